package beam

// SupportKind says which displacements a support restrains.
type SupportKind int

const (
	Pinned SupportKind = iota // holds both translations
	Roller                    // holds the vertical translation only
	Fixed                     // holds both translations and the rotation
	Spring                    // elastic vertical spring of stiffness K
)

// String returns the job-file spelling of the support kind.
func (k SupportKind) String() string {
	switch k {
	case Pinned:
		return "pinned"
	case Roller:
		return "roller"
	case Fixed:
		return "fixed"
	case Spring:
		return "spring"
	}
	return "unknown"
}

// Support is one support of the beam.
type Support struct {
	X    float64     // position from the left end [mm]
	Kind SupportKind //
	K    float64     // vertical spring stiffness, Spring only [N/mm]
}

// LoadKind is the shape of a load.
type LoadKind int

const (
	Distributed LoadKind = iota // linearly varying from W1 at X1 to W2 at X2
	PointForce                  // transverse force P at X1, positive downward
	PointMoment                 // couple P at X1, positive clockwise (M jumps by +P)
	AxialForce                  // force P along +x at X1
)

// Load is one characteristic load. Transverse loads are positive downward.
type Load struct {
	Kind   LoadKind
	X1, X2 float64 // start and end [mm]; point loads use X1
	W1, W2 float64 // distributed intensity at X1 and X2 [N/mm]
	P      float64 // point force [N] or couple [N·mm]
}

// ActionKind classifies a load case for EN 1990 combinations.
type ActionKind int

const (
	Permanent     ActionKind = iota
	Imposed                  // imposed loads in buildings, EN 1991-1-1 (Case.Category "A" … "H")
	Snow                     // snow loads on buildings, EN 1991-1-3
	Wind                     // wind actions on buildings, EN 1991-1-4
	OtherVariable            // any other variable action; give its ψ (Case.Psi)
	Thermal                  // temperature (non-fire) in buildings, EN 1991-1-5
)

// String returns the job-file spelling of the action kind.
func (k ActionKind) String() string {
	switch k {
	case Permanent:
		return "permanent"
	case Imposed:
		return "imposed"
	case Snow:
		return "snow"
	case Wind:
		return "wind"
	case OtherVariable:
		return "other"
	case Thermal:
		return "thermal"
	}
	return "unknown"
}

// Variable reports whether the action is variable (not permanent).
func (k ActionKind) Variable() bool { return k != Permanent }

// known reports whether k is one of the declared action kinds.
func (k ActionKind) known() bool { return k >= Permanent && k <= Thermal }

// Case is one characteristic load case.
type Case struct {
	Name     string
	Kind     ActionKind
	Category string      // EN 1990 Table A1.1 category for imposed loads ("A".."H"), snow "low"/"high"
	Pattern  bool        // load span by span where adverse
	Psi      *[3]float64 // explicit ψ0, ψ1, ψ2; nil takes EN 1990 Table A1.1 by kind and category
	Loads    []Load
}

// RoofImposed reports whether the case is an imposed load on a roof, category H of EN 1991-1-1
// (EN 1990 Table A1.1), which EN 1990 A1.2.1(3) and EN 1991-1-1 3.3.2(1) keep apart from snow
// and wind (see Rules.CombineRoofImposed).
func (c Case) RoofImposed() bool { return c.Kind == Imposed && c.Category == "H" }

// climatic reports whether the case is snow or wind, the actions a roof imposed load is not
// combined with.
func (c Case) climatic() bool { return c.Kind == Snow || c.Kind == Wind }

// Model is a straight prismatic beam on point supports. Lengths in mm, forces in N.
type Model struct {
	Length   float64   // total length [mm], x from 0 to Length
	Supports []Support // sorted by X
	Hinges   []float64 // x of internal moment hinges [mm]
	EI       float64   // bending stiffness [N·mm²]
	EA       float64   // axial stiffness [N]
}
