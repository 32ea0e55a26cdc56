package jobfile

import (
	"slices"
	"strings"

	"go.yaml.in/yaml/v3"
)

// Job is one job file (DESIGN.md section 8): one beam, its load cases and combinations, and
// what is needed to place its splices. Optional blocks are nil when absent; a caller supplies
// the documented defaults.
type Job struct {
	Meta
	Title        string         `yaml:"title"`
	Beam         Beam           `yaml:"beam,required"`
	Cases        Map[Case]      `yaml:"cases"`  // characteristic load cases, in file order; required without forces
	Forces       *ForcesFile    `yaml:"forces"` // forces from another analysis, in place of cases and combinations
	Combinations *Combinations  `yaml:"combinations"`
	Splice       *SpliceOptions `yaml:"splice"`
	Limits       *Limits        `yaml:"limits"`
	Vehicles     []Vehicle      `yaml:"vehicles"` // transport tiers; the cheapest that takes the longest piece is used
	Costs        *Costs         `yaml:"costs"`
	Scan         *Scan          `yaml:"scan"`
}

// Grade tables for Beam.GradeTable.
const (
	GradeTableEN1993  = "EN1993"  // EN 1993-1-1 Table 3.1 thickness steps (the default)
	GradeTableEN10025 = "EN10025" // the product standard's finer steps, EN 10025-2
)

// Beam describes the member: section, grade, spans, overhangs, supports and hinges.
type Beam struct {
	Meta
	Section      Section   `yaml:"section,required"`
	Grade        string    `yaml:"grade"`       // e.g. "S355"; looked up by the caller
	GradeTable   string    `yaml:"grade_table"` // GradeTableEN1993 (default when "") or GradeTableEN10025
	Spans        []Metres  `yaml:"spans"`       // required unless length is given
	MemberLength *Metres   `yaml:"length"`      // a member with no supports of its own (imported forces only)
	Overhang     *Overhang `yaml:"overhang"`
	Supports     []Support `yaml:"supports"`    // one per span end, left to right; required with spans
	Hinges       []Metres  `yaml:"hinges"`      // x of internal moment hinges
	SelfWeight   *bool     `yaml:"self_weight"` // nil: the default, see IncludesSelfWeight
}

// ForcesFile names a table of forces from another analysis (optimise/forcetable), its path
// relative to the job file.
type ForcesFile struct {
	Meta
	File string `yaml:"file,required"`
}

// SelfWeightCase is the name of the permanent case the section's own weight makes.
const SelfWeightCase = "SW"

// IncludesSelfWeight reports whether the section's weight is added as permanent case "SW".
// The default (self_weight absent) is true: leaving out the weight of the steel is the unsafe
// mistake, so it must be switched off on purpose.
func (b Beam) IncludesSelfWeight() bool { return b.SelfWeight == nil || *b.SelfWeight }

// LeftOverhang and RightOverhang return the overhangs [mm] (0 when absent).
func (b Beam) LeftOverhang() float64 {
	if b.Overhang == nil {
		return 0
	}
	return b.Overhang.Left.MM()
}

// RightOverhang returns the overhang beyond the last support [mm] (0 when absent).
func (b Beam) RightOverhang() float64 {
	if b.Overhang == nil {
		return 0
	}
	return b.Overhang.Right.MM()
}

// Length returns the total length [mm]: both overhangs and every span.
func (b Beam) Length() float64 {
	if b.MemberLength != nil {
		return b.MemberLength.MM()
	}
	l := b.LeftOverhang() + b.RightOverhang()
	for _, s := range b.Spans {
		l += s.MM()
	}
	return l
}

// SupportPositions returns x of each span end from the left end of the beam [mm]: the left
// overhang, then the running sum of the spans.
func (b Beam) SupportPositions() []float64 {
	if len(b.Spans) == 0 {
		return nil // a member given by its length has no supports of its own
	}
	x := b.LeftOverhang()
	xs := []float64{x}
	for _, s := range b.Spans {
		x += s.MM()
		xs = append(xs, x)
	}
	return xs
}

// Overhang gives the cantilever lengths beyond the first and last support (0 when absent).
type Overhang struct {
	Meta
	Left  Metres `yaml:"left"`
	Right Metres `yaml:"right"`
}

// Section is either a catalogue name ("IPE 600", "HE 300 B") or a welded I-section from
// plate sizes, written {welded: {h, b, tw, tf}}. Exactly one of Name and Welded is set when
// decoding succeeded.
type Section struct {
	Meta
	Name   string  // catalogue name as written, spaces trimmed; looked up by the caller
	Welded *Welded // plate sizes of a doubly symmetric welded I-section
}

// Welded is a doubly symmetric welded I-section [mm]. Its properties ignore the fillet welds;
// WeldThroat, when given, keeps the splice plates off them.
type Welded struct {
	Meta
	H  Millimetres `yaml:"h,required"`  // overall depth
	B  Millimetres `yaml:"b,required"`  // flange width
	Tw Millimetres `yaml:"tw,required"` // web thickness
	Tf Millimetres `yaml:"tf,required"` // flange thickness
	// WeldThroat is the throat a of the web-to-flange fillet welds (EN 1993-1-8 4.5.2);
	// nil: not given, the welds are ignored.
	WeldThroat *Millimetres `yaml:"weld_throat"`
}

// DecodeYAMLNode reads a catalogue name or a {welded: {...}} mapping.
func (s *Section) DecodeYAMLNode(n *yaml.Node, d *Decoder) {
	s.Meta = d.Meta(n)
	switch {
	case n.Kind == yaml.MappingNode:
		var form struct {
			Welded *Welded `yaml:"welded,required"`
		}
		d.Decode(n, &form)
		s.Welded = form.Welded
	case n.Kind == yaml.ScalarNode && n.ShortTag() == "!!str":
		s.Name = strings.TrimSpace(n.Value)
		if s.Name == "" {
			d.Problemf(n, "the section name is empty")
		}
	default:
		d.Problemf(n, "want a catalogue name such as \"IPE 600\" or {welded: {h: .., b: .., tw: .., tf: ..}}, got %s",
			describe(n))
	}
}

// Support types for Support.Type.
const (
	SupportPinned = "pinned" // holds both translations
	SupportRoller = "roller" // holds the vertical translation only
	SupportFixed  = "fixed"  // holds both translations and the rotation
	SupportSpring = "spring" // elastic vertical spring of stiffness K
)

// SupportTypes lists the allowed support types.
func SupportTypes() []string {
	return []string{SupportPinned, SupportRoller, SupportFixed, SupportSpring}
}

// Support is one support, written as its type ("pinned") or as a mapping
// ({type: spring, k: 50000}, {type: fixed}).
type Support struct {
	Meta
	Type string     // one of SupportTypes
	K    *Stiffness // vertical stiffness of a spring support; nil for the others
}

// DecodeYAMLNode reads a type name or a {type, k} mapping.
func (s *Support) DecodeYAMLNode(n *yaml.Node, d *Decoder) {
	s.Meta = d.Meta(n)
	if n.Kind == yaml.ScalarNode && n.ShortTag() == "!!str" {
		s.Type = n.Value
		return
	}
	if n.Kind != yaml.MappingNode {
		d.Problemf(n, "want a support type (%s) or a mapping such as {type: spring, k: 50000}, got %s",
			strings.Join(SupportTypes(), ", "), describe(n))
		return
	}
	var form struct {
		Type string     `yaml:"type,required"`
		K    *Stiffness `yaml:"k"`
	}
	d.Decode(n, &form)
	s.Type, s.K = form.Type, form.K
}

// Action kinds for Case.Kind.
const (
	KindPermanent = "permanent"
	KindImposed   = "imposed"
	KindSnow      = "snow"
	KindWind      = "wind"
	KindThermal   = "thermal" // temperature (non-fire), EN 1991-1-5; ψ from EN 1990 Table A1.1
	KindOther     = "other"   // another variable action; needs explicit psi
)

// CaseKinds lists the allowed case kinds.
func CaseKinds() []string {
	return []string{KindPermanent, KindImposed, KindSnow, KindWind, KindThermal, KindOther}
}

// ImposedCategories lists the EN 1990 Table A1.1 categories of imposed loads in buildings
// (A domestic … H roofs), which give ψ0, ψ1, ψ2.
func ImposedCategories() []string { return []string{"A", "B", "C", "D", "E", "F", "G", "H"} }

// SnowCategories lists the snow categories: "low" for sites at altitude H ≤ 1000 m a.s.l.,
// "high" for H > 1000 m or the Nordic countries (EN 1990 Table A1.1 snow rows).
func SnowCategories() []string { return []string{"low", "high"} }

// Case is one characteristic load case.
type Case struct {
	Meta
	Kind     string      `yaml:"kind,required"` // one of CaseKinds
	Category string      `yaml:"category"`      // imposed: ImposedCategories; snow: SnowCategories
	Pattern  *bool       `yaml:"pattern"`       // nil: the default, see Patterned
	Psi      *[3]float64 `yaml:"psi"`           // explicit ψ0, ψ1, ψ2; nil takes EN 1990 Table A1.1
	Loads    []Load      `yaml:"loads"`
}

// Patterned reports whether the case is loaded span by span where adverse: as written, or by
// default for imposed cases only.
func (c Case) Patterned() bool {
	if c.Pattern != nil {
		return *c.Pattern
	}
	return c.Kind == KindImposed
}

// Load shapes for Load.Kind, which are also the job-file keys.
const (
	LoadUDL       = "udl"       // uniform, W[0] = W[1], over From..To (whole beam by default)
	LoadTrapezoid = "trapezoid" // linear from W[0] at From to W[1] at To
	LoadPoint     = "point"     // transverse force P at At, positive downward
	LoadMoment    = "moment"    // couple M at At, positive clockwise
	LoadAxial     = "axial"     // force P along +x at At
)

// LoadKinds lists the load shapes.
func LoadKinds() []string {
	return []string{LoadUDL, LoadTrapezoid, LoadPoint, LoadMoment, LoadAxial}
}

// Load is one load of a case, written {udl: w}, {udl: w, from: a, to: b},
// {trapezoid: [w1, w2], from: a, to: b}, {point: P, at: x}, {moment: M, at: x} or
// {axial: F, at: x}. Transverse loads are positive downward.
type Load struct {
	Meta
	Kind string           // one of LoadKinds
	W    [2]LineLoad      // intensity at From and at To (udl: both equal)
	P    KiloNewtons      // point and axial force
	M    KiloNewtonMetres // point moment
	From *Metres          // start of a distributed load; nil is the left end of the beam
	To   *Metres          // end of a distributed load; nil is the right end of the beam
	At   Metres           // position of a point force, moment or axial force
}

// Distributed reports whether the load runs over a length (udl, trapezoid).
func (l Load) Distributed() bool { return l.Kind == LoadUDL || l.Kind == LoadTrapezoid }

// Range returns where a distributed load starts and ends [mm] on a beam of the given length
// [mm], filling in the defaults (0 and length).
func (l Load) Range(length float64) (from, to float64) {
	from, to = 0, length
	if l.From != nil {
		from = l.From.MM()
	}
	if l.To != nil {
		to = l.To.MM()
	}
	return from, to
}

// DecodeYAMLNode reads one load mapping and checks that it has exactly one shape and the
// position keys that shape takes.
func (l *Load) DecodeYAMLNode(n *yaml.Node, d *Decoder) {
	l.Meta = d.Meta(n)
	var form struct {
		UDL       *LineLoad         `yaml:"udl"`
		Trapezoid *[2]LineLoad      `yaml:"trapezoid"`
		Point     *KiloNewtons      `yaml:"point"`
		Moment    *KiloNewtonMetres `yaml:"moment"`
		Axial     *KiloNewtons      `yaml:"axial"`
		From      *Metres           `yaml:"from"`
		To        *Metres           `yaml:"to"`
		At        *Metres           `yaml:"at"`
	}
	d.Decode(n, &form)
	if n.Kind != yaml.MappingNode {
		return // reported by Decode
	}
	var shapes []string
	for _, k := range LoadKinds() {
		if l.Has(k) {
			shapes = append(shapes, k)
		}
	}
	switch len(shapes) {
	case 0:
		if !hasUnknownKey(n, d) { // else the unknown key's message (with its did-you-mean) says it
			d.Problemf(n, "a load needs one of %s", strings.Join(LoadKinds(), ", "))
		} else {
			d.markFailed(d.path)
		}
		return
	case 1:
	default:
		d.Problemf(n, "a load has one shape (%s), got %s", strings.Join(LoadKinds(), ", "),
			strings.Join(shapes, " and "))
		return
	}
	l.Kind = shapes[0]
	l.From, l.To = form.From, form.To
	switch l.Kind {
	case LoadUDL:
		if form.UDL != nil {
			l.W = [2]LineLoad{*form.UDL, *form.UDL}
		}
	case LoadTrapezoid:
		if form.Trapezoid != nil {
			l.W = *form.Trapezoid
		}
	case LoadPoint:
		l.P = deref(form.Point)
	case LoadMoment:
		l.M = deref(form.Moment)
	case LoadAxial:
		l.P = deref(form.Axial)
	}
	l.checkPositionKeys(d, form.At)
}

// checkPositionKeys reports position keys that do not belong to the load's shape.
func (l *Load) checkPositionKeys(d *Decoder, at *Metres) {
	if l.Distributed() {
		if l.Has("at") {
			d.ProblemAt(l.Where("at"), "a %s runs from .. to ..; at is for point, moment and axial loads", l.Kind)
		}
		return
	}
	for _, k := range []string{"from", "to"} {
		if l.Has(k) {
			d.ProblemAt(l.Where(k), "a %s load sits at one x (at); from and to are for udl and trapezoid loads", l.Kind)
		}
	}
	if at == nil {
		d.ProblemAt(l.Meta.Loc, "missing required key \"at\" (x of the %s load, m)", l.Kind)
		return
	}
	l.At = *at
}

// hasUnknownKey reports whether a mapping node has a key outside the load keys.
func hasUnknownKey(n *yaml.Node, d *Decoder) bool {
	allowed := append(LoadKinds(), "from", "to", "at")
	for i := 0; i+1 < len(n.Content); i += 2 {
		if k := n.Content[i]; k.Kind != yaml.ScalarNode || !slices.Contains(allowed, k.Value) {
			return true
		}
	}
	return false
}

func deref[T any](p *T) T {
	var zero T
	if p == nil {
		return zero
	}
	return *p
}

// Combination rules, ULS and SLS combinations and states for Combinations.
const (
	RulesEN1990 = "EN1990" // EN 1990 recommended γ and ψ values (the default)

	ULS610   = "6.10"   // EN 1990 expression (6.10) (the default)
	ULS610ab = "6.10ab" // the less favourable of (6.10a) and (6.10b)

	SLSCharacteristic = "characteristic"  // EN 1990 (6.14b) (the default)
	SLSFrequent       = "frequent"        // (6.15b)
	SLSQuasiPermanent = "quasi-permanent" // (6.16b)
	StateULS          = "uls"
	StateSLS          = "sls"
)

// OverrideKeys lists the partial factors combinations.overrides may set: γG,sup, γG,inf,
// γQ (EN 1990 Table A1.2(B)) and the reduction factor ξ of (6.10b).
func OverrideKeys() []string { return []string{"gamma_G_sup", "gamma_G_inf", "gamma_Q", "xi"} }

// Combinations selects the EN 1990 combinations generated, plus user-defined ones.
type Combinations struct {
	Meta
	Rules     string             `yaml:"rules"`     // RulesEN1990
	ULS       string             `yaml:"uls"`       // ULS610 or ULS610ab
	Overrides Map[float64]       `yaml:"overrides"` // keys from OverrideKeys
	SLS       string             `yaml:"sls"`       // SLSCharacteristic, SLSFrequent or SLSQuasiPermanent
	Extra     []ExtraCombination `yaml:"extra"`

	// RoofImposedSeparate keeps imposed loads on roofs (category H) out of every generated
	// combination with snow or wind (EN 1990 A1.2.1(3), EN 1991-1-1 3.3.2(1)); nil: the
	// default, see SeparatesRoofImposed.
	RoofImposedSeparate *bool `yaml:"roof_imposed_separate"`
}

// SeparatesRoofImposed reports whether roof imposed loads are kept apart from snow and wind.
// The default (the block or the key absent) is true, as EN 1991-1-1 3.3.2(1) allows; false
// combines them like any other variable actions (more load, never less).
func (c *Combinations) SeparatesRoofImposed() bool {
	return c == nil || c.RoofImposedSeparate == nil || *c.RoofImposedSeparate
}

// ExtraCombination is a user-defined combination: a factor on each named case.
type ExtraCombination struct {
	Meta
	Name    string       `yaml:"name,required"`
	State   string       `yaml:"state,required"`   // StateULS or StateSLS
	Factors Map[float64] `yaml:"factors,required"` // case name → factor (SW is the self weight)
}

// Splice categories, friction classes, flange arrangements and force distributions.
const (
	CategoryA = "A" // bearing type, EN 1993-1-8 Table 3.2
	CategoryB = "B" // slip-resistant at SLS
	CategoryC = "C" // slip-resistant at ULS

	FlangeOuter      = "outer"       // one outer cover plate per flange
	FlangeOuterInner = "outer+inner" // an outer plate and two inner plates (double shear)

	DistributionProportional = "proportional" // web takes M·Iw/Iy and N·Aw/A (the default)
	DistributionFlangesOnly  = "flanges-only" // flanges take all the moment
)

// SpliceCategories lists the splice categories (EN 1993-1-8 Table 3.2).
func SpliceCategories() []string { return []string{CategoryA, CategoryB, CategoryC} }

// FrictionClasses lists the EN 1090-2 friction classes of faying surfaces.
func FrictionClasses() []string { return []string{"A", "B", "C", "D"} }

// BoltClasses lists the bolt property classes of EN 1993-1-8 Table 3.1.
func BoltClasses() []string { return []string{"4.6", "4.8", "5.6", "5.8", "6.8", "8.8", "10.9"} }

// PreloadableClass reports whether bolts of a class may be preloaded (EN 1993-1-8 3.1.2:
// only 8.8 and 10.9), as categories B and C need.
func PreloadableClass(class string) bool { return class == "8.8" || class == "10.9" }

// SpliceOptions are the choices the splice sizing searches over.
type SpliceOptions struct {
	Meta
	Category      string         `yaml:"category"`       // SpliceCategories
	FrictionClass string         `yaml:"friction_class"` // FrictionClasses; categories B and C
	Bolts         *BoltOptions   `yaml:"bolts"`
	Plates        *PlateOptions  `yaml:"plates"`
	FlangePlates  []string       `yaml:"flange_plates"`  // FlangeOuter, FlangeOuterInner
	Distribution  string         `yaml:"distribution"`   // DistributionProportional or DistributionFlangesOnly
	Gap           *Millimetres   `yaml:"gap"`            // between the beam ends
	MinimumForces *MinimumForces `yaml:"minimum_forces"` // design forces at least these fractions of the beam's resistances
	Detailing     *Detailing     `yaml:"detailing"`      // the office's detailing preferences
	Assemblies    *Assemblies    `yaml:"assemblies"`     // bolting assemblies: system, shear planes
}

// Detailing holds the detailing preferences of the sizing; each one left out keeps the
// sizing's own choice. Gauge and Gauges exclude each other.
type Detailing struct {
	Meta
	Gauge            *Millimetres `yaml:"gauge"`               // flange gauge for every section
	Gauges           []WidthGauge `yaml:"gauges"`              // flange gauge by the section's flange width
	MinPlateToFlange *float64     `yaml:"min_plate_to_flange"` // least cover-plate thickness / tf
}

// WidthGauge is a preferred flange gauge for flanges at least Width wide.
type WidthGauge struct {
	Meta
	Width Millimetres `yaml:"width,required"`
	Gauge Millimetres `yaml:"gauge,required"`
}

// --- bolting assemblies (splice.assemblies) -------------------------------------------------

// Assembly systems for Assemblies.System and BoltSpec.System (the product standards of bolt,
// nut and washers).
const (
	SystemHV      = "HV"       // preloaded, EN 14399-4, class 10.9
	SystemHR      = "HR"       // preloaded, EN 14399-3, classes 8.8 and 10.9
	SystemISO4014 = "ISO 4014" // not preloaded, partly threaded, ISO 4032 nut
	SystemISO4017 = "ISO 4017" // not preloaded, fully threaded, ISO 4032 nut
)

// AssemblySystems lists the assembly systems, preloaded first.
func AssemblySystems() []string { return []string{SystemHV, SystemHR, SystemISO4014, SystemISO4017} }

// PreloadedSystem reports whether an assembly system is one for preloading (EN 14399).
func PreloadedSystem(s string) bool { return s == SystemHV || s == SystemHR }

// Shear-plane rules for Assemblies.ShearPlanes.
const (
	PlanesLength = "length" // each plane against the plain shank of the chosen bolt length (the default)
	PlanesThread = "thread" // the thread in every plane (conservative)
	PlanesShank  = "shank"  // the plain shank in every plane
)

// ShearPlaneRules lists the shear-plane rules.
func ShearPlaneRules() []string { return []string{PlanesLength, PlanesThread, PlanesShank} }

// Assemblies choose the bolting assemblies of the sized splices and where the shear checks take
// the bolts' shear planes.
type Assemblies struct {
	Meta
	System      string `yaml:"system"`       // AssemblySystems; "" the default of the category and class
	ShearPlanes string `yaml:"shear_planes"` // ShearPlaneRules; "" PlanesLength
}

// MinimumForces are fractions of the beam's own Mc,Rd, Vc,Rd and Npl,Rd that the design
// forces of every splice must reach.
type MinimumForces struct {
	Meta
	Moment *float64 `yaml:"moment"`
	Shear  *float64 `yaml:"shear"`
	Axial  *float64 `yaml:"axial"`
}

// BoltOptions lists the bolt sizes ("M20") and property classes ("8.8") to try, and bounds
// the sizes (either list, or its default) by diameter.
type BoltOptions struct {
	Meta
	Sizes   []string `yaml:"sizes"`
	Classes []string `yaml:"classes"`
	MinSize string   `yaml:"min_size"` // smallest size tried, "" for no bound
	MaxSize string   `yaml:"max_size"` // largest size tried, "" for no bound
}

// PlateOptions gives the cover plate grade and the thicknesses to try.
type PlateOptions struct {
	Meta
	Grade       string        `yaml:"grade"`
	Thicknesses []Millimetres `yaml:"thicknesses"`
}

// Limits are the transport and site limits on pieces and splice positions.
type Limits struct {
	Meta
	MaxPieceLength *Metres      `yaml:"max_piece_length"`
	MinPieceLength *Metres      `yaml:"min_piece_length"`
	MaxPieceMass   *Kilograms   `yaml:"max_piece_mass"`
	Rigging        *Kilograms   `yaml:"rigging"` // slings, shackles and spreader added to every piece's lifted mass
	KeepOut        *KeepOut     `yaml:"keep_out"`
	Splices        *SpliceCount `yaml:"splices"`
	Deflection     *Deflection  `yaml:"deflection"`
}

// Deflection sets the SLS deflection limits of the beam as span/ratio: each span against
// its length, each overhang against its own length.
type Deflection struct {
	Meta
	Span     *float64 `yaml:"span"`     // L/span for a span, e.g. 250
	Overhang *float64 `yaml:"overhang"` // L/overhang for an overhang, e.g. 180
}

// KeepOut lists where no splice may go.
type KeepOut struct {
	Meta
	Supports   *Metres     `yaml:"supports"`    // each side of every support
	PointLoads *Metres     `yaml:"point_loads"` // each side of every point load and point moment
	Ranges     [][2]Metres `yaml:"ranges"`      // [from, to] along the beam
}

// SpliceCount bounds the number of splices in a layout.
type SpliceCount struct {
	Meta
	Min *int `yaml:"min"`
	Max *int `yaml:"max"`
}

// Vehicle is one transport tier.
type Vehicle struct {
	Meta
	Name      string    `yaml:"name,required"`
	MaxLength Metres    `yaml:"max_length,required"` // longest piece it carries
	Payload   Kilograms `yaml:"payload,required"`    // mass per trip
	Cost      float64   `yaml:"cost,required"`       // per trip [currency]
}

// Costs is the cost model; every rate is in the user's currency.
type Costs struct {
	Meta
	Bolt            Map[float64] `yaml:"bolt"`              // bolt size → rate per assembly
	BoltClassFactor Map[float64] `yaml:"bolt_class_factor"` // class → factor on the bolt rate (1 when absent)
	PlatePerKg      *float64     `yaml:"plate_per_kg"`      // per kg of cover plate
	Hole            *float64     `yaml:"hole"`              // per hole
	FayingPerM2     *float64     `yaml:"faying_per_m2"`     // per m² of prepared slip surface (categories B, C)
	Splice          *float64     `yaml:"splice"`            // fixed per splice
	Lift            *float64     `yaml:"lift"`              // per piece erected
	AssemblyPerKg   *float64     `yaml:"assembly_per_kg"`   // per kg of bolt assembly, on top of costs.bolt: prices bolts by length
}

// Scan sets the candidate scan.
type Scan struct {
	Meta
	Step         *Metres `yaml:"step"`         // spacing of candidate positions
	Alternatives *int    `yaml:"alternatives"` // near-best layouts to report
	Uniform      *bool   `yaml:"uniform"`      // recommend the best layout of identical splices
}
