package beam

// The member checks of member.go at every station of a ULS envelope.

import (
	"errors"
	"fmt"
	"math"
)

// Bound says which extreme of an envelope a value comes from.
type Bound int

// The two extremes.
const (
	BoundMax Bound = iota
	BoundMin
)

// String returns "max" or "min".
func (b Bound) String() string {
	if b == BoundMin {
		return "min"
	}
	return "max"
}

// Pairing is one design force set at a station built from envelope extremes (DESIGN.md
// section 5, as the splice uses it): a moment extreme, the shear extreme of the larger |V|,
// and an axial extreme.
type Pairing struct {
	M, V, N                      Bound
	MExtreme, VExtreme, NExtreme Extreme
}

// String names the paired extremes, e.g. "M min with |V| from V max and N min".
func (p Pairing) String() string {
	return fmt.Sprintf("M %v with |V| from V %v and N %v", p.M, p.V, p.N)
}

// Forces returns the pairing's design forces.
func (p Pairing) Forces() SectionForces {
	return SectionForces{M: p.MExtreme.Value, V: p.VExtreme.Value, N: p.NExtreme.Value}
}

// MemberStation is the worst pairing at one station.
type MemberStation struct {
	Station Station
	// Utilisation is the highest over the station's pairings [-]; 0 where a pairing is class
	// 4 (no resistance is computed there).
	Utilisation float64
	Check       string       // id of the governing check; "" where a pairing is class 4
	Class       SectionClass // class of the governing pairing; Class4 where any pairing is
	Pairing     Pairing      // the governing pairing (the first class 4 one where there is one)
}

// MemberResult is the beam checked at every station of a ULS envelope.
type MemberResult struct {
	Member   Member
	Stations []MemberStation // one per envelope station, in order

	// Class is the worst class over every station and pairing. Class4 puts the whole member
	// outside scope: then the governing station is the first one where a pairing is class 4,
	// Section holds its class 4 result (no resistance) and Utilisation is 0.
	Class SectionClass

	Governing   int     // index into Stations of the highest utilisation (first of equals)
	Station     Station // Stations[Governing].Station
	X           float64 // its position [mm]
	Pairing     Pairing // the governing pairing there
	Combination string  // the governing moment extreme's combination and pattern, in words (Envelopes.Governing)
	// VCombination and NCombination name the combinations of the paired shear and axial
	// extremes, which may differ from the moment's (conservative pairing).
	VCombination, NCombination string

	// Section is the governing pairing in full: class, Mc,Rd, Vc,Rd, every check.
	Section     SectionResult
	McRd        float64 // Section.McRd: Mc,Rd in the governing pairing's class; 0 for class 4 [N·mm]
	VcRd        float64 // Section.VcRd: Vc,Rd = Vpl,Rd; 0 for class 4 [N]
	Check       string  // the governing check's id; "" for class 4
	Utilisation float64 // its utilisation [-]; 0 for class 4
}

// OutsideScope returns nil when every station is within what the checks cover, or an error
// wrapping ErrOutsideScope naming every reason (class 4 somewhere; a web that needs a
// shear-buckling check).
func (r MemberResult) OutsideScope() error {
	where := ""
	if r.Class == Class4 {
		where = fmt.Sprintf(" at x = %g mm (%v)", r.X, r.Pairing)
	}
	return scopeError(r.Section.Class, r.Member.ShearBuckling, where)
}

// CheckEnvelopes checks the cross-section at every station of env's ULS envelope. At each
// station both moment extremes are checked, each with the larger |V| of the two shear
// extremes and with each of the two axial extremes (four force sets, the pairing the splice
// design uses, DESIGN.md section 5); the station's utilisation is the worst of them.
//
// Errors: a Member not built by NewMember; no stations; envelope series whose lengths differ
// from the stations'; no ULS combination; a value that is NaN or infinite (each naming the
// station).
func (m Member) CheckEnvelopes(env *Envelopes) (MemberResult, error) {
	if err := errors.Join(m.built(), checkULSEnvelope(env)); err != nil {
		return MemberResult{}, err
	}
	e := &env.ULS
	res := MemberResult{Member: m, Stations: make([]MemberStation, len(env.Stations)), Class: Class1, Governing: -1}
	first4 := -1
	for i, st := range env.Stations {
		ms, worst := m.checkStation(e, i)
		ms.Station = st
		res.Stations[i] = ms
		res.Class = max(res.Class, worst)
		if ms.Class == Class4 {
			if first4 < 0 {
				first4 = i
			}
			continue
		}
		if res.Governing < 0 || ms.Utilisation > res.Stations[res.Governing].Utilisation {
			res.Governing = i
		}
	}
	if first4 >= 0 {
		res.Governing = first4
	}
	g := res.Stations[res.Governing]
	res.Station, res.X, res.Pairing = g.Station, g.Station.X, g.Pairing
	res.Combination = env.Governing(g.Pairing.MExtreme)
	res.VCombination = env.Governing(g.Pairing.VExtreme)
	res.NCombination = env.Governing(g.Pairing.NExtreme)
	res.Section = m.dress(m.evaluate(g.Pairing.Forces()))
	res.McRd, res.VcRd = res.Section.McRd, res.Section.VcRd
	if res.Section.Governing >= 0 {
		res.Check = res.Section.Checks[res.Section.Governing].ID
		res.Utilisation = res.Section.Utilisation
	}
	return res, nil
}

// pairings lists the station's force sets: both moment extremes, each with the larger-|V|
// shear extreme and both axial extremes (one axial extreme where the two are equal). It
// returns them in an array, the first n in use, so a whole envelope is checked without
// allocating.
func pairings(e *Envelope, i int) (out [4]Pairing, n int) {
	vb, vx := BoundMax, e.VMax[i]
	if math.Abs(e.VMin[i].Value) > math.Abs(vx.Value) {
		vb, vx = BoundMin, e.VMin[i]
	}
	for _, mb := range [2]Bound{BoundMax, BoundMin} {
		for _, nb := range [2]Bound{BoundMax, BoundMin} {
			if nb == BoundMin && e.NMax[i].Value == e.NMin[i].Value {
				continue
			}
			p := Pairing{M: mb, V: vb, N: nb, MExtreme: e.MMax[i], VExtreme: vx, NExtreme: e.NMax[i]}
			if mb == BoundMin {
				p.MExtreme = e.MMin[i]
			}
			if nb == BoundMin {
				p.NExtreme = e.NMin[i]
			}
			out[n] = p
			n++
		}
	}
	return out, n
}

// checkStation evaluates every pairing at station i and keeps the worst; it also returns the
// worst class over the pairings.
func (m Member) checkStation(e *Envelope, i int) (MemberStation, SectionClass) {
	var ms MemberStation
	worst := Class1
	ps, np := pairings(e, i)
	for k, p := range ps[:np] {
		ev := m.evaluate(p.Forces())
		if ev.class.Class == Class4 {
			return MemberStation{Class: Class4, Pairing: p}, Class4
		}
		worst = max(worst, ev.class.Class)
		if k == 0 || ev.u[ev.gov] > ms.Utilisation {
			ms = MemberStation{Utilisation: ev.u[ev.gov], Check: checkIDs(ev)[ev.gov], Class: ev.class.Class, Pairing: p}
		}
	}
	return ms, worst
}

// checkIDs lists the ids in the order of evaluation.u.
func checkIDs(e evaluation) [4]string {
	return [4]string{CheckBending, CheckShear, CheckAxial, e.combined}
}

// checkULSEnvelope validates an envelope handed to CheckEnvelopes (which may come from
// imported forces rather than an Analysis).
func checkULSEnvelope(env *Envelopes) error {
	if env == nil || len(env.Stations) == 0 {
		return errors.New("member check: the envelopes have no stations")
	}
	e := &env.ULS
	n := len(env.Stations)
	series := []struct {
		name string
		ex   []Extreme
	}{{"M_max", e.MMax}, {"M_min", e.MMin}, {"V_max", e.VMax}, {"V_min", e.VMin}, {"N_max", e.NMax}, {"N_min", e.NMin}}
	var errs []error
	for _, s := range series {
		if len(s.ex) != n {
			errs = append(errs, fmt.Errorf("member check: ULS %s has %d values for %d stations", s.name, len(s.ex), n))
		}
	}
	if len(errs) > 0 {
		return errors.Join(errs...)
	}
	hasCombination := false
	for i, st := range env.Stations {
		for _, s := range series {
			if !finite(s.ex[i].Value) {
				errs = append(errs, fmt.Errorf("member check: ULS %s at x = %g mm is %g: must be a finite number", s.name, st.X, s.ex[i].Value))
			}
			hasCombination = hasCombination || s.ex[i].Combination >= 0
		}
	}
	if !hasCombination && len(errs) == 0 {
		errs = append(errs, errors.New("member check: the envelopes have no ULS combination"))
	}
	return errors.Join(errs...)
}
