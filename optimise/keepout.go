package optimise

import (
	"fmt"
	"math"
	"slices"
	"sort"

	"spanbreak/beam"
)

// Zone is a stretch of the beam where no splice may go, with the reason in words and the
// job-file key that made it.
type Zone struct {
	From, To float64 // [mm], closed: a position at From or To is inside
	Reason   string  // e.g. "keep-out: 1 m each side of the support at 10.5 m"
	Key      string  // job-file key path, e.g. "limits.keep_out.supports"
}

// zoneTol absorbs rounding of positions on a zone boundary [mm].
const zoneTol = 1e-6

// Contains reports whether x [mm] is inside the zone.
func (z Zone) Contains(x float64) bool { return x >= z.From-zoneTol && x <= z.To+zoneTol }

// KeepOutSpec are the keep-out distances and ranges [mm].
type KeepOutSpec struct {
	Supports   float64      // each side of every support; 0 for none
	PointLoads float64      // each side of every point force and point moment; 0 for none
	Ranges     [][2]float64 // user ranges [from, to]
}

// KeepOutZones lists the zones of a beam, in this order: around supports, around point forces
// and point moments (of every load case), the user ranges, then the ends of the beam closer
// than minPiece [mm] (no piece may be that short). A zero distance makes no zone.
func KeepOutZones(m beam.Model, cases []beam.Case, k KeepOutSpec, minPiece float64) []Zone {
	var pts []PointAction
	for _, c := range cases {
		for _, l := range c.Loads {
			switch l.Kind {
			case beam.PointForce:
				pts = append(pts, PointAction{l.X1, "the point load of case " + c.Name})
			case beam.PointMoment:
				pts = append(pts, PointAction{l.X1, "the point moment of case " + c.Name})
			}
		}
	}
	return keepOutZones(m, pts, k, minPiece)
}

// PointAction is where a point load or point moment acts, and what it is in words.
type PointAction struct {
	X    float64 // [mm]
	What string
}

// tableJumps are the jumps of an imported table away from the supports: the point loads and
// moments of the analysis the table comes from.
func tableJumps(m beam.Model, st []beam.Station) []PointAction {
	var out []PointAction
	for i := 1; i < len(st); i++ {
		if st[i].X != st[i-1].X || slices.ContainsFunc(m.Supports, func(s beam.Support) bool { return math.Abs(s.X-st[i].X) <= zoneTol }) {
			continue
		}
		if len(out) == 0 || out[len(out)-1].X != st[i].X {
			out = append(out, PointAction{st[i].X, "the jump of the forces table (a point load or moment)"})
		}
	}
	return out
}

func keepOutZones(m beam.Model, pts []PointAction, k KeepOutSpec, minPiece float64) []Zone {
	var zones []Zone
	if k.Supports > 0 {
		for _, s := range m.Supports {
			zones = append(zones, Zone{From: s.X - k.Supports, To: s.X + k.Supports, Key: "limits.keep_out.supports",
				Reason: fmt.Sprintf("keep-out: %s each side of the support at %s", metres(k.Supports), metres(s.X))})
		}
	}
	if k.PointLoads > 0 {
		pts = slices.Clone(pts)
		sort.SliceStable(pts, func(i, j int) bool { return pts[i].X < pts[j].X })
		for _, p := range pts {
			zones = append(zones, Zone{From: p.X - k.PointLoads, To: p.X + k.PointLoads, Key: "limits.keep_out.point_loads",
				Reason: fmt.Sprintf("keep-out: %s each side of %s at %s", metres(k.PointLoads), p.What, metres(p.X))})
		}
	}
	for i, r := range k.Ranges {
		zones = append(zones, Zone{From: r[0], To: r[1], Key: fmt.Sprintf("limits.keep_out.ranges[%d]", i),
			Reason: fmt.Sprintf("keep-out: the range %s to %s", metres(r[0]), metres(r[1]))})
	}
	if minPiece > 0 {
		zones = append(zones,
			Zone{From: 0, To: minPiece - 2*zoneTol, Key: "limits.min_piece_length",
				Reason: fmt.Sprintf("closer than min_piece_length %s to the left end", metres(minPiece))},
			Zone{From: m.Length - minPiece + 2*zoneTol, To: m.Length, Key: "limits.min_piece_length",
				Reason: fmt.Sprintf("closer than min_piece_length %s to the right end", metres(minPiece))})
	}
	return zones
}

// metres formats a length [mm] in metres for messages, "10.5 m".
func metres(mm float64) string {
	if math.IsInf(mm, 1) {
		return "unlimited"
	}
	return fmt.Sprintf("%g m", roundTo(mm/1e3, 6))
}
