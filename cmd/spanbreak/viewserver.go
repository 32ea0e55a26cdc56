package main

import (
	"bytes"
	"embed"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"math"
	"mime"
	"net"
	"net/http"
	"net/url"
	"os"
	"path/filepath"
	"strings"
	"sync"
	"time"

	"spanbreak/optimise"
	"spanbreak/plots/encode"
)

// viewAssets are the page's own files: HTML, CSS, JS and the icon, hand-written, with no
// framework and nothing loaded from elsewhere.
//
//go:embed viewpage
var viewAssets embed.FS

// Limits on what the page may send.
const (
	maxViewBody = 64 << 10 // bytes of a request body
)

// viewHandler serves the page and its API for one optimised job. Every request is checked:
// the host must be this machine's loopback name, only the page's own paths exist (404), each
// with its method (405), POST bodies are small JSON objects decoded strictly, and every
// answer carries a content type and the page's security headers.
type viewHandler struct {
	outcome *optimise.Outcome
	result  []byte // GET /api/result: the optimise document, encoded once
	beam    []byte // GET /api/beam
	now     func() time.Time
	signals *interrupts // the run's handler: a report is written in a write phase of it
	reports sync.Mutex  // one report written at a time
	routes  map[string]route
}

// route is one path of the server: its method and handler.
type route struct {
	method string
	serve  func(w http.ResponseWriter, r *http.Request)
}

// newViewHandler encodes the outcome's documents and sets up the routes.
func newViewHandler(o *optimise.Outcome, now func() time.Time, signals *interrupts) (*viewHandler, error) {
	h := &viewHandler{outcome: o, now: now, signals: signals}
	var err error
	if h.result, err = jsonBytes(encode.Optimise(o)); err != nil {
		return nil, err
	}
	if h.beam, err = jsonBytes(encode.ViewBeam(o)); err != nil {
		return nil, err
	}
	h.routes = map[string]route{
		"/":            {http.MethodGet, h.asset("index.html", "text/html; charset=utf-8")},
		"/view.css":    {http.MethodGet, h.asset("view.css", "text/css; charset=utf-8")},
		"/view.js":     {http.MethodGet, h.asset("view.js", "text/javascript; charset=utf-8")},
		"/favicon.svg": {http.MethodGet, h.asset("favicon.svg", "image/svg+xml")},
		"/api/result":  {http.MethodGet, h.document(h.result)},
		"/api/beam":    {http.MethodGet, h.document(h.beam)},
		"/api/layout":  {http.MethodPost, h.layout},
		"/api/report":  {http.MethodPost, h.report},
	}
	return h, nil
}

func jsonBytes(v any) ([]byte, error) {
	var b bytes.Buffer
	if err := encode.WriteJSON(&b, v); err != nil {
		return nil, err
	}
	return b.Bytes(), nil
}

// ServeHTTP checks the host, the path and the method, then serves the route.
func (h *viewHandler) ServeHTTP(w http.ResponseWriter, r *http.Request) {
	hdr := w.Header()
	hdr.Set("Content-Security-Policy", "default-src 'self'; img-src 'self'; style-src 'self'; script-src 'self'; "+
		"connect-src 'self'; base-uri 'none'; form-action 'none'; frame-ancestors 'none'")
	hdr.Set("X-Content-Type-Options", "nosniff")
	hdr.Set("Referrer-Policy", "no-referrer")
	hdr.Set("X-Frame-Options", "DENY")
	hdr.Set("Cache-Control", "no-store")
	if !loopbackHost(r.Host) {
		// a page of another site that renamed itself to 127.0.0.1 (DNS rebinding) gets nothing
		writeError(w, http.StatusMisdirectedRequest, fmt.Sprintf("host %q: this server answers only as 127.0.0.1 or localhost", r.Host))
		return
	}
	rt, ok := h.routes[r.URL.Path]
	if !ok {
		writeError(w, http.StatusNotFound, fmt.Sprintf("no such page: %s", r.URL.Path))
		return
	}
	if r.Method != rt.method {
		hdr.Set("Allow", rt.method)
		writeError(w, http.StatusMethodNotAllowed, fmt.Sprintf("%s %s: use %s", r.Method, r.URL.Path, rt.method))
		return
	}
	if r.Method == http.MethodPost {
		if msg := crossSite(r); msg != "" {
			writeError(w, http.StatusForbidden, msg)
			return
		}
	}
	rt.serve(w, r)
}

// loopbackHost reports whether a Host header names this machine's loopback interface.
func loopbackHost(host string) bool {
	name, _, err := net.SplitHostPort(host)
	if err != nil {
		name = host
	}
	return name == "127.0.0.1" || name == "localhost"
}

// crossSite refuses a POST another site's page could make: the body must be declared JSON
// (a browser sends that cross-site only after a preflight this server never grants), and an
// Origin, when the browser sends one, must be this server's own.
func crossSite(r *http.Request) string {
	mt, _, err := mime.ParseMediaType(r.Header.Get("Content-Type"))
	if err != nil || mt != "application/json" {
		return "the body must be JSON, sent with Content-Type: application/json"
	}
	if o := r.Header.Get("Origin"); o != "" {
		u, err := url.Parse(o)
		if err != nil || u.Scheme != "http" || u.Host != r.Host {
			return fmt.Sprintf("origin %q: only this page may ask", o)
		}
	}
	return ""
}

// asset serves one embedded file.
func (h *viewHandler) asset(name, contentType string) func(http.ResponseWriter, *http.Request) {
	return func(w http.ResponseWriter, _ *http.Request) {
		data, err := viewAssets.ReadFile("viewpage/" + name)
		if err != nil {
			panic("view: embedded asset missing: " + name) // the build embeds them all
		}
		w.Header().Set("Content-Type", contentType)
		_, _ = w.Write(data)
	}
}

// document serves a JSON document encoded once.
func (h *viewHandler) document(data []byte) func(http.ResponseWriter, *http.Request) {
	return func(w http.ResponseWriter, _ *http.Request) {
		w.Header().Set("Content-Type", "application/json")
		_, _ = w.Write(data)
	}
}

// errorDoc is the body of every refusal.
type errorDoc struct {
	Error string `json:"error"`
}

func writeError(w http.ResponseWriter, status int, msg string) {
	writeJSON(w, status, errorDoc{msg})
}

func writeJSON(w http.ResponseWriter, status int, v any) {
	data, err := jsonBytes(v)
	if err != nil {
		status, data = http.StatusInternalServerError, []byte(`{"error":"encoding the answer failed"}`+"\n")
	}
	w.Header().Set("Content-Type", "application/json")
	w.WriteHeader(status)
	_, _ = w.Write(data)
}

// decodeBody decodes a small JSON object strictly: at most maxViewBody bytes, no unknown
// fields, one value and nothing after it. It writes the refusal itself and returns false.
func decodeBody(w http.ResponseWriter, r *http.Request, v any) bool {
	dec := json.NewDecoder(http.MaxBytesReader(w, r.Body, maxViewBody))
	dec.DisallowUnknownFields()
	err := dec.Decode(v)
	if err == nil {
		switch _, extra := dec.Token(); {
		case errors.As(extra, new(*http.MaxBytesError)):
			err = extra
		case extra != io.EOF:
			err = errors.New("more than one JSON value")
		}
	}
	var tooBig *http.MaxBytesError
	switch {
	case errors.As(err, &tooBig):
		writeError(w, http.StatusRequestEntityTooLarge, fmt.Sprintf("the body is larger than %d bytes", maxViewBody))
		return false
	case err != nil:
		writeError(w, http.StatusBadRequest, "the body: "+err.Error())
		return false
	}
	return true
}

// layoutRequest is the body of POST /api/layout.
type layoutRequest struct {
	Splices *[]float64 `json:"splices"` // [m]
}

// positions checks splice positions [m] against the beam and converts them to mm.
func (h *viewHandler) positions(xs *[]float64) ([]float64, string) {
	if xs == nil {
		return nil, `"splices": give the splice positions in m, e.g. {"splices": [13.25, 26.85]} ([] for none)`
	}
	if len(*xs) > optimise.MaxEvaluatedSplices {
		return nil, fmt.Sprintf("%d splices: at most %d", len(*xs), optimise.MaxEvaluatedSplices)
	}
	length := h.outcome.Setup.Model.Length * encode.ToM
	out := make([]float64, len(*xs))
	for i, x := range *xs {
		if math.IsNaN(x) || math.IsInf(x, 0) || !(x > 0 && x < length) {
			return nil, fmt.Sprintf("splices[%d]: %g m is off the beam, which runs from 0 to %g m", i, x, length)
		}
		out[i] = x / encode.ToM
	}
	return out, ""
}

// layout prices the layout through exactly the positions asked, by the optimiser's rules.
func (h *viewHandler) layout(w http.ResponseWriter, r *http.Request) {
	var req layoutRequest
	if !decodeBody(w, r, &req) {
		return
	}
	xs, msg := h.positions(req.Splices)
	if msg != "" {
		writeError(w, http.StatusBadRequest, msg)
		return
	}
	e, err := h.outcome.Evaluate(xs)
	if err != nil {
		writeError(w, http.StatusBadRequest, err.Error())
		return
	}
	writeJSON(w, http.StatusOK, encode.Evaluation(h.outcome, e))
}

// reportRequest is the body of POST /api/report.
type reportRequest struct {
	Splices *[]float64 `json:"splices"` // [m]
	Folder  string     `json:"folder"`  // where to write; relative to the folder view was started in
	Replace bool       `json:"replace"` // replace an earlier report folder there
}

// reportAnswer is the answer of a report written.
type reportAnswer struct {
	Folder   string   `json:"folder"` // absolute
	Files    []string `json:"files"`
	Warnings []string `json:"warnings,omitempty"` // text the report font lacks, printed as ?
}

// report writes the report folder of the layout through the positions asked, with the report
// command's machinery: the outcome with that layout as its recommendation
// (optimise.Outcome.WithLayout), reportFiles and the atomic writeFolder. An existing folder
// is refused unless replace is set, and then only if it holds an earlier report.
func (h *viewHandler) report(w http.ResponseWriter, r *http.Request) {
	var req reportRequest
	if !decodeBody(w, r, &req) {
		return
	}
	xs, msg := h.positions(req.Splices)
	if msg != "" {
		writeError(w, http.StatusBadRequest, msg)
		return
	}
	if strings.TrimSpace(req.Folder) == "" {
		writeError(w, http.StatusBadRequest, `"folder": give the folder to write the report into`)
		return
	}
	dir, err := filepath.Abs(req.Folder)
	if err != nil {
		writeError(w, http.StatusBadRequest, fmt.Sprintf("folder %q: %v", req.Folder, err))
		return
	}
	e, err := h.outcome.Evaluate(xs)
	if err != nil {
		writeError(w, http.StatusBadRequest, err.Error())
		return
	}
	if !e.Feasible {
		writeJSON(w, http.StatusUnprocessableEntity, struct {
			Error   string   `json:"error"`
			Reasons []string `json:"reasons"`
		}{"the layout is not admissible; move the splices until it is", e.Reasons})
		return
	}
	h.reports.Lock()
	defer h.reports.Unlock()
	if msg, status := refuseFolder(dir, req.Replace); msg != "" {
		writeError(w, status, msg)
		return
	}
	placed, err := h.outcome.WithLayout(e)
	if err != nil {
		writeError(w, http.StatusInternalServerError, err.Error())
		return
	}
	files, warnings, err := reportFiles(placed.Setup, placed, h.now())
	if err != nil {
		writeError(w, http.StatusInternalServerError, "building the report: "+err.Error())
		return
	}
	ph := h.signals.begin()
	if err := ph.end(writeFolder(dir, files, req.Replace, ph)); err != nil {
		writeError(w, http.StatusInternalServerError, "writing the report: "+err.Error())
		return
	}
	ans := reportAnswer{Folder: dir, Warnings: warnings}
	for _, f := range files {
		ans.Files = append(ans.Files, f.name)
	}
	writeJSON(w, http.StatusOK, ans)
}

// refuseFolder says why the report may not go to dir, with the status, or "" when it may:
// an existing path is replaced only when asked, and only if it is an earlier report folder.
func refuseFolder(dir string, replace bool) (string, int) {
	info, err := os.Lstat(dir)
	switch {
	case errors.Is(err, os.ErrNotExist):
		return "", 0
	case err != nil:
		return fmt.Sprintf("%s: %v", dir, err), http.StatusBadRequest
	case !info.IsDir():
		return fmt.Sprintf("%s is a file, not a folder; choose another folder", dir), http.StatusConflict
	case !replace:
		return fmt.Sprintf("%s exists; choose another folder, or tick \"replace\" to replace an earlier report there", dir), http.StatusConflict
	case !isReportFolder(dir):
		return fmt.Sprintf("%s exists and is not a spanbreak report folder; it is never replaced, choose another folder", dir), http.StatusConflict
	}
	return "", 0
}

// isReportFolder reports whether dir holds a report folder's files.
func isReportFolder(dir string) bool {
	for _, f := range []string{"report.pdf", "result.json", "scan.csv"} {
		if info, err := os.Lstat(filepath.Join(dir, f)); err != nil || !info.Mode().IsRegular() {
			return false
		}
	}
	return true
}
