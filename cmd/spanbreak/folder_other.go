//go:build !linux

package main

import (
	"errors"
	"fmt"
)

// exchangePaths would swap a and b in one step; this platform has no such call.
func exchangePaths(a, b string) error {
	return fmt.Errorf("exchanging %s and %s: %w", a, b, errors.ErrUnsupported)
}

// renameNoReplace moves from to to unless something is at to (an error wrapping fs.ErrExist).
func renameNoReplace(from, to string) error { return checkedRename(from, to) }
