package optimise

import (
	"errors"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/beam"
	"spanbreak/optimise/jobfile"
)

// overflowJob is a valid job; its loads are made to overflow after Prepare, where the
// plausible ranges of the job file no longer guard them, to test the analysis's own check.
const overflowJob = `beam:
  section: IPE 300
  spans: [6, 6]
  supports: [pinned, roller, roller]
cases:
  G:
    kind: permanent
    loads: [{udl: 5}]
  Q:
    kind: imposed
    category: B
    loads:
      - {udl: 2}
      - {udl: 3, from: 1, to: 5}
combinations:
  extra:
    - {name: LIFT, state: uls, factors: {G: 1.2, Q: 1.0}}
`

func prepareText(t *testing.T, src string) *Setup {
	t.Helper()
	s, err := Prepare("job.yaml", []byte(src))
	require.NoError(t, err)
	return s
}

// onlyProblem asserts that err is one located problem and returns it.
func onlyProblem(t *testing.T, err error) jobfile.Problem {
	t.Helper()
	var probs jobfile.Problems
	require.True(t, errors.As(err, &probs), "%T %v", err, err)
	require.Len(t, probs, 1, "%v", err)
	return probs[0]
}

// A load whose results overflow is reported at its own key, file:line:column, where it used
// to vanish from the envelopes (the analysis returned NaN and no error).
func TestAnalyseLocatesAnOverflowingLoad(t *testing.T) {
	s := prepareText(t, overflowJob)
	q := s.Cases[2] // SW, G, Q
	require.Equal(t, "Q", q.Name)
	q.Loads[1].W1, q.Loads[1].W2 = 1e300, 1e300
	_, err := s.Analyse()
	p := onlyProblem(t, err)
	assert.Equal(t, jobfile.Problem{File: "job.yaml", Line: 14, Column: 15, Path: "cases.Q.loads[1].udl", Message: p.Message}, p)
	assert.Contains(t, p.Message, "the analysis overflows")
	assert.Contains(t, p.Message, "not a finite number")
}

// A factor of a combination of the file's own that makes the envelopes overflow is reported
// at that factor, by Analyse (so check refuses the job) and by the optimisation.
func TestAnalyseLocatesAnOverflowingCombination(t *testing.T) {
	src := strings.Replace(overflowJob, "factors: {G: 1.2, Q: 1.0}", "factors: {G: 1.2, Q: 1e306}", 1)
	s := prepareText(t, src)
	want := jobfile.Problem{File: "job.yaml", Line: 17, Column: 50, Path: "combinations.extra[0].factors.Q"}
	_, err := s.Analyse()
	p := onlyProblem(t, err)
	want.Message = p.Message
	assert.Equal(t, want, p)
	assert.Contains(t, p.Message, "combination LIFT overflows")
	assert.Contains(t, p.Message, "case Q gives the largest part")

	_, err = Run(s, Settings{Step: 500})
	assert.Equal(t, want, onlyProblem(t, err))
}

// Each kind of overflow the analysis reports points at the key that causes it.
func TestLocateOverflow(t *testing.T) {
	s := prepareText(t, overflowJob)
	rows := []struct {
		name string
		nf   beam.NonFiniteError
		path string
		line int
	}{
		{"one load", beam.NonFiniteError{Case: "Q", Load: 0, Quantity: "shear"}, "cases.Q.loads[0].udl", 13},
		{"the loads of a case together", beam.NonFiniteError{Case: "Q", Load: -1, Quantity: "support reaction"}, "cases.Q.loads", 12},
		{"the self weight", beam.NonFiniteError{Case: jobfile.SelfWeightCase, Load: 0, Quantity: "deflection"}, "beam.self_weight", 1},
		{"a generated combination", beam.NonFiniteError{Case: "G", Load: -1, Combination: "ULS 6.10, Q leading", Quantity: "bending moment"}, "cases.G.loads", 8},
		{"an extra combination, factor on the case", beam.NonFiniteError{Case: "G", Load: -1, Combination: "LIFT", Quantity: "shear"}, "combinations.extra[0].factors.G", 17},
	}
	for _, r := range rows {
		t.Run(r.name, func(t *testing.T) {
			nf := r.nf
			probs, ok := s.LocateOverflow(errors.Join(errors.New("wrapped"), &nf))
			require.True(t, ok)
			require.Len(t, probs, 1)
			assert.Equal(t, r.path, probs[0].Path)
			assert.Equal(t, r.line, probs[0].Line)
			assert.Contains(t, probs[0].Message, "not a finite number")
		})
	}
	_, ok := s.LocateOverflow(errors.New("another error"))
	assert.False(t, ok)
	_, ok = s.LocateOverflow(nil)
	assert.False(t, ok)
}

// More spans and overhangs than the analysis takes are refused at beam.spans, not at cases.
func TestTooManySpansAtTheSpans(t *testing.T) {
	n := beam.MaxRegions + 1
	src := "beam:\n  section: IPE 300\n  spans: [" + strings.TrimSuffix(strings.Repeat("1, ", n), ", ") + "]\n" +
		"  supports: [pinned" + strings.Repeat(", roller", n) + "]\ncases: {G: {kind: permanent, loads: [{udl: 5}]}}\n"
	_, err := Prepare("job.yaml", []byte(src))
	p := onlyProblem(t, err)
	assert.Equal(t, "beam.spans", p.Path)
	assert.Equal(t, 3, p.Line)
	assert.Contains(t, p.Message, "65 spans and overhangs are more than the 64 the analysis takes")
}
