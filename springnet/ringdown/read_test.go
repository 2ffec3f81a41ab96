package ringdown

import (
	"fmt"
	"math"
	"strings"
	"testing"
	"testing/iotest"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// rows builds n data lines "t<sep>v..." with t = i·dt and the values from
// f(i), numbers printed by format (so a decimal comma can be substituted).
func rows(n int, sep string, dt float64, f func(i int) []float64, decimalComma bool) string {
	var b strings.Builder
	for i := range n {
		fields := []string{fmt.Sprintf("%.6f", float64(i)*dt)}
		if dt == 0 {
			fields = nil
		}
		for _, v := range f(i) {
			fields = append(fields, fmt.Sprintf("%.6f", v))
		}
		line := strings.Join(fields, sep)
		if decimalComma {
			line = strings.ReplaceAll(line, ".", ",")
		}
		b.WriteString(line)
		b.WriteString("\n")
	}
	return b.String()
}

// ramp gives the values i, 2i, 3i for sample i: easy to check after reading.
func ramp(i int) []float64 { return []float64{float64(i), 2 * float64(i), 3 * float64(i)} }

// one gives the single value i/10.
func one(i int) []float64 { return []float64{float64(i) / 10} }

func TestReadFormats(t *testing.T) {
	const n = 20
	tests := []struct {
		name      string
		text      string
		opt       ReadOptions
		rate      float64   // expected sample rate [Hz]
		start     float64   // expected start [s]
		first     []float64 // expected first samples
		column    string
		unit      string
		noteMatch string // a note that must be present ("" none required)
	}{
		{
			name: "comma CSV with header, chosen column",
			text: "time,ax,ay,az\n" + rows(n, ",", 0.001, ramp, false),
			opt:  ReadOptions{Column: "ay"}, rate: 1000, first: []float64{0, 2, 4}, column: "ay",
		},
		{
			name: "column chosen by number",
			text: "time,ax,ay,az\n" + rows(n, ",", 0.001, ramp, false),
			opt:  ReadOptions{Column: "4"}, rate: 1000, first: []float64{0, 3, 6}, column: "az",
		},
		{
			name: "auto column: largest standard deviation",
			text: "time,ax,ay,az\n" + rows(n, ",", 0.001, ramp, false),
			rate: 1000, first: []float64{0, 3, 6}, column: "az", noteMatch: "largest standard deviation",
		},
		{
			name: "semicolon with decimal comma",
			text: "Zeit;acc\n" + rows(n, ";", 0.002, one, true),
			rate: 500, first: []float64{0, 0.1, 0.2}, column: "acc", noteMatch: "taken as time",
		},
		{
			name: "TSV with units line in g",
			text: "t\tacc\ns\tg\n" + rows(n, "\t", 0.001, one, false),
			// 1 g = 9.80665 m/s² (CGPM 1901 standard gravity).
			rate: 1000, first: []float64{0, 0.1 * 9.80665, 0.2 * 9.80665}, column: "acc", unit: "m/s²", noteMatch: "converted from g",
		},
		{
			name: "no header, white space separated",
			text: rows(n, "  ", 0.01, one, false),
			rate: 100, first: []float64{0, 0.1, 0.2}, column: "column 2",
		},
		{
			name: "time in ms from the header",
			text: "time (ms),a [m/s^2]\n" + rows(n, ",", 2, one, false),
			rate: 500, first: []float64{0, 0.1, 0.2}, column: "a", unit: "m/s²",
		},
		{
			name: "time in ms from the units line",
			text: "time;a\n[ms];[m/s²]\n" + rows(n, ";", 2, one, false),
			rate: 500, first: []float64{0, 0.1, 0.2}, unit: "m/s²",
		},
		{
			name: "time unit given in the options",
			text: "time,a\n" + rows(n, ",", 250, one, false),
			opt:  ReadOptions{TimeUnit: 1e-6}, rate: 4000, first: []float64{0, 0.1, 0.2},
		},
		{
			name: "time in ms guessed from the step, with a note",
			text: "time,a\n" + rows(n, ",", 4, one, false),
			rate: 250, first: []float64{0, 0.1, 0.2}, noteMatch: "taken as milliseconds",
		},
		{
			name: "sample rate given, no time column",
			text: rows(n, ",", 0, one, false),
			opt:  ReadOptions{SampleRate: 800}, rate: 800, first: []float64{0, 0.1, 0.2}, column: "column 1",
		},
		{
			name: "sample rate given, time column ignored",
			text: "time,a\n" + rows(n, ",", 7, one, false),
			opt:  ReadOptions{SampleRate: 800}, rate: 800, first: []float64{0, 0.1, 0.2}, column: "a",
		},
		{
			name: "magnitude of three axes",
			text: "time,accX,accY,accZ\n" + rows(n, ",", 0.001, ramp, false),
			// |(i, 2i, 3i)| = i√14.
			opt: ReadOptions{Magnitude: true}, rate: 1000, first: []float64{0, math.Sqrt(14), 2 * math.Sqrt(14)},
			column: "|(accX, accY, accZ)|",
		},
		{
			name: "magnitude of named axes",
			text: "time,p,q,r\n" + rows(n, ",", 0.001, ramp, false),
			opt:  ReadOptions{Magnitude: true, Axes: [3]string{"p", "q", "3"}}, rate: 1000,
			// column 3 is q again: |(i, 2i, 2i)| = 3i.
			first: []float64{0, 3, 6},
		},
		{
			name: "comments, preamble, byte-order mark and CRLF",
			text: "\uFEFF# logger export\r\nDevice: demo\r\n\r\ntime,a\r\n" + strings.ReplaceAll(rows(n, ",", 0.001, one, false), "\n", "\r\n"),
			rate: 1000, first: []float64{0, 0.1, 0.2}, column: "a",
		},
		{
			name: "a preamble with semicolons does not decide the separator",
			text: "Device; demo logger\nRate; 1 kHz\ntime,a\n" + rows(n, ",", 0.001, one, false),
			rate: 1000, first: []float64{0, 0.1, 0.2}, column: "a",
		},
		{
			name: "quoted fields and a trailing separator",
			text: "\"time\";\"a\";\n" + strings.ReplaceAll(rows(n, ";", 0.001, one, false), "\n", ";\n"),
			rate: 1000, first: []float64{0, 0.1, 0.2}, column: "a",
		},
		{
			name: "a phone app's export: quoted names with units, an absolute column",
			text: "\"Time (s)\",\"Acceleration x (m/s^2)\",\"Acceleration y (m/s^2)\",\"Acceleration z (m/s^2)\",\"Absolute acceleration (m/s^2)\"\n" +
				rows(n, ",", 0.0025, func(i int) []float64 { return []float64{float64(i), 2 * float64(i), 3 * float64(i), 99} }, false),
			// |(i, 2i, 3i)| = i√14; the absolute column is not an axis.
			opt: ReadOptions{Magnitude: true}, rate: 400, first: []float64{0, math.Sqrt(14), 2 * math.Sqrt(14)},
			column: "|(Acceleration x, Acceleration y, Acceleration z)|", unit: "m/s²",
		},
		{
			name: "epoch milliseconds keep their precision",
			text: "timestamp_ms,a\n" + func() string {
				var b strings.Builder
				for i := range n {
					fmt.Fprintf(&b, "%d,%g\n", 1764547200000+5*i, float64(i)/10)
				}
				return b.String()
			}(),
			rate: 200, start: 1764547200, first: []float64{0, 0.1, 0.2},
		},
		{
			name: "repeated timestamps are averaged",
			text: "t,a\n0,1\n0,3\n" + rows(n, ",", 0.001, func(i int) []float64 { return []float64{5} }, false)[len("0.000000,5.000000\n"):],
			// (1 + 3)/2 = 2 at t = 0, then 5.
			rate: 1000, first: []float64{2, 5, 5}, noteMatch: "repeated timestamps",
		},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			rec, err := Read(strings.NewReader(tc.text), tc.opt)
			require.NoError(t, err)
			require.GreaterOrEqual(t, rec.Len(), MinSamples)
			// Times are printed with 6 decimals: relative error 1e-6 at most.
			assert.InEpsilon(t, tc.rate, rec.Rate, 1e-6, "rate")
			assert.InDelta(t, tc.start, rec.Start, 1e-9, "start")
			for i, want := range tc.first {
				assert.InDelta(t, want, rec.Samples[i], 1e-9, "sample %d", i)
			}
			if tc.column != "" {
				assert.Equal(t, tc.column, rec.Column)
			}
			if tc.unit != "" {
				assert.Equal(t, tc.unit, rec.Unit)
			}
			if tc.noteMatch != "" {
				assert.Contains(t, strings.Join(rec.Notes, "\n"), tc.noteMatch)
			}
		})
	}
}

func TestReadResamplesUnevenTime(t *testing.T) {
	// x(t) = sin(2π·5t) sampled at jittered times around 1 kHz: the spline
	// through the samples, read back on the even grid, must match the sine.
	// Natural cubic spline error in the interior is at most (5/384)·h⁴·max|x⁗|
	// (Burden & Faires, Numerical Analysis, §3.5, for the clamped spline; the
	// natural spline matches it away from the ends): h ≤ 1.8 ms,
	// max|x⁗| = (2π·5)⁴ ≈ 9.7e5, so about 1.3e-7; times and values are
	// printed with 10 and 12 decimals so rounding adds < 1e-8. Tolerance 1e-6.
	const n, f, splineTol = 400, 5.0, 1e-6
	var b strings.Builder
	b.WriteString("time,x\n")
	times := make([]float64, n)
	for i := range n {
		ti := float64(i) * 1e-3
		if i > 0 && i < n-1 {
			ti += 0.4e-3 * math.Sin(float64(i)*1.7) // uneven steps, still increasing
		}
		times[i] = ti
		fmt.Fprintf(&b, "%.10f,%.12f\n", ti, math.Sin(2*math.Pi*f*ti))
	}
	rec, err := Read(strings.NewReader(b.String()), ReadOptions{})
	require.NoError(t, err)
	require.Equal(t, n, rec.Len())
	assert.Contains(t, strings.Join(rec.Notes, "\n"), "resampled")
	for i := 10; i < n-10; i++ {
		want := math.Sin(2 * math.Pi * f * rec.Time(i))
		assert.InDelta(t, want, rec.Samples[i], splineTol, "sample %d", i)
	}
}

func TestReadErrors(t *testing.T) {
	good := func(n int) string { return rows(n, ",", 0.001, one, false) }
	tests := []struct {
		name string
		text string
		opt  ReadOptions
		want string // the error message, exactly
	}{
		{"empty file", "", ReadOptions{Name: "tap.csv"}, "ringdown: tap.csv: empty file: no data lines"},
		{"only blank lines and comments", "\n# nothing\n\n", ReadOptions{}, "ringdown: input: empty file: no data lines"},
		{"only a header", "time,a\n", ReadOptions{Name: "tap.csv"}, "ringdown: tap.csv: no data lines, only 1 line(s) of text"},
		{"text in a data line", "time,a\n" + good(5) + "0.005,abc\n" + good(20), ReadOptions{Name: "tap.csv"},
			`ringdown: tap.csv:7: column 2 ("a"): "abc" is not a finite number`},
		{"NaN in a data line", "time,a\n" + good(3) + "0.003,NaN\n", ReadOptions{Name: "tap.csv"},
			`ringdown: tap.csv:5: column 2 ("a"): "NaN" is not a finite number`},
		{"Inf time", "time,a\n" + good(3) + "+Inf,1\n", ReadOptions{Name: "tap.csv"},
			`ringdown: tap.csv:5: column 1 ("time"): "+Inf" is not a finite number`},
		{"empty field", "time,a\n" + good(3) + "0.003, \n", ReadOptions{Name: "tap.csv"},
			`ringdown: tap.csv:5: column 2 ("a"): empty field, expected a number`},
		{"wrong number of fields", "time,a\n" + good(3) + "0.003\n", ReadOptions{Name: "tap.csv"},
			"ringdown: tap.csv:5: 1 fields, expected 2 like line 2"},
		{"too few samples", "time,a\n" + good(5), ReadOptions{Name: "tap.csv"},
			"ringdown: tap.csv: only 5 samples (lines 2–6); need at least 16"},
		{"time runs backwards", "time,a\n" + good(10) + "0.0085,1\n" + good(20)[180:], ReadOptions{Name: "tap.csv"},
			`ringdown: tap.csv:12: column 1 ("time"): time 0.0085 runs backwards (previous 0.009 at line 11)`},
		{"unknown column", "time,a\n" + good(20), ReadOptions{Name: "tap.csv", Column: "z"},
			`ringdown: tap.csv: no column "z" (columns: time, a)`},
		{"column is time", "time,a\n" + good(20), ReadOptions{Column: "time"},
			`ringdown: input: column "time" is the time column`},
		{"only a time column", "time\n" + rows(20, ",", 0.001, func(int) []float64 { return nil }, false), ReadOptions{},
			"ringdown: input: no signal column: the only column is time"},
		{"one column, no header, no rate", rows(20, ",", 0, one, false), ReadOptions{},
			"ringdown: input: one column only: give the sample rate (the column is then the signal) or add a time column"},
		{"magnitude without three axes", "time,a\n" + good(20), ReadOptions{Magnitude: true},
			"ringdown: input: magnitude needs three axis columns, found 1 signal column(s)"},
		{"negative sample rate", good(20), ReadOptions{SampleRate: -5},
			"ringdown: input: sample rate -5 Hz is not positive and finite"},
		{"time unit NaN", good(20), ReadOptions{TimeUnit: math.NaN()},
			"ringdown: input: time unit NaN s is not positive and finite"},
		{"time column with a foreign unit", "time [V],a\n" + good(20), ReadOptions{},
			`ringdown: input: time column "time" has unit "v"; give the time unit`},
		{"all times equal", "time,a\n" + rows(20, ",", 0, func(i int) []float64 { return []float64{0, 1} }, false), ReadOptions{},
			"ringdown: input: only 1 distinct times; need at least 16"},
		{"line too long", "time,a\n" + strings.Repeat("1", maxLineBytes+10) + "\n", ReadOptions{},
			"ringdown: input:2: line longer than 1048576 bytes"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, err := Read(strings.NewReader(tc.text), tc.opt)
			require.Error(t, err)
			assert.Equal(t, tc.want, err.Error())
		})
	}
}

func TestReadReaderError(t *testing.T) {
	_, err := Read(iotest.ErrReader(fmt.Errorf("disk gone")), ReadOptions{Name: "tap.csv"})
	require.Error(t, err)
	assert.Equal(t, "ringdown: tap.csv: disk gone", err.Error())
}

func TestRecordCheck(t *testing.T) {
	ok := make([]float64, MinSamples)
	tests := []struct {
		name string
		rec  Record
		want string
	}{
		{"zero rate", Record{Samples: ok}, "ringdown: sample rate 0 Hz is not positive and finite"},
		{"infinite rate", Record{Rate: math.Inf(1), Samples: ok}, "ringdown: sample rate +Inf Hz is not positive and finite"},
		{"NaN start", Record{Rate: 1, Start: math.NaN(), Samples: ok}, "ringdown: start time NaN s is not finite"},
		{"too short", Record{Rate: 1, Samples: ok[:3]}, "ringdown: only 3 samples; need at least 16"},
		{"NaN sample", Record{Rate: 1, Samples: append([]float64{math.NaN()}, ok...)}, "ringdown: sample 0 is NaN, not a finite number"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			err := tc.rec.Check()
			require.Error(t, err)
			assert.Equal(t, tc.want, err.Error())
		})
	}
	r := Record{Rate: 100, Start: 2, Samples: ok}
	assert.NoError(t, r.Check())
	assert.InDelta(t, 0.15, r.Duration(), 1e-15) // (16−1)/100 s
	assert.InDelta(t, 2.05, r.Time(5), 1e-15)    // 2 + 5/100 s
}
