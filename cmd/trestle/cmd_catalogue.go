package main

import (
	"fmt"
	"io"
	"strings"

	"github.com/trestle-go/trestle/materials"
	"github.com/trestle-go/trestle/sections"
)

func materialReport(m materials.Material, withSources bool) MaterialReport {
	r := MaterialReport{Name: m.Name, Kind: m.Kind.String(),
		EPa:         [3]float64{m.E.Low, m.E.Nominal, m.E.High},
		DensityKgM3: m.Density, YieldPa: m.Yield, CompressivePa: m.Compress,
		LossFactor: [3]float64{m.Loss.Low, m.Loss.Nominal, m.Loss.High}, Spread: m.Spread}
	if withSources {
		for _, s := range m.Sources {
			r.Sources = append(r.Sources, SourceReport{Figure: s.Figure, Ref: s.Ref})
		}
	}
	return r
}

func runMaterials(e env) error {
	fl := newFlags("materials", "trestle materials [flags] [NAME]",
		`Lists the material catalogue: Young's modulus as low, nominal and high
values, density, strength and damping loss factor. With NAME (found
forgivingly: "S355", "6061 T6 aluminum"), prints that material with the
source of every figure.`,
		"trestle materials\ntrestle materials --units us\ntrestle materials \"concrete C25/30\"", e)
	var of outputFlags
	of.add(fl)
	pos, u, err := fl.parseReport(e.args, 0, maxWords, &of)
	if err != nil {
		return handled(err)
	}
	var list []materials.Material
	if len(pos) > 0 {
		m, err := materials.Lookup(strings.Join(pos, " "))
		if err != nil {
			return err
		}
		list = []materials.Material{m}
	} else {
		list = materials.Catalogue()
	}
	rep := MaterialsReport{Schema: schemaMaterial}
	for _, m := range list {
		rep.Materials = append(rep.Materials, materialReport(m, len(pos) > 0))
	}
	if of.json {
		return writeJSON(e.stdout, rep)
	}
	writeMaterials(e.stdout, rep, u)
	fmt.Fprintf(e.stdout, "\nStrengths are material figures, not design resistances: no resistance or safety factors.\n")
	writeCautions(e.stdout)
	return nil
}

func writeMaterials(w io.Writer, r MaterialsReport, u unitSystem) {
	mo, de, st := u.modulus(), u.density(), u.stress()
	rated := func(v float64) string {
		if v == 0 {
			return "—"
		}
		return st.f(v)
	}
	ratedU := func(v float64) string {
		if v == 0 {
			return "not rated"
		}
		return st.fu(v)
	}
	if len(r.Materials) == 1 {
		m := r.Materials[0]
		fmt.Fprintf(w, "%s (%s)\n\n", m.Name, m.Kind)
		tw := table(w)
		fmt.Fprintf(tw, "  Young's modulus E\t%s – %s – %s %s\t(low – nominal – high)\n", mo.f(m.EPa[0]), mo.f(m.EPa[1]), mo.f(m.EPa[2]), mo.unit)
		fmt.Fprintf(tw, "  density\t%s\t\n", de.fu(m.DensityKgM3))
		fmt.Fprintf(tw, "  yield / tensile strength\t%s\t\n", ratedU(m.YieldPa))
		fmt.Fprintf(tw, "  compressive strength\t%s\t%s\n", ratedU(m.CompressivePa), map[bool]string{true: "(yield used)", false: ""}[m.CompressivePa == 0 && m.YieldPa != 0])
		fmt.Fprintf(tw, "  loss factor η\t%s – %s – %s\t\n", num(m.LossFactor[0]), num(m.LossFactor[1]), num(m.LossFactor[2]))
		tw.Flush()
		if m.Spread != "" {
			fmt.Fprintf(w, "\n  Spread: %s\n", m.Spread)
		}
		if len(m.Sources) > 0 {
			fmt.Fprintf(w, "\n  Sources\n")
			tw = table(w)
			for _, s := range m.Sources {
				fmt.Fprintf(tw, "  %s\t%s\n", s.Figure, s.Ref)
			}
			tw.Flush()
		}
		return
	}
	fmt.Fprintf(w, "Material catalogue (%d materials). E as low – nominal – high; strength — means not rated.\n\n", len(r.Materials))
	tw := table(w)
	fmt.Fprintf(tw, "  name\tkind\tE [%s]\tdensity [%s]\tyield [%s]\tcompressive [%s]\tloss factor η\n", mo.unit, de.unit, st.unit, st.unit)
	for _, m := range r.Materials {
		fmt.Fprintf(tw, "  %s\t%s\t%s – %s – %s\t%s\t%s\t%s\t%s – %s\n", m.Name, m.Kind,
			mo.f(m.EPa[0]), mo.f(m.EPa[1]), mo.f(m.EPa[2]), de.f(m.DensityKgM3), rated(m.YieldPa), rated(m.CompressivePa),
			num(m.LossFactor[0]), num(m.LossFactor[2]))
	}
	tw.Flush()
	fmt.Fprintf(w, "\nUse a name in a model file (material = \"steel S235\"), or run trestle materials NAME for the sources.\n")
}

// maxWords bounds the words of a material name or section spec given
// without quotes (trestle sections square-tube 50x3 mm); they are joined
// with spaces.
const maxWords = 32

func runSections(e env) error {
	fl := newFlags("sections", "trestle sections [flags] [SPEC]",
		`Lists the section shapes with an example spec each. With SPEC (quotes optional),
prints the section's properties: area, second moments, torsion constant,
shear areas, section moduli and radii of gyration.`,
		"trestle sections\ntrestle sections \"square-tube 50x3 mm\"\ntrestle sections --units us \"pipe 2in sch40\"", e)
	var of outputFlags
	of.add(fl)
	pos, u, err := fl.parseReport(e.args, 0, maxWords, &of)
	if err != nil {
		return handled(err)
	}
	if len(pos) == 0 {
		rep := SectionsReport{Schema: schemaSections}
		for _, k := range sections.List() {
			rep.Kinds = append(rep.Kinds, SectionKind{Name: k.Name, Description: k.Description, Example: k.Example})
		}
		if of.json {
			return writeJSON(e.stdout, rep)
		}
		fmt.Fprintf(e.stdout, "Section shapes. Write a spec as in the example; sizes take a unit (mm, cm, m, in, ft).\n\n")
		tw := table(e.stdout)
		fmt.Fprintf(tw, "  shape\texample\twhat it is\n")
		for _, k := range rep.Kinds {
			fmt.Fprintf(tw, "  %s\t%s\t%s\n", k.Name, k.Example, k.Description)
		}
		tw.Flush()
		fmt.Fprintf(e.stdout, "\nRun trestle sections \"SPEC\" for the properties of one section.\n")
		return nil
	}
	sec, err := sections.Parse(strings.Join(pos, " "))
	if err != nil {
		return err
	}
	p, err := sec.Properties()
	if err != nil {
		return err
	}
	rep := SectionReport{Schema: schemaSection, Spec: sections.Spec(sec), AM2: p.A, IyM4: p.Iy, IzM4: p.Iz, IyzM4: p.Iyz,
		JM4: p.J, AsYM2: p.AsY, AsZM2: p.AsZ, SyM3: p.Sy, SzM3: p.Sz, RyM: p.Ry, RzM: p.Rz}
	if c, ok := sec.(sections.Composite); ok {
		parts, err := c.Parts()
		if err != nil {
			return err
		}
		for _, pt := range parts {
			rep.Parts = append(rep.Parts, SectionPart{Material: pt.Material.Name, AM2: pt.A, IyM4: pt.Iy, IzM4: pt.Iz})
		}
	}
	if of.json {
		return writeJSON(e.stdout, rep)
	}
	writeSection(e.stdout, rep, u)
	return nil
}

func writeSection(w io.Writer, r SectionReport, u unitSystem) {
	a, in, sm, l := u.area(), u.inertia(), u.sectionModulus(), u.length()
	fmt.Fprintf(w, "Section %s\n\n", r.Spec)
	tw := table(w)
	fmt.Fprintf(tw, "  area A\t%s\n", a.fu(r.AM2))
	fmt.Fprintf(tw, "  second moment Iy (about y)\t%s\n", in.fu(r.IyM4))
	fmt.Fprintf(tw, "  second moment Iz (about z)\t%s\n", in.fu(r.IzM4))
	if r.IyzM4 != 0 {
		fmt.Fprintf(tw, "  product of area Iyz\t%s\n", in.fu(r.IyzM4))
	}
	fmt.Fprintf(tw, "  torsion constant J\t%s\n", in.fu(r.JM4))
	fmt.Fprintf(tw, "  shear areas Asy, Asz\t%s, %s\n", a.f(r.AsYM2), a.fu(r.AsZM2))
	fmt.Fprintf(tw, "  section moduli Sy, Sz\t%s, %s\n", sm.f(r.SyM3), sm.fu(r.SzM3))
	fmt.Fprintf(tw, "  radii of gyration ry, rz\t%s, %s\n", l.f(r.RyM), l.fu(r.RzM))
	tw.Flush()
	if len(r.Parts) > 0 {
		fmt.Fprintf(w, "\n  Parts (composite section)\n")
		tw = table(w)
		fmt.Fprintf(tw, "  material\tA [%s]\tIy [%s]\tIz [%s]\n", a.unit, in.unit, in.unit)
		for _, p := range r.Parts {
			fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\n", p.Material, a.f(p.AM2), in.f(p.IyM4), in.f(p.IzM4))
		}
		tw.Flush()
	}
}
