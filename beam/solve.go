package beam

import (
	"errors"
	"fmt"
	"math"
	"slices"

	"gonum.org/v1/gonum/mat"
)

// ErrMechanism is returned (wrapped, with the reason) when the beam cannot carry load: too
// few supports, or hinges that turn part of it into a mechanism.
var ErrMechanism = errors.New("the beam is a mechanism")

// pointTol is the distance below which two key points are taken as one [mm].
const pointTol = 1e-6

// pivotLimit is the smallest admissible pivot of the Jacobi-scaled stiffness matrix. A real
// beam gives pivots of 1e-6 or more; a mechanism gives round-off (1e-13 and below).
const pivotLimit = 1e-10

// element is the part of the beam between two consecutive nodes.
type element struct {
	x0, l float64 // start and length [mm]
	// global transverse dofs: v0, θ0 (right side of the start node), v1, θ1 (left side of the end node);
	// -1 for a restrained dof.
	dof [4]int
	u   [2]int // global axial dofs, -1 if restrained
}

// structure is the discretised, factorised beam: nodes at key points only.
type structure struct {
	model Model
	nodes []float64 // node positions [mm], ascending
	elems []element
	vDof  []int   // per node, transverse dof or -1
	thL   []int   // per node, rotation dof seen from the left element (or -1)
	thR   []int   // per node, rotation dof seen from the right element (or -1)
	uDof  []int   // per node, axial dof or -1
	nT    int     // free transverse dofs
	nA    int     // free axial dofs
	bend  *system // transverse stiffness, factorised
	axial *system // axial stiffness, factorised when axial loads exist
}

// nodeIndex returns the index of the node at x, or -1.
func (s *structure) nodeIndex(x float64) int { return keyIndex(s.nodes, x) }

// mergePoints sorts xs and removes points closer than pointTol to their predecessor.
func mergePoints(xs []float64) []float64 {
	slices.Sort(xs)
	out := xs[:0]
	for _, x := range xs {
		if len(out) == 0 || x-out[len(out)-1] > pointTol {
			out = append(out, x)
		}
	}
	return out
}

// newStructure places nodes at the ends, supports and hinges only (loads act inside the
// elements in closed form), numbers the degrees of freedom and factorises the transverse
// stiffness. The model must have passed checkModel.
func newStructure(m Model) (*structure, error) {
	pts := []float64{0, m.Length}
	for _, sp := range m.Supports {
		pts = append(pts, sp.X)
	}
	pts = append(pts, m.Hinges...)
	s := &structure{model: m, nodes: mergePoints(pts)}
	n := len(s.nodes)
	s.vDof, s.thL, s.thR, s.uDof = make([]int, n), make([]int, n), make([]int, n), make([]int, n)
	support := make([]*Support, n)
	for i := range m.Supports {
		support[s.nodeIndex(m.Supports[i].X)] = &m.Supports[i]
	}
	hinge := make([]bool, n)
	for _, h := range m.Hinges {
		hinge[s.nodeIndex(h)] = true
	}
	for i := 0; i < n; i++ {
		sp := support[i]
		s.vDof[i] = -1
		if sp == nil || sp.Kind == Spring {
			s.vDof[i] = s.nT
			s.nT++
		}
		if sp != nil && sp.Kind == Fixed {
			s.thL[i], s.thR[i] = -1, -1
		} else {
			s.thL[i] = s.nT
			s.nT++
			s.thR[i] = s.thL[i]
			if hinge[i] {
				s.thR[i] = s.nT
				s.nT++
			}
		}
		s.uDof[i] = -1
		if sp == nil || sp.Kind == Roller || sp.Kind == Spring {
			s.uDof[i] = s.nA
			s.nA++
		}
	}
	s.elems = make([]element, n-1)
	for i := range s.elems {
		s.elems[i] = element{
			x0:  s.nodes[i],
			l:   s.nodes[i+1] - s.nodes[i],
			dof: [4]int{s.vDof[i], s.thR[i], s.vDof[i+1], s.thL[i+1]},
			u:   [2]int{s.uDof[i], s.uDof[i+1]},
		}
	}
	if err := s.factoriseBending(support); err != nil {
		return nil, err
	}
	return s, nil
}

// checkModel rejects models that cannot be discretised.
func checkModel(m Model) error {
	var errs []error
	if !(m.Length > 0) || math.IsInf(m.Length, 0) {
		errs = append(errs, fmt.Errorf("beam length must be positive and finite, got %g mm", m.Length))
	}
	if !(m.EI > 0) || math.IsInf(m.EI, 0) || !(m.EA > 0) || math.IsInf(m.EA, 0) {
		errs = append(errs, fmt.Errorf("bending and axial stiffness must be positive and finite (EI %g, EA %g)", m.EI, m.EA))
	}
	if len(m.Supports) == 0 {
		errs = append(errs, fmt.Errorf("%w: no supports", ErrMechanism))
	}
	for i, sp := range m.Supports {
		if !(sp.X >= 0 && sp.X <= m.Length) {
			errs = append(errs, fmt.Errorf("support %d at x = %g mm is off the beam (0 to %g mm)", i+1, sp.X, m.Length))
		}
		if i > 0 && sp.X-m.Supports[i-1].X <= pointTol {
			errs = append(errs, fmt.Errorf("supports %d and %d are not in ascending order of x, or share one position (x = %g mm)", i, i+1, sp.X))
		}
		if sp.Kind == Spring && (!(sp.K > 0) || math.IsInf(sp.K, 0)) {
			errs = append(errs, fmt.Errorf("spring support %d needs a positive finite stiffness, got %g N/mm", i+1, sp.K))
		}
	}
	for i, h := range m.Hinges {
		if !(h > pointTol && h < m.Length-pointTol) {
			errs = append(errs, fmt.Errorf("hinge %d at x = %g mm must lie strictly inside the beam", i+1, h))
		}
		for _, sp := range m.Supports {
			if sp.Kind == Fixed && math.Abs(sp.X-h) <= pointTol {
				errs = append(errs, fmt.Errorf("hinge %d at x = %g mm coincides with a fixed support", i+1, h))
			}
		}
		for j := 0; j < i; j++ {
			if math.Abs(m.Hinges[j]-h) <= pointTol {
				errs = append(errs, fmt.Errorf("hinges %d and %d share one position (x = %g mm)", j+1, i+1, h))
			}
		}
	}
	return errors.Join(errs...)
}

// beamStiffness is the Euler–Bernoulli element stiffness for dofs (v0, θ0, v1, θ1),
// v positive up and θ anticlockwise.
func beamStiffness(ei, l float64) [4][4]float64 {
	a, b, c, d := 12*ei/(l*l*l), 6*ei/(l*l), 4*ei/l, 2*ei/l
	return [4][4]float64{
		{a, b, -a, b},
		{b, c, -b, d},
		{-a, -b, a, -b},
		{b, d, -b, c},
	}
}

// factoriseBending assembles the transverse stiffness on the free dofs, scales it to a unit
// diagonal and factorises it; a failed or near-singular factorisation is a mechanism.
func (s *structure) factoriseBending(support []*Support) error {
	if s.nT == 0 {
		return nil
	}
	k := mat.NewSymDense(s.nT, nil)
	for _, e := range s.elems {
		ke := beamStiffness(s.model.EI, e.l)
		for i := 0; i < 4; i++ {
			if e.dof[i] < 0 {
				continue
			}
			for j := i; j < 4; j++ {
				if e.dof[j] < 0 {
					continue
				}
				r, c := e.dof[i], e.dof[j]
				if r > c {
					r, c = c, r
				}
				k.SetSym(r, c, k.At(r, c)+ke[i][j])
			}
		}
	}
	for i, sp := range support {
		if sp != nil && sp.Kind == Spring {
			d := s.vDof[i]
			k.SetSym(d, d, k.At(d, d)+sp.K)
		}
	}
	sys, err := factoriseScaled(k)
	if err != nil {
		return fmt.Errorf("%w: %s", ErrMechanism, mechanismReason(s.model))
	}
	s.bend = sys
	return nil
}

// system is a factorised symmetric positive definite stiffness system.
type system struct {
	k     *mat.SymDense // the unscaled matrix, kept for residuals
	chol  mat.Cholesky  // factor of D·K·D
	scale []float64     // D = diag(1/√Kii)
}

// factoriseScaled factorises D·K·D with D = diag(1/√Kii) and rejects small pivots.
func factoriseScaled(k *mat.SymDense) (*system, error) {
	n := k.SymmetricDim()
	sys := &system{k: k, scale: make([]float64, n)}
	for i := 0; i < n; i++ {
		d := k.At(i, i)
		if !(d > 0) {
			return nil, errors.New("zero stiffness on a degree of freedom")
		}
		sys.scale[i] = 1 / math.Sqrt(d)
	}
	ks := mat.NewSymDense(n, nil)
	for i := 0; i < n; i++ {
		for j := i; j < n; j++ {
			ks.SetSym(i, j, k.At(i, j)*sys.scale[i]*sys.scale[j])
		}
	}
	if !sys.chol.Factorize(ks) {
		return nil, errors.New("stiffness matrix is not positive definite")
	}
	u := sys.chol.RawU()
	for i := 0; i < n; i++ {
		if p := u.At(i, i); p*p < pivotLimit {
			return nil, errors.New("stiffness matrix is singular")
		}
	}
	return sys, nil
}

// solve returns X with K X = B for every column of B. Two steps of iterative refinement
// bring the residual, and so nodal equilibrium, down to round-off.
func (sys *system) solve(b *mat.Dense) (*mat.Dense, error) {
	x, err := sys.solveOnce(b)
	if err != nil {
		return nil, err
	}
	var r mat.Dense
	for step := 0; step < 2; step++ {
		r.Mul(sys.k, x)
		r.Sub(b, &r)
		dx, err := sys.solveOnce(&r)
		if err != nil {
			return nil, err
		}
		x.Add(x, dx)
	}
	return x, nil
}

func (sys *system) solveOnce(b *mat.Dense) (*mat.Dense, error) {
	r, c := b.Dims()
	bs := mat.NewDense(r, c, nil)
	for i := 0; i < r; i++ {
		for j := 0; j < c; j++ {
			bs.Set(i, j, b.At(i, j)*sys.scale[i])
		}
	}
	var x mat.Dense
	if err := sys.chol.SolveTo(&x, bs); err != nil {
		return nil, err
	}
	for i := 0; i < r; i++ {
		for j := 0; j < c; j++ {
			x.Set(i, j, x.At(i, j)*sys.scale[i])
		}
	}
	return &x, nil
}

// mechanismReason explains in words why a model is kinematically unstable, as far as a
// count of restraints can tell.
func mechanismReason(m Model) string {
	restraints := 0
	for _, sp := range m.Supports {
		restraints++
		if sp.Kind == Fixed {
			restraints++
		}
	}
	need := 2 + len(m.Hinges)
	if restraints < need {
		return fmt.Sprintf("%d support restraint(s) against %d needed (2 plus one per hinge)", restraints, need)
	}
	return "a part of the beam between hinges is not held against moving or rotating"
}

// factoriseAxial assembles and factorises the axial bar system. It is needed only when axial
// loads exist; a beam with no horizontal restraint then cannot carry them.
func (s *structure) factoriseAxial() error {
	if s.axial != nil {
		return nil
	}
	if s.nA == len(s.nodes) {
		return errors.New("axial load on a beam with no horizontal restraint: make one support pinned or fixed")
	}
	if s.nA == 0 {
		return nil
	}
	k := mat.NewSymDense(s.nA, nil)
	for _, e := range s.elems {
		ka := s.model.EA / e.l
		for i := 0; i < 2; i++ {
			for j := i; j < 2; j++ {
				r, c := e.u[i], e.u[j]
				if r < 0 || c < 0 {
					continue
				}
				v := ka
				if i != j {
					v = -ka
				}
				if r > c {
					r, c = c, r
				}
				k.SetSym(r, c, k.At(r, c)+v)
			}
		}
	}
	sys, err := factoriseScaled(k)
	if err != nil {
		return fmt.Errorf("axial system: %v", err)
	}
	s.axial = sys
	return nil
}
