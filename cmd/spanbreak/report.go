package main

import (
	"bytes"
	"errors"
	"fmt"
	"os"
	"path/filepath"
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
	Step    float64 // candidate spacing [m]; 0 takes the job's scan.step
}

func newReportCommand(run func(reportOptions, streams) error, ios streams) *cobra.Command {
	opts := reportOptions{}
	cmd := &cobra.Command{
		Use:   "report JOB.yaml --out DIR",
		Short: "Write the calculation report (PDF), the charts, scan.csv, layouts.csv and result.json",
		Long: `report optimises the job and writes a folder with everything the engineer files and the
contractor reads: report.pdf (job summary, beam and loads, envelopes, limits, the ranking of
positions, the layouts, the full calculation sheet of each splice of the recommended layout with
its drawing, and the caution), every chart and drawing as PNG and SVG, scan.csv (every candidate
position), layouts.csv and result.json.

The folder is written complete or not at all: the files go into a temporary folder next to DIR,
which is renamed to DIR at the end. An existing DIR is replaced only with --force.`,
		Args: argsUsage(cobra.ExactArgs(1)),
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.JobFile = args[0]
			return run(opts, ios.of(cmd))
		},
	}
	f := cmd.Flags()
	f.StringVar(&opts.Out, "out", "", "folder to write the report into (required; written complete or not at all)")
	f.BoolVar(&opts.Force, "force", false, "replace the folder if it exists")
	f.Float64Var(&opts.Step, "step", 0, "candidate spacing along the beam [m] (default: the job's scan.step)")
	return cmd
}

// reportFile is one file of the report folder.
type reportFile struct {
	name string
	data []byte
}

// runReport optimises the job, builds the report in memory and writes the folder; nothing is
// left behind on error.
func runReport(opts reportOptions, ios streams) error {
	stdout := ios.Out
	if opts.Out == "" {
		return usageError(errors.New("--out: give the folder to write the report into"))
	}
	if opts.Step < 0 {
		return usageError(fmt.Errorf("--step: %g m must be positive", opts.Step))
	}
	if _, err := os.Lstat(opts.Out); err == nil && !opts.Force {
		return usageError(fmt.Errorf("--out %s: the folder exists; pass --force to replace it", opts.Out))
	} else if err != nil && !errors.Is(err, os.ErrNotExist) {
		return fmt.Errorf("--out %s: %w", opts.Out, err)
	}
	setup, err := loadSetup(opts.JobFile, opts.Demo)
	if err != nil {
		return err
	}
	res, err := optimise.Run(setup, optimise.Settings{Step: opts.Step * 1e3})
	if err != nil {
		var inf *optimise.InfeasibleError
		if errors.As(err, &inf) {
			return infeasibleError(err)
		}
		return err
	}
	when, err := reportTime(ios)
	if err != nil {
		return err
	}
	files, warnings, err := reportFiles(setup, res, when)
	if err != nil {
		return err
	}
	if err := writeFolder(opts.Out, files, opts.Force); err != nil {
		return err
	}
	encode.WriteWarnings(ios.Err, warnings)
	encode.WriteReportSummary(stdout, res, len(files), opts.Out, caution)
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
	// with the recommended layout's splices and their full checks added to the JSON
	var scan, layouts, result bytes.Buffer
	if err := encode.WriteCandidatesCSV(&scan, res); err != nil {
		return nil, nil, err
	}
	if err := encode.WriteLayoutsCSV(&layouts, res); err != nil {
		return nil, nil, err
	}
	if err := encode.WriteJSON(&result, encode.ReportResult(res)); err != nil {
		return nil, nil, err
	}
	files = append(files, reportFile{"scan.csv", scan.Bytes()}, reportFile{"layouts.csv", layouts.Bytes()},
		reportFile{"result.json", result.Bytes()})
	sort.SliceStable(files, func(i, j int) bool { return files[i].name < files[j].name })
	return files, rep.Warnings, nil
}

// writeFolder writes the files into a temporary folder beside dir and renames it to dir, so
// that dir is either the complete new report or untouched. With replace, an existing dir is
// moved aside first and removed once the new one is in place (restored if the rename fails).
func writeFolder(dir string, files []reportFile, replace bool) (err error) {
	parent, base := filepath.Split(filepath.Clean(dir))
	if parent == "" {
		parent = "."
	}
	tmp, err := os.MkdirTemp(parent, "."+base+".tmp-")
	if err != nil {
		return fmt.Errorf("--out %s: %w", dir, err)
	}
	defer func() {
		if err != nil {
			os.RemoveAll(tmp)
		}
	}()
	for _, f := range files {
		if err := writeFileAtomic(filepath.Join(tmp, f.name), f.data, false); err != nil {
			return err
		}
	}
	if err := os.Chmod(tmp, 0o755); err != nil {
		return err
	}
	var old string
	if _, statErr := os.Lstat(dir); statErr == nil {
		if !replace {
			return usageError(fmt.Errorf("--out %s: the folder exists; pass --force to replace it", dir))
		}
		old = tmp + ".old"
		if err := os.Rename(dir, old); err != nil {
			return fmt.Errorf("--out %s: moving the old folder aside: %w", dir, err)
		}
	}
	if err := os.Rename(tmp, dir); err != nil {
		if old != "" {
			_ = os.Rename(old, dir)
		}
		return fmt.Errorf("--out %s: %w", dir, err)
	}
	syncDir(parent)
	if old != "" {
		if err := os.RemoveAll(old); err != nil {
			return fmt.Errorf("--out %s: the new report is in place, but the old folder %s could not be removed: %w", dir, old, err)
		}
	}
	return nil
}
