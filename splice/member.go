package splice

import (
	"errors"
	"fmt"
	"math"

	"spanbreak/beam"
)

// Steel gives the yield and ultimate strengths of a steel grade for a thickness t [mm] →
// fy, fu [N/mm²]; it returns an error for a thickness the grade's table does not cover.
// The command builds one from the beam package's grade tables; it must be safe to call from
// several goroutines (a pure function is).
type Steel struct {
	Name     string // grade name for the calculation sheet, e.g. "S355"
	Strength func(t float64) (fy, fu float64, err error)
}

func (s Steel) strength(t float64) (fy, fu float64, err error) {
	if s.Strength == nil {
		return 0, 0, errors.New("plate steel: no strength table given")
	}
	fy, fu, err = s.Strength(t)
	if err != nil {
		return 0, 0, fmt.Errorf("plate steel %s at t = %g mm: %w", s.Name, t, err)
	}
	if !(fy > 0) || !(fu >= fy) {
		return 0, 0, fmt.Errorf("plate steel %s at t = %g mm: fy = %g, fu = %g N/mm² are not valid strengths", s.Name, t, fy, fu)
	}
	return fy, fu, nil
}

// Member is the beam at the splice: its section and the strengths of its flange and web.
type Member struct {
	Section  beam.Section
	Grade    string  // grade name for the sheet
	FyFlange float64 // fy of the flange (thickness tf) [N/mm²]
	FuFlange float64 // fu of the flange [N/mm²]
	FyWeb    float64 // fy of the web (thickness tw) [N/mm²]
	FuWeb    float64 // fu of the web [N/mm²]
	// WeldThroat is the throat a of the web-to-flange fillet welds of a welded section [mm],
	// as beam.MemberSettings.WeldThroat: the height of the largest triangle inscribed in the
	// weld's section (EN 1993-1-8 4.5.2(2)), so an equal-leg 90° fillet has legs s = √2·a.
	// The web plates then stop short of the welds' toes on the web and the flange bolts'
	// washers and the inner plates keep clear of their toes on the flange, as they keep clear
	// of the root radius r of a rolled section. 0 (the default) ignores the welds, as the
	// section's properties do. Not allowed for rolled sections.
	WeldThroat float64
}

// NewMember looks up the flange and web strengths of a section in a steel grade.
func NewMember(sec beam.Section, steel Steel) (Member, error) {
	fyf, fuf, err := steel.strength(sec.Tf)
	if err != nil {
		return Member{}, fmt.Errorf("beam flange: %w", err)
	}
	fyw, fuw, err := steel.strength(sec.Tw)
	if err != nil {
		return Member{}, fmt.Errorf("beam web: %w", err)
	}
	return Member{Section: sec, Grade: steel.Name, FyFlange: fyf, FuFlange: fuf, FyWeb: fyw, FuWeb: fuw}, nil
}

func (m Member) validate() error {
	s := m.Section
	var errs []error
	bad := func(field string, v float64) {
		errs = append(errs, fmt.Errorf("section %s: %s = %g is not valid", s.Name, field, v))
	}
	for _, x := range []struct {
		n string
		v float64
	}{{"h", s.H}, {"b", s.B}, {"tw", s.Tw}, {"tf", s.Tf}, {"A", s.A}, {"Iy", s.Iy}, {"Avz", s.Avz}} {
		if !(x.v > 0) || math.IsInf(x.v, 0) {
			bad(x.n, x.v)
		}
	}
	if !(s.R >= 0) {
		bad("r", s.R)
	}
	switch a := m.WeldThroat; {
	case !(a >= 0) || math.IsInf(a, 0):
		errs = append(errs, fmt.Errorf("section %s: weld throat a = %g mm must be zero or a positive size", s.Name, a))
	case a > 0 && !s.Welded():
		errs = append(errs, fmt.Errorf("section %s: weld throat a = %g mm given for a rolled section: only welded sections have web-to-flange welds", s.Name, a))
	case a > 0 && !(s.H-2*s.Tf-2*m.fillet() > 0 && s.B-s.Tw-2*m.fillet() > 0):
		errs = append(errs, fmt.Errorf("section %s: weld throat a = %g mm: welds of leg √2·a = %.1f mm leave no web between the flanges or no flange outstand", s.Name, a, m.fillet()))
	}
	if !(s.H > 2*s.Tf) {
		errs = append(errs, fmt.Errorf("section %s: depth h = %g mm is not more than 2·tf = %g mm", s.Name, s.H, 2*s.Tf))
	}
	if !(s.B > s.Tw) {
		errs = append(errs, fmt.Errorf("section %s: flange width b = %g mm is not more than tw = %g mm", s.Name, s.B, s.Tw))
	}
	for _, x := range []struct {
		n      string
		fy, fu float64
	}{{"flange", m.FyFlange, m.FuFlange}, {"web", m.FyWeb, m.FuWeb}} {
		if !(x.fy > 0) || !(x.fu >= x.fy) {
			errs = append(errs, fmt.Errorf("beam %s steel: fy = %g, fu = %g N/mm² are not valid strengths", x.n, x.fy, x.fu))
		}
	}
	return errors.Join(errs...)
}

// webDepthClear is the depth of the web between the root fillets, h − 2tf − 2r, or between
// the toes of the welds of a welded section, h − 2tf − 2√2·a [mm].
func (m Member) webDepthClear() float64 {
	s := m.Section
	return s.H - 2*s.Tf - 2*m.fillet()
}

// fillet is how far the material between web and flange reaches from the face of the web
// along the flange, and from the face of the flange along the web [mm]: the root radius r of
// a rolled section, the leg √2·a of the fillet welds of a welded one (0 when none is given).
func (m Member) fillet() float64 {
	if m.WeldThroat > 0 {
		return math.Sqrt2 * m.WeldThroat
	}
	return m.Section.R
}

// filletName is the symbol of fillet in the sheet's formulas.
func (m Member) filletName() string {
	if m.WeldThroat > 0 {
		return "√2·a"
	}
	return "r"
}

// youngModulus is E of EN 1993-1-1 3.2.6 [N/mm²].
const youngModulus = beam.YoungModulus

// steelDensity is the density of steel in kg/mm³ (EN 1991-1-1 Table A.4, 7850 kg/m³).
const steelDensity = beam.SteelDensity * 1e-9
