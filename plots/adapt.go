package plots

import (
	"errors"
	"fmt"
	"math"

	"spanbreak/optimise"
	"spanbreak/splice"
)

// ScanPoints turns an optimisation's candidates into the points the position charts draw.
func ScanPoints(res *optimise.Result) []ScanPoint {
	out := make([]ScanPoint, len(res.Candidates))
	for i, c := range res.Candidates {
		p := ScanPoint{X: c.X, Feasible: c.Feasible, KeepOut: c.Zone != nil, Reason: c.Reason, Rank: c.Rank}
		if c.Zone != nil {
			p.Reason = c.Zone.Reason
		}
		if c.Zone == nil {
			p.Governing = c.Design.Governing
			p.Utilisation = c.Design.Utilisation
		}
		if c.Feasible {
			p.Cost, p.Bolts, p.PlateMass = c.Design.Cost, c.Design.Bolts, c.Design.PlateMass
		}
		out[i] = p
	}
	return out
}

// KeepOutRanges are the keep-out zones of an optimisation as ranges [mm].
func KeepOutRanges(res *optimise.Result) []Range {
	out := make([]Range, len(res.Zones))
	for i, z := range res.Zones {
		out[i] = Range{From: math.Max(0, z.From), To: math.Min(res.Length, z.To)}
	}
	return out
}

// LayoutsOf is the layout chart's input: the best layout for each splice count, with the
// recommended one chosen.
func LayoutsOf(res *optimise.Result, title, currency string) LayoutInput {
	in := LayoutInput{Title: title, Chosen: res.Layouts.Recommended, Currency: currency}
	for _, l := range res.Layouts.ByCount {
		in.Layouts = append(in.Layouts, layoutOf(l))
	}
	return in
}

func layoutOf(l optimise.Layout) Layout {
	out := Layout{Splices: append([]float64(nil), l.Splices...), Vehicle: l.Vehicle, Trips: l.Trips,
		Cost: LayoutCost{Splices: l.Cost.Splices, Transport: l.Cost.Transport, Erection: l.Cost.Erection, Total: l.Cost.Total}}
	for _, p := range l.Pieces {
		out.Pieces = append(out.Pieces, Piece{From: p.From, To: p.To, Mass: p.Mass})
	}
	return out
}

// SpliceSheet is one splice of the chosen layout with its full calculation.
type SpliceSheet struct {
	Name     string  // "S1", "S2", ... from the left
	Position float64 // [mm]
	Forces   optimise.PositionForces
	Result   splice.Result // every check with its formula, numbers and clause
}

// ChosenSplices re-checks the splice the scan sized at each position of a layout, this time
// with the full calculation trace (the scan keeps only the numbers), and returns the sheets
// from the left.
func ChosenSplices(s *optimise.Setup, res *optimise.Result, layout optimise.Layout) ([]SpliceSheet, error) {
	p, err := s.SpliceProblem()
	if err != nil {
		return nil, err
	}
	p.Brief = false
	var sheets []SpliceSheet
	var errs []error
	for i, x := range layout.Splices {
		c := candidateAt(res.Candidates, x)
		if c == nil || !c.Feasible {
			errs = append(errs, fmt.Errorf("splice %d at %s: no feasible candidate at that position", i+1, fmtM(x)))
			continue
		}
		sized, ok := c.Design.Detail.(splice.Result)
		if !ok {
			errs = append(errs, fmt.Errorf("splice %d at %s: the scan kept no splice geometry", i+1, fmtM(x)))
			continue
		}
		q := p
		q.ULS = splice.Forces(c.Forces.ULS)
		sls := splice.Forces(c.Forces.SLS)
		q.SLS = &sls
		r, err := splice.Verify(q, sized.Geometry)
		if err != nil {
			errs = append(errs, fmt.Errorf("splice %d at %s: %w", i+1, fmtM(x), err))
			continue
		}
		sheets = append(sheets, SpliceSheet{Name: fmt.Sprintf("S%d", i+1), Position: x, Forces: c.Forces, Result: r})
	}
	return sheets, errors.Join(errs...)
}

// candidateAt is the candidate at x [mm] (within a micrometre), or nil.
func candidateAt(cands []optimise.Candidate, x float64) *optimise.Candidate {
	for i := range cands {
		if math.Abs(cands[i].X-x) < 1e-3 {
			return &cands[i]
		}
	}
	return nil
}
