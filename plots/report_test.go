package plots

import (
	"bytes"
	"encoding/json"
	"fmt"
	"strings"
	"sync"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/optimise"
)

const testCaution = "CAUTION: test caution, check every result."

// demoRun optimises the embedded demo job once for the tests of this file.
func demoRun(t *testing.T) (*optimise.Setup, *optimise.Outcome) {
	t.Helper()
	demo := sync.OnceValues(func() (*optimise.Setup, error) {
		return optimise.Prepare(optimise.DemoJobName, optimise.DemoJob())
	})
	s, err := demo()
	require.NoError(t, err)
	res, err := optimise.Run(s, optimise.Settings{})
	require.NoError(t, err)
	return s, res
}

func demoReport(t *testing.T) (*optimise.Setup, *optimise.Outcome, *Report) {
	t.Helper()
	s, res := demoRun(t)
	rep, err := BuildReport(ReportInput{Outcome: res, Version: "test", Date: "2000-01-01", Caution: testCaution})
	require.NoError(t, err)
	return s, res, rep
}

func TestReportStructure(t *testing.T) {
	_, res, rep := demoReport(t)
	rec := res.Recommended()
	require.NotEmpty(t, rec.Splices, "the demo needs at least one splice")

	assert.True(t, bytes.HasPrefix(rep.PDF, []byte("%PDF-1.")))
	assert.Equal(t, rep.Pages, pdfPageCount(rep.PDF), "the page objects in the file")
	has := func(s string) bool { return strings.Contains(rep.Text, s) }
	assert.True(t, has(fmt.Sprintf("page %d of %d", rep.Pages, rep.Pages)), "the last footer")

	// top-level sections in order, the layout's bill, one calculation sheet per splice of the
	// recommended layout
	want := []string{"Job summary", "Beam and loads", "Envelopes", "The beam itself", "Limits", "Candidate positions", "Layouts",
		"Bill of materials"}
	for i := range rec.Splices {
		want = append(want, fmt.Sprintf("Calculation sheet: splice S%d at x = %s", i+1, fmtM(rec.Splices[i])))
	}
	want = append(want, "Caution and references")
	var got []string
	last := 0
	for _, h := range rep.Headings {
		assert.GreaterOrEqual(t, h.Page, last, "headings run forward through the pages")
		last = h.Page
		if !strings.Contains(h.Number, ".") {
			got = append(got, h.Title)
		}
	}
	assert.Equal(t, want, got)
	// each calculation sheet starts on its own page, after the layouts
	for _, h := range rep.Headings {
		if strings.HasPrefix(h.Title, "Calculation sheet") {
			assert.Greater(t, h.Page, pageOf(rep, "Layouts"))
		}
	}
	// the contents on page 1 gives the pages the headings landed on
	assert.True(t, has(fmt.Sprintf("9: %s: %d", want[8], pageOf(rep, want[8]))), "contents line of the first sheet")
	assert.Equal(t, 1, pageOf(rep, "Job summary"))
	assert.LessOrEqual(t, pageOf(rep, "Caution and references"), rep.Pages)
}

func pageOf(rep *Report, title string) int {
	for _, h := range rep.Headings {
		if h.Title == title {
			return h.Page
		}
	}
	return -1
}

func TestReportTextHoldsTheResult(t *testing.T) {
	_, res, rep := demoReport(t)
	rec := res.Recommended()
	require.Len(t, rep.Sheets, len(rec.Splices))
	has := func(s string) bool { return strings.Contains(rep.Text, s) }
	for i, x := range rec.Splices {
		sh := rep.Sheets[i]
		assert.InDelta(t, x, sh.Position, 1e-9)
		assert.True(t, has(fmt.Sprintf("S%d at %s", i+1, fmtM(x))), "chosen position in the summary")
		assert.True(t, has("governing check "+sh.Result.Governing.ID+" ("+sh.Result.Governing.Clause+")"))
		assert.True(t, has("Governing check: "+sh.Result.Governing.ID))
		// the full sheet: every check with its clause, formula and numbers
		for _, c := range sh.Result.Checks {
			assert.True(t, has(c.ID+" — "+c.Clause))
			if c.Formula != "" {
				assert.True(t, has("Formula: "+c.Formula))
			}
		}
		assert.NotEmpty(t, sh.Result.Checks[0].Substituted, "the sheet is re-checked with the full trace")
	}
	assert.GreaterOrEqual(t, strings.Count(rep.Text, testCaution), 2, "the caution on the first page and at the end")
	assert.True(t, has("2000-01-01"))
	assert.True(t, has("spanbreak test"))
	assert.True(t, has(res.Setup.Zones[0].Reason))
	// the bolt assemblies and the bills: the layout's and each splice's, and the parts lists
	bill := res.Bill()
	for _, it := range bill.Total.Items {
		assert.True(t, has(it.Name), "the layout's bill lists %s", it.Name)
	}
	for _, a := range rep.Sheets[0].Result.Assemblies {
		assert.True(t, has(a.Assembly.Designation), "the sheet names the %s assembly", a.Group)
	}
	assert.True(t, has("(from the length)"), "the planes table says how each plane was placed")
	assert.True(t, has("Bill of materials"))
	// the demo roof has a category H imposed load, snow and wind: the rule is named
	assert.True(t, has("The imposed load on the roof (category H) is not combined with snow or wind (EN 1990 A1.2.1(3)"))
}

func TestReportPDFTextWithPdftotext(t *testing.T) {
	_, res, rep := demoReport(t)
	text := pdfText(t, rep.PDF)
	for _, x := range res.Recommended().Splices {
		assert.Contains(t, text, fmtM(x))
	}
	assert.Contains(t, text, rep.Sheets[0].Result.Governing.ID)
	assert.Contains(t, text, "CAUTION: test caution")
	assert.Contains(t, text, "Calculation sheet: splice S1")
}

func TestReportIsDeterministic(t *testing.T) {
	_, _, a := demoReport(t)
	_, _, b := demoReport(t)
	assert.True(t, bytes.Equal(a.PDF, b.PDF), "two builds from the same input give the same PDF bytes")
}

func TestReportFiguresMarkTheResult(t *testing.T) {
	_, res, rep := demoReport(t)
	rec := res.Recommended()
	names := map[string]bool{}
	for _, f := range rep.Figures {
		names[f.Name] = true
	}
	for _, n := range []string{"envelopes", "cost", "utilisation", "layouts"} {
		assert.True(t, names[n], n)
	}
	for i := range rec.Splices {
		assert.True(t, names[fmt.Sprintf("splice-s%d", i+1)])
	}
	// the chosen positions appear where the layout search put them, on every chart along the beam
	for _, chart := range []string{"envelopes", "cost", "utilisation"} {
		got := marksIn(rep.Charts[chart].MarksOf(MarkSplice), "beam")
		require.Len(t, got, len(rec.Splices), chart)
		for i, x := range rec.Splices {
			assert.InDelta(t, x/1e3, got[i].X, 1e-12, chart)
		}
	}
	// the best-ranked marks are the scan's ranks 1..5 at their positions and costs
	best := rep.Charts["cost"].MarksOf(MarkBest)
	require.Len(t, best, 5)
	for _, m := range best {
		c := res.CandidateAt(m.X * 1e3)
		require.NotNil(t, c)
		assert.True(t, c.Feasible)
		assert.LessOrEqual(t, c.Rank, 5)
		assert.InDelta(t, c.Design.Cost, m.Y, 1e-9)
	}
	// every candidate in a keep-out zone lies in a gap of the cost chart, every feasible one outside
	gaps := rep.Charts["cost"].MarksOf(MarkGap)
	inGap := func(x float64) bool {
		for _, g := range gaps {
			if x/1e3 >= g.X && x/1e3 <= g.X2 {
				return true
			}
		}
		return false
	}
	for _, c := range res.Candidates {
		assert.Equal(t, !c.Feasible, inGap(c.X), "candidate at %g mm (feasible %v)", c.X, c.Feasible)
	}
	// the layout chart marks the recommended layout
	tot := rep.Charts["layouts"].MarksOf(MarkTotal)
	require.Len(t, tot, len(res.Layouts.ByCount))
	assert.Contains(t, tot[res.Layouts.Recommended].Label, "chosen")
}

func TestReportInputErrors(t *testing.T) {
	_, err := BuildReport(ReportInput{})
	assert.ErrorContains(t, err, "needs the optimisation outcome")
	_, res := demoRun(t)
	empty := *res
	empty.Layouts = optimise.LayoutResult{}
	_, err = BuildReport(ReportInput{Outcome: &empty})
	assert.ErrorContains(t, err, "no layout")
}

func mustJSON(t *testing.T, v any) string {
	t.Helper()
	b, err := json.Marshal(v)
	require.NoError(t, err)
	return string(b)
}

// TestReportTracesForces: every extreme, reaction and design force in the report names the
// combination and pattern that produces it (the analysis's own words), and the beam's own
// checks are reported with their clauses.
func TestReportTracesForces(t *testing.T) {
	_, res, rep := demoReport(t)
	has := func(s string) bool { return strings.Contains(rep.Text, s) }
	env := &res.Envelopes
	for _, r := range env.ULSReactions {
		assert.True(t, has(env.Governing(r.FzMax)), "reaction at %g mm: %s", r.X, env.Governing(r.FzMax))
		assert.True(t, has(env.Governing(r.FzMin)))
	}
	for _, r := range env.SLSReactions {
		assert.True(t, has(env.Governing(r.FzMax)))
	}
	assert.True(t, has("Support reactions"))
	for _, sh := range rep.Sheets {
		for _, o := range []string{sh.Origins.ULS.MMax, sh.Origins.ULS.MMin, sh.Origins.ULS.V, sh.Origins.SLS.MMax} {
			require.NotEmpty(t, o)
			assert.True(t, has(o), "sheet %s: %s", sh.Name, o)
		}
		assert.True(t, has("The beam here (EN 1993-1-1 6.2)"))
	}
	assert.True(t, has("The beam itself"))
	assert.True(t, has("lateral-torsional buckling"))
	m := res.Member.Member
	assert.True(t, has(fmt.Sprintf("Mc,Rd = %s kNm", kNm(m.McRd))))
	for _, d := range res.Member.Deflection.Regions {
		assert.True(t, has(d.Region.Name))
	}
}

// TestReportOfALayoutPlacedByHand: the report of Outcome.WithLayout describes the hand-placed
// layout — its positions, its sheets, the comparison with the optimiser — and not the search's.
func TestReportOfALayoutPlacedByHand(t *testing.T) {
	_, res := demoRun(t)
	e, err := res.Evaluate([]float64{13000, 26500})
	require.NoError(t, err)
	require.True(t, e.Feasible, "%v", e.Reasons)
	placed, err := res.WithLayout(e)
	require.NoError(t, err)
	rep, err := BuildReport(ReportInput{Outcome: placed, Version: "test", Date: "2000-01-01", Caution: testCaution})
	require.NoError(t, err)
	for _, want := range []string{"Layout placed by hand", "The layout placed by hand", "Pieces of the layout placed by hand",
		"placed by hand (spanbreak view): splices at 13, 26.5 m", "Calculation sheet: splice S1 at x = " + fmtM(13000),
		"Calculation sheet: splice S2 at x = " + fmtM(26500)} {
		assert.Contains(t, rep.Text, want)
	}
	assert.NotContains(t, rep.Text, "(recommended)", "the hand layout is not the optimiser's recommendation")
	require.Len(t, rep.Sheets, 2)
}
