package main

import (
	"fmt"
	"io"
	"os"

	"spanbreak/optimise"
	"spanbreak/splice"
)

// maxInputBytes bounds every input file read (job and splice files are a few kB).
const maxInputBytes = 4 << 20

// readInput reads a whole input file, refusing one larger than maxInputBytes.
func readInput(path string) ([]byte, error) {
	f, err := os.Open(path)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	data, err := io.ReadAll(io.LimitReader(f, maxInputBytes+1))
	if err != nil {
		return nil, fmt.Errorf("%s: %w", path, err)
	}
	if len(data) > maxInputBytes {
		return nil, fmt.Errorf("%s: the file is larger than %d MiB; a job file is a few kB", path, maxInputBytes>>20)
	}
	return data, nil
}

// loadSetup reads and prepares a job file, or the embedded demo job.
func loadSetup(path string, demo bool) (*optimise.Setup, error) {
	if demo {
		return optimise.Prepare(optimise.DemoJobName, optimise.DemoJob())
	}
	data, err := readInput(path)
	if err != nil {
		return nil, err
	}
	return optimise.Prepare(path, data)
}

// loadSplice reads a splice file (--splice) into a splice geometry.
func loadSplice(path string) (splice.Geometry, error) {
	data, err := readInput(path)
	if err != nil {
		return splice.Geometry{}, err
	}
	return optimise.LoadSpliceFile(path, data)
}
