package main

import (
	"encoding/json"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

const frameJob = "../../optimise/testdata/frame-beam.yaml"

// TestImportedForcesCommands: a job with forces: {file} says where its forces come from in
// check (text and JSON), runs analyse, design, optimise and report on them, and has no load
// cases for analyse --case.
func TestImportedForcesCommands(t *testing.T) {
	out, stderr, code := run(t, "check", frameJob)
	require.Equal(t, exitOK, code, stderr)
	assert.Contains(t, out, "its forces table reads")
	assert.Contains(t, out, "imported from ../../optimise/testdata/frame-beam-forces.csv (per-combination, 290 rows")
	assert.Contains(t, out, "the beam analysis was not run")
	assert.Contains(t, out, "deflection no")
	out, _, code = run(t, "check", frameJob, "--format", "json")
	require.Equal(t, exitOK, code)
	var doc struct {
		Forces struct {
			Mode   string `json:"mode"`
			File   string `json:"file"`
			SHA256 string `json:"sha256"`
		} `json:"forces"`
	}
	require.NoError(t, json.Unmarshal([]byte(out), &doc))
	assert.Equal(t, "imported", doc.Forces.Mode)
	assert.Len(t, doc.Forces.SHA256, 64)

	out, stderr, code = run(t, "design", frameJob, "--at", "7.2")
	require.Equal(t, exitOK, code, stderr)
	assert.Contains(t, out, "forces imported from")
	assert.Contains(t, out, "ULS frame")

	_, stderr, code = run(t, "analyse", frameJob, "--case", "G")
	assert.Equal(t, exitUsage, code)
	assert.Contains(t, stderr, "no load cases")

	out, stderr, code = run(t, "optimise", frameJob)
	require.Equal(t, exitOK, code, stderr)
	assert.Contains(t, out, "RECOMMENDATION: 1 splice(s)")
}
