package solver

import (
	"fmt"
	"math"
	"time"

	"gonum.org/v1/gonum/mat"
)

// Problem is a square system F(x) = 0 of Dim equations in Dim unknowns.
//
// The problem holds only the caller's functions and the facts about the
// unknowns and equations; limits and tolerances live in Settings.
type Problem struct {
	// Dim is the number of unknowns, which is also the number of equations.
	Dim int

	// Residual writes F(x) into r. Both slices have length Dim. Residual must
	// not keep r or x. An error it returns stops the solve and is returned
	// wrapped (errors.Is and errors.As see it), except an error that wraps
	// ErrDomain during a line-search trial, which makes the line search take
	// a shorter step instead.
	Residual func(r, x []float64) error

	// Jacobian, if not nil, writes dF_i/dx_j into j (Dim×Dim, already sized;
	// the solver zeroes it before each call). If nil (and SparseJacobian
	// is nil), the solver uses forward finite differences (coloured when
	// Pattern is given). With a Pattern, Jacobian must write only the
	// pattern's entries: unless Settings.VerifyPattern is set, the solver
	// zeroes and reads only those, and ignores anything written elsewhere.
	// The matrix is Dim×Dim whatever the Pattern: for a large sparse
	// problem use SparseJacobian instead.
	Jacobian func(j *mat.Dense, x []float64) error

	// SparseJacobian, if not nil, writes dF_i/dx_j into j, which holds
	// exactly the entries of Pattern (Pattern is then required, and
	// Jacobian must be nil). The solver zeroes j's values before each
	// call; write them with j.Add or j.Set (an entry outside the pattern
	// panics, naming the equation and unknown), or through j.Index and
	// j.Values. SparseJacobian must not keep j. With it, nothing the
	// solver holds is of size Dim² (see New).
	SparseJacobian func(j *Sparse, x []float64) error

	// XScale is the typical magnitude of each unknown. The solver works on
	// x_j/XScale_j. Entries must be positive and finite. Nil: the solver
	// derives the scales from the start point of each Solve, |x0_j| (1
	// where x0_j is zero), and raises a scale to |x_j| when an unknown
	// outgrows it by more than a factor 1000 (see the package doc,
	// Scaling).
	XScale []float64

	// FScale is the typical magnitude of each residual. The convergence
	// test and the merit function use F_i/FScale_i. Entries must be
	// positive and finite. Nil: the solver derives the scales from the
	// Jacobian at the start point of each Solve, FScale_i =
	// max_j |∂F_i/∂x_j|·XScale_j (the change of F_i when the unknowns move
	// by their own size), refreshes a scale when that row norm has moved
	// by more than a factor 1000, and may report convergence at the
	// round-off level of the residuals (Result.RoundOff; see the package
	// doc, Scaling).
	FScale []float64

	// Pattern, if not nil, has Dim rows; Pattern[i] lists the unknowns that
	// equation i depends on (in any order; duplicates are ignored). It is
	// used for the structural diagnosis (see Diagnose), to colour the
	// columns of a finite-difference Jacobian, and to keep the work on a
	// Jacobian proportional to its nonzeros: entries outside the pattern
	// are taken to be exactly zero and are neither read nor checked unless
	// Settings.VerifyPattern is set.
	Pattern [][]int

	// Lower and Upper are optional bounds on the unknowns (nil: unbounded;
	// use math.Inf(-1) or math.Inf(1) for an unbounded entry). Bounds are
	// closed: an unknown may land on its bound. To keep an unknown strictly
	// positive, give a small positive lower bound.
	Lower, Upper []float64

	// VarNames and EqNames name the unknowns and equations in every
	// diagnostic ("unknown 'line l3 pressure'"). Each is nil or has Dim
	// entries; a nil list or an empty entry falls back to "unknown 7",
	// "equation 3".
	VarNames, EqNames []string
}

// varName returns the name of unknown j for messages.
func (p *Problem) varName(j int) string {
	if j < len(p.VarNames) && p.VarNames[j] != "" {
		return p.VarNames[j]
	}
	return fmt.Sprintf("unknown %d", j)
}

// eqName returns the name of equation i for messages.
func (p *Problem) eqName(i int) string {
	if i < len(p.EqNames) && p.EqNames[i] != "" {
		return p.EqNames[i]
	}
	return fmt.Sprintf("equation %d", i)
}

// check panics on programmer mistakes (wrong lengths, missing residual) and
// returns an error for contradictory data (bad scales, crossed bounds).
func (p *Problem) check() error {
	if p.Dim <= 0 {
		panic(fmt.Sprintf("solver: Problem.Dim is %d, want a positive number of unknowns", p.Dim))
	}
	if p.Residual == nil {
		panic("solver: Problem.Residual is nil")
	}
	if p.SparseJacobian != nil && p.Jacobian != nil {
		panic("solver: Problem has both Jacobian and SparseJacobian, want at most one")
	}
	if p.SparseJacobian != nil && p.Pattern == nil {
		panic("solver: Problem.SparseJacobian needs a Pattern")
	}
	n := p.Dim
	lengths := []struct {
		name string
		l    int
		set  bool
	}{
		{"XScale", len(p.XScale), p.XScale != nil},
		{"FScale", len(p.FScale), p.FScale != nil},
		{"Pattern", len(p.Pattern), p.Pattern != nil},
		{"Lower", len(p.Lower), p.Lower != nil},
		{"Upper", len(p.Upper), p.Upper != nil},
	}
	for _, l := range lengths {
		if l.set && l.l != n {
			panic(fmt.Sprintf("solver: Problem.%s has length %d, want Dim = %d", l.name, l.l, n))
		}
	}
	if p.VarNames != nil && len(p.VarNames) != n {
		panic(fmt.Sprintf("solver: Problem.VarNames has length %d, want Dim = %d", len(p.VarNames), n))
	}
	if p.EqNames != nil && len(p.EqNames) != n {
		panic(fmt.Sprintf("solver: Problem.EqNames has length %d, want Dim = %d", len(p.EqNames), n))
	}
	for j, s := range p.XScale {
		if !(s > 0) || math.IsInf(s, 0) {
			return fmt.Errorf("%w: scale of unknown '%s' is %g, want a positive finite typical magnitude", ErrInvalidProblem, p.varName(j), s)
		}
	}
	for i, s := range p.FScale {
		if !(s > 0) || math.IsInf(s, 0) {
			return fmt.Errorf("%w: scale of equation '%s' is %g, want a positive finite typical magnitude", ErrInvalidProblem, p.eqName(i), s)
		}
	}
	for j := 0; j < n; j++ {
		lo, hi := p.lower(j), p.upper(j)
		if math.IsNaN(lo) || math.IsNaN(hi) {
			return fmt.Errorf("%w: bounds of unknown '%s' are [%g, %g], want numbers (use ±Inf for none)", ErrInvalidProblem, p.varName(j), lo, hi)
		}
		if lo > hi {
			return fmt.Errorf("%w: bounds of unknown '%s' are crossed: lower %g > upper %g", ErrInvalidProblem, p.varName(j), lo, hi)
		}
	}
	for i, row := range p.Pattern {
		for _, j := range row {
			if j < 0 || j >= n {
				return fmt.Errorf("%w: pattern of equation '%s' lists unknown index %d, want 0 ≤ index < %d", ErrInvalidProblem, p.eqName(i), j, n)
			}
		}
	}
	return nil
}

func (p *Problem) lower(j int) float64 {
	if p.Lower == nil {
		return math.Inf(-1)
	}
	return p.Lower[j]
}

func (p *Problem) upper(j int) float64 {
	if p.Upper == nil {
		return math.Inf(1)
	}
	return p.Upper[j]
}

// Settings holds the limits of a solve. The zero value of each field means
// the documented default; a nil *Settings means all defaults.
type Settings struct {
	// MaxIterations is the largest number of Newton iterations (Jacobian
	// evaluations); a Solve also takes at most that many steps with a
	// reused factorisation. Zero means 100.
	MaxIterations int

	// FTol is the convergence tolerance on the scaled residual: the solve has
	// converged when max_i |F_i(x)|/FScale_i ≤ FTol (infinity norm), or,
	// with scales the solver derived, when the residual is at its round-off
	// level (Result.RoundOff). Zero means 1e-10.
	FTol float64

	// XTol is the stagnation tolerance on the scaled step: if an accepted
	// step satisfies max_j |Δx_j|/max(|x_j|, XScale_j) ≤ XTol while the
	// residual test still fails, the solve stops with Stagnated. A small
	// step alone never counts as convergence (but see Result.RoundOff).
	// The line search also gives up (LineSearchFailed) when
	// α·max_j |s_j|/max(|x_j|/XScale_j, 1) falls below XTol. Zero means
	// 1e-14.
	XTol float64

	// MaxStep bounds the infinity norm of the scaled Newton step
	// (Δx_j/XScale_j); a longer step is shortened along its direction before
	// the line search. Zero means no bound.
	MaxStep float64

	// MaxCondition is the largest acceptable condition number (1-norm
	// estimate) of the scaled Jacobian; above it the Jacobian is reported as
	// singular. Zero means 1e14.
	MaxCondition float64

	// Armijo is the sufficient-decrease constant c in
	// f(x+αd) ≤ f(x) + c·∇fᵀ(x+αd−x), with f = ½‖F/FScale‖². Zero means 1e-4.
	Armijo float64

	// MaxBacktracks is the largest number of step reductions in one line
	// search. Zero means 40.
	MaxBacktracks int

	// Regularize makes the solver take a Levenberg–Marquardt step,
	// (J̃ᵀJ̃ + μI)·s = −J̃ᵀF̃ with μ = √(n·ε)·‖J̃ᵀJ̃‖₁, when the scaled
	// Jacobian is singular or its condition estimate exceeds MaxCondition,
	// instead of stopping with SingularJacobian. It helps where a
	// singular Jacobian is passing (a flow through zero in a square law, a
	// start on a symmetry line); it hides a modelling error that makes the
	// Jacobian singular everywhere, so the count of such steps is reported
	// in Result.RegularizedSteps. Default false: a singular Jacobian stops
	// the solve and is reported by name.
	Regularize bool

	// VerifyPattern makes the solver check an analytic Jacobian against the
	// Pattern at every iteration: it zeroes, reads and checks for NaN and
	// Inf every entry, and stops with a *PatternError (status
	// InvalidProblem) naming the equation and unknown of any nonzero entry
	// outside the pattern. That costs O(Dim²) per iteration. Default
	// false: only the pattern's entries are zeroed, read, checked and
	// scaled, O(nonzeros). Turn it on in a model's tests; Solver.Jacobian
	// with analytic true and Solver.CheckPattern always check the whole
	// matrix. Without a Pattern every entry is always read.
	VerifyPattern bool

	// SkipDiagnosis skips the structural diagnosis that New runs when the
	// problem has a Pattern. Use it for a warm sequence of solves of the same
	// structure after the first has been diagnosed.
	SkipDiagnosis bool

	// NoReuse makes every iteration form and factorise a fresh Jacobian.
	// By default the solver takes steps with the factorisation of an
	// earlier iteration of the same Solve while they reduce the residual
	// fast enough (see the package doc, Reuse), and repeats a solve that
	// fails after doing so without it.
	NoReuse bool

	// KeepPivots makes the solver refactorise, at an iteration that
	// follows a step of fast convergence (see the package doc, Reuse),
	// with the pivot order of the last factorisation while its pivots pass
	// the threshold, if the Factorizer can (a Refactorizer: SparseLU with
	// a Pattern). That saves the symbolic work where a fresh choice would
	// change a pivot, and changes the factors only by rounding; a solve
	// that then fails is repeated without it. Default false: every
	// factorisation chooses its pivots afresh (SparseLU still reuses its
	// symbolic work wherever the fresh choices are the kept ones).
	KeepPivots bool

	// ChordStart makes a Solve begin, before it forms any Jacobian, with
	// steps on the factorisation the Factorizer holds from an earlier
	// solve (chord steps), if it is a Holder that holds one. They are
	// taken by the rule of the steps with a kept factorisation (each must
	// cut ½‖F̃‖² by reuseAccept² or more; see the package doc, Reuse), so
	// a sequence of solves of nearby points (the hours of a voyage) often
	// ends without a Jacobian. The answer then depends on the earlier
	// solves within the tolerance, not beyond it; a solve that fails
	// after such a step is repeated without reuse, as any other. Off with
	// NoReuse. Default false: no Solve depends on an earlier one.
	ChordStart bool

	// Factorizer solves the linear systems. Nil means a dense LU from gonum
	// (NewDenseLU), except for a Problem with a SparseJacobian, where it
	// means &SparseLU{MinDegree: true}. A Factorizer belongs to one Solver.
	// With a Pattern the solver hands a SparseFactorizer (SparseLU,
	// DenseLU) its sparse Jacobian; any other Factorizer gets a dense copy.
	Factorizer Factorizer

	// Recorder, if not nil, is called after every iteration. The solver
	// never prints.
	Recorder Recorder
	// RecordBound lets the solver give a Recorder the cheap upper bound
	// of the condition number (SparseLU.CondBound) as Iteration.Cond
	// where that bound shows the Jacobian well conditioned, instead of
	// computing the estimate (Factorizer.Cond) at every iteration, which
	// costs a few solves with the factors. Set it when the Recorder
	// watches the iterates and does not report the condition.
	RecordBound bool
}

// Defaults of Settings.
const (
	DefaultMaxIterations = 100
	DefaultFTol          = 1e-10
	DefaultXTol          = 1e-14
	DefaultMaxCondition  = 1e14
	DefaultArmijo        = 1e-4
	DefaultMaxBacktracks = 40
)

// withDefaults returns a copy of s with zero fields replaced by defaults, or
// an error naming a contradictory field.
func (s *Settings) withDefaults() (Settings, error) {
	var c Settings
	if s != nil {
		c = *s
	}
	if c.MaxIterations < 0 {
		return c, fmt.Errorf("%w: Settings.MaxIterations is %d, want ≥ 0 (0 means %d)", ErrInvalidProblem, c.MaxIterations, DefaultMaxIterations)
	}
	if c.MaxIterations == 0 {
		c.MaxIterations = DefaultMaxIterations
	}
	type tol struct {
		name string
		v    *float64
		def  float64
	}
	for _, t := range []tol{
		{"FTol", &c.FTol, DefaultFTol},
		{"XTol", &c.XTol, DefaultXTol},
		{"MaxStep", &c.MaxStep, math.Inf(1)},
		{"MaxCondition", &c.MaxCondition, DefaultMaxCondition},
		{"Armijo", &c.Armijo, DefaultArmijo},
	} {
		if *t.v < 0 || math.IsNaN(*t.v) {
			return c, fmt.Errorf("%w: Settings.%s is %g, want ≥ 0 (0 means the default)", ErrInvalidProblem, t.name, *t.v)
		}
		if *t.v == 0 {
			*t.v = t.def
		}
	}
	if c.Armijo >= 0.5 {
		return c, fmt.Errorf("%w: Settings.Armijo is %g, want 0 < c < 0.5", ErrInvalidProblem, c.Armijo)
	}
	if c.MaxBacktracks < 0 {
		return c, fmt.Errorf("%w: Settings.MaxBacktracks is %d, want ≥ 0 (0 means %d)", ErrInvalidProblem, c.MaxBacktracks, DefaultMaxBacktracks)
	}
	if c.MaxBacktracks == 0 {
		c.MaxBacktracks = DefaultMaxBacktracks
	}
	return c, nil
}

// Stats counts the work of one solve.
type Stats struct {
	Iterations     int           // Newton iterations (Jacobians formed and factorised)
	ResidualEvals  int           // calls of Residual, including those for finite differences
	JacobianEvals  int           // Jacobians formed (analytic calls or finite-difference sweeps)
	Factorizations int           // factorisations of a Jacobian (one per Newton iteration)
	Reuses         int           // steps taken with the factorisation of an earlier iteration
	Carried        int           // of Reuses, those on the factorisation of an earlier solve (Settings.ChordStart)
	RejectedReuses int           // such steps tried and discarded for too little decrease
	Runtime        time.Duration // wall time of the solve
}

// Result is the outcome of a solve.
type Result struct {
	// X is the last accepted point (the root when Status is Converged). It
	// is never NaN: when the solve fails it holds the best point reached.
	X []float64

	// Status says why the solve stopped.
	Status Status

	Stats Stats

	// ResidualNorm is the infinity norm of the scaled residual at X:
	// max_i |F_i(X)|/FScale_i, the quantity FTol bounds. It is +Inf if the
	// residual could not be evaluated at the start point.
	ResidualNorm float64

	// StepNorm is the scaled infinity norm of the last accepted step:
	// max_j |Δx_j|/max(|x_j|, XScale_j), the quantity XTol bounds; 0 if
	// no step was taken.
	StepNorm float64

	// RegularizedSteps counts the Levenberg–Marquardt steps taken on a
	// singular Jacobian (Settings.Regularize).
	RegularizedSteps int

	// Colors is the number of residual evaluations one finite-difference
	// Jacobian costs: the colour count with a Pattern, Dim without one, and
	// 0 with an analytic Jacobian.
	Colors int

	// RoundOff is set on a Converged result whose residual did not meet
	// FTol but is at the round-off level of its own terms, with the last
	// step at round-off too: the accuracy the arithmetic allows (only
	// with scales the solver derived, Problem.FScale nil; see the package
	// doc, Scaling).
	RoundOff bool

	// Retried is set when the solve failed after steps with a reused
	// factorisation or pivot order and was repeated from the start point
	// without them (see Settings.NoReuse); Stats then count both attempts,
	// and a Recorder saw the repeat's iterations numbered from 1 again.
	Retried bool
}

// Iteration is what a Recorder sees after each Newton iteration.
type Iteration struct {
	Iter         int       // 1 for the first Newton iteration; a reused step carries the number of the iteration it follows
	X            []float64 // the accepted point; read only, valid during the call
	ResidualNorm float64   // scaled infinity norm at X
	StepNorm     float64   // scaled infinity norm of the accepted step
	Alpha        float64   // line-search step length taken (1 is a full Newton step)
	Backtracks   int       // step reductions in this line search
	Cond         float64   // condition estimate of the scaled Jacobian (an upper bound with Settings.RecordBound)
	Regularized  bool      // the step was a Levenberg–Marquardt step (Settings.Regularize)
	Reused       bool      // the step used the factorisation of iteration Iter (no new Jacobian)
	Stats        Stats     // counters so far
}

// Recorder receives progress. An error it returns stops the solve and is
// returned wrapped.
type Recorder interface {
	Record(it Iteration) error
}
