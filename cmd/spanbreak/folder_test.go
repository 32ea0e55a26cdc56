package main

import (
	"errors"
	"fmt"
	"io/fs"
	"os"
	"path/filepath"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// twoFolders makes an old report folder and a finished new one beside it.
func twoFolders(t *testing.T) (parent, tmp, dir string) {
	t.Helper()
	parent = t.TempDir()
	dir, tmp = filepath.Join(parent, "out"), filepath.Join(parent, ".out.tmp-1")
	for _, f := range []struct{ path, text string }{{dir, "old"}, {tmp, "new"}} {
		require.NoError(t, os.Mkdir(f.path, 0o755))
		require.NoError(t, os.WriteFile(filepath.Join(f.path, "report.pdf"), []byte(f.text), 0o644))
	}
	return parent, tmp, dir
}

// reportText is what out/report.pdf holds ("" when out/ is missing).
func reportText(t *testing.T, dir string) string {
	t.Helper()
	data, err := os.ReadFile(filepath.Join(dir, "report.pdf"))
	if errors.Is(err, fs.ErrNotExist) {
		return ""
	}
	require.NoError(t, err)
	return string(data)
}

// recordingMoves wraps the platform's operations, checking before and after each that out/
// is a complete folder (old or new).
func recordingMoves(t *testing.T, dir string, log *[]string) folderMoves {
	p := platformMoves()
	complete := func(when string) {
		if got := reportText(t, dir); got != "old" && got != "new" {
			t.Errorf("%s: no complete %s", when, dir)
		}
	}
	wrap := func(name string, f func(a, b string) error) func(a, b string) error {
		return func(a, b string) error {
			complete("before " + name)
			err := f(a, b)
			*log = append(*log, name)
			if err == nil {
				complete("after " + name)
			}
			return err
		}
	}
	return folderMoves{exchange: wrap("exchange", p.exchange), renameNew: wrap("renameNew", p.renameNew), rename: wrap("rename", p.rename)}
}

// TestReplaceFolderExchanges: where the platform exchanges two paths in one step, --force
// does nothing else to out/, so a complete out/ (old, then new) exists at every instant.
// Before, the old folder was renamed aside first, leaving no out/ until the new one moved in.
func TestReplaceFolderExchanges(t *testing.T) {
	parent, tmp, dir := twoFolders(t)
	if err := exchangePaths(tmp, dir); errors.Is(err, errors.ErrUnsupported) {
		t.Skipf("no atomic exchange on this platform or file system: %v", err)
	} else {
		require.NoError(t, err)
		require.NoError(t, exchangePaths(tmp, dir)) // and back
	}
	require.Equal(t, "old", reportText(t, dir))
	var log []string
	require.NoError(t, replaceFolder(tmp, dir, recordingMoves(t, dir, &log)))
	assert.Equal(t, []string{"exchange"}, log, "one atomic step, no rename")
	assert.Equal(t, "new", reportText(t, dir))
	assert.Equal(t, []string{"out"}, folderNames(t, parent), "the old folder is removed")
}

// unsupported is an exchange the platform does not have.
func unsupported(a, b string) error {
	return fmt.Errorf("exchanging %s and %s: %w", a, b, errors.ErrUnsupported)
}

// TestReplaceFolderFallback: without an exchange the old folder is moved aside and the new
// one in; if the new one cannot go in, the old one is moved back.
func TestReplaceFolderFallback(t *testing.T) {
	parent, tmp, dir := twoFolders(t)
	mv := platformMoves()
	mv.exchange = unsupported
	require.NoError(t, replaceFolder(tmp, dir, mv))
	assert.Equal(t, "new", reportText(t, dir))
	assert.Equal(t, []string{"out"}, folderNames(t, parent))

	parent, tmp, dir = twoFolders(t)
	mv.rename = func(from, to string) error {
		if from == tmp {
			return &os.LinkError{Op: "rename", Old: from, New: to, Err: errors.New("disk on fire")}
		}
		return os.Rename(from, to)
	}
	err := replaceFolder(tmp, dir, mv)
	require.ErrorContains(t, err, "disk on fire")
	assert.ErrorContains(t, err, "the old folder is back in place")
	assert.Equal(t, "old", reportText(t, dir), "the old folder is restored")
	assert.NotContains(t, folderNames(t, parent), ".out.tmp-1.old")
}

// TestPlaceFolderNeverReplacesWithoutForce: without --force an out/ that exists, or that
// appears between the check and the rename, is left alone (exit status 1).
func TestPlaceFolderNeverReplacesWithoutForce(t *testing.T) {
	_, tmp, dir := twoFolders(t)
	err := placeFolder(tmp, dir, false, platformMoves())
	var ee *existsError
	require.True(t, errors.As(err, &ee), "%v", err)
	assert.Equal(t, exitFailure, exitCode(err))
	assert.Contains(t, err.Error(), "--force")
	assert.Equal(t, "old", reportText(t, dir))

	// the rename that must not replace, should a folder arrive after the check: even an
	// empty one, which a plain rename(2) replaces silently (POSIX rename, "If new is an
	// existing directory ... it shall be removed ... if it is empty")
	empty := filepath.Join(filepath.Dir(dir), "empty")
	require.NoError(t, os.Mkdir(empty, 0o755))
	err = renameNoReplace(tmp, empty)
	require.ErrorIs(t, err, fs.ErrExist)
	assert.Equal(t, "", reportText(t, empty), "the folder that arrived first is left alone")
	assert.Equal(t, "new", reportText(t, tmp))
	require.NoError(t, renameNoReplace(tmp, filepath.Join(filepath.Dir(dir), "free")))
}
