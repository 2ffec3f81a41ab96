package main

import (
	"bytes"
	"flag"
	"io"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/require"
)

// update rewrites the golden files: go test ./cmd/trestle -update. Check
// the diff by eye before committing; the numbers of four-legs.toml are
// checked against hand calculations in TestFourLegsHandCheck.
var update = flag.Bool("update", false, "rewrite testdata/*.golden from the current output")

// result is what one run of the program gave.
type result struct {
	stdout, stderr string
	err            error
}

// trestle runs the program with args and stdin.
func trestle(t *testing.T, stdin string, args ...string) result {
	t.Helper()
	var out, errOut bytes.Buffer
	var in io.Reader = strings.NewReader(stdin)
	err := run(args, in, &out, &errOut)
	return result{out.String(), errOut.String(), err}
}

// golden compares got with testdata/name.golden (or rewrites it).
func golden(t *testing.T, name, got string) {
	t.Helper()
	path := filepath.Join("testdata", name+".golden")
	if *update {
		require.NoError(t, os.WriteFile(path, []byte(got), 0o644))
		return
	}
	want, err := os.ReadFile(path)
	require.NoError(t, err, "missing golden file; run go test ./cmd/trestle -update")
	if string(want) != got {
		t.Errorf("output differs from %s (rerun with -update after checking):\n%s", path, diff(string(want), got))
	}
}

// diff shows the first differing lines.
func diff(want, got string) string {
	w, g := strings.Split(want, "\n"), strings.Split(got, "\n")
	var b strings.Builder
	shown := 0
	for i := 0; i < max(len(w), len(g)) && shown < 10; i++ {
		var a, c string
		if i < len(w) {
			a = w[i]
		}
		if i < len(g) {
			c = g[i]
		}
		if a != c {
			b.WriteString("line " + strconv.Itoa(i+1) + "\n  want: " + a + "\n  got:  " + c + "\n")
			shown++
		}
	}
	return b.String()
}
