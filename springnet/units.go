package springnet

// Units for printing stiffness. The library works in N/m; convert only
// just before printing.
const (
	// PoundForce is 1 lbf in newtons, exact by definition: 0.45359237 kg ×
	// 9.80665 m/s² (international yard and pound agreement, 1959, with the
	// standard gravity of the 3rd CGPM, 1901).
	PoundForce = 4.4482216152605 // N
	// Inch is 1 in in metres, exact by definition (1959 agreement).
	Inch = 0.0254 // m
	// Micrometre is 1 µm in metres.
	Micrometre = 1e-6 // m
)

// NPerMicron converts a stiffness from N/m to N/µm.
func NPerMicron(k float64) float64 { return k * Micrometre }

// LbfPerInch converts a stiffness from N/m to lbf/in.
func LbfPerInch(k float64) float64 { return k * Inch / PoundForce }

// FromNPerMicron converts a stiffness from N/µm to N/m.
func FromNPerMicron(k float64) float64 { return k / Micrometre }

// FromLbfPerInch converts a stiffness from lbf/in to N/m.
func FromLbfPerInch(k float64) float64 { return k * PoundForce / Inch }
