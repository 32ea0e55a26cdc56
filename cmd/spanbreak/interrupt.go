package main

import (
	"fmt"
	"io"
	"os"
	"os/signal"
	"sync"
	"syscall"
)

// interrupts turn SIGINT and SIGTERM into an orderly end with the shell's status for a
// signal, 128 + its number (130 and 143).
//
// Every command builds its results in memory, so outside a write phase there is nothing to
// tidy and a signal ends the process at once. Inside a write phase (files staged in a
// temporary folder or beside their final names) the signal is only recorded: the writer
// notices it at its next step, removes what it staged and returns a *signalError, which the
// command line maps to the status. The renames that put finished output in place are never
// cut off half-way; a signal that arrives while they run is reported once they are done. A
// second signal during a write phase ends the process at once.
//
// A nil *interrupts (in streams a test builds) handles no signal: its write phases never
// report one.
type interrupts struct {
	exit   func(code int) // os.Exit in the process; a recorder in tests
	stderr io.Writer

	mu      sync.Mutex
	got     os.Signal     // the first signal, nil before
	done    chan struct{} // closed when the first signal arrives
	writing int           // write phases in progress

	// staged, when set (tests only), is called in a write phase after each step with what
	// was staged; a test delivers its signal from it, so that it falls in the write phase.
	staged func(what string)
}

// newInterrupts returns the handler of a run that ends the process with exit.
func newInterrupts(exit func(code int), stderr io.Writer) *interrupts {
	return &interrupts{exit: exit, stderr: stderr, done: make(chan struct{})}
}

// listen delivers the given signals of the process to the handler until stop is called.
func (g *interrupts) listen(sigs ...os.Signal) (stop func()) {
	if g == nil {
		return func() {}
	}
	ch := make(chan os.Signal, 2)
	signal.Notify(ch, sigs...)
	var wg sync.WaitGroup
	wg.Add(1)
	go func() {
		defer wg.Done()
		for sig := range ch {
			g.deliver(sig)
		}
	}()
	return func() {
		signal.Stop(ch) // no send on ch after Stop returns
		close(ch)
		wg.Wait()
	}
}

// deliver handles one signal: outside a write phase, and for a second signal, it ends the
// process; inside one it records the signal for the writer.
func (g *interrupts) deliver(sig os.Signal) {
	g.mu.Lock()
	defer g.mu.Unlock()
	if g.got == nil {
		g.got = sig
		close(g.done)
		if g.writing > 0 {
			return
		}
		fmt.Fprintf(g.stderr, "spanbreak: interrupted (%s)\n", signalName(sig))
	} else {
		fmt.Fprintf(g.stderr, "spanbreak: interrupted again (%s): stopping at once\n", signalName(sig))
	}
	g.exit(signalStatus(sig))
}

// begin starts a write phase.
func (g *interrupts) begin() *writePhase {
	if g != nil {
		g.mu.Lock()
		g.writing++
		g.mu.Unlock()
	}
	return &writePhase{g: g}
}

// writePhase is one writer's view of the handler: it asks between steps whether to stop.
type writePhase struct {
	g     *interrupts
	ended bool
}

// check returns a *signalError once a signal has arrived, nil before.
func (p *writePhase) check() error {
	if p.g == nil {
		return nil
	}
	select {
	case <-p.g.done:
		p.g.mu.Lock()
		defer p.g.mu.Unlock()
		return &signalError{sig: p.g.got}
	default:
		return nil
	}
}

// stopped is closed when a signal arrives; a phase of a nil handler is never stopped.
func (p *writePhase) stopped() <-chan struct{} {
	if p.g == nil {
		return nil
	}
	return p.g.done
}

// step reports a finished step of the phase to the test hook, if any.
func (p *writePhase) step(what string) {
	if p.g != nil && p.g.staged != nil {
		p.g.staged(what)
	}
}

// end closes the phase and returns err, or, when the phase succeeded but a signal arrived
// during it, the *signalError: the output is complete and in place, and the run still ends
// with the signal's status.
func (p *writePhase) end(err error) error {
	if p.g == nil || p.ended {
		return err
	}
	p.ended = true
	p.g.mu.Lock()
	p.g.writing--
	p.g.mu.Unlock()
	if err == nil {
		err = p.check()
	}
	return err
}

// signalError is a run stopped by a signal; its exit status is 128 + the signal's number.
type signalError struct{ sig os.Signal }

func (e *signalError) Error() string { return "interrupted (" + signalName(e.sig) + ")" }

// signalName is the signal as a shell names it: SIGINT, SIGTERM.
func signalName(sig os.Signal) string {
	switch sig {
	case syscall.SIGINT:
		return "SIGINT"
	case syscall.SIGTERM:
		return "SIGTERM"
	}
	return sig.String()
}

// signalStatus is the exit status of a process ended by sig: 128 + its number, as shells
// report it (130 for SIGINT, 143 for SIGTERM).
func signalStatus(sig os.Signal) int {
	if s, ok := sig.(syscall.Signal); ok {
		return 128 + int(s)
	}
	return 128 + int(syscall.SIGINT)
}
