package plots

import (
	"bytes"
	"fmt"
	"io"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgimg"
	"gonum.org/v1/plot/vg/vgsvg"
)

// Format is an output format of a figure.
type Format string

// The formats a figure renders to.
const (
	SVG Format = "svg" // vector, deterministic bytes: the golden-file format
	PNG Format = "png" // raster at PNGDPI
	PDF Format = "pdf" // vector, one page the size of the figure
)

// PNGDPI is the resolution of PNG output [dots per inch].
const PNGDPI = 150

// ParseFormat reads a format name ("svg", "png" or "pdf", any case).
func ParseFormat(s string) (Format, error) {
	switch f := Format(strings.ToLower(strings.TrimSpace(s))); f {
	case SVG, PNG, PDF:
		return f, nil
	}
	return "", fmt.Errorf("format %q: want svg, png or pdf", s)
}

// Figure is a chart or drawing laid out at its printed size. It is built once from data and
// can be rendered any number of times, to any format.
type Figure struct {
	Name          string    // short file stem, e.g. "envelopes"
	Caption       string    // one sentence saying what the figure shows
	Width, Height vg.Length // printed size [pt]
	paint         func(dc draw.Canvas)
}

// Draw paints the figure into a canvas of its size (for embedding it in another document).
// Figures come from this package's constructors; a Figure built by hand has nothing to draw.
func (f *Figure) Draw(dc draw.Canvas) {
	if f.paint == nil {
		panic("plots: Figure " + f.Name + " was not made by a plots constructor")
	}
	dc.FillPolygon(white, []vg.Point{dc.Min, {X: dc.Max.X, Y: dc.Min.Y}, dc.Max, {X: dc.Min.X, Y: dc.Max.Y}})
	f.paint(dc)
}

// Render writes the figure in the given format.
func (f *Figure) Render(w io.Writer, format Format) error {
	switch format {
	case SVG:
		c := vgsvg.NewWith(vgsvg.UseWH(f.Width, f.Height))
		f.Draw(draw.New(c))
		_, err := c.WriteTo(w)
		return err
	case PNG:
		c := vgimg.NewWith(vgimg.UseWH(f.Width, f.Height), vgimg.UseDPI(PNGDPI),
			vgimg.UseBackgroundColor(white))
		f.Draw(draw.New(c))
		_, err := vgimg.PngCanvas{Canvas: c}.WriteTo(w)
		return err
	case PDF:
		doc := newPDFDocument(f.Width.Points(), f.Height.Points(), f.Caption, documentDate())
		doc.AddPage()
		drawOnPDF(doc, f, 0, 0)
		return doc.Output(w)
	}
	return fmt.Errorf("format %q: want svg, png or pdf", format)
}

// Bytes renders the figure into memory.
func (f *Figure) Bytes(format Format) ([]byte, error) {
	var b bytes.Buffer
	if err := f.Render(&b, format); err != nil {
		return nil, err
	}
	return b.Bytes(), nil
}

// panel is one plot of a vertical stack, with its share of the height.
type panel struct {
	p      *plot.Plot
	weight float64
}

// stackPanels draws plots one above the other in c so that their data areas share the same
// left and right edges (the x axes line up), each taking a share of the height proportional
// to its weight. It is plot.Align for unequal heights.
func stackPanels(c draw.Canvas, panels []panel, gap vg.Length) {
	total := 0.0
	for _, pn := range panels {
		total += pn.weight
	}
	avail := c.Max.Y - c.Min.Y - gap*vg.Length(len(panels)-1)
	top := c.Max.Y
	tiles := make([]draw.Canvas, len(panels))
	for i, pn := range panels {
		h := avail * vg.Length(pn.weight/total)
		tiles[i] = draw.Canvas{Canvas: c.Canvas, Rectangle: vg.Rectangle{
			Min: vg.Point{X: c.Min.X, Y: top - h}, Max: vg.Point{X: c.Max.X, Y: top}}}
		top -= h + gap
	}
	// the widest left and right margins among the panels
	var left, right vg.Length
	for i, pn := range panels {
		da := pn.p.DataCanvas(tiles[i])
		left = max(left, da.Min.X-tiles[i].Min.X)
		right = max(right, tiles[i].Max.X-da.Max.X)
	}
	for i, pn := range panels {
		da := pn.p.DataCanvas(tiles[i])
		l := left - (da.Min.X - tiles[i].Min.X)
		r := right - (tiles[i].Max.X - da.Max.X)
		pn.p.Draw(draw.Crop(tiles[i], l, -r, 0, 0))
	}
}

// sharedX gives panels the same x range with no padding, hides the tick labels and axis
// label of every panel but the last, and labels the last.
func sharedX(ps []*plot.Plot, lo, hi float64, label string) {
	for i, p := range ps {
		p.X.Min, p.X.Max = lo, hi
		p.X.Padding = 0
		if i < len(ps)-1 {
			p.X.Tick.Marker = noLabels{cleanTicks{Target: 10}}
			p.X.Label.Text = ""
		} else {
			p.X.Tick.Marker = cleanTicks{Target: 10}
			p.X.Label.Text = label
		}
	}
}
