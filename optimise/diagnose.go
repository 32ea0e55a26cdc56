package optimise

import (
	"fmt"
	"math"
	"slices"
)

// diagnose explains why no layout satisfies the limits: it lifts one limit at a time and names
// the first whose removal admits a layout; if none does alone, the stretch of beam without an
// admissible splice position that is longer than any piece may be.
func diagnose(p LayoutProblem) error {
	feasible := func(q LayoutProblem) (Layout, bool) {
		q.Alternatives, q.Extra = 0, 0
		r, ok := newSearch(&q).byCount()
		if !ok {
			return Layout{}, false
		}
		return r.ByCount[r.Recommended], true
	}
	if p.MaxSplices >= 0 || p.MinSplices > 0 {
		q := p
		q.MinSplices, q.MaxSplices = 0, -1
		if l, ok := feasible(q); ok {
			if k := len(l.Sites); p.MaxSplices >= 0 && k > p.MaxSplices {
				return tooFewSplices(p, k, feasible)
			}
			return &LimitError{Key: "limits.splices.min", Message: fmt.Sprintf(
				"at least %d splice(s) asked for, but no layout with that many satisfies the piece limits "+
					"(min_piece_length %s and the admissible positions); the fewest that do: %d",
				p.MinSplices, metres(p.Limits.MinLength), len(l.Sites))}
		}
	}
	type trial struct {
		key   string
		apply bool
		relax func(*LayoutProblem)
		say   func(l Layout) string
	}
	heaviest := func(l Layout) float64 {
		m := 0.0
		for _, pc := range l.Pieces {
			m = math.Max(m, pc.Mass)
		}
		return m
	}
	longest := func(l Layout) float64 {
		m := 0.0
		for _, pc := range l.Pieces {
			m = math.Max(m, pc.Length)
		}
		return m
	}
	maxPayload, maxVehicle := 0.0, 0.0
	for _, v := range p.Vehicles {
		maxPayload, maxVehicle = math.Max(maxPayload, v.Payload), math.Max(maxVehicle, v.MaxLength)
	}
	trials := []trial{
		{"limits.max_piece_mass", !math.IsInf(p.Limits.MaxMass, 1),
			func(q *LayoutProblem) { q.Limits.MaxMass = math.Inf(1) },
			func(l Layout) string {
				return fmt.Sprintf("no layout keeps every piece within max_piece_mass %s; without that limit the best layout has a piece of %s",
					kg(p.Limits.MaxMass), kg(heaviest(l)))
			}},
		{"vehicles", len(p.Vehicles) > 0,
			func(q *LayoutProblem) {
				q.Vehicles = slices.Clone(q.Vehicles)
				for i := range q.Vehicles {
					q.Vehicles[i].Payload = math.Inf(1)
				}
			},
			func(l Layout) string {
				return fmt.Sprintf("no vehicle's payload takes the pieces: the largest payload is %s; without the payload limit the best layout has a piece of %s",
					kg(maxPayload), kg(heaviest(l)))
			}},
		{"limits.min_piece_length", p.Limits.MinLength > 0,
			func(q *LayoutProblem) { q.Limits.MinLength = 0 },
			func(l Layout) string {
				return fmt.Sprintf("min_piece_length %s cannot be met with the admissible splice positions and the other limits",
					metres(p.Limits.MinLength))
			}},
		{"limits.max_piece_length", !math.IsInf(p.Limits.MaxLength, 1),
			func(q *LayoutProblem) { q.Limits.MaxLength = math.Inf(1) },
			func(l Layout) string {
				return fmt.Sprintf("no layout keeps every piece within max_piece_length %s; without that limit the best layout has a piece of %s",
					metres(p.Limits.MaxLength), metres(longest(l)))
			}},
		{"vehicles", len(p.Vehicles) > 0,
			func(q *LayoutProblem) {
				q.Vehicles = slices.Clone(q.Vehicles)
				for i := range q.Vehicles {
					q.Vehicles[i].MaxLength = math.Inf(1)
				}
			},
			func(l Layout) string {
				return fmt.Sprintf("no vehicle takes the pieces: the longest max_length is %s, the best layout without it has a piece of %s",
					metres(maxVehicle), metres(longest(l)))
			}},
	}
	for _, t := range trials {
		if !t.apply {
			continue
		}
		q := p
		t.relax(&q)
		if l, ok := feasible(q); ok {
			return &LimitError{Key: t.key, Message: t.say(l)}
		}
	}
	return stretchError(p)
}

// tooFewSplices explains a splices.max below the k splices the pieces need: it names the
// length or mass limit that, lifted alone, lets the beam be cut within splices.max. When that
// limit is the vehicles' length (a lone short vehicle, say), the error points at the longest
// vehicle's max_length, which the user may not have seen as a piece limit.
func tooFewSplices(p LayoutProblem, k int, feasible func(LayoutProblem) (Layout, bool)) error {
	longest := -1 // the vehicle that takes the longest pieces
	for i, v := range p.Vehicles {
		if longest < 0 || v.MaxLength > p.Vehicles[longest].MaxLength {
			longest = i
		}
	}
	relaxed := func(relax func(*LayoutProblem)) bool {
		q := p
		q.Vehicles = slices.Clone(p.Vehicles)
		relax(&q)
		_, ok := feasible(q)
		return ok
	}
	allowed := fmt.Sprintf("limits.splices.max allows at most %d", p.MaxSplices)
	if longest >= 0 && p.Vehicles[longest].MaxLength < p.Limits.MaxLength &&
		relaxed(func(q *LayoutProblem) {
			for i := range q.Vehicles {
				q.Vehicles[i].MaxLength = math.Inf(1)
			}
		}) {
		v := p.Vehicles[longest]
		return &LimitError{Key: fmt.Sprintf("vehicles[%d].max_length", longest), Message: fmt.Sprintf(
			"the longest vehicle, %s, takes pieces of at most %s (its max_length), for which the %s beam needs at least %d splice(s); %s",
			v.Name, metres(v.MaxLength), metres(p.Length), k, allowed)}
	}
	limits := []struct {
		name  string
		relax func(*LayoutProblem)
	}{
		{"max_piece_length " + metres(p.Limits.MaxLength), func(q *LayoutProblem) { q.Limits.MaxLength = math.Inf(1) }},
		{"max_piece_mass " + kg(p.Limits.MaxMass), func(q *LayoutProblem) { q.Limits.MaxMass = math.Inf(1) }},
		{"the vehicles' payloads", func(q *LayoutProblem) {
			for i := range q.Vehicles {
				q.Vehicles[i].Payload = math.Inf(1)
			}
		}},
	}
	for _, l := range limits {
		if relaxed(l.relax) {
			return &LimitError{Key: "limits.splices.max", Message: fmt.Sprintf(
				"at most %d splice(s) allowed, but %s needs at least %d", p.MaxSplices, l.name, k)}
		}
	}
	return &LimitError{Key: "limits.splices.max", Message: fmt.Sprintf(
		"at most %d splice(s) allowed, but the pieces need at least %d to satisfy the length and mass limits",
		p.MaxSplices, k)}
}

// stretchError names the longest stretch of beam without an admissible splice position.
func stretchError(p LayoutProblem) error {
	allowed := p.Limits.MaxLength
	if len(p.Vehicles) > 0 {
		v := 0.0
		for _, t := range p.Vehicles {
			v = math.Max(v, t.MaxLength)
		}
		allowed = math.Min(allowed, v)
	}
	xs := []float64{0}
	for _, s := range p.Sites {
		xs = append(xs, s.X)
	}
	xs = append(xs, p.Length)
	from, to := 0.0, 0.0
	for i := 1; i < len(xs); i++ {
		if xs[i]-xs[i-1] > to-from {
			from, to = xs[i-1], xs[i]
		}
	}
	e := &LimitError{Key: "limits.keep_out", From: from, To: to}
	switch {
	case len(p.Sites) == 0:
		e.Message = fmt.Sprintf("no admissible splice position on the %s beam, which is longer than the longest piece allowed (%s)",
			metres(p.Length), metres(allowed))
	case to-from > allowed:
		e.Message = fmt.Sprintf("no admissible splice position from %s to %s, a stretch of %s, longer than the longest piece allowed (%s)",
			metres(from), metres(to), metres(to-from), metres(allowed))
	default:
		e.Key = "limits"
		e.Message = fmt.Sprintf("the piece limits together (max_piece_length %s, min_piece_length %s, max_piece_mass %s, "+
			"the vehicles) admit no layout with the admissible splice positions",
			metres(p.Limits.MaxLength), metres(p.Limits.MinLength), kg(p.Limits.MaxMass))
		e.From, e.To = 0, 0
	}
	return e
}

// kg formats a mass for messages, "3500 kg".
func kg(m float64) string {
	if math.IsInf(m, 1) {
		return "unlimited"
	}
	return fmt.Sprintf("%.0f kg", m)
}
