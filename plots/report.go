package plots

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strings"
	"time"

	"spanbreak/beam"
	"spanbreak/optimise"
	"spanbreak/plots/encode"
	"spanbreak/splice"
)

// ReportInput is everything the calculation report prints.
type ReportInput struct {
	Outcome *optimise.Outcome // the job, its analysis, the scan, the layouts and the chosen splices
	Version string            // program version printed on every page
	Date    string            // date printed on the report; "": Time's date (the caller's today; tests fix it)
	// Time is the run's time, written as the PDF's creation and modification dates: the
	// caller's clock, or SOURCE_DATE_EPOCH for reproducible output. The zero Time writes
	// 2000-01-01, so that a test's PDF is a pure function of its input.
	Time     time.Time
	Caution  string // the caution every output carries
	Ranking  int    // rows of the ranking table; 0 means 10
	Currency string // cost unit; empty: "cost units"
}

// Report is the calculation report and everything it is made of.
type Report struct {
	PDF      []byte
	Pages    int
	Text     string                 // every string the PDF prints, in order (headers and footers included)
	Headings []Heading              // the numbered headings with the page each starts on
	Figures  []*Figure              // every chart and drawing, for PNG and SVG files
	Sheets   []optimise.SpliceSheet // the chosen layout's splices with their full checks
	Bill     optimise.LayoutBill    // the chosen layout's bill of materials, splice by splice and in all
	Scan     []ScanPoint            // the candidates as charted
	Layouts  LayoutInput            // the layouts as charted
	Charts   map[string]*Chart
	// Warnings name the user's text the report fonts cannot show, each at its key in the job
	// file ("job.yaml:1:8: title: 2 characters are not in the report font and print as ?");
	// the PDF prints those characters as "?".
	Warnings []string
}

// Heading is a numbered heading of the report and its page.
type Heading struct {
	Number, Title string
	Page          int
}

// reportStations is the number of intervals the envelope chart samples along the beam (the
// analysis adds every support, load point and jump on top).
const reportStations = 600

// BuildReport lays out the calculation report: the job summary, the beam and its loads, the
// envelopes, the limits, the ranking of positions, the layouts, the full calculation sheet of
// every splice of the recommended layout with its drawing, and the caution. When no layout
// fits (the outcome is Infeasible) the layouts and sheets give way to the section that says
// why, from the outcome's Diagnosis. The PDF is built
// twice, the second time with the page count known for "page n of N"; it carries fixed
// creation dates, so equal inputs give equal bytes.
func BuildReport(in ReportInput) (*Report, error) {
	if in.Outcome == nil {
		return nil, errors.New("report: needs the optimisation outcome")
	}
	if in.Outcome.Infeasible == nil && len(in.Outcome.Layouts.ByCount) == 0 {
		return nil, errors.New("report: the optimisation found no layout and says no reason")
	}
	if in.Date == "" && !in.Time.IsZero() {
		in.Date = in.Time.Format("2006-01-02")
	}
	r := &Report{Charts: map[string]*Chart{}, Warnings: fontWarnings(in.Outcome.Setup)}
	if err := r.build(in); err != nil {
		return nil, err
	}
	// The contents list and "page n of N" need the page numbers: lay the report out until
	// they no longer change (the contents has a fixed number of lines, so the second layout
	// normally confirms the first).
	final, err := r.document(in, 0, nil)
	if err != nil {
		return nil, err
	}
	for pass := 0; pass < 3; pass++ {
		next, err := r.document(in, final.f.PageNo(), final.headings)
		if err != nil {
			return nil, err
		}
		same := next.f.PageNo() == final.f.PageNo() && slices.Equal(next.headings, final.headings)
		final = next
		if same {
			break
		}
	}
	pdf, err := final.bytes() // closes the document: the last footer is drawn here
	if err != nil {
		return nil, fmt.Errorf("report: writing the PDF: %w", err)
	}
	r.PDF = pdf
	r.Pages = final.f.PageNo()
	r.Text = final.text.String()
	for _, h := range final.headings {
		r.Headings = append(r.Headings, Heading{Number: h.Number, Title: h.Title, Page: h.Page})
	}
	return r, nil
}

// build prepares the charts, the drawing and the full splice sheets.
func (r *Report) build(in ReportInput) error {
	res := in.Outcome
	s := res.Setup
	env := res.Envelopes
	rec := res.Recommended()
	r.Sheets = res.Chosen
	r.Bill = res.Bill()
	sheets := r.Sheets
	envChart, err := EnvelopeChart(EnvelopeInput{
		Title: "Envelopes along the beam, " + s.Section.Name + " " + s.Grade.Name, Envelopes: &env,
		Model: s.Model, KeepOut: KeepOutRanges(res), Splices: rec.Splices, Deflection: s.Table == nil || s.Table.Deflection(),
	})
	if err != nil {
		return err
	}
	r.Scan = ScanPoints(res)
	scan := ScanInput{Title: "Cheapest splice at each candidate position", Model: s.Model, Points: r.Scan,
		Chosen: rec.Splices, Currency: in.Currency}
	cost, err := CostChart(scan)
	if err != nil {
		return err
	}
	scan.Title = "Utilisation of the cheapest splice at each candidate position"
	if res.Fixed != nil {
		scan.Title, scan.ShowFailing = "Utilisation of the fixed splice along the beam", true
	}
	util, err := UtilisationChart(scan)
	if err != nil {
		return err
	}
	r.Charts["envelopes"], r.Charts["cost"], r.Charts["utilisation"] = envChart, cost, util
	r.Figures = []*Figure{&envChart.Figure, &cost.Figure, &util.Figure}
	if res.Infeasible != nil {
		return nil // no layouts to chart, no splices to draw
	}
	title := "Best layout for each number of splices"
	if res.Placed {
		title = "The layout placed by hand"
	}
	r.Layouts = LayoutsOf(res, title, in.Currency)
	lay, err := LayoutChart(r.Layouts)
	if err != nil {
		return err
	}
	r.Charts["layouts"] = lay
	r.Figures = append(r.Figures, &lay.Figure)
	for i, sh := range sheets {
		f, err := SpliceDrawing(DrawingInput{
			Title:   fmt.Sprintf("Splice %s at x = %s, %s", sh.Name, fmtM(sh.Position), s.Section.Name),
			Section: s.Section, Geometry: sh.Result.Geometry, Position: sh.Position, Materials: &r.Bill.Splices[i].Materials,
		})
		if err != nil {
			return err
		}
		f.Name = "splice-" + strings.ToLower(sh.Name)
		f.Caption = fmt.Sprintf("Splice %s at x = %s: elevation and plan of the top flange with its parts list, dimensions in mm", sh.Name, fmtM(sh.Position))
		r.Figures = append(r.Figures, f)
	}
	return nil
}

// document writes the whole report once; pages is the total page count and toc the headings
// of an earlier pass, when known.
func (r *Report) document(in ReportInput, pages int, toc []heading) (*pdfDoc, error) {
	s := in.Outcome.Setup
	title := s.Title
	if title == "" {
		title = s.File
	}
	version := in.Version
	if version == "" {
		version = "dev"
	}
	d := newPDFDoc("spanbreak splice report: "+title, "spanbreak splice report — "+title,
		fmt.Sprintf("spanbreak %s · %s · %s · design aid: check by a competent engineer", version, s.File, in.Date), pages, in.Time)
	w := reportWriter{d: d, in: in, r: r, cur: in.Currency, toc: toc}
	if w.cur == "" {
		w.cur = "cost units"
	}
	d.newPage()
	w.summary(title, version)
	w.beamAndLoads()
	w.envelopes()
	w.limits()
	w.ranking()
	if in.Outcome.Infeasible != nil {
		w.whyNoLayout()
	} else {
		w.layouts()
	}
	if w.hasBill() {
		w.bill()
	}
	for i := range r.Sheets {
		w.sheet(&r.Sheets[i])
	}
	w.closing()
	if err := d.f.Error(); err != nil {
		return nil, fmt.Errorf("report: %w", err)
	}
	return d, nil
}

// reportWriter writes the sections of the report.
type reportWriter struct {
	d       *pdfDoc
	in      ReportInput
	r       *Report
	cur     string
	figures int
	toc     []heading // headings of the previous layout pass, for the contents
}

func (w *reportWriter) figure(f *Figure) {
	w.figures++
	w.d.figure(f, w.figures)
}

// keepFigure is the height a heading must keep with it so that its figure follows on the
// same page [pt].
func (w *reportWriter) keepFigure(name string) float64 {
	if f := w.findFigure(name); f != nil {
		return f.Height.Points() + smallLead + 8
	}
	return 0
}

func (w *reportWriter) findFigure(name string) *Figure {
	for _, f := range w.r.Figures {
		if f.Name == name {
			return f
		}
	}
	return nil
}

func (w *reportWriter) summary(title, version string) {
	d, s, res := w.d, w.in.Outcome.Setup, w.in.Outcome
	d.paraStyled("Splice report", true, false, 18, 22)
	d.paraStyled(title, true, false, 12, 15)
	d.heading(0, "Job summary", 80)
	d.keyValues([][2]string{
		{"Input file", s.File},
		{"Program", "spanbreak " + version},
		{"Date", w.in.Date},
		{"Beam", fmt.Sprintf("%s, %s, length %s, %d supports", s.Section.Name, s.Grade.Name, fmtM(s.Model.Length), len(s.Model.Supports))},
		{"Units", "positions m; forces kN; moments kNm; plate and bolt dimensions mm; masses kg; costs in " + w.cur},
		{"Signs", "bending moment sagging +; V = dM/dx; axial force tension +; deflection downward +"},
	})
	d.heading(1, "Result", 60)
	rows := w.resultRows()
	for _, sh := range w.r.Sheets {
		g := sh.Result.Governing
		rows = append(rows, [2]string{fmt.Sprintf("Splice %s at %s", sh.Name, fmtM(sh.Position)),
			fmt.Sprintf("%s; governing check %s (%s), utilisation %s", encode.SpliceWords(sh.Result.Geometry), g.ID, g.Clause,
				fixed(sh.Result.Utilisation, 3))})
	}
	d.keyValues(rows)
	for _, n := range res.Notes {
		d.small("Note: " + n)
	}
	d.boxed("Caution", w.in.Caution)
	w.contents()
}

// sectionTitles are the report's top-level headings in order.
func (w *reportWriter) sectionTitles() []string {
	t := []string{"Job summary", "Beam and loads", "Envelopes", "The beam itself", "Limits", "Candidate positions", "Layouts"}
	if w.in.Outcome.Infeasible != nil {
		t[len(t)-1] = whyTitle
	}
	if w.hasBill() {
		t = append(t, billTitle)
	}
	for _, sh := range w.r.Sheets {
		t = append(t, sheetTitle(&sh))
	}
	return append(t, "Caution and references")
}

func sheetTitle(sh *optimise.SpliceSheet) string {
	return fmt.Sprintf("Calculation sheet: splice %s at x = %s", sh.Name, fmtM(sh.Position))
}

// contents lists the top-level headings with their pages from the previous layout pass
// (blank in the first); it always has one line per heading, so the layout does not move.
func (w *reportWriter) contents() {
	page := map[string]int{}
	for _, h := range w.toc {
		if h.Level == 0 {
			page[h.Title] = h.Page
		}
	}
	var rows [][]string
	for i, t := range w.sectionTitles() {
		p := ""
		if n, ok := page[t]; ok {
			p = fmt.Sprint(n)
		}
		rows = append(rows, []string{fmt.Sprint(i + 1), t, p})
	}
	w.d.paraStyled("Contents", true, false, bodySize, bodyLead)
	w.d.plainTable([]float64{0.06, 0.8, 0.14}, rows)
}

// layoutWords describes a layout in one line.
func layoutWords(l optimise.Layout) string {
	if len(l.Splices) == 0 {
		if len(l.Pieces) == 0 {
			return "no splice"
		}
		return fmt.Sprintf("no splice: the beam goes in one piece of %s", fmtM(l.Pieces[0].Length))
	}
	xs := make([]string, len(l.Splices))
	for i, x := range l.Splices {
		xs[i] = fmt.Sprintf("S%d at %s", i+1, fmtM(x))
	}
	s := fmt.Sprintf("%s: %s; %d pieces", spliceCount(len(l.Splices)), strings.Join(xs, ", "), len(l.Pieces))
	if l.Vehicle != "" {
		s += fmt.Sprintf("; %s × %d", l.Vehicle, l.Trips)
	}
	return s
}

// money prints a cost in whole currency units (the rates are indicative to that precision).
func money(v float64) string { return fixed(v, 0) }

func (w *reportWriter) beamAndLoads() {
	d, s := w.d, w.in.Outcome.Setup
	d.heading(0, "Beam and loads", 120)
	sec := s.Section
	fyf, fuf, _ := s.Grade.Strength(sec.Tf, s.GradeTable)
	fyw, fuw, _ := s.Grade.Strength(sec.Tw, s.GradeTable)
	d.heading(1, "Section and steel", 60)
	d.keyValues([][2]string{
		{"Section", fmt.Sprintf("%s (%s)", sec.Name, sec.Source)},
		{"Dimensions", fmt.Sprintf("h %s, b %s, tw %s, tf %s, r %s mm", mm(sec.H), mm(sec.B), mm(sec.Tw), mm(sec.Tf), mm(sec.R))},
		{"Properties", fmt.Sprintf("A %s cm², Iy %s cm⁴, Wel,y %s cm³, Wpl,y %s cm³, Avz %s cm², mass %s kg/m",
			fourSig(sec.A/1e2), fourSig(sec.Iy/1e4), fourSig(sec.WelY/1e3), fourSig(sec.WplY/1e3), fourSig(sec.Avz/1e2), fourSig(sec.Mass))},
		{"Steel", fmt.Sprintf("%s (%s): flange fy %s, fu %s N/mm²; web fy %s, fu %s N/mm²", s.Grade.Name, s.Grade.Standard,
			fixed(fyf, 0), fixed(fuf, 0), fixed(fyw, 0), fixed(fuw, 0))},
		{"Stiffness", fmt.Sprintf("E = %s N/mm², EI = %s kNm²", fixed(beam.YoungModulus, 0), fourSig(s.Model.EI/1e9))},
	})
	d.heading(1, "Spans and supports", 60)
	var rows [][]string
	for i, sp := range s.Model.Supports {
		k := ""
		if sp.Kind == beam.Spring {
			k = fmt.Sprintf("k = %s kN/m", fourSig(sp.K))
		}
		rows = append(rows, []string{fmt.Sprint(i + 1), formatClean(sp.X/1e3, 3), sp.Kind.String(), k})
	}
	d.table(table{Columns: []column{{"support", 1, false}, {"x [m]", 1.2, true}, {"type", 1.5, false}, {"stiffness", 2.5, false}}, Rows: rows})
	if len(s.Model.Hinges) > 0 {
		var hs []string
		for _, h := range s.Model.Hinges {
			hs = append(hs, fmtM(h))
		}
		d.para("Internal hinges at " + strings.Join(hs, ", ") + ".")
	}
	if t := s.Table; t != nil {
		d.heading(1, "Forces from another analysis", 60)
		defl := "the table gives no deflection, so the deflection of the member is not checked"
		if t.Deflection() && len(s.Model.Supports) > 0 {
			defl = "the deflection is checked from the table's w"
		}
		d.keyValues([][2]string{
			{"File", t.File},
			{"SHA-256", t.SHA256},
			{"Table", fmt.Sprintf("%s shape, %d rows, %d stations over %s", t.Shape, t.Rows, len(t.Envelopes.Stations), fmtM(t.Length))},
			{"Method", "The beam analysis was not run: the design forces are those of the table, linear between its stations " +
				"(exact only at the stations), the worse side taken at a jump. The cross-section of the beam is checked on them; " + defl + "."},
		})
		return
	}
	d.heading(1, "Load cases (characteristic)", 60)
	rows = nil
	for _, c := range s.Cases {
		kind := c.Kind.String()
		if c.Category != "" {
			kind += ", category " + c.Category
		}
		if c.Pattern {
			kind += ", patterned span by span"
		}
		var loads []string
		for _, l := range c.Loads {
			loads = append(loads, loadWords(l))
		}
		rows = append(rows, []string{c.Name, kind, strings.Join(loads, "; ")})
	}
	d.table(table{Columns: []column{{"case", 0.7, false}, {"kind", 2, false}, {"loads (downward +; x from the left end)", 5, false}}, Rows: rows})
	d.heading(1, "Combinations", 40)
	nU, nS := 0, 0
	for _, c := range s.Combinations {
		if c.State == beam.ULS {
			nU++
		} else {
			nS++
		}
	}
	ru := s.Rules
	d.para(fmt.Sprintf("EN 1990 (%s): %d ULS combinations by expression %s and %d SLS combinations (%s), with γG,sup = %s, "+
		"γG,inf = %s, γQ = %s, ξ = %s and ψ from EN 1990 Table A1.1 unless the job sets them. Patterned cases are applied span by "+
		"span wherever adverse, so the envelopes are exact over every pattern.", ru.Set, nU, ru.ULS, nS, ru.SLS,
		fixed(ru.GammaGSup, 2), fixed(ru.GammaGInf, 2), fixed(ru.GammaQ, 2), fixed(ru.Xi, 2)))
	if ru.SeparatesRoofImposed(s.Cases) {
		d.para("The imposed load on the roof (category H) is not combined with snow or wind (" + beam.RoofImposedClause + ").")
	}
}

// loadWords describes one load in job-file units.
func loadWords(l beam.Load) string {
	switch l.Kind {
	case beam.PointForce:
		return fmt.Sprintf("%s kN at %s", fixed(l.P/1e3, 2), fmtM(l.X1))
	case beam.PointMoment:
		return fmt.Sprintf("couple %s kNm (clockwise +) at %s", fixed(l.P/1e6, 2), fmtM(l.X1))
	case beam.AxialForce:
		return fmt.Sprintf("axial %s kN (along +x) at %s", fixed(l.P/1e3, 2), fmtM(l.X1))
	}
	if l.W1 == l.W2 {
		return fmt.Sprintf("%s kN/m from %s to %s", fixed(l.W1, 2), formatClean(l.X1/1e3, 3), fmtM(l.X2))
	}
	return fmt.Sprintf("%s to %s kN/m from %s to %s", fixed(l.W1, 2), fixed(l.W2, 2), formatClean(l.X1/1e3, 3), fmtM(l.X2))
}

// fourSig prints four significant figures without an exponent.
func fourSig(v float64) string {
	if v == 0 || math.IsNaN(v) || math.IsInf(v, 0) {
		return fixed(v, 0)
	}
	return fixed(v, max(0, 3-int(math.Floor(math.Log10(math.Abs(v))))))
}

func (w *reportWriter) envelopes() {
	d := w.d
	d.heading(0, "Envelopes", w.keepFigure("envelopes")+3*bodyLead)
	d.para("The bands are the exact envelopes over every combination and every pattern: ULS bending moment and shear, " +
		"SLS deflection. Keep-out zones are shaded; the splices of the recommended layout are the vertical lines S1, S2, ….")
	w.figure(w.findFigure("envelopes"))
	env := &w.in.Outcome.Envelopes
	st := env.Stations
	var rows [][]string
	extreme := func(label string, ex []beam.Extreme, unit string, f float64, seekMax bool) {
		if len(ex) == 0 {
			return
		}
		best := 0
		for i := range ex {
			if (seekMax && ex[i].Value > ex[best].Value) || (!seekMax && ex[i].Value < ex[best].Value) {
				best = i
			}
		}
		rows = append(rows, []string{label, formatClean(ex[best].Value*f, 1) + " " + unit, fmtM(st[best].X), env.Governing(ex[best])})
	}
	u, sl := &env.ULS, &env.SLS
	extreme("ULS M max (sagging)", u.MMax, "kNm", 1e-6, true)
	extreme("ULS M min (hogging)", u.MMin, "kNm", 1e-6, false)
	extreme("ULS V max", u.VMax, "kN", 1e-3, true)
	extreme("ULS V min", u.VMin, "kN", 1e-3, false)
	extreme("SLS w max (down)", sl.WMax, "mm", 1, true)
	extreme("SLS w min (up)", sl.WMin, "mm", 1, false)
	d.heading(1, "Extreme values", 40)
	d.table(table{Columns: []column{{"extreme", 1.6, false}, {"value", 1, true}, {"at", 0.9, true},
		{"combination and pattern", 5, false}}, Rows: rows})
	d.heading(1, "Support reactions", 40)
	if len(env.ULSReactions) == 0 {
		d.para("None: the forces are imported from another analysis, which gives the reactions itself.")
		w.member()
		return
	}
	rows = nil
	for i, r := range env.ULSReactions {
		sr := env.SLSReactions[i]
		rows = append(rows,
			[]string{fmt.Sprint(i + 1), fmtM(r.X), "ULS max", kN(r.FzMax.Value), env.Governing(r.FzMax)},
			[]string{"", "", "ULS min", kN(r.FzMin.Value), env.Governing(r.FzMin)},
			[]string{"", "", "SLS max", kN(sr.FzMax.Value), env.Governing(sr.FzMax)},
			[]string{"", "", "SLS min", kN(sr.FzMin.Value), env.Governing(sr.FzMin)})
	}
	d.table(table{Columns: []column{{"support", 0.7, true}, {"x", 0.9, true}, {"state", 0.8, false}, {"Fz [kN]", 0.9, true},
		{"combination and pattern", 5, false}}, Rows: rows})
	d.small("Fz is the vertical reaction, upward positive; a negative minimum is uplift, to be held down. " + encode.ReactionsNote)
	w.member()
}

// member writes the beam's own checks: the cross-section along the beam, the deflection of
// every span and overhang, what fails and what is outside scope.
func (w *reportWriter) member() {
	d, m := w.d, &w.in.Outcome.Member
	d.heading(0, "The beam itself", 120)
	d.para("EN 1993-1-1: the cross-section class by Table 5.2 under the actual bending moment and axial force, Mc,Rd " +
		"(6.2.5: Wpl for class 1 and 2, Wel for class 3), Vc,Rd (6.2.6), bending with shear (6.2.8) and with axial force " +
		"(6.2.9) at every station of the envelopes, each moment extreme paired with the largest |V| and both axial extremes; " +
		"SLS deflection of every span (from the chord between its supports) and overhang (from its support) against the " +
		"job's limits.")
	for _, s := range m.Warnings() {
		d.boxed("Warning", s)
	}
	r := m.Member
	if m.Scope == nil {
		c := r.Section.Class
		gov := r.Section.Checks[r.Section.Governing]
		d.keyValues([][2]string{
			{"Class", fmt.Sprintf("%s at the governing station (flange outstand c/t = %s, %s; web c/t = %s, %s; ε = %s); worst anywhere %s",
				c.Class, fixed(c.Flange.Ratio, 2), c.Flange.Class, fixed(c.Web.Ratio, 2), c.Web.Class, fixed(c.Epsilon, 3), r.Class)},
			{"Resistances", fmt.Sprintf("Mc,Rd = %s kNm, Vc,Rd = %s kN, Npl,Rd = %s kN, fy = %s N/mm²", kNm(r.McRd), kN(r.VcRd),
				kN(r.Section.NplRd), fixed(c.Fy, 0))},
			{"Governing", fmt.Sprintf("%s (%s) at x = %s: utilisation %s, %s", gov.ID, gov.Clause, fmtM(r.X), fixed(r.Utilisation, 3),
				passWord(r.Utilisation <= 1))},
			{"Forces there", fmt.Sprintf("%s: %s", r.Pairing, r.Combination)},
		})
	} else {
		d.para("Outside scope: " + m.Scope.Error() + ".")
	}
	if m.NoDeflection != "" {
		d.para("The deflection is not checked: " + m.NoDeflection + ".")
		d.small("Not checked: " + optimise.LTBCaution + ".")
		return
	}
	var rows [][]string
	for _, x := range m.Deflection.Regions {
		rows = append(rows, []string{x.Region.Name, formatClean(x.Region.From/1e3, 3), formatClean(x.Region.To/1e3, 3), fixed(x.W, 1),
			fmt.Sprintf("L/%s = %s", formatClean(x.Ratio, 0), fixed(x.Limit, 1)), fixed(x.Utilisation, 3), passWord(x.Pass), x.Combination})
	}
	d.heading(1, "Deflection", 40)
	d.table(table{Columns: []column{{"region", 1.3, false}, {"from [m]", 0.8, true}, {"to [m]", 0.8, true}, {"w [mm]", 0.7, true},
		{"limit [mm]", 1.2, true}, {"util.", 0.6, true}, {"", 0.5, false}, {"combination and pattern", 4, false}}, Rows: rows})
	d.small("Limits span/" + formatClean(m.Deflection.Limits.Span, 0) + " and overhang/" + formatClean(m.Deflection.Limits.Overhang, 0) +
		" (common practice unless the job sets them; the national annex and the client's specification govern).")
	d.small("Not checked: " + optimise.LTBCaution + ".")
}

func (w *reportWriter) limits() {
	d, res := w.d, w.in.Outcome
	d.heading(0, "Limits", 100)
	lim := res.Limits
	count := fmt.Sprintf("at least %d", res.Setup.MinSplices)
	if res.Setup.MaxSplices >= 0 {
		count += fmt.Sprintf(", at most %d", res.Setup.MaxSplices)
	}
	d.keyValues([][2]string{
		{"Piece length", fmt.Sprintf("at most %s, at least %s (pieces of a spliced beam)", limitM(lim.MaxLength), limitM(lim.MinLength))},
		{"Piece mass", fmt.Sprintf("at most %s (crane), with %s kg rigging allowance per piece", limitKG(lim.MaxMass), fixed(lim.Rigging, 0))},
		{"Splices", count},
		{"Gap at a splice", mm(res.Gap()) + " mm between the beam ends"},
		{"Candidate step", formatClean(res.Step/1e3, 3) + " m"},
		{"Erection", fmt.Sprintf("%s %s per piece lifted", money(res.Setup.Lift), w.cur)},
	})
	d.heading(1, "Keep-out zones", 40)
	var rows [][]string
	zones := slices.Clone(res.Setup.Zones)
	slices.SortStableFunc(zones, func(a, b optimise.Zone) int { return cmpFloat(a.From, b.From) })
	for _, z := range zones {
		rows = append(rows, []string{formatClean(math.Max(0, z.From)/1e3, 3), formatClean(math.Min(res.Setup.Model.Length, z.To)/1e3, 3), z.Reason, z.Key})
	}
	if len(rows) == 0 {
		d.para("None.")
	} else {
		d.table(table{Columns: []column{{"from [m]", 1, true}, {"to [m]", 1, true}, {"reason", 4.5, false}, {"job-file key", 2.2, false}}, Rows: rows})
	}
	d.heading(1, "Vehicles", 40)
	rows = nil
	for _, v := range res.Setup.Vehicles {
		rows = append(rows, []string{v.Name, formatClean(v.MaxLength/1e3, 2), fixed(v.Payload, 0), money(v.Cost)})
	}
	if len(rows) == 0 {
		d.para("None: transport is not costed.")
	} else {
		d.table(table{Columns: []column{{"vehicle", 3, false}, {"longest piece [m]", 1.5, true}, {"payload [kg]", 1.5, true},
			{"per trip [" + w.cur + "]", 1.5, true}}, Rows: rows})
	}
	{
		sp := w.in.Outcome.Setup.Splice
		d.heading(1, "Splice options and rates", 40)
		z := sp.Sizing
		opts := [][2]string{
			{"Category", string(z.Category) + categoryWords(z.Category)},
			{"Force distribution", string(sp.Distribution)},
			{"Plate steel", sp.PlateSteel.Name},
		}
		if z.Category.Preloaded() {
			opts = append(opts, [2]string{"Friction class", fmt.Sprintf("%s (μ = %s, EN 1090-2 Table 18)", z.FrictionClass, fixed(z.FrictionClass.SlipFactor(), 1))})
		}
		opts = append(opts, [2]string{"Rates", ratesWords(sp.Rates, w.cur)})
		d.keyValues(opts)
	}
}

func cmpFloat(a, b float64) int {
	switch {
	case a < b:
		return -1
	case a > b:
		return 1
	}
	return 0
}

func categoryWords(c splice.Category) string {
	switch c {
	case splice.CategoryA:
		return ", bearing type (EN 1993-1-8 Table 3.2)"
	case splice.CategoryB:
		return ", slip-resistant at SLS (EN 1993-1-8 Table 3.2)"
	case splice.CategoryC:
		return ", slip-resistant at ULS (EN 1993-1-8 Table 3.2)"
	}
	return ""
}

func ratesWords(r splice.Rates, cur string) string {
	if r.Bolt == nil {
		r = splice.DefaultRates()
	}
	sizes := make([]string, 0, len(r.Bolt))
	for k := range r.Bolt {
		sizes = append(sizes, k)
	}
	slices.Sort(sizes)
	var bolts []string
	for _, k := range sizes {
		bolts = append(bolts, fmt.Sprintf("%s %s", k, fixed(r.Bolt[k], 2)))
	}
	classes := make([]string, 0, len(r.BoltClassFactor))
	for k := range r.BoltClassFactor {
		classes = append(classes, k)
	}
	slices.Sort(classes)
	var cf []string
	for _, k := range classes {
		cf = append(cf, fmt.Sprintf("%s × %s", k, fixed(r.BoltClassFactor[k], 2)))
	}
	s := fmt.Sprintf("bolt assembly %s; class factor %s; plate %s per kg; hole %s; faying surface %s per m²; per splice %s (%s)",
		strings.Join(bolts, ", "), strings.Join(cf, ", "), fixed(r.PlatePerKg, 2), fixed(r.Hole, 2), fixed(r.FayingPerM2, 2),
		fixed(r.Splice, 2), cur)
	return s
}

func limitM(mmv float64) string {
	if math.IsInf(mmv, 1) {
		return "no limit"
	}
	return fmtM(mmv)
}

func limitKG(kg float64) string {
	if math.IsInf(kg, 1) {
		return "no limit"
	}
	return fixed(kg, 0) + " kg"
}

func (w *reportWriter) ranking() {
	d, res := w.d, w.in.Outcome
	d.heading(0, "Candidate positions", w.keepFigure("cost")+3*bodyLead)
	st := res.Stats
	d.para(fmt.Sprintf("%d positions every %s m: %d inside keep-out zones, the cheapest splice sized at the others "+
		"(%d sizings, %d positions sharing the forces of another). Ranked by %s.", st.Candidates, formatClean(res.Step/1e3, 3),
		st.KeptOut, st.Sized, st.Shared, res.Rank))
	w.figure(w.findFigure("cost"))
	w.figure(w.findFigure("utilisation"))
	n := w.in.Ranking
	if n <= 0 {
		n = 10
	}
	best := res.DistinctBest(n)
	chosen := w.in.Outcome.Recommended().Splices
	var rows [][]string
	for _, c := range best {
		rows = append(rows, []string{fmt.Sprint(c.Rank), formatClean(c.X/1e3, 3), money(c.Design.Cost), fmt.Sprint(c.Design.Bolts),
			fixed(c.Design.PlateMass, 1), fixed(c.Design.Utilisation, 3), c.Design.Governing, c.Design.Summary})
	}
	if len(rows) == 0 {
		d.heading(1, "Best positions", 60)
		d.para("None: no position admits a splice (see the reasons in scan.csv).")
		return
	}
	d.heading(1, fmt.Sprintf("The %d best distinct positions (the best of each splice design over each stretch)", len(rows)), 60)
	d.table(table{Columns: []column{{"rank", 0.6, true}, {"x [m]", 0.9, true}, {"cost", 0.8, true}, {"bolts", 0.7, true},
		{"plates [kg]", 0.9, true}, {"util.", 0.7, true}, {"governing check", 2, false}, {"splice", 4.2, false}}, Rows: rows,
		Highlight: func(i int) bool {
			return slices.ContainsFunc(chosen, func(x float64) bool { return math.Abs(x-best[i].X) < 1e-3 })
		}})
	note := "The full list is in scan.csv."
	for i := range best {
		if slices.ContainsFunc(chosen, func(x float64) bool { return math.Abs(x-best[i].X) < 1e-3 }) {
			note = "Shaded rows are positions of the recommended layout. " + note
			break
		}
	}
	d.small(note)
}

func (w *reportWriter) layouts() {
	d, res := w.d, w.in.Outcome
	d.heading(0, "Layouts", w.keepFigure("layouts")+3*bodyLead)
	heading := "Best layout for each number of splices"
	if res.Placed {
		heading = "The layout placed by hand"
		d.para("The splice positions of this report were placed by hand (spanbreak view), each at a candidate position " +
			"of the scan with the splice sized there, and priced by the rules of the layout search: every piece within " +
			"the length and mass limits, the cheapest vehicle that carries every piece, with the fewest trips by mass. " +
			"The note in the job summary compares it with the optimiser's recommendation.")
	} else {
		d.para("For each number of splices, the cheapest set of positions that keeps every piece within the length and " +
			"mass limits, found by an exact search over the feasible candidates; transport takes the cheapest vehicle that " +
			"carries the longest piece, with the fewest trips by mass.")
	}
	w.figure(w.findFigure("layouts"))
	is := func(kind optimise.LayoutKind, i int) bool {
		return res.IsRecommended(optimise.LayoutRef{Kind: kind, Index: i})
	}
	var rows [][]string
	for i, l := range res.Layouts.ByCount {
		rows = append(rows, layoutRow(l, is(optimise.KindBest, i) && !res.Placed))
	}
	cols := []column{{"splices", 0.8, true}, {"positions [m]", 2.6, false}, {"longest piece [m]", 1.1, true},
		{"heaviest [kg]", 1, true}, {"vehicle × trips", 1.7, false}, {"splices", 0.9, true}, {"transport", 1.05, true},
		{"erection", 0.95, true}, {"total [" + w.cur + "]", 1.1, true}}
	d.heading(1, heading, 60)
	d.table(table{Columns: cols, Rows: rows, Highlight: func(i int) bool { return is(optimise.KindBest, i) }})
	if len(res.Layouts.Alternatives) > 0 {
		rows = nil
		for i, l := range res.Layouts.Alternatives {
			rows = append(rows, layoutRow(l, is(optimise.KindAlternative, i)))
		}
		d.heading(1, "Near-best alternatives", 60)
		d.table(table{Columns: cols, Rows: rows, Highlight: func(i int) bool { return is(optimise.KindAlternative, i) }})
	}
	if len(res.Identical.ByCount) > 0 {
		rows = nil
		for i, u := range res.Identical.ByCount {
			full := layoutRow(u.Layout, is(optimise.KindUniform, i))
			extra, design := "–", "–"
			for _, m := range res.Layouts.ByCount {
				if len(m.Splices) == len(u.Splices) {
					extra = fmt.Sprintf("%+.0f", u.Cost.Total-m.Cost.Total)
				}
			}
			if len(u.Splices) > 0 {
				design = u.Design.Summary
			}
			// splices, positions, vehicle × trips, total, against mixed, design
			rows = append(rows, []string{full[0], full[1], full[4], full[8], extra, design})
		}
		d.heading(1, "Identical splices: the best layout with one splice type", 60)
		d.para("For each number of splices, the cheapest layout in which every splice is the same design: one drawing, one " +
			"bolt list, no mix-ups on site. Found exactly over every design of the design space and every position where its " +
			"checks pass; the extra cost is against the best mixed layout of the same count.")
		ucols := []column{{"splices", 0.8, true}, {"positions [m]", 2.4, false}, {"vehicle × trips", 1.7, false},
			{"total [" + w.cur + "]", 1.1, true}, {"against mixed", 1.1, true}, {"the one splice design", 4.5, false}}
		d.table(table{Columns: ucols, Rows: rows, Highlight: func(i int) bool { return is(optimise.KindUniform, i) }})
	}
	rec := res.Recommended()
	if res.Placed {
		d.heading(1, "Pieces of the layout placed by hand", 60)
	} else {
		d.heading(1, "Pieces of the recommended layout", 60)
	}
	rows = nil
	for i, p := range rec.Pieces {
		rows = append(rows, []string{fmt.Sprint(i + 1), formatClean(p.From/1e3, 3), formatClean(p.To/1e3, 3), formatClean(p.Length/1e3, 3),
			fixed(p.SteelMass, 0), fixed(p.SpliceMass, 1), fixed(p.Mass, 0)})
	}
	d.table(table{Columns: []column{{"piece", 0.7, true}, {"from [m]", 1, true}, {"to [m]", 1, true}, {"length [m]", 1, true},
		{"steel [kg]", 1, true}, {"splice parts [kg]", 1.2, true}, {"total [kg]", 1, true}}, Rows: rows})
}

func layoutRow(l optimise.Layout, chosen bool) []string {
	xs := make([]string, len(l.Splices))
	for i, x := range l.Splices {
		xs[i] = formatClean(x/1e3, 3)
	}
	longest, heaviest := 0.0, 0.0
	for _, p := range l.Pieces {
		longest, heaviest = math.Max(longest, p.Length), math.Max(heaviest, p.Mass)
	}
	veh := "–"
	if l.Vehicle != "" {
		veh = fmt.Sprintf("%s × %d", l.Vehicle, l.Trips)
	}
	pos := strings.Join(xs, ", ")
	if pos == "" {
		pos = "none"
	}
	if chosen {
		pos += " (recommended)"
	}
	return []string{fmt.Sprint(len(l.Splices)), pos, formatClean(longest/1e3, 3), fixed(heaviest, 0), veh,
		money(l.Cost.Splices), money(l.Cost.Transport), money(l.Cost.Erection), money(l.Cost.Total)}
}

func (w *reportWriter) sheet(sh *optimise.SpliceSheet) {
	d, r := w.d, sh.Result
	d.newPage()
	d.heading(0, sheetTitle(sh), 100)
	d.para(fmt.Sprintf("%s. Checks to EN 1993-1-8 and EN 1993-1-1 with the recommended partial factors; every check "+
		"below gives its clause, formula, numbers and utilisation.", encode.SpliceWords(r.Geometry)))
	d.heading(1, "Design forces", 60)
	u, sl := r.Actions.ULS, r.Actions.SLS
	d.table(table{Columns: []column{{"state", 1, false}, {"M max [kNm]", 1, true}, {"M min [kNm]", 1, true},
		{"|V| max [kN]", 1, true}, {"N max [kN]", 1, true}, {"N min [kN]", 1, true}}, Rows: [][]string{
		{"ULS", kNm(u.MMax), kNm(u.MMin), kN(u.V), kN(u.NMax), kN(u.NMin)},
		{"SLS", kNm(sl.MMax), kNm(sl.MMin), kN(sl.V), kN(sl.NMax), kN(sl.NMin)},
	}})
	d.small("From the envelopes at the position, the worse side taken at a jump; each moment extreme is paired with the " +
		"largest |V| and with both axial extremes (conservative), and both signs are checked.")
	o := sh.Origins
	d.table(table{Columns: []column{{"force", 1, false}, {"ULS combination and pattern", 4, false}, {"SLS combination and pattern", 4, false}},
		Rows: [][]string{{"M max", o.ULS.MMax, o.SLS.MMax}, {"M min", o.ULS.MMin, o.SLS.MMin}, {"|V| max", o.ULS.V, o.SLS.V},
			{"N max", o.ULS.NMax, o.SLS.NMax}, {"N min", o.ULS.NMin, o.SLS.NMin}}})
	if c := sh.Section; c.Scope != nil {
		d.small("The beam here: outside scope, " + c.Scope.Error() + ".")
	} else {
		b := c.Result
		g := b.Checks[b.Governing]
		d.small(fmt.Sprintf("The beam here (EN 1993-1-1 6.2): %s, Mc,Rd = %s kNm, Vc,Rd = %s kN; %s utilisation %s under %s — %s.",
			b.Class.Class, kNm(b.McRd), kN(b.VcRd), g.ID, fixed(b.Utilisation, 3), c.Pairing, passWord(b.Utilisation <= 1)))
	}
	if r.Actions.MinimumNote != "" {
		d.small("Minimum design action (user policy, no EN 1993 clause sets one): " + r.Actions.MinimumNote)
	}
	a := r.Actions
	d.heading(1, "Force distribution", 60)
	d.keyValues([][2]string{
		{"Rule", fmt.Sprintf("%s: web share of the moment Iw/Iy = %s, of the axial force Aw/A = %s, lever arm h − tf = %s mm",
			a.Distribution, fixed(a.IwOverIy, 3), fixed(a.AwOverA, 3), mm(a.LeverArm))},
		{"Flange", fmt.Sprintf("tension Ft,Ed = %s kN (%s), compression Fc,Ed = %s kN (%s), bolt group force %s kN, in the slip state %s kN",
			kN(a.Flange.Tension), a.Flange.TensionState, kN(a.Flange.Compression), a.Flange.CompressionState, kN(a.Flange.Bolt), kN(a.Flange.SlipBolt))},
		{"Web", fmt.Sprintf("|Mw| = %s kNm, |Nw| = %s kN, |V| = %s kN (%s); in the slip state %s kNm, %s kN, %s kN",
			kNm(a.Web.Moment), kN(a.Web.Axial), kN(a.Web.Shear), a.Web.State, kNm(a.Web.SlipMoment), kN(a.Web.SlipAxial), kN(a.Web.SlipShear))},
		{"Web bolt group", fmt.Sprintf("e = %s mm, group moment |Mw| + |V|·e = %s kNm, Σ(x² + z²) = %s mm²; most loaded bolt H %s, V %s, resultant %s kN",
			mm(r.WebGroup.Eccentricity), kNm(r.WebGroup.Moment), fixed(r.WebGroup.PolarMoment, 0),
			kN(r.WebGroup.Corner.H), kN(r.WebGroup.Corner.V), kN(r.WebGroup.Corner.R))},
	})
	w.assemblies(r)
	d.heading(1, "Summary of the checks", 80)
	var rows [][]string
	gov := -1
	for i, c := range r.Checks {
		if c.ID == r.Governing.ID && gov < 0 {
			gov = i
		}
		rows = append(rows, []string{fmt.Sprint(i + 1), c.ID, c.Clause, c.State, fixed(c.Demand, 2), fixed(c.Resistance, 2), c.Unit,
			fixed(c.Utilisation, 3), passWord(c.Pass)})
	}
	d.table(table{Columns: []column{{"no.", 0.45, true}, {"check", 2.2, false}, {"clause", 2.2, false}, {"state", 0.8, false},
		{"demand", 0.9, true}, {"resistance", 0.9, true}, {"unit", 0.7, false}, {"util.", 0.6, true}, {"", 0.5, false}},
		Rows: rows, Highlight: func(i int) bool { return i == gov }})
	d.para(fmt.Sprintf("Governing check: %s (%s), utilisation %s — %s.", r.Governing.ID, r.Governing.Clause,
		fixed(r.Utilisation, 3), passWord(r.Pass)))
	d.heading(1, "The checks in full", 60)
	for i, c := range r.Checks {
		w.check(i+1, c)
	}
	if len(r.Notes) > 0 {
		d.heading(1, "Notes", 30)
		for _, n := range r.Notes {
			d.small("• " + n)
		}
	}
	q, cost := r.Quantities, r.Cost
	d.heading(1, "Quantities and cost", 40)
	d.keyValues([][2]string{
		{"Bolts", fmt.Sprintf("%d assemblies (flanges %d, web %d), %s kg; %d holes", q.Bolts, q.FlangeBolts, q.WebBolts,
			fixed(q.BoltMass, 1), q.Holes)},
		{"Plates", fmt.Sprintf("%s kg (flanges %s, web %s); plate lengths: flange %s mm, web %s mm", fixed(q.PlateMass, 1),
			fixed(q.FlangePlateMass, 1), fixed(q.WebPlateMass, 1), mm(q.FlangePlateLength), mm(q.WebPlateLength))},
		{"Faying surfaces", fixed(q.FayingArea, 2) + " m²"},
		{"Cost", fmt.Sprintf("%s %s: bolts %s, holes %s, plates %s, faying surfaces %s, per splice %s", fixed(cost.Total, 2), w.cur,
			fixed(cost.Bolts, 2), fixed(cost.Holes, 2), fixed(cost.Plates, 2), fixed(cost.Faying, 2), fixed(cost.Splice, 2))},
	})
	for i := range w.r.Bill.Splices {
		if b := &w.r.Bill.Splices[i]; b.Name == sh.Name {
			d.heading(1, "Bill of materials", 80)
			w.materials(b.Materials)
		}
	}
	if f := w.findFigure("splice-" + strings.ToLower(sh.Name)); f != nil {
		w.figure(f) // no heading: the drawing takes up to a whole page, its caption names it
	}
}

// assemblies writes a sheet's bolt assemblies: for each bolt group its plies, the length
// chosen, the thread and shank, and each shear plane with the area and αv its check uses.
func (w *reportWriter) assemblies(r splice.Result) {
	d := w.d
	d.heading(1, "Bolt assemblies", 80)
	d.small("Each group's bolt is the shortest standard length that leaves at least one thread pitch beyond the nut " +
		"and brings the thread into the clamp (EN 1090-2 8.2.2), the head on the outer flange plate and on one web plate. " +
		"The shear planes lie at the faces of the beam's flange and web, z from the head's bearing face; one beyond the " +
		"guaranteed plain shank ls,min is in the thread (EN 1993-1-8 Table 3.4: A = As and the class's αv; on the shank " +
		"A = πd²/4 and αv = 0.6).")
	var rows, planes [][]string
	for _, a := range r.Assemblies {
		var plies []string
		grip := 0.0
		for _, p := range a.Plies {
			plies = append(plies, fmt.Sprintf("%s %s", p.Name, mm(p.Thickness)))
			grip += p.Thickness
		}
		as := a.Assembly
		row := []string{a.Group, fmt.Sprint(a.Count), as.Designation, strings.Join(plies, " + "), mm(grip)}
		if a.Err != nil {
			row[2] = "no standard length: " + a.Err.Error()
			row = append(row, "–", "–", "–", "–", "–")
		} else {
			row = append(row, fixed(as.ClampMax, 1)+" + "+mm(as.Data.NutM)+" + "+mm(as.Data.P)+" = "+fixed(as.RequiredLength, 1),
				mm(as.Length), mm(as.ThreadLength), mm(as.ShankMin), fixed(as.Protrusion, 1))
		}
		rows = append(rows, row)
		rule := map[splice.ShearPlaneRule]string{splice.PlanesFromLength: "from the length", splice.PlanesInThread: "thread assumed",
			splice.PlanesOnShank: "shank assumed"}[a.Rule]
		for _, p := range a.Planes {
			at, area := "shank", "πd²/4"
			if p.Threaded {
				at, area = "thread", "As"
			}
			planes = append(planes, []string{a.Group, p.Name, fixed(p.Position, 1), at + " (" + rule + ")",
				area + " = " + fixed(p.Area, 0), fixed(p.AlphaV, 2), fixed(p.FvRd*1e-3, 1)})
		}
	}
	d.table(table{Columns: []column{{"bolts", 0.8, false}, {"n", 0.4, true}, {"assembly", 2.6, false},
		{"plies, head side first [mm]", 2.2, false}, {"grip", 0.55, true}, {"Σt,max + m + P", 1.45, true}, {"l", 0.45, true},
		{"b", 0.45, true}, {"ls,min", 0.75, true}, {"past nut", 0.8, true}}, Rows: rows})
	d.small("n assemblies of the group in the splice; grip, lengths and the protrusion past the nut in mm: the length l " +
		"needs Σt,max + m + P within its tolerance (EN 1090-2 8.2.2); b is the thread length, ls,min the plain shank from the head.")
	d.table(table{Columns: []column{{"bolts", 0.8, false}, {"shear plane", 2, false}, {"z [mm]", 0.7, true}, {"on the", 1.7, false},
		{"A [mm²]", 1, true}, {"αv", 0.5, true}, {"Fv,Rd [kN]", 0.8, true}}, Rows: planes})
	for _, a := range r.Assemblies {
		if n := a.Assembly.Note; n != "" {
			d.small(fmt.Sprintf("Note (%s bolts): %s.", a.Group, n))
		}
	}
	for _, s := range encode.AssemblySources(r.Assemblies) {
		d.small("Dimensions: " + s + ".")
	}
}

// materials writes a bill of materials as a table.
func (w *reportWriter) materials(m splice.Materials) {
	var rows [][]string
	total := 0.0
	for _, it := range m.Items {
		size := it.Size
		if it.Item == "plate" {
			size = fmt.Sprintf("%s × %s × %s", mm(it.Thickness), mm(it.Width), mm(it.Length))
		}
		rows = append(rows, []string{it.Item, it.Part, it.Name, size, it.Grade, fmt.Sprint(it.Quantity), fixed(it.UnitMass, 3),
			fixed(it.TotalMass(), 2)})
		total += it.TotalMass()
	}
	w.d.table(table{Columns: []column{{"item", 0.7, false}, {"part", 1.2, false}, {"description", 2.5, false}, {"size [mm]", 1.3, false},
		{"class / grade", 1, false}, {"qty", 0.55, true}, {"each [kg]", 0.8, true}, {"total [kg]", 0.8, true}}, Rows: rows})
	s := fmt.Sprintf("%d holes drilled (every ply counted)", m.Holes)
	if m.FayingArea > 0 {
		s += fmt.Sprintf(", %s m² of prepared faying surface", fixed(m.FayingArea, 2))
	}
	w.d.small(fmt.Sprintf("%s; %s kg in all. Plates at 7850 kg/m³ (EN 1991-1-1 Table A.4); nut classes and washer hardness "+
		"as they go with the bolt class (ISO 898-2, EN 14399-6, ISO 7089; from memory). Packing plates, where a splice has them, "+
		"are not listed.", s, fixed(total, 1)))
}

// billTitle heads the layout's bill of materials.
const billTitle = "Bill of materials"

// hasBill reports whether the report has a bill of materials: a layout with splices.
func (w *reportWriter) hasBill() bool {
	return w.in.Outcome.Infeasible == nil && len(w.r.Bill.Splices) > 0
}

// bill writes the recommended layout's bill of materials: every splice's lines added up.
func (w *reportWriter) bill() {
	d := w.d
	d.heading(0, billTitle, 120)
	names := make([]string, len(w.r.Bill.Splices))
	for i, s := range w.r.Bill.Splices {
		names[i] = fmt.Sprintf("%s at %s", s.Name, fmtM(s.Position))
	}
	d.para(fmt.Sprintf("What the %s of the recommended layout (%s) take to make, identical lines added up: bolts by size, "+
		"class and length with their nuts and washers, cover plates by thickness × width × length and grade. Each "+
		"calculation sheet lists its splice's own; bom.csv has both.", spliceCount(len(names)), strings.Join(names, ", ")))
	w.materials(w.r.Bill.Total)
}

func passWord(ok bool) string {
	if ok {
		return "OK"
	}
	return "FAILS"
}

// check writes one check in full: what, where from, the formula, the numbers and the verdict.
func (w *reportWriter) check(n int, c splice.Check) {
	d := w.d
	d.ensure(4 * smallLead)
	d.paraStyled(fmt.Sprintf("%d. %s — %s (%s)", n, c.ID, c.Clause, c.State), true, false, bodySize, bodyLead)
	if c.Formula != "" {
		d.small("Formula: " + c.Formula)
	}
	if c.Substituted != "" {
		d.small("Numbers: " + c.Substituted)
	}
	if len(c.Inputs) > 0 {
		parts := make([]string, len(c.Inputs))
		for i, in := range c.Inputs {
			parts[i] = fmt.Sprintf("%s = %s %s", in.Name, fourSig(in.Value), in.Unit)
		}
		d.small("Inputs: " + strings.Join(parts, "; "))
	}
	util := "utilisation " + fixed(c.Utilisation, 3)
	if c.Impossible != "" {
		util = encode.UtilisationText(c)
	}
	d.small(fmt.Sprintf("Demand %s %s, resistance %s %s: %s, %s.", fixed(c.Demand, 2), c.Unit,
		fixed(c.Resistance, 2), c.Unit, util, passWord(c.Pass)))
	if c.Note != "" {
		d.small("Note: " + c.Note)
	}
}

func (w *reportWriter) closing() {
	d := w.d
	d.heading(0, "Caution and references", 120)
	d.boxed("Caution", w.in.Caution)
	d.para("References: EN 1990 (basis of design, combinations of actions, Table A1.1 ψ and Table A1.2(B) γ); " +
		"EN 1993-1-1 (member and plate resistances, 6.2 and 6.3.1); EN 1993-1-8 (bolted connections: Tables 3.3, 3.4, " +
		"3.2, clauses 3.6, 3.8, 3.9, 3.10.2); EN 1090-2 (hole clearances, Table 11; slip factors, Table 18; bolt lengths, " +
		"8.2.2); EN 14399-3, -4 and -6 (preloaded HR and HV assemblies); ISO 4014, ISO 4017, ISO 4032 and ISO 7089 " +
		"(non-preloaded bolts, nuts and washers); ISO 898-1 (bolt stress areas); EN 1991-1-1 Table A.4 (steel density); " +
		"EN 10365 and BS 4-1 (section dimensions); EN 10025 (steel grades). National annex values govern where they differ " +
		"from the recommended values used here.")
}
