package plots

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"spanbreak/beam"
)

// ScanPoint is one candidate splice position as the charts see it.
type ScanPoint struct {
	X           float64 // [mm] from the left end
	Feasible    bool    // a splice may go here and one passes every check
	KeepOut     bool    // inside a keep-out zone (not evaluated)
	Reason      string  // why not, when not feasible
	Cost        float64 // cheapest splice [currency]; feasible points only
	Bolts       int     // bolt assemblies of that splice
	PlateMass   float64 // its cover plates [kg]
	Utilisation float64 // its governing utilisation
	Governing   string  // id of its governing check, e.g. "web.bolt.bearing.beam"
	Rank        int     // 1 = best position by the run's ranking; 0 when not ranked
}

// ScanInput is what the position charts show.
type ScanInput struct {
	Title    string
	Model    beam.Model  // length and supports
	Points   []ScanPoint // ascending X
	Chosen   []float64   // splice positions of the chosen layout [mm]
	Best     int         // how many of the best-ranked positions to mark; 0 means 5
	Currency string      // cost unit shown on the axis, e.g. "EUR"; empty: "cost units"
	// ShowFailing draws, on the utilisation chart, the positions where the splice was checked
	// and fails (utilisation above 1) too: the utilisation of one fixed splice along the beam.
	ShowFailing bool
}

// Gap is a run of candidate positions where no splice may go, as the charts shade it.
type Gap struct {
	From, To float64 // [mm], from half a step before the first position to half after the last
	Key      string  // letter on the chart
	Reason   string  // the reason, shared by every position of the run
}

func (in *ScanInput) validate() error {
	if len(in.Points) == 0 {
		return errors.New("no candidate positions to plot")
	}
	if !(in.Model.Length > 0) {
		return fmt.Errorf("beam length %g mm must be positive", in.Model.Length)
	}
	var errs []error
	for i, p := range in.Points {
		if i > 0 && !(p.X > in.Points[i-1].X) {
			errs = append(errs, fmt.Errorf("candidate %d at %g mm is not after candidate %d at %g mm", i, p.X, i-1, in.Points[i-1].X))
		}
		for _, v := range []float64{p.X, p.Cost, p.PlateMass, p.Utilisation} {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				errs = append(errs, fmt.Errorf("candidate %d at %g mm has a value that is not finite", i, p.X))
				break
			}
		}
	}
	return errors.Join(errs...)
}

func (in *ScanInput) currency() string {
	if in.Currency == "" {
		return "cost units"
	}
	return in.Currency
}

// gapReason is the text shared by a run of infeasible positions: a keep-out zone's own reason,
// or the check that no splice passes.
func gapReason(p ScanPoint) string {
	if p.KeepOut {
		return p.Reason
	}
	if p.Governing != "" {
		return "no splice passes: " + p.Governing + " governs"
	}
	if p.Reason != "" {
		return p.Reason
	}
	return "no splice passes"
}

// Gaps returns the runs of infeasible positions, each with one reason, lettered A, B, ... from
// the left. A run spans half the scan step either side of its positions, clipped to the beam.
func Gaps(points []ScanPoint, length float64) []Gap {
	step := scanStep(points)
	var gaps []Gap
	for i := 0; i < len(points); {
		if points[i].Feasible {
			i++
			continue
		}
		reason := gapReason(points[i])
		j := i
		for j+1 < len(points) && !points[j+1].Feasible && gapReason(points[j+1]) == reason {
			j++
		}
		gaps = append(gaps, Gap{
			From:   math.Max(0, points[i].X-step/2),
			To:     math.Min(length, points[j].X+step/2),
			Key:    gapKey(len(gaps)),
			Reason: reason,
		})
		i = j + 1
	}
	return gaps
}

// gapKey is A..Z, then AA, AB, ...
func gapKey(i int) string {
	if i < 26 {
		return string(rune('A' + i))
	}
	return gapKey(i/26-1) + gapKey(i%26)
}

// scanStep is the smallest spacing between candidates (the scan step) [mm].
func scanStep(points []ScanPoint) float64 {
	step := math.Inf(1)
	for i := 1; i < len(points); i++ {
		step = math.Min(step, points[i].X-points[i-1].X)
	}
	if math.IsInf(step, 1) {
		return 0
	}
	return step
}

// feasibleRuns splits the feasible points into runs without a gap, as x [m] and values.
func feasibleRuns(points []ScanPoint, value func(ScanPoint) float64) (xs, ys [][]float64) {
	var x, y []float64
	for _, p := range points {
		if !p.Feasible {
			if len(x) > 0 {
				xs, ys = append(xs, x), append(ys, y)
				x, y = nil, nil
			}
			continue
		}
		x, y = append(x, p.X/1e3), append(y, value(p))
	}
	if len(x) > 0 {
		xs, ys = append(xs, x), append(ys, y)
	}
	return xs, ys
}

// bestPoints are the feasible points ranked 1..n, best first.
func bestPoints(points []ScanPoint, n int) []ScanPoint {
	var out []ScanPoint
	for _, p := range points {
		if p.Feasible && p.Rank > 0 && p.Rank <= n {
			out = append(out, p)
		}
	}
	slices.SortFunc(out, func(a, b ScanPoint) int { return a.Rank - b.Rank })
	return out
}

// CostChart draws, at every candidate position, the cost of the cheapest splice (top panel)
// and its bolt count (second panel) above the beam strip. Ranges where no splice may go are
// gaps in the curves, shaded and lettered, with their reasons listed under the chart; the
// best-ranked positions are numbered and the chosen layout's splices are vertical lines.
func CostChart(in ScanInput) (*Chart, error) {
	if err := in.validate(); err != nil {
		return nil, fmt.Errorf("cost chart: %w", err)
	}
	nBest := in.Best
	if nBest <= 0 {
		nBest = 5
	}
	rec := &markRecorder{}
	gaps := Gaps(in.Points, in.Model.Length)
	gapSpans := &xSpans{Fill: gapFill, Text: textStyle(sansBold(noteSize), hogLine)}
	for _, g := range gaps {
		gapSpans.Spans = append(gapSpans.Spans, xSpan{From: g.From / 1e3, To: g.To / 1e3, Label: g.Key})
	}
	unlabelled := *gapSpans
	unlabelled.Text.Font.Size = 0
	common := commonMarks(in.Model, nil, in.Chosen)

	cost := newPlot()
	cost.Add(gapSpans, grid())
	xs, ys := feasibleRuns(in.Points, func(p ScanPoint) float64 { return p.Cost })
	if err := addRuns(cost, xs, ys, lineStyle(costLine, 1)); err != nil {
		return nil, err
	}
	best := &pointLabels{
		Glyph: draw.GlyphStyle{Color: bestMark, Radius: 2.6, Shape: draw.CircleGlyph{}},
		Text:  textStyle(sansBold(noteSize), bestMark),
	}
	var ranks []int
	for _, p := range bestPoints(in.Points, nBest) {
		best.Points = append(best.Points, pointLabel{X: p.X / 1e3, Y: p.Cost, Label: fmt.Sprintf("%d", p.Rank), Below: true})
		ranks = append(ranks, p.Rank)
	}
	groupRankLabels(best.Points, ranks, 0.03*in.Model.Length/1e3)
	common.addLines(cost)
	cost.Add(spanLabels{gapSpans}, best)
	cost.Y.Label.Text = "splice cost\n[" + in.currency() + "]"
	setRange(&cost.Y, flatten(ys), 0.15, false)

	bolts := newPlot()
	bolts.Add(&unlabelled, grid())
	bx, by := feasibleRuns(in.Points, func(p ScanPoint) float64 { return float64(p.Bolts) })
	if err := addRuns(bolts, bx, by, lineStyle(boltLine, 1)); err != nil {
		return nil, err
	}
	common.addLines(bolts)
	bolts.Y.Label.Text = "bolts per\nsplice [–]"
	bolts.Y.Tick.Marker = cleanTicks{Target: 4, Integer: true}
	setRange(&bolts.Y, flatten(by), 0.15, false)

	strip := beamStrip(in.Model, common)
	ps := []*plot.Plot{cost, bolts, strip}
	sharedX(ps, 0, in.Model.Length/1e3, "x [m] candidate splice position from the left end")

	rec.spans("cost", MarkGap, gapSpans)
	rec.points("cost", MarkBest, best)
	common.record(rec, "cost", false)
	common.record(rec, "bolts", false)
	common.record(rec, "beam", true)

	legend := []legendEntry{
		{"cheapest splice at the position", lineThumb{lineStyle(costLine, 1)}},
		{"its bolt count", lineThumb{lineStyle(boltLine, 1)}},
		{"no splice here (see key)", fillThumb{Fill: gapFill}},
		{fmt.Sprintf("best positions, ranked 1–%d", nBest), glyphThumb{best.Glyph}},
	}
	if len(in.Chosen) > 0 {
		legend = append(legend, legendEntry{"chosen splice", lineThumb{spliceStyle()}})
	}
	notes := gapNotes(gaps)
	title := in.Title
	fig := Figure{Name: "cost", Caption: "Cost and bolt count of the cheapest splice at every candidate position",
		Width: figureWidth}
	noteH := vg.Length(len(notes)) * (noteSize + 2.5)
	fig.Height = 105*vg.Millimeter + noteH
	fig.paint = func(dc draw.Canvas) {
		dc = draw.Crop(dc, 4, -4, 4, -4)
		dc = drawTitle(dc, title)
		lh := legendHeight(legend, dc.Max.X-dc.Min.X)
		drawLegend(draw.Crop(dc, 0, 0, dc.Max.Y-dc.Min.Y-lh, 0), legend)
		body := draw.Crop(dc, 0, 0, noteH, -(lh + 4))
		stackPanels(body, []panel{{cost, 3}, {bolts, 1.8}, {strip, 0.95}}, 5)
		drawNotes(draw.Crop(dc, 0, 0, 0, -(dc.Max.Y-dc.Min.Y-noteH)), notes)
	}
	return &Chart{Figure: fig, Marks: rec.marks}, nil
}

// maxNotes bounds the key under a chart; the rest are counted.
const maxNotes = 10

// gapNotes are the key lines of the gaps: "A  9.500–11.500 m  keep-out: ...".
func gapNotes(gaps []Gap) []string {
	var out []string
	for i, g := range gaps {
		if i == maxNotes-1 && len(gaps) > maxNotes {
			out = append(out, fmt.Sprintf("… and %d more ranges (see scan.csv)", len(gaps)-i))
			break
		}
		out = append(out, fmt.Sprintf("%s   %s – %s   %s", g.Key, formatClean(g.From/1e3, 3), fmtM(g.To), g.Reason))
	}
	return out
}

// drawNotes writes lines of small text from the top of c.
func drawNotes(c draw.Canvas, lines []string) {
	sty := textStyle(sans(noteSize), darkGrey)
	sty.YAlign = draw.YTop
	y := c.Max.Y
	for _, l := range lines {
		c.FillText(sty, vg.Point{X: c.Min.X, Y: y}, l)
		y -= noteSize + 2.5
	}
}

// addRuns adds one line per run of points, so that gaps stay gaps.
func addRuns(p *plot.Plot, xs, ys [][]float64, style draw.LineStyle) error {
	for i := range xs {
		l, err := xyLine(xs[i], ys[i], style)
		if err != nil {
			return err
		}
		p.Add(l)
		if len(xs[i]) == 1 { // a lone position: a dot, since a one-point line is invisible
			p.Add(&pointLabels{Points: []pointLabel{{X: xs[i][0], Y: ys[i][0]}},
				Glyph: draw.GlyphStyle{Color: style.Color, Radius: 1.2, Shape: draw.CircleGlyph{}}})
		}
	}
	return nil
}

func flatten(vs [][]float64) []float64 {
	var out []float64
	for _, v := range vs {
		out = append(out, v...)
	}
	return out
}

// setRange sets an axis to the values' range with a fraction of padding, from zero when
// fromZero, and to [0, 1] when there are no values. A nearly flat series gets a range of at
// least a tenth of its level, so that small steps do not look dramatic.
func setRange(a *plot.Axis, vs []float64, pad float64, fromZero bool) {
	if len(vs) == 0 {
		a.Min, a.Max = 0, 1
		return
	}
	lo, hi := minMax(vs)
	if fromZero {
		lo = math.Min(lo, 0)
	}
	d := math.Max(hi-lo, 0.1*math.Max(math.Abs(hi), math.Abs(lo)))
	if d <= 0 {
		d = 1
	}
	mid := (lo + hi) / 2
	if fromZero {
		a.Min, a.Max = lo, hi+pad*d
		return
	}
	a.Min, a.Max = mid-d/2-pad*d, mid+d/2+pad*d
	if lo >= 0 && a.Min < 0 {
		a.Min = 0
	}
}

// groupRankLabels keeps one label per cluster of ranked points (given best first, with their
// ranks) closer than near [m] to the first of the cluster, listing the ranks ("1–5", "2, 4"), so clustered bests stay readable.
func groupRankLabels(pts []pointLabel, ranks []int, near float64) {
	used := make([]bool, len(pts))
	for i := range pts {
		if used[i] {
			continue
		}
		group := []int{ranks[i]}
		for j := i + 1; j < len(pts); j++ {
			if !used[j] && math.Abs(pts[j].X-pts[i].X) <= near {
				used[j] = true
				group = append(group, ranks[j])
				pts[j].Label = ""
			}
		}
		slices.Sort(group)
		pts[i].Label = rankList(group)
	}
}

// rankList writes ascending ranks with runs of three or more as ranges: 1, 2, 3, 5 → "1–3, 5".
func rankList(r []int) string {
	var parts []string
	for i := 0; i < len(r); {
		j := i
		for j+1 < len(r) && r[j+1] == r[j]+1 {
			j++
		}
		switch {
		case j >= i+2:
			parts = append(parts, fmt.Sprintf("%d–%d", r[i], r[j]))
		case j == i+1:
			parts = append(parts, fmt.Sprint(r[i]), fmt.Sprint(r[j]))
		default:
			parts = append(parts, fmt.Sprint(r[i]))
		}
		i = j + 1
	}
	return strings.Join(parts, ", ")
}

// checkFamily is the part of a check id that names the member and the kind of part:
// "web.bolt.bearing.beam" → "web.bolt", "detail.spacing" → "detail".
func checkFamily(id string) string {
	parts := strings.Split(id, ".")
	if len(parts) == 0 || parts[0] == "" {
		return "other"
	}
	if parts[0] == "detail" || len(parts) == 1 {
		return parts[0]
	}
	return parts[0] + "." + parts[1]
}

// familyNames are the families in legend order with their words and colours.
func familyInfo(f string) (label string, c rgb, order int) {
	switch f {
	case "flange.bolt":
		return "flange bolts", 0x184e96, 0
	case "flange.plate":
		return "flange cover plates", 0x5aa0dc, 1
	case "flange.beam":
		return "beam flange at the holes", 0x1e7846, 2
	case "web.bolt":
		return "web bolts", 0xc85a00, 3
	case "web.plate":
		return "web cover plates", 0xe6a532, 4
	case "web.beam":
		return "beam web at the holes", 0xaa2828, 5
	case "detail":
		return "detailing", 0x784696, 6
	}
	return f, 0x646464, 7
}

// UtilisationChart draws the governing utilisation of the cheapest splice at every candidate
// position, each point coloured by the family of its governing check (flange bolts, web
// plates, ...), with the limit 1.0, the gaps shaded as on the cost chart and the chosen
// splices marked.
func UtilisationChart(in ScanInput) (*Chart, error) {
	if err := in.validate(); err != nil {
		return nil, fmt.Errorf("utilisation chart: %w", err)
	}
	rec := &markRecorder{}
	gaps := Gaps(in.Points, in.Model.Length)
	gapSpans := &xSpans{Fill: gapFill, Text: textStyle(sansBold(noteSize), hogLine)}
	for _, g := range gaps {
		gapSpans.Spans = append(gapSpans.Spans, xSpan{From: g.From / 1e3, To: g.To / 1e3, Label: g.Key})
	}
	common := commonMarks(in.Model, nil, in.Chosen)
	u := newPlot()
	u.Add(gapSpans, grid())
	u.Add(&hLine{Y: 1, Style: dashed(limitRed, 0.9)})
	byFamily := map[string]*pointLabels{}
	var us []float64
	for _, p := range in.Points {
		if !p.Feasible && !(in.ShowFailing && !p.KeepOut && p.Utilisation > 0) {
			continue
		}
		f := checkFamily(p.Governing)
		pl, ok := byFamily[f]
		if !ok {
			_, c, _ := familyInfo(f)
			pl = &pointLabels{Glyph: draw.GlyphStyle{Color: c, Radius: 1.3, Shape: draw.CircleGlyph{}}}
			byFamily[f] = pl
		}
		pl.Points = append(pl.Points, pointLabel{X: p.X / 1e3, Y: p.Utilisation})
		us = append(us, p.Utilisation)
	}
	families := make([]string, 0, len(byFamily))
	for f := range byFamily {
		families = append(families, f)
	}
	slices.SortFunc(families, func(a, b string) int {
		_, _, oa := familyInfo(a)
		_, _, ob := familyInfo(b)
		if oa != ob {
			return oa - ob
		}
		return strings.Compare(a, b)
	})
	var legend []legendEntry
	for _, f := range families {
		u.Add(byFamily[f])
		label, _, _ := familyInfo(f)
		legend = append(legend, legendEntry{label, glyphThumb{byFamily[f].Glyph}})
		for _, pt := range byFamily[f].Points {
			rec.marks = append(rec.marks, Mark{Kind: MarkUtil, Panel: "utilisation", X: pt.X, Y: pt.Y, Label: f})
		}
	}
	common.addLines(u)
	u.Add(spanLabels{gapSpans})
	u.Y.Label.Text = "governing\nutilisation [–]"
	u.Y.Min = 0
	u.Y.Max = 1.1
	if len(us) > 0 {
		_, hi := minMax(us)
		u.Y.Max = math.Max(1.1, hi*1.08)
	}
	strip := beamStrip(in.Model, common)
	sharedX([]*plot.Plot{u, strip}, 0, in.Model.Length/1e3, "x [m] candidate splice position from the left end")
	rec.spans("utilisation", MarkGap, gapSpans)
	common.record(rec, "utilisation", false)
	common.record(rec, "beam", true)
	legend = append(legend, legendEntry{"limit 1.0", lineThumb{dashed(limitRed, 0.9)}},
		legendEntry{"no splice here (see key)", fillThumb{Fill: gapFill}})
	if len(in.Chosen) > 0 {
		legend = append(legend, legendEntry{"chosen splice", lineThumb{spliceStyle()}})
	}
	notes := gapNotes(gaps)
	noteH := vg.Length(len(notes)) * (noteSize + 2.5)
	title := in.Title
	fig := Figure{Name: "utilisation", Caption: "Governing utilisation of the cheapest splice at every candidate position, by check family",
		Width: figureWidth, Height: 88*vg.Millimeter + noteH}
	fig.paint = func(dc draw.Canvas) {
		dc = draw.Crop(dc, 4, -4, 4, -4)
		dc = drawTitle(dc, title)
		lh := legendHeight(legend, dc.Max.X-dc.Min.X)
		drawLegend(draw.Crop(dc, 0, 0, dc.Max.Y-dc.Min.Y-lh, 0), legend)
		stackPanels(draw.Crop(dc, 0, 0, noteH, -(lh+4)), []panel{{u, 3}, {strip, 0.95}}, 5)
		drawNotes(draw.Crop(dc, 0, 0, 0, -(dc.Max.Y-dc.Min.Y-noteH)), notes)
	}
	return &Chart{Figure: fig, Marks: rec.marks}, nil
}
