package encode

import (
	"bufio"
	"bytes"
	"encoding/json"
	"fmt"
	"io"
	"strconv"
	"strings"
	"unicode/utf8"

	"spanbreak/beam"
	"spanbreak/optimise"
	"spanbreak/optimise/forcetable"
)

// AnalysisUnits are the units of the analyse documents.
func AnalysisUnits() map[string]string {
	return map[string]string{
		"x": "m", "length": "m", "M": "kNm", "V": "kN", "N": "kN", "w": "mm",
		"Fz": "kN", "Fx": "kN", "My": "kNm",
		"signs": "M sagging +, V = dM/dx, N tension +, w downward +, Fz upward +, My clockwise +",
	}
}

// SideName is "left" or "right": which side of a jump a station's values are.
func SideName(s beam.Side) string {
	if s == beam.Left {
		return "left"
	}
	return "right"
}

// WriteAnalysis writes an analysis in a format: "json", "csv" or "text".
func WriteAnalysis(w io.Writer, format string, o *optimise.BeamOutcome) error {
	if format != "json" && format != "csv" {
		w = TextWriter(w)
	}
	if o.Case != nil {
		return writeCase(w, format, o.Setup, *o.Case)
	}
	return writeEnvelopes(w, format, o.Setup, o.Envelopes, o.Member)
}

// --- one case ---------------------------------------------------------------------------

type reactionDoc struct {
	X  Num `json:"x"`
	Fz Num `json:"Fz"`
	Fx Num `json:"Fx"`
	My Num `json:"My"`
}

// CaseDoc is the JSON document of one load case, unfactored.
type CaseDoc struct {
	Input     string            `json:"input"`
	Version   string            `json:"version"`
	Units     map[string]string `json:"units"`
	Length    Num               `json:"length"`
	Stations  []Num             `json:"stations"`
	Sides     []string          `json:"sides"`
	Case      string            `json:"case"`
	M         []Num             `json:"M"`
	V         []Num             `json:"V"`
	N         []Num             `json:"N"`
	W         []Num             `json:"w"`
	Reactions []reactionDoc     `json:"reactions"`
}

// writeCase writes one case as JSON (the CaseDoc that WriteJSON would write, byte for byte),
// CSV or text, streaming the parts of a value per station as writeEnvelopes does.
func writeCase(w io.Writer, format string, s *optimise.Setup, r beam.CaseResult) error {
	st, ef := r.Stations, &r.Effects
	var reactions []reactionDoc
	for _, rc := range r.Reactions {
		reactions = append(reactions, reactionDoc{Num(rc.X * ToM), Num(rc.Fz * ToKN), Num(rc.Fx * ToKN), Num(rc.My * ToKNm)})
	}
	switch format {
	case "json":
		js := newJSONStream(w)
		js.open('{')
		js.value("input", s.File)
		js.value("version", Version())
		js.value("units", AnalysisUnits())
		js.value("length", Num(s.Model.Length*ToM))
		js.array("stations", len(st), func(b []byte, i int) []byte { return appendNum(b, st[i].X*ToM) })
		js.array("sides", len(st), func(b []byte, i int) []byte { return append(append(append(b, '"'), SideName(st[i].Side)...), '"') })
		js.value("case", r.Case)
		for _, q := range []struct {
			key string
			v   []float64
			f   float64
		}{{"M", ef.M, ToKNm}, {"V", ef.V, ToKN}, {"N", ef.N, ToKN}, {"w", ef.W, 1}} {
			js.array(q.key, len(q.v), func(b []byte, i int) []byte { return appendNum(b, q.v[i]*q.f) })
		}
		js.value("reactions", reactions)
		js.close('}')
		js.raw("\n")
		return js.flush()
	case "csv":
		// encoding/csv's record: numbers and "left"/"right" need no quotes
		bw := bufio.NewWriterSize(w, 1<<16)
		if err := WriteCSV(bw, []string{"x_m", "side", "M_kNm", "V_kN", "N_kN", "w_mm"}, nil); err != nil {
			return err
		}
		var line []byte
		for i := range st {
			line = appendNum(line[:0], st[i].X*ToM)
			line = append(append(line, ','), SideName(st[i].Side)...)
			for _, v := range []float64{ef.M[i] * ToKNm, ef.V[i] * ToKN, ef.N[i] * ToKN, ef.W[i]} {
				line = appendNum(append(line, ','), v)
			}
			if _, err := bw.Write(append(line, '\n')); err != nil {
				return err
			}
		}
		return bw.Flush()
	}
	bw := bufio.NewWriter(w)
	writeBeamHeader(bw, s, "load case "+r.Case+", unfactored (characteristic)")
	writeRightRows(bw, []string{"x [m]", "", "M [kNm]", "V [kN]", "N [kN]", "w [mm]"}, len(st), func(i int, c [][]byte) {
		c[0] = strconv.AppendFloat(c[0], st[i].X*ToM, 'f', 3, 64)
		c[1] = append(c[1], sideMark(st, i)...)
		for j, v := range []float64{ef.M[i] * ToKNm, ef.V[i] * ToKN, ef.N[i] * ToKN, ef.W[i]} {
			c[2+j] = appendClean(c[2+j], v, 2)
		}
	})
	fmt.Fprintln(bw, "\nSupport reactions")
	tw := RightTable(bw)
	fmt.Fprintln(tw, "x [m]\tFz [kN]\tFx [kN]\tMy [kNm]\t")
	for _, rc := range r.Reactions {
		fmt.Fprintf(tw, "%.3f\t%.2f\t%.2f\t%.2f\t\n", rc.X*ToM, Clean(rc.Fz*ToKN), Clean(rc.Fx*ToKN), Clean(rc.My*ToKNm))
	}
	tw.Flush()
	fmt.Fprintf(bw, "\n%s\n", Caution)
	return bw.Flush()
}

// sideMark marks the two values at a jump: "L" just left of x, "R" just right.
func sideMark(st []beam.Station, i int) string {
	dup := (i > 0 && st[i-1].X == st[i].X) || (i+1 < len(st) && st[i+1].X == st[i].X)
	if !dup {
		return ""
	}
	if st[i].Side == beam.Left {
		return "L"
	}
	return "R"
}

// writeBeamHeader prints what was analysed: file, title, beam, supports, cases and combinations.
func writeBeamHeader(w io.Writer, s *optimise.Setup, what string) {
	fmt.Fprintf(w, "spanbreak %s: %s\n", Version(), what)
	fmt.Fprintf(w, "Input:    %s\n", Printable(s.File))
	if s.Title != "" {
		fmt.Fprintf(w, "Title:    %s\n", Printable(s.Title))
	}
	sw := "self weight off"
	if s.SelfWeight > 0 {
		sw = fmt.Sprintf("self weight %.3f kN/m", s.SelfWeight)
	}
	fmt.Fprintf(w, "Beam:     %s, %s, length %.3f m, Iy = %.4g cm4, %s\n",
		s.Section.Name, s.Grade.Name, s.Model.Length*ToM, s.Section.Iy/1e4, sw)
	var sup []string
	for _, sp := range s.Model.Supports {
		sup = append(sup, fmt.Sprintf("%.3f m %s", sp.X*ToM, sp.Kind))
	}
	fmt.Fprintf(w, "Supports: %s\n", strings.Join(sup, ", "))
	if len(s.Model.Hinges) > 0 {
		var h []string
		for _, x := range s.Model.Hinges {
			h = append(h, fmt.Sprintf("%.3f m", x*ToM))
		}
		fmt.Fprintf(w, "Hinges:   %s\n", strings.Join(h, ", "))
	}
	if t := s.Table; t != nil {
		fmt.Fprintf(w, "Forces:   imported from %s (%s table, %d rows, SHA-256 %s); the beam analysis was not run;\n", t.File, t.Shape, t.Rows, t.SHA256)
		fmt.Fprintf(w, "          the table's own stations, linear between them (exact only at stations)\n")
		fmt.Fprintf(w, "Units:    x m, M kNm (sagging +), V kN (V = dM/dx), N kN (tension +), w mm (downward +)\n\n")
		return
	}
	var cs []string
	for _, c := range s.Cases {
		d := c.Name + " (" + c.Kind.String()
		if c.Pattern {
			d += ", patterned"
		}
		cs = append(cs, d+")")
	}
	fmt.Fprintf(w, "Cases:    %s\n", strings.Join(cs, ", "))
	nU, nS := countStates(s.Combinations)
	fmt.Fprintf(w, "Combinations: %d ULS (EN 1990 %s), %d SLS (%s); γG,sup %.2f, γG,inf %.2f, γQ %.2f\n",
		nU, s.Rules.ULS, nS, s.Rules.SLS, s.Rules.GammaGSup, s.Rules.GammaGInf, s.Rules.GammaQ)
	fmt.Fprintf(w, "Units:    x m, M kNm (sagging +), V kN (V = dM/dx), N kN (tension +), w mm (downward +)\n\n")
}

// countStates counts the ULS and the SLS combinations.
func countStates(cs []beam.Combination) (uls, sls int) {
	for _, c := range cs {
		if c.State == beam.ULS {
			uls++
		} else {
			sls++
		}
	}
	return uls, sls
}

// --- envelopes --------------------------------------------------------------------------

type envelopeDoc struct {
	MMax      []Num               `json:"M_max"`
	MMin      []Num               `json:"M_min"`
	VMax      []Num               `json:"V_max"`
	VMin      []Num               `json:"V_min"`
	NMax      []Num               `json:"N_max"`
	NMin      []Num               `json:"N_min"`
	WMax      []Num               `json:"w_max"`
	WMin      []Num               `json:"w_min"`
	Governing map[string][]string `json:"governing"`
	Reactions []reactionEnvDoc    `json:"reactions"`
}

type reactionEnvDoc struct {
	X        Num    `json:"x"`
	FzMax    Num    `json:"Fz_max"`
	FzMin    Num    `json:"Fz_min"`
	FxMax    Num    `json:"Fx_max"`
	FxMin    Num    `json:"Fx_min"`
	MyMax    Num    `json:"My_max"`
	MyMin    Num    `json:"My_min"`
	FzMaxGov string `json:"Fz_max_governing"`
	FzMinGov string `json:"Fz_min_governing"`
}

// EnvelopesDoc is the JSON document of the envelopes (DESIGN.md section 7).
type EnvelopesDoc struct {
	Input        string            `json:"input"`
	Version      string            `json:"version"`
	Units        map[string]string `json:"units"`
	Length       Num               `json:"length"`
	Stations     []Num             `json:"stations"`
	Sides        []string          `json:"sides"`
	Combinations []string          `json:"combinations"`
	ULS          envelopeDoc       `json:"uls"`
	SLS          envelopeDoc       `json:"sls"`
	Member       *MemberDoc        `json:"member"`
	Deflection   []DeflectionDoc   `json:"deflection"`
}

// writeEnvelopes writes the envelopes as JSON, CSV or text. Each streams its long parts (a
// value per station) straight to w, formatting each value as it goes, so that the memory it
// takes does not grow with the stations: the JSON is the EnvelopesDoc that WriteJSON would
// write, byte for byte.
func writeEnvelopes(w io.Writer, format string, s *optimise.Setup, env *beam.Envelopes, m *optimise.MemberChecks) error {
	switch format {
	case "json":
		return writeEnvelopesJSON(w, s, env, m)
	case "csv":
		// the envelope table a job can import back (optimise/forcetable)
		return forcetable.WriteEnvelopes(w, env)
	}
	bw := bufio.NewWriter(w)
	writeEnvelopeText(bw, s, env, m)
	return bw.Flush()
}

// writeEnvelopesJSON writes the EnvelopesDoc of the envelopes (DESIGN.md section 7): the
// parts of a value per station streamed, the others through encoding/json, each where
// WriteJSON puts it.
func writeEnvelopesJSON(w io.Writer, s *optimise.Setup, env *beam.Envelopes, m *optimise.MemberChecks) error {
	js := newJSONStream(w)
	var combos []string
	for _, c := range env.Combinations {
		combos = append(combos, c.Name)
	}
	var member *MemberDoc
	var deflection []DeflectionDoc
	if m != nil {
		member, deflection = ptr(Member(m)), Deflections(m)
	}
	st := env.Stations
	js.open('{')
	js.value("input", s.File)
	js.value("version", Version())
	js.value("units", AnalysisUnits())
	js.value("length", Num(s.Model.Length*ToM))
	js.array("stations", len(st), func(b []byte, i int) []byte { return appendNum(b, st[i].X*ToM) })
	js.array("sides", len(st), func(b []byte, i int) []byte { return append(append(append(b, '"'), SideName(st[i].Side)...), '"') })
	js.value("combinations", combos)
	names := newGoverning(env)
	for _, state := range []struct {
		key       string
		e         *beam.Envelope
		reactions []beam.ReactionEnvelope
	}{{"uls", &env.ULS, env.ULSReactions}, {"sls", &env.SLS, env.SLSReactions}} {
		js.field(state.key)
		js.open('{')
		e := state.e
		for _, sr := range []struct {
			key string
			ex  []beam.Extreme
			f   float64
		}{{"M_max", e.MMax, ToKNm}, {"M_min", e.MMin, ToKNm}, {"V_max", e.VMax, ToKN}, {"V_min", e.VMin, ToKN},
			{"N_max", e.NMax, ToKN}, {"N_min", e.NMin, ToKN}, {"w_max", e.WMax, 1}, {"w_min", e.WMin, 1}} {
			js.array(sr.key, len(sr.ex), func(b []byte, i int) []byte { return appendNum(b, sr.ex[i].Value*sr.f) })
		}
		// a map in encoding/json: its keys sorted
		js.field("governing")
		js.open('{')
		for _, sr := range []struct {
			key string
			ex  []beam.Extreme
		}{{"M_max", e.MMax}, {"M_min", e.MMin}, {"V_max", e.VMax}, {"V_min", e.VMin}} {
			js.array(sr.key, len(sr.ex), func(b []byte, i int) []byte { return append(b, names.json(sr.ex[i])...) })
		}
		js.close('}')
		js.value("reactions", reactionDocs(env, state.reactions))
		js.close('}')
	}
	js.value("member", member)
	js.value("deflection", deflection)
	js.close('}')
	js.raw("\n")
	return js.flush()
}

// reactionDocs are the reaction envelopes of one limit state.
func reactionDocs(env *beam.Envelopes, re []beam.ReactionEnvelope) []reactionEnvDoc {
	var out []reactionEnvDoc
	for _, r := range re {
		out = append(out, reactionEnvDoc{
			X: Num(r.X * ToM), FzMax: Num(r.FzMax.Value * ToKN), FzMin: Num(r.FzMin.Value * ToKN),
			FxMax: Num(r.FxMax.Value * ToKN), FxMin: Num(r.FxMin.Value * ToKN),
			MyMax: Num(r.MyMax.Value * ToKNm), MyMin: Num(r.MyMin.Value * ToKNm),
			FzMaxGov: env.Governing(r.FzMax), FzMinGov: env.Governing(r.FzMin),
		})
	}
	return out
}

// appendNum appends a number as Num encodes it.
func appendNum(b []byte, v float64) []byte { return strconv.AppendFloat(b, Round(v), 'f', -1, 64) }

// governingNames names the extremes of envelopes (Envelopes.Governing) once for each
// combination and pattern, as text and as a JSON string.
type governingNames struct {
	env   *beam.Envelopes
	names map[[2]int32][2]string
}

func newGoverning(env *beam.Envelopes) *governingNames {
	return &governingNames{env: env, names: map[[2]int32][2]string{}}
}

func (g *governingNames) both(ex beam.Extreme) [2]string {
	k := [2]int32{ex.Combination, ex.Pattern}
	n, ok := g.names[k]
	if !ok {
		text := g.env.Governing(ex)
		js, err := json.Marshal(text)
		if err != nil {
			panic("encode: a string that does not marshal: " + err.Error())
		}
		n = [2]string{text, string(js)}
		g.names[k] = n
	}
	return n
}

func (g *governingNames) text(ex beam.Extreme) string { return g.both(ex)[0] }
func (g *governingNames) json(ex beam.Extreme) string { return g.both(ex)[1] }

// jsonStream writes an indented JSON document (as WriteJSON: two spaces a level) in parts:
// objects field by field, long arrays element by element; a value of another kind through
// encoding/json at its place. The first error stops the writing and is kept for flush.
type jsonStream struct {
	w     *bufio.Writer
	buf   []byte
	depth int
	first bool // the next field or element is its object's or array's first
	err   error
}

func newJSONStream(w io.Writer) *jsonStream { return &jsonStream{w: bufio.NewWriterSize(w, 1<<16)} }

func (js *jsonStream) raw(s string) {
	if js.err == nil {
		_, js.err = js.w.WriteString(s)
	}
}

func (js *jsonStream) bytes(b []byte) {
	if js.err == nil {
		_, js.err = js.w.Write(b)
	}
}

func (js *jsonStream) newline() {
	js.raw("\n")
	for range js.depth {
		js.raw("  ")
	}
}

func (js *jsonStream) open(c byte) {
	js.raw(string(c))
	js.depth++
	js.first = true
}

func (js *jsonStream) close(c byte) {
	js.depth--
	if !js.first {
		js.newline()
	}
	js.raw(string(c))
	js.first = false
}

// next starts a field or element: after a comma unless it is the first, on its own line.
func (js *jsonStream) next() {
	if !js.first {
		js.raw(",")
	}
	js.first = false
	js.newline()
}

// field starts a field of an object: its key (letters, digits and _: nothing to escape); its
// value follows.
func (js *jsonStream) field(key string) {
	js.next()
	js.raw(`"`)
	js.raw(key)
	js.raw(`": `)
}

// value writes a field whose value encoding/json indents at this depth.
func (js *jsonStream) value(key string, v any) {
	js.field(key)
	b, err := json.MarshalIndent(v, strings.Repeat("  ", js.depth), "  ")
	if err != nil && js.err == nil {
		js.err = err
	}
	js.bytes(b)
}

// array writes a field whose value is an array of n elements, each appended by elem.
func (js *jsonStream) array(key string, n int, elem func(b []byte, i int) []byte) {
	js.field(key)
	js.open('[')
	for i := range n {
		js.next()
		js.buf = elem(js.buf[:0], i)
		js.bytes(js.buf)
	}
	js.close(']')
}

func (js *jsonStream) flush() error {
	if js.err != nil {
		return js.err
	}
	return js.w.Flush()
}

func writeEnvelopeText(w io.Writer, s *optimise.Setup, env *beam.Envelopes, m *optimise.MemberChecks) {
	writeBeamHeader(w, s, "beam analysis, ULS and SLS envelopes")
	st := env.Stations
	u, l := &env.ULS, &env.SLS
	fmt.Fprintln(w, "ULS envelope")
	writeRightRows(w, []string{"x [m]", "", "M max [kNm]", "M min [kNm]", "V max [kN]", "V min [kN]", "N max [kN]", "N min [kN]"},
		len(st), func(i int, c [][]byte) {
			c[0] = strconv.AppendFloat(c[0], st[i].X*ToM, 'f', 3, 64)
			c[1] = append(c[1], sideMark(st, i)...)
			for j, v := range []float64{u.MMax[i].Value * ToKNm, u.MMin[i].Value * ToKNm, u.VMax[i].Value * ToKN,
				u.VMin[i].Value * ToKN, u.NMax[i].Value * ToKN, u.NMin[i].Value * ToKN} {
				c[2+j] = appendClean(c[2+j], v, 1)
			}
		})
	fmt.Fprintf(w, "\nSLS envelope (%s)\n", s.Rules.SLS)
	writeRightRows(w, []string{"x [m]", "", "M max [kNm]", "M min [kNm]", "w max [mm]", "w min [mm]"},
		len(st), func(i int, c [][]byte) {
			c[0] = strconv.AppendFloat(c[0], st[i].X*ToM, 'f', 3, 64)
			c[1] = append(c[1], sideMark(st, i)...)
			c[2] = appendClean(c[2], l.MMax[i].Value*ToKNm, 1)
			c[3] = appendClean(c[3], l.MMin[i].Value*ToKNm, 1)
			c[4] = appendClean(c[4], l.WMax[i].Value, 2)
			c[5] = appendClean(c[5], l.WMin[i].Value, 2)
		})
	fmt.Fprintln(w, "\nSupport reactions [kN]")
	tw := Table(w)
	fmt.Fprintln(tw, "x [m]\tULS Fz max\tULS Fz min\tSLS Fz max\tSLS Fz min\tgoverning ULS max")
	for i, r := range env.ULSReactions {
		sr := env.SLSReactions[i]
		fmt.Fprintf(tw, "%.3f\t%.1f\t%.1f\t%.1f\t%.1f\t%s\n", r.X*ToM, Clean(r.FzMax.Value*ToKN), Clean(r.FzMin.Value*ToKN),
			Clean(sr.FzMax.Value*ToKN), Clean(sr.FzMin.Value*ToKN), env.Governing(r.FzMax))
	}
	tw.Flush()
	if len(env.ULSReactions) > 0 {
		fmt.Fprintln(w, ReactionsNote)
	}
	fmt.Fprintln(w, "\nExtremes and what governs them")
	tw = Table(w)
	extreme := func(label string, ex []beam.Extreme, f float64, unit string, seekMax bool) {
		if len(ex) == 0 {
			return
		}
		best := 0
		for i := range ex {
			if (seekMax && ex[i].Value > ex[best].Value) || (!seekMax && ex[i].Value < ex[best].Value) {
				best = i
			}
		}
		fmt.Fprintf(tw, "%s\t%+.1f %s\tat x = %.3f m\t%s\n", label, Clean(ex[best].Value*f), unit, st[best].X*ToM, env.Governing(ex[best]))
	}
	extreme("ULS M max (sagging)", u.MMax, ToKNm, "kNm", true)
	extreme("ULS M min (hogging)", u.MMin, ToKNm, "kNm", false)
	extreme("ULS V max", u.VMax, ToKN, "kN", true)
	extreme("ULS V min", u.VMin, ToKN, "kN", false)
	extreme("SLS w max (down)", l.WMax, 1, "mm", true)
	extreme("SLS w min (up)", l.WMin, 1, "mm", false)
	tw.Flush()
	if m != nil {
		writeMemberText(w, m)
	}
	fmt.Fprintf(w, "\n%s\n", Caution)
}

// writeRightRows writes a table as a RightTable with every cell ended by a tab would — each
// cell aligned on the right in a column as wide as its widest cell (in runes) and two spaces,
// no trailing spaces — without holding it: it formats each row twice, once to measure the
// columns and once to write it. row appends the cells of row i to c (given empty).
func writeRightRows(w io.Writer, header []string, rows int, row func(i int, c [][]byte)) {
	cells := make([][]byte, len(header))
	fill := func(i int) {
		for j := range cells {
			cells[j] = cells[j][:0]
		}
		if i < 0 {
			for j, h := range header {
				cells[j] = append(cells[j], h...)
			}
			return
		}
		row(i, cells)
	}
	widths := make([]int, len(header))
	for i := -1; i < rows; i++ {
		fill(i)
		for j, c := range cells {
			widths[j] = max(widths[j], utf8.RuneCount(c)+2)
		}
	}
	var line []byte
	for i := -1; i < rows; i++ {
		fill(i)
		line = line[:0]
		for j, c := range cells {
			for range widths[j] - utf8.RuneCount(c) {
				line = append(line, ' ')
			}
			line = append(line, c...)
		}
		line = append(bytes.TrimRight(line, " "), '\n')
		if _, err := w.Write(line); err != nil {
			return // the writer keeps the error (writeEnvelopes flushes a bufio.Writer)
		}
	}
}

// appendClean appends v with prec decimals as the f verb prints Clean(v): never "-0.0".
func appendClean(b []byte, v float64, prec int) []byte {
	start := len(b)
	b = strconv.AppendFloat(b, v, 'f', prec, 64)
	if len(bytes.Trim(b[start:], "-0.")) == 0 && b[start] == '-' {
		b = append(b[:start], b[start+1:]...)
	}
	return b
}
