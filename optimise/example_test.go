package optimise_test

import (
	"fmt"
	"math"

	"spanbreak/optimise"
)

// momentPriced is a stand-in designer for the example: a splice costs 200 plus 1 per kNm of
// the larger design moment, weighs 50 kg, and cannot be made above 600 kNm.
type momentPriced struct{}

func (momentPriced) Design(f optimise.PositionForces) (optimise.SpliceDesign, error) {
	m := math.Max(math.Abs(f.ULS.MMax), math.Abs(f.ULS.MMin)) / 1e6 // kNm
	if m > 600 {
		return optimise.SpliceDesign{Reason: fmt.Sprintf("%.0f kNm is over 600 kNm", m), Utilisation: m / 600}, nil
	}
	return optimise.SpliceDesign{Feasible: true, Cost: 200 + m, PlateMass: 40, BoltMass: 10, Utilisation: m / 600,
		Governing: "moment"}, nil
}

// ExampleOptimise scans the embedded demo job every 0.25 m with a stand-in designer (priced
// by the moment it carries) and prints the recommended layout.
func ExampleOptimise() {
	s, err := optimise.Prepare(optimise.DemoJobName, optimise.DemoJob())
	if err != nil {
		fmt.Println(err)
		return
	}
	r, err := optimise.Optimise(s, momentPriced{}, optimise.Settings{Step: 250})
	if err != nil {
		fmt.Println(err)
		return
	}
	best := r.Recommended()
	fmt.Printf("%d positions, %d splices at", len(r.Candidates), len(best.Splices))
	for _, x := range best.Splices {
		fmt.Printf(" %.2f m", x/1000)
	}
	fmt.Printf("\n%s, %d trip(s)\n", best.Vehicle, best.Trips)
	for _, p := range best.Pieces {
		fmt.Printf("piece %.3f–%.3f m: %.3f m, %.0f kg\n", p.From/1000, p.To/1000, p.Length/1000, p.Mass)
	}
	fmt.Printf("cost: splices %.2f + transport %.2f + erection %.2f = %.2f\n",
		best.Cost.Splices, best.Cost.Transport, best.Cost.Erection, best.Cost.Total)
	// Output:
	// 121 positions, 2 splices at 10.75 m 18.25 m
	// semi-trailer, 1 trip(s)
	// piece 0.000–10.745 m: 10.745 m, 859 kg
	// piece 10.755–18.245 m: 7.490 m, 631 kg
	// piece 18.255–30.300 m: 12.045 m, 959 kg
	// cost: splices 561.91 + transport 780.00 + erection 495.00 = 1836.91
}

// ExampleLayouts: a 20 m beam of 100 kg/m with a splice possible every metre (300 each,
// 40 kg); pieces of 2 to 13.6 m; a rigid lorry (8 m, 400 a trip) or a semi-trailer (13.6 m,
// 1500 a trip); 150 a lift. Two splices and the lorry beat one splice and the trailer.
func ExampleLayouts() {
	p := optimise.LayoutProblem{Length: 20000, MassPerLength: 0.1, MaxSplices: -1, Lift: 150, Extra: 2,
		Limits: optimise.PieceLimits{MaxLength: 13600, MinLength: 2000, MaxMass: math.Inf(1)},
		Vehicles: []optimise.Vehicle{{Name: "rigid", MaxLength: 8000, Payload: 10000, Cost: 400},
			{Name: "semi-trailer", MaxLength: 13600, Payload: 24000, Cost: 1500}}}
	for x := 1; x <= 19; x++ {
		p.Sites = append(p.Sites, optimise.Site{X: float64(x) * 1000, Cost: 300, Mass: 40})
	}
	res, err := optimise.Layouts(p)
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, l := range res.ByCount {
		fmt.Printf("%d splice(s) at %v mm on the %s: %.2f\n", len(l.Splices), l.Splices, l.Vehicle, l.Cost.Total)
	}
	fmt.Printf("recommended: %d splice(s)\n", len(res.Best().Splices))
	// Output:
	// 1 splice(s) at [7000] mm on the semi-trailer: 2100.00
	// 2 splice(s) at [4000 12000] mm on the rigid: 1450.00
	// 3 splice(s) at [2000 4000 12000] mm on the rigid: 1900.00
	// recommended: 2 splice(s)
}
