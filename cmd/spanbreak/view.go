package main

import (
	"context"
	"errors"
	"fmt"
	"net"
	"net/http"
	"os"
	"os/exec"
	"os/signal"
	"runtime"
	"strconv"
	"syscall"
	"time"

	"github.com/spf13/cobra"

	"spanbreak/optimise"
)

// viewOptions are the inputs of `spanbreak view`.
type viewOptions struct {
	JobFile string // path of the job file
	Port    int    // port on 127.0.0.1; 0 takes a free one
	NoOpen  bool   // do not open the browser
}

func newViewCommand(run func(viewOptions, streams) error, ios streams) *cobra.Command {
	opts := viewOptions{}
	cmd := &cobra.Command{
		Use:   "view JOB.yaml [--port N] [--no-open]",
		Short: "A page on this machine to move the splices by hand and see cost, pieces and checks change",
		Long: `view optimises the job, then serves a page on 127.0.0.1 only (a free port unless --port)
and opens it in the browser (unless --no-open). The first line printed is the page's address.

The page draws the beam with its supports, keep-out zones and envelopes (M, V, SLS w), the
recommended layout's splices as markers to drag (or to move with the arrow keys: one scan
step, ten with shift), the pieces coloured and labelled by the limit they break, the vehicle,
trips and cost, each splice's design with its governing check, the difference from the
optimum and the cost of the cheapest splice along the beam. Splices snap to the scan grid,
where the optimiser sized them, so the prices are the optimiser's own. A button writes the
report of the layout on the page into a folder.

The page needs no network beyond this machine: everything it loads is built into spanbreak.
Ctrl-C stops the server.`,
		Args: argsUsage(cobra.ExactArgs(1)),
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.JobFile = args[0]
			return run(opts, ios.of(cmd))
		},
	}
	f := cmd.Flags()
	f.IntVar(&opts.Port, "port", 0, "port to serve on, on 127.0.0.1 (default: a free port)")
	f.BoolVar(&opts.NoOpen, "no-open", false, "do not open the page in the browser")
	return cmd
}

// runView serves the page until Ctrl-C (or SIGTERM).
// The whole time of serving is a write phase of ios.Interrupts: a signal shuts the server
// down cleanly (a report being written finishes or is removed) instead of ending the process,
// and the run ends with the signal's status. Without a handler (tests) the signals are
// caught here.
func runView(opts viewOptions, ios streams) error {
	if ios.Interrupts == nil {
		ctx, stop := signal.NotifyContext(context.Background(), os.Interrupt, syscall.SIGTERM)
		defer stop()
		return serveView(ctx, opts, ios, openBrowser)
	}
	ph := ios.Interrupts.begin()
	ctx, cancel := context.WithCancel(context.Background())
	defer cancel()
	go func() {
		select {
		case <-ph.stopped():
			cancel()
		case <-ctx.Done():
		}
	}()
	return ph.end(serveView(ctx, opts, ios, openBrowser))
}

// viewShutdown bounds the wait for open requests (a report being written) when stopping.
const viewShutdown = 30 * time.Second

// serveView optimises the job, listens on 127.0.0.1, prints the address as the first line of
// stdout, calls open with it (unless NoOpen; a failure is a warning) and serves until ctx
// ends, then shuts the server down cleanly.
func serveView(ctx context.Context, opts viewOptions, ios streams, open func(url string) error) error {
	if opts.Port < 0 || opts.Port > 65535 {
		return usageError(fmt.Errorf("--port %d: want a port from 1 to 65535, or 0 for a free one", opts.Port))
	}
	setup, err := loadSetup(opts.JobFile, false)
	if err != nil {
		return err
	}
	res, runErr := optimise.Run(setup, optimise.Settings{})
	var inf *optimise.InfeasibleError
	if runErr != nil && !errors.As(runErr, &inf) {
		return runErr
	}
	if inf != nil {
		fmt.Fprintf(ios.Err, "spanbreak: warning: %v\nThe page shows why no layout fits; splices placed there say what they break.\n", runErr)
	}
	h, err := newViewHandler(res, ios.now, ios.Interrupts)
	if err != nil {
		return err
	}
	ln, err := net.Listen("tcp", net.JoinHostPort("127.0.0.1", strconv.Itoa(opts.Port)))
	if err != nil {
		return fmt.Errorf("--port %d: %w", opts.Port, err)
	}
	srv := &http.Server{Handler: h, ReadHeaderTimeout: 5 * time.Second, ReadTimeout: 15 * time.Second,
		WriteTimeout: 2 * time.Minute, IdleTimeout: time.Minute, MaxHeaderBytes: 64 << 10}
	url := "http://" + ln.Addr().String() + "/"
	fmt.Fprintln(ios.Out, url)
	fmt.Fprintf(ios.Err, "spanbreak view: %s on %s (127.0.0.1 only); press Ctrl-C to stop\n", setup.File, url)
	served := make(chan error, 1)
	go func() { served <- srv.Serve(ln) }()
	if !opts.NoOpen {
		if err := open(url); err != nil {
			fmt.Fprintf(ios.Err, "spanbreak: warning: could not open the browser (%v); open %s yourself\n", err, url)
		}
	}
	select {
	case err := <-served:
		return err // the listener failed; Serve never returns nil
	case <-ctx.Done():
	}
	shut, cancel := context.WithTimeout(context.Background(), viewShutdown)
	defer cancel()
	if err := srv.Shutdown(shut); err != nil {
		return fmt.Errorf("stopping the server: %w", err)
	}
	if err := <-served; !errors.Is(err, http.ErrServerClosed) {
		return err
	}
	fmt.Fprintln(ios.Err, "spanbreak view: stopped")
	return nil
}

// openerWait is how long openBrowser waits for the opener to report a failure; an opener
// still running then (some wait for the browser) is taken to have worked.
const openerWait = 3 * time.Second

// openBrowser asks the desktop to open a URL with the system's own opener (xdg-open, open,
// or rundll32's URL handler, by GOOS), and reports the opener's failure.
func openBrowser(url string) error {
	var cmd *exec.Cmd
	switch runtime.GOOS {
	case "darwin":
		cmd = exec.Command("open", url)
	case "windows":
		cmd = exec.Command("rundll32", "url.dll,FileProtocolHandler", url)
	default:
		cmd = exec.Command("xdg-open", url)
	}
	if err := cmd.Start(); err != nil {
		return err
	}
	done := make(chan error, 1)
	go func() { done <- cmd.Wait() }()
	select {
	case err := <-done:
		if err != nil {
			return fmt.Errorf("%s: %w", cmd.Path, err)
		}
	case <-time.After(openerWait):
	}
	return nil
}
