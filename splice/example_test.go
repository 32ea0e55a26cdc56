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
// M = +400/−250 kNm, V = 300 kN, N = +100/−150 kN at ULS, over the default design space.
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
	// Output:
	// sized: bolts M20 10.9
	// flange: outer 10×200 mm, inner plates true, 2 lines × 2 rows
	// web: 2 × 10×415 mm, 2 columns × 4 rows
	// governing flange.bolt.shear, utilisation 0.931
	// 32 bolts, 58.5 kg of plate, cost 613.25 (indicative rates)
}
