package materials

import (
	"fmt"
	"math"
	"strconv"
)

// Constructors for concrete and masonry from their strength, by the code
// formulas, and for a user's own material. Each sets the E range by a
// stated rule and records it in Sources and Spread.

const (
	mpa = 1e6 // Pa per MPa
	gpa = 1e9 // Pa per GPa
)

// EC2 limits and factors.
const (
	ec2MinFck = 12.0 // MPa, lowest class in EN 1992-1-1 Table 3.1 (C12/15)
	ec2MaxFck = 90.0 // MPa, highest class in EN 1992-1-1 Table 3.1 (C90/105)
	// EN 1992-1-1 3.1.3(2): Ecm is for quartzite aggregate; limestone −10 %,
	// sandstone −30 %, basalt +20 %.
	ec2LowFactor  = 0.7
	ec2HighFactor = 1.2
	// Normal-weight concrete, EN 1991-1-1 Table A.1 (24 kN/m³, plain),
	// taken as 2400 kg/m³ (common practice).
	concreteDensity = 2400.0
	// EN 1992-1-1 3.1.3(4): ν = 0.2 for uncracked concrete.
	concretePoisson = 0.2
)

// ACI 318-19 limits and factors.
const (
	aciMinFc = 17.0  // MPa, ACI 318-19 Table 19.2.1.1 minimum f'c (2500 psi), from memory
	aciMaxFc = 100.0 // MPa, trestle's limit: the √f'c fit was made on normal-strength concrete
	aciMinWc = 1440.0
	aciMaxWc = 2560.0 // kg/m³, ACI 318-19 19.2.2.1(a) density range
	// ACI 318-19 R19.2.2: measured Ec scatters from 80 % to 120 % of the
	// computed value (from memory).
	aciLowFactor  = 0.8
	aciHighFactor = 1.2
	// ACI normal-weight density behind 4700√f'c, about 145 lb/ft³ (common practice).
	aciNormalDensity = 2320.0
)

// TMS 402 limits and factors.
const (
	tmsConcreteEm = 900.0 // TMS 402-16 4.2.2: E_m = 900 f'm, concrete masonry
	tmsClayEm     = 700.0 // TMS 402-16 4.2.2: E_m = 700 f'm, clay masonry
	tmsShear      = 0.4   // TMS 402-16 4.2.2: E_v = 0.4 E_m
	tmsMinFm      = 10.3  // MPa (1500 psi), TMS 402-16 9.1.9.1.1, from memory
	tmsMaxFmCMU   = 27.6  // MPa (4000 psi), concrete masonry, TMS 402-16 9.1.9.1.1, from memory
	tmsMaxFmClay  = 41.4  // MPa (6000 psi), clay masonry, TMS 402-16 9.1.9.1.1, from memory
	// trestle's choice: ±25 % about the code value; prism moduli scatter
	// widely about 900 f'm and 700 f'm.
	tmsLowFactor  = 0.75
	tmsHighFactor = 1.25
)

// concreteLoss is the loss factor range used for concrete: dense concrete
// in tables is about 0.005–0.01 (Cremer & Heckl, Structure-Borne Sound,
// material loss factor table, from memory); micro-cracked concrete in
// structures shows more (common practice).
func concreteLoss() (Range, Source) {
	return Range{0.005, 0.015, 0.03}, Source{"loss", "Cremer & Heckl, Structure-Borne Sound, table of material loss factors (dense concrete ≈ 0.005–0.01), from memory; upper end for micro-cracked concrete, common practice"}
}

// masonryLoss is the loss factor range used for grouted masonry.
func masonryLoss() (Range, Source) {
	return Range{0.01, 0.02, 0.04}, Source{"loss", "Cremer & Heckl, Structure-Borne Sound, table of material loss factors (brick ≈ 0.01–0.02), from memory; common practice for grouted walls"}
}

// checkStrength reports whether v [MPa] is finite, positive and in [lo, hi].
func checkStrength(what string, v, lo, hi float64, rule string) error {
	switch {
	case math.IsNaN(v) || math.IsInf(v, 0):
		return fmt.Errorf("materials: %s %g MPa is not a finite number", what, v)
	case v <= 0:
		return fmt.Errorf("materials: %s %g MPa must be positive", what, v)
	case v < lo || v > hi:
		return fmt.Errorf("materials: %s %g MPa is outside %g–%g MPa (%s)", what, v, lo, hi, rule)
	}
	return nil
}

// ec2Classes maps fck [MPa] to the cube strength of the EN 1992-1-1
// Table 3.1 class, for naming.
func ec2CubeStrength(fck float64) (float64, bool) {
	classes := [][2]float64{{12, 15}, {16, 20}, {20, 25}, {25, 30}, {30, 37}, {35, 45}, {40, 50},
		{45, 55}, {50, 60}, {55, 67}, {60, 75}, {70, 85}, {80, 95}, {90, 105}}
	for _, c := range classes {
		if c[0] == fck {
			return c[1], true
		}
	}
	return 0, false
}

// EC2SecantModulus returns the mean secant modulus of normal-weight
// concrete of characteristic cylinder strength fck [Pa] (quartzite
// aggregate), Eurocode 2 EN 1992-1-1 Table 3.1:
//
//	Ecm = 22 · (fcm/10)^0.3 GPa,  fcm = fck + 8 MPa   (strengths in MPa)
//
// It does not check fck; ConcreteEC2 does.
func EC2SecantModulus(fck float64) float64 {
	fcm := fck/mpa + 8
	return 22 * math.Pow(fcm/10, 0.3) * gpa
}

// ConcreteEC2 returns normal-weight concrete of characteristic cylinder
// strength fck [Pa] by Eurocode 2 (EN 1992-1-1 Table 3.1). E.Nominal is
// Ecm = 22·(fcm/10)^0.3 GPa with fcm = fck + 8 MPa, for quartzite
// aggregate; E.Low and E.High are 0.7·Ecm and 1.2·Ecm, the aggregate
// factors of EN 1992-1-1 3.1.3(2) (sandstone −30 %, basalt +20 %).
// Compress is fck; Yield is 0 (tension not rated). Density 2400 kg/m³,
// ν = 0.2.
//
// It fails unless 12 MPa <= fck <= 90 MPa, the classes of Table 3.1.
func ConcreteEC2(fck float64) (Material, error) {
	f := fck / mpa
	if err := checkStrength("EC2 concrete fck", f, ec2MinFck, ec2MaxFck, "EN 1992-1-1 Table 3.1 classes C12/15 to C90/105"); err != nil {
		return Material{}, err
	}
	ecm := EC2SecantModulus(fck)
	name := "concrete fck " + strconv.FormatFloat(f, 'g', 4, 64) + " MPa (EC2)"
	if cube, ok := ec2CubeStrength(f); ok {
		name = fmt.Sprintf("concrete C%g/%g", f, cube)
	}
	loss, lossSrc := concreteLoss()
	return Material{
		Name:     name,
		Kind:     Concrete,
		E:        Range{ec2LowFactor * ecm, ecm, ec2HighFactor * ecm},
		Poisson:  concretePoisson,
		Density:  concreteDensity,
		Compress: fck,
		Loss:     loss,
		Sources: []Source{
			{"E", "Eurocode 2 EN 1992-1-1 Table 3.1: Ecm = 22 (fcm/10)^0.3 GPa, fcm = fck + 8 MPa"},
			{"E range", "EN 1992-1-1 3.1.3(2): aggregate factors 0.7 (sandstone) to 1.2 (basalt)"},
			{"Poisson", "EN 1992-1-1 3.1.3(4): ν = 0.2 uncracked"},
			{"density", "EN 1991-1-1 Table A.1 (24 kN/m³ plain normal-weight concrete), from memory; 2400 kg/m³ common practice"},
			{"compress", "fck, EN 1992-1-1 Table 3.1"},
			lossSrc,
		},
		Spread: "concrete: aggregate type (EC2 3.1.3(2): limestone −10 %, sandstone −30 %, basalt +20 %), " +
			"moisture and age; Ecm is a secant modulus at 0.4 fcm, the small-strain dynamic modulus is " +
			"higher (about +20 %, common practice); loss factor: cracking and moisture",
	}, nil
}

// ConcreteACI returns normal-weight concrete of specified compressive
// strength fc (f'c) [Pa] by ACI 318-19 19.2.2.1(b):
//
//	Ec = 4700 √f'c  MPa   (57 000 √f'c psi)
//
// E.Low and E.High are 0.8·Ec and 1.2·Ec, the scatter of measured values
// about the formula that ACI 318-19 R19.2.2 states (from memory). Density
// 2320 kg/m³ (145 lb/ft³), ν = 0.2, Compress f'c.
//
// It fails unless 17 MPa <= f'c <= 100 MPa (the lower bound is ACI 318-19
// Table 19.2.1.1; the upper is trestle's, since the √f'c fit is for
// normal-strength concrete).
func ConcreteACI(fc float64) (Material, error) {
	f := fc / mpa
	if err := checkStrength("ACI concrete f'c", f, aciMinFc, aciMaxFc, "ACI 318-19 Table 19.2.1.1 minimum; trestle's upper limit"); err != nil {
		return Material{}, err
	}
	ec := 4700 * math.Sqrt(f) * mpa
	return aciConcrete(fmt.Sprintf("concrete f'c %.4g MPa (ACI)", f), fc, ec, aciNormalDensity,
		Source{"E", "ACI 318-19 19.2.2.1(b): Ec = 4700 √f'c MPa, normal-weight concrete"},
		Source{"density", "about 145 lb/ft³ normal-weight concrete, common practice"}), nil
}

// ConcreteACIDensity returns concrete of specified compressive strength
// fc (f'c) [Pa] and density wc [kg/m³] by ACI 318-19 19.2.2.1(a):
//
//	Ec = wc^1.5 · 0.043 √f'c  MPa   (wc in kg/m³, f'c in MPa)
//
// with the same 0.8–1.2 range as ConcreteACI. It fails unless
// 17 MPa <= f'c <= 100 MPa and 1440 <= wc <= 2560 kg/m³ (the range of
// 19.2.2.1(a)).
func ConcreteACIDensity(fc, wc float64) (Material, error) {
	f := fc / mpa
	if err := checkStrength("ACI concrete f'c", f, aciMinFc, aciMaxFc, "ACI 318-19 Table 19.2.1.1 minimum; trestle's upper limit"); err != nil {
		return Material{}, err
	}
	if math.IsNaN(wc) || math.IsInf(wc, 0) || wc < aciMinWc || wc > aciMaxWc {
		return Material{}, fmt.Errorf("materials: ACI concrete density %g kg/m³ is outside %g–%g kg/m³ (ACI 318-19 19.2.2.1(a))", wc, aciMinWc, aciMaxWc)
	}
	ec := math.Pow(wc, 1.5) * 0.043 * math.Sqrt(f) * mpa
	return aciConcrete(fmt.Sprintf("concrete f'c %.4g MPa wc %.4g kg/m³ (ACI)", f, wc), fc, ec, wc,
		Source{"E", "ACI 318-19 19.2.2.1(a): Ec = wc^1.5 · 0.043 √f'c MPa"},
		Source{"density", "given (wc)"}), nil
}

func aciConcrete(name string, fc, ec, wc float64, eSrc, dSrc Source) Material {
	loss, lossSrc := concreteLoss()
	return Material{
		Name:     name,
		Kind:     Concrete,
		E:        Range{aciLowFactor * ec, ec, aciHighFactor * ec},
		Poisson:  concretePoisson,
		Density:  wc,
		Compress: fc,
		Loss:     loss,
		Sources: []Source{
			eSrc,
			{"E range", "ACI 318-19 R19.2.2: measured Ec 80 % to 120 % of the computed value, from memory"},
			{"Poisson", "ν = 0.2, common practice (EN 1992-1-1 3.1.3(4))"},
			dSrc,
			{"compress", "f'c as given"},
			lossSrc,
		},
		Spread: "concrete: aggregate stiffness and content, moisture, age (ACI 318-19 R19.2.2: ±20 % about the formula); loss factor: cracking and moisture",
	}
}

// ConcreteMasonry returns grouted concrete masonry of specified
// compressive strength fm (f'm) [Pa] by TMS 402-16 4.2.2:
//
//	E_m = 900 f'm,   E_v = 0.4 E_m (shear)
//
// The E range is ±25 % (trestle's choice; masonry prism moduli scatter
// widely). It fails unless 10.3 MPa <= f'm <= 27.6 MPa (1500–4000 psi,
// TMS 402-16 9.1.9.1.1, from memory).
func ConcreteMasonry(fm float64) (Material, error) {
	return masonry("concrete", fm, tmsConcreteEm, tmsMaxFmCMU, 2100,
		Source{"density", "fully grouted normal-weight concrete masonry about 2000–2200 kg/m³ (NCMA TEK 14-13 wall weights), from memory"})
}

// ClayMasonry returns grouted clay masonry of specified compressive
// strength fm (f'm) [Pa] by TMS 402-16 4.2.2: E_m = 700 f'm, E_v = 0.4 E_m,
// with the same ±25 % range as ConcreteMasonry. It fails unless
// 10.3 MPa <= f'm <= 41.4 MPa (1500–6000 psi, TMS 402-16 9.1.9.1.1, from
// memory).
func ClayMasonry(fm float64) (Material, error) {
	return masonry("clay", fm, tmsClayEm, tmsMaxFmClay, 1950,
		Source{"density", "grouted solid clay brick masonry about 1900–2000 kg/m³, from memory"})
}

func masonry(unit string, fm, factor, maxFm, density float64, dSrc Source) (Material, error) {
	f := fm / mpa
	if err := checkStrength(unit+" masonry f'm", f, tmsMinFm, maxFm, "TMS 402-16 9.1.9.1.1, from memory"); err != nil {
		return Material{}, err
	}
	em := factor * fm
	e := Range{tmsLowFactor * em, em, tmsHighFactor * em}
	loss, lossSrc := masonryLoss()
	return Material{
		Name:     fmt.Sprintf("masonry %s grouted f'm %.4g MPa", unit, f),
		Kind:     Masonry,
		E:        e,
		G:        e.Scale(tmsShear),
		Poisson:  0.25, // consistent with E_v = 0.4 E_m: E/(2G) − 1
		Density:  density,
		Compress: fm,
		Loss:     loss,
		Sources: []Source{
			{"E", fmt.Sprintf("TMS 402-16 4.2.2: E_m = %g f'm, %s masonry", factor, unit)},
			{"E range", "±25 %, trestle's choice (masonry prism moduli scatter widely)"},
			{"G", "TMS 402-16 4.2.2: E_v = 0.4 E_m"},
			dSrc,
			{"compress", "f'm as given (TMS 402 prism strength)"},
			lossSrc,
		},
		Spread: "masonry: unit strength and grout, mortar type, workmanship, moisture; prism tests scatter widely about E_m = " +
			fmt.Sprintf("%g f'm", factor),
	}, nil
}

// Custom checks a user's own material and returns a copy of it, with its
// Sources slice copied and, when it has none, a single "all: user
// supplied" source. It fails with Check's error.
func Custom(m Material) (Material, error) {
	if err := m.Check(); err != nil {
		return Material{}, err
	}
	src := append([]Source(nil), m.Sources...)
	if len(src) == 0 {
		src = []Source{{"all", "user supplied"}}
	}
	m.Sources = src
	return m, nil
}
