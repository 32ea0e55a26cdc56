package main

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"github.com/spf13/cobra"

	"spanbreak/optimise"
	"spanbreak/plots/encode"
	"spanbreak/splice"
)

// designOptions are the inputs of `spanbreak design`.
type designOptions struct {
	JobFile       string  // job file; "" for the direct mode
	At            float64 // position along the beam [mm]
	AtSet         bool    // --at was given
	Section       string  // catalogue name, or "welded HxBxTWxTF" [mm]
	Grade         string  // beam steel grade
	PlateGrade    string  // cover plate grade; "" means the beam's
	ULS           string  // "M=..,V=..,N=.." [kNm, kN]
	SLS           string  // same keys; "" when none
	SpliceFile    string  // check this fixed splice instead of sizing
	Format        string  // text | json | csv (the checks)
	Category      string  // A | B | C (sizing, direct mode)
	FrictionClass string  // A..D (sizing, categories B and C)
	Distribution  string  // proportional | flanges-only
	Gap           float64 // between the beam ends [mm] (sizing, direct mode)
}

func newDesignCommand(run func(designOptions, streams) error, ios streams) *cobra.Command {
	opts := designOptions{}
	cmd := &cobra.Command{
		Use:   "design [JOB.yaml --at X] | --section NAME --grade GRADE --uls M=..,V=..,N=..",
		Short: "Size the cheapest bolted cover-plate splice at a position, or check a given one",
		Long: `design sizes the cheapest bolted cover-plate splice (EN 1993-1-8) that passes every check
for the forces at one position, or with --splice checks a fixed splice, and prints a
calculation sheet: each check with its clause, the formula with the numbers in, the result,
the utilisation and pass or fail; then the governing check, the quantities and the cost.

Forces come from a job file at --at X (m), or directly: --uls and --sls take M in kNm and V,
N in kN as "M=350,V=120,N=-40"; M (or N) sets both extremes, or give M_max, M_min, N_max,
N_min separately. M is positive sagging, N positive in tension. Both signs of the moment are
always checked. A position inside one of the job's keep-out zones is designed all the same,
with a note naming the zone (its reason and job-file key) before the design forces.

` + caution,
		Args: argsUsage(cobra.MaximumNArgs(1)),
		RunE: func(cmd *cobra.Command, args []string) error {
			if len(args) == 1 {
				opts.JobFile = args[0]
			}
			opts.AtSet = cmd.Flags().Changed("at")
			return run(opts, ios.of(cmd))
		},
	}
	f := cmd.Flags()
	lengthVar(f, &opts.At, "at", position, 0, "position along the beam [m, or with a unit: \"9000 mm\"] (job mode; with direct forces it only labels the sheet)")
	f.StringVar(&opts.Section, "section", "", `beam section: catalogue name ("IPE 500") or "welded HxBxTWxTF" in mm`)
	f.StringVar(&opts.Grade, "grade", "S355", "beam steel grade")
	f.StringVar(&opts.PlateGrade, "plate-grade", "", "cover plate steel grade (default: the beam's)")
	f.StringVar(&opts.ULS, "uls", "", "ULS design forces, e.g. M=400,V=300,N=-150 (kNm, kN)")
	f.StringVar(&opts.SLS, "sls", "", "SLS design forces, same keys (for slip at SLS, category B)")
	f.StringVar(&opts.SpliceFile, "splice", "", "check this splice file instead of sizing one")
	f.StringVar(&opts.Format, "format", "text", "output format: text, json or csv (csv: one row per check)")
	f.StringVar(&opts.Category, "category", "A", "sizing: A bearing, B slip-resistant at SLS, C slip-resistant at ULS")
	f.StringVar(&opts.FrictionClass, "friction-class", "A", "sizing: friction class of the faying surfaces, A to D (categories B and C)")
	f.StringVar(&opts.Distribution, "distribution", "proportional", "sharing of M and N: proportional or flanges-only")
	lengthVar(f, &opts.Gap, "gap", size, splice.DefaultGap, "sizing: gap between the beam ends [mm, or with a unit]")
	return cmd
}

// runDesign sizes or checks the splice and writes the sheet; nothing is written on error.
func runDesign(opts designOptions, ios streams) error {
	w := ios.Out
	if err := checkFormat(opts.Format, "text", "json", "csv"); err != nil {
		return err
	}
	var fixed *splice.Geometry
	if opts.SpliceFile != "" {
		g, err := loadSplice(opts.SpliceFile)
		if err != nil {
			return err
		}
		fixed = &g
	}
	var o *optimise.DesignOutcome
	var err error
	if opts.JobFile != "" {
		o, err = designFromJob(opts, fixed)
	} else {
		o, err = designDirect(opts, fixed)
	}
	if err != nil {
		return settingError(err)
	}
	var buf bytes.Buffer
	write := encode.WriteDesign
	if opts.Format == "csv" {
		write = func(w io.Writer, _ string, o *optimise.DesignOutcome) error { return encode.WriteDesignCSV(w, o) }
	}
	if err := write(&buf, opts.Format, o); err != nil {
		return err
	}
	if _, err := w.Write(buf.Bytes()); err != nil {
		return err
	}
	if r := o.Result; !r.Pass {
		what := "the splice fails"
		if r.Status == splice.NoFeasible {
			what = "no splice in the design space passes"
		}
		if r.Governing.Impossible != "" {
			return infeasibleError(fmt.Errorf("%s: governing %s (%s): not possible, %s",
				what, r.Governing.ID, r.Governing.Clause, r.Governing.Impossible))
		}
		return infeasibleError(fmt.Errorf("%s: governing %s (%s) at utilisation %.3f",
			what, r.Governing.ID, r.Governing.Clause, r.Utilisation))
	}
	return nil
}

// clipped shortens a value echoed in a message to 40 characters.
func clipped(s string) string {
	if r := []rune(s); len(r) > 40 {
		return string(r[:40]) + "…"
	}
	return s
}

// designFromJob designs at --at with the job's envelopes and splice options.
func designFromJob(opts designOptions, fixed *splice.Geometry) (*optimise.DesignOutcome, error) {
	if !opts.AtSet {
		return nil, usageError(errors.New("design: with a job file, give the position with --at X (m)"))
	}
	for _, direct := range []string{opts.Section, opts.ULS, opts.SLS} {
		if direct != "" {
			return nil, usageError(errors.New("design: --section, --uls and --sls are for the direct mode; a job file gives the section and forces"))
		}
	}
	setup, err := loadSetup(opts.JobFile, false)
	if err != nil {
		return nil, err
	}
	return optimise.DesignAt(setup, opts.At, fixed, opts.SpliceFile)
}

// designDirect designs for --section, --grade, --uls and --sls.
func designDirect(opts designOptions, fixed *splice.Geometry) (*optimise.DesignOutcome, error) {
	if strings.TrimSpace(opts.Section) == "" {
		return nil, usageError(errors.New("design: give a job file and --at, or --section with --uls"))
	}
	if strings.TrimSpace(opts.ULS) == "" {
		return nil, usageError(errors.New("design: --uls is required with --section (e.g. --uls M=400,V=300,N=0)"))
	}
	spec := optimise.DirectSpec{Section: opts.Section, Grade: opts.Grade, PlateGrade: opts.PlateGrade,
		Category: opts.Category, FrictionClass: opts.FrictionClass, Distribution: opts.Distribution, Gap: opts.Gap}
	var err error
	if spec.ULS, err = parseDesignForces(opts.ULS); err != nil {
		return nil, usageError(fmt.Errorf("--uls: %w", err))
	}
	if strings.TrimSpace(opts.SLS) != "" {
		f, err := parseDesignForces(opts.SLS)
		if err != nil {
			return nil, usageError(fmt.Errorf("--sls: %w", err))
		}
		spec.SLS = &f
	}
	if opts.AtSet {
		x := opts.At / 1e3 // the sheet's position is in m
		spec.Position = &x
	}
	return optimise.DirectDesign(spec, fixed, opts.SpliceFile)
}

// parseDesignForces reads "M=400,V=300,N=-150" (kNm, kN): M sets M_max and M_min, N sets
// N_max and N_min; M_max, M_min, N_max, N_min set one extreme; an absent key is 0. A value may
// carry its unit ("400kNm", "300 kN"). A value must be a finite number within the plausible
// magnitudes of the job file's loads (optimise.MaxDirectMoment, MaxDirectForce).
func parseDesignForces(s string) (splice.Forces, error) {
	var f splice.Forces
	seen := map[string]bool{}
	for _, item := range strings.Split(s, ",") {
		item = strings.TrimSpace(item)
		if item == "" {
			continue
		}
		key, val, ok := strings.Cut(item, "=")
		if !ok {
			return f, fmt.Errorf("%q: want KEY=VALUE, e.g. M=400", item)
		}
		k := strings.ToLower(strings.ReplaceAll(strings.TrimSpace(key), "_", ""))
		unit := "kn"
		if strings.HasPrefix(k, "m") {
			unit = "knm"
		}
		targets := map[string][]*float64{
			"m": {&f.MMax, &f.MMin}, "mmax": {&f.MMax}, "mmin": {&f.MMin}, "v": {&f.V},
			"n": {&f.NMax, &f.NMin}, "nmax": {&f.NMax}, "nmin": {&f.NMin},
		}[k]
		if targets == nil {
			return f, fmt.Errorf("unknown key %q (keys: M, M_max, M_min, V, N, N_max, N_min)", strings.TrimSpace(key))
		}
		unitName, limit := "kN", optimise.MaxDirectForce/1e3 // [kN]
		if unit == "knm" {
			unitName, limit = "kNm", optimise.MaxDirectMoment/1e6 // [kNm]
		}
		num := strings.TrimSpace(val)
		if low := strings.ToLower(num); strings.HasSuffix(low, unit) {
			num = strings.TrimSpace(num[:len(num)-len(unit)])
		}
		v, err := strconv.ParseFloat(num, 64)
		switch {
		case (err != nil && !errors.Is(err, strconv.ErrRange)) || math.IsNaN(v):
			return f, fmt.Errorf("%s = %q is not a number in %s", strings.TrimSpace(key), clipped(strings.TrimSpace(val)), unitName)
		case err == nil && math.IsInf(v, 0):
			return f, fmt.Errorf("%s = %q is not a finite number in %s", strings.TrimSpace(key), clipped(strings.TrimSpace(val)), unitName)
		}
		if !(math.Abs(v) <= limit) { // an infinity or a number too large for float64 included
			return f, fmt.Errorf("%s = %s %s is outside the plausible range (magnitude at most %s %s); check the value and its unit",
				strings.TrimSpace(key), clipped(num), unitName, short(limit), unitName)
		}
		for _, other := range map[string][]string{"m": {"mmax", "mmin"}, "mmax": {"m"}, "mmin": {"m"}, "n": {"nmax", "nmin"}, "nmax": {"n"}, "nmin": {"n"}}[k] {
			if seen[other] {
				return f, fmt.Errorf("%s given twice (M sets both M_max and M_min, N both N_max and N_min)", strings.TrimSpace(key))
			}
		}
		if seen[k] {
			return f, fmt.Errorf("%s given twice", strings.TrimSpace(key))
		}
		seen[k] = true
		scale := 1e3 // kN → N
		if unit == "knm" {
			scale = 1e6 // kNm → N·mm
		}
		for _, t := range targets {
			*t = v * scale
		}
	}
	if f.MMax < f.MMin {
		return f, fmt.Errorf("M_max = %g kNm is less than M_min = %g kNm", f.MMax/1e6, f.MMin/1e6)
	}
	if f.NMax < f.NMin {
		return f, fmt.Errorf("N_max = %g kN is less than N_min = %g kN", f.NMax/1e3, f.NMin/1e3)
	}
	return f, nil
}
