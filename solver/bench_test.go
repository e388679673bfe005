package solver

import (
	"context"
	"strconv"
	"strings"
	"testing"
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
					var iters, evals int
					for b.Loop() {
						res, err := sv.Solve(ctx, m.x0)
						if err != nil {
							b.Fatal(err)
						}
						iters += res.Stats.Iterations
						evals += res.Stats.ResidualEvals
					}
					b.ReportMetric(float64(iters)/float64(b.N), "newton-iters/op")
					b.ReportMetric(float64(evals)/float64(b.N), "residual-evals/op")
				})
			}
		}
	}
}

// BenchmarkWarmVoyage solves the voyage sequence of warm_test.go: 100
// nearby Broyden tridiagonal problems (n = 50 and 500), each from the
// previous answer. One op is the whole sequence of 100 solves.
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
				var iters, evals int
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
						copy(x, res.X)
					}
				}
				b.ReportMetric(float64(iters)/float64(b.N), "newton-iters/op")
				b.ReportMetric(float64(evals)/float64(b.N), "residual-evals/op")
			})
		}
	}
}
