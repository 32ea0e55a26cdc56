package splice

// Limit states a check belongs to.
const (
	StateULS       = "ULS"
	StateSLS       = "SLS"
	StateDetailing = "detailing"
)

// Check ids, as listed in the job-file contract (DESIGN.md section 8), plus the ids this
// package adds (marked "added").
const (
	IDSpacing           = "detail.spacing"            // EN 1993-1-8 Table 3.3
	IDFit               = "detail.fit"                // added: plates within the section, nuts clear of the fillets
	IDPreload           = "detail.preload"            // added: categories B and C need class 8.8 or 10.9
	IDBoltLength        = "detail.bolt.length"        // added: a standard bolt length fits each group's grip (EN 1090-2 8.2.2)
	IDFlangeBoltShear   = "flange.bolt.shear"         // Table 3.4 with 3.8 and 3.6.1(12)
	IDFlangeBearingBeam = "flange.bolt.bearing.beam"  // Table 3.4, beam flange
	IDFlangeBearingPl   = "flange.bolt.bearing.plate" // Table 3.4, flange cover plates
	IDFlangeSlip        = "flange.bolt.slip"          // 3.9
	IDFlangeTension     = "flange.plate.tension"      // EN 1993-1-1 6.2.3
	IDFlangeBlock       = "flange.plate.block"        // 3.10.2
	IDFlangeCompression = "flange.plate.compression"  // EN 1993-1-1 6.2.4
	IDFlangeBuckling    = "flange.plate.buckling"     // Table 3.3 note, EN 1993-1-1 6.3.1
	IDFlangeBeamNet     = "flange.beam.net"           // EN 1993-1-1 6.2.5(4) / 6.2.3
	IDFlangeBeamBlock   = "flange.beam.block"         // added: 3.10.2 on the beam flange outstands
	IDWebBoltShear      = "web.bolt.shear"            // Table 3.4 with 3.8 and 3.6.1(12)
	IDWebBearingBeam    = "web.bolt.bearing.beam"     // Table 3.4, beam web, by load component
	IDWebBearingPlate   = "web.bolt.bearing.plate"    // Table 3.4, web cover plates, by load component
	IDWebSlip           = "web.bolt.slip"             // 3.9
	IDWebShearGross     = "web.plate.shear.gross"     // EN 1993-1-1 6.2.6
	IDWebShearNet       = "web.plate.shear.net"       // common practice: Av,net fu/(√3 γM2)
	IDWebBlock          = "web.plate.block"           // 3.10.2
	IDWebCombined       = "web.plate.combined"        // EN 1993-1-1 6.2.8 / 6.2.9
	IDWebBeamNetShear   = "web.beam.net-shear"        // EN 1993-1-1 6.2.6 at the holes
)

// Input is one named value a check uses, in the unit given.
type Input struct {
	Name  string
	Value float64
	Unit  string
}

// Check is one verification: what was compared, by which clause, with which numbers.
// Demand and Resistance are in Unit (kN, kNm, mm or N/mm²) so a reader can redo the
// comparison; Utilisation = Demand/Resistance (UtilisationCap when the resistance is zero).
type Check struct {
	ID          string
	Clause      string  // standard and clause, e.g. "EN 1993-1-8 Table 3.4"
	Formula     string  // the formula in symbols
	Substituted string  // the formula with the numbers in
	Inputs      []Input // the values the formula uses
	Demand      float64 // [Unit]
	Resistance  float64 // [Unit]
	Unit        string
	Utilisation float64
	State       string // StateULS, StateSLS or StateDetailing
	Pass        bool
	Note        string // governing design state, part or rule, and anything the reader must know
	// Impossible says why the check cannot be made when the geometry does not exist — a bolt
	// off its part, a distance or resistance of zero or less — e.g. "flange e2 (beam flange)
	// = -10 mm: the outer bolt lines are off the beam flange". Utilisation is then
	// UtilisationCap, a placeholder to print as "not possible", and the check fails.
	Impossible string
}

// UtilisationCap is the utilisation reported when a resistance is zero or negative (a plate with
// no net width, a bolt with no edge distance), so that results stay finite numbers.
const UtilisationCap = 999.0

// passTolerance absorbs rounding when a demand equals its resistance exactly.
const passTolerance = 1e-9

// utilisation is demand/resistance with the cap; a zero demand is always 0.
func utilisation(demand, resistance float64) float64 {
	if !(demand > 0) {
		return 0
	}
	if !(resistance > 0) {
		return UtilisationCap
	}
	u := demand / resistance
	if !(u < UtilisationCap) {
		return UtilisationCap
	}
	return u
}

func passes(u float64) bool { return u <= 1+passTolerance }

// Output scale factors from internal units.
const (
	toKN  = 1e-3 // N → kN
	toKNm = 1e-6 // N·mm → kNm
)
