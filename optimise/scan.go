package optimise

import (
	"cmp"
	"fmt"
	"math"
	"runtime"
	"slices"
	"sync"

	"spanbreak/optimise/jobfile"
	"spanbreak/splice"
)

// SpliceDesign is the cheapest splice a Designer found for one set of design forces, or the
// reason that none passes.
type SpliceDesign struct {
	Feasible    bool
	Cost        float64 // splice cost from the cost model [currency]; 0 when not feasible
	Bolts       int     // bolt assemblies, both sides of the joint, flanges and web
	Holes       int     // holes drilled, beam and cover plates
	PlateMass   float64 // cover plates [kg]
	BoltMass    float64 // bolt assemblies (bolt, nut, washers) [kg]
	FayingArea  float64 // prepared slip surface (categories B and C) [m²]
	Utilisation float64 // governing utilisation; when not feasible, that of the configuration closest to passing
	Governing   string  // id of the governing check, e.g. "web.bolt.bearing.beam"
	Summary     string  // one line: bolts, plates, e.g. "M20 10.9; flanges 2×3 outer 15 mm; web 2×5"
	Reason      string  // when not feasible: which check fails and by how much
	// Geometry is the splice sized (when not feasible, the attempt closest to passing); nil
	// when the designer keeps none (a test's stand-in designer). The scan gives every
	// position with the same splice the same pointer: it is shared, not to be changed.
	Geometry *splice.Geometry
}

// Mass returns the mass of the splice the pieces carry: plates and bolts [kg].
func (d SpliceDesign) Mass() float64 { return d.PlateMass + d.BoltMass }

// Designer sizes the cheapest splice for a set of design forces. The answer must depend on
// the forces alone (the section, grade, options and rates are the designer's own), so that
// equal force sets may share one answer, and Design must be safe for concurrent use. An error
// is for a designer that cannot work at all (bad options), not for forces that no splice
// takes: that is a SpliceDesign with Feasible false and its Reason.
type Designer interface {
	Design(f PositionForces) (SpliceDesign, error)
}

// Candidate is one position of the scan.
type Candidate struct {
	X        float64        // [mm] from the left end
	Feasible bool           // a splice may go here: outside every keep-out and a splice passes
	Reason   string         // why not, when not feasible
	Zone     *Zone          // the keep-out zone it lies in, if any (an element of the zones scanned, shared)
	Forces   PositionForces // design forces; zero inside a keep-out zone (not evaluated)
	Design   SpliceDesign   // the cheapest splice; zero inside a keep-out zone
	Rank     int            // 1 = best by the ranking of the run; 0 when not feasible
}

// ScanSettings control the scan.
type ScanSettings struct {
	// Exhaustive evaluates each position on its own: one envelope calculation per position,
	// no sharing of equal force sets, one position after another. It is the reference the
	// normal scan must equal; the designer's own pruning is switched off by whoever builds it.
	Exhaustive bool
	// Workers bounds the positions sized at once; 0 takes runtime.GOMAXPROCS(0).
	Workers int
}

// ScanStats count the work a scan did.
type ScanStats struct {
	Candidates int // positions on the grid
	KeptOut    int // in a keep-out zone, not evaluated
	Sized      int // calls to the designer
	Shared     int // positions that took the answer of an equal force set
}

// MaxCandidates bounds the grid, so that a tiny step fails with a message instead of running
// for hours; the job file's check refuses a scan.step that passes it.
const MaxCandidates = jobfile.MaxCandidates

// Grid returns the candidate positions every step [mm] from the left end, strictly inside the
// beam (a splice at an end is no splice).
func Grid(length, step float64) ([]float64, error) {
	if !(step > 0) || math.IsInf(step, 0) {
		return nil, fmt.Errorf("the scan step must be a positive spacing, got %.6g m", step/1e3)
	}
	// counted in floating point first: a step of 1e-300 m gives more positions than an int holds
	if nf := math.Ceil(length/step-1e-9) - 1; nf > MaxCandidates {
		return nil, fmt.Errorf("the scan step %.6g m gives %s positions on a %s beam; at most %d are allowed",
			step/1e3, count(nf), metres(length), MaxCandidates)
	}
	n := jobfile.ScanPositions(length, step)
	xs := make([]float64, 0, max(n, 0))
	for i := 1; i <= n; i++ {
		if x := float64(i) * step; x < length-zoneTol {
			xs = append(xs, x)
		}
	}
	return xs, nil
}

// count prints a number of positions or stations for messages: in full up to a trillion,
// then to three digits ("2.58e+301").
func count(n float64) string {
	if n < 1e12 {
		return fmt.Sprintf("%.0f", n)
	}
	return fmt.Sprintf("%.3g", n)
}

// Scan evaluates every position xs [mm]: the keep-out zones first (the first zone that holds
// a position is its reason), then the design forces from the envelopes, then the cheapest
// splice. The normal scan computes the envelopes at all positions at once and sizes each
// distinct force set once, in parallel; the exhaustive scan does neither and must give the
// same candidates.
func Scan(src Forces, xs []float64, zones []Zone, d Designer, set ScanSettings) ([]Candidate, ScanStats, error) {
	cands := make([]Candidate, len(xs))
	stats := ScanStats{Candidates: len(xs)}
	var open []int // positions outside every zone
	for i, x := range xs {
		cands[i].X = x
		if z := zoneAt(zones, x); z != nil {
			cands[i].Zone, cands[i].Reason = z, z.Reason
			stats.KeptOut++
			continue
		}
		open = append(open, i)
	}
	var err error
	if set.Exhaustive {
		err = scanExhaustive(src, cands, open, d, &stats)
	} else {
		err = scanShared(src, cands, open, d, set.Workers, &stats)
	}
	if err != nil {
		return nil, stats, err
	}
	for _, i := range open {
		c := &cands[i]
		c.Feasible = c.Design.Feasible
		if !c.Feasible {
			c.Reason = c.Design.Reason
			if c.Reason == "" {
				c.Reason = "no splice passes"
			}
		}
	}
	return cands, stats, nil
}

// sharer gives the designs whose geometries are equal one copy of the geometry, and equal
// texts one copy of each, so that the candidates hold as many splices as the scan found
// different ones, not one per position. It is safe for concurrent use.
type sharer struct {
	mu         sync.Mutex
	geometries map[splice.Geometry]*splice.Geometry
	texts      map[string]string
}

func newSharer() *sharer {
	return &sharer{geometries: map[splice.Geometry]*splice.Geometry{}, texts: map[string]string{}}
}

func (sh *sharer) share(d *SpliceDesign) {
	sh.mu.Lock()
	defer sh.mu.Unlock()
	if d.Geometry != nil {
		if g, ok := sh.geometries[*d.Geometry]; ok {
			d.Geometry = g
		} else {
			sh.geometries[*d.Geometry] = d.Geometry
		}
	}
	for _, s := range []*string{&d.Summary, &d.Reason, &d.Governing} {
		if t, ok := sh.texts[*s]; ok {
			*s = t
		} else {
			sh.texts[*s] = *s
		}
	}
}

func zoneAt(zones []Zone, x float64) *Zone {
	for i := range zones {
		if zones[i].Contains(x) {
			return &zones[i]
		}
	}
	return nil
}

// scanExhaustive is the reference: each position on its own, in order.
func scanExhaustive(src Forces, cands []Candidate, open []int, d Designer, stats *ScanStats) error {
	sh := newSharer()
	for _, i := range open {
		f, err := src.At([]float64{cands[i].X})
		if err != nil {
			return err
		}
		cands[i].Forces = f[0]
		des, err := d.Design(f[0])
		if err != nil {
			return err
		}
		stats.Sized++
		sh.share(&des)
		cands[i].Design = des
	}
	return nil
}

// scanShared computes the forces at every open position in one envelope pass, then sizes each
// distinct force set once on a bounded pool of workers. The distinct sets are found by
// sorting the positions by their forces (a force set with a NaN, which equals nothing, is
// its own), each sized at the first of its positions.
func scanShared(src Forces, cands []Candidate, open []int, d Designer, workers int, stats *ScanStats) error {
	if len(open) == 0 {
		return nil
	}
	xs := make([]float64, len(open))
	for k, i := range open {
		xs[k] = cands[i].X
	}
	forces, err := src.At(xs)
	if err != nil {
		return err
	}
	for k, i := range open {
		cands[i].Forces = forces[k]
	}
	force := func(k int32) *PositionForces { return &cands[open[k]].Forces }
	order := make([]int32, len(open)) // the open positions by their forces, then in scan order
	for k := range order {
		order[k] = int32(k)
	}
	slices.SortFunc(order, func(a, b int32) int { return cmp.Or(compareForces(force(a), force(b)), cmp.Compare(a, b)) })
	var runs []int32 // where each distinct force set's run of order begins
	for r, k := range order {
		if r == 0 || *force(k) != *force(order[r-1]) {
			runs = append(runs, int32(r))
		}
	}
	// sized in the order of their first positions, each design written to every position of its run
	slices.SortFunc(runs, func(a, b int32) int { return cmp.Compare(order[a], order[b]) })
	stats.Shared += len(open) - len(runs)
	run := func(u int) []int32 {
		end := int(runs[u]) + 1
		for end < len(order) && *force(order[end]) == *force(order[runs[u]]) {
			end++
		}
		return order[runs[u]:end]
	}
	err = designAll(d, len(runs), func(u int) PositionForces { return *force(order[runs[u]]) }, func(u int, des SpliceDesign) {
		for _, k := range run(u) {
			cands[open[k]].Design = des
		}
	}, workers)
	if err != nil {
		return err
	}
	stats.Sized += len(runs)
	return nil
}

// compareForces orders force sets field by field (ULS then SLS: M_max, M_min, V, N_max,
// N_min); equal sets compare 0.
func compareForces(a, b *PositionForces) int {
	return cmp.Or(compareSet(&a.ULS, &b.ULS), compareSet(&a.SLS, &b.SLS))
}

func compareSet(a, b *ForceSet) int {
	return cmp.Or(cmp.Compare(a.MMax, b.MMax), cmp.Compare(a.MMin, b.MMin), cmp.Compare(a.V, b.V),
		cmp.Compare(a.NMax, b.NMax), cmp.Compare(a.NMin, b.NMin))
}

// designAll sizes the force sets 0..n−1, at most workers at a time, and puts each design
// (put is called at once for different sets); the first error wins.
func designAll(d Designer, n int, force func(int) PositionForces, put func(int, SpliceDesign), workers int) error {
	sh := newSharer()
	if workers <= 0 {
		workers = runtime.GOMAXPROCS(0)
	}
	workers = min(workers, n)
	design := func(i int) error {
		des, err := d.Design(force(i))
		if err != nil {
			return err
		}
		sh.share(&des)
		put(i, des)
		return nil
	}
	if workers <= 1 {
		for i := range n {
			if err := design(i); err != nil {
				return err
			}
		}
		return nil
	}
	errs := make([]error, n)
	var wg sync.WaitGroup
	next := make(chan int)
	for w := 0; w < workers; w++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for i := range next {
				errs[i] = design(i)
			}
		}()
	}
	for i := range n {
		next <- i
	}
	close(next)
	wg.Wait()
	for _, err := range errs {
		if err != nil {
			return err
		}
	}
	return nil
}
