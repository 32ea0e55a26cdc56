package jobfile

import (
	"fmt"
	"strings"
	"testing"
	"time"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"
	"go.yaml.in/yaml/v3"

	"spanbreak/beam"
)

// doc exercises every kind the generic decoder supports.
type doc struct {
	Meta
	Name   string             `yaml:"name,required"`
	Flag   bool               `yaml:"flag"`
	Count  int                `yaml:"count"`
	Ratio  float64            `yaml:"ratio"`
	Opt    *inner             `yaml:"opt"`
	List   []float64          `yaml:"list"`
	Pair   [2]int             `yaml:"pair"`
	Plain  map[string]float64 `yaml:"plain"`
	Order  Map[inner]         `yaml:"order"`
	Custom upper              `yaml:"custom"`
}

type inner struct {
	Meta
	A float64 `yaml:"a,required"`
	B string  `yaml:"b"`
}

// upper is a custom type: a string that must be upper case, decoded through NodeDecoder.
type upper string

func (u *upper) DecodeYAMLNode(n *yaml.Node, d *Decoder) {
	var s string
	d.Decode(n, &s)
	if strings.ToUpper(s) != s {
		d.Problemf(n, "want upper case, got %q", s)
		return
	}
	*u = upper(s)
}

func decodeDoc(t *testing.T, src string) (doc, Problems) {
	t.Helper()
	var d doc
	err := Decode("d.yaml", []byte(src), &d)
	if err == nil {
		return d, nil
	}
	var ps Problems
	require.ErrorAs(t, err, &ps)
	return d, ps
}

func TestDecodeGood(t *testing.T) {
	src := `name: beam one
flag: true
count: 12
ratio: 0.25
opt: {a: 1.5, b: x}
list: [1, 2.5, -3e2]
pair: [3, 4]
plain: {p: 1, q: 2}
order:
  zeta: {a: 1}
  alpha: {a: 2}
  "10.9": {a: 3}
custom: ABC
`
	d, ps := decodeDoc(t, src)
	require.Nil(t, ps)
	assert.Equal(t, "beam one", d.Name)
	assert.True(t, d.Flag)
	assert.Equal(t, 12, d.Count)
	assert.InEpsilon(t, 0.25, d.Ratio, 1e-15)
	require.NotNil(t, d.Opt)
	assert.InEpsilon(t, 1.5, d.Opt.A, 1e-15)
	assert.Equal(t, "x", d.Opt.B)
	assert.Equal(t, []float64{1, 2.5, -300}, d.List)
	assert.Equal(t, [2]int{3, 4}, d.Pair)
	assert.Equal(t, map[string]float64{"p": 1, "q": 2}, d.Plain)
	assert.Equal(t, []string{"zeta", "alpha", "10.9"}, d.Order.Keys())
	assert.Equal(t, Loc{File: "d.yaml", Pos: Pos{10, 3}, Path: "order.zeta"}, d.Order[0].Loc)
	assert.Equal(t, `order["10.9"]`, d.Order[2].Loc.Path)
	v, ok := d.Order.Get("alpha")
	require.True(t, ok)
	assert.InEpsilon(t, 2.0, v.A, 1e-15)
	assert.Equal(t, "order.alpha", v.Meta.Loc.Path)
	assert.Equal(t, upper("ABC"), d.Custom)

	// Locations of nested keys, through Meta.Where.
	assert.Equal(t, Loc{File: "d.yaml", Pos: Pos{6, 16}, Path: "list[2]"}, d.Where("list[2]"))
	assert.Equal(t, Loc{File: "d.yaml", Pos: Pos{5, 18}, Path: "opt.b"}, d.Where("opt.b"))
	assert.Equal(t, Pos{5, 18}, d.Opt.Where("b").Pos)
	// An absent key is placed at its nearest present ancestor, keeping the path asked for.
	assert.Equal(t, Loc{File: "d.yaml", Pos: Pos{5, 6}, Path: "opt.c"}, d.Where("opt.c"))
	assert.True(t, d.Has("opt.a"))
	assert.False(t, d.Has("opt.c"))
}

func TestDecodeNullAndAbsent(t *testing.T) {
	d, ps := decodeDoc(t, "name: x\nopt:\nlist:\n")
	require.Nil(t, ps)
	assert.Nil(t, d.Opt, "a null optional block is absent")
	assert.Nil(t, d.List)
	assert.True(t, d.Has("opt"), "but the key was written")
}

// problemCase is one bad input with the problems it must give, each "line:col: path: message
// fragment" (a fragment: the start of the message is enough).
type problemCase struct {
	name string
	src  string
	want []string
}

// checkProblems asserts that ps holds exactly the wanted problems, in order.
func checkProblems(t *testing.T, file string, ps Problems, want []string) {
	t.Helper()
	ps.Sort()
	var got []string
	for _, p := range ps {
		got = append(got, p.String())
	}
	require.Len(t, got, len(want), "problems:\n%s", strings.Join(got, "\n"))
	for i, w := range want {
		assert.Contains(t, got[i], file+":"+w, "problem %d", i)
	}
}

func TestDecodeProblems(t *testing.T) {
	tests := []problemCase{
		{"missing required", "flag: true\n", []string{`1:1: missing required key "name"`}},
		{"missing required in nested", "name: x\nopt: {b: y}\n", []string{`2:6: opt: missing required key "a"`}},
		{"unknown key with suggestion", "name: x\nflga: true\n",
			[]string{`2:1: unknown key "flga" (allowed: name, flag, count, ratio, opt, list, pair, plain, order, custom); did you mean "flag"?`}},
		{"unknown key far from any", "name: x\nzzzzzz: 1\n", []string{`2:1: unknown key "zzzzzz" (allowed: name,`}},
		{"misspelt required key is not also missing", "nmae: x\n", []string{`1:1: unknown key "nmae"`}},
		{"case slip suggests", "name: x\nFlag: true\n", []string{`2:1: unknown key "Flag" (allowed: name, flag, count, ratio, opt, list, pair, plain, order, custom); did you mean "flag"?`}},
		{"duplicate key", "name: x\ncount: 1\ncount: 2\n", []string{`3:1: duplicate key "count" (first at line 2)`}},
		{"duplicate in a Map", "name: x\norder:\n  a: {a: 1}\n  a: {a: 2}\n", []string{`4:3: order: duplicate key "a" (first at line 3)`}},
		{"duplicate in a map", "name: x\nplain: {p: 1, p: 2}\n", []string{`2:15: plain: duplicate key "p" (first at line 2)`}},
		{"string wanted, got list", "name: [a]\n", []string{`1:7: name: want a string, got a list`}},
		{"string wanted, got bool", "name: true\n", []string{`1:7: name: want a string, got true`}},
		{"string wanted, got null", "name:\n", []string{`1:6: name: want a string, got nothing (null)`}},
		{"bool wanted", "name: x\nflag: yes\n", []string{`2:7: flag: want true or false, got "yes"`}},
		{"int wanted, got float", "name: x\ncount: 1.5\n", []string{`2:8: count: want a whole number, got 1.5`}},
		{"int wanted, got text", "name: x\ncount: many\n", []string{`2:8: count: want a whole number, got "many"`}},
		{"int out of range", "name: x\ncount: 99999999999999999999\n", []string{`2:8: count: the number 99999999999999999999 is out of range`}},
		{"float wanted, got text", "name: x\nratio: abc\n", []string{`2:8: ratio: want a number, got "abc"`}},
		{"float wanted, got quoted number", "name: x\nratio: \"0.5\"\n", []string{`2:8: ratio: want a number, got "0.5"`}},
		{"NaN", "name: x\nratio: .nan\n", []string{`2:8: ratio: NaN is not a value`}},
		{"NaN upper case", "name: x\nratio: .NaN\n", []string{`2:8: ratio: NaN is not a value`}},
		{"infinity", "name: x\nratio: .inf\n", []string{`2:8: ratio: an infinite value is not allowed`}},
		{"minus infinity", "name: x\nratio: -.Inf\n", []string{`2:8: ratio: an infinite value is not allowed`}},
		{"infinity in a list", "name: x\nlist: [1, +.inf]\n", []string{`2:11: list[1]: an infinite value is not allowed`}},
		{"octal-looking int", "name: x\ncount: 0o17\n", []string{`2:8: count: want a whole number, got 0o17`}},
		{"hex float", "name: x\nratio: 0x1F\n", []string{`2:8: ratio: want a decimal number, got 0x1F`}},
		{"underscore digits", "name: x\nratio: 1_000\n", []string{`2:8: ratio: want a decimal number, got 1_000`}},
		{"array length", "name: x\npair: [1, 2, 3]\n", []string{`2:7: pair: want a list of 2 values, got a list`}},
		{"list wanted", "name: x\nlist: 3\n", []string{`2:7: list: want a list, got 3`}},
		{"mapping wanted", "name: x\nopt: 3\n", []string{`2:6: opt: want a mapping (key: value), got 3`}},
		{"Map wanted", "name: x\norder: [1]\n", []string{`2:8: order: want a mapping (name: value), got a list`}},
		{"custom type problem", "name: x\ncustom: abc\n", []string{`2:9: custom: want upper case, got "abc"`}},
		{"alias", "name: &n x\ncustom: *n\n", []string{`2:9: custom: aliases (*n) are not allowed: write the value out`}},
		{"alias key", "name: x\nplain: {&k p: 1, *k : 2}\n", []string{`2:18: plain: aliases (*k) are not allowed: write the key out`}},
		{"merge key", "name: x\nopt:\n  <<: {a: 1}\n", []string{`2:1: opt: missing required key "a"`, `3:3: opt: merge keys (<<) are not supported`}},
		{"custom tag", "name: !secret x\n", []string{`1:7: name: the YAML tag !secret is not supported here`}},
		{"binary tag", "name: !!binary aGVsbG8=\n", []string{`1:7: name: the YAML tag !!binary is not supported here`}},
		{"non-string key", "name: x\nplain: {[1]: 2}\n", []string{`2:9: plain: want a key name, got a list`}},
		{"several problems sorted by position", "ratio: x\nname: [1]\ncount: y\n", []string{
			`1:8: ratio: want a number`, `2:7: name: want a string`, `3:8: count: want a whole number`}},
		{"empty file", "", []string{` the file is empty`}},
		{"comments only", "# nothing here\n", []string{` the file is empty`}},
		{"top level list", "- 1\n", []string{`1:1: want a mapping of keys at the top of the file, got a list`}},
		{"top level scalar", "hello\n", []string{`1:1: want a mapping of keys at the top of the file, got "hello"`}},
		{"syntax error", "name: x\nlist: [1, 2\n", []string{`1: YAML syntax: did not find expected ',' or ']'`}},
		{"tab indentation", "name: x\nopt:\n\ta: 1\n", []string{`3: YAML syntax: found character that cannot start any token`}},
		{"two documents", "name: x\n---\nname: y\n", []string{`2:1: a second YAML document (after ---): a file holds one document`}},
		{"not UTF-8", "name: \xff\xfe\n", []string{`1:7: byte 0xFF is not UTF-8 text`}},
		{"Latin-1 on a later line", "name: x\nopt: {a: caf\xe9}\n", []string{
			`2:13: byte 0xE9 is not UTF-8 text (is the file saved as Latin-1 or Windows-1252? save it as UTF-8)`}},
		{"NUL byte", "name: a\x00b\n", []string{`1:8: the character U+0000 is not allowed in a YAML file`}},
		{"raw ESC after a multi-byte character", "name: \u00e9\x1b[31m\n", []string{`1:8: the character U+001B is not allowed`}},
		{"raw C1 control", "name: a\u009bb\n", []string{`1:8: the character U+009B is not allowed`}},
		{"non-character", "name: a\uffffb\n", []string{`1:8: the character U+FFFF is not allowed`}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, ps := decodeDoc(t, tc.src)
			checkProblems(t, "d.yaml", ps, tc.want)
		})
	}
}

// The characters refused before parsing are exactly those the YAML reader refuses, so that
// every refusal carries its line and column and nothing the parser takes is refused.
func TestTextProblemAgreesWithParser(t *testing.T) {
	var runes []rune
	for r := rune(0); r < 0x3000; r++ {
		runes = append(runes, r)
	}
	for r := rune(0xD7F0); r < 0x10000; r++ {
		if r < 0xD800 || r > 0xDFFF { // surrogates are not UTF-8
			runes = append(runes, r)
		}
	}
	runes = append(runes, 0x10000, 0x1F600, 0x10FFFF)
	for _, r := range runes {
		src := "name: \"a" + string(r) + "b\"\n"
		_, refused := textProblem([]byte(src))
		var node yaml.Node
		err := yaml.Unmarshal([]byte(src), &node)
		parserRefuses := err != nil && strings.Contains(err.Error(), "control characters are not allowed")
		if refused != parserRefuses {
			t.Errorf("%U: refused before parsing %v, by the parser %v (%v)", r, refused, parserRefuses, err)
		}
	}
}

func TestDecodeSizeLimit(t *testing.T) {
	over := "name: " + strings.Repeat("x", MaxFileSize) + "\n"
	start := time.Now()
	_, ps := decodeDoc(t, over)
	checkProblems(t, "d.yaml", ps, []string{` the file is 4194311 bytes; the limit is 4 MiB (4194304 bytes)`})
	assert.Less(t, time.Since(start), 100*time.Millisecond, "refused before parsing")

	// Exactly at the limit is parsed.
	at := "name: " + strings.Repeat("x", MaxFileSize-7) + "\n"
	require.Len(t, at, MaxFileSize)
	d, ps := decodeDoc(t, at)
	require.Nil(t, ps)
	assert.Len(t, d.Name, MaxFileSize-7)
}

// aliasBomb builds the classic "billion laughs": each level refers ten times to the one
// before, so expanding level n would make 10ⁿ nodes.
func aliasBomb(levels int) string {
	var b strings.Builder
	b.WriteString("a0: &a0 [lol, lol, lol, lol, lol, lol, lol, lol, lol, lol]\n")
	for i := 1; i <= levels; i++ {
		fmt.Fprintf(&b, "a%d: &a%d [", i, i)
		for j := range 10 {
			if j > 0 {
				b.WriteString(", ")
			}
			fmt.Fprintf(&b, "*a%d", i-1)
		}
		b.WriteString("]\n")
	}
	return b.String()
}

func TestAliasBombRejectedFast(t *testing.T) {
	// Inside a value the decoder descends into, and as an unknown key it never reads.
	inValue := "name: x\nlist: " + strings.ReplaceAll(aliasBomb(9), "\n", "\n  ")
	bombs := map[string]string{
		"unknown top-level keys":  aliasBomb(9),
		"inside a list":           "name: x\n" + strings.Replace(aliasBomb(9), "a9:", "list:", 1),
		"inside a Map of structs": "name: x\norder:\n  k: *a9\n" + aliasBomb(9),
		"indented under a key":    inValue,
	}
	for name, src := range bombs {
		t.Run(name, func(t *testing.T) {
			start := time.Now()
			var d doc
			err := Decode("bomb.yaml", []byte(src), &d)
			require.Error(t, err)
			assert.Less(t, time.Since(start), 500*time.Millisecond)
			assert.LessOrEqual(t, strings.Count(err.Error(), "\n"), maxProblems)
		})
	}
}

func TestJobAliasBombRejectedFast(t *testing.T) {
	src := aliasBomb(9) + "beam:\n  section: IPE 300\n  spans: *a9\n  supports: [pinned, roller]\n" +
		"cases:\n  G: {kind: permanent, loads: *a9}\n"
	start := time.Now()
	_, err := LoadJob("bomb.yaml", []byte(src))
	require.Error(t, err)
	assert.Less(t, time.Since(start), 500*time.Millisecond)
	assert.Contains(t, err.Error(), "bomb.yaml:13:10: beam.spans: aliases (*a9) are not allowed")
	assert.Contains(t, err.Error(), "bomb.yaml:16:31: cases.G.loads: aliases (*a9) are not allowed")
}

func TestTooManyProblems(t *testing.T) {
	var b strings.Builder
	b.WriteString("name: x\n")
	for i := range 3 * maxProblems {
		fmt.Fprintf(&b, "k%d: 1\n", i)
	}
	_, ps := decodeDoc(t, b.String())
	require.Len(t, ps, maxProblems+1)
	assert.Contains(t, ps.Error(), "too many problems; only the first 100 are listed")
}

func TestProblemFormat(t *testing.T) {
	ps := Problems{
		{File: "j.yaml", Line: 9, Column: 3, Path: "b", Message: "second"},
		{File: "j.yaml", Line: 2, Column: 5, Path: "a.b[1]", Message: "first"},
		{File: "j.yaml", Line: 9, Column: 3, Message: "third, same place, kept after second"},
		{File: "j.yaml", Message: "whole file"},
		{File: "j.yaml", Line: 4, Message: "line only"},
	}
	assert.Equal(t, "j.yaml: whole file\n"+
		"j.yaml:2:5: a.b[1]: first\n"+
		"j.yaml:4: line only\n"+
		"j.yaml:9:3: b: second\n"+
		"j.yaml:9:3: third, same place, kept after second", ps.Error())
	assert.NoError(t, Problems(nil).Err())
	var added Problems
	added.Add(Loc{File: "j.yaml", Pos: Pos{3, 4}, Path: "x"}, "bad %s", "value")
	assert.Equal(t, "j.yaml:3:4: x: bad value", added.Err().Error())
}

func TestSuggest(t *testing.T) {
	allowed := []string{"section", "grade", "spans", "spars", "supports", "overhang", "self_weight"}
	tests := []struct{ got, want string }{
		{"sectoin", "section"},  // adjacent swap: one edit
		{"secton", "section"},   // deletion
		{"grades", "grade"},     // insertion
		{"SPANS", "spans"},      // case only
		{"suports", "supports"}, // deletion
		{"selfweight", "self_weight"},
		{"overhung", "overhang"},
		{"xyz", ""},                    // nothing close
		{"span", "spans"},              // short word, one edit
		{"sp", ""},                     // too far for a two-letter word
		{"section", ""},                // exact: no suggestion needed
		{"grad", "grade"},              // four letters, one edit
		{"spas", ""},                   // one edit from spans and from spars: equally near, no suggestion
		{"slef_wieght", "self_weight"}, // two swaps
		{strings.Repeat("s", 100), ""},
	}
	for _, tc := range tests {
		assert.Equal(t, tc.want, Suggest(tc.got, allowed), tc.got)
	}
}

// TestSuggestionsAgreeWithSections: the job file's did-you-mean and the section catalogue's close
// names follow one rule (beam.Nearest). A misspelt section name gets from Suggest, over the
// catalogue's names, the name the catalogue puts first when the catalogue offers exactly one,
// and nothing when the catalogue offers none or several equally near ones. The names are
// written without spaces, as the catalogue compares them; the misspellings are of the names
// themselves, not of the other spellings the catalogue also accepts ("HEB 300").
func TestSuggestionsAgreeWithSections(t *testing.T) {
	var names []string
	for _, s := range beam.Sections("") {
		names = append(names, strings.ReplaceAll(s.Name, " ", ""))
	}
	tests := []struct {
		got     string
		offered int // names the catalogue offers
	}{
		{"IEP500", 1},        // two neighbours swapped
		{"UC350x305x97", 1},  // two neighbours swapped
		{"IPE5000", 1},       // a letter too many
		{"UB610x229x126", 1}, // one letter wrong
		{"IPE50", 3},         // one edit from IPE 80, IPE 450 and IPE 500
		{"IPE520", 3},        // one edit from IPE 500, 550, 220 and more
		{"HE300C", 3},        // one edit from HE 300 A, B and M
		{"XYZ123", 0},        // nothing close
		{"IPE5", 0},          // four letters: one edit at most, and every name is two away
		{"IP", 0},            // too short for anything but a difference of case
	}
	for _, tc := range tests {
		_, err := beam.LookupSection(tc.got)
		var unknown *beam.UnknownSectionError
		require.ErrorAs(t, err, &unknown, tc.got)
		require.Len(t, unknown.Suggestions, tc.offered, "%s: %v", tc.got, unknown.Suggestions)
		got := Suggest(tc.got, names)
		if tc.offered == 1 {
			assert.Equal(t, strings.ReplaceAll(unknown.Suggestions[0], " ", ""), got, tc.got)
		} else {
			assert.Empty(t, got, tc.got)
		}
	}
}

func TestDecodeProgrammerErrors(t *testing.T) {
	assert.Panics(t, func() { _ = Decode("x", []byte("a: 1"), doc{}) })
	var notStruct int
	assert.Panics(t, func() { _ = Decode("x", []byte("a: 1"), &notStruct) })
	var untagged struct{ A int }
	assert.Panics(t, func() { _ = Decode("x", []byte("A: 1"), &untagged) })
}
