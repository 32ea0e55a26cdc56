package optimise

import (
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/optimise/jobfile"
	"spanbreak/splice"
)

// TestAssemblyKeysReachTheSizing: splice.assemblies and costs.assembly_per_kg of the job are the
// sizing's system, shear-plane rule and rate; check marks them when left out.
func TestAssemblyKeysReachTheSizing(t *testing.T) {
	s := editedDemo(t, "  distribution: proportional", "  distribution: proportional\n  assemblies: {system: HR, shear_planes: thread}")
	assert.Equal(t, splice.SystemHR, s.Splice.Sizing.System)
	assert.Equal(t, splice.PlanesInThread, s.Splice.Sizing.ShearPlanes)
	assert.False(t, s.IsDefault("splice.assemblies.system"))
	d := demoSetup(t)
	assert.True(t, d.IsDefault("splice.assemblies.system"))
	assert.True(t, d.IsDefault("splice.assemblies.shear_planes"))
	assert.True(t, d.IsDefault("costs.assembly_per_kg"))
	assert.Equal(t, splice.PlanesFromLength, d.Splice.Sizing.ShearPlanes)
	// HR takes both classes: the demo's 10.9 bolts become HR assemblies
	o, err := DesignAt(s, 3000, nil, "")
	require.NoError(t, err)
	for _, a := range o.Result.Assemblies {
		assert.Equal(t, splice.SystemHR, a.Assembly.Data.System)
		for _, p := range a.Planes {
			assert.True(t, p.Threaded, "the thread assumed")
		}
	}
}

// TestHVNeedsClass109: HV assemblies are made in class 10.9 only (EN 14399-4); the demo tries
// 8.8 too, so the job is refused at splice.assemblies.system.
func TestHVNeedsClass109(t *testing.T) {
	src := strings.Replace(string(DemoJob()), "  distribution: proportional", "  distribution: proportional\n  assemblies: {system: HV}", 1)
	_, err := Prepare("hv.yaml", []byte(src))
	var ps jobfile.Problems
	require.ErrorAs(t, err, &ps)
	assert.ErrorContains(t, err, "splice.assemblies.system: HV assemblies (EN 14399-4) are made in class 10.9 only")
	src = strings.Replace(src, `classes: ["8.8", "10.9"]`, `classes: ["10.9"]`, 1)
	_, err = Prepare("hv.yaml", []byte(src))
	require.NoError(t, err)
}

// TestAssembliesPricedByMass: costs.assembly_per_kg adds rate × class factor × mass to each
// assembly, so the splice at a position costs the bolt mass times the rate more (the demo's
// factors: 1 for 8.8, 1.35 for 10.9); the mass is the splice's own bolt mass.
func TestAssembliesPricedByMass(t *testing.T) {
	const rate = 6.0
	own, err := DesignAt(demoSetup(t), 5000, nil, "")
	require.NoError(t, err)
	priced := editedDemo(t, "  lift: 165", "  lift: 165\n  assembly_per_kg: 6")
	g := own.Result.Geometry
	o, err := DesignAt(priced, 5000, &g, "")
	require.NoError(t, err)
	factor := map[string]float64{"8.8": 1, "10.9": 1.35}[g.Bolt.Class]
	want := own.Result.Cost.Bolts + rate*factor*own.Result.Quantities.BoltMass
	assert.InDelta(t, want, o.Result.Cost.Bolts, 1e-4)
	assert.InDelta(t, own.Result.Cost.Total+rate*factor*own.Result.Quantities.BoltMass, o.Result.Cost.Total, 1e-4)
}
