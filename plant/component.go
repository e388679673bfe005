package plant

import (
	"fmt"
	"math"
)

// Component is one unit of the plant: a boiler, a pump, a header, a
// consumer. Every kind lives in a file of its own (boiler.go, pump.go, …)
// that holds its type, its constructor, its keys, its equations and their
// partial derivatives, its report and its copy; the plant's compile, solve
// and report code calls components only through this interface and the
// optional hooks below, never by their type.
//
// The methods that take part in the solve are unexported: the components
// of this package are the only implementations. A new kind is one file
// like pump.go plus one line in kinds.go (see DEVELOPERS.md).
type Component interface {
	// Ident is the component's name, unique in its plant, and where it
	// was declared.
	Ident() *Base
	// Kind is the trade name of the component's type ("feed pump").
	Kind() string
	// Ports lists the component's inlets and outlets.
	Ports() []PortSpec
	// Keys lists the parameters the component takes, with their
	// dimensions, defaults and documentation: the one registry that
	// scripts, load cases and the documentation read (keys.go).
	Keys() []Key

	// check adds a fault for each parameter out of range.
	check(fs *faults)
	// assemble registers the component's unknowns and equations and its
	// roles in the plant (a boiler the firing rule dispatches, say).
	assemble(a *assembly, ports portLines)
	// residual writes the component's equations at ev's unknowns, scaled
	// as registered, without allocating.
	residual(ev *eval, r []float64) error
	// jacobian adds the partial derivatives of the component's equations.
	jacobian(ev *eval, j jac) error
	// guess sets the component's outlets from its inlets for the
	// starting point.
	guess(x []float64)
	// report adds the component's figures to the case result and its
	// flows across the plant boundary to the result's balance.
	report(ev *eval, cr *CaseResult) error
	// outline adds the component's entry with no figures to cr: the shape
	// of a result when nothing is solved (a script's check mode).
	outline(cr *CaseResult)
	// clone returns an independent copy for another goroutine, with its
	// parameters (and any model it owns) copied and its links to the
	// plant's layout cleared.
	clone() Component
}

// The optional hooks a component may implement besides Component.
type (
	// linker ties a component to other components' unknowns once every
	// component has registered its own (a consumer driven by a boiler's
	// fuel flow, an economiser on a boiler's flue gas).
	linker interface {
		link(p *Plant, a *assembly, fs *faults)
	}
	// preparer computes what a component needs for a case before the
	// solve: what depends on the case's conditions and parameters but
	// not on the plant's unknowns (a consumer's duty from its model, an
	// exhaust-gas economiser's gas side, a feed pump's discharge
	// pressure).
	preparer interface {
		prepare(p *Plant, c Conditions) error
	}
	// finisher changes the case result after every component has
	// reported (an economiser folds its heat into its boiler's figures).
	finisher interface {
		finish(cr *CaseResult)
	}
)

// Base is what every component has: a name and the place it was declared.
// Components embed it.
type Base struct {
	Name string
	Pos  Pos
}

// Ident returns the component's name and position, to read or to set.
func (b *Base) Ident() *Base { return b }

// portLines are the lines connected to each port of a component, by port
// name.
type portLines map[string][]*Line

// one returns the single line on a port, or nil.
func (pl portLines) one(port string) *Line {
	if ls := pl[port]; len(ls) > 0 {
		return ls[0]
	}
	return nil
}

// assembly collects the unknowns and equations of a plant while its
// components register them, and the components' roles in the firing rule.
type assembly struct {
	varNames []string
	xScale   []float64
	lo, hi   []float64
	x0       []float64

	eqNames []string
	fScale  []float64
	pattern [][]int

	roles roles
}

// roles are the components the plant's firing rule and reports need to
// find: each registers itself in its own assemble.
type roles struct {
	boilers []*Boiler               // dispatched by the firing rule, in declaration order
	dumps   []*Condenser            // take the steam the economisers make beyond demand
	eges    []*ExhaustGasEconomiser // raise steam from the main engine's exhaust
	// economisers heat a boiler's feed with its own flue gas.
	economisers []*Economiser
	// fuelDriven are the steam flows (unknown indices) that follow a
	// boiler's fuel flow: they change with the number of boilers firing.
	fuelDriven []int
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
	for _, j := range deps {
		if j < 0 || containsInt(d, j) {
			continue
		}
		d = append(d, j)
	}
	a.pattern = append(a.pattern, d)
	return len(a.eqNames) - 1
}

// depend adds unknowns to the pattern of a registered equation.
func (a *assembly) depend(eq int, deps ...int) {
	for _, j := range deps {
		if j >= 0 && !containsInt(a.pattern[eq], j) {
			a.pattern[eq] = append(a.pattern[eq], j)
		}
	}
}

func containsInt(list []int, v int) bool {
	for _, x := range list {
		if x == v {
			return true
		}
	}
	return false
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
	// properties the components evaluate are defined.
	minP = 1e3   // Pa
	maxP = 5e7   // Pa
	minH = 1e3   // J/kg, about 0.2 °C
	maxH = 4.0e6 // J/kg, steam near 550 °C at low pressure

	// epsFlow regularises mixing equations so that a junction without flow
	// keeps a defined enthalpy. It is far below any flow of interest.
	epsFlow = 1e-9 // kg/s
)

// eval is what a component sees while the plant is evaluated: the current
// unknowns and the conditions of the case.
type eval struct {
	x    []float64
	cond Conditions
	pl   *Plant
}

func (ev *eval) m(l *Line) float64 { return ev.x[l.mIdx()] }
func (ev *eval) p(l *Line) float64 { return ev.x[l.pIdx()] }
func (ev *eval) h(l *Line) float64 { return ev.x[l.hIdx()] }

// ComponentError is a failure inside one component: a property out of
// range, a bad parameter met during the solve, a residual that is not a
// number.
type ComponentError struct {
	Name string // the component's
	Kind string
	Pos  Pos
	Err  error
}

func (e *ComponentError) Error() string {
	pre := ""
	if s := e.Pos.String(); s != "" {
		pre = s + ": "
	}
	return fmt.Sprintf("%s%s %q: %v", pre, e.Kind, e.Name, e.Err)
}

func (e *ComponentError) Unwrap() error { return e.Err }

func compErr(c Component, format string, args ...any) error {
	b := c.Ident()
	return &ComponentError{Name: b.Name, Kind: c.Kind(), Pos: b.Pos, Err: fmt.Errorf(format, args...)}
}

func wrapErr(c Component, err error) error {
	if err == nil {
		return nil
	}
	b := c.Ident()
	return &ComponentError{Name: b.Name, Kind: c.Kind(), Pos: b.Pos, Err: err}
}

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// Conditions are the surroundings of a load case.
type Conditions struct {
	SeaT       float64 // sea water temperature, K
	AirT       float64 // outside air temperature, K
	EngineLoad float64 // main engine load, fraction of its MCR
	// Period is the length of the row a case stands for (s), given by a
	// voyage whose tanks carry their temperature from row to row; zero in
	// a single load case.
	Period float64
}
