package optimise

import (
	"math"
	"slices"
)

// MaxExactPacking is the largest number of pieces whose trips are found by exact search;
// above it the trips are those of first-fit decreasing.
const MaxExactPacking = 16

// fits reports whether a load stays within the payload, with the tolerance of the piece
// checks (a piece the layout search admits always fits on its own).
func fits(load, payload float64) bool { return load <= payload+massTol }

// Trips returns the number of vehicle trips that carry pieces of the given masses [kg] when a
// trip takes any pieces whose total mass is within the payload [kg] (the pieces lie on the
// deck side by side or stacked; the deck length limit is checked per piece elsewhere).
//
// The rule is exact for up to MaxExactPacking pieces: the minimum number of trips (bin
// packing), found by first-fit decreasing when that meets the lower bound
// max(⌈Σm/payload⌉, number of pieces heavier than half the payload), otherwise by a
// branch-and-bound search. Above MaxExactPacking pieces it is first-fit decreasing, which
// may use a trip more than the minimum. A piece heavier than the payload makes the layout
// infeasible for that vehicle; Trips panics on one, as the layout search never asks.
func Trips(masses []float64, payload float64) int {
	if len(masses) == 0 {
		return 0
	}
	if math.IsInf(payload, 1) {
		return 1
	}
	m := slices.Clone(masses)
	slices.SortFunc(m, func(a, b float64) int { return -cmpFloat(a, b) })
	if !fits(m[0], payload) {
		panic("optimise: Trips called with a piece heavier than the payload")
	}
	lb := tripsLowerBound(m, payload)
	ffd := firstFitDecreasing(m, payload)
	if ffd == lb || len(m) > MaxExactPacking {
		return ffd
	}
	return exactTrips(m, payload, lb, ffd)
}

func cmpFloat(a, b float64) int {
	switch {
	case a < b:
		return -1
	case a > b:
		return 1
	}
	return 0
}

// tripsLowerBound is max(⌈Σm/P⌉, #pieces heavier than P/2): no two such pieces share a trip.
func tripsLowerBound(m []float64, payload float64) int {
	sum, heavy := 0.0, 0
	for _, x := range m {
		sum += x
		if !fits(2*x, payload) {
			heavy++
		}
	}
	lb := int(math.Ceil(sum/payload - 1e-9))
	return max(lb, heavy, 1)
}

// firstFitDecreasing puts each piece, heaviest first, on the first trip with room.
func firstFitDecreasing(sorted []float64, payload float64) int {
	var loads []float64
next:
	for _, x := range sorted {
		for i := range loads {
			if fits(loads[i]+x, payload) {
				loads[i] += x
				continue next
			}
		}
		loads = append(loads, x)
	}
	return len(loads)
}

// exactTrips finds the minimum number of trips by depth-first search over the assignment of
// pieces (heaviest first) to trips, starting from the first-fit-decreasing count and stopping
// at the lower bound. Trips with equal loads are interchangeable and tried once.
func exactTrips(sorted []float64, payload float64, lb, ub int) int {
	best := ub
	loads := make([]float64, 0, len(sorted))
	var place func(k int)
	place = func(k int) {
		if best == lb {
			return
		}
		if k == len(sorted) {
			best = len(loads) // < best, else pruned below
			return
		}
		x := sorted[k]
		for i := range loads {
			if !fits(loads[i]+x, payload) || slices.Contains(loads[:i], loads[i]) {
				continue
			}
			loads[i] += x
			place(k + 1)
			loads[i] -= x
		}
		if len(loads)+1 < best {
			loads = append(loads, x)
			place(k + 1)
			loads = loads[:len(loads)-1]
		}
	}
	place(0)
	return best
}
