package main

import (
	"io"
	"os"
	"time"

	"github.com/spf13/cobra"
	"golang.org/x/term"
)

// streams are what a command may use of its surroundings: standard output and error, whether
// standard error is a terminal (a progress bar may be drawn only then), the clock (the date
// on a report) and the handler of SIGINT and SIGTERM that output is written under. main
// builds them from the process; tests from buffers, a fixed clock and, where they deliver a
// signal, their own handler.
type streams struct {
	Out, Err    io.Writer
	ErrTerminal bool
	Now         func() time.Time
	Interrupts  *interrupts // nil: no signal is handled (tests)
}

// osStreams are the process's own streams.
func osStreams() streams {
	return streams{Out: os.Stdout, Err: os.Stderr, ErrTerminal: term.IsTerminal(int(os.Stderr.Fd())), Now: time.Now}
}

// now is the streams' clock, the system's when none is set.
func (s streams) now() time.Time {
	if s.Now == nil {
		return time.Now()
	}
	return s.Now()
}

// runners are the function each command runs once its flags are parsed into its options.
// The command line builds them from realRunners; argv-level tests substitute functions that
// record the options, so that flag parsing is tested without running a job.
type runners struct {
	Analyse  func(analyseOptions, streams) error
	Check    func(checkOptions, streams) error
	Demo     func(demoOptions, streams) error
	Design   func(designOptions, streams) error
	Init     func(initOptions, streams) error
	Optimise func(optimiseOptions, streams) error
	Report   func(reportOptions, streams) error
	Sections func(sectionsOptions, streams) error
	View     func(viewOptions, streams) error
}

func realRunners() runners {
	return runners{Analyse: runAnalyse, Check: runCheck, Demo: runDemo, Design: runDesign, Init: runInit,
		Optimise: runOptimise, Report: runReport, Sections: runSections, View: runView}
}

// of returns the streams with a command's output and error writers (those the root sets from
// the streams, or a test sets on the command).
func (s streams) of(c *cobra.Command) streams {
	s.Out, s.Err = c.OutOrStdout(), c.ErrOrStderr()
	return s
}
