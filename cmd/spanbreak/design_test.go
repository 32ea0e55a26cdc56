package main

import (
	"bytes"
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/splice"
)

// directOptions is an IPE 500 in S355 at M = +400/−250 kNm, V = 300 kN, N = +100/−150 kN (ULS),
// category B, the same case as the splice package's worked example.
func directOptions() designOptions {
	return designOptions{Section: "IPE 500", Grade: "S355", Format: "text",
		ULS: "M_max=400,M_min=-250,V=300,N_max=100,N_min=-150", SLS: "M_max=280,M_min=-170,V=210,N_max=70,N_min=-100",
		Category: "B", FrictionClass: "A", Distribution: "proportional", Gap: 10}
}

func TestParseDesignForces(t *testing.T) {
	for _, row := range []struct {
		in   string
		want splice.Forces // [N·mm, N]
		err  string
	}{
		{"M=350,V=120,N=-40", splice.Forces{MMax: 350e6, MMin: 350e6, V: 120e3, NMax: -40e3, NMin: -40e3}, ""},
		{"M_max=400, M_min=-250, V=300", splice.Forces{MMax: 400e6, MMin: -250e6, V: 300e3}, ""},
		{"Mmax=10kNm,Mmin=-5 kNm,V=3kN,Nmax=2,Nmin=-1", splice.Forces{MMax: 10e6, MMin: -5e6, V: 3e3, NMax: 2e3, NMin: -1e3}, ""},
		{"V=50", splice.Forces{V: 50e3}, ""},
		{"M=1,Q=2", splice.Forces{}, `unknown key "Q"`},
		{"M=abc", splice.Forces{}, "not a number"},
		{"M=1,M_max=2", splice.Forces{}, "given twice"},
		{"M_max=-1,M_min=1", splice.Forces{}, "less than M_min"},
		{"N_max=-5,N_min=5", splice.Forces{}, "less than N_min"},
		{"M 400", splice.Forces{}, "KEY=VALUE"},
		{"M=NaN", splice.Forces{}, "not a number"},
	} {
		t.Run(row.in, func(t *testing.T) {
			f, err := parseDesignForces(row.in)
			if row.err != "" {
				require.Error(t, err)
				assert.Contains(t, err.Error(), row.err)
				return
			}
			require.NoError(t, err)
			assert.Equal(t, row.want, f)
		})
	}
}

func TestDesignDirectTextSheet(t *testing.T) {
	var out bytes.Buffer
	require.NoError(t, runDesign(directOptions(), outTo(&out)))
	text := out.String()
	for _, id := range []string{"detail.spacing", "detail.fit", "detail.preload", "flange.bolt.shear", "flange.bolt.bearing.beam",
		"flange.bolt.bearing.plate", "flange.bolt.slip", "flange.plate.tension", "flange.plate.block", "flange.plate.compression",
		"flange.plate.buckling", "flange.beam.net", "web.bolt.shear", "web.bolt.bearing.beam", "web.bolt.bearing.plate",
		"web.bolt.slip", "web.plate.shear.gross", "web.plate.shear.net", "web.plate.block", "web.plate.combined", "web.beam.net-shear",
		"detail.bolt.length"} {
		assert.Contains(t, text, ". "+id+" — ", "every check on its own lines")
	}
	for _, want := range []string{
		"IPE 500, S355", "EN 1993-1-8 Table 3.4", "utilisation", "pass",
		"Fv,Rd = 0.50×1000×245/1.25 = 98.0 kN", // numbers substituted (M20 10.9, EN 1993-1-8 Table 3.4)
		"Governing: ", "Quantities: ", "bolts", "holes", "kg of plate", "faying surface", "total",
		"Bolt assemblies (EN 1090-2 8.2.2", "plies (head side first)", "shear planes (from the length)", "Bill of materials",
		"CAUTION", "competent engineer", "national annex",
	} {
		assert.Contains(t, text, want)
	}
}

func TestDesignJSONContract(t *testing.T) {
	opts := directOptions()
	opts.Format = "json"
	opts.At, opts.AtSet = 12500, true // [mm]
	var out bytes.Buffer
	require.NoError(t, runDesign(opts, outTo(&out)))
	var doc map[string]any
	require.NoError(t, json.Unmarshal(out.Bytes(), &doc))
	for _, key := range []string{"position", "forces", "splice", "checks", "utilisation", "governing", "quantities", "cost"} {
		assert.Contains(t, doc, key, "DESIGN.md section 7")
	}
	assert.Equal(t, 12.5, doc["position"])
	uls := doc["forces"].(map[string]any)["uls"].(map[string]any)
	assert.Equal(t, map[string]any{"M_max": 400.0, "M_min": -250.0, "V": 300.0, "N_max": 100.0, "N_min": -150.0}, uls)
	assert.NotNil(t, doc["forces"].(map[string]any)["sls"])
	sp := doc["splice"].(map[string]any)
	for _, key := range []string{"bolt", "category", "friction_class", "holes", "gap", "flange", "web"} {
		assert.Contains(t, sp, key, "same keys as the splice file")
	}
	for _, key := range []string{"outer", "columns", "rows", "gauge", "end", "edge"} {
		assert.Contains(t, sp["flange"], key)
	}
	for _, key := range []string{"thickness", "depth", "columns", "rows", "end", "edge"} {
		assert.Contains(t, sp["web"], key)
	}
	checks := doc["checks"].([]any)
	require.NotEmpty(t, checks)
	for _, c := range checks {
		for _, key := range []string{"id", "clause", "state", "demand", "resistance", "unit", "utilisation", "pass"} {
			assert.Contains(t, c, key)
		}
	}
	q := doc["quantities"].(map[string]any)
	for _, key := range []string{"bolts", "holes", "plate_mass_kg", "faying_area_m2"} {
		assert.Contains(t, q, key)
	}
	assert.Contains(t, doc["cost"], "total")
	assert.Equal(t, true, doc["pass"])
	assert.Contains(t, q, "bolt_mass_kg")
	// the shear planes follow the bolt lengths by default: the splice says no assumption
	assert.NotContains(t, sp["bolt"], "threads_in_shear_plane")
	assemblies := doc["assemblies"].([]any)
	require.Len(t, assemblies, 2, "the flange and the web group")
	for _, a := range assemblies {
		for _, key := range []string{"group", "count", "designation", "system", "plies", "grip", "clamp", "required_length", "length",
			"thread_length", "plain_shank", "protrusion", "mass_kg", "shear_planes", "planes", "source"} {
			assert.Contains(t, a, key)
		}
		assert.Equal(t, "length", a.(map[string]any)["shear_planes"])
		for _, p := range a.(map[string]any)["planes"].([]any) {
			for _, key := range []string{"name", "position", "on_thread", "threaded", "area", "alpha_v", "Fv_Rd"} {
				assert.Contains(t, p, key)
			}
		}
	}
	items := doc["materials"].(map[string]any)["items"].([]any)
	require.NotEmpty(t, items)
	for _, it := range items {
		for _, key := range []string{"item", "part", "description", "size", "class_or_grade", "quantity", "unit_mass_kg", "total_mass_kg"} {
			assert.Contains(t, it, key)
		}
	}
	assert.Contains(t, doc["materials"], "holes")
}

// TestDesignSpliceFileRoundTrip: the splice a sizing run prints (JSON is YAML) checks again as a
// splice file with the same utilisation and cost.
func TestDesignSpliceFileRoundTrip(t *testing.T) {
	opts := directOptions()
	opts.Format = "json"
	var out bytes.Buffer
	require.NoError(t, runDesign(opts, outTo(&out)))
	var doc struct {
		Splice      json.RawMessage `json:"splice"`
		Utilisation float64         `json:"utilisation"`
		Cost        struct{ Total float64 }
	}
	require.NoError(t, json.Unmarshal(out.Bytes(), &doc))
	path := filepath.Join(t.TempDir(), "splice.yaml")
	require.NoError(t, os.WriteFile(path, doc.Splice, 0o644))

	opts.SpliceFile = path
	var again bytes.Buffer
	require.NoError(t, runDesign(opts, outTo(&again)))
	var doc2 struct {
		Status      string  `json:"status"`
		Utilisation float64 `json:"utilisation"`
		Cost        struct{ Total float64 }
	}
	require.NoError(t, json.Unmarshal(again.Bytes(), &doc2))
	assert.Equal(t, "checked", doc2.Status)
	assert.Equal(t, doc.Utilisation, doc2.Utilisation)
	assert.Equal(t, doc.Cost.Total, doc2.Cost.Total)
}

func writeSplice(t *testing.T, body string) string {
	path := filepath.Join(t.TempDir(), "splice.yaml")
	require.NoError(t, os.WriteFile(path, []byte(body), 0o644))
	return path
}

const goodSplice = `bolt: {size: M20, class: "10.9", threads_in_shear_plane: true}
category: B
friction_class: A
holes: normal
gap: 10
flange:
  outer: {thickness: 15, width: 200}
  inner: {thickness: 15, width: 65}
  columns: 2
  rows: 3
  gauge: 130
  pitch: 80
  end: 70
  edge: 35
web:
  thickness: 10
  depth: 400
  columns: 2
  rows: 4
  pitch: 100
  spacing: 80
  end: 60
  edge: 50
`

func TestDesignSpliceFileChecks(t *testing.T) {
	opts := directOptions()
	opts.SpliceFile = writeSplice(t, goodSplice)
	var out bytes.Buffer
	require.NoError(t, runDesign(opts, outTo(&out)))
	assert.Contains(t, out.String(), "checked as given")
	assert.Contains(t, out.String(), "outer plate 15 × 200, 2 inner plates 15 × 65")

	// a bolt too close to the plate edge fails a detailing check: the sheet is printed, exit 3
	opts.SpliceFile = writeSplice(t, strings.Replace(strings.Replace(goodSplice, "gauge: 130", "gauge: 160", 1), "edge: 35", "edge: 20", 1))
	out.Reset()
	err := runDesign(opts, outTo(&out))
	require.Error(t, err)
	assert.Equal(t, exitInfeasible, exitCode(err))
	assert.Contains(t, out.String(), "detail.spacing")
	assert.Contains(t, out.String(), "FAIL")

	// a web edge distance that contradicts depth and pitch is an error naming the field
	opts.SpliceFile = writeSplice(t, strings.Replace(goodSplice, "  edge: 50", "  edge: 40", 1))
	out.Reset()
	err = runDesign(opts, outTo(&out))
	require.Error(t, err)
	assert.Contains(t, err.Error(), "web.edge")
	assert.Empty(t, out.String(), "nothing half-written")
	assert.Regexp(t, `splice\.yaml:\d+:9: web\.edge: `, err.Error(), "at its line")

	// bolts off the beam flange (IPE 500, b = 200 mm; gauge 240 mm: e2 = 100 − 120 = −20 mm)
	// cannot be checked: the sheet and the error say so, never a placeholder utilisation
	off := strings.NewReplacer("width: 200", "width: 340", "gauge: 130", "gauge: 240", "edge: 35", "edge: 50",
		"  inner: {thickness: 15, width: 65}\n", "").Replace(goodSplice)
	opts.SpliceFile = writeSplice(t, off)
	out.Reset()
	err = runDesign(opts, outTo(&out))
	require.Error(t, err)
	assert.Equal(t, exitInfeasible, exitCode(err))
	assert.NotContains(t, out.String()+err.Error(), "999")
	assert.Contains(t, out.String(), "not possible: flange e2 (beam flange) = -20 mm: the outer bolt lines are off the beam flange")
	assert.Contains(t, err.Error(), "not possible, flange e2 (beam flange) = -20 mm: the outer bolt lines are off the beam flange")
}

func TestDesignErrorsAndExitCodes(t *testing.T) {
	for _, row := range []struct {
		name string
		edit func(o *designOptions)
		exit int
		msg  string
	}{
		{"no section", func(o *designOptions) { o.Section = "" }, exitUsage, "--section"},
		{"no uls", func(o *designOptions) { o.ULS = "" }, exitUsage, "--uls"},
		{"unknown section", func(o *designOptions) { o.Section = "IPE 555" }, exitUsage, "--section"},
		{"unknown grade", func(o *designOptions) { o.Grade = "S999" }, exitUsage, "--grade"},
		{"bad forces", func(o *designOptions) { o.ULS = "M=x" }, exitUsage, "--uls"},
		{"bad category", func(o *designOptions) { o.Category = "E" }, exitUsage, "--category"},
		{"bad format", func(o *designOptions) { o.Format = "xml" }, exitUsage, "--format"},
		{"job mode without --at", func(o *designOptions) { o.JobFile = "job.yaml"; o.Section, o.ULS, o.SLS = "", "", "" }, exitUsage, "--at"},
		{"job mode with direct forces", func(o *designOptions) { o.JobFile = "job.yaml"; o.AtSet = true }, exitUsage, "direct mode"},
		{"nothing passes", func(o *designOptions) { o.ULS = "M=3000,V=2000" }, exitInfeasible, "no splice in the design space passes"},
	} {
		t.Run(row.name, func(t *testing.T) {
			o := directOptions()
			row.edit(&o)
			var out bytes.Buffer
			err := runDesign(o, outTo(&out))
			require.Error(t, err)
			assert.Equal(t, row.exit, exitCode(err))
			assert.Contains(t, err.Error(), row.msg)
			if row.exit == exitInfeasible {
				assert.Contains(t, out.String(), "NO SPLICE IN THE DESIGN SPACE PASSES")
				assert.Contains(t, out.String(), "Governing: ")
			}
		})
	}
}

// TestDesignCommandFlags: argv → options → output through cobra.
func TestDesignCommandFlags(t *testing.T) {
	cmd := newDesignCommand(runDesign, streams{})
	var out, errb bytes.Buffer
	cmd.SetOut(&out)
	cmd.SetErr(&errb)
	cmd.SetArgs([]string{"--section", "HE 300 B", "--grade", "S275", "--uls", "M=150,V=200", "--category", "A", "--format", "json", "--gap", "8"})
	require.NoError(t, cmd.Execute())
	var doc struct {
		Section string `json:"section"`
		Grade   string `json:"grade"`
		Splice  struct {
			Category string  `json:"category"`
			Gap      float64 `json:"gap"`
		} `json:"splice"`
		Position *float64 `json:"position"`
	}
	require.NoError(t, json.Unmarshal(out.Bytes(), &doc))
	assert.Equal(t, "HE 300 B", doc.Section)
	assert.Equal(t, "S275", doc.Grade)
	assert.Equal(t, "A", doc.Splice.Category)
	assert.Equal(t, 8.0, doc.Splice.Gap)
	assert.Nil(t, doc.Position)
}

// TestDesignFromJob: the job mode takes the envelope forces at --at. For the simply supported
// IPE 300 of simpleJob (6 m, 10 kN/m permanent) at mid-span: M_max = 1.35 wL²/8 = 60.75 kNm and
// M_min = 1.00 wL²/8 = 45 kNm (EN 1990 Table A1.2(B) γG,sup and γG,inf; standard beam tables);
// at 1.5 m from the support |V| = 1.35 (wL/2 − 1.5w) = 20.25 kN.
func TestDesignFromJob(t *testing.T) {
	job := writeJob(t, simpleJob)
	out, stderr, code := run(t, "design", job, "--at", "3", "--format", "json")
	require.Equal(t, 0, code, stderr)
	var got struct {
		Position float64 `json:"position"`
		Forces   struct {
			ULS map[string]float64 `json:"uls"`
		} `json:"forces"`
	}
	require.NoError(t, json.Unmarshal([]byte(out), &got))
	assert.InEpsilon(t, 3.0, got.Position, 1e-9)
	assert.InEpsilon(t, 60.75, got.Forces.ULS["M_max"], 1e-6)
	assert.InEpsilon(t, 45.0, got.Forces.ULS["M_min"], 1e-6)
	out, stderr, code = run(t, "design", job, "--at", "1.5", "--format", "json")
	require.Equal(t, 0, code, stderr)
	require.NoError(t, json.Unmarshal([]byte(out), &got))
	assert.InEpsilon(t, 20.25, got.Forces.ULS["V"], 1e-6)
	_, stderr, code = run(t, "design", job, "--at", "7")
	assert.Equal(t, exitUsage, code)
	assert.Contains(t, stderr, "off the beam")
}
