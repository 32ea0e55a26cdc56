package optimise

import (
	"cmp"
	"errors"
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
// right of x), numbered from the envelope's station first, and keeps the worse value of each
// extreme.
func forceSetAt(e *beam.Envelope, idx []int, first int) ForceSet {
	f := ForceSet{MMax: math.Inf(-1), MMin: math.Inf(1), NMax: math.Inf(-1), NMin: math.Inf(1)}
	for _, i := range idx {
		i -= first
		f.MMax = math.Max(f.MMax, e.MMax[i].Value)
		f.MMin = math.Min(f.MMin, e.MMin[i].Value)
		f.V = math.Max(f.V, math.Max(math.Abs(e.VMax[i].Value), math.Abs(e.VMin[i].Value)))
		f.NMax = math.Max(f.NMax, e.NMax[i].Value)
		f.NMin = math.Min(f.NMin, e.NMin[i].Value)
	}
	return f
}

// DesignForces returns the design forces at each position xs [mm] from envelope calculations
// over the positions, forceChunk at a time (each station's envelope is its own, so the chunks
// change nothing but the memory held): at a jump (support, point load or point moment) both
// sides are evaluated and the worse of each extreme is kept, so a splice exactly at a jump is
// designed for the worse side. A value that is not finite is the error the envelopes over all
// the positions at once would give: the first station's, else the support reaction's.
func DesignForces(an *beam.Analysis, combos []beam.Combination, xs []float64) ([]PositionForces, error) {
	st, err := an.StationsAt(xs)
	if err != nil {
		return nil, err
	}
	groups := positionStations(st, len(xs))
	out := make([]PositionForces, 0, len(xs))
	var reaction error // a support reaction that is not finite: reported unless a station is
	for lo := 0; lo < len(xs); lo += forceChunk {
		part := groups[lo:min(lo+forceChunk, len(xs))]
		first, last := part[0][0], part[len(part)-1][len(part[len(part)-1])-1]
		env, err := an.Envelopes(combos, st[first:last+1])
		if nf := (*beam.NonFiniteError)(nil); errors.As(err, &nf) && nf.Quantity == beam.ReactionQuantity {
			reaction = cmp.Or(reaction, err)
			continue
		}
		if err != nil {
			return nil, err
		}
		for _, idx := range part {
			out = append(out, PositionForces{ULS: forceSetAt(&env.ULS, idx, first), SLS: forceSetAt(&env.SLS, idx, first)})
		}
	}
	if reaction != nil {
		return nil, reaction
	}
	return out, nil
}

// forceChunk is the number of positions DesignForces evaluates at once.
const forceChunk = 2048

// positionStations groups the stations StationsAt gives for n positions: one station per
// position, two (left, right) at a jump, in order; each group is a range of st.
func positionStations(st []beam.Station, n int) [][]int {
	out := make([][]int, n)
	all := make([]int, len(st))
	k := 0
	for c := range n {
		start := k
		for k < len(st) && (k == start || st[k].X == st[start].X && st[k].Side != st[k-1].Side) {
			all[k] = k
			k++
		}
		out[c] = all[start:k:k]
	}
	if k != len(st) {
		panic(fmt.Sprintf("optimise: %d stations for %d positions, %d read", len(st), n, k))
	}
	return out
}

// ForceOrigins name, for each design force of one limit state, the combination and the span
// pattern that produce it (beam.Envelopes.Governing), so that a checker can rebuild it.
type ForceOrigins struct {
	MMax, MMin, V, NMax, NMin string
}

// PositionOrigins are the origins of the ULS and SLS design forces at one position.
type PositionOrigins struct {
	ULS, SLS ForceOrigins
}

// originsAt names the extremes forceSetAt takes at the stations idx.
func originsAt(env *beam.Envelopes, e *beam.Envelope, idx []int) ForceOrigins {
	pick := func(ex []beam.Extreme, better func(a, b float64) bool) beam.Extreme {
		best := ex[idx[0]]
		for _, i := range idx[1:] {
			if better(ex[i].Value, best.Value) {
				best = ex[i]
			}
		}
		return best
	}
	gt := func(a, b float64) bool { return a > b }
	lt := func(a, b float64) bool { return a < b }
	vmax, vmin := pick(e.VMax, gt), pick(e.VMin, lt)
	v := vmax
	if math.Abs(vmin.Value) > math.Abs(vmax.Value) {
		v = vmin
	}
	return ForceOrigins{MMax: env.Governing(pick(e.MMax, gt)), MMin: env.Governing(pick(e.MMin, lt)), V: env.Governing(v),
		NMax: env.Governing(pick(e.NMax, gt)), NMin: env.Governing(pick(e.NMin, lt))}
}

// DesignForcesTraced is DesignForces with the origin of every design force. It names
// combinations in words, so it is for the few positions a sheet is printed for, not the scan.
func DesignForcesTraced(an *beam.Analysis, combos []beam.Combination, xs []float64) ([]PositionForces, []PositionOrigins, error) {
	st, err := an.StationsAt(xs)
	if err != nil {
		return nil, nil, err
	}
	env, err := an.Envelopes(combos, st)
	if err != nil {
		return nil, nil, err
	}
	forces := make([]PositionForces, len(xs))
	origins := make([]PositionOrigins, len(xs))
	for c, idx := range positionStations(st, len(xs)) {
		forces[c] = PositionForces{ULS: forceSetAt(&env.ULS, idx, 0), SLS: forceSetAt(&env.SLS, idx, 0)}
		origins[c] = PositionOrigins{ULS: originsAt(&env, &env.ULS, idx), SLS: originsAt(&env, &env.SLS, idx)}
	}
	return forces, origins, nil
}
