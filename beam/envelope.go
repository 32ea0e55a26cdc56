package beam

import (
	"errors"
	"fmt"
	"math"
	"strings"
)

// Extreme is one envelope value with the combination and pattern that produce it.
type Extreme struct {
	Value       float64 // in the quantity's unit (N·mm, N or mm)
	Combination int     // index into Envelopes.Combinations; -1 when no combination of the state exists
	// Loaded holds, per patterned case (in the order of Envelopes.Patterned), a bit mask of the
	// regions that carry the case's adverse factor: bit r set means region r is loaded.
	Loaded []uint64
}

// Envelope is the max/min of each internal force and the deflection along the beam for one
// limit state, one value per station.
type Envelope struct {
	State      LimitState
	MMax, MMin []Extreme // bending moment [N·mm]
	VMax, VMin []Extreme // shear [N]
	NMax, NMin []Extreme // axial force [N]
	WMax, WMin []Extreme // deflection [mm]
}

// ReactionEnvelope is the max/min reaction at one support for one limit state.
type ReactionEnvelope struct {
	X            float64 // support position [mm]
	FzMax, FzMin Extreme // upward force [N]; FzMin < 0 is uplift
	FxMax, FxMin Extreme // horizontal force [N]
	MyMax, MyMin Extreme // clockwise couple [N·mm]
}

// Envelopes are the exact ULS and SLS envelopes over every combination and every span-by-span
// pattern of the patterned cases.
type Envelopes struct {
	Stations     []Station
	Combinations []Combination
	Patterned    []string // names of the patterned cases, the order of Extreme.Loaded
	Regions      []Region
	ULS, SLS     Envelope
	ULSReactions []ReactionEnvelope
	SLSReactions []ReactionEnvelope
}

// quantities evaluated at a station, in this order.
const (
	qM = iota
	qV
	qN
	qW
	nStationQ
)

// quantities evaluated at a support.
const (
	qFz = iota
	qFx
	qMy
	nReactionQ
)

// combTable holds each combination's factors by case index: hi applies to the part of a
// case that raises the value, lo to the part that lowers it, when seeking a maximum.
type combTable struct {
	hi, lo    [][]float64 // [combination][case]
	adverseHi [][]bool    // [combination][case]: the adverse factor is the larger one
}

func (a *Analysis) combTable(combos []Combination) (combTable, error) {
	index := map[string]int{}
	for i, c := range a.cases {
		index[c.Name] = i
	}
	var errs []error
	t := combTable{}
	for _, cb := range combos {
		hi := make([]float64, len(a.cases))
		lo := make([]float64, len(a.cases))
		adv := make([]bool, len(a.cases))
		for _, f := range cb.Factors {
			k, ok := index[f.Case]
			if !ok {
				errs = append(errs, fmt.Errorf("combination %q names load case %q, which is not defined", cb.Name, f.Case))
				continue
			}
			if !finite(f.Adverse, f.Relieving) || f.Adverse < 0 || f.Relieving < 0 {
				errs = append(errs, fmt.Errorf("combination %q: factors on %q must be finite and not negative (%g, %g)", cb.Name, f.Case, f.Adverse, f.Relieving))
				continue
			}
			hi[k], lo[k] = math.Max(f.Adverse, f.Relieving), math.Min(f.Adverse, f.Relieving)
			adv[k] = f.Adverse >= f.Relieving
		}
		t.hi, t.lo, t.adverseHi = append(t.hi, hi), append(t.lo, lo), append(t.adverseHi, adv)
	}
	return t, errors.Join(errs...)
}

// accumulator gathers, for one station or support, each case's positive and negative parts
// (region by region for patterned cases) and the regions they come from.
type accumulator struct {
	nq       int
	pos, neg []float64 // [case*nq + q]
	pMask    []uint64  // [case*nq + q] regions with a positive share
	nMask    []uint64
}

func newAccumulator(cases, nq int) *accumulator {
	return &accumulator{nq: nq, pos: make([]float64, cases*nq), neg: make([]float64, cases*nq),
		pMask: make([]uint64, cases*nq), nMask: make([]uint64, cases*nq)}
}

func (ac *accumulator) reset() {
	clear(ac.pos)
	clear(ac.neg)
	clear(ac.pMask)
	clear(ac.nMask)
}

func (ac *accumulator) add(k, q int, region int, v float64) {
	i := k*ac.nq + q
	if v > 0 {
		ac.pos[i] += v
		ac.pMask[i] |= 1 << uint(region)
	} else if v < 0 {
		ac.neg[i] += v
		ac.nMask[i] |= 1 << uint(region)
	}
}

// envelopeBuilder turns accumulated parts into extremes for every combination of one state.
type envelopeBuilder struct {
	a         *Analysis
	combos    []Combination
	tab       combTable
	patterned []int // case indices of the patterned cases
}

// extremes writes the max and min over the combinations of the state into mx and mn for
// quantity q. loadedMax and loadedMin receive the region masks (len = patterned cases).
func (b *envelopeBuilder) extremes(ac *accumulator, state LimitState, q int, mx, mn *Extreme) {
	mx.Value, mn.Value = math.Inf(-1), math.Inf(1)
	mx.Combination, mn.Combination = -1, -1
	nc := len(b.a.cases)
	for c, cb := range b.combos {
		if cb.State != state {
			continue
		}
		hi, lo := b.tab.hi[c], b.tab.lo[c]
		vmax, vmin := 0.0, 0.0
		for k := 0; k < nc; k++ {
			i := k*ac.nq + q
			vmax += hi[k]*ac.pos[i] + lo[k]*ac.neg[i]
			vmin += lo[k]*ac.pos[i] + hi[k]*ac.neg[i]
		}
		if vmax > mx.Value {
			mx.Value, mx.Combination = vmax, c
		}
		if vmin < mn.Value {
			mn.Value, mn.Combination = vmin, c
		}
	}
	if mx.Combination < 0 {
		mx.Value, mn.Value = 0, 0
		return
	}
	b.masks(ac, q, mx, true)
	b.masks(ac, q, mn, false)
}

// masks fills ex.Loaded with the regions where each patterned case takes its adverse factor.
func (b *envelopeBuilder) masks(ac *accumulator, q int, ex *Extreme, seekMax bool) {
	c := ex.Combination
	for j, k := range b.patterned {
		i := k*ac.nq + q
		if b.tab.hi[c][k] == b.tab.lo[c][k] {
			ex.Loaded[j] = 0 // the case is absent or takes one factor: no pattern
			if b.tab.hi[c][k] > 0 {
				ex.Loaded[j] = ac.pMask[i] | ac.nMask[i]
			}
			continue
		}
		// the larger factor goes on the positive parts when seeking a maximum
		onPositive := seekMax == b.tab.adverseHi[c][k]
		if onPositive {
			ex.Loaded[j] = ac.pMask[i]
		} else {
			ex.Loaded[j] = ac.nMask[i]
		}
	}
}

// Envelopes computes the exact ULS and SLS envelopes at the stations. By superposition each
// region's share of a patterned case is taken with its adverse factor only where it makes the
// value worse, which equals the worst of all 2^n span patterns without enumerating them.
func (a *Analysis) Envelopes(combos []Combination, st []Station) (Envelopes, error) {
	tab, err := a.combTable(combos)
	if err != nil {
		return Envelopes{}, err
	}
	b := &envelopeBuilder{a: a, combos: combos, tab: tab}
	var names []string
	for k, c := range a.cases {
		if c.Pattern {
			b.patterned = append(b.patterned, k)
			names = append(names, c.Name)
		}
	}
	env := Envelopes{Stations: st, Combinations: combos, Patterned: names, Regions: a.Regions()}
	np := len(b.patterned)
	states := []*Envelope{&env.ULS, &env.SLS}
	env.ULS.State, env.SLS.State = ULS, SLS
	for _, e := range states {
		for _, p := range e.series() {
			*p = newExtremes(len(st), np)
		}
	}
	ac := newAccumulator(len(a.cases), nStationQ)
	ei := a.s.model.EI
	for i, s := range st {
		ac.reset()
		e, t := a.locate(s)
		for k := range a.cases {
			for r, c := range a.caseCols[k] {
				m, v, n, w := a.cols[c].el[e].at(t, s.Side, ei)
				ac.add(k, qM, r, m)
				ac.add(k, qV, r, v)
				ac.add(k, qN, r, n)
				ac.add(k, qW, r, w)
			}
		}
		for _, en := range states {
			ser := en.series()
			for q := 0; q < nStationQ; q++ {
				b.extremes(ac, en.State, q, &(*ser[2*q])[i], &(*ser[2*q+1])[i])
			}
		}
	}
	env.ULSReactions = a.reactionEnvelope(b, ULS)
	env.SLSReactions = a.reactionEnvelope(b, SLS)
	return env, nil
}

// series lists the envelope's arrays as max/min pairs in quantity order M, V, N, W.
func (e *Envelope) series() []*[]Extreme {
	return []*[]Extreme{&e.MMax, &e.MMin, &e.VMax, &e.VMin, &e.NMax, &e.NMin, &e.WMax, &e.WMin}
}

func newExtremes(n, np int) []Extreme {
	ex := make([]Extreme, n)
	if np > 0 {
		masks := make([]uint64, n*np)
		for i := range ex {
			ex[i].Loaded = masks[i*np : (i+1)*np : (i+1)*np]
		}
	}
	return ex
}

func (a *Analysis) reactionEnvelope(b *envelopeBuilder, state LimitState) []ReactionEnvelope {
	np := len(b.patterned)
	ac := newAccumulator(len(a.cases), nReactionQ)
	out := make([]ReactionEnvelope, len(a.s.model.Supports))
	for si, sp := range a.s.model.Supports {
		ac.reset()
		for k := range a.cases {
			for r, c := range a.caseCols[k] {
				rr := a.cols[c].reactions[si]
				ac.add(k, qFz, r, rr.Fz)
				ac.add(k, qFx, r, rr.Fx)
				ac.add(k, qMy, r, rr.My)
			}
		}
		re := ReactionEnvelope{X: sp.X}
		pairs := [][2]*Extreme{{&re.FzMax, &re.FzMin}, {&re.FxMax, &re.FxMin}, {&re.MyMax, &re.MyMin}}
		for q, p := range pairs {
			if np > 0 {
				p[0].Loaded, p[1].Loaded = make([]uint64, np), make([]uint64, np)
			}
			b.extremes(ac, state, q, p[0], p[1])
		}
		out[si] = re
	}
	return out
}

// Governing describes in words which combination and pattern produce an extreme, e.g.
// "ULS 6.10b, Q leading; Q on span 1, span 3".
func (env *Envelopes) Governing(ex Extreme) string {
	if ex.Combination < 0 || ex.Combination >= len(env.Combinations) {
		return "no combination"
	}
	var b strings.Builder
	b.WriteString(env.Combinations[ex.Combination].Name)
	for j, name := range env.Patterned {
		if j >= len(ex.Loaded) {
			break
		}
		mask := ex.Loaded[j]
		if mask == 0 || !combinationUses(env.Combinations[ex.Combination], name) {
			continue
		}
		b.WriteString("; ")
		b.WriteString(name)
		b.WriteString(" on ")
		b.WriteString(env.regionList(mask))
	}
	return b.String()
}

func combinationUses(c Combination, name string) bool {
	for _, f := range c.Factors {
		if f.Case == name && (f.Adverse != 0 || f.Relieving != 0) {
			return true
		}
	}
	return false
}

// regionList names the regions in a mask ("all spans" when every region is set).
func (env *Envelopes) regionList(mask uint64) string {
	n := len(env.Regions)
	if n < 64 && mask == (uint64(1)<<uint(n))-1 && n > 1 {
		return "the whole beam"
	}
	var parts []string
	for r := 0; r < n; r++ {
		if mask&(1<<uint(r)) != 0 {
			parts = append(parts, env.Regions[r].Name)
		}
	}
	return strings.Join(parts, ", ")
}
