package encode

import (
	"fmt"
	"io"
	"math"
	"slices"
	"strconv"
	"strings"

	"spanbreak/beam"
	"spanbreak/optimise"
)

// WriteCheck writes what check understood of a job, as "json" or "text".
func WriteCheck(w io.Writer, format string, jc *optimise.JobCheck) error {
	sum, err := summarise(jc.Setup, jc.Analysis)
	if err != nil {
		return err
	}
	sum.Member, sum.Deflection = ptr(Member(&jc.Member)), Deflections(&jc.Member)
	if format == "json" {
		return WriteJSON(w, sum)
	}
	w = TextWriter(w)
	writeCheckText(w, sum)
	writeMemberText(w, &jc.Member)
	fmt.Fprintf(w, "\n%s\n", Caution)
	return nil
}

// JobSummary is what check understood from a job, in output units (m, mm, kN, kN/m, kg,
// N/mm²). It is the JSON output of check; the text output prints the same values.
type JobSummary struct {
	Input        string            `json:"input"`
	Version      string            `json:"version"`
	Valid        bool              `json:"valid"`
	Units        map[string]string `json:"units"`
	Title        string            `json:"title"`
	Section      checkSection      `json:"section"`
	Grade        checkGrade        `json:"grade"`
	Length       float64           `json:"length"`
	Spans        []float64         `json:"spans"`
	Overhang     [2]float64        `json:"overhang"` // left, right
	Supports     []checkSupport    `json:"supports"`
	Hinges       []float64         `json:"hinges"`
	SelfWeight   float64           `json:"self_weight"` // kN/m, 0 when off
	Cases        []JobCase         `json:"cases"`
	Combinations checkCombinations `json:"combinations"`
	Regions      []string          `json:"pattern_regions"`
	Limits       checkLimits       `json:"limits"`
	Vehicles     []JobVehicle      `json:"vehicles"`
	Splice       checkSplice       `json:"splice"`
	Costs        checkCosts        `json:"costs"`
	Scan         checkScan         `json:"scan"`
	Defaults     []string          `json:"defaults"` // key paths the file leaves out, which take their default
	Notes        []string          `json:"notes"`
	Member       *MemberDoc        `json:"member"`
	Deflection   []DeflectionDoc   `json:"deflection"`
	Forces       SourceDoc         `json:"forces"`
}

type checkSection struct {
	Name      string  `json:"name"`
	Series    string  `json:"series"`
	Source    string  `json:"source"`
	H         float64 `json:"h"`
	B         float64 `json:"b"`
	Tw        float64 `json:"tw"`
	Tf        float64 `json:"tf"`
	R         float64 `json:"r"`
	A         float64 `json:"A_cm2"`
	Iy        float64 `json:"Iy_cm4"`
	MassPerM  float64 `json:"mass_kg_per_m"`
	Catalogue bool    `json:"catalogue"`
	// WeldThroat is the throat a of a welded section's web-to-flange welds and WeldLeg their
	// leg √2·a [mm]; null for a rolled section or when the job gives none (welds ignored).
	WeldThroat *float64 `json:"weld_throat"`
	WeldLeg    *float64 `json:"weld_leg"`
}

type checkGrade struct {
	Name     string  `json:"name"`
	Standard string  `json:"standard"`
	Table    string  `json:"table"`
	FyFlange float64 `json:"fy_flange"`
	FuFlange float64 `json:"fu_flange"`
	FyWeb    float64 `json:"fy_web"`
	FuWeb    float64 `json:"fu_web"`
}

type checkSupport struct {
	X    float64  `json:"x"`
	Type string   `json:"type"`
	K    *float64 `json:"k"` // kN/m, springs only
}

type JobCase struct {
	Name      string      `json:"name"`
	Kind      string      `json:"kind"`
	Category  string      `json:"category"`
	Psi       *[3]float64 `json:"psi"`        // ψ0, ψ1, ψ2 used; null for permanent cases
	PsiSource string      `json:"psi_source"` // "job file", "EN 1990 Table A1.1" or ""
	Pattern   bool        `json:"pattern"`
	Loads     int         `json:"loads"`
	TotalDown float64     `json:"total_down"` // kN, the sum of the transverse loads, downward +
	SelfW     bool        `json:"self_weight"`
}

type checkCombinations struct {
	Rules     string   `json:"rules"`
	ULS       string   `json:"uls"`
	SLS       string   `json:"sls"`
	GammaGSup float64  `json:"gamma_G_sup"`
	GammaGInf float64  `json:"gamma_G_inf"`
	GammaQ    float64  `json:"gamma_Q"`
	Xi        float64  `json:"xi"`
	ULSCount  int      `json:"uls_count"`
	SLSCount  int      `json:"sls_count"`
	UserCount int      `json:"user_count"` // of the above, from combinations.extra
	Names     []string `json:"names"`

	// RoofImposedSeparate is combinations.roof_imposed_separate as used; RoofImposedApplied
	// says the rule changed the generated combinations (there are roof imposed and snow or
	// wind cases); RoofImposedRule names the rule where both groups are present, else "".
	RoofImposedSeparate bool   `json:"roof_imposed_separate"`
	RoofImposedApplied  bool   `json:"roof_imposed_applied"`
	RoofImposedRule     string `json:"roof_imposed_rule"`
}

type checkLimits struct {
	MaxPieceLength *float64     `json:"max_piece_length"` // null: no limit
	MinPieceLength float64      `json:"min_piece_length"`
	MaxPieceMass   *float64     `json:"max_piece_mass"` // null: no limit
	KeepSupports   float64      `json:"keep_out_supports"`
	KeepPointLoads float64      `json:"keep_out_point_loads"`
	KeepRanges     [][2]float64 `json:"keep_out_ranges"`
	MinSplices     int          `json:"splices_min"`
	DeflectionSpan float64      `json:"deflection_span"`     // span/ratio
	DeflectionOver float64      `json:"deflection_overhang"` // overhang length/ratio
	MaxSplices     *int         `json:"splices_max"`         // null: no limit
}

type JobVehicle struct {
	Name      string  `json:"name"`
	MaxLength float64 `json:"max_length"`
	Payload   float64 `json:"payload"`
	Cost      float64 `json:"cost"`
}

type checkSplice struct {
	Category      string    `json:"category"`
	FrictionClass string    `json:"friction_class"` // "" for category A
	BoltSizes     []string  `json:"bolt_sizes"`
	BoltClasses   []string  `json:"bolt_classes"`
	PlateGrade    string    `json:"plate_grade"`
	Thicknesses   []float64 `json:"plate_thicknesses"`
	FlangePlates  []string  `json:"flange_plates"`
	Distribution  string    `json:"distribution"`
	Gap           float64   `json:"gap"`
	// BoltMinSize and BoltMaxSize bound the sizes ("" for no bound); BoltSizesTried are the
	// sizes of BoltSizes within them, which the sizing tries.
	BoltMinSize    string         `json:"bolt_min_size"`
	BoltMaxSize    string         `json:"bolt_max_size"`
	BoltSizesTried []string       `json:"bolt_sizes_tried"`
	Detailing      checkDetailing `json:"detailing"`
	// AssemblySystem is the bolting assembly system, "" for the default of the category and
	// class; ShearPlanes the rule that places the shear planes (length, thread or shank).
	AssemblySystem string `json:"assembly_system"`
	ShearPlanes    string `json:"shear_planes"`
}

// checkDetailing is what check understood of splice.detailing.
type checkDetailing struct {
	Gauge     *float64 `json:"gauge"`      // mm; null: the sizing chooses the gauge
	GaugeFrom string   `json:"gauge_from"` // the job key it came from; "" when the sizing chooses it
	// MinPlateToFlange is the ratio, MinPlate the least thickness ratio × tf of the outer plate
	// alone or of the outer and inner plates together [mm]; null when there is no such rule.
	MinPlateToFlange *float64 `json:"min_plate_to_flange"`
	MinPlate         *float64 `json:"min_plate_thickness"`
}

type checkCosts struct {
	Indicative      bool               `json:"indicative"` // no costs block: the splice package's invented rates
	Bolt            map[string]float64 `json:"bolt"`
	BoltClassFactor map[string]float64 `json:"bolt_class_factor"`
	PlatePerKg      float64            `json:"plate_per_kg"`
	Hole            float64            `json:"hole"`
	FayingPerM2     float64            `json:"faying_per_m2"`
	Splice          float64            `json:"splice"`
	Lift            float64            `json:"lift"`
	AssemblyPerKg   float64            `json:"assembly_per_kg"`
}

type checkScan struct {
	Step         float64 `json:"step"`
	Alternatives int     `json:"alternatives"`
}

var checkUnits = map[string]string{
	"x": "m", "length": "m", "spans": "m", "sizes": "mm", "A": "cm2", "Iy": "cm4",
	"strength": "N/mm2", "self_weight": "kN/m", "total_down": "kN", "k": "kN/m", "mass": "kg",
	"cost": "currency of the job",
}

// checkBuilder collects the values of the summary.
type checkBuilder struct {
	JobSummary
}

func summarise(st *optimise.Setup, an *beam.Analysis) (JobSummary, error) {
	s := &checkBuilder{}
	s.Defaults, s.Notes, s.Vehicles = append([]string{}, st.Defaults...), append([]string{}, st.Notes...), []JobVehicle{}
	s.Input, s.Version, s.Valid, s.Units, s.Title = st.File, Version(), true, checkUnits, st.Title
	if err := s.beam(st); err != nil {
		return JobSummary{}, err
	}
	s.cases(st)
	s.combinations(st)
	for _, r := range beam.ModelRegions(st.Model) {
		s.Regions = append(s.Regions, r.Name)
	}
	s.Regions = append([]string{}, s.Regions...)
	s.Forces = forcesSource(st)
	s.limits(st)
	for _, v := range st.Vehicles {
		s.Vehicles = append(s.Vehicles, JobVehicle{Name: v.Name, MaxLength: Round(v.MaxLength * ToM), Payload: Round(v.Payload), Cost: v.Cost})
	}
	s.splice(st)
	s.costs(st)
	s.Scan = checkScan{Step: Round(st.Step * ToM), Alternatives: st.Alternatives}
	return s.JobSummary, nil
}

func (s *checkBuilder) beam(st *optimise.Setup) error {
	sec := st.Section
	s.Section = checkSection{Name: sec.Name, Series: sec.Series, Source: sec.Source, H: sec.H, B: sec.B,
		Tw: sec.Tw, Tf: sec.Tf, R: sec.R, A: Round(sec.A / 1e2), Iy: Round(sec.Iy / 1e4),
		MassPerM: Round(sec.Mass), Catalogue: !sec.Welded()}
	if a := st.WeldThroat; a > 0 {
		s.Section.WeldThroat, s.Section.WeldLeg = ptr(Round(a)), ptr(Round(math.Sqrt2*a))
	}
	fyF, fuF, err := st.Grade.Strength(sec.Tf, st.GradeTable)
	if err != nil {
		return err
	}
	fyW, fuW, err := st.Grade.Strength(sec.Tw, st.GradeTable)
	if err != nil {
		return err
	}
	s.Grade = checkGrade{Name: st.Grade.Name, Standard: st.Grade.Standard, Table: st.GradeTable.String(),
		FyFlange: fyF, FuFlange: fuF, FyWeb: fyW, FuWeb: fuW}
	s.Length = Round(st.Model.Length * ToM)
	for _, sp := range st.Spans {
		s.Spans = append(s.Spans, Round(sp*ToM))
	}
	s.Overhang = [2]float64{Round(st.Overhang[0] * ToM), Round(st.Overhang[1] * ToM)}
	for _, sp := range st.Model.Supports {
		c := checkSupport{X: Round(sp.X * ToM), Type: sp.Kind.String()}
		if sp.Kind == beam.Spring {
			k := Round(sp.K) // N/mm = kN/m
			c.K = &k
		}
		s.Supports = append(s.Supports, c)
	}
	s.Hinges = []float64{}
	for _, h := range st.Model.Hinges {
		s.Hinges = append(s.Hinges, Round(h*ToM))
	}
	s.SelfWeight = Round(st.SelfWeight) // N/mm = kN/m
	return nil
}

func (s *checkBuilder) cases(st *optimise.Setup) {
	for i, c := range st.Cases {
		row := JobCase{Name: c.Name, Kind: c.Kind.String(), Category: c.Category, Pattern: c.Pattern,
			Loads: len(c.Loads), TotalDown: Round(totalDown(c) * ToKN), SelfW: i == 0 && st.SelfWeight > 0}
		if c.Kind.Variable() {
			switch {
			case c.Psi != nil:
				psi := *c.Psi
				row.Psi, row.PsiSource = &psi, "job file"
			default:
				if psi, err := beam.Psi(c.Kind, c.Category); err == nil {
					row.Psi, row.PsiSource = &psi, "EN 1990 Table A1.1"
				}
			}
		}
		s.Cases = append(s.Cases, row)
	}
}

// totalDown is the resultant of a case's transverse loads [N], positive downward.
func totalDown(c beam.Case) float64 {
	var f float64
	for _, l := range c.Loads {
		switch l.Kind {
		case beam.Distributed:
			f += (l.W1 + l.W2) / 2 * (l.X2 - l.X1)
		case beam.PointForce:
			f += l.P
		}
	}
	return f
}

func (s *checkBuilder) combinations(st *optimise.Setup) {
	r := st.Rules
	c := checkCombinations{Rules: r.Set, ULS: r.ULS, SLS: r.SLS, GammaGSup: r.GammaGSup, GammaGInf: r.GammaGInf,
		GammaQ: r.GammaQ, Xi: r.Xi, RoofImposedSeparate: !r.CombineRoofImposed,
		RoofImposedApplied: r.SeparatesRoofImposed(st.Cases)}
	rule := r
	rule.CombineRoofImposed = false // would the rule change anything for these cases?
	if rule.SeparatesRoofImposed(st.Cases) {
		c.RoofImposedRule = beam.RoofImposedClause
	}
	for _, cm := range st.Combinations {
		if cm.State == beam.ULS {
			c.ULSCount++
		} else {
			c.SLSCount++
		}
		if cm.Rule == beam.RuleUser {
			c.UserCount++
		}
		c.Names = append(c.Names, cm.Name)
	}
	s.Combinations = c
}

func (s *checkBuilder) limits(st *optimise.Setup) {
	l := st.Limits
	s.Limits = checkLimits{KeepRanges: [][2]float64{}, MinPieceLength: Round(l.MinLength * ToM),
		KeepSupports: Round(st.KeepOut.Supports * ToM), KeepPointLoads: Round(st.KeepOut.PointLoads * ToM),
		MinSplices: st.MinSplices, DeflectionSpan: st.Deflection.Span, DeflectionOver: st.Deflection.Overhang}
	if !math.IsInf(l.MaxLength, 1) {
		v := Round(l.MaxLength * ToM)
		s.Limits.MaxPieceLength = &v
	}
	if !math.IsInf(l.MaxMass, 1) {
		v := Round(l.MaxMass)
		s.Limits.MaxPieceMass = &v
	}
	for _, r := range st.KeepOut.Ranges {
		s.Limits.KeepRanges = append(s.Limits.KeepRanges, [2]float64{Round(r[0] * ToM), Round(r[1] * ToM)})
	}
	if st.MaxSplices >= 0 {
		v := st.MaxSplices
		s.Limits.MaxSplices = &v
	}
}

func (s *checkBuilder) splice(st *optimise.Setup) {
	sp := st.Splice
	z := sp.Sizing
	c := checkSplice{Category: string(z.Category), FrictionClass: string(z.FrictionClass),
		PlateGrade: st.PlateGrade, Distribution: string(sp.Distribution), Gap: z.Gap,
		BoltSizes: z.Space.Sizes, BoltClasses: z.Space.Classes, Thicknesses: z.Space.Thicknesses,
		AssemblySystem: string(z.System), ShearPlanes: z.ShearPlanes.String()}
	for _, a := range z.Space.Arrangements {
		c.FlangePlates = append(c.FlangePlates, string(a))
	}
	c.BoltMinSize, c.BoltMaxSize, c.BoltSizesTried = z.Space.MinSize, z.Space.MaxSize, append([]string{}, st.BoltSizes...)
	det := sp.Detailing
	if det.Gauge > 0 {
		c.Detailing.Gauge, c.Detailing.GaugeFrom = ptr(Round(det.Gauge)), st.GaugeKey
	}
	if k := det.MinPlateToFlange; k > 0 {
		c.Detailing.MinPlateToFlange, c.Detailing.MinPlate = ptr(k), ptr(Round(k*st.Section.Tf))
	}
	s.Splice = c
}

func (s *checkBuilder) costs(st *optimise.Setup) {
	r := st.Rates
	s.Costs = checkCosts{Indicative: !st.Costed, Bolt: r.Bolt, BoltClassFactor: r.BoltClassFactor,
		PlatePerKg: r.PlatePerKg, Hole: r.Hole, FayingPerM2: r.FayingPerM2, Splice: r.Splice, Lift: st.Lift, AssemblyPerKg: r.AssemblyPerKg}
}

// --- text ------------------------------------------------------------------------------

func writeCheckText(w io.Writer, s JobSummary) {
	dflt := make(map[string]bool, len(s.Defaults))
	for _, p := range s.Defaults {
		dflt[p] = true
	}
	mark := func(paths ...string) string {
		for _, p := range paths {
			if dflt[p] {
				return " (default)"
			}
		}
		return ""
	}
	what := "the beam analyses"
	if s.Forces.Mode == "imported" {
		what = "its forces table reads"
	}
	fmt.Fprintf(w, "spanbreak %s: check of %s: the job is valid and %s\n", s.Version, Printable(s.Input), what)
	if s.Title != "" {
		fmt.Fprintf(w, "Title:     %s\n", Printable(s.Title))
	}
	sec := s.Section
	kind := "catalogue, " + sec.Source
	switch {
	case sec.Catalogue:
	case sec.WeldThroat != nil:
		kind = fmt.Sprintf("welded from plates; web-to-flange welds a = %s mm, legs √2·a = %.1f mm", shortNum(*sec.WeldThroat), *sec.WeldLeg)
	default:
		kind = "welded from plates; web-to-flange welds ignored, no weld_throat" + mark("beam.section.welded.weld_throat")
	}
	fmt.Fprintf(w, "Section:   %s (%s): h %g, b %g, tw %g, tf %g, r %g mm; A %.1f cm², Iy %.0f cm⁴, %.1f kg/m\n",
		sec.Name, kind, sec.H, sec.B, sec.Tw, sec.Tf, sec.R, sec.A, sec.Iy, sec.MassPerM)
	g := s.Grade
	fmt.Fprintf(w, "Grade:     %s%s, %s; strengths from %s%s: fy %g, fu %g N/mm² at tf = %g mm; fy %g, fu %g N/mm² at tw = %g mm\n",
		g.Name, mark("beam.grade"), g.Standard, g.Table, mark("beam.grade_table"), g.FyFlange, g.FuFlange, sec.Tf, g.FyWeb, g.FuWeb, sec.Tw)
	fmt.Fprintf(w, "Length:    %s m\n", shortNum(s.Length))
	if len(s.Spans) == 0 {
		fmt.Fprintf(w, "Supports:  none of its own (beam.length): a member whose forces come from another analysis\n")
	} else {
		fmt.Fprintf(w, "Spans:     %s m\n", joinShortNums(s.Spans, ", "))
		fmt.Fprintf(w, "Overhangs: left %s m%s, right %s m%s\n", shortNum(s.Overhang[0]), mark("beam.overhang.left"),
			shortNum(s.Overhang[1]), mark("beam.overhang.right"))
		var sup []string
		for _, sp := range s.Supports {
			t := fmt.Sprintf("x = %s m %s", shortNum(sp.X), sp.Type)
			if sp.K != nil {
				t += fmt.Sprintf(" (k = %s kN/m)", shortNum(*sp.K))
			}
			sup = append(sup, t)
		}
		fmt.Fprintf(w, "Supports:  %s\n", strings.Join(sup, "; "))
		hinges := "none"
		if len(s.Hinges) > 0 {
			hinges = "x = " + joinShortNums(s.Hinges, ", ") + " m"
		}
		fmt.Fprintf(w, "Hinges:    %s%s\n", hinges, mark("beam.hinges"))
	}
	sw := "off"
	if s.SelfWeight > 0 {
		sw = fmt.Sprintf("on, %.3f kN/m as permanent case %s", s.SelfWeight, optimise.SelfWeightCase)
	}
	if s.Forces.Mode == "imported" {
		writeSource(w, s.Forces)
	} else {
		fmt.Fprintf(w, "Self weight: %s%s\n", sw, mark("beam.self_weight"))
		fmt.Fprintf(w, "Pattern regions: %s\n", strings.Join(s.Regions, ", "))
		writeLoads(w, s, mark)
	}
	writeCheckLimits(w, s, mark)
	sp := s.Splice
	fmt.Fprintln(w, "\nSplice options")
	fc := sp.FrictionClass
	if fc == "" {
		fc = "not used (category A)"
	}
	fmt.Fprintf(w, "  category %s%s, friction class %s, gap %g mm%s, distribution %s%s\n",
		sp.Category, mark("splice.category"), fc, sp.Gap, mark("splice.gap"), sp.Distribution, mark("splice.distribution"))
	fmt.Fprintf(w, "  bolts %s in classes %s%s\n", boltSizesText(sp, mark("splice.bolts.sizes")),
		strings.Join(sp.BoltClasses, ", "), mark("splice.bolts.classes"))
	fmt.Fprintf(w, "  plates %s%s, thicknesses %s mm%s; flange plates %s%s\n", sp.PlateGrade, mark("splice.plates.grade"),
		joinShortNums(sp.Thicknesses, ", "), mark("splice.plates.thicknesses"), strings.Join(sp.FlangePlates, ", "), mark("splice.flange_plates"))
	system := sp.AssemblySystem
	if system == "" {
		system = "HV for preloaded 10.9, HR for preloaded 8.8, ISO 4014 (ISO 4017 for short grips) otherwise"
	}
	fmt.Fprintf(w, "  bolt assemblies %s%s; shear planes %s%s\n", system, mark("splice.assemblies.system"),
		map[string]string{"length": "on thread or shank from the bolt length", "thread": "in the thread, assumed",
			"shank": "on the shank, assumed"}[sp.ShearPlanes], mark("splice.assemblies.shear_planes"))

	writeCheckDetailing(w, sp, s.Section, mark)
	writeCheckCosts(w, s.Costs, mark)
	fmt.Fprintf(w, "\nScan: candidates every %s m%s, %d alternative layouts%s\n", shortNum(s.Scan.Step), mark("scan.step"),
		s.Scan.Alternatives, mark("scan.alternatives"))
	if len(s.Notes) > 0 {
		fmt.Fprintln(w, "\nNotes")
		for _, n := range s.Notes {
			fmt.Fprintf(w, "  - %s\n", n)
		}
	}
}

// boltSizesText lists the bolt sizes tried and, where bounds filtered them, the list and the
// bounds: "M20, M22, M24 (of M16, M20, ... (default), within min_size M20 and max_size M24)".
func boltSizesText(sp checkSplice, mark string) string {
	var b []string
	if sp.BoltMinSize != "" {
		b = append(b, "min_size "+sp.BoltMinSize)
	}
	if sp.BoltMaxSize != "" {
		b = append(b, "max_size "+sp.BoltMaxSize)
	}
	if len(b) == 0 {
		return strings.Join(sp.BoltSizes, ", ") + mark
	}
	return strings.Join(sp.BoltSizesTried, ", ") + " (of " + strings.Join(sp.BoltSizes, ", ") + mark + ", within " + strings.Join(b, " and ") + ")"
}

// writeCheckDetailing prints the detailing preferences understood.
func writeCheckDetailing(w io.Writer, sp checkSplice, sec checkSection, mark func(...string) string) {
	d := sp.Detailing
	gauge := "chosen by the sizing" + mark("splice.detailing.gauge")
	if d.Gauge != nil {
		gauge = fmt.Sprintf("%s mm (%s; with 4 bolt lines between the two nearest the web)", shortNum(*d.Gauge), d.GaugeFrom)
	}
	plate := "of any listed thickness" + mark("splice.detailing.min_plate_to_flange")
	if d.MinPlateToFlange != nil {
		plate = fmt.Sprintf("at least %s × tf = %s × %s = %s mm (the outer plate, or outer and inner plates together)",
			shortNum(*d.MinPlateToFlange), shortNum(*d.MinPlateToFlange), shortNum(sec.Tf), shortNum(*d.MinPlate))
	}
	fmt.Fprintf(w, "  detailing: flange gauge %s; flange cover plates %s\n", gauge, plate)
}

// writeRoofRule names the rule on roof imposed loads where the job has roof imposed and snow
// or wind cases, saying whether it was applied.
func writeRoofRule(w io.Writer, cb checkCombinations, mark string) {
	switch {
	case cb.RoofImposedApplied:
		fmt.Fprintf(w, "Roof:      %s applied%s: the imposed load on the roof (category H) is not combined with snow or wind\n",
			cb.RoofImposedRule, mark)
	case cb.RoofImposedRule != "":
		fmt.Fprintf(w, "Roof:      %s not applied (roof_imposed_separate: false): "+
			"the imposed load on the roof (category H) is combined with snow and wind\n", cb.RoofImposedRule)
	}
}

func writeCheckLimits(w io.Writer, s JobSummary, mark func(...string) string) {
	l := s.Limits
	fmt.Fprintln(w, "\nLimits")
	limit := func(v *float64, unit string) string {
		if v == nil {
			return "no limit"
		}
		return shortNum(*v) + " " + unit
	}
	fmt.Fprintf(w, "  max piece length %s%s, min piece length %s m%s, max piece mass %s%s\n",
		limit(l.MaxPieceLength, "m"), mark("limits.max_piece_length"), shortNum(l.MinPieceLength), mark("limits.min_piece_length"),
		limit(l.MaxPieceMass, "kg"), mark("limits.max_piece_mass"))
	var ranges []string
	for _, r := range l.KeepRanges {
		ranges = append(ranges, shortNum(r[0])+" to "+shortNum(r[1])+" m")
	}
	if len(ranges) == 0 {
		ranges = []string{"none"}
	}
	fmt.Fprintf(w, "  keep out %s m each side of supports%s, %s m each side of point loads%s; ranges %s\n",
		shortNum(l.KeepSupports), mark("limits.keep_out.supports"), shortNum(l.KeepPointLoads), mark("limits.keep_out.point_loads"),
		strings.Join(ranges, ", "))
	maxS := "no limit"
	if l.MaxSplices != nil {
		maxS = strconv.Itoa(*l.MaxSplices)
	}
	fmt.Fprintf(w, "  splices from %d%s to %s%s\n", l.MinSplices, mark("limits.splices.min"), maxS, mark("limits.splices.max"))
	fmt.Fprintf(w, "  deflection span/%s%s, overhang/%s%s (SLS; common practice, the national annex and the client govern)\n",
		shortNum(l.DeflectionSpan), mark("limits.deflection.span"), shortNum(l.DeflectionOver), mark("limits.deflection.overhang"))
	fmt.Fprintln(w, "\nVehicles")
	if len(s.Vehicles) == 0 {
		fmt.Fprintln(w, "  none")
		return
	}
	tw := Table(w)
	fmt.Fprintln(tw, "  name\tmax length [m]\tpayload [kg]\tcost per trip")
	for _, v := range s.Vehicles {
		fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\n", v.Name, shortNum(v.MaxLength), shortNum(v.Payload), shortNum(v.Cost))
	}
	tw.Flush()
}

func writeCheckCosts(w io.Writer, c checkCosts, mark func(...string) string) {
	head := "Costs"
	if c.Indicative {
		head += " (no costs block: invented indicative rates, for ranking only)"
	}
	fmt.Fprintf(w, "\n%s\n", head)
	var bolts []string
	for _, k := range sortedRateKeys(c.Bolt) {
		bolts = append(bolts, k+" "+shortNum(c.Bolt[k]))
	}
	var factors []string
	for _, k := range sortedRateKeys(c.BoltClassFactor) {
		factors = append(factors, k+" ×"+shortNum(c.BoltClassFactor[k]))
	}
	fmt.Fprintf(w, "  per bolt assembly: %s; class factors: %s\n", dashIfEmpty(strings.Join(bolts, ", ")), dashIfEmpty(strings.Join(factors, ", ")))
	fmt.Fprintf(w, "  plate per kg %s%s, hole %s%s, faying surface per m² %s%s, per splice %s%s, per lift %s%s\n",
		shortNum(c.PlatePerKg), mark("costs.plate_per_kg", "costs"), shortNum(c.Hole), mark("costs.hole", "costs"),
		shortNum(c.FayingPerM2), mark("costs.faying_per_m2", "costs"), shortNum(c.Splice), mark("costs.splice", "costs"),
		shortNum(c.Lift), mark("costs.lift", "costs"))
	fmt.Fprintf(w, "  per kg of bolt assembly %s%s\n", shortNum(c.AssemblyPerKg), mark("costs.assembly_per_kg", "costs"))
}

func sortedRateKeys(m map[string]float64) []string {
	keys := make([]string, 0, len(m))
	for k := range m {
		keys = append(keys, k)
	}
	slices.Sort(keys)
	return keys
}

// shortNum prints a rounded value in its shortest form, "7.8", "0.05", "2600".
func shortNum(v float64) string { return strconv.FormatFloat(Round(v), 'f', -1, 64) }

func joinShortNums(v []float64, sep string) string {
	parts := make([]string, len(v))
	for i, x := range v {
		parts[i] = shortNum(x)
	}
	return strings.Join(parts, sep)
}

func dashIfEmpty(s string) string {
	if s == "" {
		return "-"
	}
	return s
}

// writeLoads prints the load cases and the combinations of a job that analyses its beam.
func writeLoads(w io.Writer, s JobSummary, mark func(...string) string) {
	fmt.Fprintln(w, "\nLoad cases (characteristic)")
	tw := Table(w)
	fmt.Fprintln(tw, "case\tkind\tcategory\tψ0, ψ1, ψ2\tpattern\tloads\ttotal down [kN]")
	for _, c := range s.Cases {
		psi := "-"
		if c.Psi != nil {
			psi = fmt.Sprintf("%g, %g, %g (%s)", c.Psi[0], c.Psi[1], c.Psi[2], c.PsiSource)
		}
		pattern := "no"
		if c.Pattern {
			pattern = "yes"
		}
		pattern += mark("cases." + c.Name + ".pattern")
		name := c.Name
		if c.SelfW {
			name += " (self weight)"
		}
		fmt.Fprintf(tw, "%s\t%s\t%s\t%s\t%s\t%d\t%.2f\n", name, c.Kind, dashIfEmpty(c.Category), psi, pattern, c.Loads, Clean(c.TotalDown))
	}
	tw.Flush()

	cb := s.Combinations
	fmt.Fprintf(w, "\nCombinations: %d ULS by EN 1990 %s%s, %d SLS %s%s, %d of them from combinations.extra\n",
		cb.ULSCount, cb.ULS, mark("combinations.uls"), cb.SLSCount, cb.SLS, mark("combinations.sls"), cb.UserCount)
	fmt.Fprintf(w, "Rules:     %s%s: γG,sup %.2f%s, γG,inf %.2f%s, γQ %.2f%s, ξ %.2f%s\n", cb.Rules, mark("combinations.rules"),
		cb.GammaGSup, mark("combinations.overrides.gamma_G_sup"), cb.GammaGInf, mark("combinations.overrides.gamma_G_inf"),
		cb.GammaQ, mark("combinations.overrides.gamma_Q"), cb.Xi, mark("combinations.overrides.xi"))
	writeRoofRule(w, cb, mark("combinations.roof_imposed_separate"))
	for _, n := range cb.Names {
		fmt.Fprintf(w, "  %s\n", n)
	}
}

// SourceDoc says where a job's design forces come from: its own analysis, or a table.
type SourceDoc struct {
	Mode       string `json:"mode"` // "analysis" or "imported"
	File       string `json:"file,omitempty"`
	SHA256     string `json:"sha256,omitempty"`
	Shape      string `json:"shape,omitempty"`
	Rows       int    `json:"rows,omitempty"`
	Deflection bool   `json:"deflection"` // the member's deflection can be checked
}

func forcesSource(st *optimise.Setup) SourceDoc {
	t := st.Table
	if t == nil {
		return SourceDoc{Mode: "analysis", Deflection: true}
	}
	return SourceDoc{Mode: "imported", File: t.File, SHA256: t.SHA256, Shape: t.Shape.String(), Rows: t.Rows,
		Deflection: t.Deflection() && len(st.Model.Supports) > 0}
}

// writeSource prints where imported forces come from and what they allow.
func writeSource(w io.Writer, f SourceDoc) {
	fmt.Fprintf(w, "Forces:    imported from %s (%s, %d rows, SHA-256 %s); the beam analysis was not run\n", f.File, f.Shape, f.Rows, f.SHA256)
	defl := "no (the table gives no w, or the member has no supports)"
	if f.Deflection {
		defl = "yes (from the table's w)"
	}
	fmt.Fprintf(w, "           linear between the table's stations (exact only at stations); member checks: cross-section yes, deflection %s\n", defl)
}
