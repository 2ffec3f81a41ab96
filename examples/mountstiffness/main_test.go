package main

import (
	"bytes"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestRunDemo(t *testing.T) {
	var out bytes.Buffer
	require.NoError(t, run(nil, &out))
	s := out.String()
	assert.Contains(t, s, `mount "headstock"`)
	assert.Contains(t, s, `mount "tailstock"`)
	// Every stiffness is positive and, since the load path ends in the
	// four feet, none exceeds the feet in parallel with rigid everything
	// else: 4 × 50 N/um = 200 N/um vertically (the demo's feet; springs
	// in parallel add, in series the total is below each).
	re := regexp.MustCompile(`([-0-9.e+]+) N/um`)
	ms := re.FindAllStringSubmatch(s, -1)
	require.Len(t, ms, 2*3*3, "two mounts × three levels × three principal values")
	for _, m := range ms {
		k, err := strconv.ParseFloat(m[1], 64)
		require.NoError(t, err)
		assert.Greater(t, k, 0.0)
		assert.LessOrEqual(t, k, 4*50*1.5, "feet in parallel at the high spread, 1.5 × 200 N/um")
	}
}

func TestRunFile(t *testing.T) {
	var out bytes.Buffer
	require.NoError(t, run([]string{filepath.Join("..", "granite-piers.toml")}, &out))
	assert.Contains(t, out.String(), `mount "work"`)
	err := run([]string{filepath.Join("..", "timber-bench.toml")}, &out)
	require.Error(t, err, "the bench has no mounts")
	_, statErr := os.Stat("missing.toml")
	require.Error(t, statErr)
	assert.Error(t, run([]string{"missing.toml"}, &out))
}
