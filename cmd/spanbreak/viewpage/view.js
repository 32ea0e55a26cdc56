// spanbreak view: the page's whole program. It draws the beam from GET /api/beam and
// GET /api/result as inline SVG, lets the engineer move the splices, and asks POST
// /api/layout for the price of exactly the positions on the page. Every number shown comes
// from the server, which uses the optimiser's own rules; this file only draws.
"use strict";

(() => {
  const NS = "http://www.w3.org/2000/svg";

  // The drawing's geometry in SVG user units: one column of panels sharing the x axis.
  // W is about the drawing's width in CSS pixels at 1280 × 800, so the text sizes are pixels.
  const W = 800, LEFT = 60, RIGHT = 14, PW = W - LEFT - RIGHT;
  const PANELS = [
    { id: "beam", h: 140 },
    { id: "cost", h: 88 },
    { id: "M", h: 104 },
    { id: "V", h: 84 },
    { id: "w", h: 78 },
  ];
  const GAP = 8;
  const AXIS = 34; // below the last panel: the x axis and its label
  const BEAM = { handle: 4, label1: 38, label2: 52, top: 60, bar: 18, support: 78 };

  const state = {
    beam: null,       // GET /api/beam
    result: null,     // GET /api/result
    cands: [],        // candidate positions [m], the grid the splices snap to
    splices: [],      // {id, i}: the splices on the page, i indexes cands
    nextId: 1,
    optimum: null,    // the recommended layout of the result, or null
    version: 0,       // bumped at every change of the splices
    asked: -1,        // the version of the request in flight, -1 for none
    shown: -1,        // the version whose answer is on the page
    last: null,       // the last answer
    panelY: {},       // top of each panel
  };

  const $ = (id) => document.getElementById(id);

  function svg(name, attrs, parent) {
    const e = document.createElementNS(NS, name);
    for (const [k, v] of Object.entries(attrs || {})) e.setAttribute(k, String(v));
    if (parent) parent.appendChild(e);
    return e;
  }

  function text(parent, x, y, s, attrs) {
    const t = svg("text", Object.assign({ x, y }, attrs || {}), parent);
    t.textContent = s;
    return t;
  }

  function titled(e, s) {
    svg("title", {}, e).textContent = s;
    return e;
  }

  // Numbers for reading: fixed decimals, never "-0.00".
  function fixed(v, d) {
    const s = Number(v).toFixed(d);
    return /^-0(\.0+)?$/.test(s) ? s.slice(1) : s;
  }
  const money = (v) => fixed(v, 2);
  const m3 = (v) => fixed(v, 3);
  const X = (m) => LEFT + (m / state.beam.length) * PW;

  // --- loading ----------------------------------------------------------------------------

  async function getJSON(url) {
    const r = await fetch(url, { headers: { Accept: "application/json" } });
    if (!r.ok) throw new Error(url + ": " + r.status + " " + (await r.text()));
    return r.json();
  }

  async function start() {
    try {
      const [beam, result] = await Promise.all([getJSON("/api/beam"), getJSON("/api/result")]);
      state.beam = beam;
      state.result = result;
      state.cands = result.candidates.map((c) => c.x);
      state.optimum = result.layouts.find((l) => l.recommended) || null;
      resetToOptimum(false);
      describeJob();
      drawStatic();
      drawMarkers();
      wireControls();
      changed();
    } catch (err) {
      $("job").textContent = "The page could not load the job: " + err.message;
      $("job").className = "fatal";
    }
  }

  function describeJob() {
    const b = state.beam;
    document.title = "spanbreak view: " + (b.title || b.input);
    $("title").textContent = b.title || b.input;
    $("job").textContent = b.input + " · " + b.section + " " + b.grade + " · length " + m3(b.length) + " m · spanbreak " + b.version;
    $("snap-note").textContent = "Splices snap to the scan grid (every " + fixed(b.step, 3) + " m): each is the splice the optimiser sized at that " +
      "position, priced by the optimiser's rules, so the recommended layout costs exactly the recommended total.";
    $("caution").textContent = b.caution;
    const opt = state.optimum;
    const legend = $("legend");
    legend.replaceChildren();
    const add = (cls, label) => {
      const s = document.createElement("span");
      s.className = "swatch " + cls;
      legend.appendChild(s);
      legend.appendChild(document.createTextNode(label));
    };
    legend.appendChild(document.createTextNode("Pieces:"));
    add("sw-ok", "within every limit");
    add("sw-bad", "breaks a limit (named on the piece)");
    add("sw-keep", "keep-out zone (hatched)");
    legend.appendChild(document.createTextNode(opt ? " · dashed ▽ optimum positions" : " · no layout fits this job's limits"));
  }

  // --- the static drawing -----------------------------------------------------------------

  function drawStatic() {
    const chart = $("chart");
    let y = 0;
    for (const p of PANELS) {
      if (p.id === "w" && !state.beam.deflection) continue;
      state.panelY[p.id] = y;
      y += p.h + GAP;
    }
    state.height = y + AXIS;
    chart.setAttribute("viewBox", "0 0 " + W + " " + state.height);
    const defs = svg("defs", {}, chart);
    const keep = svg("pattern", { id: "keep-hatch", width: 6, height: 6, patternUnits: "userSpaceOnUse", patternTransform: "rotate(45)" }, defs);
    svg("rect", { width: 6, height: 6, fill: "#f3f5f6" }, keep);
    svg("line", { x1: 0, y1: 0, x2: 0, y2: 6, stroke: "#aab2b9", "stroke-width": 1.2 }, keep);
    const bad = svg("pattern", { id: "breach-hatch", width: 8, height: 8, patternUnits: "userSpaceOnUse", patternTransform: "rotate(-45)" }, defs);
    svg("line", { x1: 0, y1: 0, x2: 0, y2: 8, stroke: "#a61b1b", "stroke-width": 1.2, "stroke-opacity": 0.55 }, bad);

    state.layers = {
      zones: svg("g", { class: "zones" }, chart),
      stat: svg("g", { class: "static" }, chart),
      pieces: svg("g", { class: "pieces", "aria-label": "pieces" }, chart),
      optimum: svg("g", { class: "optimum" }, chart),
      markers: svg("g", { class: "markers", "aria-label": "splices" }, chart),
    };
    drawZones();
    drawBeam();
    drawCost();
    drawEnvelope("M", "M [kNm] ULS, sagging +", state.beam.uls.M_max, state.beam.uls.M_min, "band-uls", false);
    drawEnvelope("V", "V [kN] ULS", state.beam.uls.V_max, state.beam.uls.V_min, "band-uls", false);
    if (state.beam.deflection) {
      drawEnvelope("w", "w [mm] SLS, down +", state.beam.sls.w_max, state.beam.sls.w_min, "band-sls", true);
    }
    drawAxis(state.height - AXIS);
    drawOptimum();
  }

  function drawZones() {
    const g = state.layers.zones;
    const top = 0, bottom = state.height - AXIS;
    for (const z of state.beam.keep_out) {
      if (!(z.to > z.from)) continue;
      const r = svg("rect", { class: "keep-out", x: X(z.from), y: top, width: Math.max(X(z.to) - X(z.from), 0.5), height: bottom - top,
        "data-from": z.from, "data-to": z.to, "data-key": z.key }, g);
      titled(r, z.reason + " (" + z.key + ")");
    }
  }

  function drawBeam() {
    const g = svg("g", { class: "beam-panel" }, state.layers.stat);
    const y0 = state.panelY.beam;
    text(g, 4, y0 + BEAM.top + 14, "beam", { class: "panel-label" });
    for (const s of state.beam.supports) {
      const x = X(s.x), y = y0 + BEAM.support;
      const sg = svg("g", { class: "support-mark", "data-x": s.x, "data-kind": s.kind }, g);
      titled(sg, s.kind + " support at " + m3(s.x) + " m");
      svg("path", { class: "support", d: "M" + x + " " + y + " l-8 14 h16 z" }, sg);
      if (s.kind === "roller") svg("line", { x1: x - 10, y1: y + 18, x2: x + 10, y2: y + 18, stroke: "#1b1f24", "stroke-width": 1.2 }, sg);
      if (s.kind === "fixed") svg("line", { x1: x - 10, y1: y + 15, x2: x + 10, y2: y + 15, stroke: "#1b1f24", "stroke-width": 3 }, sg);
      text(sg, x, y + 32, fixed(s.x, 2), { class: "tick", "text-anchor": "middle" });
    }
    for (const h of state.beam.hinges) {
      titled(svg("circle", { cx: X(h), cy: y0 + BEAM.top + BEAM.bar / 2, r: 4, fill: "#fff", stroke: "#1b1f24" }, g), "hinge at " + m3(h) + " m");
    }
  }

  function drawCost() {
    const y0 = state.panelY.cost, h = PANELS[1].h;
    const g = svg("g", { class: "cost-panel" }, state.layers.stat);
    svg("rect", { class: "panel-frame", x: LEFT, y: y0, width: PW, height: h }, g);
    text(g, 4, y0 + 12, "splice cost", { class: "panel-label" });
    text(g, 4, y0 + 26, "cheapest", { class: "tick" });
    text(g, 4, y0 + 38, "at each", { class: "tick" });
    text(g, 4, y0 + 50, "position", { class: "tick" });
    const cs = state.result.candidates;
    drawNoPass(g, cs, y0 + h);
    const costs = cs.filter((c) => c.feasible).map((c) => c.cost);
    if (costs.length === 0) {
      text(g, LEFT + PW / 2, y0 + h / 2, "no position admits a splice", { class: "cost-none", "text-anchor": "middle" });
      state.costY = () => y0 + h / 2;
      return;
    }
    const max = Math.max(...costs), min = Math.min(...costs);
    const span = max > min ? max - min : Math.max(max, 1) * 0.2;
    const hi = max + 0.25 * span, lo = min - 0.25 * span;
    const Y = (v) => y0 + h - 6 - ((v - lo) / (hi - lo)) * (h - 20);
    state.costY = Y;
    let d = "";
    let open = false;
    for (const c of cs) {
      if (!c.feasible) { open = false; continue; }
      d += (open ? " L" : " M") + X(c.x).toFixed(2) + " " + Y(c.cost).toFixed(2);
      open = true;
    }
    svg("path", { class: "cost-line", d }, g);
    cs.forEach((c, k) => {
      const alone = c.feasible && !(cs[k - 1] && cs[k - 1].feasible) && !(cs[k + 1] && cs[k + 1].feasible);
      if (alone) titled(svg("circle", { class: "cost-point", cx: X(c.x), cy: Y(c.cost), r: 2.5 }, g), m3(c.x) + " m: " + money(c.cost));
    });
    text(g, LEFT + PW - 4, y0 + 11, max > min ? "from " + money(min) + " to " + money(max) : money(min) + " everywhere it passes",
      { class: "tick", "text-anchor": "end" });
  }

  // drawNoPass marks, along the bottom of the cost panel, each run of positions outside the
  // keep-out zones where no splice of the design space passes, in words where it fits.
  function drawNoPass(g, cs, bottom) {
    const step = state.beam.step;
    for (let k = 0; k < cs.length; k++) {
      if (cs[k].feasible || cs[k].keep_out) continue;
      let j = k;
      while (j + 1 < cs.length && !cs[j + 1].feasible && !cs[j + 1].keep_out) j++;
      const a = X(cs[k].x - step / 2), b = X(cs[j].x + step / 2);
      const r = svg("rect", { class: "no-pass", x: a, y: bottom - 7, width: Math.max(b - a, 1), height: 7,
        "data-from": cs[k].x, "data-to": cs[j].x }, g);
      titled(r, "no splice passes from " + m3(cs[k].x) + " to " + m3(cs[j].x) + " m (" + (cs[k].governing || "") + ")");
      if (b - a > 110) text(g, (a + b) / 2, bottom - 10, "no splice passes", { class: "no-pass-label", "text-anchor": "middle" });
      k = j;
    }
  }

  function drawEnvelope(id, label, hiVals, loVals, cls, down) {
    const y0 = state.panelY[id], h = PANELS.find((p) => p.id === id).h;
    const g = svg("g", { class: "envelope-panel", "data-quantity": id }, state.layers.stat);
    svg("rect", { class: "panel-frame", x: LEFT, y: y0, width: PW, height: h }, g);
    const words = label.split(" ");
    text(g, 4, y0 + 12, words[0] + " " + words[1], { class: "panel-label" });
    text(g, 4, y0 + 26, words.slice(2).join(" "), { class: "tick" });
    const st = state.beam.stations;
    const all = hiVals.concat(loVals, [0]);
    let top = Math.max(...all), bot = Math.min(...all);
    if (top === bot) { top += 1; bot -= 1; }
    const pad = 8;
    // values up, or down for a deflection drawn as the beam sags
    const Y = down
      ? (v) => y0 + pad + ((v - bot) / (top - bot)) * (h - 2 * pad)
      : (v) => y0 + h - pad - ((v - bot) / (top - bot)) * (h - 2 * pad);
    let d = "";
    st.forEach((x, k) => { d += (k ? " L" : "M") + X(x).toFixed(2) + " " + Y(hiVals[k]).toFixed(2); });
    for (let k = st.length - 1; k >= 0; k--) d += " L" + X(st[k]).toFixed(2) + " " + Y(loVals[k]).toFixed(2);
    svg("path", { class: cls, d: d + " Z" }, g);
    svg("line", { class: "zero", x1: LEFT, x2: LEFT + PW, y1: Y(0), y2: Y(0) }, g);
    const iMax = hiVals.indexOf(Math.max(...hiVals)), iMin = loVals.indexOf(Math.min(...loVals));
    const put = (k, v, above) => {
      const x = Math.min(Math.max(X(st[k]), LEFT + 30), LEFT + PW - 30);
      const yy = Y(v) + ((above !== down) ? -3 : 10);
      text(g, x, Math.min(Math.max(yy, y0 + 9), y0 + h - 2), fixed(v, 1), { class: "extreme", "text-anchor": "middle" });
    };
    if (hiVals[iMax] !== 0) put(iMax, hiVals[iMax], true);
    if (loVals[iMin] !== 0) put(iMin, loVals[iMin], false);
  }

  function drawAxis(y) {
    const g = svg("g", { class: "axis" }, state.layers.stat);
    svg("line", { x1: LEFT, x2: LEFT + PW, y1: y, y2: y }, g);
    const L = state.beam.length;
    const every = L > 60 ? 10 : L > 25 ? 5 : L > 10 ? 2 : 1;
    for (let x = 0; x <= L + 1e-9; x += every) {
      svg("line", { x1: X(x), x2: X(x), y1: y, y2: y + 4 }, g);
      text(g, X(x), y + 15, String(x), { "text-anchor": "middle" });
    }
    text(g, LEFT + PW, y + 28, "x [m] from the left end", { "text-anchor": "end" });
  }

  function drawOptimum() {
    const g = state.layers.optimum;
    if (!state.optimum) return;
    const y = state.panelY.beam + BEAM.top + BEAM.bar + 2;
    for (const x of state.optimum.splices) {
      titled(svg("path", { class: "optimum-mark", d: "M" + (X(x) - 5) + " " + (y + 9) + " h10 l-5 -9 z", "data-x": x }, g),
        "optimum position " + m3(x) + " m");
    }
  }

  // --- the splices on the page ------------------------------------------------------------

  // nearest is the index of the candidate nearest to x [m].
  function nearest(x) {
    const c = state.cands;
    let lo = 0, hi = c.length - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (c[mid] < x) lo = mid; else hi = mid;
    }
    return Math.abs(c[lo] - x) <= Math.abs(c[hi] - x) ? lo : hi;
  }

  function sorted() {
    return state.splices.slice().sort((a, b) => a.i - b.i || a.id - b.id);
  }

  function positions() {
    return sorted().map((s) => state.cands[s.i]);
  }

  function resetToOptimum(notify) {
    state.splices = (state.optimum ? state.optimum.splices : []).map((x) => ({ id: state.nextId++, i: nearest(x) }));
    if (notify) { drawMarkers(); changed(); }
  }

  function drawMarkers() {
    const g = state.layers.markers;
    const focused = document.activeElement && document.activeElement.dataset ? document.activeElement.dataset.id : null;
    const keep = new Map();
    for (const m of g.querySelectorAll(".marker")) keep.set(m.dataset.id, m);
    const top = state.panelY.beam + BEAM.handle, bottom = state.height - AXIS;
    const answer = state.shown === state.version ? state.last : null;
    sorted().forEach((s, k) => {
      const x = state.cands[s.i];
      const name = "S" + (k + 1);
      let m = keep.get(String(s.id));
      if (!m) {
        m = svg("g", { class: "marker", tabindex: 0, role: "slider", "data-id": s.id, "aria-valuemin": state.cands[0],
          "aria-valuemax": state.cands[state.cands.length - 1], "aria-orientation": "horizontal" }, g);
        svg("line", { class: "hit" }, m);
        svg("line", { class: "line" }, m);
        svg("path", { class: "handle" }, m);
        svg("circle", { class: "cost-dot", r: 3.5 }, m);
        svg("text", { class: "name", "text-anchor": "middle" }, m);
        wireMarker(m, s);
      }
      keep.delete(String(s.id));
      const px = X(x);
      for (const l of m.querySelectorAll("line")) { l.setAttribute("x1", px); l.setAttribute("x2", px); l.setAttribute("y1", top + 12); l.setAttribute("y2", bottom); }
      m.querySelector(".handle").setAttribute("d", "M" + (px - 7) + " " + top + " h14 v8 l-7 7 l-7 -7 z");
      const c = state.result.candidates[s.i];
      const dot = m.querySelector(".cost-dot");
      dot.setAttribute("cx", px);
      dot.setAttribute("cy", c.feasible ? state.costY(c.cost) : state.panelY.cost + PANELS[1].h - 6);
      const design = answer ? answer.designs[k] : null;
      const bad = !c.feasible || (design && !design.feasible);
      m.classList.toggle("bad", bad);
      const label = m.querySelector("text.name");
      label.setAttribute("x", Math.min(Math.max(px, LEFT + 40), LEFT + PW - 40));
      label.setAttribute("y", top + 26);
      label.textContent = name + " " + fixed(x, 2) + (bad ? " ✕" : "");
      m.setAttribute("data-x", x);
      m.setAttribute("data-name", name);
      m.setAttribute("aria-label", "Splice " + name);
      m.setAttribute("aria-valuenow", x);
      m.setAttribute("aria-valuetext", name + " at " + m3(x) + " m" + (bad ? ", " + (c.reason || (design && design.reason) || "not admissible") : ""));
    });
    for (const m of keep.values()) m.remove();
    if (focused) {
      const f = g.querySelector('.marker[data-id="' + focused + '"]');
      if (f && document.activeElement !== f) f.focus();
    }
  }

  // svgX converts a pointer's client x to metres along the beam.
  function svgX(ev) {
    const chart = $("chart");
    const pt = chart.createSVGPoint();
    pt.x = ev.clientX;
    pt.y = ev.clientY;
    const p = pt.matrixTransform(chart.getScreenCTM().inverse());
    return ((p.x - LEFT) / PW) * state.beam.length;
  }

  function moveTo(s, i) {
    i = Math.min(Math.max(i, 0), state.cands.length - 1);
    if (i === s.i) return;
    s.i = i;
    drawMarkers();
    changed();
  }

  function wireMarker(m, s) {
    m.addEventListener("pointerdown", (ev) => {
      if (ev.button !== 0) return;
      ev.preventDefault();
      m.focus();
      m.setPointerCapture(ev.pointerId);
      m.classList.add("dragging");
    });
    m.addEventListener("pointermove", (ev) => {
      if (!m.hasPointerCapture(ev.pointerId)) return;
      moveTo(s, nearest(svgX(ev)));
    });
    const end = (ev) => {
      if (m.hasPointerCapture(ev.pointerId)) m.releasePointerCapture(ev.pointerId);
      m.classList.remove("dragging");
    };
    m.addEventListener("pointerup", end);
    m.addEventListener("pointercancel", end);
    m.addEventListener("keydown", (ev) => {
      const by = ev.shiftKey ? 10 : 1;
      switch (ev.key) {
        case "ArrowLeft": case "ArrowDown": moveTo(s, s.i - by); break;
        case "ArrowRight": case "ArrowUp": moveTo(s, s.i + by); break;
        case "Home": moveTo(s, 0); break;
        case "End": moveTo(s, state.cands.length - 1); break;
        case "Delete": case "Backspace": removeSplice(s.id); break;
        default: return;
      }
      ev.preventDefault();
    });
  }

  function removeSplice(id) {
    const k = sorted().findIndex((s) => s.id === id);
    state.splices = state.splices.filter((s) => s.id !== id);
    drawMarkers();
    changed();
    const left = state.layers.markers.querySelectorAll(".marker");
    const next = [...left].sort((a, b) => a.dataset.x - b.dataset.x)[Math.min(k, left.length - 1)];
    if (next) next.focus(); else $("add").focus();
  }

  // addSplice puts a splice in the middle of the longest piece, at the admissible position
  // nearest to it, and gives it the focus.
  function addSplice() {
    if (state.splices.length >= 64) return;
    const xs = [0, ...positions(), state.beam.length];
    let a = 0, b = state.beam.length, best = -1;
    for (let k = 0; k + 1 < xs.length; k++) {
      if (xs[k + 1] - xs[k] > best) { best = xs[k + 1] - xs[k]; a = xs[k]; b = xs[k + 1]; }
    }
    const mid = nearest((a + b) / 2);
    const cs = state.result.candidates;
    let i = mid;
    for (let d = 0; d < cs.length; d++) {
      if (mid + d < cs.length && cs[mid + d].feasible) { i = mid + d; break; }
      if (mid - d >= 0 && cs[mid - d].feasible) { i = mid - d; break; }
    }
    const s = { id: state.nextId++, i };
    state.splices.push(s);
    drawMarkers();
    changed();
    const m = state.layers.markers.querySelector('.marker[data-id="' + s.id + '"]');
    if (m) m.focus();
  }

  function wireControls() {
    $("add").addEventListener("click", addSplice);
    $("reset").addEventListener("click", () => resetToOptimum(true));
    $("reset").disabled = !state.optimum;
    $("add").disabled = state.cands.length === 0;
    $("report-form").addEventListener("submit", (ev) => { ev.preventDefault(); writeReport(); });
  }

  // --- asking the server ------------------------------------------------------------------

  async function post(url, body) {
    const r = await fetch(url, { method: "POST", headers: { "Content-Type": "application/json", Accept: "application/json" },
      body: JSON.stringify(body) });
    let doc = null;
    try { doc = await r.json(); } catch (_) { doc = { error: r.status + " " + r.statusText }; }
    return { ok: r.ok, status: r.status, doc };
  }

  // changed marks the page as waiting and asks for the price of the splices on it; one
  // request at a time, the last positions always asked last.
  function changed() {
    state.version++;
    $("panel").dataset.state = "waiting";
    if (state.asked < 0) ask();
  }

  async function ask() {
    const version = state.version;
    state.asked = version;
    const xs = positions();
    let answer;
    try {
      answer = await post("/api/layout", { splices: xs });
    } catch (err) {
      answer = { ok: false, doc: { error: "the server did not answer (" + err.message + "); is spanbreak view still running?" } };
    }
    state.asked = -1;
    if (version !== state.version) { ask(); return; }
    if (!answer.ok) {
      showError(answer.doc.error);
      return;
    }
    state.last = answer.doc;
    state.shown = version;
    drawPieces(answer.doc);
    drawMarkers();
    showPanel(answer.doc);
    $("panel").dataset.state = "current";
  }

  // --- showing an answer ------------------------------------------------------------------

  const CLASS = {
    "limits.max_piece_length": "long",
    "limits.min_piece_length": "short",
    "limits.max_piece_mass": "heavy",
    vehicles: "vehicle",
    "splice.gap": "gap",
  };

  function drawPieces(ev) {
    const g = state.layers.pieces;
    g.replaceChildren();
    const y0 = state.panelY.beam;
    ev.pieces.forEach((p, k) => {
      const cls = p.breaks.length ? CLASS[p.breaks[0].key] || "long" : "ok";
      const pg = svg("g", { class: "piece " + cls, "data-piece": k + 1, "data-breaks": p.breaks.map((b) => b.label).join("; ") }, g);
      const x1 = X(p.from), x2 = X(p.to), w = Math.max(x2 - x1, 0.5);
      svg("rect", { class: "body", x: x1, y: y0 + BEAM.top, width: w, height: BEAM.bar }, pg);
      if (p.breaks.length) svg("rect", { class: "hatch", x: x1, y: y0 + BEAM.top, width: w, height: BEAM.bar }, pg);
      const name = "P" + (k + 1);
      const words = name + " · " + fixed(p.length, 3) + " m · " + fixed(p.mass_kg, 0) + " kg";
      const cx = (x1 + x2) / 2;
      // the longest label that fits the piece (about 6 px a character at 11 px)
      const fits = (s) => s.length * 6.2 + 8 <= w;
      const label = [words, name + " · " + fixed(p.length, 2) + " m", name].find(fits) || name;
      text(pg, cx, y0 + BEAM.label1, label, { class: "piece-label", "text-anchor": "middle" });
      if (p.breaks.length) {
        const what = p.breaks.map((b) => b.label).join(", ");
        text(pg, cx, y0 + BEAM.label2, fits(what) ? what : "✕ " + p.breaks[0].label, { class: "piece-break", "text-anchor": "middle" });
      }
      titled(pg, words + (p.breaks.length ? ": " + p.breaks.map((b) => b.message).join("; ") : ", within every limit"));
    });
  }

  function cell(tr, s, cls) {
    const td = document.createElement("td");
    td.textContent = s;
    if (cls) td.className = cls;
    tr.appendChild(td);
    return td;
  }

  function showPanel(ev) {
    const total = $("total");
    if (ev.cost) {
      total.textContent = money(ev.cost.total);
      total.dataset.value = String(ev.cost.total);
    } else {
      total.textContent = "not admissible";
      total.dataset.value = "";
    }
    const diff = $("difference");
    const opt = ev.optimum;
    const where = opt ? money(opt.cost.total) + " (" + opt.splices.length + " splice" + (opt.splices.length === 1 ? "" : "s") +
      (opt.splices.length ? " at " + opt.splices.map((x) => fixed(x, 2)).join(", ") + " m" : "") + ")" : "";
    if (ev.difference !== null && ev.difference !== undefined && opt) {
      const d = ev.difference;
      diff.textContent = (Math.abs(d) < 0.005 ? "equal to" : (d > 0 ? "+" + money(d) + " more than" : money(d) + " against")) +
        " the optimum " + where;
      diff.dataset.value = String(d);
    } else if (opt) {
      diff.textContent = "the optimum costs " + where;
      diff.dataset.value = "";
    } else {
      diff.textContent = "no layout fits this job's limits, so there is no optimum to compare with";
      diff.dataset.value = "";
    }
    const status = $("status");
    status.textContent = ev.feasible ? "Admissible: every piece within every limit" : "Not admissible:";
    status.className = ev.feasible ? "ok" : "bad";
    const reasons = $("reasons");
    reasons.replaceChildren();
    for (const r of ev.reasons) {
      const li = document.createElement("li");
      li.textContent = r;
      reasons.appendChild(li);
    }
    const c = ev.cost;
    $("cost-splices").textContent = c ? money(c.splices) : "–";
    $("cost-transport").textContent = c ? money(c.transport) : "–";
    $("cost-erection").textContent = c ? money(c.erection) : "–";
    $("cost-total").textContent = c ? money(c.total) : "–";
    $("vehicle").textContent = ev.vehicle ? ev.vehicle + ", " + ev.trips + " trip" + (ev.trips === 1 ? "" : "s")
      : (c ? "none costed" : "–");

    const pieces = $("pieces").tBodies[0];
    pieces.replaceChildren();
    ev.pieces.forEach((p, k) => {
      const tr = document.createElement("tr");
      cell(tr, "P" + (k + 1));
      cell(tr, m3(p.from) + "–" + m3(p.to));
      cell(tr, m3(p.length), "n");
      cell(tr, fixed(p.mass_kg, 0), "n");
      if (p.breaks.length) cell(tr, p.breaks.map((b) => b.label).join(", "), "breaks");
      else cell(tr, "within limits", "fine");
      pieces.appendChild(tr);
    });

    const designs = $("designs").tBodies[0];
    designs.replaceChildren();
    const ids = sorted();
    ev.designs.forEach((d, k) => {
      const tr = document.createElement("tr");
      cell(tr, d.name);
      cell(tr, m3(d.x), "n");
      const td = cell(tr, "");
      if (d.feasible) {
        td.textContent = d.bolts + " bolts, utilisation " + fixed(d.utilisation, 3) + " (" + d.governing + ")";
        const words = document.createElement("span");
        words.className = "design-words";
        words.textContent = d.splice;
        td.appendChild(words);
      } else {
        td.textContent = d.reason;
        td.className = "design-bad";
      }
      cell(tr, d.feasible ? money(d.cost) : "–", "n");
      const rm = document.createElement("td");
      rm.className = "no-print";
      const b = document.createElement("button");
      b.type = "button";
      b.className = "remove";
      b.textContent = "remove";
      b.setAttribute("aria-label", "remove splice " + d.name);
      const id = ids[k] ? ids[k].id : null;
      b.addEventListener("click", () => { if (id !== null) removeSplice(id); });
      rm.appendChild(b);
      tr.appendChild(rm);
      designs.appendChild(tr);
    });
    $("write-report").disabled = !ev.feasible;
  }

  function showError(msg) {
    const status = $("status");
    status.textContent = msg;
    status.className = "bad";
    $("panel").dataset.state = "error";
  }

  async function writeReport() {
    const out = $("report-status");
    const folder = $("folder").value.trim();
    if (!folder) { out.textContent = "Give the folder to write."; out.className = "bad"; return; }
    out.textContent = "Writing the report…";
    out.className = "";
    $("write-report").disabled = true;
    try {
      const r = await post("/api/report", { splices: positions(), folder, replace: $("replace").checked });
      if (r.ok) {
        out.textContent = "Wrote " + r.doc.files.length + " files to " + r.doc.folder;
        out.className = "ok";
      } else {
        out.textContent = r.doc.error + (r.doc.reasons ? ": " + r.doc.reasons.join("; ") : "");
        out.className = "bad";
      }
    } catch (err) {
      out.textContent = "The server did not answer: " + err.message;
      out.className = "bad";
    }
    $("write-report").disabled = !(state.last && state.last.feasible);
  }

  start();
})();
