package main

import (
	_ "embed"
	"strings"

	"github.com/spf13/cobra"
)

// jobFileReference describes every key of the job file and of the fixed-splice file: unit,
// default, allowed values and an example. A test walks the schema of package jobfile to keep
// it complete.
//
//go:embed jobfile-reference.txt
var jobFileReference string

// newJobFileHelpTopic is the help topic `spanbreak help job-file`: a command without a run
// function, so cobra lists it under "Additional help topics" and prints its text.
func newJobFileHelpTopic() *cobra.Command {
	return &cobra.Command{
		Use:   "job-file",
		Short: "Every key of the job file and the splice file: unit, default, allowed values, example",
		Long:  strings.TrimRight(jobFileReference, "\n"),
	}
}
