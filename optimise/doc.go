// Package optimise turns a job file into an analysed beam and, from it, the admissible splice
// positions and the cheapest layouts of splices under transport and site limits.
//
// Units: internally N and mm like every spanbreak package; the job file's units (m, kN, kNm,
// kN/m, kg) are converted where it is read, in package jobfile. Masses are in kg, costs in the
// currency of the job's rates.
//
// Errors: every problem a user can cause is returned as a jobfile.Problems, each with the file,
// line, column and key path of the value at fault; nothing here prints or exits. Results that
// overflow (a *beam.NonFiniteError from the analysis, the envelopes or a case result) are
// mapped to the load, the case's loads or the combination factor that causes them by
// Setup.LocateOverflow; Setup.Analyse also evaluates every combination at the key points, so
// that check refuses whatever the scan would.
//
// # Scan
//
// Grid places candidate positions every step from the left end, strictly inside the beam.
// KeepOutZones lists where no splice may go — each side of every support, of every point load
// and point moment, the user ranges, and the ends closer than min_piece_length — as closed
// intervals; a position in a zone keeps the zone's reason and key. At every other position
// DesignForces reads the ULS and SLS envelopes (at a jump, both sides, the worse of each
// extreme): M_max and M_min, each paired with the largest |V| and with N_max and N_min
// (DESIGN.md section 5). A Designer sizes the cheapest splice for those forces; SpliceDesigner
// does it with package splice (Size, or SizeExhaustive for the reference run) from the job's
// splice and costs blocks (Setup.SpliceProblem). A position where nothing passes keeps the
// governing check of the closest configuration and by how much it fails.
//
// The normal scan computes the envelopes at the positions in blocks of stations, sizes each
// distinct force set once (found by sorting the positions by their forces) on a bounded pool
// of goroutines; the exhaustive scan evaluates each position on its own, one after another,
// with the exhaustive sizing. Both give the same candidates. Positions with equal splices
// share one copy of its geometry and description, and a position in a keep-out zone points
// at the zone, so a candidate costs its own fields and little more.
//
// # Layouts
//
// A layout is a set of splice positions; its pieces run between them, each ending gap/2 short
// of a splice. A piece weighs its steel (length × mass per length), half of each splice at its
// ends (plates and bolt assemblies) and the rigging allowance; it must lie within the minimum
// and maximum piece length (the minimum does not apply to an unspliced beam) and the crane's
// mass limit, and within the length and payload of the vehicle. The cost is
//
//	Σ splice costs + trips × cost per trip of the vehicle + pieces × cost per lift,
//
// where the vehicle is the one of the listed tiers that makes this cheapest among those that
// take every piece, and trips is the fewest trips carrying all pieces with no trip over the
// payload (pieces side by side or stacked on the deck; exact bin packing up to
// MaxExactPacking pieces, first-fit decreasing above). Costs are summed in integer
// micro-units, so every search order gives the same sums.
//
// Layouts finds, for each vehicle tier and splice count k, the cheapest layout exactly:
// dynamic programming over the positions, layer ℓ being the ℓ-th splice, with the admissible
// previous splices of each position a window in x kept by two pointers and a sliding-window
// minimum (the mass limit checked piece by piece only where the splices' own masses decide
// it). Each layer holds only its band: the positions a valid piece reaches from the layer
// before and from which k−ℓ more splices may still reach the right end, which are all a
// k-splice layout can pass through; a lattice of more than 2^18 entries keeps checkpoint
// layers only (every ≈√k-th) and recomputes the others when asked for them, so the memory
// does not grow as k × positions. The trips depend on all pieces at once, so the layouts of
// one tier and k are then enumerated in order of splice cost (recursive enumeration of k
// shortest paths, Jiménez and Marzal 1999, each state drawing its predecessors one at a time
// from a range-minimum tree instead of holding them all) until the least possible number of
// trips, ⌈least total mass / payload⌉, proves that no later one is cheaper; usually the first
// layout already meets it. Ties go to fewer
// splices, then to the smaller sum of the ranking's measure (the utilisation for the cost
// ranking: splices where they work least), then to splices further left, compared from the
// right end.
//
// The result holds the best layout for each splice count from the fewest that satisfies the
// limits up to two more (and any larger count that would be cheaper still, which a lower bound
// on the cost of more splices rules out), and the near-best alternatives: the next layouts in
// cost order that differ from every one listed before in the stretch or splice design of at
// least one splice (variants of one layout — the same splice designs in the same stretches of
// consecutive admissible positions — are listed once), found by Lawler's partitioning over the
// sequence of those classes. When no layout meets the limits, the error names the limit whose
// removal alone would admit one (splices.max, max_piece_mass, the vehicles' payload,
// min_piece_length, max_piece_length, the vehicles' length) or the stretch of beam without an
// admissible position, with the job-file location.
//
// # Layouts placed by hand
//
// Outcome.Evaluate prices a layout at positions the caller chooses (the page of `spanbreak
// view`): each position snaps to the nearest candidate of the scan, within half a step, and
// takes the splice the scan sized there, and the layout is priced by LayoutProblem.Price, the
// search's own arithmetic for pieces, masses, the vehicle tier and the trips, so the
// recommended layout prices at exactly its reported total. Everything that makes a hand layout
// inadmissible is listed with its job-file key: a position off the beam or the grid, in a
// keep-out zone or where no splice passes, each limit each piece breaks, pieces that no one
// vehicle takes, and the splice-count limits. Outcome.WithLayout turns an admissible one into
// an outcome whose recommendation it is, for the report.
//
// # Identical splices
//
// Outcome.Uniform finds, for each splice count (by the same counting rule), the best layout in
// which every splice is the same design of the job's design space: exactly the least
// k·cost(D) + transport + erection over every design D and every layout of the positions
// where all of D's checks pass — not only those where D is the cheapest — with D's mass on
// the pieces. D's feasible positions are those of its flange part and its web part, found once
// per part with the checks monotone in the actions (splice.Catalogue); the designs are listed
// in cost order from the least that could hold k splices at all, cut by a lower bound on the
// cost of any layout of the rest, by dominance (an earlier design that passes wherever
// another does, no heavier, takes its place) of parts and of whole designs, and the layouts
// of each remaining design are found by the dynamic programme above over its own positions.
// Ties go to fewer splices, then the design first in the splice package's order (cost, fewer
// bolts, lighter plates, design-space order), then the smaller sum of its utilisation at the
// splices, then splices further left, compared from the right end. With the same number of
// splices a uniform layout costs at least as much as the mixed one unless a dearer, lighter
// splice eases a mass limit.
//
// Batch optimises several jobs on a bounded pool of goroutines and reports progress through a
// callback; the command decides whether to draw a bar.
package optimise
