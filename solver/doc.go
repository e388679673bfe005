// Package solver finds a root of a square nonlinear system F(x) = 0 by a
// globalised Newton-Raphson method. It knows nothing of plants: a caller
// hands it a Problem (a residual function, optionally a Jacobian, scales,
// a sparsity pattern, bounds and names) and gets back a Result with the
// root, a Status and counters.
//
// # Method
//
// Each Newton iteration forms the Jacobian J at the current point x,
// factorises the scaled Jacobian J̃ = D_F⁻¹·J·D_X (D_X = diag(XScale),
// D_F = diag(FScale)) through a Factorizer (dense LU from gonum by
// default) and solves J̃·s = −F̃ for the scaled Newton step s, where
// F̃ = D_F⁻¹·F(x). The unknowns move by D_X·α·s after a line search on
// the merit function f(x) = ½‖F̃(x)‖². Between Newton iterations the
// solver may take steps with the last factorisation (see Reuse).
//
// # Scaling
//
// Unknowns and residuals of a plant differ by many orders of magnitude
// (pressures near 1e6 Pa, flows near 1 kg/s). The solver works on the
// scaled unknowns x_j/XScale_j and the scaled residuals F_i/FScale_i
// throughout: in the Newton step, the merit function, the condition check,
// the convergence test and the finite-difference step.
//
// A Problem without XScale or FScale gets scales the solver derives at
// the start of each Solve, so that a problem in SI units needs no hand
// scaling:
//
//   - XScale_j = |x0_j|, or 1 where x0_j is zero; raised to |x_j| before a
//     Newton iteration where the unknown has outgrown it by more than a
//     factor 1000;
//   - FScale_i = max_j |J_ij(x0)|·XScale_j, the change of F_i when the
//     unknowns move by their own size (|F_i(x0)|, or 1, where the row is
//     zero): the Jacobian at the start point is formed first for this,
//     even when the start point turns out to be converged. After every
//     later Jacobian, a row whose norm max_j |J̃_ij| has moved by more
//     than a factor 1000 from 1 gets FScale_i multiplied by that norm.
//
// FTol then bounds the residual relative to the size of its own terms
// rather than in the problem's units, and a problem in SI units meets it
// at its root instead of stagnating at the rounding of terms of size
// 1e6. Solver.Scales returns the scales in use. (The expected outcomes
// of the Moré–Garbow–Hillstrom tests are those with unit scales, as the
// paper poses the problems; with derived scales Wood's function from
// 1·x0 and 10·x0 reaches the iteration limit and Brown's almost-linear
// system from 100·x0 converges, the reverse of unit scales.)
//
// # Convergence
//
// A solve has converged (Status Converged) when the infinity norm of the
// scaled residual, max_i |F_i(x)|/FScale_i, is at most Settings.FTol
// (default 1e-10). This is tested at the start point and after every
// accepted step; a start point that already satisfies it takes zero
// iterations. A small step alone is never taken as convergence: if an
// accepted step has max_j |Δx_j|/max(|x_j|, XScale_j) ≤ Settings.XTol
// (default 1e-14) while the residual test fails, or the line search
// shrinks the step below XTol, the solve stops with Stagnated (or
// LineSearchFailed), with one exception. When the solver derived the
// residual scales (FScale nil) and every residual is at the round-off
// level of its own terms,
//
//	|F̃_i| ≤ (m_i + 4)·ε·Σ_j |J̃_ij|·|x_j|/XScale_j,
//
// with J̃ the last Jacobian, m_i the number of nonzeros in its row i
// (the terms of F_i to first order) and ε = 2⁻⁵², the solve is
// Converged with Result.RoundOff set: the arithmetic allows no better.
// The bound is that of a sum of m_i terms plus a few ε for the terms'
// own evaluation (Higham 2002, §4.2, from memory). Terms of F_i that do
// not vary with x (a large constant cancelled by another) are not seen,
// which makes the test stricter, never looser. With the caller's FScale,
// FTol is the caller's contract and an unreachable one stagnates.
//
// # Line search
//
// The step length α starts at 1 (the full Newton step) and is accepted
// when f(x(α)) ≤ f(x) + c·gᵀ·D_X⁻¹(x(α) − x), with g = J̃ᵀF̃ the gradient
// of f in scaled unknowns (Armijo, c = Settings.Armijo, default 1e-4). Otherwise α is reduced by minimising the
// quadratic through f(x), the initial slope and f(x(α)), and from the
// second reduction the cubic through the last two trial values (Dennis and
// Schnabel, Numerical Methods for Unconstrained Optimization and Nonlinear
// Equations, 1983, A6.3.1), safeguarded to [0.1α, 0.5α]. A residual error
// wrapping ErrDomain at a trial point halves α instead of failing.
//
// # Bounds
//
// Bounds are handled by projection: the trial point is
// x(α) = P(x + α·D_X·s), where P clips each unknown to [Lower_j, Upper_j].
// An unknown may land on its bound and leave it again at a later
// iteration, so a flow driven to zero does not stall the solve. The Armijo
// test uses the actual projected displacement. If projection turns the
// Newton step into an ascent direction of f, the search uses the projected
// Cauchy step instead (steepest descent of f, scaled to minimise the linear
// model); if that also fails to descend, the solve stops with
// LineSearchFailed and names the unknowns held at a bound. A start point
// outside the bounds is an error (InvalidStart), never silently clipped.
//
// # Jacobian
//
// An analytic Jacobian is used if the Problem gives one. Otherwise forward
// differences with a step per unknown h_j = √ε·max(|x_j|, XScale_j), signed
// like x_j and turned round when x_j + h_j would leave the box. With a
// Pattern, the columns are grouped by a greedy (largest-first, by an upper
// bound of the degree) colouring of the column intersection graph
// (Curtis, Powell and Reid, J. Inst. Maths Applics 13, 1974), in time
// near-linear in the nonzeros: columns that share no equation are
// perturbed together,
// so a banded or sparse Jacobian costs a handful of residual evaluations
// (Result.Colors). The pattern must contain every nonzero of the Jacobian.
// With a Pattern, the solver holds the Jacobian on the pattern (a
// *Sparse: compressed rows, columns ascending) and the work per iteration
// on it (zeroing, checking for NaN and Inf, scaling, the gradient, handing
// it to a SparseFactorizer such as SparseLU) is proportional to its
// nonzeros, not to Dim²: entries outside the pattern are taken as zero
// and an analytic Jacobian's entries there are not read. An analytic
// Jacobian may write straight into that storage (Problem.SparseJacobian,
// with Sparse.Add or Set by binary search in the row, or by positions
// from Sparse.Index); then nothing the solver holds is of size Dim². A
// dense Problem.Jacobian writes into a Dim×Dim matrix, whose pattern
// entries the solver then copies. Settings.VerifyPattern makes the
// solver check an analytic Jacobian against the pattern at every iteration
// instead (a *PatternError names the equation and unknown); Solver.Jacobian
// with analytic true always checks, and Solver.CheckPattern checks a model
// without an analytic Jacobian by dense differences. A model's tests should
// use one of these. A difference step that leaves the model's domain (the
// residual returns an error wrapping ErrDomain) is retried from the other
// side.
//
// # Reuse
//
// After a Newton step that was a full step (α = 1, no backtracking, not a
// Cauchy or Levenberg–Marquardt step) and cut ‖F̃‖₂ by a factor 10 or
// more, the solver tries a step with the same factorisation at the new
// point (a chord step, s = −J̃_kept⁻¹·F̃(x), projected onto the box). The
// step is taken when the residual there can be evaluated and ‖F̃‖₂ has
// fallen by a factor 10 or more; then the next step tries the same
// factorisation again. Otherwise it is discarded (Stats.RejectedReuses:
// one residual and one solve spent) and a Newton iteration with a fresh
// Jacobian starts from the same point. Steps with a kept factorisation
// count in Stats.Reuses, not in Stats.Iterations (which counts Jacobians
// factorised, and which MaxIterations bounds); a Solve takes at most
// MaxIterations of them. Every Solve starts with a fresh Jacobian, so no
// Solve depends on an earlier one, unless Settings.ChordStart: a Solve
// then begins with such steps on the factorisation the Factorizer holds
// from the last solve (a Holder), and forms its first Jacobian only when
// one of them is refused.
//
// Such steps converge linearly where Newton's converge quadratically, so
// a solve ends soon after the residual meets FTol, where a full Newton
// step would have overshot it by many digits: answers differ from those
// of fresh Jacobians within the tolerance (‖J̃·Δx̃‖ of about 2·FTol), not
// bit for bit. With Settings.KeepPivots, a Newton iteration after a step
// of that fast kind also refactorises with the kept pivot order
// (SparseLU.RefactorSparse).
//
// Reuse never makes a solve fail that succeeds without it: a solve that
// fails (other than by cancellation or bad input) after taking a step
// with a kept factorisation, or after a refactorisation whose pivots a
// fresh factorisation would not have chosen, is repeated from x0 with
// fresh Jacobians and pivots at every iteration, the method without
// reuse; Result.Retried says so and Stats count both attempts.
// Settings.NoReuse turns the steps with a kept factorisation off.
//
// # Structural diagnosis
//
// When a Problem has a Pattern, New runs Diagnose first (unless
// Settings.SkipDiagnosis): a maximum matching of equations to unknowns
// (Hopcroft and Karp 1973) and the Dulmage–Mendelsohn coarse decomposition
// into over-determined, square and under-determined parts. A structurally
// singular system is reported as a *StructureError naming the equations
// and unknowns of each part.
//
// # Singular Jacobian
//
// When the LU fails or its condition estimate exceeds Settings.MaxCondition
// (default 1e14), the solve stops with SingularJacobian and a
// *SingularError that names the unknowns and equations involved: zero
// columns and rows of the scaled Jacobian, and the unknowns and equations
// that carry the singular vectors (gonum's SVD) of its smallest singular
// values (with a Pattern, up to order 1000; above, only the zero rows
// and columns, and SingularError.NotDecomposed). With
// Settings.Regularize the solver instead takes a Levenberg–Marquardt
// step, (J̃ᵀJ̃ + μI)·s = −J̃ᵀF̃ with μ = √(n·ε)·‖J̃ᵀJ̃‖₁ (with a Pattern,
// formed on the pattern of J̃ᵀJ̃ and factorised by SparseLU), and counts
// it in Result.RegularizedSteps; this
// carries a solve through a passing singularity (a flow through zero in a
// square law) but would hide a Jacobian that is singular everywhere, which
// is why it is not the default.
//
// # Linear algebra
//
// The Factorizer interface separates the linear solve from the method.
// The default DenseLU calls gonum's LAPACK routines (Dgetf2, Dgetrs,
// Dgecon) on storage it owns, so it allocates nothing after its first
// factorisation; from order 320 (DenseLU.BlockedFrom) it switches to the
// faster blocked Dgetrf, whose parallel matrix products allocate.
// SparseLU, a left-looking sparse LU with threshold partial pivoting
// (Gilbert and Peierls 1988), can be set in Settings.Factorizer for large
// sparse Jacobians (it is the default with a SparseJacobian); it takes the
// columns in their natural order unless SparseLU.MinDegree asks for an
// approximate minimum degree order found once from the Pattern (on a
// quotient graph of AᵀA, in the manner of AMD and COLAMD; the pattern's
// zeros are then kept in the structure). It keeps the symbolic part of each
// factorisation (the reach of each column, the structure of L and U, the
// pivots) and refactorises on it without any search, writing into the
// kept storage, for as long as each pivot is the one kept; from the first
// column where a pivot changes, the rest is searched again. Its storage
// is O(nonzeros + fill), and it allocates nothing once warm. It takes the
// solver's sparse Jacobian as it is; its condition estimate is made only
// when asked for, and while no Recorder wants the estimate the solver
// first tries SparseLU.CondBound, a cheaper upper bound of the condition
// number: when that is within MaxCondition, so is the estimate, and the
// estimate is skipped.
//
// # Errors and allocation
//
// NaN or Inf in a residual or Jacobian entry (with a Pattern, an entry
// of the pattern; any entry with Settings.VerifyPattern) stops the solve
// with a *NumberError naming the equation (and the unknown). An error returned by
// Residual is returned wrapped. The context is checked every iteration.
// Contradictory data (crossed bounds, non-positive scales, bad settings)
// is an error wrapping ErrInvalidProblem; a start point outside the
// bounds is InvalidStart. Wrong slice lengths are programmer mistakes and
// panic with a "solver: " prefix, as does an entry outside the pattern
// written into a Sparse. A Solver made by New reuses all its storage,
// including its Result, so repeated successful solves (the hours of a
// voyage, warm-started from the previous answer) allocate nothing below
// order 320 (see DenseLU); a failing solve allocates its error.
package solver
