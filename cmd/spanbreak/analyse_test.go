package main

import (
	"bytes"
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// run executes one command line in memory and returns stdout, stderr and the exit status.
func run(t *testing.T, args ...string) (string, string, int) {
	t.Helper()
	var out, errb bytes.Buffer
	code := execute(args, &out, &errb)
	return out.String(), errb.String(), code
}

func writeJob(t *testing.T, text string) string {
	t.Helper()
	p := filepath.Join(t.TempDir(), "job.yaml")
	require.NoError(t, os.WriteFile(p, []byte(text), 0o644))
	return p
}

// A simply supported IPE 300 of 6 m under a UDL of 10 kN/m, self weight off: the closed
// forms wL²/8 = 45 kNm and wL/2 = 30 kN (standard beam tables), and with γG,sup = 1.35 (EN 1990
// Table A1.2(B)) 60.75 kNm and 40.5 kN at ULS.
const simpleJob = `title: hand-written check job (invented)
beam:
  section: IPE 300
  grade: S275
  spans: [6.0]
  supports: [pinned, roller]
  self_weight: false
cases:
  G:
    kind: permanent
    loads:
      - {udl: 10}
`

func TestAnalyseCaseJSONContract(t *testing.T) {
	out, stderr, code := run(t, "analyse", writeJob(t, simpleJob), "--format", "json", "--case", "G", "--at", "0,3,6")
	require.Equal(t, 0, code, stderr)
	var got struct {
		Units     map[string]string `json:"units"`
		Length    float64           `json:"length"`
		Stations  []float64         `json:"stations"`
		Case      string            `json:"case"`
		M, V, N   []float64
		W         []float64 `json:"w"`
		Reactions []struct{ X, Fz, Fx, My float64 }
	}
	require.NoError(t, json.Unmarshal([]byte(out), &got))
	assert.Equal(t, "G", got.Case)
	assert.Equal(t, 6.0, got.Length)
	assert.Equal(t, []float64{0, 3, 6}, got.Stations)
	assert.InEpsilon(t, 10*6.0*6.0/8, got.M[1], 1e-6, "wL²/8, standard beam tables")
	assert.InEpsilon(t, 10*6.0/2, got.V[0], 1e-6, "wL/2")
	assert.InEpsilon(t, -10*6.0/2, got.V[2], 1e-6, "−wL/2 at the right end")
	// 5wL⁴/(384EI): E = 210 000 N/mm², Iy of IPE 300 computed from its dimensions
	require.Len(t, got.Reactions, 2)
	assert.InEpsilon(t, 30.0, got.Reactions[0].Fz, 1e-6)
	assert.Equal(t, "kNm", got.Units["M"])
}

func TestAnalyseEnvelopeJSONContract(t *testing.T) {
	out, stderr, code := run(t, "analyse", writeJob(t, simpleJob), "--format", "json", "--at", "3")
	require.Equal(t, 0, code, stderr)
	var got map[string]json.RawMessage
	require.NoError(t, json.Unmarshal([]byte(out), &got))
	for _, k := range []string{"units", "length", "stations", "uls", "sls"} {
		assert.Contains(t, got, k)
	}
	var uls map[string][]float64
	var raw map[string]json.RawMessage
	require.NoError(t, json.Unmarshal(got["uls"], &raw))
	uls = map[string][]float64{}
	for _, k := range []string{"M_max", "M_min", "V_max", "V_min", "N_max", "N_min"} {
		var v []float64
		require.NoError(t, json.Unmarshal(raw[k], &v), k)
		uls[k] = v
	}
	assert.InEpsilon(t, 1.35*45, uls["M_max"][0], 1e-6, "γG,sup wL²/8, EN 1990 Table A1.2(B)")
	assert.InEpsilon(t, 1.0*45, uls["M_min"][0], 1e-6, "γG,inf wL²/8")
}

func TestAnalyseTextAndCSV(t *testing.T) {
	job := writeJob(t, simpleJob)
	out, stderr, code := run(t, "analyse", job)
	require.Equal(t, 0, code, stderr)
	assert.Contains(t, out, "ULS envelope")
	assert.Contains(t, out, "+60.8 kNm") // 1.35 × 45 = 60.75
	assert.Contains(t, out, "CAUTION")
	assert.NotContains(t, out, "-0.0 ")
	out, _, code = run(t, "analyse", job, "--format", "csv", "--step", "1")
	require.Equal(t, 0, code)
	lines := strings.Split(strings.TrimSpace(out), "\n")
	assert.Equal(t, 1+7, len(lines), "a header and 7 stations at 1 m; the supports sit at the ends, one side each")
}

// TestDemoRuns runs the whole job on the embedded demo end to end: analysis, scan, layouts and
// the report folder.
func TestDemoRuns(t *testing.T) {
	dir := filepath.Join(t.TempDir(), "report")
	out, stderr, code := run(t, "demo", "--out", dir)
	require.Equal(t, 0, code, stderr)
	assert.Contains(t, out, "demo data, invented")
	assert.Contains(t, out, "RECOMMENDATION")
	assert.Contains(t, out, "CAUTION")
	assert.Contains(t, out, "Report written to")
	for _, f := range []string{"report.pdf", "result.json", "scan.csv", "layouts.csv", "envelopes.svg", "cost.png"} {
		assert.FileExists(t, filepath.Join(dir, f))
	}
	// a second run into a folder an earlier demo wrote needs no --force only for the default
	// folder; an explicit --out is protected: the folder exists, exit 1
	_, stderr, code = run(t, "demo", "--out", dir)
	assert.Equal(t, exitFailure, code)
	assert.Contains(t, stderr, "already exists")
}

// TestBadJobs: bad input exits 1 with a message naming the field and its line.
func TestBadJobs(t *testing.T) {
	base := func(beam, cases string) string {
		return "beam:\n" + beam + "cases:\n" + cases
	}
	okBeam := "  section: IPE 300\n  spans: [6.0]\n  supports: [pinned, roller]\n"
	okCases := "  G:\n    kind: permanent\n    loads: [{udl: 10}]\n"
	rows := []struct {
		name string
		job  string
		want []string
	}{
		{"no supports", base("  section: IPE 300\n  spans: [6.0]\n  supports: []\n", okCases), []string{"beam.supports", ":4:"}},
		{"span not positive", base("  section: IPE 300\n  spans: [0]\n  supports: [pinned, roller]\n", okCases), []string{"beam.spans[0]", ":3:"}},
		{"load off the beam", base(okBeam, "  G:\n    kind: permanent\n    loads: [{point: 10, at: 7.5}]\n"), []string{"cases.G.loads[0]", ":8:"}},
		{"hinge off the beam", base(okBeam+"  hinges: [9.0]\n", okCases), []string{"beam.hinges[0]", ":5:"}},
		{"unknown section", base("  section: IPE 333\n  spans: [6.0]\n  supports: [pinned, roller]\n", okCases), []string{"beam.section", ":2:", "IPE 333"}},
		{"unknown grade", base(okBeam+"  grade: S999\n", okCases), []string{"beam.grade", ":5:", "S999"}},
		{"NaN load", base(okBeam, "  G:\n    kind: permanent\n    loads: [{udl: .nan}]\n"), []string{"cases.G.loads[0]", ":8:"}},
		{"Inf span", base("  section: IPE 300\n  spans: [.inf]\n  supports: [pinned, roller]\n", okCases), []string{"beam.spans[0]", ":3:"}},
		{"duplicate case", base(okBeam, okCases+okCases), []string{"G", ":9:"}},
		{"undefined case in extra combination", base(okBeam, okCases) + "combinations:\n  extra: [{name: X, state: uls, factors: {Q: 1.5}}]\n",
			[]string{"combinations.extra[0]", "Q"}},
		{"unknown key", base(okBeam+"  sectoin: IPE 300\n", okCases), []string{"beam", "sectoin", ":5:"}},
		{"wrong type", base("  section: IPE 300\n  spans: six\n  supports: [pinned, roller]\n", okCases), []string{"beam.spans", ":3:"}},
		{"mechanism", base("  section: IPE 300\n  spans: [6.0]\n  supports: [roller, roller]\n  hinges: [3.0]\n", okCases), []string{"beam.supports", "mechanism"}},
	}
	for _, tc := range rows {
		t.Run(tc.name, func(t *testing.T) {
			out, stderr, code := run(t, "analyse", writeJob(t, tc.job))
			assert.Equal(t, 1, code, "stderr: %s", stderr)
			assert.Empty(t, out, "nothing is printed to stdout on error")
			for _, w := range tc.want {
				assert.Contains(t, stderr, w)
			}
			assert.NotContains(t, stderr, "goroutine")
		})
	}
}

func TestUsageErrors(t *testing.T) {
	job := writeJob(t, simpleJob)
	for _, args := range [][]string{
		{"analyse"},
		{"analyse", job, "--format", "xml"},
		{"analyse", job, "--step", "-1"},
		{"analyse", job, "--at", "99"},
		{"analyse", job, "--case", "Q"},
		{"analyse", job, "--nonsense"},
		{"nonsense"},
	} {
		_, stderr, code := run(t, args...)
		assert.Equal(t, 2, code, "%v: %s", args, stderr)
	}
}

// The header's beam line shows the self weight only when it is analysed: with self_weight:
// false it used to print the section's weight as if it were a load.
func TestAnalyseHeaderSelfWeight(t *testing.T) {
	for _, c := range [][]string{{}, {"--case", "G"}} {
		out, stderr, code := run(t, append([]string{"analyse", writeJob(t, simpleJob)}, c...)...)
		require.Equal(t, 0, code, stderr)
		assert.Contains(t, out, "Iy = 8356 cm4, self weight off\n", "%v", c)
		assert.NotContains(t, out, "kN/m", "%v: no line load is printed when the self weight is off", c)
		assert.NotContains(t, out, "SW (permanent)", "%v", c)
	}
	// IPE 300: 42.2 kg/m (published section tables); × g = 9.80665 m/s² is 0.414 kN/m
	withSW := strings.Replace(simpleJob, "self_weight: false", "self_weight: true", 1)
	out, stderr, code := run(t, "analyse", writeJob(t, withSW))
	require.Equal(t, 0, code, stderr)
	assert.Contains(t, out, "self weight 0.414 kN/m\n")
	assert.Contains(t, out, "SW (permanent)")
}
