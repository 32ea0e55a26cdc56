package jobfile

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"math"
	"reflect"
	"slices"
	"strconv"
	"strings"
	"unicode/utf8"

	"go.yaml.in/yaml/v3"
)

// MaxFileSize is the largest input accepted [bytes]: 4 MiB, a thousand times a large job.
const MaxFileSize = 4 << 20

// NodeDecoder is implemented by types that decode themselves from a YAML node (the unit
// types, Map, and the schema's either-or entries). The method is called on a pointer to the
// value; it reports every problem through d (d.Problemf) and may decode parts of the node with
// d.Decode, d.DecodeKey and d.DecodeIndex. It is never handed an alias node or a node with a
// non-standard tag: the decoder rejects those first.
type NodeDecoder interface {
	DecodeYAMLNode(n *yaml.Node, d *Decoder)
}

// Decoder walks a yaml.Node tree into Go values, collecting problems with their positions and
// key paths. It is made by Decode; custom types receive it through NodeDecoder.
type Decoder struct {
	file     string
	path     string
	problems Problems
	failed   []string // paths of values that did not decode, see markFailed
	index    *index
	structs  map[reflect.Type]*structInfo
}

// Decode parses data (the contents of file, which only names it in messages) as one YAML
// document and decodes it strictly into v, a non-nil pointer to a struct. It returns nil or a
// Problems error listing every problem found. Decode panics if v is not a pointer to a struct.
func Decode(file string, data []byte, v any) error {
	d, _ := decodeFile(file, data, v)
	return d.problems.Err()
}

// decodeFile is Decode, returning the decoder (for its index and problems) and whether the
// file was parsed at all.
func decodeFile(file string, data []byte, v any) (*Decoder, bool) {
	rv := reflect.ValueOf(v)
	if rv.Kind() != reflect.Pointer || rv.IsNil() || rv.Elem().Kind() != reflect.Struct {
		panic(fmt.Sprintf("jobfile.Decode: want a non-nil pointer to a struct, got %T", v))
	}
	d := &Decoder{file: file, index: newIndex(file), structs: make(map[reflect.Type]*structInfo)}
	root, ok := d.parse(data)
	if !ok {
		return d, false
	}
	d.index.record("", pos(root))
	if root.Kind != yaml.MappingNode {
		d.Problemf(root, "want a mapping of keys at the top of the file, got %s", describe(root))
		return d, false
	}
	d.decode(root, rv.Elem())
	return d, true
}

// parse reads exactly one YAML document and returns its top node.
func (d *Decoder) parse(data []byte) (*yaml.Node, bool) {
	if len(data) > MaxFileSize {
		d.problems.add(Problem{File: d.file, Message: fmt.Sprintf(
			"the file is %d bytes; the limit is %d MiB (%d bytes), and a job file is a few kilobytes",
			len(data), MaxFileSize>>20, MaxFileSize)})
		return nil, false
	}
	if pr, bad := textProblem(data); bad {
		pr.File = d.file
		d.problems.add(pr)
		return nil, false
	}
	dec := yaml.NewDecoder(bytes.NewReader(data))
	var doc yaml.Node
	if err := dec.Decode(&doc); err != nil {
		if errors.Is(err, io.EOF) {
			d.problems.add(Problem{File: d.file, Message: "the file is empty"})
		} else {
			d.syntaxProblem(err)
		}
		return nil, false
	}
	var second yaml.Node
	switch err := dec.Decode(&second); {
	case err == nil:
		d.problems.add(Problem{File: d.file, Line: second.Line, Column: second.Column,
			Message: "a second YAML document (after ---): a file holds one document"})
		return nil, false
	case !errors.Is(err, io.EOF):
		d.syntaxProblem(err)
		return nil, false
	}
	if doc.Kind != yaml.DocumentNode || len(doc.Content) != 1 {
		d.problems.add(Problem{File: d.file, Message: "the file holds no YAML document"})
		return nil, false
	}
	return doc.Content[0], true
}

// textProblem finds the first byte that keeps data from being YAML text: one that is not
// UTF-8 (a file saved as Latin-1 or Windows-1252), or a character the YAML reader refuses —
// a control character other than tab, line feed and carriage return, or a non-character
// (YAML 1.2 section 5.1, as go.yaml.in/yaml/v3 reads it). It returns the problem at that
// byte's line and column (counted in characters, as the parser counts them).
func textProblem(data []byte) (Problem, bool) {
	line, col := 1, 1
	for i := 0; i < len(data); {
		r, size := utf8.DecodeRune(data[i:])
		switch {
		case r == utf8.RuneError && size <= 1:
			return Problem{Line: line, Column: col, Message: fmt.Sprintf(
				"byte 0x%02X is not UTF-8 text (is the file saved as Latin-1 or Windows-1252? save it as UTF-8)", data[i])}, true
		case !yamlPrintable(r):
			return Problem{Line: line, Column: col, Message: fmt.Sprintf(
				"the character %U is not allowed in a YAML file (a control character other than tab and line breaks, or a non-character); in a double-quoted string write it as an escape such as \\x1b", r)}, true
		case r == '\n':
			line, col = line+1, 0
		}
		col++
		i += size
	}
	return Problem{}, false
}

// yamlPrintable reports whether the YAML reader accepts a character in a file: tab, line
// feed, carriage return, printable ASCII, NEL, and the Unicode ranges #xA0-#xD7FF,
// #xE000-#xFFFD and #x10000-#x10FFFF (YAML 1.2 production [1] c-printable).
func yamlPrintable(r rune) bool {
	switch {
	case r == 0x09, r == 0x0A, r == 0x0D, r >= 0x20 && r <= 0x7E, r == 0x85:
		return true
	case r >= 0xA0 && r <= 0xD7FF, r >= 0xE000 && r <= 0xFFFD, r >= 0x10000 && r <= 0x10FFFF:
		return true
	}
	return false
}

// syntaxProblem turns a parser error ("yaml: line 3: did not find ...") into a Problem.
func (d *Decoder) syntaxProblem(err error) {
	msg := strings.TrimPrefix(err.Error(), "yaml: ")
	line := 0
	if rest, ok := strings.CutPrefix(msg, "line "); ok {
		if num, after, ok := strings.Cut(rest, ": "); ok {
			if l, err := strconv.Atoi(num); err == nil {
				line, msg = l, after
			}
		}
	}
	d.problems.add(Problem{File: d.file, Line: line, Message: "YAML syntax: " + msg})
}

// Path returns the key path of the node being decoded.
func (d *Decoder) Path() string { return d.path }

// Problemf records a problem at node n under the current path, and marks the value at the
// current path as not decoded.
func (d *Decoder) Problemf(n *yaml.Node, format string, args ...any) {
	d.ProblemAt(Loc{File: d.file, Pos: pos(n), Path: d.path}, format, args...)
}

// ProblemAt records a problem at a location (from Meta.Where, for instance), and marks the
// value at its path as not decoded.
func (d *Decoder) ProblemAt(at Loc, format string, args ...any) {
	d.markFailed(at.Path)
	d.problems.Add(at, format, args...)
}

// keyProblemf records a problem with the keys of the mapping at the current path (unknown,
// duplicate or missing key) at node n. Unlike Problemf it does not mark the mapping as not
// decoded: the keys that were right still hold good values worth checking.
func (d *Decoder) keyProblemf(n *yaml.Node, format string, args ...any) {
	d.problems.Add(Loc{File: d.file, Pos: pos(n), Path: d.path}, format, args...)
}

// markFailed remembers that the value at path did not decode, so later checks leave it (and
// whatever contains or is contained in it) alone rather than report a misleading zero.
func (d *Decoder) markFailed(path string) {
	if len(d.failed) < 10*maxProblems {
		d.failed = append(d.failed, path)
	}
}

// Meta returns the Meta for a value decoded from n at the current path, for custom types
// that embed Meta.
func (d *Decoder) Meta(n *yaml.Node) Meta {
	d.index.record(d.path, pos(n))
	return Meta{Loc: d.index.loc(d.path, ""), index: d.index}
}

// Decode decodes n into v (a non-nil pointer) at the current path.
func (d *Decoder) Decode(n *yaml.Node, v any) {
	rv := reflect.ValueOf(v)
	if rv.Kind() != reflect.Pointer || rv.IsNil() {
		panic(fmt.Sprintf("jobfile.Decoder.Decode: want a non-nil pointer, got %T", v))
	}
	d.decode(n, rv.Elem())
}

// DecodeKey decodes n, the value of key, into v at the path extended by key.
func (d *Decoder) DecodeKey(key string, n *yaml.Node, v any) {
	defer d.enter(keyPath(d.path, key))()
	d.Decode(n, v)
}

// DecodeIndex decodes n, element i of a list, into v at the path extended by [i].
func (d *Decoder) DecodeIndex(i int, n *yaml.Node, v any) {
	defer d.enter(indexPath(d.path, i))()
	d.Decode(n, v)
}

// enter moves to a child path and returns the function that moves back.
func (d *Decoder) enter(path string) func() {
	saved := d.path
	d.path = path
	return func() { d.path = saved }
}

var nodeDecoderType = reflect.TypeFor[NodeDecoder]()

// decode is the reflective walk: it checks the node's form, then dispatches on v's kind.
func (d *Decoder) decode(n *yaml.Node, v reflect.Value) {
	d.index.record(d.path, pos(n))
	if !d.plainNode(n) {
		d.setMeta(n, v) // so that later checks know the value's path, and leave it alone
		return
	}
	if v.Kind() == reflect.Pointer {
		if isNull(n) {
			v.SetZero()
			return
		}
		elem := reflect.New(v.Type().Elem())
		d.decode(n, elem.Elem())
		v.Set(elem)
		return
	}
	if v.CanAddr() && v.Addr().Type().Implements(nodeDecoderType) {
		v.Addr().Interface().(NodeDecoder).DecodeYAMLNode(n, d)
		return
	}
	switch v.Kind() {
	case reflect.Struct:
		d.decodeStruct(n, v)
	case reflect.Slice:
		d.decodeSlice(n, v)
	case reflect.Array:
		d.decodeArray(n, v)
	case reflect.Map:
		d.decodeMap(n, v)
	case reflect.String:
		if s, ok := d.String(n); ok {
			v.SetString(s)
		}
	case reflect.Bool:
		if b, ok := d.Bool(n); ok {
			v.SetBool(b)
		}
	case reflect.Int:
		if i, ok := d.Int(n); ok {
			v.SetInt(int64(i))
		}
	case reflect.Float64:
		if f, ok := d.Float(n); ok {
			v.SetFloat(f)
		}
	default:
		panic(fmt.Sprintf("jobfile: cannot decode into %s", v.Type()))
	}
}

// setMeta fills the embedded Meta of a struct value, if it has one.
func (d *Decoder) setMeta(n *yaml.Node, v reflect.Value) {
	if v.Kind() != reflect.Struct {
		return
	}
	for i := range v.NumField() {
		if v.Type().Field(i).Type == metaType {
			v.Field(i).Set(reflect.ValueOf(d.Meta(n)))
			return
		}
	}
}

// plainNode rejects aliases, merge keys and non-standard tags, reporting them.
func (d *Decoder) plainNode(n *yaml.Node) bool {
	if n.Kind == yaml.AliasNode {
		d.Problemf(n, "aliases (*%s) are not allowed: write the value out", clip(n.Value))
		return false
	}
	switch tag := n.ShortTag(); tag {
	case "!!str", "!!int", "!!float", "!!bool", "!!null", "!!timestamp", "!!map", "!!seq":
		return true
	default:
		d.Problemf(n, "the YAML tag %s is not supported here", clip(tag))
		return false
	}
}

// pair is one key and value of a mapping node.
type pair struct {
	key   string
	kn, v *yaml.Node
}

// pairs returns the entries of a mapping node, reporting (and skipping) keys that are not
// plain strings and keys given twice. A null node is an empty mapping. ok is false when n is
// not a mapping at all; what says what was wanted, for the message.
func (d *Decoder) pairs(n *yaml.Node, what string) (ps []pair, ok bool) {
	if isNull(n) {
		return nil, true
	}
	if n.Kind != yaml.MappingNode {
		d.Problemf(n, "want %s, got %s", what, describe(n))
		return nil, false
	}
	seen := make(map[string]*yaml.Node, len(n.Content)/2)
	for i := 0; i+1 < len(n.Content); i += 2 {
		kn, vn := n.Content[i], n.Content[i+1]
		switch {
		case kn.Kind == yaml.AliasNode:
			d.Problemf(kn, "aliases (*%s) are not allowed: write the key out", clip(kn.Value))
			continue
		case kn.Kind != yaml.ScalarNode:
			d.Problemf(kn, "want a key name, got %s", describe(kn))
			continue
		case kn.Value == "<<" && kn.Style == 0:
			d.Problemf(kn, "merge keys (<<) are not supported: write the keys out")
			continue
		case !d.plainNode(kn):
			continue
		}
		if first, dup := seen[kn.Value]; dup {
			d.keyProblemf(kn, "duplicate key %q (first at line %d)", clip(kn.Value), first.Line)
			continue
		}
		seen[kn.Value] = kn
		ps = append(ps, pair{key: kn.Value, kn: kn, v: vn})
	}
	return ps, true
}

// valuePos is where a key's value is reported: at the value when it starts on the key's line,
// else at the key (a block mapping or list below it).
func valuePos(kn, vn *yaml.Node) *yaml.Node {
	if vn.Line == kn.Line {
		return vn
	}
	return kn
}

// structInfo lists the keys of a struct type.
type structInfo struct {
	fields []fieldInfo
	names  []string // allowed keys in declaration order, for messages
	meta   []int    // index of the embedded Meta, nil if none
}

type fieldInfo struct {
	name     string
	index    []int
	required bool
}

var metaType = reflect.TypeFor[Meta]()

// info returns the keys of struct type t. A field without a yaml tag (other than Meta) is a
// programmer error.
func (d *Decoder) info(t reflect.Type) *structInfo {
	if si, ok := d.structs[t]; ok {
		return si
	}
	si := &structInfo{}
	for i := range t.NumField() {
		f := t.Field(i)
		if f.Type == metaType {
			si.meta = f.Index
			continue
		}
		if !f.IsExported() {
			continue
		}
		tag, ok := f.Tag.Lookup("yaml")
		if !ok {
			panic(fmt.Sprintf("jobfile: field %s.%s has no yaml tag", t, f.Name))
		}
		name, opts, _ := strings.Cut(tag, ",")
		if name == "-" {
			continue
		}
		if opts != "" && opts != "required" {
			panic(fmt.Sprintf("jobfile: field %s.%s: unknown tag option %q", t, f.Name, opts))
		}
		si.fields = append(si.fields, fieldInfo{name: name, index: f.Index, required: opts == "required"})
		si.names = append(si.names, name)
	}
	d.structs[t] = si
	return si
}

func (d *Decoder) decodeStruct(n *yaml.Node, v reflect.Value) {
	si := d.info(v.Type())
	if si.meta != nil {
		v.FieldByIndex(si.meta).Set(reflect.ValueOf(d.Meta(n)))
	}
	ps, ok := d.pairs(n, "a mapping (key: value)")
	if !ok {
		return
	}
	given := make(map[string]bool, len(ps))
	for _, p := range ps {
		f := si.field(p.key)
		if f == nil {
			d.keyProblemf(p.kn, "unknown key %q%s", clip(p.key), oneOf(p.key, si.names))
			// A misspelt key already names the key it stands for: no "missing" message too.
			if g := Suggest(p.key, si.names); g != "" {
				given[g] = true
			}
			continue
		}
		given[p.key] = true
		child := keyPath(d.path, p.key)
		d.index.record(child, pos(valuePos(p.kn, p.v)))
		restore := d.enter(child)
		d.decode(p.v, v.FieldByIndex(f.index))
		restore()
	}
	for _, f := range si.fields {
		if f.required && !given[f.name] {
			d.problems.Add(d.index.loc(d.path, ""), "missing required key %q", f.name)
		}
	}
}

func (si *structInfo) field(name string) *fieldInfo {
	if i := slices.IndexFunc(si.fields, func(f fieldInfo) bool { return f.name == name }); i >= 0 {
		return &si.fields[i]
	}
	return nil
}

func (d *Decoder) decodeSlice(n *yaml.Node, v reflect.Value) {
	if isNull(n) {
		v.SetZero()
		return
	}
	if n.Kind != yaml.SequenceNode {
		d.Problemf(n, "want a list, got %s", describe(n))
		return
	}
	s := reflect.MakeSlice(v.Type(), len(n.Content), len(n.Content))
	for i, e := range n.Content {
		restore := d.enter(indexPath(d.path, i))
		d.decode(e, s.Index(i))
		restore()
	}
	v.Set(s)
}

func (d *Decoder) decodeArray(n *yaml.Node, v reflect.Value) {
	if n.Kind != yaml.SequenceNode || len(n.Content) != v.Len() {
		d.Problemf(n, "want a list of %d values, got %s", v.Len(), describe(n))
		return
	}
	for i, e := range n.Content {
		restore := d.enter(indexPath(d.path, i))
		d.decode(e, v.Index(i))
		restore()
	}
}

func (d *Decoder) decodeMap(n *yaml.Node, v reflect.Value) {
	if v.Type().Key().Kind() != reflect.String {
		panic(fmt.Sprintf("jobfile: map keys must be strings, got %s", v.Type()))
	}
	ps, ok := d.pairs(n, "a mapping (key: value)")
	if !ok {
		return
	}
	m := reflect.MakeMapWithSize(v.Type(), len(ps))
	for _, p := range ps {
		child := keyPath(d.path, p.key)
		d.index.record(child, pos(valuePos(p.kn, p.v)))
		restore := d.enter(child)
		e := reflect.New(v.Type().Elem()).Elem()
		d.decode(p.v, e)
		restore()
		m.SetMapIndex(reflect.ValueOf(p.key).Convert(v.Type().Key()), e)
	}
	v.Set(m)
}

// String returns a scalar's text. Numbers are taken as written ("8.8" stays "8.8"), so a bolt
// class or a rule name need not be quoted; null, booleans, lists and mappings are problems.
func (d *Decoder) String(n *yaml.Node) (string, bool) {
	switch {
	case n.Kind != yaml.ScalarNode:
	case n.ShortTag() == "!!str", n.ShortTag() == "!!int", n.ShortTag() == "!!float",
		n.ShortTag() == "!!timestamp":
		return n.Value, true
	}
	d.Problemf(n, "want a string, got %s", describe(n))
	return "", false
}

// Bool returns a true/false scalar.
func (d *Decoder) Bool(n *yaml.Node) (bool, bool) {
	if n.Kind == yaml.ScalarNode && n.ShortTag() == "!!bool" {
		switch strings.ToLower(n.Value) {
		case "true":
			return true, true
		case "false":
			return false, true
		}
	}
	d.Problemf(n, "want true or false, got %s", describe(n))
	return false, false
}

// Int returns a whole decimal number.
func (d *Decoder) Int(n *yaml.Node) (int, bool) {
	if !isNumber(n) {
		d.Problemf(n, "want a whole number, got %s", describe(n))
		return 0, false
	}
	s := strings.TrimPrefix(n.Value, "+")
	if !isDecimalInt(s) {
		d.Problemf(n, "want a whole number, got %s", describe(n))
		return 0, false
	}
	i, err := strconv.Atoi(s)
	if err != nil {
		d.Problemf(n, "the number %s is out of range", clip(n.Value))
		return 0, false
	}
	return i, true
}

// Float returns a finite decimal number (no NaN, no infinity, no hexadecimal or octal).
func (d *Decoder) Float(n *yaml.Node) (float64, bool) {
	if !isNumber(n) {
		d.Problemf(n, "want a number, got %s", describe(n))
		return 0, false
	}
	f, msg := parseDecimal(n.Value)
	if msg != "" {
		d.Problemf(n, "%s", msg)
		return 0, false
	}
	return f, true
}

// isNumber reports whether n is an unquoted number scalar.
func isNumber(n *yaml.Node) bool {
	tag := n.ShortTag()
	return n.Kind == yaml.ScalarNode && (tag == "!!int" || tag == "!!float")
}

// parseDecimal reads a decimal number (sign, digits, point, exponent) and returns it, or a
// message saying why it is not one.
func parseDecimal(s string) (float64, string) {
	switch strings.ToLower(strings.TrimLeft(s, "+-")) {
	case ".nan":
		return 0, "NaN is not a value"
	case ".inf":
		return 0, "an infinite value is not allowed"
	}
	if numberPrefix(s) != len(s) || s == "" {
		return 0, fmt.Sprintf("want a decimal number, got %s", clip(s))
	}
	f, err := strconv.ParseFloat(s, 64)
	if err != nil || math.IsInf(f, 0) || math.IsNaN(f) {
		return 0, fmt.Sprintf("the number %s is out of range", clip(s))
	}
	return f, ""
}

// numberPrefix returns the length of the decimal number at the start of s:
// [+-] (digits [. digits*] | . digits) [e [+-] digits].
func numberPrefix(s string) int {
	i := 0
	if i < len(s) && (s[i] == '+' || s[i] == '-') {
		i++
	}
	intDigits := digitsAt(s, i)
	i += intDigits
	fracDigits := 0
	if i < len(s) && s[i] == '.' {
		fracDigits = digitsAt(s, i+1)
		if intDigits > 0 || fracDigits > 0 {
			i += 1 + fracDigits
		}
	}
	if intDigits == 0 && fracDigits == 0 {
		return 0
	}
	if i < len(s) && (s[i] == 'e' || s[i] == 'E') {
		j := i + 1
		if j < len(s) && (s[j] == '+' || s[j] == '-') {
			j++
		}
		if k := digitsAt(s, j); k > 0 {
			i = j + k
		}
	}
	return i
}

func digitsAt(s string, i int) int {
	j := i
	for j < len(s) && s[j] >= '0' && s[j] <= '9' {
		j++
	}
	return j - i
}

func isDecimalInt(s string) bool {
	t := strings.TrimPrefix(s, "-")
	return t != "" && digitsAt(t, 0) == len(t)
}

func isNull(n *yaml.Node) bool {
	return n.Kind == yaml.ScalarNode && n.ShortTag() == "!!null"
}

func pos(n *yaml.Node) Pos { return Pos{Line: n.Line, Column: n.Column} }

// describe names what a node is, for "got ..." in messages.
func describe(n *yaml.Node) string {
	switch n.Kind {
	case yaml.MappingNode:
		return "a mapping"
	case yaml.SequenceNode:
		return "a list"
	case yaml.AliasNode:
		return "an alias"
	case yaml.DocumentNode:
		return "a document"
	}
	switch n.ShortTag() {
	case "!!null":
		return "nothing (null)"
	case "!!str":
		return strconv.Quote(clip(n.Value))
	}
	return clip(n.Value)
}

// clip shortens user text quoted in messages to 40 characters.
func clip(s string) string {
	const limit = 40
	if utf8.RuneCountInString(s) <= limit {
		return s
	}
	r := []rune(s)
	return string(r[:limit]) + "…"
}
