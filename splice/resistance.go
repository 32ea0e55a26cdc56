package splice

import (
	"errors"
	"math"
)

// The functions in this file are the resistance formulas of EN 1993-1-8:2005 and
// EN 1993-1-1:2005 as plain arithmetic on N and mm, so that a reader can find each clause
// and a test can redo it by hand. They never fail: a geometry that makes a term negative
// (an edge distance below 0.6 d0, say) gives a resistance of zero, which the checks report
// as a failure.

// ShearResistancePerPlane is Fv,Rd = αv fub A / γM2 for one shear plane, EN 1993-1-8 Table 3.4
// [N]. With threads in the plane A = As and αv is the class's value (0.6 or 0.5); through the
// shank A = πd²/4 and αv = 0.6 for every class.
func ShearResistancePerPlane(size BoltSize, class BoltClass, threadsInPlane bool, gammaM2 float64) float64 {
	if threadsInPlane {
		return class.AlphaV * class.Fub * size.As / gammaM2
	}
	return 0.6 * class.Fub * size.ShankArea() / gammaM2
}

// AlphaDEnd is αd = e1/(3 d0) for an end bolt, EN 1993-1-8 Table 3.4.
func AlphaDEnd(e1, d0 float64) float64 { return e1 / (3 * d0) }

// AlphaDInner is αd = p1/(3 d0) − 1/4 for an inner bolt, EN 1993-1-8 Table 3.4.
func AlphaDInner(p1, d0 float64) float64 { return p1/(3*d0) - 0.25 }

// AlphaB is αb = min(αd, fub/fu, 1.0), EN 1993-1-8 Table 3.4 (never below zero).
func AlphaB(alphaD, fub, fu float64) float64 {
	return max(0, min(alphaD, min(fub/fu, 1.0)))
}

// K1Edge is k1 = min(2.8 e2/d0 − 1.7, 1.4 p2/d0 − 1.7, 2.5) for an edge bolt, EN 1993-1-8
// Table 3.4 (corrected text, three terms). p2 ≤ 0 means a single bolt line: no p2 term.
func K1Edge(e2, p2, d0 float64) float64 {
	k := min(2.8*e2/d0-1.7, 2.5)
	if p2 > 0 {
		k = min(k, 1.4*p2/d0-1.7)
	}
	return max(0, k)
}

// K1Inner is k1 = min(1.4 p2/d0 − 1.7, 2.5) for an inner bolt, EN 1993-1-8 Table 3.4.
// p2 ≤ 0 means a single bolt line: k1 = 2.5.
func K1Inner(p2, d0 float64) float64 {
	if p2 <= 0 {
		return 2.5
	}
	return max(0, min(1.4*p2/d0-1.7, 2.5))
}

// BearingResistance is Fb,Rd = k1 αb fu d t / γM2, EN 1993-1-8 Table 3.4 [N]; holeFactor is
// 0.8 for oversize holes (note 1), 1.0 for normal holes.
func BearingResistance(k1, alphaB, fu, d, t, gammaM2, holeFactor float64) float64 {
	return holeFactor * k1 * alphaB * fu * d * t / gammaM2
}

// PreloadForce is Fp,C = 0.7 fub As, EN 1993-1-8 3.9.1(2) [N].
func PreloadForce(fub, as float64) float64 { return 0.7 * fub * as }

// SlipResistance is Fs,Rd = ks n μ Fp,C / γM3, EN 1993-1-8 3.9.1(1) [N]; n is the number of
// friction surfaces; γM3 is γM3,ser at SLS (category B) and γM3 at ULS (category C).
func SlipResistance(ks float64, n int, mu, fpC, gammaM3 float64) float64 {
	return ks * float64(n) * mu * fpC / gammaM3
}

// LongJointFactor is βLf = 1 − (Lj − 15d)/(200d) within 0.75..1.0, EN 1993-1-8 3.8(1); 1.0 when
// Lj ≤ 15d.
func LongJointFactor(lj, d float64) float64 {
	if lj <= 15*d {
		return 1
	}
	return min(1, max(0.75, 1-(lj-15*d)/(200*d)))
}

// PackingFactor is βp = 9d/(8d + 3tp) ≤ 1, EN 1993-1-8 3.6.1(12); 1.0 when tp ≤ d/3.
func PackingFactor(tp, d float64) float64 {
	if tp <= d/3 {
		return 1
	}
	return min(1, 9*d/(8*d+3*tp))
}

// BlockTearing is the block tearing resistance of EN 1993-1-8 3.10.2 (2005 text) [N]:
// concentric Veff,1,Rd = fu Ant/γM2 + (1/√3) fy Anv/γM0, eccentric Veff,2,Rd = 0.5 fu Ant/γM2 +
// (1/√3) fy Anv/γM0. Areas below zero count as zero.
func BlockTearing(fu, fy, ant, anv float64, concentric bool, gammaM0, gammaM2 float64) float64 {
	ant, anv = max(0, ant), max(0, anv)
	k := 0.5
	if concentric {
		k = 1
	}
	return k*fu*ant/gammaM2 + fy*anv/(math.Sqrt(3)*gammaM0)
}

// BucklingCurve is a flexural buckling curve of EN 1993-1-1 Table 6.1.
type BucklingCurve string

// ImperfectionFactor is α of EN 1993-1-1 Table 6.1: a0 0.13, a 0.21, b 0.34, c 0.49, d 0.76.
func ImperfectionFactor(curve BucklingCurve) (float64, error) {
	switch curve {
	case "a0":
		return 0.13, nil
	case "a":
		return 0.21, nil
	case "b":
		return 0.34, nil
	case "c":
		return 0.49, nil
	case "d":
		return 0.76, nil
	}
	return 0, errors.New("buckling curve " + string(curve) + " is not one of a0, a, b, c, d")
}

// Chi is the reduction factor χ = 1/(Φ + √(Φ² − λ̄²)) ≤ 1 with Φ = 0.5[1 + α(λ̄ − 0.2) + λ̄²],
// EN 1993-1-1 6.3.1.2(1). λ̄ ≤ 0.2 gives 1 (6.3.1.2(4)).
func Chi(lambdaBar, alpha float64) float64 {
	if lambdaBar <= 0.2 {
		return 1
	}
	phi := 0.5 * (1 + alpha*(lambdaBar-0.2) + lambdaBar*lambdaBar)
	return min(1, 1/(phi+math.Sqrt(phi*phi-lambdaBar*lambdaBar)))
}

// Lambda1 is λ1 = π √(E/fy) = 93.9 ε, EN 1993-1-1 6.3.1.3(1).
func Lambda1(e, fy float64) float64 { return math.Pi * math.Sqrt(e/fy) }

// Epsilon is ε = √(235/fy), EN 1993-1-1 Table 5.2.
func Epsilon(fy float64) float64 { return math.Sqrt(235 / fy) }
