package water

import (
	"bytes"
	"flag"
	"fmt"
	"go/format"
	"math/bits"
	"os"
	"slices"
	"strconv"
	"testing"
)

var update = flag.Bool("update", false, "rewrite poly_gen.go from the coefficient tables")

// The polynomial sums of IF97 are evaluated by straight-line code
// generated from the coefficient tables in coef.go: every needed power of
// the reduced variables is built by one multiplication from two powers
// already at hand, and the terms are grouped by their power of the first
// variable. TestGeneratedPolynomials keeps poly_gen.go in step with the
// tables; run it with -update after changing a table. The generated code is
// checked by the verification tests, not by this one.

// sums selects the sums a generated function returns.
type sums struct{ s0, sI, sII, sJ, sJJ, sIJ bool }

type genFunc struct {
	name  string
	doc   string
	terms []term
	want  sums
}

func genSpecs() []genFunc {
	all := sums{true, true, true, true, true, true}
	return []genFunc{
		{"poly1All", "region 1, Eq. 7: all sums", r1[:], all},
		{"poly1J", "region 1, Eq. 7: ΣJ", r1[:], sums{sJ: true}},
		{"poly1JJJ", "region 1, Eq. 7: ΣJ and ΣJ(J-1)", r1[:], sums{sJ: true, sJJ: true}},
		{"poly1S", "region 1, Eq. 7: Σ, ΣJ and ΣJ(J-1)", r1[:], sums{s0: true, sJ: true, sJJ: true}},
		{"poly1S0J", "region 1, Eq. 7: Σ and ΣJ", r1[:], sums{s0: true, sJ: true}},
		{"poly2All", "region 2 residual, Eq. 17: all sums", r2Res[:], all},
		{"poly2J", "region 2 residual, Eq. 17: ΣJ", r2Res[:], sums{sJ: true}},
		{"poly2JJJ", "region 2 residual, Eq. 17: ΣJ and ΣJ(J-1)", r2Res[:], sums{sJ: true, sJJ: true}},
		{"poly2S0J", "region 2 residual, Eq. 17: Σ and ΣJ", r2Res[:], sums{s0: true, sJ: true}},
		{"poly2S", "region 2 residual, Eq. 17: Σ, ΣJ and ΣJ(J-1)", r2Res[:], sums{s0: true, sJ: true, sJJ: true}},
		{"poly3All", "region 3, Eq. 28 without its logarithm: all sums", r3[:], all},
		{"poly3I", "region 3, Eq. 28 without its logarithm: ΣI and ΣI(I-1)", r3[:], sums{sI: true, sII: true}},
		{"poly1Tph", "region 1 backward T(p,h), Eq. 11", r1Tph[:], sums{s0: true}},
		{"poly1Tps", "region 1 backward T(p,s), Eq. 13", r1Tps[:], sums{s0: true}},
		{"poly2aTph", "region 2a backward T(p,h), Eq. 22", r2aTph[:], sums{s0: true}},
		{"poly2bTph", "region 2b backward T(p,h), Eq. 23", r2bTph[:], sums{s0: true}},
		{"poly2cTph", "region 2c backward T(p,h), Eq. 24", r2cTph[:], sums{s0: true}},
		{"poly2aTps", "region 2a backward T(p,s), Eq. 25 (a = π^(1/4))", r2aTps[:], sums{s0: true}},
		{"poly2bTps", "region 2b backward T(p,s), Eq. 26", r2bTps[:], sums{s0: true}},
		{"poly2cTps", "region 2c backward T(p,s), Eq. 27", r2cTps[:], sums{s0: true}},
	}
}

// powName names x^e.
func powName(x string, e int) string {
	switch {
	case e == 1:
		return x
	case e > 0:
		return x + strconv.Itoa(e)
	case e == -1:
		return x + "m1"
	}
	return x + "m" + strconv.Itoa(-e)
}

// emitPowers writes the multiplications that build x^e for every e in need
// (e != 0), each from two powers already built.
func emitPowers(w *bytes.Buffer, x string, need []int) {
	for _, neg := range []bool{false, true} {
		have := map[int]bool{1: true}
		sign := 1
		if neg {
			sign = -1
		}
		var want []int
		for _, e := range need {
			if (e < 0) == neg && e != 0 {
				want = append(want, e*sign)
			}
		}
		if len(want) == 0 {
			continue
		}
		slices.Sort(want)
		if neg {
			fmt.Fprintf(w, "%s := 1 / %s\n", powName(x, -1), x)
		}
		// depth[e] is the number of dependent multiplications behind x^e.
		// Each power is built from the available pair with the smallest
		// depth; if that pair is deeper than a balanced split would be, the
		// halves are built first. This keeps the chains short (about
		// log2 e), which matters more than the count of multiplications.
		depth := map[int]int{1: 0}
		var build func(e int)
		build = func(e int) {
			if have[e] {
				return
			}
			bestC, bestD := 0, 1<<30
			for c := e - 1; c >= (e+1)/2; c-- {
				if have[c] && have[e-c] {
					if d := max(depth[c], depth[e-c]) + 1; d < bestD {
						bestC, bestD = c, d
					}
				}
			}
			if bestC == 0 || bestD > bits.Len(uint(e))+1 {
				build(e / 2)
				build(e - e/2)
				bestC, bestD = e-e/2, max(depth[e/2], depth[e-e/2])+1
			}
			fmt.Fprintf(w, "%s := %s * %s\n", powName(x, e*sign), powName(x, bestC*sign), powName(x, (e-bestC)*sign))
			have[e] = true
			depth[e] = bestD
		}
		for _, e := range want {
			build(e)
		}
	}
}

func lit(v float64) string {
	s := strconv.FormatFloat(v, 'g', -1, 64)
	return s
}

// sumExpr writes Σ c_k·b^J_k for one group as an expression.
func sumExpr(ts []term, weight func(j int) float64) string {
	var b bytes.Buffer
	n := 0
	for _, t := range ts {
		c := t.n * weight(t.j)
		if c == 0 {
			continue
		}
		if n > 0 {
			b.WriteString(" + ")
		}
		if t.j == 0 {
			b.WriteString(lit(c))
		} else {
			fmt.Fprintf(&b, "%s*%s", lit(c), powName("b", t.j))
		}
		n++
	}
	if n == 0 {
		return ""
	}
	return b.String()
}

func generate() []byte {
	var w bytes.Buffer
	w.WriteString("// Code generated by TestGeneratedPolynomials (go test -run Generated -update); DO NOT EDIT.\n\n")
	w.WriteString("package water\n\n")
	for _, f := range genSpecs() {
		var names []string
		if f.want.s0 {
			names = append(names, "s0")
		}
		if f.want.sI {
			names = append(names, "sI")
		}
		if f.want.sII {
			names = append(names, "sII")
		}
		if f.want.sJ {
			names = append(names, "sJ")
		}
		if f.want.sJJ {
			names = append(names, "sJJ")
		}
		if f.want.sIJ {
			names = append(names, "sIJ")
		}
		fmt.Fprintf(&w, "// %s evaluates %s\n// for the terms n·a^I·b^J of its table.\n", f.name, f.doc)
		fmt.Fprintf(&w, "func %s(a, b float64) (", f.name)
		for k, n := range names {
			if k > 0 {
				w.WriteString(", ")
			}
			w.WriteString(n)
		}
		w.WriteString(" float64) {\n")
		// powers
		var is, js []int
		for _, t := range f.terms {
			if !slices.Contains(is, t.i) {
				is = append(is, t.i)
			}
			if !slices.Contains(js, t.j) {
				js = append(js, t.j)
			}
		}
		// only powers of b that are used with a nonzero weight
		var jneed []int
		for _, t := range f.terms {
			used := f.want.s0 || (f.want.sI && t.i != 0) || (f.want.sII && t.i != 0 && t.i != 1) ||
				(f.want.sJ && t.j != 0) || (f.want.sIJ && t.j != 0 && t.i != 0) || (f.want.sJJ && t.j != 0 && t.j != 1)
			if used && !slices.Contains(jneed, t.j) {
				jneed = append(jneed, t.j)
			}
		}
		// groups by I
		slices.Sort(is)
		var ineed []int
		type grp struct {
			i           int
			e0, eJ, eJJ string
		}
		var gs []grp
		for _, i := range is {
			var ts []term
			for _, t := range f.terms {
				if t.i == i {
					ts = append(ts, t)
				}
			}
			g := grp{i: i}
			if f.want.s0 || (f.want.sI && i != 0) || (f.want.sII && i != 0 && i != 1) {
				g.e0 = sumExpr(ts, func(int) float64 { return 1 })
			}
			if f.want.sJ || (f.want.sIJ && i != 0) {
				g.eJ = sumExpr(ts, func(j int) float64 { return float64(j) })
			}
			if f.want.sJJ {
				g.eJJ = sumExpr(ts, func(j int) float64 { return float64(j) * float64(j-1) })
			}
			if (g.e0 != "" || g.eJ != "" || g.eJJ != "") && i != 0 {
				ineed = append(ineed, i)
			}
			gs = append(gs, g)
		}
		emitPowers(&w, "a", ineed)
		emitPowers(&w, "b", jneed)
		for _, g := range gs {
			fi := float64(g.i)
			aName := powName("a", g.i)
			mul := func(e string) string {
				if g.i == 0 {
					return "(" + e + ")"
				}
				return aName + " * (" + e + ")"
			}
			if g.e0 != "" {
				fmt.Fprintf(&w, "u%s := %s\n", grpSuffix(g.i), mul(g.e0))
				if f.want.s0 {
					fmt.Fprintf(&w, "s0 += u%s\n", grpSuffix(g.i))
				}
				if f.want.sI && g.i != 0 {
					fmt.Fprintf(&w, "sI += %s * u%s\n", lit(fi), grpSuffix(g.i))
				}
				if f.want.sII && g.i != 0 && g.i != 1 {
					fmt.Fprintf(&w, "sII += %s * u%s\n", lit(fi*(fi-1)), grpSuffix(g.i))
				}
			}
			if g.eJ != "" {
				fmt.Fprintf(&w, "v%s := %s\n", grpSuffix(g.i), mul(g.eJ))
				if f.want.sJ {
					fmt.Fprintf(&w, "sJ += v%s\n", grpSuffix(g.i))
				}
				if f.want.sIJ && g.i != 0 {
					fmt.Fprintf(&w, "sIJ += %s * v%s\n", lit(fi), grpSuffix(g.i))
				}
			}
			if g.eJJ != "" {
				fmt.Fprintf(&w, "sJJ += %s\n", mul(g.eJJ))
			}
		}
		w.WriteString("return\n}\n\n")
	}
	out, err := format.Source(w.Bytes())
	if err != nil {
		os.WriteFile("poly_gen.go.broken", w.Bytes(), 0o644)
		panic(err)
	}
	return out
}

func grpSuffix(i int) string {
	if i < 0 {
		return "m" + strconv.Itoa(-i)
	}
	return strconv.Itoa(i)
}

func TestGeneratedPolynomials(t *testing.T) {
	want := generate()
	if *update {
		if err := os.WriteFile("poly_gen.go", want, 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	got, err := os.ReadFile("poly_gen.go")
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(got, want) {
		t.Fatal("poly_gen.go is out of date with the coefficient tables: run go test -run Generated -update")
	}
}
