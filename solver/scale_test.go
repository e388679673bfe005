package solver

import (
	"context"
	"math"
	"testing"
)

// steamBranch is a small steam branch in SI units, its unknowns eight
// orders of magnitude apart: a source at 16 bar(a) feeds a pipe (k1) to a
// node where 0.5 kg/s branches off; a second pipe (k2) leads to a
// consumer at 12 bar(a) that condenses its steam to 4.2e5 J/kg with a
// duty of 2 MW and loses 0.5 % of its flow as flash steam. Unknowns: p1,
// p2 (Pa), m1, m2 (kg/s), the consumer's inlet enthalpy h (J/kg) and the
// flash loss mf (kg/s, near 0.01). Its root, by hand from the equations:
// m1 solves k1·m1² + k2·(m1 − 0.5)² = p1 − 1.2e6 (the quadratic
// formula), then m2 = m1 − 0.5, p2 = p1 − k1·m1², h = 4.2e5 + 2e6/m2,
// mf = 0.005·m2.
func steamBranch() (Problem, []float64, []float64) {
	const k1, k2 = 2e4, 5e4 // Pa/(kg/s)²
	p := Problem{Dim: 6,
		Residual: func(r, x []float64) error {
			p1, p2, m1, m2, h, mf := x[0], x[1], x[2], x[3], x[4], x[5]
			r[0] = p1 - 1.6e6
			r[1] = p1 - p2 - k1*m1*math.Abs(m1)
			r[2] = p2 - 1.2e6 - k2*m2*math.Abs(m2)
			r[3] = m1 - m2 - 0.5
			r[4] = m2*(h-4.2e5) - 2e6
			r[5] = mf - 0.005*m2
			return nil
		},
		VarNames: []string{"p1", "p2", "m1", "m2", "h", "mf"},
	}
	// k1·m² + k2·(m − 0.5)² = 4e5: (k1+k2)·m² − k2·m + 0.25·k2 − 4e5 = 0.
	a, b, c := k1+k2, -k2, 0.25*k2-4e5
	m1 := (-b + math.Sqrt(b*b-4*a*c)) / (2 * a)
	m2 := m1 - 0.5
	root := []float64{1.6e6, 1.6e6 - k1*m1*m1, m1, m2, 4.2e5 + 2e6/m2, 0.005 * m2}
	x0 := []float64{1.5e6, 1.3e6, 1, 1, 2.8e6, 0.02}
	return p, x0, root
}

// TestScaleFreeSI: without XScale and FScale the steam branch in SI
// units (unknowns from 1.6e6 Pa to 1e-2 kg/s) converges to its root (by
// hand, see steamBranch) to 1e-9 relative. With unit scales and the absolute FTol of 1e-10 it cannot:
// the energy balance's terms are near 3e6 J/s, whose rounding (about
// 5e-10) is above FTol.
func TestScaleFreeSI(t *testing.T) {
	t.Parallel()
	p, x0, root := steamBranch()
	res, err := Solve(context.Background(), p, x0, nil)
	if err != nil || res.Status != Converged {
		t.Fatalf("status %v, error %v after %d iterations (residual %g); want converged", res.Status, err, res.Stats.Iterations, res.ResidualNorm)
	}
	for j, v := range root {
		if math.Abs(res.X[j]-v) > 1e-9*math.Abs(v) {
			t.Errorf("%s = %.12g, want %.12g", p.VarNames[j], res.X[j], v)
		}
	}
}

// TestDerivedScales: started at its root, the steam branch converges with
// no iteration, and the scales the solver derived are |x0_j| and
// FScale_i = max_j |∂F_i/∂x_j|·|x0_j| (the derivatives by hand from
// steamBranch's equations; the solver's are forward differences, hence
// the tolerance of 1e-6: TestFiniteDifferenceJacobian's, common
// practice, no source).
func TestDerivedScales(t *testing.T) {
	t.Parallel()
	p, _, root := steamBranch()
	sv, err := New(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	res, err := sv.Solve(context.Background(), root)
	if err != nil || res.Stats.Iterations != 0 {
		t.Fatalf("status %v, error %v, %d iterations; want converged at the start", res.Status, err, res.Stats.Iterations)
	}
	p1, p2, m1, m2, h, mf := root[0], root[1], root[2], root[3], root[4], root[5]
	wantF := []float64{
		p1,                                      // ∂/∂p1 = 1
		math.Max(math.Max(p1, p2), 2*2e4*m1*m1), // 1, −1, −2·k1·m1
		math.Max(p2, 2*5e4*m2*m2),               // 1, −2·k2·m2
		math.Max(m1, m2),                        // 1, −1
		math.Max((h-4.2e5)*m2, m2*h),            // h − 4.2e5 by m2, m2 by h
		math.Max(mf, 0.005*m2),                  // 1 by mf, −0.005 by m2
	}
	xs, fs := sv.Scales()
	for j, v := range root {
		if xs[j] != math.Abs(v) {
			t.Errorf("XScale of %s = %g, want |x0| = %g", p.VarNames[j], xs[j], math.Abs(v))
		}
	}
	for i, w := range wantF {
		if math.Abs(fs[i]-w) > 1e-6*w {
			t.Errorf("FScale of equation %d = %.9g, want %.9g", i, fs[i], w)
		}
	}
}

// TestScaleRefresh: an unknown that starts at zero gets the scale 1 and,
// once it has grown by more than a factor 1000, its own size; a residual
// whose row norm max_j |∂F_i/∂x_j|·XScale_j moves by more than 1000 gets
// a new scale (constructed: a pressure of 8e5 Pa set from a zero start,
// and a square law 2e4·m·|m| = p from m = 1e-3, root m = √40 kg/s; the
// square law's row norm is max(4e4·1e-3·1e-3, 1·1) = 1 at the start and
// 8e5 (its pressure term) once the pressure's scale is raised).
func TestScaleRefresh(t *testing.T) {
	t.Parallel()
	p := Problem{Dim: 2, Residual: func(r, x []float64) error {
		r[0] = x[0] - 8e5
		r[1] = 2e4*x[1]*math.Abs(x[1]) - x[0]
		return nil
	}}
	sv, err := New(p, nil)
	if err != nil {
		t.Fatal(err)
	}
	res, err := sv.Solve(context.Background(), []float64{0, 1e-3})
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(res.X[0]-8e5) > 1e-9*8e5 || math.Abs(res.X[1]-math.Sqrt(40)) > 1e-9*math.Sqrt(40) {
		t.Errorf("x = %v, want [8e5 √40]", res.X)
	}
	xs, fs := sv.Scales()
	// Started at 0 and 1e-3: scales 1 and 1e-3, raised when the unknowns
	// outgrew them by 1000 (the pressure at once, the flow on its way).
	if !(xs[0] >= 8e5/1e3) || !(xs[1] > 1e-3) {
		t.Errorf("unknown scales %v, want both raised from [1 1e-3]", xs)
	}
	if !(fs[1] >= 1e5) {
		t.Errorf("residual scales %v, want the square law's raised from 1 to its row norm near 8e5", fs)
	}
}

// TestRoundOff: with FTol below what the arithmetic can reach, a problem
// whose scales the solver derived is reported Converged with RoundOff
// set once the step and the residual are at round-off: √2 for
// F(x) = x² − 2 (the caller-scaled version stagnates: TestStagnated) and
// the steam branch's root (by hand, see steamBranch) to 1e-9. A problem
// without a root, F(p) = (p − 1e6)² + 1e10, whose least residual 1e10 is
// far above its round-off, is not.
func TestRoundOff(t *testing.T) {
	t.Parallel()
	ctx := context.Background()
	sq := Problem{Dim: 1, Residual: func(r, x []float64) error { r[0] = x[0]*x[0] - 2; return nil }}
	res, err := Solve(ctx, sq, []float64{10}, &Settings{FTol: 1e-300})
	if err != nil || !res.RoundOff || math.Abs(res.X[0]-math.Sqrt2) > 1e-15 {
		t.Errorf("x² − 2: status %v, error %v, round-off %v, x = %v; want converged at round-off at √2", res.Status, err, res.RoundOff, res.X)
	}
	p, x0, root := steamBranch()
	res, err = Solve(ctx, p, x0, &Settings{FTol: 1e-20})
	if err != nil || !res.RoundOff {
		t.Fatalf("steam branch: status %v, error %v, round-off %v (residual %g)", res.Status, err, res.RoundOff, res.ResidualNorm)
	}
	for j, v := range root {
		if math.Abs(res.X[j]-v) > 1e-9*math.Abs(v) {
			t.Errorf("steam branch: %s = %.12g, want %.12g", p.VarNames[j], res.X[j], v)
		}
	}
	none := Problem{Dim: 1, Residual: func(r, x []float64) error { d := x[0] - 1e6; r[0] = d*d + 1e10; return nil }}
	res, err = Solve(ctx, none, []float64{5e5}, nil)
	if err == nil || res.Status == Converged || res.RoundOff {
		t.Errorf("no root: status %v, error %v, round-off %v at x = %v; want a failure", res.Status, err, res.RoundOff, res.X)
	}
	// Converged in the ordinary way: RoundOff stays false.
	res, err = Solve(ctx, sq, []float64{10}, nil)
	if err != nil || res.RoundOff {
		t.Errorf("x² − 2 with the default FTol: status %v, error %v, round-off %v", res.Status, err, res.RoundOff)
	}
}
