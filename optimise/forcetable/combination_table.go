package forcetable

import (
	"cmp"
	"math"
	"slices"
	"strings"

	"spanbreak/beam"
)

// combRow is one row of a per-combination table, in internal units.
type combRow struct {
	x    float64              // [mm]
	f    [nQuantities]float64 // M [N·mm], V [N], N [N], w [mm]
	line int
	comb int // index into the combinations
}

// combInfo is what the reader remembers of a combination.
type combInfo struct {
	state beam.LimitState
	line  int // where it first appears
}

// combinationTable reads the data rows of a per-combination table and builds the envelopes.
func (r *reader) combinationTable() *Table {
	h := &r.h
	var rows []combRow
	var combos []beam.Combination
	var info []combInfo
	index := map[string]int{}
	tooMany := false
	for {
		rec, ok := r.dataRow()
		if !ok {
			break
		}
		row := combRow{line: r.line(0)}
		x, good := r.position(rec, h.x)
		row.x = x
		name := unneutralise(rec[h.combination])
		if strings.TrimSpace(name) == "" {
			r.cell(h.combination, "the combination's name is empty")
			good = false
		}
		st, stateOK := r.state(rec, h.state)
		good = good && stateOK
		for q := qM; q < qW; q++ {
			v, ok := r.number(rec, h.force[q])
			row.f[q], good = v*q.toInternal(), good && ok
		}
		if i := h.force[qW]; i >= 0 {
			empty := strings.TrimSpace(rec[i]) == ""
			switch {
			case empty && (!stateOK || st == beam.ULS):
				// a ULS row needs no deflection (and without a state, none can be asked)
			case empty:
				r.cell(i, "the cell is empty; an SLS row needs its deflection when the table has the column w_mm")
				good = false
			default:
				v, ok := r.number(rec, i)
				row.f[qW], good = v, good && ok
			}
		}
		if !stateOK || strings.TrimSpace(name) == "" {
			r.bad = true
			continue // no state or no name: the combination cannot be told
		}
		c, known := index[name]
		switch {
		case known && info[c].state != st:
			r.cell(h.state, "combination %q is %s on line %d; a combination belongs to one limit state",
				clip(name), info[c].state, info[c].line)
			good = false
		case !known && len(combos) == r.lim.combinations:
			if !tooMany {
				r.cell(h.combination, "more than %d combinations; a forces table may have at most %d", r.lim.combinations, r.lim.combinations)
				tooMany = true
			}
			good = false
		case !known:
			c = len(combos)
			index[name] = c
			combos = append(combos, beam.Combination{Name: name, State: st})
			info = append(info, combInfo{state: st, line: row.line})
		}
		if !good {
			r.bad = true
			continue
		}
		row.comb = c
		rows = append(rows, row)
	}
	if r.full() {
		return nil
	}
	if r.rows == 0 {
		r.add(h.line, 0, "", "the table has a header but no data rows")
		return nil
	}
	byComb := make([][]int, len(combos))
	for i, row := range rows {
		byComb[row.comb] = append(byComb[row.comb], i)
	}
	for c, idx := range byComb {
		slices.SortStableFunc(idx, func(a, b int) int { return cmp.Compare(rows[a].x, rows[b].x) })
		r.checkJumps(rows, idx, combos[c].Name)
	}
	var uls, sls bool
	for _, c := range combos {
		uls, sls = uls || c.State == beam.ULS, sls || c.State == beam.SLS
	}
	t := &Table{Shape: CombinationShape}
	if sls {
		t.SLS = Parts{M: true, V: true, N: true, W: h.force[qW] >= 0}
	}
	if !sls {
		r.need(r.opt.NeedSLS, r.opt.SLSReason, "SLS forces (no row has the state SLS)")
	}
	if !t.SLS.W {
		what := "SLS deflection (no column w_mm)"
		if h.force[qW] >= 0 {
			what = "SLS deflection (no row has the state SLS)"
		}
		r.need(r.opt.NeedDeflection, r.opt.DeflectionReason, what)
	}
	if r.bad {
		return nil
	}
	if !uls {
		r.add(h.line, 0, "", "the table has no ULS rows; the splices are designed for the ULS forces")
	}
	for c, idx := range byComb {
		first, last := rows[idx[0]], rows[idx[len(idx)-1]]
		r.covers(first.x, last.x, first.line, last.line, h.x, "the stations of combination "+quote(combos[c].Name))
	}
	if len(r.ps) > 0 {
		return nil
	}
	t.Envelopes = envelopesOf(rows, byComb, combos, t.SLS.W)
	return t
}

func quote(s string) string { return `"` + clip(s) + `"` }

// checkJumps reports a third row at one x in one combination (idx sorted by x, file order kept
// at one x).
func (r *reader) checkJumps(rows []combRow, idx []int, name string) {
	for k := 2; k < len(idx); k++ {
		a, b, c := rows[idx[k-2]], rows[idx[k-1]], rows[idx[k]]
		if a.x == c.x {
			r.add(c.line, r.h.x+1, colX, "a third row of combination %s at x = %s m (lines %d and %d are the others); a jump is two rows, the left side then the right",
				quote(name), metres(c.x), a.line, b.line)
			r.bad = true
		}
	}
}

// envelopesOf builds the envelopes of per-combination rows (byComb: each combination's rows,
// sorted by x). The stations are the union of every combination's stations, both sides where
// any combination jumps; each combination is interpolated linearly between its own stations
// (its end value holds beyond them, within the cover tolerance) and the extremes are taken
// over the combinations of each limit state, the first combination in the file winning a tie.
func envelopesOf(rows []combRow, byComb [][]int, combos []beam.Combination, hasW bool) beam.Envelopes {
	xs := make([]float64, len(rows))
	for i, row := range rows {
		xs[i] = row.x
	}
	slices.Sort(xs)
	xs = slices.Compact(xs)
	jump := make([]bool, len(xs))
	for _, idx := range byComb {
		for k := 1; k < len(idx); k++ {
			if rows[idx[k]].x == rows[idx[k-1]].x {
				i, _ := slices.BinarySearch(xs, rows[idx[k]].x)
				jump[i] = true
			}
		}
	}
	var st []beam.Station
	for i, x := range xs {
		switch {
		case jump[i]:
			st = append(st, beam.Station{X: x, Side: beam.Left}, beam.Station{X: x, Side: beam.Right})
		case i == len(xs)-1:
			st = append(st, beam.Station{X: x, Side: beam.Left})
		default:
			st = append(st, beam.Station{X: x, Side: beam.Right})
		}
	}
	env := beam.Envelopes{Stations: st, Combinations: combos}
	env.ULS.State, env.SLS.State = beam.ULS, beam.SLS
	for _, e := range []*beam.Envelope{&env.ULS, &env.SLS} {
		for q := qM; q < nQuantities; q++ {
			for _, isMax := range []bool{true, false} {
				s := series(e, extremeCol{e.State, q, isMax})
				start := math.Inf(1) // the least adverse start of a minimum
				if isMax {
					start = math.Inf(-1)
				}
				*s = make([]beam.Extreme, len(st))
				for i := range *s {
					(*s)[i] = beam.Extreme{Value: start, Combination: -1}
				}
			}
		}
	}
	v := make([][nQuantities]float64, len(st))
	for c, idx := range byComb {
		interpolate(rows, idx, st, v)
		e := stateEnvelope(&env, combos[c].State)
		nq := qW
		if e.State == beam.SLS && hasW {
			nq = nQuantities
		}
		for q := qM; q < nq; q++ {
			mx, mn := *series(e, extremeCol{e.State, q, true}), *series(e, extremeCol{e.State, q, false})
			for i := range st {
				if v[i][q] > mx[i].Value {
					mx[i] = beam.Extreme{Value: v[i][q], Combination: int32(c)}
				}
				if v[i][q] < mn[i].Value {
					mn[i] = beam.Extreme{Value: v[i][q], Combination: int32(c)}
				}
			}
		}
	}
	// a quantity no combination gives (a limit state without rows, the deflection without
	// w_mm, any ULS deflection) is 0 with no governing combination
	for _, e := range []*beam.Envelope{&env.ULS, &env.SLS} {
		for q := qM; q < nQuantities; q++ {
			for _, isMax := range []bool{true, false} {
				s := *series(e, extremeCol{e.State, q, isMax})
				for i := range s {
					if s[i].Combination < 0 {
						s[i].Value = 0
					}
				}
			}
		}
	}
	return env
}

// interpolate writes into v the values of one combination (idx: its rows sorted by x) at every
// station: at a station of its own, that row (the first of a jump for the left side, the second
// for the right); between its stations, linear; beyond its ends, the end value.
func interpolate(rows []combRow, idx []int, st []beam.Station, v [][nQuantities]float64) {
	j := 0 // the first of the combination's rows with x ≥ the station's x
	for i, s := range st {
		for j < len(idx) && rows[idx[j]].x < s.X {
			j++
		}
		switch {
		case j < len(idx) && rows[idx[j]].x == s.X:
			k := j
			if s.Side == beam.Right && j+1 < len(idx) && rows[idx[j+1]].x == s.X {
				k = j + 1
			}
			v[i] = rows[idx[k]].f
		case j == 0:
			v[i] = rows[idx[0]].f
		case j == len(idx):
			v[i] = rows[idx[len(idx)-1]].f
		default:
			// idx[j-1] is the last row left of s (the right side of a jump there), idx[j]
			// the first right of it (the left side of a jump there)
			a, b := rows[idx[j-1]], rows[idx[j]]
			t := (s.X - a.x) / (b.x - a.x)
			for q := range v[i] {
				v[i][q] = a.f[q] + t*(b.f[q]-a.f[q])
			}
		}
	}
}
