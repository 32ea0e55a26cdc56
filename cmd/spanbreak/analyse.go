package main

import (
	"bytes"
	"encoding/csv"
	"encoding/json"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
	"text/tabwriter"

	"github.com/spf13/cobra"

	"spanbreak/beam"
	"spanbreak/optimise"
)

// analyseOptions are the inputs of `spanbreak analyse`.
type analyseOptions struct {
	JobFile string    // path of the job file; "" with Demo
	Demo    bool      // analyse the embedded demo job instead of a file
	Format  string    // text | json | csv
	Step    float64   // station spacing [m]
	At      []float64 // stations [m]; overrides Step when given
	Case    string    // one load case, unfactored
}

func newAnalyseCommand() *cobra.Command {
	opts := analyseOptions{}
	cmd := &cobra.Command{
		Use:   "analyse JOB.yaml",
		Short: "Exact ULS/SLS envelopes of M, V, N and deflection along the beam",
		Long: `analyse solves the beam of a job file for every load case and prints the exact ULS and
SLS envelopes over every EN 1990 combination and every span-by-span pattern of the patterned
cases, with the combination and pattern that govern each extreme, and the support reactions.
With --case it prints one load case, unfactored.`,
		Args: argsUsage(cobra.ExactArgs(1)),
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.JobFile = args[0]
			return runAnalyse(opts, cmd.OutOrStdout())
		},
	}
	f := cmd.Flags()
	f.StringVar(&opts.Format, "format", "text", "output format: text, json or csv")
	f.Float64Var(&opts.Step, "step", 0.25, "station spacing along the beam [m]")
	f.Float64SliceVar(&opts.At, "at", nil, "evaluate only at these positions [m], e.g. --at 1.5,3.0")
	f.StringVar(&opts.Case, "case", "", "print one load case, unfactored")
	return cmd
}

// runAnalyse analyses the job and writes the result; nothing is written on error.
func runAnalyse(opts analyseOptions, w io.Writer) error {
	if err := checkFormat(opts.Format, "text", "json", "csv"); err != nil {
		return err
	}
	setup, err := loadSetup(opts.JobFile, opts.Demo)
	if err != nil {
		return err
	}
	an, err := setup.Analyse()
	if err != nil {
		return err
	}
	st, err := stations(an, opts)
	if err != nil {
		return err
	}
	var buf bytes.Buffer
	if opts.Case != "" {
		r, err := an.CaseResult(opts.Case, st)
		if probs, ok := setup.LocateOverflow(err); ok {
			return probs
		}
		if err != nil {
			return usageError(fmt.Errorf("--case: %w", err))
		}
		err = writeCase(&buf, opts.Format, setup, r)
		if err != nil {
			return err
		}
	} else {
		env, err := an.Envelopes(setup.Combinations, st)
		if probs, ok := setup.LocateOverflow(err); ok {
			return probs
		}
		if err != nil {
			return err
		}
		if err := writeEnvelopes(&buf, opts.Format, setup, &env); err != nil {
			return err
		}
	}
	_, err = w.Write(buf.Bytes())
	return err
}

func stations(an *beam.Analysis, opts analyseOptions) ([]beam.Station, error) {
	if len(opts.At) > 0 {
		xs := make([]float64, len(opts.At))
		for i, x := range opts.At {
			xs[i] = x * 1e3
		}
		st, err := an.StationsAt(xs)
		if err != nil {
			return nil, usageError(fmt.Errorf("--at: %w", err))
		}
		return st, nil
	}
	st, err := an.Stations(opts.Step * 1e3)
	if err != nil {
		return nil, usageError(fmt.Errorf("--step: %w", err))
	}
	return st, nil
}

// Output units: positions m, moments kNm, forces kN, deflection mm.
const (
	toM   = 1e-3 // mm → m
	toKN  = 1e-3 // N → kN
	toKNm = 1e-6 // N·mm → kNm
)

var analysisUnits = map[string]string{
	"x": "m", "length": "m", "M": "kNm", "V": "kN", "N": "kN", "w": "mm",
	"Fz": "kN", "Fx": "kN", "My": "kNm",
	"signs": "M sagging +, V = dM/dx, N tension +, w downward +, Fz upward +, My clockwise +",
}

// round keeps JSON and CSV output stable and readable: 6 significant digits after the point
// of the output unit are far below any engineering tolerance.
func round(v float64) float64 {
	if v == 0 || math.IsNaN(v) || math.IsInf(v, 0) {
		return 0
	}
	return math.Round(v*1e6) / 1e6
}

func xs(st []beam.Station) []float64 {
	out := make([]float64, len(st))
	for i, s := range st {
		out[i] = round(s.X * toM)
	}
	return out
}

func scaledRounded(v []float64, f float64) []float64 {
	out := make([]float64, len(v))
	for i, x := range v {
		out[i] = round(x * f)
	}
	return out
}

func sideName(s beam.Side) string {
	if s == beam.Left {
		return "left"
	}
	return "right"
}

// --- one case ---------------------------------------------------------------------------

type jsonReaction struct {
	X  float64 `json:"x"`
	Fz float64 `json:"Fz"`
	Fx float64 `json:"Fx"`
	My float64 `json:"My"`
}

func writeCase(w io.Writer, format string, s *optimise.Setup, r beam.CaseResult) error {
	switch format {
	case "json":
		out := struct {
			Input     string            `json:"input"`
			Version   string            `json:"version"`
			Units     map[string]string `json:"units"`
			Length    float64           `json:"length"`
			Stations  []float64         `json:"stations"`
			Sides     []string          `json:"sides"`
			Case      string            `json:"case"`
			M         []float64         `json:"M"`
			V         []float64         `json:"V"`
			N         []float64         `json:"N"`
			W         []float64         `json:"w"`
			Reactions []jsonReaction    `json:"reactions"`
		}{
			Input: s.File, Version: version(), Units: analysisUnits, Length: round(s.Model.Length * toM),
			Stations: xs(r.Stations), Case: r.Case,
			M: scaledRounded(r.Effects.M, toKNm), V: scaledRounded(r.Effects.V, toKN),
			N: scaledRounded(r.Effects.N, toKN), W: scaledRounded(r.Effects.W, 1),
		}
		for _, st := range r.Stations {
			out.Sides = append(out.Sides, sideName(st.Side))
		}
		for _, rc := range r.Reactions {
			out.Reactions = append(out.Reactions, jsonReaction{round(rc.X * toM), round(rc.Fz * toKN), round(rc.Fx * toKN), round(rc.My * toKNm)})
		}
		return writeJSON(w, out)
	case "csv":
		cw := csv.NewWriter(w)
		_ = cw.Write([]string{"x_m", "side", "M_kNm", "V_kN", "N_kN", "w_mm"})
		for i, st := range r.Stations {
			_ = cw.Write([]string{num(st.X * toM), sideName(st.Side), num(r.Effects.M[i] * toKNm),
				num(r.Effects.V[i] * toKN), num(r.Effects.N[i] * toKN), num(r.Effects.W[i])})
		}
		cw.Flush()
		return cw.Error()
	}
	writeHeader(w, s, "load case "+r.Case+", unfactored (characteristic)")
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(tw, "x [m]\t\tM [kNm]\tV [kN]\tN [kN]\tw [mm]\t")
	for i, st := range r.Stations {
		fmt.Fprintf(tw, "%.3f\t%s\t%.2f\t%.2f\t%.2f\t%.2f\t\n", st.X*toM, sideMark(r.Stations, i),
			z(r.Effects.M[i]*toKNm), z(r.Effects.V[i]*toKN), z(r.Effects.N[i]*toKN), z(r.Effects.W[i]))
	}
	tw.Flush()
	fmt.Fprintln(w, "\nSupport reactions")
	tw = tabwriter.NewWriter(w, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(tw, "x [m]\tFz [kN]\tFx [kN]\tMy [kNm]\t")
	for _, rc := range r.Reactions {
		fmt.Fprintf(tw, "%.3f\t%.2f\t%.2f\t%.2f\t\n", rc.X*toM, z(rc.Fz*toKN), z(rc.Fx*toKN), z(rc.My*toKNm))
	}
	tw.Flush()
	fmt.Fprintf(w, "\n%s\n", caution)
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

func num(v float64) string { return strconv.FormatFloat(round(v), 'f', -1, 64) }

// z wraps a value for text output so that a value that prints as zero never shows "-0.0".
func z(v float64) cleanFloat { return cleanFloat(v) }

// cleanFloat formats like a float64 with the verbs f, e and g, without a negative zero.
type cleanFloat float64

func (c cleanFloat) Format(f fmt.State, verb rune) {
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

func writeJSON(w io.Writer, v any) error {
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(v)
}

// writeHeader prints what was analysed: file, title, beam, supports, cases and combinations.
func writeHeader(w io.Writer, s *optimise.Setup, what string) {
	fmt.Fprintf(w, "spanbreak %s: %s\n", version(), what)
	fmt.Fprintf(w, "Input:    %s\n", s.File)
	if s.Job.Title != "" {
		fmt.Fprintf(w, "Title:    %s\n", s.Job.Title)
	}
	sw := "self weight off"
	if s.Job.Beam.IncludesSelfWeight() {
		sw = fmt.Sprintf("self weight %.3f kN/m", s.SelfWeight())
	}
	fmt.Fprintf(w, "Beam:     %s, %s, length %.3f m, Iy = %.4g cm4, %s\n",
		s.Section.Name, s.Grade.Name, s.Model.Length*toM, s.Section.Iy/1e4, sw)
	var sup []string
	for _, sp := range s.Model.Supports {
		sup = append(sup, fmt.Sprintf("%.3f m %s", sp.X*toM, sp.Kind))
	}
	fmt.Fprintf(w, "Supports: %s\n", strings.Join(sup, ", "))
	if len(s.Model.Hinges) > 0 {
		var h []string
		for _, x := range s.Model.Hinges {
			h = append(h, fmt.Sprintf("%.3f m", x*toM))
		}
		fmt.Fprintf(w, "Hinges:   %s\n", strings.Join(h, ", "))
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
	nU, nS := 0, 0
	for _, c := range s.Combinations {
		if c.State == beam.ULS {
			nU++
		} else {
			nS++
		}
	}
	fmt.Fprintf(w, "Combinations: %d ULS (EN 1990 %s), %d SLS (%s); γG,sup %.2f, γG,inf %.2f, γQ %.2f\n",
		nU, s.Rules.ULS, nS, s.Rules.SLS, s.Rules.GammaGSup, s.Rules.GammaGInf, s.Rules.GammaQ)
	fmt.Fprintf(w, "Units:    x m, M kNm (sagging +), V kN (V = dM/dx), N kN (tension +), w mm (downward +)\n\n")
}

// --- envelopes --------------------------------------------------------------------------

type jsonEnvelope struct {
	MMax      []float64           `json:"M_max"`
	MMin      []float64           `json:"M_min"`
	VMax      []float64           `json:"V_max"`
	VMin      []float64           `json:"V_min"`
	NMax      []float64           `json:"N_max"`
	NMin      []float64           `json:"N_min"`
	WMax      []float64           `json:"w_max"`
	WMin      []float64           `json:"w_min"`
	Governing map[string][]string `json:"governing"`
	Reactions []jsonReactionEnv   `json:"reactions"`
}

type jsonReactionEnv struct {
	X        float64 `json:"x"`
	FzMax    float64 `json:"Fz_max"`
	FzMin    float64 `json:"Fz_min"`
	FxMax    float64 `json:"Fx_max"`
	FxMin    float64 `json:"Fx_min"`
	MyMax    float64 `json:"My_max"`
	MyMin    float64 `json:"My_min"`
	FzMaxGov string  `json:"Fz_max_governing"`
	FzMinGov string  `json:"Fz_min_governing"`
}

func values(ex []beam.Extreme, f float64) []float64 {
	out := make([]float64, len(ex))
	for i, e := range ex {
		out[i] = round(e.Value * f)
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

func toJSONEnvelope(env *beam.Envelopes, e *beam.Envelope, re []beam.ReactionEnvelope) jsonEnvelope {
	j := jsonEnvelope{
		MMax: values(e.MMax, toKNm), MMin: values(e.MMin, toKNm),
		VMax: values(e.VMax, toKN), VMin: values(e.VMin, toKN),
		NMax: values(e.NMax, toKN), NMin: values(e.NMin, toKN),
		WMax: values(e.WMax, 1), WMin: values(e.WMin, 1),
		Governing: map[string][]string{
			"M_max": governing(env, e.MMax), "M_min": governing(env, e.MMin),
			"V_max": governing(env, e.VMax), "V_min": governing(env, e.VMin),
		},
	}
	for _, r := range re {
		j.Reactions = append(j.Reactions, jsonReactionEnv{
			X: round(r.X * toM), FzMax: round(r.FzMax.Value * toKN), FzMin: round(r.FzMin.Value * toKN),
			FxMax: round(r.FxMax.Value * toKN), FxMin: round(r.FxMin.Value * toKN),
			MyMax: round(r.MyMax.Value * toKNm), MyMin: round(r.MyMin.Value * toKNm),
			FzMaxGov: env.Governing(r.FzMax), FzMinGov: env.Governing(r.FzMin),
		})
	}
	return j
}

func writeEnvelopes(w io.Writer, format string, s *optimise.Setup, env *beam.Envelopes) error {
	switch format {
	case "json":
		var names []string
		for _, c := range env.Combinations {
			names = append(names, c.Name)
		}
		out := struct {
			Input        string            `json:"input"`
			Version      string            `json:"version"`
			Units        map[string]string `json:"units"`
			Length       float64           `json:"length"`
			Stations     []float64         `json:"stations"`
			Sides        []string          `json:"sides"`
			Combinations []string          `json:"combinations"`
			ULS          jsonEnvelope      `json:"uls"`
			SLS          jsonEnvelope      `json:"sls"`
		}{
			Input: s.File, Version: version(), Units: analysisUnits, Length: round(s.Model.Length * toM),
			Stations: xs(env.Stations), Combinations: names,
			ULS: toJSONEnvelope(env, &env.ULS, env.ULSReactions),
			SLS: toJSONEnvelope(env, &env.SLS, env.SLSReactions),
		}
		for _, st := range env.Stations {
			out.Sides = append(out.Sides, sideName(st.Side))
		}
		return writeJSON(w, out)
	case "csv":
		cw := csv.NewWriter(w)
		_ = cw.Write([]string{"x_m", "side",
			"uls_M_max_kNm", "uls_M_min_kNm", "uls_V_max_kN", "uls_V_min_kN", "uls_N_max_kN", "uls_N_min_kN",
			"sls_M_max_kNm", "sls_M_min_kNm", "sls_w_max_mm", "sls_w_min_mm",
			"uls_M_max_governing", "uls_M_min_governing"})
		u, l := &env.ULS, &env.SLS
		for i, st := range env.Stations {
			_ = cw.Write([]string{num(st.X * toM), sideName(st.Side),
				num(u.MMax[i].Value * toKNm), num(u.MMin[i].Value * toKNm), num(u.VMax[i].Value * toKN), num(u.VMin[i].Value * toKN),
				num(u.NMax[i].Value * toKN), num(u.NMin[i].Value * toKN),
				num(l.MMax[i].Value * toKNm), num(l.MMin[i].Value * toKNm), num(l.WMax[i].Value), num(l.WMin[i].Value),
				env.Governing(u.MMax[i]), env.Governing(u.MMin[i])})
		}
		cw.Flush()
		return cw.Error()
	}
	writeEnvelopeText(w, s, env)
	return nil
}

func writeEnvelopeText(w io.Writer, s *optimise.Setup, env *beam.Envelopes) {
	writeHeader(w, s, "beam analysis, ULS and SLS envelopes")
	st := env.Stations
	u, l := &env.ULS, &env.SLS
	fmt.Fprintln(w, "ULS envelope")
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(tw, "x [m]\t\tM max [kNm]\tM min [kNm]\tV max [kN]\tV min [kN]\tN max [kN]\tN min [kN]\t")
	for i := range st {
		fmt.Fprintf(tw, "%.3f\t%s\t%.1f\t%.1f\t%.1f\t%.1f\t%.1f\t%.1f\t\n", st[i].X*toM, sideMark(st, i),
			z(u.MMax[i].Value*toKNm), z(u.MMin[i].Value*toKNm), z(u.VMax[i].Value*toKN), z(u.VMin[i].Value*toKN),
			z(u.NMax[i].Value*toKN), z(u.NMin[i].Value*toKN))
	}
	tw.Flush()
	fmt.Fprintf(w, "\nSLS envelope (%s)\n", s.Rules.SLS)
	tw = tabwriter.NewWriter(w, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(tw, "x [m]\t\tM max [kNm]\tM min [kNm]\tw max [mm]\tw min [mm]\t")
	for i := range st {
		fmt.Fprintf(tw, "%.3f\t%s\t%.1f\t%.1f\t%.2f\t%.2f\t\n", st[i].X*toM, sideMark(st, i),
			z(l.MMax[i].Value*toKNm), z(l.MMin[i].Value*toKNm), z(l.WMax[i].Value), z(l.WMin[i].Value))
	}
	tw.Flush()
	fmt.Fprintln(w, "\nSupport reactions [kN]")
	tw = tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	fmt.Fprintln(tw, "x [m]\tULS Fz max\tULS Fz min\tSLS Fz max\tSLS Fz min\tgoverning ULS max")
	for i, r := range env.ULSReactions {
		sr := env.SLSReactions[i]
		fmt.Fprintf(tw, "%.3f\t%.1f\t%.1f\t%.1f\t%.1f\t%s\n", r.X*toM, z(r.FzMax.Value*toKN), z(r.FzMin.Value*toKN),
			z(sr.FzMax.Value*toKN), z(sr.FzMin.Value*toKN), env.Governing(r.FzMax))
	}
	tw.Flush()
	fmt.Fprintln(w, "\nExtremes and what governs them")
	tw = tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
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
		fmt.Fprintf(tw, "%s\t%+.1f %s\tat x = %.3f m\t%s\n", label, z(ex[best].Value*f), unit, st[best].X*toM, env.Governing(ex[best]))
	}
	extreme("ULS M max (sagging)", u.MMax, toKNm, "kNm", true)
	extreme("ULS M min (hogging)", u.MMin, toKNm, "kNm", false)
	extreme("ULS V max", u.VMax, toKN, "kN", true)
	extreme("ULS V min", u.VMin, toKN, "kN", false)
	extreme("SLS w max (down)", l.WMax, 1, "mm", true)
	extreme("SLS w min (up)", l.WMin, 1, "mm", false)
	tw.Flush()
	fmt.Fprintf(w, "\n%s\n", caution)
}
