package forcetable

import (
	"strings"

	"spanbreak/beam"
)

// Shape is the layout of a forces table, told from its header.
type Shape int

const (
	// EnvelopeShape is one row per station with the ULS and SLS extremes in columns.
	EnvelopeShape Shape = iota + 1
	// CombinationShape is one row per station and combination.
	CombinationShape
)

// String returns "envelope" or "per-combination".
func (s Shape) String() string {
	switch s {
	case EnvelopeShape:
		return "envelope"
	case CombinationShape:
		return "per-combination"
	}
	return "unknown"
}

// aTable is "an envelope table" or "a per-combination table", for messages.
func (s Shape) aTable() string {
	if s == EnvelopeShape {
		return "an envelope table"
	}
	return "a per-combination table"
}

// theTable is "the envelope table" or "the per-combination table".
func (s Shape) theTable() string { return "the " + s.String() + " table" }

// quantity is one internal force or the deflection.
type quantity int

const (
	qM quantity = iota // bending moment
	qV                 // shear
	qN                 // axial force
	qW                 // deflection
	nQuantities
)

// symbol is the quantity's letter in column names.
func (q quantity) symbol() string { return [...]string{"M", "V", "N", "w"}[q] }

// unit is the quantity's unit in the file.
func (q quantity) unit() string { return [...]string{"kNm", "kN", "kN", "mm"}[q] }

// toInternal takes a value in the file's unit to N·mm, N or mm.
func (q quantity) toInternal() float64 { return [...]float64{1e6, 1e3, 1e3, 1}[q] }

// words names the quantity in messages.
func (q quantity) words() string {
	return [...]string{"bending moment", "shear", "axial force", "deflection"}[q]
}

// Factors between the file's units and the internal ones.
const (
	mmPerM = 1e3 // x_m → mm
)

// extremeCol is one value column of the envelope table: a quantity's maximum or minimum in one
// limit state.
type extremeCol struct {
	state beam.LimitState
	q     quantity
	max   bool
}

// nExtremeCols is the number of value columns of the envelope table: 6 ULS, 8 SLS.
const nExtremeCols = 14

// extremeCols lists the envelope table's value columns in the order they are written: the ULS
// M, V and N (no ULS deflection), then the SLS M, V, N and w, each as max, min.
func extremeCols() [nExtremeCols]extremeCol {
	var out [nExtremeCols]extremeCol
	k := 0
	for _, st := range []beam.LimitState{beam.ULS, beam.SLS} {
		for q := qM; q < nQuantities; q++ {
			if st == beam.ULS && q == qW {
				continue
			}
			out[k], out[k+1] = extremeCol{st, q, true}, extremeCol{st, q, false}
			k += 2
		}
	}
	return out
}

func (c extremeCol) prefix() string {
	ext := "min"
	if c.max {
		ext = "max"
	}
	return strings.ToLower(c.state.String()) + "_" + c.q.symbol() + "_" + ext
}

// valueName is the column of the value, e.g. "uls_M_max_kNm".
func (c extremeCol) valueName() string { return c.prefix() + "_" + c.q.unit() }

// governingName is the column of the governing combination, e.g. "uls_M_max_governing".
func (c extremeCol) governingName() string { return c.prefix() + "_governing" }

// partner is the index of the other extreme of the same quantity and state.
func partner(k int) int { return k ^ 1 }

// series returns the envelope's array for one extreme column.
func series(e *beam.Envelope, c extremeCol) *[]beam.Extreme {
	switch {
	case c.q == qM && c.max:
		return &e.MMax
	case c.q == qM:
		return &e.MMin
	case c.q == qV && c.max:
		return &e.VMax
	case c.q == qV:
		return &e.VMin
	case c.q == qN && c.max:
		return &e.NMax
	case c.q == qN:
		return &e.NMin
	case c.max:
		return &e.WMax
	}
	return &e.WMin
}

func stateEnvelope(env *beam.Envelopes, st beam.LimitState) *beam.Envelope {
	if st == beam.SLS {
		return &env.SLS
	}
	return &env.ULS
}

// Column names shared by both shapes and those of the per-combination table.
const (
	colX           = "x_m"
	colSide        = "side"
	colCombination = "combination"
	colState       = "state"
	colM           = "M_kNm"
	colV           = "V_kN"
	colN           = "N_kN"
	colW           = "w_mm"
)

// EnvelopeColumns returns every column of the envelope table in the order WriteEnvelopes
// writes them: x_m, side, the 14 extremes (ULS M, V, N; SLS M, V, N, w; each max then min),
// then the 14 governing columns in the same order.
func EnvelopeColumns() []string {
	cols := extremeCols()
	out := []string{colX, colSide}
	for _, c := range cols {
		out = append(out, c.valueName())
	}
	for _, c := range cols {
		out = append(out, c.governingName())
	}
	return out
}

// CombinationColumns returns the columns of the per-combination table; the last, w_mm, is
// optional.
func CombinationColumns() []string {
	return []string{colX, colCombination, colState, colM, colV, colN, colW}
}
