package main

import (
	"bytes"
	"encoding/csv"
	"encoding/json"
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"
	"unicode/utf8"

	"github.com/spf13/cobra"

	"spanbreak/beam"
)

// sectionsOptions holds the parsed flags and argument of `spanbreak sections`.
type sectionsOptions struct {
	Filter string // part of a section name, case and space insensitive; "" lists all
	Format string // text | json | csv
}

func newSectionsCommand(run func(sectionsOptions, streams) error, ios streams) *cobra.Command {
	opts := sectionsOptions{Format: "text"}
	cmd := &cobra.Command{
		Use:   "sections [FILTER]",
		Short: "List the rolled-section catalogue, or show one section's properties",
		Long: `List the catalogue of rolled I and H sections (IPE, HE A/B/M, UB, UC) with
properties computed from the dimensions, root fillets included. FILTER keeps the sections
whose name contains it, ignoring case and spaces ("HEB", "ipe 3", "610x229"); a filter that
names or matches exactly one section also prints all its properties with the published
check values.`,
		Example: `  spanbreak sections
  spanbreak sections "IPE 500"
  spanbreak sections UB --format csv`,
		Args: cobra.MaximumNArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			if len(args) == 1 {
				opts.Filter = args[0]
			}
			return run(opts, ios.of(cmd))
		},
	}
	cmd.Flags().StringVar(&opts.Format, "format", opts.Format, "output format: text, json or csv")
	return cmd
}

// runSections writes the catalogue rows matching opts.Filter to w in opts.Format. Nothing is
// written when it fails.
func runSections(opts sectionsOptions, ios streams) error {
	w := ios.Out
	var render func([]beam.Section) ([]byte, error)
	switch opts.Format {
	case "text", "":
		render = sectionsText
	case "json":
		render = sectionsJSON
	case "csv":
		render = sectionsCSV
	default:
		return usageError(fmt.Errorf("--format %q: unknown format (want text, json or csv)", opts.Format))
	}
	found, err := matchSections(opts.Filter)
	if err != nil {
		return err
	}
	out, err := render(found)
	if err != nil {
		return err
	}
	_, err = w.Write(out)
	return err
}

// matchSections returns the section the filter names exactly (so "HEA 100" does not also list
// HE 1000 A), else every section whose name contains the filter.
func matchSections(filter string) ([]beam.Section, error) {
	if strings.TrimSpace(filter) != "" {
		if s, err := beam.LookupSection(filter); err == nil {
			return []beam.Section{s}, nil
		}
	}
	found := beam.Sections(filter)
	if len(found) > 0 {
		return found, nil
	}
	msg := fmt.Sprintf("no section matches %q", filter)
	var unknown *beam.UnknownSectionError
	if _, err := beam.LookupSection(filter); errors.As(err, &unknown) && len(unknown.Suggestions) > 0 {
		msg += " (close names: " + strings.Join(unknown.Suggestions, ", ") + ")"
	}
	return nil, errors.New(msg)
}

// sectionColumn is one column of the listing: a text header with its unit, a machine key with
// the unit in its name, and the value in that unit.
type sectionColumn struct {
	header string
	key    string
	value  func(beam.Section) float64
	text   func(float64) string
}

func sectionColumns() []sectionColumn {
	dim := func(v float64) string { return strconv.FormatFloat(v, 'f', 1, 64) }
	return []sectionColumn{
		{"h [mm]", "h_mm", func(s beam.Section) float64 { return s.H }, dim},
		{"b [mm]", "b_mm", func(s beam.Section) float64 { return s.B }, dim},
		{"tw [mm]", "tw_mm", func(s beam.Section) float64 { return s.Tw }, dim},
		{"tf [mm]", "tf_mm", func(s beam.Section) float64 { return s.Tf }, dim},
		{"r [mm]", "r_mm", func(s beam.Section) float64 { return s.R }, dim},
		{"A [cm²]", "A_cm2", func(s beam.Section) float64 { return s.A / 1e2 }, fourFigures},
		{"Iy [cm⁴]", "Iy_cm4", func(s beam.Section) float64 { return s.Iy / 1e4 }, fourFigures},
		{"Iz [cm⁴]", "Iz_cm4", func(s beam.Section) float64 { return s.Iz / 1e4 }, fourFigures},
		{"Wel,y [cm³]", "Wel_y_cm3", func(s beam.Section) float64 { return s.WelY / 1e3 }, fourFigures},
		{"Wpl,y [cm³]", "Wpl_y_cm3", func(s beam.Section) float64 { return s.WplY / 1e3 }, fourFigures},
		{"Avz [cm²]", "Avz_cm2", func(s beam.Section) float64 { return s.Avz / 1e2 }, fourFigures},
		{"mass [kg/m]", "mass_kg_m", func(s beam.Section) float64 { return s.Mass }, fourFigures},
	}
}

// fourFigures prints v with four significant figures, never in exponent form (1246000, 8356,
// 80.14, 3.580).
func fourFigures(v float64) string {
	if v == 0 || math.IsNaN(v) || math.IsInf(v, 0) {
		return strconv.FormatFloat(v, 'f', 0, 64)
	}
	decimals := max(0, 3-int(math.Floor(math.Log10(math.Abs(v)))))
	return strconv.FormatFloat(v, 'f', decimals, 64)
}

// sectionsText renders an aligned table, and for a single section its full properties.
func sectionsText(found []beam.Section) ([]byte, error) {
	cols := sectionColumns()
	table := [][]string{append([]string{"section", "series"}, headers(cols)...)}
	for _, s := range found {
		row := []string{s.Name, s.Series}
		for _, c := range cols {
			row = append(row, c.text(c.value(s)))
		}
		table = append(table, row)
	}
	right := make([]bool, len(table[0]))
	for i := 2; i < len(right); i++ {
		right[i] = true
	}
	var b bytes.Buffer
	writeAligned(&b, table, right)
	fmt.Fprintf(&b, "\n%d section(s). Properties computed from h, b, tw, tf, r with the root fillets; "+
		"Avz per EN 1993-1-1 6.2.6(3), η = %.1f; mass at %.0f kg/m³.\n",
		len(found), beam.ShearAreaEta, beam.SteelDensity)
	if len(found) == 1 {
		b.WriteString("\n")
		writeSectionDetail(&b, found[0])
	}
	return b.Bytes(), nil
}

func headers(cols []sectionColumn) []string {
	out := make([]string, len(cols))
	for i, c := range cols {
		out[i] = c.header
	}
	return out
}

// writeAligned writes rows as columns separated by two spaces, right-aligning the columns
// marked in right (numbers) and left-aligning the others.
func writeAligned(b *bytes.Buffer, rows [][]string, right []bool) {
	widths := make([]int, len(rows[0]))
	for _, row := range rows {
		for i, cell := range row {
			widths[i] = max(widths[i], utf8.RuneCountInString(cell))
		}
	}
	for _, row := range rows {
		var line strings.Builder
		for i, cell := range row {
			pad := strings.Repeat(" ", widths[i]-utf8.RuneCountInString(cell))
			if i > 0 {
				line.WriteString("  ")
			}
			if right[i] {
				line.WriteString(pad + cell)
			} else {
				line.WriteString(cell + pad)
			}
		}
		b.WriteString(strings.TrimRight(line.String(), " ") + "\n")
	}
}

// writeSectionDetail lists every property of one section with its unit, the published check
// values and their deviation.
func writeSectionDetail(b *bytes.Buffer, s beam.Section) {
	fmt.Fprintf(b, "%s (%s)\n", s.Name, s.Source)
	// computed and published in the unit shown
	deviation := func(computed, published float64) string {
		if published == 0 {
			return ""
		}
		return fmt.Sprintf("published %s, %+.2f %%", fourFigures(published), 100*(computed/published-1))
	}
	rows := [][]string{
		{"h", strconv.FormatFloat(s.H, 'f', 1, 64), "mm", "overall depth"},
		{"b", strconv.FormatFloat(s.B, 'f', 1, 64), "mm", "flange width"},
		{"tw", strconv.FormatFloat(s.Tw, 'f', 1, 64), "mm", "web thickness"},
		{"tf", strconv.FormatFloat(s.Tf, 'f', 1, 64), "mm", "flange thickness"},
		{"r", strconv.FormatFloat(s.R, 'f', 1, 64), "mm", "root radius"},
		{"hw", strconv.FormatFloat(s.WebDepth(), 'f', 1, 64), "mm", "web depth h − 2tf"},
		{"d", strconv.FormatFloat(s.DepthBetweenFillets(), 'f', 1, 64), "mm", "depth between fillets h − 2tf − 2r"},
		{"A", fourFigures(s.A / 1e2), "cm²", deviation(s.A/1e2, s.PublishedA/1e2)},
		{"Iy", fourFigures(s.Iy / 1e4), "cm⁴", deviation(s.Iy/1e4, s.PublishedIy/1e4)},
		{"Iz", fourFigures(s.Iz / 1e4), "cm⁴", ""},
		{"Wel,y", fourFigures(s.WelY / 1e3), "cm³", "2 Iy / h"},
		{"Wpl,y", fourFigures(s.WplY / 1e3), "cm³", ""},
		{"Avz", fourFigures(s.Avz / 1e2), "cm²", avzClause(s)},
		{"mass", fourFigures(s.Mass), "kg/m", fmt.Sprintf("A × %.0f kg/m³", beam.SteelDensity)},
	}
	for i := range rows {
		rows[i][0] = "  " + rows[i][0]
	}
	writeAligned(b, rows, []bool{false, true, false, false})
}

func avzClause(s beam.Section) string {
	if s.Welded() {
		return fmt.Sprintf("EN 1993-1-1 6.2.6(3)(d), η = %.1f", beam.ShearAreaEta)
	}
	return fmt.Sprintf("EN 1993-1-1 6.2.6(3)(a), ≥ η hw tw, η = %.1f", beam.ShearAreaEta)
}

// sectionRecord is the JSON form of one section; keys carry their unit and stay stable.
type sectionRecord struct {
	Name        string  `json:"name"`
	Series      string  `json:"series"`
	H           float64 `json:"h_mm"`
	B           float64 `json:"b_mm"`
	Tw          float64 `json:"tw_mm"`
	Tf          float64 `json:"tf_mm"`
	R           float64 `json:"r_mm"`
	A           float64 `json:"A_cm2"`
	Iy          float64 `json:"Iy_cm4"`
	Iz          float64 `json:"Iz_cm4"`
	WelY        float64 `json:"Wel_y_cm3"`
	WplY        float64 `json:"Wpl_y_cm3"`
	Avz         float64 `json:"Avz_cm2"`
	Mass        float64 `json:"mass_kg_m"`
	PublishedA  float64 `json:"A_published_cm2"`
	PublishedIy float64 `json:"Iy_published_cm4"`
	Source      string  `json:"source"`
}

// sixFigures rounds v to six significant figures, so machine output does not depend on the
// last bits of floating-point arithmetic.
func sixFigures(v float64) float64 {
	if v == 0 || math.IsNaN(v) || math.IsInf(v, 0) {
		return v
	}
	x, _ := strconv.ParseFloat(strconv.FormatFloat(v, 'g', 6, 64), 64)
	return x
}

func toRecord(s beam.Section) sectionRecord {
	return sectionRecord{
		Name: s.Name, Series: s.Series,
		H: s.H, B: s.B, Tw: s.Tw, Tf: s.Tf, R: s.R,
		A:           sixFigures(s.A / 1e2),
		Iy:          sixFigures(s.Iy / 1e4),
		Iz:          sixFigures(s.Iz / 1e4),
		WelY:        sixFigures(s.WelY / 1e3),
		WplY:        sixFigures(s.WplY / 1e3),
		Avz:         sixFigures(s.Avz / 1e2),
		Mass:        sixFigures(s.Mass),
		PublishedA:  sixFigures(s.PublishedA / 1e2),
		PublishedIy: sixFigures(s.PublishedIy / 1e4),
		Source:      s.Source,
	}
}

func sectionsJSON(found []beam.Section) ([]byte, error) {
	records := make([]sectionRecord, len(found))
	for i, s := range found {
		records[i] = toRecord(s)
	}
	out, err := json.MarshalIndent(records, "", "  ")
	if err != nil {
		return nil, err
	}
	return append(out, '\n'), nil
}

func sectionsCSV(found []beam.Section) ([]byte, error) {
	var b bytes.Buffer
	w := csv.NewWriter(&b)
	cols := sectionColumns()
	header := []string{"name", "series"}
	for _, c := range cols {
		header = append(header, c.key)
	}
	header = append(header, "A_published_cm2", "Iy_published_cm4", "source")
	if err := w.Write(header); err != nil {
		return nil, err
	}
	num := func(v float64) string { return strconv.FormatFloat(sixFigures(v), 'f', -1, 64) }
	for _, s := range found {
		rec := []string{s.Name, s.Series}
		for _, c := range cols {
			rec = append(rec, num(c.value(s)))
		}
		rec = append(rec, num(s.PublishedA/1e2), num(s.PublishedIy/1e4), s.Source)
		if err := w.Write(rec); err != nil {
			return nil, err
		}
	}
	w.Flush()
	return b.Bytes(), w.Error()
}
