package plots

import (
	"errors"
	"fmt"
	"os"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/optimise"
)

func fmtNum(mm float64) string { return formatClean(mm/1e3, 3) }

// infeasibleReport builds the report of a job where no layout fits: the IPE 300 of
// no-splice-midspan.yaml, whose midspan no splice of its design space passes.
func infeasibleReport(t *testing.T) (*optimise.Outcome, *Report) {
	t.Helper()
	const file = "../optimise/testdata/no-splice-midspan.yaml"
	data, err := os.ReadFile(file)
	require.NoError(t, err)
	s, err := optimise.Prepare(file, data)
	require.NoError(t, err)
	res, err := optimise.Run(s, optimise.Settings{})
	var inf *optimise.InfeasibleError
	require.True(t, errors.As(err, &inf), "the job must have no layout: %v", err)
	rep, err := BuildReport(ReportInput{Outcome: res, Version: "test", Date: "2000-01-01", Caution: testCaution})
	require.NoError(t, err)
	return res, rep
}

// TestReportWithoutALayoutSaysWhy: the report of a run without a layout has everything up
// to the candidate positions, then "Why no layout fits" with every line of the diagnosis in
// place of the layouts and the calculation sheets.
func TestReportWithoutALayoutSaysWhy(t *testing.T) {
	res, rep := infeasibleReport(t)
	var got []string
	for _, h := range rep.Headings {
		if !strings.Contains(h.Number, ".") {
			got = append(got, h.Title)
		}
	}
	assert.Equal(t, []string{"Job summary", "Beam and loads", "Envelopes", "The beam itself", "Limits", "Candidate positions",
		"Why no layout fits", "Caution and references"}, got)
	assert.Empty(t, rep.Sheets)
	names := map[string]bool{}
	for _, f := range rep.Figures {
		names[f.Name] = true
	}
	assert.Equal(t, map[string]bool{"envelopes": true, "cost": true, "utilisation": true}, names, "no layout chart, no drawings")

	why := strings.Index(rep.Text, "Why no layout fits\n")
	require.Positive(t, why)
	for _, l := range res.Diagnosis.Lines() {
		assert.Contains(t, rep.Text[why:], l, "every finding in the section")
	}
	f := res.Diagnosis[0]
	require.Equal(t, optimise.FindingStretch, f.Kind)
	assert.Contains(t, rep.Text, "none: no layout satisfies the limits")
	assert.Contains(t, rep.Text, "Why: "+f.Message, "the first finding in the summary")
	// the table of stretches: the closest attempt's check and utilisation, M_Ed and the beam's
	// Mpl,Rd; V_Ed is below Vpl,Rd, which is not given
	row := strings.Join([]string{fmtNum(f.From), fmtNum(f.To), fmt.Sprint(f.Positions), fmtNum(f.At), f.Check,
		fixed(f.Utilisation, 3), kNm(f.MEd), kNm(f.McRd), kN(f.VEd), "–"}, " | ")
	assert.Contains(t, rep.Text[why:], "\n"+row+"\n")
	assert.Equal(t, rep.Pages, pdfPageCount(rep.PDF))
	assert.Contains(t, pdfText(t, rep.PDF), "Why no layout fits")
}
