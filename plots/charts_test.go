package plots

import (
	"fmt"
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/beam"
)

// The chart tests check what each chart marks against the data it was given (not pixels):
// every mark comes from the plotter that draws it.

func marksIn(ms []Mark, panel string) []Mark {
	var out []Mark
	for _, m := range ms {
		if m.Panel == panel {
			out = append(out, m)
		}
	}
	return out
}

func TestEnvelopeChartMarks(t *testing.T) {
	b := newTestBeam(t)
	splices := []float64{19800, 8350, 31000} // deliberately unsorted
	ch, err := EnvelopeChart(EnvelopeInput{Envelopes: &b.env, Model: b.model, KeepOut: b.keepOut(), Splices: splices, Deflection: true})
	require.NoError(t, err)

	sp := ch.MarksOf(MarkSplice)
	for _, panel := range []string{"moment", "shear", "deflection", "beam"} {
		got := marksIn(sp, panel)
		require.Len(t, got, 3, panel)
		for i, want := range []float64{8350, 19800, 31000} {
			assert.InDelta(t, want/1e3, got[i].X, 1e-12, "%s splice %d", panel, i+1)
			assert.Equal(t, fmt.Sprintf("S%d %s", i+1, fmtM(want)), got[i].Label)
		}
	}
	ko := marksIn(ch.MarksOf(MarkKeepOut), "moment")
	require.Len(t, ko, len(b.keepOut()))
	for i, r := range b.keepOut() {
		assert.InDelta(t, r.From/1e3, ko[i].X, 1e-12)
		assert.InDelta(t, r.To/1e3, ko[i].X2, 1e-12)
	}
	sup := ch.MarksOf(MarkSupport)
	require.Len(t, sup, len(b.model.Supports))
	for i, s := range b.model.Supports {
		assert.InDelta(t, s.X/1e3, sup[i].X, 1e-12)
		assert.Equal(t, s.Kind.String(), sup[i].Label)
	}

	// peaks: the largest M max and smallest M min of the envelope, found here by a plain scan
	hi, lo := math.Inf(-1), math.Inf(1)
	var xHi, xLo float64
	for i, s := range b.env.Stations {
		if v := b.env.ULS.MMax[i].Value; v > hi {
			hi, xHi = v, s.X
		}
		if v := b.env.ULS.MMin[i].Value; v < lo {
			lo, xLo = v, s.X
		}
	}
	peaks := marksIn(ch.MarksOf(MarkPeak), "moment")
	require.Len(t, peaks, 2)
	assert.InEpsilon(t, hi/1e6, peaks[0].Y, 1e-12)
	assert.InDelta(t, xHi/1e3, peaks[0].X, 1e-12)
	assert.InEpsilon(t, lo/1e6, peaks[1].Y, 1e-12)
	assert.InDelta(t, xLo/1e3, peaks[1].X, 1e-12)
	assert.Contains(t, peaks[1].Label, "kNm at")
	assert.True(t, strings.HasPrefix(peaks[1].Label, "−"), "hogging peak printed with a minus sign: %q", peaks[1].Label)

	// without deflection there is no deflection panel
	ch, err = EnvelopeChart(EnvelopeInput{Envelopes: &b.env, Model: b.model})
	require.NoError(t, err)
	assert.Empty(t, marksIn(ch.MarksOf(MarkPeak), "deflection"))
	assert.Empty(t, ch.MarksOf(MarkSplice))
}

func TestEnvelopeChartErrors(t *testing.T) {
	b := newTestBeam(t)
	_, err := EnvelopeChart(EnvelopeInput{Model: b.model})
	assert.ErrorContains(t, err, "no envelope stations")
	short := b.env
	short.ULS.VMax = short.ULS.VMax[:3]
	_, err = EnvelopeChart(EnvelopeInput{Envelopes: &short, Model: b.model})
	assert.ErrorContains(t, err, "ULS envelopes of other lengths")
	bad := b.env
	bad.ULS.MMax = append([]beam.Extreme(nil), b.env.ULS.MMax...)
	bad.ULS.MMax[5].Value = math.NaN()
	_, err = EnvelopeChart(EnvelopeInput{Envelopes: &bad, Model: b.model})
	assert.ErrorContains(t, err, "M max[5] is NaN")
}

func TestCostChartMarksTheScan(t *testing.T) {
	b := newTestBeam(t)
	pts := b.scan(t)
	chosen := []float64{8300, 19800, 31000}
	ch, err := CostChart(ScanInput{Model: b.model, Points: pts, Chosen: chosen, Best: 5})
	require.NoError(t, err)

	// the best positions are the points ranked 1 to 5, at their cost
	best := ch.MarksOf(MarkBest)
	require.Len(t, best, 5)
	for r := 1; r <= 5; r++ {
		var p ScanPoint
		for _, q := range pts {
			if q.Rank == r {
				p = q
			}
		}
		assert.InDelta(t, p.X/1e3, best[r-1].X, 1e-12, "rank %d", r)
		assert.InDelta(t, p.Cost, best[r-1].Y, 1e-9, "rank %d", r)
	}
	// every infeasible position lies in exactly one gap, and no feasible position in any
	gaps := ch.MarksOf(MarkGap)
	require.NotEmpty(t, gaps)
	for _, p := range pts {
		in := 0
		for _, g := range gaps {
			if p.X/1e3 >= g.X && p.X/1e3 <= g.X2 {
				in++
			}
		}
		if p.Feasible {
			assert.Zero(t, in, "feasible position %g mm inside a gap", p.X)
		} else {
			assert.Equal(t, 1, in, "infeasible position %g mm", p.X)
		}
	}
	// the chosen splices are drawn where the layout put them, on every panel
	for _, panel := range []string{"cost", "bolts", "beam"} {
		got := marksIn(ch.MarksOf(MarkSplice), panel)
		require.Len(t, got, len(chosen), panel)
		for i, x := range chosen {
			assert.InDelta(t, x/1e3, got[i].X, 1e-12)
		}
	}
}

func TestGaps(t *testing.T) {
	pts := []ScanPoint{
		{X: 100, Feasible: true}, {X: 200, KeepOut: true, Reason: "keep-out A"}, {X: 300, KeepOut: true, Reason: "keep-out A"},
		{X: 400, KeepOut: true, Reason: "keep-out B"}, {X: 500, Feasible: true},
		{X: 600, Governing: "web.bolt.shear", Reason: "fails by 3 %"}, {X: 700, Governing: "web.bolt.shear", Reason: "fails by 5 %"},
		{X: 800, Feasible: true}, {X: 900, Reason: "odd"},
	}
	got := Gaps(pts, 950)
	want := []Gap{
		{From: 150, To: 350, Key: "A", Reason: "keep-out A"},
		{From: 350, To: 450, Key: "B", Reason: "keep-out B"},
		{From: 550, To: 750, Key: "C", Reason: "no splice passes: web.bolt.shear governs"},
		{From: 850, To: 950, Key: "D", Reason: "odd"}, // clipped to the beam end
	}
	assert.Equal(t, want, got)
	assert.Equal(t, "AA", gapKey(26))
	assert.Equal(t, "AZ", gapKey(51))
}

func TestRankList(t *testing.T) {
	tests := []struct {
		in   []int
		want string
	}{
		{[]int{1}, "1"}, {[]int{1, 2, 3, 4, 5}, "1–5"}, {[]int{1, 2, 3, 5}, "1–3, 5"}, {[]int{2, 4}, "2, 4"},
	}
	for _, tt := range tests {
		assert.Equal(t, tt.want, rankList(tt.in))
	}
	pts := []pointLabel{{X: 10}, {X: 10.05}, {X: 20}, {X: 10.1}}
	groupRankLabels(pts, []int{1, 2, 3, 4}, 0.5)
	assert.Equal(t, []string{"1, 2, 4", "", "3", ""}, []string{pts[0].Label, pts[1].Label, pts[2].Label, pts[3].Label})
}

func TestUtilisationChartColoursByFamily(t *testing.T) {
	b := newTestBeam(t)
	pts := b.scan(t)
	ch, err := UtilisationChart(ScanInput{Model: b.model, Points: pts})
	require.NoError(t, err)
	marks := ch.MarksOf(MarkUtil)
	byX := map[float64]Mark{}
	for _, m := range marks {
		byX[m.X] = m
	}
	n := 0
	for _, p := range pts {
		if !p.Feasible {
			assert.NotContains(t, byX, p.X/1e3)
			continue
		}
		n++
		m, ok := byX[p.X/1e3]
		require.True(t, ok, "feasible position %g mm is plotted", p.X)
		assert.InDelta(t, p.Utilisation, m.Y, 1e-12)
		assert.Equal(t, checkFamily(p.Governing), m.Label)
	}
	assert.Len(t, marks, n)
}

func TestCheckFamily(t *testing.T) {
	tests := []struct{ id, want string }{
		{"web.bolt.bearing.beam", "web.bolt"}, {"flange.plate.tension", "flange.plate"}, {"flange.beam.net", "flange.beam"},
		{"detail.spacing", "detail"}, {"detail.fit", "detail"}, {"web.beam.net-shear", "web.beam"}, {"", "other"},
	}
	for _, tt := range tests {
		assert.Equal(t, tt.want, checkFamily(tt.id), tt.id)
	}
	// every family of the check ids in DESIGN.md section 8 has its own legend words
	for _, f := range []string{"flange.bolt", "flange.plate", "flange.beam", "web.bolt", "web.plate", "web.beam", "detail"} {
		label, _, order := familyInfo(f)
		assert.NotEqual(t, f, label)
		assert.Less(t, order, 7)
	}
}

func TestLayoutChartTotals(t *testing.T) {
	ls := testLayouts()
	ch, err := LayoutChart(LayoutInput{Layouts: ls, Chosen: 2})
	require.NoError(t, err)
	tot := ch.MarksOf(MarkTotal)
	require.Len(t, tot, len(ls))
	for i, l := range ls {
		assert.InDelta(t, float64(i), tot[i].X, 0)
		assert.InEpsilon(t, l.Cost.Splices+l.Cost.Transport+l.Cost.Erection, tot[i].Y, 1e-12, "the stack is the sum of its items")
		assert.True(t, strings.HasPrefix(tot[i].Label, formatClean(l.Cost.Total, 0)))
		assert.Equal(t, i == 2, strings.Contains(tot[i].Label, "chosen"))
	}
	_, err = LayoutChart(LayoutInput{})
	assert.ErrorContains(t, err, "no layouts")
	bad := testLayouts()
	bad[1].Cost.Transport = math.Inf(1)
	_, err = LayoutChart(LayoutInput{Layouts: bad})
	assert.ErrorContains(t, err, "layout 1")
}

func TestScanInputErrors(t *testing.T) {
	b := newTestBeam(t)
	_, err := CostChart(ScanInput{Model: b.model})
	assert.ErrorContains(t, err, "no candidate positions")
	_, err = CostChart(ScanInput{Model: b.model, Points: []ScanPoint{{X: 200}, {X: 100}}})
	assert.ErrorContains(t, err, "is not after")
	_, err = UtilisationChart(ScanInput{Model: b.model, Points: []ScanPoint{{X: 100, Feasible: true, Cost: math.NaN()}}})
	assert.ErrorContains(t, err, "not finite")
}

func TestChartsWithNothingFeasible(t *testing.T) {
	b := newTestBeam(t)
	var pts []ScanPoint
	for x := 1000.0; x < b.model.Length; x += 1000 {
		pts = append(pts, ScanPoint{X: x, Governing: "web.bolt.shear", Reason: "fails"})
	}
	in := ScanInput{Model: b.model, Points: pts}
	for _, build := range []func(ScanInput) (*Chart, error){CostChart, UtilisationChart} {
		ch, err := build(in)
		require.NoError(t, err)
		gaps := ch.MarksOf(MarkGap)
		require.Len(t, gaps, 1, "one run, one reason")
		assert.InDelta(t, 0.5, gaps[0].X, 1e-12)
		assert.Empty(t, ch.MarksOf(MarkBest))
		_, err = ch.Bytes(SVG)
		require.NoError(t, err)
	}
	ch, err := LayoutChart(LayoutInput{Layouts: []Layout{{Cost: LayoutCost{Transport: 1450, Erection: 165, Total: 1615}}}, Chosen: 0})
	require.NoError(t, err)
	assert.Equal(t, "1615 (chosen)", ch.MarksOf(MarkTotal)[0].Label)
	assert.Equal(t, "no splice", spliceCount(0))
}
