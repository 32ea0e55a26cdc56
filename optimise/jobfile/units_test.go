package jobfile

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// unitDoc is the struct the unit tests decode into: one field of each value type.
type unitDoc struct {
	Length Metres           `yaml:"length"`
	Size   Millimetres      `yaml:"size"`
	Force  KiloNewtons      `yaml:"force"`
	Moment KiloNewtonMetres `yaml:"moment"`
	Line   LineLoad         `yaml:"line"`
	Spring Stiffness        `yaml:"spring"`
	Mass   Kilograms        `yaml:"mass"`
}

// value returns the decoded field in its internal unit.
func (u unitDoc) value(key string) float64 {
	switch key {
	case "length":
		return u.Length.MM()
	case "size":
		return u.Size.MM()
	case "force":
		return u.Force.N()
	case "moment":
		return u.Moment.NMM()
	case "line":
		return u.Line.NPerMM()
	case "spring":
		return u.Spring.NPerMM()
	case "mass":
		return u.Mass.KG()
	}
	panic("no field " + key)
}

// The conversion factors are the SI prefixes k = 10³, M = 10⁶, c = 10⁻², m = 10⁻³
// (BIPM, The International System of Units, 9th ed. 2019, Table 7) and 1 t = 10³ kg (ibid.
// Table 8). Each expected value is written as that conversion.
const siSource = "BIPM SI Brochure 9th ed., Table 7 (prefixes), Table 8 (tonne)"

func TestUnitConversion(t *testing.T) {
	tests := []struct {
		name, kind, source string
		key, input         string // field and the YAML value as written
		want               float64
	}{
		// Metres: bare m, held in mm.
		{"length bare m", "closed-form", siSource, "length", "7.2", 7.2 * 1000},
		{"length quoted bare", "closed-form", siSource, "length", `"7.2"`, 7.2 * 1000},
		{"length m", "closed-form", siSource, "length", `"7.2 m"`, 7.2 * 1000},
		{"length m no space", "closed-form", siSource, "length", `"7.2m"`, 7.2 * 1000},
		{"length cm", "closed-form", siSource, "length", `"720 cm"`, 720 * 10},
		{"length mm", "closed-form", siSource, "length", `"7200 mm"`, 7200},
		{"length exponent", "closed-form", siSource, "length", `"7.2e3 mm"`, 7.2e3},
		{"length negative, minus sign U+2212", "closed-form", siSource, "length", `"−1.5 m"`, -1.5 * 1000},
		// Millimetres: bare mm.
		{"size bare mm", "closed-form", siSource, "size", "15", 15},
		{"size m", "closed-form", siSource, "size", `"0.015 m"`, 0.015 * 1000},
		{"size cm", "closed-form", siSource, "size", `"1.5 cm"`, 1.5 * 10},
		// KiloNewtons: bare kN, held in N.
		{"force bare kN", "closed-form", siSource, "force", "45", 45 * 1000},
		{"force kN", "closed-form", siSource, "force", `"45 kN"`, 45 * 1000},
		{"force N", "closed-form", siSource, "force", `"45000 N"`, 45000},
		{"force MN", "closed-form", siSource, "force", `"0.045 MN"`, 0.045 * 1e6},
		// KiloNewtonMetres: bare kNm, held in N·mm (1 kNm = 10³ N × 10³ mm).
		{"moment bare kNm", "closed-form", siSource, "moment", "180", 180 * 1e3 * 1e3},
		{"moment kNm", "closed-form", siSource, "moment", `"180 kNm"`, 180 * 1e3 * 1e3},
		{"moment kN·m", "closed-form", siSource, "moment", `"180 kN·m"`, 180 * 1e3 * 1e3},
		{"moment kN m", "closed-form", siSource, "moment", `"180 kN m"`, 180 * 1e3 * 1e3},
		{"moment kN*m", "closed-form", siSource, "moment", `"180 kN*m"`, 180 * 1e3 * 1e3},
		{"moment Nm", "closed-form", siSource, "moment", `"180000 Nm"`, 180000 * 1e3},
		{"moment Nmm", "closed-form", siSource, "moment", `"1.8e8 Nmm"`, 1.8e8},
		{"moment N mm", "closed-form", siSource, "moment", `"1.8e8 N mm"`, 1.8e8},
		{"moment kNmm", "closed-form", siSource, "moment", `"180000 kNmm"`, 180000 * 1e3},
		{"moment MNm", "closed-form", siSource, "moment", `"0.18 MNm"`, 0.18 * 1e6 * 1e3},
		// LineLoad: bare kN/m, held in N/mm (1 kN/m = 10³ N / 10³ mm).
		{"line bare kN/m", "closed-form", siSource, "line", "25", 25 * 1e3 / 1e3},
		{"line kN/m", "closed-form", siSource, "line", `"25 kN/m"`, 25 * 1e3 / 1e3},
		{"line N/mm", "closed-form", siSource, "line", `"25 N/mm"`, 25},
		{"line N/m", "closed-form", siSource, "line", `"25000 N/m"`, 25000 / 1e3},
		{"line kN/mm", "closed-form", siSource, "line", `"0.025 kN/mm"`, 0.025 * 1e3},
		{"line MN/m", "closed-form", siSource, "line", `"0.025 MN/m"`, 0.025 * 1e6 / 1e3},
		// Stiffness: bare kN/m, held in N/mm.
		{"spring bare kN/m", "closed-form", siSource, "spring", "50000", 50000 * 1e3 / 1e3},
		{"spring kN/m", "closed-form", siSource, "spring", `"50000 kN/m"`, 50000 * 1e3 / 1e3},
		{"spring kN/mm", "closed-form", siSource, "spring", `"50 kN/mm"`, 50 * 1e3},
		// Kilograms: bare kg.
		{"mass bare kg", "closed-form", siSource, "mass", "4000", 4000},
		{"mass kg", "closed-form", siSource, "mass", `"4000 kg"`, 4000},
		{"mass t", "closed-form", siSource, "mass", `"2.5 t"`, 2.5 * 1000},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			var u unitDoc
			err := Decode("u.yaml", []byte(tc.key+": "+tc.input+"\n"), &u)
			require.NoError(t, err)
			assert.InEpsilon(t, tc.want, u.value(tc.key), 1e-12, "%s (%s)", tc.input, tc.source)
		})
	}
}

func TestUnitZeroValue(t *testing.T) {
	var u unitDoc
	require.NoError(t, Decode("u.yaml", []byte("length: \"0 mm\"\nforce: 0\n"), &u))
	assert.InDelta(t, 0, u.Length.MM(), 0)
	assert.InDelta(t, 0, u.Force.N(), 0)
}

func TestUnitErrors(t *testing.T) {
	tests := []struct {
		name, key, input string
		want             string // fragment of the message, after "u.yaml:1:col: key: "
	}{
		// A unit of every other dimension in each field.
		{"length given a force", "length", `"45 kN"`, `"45 kN" is a force; want a length (m, cm, mm)`},
		{"length given a line load", "length", `"25 kN/m"`, `"25 kN/m" is a force per length (line load or stiffness); want a length`},
		{"length given a mass", "length", `"2.5 t"`, `"2.5 t" is a mass; want a length`},
		{"size given a moment", "size", `"180 kNm"`, `"180 kNm" is a moment; want a size (m, cm, mm)`},
		{"force given a length", "force", `"7.2 m"`, `"7.2 m" is a length; want a force (kN, N, MN)`},
		{"force given a moment", "force", `"180 kNm"`, `"180 kNm" is a moment; want a force`},
		{"force given a line load", "force", `"25 kN/m"`, `is a force per length (line load or stiffness); want a force`},
		{"moment given a force", "moment", `"180 kN"`, `"180 kN" is a force; want a moment (kNm, Nm, Nmm, kNmm, MNm)`},
		{"moment given a length", "moment", `"180 m"`, `is a length; want a moment`},
		{"line given a force", "line", `"25 kN"`, `"25 kN" is a force; want a line load (kN/m, N/mm, N/m, kN/mm, MN/m)`},
		{"line given a mass", "line", `"25 kg"`, `is a mass; want a line load`},
		{"spring given a force", "spring", `"50000 kN"`, `"50000 kN" is a force; want a spring stiffness`},
		{"mass given a force", "mass", `"2.5 kN"`, `"2.5 kN" is a force; want a mass (kg, t)`},
		{"mass given a length", "mass", `"2.5 m"`, `is a length; want a mass`},
		// Unknown units, with a did-you-mean for a wrong case.
		{"unknown unit feet", "length", `"7 ft"`, `unknown unit "ft" in "7 ft"; a length takes m, cm, mm`},
		{"unknown unit KN", "force", `"45 KN"`, `unknown unit "KN" in "45 KN"; a force takes kN, N, MN; did you mean "kN"?`},
		{"unknown unit tonnes", "mass", `"2.5 tonnes"`, `unknown unit "tonnes"`},
		{"doubled unit is not mm", "length", `"7.2 m m"`, `unknown unit "m m"`},
		{"kN cm is not a moment unit", "moment", `"5 kN cm"`, `unknown unit "kNcm"`},
		// Not numbers at all.
		{"text", "length", `"abc"`, `want a length (a number in m, or a string such as "7200 mm"), got "abc"`},
		{"unit only", "force", `"kN"`, `want a force (a number in kN, or a string such as "45 kN"), got "kN"`},
		{"comma decimal", "length", `"7,2 m"`, `write the decimal point as ".": "7,2 m"`},
		{"comma decimal unquoted", "length", `7,2`, `write the decimal point as ".": "7,2"`},
		{"list", "length", `[7.2]`, `want a length (a number in m, or a string such as "7200 mm"), got a list`},
		{"bool", "mass", `true`, `want a mass (a number in kg, or a string such as "2.5 t"), got true`},
		{"null", "line", `~`, `got nothing (null)`},
		{"NaN", "length", `.nan`, `NaN is not a value`},
		{"infinity", "force", `-.inf`, `an infinite value is not allowed`},
		{"infinity in a string", "force", `"inf kN"`, `want a force`},
		{"out of range", "length", `"1e999 m"`, `the number 1e999 is out of range`},
		{"out of range after conversion", "moment", `"1e300 MNm"`, `the value "1e300 MNm" is out of range`},
		{"hexadecimal", "size", `0x10`, `want a decimal number, got 0x10`},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			var u unitDoc
			err := Decode("u.yaml", []byte(tc.key+": "+tc.input+"\n"), &u)
			require.Error(t, err)
			var ps Problems
			require.ErrorAs(t, err, &ps)
			require.Len(t, ps, 1, err.Error())
			assert.Equal(t, "u.yaml", ps[0].File)
			assert.Equal(t, 1, ps[0].Line)
			assert.Equal(t, len(tc.key)+3, ps[0].Column)
			assert.Equal(t, tc.key, ps[0].Path)
			assert.Contains(t, ps[0].Message, tc.want)
		})
	}
}

func TestUnitString(t *testing.T) {
	assert.Equal(t, "7.2 m", NewMetres(7.2).String())
	assert.Equal(t, "15 mm", Millimetres(15).String())
	assert.Equal(t, "45 kN", NewKiloNewtons(45).String())
	assert.Equal(t, "180 kNm", NewKiloNewtonMetres(180).String())
	assert.Equal(t, "25 kN/m", LineLoad(25).String())
	assert.Equal(t, "50000 kN/m", Stiffness(50000).String())
	assert.Equal(t, "2500 kg", Kilograms(2500).String())
}
