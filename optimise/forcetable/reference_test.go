package forcetable

import (
	"strings"
	"testing"
	"unicode/utf8"

	"github.com/stretchr/testify/assert"
)

// TestReferenceNamesEveryColumn: the users' text lists every column both shapes accept and
// the limits the reader applies, and fits the help text's width.
func TestReferenceNamesEveryColumn(t *testing.T) {
	ref := Reference()
	for _, c := range append(EnvelopeColumns(), CombinationColumns()...) {
		assert.Contains(t, ref, c)
	}
	for _, s := range []string{"4 MiB", "1,000,000 data rows", "1,000 combinations", "within 1 mm", "up to 100"} {
		assert.Contains(t, ref, s)
	}
	assert.True(t, strings.HasSuffix(ref, "\n") && !strings.HasPrefix(ref, "\n"))
	for i, l := range strings.Split(ref, "\n") {
		assert.LessOrEqual(t, utf8.RuneCountInString(l), 96, "line %d is too long: %q", i+1, l)
	}
	// the limits in the text are the package's
	assert.Equal(t, 4<<20, defaultLimits().bytes)
	assert.Equal(t, 1_000_000, MaxRows)
	assert.Equal(t, 1000, MaxCombinations)
	assert.Equal(t, 1.0, CoverTolerance)
}
