package beam

import (
	"cmp"
	_ "embed"
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"math"
	"slices"
	"strconv"
	"strings"
	"sync"
	"unicode"
)

// The rolled-section catalogue: one CSV row per section, each series' published source named
// in the file's header and in every row (see sections.csv).
//
//go:embed sections.csv
var catalogueCSV string

// catalogueRow is one parsed catalogue line: the section with its computed properties, the
// published mass per metre (check column) and the normalised names it answers to.
type catalogueRow struct {
	Section       Section
	PublishedMass float64 // [kg/m]
	keys          []string
}

// catalogueRows parses the embedded catalogue once; the result is never modified afterwards
// (Sections and LookupSection hand out copies). A broken embedded file is a programmer error.
var catalogueRows = sync.OnceValue(func() []catalogueRow {
	rows, err := parseCatalogue(catalogueCSV)
	if err != nil {
		panic("beam: embedded section catalogue: " + err.Error())
	}
	return rows
})

// ErrUnknownSection is matched (errors.Is) by the error LookupSection returns for a name that is
// not in the catalogue.
var ErrUnknownSection = errors.New("unknown section")

// UnknownSectionError is the error LookupSection returns for a name not in the catalogue.
type UnknownSectionError struct {
	Name        string   // the name as given
	Suggestions []string // close catalogue names, best first (may be empty)
}

func (e *UnknownSectionError) Error() string {
	if strings.TrimSpace(e.Name) == "" {
		return "section name is empty"
	}
	msg := fmt.Sprintf("unknown section %q", e.Name)
	if len(e.Suggestions) > 0 {
		msg += "; close catalogue names: " + strings.Join(e.Suggestions, ", ")
	}
	return msg
}

// Is reports ErrUnknownSection as a match.
func (e *UnknownSectionError) Is(target error) bool { return target == ErrUnknownSection }

// LookupSection finds a catalogue section by name; spacing and case insensitive ("IPE500",
// "ipe 500", "HE 300 B", "HE300B", "UB 610x229x125", "610x229x125 UB" all work). Unknown →
// error naming the input and suggesting close names.
//
// HE sections also answer to the series-first spelling ("HEB 300"), and UB/UC sections to the
// bare designation ("610x229x125"); "×" and "*" are read as "x". The error is an
// *UnknownSectionError (errors.Is(err, ErrUnknownSection) holds).
func LookupSection(name string) (Section, error) {
	key := normaliseName(name)
	rows := catalogueRows()
	if key != "" {
		for _, row := range rows {
			if slices.Contains(row.keys, key) {
				return row.Section, nil
			}
		}
	}
	return Section{}, &UnknownSectionError{Name: name, Suggestions: suggestNames(key, rows, 3)}
}

// Sections returns the catalogue rows whose name contains filter (case/space-insensitive), in
// catalogue order; "" returns all.
//
// A row matches when any spelling it answers to (see LookupSection) contains the filter, so
// "HEB" lists the HE B series and "610x229" the UB 610x229 family.
func Sections(filter string) []Section {
	f := normaliseName(filter)
	var out []Section
	for _, row := range catalogueRows() {
		if f == "" || slices.ContainsFunc(row.keys, func(k string) bool { return strings.Contains(k, f) }) {
			out = append(out, row.Section)
		}
	}
	return out
}

// normaliseName folds a section name for matching: upper case, "×" and "*" read as "x", and
// spaces, hyphens, underscores and dots removed.
func normaliseName(s string) string {
	var b strings.Builder
	for _, r := range s {
		switch {
		case r == '×' || r == '*':
			b.WriteRune('X')
		case unicode.IsSpace(r) || r == '-' || r == '_' || r == '.':
		default:
			b.WriteRune(unicode.ToUpper(r))
		}
	}
	return b.String()
}

// sectionKeys lists the normalised spellings a catalogue section answers to.
func sectionKeys(s Section) []string {
	canonical := normaliseName(s.Name)
	keys := []string{canonical}
	switch s.Series {
	case "HEA", "HEB", "HEM":
		// "HE 300 B" → also "HEB300"
		size := strings.TrimSuffix(strings.TrimPrefix(canonical, "HE"), s.Series[2:])
		keys = append(keys, s.Series+size)
	case "UB", "UC":
		// "UB 610x229x125" → also "610X229X125UB" and "610X229X125"
		designation := strings.TrimPrefix(canonical, s.Series)
		keys = append(keys, designation+s.Series, designation)
	}
	return keys
}

// parseCatalogue reads the catalogue CSV (comment lines start with '#') and computes each
// section's properties.
func parseCatalogue(data string) ([]catalogueRow, error) {
	r := csv.NewReader(strings.NewReader(data))
	r.Comment = '#'
	want := []string{"name", "series", "h", "b", "tw", "tf", "r", "A_cm2", "Iy_cm4", "mass_kg_m", "source"}
	header, err := r.Read()
	if err != nil || !slices.Equal(header, want) {
		return nil, fmt.Errorf("header must be %s", strings.Join(want, ","))
	}
	var rows []catalogueRow
	seen := map[string]string{}
	for {
		rec, err := r.Read()
		if errors.Is(err, io.EOF) {
			return rows, nil
		}
		if err != nil {
			return nil, err
		}
		line, _ := r.FieldPos(0)
		row, err := parseCatalogueRecord(rec, want)
		if err != nil {
			return nil, fmt.Errorf("line %d: %w", line, err)
		}
		for _, k := range row.keys {
			if other, dup := seen[k]; dup {
				return nil, fmt.Errorf("line %d: %s: name %q already used by %s", line, rec[0], k, other)
			}
			seen[k] = rec[0]
		}
		rows = append(rows, row)
	}
}

// parseCatalogueRecord converts one CSV record (columns as in the header want) into a row with
// its computed properties.
func parseCatalogueRecord(rec, want []string) (catalogueRow, error) {
	v := make([]float64, 8)
	for j := range v {
		x, err := strconv.ParseFloat(rec[2+j], 64)
		if err != nil || !(x >= 0) || math.IsInf(x, 0) {
			return catalogueRow{}, fmt.Errorf("%s: %s = %q is not a non-negative number", rec[0], want[2+j], rec[2+j])
		}
		v[j] = x
	}
	s := Section{
		Name: rec[0], Series: rec[1], Source: rec[10],
		H: v[0], B: v[1], Tw: v[2], Tf: v[3], R: v[4],
		PublishedA:  v[5] * 1e2, // cm² → mm²
		PublishedIy: v[6] * 1e4, // cm⁴ → mm⁴
	}
	if s.H <= 2*s.Tf || s.Tw <= 0 || s.B < s.Tw+2*s.R {
		return catalogueRow{}, fmt.Errorf("%s: inconsistent dimensions", rec[0])
	}
	iSectionProperties(&s)
	return catalogueRow{Section: s, PublishedMass: v[7], keys: sectionKeys(s)}, nil
}

// suggestNames returns up to n catalogue names close to the normalised key: the sections with
// a spelling at the smallest edit distance (Nearest), the nearest size number first, then in
// catalogue order.
func suggestNames(key string, rows []catalogueRow, n int) []string {
	if key == "" {
		return nil
	}
	var keys []string
	var owner []int
	for i, row := range rows {
		for _, k := range row.keys {
			keys, owner = append(keys, k), append(owner, i)
		}
	}
	type candidate struct {
		row     int
		sizeGap float64 // to the nearest size number among the row's spellings
	}
	size, hasSize := leadingNumber(key)
	var cands []candidate
	for _, j := range Nearest(key, keys) {
		row := owner[j]
		if len(cands) > 0 && cands[len(cands)-1].row == row {
			continue // another spelling of the same section: a row's spellings are listed together
		}
		gap := math.Inf(1)
		for _, k := range rows[row].keys {
			if other, ok := leadingNumber(k); ok && hasSize {
				gap = math.Min(gap, math.Abs(other-size))
			}
		}
		cands = append(cands, candidate{row, gap})
	}
	slices.SortStableFunc(cands, func(a, b candidate) int { return cmp.Compare(a.sizeGap, b.sizeGap) })
	var out []string
	for _, c := range cands[:min(n, len(cands))] {
		out = append(out, rows[c.row].Section.Name)
	}
	return out
}

// leadingNumber returns the first run of digits in s as a number.
func leadingNumber(s string) (float64, bool) {
	start := strings.IndexFunc(s, unicode.IsDigit)
	if start < 0 {
		return 0, false
	}
	end := start
	for end < len(s) && s[end] >= '0' && s[end] <= '9' {
		end++
	}
	v, err := strconv.ParseFloat(s[start:end], 64)
	return v, err == nil
}
