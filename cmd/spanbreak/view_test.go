package main

import (
	"bytes"
	"context"
	"encoding/json"
	"errors"
	"io"
	"net/http"
	"net/http/httptest"
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"testing"
	"time"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/optimise"
)

// demoJob is the demo job as a file, so that the view and the optimise command read the same.
const demoJob = "../../optimise/demo.yaml"

// fixedNow is the clock of the tests' reports.
func fixedNow() time.Time { return time.Date(2000, 1, 2, 3, 4, 5, 0, time.UTC) }

// viewOf optimises a job file and serves its page on a test server.
func viewOf(t *testing.T, file string) (*httptest.Server, *optimise.Outcome) {
	t.Helper()
	s, err := loadSetup(file, false)
	require.NoError(t, err)
	o, err := optimise.Run(s, optimise.Settings{})
	var inf *optimise.InfeasibleError
	if err != nil {
		require.True(t, errors.As(err, &inf), "%v", err)
	}
	h, err := newViewHandler(o, fixedNow, nil)
	require.NoError(t, err)
	srv := httptest.NewServer(h)
	t.Cleanup(srv.Close)
	return srv, o
}

// answer is one response: status, headers and body.
type answer struct {
	status int
	header http.Header
	body   []byte
}

func (a answer) json(t *testing.T, v any) {
	t.Helper()
	require.Equal(t, "application/json", a.header.Get("Content-Type"), "%s", a.body)
	require.NoError(t, json.Unmarshal(a.body, v), "%s", a.body)
}

// errorText is the error message of a refusal.
func (a answer) errorText(t *testing.T) string {
	t.Helper()
	var e struct {
		Error string `json:"error"`
	}
	a.json(t, &e)
	require.NotEmpty(t, e.Error)
	return e.Error
}

func do(t *testing.T, req *http.Request) answer {
	t.Helper()
	res, err := http.DefaultClient.Do(req)
	require.NoError(t, err)
	defer res.Body.Close()
	body, err := io.ReadAll(res.Body)
	require.NoError(t, err)
	return answer{res.StatusCode, res.Header, body}
}

func get(t *testing.T, srv *httptest.Server, path string) answer {
	t.Helper()
	req, err := http.NewRequest(http.MethodGet, srv.URL+path, nil)
	require.NoError(t, err)
	return do(t, req)
}

func post(t *testing.T, srv *httptest.Server, path, body string) answer {
	t.Helper()
	req, err := http.NewRequest(http.MethodPost, srv.URL+path, strings.NewReader(body))
	require.NoError(t, err)
	req.Header.Set("Content-Type", "application/json")
	return do(t, req)
}

// evaluationDoc is the part of POST /api/layout's answer the tests read.
type evaluationDoc struct {
	Feasible bool      `json:"feasible"`
	Reasons  []string  `json:"reasons"`
	Splices  []float64 `json:"splices"`
	Pieces   []struct {
		From   float64 `json:"from"`
		To     float64 `json:"to"`
		Length float64 `json:"length"`
		Mass   float64 `json:"mass_kg"`
		Breaks []struct {
			Key, Label, Message string
		} `json:"breaks"`
	} `json:"pieces"`
	Vehicle *string `json:"vehicle"`
	Trips   int     `json:"trips"`
	Cost    *struct {
		Splices, Transport, Erection, Total float64
	} `json:"cost"`
	Designs []struct {
		Name        string   `json:"name"`
		Asked       float64  `json:"asked"`
		X           float64  `json:"x"`
		Feasible    bool     `json:"feasible"`
		Reason      *string  `json:"reason"`
		KeepOut     *string  `json:"keep_out"`
		Splice      *string  `json:"splice"`
		Bolts       *int     `json:"bolts"`
		Utilisation *float64 `json:"utilisation"`
		Governing   *string  `json:"governing"`
		Cost        *float64 `json:"cost"`
	} `json:"designs"`
	Optimum    *json.RawMessage `json:"optimum"`
	Difference *float64         `json:"difference"`
}

// resultLayouts is the part of the optimise document the tests read.
type resultLayouts struct {
	Layouts []struct {
		Kind        string          `json:"kind"`
		Recommended bool            `json:"recommended"`
		Splices     []float64       `json:"splices"`
		Pieces      json.RawMessage `json:"pieces"`
		Vehicle     *string         `json:"vehicle"`
		Trips       int             `json:"trips"`
		Cost        struct {
			Splices, Transport, Erection, Total float64
		} `json:"cost"`
	} `json:"layouts"`
}

func layoutBody(t *testing.T, xs []float64) string {
	t.Helper()
	b, err := json.Marshal(map[string][]float64{"splices": xs})
	require.NoError(t, err)
	return string(b)
}

// TestViewResultIsTheOptimiseDocument: GET /api/result is, byte for byte, what `spanbreak
// optimise JOB --format json` prints.
func TestViewResultIsTheOptimiseDocument(t *testing.T) {
	srv, _ := viewOf(t, demoJob)
	a := get(t, srv, "/api/result")
	require.Equal(t, http.StatusOK, a.status)
	assert.Equal(t, "application/json", a.header.Get("Content-Type"))
	out, _, err := runOpt(t, optimiseOptions{Paths: []string{demoJob}, Format: "json"})
	require.NoError(t, err)
	assert.Equal(t, out, string(a.body))
}

// TestViewRecommendedLayoutPricesAtTheRecommendedTotal: the recommended splices of the demo,
// posted back, price at the optimise document's recommended total, with its pieces, vehicle
// and trips, and no difference from the optimum.
func TestViewRecommendedLayoutPricesAtTheRecommendedTotal(t *testing.T) {
	srv, _ := viewOf(t, demoJob)
	var res resultLayouts
	get(t, srv, "/api/result").json(t, &res)
	var rec *struct {
		Kind        string          `json:"kind"`
		Recommended bool            `json:"recommended"`
		Splices     []float64       `json:"splices"`
		Pieces      json.RawMessage `json:"pieces"`
		Vehicle     *string         `json:"vehicle"`
		Trips       int             `json:"trips"`
		Cost        struct {
			Splices, Transport, Erection, Total float64
		} `json:"cost"`
	}
	for i := range res.Layouts {
		if res.Layouts[i].Recommended {
			rec = &res.Layouts[i]
		}
	}
	require.NotNil(t, rec)
	a := post(t, srv, "/api/layout", layoutBody(t, rec.Splices))
	require.Equal(t, http.StatusOK, a.status, "%s", a.body)
	var e evaluationDoc
	a.json(t, &e)
	require.True(t, e.Feasible, "%v", e.Reasons)
	assert.Empty(t, e.Reasons)
	require.NotNil(t, e.Cost)
	assert.Equal(t, rec.Cost.Total, e.Cost.Total, "the same total as the optimise document")
	assert.Equal(t, rec.Cost, *e.Cost)
	assert.Equal(t, *rec.Vehicle, *e.Vehicle)
	assert.Equal(t, rec.Trips, e.Trips)
	assert.Equal(t, rec.Splices, e.Splices)
	require.NotNil(t, e.Difference)
	assert.Equal(t, 0.0, *e.Difference)
	require.Len(t, e.Designs, len(rec.Splices))
	for i, d := range e.Designs {
		assert.True(t, d.Feasible)
		assert.Equal(t, rec.Splices[i], d.X)
		assert.NotEmpty(t, *d.Governing)
		assert.Greater(t, *d.Bolts, 0)
	}
	// a position between two scan positions takes the nearer one, and the same price
	moved := []float64{rec.Splices[0] + 0.02, rec.Splices[1]}
	get2 := post(t, srv, "/api/layout", layoutBody(t, moved))
	var e2 evaluationDoc
	get2.json(t, &e2)
	assert.Equal(t, rec.Cost.Total, e2.Cost.Total)
	assert.Equal(t, moved[0], e2.Designs[0].Asked)
	assert.Equal(t, rec.Splices[0], e2.Designs[0].X)
}

// TestViewLayoutRefusals: each inadmissible layout is answered with its reasons (status 200,
// feasible false), and each request that is not a layout at all is refused (4xx) with an
// error, all as JSON.
func TestViewLayoutRefusals(t *testing.T) {
	srv, _ := viewOf(t, demoJob)
	noPass, _ := viewOf(t, noSpliceJob)
	inadmissible := []struct {
		name   string
		srv    *httptest.Server
		xs     []float64
		reason string
		label  string // a piece's breach label, when a piece breaks a limit
	}{
		{"keep-out", srv, []float64{8, 18.2}, "S1 at 8 m: keep-out: 1 m each side of the support at 8 m (limits.keep_out.supports)", ""},
		{"no splice passes", noPass, []float64{5}, "S1 at 5 m: no splice passes: ", ""},
		{"piece too long", srv, []float64{5}, "piece 2 (5.005 m to 30.3 m): 25.295 m long, over max_piece_length 18.5 m (limits.max_piece_length)", "over max length"},
		{"piece too short", srv, []float64{5, 6.5, 18.2}, "under min_piece_length 3 m (limits.min_piece_length)", "under min length"},
		{"too many splices", srv, []float64{3.1, 6.5, 12, 18.2, 23}, "more than the 4 the job allows (limits.splices.max)", ""},
	}
	for _, tc := range inadmissible {
		t.Run(tc.name, func(t *testing.T) {
			a := post(t, tc.srv, "/api/layout", layoutBody(t, tc.xs))
			require.Equal(t, http.StatusOK, a.status, "%s", a.body)
			var e evaluationDoc
			a.json(t, &e)
			assert.False(t, e.Feasible)
			assert.Nil(t, e.Cost, "no price for an inadmissible layout")
			assert.Nil(t, e.Difference)
			assert.Contains(t, strings.Join(e.Reasons, "\n"), tc.reason)
			if tc.label != "" {
				var labels []string
				for _, p := range e.Pieces {
					for _, b := range p.Breaks {
						labels = append(labels, b.Label)
					}
				}
				assert.Contains(t, labels, tc.label, "the piece says what it breaks")
			}
		})
	}
	refused := []struct {
		name, method, path, body string
		status                   int
		message                  string
	}{
		{"off the beam", "POST", "/api/layout", `{"splices": [-1]}`, 400, "splices[0]: -1 m is off the beam, which runs from 0 to 30.3 m"},
		{"at the end of the beam", "POST", "/api/layout", `{"splices": [30.3]}`, 400, "off the beam"},
		{"bad JSON", "POST", "/api/layout", `{"splices": [1,}`, 400, "the body: "},
		{"not a number", "POST", "/api/layout", `{"splices": ["x"]}`, 400, "the body: "},
		{"too big a number", "POST", "/api/layout", `{"splices": [1e999]}`, 400, "the body: "},
		{"unknown field", "POST", "/api/layout", `{"splices": [13.25], "extra": 1}`, 400, `unknown field "extra"`},
		{"two values", "POST", "/api/layout", `{"splices": [13.25]} {"splices": []}`, 400, "more than one JSON value"},
		{"no splices key", "POST", "/api/layout", `{}`, 400, `"splices": give the splice positions`},
		{"too many positions", "POST", "/api/layout", `{"splices": [` + strings.Repeat("13.25,", 64) + `13.25]}`, 400, "65 splices: at most 64"},
		{"too big a body", "POST", "/api/layout", `{"splices": [` + strings.Repeat(" ", 70<<10) + `]}`, 413, "larger than 65536 bytes"},
		{"wrong method", "GET", "/api/layout", ``, 405, "GET /api/layout: use POST"},
		{"wrong method on a document", "POST", "/api/result", `{}`, 405, "POST /api/result: use GET"},
		{"unknown path", "GET", "/etc/passwd", ``, 404, "no such page: /etc/passwd"},
		{"unknown API path", "GET", "/api/nothing", ``, 404, "no such page"},
	}
	for _, tc := range refused {
		t.Run(tc.name, func(t *testing.T) {
			req, err := http.NewRequest(tc.method, srv.URL+tc.path, strings.NewReader(tc.body))
			require.NoError(t, err)
			if tc.method == "POST" {
				req.Header.Set("Content-Type", "application/json")
			}
			a := do(t, req)
			assert.Equal(t, tc.status, a.status, "%s", a.body)
			assert.Contains(t, a.errorText(t), tc.message)
			if tc.status == 405 {
				assert.NotEmpty(t, a.header.Get("Allow"))
			}
		})
	}
}

// TestViewRefusesOtherSites: a POST must be declared JSON and come from the page's own
// origin, and the server answers only to its loopback names (a renamed host is refused).
func TestViewRefusesOtherSites(t *testing.T) {
	srv, _ := viewOf(t, demoJob)
	body := `{"splices": [13.25, 26.85]}`
	for _, tc := range []struct {
		name    string
		edit    func(r *http.Request)
		status  int
		message string
	}{
		{"a form post", func(r *http.Request) { r.Header.Set("Content-Type", "text/plain") }, 403, "Content-Type: application/json"},
		{"no content type", func(r *http.Request) { r.Header.Del("Content-Type") }, 403, "Content-Type: application/json"},
		{"another origin", func(r *http.Request) { r.Header.Set("Origin", "http://example.invalid") }, 403, "only this page may ask"},
		{"another host name", func(r *http.Request) { r.Host = "rebound.example.invalid" }, 421, "answers only as 127.0.0.1 or localhost"},
		{"its own origin", func(r *http.Request) { r.Header.Set("Origin", srv.URL) }, 200, ""},
		{"localhost", func(r *http.Request) { r.Host = strings.Replace(r.Host, "127.0.0.1", "localhost", 1) }, 200, ""},
	} {
		t.Run(tc.name, func(t *testing.T) {
			req, err := http.NewRequest(http.MethodPost, srv.URL+"/api/layout", strings.NewReader(body))
			require.NoError(t, err)
			req.Header.Set("Content-Type", "application/json")
			tc.edit(req)
			a := do(t, req)
			assert.Equal(t, tc.status, a.status, "%s", a.body)
			if tc.message != "" {
				assert.Contains(t, a.errorText(t), tc.message)
			}
		})
	}
}

// TestViewPageIsItsOwn: the page and its files are served with their content types and the
// security headers, and load nothing from anywhere else.
func TestViewPageIsItsOwn(t *testing.T) {
	srv, _ := viewOf(t, demoJob)
	outside := regexp.MustCompile(`(?i)(https?:)?//[a-z0-9.-]+\.[a-z]{2,}`)
	for path, ctype := range map[string]string{"/": "text/html; charset=utf-8", "/view.js": "text/javascript; charset=utf-8",
		"/view.css": "text/css; charset=utf-8", "/favicon.svg": "image/svg+xml", "/api/beam": "application/json"} {
		a := get(t, srv, path)
		require.Equal(t, http.StatusOK, a.status, path)
		assert.Equal(t, ctype, a.header.Get("Content-Type"), path)
		assert.Contains(t, a.header.Get("Content-Security-Policy"), "default-src 'self'", path)
		assert.Equal(t, "nosniff", a.header.Get("X-Content-Type-Options"), path)
		if path == "/api/beam" {
			continue
		}
		// the only absolute address in the files is the SVG namespace, a name, not a fetch
		found := outside.FindAllString(strings.ReplaceAll(string(a.body), "http://www.w3.org/2000/svg", ""), -1)
		assert.Empty(t, found, "%s refers to another site", path)
	}
	page := string(get(t, srv, "/").body)
	assert.Contains(t, page, `<script src="/view.js" defer></script>`)
	assert.Contains(t, page, `<link rel="stylesheet" href="/view.css">`)
	assert.NotContains(t, page, "<script>", "no inline script (the CSP forbids it)")
	assert.NotContains(t, page, "style=", "no inline style (the CSP forbids it)")
}

// TestViewBeamDocument: GET /api/beam carries what the page draws: the demo's supports at 0,
// 8, 20.5 and 28.5 m (spans 8 + 12.5 + 8 m and a 1.8 m overhang, the job file), its keep-out zones with their
// keys, the envelopes at the chart stations and the scan step.
func TestViewBeamDocument(t *testing.T) {
	srv, o := viewOf(t, demoJob)
	var b struct {
		Length   float64 `json:"length"`
		Step     float64 `json:"step"`
		Supports []struct {
			X    float64 `json:"x"`
			Kind string  `json:"kind"`
		} `json:"supports"`
		KeepOut []struct {
			From, To    float64
			Reason, Key string
		} `json:"keep_out"`
		Stations []float64 `json:"stations"`
		ULS      struct {
			MMax []float64 `json:"M_max"`
			VMin []float64 `json:"V_min"`
		} `json:"uls"`
		SLS struct {
			WMax []float64 `json:"w_max"`
		} `json:"sls"`
		Deflection bool `json:"deflection"`
		Limits     struct {
			MaxPieceLength *float64 `json:"max_piece_length"`
			SplicesMax     *int     `json:"splices_max"`
		} `json:"limits"`
		Vehicles []struct{ Name string } `json:"vehicles"`
	}
	get(t, srv, "/api/beam").json(t, &b)
	assert.Equal(t, 30.3, b.Length)
	assert.Equal(t, 0.05, b.Step)
	var xs []float64
	for _, s := range b.Supports {
		xs = append(xs, s.X)
	}
	assert.Equal(t, []float64{0, 8, 20.5, 28.5}, xs)
	assert.Equal(t, "pinned", b.Supports[0].Kind)
	require.NotEmpty(t, b.KeepOut)
	assert.Equal(t, "limits.keep_out.supports", b.KeepOut[0].Key)
	assert.Len(t, b.KeepOut, len(o.Setup.Zones))
	assert.Len(t, b.Stations, len(o.Envelopes.Stations))
	assert.Len(t, b.ULS.MMax, len(b.Stations))
	assert.Len(t, b.SLS.WMax, len(b.Stations))
	assert.True(t, b.Deflection)
	require.NotNil(t, b.Limits.MaxPieceLength)
	assert.Equal(t, 18.5, *b.Limits.MaxPieceLength)
	assert.Equal(t, 4, *b.Limits.SplicesMax)
	assert.Len(t, b.Vehicles, 3)
}

// TestViewWritesTheReportOfTheLayout: POST /api/report writes the report folder of the
// splices on the page with the report command's machinery; an existing folder is refused
// unless replace is asked, and only an earlier report folder is ever replaced.
func TestViewWritesTheReportOfTheLayout(t *testing.T) {
	srv, _ := viewOf(t, demoJob)
	dir := filepath.Join(t.TempDir(), "hand")
	body := func(folder string, replace bool, xs ...float64) string {
		b, err := json.Marshal(map[string]any{"splices": xs, "folder": folder, "replace": replace})
		require.NoError(t, err)
		return string(b)
	}
	a := post(t, srv, "/api/report", body(dir, false, 13, 26.5))
	require.Equal(t, http.StatusOK, a.status, "%s", a.body)
	var ans struct {
		Folder string   `json:"folder"`
		Files  []string `json:"files"`
	}
	a.json(t, &ans)
	assert.Equal(t, dir, ans.Folder)
	assert.Contains(t, ans.Files, "report.pdf")
	assert.Equal(t, folderNames(t, dir), ans.Files, "the answer lists the files written")
	raw, err := os.ReadFile(filepath.Join(dir, "result.json"))
	require.NoError(t, err)
	var res resultLayouts
	require.NoError(t, json.Unmarshal(raw, &res))
	require.Len(t, res.Layouts, 1)
	assert.Equal(t, "placed", res.Layouts[0].Kind)
	assert.Equal(t, []float64{13, 26.5}, res.Layouts[0].Splices)
	var e evaluationDoc
	post(t, srv, "/api/layout", layoutBody(t, []float64{13, 26.5})).json(t, &e)
	assert.Equal(t, e.Cost.Total, res.Layouts[0].Cost.Total, "the report prices the layout as the page does")
	pdf, err := os.ReadFile(filepath.Join(dir, "report.pdf"))
	require.NoError(t, err)
	assert.True(t, bytes.HasPrefix(pdf, []byte("%PDF-1.")))

	a = post(t, srv, "/api/report", body(dir, false, 13, 26.5))
	assert.Equal(t, http.StatusConflict, a.status)
	assert.Contains(t, a.errorText(t), "exists; choose another folder, or tick \"replace\"")
	a = post(t, srv, "/api/report", body(dir, true, 13.25, 26.85))
	require.Equal(t, http.StatusOK, a.status, "%s", a.body)
	raw, err = os.ReadFile(filepath.Join(dir, "result.json"))
	require.NoError(t, err)
	require.NoError(t, json.Unmarshal(raw, &res))
	assert.Equal(t, []float64{13.25, 26.85}, res.Layouts[0].Splices, "replaced")

	other := t.TempDir()
	require.NoError(t, os.WriteFile(filepath.Join(other, "notes.txt"), []byte("keep me"), 0o644))
	a = post(t, srv, "/api/report", body(other, true, 13, 26.5))
	assert.Equal(t, http.StatusConflict, a.status)
	assert.Contains(t, a.errorText(t), "is not a spanbreak report folder")
	_, err = os.Stat(filepath.Join(other, "notes.txt"))
	assert.NoError(t, err, "a folder that is not a report is left alone")

	a = post(t, srv, "/api/report", body(filepath.Join(t.TempDir(), "bad"), false, 10.5, 26.5))
	assert.Equal(t, http.StatusUnprocessableEntity, a.status)
	var refusal struct {
		Error   string   `json:"error"`
		Reasons []string `json:"reasons"`
	}
	a.json(t, &refusal)
	assert.Contains(t, strings.Join(refusal.Reasons, "\n"), "keep-out")
	a = post(t, srv, "/api/report", `{"splices": [13], "folder": ""}`)
	assert.Equal(t, http.StatusBadRequest, a.status)
	assert.Contains(t, a.errorText(t), `"folder"`)
}

// TestServeViewPrintsTheAddressAndStops: the server binds 127.0.0.1 on a free port, prints
// its address as the first line of stdout, calls the opener with it (a failing opener is a
// warning), and stops cleanly when its context ends.
func TestServeViewPrintsTheAddressAndStops(t *testing.T) {
	var out, errb bytes.Buffer
	ctx, cancel := context.WithCancel(context.Background())
	defer cancel()
	opened := make(chan string, 1)
	open := func(url string) error {
		opened <- url
		return errors.New("no desktop here")
	}
	done := make(chan error, 1)
	go func() {
		done <- serveView(ctx, viewOptions{JobFile: demoJob}, streams{Out: &out, Err: &errb, Now: fixedNow}, open)
	}()
	var url string
	select {
	case url = <-opened:
	case err := <-done:
		t.Fatalf("the server stopped before serving: %v", err)
	case <-time.After(time.Minute):
		t.Fatal("the server did not start within a minute")
	}
	assert.Regexp(t, `^http://127\.0\.0\.1:\d+/$`, url)
	first, _, _ := strings.Cut(out.String(), "\n")
	assert.Equal(t, url, first, "the address is the first line of stdout")
	res, err := http.Get(url + "api/result")
	require.NoError(t, err)
	res.Body.Close()
	assert.Equal(t, http.StatusOK, res.StatusCode)
	cancel()
	select {
	case err := <-done:
		require.NoError(t, err)
	case <-time.After(time.Minute):
		t.Fatal("the server did not stop")
	}
	assert.Contains(t, errb.String(), "warning: could not open the browser (no desktop here)")
	assert.Contains(t, errb.String(), "stopped")
	_, err = http.Get(url)
	assert.Error(t, err, "nothing listens any more")

	err = serveView(context.Background(), viewOptions{JobFile: demoJob, Port: 70000}, streams{Out: &out, Err: &errb}, open)
	assert.Equal(t, exitUsage, exitCode(err))
}
