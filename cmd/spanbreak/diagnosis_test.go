package main

import (
	"bytes"
	"encoding/csv"
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/optimise"
)

// noSpliceJob is a simply supported IPE 300 (10 m, every 0.25 m: 39 positions) whose midspan
// no splice of its small design space passes, with pieces of at most 6 m: no layout fits.
const noSpliceJob = "../../optimise/testdata/no-splice-midspan.yaml"

// findingDoc is one line of the diagnosis as the JSON document gives it.
type findingDoc struct {
	Kind        string   `json:"kind"`
	From        *float64 `json:"from"`
	To          *float64 `json:"to"`
	Key         string   `json:"key"`
	Check       *string  `json:"check"`
	Utilisation *float64 `json:"utilisation"`
	MEd         *float64 `json:"M_Ed"`
	VEd         *float64 `json:"V_Ed"`
	McRd        *float64 `json:"Mc_Rd"`
	VcRd        *float64 `json:"Vc_Rd"`
	Message     string   `json:"message"`
}

// optimiseDoc is the part of the optimise document these tests read.
type optimiseDoc struct {
	Candidates []struct {
		X        float64 `json:"x"`
		Feasible bool    `json:"feasible"`
		Reason   *string `json:"reason"`
	} `json:"candidates"`
	Layouts   []json.RawMessage `json:"layouts"`
	Diagnosis []findingDoc      `json:"diagnosis"`
}

func TestOptimiseWithoutALayoutPrintsTheWholeResult(t *testing.T) {
	t.Run("json", func(t *testing.T) {
		out, _, err := runOpt(t, optimiseOptions{Paths: []string{noSpliceJob}, Format: "json"})
		require.Error(t, err)
		assert.Equal(t, exitInfeasible, exitCode(err))
		assert.Contains(t, err.Error(), "no-splice-midspan.yaml:29:21:")
		assert.Contains(t, err.Error(), "limits.max_piece_length")
		var doc optimiseDoc
		require.NoError(t, json.Unmarshal([]byte(out), &doc))
		var raw map[string]json.RawMessage
		require.NoError(t, json.Unmarshal([]byte(out), &raw))
		assert.JSONEq(t, "[]", string(raw["layouts"]), "layouts is an empty list, not null")

		require.Len(t, doc.Candidates, 39, "every position: 10 m every 0.25 m inside the beam")
		for _, c := range doc.Candidates {
			if !c.Feasible {
				require.NotNil(t, c.Reason, "x = %g m", c.X)
				assert.NotEmpty(t, *c.Reason)
			}
		}
		require.Len(t, doc.Diagnosis, 2)
		st := doc.Diagnosis[0]
		assert.Equal(t, "stretch", st.Kind)
		assert.Equal(t, "beam.section", st.Key)
		require.NotNil(t, st.Check)
		assert.True(t, strings.HasPrefix(*st.Check, "flange.") || strings.HasPrefix(*st.Check, "web.") ||
			strings.HasPrefix(*st.Check, "detail."), "a check id: %s", *st.Check)
		require.NotNil(t, st.Utilisation)
		assert.Greater(t, *st.Utilisation, 1.0)
		require.NotNil(t, st.From)
		require.NotNil(t, st.To)
		assert.Less(t, *st.From, *st.To)
		// Mpl,Rd = Wpl,y·fy/γM0 = 628.4 cm³ × 355 N/mm² / 1.00 = 223.1 kNm (IPE 300, EN 10365
		// published; EN 1993-1-1 Table 3.1 and 6.1); the midspan moment exceeds it
		require.NotNil(t, st.McRd)
		assert.InEpsilon(t, 628.4*355/1000, *st.McRd, 5e-3)
		require.NotNil(t, st.MEd)
		assert.Greater(t, *st.MEd, *st.McRd)
		assert.Nil(t, st.VcRd, "V_Ed stays below Vpl,Rd")
		assert.Contains(t, st.Message, *st.Check)

		lim := doc.Diagnosis[1]
		assert.Equal(t, "limit", lim.Kind)
		assert.Equal(t, "limits.max_piece_length", lim.Key)
		assert.Nil(t, lim.Check)
		assert.Nil(t, lim.MEd)
		assert.Contains(t, lim.Message, "max_piece_length 6 m")
	})
	t.Run("text", func(t *testing.T) {
		out, _, err := runOpt(t, optimiseOptions{Paths: []string{noSpliceJob}, Format: "text"})
		assert.Equal(t, exitInfeasible, exitCode(err))
		scan := strings.Index(out, "Scan:     every 0.250 m, 39 positions")
		why := strings.Index(out, "\nWHY NO LAYOUT FITS\n- no splice passes from ")
		summary := strings.Index(out, "Admissible stretches")
		require.True(t, scan > 0 && why > scan && summary > why, "header, scan, why, then the candidates:\n%s", out)
		assert.Contains(t, out, "\n- limits.max_piece_length: no layout keeps every piece within max_piece_length 6 m")
		assert.NotContains(t, out, "RECOMMENDATION")
		assert.NotContains(t, out, "Best layout for each number of splices")
	})
	t.Run("exhaustive", func(t *testing.T) {
		for _, format := range []string{"text", "json", "csv"} {
			fast, _, _ := runOpt(t, optimiseOptions{Paths: []string{noSpliceJob}, Format: format})
			slow, _, err := runOpt(t, optimiseOptions{Paths: []string{noSpliceJob}, Format: format, Exhaustive: true})
			assert.Equal(t, exitInfeasible, exitCode(err))
			assert.Equal(t, fast, slow, "the reference run prints the same diagnosis (%s)", format)
		}
	})
	t.Run("csv", func(t *testing.T) {
		out, _, err := runOpt(t, optimiseOptions{Paths: []string{noSpliceJob}, Format: "csv"})
		assert.Equal(t, exitInfeasible, exitCode(err))
		rows, err := csv.NewReader(strings.NewReader(out)).ReadAll()
		require.NoError(t, err)
		assert.Len(t, rows, 1+39, "the header and every candidate")
	})
}

// TestOptimiseWithoutALayoutWritesItsFiles: --out writes the whole result, and layouts.csv
// with its header only.
func TestOptimiseWithoutALayoutWritesItsFiles(t *testing.T) {
	dir := filepath.Join(t.TempDir(), "out")
	_, _, err := runOpt(t, optimiseOptions{Paths: []string{noSpliceJob}, Format: "text", Out: dir})
	assert.Equal(t, exitInfeasible, exitCode(err))
	txt, err := os.ReadFile(filepath.Join(dir, "no-splice-midspan.optimise.txt"))
	require.NoError(t, err)
	assert.Contains(t, string(txt), "WHY NO LAYOUT FITS")
	lay, err := os.ReadFile(filepath.Join(dir, "no-splice-midspan.layouts.csv"))
	require.NoError(t, err)
	assert.Equal(t, 1, strings.Count(string(lay), "\n"), "the header only")
}

// TestOptimiseBatchShowsWhyAJobHasNoLayout: the summary shows the first line of the
// diagnosis under the job's error, and the JSON carries the whole diagnosis.
func TestOptimiseBatchShowsWhyAJobHasNoLayout(t *testing.T) {
	dir := t.TempDir()
	src, err := os.ReadFile(noSpliceJob)
	require.NoError(t, err)
	require.NoError(t, os.WriteFile(filepath.Join(dir, "a.yaml"), src, 0o644))
	ok, err := os.ReadFile(smallJob)
	require.NoError(t, err)
	require.NoError(t, os.WriteFile(filepath.Join(dir, "b.yaml"), ok, 0o644))

	out, _, err := runOpt(t, optimiseOptions{Paths: []string{dir}, Format: "text"})
	assert.Equal(t, exitInfeasible, exitCode(err))
	assert.Contains(t, out, "limits.max_piece_length: no layout keeps every piece within max_piece_length 6 m")
	assert.Contains(t, out, "\n  why: no splice passes from ")

	// the batch --out files of a job without a layout are its whole result
	outDir := filepath.Join(t.TempDir(), "files")
	_, _, err = runOpt(t, optimiseOptions{Paths: []string{dir}, Format: "json", Out: outDir})
	assert.Equal(t, exitInfeasible, exitCode(err))
	assert.FileExists(t, filepath.Join(outDir, "a.optimise.txt"))
	assert.FileExists(t, filepath.Join(outDir, "b.optimise.txt"))

	js, _, _ := runOpt(t, optimiseOptions{Paths: []string{dir}, Format: "json"})
	var doc struct {
		Jobs []struct {
			Error     *string      `json:"error"`
			Diagnosis []findingDoc `json:"diagnosis"`
		} `json:"jobs"`
	}
	require.NoError(t, json.Unmarshal([]byte(js), &doc))
	require.Len(t, doc.Jobs, 2)
	require.NotNil(t, doc.Jobs[0].Error)
	require.Len(t, doc.Jobs[0].Diagnosis, 2)
	assert.Equal(t, "stretch", doc.Jobs[0].Diagnosis[0].Kind)
	assert.Nil(t, doc.Jobs[1].Error)
	assert.Empty(t, doc.Jobs[1].Diagnosis)
}

// TestReportWithoutALayoutWritesTheDiagnosis: report writes its folder, says why no layout
// fits, and exits with status 3.
func TestReportWithoutALayoutWritesTheDiagnosis(t *testing.T) {
	dir := filepath.Join(t.TempDir(), "report")
	var stdout bytes.Buffer
	err := runReport(reportOptions{JobFile: noSpliceJob, Out: dir}, outTo(&stdout))
	require.Error(t, err)
	assert.Equal(t, exitInfeasible, exitCode(err))
	assert.Contains(t, err.Error(), "limits.max_piece_length")
	assert.Contains(t, stdout.String(), "No layout fits the limits:\n- no splice passes from ")
	assert.Contains(t, stdout.String(), "Wrote 11 files to "+dir)

	assert.Equal(t, []string{"bom.csv", "cost.png", "cost.svg", "envelopes.png", "envelopes.svg", "layouts.csv", "report.pdf",
		"result.json", "scan.csv", "utilisation.png", "utilisation.svg"}, folderNames(t, dir))
	bom, err := os.ReadFile(filepath.Join(dir, "bom.csv"))
	require.NoError(t, err)
	assert.Equal(t, 1, strings.Count(string(bom), "\n"), "bom.csv has its header only")
	raw, err := os.ReadFile(filepath.Join(dir, "result.json"))
	require.NoError(t, err)
	var doc struct {
		optimiseDoc
		Chosen []json.RawMessage `json:"chosen_splices"`
	}
	require.NoError(t, json.Unmarshal(raw, &doc))
	assert.Len(t, doc.Candidates, 39)
	assert.Empty(t, doc.Layouts)
	assert.Empty(t, doc.Chosen)
	require.NotEmpty(t, doc.Diagnosis)
	assert.Equal(t, "stretch", doc.Diagnosis[0].Kind)

	lay, err := os.ReadFile(filepath.Join(dir, "layouts.csv"))
	require.NoError(t, err)
	assert.Equal(t, 1, strings.Count(string(lay), "\n"), "layouts.csv has its header only")
	scan, err := os.ReadFile(filepath.Join(dir, "scan.csv"))
	require.NoError(t, err)
	assert.Equal(t, 1+39, strings.Count(string(scan), "\n"))
	pdf, err := os.ReadFile(filepath.Join(dir, "report.pdf"))
	require.NoError(t, err)
	assert.True(t, bytes.HasPrefix(pdf, []byte("%PDF-")))
}

// TestDesignInsideAKeepOutZone: the demo's support at 20.5 m with keep_out.supports 1.0 (job
// data): at 20.2 m the sheet says so before the design forces, and the JSON names the zone.
func TestDesignInsideAKeepOutZone(t *testing.T) {
	dir := t.TempDir()
	job := filepath.Join(dir, "demo.yaml")
	require.NoError(t, os.WriteFile(job, optimise.DemoJob(), 0o644))
	run := func(at float64, format string) string {
		var out bytes.Buffer
		err := runDesign(designOptions{JobFile: job, At: at * 1e3, AtSet: true, Format: format}, outTo(&out))
		if err != nil {
			require.Equal(t, exitInfeasible, exitCode(err), "%v", err)
		}
		return out.String()
	}
	text := run(20.2, "text")
	note := strings.Index(text, "\nNOTE: x = 20.200 m is inside a keep-out zone, 19.500 to 21.500 m: "+
		"keep-out: 1 m each side of the support at 20.5 m (limits.keep_out.supports)")
	forces := strings.Index(text, "\nDesign forces\n")
	require.True(t, note > 0 && forces > note, "the note comes before the design forces:\n%s", text)
	assert.Contains(t, text, "\nChecks\n", "the design still runs")

	var doc struct {
		KeepOut *struct {
			Reason string  `json:"reason"`
			Key    string  `json:"key"`
			From   float64 `json:"from"`
			To     float64 `json:"to"`
		} `json:"keep_out"`
		Checks []json.RawMessage `json:"checks"`
	}
	require.NoError(t, json.Unmarshal([]byte(run(20.2, "json")), &doc))
	require.NotNil(t, doc.KeepOut)
	assert.Equal(t, "keep-out: 1 m each side of the support at 20.5 m", doc.KeepOut.Reason)
	assert.Equal(t, "limits.keep_out.supports", doc.KeepOut.Key)
	assert.Equal(t, [2]float64{19.5, 21.5}, [2]float64{doc.KeepOut.From, doc.KeepOut.To})
	assert.NotEmpty(t, doc.Checks)

	var raw map[string]json.RawMessage
	require.NoError(t, json.Unmarshal([]byte(run(15, "json")), &raw))
	assert.JSONEq(t, "null", string(raw["keep_out"]), "outside every zone")
	assert.NotContains(t, run(15, "text"), "NOTE:")
}
