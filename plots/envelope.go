package plots

import (
	"errors"
	"fmt"
	"math"
	"slices"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"spanbreak/beam"
)

// EnvelopeInput is what the envelope chart shows.
type EnvelopeInput struct {
	Title      string          // first line of the figure; empty for none
	Envelopes  *beam.Envelopes // ULS (and SLS for deflection) envelopes along the beam
	Model      beam.Model      // length and supports
	KeepOut    []Range         // keep-out zones [mm]
	Splices    []float64       // chosen splice positions [mm], labelled S1, S2, ... left to right
	Deflection bool            // add a panel with the SLS deflection envelope
}

// Envelope chart sizes [pt].
const (
	envelopeHeight     = 118 * vg.Millimeter
	envelopeHeightDefl = 150 * vg.Millimeter
)

// EnvelopeChart draws the ULS bending-moment and shear envelopes as bands on panels sharing
// the x axis, with the SLS deflection envelope when asked, above a strip showing the beam with
// its supports. Keep-out zones are shaded and the chosen splices are labelled vertical lines
// on every panel. Moments are plotted sagging positive (upward), deflection downward positive
// and drawn downward, like the deflected beam.
func EnvelopeChart(in EnvelopeInput) (*Chart, error) {
	env := in.Envelopes
	if env == nil || len(env.Stations) == 0 {
		return nil, errors.New("envelope chart: no envelope stations")
	}
	n := len(env.Stations)
	if len(env.ULS.MMax) != n || len(env.ULS.MMin) != n || len(env.ULS.VMax) != n || len(env.ULS.VMin) != n {
		return nil, fmt.Errorf("envelope chart: %d stations but ULS envelopes of other lengths", n)
	}
	if in.Deflection && (len(env.SLS.WMax) != n || len(env.SLS.WMin) != n) {
		return nil, fmt.Errorf("envelope chart: %d stations but an SLS deflection envelope of another length", n)
	}
	if !(in.Model.Length > 0) {
		return nil, fmt.Errorf("envelope chart: beam length %g mm must be positive", in.Model.Length)
	}
	x := make([]float64, n)
	for i, s := range env.Stations {
		x[i] = s.X / 1e3
	}
	scaled := func(ex []beam.Extreme, f float64) []float64 {
		out := make([]float64, len(ex))
		for i, e := range ex {
			out[i] = e.Value * f
		}
		return out
	}
	mMax, mMin := scaled(env.ULS.MMax, 1e-6), scaled(env.ULS.MMin, 1e-6)
	vMax, vMin := scaled(env.ULS.VMax, 1e-3), scaled(env.ULS.VMin, 1e-3)
	var errs []error
	for name, v := range map[string][]float64{"M max": mMax, "M min": mMin, "V max": vMax, "V min": vMin} {
		errs = append(errs, finiteAll(name, v))
	}
	var wMax, wMin []float64
	if in.Deflection {
		wMax, wMin = scaled(env.SLS.WMax, 1), scaled(env.SLS.WMin, 1)
		errs = append(errs, finiteAll("w max", wMax), finiteAll("w min", wMin))
	}
	if err := errors.Join(errs...); err != nil {
		return nil, fmt.Errorf("envelope chart: %w", err)
	}

	rec := &markRecorder{}
	lengthM := in.Model.Length / 1e3
	common := commonMarks(in.Model, in.KeepOut, in.Splices)

	moment, err := bandPanel(x, mMax, mMin, momentFill, lineStyle(momentLine, 1), lineStyle(hogLine, 1), common.keepOut)
	if err != nil {
		return nil, err
	}
	moment.Y.Label.Text = "M [kNm]\nULS, sagging +"
	moment.Y.Tick.Marker = cleanTicks{Target: 5}
	peaks := peakLabels(x, mMax, mMin, "kNm", 0)
	moment.Add(peaks)
	rec.points("moment", MarkPeak, peaks)

	shear, err := bandPanel(x, vMax, vMin, shearFill, lineStyle(shearLine, 1), lineStyle(shearLine, 1), common.keepOut)
	if err != nil {
		return nil, err
	}
	shear.Y.Label.Text = "V [kN]\nULS, V = dM/dx"
	shear.Y.Tick.Marker = cleanTicks{Target: 4}
	vp := peakLabels(x, vMax, vMin, "kN", 0)
	shear.Add(vp)
	rec.points("shear", MarkPeak, vp)

	panels := []panel{{moment, 3}, {shear, 2.2}}
	names := []string{"moment", "shear"}
	if in.Deflection {
		defl, err := bandPanel(x, wMax, wMin, deflFill, lineStyle(deflLine, 1), lineStyle(deflLine, 1), common.keepOut)
		if err != nil {
			return nil, err
		}
		defl.Y.Scale = plot.InvertedScale{Normalizer: plot.LinearScale{}}
		defl.Y.Label.Text = "w [mm]\nSLS, down +"
		defl.Y.Tick.Marker = cleanTicks{Target: 4}
		wp := peakLabels(x, wMax, wMin, "mm", 1)
		// on the inverted axis the maximum lies at the bottom: label it below the point
		for i := range wp.Points {
			wp.Points[i].Below = !wp.Points[i].Below
		}
		defl.Add(wp)
		rec.points("deflection", MarkPeak, wp)
		panels = append(panels, panel{defl, 2})
		names = append(names, "deflection")
	}
	for i, pn := range panels {
		common.addLines(pn.p)
		common.record(rec, names[i], false)
	}
	strip := beamStrip(in.Model, common)
	common.record(rec, "beam", true)
	panels = append(panels, panel{strip, 0.95})

	ps := make([]*plot.Plot, len(panels))
	for i, pn := range panels {
		ps[i] = pn.p
	}
	sharedX(ps, 0, lengthM, "x [m] from the left end of the beam")

	legend := []legendEntry{
		{"ULS M max (sagging)", lineThumb{lineStyle(momentLine, 1)}},
		{"ULS M min (hogging)", lineThumb{lineStyle(hogLine, 1)}},
		{"ULS V max / min", lineThumb{lineStyle(shearLine, 1)}},
	}
	if in.Deflection {
		legend = append(legend, legendEntry{"SLS w max / min", lineThumb{lineStyle(deflLine, 1)}})
	}
	if len(in.KeepOut) > 0 {
		legend = append(legend, legendEntry{"keep-out zone", fillThumb{Fill: keepOutFill}})
	}
	if len(in.Splices) > 0 {
		legend = append(legend, legendEntry{"chosen splice", lineThumb{spliceStyle()}})
	}
	legend = append(legend, legendEntry{"support", lineThumb{supportLineStyle()}})

	h := envelopeHeight
	caption := "ULS envelopes of bending moment and shear along the beam"
	if in.Deflection {
		h = envelopeHeightDefl
		caption += ", with the SLS deflection envelope"
	}
	if len(in.Splices) > 0 {
		caption += "; chosen splices marked"
	}
	title := in.Title
	fig := Figure{Name: "envelopes", Caption: caption, Width: figureWidth, Height: h}
	fig.paint = func(dc draw.Canvas) {
		dc = draw.Crop(dc, 4, -4, 4, -4)
		dc = drawTitle(dc, title)
		lh := legendHeight(legend, dc.Max.X-dc.Min.X)
		top := draw.Crop(dc, 0, 0, dc.Max.Y-dc.Min.Y-lh, 0)
		drawLegend(top, legend)
		stackPanels(draw.Crop(dc, 0, 0, 0, -(lh+4)), panels, 5)
	}
	return &Chart{Figure: fig, Marks: rec.marks}, nil
}

// bandPanel is a panel with a filled band between two curves, a zero line and a grid; the
// plotters in under (shaded zones) are drawn first, beneath everything.
func bandPanel(x, upper, lower []float64, fill rgb, up, lo draw.LineStyle, under ...plot.Plotter) (*plot.Plot, error) {
	p := newPlot()
	p.Add(under...)
	p.Add(grid())
	items, err := band(x, upper, lower, fill, up, lo)
	if err != nil {
		return nil, err
	}
	p.Add(items...)
	p.Add(&hLine{Y: 0, Style: lineStyle(darkGrey, 0.6)})
	lo0, hi0 := minMax(append(append([]float64{}, upper...), lower...))
	pad := 0.16 * math.Max(hi0-lo0, 1e-9)
	p.Y.Min, p.Y.Max = math.Min(lo0-pad, 0), math.Max(hi0+pad, 0)
	if p.Y.Max-p.Y.Min < 1e-9 {
		p.Y.Min, p.Y.Max = -1, 1
	}
	return p, nil
}

// peakLabels marks the largest value of upper and the smallest of lower with their values.
func peakLabels(x, upper, lower []float64, unit string, decimals int) *pointLabels {
	iu, il := 0, 0
	for i := range x {
		if upper[i] > upper[iu] {
			iu = i
		}
		if lower[i] < lower[il] {
			il = i
		}
	}
	pl := &pointLabels{
		Glyph: draw.GlyphStyle{Color: black, Radius: 1.6, Shape: draw.CircleGlyph{}},
		Text:  textStyle(sans(noteSize), black),
	}
	label := func(v float64, xi float64) string {
		return fmt.Sprintf("%s %s at %s m", signed(v, decimals), unit, formatClean(xi, 2))
	}
	if upper[iu] > 0 {
		pl.Points = append(pl.Points, pointLabel{X: x[iu], Y: upper[iu], Label: label(upper[iu], x[iu])})
	}
	if lower[il] < 0 {
		pl.Points = append(pl.Points, pointLabel{X: x[il], Y: lower[il], Label: label(lower[il], x[il]), Below: true})
	}
	return pl
}

// signed prints v with a sign and the given decimals ("+512", "−388").
func signed(v float64, decimals int) string {
	s := formatClean(math.Abs(v), decimals)
	if s == formatClean(0, decimals) {
		return s
	}
	if v < 0 {
		return "−" + s
	}
	return "+" + s
}

func minMax(vs []float64) (lo, hi float64) {
	lo, hi = math.Inf(1), math.Inf(-1)
	for _, v := range vs {
		lo, hi = math.Min(lo, v), math.Max(hi, v)
	}
	return lo, hi
}

// spliceStyle is the line of a chosen splice.
func spliceStyle() draw.LineStyle { return lineStyle(spliceLine, 1.1) }

// supportLineStyle is the thin dotted line at each support on the data panels.
func supportLineStyle() draw.LineStyle {
	return draw.LineStyle{Color: midGrey, Width: 0.5, Dashes: []vg.Length{1, 1.5}}
}

// beamMarks are the marks every panel along the beam shares: keep-out zones, supports and
// chosen splices, in m.
type beamMarks struct {
	keepOut  *xSpans
	supports *vLines
	splices  *vLines
	symbols  *supportMarks
}

func commonMarks(m beam.Model, keepOut []Range, splices []float64) beamMarks {
	bm := beamMarks{
		keepOut:  &xSpans{Fill: keepOutFill},
		supports: &vLines{Style: supportLineStyle()},
		splices:  &vLines{Style: spliceStyle(), Text: textStyle(sansBold(noteSize), spliceLine)},
		symbols:  &supportMarks{Y: 0, Size: 7},
	}
	for _, r := range keepOut {
		bm.keepOut.Spans = append(bm.keepOut.Spans, xSpan{From: r.From / 1e3, To: r.To / 1e3})
	}
	for _, s := range m.Supports {
		bm.supports.Lines = append(bm.supports.Lines, vLine{X: s.X / 1e3})
		bm.symbols.Marks = append(bm.symbols.Marks, supportMark{X: s.X / 1e3, Kind: s.Kind})
	}
	for i, x := range sortedCopy(splices) {
		bm.splices.Lines = append(bm.splices.Lines, vLine{X: x / 1e3, Label: fmt.Sprintf("S%d %s", i+1, fmtM(x))})
	}
	return bm
}

// addLines adds the support and splice lines over the data, without labels: the beam strip
// carries those. (The shaded zones go in first, under the data, through bandPanel.)
func (bm beamMarks) addLines(p *plot.Plot) {
	p.Add(bm.supports)
	sp := *bm.splices
	sp.Text.Font.Size = 0
	p.Add(&sp)
}

func (bm beamMarks) record(r *markRecorder, panel string, symbols bool) {
	r.spans(panel, MarkKeepOut, bm.keepOut)
	r.lines(panel, MarkSplice, bm.splices)
	if symbols {
		r.supports(panel, bm.symbols)
	}
}

// beamStrip is the bottom panel: the beam as a thick line with its supports, keep-out zones
// and splice positions, carrying the shared x axis.
func beamStrip(m beam.Model, bm beamMarks) *plot.Plot {
	p := newPlot()
	p.Add(bm.keepOut)
	xs := []float64{0, m.Length / 1e3}
	beamLine, _ := xyLine(xs, []float64{0, 0}, lineStyle(black, 2.2))
	p.Add(beamLine)
	p.Add(bm.symbols)
	cuts := &vLines{Style: spliceStyle()}
	for _, l := range bm.splices.Lines {
		cuts.Lines = append(cuts.Lines, vLine{X: l.X})
	}
	p.Add(&spliceTicks{lines: cuts})
	p.Add(&stripLabels{lines: bm.splices})
	p.Y.Min, p.Y.Max = -1.2, 1
	p.HideY()
	p.Y.Tick.Marker = noLabels{cleanTicks{}}
	return p
}

// spliceTicks draws each splice on the beam strip as a short bar across the beam line.
type spliceTicks struct{ lines *vLines }

// Plot implements plot.Plotter.
func (s *spliceTicks) Plot(c draw.Canvas, p *plot.Plot) {
	trX, trY := p.Transforms(&c)
	y := trY(0)
	for _, l := range s.lines.Lines {
		x := trX(l.X)
		if c.ContainsX(x) {
			c.StrokeLine2(lineStyle(white, 2.5), x, y-2, x, y+2)
			c.StrokeLine2(lineStyle(spliceLine, 1.4), x-1.5, y-6, x-1.5, y+6)
			c.StrokeLine2(lineStyle(spliceLine, 1.4), x+1.5, y-6, x+1.5, y+6)
		}
	}
}

// stripLabels writes each splice's name and position above the beam line, stepping labels
// that would overlap up a line.
type stripLabels struct{ lines *vLines }

// Plot implements plot.Plotter.
func (s *stripLabels) Plot(c draw.Canvas, p *plot.Plot) {
	trX, trY := p.Transforms(&c)
	y0 := trY(0) + 7
	sty := s.lines.Text
	sty.YAlign = draw.YBottom
	var levels []vg.Length
	for _, l := range s.lines.Lines {
		x := trX(l.X)
		w := sty.Width(l.Label)
		left := max(c.Min.X, min(x-w/2, c.Max.X-w))
		lvl := 0
		for lvl < len(levels) && left < levels[lvl]+4 {
			lvl++
		}
		if lvl == len(levels) {
			levels = append(levels, c.Min.X-100)
		}
		levels[lvl] = left + w
		c.FillText(sty, vg.Point{X: left, Y: y0 + vg.Length(lvl)*(sty.Height(l.Label)+1)}, l.Label)
	}
}

func sortedCopy(v []float64) []float64 {
	out := slices.Clone(v)
	slices.Sort(out)
	return out
}
