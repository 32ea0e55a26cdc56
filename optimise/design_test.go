package optimise

import (
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestDirectWeldedSection: "welded HxBxTWxTF" builds a plate girder from its plate sizes.
func TestDirectWeldedSection(t *testing.T) {
	s, err := directSection("welded 900x300x12x25")
	require.NoError(t, err)
	assert.Equal(t, 900.0, s.H)
	assert.Equal(t, 300.0, s.B)
	_, err = directSection("welded 900x300")
	assert.Error(t, err)
}
