package optimise

import (
	"errors"
	"fmt"
	"math"

	"spanbreak/splice"
)

// SpliceSheet is one splice of a layout with its full calculation.
type SpliceSheet struct {
	Name     string  // "S1", "S2", ... from the left
	Position float64 // [mm]
	Forces   PositionForces
	Origins  PositionOrigins // the combination and pattern of every design force
	Section  SectionCheck    // the beam's own cross-section under the same forces
	Result   splice.Result   // every check with its formula, numbers and clause
}

// Sheets re-checks the splice the scan sized at each of the positions xs [mm] (candidates of
// the scan), this time with the full calculation trace (the scan keeps only the numbers), and
// returns the sheets from the left, named S1, S2, ….
func (o *Outcome) Sheets(xs []float64) ([]SpliceSheet, error) {
	p := o.Setup.Splice
	p.Brief = false
	var sheets []SpliceSheet
	var errs []error
	_, origins, err := o.Source.Traced(xs)
	if err != nil {
		return nil, err
	}
	for i, x := range xs {
		c := o.CandidateAt(x)
		if c == nil || !c.Feasible {
			errs = append(errs, fmt.Errorf("splice %d at %s: no feasible candidate at that position", i+1, metres(x)))
			continue
		}
		q := p
		q.ULS = splice.Forces(c.Forces.ULS)
		sls := splice.Forces(c.Forces.SLS)
		q.SLS = &sls
		if c.Design.Geometry == nil {
			errs = append(errs, fmt.Errorf("splice %d at %s: the designer kept no splice there", i+1, metres(x)))
			continue
		}
		r, err := splice.Verify(q, *c.Design.Geometry)
		if err != nil {
			errs = append(errs, fmt.Errorf("splice %d at %s: %w", i+1, metres(x), err))
			continue
		}
		sec, err := o.Setup.SectionAt(c.Forces.ULS)
		if err != nil {
			errs = append(errs, fmt.Errorf("splice %d at %s: %w", i+1, metres(x), err))
			continue
		}
		sheets = append(sheets, SpliceSheet{Name: fmt.Sprintf("S%d", i+1), Position: x, Forces: c.Forces, Origins: origins[i],
			Section: sec, Result: r})
	}
	return sheets, errors.Join(errs...)
}

// CandidateAt is the candidate at x [mm] (within a micrometre), or nil.
func (o *Outcome) CandidateAt(x float64) *Candidate {
	for i := range o.Candidates {
		if math.Abs(o.Candidates[i].X-x) < 1e-3 {
			return &o.Candidates[i]
		}
	}
	return nil
}

// SpliceBill is one splice's bill of materials.
type SpliceBill struct {
	Name      string  // as its sheet, "S1"
	Position  float64 // [mm]
	Materials splice.Materials
}

// LayoutBill is the bill of materials of the recommended layout: each splice's, from the left,
// and their sum with identical items added up (splice.SumMaterials).
type LayoutBill struct {
	Splices []SpliceBill
	Total   splice.Materials
}

// Bill is the bill of materials of the recommended layout, from its sheets (Outcome.Chosen);
// empty when no layout fits or the layout has no splice.
func (o *Outcome) Bill() LayoutBill {
	var b LayoutBill
	ms := make([]splice.Materials, 0, len(o.Chosen))
	for _, sh := range o.Chosen {
		m := sh.Result.Materials(o.Setup.Splice.PlateSteel.Name)
		b.Splices = append(b.Splices, SpliceBill{Name: sh.Name, Position: sh.Position, Materials: m})
		ms = append(ms, m)
	}
	b.Total = splice.SumMaterials(ms...)
	return b
}
