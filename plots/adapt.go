package plots

import (
	"math"

	"spanbreak/optimise"
)

// ScanPoints turns an optimisation's candidates into the points the position charts draw.
func ScanPoints(res *optimise.Outcome) []ScanPoint {
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
func KeepOutRanges(res *optimise.Outcome) []Range {
	s := res.Setup
	out := make([]Range, len(s.Zones))
	for i, z := range s.Zones {
		out[i] = Range{From: math.Max(0, z.From), To: math.Min(s.Model.Length, z.To)}
	}
	return out
}

// LayoutsOf is the layout chart's input: the best layout for each splice count, with the
// recommended one chosen.
func LayoutsOf(res *optimise.Outcome, title, currency string) LayoutInput {
	in := LayoutInput{Title: title, Chosen: -1, Currency: currency}
	if res.Pick.Kind == optimise.KindBest {
		in.Chosen = res.Pick.Index
	}
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
