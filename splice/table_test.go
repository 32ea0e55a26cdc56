package splice

import (
	"math/rand"
	"reflect"
	"slices"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
)

// The tests of this file hold the check table to what is derived from it: the calculation
// sheet, the number of checks, the sizing groups and their memos. They are structural
// (property) tests; the engineering values of the checks are tested against the standards in
// checks_test.go and corrections_test.go.

// contractIDs are the check ids of the JSON contract (DESIGN.md section 8).
var contractIDs = []string{"detail.spacing", "flange.bolt.shear", "flange.bolt.bearing.beam",
	"flange.bolt.bearing.plate", "flange.bolt.slip", "flange.plate.tension", "flange.plate.block",
	"flange.plate.compression", "flange.plate.buckling", "flange.beam.net", "web.bolt.shear",
	"web.bolt.bearing.beam", "web.bolt.bearing.plate", "web.bolt.slip", "web.plate.shear.gross",
	"web.plate.shear.net", "web.plate.block", "web.plate.combined", "web.beam.net-shear"}

// TestCheckTableRows: every row is one well-formed check, every contract id has a row, and ids
// are unique.
func TestCheckTableRows(t *testing.T) {
	seen := map[string]bool{}
	for i := range checkTable {
		d := &checkTable[i]
		assert.False(t, seen[d.id], "%s: id used twice", d.id)
		seen[d.id] = true
		assert.NotEmpty(t, d.clause, d.id)
		part := d.part()
		require.NotEmpty(t, part, "%s: no half", d.id)
		assert.True(t, strings.HasPrefix(d.id, part+"."), "%s: a %s check", d.id, part)
		switch {
		case d.bolt.check != nil:
			assert.True(t, d.flange.check == nil && d.web.check == nil, "%s: a bolt check has no other half", d.id)
			assert.NotNil(t, d.bolt.u, d.id)
			assert.Equal(t, groupBolt, d.bolt.group, d.id)
		case part == "detail":
			assert.Equal(t, stDetailing, d.state, "%s: only detailing checks merge two halves", d.id)
		}
		if d.flange.check != nil || d.flange.u != nil {
			assert.True(t, d.flange.check != nil && d.flange.u != nil, "%s: flange half needs both functions", d.id)
			assert.Contains(t, []sizingGroup{groupFlangeRowFree, groupFlangeRows}, d.flange.group, d.id)
		}
		if d.web.check != nil || d.web.u != nil {
			assert.True(t, d.web.check != nil && d.web.u != nil, "%s: web half needs both functions", d.id)
			assert.Contains(t, []sizingGroup{groupWebClass, groupWebPlates}, d.web.group, d.id)
		}
		if d.state == stSlip {
			assert.True(t, d.preloaded, "%s: a slip check is made in categories B and C only", d.id)
		}
	}
	for _, id := range contractIDs {
		assert.True(t, seen[id], "contract id %s (DESIGN.md section 8) has no row", id)
	}
}

// tableIDs lists the ids of the rows made in a category, in table order.
func tableIDs(preloaded bool) []string {
	var ids []string
	for i := range checkTable {
		if checkTable[i].applies(preloaded) {
			ids = append(ids, checkTable[i].id)
		}
	}
	return ids
}

func rowByID(t *testing.T, id string) *checkDef {
	t.Helper()
	for i := range checkTable {
		if checkTable[i].id == id {
			return &checkTable[i]
		}
	}
	require.Failf(t, "no row", "the sheet emits %s, which checkTable does not have", id)
	return nil
}

// TestSheetIsTheTable: a checked and a sized splice of every category carry exactly the table's
// checks in table order (none missing, none the table does not have), as many as sheetLen,
// each with its row's clause and limit state.
func TestSheetIsTheTable(t *testing.T) {
	slip := map[Category]string{CategoryA: "", CategoryB: StateSLS, CategoryC: StateULS}
	for _, cat := range []Category{CategoryA, CategoryB, CategoryC} {
		g := workedGeometry()
		g.Category = cat
		checked, err := Verify(workedProblem(t), g)
		require.NoError(t, err)
		p := workedProblem(t)
		p.Sizing = Sizing{Category: cat, FrictionClass: "A", Gap: 10, Space: smallSpace()}
		sized, err := Size(p)
		require.NoError(t, err)
		for _, r := range []Result{checked, sized} {
			ids := make([]string, len(r.Checks))
			for i, c := range r.Checks {
				ids[i] = c.ID
				d := rowByID(t, c.ID)
				assert.Contains(t, []string{d.clause, d.altClause}, c.Clause, c.ID)
				want := map[stateKind]string{stULS: StateULS, stSlip: slip[cat], stDetailing: StateDetailing}[d.state]
				assert.Equal(t, want, c.State, c.ID)
			}
			assert.Equal(t, tableIDs(cat.Preloaded()), ids, "category %s", cat)
			assert.Len(t, r.Checks, sheetLen(cat.Preloaded()), "category %s", cat)
			assert.Equal(t, len(r.Checks), cap(r.Checks), "category %s: sheetLen sizes the result", cat)
		}
	}
}

// funcPointer identifies a function value (functions are not comparable in Go).
func funcPointer(f any) uintptr { return reflect.ValueOf(f).Pointer() }

// TestSizingGroupsAreTheTable: the sizing groups of each category hold every flange and web half
// of the table's rows in that category, each in its own group and in table order, and nothing
// else; the bolt checks, which the search leaves to the design space, pass for every bolt the
// design space admits.
func TestSizingGroupsAreTheTable(t *testing.T) {
	for _, pre := range []bool{false, true} {
		want := map[sizingGroup][]uintptr{}
		for i := range checkTable {
			d := &checkTable[i]
			if !d.applies(pre) {
				continue
			}
			if d.flange.u != nil {
				want[d.flange.group] = append(want[d.flange.group], funcPointer(d.flange.u))
			}
			if d.web.u != nil {
				want[d.web.group] = append(want[d.web.group], funcPointer(d.web.u))
			}
		}
		g := newSizingGroups(checkTable[:], pre)
		assert.Equal(t, want, groupPointers(&g), "preloaded %v", pre)
		cat := CategoryA
		if pre {
			cat = CategoryB
		}
		assert.Equal(t, want, groupPointers(groupsFor(cat)), "preloaded %v: the groups the search uses", pre)
	}

	// groupBolt: DesignSpace.resolve admits, in a slip-resistant category, only the classes that
	// pass the bolt checks (it rejects the others, bad_test.go), so the search need not make them.
	p := workedProblem(t)
	for _, cat := range []Category{CategoryB, CategoryC} {
		p.Sizing = Sizing{Category: cat, FrictionClass: "A", Gap: 10,
			Space: DesignSpace{Classes: []string{"8.8", "10.9"}}}
		s, err := newSearcher(&p)
		require.NoError(t, err)
		for bi := range s.bolts {
			for i := range checkTable {
				if d := &checkTable[i]; d.bolt.check != nil && d.applies(true) {
					c := d.bolt.check(s.e, &s.bolts[bi], d, false)
					assert.True(t, c.Pass, "%s for class %s", d.id, s.bolts[bi].class.Name)
				}
			}
		}
	}
}

// groupPointers lists the functions of each sizing group.
func groupPointers(g *sizingGroups) map[sizingGroup][]uintptr {
	out := map[sizingGroup][]uintptr{}
	for group, nums := range map[sizingGroup][]flangeNum{groupFlangeRowFree: g.flangeRowFree(), groupFlangeRows: g.flangeRows()} {
		for _, n := range nums {
			out[group] = append(out[group], funcPointer(n.u))
		}
	}
	for group, nums := range map[sizingGroup][]webNum{groupWebClass: g.webClass(), groupWebPlates: g.webPlates()} {
		for _, n := range nums {
			out[group] = append(out[group], funcPointer(n.u))
		}
	}
	return out
}

// TestSizingGroupsRejectABrokenTable: a half outside its part's groups is a broken table.
func TestSizingGroupsRejectABrokenTable(t *testing.T) {
	broken := slices.Clone(checkTable[:])
	i := slices.IndexFunc(broken, func(d checkDef) bool { return d.id == IDFlangeTension })
	broken[i].flange.group = groupWebPlates
	assert.Panics(t, func() { newSizingGroups(broken, false) })
	broken = slices.Clone(checkTable[:])
	i = slices.IndexFunc(broken, func(d checkDef) bool { return d.id == IDWebBlock })
	broken[i].web.group = groupNone
	assert.Panics(t, func() { newSizingGroups(broken, false) })
}

// sampleSplices calls visit with every step-th flange and web configuration of the design space
// for every bolt of s.
func sampleSplices(s *searcher, step int, visit func(b *boltData, fl *flangeLayout, wl *webLayout)) {
	for bi := range s.bolts {
		b := &s.bolts[bi]
		var fls []flangeLayout
		var wls []webLayout
		s.forEachFlange(b, func(fl *flangeLayout) { fls = append(fls, *fl) })
		s.forEachWeb(b, func(wl *webLayout) { wls = append(wls, *wl) })
		for i := 0; i < len(fls) && len(wls) > 0; i += step {
			visit(b, &fls[i], &wls[(i/step)%len(wls)])
		}
	}
}

// TestCheckTableNumbers: on random positions and configurations of every category, each half's
// utilisation alone (which the sizing search uses) equals that of its calculation-sheet form,
// brief and full, and verdict (which SizeExhaustive uses) equals the pass and utilisation of
// the assembled result (seeded).
func TestCheckTableNumbers(t *testing.T) {
	rng := rand.New(rand.NewSource(19))
	n := 30
	if testing.Short() {
		n = 8
	}
	var splices, axial int
	for k := 0; k < n; k++ {
		p := randomProblem(t, rng)
		s, err := newSearcher(&p)
		require.NoError(t, err)
		pre := s.e.cat.Preloaded()
		sampleSplices(s, 3, func(b *boltData, fl *flangeLayout, wl *webLayout) {
			splices++
			full := splices%5 == 0
			var v evaluator
			v.splice(s.e, b, fl, wl)
			for i := range checkTable {
				d := &checkTable[i]
				if !d.applies(pre) {
					continue
				}
				if d.flange.check != nil {
					require.Equal(t, d.flange.check(&v.f, d, full).Utilisation, d.flange.u(&v.f), "%s (flange half), case %d", d.id, k)
				}
				if d.web.check != nil {
					c := d.web.check(&v.w, d, full)
					require.Equal(t, c.Utilisation, d.web.u(&v.w), "%s (web half), case %d", d.id, k)
					if c.Clause == d.altClause {
						axial++
					}
				}
				if d.bolt.check != nil {
					require.Equal(t, d.bolt.check(s.e, b, d, full).Utilisation, d.bolt.u(s.e, b), "%s, case %d", d.id, k)
				}
			}
			r := assemble(new(evaluator), s.e, b, fl, wl, &s.rates[0], full)
			pass, measure := verdict(&v)
			require.Equal(t, r.Pass, pass, "case %d", k)
			require.Equal(t, r.Utilisation, measure, "case %d", k)
		})
	}
	assert.Greater(t, splices, 1000)
	assert.Greater(t, axial, 0, "the axial form of web.plate.combined was exercised")
}

// TestSizingGroupsIndependent: what the memos of the search rely on. Over the design space of
// random positions, the row-free flange checks give the same utilisations for every bolt class
// of a size and every rows entry from two on, and the web plate checks the same for every class
// of a size (seeded).
func TestSizingGroupsIndependent(t *testing.T) {
	rng := rand.New(rand.NewSource(23))
	for k := 0; k < 12; k++ {
		p := randomProblem(t, rng)
		s, err := newSearcher(&p)
		require.NoError(t, err)
		flangeKey := map[[5]int][]float64{} // size and the flange key without the rows
		webKey := map[[4]int][]float64{}    // size and the web key
		for bi := range s.bolts {
			b := &s.bolts[bi]
			s.forEachFlange(b, func(fl *flangeLayout) {
				if fl.rows < 2 {
					return
				}
				var v evaluator
				x := v.flange(s.e, b, fl)
				var us []float64
				for _, n := range s.groups.flangeRowFree() {
					us = append(us, n.u(x))
				}
				key := [5]int{b.key[0], fl.key[0], fl.key[1], fl.key[2], fl.key[3]}
				if prev, ok := flangeKey[key]; ok {
					require.Equal(t, prev, us, "case %d: flange %v, class %s, rows %d", k, key, b.class.Name, fl.rows)
				} else {
					flangeKey[key] = us
				}
			})
			s.forEachWeb(b, func(wl *webLayout) {
				var v evaluator
				x := v.web(s.e, b, wl)
				var us []float64
				for _, n := range s.groups.webPlates() {
					us = append(us, n.u(x))
				}
				key := [4]int{b.key[0], wl.key[0], wl.key[1], wl.key[2]}
				if prev, ok := webKey[key]; ok {
					require.Equal(t, prev, us, "case %d: web %v, class %s", k, key, b.class.Name)
				} else {
					webKey[key] = us
				}
			})
		}
		require.NotEmpty(t, flangeKey)
		require.NotEmpty(t, webKey)
	}
}

// TestGridNumbersEveryCellOnce: a memo grid numbers each cell of its box exactly once, from 0 to
// cells − 1, and an index outside its list is a broken invariant.
func TestGridNumbersEveryCellOnce(t *testing.T) {
	g := newGrid(2, 3, 1, 4)
	require.Equal(t, 24, g.cells())
	seen := make([]bool, g.cells())
	for a := 0; a < 2; a++ {
		for b := 0; b < 3; b++ {
			for d := 0; d < 4; d++ {
				c := g.at(a, b, 0, d)
				require.False(t, seen[c], "cell %d twice", c)
				seen[c] = true
			}
		}
	}
	assert.NotContains(t, seen, false)
	assert.Panics(t, func() { g.at(2, 0, 0, 0) })
	assert.Panics(t, func() { g.at(0, 0, 1, 0) })
	assert.Panics(t, func() { g.at(0, -1, 0, 0) })
	assert.Panics(t, func() { g.at(0, 0, 0) })
	empty := newGrid(3, 0)
	assert.Equal(t, 0, empty.cells())
}
