package plots

import (
	"fmt"

	"spanbreak/optimise"
	"spanbreak/plots/encode"
)

// whyTitle is the heading that takes the place of the layouts when no layout fits.
const whyTitle = "Why no layout fits"

// summaryFindings bounds the findings repeated in the job summary; the section has them all.
const summaryFindings = 3

// resultRows are the result lines of the job summary: the recommended layout and its cost,
// or, when no layout fits, the findings that say why.
func (w *reportWriter) resultRows() [][2]string {
	res := w.in.Outcome
	if res.Infeasible == nil {
		rec := res.Recommended()
		label := "Recommended layout"
		if res.Placed {
			label = "Layout placed by hand"
		}
		rows := [][2]string{
			{label, layoutWords(rec)},
			{"Cost", fmt.Sprintf("%s %s: splices %s, transport %s, erection %s", money(rec.Cost.Total), w.cur,
				money(rec.Cost.Splices), money(rec.Cost.Transport), money(rec.Cost.Erection))},
		}
		if why := encode.RecommendationRule(res); why != "" {
			rows = append(rows, [2]string{"Rule", why})
		}
		if cmp := encode.UniformComparison(res); cmp != "" {
			rows = append(rows, [2]string{"Identical splices", cmp})
		}
		return append(rows, [2]string{"The beam itself", encode.MemberLine(&res.Member)})
	}
	rows := [][2]string{{"Recommended layout", "none: no layout satisfies the limits (see “" + whyTitle + "”)"}}
	d := res.Diagnosis
	for i, f := range d {
		if i == summaryFindings && len(d) > summaryFindings+1 {
			rows = append(rows, [2]string{"", fmt.Sprintf("and %d more findings (see “%s”)", len(d)-i, whyTitle)})
			break
		}
		rows = append(rows, [2]string{"Why", f.Message})
	}
	return rows
}

// whyNoLayout writes the section that replaces the layouts and the calculation sheets when
// no layout fits: every finding of the diagnosis in words, the stretches where no splice
// passes in a table, and what the folder holds instead.
func (w *reportWriter) whyNoLayout() {
	d, res := w.d, w.in.Outcome
	d.heading(0, whyTitle, 6*bodyLead)
	d.para("No choice of splice positions keeps every piece within the limits. The findings below name each stretch " +
		"of beam without an admissible splice position that leaves a piece longer or heavier than the limits allow, and " +
		"then the limit that cannot be met with the figure that breaks it. Each finding gives the job-file key to change.")
	d.heading(1, "Findings", 40)
	for i, f := range res.Diagnosis {
		d.para(fmt.Sprintf("%d. %s", i+1, f.Message))
	}
	var rows [][]string
	for _, f := range res.Diagnosis {
		if f.Kind != optimise.FindingStretch {
			continue
		}
		rows = append(rows, []string{formatClean(f.From/1e3, 3), formatClean(f.To/1e3, 3), fmt.Sprint(f.Positions),
			formatClean(f.At/1e3, 3), f.Check, fixed(f.Utilisation, 3), kNm(f.MEd), exceeded(f.McRd, kNm), kN(f.VEd), exceeded(f.VcRd, kN)})
	}
	if len(rows) > 0 {
		d.heading(1, "Stretches where no splice passes", 60)
		d.table(table{Columns: []column{{"from [m]", 0.8, true}, {"to [m]", 0.8, true}, {"positions", 1, true},
			{"closest at [m]", 0.9, true}, {"its governing check", 1.8, false}, {"util.", 0.6, true}, {"|M_Ed| max [kNm]", 1, true},
			{"Mc,Rd [kNm]", 0.9, true}, {"|V_Ed| max [kN]", 0.9, true}, {"Vc,Rd [kN]", 0.9, true}}, Rows: rows})
		d.small("The closest attempt is the position of the stretch whose cheapest configuration comes nearest to passing " +
			"(lowest governing utilisation). Mc,Rd (EN 1993-1-1 6.2.5, in the class of the section in bending) and " +
			"Vc,Rd = Av·fy/(√3·γM0) (6.2.6) are the beam's own resistances, given only where the design force exceeds them " +
			"(– otherwise); the full member checks are in \"The beam itself\".")
	}
	d.small("There is no layout, so there are no calculation sheets and layouts.csv has its header only; every " +
		"candidate position with its reason is in scan.csv and result.json.")
}

// exceeded prints a resistance that a design force exceeds, or a dash when none is given.
func exceeded(v float64, format func(float64) string) string {
	if v <= 0 {
		return "–"
	}
	return format(v)
}
