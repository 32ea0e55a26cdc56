package encode

import (
	"bytes"
	"encoding/csv"
	"encoding/json"
	"io"
	"text/tabwriter"
)

// WriteJSON writes a document as indented JSON with a final newline.
func WriteJSON(w io.Writer, v any) error {
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(v)
}

// WriteCSV writes a header and rows (RFC 4180).
func WriteCSV(w io.Writer, header []string, rows [][]string) error {
	cw := csv.NewWriter(w)
	if err := cw.Write(header); err != nil {
		return err
	}
	if err := cw.WriteAll(rows); err != nil {
		return err
	}
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
