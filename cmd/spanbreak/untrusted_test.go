package main

import (
	"bytes"
	"os"
	"path/filepath"
	"testing"
	"time"
	"unicode/utf8"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// hostileJob names everything the user writes with terminal control sequences (written as
// YAML escapes): ESC sequences that recolour and clear the screen or set the window title,
// NUL, a C1 CSI (U+009B) and a right-to-left override (U+202E).
const hostileJob = `title: "\e[31mred title\0 \u009b2J\u202e"
beam: {section: IPE 300, spans: [6.0, 6.0], supports: [pinned, roller, roller]}
cases:
  "G\e]0;owned\a": {kind: permanent, loads: [{udl: 10}]}
combinations:
  extra: [{name: "ACC\e[1m", state: uls, factors: {"G\e]0;owned\a": 1.0}}]
limits: {max_piece_length: 7}
vehicles: [{name: "lorry\e[2J", max_length: 13.6, payload: 20000, cost: 800}]
scan: {step: 0.25}
`

// controlIn returns the first control character a terminal would act on in text output
// (anything below U+0020 but the line feed, DEL, C1, the bidirectional controls), or -1.
func controlIn(s string) rune {
	for _, r := range s {
		switch {
		case r == '\n':
		case r < 0x20, r >= 0x7f && r <= 0x9f, r == 0x202e:
			return r
		}
	}
	return -1
}

// Every text output of every command, the error messages included, escapes the control
// characters of the title, the file name and the case, vehicle and combination names.
func TestTextOutputEscapesControlCharacters(t *testing.T) {
	dir := t.TempDir()
	job := filepath.Join(dir, "job\x1b[5m.yaml")
	require.NoError(t, os.WriteFile(job, []byte(hostileJob), 0o644))
	second := filepath.Join(dir, "second.yaml")
	require.NoError(t, os.WriteFile(second, []byte(hostileJob), 0o644))
	clock := func() time.Time { return time.Date(2025, 3, 4, 0, 0, 0, 0, time.UTC) }
	runs := []struct {
		name string
		run  func(streams) error
	}{
		{"check", func(s streams) error { return runCheck(checkOptions{JobFile: job, Format: "text"}, s) }},
		{"analyse", func(s streams) error { return runAnalyse(analyseOptions{JobFile: job, Format: "text", Step: 1}, s) }},
		{"analyse one case", func(s streams) error {
			return runAnalyse(analyseOptions{JobFile: job, Format: "text", Step: 1, Case: "G\x1b]0;owned\a"}, s)
		}},
		{"design", func(s streams) error {
			return runDesign(designOptions{JobFile: job, At: 3, AtSet: true, Format: "text"}, s)
		}},
		{"optimise", func(s streams) error { return runOptimise(optimiseOptions{Paths: []string{job}, Format: "text"}, s) }},
		{"batch", func(s streams) error {
			return runOptimise(optimiseOptions{Paths: []string{job, second}, Format: "text", Jobs: 1}, s)
		}},
		{"report", func(s streams) error {
			return runReport(reportOptions{JobFile: job, Out: filepath.Join(dir, "out\x1b[1m")}, s)
		}},
	}
	for _, r := range runs {
		t.Run(r.name, func(t *testing.T) {
			var out, errs bytes.Buffer
			require.NoError(t, r.run(streams{Out: &out, Err: &errs, Now: clock}))
			text := out.String()
			assert.True(t, utf8.ValidString(text))
			assert.Equal(t, rune(-1), controlIn(text), "%q", text)
			assert.Contains(t, text, `\x1b`)
		})
	}
	// errors: a problem that quotes the file name and a value of the file
	bad := filepath.Join(dir, "bad\x1b]0;owned\a.yaml")
	require.NoError(t, os.WriteFile(bad, []byte(`title: "\e[2J"`+"\nbeam: {}\n"), 0o644))
	var out, errs bytes.Buffer
	assert.Equal(t, exitFailure, execute([]string{"check", bad}, &out, &errs))
	assert.Equal(t, rune(-1), controlIn(errs.String()), "%q", errs.String())
	assert.Contains(t, errs.String(), `bad\x1b]0;owned\x07.yaml`)
	// the title, printed on one line, has its line feeds escaped too
	assert.NotContains(t, errs.String(), "\x1b")
}

// The report is dated by the streams' clock, or by SOURCE_DATE_EPOCH when it is set (the
// reproducible-builds convention: seconds since 1970-01-01 UTC), in its text and in the PDF's
// metadata; a malformed value is a usage error.
func TestReportDateFromClockOrSourceDateEpoch(t *testing.T) {
	clock := func() time.Time { return time.Date(2025, 3, 4, 5, 6, 7, 0, time.UTC) }
	report := func(t *testing.T) ([]byte, error) {
		out := filepath.Join(t.TempDir(), "report")
		var stdout, stderr bytes.Buffer
		if err := runReport(reportOptions{Demo: true, Out: out}, streams{Out: &stdout, Err: &stderr, Now: clock}); err != nil {
			return nil, err
		}
		return os.ReadFile(filepath.Join(out, "report.pdf"))
	}
	t.Run("clock", func(t *testing.T) {
		t.Setenv("SOURCE_DATE_EPOCH", "")
		pdf, err := report(t)
		require.NoError(t, err)
		assert.True(t, bytes.Contains(pdf, []byte("/CreationDate (D:20250304050607")))
	})
	t.Run("SOURCE_DATE_EPOCH", func(t *testing.T) {
		t.Setenv("SOURCE_DATE_EPOCH", "1700000000") // 2023-11-14 22:13:20 UTC
		pdf, err := report(t)
		require.NoError(t, err)
		assert.True(t, bytes.Contains(pdf, []byte("/CreationDate (D:20231114221320")))
		assert.True(t, bytes.Contains(pdf, []byte("/ModDate (D:20231114221320")))
	})
	t.Run("malformed", func(t *testing.T) {
		t.Setenv("SOURCE_DATE_EPOCH", "yesterday")
		_, err := report(t)
		require.Error(t, err)
		assert.Equal(t, exitUsage, exitCode(err))
		assert.Contains(t, err.Error(), "SOURCE_DATE_EPOCH")
	})
}

// An emoji in the title no longer stops the report: it prints as "?" and the warning, at
// the title's line, goes to standard error.
func TestReportWarnsOfTextOutsideTheFont(t *testing.T) {
	dir := t.TempDir()
	job := filepath.Join(dir, "job.yaml")
	require.NoError(t, os.WriteFile(job, []byte(`title: "Girder 🙂 over the depot"
beam: {section: IPE 300, spans: [6.0, 6.0], supports: [pinned, roller, roller]}
cases: {G: {kind: permanent, loads: [{udl: 10}]}}
limits: {max_piece_length: 7}
scan: {step: 0.25}
`), 0o644))
	var stdout, stderr bytes.Buffer
	require.NoError(t, runReport(reportOptions{JobFile: job, Out: filepath.Join(dir, "out")}, streams{Out: &stdout, Err: &stderr}))
	assert.Equal(t, "spanbreak: warning: "+job+":1:8: title: 1 character is not in the report font and print as ?\n", stderr.String())
}
