package encode

import (
	"fmt"
	"io"
	"strings"

	"spanbreak/beam"
	"spanbreak/optimise"
	"spanbreak/optimise/forcetable"
)

// AnalysisUnits are the units of the analyse documents.
func AnalysisUnits() map[string]string {
	return map[string]string{
		"x": "m", "length": "m", "M": "kNm", "V": "kN", "N": "kN", "w": "mm",
		"Fz": "kN", "Fx": "kN", "My": "kNm",
		"signs": "M sagging +, V = dM/dx, N tension +, w downward +, Fz upward +, My clockwise +",
	}
}

func stationXs(st []beam.Station) []Num {
	out := make([]Num, len(st))
	for i, s := range st {
		out[i] = Num(s.X * ToM)
	}
	return out
}

func sides(st []beam.Station) []string {
	out := make([]string, 0, len(st))
	for _, s := range st {
		out = append(out, SideName(s.Side))
	}
	return out
}

// SideName is "left" or "right": which side of a jump a station's values are.
func SideName(s beam.Side) string {
	if s == beam.Left {
		return "left"
	}
	return "right"
}

// WriteAnalysis writes an analysis in a format: "json", "csv" or "text".
func WriteAnalysis(w io.Writer, format string, o *optimise.BeamOutcome) error {
	if format != "json" && format != "csv" {
		w = TextWriter(w)
	}
	if o.Case != nil {
		return writeCase(w, format, o.Setup, *o.Case)
	}
	return writeEnvelopes(w, format, o.Setup, o.Envelopes, o.Member)
}

// --- one case ---------------------------------------------------------------------------

type reactionDoc struct {
	X  Num `json:"x"`
	Fz Num `json:"Fz"`
	Fx Num `json:"Fx"`
	My Num `json:"My"`
}

// CaseDoc is the JSON document of one load case, unfactored.
type CaseDoc struct {
	Input     string            `json:"input"`
	Version   string            `json:"version"`
	Units     map[string]string `json:"units"`
	Length    Num               `json:"length"`
	Stations  []Num             `json:"stations"`
	Sides     []string          `json:"sides"`
	Case      string            `json:"case"`
	M         []Num             `json:"M"`
	V         []Num             `json:"V"`
	N         []Num             `json:"N"`
	W         []Num             `json:"w"`
	Reactions []reactionDoc     `json:"reactions"`
}

func writeCase(w io.Writer, format string, s *optimise.Setup, r beam.CaseResult) error {
	switch format {
	case "json":
		out := CaseDoc{
			Input: s.File, Version: Version(), Units: AnalysisUnits(), Length: Num(s.Model.Length * ToM),
			Stations: stationXs(r.Stations), Sides: sides(r.Stations), Case: r.Case,
			M: Nums(r.Effects.M, ToKNm), V: Nums(r.Effects.V, ToKN), N: Nums(r.Effects.N, ToKN), W: Nums(r.Effects.W, 1),
		}
		for _, rc := range r.Reactions {
			out.Reactions = append(out.Reactions, reactionDoc{Num(rc.X * ToM), Num(rc.Fz * ToKN), Num(rc.Fx * ToKN), Num(rc.My * ToKNm)})
		}
		return WriteJSON(w, out)
	case "csv":
		rows := make([][]Cell, len(r.Stations))
		for i, st := range r.Stations {
			rows[i] = []Cell{Decimal(st.X * ToM), Text(SideName(st.Side)), Decimal(r.Effects.M[i] * ToKNm),
				Decimal(r.Effects.V[i] * ToKN), Decimal(r.Effects.N[i] * ToKN), Decimal(r.Effects.W[i])}
		}
		return WriteCSV(w, []string{"x_m", "side", "M_kNm", "V_kN", "N_kN", "w_mm"}, rows)
	}
	writeBeamHeader(w, s, "load case "+r.Case+", unfactored (characteristic)")
	tw := RightTable(w)
	fmt.Fprintln(tw, "x [m]\t\tM [kNm]\tV [kN]\tN [kN]\tw [mm]\t")
	for i, st := range r.Stations {
		fmt.Fprintf(tw, "%.3f\t%s\t%.2f\t%.2f\t%.2f\t%.2f\t\n", st.X*ToM, sideMark(r.Stations, i),
			Clean(r.Effects.M[i]*ToKNm), Clean(r.Effects.V[i]*ToKN), Clean(r.Effects.N[i]*ToKN), Clean(r.Effects.W[i]))
	}
	tw.Flush()
	fmt.Fprintln(w, "\nSupport reactions")
	tw = RightTable(w)
	fmt.Fprintln(tw, "x [m]\tFz [kN]\tFx [kN]\tMy [kNm]\t")
	for _, rc := range r.Reactions {
		fmt.Fprintf(tw, "%.3f\t%.2f\t%.2f\t%.2f\t\n", rc.X*ToM, Clean(rc.Fz*ToKN), Clean(rc.Fx*ToKN), Clean(rc.My*ToKNm))
	}
	tw.Flush()
	fmt.Fprintf(w, "\n%s\n", Caution)
	return nil
}

// sideMark marks the two values at a jump: "L" just left of x, "R" just right.
func sideMark(st []beam.Station, i int) string {
	dup := (i > 0 && st[i-1].X == st[i].X) || (i+1 < len(st) && st[i+1].X == st[i].X)
	if !dup {
		return ""
	}
	if st[i].Side == beam.Left {
		return "L"
	}
	return "R"
}

// writeBeamHeader prints what was analysed: file, title, beam, supports, cases and combinations.
func writeBeamHeader(w io.Writer, s *optimise.Setup, what string) {
	fmt.Fprintf(w, "spanbreak %s: %s\n", Version(), what)
	fmt.Fprintf(w, "Input:    %s\n", Printable(s.File))
	if s.Title != "" {
		fmt.Fprintf(w, "Title:    %s\n", Printable(s.Title))
	}
	sw := "self weight off"
	if s.SelfWeight > 0 {
		sw = fmt.Sprintf("self weight %.3f kN/m", s.SelfWeight)
	}
	fmt.Fprintf(w, "Beam:     %s, %s, length %.3f m, Iy = %.4g cm4, %s\n",
		s.Section.Name, s.Grade.Name, s.Model.Length*ToM, s.Section.Iy/1e4, sw)
	var sup []string
	for _, sp := range s.Model.Supports {
		sup = append(sup, fmt.Sprintf("%.3f m %s", sp.X*ToM, sp.Kind))
	}
	fmt.Fprintf(w, "Supports: %s\n", strings.Join(sup, ", "))
	if len(s.Model.Hinges) > 0 {
		var h []string
		for _, x := range s.Model.Hinges {
			h = append(h, fmt.Sprintf("%.3f m", x*ToM))
		}
		fmt.Fprintf(w, "Hinges:   %s\n", strings.Join(h, ", "))
	}
	if t := s.Table; t != nil {
		fmt.Fprintf(w, "Forces:   imported from %s (%s table, %d rows, SHA-256 %s); the beam analysis was not run;\n", t.File, t.Shape, t.Rows, t.SHA256)
		fmt.Fprintf(w, "          the table's own stations, linear between them (exact only at stations)\n")
		fmt.Fprintf(w, "Units:    x m, M kNm (sagging +), V kN (V = dM/dx), N kN (tension +), w mm (downward +)\n\n")
		return
	}
	var cs []string
	for _, c := range s.Cases {
		d := c.Name + " (" + c.Kind.String()
		if c.Pattern {
			d += ", patterned"
		}
		cs = append(cs, d+")")
	}
	fmt.Fprintf(w, "Cases:    %s\n", strings.Join(cs, ", "))
	nU, nS := countStates(s.Combinations)
	fmt.Fprintf(w, "Combinations: %d ULS (EN 1990 %s), %d SLS (%s); γG,sup %.2f, γG,inf %.2f, γQ %.2f\n",
		nU, s.Rules.ULS, nS, s.Rules.SLS, s.Rules.GammaGSup, s.Rules.GammaGInf, s.Rules.GammaQ)
	fmt.Fprintf(w, "Units:    x m, M kNm (sagging +), V kN (V = dM/dx), N kN (tension +), w mm (downward +)\n\n")
}

// countStates counts the ULS and the SLS combinations.
func countStates(cs []beam.Combination) (uls, sls int) {
	for _, c := range cs {
		if c.State == beam.ULS {
			uls++
		} else {
			sls++
		}
	}
	return uls, sls
}

// --- envelopes --------------------------------------------------------------------------

type envelopeDoc struct {
	MMax      []Num               `json:"M_max"`
	MMin      []Num               `json:"M_min"`
	VMax      []Num               `json:"V_max"`
	VMin      []Num               `json:"V_min"`
	NMax      []Num               `json:"N_max"`
	NMin      []Num               `json:"N_min"`
	WMax      []Num               `json:"w_max"`
	WMin      []Num               `json:"w_min"`
	Governing map[string][]string `json:"governing"`
	Reactions []reactionEnvDoc    `json:"reactions"`
}

type reactionEnvDoc struct {
	X        Num    `json:"x"`
	FzMax    Num    `json:"Fz_max"`
	FzMin    Num    `json:"Fz_min"`
	FxMax    Num    `json:"Fx_max"`
	FxMin    Num    `json:"Fx_min"`
	MyMax    Num    `json:"My_max"`
	MyMin    Num    `json:"My_min"`
	FzMaxGov string `json:"Fz_max_governing"`
	FzMinGov string `json:"Fz_min_governing"`
}

// EnvelopesDoc is the JSON document of the envelopes (DESIGN.md section 7).
type EnvelopesDoc struct {
	Input        string            `json:"input"`
	Version      string            `json:"version"`
	Units        map[string]string `json:"units"`
	Length       Num               `json:"length"`
	Stations     []Num             `json:"stations"`
	Sides        []string          `json:"sides"`
	Combinations []string          `json:"combinations"`
	ULS          envelopeDoc       `json:"uls"`
	SLS          envelopeDoc       `json:"sls"`
	Member       *MemberDoc        `json:"member"`
	Deflection   []DeflectionDoc   `json:"deflection"`
}

func extremes(ex []beam.Extreme, f float64) []Num {
	out := make([]Num, len(ex))
	for i, e := range ex {
		out[i] = Num(e.Value * f)
	}
	return out
}

func governing(env *beam.Envelopes, ex []beam.Extreme) []string {
	out := make([]string, len(ex))
	for i, e := range ex {
		out[i] = env.Governing(e)
	}
	return out
}

func toEnvelopeDoc(env *beam.Envelopes, e *beam.Envelope, re []beam.ReactionEnvelope) envelopeDoc {
	j := envelopeDoc{
		MMax: extremes(e.MMax, ToKNm), MMin: extremes(e.MMin, ToKNm),
		VMax: extremes(e.VMax, ToKN), VMin: extremes(e.VMin, ToKN),
		NMax: extremes(e.NMax, ToKN), NMin: extremes(e.NMin, ToKN),
		WMax: extremes(e.WMax, 1), WMin: extremes(e.WMin, 1),
		Governing: map[string][]string{
			"M_max": governing(env, e.MMax), "M_min": governing(env, e.MMin),
			"V_max": governing(env, e.VMax), "V_min": governing(env, e.VMin),
		},
	}
	for _, r := range re {
		j.Reactions = append(j.Reactions, reactionEnvDoc{
			X: Num(r.X * ToM), FzMax: Num(r.FzMax.Value * ToKN), FzMin: Num(r.FzMin.Value * ToKN),
			FxMax: Num(r.FxMax.Value * ToKN), FxMin: Num(r.FxMin.Value * ToKN),
			MyMax: Num(r.MyMax.Value * ToKNm), MyMin: Num(r.MyMin.Value * ToKNm),
			FzMaxGov: env.Governing(r.FzMax), FzMinGov: env.Governing(r.FzMin),
		})
	}
	return j
}

func writeEnvelopes(w io.Writer, format string, s *optimise.Setup, env *beam.Envelopes, m *optimise.MemberChecks) error {
	switch format {
	case "json":
		out := EnvelopesDoc{
			Input: s.File, Version: Version(), Units: AnalysisUnits(), Length: Num(s.Model.Length * ToM),
			Stations: stationXs(env.Stations), Sides: sides(env.Stations),
			ULS: toEnvelopeDoc(env, &env.ULS, env.ULSReactions),
			SLS: toEnvelopeDoc(env, &env.SLS, env.SLSReactions),
		}
		if m != nil {
			out.Member, out.Deflection = ptr(Member(m)), Deflections(m)
		}
		for _, c := range env.Combinations {
			out.Combinations = append(out.Combinations, c.Name)
		}
		return WriteJSON(w, out)
	case "csv":
		// the envelope table a job can import back (optimise/forcetable)
		return forcetable.WriteEnvelopes(w, env)
	}
	writeEnvelopeText(w, s, env, m)
	return nil
}

func writeEnvelopeText(w io.Writer, s *optimise.Setup, env *beam.Envelopes, m *optimise.MemberChecks) {
	writeBeamHeader(w, s, "beam analysis, ULS and SLS envelopes")
	st := env.Stations
	u, l := &env.ULS, &env.SLS
	fmt.Fprintln(w, "ULS envelope")
	tw := RightTable(w)
	fmt.Fprintln(tw, "x [m]\t\tM max [kNm]\tM min [kNm]\tV max [kN]\tV min [kN]\tN max [kN]\tN min [kN]\t")
	for i := range st {
		fmt.Fprintf(tw, "%.3f\t%s\t%.1f\t%.1f\t%.1f\t%.1f\t%.1f\t%.1f\t\n", st[i].X*ToM, sideMark(st, i),
			Clean(u.MMax[i].Value*ToKNm), Clean(u.MMin[i].Value*ToKNm), Clean(u.VMax[i].Value*ToKN), Clean(u.VMin[i].Value*ToKN),
			Clean(u.NMax[i].Value*ToKN), Clean(u.NMin[i].Value*ToKN))
	}
	tw.Flush()
	fmt.Fprintf(w, "\nSLS envelope (%s)\n", s.Rules.SLS)
	tw = RightTable(w)
	fmt.Fprintln(tw, "x [m]\t\tM max [kNm]\tM min [kNm]\tw max [mm]\tw min [mm]\t")
	for i := range st {
		fmt.Fprintf(tw, "%.3f\t%s\t%.1f\t%.1f\t%.2f\t%.2f\t\n", st[i].X*ToM, sideMark(st, i),
			Clean(l.MMax[i].Value*ToKNm), Clean(l.MMin[i].Value*ToKNm), Clean(l.WMax[i].Value), Clean(l.WMin[i].Value))
	}
	tw.Flush()
	fmt.Fprintln(w, "\nSupport reactions [kN]")
	tw = Table(w)
	fmt.Fprintln(tw, "x [m]\tULS Fz max\tULS Fz min\tSLS Fz max\tSLS Fz min\tgoverning ULS max")
	for i, r := range env.ULSReactions {
		sr := env.SLSReactions[i]
		fmt.Fprintf(tw, "%.3f\t%.1f\t%.1f\t%.1f\t%.1f\t%s\n", r.X*ToM, Clean(r.FzMax.Value*ToKN), Clean(r.FzMin.Value*ToKN),
			Clean(sr.FzMax.Value*ToKN), Clean(sr.FzMin.Value*ToKN), env.Governing(r.FzMax))
	}
	tw.Flush()
	fmt.Fprintln(w, "\nExtremes and what governs them")
	tw = Table(w)
	extreme := func(label string, ex []beam.Extreme, f float64, unit string, seekMax bool) {
		if len(ex) == 0 {
			return
		}
		best := 0
		for i := range ex {
			if (seekMax && ex[i].Value > ex[best].Value) || (!seekMax && ex[i].Value < ex[best].Value) {
				best = i
			}
		}
		fmt.Fprintf(tw, "%s\t%+.1f %s\tat x = %.3f m\t%s\n", label, Clean(ex[best].Value*f), unit, st[best].X*ToM, env.Governing(ex[best]))
	}
	extreme("ULS M max (sagging)", u.MMax, ToKNm, "kNm", true)
	extreme("ULS M min (hogging)", u.MMin, ToKNm, "kNm", false)
	extreme("ULS V max", u.VMax, ToKN, "kN", true)
	extreme("ULS V min", u.VMin, ToKN, "kN", false)
	extreme("SLS w max (down)", l.WMax, 1, "mm", true)
	extreme("SLS w min (up)", l.WMin, 1, "mm", false)
	tw.Flush()
	if m != nil {
		writeMemberText(w, m)
	}
	fmt.Fprintf(w, "\n%s\n", Caution)
}
