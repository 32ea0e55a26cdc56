package main

import (
	"io"

	"github.com/spf13/cobra"
)

// demoOptions are the inputs of `spanbreak demo`.
type demoOptions struct {
	Format string
	Step   float64 // [m]
}

func newDemoCommand() *cobra.Command {
	opts := demoOptions{}
	cmd := &cobra.Command{
		Use:   "demo",
		Short: "Run the embedded demo job (invented data)",
		Long: `demo runs spanbreak on an embedded job: a roof girder over a bus-depot wash bay, a scenario
invented to show the tool. It needs no input file.`,
		Args: argsUsage(cobra.NoArgs),
		RunE: func(cmd *cobra.Command, _ []string) error {
			return runDemo(opts, cmd.OutOrStdout())
		},
	}
	cmd.Flags().StringVar(&opts.Format, "format", "text", "output format: text, json or csv")
	cmd.Flags().Float64Var(&opts.Step, "step", 0.5, "station spacing along the beam [m]")
	return cmd
}

// runDemo analyses the embedded demo job.
func runDemo(opts demoOptions, w io.Writer) error {
	return runAnalyse(analyseOptions{Demo: true, Format: opts.Format, Step: opts.Step}, w)
}
