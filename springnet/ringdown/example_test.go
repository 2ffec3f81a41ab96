package ringdown_test

import (
	"fmt"
	"math"
	"strings"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet/ringdown"
)

// dampedSine returns a record of A e^(−ζωₙt) sin(ω_d t), the free decay of
// one mode, with a constant offset (gravity) added.
func dampedSine(rate, dur, fn, zeta, offset float64) ringdown.Record {
	wn := 2 * math.Pi * fn
	wd := wn * math.Sqrt(1-zeta*zeta)
	n := int(rate * dur)
	x := make([]float64, n)
	for i := range x {
		t := float64(i) / rate
		x[i] = offset + 2*math.Exp(-zeta*wn*t)*math.Sin(wd*t)
	}
	return ringdown.Record{Rate: rate, Samples: x, Unit: "m/s²"}
}

func ExampleRead() {
	// A phone export: semicolons, decimal commas, time in milliseconds.
	var b strings.Builder
	b.WriteString("time (ms);ax;ay;az\n")
	for i := range 20 {
		fmt.Fprintf(&b, "%d;0,01;0,02;%s\n", 2*i, strings.Replace(fmt.Sprintf("%.3f", 9.81+0.1*math.Sin(float64(i))), ".", ",", 1))
	}
	rec, err := ringdown.Read(strings.NewReader(b.String()), ringdown.ReadOptions{Name: "tap.csv", Column: "az"})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%d samples at %.4g Hz from column %q, first %.4g\n", rec.Len(), rec.Rate, rec.Column, rec.Samples[0])

	// A bad line is reported with its place.
	_, err = ringdown.Read(strings.NewReader("time;a\n0;1\n1;x\n"), ringdown.ReadOptions{Name: "tap.csv"})
	fmt.Println(err)
	// Output:
	// 20 samples at 500 Hz from column "az", first 9.81
	// ringdown: tap.csv:3: column 2 ("a"): "x" is not a finite number
}

func ExampleReduce() {
	rec := dampedSine(1000, 4, 25, 0.01, 9.81)
	res, err := ringdown.Reduce(rec, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("fn = %.4g Hz, ζ = %.4g, δ = %.4g, η = %.4g, Q = %.4g\n",
		res.NaturalFrequency().Value, res.Ratio().Value, res.LogDecrement().Value, res.Loss().Value, res.Q().Value)
	fmt.Printf("methods agree: %v\n", res.Agreement().Agree)
	// Output:
	// fn = 25 Hz, ζ = 0.01, δ = 0.06283, η = 0.02, Q = 50
	// methods agree: true
}

func ExampleReduce_band() {
	// Two modes; isolate the upper one with a band-pass around 70 Hz.
	a := dampedSine(1000, 6, 20, 0.01, 0)
	b := dampedSine(1000, 6, 70, 0.02, 0)
	for i := range a.Samples {
		a.Samples[i] += b.Samples[i]
	}
	res, err := ringdown.Reduce(a, &ringdown.Settings{Centre: 70})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("fn = %.4g Hz, ζ = %.3g\n", res.NaturalFrequency().Value, res.Ratio().Value)
	// Output:
	// fn = 70 Hz, ζ = 0.02
}

func ExampleWithMeasuredLoss() {
	// A 25 Hz mode with a weaker 90 Hz one riding on it: the methods differ
	// a little, which widens the measured range.
	rec := dampedSine(1000, 4, 25, 0.01, 0)
	other := dampedSine(1000, 4, 90, 0.03, 0)
	for i := range rec.Samples {
		rec.Samples[i] += 0.2 * other.Samples[i]
	}
	res, err := ringdown.Reduce(rec, nil)
	if err != nil {
		fmt.Println(err)
		return
	}
	steel := materials.Material{Name: "steel S235", Loss: materials.Range{Low: 1e-4, Nominal: 5e-4, High: 2e-3}}
	measured := ringdown.WithMeasuredLoss(steel, res)
	fmt.Printf("loss factor %.3g (%.3g–%.3g)\n", measured.Loss.Nominal, measured.Loss.Low, measured.Loss.High)
	fmt.Println(measured.Sources[0].Figure)
	// Output:
	// loss factor 0.02 (0.0199–0.0201)
	// loss
}
