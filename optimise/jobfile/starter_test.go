package jobfile_test

import (
	"reflect"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/optimise"
	"spanbreak/optimise/jobfile"
)

// The starter shows every block of the job file and says that its data are invented.
func TestStarterShowsEveryBlock(t *testing.T) {
	job, err := jobfile.LoadJob("starter.yaml", optimise.StarterJob())
	require.NoError(t, err)
	typ := reflect.TypeFor[jobfile.Job]()
	for i := range typ.NumField() {
		tag, ok := typ.Field(i).Tag.Lookup("yaml")
		if !ok {
			continue
		}
		key, _, _ := strings.Cut(tag, ",")
		if key == "forces" {
			// the alternative to cases and combinations: the starter names it in a comment
			assert.Contains(t, string(optimise.StarterJob()), `"forces: {file:`)
			continue
		}
		assert.True(t, job.Has(key), "the starter has no %s block", key)
	}
	text := string(optimise.StarterJob())
	assert.Contains(t, job.Title, "invented")
	assert.Contains(t, text, "INVENTED")
	assert.Contains(t, text, "spanbreak help job-file")
	assert.NotContains(t, job.Title, "bus-depot", "the starter is not the demo's scenario")
}
