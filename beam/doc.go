// Package beam computes the internal forces, deflections and reactions of a straight steel
// beam on point supports, and their exact ULS and SLS envelopes over EN 1990 combinations
// with span-by-span pattern loading.
//
// It holds the section catalogue (IPE, HE A/B/M, UB, UC, embedded from sections.csv with the
// published check columns) and welded I-sections, section properties computed from the
// dimensions with the root fillets (EN 1993-1-1 6.2.6(3) for the shear area), steel grades
// with thickness-dependent fy and fu (EN 1993-1-1 Table 3.1, or the EN 10025 steps), the beam
// model, load cases, EN 1990 combinations (expressions 6.10, 6.10a/b, 6.14b–6.16b with
// Table A1.1 ψ and Table A1.2(B) γ; imposed loads on roofs kept apart from snow and wind,
// EN 1990 A1.2.1(3) with EN 1991-1-1 3.3.2(1)), the direct stiffness solver and the envelopes.
//
// Units: N and mm throughout (N/mm² for stresses, N·mm for moments, N/mm for line loads).
// Signs: x from the left end; transverse loads and deflection positive downward; bending
// moment positive sagging; V = dM/dx; axial force positive in tension; reactions positive
// upward; applied and reaction couples positive clockwise.
//
// Method: nodes at the ends, supports and hinges only; loads act inside the elements, whose
// internal forces and deflection are evaluated in closed form, so results at any x are exact.
// A patterned case is solved once per span and overhang; envelopes take each region's share
// with its adverse factor only where it is adverse, which equals the worst of all 2^n
// patterns without enumerating them. Each extreme keeps its combination and the number of its
// pattern in the envelopes' table of the patterns found (Envelopes.Loaded), 16 bytes an
// extreme, so that envelopes at a million stations take some 256 MB.
//
// Member checks (EN 1993-1-1:2005+AC:2009, the beam itself): NewMember takes a Section, a
// Grade and MemberSettings (γM0, default 1.00; the fy table; an optional weld throat of a
// welded section; η of the shear-buckling limit, default 1.2). fy is read for the thicker of
// tf and tw and used for the whole section (conservative). Member.Classify classifies the
// section under MEd and NEd by Table 5.2: flange outstands as parts in compression (9ε, 10ε,
// 14ε), the web in bending and compression with α from the plastic neutral axis under NEd and
// ψ from the elastic stresses under MEd and NEd; the class is the worse of the two.
// Member.CheckSection gives bending (6.2.5), shear (6.2.6), axial (6.2.3/6.2.4) and, where
// they reduce the moment resistance, bending with shear (6.2.8(5)), with axial force
// (6.2.9.1(4)–(5) for classes 1 and 2, 6.2.9.2 for class 3) or with both (6.2.10, read as a
// web of thickness (1 − ρ)tw). Member.CheckEnvelopes checks every station of the ULS
// envelope with both moment extremes, each paired with the larger |V| and with both axial
// extremes, and reports the governing station, pairing, combination, class, Mc,Rd, Vc,Rd and
// check. Not covered, and reported rather than ignored: class 4 sections (no resistance is
// computed; OutsideScope returns an error wrapping ErrOutsideScope), shear buckling of webs
// with hw/tw > 72ε/η (6.2.6(6), flagged), lateral-torsional and flexural buckling of the
// member, holes in the member, fatigue, fire.
//
// Deflection: Analysis.CheckDeflections checks each span and overhang over the SLS
// combinations against span/250 and overhang/180 by default (DeflectionLimits; common
// practice — the National Annex and the client govern). A span's deflection is measured from
// the chord between its supports, an overhang's from its support, for every load column
// before the envelope is taken, so settling spring supports are removed exactly. It is the
// largest value over the stations given: pass a fine station grid.
//
// Errors: anything the input can cause (a mechanism, a load off the beam, an unknown section
// or grade, NaN) is a returned error naming the item; mechanisms wrap ErrMechanism. An
// unknown section's error lists the close catalogue names by Nearest, the suggestion rule the
// job file's did-you-mean follows too. Every result is checked to be a finite number: loads
// so large that the analysis overflows float64 give a *NonFiniteError naming the case and the
// load (NewAnalysis, CaseResult, Envelopes), so no case ever drops out of a result silently.
// The package never panics on user data and never prints. Every result is a complete value; an
// Analysis is immutable and safe for concurrent use.
package beam
