package modelfile

import (
	"errors"
	"fmt"
	"github.com/trestle-go/trestle/materials"
	"regexp"
	"sort"
	"strings"
)

// Error is one problem of a model file: where it is and what is wrong.
// Read and Build return several of them joined with errors.Join; use
// errors.As on each (or Errors) to get at the fields.
type Error struct {
	File string // the name given to Read ("" when building from Contents)
	Line int    // 1-based; 0 when not known
	Msg  string // names the item: `beam "brace-3" names unknown node "C2"; did you mean "C3"?`
}

// Error returns "file:line: message", or what of it is known.
func (e *Error) Error() string {
	switch {
	case e.File != "" && e.Line > 0:
		return fmt.Sprintf("%s:%d: %s", e.File, e.Line, e.Msg)
	case e.File != "":
		return e.File + ": " + e.Msg
	case e.Line > 0:
		return fmt.Sprintf("modelfile: line %d: %s", e.Line, e.Msg)
	}
	return "modelfile: " + e.Msg
}

// Errors returns the *Error values inside err (as joined by Read or
// Build), in order; nil if there are none.
func Errors(err error) []*Error {
	var out []*Error
	var walk func(error)
	walk = func(e error) {
		if e == nil {
			return
		}
		var fe *Error
		if x, ok := e.(*Error); ok {
			out = append(out, x)
			return
		}
		if j, ok := e.(interface{ Unwrap() []error }); ok {
			for _, x := range j.Unwrap() {
				walk(x)
			}
			return
		}
		if errors.As(e, &fe) {
			out = append(out, fe)
		}
	}
	walk(err)
	return out
}

// errList collects the errors of one read.
type errList struct {
	file string
	errs []*Error
}

// full reports whether enough errors are collected that more detail
// (suggestions, which cost a search over all names) is not worth it.
func (l *errList) full() bool { return len(l.errs) > maxErrors }

func (l *errList) add(line int, format string, args ...any) {
	l.errs = append(l.errs, &Error{File: l.file, Line: line, Msg: fmt.Sprintf(format, args...)})
}

// maxErrors bounds the errors reported; past it the reader says how many
// more there were.
const maxErrors = 100

func (l *errList) err() error {
	if len(l.errs) == 0 {
		return nil
	}
	sort.SliceStable(l.errs, func(i, j int) bool { return l.errs[i].Line < l.errs[j].Line })
	// Drop exact repeats (one bad name used by many members).
	var out []error
	seen := map[string]bool{}
	for _, e := range l.errs {
		k := e.Error()
		if seen[k] {
			continue
		}
		seen[k] = true
		out = append(out, e)
	}
	if len(out) > maxErrors {
		n := len(out) - maxErrors
		out = append(out[:maxErrors], &Error{File: l.file, Msg: fmt.Sprintf("and %d more errors", n)})
	}
	return errors.Join(out...)
}

// suggest returns `; did you mean "X"?` for the closest of names to s,
// or "" when nothing is close.
func suggest(s string, names []string) string {
	best, bestD := "", 1<<30
	ls := strings.ToLower(s)
	for _, n := range names {
		if d := materials.EditDistance(ls, strings.ToLower(n)); d < bestD || d == bestD && n < best {
			best, bestD = n, d
		}
	}
	if best == "" || bestD > max(2, len([]rune(s))/3) {
		return ""
	}
	return fmt.Sprintf("; did you mean %q?", best)
}

// validateItem finds the item a springnet validation message names:
// `springnet: bar "B7": zero length` gives ("bar", "B7", "zero length").
var validateItem = regexp.MustCompile(`^springnet: (node|bar|beam|spring|foot|group|mount|case|combination) ("(?:[^"\\]|\\.)*")`)

// validateMass finds the mass a springnet validation message names:
// `springnet: mass 2 at node "B1": ...`.
var validateMass = regexp.MustCompile(`^springnet: mass (\d+) at `)
