package plots

import (
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/beam"
	"spanbreak/splice"
)

// The splice file's dimensions fix the rest of the drawing (DESIGN.md section 8): e1 runs from
// the outer bolt row to the plate end and from the inner row to the beam end, so a plate is
// gap + 2·(2·e1 + (rows − 1)·p1) long; with two flange lines e2 = (width − gauge)/2; the web
// rows sit centred on the plate, edge = (depth − (rows − 1)·pitch)/2.
func TestResolveDims(t *testing.T) {
	sec, err := beam.LookupSection("IPE 550")
	require.NoError(t, err)
	d, err := resolveDims(sec, testGeometry())
	require.NoError(t, err)
	tests := []struct {
		name     string
		got      float64
		expected float64
	}{
		{"flange plate length", d.lf, 10 + 2*(2*45+2*70)}, // 470 mm
		{"web plate length", d.lw, 10 + 2*(2*45+1*70)},    // 330 mm
		{"flange edge e2", d.e2, (210.0 - 120) / 2},       // 45 mm
		{"web edge", d.ev, (440.0 - 4*80) / 2},            // 60 mm
		{"hole d0 of M20, normal", d.d0, 20 + 2},          // EN 1090-2 Table 11: 2 mm clearance
		{"beam stub shown", d.stub, 60},                   // the larger of 60 mm and 12 % of 470 mm
		{"half the view", d.halfLength(), 470.0/2 + 60},   //
		{"elevation height", d.elevationHeight(), 550 + 30 + 1.4*20},
	}
	for _, tt := range tests {
		assert.InEpsilon(t, tt.expected, tt.got, 1e-12, tt.name)
	}
	assert.Equal(t, []float64{-60, 60}, d.flangeLinesY())
	assert.Equal(t, []float64{160, 80, 0, -80, -160}, d.webRowsY())
	assert.Equal(t, []float64{-190, -120, -50, 50, 120, 190}, boltLinesX(10, 45, 70, 3))

	four := testGeometry()
	four.Flange.Columns, four.Flange.Gauge, four.Flange.Edge, four.Flange.Outer.Width = 4, 90, 35, 300
	d4, err := resolveDims(beam.Section{H: 600, B: 300, Tw: 12, Tf: 25, R: 27}, four)
	require.NoError(t, err)
	assert.InEpsilon(t, (300.0-2*35-90)/2, d4.p2o, 1e-12, "outer line spacing of four lines")
	assert.Equal(t, []float64{-115, -45, 45, 115}, d4.flangeLinesY())
}

func TestResolveDimsErrors(t *testing.T) {
	sec, err := beam.LookupSection("IPE 550")
	require.NoError(t, err)
	g := testGeometry()
	g.Flange.Columns = 3
	g.Web.Depth = 0
	g.Bolt.Size = "M21"
	_, err = resolveDims(sec, g)
	require.Error(t, err)
	for _, want := range []string{"flange.columns: 3", "web.depth: 0 mm", "bolt.size"} {
		assert.ErrorContains(t, err, want)
	}
	_, err = SpliceDrawing(DrawingInput{Section: sec, Geometry: splice.Geometry{}})
	assert.ErrorContains(t, err, "splice drawing")
}

func TestChainLabelsRepeatedPitchesOnly(t *testing.T) {
	pts, bolt := alongChain(470, boltLinesX(10, 45, 70, 3), 10)
	got := withGap(chain(pts, bolt), 10)
	var labels []string
	for _, s := range got {
		labels = append(labels, s.label)
	}
	assert.Equal(t, []string{"45", "2 × 70 = 140", "45", "gap 10", "45", "2 × 70 = 140", "45"}, labels)
	// end distances equal to the pitch are not merged into it
	pts, bolt = framed(-150, []float64{-100, -50, 0, 50, 100}, 150)
	labels = nil
	for _, s := range chain(pts, bolt) {
		labels = append(labels, s.label)
	}
	assert.Equal(t, []string{"50", "4 × 50 = 200", "50"}, labels)
}

func TestSpliceDrawingContent(t *testing.T) {
	sec, err := beam.LookupSection("IPE 550")
	require.NoError(t, err)
	fig, err := SpliceDrawing(DrawingInput{Section: sec, Geometry: testGeometry(), Position: 19800})
	require.NoError(t, err)
	assert.LessOrEqual(t, fig.Height, maxDrawingHeight)
	svg, err := fig.Bytes(SVG)
	require.NoError(t, err)
	text := string(svg)
	has := func(want string) bool { return strings.Contains(text, want) }
	for _, want := range []string{
		"scale 1:5", // IPE 550 with a 470 mm plate fits the page at 1:5
		"M20 class 10.9", "category B, slip-resistant at SLS", "friction class A", "d0 = 22 mm",
		"outer 15 × 210 × 470", "inner 2 × 15 × 85 × 470", "2 × 10 × 440 × 330",
		"gap 10", "2 × 70 = 140", "4 × 80 = 320", "web plate 330", "flange plate 470", "h 550", "b 210",
		"splice at x = 19.800 m", "Bolts in the splice: 44", // 2 flanges × 2 sides × 2×3 + 2 sides × 2×5
	} {
		assert.True(t, has(want), "the drawing shows %q", want)
	}

	// with the bill: a parts list above the title block, the views still on the page
	m := &splice.Materials{Items: []splice.MaterialItem{
		{Item: "bolt", Part: "flange", Name: "M20×70 HV 10.9 (EN 14399-4)", Size: "M20", Grade: "10.9", Length: 70, Quantity: 24, UnitMass: 0.244},
		{Item: "plate", Part: "flange", Name: "outer flange plate", Grade: "S355", Length: 470, Thickness: 15, Width: 210, Quantity: 2,
			UnitMass: 15 * 210 * 470 * 7850e-9}}, Holes: 132, FayingArea: 1.25}
	fig, err = SpliceDrawing(DrawingInput{Section: sec, Geometry: testGeometry(), Position: 19800, Materials: m})
	require.NoError(t, err)
	assert.LessOrEqual(t, fig.Height, maxDrawingHeight)
	svg, err = fig.Bytes(SVG)
	require.NoError(t, err)
	text = string(svg)
	for _, want := range []string{"M20×70 HV 10.9 (EN 14399-4)", "15 × 210 × 470", "S355", "each [kg]", "11.622", "23.24", // 15·210·470·7850e-9 = 11.622 kg each, two
		"132 holes, 1.25 m² of prepared faying surface", "outer 15 × 210 × 470"} {
		assert.True(t, has(want), "the drawing with its parts list shows %q", want)
	}

	// a deep welded girder falls back to a smaller scale and still fits a page
	deep, err := beam.WeldedSection(1500, 500, 16, 40)
	require.NoError(t, err)
	g := testGeometry()
	g.Flange.Outer.Width, g.Flange.Gauge, g.Flange.Edge = 500, 300, 100
	g.Web.Depth, g.Web.Rows, g.Web.Edge = 1300, 14, 130
	fig, err = SpliceDrawing(DrawingInput{Section: deep, Geometry: g, Position: -1})
	require.NoError(t, err)
	assert.LessOrEqual(t, fig.Height, maxDrawingHeight)
	dd, err := resolveDims(deep, g)
	require.NoError(t, err)
	l := dd.layout(figureWidth-12, maxDrawingHeight)
	assert.Greater(t, l.scale, 5.0, "a 1.5 m deep girder cannot be drawn at 1:5 on A4")
	svg, err = fig.Bytes(SVG)
	require.NoError(t, err)
	text = string(svg)
	assert.True(t, has("scale 1:"+mm(l.scale)))
	assert.False(t, has("splice at x ="), "a negative position is left out")
	assert.True(t, has("13 × 80 = 1040"))
}
