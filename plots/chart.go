package plots

import (
	"fmt"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// Range is an interval of positions along the beam [mm].
type Range struct{ From, To float64 }

// MarkKind says what a chart marks.
type MarkKind string

// The kinds of mark a chart records.
const (
	MarkSplice  MarkKind = "splice"      // a chosen splice position (vertical line)
	MarkKeepOut MarkKind = "keep-out"    // a keep-out zone (shaded range)
	MarkGap     MarkKind = "gap"         // a range of infeasible candidate positions (shaded range)
	MarkSupport MarkKind = "support"     // a support symbol
	MarkBest    MarkKind = "best"        // a best-ranked candidate position (glyph)
	MarkPeak    MarkKind = "peak"        // an annotated extreme value
	MarkUtil    MarkKind = "utilisation" // a candidate's governing utilisation (Label: check family)
	MarkTotal   MarkKind = "total"       // a layout's total cost over its bar (X: bar index)
)

// Mark is one thing a chart marks, in the chart's data units (x in m). Charts record their
// marks from the very plotters they draw, so tests can check what a chart shows without
// reading pixels.
type Mark struct {
	Kind  MarkKind
	Panel string  // which panel, e.g. "moment", "cost"
	X, X2 float64 // position, and the end of a range [m]
	Y     float64 // value at the mark, in the panel's unit (0 for lines and ranges)
	Label string
}

// Chart is a rendered-on-demand figure with the record of what it marks.
type Chart struct {
	Figure
	Marks []Mark
}

// MarksOf returns the chart's marks of one kind, in drawing order.
func (c *Chart) MarksOf(kind MarkKind) []Mark {
	var out []Mark
	for _, m := range c.Marks {
		if m.Kind == kind {
			out = append(out, m)
		}
	}
	return out
}

// markRecorder collects marks from plotters as a chart adds them to its panels.
type markRecorder struct{ marks []Mark }

func (r *markRecorder) lines(panel string, kind MarkKind, v *vLines) {
	for _, l := range v.Lines {
		r.marks = append(r.marks, Mark{Kind: kind, Panel: panel, X: l.X, Label: l.Label})
	}
}

func (r *markRecorder) spans(panel string, kind MarkKind, s *xSpans) {
	for _, sp := range s.Spans {
		r.marks = append(r.marks, Mark{Kind: kind, Panel: panel, X: sp.From, X2: sp.To, Label: sp.Label})
	}
}

func (r *markRecorder) supports(panel string, s *supportMarks) {
	for _, m := range s.Marks {
		r.marks = append(r.marks, Mark{Kind: MarkSupport, Panel: panel, X: m.X, Label: m.Kind.String()})
	}
}

func (r *markRecorder) points(panel string, kind MarkKind, p *pointLabels) {
	for _, pt := range p.Points {
		r.marks = append(r.marks, Mark{Kind: kind, Panel: panel, X: pt.X, Y: pt.Y, Label: pt.Label})
	}
}

// pointLabel is a labelled point [data units]; Below puts the label under the point.
type pointLabel struct {
	X, Y  float64
	Label string
	Below bool
}

// pointLabels draws a glyph at each point with its label beside it, kept inside the panel.
type pointLabels struct {
	Points []pointLabel
	Glyph  draw.GlyphStyle
	Text   draw.TextStyle
	Lift   vg.Length // extra distance between a point and its label
}

// Plot implements plot.Plotter.
func (pl *pointLabels) Plot(c draw.Canvas, p *plot.Plot) {
	trX, trY := p.Transforms(&c)
	for _, pt := range pl.Points {
		at := vg.Point{X: trX(pt.X), Y: trY(pt.Y)}
		if !c.Contains(at) {
			continue
		}
		if pl.Glyph.Radius > 0 {
			c.DrawGlyph(pl.Glyph, at)
		}
		if pt.Label == "" {
			continue
		}
		sty := pl.Text
		w := sty.Width(pt.Label)
		h := sty.Height(pt.Label)
		x := at.X - w/2
		y := at.Y + pl.Glyph.Radius + 1.5 + pl.Lift
		if pt.Below {
			y = at.Y - pl.Glyph.Radius - 1.5 - pl.Lift - h
		}
		if y+h > c.Max.Y-1 || y < c.Min.Y+1 { // no room above or below: beside the point
			y = max(c.Min.Y+1, min(at.Y-h/2, c.Max.Y-h-1))
			x = at.X + pl.Glyph.Radius + 3
			if x+w > c.Max.X-1 {
				x = at.X - pl.Glyph.Radius - 3 - w
			}
		}
		x = max(c.Min.X+1, min(x, c.Max.X-w-1))
		sty.XAlign, sty.YAlign = draw.XLeft, draw.YBottom
		c.FillPolygon(white, []vg.Point{{X: x - 1, Y: y}, {X: x + w + 1, Y: y}, {X: x + w + 1, Y: y + h}, {X: x - 1, Y: y + h}})
		c.FillText(sty, vg.Point{X: x, Y: y}, pt.Label)
	}
}

// Thumbnail implements plot.Thumbnailer.
func (pl *pointLabels) Thumbnail(c *draw.Canvas) { c.DrawGlyphNoClip(pl.Glyph, c.Center()) }

// drawTitle writes a bold title at the top-left of c and returns the canvas below it.
func drawTitle(c draw.Canvas, title string) draw.Canvas {
	if title == "" {
		return c
	}
	sty := textStyle(sansBold(titleSize), black)
	sty.YAlign = draw.YTop
	c.FillText(sty, vg.Point{X: c.Min.X, Y: c.Max.Y}, title)
	return draw.Crop(c, 0, 0, 0, -(sty.Height(title) + 4))
}

// xyLine is a plotter.Line through the points in a style.
func xyLine(x, y []float64, style draw.LineStyle) (*plotter.Line, error) {
	pts := make(plotter.XYs, len(x))
	for i := range x {
		pts[i] = plotter.XY{X: x[i], Y: y[i]}
	}
	l, err := plotter.NewLine(pts)
	if err != nil {
		return nil, err
	}
	l.LineStyle = style
	return l, nil
}

// finiteAll reports the first value that is NaN or infinite, for error messages.
func finiteAll(name string, vs []float64) error {
	for i, v := range vs {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return fmt.Errorf("%s[%d] is %v; every plotted value must be finite", name, i, v)
		}
	}
	return nil
}

// fmtM formats a position [mm] in m with the precision positions are set out (mm).
func fmtM(xmm float64) string { return formatClean(xmm/1e3, 3) + " m" }
