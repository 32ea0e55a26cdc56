package optimise

import (
	"fmt"
	"math"

	"spanbreak/beam"
)

// ForceSet is the set of design forces of one limit state at a splice position: the envelope
// extremes of the bending moment, each to be taken with the largest shear magnitude and with
// both axial extremes (DESIGN.md section 5: conservative pairing, both signs always checked).
type ForceSet struct {
	MMax float64 // largest (most sagging) bending moment [N·mm]
	MMin float64 // smallest (most hogging) bending moment [N·mm]
	V    float64 // largest shear magnitude, max |V| ≥ 0 [N]
	NMax float64 // largest axial force, tension positive [N]
	NMin float64 // smallest axial force (most compressive) [N]
}

// PositionForces are the ULS and SLS design force sets at one position. The struct is
// comparable: equal values mean the splice sizing gives the same answer.
type PositionForces struct {
	ULS, SLS ForceSet
}

// forceSetAt reads one envelope at the stations idx (one station, or two at a jump: left and
// right of x) and keeps the worse value of each extreme.
func forceSetAt(e *beam.Envelope, idx []int) ForceSet {
	f := ForceSet{MMax: math.Inf(-1), MMin: math.Inf(1), NMax: math.Inf(-1), NMin: math.Inf(1)}
	for _, i := range idx {
		f.MMax = math.Max(f.MMax, e.MMax[i].Value)
		f.MMin = math.Min(f.MMin, e.MMin[i].Value)
		f.V = math.Max(f.V, math.Max(math.Abs(e.VMax[i].Value), math.Abs(e.VMin[i].Value)))
		f.NMax = math.Max(f.NMax, e.NMax[i].Value)
		f.NMin = math.Min(f.NMin, e.NMin[i].Value)
	}
	return f
}

// DesignForces returns the design forces at each position xs [mm] from one envelope
// calculation over all the positions: at a jump (support, point load or point moment) both
// sides are evaluated and the worse of each extreme is kept, so a splice exactly at a jump is
// designed for the worse side.
func DesignForces(an *beam.Analysis, combos []beam.Combination, xs []float64) ([]PositionForces, error) {
	st, err := an.StationsAt(xs)
	if err != nil {
		return nil, err
	}
	env, err := an.Envelopes(combos, st)
	if err != nil {
		return nil, err
	}
	out := make([]PositionForces, len(xs))
	k := 0
	for c := range xs {
		start := k
		// StationsAt gives one station per position, two (left, right) at a jump, in order.
		for k < len(st) && (k == start || st[k].X == st[start].X && st[k].Side != st[k-1].Side) {
			k++
		}
		idx := make([]int, 0, 2)
		for i := start; i < k; i++ {
			idx = append(idx, i)
		}
		out[c] = PositionForces{ULS: forceSetAt(&env.ULS, idx), SLS: forceSetAt(&env.SLS, idx)}
	}
	if k != len(st) {
		panic(fmt.Sprintf("optimise: %d stations for %d positions, %d read", len(st), len(xs), k))
	}
	return out, nil
}
