package beam

import (
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// Units in these tests: N, mm. EI is an IPE 500-like value (E 210 000 N/mm², Iy 4.82e8 mm⁴).
const testEI = 210000.0 * 4.82e8
const testEA = 210000.0 * 11550

func udl(w float64, from, to float64) Load {
	return Load{Kind: Distributed, X1: from, X2: to, W1: w, W2: w}
}
func point(p, x float64) Load { return Load{Kind: PointForce, X1: x, P: p} }

func model(length float64, sup ...Support) Model {
	return Model{Length: length, Supports: sup, EI: testEI, EA: testEA}
}

func at(x float64, k SupportKind) Support { return Support{X: x, Kind: k} }

// closedForm is one reference value from a standard closed-form beam result.
type closedForm struct {
	name     string
	source   string
	model    Model
	loads    []Load
	x        float64 // station [mm]
	side     Side
	quantity string // "M", "V", "N", "W", or "R<i>" for support i's Fz, "My<i>", "Fx<i>"
	want     float64
}

func closedForms() []closedForm {
	const (
		L = 6000.0 // mm
		w = 12.0   // N/mm = kN/m
		P = 50e3   // N
	)
	a, b := 2000.0, 4000.0
	ss := model(L, at(0, Pinned), at(L, Roller))
	cant := model(L, at(0, Fixed))
	prop := model(L, at(0, Fixed), at(L, Roller))
	ff := model(L, at(0, Fixed), at(L, Fixed))
	two := model(2*L, at(0, Pinned), at(L, Roller), at(2*L, Roller))
	three := model(3*L, at(0, Pinned), at(L, Roller), at(2*L, Roller), at(3*L, Roller))
	oh := 1500.0
	over := model(L+oh, at(0, Pinned), at(L, Roller))
	ha, hb := 2500.0, 5000.0 // Gerber beam: cantilever ha, hinge, suspended span hb
	gerber := model(ha+hb, at(0, Fixed), at(ha+hb, Roller))
	gerber.Hinges = []float64{ha}
	k := 20000.0 // N/mm spring
	spring := model(2*L, at(0, Pinned), Support{X: L, Kind: Spring, K: k}, at(2*L, Roller))
	// spring support under a UDL on a single span 2L: compatibility of the free deflection
	// 5w(2L)^4/(384EI) with the spring and the point-load deflection R(2L)^3/(48EI)
	rSpring := (5 * w * math.Pow(2*L, 4) / (384 * testEI)) / (1/k + math.Pow(2*L, 3)/(48*testEI))
	tri := []Load{{Kind: Distributed, X1: 0, X2: L, W1: 0, W2: w}}
	const tables = "standard beam tables (Roark's Formulas for Stress and Strain, Table 8.1; from memory)"
	const threeMoment = "three-moment theorem (Clapeyron), equal spans, UDL"
	return []closedForm{
		{"SS UDL mid moment wL²/8", tables, ss, []Load{udl(w, 0, L)}, L / 2, Right, "M", w * L * L / 8},
		{"SS UDL left shear +wL/2", tables, ss, []Load{udl(w, 0, L)}, 0, Right, "V", w * L / 2},
		{"SS UDL right shear -wL/2", tables, ss, []Load{udl(w, 0, L)}, L, Left, "V", -w * L / 2},
		{"SS UDL mid deflection 5wL⁴/384EI", tables, ss, []Load{udl(w, 0, L)}, L / 2, Right, "W", 5 * w * math.Pow(L, 4) / (384 * testEI)},
		{"SS UDL reaction wL/2", tables, ss, []Load{udl(w, 0, L)}, 0, Right, "R1", w * L / 2},
		{"SS point load moment Pab/L", tables, ss, []Load{point(P, a)}, a, Right, "M", P * a * b / L},
		{"SS point load deflection Pa²b²/3EIL", tables, ss, []Load{point(P, a)}, a, Right, "W", P * a * a * b * b / (3 * testEI * L)},
		{"SS point load shear left Pb/L", tables, ss, []Load{point(P, a)}, a, Left, "V", P * b / L},
		{"SS point load shear right -Pa/L", tables, ss, []Load{point(P, a)}, a, Right, "V", -P * a / L},
		{"SS central point load PL/4", tables, ss, []Load{point(P, L/2)}, L / 2, Left, "M", P * L / 4},
		{"SS central point deflection PL³/48EI", tables, ss, []Load{point(P, L/2)}, L / 2, Right, "W", P * L * L * L / (48 * testEI)},
		{"SS triangular load reaction qL/6", tables, ss, tri, 0, Right, "R1", w * L / 6},
		{"SS triangular load reaction qL/3", tables, ss, tri, L, Left, "R2", w * L / 3},
		{"SS triangular load max moment qL²/(9√3)", tables, ss, tri, L / math.Sqrt(3), Right, "M", w * L * L / (9 * math.Sqrt(3))},
		{"SS clockwise couple, left of it -Ca/L", "statics of a simply supported beam", ss, []Load{{Kind: PointMoment, X1: a, P: 30e6}}, a, Left, "M", -30e6 * a / L},
		{"SS clockwise couple, right of it C(L-a)/L", "statics of a simply supported beam", ss, []Load{{Kind: PointMoment, X1: a, P: 30e6}}, a, Right, "M", 30e6 * b / L},
		{"cantilever UDL root moment -wL²/2", tables, cant, []Load{udl(w, 0, L)}, 0, Right, "M", -w * L * L / 2},
		{"cantilever UDL tip deflection wL⁴/8EI", tables, cant, []Load{udl(w, 0, L)}, L, Left, "W", w * math.Pow(L, 4) / (8 * testEI)},
		{"cantilever tip load root moment -PL", tables, cant, []Load{point(P, L)}, 0, Right, "M", -P * L},
		{"cantilever tip load deflection PL³/3EI", tables, cant, []Load{point(P, L)}, L, Left, "W", P * L * L * L / (3 * testEI)},
		{"cantilever tip load reaction couple (clockwise) -PL", tables, cant, []Load{point(P, L)}, 0, Right, "My1", -P * L},
		{"propped cantilever UDL fixed-end moment -wL²/8", tables, prop, []Load{udl(w, 0, L)}, 0, Right, "M", -w * L * L / 8},
		{"propped cantilever UDL prop reaction 3wL/8", tables, prop, []Load{udl(w, 0, L)}, L, Left, "R2", 3 * w * L / 8},
		{"propped cantilever UDL span moment 9wL²/128", tables, prop, []Load{udl(w, 0, L)}, 5 * L / 8, Right, "M", 9 * w * L * L / 128},
		{"fixed-fixed UDL end moment -wL²/12", tables, ff, []Load{udl(w, 0, L)}, 0, Right, "M", -w * L * L / 12},
		{"fixed-fixed UDL mid moment wL²/24", tables, ff, []Load{udl(w, 0, L)}, L / 2, Right, "M", w * L * L / 24},
		{"fixed-fixed UDL mid deflection wL⁴/384EI", tables, ff, []Load{udl(w, 0, L)}, L / 2, Right, "W", w * math.Pow(L, 4) / (384 * testEI)},
		{"fixed-fixed central point load end moment -PL/8", tables, ff, []Load{point(P, L/2)}, 0, Right, "M", -P * L / 8},
		{"two equal spans UDL support moment -0.125wL²", threeMoment, two, []Load{udl(w, 0, 2*L)}, L, Left, "M", -0.125 * w * L * L},
		{"two equal spans UDL end reaction 3wL/8", threeMoment, two, []Load{udl(w, 0, 2*L)}, 0, Right, "R1", 3 * w * L / 8},
		{"two equal spans UDL middle reaction 10wL/8", threeMoment, two, []Load{udl(w, 0, 2*L)}, L, Right, "R2", 10 * w * L / 8},
		{"three equal spans UDL support moment -0.100wL²", threeMoment, three, []Load{udl(w, 0, 3*L)}, L, Left, "M", -0.1 * w * L * L},
		{"three equal spans UDL second support moment -0.100wL²", threeMoment, three, []Load{udl(w, 0, 3*L)}, 2 * L, Right, "M", -0.1 * w * L * L},
		{"three equal spans UDL end reaction 0.4wL", threeMoment, three, []Load{udl(w, 0, 3*L)}, 0, Right, "R1", 0.4 * w * L},
		{"three equal spans UDL inner reaction 1.1wL", threeMoment, three, []Load{udl(w, 0, 3*L)}, L, Right, "R2", 1.1 * w * L},
		{"overhang tip load support moment -Pa", "statics of a beam with an overhang", over, []Load{point(P, L+oh)}, L, Left, "M", -P * oh},
		{"overhang tip load back-span reaction -Pa/L", "statics of a beam with an overhang", over, []Load{point(P, L+oh)}, 0, Right, "R1", -P * oh / L},
		{"overhang tip load support reaction P(L+a)/L", "statics of a beam with an overhang", over, []Load{point(P, L+oh)}, L, Right, "R2", P * (L + oh) / L},
		{"overhang tip deflection Pa²(L+a)/3EI", tables, over, []Load{point(P, L+oh)}, L + oh, Left, "W", P * oh * oh * (L + oh) / (3 * testEI)},
		{"hinge: cantilever root moment -(wa²/2 + wab/2)", "statics of a beam with an internal hinge", gerber, []Load{udl(w, 0, ha+hb)}, 0, Right, "M", -(w*ha*ha/2 + w*hb/2*ha)},
		{"hinge: zero moment at the hinge", "statics of a beam with an internal hinge", gerber, []Load{udl(w, 0, ha+hb)}, ha, Right, "M", 0},
		{"hinge: suspended span mid moment wb²/8", "statics of a beam with an internal hinge", gerber, []Load{udl(w, 0, ha+hb)}, ha + hb/2, Right, "M", w * hb * hb / 8},
		{"hinge: roller reaction wb/2", "statics of a beam with an internal hinge", gerber, []Load{udl(w, 0, ha+hb)}, ha + hb, Left, "R2", w * hb / 2},
		{"spring middle support reaction by compatibility", tables + ", superposed", spring, []Load{udl(w, 0, 2*L)}, L, Right, "R2", rSpring},
		{"spring middle support deflection R/k", tables + ", superposed", spring, []Load{udl(w, 0, 2*L)}, L, Right, "W", rSpring / k},
		{"axial force left of the load: tension F", "statics of a bar held at one end", ss, []Load{{Kind: AxialForce, X1: a, P: 150e3}}, a, Left, "N", 150e3},
		{"axial force right of the load: zero", "statics of a bar held at one end", ss, []Load{{Kind: AxialForce, X1: a, P: 150e3}}, a, Right, "N", 0},
		{"axial reaction at the pinned support: -F", "statics of a bar held at one end", ss, []Load{{Kind: AxialForce, X1: a, P: 150e3}}, 0, Right, "Fx1", -150e3},
	}
}

func TestClosedForms(t *testing.T) {
	for _, tc := range closedForms() {
		t.Run(tc.name, func(t *testing.T) {
			an, err := NewAnalysis(tc.model, []Case{{Name: "C", Kind: Permanent, Loads: tc.loads}})
			require.NoError(t, err)
			r, err := an.CaseResult("C", []Station{{X: tc.x, Side: tc.side}})
			require.NoError(t, err)
			got := pick(t, r, tc.quantity)
			if tc.want == 0 {
				scale := math.Max(1, math.Abs(r.Effects.M[0])+math.Abs(r.Effects.V[0])*1e3)
				assert.InDelta(t, 0, got, 1e-9*scale, "source: %s", tc.source)
				return
			}
			assert.InEpsilon(t, tc.want, got, 1e-6, "source: %s", tc.source)
		})
	}
}

func pick(t *testing.T, r CaseResult, q string) float64 {
	t.Helper()
	switch q {
	case "M":
		return r.Effects.M[0]
	case "V":
		return r.Effects.V[0]
	case "N":
		return r.Effects.N[0]
	case "W":
		return r.Effects.W[0]
	}
	var i int
	var kind string
	for j := 0; j < len(q); j++ {
		if q[j] >= '0' && q[j] <= '9' {
			kind = q[:j]
			for _, c := range q[j:] {
				i = i*10 + int(c-'0')
			}
			break
		}
	}
	rc := r.Reactions[i-1]
	switch kind {
	case "R":
		return rc.Fz
	case "My":
		return rc.My
	case "Fx":
		return rc.Fx
	}
	t.Fatalf("unknown quantity %q", q)
	return 0
}

func TestMechanismIsAnError(t *testing.T) {
	cases := []struct {
		name  string
		model Model
	}{
		{"no supports", model(6000)},
		{"one pinned support only", model(6000, at(0, Pinned))},
		{"hinge in a simply supported span", func() Model { m := model(6000, at(0, Pinned), at(6000, Roller)); m.Hinges = []float64{3000}; return m }()},
		{"two rollers and two hinges", func() Model {
			m := model(12000, at(0, Pinned), at(6000, Roller), at(12000, Roller))
			m.Hinges = []float64{2000, 4000}
			return m
		}()},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			_, err := NewAnalysis(tc.model, []Case{{Name: "G", Loads: []Load{udl(1, 0, tc.model.Length)}}})
			require.Error(t, err)
			assert.ErrorIs(t, err, ErrMechanism)
		})
	}
}

func TestAxialLoadNeedsHorizontalRestraint(t *testing.T) {
	m := model(6000, at(0, Roller), at(6000, Roller))
	_, err := NewAnalysis(m, []Case{{Name: "T", Loads: []Load{{Kind: AxialForce, X1: 1000, P: 1e3}}}})
	require.Error(t, err)
	assert.Contains(t, err.Error(), "no horizontal restraint")
}
