package splice_test

import (
	"fmt"

	"spanbreak/beam"
	"spanbreak/splice"
)

// steel adapts a beam grade to the splice package (EN 1993-1-1 Table 3.1 strengths).
func steel(name string) splice.Steel {
	g, err := beam.LookupGrade(name)
	if err != nil {
		panic(err)
	}
	return splice.Steel{Name: g.Name, Strength: func(t float64) (float64, float64, error) { return g.Strength(t, beam.TableEN1993) }}
}

// ExampleSize sizes the cheapest slip-resistant (category B) splice of an IPE 500 in S355 for
// M = +400/−250 kNm, V = 300 kN, N = +100/−150 kN at ULS, over the default design space. The
// shear planes follow the bolt lengths chosen (the default rule): where a plane lies on the
// plain shank its bolt shear resistance is the higher one of EN 1993-1-8 Table 3.4.
func ExampleSize() {
	sec, err := beam.LookupSection("IPE 500")
	if err != nil {
		panic(err)
	}
	m, err := splice.NewMember(sec, steel("S355"))
	if err != nil {
		panic(err)
	}
	sls := splice.Forces{MMax: 280e6, MMin: -170e6, V: 210e3, NMax: 70e3, NMin: -100e3}
	r, err := splice.Size(splice.Problem{
		Member:     m,
		ULS:        splice.Forces{MMax: 400e6, MMin: -250e6, V: 300e3, NMax: 100e3, NMin: -150e3},
		SLS:        &sls,
		PlateSteel: steel("S355"),
		Sizing:     splice.Sizing{Category: splice.CategoryB, FrictionClass: "A", Gap: splice.DefaultGap},
	})
	if err != nil {
		panic(err)
	}
	g := r.Geometry
	fmt.Printf("%s: bolts %s %s\n", r.Status, g.Bolt.Size, g.Bolt.Class)
	fmt.Printf("flange: outer %g×%g mm, inner plates %v, %d lines × %d rows\n", g.Flange.Outer.Thickness, g.Flange.Outer.Width, g.Flange.HasInner(), g.Flange.Columns, g.Flange.Rows)
	fmt.Printf("web: 2 × %g×%g mm, %d columns × %d rows\n", g.Web.Thickness, g.Web.Depth, g.Web.Columns, g.Web.Rows)
	fmt.Printf("governing %s, utilisation %.3f\n", r.Governing.ID, r.Utilisation)
	fmt.Printf("%d bolts, %.1f kg of plate, cost %.2f (indicative rates)\n", r.Quantities.Bolts, r.Quantities.PlateMass, r.Cost.Total)
	for _, a := range r.Assemblies {
		fmt.Printf("%s: %d × %s\n", a.Group, a.Count, a.Assembly.Designation)
		for _, p := range a.Planes {
			where := "shank"
			if p.Threaded {
				where = "thread"
			}
			fmt.Printf("  %s at %.1f mm: %s, Fv,Rd = %.1f kN\n", p.Name, p.Position, where, p.FvRd/1e3)
		}
	}
	// Output:
	// sized: bolts M20 10.9
	// flange: outer 10×200 mm, inner plates true, 2 lines × 2 rows
	// web: 2 × 15×415 mm, 2 columns × 3 rows
	// governing flange.bolt.slip, utilisation 0.978
	// 28 bolts, 68.8 kg of plate, cost 599.71 (indicative rates)
	// flange: 16 × M20×65 HV 10.9 (EN 14399-4), nut EN 14399-4, 2 washers EN 14399-6
	//   outer plate / beam flange at 14.3 mm: shank, Fv,Rd = 150.8 kN
	//   beam flange / inner plate at 30.3 mm: thread, Fv,Rd = 98.0 kN
	// web: 12 × M20×70 HV 10.9 (EN 14399-4), nut EN 14399-4, 2 washers EN 14399-6
	//   web plate / beam web at 19.3 mm: shank, Fv,Rd = 150.8 kN
	//   beam web / web plate at 29.5 mm: shank, Fv,Rd = 150.8 kN
}
