package optimise

import (
	"errors"
	"fmt"

	"spanbreak/beam"
)

// MemberChecks are the EN 1993-1-1 checks of the beam itself: the cross-section
// (classification by Table 5.2 under the actual M and N, Mc,Rd, Vc,Rd, bending with shear and
// with axial force) at every station of the chart envelopes, and the SLS deflection of every
// span and overhang against the job's limits. A member that fails is a warning of the
// outcome, not an error: the splices are then designed for forces the beam cannot carry.
type MemberChecks struct {
	Member     beam.MemberResult
	Scope      error // why the cross-section checks are outside scope (class 4, shear buckling), or nil
	Deflection beam.DeflectionResult
	// NoDeflection says why the deflection is not checked (imported forces without w, or a
	// member without supports); "" when it is.
	NoDeflection string
	// Compression is the largest axial compression of the ULS envelope, as a positive force,
	// and CompressionX where it acts; 0 where the beam carries none (beyond round-off). The
	// cross-section checks do not cover the buckling of a member in compression
	// (EN 1993-1-1 6.3.1, 6.3.3): Warnings says so wherever there is any.
	Compression  float64 // [N]
	CompressionX float64 // [mm]
}

// BucklingCaution says what the member checks leave to the engineer where the beam carries
// axial compression.
const BucklingCaution = "member buckling under the axial compression — flexural buckling " +
	"(EN 1993-1-1 6.3.1) and buckling with bending (6.3.3) — is not checked; the cross-section " +
	"checks of 6.2 alone do not show that the member carries it: check it separately with the " +
	"buckling lengths of the member's restraints"

// compressionRoundOff is the fraction of Npl,Rd below which an axial compression is taken as
// the round-off of an analysis without axial loads.
const compressionRoundOff = 1e-9

// noteCompression records the largest axial compression of the ULS envelope.
func (m *MemberChecks) noteCompression(env *beam.Envelopes) {
	floor := compressionRoundOff * m.Member.Member.NplRd
	for i, ex := range env.ULS.NMin {
		if c := -ex.Value; c > floor && c > m.Compression {
			m.Compression, m.CompressionX = c, env.Stations[i].X
		}
	}
}

// LTBCaution says what the member checks leave to the engineer wherever there is a member:
// its lateral-torsional buckling and the web under concentrated transverse forces.
const LTBCaution = "lateral-torsional buckling of the beam (EN 1993-1-1 6.3.2) is outside scope: " +
	"the compression flange must be restrained laterally — in sagging the top flange, in hogging near " +
	"the supports the bottom flange — at intervals that make Mb,Rd ≥ M_Ed, or continuously (a fixed deck); " +
	"check it separately; the web under the support reactions and point loads (resistance to transverse " +
	"forces, EN 1993-1-5 section 6, with bearing stiffeners where it falls short) is not checked either"

// Fails reports whether the beam fails a cross-section or deflection check.
func (m *MemberChecks) Fails() bool {
	if m.Scope == nil && m.Member.Utilisation > 1 {
		return true
	}
	for _, r := range m.Deflection.Regions {
		if !r.Pass {
			return true
		}
	}
	return false
}

// Warnings are the member's failures in words, one per failing check, for a prominent
// warning beside the results, and, where the beam carries axial compression, the member
// buckling the checks leave out (BucklingCaution).
func (m *MemberChecks) Warnings() []string {
	var out []string
	r := m.Member
	switch {
	case m.Scope != nil:
		out = append(out, fmt.Sprintf("the beam's cross-section checks are outside scope: %v", m.Scope))
	case r.Utilisation > 1:
		out = append(out, fmt.Sprintf("THE BEAM FAILS %s at x = %.3f m (utilisation %.3f, %s; %s): the splices are designed for forces the beam itself cannot carry",
			r.Check, r.X/1e3, r.Utilisation, r.Section.Class.Class, r.Combination))
	}
	for _, d := range m.Deflection.Regions {
		if !d.Pass {
			out = append(out, fmt.Sprintf("THE BEAM FAILS its deflection limit in %s: w = %.1f mm > %s/%g = %.1f mm (%s)",
				d.Region.Name, d.W, "L", d.Ratio, d.Limit, d.Combination))
		}
	}
	if m.Compression > 0 {
		out = append(out, fmt.Sprintf("the beam carries axial compression up to %.1f kN (at x = %.3f m, ULS): %s",
			m.Compression/1e3, m.CompressionX/1e3, BucklingCaution))
	}
	return out
}

// CheckMember runs the member checks on envelopes of this setup's analysis (a fine grid of
// stations: every key point and ChartIntervals intervals).
func (s *Setup) CheckMember(an *beam.Analysis, env *beam.Envelopes) (MemberChecks, error) {
	var m MemberChecks
	var err error
	if m.Member, err = s.Member.CheckEnvelopes(env); err != nil {
		return m, fmt.Errorf("member checks: %w", err)
	}
	m.noteCompression(env)
	if err := m.Member.OutsideScope(); err != nil {
		if !errors.Is(err, beam.ErrOutsideScope) {
			return m, err
		}
		m.Scope = err
	}
	if m.Deflection, err = an.CheckDeflections(env, s.Deflection); err != nil {
		return m, fmt.Errorf("deflection checks: %w", err)
	}
	return m, nil
}

// SectionCheck is the beam's cross-section checked under the design forces at one position:
// the worst of the four pairings (each moment extreme with the largest |V| and with each
// axial extreme).
type SectionCheck struct {
	Result  beam.SectionResult
	Pairing string // which extremes, e.g. "M_min with |V| and N_max"
	Scope   error  // class 4 or shear buckling: outside scope
}

// SectionAt checks the beam's cross-section under a position's design force set.
func (s *Setup) SectionAt(f ForceSet) (SectionCheck, error) {
	return sectionAt(s.Member, f)
}

func sectionAt(m beam.Member, f ForceSet) (SectionCheck, error) {
	var best SectionCheck
	found := false
	for _, mm := range []struct {
		name string
		v    float64
	}{{"M_max", f.MMax}, {"M_min", f.MMin}} {
		for _, nn := range []struct {
			name string
			v    float64
		}{{"N_max", f.NMax}, {"N_min", f.NMin}} {
			r, err := m.CheckSection(beam.SectionForces{M: mm.v, V: f.V, N: nn.v})
			if err != nil {
				return SectionCheck{}, err
			}
			c := SectionCheck{Result: r, Pairing: mm.name + " with |V| and " + nn.name}
			if err := r.OutsideScope(); err != nil {
				c.Scope = err
				return c, nil
			}
			if !found || r.Utilisation > best.Result.Utilisation {
				best, found = c, true
			}
		}
	}
	return best, nil
}
