package main

import (
	"bytes"
	"os"
	"path/filepath"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"github.com/trestle-go/trestle/springnet/modelfile"
)

func TestRun(t *testing.T) {
	var out bytes.Buffer
	require.NoError(t, run(&out))
	f, err := modelfile.Read("generated.toml", bytes.NewReader(out.Bytes()))
	require.NoError(t, err)
	// 3 × 2 legs, one stretcher level, cross-braced back (counted by hand):
	// legs 3·2·2 = 12, stretchers 2·2 + 3·1 = 7, braces 2 panels · 2 bays
	// · 2 = 8, feet 6: 33 elements; nodes 3·2·3 = 18.
	assert.Equal(t, 18, f.Model.NumNodes())
	assert.Equal(t, 33, f.Model.NumElements())
	// examples/generated-frame.toml is this program's output, kept in the
	// repository for people to read; it must not go stale.
	committed, err := os.ReadFile(filepath.Join("..", "generated-frame.toml"))
	require.NoError(t, err)
	assert.Equal(t, out.String(), string(committed), "run `go run ./examples/generate > examples/generated-frame.toml`")
}
