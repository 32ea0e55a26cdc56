package encode

import (
	"fmt"
	"io"
	"strings"

	"spanbreak/beam"
	"spanbreak/optimise"
)

// MemberDoc is the beam's own cross-section check (EN 1993-1-1 6.2, Table 5.2) at its
// governing station: the worst class over the beam, Mc,Rd and Vc,Rd of the governing
// section, the utilisation, where and under which combination.
type MemberDoc struct {
	Class        string   `json:"class"`
	McRd         Num      `json:"Mc_Rd"`
	VcRd         Num      `json:"Vc_Rd"`
	Utilisation  Num      `json:"utilisation"`
	X            Num      `json:"x"`
	Combination  string   `json:"combination"`
	Check        string   `json:"check"`
	Pairing      string   `json:"pairing"`
	Pass         bool     `json:"pass"`
	OutsideScope *string  `json:"outside_scope"`
	Warnings     []string `json:"warnings"` // as the text prints them: a failure, compression the checks leave unchecked
	Caution      string   `json:"caution"`
}

// DeflectionDoc is one span or overhang's SLS deflection against its limit.
type DeflectionDoc struct {
	Region      string `json:"region"`
	From        Num    `json:"from"`
	To          Num    `json:"to"`
	W           Num    `json:"w"`
	Limit       Num    `json:"limit"`
	Utilisation Num    `json:"utilisation"`
	Combination string `json:"combination"`
	X           Num    `json:"x"`
	Pass        bool   `json:"pass"`
}

// Member is the shape of the member check.
func Member(m *optimise.MemberChecks) MemberDoc {
	r := m.Member
	d := MemberDoc{Class: r.Class.String(), McRd: Num(r.McRd * ToKNm), VcRd: Num(r.VcRd * ToKN), Utilisation: Num(r.Utilisation),
		X: Num(r.X * ToM), Combination: r.Combination, Check: r.Check, Pairing: r.Pairing.String(),
		Pass: m.Scope == nil && r.Utilisation <= 1, Warnings: append([]string{}, m.Warnings()...), Caution: optimise.LTBCaution}
	if m.Scope != nil {
		d.OutsideScope = ptr(m.Scope.Error())
	}
	return d
}

// Deflections is the shape of the deflection checks, one per span and overhang.
func Deflections(m *optimise.MemberChecks) []DeflectionDoc {
	out := []DeflectionDoc{}
	for _, r := range m.Deflection.Regions {
		out = append(out, DeflectionDoc{Region: r.Region.Name, From: Num(r.Region.From * ToM), To: Num(r.Region.To * ToM),
			W: Num(r.W), Limit: Num(r.Limit), Utilisation: Num(r.Utilisation), Combination: r.Combination,
			X: Num(r.Station.X * ToM), Pass: r.Pass})
	}
	return out
}

// writeMemberText prints the member checks: the warnings first, then the cross-section at
// the governing station, the deflection of every region and what is outside scope.
func writeMemberText(w io.Writer, m *optimise.MemberChecks) {
	fmt.Fprintln(w, "\nThe beam itself (EN 1993-1-1 6.2, Table 5.2; SLS deflection)")
	for _, s := range m.Warnings() {
		fmt.Fprintf(w, "  WARNING: %s\n", s)
	}
	r := m.Member
	if m.Scope == nil {
		sec := r.Section
		c := sec.Class
		fmt.Fprintf(w, "  section %s at the governing station: flange c/t = %.2f (%s), web c/t = %.2f (%s), ε = %.3f, fy = %.0f N/mm²\n",
			c.Class, c.Flange.Ratio, c.Flange.Class, c.Web.Ratio, c.Web.Class, c.Epsilon, c.Fy)
		fmt.Fprintf(w, "  Mc,Rd = %.1f kNm, Vc,Rd = %.1f kN, Npl,Rd = %.1f kN (γM0 = %.2f)\n", r.McRd*ToKNm, r.VcRd*ToKN,
			sec.NplRd*ToKN, r.Member.Settings.GammaM0)
		verdict := "passes"
		if r.Utilisation > 1 {
			verdict = "FAILS"
		}
		fmt.Fprintf(w, "  governing: %s at x = %.3f m, utilisation %.3f, %s (%s; %s)\n", r.Check, r.X*ToM, r.Utilisation, verdict,
			r.Pairing, r.Combination)
		if r.Class != c.Class {
			fmt.Fprintf(w, "  the worst class anywhere on the beam is %s\n", r.Class)
		}
	}
	if m.NoDeflection != "" {
		fmt.Fprintf(w, "  deflection not checked: %s\n", m.NoDeflection)
		fmt.Fprintf(w, "  Note: %s.\n", optimise.LTBCaution)
		return
	}
	tw := Table(w)
	fmt.Fprintln(tw, "  region\tfrom [m]\tto [m]\tw [mm]\tlimit [mm]\tutilisation\t\tcombination")
	for _, d := range m.Deflection.Regions {
		mark := "ok"
		if !d.Pass {
			mark = "FAILS"
		}
		fmt.Fprintf(tw, "  %s\t%.3f\t%.3f\t%.2f\tL/%g = %.2f\t%.3f\t%s\t%s\n", d.Region.Name, d.Region.From*ToM, d.Region.To*ToM,
			Clean(d.W), d.Ratio, d.Limit, d.Utilisation, mark, d.Combination)
	}
	tw.Flush()
	fmt.Fprintf(w, "  Note: %s.\n", optimise.LTBCaution)
}

// MemberLine is the one-line summary of the member checks.
func MemberLine(m *optimise.MemberChecks) string {
	r := m.Member
	if m.Scope != nil {
		return "outside scope: " + m.Scope.Error()
	}
	parts := []string{fmt.Sprintf("%s, Mc,Rd %.1f kNm, Vc,Rd %.1f kN; %s %.3f at x = %.3f m", r.Class, r.McRd*ToKNm, r.VcRd*ToKN,
		r.Check, r.Utilisation, r.X*ToM)}
	if len(m.Deflection.Regions) > 0 {
		d := m.Deflection.Regions[m.Deflection.Governing]
		parts = append(parts, fmt.Sprintf("deflection %.3f of L/%g in %s", d.Utilisation, d.Ratio, d.Region.Name))
	} else {
		parts = append(parts, "deflection not checked: "+m.NoDeflection)
	}
	return strings.Join(parts, "; ")
}

// sectionDoc is the cross-section check at one position (design).
type sectionDoc struct {
	Class       string     `json:"class"`
	McRd        Num        `json:"Mc_Rd"`
	VcRd        Num        `json:"Vc_Rd"`
	Utilisation Num        `json:"utilisation"`
	Check       string     `json:"check"`
	Pairing     string     `json:"pairing"`
	Checks      []CheckDoc `json:"checks"`
}

func sectionChecks(r beam.SectionResult) []CheckDoc {
	out := []CheckDoc{}
	for _, c := range r.Checks {
		var in []string
		for _, i := range c.Inputs {
			in = append(in, fmt.Sprintf("%s = %s %s", i.Name, Number(i.Value), i.Unit))
		}
		unit, f := outputUnit(c.Unit)
		out = append(out, CheckDoc{ID: "member." + c.ID, Clause: c.Clause, State: "ULS", Demand: Num(c.Demand * f), Resistance: Num(c.Resistance * f),
			Unit: unit, Utilisation: Num(c.Utilisation), Pass: c.Pass, Formula: c.Formula, Substituted: strings.Join(in, "; ")})
	}
	return out
}

// outputUnit is the output unit of a value in an internal unit, and the factor to it.
func outputUnit(internal string) (string, float64) {
	switch internal {
	case "N·mm":
		return "kNm", ToKNm
	case "N":
		return "kN", ToKN
	}
	return internal, 1
}
