package optimise

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"

	"spanbreak/beam"
	"spanbreak/optimise/jobfile"
	"spanbreak/splice"
)

// DesignOutcome is one splice sized or checked at one position, with what the sheet's header
// says about where its forces came from.
type DesignOutcome struct {
	Problem    splice.Problem // the forces and the splice options, Brief off
	Result     splice.Result  // every check in full
	Position   *float64       // [m], nil when unknown (direct forces without a position)
	Input      string         // what the forces came from
	SpliceFile string         // the fixed splice checked, "" when sized
	Section    string
	Grade      string
	PlateGrade string
	Indicative bool // priced at the splice package's indicative rates
	// Origins name the combination and pattern of every design force; nil for direct forces.
	Origins *PositionOrigins
	// Beam is the beam's cross-section under the same design forces; Member the beam's own
	// checks over its whole length (nil for direct forces).
	Beam   SectionCheck
	Member *MemberChecks
	// KeepOut is the job's keep-out zone that holds the position, if any (the first, as in
	// the scan), clipped to the beam: the design still runs, but the optimiser would put no
	// splice there.
	KeepOut *Zone
}

// DesignAt sizes the cheapest splice for the envelope forces at x [mm] (the worse side at a
// jump), or checks the fixed splice when one is given (file names it for the sheet). A
// position inside a keep-out zone is designed all the same, with the zone in KeepOut.
func DesignAt(s *Setup, x float64, fixed *splice.Geometry, file string) (*DesignOutcome, error) {
	if !(x >= 0 && x <= s.Model.Length) {
		return nil, &SettingError{"at", fmt.Errorf("%g m is off the beam (0 to %g m)", x/1e3, s.Model.Length/1e3)}
	}
	src, err := s.Forces()
	if err != nil {
		return nil, err
	}
	fs, origins, err := src.Traced([]float64{x})
	if err != nil {
		return nil, err
	}
	fine, err := src.Chart()
	if err != nil {
		return nil, err
	}
	member, err := src.Member(&fine)
	if err != nil {
		return nil, err
	}
	section, err := s.SectionAt(fs[0].ULS)
	if err != nil {
		return nil, err
	}
	p := s.Splice
	p.Brief = false
	p.ULS = splice.Forces(fs[0].ULS)
	sls := splice.Forces(fs[0].SLS)
	p.SLS = &sls
	pos := x / 1e3
	o := &DesignOutcome{Problem: p, Position: &pos, SpliceFile: file,
		Input:   fmt.Sprintf("%s, %s at x = %.3f m (worse side at a jump)", s.File, s.forcesWords(), pos),
		Section: s.Section.Name, Grade: s.Grade.Name, PlateGrade: s.PlateGrade, Indicative: !s.Costed,
		Origins: &origins[0], Member: &member, Beam: section}
	if z := zoneAt(s.Zones, x); z != nil {
		z.From, z.To = math.Max(0, z.From), math.Min(s.Model.Length, z.To)
		o.KeepOut = z
	}
	return o, o.run(fixed)
}

// DirectSpec are the inputs of a design from direct forces: the section and grades by name,
// the forces, and the splice options for sizing.
type DirectSpec struct {
	Section       string // catalogue name, or "welded HxBxTWxTF" [mm]
	Grade         string // beam steel grade
	PlateGrade    string // cover plate grade; "" means the beam's
	ULS           splice.Forces
	SLS           *splice.Forces // nil when none is given
	Position      *float64       // [m], for the sheet only
	Category      string         // A, B or C (sizing)
	FrictionClass string         // A to D (sizing, categories B and C)
	Distribution  string         // proportional or flanges-only
	Gap           float64        // between the beam ends [mm] (sizing)
}

// DirectDesign sizes the cheapest splice for direct forces, or checks the fixed splice when
// one is given. A name or option that cannot be used is a *SettingError naming it.
func DirectDesign(spec DirectSpec, fixed *splice.Geometry, file string) (*DesignOutcome, error) {
	sec, err := directSection(spec.Section)
	if err != nil {
		return nil, &SettingError{"section", err}
	}
	grade, err := beam.LookupGrade(spec.Grade)
	if err != nil {
		return nil, &SettingError{"grade", err}
	}
	plate := grade
	if strings.TrimSpace(spec.PlateGrade) != "" {
		if plate, err = beam.LookupGrade(spec.PlateGrade); err != nil {
			return nil, &SettingError{"plate-grade", err}
		}
	}
	m, err := splice.NewMember(sec, directSteel(grade))
	if err != nil {
		return nil, err
	}
	bm, err := beam.NewMember(sec, grade, beam.MemberSettings{Table: beam.TableEN1993})
	if err != nil {
		return nil, &SettingError{"section", err}
	}
	forces := ForceSet{MMax: spec.ULS.MMax, MMin: spec.ULS.MMin, V: math.Abs(spec.ULS.V), NMax: spec.ULS.NMax, NMin: spec.ULS.NMin}
	section, err := sectionAt(bm, forces)
	if err != nil {
		return nil, err
	}
	dist, err := splice.ParseDistribution(spec.Distribution)
	if err != nil {
		return nil, &SettingError{"distribution", err}
	}
	z := splice.Sizing{Gap: spec.Gap}
	if fixed == nil {
		if z.Category, err = splice.ParseCategory(spec.Category); err != nil {
			return nil, &SettingError{"category", err}
		}
		if z.Category.Preloaded() {
			if z.FrictionClass, err = splice.ParseFrictionClass(spec.FrictionClass); err != nil {
				return nil, &SettingError{"friction-class", err}
			}
		}
	}
	o := &DesignOutcome{
		Problem:  splice.Problem{Member: m, ULS: spec.ULS, SLS: spec.SLS, PlateSteel: directSteel(plate), Distribution: dist, Sizing: z},
		Position: spec.Position, SpliceFile: file,
		Input:   "direct forces (--section, --grade, --uls, --sls)",
		Section: sec.Name, Grade: grade.Name, PlateGrade: plate.Name, Indicative: true, Beam: section,
	}
	return o, o.run(fixed)
}

// run sizes the splice, or checks the fixed one.
func (o *DesignOutcome) run(fixed *splice.Geometry) error {
	var err error
	if fixed != nil {
		o.Result, err = splice.Verify(o.Problem, *fixed)
		if err != nil {
			return fmt.Errorf("%s: %w", o.SpliceFile, err)
		}
		return nil
	}
	o.Result, err = splice.Size(o.Problem)
	return err
}

// directSteel adapts a grade to the splice package, with EN 1993-1-1 Table 3.1 strengths.
func directSteel(g beam.Grade) splice.Steel {
	return splice.Steel{Name: g.Name, Strength: func(t float64) (float64, float64, error) { return g.Strength(t, beam.TableEN1993) }}
}

// directSection reads a catalogue name or "welded HxBxTWxTF" [mm].
func directSection(name string) (beam.Section, error) {
	s := strings.TrimSpace(name)
	if rest, ok := strings.CutPrefix(strings.ToLower(s), "welded"); ok {
		parts := strings.FieldsFunc(rest, func(r rune) bool { return r == 'x' || r == '×' || r == ' ' || r == '*' })
		if len(parts) != 4 {
			return beam.Section{}, fmt.Errorf("%q: a welded section is \"welded HxBxTWxTF\" in mm, e.g. \"welded 900x300x12x25\"", name)
		}
		var v [4]float64
		for i, p := range parts {
			f, err := strconv.ParseFloat(p, 64)
			if err != nil {
				return beam.Section{}, fmt.Errorf("%q: %q is not a size in mm", name, p)
			}
			v[i] = f
		}
		return beam.WeldedSection(v[0], v[1], v[2], v[3])
	}
	return beam.LookupSection(s)
}

// LoadSpliceFile reads a splice file (DESIGN.md section 8): strict decoding and validation,
// every problem located; the geometry in mm.
func LoadSpliceFile(file string, data []byte) (splice.Geometry, error) {
	sf, err := jobfile.LoadSpliceFile(file, data)
	if err != nil {
		return splice.Geometry{}, err
	}
	opt := func(v *jobfile.Millimetres) float64 {
		if v == nil {
			return 0
		}
		return v.MM()
	}
	fl, wb := sf.Flange, sf.Web
	g := splice.Geometry{
		Bolt:          spliceBolt(sf.Bolt),
		Category:      splice.Category(strings.ToUpper(strings.TrimSpace(sf.Category))),
		FrictionClass: splice.FrictionClass(strings.ToUpper(strings.TrimSpace(sf.FrictionClass))),
		Holes:         splice.HoleType(sf.Holes),
		Gap:           sf.Gap.MM(),
		Flange: splice.FlangeSplice{
			Outer:   splice.Plate{Thickness: fl.Outer.Thickness.MM(), Width: fl.Outer.Width.MM()},
			Columns: fl.Columns, Rows: fl.Rows, Gauge: fl.Gauge.MM(), Pitch: opt(fl.Pitch),
			End: fl.End.MM(), Edge: fl.Edge.MM(),
		},
		Web: splice.WebSplice{
			Thickness: wb.Thickness.MM(), Depth: wb.Depth.MM(), Columns: wb.Columns, Rows: wb.Rows,
			Pitch: opt(wb.Pitch), Spacing: opt(wb.Spacing), End: wb.End.MM(), Edge: wb.Edge.MM(),
		},
	}
	if fl.Inner != nil {
		g.Flange.Inner = splice.Plate{Thickness: fl.Inner.Thickness.MM(), Width: fl.Inner.Width.MM()}
	}
	if err := locateGeometry(sf, splice.CheckGeometry(g)); err != nil {
		return splice.Geometry{}, err
	}
	return g, nil
}

// spliceBolt is a splice file's bolt in the splice package's terms (the file's names are
// checked by jobfile).
func spliceBolt(b jobfile.BoltSpec) splice.Bolt {
	rule, _ := splice.ParseShearPlaneRule(b.ShearPlanes())
	return splice.Bolt{Size: b.Size, Class: b.Class, ShearPlanes: rule, System: splice.AssemblySystem(b.System)}
}

// forcesWords says where the job's design forces come from.
func (s *Setup) forcesWords() string {
	if s.Table != nil {
		return "forces imported from " + s.Table.File
	}
	return "envelopes"
}

// locateGeometry places each problem of a splice's geometry (an edge that disagrees with the
// width and gauge, bolt lines off a plate) at its key in the splice file.
func locateGeometry(sf *jobfile.SpliceFile, err error) error {
	if err == nil {
		return nil
	}
	var probs jobfile.Problems
	var errs []error
	if joined, ok := err.(interface{ Unwrap() []error }); ok {
		errs = joined.Unwrap()
	} else {
		errs = []error{err}
	}
	for _, e := range errs {
		var fe *splice.FieldError
		if errors.As(e, &fe) {
			probs.Add(sf.Where(fe.Field), "%v", fe.Err)
		} else {
			probs.Add(sf.Where(""), "%v", e)
		}
	}
	return probs.Err()
}
