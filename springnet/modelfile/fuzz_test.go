package modelfile_test

import (
	"bytes"
	"os"
	"path/filepath"
	"testing"

	"github.com/trestle-go/trestle/springnet/modelfile"
)

// FuzzRead checks that no input panics the reader, that every failure is
// reported as *modelfile.Error values, and that whatever reads also writes
// and reads back. The seed corpus is testdata/fuzz/FuzzRead plus the
// example files.
func FuzzRead(f *testing.F) {
	f.Add(modelfile.Demo())
	names, _ := filepath.Glob("../../examples/*.toml")
	for _, n := range names {
		if b, err := os.ReadFile(n); err == nil {
			f.Add(b)
		}
	}
	f.Add([]byte("[nodes]\nA = [0, 0, 0]\n[[beam]]\nends = [\"A\", \"B\"]\n"))
	f.Add([]byte("[units]\nlength = \"in\"\nstiffness = \"lbf/in\"\n"))
	f.Fuzz(func(t *testing.T, data []byte) {
		file, err := modelfile.Read("fuzz.toml", bytes.NewReader(data))
		if err != nil {
			if len(modelfile.Errors(err)) == 0 {
				t.Fatalf("error is not a *modelfile.Error: %v", err)
			}
			return
		}
		var buf bytes.Buffer
		if err := modelfile.Write(&buf, file); err != nil {
			t.Fatalf("Write: %v", err)
		}
		if _, err := modelfile.Read("rewritten.toml", &buf); err != nil {
			t.Fatalf("a file that reads must read again after Write: %v\n%s", err, buf.String())
		}
	})
}
