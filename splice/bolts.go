package splice

import (
	"fmt"
	"math"
	"strings"
)

// BoltSize is one metric bolt size with the dimensions the checks need [mm, mm²].
type BoltSize struct {
	Name       string  // "M20"
	D          float64 // nominal (shank) diameter d [mm]
	As         float64 // tensile stress area As, EN ISO 898-1 [mm²]
	D0Normal   float64 // normal round hole d0, EN 1090-2 Table 11 clearances [mm]
	D0Oversize float64 // oversize round hole d0, EN 1090-2 Table 11 clearances [mm]
	WasherOD   float64 // outside diameter of the washer (EN 14399-6 / ISO 7089, from memory) [mm]
}

// ShankArea is the gross area of the unthreaded shank, πd²/4 [mm²].
func (s BoltSize) ShankArea() float64 { return math.Pi * s.D * s.D / 4 }

// HoleDiameter is d0 for the given hole type [mm].
func (s BoltSize) HoleDiameter(h HoleType) float64 {
	if h == OversizeHoles {
		return s.D0Oversize
	}
	return s.D0Normal
}

// boltSizeNames lists the sizes in ascending order; LookupBoltSize holds the data.
func boltSizeNames() []string {
	return []string{"M12", "M16", "M20", "M22", "M24", "M27", "M30", "M36"}
}

// BoltSizes returns every bolt size the program knows, smallest first (a fresh slice).
func BoltSizes() []BoltSize {
	names := boltSizeNames()
	out := make([]BoltSize, len(names))
	for i, n := range names {
		out[i], _ = LookupBoltSize(n)
	}
	return out
}

// LookupBoltSize returns the data of a size by name ("M20", case and spaces ignored).
//
// Stress areas As are those of EN ISO 898-1 (coarse thread). Hole clearances are EN 1090-2
// Table 11: normal 1 mm (M12, M14), 2 mm (M16–M24), 3 mm (M27 and larger); oversize 3 mm
// (M12, M14), 4 mm (M16–M22), 6 mm (M24), 8 mm (M27 and larger).
func LookupBoltSize(name string) (BoltSize, error) {
	n := strings.ToUpper(strings.ReplaceAll(strings.TrimSpace(name), " ", ""))
	switch n {
	case "M12":
		return BoltSize{Name: n, D: 12, As: 84.3, D0Normal: 13, D0Oversize: 15, WasherOD: 24}, nil
	case "M16":
		return BoltSize{Name: n, D: 16, As: 157, D0Normal: 18, D0Oversize: 20, WasherOD: 30}, nil
	case "M20":
		return BoltSize{Name: n, D: 20, As: 245, D0Normal: 22, D0Oversize: 24, WasherOD: 37}, nil
	case "M22":
		return BoltSize{Name: n, D: 22, As: 303, D0Normal: 24, D0Oversize: 26, WasherOD: 39}, nil
	case "M24":
		return BoltSize{Name: n, D: 24, As: 353, D0Normal: 26, D0Oversize: 30, WasherOD: 44}, nil
	case "M27":
		return BoltSize{Name: n, D: 27, As: 459, D0Normal: 30, D0Oversize: 35, WasherOD: 50}, nil
	case "M30":
		return BoltSize{Name: n, D: 30, As: 561, D0Normal: 33, D0Oversize: 38, WasherOD: 56}, nil
	case "M36":
		return BoltSize{Name: n, D: 36, As: 817, D0Normal: 39, D0Oversize: 44, WasherOD: 66}, nil
	}
	return BoltSize{}, fmt.Errorf("bolt size %q is not known (known: %s)", name, strings.Join(boltSizeNames(), ", "))
}

// BoltClass is a property class of EN ISO 898-1 with its EN 1993-1-8 Table 3.1 strengths.
type BoltClass struct {
	Name        string  // "8.8"
	Fyb         float64 // yield strength fyb [N/mm²]
	Fub         float64 // ultimate strength fub [N/mm²]
	AlphaV      float64 // αv for a shear plane through the threaded portion, EN 1993-1-8 Table 3.4
	Preloadable bool    // may be preloaded (categories B and C), EN 1993-1-8 3.1.2(1)
}

func boltClassNames() []string {
	return []string{"4.6", "4.8", "5.6", "5.8", "6.8", "8.8", "10.9"}
}

// BoltClasses returns every property class, weakest first (a fresh slice).
func BoltClasses() []BoltClass {
	names := boltClassNames()
	out := make([]BoltClass, len(names))
	for i, n := range names {
		out[i], _ = LookupBoltClass(n)
	}
	return out
}

// LookupBoltClass returns a property class by name ("8.8", "10.9"...).
//
// fyb and fub are EN 1993-1-8 Table 3.1; αv (threads in the shear plane) is Table 3.4: 0.6 for
// classes 4.6, 5.6 and 8.8, 0.5 for 4.8, 5.8, 6.8 and 10.9. Only 8.8 and 10.9 may be preloaded.
func LookupBoltClass(name string) (BoltClass, error) {
	n := strings.TrimSpace(name)
	switch n {
	case "4.6":
		return BoltClass{Name: n, Fyb: 240, Fub: 400, AlphaV: 0.6}, nil
	case "4.8":
		return BoltClass{Name: n, Fyb: 320, Fub: 400, AlphaV: 0.5}, nil
	case "5.6":
		return BoltClass{Name: n, Fyb: 300, Fub: 500, AlphaV: 0.6}, nil
	case "5.8":
		return BoltClass{Name: n, Fyb: 400, Fub: 500, AlphaV: 0.5}, nil
	case "6.8":
		return BoltClass{Name: n, Fyb: 480, Fub: 600, AlphaV: 0.5}, nil
	case "8.8":
		return BoltClass{Name: n, Fyb: 640, Fub: 800, AlphaV: 0.6, Preloadable: true}, nil
	case "10.9":
		return BoltClass{Name: n, Fyb: 900, Fub: 1000, AlphaV: 0.5, Preloadable: true}, nil
	}
	return BoltClass{}, fmt.Errorf("bolt class %q is not known (known: %s)", name, strings.Join(boltClassNames(), ", "))
}
