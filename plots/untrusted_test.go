package plots

import (
	"bytes"
	"strings"
	"testing"
	"time"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/optimise"
)

// fontJob names its title, a case and a vehicle with characters outside the report fonts
// (emoji, beyond U+FFFF) and one the fonts have (é). Invented data.
const fontJob = `title: "Girder 🙂 over the 🚌 depot, café"
beam: {section: IPE 300, spans: [6.0, 6.0], supports: [pinned, roller, roller]}
cases: {"G🏗": {kind: permanent, loads: [{udl: 10}]}}
limits: {max_piece_length: 7}
vehicles: [{name: "lorry 🚚", max_length: 13.6, payload: 20000, cost: 800}]
scan: {step: 0.25}
`

func fontOutcome(t *testing.T) *optimise.Outcome {
	t.Helper()
	s, err := optimise.Prepare("job.yaml", []byte(fontJob))
	require.NoError(t, err)
	o, err := optimise.Run(s, optimise.Settings{})
	require.NoError(t, err)
	return o
}

// Text the report fonts cannot show prints as "?" and is reported at its key; the report is
// still written (it failed with "character outside the supported range" before).
func TestReportFitsTextToTheFonts(t *testing.T) {
	rep, err := BuildReport(ReportInput{Outcome: fontOutcome(t), Version: "test", Date: "2000-01-01", Caution: testCaution})
	require.NoError(t, err)
	assert.Contains(t, rep.Text, "Girder ? over the ? depot, café")
	assert.Contains(t, rep.Text, "lorry ?")
	assert.NotContains(t, rep.Text, "🙂")
	assert.Equal(t, []string{
		"job.yaml:1:8: title: 2 characters are not in the report font and print as ?",
		`job.yaml:3:9: cases["G🏗"]: 1 character is not in the report font and print as ?`,
		"job.yaml:5:19: vehicles[0].name: 1 character is not in the report font and print as ?",
	}, rep.Warnings)
	assert.Contains(t, pdfText(t, rep.PDF), "Girder ? over the ? depot")
}

// The report's own text is all in the fonts: fitting it changes nothing, and the demo
// report has no warnings.
func TestReportTextIsInTheFonts(t *testing.T) {
	_, _, rep := demoReport(t)
	assert.Empty(t, rep.Warnings)
	for _, line := range strings.Split(rep.Text, "\n") {
		if out, n := fitFont(line); n > 0 {
			t.Errorf("the report prints characters outside its fonts: %q → %q", line, out)
		}
	}
	assert.True(t, inFont('≤') && inFont('γ') && inFont('é') && inFont('²'), "the calculation's symbols")
	assert.False(t, inFont('🙂') || inFont(0x1b), "emoji and control characters")
}

// The PDF is dated by the run's time (Time), and by the fixed 2000-01-01 when none is given,
// so that a test's PDF stays a pure function of its input.
func TestReportPDFDates(t *testing.T) {
	_, res := demoRun(t)
	when := time.Date(2025, 3, 4, 5, 6, 7, 0, time.UTC)
	rep, err := BuildReport(ReportInput{Outcome: res, Version: "test", Time: when, Caution: testCaution})
	require.NoError(t, err)
	assert.True(t, bytes.Contains(rep.PDF, []byte("/CreationDate (D:20250304050607")), "creation date")
	assert.True(t, bytes.Contains(rep.PDF, []byte("/ModDate (D:20250304050607")), "modification date")
	assert.Contains(t, rep.Text, "2025-03-04", "the printed date follows the time")
	_, _, fixed := demoReport(t)
	assert.True(t, bytes.Contains(fixed.PDF, []byte("/CreationDate (D:20000101000000")))
}
