//go:build unix

package main

import (
	"errors"
	"os"
	"os/exec"
	"path/filepath"
	"sync"
	"syscall"
	"testing"
	"time"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestRealSignalDuringReport re-runs the test binary as a spanbreak process wired as main
// wires it (executeListening), which sends itself a real SIGINT or SIGTERM in the report's
// write phase: the process exits 130 or 143, the folder beside the output is as it was.
func TestRealSignalDuringReport(t *testing.T) {
	for _, tc := range []struct {
		sig    string
		force  bool
		status int
	}{{"SIGINT", false, 130}, {"SIGTERM", true, 143}} {
		t.Run(tc.sig, func(t *testing.T) {
			dir := t.TempDir()
			require.NoError(t, os.WriteFile(filepath.Join(dir, "job.yaml"), []byte(simpleJob), 0o644))
			if tc.force {
				oldFolder(t, dir)
			}
			before := snapshot(t, dir)
			cmd := exec.Command(os.Args[0], "-test.run=^TestSignalChildProcess$")
			cmd.Env = append(os.Environ(), "SPANBREAK_SIGNAL_CHILD="+tc.sig, "SPANBREAK_SIGNAL_DIR="+dir)
			if tc.force {
				cmd.Env = append(cmd.Env, "SPANBREAK_SIGNAL_FORCE=1")
			}
			out, err := cmd.CombinedOutput()
			var exit *exec.ExitError
			require.True(t, errors.As(err, &exit), "the child ends with a status: %v\n%s", err, out)
			assert.Equal(t, tc.status, exit.ExitCode(), "%s", out)
			assert.Contains(t, string(out), "interrupted ("+tc.sig+")")
			assert.Equal(t, before, snapshot(t, dir))
		})
	}
}

// TestSignalChildProcess is the child of TestRealSignalDuringReport; on its own it skips.
func TestSignalChildProcess(t *testing.T) {
	name := os.Getenv("SPANBREAK_SIGNAL_CHILD")
	if name == "" {
		t.Skip("the child process of TestRealSignalDuringReport")
	}
	sig := map[string]syscall.Signal{"SIGINT": syscall.SIGINT, "SIGTERM": syscall.SIGTERM}[name]
	dir := os.Getenv("SPANBREAK_SIGNAL_DIR")
	args := []string{"report", filepath.Join(dir, "job.yaml"), "--out", filepath.Join(dir, "out")}
	if os.Getenv("SPANBREAK_SIGNAL_FORCE") != "" {
		args = append(args, "--force")
	}
	ios := osStreams()
	g := newInterrupts(os.Exit, ios.Err)
	var once sync.Once
	g.staged = func(string) {
		once.Do(func() {
			_ = syscall.Kill(os.Getpid(), sig)
			select { // the signal reaches the handler's goroutine before the writer goes on
			case <-g.done:
			case <-time.After(30 * time.Second):
				os.Exit(99)
			}
		})
	}
	ios.Interrupts = g
	os.Exit(executeListening(args, realRunners(), ios))
}
