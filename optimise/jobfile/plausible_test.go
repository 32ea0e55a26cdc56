package jobfile

import (
	"fmt"
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// Overflowing and absurd values are reported at their own key, with line and column: never
// at the cases block where the analysis would have failed, never silently.
func TestImplausibleValuesAtTheirKey(t *testing.T) {
	beamWith := func(lines string) string {
		return "beam:\n  section: IPE 300\n" + lines + "cases: {G: {kind: permanent, loads: [{udl: 5}]}}\n"
	}
	tests := []problemCase{
		{"spans of 1e306 m overflow in mm", beamWith("  spans: [1e306, 1e306, 1e306]\n  supports: [pinned, roller, roller, roller]\n"),
			[]string{"3:11: beam.spans[0]: the value 1e306 m is out of range",
				"3:18: beam.spans[1]: the value 1e306 m is out of range",
				"3:25: beam.spans[2]: the value 1e306 m is out of range"}},
		{"a 1e20 m span", beamWith("  spans: [7.8, 1e20, 7.8]\n  supports: [pinned, roller, roller, roller]\n"),
			[]string{"3:16: beam.spans[1]: a span of 1e+20 m is outside the plausible range (0.1 m to 200 m); check the value and its unit"}},
		{"a span in mm written as m, and one in m written as mm", beamWith("  spans: [7800, \"7.8 mm\"]\n  supports: [pinned, roller, roller]\n"),
			[]string{"3:11: beam.spans[0]: a span of 7800 m is outside the plausible range (0.1 m to 200 m)",
				"3:17: beam.spans[1]: a span of 0.0078 m is outside the plausible range (0.1 m to 200 m)"}},
		{"an overhang of 150 m", beamWith("  spans: [6]\n  overhang: {left: 150, right: 1.5}\n  supports: [pinned, roller]\n"),
			[]string{"4:20: beam.overhang.left: an overhang of 150 m is outside the plausible range (at most 100 m)"}},
		{"a beam of 1200 m", beamWith("  spans: [200, 200, 200, 200, 200, 200]\n  supports: [pinned, roller, roller, roller, roller, roller, roller]\n"),
			[]string{"3:10: beam.spans: a beam length (spans and overhangs) of 1200 m is outside the plausible range (at most 1000 m)"}},
		{"a spring of 1e12 kN/m", beamWith("  spans: [6]\n  supports: [pinned, {type: spring, k: 1e12}]\n"),
			[]string{"4:40: beam.supports[1].k: a spring stiffness of 1e+12 kN/m is outside the plausible range (at most 1000000000 kN/m)"}},
		{"welded sizes", "beam:\n  section: {welded: {h: 6000, b: 2500, tw: 1e-300, tf: 3}}\n  spans: [6]\n  supports: [pinned, roller]\n" +
			"cases: {G: {kind: permanent, loads: [{udl: 5}]}}\n",
			[]string{"2:25: beam.section.welded.h: a depth h of 6000 mm is outside the plausible range (at most 5000 mm)",
				"2:34: beam.section.welded.b: a flange width b of 2500 mm is outside the plausible range (at most 2000 mm)",
				"2:44: beam.section.welded.tw: a web thickness tw of 1e-300 mm is outside the plausible range (at least 4 mm)",
				"2:56: beam.section.welded.tf: a flange thickness tf of 3 mm is outside the plausible range (at least 4 mm)"}},
		{"loads", minimal + `  Q:
    kind: imposed
    category: B
    loads:
      - {udl: 1e300}
      - {trapezoid: [0, -20000], from: 1, to: 2}
      - {point: 1e307, at: 3}
      - {point: 150000, at: 3}
      - {moment: "-2e5 kNm", at: 3}
      - {axial: "200 MN", at: 0}
`, []string{"13:15: cases.Q.loads[0].udl: a line load of 1e+300 kN/m is outside the plausible range (magnitude at most 10000 kN/m); check the value and its unit",
			"14:25: cases.Q.loads[1].trapezoid[1]: a line load of -20000 kN/m is outside the plausible range (magnitude at most 10000 kN/m)",
			"15:17: cases.Q.loads[2].point: the value 1e307 kN is out of range",
			"16:17: cases.Q.loads[3].point: a point load of 150000 kN is outside the plausible range (magnitude at most 100000 kN)",
			"17:18: cases.Q.loads[4].moment: a point moment of -200000 kNm is outside the plausible range (magnitude at most 100000 kNm)",
			"18:17: cases.Q.loads[5].axial: an axial load of 200000 kN is outside the plausible range (magnitude at most 100000 kN)"}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, err := LoadJob("job.yaml", []byte(tc.src))
			var ps Problems
			require.ErrorAs(t, err, &ps)
			checkProblems(t, "job.yaml", ps, tc.want)
		})
	}
}

// Every plausible range accepts its own bounds and refuses a value just past them, at the
// key it documents: the table is what the checker enforces.
func TestPlausibleRangesAreEnforcedAtTheirBounds(t *testing.T) {
	type probe struct {
		v    float64
		pass bool
	}
	const past = 1 + 1e-9
	for _, r := range PlausibleRanges() {
		var probes []probe
		if r.Min != 0 { // a Min of 0 leaves the lower end to the key's own rule (> 0, ≥ 0)
			probes = append(probes, probe{r.Min, true}, probe{r.Min * past, false})
			if r.Min > 0 {
				probes[1].v = r.Min / past
			}
			if r.Integer {
				probes[1].v = r.Min - 1
			}
		}
		if !math.IsInf(r.Max, 1) {
			over := r.Max * past
			if r.Integer {
				over = r.Max + 1
			}
			probes = append(probes, probe{r.Max, true}, probe{over, false})
		}
		require.NotEmpty(t, probes, r.What)
		for _, c := range probes {
			load := func(src string) error { _, err := LoadJob("job.yaml", []byte(src)); return err }
			src, key := jobWith(t, r.id, c.v)
			checkProbe(t, r, c.v, c.pass, key, load(src))
			if len(r.SpliceKeys) > 0 {
				src, key := spliceWith(t, r.id, c.v)
				_, err := LoadSpliceFile("job.yaml", []byte(src))
				checkProbe(t, r, c.v, c.pass, key, err)
			}
		}
		assert.NotEmpty(t, r.Keys)
	}
}

// checkProbe asserts that a file with one value set to v passes, or fails at key with the
// range's words.
func checkProbe(t *testing.T, r PlausibleRange, v float64, pass bool, key string, err error) {
	t.Helper()
	name := fmt.Sprintf("%s = %g", key, v)
	if pass {
		assert.NoError(t, err, name)
		return
	}
	require.Error(t, err, name)
	assert.Contains(t, err.Error(), key+": "+r.What, name)
	assert.Contains(t, err.Error(), "("+r.Text+")", name)
}

// spliceWith returns a valid splice file with one value set to v (internal unit) and the key
// path of that value.
func spliceWith(t *testing.T, id int, v float64) (string, string) {
	t.Helper()
	gap, thickness := "10", "15"
	key := ""
	switch id {
	case rangePlate:
		thickness, key = fmt.Sprintf("\"%v mm\"", v), "flange.outer.thickness"
	case rangeGap:
		gap, key = fmt.Sprintf("\"%v mm\"", v), "gap"
	default:
		t.Fatalf("no splice file for range %d", id)
	}
	return `bolt: {size: M20, class: "8.8"}
category: A
gap: ` + gap + `
flange: {outer: {thickness: ` + thickness + `, width: 220}, columns: 2, rows: 3, gauge: 120, pitch: 70, end: 45, edge: 50}
web: {thickness: 10, depth: 400, columns: 2, rows: 5, pitch: 80, spacing: 70, end: 45, edge: 40}
`, key
}

// jobWith returns a valid job with one value set to v (internal unit) and the key path of
// that value.
func jobWith(t *testing.T, id int, v float64) (string, string) {
	t.Helper()
	mm := func(v float64) string { return fmt.Sprintf("\"%v mm\"", v) }
	num := func(v float64) string { return fmt.Sprintf("%v", v) }
	section, spans, supports := "IPE 300", "[6]", "[pinned, roller]"
	overhang := "{left: 0, right: 0}"
	load := "{udl: 5}"
	caseName, extra := "G", ""
	key := ""
	n := int(v) // a count
	switch id {
	case rangeSpan:
		spans, key = "["+mm(v)+"]", "beam.spans[0]"
	case rangeLength:
		// ten spans of a tenth of v, each plausible
		parts := make([]string, 10)
		for i := range parts {
			parts[i] = mm(v / 10)
		}
		spans, key = "["+strings.Join(parts, ", ")+"]", "beam.spans"
		supports = "[pinned" + strings.Repeat(", roller", 10) + "]"
	case rangeOverhang:
		overhang, key = "{left: "+mm(v)+", right: 0}", "beam.overhang.left"
	case rangeSpring:
		supports, key = "[pinned, {type: spring, k: "+num(v)+"}]", "beam.supports[1].k"
	case rangeWeldedH:
		section, key = "{welded: {h: "+num(v)+", b: 300, tw: 12, tf: 25}}", "beam.section.welded.h"
	case rangeWeldedB:
		section, key = "{welded: {h: 900, b: "+num(v)+", tw: 12, tf: 25}}", "beam.section.welded.b"
	case rangeWeldedTw:
		section, key = "{welded: {h: 900, b: 300, tw: "+num(v)+", tf: 25}}", "beam.section.welded.tw"
	case rangeWeldedTf:
		section, key = "{welded: {h: 900, b: 300, tw: 12, tf: "+num(v)+"}}", "beam.section.welded.tf"
	case rangeUDL:
		load, key = "{udl: \""+num(v)+" N/mm\"}", "cases.G.loads[0].udl"
	case rangeTrapezoid:
		load, key = "{trapezoid: [0, \""+num(v)+" N/mm\"]}", "cases.G.loads[0].trapezoid[1]"
	case rangePoint:
		load, key = "{point: \""+num(v)+" N\", at: 3}", "cases.G.loads[0].point"
	case rangeMoment:
		load, key = "{moment: \""+num(v)+" Nmm\", at: 3}", "cases.G.loads[0].moment"
	case rangeAxial:
		load, key = "{axial: \""+num(v)+" N\", at: 3}", "cases.G.loads[0].axial"
	case rangePlate:
		extra, key = "splice: {plates: {thicknesses: ["+mm(v)+"]}}\n", "splice.plates.thicknesses[0]"
	case rangeGap:
		extra, key = "splice: {gap: "+mm(v)+"}\n", "splice.gap"
	case rangeList:
		ts := make([]string, n)
		for i := range ts {
			ts[i] = num(4 + 0.25*float64(i))
		}
		extra, key = "splice: {plates: {thicknesses: ["+strings.Join(ts, ", ")+"]}}\n", "splice.plates.thicknesses"
	case rangeTitle:
		extra, key = "title: "+strings.Repeat("é", n)+"\n", "title" // characters, not bytes
	case rangeName:
		caseName = strings.Repeat("Q", n)
		key = "cases." + caseName
	case rangeStep:
		extra, key = "scan: {step: "+mm(v)+"}\n", "scan.step"
	case rangePositions:
		// 800 m of spans and an overhang making the length (n + 1) × 4 mm: n positions at 4 mm
		spans, supports = "[200, 200, 200, 200]", "[pinned, roller, roller, roller, roller]"
		overhang = "{left: 0, right: " + mm(float64(4*(n+1)-800_000)) + "}"
		extra, key = "scan: {step: \"4 mm\"}\n", "scan.step"
	case rangeSplices:
		extra, key = "limits: {splices: {max: "+num(v)+"}}\n", "limits.splices.max"
	case rangeAlternatives:
		extra, key = "scan: {alternatives: "+num(v)+"}\n", "scan.alternatives"
	case rangeRate:
		extra, key = "costs: {hole: "+num(v)+"}\n", "costs.hole"
	case rangeClassFactor:
		extra, key = "costs: {bolt_class_factor: {\"10.9\": "+num(v)+"}}\n", `costs.bolt_class_factor["10.9"]`
	case rangePayload:
		extra, key = "vehicles: [{name: lorry, max_length: 13.6, payload: "+num(v)+", cost: 800}]\n", "vehicles[0].payload"
	case rangeWeldThroat:
		section, key = "{welded: {h: 900, b: 300, tw: 12, tf: 25, weld_throat: "+mm(v)+"}}", "beam.section.welded.weld_throat"
	case rangeGauge:
		extra, key = "splice: {detailing: {gauge: "+mm(v)+"}}\n", "splice.detailing.gauge"
	case rangeGaugeWidth:
		extra, key = "splice: {detailing: {gauges: [{width: "+mm(v)+", gauge: 100}]}}\n", "splice.detailing.gauges[0].width"
	default:
		t.Fatalf("no job for range %d", id)
	}
	src := "beam:\n  section: " + section + "\n  spans: " + spans + "\n  overhang: " + overhang +
		"\n  supports: " + supports + "\ncases: {" + caseName + ": {kind: permanent, loads: [" + load + "]}}\n" + extra
	return src, key
}
