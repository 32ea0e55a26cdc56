package splice_test

import (
	"fmt"

	"spanbreak/splice"
)

// ExampleSelectAssembly chooses the preloaded M20 10.9 assemblies of an IPE 500 splice
// (tf = 16 mm, tw = 10.2 mm): the flange group clamps the outer plate, the flange and an inner
// plate; the web group a plate, the web and a plate. The head sits on the first ply.
func ExampleSelectAssembly() {
	groups := []struct {
		name  string
		plies []float64
	}{
		{"flange", []float64{15, 16, 15}}, // outer plate, beam flange, inner plate [mm]
		{"web", []float64{10, 10.2, 10}},  // plate, beam web, plate [mm]
	}
	for _, g := range groups {
		a, err := splice.SelectAssembly(splice.AssemblySpec{Size: "M20", Class: "10.9", Preloaded: true, Plies: g.plies})
		if err != nil {
			panic(err)
		}
		fmt.Printf("%s: %s\n", g.name, a.Designation)
		fmt.Printf("  grip %.1f mm, clamp %.1f mm, needs %.1f mm, ls,min %.1f mm, %.3f kg\n",
			a.Grip, a.Clamp, a.RequiredLength, a.ShankMin, a.Mass)
		for i, p := range a.Planes {
			where := "plain shank"
			if p.Threaded {
				where = "thread"
			}
			fmt.Printf("  plane %d at %.1f mm: %s\n", i+1, p.Position, where)
		}
	}
	// Output:
	// flange: M20×75 HV 10.9 (EN 14399-4), nut EN 14399-4, 2 washers EN 14399-6
	//   grip 46.0 mm, clamp 54.0 mm, needs 73.1 mm, ls,min 34.5 mm, 0.387 kg
	//   plane 1 at 19.3 mm: plain shank
	//   plane 2 at 35.3 mm: thread
	// web: M20×60 HV 10.9 (EN 14399-4), nut EN 14399-4, 2 washers EN 14399-6
	//   grip 30.2 mm, clamp 38.2 mm, needs 57.3 mm, ls,min 19.5 mm, 0.350 kg
	//   plane 1 at 14.3 mm: plain shank
	//   plane 2 at 24.5 mm: thread
}
