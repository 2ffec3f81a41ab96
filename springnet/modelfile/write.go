package modelfile

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/springnet"
)

// Write writes f's Contents as a model file that Read reads back to the
// same Contents and the same model. Plain numbers are written in
// f.Units; a value that does not convert back exactly in that unit is
// written as a text with its SI unit ("0.30000000000000004 m"). Write
// writes what f.Contents says: changes made to f.Model after it was built
// are not seen.
func Write(w io.Writer, f *File) error {
	if f == nil {
		return errors.New("modelfile: Write: nil file")
	}
	return WriteContents(w, &f.Contents)
}

// WriteContents writes c as a model file (see Write).
func WriteContents(w io.Writer, c *Contents) error {
	sc, errs := c.Units.scales()
	if len(errs) > 0 {
		return fmt.Errorf("modelfile: Write: %w", errors.Join(errs...))
	}
	// Render first, so that nothing is written when a value is bad.
	var buf bytes.Buffer
	wr := &writer{w: &buf, sc: sc}
	wr.contents(c)
	if wr.bad > 0 {
		return fmt.Errorf("modelfile: Write: %d values are NaN or infinite; a model file holds finite numbers only", wr.bad)
	}
	if _, err := w.Write(buf.Bytes()); err != nil {
		return fmt.Errorf("modelfile: Write: %w", err)
	}
	return nil
}

type writer struct {
	w   *bytes.Buffer
	sc  [numQuantities]scale
	bad int // non-finite values met
}

func (wr *writer) p(format string, args ...any) { fmt.Fprintf(wr.w, format, args...) }

// num formats an SI value in the file's unit for q.
func (wr *writer) num(v float64, q quantity) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		wr.bad++
		return "nan"
	}
	if s, ok := formatIn(v, wr.sc[q]); ok {
		return s
	}
	return quote(strconv.FormatFloat(v, 'g', -1, 64) + " " + quantityInfo[q].si)
}

func (wr *writer) vec(v springnet.Vec, q quantity) string {
	return "[" + wr.num(v.X, q) + ", " + wr.num(v.Y, q) + ", " + wr.num(v.Z, q) + "]"
}

func (wr *writer) rng(r materials.Range, q quantity) string {
	if r.Low == r.Nominal && r.Nominal == r.High {
		return wr.num(r.Nominal, q)
	}
	return "[" + wr.num(r.Low, q) + ", " + wr.num(r.Nominal, q) + ", " + wr.num(r.High, q) + "]"
}

// quote writes a TOML basic string.
func quote(s string) string {
	var b strings.Builder
	b.WriteByte('"')
	for _, r := range s {
		switch {
		case r == '"':
			b.WriteString(`\"`)
		case r == '\\':
			b.WriteString(`\\`)
		case r == '\n':
			b.WriteString(`\n`)
		case r == '\t':
			b.WriteString(`\t`)
		case r < 0x20 || r == 0x7f:
			fmt.Fprintf(&b, `\u%04X`, r)
		default:
			b.WriteRune(r)
		}
	}
	b.WriteByte('"')
	return b.String()
}

// key writes a bare key when it can, else a quoted one.
func key(s string) string {
	if s == "" {
		return `""`
	}
	for _, r := range s {
		if !(r >= 'a' && r <= 'z' || r >= 'A' && r <= 'Z' || r >= '0' && r <= '9' || r == '_' || r == '-') {
			return quote(s)
		}
	}
	return s
}

func quoteList(ss []string) string {
	q := make([]string, len(ss))
	for i, s := range ss {
		q[i] = quote(s)
	}
	return "[" + strings.Join(q, ", ") + "]"
}

func (wr *writer) contents(c *Contents) {
	wr.p("# trestle model file (see the modelfile package documentation for the format)\n")
	if c.Title != "" {
		wr.p("title = %s\n", quote(c.Title))
	}
	if c.Description != "" {
		wr.p("description = %s\n", quote(c.Description))
	}
	var ulines []string
	for q := quantity(1); q < numQuantities; q++ {
		if u := *c.Units.field(q); u != "" {
			ulines = append(ulines, fmt.Sprintf("%s = %s\n", quantityInfo[q].key, quote(u)))
		}
	}
	if len(ulines) > 0 {
		wr.p("\n[units]\n%s", strings.Join(ulines, ""))
	}
	for _, d := range c.Materials {
		wr.material(d)
	}
	if len(c.Nodes) > 0 {
		wr.p("\n[nodes]\n")
		for _, n := range c.Nodes {
			wr.p("%s = %s\n", key(n.Name), wr.vec(n.At, qLength))
		}
	}
	eachTable(c.Members, sameMember, func(m Member) string { return m.Name }, wr.members)
	eachTable(c.Feet, sameFoot, func(f Foot) string { return f.Name }, wr.feet)
	for i := 0; i < len(c.Supports); {
		j := i + 1
		for j < len(c.Supports) && c.Supports[j].Fix == c.Supports[i].Fix {
			j++
		}
		var at []string
		for _, s := range c.Supports[i:j] {
			at = append(at, s.At)
		}
		wr.p("\n[[support]]\nat = %s\nfix = %s\n", quoteList(at), dofText(c.Supports[i].Fix))
		i = j
	}
	for _, g := range c.Groups {
		wr.p("\n[[rigid-group]]\nname = %s\nnodes = %s\n", quote(g.Name), quoteList(g.Nodes))
		if g.Reference != nil {
			wr.p("reference = %s\n", wr.vec(*g.Reference, qLength))
		}
	}
	for _, m := range c.Mounts {
		wr.p("\n[[mount]]\nname = %s\non = %s\nat = %s\n", quote(m.Name), quote(m.On), wr.vec(m.At, qLength))
	}
	for _, m := range c.Masses {
		wr.p("\n[[mass]]\n")
		if m.Name != "" {
			wr.p("name = %s\n", quote(m.Name))
		}
		wr.p("on = %s\nmass = %s\n", quote(m.On), wr.num(m.Kg, qMass))
		if m.Centre != nil {
			wr.p("centre = %s\n", wr.vec(*m.Centre, qLength))
		} else if m.Offset != (springnet.Vec{}) {
			wr.p("offset = %s\n", wr.vec(m.Offset, qLength))
		}
		switch {
		case m.Products != (springnet.Vec{}):
			// The tensor as the reader takes it: −products off the diagonal.
			j := springnet.Mass{Inertia: m.Inertia, Products: m.Products}.Tensor()
			rows := make([]string, 3)
			for i, r := range j {
				// + 0 writes −0 (a zero product negated) as 0.
				rows[i] = wr.vec(springnet.Vec{X: r[0] + 0, Y: r[1] + 0, Z: r[2] + 0}, qInertia)
			}
			wr.p("inertia = [%s]\n", strings.Join(rows, ", "))
		case m.Inertia != (springnet.Vec{}):
			wr.p("inertia = %s\n", wr.vec(m.Inertia, qInertia))
		}
	}
	for _, lc := range c.Cases {
		wr.p("\n[[case]]\nname = %s\n", quote(lc.Name))
		if g := lc.Gravity; g != (springnet.Vec{}) {
			f := -g.Z / springnet.StandardGravity
			switch {
			case g == springnet.Gravity(1):
				wr.p("gravity = true\n")
			case springnet.Gravity(f) == g:
				wr.p("gravity = %s\n", wr.num(f, qNone))
			default:
				wr.p("gravity = %s\n", wr.vec(g, qAccel))
			}
		}
		for _, l := range lc.Loads {
			wr.p("[[case.load]]\nat = %s\n", quote(l.At))
			if f := l.Load.Force(); f != (springnet.Vec{}) || l.Load.Moment() == (springnet.Vec{}) {
				wr.p("force = %s\n", wr.vec(f, qForce))
			}
			if mo := l.Load.Moment(); mo != (springnet.Vec{}) {
				wr.p("moment = %s\n", wr.vec(mo, qMoment))
			}
		}
	}
	for _, cb := range c.Combos {
		var parts []string
		for _, t := range cb.Terms {
			parts = append(parts, key(t.Case)+" = "+wr.num(t.Factor, qNone))
		}
		wr.p("\n[[combination]]\nname = %s\nfactors = { %s }\n", quote(cb.Name), strings.Join(parts, ", "))
	}
	for _, sp := range c.Dynamics.Speeds {
		wr.p("\n[[speed]]\n")
		if sp.Name != "" {
			wr.p("name = %s\n", quote(sp.Name))
		}
		if sp.Low == sp.High {
			wr.p("rpm = %s\n", wr.num(sp.Low, qSpeed))
		} else {
			wr.p("rpm = [%s, %s]\n", wr.num(sp.Low, qSpeed), wr.num(sp.High, qSpeed))
		}
		if sp.PerRev != 0 {
			wr.p("teeth = %d\n", sp.PerRev)
		}
		if sp.Harmonics != 0 {
			wr.p("harmonics = %d\n", sp.Harmonics)
		}
	}
	if c.Checks.Basis != springnet.DesignK {
		wr.p("\n[checks]\neffective-length-basis = %s\n", quote(c.Checks.Basis.String()))
	}
	if d := c.Dynamics; d.Band != [2]float64{} || d.Modes != 0 {
		wr.p("\n[response]\n")
		if d.Band != [2]float64{} {
			wr.p("band = [%s, %s]\n", wr.num(d.Band[0], qFrequency), wr.num(d.Band[1], qFrequency))
		}
		if d.Modes != 0 {
			wr.p("modes = %d\n", d.Modes)
		}
	}
}

func (wr *writer) material(d MaterialDef) {
	wr.p("\n[materials.%s]\n", key(d.Name))
	m := d.Material
	var base materials.Material
	if d.From != "" {
		wr.p("from = %s\n", quote(d.From))
		base, _ = materials.Lookup(d.From)
	}
	n := 0
	line := func(k, v string) { wr.p("%s = %s\n", k, v); n++ }
	differs := m.E != base.E || m.G != base.G || m.Poisson != base.Poisson || m.Density != base.Density ||
		m.Yield != base.Yield || m.Compress != base.Compress || m.Loss != base.Loss || m.MassOnly != base.MassOnly ||
		m.Kind != base.Kind
	if m.Kind != base.Kind {
		line("family", quote(m.Kind.String()))
	}
	if m.E != base.E {
		line("E", wr.rng(m.E, qStress))
	}
	if m.G != base.G {
		line("G", wr.rng(m.G, qStress))
	}
	if m.Poisson != base.Poisson || d.From == "" {
		line("poisson", wr.num(m.Poisson, qNone))
	}
	if m.Density != base.Density || d.From == "" || (!differs && m.Name != base.Name) {
		line("density", wr.num(m.Density, qDensity))
	}
	if m.Yield != base.Yield {
		line("strength", wr.num(m.Yield, qStress))
	}
	if m.Compress != base.Compress {
		line("compressive-strength", wr.num(m.Compress, qStress))
	}
	if m.Loss != base.Loss {
		line("loss-factor", wr.rng(m.Loss, qNone))
	}
	if m.MassOnly != base.MassOnly {
		line("mass-only", strconv.FormatBool(m.MassOnly))
	}
}

// sameMember reports whether b can share a table with a: everything but
// the name and ends equal.
func sameMember(a, b Member) bool {
	a.Name, a.A, a.B, a.Line = "", "", "", 0
	b.Name, b.A, b.B, b.Line = "", "", "", 0
	return a == b
}

func sameFoot(a, b Foot) bool {
	a.Name, a.Node, a.Line = "", "", 0
	b.Name, b.Node, b.Line = "", "", 0
	return a == b
}

// eachTable calls write with each run of items that one table holds:
// consecutive items alike but for their names and places (same), named
// as groupLen allows.
func eachTable[T any](items []T, same func(a, b T) bool, name func(T) string, write func([]T)) {
	for i := 0; i < len(items); {
		j := i + 1
		for j < len(items) && same(items[i], items[j]) {
			j++
		}
		j = i + groupLen(items[i:j], name)
		write(items[i:j])
		i = j
	}
}

// groupLen returns how many of the leading items share one table: all
// unnamed, or named prefix-1, prefix-2, ... (at least two); else one.
func groupLen[T any](items []T, name func(T) string) int {
	if len(items) < 2 {
		return len(items)
	}
	if name(items[0]) == "" {
		n := 1
		for n < len(items) && name(items[n]) == "" {
			n++
		}
		return n
	}
	first := name(items[0])
	prefix, ok := strings.CutSuffix(first, "-1")
	if !ok || prefix == "" {
		return 1
	}
	n := 1
	for n < len(items) && name(items[n]) == fmt.Sprintf("%s-%d", prefix, n+1) {
		n++
	}
	return n
}

func groupName(first string, n int) string {
	if n > 1 && first != "" {
		return strings.TrimSuffix(first, "-1")
	}
	return first
}

func (wr *writer) members(ms []Member) {
	m := ms[0]
	wr.p("\n[[%s]]\n", m.Kind)
	if name := groupName(m.Name, len(ms)); name != "" {
		wr.p("name = %s\n", quote(name))
	}
	if len(ms) == 1 {
		wr.p("ends = [%s, %s]\n", quote(m.A), quote(m.B))
	} else {
		wr.p("ends = [\n")
		for _, x := range ms {
			wr.p("  [%s, %s],\n", quote(x.A), quote(x.B))
		}
		wr.p("]\n")
	}
	if m.Kind == springnet.SpringKind {
		if m.Axial != 0 {
			wr.p("axial = %s\n", wr.num(m.Axial, qStiffness))
		}
		if m.K != (springnet.Stiffness6{}) {
			wr.p("stiffness = %s\n", wr.stiffness6(m.K))
		}
		if m.Vary != (materials.Range{}) {
			wr.p("spread = %s\n", wr.rng(m.Vary, qNone))
		}
	} else {
		if m.Material != "" {
			wr.p("material = %s\n", quote(m.Material))
		}
		if m.Section != "" {
			wr.p("section = %s\n", quote(m.Section))
		}
		r := m.Raw
		for _, f := range []struct {
			k string
			v float64
			q quantity
		}{{"EA", r.EA, qForce}, {"EIy", r.EIy, qEI}, {"EIz", r.EIz, qEI}, {"GJ", r.GJ, qEI},
			{"GAy", r.GAsY, qForce}, {"GAz", r.GAsZ, qForce}, {"mass-per-length", r.LineMass, qLineMass}, {"area", r.A, qArea}} {
			if f.v != 0 {
				wr.p("%s = %s\n", f.k, wr.num(f.v, f.q))
			}
		}
	}
	if k := m.EffectiveLength; k != (springnet.EffectiveLength{}) {
		if k.Y == k.Z {
			wr.p("effective-length = %s\n", wr.num(k.Y, qNone))
		} else {
			wr.p("effective-length = [%s, %s]\n", wr.num(k.Y, qNone), wr.num(k.Z, qNone))
		}
	}
	if m.Kind == springnet.BeamKind {
		if m.Up != (springnet.Vec{}) {
			wr.p("up = %s\n", wr.vec(m.Up, qNone))
		}
		if m.Roll != 0 {
			wr.p("roll = %s\n", wr.num(m.Roll, qAngle))
		}
		if m.Timoshenko {
			wr.p("shear-deformation = true\n")
		}
		if m.ReleaseA != 0 {
			wr.p("release-start = %s\n", releaseText(m.ReleaseA))
		}
		if m.ReleaseB != 0 {
			wr.p("release-end = %s\n", releaseText(m.ReleaseB))
		}
		if m.JointSpring[0] != (springnet.Vec{}) {
			wr.p("joint-spring-start = %s\n", wr.vec(m.JointSpring[0], qRotStiffness))
		}
		if m.JointSpring[1] != (springnet.Vec{}) {
			wr.p("joint-spring-end = %s\n", wr.vec(m.JointSpring[1], qRotStiffness))
		}
	}
	if m.Loss != (materials.Range{}) {
		wr.p("loss-factor = %s\n", wr.rng(m.Loss, qNone))
	}
}

func (wr *writer) feet(fs []Foot) {
	f := fs[0]
	wr.p("\n[[foot]]\n")
	if name := groupName(f.Name, len(fs)); name != "" {
		wr.p("name = %s\n", quote(name))
	}
	var at []string
	for _, x := range fs {
		at = append(at, x.Node)
	}
	if len(at) == 1 {
		wr.p("at = %s\n", quote(at[0]))
	} else {
		wr.p("at = %s\n", quoteList(at))
	}
	wr.p("stiffness = %s\n", wr.stiffness6(f.K))
	if f.CompressionOnly {
		wr.p("compression-only = true\n")
	}
	if f.Vary != (materials.Range{}) {
		wr.p("spread = %s\n", wr.rng(f.Vary, qNone))
	}
	if f.Loss != (materials.Range{}) {
		wr.p("loss-factor = %s\n", wr.rng(f.Loss, qNone))
	}
}

func (wr *writer) stiffness6(k springnet.Stiffness6) string {
	var parts []string
	add := func(name string, v float64, q quantity) {
		if v != 0 {
			parts = append(parts, name+" = "+wr.num(v, q))
		}
	}
	add("x", k.X, qStiffness)
	add("y", k.Y, qStiffness)
	add("z", k.Z, qStiffness)
	add("rx", k.RX, qRotStiffness)
	add("ry", k.RY, qRotStiffness)
	add("rz", k.RZ, qRotStiffness)
	return "{ " + strings.Join(parts, ", ") + " }"
}

func dofText(d springnet.DOF) string {
	switch d {
	case springnet.AllDOF:
		return `"all"`
	case springnet.Translations:
		return `"translations"`
	case springnet.Rotations:
		return `"rotations"`
	}
	var w []string
	for i, n := range []string{"x", "y", "z", "rx", "ry", "rz"} {
		if d&(1<<i) != 0 {
			w = append(w, n)
		}
	}
	return quoteList(w)
}

func releaseText(r springnet.Release) string {
	if r == springnet.ReleasePin {
		return `"pin"`
	}
	var w []string
	for _, x := range []struct {
		r springnet.Release
		n string
	}{{springnet.ReleaseRX, "rx"}, {springnet.ReleaseRY, "ry"}, {springnet.ReleaseRZ, "rz"}} {
		if r&x.r != 0 {
			w = append(w, x.n)
		}
	}
	return quoteList(w)
}
