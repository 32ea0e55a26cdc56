package main

import (
	_ "embed"
	"errors"
	"fmt"
	"io/fs"
	"spanbreak/optimise"
	"spanbreak/plots/encode"

	"github.com/spf13/cobra"
)

// initOptions are the inputs of `spanbreak init`.
type initOptions struct {
	File  string // where to write the starter job; "" prints it to stdout
	Force bool   // replace File if it exists
}

func newInitCommand(run func(initOptions, streams) error, ios streams) *cobra.Command {
	opts := initOptions{}
	cmd := &cobra.Command{
		Use:   "init [FILE]",
		Short: "Write a commented starter job file (invented data) to edit",
		Long: `init writes a commented starter job: a transfer beam under an offset column in a car-park deck,
a scenario invented to show every block of a job file. It runs as it stands; replace its values
with your project's, then run "spanbreak check FILE". Without FILE it prints the job to stdout.
An existing FILE is never replaced unless --force is given; the file is written whole or not at
all. Every key is described by "spanbreak help job-file".`,
		Args: argsUsage(cobra.MaximumNArgs(1)),
		RunE: func(cmd *cobra.Command, args []string) error {
			if len(args) == 1 {
				opts.File = args[0]
			}
			return run(opts, ios.of(cmd))
		},
	}
	cmd.Flags().BoolVar(&opts.Force, "force", false, "replace FILE if it already exists")
	return cmd
}

// runInit prints the starter job, or writes it to opts.File and says so on stdout.
func runInit(opts initOptions, ios streams) error {
	stdout := ios.Out
	if opts.File == "" {
		if opts.Force {
			return usageError(errors.New("--force needs a FILE to replace"))
		}
		_, err := stdout.Write(optimise.StarterJob())
		return err
	}
	ph := ios.Interrupts.begin()
	if err := ph.end(writeOutput(opts.File, optimise.StarterJob(), opts.Force, ph)); err != nil {
		if errors.Is(err, fs.ErrExist) {
			return &existsError{path: opts.File, hint: "pass --force to replace it"}
		}
		return err
	}
	_, err := fmt.Fprintf(stdout, "wrote %s: a starter job with invented data; edit it, then run: spanbreak check %s\n",
		encode.Printable(opts.File), encode.Printable(opts.File))
	return err
}
