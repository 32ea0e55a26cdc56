package splice

import (
	"fmt"
	"testing"

	"github.com/stretchr/testify/require"

	"spanbreak/beam"
)

// publishedSection builds a rolled section from its published dimensions and properties
// (EN 10365, as listed in EC3-NOTES.md), with the shear area of EN 1993-1-1 6.2.6(3)(a)
// Av = A − 2b·tf + (tw + 2r)·tf (η = 1.0) written out here, so the tests do not depend on the
// beam package's own section computations.
func publishedSection(t testing.TB, name string) beam.Section {
	t.Helper()
	rows := map[string]struct{ h, b, tw, tf, r, a, iy, wpl float64 }{
		// name: h, b, tw, tf, r [mm]; A [cm²], Iy [cm⁴], Wpl,y [cm³] — EN 10365
		"IPE 300":  {300, 150, 7.1, 10.7, 15, 53.8, 8356, 628.4},
		"IPE 400":  {400, 180, 8.6, 13.5, 21, 84.5, 23130, 1307},
		"IPE 500":  {500, 200, 10.2, 16.0, 21, 115.5, 48200, 2194},
		"IPE 600":  {600, 220, 12.0, 19.0, 24, 156.0, 92080, 3512},
		"HE 300 A": {290, 300, 8.5, 14.0, 27, 112.5, 18260, 1383},
		"HE 300 B": {300, 300, 11.0, 19.0, 27, 149.1, 25170, 1869},
	}
	r, ok := rows[name]
	require.True(t, ok, name)
	s := beam.Section{Name: name, Series: "test", Source: "EN 10365 (EC3-NOTES.md)", H: r.h, B: r.b, Tw: r.tw, Tf: r.tf, R: r.r,
		A: r.a * 100, Iy: r.iy * 1e4, WplY: r.wpl * 1e3}
	s.Avz = s.A - 2*s.B*s.Tf + (s.Tw+2*s.R)*s.Tf
	return s
}

// steelS355 is S355 to EN 1993-1-1 Table 3.1: fy/fu = 355/490 for t ≤ 40 mm, 335/470 for
// 40 < t ≤ 80 mm.
func steelS355() Steel {
	return Steel{Name: "S355", Strength: func(t float64) (float64, float64, error) {
		switch {
		case t > 0 && t <= 40:
			return 355, 490, nil
		case t > 40 && t <= 80:
			return 335, 470, nil
		}
		return 0, 0, fmt.Errorf("t = %g mm is outside EN 1993-1-1 Table 3.1 (up to 80 mm)", t)
	}}
}

// steelS275 is S275 to EN 1993-1-1 Table 3.1: 275/430 (t ≤ 40), 255/410 (40 < t ≤ 80).
func steelS275() Steel {
	return Steel{Name: "S275", Strength: func(t float64) (float64, float64, error) {
		switch {
		case t > 0 && t <= 40:
			return 275, 430, nil
		case t > 40 && t <= 80:
			return 255, 410, nil
		}
		return 0, 0, fmt.Errorf("t = %g mm is outside EN 1993-1-1 Table 3.1 (up to 80 mm)", t)
	}}
}

func member(t testing.TB, name string, steel Steel) Member {
	t.Helper()
	m, err := NewMember(publishedSection(t, name), steel)
	require.NoError(t, err)
	return m
}

func knm(v float64) float64 { return v * 1e6 } // kNm → N·mm
func kn(v float64) float64  { return v * 1e3 } // kN → N

// smallSpace is a design space small enough for the exhaustive search to run hundreds of times.
func smallSpace() DesignSpace {
	return DesignSpace{
		Sizes:         []string{"M20", "M24"},
		Classes:       []string{"8.8", "10.9"},
		Thicknesses:   []float64{10, 15, 20},
		Arrangements:  []Arrangement{OuterOnly, OuterInner},
		FlangeColumns: []int{2, 4},
		FlangeRows:    []int{2, 3, 4, 5, 6},
		WebColumns:    []int{1, 2},
		WebRows:       []int{2, 3, 4, 5, 6},
	}
}
