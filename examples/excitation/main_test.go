package main

import (
	"bytes"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestRunDemo(t *testing.T) {
	var out bytes.Buffer
	require.NoError(t, run(nil, &out))
	lines := strings.Split(strings.TrimSpace(out.String()), "\n")
	// The demo: spindle 60–2200 rpm with 2 harmonics, motor 1440 rpm,
	// change gears with 24 teeth: 1 + 2 + 1 + 1 lines.
	require.Len(t, lines, 5)
	// 60 rpm = 1 Hz and 2200 rpm = 36.67 Hz (1 Hz = 60 rpm); the second
	// harmonic doubles both.
	assert.Contains(t, lines[1], "spindle")
	assert.Contains(t, lines[1], "1 to    36.67 Hz")
	assert.Contains(t, lines[2], "2 to    73.33 Hz")
	// 1440 rpm = 24 Hz, inside the 2–250 Hz band.
	assert.Contains(t, lines[3], "24 to       24 Hz  in band")
	// 24 teeth at 60–2200 rpm: 24 to 880 Hz, overlapping the band.
	assert.Contains(t, lines[4], "x24")
	assert.Contains(t, lines[4], "880 Hz  in band")
}
