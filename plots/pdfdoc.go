package plots

import (
	"bytes"
	"fmt"
	"math"
	"strings"
	"time"

	"codeberg.org/go-pdf/fpdf"
	stdfont "golang.org/x/image/font"
	"gonum.org/v1/plot/vg"
)

// A4 page and the report's layout [pt].
const (
	pageW       = 595.28
	pageH       = 841.89
	marginX     = 42.52 // 15 mm
	marginTop   = 34.0  // 12 mm
	marginBot   = 42.52 // 15 mm, with the footer inside it
	contentW    = pageW - 2*marginX
	headerSpace = 16.0 // running header line above the content
	bodySize    = 9.0
	bodyLead    = 12.0
	smallSize   = 7.5
	smallLead   = 9.5
)

// contentTop and contentBottom bound the text block of every page [pt from the top].
const (
	contentTop    = marginTop + headerSpace
	contentBottom = pageH - marginBot
)

// heading is a numbered heading and the page it landed on.
type heading struct {
	Number, Title string
	Level         int
	Page          int
}

// pdfDoc is a flowing A4 document on fpdf: headings, paragraphs, tables and figures, with a
// running header and footer. It records every string it prints, so the report's text can be
// checked without a PDF reader.
type pdfDoc struct {
	f        *fpdf.Fpdf
	header   string // running header text
	footer   string // left part of the footer
	pages    int    // total pages, when known (second pass), for "page n of N"
	text     strings.Builder
	headings []heading
	counters [3]int
}

func newPDFDoc(title, header, footer string, totalPages int, when time.Time) *pdfDoc {
	f := newPDFDocument(pageW, pageH, title, when)
	f.SetMargins(marginX, contentTop, marginX)
	f.SetAutoPageBreak(true, marginBot)
	d := &pdfDoc{f: f, header: fitted(header), footer: fitted(footer), pages: totalPages}
	f.SetHeaderFuncMode(d.drawHeader, true)
	f.SetFooterFunc(d.drawFooter)
	d.setFont(false, false, bodySize)
	return d
}

// setFont selects Liberation Sans.
func (d *pdfDoc) setFont(bold, italic bool, size float64) {
	fnt := sans(vg.Length(size))
	if bold {
		fnt = sansBold(vg.Length(size))
	}
	if italic {
		fnt.Style = stdfont.StyleItalic
	}
	family, style := registerFont(d.f, fnt)
	d.f.SetFont(family, style, size)
}

func (d *pdfDoc) record(s string) {
	d.text.WriteString(s)
	d.text.WriteByte('\n')
}

func (d *pdfDoc) drawHeader() {
	d.setFont(false, false, smallSize)
	d.f.SetTextColor(90, 90, 90)
	d.f.Text(marginX, marginTop, d.header)
	d.f.SetDrawColor(160, 160, 160)
	d.f.SetLineWidth(0.4)
	d.f.Line(marginX, marginTop+3, pageW-marginX, marginTop+3)
	d.f.SetTextColor(0, 0, 0)
	d.f.SetDrawColor(0, 0, 0)
	d.f.SetXY(marginX, contentTop)
	d.setFont(false, false, bodySize)
}

func (d *pdfDoc) drawFooter() {
	d.setFont(false, false, smallSize)
	d.f.SetTextColor(90, 90, 90)
	y := pageH - marginBot + 16
	d.f.SetDrawColor(160, 160, 160)
	d.f.SetLineWidth(0.4)
	d.f.Line(marginX, y-9, pageW-marginX, y-9)
	d.f.Text(marginX, y, d.footer)
	page := fmt.Sprintf("page %d", d.f.PageNo())
	if d.pages > 0 {
		page += fmt.Sprintf(" of %d", d.pages)
	}
	d.f.Text(pageW-marginX-d.f.GetStringWidth(page), y, page)
	d.record(page)
	d.f.SetTextColor(0, 0, 0)
	d.f.SetDrawColor(0, 0, 0)
	d.setFont(false, false, bodySize)
}

// remaining is the height left on the current page [pt].
func (d *pdfDoc) remaining() float64 { return contentBottom - d.f.GetY() }

// ensure starts a new page unless h [pt] fits on this one.
func (d *pdfDoc) ensure(h float64) {
	if d.f.PageNo() == 0 || d.remaining() < h {
		d.f.AddPage()
	}
}

// newPage starts a page.
func (d *pdfDoc) newPage() { d.f.AddPage() }

// heading writes a numbered heading (level 0: "3 Envelopes", 1: "3.2 Reactions") and an
// outline entry, keeping it with at least keep [pt] of what follows.
func (d *pdfDoc) heading(level int, title string, keep float64) {
	d.counters[level]++
	for i := level + 1; i < len(d.counters); i++ {
		d.counters[i] = 0
	}
	parts := make([]string, level+1)
	for i := 0; i <= level; i++ {
		parts[i] = fmt.Sprint(d.counters[i])
	}
	num := strings.Join(parts, ".")
	size := []float64{13, 10.5, 9.5}[level]
	space := []float64{10, 7, 5}[level]
	d.ensure(space + size + 6 + keep)
	if d.f.GetY() > contentTop+1 {
		d.f.Ln(space)
	}
	d.setFont(true, false, size)
	d.f.SetX(marginX)
	txt := fitted(num + "  " + title)
	d.f.Bookmark(txt, level, -1)
	d.f.CellFormat(contentW, size+4, txt, "", 1, "L", false, 0, "")
	d.record(txt)
	d.headings = append(d.headings, heading{Number: num, Title: title, Level: level, Page: d.f.PageNo()})
	d.setFont(false, false, bodySize)
	d.f.Ln(2)
}

// para writes a wrapping paragraph of body text.
func (d *pdfDoc) para(s string) { d.paraStyled(s, false, false, bodySize, bodyLead) }

// small writes a wrapping paragraph of small text.
func (d *pdfDoc) small(s string) { d.paraStyled(s, false, false, smallSize, smallLead) }

func (d *pdfDoc) paraStyled(s string, bold, italic bool, size, lead float64) {
	s = fitted(s)
	d.ensure(lead)
	d.setFont(bold, italic, size)
	d.f.SetX(marginX)
	d.f.MultiCell(contentW, lead, s, "", "L", false)
	d.record(s)
	d.setFont(false, false, bodySize)
	d.f.Ln(2)
}

// boxed writes a paragraph in a framed, shaded box (the caution).
func (d *pdfDoc) boxed(title, s string) {
	title, s = fitted(title), fitted(s)
	d.setFont(false, false, bodySize)
	lines := d.f.SplitLines([]byte(s), contentW-12)
	h := float64(len(lines))*bodyLead + bodyLead + 12
	d.ensure(h + 4)
	y := d.f.GetY()
	d.f.SetFillColor(253, 243, 224)
	d.f.SetDrawColor(200, 90, 0)
	d.f.SetLineWidth(0.8)
	d.f.Rect(marginX, y, contentW, h, "DF")
	d.f.SetDrawColor(0, 0, 0)
	d.setFont(true, false, bodySize)
	d.f.Text(marginX+6, y+6+bodySize, title)
	d.record(title)
	d.setFont(false, false, bodySize)
	for i, l := range lines {
		d.f.Text(marginX+6, y+6+bodySize+float64(i+1)*bodyLead, string(l))
	}
	d.record(s)
	d.f.SetY(y + h + 6)
}

// column of a table.
type column struct {
	Header string
	Width  float64 // share of the content width (the widths are normalised)
	Right  bool    // right-align (numbers)
}

// table is a table with wrapping cells, its header repeated on every page.
type table struct {
	Columns   []column
	Rows      [][]string
	Size      float64        // font size; 0: small
	Highlight func(int) bool // rows to shade
	Bold      func(int) bool // rows to set bold
}

// table writes a table that breaks across pages.
func (d *pdfDoc) table(t table) {
	size := t.Size
	if size == 0 {
		size = smallSize
	}
	lead := size * 1.25
	total := 0.0
	for _, c := range t.Columns {
		total += c.Width
	}
	widths := make([]float64, len(t.Columns))
	for i, c := range t.Columns {
		widths[i] = contentW * c.Width / total
	}
	const pad = 2.5
	rowHeight := func(cells []string, bold bool) (float64, [][]string) {
		d.setFont(bold, false, size)
		n := 1
		lines := make([][]string, len(cells))
		for i, s := range cells {
			if i >= len(widths) {
				break
			}
			for _, l := range d.f.SplitLines([]byte(fitted(s)), widths[i]-2*pad) {
				lines[i] = append(lines[i], string(l))
			}
			n = max(n, len(lines[i]))
		}
		return float64(n)*lead + 2*pad, lines
	}
	header := make([]string, len(t.Columns))
	for i, c := range t.Columns {
		header[i] = c.Header
	}
	drawRow := func(cells []string, bold, shade, head bool) {
		h, lines := rowHeight(cells, bold || head)
		if d.remaining() < h {
			d.f.AddPage()
			if !head { // repeat the header on the new page
				hh, hl := rowHeight(header, true)
				d.drawTableLines(hl, widths, t.Columns, true, false, true, size, lead, pad, hh)
			}
		}
		d.drawTableLines(lines, widths, t.Columns, bold || head, shade, head, size, lead, pad, h)
	}
	hh, _ := rowHeight(header, true)
	first, _ := rowHeight(firstRow(t.Rows, len(header)), false)
	d.ensure(hh + first)
	drawRow(header, true, false, true)
	for i, r := range t.Rows {
		drawRow(r, t.Bold != nil && t.Bold(i), t.Highlight != nil && t.Highlight(i), false)
	}
	d.setFont(false, false, bodySize)
	d.f.Ln(4)
}

func firstRow(rows [][]string, n int) []string {
	if len(rows) == 0 {
		return make([]string, n)
	}
	return rows[0]
}

func (d *pdfDoc) drawTableLines(lines [][]string, widths []float64, cols []column, bold, shade, head bool, size, lead, pad, h float64) {
	y := d.f.GetY()
	switch {
	case head:
		d.f.SetFillColor(226, 232, 240)
		d.f.Rect(marginX, y, contentW, h, "F")
	case shade:
		d.f.SetFillColor(253, 236, 214)
		d.f.Rect(marginX, y, contentW, h, "F")
	}
	d.setFont(bold, false, size)
	x := marginX
	var rec []string
	for i, cell := range lines {
		if i >= len(widths) {
			break
		}
		for j, l := range cell {
			tx := x + pad
			if cols[i].Right {
				tx = x + widths[i] - pad - d.f.GetStringWidth(l)
			}
			d.f.Text(tx, y+pad+float64(j)*lead+size*0.85, l)
		}
		rec = append(rec, strings.Join(cell, " "))
		x += widths[i]
	}
	d.record(strings.Join(rec, " | "))
	d.f.SetDrawColor(190, 190, 190)
	d.f.SetLineWidth(0.3)
	d.f.Line(marginX, y+h, marginX+contentW, y+h)
	d.f.SetDrawColor(0, 0, 0)
	d.f.SetY(y + h)
}

// keyValues writes a two-column list of names and values.
func (d *pdfDoc) keyValues(rows [][2]string) {
	cells := make([][]string, len(rows))
	for i, r := range rows {
		cells[i] = []string{r[0], r[1]}
	}
	d.plainTable([]float64{0.27, 0.73}, cells)
}

// plainTable writes rows without a header or rules (label/value lists).
func (d *pdfDoc) plainTable(shares []float64, rows [][]string) {
	const pad = 1.5
	widths := make([]float64, len(shares))
	for i, s := range shares {
		widths[i] = contentW * s
	}
	for _, r := range rows {
		d.setFont(false, false, bodySize)
		n := 1
		lines := make([][]string, len(r))
		for i, s := range r {
			for _, l := range d.f.SplitLines([]byte(fitted(s)), widths[i]-2*pad) {
				lines[i] = append(lines[i], string(l))
			}
			n = max(n, len(lines[i]))
		}
		h := float64(n)*bodyLead + 1
		d.ensure(h)
		y := d.f.GetY()
		x := marginX
		for i, cell := range lines {
			d.setFont(i == 0, false, bodySize)
			if i == 0 {
				d.f.SetTextColor(60, 60, 60)
			}
			for j, l := range cell {
				d.f.Text(x+pad, y+float64(j)*bodyLead+bodySize, l)
			}
			d.f.SetTextColor(0, 0, 0)
			x += widths[i]
		}
		d.record(strings.Join(r, ": "))
		d.f.SetY(y + h)
	}
	d.setFont(false, false, bodySize)
	d.f.Ln(4)
}

// figure places a figure at full width with a numbered caption under it, on a new page if it
// does not fit on this one.
func (d *pdfDoc) figure(fig *Figure, number int) {
	h := fig.Height.Points()
	cap := fmt.Sprintf("Figure %d. %s.", number, fig.Caption)
	d.ensure(h + smallLead + 6)
	y := d.f.GetY()
	x := marginX + (contentW-fig.Width.Points())/2
	drawOnPDF(d.f, fig, x, y)
	d.f.SetY(y + h + 2)
	d.paraStyled(cap, false, true, smallSize, smallLead)
}

// bytes finishes the document.
func (d *pdfDoc) bytes() ([]byte, error) {
	var b bytes.Buffer
	if err := d.f.Output(&b); err != nil {
		return nil, err
	}
	return b.Bytes(), nil
}

// kN formats a force [N] in kN with one decimal.
func kN(n float64) string { return formatClean(n/1e3, 1) }

// kNm formats a moment [N·mm] in kNm with one decimal.
func kNm(m float64) string { return formatClean(m/1e6, 1) }

// fixed formats with a number of decimals and no negative zero.
func fixed(v float64, decimals int) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "–"
	}
	return formatClean(v, decimals)
}
