package sections

import (
	"errors"
	"fmt"
	"maps"
	"regexp"
	"slices"
	"strconv"
	"strings"
	"unicode"
	"unicode/utf8"

	"github.com/trestle-go/trestle/materials"
)

// maxSpecLen bounds a spec's length; real specs are under 100 bytes.
const maxSpecLen = 400

// Parse reads a section spec (see the package documentation and List):
//
//	rect 100x20 mm · square 40 mm · round 40 mm · flat 50x10 mm
//	round-tube 60.3x3.2 mm · square-tube 50x3 mm · rect-tube 100x50x4 mm r=8
//	rect-tube 6x4x1/4 in aisc · pipe 2in sch40 · angle 50x50x5 mm r=7
//	channel 100x50x6x8.5 mm · i-shape 200x100x5.6x8.5 mm r=12
//	lumber 2x4 · lumber 2x6 x3 · block 8in · block 390x190 mm grouted
//	filled square-tube 100x5 mm with concrete C25/30
//	general A=12.3cm2 Iy=100cm4 Iz=50cm4 J=20cm4
//
// Shape names, units and keywords ignore case; material names follow
// "of" (the tube or unit) and "with" (the fill or grout) and are found
// with materials.Lookup. Parse checks the section (Properties must
// succeed) and returns an error that quotes the spec and says what is
// wrong: unknown shape (with the closest name), wrong number of sizes,
// missing or unknown unit, a size that is not a positive finite number,
// a wall too thick for the size, an unknown option or material.
func Parse(spec string) (Section, error) {
	s, err := parse(spec)
	if err != nil {
		q := spec
		if len(q) > 60 || !utf8.ValidString(q) {
			q = strings.ToValidUTF8(q[:min(len(q), 60)], "?") + "…"
		}
		return nil, fmt.Errorf("sections: spec %q: %s", q, strings.TrimPrefix(err.Error(), "sections: "))
	}
	return s, nil
}

// kindInfo describes one shape keyword.
type kindInfo struct {
	name    string
	parse   func(p *specParser) (Section, error)
	desc    string
	example string
}

// kinds lists the shape keywords in the order List shows them.
func kinds() []kindInfo {
	return []kindInfo{
		{"rect", parseRect, "solid rectangular bar, width (y) x depth (z)", "rect 100x20 mm"},
		{"square", parseSquare, "solid square bar, side", "square 40 mm"},
		{"round", parseRound, "solid round bar, diameter", "round 40 mm"},
		{"flat", parseFlat, "flat bar lying flat, width x thickness", "flat 50x10 mm"},
		{"round-tube", parseRoundTube, "circular hollow section, outside diameter x wall; aisc: design wall 0.93t", "round-tube 60.3x3.2 mm"},
		{"square-tube", parseSquareTube, "square hollow section, side x wall; sharp corners unless r= (outer corner radius), aisc (design wall 0.93t, r = 2t) or en10219 (EN 10219-2 radii)", "square-tube 50x3 mm r=6"},
		{"rect-tube", parseRectTube, "rectangular hollow section, depth (z) x width (y) x wall; r=, aisc, en10219 as for square-tube", "rect-tube 100x50x4 mm en10219"},
		{"pipe", parsePipe, "steel pipe by nominal size (1/2 to 8 in) and schedule (sch10, sch40, sch80, sch160, std, xs), ASME B36.10M", "pipe 2in sch40"},
		{"angle", parseAngle, "angle, leg (y) x leg (z) x thickness; r= root radius", "angle 50x50x5 mm r=7"},
		{"channel", parseChannel, "channel with parallel flanges, depth x flange width x web x flange; r= root radius", "channel 100x50x6x8.5 mm"},
		{"i-shape", parseIShape, "I-section with parallel flanges, depth x flange width x web x flange; r= root radius", "i-shape 200x100x5.6x8.5 mm r=12"},
		{"lumber", parseLumber, "dressed sawn lumber by nominal inches (NDS); xN: N plies glued side by side", "lumber 2x6 x3"},
		{"block", parseBlock, "hollow concrete masonry unit in plan: nominal width in inches, or length x width; grouted: cores filled", "block 8in grouted"},
		{"filled", nil, "a round-tube, square-tube, rect-tube or pipe filled with concrete, mineral casting or sand", "filled square-tube 100x5 mm with concrete C25/30"},
		{"general", parseGeneral, "any section given by its properties: A, Iy, Iz, J (and Asy, Asz, cy, cz), each with its unit", "general A=12.3cm2 Iy=100cm4 Iz=50cm4 J=20cm4"},
	}
}

// aliases maps other common names to shape keywords.
var aliases = map[string]string{
	"rectangle": "rect", "rod": "round",
	"chs": "round-tube", "shs": "square-tube", "rhs": "rect-tube",
	"tube": "round-tube", "i-beam": "i-shape", "ibeam": "i-shape",
	"cmu": "block", "timber": "lumber",
}

// specParser holds the tokens of one spec being read.
type specParser struct {
	kind   string
	toks   []string // after the shape keyword, lower-cased, before any material clause
	of     string   // material name after "of", as written
	with   string   // material name after "with", as written
	filled bool
}

func parse(spec string) (Section, error) {
	if len(spec) > maxSpecLen {
		return nil, fmt.Errorf("longer than %d bytes", maxSpecLen)
	}
	if !utf8.ValidString(spec) {
		return nil, errors.New("not valid UTF-8 text")
	}
	for _, r := range spec {
		if unicode.IsControl(r) && r != '\t' {
			return nil, fmt.Errorf("contains the control character %U", r)
		}
	}
	spec = strings.ReplaceAll(spec, "×", "x")
	fields := joinTimes(strings.Fields(spec))
	if len(fields) == 0 {
		return nil, errors.New("empty: give a shape and its sizes, e.g. \"rect 100x20 mm\"")
	}
	p := &specParser{}
	var main []string
	clause := ""
	for _, f := range fields {
		lf := strings.ToLower(f)
		if lf == materialClauseOf || lf == materialClauseFor {
			if clause == "" && len(main) == 0 {
				return nil, fmt.Errorf("%q before the shape", f)
			}
			if (lf == materialClauseOf && p.of != "") || (lf == materialClauseFor && p.with != "") {
				return nil, fmt.Errorf("%q given twice", lf)
			}
			if clause != "" && clauseText(p, clause) == "" {
				return nil, fmt.Errorf("no material name after %q", clause)
			}
			clause = lf
			continue
		}
		switch clause {
		case "":
			main = append(main, lf)
		case materialClauseOf:
			p.of = strings.TrimSpace(p.of + " " + f)
		case materialClauseFor:
			p.with = strings.TrimSpace(p.with + " " + f)
		}
	}
	if clause != "" && clauseText(p, clause) == "" {
		return nil, fmt.Errorf("no material name after %q", clause)
	}
	if len(main) == 0 {
		return nil, errors.New("no shape before the material")
	}
	if main[0] == "filled" {
		p.filled = true
		main = main[1:]
		if len(main) == 0 {
			return nil, errors.New("\"filled\" needs a tube, e.g. \"filled square-tube 100x5 mm with concrete C25/30\"")
		}
	}
	p.kind, p.toks = main[0], main[1:]
	if p.kind == "filled" {
		return nil, errors.New("\"filled\" given twice")
	}
	if a, ok := aliases[p.kind]; ok {
		p.kind = a
	}
	var info *kindInfo
	ks := kinds()
	for i := range ks {
		if ks[i].name == p.kind && ks[i].parse != nil {
			info = &ks[i]
		}
	}
	if info == nil {
		return nil, unknownKind(main[0])
	}
	if p.filled {
		return parseFilled(p, info)
	}
	if p.with != "" || p.of != "" {
		if p.kind != "block" {
			return nil, fmt.Errorf("a %s takes no material here (the member's material applies); for a filled tube write \"filled %s ... with <fill>\"", p.kind, p.kind)
		}
	}
	s, err := info.parse(p)
	if err != nil {
		return nil, err
	}
	if _, err := s.Properties(); err != nil {
		return nil, err
	}
	if c, ok := s.(Composite); ok {
		if _, err := c.Parts(); err != nil {
			return nil, err
		}
	}
	return s, nil
}

// joinTimes joins sizes written with spaces around the x ("100 x 50 x 4
// mm") into one token.
func joinTimes(fields []string) []string {
	var out []string
	for i := 0; i < len(fields); i++ {
		f := fields[i]
		if (f == "x" || f == "X") && len(out) > 0 && i+1 < len(fields) && looksNumeric(out[len(out)-1]) && looksNumeric(fields[i+1]) {
			out[len(out)-1] += "x" + fields[i+1]
			i++
			continue
		}
		out = append(out, f)
	}
	return out
}

func clauseText(p *specParser, clause string) string {
	if clause == materialClauseOf {
		return p.of
	}
	return p.with
}

// unknownKind names the closest shape keyword.
func unknownKind(k string) error {
	names := []string{}
	for _, ki := range kinds() {
		names = append(names, ki.name)
	}
	best, bestD := "", 1<<30
	for _, n := range names {
		if d := materials.EditDistance(k, n); d < bestD {
			best, bestD = n, d
		}
	}
	for _, a := range slices.Sorted(maps.Keys(aliases)) { // sorted: a tie names the same shape every time
		if d := materials.EditDistance(k, a); d < bestD {
			best, bestD = aliases[a], d
		}
	}
	if looksNumeric(k) {
		return fmt.Errorf("starts with %q: give the shape first (%s)", k, strings.Join(names, ", "))
	}
	if bestD <= max(2, len(k)/2) {
		return fmt.Errorf("unknown shape %q; did you mean %q? (shapes: %s)", k, best, strings.Join(names, ", "))
	}
	return fmt.Errorf("unknown shape %q (shapes: %s)", k, strings.Join(names, ", "))
}

func looksNumeric(s string) bool { return s != "" && (s[0] >= '0' && s[0] <= '9' || s[0] == '.') }

var trailingLetters = regexp.MustCompile(`[a-z"]+$`)

// sizes reads the sizes token "AxBxC" (n numbers), its unit (attached or
// the next token) and returns the sizes in SI, the unit and the options
// that follow. names names each size for messages ("HxBxT").
func (p *specParser) sizes(names string) ([]float64, lengthUnit, []string, error) {
	n := len(strings.Split(names, "x"))
	if len(p.toks) == 0 {
		return nil, lengthUnit{}, nil, fmt.Errorf("%s needs its sizes %s and a unit, e.g. %q", p.kind, names, exampleOf(p.kind))
	}
	tok := p.toks[0]
	rest := p.toks[1:]
	unitName := trailingLetters.FindString(tok)
	if stripped := strings.TrimSuffix(tok, unitName); stripped != "" && strings.ContainsAny(stripped[len(stripped)-1:], "0123456789.") {
		tok = stripped
	} else {
		unitName = ""
	}
	if unitName == "" && len(rest) > 0 && !strings.Contains(rest[0], "=") && trailingLetters.FindString(rest[0]) == rest[0] {
		unitName, rest = rest[0], rest[1:]
	}
	parts := strings.Split(tok, "x")
	if tok == "" {
		return nil, lengthUnit{}, nil, fmt.Errorf("%s needs its sizes %s before the unit", p.kind, names)
	}
	if len(parts) != n {
		return nil, lengthUnit{}, nil, fmt.Errorf("%s needs %d size(s) %s, got %d in %q", p.kind, n, names, len(parts), tok)
	}
	u, err := unitFor(unitName, p.kind)
	if err != nil {
		return nil, lengthUnit{}, nil, err
	}
	vals := make([]float64, n)
	for i, s := range parts {
		x, err := parseNumber(s)
		if err != nil {
			return nil, lengthUnit{}, nil, fmt.Errorf("%s size %s: %v", p.kind, nameAt(names, i), err)
		}
		if x == 0 {
			return nil, lengthUnit{}, nil, fmt.Errorf("%s size %s is zero", p.kind, nameAt(names, i))
		}
		vals[i] = u.toSI(x, 1)
	}
	return vals, u, rest, nil
}

func nameAt(names string, i int) string { return strings.Split(names, "x")[i] }

func unitFor(name, kind string) (lengthUnit, error) {
	switch name {
	case "", "aisc", "en10219", "grouted", "ungrouted":
		return lengthUnit{}, fmt.Errorf("missing unit after the sizes of the %s (%s)", kind, unitNames())
	case "\"", "inch", "inches":
		name = "in"
	case "mm.", "millimetres", "millimeters":
		name = "mm"
	}
	u, ok := findUnit(name)
	if !ok {
		return lengthUnit{}, fmt.Errorf("unknown unit %q (%s)", name, unitNames())
	}
	return u, nil
}

func exampleOf(kind string) string {
	for _, k := range kinds() {
		if k.name == kind {
			return k.example
		}
	}
	return ""
}

// options reads key=value lengths (in unit u unless a unit is attached)
// and bare keywords. keys lists the allowed keys (without "="), words the
// allowed bare keywords.
func options(kind string, toks []string, u lengthUnit, keys, words []string) (map[string]float64, map[string]bool, error) {
	vals := map[string]float64{}
	flags := map[string]bool{}
	known := func() string {
		var all []string
		for _, k := range keys {
			all = append(all, k+"=")
		}
		return strings.Join(append(all, words...), ", ")
	}
	for _, t := range toks {
		k, v, isKV := strings.Cut(t, "=")
		if !isKV {
			if !contains(words, t) {
				if len(keys)+len(words) == 0 {
					return nil, nil, fmt.Errorf("unexpected %q after the %s's sizes", t, kind)
				}
				return nil, nil, fmt.Errorf("unknown option %q for %s (known: %s)", t, kind, known())
			}
			if flags[t] {
				return nil, nil, fmt.Errorf("option %q given twice", t)
			}
			flags[t] = true
			continue
		}
		if !contains(keys, k) {
			if len(keys)+len(words) == 0 {
				return nil, nil, fmt.Errorf("unexpected %q after the %s's sizes", t, kind)
			}
			return nil, nil, fmt.Errorf("unknown option %q for %s (known: %s)", k+"=", kind, known())
		}
		if _, dup := vals[k]; dup {
			return nil, nil, fmt.Errorf("option %q given twice", k+"=")
		}
		uu := u
		if un := trailingLetters.FindString(v); un != "" {
			var err error
			if uu, err = unitFor(un, kind); err != nil {
				return nil, nil, fmt.Errorf("option %s=: %v", k, err)
			}
			v = strings.TrimSuffix(v, un)
		}
		x, err := parseNumber(v)
		if err != nil {
			return nil, nil, fmt.Errorf("option %s=: %v", k, err)
		}
		vals[k] = uu.toSI(x, 1)
	}
	return vals, flags, nil
}

func contains(list []string, s string) bool {
	for _, x := range list {
		if x == s {
			return true
		}
	}
	return false
}

func noOptions(kind string, rest []string) error {
	_, _, err := options(kind, rest, lengthUnit{}, nil, nil)
	return err
}

func parseRect(p *specParser) (Section, error) {
	v, _, rest, err := p.sizes("BxH")
	if err != nil {
		return nil, err
	}
	return Rect{B: v[0], H: v[1]}, noOptions(p.kind, rest)
}

func parseSquare(p *specParser) (Section, error) {
	v, _, rest, err := p.sizes("B")
	if err != nil {
		return nil, err
	}
	return Square{B: v[0]}, noOptions(p.kind, rest)
}

func parseRound(p *specParser) (Section, error) {
	v, _, rest, err := p.sizes("D")
	if err != nil {
		return nil, err
	}
	return Round{D: v[0]}, noOptions(p.kind, rest)
}

func parseFlat(p *specParser) (Section, error) {
	v, _, rest, err := p.sizes("WxT")
	if err != nil {
		return nil, err
	}
	return Flat{W: v[0], T: v[1]}, noOptions(p.kind, rest)
}

var convWords = []string{"aisc", "en10219"}

func convOf(flags map[string]bool) (Convention, error) {
	switch {
	case flags["aisc"] && flags["en10219"]:
		return 0, errors.New("give one of aisc and en10219, not both")
	case flags["aisc"]:
		return AISC, nil
	case flags["en10219"]:
		return EN10219, nil
	}
	return AsGiven, nil
}

func parseRoundTube(p *specParser) (Section, error) {
	v, u, rest, err := p.sizes("DxT")
	if err != nil {
		return nil, err
	}
	_, flags, err := options(p.kind, rest, u, nil, convWords)
	if err != nil {
		return nil, err
	}
	c, err := convOf(flags)
	return RoundTube{D: v[0], T: v[1], Conv: c}, err
}

func parseRectTubeWith(p *specParser, names string) (Section, error) {
	v, u, rest, err := p.sizes(names)
	if err != nil {
		return nil, err
	}
	vals, flags, err := options(p.kind, rest, u, []string{"r"}, convWords)
	if err != nil {
		return nil, err
	}
	c, err := convOf(flags)
	if err != nil {
		return nil, err
	}
	if len(v) == 2 {
		return RectTube{H: v[0], B: v[0], T: v[1], R: vals["r"], Conv: c}, nil
	}
	return RectTube{H: v[0], B: v[1], T: v[2], R: vals["r"], Conv: c}, nil
}

func parseSquareTube(p *specParser) (Section, error) { return parseRectTubeWith(p, "BxT") }
func parseRectTube(p *specParser) (Section, error)   { return parseRectTubeWith(p, "HxBxT") }

func parsePipe(p *specParser) (Section, error) {
	if len(p.toks) == 0 {
		return nil, fmt.Errorf("pipe needs a nominal size and schedule, e.g. \"pipe 2in sch40\" (sizes: %s)", strings.Join(PipeSizes(), ", "))
	}
	size := strings.TrimSuffix(strings.TrimSuffix(p.toks[0], "\""), "in")
	rest := p.toks[1:]
	if len(rest) > 0 && (rest[0] == "in" || rest[0] == "\"") {
		rest = rest[1:]
	}
	if len(rest) == 0 {
		return nil, errors.New("pipe needs a schedule after the size: sch10, sch40, sch80, sch160, std or xs")
	}
	sch := rest[0]
	switch {
	case sch == "std" || sch == "xs":
	case sch == "sch" && len(rest) > 1: // "sch 40"
		sch, rest = rest[1], rest[1:]
	case schRE.MatchString(sch):
		sch = strings.TrimPrefix(sch, "sch")
	default:
		return nil, fmt.Errorf("pipe schedule %q should read sch10, sch40, sch80, sch160, std or xs", sch)
	}
	_, flags, err := options(p.kind, rest[1:], lengthUnit{}, nil, []string{"aisc"})
	if err != nil {
		return nil, err
	}
	c, _ := convOf(flags)
	pp := Pipe{NPS: size, Schedule: sch, Conv: c}
	if _, err := pp.Tube(); err != nil {
		return nil, err
	}
	return pp, nil
}

func parseAngle(p *specParser) (Section, error) {
	v, u, rest, err := p.sizes("BxHxT")
	if err != nil {
		return nil, err
	}
	vals, _, err := options(p.kind, rest, u, []string{"r", "rt"}, nil)
	return Angle{B: v[0], H: v[1], T: v[2], R: vals["r"], RT: vals["rt"]}, err
}

func parseChannel(p *specParser) (Section, error) {
	v, u, rest, err := p.sizes("HxBxTWxTF")
	if err != nil {
		return nil, err
	}
	vals, _, err := options(p.kind, rest, u, []string{"r"}, nil)
	return Channel{H: v[0], B: v[1], TW: v[2], TF: v[3], R: vals["r"]}, err
}

func parseIShape(p *specParser) (Section, error) {
	v, u, rest, err := p.sizes("HxBxTWxTF")
	if err != nil {
		return nil, err
	}
	vals, _, err := options(p.kind, rest, u, []string{"r"}, nil)
	return IShape{H: v[0], B: v[1], TW: v[2], TF: v[3], R: vals["r"]}, err
}

var (
	lumberRE = regexp.MustCompile(`^([0-9]{1,2})x([0-9]{1,2})$`)
	pliesRE  = regexp.MustCompile(`^x([0-9]{1,2})$`)
)

func parseLumber(p *specParser) (Section, error) {
	if len(p.toks) == 0 {
		return nil, errors.New("lumber needs a nominal size in inches, e.g. \"lumber 2x4\"")
	}
	m := lumberRE.FindStringSubmatch(p.toks[0])
	if m == nil {
		if strings.Count(p.toks[0], "x") == 2 {
			return nil, fmt.Errorf("lumber size %q: write plies apart, e.g. \"lumber 2x6 x3\"", p.toks[0])
		}
		return nil, fmt.Errorf("lumber size %q is not a nominal size like 2x4 (whole inches, no unit)", p.toks[0])
	}
	t, _ := strconv.Atoi(m[1])
	w, _ := strconv.Atoi(m[2])
	l := Lumber{Thick: t, Wide: w}
	rest := p.toks[1:]
	if len(rest) > 0 {
		if in := rest[0]; in == "in" || in == "mm" || in == "cm" || in == "m" || in == "ft" {
			return nil, errors.New("lumber sizes are nominal inches and take no unit")
		}
		pm := pliesRE.FindStringSubmatch(rest[0])
		if pm == nil {
			return nil, fmt.Errorf("unexpected %q after the lumber size; plies are written x2, x3, ...", rest[0])
		}
		l.Plies, _ = strconv.Atoi(pm[1])
		if l.Plies == 0 {
			return nil, errors.New("lumber with zero plies")
		}
		rest = rest[1:]
	}
	return l, noOptions(p.kind, rest)
}

func parseBlock(p *specParser) (Section, error) {
	if len(p.toks) == 0 {
		return nil, errors.New("block needs a nominal width (\"block 8in\") or length x width and unit (\"block 390x190 mm\")")
	}
	var b Block
	var rest []string
	var u lengthUnit
	if !strings.Contains(p.toks[0], "x") {
		tok := strings.TrimSuffix(p.toks[0], "in")
		rest = p.toks[1:]
		if tok == p.toks[0] && len(rest) > 0 && rest[0] == "in" {
			rest = rest[1:]
		}
		n, err := strconv.Atoi(tok)
		if err != nil {
			return nil, fmt.Errorf("block nominal width %q should be 4in, 6in, 8in, 10in or 12in", p.toks[0])
		}
		if b, err = NominalBlock(n); err != nil {
			return nil, err
		}
		u, _ = findUnit("in")
	} else {
		v, uu, r, err := p.sizes("LxW")
		if err != nil {
			return nil, err
		}
		u, rest = uu, r
		// Face shell and web defaults for metric and other explicit units:
		// 30 mm and 25 mm (common practice for 190-wide hollow units).
		b = Block{L: v[0], W: v[1], FaceShell: 30e-3, Web: 25e-3}
	}
	var webs []string
	var others []string
	for _, t := range rest {
		if strings.HasPrefix(t, "webs=") {
			webs = append(webs, t)
		} else {
			others = append(others, t)
		}
	}
	vals, flags, err := options(p.kind, others, u, []string{"fs", "web"}, []string{"grouted", "ungrouted"})
	if err != nil {
		return nil, err
	}
	if v, ok := vals["fs"]; ok {
		b.FaceShell = v
	}
	if v, ok := vals["web"]; ok {
		b.Web = v
	}
	if len(webs) > 1 {
		return nil, errors.New("option \"webs=\" given twice")
	}
	if len(webs) == 1 {
		n, err := strconv.Atoi(strings.TrimPrefix(webs[0], "webs="))
		if err != nil || n < 2 || n > maxWebs {
			return nil, fmt.Errorf("option %q: the number of cross webs is a whole number 2…%d", webs[0], maxWebs)
		}
		b.Webs = n
	}
	if flags["grouted"] && flags["ungrouted"] {
		return nil, errors.New("give one of grouted and ungrouted")
	}
	if !flags["grouted"] {
		if p.of != "" || p.with != "" {
			return nil, errors.New("an ungrouted block takes no material here (the member's material applies)")
		}
		return b, nil
	}
	unit, err := lookup(p.of, defaultUnit)
	if err != nil {
		return nil, err
	}
	grout, err := lookup(p.with, defaultGrout)
	if err != nil {
		return nil, err
	}
	return GroutedBlock{Block: b, Unit: unit, Grout: grout}, nil
}

func lookup(name, def string) (materials.Material, error) {
	if name == "" {
		name = def
	}
	m, err := materials.Lookup(name)
	if err != nil {
		return materials.Material{}, err
	}
	return m, nil
}

func parseFilled(p *specParser, info *kindInfo) (Section, error) {
	switch p.kind {
	case "round-tube", "square-tube", "rect-tube", "pipe":
	default:
		return nil, fmt.Errorf("only a tube can be filled (round-tube, square-tube, rect-tube, pipe), not a %s", p.kind)
	}
	if p.with == "" {
		return nil, fmt.Errorf("filled %s needs its fill: \"... with concrete C25/30\" (or mineral casting, sand)", p.kind)
	}
	tube, err := info.parse(p)
	if err != nil {
		return nil, err
	}
	if _, err := tube.Properties(); err != nil {
		return nil, err
	}
	shell, err := lookup(p.of, defaultShellFor(tube))
	if err != nil {
		return nil, err
	}
	fill, err := lookup(p.with, "")
	if err != nil {
		return nil, err
	}
	f := Filled{Tube: tube, Shell: shell, Fill: fill}
	if _, err := f.Parts(); err != nil {
		return nil, err
	}
	return f, nil
}

var schRE = regexp.MustCompile(`^sch[0-9]+$`)

var qtyRE = regexp.MustCompile(`^(.*?)(mm|cm|m|in)(\^?([0-9])|²|⁴)?$`)

// quantity reads a number with its unit of length to the power want
// ("12.3cm2", "150cm^4", "8mm").
func quantity(key, v string, want int) (float64, error) {
	m := qtyRE.FindStringSubmatch(v)
	if m == nil {
		return 0, fmt.Errorf("%s=%s: give a unit, e.g. %s", key, v, map[int]string{1: "12mm", 2: "12.3cm2", 4: "150cm4"}[want])
	}
	pow := 1
	switch {
	case m[3] == "²":
		pow = 2
	case m[3] == "⁴":
		pow = 4
	case m[4] != "":
		pow = int(m[4][0] - '0')
	}
	if pow != want {
		return 0, fmt.Errorf("%s=%s: %s needs a unit of length to the power %d (like %s%d), not %d", key, v, key, want, m[2], want, pow)
	}
	x, err := parseNumber(m[1])
	if err != nil {
		return 0, fmt.Errorf("%s=%s: %v", key, v, err)
	}
	u, _ := findUnit(m[2])
	return u.toSI(x, pow), nil
}

func parseGeneral(p *specParser) (Section, error) {
	var g General
	seen := map[string]bool{}
	fields := []struct {
		key string
		pow int
		dst *float64
	}{{"a", 2, &g.A}, {"iy", 4, &g.Iy}, {"iz", 4, &g.Iz}, {"j", 4, &g.J},
		{"asy", 2, &g.AsY}, {"asz", 2, &g.AsZ}, {"cy", 1, &g.CY}, {"cz", 1, &g.CZ}}
	for _, t := range p.toks {
		k, v, ok := strings.Cut(t, "=")
		if !ok {
			return nil, fmt.Errorf("general expects key=value items (A=, Iy=, Iz=, J=, Asy=, Asz=, cy=, cz=), got %q", t)
		}
		found := false
		for _, f := range fields {
			if f.key != k {
				continue
			}
			if seen[k] {
				return nil, fmt.Errorf("%s= given twice", k)
			}
			x, err := quantity(k, v, f.pow)
			if err != nil {
				return nil, err
			}
			*f.dst, seen[k], found = x, true, true
		}
		if !found {
			return nil, fmt.Errorf("general: unknown item %q (A=, Iy=, Iz=, J=, Asy=, Asz=, cy=, cz=)", k+"=")
		}
	}
	for _, req := range []string{"a", "iy", "iz", "j"} {
		if !seen[req] {
			return nil, fmt.Errorf("general needs A=, Iy=, Iz= and J=; %s= is missing", map[string]string{"a": "A", "iy": "Iy", "iz": "Iz", "j": "J"}[req])
		}
	}
	return g, nil
}
