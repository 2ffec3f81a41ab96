package sections

import (
	"fmt"
	"slices"
	"strings"
)

var _ Section = Pipe{}

// Pipe is a steel pipe by nominal pipe size and schedule (ASME B36.10M
// outside diameters and walls). NPS is the size as written: "1/2", "3/4",
// "1", "1-1/4", "1-1/2", "2", "2-1/2", "3", "3-1/2", "4", "5", "6", "8".
// Schedule is "10", "40" or "80" for every size, and "160" for the sizes
// that have it (not 3-1/2); "std" means 40 and "xs" means 80 (the same
// walls up to NPS 8). With Conv AISC the properties use the design wall
// 0.93·t, as the AISC Manual's pipe tables do.
type Pipe struct {
	NPS      string     // nominal pipe size, e.g. "2" or "1-1/2"
	Schedule string     // "10", "40", "80", "160" (also "std", "xs")
	Conv     Convention // AISC: design wall 0.93·t; otherwise the nominal wall
}

// pipeSize is one row of ASME B36.10M (Sch 10 walls are the B36.19M 10S
// walls, which B36.10M shares for these sizes). Dimensions in inches.
// From memory of ASME B36.10M-2018 Table 1; spot-checked against the
// AISC Manual pipe table (Pipe 2 Std: OD 2.375, t = 0.154).
type pipeSize struct {
	nps                       string
	od                        float64
	sch10, sch40, sch80, s160 float64 // wall [in]; 0: not made
}

var pipeSizes = [...]pipeSize{
	{"1/2", 0.840, 0.083, 0.109, 0.147, 0.187},
	{"3/4", 1.050, 0.083, 0.113, 0.154, 0.218},
	{"1", 1.315, 0.109, 0.133, 0.179, 0.250},
	{"1-1/4", 1.660, 0.109, 0.140, 0.191, 0.250},
	{"1-1/2", 1.900, 0.109, 0.145, 0.200, 0.281},
	{"2", 2.375, 0.109, 0.154, 0.218, 0.344},
	{"2-1/2", 2.875, 0.120, 0.203, 0.276, 0.375},
	{"3", 3.500, 0.120, 0.216, 0.300, 0.438},
	{"3-1/2", 4.000, 0.120, 0.226, 0.318, 0},
	{"4", 4.500, 0.120, 0.237, 0.337, 0.531},
	{"5", 5.563, 0.134, 0.258, 0.375, 0.625},
	{"6", 6.625, 0.134, 0.280, 0.432, 0.719},
	{"8", 8.625, 0.148, 0.322, 0.500, 0.906},
}

// PipeSizes lists the nominal pipe sizes Pipe knows, smallest first.
func PipeSizes() []string {
	out := make([]string, len(pipeSizes))
	for i, s := range pipeSizes {
		out[i] = s.nps
	}
	return out
}

func canonicalSchedule(s string) string {
	switch strings.ToLower(s) {
	case "std":
		return "40"
	case "xs":
		return "80"
	}
	return strings.ToLower(s)
}

// Tube returns the pipe as a RoundTube (outside diameter and nominal wall
// in metres, with the pipe's Conv), or an error naming the unknown size
// or schedule.
func (p Pipe) Tube() (RoundTube, error) {
	i := slices.IndexFunc(pipeSizes[:], func(s pipeSize) bool { return s.nps == p.NPS })
	if i < 0 {
		return RoundTube{}, fmt.Errorf("sections: pipe: unknown nominal size %q (known: %s)", p.NPS, strings.Join(PipeSizes(), ", "))
	}
	row := pipeSizes[i]
	var t float64
	switch canonicalSchedule(p.Schedule) {
	case "10":
		t = row.sch10
	case "40":
		t = row.sch40
	case "80":
		t = row.sch80
	case "160":
		t = row.s160
	default:
		return RoundTube{}, fmt.Errorf("sections: pipe %s: unknown schedule %q (known: 10, 40, 80, 160, std, xs)", p.NPS, p.Schedule)
	}
	if t == 0 {
		return RoundTube{}, fmt.Errorf("sections: pipe %s: schedule %s is not made in this size", p.NPS, p.Schedule)
	}
	return RoundTube{D: row.od * inch, T: t * inch, Conv: p.Conv}, nil
}

// Properties returns the properties of the pipe's RoundTube.
func (p Pipe) Properties() (Props, error) {
	t, err := p.Tube()
	if err != nil {
		return Props{}, err
	}
	return t.Properties()
}

func (p Pipe) core() (Props, error) {
	t, err := p.Tube()
	if err != nil {
		return Props{}, err
	}
	return t.core()
}
