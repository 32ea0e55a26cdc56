package plots

import (
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"gonum.org/v1/plot/vg"
)

// The tick formatter's rules are properties of the formatter itself (no engineering source).

func majorLabels(t cleanTicks, lo, hi float64) []string {
	var out []string
	for _, tk := range t.Ticks(lo, hi) {
		if tk.Label != "" {
			out = append(out, tk.Label)
		}
	}
	return out
}

func TestCleanTicks(t *testing.T) {
	tests := []struct {
		name   string
		lo, hi float64
		target int
		want   []string
	}{
		{"beam length in m", 0, 36.2, 10, []string{"0", "5", "10", "15", "20", "25", "30", "35"}},
		{"moments across zero", -401, 335, 6, []string{"-400", "-300", "-200", "-100", "0", "100", "200", "300"}},
		{"utilisation", 0, 1.1, 6, []string{"0.0", "0.2", "0.4", "0.6", "0.8", "1.0"}},
		{"small deflections", -6.7, 24.3, 6, []string{"-5", "0", "5", "10", "15", "20"}},
		{"costs", 400, 455, 6, []string{"400", "410", "420", "430", "440", "450"}},
		{"tiny range", 0.001, 0.0042, 4, []string{"0.001", "0.002", "0.003", "0.004"}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			assert.Equal(t, tt.want, majorLabels(cleanTicks{Target: tt.target}, tt.lo, tt.hi))
		})
	}
	assert.Equal(t, []string{"22", "23", "24"}, majorLabels(cleanTicks{Target: 4, Integer: true}, 21.5, 24.5),
		"counts get whole-number ticks")
	for _, tk := range (cleanTicks{Target: 4, Integer: true}).Ticks(21.5, 24.5) {
		assert.Equal(t, math.Round(tk.Value), tk.Value)
	}
	// minor ticks fall between the majors, inside the range, with no label
	ts := cleanTicks{}.Ticks(-401, 335)
	minors := 0
	for _, tk := range ts {
		assert.GreaterOrEqual(t, tk.Value, -401.0)
		assert.LessOrEqual(t, tk.Value, 335.0)
		if tk.IsMinor() {
			minors++
		}
		assert.NotEqual(t, "-0", tk.Label)
	}
	assert.Greater(t, minors, 10)
	// a degenerate range gives one tick, never a panic
	require.Len(t, cleanTicks{}.Ticks(3, 3), 1)
	require.Len(t, cleanTicks{}.Ticks(math.Inf(-1), 1), 1)
}

func TestNiceStepAndDecimals(t *testing.T) {
	tests := []struct {
		raw, major, minor float64
		decimals          int
	}{
		{0.9, 1, 0.2, 0}, {1.3, 1, 0.2, 0}, {1.5, 2, 0.5, 0}, {3, 2, 0.5, 0}, {3.5, 5, 1, 0}, {7, 5, 1, 0}, {7.5, 10, 2, 0},
		{0.04, 0.05, 0.01, 2}, {180, 200, 50, 0},
	}
	for _, tt := range tests {
		major, minor := niceStep(tt.raw)
		assert.InEpsilon(t, tt.major, major, 1e-12, "raw %g", tt.raw)
		assert.InEpsilon(t, tt.minor, minor, 1e-12, "raw %g", tt.raw)
		assert.Equal(t, tt.decimals, stepDecimals(major), "raw %g", tt.raw)
	}
	assert.Equal(t, 1, stepDecimals(2.5))
}

func TestFormatClean(t *testing.T) {
	assert.Equal(t, "0.00", formatClean(-0.0001, 2))
	assert.Equal(t, "0", formatClean(math.Copysign(0, -1), 0))
	assert.Equal(t, "-1.5", formatClean(-1.5, 1))
	assert.Equal(t, "+512", signed(511.6, 0))
	assert.Equal(t, "−388", signed(-388.2, 0))
	assert.Equal(t, "0", signed(-0.2, 0))
	assert.Equal(t, "12.345 m", fmtM(12345))
	assert.Equal(t, "72.5", mm(72.5))
	assert.Equal(t, "440", mm(440))
}

func TestNoLabelsKeepsPositions(t *testing.T) {
	full := cleanTicks{}.Ticks(0, 36)
	blank := noLabels{cleanTicks{}}.Ticks(0, 36)
	require.Len(t, blank, len(full))
	for i := range full {
		assert.Equal(t, full[i].Value, blank[i].Value)
		assert.Empty(t, blank[i].Label)
	}
}

func TestLegendRowsWrap(t *testing.T) {
	entries := []legendEntry{{"a long legend entry", lineThumb{}}, {"another long legend entry", lineThumb{}},
		{"third entry here", lineThumb{}}}
	assert.Len(t, legendRows(entries, 1000), 1)
	assert.Len(t, legendRows(entries, 150), 3)
	assert.InDelta(t, float64(3*legendLine), float64(legendHeight(entries, 150)), 1e-9)
	assert.Equal(t, vg.Length(0), legendHeight(nil, 100))
}

func TestRGBAConstantColours(t *testing.T) {
	r, g, b, a := momentLine.RGBA()
	assert.Equal(t, []uint32{0x18 * 0x101, 0x4e * 0x101, 0x96 * 0x101, 0xffff}, []uint32{r, g, b, a})
	assert.True(t, strings.HasPrefix(checkFamily("flange.bolt.slip"), "flange"))
}
