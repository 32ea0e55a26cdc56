package main

import (
	"bytes"
	"errors"
	"fmt"
	"os"
	"sort"
	"strconv"
	"time"

	"github.com/spf13/cobra"

	"spanbreak/optimise"
	"spanbreak/plots"
	"spanbreak/plots/encode"
)

// reportOptions are the inputs of `spanbreak report`.
type reportOptions struct {
	JobFile string  // path of the job file; "" with Demo
	Demo    bool    // report on the embedded demo job instead of a file
	Out     string  // folder to write
	Force   bool    // replace Out if it exists
	Step    float64 // candidate spacing [mm]; 0 takes the job's scan.step
	Uniform bool    // recommend the best layout of identical splices
	Splice  string  // check this one splice at every position instead of sizing one
}

func newReportCommand(run func(reportOptions, streams) error, ios streams) *cobra.Command {
	opts := reportOptions{}
	cmd := &cobra.Command{
		Use:   "report JOB.yaml --out DIR",
		Short: "Write the calculation report (PDF), the charts, scan.csv, layouts.csv, result.json and bom.csv",
		Long: `report optimises the job and writes a folder with everything the engineer files and the
contractor reads: report.pdf (job summary, beam and loads, envelopes, limits, the ranking of
positions, the layouts, the full calculation sheet of each splice of the recommended layout with
its drawing, and the caution), every chart and drawing as PNG and SVG, scan.csv (every candidate
position), layouts.csv, result.json and bom.csv (the bill of materials of the recommended
layout: bolts, nuts and washers by size, class and length, plates by size and grade, holes and
faying surfaces, splice by splice and for the layout).

The folder is written complete or not at all: the files go into a temporary folder next to DIR,
which is renamed to DIR at the end. An existing DIR is replaced only with --force.

When no layout satisfies the limits the folder is still written, and the exit status is 3:
report.pdf has everything up to the candidate positions and then "Why no layout fits" (each
stretch where no splice passes with its closest attempt and the forces there, and the limit
that cannot be met) in place of the layouts and calculation sheets; result.json is the whole
optimise document with its diagnosis; scan.csv as always; layouts.csv and bom.csv have their
headers only.`,
		Args: argsUsage(cobra.ExactArgs(1)),
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.JobFile = args[0]
			return run(opts, ios.of(cmd))
		},
	}
	f := cmd.Flags()
	f.StringVar(&opts.Out, "out", "", "folder to write the report into (required; written complete or not at all)")
	f.BoolVar(&opts.Force, "force", false, "replace the folder if it exists")
	lengthVar(f, &opts.Step, "step", spacing, 0, `candidate spacing along the beam [m, or with a unit: "50 mm"] (default: the job's scan.step)`)
	f.BoolVar(&opts.Uniform, "uniform", false, "recommend the best layout of identical splices (one splice type)")
	f.StringVar(&opts.Splice, "splice", "", "check this splice file at every position instead of sizing one")
	return cmd
}

// runReport optimises the job, builds the report in memory and writes the folder; nothing is
// left behind on error.
func runReport(opts reportOptions, ios streams) error {
	stdout := ios.Out
	if opts.Out == "" {
		return usageError(errors.New("--out: give the folder to write the report into"))
	}
	if err := checkStepOption(opts.Step); err != nil {
		return err
	}
	if _, err := os.Lstat(opts.Out); err == nil && !opts.Force {
		return &existsError{path: opts.Out, hint: "pass --force to replace the folder"}
	} else if err != nil && !errors.Is(err, os.ErrNotExist) {
		return fmt.Errorf("--out %s: %w", opts.Out, err)
	}
	setup, err := loadSetup(opts.JobFile, opts.Demo)
	if err != nil {
		return err
	}
	set := optimise.Settings{Step: opts.Step, Uniform: opts.Uniform}
	if opts.Splice != "" {
		g, err := loadSplice(opts.Splice)
		if err != nil {
			return err
		}
		set.Fixed = &g
	}
	res, runErr := optimise.Run(setup, set)
	var inf *optimise.InfeasibleError
	if runErr != nil && !errors.As(runErr, &inf) {
		return settingError(runErr)
	}
	// without a layout the report still says everything up to the candidates, then why no
	// layout fits; the exit status stays 3
	when, err := reportTime(ios)
	if err != nil {
		return err
	}
	files, warnings, err := reportFiles(setup, res, when)
	if err != nil {
		return err
	}
	ph := ios.Interrupts.begin()
	if err := ph.end(writeFolder(opts.Out, files, opts.Force, ph)); err != nil {
		return err
	}
	encode.WriteWarnings(ios.Err, warnings)
	encode.WriteReportSummary(stdout, res, len(files), opts.Out, caution)
	if inf != nil {
		return infeasibleError(runErr)
	}
	return nil
}

// reportTime is the time the report is dated by, in its text and in the PDF's metadata:
// SOURCE_DATE_EPOCH (whole seconds since 1970-01-01 UTC) when it is set, the convention of
// reproducible builds, else the streams' clock.
func reportTime(ios streams) (time.Time, error) {
	v, ok := os.LookupEnv("SOURCE_DATE_EPOCH")
	if !ok || v == "" {
		return ios.now(), nil
	}
	sec, err := strconv.ParseInt(v, 10, 64)
	if err != nil || sec < 0 || sec > 253402300799 { // 9999-12-31T23:59:59Z
		return time.Time{}, usageError(fmt.Errorf("SOURCE_DATE_EPOCH: %q is not a number of seconds since 1970-01-01", v))
	}
	return time.Unix(sec, 0).UTC(), nil
}

// reportFiles renders the report, every figure as PNG and SVG, and the CSV and JSON files.
func reportFiles(setup *optimise.Setup, res *optimise.Outcome, when time.Time) ([]reportFile, []string, error) {
	rep, err := plots.BuildReport(plots.ReportInput{Outcome: res, Version: version(), Time: when, Caution: caution})
	if err != nil {
		return nil, nil, err
	}
	files := []reportFile{{"report.pdf", rep.PDF}}
	for _, f := range rep.Figures {
		for _, format := range []plots.Format{plots.PNG, plots.SVG} {
			b, err := f.Bytes(format)
			if err != nil {
				return nil, nil, fmt.Errorf("rendering %s.%s: %w", f.Name, format, err)
			}
			files = append(files, reportFile{f.Name + "." + string(format), b})
		}
	}
	// scan.csv, layouts.csv and result.json are the optimise command's machine contract,
	// with the recommended layout's splices and their full checks added to the JSON; bom.csv
	// is the recommended layout's bill of materials
	var scan, layouts, result, bom bytes.Buffer
	if err := encode.WriteCandidatesCSV(&scan, res); err != nil {
		return nil, nil, err
	}
	if err := encode.WriteLayoutsCSV(&layouts, res); err != nil {
		return nil, nil, err
	}
	if err := encode.WriteJSON(&result, encode.ReportResult(res)); err != nil {
		return nil, nil, err
	}
	if err := encode.WriteBOMCSV(&bom, res); err != nil {
		return nil, nil, err
	}
	files = append(files, reportFile{"scan.csv", scan.Bytes()}, reportFile{"layouts.csv", layouts.Bytes()},
		reportFile{"result.json", result.Bytes()}, reportFile{"bom.csv", bom.Bytes()})
	sort.SliceStable(files, func(i, j int) bool { return files[i].name < files[j].name })
	return files, rep.Warnings, nil
}
