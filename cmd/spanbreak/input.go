package main

import (
	"fmt"
	"io"
	"io/fs"
	"os"
	"syscall"

	"spanbreak/optimise"
	"spanbreak/splice"
)

// maxInputBytes bounds every input file read (job and splice files are a few kB).
const maxInputBytes = 4 << 20

// readInput reads a whole input file, refusing one larger than maxInputBytes and anything
// that is not a regular file. The file is opened without blocking and checked before it is
// read, so that a named pipe (which would wait for a writer for ever), a device or a folder
// is refused at once rather than hanging the command.
func readInput(path string) ([]byte, error) {
	f, err := os.OpenFile(path, os.O_RDONLY|syscall.O_NONBLOCK, 0)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	info, err := f.Stat()
	if err != nil {
		return nil, fmt.Errorf("%s: %w", path, err)
	}
	if !info.Mode().IsRegular() {
		return nil, fmt.Errorf("%s is %s, not a regular file; spanbreak reads job and splice files", path, fileKind(info.Mode()))
	}
	data, err := io.ReadAll(io.LimitReader(f, maxInputBytes+1))
	if err != nil {
		return nil, fmt.Errorf("%s: %w", path, err)
	}
	if len(data) > maxInputBytes {
		return nil, fmt.Errorf("%s: the file is larger than %d MiB; a job file is a few kB", path, maxInputBytes>>20)
	}
	return data, nil
}

// fileKind names what a file that is not a regular file is, for messages.
func fileKind(m fs.FileMode) string {
	switch {
	case m.IsDir():
		return "a folder"
	case m&fs.ModeNamedPipe != 0:
		return "a named pipe (FIFO)"
	case m&fs.ModeSocket != 0:
		return "a socket"
	case m&fs.ModeCharDevice != 0:
		return "a character device"
	case m&fs.ModeDevice != 0:
		return "a device"
	case m&fs.ModeSymlink != 0:
		return "a symbolic link"
	}
	return "a special file"
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
