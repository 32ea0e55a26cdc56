package optimise

import (
	"cmp"
	"fmt"
	"math"
	"slices"
	"strings"
)

// MaxEvaluatedSplices bounds the splices of one layout that Evaluate prices.
const MaxEvaluatedSplices = 64

// Evaluation is a layout of splices placed by hand, priced and checked by the rules of the
// layout search: what `spanbreak view` shows while the engineer moves a splice.
type Evaluation struct {
	// Splices are the positions asked for, left to right, each snapped to its scan position.
	Splices []PlacedPosition
	// Pieces run between the snapped positions, with every limit each one breaks; empty when
	// a position has no scan position (off the beam, off the grid) or two share one.
	Pieces []EvaluatedPiece
	// Feasible is true when every position admits a splice, every piece is within every
	// limit, one vehicle tier takes every piece and the number of splices is allowed.
	Feasible bool
	// Reasons says, in words, everything that makes the layout inadmissible; empty when
	// Feasible.
	Reasons []string
	// Layout is the priced layout, as the search reports one (its Sites index the feasible
	// candidates of the outcome, as the search's do); the zero Layout unless Feasible.
	Layout Layout
	// Optimum is the outcome's recommended layout; the zero Layout when no layout fits.
	Optimum Layout
	// Difference is Layout's total minus Optimum's [currency]; 0 unless Feasible and an
	// optimum exists.
	Difference float64
}

// PlacedPosition is one position of an evaluated layout.
type PlacedPosition struct {
	Asked float64 // the position asked for [mm]
	// X is the scan position it snapped to [mm]: the candidate nearest to Asked, within half a
	// scan step. Without one (off the beam, beyond the grid) Candidate is −1 and X is Asked.
	X         float64
	Candidate int            // index into Outcome.Candidates; −1 for none
	Feasible  bool           // the candidate admits a splice
	Reason    string         // why not, when not Feasible
	Zone      *Zone          // the keep-out zone X lies in, if any
	Design    SpliceDesign   // the scan's cheapest splice at X (zero in a keep-out zone)
	Forces    PositionForces // the design forces at X (zero in a keep-out zone)
}

// EvaluatedPiece is one piece of an evaluated layout with the limits it breaks.
type EvaluatedPiece struct {
	Piece
	Breaks []Breach // none when the piece is within every limit
}

// Breach is one limit a piece breaks.
type Breach struct {
	Key     string // job-file key of the limit, e.g. "limits.max_piece_length"
	Label   string // a few words for a drawing, e.g. "over max length"
	Message string // the sentence with the figures
}

// Evaluate prices the layout with splices at xs [mm] (in any order) exactly as the layout
// search prices one. Each position snaps to the nearest position of the scan — the grid of
// the outcome's step — within half a step, so that its splice, its cost and its mass are the
// scan's own and the recommended layout's positions price at the recommended total. A
// position off the beam or beyond the grid, in a keep-out zone or where no splice passes, a
// piece outside a limit, a set of pieces no single vehicle tier takes, and a number of
// splices outside limits.splices make the layout infeasible, each with its reason. The
// error is for input that cannot be a layout at all: a position that is not a finite number,
// or more than MaxEvaluatedSplices positions.
func (o *Outcome) Evaluate(xs []float64) (Evaluation, error) {
	if len(xs) > MaxEvaluatedSplices {
		return Evaluation{}, fmt.Errorf("%d splices: at most %d can be evaluated", len(xs), MaxEvaluatedSplices)
	}
	for i, x := range xs {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return Evaluation{}, fmt.Errorf("splice %d: the position %g is not a finite number", i+1, x)
		}
	}
	e := Evaluation{Optimum: o.Recommended()}
	for _, x := range slices.Sorted(slices.Values(xs)) {
		e.Splices = append(e.Splices, o.placeAt(x))
	}
	for i, sp := range e.Splices {
		if !sp.Feasible {
			e.Reasons = append(e.Reasons, fmt.Sprintf("S%d at %s: %s", i+1, metres(sp.X), sp.Reason))
		}
	}
	priced, ok := o.priceEvaluation(&e)
	o.countReasons(&e)
	e.Feasible = ok && len(e.Reasons) == 0
	if e.Feasible {
		e.Layout = priced
		if o.Infeasible == nil {
			e.Difference = fromMicro(priced.key.total - e.Optimum.key.total)
		}
	}
	return e, nil
}

// placeAt snaps a position to the nearest candidate of the scan within half a step.
func (o *Outcome) placeAt(x float64) PlacedPosition {
	p := PlacedPosition{Asked: x, X: x, Candidate: -1}
	length := o.Setup.Model.Length
	if !(x > 0 && x < length) {
		p.Reason = fmt.Sprintf("off the beam, which runs from 0 to %s", metres(length))
		return p
	}
	k, ok := o.nearestCandidate(x)
	if !ok {
		p.Reason = fmt.Sprintf("more than half a scan step (%s) from every scan position", metres(o.Step/2))
		return p
	}
	c := o.Candidates[k]
	p.X, p.Candidate, p.Feasible, p.Zone, p.Design, p.Forces = c.X, k, c.Feasible, c.Zone, c.Design, c.Forces
	switch {
	case c.Zone != nil:
		p.Reason = c.Zone.Reason + " (" + c.Zone.Key + ")"
	case !c.Feasible:
		p.Reason = "no splice passes: " + c.Reason
	}
	return p
}

// nearestCandidate is the index of the candidate nearest to x [mm], if one lies within half
// a scan step (a micrometre of rounding allowed).
func (o *Outcome) nearestCandidate(x float64) (int, bool) {
	cs := o.Candidates
	if len(cs) == 0 {
		return 0, false
	}
	i, _ := slices.BinarySearchFunc(cs, x, func(c Candidate, x float64) int { return cmp.Compare(c.X, x) })
	best := min(i, len(cs)-1)
	if i > 0 && (i == len(cs) || x-cs[i-1].X <= cs[i].X-x) {
		best = i - 1
	}
	return best, math.Abs(cs[best].X-x) <= o.Step/2+1e-3
}

// priceEvaluation prices the snapped positions with the search's own arithmetic
// (LayoutProblem.Price) and records the pieces with the limits they break. ok is false when
// the pieces cannot be formed or no vehicle tier takes them all.
func (o *Outcome) priceEvaluation(e *Evaluation) (Layout, bool) {
	for i := 1; i < len(e.Splices); i++ {
		a, b := e.Splices[i-1], e.Splices[i]
		if a.Candidate >= 0 && a.Candidate == b.Candidate {
			e.Reasons = append(e.Reasons, fmt.Sprintf("S%d and S%d are at the same scan position %s", i, i+1, metres(b.X)))
			return Layout{}, false
		}
	}
	if slices.ContainsFunc(e.Splices, func(p PlacedPosition) bool { return p.Candidate < 0 }) {
		return Layout{}, false
	}
	p := o.layoutProblem()
	all := p.Sites
	p.Sites, p.Alternatives = nil, 0
	sites := make([]int, len(e.Splices))
	for i, sp := range e.Splices {
		site := Site{X: sp.X, Candidate: sp.Candidate}
		if sp.Feasible {
			site.Cost, site.Mass = sp.Design.Cost, sp.Design.Mass()
		}
		p.Sites, sites[i] = append(p.Sites, site), i
	}
	l, ok := p.Price(sites)
	for i, pc := range l.Pieces {
		e.Pieces = append(e.Pieces, EvaluatedPiece{Piece: pc, Breaks: p.breaches(pc, len(sites) == 0)})
		for _, b := range e.Pieces[i].Breaks {
			e.Reasons = append(e.Reasons, fmt.Sprintf("piece %d (%s to %s): %s (%s)", i+1, metres(pc.From), metres(pc.To), b.Message, b.Key))
		}
	}
	if !ok && !slices.ContainsFunc(e.Pieces, func(pc EvaluatedPiece) bool { return len(pc.Breaks) > 0 }) {
		e.Reasons = append(e.Reasons, p.noCommonTier(l.Pieces))
	}
	// the search's sites are the feasible candidates: index them as it does
	for i := range l.Sites {
		l.Sites[i], _ = slices.BinarySearchFunc(all, e.Splices[i].Candidate, func(s Site, c int) int { return cmp.Compare(s.Candidate, c) })
	}
	return l, ok
}

// countReasons adds the splice-count limits of the job.
func (o *Outcome) countReasons(e *Evaluation) {
	n, s := len(e.Splices), o.Setup
	if n < s.MinSplices {
		e.Reasons = append(e.Reasons, fmt.Sprintf("%d splice(s), fewer than the %d the job asks for at least (limits.splices.min)", n, s.MinSplices))
	}
	if s.MaxSplices >= 0 && n > s.MaxSplices {
		e.Reasons = append(e.Reasons, fmt.Sprintf("%d splice(s), more than the %d the job allows (limits.splices.max)", n, s.MaxSplices))
	}
}

// breaches lists the limits a piece breaks, with the tolerances of the search; the
// unspliced beam is exempt from the minimum length, as in the search.
func (p *LayoutProblem) breaches(pc Piece, unspliced bool) []Breach {
	var out []Breach
	lim := p.Limits
	if !(pc.Length > 0) {
		out = append(out, Breach{Key: "splice.gap", Label: "no length",
			Message: fmt.Sprintf("the splices are closer than the gap of %g mm", p.Gap)})
		return out
	}
	if pc.Length > lim.MaxLength+lengthTol {
		out = append(out, Breach{Key: "limits.max_piece_length", Label: "over max length",
			Message: fmt.Sprintf("%s long, over max_piece_length %s", metres(pc.Length), metres(lim.MaxLength))})
	}
	if !unspliced && pc.Length < lim.MinLength-lengthTol {
		out = append(out, Breach{Key: "limits.min_piece_length", Label: "under min length",
			Message: fmt.Sprintf("%s long, under min_piece_length %s", metres(pc.Length), metres(lim.MinLength))})
	}
	if pc.Mass > lim.MaxMass+massTol {
		out = append(out, Breach{Key: "limits.max_piece_mass", Label: "over max mass",
			Message: fmt.Sprintf("%s, over max_piece_mass %s", kg(pc.Mass), kg(lim.MaxMass))})
	}
	if len(p.Vehicles) == 0 {
		return out
	}
	longest, payload := 0.0, 0.0
	for _, v := range p.Vehicles {
		longest, payload = math.Max(longest, v.MaxLength), math.Max(payload, v.Payload)
	}
	if pc.Length > longest+lengthTol && longest < lim.MaxLength {
		out = append(out, Breach{Key: "vehicles", Label: "longer than every vehicle",
			Message: fmt.Sprintf("%s long, longer than every vehicle (at most %s)", metres(pc.Length), metres(longest))})
	}
	if pc.Mass > payload+massTol && payload < lim.MaxMass {
		out = append(out, Breach{Key: "vehicles", Label: "heavier than every payload",
			Message: fmt.Sprintf("%s, heavier than every vehicle's payload (at most %s)", kg(pc.Mass), kg(payload))})
	}
	return out
}

// noCommonTier says why no vehicle tier takes pieces that each fit one.
func (p *LayoutProblem) noCommonTier(pieces []Piece) string {
	longest, heaviest := 0.0, 0.0
	for _, pc := range pieces {
		longest, heaviest = math.Max(longest, pc.Length), math.Max(heaviest, pc.Mass)
	}
	var fit []string
	for _, v := range p.Vehicles {
		fit = append(fit, fmt.Sprintf("%s takes %s and %s", v.Name, metres(v.MaxLength), kg(v.Payload)))
	}
	return fmt.Sprintf("no one vehicle takes every piece: the longest is %s, the heaviest %s; %s (vehicles)",
		metres(longest), kg(heaviest), strings.Join(fit, ", "))
}

// WithLayout returns a copy of the outcome whose only layout, and so the recommended one, is
// the feasible evaluated layout e (from o.Evaluate), with its splices checked in full
// (Chosen) and a note that compares it with the search's recommendation; Placed is set. The
// scan, the envelopes and the member checks are shared with o, which is left unchanged.
// Every renderer of an outcome (the report, its JSON) then describes the hand-placed layout.
func (o *Outcome) WithLayout(e Evaluation) (*Outcome, error) {
	if !e.Feasible {
		return nil, fmt.Errorf("the layout is not admissible: %s", strings.Join(e.Reasons, "; "))
	}
	c := *o
	c.Layouts = LayoutResult{ByCount: []Layout{e.Layout}}
	c.Identical, c.UniformRule = UniformResult{}, false
	c.Pick = LayoutRef{Kind: KindBest, Index: 0}
	c.Infeasible, c.Diagnosis = nil, nil // the placed layout meets every limit
	c.Placed = true
	c.Notes = append(slices.Clone(o.Notes), placedNote(e, o.Infeasible == nil))
	chosen, err := c.Sheets(e.Layout.Splices)
	if err != nil {
		return nil, err
	}
	c.Chosen = chosen
	return &c, nil
}

// placedNote says where the hand-placed layout's splices are and what it costs against the
// search's recommendation.
func placedNote(e Evaluation, optimum bool) string {
	note := fmt.Sprintf("the layout of this report was placed by hand (spanbreak view): splices at %s, total %.2f",
		positionList(e.Layout.Splices), e.Layout.Cost.Total)
	if !optimum {
		return note
	}
	switch d := e.Difference; {
	case d > 0:
		note += fmt.Sprintf(", %.2f more than", d)
	case d < 0:
		note += fmt.Sprintf(", %.2f less than", -d) // only when the search stopped at its work bound
	default:
		note += ", the same as"
	}
	return note + fmt.Sprintf(" the optimiser's recommended layout (splices at %s, total %.2f)",
		positionList(e.Optimum.Splices), e.Optimum.Cost.Total)
}

// positionList lists positions [mm] in metres, "13.25, 26.85 m", or "none".
func positionList(xs []float64) string {
	if len(xs) == 0 {
		return "none"
	}
	s := make([]string, len(xs))
	for i, x := range xs {
		s[i] = fmt.Sprintf("%g", roundTo(x/1e3, 6))
	}
	return strings.Join(s, ", ") + " m"
}
