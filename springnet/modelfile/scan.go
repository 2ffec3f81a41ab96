package modelfile

import (
	"fmt"
	"strconv"
	"strings"
)

// MaxFileSize is the largest model file Read accepts [bytes]. A stand
// described by hand is a few kilobytes; a generated one with thousands of
// members well under a megabyte.
const MaxFileSize = 16 << 20

// MaxNesting is the deepest nesting of arrays, inline tables and dotted
// keys Read accepts. The format needs three (a list of [x, y, z] points
// inside a table).
const MaxNesting = 16

// positions maps the path of every key and table header of a TOML text to
// its line. Paths join keys with "."; the n-th table of an array of tables
// gets "#n" (counting from 0): "beam#2.ends", "case#0.load#1.force".
//
// It is a light scanner, not a parser: toml.Decode checks the syntax; the
// scanner only needs to find where things are, so that messages can say
// "stand.toml:42". It also measures the nesting depth before the decoder
// sees the text.
type positions struct {
	line     map[string]int
	maxDepth int
	depthAt  int // line of the deepest nesting
}

func scanPositions(src string) *positions {
	p := &positions{line: make(map[string]int)}
	arrayIdx := map[string]int{} // resolved array-table path -> current index
	isArray := map[string]bool{} // unresolved (plain) path of array tables
	table := ""                  // current resolved table path
	depth := 0                   // bracket depth inside a value
	mlString := ""               // `"""` or `'''` while inside a multi-line string
	lines := strings.Split(src, "\n")
	for ln, raw := range lines {
		lineNo := ln + 1
		rest := raw
		if mlString == "" && depth == 0 {
			t := strings.TrimSpace(raw)
			switch {
			case t == "" || t[0] == '#':
				continue
			case t[0] == '[':
				arr := strings.HasPrefix(t, "[[")
				inner := strings.TrimLeft(t, "[")
				if i := strings.IndexByte(inner, ']'); i >= 0 {
					inner = inner[:i]
				}
				segs := splitKey(inner)
				if len(segs) > MaxNesting && p.maxDepth < len(segs) {
					p.maxDepth, p.depthAt = len(segs), lineNo
				}
				plain := strings.Join(segs, ".")
				resolved := resolve(segs, isArray, arrayIdx)
				if arr {
					isArray[plain] = true
					idx, seen := arrayIdx[resolved]
					if seen {
						idx++
					}
					arrayIdx[resolved] = idx
					// Children of the previous element are forgotten.
					prefix := resolved + "#"
					for k := range arrayIdx {
						if strings.HasPrefix(k, prefix) {
							delete(arrayIdx, k)
						}
					}
					resolved += "#" + strconv.Itoa(idx)
				}
				table = resolved
				p.set(table, lineNo)
				continue
			default:
				eq := keyEnd(t)
				if eq < 0 {
					continue
				}
				segs := splitKey(t[:eq])
				if len(segs) > MaxNesting && p.maxDepth < len(segs) {
					p.maxDepth, p.depthAt = len(segs), lineNo
				}
				key := strings.Join(segs, ".")
				if table != "" {
					key = table + "." + key
				}
				p.set(key, lineNo)
				rest = t[eq+1:]
			}
		}
		depth, mlString = p.scanValue(rest, depth, mlString, lineNo)
	}
	return p
}

func (p *positions) set(key string, line int) {
	if _, ok := p.line[key]; !ok {
		p.line[key] = line
	}
}

// scanValue follows brackets and strings through one line of a value.
func (p *positions) scanValue(s string, depth int, ml string, lineNo int) (int, string) {
	for i := 0; i < len(s); i++ {
		if ml != "" {
			if strings.HasPrefix(s[i:], ml) {
				i += 2
				ml = ""
			} else if ml == `"""` && s[i] == '\\' {
				i++
			}
			continue
		}
		switch c := s[i]; c {
		case '#':
			return depth, ml
		case '"', '\'':
			q := s[i : i+1]
			if strings.HasPrefix(s[i:], q+q+q) {
				ml = q + q + q
				i += 2
				continue
			}
			for i++; i < len(s) && s[i] != c; i++ {
				if c == '"' && s[i] == '\\' {
					i++
				}
			}
		case '[', '{':
			depth++
			if depth > p.maxDepth {
				p.maxDepth, p.depthAt = depth, lineNo
			}
		case ']', '}':
			if depth > 0 {
				depth--
			}
		}
	}
	return depth, ml
}

// keyEnd returns the index of the "=" ending the key at the start of t,
// skipping quoted parts, or −1.
func keyEnd(t string) int {
	for i := 0; i < len(t); i++ {
		switch c := t[i]; c {
		case '=':
			return i
		case '"', '\'':
			for i++; i < len(t) && t[i] != c; i++ {
				if c == '"' && t[i] == '\\' {
					i++
				}
			}
		}
	}
	return -1
}

// splitKey splits a dotted key into its parts, unquoting quoted parts.
func splitKey(k string) []string {
	var out []string
	var b strings.Builder
	for i := 0; i < len(k); i++ {
		switch c := k[i]; c {
		case '.':
			out = append(out, strings.TrimSpace(b.String()))
			b.Reset()
		case '"', '\'':
			j := i + 1
			for ; j < len(k) && k[j] != c; j++ {
				if c == '"' && k[j] == '\\' {
					j++
				}
			}
			q := k[i:min(j+1, len(k))]
			if c == '"' {
				if u, err := strconv.Unquote(q); err == nil {
					q = u
				} else {
					q = strings.Trim(q, `"`)
				}
			} else {
				q = strings.Trim(q, "'")
			}
			b.WriteString(q)
			i = j
		default:
			b.WriteByte(c)
		}
	}
	out = append(out, strings.TrimSpace(b.String()))
	return out
}

// resolve turns a plain table path into its resolved path, adding the
// current index after every prefix that is an array of tables.
func resolve(segs []string, isArray map[string]bool, arrayIdx map[string]int) string {
	plain, res := "", ""
	for i, s := range segs {
		if i > 0 {
			plain += "."
			res += "."
		}
		plain += s
		res += s
		if i < len(segs)-1 && isArray[plain] {
			if idx, ok := arrayIdx[res]; ok {
				res += "#" + strconv.Itoa(idx)
			}
		}
	}
	return res
}

// at returns the line of the key path, or of its nearest enclosing table;
// 0 if unknown.
func (p *positions) at(path string) int {
	for path != "" {
		if l, ok := p.line[path]; ok {
			return l
		}
		i := strings.LastIndexAny(path, ".#")
		if i < 0 {
			break
		}
		path = path[:i]
	}
	return 0
}

// checkNesting returns an error if the text nests deeper than MaxNesting.
func (p *positions) checkNesting() error {
	if p.maxDepth > MaxNesting {
		return fmt.Errorf("nesting %d deep (arrays, inline tables or dotted keys) exceeds the limit of %d", p.maxDepth, MaxNesting)
	}
	return nil
}
