package main

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
	"text/tabwriter"

	"github.com/spf13/cobra"

	"spanbreak/beam"
	"spanbreak/optimise"
	"spanbreak/optimise/jobfile"
	"spanbreak/splice"
)

// designOptions are the inputs of `spanbreak design`.
type designOptions struct {
	JobFile       string  // job file; "" for the direct mode
	At            float64 // position along the beam [m]
	AtSet         bool    // --at was given
	Section       string  // catalogue name, or "welded HxBxTWxTF" [mm]
	Grade         string  // beam steel grade
	PlateGrade    string  // cover plate grade; "" means the beam's
	ULS           string  // "M=..,V=..,N=.." [kNm, kN]
	SLS           string  // same keys; "" when none
	SpliceFile    string  // check this fixed splice instead of sizing
	Format        string  // text | json
	Category      string  // A | B | C (sizing, direct mode)
	FrictionClass string  // A..D (sizing, categories B and C)
	Distribution  string  // proportional | flanges-only
	Gap           float64 // between the beam ends [mm] (sizing, direct mode)
}

func newDesignCommand() *cobra.Command {
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
always checked.

` + caution,
		Args: argsUsage(cobra.MaximumNArgs(1)),
		RunE: func(cmd *cobra.Command, args []string) error {
			if len(args) == 1 {
				opts.JobFile = args[0]
			}
			opts.AtSet = cmd.Flags().Changed("at")
			return runDesign(opts, cmd.OutOrStdout())
		},
	}
	f := cmd.Flags()
	f.Float64Var(&opts.At, "at", 0, "position along the beam [m] (job mode; with direct forces it only labels the sheet)")
	f.StringVar(&opts.Section, "section", "", `beam section: catalogue name ("IPE 500") or "welded HxBxTWxTF" in mm`)
	f.StringVar(&opts.Grade, "grade", "S355", "beam steel grade")
	f.StringVar(&opts.PlateGrade, "plate-grade", "", "cover plate steel grade (default: the beam's)")
	f.StringVar(&opts.ULS, "uls", "", "ULS design forces, e.g. M=400,V=300,N=-150 (kNm, kN)")
	f.StringVar(&opts.SLS, "sls", "", "SLS design forces, same keys (for slip at SLS, category B)")
	f.StringVar(&opts.SpliceFile, "splice", "", "check this splice file instead of sizing one")
	f.StringVar(&opts.Format, "format", "text", "output format: text or json")
	f.StringVar(&opts.Category, "category", "A", "sizing: A bearing, B slip-resistant at SLS, C slip-resistant at ULS")
	f.StringVar(&opts.FrictionClass, "friction-class", "A", "sizing: friction class of the faying surfaces, A to D (categories B and C)")
	f.StringVar(&opts.Distribution, "distribution", "proportional", "sharing of M and N: proportional or flanges-only")
	f.Float64Var(&opts.Gap, "gap", splice.DefaultGap, "sizing: gap between the beam ends [mm]")
	return cmd
}

// designCase is what either input mode provides: the splice problem at one position and the
// words for the sheet's header.
type designCase struct {
	Problem    splice.Problem
	Position   *float64 // [m], nil when unknown
	Input      string   // what the forces came from
	Section    string
	Grade      string
	PlateGrade string
}

// runDesign sizes or checks the splice and writes the sheet; nothing is written on error.
func runDesign(opts designOptions, w io.Writer) error {
	if err := checkFormat(opts.Format, "text", "json"); err != nil {
		return err
	}
	var dc designCase
	var err error
	if opts.JobFile != "" {
		dc, err = designCaseFromJob(opts)
	} else {
		dc, err = designCaseDirect(opts)
	}
	if err != nil {
		return err
	}
	var r splice.Result
	if opts.SpliceFile != "" {
		g, err := designLoadSplice(opts.SpliceFile)
		if err != nil {
			return err
		}
		r, err = splice.Verify(dc.Problem, g)
		if err != nil {
			return fmt.Errorf("%s: %w", opts.SpliceFile, err)
		}
	} else {
		r, err = splice.Size(dc.Problem)
		if err != nil {
			return err
		}
	}
	var buf bytes.Buffer
	if opts.Format == "json" {
		err = writeDesignJSON(&buf, dc, r)
	} else {
		err = writeDesignText(&buf, dc, r, opts.SpliceFile)
	}
	if err != nil {
		return err
	}
	if _, err := w.Write(buf.Bytes()); err != nil {
		return err
	}
	if !r.Pass {
		what := "the splice fails"
		if r.Status == splice.NoFeasible {
			what = "no splice in the design space passes"
		}
		return infeasibleError(fmt.Errorf("%s: governing %s (%s) at utilisation %.3f",
			what, r.Governing.ID, r.Governing.Clause, r.Utilisation))
	}
	return nil
}

// designCaseFromJob reads the forces at --at from a job's envelopes (the worse side at a
// jump) and the splice options, rates and plate grade from the job's splice and costs blocks.
func designCaseFromJob(opts designOptions) (designCase, error) {
	if !opts.AtSet {
		return designCase{}, usageError(errors.New("design: with a job file, give the position with --at X (m)"))
	}
	for _, direct := range []string{opts.Section, opts.ULS, opts.SLS} {
		if direct != "" {
			return designCase{}, usageError(errors.New("design: --section, --uls and --sls are for the direct mode; a job file gives the section and forces"))
		}
	}
	setup, err := loadSetup(opts.JobFile, false)
	if err != nil {
		return designCase{}, err
	}
	an, err := setup.Analyse()
	if err != nil {
		return designCase{}, err
	}
	x := opts.At * 1e3
	if !(x >= 0 && x <= setup.Model.Length) {
		return designCase{}, usageError(fmt.Errorf("--at %g m is off the beam (0 to %g m)", opts.At, setup.Model.Length/1e3))
	}
	fs, err := optimise.DesignForces(an, setup.Combinations, []float64{x})
	if probs, ok := setup.LocateOverflow(err); ok {
		return designCase{}, probs
	}
	if err != nil {
		return designCase{}, err
	}
	p, err := setup.SpliceProblem()
	if err != nil {
		return designCase{}, err
	}
	p.Brief = false
	p.ULS = splice.Forces(fs[0].ULS)
	sls := splice.Forces(fs[0].SLS)
	p.SLS = &sls
	pos := opts.At
	plate := setup.Grade.Name
	if sp := setup.Job.Splice; sp != nil && sp.Plates != nil && sp.Plates.Grade != "" {
		plate = sp.Plates.Grade
	}
	return designCase{
		Problem:    p,
		Position:   &pos,
		Input:      fmt.Sprintf("%s, envelopes at x = %.3f m (worse side at a jump)", opts.JobFile, opts.At),
		Section:    setup.Section.Name,
		Grade:      setup.Grade.Name,
		PlateGrade: plate,
	}, nil
}

// designCaseDirect builds the problem from --section, --grade, --uls and --sls.
func designCaseDirect(opts designOptions) (designCase, error) {
	if strings.TrimSpace(opts.Section) == "" {
		return designCase{}, usageError(errors.New("design: give a job file and --at, or --section with --uls"))
	}
	if strings.TrimSpace(opts.ULS) == "" {
		return designCase{}, usageError(errors.New("design: --uls is required with --section (e.g. --uls M=400,V=300,N=0)"))
	}
	sec, err := designSection(opts.Section)
	if err != nil {
		return designCase{}, usageError(fmt.Errorf("--section: %w", err))
	}
	grade, err := beam.LookupGrade(opts.Grade)
	if err != nil {
		return designCase{}, usageError(fmt.Errorf("--grade: %w", err))
	}
	plate := grade
	if strings.TrimSpace(opts.PlateGrade) != "" {
		if plate, err = beam.LookupGrade(opts.PlateGrade); err != nil {
			return designCase{}, usageError(fmt.Errorf("--plate-grade: %w", err))
		}
	}
	uls, err := parseDesignForces(opts.ULS)
	if err != nil {
		return designCase{}, usageError(fmt.Errorf("--uls: %w", err))
	}
	var sls *splice.Forces
	if strings.TrimSpace(opts.SLS) != "" {
		f, err := parseDesignForces(opts.SLS)
		if err != nil {
			return designCase{}, usageError(fmt.Errorf("--sls: %w", err))
		}
		sls = &f
	}
	m, err := splice.NewMember(sec, designSteel(grade))
	if err != nil {
		return designCase{}, err
	}
	dist, err := splice.ParseDistribution(opts.Distribution)
	if err != nil {
		return designCase{}, usageError(fmt.Errorf("--distribution: %w", err))
	}
	z := splice.Sizing{Gap: opts.Gap}
	if opts.SpliceFile == "" {
		if z.Category, err = splice.ParseCategory(opts.Category); err != nil {
			return designCase{}, usageError(fmt.Errorf("--category: %w", err))
		}
		if z.Category.Preloaded() {
			if z.FrictionClass, err = splice.ParseFrictionClass(opts.FrictionClass); err != nil {
				return designCase{}, usageError(fmt.Errorf("--friction-class: %w", err))
			}
		}
	}
	dc := designCase{
		Problem: splice.Problem{Member: m, ULS: uls, SLS: sls, PlateSteel: designSteel(plate), Distribution: dist, Sizing: z},
		Input:   "direct forces (--section, --grade, --uls, --sls)",
		Section: sec.Name, Grade: grade.Name, PlateGrade: plate.Name,
	}
	if opts.AtSet {
		x := opts.At
		dc.Position = &x
	}
	return dc, nil
}

// designSteel adapts a grade to the splice package, with EN 1993-1-1 Table 3.1 strengths.
func designSteel(g beam.Grade) splice.Steel {
	return splice.Steel{Name: g.Name, Strength: func(t float64) (float64, float64, error) { return g.Strength(t, beam.TableEN1993) }}
}

// designSection reads a catalogue name or "welded HxBxTWxTF" [mm].
func designSection(name string) (beam.Section, error) {
	s := strings.TrimSpace(name)
	if rest, ok := strings.CutPrefix(strings.ToLower(s), "welded"); ok {
		parts := strings.FieldsFunc(rest, func(r rune) bool { return r == 'x' || r == '×' || r == ' ' || r == '*' })
		if len(parts) != 4 {
			return beam.Section{}, fmt.Errorf("%q: a welded section is \"welded HxBxTWxTF\" in mm, e.g. \"welded 900x300x12x25\"", name)
		}
		var v [4]float64
		for i, p := range parts {
			f, err := strconv.ParseFloat(p, 64)
			if err != nil {
				return beam.Section{}, fmt.Errorf("%q: %q is not a size in mm", name, p)
			}
			v[i] = f
		}
		return beam.WeldedSection(v[0], v[1], v[2], v[3])
	}
	return beam.LookupSection(s)
}

// parseDesignForces reads "M=400,V=300,N=-150" (kNm, kN): M sets M_max and M_min, N sets
// N_max and N_min; M_max, M_min, N_max, N_min set one extreme; an absent key is 0. A value may
// carry its unit ("400kNm", "300 kN").
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
		num := strings.TrimSpace(val)
		if low := strings.ToLower(num); strings.HasSuffix(low, unit) {
			num = strings.TrimSpace(num[:len(num)-len(unit)])
		}
		v, err := strconv.ParseFloat(num, 64)
		if err != nil || math.IsNaN(v) || math.IsInf(v, 0) {
			return f, fmt.Errorf("%s = %q is not a number in %s", strings.TrimSpace(key), strings.TrimSpace(val), map[string]string{"kn": "kN", "knm": "kNm"}[unit])
		}
		targets := map[string][]*float64{
			"m": {&f.MMax, &f.MMin}, "mmax": {&f.MMax}, "mmin": {&f.MMin}, "v": {&f.V},
			"n": {&f.NMax, &f.NMin}, "nmax": {&f.NMax}, "nmin": {&f.NMin},
		}[k]
		if targets == nil {
			return f, fmt.Errorf("unknown key %q (keys: M, M_max, M_min, V, N, N_max, N_min)", strings.TrimSpace(key))
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

// designLoadSplice reads a splice file (DESIGN.md section 8) into a splice geometry.
func designLoadSplice(path string) (splice.Geometry, error) {
	data, err := readInput(path)
	if err != nil {
		return splice.Geometry{}, err
	}
	sf, err := jobfile.LoadSpliceFile(path, data)
	if err != nil {
		return splice.Geometry{}, err
	}
	return designGeometry(sf), nil
}

// designGeometry converts the decoded file (sizes in mm) to the splice package's geometry.
func designGeometry(sf *jobfile.SpliceFile) splice.Geometry {
	opt := func(v *jobfile.Millimetres) float64 {
		if v == nil {
			return 0
		}
		return v.MM()
	}
	fl, wb := sf.Flange, sf.Web
	g := splice.Geometry{
		Bolt:          splice.Bolt{Size: sf.Bolt.Size, Class: sf.Bolt.Class, ThreadsInShearPlane: sf.Bolt.ThreadsInShear()},
		Category:      splice.Category(strings.ToUpper(strings.TrimSpace(sf.Category))),
		FrictionClass: splice.FrictionClass(strings.ToUpper(strings.TrimSpace(sf.FrictionClass))),
		Holes:         splice.HoleType(sf.Holes),
		Gap:           sf.Gap.MM(),
		Flange: splice.FlangeSplice{
			Outer:   splice.Plate{Thickness: fl.Outer.Thickness.MM(), Width: fl.Outer.Width.MM()},
			Columns: fl.Columns, Rows: fl.Rows, Gauge: fl.Gauge.MM(), Pitch: opt(fl.Pitch),
			End: fl.End.MM(), Edge: fl.Edge.MM(),
		},
		Web: splice.WebSplice{
			Thickness: wb.Thickness.MM(), Depth: wb.Depth.MM(), Columns: wb.Columns, Rows: wb.Rows,
			Pitch: opt(wb.Pitch), Spacing: opt(wb.Spacing), End: wb.End.MM(), Edge: wb.Edge.MM(),
		},
	}
	if fl.Inner != nil {
		g.Flange.Inner = splice.Plate{Thickness: fl.Inner.Thickness.MM(), Width: fl.Inner.Width.MM()}
	}
	return g
}

// --- JSON (DESIGN.md section 7) -----------------------------------------------------------

type designJSON struct {
	Version     string             `json:"version"`
	Input       string             `json:"input"`
	Position    *float64           `json:"position"`
	Section     string             `json:"section"`
	Grade       string             `json:"grade"`
	PlateGrade  string             `json:"plate_grade"`
	Status      string             `json:"status"`
	Pass        bool               `json:"pass"`
	Forces      designForcesJSON   `json:"forces"`
	Splice      designSpliceJSON   `json:"splice"`
	Checks      []designCheckJSON  `json:"checks"`
	Utilisation float64            `json:"utilisation"`
	Governing   string             `json:"governing"`
	Quantities  designQuantityJSON `json:"quantities"`
	Cost        designCostJSON     `json:"cost"`
	Notes       []string           `json:"notes"`
	Caution     string             `json:"caution"`
}

type designForcesJSON struct {
	ULS designForceSetJSON  `json:"uls"`
	SLS *designForceSetJSON `json:"sls"`
}

type designForceSetJSON struct {
	MMax float64 `json:"M_max"`
	MMin float64 `json:"M_min"`
	V    float64 `json:"V"`
	NMax float64 `json:"N_max"`
	NMin float64 `json:"N_min"`
}

// designSpliceJSON has the keys of the splice file, so the output can be saved and checked again.
type designSpliceJSON struct {
	Bolt struct {
		Size    string `json:"size"`
		Class   string `json:"class"`
		Threads bool   `json:"threads_in_shear_plane"`
	} `json:"bolt"`
	Category      string           `json:"category"`
	FrictionClass string           `json:"friction_class,omitempty"`
	Holes         string           `json:"holes"`
	Gap           float64          `json:"gap"`
	Flange        designFlangeJSON `json:"flange"`
	Web           designWebJSON    `json:"web"`
}

type designPlateJSON struct {
	Thickness float64 `json:"thickness"`
	Width     float64 `json:"width"`
}

type designFlangeJSON struct {
	Outer   designPlateJSON  `json:"outer"`
	Inner   *designPlateJSON `json:"inner,omitempty"`
	Columns int              `json:"columns"`
	Rows    int              `json:"rows"`
	Gauge   float64          `json:"gauge"`
	Pitch   *float64         `json:"pitch,omitempty"`
	End     float64          `json:"end"`
	Edge    float64          `json:"edge"`
}

type designWebJSON struct {
	Thickness float64  `json:"thickness"`
	Depth     float64  `json:"depth"`
	Columns   int      `json:"columns"`
	Rows      int      `json:"rows"`
	Pitch     *float64 `json:"pitch,omitempty"`
	Spacing   *float64 `json:"spacing,omitempty"`
	End       float64  `json:"end"`
	Edge      float64  `json:"edge"`
}

type designCheckJSON struct {
	ID          string  `json:"id"`
	Clause      string  `json:"clause"`
	State       string  `json:"state"`
	Demand      float64 `json:"demand"`
	Resistance  float64 `json:"resistance"`
	Unit        string  `json:"unit"`
	Utilisation float64 `json:"utilisation"`
	Pass        bool    `json:"pass"`
	Formula     string  `json:"formula"`
	Substituted string  `json:"substituted"`
	Note        string  `json:"note,omitempty"`
}

type designQuantityJSON struct {
	Bolts       int     `json:"bolts"`
	Holes       int     `json:"holes"`
	PlateMassKg float64 `json:"plate_mass_kg"`
	FayingM2    float64 `json:"faying_area_m2"`
}

type designCostJSON struct {
	Bolts  float64 `json:"bolts"`
	Holes  float64 `json:"holes"`
	Plates float64 `json:"plates"`
	Faying float64 `json:"faying"`
	Splice float64 `json:"splice"`
	Total  float64 `json:"total"`
}

func designForceSet(f splice.Forces) designForceSetJSON {
	return designForceSetJSON{MMax: round(f.MMax / 1e6), MMin: round(f.MMin / 1e6), V: round(math.Abs(f.V) / 1e3),
		NMax: round(f.NMax / 1e3), NMin: round(f.NMin / 1e3)}
}

func designSpliceToJSON(g splice.Geometry) designSpliceJSON {
	var s designSpliceJSON
	s.Bolt.Size, s.Bolt.Class, s.Bolt.Threads = g.Bolt.Size, g.Bolt.Class, g.Bolt.ThreadsInShearPlane
	s.Category, s.Holes, s.Gap = string(g.Category), string(g.Holes), round(g.Gap)
	if s.Holes == "" {
		s.Holes = string(splice.NormalHoles)
	}
	if g.Category.Preloaded() {
		s.FrictionClass = string(g.FrictionClass)
	}
	ptr := func(v float64) *float64 { r := round(v); return &r }
	f := g.Flange
	s.Flange = designFlangeJSON{Outer: designPlateJSON{round(f.Outer.Thickness), round(f.Outer.Width)}, Columns: f.Columns, Rows: f.Rows,
		Gauge: round(f.Gauge), End: round(f.End), Edge: round(f.Edge)}
	if f.HasInner() {
		s.Flange.Inner = &designPlateJSON{round(f.Inner.Thickness), round(f.Inner.Width)}
	}
	if f.Rows > 1 {
		s.Flange.Pitch = ptr(f.Pitch)
	}
	w := g.Web
	s.Web = designWebJSON{Thickness: round(w.Thickness), Depth: round(w.Depth), Columns: w.Columns, Rows: w.Rows, End: round(w.End), Edge: round(w.Edge)}
	if w.Rows > 1 {
		s.Web.Pitch = ptr(w.Pitch)
	}
	if w.Columns > 1 {
		s.Web.Spacing = ptr(w.Spacing)
	}
	return s
}

func writeDesignJSON(w io.Writer, dc designCase, r splice.Result) error {
	out := designJSON{
		Version: version(), Input: dc.Input, Section: dc.Section, Grade: dc.Grade, PlateGrade: dc.PlateGrade,
		Status: r.Status.String(), Pass: r.Pass,
		Forces:      designForcesJSON{ULS: designForceSet(r.Actions.ULS)},
		Splice:      designSpliceToJSON(r.Geometry),
		Utilisation: round(r.Utilisation), Governing: r.Governing.ID,
		Quantities: designQuantityJSON{Bolts: r.Quantities.Bolts, Holes: r.Quantities.Holes,
			PlateMassKg: round(r.Quantities.PlateMass), FayingM2: round(r.Quantities.FayingArea)},
		Cost: designCostJSON{Bolts: round(r.Cost.Bolts), Holes: round(r.Cost.Holes), Plates: round(r.Cost.Plates),
			Faying: round(r.Cost.Faying), Splice: round(r.Cost.Splice), Total: round(r.Cost.Total)},
		Notes: append([]string{}, r.Notes...), Caution: caution,
	}
	if dc.Position != nil {
		x := round(*dc.Position)
		out.Position = &x
	}
	if r.Actions.SLSGiven {
		s := designForceSet(r.Actions.SLS)
		out.Forces.SLS = &s
	}
	out.Checks = make([]designCheckJSON, len(r.Checks))
	for i, c := range r.Checks {
		out.Checks[i] = designCheckJSON{ID: c.ID, Clause: c.Clause, State: c.State, Demand: round(c.Demand), Resistance: round(c.Resistance),
			Unit: c.Unit, Utilisation: round(c.Utilisation), Pass: c.Pass, Formula: c.Formula, Substituted: c.Substituted, Note: c.Note}
	}
	return writeJSON(w, out)
}

// --- text: the calculation sheet -----------------------------------------------------------

func writeDesignText(w io.Writer, dc designCase, r splice.Result, spliceFile string) error {
	p, g, a := dc.Problem, r.Geometry, r.Actions
	m := p.Member
	fmt.Fprintf(w, "spanbreak %s: bolted cover-plate splice, EN 1993-1-8:2005 / EN 1993-1-1:2005\n", version())
	fmt.Fprintf(w, "Input:     %s\n", dc.Input)
	if spliceFile != "" {
		fmt.Fprintf(w, "Splice:    %s (checked as given)\n", spliceFile)
	}
	if dc.Position != nil {
		fmt.Fprintf(w, "Position:  x = %.3f m\n", z(*dc.Position))
	}
	fmt.Fprintf(w, "Beam:      %s, %s (flange fy = %g, fu = %g N/mm²; web fy = %g, fu = %g N/mm², EN 1993-1-1 Table 3.1)\n",
		dc.Section, dc.Grade, m.FyFlange, m.FuFlange, m.FyWeb, m.FuWeb)
	s := m.Section
	fmt.Fprintf(w, "           h = %g, b = %g, tw = %g, tf = %g, r = %g mm; A = %.1f cm², Iy = %.0f cm⁴\n",
		s.H, s.B, s.Tw, s.Tf, s.R, s.A/1e2, s.Iy/1e4)
	fmt.Fprintf(w, "Plates:    %s\n", dc.PlateGrade)
	fmt.Fprintf(w, "Units:     forces kN, moments kNm (sagging +), axial force tension +, sizes mm\n\n")

	fmt.Fprintf(w, "Design forces\n")
	fmt.Fprintf(w, "  ULS  M_max %+.1f, M_min %+.1f kNm; |V| %.1f kN; N_max %+.1f, N_min %+.1f kN\n",
		z(a.ULS.MMax/1e6), z(a.ULS.MMin/1e6), z(math.Abs(a.ULS.V)/1e3), z(a.ULS.NMax/1e3), z(a.ULS.NMin/1e3))
	if a.SLSGiven {
		fmt.Fprintf(w, "  SLS  M_max %+.1f, M_min %+.1f kNm; |V| %.1f kN; N_max %+.1f, N_min %+.1f kN\n",
			z(a.SLS.MMax/1e6), z(a.SLS.MMin/1e6), z(math.Abs(a.SLS.V)/1e3), z(a.SLS.NMax/1e3), z(a.SLS.NMin/1e3))
	} else {
		fmt.Fprintf(w, "  SLS  none given\n")
	}
	fmt.Fprintf(w, "  States: M_max and M_min, each with the largest |V| and with N_max and N_min; both signs of M checked\n")
	if a.Distribution == splice.FlangesOnly {
		fmt.Fprintf(w, "  Distribution: flanges only (Mw = 0); web Nw = N·Aw/A = %.4f·N\n", a.AwOverA)
	} else {
		fmt.Fprintf(w, "  Distribution: proportional, Mw = M·Iw/Iy = %.4f·M, Nw = N·Aw/A = %.4f·N\n", a.IwOverIy, a.AwOverA)
	}
	fmt.Fprintf(w, "  Flange: Ff = (M − Mw)/(h − tf) ± (N − Nw)/2, h − tf = %g mm: Ft,Ed = %.1f kN (%s), Fc,Ed = %.1f kN (%s)",
		a.LeverArm, a.Flange.Tension/1e3, a.Flange.TensionState, a.Flange.Compression/1e3, a.Flange.CompressionState)
	if g.Category.Preloaded() {
		fmt.Fprintf(w, ", slip state %.1f kN", a.Flange.SlipBolt/1e3)
	}
	fmt.Fprintf(w, "\n  Web: |Mw| = %.2f kNm, |Nw| = %.1f kN, |V| = %.1f kN (%s)\n", a.Web.Moment/1e6, a.Web.Axial/1e3, a.Web.Shear/1e3, a.Web.State)
	if a.MinimumNote != "" {
		fmt.Fprintf(w, "  %s\n", a.MinimumNote)
	}

	fmt.Fprintf(w, "\nSplice (%s)\n", r.Status)
	threads := "threads in the shear planes"
	if !g.Bolt.ThreadsInShearPlane {
		threads = "shank in the shear planes"
	}
	cat := map[splice.Category]string{splice.CategoryA: "A (bearing)", splice.CategoryB: "B (slip-resistant at SLS)", splice.CategoryC: "C (slip-resistant at ULS)"}[g.Category]
	fmt.Fprintf(w, "  Bolts:  %s %s, %s; category %s", g.Bolt.Size, g.Bolt.Class, threads, cat)
	if g.Category.Preloaded() {
		fmt.Fprintf(w, ", friction class %s", g.FrictionClass)
	}
	holes := string(g.Holes)
	if holes == "" {
		holes = string(splice.NormalHoles)
	}
	fmt.Fprintf(w, "; %s holes; gap %g mm\n", holes, g.Gap)
	f := g.Flange
	fmt.Fprintf(w, "  Flange: outer plate %g × %g", f.Outer.Thickness, f.Outer.Width)
	if f.HasInner() {
		fmt.Fprintf(w, ", 2 inner plates %g × %g", f.Inner.Thickness, f.Inner.Width)
	}
	fmt.Fprintf(w, ", %.0f long; %d lines × %d rows each side; gauge %g", r.Quantities.FlangePlateLength, f.Columns, f.Rows, f.Gauge)
	if f.Rows > 1 {
		fmt.Fprintf(w, ", pitch %g", f.Pitch)
	}
	fmt.Fprintf(w, ", end %g, edge %g\n", f.End, f.Edge)
	wb := g.Web
	fmt.Fprintf(w, "  Web:    2 plates %g × %g, %.0f long; %d columns × %d rows each side", wb.Thickness, wb.Depth, r.Quantities.WebPlateLength, wb.Columns, wb.Rows)
	if wb.Rows > 1 {
		fmt.Fprintf(w, "; pitch %g", wb.Pitch)
	}
	if wb.Columns > 1 {
		fmt.Fprintf(w, ", spacing %g", wb.Spacing)
	}
	fmt.Fprintf(w, ", end %g, edge %g\n", wb.End, wb.Edge)
	wg := r.WebGroup
	fmt.Fprintf(w, "  Web bolt group: e = %g mm, Mg = |Mw| + |V|·e = %.2f kNm, Ip = %.0f mm²\n", wg.Eccentricity, wg.Moment/1e6, wg.PolarMoment)
	if len(wg.Bolts) > 0 {
		tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', tabwriter.AlignRight)
		fmt.Fprintf(tw, "    column\trow\tx mm\tz mm\tH kN\tV kN\tR kN\t\n")
		for _, b := range wg.Bolts {
			fmt.Fprintf(tw, "    %d\t%d\t%.1f\t%.1f\t%.1f\t%.1f\t%.1f\t\n", b.Column, b.Row, z(b.X), z(b.Z), z(b.H/1e3), z(b.V/1e3), z(b.R/1e3))
		}
		if err := tw.Flush(); err != nil {
			return err
		}
		fmt.Fprintf(w, "    (column 1 is nearest the joint; each component taken with its adverse sign)\n")
	}

	fmt.Fprintf(w, "\nChecks\n")
	for i, c := range r.Checks {
		mark := "pass"
		if !c.Pass {
			mark = "FAIL"
		}
		fmt.Fprintf(w, "%3d. %s — %s [%s]\n", i+1, c.ID, c.Clause, c.State)
		if c.Formula != "" {
			fmt.Fprintf(w, "     %s\n", c.Formula)
		}
		if c.Substituted != "" {
			fmt.Fprintf(w, "     %s\n", c.Substituted)
		}
		fmt.Fprintf(w, "     %s %s ≤ %s %s: utilisation %.3f, %s\n", designNumber(c.Demand), c.Unit, designNumber(c.Resistance), c.Unit, c.Utilisation, mark)
		if c.Note != "" {
			fmt.Fprintf(w, "     note: %s\n", c.Note)
		}
	}

	gv := r.Governing
	fmt.Fprintf(w, "\nGoverning: %s (%s), utilisation %.3f — ", gv.ID, gv.Clause, r.Utilisation)
	switch {
	case r.Pass:
		fmt.Fprintf(w, "every check passes\n")
	case r.Status == splice.NoFeasible:
		fmt.Fprintf(w, "NO SPLICE IN THE DESIGN SPACE PASSES; this is the best attempt\n")
	default:
		fmt.Fprintf(w, "THE SPLICE FAILS\n")
	}
	q := r.Quantities
	fmt.Fprintf(w, "Quantities: %d bolts (%d flange, %d web), %d holes, %.1f kg of plate (flanges %.1f, web %.1f), %.2f m² of faying surface\n",
		q.Bolts, q.FlangeBolts, q.WebBolts, q.Holes, q.PlateMass, q.FlangePlateMass, q.WebPlateMass, q.FayingArea)
	c := r.Cost
	rates := "indicative rates, for ranking only"
	if p.Rates.Bolt != nil {
		rates = "job rates"
	}
	fmt.Fprintf(w, "Cost (%s): bolts %.2f, holes %.2f, plates %.2f", rates, c.Bolts, c.Holes, c.Plates)
	if g.Category.Preloaded() {
		fmt.Fprintf(w, ", faying surfaces %.2f", c.Faying)
	}
	fmt.Fprintf(w, ", splice %.2f; total %.2f\n", c.Splice, c.Total)
	for _, n := range r.Notes {
		fmt.Fprintf(w, "Note: %s\n", n)
	}
	fmt.Fprintf(w, "Partial factors: EN 1993-1-8 Table 2.1 and EN 1993-1-1 6.1 recommended values unless set; a National Annex may differ.\n")
	fmt.Fprintf(w, "\n%s\n", caution)
	return nil
}

// designNumber prints a check value at a precision fit for its size.
func designNumber(v float64) string {
	a := math.Abs(v)
	switch {
	case a >= 100:
		return strconv.FormatFloat(v, 'f', 1, 64)
	case a >= 1:
		return strconv.FormatFloat(v, 'f', 2, 64)
	default:
		return strconv.FormatFloat(v, 'f', 3, 64)
	}
}
