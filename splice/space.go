package splice

import (
	"cmp"
	"errors"
	"fmt"
	"math"
	"slices"
	"strings"
)

// DesignSpace lists the choices Size searches. An empty list takes the default list
// (DefaultDesignSpace). Lists are sorted and duplicates dropped; ties in cost are broken by
// fewer bolts, then lighter plates, then the first in the sorted lists (smaller bolt, weaker
// class, outer before outer+inner, fewer columns, thinner plates, fewer rows).
type DesignSpace struct {
	Sizes         []string      // bolt sizes, e.g. "M20"
	Classes       []string      // bolt classes, e.g. "8.8"
	Thicknesses   []float64     // plate thicknesses for outer, inner and web plates [mm]
	Arrangements  []Arrangement // flange plates
	FlangeColumns []int         // 2 and/or 4
	FlangeRows    []int         // rows each side of the joint, 1 or more
	WebColumns    []int         // columns each side of the joint, 1 or more
	WebRows       []int         // rows, 2 or more
	// MinSize and MaxSize bound the bolt sizes tried by diameter ("M20"; "" for no bound):
	// Sizes, or the default list, is filtered by FilterBoltSizes.
	MinSize, MaxSize string
}

// DefaultDesignSpace is M16–M30 in 8.8 and 10.9, plates 8–30 mm, both flange arrangements,
// 2 or 4 flange lines with 2–10 rows, 1–3 web columns with 2–10 rows.
func DefaultDesignSpace() DesignSpace {
	return DesignSpace{
		Sizes:         []string{"M16", "M20", "M22", "M24", "M27", "M30"},
		Classes:       []string{"8.8", "10.9"},
		Thicknesses:   []float64{8, 10, 12, 15, 20, 25, 30},
		Arrangements:  []Arrangement{OuterOnly, OuterInner},
		FlangeColumns: []int{2, 4},
		FlangeRows:    []int{2, 3, 4, 5, 6, 7, 8, 9, 10},
		WebColumns:    []int{1, 2, 3},
		WebRows:       []int{2, 3, 4, 5, 6, 7, 8, 9, 10},
	}
}

// space is a design space resolved for one Size call.
type space struct {
	sizes        []BoltSize
	classes      []BoltClass
	th           []float64
	fy, fu       []float64 // plate strengths per thickness
	inner        []bool
	fcols, frows []int
	wcols, wrows []int
}

const maxListLength = 100

// sortedSet returns a sorted copy of v without repeats (one allocation).
func sortedSet[T cmp.Ordered](v []T) []T {
	out := slices.Clone(v)
	slices.Sort(out)
	return slices.Compact(out)
}

// sortedInts returns v sorted, without repeats, each entry checked against lo, hi and allowed.
func sortedInts(field string, v []int, lo, hi int, allowed func(int) bool) ([]int, error) {
	if len(v) > maxListLength {
		return nil, fmt.Errorf("%s: %d entries is more than %d", field, len(v), maxListLength)
	}
	out := sortedSet(v)
	for _, x := range out {
		if x < lo || x > hi || (allowed != nil && !allowed(x)) {
			return nil, fmt.Errorf("%s: %d is not allowed (%d to %d)", field, x, lo, hi)
		}
	}
	return out, nil
}

func (d DesignSpace) resolve(cat Category, steel Steel) (space, error) {
	def := DefaultDesignSpace()
	if len(d.Sizes) == 0 {
		d.Sizes = def.Sizes
	}
	if len(d.Classes) == 0 {
		d.Classes = def.Classes
	}
	if len(d.Thicknesses) == 0 {
		d.Thicknesses = def.Thicknesses
	}
	if len(d.Arrangements) == 0 {
		d.Arrangements = def.Arrangements
	}
	if len(d.FlangeColumns) == 0 {
		d.FlangeColumns = def.FlangeColumns
	}
	if len(d.FlangeRows) == 0 {
		d.FlangeRows = def.FlangeRows
	}
	if len(d.WebColumns) == 0 {
		d.WebColumns = def.WebColumns
	}
	if len(d.WebRows) == 0 {
		d.WebRows = def.WebRows
	}
	var s space
	var errs []error
	if len(d.Sizes) > maxListLength || len(d.Classes) > maxListLength || len(d.Arrangements) > maxListLength {
		return s, fmt.Errorf("bolts: more than %d sizes, classes or arrangements", maxListLength)
	}
	s.sizes = make([]BoltSize, 0, len(d.Sizes))
	for _, n := range d.Sizes {
		b, err := LookupBoltSize(n)
		if err != nil {
			errs = append(errs, fmt.Errorf("bolts.sizes: %w", err))
			continue
		}
		s.sizes = append(s.sizes, b)
	}
	// in order of diameter (one size per diameter), without repeats
	slices.SortStableFunc(s.sizes, func(a, b BoltSize) int { return cmp.Compare(a.D, b.D) })
	s.sizes = slices.CompactFunc(s.sizes, func(a, b BoltSize) bool { return a.Name == b.Name })
	if d.MinSize != "" || d.MaxSize != "" {
		if lo, hi, err := sizeBounds(d.MinSize, d.MaxSize); err != nil {
			errs = append(errs, err)
		} else if s.sizes = withinBounds(s.sizes, lo, hi); len(s.sizes) == 0 && len(errs) == 0 {
			errs = append(errs, fmt.Errorf("bolts: no size of %s lies %s", strings.Join(d.Sizes, ", "), boundsText(d.MinSize, d.MaxSize)))
		}
	}
	s.classes = make([]BoltClass, 0, len(d.Classes))
	for _, n := range d.Classes {
		c, err := LookupBoltClass(n)
		if err != nil {
			errs = append(errs, fmt.Errorf("bolts.classes: %w", err))
			continue
		}
		if cat.Preloaded() && !c.Preloadable {
			errs = append(errs, fmt.Errorf("bolts.classes: class %s cannot be preloaded; category %s needs 8.8 or 10.9 (EN 1993-1-8 3.1.2(1))", c.Name, cat))
			continue
		}
		s.classes = append(s.classes, c)
	}
	// in order of fub, then fyb (one class for each pair), without repeats
	slices.SortStableFunc(s.classes, func(a, b BoltClass) int {
		return cmp.Or(cmp.Compare(a.Fub, b.Fub), cmp.Compare(a.Fyb, b.Fyb))
	})
	s.classes = slices.CompactFunc(s.classes, func(a, b BoltClass) bool { return a.Name == b.Name })
	if len(d.Thicknesses) > maxListLength {
		errs = append(errs, fmt.Errorf("plates.thicknesses: %d entries is more than %d", len(d.Thicknesses), maxListLength))
	} else {
		th := sortedSet(d.Thicknesses)
		s.th, s.fy, s.fu = make([]float64, 0, len(th)), make([]float64, 0, len(th)), make([]float64, 0, len(th))
		for _, t := range th {
			if !(t > 0 && t <= 200) {
				errs = append(errs, fmt.Errorf("plates.thicknesses: %g mm is not a plate thickness (0 to 200 mm)", t))
				continue
			}
			fy, fu, err := steel.strength(t)
			if err != nil {
				errs = append(errs, fmt.Errorf("plates.thicknesses: %w", err))
				continue
			}
			s.th, s.fy, s.fu = append(s.th, t), append(s.fy, fy), append(s.fu, fu)
		}
	}
	var haveOuter, haveInner bool
	for _, a := range d.Arrangements {
		switch a {
		case OuterOnly:
			haveOuter = true
		case OuterInner:
			haveInner = true
		default:
			errs = append(errs, fmt.Errorf("flange_plates: %q is not one of outer, outer+inner", a))
		}
	}
	if haveOuter {
		s.inner = append(s.inner, false)
	}
	if haveInner {
		s.inner = append(s.inner, true)
	}
	var err error
	if s.fcols, err = sortedInts("flange.columns", d.FlangeColumns, 2, 4, func(c int) bool { return c == 2 || c == 4 }); err != nil {
		errs = append(errs, err)
	}
	if s.frows, err = sortedInts("flange.rows", d.FlangeRows, 1, 50, nil); err != nil {
		errs = append(errs, err)
	}
	if s.wcols, err = sortedInts("web.columns", d.WebColumns, 1, 10, nil); err != nil {
		errs = append(errs, err)
	}
	if s.wrows, err = sortedInts("web.rows", d.WebRows, 2, 50, nil); err != nil {
		errs = append(errs, err)
	}
	return s, errors.Join(errs...)
}

// FilterBoltSizes returns the sizes of a list ("M20") whose diameter lies between the sizes lo
// and hi, both included ("" for no bound), in the list's order. An unknown size in the list or
// as a bound, or lo larger than hi, is an error; the result may be empty.
func FilterBoltSizes(sizes []string, lo, hi string) ([]string, error) {
	dlo, dhi, err := sizeBounds(lo, hi)
	if err != nil {
		return nil, err
	}
	out := make([]string, 0, len(sizes))
	for _, n := range sizes {
		b, err := LookupBoltSize(n)
		if err != nil {
			return nil, err
		}
		if len(withinBounds([]BoltSize{b}, dlo, dhi)) == 1 {
			out = append(out, n)
		}
	}
	return out, nil
}

// sizeBounds reads the bounds of a bolt-size filter as diameters [mm].
func sizeBounds(lo, hi string) (dlo, dhi float64, err error) {
	dlo, dhi = 0, math.Inf(1)
	var errs []error
	if lo != "" {
		b, err := LookupBoltSize(lo)
		if err != nil {
			errs = append(errs, fmt.Errorf("bolts.min_size: %w", err))
		}
		dlo = b.D
	}
	if hi != "" {
		b, err := LookupBoltSize(hi)
		if err != nil {
			errs = append(errs, fmt.Errorf("bolts.max_size: %w", err))
		}
		dhi = b.D
	}
	if len(errs) == 0 && dlo > dhi {
		errs = append(errs, fmt.Errorf("bolts.min_size: %s is larger than max_size %s", lo, hi))
	}
	return dlo, dhi, errors.Join(errs...)
}

// withinBounds keeps the sizes of diameter dlo to dhi, in order.
func withinBounds(sizes []BoltSize, dlo, dhi float64) []BoltSize {
	return slices.DeleteFunc(slices.Clone(sizes), func(b BoltSize) bool { return b.D < dlo || b.D > dhi })
}

// boundsText says what the bounds of a bolt-size filter are, for messages.
func boundsText(lo, hi string) string {
	switch {
	case lo != "" && hi != "":
		return "from " + lo + " to " + hi
	case lo != "":
		return "at " + lo + " or larger"
	}
	return "at " + hi + " or smaller"
}
