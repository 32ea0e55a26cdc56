package plots

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// Piece is one piece of the beam between splices (or an end).
type Piece struct {
	From, To float64 // [mm]
	Mass     float64 // with the splice plates and bolts it carries [kg]
}

// LayoutCost is the cost of a whole layout by item [currency].
type LayoutCost struct {
	Splices, Transport, Erection, Total float64
}

// Layout is one way to break the beam: the splice positions and what it costs.
type Layout struct {
	Splices []float64 // positions [mm], ascending
	Pieces  []Piece
	Cost    LayoutCost
	Vehicle string // vehicle tier used, when known
	Trips   int    // transport trips, when known
}

// LayoutInput is what the layout chart shows.
type LayoutInput struct {
	Title    string
	Layouts  []Layout // the best layout for each splice count, fewest splices first
	Chosen   int      // index into Layouts of the recommended layout; -1 for none
	Currency string   // cost unit on the axis; empty: "cost units"
}

// Layout chart size.
const layoutHeight = 95 * vg.Millimeter

// LayoutChart compares the best layout for each splice count: one bar per count, stacked by
// splice cost, transport and erection, with the total written over each bar and the chosen
// layout marked.
func LayoutChart(in LayoutInput) (*Chart, error) {
	if len(in.Layouts) == 0 {
		return nil, errors.New("layout chart: no layouts to compare")
	}
	n := len(in.Layouts)
	sp, tr, er := make(plotter.Values, n), make(plotter.Values, n), make(plotter.Values, n)
	names := make([]string, n)
	var errs []error
	for i, l := range in.Layouts {
		c := l.Cost
		for _, v := range []float64{c.Splices, c.Transport, c.Erection, c.Total} {
			if math.IsNaN(v) || math.IsInf(v, 0) || v < 0 {
				errs = append(errs, fmt.Errorf("layout %d: cost %v is not a finite, non-negative number", i, v))
				break
			}
		}
		sp[i], tr[i], er[i] = c.Splices, c.Transport, c.Erection
		names[i] = spliceCount(len(l.Splices))
		if l.Vehicle != "" {
			names[i] += "\n" + l.Vehicle
			if l.Trips > 0 {
				names[i] += fmt.Sprintf(" × %d", l.Trips)
			}
		}
	}
	if err := errors.Join(errs...); err != nil {
		return nil, fmt.Errorf("layout chart: %w", err)
	}
	cur := in.Currency
	if cur == "" {
		cur = "cost units"
	}
	p := newPlot()
	p.Add(grid())
	width := vg.Length(math.Min(48, 300/float64(n)))
	bSp, err := plotter.NewBarChart(sp, width)
	if err != nil {
		return nil, err
	}
	bTr, err := plotter.NewBarChart(tr, width)
	if err != nil {
		return nil, err
	}
	bEr, err := plotter.NewBarChart(er, width)
	if err != nil {
		return nil, err
	}
	const (
		spliceBar    rgb = 0xc85a00
		transportBar rgb = 0x184e96
		erectionBar  rgb = 0x7fa8d6
	)
	for _, b := range []*plotter.BarChart{bSp, bTr, bEr} {
		b.LineStyle = lineStyle(white, 0.6)
	}
	bSp.Color, bTr.Color, bEr.Color = spliceBar, transportBar, erectionBar
	bTr.StackOn(bSp)
	bEr.StackOn(bTr)
	p.Add(bSp, bTr, bEr)
	totals := &pointLabels{Text: textStyle(sansBold(noteSize), black), Lift: 3}
	var top float64
	for i, l := range in.Layouts {
		lbl := formatClean(l.Cost.Total, 0)
		if i == in.Chosen {
			lbl += " (chosen)"
		}
		stack := sp[i] + tr[i] + er[i]
		totals.Points = append(totals.Points, pointLabel{X: float64(i), Y: stack, Label: lbl})
		top = math.Max(top, stack)
	}
	p.Add(totals)
	if in.Chosen >= 0 && in.Chosen < n {
		p.Add(&barOutline{X: float64(in.Chosen), Top: sp[in.Chosen] + tr[in.Chosen] + er[in.Chosen], Width: width + 4})
	}
	p.NominalX(names...)
	p.X.Tick.Label.Font = sans(tickSize)
	p.X.Padding = 0
	p.X.Label.Text = "best layout for each number of splices, with its vehicle × trips"
	p.Y.Label.Text = "layout cost [" + cur + "]"
	p.Y.Min, p.Y.Max = 0, math.Max(top*1.15, 1)
	p.X.Min, p.X.Max = -0.75, float64(n)-0.25

	rec := &markRecorder{}
	rec.points("layouts", MarkTotal, totals)
	legend := []legendEntry{
		{"splices", fillThumb{Fill: spliceBar}},
		{"transport", fillThumb{Fill: transportBar}},
		{"erection (lifts)", fillThumb{Fill: erectionBar}},
	}
	if in.Chosen >= 0 && in.Chosen < n {
		legend = append(legend, legendEntry{"chosen layout", fillThumb{Fill: white, Edge: lineStyle(black, 1)}})
	}
	title := in.Title
	fig := Figure{Name: "layouts", Caption: "Total cost of the best layout for each number of splices, by item",
		Width: figureWidth, Height: layoutHeight}
	fig.paint = func(dc draw.Canvas) {
		dc = draw.Crop(dc, 4, -4, 4, -4)
		dc = drawTitle(dc, title)
		lh := legendHeight(legend, dc.Max.X-dc.Min.X)
		drawLegend(draw.Crop(dc, 0, 0, dc.Max.Y-dc.Min.Y-lh, 0), legend)
		p.Draw(draw.Crop(dc, 0, 0, 0, -(lh + 4)))
	}
	return &Chart{Figure: fig, Marks: rec.marks}, nil
}

// spliceCount is "no splice", "1 splice", "2 splices".
func spliceCount(n int) string {
	switch n {
	case 0:
		return "no splice"
	case 1:
		return "1 splice"
	}
	return fmt.Sprintf("%d splices", n)
}

// barOutline draws a frame around one bar of a bar chart (the chosen layout).
type barOutline struct {
	X, Top float64
	Width  vg.Length
}

// Plot implements plot.Plotter.
func (b *barOutline) Plot(c draw.Canvas, p *plot.Plot) {
	trX, trY := p.Transforms(&c)
	x, y0, y1 := trX(b.X), trY(0), trY(b.Top)
	pts := []vg.Point{{X: x - b.Width/2, Y: y0}, {X: x - b.Width/2, Y: y1 + 2}, {X: x + b.Width/2, Y: y1 + 2}, {X: x + b.Width/2, Y: y0}}
	c.StrokeLines(lineStyle(black, 1.2), pts)
}
