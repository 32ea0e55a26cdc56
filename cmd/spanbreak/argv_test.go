package main

import (
	"bytes"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// recorded holds the options each command's runner received.
type recorded struct {
	analyse  *analyseOptions
	check    *checkOptions
	demo     *demoOptions
	design   *designOptions
	init     *initOptions
	optimise *optimiseOptions
	report   *reportOptions
	sections *sectionsOptions
	view     *viewOptions
}

// parseArgs runs one command line through the real command tree with runners that only
// record their options: flags → options, with no job run.
func parseArgs(t *testing.T, args ...string) (recorded, int, string) {
	t.Helper()
	var got recorded
	r := runners{
		Analyse:  func(o analyseOptions, _ streams) error { got.analyse = &o; return nil },
		Check:    func(o checkOptions, _ streams) error { got.check = &o; return nil },
		Demo:     func(o demoOptions, _ streams) error { got.demo = &o; return nil },
		Design:   func(o designOptions, _ streams) error { got.design = &o; return nil },
		Init:     func(o initOptions, _ streams) error { got.init = &o; return nil },
		Optimise: func(o optimiseOptions, _ streams) error { got.optimise = &o; return nil },
		Report:   func(o reportOptions, _ streams) error { got.report = &o; return nil },
		Sections: func(o sectionsOptions, _ streams) error { got.sections = &o; return nil },
		View:     func(o viewOptions, _ streams) error { got.view = &o; return nil },
	}
	var out, errb bytes.Buffer
	code := executeWith(args, r, streams{Out: &out, Err: &errb})
	return got, code, errb.String()
}

func TestArgvToOptions(t *testing.T) {
	got, code, stderr := parseArgs(t, "analyse", "job.yaml", "--format", "csv", "--step", "0.5", "--at", "1.5,3", "--case", "G")
	require.Equal(t, exitOK, code, stderr)
	assert.Equal(t, analyseOptions{JobFile: "job.yaml", Format: "csv", Step: 500, At: []float64{1500, 3000}, Case: "G"}, *got.analyse)

	got, code, stderr = parseArgs(t, "check", "job.yaml", "--format", "json")
	require.Equal(t, exitOK, code, stderr)
	assert.Equal(t, checkOptions{JobFile: "job.yaml", Format: "json"}, *got.check)

	got, code, stderr = parseArgs(t, "demo", "--no-report", "--format", "json", "--out", "d", "--force")
	require.Equal(t, exitOK, code, stderr)
	assert.Equal(t, demoOptions{Format: "json", Out: "d", Force: true, NoReport: true}, *got.demo)

	got, code, stderr = parseArgs(t, "design", "job.yaml", "--at", "4.5", "--splice", "s.yaml", "--format", "json")
	require.Equal(t, exitOK, code, stderr)
	d := *got.design
	assert.Equal(t, "job.yaml", d.JobFile)
	assert.Equal(t, 4500.0, d.At, "mm")
	assert.True(t, d.AtSet)
	assert.Equal(t, "s.yaml", d.SpliceFile)
	assert.Equal(t, "json", d.Format)
	assert.Equal(t, "S355", d.Grade, "default grade")

	got, code, stderr = parseArgs(t, "design", "--section", "IPE 500", "--uls", "M=400,V=300", "--sls", "M=300", "--category", "B",
		"--friction-class", "C", "--distribution", "flanges-only", "--gap", "8", "--plate-grade", "S275")
	require.Equal(t, exitOK, code, stderr)
	d = *got.design
	assert.Equal(t, designOptions{Section: "IPE 500", Grade: "S355", PlateGrade: "S275", ULS: "M=400,V=300", SLS: "M=300",
		Format: "text", Category: "B", FrictionClass: "C", Distribution: "flanges-only", Gap: 8}, d)

	got, code, stderr = parseArgs(t, "init", "job.yaml", "--force")
	require.Equal(t, exitOK, code, stderr)
	assert.Equal(t, initOptions{File: "job.yaml", Force: true}, *got.init)

	got, code, stderr = parseArgs(t, "optimise", "a.yaml", "b.yaml", "--step", "0.1", "--rank", "bolts", "--exhaustive",
		"--out", "o", "--force", "--jobs", "3", "--format", "csv")
	require.Equal(t, exitOK, code, stderr)
	assert.Equal(t, optimiseOptions{Paths: []string{"a.yaml", "b.yaml"}, Format: "csv", Step: 100, Rank: "bolts", Exhaustive: true,
		Out: "o", Force: true, Jobs: 3}, *got.optimise)

	got, code, stderr = parseArgs(t, "report", "job.yaml", "--out", "r", "--force", "--step", "0.2")
	require.Equal(t, exitOK, code, stderr)
	assert.Equal(t, reportOptions{JobFile: "job.yaml", Out: "r", Force: true, Step: 200}, *got.report)

	got, code, stderr = parseArgs(t, "sections", "HEB", "--format", "json")
	require.Equal(t, exitOK, code, stderr)
	assert.Equal(t, sectionsOptions{Filter: "HEB", Format: "json"}, *got.sections)

	got, code, stderr = parseArgs(t, "view", "job.yaml", "--port", "8123", "--no-open")
	require.Equal(t, exitOK, code, stderr)
	assert.Equal(t, viewOptions{JobFile: "job.yaml", Port: 8123, NoOpen: true}, *got.view)
	got, code, stderr = parseArgs(t, "view", "job.yaml")
	require.Equal(t, exitOK, code, stderr)
	assert.Equal(t, viewOptions{JobFile: "job.yaml"}, *got.view, "a free port, and the browser opens")
}

// TestArgvMistakesAreUsage: a bad command line is exit 2 before any runner is called.
func TestArgvMistakesAreUsage(t *testing.T) {
	for _, args := range [][]string{
		{"analyse"},                          // the job file is required
		{"analyse", "a.yaml", "b.yaml"},      // only one
		{"analyse", "a.yaml", "--step", "x"}, // not a number
		{"optimise"},
		{"report", "--out", "r"},
		{"check", "a.yaml", "--nope"},
		{"init", "a", "b"},
		{"demo", "extra"},
		{"view"},
		{"view", "a.yaml", "--port", "x"},
		{"nocommand"},
	} {
		got, code, _ := parseArgs(t, args...)
		assert.Equal(t, exitUsage, code, "%q", args)
		assert.Equal(t, recorded{}, got, "%q: no runner is called", args)
	}
}

// TestStreamsTerminal: a progress bar is drawn only when stderr is a terminal.
func TestStreamsTerminal(t *testing.T) {
	var errb bytes.Buffer
	progress, finish := progressReporter(streams{Err: &errb}, 3)
	assert.Nil(t, progress, "not a terminal: no bar")
	finish()
	assert.Empty(t, errb.String())
	progress, finish = progressReporter(streams{Err: &errb, ErrTerminal: true}, 3)
	require.NotNil(t, progress)
	progress(1, 3)
	finish()
	assert.Contains(t, errb.String(), "optimising")
}
