package plots

import (
	"bytes"
	"os/exec"
	"regexp"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"gonum.org/v1/plot/vg"
)

// pdfPageCount counts the page objects of a PDF (fpdf writes the object dictionaries
// uncompressed).
func pdfPageCount(pdf []byte) int {
	return len(regexp.MustCompile(`/Type /Page\b[^s]`).FindAll(pdf, -1))
}

// pdfText extracts a PDF's text with pdftotext (poppler-utils), or skips the test when the
// tool is not installed.
func pdfText(t *testing.T, pdf []byte) string {
	t.Helper()
	tool, err := exec.LookPath("pdftotext")
	if err != nil {
		t.Skip("pdftotext (poppler-utils) is not installed")
	}
	cmd := exec.Command(tool, "-layout", "-", "-")
	cmd.Stdin = bytes.NewReader(pdf)
	out, err := cmd.Output()
	if err != nil {
		t.Fatalf("pdftotext: %v", err)
	}
	return string(out)
}

func TestAffineComposition(t *testing.T) {
	// a quarter turn then a shift: (1, 0) → (0, 1) → (10, 21)
	m := identity().then(affine{a: 1, d: 1, e: 10, f: 20}).then(affine{a: 0, b: 1, c: -1, d: 0})
	x, y := m.apply(vg.Point{X: 1, Y: 0})
	assert.InDelta(t, 10, x, 1e-12)
	assert.InDelta(t, 21, y, 1e-12)
}

func TestFigurePDFHoldsItsText(t *testing.T) {
	fig := goldenFigures(t)["layouts"]
	pdf, err := fig.Bytes(PDF)
	require.NoError(t, err)
	text := pdfText(t, pdf)
	for _, want := range []string{"Layouts", "3 splices", "2550 (chosen)", "layout cost [EUR]", "erection (lifts)"} {
		assert.True(t, strings.Contains(text, want), "the PDF text has %q", want)
	}
}
