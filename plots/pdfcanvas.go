package plots

import (
	"bytes"
	"crypto/sha256"
	"fmt"
	"image"
	"image/color"
	"image/png"
	"math"
	"time"

	"codeberg.org/go-fonts/liberation/liberationmonobold"
	"codeberg.org/go-fonts/liberation/liberationmonoregular"
	"codeberg.org/go-fonts/liberation/liberationsansbold"
	"codeberg.org/go-fonts/liberation/liberationsansbolditalic"
	"codeberg.org/go-fonts/liberation/liberationsansitalic"
	"codeberg.org/go-fonts/liberation/liberationsansregular"
	"codeberg.org/go-fonts/liberation/liberationserifbold"
	"codeberg.org/go-fonts/liberation/liberationserifregular"
	"codeberg.org/go-pdf/fpdf"
	stdfont "golang.org/x/image/font"
	"gonum.org/v1/plot/font"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// documentDate is the creation and modification date written into a PDF made without a
// run's time (a figure, a report built by a test), so that it is a pure function of its input.
func documentDate() time.Time { return time.Date(2000, 1, 1, 0, 0, 0, 0, time.UTC) }

// newPDFDocument returns an fpdf document measured in points, dated when (documentDate when
// zero, in UTC), with a sorted catalogue and the Liberation fonts registered on first use by
// pdfCanvas.
func newPDFDocument(wPt, hPt float64, title string, when time.Time) *fpdf.Fpdf {
	doc := fpdf.NewCustom(&fpdf.InitType{UnitStr: "pt", Size: fpdf.SizeType{Wd: wPt, Ht: hPt}})
	if when.IsZero() {
		when = documentDate()
	}
	doc.SetCreationDate(when.UTC())
	doc.SetModificationDate(when.UTC())
	doc.SetCatalogSort(true)
	doc.SetCompression(true)
	doc.SetMargins(0, 0, 0)
	doc.SetAutoPageBreak(false, 0)
	doc.SetCreator("spanbreak", true)
	doc.SetProducer("spanbreak", true)
	if title != "" {
		doc.SetTitle(fitted(title), true)
	}
	return doc
}

// drawOnPDF paints a figure onto the current page of doc with its top-left corner at (x, y)
// [pt from the page's top-left], as vector paths and text.
func drawOnPDF(doc *fpdf.Fpdf, f *Figure, x, y float64) {
	c := newPDFCanvas(doc, x, y, f.Width, f.Height)
	f.Draw(draw.New(c))
	// leave the page state as the text flow expects it
	doc.SetDrawColor(0, 0, 0)
	doc.SetFillColor(255, 255, 255)
	doc.SetTextColor(0, 0, 0)
	doc.SetDashPattern(nil, 0)
	doc.SetLineWidth(0.5)
	if c.alpha != 1 {
		doc.SetAlpha(1, "Normal")
	}
}

// pdfCanvas is a vg.Canvas that draws onto an fpdf page inside a box. vg's origin is the box's
// bottom-left corner with y up; fpdf's is the page's top-left with y down. The canvas keeps
// its own transformation stack and maps every point itself, so fpdf transforms are needed
// only to rotate text.
type pdfCanvas struct {
	doc    *fpdf.Fpdf
	x0, y0 float64   // box top-left on the page [pt]
	w, h   vg.Length // box size
	stack  []pdfState
	alpha  float64 // current opacity; fpdf starts opaque
}

type pdfState struct {
	m     affine
	color color.Color
	width vg.Length
}

// affine maps (x, y) to (a·x + c·y + e, b·x + d·y + f).
type affine struct{ a, b, c, d, e, f float64 }

func identity() affine { return affine{a: 1, d: 1} }

// then returns the transform that applies n first, then m.
func (m affine) then(n affine) affine {
	return affine{
		a: m.a*n.a + m.c*n.b, b: m.b*n.a + m.d*n.b,
		c: m.a*n.c + m.c*n.d, d: m.b*n.c + m.d*n.d,
		e: m.a*n.e + m.c*n.f + m.e, f: m.b*n.e + m.d*n.f + m.f,
	}
}

func (m affine) apply(p vg.Point) (float64, float64) {
	x, y := float64(p.X), float64(p.Y)
	return m.a*x + m.c*y + m.e, m.b*x + m.d*y + m.f
}

func newPDFCanvas(doc *fpdf.Fpdf, x, y float64, w, h vg.Length) *pdfCanvas {
	c := &pdfCanvas{doc: doc, x0: x, y0: y, w: w, h: h,
		stack: []pdfState{{m: identity(), color: black, width: 1}}, alpha: -1}
	doc.SetLineCapStyle("butt")
	doc.SetLineJoinStyle("miter")
	c.SetColor(black)
	c.SetLineWidth(1)
	c.SetLineDash(nil, 0)
	return c
}

func (c *pdfCanvas) top() *pdfState { return &c.stack[len(c.stack)-1] }

// page maps a point of the canvas to page coordinates.
func (c *pdfCanvas) page(p vg.Point) (float64, float64) {
	x, y := c.top().m.apply(p)
	return c.x0 + x, c.y0 + float64(c.h) - y
}

// Size implements vg.CanvasSizer.
func (c *pdfCanvas) Size() (w, h vg.Length) { return c.w, c.h }

// SetLineWidth implements vg.Canvas.
func (c *pdfCanvas) SetLineWidth(w vg.Length) {
	c.top().width = w
	if w > 0 {
		c.doc.SetLineWidth(float64(w))
	}
}

// SetLineDash implements vg.Canvas.
func (c *pdfCanvas) SetLineDash(pattern []vg.Length, offset vg.Length) {
	ds := make([]float64, len(pattern))
	for i, d := range pattern {
		ds[i] = float64(d)
	}
	c.doc.SetDashPattern(ds, float64(offset))
}

// SetColor implements vg.Canvas.
func (c *pdfCanvas) SetColor(clr color.Color) {
	if clr == nil {
		clr = black
	}
	c.top().color = clr
	r, g, b, a := clr.RGBA()
	if a == 0 {
		c.setAlpha(0)
		return
	}
	// un-premultiply
	ri, gi, bi := int(r*255/a), int(g*255/a), int(b*255/a)
	c.doc.SetDrawColor(ri, gi, bi)
	c.doc.SetFillColor(ri, gi, bi)
	c.doc.SetTextColor(ri, gi, bi)
	c.setAlpha(float64(a) / 0xffff)
}

// setAlpha changes the fill and stroke opacity only when it changes, so that opaque drawing
// writes no graphics-state operators at all.
func (c *pdfCanvas) setAlpha(a float64) {
	if a == c.alpha {
		return
	}
	c.alpha = a
	c.doc.SetAlpha(a, "Normal")
}

// Rotate implements vg.Canvas.
func (c *pdfCanvas) Rotate(rad float64) {
	s, co := math.Sincos(rad)
	c.top().m = c.top().m.then(affine{a: co, b: s, c: -s, d: co})
}

// Translate implements vg.Canvas.
func (c *pdfCanvas) Translate(pt vg.Point) {
	c.top().m = c.top().m.then(affine{a: 1, d: 1, e: float64(pt.X), f: float64(pt.Y)})
}

// Scale implements vg.Canvas.
func (c *pdfCanvas) Scale(x, y float64) {
	c.top().m = c.top().m.then(affine{a: x, d: y})
}

// Push implements vg.Canvas.
func (c *pdfCanvas) Push() { c.stack = append(c.stack, *c.top()) }

// Pop implements vg.Canvas.
func (c *pdfCanvas) Pop() {
	if len(c.stack) == 1 {
		panic("plots: pdfCanvas.Pop without Push")
	}
	c.stack = c.stack[:len(c.stack)-1]
	st := *c.top()
	c.SetColor(st.color)
	c.SetLineWidth(st.width)
}

// Stroke implements vg.Canvas.
func (c *pdfCanvas) Stroke(p vg.Path) {
	if c.top().width <= 0 {
		return
	}
	c.path(p, "D")
}

// Fill implements vg.Canvas.
func (c *pdfCanvas) Fill(p vg.Path) { c.path(p, "F") }

func (c *pdfCanvas) path(p vg.Path, style string) {
	if len(p) == 0 {
		return
	}
	var start vg.Point // first point of the current sub-path
	open := false
	for _, comp := range p {
		switch comp.Type {
		case vg.MoveComp:
			c.doc.MoveTo(c.page(comp.Pos))
			start, open = comp.Pos, true
		case vg.LineComp:
			if !open {
				c.doc.MoveTo(c.page(comp.Pos))
				start, open = comp.Pos, true
			} else {
				c.doc.LineTo(c.page(comp.Pos))
			}
		case vg.ArcComp:
			c.arc(comp, open)
			if !open {
				start = arcPoint(comp, comp.Start)
			}
			open = true
		case vg.CurveComp:
			cx, cy := c.page(comp.Control[0])
			x, y := c.page(comp.Pos)
			if len(comp.Control) == 1 {
				c.doc.CurveTo(cx, cy, x, y)
			} else {
				dx, dy := c.page(comp.Control[1])
				c.doc.CurveBezierCubicTo(cx, cy, dx, dy, x, y)
			}
		case vg.CloseComp:
			c.doc.LineTo(c.page(start))
			c.doc.ClosePath()
		}
	}
	c.doc.DrawPath(style)
}

func arcPoint(comp vg.PathComp, angle float64) vg.Point {
	s, co := math.Sincos(angle)
	return vg.Point{X: comp.Pos.X + comp.Radius*vg.Length(co), Y: comp.Pos.Y + comp.Radius*vg.Length(s)}
}

// arc appends a circular arc as cubic Bézier pieces of at most 90° each, joined to the
// current point by a straight line as vg specifies.
func (c *pdfCanvas) arc(comp vg.PathComp, open bool) {
	p0 := arcPoint(comp, comp.Start)
	if open {
		c.doc.LineTo(c.page(p0))
	} else {
		c.doc.MoveTo(c.page(p0))
	}
	n := int(math.Ceil(math.Abs(comp.Angle) / (math.Pi / 2)))
	step := comp.Angle / float64(n)
	k := 4.0 / 3.0 * math.Tan(step/4) * float64(comp.Radius)
	a := comp.Start
	for i := 0; i < n; i++ {
		b := a + step
		pa, pb := arcPoint(comp, a), arcPoint(comp, b)
		sa, ca := math.Sincos(a)
		sb, cb := math.Sincos(b)
		c1 := vg.Point{X: pa.X - vg.Length(k*sa), Y: pa.Y + vg.Length(k*ca)}
		c2 := vg.Point{X: pb.X + vg.Length(k*sb), Y: pb.Y - vg.Length(k*cb)}
		x1, y1 := c.page(c1)
		x2, y2 := c.page(c2)
		x, y := c.page(pb)
		c.doc.CurveBezierCubicTo(x1, y1, x2, y2, x, y)
		a = b
	}
}

// FillString implements vg.Canvas: the text's baseline starts at pt.
func (c *pdfCanvas) FillString(f font.Face, pt vg.Point, txt string) {
	if f.Font.Size == 0 || txt == "" {
		return
	}
	txt = fitted(txt)
	family, style := c.useFont(f.Font)
	c.doc.SetFont(family, style, float64(f.Font.Size))
	x, y := c.page(pt)
	m := c.top().m
	angle := math.Atan2(m.b, m.a) * 180 / math.Pi
	if math.Abs(angle) > 1e-9 {
		c.doc.TransformBegin()
		c.doc.TransformRotate(angle, x, y)
		c.doc.Text(x, y, txt)
		c.doc.TransformEnd()
		return
	}
	c.doc.Text(x, y, txt)
}

// useFont registers the Liberation face of a font with the document on first use and
// returns its fpdf family and style.
func (c *pdfCanvas) useFont(f font.Font) (family, style string) {
	return registerFont(c.doc, f)
}

// registerFont registers the Liberation face matching f (Sans, Serif or Mono; regular, bold,
// italic) with doc on first use and returns the fpdf family and style names.
func registerFont(doc *fpdf.Fpdf, f font.Font) (family, style string) {
	bold := f.Weight >= stdfont.WeightBold
	italic := f.Style == stdfont.StyleItalic
	switch {
	case bold && italic:
		style = "BI"
	case bold:
		style = "B"
	case italic:
		style = "I"
	}
	var data []byte
	switch f.Variant {
	case "Serif":
		family = "LiberationSerif"
		data = liberationserifregular.TTF
		if bold {
			data = liberationserifbold.TTF
		}
		style = map[bool]string{true: "B", false: ""}[bold]
	case "Mono":
		family = "LiberationMono"
		data = liberationmonoregular.TTF
		if bold {
			data = liberationmonobold.TTF
		}
		style = map[bool]string{true: "B", false: ""}[bold]
	default:
		family = "LiberationSans"
		switch style {
		case "BI":
			data = liberationsansbolditalic.TTF
		case "B":
			data = liberationsansbold.TTF
		case "I":
			data = liberationsansitalic.TTF
		default:
			data = liberationsansregular.TTF
		}
	}
	doc.AddUTF8FontFromBytes(family, style, data) // a no-op once the face is registered
	return family, style
}

// DrawImage implements vg.Canvas; the image is embedded as PNG in the box's axes.
func (c *pdfCanvas) DrawImage(rect vg.Rectangle, img image.Image) {
	var buf bytes.Buffer
	if err := png.Encode(&buf, img); err != nil {
		panic(fmt.Sprintf("plots: encoding an in-memory image: %v", err))
	}
	sum := sha256.Sum256(buf.Bytes())
	name := fmt.Sprintf("img-%x", sum[:8]) // named by content: deterministic output
	opts := fpdf.ImageOptions{ImageType: "png"}
	c.doc.RegisterImageOptionsReader(name, opts, &buf)
	x0, y0 := c.page(vg.Point{X: rect.Min.X, Y: rect.Max.Y})
	x1, y1 := c.page(vg.Point{X: rect.Max.X, Y: rect.Min.Y})
	c.doc.ImageOptions(name, x0, y0, x1-x0, y1-y0, false, opts, 0, "")
}
