package main

import (
	"bytes"
	"encoding/csv"
	"encoding/json"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

func TestRunSectionsTextSingleSection(t *testing.T) {
	var out bytes.Buffer
	require.NoError(t, runSections(sectionsOptions{Filter: "ipe500", Format: "text"}, outTo(&out)))
	text := out.String()
	for _, want := range []string{
		"h [mm]", "b [mm]", "tw [mm]", "tf [mm]", "r [mm]", "A [cm²]", "Iy [cm⁴]",
		"Wel,y [cm³]", "Wpl,y [cm³]", "Avz [cm²]", "mass [kg/m]",
		"IPE 500", "1 section(s)",
		// full properties of the one match, with the EN 10365 check values
		"EN 10365:2017 IPE", "published 48200", "published 115.5", "depth between fillets",
		"6.2.6(3)(a)", "2194", // Wpl,y = 2194 cm³ (EN 10365:2017 IPE 500, via EC3-NOTES.md)
	} {
		assert.Contains(t, text, want)
	}
}

func TestRunSectionsTextListAligned(t *testing.T) {
	var out bytes.Buffer
	require.NoError(t, runSections(sectionsOptions{Filter: "HEB", Format: "text"}, outTo(&out)))
	lines := strings.Split(strings.TrimRight(out.String(), "\n"), "\n")
	// header + 24 HE B rows + blank + summary
	require.Len(t, lines, 27)
	assert.True(t, strings.HasPrefix(lines[1], "HE 100 B"))
	assert.True(t, strings.HasPrefix(lines[24], "HE 1000 B"))
	width := len([]rune(lines[0]))
	for _, l := range lines[1:25] {
		assert.Equal(t, width, len([]rune(l)), "rows align with the header: %q", l)
	}
	assert.Contains(t, out.String(), "24 section(s)")
	assert.NotContains(t, out.String(), "depth between fillets", "no detail block for a list")
}

func TestRunSectionsExactNameWinsOverSubstring(t *testing.T) {
	// "HEA 100" is also a substring of "HEA 1000"; naming a section shows that one.
	var out bytes.Buffer
	require.NoError(t, runSections(sectionsOptions{Filter: "HEA 100", Format: "csv"}, outTo(&out)))
	rows, err := csv.NewReader(&out).ReadAll()
	require.NoError(t, err)
	require.Len(t, rows, 2)
	assert.Equal(t, "HE 100 A", rows[1][0])
}

func TestRunSectionsJSON(t *testing.T) {
	var out bytes.Buffer
	require.NoError(t, runSections(sectionsOptions{Filter: "IPE 300", Format: "json"}, outTo(&out)))
	raw := out.String()
	// stable key order with units in the key names
	assert.Contains(t, raw, "\"name\": \"IPE 300\",\n    \"series\": \"IPE\",\n    \"h_mm\": 300,\n    \"b_mm\": 150,")
	var records []map[string]any
	require.NoError(t, json.Unmarshal(out.Bytes(), &records))
	require.Len(t, records, 1)
	r := records[0]
	for _, key := range []string{"name", "series", "h_mm", "b_mm", "tw_mm", "tf_mm", "r_mm", "A_cm2",
		"Iy_cm4", "Iz_cm4", "Wel_y_cm3", "Wpl_y_cm3", "Avz_cm2", "mass_kg_m", "A_published_cm2",
		"Iy_published_cm4", "source"} {
		assert.Contains(t, r, key)
	}
	assert.Len(t, r, 17)
	// EN 10365:2017 IPE 300 (via EC3-NOTES.md): A 53.8 cm², Iy 8356 cm⁴, Wpl,y 628.4 cm³.
	assert.InEpsilon(t, 53.8, r["A_cm2"], 0.01)
	assert.InEpsilon(t, 8356, r["Iy_cm4"], 0.01)
	assert.InEpsilon(t, 628.4, r["Wpl_y_cm3"], 0.01)
	assert.InEpsilon(t, 8356, r["Iy_published_cm4"], 1e-9)

	out.Reset()
	require.NoError(t, runSections(sectionsOptions{Format: "json"}, outTo(&out)))
	require.NoError(t, json.Unmarshal(out.Bytes(), &records))
	assert.Len(t, records, 201)
}

func TestRunSectionsCSV(t *testing.T) {
	var out bytes.Buffer
	require.NoError(t, runSections(sectionsOptions{Filter: "UC 305", Format: "csv"}, outTo(&out)))
	rows, err := csv.NewReader(&out).ReadAll()
	require.NoError(t, err)
	assert.Equal(t, []string{"name", "series", "h_mm", "b_mm", "tw_mm", "tf_mm", "r_mm", "A_cm2", "Iy_cm4",
		"Iz_cm4", "Wel_y_cm3", "Wpl_y_cm3", "Avz_cm2", "mass_kg_m", "A_published_cm2", "Iy_published_cm4",
		"source"}, rows[0])
	require.Len(t, rows, 1+7) // the seven UC 305x305 sizes of BS 4-1:2005
	assert.Equal(t, "UC 305x305x97", rows[1][0])
	assert.Equal(t, "307.9", rows[1][2]) // h of UC 305x305x97, BS 4-1:2005
}

func TestRunSectionsErrors(t *testing.T) {
	tests := []struct {
		name string
		opts sectionsOptions
		want []string
		exit int
	}{
		{"unknown format", sectionsOptions{Format: "xml"}, []string{`--format "xml"`, "text, json or csv"}, exitUsage},
		{"no match", sectionsOptions{Filter: "W14x90", Format: "text"}, []string{`no section matches "W14x90"`}, exitFailure},
		{"no match with close names", sectionsOptions{Filter: "IPE 520", Format: "json"},
			[]string{`no section matches "IPE 520"`, "IPE 500"}, exitFailure},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			var out bytes.Buffer
			err := runSections(tt.opts, outTo(&out))
			require.Error(t, err)
			for _, want := range tt.want {
				assert.Contains(t, err.Error(), want)
			}
			assert.Zero(t, out.Len(), "nothing is written on error")
			assert.Equal(t, tt.exit, exitCode(err))
		})
	}
}

func TestSectionsCommandParsesArgsAndFlags(t *testing.T) {
	cmd := newSectionsCommand(runSections, streams{})
	var out bytes.Buffer
	cmd.SetOut(&out)
	cmd.SetErr(&bytes.Buffer{})
	cmd.SetArgs([]string{"HE 300 B", "--format", "csv"})
	require.NoError(t, cmd.Execute())
	rows, err := csv.NewReader(&out).ReadAll()
	require.NoError(t, err)
	require.Len(t, rows, 2)
	assert.Equal(t, "HE 300 B", rows[1][0])

	cmd = newSectionsCommand(runSections, streams{})
	cmd.SetOut(&bytes.Buffer{})
	cmd.SetErr(&bytes.Buffer{})
	cmd.SetArgs([]string{"IPE", "HEB"})
	assert.Error(t, cmd.Execute(), "at most one FILTER")
}

func TestFourFigures(t *testing.T) {
	tests := []struct {
		v    float64
		want string
	}{
		{1246000, "1246000"}, {8356.1, "8356"}, {80.144, "80.14"}, {3.58, "3.580"}, {0.0123456, "0.01235"}, {0, "0"},
	}
	for _, tt := range tests {
		assert.Equal(t, tt.want, fourFigures(tt.v), "%v", tt.v)
	}
}
