package encode

import (
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"math"
	"strings"

	"spanbreak/optimise"
)

// WriteOptimise writes an optimisation as "json", "csv" (the candidates) or "text".
func WriteOptimise(w io.Writer, format string, r *optimise.Outcome) error {
	switch format {
	case "json":
		return WriteOptimiseJSON(w, r)
	case "csv":
		return WriteCandidatesCSV(w, r)
	}
	WriteOptimiseText(w, r)
	return nil
}

// WriteOptimiseJSON writes the optimise document exactly as WriteJSON writes Optimise(r), with
// the candidates made and written one at a time, so that a long scan is never held twice.
func WriteOptimiseJSON(w io.Writer, r *optimise.Outcome) error {
	d := optimiseHead(r)
	js := newJSONStream(w)
	js.open('{')
	js.value("input", d.Input)
	js.value("version", d.Version)
	js.value("title", d.Title)
	js.value("units", d.Units)
	js.value("section", d.Section)
	js.value("length", d.Length)
	js.value("step", d.Step)
	js.value("rank", d.Rank)
	js.array("candidates", len(r.Candidates), func(b []byte, i int) []byte {
		e, err := json.MarshalIndent(candidateDoc(r.Candidates[i]), strings.Repeat("  ", js.depth), "  ")
		if err != nil && js.err == nil {
			js.err = err
		}
		return append(b, e...)
	})
	js.value("layouts", layoutDocs(r))
	js.value("diagnosis", Diagnosis(r.Diagnosis))
	js.value("notes", notes(r))
	js.value("caution", Caution)
	js.close('}')
	js.raw("\n")
	return js.flush()
}

// WriteBatch writes a batch summary as "json", "csv" or "text".
func WriteBatch(w io.Writer, format string, outcomes []optimise.BatchOutcome) error {
	switch format {
	case "json":
		return WriteJSON(w, Batch(outcomes))
	case "csv":
		return WriteBatchCSV(w, outcomes)
	}
	WriteBatchText(w, outcomes)
	return nil
}

// --- JSON ------------------------------------------------------------------------------

func optimiseUnits() map[string]string {
	return map[string]string{
		"x": "m", "length": "m", "from": "m", "to": "m", "step": "m", "splices": "m", "mass_kg": "kg",
		"plate_mass_kg": "kg", "splice_mass_kg": "kg", "cost": "currency of the job's rates", "utilisation": "ratio (demand/resistance)",
		"at": "m", "M_Ed": "kNm", "V_Ed": "kN", "Mc_Rd": "kNm", "Vc_Rd": "kN",
	}
}

// CandidateDoc is one scanned position of the optimise document.
type CandidateDoc struct {
	X            Num     `json:"x"`
	Feasible     bool    `json:"feasible"`
	Reason       *string `json:"reason"`
	Cost         *Num    `json:"cost"`
	Bolts        *int    `json:"bolts"`
	PlateMass    *Num    `json:"plate_mass_kg"`
	SpliceMass   *Num    `json:"splice_mass_kg"`
	Utilisation  *Num    `json:"utilisation"`
	Governing    *string `json:"governing"`
	Splice       *string `json:"splice"`
	Rank         *int    `json:"rank"`
	KeepOutZone  *string `json:"keep_out"`
	ForcesULSMax *Num    `json:"uls_M_max"`
	ForcesULSMin *Num    `json:"uls_M_min"`
	ForcesULSV   *Num    `json:"uls_V"`
}

// PieceDoc is one piece of a layout.
type PieceDoc struct {
	From   Num `json:"from"`
	To     Num `json:"to"`
	Length Num `json:"length"`
	Mass   Num `json:"mass_kg"`
}

// CostDoc is the cost of a layout.
type CostDoc struct {
	Splices   Num `json:"splices"`
	Transport Num `json:"transport"`
	Erection  Num `json:"erection"`
	Total     Num `json:"total"`
}

// LayoutDoc is one layout: where the splices go, the pieces, the vehicle and the cost.
type LayoutDoc struct {
	Kind        string      `json:"kind"` // "best" for its splice count, "alternative", "uniform" (identical splices), or "placed" by hand (view)
	Recommended bool        `json:"recommended"`
	Splices     []Num       `json:"splices"`
	Pieces      []PieceDoc  `json:"pieces"`
	Vehicle     *string     `json:"vehicle"`
	Trips       int         `json:"trips"`
	Cost        CostDoc     `json:"cost"`
	Designs     []DesignRef `json:"designs"`
}

// DesignRef is one splice of a layout at its position: what it is and how hard it works.
type DesignRef struct {
	X           Num    `json:"x"`
	Splice      string `json:"splice"`
	Cost        Num    `json:"cost"`
	Bolts       int    `json:"bolts"`
	Utilisation Num    `json:"utilisation"`
	Governing   string `json:"governing"`
}

func designRefs(ps []optimise.PlacedSplice) []DesignRef {
	out := []DesignRef{}
	for _, p := range ps {
		out = append(out, DesignRef{X: Num(p.X * ToM), Splice: p.Splice, Cost: Num(p.Cost), Bolts: p.Bolts,
			Utilisation: Num(p.Utilisation), Governing: p.Governing})
	}
	return out
}

// OptimiseDoc is the JSON document of optimise (DESIGN.md section 7).
type OptimiseDoc struct {
	Input      string            `json:"input"`
	Version    string            `json:"version"`
	Title      string            `json:"title"`
	Units      map[string]string `json:"units"`
	Section    string            `json:"section"`
	Length     Num               `json:"length"`
	Step       Num               `json:"step"`
	Rank       string            `json:"rank"`
	Candidates []CandidateDoc    `json:"candidates"`
	Layouts    []LayoutDoc       `json:"layouts"`
	Diagnosis  []FindingDoc      `json:"diagnosis"`
	Notes      []string          `json:"notes"`
	Caution    string            `json:"caution"`
}

// FindingDoc is one line of the diagnosis of a run where no layout fits (exit status 3).
// Units: from, to and at m; M_Ed and Mc_Rd kNm; V_Ed and Vc_Rd kN. A value a kind does not
// have is null; Mc_Rd and Vc_Rd are null unless the design force exceeds them.
type FindingDoc struct {
	Kind        string  `json:"kind"` // "stretch", "keep_out" or "limit"
	From        *Num    `json:"from"`
	To          *Num    `json:"to"`
	Positions   *int    `json:"positions"`
	Key         string  `json:"key"`
	Check       *string `json:"check"`
	Utilisation *Num    `json:"utilisation"`
	At          *Num    `json:"at"`
	Splice      *string `json:"splice"`
	MEd         *Num    `json:"M_Ed"`
	VEd         *Num    `json:"V_Ed"`
	McRd        *Num    `json:"Mc_Rd"`
	VcRd        *Num    `json:"Vc_Rd"`
	Message     string  `json:"message"`
}

// Diagnosis is the shape of a diagnosis; a run whose layout fits has an empty one.
func Diagnosis(d optimise.Diagnosis) []FindingDoc {
	out := make([]FindingDoc, 0, len(d))
	for _, f := range d {
		j := FindingDoc{Kind: string(f.Kind), Key: f.Key, Message: f.Message}
		if f.To > f.From {
			j.From, j.To = NumPtr(f.From*ToM), NumPtr(f.To*ToM)
		}
		if f.Kind != optimise.FindingLimit {
			j.From, j.To, j.Positions = NumPtr(f.From*ToM), NumPtr(f.To*ToM), ptr(f.Positions)
		}
		if f.Kind == optimise.FindingStretch {
			j.Utilisation, j.At, j.MEd, j.VEd = NumPtr(f.Utilisation), NumPtr(f.At*ToM), NumPtr(f.MEd*ToKNm), NumPtr(f.VEd*ToKN)
			if f.Check != "" {
				j.Check = ptr(f.Check)
			}
			if f.Attempt != "" {
				j.Splice = ptr(f.Attempt)
			}
			if f.McRd > 0 {
				j.McRd = NumPtr(f.McRd * ToKNm)
			}
			if f.VcRd > 0 {
				j.VcRd = NumPtr(f.VcRd * ToKN)
			}
		}
		out = append(out, j)
	}
	return out
}

func ptr[T any](v T) *T { return &v }

func candidateDoc(c optimise.Candidate) CandidateDoc {
	j := CandidateDoc{X: Num(c.X * ToM), Feasible: c.Feasible}
	if !c.Feasible {
		j.Reason = ptr(c.Reason)
	}
	if c.Zone != nil {
		j.KeepOutZone = ptr(c.Zone.Key)
		return j
	}
	f := c.Forces.ULS
	j.ForcesULSMax, j.ForcesULSMin, j.ForcesULSV = NumPtr(f.MMax*ToKNm), NumPtr(f.MMin*ToKNm), NumPtr(f.V*ToKN)
	d := c.Design
	j.Utilisation, j.Governing, j.Splice = NumPtr(d.Utilisation), ptr(d.Governing), ptr(d.Summary)
	if c.Feasible {
		j.Cost, j.Bolts, j.PlateMass = NumPtr(d.Cost), ptr(d.Bolts), NumPtr(d.PlateMass)
		j.SpliceMass, j.Rank = NumPtr(d.Mass()), ptr(c.Rank)
	}
	return j
}

// layoutDoc is the shape of one layout wherever a layout appears.
func layoutDoc(l optimise.Layout, kind string, recommended bool) LayoutDoc {
	j := LayoutDoc{Kind: kind, Recommended: recommended, Splices: Nums(l.Splices, ToM), Trips: l.Trips,
		Cost: CostDoc{Num(l.Cost.Splices), Num(l.Cost.Transport), Num(l.Cost.Erection), Num(l.Cost.Total)}}
	for _, p := range l.Pieces {
		j.Pieces = append(j.Pieces, PieceDoc{Num(p.From * ToM), Num(p.To * ToM), Num(p.Length * ToM), Num(p.Mass)})
	}
	if l.Vehicle != "" {
		j.Vehicle = ptr(l.Vehicle)
	}
	return j
}

func layoutDocs(r *optimise.Outcome) []LayoutDoc {
	out := []LayoutDoc{}
	add := func(kind optimise.LayoutKind, i int, l optimise.Layout, ps []optimise.PlacedSplice) {
		d := layoutDoc(l, string(kind), r.IsRecommended(optimise.LayoutRef{Kind: kind, Index: i}))
		d.Designs = designRefs(ps)
		out = append(out, d)
	}
	for i, l := range r.Layouts.ByCount {
		add(optimise.KindBest, i, l, r.PlacedSplices(l))
		if r.Placed {
			out[len(out)-1].Kind = "placed" // the one layout of Outcome.WithLayout, placed by hand
		}
	}
	for i, l := range r.Layouts.Alternatives {
		add(optimise.KindAlternative, i, l, r.PlacedSplices(l))
	}
	for i, u := range r.Identical.ByCount {
		add(optimise.KindUniform, i, u.Layout, u.Designs)
	}
	return out
}

// optimiseHead is the optimise document's fields before the candidates.
func optimiseHead(r *optimise.Outcome) OptimiseDoc {
	return OptimiseDoc{Input: r.Setup.File, Version: Version(), Title: r.Setup.Title, Units: optimiseUnits(), Section: r.Setup.Section.Name,
		Length: Num(r.Setup.Model.Length * ToM), Step: Num(r.Step * ToM), Rank: string(r.Rank)}
}

// Optimise is the JSON document of an optimisation.
func Optimise(r *optimise.Outcome) OptimiseDoc {
	j := optimiseHead(r)
	j.Candidates, j.Layouts, j.Diagnosis = make([]CandidateDoc, 0, len(r.Candidates)), layoutDocs(r), Diagnosis(r.Diagnosis)
	j.Notes, j.Caution = notes(r), Caution
	for _, c := range r.Candidates {
		j.Candidates = append(j.Candidates, candidateDoc(c))
	}
	return j
}

// notes are the result's notes plus any layout whose fewest trips were not proven.
func notes(r *optimise.Outcome) []string {
	out := append([]string{}, r.Notes...)
	for _, l := range append(append([]optimise.Layout{}, r.Layouts.ByCount...), r.Layouts.Alternatives...) {
		if !l.Proven {
			out = append(out, fmt.Sprintf("the layout with splices at %s m: the search for fewer trips stopped at its work bound; "+
				"a layout with fewer trips may exist", positions(l.Splices)))
		}
	}
	return out
}

type batchJobDoc struct {
	File      string       `json:"file"`
	Title     string       `json:"title"`
	Best      *LayoutDoc   `json:"best"`
	Error     *string      `json:"error"`
	Diagnosis []FindingDoc `json:"diagnosis"` // why no layout fits; empty otherwise
}

// BatchDoc is the JSON document of a batch: the best layout of each job, or its error.
type BatchDoc struct {
	Version string            `json:"version"`
	Units   map[string]string `json:"units"`
	Jobs    []batchJobDoc     `json:"jobs"`
	Caution string            `json:"caution"`
}

// Batch is the JSON document of a batch.
func Batch(outcomes []optimise.BatchOutcome) BatchDoc {
	jobs := make([]batchJobDoc, 0, len(outcomes))
	for _, o := range outcomes {
		j := batchJobDoc{File: o.File, Title: o.Title, Diagnosis: []FindingDoc{}}
		if o.Err != nil {
			j.Error = ptr(o.Err.Error())
			if o.Outcome != nil {
				j.Diagnosis = Diagnosis(o.Outcome.Diagnosis)
			}
		} else {
			j.Best = ptr(layoutDoc(o.Outcome.Recommended(), string(o.Outcome.Pick.Kind), true))
			j.Best.Designs = designRefs(o.Outcome.PlacedSplices(o.Outcome.Recommended()))
		}
		jobs = append(jobs, j)
	}
	return BatchDoc{Version(), optimiseUnits(), jobs, Caution}
}

// --- CSV -------------------------------------------------------------------------------

// WriteCandidatesCSV writes one row per scanned position, each made as it is written.
func WriteCandidatesCSV(w io.Writer, r *optimise.Outcome) error {
	return writeCSVRows(w, []string{"x_m", "feasible", "rank", "cost", "bolts", "holes", "plate_mass_kg", "splice_mass_kg",
		"utilisation", "governing", "uls_M_max_kNm", "uls_M_min_kNm", "uls_V_kN", "splice", "reason"}, len(r.Candidates),
		func(i int, row []Cell) []Cell {
			c := &r.Candidates[i]
			row = append(row[:0], make([]Cell, 15)...)
			row[0], row[1], row[14] = Decimal(c.X*ToM), Boolean(c.Feasible), Text(c.Reason)
			if c.Zone == nil {
				d, f := c.Design, c.Forces.ULS
				row[8], row[9], row[10], row[11], row[12], row[13] = Decimal(d.Utilisation), Text(d.Governing), Decimal(f.MMax*ToKNm),
					Decimal(f.MMin*ToKNm), Decimal(f.V*ToKN), Text(d.Summary)
				if c.Feasible {
					row[2], row[3], row[4], row[5] = Integer(c.Rank), Decimal(d.Cost), Integer(d.Bolts), Integer(d.Holes)
					row[6], row[7] = Decimal(d.PlateMass), Decimal(d.Mass())
				}
			}
			return row
		})
}

// WriteLayoutsCSV writes one row per layout.
func WriteLayoutsCSV(w io.Writer, r *optimise.Outcome) error {
	var rows [][]Cell
	for _, j := range layoutDocs(r) {
		rows = append(rows, append([]Cell{Text(j.Kind), Boolean(j.Recommended)}, layoutCSVRow(j)...))
	}
	return WriteCSV(w, layoutCSVHeader("kind", "recommended"), rows)
}

func layoutCSVHeader(first ...string) []string {
	return append(first, "splice_count", "splices_m", "pieces_m", "piece_mass_kg", "vehicle", "trips",
		"cost_splices", "cost_transport", "cost_erection", "cost_total")
}

func layoutCSVRow(j LayoutDoc) []Cell {
	var pieces, masses []float64
	for _, p := range j.Pieces {
		pieces = append(pieces, float64(p.Length))
		masses = append(masses, float64(p.Mass))
	}
	var xs []float64
	for _, x := range j.Splices {
		xs = append(xs, float64(x))
	}
	vehicle := ""
	if j.Vehicle != nil {
		vehicle = *j.Vehicle
	}
	c := j.Cost
	return []Cell{Integer(len(j.Splices)), Decimals(xs), Decimals(pieces), Decimals(masses),
		Text(vehicle), Integer(j.Trips), Decimal(float64(c.Splices)), Decimal(float64(c.Transport)), Decimal(float64(c.Erection)), Decimal(float64(c.Total))}
}

// WriteBatchCSV writes the best layout of each job of a batch, or its error.
func WriteBatchCSV(w io.Writer, outcomes []optimise.BatchOutcome) error {
	var rows [][]Cell
	for _, o := range outcomes {
		if o.Err != nil {
			row := make([]Cell, 13)
			row[0], row[1], row[12] = Text(o.File), Text(o.Title), Text(o.Err.Error())
			rows = append(rows, row)
			continue
		}
		j := layoutDoc(o.Outcome.Recommended(), string(o.Outcome.Pick.Kind), true)
		rows = append(rows, append(append([]Cell{Text(o.File), Text(o.Title)}, layoutCSVRow(j)...), Cell{}))
	}
	return WriteCSV(w, append(layoutCSVHeader("file", "title"), "error"), rows)
}

// --- text ------------------------------------------------------------------------------

func positions(xs []float64) string {
	if len(xs) == 0 {
		return "none"
	}
	s := make([]string, len(xs))
	for i, x := range xs {
		s[i] = fmt.Sprintf("%.3f", x*ToM)
	}
	return strings.Join(s, ", ")
}

func money(v float64) string { return fmt.Sprintf("%.2f", Clean(v)) }

func lengthLimit(mm float64) string {
	if math.IsInf(mm, 1) {
		return "no limit"
	}
	return fmt.Sprintf("%.3f m", mm*ToM)
}

func massLimit(kg float64) string {
	if math.IsInf(kg, 1) {
		return "no limit"
	}
	return fmt.Sprintf("%.0f kg", kg)
}

// WriteOptimiseText writes an optimisation for reading: limits, the recommendation, the
// layouts, the admissible stretches and the best positions.
func WriteOptimiseText(w io.Writer, r *optimise.Outcome) {
	w = TextWriter(w)
	fmt.Fprintf(w, "spanbreak %s: splice positions and layouts\n", Version())
	fmt.Fprintf(w, "Input:    %s\n", Printable(r.Setup.File))
	if r.Setup.Title != "" {
		fmt.Fprintf(w, "Title:    %s\n", Printable(r.Setup.Title))
	}
	fmt.Fprintf(w, "Beam:     %s, length %.3f m, %.1f kg/m of steel\n", r.Setup.Section.Name, r.Setup.Model.Length*ToM, r.Setup.Section.Mass)
	splices := fmt.Sprintf("%d or more", r.Setup.MinSplices)
	if r.Setup.MaxSplices >= 0 {
		splices = fmt.Sprintf("%d to %d", r.Setup.MinSplices, r.Setup.MaxSplices)
	}
	fmt.Fprintf(w, "Limits:   piece length %s to %s, piece mass %s (crane), rigging %.0f kg per piece, %s splices, gap %g mm\n",
		lengthLimit(r.Limits.MinLength), lengthLimit(r.Limits.MaxLength), massLimit(r.Limits.MaxMass), r.Limits.Rigging, splices, r.Gap())
	if len(r.Setup.Vehicles) > 0 {
		var vs []string
		for _, v := range r.Setup.Vehicles {
			vs = append(vs, fmt.Sprintf("%s (%.2f m, %.0f kg, %s per trip)", v.Name, v.MaxLength*ToM, v.Payload, money(v.Cost)))
		}
		fmt.Fprintf(w, "Vehicles: %s\n", strings.Join(vs, "; "))
	}
	feasible, kept := 0, 0
	for _, c := range r.Candidates {
		switch {
		case c.Feasible:
			feasible++
		case c.Zone != nil:
			kept++
		}
	}
	if r.Fixed != nil {
		fmt.Fprintf(w, "Splice:   fixed, checked at every position (no sizing): %s\n", SpliceWords(*r.Fixed))
	}
	fmt.Fprintf(w, "Scan:     every %.3f m, %d positions: %d admissible, %d in keep-out zones, %d where no splice passes; lift %s per piece\n\n",
		r.Step*ToM, len(r.Candidates), feasible, kept, len(r.Candidates)-feasible-kept, money(r.Setup.Lift))
	for _, s := range r.Member.Warnings() {
		fmt.Fprintf(w, "WARNING: %s\n\n", s)
	}
	if r.Infeasible != nil {
		WriteDiagnosisText(w, r.Diagnosis)
	} else {
		writeRecommendation(w, r)
		writeLayoutTable(w, r)
	}
	writeCandidateSummary(w, r)
	for _, n := range notes(r) {
		fmt.Fprintf(w, "Note: %s\n", n)
	}
	fmt.Fprintf(w, "\n%s\n", Caution)
}

// WriteDiagnosisText writes the section that says why no layout fits, one finding a line.
func WriteDiagnosisText(w io.Writer, d optimise.Diagnosis) {
	fmt.Fprintln(w, "WHY NO LAYOUT FITS")
	for _, l := range d.Lines() {
		fmt.Fprintf(w, "- %s\n", l)
	}
	fmt.Fprintln(w)
}

func vehicleText(l optimise.Layout) string {
	if l.Vehicle == "" {
		return "no vehicle costed"
	}
	return fmt.Sprintf("%s, %d trip(s)", l.Vehicle, l.Trips)
}

func writeRecommendation(w io.Writer, r *optimise.Outcome) {
	best := r.Recommended()
	fmt.Fprintf(w, "RECOMMENDATION: %d splice(s)", len(best.Splices))
	if len(best.Splices) > 0 {
		fmt.Fprintf(w, " at %s m", positions(best.Splices))
	}
	fmt.Fprintf(w, ", %d piece(s), %s; total %s\n", len(best.Pieces), vehicleText(best), money(best.Cost.Total))
	fmt.Fprintf(w, "  cost: splices %s + transport %s + erection %s = %s\n", money(best.Cost.Splices),
		money(best.Cost.Transport), money(best.Cost.Erection), money(best.Cost.Total))
	if why := RecommendationRule(r); why != "" {
		fmt.Fprintf(w, "  %s\n", why)
	}
	if cmp := UniformComparison(r); cmp != "" {
		fmt.Fprintf(w, "  %s\n", cmp)
	}
	tw := Table(w)
	fmt.Fprintln(tw, "  piece\tfrom [m]\tto [m]\tlength [m]\tmass [kg]\tof which splice [kg]")
	for i, p := range best.Pieces {
		fmt.Fprintf(tw, "  %d\t%.3f\t%.3f\t%.3f\t%.1f\t%.1f\n", i+1, p.From*ToM, p.To*ToM, p.Length*ToM, p.Mass, p.SpliceMass)
	}
	tw.Flush()
	if len(best.Splices) > 0 {
		tw = Table(w)
		fmt.Fprintln(tw, "  splice at [m]\tcost\tbolts\tutilisation\tgoverning check\tsplice")
		for _, ci := range candidateIndices(r, best) {
			c := r.Candidates[ci]
			fmt.Fprintf(tw, "  %.3f\t%s\t%d\t%.3f\t%s\t%s\n", c.X*ToM, money(c.Design.Cost), c.Design.Bolts,
				c.Design.Utilisation, c.Design.Governing, c.Design.Summary)
		}
		tw.Flush()
	}
	fmt.Fprintln(w)
}

// candidateIndices maps a layout's splices to the candidates they sit at.
func candidateIndices(r *optimise.Outcome, l optimise.Layout) []int {
	var out []int
	k := 0
	for i, c := range r.Candidates {
		if k < len(l.Splices) && c.X == l.Splices[k] {
			out = append(out, i)
			k++
		}
	}
	return out
}

func writeLayoutTable(w io.Writer, r *optimise.Outcome) {
	// row prints a layout's cells, then the extra cells (the last is the recommendation mark)
	row := func(tw io.Writer, l optimise.Layout, extra ...string) {
		var ls []string
		for _, p := range l.Pieces {
			ls = append(ls, fmt.Sprintf("%.2f", p.Length*ToM))
		}
		vehicle := l.Vehicle
		if vehicle == "" {
			vehicle = "-"
		}
		fmt.Fprintf(tw, "%d\t%s\t%s\t%s\t%d\t%s\t%s\t%s\t%s\t%s\n", len(l.Splices), positions(l.Splices), strings.Join(ls, " / "),
			vehicle, l.Trips, money(l.Cost.Splices), money(l.Cost.Transport), money(l.Cost.Erection), money(l.Cost.Total),
			strings.Join(extra, "\t"))
	}
	header := "splices\tat [m]\tpieces [m]\tvehicle\ttrips\tsplices\ttransport\terection\ttotal\t"
	fmt.Fprintln(w, "Best layout for each number of splices")
	tw := Table(w)
	fmt.Fprintln(tw, header)
	mark := func(kind optimise.LayoutKind, i int) string {
		if r.IsRecommended(optimise.LayoutRef{Kind: kind, Index: i}) {
			return "<- recommended"
		}
		return ""
	}
	for i, l := range r.Layouts.ByCount {
		row(tw, l, mark(optimise.KindBest, i))
	}
	tw.Flush()
	if len(r.Layouts.Alternatives) > 0 {
		fmt.Fprintln(w, "\nNear-best alternatives (each moves a splice to another stretch or splice design)")
		tw = Table(w)
		fmt.Fprintln(tw, header)
		for i, l := range r.Layouts.Alternatives {
			row(tw, l, mark(optimise.KindAlternative, i))
		}
		tw.Flush()
	}
	if len(r.Identical.ByCount) > 0 {
		fmt.Fprintln(w, "\nBest layout of identical splices for each number of splices (one splice type: one drawing, one bolt list)")
		tw = Table(w)
		fmt.Fprintln(tw, header+"against mixed\tsplice\t")
		for i, u := range r.Identical.ByCount {
			extra := "-"
			if m, ok := mixedOfCount(r, len(u.Splices)); ok {
				extra = signedMoney(u.Cost.Total - m.Cost.Total)
			}
			design := "-"
			if len(u.Splices) > 0 {
				design = u.Design.Summary
			}
			row(tw, u.Layout, extra, design, mark(optimise.KindUniform, i))
		}
		tw.Flush()
	}
	fmt.Fprintln(w)
}

// mixedOfCount is the best mixed layout with n splices.
func mixedOfCount(r *optimise.Outcome, n int) (optimise.Layout, bool) {
	for _, l := range r.Layouts.ByCount {
		if len(l.Splices) == n {
			return l, true
		}
	}
	return optimise.Layout{}, false
}

// signedMoney prints a cost difference with its sign.
func signedMoney(v float64) string { return fmt.Sprintf("%+.2f", Clean(v)) }

// UniformComparison compares the recommended layout with the best of identical splices of the
// same count, e.g. "identical splices: +38.20, one splice type (M20 10.9; ...)".
func UniformComparison(r *optimise.Outcome) string {
	rec := r.Recommended()
	if r.Pick.Kind == optimise.KindUniform {
		if m, ok := mixedOfCount(r, len(rec.Splices)); ok && len(rec.Splices) > 0 {
			return fmt.Sprintf("identical splices by the rule of the job or --uniform: %s against the best mixed layout of %d splice(s) (%s)",
				signedMoney(rec.Cost.Total-m.Cost.Total), len(rec.Splices), money(m.Cost.Total))
		}
		return ""
	}
	for _, u := range r.Identical.ByCount {
		if len(u.Splices) != len(rec.Splices) || len(u.Splices) == 0 {
			continue
		}
		d := u.Cost.Total - rec.Cost.Total
		if math.Abs(d) < 0.005 && sameSplices(u.Splices, rec.Splices) {
			return "identical splices: the recommended layout already uses one splice type"
		}
		return fmt.Sprintf("identical splices: %s, one splice type (%s), at %s m", signedMoney(d), u.Design.Summary, positions(u.Splices))
	}
	return ""
}

func sameSplices(a, b []float64) bool {
	if len(a) != len(b) {
		return false
	}
	for i := range a {
		if a[i] != b[i] {
			return false
		}
	}
	return true
}

// RecommendationRule says why the recommended layout is not simply the cheapest.
func RecommendationRule(r *optimise.Outcome) string {
	switch {
	case r.Pick.Kind == optimise.KindUniform:
		return "recommended: the cheapest layout of identical splices (scan.uniform or --uniform)"
	case r.Rank != optimise.RankCost && r.Rank != "":
		return fmt.Sprintf("recommended by %s (--rank): the listed layout with the %s, cost breaking ties", r.Rank,
			map[optimise.Rank]string{optimise.RankBolts: "fewest bolts", optimise.RankMass: "least plate mass",
				optimise.RankUtilisation: "lowest highest utilisation (most reserve)"}[r.Rank])
	}
	return ""
}

// writeCandidateSummary lists the admissible stretches with their cheapest position, and the
// best positions by the ranking.
func writeCandidateSummary(w io.Writer, r *optimise.Outcome) {
	fmt.Fprintln(w, "Admissible stretches (consecutive positions where a splice may go)")
	tw := Table(w)
	fmt.Fprintln(tw, "from [m]\tto [m]\tpositions\tcheapest\tat [m]\tutilisation\tgoverning check")
	cs := r.Candidates
	for i := 0; i < len(cs); {
		if !cs[i].Feasible {
			i++
			continue
		}
		j, best := i, i
		for j < len(cs) && cs[j].Feasible {
			if cs[j].Design.Cost < cs[best].Design.Cost {
				best = j
			}
			j++
		}
		b := cs[best]
		fmt.Fprintf(tw, "%.3f\t%.3f\t%d\t%s\t%.3f\t%.3f\t%s\n", cs[i].X*ToM, cs[j-1].X*ToM, j-i, money(b.Design.Cost), b.X*ToM,
			b.Design.Utilisation, b.Design.Governing)
		i = j
	}
	tw.Flush()
	ranked := r.DistinctBest(5)
	fmt.Fprintf(w, "\nBest positions by %s (the best of each splice design over each stretch)\n", r.Rank)
	tw = Table(w)
	fmt.Fprintln(tw, "rank\tat [m]\tcost\tbolts\tplates [kg]\tutilisation\tsplice")
	for _, c := range ranked {
		fmt.Fprintf(tw, "%d\t%.3f\t%s\t%d\t%.1f\t%.3f\t%s\n", c.Rank, c.X*ToM, money(c.Design.Cost), c.Design.Bolts,
			c.Design.PlateMass, c.Design.Utilisation, c.Design.Summary)
	}
	tw.Flush()
	fmt.Fprintln(w)
}

// WriteBatchText writes the summary table of a batch.
func WriteBatchText(w io.Writer, outcomes []optimise.BatchOutcome) {
	w = TextWriter(w)
	fmt.Fprintf(w, "spanbreak %s: best layout of each job\n\n", Version())
	tw := Table(w)
	fmt.Fprintln(tw, "file\ttitle\tsplices\tat [m]\tvehicle\ttrips\ttotal\tstatus")
	var errs []string
	for _, o := range outcomes {
		if o.Err != nil {
			status := "failed (below)"
			var inf *optimise.InfeasibleError
			if errors.As(o.Err, &inf) {
				status = "no layout within the limits (below)"
			}
			fmt.Fprintf(tw, "%s\t%s\t\t\t\t\t\t%s\n", Printable(o.File), Printable(o.Title), status)
			msg := o.Err.Error()
			if o.Outcome != nil && len(o.Outcome.Diagnosis) > 0 {
				msg += "\n  why: " + o.Outcome.Diagnosis[0].Message
			}
			errs = append(errs, msg)
			continue
		}
		l := o.Outcome.Recommended()
		vehicle := l.Vehicle
		if vehicle == "" {
			vehicle = "-"
		}
		fmt.Fprintf(tw, "%s\t%s\t%d\t%s\t%s\t%d\t%s\tok\n", Printable(o.File), Printable(o.Title), len(l.Splices), positions(l.Splices), vehicle,
			l.Trips, money(l.Cost.Total))
	}
	tw.Flush()
	if len(errs) > 0 {
		fmt.Fprintln(w, "\nProblems")
		for _, e := range errs {
			fmt.Fprintln(w, e)
		}
	}
	fmt.Fprintf(w, "\n%s\n", Caution)
}
