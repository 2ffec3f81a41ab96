package materials

// maxEditRunes bounds the strings EditDistance compares: a name longer
// than this is not a typo of a catalogue name, and the quadratic cost is
// not worth paying on hostile input.
const maxEditRunes = 200

// EditDistance returns the Levenshtein distance between a and b, counted
// in runes (insertions, deletions and substitutions each cost 1). Every
// "did you mean" suggestion in trestle uses it. If either string is longer
// than 200 runes it returns a distance larger than any real one (1<<20)
// without comparing.
func EditDistance(a, b string) int {
	ra, rb := []rune(a), []rune(b)
	if len(ra) > maxEditRunes || len(rb) > maxEditRunes {
		return 1 << 20
	}
	prev := make([]int, len(rb)+1)
	cur := make([]int, len(rb)+1)
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(ra); i++ {
		cur[0] = i
		for j := 1; j <= len(rb); j++ {
			cost := 1
			if ra[i-1] == rb[j-1] {
				cost = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+cost)
		}
		prev, cur = cur, prev
	}
	return prev[len(rb)]
}
