package optimise

import (
	"errors"
	"fmt"
	"math"

	"spanbreak/beam"
	"spanbreak/optimise/forcetable"
)

// Forces is where a job's design forces come from: its own beam analysis, or a table of
// forces imported from another analysis (job key forces). Both give the same things, so the
// scan, the sizing, the layouts and the report do not care which.
type Forces interface {
	// At returns the design forces at positions xs [mm] (the worse side at a jump).
	At(xs []float64) ([]PositionForces, error)
	// Traced is At with the combination and pattern of every force, in words.
	Traced(xs []float64) ([]PositionForces, []PositionOrigins, error)
	// Chart returns the envelopes the charts draw and the member checks use: every key point
	// and ChartIntervals intervals of an analysis, the stations of a table.
	Chart() (beam.Envelopes, error)
	// Member checks the beam itself on the chart envelopes.
	Member(env *beam.Envelopes) (MemberChecks, error)
	// Analysis is the job's own analysis, nil for imported forces.
	Analysis() *beam.Analysis
}

// Imported reports whether the job's forces come from a table.
func (s *Setup) Imported() bool { return s.Table != nil }

// Forces returns the job's source of design forces: the table it imports, or its own beam
// analysed (a mechanism or an overflow is then the error, located in the job file).
func (s *Setup) Forces() (Forces, error) {
	if s.Table != nil {
		return &tableForces{s: s, t: s.Table}, nil
	}
	an, err := s.Analyse()
	if err != nil {
		return nil, err
	}
	return &analysedForces{s: s, an: an, combos: s.Combinations}, nil
}

// AnalysedForces are the envelopes of an analysis over combinations, for a scan without a
// job (its Member check then has no member to check and fails).
func AnalysedForces(an *beam.Analysis, combos []beam.Combination) Forces {
	return &analysedForces{an: an, combos: combos}
}

// analysedForces are the envelopes of an analysis: the job's own (s set), or any.
type analysedForces struct {
	s      *Setup // nil without a job: overflows are not located, the member is not checked
	an     *beam.Analysis
	combos []beam.Combination
}

func (f *analysedForces) Analysis() *beam.Analysis { return f.an }

// located turns an overflow into a problem at the job's key, when there is a job.
func (f *analysedForces) located(err error) error {
	if f.s != nil {
		if probs, ok := f.s.LocateOverflow(err); ok {
			return probs
		}
	}
	return err
}

func (f *analysedForces) At(xs []float64) ([]PositionForces, error) {
	out, err := DesignForces(f.an, f.combos, xs)
	return out, f.located(err)
}

func (f *analysedForces) Traced(xs []float64) ([]PositionForces, []PositionOrigins, error) {
	out, origins, err := DesignForcesTraced(f.an, f.combos, xs)
	return out, origins, f.located(err)
}

func (f *analysedForces) Chart() (beam.Envelopes, error) {
	st, err := f.an.Stations(math.Max(f.an.Model().Length/ChartIntervals, 10))
	if err != nil {
		return beam.Envelopes{}, err
	}
	env, err := f.an.Envelopes(f.combos, st)
	return env, f.located(err)
}

func (f *analysedForces) Member(env *beam.Envelopes) (MemberChecks, error) {
	if f.s == nil {
		return MemberChecks{}, errors.New("member checks: no member (the forces are not a job's)")
	}
	return f.s.CheckMember(f.an, env)
}

// tableForces are the envelopes of an imported table, linear between its stations.
type tableForces struct {
	s *Setup
	t *forcetable.Table
}

func (f *tableForces) Analysis() *beam.Analysis { return nil }

func (f *tableForces) At(xs []float64) ([]PositionForces, error) {
	fs, err := f.t.ForcesAt(xs)
	if err != nil {
		return nil, err
	}
	out := make([]PositionForces, len(fs))
	for i, p := range fs {
		out[i] = PositionForces{ULS: ForceSet(p.ULS), SLS: ForceSet(p.SLS)}
	}
	return out, nil
}

// Traced names, for each force, the combination the table gives for the nearest station's
// extreme (the table says what governs at its stations only; between them the forces are
// interpolated, and so is the name: it is the one of the station with the larger value).
func (f *tableForces) Traced(xs []float64) ([]PositionForces, []PositionOrigins, error) {
	out, err := f.At(xs)
	if err != nil {
		return nil, nil, err
	}
	env := &f.t.Envelopes
	origins := make([]PositionOrigins, len(xs))
	for i, x := range xs {
		idx := bracket(env.Stations, x)
		origins[i] = PositionOrigins{ULS: f.origins(&env.ULS, idx), SLS: f.origins(&env.SLS, idx)}
	}
	return out, origins, nil
}

func (f *tableForces) origins(e *beam.Envelope, idx []int) ForceOrigins {
	name := func(ex []beam.Extreme, max bool) string {
		best := ex[idx[0]]
		for _, i := range idx[1:] {
			if (max && ex[i].Value > best.Value) || (!max && ex[i].Value < best.Value) {
				best = ex[i]
			}
		}
		if g := f.t.Governing(best); g != "" {
			return g
		}
		return "not given by " + f.t.File
	}
	v := name(e.VMax, true)
	if a, b := e.VMax[idx[0]].Value, e.VMin[idx[0]].Value; math.Abs(b) > math.Abs(a) {
		v = name(e.VMin, false)
	}
	return ForceOrigins{MMax: name(e.MMax, true), MMin: name(e.MMin, false), V: v, NMax: name(e.NMax, true), NMin: name(e.NMin, false)}
}

// bracket returns the stations around x: those at x (both sides at a jump), or the two on
// either side of it.
func bracket(st []beam.Station, x float64) []int {
	var at []int
	for i, s := range st {
		if math.Abs(s.X-x) <= 1e-6 {
			at = append(at, i)
		}
	}
	if len(at) > 0 {
		return at
	}
	for i := 1; i < len(st); i++ {
		if st[i-1].X < x && x < st[i].X {
			return []int{i - 1, i}
		}
	}
	if x <= st[0].X {
		return []int{0}
	}
	return []int{len(st) - 1}
}

func (f *tableForces) Chart() (beam.Envelopes, error) { return f.t.Envelopes, nil }

// Member checks the cross-section on the table's envelopes and, where the table gives the
// SLS deflection and the beam has supports, the deflection of each span and overhang: the
// table's w taken as measured from the supports (rigid supports; a table from a model with
// settling supports should give relative deflections).
func (f *tableForces) Member(env *beam.Envelopes) (MemberChecks, error) {
	var m MemberChecks
	var err error
	if m.Member, err = f.s.Member.CheckEnvelopes(env); err != nil {
		return m, fmt.Errorf("member checks: %w", err)
	}
	m.noteCompression(env)
	if err := m.Member.OutsideScope(); err != nil {
		if !errors.Is(err, beam.ErrOutsideScope) {
			return m, err
		}
		m.Scope = err
	}
	if !f.t.Deflection() || len(f.s.Model.Supports) == 0 {
		m.NoDeflection = "the forces table gives no deflection"
		if f.t.Deflection() {
			m.NoDeflection = "the member has no supports of its own (beam.length)"
		}
		return m, nil
	}
	m.Deflection = tableDeflection(env, f.s.Model, f.s.Deflection, f.t)
	return m, nil
}

// tableDeflection is the largest |w| of each region over the stations in it.
func tableDeflection(env *beam.Envelopes, m beam.Model, limits beam.DeflectionLimits, t *forcetable.Table) beam.DeflectionResult {
	out := beam.DeflectionResult{Limits: limits}
	first, last := m.Supports[0].X, m.Supports[len(m.Supports)-1].X
	for _, r := range beam.ModelRegions(m) {
		overhang := r.To <= first || r.From >= last // beyond the end supports
		ratio := limits.Span
		if overhang {
			ratio = limits.Overhang
		}
		d := beam.RegionDeflection{Region: r, Overhang: overhang, Reference: beam.FromDatum, Length: r.To - r.From, Ratio: ratio}
		d.Limit = d.Length / ratio
		found := false
		for i, st := range env.Stations {
			if st.X < r.From-1e-6 || st.X > r.To+1e-6 {
				continue
			}
			for _, ex := range []beam.Extreme{env.SLS.WMax[i], env.SLS.WMin[i]} {
				if !found || math.Abs(ex.Value) > math.Abs(d.W) {
					d.W, d.Station, d.Extreme, found = ex.Value, st, ex, true
				}
			}
		}
		d.Combination = t.Governing(d.Extreme)
		d.Utilisation = math.Abs(d.W) / d.Limit
		d.Pass = d.Utilisation <= 1
		out.Regions = append(out.Regions, d)
		if d.Utilisation > out.Regions[out.Governing].Utilisation {
			out.Governing = len(out.Regions) - 1
		}
	}
	return out
}
