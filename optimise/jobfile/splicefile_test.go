package jobfile

import (
	"os"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// The splice file is the second example of DESIGN.md section 8 (invented), copied verbatim;
// every size in it is in mm.
func TestLoadSpliceFile(t *testing.T) {
	data, err := os.ReadFile("testdata/splice.yaml")
	require.NoError(t, err)
	sf, err := LoadSpliceFile("splice.yaml", data)
	require.NoError(t, err)
	const tol = 1e-12
	assert.Equal(t, "M20", sf.Bolt.Size)
	assert.Equal(t, "8.8", sf.Bolt.Class)
	assert.Equal(t, PlanesThread, sf.Bolt.ShearPlanes())
	assert.Equal(t, CategoryB, sf.Category)
	assert.Equal(t, "A", sf.FrictionClass)
	assert.Equal(t, HolesNormal, sf.Holes)
	assert.InEpsilon(t, 10.0, sf.Gap.MM(), tol)

	f := sf.Flange
	assert.InEpsilon(t, 15.0, f.Outer.Thickness.MM(), tol)
	assert.InEpsilon(t, 220.0, f.Outer.Width.MM(), tol)
	require.NotNil(t, f.Inner)
	assert.InEpsilon(t, 15.0, f.Inner.Thickness.MM(), tol)
	assert.InEpsilon(t, 90.0, f.Inner.Width.MM(), tol)
	assert.Equal(t, 2, f.Columns)
	assert.Equal(t, 3, f.Rows)
	assert.InEpsilon(t, 120.0, f.Gauge.MM(), tol)
	assert.InEpsilon(t, 70.0, f.Pitch.MM(), tol)
	assert.InEpsilon(t, 45.0, f.End.MM(), tol)
	assert.InEpsilon(t, 50.0, f.Edge.MM(), tol)

	w := sf.Web
	assert.InEpsilon(t, 10.0, w.Thickness.MM(), tol)
	assert.InEpsilon(t, 400.0, w.Depth.MM(), tol)
	assert.Equal(t, 2, w.Columns)
	assert.Equal(t, 5, w.Rows)
	assert.InEpsilon(t, 80.0, w.Pitch.MM(), tol)
	assert.InEpsilon(t, 70.0, w.Spacing.MM(), tol)
	assert.InEpsilon(t, 45.0, w.End.MM(), tol)
	assert.InEpsilon(t, 40.0, w.Edge.MM(), tol)
	assert.Equal(t, Loc{File: "splice.yaml", Pos: Pos{20, 10}, Path: "web.pitch"}, w.Where("pitch"))
}

// minimalSplice is a good category A splice with one row of flange bolts and one web column,
// so that pitch and spacing are not needed.
const minimalSplice = `bolt: {size: M16, class: "4.6"}
category: A
gap: "1 cm"
flange:
  outer: {thickness: 10, width: 150}
  columns: 2
  rows: 1
  gauge: 90
  end: 30
  edge: 30
web:
  thickness: 8
  depth: 200
  columns: 1
  rows: 1
  end: 30
  edge: 30
`

func TestLoadMinimalSpliceFile(t *testing.T) {
	sf, err := LoadSpliceFile("s.yaml", []byte(minimalSplice))
	require.NoError(t, err)
	assert.InEpsilon(t, 10.0, sf.Gap.MM(), 1e-12)
	assert.Nil(t, sf.Flange.Inner)
	assert.Nil(t, sf.Flange.Pitch)
	assert.Equal(t, "", sf.Holes)
}

func TestLoadBadSpliceFiles(t *testing.T) {
	tests := []problemCase{
		{"missing blocks", "bolt: {size: M20}\n", []string{
			`1:1: missing required key "category"`, `1:1: missing required key "gap"`,
			`1:1: missing required key "flange"`, `1:1: missing required key "web"`,
			`1:7: bolt: missing required key "class"`}},
		{"bolt and category", `bolt: {size: m20, class: "8.8", threads_in_shear_plane: 1}
category: B
holes: slotted
gap: -1
flange:
  outer: {thickness: 0, width: "0.2 m"}
  inner: {thickness: 15}
  columns: 3
  rows: 2
  gauge: 120
  end: 45
  edge: "5 kN"
web:
  thickness: 10
  depth: 440
  columns: 2
  rows: 0
  end: 45
  edge: 40
  spacng: 70
`, []string{
			`1:14: bolt.size: bolt size "m20" is not a metric size such as M20`,
			`1:57: bolt.threads_in_shear_plane: want true or false, got 1`,
			`2:11: category: a category B (slip-resistant) splice needs friction_class (A, B, C, D)`,
			`3:8: holes: unknown hole type "slotted" (allowed: normal, oversize)`,
			`4:6: gap: the gap must not be negative, got -1 mm`,
			`6:22: flange.outer.thickness: thickness must be greater than 0, got 0 mm`,
			`7:10: flange.inner: missing required key "width"`,
			`8:12: flange.columns: a flange has 2 or 4 bolt lines, got 3`,
			`9:9: flange.rows: 2 rows need pitch (mm)`,
			`12:9: flange.edge: "5 kN" is a force; want a size (m, cm, mm)`,
			`16:12: web.columns: 2 columns need spacing (mm)`,
			`17:9: web.rows: rows must be at least 1, got 0`,
			`20:3: web: unknown key "spacng" (allowed: thickness, depth, columns, rows, pitch, spacing, end, edge); did you mean "spacing"?`,
		}},
		{"category C with a class that cannot be preloaded", minimalSplice[len("bolt: {size: M16, class: \"4.6\"}\ncategory: A\n"):] +
			"bolt: {size: M16, class: \"5.6\"}\ncategory: C\nfriction_class: F\n", []string{
			`16:26: bolt.class: class 5.6 bolts cannot be preloaded (EN 1993-1-8 3.1.2: 8.8 and 10.9 only), as category C needs`,
			`18:17: friction_class: unknown friction class "F" (allowed: A, B, C, D)`,
		}},
		{"bolting assembly systems", minimalSplice[len("bolt: {size: M16, class: \"4.6\"}\ncategory: A\n"):] +
			"bolt: {size: M16, class: \"8.8\", system: HV}\ncategory: B\nfriction_class: A\n",
			[]string{`16:41: bolt.system: HV assemblies (EN 14399-4) are made in class 10.9 only, not 8.8; use HR`}},
		{"a preloaded system in category A", replaceOnce(minimalSplice, "class: \"4.6\"}", "class: \"4.6\", system: HR}"),
			[]string{`1:41: bolt.system: HR assemblies are for preloaded bolts; a category A splice takes ISO 4014 or ISO 4017`}},
		{"negative pitch, zero spacing", replaceOnce(minimalSplice,
			"  rows: 1\n  end: 30\n  edge: 30\n", "  rows: 2\n  pitch: -80\n  spacing: 0\n  end: 30\n  edge: 30\n"),
			[]string{`16:10: web.pitch: pitch must be greater than 0, got -80 mm`,
				`17:12: web.spacing: spacing must be greater than 0, got 0 mm`}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			sf, err := LoadSpliceFile("s.yaml", []byte(tc.src))
			require.Error(t, err)
			assert.NotNil(t, sf)
			var ps Problems
			require.ErrorAs(t, err, &ps)
			checkProblems(t, "s.yaml", ps, tc.want)
		})
	}
}

func replaceOnce(s, old, new string) string {
	i := indexOf(s, old)
	return s[:i] + new + s[i+len(old):]
}
