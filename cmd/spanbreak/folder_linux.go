package main

import (
	"errors"
	"fmt"
	"os"

	"golang.org/x/sys/unix"
)

// exchangePaths swaps a and b in one step (renameat2 with RENAME_EXCHANGE, Linux 3.15 and
// later). A kernel or file system without it gives an error wrapping errors.ErrUnsupported.
func exchangePaths(a, b string) error {
	err := unix.Renameat2(unix.AT_FDCWD, a, unix.AT_FDCWD, b, unix.RENAME_EXCHANGE)
	if errors.Is(err, unix.ENOSYS) || errors.Is(err, unix.EINVAL) {
		return fmt.Errorf("exchanging %s and %s: %w (%v)", a, b, errors.ErrUnsupported, err)
	}
	if err != nil {
		return &os.LinkError{Op: "exchange", Old: a, New: b, Err: err}
	}
	return nil
}

// renameNoReplace moves from to to, failing with an error wrapping fs.ErrExist if something
// is at to (renameat2 with RENAME_NOREPLACE); without it, a check and a rename.
func renameNoReplace(from, to string) error {
	err := unix.Renameat2(unix.AT_FDCWD, from, unix.AT_FDCWD, to, unix.RENAME_NOREPLACE)
	if errors.Is(err, unix.ENOSYS) || errors.Is(err, unix.EINVAL) {
		return checkedRename(from, to)
	}
	if err != nil {
		return &os.LinkError{Op: "rename", Old: from, New: to, Err: err}
	}
	return nil
}
