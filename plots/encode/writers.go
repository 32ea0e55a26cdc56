package encode

import (
	"bytes"
	"encoding/csv"
	"encoding/json"
	"io"
	"strconv"
	"strings"
	"text/tabwriter"
)

// WriteJSON writes a document as indented JSON with a final newline.
func WriteJSON(w io.Writer, v any) error {
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(v)
}

// Cell is one CSV cell: a number, written as it is, or text. A spreadsheet runs a cell that
// begins with =, +, - or @ as a formula (and a leading tab or carriage return hides what
// follows), so text cells that begin so — a vehicle named "=HYPERLINK(...)", a title, a
// reason — get a leading apostrophe, the mark spreadsheets read as "this is text"; a leading
// apostrophe is doubled so that the mark can be told from the text. Number cells are never
// changed: a negative moment stays a number. The zero Cell is an empty cell.
type Cell struct{ s string }

// formulaStarts are the first characters that make a spreadsheet read a text cell as a
// formula or hide it, and the apostrophe that marks text. optimise/forcetable writes its
// governing names by the same rule.
const formulaStarts = "=+-@\t\r'"

// Text is a text cell: control characters escaped as TextWriter does (the line feeds a
// quoted CSV cell may hold are kept), then neutralised if a spreadsheet would run it.
func Text(s string) Cell {
	s = escape(s, true)
	if s != "" && strings.IndexByte(formulaStarts, s[0]) >= 0 {
		s = "'" + s
	}
	return Cell{s}
}

// Decimal is a number cell, rounded as Number rounds.
func Decimal(v float64) Cell { return Cell{Number(v)} }

// Decimals is a cell of numbers separated by semicolons, "4.995;7.005".
func Decimals(vs []float64) Cell {
	parts := make([]string, len(vs))
	for i, v := range vs {
		parts[i] = Number(v)
	}
	return Cell{strings.Join(parts, ";")}
}

// Integer is a whole-number cell.
func Integer(n int) Cell { return Cell{strconv.Itoa(n)} }

// Boolean is a true/false cell.
func Boolean(b bool) Cell { return Cell{strconv.FormatBool(b)} }

// String returns the cell as written.
func (c Cell) String() string { return c.s }

// WriteCSV writes a header (the program's own column names) and rows of cells (RFC 4180).
func WriteCSV(w io.Writer, header []string, rows [][]Cell) error {
	return writeCSVRows(w, header, len(rows), func(i int, _ []Cell) []Cell { return rows[i] })
}

// writeCSVRows writes a header and n rows, row i made by row(i, dst) when it is written (dst
// is the previous row's slice, free to reuse), so that a long table is never held whole.
func writeCSVRows(w io.Writer, header []string, n int, row func(i int, dst []Cell) []Cell) error {
	cw := csv.NewWriter(w)
	if err := cw.Write(header); err != nil {
		return err
	}
	rec := make([]string, 0, len(header))
	var cells []Cell
	for i := range n {
		cells = row(i, cells)
		rec = rec[:0]
		for _, c := range cells {
			rec = append(rec, c.s)
		}
		if err := cw.Write(rec); err != nil {
			return err
		}
	}
	cw.Flush()
	return cw.Error()
}

// Table returns a text table: cells separated by tabs, columns padded two spaces apart, and
// no trailing spaces on any line. Flush writes it.
func Table(w io.Writer) *tabwriter.Writer {
	return tabwriter.NewWriter(&trimWriter{w: w}, 0, 0, 2, ' ', 0)
}

// RightTable is a Table whose columns are aligned on the right (numbers); every cell,
// the last one included, must end with a tab.
func RightTable(w io.Writer) *tabwriter.Writer {
	return tabwriter.NewWriter(&trimWriter{w: w}, 0, 0, 2, ' ', tabwriter.AlignRight)
}

// trimWriter passes lines on without their trailing spaces.
type trimWriter struct {
	w       io.Writer
	pending []byte
}

func (t *trimWriter) Write(p []byte) (int, error) {
	t.pending = append(t.pending, p...)
	for {
		i := bytes.IndexByte(t.pending, '\n')
		if i < 0 {
			return len(p), nil
		}
		line := bytes.TrimRight(t.pending[:i], " ")
		if _, err := t.w.Write(append(line, '\n')); err != nil {
			return 0, err
		}
		t.pending = t.pending[i+1:]
	}
}
