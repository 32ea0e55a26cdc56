package splice

import (
	"reflect"
	"slices"
	"sync"
)

// A Shelf keeps the sizers of the problems it was last asked for, so that jobs on the same
// member, steels and design space (the beams of a batch, say) share what their sizing does not
// owe to the forces. Two problems share a sizer only when they are equal in every field but
// the forces and the plate steel's strength function (reflect.DeepEqual), and that function
// gives the same fy and fu at every plate thickness of the design space, the only place the
// sizing reads it. A problem whose design space does not resolve, or that does not compare
// equal to itself (a NaN), gets a sizer of its own. A Shelf is safe for concurrent use.
type Shelf struct {
	mu   sync.Mutex
	max  int
	kept []shelved // most recently asked for last
}

type shelved struct {
	key    Problem // without forces and strength function
	fy, fu []float64
	z      *Sizer
}

// NewShelf returns a shelf of at most n sizers; the least recently asked for goes first.
func NewShelf(n int) *Shelf { return &Shelf{max: n} }

// Sizer returns the shelf's sizer of p (its forces ignored), made and kept when the shelf has
// none. A nil shelf makes a new sizer each time.
func (sh *Shelf) Sizer(p Problem) *Sizer {
	if sh == nil || sh.max <= 0 {
		return NewSizer(p)
	}
	p.ULS, p.SLS = Forces{}, nil
	key := p
	key.PlateSteel.Strength = nil
	cat, err := ParseCategory(string(p.Sizing.Category))
	if err != nil {
		return NewSizer(p)
	}
	sp, err := p.Sizing.Space.resolve(cat, p.PlateSteel)
	if err != nil {
		return NewSizer(p)
	}
	sh.mu.Lock()
	defer sh.mu.Unlock()
	for i := len(sh.kept) - 1; i >= 0; i-- {
		k := sh.kept[i]
		if slices.Equal(k.fy, sp.fy) && slices.Equal(k.fu, sp.fu) && reflect.DeepEqual(k.key, key) {
			copy(sh.kept[i:], sh.kept[i+1:])
			sh.kept[len(sh.kept)-1] = k
			return k.z
		}
	}
	z := NewSizer(p)
	if len(sh.kept) == sh.max {
		sh.kept = slices.Delete(sh.kept, 0, 1)
	}
	sh.kept = append(sh.kept, shelved{key: key, fy: sp.fy, fu: sp.fu, z: z})
	return z
}
