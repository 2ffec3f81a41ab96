package materials

import (
	"fmt"
	"slices"
	"strings"
	"unicode"
)

// Names returns the catalogue names in catalogue order.
func Names() []string {
	cat := Catalogue()
	names := make([]string, len(cat))
	for i, m := range cat {
		names[i] = m.Name
	}
	return names
}

// Lookup returns the catalogue material called name. The comparison is
// forgiving: case is ignored; spaces, hyphens, underscores, slashes, dots
// and other punctuation are equivalent and may be left out; word order
// does not matter; "aluminum" is "aluminium", "grade" is "gr" and "grey"
// is "gray". So "Concrete_C25-30",
// "dry sand" and "6061 T6 aluminum" all find their entries. A name that
// is part of exactly one entry's words also finds it ("S355", "class 40").
// A few trade synonyms are known ("mineral casting" and "polymer
// concrete" for "epoxy granite"; "SPF", "DF-L", "SYP" for the graded
// lumber).
//
// On a miss the error names the closest catalogue entries (by edit
// distance); when the name fits several entries, it names them.
func Lookup(name string) (Material, error) {
	q := newKey(name)
	if q.joined == "" {
		return Material{}, fmt.Errorf("materials: empty material name")
	}
	if full, ok := synonyms()[q.joined]; ok {
		q = newKey(full)
	}
	cat := Catalogue()
	keys := make([]key, len(cat))
	for i, m := range cat {
		keys[i] = newKey(m.Name)
		if keys[i].joined == q.joined || keys[i].sorted == q.sorted {
			return cat[i], nil
		}
	}
	// Words of the query all among an entry's words: accept when unique.
	var hits []string
	var hit int
	for i, k := range keys {
		if k.hasAll(q.words) {
			hits = append(hits, cat[i].Name)
			hit = i
		}
	}
	switch {
	case len(hits) == 1:
		return cat[hit], nil
	case len(hits) > 1:
		return Material{}, fmt.Errorf("materials: %q fits several catalogue entries: %s; give more of the name", name, quoteList(hits))
	}
	return Material{}, fmt.Errorf("materials: no material %q in the catalogue; closest: %s", name, quoteList(closest(q, cat, keys, 3)))
}

// synonyms maps trade names (as joined keys) to catalogue names.
func synonyms() map[string]string {
	return map[string]string{
		"mineralcasting":   "epoxy granite",
		"polymerconcrete":  "epoxy granite",
		"epoxygranitecast": "epoxy granite",
		"chloroprenepad":   "pad neoprene",
		"rubberpad":        "pad natural rubber",
		"drysand":          "sand dry",
		"sand":             "sand dry",
		"graycastiron":     "cast iron class 30",
		"greycastiron":     "cast iron class 30",
		"spf":              "timber spruce-pine-fir No.2",
		"dfl":              "timber Douglas fir-larch No.2",
		"syp":              "timber southern pine No.2",
	}
}

// key is a name in the forms Lookup compares.
type key struct {
	words  []string // lower-case words, split at anything not a letter or digit
	joined string   // the words run together
	sorted string   // the words sorted, space separated
}

func newKey(name string) key {
	s := strings.ToLower(name)
	s = strings.ReplaceAll(s, "aluminum", "aluminium")
	words := strings.FieldsFunc(s, func(r rune) bool { return !unicode.IsLetter(r) && !unicode.IsDigit(r) })
	for i, w := range words {
		switch w {
		case "grade":
			words[i] = "gr"
		case "grey":
			words[i] = "gray"
		}
	}
	sorted := slices.Clone(words)
	slices.Sort(sorted)
	return key{words: words, joined: strings.Join(words, ""), sorted: strings.Join(sorted, " ")}
}

// hasAll reports whether every word of ws is one of k's words, or, when
// ws run together equal a run of k's consecutive words ("s235", "a500grb").
func (k key) hasAll(ws []string) bool {
	joined := strings.Join(ws, "")
	for i := range k.words {
		run := ""
		for j := i; j < len(k.words); j++ {
			run += k.words[j]
			if run == joined {
				return true
			}
		}
	}
	for _, w := range ws {
		if !slices.Contains(k.words, w) {
			return false
		}
	}
	return true
}

// closest returns up to n catalogue names nearest to q by edit distance,
// comparing q with each name run together and with each of its tails
// (so "S235JR" is near "steel S235").
func closest(q key, cat []Material, keys []key, n int) []string {
	type cand struct {
		i, d int
	}
	cands := make([]cand, len(cat))
	for i, k := range keys {
		best := EditDistance(q.joined, k.joined)
		for j := 1; j < len(k.words); j++ {
			best = min(best, EditDistance(q.joined, strings.Join(k.words[j:], "")))
		}
		cands[i] = cand{i, best}
	}
	slices.SortStableFunc(cands, func(a, b cand) int { return a.d - b.d })
	var names []string
	for _, c := range cands[:min(n, len(cands))] {
		names = append(names, cat[c.i].Name)
	}
	return names
}

func quoteList(names []string) string {
	q := make([]string, len(names))
	for i, n := range names {
		q[i] = fmt.Sprintf("%q", n)
	}
	return strings.Join(q, ", ")
}
