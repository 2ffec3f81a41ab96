package ringdown

import (
	"bufio"
	"errors"
	"fmt"
	"io"
	"math"
	"slices"
	"strconv"
	"strings"
)

// ReadOptions say how to read a ring-down file. The zero value reads a file
// with a time column in seconds (or a unit named in the header) and picks the
// signal column automatically.
type ReadOptions struct {
	// Name is used in error messages, e.g. the file name; "" means "input".
	Name string
	// Column chooses the signal column by header name (case-insensitive) or
	// 1-based number. "" picks the column with the largest standard deviation
	// among the columns that are not time.
	Column string
	// Magnitude uses √(x²+y²+z²) of three axis columns as the signal.
	Magnitude bool
	// Axes names the three columns for Magnitude (names or 1-based numbers).
	// Zero: the columns whose names end in x, y and z, else the first three
	// columns that are not time.
	Axes [3]string
	// SampleRate [Hz], when positive, says the samples are evenly spaced at
	// this rate; no column is read as time (a column named time is ignored).
	SampleRate float64
	// TimeUnit is the length of one unit of the time column [s], e.g. 1e-3
	// for milliseconds. Zero: from the header or units line (s, ms, us, ns),
	// else seconds, or milliseconds when the median step is 0.5 or more (a
	// note in the Record says so).
	TimeUnit float64
}

// Limits of the reader.
const (
	maxLineBytes = 1 << 20 // longest line accepted [bytes]
	jitterLimit  = 0.01    // relative spread of time steps above which the record is resampled
	gapFactor    = 5       // a step longer than this many median steps is reported as a gap
)

// column is one column of the file as the reader sees it.
type column struct {
	name string // header name, or "column N"
	unit string // unit from the units line or the header name; "" unknown
}

// line is one content line of the file.
type line struct {
	num    int      // 1-based line number in the file
	text   string   // the line, trimmed
	fields []string // its trimmed fields, once split
}

// Read reads a ring-down record from a CSV or TSV file: fields separated by
// tabs, semicolons or commas (or runs of spaces), with or without a header
// line and a units line under it; decimal commas are accepted when the
// separator is not a comma. Lines starting with # are comments. Text lines
// above the header are ignored.
//
// The time column is the one named time (t, timestamp, ...) or else the first
// column; its unit comes from opt.TimeUnit, the header or the units line.
// Uneven time steps are resampled onto an even grid with a natural cubic
// spline; repeated timestamps are averaged. Signals in g or mg are converted
// to m/s².
//
// Errors name the input and, where they belong to one place, the line and
// column: an empty file, a field that is not a finite number, a line with
// the wrong number of fields, fewer than MinSamples samples, time that runs
// backwards. Read never panics on bad input.
func Read(r io.Reader, opt ReadOptions) (Record, error) {
	name := opt.Name
	if name == "" {
		name = "input"
	}
	if bad(opt.SampleRate) || opt.SampleRate < 0 {
		return Record{}, fmt.Errorf("ringdown: %s: sample rate %g Hz is not positive and finite", name, opt.SampleRate)
	}
	if bad(opt.TimeUnit) || opt.TimeUnit < 0 {
		return Record{}, fmt.Errorf("ringdown: %s: time unit %g s is not positive and finite", name, opt.TimeUnit)
	}
	src := newLineSource(r, name)
	// The head of the file: every line up to the 50th that starts like a
	// number decides the separator, the header and the units.
	var head []line
	numeric := 0
	for numeric < 50 {
		l, ok, err := src.next()
		if err != nil {
			return Record{}, err
		}
		if !ok {
			break
		}
		head = append(head, l)
		if startsLikeNumber(l.text) {
			numeric++
		}
	}
	if len(head) == 0 {
		return Record{}, fmt.Errorf("ringdown: %s: empty file: no data lines", name)
	}
	sep := detectSeparator(head)
	for i := range head {
		head[i].fields = splitFields(nil, head[i].text, sep)
	}
	// Leading text lines (no field is a number) are preamble, header and units.
	first := 0
	for {
		for first < len(head) && isTextLine(head[first].fields) {
			first++
		}
		if first < len(head) {
			break
		}
		l, ok, err := src.next()
		if err != nil {
			return Record{}, err
		}
		if !ok {
			return Record{}, fmt.Errorf("ringdown: %s: no data lines, only %d line(s) of text", name, len(head))
		}
		l.fields = splitFields(nil, l.text, sep)
		head = append(head, l)
	}
	// A separator at the end of every line leaves an empty last field: drop
	// it when the first data line has one.
	f := head[first].fields
	trailing := len(f) > 1 && f[len(f)-1] == ""
	if trailing {
		for i := range head {
			head[i].fields = dropTrailing(head[i].fields)
		}
	}
	ncol := len(head[first].fields)
	cols, header := headerColumns(head[:first], ncol)
	rd := reader{name: name, opt: opt, cols: cols, hasHeader: header >= 0, sep: sep, trailing: trailing}
	return rd.read(head[first:], src)
}

// dropTrailing drops an empty last field (from a trailing separator).
func dropTrailing(f []string) []string {
	if len(f) > 1 && f[len(f)-1] == "" {
		return f[:len(f)-1]
	}
	return f
}

// startsLikeNumber reports whether s begins with a digit, sign or point.
func startsLikeNumber(s string) bool {
	c := s[0]
	return c >= '0' && c <= '9' || c == '-' || c == '+' || c == '.'
}

// bad reports whether v is NaN or infinite.
func bad(v float64) bool { return math.IsNaN(v) || math.IsInf(v, 0) }

// lineSource yields the non-blank, non-comment lines of a file with their
// numbers.
type lineSource struct {
	sc   *bufio.Scanner
	name string
	num  int // number of the last line read
}

func newLineSource(r io.Reader, name string) *lineSource {
	sc := bufio.NewScanner(r)
	sc.Buffer(make([]byte, 0, 64*1024), maxLineBytes)
	return &lineSource{sc: sc, name: name}
}

// next returns the next content line; ok is false at the end of the input.
func (s *lineSource) next() (l line, ok bool, err error) {
	for s.sc.Scan() {
		s.num++
		t := s.sc.Text()
		if s.num == 1 {
			t = strings.TrimPrefix(t, "\uFEFF") // byte-order mark
		}
		t = strings.TrimSpace(t)
		if t == "" || strings.HasPrefix(t, "#") || strings.HasPrefix(t, "//") {
			continue
		}
		return line{num: s.num, text: t}, true, nil
	}
	if err := s.sc.Err(); err != nil {
		if errors.Is(err, bufio.ErrTooLong) {
			return line{}, false, fmt.Errorf("ringdown: %s:%d: line longer than %d bytes", s.name, s.num+1, maxLineBytes)
		}
		return line{}, false, fmt.Errorf("ringdown: %s: %w", s.name, err)
	}
	return line{}, false, nil
}

// detectSeparator picks tab, semicolon or comma, in that order of
// preference, from the first 50 lines that start like a number (so that a
// preamble line does not decide); 0 means runs of white space.
func detectSeparator(lines []line) rune {
	var sample []line
	for _, l := range lines {
		if startsLikeNumber(l.text) {
			sample = append(sample, l)
			if len(sample) == 50 {
				break
			}
		}
	}
	if len(sample) == 0 {
		sample = lines[:min(len(lines), 50)]
	}
	for _, sep := range []string{"\t", ";", ","} {
		for _, l := range sample {
			if strings.Contains(l.text, sep) {
				return rune(sep[0])
			}
		}
	}
	return 0
}

// splitFields splits s at sep (runs of white space when sep is 0) into
// dst[:0], trims each field and its quotes, and turns a decimal comma into
// a point when sep is not a comma. Fields are substrings of s.
func splitFields(dst []string, s string, sep rune) []string {
	dst = dst[:0]
	if sep == 0 {
		for f := range strings.FieldsSeq(s) {
			dst = append(dst, cleanField(f, sep))
		}
		return dst
	}
	for {
		i := strings.IndexRune(s, sep)
		if i < 0 {
			return append(dst, cleanField(s, sep))
		}
		dst = append(dst, cleanField(s[:i], sep))
		s = s[i+1:]
	}
}

// cleanField trims a field and its quotes and turns a decimal comma into a
// point when sep is not a comma.
func cleanField(v string, sep rune) string {
	v = strings.TrimSpace(v)
	if len(v) >= 2 && v[0] == '"' && v[len(v)-1] == '"' {
		v = strings.TrimSpace(v[1 : len(v)-1])
	}
	if sep != ',' && strings.Contains(v, ",") && !strings.Contains(v, ".") {
		v = strings.Replace(v, ",", ".", 1)
	}
	return v
}

// parseNumber parses a finite decimal number.
func parseNumber(s string) (float64, bool) {
	if s == "" {
		return 0, false
	}
	v, err := strconv.ParseFloat(s, 64)
	if err != nil || bad(v) {
		return 0, false
	}
	return v, true
}

// looksNumeric reports whether s parses as a number, finite or not, so that
// "NaN" in a data line is reported as a bad value rather than taken for text.
func looksNumeric(s string) bool {
	_, err := strconv.ParseFloat(s, 64)
	return err == nil
}

// isTextLine reports whether no field of a line is a number.
func isTextLine(fields []string) bool {
	for _, f := range fields {
		if looksNumeric(f) {
			return false
		}
	}
	return true
}

// headerColumns names the ncol columns from the leading text lines. The last
// text line with ncol fields is the header, unless it is a units line, in
// which case the one before it with ncol fields is. header is the index of
// the header line in text, or -1.
func headerColumns(text []line, ncol int) (cols []column, header int) {
	cols = make([]column, ncol)
	for i := range cols {
		cols[i].name = fmt.Sprintf("column %d", i+1)
	}
	var match []int
	for i, l := range text {
		if len(l.fields) == ncol {
			match = append(match, i)
		}
	}
	units := -1
	header = -1
	switch {
	case len(match) == 0:
	case isUnitsLine(text[match[len(match)-1]].fields) && len(match) >= 2:
		units = match[len(match)-1]
		header = match[len(match)-2]
	case isUnitsLine(text[match[len(match)-1]].fields) && len(match) == 1:
		units = match[0]
	default:
		header = match[len(match)-1]
	}
	if header >= 0 {
		for i, f := range text[header].fields {
			name, unit := splitUnit(f)
			if name == "" {
				name = fmt.Sprintf("column %d", i+1)
			}
			cols[i] = column{name: name, unit: unit}
		}
	}
	if units >= 0 {
		for i, f := range text[units].fields {
			if u := normUnit(f); u != "" {
				cols[i].unit = u
			}
		}
	}
	return cols, header
}

// isUnitsLine reports whether every non-empty field is a unit we know or a
// bracketed unit.
func isUnitsLine(fields []string) bool {
	seen := false
	for _, f := range fields {
		if f == "" {
			continue
		}
		seen = true
		if strings.HasPrefix(f, "[") || strings.HasPrefix(f, "(") {
			continue
		}
		if _, known, _ := unitScale(normUnit(f)); !known {
			return false
		}
	}
	return seen
}

// unitScale returns the size of a normalised unit in SI — seconds for
// time, m/s² for acceleration, 0 for units kept as they are — whether the
// unit is known, and whether it measures time.
func unitScale(u string) (scale float64, known, isTime bool) {
	switch u {
	case "s", "sec":
		return 1, true, true
	case "ms":
		return 1e-3, true, true
	case "us":
		return 1e-6, true, true
	case "ns":
		return 1e-9, true, true
	case "g":
		return StandardGravity, true, false
	case "mg":
		return 1e-3 * StandardGravity, true, false
	case "m/s²":
		return 1, true, false
	case "mm/s²":
		return 1e-3, true, false
	case "v", "mv", "-", "m", "mm", "m/s", "mm/s", "um":
		return 0, true, false
	}
	return 0, false, false
}

// normUnit normalises a unit: brackets stripped, lower case, µ → u,
// m/s^2 and its spellings → m/s².
func normUnit(u string) string {
	u = strings.TrimSpace(u)
	u = strings.Trim(u, "[]()")
	u = strings.ToLower(strings.TrimSpace(u))
	u = strings.NewReplacer("µ", "u", "μ", "u", " ", "").Replace(u)
	switch u {
	case "m/s^2", "m/s2", "m/s/s", "ms^-2", "m·s^-2", "m*s^-2", "m.s-2", "ms-2":
		return "m/s²"
	case "mm/s^2", "mm/s2":
		return "mm/s²"
	case "secs", "seconds", "second":
		return "s"
	case "msec", "millis", "milliseconds":
		return "ms"
	}
	return u
}

// splitUnit splits a header field like "az (m/s^2)", "time[ms]" or
// "time_ms" into a name and a normalised unit.
func splitUnit(f string) (name, unit string) {
	f = strings.TrimSpace(f)
	for _, br := range [][2]string{{"(", ")"}, {"[", "]"}} {
		if i := strings.LastIndex(f, br[0]); i > 0 && strings.HasSuffix(f, br[1]) {
			return strings.TrimSpace(f[:i]), normUnit(f[i:])
		}
	}
	lower := strings.ToLower(f)
	for _, suf := range []string{"_ms", " ms", "_s", " s", "_us", " us", "_ns", " ns"} {
		if strings.HasSuffix(lower, suf) && len(f) > len(suf) {
			return strings.TrimSpace(f[:len(f)-len(suf)]), strings.TrimSpace(suf[1:])
		}
	}
	return f, ""
}

// reader holds what one Read has found about the file.
type reader struct {
	name      string
	opt       ReadOptions
	cols      []column
	hasHeader bool
	chosen    int  // the signal column (the first axis for Magnitude)
	sep       rune // field separator (0: white space)
	trailing  bool // lines end with a separator
	notes     []string
}

// where returns "name:line: column N ("col")" for messages.
func (rd *reader) where(lnum, col int) string {
	return fmt.Sprintf("%s:%d: column %d (%q)", rd.name, lnum, col+1, rd.cols[col].name)
}

// read parses the data lines: those already split in data, then the rest
// of src, keeping only the columns in use.
func (rd *reader) read(data []line, src *lineSource) (Record, error) {
	ncol := len(rd.cols)
	timeCol := -1
	if rd.opt.SampleRate == 0 {
		timeCol = rd.findTime()
	}
	sigCols, err := rd.signalColumns(timeCol)
	if err != nil {
		return Record{}, err
	}
	need := slices.Clone(sigCols)
	if timeCol >= 0 {
		need = append(need, timeCol)
	}
	slices.Sort(need)
	need = slices.Compact(need)
	values := make([][]float64, ncol)
	var nums []int // line number of each sample
	firstNum := data[0].num
	parse := func(l line) error {
		if len(l.fields) != ncol {
			return fmt.Errorf("ringdown: %s:%d: %d fields, expected %d like line %d",
				rd.name, l.num, len(l.fields), ncol, firstNum)
		}
		for _, c := range need {
			x, ok := parseNumber(l.fields[c])
			if !ok {
				if l.fields[c] == "" {
					return fmt.Errorf("ringdown: %s: empty field, expected a number", rd.where(l.num, c))
				}
				return fmt.Errorf("ringdown: %s: %q is not a finite number", rd.where(l.num, c), l.fields[c])
			}
			values[c] = append(values[c], x)
		}
		nums = append(nums, l.num)
		return nil
	}
	for _, l := range data {
		if err := parse(l); err != nil {
			return Record{}, err
		}
	}
	var buf []string
	for {
		l, ok, err := src.next()
		if err != nil {
			return Record{}, err
		}
		if !ok {
			break
		}
		buf = splitFields(buf, l.text, rd.sep)
		l.fields = buf
		if rd.trailing {
			l.fields = dropTrailing(l.fields)
		}
		if err := parse(l); err != nil {
			return Record{}, err
		}
	}
	if len(nums) < MinSamples {
		return Record{}, fmt.Errorf("ringdown: %s: only %d samples (lines %d–%d); need at least %d",
			rd.name, len(nums), nums[0], nums[len(nums)-1], MinSamples)
	}
	sig, err := rd.signal(values, sigCols, nums)
	if err != nil {
		return Record{}, err
	}
	rec := Record{Samples: sig}
	rec.Unit, rec.Column = rd.signalUnit(sigCols, sig)
	if timeCol < 0 {
		rec.Rate = rd.opt.SampleRate
		if rec.Rate == 0 {
			return Record{}, fmt.Errorf("ringdown: %s: no time column and no sample rate given", rd.name)
		}
	} else if err := rd.timeBase(&rec, values[timeCol], timeCol, nums); err != nil {
		return Record{}, err
	}
	rec.Notes = rd.notes
	if err := rec.Check(); err != nil {
		return Record{}, fmt.Errorf("ringdown: %s: %s", rd.name, strings.TrimPrefix(err.Error(), "ringdown: "))
	}
	return rec, nil
}

// findTime returns the time column: one named like time, else the first.
func (rd *reader) findTime() int {
	for i, c := range rd.cols {
		if isTimeName(c.name) {
			return i
		}
	}
	if rd.hasHeader {
		rd.notes = append(rd.notes, fmt.Sprintf("no column is named time: column 1 (%q) taken as time", rd.cols[0].name))
	}
	return 0
}

// lookup finds a column by name (case-insensitive) or 1-based number.
func (rd *reader) lookup(key string) (int, error) {
	key = strings.TrimSpace(key)
	for i, c := range rd.cols {
		if strings.EqualFold(c.name, key) {
			return i, nil
		}
	}
	if n, err := strconv.Atoi(key); err == nil && n >= 1 && n <= len(rd.cols) {
		return n - 1, nil
	}
	names := make([]string, len(rd.cols))
	for i, c := range rd.cols {
		names[i] = c.name
	}
	return 0, fmt.Errorf("ringdown: %s: no column %q (columns: %s)", rd.name, key, strings.Join(names, ", "))
}

// signalColumns returns the one signal column, or the three axes for
// Magnitude; -1 in the single case means "pick the widest spread later".
func (rd *reader) signalColumns(timeCol int) ([]int, error) {
	var free []int
	for i, c := range rd.cols {
		if i == timeCol || (rd.opt.SampleRate > 0 && isTimeName(c.name)) {
			continue
		}
		free = append(free, i)
	}
	if rd.opt.Magnitude {
		if rd.opt.Axes != [3]string{} {
			out := make([]int, 3)
			for k, a := range rd.opt.Axes {
				c, err := rd.lookup(a)
				if err != nil {
					return nil, err
				}
				out[k] = c
			}
			return out, nil
		}
		out := make([]int, 0, 3)
		for _, suf := range []string{"x", "y", "z"} {
			for _, c := range free {
				if strings.HasSuffix(strings.ToLower(rd.cols[c].name), suf) {
					out = append(out, c)
					break
				}
			}
		}
		if len(out) == 3 && out[0] != out[1] && out[1] != out[2] && out[0] != out[2] {
			return out, nil
		}
		if len(free) < 3 {
			return nil, fmt.Errorf("ringdown: %s: magnitude needs three axis columns, found %d signal column(s)", rd.name, len(free))
		}
		return free[:3], nil
	}
	if rd.opt.Column != "" {
		c, err := rd.lookup(rd.opt.Column)
		if err != nil {
			return nil, err
		}
		if c == timeCol {
			return nil, fmt.Errorf("ringdown: %s: column %q is the time column", rd.name, rd.opt.Column)
		}
		return []int{c}, nil
	}
	if len(free) == 0 {
		if !rd.hasHeader {
			return nil, fmt.Errorf("ringdown: %s: one column only: give the sample rate (the column is then the signal) or add a time column", rd.name)
		}
		return nil, fmt.Errorf("ringdown: %s: no signal column: the only column is time", rd.name)
	}
	return free, nil
}

// isTimeName reports whether a header name means time: t, time,
// timestamp, seconds, sec, s, ms, millis, elapsed, clock, or any name
// containing "time".
func isTimeName(n string) bool {
	n = strings.ToLower(n)
	switch n {
	case "t", "seconds", "sec", "s", "ms", "millis", "elapsed", "clock":
		return true
	}
	return strings.Contains(n, "time")
}

// signal builds the signal from the parsed columns: the magnitude of three
// axes, the one chosen column, or the column with the largest standard
// deviation among the candidates.
func (rd *reader) signal(values [][]float64, cols []int, nums []int) ([]float64, error) {
	if rd.opt.Magnitude {
		x, y, z := values[cols[0]], values[cols[1]], values[cols[2]]
		out := make([]float64, len(x))
		for i := range out {
			out[i] = math.Sqrt(x[i]*x[i] + y[i]*y[i] + z[i]*z[i])
			if bad(out[i]) {
				return nil, fmt.Errorf("ringdown: %s:%d: magnitude overflows", rd.name, nums[i])
			}
		}
		rd.chosen = cols[0]
		return out, nil
	}
	best, bestSD := cols[0], -1.0
	for _, c := range cols {
		if sd := stdDev(values[c]); sd > bestSD {
			best, bestSD = c, sd
		}
	}
	if len(cols) > 1 {
		rd.notes = append(rd.notes, fmt.Sprintf("signal column %q picked: largest standard deviation of %d columns", rd.cols[best].name, len(cols)))
	}
	rd.chosen = best
	return slices.Clone(values[best]), nil
}

// stdDev returns the standard deviation of v about its mean, finite even
// for huge values (they are scaled first).
func stdDev(v []float64) float64 {
	scale := 0.0
	for _, x := range v {
		scale = max(scale, math.Abs(x))
	}
	if scale == 0 || len(v) == 0 {
		return 0
	}
	mean := 0.0
	for _, x := range v {
		mean += x / scale
	}
	mean /= float64(len(v))
	ss := 0.0
	for _, x := range v {
		d := x/scale - mean
		ss += d * d
	}
	return scale * math.Sqrt(ss/float64(len(v)))
}

// signalUnit returns the unit of the signal and the column description,
// converting g and mg to m/s² in place.
func (rd *reader) signalUnit(cols []int, sig []float64) (unit, desc string) {
	c := rd.chosen
	desc = rd.cols[c].name
	if rd.opt.Magnitude {
		desc = fmt.Sprintf("|(%s, %s, %s)|", rd.cols[cols[0]].name, rd.cols[cols[1]].name, rd.cols[cols[2]].name)
		c = cols[0]
	}
	u := rd.cols[c].unit
	if f, _, isTime := unitScale(u); f != 0 && f != 1 && !isTime {
		for i := range sig {
			sig[i] *= f
		}
		rd.notes = append(rd.notes, fmt.Sprintf("signal converted from %s to m/s²", u))
		return "m/s²", desc
	}
	return u, desc
}

// timeBase sets Start and Rate from the time column, checking that time
// advances, averaging repeated timestamps and resampling uneven steps.
func (rd *reader) timeBase(rec *Record, t []float64, col int, nums []int) error {
	// Work relative to the first timestamp so epoch times keep precision.
	t0 := t[0]
	rel := make([]float64, len(t))
	for i := range t {
		rel[i] = t[i] - t0
		if i > 0 && rel[i] < rel[i-1] {
			return fmt.Errorf("ringdown: %s: time %g runs backwards (previous %g at line %d)",
				rd.where(nums[i], col), t[i], t[i-1], nums[i-1])
		}
	}
	x := rec.Samples
	rel, x, dups := mergeRepeats(rel, x)
	if dups > 0 {
		rd.notes = append(rd.notes, fmt.Sprintf("%d repeated timestamps: their samples averaged", dups))
	}
	if len(rel) < MinSamples {
		return fmt.Errorf("ringdown: %s: only %d distinct times; need at least %d", rd.name, len(rel), MinSamples)
	}
	steps := make([]float64, len(rel)-1)
	for i := range steps {
		steps[i] = rel[i+1] - rel[i]
	}
	med := median(steps)
	scale, err := rd.timeScale(col, med)
	if err != nil {
		return err
	}
	span := rel[len(rel)-1]
	rate := float64(len(rel)-1) / (span * scale)
	if bad(rate) || !(rate > 0) || bad(t0*scale) {
		return fmt.Errorf("ringdown: %s: time column %q gives no usable sample rate", rd.name, rd.cols[col].name)
	}
	rec.Start = t0 * scale
	rec.Rate = rate
	spread := 0.0
	gaps := 0
	for _, s := range steps {
		spread = max(spread, math.Abs(s-med)/med)
		if s > gapFactor*med {
			gaps++
		}
	}
	if gaps > 0 {
		rd.notes = append(rd.notes, fmt.Sprintf("%d gap(s) longer than %d time steps: filled by interpolation", gaps, gapFactor))
	}
	if spread > jitterLimit {
		grid := make([]float64, len(rel))
		for i := range grid {
			grid[i] = float64(i) * span / float64(len(rel)-1)
		}
		rec.Samples = splineResample(rel, x, grid)
		rd.notes = append(rd.notes, fmt.Sprintf("time steps vary by up to %.3g %%: resampled to an even %.6g Hz", 100*spread, rate))
	} else {
		rec.Samples = x
	}
	return nil
}

// timeScale returns seconds per unit of the time column.
func (rd *reader) timeScale(col int, medStep float64) (float64, error) {
	if rd.opt.TimeUnit > 0 {
		return rd.opt.TimeUnit, nil
	}
	u := rd.cols[col].unit
	if u == "" {
		// Bare names like "ms" or "time_ms".
		n := strings.ToLower(rd.cols[col].name)
		if n == "ms" || n == "millis" {
			u = "ms"
		}
	}
	if f, _, isTime := unitScale(u); isTime {
		return f, nil
	}
	if u != "" {
		return 0, fmt.Errorf("ringdown: %s: time column %q has unit %q; give the time unit", rd.name, rd.cols[col].name, u)
	}
	if medStep >= 0.5 {
		rd.notes = append(rd.notes, fmt.Sprintf("time unit not given: median step %g taken as milliseconds", medStep))
		return 1e-3, nil
	}
	return 1, nil
}

// mergeRepeats averages samples that share a timestamp; t is non-decreasing.
func mergeRepeats(t, x []float64) ([]float64, []float64, int) {
	dups := 0
	for i := 1; i < len(t); i++ {
		if t[i] == t[i-1] {
			dups++
		}
	}
	if dups == 0 {
		return t, x, 0
	}
	tt := make([]float64, 0, len(t)-dups)
	xx := make([]float64, 0, len(t)-dups)
	for i := 0; i < len(t); {
		j, sum := i, 0.0
		for j < len(t) && t[j] == t[i] {
			sum += x[j]
			j++
		}
		tt = append(tt, t[i])
		xx = append(xx, sum/float64(j-i))
		i = j
	}
	return tt, xx, dups
}

// median returns the median of v (v is not changed).
func median(v []float64) float64 {
	if len(v) == 0 {
		return 0
	}
	s := slices.Clone(v)
	slices.Sort(s)
	n := len(s)
	if n%2 == 1 {
		return s[n/2]
	}
	return (s[n/2-1] + s[n/2]) / 2
}
