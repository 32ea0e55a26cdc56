package splice

import (
	"errors"
	"fmt"
	"strings"
)

// PartialFactors are the EN 1993-1-8 Table 2.1 / EN 1993-1-1 6.1 partial factors. A zero field
// takes the recommended value (DefaultPartialFactors); a National Annex may set others.
type PartialFactors struct {
	GammaM0    float64 // resistance of cross-sections (recommended 1.00)
	GammaM1    float64 // member buckling (recommended 1.00)
	GammaM2    float64 // bolts, bearing, net sections, block tearing (recommended 1.25)
	GammaM3    float64 // slip resistance at ULS, category C (recommended 1.25)
	GammaM3Ser float64 // slip resistance at SLS, category B (recommended 1.10)
	GammaM7    float64 // preload of high-strength bolts (recommended 1.10); listed in Table 2.1 but no formula of the 2005 text uses it (Fp,C = 0.7 fub As)
}

// DefaultPartialFactors returns the recommended values of EN 1993-1-8 Table 2.1 and
// EN 1993-1-1 6.1(1) NOTE 2B.
func DefaultPartialFactors() PartialFactors {
	return PartialFactors{GammaM0: 1.00, GammaM1: 1.00, GammaM2: 1.25, GammaM3: 1.25, GammaM3Ser: 1.10, GammaM7: 1.10}
}

// resolved replaces zero fields by the recommended values.
func (f PartialFactors) resolved() PartialFactors {
	d := DefaultPartialFactors()
	pick := func(v, def float64) float64 {
		if v == 0 {
			return def
		}
		return v
	}
	return PartialFactors{
		GammaM0:    pick(f.GammaM0, d.GammaM0),
		GammaM1:    pick(f.GammaM1, d.GammaM1),
		GammaM2:    pick(f.GammaM2, d.GammaM2),
		GammaM3:    pick(f.GammaM3, d.GammaM3),
		GammaM3Ser: pick(f.GammaM3Ser, d.GammaM3Ser),
		GammaM7:    pick(f.GammaM7, d.GammaM7),
	}
}

func (f PartialFactors) validate() error {
	r := f.resolved()
	var errs []error
	for _, x := range []struct {
		name string
		v    float64
	}{{"gamma_M0", r.GammaM0}, {"gamma_M1", r.GammaM1}, {"gamma_M2", r.GammaM2},
		{"gamma_M3", r.GammaM3}, {"gamma_M3_ser", r.GammaM3Ser}, {"gamma_M7", r.GammaM7}} {
		if !(x.v > 0) || x.v > 10 {
			errs = append(errs, fmt.Errorf("factors.%s: %g is not a partial factor (expected a value between 0 and 10)", x.name, x.v))
		}
	}
	return errors.Join(errs...)
}

// Category is the bolted-connection category of EN 1993-1-8 Table 3.2 for shear.
type Category string

const (
	CategoryA Category = "A" // bearing type
	CategoryB Category = "B" // slip-resistant at serviceability limit state
	CategoryC Category = "C" // slip-resistant at ultimate limit state
)

// ParseCategory reads "A", "B" or "C" (case ignored).
func ParseCategory(s string) (Category, error) {
	switch strings.ToUpper(strings.TrimSpace(s)) {
	case "A":
		return CategoryA, nil
	case "B":
		return CategoryB, nil
	case "C":
		return CategoryC, nil
	}
	return "", fmt.Errorf("category %q is not one of A (bearing), B (slip-resistant at SLS), C (slip-resistant at ULS)", s)
}

// Preloaded reports whether the category needs preloaded bolts.
func (c Category) Preloaded() bool { return c == CategoryB || c == CategoryC }

// FrictionClass is the class of the prepared faying surfaces, EN 1090-2 Table 18 / EN 1993-1-8 3.9.1.
type FrictionClass string

// ParseFrictionClass reads "A".."D" (case ignored).
func ParseFrictionClass(s string) (FrictionClass, error) {
	u := strings.ToUpper(strings.TrimSpace(s))
	switch u {
	case "A", "B", "C", "D":
		return FrictionClass(u), nil
	}
	return "", fmt.Errorf("friction class %q is not one of A, B, C, D", s)
}

// SlipFactor is μ for the class (EN 1090-2 Table 18): A 0.5 (shot or grit blasted), B 0.4
// (blasted and spray-metallised or alkali-zinc silicate painted), C 0.3 (wire-brushed or
// flame-cleaned), D 0.2 (as rolled). An unknown class gives 0.
func (f FrictionClass) SlipFactor() float64 {
	switch f {
	case "A":
		return 0.5
	case "B":
		return 0.4
	case "C":
		return 0.3
	case "D":
		return 0.2
	}
	return 0
}

// HoleType is the bolt hole clearance of EN 1090-2.
type HoleType string

const (
	NormalHoles   HoleType = "normal"
	OversizeHoles HoleType = "oversize"
)

// ParseHoleType reads "normal" or "oversize"; "" means normal.
func ParseHoleType(s string) (HoleType, error) {
	switch strings.ToLower(strings.TrimSpace(s)) {
	case "", "normal":
		return NormalHoles, nil
	case "oversize":
		return OversizeHoles, nil
	}
	return "", fmt.Errorf("holes %q is not one of normal, oversize", s)
}

// Ks is the hole-type factor ks of EN 1993-1-8 Table 3.6: 1.0 normal holes, 0.85 oversize.
func (h HoleType) Ks() float64 {
	if h == OversizeHoles {
		return 0.85
	}
	return 1.0
}

// BearingFactor multiplies Fb,Rd for the hole type: 0.8 for oversize holes, EN 1993-1-8 Table 3.4 note 1.
func (h HoleType) BearingFactor() float64 {
	if h == OversizeHoles {
		return 0.8
	}
	return 1.0
}

// Distribution is the rule that shares the moment and axial force between flanges and web.
type Distribution string

const (
	// Proportional: the web takes Mw = M·Iw/Iy and Nw = N·Aw/A, the flanges the rest.
	Proportional Distribution = "proportional"
	// FlangesOnly: the flanges take all the moment, the web the shear and its share N·Aw/A.
	FlangesOnly Distribution = "flanges-only"
)

// ParseDistribution reads "proportional" or "flanges-only"; "" means proportional.
func ParseDistribution(s string) (Distribution, error) {
	switch strings.ToLower(strings.TrimSpace(s)) {
	case "", "proportional":
		return Proportional, nil
	case "flanges-only":
		return FlangesOnly, nil
	}
	return "", fmt.Errorf("distribution %q is not one of proportional, flanges-only", s)
}

// Arrangement is the set of flange cover plates.
type Arrangement string

const (
	OuterOnly  Arrangement = "outer"       // one outer plate per flange, bolts in single shear
	OuterInner Arrangement = "outer+inner" // outer plate plus two inner plates, bolts in double shear
)

// ParseArrangement reads "outer" or "outer+inner".
func ParseArrangement(s string) (Arrangement, error) {
	switch strings.ToLower(strings.ReplaceAll(s, " ", "")) {
	case "outer":
		return OuterOnly, nil
	case "outer+inner":
		return OuterInner, nil
	}
	return "", fmt.Errorf("flange plate arrangement %q is not one of outer, outer+inner", s)
}
