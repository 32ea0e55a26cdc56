package plots

import (
	"image/color"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/text"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"spanbreak/beam"
)

// The plotters in this file have no DataRange method on purpose: marks never change a
// panel's autoscaled range.

// vLine is one vertical marker at X [data units] with an optional label.
type vLine struct {
	X     float64
	Label string
}

// vLines draws vertical lines across a panel's data area, labelled at the top. Labels that
// would overlap step down a line.
type vLines struct {
	Lines []vLine
	Style draw.LineStyle
	Text  text.Style // label style; a zero font size draws no labels
}

// Plot implements plot.Plotter.
func (m *vLines) Plot(c draw.Canvas, p *plot.Plot) {
	trX, _ := p.Transforms(&c)
	var levels []vg.Length // right end of the last label on each level
	for _, l := range m.Lines {
		x := trX(l.X)
		if !c.ContainsX(x) {
			continue
		}
		c.StrokeLine2(m.Style, x, c.Min.Y, x, c.Max.Y)
		if l.Label == "" || m.Text.Font.Size == 0 {
			continue
		}
		w := m.Text.Width(l.Label)
		h := m.Text.Height(l.Label)
		left := x + 2
		if left+w > c.Max.X { // keep the label inside: put it left of the line
			left = x - 2 - w
		}
		lvl := 0
		for lvl < len(levels) && left < levels[lvl]+3 {
			lvl++
		}
		if lvl == len(levels) {
			levels = append(levels, 0)
		}
		levels[lvl] = left + w
		top := c.Max.Y - 2 - vg.Length(lvl)*(h+2)
		box := []vg.Point{{X: left - 1, Y: top - h}, {X: left + w + 1, Y: top - h}, {X: left + w + 1, Y: top}, {X: left - 1, Y: top}}
		c.FillPolygon(white, box)
		sty := m.Text
		sty.XAlign, sty.YAlign = draw.XLeft, draw.YTop
		c.FillText(sty, vg.Point{X: left, Y: top}, l.Label)
	}
}

// Thumbnail implements plot.Thumbnailer.
func (m *vLines) Thumbnail(c *draw.Canvas) {
	x := (c.Min.X + c.Max.X) / 2
	c.StrokeLine2(m.Style, x, c.Min.Y, x, c.Max.Y)
}

// xSpan is a range [From, To] of x [data units] with an optional label.
type xSpan struct {
	From, To float64
	Label    string
}

// xSpans shades x-ranges over the full height of a panel (keep-out zones, infeasible
// ranges). Add it before the data so that the lines draw on top.
type xSpans struct {
	Spans []xSpan
	Fill  color.Color
	Edge  draw.LineStyle // zero width: no edges
	Text  text.Style     // label style for spanLabels; zero size: no labels
}

// Plot implements plot.Plotter.
func (s *xSpans) Plot(c draw.Canvas, p *plot.Plot) {
	trX, _ := p.Transforms(&c)
	for _, sp := range s.Spans {
		x0, x1 := trX(sp.From), trX(sp.To)
		if x1-x0 < 0.6 { // keep a hairline visible
			mid := (x0 + x1) / 2
			x0, x1 = mid-0.3, mid+0.3
		}
		rect := []vg.Point{{X: x0, Y: c.Min.Y}, {X: x1, Y: c.Min.Y}, {X: x1, Y: c.Max.Y}, {X: x0, Y: c.Max.Y}}
		clipped := c.ClipPolygonX(rect)
		if len(clipped) == 0 {
			continue
		}
		c.FillPolygon(s.Fill, clipped)
		if s.Edge.Width > 0 {
			for _, x := range []vg.Length{x0, x1} {
				if c.ContainsX(x) {
					c.StrokeLine2(s.Edge, x, c.Min.Y, x, c.Max.Y)
				}
			}
		}
	}
}

// spanLabels writes the labels of shaded ranges centred near the top of the panel on a white
// ground; add it after the lines so that no line crosses a label.
type spanLabels struct{ spans *xSpans }

// Plot implements plot.Plotter.
func (l spanLabels) Plot(c draw.Canvas, p *plot.Plot) {
	s := l.spans
	if s.Text.Font.Size == 0 {
		return
	}
	trX, _ := p.Transforms(&c)
	sty := s.Text
	sty.XAlign, sty.YAlign = draw.XCenter, draw.YTop
	for _, sp := range s.Spans {
		if sp.Label == "" {
			continue
		}
		x0, x1 := max(trX(sp.From), c.Min.X), min(trX(sp.To), c.Max.X)
		if x1 < x0 {
			continue
		}
		mid := (x0 + x1) / 2
		w, h := sty.Width(sp.Label), sty.Height(sp.Label)
		top := c.Max.Y - 2
		c.FillPolygon(gapFill, []vg.Point{{X: mid - w/2 - 1, Y: top - h}, {X: mid + w/2 + 1, Y: top - h},
			{X: mid + w/2 + 1, Y: top}, {X: mid - w/2 - 1, Y: top}})
		c.FillText(sty, vg.Point{X: mid, Y: top}, sp.Label)
	}
}

// Thumbnail implements plot.Thumbnailer.
func (s *xSpans) Thumbnail(c *draw.Canvas) {
	c.FillPolygon(s.Fill, []vg.Point{c.Min, {X: c.Max.X, Y: c.Min.Y}, c.Max, {X: c.Min.X, Y: c.Max.Y}})
}

// supportMark is one support symbol at X [data units].
type supportMark struct {
	X    float64
	Kind beam.SupportKind
}

// supportMarks draws the conventional support symbols with their apex on the line y = Y
// [data units]: a triangle (pinned), a triangle on a line with a gap (roller), a hatched
// wall (fixed) and a zig-zag (spring).
type supportMarks struct {
	Marks []supportMark
	Y     float64
	Size  vg.Length // symbol height [pt]
}

// Plot implements plot.Plotter.
func (s *supportMarks) Plot(c draw.Canvas, p *plot.Plot) {
	trX, trY := p.Transforms(&c)
	y := trY(s.Y)
	for _, m := range s.Marks {
		x := trX(m.X)
		if !c.ContainsX(x) {
			continue
		}
		drawSupport(c, m.Kind, vg.Point{X: x, Y: y}, s.Size)
	}
}

// drawSupport draws one support symbol with its apex at pt.
func drawSupport(c draw.Canvas, kind beam.SupportKind, pt vg.Point, h vg.Length) {
	ink := lineStyle(darkGrey, 0.7)
	half := h * 0.6
	ground := func(y vg.Length) {
		c.StrokeLine2(ink, pt.X-half*1.4, y, pt.X+half*1.4, y)
		for i := -3; i <= 2; i++ {
			x := pt.X + vg.Length(i)*half*0.45
			c.StrokeLine2(lineStyle(darkGrey, 0.5), x, y, x+half*0.35, y-half*0.35)
		}
	}
	switch kind {
	case beam.Fixed:
		w := h * 0.35
		c.FillPolygon(darkGrey, []vg.Point{{X: pt.X - w/2, Y: pt.Y - h}, {X: pt.X + w/2, Y: pt.Y - h},
			{X: pt.X + w/2, Y: pt.Y + h*0.4}, {X: pt.X - w/2, Y: pt.Y + h*0.4}})
	case beam.Spring:
		pts := []vg.Point{pt}
		for i := 1; i <= 6; i++ {
			dx := half * 0.5
			if i%2 == 0 {
				dx = -dx
			}
			if i == 6 {
				dx = 0
			}
			pts = append(pts, vg.Point{X: pt.X + dx, Y: pt.Y - h*vg.Length(i)/6})
		}
		c.StrokeLines(ink, pts)
		ground(pt.Y - h)
	default:
		tri := []vg.Point{pt, {X: pt.X + half, Y: pt.Y - h*0.8}, {X: pt.X - half, Y: pt.Y - h*0.8}}
		c.FillPolygon(white, tri)
		c.StrokeLines(ink, append(tri, pt))
		if kind == beam.Roller {
			c.StrokeLine2(ink, pt.X-half*1.2, pt.Y-h*0.8, pt.X+half*1.2, pt.Y-h*0.8)
			ground(pt.Y - h)
		} else {
			ground(pt.Y - h*0.8)
		}
	}
}

// legendEntry is one item of a legend row.
type legendEntry struct {
	Label string
	Thumb plot.Thumbnailer
}

// legendRows lays legend entries out left to right, wrapping at width, and returns each
// row's entries.
func legendRows(entries []legendEntry, width vg.Length) [][]legendEntry {
	sty := textStyle(sans(legendSize), black)
	var rows [][]legendEntry
	var row []legendEntry
	x := vg.Length(0)
	for _, e := range entries {
		w := legendThumb + 3 + sty.Width(e.Label) + legendSpacing
		if len(row) > 0 && x+w > width {
			rows = append(rows, row)
			row, x = nil, 0
		}
		row = append(row, e)
		x += w
	}
	if len(row) > 0 {
		rows = append(rows, row)
	}
	return rows
}

const (
	legendThumb   vg.Length = 14 // thumbnail width [pt]
	legendSpacing vg.Length = 10 // between entries [pt]
	legendLine    vg.Length = 11 // row height [pt]
)

// legendHeight is the height that drawLegend needs for the entries at a width.
func legendHeight(entries []legendEntry, width vg.Length) vg.Length {
	return vg.Length(len(legendRows(entries, width))) * legendLine
}

// drawLegend draws legend entries in rows from the top-left of c.
func drawLegend(c draw.Canvas, entries []legendEntry) {
	sty := textStyle(sans(legendSize), black)
	sty.YAlign = draw.YCenter
	y := c.Max.Y - legendLine/2
	for _, row := range legendRows(entries, c.Max.X-c.Min.X) {
		x := c.Min.X
		for _, e := range row {
			th := draw.Canvas{Canvas: c.Canvas, Rectangle: vg.Rectangle{
				Min: vg.Point{X: x, Y: y - 3.5}, Max: vg.Point{X: x + legendThumb, Y: y + 3.5}}}
			e.Thumb.Thumbnail(&th)
			c.FillText(sty, vg.Point{X: x + legendThumb + 3, Y: y}, e.Label)
			x += legendThumb + 3 + sty.Width(e.Label) + legendSpacing
		}
		y -= legendLine
	}
}

// lineThumb is a legend thumbnail of a plain line.
type lineThumb struct{ Style draw.LineStyle }

// Thumbnail implements plot.Thumbnailer.
func (l lineThumb) Thumbnail(c *draw.Canvas) {
	y := (c.Min.Y + c.Max.Y) / 2
	c.StrokeLine2(l.Style, c.Min.X, y, c.Max.X, y)
}

// fillThumb is a legend thumbnail of a filled box with an outline.
type fillThumb struct {
	Fill color.Color
	Edge draw.LineStyle
}

// Thumbnail implements plot.Thumbnailer.
func (f fillThumb) Thumbnail(c *draw.Canvas) {
	pts := []vg.Point{c.Min, {X: c.Max.X, Y: c.Min.Y}, c.Max, {X: c.Min.X, Y: c.Max.Y}}
	c.FillPolygon(f.Fill, pts)
	if f.Edge.Width > 0 {
		c.StrokeLines(f.Edge, append(pts, c.Min))
	}
}

// glyphThumb is a legend thumbnail of one glyph.
type glyphThumb struct{ Style draw.GlyphStyle }

// Thumbnail implements plot.Thumbnailer.
func (g glyphThumb) Thumbnail(c *draw.Canvas) {
	c.DrawGlyphNoClip(g.Style, c.Center())
}

// band is a filled envelope between an upper and a lower curve, with both curves drawn.
func band(x, upper, lower []float64, fill color.Color, upperLine, lowerLine draw.LineStyle) ([]plot.Plotter, error) {
	n := len(x)
	poly := make(plotter.XYs, 0, 2*n)
	up := make(plotter.XYs, n)
	lo := make(plotter.XYs, n)
	for i := range x {
		up[i] = plotter.XY{X: x[i], Y: upper[i]}
		lo[i] = plotter.XY{X: x[i], Y: lower[i]}
		poly = append(poly, up[i])
	}
	for i := n - 1; i >= 0; i-- {
		poly = append(poly, lo[i])
	}
	pg, err := plotter.NewPolygon(poly)
	if err != nil {
		return nil, err
	}
	pg.Color = fill
	pg.LineStyle.Width = 0
	lu, err := plotter.NewLine(up)
	if err != nil {
		return nil, err
	}
	lu.LineStyle = upperLine
	ll, err := plotter.NewLine(lo)
	if err != nil {
		return nil, err
	}
	ll.LineStyle = lowerLine
	return []plot.Plotter{pg, lu, ll}, nil
}

// hLine draws a horizontal line across a panel at y [data units] (a zero line, a limit).
type hLine struct {
	Y     float64
	Style draw.LineStyle
}

// Plot implements plot.Plotter.
func (h *hLine) Plot(c draw.Canvas, p *plot.Plot) {
	_, trY := p.Transforms(&c)
	y := trY(h.Y)
	if c.ContainsY(y) {
		c.StrokeLine2(h.Style, c.Min.X, y, c.Max.X, y)
	}
}

// Thumbnail implements plot.Thumbnailer.
func (h *hLine) Thumbnail(c *draw.Canvas) { lineThumb{h.Style}.Thumbnail(c) }
