package main

// JSON reports. Every report carries a "schema" field naming its kind and
// version; numbers are SI base units whatever --units says, and field
// names carry the unit. SCHEMA.md documents each field. A change that
// removes or renames a field, or changes its meaning, bumps the version.

// Schema versions of the JSON reports.
const (
	schemaAnalysis = "trestle.analysis/1"
	schemaRanges   = "trestle.ranges/1"
	schemaCompare  = "trestle.compare/1"
	schemaRingdown = "trestle.ringdown/1"
	schemaMaterial = "trestle.materials/1"
	schemaSections = "trestle.sections/1"
	schemaSection  = "trestle.section/1"
	schemaModes    = "trestle.modes/1"
	schemaResponse = "trestle.response/1"
)

// AnalysisReport is the JSON form of `trestle analyse` and `trestle demo`.
type AnalysisReport struct {
	Schema    string           `json:"schema"`
	Model     string           `json:"model"`
	Level     string           `json:"level"` // material level: low, nominal or high
	Summary   ModelSummary     `json:"summary"`
	Governing Governing        `json:"governing"`
	Warnings  []string         `json:"warnings"`
	Mounts    []MountStiffness `json:"mounts"`
	Cases     []CaseReport     `json:"cases"`
	Buckling  []BucklingReport `json:"buckling"`
	Modes     *ModesReport     `json:"modes,omitempty"`
	Pending   []string         `json:"pending"` // analyses this build cannot run yet
	Cautions  []string         `json:"cautions"`
}

// ModelSummary counts what the model holds.
type ModelSummary struct {
	Nodes         int     `json:"nodes"`
	Bars          int     `json:"bars"`
	Beams         int     `json:"beams"`
	Springs       int     `json:"springs"`
	Feet          int     `json:"feet"`
	Groups        int     `json:"rigid_groups"`
	Mounts        int     `json:"mounts"`
	Cases         int     `json:"cases"`
	FloorLoadN    float64 `json:"floor_load_n"`    // vertical reaction of floor and supports in FloorLoadCase; 0 if none
	FloorLoadCase string  `json:"floor_load_case"` // the first plain load case with a vertical reaction
}

// Governing holds the numbers a designer reads first. Optional numbers are
// null when the analysis is not available or does not apply.
type Governing struct {
	SoftestMount          string     `json:"softest_mount"`
	SoftestStiffnessNPerM float64    `json:"softest_stiffness_n_per_m"`
	SoftestDirection      [3]float64 `json:"softest_direction"` // unit vector, global X, Y, Z
	FirstFrequencyHz      *float64   `json:"first_frequency_hz"`
	MaxUtilisation        float64    `json:"max_utilisation"`
	MaxUtilisationMember  string     `json:"max_utilisation_member"`
	MaxUtilisationCase    string     `json:"max_utilisation_case"`
	BucklingFactor        *float64   `json:"buckling_factor"` // lowest whole-frame load factor over the cases; null if none found
	BucklingCase          string     `json:"buckling_case,omitempty"`
	EulerMargin           *float64   `json:"euler_margin"` // lowest member Euler margin; null if no rated member is in compression
	EulerMember           string     `json:"euler_member,omitempty"`
	EulerCase             string     `json:"euler_case,omitempty"`
	MaxDisplacementM      float64    `json:"max_displacement_m"`
	MaxDisplacementNode   string     `json:"max_displacement_node"`
	MaxDisplacementCase   string     `json:"max_displacement_case"`
	LiftedFeet            []string   `json:"lifted_feet"`    // "foot (case)"
	HeldFeet              []string   `json:"held_feet"`      // lifted feet still held sideways: "foot (case)", also in lifted_feet
	UpliftFeet            []string   `json:"uplift_feet"`    // bolted feet in tension: "foot (case)"
	TippingFactor         *float64   `json:"tipping_factor"` // smallest over cases; null if no case can tip
	TippingCase           string     `json:"tipping_case,omitempty"`
	TippedCases           []string   `json:"tipped_cases,omitempty"` // cases under which the stand tips over
}

// MountStiffness is the static stiffness felt at one mount (or rigid
// group, or node) with its rotation free.
type MountStiffness struct {
	Name               string        `json:"name"`
	XNPerM             float64       `json:"x_n_per_m"` // along global X
	YNPerM             float64       `json:"y_n_per_m"`
	ZNPerM             float64       `json:"z_n_per_m"`
	PrincipalNPerM     [3]float64    `json:"principal_n_per_m"`   // ascending
	PrincipalDirection [3][3]float64 `json:"principal_direction"` // unit vectors, one per principal stiffness
	SoftestTied        bool          `json:"softest_tied"`        // the two softest principal stiffnesses are equal: any direction in their plane is as soft
}

// CaseReport holds the static results of one load case or combination.
type CaseReport struct {
	Name                 string            `json:"name"`
	Combination          bool              `json:"combination"`
	MaxDisplacementM     float64           `json:"max_displacement_m"`
	MaxDisplacementNode  string            `json:"max_displacement_node"`
	MaxUtilisation       float64           `json:"max_utilisation"`
	MaxUtilisationMember string            `json:"max_utilisation_member"`
	EulerMargin          float64           `json:"euler_margin"` // lowest member Euler margin in this case; 0 when none
	EulerMember          string            `json:"euler_member"`
	Feet                 []FootReport      `json:"feet"`
	Supports             []SupportReport   `json:"supports"`
	Members              []MemberReport    `json:"members"`
	Mounts               []MountMotion     `json:"mounts"`
	Equilibrium          EquilibriumReport `json:"equilibrium"`
	Residual             float64           `json:"residual"` // relative ‖K·u − f‖/‖f‖
	Tipping              TippingReport     `json:"tipping"`
	// Tipped: the stand tips under this case (no stable set of feet
	// stays in contact); it has no displacements, forces or reactions,
	// TippedLifted names the feet lifted when it lost its last stable
	// set and Tipping.Factor (at most 1) is where it tips. Absent: false.
	Tipped       bool     `json:"tipped,omitempty"`
	TippedLifted []string `json:"tipped_lifted,omitempty"`
}

// FootReport is the reaction at one foot: the force the floor exerts on
// the stand (FZ positive when the foot presses on the floor).
type FootReport struct {
	Name   string  `json:"name"`
	Node   string  `json:"node"`
	FXN    float64 `json:"fx_n"`
	FYN    float64 `json:"fy_n"`
	FZN    float64 `json:"fz_n"`
	Share  float64 `json:"share"`  // FZ over the sum of FZ of all feet
	Uplift bool    `json:"uplift"` // the foot pulls the stand down (needs an anchor)
	Lifted bool    `json:"lifted"` // a loose foot out of contact
	// Held marks a lifted foot at the point of lifting that friction still
	// holds sideways: its fz_n is 0 but fx_n and fy_n carry the sideways
	// force (springnet.FootResult.Held). Held implies Lifted.
	Held bool `json:"held"`
}

// SupportReport is the reaction at a fixed node (a rigid support).
type SupportReport struct {
	Node string  `json:"node"`
	FXN  float64 `json:"fx_n"`
	FYN  float64 `json:"fy_n"`
	FZN  float64 `json:"fz_n"`
	MXNm float64 `json:"mx_nm"`
	MYNm float64 `json:"my_nm"`
	MZNm float64 `json:"mz_nm"`
}

// MemberReport is the force state of one bar, beam or spring.
type MemberReport struct {
	Name          string  `json:"name"`
	Kind          string  `json:"kind"`           // bar, beam, spring
	AxialN        float64 `json:"axial_n"`        // at end a, tension positive
	MaxMomentNm   float64 `json:"max_moment_nm"`  // largest bending moment at the ends, √(My² + Mz²)
	TensionPa     float64 `json:"tension_pa"`     // largest tensile fibre stress (≥ 0); 0 when not computed
	CompressionPa float64 `json:"compression_pa"` // largest compressive fibre stress as a magnitude (≥ 0)
	Utilisation   float64 `json:"utilisation"`    // fibre stress over strength; 0 when not rated
	Rated         bool    `json:"rated"`          // a utilisation was computed
	Governs       string  `json:"governs"`        // "tension", "compression" or ""
	EulerMargin   float64 `json:"euler_margin"`   // member Euler load over its compression; 0 when not in compression or not rated
	EulerK        float64 `json:"euler_k"`        // effective-length factor of the weaker axis; 0 when none
}

// MountMotion is the displacement of a mount in one case.
type MountMotion struct {
	Name string  `json:"name"`
	UXM  float64 `json:"ux_m"`
	UYM  float64 `json:"uy_m"`
	UZM  float64 `json:"uz_m"`
}

// EquilibriumReport compares applied loads and reactions.
type EquilibriumReport struct {
	AppliedN    [3]float64 `json:"applied_n"`
	ReactionsN  [3]float64 `json:"reactions_n"`
	ForceError  float64    `json:"force_error"`  // relative
	MomentError float64    `json:"moment_error"` // relative
}

// TippingReport is the tipping margin of a case on loose feet.
type TippingReport struct {
	Found    bool    `json:"found"`  // some factor on the non-gravity loads tips the stand
	Factor   float64 `json:"factor"` // that factor; 0 when not found
	LastFoot string  `json:"last_foot,omitempty"`
	Note     string  `json:"note,omitempty"` // why no factor was found, when the path stopped without an answer
}

// BucklingReport holds the lowest whole-frame buckling load factors of
// one load case: the factors on all of the case's loads (self-weight
// included) at which the stand buckles.
type BucklingReport struct {
	Case    string    `json:"case"`
	Factors []float64 `json:"factors"` // ascending; empty when none is positive
	Note    string    `json:"note,omitempty"`
}

// ModesReport holds natural frequencies, modal damping and the check of
// the machine's running speeds.
type ModesReport struct {
	Modes        []ModeReport      `json:"modes"`
	SturmCount   int               `json:"sturm_count"` // eigenvalues below SturmBelowHz by the Sturm count; -1 when not checked
	SturmBelowHz float64           `json:"sturm_below_hz"`
	TotalMassKg  [3]float64        `json:"total_mass_kg"` // mass moving with a rigid translation along X, Y, Z
	Resonances   []ResonanceReport `json:"resonances"`    // natural frequencies near an excitation band
	Speeds       []string          `json:"speeds"`        // the running speeds checked, as read
}

// ModeReport is one natural mode.
type ModeReport struct {
	Number        int            `json:"number"` // from 1, ascending frequency
	FrequencyHz   float64        `json:"frequency_hz"`
	RigidBody     bool           `json:"rigid_body"`    // a free (zero-frequency) motion
	LossFactor    [3]float64     `json:"loss_factor"`   // low, nominal, high (modal strain energy)
	DampingRatio  float64        `json:"damping_ratio"` // nominal ζ = η/2
	Participation [6]float64     `json:"participation"` // effective mass share along X, Y, Z, about X, Y, Z
	Motion        string         `json:"motion"`        // the direction it mostly moves in, in words
	Energy        []EnergyReport `json:"energy"`        // strain-energy shares by material or group, largest first
}

// EnergyReport is one group's share of a mode's strain energy.
type EnergyReport struct {
	Group string  `json:"group"`
	Share float64 `json:"share"`
}

// ResonanceReport is a natural frequency within the margin of an
// excitation band of a running speed.
type ResonanceReport struct {
	Mode        int     `json:"mode"`
	FrequencyHz float64 `json:"frequency_hz"`
	Speed       string  `json:"speed"`
	Order       int     `json:"order"` // harmonic
	LowHz       float64 `json:"low_hz"`
	HighHz      float64 `json:"high_hz"`
	Separation  float64 `json:"separation"` // relative distance from the band; 0 inside it
}

// RangesReport is the JSON form of `trestle ranges`.
type RangesReport struct {
	Schema   string        `json:"schema"`
	Model    string        `json:"model"`
	Levels   []LevelReport `json:"levels"`   // low, nominal, high
	Warnings []string      `json:"warnings"` // places without stiffness, no modes, suspect solves
	Pending  []string      `json:"pending"`
	Cautions []string      `json:"cautions"`
}

// LevelReport is the governing numbers at one material level.
type LevelReport struct {
	Level     string           `json:"level"`
	Governing Governing        `json:"governing"`
	Mounts    []MountStiffness `json:"mounts"`
}

// CompareReport is the JSON form of `trestle compare`.
type CompareReport struct {
	Schema     string           `json:"schema"`
	A          string           `json:"a"`
	B          string           `json:"b"`
	GoverningA Governing        `json:"governing_a"`
	GoverningB Governing        `json:"governing_b"`
	MountsA    []MountStiffness `json:"mounts_a"`
	MountsB    []MountStiffness `json:"mounts_b"`
	Cautions   []string         `json:"cautions"`
}

// RingdownReport is the JSON form of `trestle ringdown`.
type RingdownReport struct {
	Schema           string         `json:"schema"`
	Input            string         `json:"input"`
	Column           string         `json:"column"`
	SampleRateHz     float64        `json:"sample_rate_hz"`
	Samples          int            `json:"samples"`
	DampedFrequency  Estimate       `json:"damped_frequency_hz"`
	NaturalFrequency Estimate       `json:"natural_frequency_hz"`
	Ratio            Estimate       `json:"damping_ratio"`
	LogDecrement     Estimate       `json:"log_decrement"`
	LossFactor       Estimate       `json:"loss_factor"`
	Q                Estimate       `json:"q"`
	SpecificCapacity Estimate       `json:"specific_damping_capacity"`
	WindowS          [2]float64     `json:"window_s"`
	Cycles           float64        `json:"cycles"`
	Nominal          string         `json:"nominal_method"`
	Methods          []MethodReport `json:"methods"`
	AgreementFactor  float64        `json:"agreement_factor"` // largest over smallest ζ among the methods
	AgreementLimit   float64        `json:"agreement_limit"`
	Agree            bool           `json:"agree"`
	Warnings         []string       `json:"warnings"`
	Notes            []string       `json:"notes"` // what the reader decided
	Picture          string         `json:"picture,omitempty"`
	ModelMaterial    string         `json:"model_material,omitempty"` // with --material: a model-file material entry carrying the measured loss factor
}

// Estimate is a value with its standard uncertainty.
type Estimate struct {
	Value       float64 `json:"value"`
	Uncertainty float64 `json:"uncertainty"`
}

// MethodReport is one method's estimate in a ring-down reduction.
type MethodReport struct {
	Method          string   `json:"method"`
	OK              bool     `json:"ok"`
	DampedFrequency Estimate `json:"damped_frequency_hz"`
	Ratio           Estimate `json:"damping_ratio"`
	Cycles          float64  `json:"cycles"`
	Note            string   `json:"note"`
}

// MaterialsReport is the JSON form of `trestle materials`.
type MaterialsReport struct {
	Schema    string           `json:"schema"`
	Materials []MaterialReport `json:"materials"`
}

// MaterialReport is one catalogue material.
type MaterialReport struct {
	Name          string         `json:"name"`
	Kind          string         `json:"kind"`
	EPa           [3]float64     `json:"e_pa"` // low, nominal, high
	DensityKgM3   float64        `json:"density_kg_m3"`
	YieldPa       float64        `json:"yield_pa"`       // 0: not rated
	CompressivePa float64        `json:"compressive_pa"` // 0: not rated
	LossFactor    [3]float64     `json:"loss_factor"`    // low, nominal, high
	Spread        string         `json:"spread,omitempty"`
	Sources       []SourceReport `json:"sources,omitempty"`
}

// SourceReport names where one figure came from.
type SourceReport struct {
	Figure string `json:"figure"`
	Ref    string `json:"ref"`
}

// SectionsReport is the JSON form of `trestle sections`.
type SectionsReport struct {
	Schema string        `json:"schema"`
	Kinds  []SectionKind `json:"kinds"`
}

// SectionKind is one shape keyword.
type SectionKind struct {
	Name        string `json:"name"`
	Description string `json:"description"`
	Example     string `json:"example"`
}

// SectionReport is the JSON form of `trestle sections SPEC`.
type SectionReport struct {
	Schema string        `json:"schema"`
	Spec   string        `json:"spec"`
	AM2    float64       `json:"a_m2"`
	IyM4   float64       `json:"iy_m4"`
	IzM4   float64       `json:"iz_m4"`
	IyzM4  float64       `json:"iyz_m4"`
	JM4    float64       `json:"j_m4"`
	AsYM2  float64       `json:"asy_m2"`
	AsZM2  float64       `json:"asz_m2"`
	SyM3   float64       `json:"sy_m3"`
	SzM3   float64       `json:"sz_m3"`
	RyM    float64       `json:"ry_m"`
	RzM    float64       `json:"rz_m"`
	Parts  []SectionPart `json:"parts,omitempty"`
}

// SectionPart is one material's share of a composite section.
type SectionPart struct {
	Material string  `json:"material"`
	AM2      float64 `json:"a_m2"`
	IyM4     float64 `json:"iy_m4"`
	IzM4     float64 `json:"iz_m4"`
}

// ModesCommandReport is the JSON form of `trestle modes`.
type ModesCommandReport struct {
	Schema           string       `json:"schema"`
	Model            string       `json:"model"`
	Level            string       `json:"level"`
	FirstFrequencyHz *float64     `json:"first_frequency_hz"` // lowest non-zero natural frequency; null if none
	Modes            *ModesReport `json:"modes"`
	Picture          string       `json:"picture,omitempty"`
	Warnings         []string     `json:"warnings"`
	Cautions         []string     `json:"cautions"`
}

// ResponseReport is the JSON form of `trestle response`.
type ResponseReport struct {
	Schema   string          `json:"schema"`
	Model    string          `json:"model"`
	Level    string          `json:"level"`
	BandHz   [2]float64      `json:"band_hz"`
	Modes    int             `json:"modes"` // modes in the sums
	Probes   []ProbeResponse `json:"probes"`
	Warnings []string        `json:"warnings"`
	Cautions []string        `json:"cautions"`
}

// ProbeResponse is the driving-point response at one place and direction:
// the motion there per unit harmonic force there, along the same axis.
type ProbeResponse struct {
	Place           string       `json:"place"`
	Direction       string       `json:"direction"`                     // UX, UY or UZ
	StaticNPerM     float64      `json:"static_n_per_m"`                // |1/H| at the bottom of the band
	MinDynamicNPerM float64      `json:"min_dynamic_stiffness_n_per_m"` // smallest |1/H| in the band
	MinDynamicAtHz  float64      `json:"min_dynamic_at_hz"`
	Peaks           []PeakReport `json:"peaks"`
	FrequencyHz     []float64    `json:"frequency_hz"`
	ReceptanceMPerN []float64    `json:"receptance_m_per_n"` // |H|
	PhaseRad        []float64    `json:"phase_rad"`
}

// PeakReport is a resonance peak of a receptance.
type PeakReport struct {
	FrequencyHz     float64 `json:"frequency_hz"`
	ReceptanceMPerN float64 `json:"receptance_m_per_n"`
	DynamicNPerM    float64 `json:"dynamic_stiffness_n_per_m"`
	Mode            int     `json:"mode"` // nearest mode, from 1
}
