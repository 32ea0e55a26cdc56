package main

import (
	"strings"

	"github.com/spf13/cobra"

	"spanbreak/optimise"
)

// newJobFileHelpTopic is the help topic `spanbreak help job-file`: a command without a run
// function, so cobra lists it under "Additional help topics" and prints its text.
func newJobFileHelpTopic() *cobra.Command {
	return &cobra.Command{
		Use:   "job-file",
		Short: "Every key of the job file and the splice file: unit, default, allowed values, example",
		Long:  strings.TrimRight(optimise.JobFileReference(), "\n"),
	}
}
