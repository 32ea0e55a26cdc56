package optimise

import (
	"cmp"
	"fmt"
	"math"
	"slices"
	"strings"

	"spanbreak/beam"
	"spanbreak/splice"
)

// FindingKind says what one line of a Diagnosis is about.
type FindingKind string

const (
	// FindingStretch is a stretch of consecutive positions where no splice of the design
	// space passes.
	FindingStretch FindingKind = "stretch"
	// FindingKeepOut is a keep-out zone inside a stretch of beam without admissible positions.
	FindingKeepOut FindingKind = "keep_out"
	// FindingLimit is the limit of the job that no layout meets (the *LimitError).
	FindingLimit FindingKind = "limit"
)

// Finding is one reason why no layout fits, in figures and in words.
type Finding struct {
	Kind FindingKind
	// From and To bound the finding [mm]: the first and last position of a stretch, the
	// extent of a zone on the beam, or the stretch a limit error names; both 0 for a limit
	// without one.
	From, To float64
	// Positions is the number of candidate positions in a stretch or zone.
	Positions int
	// Key is the job-file key to act on: "splice" for a stretch that the design space cannot
	// splice, "beam.section" for one where the beam's own resistance is exceeded, the zone's
	// key, or the limit's key.
	Key string

	// The closest attempt of a stretch: the position with the lowest utilisation there.
	Check       string  // its governing check id; "" when the designer names none
	Utilisation float64 // its governing utilisation
	At          float64 // its position [mm]
	Attempt     string  // its splice in one line; "" when the designer keeps none

	// The design forces of a stretch at ULS: the largest |M| [N·mm] and |V| [N] over its
	// positions.
	MEd, VEd float64
	// McRd and VcRd are the beam's own bending and shear resistances [N·mm, N], set only
	// where MEd or VEd exceeds them (0 otherwise). They are the simple plastic values
	// Mpl,Rd = Wpl,y·fy/γM0 and Vpl,Rd = Av·fy/(√3·γM0) with fy of the flange, without
	// classification or interaction.
	McRd, VcRd float64

	Message string // the finding in words, one line
}

// Diagnosis explains why no layout fits: the stretches of beam without an admissible splice
// position that make a piece too long (each no-pass stretch with its closest attempt, each
// keep-out zone by its reason and key), then the limit no layout meets. It is empty when a
// layout fits.
type Diagnosis []Finding

// Lines are the findings in words, in order.
func (d Diagnosis) Lines() []string {
	out := make([]string, len(d))
	for i, f := range d {
		out[i] = f.Message
	}
	return out
}

// diagnosis builds the Diagnosis of an outcome whose layout search failed with le.
//
// A stretch of beam between two admissible positions (or a beam end) matters when the piece
// it leaves is longer than max_piece_length or the longest vehicle allows, or when it holds
// positions where no splice passes and its steel alone is heavier than max_piece_mass or the
// largest payload allows (less the rigging allowance), or when it lies in the stretch le
// names. (A stretch of keep-out zones alone that is too heavy is the mass limit's own
// finding: the limit line says it.) Inside each such stretch every
// maximal run of positions where no splice passes is one FindingStretch and every keep-out
// zone is one FindingKeepOut. The stretches come first, then the zones (each by position),
// and the FindingLimit of le last.
func (o *Outcome) diagnosis(le *LimitError) Diagnosis {
	var d Diagnosis
	length := o.Setup.Model.Length
	byLength, byMass := o.pieceAllowance()
	edges := []float64{0}
	for _, c := range o.Candidates {
		if c.Feasible {
			edges = append(edges, c.X)
		}
	}
	edges = append(edges, length)
	for k := 1; k < len(edges); k++ {
		a, b := edges[k-1], edges[k]
		piece := b - a
		if a > 0 {
			piece -= o.Gap() / 2
		}
		if b < length {
			piece -= o.Gap() / 2
		}
		named := le.To > le.From && a >= le.From-zoneTol && b <= le.To+zoneTol
		found := o.findingsBetween(a, b)
		noPass := slices.ContainsFunc(found, func(f Finding) bool { return f.Kind == FindingStretch })
		if piece > byLength+zoneTol || (noPass && piece > byMass+zoneTol) || named {
			d = append(d, found...)
		}
	}
	// what no splice can span first, then what no splice may span
	slices.SortStableFunc(d, func(a, b Finding) int {
		if a.Kind != b.Kind {
			return cmp.Compare(kindOrder(a.Kind), kindOrder(b.Kind))
		}
		return cmp.Compare(a.From, b.From)
	})
	return append(d, Finding{Kind: FindingLimit, From: le.From, To: le.To, Key: le.Key, Message: le.Key + ": " + le.Message})
}

func kindOrder(k FindingKind) int {
	return slices.Index([]FindingKind{FindingStretch, FindingKeepOut, FindingLimit}, k)
}

// pieceAllowance is the longest piece any layout may have [mm], by length — the lesser of
// max_piece_length and the longest vehicle — and by mass: the steel length whose mass alone
// reaches the lesser of max_piece_mass and the largest payload, less the rigging allowance.
func (o *Outcome) pieceAllowance() (byLength, byMass float64) {
	byLength = o.Limits.MaxLength
	mass := o.Limits.MaxMass
	if vs := o.Setup.Vehicles; len(vs) > 0 {
		longest, payload := 0.0, 0.0
		for _, v := range vs {
			longest, payload = math.Max(longest, v.MaxLength), math.Max(payload, v.Payload)
		}
		byLength, mass = math.Min(byLength, longest), math.Min(mass, payload)
	}
	byMass = math.Inf(1)
	if perMM := o.Setup.Section.Mass / 1000; !math.IsInf(mass, 1) && perMM > 0 {
		byMass = math.Max(0, mass-o.Limits.Rigging) / perMM
	}
	return byLength, byMass
}

// findingsBetween describes the positions strictly between two admissible positions a and b
// [mm]: each maximal run where no splice passes, and each keep-out zone once.
func (o *Outcome) findingsBetween(a, b float64) []Finding {
	var out []Finding
	var run []Candidate
	flush := func() {
		if len(run) > 0 {
			out = append(out, o.stretchFinding(run))
			run = nil
		}
	}
	for _, c := range o.Candidates {
		if c.X <= a || c.X >= b || c.Feasible {
			continue
		}
		if c.Zone == nil {
			run = append(run, c)
			continue
		}
		flush()
		z := o.zoneFinding(c.Zone)
		if i := slices.IndexFunc(out, func(f Finding) bool { return f.Kind == FindingKeepOut && f.Message == z.Message }); i >= 0 {
			out[i].Positions++
			continue
		}
		out = append(out, z)
	}
	flush()
	return out
}

// zoneFinding names a keep-out zone by its reason and key, clipped to the beam.
func (o *Outcome) zoneFinding(z *Zone) Finding {
	from, to := math.Max(0, z.From), math.Min(o.Setup.Model.Length, z.To)
	return Finding{Kind: FindingKeepOut, From: from, To: to, Positions: 1, Key: z.Key,
		Message: fmt.Sprintf("no splice may go from %.3f to %.3f m: %s (%s)", from/1e3, to/1e3, z.Reason, z.Key)}
}

// stretchFinding describes a run of consecutive positions where no splice passes: the
// closest attempt, the design forces and the beam's own resistances where they are exceeded.
func (o *Outcome) stretchFinding(run []Candidate) Finding {
	best := run[0]
	f := Finding{Kind: FindingStretch, From: run[0].X, To: run[len(run)-1].X, Positions: len(run), Key: "splice"}
	for _, c := range run {
		if c.Design.Utilisation < best.Design.Utilisation {
			best = c
		}
		u := c.Forces.ULS
		f.MEd = math.Max(f.MEd, math.Max(math.Abs(u.MMax), math.Abs(u.MMin)))
		f.VEd = math.Max(f.VEd, u.V)
	}
	f.Check, f.Utilisation, f.At, f.Attempt = best.Design.Governing, best.Design.Utilisation, best.X, best.Design.Summary
	mpl, vpl := o.plasticResistances()
	overFrom, overTo := math.Inf(1), math.Inf(-1)
	for _, c := range run {
		u := c.Forces.ULS
		if math.Max(math.Abs(u.MMax), math.Abs(u.MMin)) > mpl || u.V > vpl {
			overFrom, overTo = math.Min(overFrom, c.X), math.Max(overTo, c.X)
		}
	}
	if f.MEd > mpl {
		f.McRd = mpl
	}
	if f.VEd > vpl {
		f.VcRd = vpl
	}
	if f.McRd > 0 || f.VcRd > 0 {
		f.Key = "beam.section"
	}
	var g splice.Geometry
	if best.Design.Geometry != nil {
		g = *best.Design.Geometry
	}
	f.Message = o.stretchMessage(f, g, overFrom, overTo)
	return f
}

// plasticResistances are the beam's own Mc,Rd in pure bending (EN 1993-1-1 6.2.5: Wpl,y·fy/γM0
// for a class 1 or 2 section, Wel,y·fy/γM0 for class 3) and Vc,Rd = Av·fy/(√3·γM0) (6.2.6)
// [N·mm, N], from the member checks' beam (fy of the thicker plate).
func (o *Outcome) plasticResistances() (mc, vc float64) {
	m := o.Setup.Member
	mc = m.MplRd
	if m.Classify(m.MplRd, 0).Class > beam.Class2 {
		mc = m.MelRd
	}
	return mc, m.VplRd
}

// stretchMessage says a stretch finding in words; the beam's resistances are exceeded from
// overFrom to overTo [mm].
func (o *Outcome) stretchMessage(f Finding, g splice.Geometry, overFrom, overTo float64) string {
	var b strings.Builder
	fmt.Fprintf(&b, "no splice passes %s", span(f.From, f.To))
	if f.Positions > 1 {
		fmt.Fprintf(&b, " (%d positions)", f.Positions)
	}
	check := f.Check
	if check == "" {
		check = "a check"
	}
	fmt.Fprintf(&b, ": the closest attempt, at %.3f m, fails %s at utilisation %.2f", f.At/1e3, check, f.Utilisation)
	if largest, ok := o.largestOfSpace(g); ok {
		fmt.Fprintf(&b, " with the largest bolts and plates of the design space (%s)", largest)
	} else if f.Attempt != "" {
		fmt.Fprintf(&b, " (%s)", f.Attempt)
	}
	fmt.Fprintf(&b, "; there |M_Ed| is up to %.1f kNm and |V_Ed| up to %.1f kN", f.MEd/1e6, f.VEd/1e3)
	var over []string
	if f.McRd > 0 {
		over = append(over, fmt.Sprintf("|M_Ed| exceeds the beam's own Mc,Rd = %.1f kNm", f.McRd/1e6))
	}
	if f.VcRd > 0 {
		over = append(over, fmt.Sprintf("|V_Ed| exceeds the beam's own Vc,Rd = %.1f kN", f.VcRd/1e3))
	}
	if len(over) > 0 {
		fmt.Fprintf(&b, "; %s (EN 1993-1-1 6.2.5, 6.2.6) %s: the beam itself is overstressed there, whatever the splice",
			strings.Join(over, " and "), span(overFrom, overTo))
	}
	return b.String()
}

// span names a stretch of positions [mm]: "at 4.000 m", "from 4.000 to 5.000 m".
func span(from, to float64) string {
	if to-from < zoneTol {
		return fmt.Sprintf("at %.3f m", from/1e3)
	}
	return fmt.Sprintf("from %.3f to %.3f m", from/1e3, to/1e3)
}

// largestOfSpace reports whether a splice uses the largest bolt size, the strongest class
// and the thickest plate of the job's design space, and names them.
func (o *Outcome) largestOfSpace(g splice.Geometry) (string, bool) {
	sp := o.Setup.Splice.Sizing.Space
	if g.Bolt.Size == "" || len(sp.Sizes) == 0 || len(sp.Classes) == 0 || len(sp.Thicknesses) == 0 {
		return "", false
	}
	diameter := func(name string) float64 {
		s, err := splice.LookupBoltSize(name)
		if err != nil {
			return 0
		}
		return s.D
	}
	strength := func(name string) float64 {
		c, err := splice.LookupBoltClass(name)
		if err != nil {
			return 0
		}
		return c.Fub
	}
	size := slices.MaxFunc(sp.Sizes, func(a, b string) int { return cmp.Compare(diameter(a), diameter(b)) })
	class := slices.MaxFunc(sp.Classes, func(a, b string) int { return cmp.Compare(strength(a), strength(b)) })
	t := slices.Max(sp.Thicknesses)
	if diameter(g.Bolt.Size) < diameter(size) || strength(g.Bolt.Class) < strength(class) || g.Flange.Outer.Thickness < t {
		return "", false
	}
	return fmt.Sprintf("%s %s, %g mm plates", size, class, t), true
}
