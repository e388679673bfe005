package polygen

import (
	"bytes"
	"fmt"
	"go/ast"
	"go/format"
	"go/parser"
	"go/token"
	"math/bits"
	"slices"
	"strconv"
	"strings"
)

// Term is one term n·a^I·b^J of a polynomial in two reduced variables.
type Term struct {
	I, J int
	N    float64
}

// Sums selects the sums a generated function returns, in this order:
// Σ n·a^I·b^J (S0), the same weighted by I (SI), by I(I-1) (SII), by J (SJ),
// by J(J-1) (SJJ) and by I·J (SIJ).
type Sums struct{ S0, SI, SII, SJ, SJJ, SIJ bool }

// Form is how a generated function evaluates its sums (see the package
// documentation).
type Form int

// The forms.
const (
	Horner Form = iota // groups nested in one variable, times powers of the other
	Powers             // powers built once, terms summed by groups of equal I
)

// Spec describes one generated function.
type Spec struct {
	Name  string // Go name of the function
	Doc   string // what it evaluates, for its comment
	Table string // the coefficient table in coef.go, of type [N]term
	Want  Sums
	Form  Form
}

// Specs lists the functions of poly_gen.go.
func Specs() []Spec {
	all := Sums{true, true, true, true, true, true}
	s0 := Sums{S0: true}
	return []Spec{
		{"poly1All", "region 1, Eq. 7: all sums", "r1", all, Horner},
		{"poly1J", "region 1, Eq. 7: ΣJ", "r1", Sums{SJ: true}, Horner},
		{"poly1JJJ", "region 1, Eq. 7: ΣJ and ΣJ(J-1)", "r1", Sums{SJ: true, SJJ: true}, Horner},
		{"poly1S", "region 1, Eq. 7: Σ, ΣJ and ΣJ(J-1)", "r1", Sums{S0: true, SJ: true, SJJ: true}, Horner},
		{"poly1S0J", "region 1, Eq. 7: Σ and ΣJ", "r1", Sums{S0: true, SJ: true}, Horner},
		{"poly2All", "region 2 residual, Eq. 17: all sums", "r2Res", all, Horner},
		{"poly2J", "region 2 residual, Eq. 17: ΣJ", "r2Res", Sums{SJ: true}, Horner},
		{"poly2JJJ", "region 2 residual, Eq. 17: ΣJ and ΣJ(J-1)", "r2Res", Sums{SJ: true, SJJ: true}, Horner},
		{"poly2S0J", "region 2 residual, Eq. 17: Σ and ΣJ", "r2Res", Sums{S0: true, SJ: true}, Horner},
		{"poly2S", "region 2 residual, Eq. 17: Σ, ΣJ and ΣJ(J-1)", "r2Res", Sums{S0: true, SJ: true, SJJ: true}, Horner},
		{"poly3All", "region 3, Eq. 28 without its logarithm: all sums", "r3", all, Powers},
		{"poly3I", "region 3, Eq. 28 without its logarithm: ΣI and ΣI(I-1)", "r3", Sums{SI: true, SII: true}, Powers},
		{"poly1Tph", "region 1 backward T(p,h), Eq. 11", "r1Tph", s0, Horner},
		{"poly1Tps", "region 1 backward T(p,s), Eq. 13", "r1Tps", s0, Horner},
		{"poly2aTph", "region 2a backward T(p,h), Eq. 22", "r2aTph", s0, Horner},
		{"poly2bTph", "region 2b backward T(p,h), Eq. 23", "r2bTph", s0, Horner},
		{"poly2cTph", "region 2c backward T(p,h), Eq. 24", "r2cTph", s0, Horner},
		{"poly2aTps", "region 2a backward T(p,s), Eq. 25 (a = π^(1/4))", "r2aTps", s0, Horner},
		{"poly2bTps", "region 2b backward T(p,s), Eq. 26", "r2bTps", s0, Horner},
		{"poly2cTps", "region 2c backward T(p,s), Eq. 27", "r2cTps", s0, Horner},
	}
}

// ReadTables returns every table of type [N]term declared in src (the
// text of coef.go), by name. Each element must be a literal {I, J, n} of
// two integers and a number.
func ReadTables(src []byte) (map[string][]Term, error) {
	fset := token.NewFileSet()
	f, err := parser.ParseFile(fset, "coef.go", src, 0)
	if err != nil {
		return nil, err
	}
	tables := map[string][]Term{}
	for _, d := range f.Decls {
		gd, ok := d.(*ast.GenDecl)
		if !ok || gd.Tok != token.VAR {
			continue
		}
		for _, sp := range gd.Specs {
			vs := sp.(*ast.ValueSpec)
			for k, name := range vs.Names {
				if k >= len(vs.Values) {
					continue
				}
				cl, ok := vs.Values[k].(*ast.CompositeLit)
				if !ok {
					continue
				}
				at, ok := cl.Type.(*ast.ArrayType)
				if !ok {
					continue
				}
				if id, ok := at.Elt.(*ast.Ident); !ok || id.Name != "term" {
					continue
				}
				ts, err := readTerms(fset, cl)
				if err != nil {
					return nil, fmt.Errorf("coef.go: table %s: %w", name.Name, err)
				}
				if n, ok := at.Len.(*ast.BasicLit); ok {
					if want, err := strconv.Atoi(n.Value); err != nil || want != len(ts) {
						return nil, fmt.Errorf("coef.go: table %s: declared length %s, %d terms given", name.Name, n.Value, len(ts))
					}
				}
				tables[name.Name] = ts
			}
		}
	}
	return tables, nil
}

func readTerms(fset *token.FileSet, cl *ast.CompositeLit) ([]Term, error) {
	var ts []Term
	for _, e := range cl.Elts {
		el, ok := e.(*ast.CompositeLit)
		if !ok || len(el.Elts) != 3 {
			return nil, fmt.Errorf("%s: want {I, J, n}", fset.Position(e.Pos()))
		}
		var vals [3]string
		for k, x := range el.Elts {
			s, ok := number(x)
			if !ok {
				return nil, fmt.Errorf("%s: not a number literal", fset.Position(x.Pos()))
			}
			vals[k] = s
		}
		i, err1 := strconv.Atoi(vals[0])
		j, err2 := strconv.Atoi(vals[1])
		n, err3 := strconv.ParseFloat(vals[2], 64)
		if err1 != nil || err2 != nil || err3 != nil {
			return nil, fmt.Errorf("%s: want two integers and a number, got {%s, %s, %s}", fset.Position(e.Pos()), vals[0], vals[1], vals[2])
		}
		ts = append(ts, Term{i, j, n})
	}
	return ts, nil
}

// number returns the text of a number literal, with its sign.
func number(x ast.Expr) (string, bool) {
	switch v := x.(type) {
	case *ast.BasicLit:
		if v.Kind == token.INT || v.Kind == token.FLOAT {
			return v.Value, true
		}
	case *ast.UnaryExpr:
		if s, ok := number(v.X); ok && (v.Op == token.SUB || v.Op == token.ADD) && !strings.HasPrefix(s, "-") {
			return v.Op.String() + s, true
		}
	}
	return "", false
}

// Generate returns the source of poly_gen.go for the coefficient tables in
// coefSrc (the text of coef.go).
func Generate(coefSrc []byte) ([]byte, error) {
	tables, err := ReadTables(coefSrc)
	if err != nil {
		return nil, err
	}
	var w bytes.Buffer
	w.WriteString("// Code generated by gen.go from the tables in coef.go (go generate ./plant/water); DO NOT EDIT.\n\n")
	w.WriteString("package water\n\n")
	for _, sp := range Specs() {
		ts, ok := tables[sp.Table]
		if !ok {
			return nil, fmt.Errorf("coef.go: no table %s of type [N]term (for %s)", sp.Table, sp.Name)
		}
		ks := kinds(sp.Want)
		if len(ks) == 0 {
			return nil, fmt.Errorf("%s: no sum wanted", sp.Name)
		}
		var body, how string
		switch sp.Form {
		case Horner:
			describe := func(x, e, y string) string {
				return "the groups of equal " + e + " nested (Horner) in " + y + ", each times its power of " + x + ", summed"
			}
			ba, ca := horner(ts, ks, true)
			bb, cb := horner(ts, ks, false)
			body, how = ba, fmt.Sprintf("%s:\n// %s (grouped by J instead: %s)", describe("a", "I", "b"), ca, cb)
			if cb.less(ca) {
				body, how = bb, fmt.Sprintf("%s:\n// %s (grouped by I instead: %s)", describe("b", "J", "a"), cb, ca)
			}
		case Powers:
			var c cost
			body, c = powers(ts, ks)
			how = "by powers of a and b, each built once, summed over the groups of equal I:\n// " + c.String()
		default:
			return nil, fmt.Errorf("%s: unknown form %d", sp.Name, sp.Form)
		}
		fmt.Fprintf(&w, "// %s evaluates %s\n// over the terms n·a^I·b^J of table %s, %s.\n", sp.Name, sp.Doc, sp.Table, how)
		fmt.Fprintf(&w, "func %s(a, b float64) (", sp.Name)
		for k, kd := range ks {
			if k > 0 {
				w.WriteString(", ")
			}
			w.WriteString(kd.name)
		}
		w.WriteString(" float64) {\n")
		w.WriteString(body)
		w.WriteString("return\n}\n\n")
	}
	out, err := format.Source(w.Bytes())
	if err != nil {
		return nil, fmt.Errorf("generated code does not parse: %w", err)
	}
	return out, nil
}

// weight is the factor a sum puts on a term by one exponent e.
type weight int

const (
	one  weight = iota // 1
	lin                // e
	quad               // e(e-1)
)

func (w weight) at(e int) float64 {
	switch w {
	case lin:
		return float64(e)
	case quad:
		return float64(e) * float64(e-1)
	}
	return 1
}

// kind is one of the six sums, with its weights on I and on J.
type kind struct {
	name   string
	wi, wj weight
}

func kinds(s Sums) []kind {
	var ks []kind
	for _, k := range []struct {
		on bool
		kind
	}{
		{s.S0, kind{"s0", one, one}},
		{s.SI, kind{"sI", lin, one}},
		{s.SII, kind{"sII", quad, one}},
		{s.SJ, kind{"sJ", one, lin}},
		{s.SJJ, kind{"sJJ", one, quad}},
		{s.SIJ, kind{"sIJ", lin, lin}},
	} {
		if k.on {
			ks = append(ks, k.kind)
		}
	}
	return ks
}

// cost counts the arithmetic of a generated function.
type cost struct{ mul, div int }

func (c cost) less(d cost) bool {
	return c.mul+c.div < d.mul+d.div || (c.mul+c.div == d.mul+d.div && c.div < d.div)
}

func (c cost) String() string {
	s := strconv.Itoa(c.mul) + " multiplications"
	switch c.div {
	case 0:
	case 1:
		s += " and 1 division"
	default:
		s += " and " + strconv.Itoa(c.div) + " divisions"
	}
	return s
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

// suffix names an exponent in a variable name.
func suffix(e int) string {
	if e < 0 {
		return "m" + strconv.Itoa(-e)
	}
	return strconv.Itoa(e)
}

func lit(v float64) string { return strconv.FormatFloat(v, 'g', -1, 64) }

// emitPowers writes the multiplications that build x^e for every e in need
// (e != 0), each from two powers already built, and counts them.
func emitPowers(w *bytes.Buffer, c *cost, x string, need []int) {
	for _, neg := range []bool{false, true} {
		have := map[int]bool{1: true}
		sign := 1
		if neg {
			sign = -1
		}
		var want []int
		for _, e := range need {
			if (e < 0) == neg && e != 0 && !slices.Contains(want, e*sign) {
				want = append(want, e*sign)
			}
		}
		if len(want) == 0 {
			continue
		}
		slices.Sort(want)
		if neg {
			fmt.Fprintf(w, "%s := 1 / %s\n", powName(x, -1), x)
			c.div++
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
			for k := e - 1; k >= (e+1)/2; k-- {
				if have[k] && have[e-k] {
					if d := max(depth[k], depth[e-k]) + 1; d < bestD {
						bestC, bestD = k, d
					}
				}
			}
			if bestC == 0 || bestD > bits.Len(uint(e))+1 {
				build(e / 2)
				build(e - e/2)
				bestC, bestD = e-e/2, max(depth[e/2], depth[e-e/2])+1
			}
			fmt.Fprintf(w, "%s := %s * %s\n", powName(x, e*sign), powName(x, bestC*sign), powName(x, (e-bestC)*sign))
			c.mul++
			have[e] = true
			depth[e] = bestD
		}
		for _, e := range want {
			build(e)
		}
	}
}

// nest is a polynomial Σ c_k·v^e_k with ascending exponents, whose
// coefficients are expressions.
type nest struct {
	exps   []int
	coefs  []string
	vals   []float64 // the coefficients' values, where they are numbers
	maxGap int       // the largest step within one run (0: no limit)
}

// runs splits n at the steps between exponents larger than maxGap (all
// of n is one run if maxGap is 0), and returns the index where each run
// starts.
func (n *nest) runs() []int {
	if len(n.exps) == 0 {
		return nil
	}
	starts := []int{0}
	for k := 1; k < len(n.exps); k++ {
		if n.maxGap > 0 && n.exps[k]-n.exps[k-1] > n.maxGap {
			starts = append(starts, k)
		}
	}
	return starts
}

// needs returns the powers of v that the nested form of n uses: the lowest
// exponent of each run and the steps between exponents within a run.
func (n *nest) needs() []int {
	var need []int
	starts := n.runs()
	for r, s := range starts {
		end := len(n.exps)
		if r+1 < len(starts) {
			end = starts[r+1]
		}
		need = append(need, n.exps[s])
		for k := s + 1; k < end; k++ {
			need = append(need, n.exps[k]-n.exps[k-1])
		}
	}
	return need
}

// expr writes n as the sum of its runs, each nested by Horner's rule with
// its lowest power factored out: v^e0·(c0 + v^(e1-e0)·(c1 + ...)).
func (n *nest) expr(v string, c *cost) string {
	starts := n.runs()
	var parts []string
	for r, s := range starts {
		end := len(n.exps)
		if r+1 < len(starts) {
			end = starts[r+1]
		}
		e := n.exps[s:end]
		m := len(e)
		x := n.coefs[end-1]
		for k := m - 2; k >= 0; k-- {
			x = n.coefs[s+k] + " + " + powName(v, e[k+1]-e[k]) + "*(" + x + ")"
			c.mul++
		}
		if e[0] != 0 {
			if m == 1 {
				x = x + "*" + powName(v, e[0])
			} else {
				x = powName(v, e[0]) + "*(" + x + ")"
			}
			c.mul++
		}
		parts = append(parts, x)
	}
	return strings.Join(parts, " + ")
}

// innerMaxGap is the largest step of exponents that a nested group spans;
// at a larger step the group is split into runs that are added.
const innerMaxGap = 4

// horner writes the body of a function in the Horner form with a as the
// outer variable (outerA) or b: the groups of equal outer exponent nested
// in the inner variable, each multiplied once by its power of the outer
// variable and added to the sums. It counts the cost.
func horner(ts []Term, ks []kind, outerA bool) (string, cost) {
	xv, yv := "a", "b"
	xe := func(t Term) int { return t.I }
	ye := func(t Term) int { return t.J }
	wx := func(k kind) weight { return k.wi }
	wy := func(k kind) weight { return k.wj }
	if !outerA {
		xv, yv = yv, xv
		xe, ye = ye, xe
		wx, wy = wy, wx
	}
	// groups of equal outer exponent, ascending; terms by inner exponent
	var xs []int
	for _, t := range ts {
		if !slices.Contains(xs, xe(t)) {
			xs = append(xs, xe(t))
		}
	}
	slices.Sort(xs)
	group := func(x int) []Term {
		var g []Term
		for _, t := range ts {
			if xe(t) == x {
				g = append(g, t)
			}
		}
		slices.SortFunc(g, func(p, q Term) int { return ye(p) - ye(q) })
		return g
	}
	// inner polynomials, by group and inner weight
	type key struct {
		x int
		w weight
	}
	inner := map[key]*nest{}
	var order []key
	innerOf := func(x int, w weight) *nest {
		k := key{x, w}
		if n, ok := inner[k]; ok {
			return n
		}
		n := &nest{maxGap: innerMaxGap}
		for _, t := range group(x) {
			if c := t.N * w.at(ye(t)); c != 0 {
				n.exps = append(n.exps, ye(t))
				n.coefs = append(n.coefs, lit(c))
				n.vals = append(n.vals, c)
			}
		}
		inner[k] = n
		order = append(order, k)
		return n
	}
	gname := func(k key) string {
		return "g" + suffix(k.x) + [...]string{"", "e", "ee"}[k.w]
	}
	// the groups each sum takes, with the weight on the outer exponent
	type entry struct {
		k key
		f float64
	}
	var c cost
	entries := make([][]entry, len(ks))
	for s, kd := range ks {
		for _, x := range xs {
			f := wx(kd).at(x)
			if f == 0 {
				continue
			}
			k := key{x, wy(kd)}
			if n := innerOf(x, k.w); len(n.exps) > 0 {
				entries[s] = append(entries[s], entry{k, f})
			}
		}
	}
	constant := func(k key) (float64, bool) {
		n := inner[k]
		if len(n.exps) == 1 && n.exps[0] == 0 {
			return n.vals[0], true
		}
		return 0, false
	}
	var yneed []int
	for _, k := range order {
		yneed = append(yneed, inner[k].needs()...)
	}
	var w bytes.Buffer
	var body bytes.Buffer // everything after the powers
	var xneed []int
	written := map[key]bool{}
	writeInner := func(k key) {
		if _, isConst := constant(k); isConst || written[k] || len(inner[k].exps) == 0 {
			return
		}
		written[k] = true
		fmt.Fprintf(&body, "%s := %s\n", gname(k), inner[k].expr(yv, &c))
	}
	// group by group: its nested polynomials, each times its power of
	// x once, added to the sums
	uname := func(k key) string { return "u" + gname(k)[1:] }
	for _, x := range xs {
		for _, wt := range []weight{one, lin, quad} {
			k := key{x, wt}
			var users []int
			for s := range ks {
				for _, e := range entries[s] {
					if e.k == k {
						users = append(users, s)
					}
				}
			}
			if len(users) == 0 {
				continue
			}
			writeInner(k)
			v, isConst := constant(k)
			u := uname(k)
			switch {
			case x == 0 && isConst:
				u = ""
			case x == 0:
				u = gname(k)
			case isConst:
				fmt.Fprintf(&body, "%s := %s * %s\n", u, lit(v), powName(xv, x))
				c.mul++
			default:
				fmt.Fprintf(&body, "%s := %s * %s\n", u, powName(xv, x), gname(k))
				c.mul++
			}
			if x != 0 {
				xneed = append(xneed, x)
			}
			for _, s := range users {
				f := wx(ks[s]).at(x)
				switch {
				case u == "":
					fmt.Fprintf(&body, "%s += %s\n", ks[s].name, lit(f*v))
				case f == 1:
					fmt.Fprintf(&body, "%s += %s\n", ks[s].name, u)
				default:
					fmt.Fprintf(&body, "%s += %s * %s\n", ks[s].name, lit(f), u)
					c.mul++
				}
			}
		}
	}
	emitPowers(&w, &c, xv, xneed)
	emitPowers(&w, &c, yv, yneed)
	w.Write(body.Bytes())
	return w.String(), c
}

// powers writes the body of a function in the Powers form and counts its
// cost.
func powers(ts []Term, ks []kind) (string, cost) {
	want := map[string]bool{}
	for _, k := range ks {
		want[k.name] = true
	}
	var is []int
	for _, t := range ts {
		if !slices.Contains(is, t.I) {
			is = append(is, t.I)
		}
	}
	slices.Sort(is)
	// sumExpr writes Σ c_k·b^J_k of one group, and the powers of b it uses.
	var c cost
	var jneed []int
	sumExpr := func(g []Term, w weight) string {
		var b strings.Builder
		n := 0
		for _, t := range g {
			v := t.N * w.at(t.J)
			if v == 0 {
				continue
			}
			if n > 0 {
				b.WriteString(" + ")
			}
			if t.J == 0 {
				b.WriteString(lit(v))
			} else {
				fmt.Fprintf(&b, "%s*%s", lit(v), powName("b", t.J))
				c.mul++
				jneed = append(jneed, t.J)
			}
			n++
		}
		return b.String()
	}
	type grp struct {
		i           int
		e0, eJ, eJJ string
	}
	var gs []grp
	var ineed []int
	for _, i := range is {
		var g []Term
		for _, t := range ts {
			if t.I == i {
				g = append(g, t)
			}
		}
		gr := grp{i: i}
		if want["s0"] || (want["sI"] && i != 0) || (want["sII"] && i != 0 && i != 1) {
			gr.e0 = sumExpr(g, one)
		}
		if want["sJ"] || (want["sIJ"] && i != 0) {
			gr.eJ = sumExpr(g, lin)
		}
		if want["sJJ"] {
			gr.eJJ = sumExpr(g, quad)
		}
		if (gr.e0 != "" || gr.eJ != "" || gr.eJJ != "") && i != 0 {
			ineed = append(ineed, i)
		}
		gs = append(gs, gr)
	}
	var w bytes.Buffer
	emitPowers(&w, &c, "a", ineed)
	emitPowers(&w, &c, "b", jneed)
	for _, g := range gs {
		fi := float64(g.i)
		mul := func(e string) string {
			if g.i == 0 {
				return "(" + e + ")"
			}
			c.mul++
			return powName("a", g.i) + " * (" + e + ")"
		}
		sfx := suffix(g.i)
		if g.e0 != "" {
			fmt.Fprintf(&w, "u%s := %s\n", sfx, mul(g.e0))
			if want["s0"] {
				fmt.Fprintf(&w, "s0 += u%s\n", sfx)
			}
			if want["sI"] && g.i != 0 {
				fmt.Fprintf(&w, "sI += %s * u%s\n", lit(fi), sfx)
				c.mul++
			}
			if want["sII"] && g.i != 0 && g.i != 1 {
				fmt.Fprintf(&w, "sII += %s * u%s\n", lit(fi*(fi-1)), sfx)
				c.mul++
			}
		}
		if g.eJ != "" {
			fmt.Fprintf(&w, "v%s := %s\n", sfx, mul(g.eJ))
			if want["sJ"] {
				fmt.Fprintf(&w, "sJ += v%s\n", sfx)
			}
			if want["sIJ"] && g.i != 0 {
				fmt.Fprintf(&w, "sIJ += %s * v%s\n", lit(fi), sfx)
				c.mul++
			}
		}
		if g.eJJ != "" {
			fmt.Fprintf(&w, "sJJ += %s\n", mul(g.eJJ))
		}
	}
	return w.String(), c
}
