package main

import (
	"bufio"
	"bytes"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"os"
	"path/filepath"
	"sort"
	"strings"

	"github.com/schollz/progressbar/v3"
	"github.com/spf13/cobra"

	"spanbreak/optimise"
	"spanbreak/plots/encode"
)

// optimiseOptions are the inputs of `spanbreak optimise`.
type optimiseOptions struct {
	Paths      []string // job files, or folders of job files (*.yaml, *.yml)
	Demo       bool     // optimise the embedded demo job instead of files
	Format     string   // text | json | csv
	Step       float64  // candidate spacing [mm]; 0: the job's scan.step (default 0.05 m)
	Rank       string   // cost | bolts | mass | utilisation
	Exhaustive bool     // reference run without pruning or sharing; prints the same results
	Out        string   // folder to write the results into as files; "" for none
	Force      bool     // replace files already in Out
	Jobs       int      // jobs optimised at once in a batch; 0: one per CPU
	Uniform    bool     // recommend the best layout of identical splices
	SpliceFile string   // check this one splice at every position instead of sizing one
}

func newOptimiseCommand(run func(optimiseOptions, streams) error, ios streams) *cobra.Command {
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
Exit status 3 means the run worked but no layout satisfies the limits: the result is still
printed in full (every candidate with its reason, no layouts) with a diagnosis of why nothing
fits — each stretch where no splice passes with its closest attempt and the forces there, and
the limit that cannot be met with the figure that breaks it.`,
		Args: argsUsage(cobra.MinimumNArgs(1)),
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.Paths = args
			return run(opts, ios.of(cmd))
		},
	}
	f := cmd.Flags()
	f.StringVar(&opts.Format, "format", "text", "output format: text, json or csv")
	lengthVar(f, &opts.Step, "step", spacing, 0, `candidate spacing along the beam [m, or with a unit: "50 mm"] (default: the job's scan.step, else 0.05)`)
	f.StringVar(&opts.Rank, "rank", "cost", "rank positions by cost, bolts, mass or utilisation")
	f.BoolVar(&opts.Exhaustive, "exhaustive", false, "reference run: no pruning or sharing (slow; same results)")
	f.StringVar(&opts.Out, "out", "", "also write the results as files into this folder")
	f.BoolVar(&opts.Force, "force", false, "replace files already in the --out folder")
	f.IntVar(&opts.Jobs, "jobs", 0, "jobs optimised at once in a batch (default: one per CPU)")
	f.BoolVar(&opts.Uniform, "uniform", false, "recommend the best layout of identical splices (one splice type)")
	f.StringVar(&opts.SpliceFile, "splice", "", "check this splice file at every position instead of sizing one")
	return cmd
}

// runOptimise optimises one job or a batch and writes the result; for one job nothing is
// written on error.
func runOptimise(opts optimiseOptions, ios streams) error {
	if err := checkFormat(opts.Format, "text", "json", "csv"); err != nil {
		return err
	}
	rank, err := optimise.ParseRank(opts.Rank)
	if err != nil {
		return usageError(fmt.Errorf("--rank: %w", err))
	}
	if err := checkStepOption(opts.Step); err != nil {
		return err
	}
	if opts.Jobs < 0 {
		return usageError(fmt.Errorf("--jobs %d: want a positive number", opts.Jobs))
	}
	set := optimise.Settings{Step: opts.Step, Rank: rank, Exhaustive: opts.Exhaustive, Uniform: opts.Uniform}
	if opts.SpliceFile != "" {
		g, err := loadSplice(opts.SpliceFile)
		if err != nil {
			return err
		}
		set.Fixed = &g
	}
	if opts.Demo {
		return optimiseOne(opts, set, "", ios)
	}
	files, batch, err := jobFiles(opts.Paths, ios.Err)
	if err != nil {
		return err
	}
	if !batch {
		return optimiseOne(opts, set, files[0], ios)
	}
	return optimiseBatch(opts, set, files, ios)
}

// jobFiles expands the arguments: files as given, folders to their *.yaml and *.yml files in
// name order. A batch is more than one file or any folder. In a folder, a *.yaml or *.yml
// entry that is not a regular file (a named pipe, a device, a folder; a symbolic link counts
// as what it points to) is skipped with a warning to warn, so that it cannot hang the batch;
// a file given as an argument is left to readInput, which refuses it.
func jobFiles(paths []string, warn io.Writer) (files []string, batch bool, err error) {
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
			if ext != ".yaml" && ext != ".yml" {
				continue
			}
			path := filepath.Join(p, e.Name())
			if info, err := os.Stat(path); err != nil || !info.Mode().IsRegular() {
				why := "it is not a regular file"
				var pe *fs.PathError
				switch {
				case errors.As(err, &pe):
					why = pe.Err.Error() // a dangling link, no permission
				case err == nil:
					why = "it is " + fileKind(info.Mode()) + ", not a regular file"
				}
				fmt.Fprintf(warn, "spanbreak: warning: skipping %s: %s\n", path, why)
				continue
			}
			found = append(found, path)
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
func optimiseOne(opts optimiseOptions, set optimise.Settings, file string, ios streams) error {
	setup, err := loadSetup(file, opts.Demo)
	if err != nil {
		return err
	}
	res, runErr := optimise.Run(setup, set)
	var inf *optimise.InfeasibleError
	if runErr != nil && !errors.As(runErr, &inf) {
		return settingError(runErr)
	}
	// a run without a layout within the limits is still a whole document: the candidates
	// with their reasons and the diagnosis, printed before the exit-3 error. With --out the
	// folder is written first and the document printed once it is (nothing is printed when
	// the folder cannot be); without, the document streams to the output, so that a long
	// scan's document is never held whole.
	if opts.Out == "" {
		bw := bufio.NewWriterSize(ios.Out, 1<<16)
		if err := encode.WriteOptimise(bw, opts.Format, res); err != nil {
			return err
		}
		if err := bw.Flush(); err != nil {
			return err
		}
	} else {
		var buf bytes.Buffer
		if err := encode.WriteOptimise(&buf, opts.Format, res); err != nil {
			return err
		}
		if err := writeResultFiles(opts.Out, opts.Force, res, ios.Interrupts); err != nil {
			return err
		}
		if _, err := ios.Out.Write(buf.Bytes()); err != nil {
			return err
		}
	}
	if inf != nil {
		return infeasibleError(runErr)
	}
	return nil
}

// --- batch -----------------------------------------------------------------------------

func optimiseBatch(opts optimiseOptions, set optimise.Settings, files []string, ios streams) error {
	stdout := ios.Out
	inputs := make([]optimise.BatchInput, len(files))
	for i, f := range files {
		data, err := readInput(f)
		inputs[i] = optimise.BatchInput{File: f, Data: data, Err: err}
	}
	progress, finish := progressReporter(ios, len(files))
	outcomes := optimise.Batch(inputs, set, opts.Jobs, progress)
	finish()
	var buf bytes.Buffer
	if err := encode.WriteBatch(&buf, opts.Format, outcomes); err != nil {
		return err
	}
	if opts.Out != "" {
		if err := writeBatchFiles(opts.Out, opts.Force, outcomes, opts.Format, buf.Bytes(), ios.Interrupts); err != nil {
			return err
		}
	}
	if _, err := stdout.Write(buf.Bytes()); err != nil {
		return err
	}
	return batchStatus(outcomes)
}

// progressReporter returns the batch's progress callback and a function that ends the bar: a
// bar on stderr when it is a terminal, nothing otherwise.
func progressReporter(ios streams, total int) (func(done, total int), func()) {
	if !ios.ErrTerminal {
		return nil, func() {}
	}
	bar := progressbar.NewOptions(total, progressbar.OptionSetWriter(ios.Err), progressbar.OptionSetDescription("optimising"),
		progressbar.OptionShowCount(), progressbar.OptionClearOnFinish(), progressbar.OptionSetWidth(30))
	return func(done, _ int) { _ = bar.Set(done) }, func() { _ = bar.Finish() }
}

// batchStatus is the exit status of a batch: a job that refuses a setting of the command line
// (a --step too fine for its beam) is exit 2, naming the flag; otherwise a failed job (bad
// input) is exit 1, and a job without a feasible layout exit 3.
func batchStatus(outcomes []optimise.BatchOutcome) error {
	failed, infeasible := 0, 0
	var setting error // the first job that refuses a setting of the command line
	for _, o := range outcomes {
		var inf *optimise.InfeasibleError
		var se *optimise.SettingError
		switch {
		case o.Err == nil:
		case errors.As(o.Err, &inf):
			infeasible++
		case errors.As(o.Err, &se):
			failed++
			if setting == nil {
				setting = usageError(fmt.Errorf("--%s: %s: %w", se.Setting, o.File, se.Err))
			}
		default:
			failed++
		}
	}
	switch {
	case setting != nil:
		return setting
	case failed > 0:
		return fmt.Errorf("%d of %d job(s) failed (see the summary)", failed, len(outcomes))
	case infeasible > 0:
		return infeasibleError(fmt.Errorf("%d of %d job(s) have no layout within their limits (see the summary)", infeasible, len(outcomes)))
	}
	return nil
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
	encode.WriteOptimiseText(&txt, r)
	if err := encode.WriteOptimiseJSON(&js, r); err != nil {
		return nil, err
	}
	if err := encode.WriteCandidatesCSV(&cand, r); err != nil {
		return nil, err
	}
	if err := encode.WriteLayoutsCSV(&lay, r); err != nil {
		return nil, err
	}
	return []outFile{{base + ".optimise.txt", txt.Bytes()}, {base + ".optimise.json", js.Bytes()},
		{base + ".candidates.csv", cand.Bytes()}, {base + ".layouts.csv", lay.Bytes()}}, nil
}

func writeResultFiles(dir string, force bool, r *optimise.Outcome, g *interrupts) error {
	files, err := resultFiles(r)
	if err != nil {
		return err
	}
	return writeOutFiles(dir, force, files, g)
}

// writeBatchFiles writes every job's files and the summary (summary.txt, .json or .csv).
func writeBatchFiles(dir string, force bool, outcomes []optimise.BatchOutcome, format string, summary []byte, g *interrupts) error {
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
	return writeOutFiles(dir, force, files, g)
}

// jobBase is the file name of a job without folder and extension ("demo" for the demo).
func jobBase(file string) string {
	if file == optimise.DemoJobName {
		return "demo"
	}
	b := filepath.Base(file)
	return strings.TrimSuffix(b, filepath.Ext(b))
}
