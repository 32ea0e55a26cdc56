package encode

import (
	"bytes"
	"encoding/csv"
	"encoding/json"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/splice"
)

// TestSpliceDocShearPlanes: the bolt's threads_in_shear_plane is written only where a rule
// assumes the thread (true) or the shank (false) in every plane; left out, as in the splice
// file, the planes follow from the bolt length. The system is written where one was chosen.
func TestSpliceDocShearPlanes(t *testing.T) {
	for _, row := range []struct {
		rule   splice.ShearPlaneRule
		system splice.AssemblySystem
		want   string
	}{
		{splice.PlanesFromLength, "", `{"size":"M20","class":"8.8"}`},
		{splice.PlanesInThread, "", `{"size":"M20","class":"8.8","threads_in_shear_plane":true}`},
		{splice.PlanesOnShank, splice.SystemHR, `{"size":"M20","class":"8.8","threads_in_shear_plane":false,"system":"HR"}`},
	} {
		d := Splice(splice.Geometry{Bolt: splice.Bolt{Size: "M20", Class: "8.8", ShearPlanes: row.rule, System: row.system}})
		b, err := json.Marshal(d.Bolt)
		require.NoError(t, err)
		assert.JSONEq(t, row.want, string(b), "rule %s", row.rule)
	}
}

// TestBOMRowsNeutraliseFormulas: a grade or a name that a spreadsheet would read as a formula is
// written as text, and every row has the header's columns.
func TestBOMRowsNeutraliseFormulas(t *testing.T) {
	m := splice.Materials{Items: []splice.MaterialItem{
		{Item: "plate", Part: "web", Name: "web plate", Grade: "=HYPERLINK(1)", Length: 300, Thickness: 10, Width: 400, Quantity: 2, UnitMass: 9.42},
		{Item: "bolt", Part: "flange", Name: "M20×60 ISO 4017 8.8", Standard: "ISO 4017", Size: "M20", Grade: "8.8", Length: 60, Quantity: 8, UnitMass: 0.2},
	}, Holes: 40}
	var buf bytes.Buffer
	require.NoError(t, WriteCSV(&buf, BOMHeader, bomRows("S1", m)))
	rows, err := csv.NewReader(&buf).ReadAll()
	require.NoError(t, err)
	require.Len(t, rows, 1+2+1, "header, two items, the holes; no faying surface in category A")
	for _, r := range rows {
		assert.Len(t, r, len(BOMHeader))
	}
	assert.Equal(t, "'=HYPERLINK(1)", rows[1][6])
	assert.Equal(t, "10×400×300", rows[1][5], "a plate's size is t×b×L")
	assert.Equal(t, "18.84", rows[1][12], "2 × 9.42 kg")
	assert.Equal(t, "60", rows[2][7])
	assert.Equal(t, "hole", rows[3][1])
	assert.Equal(t, "40", rows[3][10])
}

// TestReportResultHasTheBill: result.json's bill of materials is the layout's, its bolts those
// of the chosen splices.
func TestReportResultHasTheBill(t *testing.T) {
	o := demoOutcome(t)
	d := ReportResult(o)
	require.NotNil(t, d.Bill)
	bolts, chosen := 0, 0
	for _, it := range d.Bill.Items {
		if it.Item == "bolt" {
			bolts += it.Quantity
		}
	}
	for _, c := range d.ChosenSplices {
		chosen += c.Bolts
		assert.Len(t, c.Assemblies, 2)
		assert.NotEmpty(t, c.Materials.Items)
	}
	assert.Equal(t, chosen, bolts)
}
