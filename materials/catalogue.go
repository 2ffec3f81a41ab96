package materials

import (
	"math"
	"strconv"
)

// The built-in catalogue. Every entry is built afresh in Catalogue, so
// callers may change what they get. Each figure names its source; "from
// memory" marks a value recalled rather than checked against the text,
// "common practice" a rule of thumb.

const psi = 6894.757293168 // Pa per lb/in², to 13 figures (exactly 4.4482216152605 N / 0.0254² m²; NIST SP 811)

// Loss factor ranges shared by several entries.
func steelLoss() (Range, Source) {
	return Range{1e-4, 3e-4, 1e-3}, Source{"loss", "Cremer & Heckl, Structure-Borne Sound, table of material loss factors (steel ≈ 1e-4), from memory; " +
		"upper end for hot-rolled sections with mill scale, common practice; joints add far more and are modelled separately"}
}

func aluminiumLoss() (Range, Source) {
	return Range{1e-4, 3e-4, 1e-3}, Source{"loss", "Cremer & Heckl, Structure-Borne Sound, table of material loss factors (aluminium ≈ 1e-4), from memory; common practice"}
}

func woodLoss() (Range, Source) {
	return Range{0.005, 0.01, 0.02}, Source{"loss", "Cremer & Heckl, Structure-Borne Sound, table of material loss factors (wood ≈ 0.008–0.01 along the grain), from memory; rises with moisture"}
}

// steel is a carbon steel grade of yield fy [Pa] with nominal E eNom [Pa].
func steel(name string, fy, eNom, g float64, eSrc, gSrc, ySrc string) Material {
	loss, lossSrc := steelLoss()
	return Material{
		Name:    name,
		Kind:    Steel,
		E:       Range{195 * gpa, eNom, 212 * gpa},
		G:       Range{g * 195 * gpa / eNom, g, g * 212 * gpa / eNom},
		Poisson: 0.3,
		Density: 7850,
		Yield:   fy,
		Loss:    loss,
		Sources: []Source{
			{"E", eSrc},
			{"E range", "195–212 GPa: spread of measured moduli of structural steels, from memory"},
			{"G", gSrc},
			{"Poisson", "ν = 0.3, EN 1993-1-1 3.2.6(1)"},
			{"density", "7850 kg/m³ (490 lb/ft³), EN 1991-1-1 Table A.4 (77–78.5 kN/m³), from memory; common practice"},
			{"yield", ySrc},
			lossSrc,
		},
		Spread: "steel: E barely varies (composition, rolling texture, ±3 %); loss factor: mill scale, residual stress, amplitude",
	}
}

func astmSteel(name string, fy float64, ySrc string) Material {
	return steel(name, fy, 29000e3*psi, 11200e3*psi,
		"AISC 360-16 E = 29 000 ksi (200 GPa), common practice",
		"AISC 360-16 G = 11 200 ksi (77.2 GPa)", ySrc)
}

func enSteel(name string, fy float64, ySrc string) Material {
	return steel(name, fy, 210*gpa, 81*gpa,
		"EN 1993-1-1 3.2.6(1): E = 210 GPa",
		"EN 1993-1-1 3.2.6(1): G ≈ 81 GPa", ySrc)
}

func stainless(name string, fy float64, ySrc string) Material {
	loss, lossSrc := steelLoss()
	return Material{
		Name:    name,
		Kind:    Stainless,
		E:       Range{190 * gpa, 193 * gpa, 200 * gpa},
		Poisson: 0.29,
		Density: 8000,
		Yield:   fy,
		Loss:    loss,
		Sources: []Source{
			{"E", "ASM Handbook Vol. 1, wrought austenitic stainless steels: 193 GPa, from memory; EN 1993-1-4 2.1.3 design value 200 GPa, from memory"},
			{"Poisson", "ASM Handbook Vol. 1: ν ≈ 0.29, from memory"},
			{"density", "ASM Handbook Vol. 1: 8000 kg/m³, from memory"},
			{"yield", ySrc},
			lossSrc,
		},
		Spread: "stainless: cold work raises strength and slightly lowers E; E 190–200 GPa",
	}
}

// grayIron is an ASTM A48 class. eLo, eHi, gLo, gHi [GPa] are the tensile
// and torsional moduli from the ASM table; tensile is the class's minimum
// tensile strength [Pa], compress a typical compressive strength [Pa].
func grayIron(class int, eLo, eHi, gLo, gHi, tensile, compress, density float64, loss Range) Material {
	return Material{
		Name:     "cast iron class " + strconv.Itoa(class),
		Kind:     CastIron,
		E:        Range{eLo * gpa, (eLo + eHi) / 2 * gpa, eHi * gpa},
		G:        Range{gLo * gpa, (gLo + gHi) / 2 * gpa, gHi * gpa},
		Poisson:  0.26,
		Density:  density,
		Yield:    tensile,
		Compress: compress,
		Loss:     loss,
		Sources: []Source{
			{"E", "ASM Handbook Vol. 1, Properties of Gray Iron, typical properties of ASTM A48 test bars (tensile modulus range), from memory; nominal is the middle"},
			{"G", "same ASM table (torsional modulus range), from memory"},
			{"Poisson", "ν ≈ 0.26 for gray iron, ASM Handbook Vol. 1, from memory"},
			{"density", "ASM Handbook Vol. 1: 7050–7350 kg/m³ rising with class, from memory"},
			{"yield", "no yield point: minimum tensile strength of the class, ASTM A48/A48M (class number in ksi); brittle, use a large factor"},
			{"compress", "ASM Handbook Vol. 1 gray iron table, typical compressive strength, from memory"},
			{"loss", "gray iron damps far more than steel, most in low classes with coarse flake graphite; ASM Handbook Vol. 1 damping capacity ranking, values from memory"},
		},
		Spread: "cast iron: graphite flake size and amount, section thickness (cooling rate); E is not linear and falls with stress; " +
			"class 20 ≈ 66–97 GPa, class 60 ≈ 141–162 GPa (ASM, from memory)",
	}
}

func ductileIron(name string, fy, fu, eLo, eNom, eHi float64) Material {
	return Material{
		Name:    name,
		Kind:    CastIron,
		E:       Range{eLo * gpa, eNom * gpa, eHi * gpa},
		Poisson: 0.275,
		Density: 7100,
		Yield:   fy,
		Loss:    Range{5e-4, 1e-3, 3e-3},
		Sources: []Source{
			{"E", "ASM Handbook Vol. 1, Ductile Iron: tensile modulus 162–170 GPa, from memory"},
			{"Poisson", "ASM Handbook Vol. 1, Ductile Iron: ν ≈ 0.275, from memory"},
			{"density", "ASM Handbook Vol. 1: about 7100 kg/m³, from memory"},
			{"yield", "ASTM A536 grade name: minimum tensile-yield-elongation (ksi-ksi-%), e.g. 65-45-12 → yield 45 ksi; tensile " +
				formatMPa(fu)},
			{"loss", "between steel and gray iron (spheroidal graphite), from memory; common practice"},
		},
		Spread: "ductile iron: nodularity and matrix (ferrite/pearlite), section size; E 162–172 GPa",
	}
}

func aluminium(name string, fy float64, ySrc string, density float64) Material {
	loss, lossSrc := aluminiumLoss()
	return Material{
		Name:    name,
		Kind:    Aluminium,
		E:       Range{68 * gpa, 69 * gpa, 71 * gpa},
		G:       Range{25.5 * gpa, 26 * gpa, 27 * gpa},
		Poisson: 0.33,
		Density: density,
		Yield:   fy,
		Loss:    loss,
		Sources: []Source{
			{"E", "ASM Handbook Vol. 2 / Aluminum Association: 68.9 GPa (10 000 ksi) for 6xxx alloys, from memory; EN 1999-1-1 3.2.5: 70 GPa"},
			{"G", "ASM Handbook Vol. 2: 26 GPa, from memory; EN 1999-1-1 3.2.5: 27 GPa"},
			{"Poisson", "ν = 0.33, ASM Handbook Vol. 2, from memory (EN 1999-1-1 uses 0.3)"},
			{"density", "ASM Handbook Vol. 2, from memory"},
			{"yield", ySrc},
			lossSrc,
		},
		Spread: "aluminium: alloy and temper change strength, hardly E (±2 %); loss factor: amplitude, temperature",
	}
}

// timberNDS is graded softwood lumber with NDS Supplement reference
// design values (2x4 to 4x4 sizes), E, Fb, Fc in psi, specific gravity g.
func timberNDS(name string, e, fb, fc, g float64) Material {
	const cov = 0.25 // NDS Appendix F Table F1: COV of E for visually graded sawn lumber
	loss, lossSrc := woodLoss()
	eN := e * psi
	r := Range{eN * (1 - 1.645*cov), eN, eN * (1 + 1.645*cov)}
	return Material{
		Name:     name,
		Kind:     Timber,
		E:        r,
		G:        r.Scale(1.0 / 16),
		Poisson:  0.37,
		Density:  math.Round(1000 * g * 1.12),
		Yield:    fb * psi,
		Compress: fc * psi,
		Loss:     loss,
		Sources: []Source{
			{"E", "NDS Supplement (2018) Table 4A/4B reference E, No.2 grade, from memory"},
			{"E range", "5th to 95th percentile, E(1 ± 1.645·COV) with COV 0.25, NDS Appendix F Table F1 (visually graded sawn lumber)"},
			{"G", "G = E/16, common practice (NDS commentary, EN 338 ratio)"},
			{"Poisson", "ν_LR ≈ 0.37, Wood Handbook FPL-GTR-282 Table 5-2, from memory"},
			{"density", "1000·G·1.12 kg/m³ at 12 % moisture, G from NDS Table 12.3.3A, from memory"},
			{"yield", "reference bending design value Fb (allowable stress, unadjusted), NDS Supplement, from memory"},
			{"compress", "reference compression parallel to grain Fc, NDS Supplement, from memory"},
			lossSrc,
		},
		Spread: "timber: grade (knots, slope of grain), moisture content (E −1–2 % per % MC), species mix; COV of E 0.25 (NDS App. F)",
	}
}

// timberClear is a hardwood with Wood Handbook clear-wood values at 12 %
// moisture: E [GPa], specific gravity g (12 % basis).
func timberClear(name string, e, g float64, ref string) Material {
	const cov = 0.22 // Wood Handbook FPL-GTR-282 Table 5-6: average COV of clear-wood MOE
	loss, lossSrc := woodLoss()
	eN := e * gpa
	r := Range{eN * (1 - 1.645*cov), eN, eN * (1 + 1.645*cov)}
	return Material{
		Name:    name,
		Kind:    Timber,
		E:       r,
		G:       r.Scale(1.0 / 16),
		Poisson: 0.37,
		Density: math.Round(1000 * g * 1.12),
		Loss:    loss,
		Sources: []Source{
			{"E", ref},
			{"E range", "E(1 ± 1.645·COV), COV 0.22, Wood Handbook FPL-GTR-282 Table 5-6, from memory"},
			{"G", "G = E/16, common practice"},
			{"Poisson", "ν_LR ≈ 0.37, Wood Handbook FPL-GTR-282 Table 5-2, from memory"},
			{"density", "1000·SG·1.12 kg/m³ at 12 % moisture (SG from the same table)"},
			{"yield", "not rated: clear-wood strength is no design value; use the grade's design value"},
			lossSrc,
		},
		Spread: "timber: clear wood at 12 % moisture; knots and slope of grain lower E of graded stock, moisture (−1–2 % per % MC); COV 0.22",
	}
}

// Catalogue returns the built-in materials, a fresh copy on every call.
// Names are unique under the forgiving comparison Lookup uses.
func Catalogue() []Material {
	var cat []Material
	add := func(m Material) { cat = append(cat, m) }

	// Structural steels.
	// A500: the lower, round-tube yield of editions before A500-21 is used
	// (shaped tubes: 46 and 50 ksi; A500-21 gives round tubes the shaped value).
	add(astmSteel("steel A500 Gr B", 42e3*psi, "ASTM A500 Grade B: Fy = 42 ksi (290 MPa) round, 46 ksi (315 MPa) shaped (ASTM A500-07 table); later editions give round tubes the shaped value, from memory; the lower value is used"))
	add(astmSteel("steel A500 Gr C", 46e3*psi, "ASTM A500 Grade C: Fy = 46 ksi (315 MPa) round, 50 ksi (345 MPa) shaped (A500-07); A500-21: 50 ksi for all shapes (Steel Tube Institute); the lower value is used"))
	add(astmSteel("steel A36", 36e3*psi, "ASTM A36: Fy = 36 ksi (250 MPa)"))
	add(enSteel("steel S235", 235*mpa, "EN 1993-1-1 Table 3.1: fy = 235 MPa, t <= 40 mm"))
	add(enSteel("steel S355", 355*mpa, "EN 1993-1-1 Table 3.1: fy = 355 MPa, t <= 40 mm"))
	add(stainless("stainless 304", 205*mpa, "ASTM A240 type 304 (1.4301): 0.2 % proof 205 MPa (30 ksi) minimum, from memory"))
	add(stainless("stainless 316", 205*mpa, "ASTM A240 type 316 (1.4401): 0.2 % proof 205 MPa (30 ksi) minimum, from memory"))

	// Gray cast iron, ASTM A48 classes; ASM typical-property table, from memory.
	add(grayIron(20, 66, 97, 27, 39, 20e3*psi, 572*mpa, 7050, Range{0.005, 0.01, 0.02}))
	add(grayIron(30, 90, 113, 36, 45, 30e3*psi, 752*mpa, 7150, Range{0.003, 0.006, 0.012}))
	add(grayIron(40, 110, 138, 44, 54, 40e3*psi, 965*mpa, 7250, Range{0.002, 0.004, 0.008}))
	add(grayIron(60, 141, 162, 54, 59, 60e3*psi, 1293*mpa, 7350, Range{0.001, 0.002, 0.005}))

	// Ductile iron, ASTM A536.
	add(ductileIron("ductile iron 65-45-12", 45e3*psi, 65e3*psi, 162, 169, 172))
	add(ductileIron("ductile iron 80-55-06", 55e3*psi, 80e3*psi, 162, 168, 172))

	// Aluminium alloys.
	add(aluminium("aluminium 6061-T6", 276*mpa, "ASM Handbook Vol. 2 / Aluminum Association typical yield 276 MPa (40 ksi); ASTM B221 minimum 240 MPa (35 ksi), from memory", 2700))
	add(aluminium("aluminium 6063-T5", 110*mpa, "ASTM B221 6063-T5 minimum yield about 110 MPa (16 ksi), from memory; typical 145 MPa", 2690))
	add(aluminium("aluminium 6063-T6", 170*mpa, "ASTM B221 6063-T6 minimum yield 170 MPa (25 ksi), from memory; typical 214 MPa", 2690))
	al5083 := aluminium("aluminium 5083-H111", 125*mpa, "EN 1999-1-1 Table 3.2a, EN AW-5083 O/H111: f0 = 125 MPa, from memory", 2660)
	al5083.E = Range{69 * gpa, 70.3 * gpa, 72 * gpa}
	al5083.Sources[0] = Source{"E", "ASM Handbook Vol. 2: 5083 71 GPa, from memory; EN 1999-1-1 3.2.5: 70 GPa"}
	add(al5083)

	// Concrete by EN 1992-1-1 Table 3.1 classes.
	for _, fck := range []float64{20, 25, 30, 40} {
		m, err := ConcreteEC2(fck * mpa)
		if err != nil {
			panic(err) // a catalogue bug, caught by the tests
		}
		add(m)
	}

	// Grouted masonry, TMS 402 (f'm 2000 psi concrete, 2500 psi clay: common specified values).
	for _, c := range []struct {
		name string
		f    func(float64) (Material, error)
		fm   float64
	}{{"masonry concrete grouted", ConcreteMasonry, 2000 * psi}, {"masonry clay grouted", ClayMasonry, 2500 * psi}} {
		m, err := c.f(c.fm)
		if err != nil {
			panic(err)
		}
		m.Name = c.name
		m.Spread += "; catalogue entry at f'm " + formatMPa(c.fm)
		add(m)
	}

	// Grouts: under base plates and in filled tubes.
	gfg := 2000 * psi // TMS 602 minimum grout strength f'g, from memory
	ge := Range{tmsLowFactor * 500 * gfg, 500 * gfg, tmsHighFactor * 500 * gfg}
	cLoss, cLossSrc := concreteLoss()
	add(Material{
		Name:     "grout masonry",
		Kind:     Concrete,
		E:        ge,
		Poisson:  concretePoisson,
		Density:  2200,
		Compress: gfg,
		Loss:     cLoss,
		Sources: []Source{
			{"E", "TMS 402-16 4.2.2: E_g = 500 f'g, at f'g = 2000 psi (13.8 MPa), from memory"},
			{"E range", "±25 %, trestle's choice as for masonry"},
			{"Poisson", "ν = 0.2, common practice"},
			{"density", "≈ 2200 kg/m³, common practice"},
			{"compress", "f'g = 2000 psi minimum, TMS 602 / ASTM C476, from memory"},
			cLossSrc,
		},
		Spread: "grout: water content, aggregate (fine or coarse grout), absorption by the units; 500 f'g is a low, code-conservative modulus",
	})
	add(Material{
		Name:     "grout cementitious non-shrink",
		Kind:     Concrete,
		E:        Range{20 * gpa, 27 * gpa, 32 * gpa},
		Poisson:  concretePoisson,
		Density:  2250,
		Compress: 5000 * psi,
		Loss:     cLoss,
		Sources: []Source{
			{"E", "non-shrink cementitious machinery grouts, makers' data 20–32 GPa, from memory"},
			{"Poisson", "ν = 0.2, common practice"},
			{"density", "≈ 2200–2300 kg/m³, makers' data, from memory"},
			{"compress", "ASTM C1107: 5000 psi (34.5 MPa) at 28 days minimum, from memory"},
			cLossSrc,
		},
		Spread: "grout: product, water added (flowable vs. fluid consistency), curing; E rises with strength",
	})
	add(Material{
		Name:     "grout epoxy",
		Kind:     MineralCasting,
		E:        Range{8 * gpa, 12 * gpa, 16 * gpa},
		Poisson:  0.3,
		Density:  2050,
		Compress: 90 * mpa,
		Loss:     Range{0.01, 0.03, 0.06},
		Sources: []Source{
			{"E", "epoxy machinery grouts, compressive modulus ≈ 1.2–2.3e6 psi (8–16 GPa), makers' data, from memory"},
			{"Poisson", "≈ 0.3, from memory"},
			{"density", "≈ 2000–2100 kg/m³, makers' data, from memory"},
			{"compress", "≈ 90 MPa (13 000 psi) at 7 days, makers' data, from memory"},
			{"loss", "filled epoxy, from memory; rises with temperature"},
		},
		Spread: "epoxy grout: filler content, temperature (creep and softening above ~40 °C), product",
	})

	add(Material{
		Name:     "epoxy granite",
		Kind:     MineralCasting,
		E:        Range{30 * gpa, 38 * gpa, 45 * gpa},
		Poisson:  0.25,
		Density:  2400,
		Compress: 110 * mpa,
		Yield:    15 * mpa,
		Loss:     Range{0.01, 0.02, 0.03},
		Sources: []Source{
			{"E", "mineral casting (epoxy-bonded aggregate) makers' data and machine-tool texts: 30–45 GPa, from memory"},
			{"Poisson", "≈ 0.25, from memory"},
			{"density", "2300–2500 kg/m³, makers' data, from memory"},
			{"compress", "compressive strength 100–150 MPa, makers' data, from memory (lower end)"},
			{"yield", "flexural/tensile strength ≈ 15–40 MPa, makers' data, from memory (lower end; brittle)"},
			{"loss", "damping several times that of gray iron, makers' data and machine-tool texts, from memory"},
		},
		Spread: "mineral casting: resin fraction (8–15 %), aggregate grading and type, cure temperature; loss factor falls as the resin fraction falls",
	})
	add(Material{
		Name:     "granite",
		Kind:     Stone,
		E:        Range{35 * gpa, 50 * gpa, 70 * gpa},
		Poisson:  0.25,
		Density:  2650,
		Compress: 131 * mpa,
		Yield:    8.27 * mpa,
		Loss:     Range{0.001, 0.003, 0.01},
		Sources: []Source{
			{"E", "granites 35–70 GPa, rock-mechanics tables (e.g. Goodman, Introduction to Rock Mechanics), from memory"},
			{"Poisson", "0.2–0.3, from memory"},
			{"density", "2600–2700 kg/m³; ASTM C615 minimum 2560 kg/m³ (160 lb/ft³), from memory"},
			{"compress", "ASTM C615 minimum compressive strength 131 MPa (19 000 psi), from memory"},
			{"yield", "ASTM C615 minimum flexural strength 8.27 MPa (1200 psi), from memory; brittle"},
			{"loss", "dense igneous rock, from memory; common practice"},
		},
		Spread: "granite: mineralogy, grain size, micro-cracks (black diabase 'granite' for surface plates is stiffer, to ~100 GPa)",
	})

	// Timber parallel to grain.
	add(timberNDS("timber Douglas fir-larch No.2", 1.6e6, 900, 1350, 0.50))
	add(timberNDS("timber southern pine No.2", 1.4e6, 1100, 1450, 0.55))
	add(timberNDS("timber spruce-pine-fir No.2", 1.4e6, 875, 1150, 0.42))
	add(timberClear("timber white oak", 12.3, 0.68, "Wood Handbook FPL-GTR-282 Table 5-3a, white oak at 12 % MC: MOE 12.3 GPa, SG 0.68, from memory"))
	add(timberClear("timber hard maple", 12.6, 0.63, "Wood Handbook FPL-GTR-282 Table 5-3a, sugar maple at 12 % MC: MOE 12.6 GPa, SG 0.63, from memory"))
	add(timberClear("timber red oak", 12.5, 0.63, "Wood Handbook FPL-GTR-282 Table 5-3a, northern red oak at 12 % MC: MOE 12.5 GPa, SG 0.63, from memory"))
	beech := timberClear("timber European beech", 14.0, 0.64, "European beech (Fagus sylvatica) at 12 % MC, about 14 GPa, timber-data tables, from memory")
	beech.Density = 720
	beech.Sources[4] = Source{"density", "about 720 kg/m³ at 12 % MC, from memory"}
	add(beech)
	loss, lossSrc := woodLoss()
	c24 := Range{7.4 * gpa, 11 * gpa, 11 * gpa * (1 + 1.645*0.2)}
	add(Material{
		Name:     "timber C24",
		Kind:     Timber,
		E:        c24,
		G:        Range{c24.Low / 16, 0.69 * gpa, c24.High / 16},
		Poisson:  0.37,
		Density:  420,
		Yield:    24 * mpa,
		Compress: 21 * mpa,
		Loss:     loss,
		Sources: []Source{
			{"E", "EN 338 C24: E0,mean 11.0 GPa, E0,05 7.4 GPa (low), from memory"},
			{"E range", "high end E0,mean(1 + 1.645·0.2), COV 0.2 implied by E0,05/E0,mean in EN 338, our reading"},
			{"G", "EN 338 C24: Gmean 0.69 GPa, from memory"},
			{"Poisson", "ν_LR ≈ 0.37, Wood Handbook FPL-GTR-282 Table 5-2, from memory"},
			{"density", "EN 338 C24: ρmean 420 kg/m³, from memory"},
			{"yield", "EN 338 C24: fm,k 24 MPa characteristic bending strength (apply γM and kmod), from memory"},
			{"compress", "EN 338 C24: fc,0,k 21 MPa, from memory"},
			lossSrc,
		},
		Spread: "timber: strength-graded softwood, moisture content and grade; E0,05 = 0.67 E0,mean (EN 338)",
	})

	// Engineered wood.
	add(Material{
		Name:    "plywood softwood",
		Kind:    EngineeredWood,
		E:       Range{6 * gpa, 8.5 * gpa, 11 * gpa},
		G:       Range{0.4 * gpa, 0.5 * gpa, 0.6 * gpa},
		Poisson: 0.3,
		Density: 540,
		Loss:    Range{0.008, 0.015, 0.03},
		Sources: []Source{
			{"E", "softwood structural plywood, bending parallel to face grain, whole-panel effective E ≈ 6–11 GPa, Wood Handbook FPL-GTR-282 ch. 11 / APA data, from memory"},
			{"G", "panel in-plane shear modulus ≈ 0.5 GPa, from memory"},
			{"Poisson", "≈ 0.3, from memory"},
			{"density", "≈ 500–600 kg/m³, from memory"},
			{"yield", "not rated: use the panel's span-rated capacities"},
			{"loss", "wood and glue lines, from memory; common practice"},
		},
		Spread: "plywood: ply lay-up and direction (E across face grain is half or less), species, moisture",
	})
	add(Material{
		Name:    "plywood birch",
		Kind:    EngineeredWood,
		E:       Range{8 * gpa, 10 * gpa, 12 * gpa},
		G:       Range{0.5 * gpa, 0.62 * gpa, 0.75 * gpa},
		Poisson: 0.3,
		Density: 680,
		Loss:    Range{0.008, 0.015, 0.03},
		Sources: []Source{
			{"E", "birch plywood (all-birch veneers), bending parallel to face grain ≈ 8–12 GPa, makers' handbooks, from memory"},
			{"G", "panel shear ≈ 0.62 GPa, makers' handbooks, from memory"},
			{"Poisson", "≈ 0.3, from memory"},
			{"density", "≈ 650–700 kg/m³, makers' handbooks, from memory"},
			{"yield", "not rated"},
			{"loss", "wood and glue lines, from memory; common practice"},
		},
		Spread: "plywood: number and direction of plies (thin panels differ most), moisture",
	})
	lvl := Range{13.8 * gpa * (1 - 1.645*0.10), 13.8 * gpa, 13.8 * gpa * (1 + 1.645*0.10)}
	add(Material{
		Name:     "LVL 2.0E",
		Kind:     EngineeredWood,
		E:        lvl,
		G:        lvl.Scale(1.0 / 16),
		Poisson:  0.37,
		Density:  580,
		Yield:    2600 * psi,
		Compress: 2500 * psi,
		Loss:     Range{0.005, 0.01, 0.02},
		Sources: []Source{
			{"E", "2.0E grade LVL: E = 2.0e6 psi (13.8 GPa), makers' published design values, from memory"},
			{"E range", "E(1 ± 1.645·0.10), COV 0.10 for structural composite lumber, NDS Appendix F Table F1, from memory"},
			{"G", "G = E/16, common practice (makers quote ≈ E/16)"},
			{"Poisson", "as sawn softwood, from memory"},
			{"density", "≈ 550–620 kg/m³, makers' data, from memory"},
			{"yield", "Fb ≈ 2600 psi (17.9 MPa) allowable, makers' data for 2.0E, from memory"},
			{"compress", "Fc parallel ≈ 2500 psi (17.2 MPa) allowable, makers' data, from memory"},
			{"loss", "as wood, from memory; common practice"},
		},
		Spread: "LVL: veneer grading makes it uniform (COV 0.10); moisture",
	})
	gl := Range{12.4 * gpa * (1 - 1.645*0.10), 12.4 * gpa, 12.4 * gpa * (1 + 1.645*0.10)}
	add(Material{
		Name:     "glulam 24F-1.8E",
		Kind:     EngineeredWood,
		E:        gl,
		G:        gl.Scale(1.0 / 16),
		Poisson:  0.37,
		Density:  530,
		Yield:    2400 * psi,
		Compress: 1600 * psi,
		Loss:     Range{0.005, 0.01, 0.02},
		Sources: []Source{
			{"E", "NDS Supplement Table 5A, 24F-1.8E: Ex = 1.8e6 psi (12.4 GPa), from memory"},
			{"E range", "E(1 ± 1.645·0.10), COV 0.10 for glulam, NDS Appendix F Table F1, from memory"},
			{"G", "G = E/16, common practice"},
			{"Poisson", "as sawn softwood, from memory"},
			{"density", "Douglas fir/southern pine laminations ≈ 500–560 kg/m³, from memory"},
			{"yield", "Fbx+ = 2400 psi (16.5 MPa), NDS Supplement Table 5A, from memory"},
			{"compress", "Fc parallel ≈ 1600 psi (11 MPa), NDS Supplement Table 5A, from memory"},
			{"loss", "as wood, from memory; common practice"},
		},
		Spread: "glulam: lamination grade and layup; COV 0.10",
	})

	// Elastomer pads: E = 3G for a nearly incompressible solid; a pad's
	// compressive stiffness depends on its shape factor, so model a pad as
	// a spring and use these figures only for the bulk material.
	add(Material{
		Name:     "pad neoprene",
		Kind:     Elastomer,
		E:        Range{3 * 0.66 * mpa, 3 * 0.9 * mpa, 3 * 1.38 * mpa},
		G:        Range{0.66 * mpa, 0.9 * mpa, 1.38 * mpa},
		Poisson:  0.49,
		Density:  1300,
		Compress: 5.5 * mpa,
		Loss:     Range{0.1, 0.15, 0.3},
		Sources: []Source{
			{"E", "E = 3G for a nearly incompressible elastomer, common practice"},
			{"G", "AASHTO LRFD Bridge Design Specifications Table 14.7.6.2-1: 50–60 Shore A, G ≈ 0.66–1.38 MPa, from memory"},
			{"Poisson", "≈ 0.49 (nearly incompressible), common practice"},
			{"density", "polychloroprene compounds ≈ 1250–1400 kg/m³, from memory"},
			{"compress", "plain elastomeric pad average compressive stress ≈ 5.5 MPa (0.8 ksi), AASHTO LRFD 14.7.6.3.2, from memory"},
			{"loss", "chloroprene rubber tan δ ≈ 0.1–0.3 at room temperature, Ungar / Nashif, Jones & Henderson, Vibration Damping, from memory"},
		},
		Spread: "elastomer: hardness (Shore A), temperature and frequency (stiffens and damps more when cold or fast), strain amplitude",
	})
	add(Material{
		Name:     "pad natural rubber",
		Kind:     Elastomer,
		E:        Range{3 * 0.4 * mpa, 3 * 0.7 * mpa, 3 * 1.0 * mpa},
		G:        Range{0.4 * mpa, 0.7 * mpa, 1.0 * mpa},
		Poisson:  0.49,
		Density:  1100,
		Compress: 5.5 * mpa,
		Loss:     Range{0.05, 0.1, 0.2},
		Sources: []Source{
			{"E", "E = 3G for a nearly incompressible elastomer, common practice"},
			{"G", "filled natural rubber 40–60 Shore A: G ≈ 0.4–1.0 MPa, from memory"},
			{"Poisson", "≈ 0.49, common practice"},
			{"density", "filled natural rubber ≈ 1000–1150 kg/m³, from memory"},
			{"compress", "as the neoprene pad, AASHTO LRFD 14.7.6.3.2, from memory"},
			{"loss", "natural rubber tan δ ≈ 0.05–0.2, Nashif, Jones & Henderson, Vibration Damping, from memory"},
		},
		Spread: "elastomer: hardness and filler content, temperature, frequency, strain amplitude",
	})

	add(Material{
		Name:     "sand dry",
		Kind:     Fill,
		MassOnly: true,
		Poisson:  0.3,
		Density:  1600,
		Loss:     Range{0.05, 0.1, 0.3},
		Sources: []Source{
			{"E", "none: MassOnly, loose fill adds no stiffness to the member"},
			{"density", "dry sand 1500–1700 kg/m³ (loose to compacted), EN 1991-1-1 Table A.6 (sand, 14–19 kN/m³), from memory"},
			{"Poisson", "unused (MassOnly)"},
			{"loss", "granular fill in hollow members damps by friction; literature on sand-filled tubes, from memory; depends on fill ratio and amplitude"},
		},
		Spread: "sand fill: grading, moisture, compaction; damping depends strongly on vibration amplitude and how full the member is",
	})
	return cat
}

// formatMPa formats a stress [Pa] in MPa for a source note.
func formatMPa(v float64) string { return strconv.FormatFloat(v/mpa, 'g', 4, 64) + " MPa" }
