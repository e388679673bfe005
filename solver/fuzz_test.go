package solver

import (
	"testing"
)

// FuzzDiagnose builds an incidence pattern from arbitrary bytes and checks
// that DiagnoseIncidence never panics and that its decomposition is
// consistent (the same invariants as TestDiagnoseRandom).
func FuzzDiagnose(f *testing.F) {
	f.Add([]byte{3, 3, 0, 1, 1, 2, 2})
	f.Add([]byte{2, 2, 0, 0, 0})
	f.Add([]byte{4, 2, 1, 5, 200, 3})
	f.Fuzz(func(t *testing.T, data []byte) {
		if len(data) < 2 {
			return
		}
		eqs, vars := int(data[0]%16), int(data[1]%16)
		pattern := make([][]int, eqs)
		if eqs > 0 && vars > 0 {
			for k, b := range data[2:] {
				pattern[k%eqs] = append(pattern[k%eqs], int(b)%vars)
			}
		}
		s, err := DiagnoseIncidence(eqs, vars, pattern, nil, nil)
		if s == nil {
			t.Fatal(err)
		}
		if (err == nil) != (s.Err() == nil) {
			t.Fatalf("returned error %v, Err() %v", err, s.Err())
		}
		if vars-(len(s.UnderUnknowns)-len(s.UnderEquations)) != s.Rank ||
			eqs-(len(s.OverEquations)-len(s.OverUnknowns)) != s.Rank ||
			len(s.SquareEquations) != len(s.SquareUnknowns) {
			t.Fatalf("inconsistent decomposition %+v for %v", s, pattern)
		}
		if err := s.Err(); (err == nil) != (eqs == vars && s.Rank == vars) {
			t.Fatalf("Err %v with rank %d of %d×%d", err, s.Rank, eqs, vars)
		}
		if s.Err() != nil {
			_ = s.Err().Error()
		}
	})
}

// FuzzMinDegree builds a square pattern (order up to 40) from arbitrary
// bytes and checks that the column order is a permutation with or
// without dense rows and columns left out (the default limits, and
// limits of 2 entries, which leave most out), that without any left out its fill
// count equals that of an explicit elimination in the same order (as
// TestQuotientGraphExact), and that the colouring is valid.
func FuzzMinDegree(f *testing.F) {
	f.Add([]byte{5, 0, 1, 1, 2, 2, 3, 3, 4, 4, 0})
	f.Add([]byte{3, 0, 0, 0, 1, 1, 1, 2, 2, 2})
	f.Add([]byte{8, 7, 6, 5, 4, 3, 2, 1, 0, 255, 128, 64, 32, 16})
	f.Fuzz(func(t *testing.T, data []byte) {
		if len(data) < 1 {
			return
		}
		n := 1 + int(data[0]%40)
		pattern := make([][]int, n)
		for k, b := range data[1:] {
			pattern[k%n] = append(pattern[k%n], int(b)%n)
		}
		var lu SparseLU
		lu.SetPattern(n, pattern)
		for _, limit := range []int{n, 0, 2} {
			rl, cl := limit, limit
			if limit == 0 {
				rl, cl = denseRowLimit(n), denseColumnLimit(n)
			}
			g := newQuotientGraph(n, lu.pp, lu.pr, rl, cl)
			q := g.eliminate()
			seen := make([]bool, n)
			for _, j := range q {
				if j < 0 || j >= n || seen[j] {
					t.Fatalf("limit %d: order %v is not a permutation of 0..%d", limit, q, n-1)
				}
				seen[j] = true
			}
			if len(q) != n {
				t.Fatalf("limit %d: %d columns ordered of %d", limit, len(q), n)
			}
			if limit == n {
				if want, _ := eliminateInOrder(n, lu.pp, lu.pr, q); g.fill != want {
					t.Fatalf("fill count %d, want %d", g.fill, want)
				}
			}
		}
		col := colorColumns(pattern, n)
		group := make([]int, n)
		for c, members := range col.groups {
			for _, j := range members {
				group[j] = c
			}
		}
		for i, row := range pattern {
			at := map[int]int{}
			for _, j := range row {
				if k, ok := at[group[j]]; ok && k != j {
					t.Fatalf("columns %d and %d of group %d share row %d", k, j, group[j], i)
				}
				at[group[j]] = j
			}
		}
	})
}
