package main

import (
	"os"
	"path/filepath"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestOutputExistsIsExit1Everywhere: an output that is already there is a state of the file
// system, not a mistake in the command line: exit 1 for report, optimise --out, init and
// demo alike, naming the path and --force, with the output left unchanged. Before, report
// (and demo's report) said so with exit 2, optimise --out and init with exit 1.
func TestOutputExistsIsExit1Everywhere(t *testing.T) {
	dir := t.TempDir()
	job, second := filepath.Join(dir, "job.yaml"), filepath.Join(dir, "second.yaml")
	require.NoError(t, os.WriteFile(job, []byte(simpleJob), 0o644))
	require.NoError(t, os.WriteFile(second, []byte(simpleJob), 0o644))
	folder := filepath.Join(dir, "folder")
	require.NoError(t, os.Mkdir(folder, 0o755))
	require.NoError(t, os.WriteFile(filepath.Join(folder, "job.optimise.txt"), []byte("earlier"), 0o644))
	before := snapshot(t, dir)
	for _, args := range [][]string{
		{"report", job, "--out", folder},
		{"optimise", job, "--out", folder},
		{"optimise", second, job, "--out", folder}, // a batch
		{"init", job},
		{"demo", "--out", folder, "--format", "json"},
	} {
		stdout, stderr, code := run(t, args...)
		assert.Equal(t, exitFailure, code, "%q: %s", args, stderr)
		assert.Empty(t, stdout, "%q: nothing is printed", args)
		assert.Contains(t, stderr, "already exists; it was left unchanged", "%q", args)
		assert.Contains(t, stderr, "--force", "%q", args)
	}
	assert.Equal(t, before, snapshot(t, dir), "nothing changed")
}
