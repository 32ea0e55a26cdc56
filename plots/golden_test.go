package plots

import (
	"bytes"
	"flag"
	"os"
	"path/filepath"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/beam"
)

// update rewrites the golden files: go test ./plots -update
var update = flag.Bool("update", false, "rewrite the golden files in testdata/")

// checkGolden compares got with testdata/name byte for byte, or rewrites the file with -update.
func checkGolden(t *testing.T, name string, got []byte) {
	t.Helper()
	path := filepath.Join("testdata", name)
	if *update {
		require.NoError(t, os.WriteFile(path, got, 0o644))
		return
	}
	want, err := os.ReadFile(path)
	require.NoError(t, err, "missing golden file; run go test ./plots -update")
	if !bytes.Equal(want, got) {
		out := filepath.Join(t.TempDir(), name)
		_ = os.WriteFile(out, got, 0o644)
		t.Errorf("%s differs from the golden file (got %d bytes, want %d); the new output is in %s; "+
			"if the change is intended, run go test ./plots -update and look at the figure", name, len(got), len(want), out)
	}
}

// goldenFigures are the figures the golden files hold, built from the test fixtures.
func goldenFigures(t *testing.T) map[string]*Figure {
	t.Helper()
	b := newTestBeam(t)
	env, err := EnvelopeChart(EnvelopeInput{Title: "Envelopes, test beam", Envelopes: &b.env, Model: b.model,
		KeepOut: b.keepOut(), Splices: []float64{8300, 19800, 31000}, Deflection: true})
	require.NoError(t, err)
	scan := ScanInput{Title: "Cheapest splice at each position", Model: b.model, Points: b.scan(t),
		Chosen: []float64{8300, 19800, 31000}, Currency: "EUR"}
	cost, err := CostChart(scan)
	require.NoError(t, err)
	util, err := UtilisationChart(scan)
	require.NoError(t, err)
	lay, err := LayoutChart(LayoutInput{Title: "Layouts", Layouts: testLayouts(), Chosen: 2, Currency: "EUR"})
	require.NoError(t, err)
	sec, err := beam.LookupSection("IPE 550")
	require.NoError(t, err)
	drw, err := SpliceDrawing(DrawingInput{Section: sec, Geometry: testGeometry(), Position: 19800})
	require.NoError(t, err)
	return map[string]*Figure{"envelopes": &env.Figure, "cost": &cost.Figure, "utilisation": &util.Figure,
		"layouts": &lay.Figure, "splice": drw}
}

func TestSVGGoldens(t *testing.T) {
	for name, fig := range goldenFigures(t) {
		t.Run(name, func(t *testing.T) {
			got, err := fig.Bytes(SVG)
			require.NoError(t, err)
			checkGolden(t, name+".svg", got)
		})
	}
}

func TestRenderingIsDeterministic(t *testing.T) {
	first, second := goldenFigures(t), goldenFigures(t)
	for name := range first {
		for _, f := range []Format{SVG, PNG, PDF} {
			a, err := first[name].Bytes(f)
			require.NoError(t, err)
			b, err := second[name].Bytes(f)
			require.NoError(t, err)
			assert.True(t, bytes.Equal(a, b), "%s.%s differs between two builds from the same data", name, f)
		}
	}
}

func TestRenderFormats(t *testing.T) {
	fig := goldenFigures(t)["layouts"]
	tests := []struct {
		format Format
		magic  string
	}{
		{SVG, "<?xml"}, {PNG, "\x89PNG\r\n\x1a\n"}, {PDF, "%PDF-1."},
	}
	for _, tt := range tests {
		got, err := fig.Bytes(tt.format)
		require.NoError(t, err)
		assert.True(t, bytes.HasPrefix(got, []byte(tt.magic)), "%s output starts with %q", tt.format, tt.magic)
	}
	pdf, err := fig.Bytes(PDF)
	require.NoError(t, err)
	assert.Equal(t, 1, pdfPageCount(pdf), "a figure is one PDF page")
	_, err = fig.Bytes("eps")
	assert.ErrorContains(t, err, `format "eps"`)

	for _, s := range []string{"svg", " PNG ", "pdf"} {
		_, err := ParseFormat(s)
		assert.NoError(t, err, s)
	}
	_, err = ParseFormat("jpeg")
	assert.ErrorContains(t, err, "want svg, png or pdf")
}
