package forcetable

import (
	"fmt"
	"strings"

	"spanbreak/beam"
	"spanbreak/optimise/jobfile"
)

// header is the meaning of the header row: the shape and the index of each known column
// (-1 where the column is absent).
type header struct {
	shape Shape
	line  int      // line of the header row in the file
	names []string // the header cells, spaces trimmed

	x, side int // both shapes (side: envelope table only)

	value, governing [nExtremeCols]int // envelope table, in the order of extremeCols

	combination, state int // per-combination table
	force              [nQuantities]int
}

// shapesHint describes the two shapes, for a header that fits neither.
const shapesHint = "; an envelope table has the columns x_m, side, uls_M_max_kNm, uls_M_min_kNm, " +
	"uls_V_max_kN, uls_V_min_kN, uls_N_max_kN, uls_N_min_kN and optional SLS and governing columns; " +
	"a per-combination table has x_m, combination, state, M_kNm, V_kN, N_kN and optionally w_mm"

// header reads the header row. It returns false when the rows cannot be read by it: no
// shape, or a required column missing. Unknown and duplicate columns are problems too, but
// the rows are still checked (those columns ignored).
func (r *reader) header(rec []string) bool {
	h := &r.h
	h.line = r.line(0)
	h.names = make([]string, len(rec))
	for i, c := range rec {
		h.names[i] = strings.TrimSpace(c)
	}
	envelope, combination := columnSet(EnvelopeColumns()), columnSet(CombinationColumns())
	envAt, combAt := -1, -1 // the first column that belongs to one shape only
	for i, n := range h.names {
		if n == colX {
			continue
		}
		if envelope[n] && envAt < 0 {
			envAt = i
		}
		if combination[n] && combAt < 0 {
			combAt = i
		}
	}
	switch {
	case envAt >= 0 && combAt >= 0:
		r.add(h.line, 0, "", "the header mixes the two table shapes: %s (column %d) belongs to the envelope table, %s (column %d) to the per-combination table%s",
			h.names[envAt], envAt+1, h.names[combAt], combAt+1, shapesHint)
		return false
	case envAt >= 0:
		h.shape = EnvelopeShape
	case combAt >= 0:
		h.shape = CombinationShape
	default:
		r.add(h.line, 0, "", "the header matches neither table shape%s", shapesHint)
		return false
	}

	h.x, h.side, h.combination, h.state = -1, -1, -1, -1
	for k := range h.value {
		h.value[k], h.governing[k] = -1, -1
	}
	for q := range h.force {
		h.force[q] = -1
	}
	index := h.indexFor()
	allowed := EnvelopeColumns()
	if h.shape == CombinationShape {
		allowed = CombinationColumns()
	}
	first := map[string]int{}
	for i, n := range h.names {
		switch j, seen := first[n]; {
		case n == "":
			r.add(h.line, i+1, "", "column %d has no name", i+1)
		case seen:
			r.add(h.line, i+1, n, "a second column %s (the first is column %d)", n, j+1)
		case index[n] == nil:
			first[n] = i
			r.add(h.line, i+1, clip(n), "unknown column %q in %s%s", clip(n), h.shape.aTable(), columnHint(n, allowed, h.shape))
		default:
			first[n] = i
			*index[n] = i
		}
	}
	return r.checkColumns()
}

// indexFor maps each column name of the header's shape to the field holding its index.
func (h *header) indexFor() map[string]*int {
	m := map[string]*int{colX: &h.x}
	if h.shape == CombinationShape {
		m[colCombination], m[colState] = &h.combination, &h.state
		m[colM], m[colV], m[colN], m[colW] = &h.force[qM], &h.force[qV], &h.force[qN], &h.force[qW]
		return m
	}
	m[colSide] = &h.side
	for k, c := range extremeCols() {
		m[c.valueName()], m[c.governingName()] = &h.value[k], &h.governing[k]
	}
	return m
}

// checkColumns reports missing and unpaired columns; it returns false when a required column
// is missing.
func (r *reader) checkColumns() bool {
	h := &r.h
	ok := true
	missing := func(idx int, name string) {
		if idx < 0 {
			r.add(h.line, 0, name, "%s needs the column %s", h.shape.theTable(), name)
			ok = false
		}
	}
	missing(h.x, colX)
	if h.shape == CombinationShape {
		missing(h.combination, colCombination)
		missing(h.state, colState)
		missing(h.force[qM], colM)
		missing(h.force[qV], colV)
		missing(h.force[qN], colN)
		return ok
	}
	cols := extremeCols()
	for k, c := range cols {
		if c.state == beam.ULS {
			missing(h.value[k], c.valueName())
			continue
		}
		if other := partner(k); h.value[k] >= 0 && h.value[other] < 0 {
			r.add(h.line, h.value[k]+1, c.valueName(), "%s comes without %s; give both extremes or neither",
				c.valueName(), cols[other].valueName())
		}
	}
	for k, c := range cols {
		if h.governing[k] >= 0 && h.value[k] < 0 {
			r.add(h.line, h.governing[k]+1, c.governingName(), "%s comes without the values it is about, %s",
				c.governingName(), c.valueName())
		}
	}
	return ok
}

func columnSet(names []string) map[string]bool {
	m := make(map[string]bool, len(names))
	for _, n := range names {
		m[n] = true
	}
	return m
}

// columnHint suggests a close column name, or lists the columns of the shape.
func columnHint(got string, allowed []string, shape Shape) string {
	if s := jobfile.Suggest(got, allowed); s != "" {
		return fmt.Sprintf("; did you mean %s?", s)
	}
	if shape == CombinationShape {
		return " (columns: " + strings.Join(allowed, ", ") + ")"
	}
	return " (columns: x_m, side, then uls_ or sls_, a quantity M, V, N or w (SLS only), _max or _min, " +
		"and the unit _kNm, _kN or _mm, or _governing for the combination that gives the value)"
}
