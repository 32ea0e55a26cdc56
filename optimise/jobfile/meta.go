package jobfile

import (
	"strconv"
	"strings"
)

// Meta is embedded in every schema struct. The decoder fills it with the struct's own
// location and a handle on the positions of everything decoded from the same file, so checks
// made later (by this package or by the caller) can point at any key below the struct.
type Meta struct {
	Loc   Loc
	index *index
}

// index maps every decoded key path to its position in one file.
type index struct {
	file string
	pos  map[string]Pos
}

func newIndex(file string) *index {
	return &index{file: file, pos: make(map[string]Pos)}
}

// record keeps the first position seen for a path.
func (x *index) record(path string, p Pos) {
	if _, ok := x.pos[path]; !ok {
		x.pos[path] = p
	}
}

// loc returns the location of base+rel. When that path was not recorded (a missing key is
// reported where its parent is) the position is that of the longest recorded prefix, cutting
// rel at its dots and brackets, down to base; the path stays the full one asked for.
func (x *index) loc(base, rel string) Loc {
	path := joinRel(base, rel)
	for r := rel; ; {
		if pos, ok := x.pos[joinRel(base, r)]; ok {
			return Loc{File: x.file, Pos: pos, Path: path}
		}
		if r == "" {
			return Loc{File: x.file, Path: path}
		}
		i := strings.LastIndexAny(r, ".[")
		if i < 0 {
			i = 0
		}
		r = r[:i]
	}
}

// Where returns the location of a key below the struct, given relative to it: "at",
// "spans[2]", "overhang.left". When that key is absent from the file the position is the
// nearest present ancestor's, and the path is still the one asked for. On a zero Meta (a
// struct not made by the decoder) Where returns the path alone.
func (m Meta) Where(rel string) Loc {
	if m.index == nil {
		return Loc{File: m.Loc.File, Pos: m.Loc.Pos, Path: joinRel(m.Loc.Path, rel)}
	}
	return m.index.loc(m.Loc.Path, rel)
}

// joinRel appends a relative path ("at", "[2]", "spans[2].x") to a base path.
func joinRel(base, rel string) string {
	switch {
	case rel == "":
		return base
	case base == "":
		return rel
	case rel[0] == '[':
		return base + rel
	}
	return base + "." + rel
}

// keyPath appends a mapping key to a path, quoting keys that would make the path ambiguous.
func keyPath(base, key string) string {
	if !plainKey(key) {
		return base + "[" + strconv.Quote(key) + "]"
	}
	if base == "" {
		return key
	}
	return base + "." + key
}

// indexPath appends a 0-based list index to a path.
func indexPath(base string, i int) string {
	return base + "[" + strconv.Itoa(i) + "]"
}

// plainKey reports whether a key can stand in a dotted path without quotes.
func plainKey(key string) bool {
	if key == "" {
		return false
	}
	for _, r := range key {
		ok := r == '_' || r == '-' || r == '+' || r >= '0' && r <= '9' ||
			r >= 'a' && r <= 'z' || r >= 'A' && r <= 'Z'
		if !ok {
			return false
		}
	}
	return true
}

// Has reports whether a key below the struct (relative, as for At) was written in the file,
// telling an absent key from one given as zero or as an empty list.
func (m Meta) Has(rel string) bool {
	if m.index == nil {
		return false
	}
	_, ok := m.index.pos[joinRel(m.Loc.Path, rel)]
	return ok
}
