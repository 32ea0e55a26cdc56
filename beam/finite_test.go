package beam

import (
	"errors"
	"math"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// A simply supported 6 m beam with a finite load first and a line load of 1e300 N/mm second:
// the fixed-end force of the second, w·l/2 ≈ 3e303 N, times the l² of the element kernel
// leaves the range of float64. The case used to solve to NaN and drop out of every envelope.
func TestOverflowingLoadIsNamed(t *testing.T) {
	m := model(6000, at(0, Pinned), at(6000, Roller))
	cases := []Case{
		{Name: "G", Kind: Permanent, Loads: []Load{udl(10, 0, 6000)}},
		{Name: "Q", Kind: Imposed, Pattern: true, Loads: []Load{udl(5, 0, 6000), udl(1e300, 0, 6000)}},
	}
	an, err := NewAnalysis(m, cases)
	require.Error(t, err)
	assert.Nil(t, an)
	var nf *NonFiniteError
	require.True(t, errors.As(err, &nf), "%T %v", err, err)
	assert.Equal(t, "Q", nf.Case)
	assert.Equal(t, 1, nf.Load, "the second load of Q, alone, overflows")
	assert.Empty(t, nf.Combination)
	assert.Contains(t, err.Error(), "case Q, load 2:")
	assert.Contains(t, err.Error(), "not a finite number")

	// the same load unpatterned, as the only load of the case
	cases[1] = Case{Name: "Q", Kind: Imposed, Loads: []Load{udl(1e300, 0, 6000)}}
	_, err = NewAnalysis(m, cases)
	require.True(t, errors.As(err, &nf), "%v", err)
	assert.Equal(t, NonFiniteError{Case: "Q", Load: 0, Quantity: nf.Quantity, X: nf.X}, *nf)
}

// Two spans of 1 mm (EI 1 N·mm², so the deflections stay small numbers) with a point load
// P = 1.7e308 N at the middle of each, patterned. One span loaded alone gives the centre
// support 11P/16 (two-span continuous beam, central point load on one span, standard beam
// tables), about 1.17e308 N: finite. Both spans together give 22P/16 ≈ 2.3e308 N, past the
// largest float64 (1.8e308): the sum of the regions overflows although no region does.
func TestOverflowingSumOfRegionsIsNamed(t *testing.T) {
	const P = 1.7e308
	m := Model{Length: 2, EI: 1, EA: 1, Supports: []Support{at(0, Pinned), at(1, Roller), at(2, Roller)}}
	cases := []Case{{Name: "Q", Kind: Imposed, Pattern: true, Loads: []Load{point(P, 0.5), point(P, 1.5)}}}
	centre := 11 * (P / 16)
	require.True(t, math.IsInf(centre+centre, 1), "the premise: the sum overflows")
	require.Less(t, centre, math.MaxFloat64, "the premise: one span alone does not")
	an, err := NewAnalysis(m, cases)
	require.NoError(t, err, "every region's results are finite")
	st, err := an.Stations(0.25)
	require.NoError(t, err)

	want := NonFiniteError{Case: "Q", Load: -1, Quantity: "support reaction", X: 1}
	_, err = an.CaseResult("Q", st)
	var nf *NonFiniteError
	require.True(t, errors.As(err, &nf), "CaseResult: %v", err)
	assert.Equal(t, want, *nf)
	assert.Contains(t, err.Error(), "case Q: the support reaction at x = 1 mm")

	combos := []Combination{{Name: "U", State: ULS, Factors: []Factor{{Case: "Q", Adverse: 1.5, Relieving: 0}}}}
	_, err = an.Envelopes(combos, st)
	require.True(t, errors.As(err, &nf), "Envelopes: %v", err)
	assert.Equal(t, want, *nf, "the case's regions add past the range before any factor")
}

// A case with finite results of about 1e300 (a 1 m span, M = wL²/8 = 1e300 N·mm) is analysed,
// but a combination with a factor of 1e10 on it overflows: Envelopes names the combination
// and the case with the largest part, where the envelope used to keep whatever was finite.
func TestOverflowingCombinationIsNamed(t *testing.T) {
	const L = 1000.0
	w := 8 * 1e300 / (L * L)
	m := model(L, at(0, Pinned), at(L, Roller))
	cases := []Case{
		{Name: "G", Kind: Permanent, Loads: []Load{udl(10, 0, L)}},
		{Name: "Q", Kind: Imposed, Loads: []Load{udl(w, 0, L)}},
	}
	an, err := NewAnalysis(m, cases)
	require.NoError(t, err)
	st, err := an.StationsAt([]float64{0, L / 2, L})
	require.NoError(t, err)
	r, err := an.CaseResult("Q", st)
	require.NoError(t, err)
	assert.InEpsilon(t, 1e300, r.Effects.M[1], 1e-9, "wL²/8, standard beam tables")

	combos := []Combination{
		{Name: "fine", State: ULS, Factors: []Factor{{Case: "G", Adverse: 1.35, Relieving: 1}, {Case: "Q", Adverse: 1.5, Relieving: 0}}},
		{Name: "huge", State: ULS, Factors: []Factor{{Case: "G", Adverse: 1, Relieving: 1}, {Case: "Q", Adverse: 1e10, Relieving: 0}}},
	}
	_, err = an.Envelopes(combos, st)
	var nf *NonFiniteError
	require.True(t, errors.As(err, &nf), "%v", err)
	assert.Equal(t, "huge", nf.Combination)
	assert.Equal(t, "Q", nf.Case, "Q carries the largest part")
	assert.Equal(t, -1, nf.Load)
	assert.Contains(t, err.Error(), "combination huge (case Q the largest part)")

	env, err := an.Envelopes(combos[:1], st)
	require.NoError(t, err, "the combination with EN 1990 factors is finite")
	assert.InEpsilon(t, 1.5e300, env.ULS.MMax[1].Value, 1e-6, "γQ wL²/8 + γG (10 N/mm)L²/8; the G part is below round-off")
}
