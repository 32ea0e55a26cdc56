package main

import (
	"bytes"
	"encoding/csv"
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/spf13/cobra"
	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

const smallJob = "../../optimise/testdata/small-space.yaml"

func runOpt(t *testing.T, opts optimiseOptions) (string, string, error) {
	t.Helper()
	var out, errw bytes.Buffer
	err := runOptimise(opts, streams{Out: &out, Err: &errw})
	return out.String(), errw.String(), err
}

// execOptimise runs the command line through cobra: argv → options → output.
func execOptimise(t *testing.T, args ...string) (string, error) {
	t.Helper()
	cmd := newOptimiseCommand(runOptimise, streams{})
	var out, errw bytes.Buffer
	cmd.SetArgs(args)
	cmd.SetOut(&out)
	cmd.SetErr(&errw)
	cmd.SilenceErrors, cmd.SilenceUsage = true, true
	cmd.SetFlagErrorFunc(func(_ *cobra.Command, err error) error { return usageError(err) })
	err := cmd.Execute()
	return out.String(), err
}

func TestOptimiseDemoText(t *testing.T) {
	out, stderr, err := runOpt(t, optimiseOptions{Demo: true, Format: "text", Rank: "cost"})
	require.NoError(t, err)
	assert.Empty(t, stderr)
	rec := strings.Index(out, "RECOMMENDATION:")
	table := strings.Index(out, "Best layout for each number of splices")
	summary := strings.Index(out, "Admissible stretches")
	cautionAt := strings.Index(out, "CAUTION")
	require.True(t, rec > 0 && table > rec && summary > table && cautionAt > summary,
		"recommendation, then the layouts, then the candidate summary, then the caution:\n%s", out)
	for _, want := range []string{"demo.yaml (embedded, invented data)", "IPE 450", "semi-trailer", "governing check",
		"<- recommended", "Near-best alternatives", "Best positions by cost", "keep-out zones"} {
		assert.Contains(t, out, want)
	}
}

// TestOptimiseJSONContract: the keys of DESIGN.md section 7 for one job.
func TestOptimiseJSONContract(t *testing.T) {
	out, _, err := runOpt(t, optimiseOptions{Paths: []string{smallJob}, Format: "json"})
	require.NoError(t, err)
	var doc map[string]any
	require.NoError(t, json.Unmarshal([]byte(out), &doc))
	cands := doc["candidates"].([]any)
	require.NotEmpty(t, cands)
	var feasible, kept map[string]any
	for _, c := range cands {
		m := c.(map[string]any)
		for _, k := range []string{"x", "feasible", "reason", "cost", "bolts", "plate_mass_kg", "utilisation", "governing"} {
			require.Contains(t, m, k)
		}
		if m["feasible"].(bool) && feasible == nil {
			feasible = m
		}
		if m["keep_out"] != nil && kept == nil {
			kept = m
		}
	}
	require.NotNil(t, feasible)
	assert.Nil(t, feasible["reason"])
	assert.Greater(t, feasible["cost"].(float64), 0.0)
	require.NotNil(t, kept)
	assert.Contains(t, kept["reason"], "keep-out")
	assert.Nil(t, kept["cost"])
	layouts := doc["layouts"].([]any)
	require.NotEmpty(t, layouts)
	recommended := 0
	for _, l := range layouts {
		m := l.(map[string]any)
		require.Contains(t, m, "splices")
		pieces := m["pieces"].([]any)
		require.Len(t, pieces, len(m["splices"].([]any))+1)
		for _, p := range pieces {
			for _, k := range []string{"from", "to", "length", "mass_kg"} {
				require.Contains(t, p.(map[string]any), k)
			}
		}
		cost := m["cost"].(map[string]any)
		total := cost["splices"].(float64) + cost["transport"].(float64) + cost["erection"].(float64)
		assert.InDelta(t, total, cost["total"].(float64), 1e-5)
		if m["recommended"].(bool) {
			recommended++
		}
	}
	assert.Equal(t, 1, recommended)
	assert.Equal(t, "m", doc["units"].(map[string]any)["x"])
}

// TestOptimiseExhaustivePrintsIdenticalResults in every format.
func TestOptimiseExhaustivePrintsIdenticalResults(t *testing.T) {
	for _, format := range []string{"text", "json", "csv"} {
		fast, _, err := runOpt(t, optimiseOptions{Paths: []string{smallJob}, Format: format, Rank: "bolts"})
		require.NoError(t, err)
		slow, _, err := runOpt(t, optimiseOptions{Paths: []string{smallJob}, Format: format, Rank: "bolts", Exhaustive: true})
		require.NoError(t, err)
		assert.Equal(t, fast, slow, format)
	}
}

func TestOptimiseCSV(t *testing.T) {
	out, _, err := runOpt(t, optimiseOptions{Paths: []string{smallJob}, Format: "csv", Step: 500})
	require.NoError(t, err)
	rows, err := csv.NewReader(strings.NewReader(out)).ReadAll()
	require.NoError(t, err)
	assert.Equal(t, "x_m", rows[0][0])
	assert.Len(t, rows, 1+42, "21.2 m every 0.5 m: 42 positions inside the beam")
	assert.Equal(t, "0.5", rows[1][0])
}

func TestOptimiseInfeasibleExitsWith3(t *testing.T) {
	src, err := os.ReadFile(smallJob)
	require.NoError(t, err)
	path := filepath.Join(t.TempDir(), "heavy.yaml")
	require.NoError(t, os.WriteFile(path, bytes.Replace(src, []byte("max_piece_mass: 1200"), []byte("max_piece_mass: 150"), 1), 0o644))
	out, _, err := runOpt(t, optimiseOptions{Paths: []string{path}, Format: "text"})
	require.Error(t, err)
	assert.Equal(t, exitInfeasible, exitCode(err))
	assert.Contains(t, err.Error(), "limits.max_piece_mass")
	assert.Contains(t, err.Error(), "heavy.yaml:32:")
	// the result is still printed, with the limit and the figure that breaks it
	assert.Contains(t, out, "WHY NO LAYOUT FITS\n- limits.max_piece_mass: no layout keeps every piece within max_piece_mass 150 kg")
	assert.NotContains(t, out, "RECOMMENDATION")
}

func TestOptimiseUsageErrors(t *testing.T) {
	tests := []struct {
		name string
		opts optimiseOptions
		text string
	}{
		{"format", optimiseOptions{Demo: true, Format: "xml"}, "--format"},
		{"rank", optimiseOptions{Demo: true, Format: "text", Rank: "price"}, "--rank"},
		{"step", optimiseOptions{Demo: true, Format: "text", Step: -1000}, "--step"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, _, err := runOpt(t, tc.opts)
			require.Error(t, err)
			assert.Equal(t, exitUsage, exitCode(err))
			assert.Contains(t, err.Error(), tc.text)
		})
	}
}

// TestOptimiseCommandLine: argv through cobra to the output.
func TestOptimiseCommandLine(t *testing.T) {
	out, err := execOptimise(t, smallJob, "--format", "json", "--step", "0.5", "--rank", "utilisation")
	require.NoError(t, err)
	var doc struct {
		Step       float64 `json:"step"`
		Rank       string  `json:"rank"`
		Candidates []any   `json:"candidates"`
	}
	require.NoError(t, json.Unmarshal([]byte(out), &doc))
	assert.Equal(t, 0.5, doc.Step)
	assert.Equal(t, "utilisation", doc.Rank)
	assert.Len(t, doc.Candidates, 42)
	_, err = execOptimise(t)
	assert.Equal(t, exitUsage, exitCode(err), "a job file is required")
	_, err = execOptimise(t, smallJob, "--rank", "price")
	assert.Equal(t, exitUsage, exitCode(err))
}

func batchFolder(t *testing.T) string {
	t.Helper()
	src, err := os.ReadFile(smallJob)
	require.NoError(t, err)
	dir := t.TempDir()
	require.NoError(t, os.WriteFile(filepath.Join(dir, "a.yaml"), src, 0o644))
	require.NoError(t, os.WriteFile(filepath.Join(dir, "b.yml"), bytes.Replace(src, []byte("spans: [9.0, 11.0]"), []byte("spans: [8.0, 10.0]"), 1), 0o644))
	require.NoError(t, os.WriteFile(filepath.Join(dir, "c.yaml"), bytes.Replace(src, []byte("max_piece_mass: 1200"), []byte("max_piece_mass: 150"), 1), 0o644))
	require.NoError(t, os.WriteFile(filepath.Join(dir, "notes.txt"), []byte("not a job"), 0o644))
	return dir
}

func TestOptimiseBatchFolder(t *testing.T) {
	dir := batchFolder(t)
	out, stderr, err := runOpt(t, optimiseOptions{Paths: []string{dir}, Format: "json"})
	assert.Equal(t, exitInfeasible, exitCode(err), "one job has no layout: %v", err)
	assert.Empty(t, stderr, "no progress bar when stderr is not a terminal")
	var doc struct {
		Jobs []struct {
			File  string          `json:"file"`
			Title string          `json:"title"`
			Best  json.RawMessage `json:"best"`
			Error *string         `json:"error"`
		} `json:"jobs"`
	}
	require.NoError(t, json.Unmarshal([]byte(out), &doc))
	require.Len(t, doc.Jobs, 3, "the .txt file is not a job")
	assert.Equal(t, filepath.Join(dir, "a.yaml"), doc.Jobs[0].File)
	assert.Nil(t, doc.Jobs[0].Error)
	assert.Contains(t, string(doc.Jobs[0].Best), `"splices"`)
	assert.Nil(t, doc.Jobs[1].Error)
	require.NotNil(t, doc.Jobs[2].Error)
	assert.Contains(t, *doc.Jobs[2].Error, "limits.max_piece_mass")
	assert.Equal(t, "null", string(doc.Jobs[2].Best))

	// a single job of the batch prints the same best layout as on its own
	single, _, err := runOpt(t, optimiseOptions{Paths: []string{filepath.Join(dir, "a.yaml")}, Format: "json"})
	require.NoError(t, err)
	var one struct {
		Layouts []json.RawMessage `json:"layouts"`
	}
	require.NoError(t, json.Unmarshal([]byte(single), &one))
	found := false
	for _, l := range one.Layouts {
		found = found || bytes.Equal(compact(t, l), compact(t, doc.Jobs[0].Best))
	}
	assert.True(t, found)

	text, _, _ := runOpt(t, optimiseOptions{Paths: []string{dir}, Format: "text"})
	assert.Contains(t, text, "best layout of each job")
	assert.Contains(t, text, "no layout within the limits (below)")
	csvOut, _, _ := runOpt(t, optimiseOptions{Paths: []string{dir}, Format: "csv"})
	rows, err := csv.NewReader(strings.NewReader(csvOut)).ReadAll()
	require.NoError(t, err)
	assert.Len(t, rows, 4)
}

func compact(t *testing.T, raw []byte) []byte {
	var b bytes.Buffer
	require.NoError(t, json.Compact(&b, raw))
	return b.Bytes()
}

func TestOptimiseBatchBadFileExitsWith1(t *testing.T) {
	dir := t.TempDir()
	require.NoError(t, os.WriteFile(filepath.Join(dir, "bad.yaml"), []byte("title: x\nbeam: {section: IPE 999}\n"), 0o644))
	src, err := os.ReadFile(smallJob)
	require.NoError(t, err)
	require.NoError(t, os.WriteFile(filepath.Join(dir, "good.yaml"), src, 0o644))
	var outb, errb bytes.Buffer
	err = runOptimise(optimiseOptions{Paths: []string{filepath.Join(dir, "bad.yaml"), filepath.Join(dir, "good.yaml")},
		Format: "text"}, streams{Out: &outb, Err: &errb, ErrTerminal: true})
	out, stderr := outb.String(), errb.String()
	assert.Equal(t, exitFailure, exitCode(err))
	assert.Contains(t, out, "bad.yaml")
	assert.Contains(t, out, "good.yaml")
	assert.Contains(t, stderr, "optimising", "the bar when stderr is a terminal")
}

func TestOptimiseOutFolder(t *testing.T) {
	dir := filepath.Join(t.TempDir(), "results")
	_, _, err := runOpt(t, optimiseOptions{Paths: []string{smallJob}, Format: "text", Out: dir})
	require.NoError(t, err)
	for _, f := range []string{"small-space.optimise.txt", "small-space.optimise.json", "small-space.candidates.csv", "small-space.layouts.csv"} {
		info, err := os.Stat(filepath.Join(dir, f))
		require.NoError(t, err, f)
		assert.Positive(t, info.Size())
	}
	before, err := os.ReadFile(filepath.Join(dir, "small-space.layouts.csv"))
	require.NoError(t, err)
	_, _, err = runOpt(t, optimiseOptions{Paths: []string{smallJob}, Format: "text", Out: dir, Step: 500})
	require.ErrorContains(t, err, "--force")
	after, err := os.ReadFile(filepath.Join(dir, "small-space.layouts.csv"))
	require.NoError(t, err)
	assert.Equal(t, before, after, "left unchanged without --force")
	_, _, err = runOpt(t, optimiseOptions{Paths: []string{smallJob}, Format: "text", Out: dir, Step: 500, Force: true})
	require.NoError(t, err)
	entries, err := os.ReadDir(dir)
	require.NoError(t, err)
	assert.Len(t, entries, 4, "no temporary files left behind")
}
