package polygen

import (
	"slices"
	"strings"
	"testing"
)

// TestReadTablesErrors: a malformed table is an error that names the table
// and the position. Source: common practice, no source.
func TestReadTablesErrors(t *testing.T) {
	t.Parallel()
	cases := []struct{ name, src, want string }{
		{"length", "package water\n\nvar r1 = [3]term{{0, 1, 2.5}, {1, 2, -3}}\n", "table r1: declared length 3, 2 terms given"},
		{"not a number", "package water\n\nvar r1 = [1]term{{0, x, 2.5}}\n", "coef.go:3:22: not a number literal"},
		{"short", "package water\n\nvar r2 = [1]term{{0, 2.5}}\n", "table r2: coef.go:3:18: want {I, J, n}"},
		{"fraction", "package water\n\nvar r3 = [1]term{{0.5, 1, 2}}\n", "want two integers and a number"},
		{"syntax", "package water\n\nvar r1 = [1]term{{0, 1, 2}\n", "coef.go:"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			t.Parallel()
			_, err := ReadTables([]byte(c.src))
			if err == nil || !strings.Contains(err.Error(), c.want) {
				t.Fatalf("error %v, want one containing %q", err, c.want)
			}
		})
	}
}

// TestReadTablesSigns: signs and exponents of the literals are read as Go
// reads them. Source: the Go specification's number literals.
func TestReadTablesSigns(t *testing.T) {
	t.Parallel()
	src := "package water\n\nvar r1 = [3]term{{-2, 3, -0.5e1}, {+1, -4, 7}, {0, 0, .25}}\n\nvar other = [2]float64{1, 2}\n"
	tables, err := ReadTables([]byte(src))
	if err != nil {
		t.Fatal(err)
	}
	want := []Term{{-2, 3, -5}, {1, -4, 7}, {0, 0, 0.25}}
	got := tables["r1"]
	if len(tables) != 1 || len(got) != len(want) {
		t.Fatalf("tables %v, want only r1 = %v", tables, want)
	}
	for k := range want {
		if got[k] != want[k] {
			t.Errorf("term %d: got %v, want %v", k, got[k], want[k])
		}
	}
}

// TestNestExpr: the nested form of a sparse polynomial with a negative
// lowest power, and its count of multiplications. Source: Horner's rule
// (common practice, no source).
func TestNestExpr(t *testing.T) {
	t.Parallel()
	n := nest{exps: []int{-2, 0, 1, 5}, coefs: []string{"1", "2", "3", "4"}}
	var c cost
	got := n.expr("b", &c)
	want := "bm2*(1 + b2*(2 + b*(3 + b4*(4))))"
	if got != want || c.mul != 4 {
		t.Errorf("got %s with %d multiplications, want %s with 4", got, c.mul, want)
	}
	if need := n.needs(); len(need) != 4 || need[0] != -2 || need[1] != 2 || need[2] != 1 || need[3] != 4 {
		t.Errorf("powers needed %v, want [-2 2 1 4]", need)
	}
	one := nest{exps: []int{3}, coefs: []string{"-0.5"}}
	c = cost{}
	if got := one.expr("a", &c); got != "-0.5*a3" || c.mul != 1 {
		t.Errorf("one term: got %s with %d multiplications, want -0.5*a3 with 1", got, c.mul)
	}
}

// TestNestRuns: a group is split into runs where its exponents step by
// more than maxGap, and the runs are added. Source: common practice, no
// source.
func TestNestRuns(t *testing.T) {
	t.Parallel()
	n := nest{exps: []int{-2, 0, 1, 5, 12}, coefs: []string{"1", "2", "3", "4", "5"}, maxGap: 4}
	var c cost
	got := n.expr("b", &c)
	want := "bm2*(1 + b2*(2 + b*(3 + b4*(4)))) + 5*b12"
	if got != want || c.mul != 5 {
		t.Errorf("got %s with %d multiplications, want %s with 5", got, c.mul, want)
	}
	need := n.needs()
	if want := []int{-2, 2, 1, 4, 12}; !slices.Equal(need, want) {
		t.Errorf("powers needed %v, want %v", need, want)
	}
}
