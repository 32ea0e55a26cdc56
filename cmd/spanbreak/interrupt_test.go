package main

import (
	"bytes"
	"os"
	"path/filepath"
	"sync"
	"syscall"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// runSignalled runs a command line whose first write-phase step delivers sig to the handler,
// as the signal goroutine does: the signal falls in the write phase, deterministically. The
// handler must not end the process then; the run must end by itself with the status.
func runSignalled(t *testing.T, sig syscall.Signal, args ...string) (stdout, stderr string, code int) {
	t.Helper()
	var out, errb bytes.Buffer
	g := newInterrupts(func(code int) { t.Errorf("the process was ended (status %d) in a write phase", code) }, &errb)
	var once sync.Once
	delivered := false
	g.staged = func(string) { once.Do(func() { delivered = true; g.deliver(sig) }) }
	code = executeWith(args, realRunners(), streams{Out: &out, Err: &errb, Interrupts: g})
	require.True(t, delivered, "%q has a write phase", args)
	return out.String(), errb.String(), code
}

// A signal in the write phase of every command that writes files ends it with 128 + the
// signal's number and leaves nothing half-written: no temporary file or folder, no new
// output, and an existing output exactly as it was. Before, an interrupted report left a
// hidden .out.tmp-NNNN folder of several MB beside the output.
func TestSignalInTheWritePhaseLeavesNothing(t *testing.T) {
	rows := []struct {
		name    string
		sig     syscall.Signal
		status  int
		args    func(dir, job string) []string
		prepare func(t *testing.T, dir string) // output already there
	}{
		{"report, new folder, SIGINT", syscall.SIGINT, 130,
			func(dir, job string) []string { return []string{"report", job, "--out", filepath.Join(dir, "out")} }, nil},
		{"report --force over an old folder, SIGTERM", syscall.SIGTERM, 143,
			func(dir, job string) []string {
				return []string{"report", job, "--out", filepath.Join(dir, "out"), "--force"}
			}, oldFolder},
		{"optimise --out, new folder, SIGINT", syscall.SIGINT, 130,
			func(dir, job string) []string {
				return []string{"optimise", job, "--out", filepath.Join(dir, "out"), "--format", "json"}
			}, nil},
		{"optimise --out --force over an earlier run's files, SIGTERM", syscall.SIGTERM, 143,
			func(dir, job string) []string {
				return []string{"optimise", job, "--out", filepath.Join(dir, "out"), "--force"}
			}, oldResults},
		{"optimise batch --out, SIGINT", syscall.SIGINT, 130,
			func(dir, job string) []string {
				second := filepath.Join(dir, "second.yaml")
				data, _ := os.ReadFile(job)
				_ = os.WriteFile(second, data, 0o644)
				return []string{"optimise", job, second, "--out", filepath.Join(dir, "out")}
			}, nil},
		{"init FILE, SIGINT", syscall.SIGINT, 130,
			func(dir, _ string) []string { return []string{"init", filepath.Join(dir, "new.yaml")} }, nil},
		{"init --force over a file, SIGTERM", syscall.SIGTERM, 143,
			func(dir, _ string) []string { return []string{"init", filepath.Join(dir, "out"), "--force"} }, oldFile},
		{"demo's report, SIGINT", syscall.SIGINT, 130,
			func(dir, _ string) []string {
				return []string{"demo", "--out", filepath.Join(dir, "out"), "--format", "json"}
			}, nil},
	}
	for _, r := range rows {
		t.Run(r.name, func(t *testing.T) {
			dir := t.TempDir()
			job := filepath.Join(dir, "job.yaml")
			require.NoError(t, os.WriteFile(job, []byte(simpleJob), 0o644))
			if r.prepare != nil {
				r.prepare(t, dir)
			}
			args := r.args(dir, job)
			before := snapshot(t, dir)
			_, stderr, code := runSignalled(t, r.sig, args...)
			assert.Equal(t, r.status, code, stderr)
			assert.Contains(t, stderr, "interrupted ("+signalName(r.sig)+")")
			assert.Equal(t, before, snapshot(t, dir), "the folder is exactly as it was: nothing new, nothing staged, nothing changed")
		})
	}
}

// oldFolder is an earlier output folder holding one file.
func oldFolder(t *testing.T, dir string) {
	require.NoError(t, os.Mkdir(filepath.Join(dir, "out"), 0o755))
	require.NoError(t, os.WriteFile(filepath.Join(dir, "out", "earlier.txt"), []byte("earlier work"), 0o644))
}

// oldResults is an --out folder holding an earlier run's files.
func oldResults(t *testing.T, dir string) {
	require.NoError(t, os.Mkdir(filepath.Join(dir, "out"), 0o755))
	for _, f := range []string{"job.optimise.txt", "job.optimise.json", "job.candidates.csv", "job.layouts.csv", "notes.txt"} {
		require.NoError(t, os.WriteFile(filepath.Join(dir, "out", f), []byte("earlier run"), 0o644))
	}
}

// oldFile is an earlier output file.
func oldFile(t *testing.T, dir string) {
	require.NoError(t, os.WriteFile(filepath.Join(dir, "out"), []byte("earlier work"), 0o644))
}

// snapshot maps every path under dir, hidden ones included, to its content ("/" for a folder).
func snapshot(t *testing.T, dir string) map[string]string {
	t.Helper()
	got := map[string]string{}
	require.NoError(t, filepath.WalkDir(dir, func(p string, d os.DirEntry, err error) error {
		if err != nil || p == dir {
			return err
		}
		rel, _ := filepath.Rel(dir, p)
		if d.IsDir() {
			got[rel] = "/"
			return nil
		}
		data, err := os.ReadFile(p)
		got[rel] = string(data)
		return err
	}))
	return got
}

// TestSignalOutsideTheWritePhaseEndsAtOnce: while results are being computed there is
// nothing on disk to tidy, so the handler ends the process at once with 128 + the number.
func TestSignalOutsideTheWritePhaseEndsAtOnce(t *testing.T) {
	for _, tc := range []struct {
		sig    syscall.Signal
		status int
	}{{syscall.SIGINT, 128 + 2}, {syscall.SIGTERM, 128 + 15}} { // POSIX signal numbers 2 and 15
		var errb bytes.Buffer
		var ended []int
		g := newInterrupts(func(code int) { ended = append(ended, code) }, &errb)
		g.deliver(tc.sig)
		assert.Equal(t, []int{tc.status}, ended)
		assert.Contains(t, errb.String(), "interrupted ("+signalName(tc.sig)+")")
	}
}

// TestSignalWhilePlacing: a signal after the last check of a write phase (while the finished
// output is renamed into place) is not cut off; the phase ends with the signal's status.
// A second signal in a write phase ends the process at once.
func TestSignalWhilePlacing(t *testing.T) {
	var ended []int
	g := newInterrupts(func(code int) { ended = append(ended, code) }, &bytes.Buffer{})
	ph := g.begin()
	require.NoError(t, ph.check())
	g.deliver(syscall.SIGTERM)
	assert.Empty(t, ended, "the first signal in a write phase is left to the writer")
	err := ph.end(nil)
	assert.Equal(t, 143, exitCode(err))
	assert.Empty(t, ended)

	g = newInterrupts(func(code int) { ended = append(ended, code) }, &bytes.Buffer{})
	ph = g.begin()
	g.deliver(syscall.SIGINT)
	g.deliver(syscall.SIGINT)
	assert.Equal(t, []int{130}, ended, "a second signal stops at once")
	assert.Equal(t, 130, exitCode(ph.end(nil)))
}

// TestNoHandlerNoSignal: streams without a handler (tests, library-like use) write as before.
func TestNoHandlerNoSignal(t *testing.T) {
	var g *interrupts
	ph := g.begin()
	require.NoError(t, ph.check())
	ph.step("x")
	require.NoError(t, ph.end(nil))
	g.listen(syscall.SIGINT)()
}
