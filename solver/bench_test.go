package solver

import (
	"context"
	"strconv"
	"strings"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// BenchmarkBroyden solves Broyden tridiagonal (MGH (30)) and Broyden
// banded (MGH (31)) from the standard start with an analytic, a dense
// finite-difference and a coloured finite-difference Jacobian, reusing one
// Solver; the "sparse-lu" variants replace DenseLU with SparseLU, the
// "pattern" variant gives the analytic Jacobian its Pattern too, and
// "min-degree" sets SparseLU.MinDegree.
func BenchmarkBroyden(b *testing.B) {
	ctx := context.Background()
	for _, mk := range []func(int) mghProblem{broydenTridiagonal, broydenBanded} {
		for _, n := range []int{50, 500} {
			m := mk(n)
			for _, mode := range []string{"analytic", "dense-fd", "colored-fd", "analytic+sparse-lu", "colored-fd+sparse-lu", "analytic+pattern+sparse-lu", "analytic+pattern+sparse-lu+min-degree"} {
				analytic := strings.HasPrefix(mode, "analytic")
				p := m.problem(analytic)
				if !strings.Contains(mode, "colored") && !strings.Contains(mode, "pattern") {
					p.Pattern = nil
				}
				var set *Settings
				if strings.Contains(mode, "sparse-lu") {
					set = &Settings{Factorizer: &SparseLU{MinDegree: strings.HasSuffix(mode, "min-degree")}}
				}
				name := m.name + "/n=" + strconv.Itoa(n) + "/" + mode
				b.Run(name, func(b *testing.B) {
					sv, err := New(p, set)
					if err != nil {
						b.Fatal(err)
					}
					// One solve outside the loop sizes the factorisation.
					if _, err := sv.Solve(ctx, m.x0); err != nil {
						b.Fatal(err)
					}
					var iters, evals, reuses int
					for b.Loop() {
						res, err := sv.Solve(ctx, m.x0)
						if err != nil {
							b.Fatal(err)
						}
						iters += res.Stats.Iterations
						evals += res.Stats.ResidualEvals
						reuses += res.Stats.Reuses
					}
					b.ReportMetric(float64(iters)/float64(b.N), "newton-iters/op")
					b.ReportMetric(float64(evals)/float64(b.N), "residual-evals/op")
					b.ReportMetric(float64(reuses)/float64(b.N), "reuses/op")
				})
			}
		}
	}
}

// BenchmarkWarmVoyage solves the voyage sequence of warm_test.go: 100
// nearby Broyden tridiagonal problems (n = 50 and 500), each from the
// previous answer. One op is the whole sequence of 100 solves.
// (newton-iters counts Jacobians factorised, reuses the steps taken with
// the factorisation of an earlier iteration.)
func BenchmarkWarmVoyage(b *testing.B) {
	ctx := context.Background()
	for _, n := range []int{50, 500} {
		for _, mode := range []string{"analytic", "colored", "analytic+pattern+sparse-lu", "analytic+pattern+sparse-lu+min-degree"} {
			b.Run("n="+strconv.Itoa(n)+"/"+mode, func(b *testing.B) {
				var set *Settings
				vmode := mode
				if strings.HasPrefix(mode, "analytic+pattern+sparse-lu") {
					set = &Settings{Factorizer: &SparseLU{MinDegree: strings.HasSuffix(mode, "min-degree")}}
					vmode = "analytic+pattern"
				}
				v := newVoyage(n, vmode, set)
				start := filled(n, -1)
				v.c = voyageLoad(0)
				res, err := v.sv.Solve(ctx, start)
				if err != nil {
					b.Fatal(err)
				}
				copy(start, res.X)
				x := make([]float64, n)
				var iters, evals, reuses int
				for b.Loop() {
					copy(x, start)
					for k := 1; k <= voyageSteps; k++ {
						v.c = voyageLoad(k)
						res, err := v.sv.Solve(ctx, x)
						if err != nil {
							b.Fatal(err)
						}
						iters += res.Stats.Iterations
						evals += res.Stats.ResidualEvals
						reuses += res.Stats.Reuses
						copy(x, res.X)
					}
				}
				b.ReportMetric(float64(iters)/float64(b.N), "newton-iters/op")
				b.ReportMetric(float64(evals)/float64(b.N), "residual-evals/op")
				b.ReportMetric(float64(reuses)/float64(b.N), "reuses/op")
			})
		}
	}
}

// BenchmarkFirstSolve makes a Solver and solves once (one op: New and the
// first Solve, as a plant's first case) the nine-point Bratu system of
// order 1024, 2025 and 8100 (systems_test.go), with unknowns and
// equations numbered at random, SparseLU with minimum degree, and the
// analytic Jacobian given sparse (Problem.SparseJacobian) or dense
// (Problem.Jacobian, which writes into a Dim×Dim matrix; not run at 8100,
// where that matrix alone is 525 MB). B/op is the memory of a first solve.
func BenchmarkFirstSolve(b *testing.B) {
	ctx := context.Background()
	for _, m := range []int{32, 45, 90} {
		br := newBratu(m, 1)
		for _, mode := range []string{"sparse-jacobian", "dense-jacobian"} {
			if m == 90 && mode == "dense-jacobian" {
				continue
			}
			b.Run("n="+strconv.Itoa(br.n)+"/"+mode, func(b *testing.B) {
				p := br.problem(mode == "sparse-jacobian")
				var iters int
				for b.Loop() {
					sv, err := New(p, &Settings{Factorizer: &SparseLU{MinDegree: true}})
					if err != nil {
						b.Fatal(err)
					}
					res, err := sv.Solve(ctx, br.x0)
					if err != nil {
						b.Fatal(err)
					}
					iters += res.Stats.Iterations
				}
				b.ReportMetric(float64(iters)/float64(b.N), "newton-iters/op")
			})
		}
	}
}

// BenchmarkRepeatedSolve solves 20 hours of the plant-like network of
// order 1976 (systems_test.go: pipes and nodes in SI units with the
// plant's kind of scales, numbered at random, the demands drifting), each
// from the previous answer, on one Solver with SparseLU and minimum
// degree and the dense analytic Jacobian with a Pattern (the plant's
// way). One op is the 20 solves. dfs-cols/fact is the share of the
// columns whose reach a factorisation had to find by depth-first search
// (0: the whole symbolic part kept; 1: none of it); modes: "fresh" (fresh
// Jacobians and pivots at every iteration, Settings.NoReuse), "keep-pivots"
// (refactorisation with kept pivots), "reuse" (the defaults: steps with
// a kept factorisation) and both.
func BenchmarkRepeatedSolve(b *testing.B) {
	ctx := context.Background()
	for _, mode := range []string{"fresh", "keep-pivots", "reuse", "reuse+keep-pivots"} {
		b.Run("n=1976/"+mode, func(b *testing.B) {
			nt := newNetwork(26, 26, 3)
			lu := &SparseLU{MinDegree: true}
			set := &Settings{Factorizer: lu, NoReuse: !strings.HasPrefix(mode, "reuse"), KeepPivots: strings.HasSuffix(mode, "keep-pivots")}
			sv, err := New(nt.problem(true, false), set)
			if err != nil {
				b.Fatal(err)
			}
			start := append([]float64(nil), nt.x0...)
			nt.setLoad(0)
			res, err := sv.Solve(ctx, start)
			if err != nil {
				b.Fatal(err)
			}
			copy(start, res.X)
			x := make([]float64, nt.n)
			var iters, facts, reuses, dfs int
			for b.Loop() {
				copy(x, start)
				dfs0 := lu.dfsCols
				for k := 1; k <= 20; k++ {
					nt.setLoad(k)
					res, err := sv.Solve(ctx, x)
					if err != nil {
						b.Fatal(err)
					}
					copy(x, res.X)
					iters += res.Stats.Iterations
					facts += res.Stats.Factorizations
					reuses += res.Stats.Reuses
				}
				dfs += lu.dfsCols - dfs0
			}
			b.ReportMetric(float64(iters)/float64(b.N), "newton-iters/op")
			b.ReportMetric(float64(reuses)/float64(b.N), "reuses/op")
			b.ReportMetric(float64(dfs)/float64(facts)/float64(nt.n), "dfs-cols/fact")
		})
	}
}

// BenchmarkSparseAdd writes every entry of the 2025-unknown Bratu
// Jacobian's pattern (17,689 entries, nine a row) once: by Add (binary
// search in the row), by positions found once with Index, and into a
// dense Dim×Dim matrix as Problem.Jacobian does. ns/entry is the cost of
// one write.
func BenchmarkSparseAdd(b *testing.B) {
	br := newBratu(45, 1)
	s := NewSparse(br.n, br.pattern)
	type entry struct{ i, j, pos int }
	var entries []entry
	for i, row := range br.pattern {
		for _, j := range row {
			entries = append(entries, entry{i, j, s.Index(i, j)})
		}
	}
	for _, mode := range []string{"add", "position", "dense"} {
		b.Run(mode, func(b *testing.B) {
			d := mat.NewDense(br.n, br.n, nil)
			raw := d.RawMatrix()
			v := s.Values()
			for b.Loop() {
				switch mode {
				case "add":
					for _, e := range entries {
						s.Add(e.i, e.j, 1)
					}
				case "position":
					for _, e := range entries {
						v[e.pos]++
					}
				case "dense":
					for _, e := range entries {
						raw.Data[e.i*raw.Stride+e.j]++
					}
				}
			}
			b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/float64(len(entries)), "ns/entry")
		})
	}
}

// BenchmarkCompileStar makes a Solver for the plant-like system of
// star_test.go (two boilers, the consumers that give the order n) with
// its SparseJacobian and the default SparseLU with minimum degree, and
// solves it once (one op: New, with the structural diagnosis, the
// colouring and the column order, then the first Solve: the Jacobian,
// the first factorisation, one Newton step). B/op is the memory of a
// plant's compile and first case on the solver's side; lu-entries the
// entries of L and U (their diagonals included), the fill.
func BenchmarkCompileStar(b *testing.B) {
	ctx := context.Background()
	for _, n := range []int{500, 2000, 8000} {
		st := starOfOrder(n)
		p := st.problem()
		x0 := make([]float64, st.n)
		b.Run("n="+strconv.Itoa(n), func(b *testing.B) {
			var lu *SparseLU
			for b.Loop() {
				lu = &SparseLU{MinDegree: true}
				sv, err := New(p, &Settings{Factorizer: lu})
				if err != nil {
					b.Fatal(err)
				}
				if _, err := sv.Solve(ctx, x0); err != nil {
					b.Fatal(err)
				}
			}
			b.ReportMetric(float64(st.n), "unknowns")
			b.ReportMetric(float64(len(lu.lrow)+len(lu.ui)), "lu-entries")
		})
	}
}

// BenchmarkSymbolic times the parts of New's symbolic work on the
// plant-like system of star_test.go, one at a time: the structural
// diagnosis (DiagnoseIncidence: matching, Dulmage–Mendelsohn, colour
// count), the colouring of the columns, and the minimum degree column
// order of SparseLU.
func BenchmarkSymbolic(b *testing.B) {
	for _, n := range []int{500, 2000, 8000} {
		st := starOfOrder(n)
		var lu SparseLU
		lu.SetPattern(st.n, st.pattern) // natural order: pp, pr are A's columns
		pp, pr := lu.pp, lu.pr
		for _, part := range []string{"diagnose", "color", "order"} {
			b.Run("n="+strconv.Itoa(n)+"/"+part, func(b *testing.B) {
				for b.Loop() {
					switch part {
					case "diagnose":
						if _, err := DiagnoseIncidence(st.n, st.n, st.pattern, nil, nil); err != nil {
							b.Fatal(err)
						}
					case "color":
						colorColumns(st.pattern, st.n)
					case "order":
						minDegreeOrder(st.n, pp, pr)
					}
				}
			})
		}
	}
}
