package plant

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"github.com/rs/zerolog"

	"steamcase/solver"
)

// Sharing is the rule by which firing boilers share the demand.
type Sharing int

// Sharing rules.
const (
	// EqualLoad runs every firing boiler at the same fraction of its MCR.
	EqualLoad Sharing = iota
	// LeadLag runs the lead boiler (the first declared that fires) at
	// Options.LeadLoad of its MCR and shares the rest equally among the
	// others.
	LeadLag
)

func (s Sharing) String() string {
	switch s {
	case EqualLoad:
		return "equal load"
	case LeadLag:
		return "lead-lag"
	}
	return fmt.Sprintf("Sharing(%d)", int(s))
}

// Options are the plant-wide settings. Zero values mean the documented
// defaults.
type Options struct {
	// AmbientPressure is the pressure that gauge figures refer to, Pa.
	// Zero means 101325 Pa.
	AmbientPressure float64
	// UsableFraction is the fraction of one boiler's MCR up to which one
	// boiler carries the demand before the next must fire. Zero means 0.85
	// (85-90 % is common practice, no source).
	UsableFraction float64
	// Sharing is how firing boilers share the demand (zero: EqualLoad).
	Sharing Sharing
	// LeadLoad is the lead boiler's load fraction under LeadLag (zero: 0.8).
	LeadLoad float64
	// FeedSuctionMaxT is the feed tank temperature above which the feed
	// pump's suction is warned about, K. Zero means 363.15 K (90 °C, common
	// practice, no source).
	FeedSuctionMaxT float64
	// Logger receives debug records of the solves; zero value: no logging.
	Logger zerolog.Logger
	// Solver settings; nil means the solver's defaults.
	Solver *solver.Settings
	// NoEGESaving skips the second solve of each case without its
	// exhaust-gas economisers that gives the fuel they save.
	NoEGESaving bool
	// FiniteDifferences makes the solver form the Jacobian by its own
	// coloured finite differences instead of the plant's analytic partial
	// derivatives (jacobian.go): a fallback and a check.
	FiniteDifferences bool
}

func (o *Options) defaults() {
	if o.AmbientPressure == 0 {
		o.AmbientPressure = 101325
	}
	if o.UsableFraction == 0 {
		o.UsableFraction = 0.85
	}
	if o.LeadLoad == 0 {
		o.LeadLoad = 0.8
	}
	if o.FeedSuctionMaxT == 0 {
		o.FeedSuctionMaxT = 363.15
	}
}

// Plant is a steam plant: units joined by lines. Build it with Add and
// Connect, then Solve load cases. A Plant is not safe for concurrent use.
type Plant struct {
	Name string
	Pos  Pos
	Opt  Options

	units  []Unit
	byName map[string]Unit
	lines  []*Line

	compiled bool
	asm      *assembly
	ports    map[string]map[string][]*Line // unit -> port -> lines
	boilers  []*Boiler
	dumps    []*Condenser
	disp     dispatchState
	dispEqs  []int
	slv      *solver.Solver
	prob     solver.Problem
	last     []float64 // last converged unknowns, for warm starts
	x0       []float64 // starting point scratch
	lastCopy []float64
	// hint is how many boilers fired in the last case, where the firing
	// decision of the next starts; keep* hold a solution during a trial.
	hint       int
	hintSet    bool
	keepX      []float64
	keepRes    solver.Result
	keepSolves int
	slvRes     solver.Result
	solves     int
	ev         eval
}

// New returns an empty plant.
func New(name string, opt Options) *Plant {
	opt.defaults()
	return &Plant{Name: name, Opt: opt, byName: map[string]Unit{}}
}

// Add adds a unit. It fails if the name is empty or taken.
func (p *Plant) Add(u Unit) error {
	name := u.UnitName()
	if name == "" {
		return fmt.Errorf("%s: %s without a name", u.Position(), u.Kind())
	}
	if old, ok := p.byName[name]; ok {
		return &GraphError{Faults: []Fault{{Pos: u.Position(), Unit: name,
			Msg: fmt.Sprintf("name already used by the %s declared at %s", old.Kind(), old.Position())}}}
	}
	p.units = append(p.units, u)
	p.byName[name] = u
	p.compiled = false
	return nil
}

// Connect joins outlet port fromPort of unit from to inlet port toPort of
// unit to with a line called name. Faults in the connection are reported
// by Check, all at once.
func (p *Plant) Connect(name string, pos Pos, from, fromPort, to, toPort string) *Line {
	l := &Line{Name: name, Pos: pos, From: from, FromPort: fromPort, To: to, ToPort: toPort}
	p.lines = append(p.lines, l)
	p.compiled = false
	return l
}

// Unit returns the unit called name, or nil.
func (p *Plant) Unit(name string) Unit { return p.byName[name] }

// Units returns the plant's units in declaration order.
func (p *Plant) Units() []Unit { return p.units }

// Lines returns the plant's lines in declaration order.
func (p *Plant) Lines() []*Line { return p.lines }

// Check validates the plant without solving: every port connected as its
// kind requires, media matching, parameters in range, and the degrees of
// freedom balanced by a structural analysis of the equations. It lists
// every fault it finds.
func (p *Plant) Check() error {
	return p.compile()
}

func (p *Plant) compile() error {
	if p.compiled {
		return nil
	}
	var fs faults
	if len(p.units) == 0 {
		fs.add(p.Pos, "", "", "plant %q has no units", p.Name)
		return fs.err()
	}
	lineNames := map[string]*Line{}
	ports := map[string]map[string][]*Line{}
	for _, u := range p.units {
		ports[u.UnitName()] = map[string][]*Line{}
		u.check(&fs)
	}
	spec := func(u Unit, port string) (PortSpec, bool) {
		for _, s := range u.Ports() {
			if s.Name == port {
				return s, true
			}
		}
		return PortSpec{}, false
	}
	portNames := func(u Unit, d Direction) []string {
		var ns []string
		for _, s := range u.Ports() {
			if s.Dir == d {
				ns = append(ns, s.Name)
			}
		}
		return ns
	}
	for _, l := range p.lines {
		if l.Name == "" {
			fs.add(l.Pos, "", "", "a line without a name (from %q to %q)", l.From, l.To)
			continue
		}
		if old, ok := lineNames[l.Name]; ok {
			fs.add(l.Pos, "", l.Name, "line name already used at %s", old.Pos)
			continue
		}
		lineNames[l.Name] = l
		ok := true
		var fromSpec, toSpec PortSpec
		fu, found := p.byName[l.From]
		if !found {
			fs.add(l.Pos, l.From, l.Name, "no unit called %q to leave from", l.From)
			ok = false
		} else if s, has := spec(fu, l.FromPort); !has || s.Dir != Out {
			fs.add(l.Pos, l.From, l.Name, "%s %q has no outlet %q; its outlets are %q", fu.Kind(), l.From, l.FromPort, portNames(fu, Out))
			ok = false
		} else {
			fromSpec = s
		}
		tu, found := p.byName[l.To]
		if !found {
			fs.add(l.Pos, l.To, l.Name, "no unit called %q to enter", l.To)
			ok = false
		} else if s, has := spec(tu, l.ToPort); !has || s.Dir != In {
			fs.add(l.Pos, l.To, l.Name, "%s %q has no inlet %q; its inlets are %q", tu.Kind(), l.To, l.ToPort, portNames(tu, In))
			ok = false
		} else {
			toSpec = s
		}
		if !ok {
			continue
		}
		if fromSpec.Medium != toSpec.Medium {
			fs.add(l.Pos, l.To, l.Name, "media do not match: %s outlet %q of %q carries %s, inlet %q of %q takes %s",
				fu.Kind(), l.FromPort, l.From, fromSpec.Medium, l.ToPort, l.To, toSpec.Medium)
			continue
		}
		l.medium = fromSpec.Medium
		ports[l.From][l.FromPort] = append(ports[l.From][l.FromPort], l)
		ports[l.To][l.ToPort] = append(ports[l.To][l.ToPort], l)
	}
	for _, u := range p.units {
		for _, s := range u.Ports() {
			n := len(ports[u.UnitName()][s.Name])
			switch {
			case n == 0 && !s.Optional:
				fs.add(u.Position(), u.UnitName(), "", "%s %q is not connected", s.Dir, s.Name)
			case n > 1 && !s.Multi:
				var names []string
				for _, l := range ports[u.UnitName()][s.Name] {
					names = append(names, l.Name)
				}
				fs.add(u.Position(), u.UnitName(), "", "%s %q takes one line, but %d are connected: %q", s.Dir, s.Name, n, names)
			}
		}
	}
	if err := fs.err(); err != nil {
		return err
	}

	// Lay out the unknowns: three per line, then each unit's own.
	a := &assembly{}
	for _, l := range p.lines {
		if l.medium != WaterSteam {
			continue
		}
		l.idx = a.variable("line "+l.Name+" mass flow", 1, 0, math.Inf(1), 1)
		a.variable("line "+l.Name+" pressure", scaleP, minP, maxP, 1e6)
		a.variable("line "+l.Name+" enthalpy", scaleH, minH, maxH, 1e6)
	}
	p.boilers = p.boilers[:0]
	p.dumps = p.dumps[:0]
	for _, u := range p.units {
		u.assemble(a, ports[u.UnitName()])
		switch v := u.(type) {
		case *Boiler:
			p.boilers = append(p.boilers, v)
		case *Condenser:
			if v.Dump {
				p.dumps = append(p.dumps, v)
			}
		}
	}
	for _, u := range p.units {
		switch v := u.(type) {
		case *Consumer:
			v.link(p, a, &fs)
		case *Economiser:
			v.link(p, a, &fs)
		}
	}
	if err := fs.err(); err != nil {
		return err
	}
	p.assembleDispatch(a)
	p.asm = a
	p.ports = ports

	p.prob = solver.Problem{
		Dim:      len(a.varNames),
		XScale:   a.xScale,
		FScale:   a.fScale,
		Pattern:  a.pattern,
		Lower:    a.lo,
		Upper:    a.hi,
		VarNames: a.varNames,
		EqNames:  a.eqNames,
	}
	st, err := solver.DiagnoseIncidence(len(a.eqNames), len(a.varNames), a.pattern, a.eqNames, a.varNames)
	if err != nil {
		return p.structureErr(err)
	}
	if err := st.Err(); err != nil {
		return p.structureErr(err)
	}
	var pumpFaults faults
	for _, u := range p.units {
		if fp, ok := u.(*FeedPump); ok {
			if err := fp.resolve(p); err != nil {
				pumpFaults.add(fp.Pos, fp.Name, "", "%v", err.(*UnitError).Err)
			}
		}
	}
	if err := pumpFaults.err(); err != nil {
		return err
	}
	p.prob.Residual = p.residual
	if !p.Opt.FiniteDifferences {
		p.prob.Jacobian = p.jacobian
	}
	slv, err := solver.New(p.prob, p.solverSettings())
	if err != nil {
		return err
	}
	p.slv = slv
	p.compiled = true
	p.last = nil
	return nil
}

// structureErr turns the solver's structural diagnosis into a plant fault.
func (p *Plant) structureErr(err error) error {
	if errors.Is(err, solver.ErrStructure) {
		msg := strings.TrimPrefix(err.Error(), "solver: ")
		return &GraphError{Faults: []Fault{{Pos: p.Pos, Msg: "degrees of freedom do not balance: " + msg}}}
	}
	return err
}

// guess fills x with a starting point: each unit sets its outlets from its
// inlets, a few passes round the graph.
func (p *Plant) guess(x []float64) {
	copy(x, p.asm.x0)
	for pass := 0; pass < 4; pass++ {
		for _, u := range p.units {
			u.guess(x)
		}
	}
}
