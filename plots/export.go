package plots

import (
	"math"

	"spanbreak/optimise"
	"spanbreak/splice"
)

// SpliceJSON is one splice of the recommended layout in machine-readable form. Units:
// position m, the splice in the keys and units of the splice file (mm), each check's demand
// and resistance in the check's own unit, plate mass kg, cost in the job's currency units.
type SpliceJSON struct {
	Name        string         `json:"name"`
	Position    float64        `json:"position"`
	Summary     string         `json:"summary"`
	Splice      map[string]any `json:"splice"`
	Checks      []CheckJSON    `json:"checks"`
	Utilisation float64        `json:"utilisation"`
	Governing   string         `json:"governing"`
	Cost        float64        `json:"cost"`
	Bolts       int            `json:"bolts"`
	PlateMass   float64        `json:"plate_mass_kg"`
}

// CheckJSON is one check of a splice with the keys of DESIGN.md section 7.
type CheckJSON struct {
	ID          string  `json:"id"`
	Clause      string  `json:"clause"`
	State       string  `json:"state"`
	Formula     string  `json:"formula"`
	Substituted string  `json:"substituted"`
	Demand      float64 `json:"demand"`
	Resistance  float64 `json:"resistance"`
	Unit        string  `json:"unit"`
	Utilisation float64 `json:"utilisation"`
	Pass        bool    `json:"pass"`
}

// ChosenSplicesJSON returns the sheets of the recommended layout as result.json carries them,
// left to right.
func ChosenSplicesJSON(sheets []optimise.SpliceSheet) []SpliceJSON {
	out := []SpliceJSON{}
	for _, sh := range sheets {
		r := sh.Result
		js := SpliceJSON{Name: sh.Name, Position: round6(sh.Position / 1e3), Summary: spliceWords(r.Geometry),
			Splice: geometryJSON(r.Geometry), Utilisation: round6(r.Utilisation), Governing: r.Governing.ID,
			Cost: round6(r.Cost.Total), Bolts: r.Quantities.Bolts, PlateMass: round6(r.Quantities.PlateMass),
			Checks: []CheckJSON{}}
		for _, c := range r.Checks {
			js.Checks = append(js.Checks, CheckJSON{ID: c.ID, Clause: c.Clause, State: c.State, Formula: c.Formula,
				Substituted: c.Substituted, Demand: round6(c.Demand), Resistance: round6(c.Resistance), Unit: c.Unit,
				Utilisation: round6(c.Utilisation), Pass: c.Pass})
		}
		out = append(out, js)
	}
	return out
}

// round6 rounds to six decimals of the output unit (far below any engineering tolerance), so
// machine output does not depend on the last bits of the arithmetic; no negative zero.
func round6(v float64) float64 {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return 0
	}
	r := math.Round(v*1e6) / 1e6
	if r == 0 {
		return 0
	}
	return r
}

// geometryJSON writes a splice in the keys of the splice file (DESIGN.md section 8) [mm].
func geometryJSON(g splice.Geometry) map[string]any {
	f, w := g.Flange, g.Web
	flange := map[string]any{
		"outer":   map[string]any{"thickness": round6(f.Outer.Thickness), "width": round6(f.Outer.Width)},
		"columns": f.Columns, "rows": f.Rows, "gauge": round6(f.Gauge), "pitch": round6(f.Pitch),
		"end": round6(f.End), "edge": round6(f.Edge),
	}
	if f.HasInner() {
		flange["inner"] = map[string]any{"thickness": round6(f.Inner.Thickness), "width": round6(f.Inner.Width)}
	}
	holes := string(g.Holes)
	if holes == "" {
		holes = string(splice.NormalHoles)
	}
	return map[string]any{
		"bolt":           map[string]any{"size": g.Bolt.Size, "class": g.Bolt.Class, "threads_in_shear_plane": g.Bolt.ThreadsInShearPlane},
		"category":       string(g.Category),
		"friction_class": string(g.FrictionClass),
		"holes":          holes,
		"gap":            round6(g.Gap),
		"flange":         flange,
		"web": map[string]any{"thickness": round6(w.Thickness), "depth": round6(w.Depth), "columns": w.Columns,
			"rows": w.Rows, "pitch": round6(w.Pitch), "spacing": round6(w.Spacing), "end": round6(w.End), "edge": round6(w.Edge)},
	}
}
