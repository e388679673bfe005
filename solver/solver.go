package solver

import (
	"context"
	"errors"
	"fmt"
	"math"
	"strconv"
	"time"

	"gonum.org/v1/gonum/floats"
	"gonum.org/v1/gonum/mat"
)

// Solver solves one Problem repeatedly without allocating: it owns the
// Jacobian, the factorisation, the work vectors and the Result. A Solver is
// not safe for concurrent use.
type Solver struct {
	p   Problem
	set Settings
	n   int

	xs, fs, lo, hi []float64 // scales and bounds, defaults filled in
	bounded        bool

	fact  Factorizer
	jac   *mat.Dense // scaled Jacobian
	color *coloring  // nil without a Pattern: dense finite differences

	// With a Pattern: its rows sorted and without duplicates (row i is
	// pcol[pptr[i]:pptr[i+1]]), the matrix an analytic Jacobian is written
	// into when only the pattern is read, and whether s.jac may hold
	// nonzeros outside the pattern (see clearOutside).
	pptr, pcol []int
	model      *mat.Dense
	outside    bool
	bounder    condBounder // s.fact's cheap condition bound, if it has one

	jtj    *mat.Dense // J̃ᵀJ̃ + μI for Levenberg–Marquardt steps (Regularize only)
	lmFact *DenseLU

	x, r     []float64 // current point and scaled residual
	xt, rt   []float64 // trial point and its scaled residual
	step     []float64 // scaled Newton step
	dir      []float64 // scaled search direction (full step)
	grad     []float64 // scaled gradient of ½‖F̃‖²: J̃ᵀF̃
	h        []float64 // finite-difference steps
	one      [1]int    // a single-column group for dense differences
	mark     []int     // column marks for the pattern check
	xout     []float64 // Result.X storage
	res      Result
	itRecord Iteration
	start    time.Time // of the current solve

	structure *Structure
}

// New checks p and s and prepares a Solver. When p has a Pattern and
// s.SkipDiagnosis is false, New runs Diagnose and returns its
// *StructureError if the pattern is structurally singular.
//
// New copies XScale, FScale, Lower and Upper, and colours the Pattern
// once; later changes to those slices do not reach the Solver. The
// Residual and Jacobian functions are called as they are, so a sequence
// of problems can share one Solver by closing over changing inputs.
//
// Wrong slice lengths in p panic with a "solver: " prefix; contradictory
// data (crossed bounds, non-positive scales, bad settings) return an error.
func New(p Problem, s *Settings) (*Solver, error) {
	if err := p.check(); err != nil {
		return nil, err
	}
	set, err := s.withDefaults()
	if err != nil {
		return nil, err
	}
	n := p.Dim
	sv := &Solver{p: p, set: set, n: n}
	if p.Pattern != nil && !set.SkipDiagnosis {
		st, err := Diagnose(p)
		if err != nil {
			return nil, err
		}
		sv.structure = st
	}
	fill := func(src []float64, def float64) []float64 {
		d := make([]float64, n)
		if src == nil {
			for i := range d {
				d[i] = def
			}
		} else {
			copy(d, src)
		}
		return d
	}
	sv.xs = fill(p.XScale, 1)
	sv.fs = fill(p.FScale, 1)
	sv.lo = fill(p.Lower, math.Inf(-1))
	sv.hi = fill(p.Upper, math.Inf(1))
	for j := 0; j < n; j++ {
		if !math.IsInf(sv.lo[j], -1) || !math.IsInf(sv.hi[j], 1) {
			sv.bounded = true
		}
	}
	sv.fact = set.Factorizer
	if sv.fact == nil {
		sv.fact = NewDenseLU()
	}
	sv.jac = mat.NewDense(n, n, nil)
	if set.Regularize {
		sv.jtj = mat.NewDense(n, n, nil)
		sv.lmFact = NewDenseLU()
	}
	if p.Pattern != nil {
		sv.color = colorColumns(p.Pattern, n)
		sv.pptr, sv.pcol = compressPattern(p.Pattern, n)
		if p.Jacobian != nil && !set.VerifyPattern {
			sv.model = mat.NewDense(n, n, nil)
		}
		if pf, ok := sv.fact.(PatternFactorizer); ok {
			pf.SetPattern(n, p.Pattern)
		}
	}
	sv.bounder, _ = sv.fact.(condBounder)
	work := make([]float64, 9*n)
	next := func() []float64 { v := work[:n:n]; work = work[n:]; return v }
	sv.x, sv.r, sv.xt, sv.rt = next(), next(), next(), next()
	sv.step, sv.dir, sv.grad, sv.h, sv.xout = next(), next(), next(), next(), next()
	sv.res.X = sv.xout
	if p.Pattern != nil {
		sv.mark = make([]int, n)
	}
	switch {
	case p.Jacobian != nil:
		sv.res.Colors = 0
	case sv.color != nil:
		sv.res.Colors = len(sv.color.groups)
	default:
		sv.res.Colors = n
	}
	return sv, nil
}

// Structure returns the structural diagnosis New made, or nil if the
// problem has no Pattern or diagnosis was skipped.
func (s *Solver) Structure() *Structure { return s.structure }

// Colors returns the residual evaluations one finite-difference Jacobian
// costs (the colour count with a Pattern), or 0 with an analytic Jacobian.
func (s *Solver) Colors() int { return s.res.Colors }

// Solve is a convenience for New followed by (*Solver).Solve. It allocates
// a Solver and returns a Result the caller owns.
func Solve(ctx context.Context, p Problem, x0 []float64, s *Settings) (*Result, error) {
	if len(x0) != p.Dim {
		panic(fmt.Sprintf("solver: len(x0) = %d, want Dim = %d", len(x0), p.Dim))
	}
	sv, err := New(p, s)
	if err != nil {
		st := InvalidProblem
		if errors.Is(err, ErrStructure) {
			st = StructurallySingular
		}
		x := make([]float64, len(x0))
		copy(x, x0)
		return &Result{X: x, Status: st, ResidualNorm: math.Inf(1)}, err
	}
	return sv.Solve(ctx, x0)
}

// Solve solves F(x) = 0 from x0 (which it does not modify).
//
// The returned *Result belongs to the Solver: the next call of Solve
// overwrites it and its X. Copy what you need to keep. On a warm Solver,
// Solve allocates nothing unless it fails (building the error allocates).
//
// The error is nil exactly when Result.Status is Converged. Otherwise it
// wraps Result.Status.Err() and, where there is one, a detailed error: a
// *NumberError, a *SingularError, the Residual's own error or ctx.Err().
func (s *Solver) Solve(ctx context.Context, x0 []float64) (*Result, error) {
	if len(x0) != s.n {
		panic(fmt.Sprintf("solver: len(x0) = %d, want Dim = %d", len(x0), s.n))
	}
	start := time.Now()
	s.start = start
	res := &s.res
	res.Stats = Stats{}
	res.RegularizedSteps = 0
	res.Status = NotStarted
	res.ResidualNorm = math.Inf(1)
	res.StepNorm = 0
	copy(s.x, x0)
	copy(res.X, x0)
	err := s.run(ctx)
	copy(res.X, s.x)
	res.Stats.Runtime = time.Since(start)
	return res, err
}

// fail sets the status and builds the returned error.
func (s *Solver) fail(st Status, err error) error {
	s.res.Status = st
	if err == nil {
		return st.Err()
	}
	var se *statusError
	if errors.As(err, &se) {
		s.res.Status = se.status
		return err
	}
	switch err.(type) {
	case *PatternError:
		s.res.Status = InvalidProblem
		return err
	case *NumberError:
		s.res.Status = BadNumber
		return err
	case *SingularError:
		s.res.Status = SingularJacobian
		return err
	}
	return &statusError{status: st, msg: st.Err().Error(), err: err}
}

func (s *Solver) run(ctx context.Context) error {
	set := &s.set
	// The start point must be finite and inside the box.
	for j, v := range s.x {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return s.fail(InvalidStart, fmt.Errorf("start value of unknown '%s' is %g, want a finite number", s.p.varName(j), v))
		}
		if v < s.lo[j] || v > s.hi[j] {
			return s.fail(InvalidStart, fmt.Errorf("start value of unknown '%s' is %g, outside its bounds [%g, %g]", s.p.varName(j), v, s.lo[j], s.hi[j]))
		}
	}
	if err := s.residual(s.r, s.x, 0, false); err != nil {
		return s.fail(ResidualFailed, err)
	}
	fnorm := infNorm(s.r)
	f := 0.5 * dot(s.r, s.r)
	s.res.ResidualNorm = fnorm
	for it := 1; ; it++ {
		if fnorm <= set.FTol {
			s.res.Status = Converged
			return nil
		}
		if it > set.MaxIterations {
			return s.fail(IterationLimit, nil)
		}
		if err := ctx.Err(); err != nil {
			return s.fail(Canceled, err)
		}
		s.res.Stats.Iterations = it
		if err := s.jacobian(it); err != nil {
			return s.fail(ResidualFailed, err)
		}
		s.gradient()
		ferr := s.fact.Factorize(s.jac)
		cond := s.condition(ferr)
		regularized := false
		if ferr != nil || !(cond <= set.MaxCondition) {
			if math.IsNaN(cond) {
				cond = math.Inf(1)
			}
			if !set.Regularize || !s.levenbergMarquardt() {
				return s.fail(SingularJacobian, s.singularError(it, cond))
			}
			regularized = true
			s.res.RegularizedSteps++
		} else {
			// Newton step in scaled unknowns: J̃·step = −F̃.
			for i, v := range s.r {
				s.rt[i] = -v
			}
			if err := s.fact.Solve(s.step, s.rt); err != nil {
				return s.fail(SingularJacobian, s.singularError(it, math.Inf(1)))
			}
		}
		if sn := infNorm(s.step); sn > set.MaxStep {
			scale(s.step, set.MaxStep/sn)
		}

		alpha, back, fnew, err := s.lineSearch(f, it)
		if err != nil {
			return s.fail(LineSearchFailed, err)
		}
		// Accepted: s.xt, s.rt hold the new point. Step norm, then swap in.
		stepNorm := 0.0
		for j := range s.x {
			d := math.Abs(s.xt[j]-s.x[j]) / math.Max(math.Abs(s.xt[j]), s.xs[j])
			if d > stepNorm {
				stepNorm = d
			}
		}
		s.x, s.xt = s.xt, s.x
		s.r, s.rt = s.rt, s.r
		f = fnew
		fnorm = infNorm(s.r)
		s.res.ResidualNorm = fnorm
		s.res.StepNorm = stepNorm
		if set.Recorder != nil {
			s.res.Stats.Runtime = time.Since(s.start)
			s.itRecord = Iteration{Iter: it, X: s.x, ResidualNorm: fnorm, StepNorm: stepNorm,
				Alpha: alpha, Backtracks: back, Cond: cond, Regularized: regularized, Stats: s.res.Stats}
			if err := set.Recorder.Record(s.itRecord); err != nil {
				return s.fail(ResidualFailed, fmt.Errorf("recorder at iteration %d: %w", it, err))
			}
		}
		if fnorm > set.FTol && stepNorm <= set.XTol {
			return s.fail(Stagnated, fmt.Errorf("scaled step %.3g ≤ XTol %.3g at iteration %d with scaled residual %.3g > FTol %.3g",
				stepNorm, set.XTol, it, fnorm, set.FTol))
		}
	}
}

// residual evaluates the scaled residual F(x)/FScale into r, counting the
// call and naming any NaN or Inf. trial marks a line-search trial, where an
// ErrDomain error is passed back unwrapped for the caller to handle.
func (s *Solver) residual(r, x []float64, it int, trial bool) error {
	s.res.Stats.ResidualEvals++
	if err := s.p.Residual(r, x); err != nil {
		if trial && errors.Is(err, ErrDomain) {
			return err
		}
		return &statusError{status: ResidualFailed, msg: "solver: residual at iteration " + itoa(it), err: err}
	}
	for i, v := range r {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return &NumberError{Equation: s.p.eqName(i), Value: v, Iter: it}
		}
		r[i] = v / s.fs[i]
	}
	return nil
}

// levenbergMarquardt sets s.step to the solution of
// (J̃ᵀJ̃ + μI)·step = −J̃ᵀF̃ with μ = √(n·ε)·‖J̃ᵀJ̃‖₁, the perturbation
// Dennis and Schnabel (1983, §6.5) give for a singular or ill-conditioned
// Jacobian (from memory). It needs s.grad and returns false if J̃ is zero
// or the perturbed matrix cannot be factorised.
func (s *Solver) levenbergMarquardt() bool {
	n := s.n
	raw := s.jac.RawMatrix()
	a := s.jtj.RawMatrix()
	for i := 0; i < n; i++ {
		for j := 0; j <= i; j++ {
			sum := 0.0
			for k := 0; k < n; k++ {
				sum += raw.Data[k*raw.Stride+i] * raw.Data[k*raw.Stride+j]
			}
			a.Data[i*a.Stride+j] = sum
			a.Data[j*a.Stride+i] = sum
		}
	}
	norm1 := 0.0
	for j := 0; j < n; j++ {
		col := 0.0
		for i := 0; i < n; i++ {
			col += math.Abs(a.Data[i*a.Stride+j])
		}
		norm1 = math.Max(norm1, col)
	}
	if norm1 == 0 {
		return false
	}
	mu := math.Sqrt(float64(n)*0x1p-52) * norm1
	for i := 0; i < n; i++ {
		a.Data[i*a.Stride+i] += mu
	}
	if s.lmFact.Factorize(s.jtj) != nil {
		return false
	}
	for j, g := range s.grad {
		s.rt[j] = -g
	}
	return s.lmFact.Solve(s.step, s.rt) == nil
}

// condition returns the condition estimate of the factorisation, or,
// when nobody will see the estimate (no Recorder) and the Factorizer has a
// cheap upper bound of the condition number that is within
// Settings.MaxCondition, that bound. Since the estimate is never above
// the true condition number (in exact arithmetic: Hager's estimate is
// ‖A⁻¹x‖₁ for some ‖x‖₁ = 1) and the bound never below it, the bound
// passing the limit means the estimate would have passed it too: the
// SingularJacobian decision is the same, only the estimate is skipped.
// (Within the estimate's own rounding error, about cond·ε relative, of
// the limit the two could differ; there the verdict is a coin toss
// either way.)
func (s *Solver) condition(ferr error) float64 {
	if ferr == nil && s.bounder != nil && s.set.Recorder == nil {
		if b := s.bounder.CondBound(); b <= s.set.MaxCondition {
			return b
		}
	}
	return s.fact.Cond()
}

// gradient sets s.grad = J̃ᵀ·F̃, the gradient of ½‖F̃‖² in scaled unknowns.
func (s *Solver) gradient() {
	raw := s.jac.RawMatrix()
	for j := range s.grad {
		s.grad[j] = 0
	}
	sparse := s.pptr != nil && !s.outside
	for i := 0; i < s.n; i++ {
		ri := s.r[i]
		if ri == 0 {
			continue
		}
		row := raw.Data[i*raw.Stride : i*raw.Stride+s.n]
		if sparse {
			for _, j := range s.prow(i) {
				s.grad[j] += row[j] * ri
			}
			continue
		}
		for j, v := range row {
			s.grad[j] += v * ri
		}
	}
}

// setDirection sets s.dir, the scaled full step from s.x to the projection
// onto the box of s.x + XScale·v, and returns the slope grad·dir.
func (s *Solver) setDirection(v []float64) float64 {
	slope := 0.0
	for j, vj := range v {
		xj := s.x[j]
		t := clamp(xj+s.xs[j]*vj, s.lo[j], s.hi[j])
		s.dir[j] = (t - xj) / s.xs[j]
		slope += s.grad[j] * s.dir[j]
	}
	return slope
}

// lineSearch finds a step length α along the projected path
// x(α) = P(x + α·XScale·dir) with sufficient decrease of f = ½‖F̃‖²:
// f(x(α)) ≤ f(x) + c·gradᵀ(x(α) − x) in scaled unknowns. The first trial is
// the full projected Newton step; if projection has turned it into an
// ascent direction, the projected Cauchy (steepest-descent) step is used
// instead. Step lengths are reduced by quadratic, then cubic interpolation,
// safeguarded to [0.1α, 0.5α]. On success s.xt and s.rt hold the new point.
func (s *Solver) lineSearch(f float64, it int) (alpha float64, backtracks int, fnew float64, err error) {
	slope := s.setDirection(s.step)
	if !(slope < 0) {
		// Projected Cauchy step: minimise the linear model along −grad.
		g2 := dot(s.grad, s.grad)
		if g2 == 0 {
			return 0, 0, f, s.boundStall("the gradient of ½‖F/FScale‖² is zero", it)
		}
		jg := s.jgNormSq()
		t := g2 / jg
		if jg == 0 || math.IsInf(t, 0) {
			t = 1
		}
		for j := range s.step {
			s.step[j] = -t * s.grad[j]
		}
		slope = s.setDirection(s.step)
		if !(slope < 0) {
			return 0, 0, f, s.boundStall("no descent direction inside the bounds", it)
		}
	}
	dmax := 0.0
	for j, d := range s.dir {
		if v := math.Abs(d) / math.Max(math.Abs(s.x[j])/s.xs[j], 1); v > dmax {
			dmax = v
		}
	}
	alpha = 1
	prevAlpha, prevF := 0.0, 0.0
	var lastDomain error // the last ErrDomain error of a trial, for the failure message
	c := s.set.Armijo
	for backtracks = 0; ; backtracks++ {
		gd := 0.0
		for j, d := range s.dir {
			s.xt[j] = clamp(s.x[j]+alpha*s.xs[j]*d, s.lo[j], s.hi[j])
			gd += s.grad[j] * (s.xt[j] - s.x[j]) / s.xs[j]
		}
		rerr := s.residual(s.rt, s.xt, it, true)
		ft := math.Inf(1)
		if rerr == nil {
			ft = 0.5 * dot(s.rt, s.rt)
			if ft <= f+c*gd {
				return alpha, backtracks, ft, nil
			}
		} else if !errors.Is(rerr, ErrDomain) {
			return 0, backtracks, f, rerr
		}
		if rerr != nil {
			lastDomain = rerr
		}
		if backtracks >= s.set.MaxBacktracks || alpha*dmax < s.set.XTol {
			if lastDomain != nil {
				return 0, backtracks, f, fmt.Errorf("no sufficient decrease of ½‖F/FScale‖² after %d step reductions at iteration %d (step length %.3g, scaled residual %.3g); a trial point was outside the model's domain: %w",
					backtracks, it, alpha, infNorm(s.r), lastDomain)
			}
			return 0, backtracks, f, fmt.Errorf("no sufficient decrease of ½‖F/FScale‖² after %d step reductions at iteration %d (step length %.3g, scaled residual %.3g)",
				backtracks, it, alpha, infNorm(s.r))
		}
		var next float64
		switch {
		case math.IsInf(ft, 1):
			next = 0.5 * alpha
		case prevAlpha == 0:
			// Quadratic through f, slope and ft.
			next = -slope * alpha * alpha / (2 * (ft - f - slope*alpha))
		default:
			next = cubicStep(f, slope, alpha, ft, prevAlpha, prevF)
		}
		if math.IsNaN(next) || next > 0.5*alpha {
			next = 0.5 * alpha
		}
		if next < 0.1*alpha {
			next = 0.1 * alpha
		}
		if !math.IsInf(ft, 1) {
			prevAlpha, prevF = alpha, ft
		}
		alpha = next
	}
}

// cubicStep minimises the cubic through φ(0)=f, φ'(0)=slope, φ(a1)=f1 and
// φ(a2)=f2 (Dennis and Schnabel 1983, Algorithm A6.3.1).
func cubicStep(f, slope, a1, f1, a2, f2 float64) float64 {
	r1 := f1 - f - slope*a1
	r2 := f2 - f - slope*a2
	d := a1 - a2
	a := (r1/(a1*a1) - r2/(a2*a2)) / d
	b := (-a2*r1/(a1*a1) + a1*r2/(a2*a2)) / d
	if a == 0 {
		return -slope / (2 * b)
	}
	disc := b*b - 3*a*slope
	if disc < 0 {
		return 0.5 * a1
	}
	return (-b + math.Sqrt(disc)) / (3 * a)
}

// jgNormSq returns ‖J̃·grad‖².
func (s *Solver) jgNormSq() float64 {
	raw := s.jac.RawMatrix()
	sum := 0.0
	sparse := s.pptr != nil && !s.outside
	for i := 0; i < s.n; i++ {
		row := raw.Data[i*raw.Stride : i*raw.Stride+s.n]
		v := 0.0
		if sparse {
			for _, j := range s.prow(i) {
				v += row[j] * s.grad[j]
			}
			sum += v * v
			continue
		}
		for j, a := range row {
			v += a * s.grad[j]
		}
		sum += v * v
	}
	return sum
}

// boundStall builds the line-search error when no descent is possible,
// naming the unknowns held at their bounds.
func (s *Solver) boundStall(why string, it int) error {
	var at []string
	for j, v := range s.x {
		if v == s.lo[j] || v == s.hi[j] {
			at = append(at, s.p.varName(j))
		}
	}
	msg := fmt.Sprintf("%s at iteration %d (scaled residual %.3g)", why, it, infNorm(s.r))
	if len(at) > 0 {
		msg += "; unknowns at a bound: " + quoteList(at)
	}
	return errors.New(msg)
}

func clamp(v, lo, hi float64) float64 {
	if v < lo {
		return lo
	}
	if v > hi {
		return hi
	}
	return v
}

// infNorm returns max_i |v_i| exactly as floats.Norm(v, +Inf) does (+Inf
// if any entry is infinite, else NaN if any is NaN), without its call of
// math.Max per entry.
func infNorm(v []float64) float64 {
	m := 0.0
	nan := false
	for _, a := range v {
		a = math.Abs(a)
		if a > m {
			m = a
		} else if a != a {
			nan = true
		}
	}
	if nan && !math.IsInf(m, 1) {
		return math.NaN()
	}
	return m
}

func dot(a, b []float64) float64 { return floats.Dot(a, b) }

func scale(v []float64, f float64) { floats.Scale(f, v) }

func itoa(i int) string { return strconv.Itoa(i) }
