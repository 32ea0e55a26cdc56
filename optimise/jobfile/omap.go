package jobfile

import "go.yaml.in/yaml/v3"

// Entry is one key and value of a Map, with the key's location.
type Entry[T any] struct {
	Key   string
	Loc   Loc // of the key
	Value T
}

// Map is a YAML mapping decoded in file order, each entry keeping where its key was written.
// Use it where order matters to the user (load cases print in the order written) or where
// checks point at a key (a bolt size in costs.bolt).
type Map[T any] []Entry[T]

// Get returns the value stored under key.
func (m Map[T]) Get(key string) (T, bool) {
	for _, e := range m {
		if e.Key == key {
			return e.Value, true
		}
	}
	var zero T
	return zero, false
}

// Has reports whether key is present.
func (m Map[T]) Has(key string) bool {
	_, ok := m.Get(key)
	return ok
}

// Keys returns the keys in file order.
func (m Map[T]) Keys() []string {
	keys := make([]string, len(m))
	for i, e := range m {
		keys[i] = e.Key
	}
	return keys
}

// DecodeYAMLNode decodes a mapping (null is an empty Map), reporting duplicate keys.
func (m *Map[T]) DecodeYAMLNode(n *yaml.Node, d *Decoder) {
	ps, ok := d.pairs(n, "a mapping (name: value)")
	if !ok {
		return
	}
	out := make(Map[T], 0, len(ps))
	for _, p := range ps {
		child := keyPath(d.path, p.key)
		d.index.record(child, pos(valuePos(p.kn, p.v)))
		e := Entry[T]{Key: p.key, Loc: Loc{File: d.file, Pos: pos(p.kn), Path: child}}
		d.DecodeKey(p.key, p.v, &e.Value)
		out = append(out, e)
	}
	*m = out
}
