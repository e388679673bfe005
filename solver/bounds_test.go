package solver

import (
	"context"
	"errors"
	"fmt"
	"math"
	"strings"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// TestBoundsRootOnBound: F(m) = m/(1+m) with the flow m ≥ 0 has its root
// on the bound. From m = 3 the Newton step is −m(1+m) = −12; projected onto
// the box it lands on m = 0 exactly (root by inspection).
func TestBoundsRootOnBound(t *testing.T) {
	t.Parallel()
	p := Problem{Dim: 1, VarNames: []string{"line l1 flow"}, Lower: []float64{0}, Upper: []float64{math.Inf(1)},
		Residual: func(r, x []float64) error {
			if x[0] < 0 {
				return fmt.Errorf("flow %g evaluated below its bound", x[0])
			}
			r[0] = x[0] / (1 + x[0])
			return nil
		}}
	res, err := Solve(context.Background(), p, []float64{3}, nil)
	if err != nil || res.X[0] != 0 || res.Stats.Iterations != 1 {
		t.Errorf("status %v, error %v, x = %v after %d iterations; want m = 0 in 1 iteration", res.Status, err, res.X, res.Stats.Iterations)
	}
}

// TestBoundsPressure: F(p) = ln(p/1e5) with XScale 1e5 has its root at
// p = 1e5 Pa (by inspection). From 1e6 Pa the Newton step is
// −p·ln 10 ≈ −2.3e6 Pa, which would make the pressure negative. With a
// lower bound of 1e3 Pa the step is projected and the line search
// recovers; the residual is never evaluated below the bound. Without a
// bound, the residual reports the negative pressure as ErrDomain and the
// line search shortens the step.
func TestBoundsPressure(t *testing.T) {
	t.Parallel()
	for _, bounded := range []bool{true, false} {
		lowest := math.Inf(1)
		p := Problem{Dim: 1, XScale: []float64{1e5}, VarNames: []string{"drum pressure"},
			Residual: func(r, x []float64) error {
				lowest = math.Min(lowest, x[0])
				if x[0] <= 0 {
					return fmt.Errorf("drum pressure %g Pa: %w", x[0], ErrDomain)
				}
				r[0] = math.Log(x[0] / 1e5)
				return nil
			}}
		if bounded {
			p.Lower, p.Upper = []float64{1e3}, []float64{math.Inf(1)}
		}
		res, err := Solve(context.Background(), p, []float64{1e6}, nil)
		if err != nil || math.Abs(res.X[0]-1e5) > 1e-4 {
			t.Errorf("bounded=%v: status %v, error %v, p = %v; want 1e5 Pa", bounded, res.Status, err, res.X)
		}
		if bounded && lowest < 1e3 {
			t.Errorf("bounded: residual evaluated at %g Pa, below the bound", lowest)
		}
		if !bounded && lowest > 0 {
			t.Errorf("unbounded: the test meant the full step to leave the domain, lowest p %g", lowest)
		}
	}
}

// TestBoundsActive: two flows m1, m2 ≥ 0 with m1 + m2 = 1 and
// m1 − m2 = 3 have the unconstrained root (2, −1). With bounds there is no
// root; the solver must neither evaluate a negative flow nor stall
// silently: it stops with LineSearchFailed and names the flow held at its
// bound (by inspection: the least-squares point on the box is (2, 0)).
func TestBoundsActive(t *testing.T) {
	t.Parallel()
	p := Problem{Dim: 2, VarNames: []string{"branch a flow", "branch b flow"},
		Lower: []float64{0, 0}, Upper: []float64{math.Inf(1), math.Inf(1)},
		Residual: func(r, x []float64) error {
			if x[0] < 0 || x[1] < 0 {
				return fmt.Errorf("negative flow %v", x)
			}
			r[0] = x[0] + x[1] - 1
			r[1] = x[0] - x[1] - 3
			return nil
		}}
	res, err := Solve(context.Background(), p, []float64{0.5, 0.5}, nil)
	if res.Status != LineSearchFailed || !errors.Is(err, ErrLineSearch) {
		t.Fatalf("status %v, error %v; want LineSearchFailed", res.Status, err)
	}
	if math.Abs(res.X[0]-2) > 1e-6 || res.X[1] != 0 {
		t.Errorf("stopped at %v, want the constrained least-squares point (2, 0)", res.X)
	}
	if want := "'branch b flow'"; !strings.Contains(err.Error(), want) {
		t.Errorf("message %q does not name %s", err, want)
	}
}

// TestBoundsLeaveBound: a flow that starts on its bound (0) and must move
// off it: F(m) = m − 0.5 (root by inspection).
func TestBoundsLeaveBound(t *testing.T) {
	t.Parallel()
	p := Problem{Dim: 2, Lower: []float64{0, 0}, Upper: []float64{1, math.Inf(1)},
		Residual: func(r, x []float64) error {
			r[0] = x[0] - 0.5
			r[1] = x[1]*x[1] - 4
			return nil
		}}
	res, err := Solve(context.Background(), p, []float64{0, 0.1}, nil)
	if err != nil || math.Abs(res.X[0]-0.5) > 1e-12 || math.Abs(res.X[1]-2) > 1e-9 {
		t.Errorf("status %v, error %v, x = %v; want (0.5, 2)", res.Status, err, res.X)
	}
}

// TestFiniteDifferenceDomain: F(x) = √(1 − x) − 1/2 is defined only for
// x ≤ 1 and the model says so with ErrDomain, not with a bound. From
// x0 = 1 − 1e-10 the forward step √ε leaves the domain; the solver turns
// the step round. Root by inspection: x = 3/4.
func TestFiniteDifferenceDomain(t *testing.T) {
	t.Parallel()
	p := Problem{Dim: 1, Residual: func(r, x []float64) error {
		if x[0] > 1 {
			return fmt.Errorf("x = %g > 1: %w", x[0], ErrDomain)
		}
		r[0] = math.Sqrt(1-x[0]) - 0.5
		return nil
	}}
	res, err := Solve(context.Background(), p, []float64{1 - 1e-10}, nil)
	if err != nil || math.Abs(res.X[0]-0.75) > 1e-9 { // |F′(3/4)| = 1, so |Δx| ≲ FTol
		t.Errorf("status %v, error %v, x = %v; want 0.75", res.Status, err, res.X)
	}
}

// TestDomainReported: when every trial point is outside the model's
// domain, the line search fails and its error carries the model's own
// error (constructed case, no source).
func TestDomainReported(t *testing.T) {
	t.Parallel()
	p := Problem{Dim: 1, Residual: func(r, x []float64) error {
		if x[0] != 2 {
			return &plantError{"valve v1"}
		}
		r[0] = 1
		return nil
	}}
	// The start point is fine; every other point fails with a domain error.
	q := p
	q.Residual = func(r, x []float64) error {
		if err := p.Residual(r, x); err != nil {
			return fmt.Errorf("%w: %w", ErrDomain, err)
		}
		return nil
	}
	q.Jacobian = func(j *mat.Dense, x []float64) error { j.Set(0, 0, 1); return nil }
	res, err := Solve(context.Background(), q, []float64{2}, nil)
	var pe *plantError
	if res.Status != LineSearchFailed || !errors.As(err, &pe) || !strings.Contains(err.Error(), "outside the model's domain") {
		t.Errorf("status %v, error %v; want LineSearchFailed carrying the plant error", res.Status, err)
	}
}
