package optimise

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/beam"
	"spanbreak/optimise/jobfile"
)

// TestParseLength: positions and steps take the job file's length units. The factors are
// the SI definitions (BIPM, The International System of Units, 9th edition, Table 7:
// centi = 10⁻², milli = 10⁻³), so 1 m = 1000 mm and 1 cm = 10 mm.
func TestParseLength(t *testing.T) {
	rows := []struct {
		name, in string
		want     float64 // [mm]
	}{
		{"bare number in metres", "9", 9 * 1000},
		{"metres", "9 m", 9 * 1000},
		{"metres without a space", "9m", 9 * 1000},
		{"millimetres", "9000 mm", 9000},
		{"a step in millimetres", "50 mm", 50},
		{"centimetres", "2.5 cm", 2.5 * 10},
		{"a negative position, left to the caller", "-5", -5 * 1000},
		{"an exponent", "1e-3 m", 1},
	}
	for _, r := range rows {
		t.Run(r.name, func(t *testing.T) {
			got, err := ParseLength(r.in)
			require.NoError(t, err)
			assert.InDelta(t, r.want, got, 1e-9*math.Abs(r.want))
		})
	}
	for _, bad := range []struct{ in, want string }{
		{"nan", "want a length"},
		{"NaN m", "want a length"},
		{"inf", "want a length"},
		{"-Inf", "want a length"},
		{"1e999", "out of range"},
		{"9 kN", "is a force"},
		{"9 x", `unknown unit "x"`},
		{"9,5", `decimal point as "."`},
		{"", "want a length"},
	} {
		_, err := ParseLength(bad.in)
		assert.ErrorContains(t, err, bad.want, "%q", bad.in)
	}
	got, err := ParseSize("10")
	require.NoError(t, err)
	assert.Equal(t, 10.0, got, "a bare size is in mm")
	got, err = ParseSize("1 cm")
	require.NoError(t, err)
	assert.Equal(t, 10.0, got)
}

// TestDirectForceBounds: the bounds of direct forces are the job file's load bounds.
func TestDirectForceBounds(t *testing.T) {
	assert.Equal(t, jobfile.MaxPointLoad, float64(MaxDirectForce))
	assert.Equal(t, jobfile.MaxPointMoment, float64(MaxDirectMoment))
}

// TestRunStepIsASettingError: a step given in the settings that the grid refuses is a
// *SettingError on "step", in metres, before any analysis; the same step from the job file
// stays located at scan.step. Before, a step of 1e-300 m was blamed on scan.step and counted
// 9223372036854775807 positions.
func TestRunStepIsASettingError(t *testing.T) {
	s := demoSetup(t)
	for _, tc := range []struct {
		step float64 // [mm]
		want string
	}{
		{1e-4, "the scan step 1e-07 m gives "},
		{1e-297, "the scan step 1e-300 m gives "},
		{-100, "positive spacing, got -0.1 m"},
	} {
		_, err := Run(s, Settings{Step: tc.step})
		var se *SettingError
		require.True(t, errors.As(err, &se), "%g mm: %v", tc.step, err)
		assert.Equal(t, "step", se.Setting)
		assert.ErrorContains(t, err, tc.want)
		assert.NotContains(t, err.Error(), "9223372036854775807")
		var probs jobfile.Problems
		assert.False(t, errors.As(err, &probs), "not blamed on the job file: %v", err)
	}
	// the same step in the job file is the job's fault, found when the job is read
	_, err := Prepare("edited-demo.yaml", []byte(strings.Replace(string(DemoJob()), "  step: 0.05", "  step: 1e-7", 1)))
	var se *SettingError
	assert.False(t, errors.As(err, &se))
	var probs jobfile.Problems
	require.True(t, errors.As(err, &probs), "%v", err)
	assert.ErrorContains(t, err, "scan.step: a scan step of 0.0001 mm is outside the plausible range")
}

// TestAnalyseBeamSettingsInMetres: positions off the beam and a step that gives too many
// stations are refused in metres, the unit of the settings' flags. Before, they came back in
// mm ("position -5000 mm is off the beam (0 to 36200 mm)").
func TestAnalyseBeamSettingsInMetres(t *testing.T) {
	s := demoSetup(t)
	l := s.Model.Length
	tooFine := l / (beam.MaxStations + 10) // [mm]
	for _, tc := range []struct {
		set     BeamSettings
		setting string
		want    string
	}{
		{BeamSettings{At: []float64{-5000}}, "at", "-5 m is off the beam (0 to "},
		{BeamSettings{At: []float64{1000, l + 1000}}, "at", " m is off the beam"},
		{BeamSettings{Step: -500}, "step", "got -0.5 m"},
		{BeamSettings{Step: 0}, "step", "want a positive station spacing"},
		{BeamSettings{Step: tooFine}, "step", "stations on a "},
	} {
		_, err := AnalyseBeam(s, tc.set)
		var se *SettingError
		require.True(t, errors.As(err, &se), "%+v: %v", tc.set, err)
		assert.Equal(t, tc.setting, se.Setting)
		assert.ErrorContains(t, err, tc.want)
		assert.NotContains(t, err.Error(), " mm")
	}
}
