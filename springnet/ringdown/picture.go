package ringdown

import (
	"errors"
	"fmt"
	"image/color"
	"io"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgimg"
	"gonum.org/v1/plot/vg/vgsvg"
)

var _ fmt.Stringer = Format(0)

// Format is a picture file format.
type Format int

// Picture formats.
const (
	SVG Format = iota // scalable vector graphics (fonts not embedded)
	PNG               // portable network graphics, 96 dpi
)

// String returns "svg" or "png".
func (f Format) String() string {
	switch f {
	case SVG:
		return "svg"
	case PNG:
		return "png"
	}
	return fmt.Sprintf("Format(%d)", int(f))
}

// Picture size and detail.
const (
	picWidth   = 20 * vg.Centimeter
	picHeight  = 16 * vg.Centimeter
	picDPI     = 96
	traceBins  = 1200 // the record is drawn as min/max over this many bins
	specPoints = 1500 // the spectrum is drawn with at most this many points
	curvePts   = 400  // points along the fitted envelope
)

// picture holds what WritePicture draws, decimated when the result is made.
type picture struct {
	unit      string
	trace     plotter.XYs // record (isolated signal), min/max per bin [s, unit]
	env       plotter.XYs // analytic envelope, max per bin
	fit       plotter.XYs // fitted envelope A e^(−σ(t−t₀)) [s, unit]
	winX      [2]float64  // fit window [s]
	spec      plotter.XYs // overview spectrum [Hz, dB re its peak]
	f0        float64     // mode frequency [Hz]
	halfPts   [2]float64  // half-power frequencies [Hz] (zero if none)
	band      Band
	specFloor float64 // lowest dB shown
}

// picture collects the drawing data from the reduction.
func (r *reduction) picture(sf sineFit, nom *MethodEstimate) picture {
	// Draw the record up to half a window length past the fit window (a
	// long noise floor adds nothing to see), and at least its first 20 %.
	n := len(r.y)
	n = min(n, max(r.win[1]+(r.win[1]-r.strike)/2, n/5, min(n, 2*MinSamples)))
	back := r.scale // to the record's unit
	pic := picture{unit: r.rec.Unit, f0: r.f0, halfPts: r.halfPts, band: r.cfg.band}
	bins := min(traceBins, n)
	for b := range bins {
		a, e := b*n/bins, (b+1)*n/bins
		lo, hi, il, ih := r.y[a], r.y[a], a, a
		em := 0.0
		for i := a; i < e; i++ {
			if r.y[i] < lo {
				lo, il = r.y[i], i
			}
			if r.y[i] > hi {
				hi, ih = r.y[i], i
			}
			em = math.Max(em, r.env[i])
		}
		first, second := il, ih
		if ih < il {
			first, second = ih, il
		}
		pic.trace = append(pic.trace, plotter.XY{X: r.rec.Time(first), Y: back * r.y[first]}, plotter.XY{X: r.rec.Time(second), Y: back * r.y[second]})
		pic.env = append(pic.env, plotter.XY{X: r.rec.Time((a + e) / 2), Y: back * em})
	}
	t0 := r.rec.Time(r.win[0])
	pic.winX = [2]float64{t0, r.rec.Time(r.win[1])}
	amp, sig := back*sf.amplitude(), sf.p[2]
	if nom.Method != MethodSineFit {
		// Envelope through the window start from the nominal method's decay.
		amp = back * r.env[r.win[0]]
		sig = 2 * math.Pi * nom.DampedFrequency.Value * nom.Ratio.Value / math.Sqrt(1-nom.Ratio.Value*nom.Ratio.Value)
	}
	tEnd := r.rec.Time(n - 1) // end of the drawn part
	tStrike := r.rec.Time(r.strike)
	for i := range curvePts + 1 {
		t := r.rec.Start + float64(i)/curvePts*(tEnd-r.rec.Start)
		if t < tStrike {
			continue // before the strike there is no ring-down to draw
		}
		pic.fit = append(pic.fit, plotter.XY{X: t, Y: amp * math.Exp(-sig*(t-t0))})
	}
	// Spectrum up to four times the mode (or past the band).
	fmax := math.Min(r.fs/2, math.Max(4*r.f0, 1.5*r.cfg.band.High))
	kmax := min(len(r.over.mag)-1, int(fmax/r.over.df))
	peak := 0.0
	for _, v := range r.over.mag[1 : kmax+1] {
		peak = math.Max(peak, v)
	}
	step := max(1, kmax/specPoints)
	pic.specFloor = -80
	for k := 1; k+step-1 <= kmax; k += step {
		m := 0.0
		for j := k; j < k+step; j++ {
			m = math.Max(m, r.over.mag[j])
		}
		db := pic.specFloor
		if m > 0 && peak > 0 {
			db = math.Max(pic.specFloor, 20*math.Log10(m/peak))
		}
		pic.spec = append(pic.spec, plotter.XY{X: r.over.freq(float64(k + step/2)), Y: db})
	}
	return pic
}

// WritePicture draws the record with the fitted envelope and the fit
// window (top) and the spectrum with the mode, its half-power points and
// any isolation band (bottom), and writes it to w as SVG or PNG. It fails
// only if w does or the format is unknown.
func (r Result) WritePicture(w io.Writer, f Format) error {
	if len(r.pic.trace) == 0 {
		return errors.New("ringdown: no picture: the Result did not come from Reduce")
	}
	top, err := r.pic.recordPlot()
	if err != nil {
		return err
	}
	bottom, err := r.pic.spectrumPlot()
	if err != nil {
		return err
	}
	plots := [][]*plot.Plot{{top}, {bottom}}
	tiles := draw.Tiles{Rows: 2, Cols: 1, PadX: vg.Millimeter, PadY: 4 * vg.Millimeter,
		PadTop: 2 * vg.Millimeter, PadBottom: 2 * vg.Millimeter, PadLeft: 2 * vg.Millimeter, PadRight: 4 * vg.Millimeter}
	draw1 := func(c vg.CanvasSizer) {
		dc := draw.New(c)
		cs := plot.Align(plots, tiles, dc)
		top.Draw(cs[0][0])
		bottom.Draw(cs[1][0])
	}
	switch f {
	case SVG:
		c := vgsvg.New(picWidth, picHeight)
		draw1(c)
		_, err = c.WriteTo(w)
	case PNG:
		c := vgimg.NewWith(vgimg.UseWH(picWidth, picHeight), vgimg.UseDPI(picDPI), vgimg.UseBackgroundColor(color.White))
		draw1(c)
		_, err = vgimg.PngCanvas{Canvas: c}.WriteTo(w)
	default:
		return fmt.Errorf("ringdown: unknown picture format %d", int(f))
	}
	if err != nil {
		return fmt.Errorf("ringdown: writing the %v picture: %w", f, err)
	}
	return nil
}

// Colours of the picture (functions, so the package holds no mutable state).
func colTrace() color.Color  { return color.RGBA{R: 90, G: 90, B: 90, A: 255} }
func colEnv() color.Color    { return color.RGBA{R: 70, G: 130, B: 200, A: 255} }
func colFit() color.Color    { return color.RGBA{R: 210, G: 60, B: 40, A: 255} }
func colWindow() color.Color { return color.NRGBA{R: 255, G: 190, B: 60, A: 70} }
func colBand() color.Color   { return color.NRGBA{R: 100, G: 190, B: 100, A: 60} }

// shade returns a filled rectangle from x0 to x1 spanning y0 to y1.
func shade(x0, x1, y0, y1 float64, c color.Color) (*plotter.Polygon, error) {
	pg, err := plotter.NewPolygon(plotter.XYs{{X: x0, Y: y0}, {X: x1, Y: y0}, {X: x1, Y: y1}, {X: x0, Y: y1}})
	if err != nil {
		return nil, err
	}
	pg.Color = c
	pg.LineStyle.Width = 0
	pg.LineStyle.Color = color.Transparent
	return pg, nil
}

func (p picture) recordPlot() (*plot.Plot, error) {
	pl := plot.New()
	pl.Title.Text = "Ring-down and fitted envelope"
	pl.X.Label.Text = "time [s]"
	pl.Y.Label.Text = "signal"
	if p.unit != "" {
		pl.Y.Label.Text = "signal [" + p.unit + "]"
	}
	ymax := 0.0
	for _, v := range p.trace {
		ymax = math.Max(ymax, math.Abs(v.Y))
	}
	if ymax == 0 {
		ymax = 1
	}
	win, err := shade(p.winX[0], p.winX[1], -1.1*ymax, 1.1*ymax, colWindow())
	if err != nil {
		return nil, fmt.Errorf("ringdown: picture: %w", err)
	}
	tr, err := plotter.NewLine(p.trace)
	if err != nil {
		return nil, fmt.Errorf("ringdown: picture: %w", err)
	}
	tr.Color = colTrace()
	tr.Width = vg.Points(0.5)
	env, err := plotter.NewLine(p.env)
	if err != nil {
		return nil, fmt.Errorf("ringdown: picture: %w", err)
	}
	env.Color = colEnv()
	env.Width = vg.Points(0.8)
	pl.Add(win, tr, env)
	pl.Legend.Add("fit window", win)
	if p.band.IsZero() {
		pl.Legend.Add("signal (less its trend)", tr)
	} else {
		pl.Legend.Add(fmt.Sprintf("signal, band-passed %.4g–%.4g Hz", p.band.Low, p.band.High), tr)
	}
	pl.Legend.Add("envelope (analytic signal)", env)
	if len(p.fit) > 1 {
		var lo plotter.XYs
		hi := make(plotter.XYs, 0, len(p.fit))
		for _, v := range p.fit {
			y := math.Min(v.Y, 1.1*ymax)
			hi = append(hi, plotter.XY{X: v.X, Y: y})
			lo = append(lo, plotter.XY{X: v.X, Y: -y})
		}
		up, err := plotter.NewLine(hi)
		if err != nil {
			return nil, fmt.Errorf("ringdown: picture: %w", err)
		}
		dn, err := plotter.NewLine(lo)
		if err != nil {
			return nil, fmt.Errorf("ringdown: picture: %w", err)
		}
		for _, l := range []*plotter.Line{up, dn} {
			l.Color = colFit()
			l.Width = vg.Points(1.2)
			l.Dashes = []vg.Length{vg.Points(4), vg.Points(2)}
		}
		pl.Add(up, dn)
		pl.Legend.Add("fitted envelope", up)
	}
	pl.Y.Min, pl.Y.Max = -1.15*ymax, 1.15*ymax
	pl.Legend.Top = true
	pl.Add(plotter.NewGrid())
	return pl, nil
}

func (p picture) spectrumPlot() (*plot.Plot, error) {
	pl := plot.New()
	pl.Title.Text = fmt.Sprintf("Spectrum after the strike: mode at %.4g Hz", p.f0)
	pl.X.Label.Text = "frequency [Hz]"
	pl.Y.Label.Text = "amplitude [dB re peak]"
	if !p.band.IsZero() {
		b, err := shade(p.band.Low, p.band.High, p.specFloor, 5, colBand())
		if err != nil {
			return nil, fmt.Errorf("ringdown: picture: %w", err)
		}
		pl.Add(b)
		pl.Legend.Add("isolation band", b)
	}
	sp, err := plotter.NewLine(p.spec)
	if err != nil {
		return nil, fmt.Errorf("ringdown: picture: %w", err)
	}
	sp.Color = colTrace()
	sp.Width = vg.Points(0.8)
	pl.Add(sp)
	pl.Legend.Add("spectrum", sp)
	mark := func(x float64, c color.Color, dashed bool) (*plotter.Line, error) {
		l, err := plotter.NewLine(plotter.XYs{{X: x, Y: p.specFloor}, {X: x, Y: 5}})
		if err != nil {
			return nil, fmt.Errorf("ringdown: picture: %w", err)
		}
		l.Color = c
		l.Width = vg.Points(1)
		if dashed {
			l.Dashes = []vg.Length{vg.Points(3), vg.Points(2)}
		}
		return l, nil
	}
	m, err := mark(p.f0, colFit(), false)
	if err != nil {
		return nil, err
	}
	pl.Add(m)
	pl.Legend.Add("mode", m)
	if p.halfPts != [2]float64{} {
		for i, x := range p.halfPts {
			l, err := mark(x, colEnv(), true)
			if err != nil {
				return nil, err
			}
			pl.Add(l)
			if i == 0 {
				pl.Legend.Add("half-power points (fit window)", l)
			}
		}
	}
	pl.Y.Min, pl.Y.Max = p.specFloor, 5
	pl.Legend.Top = true
	pl.Add(plotter.NewGrid())
	return pl, nil
}
