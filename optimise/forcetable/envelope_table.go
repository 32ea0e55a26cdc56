package forcetable

import (
	"strings"

	"spanbreak/beam"
)

// comboKey identifies a combination by its limit state and name.
type comboKey struct {
	state beam.LimitState
	name  string
}

// order checks that stations ascend and that a jump is at most two rows; it remembers the last
// good row.
type order struct {
	seen  bool
	x     float64   // [mm]
	text  string    // the x cell as written
	lines [2]int    // lines of the rows at x
	n     int       // rows at x so far: 1, or 2 at a jump
	side  beam.Side // of the last row at x
}

// envelopeTable reads the data rows of an envelope table.
func (r *reader) envelopeTable() *Table {
	h := &r.h
	cols := extremeCols()
	t := &Table{Shape: EnvelopeShape}
	env := &t.Envelopes
	env.ULS.State, env.SLS.State = beam.ULS, beam.SLS
	var data [nExtremeCols]*[]beam.Extreme
	for k, c := range cols {
		data[k] = series(stateEnvelope(env, c.state), c)
	}
	combos := map[comboKey]int{}
	combination := func(st beam.LimitState, cell string) int {
		name := unneutralise(cell)
		if strings.TrimSpace(name) == "" {
			return -1
		}
		key := comboKey{st, name}
		i, ok := combos[key]
		if !ok {
			i = len(env.Combinations)
			combos[key] = i
			env.Combinations = append(env.Combinations, beam.Combination{Name: name, State: st})
		}
		return i
	}
	var prev order
	var firstLine, lastLine int
	for {
		rec, ok := r.dataRow()
		if !ok {
			break
		}
		x, good := r.position(rec, h.x)
		side := beam.Right
		if h.side >= 0 {
			s, ok := r.side(rec, h.side)
			side, good = s, good && ok
		}
		var vals [nExtremeCols]float64
		var read [nExtremeCols]bool
		for k, c := range cols {
			if h.value[k] < 0 {
				continue
			}
			v, ok := r.number(rec, h.value[k])
			vals[k], read[k] = v*c.q.toInternal(), ok
			good = good && ok
		}
		for k := 0; k < nExtremeCols; k += 2 {
			if read[k] && read[k+1] && vals[k] < vals[k+1] {
				r.cell(h.value[k], "%s = %s is below %s = %s; a maximum cannot be below its minimum",
					cols[k].valueName(), strings.TrimSpace(rec[h.value[k]]),
					cols[k+1].valueName(), strings.TrimSpace(rec[h.value[k+1]]))
				good = false
			}
		}
		if !good || !r.inOrder(&prev, rec, x, side) {
			r.bad = true
			continue
		}
		if firstLine == 0 {
			firstLine = r.line(0)
		}
		lastLine = r.line(0)
		env.Stations = append(env.Stations, beam.Station{X: x, Side: side})
		for k, c := range cols {
			if h.value[k] < 0 {
				continue
			}
			ex := beam.Extreme{Value: vals[k], Combination: -1}
			if h.governing[k] >= 0 {
				ex.Combination = int32(combination(c.state, rec[h.governing[k]]))
			}
			*data[k] = append(*data[k], ex)
		}
	}
	if r.full() {
		return nil
	}
	for k, c := range cols {
		if h.value[k] >= 0 && h.value[partner(k)] >= 0 && c.state == beam.SLS {
			t.SLS.set(c.q)
		}
	}
	r.needEnvelopeParts(t.SLS)
	if r.rows == 0 {
		r.add(h.line, 0, "", "the table has a header but no data rows")
		return nil
	}
	if r.bad {
		return nil
	}
	n := len(env.Stations)
	for _, e := range []*beam.Envelope{&env.ULS, &env.SLS} {
		for q := qM; q < nQuantities; q++ {
			for _, isMax := range []bool{true, false} {
				// the ULS deflection, and an SLS quantity the table does not give (or gives
				// only one extreme of, a problem already reported)
				if s := series(e, extremeCol{e.State, q, isMax}); e.State == beam.SLS && !t.SLS.has(q) || len(*s) != n {
					*s = absent(n)
				}
			}
		}
	}
	if h.side < 0 {
		assignSides(env.Stations)
	}
	r.covers(env.Stations[0].X, env.Stations[n-1].X, firstLine, lastLine, h.x, "the stations")
	return t
}

// inOrder checks a row's x against the last good row: ascending, a jump at most two rows, and
// with a side column, a jump's rows the left side then the right. It records the row as the
// last good one when it passes.
func (r *reader) inOrder(prev *order, rec []string, x float64, side beam.Side) bool {
	h := &r.h
	text, line := strings.TrimSpace(rec[h.x]), r.line(h.x)
	if prev.seen {
		switch {
		case x < prev.x:
			r.cell(h.x, "x = %s m comes after x = %s m (line %d); the stations must ascend", text, prev.text, prev.lines[prev.n-1])
			return false
		case x == prev.x && prev.n == 2:
			r.cell(h.x, "a third row at x = %s m (lines %d and %d are the others); a jump is two rows, the left side then the right",
				text, prev.lines[0], prev.lines[1])
			return false
		case x == prev.x && h.side >= 0 && !(prev.side == beam.Left && side == beam.Right):
			r.cell(h.side, "two rows at x = %s m (lines %d and %d) are a jump: the first must be the left side and the second the right, not %s then %s",
				text, prev.lines[0], line, sideName(prev.side), sideName(side))
			return false
		case x == prev.x:
			prev.lines[1], prev.n, prev.side = line, 2, side
			return true
		}
	}
	*prev = order{seen: true, x: x, text: text, lines: [2]int{line}, n: 1, side: side}
	return true
}

// assignSides gives stations read without a side column their side: at a jump (two rows at
// one x) the first is Left and the second Right; a single row is Right, or Left at the end of
// the member (as beam.Analysis.Stations places them).
func assignSides(st []beam.Station) {
	for i := range st {
		switch {
		case i+1 < len(st) && st[i+1].X == st[i].X:
			st[i].Side = beam.Left
		case i > 0 && st[i-1].X == st[i].X:
			st[i].Side = beam.Right
		case i == len(st)-1 && i > 0:
			st[i].Side = beam.Left
		default:
			st[i].Side = beam.Right
		}
	}
}

// covers checks that stations from first to last [mm] cover the member; the lines are those of
// the rows holding them, col the column of x, what names the stations.
func (r *reader) covers(first, last float64, firstLine, lastLine, col int, what string) {
	if first > CoverTolerance {
		r.add(firstLine, col+1, colX, "%s start at x = %s m; they must cover the member from x = 0 (within %g mm)",
			what, metres(first), CoverTolerance)
	}
	if last < r.opt.Length-CoverTolerance {
		r.add(lastLine, col+1, colX, "%s end at x = %s m; they must cover the member to its end at x = %s m (within %g mm)",
			what, metres(last), metres(r.opt.Length), CoverTolerance)
	}
}

// needEnvelopeParts reports the SLS columns the caller needs and the table lacks.
func (r *reader) needEnvelopeParts(sls Parts) {
	var words, names []string
	for k, c := range extremeCols() {
		if c.state == beam.SLS && c.q != qW && c.max && !sls.has(c.q) {
			words = append(words, c.q.words())
			names = append(names, c.valueName(), extremeCols()[partner(k)].valueName())
		}
	}
	if len(words) > 0 {
		r.need(r.opt.NeedSLS, r.opt.SLSReason, "SLS "+strings.Join(words, ", ")+
			" (no columns "+strings.Join(names, ", ")+")")
	}
	if !sls.W {
		r.need(r.opt.NeedDeflection, r.opt.DeflectionReason, "SLS deflection (no columns sls_w_max_mm, sls_w_min_mm)")
	}
}

// absent is the series of a quantity the file does not give: 0, no governing combination.
func absent(n int) []beam.Extreme {
	out := make([]beam.Extreme, n)
	for i := range out {
		out[i].Combination = -1
	}
	return out
}
