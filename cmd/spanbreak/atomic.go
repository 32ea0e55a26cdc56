package main

import (
	"errors"
	"fmt"
	"io"
	"io/fs"
	"os"
	"path/filepath"
)

// outputMode is the permission of a new output file: readable by all, as an editor would
// make it, rather than the 0600 a temporary file is created with.
const outputMode fs.FileMode = 0o644

// existsError says that an output file is already there and was left alone.
type existsError struct{ path string }

func (e *existsError) Error() string { return e.path + " already exists; it was left unchanged" }

// Is makes errors.Is(err, fs.ErrExist) true.
func (e *existsError) Is(target error) bool { return target == fs.ErrExist }

// writeFileAtomic writes data to path so that a reader, or a crash, sees either the old state
// or the whole new file, never a part: the data goes to a temporary file in the same folder,
// is flushed to disk, and is then renamed to path. An existing file is replaced only when
// force is set; otherwise the error wraps fs.ErrExist and nothing changes. On any error the
// temporary file is removed, so the folder is left as it was.
func writeFileAtomic(path string, data []byte, force bool) error {
	return writeAtomic(path, force, func(w io.Writer) error {
		_, err := w.Write(data)
		return err
	})
}

// writeAtomic is writeFileAtomic for output that is rendered straight into the file: render
// writes the whole content to w; if it fails, nothing is left behind.
func writeAtomic(path string, force bool, render func(w io.Writer) error) (err error) {
	mode := outputMode
	switch info, statErr := os.Lstat(path); {
	case statErr == nil && info.IsDir():
		return fmt.Errorf("%s is a folder, not a file", path)
	case statErr == nil && !force:
		return &existsError{path}
	case statErr == nil && info.Mode().IsRegular():
		mode = info.Mode().Perm() // a replaced file keeps its permissions
	case statErr != nil && !errors.Is(statErr, fs.ErrNotExist):
		return statErr
	}
	dir, base := filepath.Split(path)
	if dir == "" {
		dir = "."
	}
	tmp, err := os.CreateTemp(dir, "."+base+".tmp-*")
	if err != nil {
		return fmt.Errorf("%s: %w", path, err)
	}
	tmpName := tmp.Name()
	placed := false
	defer func() {
		if !placed {
			_ = tmp.Close() // a second Close after a successful one only returns an error
			_ = os.Remove(tmpName)
		}
	}()
	if err := render(tmp); err != nil {
		return fmt.Errorf("%s: %w", path, err)
	}
	if err := tmp.Chmod(mode); err != nil {
		return fmt.Errorf("%s: %w", path, err)
	}
	if err := tmp.Sync(); err != nil {
		return fmt.Errorf("%s: %w", path, err)
	}
	if err := tmp.Close(); err != nil {
		return fmt.Errorf("%s: %w", path, err)
	}
	if err := place(tmpName, path, force); err != nil {
		return err
	}
	placed = true
	syncDir(dir)
	return nil
}

// place moves the finished temporary file to path. Without force it links rather than
// renames, so a file that appeared at path since the check above is still never replaced; a
// file system without hard links falls back to a check and a rename.
func place(tmpName, path string, force bool) error {
	if force {
		if err := os.Rename(tmpName, path); err != nil {
			return fmt.Errorf("%s: %w", path, err)
		}
		return nil
	}
	err := os.Link(tmpName, path)
	switch {
	case err == nil:
		_ = os.Remove(tmpName) // path holds the data now; the extra name goes
		return nil
	case errors.Is(err, fs.ErrExist):
		return &existsError{path}
	}
	if _, statErr := os.Lstat(path); statErr == nil {
		return &existsError{path}
	}
	if err := os.Rename(tmpName, path); err != nil {
		return fmt.Errorf("%s: %w", path, err)
	}
	return nil
}

// syncDir flushes the folder entry of a renamed file to disk. It is best effort: some systems
// cannot open or sync a folder, and the file itself is already complete and in place.
func syncDir(dir string) {
	d, err := os.Open(dir)
	if err != nil {
		return
	}
	_ = d.Sync()
	_ = d.Close()
}
