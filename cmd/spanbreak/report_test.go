package main

import (
	"bytes"
	"encoding/csv"
	"encoding/json"
	"fmt"
	"os"
	"path/filepath"
	"slices"
	"strconv"
	"testing"
	"time"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/optimise"
	"spanbreak/plots/encode"
)

// demoSplices is the number of splices of the demo's recommended layout.
func demoSplices(t *testing.T) int {
	t.Helper()
	s, err := optimise.Prepare(optimise.DemoJobName, optimise.DemoJob())
	require.NoError(t, err)
	res, err := optimise.Run(s, optimise.Settings{})
	require.NoError(t, err)
	return len(res.Recommended().Splices)
}

func TestRunReportDemoWritesTheFolder(t *testing.T) {
	parent := t.TempDir()
	out := filepath.Join(parent, "report")
	var stdout bytes.Buffer
	require.NoError(t, runReport(reportOptions{Demo: true, Out: out}, outTo(&stdout)))

	want := []string{"bom.csv", "layouts.csv", "report.pdf", "result.json", "scan.csv"}
	figures := []string{"cost", "envelopes", "layouts", "utilisation"}
	for i := 1; i <= demoSplices(t); i++ {
		figures = append(figures, fmt.Sprintf("splice-s%d", i))
	}
	for _, f := range figures {
		want = append(want, f+".png", f+".svg")
	}
	slices.Sort(want)
	assert.Equal(t, want, folderNames(t, out))
	assert.Equal(t, []string{"report"}, folderNames(t, parent), "no temporary folder is left behind")

	pdf, err := os.ReadFile(filepath.Join(out, "report.pdf"))
	require.NoError(t, err)
	assert.True(t, bytes.HasPrefix(pdf, []byte("%PDF-1.")))
	png, err := os.ReadFile(filepath.Join(out, "envelopes.png"))
	require.NoError(t, err)
	assert.True(t, bytes.HasPrefix(png, []byte("\x89PNG")))
	// result.json is the optimise command's JSON with the recommended layout's splices added
	var keys map[string]json.RawMessage
	raw, err := os.ReadFile(filepath.Join(out, "result.json"))
	require.NoError(t, err)
	require.NoError(t, json.Unmarshal(raw, &keys))
	for _, key := range []string{"input", "version", "units", "candidates", "layouts", "caution", "chosen_splices", "bill_of_materials"} {
		_, ok := keys[key]
		assert.True(t, ok, "result.json has %q", key)
	}
	var result struct {
		Layouts []struct {
			Recommended bool      `json:"recommended"`
			Splices     []float64 `json:"splices"`
		} `json:"layouts"`
		Chosen []struct {
			Position float64          `json:"position"`
			Checks   []map[string]any `json:"checks"`
		} `json:"chosen_splices"`
	}
	require.NoError(t, json.Unmarshal(raw, &result))
	var rec []float64
	for _, l := range result.Layouts {
		if l.Recommended {
			rec = l.Splices
		}
	}
	require.Len(t, result.Chosen, len(rec))
	for i, x := range rec {
		assert.InDelta(t, x, result.Chosen[i].Position, 1e-9, "the sheets are the recommended layout's splices")
		assert.NotEmpty(t, result.Chosen[i].Checks)
	}
	scan, err := os.ReadFile(filepath.Join(out, "scan.csv"))
	require.NoError(t, err)
	var optimiseCSV bytes.Buffer
	require.NoError(t, runOptimise(optimiseOptions{Demo: true, Format: "csv"}, outTo(&optimiseCSV)))
	assert.Equal(t, optimiseCSV.String(), string(scan), "scan.csv is what optimise --format csv prints")
	text := stdout.String()
	assert.Contains(t, text, fmt.Sprintf("Wrote %d files to %s", len(want), out))
	assert.Contains(t, text, "Recommended:")
	assert.Contains(t, text, encode.Caution)
}

func TestRunReportReplacesOnlyWithForce(t *testing.T) {
	parent := t.TempDir()
	out := filepath.Join(parent, "report")
	require.NoError(t, os.Mkdir(out, 0o755))
	marker := filepath.Join(out, "keep-me.txt")
	require.NoError(t, os.WriteFile(marker, []byte("earlier work"), 0o644))

	var stdout bytes.Buffer
	err := runReport(reportOptions{Demo: true, Out: out}, outTo(&stdout))
	require.Error(t, err)
	assert.Contains(t, err.Error(), "--force")
	assert.Equal(t, exitFailure, exitCode(err), "an existing folder is a state of the file system, exit 1")
	assert.FileExists(t, marker, "the existing folder is untouched")
	assert.Equal(t, []string{"report"}, folderNames(t, parent))
	assert.Zero(t, stdout.Len())

	require.NoError(t, runReport(reportOptions{Demo: true, Out: out, Force: true}, outTo(&stdout)))
	assert.NoFileExists(t, marker, "--force replaces the folder as a whole")
	assert.FileExists(t, filepath.Join(out, "report.pdf"))
	assert.Equal(t, []string{"report"}, folderNames(t, parent), "neither the temporary nor the old folder is left")
}

func TestRunReportErrors(t *testing.T) {
	dir := t.TempDir()
	job := filepath.Join(dir, "bad.yaml")
	require.NoError(t, os.WriteFile(job, []byte("title: no beam\n"), 0o644))
	tests := []struct {
		name string
		opts reportOptions
		want string
		exit int
	}{
		{"no folder", reportOptions{Demo: true}, "--out", exitUsage},
		{"negative step", reportOptions{Demo: true, Out: filepath.Join(dir, "a"), Step: -100}, "--step", exitUsage},
		{"missing job file", reportOptions{JobFile: filepath.Join(dir, "none.yaml"), Out: filepath.Join(dir, "b")}, "none.yaml", exitFailure},
		{"bad job file", reportOptions{JobFile: job, Out: filepath.Join(dir, "c")}, "bad.yaml", exitFailure},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			var stdout bytes.Buffer
			err := runReport(tt.opts, outTo(&stdout))
			require.Error(t, err)
			assert.Contains(t, err.Error(), tt.want)
			assert.Equal(t, tt.exit, exitCode(err))
			assert.Zero(t, stdout.Len(), "nothing is printed on error")
			if tt.opts.Out != "" {
				assert.NoDirExists(t, tt.opts.Out, "nothing is written on error")
			}
		})
	}
	assert.Equal(t, []string{"bad.yaml"}, folderNames(t, dir), "no temporary folders are left behind")
}

func TestReportCommandParsesArgsAndFlags(t *testing.T) {
	dir := t.TempDir()
	job := filepath.Join(dir, "job.yaml")
	require.NoError(t, os.WriteFile(job, optimise.DemoJob(), 0o644))
	out := filepath.Join(dir, "out")

	cmd := newReportCommand(runReport, streams{})
	var stdout bytes.Buffer
	cmd.SetOut(&stdout)
	cmd.SetErr(&bytes.Buffer{})
	cmd.SetArgs([]string{job, "--out", out, "--step", "0.1"})
	require.NoError(t, cmd.Execute())
	assert.FileExists(t, filepath.Join(out, "report.pdf"))
	assert.Contains(t, stdout.String(), "report on "+job)
	raw, err := os.ReadFile(filepath.Join(out, "result.json"))
	require.NoError(t, err)
	var result struct{ Step float64 }
	require.NoError(t, json.Unmarshal(raw, &result))
	assert.InDelta(t, 0.1, result.Step, 1e-12, "--step reaches the scan")

	cmd = newReportCommand(runReport, streams{})
	cmd.SetOut(&bytes.Buffer{})
	cmd.SetErr(&bytes.Buffer{})
	cmd.SetArgs([]string{job, "--out", out}) // exists now, no --force
	err = cmd.Execute()
	require.Error(t, err)
	assert.Equal(t, exitFailure, exitCode(err))

	cmd = newReportCommand(runReport, streams{})
	cmd.SetOut(&bytes.Buffer{})
	cmd.SetErr(&bytes.Buffer{})
	cmd.SetArgs([]string{job, "--out", out, "--force"})
	require.NoError(t, cmd.Execute())

	cmd = newReportCommand(runReport, streams{})
	cmd.SetOut(&bytes.Buffer{})
	cmd.SetErr(&bytes.Buffer{})
	cmd.SetArgs([]string{"--out", out})
	err = cmd.Execute()
	require.Error(t, err, "the job file is required")
	assert.Equal(t, exitUsage, exitCode(err))
}

// TestReportBOMAddsUp: bom.csv of the demo's report adds up to the recommended layout's own
// totals — the bolts of its splices and their plate and bolt masses, as the Outcome states them
// (tested on their own in splice and optimise) — splice by splice and for the layout; and a
// plate of the first splice weighs t·b·L·7850 kg/m³ (EN 1991-1-1 Table A.4), by hand.
func TestReportBOMAddsUp(t *testing.T) {
	s, err := optimise.Prepare(optimise.DemoJobName, optimise.DemoJob())
	require.NoError(t, err)
	res, err := optimise.Run(s, optimise.Settings{})
	require.NoError(t, err)
	files, _, err := reportFiles(s, res, time.Time{})
	require.NoError(t, err)
	var bom []byte
	for _, f := range files {
		if f.name == "bom.csv" {
			bom = f.data
		}
	}
	require.NotNil(t, bom, "the report folder has bom.csv")
	rows, err := csv.NewReader(bytes.NewReader(bom)).ReadAll()
	require.NoError(t, err)
	require.Equal(t, encode.BOMHeader, rows[0])
	col := map[string]int{}
	for i, h := range rows[0] {
		col[h] = i
	}
	for _, c := range []string{"item", "size", "class_or_grade", "length_mm", "quantity", "unit_mass_kg", "total_mass_kg"} {
		assert.Contains(t, col, c, "a column the issue asks for")
	}
	type sums struct {
		bolts, nuts    int
		plates, fixing float64 // kg
	}
	got := map[string]*sums{}
	num := func(s string) float64 {
		v, err := strconv.ParseFloat(s, 64)
		require.NoError(t, err, s)
		return v
	}
	for _, r := range rows[1:] {
		sp := r[col["splice"]]
		if got[sp] == nil {
			got[sp] = &sums{}
		}
		g := got[sp]
		switch r[col["item"]] {
		case "bolt":
			g.bolts += int(num(r[col["quantity"]]))
			g.fixing += num(r[col["total_mass_kg"]])
		case "nut":
			g.nuts += int(num(r[col["quantity"]]))
			g.fixing += num(r[col["total_mass_kg"]])
		case "washer":
			g.fixing += num(r[col["total_mass_kg"]])
		case "plate":
			g.plates += num(r[col["total_mass_kg"]])
			assert.InDelta(t, num(r[col["quantity"]])*num(r[col["unit_mass_kg"]]), num(r[col["total_mass_kg"]]), 1e-5)
		}
	}
	rec := res.Recommended()
	require.NotEmpty(t, rec.Splices)
	var total sums
	for i, x := range rec.Splices {
		d := res.CandidateAt(x).Design
		g := got[fmt.Sprintf("S%d", i+1)]
		require.NotNil(t, g, "splice S%d has its lines", i+1)
		assert.Equal(t, d.Bolts, g.bolts, "S%d: bolts", i+1)
		assert.Equal(t, d.Bolts, g.nuts, "S%d: a nut a bolt", i+1)
		assert.InDelta(t, d.PlateMass, g.plates, 1e-4, "S%d: plate mass", i+1)
		assert.InDelta(t, d.BoltMass, g.fixing, 1e-4, "S%d: bolts, nuts and washers", i+1)
		total.bolts += d.Bolts
		total.plates += d.PlateMass
		total.fixing += d.BoltMass
	}
	lay := got["layout"]
	require.NotNil(t, lay)
	assert.Equal(t, total.bolts, lay.bolts, "the layout's bolts")
	assert.InDelta(t, total.plates, lay.plates, 1e-4, "the layout's plate mass")
	assert.InDelta(t, total.fixing, lay.fixing, 1e-4, "the layout's bolt assemblies")
	// the pieces carry the splices: plates and bolts together
	carried := 0.0
	for _, p := range rec.Pieces {
		carried += p.SpliceMass
	}
	assert.InDelta(t, total.plates+total.fixing, carried, 1e-6)

	// by hand: the first splice's outer flange plates (t × b × L from its geometry)
	g := res.CandidateAt(rec.Splices[0]).Design.Geometry
	length := g.Gap + 2*(2*g.Flange.End+float64(g.Flange.Rows-1)*g.Flange.Pitch)
	wantSize := fmt.Sprintf("%g×%g×%g", g.Flange.Outer.Thickness, g.Flange.Outer.Width, length)
	found := false
	for _, r := range rows[1:] {
		if r[col["splice"]] == "S1" && r[col["description"]] == "outer flange plate" {
			found = true
			assert.Equal(t, wantSize, r[col["size"]])
			assert.InDelta(t, g.Flange.Outer.Thickness*g.Flange.Outer.Width*length*7850e-9, num(r[col["unit_mass_kg"]]), 1e-6)
			assert.Equal(t, "2", r[col["quantity"]], "one outer plate a flange")
			assert.Equal(t, s.Splice.PlateSteel.Name, r[col["class_or_grade"]])
		}
	}
	assert.True(t, found, "S1 lists its outer flange plates")
}
