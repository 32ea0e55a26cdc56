package main

import (
	"encoding/json"
	"path/filepath"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestLengthFlagsTakeUnits: positions and steps take the job file's length units; a bare
// number is in m (a gap in mm). The options hold mm. 1 m = 1000 mm and 1 cm = 10 mm are the
// SI prefixes (BIPM, The International System of Units, 9th edition, Table 7). Before, "9 m"
// was refused with strconv.ParseFloat's own message.
func TestLengthFlagsTakeUnits(t *testing.T) {
	got, code, stderr := parseArgs(t, "analyse", "job.yaml", "--at", "9 m,9000 mm", "--at", "1.5", "--step", "50 mm")
	require.Equal(t, exitOK, code, stderr)
	assert.Equal(t, []float64{9 * 1000, 9000, 1.5 * 1000}, got.analyse.At, "a repeated --at adds to the list")
	assert.Equal(t, 50.0, got.analyse.Step)

	got, code, stderr = parseArgs(t, "analyse", "job.yaml")
	require.Equal(t, exitOK, code, stderr)
	assert.Equal(t, 0.25*1000, got.analyse.Step, "the default station spacing, 0.25 m")
	assert.Empty(t, got.analyse.At)

	got, code, stderr = parseArgs(t, "design", "job.yaml", "--at", "9000 mm")
	require.Equal(t, exitOK, code, stderr)
	assert.Equal(t, 9000.0, got.design.At)
	assert.True(t, got.design.AtSet)

	got, code, stderr = parseArgs(t, "design", "--section", "IPE 500", "--uls", "M=1", "--gap", "1 cm")
	require.Equal(t, exitOK, code, stderr)
	assert.Equal(t, 1*10.0, got.design.Gap, "1 cm = 10 mm")

	got, code, stderr = parseArgs(t, "optimise", "job.yaml", "--step", "5cm")
	require.Equal(t, exitOK, code, stderr)
	assert.Equal(t, 5*10.0, got.optimise.Step)

	got, code, stderr = parseArgs(t, "report", "job.yaml", "--out", "r", "--step", "0.1")
	require.Equal(t, exitOK, code, stderr)
	assert.Equal(t, 0.1*1000, got.report.Step)
}

// TestBadFlagValuesAreUsageErrors: every flag value that cannot be used is exit 2 before any
// runner runs, the message names the flag and speaks in the flag's unit, and no parser's
// internals leak. Before, --step 0 and --step nan reached the runner (optimise then used the
// job's step; report blamed the job file with exit 1), and "9 m" failed with strconv's text.
func TestBadFlagValuesAreUsageErrors(t *testing.T) {
	rows := []struct {
		args []string
		want []string
	}{
		{[]string{"analyse", "a.yaml", "--at", "-5"}, []string{`--at "-5"`, "0 m or more, got -5 m"}},
		{[]string{"analyse", "a.yaml", "--at", "1,-2"}, []string{`--at "1,-2"`, "got -2 m"}},
		{[]string{"analyse", "a.yaml", "--at", "1,,2"}, []string{`--at "1,,2"`, "empty position"}},
		{[]string{"analyse", "a.yaml", "--at", "9 kN"}, []string{`--at "9 kN"`, "is a force; want a length"}},
		{[]string{"analyse", "a.yaml", "--at", "9 x"}, []string{`--at "9 x"`, `unknown unit "x"`}},
		{[]string{"analyse", "a.yaml", "--step", "-0.5"}, []string{`--step "-0.5"`, "got -0.5 m"}},
		{[]string{"analyse", "a.yaml", "--step", "0"}, []string{`--step "0"`, "more than 0 m"}},
		{[]string{"analyse", "a.yaml", "--step", "x"}, []string{`--step "x"`, "want a length"}},
		{[]string{"optimise", "a.yaml", "--step", "0"}, []string{`--step "0"`, "more than 0 m"}},
		{[]string{"optimise", "a.yaml", "--step", "nan"}, []string{`--step "nan"`}},
		{[]string{"optimise", "a.yaml", "--step", "-Inf"}, []string{`--step "-Inf"`}},
		{[]string{"optimise", "a.yaml", "--step", "1e999"}, []string{`--step "1e999"`, "out of range"}},
		{[]string{"optimise", "a.yaml", "--jobs", "x"}, []string{`--jobs "x"`, "want a whole number"}},
		{[]string{"optimise", "a.yaml", "--force=maybe"}, []string{`--force "maybe"`, "want true or false"}},
		{[]string{"report", "a.yaml", "--out", "r", "--step", "nan"}, []string{`--step "nan"`}},
		{[]string{"report", "a.yaml", "--out", "r", "--step", "0"}, []string{`--step "0"`}},
		{[]string{"design", "a.yaml", "--at", "nan"}, []string{`--at "nan"`}},
		{[]string{"design", "a.yaml", "--at", "-0.5"}, []string{`--at "-0.5"`, "got -0.5 m"}},
		{[]string{"design", "--section", "IPE 500", "--uls", "M=1", "--gap", "nan"}, []string{`--gap "nan"`, "in mm"}},
		{[]string{"design", "--section", "IPE 500", "--uls", "M=1", "--gap", "-5"}, []string{`--gap "-5"`, "got -5 mm"}},
	}
	for _, r := range rows {
		got, code, stderr := parseArgs(t, r.args...)
		assert.Equal(t, exitUsage, code, "%q: %s", r.args, stderr)
		assert.Equal(t, recorded{}, got, "%q: no runner is called", r.args)
		for _, w := range r.want {
			assert.Contains(t, stderr, w, "%q", r.args)
		}
		assert.NotContains(t, stderr, "strconv", "%q", r.args)
		assert.NotContains(t, stderr, "invalid argument", "%q", r.args)
	}
}

// TestBadFlagValuesAgainstTheJob: values that only the job's beam can judge are still exit 2,
// naming the flag, in metres, and nothing is written. Before, optimise --step 1e-300 and
// report --step 1e-7 were blamed on the job's scan.step with exit 1 (and counted
// 9223372036854775807 positions), analyse --at 7 answered in mm, and design --uls M=1e308
// was a member-check failure with exit 1.
func TestBadFlagValuesAgainstTheJob(t *testing.T) {
	job := writeJob(t, simpleJob) // 6 m
	out := filepath.Join(t.TempDir(), "report")
	rows := []struct {
		args []string
		want []string
	}{
		// 6 m every 1e-300 m: beyond any count, and beyond optimise.MaxCandidates (200 000)
		{[]string{"optimise", job, "--step", "1e-300"}, []string{"--step: ", "1e-300 m", "at most 200000"}},
		// 6 m every 0.01 mm: 600 000 positions
		{[]string{"optimise", job, "--step", "0.01 mm"}, []string{"--step: ", "1e-05 m gives 599999 positions on a 6 m beam"}},
		{[]string{"report", job, "--out", out, "--step", "1e-7"}, []string{"--step: ", "1e-07 m"}},
		// 6 m every 0.001 mm: 6 000 000 stations, beyond beam.MaxStations (1 000 000)
		{[]string{"analyse", job, "--step", "0.001 mm"}, []string{"--step: ", "1e-06 m gives 6000000 stations", "at most 1000000"}},
		{[]string{"analyse", job, "--at", "7"}, []string{"--at: 7 m is off the beam (0 to 6 m)"}},
		{[]string{"analyse", job, "--at", "3,7000 mm"}, []string{"--at: 7 m is off the beam"}},
		{[]string{"design", job, "--at", "6.5"}, []string{"--at: 6.5 m is off the beam (0 to 6 m)"}},
		{[]string{"design", "--section", "IPE 500", "--uls", "M=1e308"}, []string{"--uls: M = 1e308 kNm", "at most 100000 kNm"}},
		{[]string{"design", "--section", "IPE 500", "--uls", "V=1e9"}, []string{"--uls: V = 1e9 kN", "at most 100000 kN"}},
		{[]string{"design", "--section", "IPE 500", "--uls", "M=100", "--sls", "N_min=-2e5"}, []string{"--sls: N_min = -2e5 kN"}},
		{[]string{"design", "--section", "IPE 500", "--uls", "M=inf"}, []string{"--uls: M = \"inf\" is not a finite number in kNm"}},
	}
	for _, r := range rows {
		stdout, stderr, code := run(t, r.args...)
		assert.Equal(t, exitUsage, code, "%q: %s", r.args, stderr)
		assert.Empty(t, stdout, "%q", r.args)
		for _, w := range r.want {
			assert.Contains(t, stderr, w, "%q", r.args)
		}
		assert.NotContains(t, stderr, "scan.step", "%q: the flag, not the job file", r.args)
		assert.NotContains(t, stderr, " mm", "%q: in the flag's unit", r.args)
		assert.NotContains(t, stderr, "9223372036854775807", "%q", r.args)
	}
	assert.NoDirExists(t, out, "nothing is written")
}

// TestBatchStepTooFineIsUsage: a --step too fine for a job of a batch is the command line's
// mistake, exit 2 naming the flag, although the summary is printed.
func TestBatchStepTooFineIsUsage(t *testing.T) {
	a, b := writeJob(t, simpleJob), writeJob(t, simpleJob)
	stdout, stderr, code := run(t, "optimise", a, b, "--step", "1e-300", "--format", "json")
	assert.Equal(t, exitUsage, code, stderr)
	assert.Contains(t, stderr, "--step: ")
	var doc struct {
		Jobs []struct {
			Error *string `json:"error"`
		} `json:"jobs"`
	}
	require.NoError(t, json.Unmarshal([]byte(stdout), &doc))
	require.Len(t, doc.Jobs, 2)
	require.NotNil(t, doc.Jobs[0].Error)
}

// TestPositionsWithUnitsEndToEnd: "3 m" and "3000 mm" are the same station.
func TestPositionsWithUnitsEndToEnd(t *testing.T) {
	stdout, stderr, code := run(t, "analyse", writeJob(t, simpleJob), "--case", "G", "--at", "3 m,3000 mm,300cm", "--format", "json")
	require.Equal(t, exitOK, code, stderr)
	var doc struct {
		Stations []float64 `json:"stations"`
		M        []float64 `json:"M"`
	}
	require.NoError(t, json.Unmarshal([]byte(stdout), &doc))
	assert.Equal(t, []float64{3, 3, 3}, doc.Stations)
	// wL²/8 = 10·6²/8 = 45 kNm at midspan (standard beam tables; simpleJob's comment)
	for _, m := range doc.M {
		assert.InDelta(t, 10*6.0*6/8, m, 1e-6)
	}
}
