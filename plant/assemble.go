package plant

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/mat"
)

// Unit is one component of the plant. The units of this package are the
// only implementations: each adds its unknowns and equations to the plant's
// system and reports its own figures.
type Unit interface {
	// UnitName is the unit's name, unique in its plant.
	UnitName() string
	// Kind is the trade name of the unit's type ("feed pump").
	Kind() string
	// Position is where the unit was declared.
	Position() Pos
	// Ports lists the unit's inlets and outlets.
	Ports() []PortSpec

	check(fs *faults)
	assemble(a *assembly, ports map[string][]*Line)
	residual(ev *eval, r []float64) error
	jacobian(ev *eval, j *mat.Dense) error
	guess(x []float64)
	report(ev *eval, cr *CaseResult) error
	param(name string) (*float64, error)
	clone() Unit
}

// UnitBase holds what every unit has: a name and the place it was declared.
type UnitBase struct {
	Name string
	Pos  Pos
}

// UnitName returns the unit's name.
func (u *UnitBase) UnitName() string { return u.Name }

// Position returns where the unit was declared.
func (u *UnitBase) Position() Pos { return u.Pos }

// assembly collects the unknowns and equations of a plant while its units
// register them.
type assembly struct {
	varNames []string
	xScale   []float64
	lo, hi   []float64
	x0       []float64

	eqNames []string
	fScale  []float64
	pattern [][]int
}

// variable registers one unknown and returns its index.
func (a *assembly) variable(name string, scale, lo, hi, guess float64) int {
	a.varNames = append(a.varNames, name)
	a.xScale = append(a.xScale, scale)
	a.lo = append(a.lo, lo)
	a.hi = append(a.hi, hi)
	a.x0 = append(a.x0, guess)
	return len(a.varNames) - 1
}

// equation registers one equation depending on the given unknowns and
// returns its index.
func (a *assembly) equation(name string, scale float64, deps ...int) int {
	a.eqNames = append(a.eqNames, name)
	a.fScale = append(a.fScale, scale)
	d := make([]int, 0, len(deps))
	seen := map[int]bool{}
	for _, j := range deps {
		if j < 0 || seen[j] {
			continue
		}
		seen[j] = true
		d = append(d, j)
	}
	a.pattern = append(a.pattern, d)
	return len(a.eqNames) - 1
}

// lineDeps lists the unknowns of the given lines.
func lineDeps(ls ...*Line) []int {
	d := make([]int, 0, 3*len(ls))
	for _, l := range ls {
		if l == nil {
			continue
		}
		d = append(d, l.mIdx(), l.pIdx(), l.hIdx())
	}
	return d
}

// Scales of the unknowns and equations. The solver works on x/scale, so
// these set the balance between flows (~1 kg/s), pressures (~1 MPa) and
// enthalpies (~1 MJ/kg).
const (
	scaleP = 1e6 // Pa
	scaleH = 1e6 // J/kg
	scaleQ = 1e6 // W

	// Bounds that keep every iterate inside the range where the IF97
	// properties the units evaluate are defined.
	minP = 1e3   // Pa
	maxP = 5e7   // Pa
	minH = 1e3   // J/kg, about 0.2 °C
	maxH = 4.0e6 // J/kg, steam near 550 °C at low pressure

	// epsFlow regularises mixing equations so that a junction without flow
	// keeps a defined enthalpy. It is far below any flow of interest.
	epsFlow = 1e-9 // kg/s
)

// eval is what a unit sees while the plant is evaluated: the current
// unknowns and the conditions of the case.
type eval struct {
	x    []float64
	cond Conditions
	pl   *Plant
	disp *dispatchState
}

func (ev *eval) m(l *Line) float64 { return ev.x[l.mIdx()] }
func (ev *eval) p(l *Line) float64 { return ev.x[l.pIdx()] }
func (ev *eval) h(l *Line) float64 { return ev.x[l.hIdx()] }

// UnitError is a failure inside one unit: a property out of range, a bad
// parameter met during the solve, a residual that is not a number.
type UnitError struct {
	Unit string
	Kind string
	Pos  Pos
	Err  error
}

func (e *UnitError) Error() string {
	pre := ""
	if s := e.Pos.String(); s != "" {
		pre = s + ": "
	}
	return fmt.Sprintf("%s%s %q: %v", pre, e.Kind, e.Unit, e.Err)
}

func (e *UnitError) Unwrap() error { return e.Err }

func unitErr(u Unit, format string, args ...any) error {
	return &UnitError{Unit: u.UnitName(), Kind: u.Kind(), Pos: u.Position(), Err: fmt.Errorf(format, args...)}
}

func wrapUnitErr(u Unit, err error) error {
	if err == nil {
		return nil
	}
	return &UnitError{Unit: u.UnitName(), Kind: u.Kind(), Pos: u.Position(), Err: err}
}

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }
