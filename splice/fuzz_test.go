package splice

import (
	"fmt"
	"math"
	"reflect"
	"testing"
)

// fuzzShelf keeps sizers between the fuzzer's inputs, so that a sizer's kept layouts meet
// arbitrary forces one after another.
var fuzzShelf = NewShelf(8)

// FuzzSize drives the sizing entry point with arbitrary forces and options: it must return a
// result or an error — never panic, never a NaN utilisation, and never call a splice that
// fails a check a passing one — and a sizer kept between inputs returns exactly Size's result
// or error. The seed corpus is replayed by every go test.
func FuzzSize(f *testing.F) {
	f.Add(520.0, -310.0, 290.0, 60.0, -120.0, uint8(1), uint8(0), 10.0, uint8(0))
	f.Add(0.0, 0.0, 0.0, 0.0, 0.0, uint8(0), uint8(1), 0.0, uint8(1))
	f.Add(3000.0, -3000.0, 2000.0, 900.0, -900.0, uint8(2), uint8(2), 50.0, uint8(2))
	f.Add(math.NaN(), math.Inf(1), -5.0, 1e300, -1e300, uint8(7), uint8(9), -3.0, uint8(3))
	f.Fuzz(func(t *testing.T, mMax, mMin, v, nMax, nMin float64, cat, fric uint8, gap float64, sec uint8) {
		names := []string{"IPE 300", "IPE 500", "HE 300 B", "IPE 600"}
		cats := []Category{CategoryA, CategoryB, CategoryC}
		frics := []FrictionClass{"A", "B", "C", "D"}
		uls := Forces{MMax: knm(mMax), MMin: knm(mMin), V: kn(v), NMax: kn(nMax), NMin: kn(nMin)}
		sls := Forces{MMax: uls.MMax / 1.4, MMin: uls.MMin / 1.4, V: uls.V / 1.4, NMax: uls.NMax / 1.4, NMin: uls.NMin / 1.4}
		p := Problem{
			Member:     member(t, names[int(sec)%len(names)], steelS355()),
			ULS:        uls,
			SLS:        &sls,
			PlateSteel: steelS355(),
			Brief:      true,
			Sizing:     Sizing{Category: cats[int(cat)%len(cats)], FrictionClass: frics[int(fric)%len(frics)], Gap: gap, Space: smallSpace()},
		}
		r, err := Size(p)
		rz, errz := fuzzShelf.Sizer(p).Size(p.ULS, p.SLS)
		if fmt.Sprint(err) != fmt.Sprint(errz) || (err == nil && !reflect.DeepEqual(r, rz)) {
			t.Fatalf("the shelf's sizer disagrees with Size: %v / %v", err, errz)
		}
		if err != nil {
			return
		}
		if math.IsNaN(r.Utilisation) {
			t.Fatalf("NaN utilisation for %+v", uls)
		}
		if r.Pass {
			for _, c := range r.Checks {
				if !c.Pass {
					t.Fatalf("a passing splice fails %s", c.ID)
				}
			}
		}
	})
}
