package springnet_test

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"github.com/trestle-go/trestle/springnet"
)

// Excitation frequencies f = k·PerRev·rpm/60 and the ±20 % margin (common
// practice) on hand-worked numbers: a spindle at 600–3000 rpm with a
// 4-flute cutter excites 40–200 Hz (k = 1), 80–400 Hz, 120–600 Hz; a motor
// at 1450 rpm, once per revolution, 24.17 Hz, 48.33 Hz, 72.5 Hz.
func TestCheckExcitation(t *testing.T) {
	speeds := []springnet.RunningSpeed{
		{Name: "spindle", RPMLow: 600, RPMHigh: 3000, PerRev: 4},
		{Name: "motor", RPMLow: 1450, RPMHigh: 1450},
	}
	ex, err := springnet.Excitations(speeds, 3)
	require.NoError(t, err)
	require.Len(t, ex, 6)
	// 1e-12: one multiply and divide of the hand numbers above, round-off only.
	assert.InEpsilon(t, 80.0, ex[1].Low, 1e-12)
	assert.InEpsilon(t, 400.0, ex[1].High, 1e-12)
	assert.InEpsilon(t, 1450.0*3/60, ex[5].Low, 1e-12)

	freqs := []float64{0, 15, 35, 100, 700, 750}
	got, err := springnet.CheckExcitation(freqs, speeds, nil)
	require.NoError(t, err)
	type hit struct {
		mode  int
		speed string
		order int
		sep   float64
	}
	// By hand, margin 0.2: 15 Hz is below 0.8·40 = 32 and above
	// 1.2·24.17 = 29; 35 Hz lies in [32, 240] (k = 1), 5/40 below it;
	// 100 Hz lies inside 40–200 and 80–400, and 20/120 below 120–600;
	// 700 Hz is 100/600 above 120–600 (< 720); 750 Hz is clear.
	want := []hit{
		{2, "spindle", 1, 5.0 / 40},
		{3, "spindle", 1, 0}, {3, "spindle", 2, 0}, {3, "spindle", 3, 20.0 / 120},
		{4, "spindle", 3, 100.0 / 600},
	}
	require.Len(t, got, len(want))
	for i, w := range want {
		assert.Equal(t, w.mode, got[i].Mode)
		assert.Equal(t, w.speed, got[i].Excitation.Speed)
		assert.Equal(t, w.order, got[i].Excitation.Order)
		assert.InDelta(t, w.sep, got[i].Separation, 1e-12) // a ratio of the hand numbers: round-off only
	}

	for _, tc := range []struct {
		name   string
		speeds []springnet.RunningSpeed
		s      *springnet.ExcitationSettings
	}{
		{"reversed range", []springnet.RunningSpeed{{Name: "x", RPMLow: 3000, RPMHigh: 600}}, nil},
		{"zero speed", []springnet.RunningSpeed{{Name: "x"}}, nil},
		{"margin too big", speeds, &springnet.ExcitationSettings{Margin: 1.5}},
		{"negative harmonics", speeds, &springnet.ExcitationSettings{Harmonics: -1}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, err := springnet.CheckExcitation(freqs, tc.speeds, tc.s)
			assert.ErrorContains(t, err, "springnet: excitation")
		})
	}
}
