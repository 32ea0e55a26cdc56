package beam

import (
	"fmt"
	"math"
)

// NonFiniteError reports a result that is not a finite number: a load, or the loads of a case
// or a combination together, so large that a product of the analysis (a load times a length
// cubed, a moment times a length squared over EI) leaves the range of float64 (about
// 1.8e308). The analysis returns it instead of any NaN or infinity, so no case ever drops out
// of an envelope silently. Callers that know where the load was written (a job file) locate
// it from Case and Load.
type NonFiniteError struct {
	Case string // the load case whose results overflow
	// Load is the index into the case's Loads of a load whose results overflow on their own;
	// -1 when no single load does (only the case's loads together, or a combination).
	Load int
	// Combination is the combination whose factored sum overflows; "" when the case's own
	// results do.
	Combination string
	Quantity    string  // what overflowed: "bending moment", "shear", "axial force", "deflection" or "support reaction"
	X           float64 // where it was found [mm]
}

func (e *NonFiniteError) Error() string {
	who := "case " + e.Case
	if e.Load >= 0 {
		who += fmt.Sprintf(", load %d", e.Load+1)
	}
	if e.Combination != "" {
		return fmt.Sprintf("combination %s (%s the largest part): the %s at x = %g mm is not a finite number; the loads are too large to analyse",
			e.Combination, who, e.Quantity, e.X)
	}
	return fmt.Sprintf("%s: the %s at x = %g mm is not a finite number; the load is too large to analyse",
		who, e.Quantity, e.X)
}

// isFinite reports whether x is neither NaN nor infinite, in one comparison (NaN compares
// false) so that it costs nothing in the envelope's inner loop.
func isFinite(x float64) bool { return math.Abs(x) <= math.MaxFloat64 }

// ReactionQuantity is the Quantity of a NonFiniteError about a support reaction.
const ReactionQuantity = "support reaction"

// stationQuantity names a station quantity (qM, qV, qN, qW) in a NonFiniteError.
func stationQuantity(q int) string {
	switch q {
	case qM:
		return "bending moment"
	case qV:
		return "shear"
	case qN:
		return "axial force"
	}
	return "deflection"
}

// firstNonFinite returns the index of the first value that is not finite, or -1.
func firstNonFinite(v ...float64) int {
	for i, x := range v {
		if !isFinite(x) {
			return i
		}
	}
	return -1
}

// columnFault finds the first non-finite value of one solved column: its element states, its
// reactions, then its values at the stations. ok is false when there is one.
func (a *Analysis) columnFault(col *column, st []Station) (quantity string, x float64, ok bool) {
	for i := range col.el {
		e := &col.el[i]
		x0 := a.s.elems[i].x0
		// the slope p0 counts as the deflection it feeds
		if q := firstNonFinite(e.m0, e.v0, e.n0, e.w0, e.p0); q >= 0 {
			return stationQuantity(min(q, qW)), x0, false
		}
	}
	for _, r := range col.reactions {
		if firstNonFinite(r.Fz, r.Fx, r.My) >= 0 {
			return ReactionQuantity, r.X, false
		}
	}
	ei := a.s.model.EI
	for _, s := range st {
		e, t := a.locate(s)
		m, v, n, w := col.el[e].at(t, s.Side, ei)
		if q := firstNonFinite(m, v, n, w); q >= 0 {
			return stationQuantity(q), s.X, false
		}
	}
	return "", 0, true
}

// keyStations are both sides of every key point: where loads start, end and act, the supports
// and the hinges.
func (a *Analysis) keyStations() []Station {
	st := make([]Station, 0, 2*len(a.keys))
	for _, x := range a.keys {
		st = append(st, Station{X: x, Side: Left}, Station{X: x, Side: Right})
	}
	return st
}

// checkFinite verifies every solved column at its element states, reactions and key points,
// and names the case (and the load, where one alone overflows) of the first that fails.
func (a *Analysis) checkFinite() error {
	st := a.keyStations()
	for k, cols := range a.caseCols {
		for _, c := range cols {
			if q, x, ok := a.columnFault(&a.cols[c], st); !ok {
				return &NonFiniteError{Case: a.cases[k].Name, Load: a.culprit(k, st), Quantity: q, X: x}
			}
		}
	}
	return nil
}

// culprit returns the index of the first load of case k whose results alone are not finite
// at the stations, or -1 when every load alone is finite (only their sum overflows). It solves
// each load on its own, so it is called only once a fault has been found.
func (a *Analysis) culprit(k int, st []Station) int {
	loads := a.cases[k].Loads
	sets := make([][]Load, len(loads))
	for i, l := range loads {
		sets[i] = []Load{l}
	}
	cols, err := a.s.solve(sets)
	if err != nil {
		return -1
	}
	for i := range cols {
		if _, _, ok := a.columnFault(&cols[i], st); !ok {
			return i
		}
	}
	return -1
}
