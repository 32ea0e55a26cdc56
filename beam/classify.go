package beam

// Cross-section classification, EN 1993-1-1 5.5.2 and Table 5.2.

import (
	"fmt"
	"math"
)

// SectionClass is the cross-section class of EN 1993-1-1 5.5.2: classes 1 and 2 reach the
// plastic moment, class 3 the elastic one, class 4 buckles locally before the extreme fibre
// yields (outside spanbreak's scope).
type SectionClass int

// The four classes.
const (
	Class1 SectionClass = 1
	Class2 SectionClass = 2
	Class3 SectionClass = 3
	Class4 SectionClass = 4
)

// String returns "class 1" ... "class 4".
func (c SectionClass) String() string { return fmt.Sprintf("class %d", int(c)) }

// PartClass is the classification of one compression part by its width-to-thickness ratio.
type PartClass struct {
	Part  string  // "flange outstand" or "web"
	C, T  float64 // width c and thickness t of Table 5.2 [mm]
	Ratio float64 // c/t [-]
	// Limits are the c/t limits of classes 1, 2 and 3 [-]. A limit is 0 where the part has no
	// compressed zone under that class's stress distribution: the limit does not apply and
	// the part meets it.
	Limits [3]float64
	Class  SectionClass // the lowest class whose limit c/t meets (4 when none)
}

// Classification is the class of the section under one design axial force and moment.
type Classification struct {
	Fy      float64 // [N/mm²]
	Epsilon float64 // ε = √(235/fy) [-]
	NEd     float64 // axial force classified under, tension positive [N]
	MEd     float64 // bending moment classified under [N·mm]
	// Alpha is α of Table 5.2 sheet 1: the compressed fraction of the web's c in the plastic
	// stress distribution at the section's resistance under NEd [-].
	Alpha float64
	// Psi is ψ = σ2/σ1 of Table 5.2 sheet 1: the ratio of the elastic stresses at the two
	// ends of the web's c under MEd and NEd, σ1 the larger compression [-]; 0 when no part of
	// the web is in compression (the class 3 limit then does not apply).
	Psi    float64
	Flange PartClass // outstand flanges, Table 5.2 sheet 2
	Web    PartClass // internal compression part, Table 5.2 sheet 1
	Class  SectionClass
}

// Classify classifies the cross-section under a design moment and axial force (EN 1993-1-1
// 5.5.2 and Table 5.2); the class is the worse of the flange outstands and the web. The sign
// of MEd does not matter for a doubly symmetric section; the sign of NEd does (tension
// positive). Forces must be finite (CheckSection and CheckEnvelopes check them).
//
// The flanges are always taken as outstands in uniform compression (9ε, 10ε, 14ε): under
// major-axis bending one flange is compressed, and under a tension that relieves it the
// compression limits stay on the safe side.
//
// The web is a part in bending and compression:
//   - α, for the class 1 and 2 limits (396ε/(13α − 1) and 456ε/(13α − 1) for α > 0.5,
//     36ε/α and 41.5ε/α for α ≤ 0.5), is the position of the plastic neutral axis at the
//     section's plastic resistance under NEd: α = 1/2 + NEd,c/(2·c·tw·fy/γM0), clipped to
//     [0, 1], NEd,c the compression (negative for tension). The moment is the one that makes
//     the section fully plastic together with NEd, so α depends on NEd alone (α = 0.5 gives
//     72ε and 83ε of pure bending, α = 1 gives 33ε and 38ε of pure compression), as in the
//     published design guides' reading of Table 5.2. A web that meets the class 1 or 2 limit
//     for its α is class 1 or 2 whatever ψ is.
//   - ψ, for the class 3 limit (42ε/(0.67 + 0.33ψ) for ψ > −1, 62ε(1 − ψ)√(−ψ) for ψ ≤ −1),
//     is the ratio of the elastic stresses at the two ends of c under the actual MEd and NEd:
//     σ = −NEd/A ± |MEd|·(c/2)/Iy. With no force at all ψ is taken as −1 (pure bending, the
//     class a beam is known by).
//
// fy is divided by γM0 in α (the design plastic stress block); ε uses fy itself.
func (m Member) Classify(mEd, nEd float64) Classification {
	return m.classify(SectionForces{M: mEd, N: nEd})
}

func (m Member) classify(f SectionForces) Classification {
	s := m.Section
	eps := m.Epsilon
	c := Classification{Fy: m.Fy, Epsilon: eps, NEd: f.N, MEd: f.M}
	c.Flange = classifyPart("flange outstand", m.FlangeC, s.Tf, [3]float64{9 * eps, 10 * eps, 14 * eps})

	fyd := m.Fy / m.Settings.GammaM0
	cw := m.WebC
	nc := -f.N // compression positive
	c.Alpha = math.Min(math.Max(0.5+nc/(2*cw*s.Tw*fyd), 0), 1)
	var lim [3]float64
	switch a := c.Alpha; {
	case a > 0.5:
		lim[0], lim[1] = 396*eps/(13*a-1), 456*eps/(13*a-1)
	case a > 0:
		lim[0], lim[1] = 36*eps/a, 41.5*eps/a
	}
	sigmaN := nc / s.A
	sigmaB := math.Abs(f.M) * (cw / 2) / s.Iy
	sigma1, sigma2 := sigmaN+sigmaB, sigmaN-sigmaB
	compressed := true
	switch {
	case f.M == 0 && f.N == 0:
		c.Psi = -1
	case sigma1 > 0:
		c.Psi = sigma2 / sigma1
	default: // the whole web is in tension
		compressed = false
	}
	if compressed {
		if c.Psi > -1 {
			lim[2] = 42 * eps / (0.67 + 0.33*c.Psi)
		} else {
			lim[2] = 62 * eps * (1 - c.Psi) * math.Sqrt(-c.Psi)
		}
	}
	c.Web = classifyPart("web", cw, s.Tw, lim)
	c.Class = max(c.Flange.Class, c.Web.Class)
	return c
}

// classifyPart finds the lowest class whose limit the part's c/t meets. A relative tolerance
// of 1e-12 keeps a ratio exactly on a limit in the lower class.
func classifyPart(name string, c, t float64, limits [3]float64) PartClass {
	p := PartClass{Part: name, C: c, T: t, Ratio: c / t, Limits: limits, Class: Class4}
	for k, l := range limits {
		if l == 0 || p.Ratio <= l*(1+1e-12) {
			p.Class = SectionClass(k + 1)
			break
		}
	}
	return p
}
