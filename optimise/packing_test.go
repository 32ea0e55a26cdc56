package optimise

import (
	"math"
	"math/rand/v2"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestTrips(t *testing.T) {
	tests := []struct {
		name    string
		kind    string
		masses  []float64 // kg
		payload float64   // kg
		want    int
	}{
		{"one piece", "closed form", []float64{1500}, 12000, 1},
		{"total within the payload: one trip", "closed form", []float64{1400, 1500, 1000}, 12000, 1},
		{"⌈Σm/P⌉ = ⌈7200/3000⌉ = 3", "closed form", []float64{2400, 2400, 2400}, 3000, 3},
		// Σm/P = 1.8 → ⌈⌉ = 2, but no two 0.6P pieces share a trip: 3 trips
		{"three pieces over half the payload", "closed form", []float64{600, 600, 600}, 1000, 3},
		// the classic case where first-fit decreasing needs 3 trips: {500, 400}, {400, 300, 200},
		// {200}; the minimum is 2: {500, 300, 200} and {400, 400, 200}, each 1000 kg
		{"first-fit decreasing is not minimal", "closed form", []float64{500, 400, 400, 300, 200, 200}, 1000, 2},
		{"a piece exactly at the payload", "closed form", []float64{1000, 1000}, 1000, 2},
		{"no pieces", "closed form", nil, 1000, 0},
		{"no payload limit (no vehicle)", "closed form", []float64{5000, 6000}, math.Inf(1), 1},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			assert.Equal(t, tc.want, Trips(tc.masses, tc.payload), tc.kind)
		})
	}
	// the first-fit decreasing count of the classic case, for the record
	assert.Equal(t, 3, firstFitDecreasing([]float64{500, 400, 400, 300, 200, 200}, 1000))
	assert.Panics(t, func() { Trips([]float64{1200}, 1000) }, "a piece over the payload is the caller's error")
}

// minTripsBrute assigns every piece to every trip (up to n trips) and keeps the fewest.
func minTripsBrute(m []float64, payload float64) int {
	n := len(m)
	best := n
	loads := make([]float64, n)
	var rec func(i, used int)
	rec = func(i, used int) {
		if used >= best {
			return
		}
		if i == n {
			best = used
			return
		}
		for b := 0; b <= used && b < n; b++ {
			if fits(loads[b]+m[i], payload) {
				loads[b] += m[i]
				nu := used
				if b == used {
					nu++
				}
				rec(i+1, nu)
				loads[b] -= m[i]
			}
		}
	}
	rec(0, 0)
	return best
}

// TestTripsIsTheMinimum: for up to MaxExactPacking pieces Trips is the minimum number of
// trips, against an assignment of every piece to every trip (kind: property, exhaustive).
func TestTripsIsTheMinimum(t *testing.T) {
	r := rand.New(rand.NewPCG(11, 3))
	for trial := 0; trial < 3000; trial++ {
		n := 1 + r.IntN(9)
		payload := 1000.0
		m := make([]float64, n)
		for i := range m {
			m[i] = 50 + r.Float64()*950
			if trial%3 == 0 {
				m[i] = float64(100 * (1 + r.IntN(7))) // exact fits
			}
		}
		require.Equal(t, minTripsBrute(m, payload), Trips(m, payload), "masses %v", m)
	}
}

// TestTripsAboveTheExactLimitIsFirstFitDecreasing: past MaxExactPacking pieces the rule is
// first-fit decreasing, as documented.
func TestTripsAboveTheExactLimitIsFirstFitDecreasing(t *testing.T) {
	m := []float64{}
	for i := 0; i < 3; i++ {
		m = append(m, 500, 400, 400, 300, 200, 200) // 18 pieces
	}
	require.Greater(t, len(m), MaxExactPacking)
	assert.Equal(t, firstFitDecreasing([]float64{500, 500, 500, 400, 400, 400, 400, 400, 400, 300, 300, 300, 200, 200, 200, 200, 200, 200}, 1000),
		Trips(m, 1000))
}
