package main

import (
	"bytes"
	"flag"
	"io"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/require"
)

// update rewrites the golden files: go test ./cmd/trestle -update. Check
// the diff by eye before committing. The numbers in the goldens of
// four-legs.toml are checked against hand calculations in
// TestFourLegsHandCheck (statics, stiffness, buckling), TestModesHandCheck
// and TestResponseHandCheck; those of steel-legs.toml in
// TestRangesHandCheck; the square tube's section properties are
// (50² − 44²) mm² and (50⁴ − 44⁴)/12 mm⁴ (sharp corners).
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
	if string(want) != got && !sameButRounding(string(want), got) {
		t.Errorf("output differs from %s (rerun with -update after checking):\n%s", path, diff(string(want), got))
	}
}

// goldenTol is the relative difference allowed between a number in a
// golden file and the output: reports print four significant figures, so
// a change in the last printed digit from round-off in a library's
// arithmetic (a new ordering, a blocked kernel) is not a failure; any
// other change is.
const goldenTol = 2e-3

// roundOffFloor: numbers below it in golden files are relative residuals
// and equilibrium errors of double-precision solves (about 1e-16 to
// 1e-14), which change with the order of the arithmetic.
const roundOffFloor = 1e-10

// sameButRounding reports whether want and got have the same words and
// layout and numbers that agree within goldenTol.
func sameButRounding(want, got string) bool { return sameWithin(want, got, goldenTol) }

// sameWithin reports whether want and got have the same words and layout
// and numbers that agree within rel (relative), any two below
// roundOffFloor being the same.
func sameWithin(want, got string, rel float64) bool {
	wl, gl := strings.Split(want, "\n"), strings.Split(got, "\n")
	if len(wl) != len(gl) {
		return false
	}
	for i := range wl {
		wf, gf := strings.Fields(wl[i]), strings.Fields(gl[i])
		if len(wf) != len(gf) {
			return false
		}
		for j := range wf {
			if wf[j] == gf[j] {
				continue
			}
			a, errA := strconv.ParseFloat(strings.Trim(wf[j], ",:()[]\"×÷"), 64)
			b, errB := strconv.ParseFloat(strings.Trim(gf[j], ",:()[]\"×÷"), 64)
			if errA != nil || errB != nil {
				return false
			}
			// Residuals and equilibrium errors are round-off: any two
			// values below roundOffFloor are the same.
			if math.Max(math.Abs(a), math.Abs(b)) < roundOffFloor {
				continue
			}
			if math.Abs(a-b) > rel*math.Max(math.Abs(a), math.Abs(b)) {
				return false
			}
		}
	}
	return true
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

func TestSameButRounding(t *testing.T) {
	tests := []struct {
		name      string
		want, got string
		same      bool
	}{
		{"identical", "k  1.337 N/µm\n", "k  1.337 N/µm\n", true},
		{"last digit", "k  1.337 N/µm\n", "k  1.338 N/µm\n", true},
		{"json number", `"x_n_per_m": 480000,`, `"x_n_per_m": 480000.00000001,`, true},
		{"a real change", "k  1.337 N/µm\n", "k  1.437 N/µm\n", false},
		{"round-off", `"residual": 1.1e-16,`, `"residual": 3.4e-15,`, true},
		{"a word", "along X\n", "along Y\n", false},
		{"a line more", "a\n", "a\nb\n", false},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			if got := sameButRounding(tc.want, tc.got); got != tc.same {
				t.Errorf("sameButRounding = %v, want %v", got, tc.same)
			}
		})
	}
	// A tighter tolerance sees the last printed digit.
	if sameWithin("k  1.337 N/µm\n", "k  1.338 N/µm\n", 1e-9) {
		t.Error("sameWithin(1.337, 1.338, 1e-9) = true, want false")
	}
}
