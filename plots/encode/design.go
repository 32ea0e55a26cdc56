package encode

import (
	"fmt"
	"io"
	"math"
	"strconv"

	"spanbreak/optimise"
	"spanbreak/splice"
)

// WriteDesign writes a splice's calculation as "json" or as the text sheet.
func WriteDesign(w io.Writer, format string, o *optimise.DesignOutcome) error {
	if format == "json" {
		return WriteJSON(w, Design(o))
	}
	return writeDesignText(TextWriter(w), o, o.Result, o.SpliceFile)
}

// --- JSON (DESIGN.md section 7) -----------------------------------------------------------

// DesignDoc is the JSON document of design.
type DesignDoc struct {
	Version     string      `json:"version"`
	Input       string      `json:"input"`
	Position    *Num        `json:"position"`
	Section     string      `json:"section"`
	Grade       string      `json:"grade"`
	PlateGrade  string      `json:"plate_grade"`
	Status      string      `json:"status"`
	Pass        bool        `json:"pass"`
	Forces      ForcesDoc   `json:"forces"`
	Splice      SpliceDoc   `json:"splice"`
	Checks      []CheckDoc  `json:"checks"`
	Utilisation Num         `json:"utilisation"`
	Governing   string      `json:"governing"`
	Quantities  quantityDoc `json:"quantities"`
	Cost        spliceCost  `json:"cost"`
	// Assemblies are the bolting assemblies of the flange and web bolt groups; Materials the
	// splice's bill of materials.
	Assemblies []AssemblyDoc `json:"assemblies"`
	Materials  MaterialsDoc  `json:"materials"`
	Beam       sectionDoc    `json:"beam"`
	Member     *MemberDoc    `json:"member"`
	Notes      []string      `json:"notes"`
	KeepOut    *KeepOutDoc   `json:"keep_out"`
	Caution    string        `json:"caution"`
}

// KeepOutDoc is the keep-out zone a designed position lies in (from and to in m).
type KeepOutDoc struct {
	Reason string `json:"reason"`
	Key    string `json:"key"`
	From   Num    `json:"from"`
	To     Num    `json:"to"`
}

// keepOutDoc is the shape of a zone; nil for none.
func keepOutDoc(z *optimise.Zone) *KeepOutDoc {
	if z == nil {
		return nil
	}
	return &KeepOutDoc{Reason: z.Reason, Key: z.Key, From: Num(z.From * ToM), To: Num(z.To * ToM)}
}

// ForcesDoc are a splice's design forces (kNm, kN; V is the largest |V|).
type ForcesDoc struct {
	ULS       ForceSetDoc   `json:"uls"`
	SLS       *ForceSetDoc  `json:"sls"`
	Governing *governingDoc `json:"governing,omitempty"` // the combination and pattern of each force
}

// governingDoc names the combination and pattern of each design force of both states.
type governingDoc struct {
	ULS OriginDoc  `json:"uls"`
	SLS *OriginDoc `json:"sls"`
}

// ForceSetDoc is one limit state's design forces.
type ForceSetDoc struct {
	MMax Num `json:"M_max"`
	MMin Num `json:"M_min"`
	V    Num `json:"V"`
	NMax Num `json:"N_max"`
	NMin Num `json:"N_min"`
}

// OriginDoc names the combination and span pattern of each design force.
type OriginDoc struct {
	MMax string `json:"M_max"`
	MMin string `json:"M_min"`
	V    string `json:"V"`
	NMax string `json:"N_max"`
	NMin string `json:"N_min"`
}

func originDoc(o optimise.ForceOrigins) OriginDoc {
	return OriginDoc{MMax: o.MMax, MMin: o.MMin, V: o.V, NMax: o.NMax, NMin: o.NMin}
}

// beamDoc is the shape of the beam's cross-section check at a splice.
func beamDoc(c optimise.SectionCheck) sectionDoc {
	r := c.Result
	d := sectionDoc{Class: r.Class.Class.String(), McRd: Num(r.McRd * ToKNm), VcRd: Num(r.VcRd * ToKN), Utilisation: Num(r.Utilisation),
		Pairing: c.Pairing, Checks: sectionChecks(r)}
	if r.Governing >= 0 && r.Governing < len(r.Checks) {
		d.Check = "member." + r.Checks[r.Governing].ID
	}
	return d
}

// SpliceDoc is a splice in the keys and units (mm) of the splice file, so that it can be
// saved and checked again; it is the one shape of a splice in every document. The bolt's
// threads_in_shear_plane is there only where a rule assumes the thread (true) or the shank
// (false) in every plane: absent, as in the splice file, each plane follows from the bolt
// length of its group; system only where one was chosen.
type SpliceDoc struct {
	Bolt struct {
		Size    string `json:"size"`
		Class   string `json:"class"`
		Threads *bool  `json:"threads_in_shear_plane,omitempty"`
		System  string `json:"system,omitempty"`
	} `json:"bolt"`
	Category      string        `json:"category"`
	FrictionClass string        `json:"friction_class,omitempty"`
	Holes         string        `json:"holes"`
	Gap           Num           `json:"gap"`
	Flange        spliceFlange  `json:"flange"`
	Web           spliceWebPart `json:"web"`
}

type splicePlate struct {
	Thickness Num `json:"thickness"`
	Width     Num `json:"width"`
}

type spliceFlange struct {
	Outer   splicePlate  `json:"outer"`
	Inner   *splicePlate `json:"inner,omitempty"`
	Columns int          `json:"columns"`
	Rows    int          `json:"rows"`
	Gauge   Num          `json:"gauge"`
	Pitch   *Num         `json:"pitch,omitempty"`
	End     Num          `json:"end"`
	Edge    Num          `json:"edge"`
}

type spliceWebPart struct {
	Thickness Num  `json:"thickness"`
	Depth     Num  `json:"depth"`
	Columns   int  `json:"columns"`
	Rows      int  `json:"rows"`
	Pitch     *Num `json:"pitch,omitempty"`
	Spacing   *Num `json:"spacing,omitempty"`
	End       Num  `json:"end"`
	Edge      Num  `json:"edge"`
}

// CheckDoc is one check of a splice: the one shape of a check in every document. Demand and
// resistance are in the check's unit.
type CheckDoc struct {
	ID          string `json:"id"`
	Clause      string `json:"clause"`
	State       string `json:"state"`
	Demand      Num    `json:"demand"`
	Resistance  Num    `json:"resistance"`
	Unit        string `json:"unit"`
	Utilisation Num    `json:"utilisation"`
	Pass        bool   `json:"pass"`
	Formula     string `json:"formula"`
	Substituted string `json:"substituted"`
	Note        string `json:"note,omitempty"`
	// Impossible says why the check could not be made (a bolt off its part); utilisation
	// then holds the cap, splice.UtilisationCap, not a ratio.
	Impossible string `json:"impossible,omitempty"`
}

type quantityDoc struct {
	Bolts       int `json:"bolts"`
	Holes       int `json:"holes"`
	PlateMassKg Num `json:"plate_mass_kg"`
	BoltMassKg  Num `json:"bolt_mass_kg"`
	FayingM2    Num `json:"faying_area_m2"`
}

type spliceCost struct {
	Bolts  Num `json:"bolts"`
	Holes  Num `json:"holes"`
	Plates Num `json:"plates"`
	Faying Num `json:"faying"`
	Splice Num `json:"splice"`
	Total  Num `json:"total"`
}

func forceSetDoc(f splice.Forces) ForceSetDoc {
	return ForceSetDoc{MMax: Num(f.MMax * ToKNm), MMin: Num(f.MMin * ToKNm), V: Num(math.Abs(f.V) * ToKN),
		NMax: Num(f.NMax * ToKN), NMin: Num(f.NMin * ToKN)}
}

// Splice is the shape of a splice geometry.
func Splice(g splice.Geometry) SpliceDoc {
	var s SpliceDoc
	s.Bolt.Size, s.Bolt.Class, s.Bolt.System = g.Bolt.Size, g.Bolt.Class, string(g.Bolt.System)
	switch g.Bolt.ShearPlanes {
	case splice.PlanesInThread:
		s.Bolt.Threads = ptr(true)
	case splice.PlanesOnShank:
		s.Bolt.Threads = ptr(false)
	}
	s.Category, s.Holes, s.Gap = string(g.Category), string(g.Holes), Num(g.Gap)
	if s.Holes == "" {
		s.Holes = string(splice.NormalHoles)
	}
	if g.Category.Preloaded() {
		s.FrictionClass = string(g.FrictionClass)
	}
	f := g.Flange
	s.Flange = spliceFlange{Outer: splicePlate{Num(f.Outer.Thickness), Num(f.Outer.Width)}, Columns: f.Columns, Rows: f.Rows,
		Gauge: Num(f.Gauge), End: Num(f.End), Edge: Num(f.Edge)}
	if f.HasInner() {
		s.Flange.Inner = &splicePlate{Num(f.Inner.Thickness), Num(f.Inner.Width)}
	}
	if f.Rows > 1 {
		s.Flange.Pitch = NumPtr(f.Pitch)
	}
	w := g.Web
	s.Web = spliceWebPart{Thickness: Num(w.Thickness), Depth: Num(w.Depth), Columns: w.Columns, Rows: w.Rows, End: Num(w.End), Edge: Num(w.Edge)}
	if w.Rows > 1 {
		s.Web.Pitch = NumPtr(w.Pitch)
	}
	if w.Columns > 1 {
		s.Web.Spacing = NumPtr(w.Spacing)
	}
	return s
}

// Checks is the shape of a splice's checks, in the sheet's order.
func Checks(cs []splice.Check) []CheckDoc {
	out := make([]CheckDoc, len(cs))
	for i, c := range cs {
		out[i] = CheckDoc{ID: c.ID, Clause: c.Clause, State: c.State, Demand: Num(c.Demand), Resistance: Num(c.Resistance),
			Unit: c.Unit, Utilisation: Num(c.Utilisation), Pass: c.Pass, Formula: c.Formula, Substituted: c.Substituted, Note: c.Note,
			Impossible: c.Impossible}
	}
	return out
}

// UtilisationText is a check's utilisation as the text outputs print it, "utilisation
// 0.812", or "not possible: " and the reason when the geometry cannot exist (the utilisation
// then holds a placeholder, splice.UtilisationCap).
func UtilisationText(c splice.Check) string {
	if c.Impossible != "" {
		return "not possible: " + c.Impossible
	}
	return fmt.Sprintf("utilisation %.3f", c.Utilisation)
}

// Design is the JSON document of a sized or checked splice.
func Design(dc *optimise.DesignOutcome) DesignDoc {
	r := dc.Result
	out := DesignDoc{
		Version: Version(), Input: dc.Input, Section: dc.Section, Grade: dc.Grade, PlateGrade: dc.PlateGrade,
		Status: r.Status.String(), Pass: r.Pass,
		Forces:      forcesDoc(r, dc.Origins),
		Splice:      Splice(r.Geometry),
		Checks:      Checks(r.Checks),
		Utilisation: Num(r.Utilisation), Governing: r.Governing.ID,
		Quantities: quantityDoc{Bolts: r.Quantities.Bolts, Holes: r.Quantities.Holes,
			PlateMassKg: Num(r.Quantities.PlateMass), BoltMassKg: Num(r.Quantities.BoltMass), FayingM2: Num(r.Quantities.FayingArea)},
		Cost: spliceCost{Bolts: Num(r.Cost.Bolts), Holes: Num(r.Cost.Holes), Plates: Num(r.Cost.Plates),
			Faying: Num(r.Cost.Faying), Splice: Num(r.Cost.Splice), Total: Num(r.Cost.Total)},
		Notes: append([]string{}, r.Notes...), KeepOut: keepOutDoc(dc.KeepOut), Caution: Caution,
	}
	if dc.Position != nil {
		out.Position = NumPtr(*dc.Position)
	}
	out.Assemblies = Assemblies(r.Assemblies)
	out.Materials = Materials(r.Materials(dc.PlateGrade))
	out.Beam = beamDoc(dc.Beam)
	if dc.Member != nil {
		out.Member = ptr(Member(dc.Member))
	}
	return out
}

// --- text: the calculation sheet -----------------------------------------------------------

func writeDesignText(w io.Writer, dc *optimise.DesignOutcome, r splice.Result, spliceFile string) error {
	p, g, a := dc.Problem, r.Geometry, r.Actions
	m := p.Member
	fmt.Fprintf(w, "spanbreak %s: bolted cover-plate splice, EN 1993-1-8:2005 / EN 1993-1-1:2005\n", Version())
	fmt.Fprintf(w, "Input:     %s\n", Printable(dc.Input))
	if spliceFile != "" {
		fmt.Fprintf(w, "Splice:    %s (checked as given)\n", Printable(spliceFile))
	}
	if dc.Position != nil {
		fmt.Fprintf(w, "Position:  x = %.3f m\n", Clean(*dc.Position))
	}
	fmt.Fprintf(w, "Beam:      %s, %s (flange fy = %g, fu = %g N/mm²; web fy = %g, fu = %g N/mm², EN 1993-1-1 Table 3.1)\n",
		dc.Section, dc.Grade, m.FyFlange, m.FuFlange, m.FyWeb, m.FuWeb)
	s := m.Section
	fmt.Fprintf(w, "           h = %g, b = %g, tw = %g, tf = %g, r = %g mm; A = %.1f cm², Iy = %.0f cm⁴\n",
		s.H, s.B, s.Tw, s.Tf, s.R, s.A/1e2, s.Iy/1e4)
	fmt.Fprintf(w, "Plates:    %s\n", dc.PlateGrade)
	fmt.Fprintf(w, "Units:     forces kN, moments kNm (sagging +), axial force tension +, sizes mm\n\n")
	if z := dc.KeepOut; z != nil {
		where := "the position"
		if dc.Position != nil {
			where = fmt.Sprintf("x = %.3f m", Clean(*dc.Position))
		}
		fmt.Fprintf(w, "NOTE: %s is inside a keep-out zone, %.3f to %.3f m: %s (%s); optimise puts no splice here\n\n",
			where, Clean(z.From*ToM), Clean(z.To*ToM), z.Reason, z.Key)
	}

	fmt.Fprintf(w, "Design forces\n")
	fmt.Fprintf(w, "  ULS  M_max %+.1f, M_min %+.1f kNm; |V| %.1f kN; N_max %+.1f, N_min %+.1f kN\n",
		Clean(a.ULS.MMax/1e6), Clean(a.ULS.MMin/1e6), Clean(math.Abs(a.ULS.V)/1e3), Clean(a.ULS.NMax/1e3), Clean(a.ULS.NMin/1e3))
	if a.SLSGiven {
		fmt.Fprintf(w, "  SLS  M_max %+.1f, M_min %+.1f kNm; |V| %.1f kN; N_max %+.1f, N_min %+.1f kN\n",
			Clean(a.SLS.MMax/1e6), Clean(a.SLS.MMin/1e6), Clean(math.Abs(a.SLS.V)/1e3), Clean(a.SLS.NMax/1e3), Clean(a.SLS.NMin/1e3))
	} else {
		fmt.Fprintf(w, "  SLS  none given\n")
	}
	if o := dc.Origins; o != nil {
		writeOrigins(w, "ULS", o.ULS)
		if a.SLSGiven {
			writeOrigins(w, "SLS", o.SLS)
		}
	}
	fmt.Fprintf(w, "  States: M_max and M_min, each with the largest |V| and with N_max and N_min; both signs of M checked\n")
	if a.Distribution == splice.FlangesOnly {
		fmt.Fprintf(w, "  Distribution: flanges only (Mw = 0); web Nw = N·Aw/A = %.4f·N\n", a.AwOverA)
	} else {
		fmt.Fprintf(w, "  Distribution: proportional, Mw = M·Iw/Iy = %.4f·M, Nw = N·Aw/A = %.4f·N\n", a.IwOverIy, a.AwOverA)
	}
	fmt.Fprintf(w, "  Flange: Ff = (M − Mw)/(h − tf) ± (N − Nw)/2, h − tf = %g mm: Ft,Ed = %.1f kN (%s), Fc,Ed = %.1f kN (%s)",
		a.LeverArm, a.Flange.Tension/1e3, a.Flange.TensionState, a.Flange.Compression/1e3, a.Flange.CompressionState)
	if g.Category.Preloaded() {
		fmt.Fprintf(w, ", slip state %.1f kN", a.Flange.SlipBolt/1e3)
	}
	fmt.Fprintf(w, "\n  Web: |Mw| = %.2f kNm, |Nw| = %.1f kN, |V| = %.1f kN (%s)\n", a.Web.Moment/1e6, a.Web.Axial/1e3, a.Web.Shear/1e3, a.Web.State)
	if a.MinimumNote != "" {
		fmt.Fprintf(w, "  %s\n", a.MinimumNote)
	}

	writeBeamAtSplice(w, dc.Beam, dc.Member)

	fmt.Fprintf(w, "\nSplice (%s)\n", r.Status)
	threads := map[splice.ShearPlaneRule]string{splice.PlanesFromLength: "shear planes on thread or shank from the bolt lengths",
		splice.PlanesInThread: "thread assumed in every shear plane", splice.PlanesOnShank: "plain shank assumed in every shear plane"}[g.Bolt.ShearPlanes]
	cat := map[splice.Category]string{splice.CategoryA: "A (bearing)", splice.CategoryB: "B (slip-resistant at SLS)", splice.CategoryC: "C (slip-resistant at ULS)"}[g.Category]
	fmt.Fprintf(w, "  Bolts:  %s %s, %s; category %s", g.Bolt.Size, g.Bolt.Class, threads, cat)
	if g.Category.Preloaded() {
		fmt.Fprintf(w, ", friction class %s", g.FrictionClass)
	}
	holes := string(g.Holes)
	if holes == "" {
		holes = string(splice.NormalHoles)
	}
	fmt.Fprintf(w, "; %s holes; gap %g mm\n", holes, g.Gap)
	f := g.Flange
	fmt.Fprintf(w, "  Flange: outer plate %g × %g", f.Outer.Thickness, f.Outer.Width)
	if f.HasInner() {
		fmt.Fprintf(w, ", 2 inner plates %g × %g", f.Inner.Thickness, f.Inner.Width)
	}
	fmt.Fprintf(w, ", %.0f long; %d lines × %d rows each side; gauge %g", r.Quantities.FlangePlateLength, f.Columns, f.Rows, f.Gauge)
	if f.Rows > 1 {
		fmt.Fprintf(w, ", pitch %g", f.Pitch)
	}
	fmt.Fprintf(w, ", end %g, edge %g\n", f.End, f.Edge)
	wb := g.Web
	fmt.Fprintf(w, "  Web:    2 plates %g × %g, %.0f long; %d columns × %d rows each side", wb.Thickness, wb.Depth, r.Quantities.WebPlateLength, wb.Columns, wb.Rows)
	if wb.Rows > 1 {
		fmt.Fprintf(w, "; pitch %g", wb.Pitch)
	}
	if wb.Columns > 1 {
		fmt.Fprintf(w, ", spacing %g", wb.Spacing)
	}
	fmt.Fprintf(w, ", end %g, edge %g\n", wb.End, wb.Edge)
	wg := r.WebGroup
	fmt.Fprintf(w, "  Web bolt group: e = %g mm, Mg = |Mw| + |V|·e = %.2f kNm, Ip = %.0f mm²\n", wg.Eccentricity, wg.Moment/1e6, wg.PolarMoment)
	if len(wg.Bolts) > 0 {
		tw := RightTable(w)
		fmt.Fprintf(tw, "    column\trow\tx mm\tz mm\tH kN\tV kN\tR kN\t\n")
		for _, b := range wg.Bolts {
			fmt.Fprintf(tw, "    %d\t%d\t%.1f\t%.1f\t%.1f\t%.1f\t%.1f\t\n", b.Column, b.Row, Clean(b.X), Clean(b.Z), Clean(b.H/1e3), Clean(b.V/1e3), Clean(b.R/1e3))
		}
		if err := tw.Flush(); err != nil {
			return err
		}
		fmt.Fprintf(w, "    (column 1 is nearest the joint; each component taken with its adverse sign)\n")
	}
	if err := writeAssembliesText(w, r.Assemblies); err != nil {
		return err
	}

	fmt.Fprintf(w, "\nChecks\n")
	for i, c := range r.Checks {
		mark := "pass"
		if !c.Pass {
			mark = "FAIL"
		}
		fmt.Fprintf(w, "%3d. %s — %s [%s]\n", i+1, c.ID, c.Clause, c.State)
		if c.Formula != "" {
			fmt.Fprintf(w, "     %s\n", c.Formula)
		}
		if c.Substituted != "" {
			fmt.Fprintf(w, "     %s\n", c.Substituted)
		}
		fmt.Fprintf(w, "     %s %s ≤ %s %s: %s, %s\n", designNumber(c.Demand), c.Unit, designNumber(c.Resistance), c.Unit, UtilisationText(c), mark)
		if c.Note != "" {
			fmt.Fprintf(w, "     note: %s\n", c.Note)
		}
	}

	gv := r.Governing
	governing := fmt.Sprintf("utilisation %.3f", r.Utilisation)
	if gv.Impossible != "" {
		governing = UtilisationText(gv)
	}
	fmt.Fprintf(w, "\nGoverning: %s (%s), %s — ", gv.ID, gv.Clause, governing)
	switch {
	case r.Pass:
		fmt.Fprintf(w, "every check passes\n")
	case r.Status == splice.NoFeasible:
		fmt.Fprintf(w, "NO SPLICE IN THE DESIGN SPACE PASSES; this is the best attempt\n")
	default:
		fmt.Fprintf(w, "THE SPLICE FAILS\n")
	}
	q := r.Quantities
	fmt.Fprintf(w, "Quantities: %d bolts (%d flange, %d web), %d holes, %.1f kg of plate (flanges %.1f, web %.1f), %.1f kg of bolt assemblies, %.2f m² of faying surface\n",
		q.Bolts, q.FlangeBolts, q.WebBolts, q.Holes, q.PlateMass, q.FlangePlateMass, q.WebPlateMass, q.BoltMass, q.FayingArea)
	if err := writeMaterialsText(w, r.Materials(dc.PlateGrade)); err != nil {
		return err
	}
	c := r.Cost
	rates := "indicative rates, for ranking only"
	if !dc.Indicative {
		rates = "job rates"
	}
	fmt.Fprintf(w, "Cost (%s): bolts %.2f, holes %.2f, plates %.2f", rates, c.Bolts, c.Holes, c.Plates)
	if g.Category.Preloaded() {
		fmt.Fprintf(w, ", faying surfaces %.2f", c.Faying)
	}
	fmt.Fprintf(w, ", splice %.2f; total %.2f\n", c.Splice, c.Total)
	for _, n := range r.Notes {
		fmt.Fprintf(w, "Note: %s\n", n)
	}
	fmt.Fprintf(w, "Partial factors: EN 1993-1-8 Table 2.1 and EN 1993-1-1 6.1 recommended values unless set; a National Annex may differ.\n")
	fmt.Fprintf(w, "\n%s\n", Caution)
	return nil
}

// designNumber prints a check value at a precision fit for its size.
func designNumber(v float64) string {
	a := math.Abs(v)
	switch {
	case a >= 100:
		return strconv.FormatFloat(v, 'f', 1, 64)
	case a >= 1:
		return strconv.FormatFloat(v, 'f', 2, 64)
	default:
		return strconv.FormatFloat(v, 'f', 3, 64)
	}
}

// writeOrigins names the combination and pattern of each design force of one state.
func writeOrigins(w io.Writer, state string, o optimise.ForceOrigins) {
	fmt.Fprintf(w, "  %s combinations and patterns:\n", state)
	for _, r := range [][2]string{{"M_max", o.MMax}, {"M_min", o.MMin}, {"|V|", o.V}, {"N_max", o.NMax}, {"N_min", o.NMin}} {
		fmt.Fprintf(w, "    %-6s %s\n", r[0], r[1])
	}
}

// writeBeamAtSplice prints the beam's own cross-section check under the splice's design
// forces, and the member's warnings and summary where the whole beam was checked.
func writeBeamAtSplice(w io.Writer, c optimise.SectionCheck, m *optimise.MemberChecks) {
	fmt.Fprintf(w, "\nThe beam at this position (EN 1993-1-1 6.2, Table 5.2)\n")
	if c.Scope != nil {
		fmt.Fprintf(w, "  outside scope: %v\n", c.Scope)
	} else {
		r := c.Result
		verdict := "passes"
		if r.Utilisation > 1 {
			verdict = "FAILS: the splice is designed for forces the beam itself cannot carry"
		}
		fmt.Fprintf(w, "  %s (flange c/t %.2f, web c/t %.2f): Mc,Rd = %.1f kNm, Vc,Rd = %.1f kN; %s %.3f under %s, %s\n",
			r.Class.Class, r.Class.Flange.Ratio, r.Class.Web.Ratio, r.McRd*ToKNm, r.VcRd*ToKN, r.Checks[r.Governing].ID,
			r.Utilisation, c.Pairing, verdict)
	}
	if m != nil {
		for _, s := range m.Warnings() {
			fmt.Fprintf(w, "  WARNING: %s\n", s)
		}
		fmt.Fprintf(w, "  whole beam: %s\n", MemberLine(m))
		fmt.Fprintf(w, "  Note: %s\n", optimise.LTBCaution)
	}
}

// forcesDoc is the shape of a splice's design forces, with their origins when known.
func forcesDoc(r splice.Result, o *optimise.PositionOrigins) ForcesDoc {
	out := ForcesDoc{ULS: forceSetDoc(r.Actions.ULS)}
	if r.Actions.SLSGiven {
		out.SLS = ptr(forceSetDoc(r.Actions.SLS))
	}
	if o != nil {
		out.Governing = &governingDoc{ULS: originDoc(o.ULS)}
		if out.SLS != nil {
			out.Governing.SLS = ptr(originDoc(o.SLS))
		}
	}
	return out
}
