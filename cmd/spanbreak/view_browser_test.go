package main

import (
	"bytes"
	"context"
	"encoding/json"
	"fmt"
	"net/http"
	"os"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"sync"
	"testing"
	"time"

	"github.com/chromedp/cdproto/cdp"
	"github.com/chromedp/cdproto/emulation"
	"github.com/chromedp/cdproto/input"
	cdplog "github.com/chromedp/cdproto/log"
	"github.com/chromedp/cdproto/network"
	"github.com/chromedp/cdproto/runtime"
	"github.com/chromedp/chromedp"
	"github.com/chromedp/chromedp/kb"
	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// chromiumPath is where Debian's chromium package puts the browser; .ci/run installs it
// (apt-get install -y chromium) when it is missing.
const chromiumPath = "/usr/bin/chromium"

// screenshotEnv names a file the browser test also writes its screenshot to, for a person to
// look at; the test always writes one into its own temporary folder.
const screenshotEnv = "SPANBREAK_VIEW_SCREENSHOT"

// browserPage is a headless Chromium tab on the page of a running `spanbreak view`, with
// what the page reported: exceptions, console and log errors, and every address it asked.
type browserPage struct {
	t    *testing.T
	ctx  context.Context
	base string // the page's address, http://127.0.0.1:PORT/
	dir  string // where the screenshots go

	mu       sync.Mutex
	problems []string
	requests []string
}

// startBrowser starts Chromium (headless, no sandbox, no GPU, no background networking, no
// component updates, no sync, no first run, a fresh profile) on a 1280×800 window. A browser
// that cannot start fails the test with what it printed.
func startBrowser(t *testing.T, ctx context.Context, base string) *browserPage {
	t.Helper()
	if _, err := os.Stat(chromiumPath); err != nil {
		t.Fatalf("the browser test drives headless Chromium at %s, which is missing (%v): install it with "+
			"`apt-get install -y chromium` (.ci/run does this)", chromiumPath, err)
	}
	var out bytes.Buffer
	actx, cancelAlloc := chromedp.NewExecAllocator(ctx,
		chromedp.ExecPath(chromiumPath), chromedp.Headless, chromedp.NoSandbox, chromedp.DisableGPU,
		chromedp.Flag("disable-background-networking", true), chromedp.Flag("disable-component-update", true),
		chromedp.Flag("disable-sync", true), chromedp.NoFirstRun, chromedp.NoDefaultBrowserCheck,
		chromedp.Flag("disable-dev-shm-usage", true), chromedp.UserDataDir(t.TempDir()), chromedp.WindowSize(1280, 800),
		chromedp.CombinedOutput(&out))
	t.Cleanup(cancelAlloc)
	bctx, cancel := chromedp.NewContext(actx)
	t.Cleanup(cancel)
	p := &browserPage{t: t, ctx: bctx, base: base, dir: t.TempDir()}
	if err := chromedp.Do(bctx); err != nil {
		t.Fatalf("headless Chromium (%s) did not start: %v\nits output:\n%s", chromiumPath, err, out.String())
	}
	require.NoError(t, chromedp.Listen(bctx, p.record))
	require.NoError(t, chromedp.Do(bctx,
		chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
			if _, err := cdp.Call(ctx, tg, cdplog.Enable, cdp.Empty{}); err != nil {
				return err
			}
			if _, err := cdp.Call(ctx, tg, runtime.Enable, cdp.Empty{}); err != nil {
				return err
			}
			_, err := cdp.Call(ctx, tg, network.Enable, network.EnableParams{})
			return err
		}),
		chromedp.EmulateViewport(1280, 800)))
	return p
}

// record keeps the events that say something went wrong, and every request.
func (p *browserPage) record(ev any) {
	p.mu.Lock()
	defer p.mu.Unlock()
	switch e := ev.(type) {
	case *runtime.EventExceptionThrown:
		p.problems = append(p.problems, "exception: "+e.ExceptionDetails.Text+" "+exceptionText(e.ExceptionDetails))
	case *runtime.EventConsoleAPICalled:
		if e.Type == runtime.ConsoleAPICalledTypeError {
			p.problems = append(p.problems, fmt.Sprintf("console.error: %d args", len(e.Args)))
		}
	case *cdplog.EventEntryAdded:
		if e.Entry.Level == cdplog.EntryLevelError {
			p.problems = append(p.problems, "log: "+e.Entry.Text+" "+e.Entry.URL)
		}
	case *network.EventRequestWillBeSent:
		p.requests = append(p.requests, e.Request.URL)
	}
}

func exceptionText(d *runtime.ExceptionDetails) string {
	if d.Exception != nil {
		return d.Exception.Description
	}
	return ""
}

// do runs browser actions, failing the test on an error.
func (p *browserPage) do(steps ...chromedp.Action[chromedp.Void]) {
	p.t.Helper()
	require.NoError(p.t, chromedp.Do(p.ctx, steps...))
}

// eval evaluates a script on the page and decodes its value.
func eval[T any](p *browserPage, script string) T {
	p.t.Helper()
	v, err := chromedp.Run(p.ctx, chromedp.Evaluate[T](script))
	require.NoError(p.t, err, "%s", script)
	return v
}

// settled waits until the panel shows the answer for the splices on the page.
func (p *browserPage) settled() {
	p.t.Helper()
	_, err := chromedp.Run(p.ctx, chromedp.Poll[bool](`document.getElementById("panel").dataset.state === "current"`,
		chromedp.WithPollingTimeout(20*time.Second)))
	require.NoError(p.t, err, "the panel never showed the answer for the splices on the page")
}

// markers are the splice positions the page shows [m], left to right.
func (p *browserPage) markers() []float64 {
	p.t.Helper()
	xs := eval[[]float64](p, `[...document.querySelectorAll("#chart .marker")].map(m => Number(m.dataset.x)).sort((a, b) => a - b)`)
	return xs
}

// total is the panel's total as its raw number ("" when not admissible).
func (p *browserPage) total() string {
	p.t.Helper()
	return eval[string](p, `document.getElementById("total").dataset.value`)
}

// screenshot saves the viewport as a PNG in the test's folder and returns its path.
func (p *browserPage) screenshot(name string) string {
	p.t.Helper()
	return p.capture(name, chromedp.CaptureScreenshot())
}

// capture saves a screenshot action's PNG in the test's folder and returns its path.
func (p *browserPage) capture(name string, shot chromedp.Action[[]byte]) string {
	p.t.Helper()
	png, err := chromedp.Run(p.ctx, shot)
	require.NoError(p.t, err)
	path := filepath.Join(p.dir, name)
	require.NoError(p.t, os.WriteFile(path, png, 0o644))
	return path
}

type point struct{ X, Y float64 }

// centre is the centre of the first element a selector finds, in CSS pixels of the viewport.
func (p *browserPage) centre(selector string) point {
	p.t.Helper()
	return eval[point](p, fmt.Sprintf(`(() => { const r = document.querySelector(%q).getBoundingClientRect();
		return {X: r.x + r.width / 2, Y: r.y + r.height / 2}; })()`, selector))
}

// drag presses the left button at from, moves to to in steps and releases it there: the
// synthetic mouse events of a person dragging.
func (p *browserPage) drag(from, to point) {
	p.t.Helper()
	held := func(e *input.DispatchMouseEventParams) { e.Button, e.Buttons = input.MouseButtonLeft, 1 }
	steps := []chromedp.Action[chromedp.Void]{
		chromedp.MouseEvent(input.DispatchMouseEventTypeMouseMoved, from.X, from.Y),
		chromedp.MouseEvent(input.DispatchMouseEventTypeMousePressed, from.X, from.Y, held, chromedp.ClickCount(1)),
	}
	const n = 12
	for k := 1; k <= n; k++ {
		f := float64(k) / n
		steps = append(steps, chromedp.MouseEvent(input.DispatchMouseEventTypeMouseMoved, from.X+f*(to.X-from.X), from.Y+f*(to.Y-from.Y), held))
	}
	steps = append(steps, chromedp.MouseEvent(input.DispatchMouseEventTypeMouseReleased, to.X, to.Y, chromedp.ButtonLeft, chromedp.ClickCount(1)))
	p.do(steps...)
}

// priceOf asks the server, as a program would, for the layout through xs [m].
func priceOf(t *testing.T, base string, xs []float64) evaluationDoc {
	t.Helper()
	body, err := json.Marshal(map[string][]float64{"splices": xs})
	require.NoError(t, err)
	res, err := http.Post(base+"api/layout", "application/json", bytes.NewReader(body))
	require.NoError(t, err)
	defer res.Body.Close()
	require.Equal(t, http.StatusOK, res.StatusCode)
	var e evaluationDoc
	require.NoError(t, json.NewDecoder(res.Body).Decode(&e))
	return e
}

// totalText is the number as the API answers it, written as the page keeps it.
func totalText(e evaluationDoc) string {
	if e.Cost == nil {
		return ""
	}
	return strconv.FormatFloat(e.Cost.Total, 'f', -1, 64)
}

// TestViewInTheBrowser drives the page of `spanbreak view` on the demo job in headless
// Chromium: it loads with the recommended layout at the recommended total; a splice added
// with the button and then dragged with the mouse moves, and the panel's total becomes the
// API's price for the new positions; the keyboard moves a marker by one and ten scan steps; a
// splice in a keep-out zone and a piece over the length limit say so in words; the button
// writes the report folder; the print stylesheet hides the controls; and the page asks
// nothing of any other address and reports no error.
func TestViewInTheBrowser(t *testing.T) {
	ctx, cancel := context.WithTimeout(context.Background(), 3*time.Minute)
	defer cancel()
	served := make(chan string, 1)
	done := make(chan error, 1)
	var out, errb bytes.Buffer
	go func() {
		done <- serveView(ctx, viewOptions{JobFile: demoJob}, streams{Out: &out, Err: &errb, Now: fixedNow},
			func(url string) error { served <- url; return nil })
	}()
	var base string
	select {
	case base = <-served:
	case err := <-done:
		t.Fatalf("the view server stopped: %v", err)
	}
	t.Cleanup(func() {
		cancel()
		<-done
	})
	p := startBrowser(t, ctx, base)
	p.do(chromedp.Navigate(base))
	p.settled()

	// the recommended layout at the recommended total
	var res resultLayouts
	r, err := http.Get(base + "api/result")
	require.NoError(t, err)
	require.NoError(t, json.NewDecoder(r.Body).Decode(&res))
	r.Body.Close()
	var rec []float64
	var recTotal float64
	for _, l := range res.Layouts {
		if l.Recommended {
			rec, recTotal = l.Splices, l.Cost.Total
		}
	}
	require.NotEmpty(t, rec)
	assert.Equal(t, rec, p.markers(), "the markers are the recommended splices")
	assert.Equal(t, strconv.FormatFloat(recTotal, 'f', -1, 64), p.total())
	assert.Equal(t, fmt.Sprintf("%.2f", recTotal), eval[string](p, `document.getElementById("total").textContent`))
	assert.Contains(t, eval[string](p, `document.getElementById("difference").textContent`), "equal to the optimum")
	assert.Equal(t, len(rec)+1, eval[int](p, `document.querySelectorAll("#chart .piece").length`), "one piece more than splices")
	assert.Equal(t, 4, eval[int](p, `document.querySelectorAll("#chart .support-mark").length`), "the demo's four supports")
	assert.Positive(t, eval[int](p, `document.querySelectorAll("#chart .keep-out").length`))
	assert.Equal(t, 3, eval[int](p, `document.querySelectorAll("#chart .envelope-panel").length`), "M, V and w")
	first := p.screenshot("view-recommended.png")

	// a third splice from the button goes into the middle of the longest piece
	p.do(chromedp.Click(`#add`))
	p.settled()
	three := p.markers()
	require.Len(t, three, len(rec)+1)
	before := priceOf(t, base, three)
	require.True(t, before.Feasible, "%v", before.Reasons)
	assert.Equal(t, totalText(before), p.total())

	// drag the middle splice with the mouse to 12.5 m, where the demo's cheapest splice costs
	// more than in the middle of the longest piece (488.53 from 12.3 to 12.85 m against 409.04
	// at 11.4 to 11.55 m, in the scan of the demo job): the total changes, to the API's price
	// of the new positions; the support marks at 8 and 20.5 m give the drawing's scale
	a, b := p.centre(`.support-mark[data-x="8"] path`), p.centre(`.support-mark[data-x="20.5"] path`)
	perMetre := (b.X - a.X) / 12.5
	require.Greater(t, perMetre, 5.0, "the drawing is wide enough to drag on")
	from := p.centre(`.marker[data-name="S2"] .handle`)
	p.drag(from, point{from.X + (12.5-three[1])*perMetre, from.Y})
	p.settled()
	moved := p.markers()
	require.Len(t, moved, len(three))
	assert.InDelta(t, 12.5, moved[1], 0.3, "S2 followed the mouse")
	assert.Equal(t, []float64{three[0], three[2]}, []float64{moved[0], moved[2]}, "the other splices stay")
	api := priceOf(t, base, moved)
	require.True(t, api.Feasible, "%v", api.Reasons)
	assert.NotEqual(t, totalText(before), totalText(api), "moving S2 there changes the price")
	assert.Equal(t, totalText(api), p.total(), "the panel's total is the API's for the new positions")
	assert.Equal(t, fmt.Sprintf("%.2f", api.Cost.Total), eval[string](p, `document.getElementById("total").textContent`))
	assert.True(t, eval[bool](p, `document.activeElement.matches('.marker[data-name="S2"]')`), "the dragged marker has the focus")
	dragged := p.screenshot("view-dragged.png")

	// the keyboard: shift + right arrow is ten scan steps (0.5 m), left arrow one step back
	p.do(chromedp.KeyEvent(kb.ArrowRight, chromedp.KeyModifiers(chromedp.ModifierShift)))
	p.settled()
	assert.InDelta(t, moved[1]+10*0.05, p.markers()[1], 1e-9)
	p.do(chromedp.KeyEvent(kb.ArrowLeft))
	p.settled()
	keyed := p.markers()
	assert.InDelta(t, moved[1]+9*0.05, keyed[1], 1e-9)
	assert.Equal(t, totalText(priceOf(t, base, keyed)), p.total())

	// S3 into the keep-out round the support at 20.5 m (19.5 to 21.5 m): not admissible, in words
	p.do(chromedp.Evaluate[chromedp.Void](`document.querySelector('.marker[data-name="S3"]').focus()`))
	for p.markers()[2] < 19.55 {
		p.do(chromedp.KeyEvent(kb.ArrowRight, chromedp.KeyModifiers(chromedp.ModifierShift)))
		p.settled()
	}
	assert.Empty(t, p.total())
	assert.Equal(t, "not admissible", eval[string](p, `document.getElementById("total").textContent`))
	assert.Contains(t, eval[string](p, `document.getElementById("reasons").textContent`), "keep-out")
	assert.Contains(t, eval[string](p, `document.querySelector('.marker[data-name="S3"]').getAttribute("aria-valuetext")`), "keep-out")

	// remove S3, then S2: the last piece (5 to 30.3 m) is longer than the 18.5 m limit, and
	// says so on the drawing
	p.do(chromedp.KeyEvent(kb.Delete))
	p.settled()
	require.Len(t, p.markers(), len(rec))
	p.do(chromedp.Evaluate[chromedp.Void](`document.querySelector('.marker[data-name="S2"]').focus()`))
	p.do(chromedp.KeyEvent(kb.Delete))
	p.settled()
	require.Len(t, p.markers(), len(rec)-1)
	breaks := eval[[]string](p, `[...document.querySelectorAll("#chart .piece-break")].map(t => t.textContent)`)
	assert.Contains(t, breaks, "over max length", "the piece names the limit it breaks, beside its colour")
	assert.Contains(t, eval[string](p, `document.getElementById("pieces").textContent`), "over max length")
	breach := p.screenshot("view-breach.png")

	// back to the optimum
	p.do(chromedp.Click(`#reset`))
	p.settled()
	assert.Equal(t, rec, p.markers())
	assert.Equal(t, strconv.FormatFloat(recTotal, 'f', -1, 64), p.total())

	// the report of the layout on the page, into a folder typed in the form
	folder := filepath.Join(t.TempDir(), "from-the-page")
	p.do(chromedp.Evaluate[chromedp.Void](fmt.Sprintf(`document.getElementById("folder").value = %q`, folder)),
		chromedp.Click(`#write-report`))
	_, err = chromedp.Run(p.ctx, chromedp.Poll[bool](`document.getElementById("report-status").className !== ""`,
		chromedp.WithPollingTimeout(time.Minute)))
	require.NoError(t, err)
	assert.Equal(t, "Wrote "+strconv.Itoa(len(folderNames(t, folder)))+" files to "+folder,
		eval[string](p, `document.getElementById("report-status").textContent`))
	_, err = os.Stat(filepath.Join(folder, "report.pdf"))
	assert.NoError(t, err)

	// printed: the controls go, the drawing and the numbers stay
	p.do(chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
		_, err := cdp.Call(ctx, tg, emulation.SetEmulatedMedia, emulation.SetEmulatedMediaParams{Media: "print"})
		return err
	}))
	assert.Equal(t, "none", eval[string](p, `getComputedStyle(document.querySelector(".toolbar")).display`))
	assert.Equal(t, "none", eval[string](p, `getComputedStyle(document.getElementById("report-box")).display`))
	printed := p.capture("view-print.png", chromedp.FullScreenshot(100)) // the whole page, as it flows on paper

	p.mu.Lock()
	defer p.mu.Unlock()
	assert.Empty(t, p.problems, "the page reported errors")
	for _, u := range p.requests {
		assert.True(t, strings.HasPrefix(u, base), "the page asked %s, not its own server", u)
	}
	assert.True(t, slices.ContainsFunc(p.requests, func(u string) bool { return strings.HasSuffix(u, "/api/layout") }))
	t.Logf("screenshots: %s, %s, %s, %s", first, dragged, breach, printed)
	if dst := os.Getenv(screenshotEnv); dst != "" {
		png, err := os.ReadFile(dragged)
		require.NoError(t, err)
		require.NoError(t, os.WriteFile(dst, png, 0o644))
		for _, extra := range []string{first, breach, printed} {
			data, err := os.ReadFile(extra)
			require.NoError(t, err)
			name := strings.TrimSuffix(dst, filepath.Ext(dst)) + "-" + strings.TrimPrefix(filepath.Base(extra), "view-")
			require.NoError(t, os.WriteFile(name, data, 0o644))
		}
	}
}
