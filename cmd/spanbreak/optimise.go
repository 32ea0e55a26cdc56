package main

import (
	"bytes"
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"math"
	"os"
	"path/filepath"
	"sort"
	"strconv"
	"strings"
	"text/tabwriter"

	"github.com/schollz/progressbar/v3"
	"github.com/spf13/cobra"
	"golang.org/x/term"

	"spanbreak/optimise"
)

// optimiseOptions are the inputs of `spanbreak optimise`.
type optimiseOptions struct {
	Paths      []string // job files, or folders of job files (*.yaml, *.yml)
	Demo       bool     // optimise the embedded demo job instead of files
	Format     string   // text | json | csv
	Step       float64  // candidate spacing [m]; 0: the job's scan.step (default 0.05 m)
	Rank       string   // cost | bolts | mass | utilisation
	Exhaustive bool     // reference run without pruning or sharing; prints the same results
	Out        string   // folder to write the results into as files; "" for none
	Force      bool     // replace files already in Out
	Jobs       int      // jobs optimised at once in a batch; 0: one per CPU
	Progress   *bool    // show a progress bar in a batch; nil: when stderr is a terminal
}

func newOptimiseCommand() *cobra.Command {
	opts := optimiseOptions{}
	cmd := &cobra.Command{
		Use:   "optimise JOB.yaml [JOB.yaml...|DIR]",
		Short: "Where to splice the beam: admissible positions, splice costs and the best layouts",
		Long: `optimise scans every position along the beam (every --step, default the job's scan.step),
leaves out the keep-out zones, sizes the cheapest bolted cover-plate splice for the envelope
forces at each position, and finds by dynamic programming the cheapest layouts of splices:
splice costs + transport (the cheapest vehicle that takes the longest piece, trips by mass) +
erection (a lift per piece), with every piece within the length and mass limits. It prints the
best layout for each splice count from the fewest feasible up to two more, and the near-best
alternatives.

Several job files, or a folder, are optimised in parallel and summarised in one table.
Exit status 3 means the run worked but no layout satisfies the limits.`,
		Args: argsUsage(cobra.MinimumNArgs(1)),
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.Paths = args
			return runOptimise(opts, cmd.OutOrStdout(), cmd.ErrOrStderr())
		},
	}
	f := cmd.Flags()
	f.StringVar(&opts.Format, "format", "text", "output format: text, json or csv")
	f.Float64Var(&opts.Step, "step", 0, "candidate spacing along the beam [m] (default: the job's scan.step, else 0.05)")
	f.StringVar(&opts.Rank, "rank", "cost", "rank positions by cost, bolts, mass or utilisation")
	f.BoolVar(&opts.Exhaustive, "exhaustive", false, "reference run: no pruning or sharing (slow; same results)")
	f.StringVar(&opts.Out, "out", "", "also write the results as files into this folder")
	f.BoolVar(&opts.Force, "force", false, "replace files already in the --out folder")
	f.IntVar(&opts.Jobs, "jobs", 0, "jobs optimised at once in a batch (default: one per CPU)")
	return cmd
}

// runOptimise optimises one job or a batch and writes the result; for one job nothing is
// written on error.
func runOptimise(opts optimiseOptions, stdout, stderr io.Writer) error {
	if err := checkFormat(opts.Format, "text", "json", "csv"); err != nil {
		return err
	}
	rank, err := optimise.ParseRank(opts.Rank)
	if err != nil {
		return usageError(fmt.Errorf("--rank: %w", err))
	}
	if opts.Step < 0 || math.IsNaN(opts.Step) || math.IsInf(opts.Step, 0) {
		return usageError(fmt.Errorf("--step %g: want a positive spacing in m", opts.Step))
	}
	if opts.Jobs < 0 {
		return usageError(fmt.Errorf("--jobs %d: want a positive number", opts.Jobs))
	}
	set := optimise.Settings{Step: opts.Step * 1e3, Rank: rank, Exhaustive: opts.Exhaustive}
	if opts.Demo {
		return optimiseOne(opts, set, "", stdout)
	}
	files, batch, err := jobFiles(opts.Paths)
	if err != nil {
		return err
	}
	if !batch {
		return optimiseOne(opts, set, files[0], stdout)
	}
	return optimiseBatch(opts, set, files, stdout, stderr)
}

// jobFiles expands the arguments: files as given, folders to their *.yaml and *.yml files in
// name order. A batch is more than one file or any folder.
func jobFiles(paths []string) (files []string, batch bool, err error) {
	batch = len(paths) > 1
	for _, p := range paths {
		info, err := os.Stat(p)
		if err != nil {
			return nil, false, err
		}
		if !info.IsDir() {
			files = append(files, p)
			continue
		}
		batch = true
		entries, err := os.ReadDir(p)
		if err != nil {
			return nil, false, err
		}
		var found []string
		for _, e := range entries {
			ext := strings.ToLower(filepath.Ext(e.Name()))
			if !e.IsDir() && (ext == ".yaml" || ext == ".yml") {
				found = append(found, filepath.Join(p, e.Name()))
			}
		}
		if len(found) == 0 {
			return nil, false, fmt.Errorf("%s: the folder has no job files (*.yaml, *.yml)", p)
		}
		sort.Strings(found)
		files = append(files, found...)
	}
	return files, batch, nil
}

// optimiseOne runs one job (file "" with opts.Demo) and prints it.
func optimiseOne(opts optimiseOptions, set optimise.Settings, file string, w io.Writer) error {
	setup, err := loadSetup(file, opts.Demo)
	if err != nil {
		return err
	}
	res, err := optimise.Run(setup, set)
	if err != nil {
		var inf *optimise.InfeasibleError
		if errors.As(err, &inf) {
			return infeasibleError(err)
		}
		return err
	}
	var buf bytes.Buffer
	if err := writeResult(&buf, opts.Format, res); err != nil {
		return err
	}
	if opts.Out != "" {
		if err := writeResultFiles(opts.Out, opts.Force, res); err != nil {
			return err
		}
	}
	_, err = w.Write(buf.Bytes())
	return err
}

func writeResult(w io.Writer, format string, r *optimise.Outcome) error {
	switch format {
	case "json":
		return writeJSON(w, toJSONResult(r))
	case "csv":
		return writeCandidatesCSV(w, r)
	}
	writeResultText(w, r)
	return nil
}

// --- batch -----------------------------------------------------------------------------

func optimiseBatch(opts optimiseOptions, set optimise.Settings, files []string, stdout, stderr io.Writer) error {
	inputs := make([]optimise.BatchInput, len(files))
	for i, f := range files {
		data, err := readInput(f)
		inputs[i] = optimise.BatchInput{File: f, Data: data, Err: err}
	}
	progress, finish := progressReporter(opts, stderr, len(files))
	outcomes := optimise.Batch(inputs, set, opts.Jobs, progress)
	finish()
	var buf bytes.Buffer
	var err error
	switch opts.Format {
	case "json":
		err = writeJSON(&buf, toJSONBatch(outcomes))
	case "csv":
		err = writeBatchCSV(&buf, outcomes)
	default:
		writeBatchText(&buf, outcomes)
	}
	if err != nil {
		return err
	}
	if opts.Out != "" {
		if err := writeBatchFiles(opts.Out, opts.Force, outcomes, opts.Format, buf.Bytes()); err != nil {
			return err
		}
	}
	if _, err := stdout.Write(buf.Bytes()); err != nil {
		return err
	}
	return batchStatus(outcomes)
}

// progressReporter returns the batch's progress callback and a function that ends the bar: a
// bar on stderr when it is a terminal (or when opts.Progress says so), nothing otherwise.
func progressReporter(opts optimiseOptions, stderr io.Writer, total int) (func(done, total int), func()) {
	show := false
	if opts.Progress != nil {
		show = *opts.Progress
	} else if f, ok := stderr.(*os.File); ok {
		show = term.IsTerminal(int(f.Fd()))
	}
	if !show {
		return nil, func() {}
	}
	bar := progressbar.NewOptions(total, progressbar.OptionSetWriter(stderr), progressbar.OptionSetDescription("optimising"),
		progressbar.OptionShowCount(), progressbar.OptionClearOnFinish(), progressbar.OptionSetWidth(30))
	return func(done, _ int) { _ = bar.Set(done) }, func() { _ = bar.Finish() }
}

// batchStatus is the exit status of a batch: a failed job (bad input) is exit 1, otherwise a
// job without a feasible layout is exit 3.
func batchStatus(outcomes []optimise.BatchOutcome) error {
	failed, infeasible := 0, 0
	for _, o := range outcomes {
		var inf *optimise.InfeasibleError
		switch {
		case o.Err == nil:
		case errors.As(o.Err, &inf):
			infeasible++
		default:
			failed++
		}
	}
	switch {
	case failed > 0:
		return fmt.Errorf("%d of %d job(s) failed (see the summary)", failed, len(outcomes))
	case infeasible > 0:
		return infeasibleError(fmt.Errorf("%d of %d job(s) have no layout within their limits (see the summary)", infeasible, len(outcomes)))
	}
	return nil
}

// --- JSON ------------------------------------------------------------------------------

func optimiseUnits() map[string]string {
	return map[string]string{
		"x": "m", "length": "m", "from": "m", "to": "m", "step": "m", "splices": "m", "mass_kg": "kg",
		"plate_mass_kg": "kg", "splice_mass_kg": "kg", "cost": "currency of the job's rates", "utilisation": "ratio (demand/resistance)",
	}
}

type jsonCandidate struct {
	X            float64  `json:"x"`
	Feasible     bool     `json:"feasible"`
	Reason       *string  `json:"reason"`
	Cost         *float64 `json:"cost"`
	Bolts        *int     `json:"bolts"`
	PlateMass    *float64 `json:"plate_mass_kg"`
	SpliceMass   *float64 `json:"splice_mass_kg"`
	Utilisation  *float64 `json:"utilisation"`
	Governing    *string  `json:"governing"`
	Splice       *string  `json:"splice"`
	Rank         *int     `json:"rank"`
	KeepOutZone  *string  `json:"keep_out"`
	ForcesULSMax *float64 `json:"uls_M_max"`
	ForcesULSMin *float64 `json:"uls_M_min"`
	ForcesULSV   *float64 `json:"uls_V"`
}

type jsonPiece struct {
	From   float64 `json:"from"`
	To     float64 `json:"to"`
	Length float64 `json:"length"`
	Mass   float64 `json:"mass_kg"`
}

type jsonCost struct {
	Splices   float64 `json:"splices"`
	Transport float64 `json:"transport"`
	Erection  float64 `json:"erection"`
	Total     float64 `json:"total"`
}

type jsonLayout struct {
	Kind        string      `json:"kind"` // "best" for its splice count, or "alternative"
	Recommended bool        `json:"recommended"`
	Splices     []float64   `json:"splices"`
	Pieces      []jsonPiece `json:"pieces"`
	Vehicle     *string     `json:"vehicle"`
	Trips       int         `json:"trips"`
	Cost        jsonCost    `json:"cost"`
}

type jsonResult struct {
	Input      string            `json:"input"`
	Version    string            `json:"version"`
	Title      string            `json:"title"`
	Units      map[string]string `json:"units"`
	Section    string            `json:"section"`
	Length     float64           `json:"length"`
	Step       float64           `json:"step"`
	Rank       string            `json:"rank"`
	Candidates []jsonCandidate   `json:"candidates"`
	Layouts    []jsonLayout      `json:"layouts"`
	Notes      []string          `json:"notes"`
	Caution    string            `json:"caution"`
}

func ptr[T any](v T) *T { return &v }

func toJSONCandidate(c optimise.Candidate) jsonCandidate {
	j := jsonCandidate{X: round(c.X * toM), Feasible: c.Feasible}
	if !c.Feasible {
		j.Reason = ptr(c.Reason)
	}
	if c.Zone != nil {
		j.KeepOutZone = ptr(c.Zone.Key)
		return j
	}
	f := c.Forces.ULS
	j.ForcesULSMax, j.ForcesULSMin, j.ForcesULSV = ptr(round(f.MMax*toKNm)), ptr(round(f.MMin*toKNm)), ptr(round(f.V*toKN))
	d := c.Design
	j.Utilisation, j.Governing, j.Splice = ptr(round(d.Utilisation)), ptr(d.Governing), ptr(d.Summary)
	if c.Feasible {
		j.Cost, j.Bolts, j.PlateMass = ptr(round(d.Cost)), ptr(d.Bolts), ptr(round(d.PlateMass))
		j.SpliceMass, j.Rank = ptr(round(d.Mass())), ptr(c.Rank)
	}
	return j
}

func toJSONLayout(l optimise.Layout, kind string, recommended bool) jsonLayout {
	j := jsonLayout{Kind: kind, Recommended: recommended, Splices: []float64{}, Trips: l.Trips,
		Cost: jsonCost{round(l.Cost.Splices), round(l.Cost.Transport), round(l.Cost.Erection), round(l.Cost.Total)}}
	for _, x := range l.Splices {
		j.Splices = append(j.Splices, round(x*toM))
	}
	for _, p := range l.Pieces {
		j.Pieces = append(j.Pieces, jsonPiece{round(p.From * toM), round(p.To * toM), round(p.Length * toM), round(p.Mass)})
	}
	if l.Vehicle != "" {
		j.Vehicle = ptr(l.Vehicle)
	}
	return j
}

func toJSONLayouts(r *optimise.Outcome) []jsonLayout {
	var out []jsonLayout
	for i, l := range r.Layouts.ByCount {
		out = append(out, toJSONLayout(l, "best", i == r.Layouts.Recommended))
	}
	for _, l := range r.Layouts.Alternatives {
		out = append(out, toJSONLayout(l, "alternative", false))
	}
	return out
}

func toJSONResult(r *optimise.Outcome) jsonResult {
	j := jsonResult{Input: r.Setup.File, Version: version(), Title: r.Setup.Title, Units: optimiseUnits(), Section: r.Setup.Section.Name,
		Length: round(r.Setup.Model.Length * toM), Step: round(r.Step * toM), Rank: string(r.Rank),
		Candidates: make([]jsonCandidate, 0, len(r.Candidates)), Layouts: toJSONLayouts(r), Notes: notes(r), Caution: caution}
	for _, c := range r.Candidates {
		j.Candidates = append(j.Candidates, toJSONCandidate(c))
	}
	return j
}

// notes are the result's notes plus any layout whose fewest trips were not proven.
func notes(r *optimise.Outcome) []string {
	out := append([]string{}, r.Notes...)
	for _, l := range append(append([]optimise.Layout{}, r.Layouts.ByCount...), r.Layouts.Alternatives...) {
		if !l.Proven {
			out = append(out, fmt.Sprintf("the layout with splices at %s m: the search for fewer trips stopped at its work bound; "+
				"a layout with fewer trips may exist", positions(l.Splices)))
		}
	}
	return out
}

type jsonBatchJob struct {
	File  string      `json:"file"`
	Title string      `json:"title"`
	Best  *jsonLayout `json:"best"`
	Error *string     `json:"error"`
}

func toJSONBatch(outcomes []optimise.BatchOutcome) any {
	jobs := make([]jsonBatchJob, 0, len(outcomes))
	for _, o := range outcomes {
		j := jsonBatchJob{File: o.File, Title: o.Title}
		if o.Err != nil {
			j.Error = ptr(o.Err.Error())
		} else {
			j.Best = ptr(toJSONLayout(o.Outcome.Recommended(), "best", true))
		}
		jobs = append(jobs, j)
	}
	return struct {
		Version string            `json:"version"`
		Units   map[string]string `json:"units"`
		Jobs    []jsonBatchJob    `json:"jobs"`
		Caution string            `json:"caution"`
	}{version(), optimiseUnits(), jobs, caution}
}

// --- CSV -------------------------------------------------------------------------------

// writeCandidatesCSV writes one row per position.
func writeCandidatesCSV(w io.Writer, r *optimise.Outcome) error {
	cw := csv.NewWriter(w)
	_ = cw.Write([]string{"x_m", "feasible", "rank", "cost", "bolts", "holes", "plate_mass_kg", "splice_mass_kg",
		"utilisation", "governing", "uls_M_max_kNm", "uls_M_min_kNm", "uls_V_kN", "splice", "reason"})
	for _, c := range r.Candidates {
		row := []string{num(c.X * toM), strconv.FormatBool(c.Feasible), "", "", "", "", "", "", "", "", "", "", "", "", c.Reason}
		if c.Zone == nil {
			d, f := c.Design, c.Forces.ULS
			row[8], row[9], row[10], row[11], row[12], row[13] = num(d.Utilisation), d.Governing, num(f.MMax*toKNm),
				num(f.MMin*toKNm), num(f.V*toKN), d.Summary
			if c.Feasible {
				row[2], row[3], row[4], row[5] = strconv.Itoa(c.Rank), num(d.Cost), strconv.Itoa(d.Bolts), strconv.Itoa(d.Holes)
				row[6], row[7] = num(d.PlateMass), num(d.Mass())
			}
		}
		_ = cw.Write(row)
	}
	cw.Flush()
	return cw.Error()
}

// writeLayoutsCSV writes one row per layout.
func writeLayoutsCSV(w io.Writer, r *optimise.Outcome) error {
	cw := csv.NewWriter(w)
	_ = cw.Write(layoutCSVHeader("kind", "recommended"))
	for _, j := range toJSONLayouts(r) {
		_ = cw.Write(append([]string{j.Kind, strconv.FormatBool(j.Recommended)}, layoutCSVRow(j)...))
	}
	cw.Flush()
	return cw.Error()
}

func layoutCSVHeader(first ...string) []string {
	return append(first, "splice_count", "splices_m", "pieces_m", "piece_mass_kg", "vehicle", "trips",
		"cost_splices", "cost_transport", "cost_erection", "cost_total")
}

func layoutCSVRow(j jsonLayout) []string {
	var pieces, masses []string
	for _, p := range j.Pieces {
		pieces = append(pieces, num(p.Length))
		masses = append(masses, num(p.Mass))
	}
	var xs []string
	for _, x := range j.Splices {
		xs = append(xs, num(x))
	}
	vehicle := ""
	if j.Vehicle != nil {
		vehicle = *j.Vehicle
	}
	return []string{strconv.Itoa(len(j.Splices)), strings.Join(xs, ";"), strings.Join(pieces, ";"), strings.Join(masses, ";"),
		vehicle, strconv.Itoa(j.Trips), num(j.Cost.Splices), num(j.Cost.Transport), num(j.Cost.Erection), num(j.Cost.Total)}
}

func writeBatchCSV(w io.Writer, outcomes []optimise.BatchOutcome) error {
	cw := csv.NewWriter(w)
	_ = cw.Write(append(layoutCSVHeader("file", "title"), "error"))
	for _, o := range outcomes {
		if o.Err != nil {
			row := make([]string, 13)
			row[0], row[1], row[12] = o.File, o.Title, o.Err.Error()
			_ = cw.Write(row)
			continue
		}
		j := toJSONLayout(o.Outcome.Recommended(), "best", true)
		_ = cw.Write(append(append([]string{o.File, o.Title}, layoutCSVRow(j)...), ""))
	}
	cw.Flush()
	return cw.Error()
}

// --- text ------------------------------------------------------------------------------

func positions(xs []float64) string {
	if len(xs) == 0 {
		return "none"
	}
	s := make([]string, len(xs))
	for i, x := range xs {
		s[i] = fmt.Sprintf("%.3f", x*toM)
	}
	return strings.Join(s, ", ")
}

func money(v float64) string { return fmt.Sprintf("%.2f", z(v)) }

func lengthLimit(mm float64) string {
	if math.IsInf(mm, 1) {
		return "no limit"
	}
	return fmt.Sprintf("%.3f m", mm*toM)
}

func massLimit(kg float64) string {
	if math.IsInf(kg, 1) {
		return "no limit"
	}
	return fmt.Sprintf("%.0f kg", kg)
}

// table returns a tab-aligned writer whose lines carry no trailing spaces; Flush writes it.
func table(w io.Writer) *tabwriter.Writer {
	return tabwriter.NewWriter(&trimWriter{w: w}, 0, 0, 2, ' ', 0)
}

// trimWriter passes lines on without their trailing spaces.
type trimWriter struct {
	w       io.Writer
	pending []byte
}

func (t *trimWriter) Write(p []byte) (int, error) {
	t.pending = append(t.pending, p...)
	for {
		i := bytes.IndexByte(t.pending, '\n')
		if i < 0 {
			return len(p), nil
		}
		line := bytes.TrimRight(t.pending[:i], " ")
		if _, err := t.w.Write(append(line, '\n')); err != nil {
			return 0, err
		}
		t.pending = t.pending[i+1:]
	}
}

func writeResultText(w io.Writer, r *optimise.Outcome) {
	fmt.Fprintf(w, "spanbreak %s: splice positions and layouts\n", version())
	fmt.Fprintf(w, "Input:    %s\n", r.Setup.File)
	if r.Setup.Title != "" {
		fmt.Fprintf(w, "Title:    %s\n", r.Setup.Title)
	}
	fmt.Fprintf(w, "Beam:     %s, length %.3f m, %.1f kg/m of steel\n", r.Setup.Section.Name, r.Setup.Model.Length*toM, r.Setup.Section.Mass)
	splices := fmt.Sprintf("%d or more", r.Setup.MinSplices)
	if r.Setup.MaxSplices >= 0 {
		splices = fmt.Sprintf("%d to %d", r.Setup.MinSplices, r.Setup.MaxSplices)
	}
	fmt.Fprintf(w, "Limits:   piece length %s to %s, piece mass %s (crane), rigging %.0f kg per piece, %s splices, gap %g mm\n",
		lengthLimit(r.Limits.MinLength), lengthLimit(r.Limits.MaxLength), massLimit(r.Limits.MaxMass), r.Limits.Rigging, splices, r.Gap())
	if len(r.Setup.Vehicles) > 0 {
		var vs []string
		for _, v := range r.Setup.Vehicles {
			vs = append(vs, fmt.Sprintf("%s (%.2f m, %.0f kg, %s per trip)", v.Name, v.MaxLength*toM, v.Payload, money(v.Cost)))
		}
		fmt.Fprintf(w, "Vehicles: %s\n", strings.Join(vs, "; "))
	}
	feasible, kept := 0, 0
	for _, c := range r.Candidates {
		switch {
		case c.Feasible:
			feasible++
		case c.Zone != nil:
			kept++
		}
	}
	fmt.Fprintf(w, "Scan:     every %.3f m, %d positions: %d admissible, %d in keep-out zones, %d where no splice passes; lift %s per piece\n\n",
		r.Step*toM, len(r.Candidates), feasible, kept, len(r.Candidates)-feasible-kept, money(r.Setup.Lift))
	writeRecommendation(w, r)
	writeLayoutTable(w, r)
	writeCandidateSummary(w, r)
	for _, n := range notes(r) {
		fmt.Fprintf(w, "Note: %s\n", n)
	}
	fmt.Fprintf(w, "\n%s\n", caution)
}

func vehicleText(l optimise.Layout) string {
	if l.Vehicle == "" {
		return "no vehicle costed"
	}
	return fmt.Sprintf("%s, %d trip(s)", l.Vehicle, l.Trips)
}

func writeRecommendation(w io.Writer, r *optimise.Outcome) {
	best := r.Recommended()
	fmt.Fprintf(w, "RECOMMENDATION: %d splice(s)", len(best.Splices))
	if len(best.Splices) > 0 {
		fmt.Fprintf(w, " at %s m", positions(best.Splices))
	}
	fmt.Fprintf(w, ", %d piece(s), %s; total %s\n", len(best.Pieces), vehicleText(best), money(best.Cost.Total))
	fmt.Fprintf(w, "  cost: splices %s + transport %s + erection %s = %s\n", money(best.Cost.Splices),
		money(best.Cost.Transport), money(best.Cost.Erection), money(best.Cost.Total))
	tw := table(w)
	fmt.Fprintln(tw, "  piece\tfrom [m]\tto [m]\tlength [m]\tmass [kg]\tof which splice [kg]")
	for i, p := range best.Pieces {
		fmt.Fprintf(tw, "  %d\t%.3f\t%.3f\t%.3f\t%.1f\t%.1f\n", i+1, p.From*toM, p.To*toM, p.Length*toM, p.Mass, p.SpliceMass)
	}
	tw.Flush()
	if len(best.Splices) > 0 {
		tw = table(w)
		fmt.Fprintln(tw, "  splice at [m]\tcost\tbolts\tutilisation\tgoverning check\tsplice")
		for _, ci := range candidateIndices(r, best) {
			c := r.Candidates[ci]
			fmt.Fprintf(tw, "  %.3f\t%s\t%d\t%.3f\t%s\t%s\n", c.X*toM, money(c.Design.Cost), c.Design.Bolts,
				c.Design.Utilisation, c.Design.Governing, c.Design.Summary)
		}
		tw.Flush()
	}
	fmt.Fprintln(w)
}

// candidateIndices maps a layout's splices to the candidates they sit at.
func candidateIndices(r *optimise.Outcome, l optimise.Layout) []int {
	var out []int
	k := 0
	for i, c := range r.Candidates {
		if k < len(l.Splices) && c.X == l.Splices[k] {
			out = append(out, i)
			k++
		}
	}
	return out
}

func writeLayoutTable(w io.Writer, r *optimise.Outcome) {
	row := func(tw io.Writer, l optimise.Layout, mark string) {
		var ls []string
		for _, p := range l.Pieces {
			ls = append(ls, fmt.Sprintf("%.2f", p.Length*toM))
		}
		vehicle := l.Vehicle
		if vehicle == "" {
			vehicle = "-"
		}
		fmt.Fprintf(tw, "%d\t%s\t%s\t%s\t%d\t%s\t%s\t%s\t%s\t%s\n", len(l.Splices), positions(l.Splices), strings.Join(ls, " / "),
			vehicle, l.Trips, money(l.Cost.Splices), money(l.Cost.Transport), money(l.Cost.Erection), money(l.Cost.Total), mark)
	}
	header := "splices\tat [m]\tpieces [m]\tvehicle\ttrips\tsplices\ttransport\terection\ttotal\t"
	fmt.Fprintln(w, "Best layout for each number of splices")
	tw := table(w)
	fmt.Fprintln(tw, header)
	for i, l := range r.Layouts.ByCount {
		mark := ""
		if i == r.Layouts.Recommended {
			mark = "<- recommended"
		}
		row(tw, l, mark)
	}
	tw.Flush()
	if len(r.Layouts.Alternatives) > 0 {
		fmt.Fprintln(w, "\nNear-best alternatives (each moves a splice to another stretch or splice design)")
		tw = table(w)
		fmt.Fprintln(tw, header)
		for _, l := range r.Layouts.Alternatives {
			row(tw, l, "")
		}
		tw.Flush()
	}
	fmt.Fprintln(w)
}

// writeCandidateSummary lists the admissible stretches with their cheapest position, and the
// best positions by the ranking.
func writeCandidateSummary(w io.Writer, r *optimise.Outcome) {
	fmt.Fprintln(w, "Admissible stretches (consecutive positions where a splice may go)")
	tw := table(w)
	fmt.Fprintln(tw, "from [m]\tto [m]\tpositions\tcheapest\tat [m]\tutilisation\tgoverning check")
	cs := r.Candidates
	for i := 0; i < len(cs); {
		if !cs[i].Feasible {
			i++
			continue
		}
		j, best := i, i
		for j < len(cs) && cs[j].Feasible {
			if cs[j].Design.Cost < cs[best].Design.Cost {
				best = j
			}
			j++
		}
		b := cs[best]
		fmt.Fprintf(tw, "%.3f\t%.3f\t%d\t%s\t%.3f\t%.3f\t%s\n", cs[i].X*toM, cs[j-1].X*toM, j-i, money(b.Design.Cost), b.X*toM,
			b.Design.Utilisation, b.Design.Governing)
		i = j
	}
	tw.Flush()
	var ranked []optimise.Candidate
	for _, c := range cs {
		if c.Feasible {
			ranked = append(ranked, c)
		}
	}
	sort.SliceStable(ranked, func(a, b int) bool { return ranked[a].Rank < ranked[b].Rank })
	if len(ranked) > 5 {
		ranked = ranked[:5]
	}
	fmt.Fprintf(w, "\nBest positions by %s\n", r.Rank)
	tw = table(w)
	fmt.Fprintln(tw, "rank\tat [m]\tcost\tbolts\tplates [kg]\tutilisation\tsplice")
	for _, c := range ranked {
		fmt.Fprintf(tw, "%d\t%.3f\t%s\t%d\t%.1f\t%.3f\t%s\n", c.Rank, c.X*toM, money(c.Design.Cost), c.Design.Bolts,
			c.Design.PlateMass, c.Design.Utilisation, c.Design.Summary)
	}
	tw.Flush()
	fmt.Fprintln(w)
}

func writeBatchText(w io.Writer, outcomes []optimise.BatchOutcome) {
	fmt.Fprintf(w, "spanbreak %s: best layout of each job\n\n", version())
	tw := table(w)
	fmt.Fprintln(tw, "file\ttitle\tsplices\tat [m]\tvehicle\ttrips\ttotal\tstatus")
	var errs []string
	for _, o := range outcomes {
		if o.Err != nil {
			status := "failed (below)"
			var inf *optimise.InfeasibleError
			if errors.As(o.Err, &inf) {
				status = "no layout within the limits (below)"
			}
			fmt.Fprintf(tw, "%s\t%s\t\t\t\t\t\t%s\n", o.File, o.Title, status)
			errs = append(errs, o.Err.Error())
			continue
		}
		l := o.Outcome.Recommended()
		vehicle := l.Vehicle
		if vehicle == "" {
			vehicle = "-"
		}
		fmt.Fprintf(tw, "%s\t%s\t%d\t%s\t%s\t%d\t%s\tok\n", o.File, o.Title, len(l.Splices), positions(l.Splices), vehicle,
			l.Trips, money(l.Cost.Total))
	}
	tw.Flush()
	if len(errs) > 0 {
		fmt.Fprintln(w, "\nProblems")
		for _, e := range errs {
			fmt.Fprintln(w, e)
		}
	}
	fmt.Fprintf(w, "\n%s\n", caution)
}

// --- files -----------------------------------------------------------------------------

// outFile is one file to write into the --out folder.
type outFile struct {
	name string
	data []byte
}

// resultFiles renders one job's files: <name>.optimise.txt, <name>.optimise.json,
// <name>.candidates.csv and <name>.layouts.csv.
func resultFiles(r *optimise.Outcome) ([]outFile, error) {
	base := jobBase(r.Setup.File)
	var txt, js, cand, lay bytes.Buffer
	writeResultText(&txt, r)
	if err := writeJSON(&js, toJSONResult(r)); err != nil {
		return nil, err
	}
	if err := writeCandidatesCSV(&cand, r); err != nil {
		return nil, err
	}
	if err := writeLayoutsCSV(&lay, r); err != nil {
		return nil, err
	}
	return []outFile{{base + ".optimise.txt", txt.Bytes()}, {base + ".optimise.json", js.Bytes()},
		{base + ".candidates.csv", cand.Bytes()}, {base + ".layouts.csv", lay.Bytes()}}, nil
}

func writeResultFiles(dir string, force bool, r *optimise.Outcome) error {
	files, err := resultFiles(r)
	if err != nil {
		return err
	}
	return writeOutFiles(dir, force, files)
}

// writeBatchFiles writes every job's files and the summary (summary.txt, .json or .csv).
func writeBatchFiles(dir string, force bool, outcomes []optimise.BatchOutcome, format string, summary []byte) error {
	var files []outFile
	for _, o := range outcomes {
		if o.Outcome != nil {
			jf, err := resultFiles(o.Outcome)
			if err != nil {
				return err
			}
			files = append(files, jf...)
		}
	}
	ext := map[string]string{"text": "txt", "json": "json", "csv": "csv"}[format]
	files = append(files, outFile{"summary." + ext, summary})
	return writeOutFiles(dir, force, files)
}

// writeOutFiles writes the files into dir, each whole or not at all. Without force it first
// makes sure that none exists, so that a refusal leaves the folder untouched.
func writeOutFiles(dir string, force bool, files []outFile) error {
	if err := os.MkdirAll(dir, 0o755); err != nil {
		return err
	}
	seen := map[string]bool{}
	for _, f := range files {
		if seen[f.name] {
			return fmt.Errorf("--out: two jobs would both write %s; give the job files distinct names", f.name)
		}
		seen[f.name] = true
		if _, err := os.Lstat(filepath.Join(dir, f.name)); err == nil && !force {
			return fmt.Errorf("%s already exists; it was left unchanged (pass --force to replace the files)", filepath.Join(dir, f.name))
		}
	}
	for _, f := range files {
		if err := writeFileAtomic(filepath.Join(dir, f.name), f.data, force); err != nil {
			if errors.Is(err, fs.ErrExist) {
				return fmt.Errorf("%w (pass --force to replace the files)", err)
			}
			return err
		}
	}
	return nil
}

// jobBase is the file name of a job without folder and extension ("demo" for the demo).
func jobBase(file string) string {
	if file == optimise.DemoJobName {
		return "demo"
	}
	b := filepath.Base(file)
	return strings.TrimSuffix(b, filepath.Ext(b))
}
