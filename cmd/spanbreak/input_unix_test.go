//go:build unix

package main

import (
	"encoding/json"
	"os"
	"path/filepath"
	"sync/atomic"
	"syscall"
	"testing"
	"time"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// fifo makes a named pipe at path. A watchdog opens and closes its writing end every ten
// seconds, so that a command that wrongly waits on it for reading comes back (with nothing
// read) and the test fails instead of hanging; stuck says whether a reader was found waiting.
func fifo(t *testing.T, path string) (stuck func() bool) {
	t.Helper()
	require.NoError(t, syscall.Mkfifo(path, 0o644))
	var found atomic.Bool
	done := make(chan struct{})
	go func() {
		for {
			select {
			case <-done:
				return
			case <-time.After(10 * time.Second):
				// without a reader a non-blocking open for writing fails (ENXIO)
				if f, err := os.OpenFile(path, os.O_WRONLY|syscall.O_NONBLOCK, 0); err == nil {
					found.Store(true)
					_ = f.Close()
				}
			}
		}
	}()
	t.Cleanup(func() { close(done) })
	return found.Load
}

// TestSpecialFileInputIsRefused: a named pipe, a device or a folder given where a job or a
// splice file goes is refused at once with exit 1, saying what it is. Before, a named pipe
// blocked every command until something wrote to it.
func TestSpecialFileInputIsRefused(t *testing.T) {
	dir := t.TempDir()
	pipe := filepath.Join(dir, "job.yaml")
	stuck := fifo(t, pipe)
	job := filepath.Join(dir, "real.yaml")
	require.NoError(t, os.WriteFile(job, []byte(simpleJob), 0o644))
	rows := []struct {
		args []string
		want string
	}{
		{[]string{"check", pipe}, "job.yaml is a named pipe (FIFO), not a regular file"},
		{[]string{"analyse", pipe}, "a named pipe (FIFO)"},
		{[]string{"design", pipe, "--at", "1"}, "a named pipe (FIFO)"},
		{[]string{"optimise", pipe}, "a named pipe (FIFO)"},
		{[]string{"report", pipe, "--out", filepath.Join(dir, "out")}, "a named pipe (FIFO)"},
		{[]string{"design", "--section", "IPE 300", "--uls", "M=50", "--splice", pipe}, "a named pipe (FIFO)"},
		{[]string{"design", job, "--at", "1", "--splice", dir}, "is a folder, not a regular file"},
		{[]string{"check", os.DevNull}, "is a character device, not a regular file"},
	}
	for _, r := range rows {
		stdout, stderr, code := run(t, r.args...)
		assert.Equal(t, exitFailure, code, "%q: %s", r.args, stderr)
		assert.Contains(t, stderr, r.want, "%q", r.args)
		assert.Empty(t, stdout, "%q", r.args)
	}
	assert.False(t, stuck(), "no command waited on the named pipe")
	assert.NoDirExists(t, filepath.Join(dir, "out"))
}

// TestBatchSkipsSpecialFiles: a batch folder holding a named pipe (or a folder) named like a
// job file skips it with a warning naming it and optimises the other jobs. Before, the pipe
// hung the whole batch.
func TestBatchSkipsSpecialFiles(t *testing.T) {
	dir := t.TempDir()
	require.NoError(t, os.WriteFile(filepath.Join(dir, "a.yaml"), []byte(simpleJob), 0o644))
	stuck := fifo(t, filepath.Join(dir, "b.yaml"))
	require.NoError(t, os.Mkdir(filepath.Join(dir, "c.yml"), 0o755))
	require.NoError(t, os.Symlink(filepath.Join(dir, "a.yaml"), filepath.Join(dir, "d.yaml")))
	require.NoError(t, os.Symlink(filepath.Join(dir, "gone.yaml"), filepath.Join(dir, "e.yaml")))

	stdout, stderr, code := run(t, "optimise", dir, "--format", "json")
	require.Equal(t, exitOK, code, stderr)
	assert.False(t, stuck(), "the batch did not wait on the named pipe")
	assert.Contains(t, stderr, "warning: skipping "+filepath.Join(dir, "b.yaml")+": it is a named pipe (FIFO), not a regular file")
	assert.Contains(t, stderr, "warning: skipping "+filepath.Join(dir, "c.yml")+": it is a folder, not a regular file")
	assert.Contains(t, stderr, "warning: skipping "+filepath.Join(dir, "e.yaml")+": no such file or directory")
	var doc struct {
		Jobs []struct {
			File  string  `json:"file"`
			Error *string `json:"error"`
		} `json:"jobs"`
	}
	require.NoError(t, json.Unmarshal([]byte(stdout), &doc))
	require.Len(t, doc.Jobs, 2, "a.yaml and the link d.yaml to it")
	assert.Equal(t, filepath.Join(dir, "a.yaml"), doc.Jobs[0].File)
	assert.Equal(t, filepath.Join(dir, "d.yaml"), doc.Jobs[1].File)
	assert.Nil(t, doc.Jobs[0].Error)

	// a named pipe given among the files of a batch is that job's error, not a hang
	stdout, stderr, code = run(t, "optimise", filepath.Join(dir, "a.yaml"), filepath.Join(dir, "b.yaml"), "--format", "json")
	assert.Equal(t, exitFailure, code, stderr)
	assert.Contains(t, stdout, "a named pipe (FIFO)")
	assert.False(t, stuck())
}
