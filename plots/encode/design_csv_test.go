package encode

import (
	"reflect"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
)

// TestDesignCSVColumnsAreTheCheckShape: the columns of design's CSV are keys of the one
// shape of a check (CheckDoc's JSON keys), so a check reads the same in both formats.
func TestDesignCSVColumnsAreTheCheckShape(t *testing.T) {
	keys := map[string]bool{}
	typ := reflect.TypeOf(CheckDoc{})
	for i := range typ.NumField() {
		name, _, _ := strings.Cut(typ.Field(i).Tag.Get("json"), ",")
		keys[name] = true
	}
	for _, c := range designCSVHeader {
		assert.True(t, keys[c], "column %q is a key of CheckDoc", c)
	}
}
