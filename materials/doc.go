// Package materials holds the engineering properties of the materials a
// machine stand is built from, each known as a range (low, nominal, high)
// and each with its source.
//
// # Model
//
// A Material is linear elastic and, for stiffness, isotropic: Young's
// modulus E, and either a shear modulus G or Poisson's ratio ν (G zero:
// G = E/(2(1+ν))). Timber, plywood and the engineered woods are used along
// the grain and carry their own, much smaller, G. Strength is one figure
// for tension and bending (Yield: the yield stress of metals, the minimum
// tensile strength of gray iron, an allowable or characteristic bending
// stress of timber) and one for compression (Compress: f'c or fck of
// concrete, f'm of masonry, Fc of timber); zero means not rated. Damping
// is the material loss factor η (hysteretic, per cycle η = ΔU/(2π U)); at
// resonance η = 2ζ. A MassOnly material (dry sand fill) adds mass and
// no stiffness.
//
// # Units
//
// SI throughout: Pa for moduli and strengths, kg/m³ for density, loss
// factors and ratios dimensionless. Constructors take strengths in Pa
// too (25e6 for 25 MPa); a value given in MPa by mistake is caught by the
// range checks of the standards.
//
// # Levels and ranges
//
// Each uncertain property is a Range{Low, Nominal, High}. The zero Level
// is Nominal; Levels lists Low, Nominal, High for sweeps. Material.At
// takes every range at the same level; mix levels by reading the ranges.
// The width of a range follows a stated rule, recorded in Sources and
// Spread: the EN 1992-1-1 3.1.3(2) aggregate factors 0.7–1.2 for EC2
// concrete, ACI 318 R19.2.2's 80–120 % for ACI concrete, ±25 % for TMS 402
// masonry (trestle's choice), E(1 ± 1.645·COV) for timber with the COV of
// NDS Appendix F or Wood Handbook Table 5-6, the measured ranges of the
// ASM gray-iron table for cast iron.
//
// # Catalogue and constructors
//
// Catalogue returns the built-in materials (a fresh copy every call) and
// Lookup finds one by a forgiving name ("concrete C25/30", "dry sand",
// "S355"); a miss names the closest entries. ConcreteEC2, ConcreteACI,
// ConcreteACIDensity, ConcreteMasonry and ClayMasonry build a material
// from its specified strength by the code formula; Custom checks a
// user's own. Every figure has a Source naming the standard or handbook
// it came from; "from memory" marks values recalled rather than checked,
// "common practice" rules of thumb.
//
// # Damping conversions
//
// damping.go converts between damping ratio ζ, log decrement δ, loss
// factor η, quality factor Q and specific damping capacity ψ, in exact
// and small-damping forms (FromRatio, FromLogDecrement, FromLossFactor,
// FromQ, FromSpecificCapacity, the Ratio*/Approx* functions).
//
// # Errors
//
// Errors start with "materials: " and name the material or the value at
// fault: `materials: "steel S235": density 0 kg/m³ must be positive and
// finite`. Material.Check reports every problem it finds at once
// (errors.Join). Constructors reject NaN, infinite, non-positive and
// out-of-standard inputs and never return a material that fails Check.
// Nothing here panics on user input.
//
// These figures are for modelling; design to the governing code and defer
// to licensed engineering practice where safety is at stake.
package materials
