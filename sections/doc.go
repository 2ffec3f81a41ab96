// Package sections holds member cross-sections: their geometry and
// properties (area, second moments, torsion constant, shear areas,
// section moduli, radii of gyration, outline), composite (transformed)
// sections of more than one material, and a short text spec for each
// shape.
//
// # Axes and units
//
// Local axes: x along the member, y and z in the section. Iy = ∫z² dA is
// the second moment about the y axis (bending in the x–z plane); Iz =
// ∫y² dA. Every shape puts its depth along z, so Iy is the strong axis of
// a beam on edge (rect 100x20 is 100 wide along y and 20 deep along z;
// use rect 20x100 for the bar on edge). Properties are about the
// centroid; Iyz is zero except for unsymmetric shapes (the angle), whose
// principal values come from Props.Principal. Outline loops are about
// the centroid, outer loop first (counter-clockwise), then holes.
// Everything is SI: m, m², m⁴. Shapes are plain values built with
// literals in metres:
//
//	const mm = 1e-3
//	tube := sections.RoundTube{D: 60.3 * mm, T: 3.2 * mm}
//	p, err := tube.Properties()
//
// # Shapes and methods
//
// Rect, Square, Round, Flat; RoundTube, RectTube (square when H = B),
// Pipe (ASME B36.10M by NPS and schedule); Angle, Channel, IShape; Lumber
// (NDS dressed sizes from nominal, glued plies); Block (hollow concrete
// masonry unit, net section); GroutedBlock and Filled (Composite); and
// General, given by its properties. A tube's Conv selects how the
// nominal wall is used: AsGiven, AISC (design wall 0.93·t, AISC 360-16
// §B4.2, corner radius 2t) or EN10219 (nominal wall, EN 10219-2 corner
// radii). Torsion: exact for circles and annuli, Bredt with corners for
// closed rectangular tubes and blocks, Σ b t³/3 for open shapes (with El
// Darwish–Johnston fillet terms for I-shapes), the Timoshenko–Goodier
// series for solid rectangles. Shear areas: 5/6 A for rectangles,
// Cowper's coefficient (ν = 0.3) for round bars and tubes, wall or web
// areas parallel to the shear for tubes and I-shapes (common practice).
// Each shape's doc comment names its sources.
//
// A Composite's Props are its primary part's (the tube, the block);
// Parts gives each material's A, Iy, Iz and J about the common centroid,
// and Transformed sums them into EA, EI, GJ and mass per length at a
// material level. A MassOnly fill (dry sand) adds mass, no stiffness.
//
// # Spec syntax
//
// A spec is the shape keyword, the sizes joined by x, a unit (mm, cm, m,
// in, ft; attached or apart) and options; fractions (3/16, 1-1/2) are
// allowed. Keywords and units ignore case.
//
//	rect BxH u            square B u            round D u         flat WxT u
//	round-tube DxT u [aisc|en10219]
//	square-tube BxT u [r=R] [aisc|en10219]
//	rect-tube HxBxT u [r=R] [aisc|en10219]
//	pipe NPSin sch40|sch80|sch10|sch160|std|xs [aisc]
//	angle BxHxT u [r=R] [rt=RT]
//	channel HxBxTWxTF u [r=R]      i-shape HxBxTWxTF u [r=R]
//	lumber TxW [xN]                (nominal inches, no unit; N glued plies)
//	block 8in | block LxW u [fs=F] [web=W] [webs=N]  [grouted [of UNIT] [with GROUT]]
//	filled <tube spec> [of SHELL] with FILL
//	general A=12.3cm2 Iy=100cm4 Iz=50cm4 J=20cm4 [Asy=..] [Asz=..] [cy=..mm] [cz=..mm]
//
// Option lengths take the spec's unit unless they carry their own
// (r=0.8cm). Material names are looked up with materials.Lookup; the
// defaults are steel S235 (steel A500 Gr C with aisc) for a tube's shell,
// masonry concrete grouted for a block unit and concrete C20/25 for
// grout. List returns every keyword with a description and example.
// Spec (and each shape's String) writes a spec that Parse reads back to
// the same section, lengths to within a few ulps, in mm or in, whichever
// is shorter.
//
// # Errors
//
// Properties fails, never panics, on a size that is zero, negative, not
// finite or outside 1 µm…100 m, or on geometry that does not fit (a wall
// not less than half the width, a corner radius larger than the side, a
// web and fillets wider than the flange). Parse fails with an error that
// quotes the spec and says what is wrong: an unknown shape (naming the
// closest), the wrong number of sizes, a missing or unknown unit, a
// number that is not a plain decimal or fraction (NaN, Inf and hex are
// refused), an unknown option or material. All errors start with
// "sections: ".
package sections
