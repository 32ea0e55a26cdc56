package main

import (
	"errors"
	"io"
	"io/fs"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// folderNames returns the names in a folder, sorted.
func folderNames(t *testing.T, dir string) []string {
	t.Helper()
	entries, err := os.ReadDir(dir)
	require.NoError(t, err)
	names := make([]string, len(entries))
	for i, e := range entries {
		names[i] = e.Name()
	}
	slices.Sort(names)
	return names
}

func TestWriteFileAtomicNewFile(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "out.yaml")
	require.NoError(t, writeFileAtomic(path, []byte("a: 1\n"), false))
	got, err := os.ReadFile(path)
	require.NoError(t, err)
	assert.Equal(t, "a: 1\n", string(got))
	assert.Equal(t, []string{"out.yaml"}, folderNames(t, dir), "no temporary file is left beside it")
	info, err := os.Stat(path)
	require.NoError(t, err)
	assert.Equal(t, outputMode, info.Mode().Perm(), "an output file is readable like any text file, not 0600")
}

func TestWriteFileAtomicRefusesExisting(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "job.yaml")
	require.NoError(t, os.WriteFile(path, []byte("mine\n"), 0o600))
	err := writeFileAtomic(path, []byte("theirs\n"), false)
	require.Error(t, err)
	assert.ErrorIs(t, err, fs.ErrExist)
	assert.Contains(t, err.Error(), "job.yaml already exists")
	got, _ := os.ReadFile(path)
	assert.Equal(t, "mine\n", string(got), "the existing file is untouched")
	assert.Equal(t, []string{"job.yaml"}, folderNames(t, dir))
}

func TestWriteFileAtomicForceReplacesAndKeepsMode(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "job.yaml")
	require.NoError(t, os.WriteFile(path, []byte("old\n"), 0o600))
	require.NoError(t, os.Chmod(path, 0o600))
	require.NoError(t, writeFileAtomic(path, []byte("new\n"), true))
	got, _ := os.ReadFile(path)
	assert.Equal(t, "new\n", string(got))
	info, err := os.Stat(path)
	require.NoError(t, err)
	assert.Equal(t, fs.FileMode(0o600), info.Mode().Perm(), "a replaced file keeps its permissions")
	assert.Equal(t, []string{"job.yaml"}, folderNames(t, dir))
}

func TestWriteFileAtomicRefusesFolder(t *testing.T) {
	dir := t.TempDir()
	sub := filepath.Join(dir, "results")
	require.NoError(t, os.Mkdir(sub, 0o755))
	for _, force := range []bool{false, true} {
		err := writeFileAtomic(sub, []byte("x"), force)
		require.Error(t, err, "force %v", force)
		assert.Contains(t, err.Error(), "is a folder")
		assert.Equal(t, []string{"results"}, folderNames(t, dir))
		assert.Empty(t, folderNames(t, sub))
	}
}

func TestWriteFileAtomicMissingFolder(t *testing.T) {
	dir := t.TempDir()
	err := writeFileAtomic(filepath.Join(dir, "no-such-folder", "out.yaml"), []byte("x"), false)
	require.Error(t, err)
	assert.ErrorIs(t, err, fs.ErrNotExist)
	assert.Empty(t, folderNames(t, dir))
}

// A render that fails after writing part of its output leaves the folder as it was: no
// partial file, no temporary file, and an existing file (replaced only on success) intact.
func TestFailedWriteLeavesNoPartialOutput(t *testing.T) {
	errDisk := errors.New("simulated write failure")
	halfThenFail := func(w io.Writer) error {
		if _, err := io.WriteString(w, "first half of the output\n"); err != nil {
			return err
		}
		return errDisk
	}
	t.Run("new file", func(t *testing.T) {
		dir := t.TempDir()
		err := writeAtomic(filepath.Join(dir, "report.csv"), false, halfThenFail)
		require.ErrorIs(t, err, errDisk)
		assert.Empty(t, folderNames(t, dir))
	})
	t.Run("replacing with force", func(t *testing.T) {
		dir := t.TempDir()
		path := filepath.Join(dir, "report.csv")
		require.NoError(t, os.WriteFile(path, []byte("previous run\n"), 0o644))
		err := writeAtomic(path, true, halfThenFail)
		require.ErrorIs(t, err, errDisk)
		got, _ := os.ReadFile(path)
		assert.Equal(t, "previous run\n", string(got))
		assert.Equal(t, []string{"report.csv"}, folderNames(t, dir))
	})
}

// place never replaces a file that appeared after writeAtomic looked, unless forced.
func TestPlaceDoesNotClobber(t *testing.T) {
	dir := t.TempDir()
	tmp := filepath.Join(dir, ".out.tmp-1")
	path := filepath.Join(dir, "out.txt")
	require.NoError(t, os.WriteFile(tmp, []byte("new"), 0o644))
	require.NoError(t, os.WriteFile(path, []byte("arrived first"), 0o644))
	err := place(tmp, path, false)
	require.ErrorIs(t, err, fs.ErrExist)
	got, _ := os.ReadFile(path)
	assert.Equal(t, "arrived first", string(got))

	require.NoError(t, place(tmp, path, true))
	got, _ = os.ReadFile(path)
	assert.Equal(t, "new", string(got))
	assert.Equal(t, []string{"out.txt"}, folderNames(t, dir))
}

func TestExistsErrorMessage(t *testing.T) {
	err := error(&existsError{path: "a/b.yaml"})
	assert.True(t, errors.Is(err, fs.ErrExist))
	assert.False(t, errors.Is(err, fs.ErrNotExist))
	assert.True(t, strings.HasPrefix(err.Error(), "a/b.yaml already exists"))
}
