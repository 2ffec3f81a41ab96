package modelfile

import (
	"testing"

	"github.com/stretchr/testify/assert"
)

// TestScanPositions checks the line scanner on the TOML forms the format
// uses; the expected lines are counted by hand in the text.
func TestScanPositions(t *testing.T) {
	src := `# comment
title = "a # not a comment [x]"   # line 2
[nodes]
"A.1" = [0, 0, 0]                  # line 4: a quoted key with a dot
B = [                              # line 5
  0, 0,
  1 ]
[[case]]                           # line 8
name = 'one'
[[case.load]]                      # line 10
at = "A.1"
[[case.load]]                      # line 12
force = { x = 1 }                  # line 13
[[case]]                           # line 14
text = """
[[case]]
not = "a key"
"""
name = "two"                       # line 19
[[case.load]]                      # line 20
at.sub = 1                         # line 21: dotted key
`
	p := scanPositions(src)
	tests := []struct {
		path string
		line int
	}{
		{"title", 2},
		{"nodes.A.1", 4},
		{"nodes.B", 5},
		{"case#0", 8},
		{"case#0.name", 9},
		{"case#0.load#0", 10},
		{"case#0.load#0.at", 11},
		{"case#0.load#1.force", 13},
		{"case#0.load#1.force.x", 13}, // inside an inline table: the key's line
		{"case#1", 14},
		{"case#1.name", 19},
		{"case#1.load#0", 20},
		{"case#1.load#0.at.sub", 21},
		{"case#2", 0}, // the [[case]] inside the multi-line text is not a table
	}
	for _, tc := range tests {
		assert.Equal(t, tc.line, p.at(tc.path), tc.path)
	}
	assert.Equal(t, 1, p.maxDepth, "B's list and the inline table are one level deep; the header brackets do not count")
}
