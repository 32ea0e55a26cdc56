package jobfile_test

import (
	"fmt"
	"math"
	"reflect"
	"regexp"
	"strconv"
	"strings"
	"testing"
	"unicode/utf8"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/beam"
	"spanbreak/optimise"
	"spanbreak/optimise/jobfile"
	"spanbreak/splice"
)

// refEntry is one key of the reference: its header line and the indented lines below it.
type refEntry struct {
	path   string // normalised: a CAPITALS name segment is "*"
	header string // the rest of the header line ("required", "required for a spring", "")
	body   string
}

// parseReference splits the reference into the entries of the job file and of the splice
// file. An entry starts at a line that begins with a lowercase key path.
func parseReference(t *testing.T, text string) (job, spliceFile map[string]refEntry) {
	t.Helper()
	entryLine := regexp.MustCompile(`^([a-z][A-Za-z0-9_.\[\]]*)(?:\s{2,}(\S.*))?$`)
	placeholder := regexp.MustCompile(`\.[A-Z]+(\.|\[|$)`)
	job, spliceFile = map[string]refEntry{}, map[string]refEntry{}
	cur := job
	var e *refEntry
	flush := func() {
		if e != nil {
			_, dup := cur[e.path]
			assert.False(t, dup, "%s is described twice", e.path)
			cur[e.path] = *e
			e = nil
		}
	}
	for _, line := range strings.Split(text, "\n") {
		switch m := entryLine.FindStringSubmatch(line); {
		case m != nil:
			flush()
			p := placeholder.ReplaceAllString(m[1], ".*$1")
			e = &refEntry{path: p, header: m[2]}
		case line == "" || strings.HasPrefix(line, " "):
			if e != nil {
				e.body += line + "\n"
			}
		default: // a heading
			flush()
			if strings.HasPrefix(line, "SPLICE FILE") {
				cur = spliceFile
			}
		}
	}
	flush()
	return job, spliceFile
}

// schemaKey is one key the decoder accepts, with whether its yaml tag makes it required.
type schemaKey struct {
	path     string
	required bool
}

// selfDecodedKeys lists the keys of the schema types that read themselves (NodeDecoder)
// instead of through yaml tags: they cannot be found by walking tags.
func selfDecodedKeys() map[reflect.Type][]struct {
	key      string
	typ      reflect.Type
	required bool
} {
	type k = struct {
		key      string
		typ      reflect.Type
		required bool
	}
	leaf := reflect.TypeFor[float64]()
	return map[reflect.Type][]k{
		reflect.TypeFor[jobfile.Section](): {{"welded", reflect.TypeFor[jobfile.Welded](), true}},
		reflect.TypeFor[jobfile.Support](): {{"type", leaf, true}, {"k", leaf, false}},
		reflect.TypeFor[jobfile.Load](): {{"udl", leaf, false}, {"trapezoid", leaf, false}, {"point", leaf, false},
			{"moment", leaf, false}, {"axial", leaf, false}, {"from", leaf, false}, {"to", leaf, false}, {"at", leaf, false}},
	}
}

// schemaKeys walks a schema type by its yaml tags and returns every key path, "*" for a
// name the user chooses (a Map key) and "[]" for a list entry.
func schemaKeys(t *testing.T, root reflect.Type) []schemaKey {
	t.Helper()
	var keys []schemaKey
	self := selfDecodedKeys()
	decoder := reflect.TypeFor[jobfile.NodeDecoder]()
	var walk func(typ reflect.Type, path string)
	join := func(path, key string) string {
		if path == "" {
			return key
		}
		return path + "." + key
	}
	walk = func(typ reflect.Type, path string) {
		for typ.Kind() == reflect.Pointer {
			typ = typ.Elem()
		}
		if typ.PkgPath() == reflect.TypeFor[jobfile.Job]().PkgPath() && strings.HasPrefix(typ.Name(), "Map[") {
			value, ok := typ.Elem().FieldByName("Value")
			require.True(t, ok, "%s has no Value", typ)
			walk(value.Type, path+".*")
			return
		}
		switch typ.Kind() {
		case reflect.Slice, reflect.Array:
			walk(typ.Elem(), path+"[]")
			return
		case reflect.Struct:
		default:
			return
		}
		if list, ok := self[typ]; ok {
			for _, k := range list {
				keys = append(keys, schemaKey{join(path, k.key), k.required})
				walk(k.typ, join(path, k.key))
			}
			return
		}
		if reflect.PointerTo(typ).Implements(decoder) {
			t.Errorf("%s decodes itself: list its keys in selfDecodedKeys", typ)
			return
		}
		for i := range typ.NumField() {
			f := typ.Field(i)
			tag, ok := f.Tag.Lookup("yaml")
			if !ok {
				continue
			}
			name, opts, _ := strings.Cut(tag, ",")
			keys = append(keys, schemaKey{join(path, name), opts == "required"})
			walk(f.Type, join(path, name))
		}
	}
	walk(root, "")
	return keys
}

func checkCoverage(t *testing.T, what string, keys []schemaKey, ref map[string]refEntry) {
	t.Helper()
	known := map[string]bool{}
	for _, k := range keys {
		known[k.path] = true
		e, ok := ref[k.path]
		if !assert.True(t, ok, "%s key %s is not in jobfile-reference.txt", what, k.path) {
			continue
		}
		if k.required {
			assert.True(t, strings.HasPrefix(e.header, "required"), "%s %s is required: say so on its line", what, k.path)
		}
		// validate.go requires a case's loads although the tag does not ("the case has no loads")
		requiredByChecks := k.path == "cases.*.loads"
		if e.header == "required" && !k.required && !requiredByChecks {
			assert.Fail(t, "marked required but optional", "%s %s", what, k.path)
		}
	}
	for p := range ref {
		assert.True(t, known[p], "jobfile-reference.txt describes %s key %s, which the schema does not have", what, p)
	}
}

// The reference describes every key the decoder accepts, and no other, in both files.
func TestReferenceCoversSchema(t *testing.T) {
	job, sf := parseReference(t, jobfile.Reference())
	jobKeys := schemaKeys(t, reflect.TypeFor[jobfile.Job]())
	require.Greater(t, len(jobKeys), 80, "the walk found the job schema")
	checkCoverage(t, "job file", jobKeys, job)
	checkCoverage(t, "splice file", schemaKeys(t, reflect.TypeFor[jobfile.SpliceFile]()), sf)
}

// Every entry gives its unit, default, allowed values and an example, in that order, and the
// text fits a terminal.
func TestReferenceEntriesComplete(t *testing.T) {
	job, sf := parseReference(t, jobfile.Reference())
	for _, ref := range []map[string]refEntry{job, sf} {
		for p, e := range ref {
			last := -1
			for _, label := range []string{"\n    unit: ", "\n    default: ", "\n    allowed: ", "\n    example: "} {
				i := strings.Index("\n"+e.body, label)
				if assert.GreaterOrEqual(t, i, 0, "%s has no %q line", p, strings.TrimSpace(label)) {
					assert.Greater(t, i, last, "%s: %q out of order", p, strings.TrimSpace(label))
					last = i
				}
			}
		}
	}
	for i, line := range strings.Split(jobfile.Reference(), "\n") {
		assert.LessOrEqual(t, utf8.RuneCountInString(line), 100, "line %d is too wide: %q", i+1, line)
	}
}

// tokens splits text into words, dropping punctuation around them.
func tokens(text string) []string {
	return strings.FieldsFunc(text, func(r rune) bool { return strings.ContainsRune(" \n,;:()[]{}\"|", r) })
}

// The allowed values in the reference are those the code accepts.
func TestReferenceNamesAllowedValues(t *testing.T) {
	job, sf := parseReference(t, jobfile.Reference())
	var grades []string
	for _, g := range beam.Grades() {
		grades = append(grades, g.Name)
	}
	rows := []struct {
		ref    map[string]refEntry
		path   string
		values []string
	}{
		{job, "beam.grade", grades},
		{job, "beam.grade_table", []string{jobfile.GradeTableEN1993, jobfile.GradeTableEN10025}},
		{job, "beam.supports", jobfile.SupportTypes()},
		{job, "beam.supports[].type", jobfile.SupportTypes()},
		{job, "cases.*.kind", jobfile.CaseKinds()},
		{job, "cases.*.category", append(jobfile.ImposedCategories(), jobfile.SnowCategories()...)},
		{job, "cases.*.loads", jobfile.LoadKinds()},
		{job, "combinations.rules", []string{jobfile.RulesEN1990}},
		{job, "combinations.uls", []string{jobfile.ULS610, jobfile.ULS610ab}},
		{job, "combinations.sls", []string{jobfile.SLSCharacteristic, jobfile.SLSFrequent, jobfile.SLSQuasiPermanent}},
		{job, "combinations.overrides", jobfile.OverrideKeys()},
		{job, "combinations.extra[].state", []string{jobfile.StateULS, jobfile.StateSLS}},
		{job, "splice.category", jobfile.SpliceCategories()},
		{job, "splice.friction_class", jobfile.FrictionClasses()},
		{job, "splice.bolts.classes", jobfile.BoltClasses()},
		{job, "splice.flange_plates", []string{jobfile.FlangeOuter, jobfile.FlangeOuterInner}},
		{job, "splice.distribution", []string{jobfile.DistributionProportional, jobfile.DistributionFlangesOnly}},
		{job, "costs.bolt_class_factor", jobfile.BoltClasses()},
		{sf, "category", jobfile.SpliceCategories()},
		{sf, "friction_class", jobfile.FrictionClasses()},
		{sf, "bolt.class", jobfile.BoltClasses()},
		{sf, "holes", []string{jobfile.HolesNormal, jobfile.HolesOversize}},
	}
	for _, r := range rows {
		e, ok := r.ref[r.path]
		require.True(t, ok, r.path)
		words := tokens(e.body)
		for _, v := range r.values {
			assert.Contains(t, words, v, "%s does not name %q", r.path, v)
		}
	}
	// every bolt size the reference offers is one the splice package knows
	for _, p := range []string{"splice.bolts.sizes"} {
		allowed := job[p].body[strings.Index(job[p].body, "allowed:"):]
		for _, w := range tokens(allowed) {
			if strings.HasPrefix(w, "M") && len(w) <= 3 {
				_, err := splice.LookupBoltSize(w)
				assert.NoError(t, err, "%s offers %s", p, w)
			}
		}
	}
}

// defaultOf returns the text after "default: " of an entry, continuation lines joined.
func defaultOf(t *testing.T, ref map[string]refEntry, path string) string {
	t.Helper()
	e, ok := ref[path]
	require.True(t, ok, path)
	_, after, ok := strings.Cut(e.body, "    default: ")
	require.True(t, ok, path)
	before, _, _ := strings.Cut(after, "\n    allowed: ")
	return strings.Join(strings.Fields(before), " ")
}

// The defaults the reference states are the ones the code applies.
func TestReferenceDefaultsMatchCode(t *testing.T) {
	job, sf := parseReference(t, jobfile.Reference())
	setup, err := optimise.Prepare("job.yaml", []byte(`beam: {section: IPE 300, spans: [6.0], supports: [pinned, roller]}
cases: {G: {kind: permanent, loads: [{udl: 10}]}}
`))
	require.NoError(t, err)
	sp := setup.Splice
	rules, err := beam.NewRules("", "", "", nil)
	require.NoError(t, err)
	require.False(t, rules.CombineRoofImposed, "the rule on roof imposed loads is on by default, as the reference says")
	dist, err := splice.ParseDistribution("")
	require.NoError(t, err)
	space := splice.DefaultDesignSpace()
	var arrangements []string
	for _, a := range space.Arrangements {
		arrangements = append(arrangements, string(a))
	}
	var thicknesses []string
	for _, th := range space.Thicknesses {
		thicknesses = append(thicknesses, num(th))
	}
	rows := []struct {
		ref  map[string]refEntry
		path string
		want string // the default text starts with this
	}{
		{job, "beam.grade", setup.Grade.Name},
		{job, "beam.grade_table", jobfile.GradeTableEN1993},
		{job, "beam.self_weight", strconv.FormatBool(jobfile.Beam{}.IncludesSelfWeight())},
		{job, "combinations.rules", rules.Set},
		{job, "combinations.uls", strconv.Quote(rules.ULS)},
		{job, "combinations.sls", rules.SLS},
		{job, "combinations.roof_imposed_separate", strconv.FormatBool((*jobfile.Combinations)(nil).SeparatesRoofImposed())},
		{job, "splice.category", string(sp.Sizing.Category)},
		{job, "splice.gap", num(sp.Sizing.Gap)},
		{job, "splice.distribution", string(dist)},
		{job, "splice.bolts.sizes", strings.Join(space.Sizes, ", ")},
		{job, "splice.bolts.classes", strings.Join(space.Classes, ", ")},
		{job, "splice.plates.thicknesses", strings.Join(thicknesses, ", ")},
		{job, "splice.flange_plates", strings.Join(arrangements, ", ")},
		{job, "scan.step", num(optimise.DefaultStep*1e-3) + " m"},
		{job, "scan.alternatives", strconv.Itoa(optimise.DefaultAlternatives)},
		{job, "limits.splices.min", "0"},
		{sf, "bolt.threads_in_shear_plane", "from the bolt length"},
		{job, "splice.assemblies.shear_planes", jobfile.BoltSpec{}.ShearPlanes()},
		{job, "splice.assemblies.shear_planes", splice.PlanesFromLength.String()},
		{sf, "holes", jobfile.HolesNormal},
	}
	for _, r := range rows {
		assert.True(t, strings.HasPrefix(defaultOf(t, r.ref, r.path), r.want),
			"%s: the reference says %q, the code %q", r.path, defaultOf(t, r.ref, r.path), r.want)
	}
	// The plates take the beam's grade; the override defaults are EN 1990 Table A1.2(B).
	assert.Equal(t, setup.Grade.Name, sp.PlateSteel.Name)
	overrides := job["combinations.overrides"].body
	for _, v := range []struct {
		key string
		val float64
	}{{"gamma_G_sup", rules.GammaGSup}, {"gamma_G_inf", rules.GammaGInf}, {"gamma_Q", rules.GammaQ}, {"xi", rules.Xi}} {
		assert.Contains(t, overrides, fmt.Sprintf("default %.2f", v.val), v.key)
	}
	// pattern: true for imposed cases only
	assert.Equal(t, "true for imposed cases, false for every other kind", defaultOf(t, job, "cases.*.pattern"))
	for _, kind := range jobfile.CaseKinds() {
		assert.Equal(t, kind == jobfile.KindImposed, jobfile.Case{Kind: kind}.Patterned(), kind)
	}
}

// allowedOf returns the text after "allowed: " of an entry, continuation lines joined.
func allowedOf(t *testing.T, ref map[string]refEntry, path string) string {
	t.Helper()
	e, ok := ref[path]
	require.True(t, ok, path)
	_, after, ok := strings.Cut(e.body, "    allowed: ")
	require.True(t, ok, path)
	before, _, _ := strings.Cut(after, "\n    example: ")
	return strings.Join(strings.Fields(before), " ")
}

// The reference states every plausible range the job file is checked against, under the key
// it bounds, in the words of the messages; and the largest number of spans the analysis takes.
func TestReferenceStatesPlausibleRanges(t *testing.T) {
	job, sf := parseReference(t, jobfile.Reference())
	placeholder := regexp.MustCompile(`\.[A-Z]+(\.|\[|$)`)
	ranges := jobfile.PlausibleRanges()
	require.NotEmpty(t, ranges)
	for _, r := range ranges {
		for _, key := range r.Keys {
			path := placeholder.ReplaceAllString(key, ".*$1")
			assert.Contains(t, allowedOf(t, job, path), r.Text, "%s: %s", key, r.What)
		}
		for _, key := range r.SpliceKeys {
			assert.Contains(t, allowedOf(t, sf, key), r.Text, "splice file %s: %s", key, r.What)
		}
	}
	// the conventions name the ranges of the sizes a user most often slips on
	for _, text := range []string{"plates 4 mm to 100 mm", "a gap of at most 50 mm", "titles of at most 200 characters",
		"lists of at most 100 entries", "at most 200000 scan positions"} {
		assert.Contains(t, strings.Join(strings.Fields(jobfile.Reference()), " "), text)
	}
	assert.Contains(t, allowedOf(t, job, "beam.spans"), fmt.Sprintf("at most %d spans and overhangs", beam.MaxRegions))
}

// num prints a value as the reference does: the shortest form of the value rounded to 1e-6.
func num(v float64) string { return strconv.FormatFloat(math.Round(v*1e6)/1e6, 'f', -1, 64) }
