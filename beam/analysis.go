package beam

import (
	"errors"
	"fmt"
	"math"
	"sort"

	"gonum.org/v1/gonum/mat"
)

// MaxRegions is the largest number of pattern regions (spans plus overhangs) a beam may have.
const MaxRegions = 64

// Region is one span or overhang: the unit of pattern loading.
type Region struct {
	Name     string  // "left overhang", "span 1", ..., "right overhang"
	From, To float64 // [mm]
}

// Side says which side of a station's x a value belongs to; it matters only at jumps.
type Side int

const (
	Right Side = iota // the value just right of x (the default)
	Left              // the value just left of x
)

// Station is a point where results are evaluated.
type Station struct {
	X    float64 // [mm]
	Side Side
}

// Reaction is a support reaction: Fz upward [N], Fx along +x [N], My clockwise [N·mm].
type Reaction struct {
	X          float64 // support position [mm]
	Fz, Fx, My float64
}

// piece is one load acting inside an element, positioned from the element start.
type piece struct {
	kind  LoadKind
	a, b  float64 // start and end [mm] from the element start (b only for distributed)
	q1, k float64 // distributed: intensity at a [N/mm] and gradient [N/mm²], downward
	p     float64 // point force [N], clockwise couple [N·mm] or axial force along +x [N]
}

// elemState is one load column's solution on one element, enough to evaluate the exact
// internal forces and deflection anywhere inside it.
type elemState struct {
	m0, v0 float64 // internal moment [N·mm] and shear [N] just right of the element start
	w0, p0 float64 // deflection [mm] (downward) and slope dw/dx at the start
	n0     float64 // axial force just right of the start [N], tension positive
	loads  []piece
}

// column is the solution of one set of loads (a case, or one region's share of a case).
type column struct {
	el        []elemState
	reactions []Reaction
}

// Analysis is a solved beam: every load case (patterned cases region by region) solved once,
// so results at any station and envelopes over any combinations follow by superposition.
// It is immutable after NewAnalysis and safe for concurrent use.
type Analysis struct {
	s        *structure
	cases    []Case
	regions  []Region
	keys     []float64 // key points: nodes, load starts and ends, point actions [mm]
	jump     []bool    // per key point: a support or a point action sits there
	cols     []column
	caseCols [][]int // per case, its column indices (one per region for patterned cases)
}

// Regions lists the pattern regions of the beam, left to right.
func (a *Analysis) Regions() []Region { return append([]Region(nil), a.regions...) }

// Cases returns the load cases the analysis was built with.
func (a *Analysis) Cases() []Case { return append([]Case(nil), a.cases...) }

// Model returns the analysed model.
func (a *Analysis) Model() Model { return a.s.model }

// NewAnalysis discretises the beam, checks every load and solves each case. Cases keep
// their order; a patterned case is solved once per region. A case whose results are not
// finite numbers at any key point (loads too large for float64) is a *NonFiniteError.
func NewAnalysis(m Model, cases []Case) (*Analysis, error) {
	if err := errors.Join(checkModel(m), checkCases(m, cases)); err != nil {
		return nil, err
	}
	regions := regionsOf(m)
	if len(regions) > MaxRegions {
		return nil, fmt.Errorf("the beam has %d spans and overhangs; at most %d are supported", len(regions), MaxRegions)
	}
	s, err := newStructure(m)
	if err != nil {
		return nil, err
	}
	a := &Analysis{s: s, cases: append([]Case(nil), cases...), regions: regions}
	a.keyPoints()
	var loadSets [][]Load
	for _, c := range cases {
		var idx []int
		if c.Pattern {
			for _, r := range regions {
				idx = append(idx, len(loadSets))
				loadSets = append(loadSets, loadsInRegion(c.Loads, r, m.Length))
			}
		} else {
			idx = append(idx, len(loadSets))
			loadSets = append(loadSets, c.Loads)
		}
		a.caseCols = append(a.caseCols, idx)
	}
	cols, err := s.solve(loadSets)
	if err != nil {
		return nil, err
	}
	a.cols = cols
	if err := a.checkFinite(); err != nil {
		return nil, err
	}
	return a, nil
}

// keyPoints collects the nodes and every load's start and end, marking where a value can
// jump (supports and point actions), so that stations never miss a peak or a jump.
func (a *Analysis) keyPoints() {
	xs := append([]float64(nil), a.s.nodes...)
	var jumps []float64
	for _, sp := range a.s.model.Supports {
		jumps = append(jumps, sp.X)
	}
	for _, c := range a.cases {
		for _, l := range c.Loads {
			xs = append(xs, l.X1)
			if l.Kind == Distributed {
				xs = append(xs, l.X2)
			} else {
				jumps = append(jumps, l.X1)
			}
		}
	}
	a.keys = mergePoints(xs)
	a.jump = make([]bool, len(a.keys))
	for _, x := range jumps {
		if i := keyIndex(a.keys, x); i >= 0 {
			a.jump[i] = true
		}
	}
}

// keyIndex returns the index of x in the sorted points, or -1.
func keyIndex(pts []float64, x float64) int {
	i := sort.SearchFloat64s(pts, x-pointTol)
	if i < len(pts) && math.Abs(pts[i]-x) <= pointTol {
		return i
	}
	return -1
}

// checkCases validates names, kinds and load positions and values.
func checkCases(m Model, cases []Case) error {
	var errs []error
	seen := map[string]bool{}
	if len(cases) == 0 {
		errs = append(errs, errors.New("no load cases"))
	}
	for _, c := range cases {
		if c.Name == "" {
			errs = append(errs, errors.New("a load case has no name"))
		}
		if seen[c.Name] {
			errs = append(errs, fmt.Errorf("load case %q is defined twice", c.Name))
		}
		seen[c.Name] = true
		for i, l := range c.Loads {
			if err := checkLoad(m, l); err != nil {
				errs = append(errs, fmt.Errorf("case %s, load %d: %w", c.Name, i+1, err))
			}
		}
	}
	return errors.Join(errs...)
}

func finite(v ...float64) bool {
	for _, x := range v {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return false
		}
	}
	return true
}

func checkLoad(m Model, l Load) error {
	if !finite(l.X1, l.X2, l.W1, l.W2, l.P) {
		return errors.New("load values must be finite numbers")
	}
	on := func(x float64) bool { return x >= -pointTol && x <= m.Length+pointTol }
	switch l.Kind {
	case Distributed:
		if !on(l.X1) || !on(l.X2) {
			return fmt.Errorf("distributed load from %g to %g mm is off the beam (0 to %g mm)", l.X1, l.X2, m.Length)
		}
		if !(l.X2-l.X1 > pointTol) {
			return fmt.Errorf("distributed load must end after it starts (from %g to %g mm)", l.X1, l.X2)
		}
	case PointForce, PointMoment, AxialForce:
		if !on(l.X1) {
			return fmt.Errorf("point load at %g mm is off the beam (0 to %g mm)", l.X1, m.Length)
		}
		if l.Kind == PointMoment {
			for _, h := range m.Hinges {
				if math.Abs(h-l.X1) <= pointTol {
					return fmt.Errorf("point moment at %g mm acts on a hinge: move it to one side", l.X1)
				}
			}
		}
	default:
		return fmt.Errorf("unknown load kind %d", l.Kind)
	}
	return nil
}

// regionsOf splits the beam into overhangs and spans.
func regionsOf(m Model) []Region {
	var rs []Region
	first, last := m.Supports[0].X, m.Supports[len(m.Supports)-1].X
	if first > pointTol {
		rs = append(rs, Region{Name: "left overhang", From: 0, To: first})
	}
	for i := 1; i < len(m.Supports); i++ {
		rs = append(rs, Region{Name: fmt.Sprintf("span %d", i), From: m.Supports[i-1].X, To: m.Supports[i].X})
	}
	if m.Length-last > pointTol {
		rs = append(rs, Region{Name: "right overhang", From: last, To: m.Length})
	}
	if len(rs) == 0 { // unreachable for a checked model (length > 0); kept so rs is never empty
		rs = append(rs, Region{Name: "beam", From: 0, To: m.Length})
	}
	return rs
}

// loadsInRegion returns the part of the loads acting on region r. A point action exactly on
// a region boundary belongs to the region on its right (on its left at the beam's right end).
func loadsInRegion(loads []Load, r Region, length float64) []Load {
	var out []Load
	for _, l := range loads {
		if l.Kind == Distributed {
			a, b := math.Max(l.X1, r.From), math.Min(l.X2, r.To)
			if b-a <= pointTol {
				continue
			}
			w := func(x float64) float64 { return l.W1 + (l.W2-l.W1)*(x-l.X1)/(l.X2-l.X1) }
			out = append(out, Load{Kind: Distributed, X1: a, X2: b, W1: w(a), W2: w(b)})
			continue
		}
		x := l.X1
		inside := x >= r.From-pointTol && x < r.To-pointTol
		if r.To >= length-pointTol && x >= length-pointTol {
			inside = true
		}
		if inside {
			out = append(out, l)
		}
	}
	return out
}

// solve finds each load set's element states and reactions.
func (s *structure) solve(sets [][]Load) ([]column, error) {
	nc := len(sets)
	bT := mat.NewDense(max(s.nT, 1), max(nc, 1), nil)
	bA := mat.NewDense(max(s.nA, 1), max(nc, 1), nil)
	cols := make([]column, nc)
	ext := make([]nodalLoads, nc)
	needAxial := false
	for c, set := range sets {
		cols[c].el = make([]elemState, len(s.elems))
		ext[c] = newNodalLoads(len(s.nodes))
		for _, l := range set {
			if l.Kind == AxialForce {
				needAxial = true
			}
			s.place(l, cols[c].el, ext[c])
		}
		s.loadVectors(bT, bA, c, cols[c].el, ext[c])
	}
	var dT, dA *mat.Dense
	var err error
	if s.nT > 0 {
		if dT, err = s.bend.solve(bT); err != nil {
			return nil, fmt.Errorf("%w: %v", ErrMechanism, err)
		}
	}
	if needAxial {
		if err := s.factoriseAxial(); err != nil {
			return nil, err
		}
		if s.nA > 0 {
			if dA, err = s.axial.solve(bA); err != nil {
				return nil, fmt.Errorf("axial system: %v", err)
			}
		}
	}
	for c := range sets {
		s.recover(&cols[c], c, dT, dA, ext[c])
	}
	return cols, nil
}

// nodalLoads are point actions that sit exactly on a node.
type nodalLoads struct {
	p, c, h []float64 // per node: downward force [N], clockwise couple [N·mm], axial force [N]
}

func newNodalLoads(n int) nodalLoads {
	return nodalLoads{p: make([]float64, n), c: make([]float64, n), h: make([]float64, n)}
}

// place splits a load into the elements it acts on (or onto a node).
func (s *structure) place(l Load, el []elemState, ext nodalLoads) {
	if l.Kind == Distributed {
		w := func(x float64) float64 { return l.W1 + (l.W2-l.W1)*(x-l.X1)/(l.X2-l.X1) }
		for i, e := range s.elems {
			a, b := math.Max(l.X1, e.x0), math.Min(l.X2, e.x0+e.l)
			if b-a <= pointTol {
				continue
			}
			q1, q2 := w(a), w(b)
			el[i].loads = append(el[i].loads, piece{kind: Distributed, a: a - e.x0, b: b - e.x0, q1: q1, k: (q2 - q1) / (b - a)})
		}
		return
	}
	if n := s.nodeIndex(l.X1); n >= 0 {
		switch l.Kind {
		case PointForce:
			ext.p[n] += l.P
		case PointMoment:
			ext.c[n] += l.P
		case AxialForce:
			ext.h[n] += l.P
		}
		return
	}
	i := sort.Search(len(s.elems), func(k int) bool { return s.elems[k].x0+s.elems[k].l > l.X1 })
	el[i].loads = append(el[i].loads, piece{kind: l.Kind, a: l.X1 - s.elems[i].x0, p: l.P})
}

// fixedEnd returns the fixed-end forces of a fully fixed element of length l under its
// loads: end shears up and end couples anticlockwise, for dofs (v0, θ0, v1, θ1).
// Point force P at a (standard beam tables): F1 = P(l−a)²(l+2a)/l³, M1 = Pa(l−a)²/l²,
// F2 = Pa²(3l−2a)/l³, M2 = −Pa²(l−a)/l². A clockwise couple is the derivative of these with
// respect to a; a distributed load is their integral, taken by 3-point Gauss–Legendre
// quadrature, exact for the quartic integrand.
func fixedEnd(l float64, loads []piece) [4]float64 {
	var f [4]float64
	pointKernel := func(p, a float64) {
		b := l - a
		f[0] += p * b * b * (l + 2*a) / (l * l * l)
		f[1] += p * a * b * b / (l * l)
		f[2] += p * a * a * (l + 2*b) / (l * l * l)
		f[3] -= p * a * a * b / (l * l)
	}
	for _, pc := range loads {
		switch pc.kind {
		case PointForce:
			pointKernel(pc.p, pc.a)
		case PointMoment:
			a, b, c := pc.a, l-pc.a, pc.p
			f[0] -= 6 * c * a * b / (l * l * l)
			f[1] += c * b * (l - 3*a) / (l * l)
			f[2] += 6 * c * a * b / (l * l * l)
			f[3] -= c * a * (2*l - 3*a) / (l * l)
		case Distributed:
			h, m := (pc.b-pc.a)/2, (pc.a+pc.b)/2
			for g := 0; g < 3; g++ {
				x := m + h*gaussX[g]
				pointKernel(h*gaussW[g]*(pc.q1+pc.k*(x-pc.a)), x)
			}
		}
	}
	return f
}

// Three-point Gauss–Legendre abscissae and weights on [−1, 1].
var (
	gaussX = [3]float64{-0.7745966692414834, 0, 0.7745966692414834}
	gaussW = [3]float64{5.0 / 9, 8.0 / 9, 5.0 / 9}
)

// loadVectors writes column c of the transverse (v up, θ anticlockwise) and axial right-hand sides.
func (s *structure) loadVectors(bT, bA *mat.Dense, c int, el []elemState, ext nodalLoads) {
	add := func(b *mat.Dense, d int, v float64) {
		if d >= 0 && v != 0 {
			b.Set(d, c, b.At(d, c)+v)
		}
	}
	for i, e := range s.elems {
		if len(el[i].loads) == 0 {
			continue
		}
		fe := fixedEnd(e.l, el[i].loads)
		for k := 0; k < 4; k++ {
			add(bT, e.dof[k], -fe[k])
		}
		for _, pc := range el[i].loads {
			if pc.kind == AxialForce {
				add(bA, e.u[0], pc.p*(e.l-pc.a)/e.l)
				add(bA, e.u[1], pc.p*pc.a/e.l)
			}
		}
	}
	for i := range s.nodes {
		add(bT, s.vDof[i], -ext.p[i])
		add(bT, s.thL[i], -ext.c[i]) // thL == thR away from hinges; couples at hinges are rejected
		add(bA, s.uDof[i], ext.h[i])
	}
}

// recover turns nodal displacements into element states and support reactions.
func (s *structure) recover(col *column, c int, dT, dA *mat.Dense, ext nodalLoads) {
	disp := func(m *mat.Dense, d int) float64 {
		if d < 0 || m == nil {
			return 0
		}
		return m.At(d, c)
	}
	for i, e := range s.elems {
		st := &col.el[i]
		d := [4]float64{disp(dT, e.dof[0]), disp(dT, e.dof[1]), disp(dT, e.dof[2]), disp(dT, e.dof[3])}
		ke := beamStiffness(s.model.EI, e.l)
		fe := fixedEnd(e.l, st.loads)
		f0, f1 := fe[0], fe[1]
		for k := 0; k < 4; k++ {
			f0 += ke[0][k] * d[k]
			f1 += ke[1][k] * d[k]
		}
		st.v0, st.m0, st.w0, st.p0 = f0, -f1, -d[0], -d[1]
		if dA != nil {
			st.n0 = s.model.EA * (disp(dA, e.u[1]) - disp(dA, e.u[0])) / e.l
			for _, pc := range st.loads {
				if pc.kind == AxialForce {
					st.n0 += pc.p * (e.l - pc.a) / e.l
				}
			}
		}
	}
	for _, sp := range s.model.Supports {
		i := s.nodeIndex(sp.X)
		var vl, vr, ml, mr, nl, nr float64
		if i > 0 {
			ml, vl, nl, _ = col.el[i-1].at(s.elems[i-1].l, Left, s.model.EI)
		}
		if i < len(s.elems) {
			e := &col.el[i]
			mr, vr, nr = e.m0, e.v0, e.n0
		}
		col.reactions = append(col.reactions, Reaction{
			X:  sp.X,
			Fz: vr - vl + ext.p[i],
			Fx: nl - nr - ext.h[i],
			My: -(ml - mr + ext.c[i]),
		})
	}
}

// at evaluates moment [N·mm], shear [N], axial force [N] and deflection [mm] at distance t
// from the element start, in closed form. A point action exactly at t counts only on the
// Right side.
func (e *elemState) at(t float64, side Side, ei float64) (m, v, n, w float64) {
	t2 := t * t
	v = e.v0
	m = e.m0 + e.v0*t
	d := e.m0*t2/2 + e.v0*t2*t/6 // ∫∫M, built up with the loads below
	n = e.n0
	for i := range e.loads {
		pc := &e.loads[i]
		if pc.kind == Distributed {
			if t <= pc.a {
				continue
			}
			dv, dm, dd := distributedIntegrals(t-pc.a, pc.q1, pc.k)
			if t > pc.b {
				ev, em, ed := distributedIntegrals(t-pc.b, pc.q1+pc.k*(pc.b-pc.a), pc.k)
				dv, dm, dd = dv-ev, dm-em, dd-ed
			}
			v, m, d = v-dv, m-dm, d-dd
			continue
		}
		s := t - pc.a
		if s < -pointTol || (s <= pointTol && side == Left) {
			continue
		}
		s = math.Max(s, 0)
		switch pc.kind {
		case PointForce:
			v -= pc.p
			m -= pc.p * s
			d -= pc.p * s * s * s / 6
		case PointMoment:
			m += pc.p
			d += pc.p * s * s / 2
		case AxialForce:
			n -= pc.p
		}
	}
	w = e.w0 + e.p0*t - d/ei
	return m, v, n, w
}

// distributedIntegrals returns ∫q, ∫∫q and ∫∫∫∫q over a length s of a load q1 + k·x.
func distributedIntegrals(s, q1, k float64) (float64, float64, float64) {
	s2 := s * s
	return q1*s + k*s2/2, q1*s2/2 + k*s2*s/6, q1*s2*s2/24 + k*s2*s2*s/120
}

// ModelRegions returns the spans and overhangs of a model with at least one support, left to
// right: the regions an analysis patterns loads over and checks deflections in.
func ModelRegions(m Model) []Region {
	if len(m.Supports) == 0 {
		return nil
	}
	return regionsOf(m)
}
