package jobfile

import (
	"strconv"
	"strings"
)

// Suggest returns the allowed word closest to got when it is close enough to be a likely
// typing slip, or "" otherwise. Close enough is a difference of letter case only, or an edit
// distance (a swap of neighbours counting as one edit) of 1 for words of 3 or 4 characters
// and 2 for longer ones, with no other allowed word as close. Words of 1 or 2 characters get
// a suggestion for a case difference only: any letter is one edit from any other.
func Suggest(got string, allowed []string) string {
	if len(got) > 64 {
		return ""
	}
	for _, a := range allowed {
		if strings.EqualFold(a, got) && a != got {
			return a
		}
	}
	limit := 0
	switch {
	case len(got) > 4:
		limit = 2
	case len(got) > 2:
		limit = 1
	}
	best, bestD, ties := "", limit+1, 0
	for _, a := range allowed {
		switch d := editDistance(strings.ToLower(got), strings.ToLower(a)); {
		case d == 0:
			return ""
		case d < bestD:
			best, bestD, ties = a, d, 1
		case d == bestD:
			ties++
		}
	}
	if ties != 1 {
		return ""
	}
	return best
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

// editDistance is the optimal-string-alignment distance between a and b (insertions,
// deletions, substitutions and swaps of adjacent characters, each costing 1), over bytes.
func editDistance(a, b string) int {
	prev2 := make([]int, len(b)+1)
	prev := make([]int, len(b)+1)
	cur := make([]int, len(b)+1)
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(a); i++ {
		cur[0] = i
		for j := 1; j <= len(b); j++ {
			cost := 1
			if a[i-1] == b[j-1] {
				cost = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+cost)
			if i > 1 && j > 1 && a[i-1] == b[j-2] && a[i-2] == b[j-1] {
				cur[j] = min(cur[j], prev2[j-2]+1)
			}
		}
		prev2, prev, cur = prev, cur, prev2
	}
	return prev[len(b)]
}
