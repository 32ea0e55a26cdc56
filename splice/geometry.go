package splice

import (
	"errors"
	"fmt"
	"math"
)

// Geometry is a complete bolted cover-plate splice, in the terms of the splice file
// (DESIGN.md section 8) [mm]. Both flange splices are the same; both sides of the joint are
// the same.
type Geometry struct {
	Bolt          Bolt
	Category      Category
	FrictionClass FrictionClass // used by categories B and C
	Holes         HoleType      // "" means normal
	Gap           float64       // between the beam ends [mm]
	Flange        FlangeSplice
	Web           WebSplice
}

// Bolt is the one bolt size and class used throughout a splice, with its assemblies.
type Bolt struct {
	Size  string // "M20"
	Class string // "8.8"
	// ShearPlanes says where the shear checks take the shear planes: from each group's bolt
	// length (PlanesFromLength, the zero value), or the thread, or the shank, in every plane.
	ShearPlanes ShearPlaneRule
	// System is the assembly system (SelectAssembly); "" takes the default of the category
	// and class: HV for preloaded 10.9, HR for preloaded 8.8, ISO 4014 (ISO 4017 for short
	// grips) otherwise.
	System AssemblySystem
}

// Plate is a cover plate's cross-section [mm].
type Plate struct {
	Thickness, Width float64
}

// FlangeSplice is the splice of one flange [mm].
type FlangeSplice struct {
	Outer   Plate
	Inner   Plate // Thickness 0: no inner plates; otherwise one each side of the web
	Columns int   // bolt lines across the flange: 2 or 4
	Rows    int   // bolt rows on each side of the joint
	Gauge   float64
	Pitch   float64 // along the beam
	End     float64 // bolt to plate end and to beam end
	Edge    float64 // bolt line to the outer plate's long edge; 0: derived (2 columns only)
	Packing float64 // packing thickness between flange and plate, 0 when none (3.6.1(12))
}

// HasInner reports whether the flange has inner plates.
func (f FlangeSplice) HasInner() bool { return f.Inner.Thickness > 0 }

// WebSplice is the web splice: a pair of cover plates [mm].
type WebSplice struct {
	Thickness float64 // each of the two plates
	Depth     float64
	Columns   int     // bolt columns on each side of the joint
	Rows      int     // bolt rows
	Pitch     float64 // vertical, between rows
	Spacing   float64 // horizontal, between columns
	End       float64 // bolt to plate end and to beam end
	Edge      float64 // bolt to the plate's top and bottom edges; 0: derived from the depth
	Packing   float64 // packing thickness, 0 when none (3.6.1(12))
}

// flangeLayout is a flange splice with every position resolved [mm, N/mm²].
type flangeLayout struct {
	inner      bool
	to, bo     float64 // outer plate thickness and width
	ti, bi     float64 // inner plate thickness and width (each)
	cols, rows int
	g, p2o     float64 // gauge across the web; spacing between inner and outer lines (4 columns)
	e1, p1, e2 float64
	packing    float64
	length     float64   // plate length along the beam
	fyo, fuo   float64   // outer plate strengths
	fyi, fui   float64   // inner plate strengths
	key        [5]int    // position in the design space (sizing only)
	fit        *groupFit // the bolts' assembly for these plies (set by whoever builds the layout)
}

// webLayout is a web splice with every position resolved [mm, N/mm²].
type webLayout struct {
	tp, hp     float64
	cols, rows int
	ph, pv     float64 // horizontal spacing, vertical pitch
	eh, ev     float64 // end distance, edge distance (top and bottom)
	packing    float64
	length     float64
	fy, fu     float64
	key        [3]int
	fit        *groupFit // the bolts' assembly for these plies
}

// lines returns the bolt line positions across the flange, from the web centreline, ascending.
func (f *flangeLayout) lines() (y [4]float64, n int) {
	if f.cols == 4 {
		return [4]float64{-f.g/2 - f.p2o, -f.g / 2, f.g / 2, f.g/2 + f.p2o}, 4
	}
	return [4]float64{-f.g / 2, f.g / 2}, 2
}

// innerEdge is the distance of the inner plates' inner edges from the web centreline: the
// inner plates are set with their outer edges in line with the outer plate's edges.
func (f *flangeLayout) innerEdge() float64 { return f.bo/2 - f.bi }

func flangeLength(gap, e1, p1 float64, rows int) float64 {
	return gap + 2*(2*e1+float64(rows-1)*p1)
}

func webLength(gap, eh, ph float64, cols int) float64 {
	return gap + 2*(2*eh+float64(cols-1)*ph)
}

// FieldError is a value a fixed splice cannot have, named by its splice-file key
// ("flange.edge", "web.depth"; "flange" or "web" for a problem of the group as a whole).
type FieldError struct {
	Field string
	Err   error
}

func (e *FieldError) Error() string { return e.Field + ": " + e.Err.Error() }
func (e *FieldError) Unwrap() error { return e.Err }

// CheckGeometry reports the values of a fixed splice that it cannot have, whatever the steel
// and the forces: sizes that are missing or not positive, counts out of range, an edge
// distance that disagrees with the width and gauge or with the depth, rows and pitch (beyond
// 0.5 mm), bolt lines outside a plate. Each problem is a *FieldError; the error joins them
// (errors.Join), nil when there is none. Verify makes the same checks first.
func CheckGeometry(g Geometry) error {
	_, _, err := g.shape()
	return err
}

// sameLength is the tolerance on redundant splice-file dimensions [mm].
const sameLength = 0.5

// resolve checks a fixed geometry for values a splice cannot have and resolves its positions.
// Values that give a poor but drawable splice (an edge distance below the Table 3.3 minimum)
// are not errors: the detailing checks report them.
func (g Geometry) resolve(steel Steel) (flangeLayout, webLayout, error) {
	fl, wl, err := g.shape()
	if err != nil {
		return fl, wl, err
	}
	var errs []error
	if fl.fyo, fl.fuo, err = steel.strength(fl.to); err != nil {
		errs = append(errs, &FieldError{Field: "flange.outer.thickness", Err: err})
	}
	if fl.inner {
		if fl.fyi, fl.fui, err = steel.strength(fl.ti); err != nil {
			errs = append(errs, &FieldError{Field: "flange.inner.thickness", Err: err})
		}
	}
	if wl.fy, wl.fu, err = steel.strength(wl.tp); err != nil {
		errs = append(errs, &FieldError{Field: "web.thickness", Err: err})
	}
	return fl, wl, errors.Join(errs...)
}

// shape checks the values a splice cannot have whatever its steel, and lays out its bolts.
func (g Geometry) shape() (flangeLayout, webLayout, error) {
	var errs []error
	add := func(field, format string, a ...any) {
		errs = append(errs, &FieldError{Field: field, Err: fmt.Errorf(format, a...)})
	}
	positive := func(field string, v float64) {
		if !(v > 0) || math.IsInf(v, 0) {
			add(field, "%g mm must be more than 0", v)
		}
	}
	nonNegative := func(field string, v float64) {
		if !(v >= 0) || math.IsInf(v, 0) {
			add(field, "%g mm must not be negative", v)
		}
	}
	nonNegative("gap", g.Gap)
	f := g.Flange
	fl := flangeLayout{inner: f.HasInner(), to: f.Outer.Thickness, bo: f.Outer.Width,
		cols: f.Columns, rows: f.Rows, g: f.Gauge, e1: f.End, p1: f.Pitch, packing: f.Packing}
	positive("flange.outer.thickness", f.Outer.Thickness)
	positive("flange.outer.width", f.Outer.Width)
	if f.Inner.Thickness != 0 || f.Inner.Width != 0 {
		positive("flange.inner.thickness", f.Inner.Thickness)
		positive("flange.inner.width", f.Inner.Width)
		fl.ti, fl.bi = f.Inner.Thickness, f.Inner.Width
	}
	if f.Columns != 2 && f.Columns != 4 {
		add("flange.columns", "%d must be 2 or 4", f.Columns)
	}
	if f.Rows < 1 {
		add("flange.rows", "%d must be at least 1", f.Rows)
	}
	positive("flange.gauge", f.Gauge)
	positive("flange.end", f.End)
	if f.Rows > 1 {
		positive("flange.pitch", f.Pitch)
	}
	nonNegative("flange.packing", f.Packing)
	nonNegative("flange.edge", f.Edge)
	switch f.Columns {
	case 2:
		fl.e2 = (f.Outer.Width - f.Gauge) / 2
		if f.Edge > 0 && math.Abs(f.Edge-fl.e2) > sameLength {
			add("flange.edge", "%g mm does not match (width − gauge)/2 = %g mm; give consistent values or leave edge out", f.Edge, fl.e2)
		}
		if f.Outer.Width > 0 && f.Gauge > 0 && !(fl.e2 > 0) {
			add("flange.gauge", "%g mm puts the bolt lines outside the %g mm plate", f.Gauge, f.Outer.Width)
		}
	case 4:
		fl.e2 = f.Edge
		positive("flange.edge", f.Edge)
		fl.p2o = (f.Outer.Width - 2*f.Edge - f.Gauge) / 2
		if f.Outer.Width > 0 && f.Edge > 0 && f.Gauge > 0 && !(fl.p2o > 0) {
			add("flange", "width %g − 2×edge %g − gauge %g leaves no room for the outer bolt lines", f.Outer.Width, f.Edge, f.Gauge)
		}
	}
	if fl.inner && f.Gauge > 0 && f.Outer.Width > 0 && f.Inner.Width > 0 && !(f.Gauge/2 > fl.innerEdge()) {
		add("flange.inner.width", "%g mm reaches past the bolt line nearest the web (inner plates are set flush with the outer plate's edges)", f.Inner.Width)
	}
	if f.Rows >= 1 && f.End > 0 {
		fl.length = flangeLength(g.Gap, f.End, f.Pitch, f.Rows)
	}

	w := g.Web
	wl := webLayout{tp: w.Thickness, hp: w.Depth, cols: w.Columns, rows: w.Rows, ph: w.Spacing,
		pv: w.Pitch, eh: w.End, packing: w.Packing}
	positive("web.thickness", w.Thickness)
	positive("web.depth", w.Depth)
	if w.Columns < 1 {
		add("web.columns", "%d must be at least 1", w.Columns)
	}
	if w.Rows < 1 {
		add("web.rows", "%d must be at least 1", w.Rows)
	}
	if w.Columns*w.Rows < 2 && w.Columns >= 1 && w.Rows >= 1 {
		add("web", "a single bolt each side cannot carry the eccentricity moment; use at least two")
	}
	if w.Columns > 1 {
		positive("web.spacing", w.Spacing)
	}
	if w.Rows > 1 {
		positive("web.pitch", w.Pitch)
	}
	positive("web.end", w.End)
	nonNegative("web.packing", w.Packing)
	nonNegative("web.edge", w.Edge)
	if w.Rows >= 1 {
		span := float64(w.Rows-1) * w.Pitch
		wl.ev = (w.Depth - span) / 2
		if w.Edge > 0 && math.Abs(w.Edge-wl.ev) > sameLength {
			add("web.edge", "%g mm does not match (depth − (rows − 1)×pitch)/2 = %g mm; give consistent values or leave edge out", w.Edge, wl.ev)
		}
		if w.Depth > 0 && !(wl.ev > 0) {
			add("web.depth", "%g mm is not deeper than the bolt rows, (rows − 1)×pitch = %g mm", w.Depth, span)
		}
	}
	if w.Columns >= 1 && w.End > 0 {
		wl.length = webLength(g.Gap, w.End, w.Spacing, w.Columns)
	}
	return fl, wl, errors.Join(errs...)
}

// geometryOf writes resolved layouts back in splice-file terms.
func geometryOf(b *boltData, cat Category, fc FrictionClass, holes HoleType, gap float64, fl *flangeLayout, wl *webLayout) Geometry {
	g := Geometry{
		Bolt:          Bolt{Size: b.size.Name, Class: b.class.Name, ShearPlanes: b.rule, System: b.system},
		Category:      cat,
		FrictionClass: fc,
		Holes:         holes,
		Gap:           gap,
		Flange: FlangeSplice{
			Outer:   Plate{Thickness: fl.to, Width: fl.bo},
			Columns: fl.cols, Rows: fl.rows, Gauge: fl.g, Pitch: fl.p1, End: fl.e1, Edge: fl.e2,
			Packing: fl.packing,
		},
		Web: WebSplice{
			Thickness: wl.tp, Depth: wl.hp, Columns: wl.cols, Rows: wl.rows, Pitch: wl.pv,
			Spacing: wl.ph, End: wl.eh, Edge: wl.ev, Packing: wl.packing,
		},
	}
	if fl.inner {
		g.Flange.Inner = Plate{Thickness: fl.ti, Width: fl.bi}
	}
	if fl.rows == 1 {
		g.Flange.Pitch = 0
	}
	if wl.cols == 1 {
		g.Web.Spacing = 0
	}
	if wl.rows == 1 {
		g.Web.Pitch = 0
	}
	return g
}
