package optimise

import (
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// compressedJobFile is a simply supported IPE 300 in S355 over 6 m (invented data) carrying
// 20 kN/m and a 400 kN end thrust, both permanent, with γG,sup set to 1.00 so that the ULS
// forces are the characteristic ones: MEd = wL²/8 = 90 kNm at midspan, NEd = −400 kN
// (compression) along the whole beam.
const compressedJobFile = `beam:
  section: IPE 300
  grade: S355
  spans: [6.0]
  supports: [pinned, roller]
  self_weight: false
cases:
  G: {kind: permanent, loads: [{udl: 20}, {axial: -400, at: 6.0}]}
combinations:
  overrides: {gamma_G_sup: 1.0}
`

// The cross-section checks of EN 1993-1-1 6.2 say nothing about the buckling of a member in
// compression, so a beam that carries axial compression must be told that 6.3.1 (flexural
// buckling) and 6.3.3 (buckling with bending) are not checked. By hand (IPE 300 from
// EN 10365:2017: A = 53.81 cm², Wpl,y = 628.4 cm³, b = 150, tf = 10.7, tw = 7.1, r = 15 mm,
// iz = 33.5 mm; fy = 355 N/mm², EN 1993-1-1 Table 3.1):
//
//   - 6.2.9.1: Npl,Rd = 1910.3 kN; NEd = 400 kN > 0.5·hw·tw·fy = 351.1 kN, so (6.36) applies:
//     n = 0.2094, a = (A − 2b·tf)/A = 0.4035, MN,y,Rd = 223.07·(1 − n)/(1 − 0.5a) = 220.9 kNm,
//     utilisation 90/220.9 = 0.407 — the section passes;
//   - 6.3.1.2, about z with Lcr = 6 m (no restraint assumed): λ̄z = 6000/33.5/(93.9·0.8136)
//     = 2.34, curve b (Table 6.2, h/b > 1.2, tf ≤ 40 mm), α = 0.34, χz = 0.157,
//     Nb,z,Rd = 300 kN < 400 kN — the member fails unless it is restrained.
//
// So "passes" with only the lateral-torsional buckling caution would be unconservative: the
// output must warn.
func TestCompressionNamesTheUncheckedMemberBuckling(t *testing.T) {
	s, err := Prepare("compressed.yaml", []byte(compressedJobFile))
	require.NoError(t, err)
	b, err := AnalyseBeam(s, BeamSettings{Step: 500})
	require.NoError(t, err)
	require.NotNil(t, b.Member)
	m := b.Member

	// EN 1993-1-1 6.2.9.1(5), worked above
	assert.Equal(t, "bending+axial", m.Member.Check)
	assert.InDelta(t, 0.407, m.Member.Utilisation, 0.001)
	assert.False(t, m.Fails(), "the cross-section passes: not checking buckling is not a failure")

	warnings := strings.Join(m.Warnings(), "\n")
	assert.Contains(t, warnings, "6.3.1", "flexural buckling of the member is not checked")
	assert.Contains(t, warnings, "6.3.3", "nor buckling with bending")
	assert.Contains(t, warnings, "400.0 kN", "the warning states the largest compression")

	// the same beam without the thrust carries no compression: no such warning
	s, err = Prepare("bent.yaml", []byte(strings.Replace(compressedJobFile, ", {axial: -400, at: 6.0}", "", 1)))
	require.NoError(t, err)
	b, err = AnalyseBeam(s, BeamSettings{Step: 500})
	require.NoError(t, err)
	assert.NotContains(t, strings.Join(b.Member.Warnings(), "\n"), "6.3.1")

	// tension (the thrust reversed) needs no buckling check either
	s, err = Prepare("tied.yaml", []byte(strings.Replace(compressedJobFile, "axial: -400", "axial: 400", 1)))
	require.NoError(t, err)
	b, err = AnalyseBeam(s, BeamSettings{Step: 500})
	require.NoError(t, err)
	assert.NotContains(t, strings.Join(b.Member.Warnings(), "\n"), "6.3.1")
}

// The member checks are those of EN 1993-1-1 6.2 at every station; a beam also has to carry
// its support reactions and point loads through the web (EN 1993-1-5 section 6, resistance to
// transverse forces), which spanbreak does not check. By hand (EN 1993-1-5:2006 6.2 to 6.5, the
// formulas from memory) for the demo's IPE 450 in S355
// (EN 10365:2017: hw = 420.8 mm, tw = 9.4, tf = 14.6, b = 190 mm) at its 414 kN inner-support
// reaction with no stiffener and a stiff bearing ss = 0: kF = 6 (type a), Fcr = 0.9·kF·E·tw³/hw
// = 2238 kN, ly = 2tf(1 + √(m1 + m2)) = 206 mm, λ̄F = 0.555, χF = 0.5/λ̄F = 0.90,
// FRd = χF·ly·tw·fy/γM1 = 621 kN: the demo passes, but a heavier reaction would not, so the
// caution printed with every member check must name it with lateral-torsional buckling.
func TestCautionNamesWhatTheMemberChecksLeaveOut(t *testing.T) {
	assert.Contains(t, LTBCaution, "6.3.2", "lateral-torsional buckling")
	assert.Contains(t, LTBCaution, "EN 1993-1-5 section 6", "the web under transverse forces")
}
