package main

import (
	"errors"
	"strings"
)

// Exit statuses: scripts can tell bad input from bad usage and from a run that worked but
// found no splice or layout within the limits. An output that already exists (without
// --force) is exit 1, a state of the file system rather than a mistake in the command line;
// a run ended by a signal exits 128 + the signal's number (130 SIGINT, 143 SIGTERM, see
// signalStatus).
const (
	exitOK         = 0 // success
	exitFailure    = 1 // bad input, an output that already exists, or a failed run
	exitUsage      = 2 // bad command line
	exitInfeasible = 3 // the run worked, but no splice or layout satisfies the limits
)

// exitError carries an exit status with an error.
type exitError struct {
	code int
	err  error
}

func (e *exitError) Error() string { return e.err.Error() }
func (e *exitError) Unwrap() error { return e.err }

// usageError marks a command-line mistake (exit status 2).
func usageError(err error) error { return &exitError{code: exitUsage, err: err} }

// infeasibleError marks a run that found no admissible splice or layout (exit status 3).
func infeasibleError(err error) error { return &exitError{code: exitInfeasible, err: err} }

// exitCode maps an error to the process exit status.
func exitCode(err error) int {
	var e *exitError
	if errors.As(err, &e) {
		return e.code
	}
	var sig *signalError
	if errors.As(err, &sig) {
		return signalStatus(sig.sig)
	}
	// cobra's own parse errors for commands and arguments
	msg := err.Error()
	for _, p := range []string{"unknown command", "unknown flag", "unknown shorthand flag", "accepts ", "requires at least", "invalid argument"} {
		if strings.HasPrefix(msg, p) {
			return exitUsage
		}
	}
	return exitFailure
}
