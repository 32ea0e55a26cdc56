package encode

import (
	"bytes"
	"encoding/csv"
	"fmt"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/optimise"
	"spanbreak/optimise/forcetable"
)

func TestPrintableEscapesControlCharacters(t *testing.T) {
	for _, tc := range []struct{ in, want string }{
		{"plain text, ünïcode and 🙂 stay", "plain text, ünïcode and 🙂 stay"},
		{"\x1b[31mred\x1b[0m", `\x1b[31mred\x1b[0m`},
		{"a\x00b\tc\rd\ne\x7f", `a\x00b\x09c\x0dd\x0ae\x7f`},
		{"csi \u009b2J, nel \u0085", `csi \u009b2J, nel \u0085`},
		{"abc\u202edef", `abc\u202edef`},
		{"caf\xe9", `caf\xe9`},
	} {
		assert.Equal(t, tc.want, Printable(tc.in), "%q", tc.in)
	}
	var b bytes.Buffer
	_, err := fmt.Fprintf(TextWriter(&b), "line 1 \x1b]0;title\a\nline 2\n")
	require.NoError(t, err)
	assert.Equal(t, "line 1 \\x1b]0;title\\x07\nline 2\n", b.String(), "line feeds kept, the rest escaped")
}

// Text cells that a spreadsheet would run as a formula get a leading apostrophe (OWASP,
// "CSV Injection": =, +, -, @, tab and carriage return); number cells, negative ones
// included, are written as they are.
func TestCSVCellsNeutraliseFormulas(t *testing.T) {
	for _, tc := range []struct{ in, want string }{
		{`=HYPERLINK("http://example.invalid","x")`, `'=HYPERLINK("http://example.invalid","x")`},
		{"+1+2", "'+1+2"},
		{"-2+3", "'-2+3"},
		{"@SUM(A1)", "'@SUM(A1)"},
		{"'quoted", "''quoted"},
		{"\tTAB", `\x09TAB`}, // escaped, so no longer leading with a tab
		{"lorry", "lorry"},
		{"", ""},
	} {
		assert.Equal(t, tc.want, Text(tc.in).String(), "%q", tc.in)
	}
	assert.Equal(t, "-12.5", Decimal(-12.5).String())
	assert.Equal(t, "-3", Integer(-3).String())
	assert.Equal(t, "-1;2.5", Decimals([]float64{-1, 2.5}).String())
}

// A vehicle, a title and a combination named as formulas reach layouts.csv, the batch CSV and
// the envelope CSV neutralised, while every number stays a number.
func TestCSVOutputsNeutraliseNames(t *testing.T) {
	src := `title: "@title"
beam: {section: IPE 300, spans: [6.0, 6.0], supports: [pinned, roller, roller]}
cases: {G: {kind: permanent, loads: [{udl: 10}]}}
combinations: {extra: [{name: "=cmd|' /C calc'!A0", state: uls, factors: {G: 2.0}}]}
limits: {max_piece_length: 7}
vehicles: [{name: "=HYPERLINK(""http://example.invalid"")", max_length: 13.6, payload: 20000, cost: 800}]
scan: {step: 0.25}
`
	src = strings.Replace(src, `""http://example.invalid""`, `\"http://example.invalid\"`, 1)
	s, err := optimise.Prepare("job.yaml", []byte(src))
	require.NoError(t, err)
	o, err := optimise.Run(s, optimise.Settings{})
	require.NoError(t, err)

	var lay bytes.Buffer
	require.NoError(t, WriteLayoutsCSV(&lay, o))
	rows := readCSV(t, lay.Bytes())
	vehicle := column(t, rows, "vehicle")
	assert.Equal(t, `'=HYPERLINK("http://example.invalid")`, rows[1][vehicle])

	var batch bytes.Buffer
	require.NoError(t, WriteBatchCSV(&batch, []optimise.BatchOutcome{{File: "-job.yaml", Title: s.Title, Outcome: o}}))
	rows = readCSV(t, batch.Bytes())
	assert.Equal(t, "'-job.yaml", rows[1][column(t, rows, "file")])
	assert.Equal(t, "'@title", rows[1][column(t, rows, "title")])

	an, err := optimise.AnalyseBeam(s, optimise.BeamSettings{Step: 1000})
	require.NoError(t, err)
	var env bytes.Buffer
	require.NoError(t, WriteAnalysis(&env, "csv", an))
	rows = readCSV(t, env.Bytes())
	mMin := column(t, rows, "uls_M_min_kNm")
	gov := column(t, rows, "uls_M_max_governing")
	negative, named := false, 0
	for _, r := range rows[1:] {
		v, err := strconv.ParseFloat(r[mMin], 64)
		require.NoError(t, err, "a number cell stays a number: %q", r[mMin])
		negative = negative || v < 0
		assert.NotEqual(t, "=cmd|' /C calc'!A0", r[gov], "a formula reaches the spreadsheet")
		if r[gov] == "'=cmd|' /C calc'!A0" {
			named++
		}
	}
	assert.True(t, negative, "the hogging moments are negative numbers, not neutralised text")
	assert.Positive(t, named, "the extra combination governs the sagging moment (factor 2.0 on G)")

	// optimise/forcetable writes the governing names by the same rule
	var ft bytes.Buffer
	require.NoError(t, forcetable.WriteEnvelopes(&ft, an.Envelopes))
	frows := readCSV(t, ft.Bytes())
	fgov := column(t, frows, "uls_M_max_governing")
	for i := 1; i < len(frows); i++ {
		assert.Equal(t, Text(an.Envelopes.Governing(an.Envelopes.ULS.MMax[i-1])).String(), frows[i][fgov])
	}
}

func readCSV(t *testing.T, data []byte) [][]string {
	t.Helper()
	rows, err := csv.NewReader(bytes.NewReader(data)).ReadAll()
	require.NoError(t, err)
	require.Greater(t, len(rows), 1)
	return rows
}

func column(t *testing.T, rows [][]string, name string) int {
	t.Helper()
	for i, h := range rows[0] {
		if h == name {
			return i
		}
	}
	require.Failf(t, "no column", "%s in %v", name, rows[0])
	return -1
}
