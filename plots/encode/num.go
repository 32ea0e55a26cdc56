package encode

import (
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
)

// Output units: the factors from the internal N and mm.
const (
	ToM   = 1e-3 // mm → m
	ToKN  = 1e-3 // N → kN
	ToKNm = 1e-6 // N·mm → kNm
)

// Round applies the machine-output rule: six decimals of the output unit, no negative zero,
// 0 for a non-finite value.
func Round(v float64) float64 {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return 0
	}
	r := math.Round(v*1e6) / 1e6
	if r == 0 {
		return 0 // also turns −0 into 0
	}
	return r
}

// Num is a number of a JSON document; it is encoded by the rounding rule.
type Num float64

// MarshalJSON writes the rounded value in the shortest form that reads back the same.
func (n Num) MarshalJSON() ([]byte, error) {
	return strconv.AppendFloat(nil, Round(float64(n)), 'f', -1, 64), nil
}

// Nums converts a slice, scaling each value by f.
func Nums(v []float64, f float64) []Num {
	out := make([]Num, len(v))
	for i, x := range v {
		out[i] = Num(x * f)
	}
	return out
}

// NumPtr is a pointer to a Num, for optional values (null when absent).
func NumPtr(v float64) *Num { n := Num(v); return &n }

// Number is a CSV cell or a short text value: the rounded value in its shortest form.
func Number(v float64) string { return strconv.FormatFloat(Round(v), 'f', -1, 64) }

// Fixed prints v with prec decimals for reading, without a negative zero.
func Fixed(v float64, prec int) string { return fmt.Sprintf("%.*f", prec, Clean(v)) }

// Clean wraps a value for fmt's f, e and g verbs so that a value that prints as zero never
// shows as "-0.0"; the + flag still signs positive values.
type Clean float64

// Format implements fmt.Formatter.
func (c Clean) Format(f fmt.State, verb rune) {
	prec, ok := f.Precision()
	if !ok {
		prec = -1
	}
	if verb != 'e' && verb != 'g' {
		verb = 'f'
	}
	s := strconv.FormatFloat(float64(c), byte(verb), prec, 64)
	if strings.Trim(s, "-0.") == "" {
		s = strings.TrimPrefix(s, "-")
	}
	if f.Flag('+') && !strings.HasPrefix(s, "-") {
		s = "+" + s
	}
	_, _ = io.WriteString(f, s)
}
