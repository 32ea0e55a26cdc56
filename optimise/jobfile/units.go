package jobfile

import (
	"fmt"
	"math"
	"strconv"
	"strings"
	"unicode"

	"go.yaml.in/yaml/v3"
)

// dimension is a physical dimension a job-file value may carry.
type dimension int

const (
	dimLength dimension = iota + 1
	dimForce
	dimMoment
	dimForcePerLength
	dimMass
)

// unitSymbols lists the unit symbols accepted for a dimension, in the order messages show them.
func (dim dimension) unitSymbols() []string {
	switch dim {
	case dimLength:
		return []string{"m", "cm", "mm"}
	case dimForce:
		return []string{"kN", "N", "MN"}
	case dimMoment:
		return []string{"kNm", "Nm", "Nmm", "kNmm", "MNm"}
	case dimForcePerLength:
		return []string{"kN/m", "N/mm", "N/m", "kN/mm", "MN/m"}
	case dimMass:
		return []string{"kg", "t"}
	}
	return nil
}

// name says what a dimension is, for "is a ..." in messages.
func (dim dimension) name() string {
	switch dim {
	case dimLength:
		return "a length"
	case dimForce:
		return "a force"
	case dimMoment:
		return "a moment"
	case dimForcePerLength:
		return "a force per length (line load or stiffness)"
	case dimMass:
		return "a mass"
	}
	return "a quantity"
}

// unitFactor returns the dimension of a unit symbol (spaces, "·", "⋅" and "*" already removed)
// and the factor taking a value in that unit to the internal unit of the dimension:
// mm for lengths, N for forces, N·mm for moments, N/mm for force per length, kg for masses.
func unitFactor(sym string) (dimension, float64, bool) {
	switch sym {
	case "mm":
		return dimLength, 1, true
	case "cm":
		return dimLength, 10, true // 1 cm = 10 mm
	case "m":
		return dimLength, 1e3, true // 1 m = 1000 mm
	case "N":
		return dimForce, 1, true
	case "kN":
		return dimForce, 1e3, true // 1 kN = 1000 N
	case "MN":
		return dimForce, 1e6, true // 1 MN = 10⁶ N
	case "Nmm":
		return dimMoment, 1, true
	case "Nm":
		return dimMoment, 1e3, true // 1 N·m = 1000 N·mm
	case "kNmm":
		return dimMoment, 1e3, true // 1 kN·mm = 1000 N·mm
	case "kNm":
		return dimMoment, 1e6, true // 1 kN·m = 1000 N × 1000 mm = 10⁶ N·mm
	case "MNm":
		return dimMoment, 1e9, true // 1 MN·m = 10⁹ N·mm
	case "N/mm":
		return dimForcePerLength, 1, true
	case "N/m":
		return dimForcePerLength, 1e-3, true // 1 N/m = 1 N / 1000 mm
	case "kN/m":
		return dimForcePerLength, 1, true // 1 kN/m = 1000 N / 1000 mm = 1 N/mm
	case "kN/mm":
		return dimForcePerLength, 1e3, true // 1 kN/mm = 1000 N/mm
	case "MN/m":
		return dimForcePerLength, 1e3, true // 1 MN/m = 10⁶ N / 1000 mm = 1000 N/mm
	case "kg":
		return dimMass, 1, true
	case "t":
		return dimMass, 1e3, true // 1 t = 1000 kg
	}
	return 0, 0, false
}

// allUnitSymbols lists every accepted symbol, for did-you-mean on an unknown unit.
func allUnitSymbols() []string {
	var all []string
	for dim := dimLength; dim <= dimMass; dim++ {
		all = append(all, dim.unitSymbols()...)
	}
	return all
}

// quantity describes one value type: its dimension, the unit of a bare number, and the words
// used in messages.
type quantity struct {
	dim  dimension
	bare string // unit of a bare number
	what string // "a length", "a spring stiffness", ...
	eg   string // an example with a unit, "7200 mm"
}

// decodeQuantity reads a bare number (in q.bare) or a string "number unit" and returns the
// value in the internal unit of q.dim, reporting any problem through d.
func decodeQuantity(n *yaml.Node, d *Decoder, q quantity) (float64, bool) {
	if isNumber(n) {
		f, msg := parseDecimal(n.Value)
		if msg != "" {
			d.Problemf(n, "%s", msg)
			return 0, false
		}
		_, factor, _ := unitFactor(q.bare)
		v := f * factor
		if math.IsInf(v, 0) {
			d.Problemf(n, "the value %s %s is out of range", clip(n.Value), q.bare)
			return 0, false
		}
		return v, true
	}
	if n.Kind != yaml.ScalarNode || n.ShortTag() != "!!str" {
		d.Problemf(n, "want %s (a number in %s, or a string such as %q), got %s",
			q.what, q.bare, q.eg, describe(n))
		return 0, false
	}
	v, err := parseQuantity(n.Value, q)
	if err != nil {
		d.Problemf(n, "%v", err)
		return 0, false
	}
	return v, true
}

// parseQuantity reads "number [unit]" (unit optional, then q.bare applies) into the internal
// unit of q.dim.
func parseQuantity(s string, q quantity) (float64, error) {
	text := strings.TrimSpace(strings.ReplaceAll(s, "−", "-")) // U+2212 minus sign
	k := numberPrefix(text)
	if k == 0 {
		return 0, fmt.Errorf("want %s (a number in %s, or a string such as %q), got %q",
			q.what, q.bare, q.eg, clip(s))
	}
	f, msg := parseDecimal(text[:k])
	if msg != "" {
		return 0, fmt.Errorf("%s", msg)
	}
	if rest := text[k:]; len(rest) > 1 && rest[0] == ',' && rest[1] >= '0' && rest[1] <= '9' {
		return 0, fmt.Errorf("write the decimal point as \".\": %q", clip(s))
	}
	sym := normaliseUnit(text[k:])
	if sym == "" {
		sym = q.bare
	}
	dim, factor, ok := unitFactor(sym)
	switch {
	case !ok:
		hint := ""
		if g := Suggest(sym, allUnitSymbols()); g != "" {
			hint = "; did you mean " + strconv.Quote(g) + "?"
		}
		return 0, fmt.Errorf("unknown unit %q in %q; %s takes %s%s", clip(sym), clip(s),
			q.what, strings.Join(q.dim.unitSymbols(), ", "), hint)
	case dim != q.dim:
		return 0, fmt.Errorf("%q is %s; want %s (%s)", clip(s), dim.name(), q.what,
			strings.Join(q.dim.unitSymbols(), ", "))
	}
	v := f * factor
	if math.IsInf(v, 0) {
		return 0, fmt.Errorf("the value %q is out of range", clip(s))
	}
	return v, nil
}

// normaliseUnit trims a unit and joins a force and a length written apart ("kN·m", "kN m",
// "kN*m", "N mm") into one symbol ("kNm", "Nmm"). Any other spacing inside is left as
// written, so "m m" stays an unknown unit rather than becoming "mm".
func normaliseUnit(u string) string {
	u = strings.TrimSpace(u)
	parts := strings.FieldsFunc(u, func(r rune) bool {
		return unicode.IsSpace(r) || r == '·' || r == '⋅' || r == '*'
	})
	if len(parts) != 2 {
		return u
	}
	fd, _, fok := unitFactor(parts[0])
	ld, _, lok := unitFactor(parts[1])
	if fok && lok && fd == dimForce && ld == dimLength {
		return parts[0] + parts[1]
	}
	return u
}

// formatNumber prints a value compactly for messages ("7.2", "40.5", "0.001").
func formatNumber(f float64) string { return strconv.FormatFloat(f, 'g', 6, 64) }

// Metres is a length given in metres (positions along the beam, spans, piece lengths). A bare
// number is in m; a string may say "7.2 m", "720 cm" or "7200 mm". The value is held in mm:
// use MM, or NewMetres to make one from metres.
type Metres float64

// NewMetres returns the length of m metres.
func NewMetres(m float64) Metres { return Metres(m * 1e3) }

// MM returns the length [mm].
func (v Metres) MM() float64 { return float64(v) }

// String prints the length in metres, "7.2 m".
func (v Metres) String() string { return formatNumber(float64(v)/1e3) + " m" }

// DecodeYAMLNode reads a length: a bare number in m or a string with a unit.
func (v *Metres) DecodeYAMLNode(n *yaml.Node, d *Decoder) {
	if f, ok := decodeQuantity(n, d, quantity{dimLength, "m", "a length", "7200 mm"}); ok {
		*v = Metres(f)
	}
}

// Millimetres is a size given in millimetres (plate and section dimensions, bolt spacing,
// gap). A bare number is in mm; a string may carry m, cm or mm. Held in mm.
type Millimetres float64

// MM returns the size [mm].
func (v Millimetres) MM() float64 { return float64(v) }

// String prints the size, "15 mm".
func (v Millimetres) String() string { return formatNumber(float64(v)) + " mm" }

// DecodeYAMLNode reads a size: a bare number in mm or a string with a unit.
func (v *Millimetres) DecodeYAMLNode(n *yaml.Node, d *Decoder) {
	if f, ok := decodeQuantity(n, d, quantity{dimLength, "mm", "a size", "15 mm"}); ok {
		*v = Millimetres(f)
	}
}

// KiloNewtons is a force given in kN (point and axial loads). A bare number is in kN; a
// string may carry N, kN or MN. Held in N: use N, or NewKiloNewtons.
type KiloNewtons float64

// NewKiloNewtons returns the force of kn kilonewtons.
func NewKiloNewtons(kn float64) KiloNewtons { return KiloNewtons(kn * 1e3) }

// N returns the force [N].
func (v KiloNewtons) N() float64 { return float64(v) }

// String prints the force in kN, "45 kN".
func (v KiloNewtons) String() string { return formatNumber(float64(v)/1e3) + " kN" }

// DecodeYAMLNode reads a force: a bare number in kN or a string with a unit.
func (v *KiloNewtons) DecodeYAMLNode(n *yaml.Node, d *Decoder) {
	if f, ok := decodeQuantity(n, d, quantity{dimForce, "kN", "a force", "45 kN"}); ok {
		*v = KiloNewtons(f)
	}
}

// KiloNewtonMetres is a moment given in kNm (point moments). A bare number is in kNm; a
// string may carry kNm, kN·m, Nm, Nmm, kNmm or MNm. Held in N·mm: use NMM, or
// NewKiloNewtonMetres.
type KiloNewtonMetres float64

// NewKiloNewtonMetres returns the moment of knm kilonewton-metres.
func NewKiloNewtonMetres(knm float64) KiloNewtonMetres { return KiloNewtonMetres(knm * 1e6) }

// NMM returns the moment [N·mm].
func (v KiloNewtonMetres) NMM() float64 { return float64(v) }

// String prints the moment in kNm, "180 kNm".
func (v KiloNewtonMetres) String() string { return formatNumber(float64(v)/1e6) + " kNm" }

// DecodeYAMLNode reads a moment: a bare number in kNm or a string with a unit.
func (v *KiloNewtonMetres) DecodeYAMLNode(n *yaml.Node, d *Decoder) {
	if f, ok := decodeQuantity(n, d, quantity{dimMoment, "kNm", "a moment", "180 kNm"}); ok {
		*v = KiloNewtonMetres(f)
	}
}

// LineLoad is a distributed load given in kN/m. A bare number is in kN/m; a string may carry
// kN/m, N/mm, N/m, kN/mm or MN/m. Held in N/mm (numerically equal to kN/m).
type LineLoad float64

// NPerMM returns the intensity [N/mm].
func (v LineLoad) NPerMM() float64 { return float64(v) }

// String prints the intensity in kN/m, "25 kN/m".
func (v LineLoad) String() string { return formatNumber(float64(v)) + " kN/m" }

// DecodeYAMLNode reads a line load: a bare number in kN/m or a string with a unit.
func (v *LineLoad) DecodeYAMLNode(n *yaml.Node, d *Decoder) {
	if f, ok := decodeQuantity(n, d, quantity{dimForcePerLength, "kN/m", "a line load", "25 kN/m"}); ok {
		*v = LineLoad(f)
	}
}

// Stiffness is a vertical spring stiffness given in kN/m (spring supports): force per unit
// deflection, the same dimension as LineLoad. A bare number is in kN/m. Held in N/mm.
type Stiffness float64

// NPerMM returns the stiffness [N/mm].
func (v Stiffness) NPerMM() float64 { return float64(v) }

// String prints the stiffness in kN/m, "50000 kN/m".
func (v Stiffness) String() string { return formatNumber(float64(v)) + " kN/m" }

// DecodeYAMLNode reads a stiffness: a bare number in kN/m or a string with a unit.
func (v *Stiffness) DecodeYAMLNode(n *yaml.Node, d *Decoder) {
	if f, ok := decodeQuantity(n, d, quantity{dimForcePerLength, "kN/m", "a spring stiffness", "50000 kN/m"}); ok {
		*v = Stiffness(f)
	}
}

// Kilograms is a mass given in kg (piece and payload limits). A bare number is in kg; a
// string may carry kg or t. Held in kg.
type Kilograms float64

// KG returns the mass [kg].
func (v Kilograms) KG() float64 { return float64(v) }

// String prints the mass, "4000 kg".
func (v Kilograms) String() string { return formatNumber(float64(v)) + " kg" }

// DecodeYAMLNode reads a mass: a bare number in kg or a string with a unit.
func (v *Kilograms) DecodeYAMLNode(n *yaml.Node, d *Decoder) {
	if f, ok := decodeQuantity(n, d, quantity{dimMass, "kg", "a mass", "2.5 t"}); ok {
		*v = Kilograms(f)
	}
}
