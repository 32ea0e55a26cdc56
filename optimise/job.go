package optimise

import (
	"errors"
	"fmt"
	"math"

	"spanbreak/beam"
	"spanbreak/optimise/jobfile"
)

// StandardGravity converts mass to weight, g = 9.80665 m/s² (ISO 80000-3; EN 1991-1-1 uses
// the same conversion for self weight).
const StandardGravity = 9.80665

func (s *Setup) section(probs *jobfile.Problems) {
	b := s.job.Beam
	at := b.Where("section")
	if b.Section.Welded != nil {
		w := b.Section.Welded
		sec, err := beam.WeldedSection(w.H.MM(), w.B.MM(), w.Tw.MM(), w.Tf.MM())
		if err != nil {
			probs.Add(at, "%v", err)
			return
		}
		s.Section = sec
		if w.WeldThroat != nil {
			s.WeldThroat = w.WeldThroat.MM()
		}
		return
	}
	sec, err := beam.LookupSection(b.Section.Name)
	if err != nil {
		probs.Add(at, "%v", err)
		return
	}
	s.Section = sec
}

func (s *Setup) grade(probs *jobfile.Problems) {
	b := s.job.Beam
	name := b.Grade
	if name == "" {
		name = "S355"
	}
	g, err := beam.LookupGrade(name)
	if err != nil {
		probs.Add(b.Where("grade"), "%v", err)
		return
	}
	s.Grade = g
	s.GradeTable = beam.TableEN1993
	if b.GradeTable == jobfile.GradeTableEN10025 {
		s.GradeTable = beam.TableEN10025
	}
	if _, _, err := g.Strength(s.Section.Tf, s.GradeTable); err != nil && s.Section.Tf > 0 {
		probs.Add(b.Where("grade"), "%s for the %s flange (tf = %g mm): %v", name, s.Section.Name, s.Section.Tf, err)
	}
}

// model builds the beam model [N, mm] from the beam block.
func (s *Setup) model() {
	b := s.job.Beam
	m := beam.Model{
		Length: b.Length(),
		EI:     beam.YoungModulus * s.Section.Iy,
		EA:     beam.YoungModulus * s.Section.A,
	}
	for i, x := range b.SupportPositions() {
		sp := beam.Support{X: x}
		switch b.Supports[i].Type {
		case jobfile.SupportPinned:
			sp.Kind = beam.Pinned
		case jobfile.SupportRoller:
			sp.Kind = beam.Roller
		case jobfile.SupportFixed:
			sp.Kind = beam.Fixed
		case jobfile.SupportSpring:
			sp.Kind = beam.Spring
			if b.Supports[i].K != nil {
				sp.K = b.Supports[i].K.NPerMM()
			}
		}
		m.Supports = append(m.Supports, sp)
	}
	for _, h := range b.Hinges {
		m.Hinges = append(m.Hinges, h.MM())
	}
	s.Model = m
	for _, sp := range b.Spans {
		s.Spans = append(s.Spans, sp.MM())
	}
	s.Overhang = [2]float64{b.LeftOverhang(), b.RightOverhang()}
}

// SectionWeight is the section's weight per length [N/mm], whether or not the job includes
// it as a load.
func (s *Setup) SectionWeight() float64 { return s.Section.Mass * StandardGravity / 1000 }

// regions refuses a beam with more spans and overhangs than the analysis takes, at the spans.
func (s *Setup) regions(probs *jobfile.Problems) {
	n := len(s.job.Beam.Spans)
	if s.job.Beam.LeftOverhang() > 0 {
		n++
	}
	if s.job.Beam.RightOverhang() > 0 {
		n++
	}
	if n > beam.MaxRegions {
		probs.Add(s.job.Beam.Where("spans"), "%d spans and overhangs are more than the %d the analysis takes",
			n, beam.MaxRegions)
	}
}

func (s *Setup) cases() {
	if s.job.Beam.IncludesSelfWeight() {
		s.SelfWeight = s.SectionWeight()
		s.Cases = append(s.Cases, beam.Case{
			Name: jobfile.SelfWeightCase, Kind: beam.Permanent,
			Loads: []beam.Load{{Kind: beam.Distributed, X1: 0, X2: s.Model.Length, W1: s.SelfWeight, W2: s.SelfWeight}},
		})
	}
	for _, e := range s.job.Cases {
		c := beam.Case{Name: e.Key, Kind: actionKind(e.Value.Kind), Category: e.Value.Category,
			Pattern: e.Value.Patterned(), Psi: e.Value.Psi}
		for _, l := range e.Value.Loads {
			c.Loads = append(c.Loads, convertLoad(l, s.Model.Length))
		}
		s.Cases = append(s.Cases, c)
	}
}

func actionKind(k string) beam.ActionKind {
	switch k {
	case jobfile.KindImposed:
		return beam.Imposed
	case jobfile.KindSnow:
		return beam.Snow
	case jobfile.KindWind:
		return beam.Wind
	case jobfile.KindOther:
		return beam.OtherVariable
	case jobfile.KindThermal:
		return beam.Thermal
	}
	return beam.Permanent
}

func convertLoad(l jobfile.Load, length float64) beam.Load {
	switch l.Kind {
	case jobfile.LoadPoint:
		return beam.Load{Kind: beam.PointForce, X1: l.At.MM(), P: l.P.N()}
	case jobfile.LoadMoment:
		return beam.Load{Kind: beam.PointMoment, X1: l.At.MM(), P: l.M.NMM()}
	case jobfile.LoadAxial:
		return beam.Load{Kind: beam.AxialForce, X1: l.At.MM(), P: l.P.N()}
	}
	from, to := l.Range(length)
	return beam.Load{Kind: beam.Distributed, X1: from, X2: to, W1: l.W[0].NPerMM(), W2: l.W[1].NPerMM()}
}

func (s *Setup) combinations(probs *jobfile.Problems) {
	set, uls, sls := jobfile.RulesEN1990, jobfile.ULS610, jobfile.SLSCharacteristic
	overrides := map[string]float64{}
	cb := s.job.Combinations
	at := s.job.Where("combinations")
	if cb != nil {
		set, uls, sls = orDefault(cb.Rules, set), orDefault(cb.ULS, uls), orDefault(cb.SLS, sls)
		for _, e := range cb.Overrides {
			overrides[e.Key] = e.Value
		}
		at = cb.Loc
	}
	rules, err := beam.NewRules(set, uls, sls, overrides)
	if err != nil {
		probs.Add(at, "%v", err)
		return
	}
	rules.CombineRoofImposed = !cb.SeparatesRoofImposed()
	s.Rules = rules
	combos, err := beam.Combinations(s.Cases, rules)
	if err != nil {
		probs.Add(at, "%v", err)
		return
	}
	names := map[string]bool{}
	for _, c := range combos {
		names[c.Name] = true
	}
	if cb != nil {
		for i, x := range cb.Extra {
			state := beam.ULS
			if x.State == jobfile.StateSLS {
				state = beam.SLS
			}
			factors := map[string]float64{}
			for _, f := range x.Factors {
				factors[f.Key] = f.Value
			}
			if s.job.Beam.IncludesSelfWeight() {
				if _, ok := factors[jobfile.SelfWeightCase]; !ok {
					// the self weight is a permanent action of the same source as the
					// structure: unless named, it takes the largest permanent factor given
					factors[jobfile.SelfWeightCase] = largestPermanentFactor(factors, s.Cases)
				}
			}
			c, err := beam.UserCombination(x.Name, state, factors, s.Cases)
			if err != nil {
				probs.Add(cb.Where(fmt.Sprintf("extra[%d]", i)), "%v", err)
				continue
			}
			if names[c.Name] {
				probs.Add(cb.Where(fmt.Sprintf("extra[%d].name", i)), "combination name %q is already used", c.Name)
				continue
			}
			names[c.Name] = true
			combos = append(combos, c)
		}
	}
	s.Combinations = combos
}

// largestPermanentFactor returns the largest factor given to a permanent case, or 1.
func largestPermanentFactor(factors map[string]float64, cases []beam.Case) float64 {
	f, found := 0.0, false
	for _, c := range cases {
		if v, ok := factors[c.Name]; ok && c.Kind == beam.Permanent {
			f, found = math.Max(f, v), true
		}
	}
	if !found {
		return 1
	}
	return f
}

func orDefault(v, d string) string {
	if v == "" {
		return d
	}
	return v
}

// Analyse solves the job's beam for every case and evaluates every combination at the key
// points (supports, hinges, load starts, ends and points), so that whatever command runs
// next, check included, refuses a job whose results overflow. A mechanism or another model
// error is reported against the beam block of the job file; results that overflow against
// the load or factor that causes them (see LocateOverflow).
func (s *Setup) Analyse() (*beam.Analysis, error) {
	an, err := beam.NewAnalysis(s.Model, s.Cases)
	if err == nil {
		err = s.combinationsFinite(an)
	}
	if err == nil {
		return an, nil
	}
	if probs, ok := s.LocateOverflow(err); ok {
		return nil, probs
	}
	var probs jobfile.Problems
	at := s.job.Beam.Where("supports")
	if !errors.Is(err, beam.ErrMechanism) {
		at = s.job.Where("cases")
	}
	probs.Add(at, "%v", err)
	return nil, probs.Err()
}

// combinationsFinite evaluates the envelopes at the beam ends and key points only: cheap,
// and where a case's or combination's overflow shows first.
func (s *Setup) combinationsFinite(an *beam.Analysis) error {
	st, err := an.Stations(s.Model.Length)
	if err != nil {
		return err
	}
	_, err = an.Envelopes(s.Combinations, st)
	return err
}

// LocateOverflow turns an analysis error that holds a *beam.NonFiniteError (results that
// overflow) into a problem at the job-file key that causes it: the load
// (cases.Q.loads[1].udl), the case's loads when only they together overflow, or the factor
// of an extra combination of the file's own. ok is false for any other error.
func (s *Setup) LocateOverflow(err error) (probs jobfile.Problems, ok bool) {
	var nf *beam.NonFiniteError
	if !errors.As(err, &nf) {
		return nil, false
	}
	at, msg := s.overflowAt(nf)
	probs.Add(at, "%s", msg)
	return probs, true
}

// overflowAt finds where an overflow comes from and says what overflowed, in output units.
func (s *Setup) overflowAt(nf *beam.NonFiniteError) (jobfile.Loc, string) {
	what := fmt.Sprintf("the %s at x = %s is not a finite number", nf.Quantity, metres(nf.X))
	if nf.Combination != "" {
		msg := fmt.Sprintf("combination %s overflows: %s (case %s gives the largest part); the factors or the loads are too large",
			nf.Combination, what, nf.Case)
		if at, ok := s.extraFactorAt(nf.Combination, nf.Case); ok {
			return at, msg
		}
		return s.caseLoadsAt(nf.Case), msg
	}
	if nf.Load < 0 {
		return s.caseLoadsAt(nf.Case), fmt.Sprintf("the analysis overflows: with the loads of case %s together %s; the loads are too large",
			nf.Case, what)
	}
	c, ok := s.job.Cases.Get(nf.Case)
	if !ok || nf.Load >= len(c.Loads) {
		return s.caseLoadsAt(nf.Case), "the analysis overflows: " + what
	}
	l := c.Loads[nf.Load]
	return l.Where(l.Kind), fmt.Sprintf("the analysis overflows: with this load %s; the load is too large (check its value and unit)", what)
}

// caseLoadsAt is the loads of a job case, or the beam's self weight for its case.
func (s *Setup) caseLoadsAt(name string) jobfile.Loc {
	if name == jobfile.SelfWeightCase && s.job.Beam.IncludesSelfWeight() {
		return s.job.Beam.Where("self_weight")
	}
	for _, e := range s.job.Cases {
		if e.Key == name {
			return e.Value.Where("loads")
		}
	}
	return s.job.Where("cases")
}

// extraFactorAt is the factor on a case in a combination of combinations.extra.
func (s *Setup) extraFactorAt(combination, caseName string) (jobfile.Loc, bool) {
	cb := s.job.Combinations
	if cb == nil {
		return jobfile.Loc{}, false
	}
	for i, x := range cb.Extra {
		if x.Name != combination {
			continue
		}
		for _, f := range x.Factors {
			if f.Key == caseName {
				return f.Loc, true
			}
		}
		return cb.Where(fmt.Sprintf("extra[%d].factors", i)), true
	}
	return jobfile.Loc{}, false
}
