package beam

import (
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
)

// TestEditDistance: the optimal-string-alignment distance against worked examples.
func TestEditDistance(t *testing.T) {
	tests := []struct {
		name, kind, source string
		a, b               string
		want               int
	}{
		{"both empty", "closed form", "no edit", "", "", 0},
		{"to empty", "closed form", "one deletion per rune", "abc", "", 3},
		{"from empty", "closed form", "one insertion per rune", "", "abc", 3},
		{"kitten", "published", "the usual Levenshtein example: k→s, e→i, +g (from memory)", "kitten", "sitting", 3},
		{"flaw", "published", "Levenshtein example: −f, +n (from memory)", "flaw", "lawn", 2},
		{"swap", "closed form", "one swap of neighbours", "ab", "ba", 1},
		{"swap in a word", "closed form", "one swap of neighbours", "sectoin", "section", 1},
		{"no edit twice", "published", "optimal string alignment: ca → abc is 3, Damerau–Levenshtein 2 (from memory)", "ca", "abc", 3},
		{"runes", "closed form", "× is one rune of two bytes: one substitution", "610×229", "610x229", 1},
	}
	for _, tt := range tests {
		assert.Equal(t, tt.want, EditDistance(tt.a, tt.b), "%s (%s: %s)", tt.name, tt.kind, tt.source)
		assert.Equal(t, tt.want, EditDistance(tt.b, tt.a), "%s, reversed", tt.name)
	}
}

// TestNearest: the suggestion rule — nearest first, ties all returned in order, letter case
// ignored, and how many edits a word of each length may carry.
func TestNearest(t *testing.T) {
	tests := []struct {
		name       string
		got        string
		candidates []string
		want       []int
	}{
		{"case only", "SPANS", []string{"grade", "spans"}, []int{1}},
		{"case only, two letters", "kN", []string{"KN", "N"}, []int{0}},
		{"two letters, one edit", "kM", []string{"kN"}, nil},
		{"exact", "spans", []string{"spans", "span"}, []int{0}},
		{"ties in order", "spas", []string{"spars", "grade", "spans"}, []int{0, 2}},
		{"nearest only", "IPE5000", []string{"IPE600", "IPE500"}, []int{1}},
		{"four letters, one edit", "grad", []string{"grade"}, []int{0}},
		{"four letters, two edits", "gade", []string{"grades"}, nil},
		{"eight letters, two edits", "abcdefxy", []string{"abcdefgh"}, []int{0}},
		{"eight letters, three edits", "abcdexyz", []string{"abcdefgh"}, nil},
		{"nine letters, three edits", "abcdefxyz", []string{"abcdefghi"}, []int{0}},
		{"nine letters, four edits", "abcdewxyz", []string{"abcdefghi"}, nil},
		{"too long", strings.Repeat("s", 65), []string{strings.Repeat("s", 64)}, nil},
		{"nothing", "xyz", []string{"spans", "grade"}, nil},
	}
	for _, tt := range tests {
		assert.Equal(t, tt.want, Nearest(tt.got, tt.candidates), tt.name)
	}
}
