package plots

import (
	"errors"
	"fmt"
	"image/color"
	"math"
	"slices"

	"gonum.org/v1/plot/text"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"spanbreak/beam"
	"spanbreak/splice"
)

// DrawingInput is what the splice drawing shows: the beam section and the splice [mm].
type DrawingInput struct {
	Title    string
	Section  beam.Section
	Geometry splice.Geometry
	Position float64 // splice position along the beam [mm], for the title block; <0 to omit
	// Materials, when set, is the splice's bill of materials, drawn as a parts list above
	// the title block.
	Materials *splice.Materials
}

// maxDrawingHeight is the tallest the drawing may be: the text height of an A4 page less the
// report's header and footer (see the report's page layout).
const maxDrawingHeight = 250 * vg.Millimeter

// drawingScales are the scales 1:N the drawing may use, largest first (ISO 5455 reduction
// scales, with 1:2.5, 1:15 and 1:25 that steel detailing also uses).
func drawingScales() []float64 { return []float64{2, 2.5, 5, 10, 15, 20, 25, 50} }

// Paper allowances around each view for dimensions and labels [pt].
const (
	dimStep   vg.Length = 13 // between dimension lines
	dimFirst  vg.Length = 10 // from the part to the first dimension line
	dimText             = 6.5
	viewLabel vg.Length = 14 // view title above a view
)

// spliceDims are the resolved positions of a splice drawing [mm]: x along the beam from the
// joint centreline, y across (plan) or up (elevation) from the beam's centre.
type spliceDims struct {
	h, b, tw, tf, r     float64
	to, bo, ti, bi      float64
	fCols, fRows        int
	g, p2o, e1, p1, e2  float64
	lf                  float64 // flange plate length
	tp, hp              float64
	wCols, wRows        int
	pv, ph, eh, ev      float64
	lw                  float64 // web plate length
	gap                 float64
	d, d0               float64
	boltSize, boltClass string
	category, friction  string
	holes               string
	stub                float64 // beam shown beyond the longest plate [mm]
}

func resolveDims(sec beam.Section, g splice.Geometry) (spliceDims, error) {
	var errs []error
	bad := func(format string, a ...any) { errs = append(errs, fmt.Errorf(format, a...)) }
	size, err := splice.LookupBoltSize(g.Bolt.Size)
	if err != nil {
		bad("bolt.size: %v", err)
	}
	f, w := g.Flange, g.Web
	d := spliceDims{
		h: sec.H, b: sec.B, tw: sec.Tw, tf: sec.Tf, r: sec.R,
		to: f.Outer.Thickness, bo: f.Outer.Width, ti: f.Inner.Thickness, bi: f.Inner.Width,
		fCols: f.Columns, fRows: f.Rows, g: f.Gauge, e1: f.End, p1: f.Pitch,
		tp: w.Thickness, hp: w.Depth, wCols: w.Columns, wRows: w.Rows, pv: w.Pitch, ph: w.Spacing, eh: w.End,
		gap: g.Gap, d: size.D, d0: size.HoleDiameter(g.Holes),
		boltSize: size.Name, boltClass: g.Bolt.Class, category: string(g.Category), friction: string(g.FrictionClass),
		holes: string(g.Holes),
	}
	if d.holes == "" {
		d.holes = string(splice.NormalHoles)
	}
	for _, v := range []struct {
		name string
		v    float64
	}{{"section h", d.h}, {"section b", d.b}, {"section tw", d.tw}, {"section tf", d.tf},
		{"flange.outer.thickness", d.to}, {"flange.outer.width", d.bo}, {"flange.gauge", d.g}, {"flange.end", d.e1},
		{"web.thickness", d.tp}, {"web.depth", d.hp}, {"web.end", d.eh}} {
		if !(v.v > 0) || math.IsInf(v.v, 0) {
			bad("%s: %g mm must be more than 0", v.name, v.v)
		}
	}
	if d.fCols != 2 && d.fCols != 4 {
		bad("flange.columns: %d must be 2 or 4", d.fCols)
	}
	if d.fRows < 1 || d.wRows < 1 || d.wCols < 1 {
		bad("bolt rows and columns must be at least 1 (flange rows %d, web rows %d, web columns %d)", d.fRows, d.wRows, d.wCols)
	}
	if !(d.gap >= 0) {
		bad("gap: %g mm must not be negative", d.gap)
	}
	if d.fRows == 1 {
		d.p1 = 0
	}
	if d.wRows == 1 {
		d.pv = 0
	}
	if d.wCols == 1 {
		d.ph = 0
	}
	if d.fCols == 4 {
		d.e2 = f.Edge
		d.p2o = (d.bo - 2*d.e2 - d.g) / 2
		if !(d.p2o > 0) {
			bad("flange: width %g − 2×edge %g − gauge %g leaves no room for the outer bolt lines", d.bo, d.e2, d.g)
		}
	} else {
		d.e2 = (d.bo - d.g) / 2
	}
	d.ev = (d.hp - float64(d.wRows-1)*d.pv) / 2
	d.lf = d.gap + 2*(2*d.e1+float64(d.fRows-1)*d.p1)
	d.lw = d.gap + 2*(2*d.eh+float64(d.wCols-1)*d.ph)
	d.stub = math.Max(60, 0.12*math.Max(d.lf, d.lw))
	return d, errors.Join(errs...)
}

// SpliceDrawing draws the splice to a standard scale: the elevation with the web cover plates
// and their bolts, the flange plates and bolts seen edge-on, and the plan of the top flange
// with its cover plate and bolts; both views dimensioned (pitches, end and edge distances,
// gauge, gap, plate sizes) above a title block with the bolt size and class and the plates.
func SpliceDrawing(in DrawingInput) (*Figure, error) {
	d, err := resolveDims(in.Section, in.Geometry)
	if err != nil {
		return nil, fmt.Errorf("splice drawing: %w", err)
	}
	notes := d.notes(in.Section.Name, in.Position)
	title := in.Title
	if title == "" {
		title = "Bolted cover-plate splice, " + in.Section.Name
	}
	const margin, gap = 6, 8
	noteH := vg.Length(len(notes))*(noteSize+3.5) + 8
	var parts [][]string
	if in.Materials != nil {
		parts = partsList(*in.Materials)
	}
	partsH := vg.Length(0)
	if len(parts) > 0 {
		partsH = vg.Length(len(parts))*(noteSize+3.5) + 8 + gap
	}
	titleH := textStyle(sansBold(titleSize), black).Height(title) + 4
	l := d.layout(figureWidth-2*margin, maxDrawingHeight-2*margin-titleH-noteH-partsH-gap)
	fig := &Figure{Name: "splice", Caption: "Dimensioned drawing of the chosen splice: elevation and plan of the top flange",
		Width: figureWidth, Height: 2*margin + titleH + l.height + gap + partsH + noteH}
	fig.paint = func(dc draw.Canvas) {
		dc = draw.Crop(dc, margin, -margin, margin, -margin)
		dc = drawTitle(dc, title)
		d.drawViews(draw.Crop(dc, 0, 0, noteH+partsH+gap, 0), l)
		if len(parts) > 0 {
			drawPartsList(draw.Crop(dc, 0, 0, noteH+gap, -(dc.Max.Y-dc.Min.Y-noteH-partsH)), parts)
		}
		drawTitleBlock(draw.Crop(dc, 0, 0, 0, -(dc.Max.Y-dc.Min.Y-noteH)), notes)
	}
	return fig, nil
}

// partsList is the drawing's parts list: a header row, then one row a line of the bill
// (bolts, nuts, washers, plates), then the holes and the bill's mass.
func partsList(m splice.Materials) [][]string {
	rows := [][]string{{"item", "part", "description", "size", "class / grade", "quantity", "each [kg]", "total [kg]"}}
	total := 0.0
	for _, it := range m.Items {
		size := it.Size
		if it.Item == "plate" {
			size = fmt.Sprintf("%s × %s × %s", mm(it.Thickness), mm(it.Width), mm(it.Length))
		}
		rows = append(rows, []string{it.Item, it.Part, it.Name, size, it.Grade, fmt.Sprint(it.Quantity),
			fixed(it.UnitMass, 3), fixed(it.TotalMass(), 2)})
		total += it.TotalMass()
	}
	tail := fmt.Sprintf("%d holes", m.Holes)
	if m.FayingArea > 0 {
		tail += fmt.Sprintf(", %s m² of prepared faying surface", fixed(m.FayingArea, 2))
	}
	return append(rows, []string{"", "", tail, "", "", "", "in all", fixed(total, 1)})
}

// partsColumn is a column of the parts list: where its text starts, as a fraction of the
// list's width, or for numbers (right) where it ends.
type partsColumn struct {
	at    float64
	right bool
}

// partsColumns are the parts list's columns.
func partsColumns() []partsColumn {
	return []partsColumn{{0, false}, {0.075, false}, {0.205, false}, {0.5, false}, {0.635, false}, {0.80, true}, {0.90, true}, {1, true}}
}

// drawPartsList frames the parts list (rows[0] is the header).
func drawPartsList(c draw.Canvas, rows [][]string) {
	frame := []vg.Point{c.Min, {X: c.Max.X, Y: c.Min.Y}, c.Max, {X: c.Min.X, Y: c.Max.Y}, c.Min}
	c.StrokeLines(lineStyle(black, 0.6), frame)
	in := draw.Crop(c, 5, -5, 0, -4)
	w := in.Max.X - in.Min.X
	cols := partsColumns()
	y := in.Max.Y
	for i, r := range rows {
		sty := textStyle(sans(noteSize), black)
		if i == 0 {
			sty.Font = sansBold(noteSize)
		}
		sty.YAlign = draw.YTop
		for j, cell := range r {
			s := sty
			if cols[j].right {
				s.XAlign = draw.XRight
			}
			in.FillText(s, vg.Point{X: in.Min.X + vg.Length(cols[j].at)*w, Y: y}, cell)
		}
		y -= noteSize + 3.5
		if i == 0 {
			c.StrokeLine2(thin(), c.Min.X, y+2, c.Max.X, y+2)
		}
	}
}

// notes are the title block lines: what is bolted with what.
func (d spliceDims) notes(section string, position float64) []string {
	cat := map[string]string{"A": "category A, bearing type", "B": "category B, slip-resistant at SLS",
		"C": "category C, slip-resistant at ULS"}[d.category]
	if cat == "" {
		cat = "category " + d.category
	}
	bolts := fmt.Sprintf("Bolts: %s class %s, %s", d.boltSize, d.boltClass, cat)
	if d.category == "B" || d.category == "C" {
		bolts += fmt.Sprintf(", preloaded, faying surfaces friction class %s", d.friction)
	}
	bolts += fmt.Sprintf("; %s holes d0 = %s mm", d.holes, mm(d.d0))
	fb := d.fCols * d.fRows * 2
	wb := d.wCols * d.wRows * 2
	outer := fmt.Sprintf("Flange cover plates (each flange): outer %s × %s × %s", mm(d.to), mm(d.bo), mm(d.lf))
	if d.ti > 0 {
		outer += fmt.Sprintf(", inner 2 × %s × %s × %s", mm(d.ti), mm(d.bi), mm(d.lf))
	}
	outer += " mm (t × b × L)"
	lines := []string{
		bolts,
		outer,
		fmt.Sprintf("Flange bolts: %d lines × %s each side of the joint, %d per flange; gauge %s, %send e1 %s, edge e2 %s mm",
			d.fCols, plural(d.fRows, "row"), fb, mm(d.g), flangeSpacings(d), mm(d.e1), mm(d.e2)),
		fmt.Sprintf("Web cover plates: 2 × %s × %s × %s mm (t × depth × L); bolts %s × %s each side, %d in all; %send %s, edge %s mm",
			mm(d.tp), mm(d.hp), mm(d.lw), plural(d.wCols, "column"), plural(d.wRows, "row"), wb, webSpacings(d), mm(d.eh), mm(d.ev)),
		fmt.Sprintf("Gap between the beam ends %s mm. Bolts in the splice: %d. Dimensions in mm.", mm(d.gap), 2*fb+wb),
	}
	head := "Beam " + section
	if position >= 0 {
		head += ", splice at x = " + fmtM(position)
	}
	return append([]string{head}, lines...)
}

// plural is "1 row", "3 rows".
func plural(n int, word string) string {
	if n == 1 {
		return "1 " + word
	}
	return fmt.Sprintf("%d %ss", n, word)
}

// webSpacings lists the web pitch and column spacing that exist ("pitch 80, spacing 70, ").
func webSpacings(d spliceDims) string {
	s := ""
	if d.wRows > 1 {
		s += "pitch " + mm(d.pv) + ", "
	}
	if d.wCols > 1 {
		s += "spacing " + mm(d.ph) + ", "
	}
	return s
}

// flangeSpacings lists the flange pitch (and the outer line spacing of four lines).
func flangeSpacings(d spliceDims) string {
	s := ""
	if d.fRows > 1 {
		s += "pitch p1 " + mm(d.p1) + ", "
	}
	if d.fCols == 4 {
		s += "outer lines p2 " + mm(d.p2o) + ", "
	}
	return s
}

// mm prints a dimension [mm] without needless decimals.
func mm(v float64) string { return formatClean(v, stepDecimals(math.Round(v*10)/10)) }

// drawTitleBlock frames the notes under the views.
func drawTitleBlock(c draw.Canvas, lines []string) {
	frame := []vg.Point{c.Min, {X: c.Max.X, Y: c.Min.Y}, c.Max, {X: c.Min.X, Y: c.Max.Y}, c.Min}
	c.StrokeLines(lineStyle(black, 0.6), frame)
	in := draw.Crop(c, 5, -5, 0, -4)
	sty := textStyle(sans(noteSize), black)
	sty.YAlign = draw.YTop
	y := in.Max.Y
	for i, l := range lines {
		s := sty
		if i == 0 {
			s.Font = sansBold(noteSize)
		}
		in.FillText(s, vg.Point{X: in.Min.X, Y: y}, l)
		y -= noteSize + 3.5
	}
}

// sheet maps model millimetres to paper points at a scale.
type sheet struct {
	c      draw.Canvas
	ox, oy vg.Length // paper position of the model origin
	k      float64   // paper points per model millimetre
}

func (s sheet) pt(x, y float64) vg.Point {
	return vg.Point{X: s.ox + vg.Length(x*s.k), Y: s.oy + vg.Length(y*s.k)}
}

func (s sheet) rect(x0, y0, x1, y1 float64, fill color.Color, edge draw.LineStyle) {
	pts := []vg.Point{s.pt(x0, y0), s.pt(x1, y0), s.pt(x1, y1), s.pt(x0, y1)}
	if fill != nil {
		s.c.FillPolygon(fill, pts)
	}
	if edge.Width > 0 {
		s.c.StrokeLines(edge, append(pts, pts[0]))
	}
}

func (s sheet) line(sty draw.LineStyle, x0, y0, x1, y1 float64) {
	s.c.StrokeLines(sty, []vg.Point{s.pt(x0, y0), s.pt(x1, y1)})
}

// hole draws a bolt hole of diameter d0 with its centre cross.
func (s sheet) hole(x, y, d0 float64) {
	c := s.pt(x, y)
	r := vg.Length(d0 / 2 * s.k)
	var p vg.Path
	p.Move(vg.Point{X: c.X + r, Y: c.Y})
	p.Arc(c, r, 0, 2*math.Pi)
	p.Close()
	s.c.SetColor(white)
	s.c.Fill(p)
	s.c.SetLineStyle(lineStyle(black, 0.6))
	s.c.Stroke(p)
	cross := r + 1.5
	s.c.StrokeLine2(centreStyle(), c.X-cross, c.Y, c.X+cross, c.Y)
	s.c.StrokeLine2(centreStyle(), c.X, c.Y-cross, c.X, c.Y+cross)
}

func outline() draw.LineStyle { return lineStyle(black, 0.7) }
func thin() draw.LineStyle    { return lineStyle(black, 0.35) }
func hidden() draw.LineStyle {
	return draw.LineStyle{Color: darkGrey, Width: 0.4, Dashes: []vg.Length{2.5, 1.5}}
}
func centreStyle() draw.LineStyle {
	return draw.LineStyle{Color: midGrey, Width: 0.3, Dashes: []vg.Length{6, 1.5, 1, 1.5}}
}

// dimension is one dimension line: the features at a and b (model coordinates along the
// dimension), the reference coordinate across it where the extension lines start, and the
// paper offset of the line from there.
type dimSeg struct {
	a, b  float64
	label string
}

// dimH draws a chain of horizontal dimensions at paper offset off (positive up) from the
// model line y = yRef. It returns the extra depth taken by text set on the far side of the
// line (a segment too short for its text), which the next line out must clear.
func (s sheet) dimH(segs []dimSeg, yRef float64, off vg.Length) (extra vg.Length) {
	y0 := s.pt(0, yRef).Y
	yl := y0 + off
	sty := dimStyle()
	dir := vg.Length(1)
	if off < 0 {
		dir = -1
	}
	levels, extra := farLevels(segs, s.k)
	th := sty.Height("0")
	for i, sg := range segs {
		xa, xb := s.pt(sg.a, 0).X, s.pt(sg.b, 0).X
		for _, x := range []vg.Length{xa, xb} {
			s.c.StrokeLine2(thin(), x, y0+dir*2, x, yl+dir*2)
		}
		s.c.StrokeLine2(thin(), xa, yl, xb, yl)
		tick(s.c, xa, yl)
		tick(s.c, xb, yl)
		ty := yl + 1
		switch {
		case levels[i] > 0 && off < 0:
			ty = yl - 1.5 - vg.Length(levels[i])*(th+1)
		case levels[i] > 0:
			ty = yl + 1 + vg.Length(levels[i])*(th+1)
		}
		s.c.FillText(sty, vg.Point{X: (xa + xb) / 2, Y: ty}, sg.label)
	}
	return extra
}

// dimStyle is the text of dimensions: centred over the line.
func dimStyle() text.Style {
	sty := textStyle(sans(dimText), black)
	sty.XAlign = draw.XCenter
	sty.YAlign = draw.YBottom
	return sty
}

// farLevels decides where each segment's text goes at k points per millimetre: 0 between
// the ticks, or level 1, 2, ... on the far side of the line for a segment too short for its
// text, on the first level where it clears the texts already there. extra is the paper the
// far-side levels take.
func farLevels(segs []dimSeg, k float64) (levels []int, extra vg.Length) {
	sty := dimStyle()
	th := sty.Height("0")
	var placed [][][2]vg.Length // text extents on each far-side level
	clear := func(lvl int, x0, x1 vg.Length) bool {
		for _, r := range placed[lvl] {
			if x0 < r[1]+2 && x1 > r[0]-2 {
				return false
			}
		}
		return true
	}
	levels = make([]int, len(segs))
	for i, sg := range segs {
		xa, xb := vg.Length(sg.a*k), vg.Length(sg.b*k)
		w := sty.Width(sg.label)
		if w <= xb-xa-2 {
			continue
		}
		mid := (xa + xb) / 2
		lvl := 0
		for lvl < len(placed) && !clear(lvl, mid-w/2, mid+w/2) {
			lvl++
		}
		if lvl == len(placed) {
			placed = append(placed, nil)
		}
		placed[lvl] = append(placed[lvl], [2]vg.Length{mid - w/2, mid + w/2})
		levels[i] = lvl + 1
		extra = max(extra, vg.Length(lvl+1)*(th+1)+1)
	}
	return levels, extra
}

// dimV draws a chain of vertical dimensions at paper offset off (positive right) from the
// model line x = xRef; the text reads from below, rotated a quarter turn.
func (s sheet) dimV(segs []dimSeg, xRef float64, off vg.Length) {
	x0 := s.pt(xRef, 0).X
	xl := x0 + off
	sty := textStyle(sans(dimText), black)
	sty.Rotation = math.Pi / 2
	sty.XAlign = draw.XCenter
	sty.YAlign = draw.YBottom
	dir := vg.Length(1)
	if off < 0 {
		dir = -1
	}
	raised := false
	for i, sg := range segs {
		ya, yb := s.pt(0, sg.a).Y, s.pt(0, sg.b).Y
		for _, y := range []vg.Length{ya, yb} {
			s.c.StrokeLine2(thin(), x0+dir*2, y, xl+dir*2, y)
		}
		s.c.StrokeLine2(thin(), xl, ya, xl, yb)
		tick(s.c, xl, ya)
		tick(s.c, xl, yb)
		w := sty.Width(sg.label)
		tx := xl - 1
		if w > yb-ya-2 {
			if !raised || i == 0 {
				tx = xl - 1 - sty.Height(sg.label)
			}
			raised = !raised
		} else {
			raised = false
		}
		s.c.FillText(sty, vg.Point{X: tx, Y: (ya + yb) / 2}, sg.label)
	}
}

// tick is the oblique stroke that ends a dimension line.
func tick(c draw.Canvas, x, y vg.Length) {
	c.StrokeLine2(lineStyle(black, 0.6), x-2, y-2, x+2, y+2)
}

// chain builds dimension segments between consecutive points, labelling runs of equal
// spacing between bolt lines as "n × p = total" (the drawing convention for repeated
// pitches). bolt[i] says whether points[i] is a bolt line; end and edge distances are never
// merged with a pitch.
func chain(points []float64, bolt []bool) []dimSeg {
	var segs []dimSeg
	for i := 0; i+1 < len(points); {
		step := points[i+1] - points[i]
		j := i + 1
		if bolt[i] && bolt[j] {
			for j+1 < len(points) && bolt[j+1] && math.Abs(points[j+1]-points[j]-step) < 1e-6 {
				j++
			}
		}
		n := j - i
		label := mm(step)
		if n > 1 {
			label = fmt.Sprintf("%d × %s = %s", n, mm(step), mm(points[j]-points[i]))
		}
		segs = append(segs, dimSeg{a: points[i], b: points[j], label: label})
		i = j
	}
	return segs
}

// framed is the chain of a plate edge, bolt lines and the other edge, with its bolt flags.
func framed(lo float64, lines []float64, hi float64) ([]float64, []bool) {
	pts := append(append([]float64{lo}, lines...), hi)
	bolt := make([]bool, len(pts))
	for i := 1; i < len(pts)-1; i++ {
		bolt[i] = true
	}
	return pts, bolt
}

// boltLinesX are the bolt rows (flange) or columns (web) along the beam, both sides, from
// the joint centreline [mm].
func boltLinesX(gap, end, pitch float64, n int) []float64 {
	var xs []float64
	for k := n - 1; k >= 0; k-- {
		xs = append(xs, -(gap/2 + end + float64(k)*pitch))
	}
	for k := 0; k < n; k++ {
		xs = append(xs, gap/2+end+float64(k)*pitch)
	}
	return xs
}

// flangeLinesY are the flange bolt lines across the flange from the web centreline [mm].
func (d spliceDims) flangeLinesY() []float64 {
	if d.fCols == 4 {
		return []float64{-d.g/2 - d.p2o, -d.g / 2, d.g / 2, d.g/2 + d.p2o}
	}
	return []float64{-d.g / 2, d.g / 2}
}

// webRowsY are the web bolt rows from the beam's mid-depth, top first [mm].
func (d spliceDims) webRowsY() []float64 {
	var ys []float64
	for k := 0; k < d.wRows; k++ {
		ys = append(ys, d.hp/2-d.ev-float64(k)*d.pv)
	}
	return ys
}

// extents of the two views in model mm and the paper they need around them.
func (d spliceDims) halfLength() float64 { return math.Max(d.lf, d.lw)/2 + d.stub }

func (d spliceDims) elevationHeight() float64 { return d.h + 2*d.to + 2*0.7*d.d }

// drawViews chooses the largest standard scale at which both views and their dimensions fit
// in c, then draws the elevation above the plan.
// drawingLayout is the scale of a drawing and the paper height its two views take.
type drawingLayout struct {
	scale  float64   // the drawing is at 1:scale
	k      float64   // paper points per model millimetre
	height vg.Length // both views with their labels and dimensions
	left   vg.Length // paper left of the elevation for its vertical dimensions
	width  vg.Length // paper width for the model
}

// Paper allowances around the views [pt].
const (
	dimLeft  = 3*dimStep + dimFirst + 10 // vertical dimension chains left of the elevation
	dimRight = 3*dimStep + dimFirst      // across-flange chains right of the plan
	dimBelow = 2*dimStep + dimFirst      // chains under each view, plus the text set outside (farLevels)
)

// layout picks the largest standard scale at which the views fit the width and at most
// maxHeight of paper.
func (d spliceDims) layout(width, maxHeight vg.Length) drawingLayout {
	avail := width - dimLeft - dimRight
	var l drawingLayout
	for _, n := range drawingScales() {
		k := 72 / 25.4 / n
		l = drawingLayout{scale: n, k: k, left: dimLeft, width: avail, height: d.viewsHeight(k)}
		if vg.Length(2*d.halfLength()*k) <= avail && l.height <= maxHeight {
			break
		}
	}
	return l
}

// viewsHeight is the paper height of both views at k points per millimetre, with the text
// the dimension chains set outside their lines.
func (d spliceDims) viewsHeight(k float64) vg.Length {
	_, we := farLevels(d.webChain(), k)
	_, fe := farLevels(d.flangeChain(), k)
	return viewLabel + 4 + vg.Length(d.elevationHeight()*k) + dimBelow + we +
		viewLabel + 6 + vg.Length(math.Max(d.b, d.bo)*k) + dimBelow + fe
}

// drawViews draws the elevation above the plan at the layout's scale, from the top of c.
func (d spliceDims) drawViews(c draw.Canvas, l drawingLayout) {
	k := l.k
	cx := c.Min.X + l.left + l.width/2
	elevTop := c.Max.Y - viewLabel
	elev := sheet{c: c, ox: cx, oy: elevTop - vg.Length((d.elevationHeight()/2)*k) - 4, k: k}
	d.drawElevation(elev)
	viewTitle(c, vg.Point{X: c.Min.X, Y: c.Max.Y}, fmt.Sprintf("ELEVATION, web splice (scale 1:%s)", mm(l.scale)))
	_, we := farLevels(d.webChain(), k)
	elevBottom := elev.pt(0, -d.elevationHeight()/2).Y - dimBelow - we
	planTop := elevBottom - viewLabel
	half := math.Max(d.b, d.bo) / 2
	plan := sheet{c: c, ox: cx, oy: planTop - vg.Length(half*k) - 6, k: k}
	viewTitle(c, vg.Point{X: c.Min.X, Y: elevBottom + 2}, fmt.Sprintf("PLAN of the top flange (scale 1:%s)", mm(l.scale)))
	d.drawPlan(plan)
}

func viewTitle(c draw.Canvas, at vg.Point, s string) {
	sty := textStyle(sansBold(8), black)
	sty.YAlign = draw.YTop
	c.FillText(sty, at, s)
}

// drawElevation draws the side view: beam ends with the gap, flange plates and flange bolts
// edge-on, web cover plate with its bolts, and the dimension chains.
func (d spliceDims) drawElevation(s sheet) {
	L := d.halfLength()
	h2 := d.h / 2
	// beam ends
	for _, side := range []float64{-1, 1} {
		x0, x1 := side*d.gap/2, side*L
		s.rect(math.Min(x0, x1), -h2, math.Max(x0, x1), h2, steelFill, draw.LineStyle{})
		// flanges, with the root-fillet tangent lines
		for _, y := range []float64{h2, h2 - d.tf, -h2 + d.tf, -h2} {
			s.line(outline(), x0, y, x1, y)
		}
		for _, y := range []float64{h2 - d.tf - d.r, -h2 + d.tf + d.r} {
			s.line(thin(), x0, y, x1, y)
		}
		s.line(outline(), x0, -h2, x0, h2) // beam end
		breakLine(s, x1, -h2, h2, -side)
	}
	// web cover plate (the near one), the beam ends hidden behind it, and inner flange plates
	s.rect(-d.lw/2, -d.hp/2, d.lw/2, d.hp/2, plateFill, outline())
	s.line(hidden(), -d.gap/2, -d.hp/2, -d.gap/2, d.hp/2)
	s.line(hidden(), d.gap/2, -d.hp/2, d.gap/2, d.hp/2)
	if d.ti > 0 {
		s.rect(-d.lf/2, h2-d.tf-d.ti, d.lf/2, h2-d.tf, plateFill, outline())
		s.rect(-d.lf/2, -h2+d.tf, d.lf/2, -h2+d.tf+d.ti, plateFill, outline())
	}
	// outer flange plates
	s.rect(-d.lf/2, h2, d.lf/2, h2+d.to, plateFill, outline())
	s.rect(-d.lf/2, -h2-d.to, d.lf/2, -h2, plateFill, outline())
	// flange bolts edge-on: shank centre line, head on the outer plate, nut under the flange
	head := 0.65 * d.d
	for _, x := range boltLinesX(d.gap, d.e1, d.p1, d.fRows) {
		for _, sgn := range []float64{1, -1} {
			outerFace := sgn * (h2 + d.to)
			innerFace := sgn * (h2 - d.tf - d.ti)
			s.line(centreStyle(), x, outerFace+sgn*head*1.6, x, innerFace-sgn*head*1.6)
			s.rect(x-0.85*d.d, outerFace, x+0.85*d.d, outerFace+sgn*head, white, outline())
			s.rect(x-0.85*d.d, innerFace, x+0.85*d.d, innerFace-sgn*head, white, outline())
		}
	}
	// web bolts
	cols := boltLinesX(d.gap, d.eh, d.ph, d.wCols)
	rows := d.webRowsY()
	for _, x := range cols {
		for _, y := range rows {
			s.hole(x, y, d.d0)
		}
	}
	// joint centreline
	s.line(centreStyle(), 0, -h2-d.to-head-8, 0, h2+d.to+head+8)

	// dimensions: web bolt columns and plate length under the beam
	bottom := -h2 - d.to - head
	extra := s.dimH(d.webChain(), bottom, -dimFirst)
	s.dimH([]dimSeg{{a: -d.lw / 2, b: d.lw / 2, label: "web plate " + mm(d.lw)}}, bottom, -(dimFirst + dimStep + extra))
	// vertical: web rows and plate depth, beam depth, on the left
	leftEdge := -L
	up := slices.Clone(rows)
	slices.Reverse(up)
	xRef := -d.lw / 2
	s.dimV(chain(framed(-d.hp/2, up, d.hp/2)), xRef, -vg.Length((xRef-leftEdge)*s.k)-dimFirst)
	s.dimV([]dimSeg{{a: -d.hp / 2, b: d.hp / 2, label: "web plate " + mm(d.hp)}}, xRef, -vg.Length((xRef-leftEdge)*s.k)-dimFirst-dimStep)
	s.dimV([]dimSeg{{a: -h2, b: h2, label: "h " + mm(d.h)}}, leftEdge, -dimFirst-2*dimStep)
}

// alongChain is the chain of positions along the beam: plate end, the bolt lines of the left
// side, both beam ends, the bolt lines of the right side, plate end; with the bolt flags.
func alongChain(length float64, lines []float64, gap float64) ([]float64, []bool) {
	pts, bolt := []float64{-length / 2}, []bool{false}
	for _, x := range lines {
		if x > 0 && pts[len(pts)-1] < 0 {
			pts, bolt = append(pts, -gap/2, gap/2), append(bolt, false, false)
		}
		pts, bolt = append(pts, x), append(bolt, true)
	}
	return append(pts, length/2), append(bolt, false)
}

// webChain and flangeChain are the dimension chains along the beam under the elevation and
// the plan.
func (d spliceDims) webChain() []dimSeg {
	return withGap(chain(alongChain(d.lw, boltLinesX(d.gap, d.eh, d.ph, d.wCols), d.gap)), d.gap)
}

func (d spliceDims) flangeChain() []dimSeg {
	return withGap(chain(alongChain(d.lf, boltLinesX(d.gap, d.e1, d.p1, d.fRows), d.gap)), d.gap)
}

// withGap replaces the label of the chain segment across the joint by "gap g".
func withGap(segs []dimSeg, gap float64) []dimSeg {
	for i := range segs {
		if math.Abs(segs[i].a+gap/2) < 1e-6 && math.Abs(segs[i].b-gap/2) < 1e-6 {
			segs[i].label = "gap " + mm(gap)
		}
	}
	return segs
}

// breakLine draws the zig-zag that shows the beam continues beyond x; inward (+1 or −1) is
// the side the beam is drawn on, so the zig-zag stays on the part.
func breakLine(s sheet, x, y0, y1, inward float64) {
	h := y1 - y0
	a := inward * math.Min(0.04*h, 12)
	pts := []vg.Point{
		s.pt(x, y0), s.pt(x, y0+0.42*h), s.pt(x+2*a, y0+0.47*h), s.pt(x, y0+0.53*h),
		s.pt(x, y0+0.58*h), s.pt(x, y1),
	}
	s.c.StrokeLines(thin(), pts)
}

// drawPlan draws the top flange from above: beam flange with the gap, outer cover plate with
// its bolts, the inner plates and the web hidden, and the dimension chains.
func (d spliceDims) drawPlan(s sheet) {
	L := d.halfLength()
	b2 := d.b / 2
	for _, side := range []float64{-1, 1} {
		x0, x1 := side*d.gap/2, side*L
		s.rect(math.Min(x0, x1), -b2, math.Max(x0, x1), b2, steelFill, draw.LineStyle{})
		s.line(outline(), x0, b2, x1, b2)
		s.line(outline(), x0, -b2, x1, -b2)
		s.line(outline(), x0, -b2, x0, b2)
		s.line(hidden(), x0, d.tw/2, x1, d.tw/2)
		s.line(hidden(), x0, -d.tw/2, x1, -d.tw/2)
		breakLine(s, x1, -b2, b2, -side)
	}
	s.rect(-d.lf/2, -d.bo/2, d.lf/2, d.bo/2, plateFill, outline())
	if d.ti > 0 {
		for _, sgn := range []float64{1, -1} {
			yOut, yIn := sgn*d.bo/2, sgn*(d.bo/2-d.bi)
			s.rect(-d.lf/2, math.Min(yOut, yIn), d.lf/2, math.Max(yOut, yIn), nil, hidden())
		}
	}
	rows := boltLinesX(d.gap, d.e1, d.p1, d.fRows)
	lines := d.flangeLinesY()
	for _, x := range rows {
		for _, y := range lines {
			s.hole(x, y, d.d0)
		}
	}
	s.line(centreStyle(), 0, -b2-8, 0, b2+8)
	s.line(centreStyle(), -L-5, 0, L+5, 0)
	// along the beam, under the plan
	bottom := -math.Max(b2, d.bo/2)
	extra := s.dimH(d.flangeChain(), bottom, -dimFirst)
	s.dimH([]dimSeg{{a: -d.lf / 2, b: d.lf / 2, label: "flange plate " + mm(d.lf)}}, bottom, -(dimFirst + dimStep + extra))
	// across the flange, right of the plan
	xr := L
	s.dimV(chain(framed(-d.bo/2, lines, d.bo/2)), d.lf/2, vg.Length((xr-d.lf/2)*s.k)+dimFirst)
	s.dimV([]dimSeg{{a: -d.bo / 2, b: d.bo / 2, label: "plate " + mm(d.bo)}}, d.lf/2, vg.Length((xr-d.lf/2)*s.k)+dimFirst+dimStep)
	s.dimV([]dimSeg{{a: -b2, b: b2, label: "b " + mm(d.b)}}, xr, dimFirst+2*dimStep)
}
