package solver

import (
	"context"
	"errors"
	"math"
	"reflect"
	"strings"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// TestSingularNaming checks that a singular Jacobian is reported by the
// names of the equations and unknowns involved. The systems are built so
// the answer is known by construction (no published source).
func TestSingularNaming(t *testing.T) {
	t.Parallel()
	names := []string{"drum pressure", "steam flow", "feed temperature"}
	eqs := []string{"boiler energy balance", "drum mass balance", "feed heater duty"}
	cases := []struct {
		name                        string
		f                           func(r, x []float64)
		zeroUnknowns, zeroEquations []string
		unknowns, equations         []string
	}{
		{
			// Equations 0 and 1 are multiples of each other in (p, m);
			// the null vector is (1, −1, 0)/√2.
			name: "dependent equations",
			f: func(r, x []float64) {
				r[0] = x[0] + x[1] - 2
				r[1] = 2*x[0] + 2*x[1] - 4
				r[2] = x[2] - 3
			},
			unknowns:  []string{"drum pressure", "steam flow"},
			equations: []string{"boiler energy balance", "drum mass balance"},
		},
		{
			// The steam flow appears in no equation at all.
			name: "unknown in no equation",
			f: func(r, x []float64) {
				r[0] = x[0] - 1
				r[1] = x[0]*x[0] + x[2] - 3
				r[2] = x[2] - 3
			},
			zeroUnknowns: []string{"steam flow"},
			unknowns:     []string{"steam flow"},
			equations:    []string{"boiler energy balance", "drum mass balance", "feed heater duty"},
		},
		{
			// The feed heater duty depends on nothing.
			name: "equation depends on nothing",
			f: func(r, x []float64) {
				r[0] = x[0] + x[2] - 1
				r[1] = x[1] - x[2]
				r[2] = 5
			},
			zeroEquations: []string{"feed heater duty"},
			equations:     []string{"feed heater duty"},
			unknowns:      []string{"drum pressure", "steam flow", "feed temperature"},
		},
	}
	for _, c := range cases {
		p := Problem{Dim: 3, VarNames: names, EqNames: eqs,
			Residual: func(r, x []float64) error { c.f(r, x); return nil }}
		res, err := Solve(context.Background(), p, []float64{0.5, 0.5, 0.5}, nil)
		var se *SingularError
		if res.Status != SingularJacobian || !errors.As(err, &se) || !errors.Is(err, ErrSingular) {
			t.Fatalf("%s: status %v, error %v; want SingularJacobian with *SingularError", c.name, res.Status, err)
		}
		if !reflect.DeepEqual(se.ZeroUnknowns, c.zeroUnknowns) || !reflect.DeepEqual(se.ZeroEquations, c.zeroEquations) {
			t.Errorf("%s: zero unknowns %q, zero equations %q; want %q, %q", c.name, se.ZeroUnknowns, se.ZeroEquations, c.zeroUnknowns, c.zeroEquations)
		}
		if !reflect.DeepEqual(se.Unknowns, c.unknowns) || !reflect.DeepEqual(se.Equations, c.equations) {
			t.Errorf("%s: null-vector unknowns %q, equations %q; want %q, %q", c.name, se.Unknowns, se.Equations, c.unknowns, c.equations)
		}
		for _, n := range append(c.unknowns, c.equations...) {
			if !strings.Contains(err.Error(), "'"+n+"'") {
				t.Errorf("%s: message %q lacks '%s'", c.name, err, n)
			}
		}
	}
}

// TestBadNumbers checks that NaN or Inf in a residual or a Jacobian entry
// names the equation (and the unknown).
func TestBadNumbers(t *testing.T) {
	t.Parallel()
	names := []string{"economiser eco1 water outlet enthalpy", "economiser eco1 gas outlet temperature"}
	eqs := []string{"economiser eco1 energy balance", "economiser eco1 heat transfer"}
	// Residual NaN once x[0] passes 2 (reached in the first step).
	base := Problem{Dim: 2, VarNames: names, EqNames: eqs,
		Residual: func(r, x []float64) error {
			r[0] = x[0] - 3
			r[1] = x[1] - 1
			if x[0] > 2 {
				r[1] = math.NaN()
			}
			return nil
		}}
	res, err := Solve(context.Background(), base, []float64{0, 0}, nil)
	var ne *NumberError
	if res.Status != BadNumber || !errors.As(err, &ne) || ne.Equation != eqs[1] || ne.Unknown != "" || !errors.Is(err, ErrBadNumber) {
		t.Fatalf("residual NaN: status %v, error %v; want BadNumber naming %q", res.Status, err, eqs[1])
	}
	if !strings.Contains(err.Error(), "'economiser eco1 heat transfer': residual is NaN") {
		t.Errorf("message %q", err)
	}
	for _, v := range res.X {
		if math.IsNaN(v) {
			t.Errorf("result X has NaN: %v", res.X)
		}
	}
	// Inf at the start point.
	inf := base
	inf.Residual = func(r, x []float64) error { r[0], r[1] = math.Inf(1), 0; return nil }
	res, err = Solve(context.Background(), inf, []float64{0, 0}, nil)
	if res.Status != BadNumber || !errors.As(err, &ne) || ne.Equation != eqs[0] || ne.Iter != 0 {
		t.Errorf("residual Inf: status %v, error %v", res.Status, err)
	}
	// Jacobian NaN in d(heat transfer)/d(gas outlet temperature).
	jac := base
	jac.Residual = func(r, x []float64) error { r[0], r[1] = x[0]-3, x[1]-1; return nil }
	jac.Jacobian = func(j *mat.Dense, x []float64) error {
		j.Set(0, 0, 1)
		j.Set(1, 1, math.NaN())
		return nil
	}
	res, err = Solve(context.Background(), jac, []float64{0, 0}, nil)
	if res.Status != BadNumber || !errors.As(err, &ne) || ne.Equation != eqs[1] || ne.Unknown != names[1] {
		t.Fatalf("Jacobian NaN: status %v, error %v", res.Status, err)
	}
	if !strings.Contains(err.Error(), "equation 'economiser eco1 heat transfer': derivative with respect to 'economiser eco1 gas outlet temperature' is NaN") {
		t.Errorf("message %q", err)
	}
}

// plantError stands for an error of a plant model.
type plantError struct{ unit string }

func (e *plantError) Error() string { return "unit " + e.unit + ": no air means no fire" }

func TestResidualErrorWrapped(t *testing.T) {
	t.Parallel()
	calls := 0
	p := Problem{Dim: 1, Residual: func(r, x []float64) error {
		calls++
		if calls == 3 {
			return &plantError{"burner b1"}
		}
		r[0] = x[0]*x[0] - 2
		return nil
	}}
	res, err := Solve(context.Background(), p, []float64{1}, nil)
	var pe *plantError
	if res.Status != ResidualFailed || !errors.As(err, &pe) || pe.unit != "burner b1" || !errors.Is(err, ErrResidual) {
		t.Fatalf("status %v, error %v; want ResidualFailed wrapping *plantError", res.Status, err)
	}
	if !strings.Contains(err.Error(), "no air means no fire") {
		t.Errorf("message %q lacks the plant's message", err)
	}
}

// stopAfter cancels a context at a given iteration.
type stopAfter struct {
	iter   int
	cancel context.CancelFunc
	seen   int
}

func (s *stopAfter) Record(it Iteration) error {
	s.seen++
	if it.Iter == s.iter {
		s.cancel()
	}
	return nil
}

func TestCancel(t *testing.T) {
	t.Parallel()
	m := rosenbrock()
	ctx, cancel := context.WithCancel(context.Background())
	cancel()
	res, err := Solve(ctx, m.problem(true), m.x0, nil)
	if res.Status != Canceled || !errors.Is(err, context.Canceled) || !errors.Is(err, ErrCanceled) || res.Stats.Iterations != 0 {
		t.Fatalf("canceled before start: status %v, error %v, %d iterations", res.Status, err, res.Stats.Iterations)
	}
	ctx, cancel = context.WithCancel(context.Background())
	rec := &stopAfter{iter: 2, cancel: cancel}
	res, err = Solve(ctx, m.problem(true), m.x0, &Settings{Recorder: rec})
	if res.Status != Canceled || !errors.Is(err, context.Canceled) || res.Stats.Iterations != 2 || rec.seen != 2 {
		t.Fatalf("canceled at iteration 2: status %v, error %v, %d iterations, %d records", res.Status, err, res.Stats.Iterations, rec.seen)
	}
}

type failRecorder struct{}

func (failRecorder) Record(Iteration) error { return errors.New("disk full") }

func TestRecorderErrorAndLimit(t *testing.T) {
	t.Parallel()
	m := rosenbrock()
	res, err := Solve(context.Background(), m.problem(true), m.x0, &Settings{Recorder: failRecorder{}})
	if res.Status != ResidualFailed || err == nil || !strings.Contains(err.Error(), "disk full") {
		t.Errorf("recorder error: status %v, error %v", res.Status, err)
	}
	res, err = Solve(context.Background(), m.problem(true), m.x0, &Settings{MaxIterations: 2})
	if res.Status != IterationLimit || !errors.Is(err, ErrIterationLimit) || res.Stats.Iterations != 2 {
		t.Errorf("iteration limit: status %v, error %v, %d iterations", res.Status, err, res.Stats.Iterations)
	}
}

func TestInvalidInput(t *testing.T) {
	t.Parallel()
	p := Problem{Dim: 2, VarNames: []string{"drum pressure", "steam flow"},
		Lower:    []float64{1e3, 0},
		Upper:    []float64{math.Inf(1), math.Inf(1)},
		Residual: func(r, x []float64) error { r[0], r[1] = x[0]-1e6, x[1]-1; return nil }}
	res, err := Solve(context.Background(), p, []float64{5e5, -1}, nil)
	if res.Status != InvalidStart || err == nil || !strings.Contains(err.Error(), "'steam flow' is -1, outside its bounds [0, +Inf]") {
		t.Errorf("start outside bounds: status %v, error %v", res.Status, err)
	}
	res, err = Solve(context.Background(), p, []float64{math.NaN(), 1}, nil)
	if res.Status != InvalidStart || err == nil || !strings.Contains(err.Error(), "'drum pressure' is NaN") {
		t.Errorf("NaN start: status %v, error %v", res.Status, err)
	}
	q := p
	q.Lower = []float64{2, 0}
	q.Upper = []float64{1, 1}
	if res, err := Solve(context.Background(), q, []float64{1, 1}, nil); res.Status != InvalidProblem || !errors.Is(err, ErrInvalidProblem) {
		t.Errorf("crossed bounds through Solve: status %v, error %v", res.Status, err)
	}
	if _, err := New(q, nil); err == nil || !strings.Contains(err.Error(), "'drum pressure' are crossed") {
		t.Errorf("crossed bounds: %v", err)
	}
	q = p
	q.XScale = []float64{1e6, 0}
	if _, err := New(q, nil); err == nil || !strings.Contains(err.Error(), "scale of unknown 'steam flow' is 0") {
		t.Errorf("zero scale: %v", err)
	}
	if _, err := New(p, &Settings{FTol: -1}); err == nil || !strings.Contains(err.Error(), "FTol") {
		t.Errorf("negative FTol: %v", err)
	}
}

func TestPanicsOnWrongLength(t *testing.T) {
	t.Parallel()
	res := func(r, x []float64) error { return nil }
	cases := []struct {
		name string
		f    func()
	}{
		{"x0", func() { _, _ = Solve(context.Background(), Problem{Dim: 2, Residual: res}, []float64{1}, nil) }},
		{"XScale", func() { _, _ = New(Problem{Dim: 2, Residual: res, XScale: []float64{1}}, nil) }},
		{"EqNames", func() { _, _ = New(Problem{Dim: 2, Residual: res, EqNames: []string{"a"}}, nil) }},
		{"Dim", func() { _, _ = New(Problem{Residual: res}, nil) }},
		{"Residual", func() { _, _ = New(Problem{Dim: 1}, nil) }},
	}
	for _, c := range cases {
		func() {
			defer func() {
				r := recover()
				if s, ok := r.(string); !ok || !strings.HasPrefix(s, "solver: ") {
					t.Errorf("%s: recovered %v, want a panic with the \"solver: \" prefix", c.name, r)
				}
			}()
			c.f()
		}()
	}
}

func TestStatusStrings(t *testing.T) {
	t.Parallel()
	for s := NotStarted; s <= InvalidProblem; s++ {
		if s.String() == "" || strings.HasPrefix(s.String(), "status ") {
			t.Errorf("status %d has no name", int(s))
		}
		if (s.Err() == nil) != (s == Converged) {
			t.Errorf("%v.Err() = %v", s, s.Err())
		}
	}
}
