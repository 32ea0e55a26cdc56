package jobfile

import (
	"slices"
	"strconv"
	"strings"

	"spanbreak/beam"
)

// Suggest returns the allowed word closest to got when it is close enough to be a likely
// typing slip, or "" otherwise: the one allowed word nearest to got under beam.Nearest (the
// rule the section catalogue's suggestions follow too: letter case ignored, a swap of
// neighbours counting as one edit, at most 1 edit in a word of 3 or 4 characters and 2, or a
// third of the length, in longer ones; words of 1 or 2 characters only for a difference of
// case). No word is suggested when got is allowed as it is, or when two are equally near.
func Suggest(got string, allowed []string) string {
	if slices.Contains(allowed, got) {
		return ""
	}
	if near := beam.Nearest(got, allowed); len(near) == 1 {
		return allowed[near[0]]
	}
	return ""
}

// oneOf formats an allowed-values list with a did-you-mean, as used after "unknown ...":
// ` (allowed: a, b, c); did you mean "b"?`.
func oneOf(got string, allowed []string) string {
	s := " (allowed: " + strings.Join(allowed, ", ") + ")"
	if g := Suggest(got, allowed); g != "" {
		s += "; did you mean " + strconv.Quote(g) + "?"
	}
	return s
}
