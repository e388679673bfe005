package solver

import (
	"context"
	"errors"
	"math"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// withinTolerance checks that two converged answers a and b of p agree to
// what the residual test allows: both have ‖F̃‖∞ ≤ FTol, so to first
// order ‖J̃(a)·(b − a)/XScale‖∞ ≤ 2·FTol; the check allows 4·FTol for the
// second-order terms (constructed bound, no source). xs and fs are the
// scales of a's solve.
func withinTolerance(t *testing.T, name string, p Problem, a, b, xs, fs []float64, ftol float64) {
	t.Helper()
	sv, err := New(p, &Settings{SkipDiagnosis: true})
	if err != nil {
		t.Fatal(err)
	}
	n := p.Dim
	j := mat.NewDense(n, n, nil)
	if err := sv.Jacobian(j, a, p.Jacobian != nil || p.SparseJacobian != nil); err != nil {
		t.Fatal(err)
	}
	worst := 0.0
	for i := 0; i < n; i++ {
		s := 0.0
		for k := 0; k < n; k++ {
			s += j.At(i, k) * (b[k] - a[k])
		}
		worst = math.Max(worst, math.Abs(s)/fs[i])
	}
	if !(worst <= 4*ftol) {
		t.Errorf("%s: the answers differ by ‖J̃·Δx̃‖∞ = %.3g, want ≤ 4·FTol = %.3g", name, worst, 4*ftol)
	}
}

// TestReuseNeverLoses solves the MGH 1981 set as TestMGH does, with and
// without reuse: every run that converges without reuse converges with
// it (a failing attempt with reuse is repeated without), the two answers
// agree to the tolerance (withinTolerance), and the counts are
// consistent: one factorisation per Newton iteration, Reuses only with
// reuse on. Where both runs fail, they may fail differently.
func TestReuseNeverLoses(t *testing.T) {
	t.Parallel()
	ctx := context.Background()
	reused, runs := 0, 0
	for _, m := range mghProblems() {
		for _, factor := range []float64{1, 10, 100} {
			for _, analytic := range []bool{true, false} {
				x0 := make([]float64, m.n)
				for i := range x0 {
					x0[i] = factor * m.x0[i]
				}
				p := m.problem(analytic)
				off, errOff := Solve(ctx, p, x0, &Settings{NoReuse: true})
				on, errOn := Solve(ctx, p, x0, nil)
				name := m.source + " " + m.name
				runs++
				if off.Stats.Reuses != 0 || off.Stats.Factorizations != off.Stats.Iterations || on.Stats.Factorizations != on.Stats.Iterations {
					t.Errorf("%s from %g·x0: counts without reuse %+v, with %+v", name, factor, off.Stats, on.Stats)
				}
				if on.Stats.Reuses > 0 {
					reused++
				}
				if errOff != nil {
					continue
				}
				if errOn != nil {
					t.Errorf("%s from %g·x0 (analytic %v): converges without reuse, fails with it: %v", name, factor, analytic, errOn)
					continue
				}
				withinTolerance(t, name, p, off.X, on.X, filled(m.n, 1), filled(m.n, 1), DefaultFTol)
			}
		}
	}
	if reused < runs/3 {
		t.Errorf("only %d of %d runs took a step with a reused factorisation", reused, runs)
	}
}

// TestReuseVoyage: on the voyage sequence (TestWarmStart) the default
// reuse takes fewer factorisations than fresh Jacobians at every
// iteration, and each hour's answer agrees with the fresh one to the
// tolerance.
func TestReuseVoyage(t *testing.T) {
	t.Parallel()
	ctx := context.Background()
	on, off := newVoyage(50, "analytic", nil), newVoyage(50, "analytic", &Settings{NoReuse: true})
	xOn, xOff := filled(50, -1), filled(50, -1)
	var fOn, fOff, reuses int
	for k := 0; k <= voyageSteps; k++ {
		on.c, off.c = voyageLoad(k), voyageLoad(k)
		a, err := off.sv.Solve(ctx, xOff)
		if err != nil {
			t.Fatal(err)
		}
		copy(xOff, a.X)
		fOff += a.Stats.Factorizations
		b, err := on.sv.Solve(ctx, xOn)
		if err != nil {
			t.Fatal(err)
		}
		copy(xOn, b.X)
		fOn += b.Stats.Factorizations
		reuses += b.Stats.Reuses
		xs, fs := on.sv.Scales()
		p := Problem{Dim: 50, Residual: on.sv.p.Residual, Jacobian: on.sv.p.Jacobian, XScale: xs, FScale: fs}
		withinTolerance(t, "voyage hour "+itoa(k), p, xOff, xOn, xs, fs, DefaultFTol)
	}
	t.Logf("factorisations: %d fresh at every iteration, %d with reuse (%d reused steps)", fOff, fOn, reuses)
	if !(fOn < fOff) || reuses == 0 {
		t.Errorf("factorisations %d with reuse, %d without; %d reused steps", fOn, fOff, reuses)
	}
}

// TestReuseRetry: a solve that fails after a step with a reused
// factorisation is repeated without reuse. Here the residual fails at the
// two evaluations after the first reused step (a constructed failure: the
// trial of the next reused step, which is discarded, then the trial of
// the Newton step that follows, which stops the attempt); the repeat
// converges to the answer of a solve without reuse, bit for bit, and the
// Result says so and counts both attempts.
func TestReuseRetry(t *testing.T) {
	t.Parallel()
	m := broydenTridiagonal(20)
	failNext, failed := false, 0
	p := m.problem(true)
	inner := p.Residual
	p.Residual = func(r, x []float64) error {
		if failNext && failed < 2 {
			failed++
			return errors.New("a sensor of the model is out of range")
		}
		return inner(r, x)
	}
	rec := recordFunc(func(it Iteration) error {
		if it.Reused {
			failNext = true
		}
		return nil
	})
	res, err := Solve(context.Background(), p, m.x0, &Settings{Recorder: rec})
	if err != nil || !res.Retried || failed != 2 {
		t.Fatalf("status %v, error %v, retried %v, failures injected %d; want a converged repeat after 2", res.Status, err, res.Retried, failed)
	}
	ref, err := Solve(context.Background(), m.problem(true), m.x0, &Settings{NoReuse: true})
	if err != nil {
		t.Fatal(err)
	}
	for i := range ref.X {
		if math.Float64bits(ref.X[i]) != math.Float64bits(res.X[i]) {
			t.Fatalf("x[%d] = %v after the repeat, %v without reuse", i, res.X[i], ref.X[i])
		}
	}
	if res.Stats.Iterations <= ref.Stats.Iterations || res.Stats.Reuses == 0 {
		t.Errorf("stats %+v; want both attempts counted (the repeat alone: %+v)", res.Stats, ref.Stats)
	}
}

// countingLU counts the pivots its refactorisations kept against a fresh
// choice.
type countingLU struct {
	*SparseLU
	kept, refactors int
}

func (c *countingLU) RefactorSparse(j *Sparse) error {
	err := c.SparseLU.RefactorSparse(j)
	c.kept += c.SparseLU.KeptPivots()
	c.refactors++
	return err
}

// TestWarmColdAgree: warm sequences of solves of the plant-like network
// (each from the previous answer, one Solver, SparseLU with minimum
// degree and kept pivots, with and without reused factorisations, and
// with chord steps on the factorisation of the previous solve,
// Settings.ChordStart) and cold solves of the same systems (a new Solver
// each, from the start point, fresh Jacobians and pivots) agree to the
// tolerance at every step; the warm sequences did keep pivots that fresh
// factorisations would have changed, and the chord sequence did take
// steps on the factorisation of an earlier solve.
func TestWarmColdAgree(t *testing.T) {
	t.Parallel()
	ctx := context.Background()
	for _, mode := range []struct{ noReuse, chord bool }{{true, false}, {false, false}, {false, true}} {
		noReuse := mode.noReuse
		nt := newNetwork(8, 7, 9)
		lu := &countingLU{SparseLU: &SparseLU{MinDegree: true}}
		warm, err := New(nt.problem(true, true), &Settings{Factorizer: lu, KeepPivots: true, NoReuse: noReuse, ChordStart: mode.chord})
		if err != nil {
			t.Fatal(err)
		}
		x := append([]float64(nil), nt.x0...)
		retried, carried := 0, 0
		for k := 0; k < 60; k++ {
			nt.setLoad(k)
			w, err := warm.Solve(ctx, x)
			if err != nil {
				t.Fatalf("no reuse %v, chord %v, warm step %d: %v", noReuse, mode.chord, k, err)
			}
			if w.Retried {
				retried++
			}
			carried += w.Stats.Carried
			copy(x, w.X)
			p := nt.problem(true, true)
			c, err := Solve(ctx, p, nt.x0, &Settings{NoReuse: true, Factorizer: &SparseLU{MinDegree: true}})
			if err != nil {
				t.Fatalf("cold step %d: %v", k, err)
			}
			withinTolerance(t, "network step "+itoa(k), p, c.X, x, nt.xScale, nt.fScale, DefaultFTol)
		}
		t.Logf("no reuse %v, chord %v: %d refactorisations kept %d pivots a fresh factorisation would have changed; %d solves retried; %d chord steps", noReuse, mode.chord, lu.refactors, lu.kept, retried, carried)
		if noReuse && (lu.refactors == 0 || lu.kept == 0) {
			t.Errorf("%d refactorisations, %d kept pivots; the test needs some", lu.refactors, lu.kept)
		}
		if mode.chord != (carried > 0) {
			t.Errorf("chord %v: %d steps on the factorisation of an earlier solve", mode.chord, carried)
		}
	}
}
