package modelfile

import (
	"bytes"
	"fmt"
	"io"
	"math"
	"sort"
	"strconv"
	"strings"
	"unicode/utf8"

	"github.com/BurntSushi/toml"
	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet"
)

// File is a model file read (or generated) and built: what it says
// (Contents, with the title, units and dynamics inputs), the model built
// from it, and the handles of its named items.
type File struct {
	Contents
	Name  string           // the file name given to Read, used in messages
	Model *springnet.Model // built from Contents; validated

	// Handles of the model's items by name.
	NodeIDs    map[string]springnet.NodeID
	ElementIDs map[string]springnet.ElementID // members and feet, by the model's name
	GroupIDs   map[string]springnet.GroupID
	MountIDs   map[string]springnet.MountID
	CaseIDs    map[string]springnet.CaseID // load cases and combinations
}

// Read reads a model file (see the package documentation for the format)
// and builds its model. name is used in messages ("stand.toml:42: ...").
//
// Every problem found is reported, joined with errors.Join, each an *Error
// with the file, the line and the item: syntax, unknown keys (with the
// closest known key), wrong units, unknown names (with the closest name),
// and finally the model's own Validate errors mapped back to the line of
// the item they name. A file larger than MaxFileSize or nested deeper than
// MaxNesting, or a model whose analysis would not fit in MemoryBudget
// (see Estimate), is refused before anything is built.
func Read(name string, r io.Reader) (*File, error) {
	data, err := io.ReadAll(io.LimitReader(r, MaxFileSize+1))
	if err != nil {
		return nil, &Error{File: name, Msg: fmt.Sprintf("reading: %v", err)}
	}
	if len(data) > MaxFileSize {
		return nil, &Error{File: name, Msg: fmt.Sprintf("larger than %d MiB; a model file is text written by hand or generated, a few kilobytes to a megabyte", MaxFileSize>>20)}
	}
	c, err := Parse(name, data)
	if err != nil {
		return nil, err
	}
	return build(name, c)
}

// Parse reads the text of a model file into Contents without building
// the model (Read does both). Errors are as for Read.
func Parse(name string, data []byte) (*Contents, error) {
	el := &errList{file: name}
	if len(data) > MaxFileSize {
		el.add(0, "larger than %d MiB", MaxFileSize>>20)
		return nil, el.err()
	}
	if !utf8.Valid(data) {
		line := 1 + bytes.Count(data[:firstInvalid(data)], []byte("\n"))
		el.add(line, "not valid UTF-8 text; save the file as UTF-8")
		return nil, el.err()
	}
	src := string(data)
	pos := scanPositions(src)
	if err := pos.checkNesting(); err != nil {
		el.add(pos.depthAt, "%v", err)
		return nil, el.err()
	}
	var doc map[string]any
	md, err := decodeTOML(src, &doc)
	if err != nil {
		line := 0
		msg := err.Error()
		if pe, ok := err.(toml.ParseError); ok {
			line = pe.Position.Line
			if st := pe.Position.Start; st > 0 && st <= len(data) {
				// Count lines ourselves: an error at a line's end
				// (a missing "]") belongs to that line, not the next.
				line = 1 + bytes.Count(data[:st], []byte("\n"))
			}
			msg = pe.Message
		}
		el.add(line, "syntax: %s", strings.TrimPrefix(msg, "toml: "))
		return nil, el.err()
	}
	rd := &reader{errs: el, pos: pos}
	c := rd.contents(doc, md)
	if err := el.err(); err != nil {
		return nil, err
	}
	return c, nil
}

// decodeTOML runs the TOML decoder, turning a panic inside it (none is
// known; the decoder is fuzzed upstream) into an error, since user input
// must never crash the caller.
func decodeTOML(src string, v any) (md toml.MetaData, err error) {
	defer func() {
		if p := recover(); p != nil {
			err = fmt.Errorf("the TOML decoder failed on this text: %v", p)
		}
	}()
	return toml.Decode(src, v)
}

func firstInvalid(b []byte) int {
	for i := 0; i < len(b); {
		r, n := utf8.DecodeRune(b[i:])
		if r == utf8.RuneError && n <= 1 {
			return i
		}
		i += n
	}
	return len(b)
}

var topKeys = []string{"title", "description", "units", "materials", "sections", "nodes",
	"bar", "beam", "spring", "foot", "support", "rigid-group", "mount", "mass", "case",
	"combination", "speed", "response", "checks"}

func (rd *reader) contents(doc map[string]any, md toml.MetaData) *Contents {
	c := &Contents{}
	top := &tab{r: rd, what: "file", m: doc}
	top.allow(topKeys...)
	c.Title, _ = top.str("title")
	c.Description, _ = top.str("description")

	// Units first: every number depends on them.
	if u, ok := top.sub("units"); ok {
		u.what = "[units]"
		u.path = "units"
		var keys []string
		for q := quantity(1); q < numQuantities; q++ {
			keys = append(keys, quantityInfo[q].key)
		}
		u.allow(keys...)
		for q := quantity(1); q < numQuantities; q++ {
			if s, ok := u.str(quantityInfo[q].key); ok {
				*c.Units.field(q) = s
			}
		}
	}
	sc, errs := c.Units.scales()
	for _, e := range errs {
		rd.errs.add(rd.pos.at("units"), "[%v", e)
	}
	rd.sc = sc

	order := keyOrder(md)
	sections := rd.sections(top)
	rd.materials(top, order, c)
	rd.nodes(top, order, c)
	for _, kind := range []springnet.ElementKind{springnet.BarKind, springnet.BeamKind, springnet.SpringKind} {
		rd.members(top, kind, sections, c)
	}
	rd.mergeMemberOrder(c)
	rd.feet(top, c)
	rd.supports(top, c)
	rd.groups(top, c)
	rd.mounts(top, c)
	rd.masses(top, c)
	rd.cases(top, order, c)
	rd.dynamics(top, c)
	if t, ok := top.sub("checks"); ok {
		t.path, t.what = "checks", "[checks]"
		t.allow("effective-length-basis")
		if b, ok := t.str("effective-length-basis"); ok {
			switch strings.ToLower(b) {
			case "design":
				c.Checks.Basis = springnet.DesignK
			case "theoretical":
				c.Checks.Basis = springnet.TheoreticalK
			default:
				t.errf("effective-length-basis", "must be \"design\" or \"theoretical\", not %q", b)
			}
		}
	}
	return c
}

// effectiveLength reads one factor for both axes, [ky, kz] or { y = , z = }.
func (t *tab) effectiveLength(key string) (springnet.EffectiveLength, bool) {
	bad := func() (springnet.EffectiveLength, bool) {
		t.errf(key, "must be a factor (1.0), two factors [about y, about z] or { y = 0.8, z = 1 }, each positive")
		return springnet.EffectiveLength{}, false
	}
	var k springnet.EffectiveLength
	switch v := t.m[key].(type) {
	case []any:
		if len(v) != 2 {
			return bad()
		}
		y, e1 := t.r.value(v[0], qNone)
		z, e2 := t.r.value(v[1], qNone)
		if e1 != nil || e2 != nil {
			return bad()
		}
		k = springnet.EffectiveLength{Y: y, Z: z}
	case map[string]any:
		sub := &tab{r: t.r, path: t.path + "." + key, what: t.what + ": " + key, m: v}
		sub.allow("y", "z")
		k.Y, _ = sub.num("y", qNone)
		k.Z, _ = sub.num("z", qNone)
	default:
		f, err := t.r.value(v, qNone)
		if err != nil {
			return bad()
		}
		k = springnet.EffectiveLength{Y: f, Z: f}
	}
	if k.Y < 0 || k.Z < 0 || k == (springnet.EffectiveLength{}) {
		return bad()
	}
	return k, true
}

// MemberSettings returns the member-check settings the file gives: the
// effective-length basis of [checks] and the factors of members with an
// "effective-length" (by element handle). It returns nil when the file
// gives none, which the analyses read as defaults.
func (f *File) MemberSettings() *springnet.MemberSettings {
	s := &springnet.MemberSettings{Basis: f.Checks.Basis}
	// Build adds the members first, in order: member i is element i.
	for i, m := range f.Members {
		if m.EffectiveLength == (springnet.EffectiveLength{}) || f.Model == nil || i >= f.Model.NumElements() {
			continue
		}
		if s.K == nil {
			s.K = map[springnet.ElementID]springnet.EffectiveLength{}
		}
		s.K[springnet.ElementID(i)] = m.EffectiveLength
	}
	if s.Basis == springnet.DesignK && s.K == nil {
		return nil
	}
	return s
}

// keyOrder returns, for each table path, its keys in file order.
func keyOrder(md toml.MetaData) map[string][]string {
	out := map[string][]string{}
	for _, k := range md.Keys() {
		if len(k) < 2 {
			continue
		}
		parent := strings.Join(k[:len(k)-1], "\x00")
		out[parent] = append(out[parent], k[len(k)-1])
	}
	return out
}

// arrayOf returns the tables of an array of tables [[key]].
func (rd *reader) arrayOf(top *tab, key string) []*tab {
	v, ok := top.m[key]
	if !ok {
		return nil
	}
	list, ok := v.([]map[string]any)
	if !ok {
		if l2, ok2 := v.([]any); ok2 {
			for _, x := range l2 {
				m, ok := x.(map[string]any)
				if !ok {
					list = nil
					break
				}
				list = append(list, m)
			}
			ok = list != nil || len(l2) == 0
		}
		if !ok {
			top.errf(key, "must be written as tables [[%s]], not %s", key, typeWord(v))
			return nil
		}
	}
	out := make([]*tab, len(list))
	for i, m := range list {
		out[i] = &tab{r: rd, path: key + "#" + strconv.Itoa(i), what: fmt.Sprintf("%s %d", key, i+1), m: m}
	}
	return out
}

// name reads the item's "name" and renames t's messages after it.
func (t *tab) named(kind string) string {
	n, _ := t.str("name")
	if n != "" {
		t.what = fmt.Sprintf("%s %q", kind, n)
	}
	return n
}

func (rd *reader) sections(top *tab) map[string]string {
	out := map[string]string{}
	s, ok := top.sub("sections")
	if !ok {
		return out
	}
	s.path, s.what = "sections", "[sections]"
	for k := range s.m {
		if v, ok := s.str(k); ok {
			out[k] = v
		}
	}
	return out
}

var materialKeys = []string{"from", "family", "E", "G", "poisson", "density", "strength", "compressive-strength", "loss-factor", "mass-only"}

// families lists the material families by their names ("steel",
// "timber", ...), for the "family" key.
func families() map[string]materials.Kind {
	out := map[string]materials.Kind{}
	for k := materials.Other; k <= materials.Fill; k++ {
		out[k.String()] = k
	}
	return out
}

func (rd *reader) materials(top *tab, order map[string][]string, c *Contents) {
	mt, ok := top.sub("materials")
	if !ok {
		return
	}
	for _, name := range order["materials"] {
		sub, ok := mt.sub(name)
		if !ok {
			continue
		}
		sub.path = "materials." + name
		sub.what = fmt.Sprintf("material %q", name)
		sub.allow(materialKeys...)
		def := MaterialDef{Name: name, Line: sub.line("")}
		var m materials.Material
		if from, ok := sub.str("from"); ok {
			base, err := materials.Lookup(from)
			if err != nil {
				sub.errf("from", "%s", strings.TrimPrefix(err.Error(), "materials: "))
				continue
			}
			def.From, m = from, base
		} else if !sub.has("E") || !sub.has("density") {
			sub.errf("", `needs "from" (a catalogue material) or its own "E" and "density"`)
			continue
		}
		if r, ok := sub.rng("E", qStress); ok {
			m.E = r
		}
		if r, ok := sub.rng("G", qStress); ok {
			m.G = r
		}
		for _, f := range []struct {
			k   string
			q   quantity
			dst *float64
		}{{"poisson", qNone, &m.Poisson}, {"density", qDensity, &m.Density},
			{"strength", qStress, &m.Yield}, {"compressive-strength", qStress, &m.Compress}} {
			if v, ok := sub.num(f.k, f.q); ok {
				*f.dst = v
			}
		}
		if r, ok := sub.rng("loss-factor", qNone); ok {
			m.Loss = r
		}
		if b, ok := sub.boolean("mass-only"); ok {
			m.MassOnly = b
		}
		if fam, ok := sub.str("family"); ok {
			fams := families()
			if k, ok := fams[strings.ToLower(fam)]; ok {
				m.Kind = k
			} else {
				var names []string
				for n := range fams {
					names = append(names, n)
				}
				sort.Strings(names)
				sub.errf("family", "unknown family %q%s (families: %s)", fam, suggest(fam, names), strings.Join(names, ", "))
			}
		}
		if len(sub.m) > 1 || def.From == "" {
			m.Name = name
			m.Sources = nil
			cm, err := materials.Custom(m)
			if err != nil {
				sub.errf("", "%s", strings.ReplaceAll(strings.TrimPrefix(err.Error(), "materials: "), "\nmaterials: ", "; "))
				continue
			}
			m = cm
		}
		def.Material = m
		c.Materials = append(c.Materials, def)
	}
}

func (rd *reader) nodes(top *tab, order map[string][]string, c *Contents) {
	nt, ok := top.sub("nodes")
	if !ok {
		return
	}
	nt.path, nt.what = "nodes", "[nodes]"
	for _, name := range order["nodes"] {
		if _, ok := nt.m[name]; !ok {
			continue
		}
		line := nt.line(name)
		at, err := rd.vecValue(nt.m[name], qLength)
		if err != nil {
			rd.errs.add(line, "node %q: %v", name, err)
			continue
		}
		c.Nodes = append(c.Nodes, Node{Name: name, At: at, Line: line})
	}
}

var (
	memberKeys = []string{"name", "ends", "material", "section", "loss-factor",
		"EA", "EIy", "EIz", "GJ", "GAy", "GAz", "mass-per-length", "area", "effective-length"}
	beamKeys   = []string{"up", "roll", "shear-deformation", "release-start", "release-end", "joint-spring-start", "joint-spring-end"}
	springKeys = []string{"name", "ends", "axial", "stiffness", "spread", "loss-factor"}
)

func (rd *reader) members(top *tab, kind springnet.ElementKind, sections map[string]string, c *Contents) {
	key := kind.String()
	for _, t := range rd.arrayOf(top, key) {
		name := t.named(key)
		var m Member
		m.Kind = kind
		m.Line = t.line("")
		switch kind {
		case springnet.SpringKind:
			t.allow(springKeys...)
			if v, ok := t.num("axial", qStiffness); ok {
				m.Axial = v
			}
			if k, ok := t.stiffness6("stiffness"); ok {
				m.K = k
			}
			if r, ok := t.rng("spread", qNone); ok {
				m.Vary = r
			}
		case springnet.BeamKind:
			t.allow(append(append([]string{}, memberKeys...), beamKeys...)...)
		default:
			t.allow(memberKeys...)
		}
		if r, ok := t.rng("loss-factor", qNone); ok {
			m.Loss = r
		}
		if kind != springnet.SpringKind {
			m.Material, _ = t.str("material")
			if s, ok := t.str("section"); ok {
				if named, ok := sections[s]; ok {
					s = named
				}
				m.Section = s
			}
			raw := &m.Raw
			for _, f := range []struct {
				k   string
				q   quantity
				dst *float64
			}{{"EA", qForce, &raw.EA}, {"EIy", qEI, &raw.EIy}, {"EIz", qEI, &raw.EIz}, {"GJ", qEI, &raw.GJ},
				{"GAy", qForce, &raw.GAsY}, {"GAz", qForce, &raw.GAsZ}, {"mass-per-length", qLineMass, &raw.LineMass},
				{"area", qArea, &raw.A}} {
				if v, ok := t.num(f.k, f.q); ok {
					*f.dst = v
				}
			}
			if t.has("effective-length") {
				m.EffectiveLength, _ = t.effectiveLength("effective-length")
			}
			if m.Section != "" && m.Raw != (springnet.RawBeam{}) {
				t.errf("section", "give either a section or raw stiffness (EA, EIy, ...), not both")
			}
			if m.Section == "" && m.Raw == (springnet.RawBeam{}) {
				t.errf("", `needs a "section" (e.g. "square-tube 50x3 mm") or raw stiffness (EA, EIy, EIz, GJ)`)
			}
			if m.Section != "" && m.Material == "" {
				t.errf("", `needs a "material" for its section`)
			}
		}
		if kind == springnet.BeamKind {
			if v, ok := t.vec("up", qNone); ok {
				m.Up = v
			}
			if v, ok := t.num("roll", qAngle); ok {
				m.Roll = v
			}
			if b, ok := t.boolean("shear-deformation"); ok {
				m.Timoshenko = b
			}
			if r, ok := t.release("release-start"); ok {
				m.ReleaseA = r
			}
			if r, ok := t.release("release-end"); ok {
				m.ReleaseB = r
			}
			if v, ok := t.vec("joint-spring-start", qRotStiffness); ok {
				m.JointSpring[0] = v
			}
			if v, ok := t.vec("joint-spring-end", qRotStiffness); ok {
				m.JointSpring[1] = v
			}
		}
		pairs, ok := t.ends()
		if !ok {
			continue
		}
		for i, p := range pairs {
			mm := m
			mm.A, mm.B = p[0], p[1]
			mm.Name = name
			if len(pairs) > 1 && name != "" {
				mm.Name = fmt.Sprintf("%s-%d", name, i+1)
			}
			c.Members = append(c.Members, mm)
		}
	}
}

// ends reads "ends": a pair of node names or a list of pairs.
func (t *tab) ends() ([][2]string, bool) {
	v, ok := t.m["ends"]
	if !ok {
		t.errf("", `needs "ends": its two end nodes ["A1", "B1"], or a list of pairs`)
		return nil, false
	}
	bad := func() ([][2]string, bool) {
		t.errf("ends", `must be two node names ["A1", "B1"] or a list of pairs [["A1", "B1"], ["A2", "B2"]], not %s`, typeWord(v))
		return nil, false
	}
	list, ok := v.([]any)
	if !ok || len(list) == 0 {
		return bad()
	}
	pair := func(x any) ([2]string, bool) {
		l, ok := x.([]any)
		if !ok || len(l) != 2 {
			return [2]string{}, false
		}
		a, ok1 := l[0].(string)
		b, ok2 := l[1].(string)
		return [2]string{a, b}, ok1 && ok2
	}
	if a, ok := list[0].(string); ok {
		if len(list) != 2 {
			return bad()
		}
		b, ok := list[1].(string)
		if !ok {
			return bad()
		}
		return [][2]string{{a, b}}, true
	}
	out := make([][2]string, 0, len(list))
	for _, x := range list {
		p, ok := pair(x)
		if !ok {
			return bad()
		}
		out = append(out, p)
	}
	return out, true
}

// mergeMemberOrder puts the members in file order (bars, beams and
// springs may be interleaved in the file).
func (rd *reader) mergeMemberOrder(c *Contents) {
	// A stable sort by line keeps the expansion order within a table.
	sort.SliceStable(c.Members, func(i, j int) bool { return c.Members[i].Line < c.Members[j].Line })
}

func (rd *reader) feet(top *tab, c *Contents) {
	for _, t := range rd.arrayOf(top, "foot") {
		name := t.named("foot")
		t.allow("name", "at", "stiffness", "compression-only", "spread", "loss-factor")
		f := Foot{Line: t.line("")}
		if !t.require("at", "stiffness") {
			continue
		}
		f.K, _ = t.stiffness6("stiffness")
		f.CompressionOnly, _ = t.boolean("compression-only")
		f.Vary, _ = t.rng("spread", qNone)
		f.Loss, _ = t.rng("loss-factor", qNone)
		at, ok := t.strs("at")
		if !ok {
			continue
		}
		for i, n := range at {
			ff := f
			ff.Node, ff.Name = n, name
			if len(at) > 1 && name != "" {
				ff.Name = fmt.Sprintf("%s-%d", name, i+1)
			}
			c.Feet = append(c.Feet, ff)
		}
	}
}

func (rd *reader) supports(top *tab, c *Contents) {
	for _, t := range rd.arrayOf(top, "support") {
		t.allow("at", "fix")
		if !t.require("at", "fix") {
			continue
		}
		d, ok1 := t.dof("fix")
		at, ok2 := t.strs("at")
		if !ok1 || !ok2 {
			continue
		}
		for _, n := range at {
			c.Supports = append(c.Supports, Support{At: n, Fix: d, Line: t.line("")})
		}
	}
}

func (rd *reader) groups(top *tab, c *Contents) {
	for _, t := range rd.arrayOf(top, "rigid-group") {
		name := t.named("rigid group")
		t.allow("name", "nodes", "reference")
		if !t.require("name", "nodes") {
			continue
		}
		g := RigidGroup{Name: name, Line: t.line("")}
		g.Nodes, _ = t.strs("nodes")
		if v, ok := t.vec("reference", qLength); ok {
			g.Reference = &v
		}
		c.Groups = append(c.Groups, g)
	}
}

func (rd *reader) mounts(top *tab, c *Contents) {
	for _, t := range rd.arrayOf(top, "mount") {
		name := t.named("mount")
		t.allow("name", "on", "at")
		if !t.require("name", "on", "at") {
			continue
		}
		mt := Mount{Name: name, Line: t.line("")}
		mt.On, _ = t.str("on")
		mt.At, _ = t.vec("at", qLength)
		c.Mounts = append(c.Mounts, mt)
	}
}

func (rd *reader) masses(top *tab, c *Contents) {
	for _, t := range rd.arrayOf(top, "mass") {
		name := t.named("mass")
		t.allow("name", "on", "mass", "centre", "offset", "inertia", "box")
		if !t.require("on", "mass") {
			continue
		}
		ms := Mass{Name: name, Line: t.line("")}
		ms.On, _ = t.str("on")
		if v, ok := t.num("mass", qMass); ok {
			if v < 0 {
				t.errf("mass", "must not be negative")
			}
			ms.Kg = v
		}
		if t.has("centre") && t.has("offset") {
			t.errf("offset", `give "centre" (global coordinates) or "offset" (from the point it is on), not both`)
		}
		if v, ok := t.vec("centre", qLength); ok {
			ms.Centre = &v
		}
		if v, ok := t.vec("offset", qLength); ok {
			ms.Offset = v
		}
		if t.has("inertia") && t.has("box") {
			t.errf("box", `give "inertia" or "box", not both`)
		}
		if t.has("inertia") {
			ms.Inertia, ms.Products, _ = t.inertia("inertia")
		}
		if b, ok := t.vec("box", qLength); ok {
			if b.X < 0 || b.Y < 0 || b.Z < 0 {
				t.errf("box", "sizes must not be negative")
			}
			ms.Inertia = BoxInertia(ms.Kg, b)
		}
		c.Masses = append(c.Masses, ms)
	}
}

// BoxInertia returns the moments of inertia about axes through the centre
// of a uniform solid box of mass kg and sizes size (along X, Y, Z) [kg·m²]:
//
//	Ixx = m·(Ly² + Lz²)/12, Iyy = m·(Lx² + Lz²)/12, Izz = m·(Lx² + Ly²)/12
//
// (solid rectangular prism; e.g. Meriam & Kraige, Engineering Mechanics:
// Dynamics, table of mass moments of inertia).
func BoxInertia(kg float64, size springnet.Vec) springnet.Vec {
	x2, y2, z2 := size.X*size.X, size.Y*size.Y, size.Z*size.Z
	return springnet.Vec{X: kg * (y2 + z2) / 12, Y: kg * (x2 + z2) / 12, Z: kg * (x2 + y2) / 12}
}

// inertia reads [Ixx, Iyy, Izz] or a full 3×3 inertia tensor about the
// centre in global axes, as a dynamics text writes it: moments on the
// diagonal, the tensor's own off-diagonal terms J_xy = −∫xy dm (the
// negated products of inertia) off it. It returns the moments and the
// products of inertia P_yz, P_zx, P_xy (springnet.Mass.Products). A
// tensor that is not symmetric is refused; springnet's Validate checks
// that a body can have it.
func (t *tab) inertia(key string) (moments, products springnet.Vec, ok bool) {
	v := t.m[key]
	rows, isList := v.([]any)
	if isList && len(rows) == 3 {
		if _, nested := rows[0].([]any); nested {
			var m [3][3]float64
			for i, r := range rows {
				row, ok := r.([]any)
				if !ok || len(row) != 3 {
					t.errf(key, "a tensor is three rows of three numbers")
					return springnet.Vec{}, springnet.Vec{}, false
				}
				for j, x := range row {
					f, err := t.r.value(x, qInertia)
					if err != nil {
						t.errf(key, "row %d: %v", i+1, err)
						return springnet.Vec{}, springnet.Vec{}, false
					}
					m[i][j] = f
				}
			}
			tol := symmetryTol * (math.Abs(m[0][0]) + math.Abs(m[1][1]) + math.Abs(m[2][2]))
			for i := 0; i < 3; i++ {
				for j := i + 1; j < 3; j++ {
					if math.Abs(m[i][j]-m[j][i]) > tol {
						t.errf(key, "the inertia tensor is not symmetric: row %d column %d is %g, row %d column %d is %g; "+
							"they must be equal (both −∫%s dm)", i+1, j+1, m[i][j], j+1, i+1, m[j][i], axisPair[i+j-1])
						return springnet.Vec{}, springnet.Vec{}, false
					}
				}
			}
			iv := springnet.Vec{X: m[0][0], Y: m[1][1], Z: m[2][2]}
			if iv.X < 0 || iv.Y < 0 || iv.Z < 0 {
				t.errf(key, "moments of inertia must not be negative")
			}
			pv := springnet.Vec{
				X: -(m[1][2] + m[2][1]) / 2,
				Y: -(m[0][2] + m[2][0]) / 2,
				Z: -(m[0][1] + m[1][0]) / 2,
			}
			return iv, pv, true
		}
	}
	iv, ok := t.vec(key, qInertia)
	if ok && (iv.X < 0 || iv.Y < 0 || iv.Z < 0) {
		t.errf(key, "moments of inertia must not be negative")
	}
	return iv, springnet.Vec{}, ok
}

// symmetryTol: the off-diagonal terms of an inertia tensor in a file may
// differ by this fraction of its trace (numbers written to about ten
// figures); more is a mistake, not round-off.
const symmetryTol = 1e-9

// axisPair names the product of the off-diagonal term (i, j), i < j, by
// i+j-1: (1,2) xy, (1,3) xz, (2,3) yz.
var axisPair = [3]string{"xy", "xz", "yz"}

func (rd *reader) cases(top *tab, order map[string][]string, c *Contents) {
	for _, t := range rd.arrayOf(top, "case") {
		name := t.named("case")
		t.allow("name", "gravity", "load")
		if !t.require("name") {
			continue
		}
		lc := Case{Name: name, Line: t.line("")}
		if v, ok := t.m["gravity"]; ok {
			switch g := v.(type) {
			case bool:
				if g {
					lc.Gravity = springnet.Gravity(1)
				}
			case []any:
				lc.Gravity, _ = t.vec("gravity", qAccel)
			default:
				f, err := rd.value(v, qNone)
				if err != nil {
					t.errf("gravity", "must be true, a factor of standard gravity (1.0), or an acceleration vector [0, 0, \"-9.81 m/s2\"]")
				} else {
					lc.Gravity = springnet.Gravity(f)
				}
			}
		}
		for _, lt := range rd.arrayOf(t, "load") {
			lt.path = t.path + "." + lt.path
			lt.what = fmt.Sprintf("case %q: %s", name, lt.what)
			lt.allow("at", "force", "moment")
			if !lt.require("at") {
				continue
			}
			l := Load{Line: lt.line("")}
			l.At, _ = lt.str("at")
			f, _ := lt.vec("force", qForce)
			mo, _ := lt.vec("moment", qMoment)
			l.Load = springnet.Load{FX: f.X, FY: f.Y, FZ: f.Z, MX: mo.X, MY: mo.Y, MZ: mo.Z}
			if !lt.has("force") && !lt.has("moment") {
				lt.errf("", `needs a "force" [fx, fy, fz] or a "moment" [mx, my, mz]`)
			}
			lc.Loads = append(lc.Loads, l)
		}
		c.Cases = append(c.Cases, lc)
	}
	for i, t := range rd.arrayOf(top, "combination") {
		name := t.named("combination")
		t.allow("name", "factors")
		if !t.require("name", "factors") {
			continue
		}
		cb := Combination{Name: name, Line: t.line("")}
		ft, ok := t.sub("factors")
		if !ok {
			continue
		}
		// File order of the terms, from the decoder's key order.
		var keys []string
		for _, k := range order["combination\x00factors"] {
			if _, ok := ft.m[k]; ok && !contains(keys, k) {
				keys = append(keys, k)
			}
		}
		for k := range ft.m {
			if !contains(keys, k) {
				keys = append(keys, k)
			}
		}
		_ = i
		for _, k := range keys {
			if f, ok := ft.num(k, qNone); ok {
				cb.Terms = append(cb.Terms, Term{Case: k, Factor: f})
			}
		}
		if len(cb.Terms) == 0 && len(ft.m) == 0 {
			t.errf("factors", "names no case")
		}
		c.Combos = append(c.Combos, cb)
	}
}

func contains(s []string, x string) bool {
	for _, y := range s {
		if y == x {
			return true
		}
	}
	return false
}

func (rd *reader) dynamics(top *tab, c *Contents) {
	for _, t := range rd.arrayOf(top, "speed") {
		name := t.named("speed")
		t.allow("name", "rpm", "teeth", "flutes", "blades", "harmonics")
		if !t.require("rpm") {
			continue
		}
		sp := Speed{Name: name, Line: t.line("")}
		v := t.m["rpm"]
		switch x := v.(type) {
		case []any:
			if len(x) != 2 {
				t.errf("rpm", "give one speed or a range [lowest, highest]")
				continue
			}
			lo, err1 := rd.value(x[0], qSpeed)
			hi, err2 := rd.value(x[1], qSpeed)
			if err1 != nil || err2 != nil {
				t.errf("rpm", "give one speed or a range [lowest, highest] of numbers (rpm) or texts with a unit (\"40 Hz\")")
				continue
			}
			sp.Low, sp.High = lo, hi
		default:
			f, ok := t.num("rpm", qSpeed)
			if !ok {
				continue
			}
			sp.Low, sp.High = f, f
		}
		if sp.Low <= 0 || sp.High < sp.Low {
			t.errf("rpm", "speeds must be positive, lowest first")
		}
		n := 0
		for _, k := range []string{"teeth", "flutes", "blades"} {
			if x, ok := t.integer(k, 1, 10000); ok {
				if n != 0 {
					t.errf(k, `give one of "teeth", "flutes" or "blades"`)
				}
				n = x
			}
		}
		sp.PerRev = n
		sp.Harmonics, _ = t.integer("harmonics", 1, 100)
		c.Dynamics.Speeds = append(c.Dynamics.Speeds, sp)
	}
	if t, ok := top.sub("response"); ok {
		t.path, t.what = "response", "[response]"
		t.allow("band", "modes")
		if v, ok := t.m["band"]; ok {
			l, ok := v.([]any)
			if !ok || len(l) != 2 {
				t.errf("band", "must be [lowest, highest] frequency")
			} else {
				lo, err1 := rd.value(l[0], qFrequency)
				hi, err2 := rd.value(l[1], qFrequency)
				switch {
				case err1 != nil || err2 != nil:
					t.errf("band", "must be two frequencies (numbers in Hz or texts like \"5 Hz\")")
				case lo < 0 || hi <= lo:
					t.errf("band", "must be [lowest, highest] with 0 <= lowest < highest")
				default:
					c.Dynamics.Band = [2]float64{lo, hi}
				}
			}
		}
		c.Dynamics.Modes, _ = t.integer("modes", 1, 10000)
	}
}
