package solver

import (
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// TestSparse: Index finds every entry of a seeded random pattern (given
// unsorted, with duplicates) and nothing else, Add, Set and At agree with
// a dense copy, Row and Values are views, Zero clears and DenseTo writes
// the matrix (constructed check, no source).
func TestSparse(t *testing.T) {
	t.Parallel()
	rng := rand.New(rand.NewPCG(4, 40))
	for trial := 0; trial < 50; trial++ {
		n := 1 + rng.IntN(30)
		pattern := make([][]int, n)
		in := make([][]bool, n)
		for i := range pattern {
			in[i] = make([]bool, n)
			for range rng.IntN(2 * n) {
				j := rng.IntN(n)
				pattern[i] = append(pattern[i], j)
				in[i][j] = true
			}
		}
		s := NewSparse(n, pattern)
		want := mat.NewDense(n, n, nil)
		nnz := 0
		for i := 0; i < n; i++ {
			for j := 0; j < n; j++ {
				p := s.Index(i, j)
				if (p >= 0) != in[i][j] {
					t.Fatalf("trial %d: Index(%d, %d) = %d, in pattern %v", trial, i, j, p, in[i][j])
				}
				if p < 0 {
					continue
				}
				nnz++
				v := rng.NormFloat64()
				if rng.IntN(2) == 0 {
					s.Set(i, j, v)
				} else {
					s.Add(i, j, v)
				}
				s.Add(i, j, 1)
				want.Set(i, j, v+1)
			}
		}
		if s.NNZ() != nnz {
			t.Fatalf("trial %d: NNZ %d, want %d", trial, s.NNZ(), nnz)
		}
		got := mat.NewDense(n, n, nil)
		s.DenseTo(got)
		if !mat.Equal(got, want) {
			t.Fatalf("trial %d: DenseTo differs from the entries written", trial)
		}
		for i := 0; i < n; i++ {
			cols, vals := s.Row(i)
			for k, j := range cols {
				if k > 0 && cols[k-1] >= j {
					t.Fatalf("trial %d: row %d columns %v not ascending", trial, i, cols)
				}
				if vals[k] != s.At(i, j) || s.Values()[s.Index(i, j)] != vals[k] {
					t.Fatalf("trial %d: Row, At and Values disagree at (%d, %d)", trial, i, j)
				}
			}
		}
		s.Zero()
		for _, v := range s.Values() {
			if v != 0 {
				t.Fatalf("trial %d: Zero left %g", trial, v)
			}
		}
	}
}
