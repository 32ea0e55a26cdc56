package splice

import (
	"encoding/csv"
	"os"
	"strconv"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func readCSV(t *testing.T, path string) []map[string]string {
	t.Helper()
	f, err := os.Open(path)
	require.NoError(t, err)
	defer f.Close()
	recs, err := csv.NewReader(f).ReadAll()
	require.NoError(t, err)
	var out []map[string]string
	for _, r := range recs[1:] {
		row := map[string]string{}
		for i, h := range recs[0] {
			row[h] = r[i]
		}
		out = append(out, row)
	}
	return out
}

func atof(t *testing.T, s string) float64 {
	t.Helper()
	v, err := strconv.ParseFloat(s, 64)
	require.NoError(t, err)
	return v
}

// TestBoltSizesPublished compares the size table with EN ISO 898-1 stress areas and EN 1090-2
// hole clearances (testdata/bolts.csv, source per row).
func TestBoltSizesPublished(t *testing.T) {
	rows := readCSV(t, "testdata/bolts.csv")
	require.Len(t, rows, len(boltSizeNames()))
	for _, r := range rows {
		t.Run(r["size"], func(t *testing.T) {
			b, err := LookupBoltSize(r["size"])
			require.NoError(t, err, r["source"])
			assert.InEpsilon(t, atof(t, r["d_mm"]), b.D, 1e-12, r["source"])
			assert.InEpsilon(t, atof(t, r["As_mm2"]), b.As, 1e-12, r["source"])
			assert.InEpsilon(t, atof(t, r["d0_normal_mm"]), b.HoleDiameter(NormalHoles), 1e-12, r["source"])
			assert.InEpsilon(t, atof(t, r["d0_oversize_mm"]), b.HoleDiameter(OversizeHoles), 1e-12, r["source"])
		})
	}
	_, err := LookupBoltSize("M21")
	assert.ErrorContains(t, err, `"M21"`)
	b, err := LookupBoltSize(" m 20 ")
	require.NoError(t, err)
	assert.Equal(t, "M20", b.Name)
}

// TestBoltClassesPublished compares the classes with EN 1993-1-8 Table 3.1 and Table 3.4.
func TestBoltClassesPublished(t *testing.T) {
	rows := readCSV(t, "testdata/bolt-classes.csv")
	require.Len(t, rows, len(boltClassNames()))
	for _, r := range rows {
		t.Run(r["class"], func(t *testing.T) {
			c, err := LookupBoltClass(r["class"])
			require.NoError(t, err)
			assert.InEpsilon(t, atof(t, r["fyb_N_mm2"]), c.Fyb, 1e-12, r["source"])
			assert.InEpsilon(t, atof(t, r["fub_N_mm2"]), c.Fub, 1e-12, r["source"])
			assert.InEpsilon(t, atof(t, r["alpha_v_threads"]), c.AlphaV, 1e-12, r["source"])
			assert.Equal(t, r["preloadable"] == "yes", c.Preloadable, r["source"])
		})
	}
	_, err := LookupBoltClass("12.9")
	assert.ErrorContains(t, err, `"12.9"`)
}

// TestPartialFactorsRecommended: EN 1993-1-8 Table 2.1 and EN 1993-1-1 6.1 recommended values;
// a zero field takes the recommended value, a set field is kept (National Annex override).
func TestPartialFactorsRecommended(t *testing.T) {
	d := DefaultPartialFactors()
	for _, row := range []struct {
		name   string
		got    float64
		want   float64
		source string
	}{
		{"γM0", d.GammaM0, 1.00, "EN 1993-1-1 6.1(1) note 2B"},
		{"γM1", d.GammaM1, 1.00, "EN 1993-1-1 6.1(1) note 2B"},
		{"γM2", d.GammaM2, 1.25, "EN 1993-1-8 Table 2.1"},
		{"γM3", d.GammaM3, 1.25, "EN 1993-1-8 Table 2.1 (slip at ULS)"},
		{"γM3,ser", d.GammaM3Ser, 1.10, "EN 1993-1-8 Table 2.1 (slip at SLS)"},
		{"γM7", d.GammaM7, 1.10, "EN 1993-1-8 Table 2.1"},
	} {
		assert.InEpsilon(t, row.want, row.got, 1e-12, row.name+" "+row.source)
	}
	r := PartialFactors{GammaM2: 1.3}.resolved()
	assert.InEpsilon(t, 1.3, r.GammaM2, 1e-12)
	assert.InEpsilon(t, 1.25, r.GammaM3, 1e-12)
	assert.Error(t, PartialFactors{GammaM0: -1}.validate())
}

// TestFrictionAndHoleFactors: μ by class (EN 1090-2 Table 18 / EN 1993-1-8 Table 3.7) and ks
// (EN 1993-1-8 Table 3.6).
func TestFrictionAndHoleFactors(t *testing.T) {
	for _, row := range []struct {
		class FrictionClass
		mu    float64
	}{{"A", 0.5}, {"B", 0.4}, {"C", 0.3}, {"D", 0.2}} {
		assert.InEpsilon(t, row.mu, row.class.SlipFactor(), 1e-12, "EN 1090-2 Table 18 / EN 1993-1-8 Table 3.7, class %s", row.class)
	}
	assert.InEpsilon(t, 1.0, NormalHoles.Ks(), 1e-12, "EN 1993-1-8 Table 3.6")
	assert.InEpsilon(t, 0.85, OversizeHoles.Ks(), 1e-12, "EN 1993-1-8 Table 3.6")
	assert.InEpsilon(t, 0.8, OversizeHoles.BearingFactor(), 1e-12, "EN 1993-1-8 Table 3.4 note 1")
	_, err := ParseFrictionClass("E")
	assert.Error(t, err)
	_, err = ParseCategory("D")
	assert.Error(t, err)
}
