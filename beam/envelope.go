package beam

import (
	"encoding/binary"
	"errors"
	"fmt"
	"math"
	"slices"
	"strings"
)

// Extreme is one envelope value with the combination and pattern that produce it. It is 16
// bytes, so that envelopes at a million stations fit in little memory: the pattern is a
// number into the envelopes' table of the patterns they found (Envelopes.Loaded).
type Extreme struct {
	Value       float64 // in the quantity's unit (N·mm, N or mm)
	Combination int32   // index into Envelopes.Combinations; -1 when no combination of the state exists
	// Pattern numbers the span pattern in the table of the envelopes that hold the extreme:
	// per patterned case, the regions that carry the case's adverse factor. Pattern 0 loads
	// no region; -1 is a pattern not in the table (RegionDeflection.Loaded gives it).
	Pattern int32
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
	Patterned    []string // names of the patterned cases, the order of the masks of Loaded
	Regions      []Region
	ULS, SLS     Envelope
	ULSReactions []ReactionEnvelope
	SLSReactions []ReactionEnvelope

	patterns []uint64 // len(Patterned) masks per pattern, in the order of Extreme.Pattern
}

// Loaded returns the pattern of an extreme of these envelopes: per patterned case, in the order
// of Patterned, a bit mask of the regions that carry the case's adverse factor (bit r set
// means region r is loaded). It is nil when there are no patterned cases or the pattern is
// not in the envelopes' table.
func (env *Envelopes) Loaded(ex Extreme) []uint64 {
	np := len(env.Patterned)
	if np == 0 || ex.Pattern < 0 || (int(ex.Pattern)+1)*np > len(env.patterns) {
		return nil
	}
	return slices.Clone(env.patterns[int(ex.Pattern)*np : (int(ex.Pattern)+1)*np])
}

// patternTable numbers the distinct patterns (np masks each) as the envelopes find them.
// Pattern 0 loads no region. Consecutive extremes of one series mostly share a pattern, so
// each series remembers its last one and looks in the table only when it changes.
type patternTable struct {
	np    int
	masks []uint64         // np per pattern
	ids   map[string]int32 // the masks' bytes → pattern
	key   []byte
}

func newPatternTable(np int) *patternTable {
	return &patternTable{np: np, masks: make([]uint64, np), ids: map[string]int32{}, key: make([]byte, 8*np)}
}

// id returns the number of a pattern, adding it when new.
func (pt *patternTable) id(m []uint64) int32 {
	if pt.np == 0 || !slices.ContainsFunc(m, func(w uint64) bool { return w != 0 }) {
		return 0
	}
	for j, w := range m {
		binary.LittleEndian.PutUint64(pt.key[8*j:], w)
	}
	if id, ok := pt.ids[string(pt.key)]; ok {
		return id
	}
	id := int32(len(pt.masks) / pt.np)
	pt.masks = append(pt.masks, m...)
	pt.ids[string(pt.key)] = id
	return id
}

// pattern returns the masks of a pattern (the table's own: not to be changed).
func (pt *patternTable) pattern(id int32) []uint64 {
	return pt.masks[int(id)*pt.np : (int(id)+1)*pt.np]
}

// series remembers one envelope series' last pattern.
type series struct {
	masks []uint64
	last  int32
}

// id returns the number of a pattern of the series.
func (sr *series) id(pt *patternTable, m []uint64) int32 {
	if sr.masks == nil {
		sr.masks = make([]uint64, len(m))
	} else if slices.Equal(sr.masks, m) {
		return sr.last
	}
	copy(sr.masks, m)
	sr.last = pt.id(m)
	return sr.last
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
// (region by region for patterned cases) and the regions they come from, for up to four
// quantities.
type accumulator struct {
	nq           int
	pos, neg     [][nStationQ]float64 // [case][q]
	pMask, nMask [][nStationQ]uint64  // [case][q] regions with a positive (negative) share
}

func newAccumulator(cases, nq int) *accumulator {
	return &accumulator{nq: nq, pos: make([][nStationQ]float64, cases), neg: make([][nStationQ]float64, cases),
		pMask: make([][nStationQ]uint64, cases), nMask: make([][nStationQ]uint64, cases)}
}

func (ac *accumulator) reset() {
	clear(ac.pos)
	clear(ac.neg)
	clear(ac.pMask)
	clear(ac.nMask)
}

func (ac *accumulator) add(k, q int, region int, v float64) {
	if v > 0 {
		ac.pos[k][q] += v
		ac.pMask[k][q] |= 1 << uint(region)
	} else if v < 0 {
		ac.neg[k][q] += v
		ac.nMask[k][q] |= 1 << uint(region)
	}
}

// envelopeBuilder turns accumulated parts into extremes for every combination of one state.
type envelopeBuilder struct {
	a         *Analysis
	combos    []Combination
	tab       combTable
	patterned []int    // case indices of the patterned cases
	byState   [2][]int // combination indices of each limit state
	terms     [][]term // per combination, the cases with a non-zero factor
	scratch   []uint64 // masks' result, one per patterned case
}

// term is one case's factors in one combination.
type term struct {
	k      int     // case index
	hi, lo float64 // larger and smaller factor
}

// extremes writes, for every quantity q, the max and min over the combinations of one state
// into mx[q] and mn[q], with the pattern of the patterned cases from the table (sx and sn,
// one per quantity, remember each series' last pattern). When a combination's value is not
// a finite number it stops and returns that combination and quantity; otherwise it returns
// -1.
func (b *envelopeBuilder) extremes(ac *accumulator, state LimitState, mx, mn []*Extreme, pt *patternTable, sx, sn []series) (combination, quantity int) {
	nq := ac.nq
	var vmax, vmin [nStationQ]float64
	for q := 0; q < nq; q++ {
		mx[q].Value, mn[q].Value = math.Inf(-1), math.Inf(1)
		mx[q].Combination, mn[q].Combination = -1, -1
	}
	for _, c := range b.byState[state] {
		vmax, vmin = [nStationQ]float64{}, [nStationQ]float64{}
		for _, f := range b.terms[c] {
			p, n := &ac.pos[f.k], &ac.neg[f.k]
			vmax[0] += f.hi*p[0] + f.lo*n[0]
			vmax[1] += f.hi*p[1] + f.lo*n[1]
			vmax[2] += f.hi*p[2] + f.lo*n[2]
			vmax[3] += f.hi*p[3] + f.lo*n[3]
			vmin[0] += f.lo*p[0] + f.hi*n[0]
			vmin[1] += f.lo*p[1] + f.hi*n[1]
			vmin[2] += f.lo*p[2] + f.hi*n[2]
			vmin[3] += f.lo*p[3] + f.hi*n[3]
		}
		for q := 0; q < nq; q++ {
			if !isFinite(vmax[q]) || !isFinite(vmin[q]) {
				return c, q
			}
			if vmax[q] > mx[q].Value {
				mx[q].Value, mx[q].Combination = vmax[q], int32(c)
			}
			if vmin[q] < mn[q].Value {
				mn[q].Value, mn[q].Combination = vmin[q], int32(c)
			}
		}
	}
	for q := 0; q < nq; q++ {
		mx[q].Pattern, mn[q].Pattern = 0, 0
		if mx[q].Combination < 0 {
			mx[q].Value, mn[q].Value = 0, 0
			continue
		}
		if len(b.patterned) > 0 {
			mx[q].Pattern = sx[q].id(pt, b.masks(ac, q, int(mx[q].Combination), true))
			mn[q].Pattern = sn[q].id(pt, b.masks(ac, q, int(mn[q].Combination), false))
		}
	}
	return -1, 0
}

// combinationFault explains a combined value that is not finite: a case whose shares add up
// past the range of float64 by themselves, else the combination, naming the case with the
// largest part.
func (b *envelopeBuilder) combinationFault(ac *accumulator, c, q int, quantity string, x float64) *NonFiniteError {
	biggest, size := -1, math.Inf(-1)
	for _, f := range b.terms[c] {
		p, n := ac.pos[f.k][q], ac.neg[f.k][q]
		if !isFinite(p) || !isFinite(n) {
			return &NonFiniteError{Case: b.a.cases[f.k].Name, Load: -1, Quantity: quantity, X: x}
		}
		// compared as logarithms: the factored parts themselves may overflow
		if s := math.Log(f.hi) + math.Log(p-n); s > size {
			biggest, size = f.k, s
		}
	}
	e := &NonFiniteError{Load: -1, Combination: b.combos[c].Name, Quantity: quantity, X: x}
	if biggest >= 0 {
		e.Case = b.a.cases[biggest].Name
	}
	return e
}

// masks returns, in the builder's scratch, the regions where each patterned case takes its
// adverse factor in combination c.
func (b *envelopeBuilder) masks(ac *accumulator, q, c int, seekMax bool) []uint64 {
	m := b.scratch
	for j, k := range b.patterned {
		if b.tab.hi[c][k] == b.tab.lo[c][k] {
			m[j] = 0 // the case is absent or takes one factor: no pattern
			if b.tab.hi[c][k] > 0 {
				m[j] = ac.pMask[k][q] | ac.nMask[k][q]
			}
			continue
		}
		// the larger factor goes on the positive parts when seeking a maximum
		if seekMax == b.tab.adverseHi[c][k] {
			m[j] = ac.pMask[k][q]
		} else {
			m[j] = ac.nMask[k][q]
		}
	}
	return m
}

// Envelopes computes the exact ULS and SLS envelopes at the stations. By superposition each
// region's share of a patterned case is taken with its adverse factor only where it makes the
// value worse, which equals the worst of all 2^n span patterns without enumerating them.
// A case or combination value that is not a finite number at a station is a
// *NonFiniteError; no value is ever left out of an envelope.
func (a *Analysis) Envelopes(combos []Combination, st []Station) (Envelopes, error) {
	b, names, err := a.newEnvelopeBuilder(combos)
	if err != nil {
		return Envelopes{}, err
	}
	env := Envelopes{Stations: st, Combinations: combos, Patterned: names, Regions: a.Regions()}
	pt := newPatternTable(len(b.patterned))
	states := []*Envelope{&env.ULS, &env.SLS}
	env.ULS.State, env.SLS.State = ULS, SLS
	all := make([]Extreme, 16*len(st))
	for si, e := range states {
		for j, p := range e.series() {
			o := (8*si + j) * len(st)
			*p = all[o : o+len(st) : o+len(st)]
		}
	}
	var sx, sn [2][nStationQ]series
	ac := newAccumulator(len(a.cases), nStationQ)
	ei := a.s.model.EI
	for i, s := range st {
		ac.reset()
		e, t := a.locate(s)
		for k := range a.cases {
			for r, c := range a.caseCols[k] {
				m, v, n, w := a.cols[c].el[e].at(t, s.Side, ei)
				if !isFinite(m) || !isFinite(v) || !isFinite(n) || !isFinite(w) {
					return Envelopes{}, a.stationFault(k, s, m, v, n, w)
				}
				ac.add(k, qM, r, m)
				ac.add(k, qV, r, v)
				ac.add(k, qN, r, n)
				ac.add(k, qW, r, w)
			}
		}
		for si, en := range states {
			mx := [nStationQ]*Extreme{&en.MMax[i], &en.VMax[i], &en.NMax[i], &en.WMax[i]}
			mn := [nStationQ]*Extreme{&en.MMin[i], &en.VMin[i], &en.NMin[i], &en.WMin[i]}
			if c, q := b.extremes(ac, en.State, mx[:], mn[:], pt, sx[si][:], sn[si][:]); c >= 0 {
				return Envelopes{}, b.combinationFault(ac, c, q, stationQuantity(q), s.X)
			}
		}
	}
	if env.ULSReactions, err = a.reactionEnvelope(b, ULS, pt); err != nil {
		return Envelopes{}, err
	}
	if env.SLSReactions, err = a.reactionEnvelope(b, SLS, pt); err != nil {
		return Envelopes{}, err
	}
	env.patterns = slices.Clip(pt.masks)
	return env, nil
}

// stationFault names the case (and the load, where one alone overflows) whose value at a
// station is not finite.
func (a *Analysis) stationFault(k int, s Station, v ...float64) *NonFiniteError {
	q := max(firstNonFinite(v...), 0)
	return &NonFiniteError{Case: a.cases[k].Name, Load: a.culprit(k, []Station{s}), Quantity: stationQuantity(q), X: s.X}
}

// newEnvelopeBuilder prepares the combination factors for envelopes over combos; it also
// returns the names of the patterned cases (the order of Extreme.Loaded).
func (a *Analysis) newEnvelopeBuilder(combos []Combination) (*envelopeBuilder, []string, error) {
	tab, err := a.combTable(combos)
	if err != nil {
		return nil, nil, err
	}
	b := &envelopeBuilder{a: a, combos: combos, tab: tab}
	for c, cb := range combos {
		b.byState[cb.State] = append(b.byState[cb.State], c)
		var terms []term
		for k := range a.cases {
			if tab.hi[c][k] != 0 || tab.lo[c][k] != 0 {
				terms = append(terms, term{k: k, hi: tab.hi[c][k], lo: tab.lo[c][k]})
			}
		}
		b.terms = append(b.terms, terms)
	}
	var names []string
	for k, c := range a.cases {
		if c.Pattern {
			b.patterned = append(b.patterned, k)
			names = append(names, c.Name)
		}
	}
	b.scratch = make([]uint64, len(b.patterned))
	return b, names, nil
}

// series lists the envelope's arrays as max/min pairs in quantity order M, V, N, W.
func (e *Envelope) series() []*[]Extreme {
	return []*[]Extreme{&e.MMax, &e.MMin, &e.VMax, &e.VMin, &e.NMax, &e.NMin, &e.WMax, &e.WMin}
}

func (a *Analysis) reactionEnvelope(b *envelopeBuilder, state LimitState, pt *patternTable) ([]ReactionEnvelope, error) {
	ac := newAccumulator(len(a.cases), nReactionQ)
	var sx, sn [nReactionQ]series
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
		mx := []*Extreme{&re.FzMax, &re.FxMax, &re.MyMax}
		mn := []*Extreme{&re.FzMin, &re.FxMin, &re.MyMin}
		if c, q := b.extremes(ac, state, mx, mn, pt, sx[:], sn[:]); c >= 0 {
			return nil, b.combinationFault(ac, c, q, ReactionQuantity, sp.X)
		}
		out[si] = re
	}
	return out, nil
}

// Governing describes in words which combination and pattern produce an extreme, e.g.
// "ULS 6.10b, Q leading; Q on span 1, span 3".
func (env *Envelopes) Governing(ex Extreme) string {
	np := len(env.Patterned)
	var loaded []uint64
	if np > 0 && ex.Pattern >= 0 && (int(ex.Pattern)+1)*np <= len(env.patterns) {
		loaded = env.patterns[int(ex.Pattern)*np : (int(ex.Pattern)+1)*np]
	}
	return env.governing(int(ex.Combination), loaded)
}

// governing is Governing for a combination and the masks of its pattern (nil: none).
func (env *Envelopes) governing(combination int, loaded []uint64) string {
	if combination < 0 || combination >= len(env.Combinations) {
		return "no combination"
	}
	var b strings.Builder
	b.WriteString(env.Combinations[combination].Name)
	for j, name := range env.Patterned {
		if j >= len(loaded) {
			break
		}
		mask := loaded[j]
		if mask == 0 || !combinationUses(env.Combinations[combination], name) {
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
	return slices.ContainsFunc(c.Factors, func(f Factor) bool {
		return f.Case == name && (f.Adverse != 0 || f.Relieving != 0)
	})
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
