package forcetable

import (
	"fmt"
	"math"
	"sort"

	"spanbreak/beam"
)

// Limits of a forces table.
const (
	// MaxRows is the largest number of data rows, the station limit of beam.Analysis.Stations.
	MaxRows = 1_000_000
	// MaxCombinations is the largest number of combinations in a per-combination table.
	MaxCombinations = 1000
	// MaxMagnitude bounds every number in the file, in the file's unit (m, kN, kNm, mm): a
	// larger value is a slip of the keyboard, and would overflow once taken to N·mm.
	MaxMagnitude = 1e12
	// CoverTolerance [mm] is how far the first station may lie after x = 0 and the last before
	// x = L (or beyond the ends) while still counting as covering the member.
	CoverTolerance = 1.0
)

// atTol [mm] is how close a position must be to a station to take that station's values
// (both sides at a jump) rather than interpolate: float noise, the tolerance of beam's key
// points.
const atTol = 1e-6

// Options say what the caller's member and splice need from the table.
type Options struct {
	// Length is the member length L [mm]; the stations must cover [0, L]. It must be positive.
	Length float64
	// NeedSLS says the splice needs the SLS bending moment, shear and axial force (category B:
	// slip resistance at SLS, EN 1993-1-8 Table 3.2 and 3.9); SLSReason says why, for the
	// message (e.g. "splice.category B is checked for slip at SLS").
	NeedSLS   bool
	SLSReason string
	// NeedDeflection says the SLS deflection is needed (a deflection limit is set);
	// DeflectionReason says why.
	NeedDeflection   bool
	DeflectionReason string
}

// Parts says which quantities of a limit state the file gives.
type Parts struct {
	M, V, N bool // bending moment, shear, axial force
	W       bool // deflection (SLS only)
}

// Forces reports whether M, V and N are all given, as a splice check needs.
func (p Parts) Forces() bool { return p.M && p.V && p.N }

// has reports whether one quantity is given.
func (p Parts) has(q quantity) bool {
	return [...]bool{p.M, p.V, p.N, p.W}[q]
}

func (p *Parts) set(q quantity) {
	*[...]*bool{&p.M, &p.V, &p.N, &p.W}[q] = true
}

// allSLS is what an analysis gives: every SLS quantity.
func allSLS() Parts { return Parts{M: true, V: true, N: true, W: true} }

// Table is a forces table that passed every check, as envelopes over the member.
type Table struct {
	File   string // the name the table was read under (as given to Read or ReadFile)
	SHA256 string // SHA-256 of the file's bytes as read (a BOM included), lower-case hex
	Shape  Shape
	Rows   int     // data rows read
	Length float64 // member length L the stations were checked against [mm]

	// Envelopes holds the stations (ascending; a jump is a Left then a Right station at one
	// x), the combinations and the ULS and SLS envelopes, every series one value per station.
	// An extreme's Combination indexes Combinations (Name and State set, nothing else: the
	// file gives no factors), or is -1 when the file does not say what governs it (an envelope
	// table without that governing column, a quantity it does not give, or a limit state with
	// no combination); a quantity the file does not give is 0 at every station. Patterned,
	// Regions and the reaction envelopes are empty.
	Envelopes beam.Envelopes

	// SLS says which SLS quantities the file gives; the ULS M, V and N are always given.
	SLS Parts
}

// Deflection reports whether the file gives the SLS deflection.
func (t *Table) Deflection() bool { return t.SLS.W }

// Governing names the combination that produces an extreme: the file's combination name (in
// an envelope table, its governing cell verbatim), or "" when the file does not say.
func (t *Table) Governing(ex beam.Extreme) string {
	if ex.Combination < 0 || int(ex.Combination) >= len(t.Envelopes.Combinations) {
		return ""
	}
	return t.Envelopes.Combinations[ex.Combination].Name
}

// ForceSet is the set of design forces of one limit state at a position, with the fields and
// meaning of optimise.ForceSet (DESIGN.md section 5): the bending-moment extremes, each to be
// taken with the largest shear magnitude and with both axial extremes.
type ForceSet struct {
	MMax float64 // largest (most sagging) bending moment [N·mm]
	MMin float64 // smallest (most hogging) bending moment [N·mm]
	V    float64 // largest shear magnitude, max |V| ≥ 0 [N]
	NMax float64 // largest axial force, tension positive [N]
	NMin float64 // smallest axial force (most compressive) [N]
}

// PositionForces are the ULS and SLS design forces at one position. A quantity the file does
// not give is 0: see Table.SLS before using the SLS set.
type PositionForces struct {
	ULS, SLS ForceSet
}

// At returns the design forces at x [mm]. At a station the station's values hold (the worse
// of the two sides at a jump); between stations each extreme is interpolated linearly. A
// position within CoverTolerance outside the stations takes the end station's values; one
// further off the member is an error.
func (t *Table) At(x float64) (PositionForces, error) {
	st := t.Envelopes.Stations
	if len(st) == 0 {
		return PositionForces{}, fmt.Errorf("the forces table %s has no stations", t.File)
	}
	if !(x >= -CoverTolerance && x <= t.Length+CoverTolerance) {
		return PositionForces{}, fmt.Errorf("x = %s m is off the member (0 to %s m) of the forces table %s",
			metres(x), metres(t.Length), t.File)
	}
	x = math.Min(math.Max(x, st[0].X), st[len(st)-1].X)
	i := sort.Search(len(st), func(k int) bool { return st[k].X >= x-atTol })
	if i < len(st) && st[i].X <= x+atTol {
		f := PositionForces{ULS: emptySet(), SLS: emptySet()}
		for j := i; j < len(st) && st[j].X <= x+atTol; j++ {
			f.ULS.worsen(sampleAt(&t.Envelopes.ULS, j))
			f.SLS.worsen(sampleAt(&t.Envelopes.SLS, j))
		}
		return f, nil
	}
	// st[i-1].X < x < st[i].X: i-1 is the last station left of x (the right side of a jump
	// there), i the first right of it (the left side of a jump there).
	a, b := i-1, i
	r := (x - st[a].X) / (st[b].X - st[a].X)
	f := PositionForces{ULS: emptySet(), SLS: emptySet()}
	f.ULS.worsen(lerp(sampleAt(&t.Envelopes.ULS, a), sampleAt(&t.Envelopes.ULS, b), r))
	f.SLS.worsen(lerp(sampleAt(&t.Envelopes.SLS, a), sampleAt(&t.Envelopes.SLS, b), r))
	return f, nil
}

// ForcesAt returns the design forces at each position xs [mm], as At.
func (t *Table) ForcesAt(xs []float64) ([]PositionForces, error) {
	out := make([]PositionForces, len(xs))
	for i, x := range xs {
		f, err := t.At(x)
		if err != nil {
			return nil, err
		}
		out[i] = f
	}
	return out, nil
}

// sample is one station's envelope values of the three forces.
type sample struct {
	mMax, mMin, vMax, vMin, nMax, nMin float64
}

func sampleAt(e *beam.Envelope, i int) sample {
	return sample{e.MMax[i].Value, e.MMin[i].Value, e.VMax[i].Value, e.VMin[i].Value,
		e.NMax[i].Value, e.NMin[i].Value}
}

func lerp(a, b sample, r float64) sample {
	l := func(u, v float64) float64 { return u + r*(v-u) }
	return sample{l(a.mMax, b.mMax), l(a.mMin, b.mMin), l(a.vMax, b.vMax), l(a.vMin, b.vMin),
		l(a.nMax, b.nMax), l(a.nMin, b.nMin)}
}

// emptySet is the start of a worse-of: every extreme at its least adverse.
func emptySet() ForceSet {
	return ForceSet{MMax: math.Inf(-1), MMin: math.Inf(1), NMax: math.Inf(-1), NMin: math.Inf(1)}
}

// worsen keeps the worse of f and s in each extreme.
func (f *ForceSet) worsen(s sample) {
	f.MMax = math.Max(f.MMax, s.mMax)
	f.MMin = math.Min(f.MMin, s.mMin)
	f.V = math.Max(f.V, math.Max(math.Abs(s.vMax), math.Abs(s.vMin)))
	f.NMax = math.Max(f.NMax, s.nMax)
	f.NMin = math.Min(f.NMin, s.nMin)
}

// metres formats a length [mm] in m for messages.
func metres(x float64) string { return num(x / mmPerM) }
