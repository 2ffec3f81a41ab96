// Package modelfile reads and writes trestle model files: a stand described
// in a short text file of our own format on top of TOML, or generated from
// a few numbers (Generate). Read builds a springnet.Model from a file;
// Write writes one back; Demo returns an example file.
//
//	f, err := modelfile.Read("stand.toml", r)  // f.Model, f.MountIDs["spindle"], f.Dynamics
//	err = modelfile.Write(w, f)                  // reads back to the same model
//	f, err = modelfile.Generate(modelfile.Layout{LegsX: 2, LegsY: 2, ...})
//
// # The format
//
// A model file is TOML (https://toml.io): "#" starts a comment, text goes
// in quotes, lists in [ ], small tables in { }. Names (of nodes, members,
// groups, mounts, cases) are any text; quote a name that has characters
// other than letters, digits, "-" and "_" when it is a key ("top-1" = ...
// needs no quotes; "leg 1" does).
//
// Top-level keys:
//
//	title = "Welded stand for a small lathe"   # optional
//	description = "..."                          # optional
//
// # Units
//
// Every plain number is in the unit of its kind of quantity, set once per
// file in [units]; any value may instead be a text with its own unit
// ("1200 mm", "5 kN", "2.5 N/um", "200 GPa"), which is checked against the
// kind of quantity the key expects.
//
//	[units]
//	length = "mm"              # default m
//	force = "N"                # default N
//	mass = "kg"                # default kg
//	stress = "MPa"             # moduli and strengths; default force/length² (MPa for N and mm)
//	density = "kg/m3"          # default kg/m3
//	stiffness = "N/um"         # springs and feet; default force/length
//	rotational-stiffness = "N*m/rad"   # default force·length/rad
//	moment = "N*m"             # default force·length
//	bending-stiffness = "N*m2" # raw EI and GJ; default force·length²
//	mass-per-length = "kg/m"   # default kg/m
//	area = "mm2"               # default length²
//	mass-inertia = "kg*m2"     # default kg*m2
//	acceleration = "m/s2"      # default m/s2
//	frequency = "Hz"           # default Hz
//	angle = "deg"              # default deg
//	speed = "rpm"              # running speeds; default rpm
//
// Unit symbols: m mm cm um km in ft; N kN MN lbf kip kgf; kg g t lb; s ms
// min; Pa kPa MPa GPa psi ksi; Hz rpm; rad deg. Combine them with "*" (or
// "·"), one "/" and powers written as a trailing digit, "^n" or ² ³:
// "kN*m/rad", "kg/m3", "N/mm²", "lbf/in". Case is ignored ("mpa" is MPa),
// so write MN for meganewtons (mN is refused).
//
// # Materials and sections
//
// A member names its material: a name from the [materials] table of the
// file, else a catalogue name found by materials.Lookup ("steel S235",
// "timber C24", "concrete C25/30"). A [materials] entry starts from a
// catalogue entry and overrides some properties, or gives its own:
//
//	[materials."frame steel"]
//	from = "steel S235"                  # catalogue entry to start from
//	family = "steel"                     # for grouping and drawing: steel, timber, concrete, masonry, stone, ...
//	E = ["195 GPa", "205 GPa", "212 GPa"] # a range [low, nominal, high], or one value
//	G = "79 GPa"                          # shear modulus; default E/(2(1+poisson))
//	poisson = 0.3
//	density = 7850
//	strength = "235 MPa"                  # yield or allowable tension/bending
//	compressive-strength = "30 MPa"       # concrete, masonry, timber
//	loss-factor = [0.001, 0.002, 0.004]   # damping loss factor η
//	mass-only = false                     # true: adds mass, no stiffness (sand fill)
//
// Without "from", "E" and "density" are required. A range may also be
// written { low = 195e3, nominal = 205e3, high = 212e3 }.
//
// A member's section is a section spec string (sections.Parse: "square-tube
// 50x3 mm", "rect-tube 100x50x4 mm", "lumber 2x6", "filled square-tube
// 100x5 mm with concrete C25/30", "general A=12.3cm2 Iy=100cm4 Iz=50cm4
// J=20cm4") or a name from the [sections] table:
//
//	[sections]
//	leg = "square-tube 50x3 mm"
//
// # Nodes
//
//	[nodes]
//	A1 = [0, 0, 0]          # x, y, z in the length unit; Z is up
//	T1 = [0, 0, "0.8 m"]
//
// # Members: [[bar]], [[beam]], [[spring]]
//
// One table may describe one member or several alike: "ends" is a pair of
// node names or a list of pairs, and a "name" given to several becomes
// name-1, name-2, ... in order. Without a name the model names them (B3,
// M5, S7).
//
//	[[beam]]
//	name = "leg"                         # leg-1 .. leg-4
//	ends = [["A1", "T1"], ["A2", "T2"], ["A3", "T3"], ["A4", "T4"]]
//	material = "steel S235"
//	section = "leg"
//	up = [0, 0, 1]                       # local z lies in the plane of the axis and up; default global Z (Y for a vertical member)
//	roll = 90                            # turn about the axis, in the angle unit
//	shear-deformation = true             # Timoshenko beam (shear areas of the section)
//	release-start = "pin"                # free end rotations: "pin" (ry and rz), "twist" (rx), "all", or ["ry"], ... in local axes
//	release-end = ["rz"]
//	joint-spring-start = [0, "30 kN*m/rad", "30 kN*m/rad"]   # rotational springs about local x, y, z; 0: rigid
//	joint-spring-end = [0, "30 kN*m/rad", "30 kN*m/rad"]
//	loss-factor = 0.003                  # overrides the material's
//
// A [[bar]] (pin-ended, axial only) takes name, ends, material, section and
// loss-factor. Bars and beams without a section take raw stiffness
// instead: EA (force), EIy, EIz, GJ (bending-stiffness), GAy, GAz (force;
// shear stiffness), mass-per-length and area; a bar uses EA and
// mass-per-length.
//
//	[[spring]]
//	name = "pad"
//	ends = ["P1-head", "P1-plate"]
//	axial = "2.5 N/um"                   # along the line from the first end to the second
//	stiffness = { z = 5000, horizontal = 1500, rx = "5 MN*m/rad" }  # per global direction: x y z rx ry rz; horizontal sets x and y
//	spread = [0.7, 1, 1.4]               # factor on every stiffness at the low, nominal, high level
//	loss-factor = 0.05
//
// A spring with per-direction stiffness between two points apart is
// refused by the model (it would leave a moment unbalanced): put its ends
// at one point, or use "axial".
//
// # Feet, supports, rigid groups, mounts
//
//	[[foot]]                             # a spring from a node to the floor
//	name = "foot"                        # foot-1 .. foot-4 when at lists several nodes
//	at = ["A1", "A2", "A3", "A4"]
//	stiffness = { z = 50, horizontal = 5 }
//	compression-only = true              # lifts off instead of pulling
//	spread = [0.7, 1, 1.5]
//	loss-factor = 0.05
//
//	[[support]]                          # fixed directions of nodes or rigid groups
//	at = ["P1", "P2"]
//	fix = "all"                          # or "translations", "rotations", or a list of x y z rx ry rz
//
//	[[rigid-group]]                      # nodes moving as one rigid body (a thick top plate, a bed)
//	name = "top"
//	nodes = ["T1", "T2", "T3", "T4"]
//	reference = [600, 250, 800]          # optional; default the centroid of the nodes
//
//	[[mount]]                            # a named point where a machine sits
//	name = "headstock"
//	on = "top"                           # a node, rigid group or earlier mount
//	at = [250, 250, 820]
//
// Where a name could mean items of more than one kind, write
// "node:X", "group:X" or "mount:X".
//
// # Masses: the machine and point masses
//
//	[[mass]]
//	name = "lathe"                       # optional, for messages and reports
//	on = "top"                           # node, rigid group or mount it is fixed to
//	mass = 320
//	centre = [560, 250, 1010]            # centre of mass in global coordinates; or
//	# offset = [0, 0, 200]               # from the point it is on (default: at that point)
//	box = [1250, 420, 420]               # inertia of a uniform box this size; or
//	# inertia = [9.4, 46.4, 46.4]        # about axes through the centre parallel to X, Y, Z, or a 3×3 tensor
//
// "inertia" may be the full inertia tensor about the centre of mass in
// global axes, three rows of three, as a dynamics text writes it:
//
//	inertia = [[Ixx, -Pxy, -Pxz],
//	           [-Pxy, Iyy, -Pyz],
//	           [-Pxz, -Pyz, Izz]]
//
// The off-diagonal entries are the tensor's own terms, the NEGATED
// products of inertia Pxy = ∫x·y dm, Pxz = ∫x·z dm, Pyz = ∫y·z dm
// (x, y, z measured from the centre): a body whose mass lies along the
// line x = y has Pxy > 0 and a negative entry in row 1, column 2. The
// tensor must be symmetric (entries (i, j) and (j, i) equal within 1e-9
// of its trace; otherwise an error names the file, line and entries) and
// one a body can have (principal moments non-negative, each at most the
// sum of the other two; springnet's Validate checks this). The model
// holds the moments and the products (springnet.Mass.Inertia and
// Products); Write writes a mass with products back as this tensor. For a
// block turned in space, J = R·diag(Ia, Ib, Ic)·Rᵀ, R's columns being
// the block's edges in global axes.
//
// # Load cases and combinations
//
//	[[case]]
//	name = "weight and cutting"
//	gravity = true                       # or a factor of standard gravity (1.0), or a vector [0, 0, "-9.81 m/s2"]
//	[[case.load]]                        # as many as needed, each after its case
//	at = "headstock"                     # node, rigid group or mount
//	force = [-150, 300, "-1.2 kN"]
//	moment = [0, 0, "20 N*m"]
//
//	[[combination]]                      # a factored sum of cases, analysed as one load
//	name = "factored weight and cutting"
//	factors = { "weight and cutting" = 1.5 }   # or several: { "own weight" = 1, "other case" = 1.5 }
//
// On compression-only feet give every case the weight that holds the
// stand down (gravity): a load alone, without it, lifts feet that the
// weight would keep on the floor. A combination is solved as one load, so
// its feet are right even though the sum of its cases' results would not
// be.
//
// # Running speeds and response band
//
// These are carried to the caller in Dynamics (for the excitation check
// and the frequency response); the model does not use them.
//
//	[[speed]]
//	name = "spindle"
//	rpm = [60, 2200]                     # a range or one speed; plain numbers in the speed unit, or "40 Hz"
//	teeth = 24                           # or flutes, or blades: events per revolution (default 1)
//	harmonics = 2                        # multiples to check
//
//	[response]
//	band = ["2 Hz", "250 Hz"]
//	modes = 12
//
// # Member checks
//
//	effective-length = 0.8                # in a [[bar]] or [[beam]]: buckling factor K for both axes, or [ky, kz], or { y = 0.8, z = 1 }
//
//	[checks]
//	effective-length-basis = "design"     # automatic factors: "design" (default) or "theoretical"; see File.MemberSettings
//
// # Limits
//
// Read refuses a file larger than MaxFileSize (16 MiB) or nested deeper
// than MaxNesting, and a model whose analysis would need more than
// MemoryBudget (8 GiB) by the estimate of Estimate, before building it.
// Generate refuses a layout the same way.
//
// # Errors
//
// Read reports every problem it finds, joined with errors.Join, as *Error
// values that print as "file:line: message" and name the item, with the
// closest known name or key where one is near:
//
//	stand.toml:42: beam "brace-3" names unknown node "C2"; did you mean "C3"?
//	stand.toml:17: beam "leg": unknown key "materal"; did you mean "material"? (keys here: ...)
//	stand.toml:9: foot 1: stiffness: z: "50 kN" is not a stiffness (force per length)
//
// The model's own Validate errors come last, mapped to the line of the item
// they name. Errors returns the *Error values of a joined error. Nothing
// in the package panics on any input (FuzzRead).
//
// # Units inside, axes
//
// Contents, the model and every Go value of this package are SI (m, N, kg,
// Pa, s, rad; speeds in rev/s, frequencies in Hz). Axes are global with Z
// up; the floor under feet is horizontal.
package modelfile
