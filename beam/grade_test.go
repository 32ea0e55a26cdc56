package beam

import (
	"fmt"
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// band is one row of a published strength table: fy and fu [N/mm²] for lo < t ≤ hi [mm];
// below marks a "t < hi" row (EN 10025-2 "t < 3 mm"), from a row starting at lo inclusive
// ("3 ≤ t").
type band struct {
	lo, hi      float64
	below, from bool
	fy, fu      float64
}

// thicknesses returns points that exercise a band: both ends (just inside an open end) and
// the middle.
func (b band) thicknesses() []float64 {
	first, last := b.lo+0.01, b.hi
	if b.from {
		first = b.lo
	}
	if b.below {
		first, last = math.Max(b.lo, 0.5), b.hi-0.01
	}
	return []float64{first, (b.lo + b.hi) / 2, last}
}

// gradeReference is the published table of one grade, with its source.
type gradeReference struct {
	grade  string
	table  GradeTable
	kind   string // "published" (checked against a public text) or "published (from memory)"
	source string
	bands  []band
}

// Table 3.1 rows of EN 1993-1-1:2005+AC:2009 (hot-rolled structural steel). The S355 fu of
// 490 N/mm² for t ≤ 40 mm is the corrected value (the first print had 510, the EN 10210-1
// hollow-section figure).
func table31(grade, source string, fy40, fu40, fy80, fu80 float64) gradeReference {
	return gradeReference{grade, TableEN1993, "published", "EN 1993-1-1 Table 3.1, " + source, []band{
		{lo: 0, hi: 40, fy: fy40, fu: fu40},
		{lo: 40, hi: 80, fy: fy80, fu: fu80},
	}}
}

func gradeReferences() []gradeReference {
	refs := []gradeReference{
		table31("S235", "EN 10025-2 row", 235, 360, 215, 360),
		table31("S275", "EN 10025-2 row", 275, 430, 255, 410),
		table31("S355", "EN 10025-2 row", 355, 490, 335, 470),
		table31("S450", "EN 10025-2 row", 440, 550, 410, 550),
		table31("S420", "EN 10025-4 (M/ML) row", 420, 520, 390, 500),
		table31("S460", "EN 10025-4 (M/ML) row", 460, 540, 430, 530),
		table31("S420N", "EN 10025-3 (N/NL) row", 420, 520, 390, 520),
		table31("S460N", "EN 10025-3 (N/NL) row", 460, 540, 430, 540),
	}
	// EN 10025-2:2004 Table 7: minimum ReH for t ≤ 16, 40, 63, 80, 100 mm (S235, S275, S355 as
	// quoted in EC3-NOTES.md) and minimum Rm for t < 3 mm and 3 ≤ t ≤ 100 mm (from memory).
	part2 := func(grade string, reh [5]float64, rmBelow3, rm float64, kind string) gradeReference {
		bands := []band{
			{lo: 0, hi: 3, below: true, fy: reh[0], fu: rmBelow3},
			{lo: 3, hi: 16, from: true, fy: reh[0], fu: rm}, // t = 3 mm takes the 3–100 mm Rm
			{lo: 16, hi: 40, fy: reh[1], fu: rm},
			{lo: 40, hi: 63, fy: reh[2], fu: rm},
			{lo: 63, hi: 80, fy: reh[3], fu: rm},
			{lo: 80, hi: 100, fy: reh[4], fu: rm},
		}
		if rmBelow3 == 0 {
			bands = bands[1:]
		}
		return gradeReference{grade, TableEN10025, kind, "EN 10025-2:2004 Table 7 (ReH, Rm minima)", bands}
	}
	// EN 10025-3/-4:2004: ReH for t ≤ 16, 40, 63, 80, 100 mm and Rm by band (from memory;
	// consistent with the Table 3.1 rows above, which take the ≤ 16 and 40–63 mm values).
	part34 := func(grade, source string, reh [5]float64, rm [4]float64) gradeReference {
		return gradeReference{grade, TableEN10025, "published (from memory)", source, []band{
			{lo: 0, hi: 16, fy: reh[0], fu: rm[0]},
			{lo: 16, hi: 40, fy: reh[1], fu: rm[0]},
			{lo: 40, hi: 63, fy: reh[2], fu: rm[1]},
			{lo: 63, hi: 80, fy: reh[3], fu: rm[2]},
			{lo: 80, hi: 100, fy: reh[4], fu: rm[3]},
		}}
	}
	refs = append(refs,
		part2("S235", [5]float64{235, 225, 215, 215, 215}, 360, 360, "published (ReH: EC3-NOTES.md; Rm from memory)"),
		part2("S275", [5]float64{275, 265, 255, 245, 235}, 430, 410, "published (ReH: EC3-NOTES.md; Rm from memory)"),
		part2("S355", [5]float64{355, 345, 335, 325, 315}, 510, 470, "published (ReH: EC3-NOTES.md; Rm from memory)"),
		part2("S450", [5]float64{450, 430, 410, 390, 380}, 0, 550, "published (from memory)"),
		part34("S420", "EN 10025-4:2004 (M/ML) ReH, Rm minima", [5]float64{420, 400, 390, 380, 370}, [4]float64{520, 500, 480, 470}),
		part34("S460", "EN 10025-4:2004 (M/ML) ReH, Rm minima", [5]float64{460, 440, 430, 410, 400}, [4]float64{540, 530, 510, 500}),
		part34("S420N", "EN 10025-3:2004 (N/NL) ReH, Rm minima", [5]float64{420, 400, 390, 370, 360}, [4]float64{520, 520, 520, 520}),
		part34("S460N", "EN 10025-3:2004 (N/NL) ReH, Rm minima", [5]float64{460, 440, 430, 410, 400}, [4]float64{540, 540, 540, 540}),
	)
	return refs
}

func TestGradeStrengthAgainstPublishedTables(t *testing.T) {
	for _, ref := range gradeReferences() {
		g, err := LookupGrade(ref.grade)
		require.NoError(t, err, ref.grade)
		for _, b := range ref.bands {
			for _, th := range b.thicknesses() {
				name := fmt.Sprintf("%s/%v/t=%v", ref.grade, ref.table, th)
				t.Run(name, func(t *testing.T) {
					fy, fu, err := g.Strength(th, ref.table)
					require.NoError(t, err)
					assert.InEpsilon(t, b.fy, fy, 1e-12, "fy, %s: %s", ref.kind, ref.source)
					assert.InEpsilon(t, b.fu, fu, 1e-12, "fu, %s: %s", ref.kind, ref.source)
				})
			}
		}
	}
}

func TestGradeStrengthRejectsThicknessOutsideTable(t *testing.T) {
	s355, err := LookupGrade("S355")
	require.NoError(t, err)
	s450, err := LookupGrade("S450")
	require.NoError(t, err)
	tests := []struct {
		name  string
		g     Grade
		t     float64
		table GradeTable
		want  string
	}{
		{"zero", s355, 0, TableEN1993, "t = 0"},
		{"negative", s355, -5, TableEN10025, "t = -5"},
		{"NaN", s355, math.NaN(), TableEN1993, "t = NaN"},
		{"infinite", s355, math.Inf(1), TableEN10025, "t = +Inf"},
		{"beyond Table 3.1", s355, 80.5, TableEN1993, "t ≤ 80 mm"},
		{"beyond EN 10025-2 as coded", s355, 100.5, TableEN10025, "t ≤ 100 mm"},
		{"S450 below 3 mm in EN 10025-2", s450, 2, TableEN10025, "3 mm ≤ t ≤ 100 mm"},
		{"unknown table", s355, 10, GradeTable(7), "unknown strength table"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			_, _, err := tt.g.Strength(tt.t, tt.table)
			require.Error(t, err)
			assert.Contains(t, err.Error(), tt.want)
			assert.Contains(t, err.Error(), tt.g.Name)
		})
	}
}

func TestLookupGradeNames(t *testing.T) {
	tests := []struct{ input, want string }{
		{"S355", "S355"},
		{"s355", "S355"},
		{" S 355 J2 ", "S355"},
		{"S355K2", "S355"},
		{"S275JR", "S275"},
		{"S235J0", "S235"},
		{"S450J0", "S450"},
		{"S420", "S420"},
		{"S460ML", "S460"},
		{"S420M", "S420"},
		{"S420N", "S420N"},
		{"S460NL", "S460N"},
	}
	for _, tt := range tests {
		g, err := LookupGrade(tt.input)
		if assert.NoError(t, err, tt.input) {
			assert.Equal(t, tt.want, g.Name, tt.input)
		}
	}
	for _, bad := range []string{"", "S500", "S355N", "S235K2", "S355X", "A36"} {
		_, err := LookupGrade(bad)
		if assert.Error(t, err, bad) {
			assert.Contains(t, err.Error(), fmt.Sprintf("%q", bad))
			assert.Contains(t, err.Error(), "S355")
		}
	}
}

func TestGradesListsEveryGradeOnce(t *testing.T) {
	var names []string
	for _, g := range Grades() {
		names = append(names, g.Name)
		assert.NotEmpty(t, g.Standard, g.Name)
		assert.Equal(t, g.Name, g.String())
	}
	assert.Equal(t, []string{"S235", "S275", "S355", "S420", "S420N", "S450", "S460", "S460N"}, names)
	assert.Equal(t, "EN 1993-1-1 Table 3.1", TableEN1993.String())
}

// Property: within each table fy never rises with thickness and fu ≥ fy (common practice:
// thicker products have lower guaranteed strengths).
func TestGradeStrengthMonotonic(t *testing.T) {
	for _, g := range Grades() {
		for _, table := range []GradeTable{TableEN1993, TableEN10025} {
			prev := math.Inf(1)
			for th := 3.0; th <= 80; th += 0.5 {
				fy, fu, err := g.Strength(th, table)
				require.NoError(t, err, "%s %v t=%v", g.Name, table, th)
				assert.LessOrEqual(t, fy, prev, "%s %v t=%v", g.Name, table, th)
				assert.Greater(t, fu, fy, "%s %v t=%v", g.Name, table, th)
				prev = fy
			}
		}
	}
}
