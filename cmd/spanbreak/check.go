package main

import (
	"bytes"
	"io"

	"github.com/spf13/cobra"

	"spanbreak/optimise"
	"spanbreak/plots/encode"
)

// checkOptions are the inputs of `spanbreak check`.
type checkOptions struct {
	JobFile string // path of the job file
	Format  string // text | json | csv
}

func newCheckCommand(run func(checkOptions, streams) error, ios streams) *cobra.Command {
	opts := checkOptions{}
	cmd := &cobra.Command{
		Use:   "check JOB.yaml",
		Short: "Validate a job file and print what spanbreak understood from it",
		Long: `check reads a job file strictly and reports every problem in one pass, each with its file,
line, column and key path (exit status 1). A valid job is also analysed, so that a mechanism
(too few supports, a misplaced hinge) is reported, and check then prints what it understood:
the section and grade with fy and fu at the flange and web thickness, the length, spans,
supports, hinges and overhangs, each load case (kind, category, ψ used, pattern, number of loads
and total downward load), the combinations, their γ values and whether roof imposed loads are
kept apart from snow and wind (EN 1990 A1.2.1(3)), the limits, vehicles, splice
options, costs and scan. Values the file leaves out are shown with their defaults, marked.`,
		Args: argsUsage(cobra.ExactArgs(1)),
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.JobFile = args[0]
			return run(opts, ios.of(cmd))
		},
	}
	cmd.Flags().StringVar(&opts.Format, "format", "text", "output format: text, json or csv (csv: key, value, unit, default)")
	return cmd
}

// runCheck validates and analyses the job, then prints its summary; nothing is written on
// error.
func runCheck(opts checkOptions, ios streams) error {
	stdout := ios.Out
	if err := checkFormat(opts.Format, "text", "json", "csv"); err != nil {
		return err
	}
	setup, err := loadSetup(opts.JobFile, false)
	if err != nil {
		return err
	}
	jc, err := optimise.CheckJob(setup)
	if err != nil {
		return err
	}
	var buf bytes.Buffer
	write := encode.WriteCheck
	if opts.Format == "csv" {
		write = func(w io.Writer, _ string, jc *optimise.JobCheck) error { return encode.WriteCheckCSV(w, jc) }
	}
	if err := write(&buf, opts.Format, jc); err != nil {
		return err
	}
	_, err = stdout.Write(buf.Bytes())
	return err
}
