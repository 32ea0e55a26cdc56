package main

import (
	"errors"
	"fmt"

	"github.com/spf13/cobra"

	"spanbreak/optimise"
	"spanbreak/plots/encode"
)

// analyseOptions are the inputs of `spanbreak analyse`.
type analyseOptions struct {
	JobFile string    // path of the job file; "" with Demo
	Demo    bool      // analyse the embedded demo job instead of a file
	Format  string    // text | json | csv
	Step    float64   // station spacing [mm]
	At      []float64 // stations [mm]; overrides Step when given
	Case    string    // one load case, unfactored
}

func newAnalyseCommand(run func(analyseOptions, streams) error, ios streams) *cobra.Command {
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
			return run(opts, ios.of(cmd))
		},
	}
	f := cmd.Flags()
	f.StringVar(&opts.Format, "format", "text", "output format: text, json or csv")
	lengthVar(f, &opts.Step, "step", spacing, 250, `station spacing along the beam [m, or with a unit: "100 mm"]`)
	lengthsVar(f, &opts.At, "at", position, `evaluate only at these positions [m, or with a unit], e.g. --at 1.5,3.0 or --at "9000 mm"`)
	f.StringVar(&opts.Case, "case", "", "print one load case, unfactored")
	return cmd
}

// runAnalyse analyses the job and writes the result; nothing is written when the job or a
// setting is refused.
func runAnalyse(opts analyseOptions, ios streams) error {
	w := ios.Out
	if err := checkFormat(opts.Format, "text", "json", "csv"); err != nil {
		return err
	}
	setup, err := loadSetup(opts.JobFile, opts.Demo)
	if err != nil {
		return err
	}
	set := optimise.BeamSettings{Step: opts.Step, At: opts.At, Case: opts.Case}
	o, err := optimise.AnalyseBeam(setup, set)
	if err != nil {
		return settingError(err)
	}
	// streamed, not buffered: at 10⁶ stations the document is gigabytes. Once the analysis has
	// succeeded the encoder can fail only on the writer (the CSV refuses a non-finite value
	// before it writes anything), so nothing half-made is printed for a bad job.
	return encode.WriteAnalysis(w, opts.Format, o)
}

// settingError reports a run setting the optimise package refuses against its flag, as a
// command-line mistake.
func settingError(err error) error {
	var se *optimise.SettingError
	if errors.As(err, &se) {
		return usageError(fmt.Errorf("--%s: %w", se.Setting, se.Err))
	}
	return err
}
