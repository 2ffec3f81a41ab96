package ringdown

import (
	"bytes"
	"encoding/xml"
	"errors"
	"image/png"
	"io"
	"math/rand/v2"
	"os"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"github.com/trestle-go/trestle/materials"
)

// demoResult reduces a noisy two-mode record around the 70 Hz mode.
func demoResult(t *testing.T) Result {
	t.Helper()
	s := synth{Rate: 1000, Duration: 6, Strike: 0.2, Modes: []mode{{F: 20, Zeta: 0.01, A: 2}, {F: 70, Zeta: 0.02, A: 1.5, Phi: 1}}, SNR: 30}
	res, err := Reduce(s.record(rand.New(rand.NewPCG(1, 1))), &Settings{Centre: 20})
	require.NoError(t, err)
	return res
}

func TestWritePicture(t *testing.T) {
	res := demoResult(t)
	var svg bytes.Buffer
	require.NoError(t, res.WritePicture(&svg, SVG))
	// Well-formed XML with an svg root.
	dec := xml.NewDecoder(bytes.NewReader(svg.Bytes()))
	root := ""
	for {
		tok, err := dec.Token()
		if errors.Is(err, io.EOF) {
			break
		}
		require.NoError(t, err)
		if se, ok := tok.(xml.StartElement); ok && root == "" {
			root = se.Name.Local
		}
	}
	assert.Equal(t, "svg", root)
	assert.Contains(t, svg.String(), "fitted envelope")
	assert.Less(t, svg.Len(), 2_000_000, "the record is decimated for drawing")

	var pngBuf bytes.Buffer
	require.NoError(t, res.WritePicture(&pngBuf, PNG))
	img, err := png.Decode(&pngBuf)
	require.NoError(t, err)
	// 20 cm × 16 cm at 96 dpi: 756 × 605 pixels.
	assert.InDelta(t, 756, img.Bounds().Dx(), 1)
	assert.InDelta(t, 605, img.Bounds().Dy(), 1)

	if dir := os.Getenv("RINGDOWN_PICTURES"); dir != "" { // for looking at them by eye
		require.NoError(t, os.WriteFile(dir+"/ringdown.svg", svg.Bytes(), 0o644))
		var b bytes.Buffer
		require.NoError(t, res.WritePicture(&b, PNG))
		require.NoError(t, os.WriteFile(dir+"/ringdown.png", b.Bytes(), 0o644))
	}
}

type failWriter struct{}

func (failWriter) Write([]byte) (int, error) { return 0, errors.New("disk full") }

func TestWritePictureErrors(t *testing.T) {
	var buf bytes.Buffer
	err := Result{}.WritePicture(&buf, SVG)
	require.Error(t, err)
	assert.Equal(t, "ringdown: no picture: the Result did not come from Reduce", err.Error())
	res := demoResult(t)
	err = res.WritePicture(&buf, Format(7))
	require.Error(t, err)
	assert.Equal(t, "ringdown: unknown picture format 7", err.Error())
	for _, f := range []Format{SVG, PNG} {
		err = res.WritePicture(failWriter{}, f)
		require.Error(t, err)
		assert.True(t, strings.HasPrefix(err.Error(), "ringdown: writing the "+f.String()+" picture: "), err.Error())
	}
	assert.Equal(t, "Format(7)", Format(7).String())
}

func TestWithMeasuredLoss(t *testing.T) {
	res := demoResult(t)
	steel := materials.Material{
		Name: "steel S235",
		Loss: materials.Range{Low: 1e-4, Nominal: 5e-4, High: 2e-3},
		Sources: []materials.Source{
			{Figure: "E", Ref: "EN 1993-1-1 §3.2.6"},
			{Figure: "loss", Ref: "common practice"},
		},
	}
	before := steel.Sources[1]
	got := WithMeasuredLoss(steel, res)
	assert.Equal(t, res.LossFactor(), got.Loss)
	require.NoError(t, got.Loss.Check())
	assert.Equal(t, "steel S235", got.Name)
	require.Len(t, got.Sources, 2)
	assert.Equal(t, "E", got.Sources[0].Figure)
	assert.Equal(t, "loss", got.Sources[1].Figure)
	assert.Contains(t, got.Sources[1].Ref, "tap-test ring-down")
	assert.Equal(t, before, steel.Sources[1], "the material passed in is not changed")
	assert.Equal(t, materials.Range{Low: 1e-4, Nominal: 5e-4, High: 2e-3}, steel.Loss)
	// The loss factor of the 20 Hz mode, ζ = 0.01: η = 2ζ = 0.02 (Inman
	// §1.6), within its own range.
	lf := got.Loss
	assert.LessOrEqual(t, lf.Low, 0.02)
	assert.GreaterOrEqual(t, lf.High, 0.02)
}

func TestLossFactorLowEndNotNegative(t *testing.T) {
	r := Result{eta: Estimate{Value: 0.01, Err: 0.008}}
	lf := r.LossFactor()
	// 0.01 ± 2·0.008 (GUM coverage factor 2), the low end held at 0.
	assert.Zero(t, lf.Low)
	assert.InEpsilon(t, 0.01, lf.Nominal, 1e-15)
	assert.InEpsilon(t, 0.026, lf.High, 1e-15)
}
