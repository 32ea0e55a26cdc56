// Package splice checks and sizes bolted cover-plate splices of I-beams to EN 1993-1-8:2005
// and EN 1993-1-1:2005: for the design forces at one position it returns every resistance
// check (clause, formula, numbers, demand, resistance, utilisation, limit state) of a given
// splice (Verify), or the cheapest splice in a design space that passes them all (Size).
//
// # The splice
//
// Each flange has an outer cover plate and, optionally, two inner plates (one each side of the
// web, set flush with the outer plate's edges), with 2 or 4 bolt lines and a number of rows on
// each side of the joint. The web has a pair of cover plates with columns and rows of bolts.
// One bolt size and class is used throughout. Categories (EN 1993-1-8 Table 3.2): A bearing,
// B slip-resistant at SLS, C slip-resistant at ULS. Both flange splices and both sides of the
// joint are the same, so the checks are made for the worse flange and one side.
//
// # Units and signs
//
// Inside the package everything is N and mm (stresses N/mm², moments N·mm). Forces carries
// M positive sagging and N positive in tension; the sign of V does not matter. A Check carries
// its demand and resistance in its own unit (kN, kNm, mm or N/mm²) for output; its
// utilisation is demand/resistance.
//
// # Method (DESIGN.md section 5)
//
// Design states: M_max and M_min, each with the largest |V| and with N_max and N_min. Both
// signs of the moment are always checked, so either flange may be the tension flange.
//
// Force distribution: proportional (the web takes Mw = M·Iw/Iy and Nw = N·Aw/A with
// Iw = tw·hw³/12, Aw = tw·hw, hw = h − 2tf; the flanges the rest, Ff = (M − Mw)/(h − tf) ±
// (N − Nw)/2), or flanges-only (Mw = 0). The web bolt group carries the moment |Mw| + |V|·e,
// e = gap/2 + end distance + half the group width, distributed elastically (polar moment of
// inertia); the axial share adds to the horizontal component and the shear to the vertical
// one, signs taken adversely. The flange force is shared between outer and inner plates in
// proportion to their areas; a plate check's resistance is stated as the flange force at which
// the first plate reaches its resistance.
//
// Checks (ids of DESIGN.md section 8, plus detail.fit, detail.preload and flange.beam.block):
// Table 3.3 spacing (maxima for steel exposed to the weather unless Detailing.Sheltered);
// fit of the plates between the root fillets (or the toes of a welded section's
// web-to-flange welds, Member.WeldThroat) and within the flange, washers clear of the
// fillets, and the least cover-plate thickness of Detailing.MinPlateToFlange where one is
// set; bolt shear per plane (Table 3.4) with the long-joint (3.8) and packing
// (3.6.1(12)) factors; bearing (Table 3.4) on the beam and the plates, where the load reverses
// every end and inner term applies, the group resistance is n × the smallest bolt (3.7, the
// branch that holds without conditions), and web bolts are checked component by component in
// the two load directions (Table 3.4 note 3); slip (3.9) at SLS for B and ULS for C; flange
// plate tension on gross and net section (EN 1993-1-1 6.2.3, Nnet,Rd for category C),
// compression (6.2.4) and buckling between bolts and across the joint (Table 3.3 note, 6.3.1,
// curve c, Lcr = 0.6 × the free length); block tearing (3.10.2, 2005 text) of the plates and
// of the beam flange outstands; beam flange net section (6.2.3, 6.2.5(4); with oversize holes
// the compression flange too, 6.2.4(3)); web plate shear on gross and net section, block
// tearing, bending with shear and axial force at the bolt column nearest the joint (6.2.8,
// 6.2.9.1); beam web net shear at the bolts.
//
// Not covered: fatigue, fire, seismic action, lateral-torsional buckling of the member, bolt
// tension and prying (a cover-plate splice loads its bolts in shear), local buckling of the web
// cover plates' compression zone (the flange plates are checked; the brief lists no such check
// for the web plates), the beam's own member resistance (the result notes when |M| or |V|
// exceed Mpl,Rd or Vpl,Rd), clearances of bolt heads
// and of web plates against inner flange plates (the result notes when both plates are thicker
// than the root radius plus the clearance), and block tearing of the beam web (the web has no
// free edge at the splice).
//
// # Sizing
//
// Size searches the design space (bolt sizes and classes, plate thicknesses, flange
// arrangements, columns and rows) with spacings from the Detailing rules: targets that give
// full bearing where there is room (e1 = 3 d0, p1 = 3.75 d0, e2 = 1.5 d0, p2 = 3 d0), rounded
// up to 5 mm and kept within Table 3.3; flange plates as wide as the flange; web plates as deep
// as the space between the root fillets less 5 mm each side. It returns the cheapest passing
// splice (ties: fewer bolts, then lighter plates, then the earlier entry of the sorted lists),
// exactly as SizeExhaustive, or the best attempt with Status NoFeasible. Costs use Rates;
// DefaultRates are invented indicative rates for ranking only.
//
// Detailing preferences narrow the search without changing it: a fixed flange gauge
// (Detailing.Gauge; GaugeFits says which layouts cannot take it and why), a least cover-plate
// thickness (Detailing.MinPlateToFlange) and bounds on the bolt sizes (DesignSpace.MinSize,
// MaxSize; FilterBoltSizes). The layouts they forbid are left out of Size, SizeExhaustive
// and the Catalogue alike; with none set the search is the one above.
//
// # One design at many positions
//
// A Catalogue lists the whole splices of a design space for a problem without forces — each
// a bolt, a flange part and a web part, in the order Size ranks them (Designs) — and checks
// any of them at a Loading (the design actions of one set of forces) for numbers only, with
// Verify's verdict and utilisation. The flange and web parts pass or fail independently, and
// a part that passes at a loading passes at every loading below it, action by action; a
// search for one design that passes at many positions (identical splices along a beam) is
// built on these two facts.
//
// # Errors
//
// Anything a user can cause (an unknown bolt size, a plate thickness the steel table does not
// cover, a splice geometry with bolt lines outside a plate, a non-preloadable class in a
// slip-resistant design space) is a returned error naming the field and value; several
// problems are joined. A drawable splice that breaks a rule gives failing detailing checks.
// The package never prints and keeps no state between calls: Verify, Size and SizeExhaustive
// are safe for concurrent use (Steel.Strength must be too). Problem.Brief leaves the formula
// text out of the result for whole-span scans; the numbers are the same.
//
// References: EN 1993-1-8:2005+AC:2009, EN 1993-1-1:2005, EN 1090-2 (hole clearances, slip
// factors), EN ISO 898-1 (bolt stress areas). National annexes may change the partial factors
// and other nationally determined parameters; set them in PartialFactors.
package splice
