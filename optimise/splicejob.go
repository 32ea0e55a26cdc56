package optimise

import (
	"fmt"
	"math"
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
		}
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
	p.Sizing = z
	if len(probs) > 0 {
		return splice.Problem{}, probs.Err()
	}
	return p, nil
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
	// Tf, Tw are the beam's flange and web thicknesses [mm], for the bolt grip.
	Tf, Tw float64
}

// NewSpliceDesigner builds the designer of a job.
func (s *Setup) NewSpliceDesigner(exhaustive bool) *SpliceDesigner {
	return &SpliceDesigner{Problem: s.Splice, Exhaustive: exhaustive, Tf: s.Section.Tf, Tw: s.Section.Tw}
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
		return out, nil
	}
	q := r.Quantities
	out.Cost, out.Bolts, out.Holes, out.PlateMass, out.FayingArea = r.Cost.Total, q.Bolts, q.Holes, q.PlateMass, q.FayingArea
	out.BoltMass = d.boltMass(r)
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

// boltMass estimates the mass of the splice's bolt assemblies [kg]: per assembly a hexagon
// head and nut, two washers and a shank through the grip, from the proportions of EN 14399-4
// HR bolts and EN 14399-6 washers — width across flats s = 1.6d, head k = 0.65d, nut m = 0.9d,
// washer outside diameter 1.85d and thickness 4 mm (M ≤ 24) or 5 mm (from memory) — and
// steel at 7850 kg/m³ (EN 1991-1-1 Table A.4). It is a small part of a piece's mass.
func (d *SpliceDesigner) boltMass(r splice.Result) float64 {
	g := r.Geometry
	size, err := splice.LookupBoltSize(g.Bolt.Size)
	if err != nil {
		return 0
	}
	q := r.Quantities
	return d.flangeBoltMass(size, g.Flange, q.FlangeBolts) + d.webBoltMass(size, g.Web, q.WebBolts)
}

// flangeBoltMass is the mass of a flange splice's bolt assemblies [kg], both flanges.
func (d *SpliceDesigner) flangeBoltMass(size splice.BoltSize, fl splice.FlangeSplice, bolts int) float64 {
	return float64(bolts) * boltAssemblyMass(size, d.Tf+fl.Outer.Thickness+fl.Inner.Thickness+fl.Packing)
}

// webBoltMass is the mass of a web splice's bolt assemblies [kg].
func (d *SpliceDesigner) webBoltMass(size splice.BoltSize, w splice.WebSplice, bolts int) float64 {
	return float64(bolts) * boltAssemblyMass(size, d.Tw+2*w.Thickness+2*w.Packing)
}

// boltAssemblyMass is the estimated mass of one bolt, nut and two washers for a grip [kg].
func boltAssemblyMass(b splice.BoltSize, grip float64) float64 {
	const density = 7.85e-6 // kg/mm³
	dd := b.D
	s, k, m := 1.6*dd, 0.65*dd, 0.9*dd
	tw := 4.0
	if dd > 24 {
		tw = 5
	}
	hex := math.Sqrt(3) / 2 * s * s
	shankArea := math.Pi * dd * dd / 4
	washer := math.Pi / 4 * ((1.85*dd)*(1.85*dd) - b.D0Normal*b.D0Normal) * tw
	protrusion := 0.5 * dd // thread beyond the nut (common practice: at least one full thread, here half a diameter)
	shank := shankArea * (grip + 2*tw + m + protrusion)
	nut := (hex - shankArea) * m
	return density * (hex*k + nut + 2*washer + shank)
}
