package main

import (
	"slices"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/optimise"
)

func TestHelpJobFileTopic(t *testing.T) {
	out, stderr, code := runMine(t, "help", "job-file")
	require.Equal(t, exitOK, code, stderr)
	assert.Equal(t, strings.TrimRight(optimise.JobFileReference(), "\n")+"\n", strings.TrimRight(out, "\n")+"\n")
	assert.True(t, strings.HasPrefix(out, "SPANBREAK JOB FILE REFERENCE"))

	out, _, code = runMine(t, "help")
	require.Equal(t, exitOK, code)
	assert.Contains(t, out, "Additional help topics")
	i := strings.Index(out, "Additional help topics")
	assert.Contains(t, out[i:], "job-file")
	assert.True(t, slices.Contains(strings.Fields(out[i:]), "job-file"))
}
