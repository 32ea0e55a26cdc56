// Package beam computes the internal forces, deflections and reactions of a straight steel
// beam on point supports, and their exact ULS and SLS envelopes over EN 1990 combinations
// with span-by-span pattern loading.
//
// It holds the section catalogue (IPE, HE A/B/M, UB, UC, embedded from sections.csv with the
// published check columns) and welded I-sections, section properties computed from the
// dimensions with the root fillets (EN 1993-1-1 6.2.6(3) for the shear area), steel grades
// with thickness-dependent fy and fu (EN 1993-1-1 Table 3.1, or the EN 10025 steps), the beam
// model, load cases, EN 1990 combinations (expressions 6.10, 6.10a/b, 6.14b–6.16b with
// Table A1.1 ψ and Table A1.2(B) γ), the direct stiffness solver and the envelopes.
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
// patterns without enumerating them.
//
// Errors: anything the input can cause (a mechanism, a load off the beam, an unknown section
// or grade, NaN) is a returned error naming the item; mechanisms wrap ErrMechanism. An
// unknown section's error lists the close catalogue names by Nearest, the suggestion rule the
// job file's did-you-mean follows too. The
// package never panics on user data and never prints. Every result is a complete value; an
// Analysis is immutable and safe for concurrent use.
package beam
