package optimise

import (
	"fmt"
	"strings"

	"spanbreak/beam"
	"spanbreak/optimise/jobfile"
	"spanbreak/splice"
)

// spliceProblem turns the job's splice and costs blocks into a splice sizing problem without
// forces (the caller sets ULS and SLS for each position). Defaults where a block or key is
// absent: category A (bearing), normal holes, the splice package's gap and design-space lists,
// the beam's grade for the plates, bolt sizes limited to those priced in costs.bolt, and the
// splice package's indicative rates when the job has no costs block. A category B or C splice
// needs friction_class. Problems are reported against the job file's keys.
func (s *Setup) spliceProblem() (splice.Problem, error) {
	var probs jobfile.Problems
	job := s.job
	opts := job.Splice
	where := func(key string) jobfile.Loc {
		if opts == nil {
			return job.Where("splice")
		}
		return opts.Where(key)
	}
	member, err := splice.NewMember(s.Section, s.steel(s.Grade))
	if err != nil {
		probs.Add(job.Beam.Where("grade"), "%v", err)
	}
	member.WeldThroat = s.WeldThroat
	p := splice.Problem{Member: member, Brief: true, Rates: s.rates()}
	p.PlateSteel = s.steel(s.Grade)
	z := splice.Sizing{Category: splice.CategoryA, Gap: splice.DefaultGap}
	if opts != nil {
		if opts.Category != "" {
			cat, err := splice.ParseCategory(opts.Category)
			if err != nil {
				probs.Add(where("category"), "%v", err)
			}
			z.Category = cat
		}
		if z.Category.Preloaded() {
			if opts.FrictionClass == "" {
				probs.Add(where("friction_class"), "a category %s (slip-resistant) splice needs friction_class (A, B, C or D)", z.Category)
			} else if fc, err := splice.ParseFrictionClass(opts.FrictionClass); err != nil {
				probs.Add(where("friction_class"), "%v", err)
			} else {
				z.FrictionClass = fc
			}
		}
		if opts.Gap != nil {
			z.Gap = opts.Gap.MM()
		}
		if d, err := splice.ParseDistribution(opts.Distribution); err != nil {
			probs.Add(where("distribution"), "%v", err)
		} else {
			p.Distribution = d
		}
		if b := opts.Bolts; b != nil {
			z.Space.Sizes, z.Space.Classes = b.Sizes, b.Classes
			z.Space.MinSize, z.Space.MaxSize = b.MinSize, b.MaxSize
		}
		p.Detailing, s.GaugeKey = s.detailing(opts.Detailing)
		if pl := opts.Plates; pl != nil {
			if strings.TrimSpace(pl.Grade) != "" {
				g, err := beam.LookupGrade(pl.Grade)
				if err != nil {
					probs.Add(pl.Where("grade"), "%v", err)
				} else {
					p.PlateSteel = s.steel(g)
				}
			}
			for _, t := range pl.Thicknesses {
				z.Space.Thicknesses = append(z.Space.Thicknesses, t.MM())
			}
		}
		if a := opts.Assemblies; a != nil {
			rule, err := splice.ParseShearPlaneRule(a.ShearPlanes)
			if err != nil {
				probs.Add(a.Where("shear_planes"), "%v", err)
			}
			z.ShearPlanes, z.System = rule, splice.AssemblySystem(a.System)
		}
		for i, a := range opts.FlangePlates {
			arr, err := splice.ParseArrangement(a)
			if err != nil {
				probs.Add(opts.Where(fmt.Sprintf("flange_plates[%d]", i)), "%v", err)
				continue
			}
			z.Space.Arrangements = append(z.Space.Arrangements, arr)
		}
	} else {
		p.Distribution = splice.Proportional
	}
	if len(z.Space.Sizes) == 0 && job.Costs != nil && len(job.Costs.Bolt) > 0 {
		// the default sizes would include some without a rate: take the priced ones
		for _, size := range splice.DefaultDesignSpace().Sizes {
			if job.Costs.Bolt.Has(size) {
				z.Space.Sizes = append(z.Space.Sizes, size)
			}
		}
		if len(z.Space.Sizes) == 0 {
			z.Space.Sizes = job.Costs.Bolt.Keys()
		}
	}
	def := splice.DefaultDesignSpace()
	if len(z.Space.Sizes) == 0 {
		z.Space.Sizes = def.Sizes
	}
	if len(z.Space.Classes) == 0 {
		z.Space.Classes = def.Classes
	}
	if len(z.Space.Thicknesses) == 0 {
		z.Space.Thicknesses = def.Thicknesses
	}
	if len(z.Space.Arrangements) == 0 {
		z.Space.Arrangements = def.Arrangements
	}
	if z.System == splice.SystemHV {
		for _, c := range z.Space.Classes {
			if strings.TrimSpace(c) != "10.9" {
				probs.Add(opts.Assemblies.Where("system"), "HV assemblies (EN 14399-4) are made in class 10.9 only; the bolt classes tried include %s: use HR, or splice.bolts.classes: [\"10.9\"]", c)
				break
			}
		}
	}
	p.Sizing = z
	if len(probs) > 0 {
		return splice.Problem{}, probs.Err()
	}
	// unknown bounds and an empty result are reported at their keys by preferences
	s.BoltSizes, _ = splice.FilterBoltSizes(z.Space.Sizes, z.Space.MinSize, z.Space.MaxSize)
	return p, nil
}

// detailing converts splice.detailing into the sizing's detailing rules, resolving a table of
// gauges by flange width for the job's section: the entry with the largest width not above
// the flange width b (to sameWidth). It returns the key the gauge came from, "" when the
// sizing chooses it.
func (s *Setup) detailing(d *jobfile.Detailing) (splice.Detailing, string) {
	var det splice.Detailing
	if d == nil {
		return det, ""
	}
	if d.MinPlateToFlange != nil {
		det.MinPlateToFlange = *d.MinPlateToFlange
	}
	if d.Gauge != nil {
		det.Gauge = d.Gauge.MM()
		return det, "splice.detailing.gauge"
	}
	if i := s.gaugeEntry(d); i >= 0 {
		det.Gauge = d.Gauges[i].Gauge.MM()
		return det, fmt.Sprintf("splice.detailing.gauges[%d]", i)
	}
	return det, ""
}

// sameWidth is the tolerance on a flange width matched to an entry of splice.detailing.gauges
// [mm].
const sameWidth = 0.5

// gaugeEntry is the index of the entry of splice.detailing.gauges for the job's section, −1
// when every entry is for wider flanges.
func (s *Setup) gaugeEntry(d *jobfile.Detailing) int {
	best := -1
	for i, e := range d.Gauges {
		if e.Width.MM() <= s.Section.B+sameWidth && (best < 0 || e.Width > d.Gauges[best].Width) {
			best = i
		}
	}
	return best
}

// steel adapts a grade of the beam package to the splice package's strength lookup.
func (s *Setup) steel(g beam.Grade) splice.Steel {
	table := s.GradeTable
	return splice.Steel{Name: g.Name, Strength: func(t float64) (float64, float64, error) { return g.Strength(t, table) }}
}

// rates converts the costs block; without one the splice package's indicative rates apply.
func (s *Setup) rates() splice.Rates {
	c := s.job.Costs
	if c == nil {
		return splice.DefaultRates()
	}
	r := splice.Rates{Bolt: map[string]float64{}, BoltClassFactor: map[string]float64{}}
	for _, e := range c.Bolt {
		r.Bolt[e.Key] = e.Value
	}
	for _, e := range c.BoltClassFactor {
		r.BoltClassFactor[e.Key] = e.Value
	}
	r.PlatePerKg, r.Hole, r.FayingPerM2, r.Splice = deref(c.PlatePerKg), deref(c.Hole), deref(c.FayingPerM2), deref(c.Splice)
	r.AssemblyPerKg = deref(c.AssemblyPerKg)
	return r
}

func deref(p *float64) float64 {
	if p == nil {
		return 0
	}
	return *p
}

// SpliceDesigner sizes splices with the splice package: Size, or SizeExhaustive for the
// reference run. It is safe for concurrent use (each call works on its own copy of the
// problem).
type SpliceDesigner struct {
	Problem    splice.Problem // without forces
	Exhaustive bool
	// Fixed, when set, is the one splice checked at every position instead of sizing one:
	// a position is feasible where all its checks pass.
	Fixed *splice.Geometry

	sizer *splice.Sizer // Problem's sizer, which keeps the layouts between positions
}

// catalogue lists the design space of the designer's problem, sharing the sizer's layouts.
func (d *SpliceDesigner) catalogue() (*splice.Catalogue, error) {
	if d.sizer == nil {
		return splice.NewCatalogue(d.Problem)
	}
	return d.sizer.Catalogue()
}

// NewSpliceDesigner builds the designer of a job. Its Problem is not to be changed afterwards:
// the designer keeps what the sizing of that problem does not owe to the forces, in a sizer
// shared with every designer of an equal problem on the job's shelf.
func (s *Setup) NewSpliceDesigner(exhaustive bool) *SpliceDesigner {
	return &SpliceDesigner{Problem: s.Splice, Exhaustive: exhaustive, sizer: s.shelf.Sizer(s.Splice)}
}

// Design sizes the cheapest splice for the forces.
func (d *SpliceDesigner) Design(f PositionForces) (SpliceDesign, error) {
	p := d.Problem
	p.ULS = splice.Forces(f.ULS)
	sls := splice.Forces(f.SLS)
	p.SLS = &sls
	var r splice.Result
	var err error
	switch {
	case d.Fixed != nil:
		r, err = splice.Verify(p, *d.Fixed)
	case d.Exhaustive:
		r, err = splice.SizeExhaustive(p)
	case d.sizer != nil:
		r, err = d.sizer.Size(p.ULS, p.SLS)
	default:
		r, err = splice.Size(p)
	}
	if err != nil {
		return SpliceDesign{}, err
	}
	g := r.Geometry // a copy: a pointer into r would keep the whole result with its checks
	out := SpliceDesign{
		Feasible:    r.Pass && (d.Fixed != nil || r.Status == splice.Sized),
		Utilisation: r.Utilisation,
		Governing:   r.Governing.ID,
		Summary:     summary(r.Geometry),
		Geometry:    &g,
	}
	if !out.Feasible {
		if d.Fixed != nil {
			out.Reason = fmt.Sprintf("the fixed splice fails %s (%s) at utilisation %.3f, %.1f %% over",
				r.Governing.ID, r.Governing.Clause, r.Utilisation, 100*(r.Utilisation-1))
			return out, nil
		}
		out.Reason = fmt.Sprintf("no splice passes: the closest (%s) fails %s (%s) at utilisation %.3f, %.1f %% over",
			out.Summary, r.Governing.ID, r.Governing.Clause, r.Utilisation, 100*(r.Utilisation-1))
		if r.Governing.Impossible != "" {
			out.Reason = fmt.Sprintf("no splice passes: the closest (%s) cannot be made, %s (%s): %s",
				out.Summary, r.Governing.ID, r.Governing.Clause, r.Governing.Impossible)
		}
		return out, nil
	}
	q := r.Quantities
	out.Cost, out.Bolts, out.Holes, out.PlateMass, out.FayingArea = r.Cost.Total, q.Bolts, q.Holes, q.PlateMass, q.FayingArea
	out.BoltMass = q.BoltMass
	return out, nil
}

// summary describes a splice in one line.
func summary(g splice.Geometry) string {
	fl := g.Flange
	plates := fmt.Sprintf("outer %g×%g", fl.Outer.Thickness, fl.Outer.Width)
	if fl.HasInner() {
		plates += fmt.Sprintf(" + 2 inner %g×%g", fl.Inner.Thickness, fl.Inner.Width)
	}
	return fmt.Sprintf("%s %s; flanges %s, %d×%d bolts each side; web 2 × %g×%g, %d×%d bolts each side",
		g.Bolt.Size, g.Bolt.Class, plates, fl.Columns, fl.Rows, g.Web.Thickness, g.Web.Depth, g.Web.Columns, g.Web.Rows)
}
