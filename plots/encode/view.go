package encode

import (
	"fmt"
	"math"

	"spanbreak/beam"
	"spanbreak/optimise"
)

// The documents of `spanbreak view`: the beam the page draws (GET /api/beam) and a layout
// placed by hand, priced by the optimiser's rules (POST /api/layout). The optimise document
// itself (GET /api/result) is Optimise.

// ViewUnits are the units of the view documents.
func ViewUnits() map[string]string {
	u := optimiseUnits()
	for k, v := range AnalysisUnits() {
		if _, ok := u[k]; !ok {
			u[k] = v
		}
	}
	u["gap"], u["asked"], u["difference"] = "mm", "m", "currency of the job's rates"
	u["max_length"], u["payload"], u["steel_mass_kg"], u["rigging"] = "m", "kg", "kg", "kg"
	return u
}

// BreachDoc is one limit a piece breaks: the job-file key, a few words for the drawing and
// the sentence with the figures.
type BreachDoc struct {
	Key     string `json:"key"`
	Label   string `json:"label"`
	Message string `json:"message"`
}

// EvaluatedPieceDoc is one piece of a hand-placed layout (units: m, kg).
type EvaluatedPieceDoc struct {
	PieceDoc
	SteelMass  Num         `json:"steel_mass_kg"`
	SpliceMass Num         `json:"splice_mass_kg"`
	Breaks     []BreachDoc `json:"breaks"`
}

// PlacedDesignDoc is one splice of a hand-placed layout: its name from the left, the
// position asked for, and the scan position it snapped to in the shape of a candidate of the
// optimise document (x, feasible, reason, cost, bolts, splice, utilisation, governing, ...).
type PlacedDesignDoc struct {
	Name  string `json:"name"`
	Asked Num    `json:"asked"`
	CandidateDoc
}

// EvaluationDoc is the answer of POST /api/layout: the layout through exactly the positions
// asked (each snapped to the scan grid), priced as the optimiser prices one. Cost, vehicle
// and difference are null unless the layout is feasible; difference is its total minus the
// optimum's, null when no layout fits the job.
type EvaluationDoc struct {
	Feasible   bool                `json:"feasible"`
	Reasons    []string            `json:"reasons"`
	Splices    []Num               `json:"splices"`
	Pieces     []EvaluatedPieceDoc `json:"pieces"`
	Vehicle    *string             `json:"vehicle"`
	Trips      int                 `json:"trips"`
	Cost       *CostDoc            `json:"cost"`
	Designs    []PlacedDesignDoc   `json:"designs"`
	Optimum    *LayoutDoc          `json:"optimum"`
	Difference *Num                `json:"difference"`
}

// Evaluation is the document of an evaluated layout of an outcome.
func Evaluation(o *optimise.Outcome, e optimise.Evaluation) EvaluationDoc {
	j := EvaluationDoc{Feasible: e.Feasible, Reasons: append([]string{}, e.Reasons...), Splices: []Num{},
		Pieces: []EvaluatedPieceDoc{}, Designs: []PlacedDesignDoc{}}
	for i, sp := range e.Splices {
		j.Splices = append(j.Splices, Num(sp.X*ToM))
		d := PlacedDesignDoc{Name: fmt.Sprintf("S%d", i+1), Asked: Num(sp.Asked * ToM)}
		if sp.Candidate >= 0 {
			d.CandidateDoc = candidateDoc(o.Candidates[sp.Candidate])
		} else {
			d.CandidateDoc = CandidateDoc{X: Num(sp.X * ToM), Reason: ptr(sp.Reason)}
		}
		j.Designs = append(j.Designs, d)
	}
	for _, p := range e.Pieces {
		pd := EvaluatedPieceDoc{PieceDoc: PieceDoc{Num(p.From * ToM), Num(p.To * ToM), Num(p.Length * ToM), Num(p.Mass)},
			SteelMass: Num(p.SteelMass), SpliceMass: Num(p.SpliceMass), Breaks: []BreachDoc{}}
		for _, b := range p.Breaks {
			pd.Breaks = append(pd.Breaks, BreachDoc(b))
		}
		j.Pieces = append(j.Pieces, pd)
	}
	if e.Feasible {
		l := layoutDoc(e.Layout, "placed", false)
		j.Vehicle, j.Trips, j.Cost = l.Vehicle, l.Trips, &l.Cost
	}
	if o.Infeasible == nil {
		j.Optimum = ptr(layoutDoc(o.Recommended(), "best", true))
		if e.Feasible {
			j.Difference = NumPtr(e.Difference)
		}
	}
	return j
}

// ViewSupportDoc is a support of the beam (x m).
type ViewSupportDoc struct {
	X    Num    `json:"x"`
	Kind string `json:"kind"`
}

// ViewZoneDoc is a keep-out zone (from, to m), with its reason and job-file key.
type ViewZoneDoc struct {
	From   Num    `json:"from"`
	To     Num    `json:"to"`
	Reason string `json:"reason"`
	Key    string `json:"key"`
}

// ViewLimitsDoc are the piece limits; null for none.
type ViewLimitsDoc struct {
	MaxPieceLength *Num `json:"max_piece_length"`
	MinPieceLength Num  `json:"min_piece_length"`
	MaxPieceMass   *Num `json:"max_piece_mass"`
	Rigging        Num  `json:"rigging"`
	SplicesMin     int  `json:"splices_min"`
	SplicesMax     *int `json:"splices_max"`
}

// ViewVehicleDoc is one vehicle tier (max_length m, payload kg, cost per trip).
type ViewVehicleDoc struct {
	Name      string `json:"name"`
	MaxLength Num    `json:"max_length"`
	Payload   Num    `json:"payload"`
	Cost      Num    `json:"cost"`
}

// ViewBeamDoc is the answer of GET /api/beam: what the page draws under the splices — the
// beam with its supports, hinges and keep-out zones, the ULS and SLS envelopes at the
// outcome's chart stations (in the shape of the analyse document), the limits and vehicles,
// and the scan step the splices snap to. Deflection is false when the forces come from a
// table without w.
type ViewBeamDoc struct {
	Input      string            `json:"input"`
	Version    string            `json:"version"`
	Title      string            `json:"title"`
	Units      map[string]string `json:"units"`
	Section    string            `json:"section"`
	Grade      string            `json:"grade"`
	Length     Num               `json:"length"`
	Step       Num               `json:"step"`
	Gap        Num               `json:"gap"`
	Supports   []ViewSupportDoc  `json:"supports"`
	Hinges     []Num             `json:"hinges"`
	KeepOut    []ViewZoneDoc     `json:"keep_out"`
	Stations   []Num             `json:"stations"`
	ULS        envelopeDoc       `json:"uls"`
	SLS        envelopeDoc       `json:"sls"`
	Deflection bool              `json:"deflection"`
	Limits     ViewLimitsDoc     `json:"limits"`
	Vehicles   []ViewVehicleDoc  `json:"vehicles"`
	Lift       Num               `json:"lift"`
	Caution    string            `json:"caution"`
}

// finite is a limit that may be +Inf: null for none.
func finite(v, f float64) *Num {
	if math.IsInf(v, 1) {
		return nil
	}
	return NumPtr(v * f)
}

// ViewBeam is the document of the beam of an outcome.
func ViewBeam(o *optimise.Outcome) ViewBeamDoc {
	s, env := o.Setup, &o.Envelopes
	j := ViewBeamDoc{Input: s.File, Version: Version(), Title: s.Title, Units: ViewUnits(), Section: s.Section.Name, Grade: s.Grade.Name,
		Length: Num(s.Model.Length * ToM), Step: Num(o.Step * ToM), Gap: Num(o.Gap()), Supports: []ViewSupportDoc{},
		Hinges: Nums(s.Model.Hinges, ToM), KeepOut: []ViewZoneDoc{}, Stations: stationXs(env.Stations),
		ULS: toEnvelopeDoc(env, &env.ULS, env.ULSReactions), SLS: toEnvelopeDoc(env, &env.SLS, env.SLSReactions),
		Deflection: s.Table == nil || s.Table.Deflection(), Vehicles: []ViewVehicleDoc{}, Lift: Num(s.Lift), Caution: Caution,
		Limits: ViewLimitsDoc{MaxPieceLength: finite(o.Limits.MaxLength, ToM), MinPieceLength: Num(o.Limits.MinLength * ToM),
			MaxPieceMass: finite(o.Limits.MaxMass, 1), Rigging: Num(o.Limits.Rigging), SplicesMin: s.MinSplices}}
	if s.MaxSplices >= 0 {
		j.Limits.SplicesMax = ptr(s.MaxSplices)
	}
	for _, sp := range s.Model.Supports {
		j.Supports = append(j.Supports, ViewSupportDoc{Num(sp.X * ToM), sp.Kind.String()})
	}
	for _, z := range s.Zones {
		j.KeepOut = append(j.KeepOut, ViewZoneDoc{Num(math.Max(0, z.From) * ToM), Num(math.Min(s.Model.Length, z.To) * ToM), z.Reason, z.Key})
	}
	for _, v := range s.Vehicles {
		j.Vehicles = append(j.Vehicles, ViewVehicleDoc{v.Name, Num(v.MaxLength * ToM), Num(v.Payload), Num(v.Cost)})
	}
	return j
}

// stationXs are the stations' positions [m].
func stationXs(st []beam.Station) []Num {
	out := make([]Num, len(st))
	for i, s := range st {
		out[i] = Num(s.X * ToM)
	}
	return out
}

// toEnvelopeDoc is one limit state's envelope as the page draws it (the chart stations only,
// so it is held whole).
func toEnvelopeDoc(env *beam.Envelopes, e *beam.Envelope, re []beam.ReactionEnvelope) envelopeDoc {
	values := func(ex []beam.Extreme, f float64) []Num {
		out := make([]Num, len(ex))
		for i, x := range ex {
			out[i] = Num(x.Value * f)
		}
		return out
	}
	names := newGoverning(env)
	governing := func(ex []beam.Extreme) []string {
		out := make([]string, len(ex))
		for i, x := range ex {
			out[i] = names.text(x)
		}
		return out
	}
	return envelopeDoc{
		MMax: values(e.MMax, ToKNm), MMin: values(e.MMin, ToKNm),
		VMax: values(e.VMax, ToKN), VMin: values(e.VMin, ToKN),
		NMax: values(e.NMax, ToKN), NMin: values(e.NMin, ToKN),
		WMax: values(e.WMax, 1), WMin: values(e.WMin, 1),
		Governing: map[string][]string{
			"M_max": governing(e.MMax), "M_min": governing(e.MMin),
			"V_max": governing(e.VMax), "V_min": governing(e.VMin),
		},
		Reactions: reactionDocs(env, re),
	}
}
