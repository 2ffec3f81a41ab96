package sections

import (
	"math"
	"reflect"
	"testing"
)

// FuzzParse checks, for any text: Parse never panics; when it succeeds,
// every property is finite (A, Iy, Iz, J positive), a composite's parts
// are finite and positive in area, and Spec parses back to the same
// section (within roundTripTol). Run with
//
//	go test -run '^$' -fuzz FuzzParse -fuzztime 2m ./sections
func FuzzParse(f *testing.F) {
	for _, k := range List() {
		f.Add(k.Example)
	}
	for _, s := range []string{
		"rect 100x20 mm", "round-tube 4.5x0.237 in aisc", "rect-tube 6x4x1/4 in aisc", "square-tube 100x5 mm en10219 r=12",
		"pipe 1-1/2in std aisc", "angle 50x50x5 mm r=7 rt=3.5", "lumber 2x6 x3", "block 390x190 mm fs=32 web=28 webs=2",
		"filled round-tube 114.3x3.6 mm of steel S355 with sand", "general a=1230mm² iy=1e6mm^4 iz=0.5e6mm4 j=2e5mm4 asy=6cm2 cz=5cm",
		"rect 1e-9x1 mm", "round-tube 60x30 mm", "rund 40 mm", "rect nanxnan mm", "rect 1/0x3 mm", "",
	} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, spec string) {
		s, err := Parse(spec)
		if err != nil {
			if s != nil {
				t.Fatalf("Parse(%q) returned a section and an error", spec)
			}
			return
		}
		p, err := s.Properties()
		if err != nil {
			t.Fatalf("Parse(%q) succeeded but Properties failed: %v", spec, err)
		}
		if err := checkProps(p); err != nil {
			t.Fatalf("Parse(%q): %v (%+v)", spec, err, p)
		}
		for _, l := range p.Outline {
			for _, pt := range l {
				if math.IsNaN(pt[0]+pt[1]) || math.IsInf(pt[0]+pt[1], 0) {
					t.Fatalf("Parse(%q): outline point %v not finite", spec, pt)
				}
			}
		}
		if c, ok := s.(Composite); ok {
			parts, err := c.Parts()
			if err != nil {
				t.Fatalf("Parse(%q): Parts: %v", spec, err)
			}
			for _, pt := range parts {
				for _, v := range []float64{pt.A, pt.Iy, pt.Iz, pt.J} {
					if !(v > 0) || math.IsInf(v, 0) {
						t.Fatalf("Parse(%q): part %q has %v", spec, pt.Material.Name, pt)
					}
				}
			}
		}
		out := Spec(s)
		back, err := Parse(out)
		if err != nil {
			t.Fatalf("Parse(%q) → Spec %q does not parse: %v", spec, out, err)
		}
		if ok, why := sameValue(reflect.ValueOf(s), reflect.ValueOf(back), roundTripTol, ""); !ok {
			t.Fatalf("Parse(%q) → Spec %q → different section: %s", spec, out, why)
		}
	})
}
