package forcetable

import (
	"bytes"
	"crypto/sha256"
	"encoding/csv"
	"encoding/hex"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"unicode/utf8"

	"spanbreak/beam"
	"spanbreak/optimise/jobfile"
)

// maxProblems is the length of a problem list before it is cut, as jobfile.Problems cuts it.
const maxProblems = 100

// limits bound one read; the package's tests shrink them to reach each limit cheaply.
type limits struct {
	bytes, rows, combinations int
}

func defaultLimits() limits { return limits{jobfile.MaxFileSize, MaxRows, MaxCombinations} }

// Read checks a forces table and returns it as envelopes over the member [0, opt.Length].
// name is used in the problems and kept as Table.File. The error is a non-empty
// jobfile.Problems (every problem of the file, sorted by line) or nil.
func Read(name string, data []byte, opt Options) (*Table, error) {
	return read(name, data, opt, defaultLimits())
}

// ReadFile reads the forces table at path (at most jobfile.MaxFileSize bytes are read) and
// checks it as Read; path is kept as Table.File. A file that cannot be read is a
// jobfile.Problems too.
func ReadFile(path string, opt Options) (*Table, error) {
	f, err := os.Open(path)
	if err != nil {
		return nil, fileProblem(path, err)
	}
	defer f.Close()
	data, err := io.ReadAll(io.LimitReader(f, jobfile.MaxFileSize+1))
	if err != nil {
		return nil, fileProblem(path, err)
	}
	return Read(path, data, opt)
}

// ResolvePath returns the path of a forces file named in a job file: relative to the folder of
// the job file, unless it is absolute.
func ResolvePath(jobFile, file string) string {
	if filepath.IsAbs(file) {
		return file
	}
	return filepath.Join(filepath.Dir(jobFile), file)
}

func fileProblem(path string, err error) error {
	var pe *fs.PathError
	if errors.As(err, &pe) {
		err = pe.Err
	}
	var ps jobfile.Problems
	ps.Add(jobfile.Loc{File: path}, "cannot read the forces table: %v", err)
	return ps.Err()
}

func read(name string, data []byte, opt Options, lim limits) (*Table, error) {
	if !(opt.Length > 0) || math.IsInf(opt.Length, 0) {
		panic(fmt.Sprintf("forcetable: Options.Length must be a positive member length in mm, got %g", opt.Length))
	}
	r := &reader{file: name, opt: opt, lim: lim}
	t := r.table(data)
	if len(r.ps) > 0 {
		return nil, r.ps.Err()
	}
	if t == nil {
		panic("forcetable: a table was refused without a problem")
	}
	t.File, t.SHA256, t.Length, t.Rows = name, sha256Hex(data), opt.Length, r.rows
	return t, nil
}

// sha256Hex is the SHA-256 of data in lower-case hex.
func sha256Hex(data []byte) string {
	sum := sha256.Sum256(data)
	return hex.EncodeToString(sum[:])
}

// reader holds the state of one read.
type reader struct {
	file string
	opt  Options
	lim  limits
	ps   jobfile.Problems
	cr   *csv.Reader
	h    header
	rows int  // data rows read so far
	bad  bool // a data row failed: the checks of the whole table are left out
}

// add records a problem at a line and a column (1-based index, 0 for none) named path.
func (r *reader) add(line, col int, path, format string, args ...any) {
	r.ps.Add(jobfile.Loc{File: r.file, Pos: jobfile.Pos{Line: line, Column: col}, Path: path}, format, args...)
}

// full reports whether the problem list has been cut: reading further is wasted.
func (r *reader) full() bool { return len(r.ps) > maxProblems }

// cell records a problem with field i of the record just read.
func (r *reader) cell(i int, format string, args ...any) {
	line, _ := r.cr.FieldPos(i)
	r.add(line, i+1, r.h.names[i], format, args...)
}

// rowProblem records a problem with the record just read as a whole.
func (r *reader) rowProblem(format string, args ...any) {
	line, _ := r.cr.FieldPos(0)
	r.add(line, 0, "", format, args...)
}

// line is the line of field i of the record just read.
func (r *reader) line(i int) int {
	line, _ := r.cr.FieldPos(i)
	return line
}

// utf8BOM is the byte-order mark some spreadsheets put before UTF-8 text.
const utf8BOM = "\ufeff"

// table reads the whole file; it returns nil when the file cannot be read as a table.
func (r *reader) table(data []byte) *Table {
	if len(data) > r.lim.bytes {
		r.add(0, 0, "", "the file is %d bytes; a forces table may be at most %d MiB (%d bytes), the limit of job files",
			len(data), r.lim.bytes>>20, r.lim.bytes)
		return nil
	}
	if !utf8.Valid(data) {
		r.add(0, 0, "", "the file is not UTF-8 text; save the table as CSV in UTF-8")
		return nil
	}
	r.cr = csv.NewReader(bytes.NewReader(bytes.TrimPrefix(data, []byte(utf8BOM))))
	r.cr.FieldsPerRecord = -1 // the reader checks the count itself, to report and go on
	rec, ok := r.next()
	if len(r.ps) > 0 {
		return nil // the header row is malformed
	}
	if !ok {
		r.add(0, 0, "", "the file is empty; a forces table starts with a header row%s", shapesHint)
		return nil
	}
	if !r.header(rec) {
		return nil
	}
	switch r.h.shape {
	case EnvelopeShape:
		return r.envelopeTable()
	default:
		return r.combinationTable()
	}
}

// next returns the next record that is not blank (a row of empty cells, as spreadsheets
// pad, is blank). A malformed record is reported, marks the table bad and is skipped. It
// returns false at the end of the file, or when the problem list is full.
func (r *reader) next() ([]string, bool) {
	for !r.full() {
		rec, err := r.cr.Read()
		if err == io.EOF {
			return nil, false
		}
		var pe *csv.ParseError
		if errors.As(err, &pe) {
			r.add(pe.Line, 0, "", "%s (at byte %d of the line)", csvMessage(pe.Err), pe.Column)
			r.bad = true
			continue
		}
		if err != nil {
			r.add(0, 0, "", "%v", err)
			return nil, false
		}
		if blank(rec) {
			continue
		}
		return rec, true
	}
	return nil, false
}

func csvMessage(err error) string {
	switch {
	case errors.Is(err, csv.ErrBareQuote):
		return `a quote (") inside a cell that does not start with one; quote the whole cell and double the quote inside`
	case errors.Is(err, csv.ErrQuote):
		return `a quoted cell is not closed, or its closing quote (") is followed by other text`
	}
	return err.Error()
}

func blank(rec []string) bool {
	for _, c := range rec {
		if strings.TrimSpace(c) != "" {
			return false
		}
	}
	return true
}

// dataRow returns the next data row with as many cells as the header, counting rows and
// reporting a row of another length or past MaxRows.
func (r *reader) dataRow() ([]string, bool) {
	for {
		rec, ok := r.next()
		if !ok {
			return nil, false
		}
		r.rows++
		if r.rows > r.lim.rows {
			r.rowProblem("the table has more than %d data rows, the station limit of an analysis", r.lim.rows)
			r.bad = true
			return nil, false
		}
		if len(rec) != len(r.h.names) {
			r.rowProblem("the row has %d cells; the header has %d", len(rec), len(r.h.names))
			r.bad = true
			continue
		}
		return rec, true
	}
}

// number reads field i as a decimal number in the file's unit.
func (r *reader) number(rec []string, i int) (float64, bool) {
	v, msg := parseNumber(strings.TrimSpace(rec[i]))
	if msg != "" {
		r.cell(i, "%s", msg)
		return 0, false
	}
	return v, true
}

// position reads field i as x [m] and returns it in mm, on the member within CoverTolerance.
// x is taken to 1e-6 m (0.001 mm), the resolution the tables are written with, so that a
// table written from this one reads back with the same stations.
func (r *reader) position(rec []string, i int) (float64, bool) {
	v, ok := r.number(rec, i)
	if !ok {
		return 0, false
	}
	x := math.Round(v*1e6) / 1e6 * mmPerM
	if !(x >= -CoverTolerance && x <= r.opt.Length+CoverTolerance) {
		r.cell(i, "x = %s m is off the member (0 to %s m)", strings.TrimSpace(rec[i]), metres(r.opt.Length))
		return 0, false
	}
	return x, true
}

// parseNumber reads a decimal number: digits with an optional point and exponent, finite and
// within MaxMagnitude. It returns the problem's message when the text is not one.
func parseNumber(s string) (float64, string) {
	if s == "" {
		return 0, "the cell is empty; a number is needed"
	}
	if !isDecimal(s) {
		l := strings.ToLower(strings.TrimLeft(s, "+-"))
		if l == "nan" || strings.HasPrefix(l, "inf") {
			return 0, fmt.Sprintf("%q is not a finite number", clip(s))
		}
		return 0, fmt.Sprintf("%q is not a number (write decimal digits with a point, such as 12.5 or -3e2)", clip(s))
	}
	v, err := strconv.ParseFloat(s, 64)
	if err != nil || math.Abs(v) > MaxMagnitude {
		return 0, fmt.Sprintf("%s is out of range: a value must lie within ±%g of its unit", clip(s), MaxMagnitude)
	}
	return v, ""
}

// isDecimal reports whether s is [+-] digits [. digits] [e [+-] digits], with a digit before
// or after the point.
func isDecimal(s string) bool {
	i := 0
	if i < len(s) && (s[i] == '+' || s[i] == '-') {
		i++
	}
	digits := func() int {
		j := i
		for i < len(s) && s[i] >= '0' && s[i] <= '9' {
			i++
		}
		return i - j
	}
	n := digits()
	if i < len(s) && s[i] == '.' {
		i++
		n += digits()
	}
	if n == 0 {
		return false
	}
	if i < len(s) && (s[i] == 'e' || s[i] == 'E') {
		i++
		if i < len(s) && (s[i] == '+' || s[i] == '-') {
			i++
		}
		if digits() == 0 {
			return false
		}
	}
	return i == len(s)
}

// clip shortens a cell's text for a message.
func clip(s string) string {
	const limit = 40
	if utf8.RuneCountInString(s) <= limit {
		return s
	}
	return string([]rune(s)[:limit]) + "…"
}

// side reads a side cell: left or right, in any letter case.
func (r *reader) side(rec []string, i int) (beam.Side, bool) {
	switch strings.ToLower(strings.TrimSpace(rec[i])) {
	case "left":
		return beam.Left, true
	case "right":
		return beam.Right, true
	}
	r.cell(i, "unknown side %q (allowed: left, right)", clip(rec[i]))
	return 0, false
}

// state reads a limit-state cell: ULS or SLS, in any letter case.
func (r *reader) state(rec []string, i int) (beam.LimitState, bool) {
	switch strings.ToUpper(strings.TrimSpace(rec[i])) {
	case "ULS":
		return beam.ULS, true
	case "SLS":
		return beam.SLS, true
	}
	r.cell(i, "unknown limit state %q (allowed: ULS, SLS)", clip(rec[i]))
	return 0, false
}

// need records that the caller needs the SLS forces or the deflection and the file does not
// give them; what says what is missing.
func (r *reader) need(needed bool, reason, what string) {
	if needed {
		r.add(r.h.line, 0, "", "the table gives no %s; it is needed%s", what, because(reason))
	}
}

func because(reason string) string {
	if reason == "" {
		return ""
	}
	return ": " + reason
}
