package optimise

import (
	"cmp"
	"errors"
	"fmt"
	"maps"
	"slices"
	"strconv"
	"strings"

	"spanbreak/beam"
	"spanbreak/optimise/jobfile"
	"spanbreak/splice"
)

// This file holds the checks of a job that need the section or a grade: the limits the
// splice sizing enforces that the job file's own checks (optimise/jobfile) cannot see. Each
// is reported at the key it is about, so that check refuses every job optimise would.

// spliceSpace checks the splice options against the tables of the splice and beam packages,
// each at its own list entry: a bolt size must be one the splice package knows, and a plate
// thickness one the plate grade's strength table covers (EN 1993-1-1 Table 3.1 up to 80 mm,
// the EN 10025 steps up to 100 mm).
func (s *Setup) spliceSpace(probs *jobfile.Problems) {
	opts := s.job.Splice
	if opts == nil {
		return
	}
	if b := opts.Bolts; b != nil {
		for i, size := range b.Sizes {
			at := b.Where(fmt.Sprintf("sizes[%d]", i))
			if probs.About(at.Path) {
				continue
			}
			if _, err := splice.LookupBoltSize(size); err != nil {
				probs.Add(at, "%v", err)
			}
		}
	}
	pl := opts.Plates
	if pl == nil || len(pl.Thicknesses) == 0 {
		return
	}
	grade, table := s.Grade, s.GradeTable
	if strings.TrimSpace(pl.Grade) != "" {
		g, err := beam.LookupGrade(pl.Grade)
		if err != nil {
			return // reported with the splice problem
		}
		grade = g
	}
	for i, t := range pl.Thicknesses {
		at := pl.Where(fmt.Sprintf("thicknesses[%d]", i))
		if probs.About(at.Path) {
			continue
		}
		if _, _, err := grade.Strength(t.MM(), table); err != nil {
			hint := "; choose thinner plates"
			if _, _, e := grade.Strength(t.MM(), beam.TableEN10025); e == nil {
				hint += " or set beam.grade_table: EN10025, whose steps go further"
			}
			probs.Add(at, "the plate grade has no strength for it: %v%s", err, hint)
		}
	}
}

// detailable sizes the splice once without forces, so that a design space that cannot be
// detailed on the section at all — every bolt size too large for the flange or the web — or
// any other refusal of the sizing is reported by check, not first by optimise. The problem is
// placed at the bolt sizes that do not fit, or at the section when the sizes are the defaults.
func (s *Setup) detailable() error {
	p := s.Splice
	_, err := splice.Size(p)
	if err == nil {
		return nil
	}
	var probs jobfile.Problems
	if !errors.Is(err, splice.ErrNoDetailing) {
		probs.Add(s.Where("splice"), "%v", err)
		return probs.Err()
	}
	if p.Detailing != (splice.Detailing{}) {
		q := p
		q.Detailing = splice.Detailing{}
		if _, err := splice.Size(q); err == nil {
			probs.Add(s.Where("splice.detailing"), "the detailing preferences together leave no splice of the design space "+
				"that can be detailed on %s: each layout the gauge allows breaks another preference; relax one of them", s.Section.Name)
			return probs.Err()
		}
	}
	opts := s.job.Splice
	if opts == nil || opts.Bolts == nil || len(opts.Bolts.Sizes) == 0 {
		probs.Add(s.job.Beam.Where("section"), "no splice of the design space (bolts %s) can be detailed on %s: "+
			"its flange (b = %g mm) is too narrow for two bolt lines or its web too shallow for two bolt rows; "+
			"give smaller bolts in splice.bolts.sizes", strings.Join(p.Sizing.Space.Sizes, ", "), s.Section.Name, s.Section.B)
		return probs.Err()
	}
	for i, size := range opts.Bolts.Sizes {
		q := p
		q.Sizing.Space.Sizes = []string{size}
		if _, err := splice.Size(q); errors.Is(err, splice.ErrNoDetailing) {
			probs.Add(opts.Bolts.Where(fmt.Sprintf("sizes[%d]", i)), "%s bolts cannot be detailed on %s: its flange "+
				"(b = %g mm) is too narrow for two bolt lines of them, or its web too shallow for two bolt rows",
				size, s.Section.Name, s.Section.B)
		}
	}
	if len(probs) == 0 { // a safeguard: the sizes fail together though each alone may be detailed
		probs.Add(opts.Bolts.Where("sizes"), "%v", err)
	}
	return probs.Err()
}

// preferences checks the splice's detailing preferences against the section and the design
// space, each at its own key, so that check refuses what the sizing could not honour: the
// bolt-size bounds must be sizes the splice package knows and leave a size to try; the least
// cover-plate thickness must be reached by the listed plates; a fixed flange gauge must be
// detailable with some bolt size and number of lines (EN 1993-1-8 Table 3.3, the washers'
// clearance to the fillets or welds). What the preferences leave out without refusing the
// job — layouts a gauge cannot take, a table of gauges with no entry for the section — is
// said in the notes.
func (s *Setup) preferences() error {
	opts := s.job.Splice
	if opts == nil {
		return nil
	}
	var probs jobfile.Problems
	s.boltBounds(&probs)
	s.plateRatio(&probs)
	if len(probs) == 0 {
		s.gauge(&probs)
	}
	return probs.Err()
}

// boltBounds checks splice.bolts.min_size and max_size against the known sizes and the list
// they filter.
func (s *Setup) boltBounds(probs *jobfile.Problems) {
	b := s.job.Splice.Bolts
	if b == nil || (b.MinSize == "" && b.MaxSize == "") {
		return
	}
	bad := false
	for _, k := range []struct{ key, size string }{{"min_size", b.MinSize}, {"max_size", b.MaxSize}} {
		if k.size == "" {
			continue
		}
		if _, err := splice.LookupBoltSize(k.size); err != nil {
			probs.Add(b.Where(k.key), "%v", err)
			bad = true
		}
	}
	if bad || len(s.BoltSizes) > 0 {
		return
	}
	key, bound := "min_size", "at "+b.MinSize+" or larger"
	switch {
	case b.MinSize != "" && b.MaxSize != "":
		bound = "from " + b.MinSize + " to " + b.MaxSize
	case b.MinSize == "":
		key, bound = "max_size", "at "+b.MaxSize+" or smaller"
	}
	probs.Add(b.Where(key), "leaves no bolt size to try: none of the sizes %s (%s) lies %s",
		strings.Join(s.Splice.Sizing.Space.Sizes, ", "), s.sizesOrigin(), bound)
}

// sizesOrigin says where the list of bolt sizes comes from.
func (s *Setup) sizesOrigin() string {
	switch {
	case s.job.Splice != nil && s.job.Splice.Has("bolts.sizes"):
		return "splice.bolts.sizes"
	case s.job.Costs != nil && len(s.job.Costs.Bolt) > 0:
		return "the default sizes priced in costs.bolt"
	}
	return "the default list"
}

// plateRatio checks that splice.detailing.min_plate_to_flange can be met: one plate of the
// list, or with inner plates two, at least ratio × tf. When only outer and inner plates
// together reach it, the outer plate alone is left out, and a note says so.
func (s *Setup) plateRatio(probs *jobfile.Problems) {
	det, z := s.Splice.Detailing, s.Splice.Sizing.Space
	if !(det.MinPlateToFlange > 0) || len(z.Thicknesses) == 0 {
		return
	}
	need := det.MinPlateToFlange * s.Section.Tf
	thickest := slices.Max(z.Thicknesses)
	inner := slices.Contains(z.Arrangements, splice.OuterInner)
	outer := slices.Contains(z.Arrangements, splice.OuterOnly)
	reach := func(t float64) bool { return t >= need*(1-1e-9) }
	switch {
	case outer && reach(thickest):
	case inner && reach(2*thickest):
		if outer {
			s.Notes = append(s.Notes, fmt.Sprintf("splice.detailing.min_plate_to_flange: no single plate reaches %s × tf = %s mm, "+
				"so only flanges with inner plates (outer + inner at least %s mm) are tried", num(det.MinPlateToFlange), num(need), num(need)))
		}
	default:
		what := "no plate of splice.plates.thicknesses (at most " + num(thickest) + " mm) reaches it"
		if inner {
			what += ", nor an outer and an inner plate together"
		}
		probs.Add(s.Where("splice.detailing.min_plate_to_flange"), "%s asks the flange cover plates to be at least %s × tf = %s mm "+
			"(tf = %s mm of %s): %s", num(det.MinPlateToFlange), num(det.MinPlateToFlange), num(need), num(s.Section.Tf), s.Section.Name, what)
	}
}

// gauge checks that the fixed flange gauge can be detailed on the section with some bolt size
// and number of lines of the design space, refusing it at its key with the rules it breaks
// (for the smallest bolt, the most lenient); the bolts and layouts that cannot take it go in
// the notes. A table of gauges with no entry for the section is a note too.
func (s *Setup) gauge(probs *jobfile.Problems) {
	d := s.job.Splice.Detailing
	g := s.Splice.Detailing.Gauge
	if d != nil && len(d.Gauges) > 0 && g == 0 {
		narrowest := slices.MinFunc(d.Gauges, func(a, b jobfile.WidthGauge) int { return cmp.Compare(a.Width, b.Width) })
		s.Notes = append(s.Notes, fmt.Sprintf("splice.detailing.gauges has no entry for the %s flange (b = %s mm; the narrowest "+
			"entry is for %s): the sizing chooses the gauge", s.Section.Name, num(s.Section.B), narrowest.Width))
	}
	if g == 0 {
		return
	}
	fits, err := splice.GaugeFits(s.Splice)
	if err != nil {
		return // the sizing's own refusal, reported by detailable
	}
	key := s.GaugeKey
	if key != "splice.detailing.gauge" {
		key += ".gauge"
	}
	if !slices.ContainsFunc(fits, func(f splice.GaugeFit) bool { return f.Reason == "" }) {
		var why []string
		for _, f := range fits {
			if f.Size == fits[0].Size {
				why = append(why, fmt.Sprintf("%s, %d lines: %s", arrangementText(f.Arrangement), f.Columns, f.Reason))
			}
		}
		probs.Add(s.Where(key), "a gauge of %s mm cannot be detailed on %s (flange b = %s mm) with any bolt size and number of "+
			"bolt lines tried; with %s bolts (the smallest): %s", num(g), s.Section.Name, num(s.Section.B), fits[0].Size,
			strings.Join(why, "; "))
		return
	}
	s.Notes = append(s.Notes, gaugeNotes(key, g, fits)...)
}

// gaugeNotes say which bolt sizes, and which layouts (number of lines, with one flange
// arrangement or with every one tried), a fixed gauge leaves out, each with the first rule
// it breaks.
func gaugeNotes(key string, g float64, fits []splice.GaugeFit) []string {
	var out []string
	fitsAny := func(keep func(splice.GaugeFit) bool) bool {
		return slices.ContainsFunc(fits, func(f splice.GaugeFit) bool { return keep(f) && f.Reason == "" })
	}
	var sizes []string
	for _, f := range fits {
		if !slices.Contains(sizes, f.Size) && !fitsAny(func(o splice.GaugeFit) bool { return o.Size == f.Size }) {
			sizes = append(sizes, f.Size)
		}
	}
	if len(sizes) > 0 {
		out = append(out, fmt.Sprintf("%s = %s mm cannot be detailed with %s bolts, which are not tried", key, num(g), strings.Join(sizes, ", ")))
	}
	type layout struct {
		cols int
		arr  splice.Arrangement
	}
	failed := map[int][]splice.GaugeFit{} // per number of lines, the first refusal of each arrangement no size can take
	arrangements := map[int]int{}
	var seen []layout
	for _, f := range fits {
		l := layout{f.Columns, f.Arrangement}
		if slices.Contains(seen, l) {
			continue
		}
		seen = append(seen, l)
		arrangements[f.Columns]++
		if !fitsAny(func(o splice.GaugeFit) bool { return o.Columns == l.cols && o.Arrangement == l.arr }) {
			failed[f.Columns] = append(failed[f.Columns], f)
		}
	}
	for _, cols := range slices.Sorted(maps.Keys(failed)) {
		fs := failed[cols]
		with := fmt.Sprintf("%d bolt lines", cols)
		if len(fs) < arrangements[cols] {
			with += " and " + arrangementText(fs[0].Arrangement)
		}
		out = append(out, fmt.Sprintf("%s = %s mm cannot be detailed with %s (%s: %s): those flanges are not tried",
			key, num(g), with, fs[0].Size, fs[0].Reason))
	}
	return out
}

// arrangementText names a flange arrangement in messages.
func arrangementText(a splice.Arrangement) string {
	if a == splice.OuterInner {
		return "outer and inner plates"
	}
	return "an outer plate"
}

// num prints a value for messages: rounded to 0.001, in its shortest form.
func num(v float64) string { return strconv.FormatFloat(roundTo(v, 3), 'f', -1, 64) }
