package splice

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strings"
)

// Bolting assemblies: what a fabricator orders for one bolt group.
//
// SelectAssembly takes the plies a bolt clamps (head side first), the size, class, system and
// washer placement, and returns the grip, the clamp length Σt (plies plus washers), the
// shortest standard length that the product standards and EN 1090-2 8.2.2 allow, the thread
// length of that bolt, whether each shear plane lies on the plain shank or in the thread, and
// the mass of the assembly.
//
// # The rules used (EN 1090-2:2008 8.2.2, paraphrased)
//
//   - Protrusion: after tightening the bolt end stands at least one thread pitch P beyond the
//     outer face of the nut. Checked with the least-material length (nominal length less the
//     lower length tolerance of ISO 4759-1: js15 for ISO 4014/4017 product grade A, js17 for
//     grade B and for EN 14399-3/-4 bolts), the thickest nut (m max) and the thickest washers
//     (h max): Σt,max + m + P ≤ l − tolerance.
//   - Thread reaching into the clamp: between the nut's bearing face and the end of the
//     thread run-out (the first full thread, at lg,max = l − b from the head) at least one full
//     thread stays clear for non-preloaded bolts and four for EN 14399-3 (HR) preloaded bolts:
//     Σt,min ≥ lg,max + n·P, with the thinnest washers (h min).
//   - EN 14399-4 (HV) bolts: EN 1090-2 refers to the clamp lengths of EN 14399-4 Table A.1,
//     which was not available when this was written. The range used here is derived from the
//     EN 14399-4 bolt dimensions by the same two principles: the nut bears on full thread
//     (Σt,min ≥ lg,max, no free thread required: HV assemblies get their ductility from the
//     threads engaged in the nut) and the protrusion is at least P. It is marked "derived".
//   - Fully threaded ISO 4017 bolts have an incomplete thread of at most a = 3P under the
//     head; one full thread must stay clear beyond it.
//
// # Thread in a shear plane
//
// A shear plane at distance z from the head's bearing face lies on the plain shank only if
// z ≤ ls,min, the guaranteed length of full-diameter shank: ls,min = lg,max − 5P for ISO 4014
// and EN 14399-3 bolts, lg,max − 3P for EN 14399-4 bolts (EN 14399-4 Table 1), 0 for ISO 4017
// screws. Everything beyond ls,min — the thread run-out included — counts as thread, as
// EN 1090-2 8.2.2 asks ("the unthreaded shank of full cross-section is shorter than the
// nominal unthreaded length"). The plane position uses the thickest washer under the head.
// Where every plane is on the shank, EN 1993-1-8 Table 3.4 allows A = πd²/4 and αv = 0.6.
//
// # Mass
//
// Computed from the nominal dimensions with steel at 7850 kg/m³ (EN 1991-1-1 Table A.4):
// head and nut as hexagonal prisms (width across flats s, corner chamfers and washer faces
// ignored, so a few per cent high), the plain shank at d, the thread as a cylinder of the
// pitch diameter d2 = d − 0.6495·P (ISO 724 basic profile), the nut bore at d2, washers as
// flat rings of the nominal h, d1 and d2. Good for piece masses and a bill of materials, not
// for weighing.

// AssemblySystem is a family of bolting assemblies: the product standards of bolt, nut and
// washers, and the rules that set the bolt length.
type AssemblySystem string

// The systems SelectAssembly knows.
const (
	// SystemISO4014: non-preloaded; partly threaded hexagon bolt ISO 4014, nut ISO 4032,
	// washers ISO 7089 (the structural non-preloaded assemblies of EN 15048 use these forms).
	SystemISO4014 AssemblySystem = "ISO 4014"
	// SystemISO4017: non-preloaded; fully threaded hexagon screw ISO 4017, nut ISO 4032,
	// washers ISO 7089. Every shear plane is in the thread.
	SystemISO4017 AssemblySystem = "ISO 4017"
	// SystemHR: preloaded, EN 14399-3 (HR, classes 8.8 and 10.9), washers EN 14399-6.
	SystemHR AssemblySystem = "HR"
	// SystemHV: preloaded, EN 14399-4 (HV, class 10.9 only), washers EN 14399-6.
	SystemHV AssemblySystem = "HV"
)

// AssemblySystems lists every system, non-preloaded first (a fresh slice).
func AssemblySystems() []AssemblySystem {
	return []AssemblySystem{SystemISO4014, SystemISO4017, SystemHR, SystemHV}
}

// ParseAssemblySystem reads a system name: "ISO 4014", "ISO 4017", "HR", "HV", or the bolt
// standards "EN 14399-3" and "EN 14399-4" (case and spaces ignored).
func ParseAssemblySystem(s string) (AssemblySystem, error) {
	switch sys := AssemblySystem(s); sys {
	case SystemISO4014, SystemISO4017, SystemHR, SystemHV:
		return sys, nil
	}
	switch strings.ToUpper(strings.ReplaceAll(strings.TrimSpace(s), " ", "")) {
	case "ISO4014":
		return SystemISO4014, nil
	case "ISO4017":
		return SystemISO4017, nil
	case "HR", "EN14399-3":
		return SystemHR, nil
	case "HV", "EN14399-4":
		return SystemHV, nil
	}
	return "", fmt.Errorf("bolting assembly %q is not known (known: ISO 4014, ISO 4017, HR, HV)", s)
}

// Preloaded reports whether the system is one for preloading (EN 14399).
func (s AssemblySystem) Preloaded() bool { return s == SystemHR || s == SystemHV }

// WasherPlacement says where an assembly has washers.
type WasherPlacement string

// Washer placements. The default (the zero value) follows EN 1090-2 8.2.4 as recalled (from
// memory): preloaded class 10.9 (every HV assembly) a washer under the head and under the
// nut; preloaded class 8.8 one under the part that is turned, taken as the nut; non-preloaded
// bolts need none in normal holes, and one under the nut is taken (common practice).
const (
	WashersDefault  WasherPlacement = ""
	WashersNone     WasherPlacement = "none"
	WasherUnderNut  WasherPlacement = "nut"
	WasherUnderHead WasherPlacement = "head"
	WashersBoth     WasherPlacement = "both"
)

// AssemblySpec asks for the assembly of one bolt group.
type AssemblySpec struct {
	Size      string          // "M20"
	Class     string          // "8.8", "10.9"...
	Preloaded bool            // preloaded (categories B, C) or not (category A)
	System    AssemblySystem  // "": HV for preloaded 10.9, HR for preloaded 8.8, ISO 4014 (falling back to ISO 4017 for short grips) otherwise
	Washers   WasherPlacement // "": the EN 1090-2 default, see WashersDefault
	Plies     []float64       // thicknesses of the clamped plies, head side first [mm]
}

// AssemblyData are the product dimensions of one size in one system [mm].
type AssemblyData struct {
	System AssemblySystem
	Size   string  // "M20"
	D      float64 // nominal diameter d
	P      float64 // coarse thread pitch, ISO 261
	HeadK  float64 // head height k, nominal
	HeadS  float64 // head width across flats s
	NutM   float64 // nut height m, maximum
	NutS   float64 // nut width across flats s
	// Washer thickness h (nominal, minimum, maximum) and hole and outside diameters d1, d2.
	WasherH, WasherHMin, WasherHMax, WasherD1, WasherD2 float64
	// Lengths are the standard nominal lengths l, ascending.
	Lengths []float64
	// BoltStandard, NutStandard and WasherStandard name the product standards.
	BoltStandard, NutStandard, WasherStandard string
	// Source names where each dimension comes from, and which were recalled.
	Source string

	rule systemRule
}

// systemRule is how a system's thread length, shank and clamp limits follow from l.
type systemRule struct {
	thread       threadKind
	bFixed       float64 // b for threadFixed
	runOut       float64 // ls,min = lg,max − runOut·P
	clearThreads float64 // full threads clear between lg,max and the nut (EN 1090-2 8.2.2)
	gradeAB      bool    // ISO 4014/4017 product grades A (js15) and B (js17); otherwise js17
}

type threadKind int

const (
	threadISO888 threadKind = iota // b = 2d+6 (l ≤ 125), 2d+12 (125 < l ≤ 200), 2d+25 (l > 200)
	threadFixed                    // b set per size (EN 14399-4)
	threadFull                     // threaded to within a ≤ 3P of the head (ISO 4017)
)

// ThreadLength is the thread length b of a bolt of nominal length l [mm].
func (a *AssemblyData) ThreadLength(l float64) float64 {
	switch a.rule.thread {
	case threadFixed:
		return a.rule.bFixed
	case threadFull:
		return l - 3*a.P
	}
	switch {
	case l <= 125:
		return 2*a.D + 6
	case l <= 200:
		return 2*a.D + 12
	}
	return 2*a.D + 25
}

// ThreadStart is lg,max = l − b, the distance from the head's bearing face to the first full
// thread (the end of the run-out) [mm].
func (a *AssemblyData) ThreadStart(l float64) float64 { return l - a.ThreadLength(l) }

// ShankMin is ls,min, the guaranteed length of full-diameter plain shank from the head's
// bearing face [mm]; a shear plane beyond it is in the thread.
func (a *AssemblyData) ShankMin(l float64) float64 {
	if a.rule.thread == threadFull {
		return 0
	}
	return max(0, a.ThreadStart(l)-a.rule.runOut*a.P)
}

// LengthTolerance is the lower deviation of the nominal length l, ISO 4759-1 (js15 or js17,
// IT values of ISO 286-1) [mm]: ISO 4014/4017 product grade A (d ≤ 24 mm and l ≤ 10d or
// 150 mm, the shorter) js15, grade B js17; EN 14399-3 and EN 14399-4 bolts js17.
func (a *AssemblyData) LengthTolerance(l float64) float64 {
	grade17 := true
	if a.rule.gradeAB && a.D <= 24 && l <= min(10*a.D, 150) {
		grade17 = false
	}
	return itHalf(l, grade17)
}

// itHalf is half the ISO 286-1 standard tolerance IT15 or IT17 for a nominal size [mm]
// (from memory; the IT17 steps from 30 to 120 mm agree with the EN 14399-4 length table).
// Beyond 500 mm, longer than any bolt here, the last step is kept.
func itHalf(l float64, it17 bool) float64 {
	var it15, itB float64 // IT15, IT17 of the nominal size step
	switch {
	case l <= 18:
		it15, itB = 0.70, 1.8
	case l <= 30:
		it15, itB = 0.84, 2.1
	case l <= 50:
		it15, itB = 1.00, 2.5
	case l <= 80:
		it15, itB = 1.20, 3.0
	case l <= 120:
		it15, itB = 1.40, 3.5
	case l <= 180:
		it15, itB = 1.60, 4.0
	case l <= 250:
		it15, itB = 1.85, 4.6
	case l <= 315:
		it15, itB = 2.10, 5.2
	case l <= 400:
		it15, itB = 2.30, 5.7
	default:
		it15, itB = 2.50, 6.3
	}
	if it17 {
		return itB / 2
	}
	return it15 / 2
}

// ClampRange is the range of clamp length Σt (plies plus washers) a bolt of nominal length l
// admits under EN 1090-2 8.2.2 (see the rules above) [mm]: lo = lg,max + n·P (n = 1
// non-preloaded, 4 HR, 0 HV, derived), hi = l − tolerance − m − P.
func (a *AssemblyData) ClampRange(l float64) (lo, hi float64) {
	start := a.ThreadStart(l)
	return start + a.rule.clearThreads*a.P, l - a.LengthTolerance(l) - a.NutM - a.P
}

// ShearPlane is the interface between two neighbouring plies.
type ShearPlane struct {
	Position float64 // from the head's bearing face, with the thickest head washer [mm]
	Threaded bool    // beyond ls,min: the thread or its run-out is in the plane (A = As)
}

// AssemblyPart is one kind of component of an assembly, for a bill of materials.
type AssemblyPart struct {
	Item     string  // "bolt", "nut" or "washer"
	Standard string  // product standard, e.g. "EN 14399-4"
	Count    int     // per assembly
	Mass     float64 // each [kg]
}

// Assembly is the bolting assembly of one bolt group [mm, kg].
type Assembly struct {
	Spec           AssemblySpec // as resolved: system, class and washers filled in
	Data           AssemblyData
	HeadWashers    int     // washers under the head (0 or 1)
	NutWashers     int     // washers under the nut (0 or 1)
	Grip           float64 // Σ plies
	Clamp          float64 // Σt = grip + washers, nominal
	ClampMin       float64 // Σt with the thinnest washers
	ClampMax       float64 // Σt with the thickest washers
	RequiredLength float64 // least actual length: Σt,max + m + P (EN 1090-2 8.2.2)
	Length         float64 // chosen standard nominal length l
	ThreadLength   float64 // b of the chosen bolt
	ThreadStart    float64 // lg,max = l − b
	ShankMin       float64 // ls,min
	AdmitMin       float64 // the chosen length's admissible clamp range, ClampRange(l)
	AdmitMax       float64 //
	Protrusion     float64 // l − Σt − m, nominal
	Planes         []ShearPlane
	// ThreadsInShearPlanes is true when any plane is in the thread. False with no shear
	// plane (a single ply).
	ThreadsInShearPlanes bool
	Parts                []AssemblyPart
	Mass                 float64 // bolt + nut + washers [kg]
	Designation          string  // e.g. "M20×80 HV 10.9 (EN 14399-4), nut EN 14399-4, 2 washers EN 14399-6"
	Note                 string  // why a default system was changed, when it was
}

// ThreadsAt reports whether a shear plane at distance z from the head's bearing face meets
// the thread (z beyond ls,min) [mm].
func (a Assembly) ThreadsAt(z float64) bool { return z > a.ShankMin+1e-9 }

// AssemblyLengthError is returned when no standard length fits a grip.
type AssemblyLengthError struct {
	System   AssemblySystem
	Size     string
	Grip     float64 // Σ plies [mm]
	Clamp    float64 // Σt with the thickest washers [mm]
	TooLong  bool    // the protrusion needs a longer bolt than the series has; false: grip too short for the thread
	Shortest float64 // of the standard lengths [mm]
	Longest  float64 // [mm]
}

func (e *AssemblyLengthError) Error() string {
	head := fmt.Sprintf("%s %s: no standard length (%s–%s mm) fits a grip of %s mm (clamp %s mm with washers)",
		e.Size, e.System, mm(e.Shortest), mm(e.Longest), mm(e.Grip), mm(e.Clamp))
	if e.TooLong {
		return head + ": the longest bolt does not leave one thread pitch beyond the nut"
	}
	hint := ""
	switch e.System {
	case SystemISO4014:
		hint = "; use a fully threaded ISO 4017 bolt"
	case SystemHR:
		hint = "; EN 14399-2 asks for a fully threaded HR bolt here"
	}
	return head + ": the thread does not reach far enough into the clamp (EN 1090-2 8.2.2)" + hint
}

// LookupAssemblyData returns the dimensions of a size ("M20") in a system.
func LookupAssemblyData(system AssemblySystem, size string) (AssemblyData, error) {
	d, err := tableAssemblyData(system, size)
	if err != nil {
		return AssemblyData{}, err
	}
	out := *d
	out.Lengths = slices.Clone(d.Lengths)
	return out, nil
}

// assemblyTable holds the dimensions of every system and size, built once at initialisation
// and, like checkTable, read only: nothing writes to it afterwards, and the searches point
// into it instead of building the dimensions for every position.
var assemblyTable = buildAssemblyTable()

type assemblyKey struct {
	system AssemblySystem
	size   string
}

func buildAssemblyTable() map[assemblyKey]*AssemblyData {
	t := map[assemblyKey]*AssemblyData{}
	for _, sys := range AssemblySystems() {
		for _, size := range boltSizeNames() {
			d, err := assemblyDataOf(sys, size)
			if err != nil {
				panic("splice: assembly dimensions: " + err.Error())
			}
			t[assemblyKey{sys, size}] = &d
		}
	}
	return t
}

// tableAssemblyData is the table's entry of a system and size; it must not be changed.
func tableAssemblyData(system AssemblySystem, size string) (*AssemblyData, error) {
	bs, err := LookupBoltSize(size)
	if err != nil {
		return nil, err
	}
	if d, ok := assemblyTable[assemblyKey{system, bs.Name}]; ok {
		return d, nil
	}
	return nil, fmt.Errorf("bolting assembly %q is not known (known: ISO 4014, ISO 4017, HR, HV)", system)
}

// assemblyDataOf computes the dimensions of a size in a system.
func assemblyDataOf(system AssemblySystem, size string) (AssemblyData, error) {
	bs, err := LookupBoltSize(size)
	if err != nil {
		return AssemblyData{}, err
	}
	row, ok := assemblyRow(bs.Name)
	if !ok {
		return AssemblyData{}, fmt.Errorf("bolt size %s has no assembly dimensions", bs.Name)
	}
	a := AssemblyData{System: system, Size: bs.Name, D: bs.D, P: row.p}
	switch system {
	case SystemISO4014, SystemISO4017:
		a.HeadK, a.HeadS, a.NutM, a.NutS = row.isoK, row.isoS, row.isoNutM, row.isoS
		a.WasherH, a.WasherHMin, a.WasherHMax, a.WasherD1, a.WasherD2 = row.w7089[0], row.w7089[1], row.w7089[2], row.w7089[3], row.w7089[4]
		a.NutStandard, a.WasherStandard = "ISO 4032", "ISO 7089"
		if system == SystemISO4014 {
			a.BoltStandard = "ISO 4014"
			a.Lengths = isoSeries(row.l4014[0], row.l4014[1])
			a.rule = systemRule{thread: threadISO888, runOut: 5, clearThreads: 1, gradeAB: true}
			a.Source = "ISO 4014 k, s and lengths, ISO 4032 nut, ISO 7089 washers " + row.srcISO +
				"; b = 2d+6/2d+12/2d+25 (ISO 888, as EN 14399-3 Table 2); ls,min = lg,max − 5P (from memory; EN 1090-2 8.2.2 note: up to 12 mm for M20)"
		} else {
			a.BoltStandard = "ISO 4017"
			a.Lengths = isoSeries(row.l4017[0], row.l4017[1])
			a.rule = systemRule{thread: threadFull, clearThreads: 1, gradeAB: true}
			a.Source = "ISO 4017 k, s and lengths, ISO 4032 nut, ISO 7089 washers " + row.srcISO +
				"; incomplete thread under the head a ≤ 3P (EN 15048 screw table as published)" + row.src4017
		}
	case SystemHR:
		a.HeadK, a.HeadS, a.NutM, a.NutS = row.isoK, row.heavyS, row.isoNutM, row.heavyS
		a.WasherH, a.WasherHMin, a.WasherHMax, a.WasherD1, a.WasherD2 = row.w14399[0], row.w14399[1], row.w14399[2], row.w14399[3], row.w14399[4]
		a.BoltStandard, a.NutStandard, a.WasherStandard = "EN 14399-3", "EN 14399-3", "EN 14399-6"
		a.Lengths = hrSeries(row.lHR[0], row.lHR[1])
		a.rule = systemRule{thread: threadISO888, runOut: 5, clearThreads: 4}
		a.Source = "EN 14399-3 Table 2 (b, k, s) and EN 14399-6 washers as published; nut height m of ISO 4032 style 1 (EN 14399-3/-7 regular nut); " +
			"nut width s, ls,min = lg,max − 5P and the length series from memory"
	case SystemHV:
		a.HeadK, a.HeadS, a.NutM, a.NutS = row.hvK, row.heavyS, row.hvNutM, row.heavyS
		a.WasherH, a.WasherHMin, a.WasherHMax, a.WasherD1, a.WasherD2 = row.w14399[0], row.w14399[1], row.w14399[2], row.w14399[3], row.w14399[4]
		a.BoltStandard, a.NutStandard, a.WasherStandard = "EN 14399-4", "EN 14399-4", "EN 14399-6"
		a.Lengths = stepSeries(row.lHV[0], row.lHV[1], 5)
		a.rule = systemRule{thread: threadFixed, bFixed: row.hvB, runOut: 3}
		a.Source = "EN 14399-4 Table 1 (b, k, s, ls,min = lg,max − 3P, lengths in 5 mm steps, js17) and EN 14399-6 washers as published; " +
			"nut height m, the M36 shortest and every longest length from memory; clamp range derived (EN 14399-4 Table A.1 not checked)"
	default:
		return AssemblyData{}, fmt.Errorf("bolting assembly %q is not known (known: ISO 4014, ISO 4017, HR, HV)", system)
	}
	return a, nil
}

// assemblyDims is one size's dimensions across the systems [mm].
type assemblyDims struct {
	p                float64
	isoK, isoS       float64    // ISO 4014/4017 head height and width across flats (= ISO 4032 nut s)
	isoNutM          float64    // ISO 4032 m max (also the EN 14399-3 HR nut)
	heavyS           float64    // EN 14399-3/-4 head and nut width across flats
	hvK, hvB, hvNutM float64    // EN 14399-4 head height, thread length, nut height
	w7089, w14399    [5]float64 // h, h min, h max, d1, d2
	l4014, l4017     [2]float64 // shortest and longest length
	lHR, lHV         [2]float64
	srcISO, src4017  string
}

// assemblyRow holds the published and recalled dimensions; testdata/assembly-*.csv give the
// source of every value.
func assemblyRow(size string) (assemblyDims, bool) {
	const pub = "(public tables reproducing the standards)"
	switch size {
	case "M12":
		return assemblyDims{p: 1.75, isoK: 7.5, isoS: 18, isoNutM: 10.8, heavyS: 22, hvK: 8, hvB: 23, hvNutM: 10,
			w7089: [5]float64{2.5, 2.3, 2.7, 13, 24}, w14399: [5]float64{3, 2.7, 3.3, 13, 24},
			l4014: [2]float64{50, 120}, l4017: [2]float64{25, 120}, lHR: [2]float64{30, 120}, lHV: [2]float64{35, 95}, srcISO: pub}, true
	case "M16":
		return assemblyDims{p: 2, isoK: 10, isoS: 24, isoNutM: 14.8, heavyS: 27, hvK: 10, hvB: 28, hvNutM: 13,
			w7089: [5]float64{3, 2.7, 3.3, 17, 30}, w14399: [5]float64{4, 3.7, 4.3, 17, 30},
			l4014: [2]float64{65, 160}, l4017: [2]float64{30, 150}, lHR: [2]float64{35, 200}, lHV: [2]float64{40, 130}, srcISO: pub}, true
	case "M20":
		return assemblyDims{p: 2.5, isoK: 12.5, isoS: 30, isoNutM: 18, heavyS: 32, hvK: 13, hvB: 33, hvNutM: 16,
			w7089: [5]float64{3, 2.7, 3.3, 21, 37}, w14399: [5]float64{4, 3.7, 4.3, 21, 37},
			l4014: [2]float64{80, 200}, l4017: [2]float64{40, 160}, lHR: [2]float64{40, 300}, lHV: [2]float64{45, 200}, srcISO: pub}, true
	case "M22":
		return assemblyDims{p: 2.5, isoK: 14, isoS: 34, isoNutM: 19.4, heavyS: 36, hvK: 14, hvB: 34, hvNutM: 18,
			w7089: [5]float64{3, 2.7, 3.3, 23, 39}, w14399: [5]float64{4, 3.7, 4.3, 23, 39},
			l4014: [2]float64{90, 220}, l4017: [2]float64{45, 200}, lHR: [2]float64{45, 300}, lHV: [2]float64{50, 200}, srcISO: pub + "; ISO 7089 M22 from memory"}, true
	case "M24":
		return assemblyDims{p: 3, isoK: 15, isoS: 36, isoNutM: 21.5, heavyS: 41, hvK: 15, hvB: 39, hvNutM: 20,
			w7089: [5]float64{4, 3.7, 4.3, 25, 44}, w14399: [5]float64{4, 3.7, 4.3, 25, 44},
			l4014: [2]float64{90, 240}, l4017: [2]float64{50, 180}, lHR: [2]float64{50, 300}, lHV: [2]float64{60, 200}, srcISO: pub}, true
	case "M27":
		return assemblyDims{p: 3, isoK: 17, isoS: 41, isoNutM: 23.8, heavyS: 46, hvK: 17, hvB: 41, hvNutM: 22,
			w7089: [5]float64{4, 3.7, 4.3, 28, 50}, w14399: [5]float64{5, 4.4, 5.6, 28, 50},
			l4014: [2]float64{100, 260}, l4017: [2]float64{55, 200}, lHR: [2]float64{60, 300}, lHV: [2]float64{70, 200}, srcISO: pub + "; ISO 7089 M27 from memory",
			src4017: "; ISO 4017 M27 lengths from memory"}, true
	case "M30":
		return assemblyDims{p: 3.5, isoK: 18.7, isoS: 46, isoNutM: 25.6, heavyS: 50, hvK: 19, hvB: 44, hvNutM: 24,
			w7089: [5]float64{4, 3.7, 4.3, 31, 56}, w14399: [5]float64{5, 4.4, 5.6, 31, 56},
			l4014: [2]float64{110, 300}, l4017: [2]float64{60, 200}, lHR: [2]float64{70, 300}, lHV: [2]float64{75, 200}, srcISO: pub}, true
	case "M36":
		return assemblyDims{p: 4, isoK: 22.5, isoS: 55, isoNutM: 31, heavyS: 60, hvK: 23, hvB: 52, hvNutM: 29,
			w7089: [5]float64{5, 4.4, 5.6, 37, 66}, w14399: [5]float64{6, 5.4, 6.6, 37, 66},
			l4014: [2]float64{140, 360}, l4017: [2]float64{70, 200}, lHR: [2]float64{80, 300}, lHV: [2]float64{85, 200}, srcISO: pub}, true
	}
	return assemblyDims{}, false
}

// isoSeries is the ISO 4014/4017 length series (5 mm steps to 70, 10 mm to 160, 20 mm to
// 500) from lo to hi.
func isoSeries(lo, hi float64) []float64 {
	out := make([]float64, 0, 40)
	for l := 20.0; l <= min(hi, 500); {
		if l >= lo {
			out = append(out, l)
		}
		switch {
		case l < 70:
			l += 5
		case l < 160:
			l += 10
		default:
			l += 20
		}
	}
	return out
}

// hrSeries is the HR length series as recalled (5 mm steps to 80, 10 mm to 200, 20 mm
// beyond), from lo to hi.
func hrSeries(lo, hi float64) []float64 {
	out := make([]float64, 0, 40)
	for l := 30.0; l <= hi; {
		if l >= lo {
			out = append(out, l)
		}
		switch {
		case l < 80:
			l += 5
		case l < 200:
			l += 10
		default:
			l += 20
		}
	}
	return out
}

func stepSeries(lo, hi, step float64) []float64 {
	out := make([]float64, 0, int((hi-lo)/step)+1)
	for l := lo; l <= hi+1e-9; l += step {
		out = append(out, l)
	}
	return out
}

// SelectAssembly chooses the bolting assembly of one bolt group: the shortest standard length
// whose admissible clamp range (AssemblyData.ClampRange) holds the clamp with the thinnest and
// the thickest washers, the thread position at each ply interface, and the mass. A grip no
// standard length covers is an *AssemblyLengthError naming the size and the grip; with
// System "" and not preloaded, a grip too short for ISO 4014 takes an ISO 4017 bolt instead
// (and says so in Note).
func SelectAssembly(spec AssemblySpec) (Assembly, error) {
	r, err := resolveAssemblySpec(spec)
	if err != nil {
		return Assembly{}, err
	}
	c, err := newAssemblyChooser(r)
	if err != nil {
		return Assembly{}, err
	}
	return c.assembly(r.Plies)
}

// assemblyChooser selects lengths for one resolved size, class, system and washer placement,
// for any plies: the product data are looked up once.
type assemblyChooser struct {
	spec   resolvedSpec
	data   *AssemblyData // in assemblyTable, as full
	full   *AssemblyData // ISO 4017, for a grip too short for a defaulted ISO 4014 bolt
	nh, nn int           // washers under the head and under the nut
}

func newAssemblyChooser(r resolvedSpec) (assemblyChooser, error) {
	c := assemblyChooser{spec: r}
	var err error
	if c.data, err = tableAssemblyData(r.System, r.Size); err != nil {
		return c, err
	}
	if r.System == SystemISO4014 && r.autoSystem {
		if c.full, err = tableAssemblyData(SystemISO4017, r.Size); err != nil {
			return c, err
		}
	}
	c.nh, c.nn = washerCounts(r.Washers)
	return c, nil
}

// lengthFit is the outcome of the length selection for one grip.
type lengthFit struct {
	data               *AssemblyData // the system chosen (the ISO 4017 fall-back included)
	grip               float64       // Σ plies
	clamp, cMin, cMax  float64       // Σt with nominal, thinnest and thickest washers
	length             float64       // chosen nominal length; when !ok, the one the check reports
	lo, hi             float64       // its admissible clamp range, ClampRange(length)
	ok, tooLong, isAlt bool          // isAlt: the ISO 4017 fall-back was taken
}

// fit chooses the length for a grip (Σ plies) in the chooser's system, or in ISO 4017 where
// SelectAssembly falls back to it. When no length fits, length is the one a reader is shown:
// the longest of the series when the protrusion needs more, otherwise the shortest whose
// protrusion suffices (its thread does not reach the clamp) — of the fully threaded form
// where the partly threaded one falls back to it.
func (c *assemblyChooser) fit(grip float64) lengthFit {
	f := c.fitIn(c.data, grip)
	if !f.ok && !f.tooLong && c.full != nil {
		g := c.fitIn(c.full, grip)
		g.isAlt = true
		if g.ok || !g.tooLong {
			return g
		}
	}
	return f
}

func (c *assemblyChooser) fitIn(data *AssemblyData, grip float64) lengthFit {
	n := float64(c.nh + c.nn)
	f := lengthFit{data: data, grip: grip, clamp: grip + n*data.WasherH, cMin: grip + n*data.WasherHMin, cMax: grip + n*data.WasherHMax}
	const eps = 1e-9
	protrusionOK := false
	// hi grows with l along every series (TestAssemblyClampRangeGrows), so the lengths too short
	// for the protrusion are skipped at once
	first, _ := slices.BinarySearchFunc(data.Lengths, f.cMax, func(l, cMax float64) int {
		if _, hi := data.ClampRange(l); cMax > hi+eps {
			return -1
		}
		return 1
	})
	for _, l := range data.Lengths[first:] {
		lo, hi := data.ClampRange(l)
		if f.cMax > hi+eps {
			continue
		}
		if !protrusionOK {
			protrusionOK = true
			f.length, f.lo, f.hi = l, lo, hi // reported if none fits
		}
		if f.cMin >= lo-eps {
			f.length, f.lo, f.hi, f.ok = l, lo, hi, true
			return f
		}
	}
	if !protrusionOK {
		l := data.Lengths[len(data.Lengths)-1]
		f.length, f.tooLong = l, true
		f.lo, f.hi = data.ClampRange(l)
	}
	return f
}

// requiredLength is Σt,max + m + P, the least actual length the protrusion rule needs [mm].
func (f *lengthFit) requiredLength() float64 { return f.cMax + f.data.NutM + f.data.P }

// lengthError is the *AssemblyLengthError of a fit that failed.
func (f *lengthFit) lengthError() error {
	d := f.data
	return &AssemblyLengthError{System: d.System, Size: d.Size, Grip: f.grip, Clamp: f.cMax,
		TooLong: f.tooLong, Shortest: d.Lengths[0], Longest: d.Lengths[len(d.Lengths)-1]}
}

// assembly selects the assembly for the plies (head side first).
func (c *assemblyChooser) assembly(plies []float64) (Assembly, error) {
	grip := 0.0
	for _, t := range plies {
		grip += t
	}
	f := c.fit(grip)
	if !f.ok {
		return Assembly{}, f.lengthError()
	}
	a := c.build(&f, plies)
	if f.isAlt {
		a.Note = "grip too short for a partly threaded ISO 4014 bolt of the series: fully threaded ISO 4017 used"
	}
	return a, nil
}

// resolvedSpec is a validated spec; autoSystem records that the system was defaulted.
type resolvedSpec struct {
	AssemblySpec
	autoSystem bool
}

func resolveAssemblySpec(spec AssemblySpec) (resolvedSpec, error) {
	r, err := resolveBoltSystem(spec)
	errs := []error{err}
	r.Plies = append([]float64(nil), spec.Plies...)
	if len(spec.Plies) == 0 {
		errs = append(errs, errors.New("plies: at least one ply thickness is needed"))
	}
	for i, t := range spec.Plies {
		if !(t > 0) || math.IsInf(t, 0) {
			errs = append(errs, fmt.Errorf("plies[%d]: %g mm must be more than 0", i, t))
		}
	}
	return r, errors.Join(errs...)
}

// resolveBoltSystem validates and completes everything of a spec but its plies: size, class,
// system and washers.
func resolveBoltSystem(spec AssemblySpec) (resolvedSpec, error) {
	var errs []error
	r := resolvedSpec{AssemblySpec: spec}
	r.Plies = nil
	bs, err := LookupBoltSize(spec.Size)
	if err != nil {
		errs = append(errs, fmt.Errorf("size: %w", err))
	} else {
		r.Size = bs.Name
	}
	class, classErr := LookupBoltClass(spec.Class)
	if classErr != nil {
		errs = append(errs, fmt.Errorf("class: %w", classErr))
	} else {
		r.Class = class.Name
	}
	if classErr == nil {
		if r.System == "" {
			r.autoSystem = true
			switch {
			case !spec.Preloaded:
				r.System = SystemISO4014
			case class.Name == "10.9":
				r.System = SystemHV
			default:
				r.System = SystemHR
			}
		}
		sys, perr := ParseAssemblySystem(string(r.System))
		if perr != nil {
			errs = append(errs, fmt.Errorf("system: %w", perr))
		} else {
			r.System = sys
			if verr := checkSystemClass(r.System, spec.Preloaded, class); verr != nil {
				errs = append(errs, verr)
			}
		}
	}
	switch spec.Washers {
	case WashersDefault:
		r.Washers = defaultWashers(r.System, class)
	case WashersNone, WasherUnderNut, WasherUnderHead, WashersBoth:
	default:
		errs = append(errs, fmt.Errorf("washers: %q is not known (none, nut, head, both)", spec.Washers))
	}
	return r, errors.Join(errs...)
}

// checkSystemClass enforces the classes each system is made in: HV 10.9 only (EN 14399-4),
// HR 8.8 or 10.9 (EN 14399-3), and preloaded systems only for preloaded designs.
func checkSystemClass(s AssemblySystem, preloaded bool, c BoltClass) error {
	switch {
	case preloaded && !s.Preloaded():
		return fmt.Errorf("system: %s assemblies are not for preloading; use HR or HV", s)
	case !preloaded && s.Preloaded():
		return fmt.Errorf("system: %s is a preloaded system, but the bolts are not preloaded", s)
	case s == SystemHV && c.Name != "10.9":
		return fmt.Errorf("class: HV assemblies (EN 14399-4) are made in class 10.9 only, not %s", c.Name)
	case s == SystemHR && !c.Preloadable:
		return fmt.Errorf("class: HR assemblies (EN 14399-3) are made in classes 8.8 and 10.9, not %s", c.Name)
	}
	return nil
}

func defaultWashers(s AssemblySystem, c BoltClass) WasherPlacement {
	switch {
	case s == SystemHV, s == SystemHR && c.Name == "10.9":
		return WashersBoth
	}
	return WasherUnderNut
}

func washerCounts(w WasherPlacement) (head, nut int) {
	switch w {
	case WasherUnderNut:
		return 0, 1
	case WasherUnderHead:
		return 1, 0
	case WashersBoth:
		return 1, 1
	}
	return 0, 0
}

// build completes the assembly of a fit that succeeded.
func (c *assemblyChooser) build(f *lengthFit, plies []float64) Assembly {
	data := *f.data
	data.Lengths = slices.Clone(data.Lengths)
	nh, nn := c.nh, c.nn
	spec := c.spec.AssemblySpec
	spec.System = data.System
	a := Assembly{
		Spec: spec, Data: data, HeadWashers: nh, NutWashers: nn, Grip: f.grip,
		Clamp: f.clamp, ClampMin: f.cMin, ClampMax: f.cMax, RequiredLength: f.requiredLength(),
		Length: f.length, AdmitMin: f.lo, AdmitMax: f.hi,
	}
	l := a.Length
	a.ThreadLength = min(data.ThreadLength(l), l)
	a.ThreadStart = data.ThreadStart(l)
	a.ShankMin = data.ShankMin(l)
	a.Protrusion = l - a.Clamp - data.NutM
	z := float64(nh) * data.WasherHMax
	for _, t := range plies[:len(plies)-1] {
		z += t
		p := ShearPlane{Position: z, Threaded: a.ThreadsAt(z)}
		a.Planes = append(a.Planes, p)
		a.ThreadsInShearPlanes = a.ThreadsInShearPlanes || p.Threaded
	}
	bolt, nut, washer := assemblyMasses(&data, l)
	a.Parts = []AssemblyPart{{Item: "bolt", Standard: data.BoltStandard, Count: 1, Mass: bolt},
		{Item: "nut", Standard: data.NutStandard, Count: 1, Mass: nut}}
	if nh+nn > 0 {
		a.Parts = append(a.Parts, AssemblyPart{Item: "washer", Standard: data.WasherStandard, Count: nh + nn, Mass: washer})
	}
	a.Mass = bolt + nut + float64(nh+nn)*washer
	a.Designation = designation(a)
	return a
}

func designation(a Assembly) string {
	d := a.Data
	var b strings.Builder
	b.WriteString(boltDesignation(a))
	fmt.Fprintf(&b, ", nut %s", d.NutStandard)
	switch w := a.HeadWashers + a.NutWashers; w {
	case 0:
		b.WriteString(", no washers")
	case 1:
		fmt.Fprintf(&b, ", 1 washer %s", d.WasherStandard)
	default:
		fmt.Fprintf(&b, ", %d washers %s", w, d.WasherStandard)
	}
	return b.String()
}

// boltDesignation names the bolt of an assembly: "M20×80 HV 10.9 (EN 14399-4)", "M20×60 ISO 4017 8.8".
func boltDesignation(a Assembly) string {
	d := a.Data
	if d.System.Preloaded() {
		return fmt.Sprintf("%s×%s %s %s (%s)", d.Size, mm(a.Length), d.System, a.Spec.Class, d.BoltStandard)
	}
	return fmt.Sprintf("%s×%s %s %s", d.Size, mm(a.Length), d.BoltStandard, a.Spec.Class)
}

// assemblyMasses are the masses of one bolt of length l, one nut and one washer [kg] (see the
// simplifications at the top of this file).
func assemblyMasses(d *AssemblyData, l float64) (bolt, nut, washer float64) {
	hex := func(s float64) float64 { return math.Sqrt(3) / 2 * s * s }
	circle := func(dia float64) float64 { return math.Pi * dia * dia / 4 }
	d2 := d.D - 0.649519*d.P
	b := min(d.ThreadLength(l), l)
	if d.rule.thread == threadFull {
		b = l
	}
	vBolt := hex(d.HeadS)*d.HeadK + circle(d.D)*(l-b) + circle(d2)*b
	vNut := (hex(d.NutS) - circle(d2)) * d.NutM
	vWasher := (circle(d.WasherD2) - circle(d.WasherD1)) * d.WasherH
	return vBolt * steelDensity, vNut * steelDensity, vWasher * steelDensity
}
