package main

import (
	"bytes"
	"io/fs"
	"os"
	"path/filepath"
	"testing"

	"github.com/spf13/cobra"
	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/optimise"
)

// runMine runs a command line like execute does, on a root that has this file's commands
// (init, check, help job-file) whether or not root.go registers them yet.
func runMine(t *testing.T, args ...string) (stdout, stderr string, code int) {
	t.Helper()
	root := newRootCommand(realRunners(), streams{})
	have := map[string]bool{}
	for _, c := range root.Commands() {
		have[c.Name()] = true
	}
	for _, c := range []*cobra.Command{newInitCommand(runInit, streams{}), newCheckCommand(runCheck, streams{}), newJobFileHelpTopic()} {
		if !have[c.Name()] {
			root.AddCommand(c)
		}
	}
	var out, errb bytes.Buffer
	root.SetArgs(args)
	root.SetOut(&out)
	root.SetErr(&errb)
	if err := root.Execute(); err != nil {
		errb.WriteString("spanbreak: " + err.Error() + "\n")
		return out.String(), errb.String(), exitCode(err)
	}
	return out.String(), errb.String(), exitOK
}

// The starter job runs as it stands: it decodes and validates, the beam analyses, and a
// whole optimisation finds a layout within its limits.
func TestStarterRunsAsIs(t *testing.T) {
	s, err := optimise.Prepare("starter.yaml", optimise.StarterJob())
	require.NoError(t, err)
	_, err = s.Analyse()
	require.NoError(t, err)
	res, err := optimise.Run(s, optimise.Settings{})
	require.NoError(t, err, "the starter's limits admit a layout")
	best := res.Recommended()
	assert.NotEmpty(t, best.Splices, "25.8 m under max_piece_length 12 m needs splices")
	for _, p := range best.Pieces {
		assert.LessOrEqual(t, p.Length, 12000.0, "piece within max_piece_length [mm]")
	}
}

func TestInitPrintsStarter(t *testing.T) {
	var out bytes.Buffer
	require.NoError(t, runInit(initOptions{}, outTo(&out)))
	assert.Equal(t, string(optimise.StarterJob()), out.String())
}

func TestInitWritesFile(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "beam.yaml")
	var out bytes.Buffer
	require.NoError(t, runInit(initOptions{File: path}, outTo(&out)))
	got, err := os.ReadFile(path)
	require.NoError(t, err)
	assert.Equal(t, optimise.StarterJob(), got)
	assert.Contains(t, out.String(), "wrote "+path)
	assert.Contains(t, out.String(), "spanbreak check "+path)
	assert.Equal(t, []string{"beam.yaml"}, folderNames(t, dir))
}

func TestInitRefusesToOverwrite(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "beam.yaml")
	mine := []byte("title: my own job, hours of work\n")
	require.NoError(t, os.WriteFile(path, mine, 0o644))
	var out bytes.Buffer
	err := runInit(initOptions{File: path}, outTo(&out))
	require.Error(t, err)
	assert.ErrorIs(t, err, fs.ErrExist)
	assert.Equal(t, exitFailure, exitCode(err))
	assert.Contains(t, err.Error(), "already exists")
	assert.Contains(t, err.Error(), "--force")
	assert.Empty(t, out.String())
	got, _ := os.ReadFile(path)
	assert.Equal(t, mine, got, "the existing job is untouched")
	assert.Equal(t, []string{"beam.yaml"}, folderNames(t, dir), "nothing else is left in the folder")

	require.NoError(t, runInit(initOptions{File: path, Force: true}, outTo(&out)))
	got, _ = os.ReadFile(path)
	assert.Equal(t, optimise.StarterJob(), got, "--force replaces it")
}

// The command line: argv → options → file, exit statuses as documented.
func TestInitCommandLine(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "job.yaml")

	out, stderr, code := runMine(t, "init")
	require.Equal(t, exitOK, code, stderr)
	assert.Equal(t, string(optimise.StarterJob()), out)

	_, stderr, code = runMine(t, "init", path)
	require.Equal(t, exitOK, code, stderr)
	_, stderr, code = runMine(t, "init", path)
	assert.Equal(t, exitFailure, code)
	assert.Contains(t, stderr, "already exists")
	_, stderr, code = runMine(t, "init", path, "--force")
	assert.Equal(t, exitOK, code, stderr)

	for _, args := range [][]string{{"init", "a.yaml", "b.yaml"}, {"init", "--force"}, {"init", "--nonsense"}} {
		_, stderr, code := runMine(t, args...)
		assert.Equal(t, exitUsage, code, "%v: %s", args, stderr)
	}
	assert.Equal(t, []string{"job.yaml"}, folderNames(t, dir))
}

// Writing the starter and checking it is the path a new user takes.
func TestInitThenCheck(t *testing.T) {
	path := filepath.Join(t.TempDir(), "job.yaml")
	_, stderr, code := runMine(t, "init", path)
	require.Equal(t, exitOK, code, stderr)
	out, stderr, code := runMine(t, "check", path)
	require.Equal(t, exitOK, code, stderr)
	assert.Contains(t, out, "the job is valid")
	assert.Contains(t, out, "UB 762x267x173")
}
