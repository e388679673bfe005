package water

import (
	"fmt"
	"math"
	"math/big"
	"os"
	"slices"
	"testing"

	"steamcase/plant/water/internal/polygen"
)

// kernelTables are the coefficient tables of the generated kernels, by the
// names polygen.Specs uses.
var kernelTables = map[string][]term{
	"r1": r1[:], "r2Res": r2Res[:], "r3": r3[:],
	"r1Tph": r1Tph[:], "r1Tps": r1Tps[:],
	"r2aTph": r2aTph[:], "r2bTph": r2bTph[:], "r2cTph": r2cTph[:],
	"r2aTps": r2aTps[:], "r2bTps": r2bTps[:], "r2cTps": r2cTps[:],
}

// kernels calls each generated kernel and returns its sums in the order
// Σ, ΣI, ΣI(I-1), ΣJ, ΣJ(J-1), ΣIJ (zero where the kernel does not give
// one).
var kernels = map[string]func(a, b float64) [6]float64{
	"poly1All": func(a, b float64) [6]float64 {
		s0, sI, sII, sJ, sJJ, sIJ := poly1All(a, b)
		return [6]float64{s0, sI, sII, sJ, sJJ, sIJ}
	},
	"poly1J": func(a, b float64) [6]float64 { return [6]float64{3: poly1J(a, b)} },
	"poly1JJJ": func(a, b float64) [6]float64 {
		sJ, sJJ := poly1JJJ(a, b)
		return [6]float64{3: sJ, 4: sJJ}
	},
	"poly1S": func(a, b float64) [6]float64 {
		s0, sJ, sJJ := poly1S(a, b)
		return [6]float64{0: s0, 3: sJ, 4: sJJ}
	},
	"poly1S0J": func(a, b float64) [6]float64 {
		s0, sJ := poly1S0J(a, b)
		return [6]float64{0: s0, 3: sJ}
	},
	"poly2All": func(a, b float64) [6]float64 {
		s0, sI, sII, sJ, sJJ, sIJ := poly2All(a, b)
		return [6]float64{s0, sI, sII, sJ, sJJ, sIJ}
	},
	"poly2J": func(a, b float64) [6]float64 { return [6]float64{3: poly2J(a, b)} },
	"poly2JJJ": func(a, b float64) [6]float64 {
		sJ, sJJ := poly2JJJ(a, b)
		return [6]float64{3: sJ, 4: sJJ}
	},
	"poly2S0J": func(a, b float64) [6]float64 {
		s0, sJ := poly2S0J(a, b)
		return [6]float64{0: s0, 3: sJ}
	},
	"poly2S": func(a, b float64) [6]float64 {
		s0, sJ, sJJ := poly2S(a, b)
		return [6]float64{0: s0, 3: sJ, 4: sJJ}
	},
	"poly3All": func(a, b float64) [6]float64 {
		s0, sI, sII, sJ, sJJ, sIJ := poly3All(a, b)
		return [6]float64{s0, sI, sII, sJ, sJJ, sIJ}
	},
	"poly3I": func(a, b float64) [6]float64 {
		sI, sII := poly3I(a, b)
		return [6]float64{1: sI, 2: sII}
	},
	"poly1Tph":  func(a, b float64) [6]float64 { return [6]float64{poly1Tph(a, b)} },
	"poly1Tps":  func(a, b float64) [6]float64 { return [6]float64{poly1Tps(a, b)} },
	"poly2aTph": func(a, b float64) [6]float64 { return [6]float64{poly2aTph(a, b)} },
	"poly2bTph": func(a, b float64) [6]float64 { return [6]float64{poly2bTph(a, b)} },
	"poly2cTph": func(a, b float64) [6]float64 { return [6]float64{poly2cTph(a, b)} },
	"poly2aTps": func(a, b float64) [6]float64 { return [6]float64{poly2aTps(a, b)} },
	"poly2bTps": func(a, b float64) [6]float64 { return [6]float64{poly2bTps(a, b)} },
	"poly2cTps": func(a, b float64) [6]float64 { return [6]float64{poly2cTps(a, b)} },
}

var sumNames = [6]string{"Σ", "ΣI", "ΣI(I-1)", "ΣJ", "ΣJ(J-1)", "ΣIJ"}

// wanted lists the sums a spec returns, as indexes into the order above.
func wanted(s polygen.Sums) []int {
	var w []int
	for k, on := range [6]bool{s.S0, s.SI, s.SII, s.SJ, s.SJJ, s.SIJ} {
		if on {
			w = append(w, k)
		}
	}
	return w
}

// naiveSum is the direct evaluation of one weighted sum: each term
// n·w·a^I·b^J by math.Pow, added exactly (big.Float, 256 bits). It also
// returns Σ|terms|, the scale of the rounding error of any evaluation in
// float64.
func naiveSum(ts []term, k int, a, b float64) (sum, abs float64) {
	acc := new(big.Float).SetPrec(256)
	var x big.Float
	x.SetPrec(256)
	for _, t := range ts {
		fi, fj := float64(t.i), float64(t.j)
		w := [6]float64{1, fi, fi * (fi - 1), fj, fj * (fj - 1), fi * fj}[k]
		v := t.n * w * math.Pow(a, fi) * math.Pow(b, fj)
		acc.Add(acc, x.SetFloat64(v))
		abs += math.Abs(v)
	}
	sum, _ = acc.Float64()
	return sum, abs
}

// kernelPoint is one point (a, b) of a kernel's domain and the state it
// comes from.
type kernelPoint struct {
	a, b  float64
	where string
}

// logGrid returns n values from lo to hi, evenly spaced in the logarithm.
func logGrid(lo, hi float64, n int) []float64 {
	g := make([]float64, n)
	for k := range g {
		g[k] = lo * math.Pow(hi/lo, float64(k)/float64(n-1))
	}
	return g
}

func linGrid(lo, hi float64, n int) []float64 {
	g := make([]float64, n)
	for k := range g {
		g[k] = lo + (hi-lo)*float64(k)/float64(n-1)
	}
	return g
}

// kernelDomains returns points covering the domain of each table: its
// region (1, 2 or 3) on a grid of p and T, and for a backward equation the
// (p,h) or (p,s) of those states that the equation is used for.
func kernelDomains() map[string][]kernelPoint {
	d := map[string][]kernelPoint{}
	at := func(p, t float64) string { return fmt.Sprintf("p = %s, T = %s", fmtPressure(p), fmtTemperature(t)) }
	// region 1: 273.15 K <= T <= 623.15 K, p_sat(T) <= p <= 100 MPa
	for _, t := range linGrid(tMin, t13, 36) {
		for _, p := range logGrid(psat4(t), pMax, 36) {
			d["r1"] = append(d["r1"], kernelPoint{7.1 - p/p1Star, t1Star/t - 1.222, at(p, t)})
			h, s := h1(p, t), s1(p, t)
			d["r1Tph"] = append(d["r1Tph"], kernelPoint{p / 1e6, h/2500e3 + 1, at(p, t)})
			d["r1Tps"] = append(d["r1Tps"], kernelPoint{p / 1e6, s/1e3 + 2, at(p, t)})
		}
	}
	// region 2: the points of the backward equations, by subregion
	back2 := func(p, t float64) {
		h, s := h2(p, t), s2(p, t)
		pi, eta := p/1e6, h/2000e3
		switch {
		case p <= p2abLim:
			d["r2aTph"] = append(d["r2aTph"], kernelPoint{pi, eta - 2.1, at(p, t)})
			d["r2aTps"] = append(d["r2aTps"], kernelPoint{math.Sqrt(math.Sqrt(pi)), s/2e3 - 2, at(p, t)})
			return
		case p <= b2bc[4]*1e6 || h >= hB2bc(p):
			d["r2bTph"] = append(d["r2bTph"], kernelPoint{pi - 2, eta - 2.6, at(p, t)})
		default:
			d["r2cTph"] = append(d["r2cTph"], kernelPoint{pi + 25, eta - 1.8, at(p, t)})
		}
		if s >= s2bcLim {
			d["r2bTps"] = append(d["r2bTps"], kernelPoint{pi, 10 - s/0.7853e3, at(p, t)})
		} else {
			d["r2cTps"] = append(d["r2cTps"], kernelPoint{pi, 2 - s/2.9251e3, at(p, t)})
		}
	}
	// region 2: 273.15 K <= T <= 1073.15 K, from 1 mPa to p_sat(T), the
	// B23 pressure or 100 MPa
	for _, t := range linGrid(tMin, tMid, 41) {
		top := pMax
		switch {
		case t <= t13:
			top = psat4(t)
		case t <= t23max:
			top = pB23(t)
		}
		for _, p := range logGrid(1e-3, top, 41) {
			d["r2Res"] = append(d["r2Res"], kernelPoint{p / p2Star, t2Star/t - 0.5, at(p, t)})
			back2(p, t)
		}
	}
	// and more densely above 4 MPa, where subregion 2c lies along the
	// saturation line and the B23 boundary
	for _, p := range linGrid(p2abLim*(1+1e-9), pMax, 40) {
		lo := tB23(p)
		if p <= pSat13 {
			lo = tsat4(p)
		}
		for _, t := range linGrid(lo, min(lo+300, tMid), 40) {
			d["r2Res"] = append(d["r2Res"], kernelPoint{p / p2Star, t2Star/t - 0.5, at(p, t)})
			back2(p, t)
		}
	}
	// region 3: 623.15 K <= T <= T_B23(p), p_sat(623.15 K) <= p <= 100 MPa
	for _, p := range linGrid(pSat13*(1+1e-9), pMax, 30) {
		for _, t := range linGrid(t13, tB23(p), 30) {
			reg, sd, err := regionPT("test", p, t)
			if err != nil || reg != Region3 {
				continue
			}
			rho, ok := rho3(p, t, sd)
			if !ok {
				continue
			}
			d["r3"] = append(d["r3"], kernelPoint{rho / rhoCrit, tCrit / t, at(p, t)})
		}
	}
	return d
}

// TestKernelsAgreeWithNaiveSums checks every generated kernel against the
// direct evaluation of its sums (each term by math.Pow, the terms added
// exactly) on a grid over the region, or over the states, the kernel is
// used for. Source: the IF97 equations as sums (IAPWS R7-97(2012) Eqs. 7,
// 11, 13, 17, 22-28); the reference is a direct sum, not a published
// value. A sum agrees when it is within 1e-13 of the direct sum, relative
// to the direct sum; where its terms cancel so far that float64 cannot
// give that (Σ|terms| > 100·|sum|, which happens only next to a sign change
// of the sum), within 1e-15·Σ|terms| instead.
func TestKernelsAgreeWithNaiveSums(t *testing.T) {
	t.Parallel()
	domains := kernelDomains()
	for _, sp := range polygen.Specs() {
		t.Run(sp.Name, func(t *testing.T) {
			t.Parallel()
			f, ok := kernels[sp.Name]
			if !ok {
				t.Fatalf("no call of %s in the test's kernels", sp.Name)
			}
			ts, ok := kernelTables[sp.Table]
			if !ok {
				t.Fatalf("no table %s in the test's kernelTables", sp.Table)
			}
			pts := domains[sp.Table]
			if len(pts) < 100 {
				t.Fatalf("table %s: %d points on the grid, want at least 100", sp.Table, len(pts))
			}
			var worst, worstScaled, maxCond [6]float64
			var worstAt [6]string
			for _, pt := range pts {
				got := f(pt.a, pt.b)
				for _, k := range wanted(sp.Want) {
					want, abs := naiveSum(ts, k, pt.a, pt.b)
					cond := abs / math.Abs(want)
					maxCond[k] = max(maxCond[k], cond)
					dev := math.Abs(got[k]-want) / math.Abs(want)
					if !(dev <= 1e-13) && !(cond > 100 && math.Abs(got[k]-want) <= 1e-15*abs) {
						t.Errorf("%s %s at a = %.17g, b = %.17g (%s): got %.17g, direct sum %.17g (rel. dev. %.2g, Σ|terms|/|sum| %.3g)",
							sp.Name, sumNames[k], pt.a, pt.b, pt.where, got[k], want, dev, cond)
					}
					if cond > 100 {
						worstScaled[k] = max(worstScaled[k], math.Abs(got[k]-want)/abs)
					} else if dev > worst[k] {
						worst[k], worstAt[k] = dev, pt.where
					}
				}
			}
			if testing.Verbose() {
				for _, k := range wanted(sp.Want) {
					t.Logf("%s %s: %d points, largest rel. dev. %.2g at %s; largest Σ|terms|/|sum| %.3g, where > 100 largest dev./Σ|terms| %.2g",
						sp.Name, sumNames[k], len(pts), worst[k], worstAt[k], maxCond[k], worstScaled[k])
				}
			}
		})
	}
}

// TestReadTables checks that the generator reads from coef.go exactly the
// coefficients the compiler reads. Source: coef.go itself (the tables of
// IAPWS R7-97(2012)); this is a check of the generator's parser.
func TestReadTables(t *testing.T) {
	t.Parallel()
	src, err := os.ReadFile("coef.go")
	if err != nil {
		t.Fatal(err)
	}
	tables, err := polygen.ReadTables(src)
	if err != nil {
		t.Fatal(err)
	}
	var names []string
	for name := range tables {
		names = append(names, name)
	}
	slices.Sort(names)
	var want []string
	for name := range kernelTables {
		want = append(want, name)
	}
	want = append(want, "r5Res")
	slices.Sort(want)
	if !slices.Equal(names, want) {
		t.Fatalf("tables read from coef.go: %v, want %v", names, want)
	}
	compiled := map[string][]term{"r5Res": r5Res[:]}
	for name, ts := range kernelTables {
		compiled[name] = ts
	}
	for name, ts := range tables {
		comp := compiled[name]
		if len(ts) != len(comp) {
			t.Errorf("%s: %d terms read, %d compiled", name, len(ts), len(comp))
			continue
		}
		for k := range ts {
			if ts[k].I != comp[k].i || ts[k].J != comp[k].j || ts[k].N != comp[k].n {
				t.Errorf("%s[%d]: read {%d, %d, %v}, compiled {%d, %d, %v}", name, k, ts[k].I, ts[k].J, ts[k].N, comp[k].i, comp[k].j, comp[k].n)
			}
		}
	}
}

// BenchmarkKernels times each generated kernel alone, cycling through four
// points of the region or subregion it serves, and reports cpu-ns/op: the
// figure to compare when the generator's forms change. The call goes
// through the test's wrapper (kernels), which costs the same for every
// kernel, some 9 ns on the development machine (poly1Tph: 6.4 ns called
// directly, 15.5 ns through the wrapper).
func BenchmarkKernels(b *testing.B) {
	domains := kernelDomains()
	for _, sp := range polygen.Specs() {
		f := kernels[sp.Name]
		pts := domains[sp.Table]
		var as, bs [4]float64
		for k := range as {
			pt := pts[(2*k+1)*len(pts)/8]
			as[k], bs[k] = pt.a, pt.b
		}
		b.Run(sp.Name, func(b *testing.B) {
			m := startCPU()
			defer m.report(b)
			i := 0
			for b.Loop() {
				s := f(as[i&3], bs[i&3])
				sink += s[0] + s[1] + s[2] + s[3] + s[4] + s[5]
				i++
			}
		})
	}
}
