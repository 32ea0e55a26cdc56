package main

import (
	"go/parser"
	"go/token"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// TestLayers keeps the ownership of DEVELOPERS.md: only optimise reads the decoded job file
// (cmd and plots never import optimise/jobfile), and plots renders outcomes without running
// engineering again (no analysis, no sizing, no checking of splices).
func TestLayers(t *testing.T) {
	engineering := regexp.MustCompile(`\.Analyse\(|\bsplice\.(Size|SizeExhaustive|Verify)\(|\.Envelopes\(|NewSpliceDesigner\(`)
	for _, dir := range []string{".", "../../plots", "../../plots/encode"} {
		files, err := filepath.Glob(filepath.Join(dir, "*.go"))
		require.NoError(t, err)
		require.NotEmpty(t, files, dir)
		for _, f := range files {
			parsed, err := parser.ParseFile(token.NewFileSet(), f, nil, parser.ImportsOnly)
			require.NoError(t, err)
			for _, imp := range parsed.Imports {
				path, _ := strconv.Unquote(imp.Path.Value)
				assert.NotEqual(t, "spanbreak/optimise/jobfile", path, "%s imports the job-file decoder", f)
			}
			if dir == "." || strings.HasSuffix(f, "_test.go") {
				continue
			}
			src, err := os.ReadFile(f)
			require.NoError(t, err)
			assert.Empty(t, engineering.FindAllString(string(src), -1), "%s runs engineering; plots renders an Outcome", f)
		}
	}
}
