// Command spanbreak analyses a long steel beam, designs its bolted cover-plate splices to
// EN 1993-1-8 and finds where to break it for transport and erection.
//
// This file and the other command files only wire flags to run functions; the engineering
// lives in the beam, splice, optimise and plots packages.
package main

import (
	"fmt"
	"io"
	"os"
)

func main() {
	os.Exit(execute(os.Args[1:], os.Stdout, os.Stderr))
}

// execute runs one command line and returns the process exit status.
func execute(args []string, stdout, stderr io.Writer) int {
	root := newRootCommand()
	root.SetArgs(args)
	root.SetOut(stdout)
	root.SetErr(stderr)
	if err := root.Execute(); err != nil {
		fmt.Fprintf(stderr, "spanbreak: %v\n", err)
		return exitCode(err)
	}
	return exitOK
}
