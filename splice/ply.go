package splice

import (
	"fmt"
	"math"
	"strconv"
	"strings"
)

// ply is one connected part seen across the load: its edges and the bolt lines in it [mm].
type ply struct {
	yL, yR float64
	y      [4]float64
	n      int
	noPlug int // index of a strip that cannot tear out (the strip holding the web), −1 for none
	// offCentre marks a ply loaded off its own centre line (an inner flange plate, loaded
	// through the bolts beside the web): it may tear in any pattern, even where its bolt lines
	// happen to sit symmetrically in it.
	offCentre bool
}

// k1Min is the smallest k1 of EN 1993-1-8 Table 3.4 over the ply's lines: lines next to an edge
// are edge bolts (three-term form with the spacing to the next line, none with one line), the
// others inner bolts.
func (p *ply) k1Min(d0 float64) float64 {
	k := math.Inf(1)
	for j := 0; j < p.n; j++ {
		p2 := math.Inf(1)
		if j > 0 {
			p2 = p.y[j] - p.y[j-1]
		}
		if j < p.n-1 {
			p2 = min(p2, p.y[j+1]-p.y[j])
		}
		if math.IsInf(p2, 1) {
			p2 = 0
		}
		e2 := math.Inf(1)
		if j == 0 {
			e2 = p.y[0] - p.yL
		}
		if j == p.n-1 {
			e2 = min(e2, p.yR-p.y[p.n-1])
		}
		var kj float64
		if math.IsInf(e2, 1) {
			kj = K1Inner(p2, d0)
		} else {
			kj = K1Edge(e2, p2, d0)
		}
		k = min(k, kj)
	}
	return k
}

// block is the smallest block tearing resistance (EN 1993-1-8 3.10.2) over the ply's tear-out
// patterns, per mm of thickness and for shear planes of net length lv [N/mm].
//
// A pattern tears out a set of strips (edge strips outside the outer lines, strips between
// lines) in tension across the load, and shears along each bolt line that has a torn strip on
// one side only; every line must border a torn strip, and tearing every strip is the net
// section, which the tension check covers. A symmetric ply (outer plate, beam flange) is loaded
// through its centre line and tears symmetrically, as in EN 1993-1-8 Figure 3.8 (concentric,
// Veff,1); a ply loaded off its centre line (an inner plate) may tear in any pattern and is
// taken as eccentric (Veff,2) whatever its geometry, so the resistance of an inner plate is
// continuous across widths, including the width that centres its bolt line.
func (p *ply) block(d0, lv, fy, fu, gammaM0, gammaM2 float64) (res float64, ant, anv float64, concentric bool) {
	ns := p.n + 1
	var w [5]float64
	w[0] = p.y[0] - p.yL - d0/2
	for i := 1; i < p.n; i++ {
		w[i] = p.y[i] - p.y[i-1] - d0
	}
	w[p.n] = p.yR - p.y[p.n-1] - d0/2
	sym := !p.offCentre
	for j := 0; sym && j < p.n; j++ {
		if math.Abs((p.y[j]-p.yL)-(p.yR-p.y[p.n-1-j])) > 1e-6 {
			sym = false
		}
	}
	res = math.Inf(1)
	all := 1<<ns - 1
	for mask := 1; mask < all; mask++ {
		if p.noPlug >= 0 && mask&(1<<p.noPlug) != 0 {
			continue
		}
		planes, ok := 0, true
		for j := 0; j < p.n; j++ {
			left, right := mask&(1<<j) != 0, mask&(1<<(j+1)) != 0
			if !left && !right {
				ok = false
				break
			}
			if left != right {
				planes++
			}
		}
		if !ok {
			continue
		}
		a := 0.0
		mirror := 0
		for s := 0; s < ns; s++ {
			if mask&(1<<s) != 0 {
				a += w[s]
				mirror |= 1 << (ns - 1 - s)
			}
		}
		if sym && mirror != mask {
			continue
		}
		conc := sym
		v := float64(planes) * lv
		r := BlockTearing(fu, fy, a, v, conc, gammaM0, gammaM2)
		if r < res {
			res, ant, anv, concentric = r, a, v, conc
		}
	}
	if math.IsInf(res, 1) {
		return 0, 0, 0, false
	}
	return res, ant, anv, concentric
}

// Number formatting for the calculation sheet.

func fnum(x float64, prec int) string {
	s := strconv.FormatFloat(x, 'f', prec, 64)
	if strings.HasPrefix(s, "-") && strings.Trim(s[1:], "0.") == "" {
		s = s[1:]
	}
	return s
}

func kN(x float64) string  { return fnum(x*toKN, 1) }
func kNm(x float64) string { return fnum(x*toKNm, 2) }
func mm(x float64) string {
	if x == math.Round(x) {
		return fnum(x, 0)
	}
	return fnum(x, 1)
}
func f3(x float64) string { return fnum(x, 3) }
func f2(x float64) string { return fnum(x, 2) }

func sprintf(format string, a ...any) string { return fmt.Sprintf(format, a...) }

func in(name string, v float64, unit string) Input { return Input{Name: name, Value: v, Unit: unit} }
