package main

import (
	"encoding/json"
	"spanbreak/optimise"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

type layoutsDoc struct {
	Layouts []struct {
		Kind        string    `json:"kind"`
		Recommended bool      `json:"recommended"`
		Splices     []float64 `json:"splices"`
		Cost        struct {
			Total float64 `json:"total"`
		} `json:"cost"`
		Designs []struct {
			X           float64 `json:"x"`
			Splice      string  `json:"splice"`
			Bolts       int     `json:"bolts"`
			Utilisation float64 `json:"utilisation"`
			Governing   string  `json:"governing"`
		} `json:"designs"`
	} `json:"layouts"`
}

func optimiseLayouts(t *testing.T, flags ...string) layoutsDoc {
	t.Helper()
	job := writeJob(t, string(optimise.DemoJob()))
	out, stderr, code := run(t, append([]string{"optimise", job, "--format", "json"}, flags...)...)
	require.Equal(t, exitOK, code, stderr)
	var doc layoutsDoc
	require.NoError(t, json.Unmarshal([]byte(out), &doc))
	return doc
}

// TestLayoutsKindsAndDesigns: the optimise document lists the best mixed layouts, the
// alternatives and the best layouts of identical splices (kind "uniform"), each with one
// design entry per splice; exactly one is recommended. On the demo the three-splice uniform
// layout costs more than the mixed one, and its designs are all the same splice.
func TestLayoutsKindsAndDesigns(t *testing.T) {
	doc := optimiseLayouts(t)
	kinds := map[string]int{}
	recommended := 0
	for _, l := range doc.Layouts {
		kinds[l.Kind]++
		require.Len(t, l.Designs, len(l.Splices), "%s layout at %v", l.Kind, l.Splices)
		for i, d := range l.Designs {
			assert.Equal(t, l.Splices[i], d.X)
			assert.NotEmpty(t, d.Splice)
			assert.LessOrEqual(t, d.Utilisation, 1.0)
		}
		if l.Recommended {
			recommended++
		}
		if l.Kind == "uniform" {
			for _, d := range l.Designs {
				assert.Equal(t, l.Designs[0].Splice, d.Splice, "identical splices")
			}
		}
	}
	assert.Equal(t, 1, recommended)
	assert.Positive(t, kinds["best"])
	assert.Positive(t, kinds["alternative"])
	assert.Positive(t, kinds["uniform"])
	var mixed3, uniform3 float64
	for _, l := range doc.Layouts {
		if len(l.Splices) == 3 && l.Kind == "best" {
			mixed3 = l.Cost.Total
		}
		if len(l.Splices) == 3 && l.Kind == "uniform" {
			uniform3 = l.Cost.Total
		}
	}
	assert.Greater(t, uniform3, mixed3, "identical splices cost more for three splices on the demo")
}

// TestRankAndUniformChangeTheRecommendation: --rank bolts recommends the listed layout with
// the fewest bolts (on the demo one splice with the extendable trailer, instead of the two
// cheaper splices with the semi-trailer); --uniform recommends a layout of identical splices.
func TestRankAndUniformChangeTheRecommendation(t *testing.T) {
	rec := func(doc layoutsDoc) (string, int) {
		for _, l := range doc.Layouts {
			if l.Recommended {
				return l.Kind, len(l.Splices)
			}
		}
		return "", -1
	}
	kind, n := rec(optimiseLayouts(t))
	assert.Equal(t, "best", kind)
	assert.Equal(t, 2, n)
	kind, n = rec(optimiseLayouts(t, "--rank", "bolts"))
	assert.Equal(t, 1, n, "fewest bolts")
	assert.NotEqual(t, "", kind)
	kind, _ = rec(optimiseLayouts(t, "--uniform"))
	assert.Equal(t, "uniform", kind)
	out, _, code := run(t, "optimise", writeJob(t, string(optimise.DemoJob())), "--rank", "bolts")
	require.Equal(t, exitOK, code)
	assert.Contains(t, out, "recommended by bolts (--rank): the listed layout with the fewest bolts")
}
