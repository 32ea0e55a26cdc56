package optimise

import (
	"errors"
	"fmt"
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
