package plant

import (
	"fmt"
	"math"

	"github.com/rs/zerolog"

	"steamcase/solver"
)

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
	// NoLineStates leaves the state of every line out of each case's
	// report (CaseResult.Lines empty), for jobs that keep the totals of
	// many cases and not their lines (an audit's samples): the lines' IF97
	// temperatures are a tenth of a report's work. Nothing else in the
	// report depends on them. A line whose state IF97 cannot give fails
	// the case's report with it and passes without.
	NoLineStates bool
	// NoContingencies skips the N-1 answers of each case (contingency.go):
	// the largest firing boiler tripping, each exhaust-gas economiser out,
	// and the Contingencies listed; for speed.
	NoContingencies bool
	// Contingencies are failures to answer besides the automatic ones:
	// each the boilers and exhaust-gas economisers lost together. The
	// slice is only read.
	Contingencies []Contingency
	// InertGasO2Max is the highest O2 in the dry flue gas an inert-gas
	// source may deliver, a mole fraction; zero means 0.05 (5 % by volume:
	// the figure of SOLAS II-2 reg. 4.5.5 and the FSS Code ch. 15, from
	// memory). InertGasCapacity is the inert gas the sources must deliver
	// as a fraction of the running cargo pumps' rate; zero means 1.25
	// (125 %, the FSS Code ch. 15 figure, from memory).
	InertGasO2Max, InertGasCapacity float64
	// FiniteDifferences makes the solver form the Jacobian by its own
	// coloured finite differences instead of the components' analytic
	// partial derivatives: a fallback and a check.
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
	if o.InertGasO2Max == 0 {
		o.InertGasO2Max = 0.05
	}
	if o.InertGasCapacity == 0 {
		o.InertGasCapacity = 1.25
	}
}

// check adds a fault for each option out of its range.
func (o *Options) check(fs *faults, pos Pos) {
	if !(o.AmbientPressure >= 5e4 && o.AmbientPressure <= 1.5e5) {
		fs.add(pos, "", "", "the ambient pressure must lie between 0.5 and 1.5 bar(a); got %g Pa", o.AmbientPressure)
	}
	if !(o.UsableFraction >= 0.5 && o.UsableFraction <= 1) {
		fs.add(pos, "", "", "the usable fraction of a boiler's MCR must lie between 50 %% and 100 %%; got %g %%", 100*o.UsableFraction)
	}
	if !(o.LeadLoad > 0 && o.LeadLoad <= 1) {
		fs.add(pos, "", "", "the lead boiler's load must lie above 0 %% and at most 100 %% of its MCR; got %g %%", 100*o.LeadLoad)
	}
	if !(o.FeedSuctionMaxT > 273.15 && o.FeedSuctionMaxT < 423.15) {
		fs.add(pos, "", "", "the feed suction's warning temperature must lie between 0 and 150 °C; got %g K", o.FeedSuctionMaxT)
	}
}

// Plant is a steam plant: components joined by lines. Build it with Add
// and Connect, then Solve load cases. A Plant is not safe for concurrent
// use; Clone gives a copy for another goroutine.
//
// The Plant holds the description. What the solves need and keep (the
// compiled system, the solver, the warm start) is in its session, made by
// the first Check or Solve and discarded when the description changes.
type Plant struct {
	Name string
	Pos  Pos
	Opt  Options

	comps  []Component
	byName map[string]Component
	lines  []*Line

	s *session // nil until compiled
}

// New returns an empty plant.
func New(name string, opt Options) *Plant {
	opt.defaults()
	return &Plant{Name: name, Opt: opt, byName: map[string]Component{}}
}

// Add adds a component. It fails if the name is empty or taken.
func (p *Plant) Add(c Component) error {
	b := c.Ident()
	if b.Name == "" {
		return fmt.Errorf("%s: %s without a name", b.Pos, c.Kind())
	}
	if old, ok := p.byName[b.Name]; ok {
		return &GraphError{Faults: []Fault{{Pos: b.Pos, Unit: b.Name,
			Msg: fmt.Sprintf("name already used by the %s declared at %s", old.Kind(), old.Ident().Pos)}}}
	}
	p.comps = append(p.comps, c)
	p.byName[b.Name] = c
	p.s = nil
	return nil
}

// Connect joins outlet port fromPort of component from to inlet port
// toPort of component to with a line called name. Faults in the connection
// are reported by Check, all at once.
func (p *Plant) Connect(name string, pos Pos, from, fromPort, to, toPort string) *Line {
	l := &Line{Name: name, Pos: pos, From: from, FromPort: fromPort, To: to, ToPort: toPort}
	p.lines = append(p.lines, l)
	p.s = nil
	return l
}

// Component returns the component called name, or nil.
func (p *Plant) Component(name string) Component { return p.byName[name] }

// Components returns the plant's components in declaration order.
func (p *Plant) Components() []Component { return p.comps }

// Lines returns the plant's lines in declaration order.
func (p *Plant) Lines() []*Line { return p.lines }

// Clone returns an independent copy of the plant: the same components
// with the same parameters (their duty models copied too) and the same
// lines, ready to solve in another goroutine. Efficiency models and fuels
// are shared: the plant package never changes them while it solves.
func (p *Plant) Clone() *Plant {
	c := New(p.Name, p.Opt)
	c.Pos = p.Pos
	for _, u := range p.comps {
		// Add cannot fail: the names were unique in p.
		_ = c.Add(u.clone())
	}
	for _, l := range p.lines {
		c.Connect(l.Name, l.Pos, l.From, l.FromPort, l.To, l.ToPort)
	}
	return c
}

// Check validates the plant without solving: every port connected as its
// kind requires, media matching, parameters in range, and the degrees of
// freedom balanced by a structural analysis of the equations. It lists
// every fault it finds.
func (p *Plant) Check() error {
	return p.compile()
}

// compile checks the description and builds the session: the lines on
// each port, the unknowns and equations, the structural diagnosis and the
// solver.
func (p *Plant) compile() error {
	if p.s != nil {
		return nil
	}
	var fs faults
	if len(p.comps) == 0 {
		fs.add(p.Pos, "", "", "plant %q has no units", p.Name)
		return fs.err()
	}
	p.Opt.check(&fs, p.Pos)
	for _, c := range p.comps {
		c.check(&fs)
	}
	p.checkContingencies(&fs)
	p.checkInertGas(&fs)
	if p.Opt.Sharing == LeastFuel {
		n := 0
		for _, c := range p.comps {
			if _, ok := c.(*Boiler); ok {
				n++
			}
		}
		if n > MaxLeastFuelBoilers {
			fs.add(p.Pos, "", "", "least-fuel sharing tries every set of boilers, for at most %d; this plant has %d: share equally or lead-lag", MaxLeastFuelBoilers, n)
		}
	}
	ports := p.connect(&fs)
	if err := fs.err(); err != nil {
		return err
	}
	a := p.layout(ports, &fs)
	if err := fs.err(); err != nil {
		return err
	}
	p.checkPressures(&fs)
	if err := fs.err(); err != nil {
		return err
	}
	s := &session{asm: a, ports: ports}
	s.assembleDispatch(a, p.comps)
	st, err := solver.DiagnoseIncidence(len(a.eqNames), len(a.varNames), a.pattern, a.eqNames, a.varNames)
	if err == nil {
		err = st.Err()
	}
	if err != nil {
		return p.structureErr(err)
	}
	if err := p.newSolver(s); err != nil {
		return err
	}
	p.s = s
	return nil
}

// connect checks every line against the ports it names and returns the
// lines on each component's ports.
func (p *Plant) connect(fs *faults) map[string]portLines {
	lineNames := map[string]*Line{}
	ports := map[string]portLines{}
	for _, c := range p.comps {
		ports[c.Ident().Name] = portLines{}
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
		fromSpec, ok1 := p.endSpec(fs, l, l.From, l.FromPort, Out)
		toSpec, ok2 := p.endSpec(fs, l, l.To, l.ToPort, In)
		if !ok1 || !ok2 {
			continue
		}
		if fromSpec.Medium != toSpec.Medium {
			fu := p.byName[l.From]
			fs.add(l.Pos, l.To, l.Name, "media do not match: %s outlet %q of %q carries %s, inlet %q of %q takes %s",
				fu.Kind(), l.FromPort, l.From, fromSpec.Medium, l.ToPort, l.To, toSpec.Medium)
			continue
		}
		l.medium = fromSpec.Medium
		ports[l.From][l.FromPort] = append(ports[l.From][l.FromPort], l)
		ports[l.To][l.ToPort] = append(ports[l.To][l.ToPort], l)
	}
	for _, c := range p.comps {
		b := c.Ident()
		for _, s := range c.Ports() {
			n := len(ports[b.Name][s.Name])
			switch {
			case n == 0 && !s.Optional:
				fs.add(b.Pos, b.Name, "", "%s %q is not connected", s.Dir, s.Name)
			case n > 1 && !s.Multi:
				var names []string
				for _, l := range ports[b.Name][s.Name] {
					names = append(names, l.Name)
				}
				fs.add(b.Pos, b.Name, "", "%s %q takes one line, but %d are connected: %q", s.Dir, s.Name, n, names)
			}
		}
	}
	return ports
}

// endSpec finds the port one end of a line names, adding a fault when the
// component or the port does not exist.
func (p *Plant) endSpec(fs *faults, l *Line, unit, port string, dir Direction) (PortSpec, bool) {
	c, found := p.byName[unit]
	if !found {
		if dir == Out {
			fs.add(l.Pos, unit, l.Name, "no unit called %q to leave from", unit)
		} else {
			fs.add(l.Pos, unit, l.Name, "no unit called %q to enter", unit)
		}
		return PortSpec{}, false
	}
	for _, s := range c.Ports() {
		if s.Name == port && s.Dir == dir {
			return s, true
		}
	}
	var names []string
	for _, s := range c.Ports() {
		if s.Dir == dir {
			names = append(names, s.Name)
		}
	}
	if dir == Out {
		fs.add(l.Pos, unit, l.Name, "%s %q has no outlet %q; its outlets are %q", c.Kind(), unit, port, names)
	} else {
		fs.add(l.Pos, unit, l.Name, "%s %q has no inlet %q; its inlets are %q", c.Kind(), unit, port, names)
	}
	return PortSpec{}, false
}

// layout registers the unknowns and equations: three unknowns per
// water/steam line, then each component's own, then the links between
// components.
func (p *Plant) layout(ports map[string]portLines, fs *faults) *assembly {
	a := &assembly{}
	for _, l := range p.lines {
		if l.medium != WaterSteam {
			continue
		}
		l.idx = a.variable("line "+l.Name+" mass flow", 1, 0, math.Inf(1), 1)
		a.variable("line "+l.Name+" pressure", scaleP, minP, maxP, 1e6)
		a.variable("line "+l.Name+" enthalpy", scaleH, minH, maxH, 1e6)
	}
	for _, c := range p.comps {
		c.assemble(a, ports[c.Ident().Name])
	}
	for _, c := range p.comps {
		if l, ok := c.(linker); ok {
			l.link(p, a, fs)
		}
	}
	return a
}

// newSolver makes the session's solver problem and solver.
func (p *Plant) newSolver(s *session) error {
	a := s.asm
	s.prob = solver.Problem{
		Dim:      len(a.varNames),
		XScale:   a.xScale,
		FScale:   a.fScale,
		Pattern:  a.pattern,
		Lower:    a.lo,
		Upper:    a.hi,
		VarNames: a.varNames,
		EqNames:  a.eqNames,
		Residual: p.residual,
	}
	if !p.Opt.FiniteDifferences {
		s.prob.SparseJacobian = p.jacobian
		s.jac = newJac()
	}
	set := p.solverSettings()
	s.lus, _ = set.Factorizer.(*luSet)
	slv, err := solver.New(s.prob, set)
	if err != nil {
		return err
	}
	s.slv = slv
	return nil
}

func (p *Plant) solverSettings() *solver.Settings {
	s := solver.Settings{}
	if p.Opt.Solver != nil {
		s = *p.Opt.Solver
	} else {
		// A case begins on the factorisation of the last case solved in
		// its firing configuration (solver.Settings.ChordStart): the
		// hours of a voyage are near each other, and most then need no
		// Jacobian. ColdStart forgets it.
		s.ChordStart = true
	}
	s.SkipDiagnosis = true // compile has diagnosed the structure
	if s.Recorder == nil {
		// The watch reads the iterates, not the condition.
		s.RecordBound = true
	}
	s.Recorder = &stallWatch{p: p, next: s.Recorder}
	if s.Factorizer == nil {
		// A plant's Jacobian is sparse (each equation touches a few
		// lines): the sparse LU is several times faster than the dense
		// one at a plant's size, and a minimum-degree column order on the
		// pattern keeps its fill and its symbolic work small. Each plant
		// (and clone) has its own, one per firing configuration
		// (lucache.go).
		s.Factorizer = newLUSet()
	}
	return &s
}

// guess fills x with a starting point: each component sets its outlets
// from its inlets, a few passes round the graph.
func (p *Plant) guess(x []float64) {
	copy(x, p.s.asm.x0)
	for pass := 0; pass < 4; pass++ {
		for _, c := range p.comps {
			c.guess(x)
		}
	}
}

// economiserOf returns the flue-gas economiser on boiler b's gas, or nil.
func (p *Plant) economiserOf(b *Boiler) *Economiser {
	for _, e := range p.s.asm.roles.economisers {
		if e.b == b {
			return e
		}
	}
	return nil
}
