package solver

import (
	"errors"
	"fmt"
	"strconv"
	"strings"
)

// Status says why a solve stopped. Only Converged is success; Err gives a
// sentinel error for the others, which the detailed error returned by Solve
// wraps (errors.Is(err, solver.ErrSingular) and so on).
type Status int

const (
	NotStarted           Status = iota // no solve has run
	Converged                          // scaled residual infinity norm ≤ FTol
	IterationLimit                     // MaxIterations reached without convergence
	Stagnated                          // an accepted step was below XTol but the residual was not below FTol
	LineSearchFailed                   // no step length gave sufficient decrease of ½‖F/FScale‖²
	SingularJacobian                   // the scaled Jacobian is singular or too ill conditioned
	Canceled                           // the context was canceled or its deadline passed
	BadNumber                          // NaN or Inf in a residual or Jacobian entry
	ResidualFailed                     // Residual, Jacobian or the Recorder returned an error
	StructurallySingular               // the sparsity pattern admits no perfect matching
	InvalidStart                       // the start point is outside the bounds or not finite
	InvalidProblem                     // the Problem or Settings are contradictory (crossed bounds, bad scales)
)

var statusNames = [...]string{
	NotStarted:           "not started",
	Converged:            "converged",
	IterationLimit:       "iteration limit",
	Stagnated:            "stagnated",
	LineSearchFailed:     "line search failed",
	SingularJacobian:     "singular Jacobian",
	Canceled:             "canceled",
	BadNumber:            "bad number",
	ResidualFailed:       "residual failed",
	StructurallySingular: "structurally singular",
	InvalidStart:         "invalid start",
	InvalidProblem:       "invalid problem",
}

// String returns a short lower-case description.
func (s Status) String() string {
	if s >= 0 && int(s) < len(statusNames) {
		return statusNames[s]
	}
	return "status " + strconv.Itoa(int(s))
}

// Sentinel errors, one per failing Status. They are never modified.
var (
	ErrIterationLimit  = errors.New("solver: iteration limit reached")
	ErrStagnated       = errors.New("solver: step too small before the residual met the tolerance")
	ErrLineSearch      = errors.New("solver: line search found no sufficient decrease")
	ErrSingular        = errors.New("solver: singular Jacobian")
	ErrCanceled        = errors.New("solver: canceled")
	ErrBadNumber       = errors.New("solver: NaN or Inf")
	ErrResidual        = errors.New("solver: residual function failed")
	ErrStructure       = errors.New("solver: structurally singular system")
	ErrInvalidStart    = errors.New("solver: invalid start point")
	ErrInvalidProblem  = errors.New("solver: invalid problem")
	errNotStartedError = errors.New("solver: not started")

	// ErrDomain may be wrapped by an error that Residual returns when x lies
	// outside the domain of the model (a property call out of range, say).
	// During a line-search trial such an error makes the solver shorten the
	// step; anywhere else it stops the solve like any other error.
	ErrDomain = errors.New("solver: outside the model's domain")
)

// Err returns nil for Converged and a sentinel error otherwise.
func (s Status) Err() error {
	switch s {
	case Converged:
		return nil
	case NotStarted:
		return errNotStartedError
	case IterationLimit:
		return ErrIterationLimit
	case Stagnated:
		return ErrStagnated
	case LineSearchFailed:
		return ErrLineSearch
	case SingularJacobian:
		return ErrSingular
	case Canceled:
		return ErrCanceled
	case BadNumber:
		return ErrBadNumber
	case ResidualFailed:
		return ErrResidual
	case StructurallySingular:
		return ErrStructure
	case InvalidStart:
		return ErrInvalidStart
	case InvalidProblem:
		return ErrInvalidProblem
	}
	return fmt.Errorf("solver: unknown status %d", int(s))
}

// NumberError reports a NaN or Inf in a residual or Jacobian entry.
type NumberError struct {
	Equation string  // name of the equation
	Unknown  string  // name of the unknown for a Jacobian entry, "" for a residual
	Value    float64 // the offending value
	Iter     int     // iteration (0 for the start point)
}

func (e *NumberError) Error() string {
	if e.Unknown != "" {
		return fmt.Sprintf("solver: equation '%s': derivative with respect to '%s' is %g at iteration %d, want a finite number",
			e.Equation, e.Unknown, e.Value, e.Iter)
	}
	return fmt.Sprintf("solver: equation '%s': residual is %g at iteration %d, want a finite number", e.Equation, e.Value, e.Iter)
}

// Unwrap lets errors.Is(err, ErrBadNumber) match.
func (e *NumberError) Unwrap() error { return ErrBadNumber }

// SingularError names the equations and unknowns involved in a singular
// (or too ill-conditioned) scaled Jacobian.
type SingularError struct {
	Iter int
	Cond float64 // condition estimate of the scaled Jacobian (+Inf if exactly singular)
	// ZeroUnknowns appear in no equation at this point (zero Jacobian columns).
	ZeroUnknowns []string
	// ZeroEquations depend on no unknown at this point (zero Jacobian rows).
	ZeroEquations []string
	// Unknowns carry the null vector of the scaled Jacobian: a combination
	// of them leaves every residual unchanged to first order.
	Unknowns []string
	// Equations carry the left null vector: a combination of them is
	// (nearly) linearly dependent.
	Equations []string
	// NotDecomposed is set when the Jacobian was too large (order above
	// 1000, with a Pattern) for the singular value decomposition that
	// finds Unknowns and Equations; only the zero rows and columns are
	// named then.
	NotDecomposed bool
}

func (e *SingularError) Error() string {
	var b strings.Builder
	fmt.Fprintf(&b, "solver: singular Jacobian at iteration %d (condition estimate %.3g)", e.Iter, e.Cond)
	if len(e.ZeroUnknowns) > 0 {
		fmt.Fprintf(&b, "; unknowns %s appear in no equation here", quoteList(e.ZeroUnknowns))
	}
	if len(e.ZeroEquations) > 0 {
		fmt.Fprintf(&b, "; equations %s depend on no unknown here", quoteList(e.ZeroEquations))
	}
	if len(e.Equations) > 0 {
		fmt.Fprintf(&b, "; equations %s are (nearly) linearly dependent", quoteList(e.Equations))
	}
	if len(e.Unknowns) > 0 {
		fmt.Fprintf(&b, "; unknowns %s are not determined by them", quoteList(e.Unknowns))
	}
	if e.NotDecomposed {
		b.WriteString("; the system is too large for the decomposition that would name the dependent equations and unknowns")
	}
	return b.String()
}

// Unwrap lets errors.Is(err, ErrSingular) match.
func (e *SingularError) Unwrap() error { return ErrSingular }

func quoteList(names []string) string {
	var b strings.Builder
	for i, n := range names {
		if i > 0 {
			b.WriteString(", ")
		}
		b.WriteByte('\'')
		b.WriteString(n)
		b.WriteByte('\'')
	}
	return b.String()
}

// statusError wraps a detail error with a status sentinel so errors.Is
// matches both.
type statusError struct {
	status Status
	msg    string
	err    error // may be nil
}

func (e *statusError) Error() string {
	if e.err != nil {
		return e.msg + ": " + e.err.Error()
	}
	return e.msg
}

func (e *statusError) Unwrap() []error {
	if e.err != nil {
		return []error{e.status.Err(), e.err}
	}
	return []error{e.status.Err()}
}

// PatternError lists Jacobian entries that are nonzero although the
// Problem's Pattern leaves them out.
type PatternError struct {
	Iter    int
	Entries [][2]string // {equation, unknown} pairs
}

func (e *PatternError) Error() string {
	var b strings.Builder
	fmt.Fprintf(&b, "solver: the Pattern is incomplete (iteration %d): ", e.Iter)
	for k, p := range e.Entries {
		if k == 5 {
			fmt.Fprintf(&b, "; and %d more", len(e.Entries)-5)
			break
		}
		if k > 0 {
			b.WriteString("; ")
		}
		fmt.Fprintf(&b, "equation '%s' depends on unknown '%s'", p[0], p[1])
	}
	return b.String()
}

// Unwrap lets errors.Is(err, ErrInvalidProblem) match.
func (e *PatternError) Unwrap() error { return ErrInvalidProblem }
