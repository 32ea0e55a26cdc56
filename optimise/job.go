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

// Analyse solves the job's beam for every case. A mechanism or another model error is
// reported against the beam block of the job file.
func (s *Setup) Analyse() (*beam.Analysis, error) {
	an, err := beam.NewAnalysis(s.Model, s.Cases)
	if err != nil {
		var probs jobfile.Problems
		at := s.job.Beam.Where("supports")
		if !errors.Is(err, beam.ErrMechanism) {
			at = s.job.Where("cases")
		}
		probs.Add(at, "%v", err)
		return nil, probs.Err()
	}
	return an, nil
}
