package main

import (
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
)

// overflowBase is a valid two-span job; each row below breaks one value of it.
const overflowBase = `beam:
  section: IPE 300
  spans: [6.0, 6.0]
  supports: [pinned, roller, roller]
cases:
  G:
    kind: permanent
    loads: [{udl: 5}, {point: 20, at: 3}]
  Q:
    kind: imposed
    category: B
    loads:
      - {udl: 4}
combinations:
  extra:
    - {name: LIFT, state: uls, factors: {G: 1.2, Q: 1.0}}
`

// Overflowing and absurd values of the beam and its loads stop every command with exit
// status 1 and the value's own file:line:column and key path, nothing on stdout. Before, a
// udl of 1e300 made its case vanish (exit 0, envelopes as if it were absent, NaN with
// --case), and the other values were reported at "cases:" whatever they were.
func TestOverflowIsLocatedByEveryCommand(t *testing.T) {
	rows := []struct {
		name, old, new string
		want           string // file:line:column: key path
	}{
		{"udl of 1e300 kN/m", "      - {udl: 4}", "      - {udl: 1e300}", ":13:15: cases.Q.loads[0].udl: "},
		{"spans of 1e306 m", "spans: [6.0, 6.0]", "spans: [1e306, 1e306]", ":3:11: beam.spans[0]: "},
		{"a span of 1e20 m", "spans: [6.0, 6.0]", "spans: [6.0, 1e20]", ":3:16: beam.spans[1]: "},
		{"a point load of 1e307 kN", "{point: 20, at: 3}", "{point: 1e307, at: 3}", ":8:31: cases.G.loads[1].point: "},
		{"a factor of 1e306", "factors: {G: 1.2, Q: 1.0}", "factors: {G: 1.2, Q: 1e306}", ":16:50: combinations.extra[0].factors.Q: "},
	}
	commands := [][]string{{"check"}, {"analyse"}, {"analyse", "--case", "Q"}, {"optimise"}, {"design", "--at", "3"}}
	for _, r := range rows {
		t.Run(r.name, func(t *testing.T) {
			if !strings.Contains(overflowBase, r.old) {
				t.Fatalf("the base job has no %q", r.old)
			}
			job := writeJob(t, strings.Replace(overflowBase, r.old, r.new, 1))
			for _, c := range commands {
				args := append([]string{c[0], job}, c[1:]...)
				out, stderr, code := run(t, args...)
				assert.Equal(t, exitFailure, code, "%v: %s", c, stderr)
				assert.Empty(t, out, "%v: nothing on stdout", c)
				assert.Contains(t, stderr, "job.yaml"+r.want, "%v", c)
				assert.NotContains(t, stderr, "NaN", "%v", c)
			}
		})
	}
}
