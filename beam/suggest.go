package beam

import "strings"

// Suggestions for names a user types: catalogue sections here, and the keys and values of the
// job file (optimise/jobfile) follow one rule, Nearest.

// maxSuggestRunes bounds the words Nearest compares: the distance costs the product of the two
// lengths, and nothing that long is a slip of the keyboard.
const maxSuggestRunes = 64

// Nearest returns the indices (in the order given) of the candidates a user most likely meant
// by got: those at the smallest edit distance from it (EditDistance, letter case ignored),
// provided that distance is within what a typing slip makes in a word of got's length — none
// up to 2 runes (any letter is one edit from any other; a difference of case alone still
// counts), 1 for 3 or 4 runes, and otherwise 2 or a third of the length, whichever is more. An
// empty result means nothing is that close, or got is longer than 64 runes. A candidate equal
// to got is at distance 0, so callers that accept got as it is check that first.
func Nearest(got string, candidates []string) []int {
	n := len([]rune(got))
	if n > maxSuggestRunes {
		return nil
	}
	limit := 0
	switch {
	case n > 4:
		limit = max(2, n/3)
	case n > 2:
		limit = 1
	}
	g := strings.ToLower(got)
	var nearest []int
	best := limit + 1
	for i, c := range candidates {
		d := EditDistance(g, strings.ToLower(c))
		switch {
		case d > limit:
		case d < best:
			best, nearest = d, append(nearest[:0], i)
		case d == best:
			nearest = append(nearest, i)
		}
	}
	return nearest
}

// EditDistance is the optimal-string-alignment distance between a and b, counted in runes: the
// fewest insertions, deletions, substitutions and swaps of two neighbouring runes that turn a
// into b, where no part is edited twice (so "ca" → "abc" is 3, where the unrestricted
// Damerau–Levenshtein distance is 2). A swap counts as one edit, the commonest typing slip.
func EditDistance(a, b string) int {
	ra, rb := []rune(a), []rune(b)
	// three rows of the dynamic programme: i − 2, i − 1 and i
	prev2, prev, cur := make([]int, len(rb)+1), make([]int, len(rb)+1), make([]int, len(rb)+1)
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(ra); i++ {
		cur[0] = i
		for j := 1; j <= len(rb); j++ {
			cost := 1
			if ra[i-1] == rb[j-1] {
				cost = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+cost)
			if i > 1 && j > 1 && ra[i-1] == rb[j-2] && ra[i-2] == rb[j-1] {
				cur[j] = min(cur[j], prev2[j-2]+1)
			}
		}
		prev2, prev, cur = prev, cur, prev2
	}
	return prev[len(rb)]
}
