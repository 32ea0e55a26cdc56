package optimise

import (
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestDirectWeldedSection: "welded HxBxTWxTF" builds a plate girder from its plate sizes.
func TestDirectWeldedSection(t *testing.T) {
	s, err := directSection("welded 900x300x12x25")
	require.NoError(t, err)
	assert.Equal(t, 900.0, s.H)
	assert.Equal(t, 300.0, s.B)
	_, err = directSection("welded 900x300")
	assert.Error(t, err)
}

// A splice file whose redundant sizes disagree, or whose bolts cannot lie on its plates, is
// refused at the key that disagrees, with its line: not by the design run without a line.
func TestLoadSpliceFileLocatesGeometry(t *testing.T) {
	const good = `bolt: {size: M20, class: "8.8"}
category: A
gap: 10
flange:
  outer: {thickness: 15, width: 220}
  columns: 2
  rows: 3
  gauge: 120
  pitch: 70
  end: 45
  edge: 50
web: {thickness: 10, depth: 400, columns: 2, rows: 5, pitch: 80, spacing: 70, end: 45, edge: 40}
`
	_, err := LoadSpliceFile("s.yaml", []byte(good))
	require.NoError(t, err)
	tests := []struct {
		name, old, new string
		want           string
	}{
		// (220 − 120)/2 = 50 mm is the edge the width and gauge give
		{"flange edge", "edge: 50", "edge: 60",
			"s.yaml:11:9: flange.edge: 60 mm does not match (width − gauge)/2 = 50 mm; give consistent values or leave edge out"},
		// (400 − 4 × 80)/2 = 40 mm is the edge the depth, rows and pitch give
		{"web edge", "depth: 400", "depth: 440",
			"s.yaml:12:94: web.edge: 40 mm does not match (depth − (rows − 1)×pitch)/2 = 60 mm; give consistent values or leave edge out"},
		{"bolts off the plate", "gauge: 120", "gauge: 240",
			"s.yaml:8:10: flange.gauge: 240 mm puts the bolt lines outside the 220 mm plate\n" +
				"s.yaml:11:9: flange.edge: 50 mm does not match (width − gauge)/2 = -10 mm; give consistent values or leave edge out"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			require.Contains(t, good, tc.old)
			_, err := LoadSpliceFile("s.yaml", []byte(strings.Replace(good, tc.old, tc.new, 1)))
			require.Error(t, err)
			assert.Equal(t, tc.want, err.Error())
		})
	}
}
