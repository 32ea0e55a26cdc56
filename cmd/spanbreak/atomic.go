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

// existsError says that an output file or folder is already there and was left alone. It is
// exit status 1: a state of the file system, not a mistake in the command line.
type existsError struct {
	path string
	hint string // what to do instead, e.g. "pass --force to replace it"; "" for none
}

func (e *existsError) Error() string {
	msg := e.path + " already exists; it was left unchanged"
	if e.hint != "" {
		msg += " (" + e.hint + ")"
	}
	return msg
}

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
func writeAtomic(path string, force bool, render func(w io.Writer) error) error {
	s, err := stageFile(path, force, render)
	if err != nil {
		return err
	}
	return s.place()
}

// writeOutput is writeFileAtomic for a file the user named (init's job file) in a write
// phase: a signal before the file is placed leaves nothing behind.
func writeOutput(path string, data []byte, force bool, ph *writePhase) error {
	s, err := stageFile(path, force, func(w io.Writer) error {
		_, err := w.Write(data)
		return err
	})
	if err != nil {
		return err
	}
	ph.step(path)
	if err := ph.check(); err != nil {
		s.discard()
		return err
	}
	return s.place()
}

// stagedFile is an output written in full, and flushed, to a temporary file beside its path,
// waiting to be placed or discarded.
type stagedFile struct {
	tmp, path string
	force     bool
}

// stageFile writes the whole content of path to a temporary file in its folder. A folder at
// path is refused, and so is an existing file unless force is set (an *existsError); a
// replaced file keeps its permissions. On any error nothing is left behind.
func stageFile(path string, force bool, render func(w io.Writer) error) (_ *stagedFile, err error) {
	mode := outputMode
	switch info, statErr := os.Lstat(path); {
	case statErr == nil && info.IsDir():
		return nil, fmt.Errorf("%s is a folder, not a file", path)
	case statErr == nil && !force:
		return nil, &existsError{path: path}
	case statErr == nil && info.Mode().IsRegular():
		mode = info.Mode().Perm() // a replaced file keeps its permissions
	case statErr != nil && !errors.Is(statErr, fs.ErrNotExist):
		return nil, statErr
	}
	dir, base := filepath.Split(path)
	if dir == "" {
		dir = "."
	}
	tmp, err := os.CreateTemp(dir, "."+base+".tmp-*")
	if err != nil {
		return nil, fmt.Errorf("%s: %w", path, err)
	}
	defer func() {
		if err != nil {
			_ = tmp.Close() // a second Close after a successful one only returns an error
			_ = os.Remove(tmp.Name())
		}
	}()
	if err := render(tmp); err != nil {
		return nil, fmt.Errorf("%s: %w", path, err)
	}
	if err := tmp.Chmod(mode); err != nil {
		return nil, fmt.Errorf("%s: %w", path, err)
	}
	if err := tmp.Sync(); err != nil {
		return nil, fmt.Errorf("%s: %w", path, err)
	}
	if err := tmp.Close(); err != nil {
		return nil, fmt.Errorf("%s: %w", path, err)
	}
	return &stagedFile{tmp: tmp.Name(), path: path, force: force}, nil
}

// place moves the staged file to its path and flushes the folder entry; on error the
// temporary file is removed.
func (s *stagedFile) place() error {
	if err := place(s.tmp, s.path, s.force); err != nil {
		s.discard()
		return err
	}
	dir := filepath.Dir(s.path)
	syncDir(dir)
	return nil
}

// discard removes the staged file.
func (s *stagedFile) discard() { _ = os.Remove(s.tmp) }

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
		return &existsError{path: path}
	}
	if _, statErr := os.Lstat(path); statErr == nil {
		return &existsError{path: path}
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

// writeOutFiles writes the files into dir (made if missing) as a whole or not at all, as far
// as the file system allows: every file is staged beside its final name first, and only
// when all are staged are they renamed into place. Without force it first makes sure that
// none exists, so that a refusal leaves the folder untouched. A signal while the files are
// staged (a write phase of g) removes every staged file, and the folder if it made it, and
// returns the *signalError.
func writeOutFiles(dir string, force bool, files []outFile, g *interrupts) (err error) {
	ph := g.begin()
	defer func() { err = ph.end(err) }()
	seen := map[string]bool{}
	for _, f := range files {
		if seen[f.name] {
			return fmt.Errorf("--out: two jobs would both write %s; give the job files distinct names", f.name)
		}
		seen[f.name] = true
		if _, err := os.Lstat(filepath.Join(dir, f.name)); err == nil && !force {
			return &existsError{path: filepath.Join(dir, f.name), hint: "pass --force to replace the files"}
		}
	}
	_, statErr := os.Lstat(dir)
	made := errors.Is(statErr, fs.ErrNotExist)
	if err := os.MkdirAll(dir, 0o755); err != nil {
		return err
	}
	var staged []*stagedFile
	defer func() {
		if err != nil {
			for _, s := range staged {
				s.discard()
			}
			if made {
				_ = os.Remove(dir) // only if still empty
			}
		}
	}()
	for _, f := range files {
		if err := ph.check(); err != nil {
			return fmt.Errorf("--out %s: nothing was written: %w", dir, err)
		}
		s, err := stageFile(filepath.Join(dir, f.name), force, func(w io.Writer) error {
			_, err := w.Write(f.data)
			return err
		})
		if err != nil {
			if errors.Is(err, fs.ErrExist) {
				return &existsError{path: filepath.Join(dir, f.name), hint: "pass --force to replace the files"}
			}
			return err
		}
		staged = append(staged, s)
		ph.step(f.name)
	}
	if err := ph.check(); err != nil {
		return fmt.Errorf("--out %s: nothing was written: %w", dir, err)
	}
	for i, s := range staged {
		if err := s.place(); err != nil {
			staged = staged[i+1:] // the placed ones stay: each is complete
			made = false
			if errors.Is(err, fs.ErrExist) {
				return &existsError{path: s.path, hint: "pass --force to replace the files"}
			}
			return err
		}
	}
	return nil
}
