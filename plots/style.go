package plots

import (
	"image/color"
	"math"
	"strconv"
	"strings"

	stdfont "golang.org/x/image/font"
	"gonum.org/v1/plot"
	"gonum.org/v1/plot/font"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/text"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// Font sizes [pt]. Every figure is laid out at its printed size (the width of an A4 page's
// text block), so these are the sizes a reader sees on paper.
const (
	titleSize  = 10.5
	labelSize  = 8.5
	tickSize   = 7.5
	legendSize = 7.5
	noteSize   = 7
)

// figureWidth is the natural width of every chart: the text width of an A4 page with 15 mm
// margins, so the report embeds charts at 1:1 and PNG/SVG files show the same layout.
const figureWidth = 180 * vg.Millimeter

// sans is Liberation Sans at a size; the typeface is compiled into gonum/plot.
func sans(size vg.Length) font.Font {
	return font.Font{Typeface: "Liberation", Variant: "Sans", Size: size}
}

// sansBold is the bold weight of sans.
func sansBold(size vg.Length) font.Font {
	f := sans(size)
	f.Weight = stdfont.WeightBold
	return f
}

// rgb is an opaque colour written as 0xRRGGBB; being an integer type it can be a constant,
// so the palette needs no package-level variables.
type rgb uint32

// RGBA implements color.Color.
func (c rgb) RGBA() (r, g, b, a uint32) {
	r = uint32(c>>16) & 0xff
	g = uint32(c>>8) & 0xff
	b = uint32(c) & 0xff
	return r * 0x101, g * 0x101, b * 0x101, 0xffff
}

// Colours. Fills are opaque pastels drawn under the lines: PDF viewers render translucent
// fills too dark, and opaque fills look the same in every format.
const (
	black       rgb = 0x000000
	white       rgb = 0xffffff
	darkGrey    rgb = 0x464646
	midGrey     rgb = 0x8c8c8c
	lightGrey   rgb = 0xc8c8c8
	gridGrey    rgb = 0xe4e4e4
	keepOutFill rgb = 0xe2e2e2
	gapFill     rgb = 0xfadcd4
	limitRed    rgb = 0xb42828

	momentLine rgb = 0x184e96
	momentFill rgb = 0xcfdef2
	hogLine    rgb = 0xaa2828
	shearLine  rgb = 0x1e7846
	shearFill  rgb = 0xd2ecdc
	deflLine   rgb = 0x784696
	deflFill   rgb = 0xe6daf0
	spliceLine rgb = 0xc85a00
	costLine   rgb = 0x184e96
	boltLine   rgb = 0x1e7846
	bestMark   rgb = 0xc85a00
	steelFill  rgb = 0xdfe3e8
	plateFill  rgb = 0xf3dcb8
)

// newPlot returns a plot in the house style: Liberation Sans everywhere, clean ticks, no
// padding between the axes and the data (so panels that share x line up exactly).
func newPlot() *plot.Plot {
	p := plot.New()
	p.Title.TextStyle.Font = sansBold(titleSize)
	p.Title.Padding = 4
	for _, a := range []*plot.Axis{&p.X, &p.Y} {
		a.Label.TextStyle.Font = sans(labelSize)
		a.Label.Padding = 3
		a.Tick.Label.Font = sans(tickSize)
		a.Tick.Marker = cleanTicks{}
		a.Tick.Length = 4
		a.Padding = 0
		a.LineStyle.Width = 0.6
		a.Tick.LineStyle.Width = 0.6
	}
	p.Legend.TextStyle.Font = sans(legendSize)
	return p
}

// grid returns light horizontal and vertical grid lines at the major ticks.
func grid() *plotter.Grid {
	g := plotter.NewGrid()
	g.Vertical.Color = gridGrey
	g.Horizontal.Color = gridGrey
	g.Vertical.Width = 0.4
	g.Horizontal.Width = 0.4
	return g
}

// cleanTicks places major ticks at multiples of 1, 2 or 5 × 10ⁿ and labels them with as many decimals as
// the step needs (0, 25, 50 rather than 0.00, 25.00, 50.00), never "-0". Minor ticks split
// each step into four or five.
type cleanTicks struct {
	// Target is the wanted number of major intervals; 0 means 6.
	Target int
	// Integer keeps every tick on a whole number (counts such as bolts).
	Integer bool
}

// Ticks implements plot.Ticker.
func (t cleanTicks) Ticks(lo, hi float64) []plot.Tick {
	if !(hi > lo) || math.IsInf(lo, 0) || math.IsInf(hi, 0) {
		return []plot.Tick{{Value: lo, Label: formatClean(lo, 0)}}
	}
	target := t.Target
	if target <= 0 {
		target = 6
	}
	step, minor := niceStep((hi - lo) / float64(target))
	if t.Integer && step < 1 {
		step, minor = 1, 1
	} else if t.Integer && minor < 1 {
		minor = step
	}
	decimals := stepDecimals(step)
	var ticks []plot.Tick
	first := math.Ceil(lo/minor - 1e-9)
	last := math.Floor(hi/minor + 1e-9)
	perMajor := int(math.Round(step / minor))
	for k := first; k <= last; k++ {
		v := k * minor
		if math.Abs(v) < minor*1e-9 {
			v = 0
		}
		label := ""
		if int(math.Round(k))%perMajor == 0 {
			label = formatClean(v, decimals)
		}
		ticks = append(ticks, plot.Tick{Value: v, Label: label})
	}
	return ticks
}

// niceStep returns the step of 1, 2 or 5 × 10ⁿ nearest (by ratio) to a raw interval, with its
// minor step.
func niceStep(raw float64) (major, minor float64) {
	mag := math.Pow(10, math.Floor(math.Log10(raw)))
	switch f := raw / mag; {
	case f < math.Sqrt2:
		return mag, mag / 5
	case f < math.Sqrt(10):
		return 2 * mag, mag / 2
	case f < math.Sqrt(50):
		return 5 * mag, mag
	default:
		return 10 * mag, 2 * mag
	}
}

// stepDecimals is the number of decimals that shows a multiple of step exactly.
func stepDecimals(step float64) int {
	d := 0
	for d < 9 && math.Abs(step*math.Pow10(d)-math.Round(step*math.Pow10(d))) > 1e-6*step*math.Pow10(d) {
		d++
	}
	return d
}

// formatClean prints v with the given decimals and no negative zero.
func formatClean(v float64, decimals int) string {
	s := strconv.FormatFloat(v, 'f', decimals, 64)
	if strings.Trim(s, "-0.") == "" {
		s = strings.TrimPrefix(s, "-")
	}
	return s
}

// noLabels keeps a ticker's tick positions but hides the labels, for the x axis of panels
// that share it with the panel below. (A transparent label colour would render black in SVG.)
type noLabels struct{ plot.Ticker }

// Ticks implements plot.Ticker.
func (n noLabels) Ticks(lo, hi float64) []plot.Tick {
	ts := n.Ticker.Ticks(lo, hi)
	for i := range ts {
		ts[i].Label = ""
	}
	return ts
}

// lineStyle is a solid line of a colour and width [pt].
func lineStyle(c color.Color, width vg.Length) draw.LineStyle {
	return draw.LineStyle{Color: c, Width: width}
}

// dashed is a dashed line of a colour and width [pt].
func dashed(c color.Color, width vg.Length) draw.LineStyle {
	return draw.LineStyle{Color: c, Width: width, Dashes: []vg.Length{3, 2}}
}

// textStyle is left-aligned, baseline-above text in Liberation Sans.
func textStyle(f font.Font, c color.Color) text.Style {
	return text.Style{Color: c, Font: f, Handler: plot.DefaultTextHandler}
}
