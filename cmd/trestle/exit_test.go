package main

import (
	"errors"
	"os"
	"os/exec"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// runMainEnv, when set, makes the test binary run main with the rest of
// its arguments (after "--"), so that the exit code of the real program
// can be tested without building it separately.
const runMainEnv = "TRESTLE_TEST_RUN_MAIN"

func TestMain(m *testing.M) {
	if os.Getenv(runMainEnv) == "1" {
		for i, a := range os.Args {
			if a == "--" {
				os.Args = append([]string{"trestle"}, os.Args[i+1:]...)
				break
			}
		}
		main()
		os.Exit(0)
	}
	os.Exit(m.Run())
}

// execMain runs the program as a process and returns its exit code,
// standard output and standard error.
func execMain(t *testing.T, args ...string) (int, string, string) {
	t.Helper()
	cmd := exec.Command(os.Args[0], append([]string{"-test.run=^$", "--"}, args...)...)
	cmd.Env = append(os.Environ(), runMainEnv+"=1")
	var out, errOut strings.Builder
	cmd.Stdout, cmd.Stderr = &out, &errOut
	err := cmd.Run()
	var exit *exec.ExitError
	switch {
	case err == nil:
		return 0, out.String(), errOut.String()
	case errors.As(err, &exit):
		return exit.ExitCode(), out.String(), errOut.String()
	}
	require.NoError(t, err)
	return -1, "", ""
}

func TestExitCodes(t *testing.T) {
	code, out, _ := execMain(t, "sections", "round 40 mm")
	assert.Equal(t, 0, code)
	assert.Contains(t, out, "Section round 40 mm")

	code, out, errOut := execMain(t, "analyse", "no-such-file.toml")
	assert.Equal(t, 1, code, "an error exits 1")
	assert.Empty(t, out)
	assert.True(t, strings.HasPrefix(errOut, "trestle: "), "the error goes to standard error: %q", errOut)
	assert.Contains(t, errOut, "no-such-file.toml")

	code, out, _ = execMain(t, "ringdown", "--help")
	assert.Equal(t, 0, code, "help is not an error")
	assert.Contains(t, out, "Example:")
}
