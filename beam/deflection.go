package beam

// Serviceability check of the deflection of every span and overhang.

import (
	"errors"
	"fmt"
	"math"
	"slices"
)

// Default deflection limits as ratios of the region length (common practice for beams; EN 1990
// A1.4 and EN 1993-1-1 7.2 leave the limits to the National Annex and the client, which govern).
const (
	DefaultSpanRatio     = 250.0 // span/250
	DefaultOverhangRatio = 180.0 // overhang length/180
)

// DeflectionLimits are the serviceability limits as length/deflection ratios. The zero value
// takes the defaults.
type DeflectionLimits struct {
	Span     float64 // limit = span/Span [-]; 0 takes DefaultSpanRatio
	Overhang float64 // limit = overhang length/Overhang [-]; 0 takes DefaultOverhangRatio
}

func (l DeflectionLimits) resolved() DeflectionLimits {
	if l.Span == 0 {
		l.Span = DefaultSpanRatio
	}
	if l.Overhang == 0 {
		l.Overhang = DefaultOverhangRatio
	}
	return l
}

func (l DeflectionLimits) validate() error {
	var errs []error
	if !finite(l.Span) || l.Span < 0 {
		errs = append(errs, fmt.Errorf("deflection limit: span ratio %g: must be a positive finite number (0 takes %g)", l.Span, DefaultSpanRatio))
	}
	if !finite(l.Overhang) || l.Overhang < 0 {
		errs = append(errs, fmt.Errorf("deflection limit: overhang ratio %g: must be a positive finite number (0 takes %g)", l.Overhang, DefaultOverhangRatio))
	}
	return errors.Join(errs...)
}

// DeflectionReference says what a region's deflection is measured from.
type DeflectionReference int

// References of the deflection of a region.
const (
	// FromChord: a span, measured from the straight line between the deflections of its two
	// supports (zero for rigid supports; for springs the settlement is removed as a rigid-body
	// movement).
	FromChord DeflectionReference = iota
	// FromSupport: an overhang, measured from the deflection of its support (the support's
	// settlement removed; the rotation there, from the back span or a settling neighbour,
	// kept, since the tip moves with it).
	FromSupport
	// FromDatum: absolute deflection, for a region with no support at either end (not
	// produced by a checked model; kept so every region has a reference).
	FromDatum
)

// String describes the reference for a report.
func (r DeflectionReference) String() string {
	switch r {
	case FromChord:
		return "relative to the chord between the supports"
	case FromSupport:
		return "relative to the support"
	}
	return "absolute"
}

// RegionDeflection is the serviceability check of one span or overhang.
type RegionDeflection struct {
	Region    Region
	Overhang  bool                // the region has a support at one end only
	Reference DeflectionReference // what W is measured from
	Length    float64             // region length L [mm]
	Ratio     float64             // the limit's ratio [-]
	Limit     float64             // L/Ratio [mm]

	W           float64  // largest relative deflection over the region's stations, downward positive (negative: upward) [mm]
	Station     Station  // where W occurs
	Extreme     Extreme  // SLS combination of W (Value = W); its Pattern is -1: the pattern is Loaded
	Loaded      []uint64 // the pattern of W: per patterned case, the regions loaded (as Envelopes.Loaded)
	Combination string   // the combination and pattern in words (as Envelopes.Governing)
	Utilisation float64  // |W|/Limit [-]
	Pass        bool
}

// DeflectionResult is the deflection check of every region.
type DeflectionResult struct {
	Limits    DeflectionLimits   // with the defaults applied
	Regions   []RegionDeflection // one per span and overhang, left to right
	Governing int                // index into Regions of the highest utilisation (first of equals)
}

// CheckDeflections checks the deflection of every span and overhang over the SLS
// combinations of env, at env's stations, against DeflectionLimits: span/Span for a span and
// overhang length/Overhang for an overhang.
//
// The deflection of each load column is measured from its region's reference (see
// DeflectionReference) before the envelope is taken, so with spring supports the relative
// deflection is exact for every combination and span pattern, not the difference of two
// envelopes. With rigid supports (pinned, roller, fixed) it equals the SLS envelope WMax/WMin.
//
// The check is the largest value over the stations given, nothing between them: pass a fine
// grid (Analysis.Stations with a step of a small fraction of the shortest region) so the peak
// is not missed. Stations on a support count for both regions that meet there.
//
// env must come from this analysis (a.Envelopes). Errors: invalid limits; envelopes with no
// stations, with regions other than this analysis's, or with no SLS combination; a region
// with no station.
func (a *Analysis) CheckDeflections(env *Envelopes, limits DeflectionLimits) (DeflectionResult, error) {
	if err := limits.validate(); err != nil {
		return DeflectionResult{}, err
	}
	if err := a.checkOwnEnvelopes(env); err != nil {
		return DeflectionResult{}, err
	}
	b, _, err := a.newEnvelopeBuilder(env.Combinations)
	if err != nil {
		return DeflectionResult{}, err
	}
	if len(b.byState[SLS]) == 0 {
		return DeflectionResult{}, errors.New("deflection check: no SLS combination")
	}
	lim := limits.resolved()
	res := DeflectionResult{Limits: lim, Regions: make([]RegionDeflection, len(a.regions))}
	var errs []error
	for r, reg := range a.regions {
		rd, ok := a.regionDeflection(b, env, reg, lim)
		if !ok {
			errs = append(errs, fmt.Errorf("deflection check: %s (%g to %g mm) has no station: pass stations covering every region", reg.Name, reg.From, reg.To))
			continue
		}
		rd.Combination = env.governing(int(rd.Extreme.Combination), rd.Loaded)
		res.Regions[r] = rd
		if rd.Utilisation > res.Regions[res.Governing].Utilisation {
			res.Governing = r
		}
	}
	if len(errs) > 0 {
		return DeflectionResult{}, errors.Join(errs...)
	}
	return res, nil
}

// checkOwnEnvelopes rejects envelopes that do not belong to the analysis.
func (a *Analysis) checkOwnEnvelopes(env *Envelopes) error {
	if env == nil || len(env.Stations) == 0 {
		return errors.New("deflection check: the envelopes have no stations")
	}
	same := len(env.Regions) == len(a.regions)
	for i := 0; same && i < len(a.regions); i++ {
		same = math.Abs(env.Regions[i].From-a.regions[i].From) <= pointTol && math.Abs(env.Regions[i].To-a.regions[i].To) <= pointTol
	}
	if !same {
		return errors.New("deflection check: the envelopes' regions are not this analysis's: build them with its Envelopes method")
	}
	for _, st := range env.Stations {
		if !(st.X >= -pointTol && st.X <= a.s.model.Length+pointTol) {
			return fmt.Errorf("deflection check: station x = %g mm is off the beam (0 to %g mm)", st.X, a.s.model.Length)
		}
	}
	return nil
}

// isSupport reports whether a support stands at x.
func (a *Analysis) isSupport(x float64) bool {
	return slices.ContainsFunc(a.s.model.Supports, func(s Support) bool { return math.Abs(s.X-x) <= pointTol })
}

// regionDeflection finds the largest relative deflection of one region; ok is false when no
// station lies in it.
func (a *Analysis) regionDeflection(b *envelopeBuilder, env *Envelopes, reg Region, lim DeflectionLimits) (rd RegionDeflection, ok bool) {
	atFrom, atTo := a.isSupport(reg.From), a.isSupport(reg.To)
	rd = RegionDeflection{Region: reg, Length: reg.To - reg.From, Ratio: lim.Span}
	switch {
	case atFrom && atTo:
		rd.Reference = FromChord
	case atFrom || atTo:
		rd.Reference, rd.Overhang, rd.Ratio = FromSupport, true, lim.Overhang
	default:
		rd.Reference = FromDatum
	}
	rd.Limit = rd.Length / rd.Ratio

	// each column's deflection at the region's ends
	ei := a.s.model.EI
	wAt := func(c int, x float64) float64 {
		e, t := a.locate(Station{X: x})
		_, _, _, w := a.cols[c].el[e].at(t, Right, ei)
		return w
	}
	wFrom, wTo := make([]float64, len(a.cols)), make([]float64, len(a.cols))
	for c := range a.cols {
		wFrom[c], wTo[c] = wAt(c, reg.From), wAt(c, reg.To)
	}
	ref := func(c int, x float64) float64 {
		switch {
		case rd.Reference == FromChord:
			return wFrom[c] + (wTo[c]-wFrom[c])*(x-reg.From)/rd.Length
		case rd.Reference == FromSupport && atFrom:
			return wFrom[c]
		case rd.Reference == FromSupport:
			return wTo[c]
		}
		return 0
	}

	var mx, mn Extreme
	pt := newPatternTable(len(b.patterned))
	var sx, sn [1]series
	ac := newAccumulator(len(a.cases), 1)
	for _, st := range env.Stations {
		if st.X < reg.From-pointTol || st.X > reg.To+pointTol {
			continue
		}
		ac.reset()
		e, t := a.locate(st)
		for k := range a.cases {
			for r, c := range a.caseCols[k] {
				_, _, _, w := a.cols[c].el[e].at(t, st.Side, ei)
				ac.add(k, 0, r, w-ref(c, st.X))
			}
		}
		b.extremes(ac, SLS, []*Extreme{&mx}, []*Extreme{&mn}, pt, sx[:], sn[:])
		for _, ex := range []*Extreme{&mx, &mn} {
			if !ok || math.Abs(ex.Value) > math.Abs(rd.W) {
				rd.W, rd.Station = ex.Value, st
				rd.Extreme = Extreme{Value: ex.Value, Combination: ex.Combination, Pattern: -1}
				rd.Loaded = nil
				if len(b.patterned) > 0 {
					rd.Loaded = slices.Clone(pt.pattern(ex.Pattern))
				}
				ok = true
			}
		}
	}
	rd.Utilisation = math.Abs(rd.W) / rd.Limit
	rd.Pass = rd.Utilisation <= 1+passTolerance
	return rd, ok
}
