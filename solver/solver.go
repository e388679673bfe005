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
	xsAuto, fsAuto bool // the scales are derived (Problem.XScale, FScale nil)

	fact    Factorizer
	sfact   SparseFactorizer // fact, if it takes the sparse Jacobian
	refact  Refactorizer     // fact, if it can keep its pivot order
	bounder condBounder      // fact's cheap condition bound, if it has one
	holder  Holder           // fact, if it can say it holds a factorisation (ChordStart)

	// The scaled Jacobian: dense without a Pattern (jac), on the
	// Pattern with one (sj, whose rows are the pattern's, sorted and
	// without duplicates). model is the Dim×Dim matrix a dense
	// Problem.Jacobian writes into when there is a Pattern, dense the
	// copy of sj for a Factorizer that takes only dense matrices; both
	// are nil otherwise.
	jac    *mat.Dense
	sj     *Sparse
	model  *mat.Dense
	dense  *mat.Dense
	color  *coloring // nil without a Pattern (dense finite differences), and with an analytic Jacobian until differences are asked for
	colPos [][]int   // colPos[j][k]: position in sj of (color.colRows[j][k], j)

	jtj    *mat.Dense // J̃ᵀJ̃ + μI for Levenberg–Marquardt steps (Regularize, no Pattern)
	lmFact *DenseLU
	lm     *normalMatrix // the same on the Pattern (Regularize with a Pattern), made when first needed

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

	// Of the current attempt of a solve: whether it took or tried a step
	// with a kept factorisation or refactorised with kept pivots, whether
	// a Recorder stopped it, and whether the last line search turned to
	// the Cauchy step or gave up on a step below XTol.
	usedReuse, recStop bool
	cauchy, tinyStep   bool

	structure *Structure
}

// Constants of the reuse rule and of the derived scales (see the package
// doc, Reuse and Scaling).
const (
	// reuseGate: a kept factorisation is tried after a full Newton step
	// (no backtracking) that reduced ‖F̃‖₂ by at least this factor.
	reuseGate = 0.1
	// reuseAccept: a step with a kept factorisation is taken if it reduces
	// ‖F̃‖₂ by at least this factor; otherwise it is discarded.
	reuseAccept = 0.1
	// scaleDrift: a derived scale is refreshed when what it measures has
	// moved by more than this factor (three orders of magnitude).
	scaleDrift = 1e3
	// roundOffTerms: the allowance, in units of ε times the size of its
	// terms, for the rounding of a residual beyond one ε per term
	// summed (products, a property call).
	roundOffTerms = 4
)

// New checks p and s and prepares a Solver. When p has a Pattern and
// s.SkipDiagnosis is false, New runs Diagnose and returns its
// *StructureError if the pattern is structurally singular.
//
// New copies XScale, FScale, Lower and Upper, and colours the Pattern
// once when the problem has no analytic Jacobian (with one, the
// diagnosis counts the colours, and Solver.Jacobian colours the Pattern
// when first asked for differences); later changes to those slices do
// not reach the Solver. The
// Residual and Jacobian functions are called as they are, so a sequence
// of problems can share one Solver by closing over changing inputs.
//
// With a Pattern, the Solver holds the Jacobian on the pattern (a
// *Sparse) and nothing of size Dim², except what the caller chose: the
// Dim×Dim matrix a dense Problem.Jacobian writes into, a DenseLU (which
// is dense; the default unless the Problem has a SparseJacobian), a
// Factorizer that takes only dense matrices, and the dense copy of the
// Jacobian that the diagnosis of a singular Jacobian makes on failure up
// to order maxSVDOrder.
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
	fd := p.Jacobian == nil && p.SparseJacobian == nil
	if p.Pattern != nil && fd {
		// The colouring of finite differences, which the diagnosis
		// counts too.
		sv.color = colorColumns(p.Pattern, n)
	}
	if p.Pattern != nil && !set.SkipDiagnosis {
		st, err := diagnoseIncidence(n, n, p.Pattern, p.EqNames, p.VarNames, sv.color)
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
	sv.xsAuto, sv.fsAuto = p.XScale == nil, p.FScale == nil
	sv.fact = set.Factorizer
	if sv.fact == nil {
		if p.SparseJacobian != nil {
			sv.fact = &SparseLU{MinDegree: true}
		} else {
			sv.fact = NewDenseLU()
		}
	}
	if set.Regularize && p.Pattern == nil {
		sv.jtj = mat.NewDense(n, n, nil)
		sv.lmFact = NewDenseLU()
	}
	if p.Pattern != nil {
		ptr, col := compressPattern(p.Pattern, n)
		sv.sj = newSparse(&sparsePattern{n: n, ptr: ptr, col: col, rowNames: p.EqNames, colNames: p.VarNames})
		if fd {
			sv.colorPositions()
		}
		if p.Jacobian != nil {
			sv.model = mat.NewDense(n, n, nil)
		}
		if lu, ok := sv.fact.(*SparseLU); ok {
			lu.setPattern(n, ptr, col) // SetPattern, on the rows compressed here
		} else if pf, ok := sv.fact.(PatternFactorizer); ok {
			pf.SetPattern(n, p.Pattern)
		}
		sv.sfact, _ = sv.fact.(SparseFactorizer)
		sv.refact, _ = sv.fact.(Refactorizer)
		sv.mark = make([]int, n)
	} else {
		sv.jac = mat.NewDense(n, n, nil)
	}
	sv.bounder, _ = sv.fact.(condBounder)
	sv.holder, _ = sv.fact.(Holder)
	work := make([]float64, 9*n)
	next := func() []float64 { v := work[:n:n]; work = work[n:]; return v }
	sv.x, sv.r, sv.xt, sv.rt = next(), next(), next(), next()
	sv.step, sv.dir, sv.grad, sv.h, sv.xout = next(), next(), next(), next(), next()
	sv.res.X = sv.xout
	switch {
	case p.Jacobian != nil || p.SparseJacobian != nil:
		sv.res.Colors = 0
	case sv.color != nil:
		sv.res.Colors = len(sv.color.groups)
	default:
		sv.res.Colors = n
	}
	return sv, nil
}

// colorPositions colours the columns of the Pattern (unless done) and
// finds where each entry of a column's rows is in the sparse Jacobian,
// for coloured finite differences. New does it for a problem without an
// analytic Jacobian; Solver.Jacobian and JacobianSparse do it when first
// asked for differences of one with.
func (s *Solver) colorPositions() {
	if s.color == nil {
		s.color = colorColumns(s.p.Pattern, s.n)
	}
	if s.colPos != nil {
		return
	}
	s.colPos = make([][]int, s.n)
	pos := make([]int, 0, s.sj.NNZ())
	for j, rows := range s.color.colRows {
		start := len(pos)
		for _, i := range rows {
			pos = append(pos, s.sj.Index(i, j))
		}
		s.colPos[j] = pos[start:len(pos):len(pos)]
	}
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
// A Solve depends only on x0 and the Problem, never on earlier solves
// (unless Settings.ChordStart, where it does within the tolerance).
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
	res.Retried = false
	err := s.attempt(ctx, x0, !s.set.NoReuse, s.set.KeepPivots)
	if err != nil && s.usedReuse && !s.recStop && retryable(res.Status) {
		// Reuse must never make a solve fail that succeeds without it:
		// repeat it without.
		first := res.Stats
		err = s.attempt(ctx, x0, false, false)
		st := &res.Stats
		st.Iterations += first.Iterations
		st.ResidualEvals += first.ResidualEvals
		st.JacobianEvals += first.JacobianEvals
		st.Factorizations += first.Factorizations
		st.Reuses += first.Reuses
		st.Carried += first.Carried
		st.RejectedReuses += first.RejectedReuses
		res.Retried = true
	}
	res.Stats.Runtime = time.Since(start)
	return res, err
}

// attempt runs one solve from x0, with or without steps with a kept
// factorisation (reuse) and refactorisations with kept pivots (keep).
func (s *Solver) attempt(ctx context.Context, x0 []float64, reuse, keep bool) error {
	res := &s.res
	res.Stats = Stats{}
	res.RegularizedSteps = 0
	res.RoundOff = false
	res.Status = NotStarted
	res.ResidualNorm = math.Inf(1)
	res.StepNorm = 0
	s.usedReuse, s.recStop = false, false
	copy(s.x, x0)
	copy(res.X, x0)
	err := s.run(ctx, reuse, keep)
	copy(res.X, s.x)
	return err
}

// retryable says whether a solve that stopped with st may succeed when
// repeated without reuse.
func retryable(st Status) bool {
	switch st {
	case Canceled, InvalidStart, InvalidProblem, Converged:
		return false
	}
	return true
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

func (s *Solver) run(ctx context.Context, reuse, keep bool) error {
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
	if s.xsAuto {
		s.deriveXScale()
	}
	haveJac := false // the Jacobian at the start point is formed
	if s.fsAuto {
		// The residual scales come from the Jacobian at the start point:
		// form both unscaled, then scale.
		for i := range s.fs {
			s.fs[i] = 1
		}
		if err := s.residual(s.r, s.x, 0, false); err != nil {
			return s.fail(ResidualFailed, err)
		}
		if err := s.jacobian(1); err != nil {
			return s.fail(ResidualFailed, err)
		}
		s.deriveFScale()
		haveJac = true
	} else if err := s.residual(s.r, s.x, 0, false); err != nil {
		return s.fail(ResidualFailed, err)
	}
	fnorm := infNorm(s.r)
	f := 0.5 * dot(s.r, s.r)
	s.res.ResidualNorm = fnorm
	cond := math.Inf(1)
	// fast: the last step was a full Newton step (or one with a kept
	// factorisation) that cut ‖F̃‖₂ by reuseGate or more; only then are
	// the last factorisation and its pivot order used again.
	fast, tryReuse := false, false
	// With ChordStart the first steps take the factorisation of an
	// earlier solve, if the Factorizer holds one.
	tryReuse = reuse && set.ChordStart && s.holder != nil && s.holder.Holds()
	for it := 0; ; {
		if fnorm <= set.FTol {
			s.res.Status = Converged
			return nil
		}
		if tryReuse && s.res.Stats.Reuses < set.MaxIterations {
			if err := ctx.Err(); err != nil {
				return s.fail(Canceled, err)
			}
			if fnew, ok := s.reuseStep(f, it); ok {
				if it == 0 {
					// A chord step: the Jacobian at the start point, if
					// formed for the scales, is not the one at the new
					// point.
					s.res.Stats.Carried++
					haveJac = false
				}
				stepNorm := s.accept()
				f = fnew
				fnorm = infNorm(s.r)
				s.res.ResidualNorm = fnorm
				s.res.StepNorm = stepNorm
				if err := s.record(it, stepNorm, 1, 0, cond, false, true); err != nil {
					return err
				}
				if fnorm > set.FTol && stepNorm <= set.XTol {
					return s.stagnated(stepNorm, it)
				}
				continue
			}
			tryReuse = false
		}
		it++
		if it > set.MaxIterations {
			return s.fail(IterationLimit, nil)
		}
		if err := ctx.Err(); err != nil {
			return s.fail(Canceled, err)
		}
		s.res.Stats.Iterations = it
		if !haveJac || it > 1 {
			if s.xsAuto && it > 1 {
				s.refreshXScale()
			}
			if err := s.jacobian(it); err != nil {
				return s.fail(ResidualFailed, err)
			}
			if s.fsAuto && it > 1 && s.refreshFScale() {
				fnorm = infNorm(s.r)
				f = 0.5 * dot(s.r, s.r)
				s.res.ResidualNorm = fnorm
			}
		}
		s.gradient()
		ferr := s.factorize(!keep || !fast)
		s.res.Stats.Factorizations++
		cond = s.condition(ferr)
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
			if s.tinyStep && s.fsAuto && s.atRoundOff() {
				s.res.RoundOff = true
				s.res.Status = Converged
				return nil
			}
			return s.fail(LineSearchFailed, err)
		}
		stepNorm := s.accept()
		fold := f
		f = fnew
		fnorm = infNorm(s.r)
		s.res.ResidualNorm = fnorm
		s.res.StepNorm = stepNorm
		if err := s.record(it, stepNorm, alpha, back, cond, regularized, false); err != nil {
			return err
		}
		if fnorm > set.FTol && stepNorm <= set.XTol {
			return s.stagnated(stepNorm, it)
		}
		// Reuse rule: after a full Newton step that cut ‖F̃‖₂ by
		// reuseGate or more, try the same factorisation next.
		fast = !regularized && !s.cauchy && alpha == 1 && back == 0 && f <= reuseGate*reuseGate*fold
		tryReuse = reuse && fast
	}
}

// accept moves to the trial point in s.xt, s.rt and returns the scaled
// norm of the step.
func (s *Solver) accept() float64 {
	stepNorm := 0.0
	for j := range s.x {
		d := math.Abs(s.xt[j]-s.x[j]) / math.Max(math.Abs(s.xt[j]), s.xs[j])
		if d > stepNorm {
			stepNorm = d
		}
	}
	s.x, s.xt = s.xt, s.x
	s.r, s.rt = s.rt, s.r
	return stepNorm
}

// record calls the Recorder, if any.
func (s *Solver) record(it int, stepNorm, alpha float64, back int, cond float64, regularized, reused bool) error {
	if s.set.Recorder == nil {
		return nil
	}
	s.res.Stats.Runtime = time.Since(s.start)
	s.itRecord = Iteration{Iter: it, X: s.x, ResidualNorm: s.res.ResidualNorm, StepNorm: stepNorm,
		Alpha: alpha, Backtracks: back, Cond: cond, Regularized: regularized, Reused: reused, Stats: s.res.Stats}
	if err := s.set.Recorder.Record(s.itRecord); err != nil {
		s.recStop = true
		return s.fail(ResidualFailed, fmt.Errorf("recorder at iteration %d: %w", it, err))
	}
	return nil
}

// stagnated ends a solve whose accepted step was below XTol with the
// residual above FTol: Converged at round-off when the scales are derived
// and the residual is at its round-off level, Stagnated otherwise.
func (s *Solver) stagnated(stepNorm float64, it int) error {
	if s.fsAuto && s.atRoundOff() {
		s.res.RoundOff = true
		s.res.Status = Converged
		return nil
	}
	return s.fail(Stagnated, fmt.Errorf("scaled step %.3g ≤ XTol %.3g at iteration %d with scaled residual %.3g > FTol %.3g",
		stepNorm, s.set.XTol, it, s.res.ResidualNorm, s.set.FTol))
}

// reuseStep tries a step with the factorisation of the last Newton
// iteration: s.step = −J̃_kept⁻¹·F̃(x), to the projection of x +
// XScale·step onto the box. It is taken (s.xt, s.rt hold the new point)
// when the residual there can be evaluated and ½‖F̃‖² has fallen to at
// most reuseAccept² times f; otherwise it is discarded.
func (s *Solver) reuseStep(f float64, it int) (float64, bool) {
	for i, v := range s.r {
		s.rt[i] = -v
	}
	if s.fact.Solve(s.step, s.rt) != nil {
		s.res.Stats.RejectedReuses++
		return f, false
	}
	if sn := infNorm(s.step); sn > s.set.MaxStep {
		scale(s.step, s.set.MaxStep/sn)
	}
	for j, v := range s.step {
		s.xt[j] = clamp(s.x[j]+s.xs[j]*v, s.lo[j], s.hi[j])
	}
	if err := s.residual(s.rt, s.xt, it, true); err != nil {
		s.res.Stats.RejectedReuses++
		return f, false
	}
	ft := 0.5 * dot(s.rt, s.rt)
	if !(ft <= reuseAccept*reuseAccept*f) {
		s.res.Stats.RejectedReuses++
		return f, false
	}
	s.res.Stats.Reuses++
	s.usedReuse = true // the path leaves that of fresh Jacobians
	return ft, true
}

// factorize factorises the scaled Jacobian: afresh, or (fresh false, with
// a Refactorizer) keeping the pivot order of the last factorisation.
func (s *Solver) factorize(fresh bool) error {
	if s.sj == nil {
		return s.fact.Factorize(s.jac)
	}
	if !fresh && s.refact != nil {
		err := s.refact.RefactorSparse(s.sj)
		if s.refact.KeptPivots() > 0 {
			s.usedReuse = true // the factors differ from fresh ones
		}
		return err
	}
	if s.sfact != nil {
		return s.sfact.FactorizeSparse(s.sj)
	}
	// A Factorizer that takes only dense matrices: a dense copy, whose
	// entries outside the pattern stay zero.
	if s.dense == nil {
		s.dense = mat.NewDense(s.n, s.n, nil)
	}
	raw := s.dense.RawMatrix()
	for i := 0; i < s.n; i++ {
		cols, vals := s.sj.Row(i)
		row := raw.Data[i*raw.Stride : i*raw.Stride+s.n]
		for k, j := range cols {
			row[j] = vals[k]
		}
	}
	return s.fact.Factorize(s.dense)
}

// deriveXScale sets XScale from the start point: |x0_j|, or 1 where x0_j
// is zero.
func (s *Solver) deriveXScale() {
	for j, v := range s.x {
		a := math.Abs(v)
		if a == 0 {
			a = 1
		}
		s.xs[j] = a
	}
}

// refreshXScale raises a derived scale to |x_j| where the unknown has
// outgrown it by more than scaleDrift.
func (s *Solver) refreshXScale() {
	for j, v := range s.x {
		if a := math.Abs(v); a > scaleDrift*s.xs[j] {
			s.xs[j] = a
		}
	}
}

// jacRow returns row i of the scaled Jacobian: its columns and values
// on the Pattern, or its dense values (cols nil) without one.
func (s *Solver) jacRow(i int) (cols []int, vals []float64) {
	if s.sj != nil {
		return s.sj.Row(i)
	}
	raw := s.jac.RawMatrix()
	return nil, raw.Data[i*raw.Stride : i*raw.Stride+s.n]
}

// rowMax returns max_j |J̃_ij| of the scaled Jacobian.
func (s *Solver) rowMax(i int) float64 {
	_, vals := s.jacRow(i)
	m := 0.0
	for _, v := range vals {
		m = math.Max(m, math.Abs(v))
	}
	return m
}

// scaleRow multiplies row i of the scaled Jacobian and the scaled
// residual by c.
func (s *Solver) scaleRow(i int, c float64) {
	_, vals := s.jacRow(i)
	for k := range vals {
		vals[k] *= c
	}
	s.r[i] *= c
}

// deriveFScale sets FScale from the Jacobian at the start point, formed
// with FScale 1: FScale_i = max_j |J_ij|·XScale_j, or |F_i(x0)| where
// the row is zero, or 1 where that is zero too; and scales the Jacobian
// and the residual by it.
func (s *Solver) deriveFScale() {
	for i := range s.fs {
		m := s.rowMax(i)
		if !(m > 0) || math.IsInf(m, 0) {
			m = math.Abs(s.r[i])
			if !(m > 0) {
				m = 1
			}
		}
		s.fs[i] = m
		s.scaleRow(i, 1/m)
	}
}

// refreshFScale rescales the rows of the scaled Jacobian whose norm has
// moved by more than scaleDrift from 1 (their FScale measured), and
// reports whether it changed any.
func (s *Solver) refreshFScale() bool {
	changed := false
	for i := range s.fs {
		m := s.rowMax(i)
		if m > scaleDrift && !math.IsInf(m, 0) || m > 0 && m < 1/scaleDrift {
			s.fs[i] *= m
			s.scaleRow(i, 1/m)
			changed = true
		}
	}
	return changed
}

// atRoundOff reports whether every scaled residual at s.x is within the
// round-off of its terms: |F̃_i| ≤ (m_i + roundOffTerms)·ε·Σ_j |J̃_ij|·|x_j|/XScale_j,
// where the sum, with the last Jacobian, is the size of the terms of F_i
// to first order and m_i counts them (the nonzeros of the row): the bound
// of rounding in a sum of m_i terms (Higham, Accuracy and Stability of
// Numerical Algorithms, 2nd ed., SIAM 2002, §4.2, from memory) plus a
// few ε for the terms' own evaluation. Constant terms that cancel (a
// residual written as a difference of two large constants) are not
// seen, which makes the test stricter, never looser.
func (s *Solver) atRoundOff() bool {
	const eps = 0x1p-52
	for i := 0; i < s.n; i++ {
		cols, vals := s.jacRow(i)
		sum, m := 0.0, 0
		for k, v := range vals {
			if v == 0 {
				continue
			}
			j := k
			if cols != nil {
				j = cols[k]
			}
			m++
			sum += math.Abs(v) * math.Abs(s.x[j]) / s.xs[j]
		}
		if !(math.Abs(s.r[i]) <= float64(m+roundOffTerms)*eps*sum) {
			return false
		}
	}
	return true
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
// or the perturbed matrix cannot be factorised. With a Pattern the
// matrix is formed and factorised on the pattern of J̃ᵀJ̃ (normalMatrix).
func (s *Solver) levenbergMarquardt() bool {
	if s.sj != nil {
		if s.lm == nil {
			s.lm = newNormalMatrix(s.sj)
		}
		if !s.lm.factorize(s.sj) {
			return false
		}
		for j, g := range s.grad {
			s.rt[j] = -g
		}
		return s.lm.lu.Solve(s.step, s.rt) == nil
	}
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

// normalMatrix is J̃ᵀJ̃ + μI on its pattern, for the Levenberg–Marquardt
// steps of a problem with a Pattern: entry (j, k) exists when some row of
// J̃ has both columns, plus the diagonal.
type normalMatrix struct {
	a    *Sparse
	pos  []int // for each row of J̃, for each pair (a, b) of its entries, the position of (col a, col b) in a
	diag []int // positions of the diagonal
	lu   *SparseLU
}

func newNormalMatrix(j *Sparse) *normalMatrix {
	n := j.pat.n
	pattern := make([][]int, n)
	for c := 0; c < n; c++ {
		pattern[c] = append(pattern[c], c)
	}
	for i := 0; i < n; i++ {
		cols, _ := j.Row(i)
		for _, a := range cols {
			pattern[a] = append(pattern[a], cols...)
		}
	}
	m := &normalMatrix{a: NewSparse(n, pattern), lu: &SparseLU{MinDegree: true}, diag: make([]int, n)}
	for i := 0; i < n; i++ {
		cols, _ := j.Row(i)
		for _, a := range cols {
			for _, b := range cols {
				m.pos = append(m.pos, m.a.Index(a, b))
			}
		}
	}
	for c := range m.diag {
		m.diag[c] = m.a.Index(c, c)
	}
	return m
}

// factorize forms J̃ᵀJ̃ + μI from j (the products summed over the rows of
// j in order, as the dense loop sums them) and factorises it.
func (m *normalMatrix) factorize(j *Sparse) bool {
	m.a.Zero()
	v := m.a.val
	q := 0
	n := j.pat.n
	for i := 0; i < n; i++ {
		_, vals := j.Row(i)
		for _, x := range vals {
			for _, y := range vals {
				v[m.pos[q]] += x * y
				q++
			}
		}
	}
	// ‖·‖₁ of the symmetric matrix is its largest absolute row sum.
	norm1 := 0.0
	for c := 0; c < n; c++ {
		_, vals := m.a.Row(c)
		sum := 0.0
		for _, x := range vals {
			sum += math.Abs(x)
		}
		norm1 = math.Max(norm1, sum)
	}
	if norm1 == 0 {
		return false
	}
	mu := math.Sqrt(float64(n)*0x1p-52) * norm1
	for _, p := range m.diag {
		v[p] += mu
	}
	return m.lu.FactorizeSparse(m.a) == nil
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
	if ferr == nil && s.bounder != nil && (s.set.Recorder == nil || s.set.RecordBound) {
		if b := s.bounder.CondBound(); b <= s.set.MaxCondition {
			return b
		}
	}
	return s.fact.Cond()
}

// gradient sets s.grad = J̃ᵀ·F̃, the gradient of ½‖F̃‖² in scaled unknowns.
func (s *Solver) gradient() {
	clear(s.grad)
	if s.sj != nil {
		for i := 0; i < s.n; i++ {
			ri := s.r[i]
			if ri == 0 {
				continue
			}
			cols, vals := s.sj.Row(i)
			for k, j := range cols {
				s.grad[j] += vals[k] * ri
			}
		}
		return
	}
	raw := s.jac.RawMatrix()
	for i := 0; i < s.n; i++ {
		ri := s.r[i]
		if ri == 0 {
			continue
		}
		row := raw.Data[i*raw.Stride : i*raw.Stride+s.n]
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
	s.cauchy, s.tinyStep = false, false
	slope := s.setDirection(s.step)
	if !(slope < 0) {
		s.cauchy = true
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
			s.tinyStep = alpha*dmax < s.set.XTol
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
	sum := 0.0
	if s.sj != nil {
		for i := 0; i < s.n; i++ {
			cols, vals := s.sj.Row(i)
			v := 0.0
			for k, j := range cols {
				v += vals[k] * s.grad[j]
			}
			sum += v * v
		}
		return sum
	}
	raw := s.jac.RawMatrix()
	for i := 0; i < s.n; i++ {
		row := raw.Data[i*raw.Stride : i*raw.Stride+s.n]
		v := 0.0
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
