package main

import (
	"errors"
	"fmt"
	"io/fs"
	"os"
	"path/filepath"
)

// reportFile is one file of a folder written as a whole (the report).
type reportFile struct {
	name string
	data []byte
}

// writeFolder writes the files into a temporary folder beside dir and moves it to dir, so
// that dir is either the complete new folder or as it was. An existing dir is an
// *existsError unless replace is set; then it is exchanged with the new folder where the
// platform can (see replaceFolder), so that at every instant a complete dir exists, old or
// new. A signal in the write phase (ph) removes the temporary folder and returns the
// *signalError; nothing is left behind on any error.
func writeFolder(dir string, files []reportFile, replace bool, ph *writePhase) (err error) {
	parent, base := filepath.Split(filepath.Clean(dir))
	if parent == "" {
		parent = "."
	}
	if err := ph.check(); err != nil {
		return err
	}
	tmp, err := os.MkdirTemp(parent, "."+base+".tmp-")
	if err != nil {
		return fmt.Errorf("--out %s: %w", dir, err)
	}
	defer func() {
		if err != nil {
			_ = os.RemoveAll(tmp)
		}
	}()
	for _, f := range files {
		if err := writeFileAtomic(filepath.Join(tmp, f.name), f.data, false); err != nil {
			return err
		}
		ph.step(f.name)
		if err := ph.check(); err != nil {
			return fmt.Errorf("--out %s: nothing was written: %w", dir, err)
		}
	}
	if err := os.Chmod(tmp, 0o755); err != nil {
		return err
	}
	return placeFolder(tmp, dir, replace, platformMoves())
}

// folderMoves are the operations that put a finished folder in place; tests substitute
// failing ones.
type folderMoves struct {
	// exchange swaps two paths atomically; an error wrapping errors.ErrUnsupported says the
	// platform or the file system cannot, and nothing changed.
	exchange func(a, b string) error
	// renameNew moves a folder to a path where nothing is; an error wrapping fs.ErrExist
	// says something arrived there first, and nothing changed.
	renameNew func(from, to string) error
	rename    func(from, to string) error
}

// platformMoves are the platform's own operations.
func platformMoves() folderMoves {
	return folderMoves{exchange: exchangePaths, renameNew: renameNoReplace, rename: os.Rename}
}

// placeFolder moves the finished folder tmp to dir: into an empty place, or, with replace,
// over an existing dir (replaceFolder). Without replace an existing dir is an *existsError
// and is left alone.
func placeFolder(tmp, dir string, replace bool, mv folderMoves) error {
	exists := &existsError{path: dir, hint: "pass --force to replace the folder"}
	switch _, err := os.Lstat(dir); {
	case err == nil && !replace:
		return exists
	case err == nil:
		return replaceFolder(tmp, dir, mv)
	case !errors.Is(err, fs.ErrNotExist):
		return fmt.Errorf("--out %s: %w", dir, err)
	}
	if err := mv.renameNew(tmp, dir); err != nil {
		if errors.Is(err, fs.ErrExist) {
			return exists // it appeared since the check
		}
		return fmt.Errorf("--out %s: %w", dir, err)
	}
	syncDir(filepath.Dir(dir))
	return nil
}

// replaceFolder puts the finished folder tmp in the place of the existing dir and removes the
// old one. Where the platform can, the two are exchanged in one step (Linux renameat2 with
// RENAME_EXCHANGE), so that dir is never missing; elsewhere the old folder is moved aside,
// the new one moved in, and the old one moved back if that fails.
func replaceFolder(tmp, dir string, mv folderMoves) error {
	parent := filepath.Dir(dir)
	err := mv.exchange(tmp, dir)
	if err == nil {
		syncDir(parent)
		if err := os.RemoveAll(tmp); err != nil { // tmp holds the old folder now
			return fmt.Errorf("--out %s: the new folder is in place, but the old one (%s) could not be removed: %w", dir, tmp, err)
		}
		return nil
	}
	if !errors.Is(err, errors.ErrUnsupported) {
		return fmt.Errorf("--out %s: replacing the folder: %w", dir, err)
	}
	old := tmp + ".old"
	if err := mv.rename(dir, old); err != nil {
		return fmt.Errorf("--out %s: moving the old folder aside: %w", dir, err)
	}
	if err := mv.rename(tmp, dir); err != nil {
		if restoreErr := mv.rename(old, dir); restoreErr != nil {
			return fmt.Errorf("--out %s: %w; the old folder could not be moved back and is at %s: %v", dir, err, old, restoreErr)
		}
		return fmt.Errorf("--out %s: %w (the old folder is back in place)", dir, err)
	}
	syncDir(parent)
	if err := os.RemoveAll(old); err != nil {
		return fmt.Errorf("--out %s: the new folder is in place, but the old one (%s) could not be removed: %w", dir, old, err)
	}
	return nil
}

// checkedRename is renameNoReplace where the platform cannot refuse to replace in the rename
// itself: a check, then the rename (a folder that appears in between is still not replaced
// unless it is empty).
func checkedRename(from, to string) error {
	if _, err := os.Lstat(to); err == nil {
		return &os.LinkError{Op: "rename", Old: from, New: to, Err: fs.ErrExist}
	}
	return os.Rename(from, to)
}
