package optimise

import (
	"errors"
	"math"
	"slices"

	"spanbreak/beam"
	"spanbreak/optimise/forcetable"
	"spanbreak/optimise/jobfile"
	"spanbreak/splice"
)

// Defaults of the scan when the job and the settings leave them out. Every default of the
// job file is applied in this package, once, by Prepare; Setup.Defaults lists the key paths
// that took one.
const (
	DefaultStep         = 50.0 // candidate spacing [mm] (DESIGN.md section 6)
	DefaultAlternatives = 3    // near-best alternative layouts listed
	ExtraCounts         = 2    // splice counts reported beyond the fewest feasible
)

// SelfWeightCase is the name of the permanent case that carries the beam's own weight.
const SelfWeightCase = jobfile.SelfWeightCase

// Setup is a job file resolved once into everything a run needs: the beam model, load cases
// and combinations, the section and grade, the splice problem (without forces), the piece
// limits, keep-out zones, vehicles, costs, splice counts and scan settings, each with its
// default applied where the file leaves it out. Every command and renderer reads the job
// through a Setup; only this package sees the decoded file.
type Setup struct {
	File  string // the job file's name as given ("demo.yaml" for the demo)
	Title string

	Section    beam.Section
	WeldThroat float64 // throat a of a welded section's web-to-flange welds, 0 when not given [mm]
	Grade      beam.Grade
	GradeTable beam.GradeTable
	Model      beam.Model
	Spans      []float64  // as written, left to right [mm]
	Overhang   [2]float64 // left, right [mm]
	SelfWeight float64    // the section's weight per length when the job includes it, else 0 [N/mm]

	// Table holds the forces imported from another analysis (job key forces), in place of
	// the cases and combinations, which are then empty; nil when the job analyses its beam.
	Table *forcetable.Table

	Cases        []beam.Case // job cases in file order; SelfWeightCase first when self weight is on
	Rules        beam.Rules
	Combinations []beam.Combination

	// Splice is the job's splice sizing problem without forces (Brief: the scan's numbers
	// only); its design space lists what the job gives, with the package defaults filled in.
	Splice     splice.Problem
	PlateGrade string // name of the cover plates' steel
	Costed     bool   // the job has a costs block; without one the splice rates are indicative
	Rates      splice.Rates
	// BoltSizes are the sizes the sizing tries: those of the design space within
	// splice.bolts.min_size and max_size (Splice.Sizing.Space holds the list and the bounds).
	BoltSizes []string
	// GaugeKey is the key the fixed flange gauge (Splice.Detailing.Gauge) comes from,
	// "splice.detailing.gauge" or "splice.detailing.gauges[1]"; "" when the sizing chooses it.
	GaugeKey string

	Limits     PieceLimits // from the job; a run's settings may add rigging
	KeepOut    KeepOutSpec
	Zones      []Zone
	MinSplices int
	MaxSplices int // < 0: no limit
	Vehicles   []Vehicle
	Lift       float64 // per piece erected [currency]

	// Member is the beam for its own EN 1993-1-1 checks (fy of the thicker plate); Deflection
	// the SLS limits of its spans and overhangs.
	Member     beam.Member
	Deflection beam.DeflectionLimits

	Step         float64 // candidate spacing [mm]
	Alternatives int     // near-best alternative layouts
	Uniform      bool    // recommend the best layout of identical splices (scan.uniform)

	// Defaults lists the key paths the file leaves out, which took their default, sorted.
	Defaults []string
	// Notes say what the file's omissions mean for the results (no limits, vehicles, costs).
	Notes []string

	job *jobfile.Job // for locating problems in the file
	// shelf keeps the sizers of the job's splice problem, so that every designer of the job
	// shares one; a batch gives its jobs one shelf, so that beams alike share theirs.
	shelf *splice.Shelf
}

// JobFileReference is the reference of every key of the job file and the splice file: unit,
// default, allowed values, plausible range and an example.
func JobFileReference() string { return jobfile.Reference() + "\n" + forcetable.Reference() }

// Where locates a job-file key path ("limits.keep_out", "scan.step") in the file, for
// messages; a key the file does not hold points at its nearest written parent.
func (s *Setup) Where(key string) jobfile.Loc { return s.job.Where(key) }

// WhereCase locates a load case's name in the file, for messages about the name itself;
// the self weight's case is located at beam.self_weight.
func (s *Setup) WhereCase(name string) jobfile.Loc {
	for _, e := range s.job.Cases {
		if e.Key == name {
			return e.Loc
		}
	}
	return s.job.Beam.Where("self_weight")
}

// IsDefault reports whether a key path took its default.
func (s *Setup) IsDefault(key string) bool {
	_, found := slices.BinarySearch(s.Defaults, key)
	return found
}

// Prepare reads a job file's bytes: strict decoding and validation (every problem of the file
// in one pass, with line, column and key path), then resolves the section and grade, the
// model, the cases and combinations, the splice problem, the limits, vehicles, costs and scan.
// The error is a jobfile.Problems where it can point into the file.
func Prepare(file string, data []byte) (*Setup, error) {
	job, err := jobfile.LoadJob(file, data)
	if job == nil {
		return nil, err
	}
	// the section and grade are looked up even when the file has other problems, so that
	// every problem is reported in one pass
	var probs jobfile.Problems
	if !errors.As(err, &probs) && err != nil {
		return nil, err
	}
	s := &Setup{File: file, Title: job.Title, job: job, shelf: splice.NewShelf(2)}
	if (job.Beam.Section.Name != "" || job.Beam.Section.Welded != nil) && !probs.About("beam.section") {
		s.section(&probs)
		if s.Section.Name != "" && !probs.About("beam.grade") {
			s.grade(&probs)
		}
		if s.Grade.Name != "" {
			s.spliceSpace(&probs)
		}
	}
	if len(probs) > 0 {
		return nil, probs.Err()
	}
	s.model()
	s.regions(&probs)
	if job.Forces == nil {
		s.cases()
		s.combinations(&probs)
	}
	if len(probs) > 0 {
		return nil, probs.Err()
	}
	s.transport()
	if s.Member, err = beam.NewMember(s.Section, s.Grade, beam.MemberSettings{Table: s.GradeTable, WeldThroat: s.WeldThroat}); err != nil {
		probs.Add(s.job.Beam.Where("section"), "%v", err)
		return nil, probs.Err()
	}

	sp, err := s.spliceProblem()
	if err != nil {
		return nil, err
	}
	sp.Minimum = s.minimumForces()
	s.Splice = sp
	s.PlateGrade, s.Rates = sp.PlateSteel.Name, sp.Rates
	if job.Forces != nil {
		if s.Table, err = s.readTable(); err != nil {
			return nil, err
		}
		s.Zones = keepOutZones(s.Model, tableJumps(s.Model, s.Table.Envelopes.Stations), s.KeepOut, s.Limits.MinLength)
	} else {
		s.Zones = KeepOutZones(s.Model, s.Cases, s.KeepOut, s.Limits.MinLength)
	}
	s.Notes = notesOf(job)
	if err := s.preferences(); err != nil {
		return nil, err
	}
	if err := s.detailable(); err != nil {
		return nil, err
	}
	s.Defaults = defaultsOf(job)
	return s, nil
}

// transport resolves the limits, keep-outs, splice counts, vehicles, lift rate and scan.
func (s *Setup) transport() {
	job := s.job
	s.Limits = PieceLimits{MaxLength: math.Inf(1), MaxMass: math.Inf(1), MinLength: DefaultMinPieceLength}
	s.MaxSplices = -1
	if l := job.Limits; l != nil {
		if l.MaxPieceLength != nil {
			s.Limits.MaxLength = l.MaxPieceLength.MM()
		}
		// Without min_piece_length a piece must still be long enough to carry the cover
		// plates of the splices at its ends without the plates of two splices meeting.
		if l.MinPieceLength != nil {
			s.Limits.MinLength = l.MinPieceLength.MM()
		}
		if l.MaxPieceMass != nil {
			s.Limits.MaxMass = l.MaxPieceMass.KG()
		}
		if l.Rigging != nil {
			s.Limits.Rigging = l.Rigging.KG()
		}
		if k := l.KeepOut; k != nil {
			if k.Supports != nil {
				s.KeepOut.Supports = k.Supports.MM()
			}
			if k.PointLoads != nil {
				s.KeepOut.PointLoads = k.PointLoads.MM()
			}
			for _, r := range k.Ranges {
				s.KeepOut.Ranges = append(s.KeepOut.Ranges, [2]float64{r[0].MM(), r[1].MM()})
			}
		}
		if c := l.Splices; c != nil {
			if c.Min != nil {
				s.MinSplices = *c.Min
			}
			if c.Max != nil {
				s.MaxSplices = *c.Max
			}
		}
	}
	for _, v := range job.Vehicles {
		s.Vehicles = append(s.Vehicles, Vehicle{Name: v.Name, MaxLength: v.MaxLength.MM(), Payload: v.Payload.KG(), Cost: v.Cost})
	}
	if c := job.Costs; c != nil {
		s.Costed = true
		s.Lift = deref(c.Lift)
	}
	s.Deflection = beam.DeflectionLimits{Span: beam.DefaultSpanRatio, Overhang: beam.DefaultOverhangRatio}
	if l := job.Limits; l != nil && l.Deflection != nil {
		if v := l.Deflection.Span; v != nil {
			s.Deflection.Span = *v
		}
		if v := l.Deflection.Overhang; v != nil {
			s.Deflection.Overhang = *v
		}
	}
	s.Step, s.Alternatives = DefaultStep, DefaultAlternatives
	if sc := job.Scan; sc != nil {
		if sc.Step != nil {
			s.Step = sc.Step.MM()
		}
		if sc.Alternatives != nil {
			s.Alternatives = *sc.Alternatives
		}
		if sc.Uniform != nil {
			s.Uniform = *sc.Uniform
		}
	}
}

// defaultsOf lists the key paths a job leaves out, which take their default.
func defaultsOf(job *jobfile.Job) []string {
	var out []string
	given := func(present bool, path string) bool {
		if !present {
			out = append(out, path)
		}
		return present
	}
	b := job.Beam
	for _, k := range []string{"grade", "grade_table", "overhang.left", "overhang.right", "hinges", "self_weight"} {
		given(b.Has(k), "beam."+k)
	}
	for _, e := range job.Cases {
		given(e.Value.Has("pattern"), "cases."+e.Key+".pattern")
	}
	cb := job.Combinations
	keys := []string{"rules", "uls", "sls", "roof_imposed_separate"}
	for _, k := range jobfile.OverrideKeys() {
		keys = append(keys, "overrides."+k)
	}
	for _, k := range keys {
		given(cb != nil && cb.Has(k), "combinations."+k)
	}
	l := job.Limits
	for _, k := range []string{"max_piece_length", "min_piece_length", "max_piece_mass", "keep_out.supports",
		"keep_out.point_loads", "splices.min", "splices.max", "deflection.span", "deflection.overhang"} {
		given(l != nil && l.Has(k), "limits."+k)
	}
	if w := b.Section.Welded; w != nil {
		given(w.WeldThroat != nil, "beam.section.welded.weld_throat")
	}
	o := job.Splice
	for _, k := range []string{"category", "distribution", "gap", "bolts.sizes", "bolts.classes", "bolts.min_size",
		"bolts.max_size", "plates.grade", "plates.thicknesses", "flange_plates", "minimum_forces",
		"detailing.min_plate_to_flange"} {
		given(o != nil && o.Has(k), "splice."+k)
	}
	given(o != nil && (o.Has("detailing.gauge") || o.Has("detailing.gauges")), "splice.detailing.gauge")
	for _, k := range []string{"assemblies.system", "assemblies.shear_planes"} {
		given(o != nil && o.Has(k), "splice."+k)
	}
	if c := job.Costs; given(c != nil, "costs") {
		for _, r := range []struct {
			key string
			v   *float64
		}{{"plate_per_kg", c.PlatePerKg}, {"hole", c.Hole}, {"faying_per_m2", c.FayingPerM2}, {"splice", c.Splice}, {"lift", c.Lift},
			{"assembly_per_kg", c.AssemblyPerKg}} {
			given(r.v != nil, "costs."+r.key)
		}
	}
	sc := job.Scan
	given(sc != nil && sc.Step != nil, "scan.step")
	given(sc != nil && sc.Alternatives != nil, "scan.alternatives")
	given(sc != nil && sc.Uniform != nil, "scan.uniform")
	slices.Sort(out)
	return slices.Compact(out)
}

// notesOf says what a job's omissions mean for its results.
func notesOf(job *jobfile.Job) []string {
	out := []string{}
	if job.Limits == nil || (job.Limits.MaxPieceLength == nil && job.Limits.MaxPieceMass == nil) {
		out = append(out, "no max_piece_length or max_piece_mass: nothing forces a splice, and optimise may find the unspliced beam best")
	}
	if len(job.Vehicles) == 0 {
		out = append(out, "no vehicles: transport is not costed")
	}
	if job.Costs == nil {
		out = append(out, "no costs block: splices are priced at invented indicative rates, for ranking only, and lifts cost nothing")
	}
	if w := job.Beam.Section.Welded; w != nil && w.WeldThroat == nil {
		out = append(out, "beam.section.welded gives no weld_throat: the web-to-flange welds are ignored, so the web plates "+
			"fill the clear web less the clearance and may reach the welds; give weld_throat (mm) to keep them clear")
	}
	return out
}

// readTable reads the job's forces table, its path relative to the job file. Slip at SLS
// (category B) needs the SLS forces.
func (s *Setup) readTable() (*forcetable.Table, error) {
	path := forcetable.ResolvePath(s.File, s.job.Forces.File)
	opt := forcetable.Options{Length: s.Model.Length}
	if s.Splice.Sizing.Category == splice.CategoryB {
		opt.NeedSLS = true
		opt.SLSReason = "splice.category B is checked for slip at SLS (EN 1993-1-8 Table 3.2, 3.9)"
	}
	return forcetable.ReadFile(path, opt)
}

// minimumForces resolves splice.minimum_forces against the beam's own resistances: Mc,Rd in
// the class the section has in pure bending (EN 1993-1-1 6.2.5, Table 5.2), Vc,Rd (6.2.6)
// and Npl,Rd (6.2.3, 6.2.4).
func (s *Setup) minimumForces() splice.MinimumAction {
	o := s.job.Splice
	if o == nil || o.MinimumForces == nil {
		return splice.MinimumAction{}
	}
	m := s.Member
	mc := m.MplRd
	if m.Classify(m.MplRd, 0).Class > beam.Class2 {
		mc = m.MelRd
	}
	f := o.MinimumForces
	return splice.MinimumAction{MomentFraction: deref(f.Moment), ShearFraction: deref(f.Shear), AxialFraction: deref(f.Axial),
		McRd: mc, VcRd: m.VplRd, NplRd: m.NplRd}
}
