package main

import (
	"encoding/csv"
	"encoding/json"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// readCSV parses a CSV document into its header and rows.
func readCSV(t *testing.T, text string) ([]string, [][]string) {
	t.Helper()
	rows, err := csv.NewReader(strings.NewReader(text)).ReadAll()
	require.NoError(t, err)
	require.NotEmpty(t, rows)
	return rows[0], rows[1:]
}

// TestDesignCSV: design --format csv prints the splice's checks, one row per check with the
// values of the JSON checks (the machine contract), in both modes. Before, design refused
// csv although the README promises it for every command that prints results.
func TestDesignCSV(t *testing.T) {
	job := writeJob(t, simpleJob)
	for _, mode := range [][]string{
		{"design", "--section", "IPE 500", "--uls", "M=400,V=300,N=-150", "--sls", "M=300,V=200"},
		{"design", job, "--at", "1.5 m"},
	} {
		out, stderr, code := run(t, append(mode, "--format", "csv")...)
		require.Equal(t, exitOK, code, stderr)
		header, rows := readCSV(t, out)
		assert.Equal(t, []string{"id", "clause", "state", "demand", "resistance", "unit", "utilisation", "pass"}, header)

		js, stderr, code := run(t, append(mode, "--format", "json")...)
		require.Equal(t, exitOK, code, stderr)
		var doc struct {
			Checks []struct {
				ID, Clause, State, Unit         string
				Demand, Resistance, Utilisation float64
				Pass                            bool
			} `json:"checks"`
		}
		require.NoError(t, json.Unmarshal([]byte(js), &doc))
		require.Len(t, rows, len(doc.Checks), "one row per check")
		for i, c := range doc.Checks {
			r := rows[i]
			assert.Equal(t, []string{c.ID, c.Clause, c.State, c.Unit, strconv.FormatBool(c.Pass)}, []string{r[0], r[1], r[2], r[5], r[7]})
			for j, v := range []float64{c.Demand, c.Resistance, c.Utilisation} {
				got, err := strconv.ParseFloat(r[[]int{3, 4, 6}[j]], 64)
				require.NoError(t, err)
				assert.Equal(t, v, got, "%s column %d", c.ID, j)
			}
		}
	}
}

// TestCheckCSV: check --format csv prints what check understood as key, value, unit and
// default rows, under the job file's key paths. simpleJob gives a 6 m span of IPE 300 in
// S275 and leaves out the overhangs, limits, costs and scan; the default scan step is 0.05 m
// (DESIGN.md section 6), EN 1993-1-1 Table 3.1 gives fy = 275 N/mm² for S275 up to 40 mm.
// Before, check refused csv.
func TestCheckCSV(t *testing.T) {
	out, stderr, code := run(t, "check", writeJob(t, simpleJob), "--format", "csv")
	require.Equal(t, exitOK, code, stderr)
	header, rows := readCSV(t, out)
	assert.Equal(t, []string{"key", "value", "unit", "default"}, header)
	got := map[string][]string{}
	for _, r := range rows {
		require.Len(t, r, 4)
		_, dup := got[r[0]]
		assert.False(t, dup, "one row per key: %s", r[0])
		got[r[0]] = r[1:]
	}
	for key, want := range map[string][]string{
		"beam.section":             {"IPE 300", "", "false"},
		"beam.grade":               {"S275", "", "false"},
		"grade.fy_flange":          {"275", "N/mm2", "false"},
		"beam.spans[0]":            {"6", "m", "false"},
		"beam.overhang.left":       {"0", "m", "true"},
		"beam.self_weight":         {"0", "kN/m", "false"},
		"beam.supports[1]":         {"roller", "", "false"},
		"beam.supports[1].x":       {"6", "m", "false"},
		"cases.G.kind":             {"permanent", "", "false"},
		"cases.G.total_down":       {"60", "kN", "false"}, // 10 kN/m × 6 m
		"limits.max_piece_length":  {"", "m", "true"},
		"scan.step":                {"0.05", "m", "true"},
		"costs.indicative":         {"true", "", "true"},
		"combinations.uls":         {"6.10", "", "true"},
		"splice.bolts.sizes[0]":    {got["splice.bolts.sizes[0]"][0], "", "true"},
		"limits.deflection.span":   {got["limits.deflection.span"][0], "", "true"},
		"combinations.count.extra": {"0", "", "false"},
	} {
		assert.Equal(t, want, got[key], key)
	}
}

// TestEveryResultCommandTakesCSV: the README's "Every command that prints results takes
// --format text|json|csv" holds for every such command, end to end.
func TestEveryResultCommandTakesCSV(t *testing.T) {
	job := writeJob(t, simpleJob)
	for _, args := range [][]string{
		{"analyse", job}, {"check", job}, {"design", job, "--at", "1"}, {"optimise", job},
		{"sections", "IPE 300"}, {"demo", "--no-report"},
	} {
		out, stderr, code := run(t, append(args, "--format", "csv")...)
		assert.Equal(t, exitOK, code, "%q: %s", args, stderr)
		rows, err := csv.NewReader(strings.NewReader(out)).ReadAll()
		assert.NoError(t, err, "%q", args)
		assert.Greater(t, len(rows), 1, "%q: a header and rows", args)
	}
}
