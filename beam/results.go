package beam

import (
	"fmt"
	"math"
	"sort"
)

// MaxStations bounds the stations of one call to Stations, so that a tiny step fails with a
// message instead of exhausting memory (a million stations hold the envelopes of a 1 km beam
// every millimetre).
const MaxStations = 1_000_000

// Stations returns evaluation points every step [mm] from 0 to the beam length, plus every
// node (supports, hinges, load starts and ends). Where a jump can occur (support, point
// force, couple or axial force) the node appears twice: its left value, then its right value.
func (a *Analysis) Stations(step float64) ([]Station, error) {
	if !(step > 0) || math.IsInf(step, 0) {
		return nil, fmt.Errorf("station step must be positive, got %g mm", step)
	}
	l := a.s.model.Length
	n := int(math.Floor(l/step + 1e-9))
	if n > MaxStations {
		return nil, fmt.Errorf("station step %g mm gives %d stations; use a larger step", step, n)
	}
	xs := make([]float64, 0, n+2+len(a.keys))
	for i := 0; i <= n; i++ {
		xs = append(xs, float64(i)*step)
	}
	xs = append(xs, a.keys...)
	return a.stationsFor(mergePoints(xs)), nil
}

// StationsAt returns the stations for the given positions [mm], both sides at jumps, in the
// order given.
func (a *Analysis) StationsAt(xs []float64) ([]Station, error) {
	l := a.s.model.Length
	var st []Station
	for _, x := range xs {
		if !(x >= -pointTol && x <= l+pointTol) {
			return nil, fmt.Errorf("position %g mm is off the beam (0 to %g mm)", x, l)
		}
		st = append(st, a.stationsFor([]float64{math.Min(math.Max(x, 0), l)})...)
	}
	return st, nil
}

func (a *Analysis) stationsFor(xs []float64) []Station {
	l := a.s.model.Length
	st := make([]Station, 0, len(xs)+8)
	for _, x := range xs {
		i := keyIndex(a.keys, x)
		switch {
		case i >= 0 && a.jump[i] && x > pointTol && x < l-pointTol:
			st = append(st, Station{X: x, Side: Left}, Station{X: x, Side: Right})
		case x >= l-pointTol:
			st = append(st, Station{X: l, Side: Left})
		default:
			st = append(st, Station{X: x, Side: Right})
		}
	}
	return st
}

// locate returns the element holding a station and the distance into it.
func (a *Analysis) locate(st Station) (int, float64) {
	nodes := a.s.nodes
	ne := len(a.s.elems)
	// first node strictly greater than x (within tolerance)
	j := sort.Search(len(nodes), func(k int) bool { return nodes[k] > st.X+pointTol })
	e := j - 1
	if e >= ne {
		e = ne - 1
	}
	if e < 0 {
		e = 0
	}
	if st.Side == Left && e > 0 && math.Abs(nodes[e]-st.X) <= pointTol {
		e--
	}
	t := st.X - a.s.elems[e].x0
	return e, math.Min(math.Max(t, 0), a.s.elems[e].l)
}

// Effects are the internal forces and deflection of one load set at a list of stations.
type Effects struct {
	M []float64 // bending moment, sagging positive [N·mm]
	V []float64 // shear, V = dM/dx [N]
	N []float64 // axial force, tension positive [N]
	W []float64 // deflection, downward positive [mm]
}

func newEffects(n int) Effects {
	return Effects{M: make([]float64, n), V: make([]float64, n), N: make([]float64, n), W: make([]float64, n)}
}

// CaseResult is one unfactored load case at a list of stations.
type CaseResult struct {
	Case      string
	Stations  []Station
	Effects   Effects
	Reactions []Reaction
}

// CaseResult evaluates one whole load case (all regions, unfactored). A value that is not a
// finite number is a *NonFiniteError.
func (a *Analysis) CaseResult(name string, st []Station) (CaseResult, error) {
	k := -1
	for i, c := range a.cases {
		if c.Name == name {
			k = i
		}
	}
	if k < 0 {
		names := make([]string, len(a.cases))
		for i, c := range a.cases {
			names[i] = c.Name
		}
		return CaseResult{}, fmt.Errorf("no load case %q (cases: %v)", name, names)
	}
	r := CaseResult{Case: name, Stations: st, Effects: newEffects(len(st))}
	ei := a.s.model.EI
	for i, s := range st {
		e, t := a.locate(s)
		for _, c := range a.caseCols[k] {
			m, v, n, w := a.cols[c].el[e].at(t, s.Side, ei)
			r.Effects.M[i] += m
			r.Effects.V[i] += v
			r.Effects.N[i] += n
			r.Effects.W[i] += w
		}
		ef := &r.Effects
		if q := firstNonFinite(ef.M[i], ef.V[i], ef.N[i], ef.W[i]); q >= 0 {
			return CaseResult{}, &NonFiniteError{Case: name, Load: a.culprit(k, []Station{s}), Quantity: stationQuantity(q), X: s.X}
		}
	}
	for si, sp := range a.s.model.Supports {
		rc := Reaction{X: sp.X}
		for _, c := range a.caseCols[k] {
			rr := a.cols[c].reactions[si]
			rc.Fz += rr.Fz
			rc.Fx += rr.Fx
			rc.My += rr.My
		}
		if firstNonFinite(rc.Fz, rc.Fx, rc.My) >= 0 {
			return CaseResult{}, &NonFiniteError{Case: name, Load: a.culprit(k, nil), Quantity: ReactionQuantity, X: sp.X}
		}
		r.Reactions = append(r.Reactions, rc)
	}
	return r, nil
}
