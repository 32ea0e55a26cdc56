package splice

import (
	"cmp"
	"errors"
	"fmt"
	"maps"
	"math"
	"slices"
	"strings"
)

// Rates are the unit costs used to rank splices, in the user's currency.
type Rates struct {
	Bolt            map[string]float64 // per bolt assembly (bolt, nut, washers) by size, e.g. "M20"
	BoltClassFactor map[string]float64 // multiplies the bolt rate by class; a class not listed takes 1
	PlatePerKg      float64            // per kg of cover plate
	Hole            float64            // per hole drilled, counted in every ply
	FayingPerM2     float64            // per m² of prepared faying surface, categories B and C only
	Splice          float64            // fixed per splice (handling, marking, assembly)
	// AssemblyPerKg prices the bolt assemblies by their length: per kg of assembly (bolt, nut
	// and washers of the length chosen for each group), added to the Bolt rate before the
	// class factor. 0 (the default) prices assemblies by size and class alone.
	AssemblyPerKg float64
}

// DefaultRates returns invented, indicative rates for ranking only; they are not market prices
// and the user should set real ones. A Rates with a nil Bolt map is replaced by these.
func DefaultRates() Rates {
	return Rates{
		Bolt: map[string]float64{
			"M12": 1.6, "M16": 2.3, "M20": 3.2, "M22": 3.8, "M24": 4.5, "M27": 5.8, "M30": 7.4, "M36": 11.5,
		},
		BoltClassFactor: map[string]float64{"4.6": 0.8, "8.8": 1.0, "10.9": 1.3},
		PlatePerKg:      2.4,
		Hole:            1.8,
		FayingPerM2:     35,
		Splice:          120,
	}
}

func (r Rates) resolved() Rates {
	if r.Bolt == nil {
		return DefaultRates()
	}
	return r
}

func (r Rates) validate() error {
	var errs []error
	bad := func(v float64) bool { return !(v >= 0) || math.IsInf(v, 0) }
	neg := func(field string, v float64) {
		if bad(v) {
			errs = append(errs, fmt.Errorf("costs.%s: %g must be a rate of 0 or more", field, v))
		}
	}
	for _, k := range sortedKeys(r.Bolt) {
		if bad(r.Bolt[k]) {
			neg("bolt."+k, r.Bolt[k])
		}
	}
	for _, k := range sortedKeys(r.BoltClassFactor) {
		if bad(r.BoltClassFactor[k]) {
			neg("bolt_class_factor."+k, r.BoltClassFactor[k])
		}
	}
	neg("plate_per_kg", r.PlatePerKg)
	neg("hole", r.Hole)
	neg("faying_per_m2", r.FayingPerM2)
	neg("splice", r.Splice)
	neg("assembly_per_kg", r.AssemblyPerKg)
	return errors.Join(errs...)
}

// sortedKeys lists a map's keys in order, only when something in it is wrong (so that the
// common case does not allocate).
func sortedKeys(m map[string]float64) []string {
	ok := true
	for _, v := range m {
		if !(v >= 0) || math.IsInf(v, 0) {
			ok = false
		}
	}
	if ok {
		return nil
	}
	return slices.Sorted(maps.Keys(m))
}

// boltRate is the rate of one assembly of a size and class, and the rate per kg of assembly
// with the class factor applied.
func (r Rates) boltRate(size, class string) (perAssembly, perKg float64, err error) {
	v, ok := r.Bolt[size]
	if !ok {
		have := slices.Sorted(maps.Keys(r.Bolt))
		return 0, 0, fmt.Errorf("costs.bolt: no rate for %s (rates given for %s)", size, strings.Join(have, ", "))
	}
	f, ok := r.BoltClassFactor[class]
	if !ok {
		f = 1
	}
	return v * f, r.AssemblyPerKg * f, nil
}

// Quantities are what a splice takes to make: both flange splices, the web splice, both sides.
type Quantities struct {
	Bolts             int     // bolt assemblies
	FlangeBolts       int     //
	WebBolts          int     //
	BoltMass          float64 // bolt assemblies (bolt, nut, washers of the lengths chosen) [kg]
	FlangeBoltMass    float64 // [kg]
	WebBoltMass       float64 // [kg]
	Holes             int     // holes drilled, every ply counted (beam and plates)
	PlateMass         float64 // cover plates [kg]
	FlangePlateMass   float64 // [kg]
	WebPlateMass      float64 // [kg]
	FayingArea        float64 // prepared faying surfaces, both faces of every slip interface [m²]
	FlangePlateLength float64 // [mm]
	WebPlateLength    float64 // [mm]
}

// Cost is the cost of one splice by item, in the user's currency.
type Cost struct {
	Bolts, Holes, Plates, Faying, Splice, Total float64
}

// part quantities of one of the flange or web splices (all of it: both flanges, both sides).
type partQty struct {
	bolts, holes int
	mass, faying float64 // kg, m²
	boltMass     float64 // one assembly [kg]
}

func flangeQty(l *flangeLayout, gap float64) partQty {
	bolts := 4 * l.rows * l.cols
	plies := 2
	width := l.bo
	vol := l.bo * l.to
	if l.inner {
		plies = 3
		width += 2 * l.bi
		vol += 2 * l.bi * l.ti
	}
	return partQty{
		bolts:    bolts,
		holes:    bolts * plies,
		mass:     2 * vol * l.length * steelDensity,
		faying:   2 * 2 * width * (l.length - gap) * 1e-6,
		boltMass: l.fit.boltMass(),
	}
}

func webQty(l *webLayout, gap float64) partQty {
	bolts := 2 * l.rows * l.cols
	return partQty{
		bolts:    bolts,
		holes:    3 * bolts,
		mass:     2 * l.hp * l.tp * l.length * steelDensity,
		faying:   2 * 2 * l.hp * (l.length - gap) * 1e-6,
		boltMass: l.fit.boltMass(),
	}
}

// boltMass is one assembly's mass [kg]; a layout without its assembly (a sizing bound that does
// not price by mass, size.go) weighs nothing.
func (g *groupFit) boltMass() float64 {
	if g == nil {
		return 0
	}
	return g.mass
}

// micro is one millionth of a currency unit: costs are summed in whole micro-units so that a sum
// over parts is exact and the decomposed search ranks exactly as the exhaustive one.
const micro = 1e6

// unitRates are the rates in micro-units for one bolt.
type unitRates struct {
	bolt, hole    int64
	boltPerKg     float64 // per kg of assembly (rounded per assembly)
	plate, faying float64 // per kg, per m² (rounded per part)
	splice        int64
	preloaded     bool
}

func toMicro(x float64) int64 { return int64(math.Round(x * micro)) }

// score is the ranking of a configuration: cost, then fewer bolts, then lighter plates.
type score struct {
	cost  int64 // micro-units
	bolts int
	mass  int64 // grams
}

func (s score) add(o score) score {
	return score{cost: s.cost + o.cost, bolts: s.bolts + o.bolts, mass: s.mass + o.mass}
}

// cmp orders scores by cost, then bolts, then mass.
func (s score) cmp(o score) int {
	if c := cmp.Compare(s.cost, o.cost); c != 0 {
		return c
	}
	if c := cmp.Compare(s.bolts, o.bolts); c != 0 {
		return c
	}
	return cmp.Compare(s.mass, o.mass)
}

// byMass reports whether the price of an assembly depends on its mass (its length).
func (u *unitRates) byMass() bool { return u.boltPerKg != 0 }

// boltCost is the cost of one assembly of a part [micro-units].
func (u *unitRates) boltCost(q partQty) int64 { return u.bolt + toMicro(u.boltPerKg*q.boltMass) }

func (u *unitRates) score(q partQty) score {
	c := u.boltCost(q)*int64(q.bolts) + u.hole*int64(q.holes) + toMicro(u.plate*q.mass)
	if u.preloaded {
		c += toMicro(u.faying * q.faying)
	}
	return score{cost: c, bolts: q.bolts, mass: int64(math.Round(q.mass * 1000))}
}

// costOf prices the quantities with the same rounding as the search.
func costOf(u *unitRates, fq, wq partQty) (Quantities, Cost) {
	q := Quantities{
		Bolts: fq.bolts + wq.bolts, FlangeBolts: fq.bolts, WebBolts: wq.bolts,
		FlangeBoltMass: float64(fq.bolts) * fq.boltMass, WebBoltMass: float64(wq.bolts) * wq.boltMass,
		Holes:     fq.holes + wq.holes,
		PlateMass: fq.mass + wq.mass, FlangePlateMass: fq.mass, WebPlateMass: wq.mass,
		FayingArea: fq.faying + wq.faying,
	}
	c := Cost{
		Bolts:  float64(u.boltCost(fq)*int64(fq.bolts)+u.boltCost(wq)*int64(wq.bolts)) / micro,
		Holes:  float64(u.hole*int64(q.Holes)) / micro,
		Plates: float64(toMicro(u.plate*fq.mass)+toMicro(u.plate*wq.mass)) / micro,
		Splice: float64(u.splice) / micro,
	}
	q.BoltMass = q.FlangeBoltMass + q.WebBoltMass
	if u.preloaded {
		c.Faying = float64(toMicro(u.faying*fq.faying)+toMicro(u.faying*wq.faying)) / micro
	}
	total := u.splice + u.score(fq).cost + u.score(wq).cost
	c.Total = float64(total) / micro
	return q, c
}
