package beam

import (
	"fmt"
	"math"
	"strings"
)

// GradeTable selects the table that gives fy and fu for a thickness.
type GradeTable int

const (
	TableEN1993  GradeTable = iota // EN 1993-1-1 Table 3.1 (t ≤ 40 / 40 < t ≤ 80)
	TableEN10025                   // product standard ReH thickness steps (EN 10025-2, and -3/-4 for S420/S460)
)

// String names the table as a calculation sheet cites it.
func (t GradeTable) String() string {
	switch t {
	case TableEN1993:
		return "EN 1993-1-1 Table 3.1"
	case TableEN10025:
		return "product standard (EN 10025)"
	}
	return fmt.Sprintf("GradeTable(%d)", int(t))
}

// Grade is a structural steel grade with thickness-dependent nominal strengths.
//
// fy and fu come either from EN 1993-1-1:2005+AC:2009 Table 3.1 (two thickness bands) or from
// the product standard's finer steps: minimum ReH and Rm of EN 10025-2:2004 Table 7 for
// S235–S450, EN 10025-4:2004 (thermomechanically rolled M/ML) for S420 and S460, and
// EN 10025-3:2004 (normalised N/NL) for S420N and S460N.
type Grade struct {
	Name     string // e.g. "S355"
	Standard string // product standard, e.g. "EN 10025-2"

	table31 strengthSteps // EN 1993-1-1 Table 3.1
	product strengthSteps // product standard
}

// String returns the grade name.
func (g Grade) String() string { return g.Name }

// strengthSteps holds fy and fu as functions of the thickness, each a list of steps.
type strengthSteps struct {
	fy, fu []step
	source string // cited in range errors
}

// step gives a value for thicknesses up to max: t ≤ max, or t < max when open.
// A zero value means the table gives no value in that band.
type step struct {
	max   float64 // [mm]
	open  bool
	value float64 // [N/mm²]
}

// find returns the value of the first step that covers t.
func find(steps []step, t float64) (value float64, ok bool) {
	for _, s := range steps {
		if t < s.max || (!s.open && t == s.max) {
			return s.value, s.value > 0
		}
	}
	return 0, false
}

// upTo is shorthand for steps closed at their upper bound: upTo(16, 235, 40, 225) means
// 235 for t ≤ 16 and 225 for 16 < t ≤ 40.
func upTo(pairs ...float64) []step {
	out := make([]step, 0, len(pairs)/2)
	for i := 0; i+1 < len(pairs); i += 2 {
		out = append(out, step{max: pairs[i], value: pairs[i+1]})
	}
	return out
}

// Strength returns fy and fu [N/mm²] for an element of nominal thickness t [mm] from the chosen
// table; error if t ≤ 0 or beyond the table's range (Table 3.1: t ≤ 80 mm; the product
// standards as coded: t ≤ 100 mm).
func (g Grade) Strength(t float64, table GradeTable) (fy, fu float64, err error) {
	if math.IsNaN(t) || math.IsInf(t, 0) || t <= 0 {
		return 0, 0, fmt.Errorf("%s: thickness t = %v mm: must be a positive finite thickness", g.Name, t)
	}
	var steps strengthSteps
	switch table {
	case TableEN1993:
		steps = g.table31
	case TableEN10025:
		steps = g.product
	default:
		return 0, 0, fmt.Errorf("%s: unknown strength table %v", g.Name, table)
	}
	fy, okY := find(steps.fy, t)
	fu, okU := find(steps.fu, t)
	if !okY || !okU {
		return 0, 0, fmt.Errorf("%s: thickness t = %v mm is outside %s (%s)", g.Name, t, steps.source, rangeText(steps))
	}
	return fy, fu, nil
}

// rangeText describes the thickness range a table covers, for error messages.
func rangeText(s strengthSteps) string {
	lo := 0.0
	for _, st := range s.fu {
		if st.value > 0 {
			break
		}
		lo = st.max
	}
	hi := math.Min(s.fy[len(s.fy)-1].max, s.fu[len(s.fu)-1].max)
	if lo > 0 {
		return fmt.Sprintf("%v mm ≤ t ≤ %v mm", lo, hi)
	}
	return fmt.Sprintf("t ≤ %v mm", hi)
}

// Grades returns every grade spanbreak knows, weakest first.
//
// Provenance of the figures: Table 3.1 rows as printed in EN 1993-1-1:2005+AC:2009 (S355
// fu = 490 N/mm² for t ≤ 40 mm; the first print's 510 is the EN 10210-1 hollow-section value);
// EN 10025-2 ReH steps of S235, S275 and S355 as in the standard's Table 7; the EN 10025-2 Rm
// minima, the S450 steps and the EN 10025-3/-4 steps are quoted from memory and agree with the
// Table 3.1 rows derived from them.
func Grades() []Grade {
	const (
		t31   = "EN 1993-1-1 Table 3.1"
		en2   = "EN 10025-2"
		en3   = "EN 10025-3"
		en4   = "EN 10025-4"
		steps = " thickness steps"
	)
	table31 := func(fy40, fu40, fy80, fu80 float64) strengthSteps {
		return strengthSteps{fy: upTo(40, fy40, 80, fy80), fu: upTo(40, fu40, 80, fu80), source: t31}
	}
	// EN 10025-2:2004 Table 7: ReH for t ≤ 16, 40, 63, 80, 100 mm; Rm for t < 3 and 3 ≤ t ≤ 100.
	en10025part2 := func(reh [5]float64, rmBelow3, rm float64) strengthSteps {
		return strengthSteps{
			fy:     upTo(16, reh[0], 40, reh[1], 63, reh[2], 80, reh[3], 100, reh[4]),
			fu:     []step{{max: 3, open: true, value: rmBelow3}, {max: 100, value: rm}},
			source: en2 + steps,
		}
	}
	// EN 10025-3/-4: ReH for t ≤ 16, 40, 63, 80, 100 mm; Rm steps as given.
	en10025part34 := func(part string, reh [5]float64, rm []step) strengthSteps {
		return strengthSteps{
			fy:     upTo(16, reh[0], 40, reh[1], 63, reh[2], 80, reh[3], 100, reh[4]),
			fu:     rm,
			source: part + steps,
		}
	}
	return []Grade{
		{Name: "S235", Standard: en2,
			table31: table31(235, 360, 215, 360),
			product: en10025part2([5]float64{235, 225, 215, 215, 215}, 360, 360)},
		{Name: "S275", Standard: en2,
			table31: table31(275, 430, 255, 410),
			product: en10025part2([5]float64{275, 265, 255, 245, 235}, 430, 410)},
		{Name: "S355", Standard: en2,
			table31: table31(355, 490, 335, 470),
			product: en10025part2([5]float64{355, 345, 335, 325, 315}, 510, 470)},
		{Name: "S420", Standard: en4 + " (M/ML)",
			table31: table31(420, 520, 390, 500),
			product: en10025part34(en4, [5]float64{420, 400, 390, 380, 370}, upTo(40, 520, 63, 500, 80, 480, 100, 470))},
		{Name: "S420N", Standard: en3 + " (N/NL)",
			table31: table31(420, 520, 390, 520),
			product: en10025part34(en3, [5]float64{420, 400, 390, 370, 360}, upTo(100, 520))},
		{Name: "S450", Standard: en2,
			table31: table31(440, 550, 410, 550),
			// EN 10025-2 gives S450 (J0) no Rm below 3 mm.
			product: en10025part2([5]float64{450, 430, 410, 390, 380}, 0, 550)},
		{Name: "S460", Standard: en4 + " (M/ML)",
			table31: table31(460, 540, 430, 530),
			product: en10025part34(en4, [5]float64{460, 440, 430, 410, 400}, upTo(40, 540, 63, 530, 80, 510, 100, 500))},
		{Name: "S460N", Standard: en3 + " (N/NL)",
			table31: table31(460, 540, 430, 540),
			product: en10025part34(en3, [5]float64{460, 440, 430, 410, 400}, upTo(100, 540))},
	}
}

// gradeQualities lists the quality and delivery suffixes each grade name accepts: toughness
// qualities of EN 10025-2 (JR, J0, J2, K2) and the M/ML, N/NL conditions of EN 10025-4/-3.
// A suffix does not change fy or fu.
func gradeQualities(name string) []string {
	switch name {
	case "S235", "S275":
		return []string{"JR", "J0", "J2"}
	case "S355":
		return []string{"JR", "J0", "J2", "K2"}
	case "S450":
		return []string{"J0"}
	case "S420", "S460":
		return []string{"M", "ML"}
	case "S420N", "S460N":
		return []string{"L"} // S420NL, S460NL
	}
	return nil
}

// LookupGrade finds a steel grade by name: S235, S275, S355, S420, S450, S460 (S420/S460 as
// EN 10025-4 M/ML) and S420N, S460N (EN 10025-3 N/NL), case and space insensitive, optionally
// with a quality suffix (S355J2, S275JR, S460ML, S420NL). Anything else is an error.
func LookupGrade(name string) (Grade, error) {
	key := strings.ToUpper(strings.Join(strings.Fields(name), ""))
	grades := Grades()
	for _, g := range grades {
		if key == g.Name {
			return g, nil
		}
	}
	for _, g := range grades {
		for _, q := range gradeQualities(g.Name) {
			if key == g.Name+q {
				return g, nil
			}
		}
	}
	names := make([]string, len(grades))
	for i, g := range grades {
		names[i] = g.Name
	}
	return Grade{}, fmt.Errorf("unknown steel grade %q (known: %s; quality suffixes such as S355J2 or S460ML are accepted)",
		name, strings.Join(names, ", "))
}
