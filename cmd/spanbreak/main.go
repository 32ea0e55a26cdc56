// Command spanbreak analyses a long steel beam, designs its bolted cover-plate splices to
// EN 1993-1-8 and finds where to break it for transport and erection.
//
// This file and the other command files only wire flags to run functions; the engineering
// lives in the beam, splice, optimise and plots packages.
package main

import (
	"io"
	"os"
	"syscall"

	"spanbreak/plots/encode"
)

func main() {
	ios := osStreams()
	ios.Interrupts = newInterrupts(os.Exit, ios.Err)
	os.Exit(executeListening(os.Args[1:], realRunners(), ios))
}

// executeListening is executeWith with SIGINT and SIGTERM going to ios.Interrupts for the
// time of the run: a signal ends it with status 130 or 143 and leaves nothing half-written.
func executeListening(args []string, r runners, ios streams) int {
	stop := ios.Interrupts.listen(syscall.SIGINT, syscall.SIGTERM)
	defer stop()
	return executeWith(args, r, ios)
}

// execute runs one command line with the real commands and returns the process exit status.
func execute(args []string, stdout, stderr io.Writer) int {
	return executeWith(args, realRunners(), streams{Out: stdout, Err: stderr})
}

// executeWith runs one command line with the given runners and streams.
func executeWith(args []string, r runners, ios streams) int {
	root := newRootCommand(r, ios)
	root.SetArgs(args)
	if err := root.Execute(); err != nil {
		encode.WriteError(ios.Err, err)
		return exitCode(err)
	}
	return exitOK
}
