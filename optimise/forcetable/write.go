package forcetable

import (
	"bufio"
	"bytes"
	"encoding/csv"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"spanbreak/beam"
)

// num formats a value in the file's unit: rounded to 1e-6 of the unit (far below any
// engineering tolerance), shortest form, never "-0".
func num(v float64) string { return string(appendNum(nil, v)) }

// appendNum appends num(v).
func appendNum(b []byte, v float64) []byte {
	r := math.Round(v*1e6) / 1e6
	if r == 0 {
		return append(b, '0')
	}
	return strconv.AppendFloat(b, r, 'f', -1, 64)
}

// formulaStarts are the first characters that make a spreadsheet read a cell as a formula (or
// hide it), and the apostrophe that escapes them, which is escaped too so that reading strips
// exactly what writing added.
const formulaStarts = "=+-@\t\r'"

// neutralise prefixes an apostrophe to a text cell that a spreadsheet would take for a formula.
func neutralise(s string) string {
	if s != "" && strings.IndexByte(formulaStarts, s[0]) >= 0 {
		return "'" + s
	}
	return s
}

// unneutralise strips the apostrophe that neutralise adds.
func unneutralise(s string) string {
	if len(s) >= 2 && s[0] == '\'' && strings.IndexByte(formulaStarts, s[1]) >= 0 {
		return s[1:]
	}
	return s
}

// WriteEnvelopes writes envelopes as an envelope table with every column of EnvelopeColumns:
// what `analyse --format csv` writes, and what Read takes back unchanged. Values are rounded
// to 1e-6 of the file's unit (so x to 1e-3 mm: stations closer than that print at one x); a
// governing cell is env.Governing of the extreme, empty where no combination of the limit
// state exists. For a table that imports, the stations must ascend and cover the member, as
// those of beam.Analysis.Stations do. Nothing is written when a value is not finite.
func WriteEnvelopes(w io.Writer, env *beam.Envelopes) error {
	name := func(ex beam.Extreme) string {
		if ex.Combination < 0 || int(ex.Combination) >= len(env.Combinations) {
			return ""
		}
		return env.Governing(ex)
	}
	return write(w, env, allSLS(), name)
}

// Write writes the table in the envelope shape, with the SLS columns of the quantities it
// gives and every governing column; reading the result gives the same table.
func (t *Table) Write(w io.Writer) error {
	return write(w, &t.Envelopes, t.SLS, t.Governing)
}

func write(w io.Writer, env *beam.Envelopes, sls Parts, governing func(beam.Extreme) string) error {
	var cols []extremeCol
	for _, c := range extremeCols() {
		if c.state == beam.ULS || sls.has(c.q) {
			cols = append(cols, c)
		}
	}
	n := len(env.Stations)
	data := make([]*[]beam.Extreme, len(cols))
	for k, c := range cols {
		data[k] = series(stateEnvelope(env, c.state), c)
		if len(*data[k]) != n {
			panic(fmt.Sprintf("forcetable: %d stations but %d values of %s", n, len(*data[k]), c.valueName()))
		}
	}
	for i, s := range env.Stations {
		if !finite(s.X) {
			return fmt.Errorf("station %d: x = %g mm is not finite", i, s.X)
		}
		for k, c := range cols {
			if v := (*data[k])[i].Value; !finite(v) {
				return fmt.Errorf("station %d (x = %s m): %s = %g is not finite", i, metres(s.X), c.valueName(), v)
			}
		}
	}
	header := []string{colX, colSide}
	for _, c := range cols {
		header = append(header, c.valueName())
	}
	for _, c := range cols {
		header = append(header, c.governingName())
	}
	// the rows are written as encoding/csv writes them, a field at a time into one line: a
	// number needs no quotes, and each governing cell is quoted once for all its stations
	bw := bufio.NewWriterSize(w, 1<<16)
	cells := newCSVCells()
	if _, err := bw.Write(cells.record(header)); err != nil {
		return err
	}
	named := map[[2]int32][]byte{}
	var line []byte
	for i, s := range env.Stations {
		line = appendNum(line[:0], s.X/mmPerM)
		line = append(append(line, ','), sideName(s.Side)...)
		for k, c := range cols {
			line = appendNum(append(line, ','), (*data[k])[i].Value/c.q.toInternal())
		}
		for k := range cols {
			ex := (*data[k])[i]
			key := [2]int32{ex.Combination, ex.Pattern}
			cell, ok := named[key]
			if !ok {
				cell = cells.field(neutralise(governing(ex)))
				named[key] = cell
			}
			line = append(append(line, ','), cell...)
		}
		if _, err := bw.Write(append(line, '\n')); err != nil {
			return err
		}
	}
	return bw.Flush()
}

// csvCells encodes cells as encoding/csv writes them (quoted where it quotes them).
type csvCells struct {
	buf bytes.Buffer
	w   *csv.Writer
}

func newCSVCells() *csvCells {
	c := &csvCells{}
	c.w = csv.NewWriter(&c.buf)
	return c
}

// record returns a whole record with its line end.
func (c *csvCells) record(fields []string) []byte {
	c.buf.Reset()
	_ = c.w.Write(fields) // into memory: cannot fail
	c.w.Flush()
	return bytes.Clone(c.buf.Bytes())
}

// field returns one cell.
func (c *csvCells) field(s string) []byte {
	r := c.record([]string{s})
	return r[:len(r)-1]
}

func sideName(s beam.Side) string {
	if s == beam.Left {
		return "left"
	}
	return "right"
}

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }
