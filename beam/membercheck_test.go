package beam

import (
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// memberJob analyses a beam of the section under the cases with EN 1990 6.10 and the
// characteristic SLS combinations, at stations every step [mm].
func memberJob(t *testing.T, sec Section, length float64, sup []Support, cases []Case, step float64) (*Analysis, Envelopes) {
	t.Helper()
	m := Model{Length: length, Supports: sup, EI: YoungModulus * sec.Iy, EA: YoungModulus * sec.A}
	an, err := NewAnalysis(m, cases)
	require.NoError(t, err)
	rules, err := NewRules(SetEN1990, ULS610, SLSCharacteristic, nil)
	require.NoError(t, err)
	combos, err := Combinations(cases, rules)
	require.NoError(t, err)
	st, err := an.Stations(step)
	require.NoError(t, err)
	env, err := an.Envelopes(combos, st)
	require.NoError(t, err)
	return an, env
}

func gq(g, q float64, length float64) []Case {
	return []Case{
		{Name: "G", Kind: Permanent, Loads: []Load{udl(g, 0, length)}},
		{Name: "Q", Kind: Imposed, Category: "B", Pattern: true, Loads: []Load{udl(q, 0, length)}},
	}
}

// TestCheckEnvelopesSimplySupported: IPE 300 S355 simply supported over L = 6 m, G = 10 kN/m,
// Q = 15 kN/m (category B). EN 1990 (6.10): wEd = 1.35·10 + 1.5·15 = 36 kN/m (Table A1.2(B)).
// MEd = wL²/8 = 162 kNm at mid-span, VEd = wL/2 = 108 kN at the supports (handbook closed
// forms). Mc,Rd = Wpl,y·fy = 628.4 cm³·355 = 223.1 kNm, Vpl,Rd = Avz·fy/√3 = 25.68 cm²·355/√3
// = 526.3 kN with the published Wpl,y (EN 10365) and Avz (from memory); tolerance 0.5 % for
// the computed section properties.
func TestCheckEnvelopesSimplySupported(t *testing.T) {
	const L = 6000.0
	sec, err := LookupSection("IPE 300")
	require.NoError(t, err)
	_, env := memberJob(t, sec, L, []Support{at(0, Pinned), at(L, Roller)}, gq(10, 15, L), 100)
	m, err := NewMember(sec, grade(t, "S355"), MemberSettings{})
	require.NoError(t, err)
	res, err := m.CheckEnvelopes(&env)
	require.NoError(t, err)
	require.Len(t, res.Stations, len(env.Stations))

	mEd := 36 * L * L / 8
	mcRd := 628.4e3 * 355
	assert.InDelta(t, L/2, res.X, 1e-9, "governing at mid-span")
	assert.Equal(t, CheckBending, res.Check)
	assert.InEpsilon(t, mEd/mcRd, res.Utilisation, 0.005)
	assert.InEpsilon(t, mEd, res.Section.Forces.M, 1e-9)
	assert.Equal(t, BoundMax, res.Pairing.M, "the sagging extreme")
	assert.Equal(t, "ULS 6.10, Q leading; Q on span 1", res.Combination)
	assert.Equal(t, Class1, res.Class)
	assert.Equal(t, Class1, res.Section.Class.Class)
	assert.InEpsilon(t, mcRd, res.Section.McRd, 0.005)
	assert.Equal(t, res.Section.McRd, res.McRd)
	assert.Equal(t, res.Section.VcRd, res.VcRd)
	assert.InEpsilon(t, 25.68e2*355/math.Sqrt(3), res.Section.VcRd, 0.005)
	assert.NoError(t, res.OutsideScope())

	// at the left support the shear is the largest: 108 kN over Vpl,Rd
	s0 := res.Stations[0]
	assert.Zero(t, s0.Station.X)
	assert.Equal(t, CheckShear, s0.Check)
	assert.InEpsilon(t, 36*L/2/(25.68e2*355/math.Sqrt(3)), s0.Utilisation, 0.005)
	assert.InEpsilon(t, 36*L/2, math.Abs(s0.Pairing.VExtreme.Value), 1e-9)
	for _, st := range res.Stations {
		assert.LessOrEqual(t, st.Utilisation, res.Utilisation)
	}
}

// TestCheckEnvelopesPairsBothSigns: two equal spans, 8 m, IPE 400 S355: the hogging moment at
// the middle support (−0.125·wL², three-moment theorem) is checked with the larger |V| there
// (0.625·wL); the minimum moment extreme governs.
func TestCheckEnvelopesPairsBothSigns(t *testing.T) {
	const L = 8000.0
	sec, err := LookupSection("IPE 400")
	require.NoError(t, err)
	_, env := memberJob(t, sec, 2*L, []Support{at(0, Pinned), at(L, Roller), at(2*L, Roller)}, gq(10, 15, 2*L), 100)
	m, err := NewMember(sec, grade(t, "S355"), MemberSettings{})
	require.NoError(t, err)
	res, err := m.CheckEnvelopes(&env)
	require.NoError(t, err)
	w := 1.35*10 + 1.5*15.0
	assert.InDelta(t, L, res.X, 1e-9)
	assert.Equal(t, BoundMin, res.Pairing.M)
	assert.InEpsilon(t, -0.125*w*L*L, res.Pairing.MExtreme.Value, 1e-9)
	assert.InEpsilon(t, 0.625*w*L, math.Abs(res.Pairing.VExtreme.Value), 1e-9)
	assert.Contains(t, res.Combination, "Q on the whole beam")
	// 0.625·36·8 = 180 kN < 0.5 Vpl,Rd: no M–V reduction, plain bending with Wpl,y
	assert.Equal(t, CheckBending, res.Check)
	assert.InEpsilon(t, 0.125*w*L*L/(sec.WplY*355), res.Utilisation, 1e-9)
	assert.Equal(t, "M min with |V| from V "+res.Pairing.V.String()+" and N max", res.Pairing.String())
}

// TestCheckEnvelopesWithAxialForce: HE 300 B S355, L = 6 m simply supported, a permanent
// compression of 1500 kN applied at the roller end and G = 60 kN/m. ULS (6.10): NEd =
// −1.35·1500 = −2025 kN, MEd = 1.35·60·6²/8 = 364.5 kNm. n = 2025/(A·355) = 0.383 > 0.25, so
// 6.2.9.1(5) applies: MN,y,Rd = Mpl,y,Rd·(1 − n)/(1 − 0.5a), a = (A − 2·300·19)/A; MEd/MN,y,Rd
// = 0.79 exceeds the axial check's 0.383 at the ends.
func TestCheckEnvelopesWithAxialForce(t *testing.T) {
	const L = 6000.0
	sec, err := LookupSection("HE 300 B")
	require.NoError(t, err)
	cases := []Case{{Name: "G", Kind: Permanent, Loads: []Load{udl(60, 0, L), {Kind: AxialForce, X1: L, P: -1500e3}}}}
	_, env := memberJob(t, sec, L, []Support{at(0, Pinned), at(L, Roller)}, cases, 100)
	m, err := NewMember(sec, grade(t, "S355"), MemberSettings{})
	require.NoError(t, err)
	res, err := m.CheckEnvelopes(&env)
	require.NoError(t, err)
	nEd := -1.35 * 1500e3
	n := -nEd / (sec.A * 355)
	a := (sec.A - 2*300*19) / sec.A
	mn := sec.WplY * 355 * (1 - n) / (1 - 0.5*a)
	assert.InDelta(t, L/2, res.X, 1e-9)
	assert.Equal(t, CheckBendingAxial, res.Check)
	assert.InEpsilon(t, nEd, res.Section.Forces.N, 1e-9)
	assert.InEpsilon(t, 1.35*60*L*L/8/mn, res.Utilisation, 1e-9)
	assert.InEpsilon(t, -nEd/(sec.A*355), res.Stations[0].Utilisation, 1e-9, "axial check at the end, M = 0")
	assert.Equal(t, CheckAxial, res.Stations[0].Check)
	assert.Equal(t, BoundMin, res.Pairing.N, "the larger compression")
}

// TestCheckEnvelopesClass4OutsideScope: IPE 500 S355 (web c/t = 41.76) with a compression of
// 1400 kN: at the pinned end M = 0, the web is in uniform compression and 41.76 > 42ε = 34.2
// (Table 5.2): class 4, the member is outside scope and no utilisation is given.
func TestCheckEnvelopesClass4OutsideScope(t *testing.T) {
	const L = 6000.0
	sec, err := LookupSection("IPE 500")
	require.NoError(t, err)
	cases := []Case{{Name: "G", Kind: Permanent, Loads: []Load{udl(10, 0, L), {Kind: AxialForce, X1: L, P: -1400e3 / 1.35}}}}
	_, env := memberJob(t, sec, L, []Support{at(0, Pinned), at(L, Roller)}, cases, 100)
	m, err := NewMember(sec, grade(t, "S355"), MemberSettings{})
	require.NoError(t, err)
	res, err := m.CheckEnvelopes(&env)
	require.NoError(t, err)
	assert.Equal(t, Class4, res.Class)
	assert.Equal(t, Class4, res.Section.Class.Class)
	assert.Zero(t, res.Utilisation)
	assert.Empty(t, res.Check)
	assert.Zero(t, res.Section.McRd)
	assert.Zero(t, res.McRd)
	assert.Zero(t, res.X, "the first class 4 station")
	err = res.OutsideScope()
	require.ErrorIs(t, err, ErrOutsideScope)
	assert.Contains(t, err.Error(), "x = 0 mm")
}

// TestCheckEnvelopesErrors: envelopes that cannot be checked are errors.
func TestCheckEnvelopesErrors(t *testing.T) {
	const L = 6000.0
	sec, err := LookupSection("IPE 300")
	require.NoError(t, err)
	m, err := NewMember(sec, grade(t, "S355"), MemberSettings{})
	require.NoError(t, err)
	_, env := memberJob(t, sec, L, []Support{at(0, Pinned), at(L, Roller)}, gq(10, 15, L), 500)

	_, err = m.CheckEnvelopes(&Envelopes{})
	assert.ErrorContains(t, err, "no stations")
	_, err = Member{}.CheckEnvelopes(&env)
	assert.ErrorContains(t, err, "NewMember")
	_, err = Member{}.CheckSection(SectionForces{M: 1})
	assert.ErrorContains(t, err, "NewMember")
	short := env
	short.ULS.MMax = short.ULS.MMax[:3]
	_, err = m.CheckEnvelopes(&short)
	assert.ErrorContains(t, err, "M_max has 3 values")
	bad := env
	bad.ULS.VMin = append([]Extreme(nil), env.ULS.VMin...)
	bad.ULS.VMin[2].Value = math.NaN()
	_, err = m.CheckEnvelopes(&bad)
	assert.ErrorContains(t, err, "V_min at x = 1000 mm")

	// only SLS combinations: no ULS envelope to check
	an, err := NewAnalysis(Model{Length: L, Supports: []Support{at(0, Pinned), at(L, Roller)}, EI: testEI, EA: testEA}, gq(10, 15, L))
	require.NoError(t, err)
	st, err := an.Stations(500)
	require.NoError(t, err)
	sls, err := UserCombination("S", SLS, map[string]float64{"G": 1, "Q": 1}, gq(10, 15, L))
	require.NoError(t, err)
	onlySLS, err := an.Envelopes([]Combination{sls}, st)
	require.NoError(t, err)
	_, err = m.CheckEnvelopes(&onlySLS)
	assert.ErrorContains(t, err, "no ULS combination")
}

// TestCheckEnvelopesEqualsSectionChecks: every station's utilisation is the worst of its four
// pairings checked one by one with CheckSection (a brute-force twin), on a patterned
// three-span beam with an axial force.
func TestCheckEnvelopesEqualsSectionChecks(t *testing.T) {
	const L = 7000.0
	sec, err := LookupSection("HE 300 B")
	require.NoError(t, err)
	cases := gq(25, 30, 3*L)
	cases = append(cases, Case{Name: "T", Kind: OtherVariable, Psi: &[3]float64{0.6, 0.5, 0}, Loads: []Load{{Kind: AxialForce, X1: 3 * L, P: -900e3}}})
	_, env := memberJob(t, sec, 3*L, []Support{at(0, Pinned), at(L, Roller), at(2*L, Roller), at(3*L, Roller)}, cases, 250)
	m, err := NewMember(sec, grade(t, "S355"), MemberSettings{})
	require.NoError(t, err)
	res, err := m.CheckEnvelopes(&env)
	require.NoError(t, err)
	e := env.ULS
	for i, st := range res.Stations {
		v := e.VMax[i].Value
		if math.Abs(e.VMin[i].Value) > math.Abs(v) {
			v = e.VMin[i].Value
		}
		worst, id := 0.0, ""
		for _, mm := range []float64{e.MMax[i].Value, e.MMin[i].Value} {
			for _, nn := range []float64{e.NMax[i].Value, e.NMin[i].Value} {
				r := checkSection(t, m, SectionForces{M: mm, V: v, N: nn})
				if r.Utilisation > worst {
					worst, id = r.Utilisation, r.Checks[r.Governing].ID
				}
			}
		}
		assert.InEpsilon(t, worst, st.Utilisation, 1e-12, "x = %g", st.Station.X)
		assert.Equal(t, id, st.Check, "x = %g", st.Station.X)
	}
	g := res.Stations[res.Governing]
	assert.Equal(t, g.Utilisation, res.Utilisation)
	assert.True(t, strings.HasPrefix(res.Combination, "ULS 6.10"), res.Combination)
	assert.NotEmpty(t, res.NCombination)
}
