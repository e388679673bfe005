package solver

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/diff/fd"
	"gonum.org/v1/gonum/mat"
)

// TestFiniteDifferenceJacobian compares the dense and coloured forward
// difference Jacobians, and gonum's central differences (diff/fd), with
// the analytic Jacobians of the MGH 1981 systems at seeded random points.
// Tolerance: forward differences with h = √ε·max(|x|, 1) have a relative
// error of order √ε ≈ 1.5e-8 times the second derivative; 1e-6 relative to
// the largest entry of the row is common practice, no source.
func TestFiniteDifferenceJacobian(t *testing.T) {
	t.Parallel()
	rng := rand.New(rand.NewPCG(1, 2))
	problems := append(mghProblems(), broydenTridiagonal(50), broydenBanded(50), discreteBVP(50))
	for _, m := range problems {
		for _, colored := range []bool{false, true} {
			if colored && m.pattern == nil {
				continue
			}
			p := m.problem(true)
			if !colored {
				p.Pattern = nil
			}
			sv, err := New(p, nil)
			if err != nil {
				t.Fatal(err)
			}
			for trial := 0; trial < 5; trial++ {
				x := make([]float64, m.n)
				for i := range x {
					x[i] = m.x0[i] + (2*rng.Float64() - 1)
				}
				if m.source == "MGH (7)" && x[0] == 0 {
					x[0] = 0.5
				}
				ja := mat.NewDense(m.n, m.n, nil)
				jf := mat.NewDense(m.n, m.n, nil)
				for i := range m.n {
					for j := range m.n {
						jf.Set(i, j, math.NaN())
					}
				}
				if err := sv.Jacobian(ja, x, true); err != nil {
					t.Fatal(err)
				}
				if err := sv.Jacobian(jf, x, false); err != nil {
					t.Fatal(err)
				}
				jc := mat.NewDense(m.n, m.n, nil)
				fd.Jacobian(jc, func(y, x []float64) { m.f(y, x) }, x, &fd.JacobianSettings{Formula: fd.Central})
				for i := range m.n {
					rowMax := 0.0
					for j := range m.n {
						rowMax = math.Max(rowMax, math.Abs(ja.At(i, j)))
					}
					tol := 1e-6 * math.Max(rowMax, 1)
					for j := range m.n {
						a, f, c := ja.At(i, j), jf.At(i, j), jc.At(i, j)
						if math.Abs(a-f) > tol || math.IsNaN(f) {
							t.Errorf("%s %s n=%d colored=%v: J[%d][%d] forward %g, analytic %g", m.source, m.name, m.n, colored, i, j, f, a)
						}
						if math.Abs(a-c) > tol {
							t.Errorf("%s %s n=%d: J[%d][%d] gonum central %g, analytic %g", m.source, m.name, m.n, i, j, c, a)
						}
					}
				}
			}
		}
	}
}

// TestColorCount checks the colour counts of banded and block patterns.
// In a band matrix with lower width ml and upper width mu, columns j and k
// share a row exactly when |j−k| ≤ ml+mu, so any ml+mu+1 consecutive
// columns are pairwise adjacent and at least ml+mu+1 groups are needed;
// j mod (ml+mu+1) attains it (derived here). The wanted counts are that
// optimum. Extended Rosenbrock (MGH (21)) and extended Powell singular
// (MGH (22)) have two columns per row, in 2×2 and 4×4 blocks whose
// intersection graphs are bipartite, so 2 groups (read off the
// definitions).
func TestColorCount(t *testing.T) {
	t.Parallel()
	cases := []struct {
		m    mghProblem
		want int
	}{
		{broydenTridiagonal(10), 3},
		{broydenTridiagonal(500), 3},
		{broydenBanded(10), 7},
		{broydenBanded(500), 7},
		{discreteBVP(50), 3},
		{extendedRosenbrock(50), 2},
		{extendedPowellSingular(48), 2},
	}
	for _, c := range cases {
		sv, err := New(c.m.problem(false), nil)
		if err != nil {
			t.Fatal(err)
		}
		if got := sv.Colors(); got != c.want {
			t.Errorf("%s n=%d: %d colours, want %d", c.m.name, c.m.n, got, c.want)
		}
		if got := sv.Structure().Colors; got != c.want {
			t.Errorf("%s n=%d: Structure.Colors %d, want %d", c.m.name, c.m.n, got, c.want)
		}
		// The colouring is valid: no two columns of a group share a row.
		col := colorColumns(c.m.pattern, c.m.n)
		for g, group := range col.groups {
			seen := map[int]int{}
			for _, j := range group {
				for _, i := range col.colRows[j] {
					if k, ok := seen[i]; ok {
						t.Fatalf("%s: columns %d and %d of group %d share row %d", c.m.name, k, j, g, i)
					}
					seen[i] = j
				}
			}
		}
	}
}

// TestColoredSolveCost checks that a coloured finite-difference solve of
// Broyden banded (MGH (31)) at n = 500 costs 1 + 7 residual evaluations
// per iteration plus the line-search trials, not 500.
func TestColoredSolveCost(t *testing.T) {
	t.Parallel()
	m := broydenBanded(500)
	res, err := Solve(t.Context(), m.problem(false), m.x0, nil)
	if err != nil {
		t.Fatal(err)
	}
	// Per iteration: one group evaluation per colour, and (allowing) up
	// to two line-search trials; plus the start point.
	if max := res.Stats.Iterations*(res.Colors+2) + 1; res.Stats.ResidualEvals > max {
		t.Errorf("coloured solve used %d residual evaluations in %d iterations with %d colours", res.Stats.ResidualEvals, res.Stats.Iterations, res.Colors)
	}
}

// TestColorLongRows: on patterns with rows long enough to be kept as bit
// sets of colours (the plant-like star; seeded random patterns with a
// few rows of half the columns), the colouring is valid (no two columns
// of a group share a row, every column in one group) and, being greedy,
// uses at most Δ + 1 colours for the largest degree Δ of the column
// intersection graph, and at least the length of the longest row, which
// is a clique (both bounds derived here).
func TestColorLongRows(t *testing.T) {
	t.Parallel()
	rng := rand.New(rand.NewPCG(17, 5))
	patterns := [][][]int{newStar(2, 40, 1).pattern, starOfOrder(2000).pattern}
	for trial := 0; trial < 20; trial++ {
		n := 50 + rng.IntN(400)
		p, _ := randomSparse(rng, n, 3/float64(n))
		for range 1 + rng.IntN(4) {
			i := rng.IntN(n)
			for j := 0; j < n; j++ {
				if rng.IntN(2) == 0 {
					p[i] = append(p[i], j, j) // duplicates are ignored
				}
			}
		}
		patterns = append(patterns, p)
	}
	for k, pattern := range patterns {
		n := len(pattern)
		col := colorColumns(pattern, n)
		group := make([]int, n)
		for j := range group {
			group[j] = -1
		}
		for g, members := range col.groups {
			for _, j := range members {
				if group[j] >= 0 {
					t.Fatalf("pattern %d: column %d in groups %d and %d", k, j, group[j], g)
				}
				group[j] = g
			}
		}
		longest, maxDeg := 0, 0
		rowsOf := make([][]int, n)
		for i, row := range pattern {
			seen := map[int]bool{}
			for _, j := range row {
				seen[j] = true
			}
			longest = max(longest, len(seen))
			inRow := map[int]int{} // group → column, within the row
			for j := range seen {
				if group[j] < 0 {
					t.Fatalf("pattern %d: column %d has no group", k, j)
				}
				if c, ok := inRow[group[j]]; ok {
					t.Fatalf("pattern %d: columns %d and %d of group %d share row %d", k, c, j, group[j], i)
				}
				inRow[group[j]] = j
				rowsOf[j] = append(rowsOf[j], i)
			}
		}
		for j := 0; j < n; j++ {
			nb := map[int]bool{}
			for _, i := range rowsOf[j] {
				for _, c := range pattern[i] {
					if c != j {
						nb[c] = true
					}
				}
			}
			maxDeg = max(maxDeg, len(nb))
		}
		if c := len(col.groups); c < longest || c > maxDeg+1 {
			t.Errorf("pattern %d (order %d): %d colours, want between the longest row %d and Δ+1 = %d", k, n, c, longest, maxDeg+1)
		}
	}
}
