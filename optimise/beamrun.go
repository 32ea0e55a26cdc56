package optimise

import (
	"fmt"
	"math"
	"slices"

	"spanbreak/beam"
)

// BeamSettings choose where and what AnalyseBeam evaluates.
type BeamSettings struct {
	Step float64   // station spacing [mm], used when At is empty
	At   []float64 // positions [mm], in the order given
	Case string    // one load case, unfactored; "" for the envelopes of every combination
}

// BeamOutcome is the analysis of a job's beam at a list of stations: the exact ULS and SLS
// envelopes over every combination and pattern, or one load case unfactored.
type BeamOutcome struct {
	Setup     *Setup
	Analysis  *beam.Analysis
	Stations  []beam.Station
	Envelopes *beam.Envelopes  // nil for one case
	Case      *beam.CaseResult // nil for the envelopes
	// Member are the beam's own checks over the whole beam (at every key point and
	// ChartIntervals intervals, whatever the stations asked for); nil for one case.
	Member *MemberChecks
}

// SettingError is a run setting (not the job file) that cannot be used: a command line
// reports it against its flag.
type SettingError struct {
	Setting string // "step", "at", "case", or a direct design's "section", "grade"...
	Err     error
}

func (e *SettingError) Error() string { return e.Setting + ": " + e.Err.Error() }
func (e *SettingError) Unwrap() error { return e.Err }

// AnalyseBeam analyses the job's beam at the stations the settings ask for. A job with
// imported forces has no analysis: its table's envelopes are given at the table's stations
// (the settings' stations do not apply), and there are no load cases.
func AnalyseBeam(s *Setup, set BeamSettings) (*BeamOutcome, error) {
	src, err := s.Forces()
	if err != nil {
		return nil, err
	}
	if s.Imported() {
		return importedBeam(s, src, set)
	}
	an := src.Analysis()
	o := &BeamOutcome{Setup: s, Analysis: an}
	if err := s.checkStations(set); err != nil {
		return nil, err
	}
	if len(set.At) > 0 {
		if o.Stations, err = an.StationsAt(set.At); err != nil {
			return nil, &SettingError{"at", err}
		}
	} else if o.Stations, err = an.Stations(set.Step); err != nil {
		return nil, &SettingError{"step", err}
	}
	if set.Case != "" {
		if !slices.ContainsFunc(s.Cases, func(c beam.Case) bool { return c.Name == set.Case }) {
			names := make([]string, len(s.Cases))
			for i, c := range s.Cases {
				names[i] = c.Name
			}
			return nil, &SettingError{"case", fmt.Errorf("no load case %q (cases: %v)", set.Case, names)}
		}
		r, err := an.CaseResult(set.Case, o.Stations)
		if probs, ok := s.LocateOverflow(err); ok {
			return nil, probs
		}
		if err != nil {
			return nil, err
		}
		o.Case = &r
		return o, nil
	}
	env, err := an.Envelopes(s.Combinations, o.Stations)
	if probs, ok := s.LocateOverflow(err); ok {
		return nil, probs
	}
	if err != nil {
		return nil, err
	}
	o.Envelopes = &env
	fine, err := src.Chart()
	if err != nil {
		return nil, err
	}
	m, err := src.Member(&fine)
	if err != nil {
		return nil, err
	}
	o.Member = &m
	return o, nil
}

// importedBeam is AnalyseBeam for a job with a forces table.
func importedBeam(s *Setup, src Forces, set BeamSettings) (*BeamOutcome, error) {
	if set.Case != "" {
		return nil, &SettingError{"case", fmt.Errorf("the job has no load cases: its forces come from %s", s.Table.File)}
	}
	env, err := src.Chart()
	if err != nil {
		return nil, err
	}
	m, err := src.Member(&env)
	if err != nil {
		return nil, err
	}
	return &BeamOutcome{Setup: s, Stations: env.Stations, Envelopes: &env, Member: &m}, nil
}

// checkStations refuses, in metres, positions off the beam and a step that is not a positive
// spacing or gives more than beam.MaxStations stations.
func (s *Setup) checkStations(set BeamSettings) error {
	l := s.Model.Length
	if len(set.At) > 0 {
		for _, x := range set.At {
			if !(x >= 0 && x <= l) {
				return &SettingError{"at", fmt.Errorf("%g m is off the beam (0 to %g m)", x/1e3, l/1e3)}
			}
		}
		return nil
	}
	if !(set.Step > 0) || math.IsInf(set.Step, 0) {
		return &SettingError{"step", fmt.Errorf("want a positive station spacing, got %.6g m", set.Step/1e3)}
	}
	if n := math.Floor(l/set.Step + 1e-9); n > beam.MaxStations {
		return &SettingError{"step", fmt.Errorf("a station spacing of %.6g m gives %s stations on a %s beam; at most %d are allowed",
			set.Step/1e3, count(n), metres(l), beam.MaxStations)}
	}
	return nil
}

// JobCheck is what a check of the job reports: the resolved job, its analysis (a mechanism or
// an overflow is an error) and the beam's own checks.
type JobCheck struct {
	Setup    *Setup
	Analysis *beam.Analysis
	Member   MemberChecks
}

// CheckJob analyses the job's beam (or takes its imported forces) and checks the beam itself.
func CheckJob(s *Setup) (*JobCheck, error) {
	src, err := s.Forces()
	if err != nil {
		return nil, err
	}
	env, err := src.Chart()
	if err != nil {
		return nil, err
	}
	m, err := src.Member(&env)
	if err != nil {
		return nil, err
	}
	return &JobCheck{Setup: s, Analysis: src.Analysis(), Member: m}, nil
}
