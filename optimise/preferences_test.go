package optimise

import (
	"math"
	"os"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/splice"
)

func prepareFile(t *testing.T, path string) *Setup {
	t.Helper()
	src, err := os.ReadFile(path)
	require.NoError(t, err)
	s, err := Prepare(path, src)
	require.NoError(t, err)
	return s
}

// The job of testdata/preferences.yaml (invented data): a welded girder 900 × 300 × 12 × 25
// with welds of throat a = 6 mm, flange gauges by width, cover plates at least 0.5·tf and bolts
// M20 to M24. Every splice of the scan keeps to the preferences.
func TestPreferencesJob(t *testing.T) {
	s := prepareFile(t, "testdata/preferences.yaml")
	// b = 300 mm takes the entry for flanges 300 mm wide and over
	assert.Equal(t, 160.0, s.Splice.Detailing.Gauge)
	assert.Equal(t, "splice.detailing.gauges[1]", s.GaugeKey)
	assert.Equal(t, 0.5, s.Splice.Detailing.MinPlateToFlange)
	assert.Equal(t, []string{"M20", "M22", "M24"}, s.BoltSizes)
	assert.Equal(t, 6.0, s.WeldThroat)
	assert.Equal(t, 6.0, s.Splice.Member.WeldThroat)
	// the member checks measure the flange outstand from the weld toe (EN 1993-1-1 Table 5.2):
	// c = (b − tw)/2 − √2·a = (300 − 12)/2 − 6√2 = 135.51 mm
	assert.InDelta(t, 144-6*math.Sqrt2, s.Member.FlangeC, 1e-9)
	assert.InDelta(t, 850-12*math.Sqrt2, s.Member.WebC, 1e-9)
	// 4 bolt lines cannot take the gauge: (300 − 2×35 − 160)/2 = 35 mm < 2.4·d0 = 52.8 mm for M20
	assert.Contains(t, strings.Join(s.Notes, "\n"), "splice.detailing.gauges[1].gauge = 160 mm cannot be detailed with 4 bolt lines (M20: 4 lines leave "+
		"p2 = (300 − 2×35 − 160)/2 = 35 mm between the inner and outer lines, less than 2.4·d0 = 52.8 mm (EN 1993-1-8 Table 3.3)): "+
		"those flanges are not tried")

	o, err := Run(s, Settings{})
	require.NoError(t, err)
	// the plates: at least 0.5 × 25 = 12.5 mm; the web plates between the weld toes:
	// down(900 − 2×25 − 2×6√2 − 2×5, to 5 mm) = down(823.03) = 820 mm
	feasible := 0
	for _, c := range o.Candidates {
		if !c.Feasible {
			continue
		}
		feasible++
		g := c.Design.Geometry
		assert.Equal(t, 160.0, g.Flange.Gauge, "x = %g", c.X)
		assert.Equal(t, 2, g.Flange.Columns, "x = %g", c.X)
		assert.Contains(t, []string{"M20", "M22", "M24"}, g.Bolt.Size, "x = %g", c.X)
		assert.GreaterOrEqual(t, g.Flange.Outer.Thickness+g.Flange.Inner.Thickness, 12.5, "x = %g", c.X)
		assert.Equal(t, 820.0, g.Web.Depth, "x = %g", c.X)
	}
	assert.Greater(t, feasible, 50)
	require.NotEmpty(t, o.Chosen)
	for _, sh := range o.Chosen {
		for _, c := range sh.Result.Checks {
			switch c.ID {
			case splice.IDSpacing:
				assert.Contains(t, c.Note, "the gauge is the preferred 160 mm (detailing preference)")
			case splice.IDFit:
				assert.Contains(t, c.Substituted, "(preferred minimum)")
				assert.Contains(t, c.Substituted, "≥ 0.5·tf = 12.5 mm")
				assert.Contains(t, c.Substituted, "h − 2tf − 2√2·a − 2×clearance")
			}
		}
	}
}

// Preferences that exclude nothing leave the whole result as it is without them: bounds that
// take every size give the same outcome, sheets included; a least plate thickness below every
// plate gives the same scan and layouts (its sheets state the rule, which passes).
func TestPreferencesThatBindNothingChangeNothing(t *testing.T) {
	src, err := os.ReadFile("testdata/small-space.yaml")
	require.NoError(t, err)
	base := string(src)
	const bolts = `bolts: {sizes: [M20, M24], classes: ["10.9"]}`
	require.Contains(t, base, bolts)
	run := func(job string) *Outcome {
		s, err := Prepare("job.yaml", []byte(job))
		require.NoError(t, err)
		o, err := Run(s, Settings{})
		require.NoError(t, err)
		return o
	}
	want := run(base)
	bounds := run(strings.Replace(base, bolts, `bolts: {sizes: [M20, M24], classes: ["10.9"], min_size: M12, max_size: M36}`, 1))
	assert.Equal(t, want.Candidates, bounds.Candidates)
	assert.Equal(t, want.Layouts, bounds.Layouts)
	assert.Equal(t, want.Identical, bounds.Identical)
	assert.Equal(t, want.Chosen, bounds.Chosen)
	// IPE 400, tf = 13.5 mm (EN 10365): 0.1·tf = 1.35 mm, below every plate of the list
	thin := run(strings.Replace(base, bolts, bolts+"\n  detailing: {min_plate_to_flange: 0.1}", 1))
	assert.Equal(t, want.Candidates, thin.Candidates)
	assert.Equal(t, want.Layouts, thin.Layouts)
	assert.Equal(t, want.Identical, thin.Identical)
}

// A table of gauges with no entry as narrow as the section leaves the gauge to the sizing,
// and says so; a welded section without a weld throat is noted.
func TestPreferenceNotes(t *testing.T) {
	s, err := Prepare("job.yaml", []byte(agreementJob+"splice: {detailing: {gauges: [{width: 200, gauge: 120}]}}\n"))
	require.NoError(t, err)
	assert.Zero(t, s.Splice.Detailing.Gauge)
	assert.Empty(t, s.GaugeKey)
	assert.Contains(t, s.Notes, "splice.detailing.gauges has no entry for the IPE 300 flange (b = 150 mm; the narrowest "+
		"entry is for 200 mm): the sizing chooses the gauge")
	w, err := Prepare("job.yaml", []byte(strings.Replace(agreementJob, "IPE 300", "{welded: {h: 400, b: 200, tw: 8, tf: 12}}", 1)))
	require.NoError(t, err)
	assert.Contains(t, strings.Join(w.Notes, "\n"), "beam.section.welded gives no weld_throat")
	// within 0.5 mm the entry for 150 mm flanges applies to a 149.6 mm flange
	s, err = Prepare("job.yaml", []byte(strings.Replace(agreementJob, "IPE 300", "{welded: {h: 300, b: 149.6, tw: 8, tf: 12}}", 1)+
		"splice: {detailing: {gauges: [{width: 100, gauge: 60}, {width: 150, gauge: 80}, {width: 200, gauge: 120}]}}\n"))
	require.NoError(t, err)
	assert.Equal(t, 80.0, s.Splice.Detailing.Gauge)
	assert.Equal(t, "splice.detailing.gauges[1]", s.GaugeKey)
	// IPE 300, b = 150 mm, gauge 100 mm: e2 = 25 mm ≥ 1.2 × 18 = 21.6 mm for M16 (d0 = 18 mm,
	// EN 1090-2) but < 1.2 × 22 = 26.4 mm for M20 and every larger size (EN 1993-1-8 Table 3.3)
	s, err = Prepare("job.yaml", []byte(agreementJob+"splice: {detailing: {gauge: 100}}\n"))
	require.NoError(t, err)
	notes := strings.Join(s.Notes, "\n")
	assert.Contains(t, notes, "splice.detailing.gauge = 100 mm cannot be detailed with M20, M22, M24, M27, M30 bolts, which are not tried")
	assert.Contains(t, notes, "splice.detailing.gauge = 100 mm cannot be detailed with 4 bolt lines (M16: ")
	o, err := Run(s, Settings{})
	require.NoError(t, err)
	for _, c := range o.Candidates {
		if c.Feasible {
			assert.Equal(t, "M16", c.Design.Geometry.Bolt.Size)
			assert.Equal(t, 100.0, c.Design.Geometry.Flange.Gauge)
		}
	}
}
