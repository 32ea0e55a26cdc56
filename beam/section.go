package beam

import (
	"errors"
	"fmt"
	"math"
	"strconv"
)

// Steel material constants, EN 1993-1-1 3.2.6 [N/mm², kg/m³].
const (
	YoungModulus = 210000.0 // E [N/mm²]
	ShearModulus = 81000.0  // G [N/mm²]
	SteelDensity = 7850.0   // ρ [kg/m³], EN 1991-1-1 Table A.4
)

// ShearAreaEta is the factor η of EN 1993-1-1 6.2.6(3) used for the shear area Avz.
// EN 1993-1-1 recommends η = 1.2 for steels up to S460 (EN 1993-1-5 5.1); spanbreak uses
// η = 1.0 throughout, which the standard permits as the conservative choice. With η = 1.0 the
// floor η·hw·tw of 6.2.6(3)(a) never governs a rolled section (A − 2btf + (tw + 2r)tf exceeds
// hw·tw by the fillets and the web-flange overlap); it is applied all the same.
const ShearAreaEta = 1.0

// Section is a doubly symmetric I or H section bending about its major (y) axis.
// Dimensions are in mm, areas mm², second moments mm⁴, section moduli mm³, mass kg/m.
// Every property is computed from the dimensions (root fillets included for rolled sections);
// PublishedA and PublishedIy hold the catalogue's check columns (zero for welded sections).
type Section struct {
	Name   string // catalogue name, e.g. "IPE 500", or "welded 900x300x12x25"
	Series string // "IPE", "HEA", "HEB", "HEM", "UB", "UC" or "welded"
	Source string // published table the row comes from

	H, B, Tw, Tf, R float64 // depth, flange width, web and flange thickness, root radius [mm]

	A    float64 // gross area [mm²]
	Iy   float64 // second moment about the major axis [mm⁴]
	Iz   float64 // second moment about the minor axis [mm⁴]
	WelY float64 // elastic modulus about y [mm³]
	WplY float64 // plastic modulus about y [mm³]
	Avz  float64 // shear area for load parallel to the web, EN 1993-1-1 6.2.6(3) with η = 1.0 [mm²]
	Mass float64 // mass per metre [kg/m]

	PublishedA  float64 // catalogue A [mm²] (check column)
	PublishedIy float64 // catalogue Iy [mm⁴] (check column)
}

// WebDepth returns hw = h − 2tf, the clear depth of the web between the flanges [mm]
// (the hw of EN 1993-1-1 6.2.6(3)).
func (s Section) WebDepth() float64 { return s.H - 2*s.Tf }

// DepthBetweenFillets returns d = h − 2tf − 2r, the straight part of the web between the
// root fillets [mm]: the depth available to a web cover plate.
func (s Section) DepthBetweenFillets() float64 { return s.H - 2*s.Tf - 2*s.R }

// Welded reports whether the section was built from plates (no root fillets).
func (s Section) Welded() bool { return s.Series == SeriesWelded }

// SeriesWelded is the Series of sections made by WeldedSection.
const SeriesWelded = "welded"

// Root fillet (spandrel) geometry: the region between two perpendicular faces and a quarter
// circle of radius r that is tangent to both. Closed forms, per unit r:
//
//	area               Af = (1 − π/4) r²
//	centroid offset    e  = r (10 − 3π)/(12 − 3π) ≈ 0.2234 r from each face
//	own second moment  If = (1/3 − π/16) r⁴ − Af (r − e)² ≈ 0.00755 r⁴
//
// (square r×r minus a quarter disc; the quarter disc's centroid lies 4r/(3π) from its centre).
func filletArea(r float64) float64 { return (1 - math.Pi/4) * r * r }

func filletOffset(r float64) float64 { return r * (10 - 3*math.Pi) / (12 - 3*math.Pi) }

func filletOwnInertia(r float64) float64 {
	arm := r - filletOffset(r) // from the quarter circle's centre to the fillet centroid
	return (1.0/3-math.Pi/16)*r*r*r*r - filletArea(r)*arm*arm
}

// iSectionProperties fills A, Iy, Iz, WelY, WplY, Avz and Mass of s from H, B, Tw, Tf and R.
// Root fillets (R > 0) are included in every property with their own centroid and second
// moment. Avz follows EN 1993-1-1 6.2.6(3)(a) for rolled sections and 6.2.6(3)(d) for
// welded ones, both with η = ShearAreaEta.
func iSectionProperties(s *Section) {
	h, b, tw, tf, r := s.H, s.B, s.Tw, s.Tf, s.R
	hw := h - 2*tf
	af := filletArea(r)
	e := filletOffset(r)
	ifo := filletOwnInertia(r)

	// Distances of the fillet centroids from the axes: next to the inner face of a flange
	// for y, next to the face of the web for z.
	yf := hw/2 - e
	zf := tw/2 + e

	s.A = 2*b*tf + hw*tw + 4*af
	s.Iy = (b*h*h*h-(b-tw)*hw*hw*hw)/12 + 4*(ifo+af*yf*yf)
	s.Iz = 2*tf*b*b*b/12 + hw*tw*tw*tw/12 + 4*(ifo+af*zf*zf)
	s.WelY = 2 * s.Iy / h
	s.WplY = b*tf*(h-tf) + tw*hw*hw/4 + 4*af*yf

	minimum := ShearAreaEta * hw * tw
	if r > 0 {
		s.Avz = math.Max(s.A-2*b*tf+(tw+2*r)*tf, minimum) // 6.2.6(3)(a)
	} else {
		s.Avz = minimum // 6.2.6(3)(d), welded: η Σ hw tw
	}
	s.Mass = s.A * 1e-6 * SteelDensity
}

// WeldedSection builds a doubly symmetric welded I-section from plate sizes [mm] (fillet welds
// ignored); invalid sizes → error naming the field.
//
// h is the overall depth, b the flange width, tw and tf the web and flange thicknesses. Avz is
// hw·tw with η = 1.0 (EN 1993-1-1 6.2.6(3)(d)).
func WeldedSection(h, b, tw, tf float64) (Section, error) {
	var errs []error
	for _, f := range []struct {
		name  string
		value float64
	}{{"h", h}, {"b", b}, {"tw", tw}, {"tf", tf}} {
		if math.IsNaN(f.value) || math.IsInf(f.value, 0) || f.value <= 0 {
			errs = append(errs, fmt.Errorf("welded section: %s = %v mm: must be a positive finite size", f.name, f.value))
		}
	}
	if len(errs) > 0 {
		return Section{}, errors.Join(errs...)
	}
	if 2*tf >= h {
		errs = append(errs, fmt.Errorf("welded section: tf = %v mm: two flanges (%v mm) leave no web in h = %v mm", tf, 2*tf, h))
	}
	if tw > b {
		errs = append(errs, fmt.Errorf("welded section: tw = %v mm: web is wider than the flange b = %v mm", tw, b))
	}
	if len(errs) > 0 {
		return Section{}, errors.Join(errs...)
	}
	s := Section{
		Name:   "welded " + mm(h) + "x" + mm(b) + "x" + mm(tw) + "x" + mm(tf),
		Series: SeriesWelded,
		Source: "plate sizes; properties by closed form (fillet welds ignored)",
		H:      h, B: b, Tw: tw, Tf: tf,
	}
	iSectionProperties(&s)
	return s, nil
}

// mm formats a plate size for a section name: shortest exact decimal, no exponent.
func mm(v float64) string { return strconv.FormatFloat(v, 'f', -1, 64) }
