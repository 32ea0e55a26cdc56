package main

import (
	"bytes"
	"fmt"
	"io"
	"os"
	"path/filepath"

	"github.com/spf13/cobra"

	"spanbreak/optimise"
	"spanbreak/plots/encode"
)

// defaultDemoDir is the folder, in the current directory, that `demo` writes its report to.
const defaultDemoDir = "spanbreak-demo-report"

// demoOptions are the inputs of `spanbreak demo`.
type demoOptions struct {
	Format   string // text | json | csv, of the optimisation printed
	Out      string // report folder; "" takes defaultDemoDir
	Force    bool   // replace Out if it exists
	NoReport bool   // print the optimisation only
}

func newDemoCommand(run func(demoOptions, streams) error, ios streams) *cobra.Command {
	opts := demoOptions{}
	cmd := &cobra.Command{
		Use:   "demo",
		Short: "Run the whole job on the embedded demo (invented data) and write its report",
		Long: `demo runs spanbreak on an embedded job: a roof girder over a bus-depot wash bay, a scenario
invented to show the tool. It analyses the beam, scans every splice position, prints the
recommended layout and the alternatives, and writes the full report (report.pdf, charts,
scan.csv, layouts.csv, result.json) into ./` + defaultDemoDir + ` or --out. A report folder
left by an earlier demo run is replaced; any other existing folder needs --force.`,
		Args: argsUsage(cobra.NoArgs),
		RunE: func(cmd *cobra.Command, _ []string) error {
			return run(opts, ios.of(cmd))
		},
	}
	f := cmd.Flags()
	f.StringVar(&opts.Format, "format", "text", "output format of the printed result: text, json or csv")
	f.StringVar(&opts.Out, "out", "", "report folder (default ./"+defaultDemoDir+")")
	f.BoolVar(&opts.Force, "force", false, "replace the report folder if it exists")
	f.BoolVar(&opts.NoReport, "no-report", false, "print the result only; write no report")
	return cmd
}

// runDemo optimises the embedded demo job, prints the result and writes the report.
func runDemo(opts demoOptions, ios streams) error {
	stdout, stderr := ios.Out, ios.Err
	if err := checkFormat(opts.Format, "text", "json", "csv"); err != nil {
		return err
	}
	out, force := opts.Out, opts.Force
	if out == "" {
		out = defaultDemoDir
		force = force || earlierDemoReport(out)
	}
	if _, err := os.Lstat(out); err == nil && !force && !opts.NoReport {
		return &existsError{path: out, hint: "pass --force to replace the folder"} // before anything is printed
	}
	if err := runOptimise(optimiseOptions{Demo: true, Format: opts.Format}, ios); err != nil {
		return err
	}
	if opts.NoReport {
		return nil
	}
	quiet := ios
	quiet.Out = io.Discard
	if err := runReport(reportOptions{Demo: true, Out: out, Force: force}, quiet); err != nil {
		return err
	}
	where := stdout
	if opts.Format != "text" {
		where = stderr // keep JSON and CSV on stdout clean
	}
	abs, err := filepath.Abs(out)
	if err != nil {
		abs = out
	}
	fmt.Fprintf(where, "\nReport written to %s (report.pdf, the charts as PNG and SVG, scan.csv, layouts.csv, result.json)\n",
		encode.Printable(abs))
	return nil
}

// earlierDemoReport reports whether dir holds a report an earlier demo run wrote, which the
// default demo run may replace without --force.
func earlierDemoReport(dir string) bool {
	for _, f := range []string{"report.pdf", "result.json", "scan.csv"} {
		if _, err := os.Stat(filepath.Join(dir, f)); err != nil {
			return false
		}
	}
	data, err := os.ReadFile(filepath.Join(dir, "result.json"))
	return err == nil && bytes.Contains(data, []byte(optimise.DemoJobName))
}
