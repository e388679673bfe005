package plant

import (
	"context"
	"errors"
	"fmt"
	"math"
	"steamcase/plant/units"

	"steamcase/solver"
)

// Case is one load case: the surroundings, the parameters of components
// that differ from the plant's (a consumer's duty, a turbine's power, a
// component switched off), and optionally which boilers must fire.
type Case struct {
	Name string
	// Series groups cases a script solves as one sweep (a sea temperature
	// from 0 to 30 °C, say): the report shows them as one table.
	Series     string
	Pos        Pos
	Conditions Conditions
	Set        []Setting
	// Fire, if not nil, names the boilers that must fire; the others stay
	// cold. Nil lets the plant decide by its firing rule.
	Fire []string
}

// Setting changes one parameter of one component for a case: Param is the
// name of one of the component's keys that a case may set (Key.Case), and
// Value its value in SI (1 or 0 for a flag, the index of a choice), or
// Text its value for a text key (a boiler's fuel grade).
type Setting struct {
	Unit  string
	Param string
	Value float64
	Text  string
	Pos   Pos
}

// session is the solve-time state of a compiled plant, apart from its
// description: the system the components registered, the solver and its
// problem, the firing configuration being solved, the last solution (the
// next case's warm start) and the scratch of the firing rule's trials.
type session struct {
	asm   *assembly
	ports map[string]portLines

	dispEqs   []int
	fire      []bool    // per boiler of asm.roles.boilers
	firingBuf []*Boiler // scratch for the firing list

	// The shedding (priority.go): the shed level's unknown and equation
	// (−1 without boilers and dump condensers), the components it may
	// reduce and, for the case, how many distinct priorities they have.
	// noShed holds the shed level at zero in the solve in hand (the
	// firing rule's trials, and a case that shedding cannot carry);
	// shedFailed says that shedding everything that may be reduced was
	// not enough for the solution in hand.
	shedIdx, shedEq int
	shedders        []shedder
	nRanks          int
	noShed          bool
	shedFailed      bool
	// shares, if not nil, are the boilers' shares of the firing boilers'
	// steam (least-fuel sharing tries them); equalShare makes a lead-lag
	// plant share equally (its fallback, and the contingencies).
	shares     []float64
	equalShare bool

	// Scratch of the contingencies: the case's solution and firing, and a
	// contingency's firing set and the boilers it starts.
	n1Base            []float64
	n1BaseFire        []bool
	n1Fire, n1Started []bool

	prob   solver.Problem
	slv    *solver.Solver
	slvRes solver.Result
	solves int // configurations solved for the present case
	// newton counts the Newton iterations of every solve of the present
	// case, failed and repeated ones included.
	newton int
	// carried counts the steps of every solve of the present case on the
	// factorisation of an earlier case (solver.Stats.Carried).
	carried int

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
	keepNoShed bool

	ev  eval
	jac jac // the Jacobian's remembered entry places
	// nUnits and nConsumers are the lengths of the last report's lists.
	nUnits, nConsumers int
	// undo lists the parameters the case in hand changed (applySettings).
	undo []undoSetting
	// lus is the solver's Factorizer when the plant chose it (nil when
	// Options.Solver gives one): one sparse LU per firing configuration.
	lus   *luSet
	trend trend
}

// domainErr marks a component's failure while the solver explores: the
// solver shortens a line-search step that meets it and reports it
// otherwise.
type domainErr struct{ err error }

func (e domainErr) Error() string        { return e.err.Error() }
func (e domainErr) Unwrap() error        { return e.err }
func (e domainErr) Is(target error) bool { return target == solver.ErrDomain }

// residual evaluates every component's equations and the dispatch
// equations: the solver's Problem.Residual.
func (p *Plant) residual(r, x []float64) error {
	ev := &p.s.ev
	ev.x = x
	for _, c := range p.comps {
		if err := c.residual(ev, r); err != nil {
			return domainErr{err}
		}
	}
	p.dispatchResidual(x, r)
	return nil
}

// solveConfig solves the plant with the boilers in fire firing, starting
// from the last converged point when there is one (the first solve of a
// case from the trend of the last cases, when it has one, and from the
// last point if that fails other than by a firing boiler held at zero),
// and from the plant's guess if that fails.
func (p *Plant) solveConfig(ctx context.Context, fire []bool) error {
	s := p.s
	copy(s.fire, fire)
	if s.x0 == nil {
		s.x0 = make([]float64, s.prob.Dim)
	}
	warm := s.last != nil
	pred := warm && s.trend.usePred
	s.trend.usePred = false
	if s.lus != nil {
		s.lus.use(s.configKey(p.Opt.Sharing == LeadLag))
	}
	solve := func(x0 []float64) (*solver.Result, error) {
		if x0 == nil {
			p.guess(s.x0)
		} else {
			copy(s.x0, x0)
		}
		if s.noShed && s.shedIdx >= 0 {
			s.x0[s.shedIdx] = 0
		}
		res, err := s.slv.Solve(ctx, s.x0)
		s.newton += res.Stats.Iterations
		s.carried += res.Stats.Carried
		return res, err
	}
	var res *solver.Result
	var err error
	switch {
	case pred:
		res, err = solve(s.trend.pred)
		var zero *firedAtZeroError
		if err != nil && ctx.Err() == nil && !errors.As(err, &zero) {
			// Not the sign of a configuration without a solution (a
			// firing boiler held at zero steam): from the last point.
			res, err = solve(s.last)
		}
	case warm:
		res, err = solve(s.last)
	default:
		res, err = solve(nil)
	}
	if err != nil && warm && ctx.Err() == nil {
		res, err = solve(nil)
	}
	s.slvRes = *res
	if err != nil {
		return err
	}
	if s.last == nil {
		s.last = make([]float64, s.prob.Dim)
	}
	copy(s.last, res.X)
	s.solves++
	return nil
}

// ColdStart forgets the last solution, so that the next case starts from
// the plant's own guess.
func (p *Plant) ColdStart() {
	if p.s != nil {
		p.s.last, p.s.hintSet = nil, false
		p.s.trend.reset()
		if p.s.lus != nil {
			p.s.lus.forget()
		}
	}
}

// undoSetting is one parameter a case changed: the key and its old
// value, or, for a text key, the function that puts back what its setter
// changed.
type undoSetting struct {
	u    Component
	k    *Key
	old  float64
	back func()
}

// applySettings sets the case's parameters through the components' keys,
// checks every component and prepares each for the case. On success the
// caller must call restoreSettings, which puts back the plant's own
// parameters; on failure they are put back already. The old values are
// kept in the session's undo list, reused from case to case.
func (p *Plant) applySettings(c *Case) error {
	s := p.s
	s.undo = s.undo[:0]
	set := func(u Component, k *Key, v float64) {
		old, _ := k.Get(u)
		s.undo = append(s.undo, undoSetting{u: u, k: k, old: old})
		k.Set(u, v)
	}
	setText := func(u Component, k *Key, v string) error {
		back := k.keep(u)
		if err := k.text(u, []string{v}); err != nil {
			back()
			return err
		}
		s.undo = append(s.undo, undoSetting{back: back})
		return nil
	}
	var fs faults
	movesPressure := false
	for _, s := range c.Set {
		u, ok := p.byName[s.Unit]
		if !ok {
			fs.add(s.Pos, s.Unit, "", "case %q sets %q of a unit that the plant does not have", c.Name, s.Param)
			continue
		}
		keys := u.Keys()
		k, ok := findKey(keys, s.Param)
		if !ok || !k.Case || !k.Settable() {
			fs.add(s.Pos, s.Unit, "", "%s", paramMsg(u, s.Param))
			continue
		}
		if k.Kind == KeyText || k.Dim == units.Pressure {
			movesPressure = true
		}
		if k.Kind == KeyText {
			if err := setText(u, k, s.Text); err != nil {
				fs.add(s.Pos, s.Unit, "", "%v", err)
			}
			continue
		}
		if !finite(s.Value) {
			fs.add(s.Pos, s.Unit, "", "%s must be a number; got %g", s.Param, s.Value)
			continue
		}
		set(u, k, s.Value)
		for _, name := range k.Clears {
			if ck, ok := findKey(keys, name); ok {
				set(u, ck, 0)
			}
		}
	}
	for _, u := range p.comps {
		u.check(&fs)
		if pr, ok := u.(preparer); ok {
			if err := pr.prepare(p, c.Conditions); err != nil {
				b := u.Ident()
				var ce *ComponentError
				if errors.As(err, &ce) {
					err = ce.Err
				}
				fs.add(b.Pos, b.Name, "", "%v", err)
			}
		}
	}
	if movesPressure {
		// A case may move the set pressures (a drum, a valve, a text
		// setting that may carry one).
		p.checkPressures(&fs)
	}
	if err := fs.err(); err != nil {
		p.restoreSettings()
		return err
	}
	return nil
}

// restoreSettings puts back, last first, the parameters applySettings
// changed.
func (p *Plant) restoreSettings() {
	s := p.s
	for i := len(s.undo) - 1; i >= 0; i-- {
		if r := s.undo[i]; r.back != nil {
			r.back()
		} else {
			r.k.Set(r.u, r.old)
		}
		s.undo[i] = undoSetting{}
	}
	s.undo = s.undo[:0]
}

// Solve solves one load case: it decides which boilers fire (or takes the
// case's choice), solves the plant's balance, and reports. A case whose
// demand exceeds every boiler's MCR is solved and reported with CanCarry
// false and the shortfall; it is not an error.
func (p *Plant) Solve(ctx context.Context, c Case) (*CaseResult, error) {
	if err := p.compile(); err != nil {
		return nil, err
	}
	if err := p.applySettings(&c); err != nil {
		return nil, err
	}
	defer p.restoreSettings()
	s := p.s
	s.ev = eval{cond: c.Conditions, pl: p}
	s.solves, s.newton, s.carried = 0, 0, 0
	s.trendBegin(&c)

	s.shares, s.equalShare = nil, false
	given := p.rankShedding()

	boilers := s.asm.roles.boilers
	fire := make([]bool, len(boilers))
	forced := c.Fire != nil
	if forced {
		if err := p.forcedFiring(c, fire); err != nil {
			return nil, err
		}
		if err := p.solveShedding(ctx, fire, false); err != nil {
			return nil, p.solveErr(c, err)
		}
		if err := p.forcedOffShort(c, fire); err != nil {
			return nil, err
		}
	} else if err := p.decideShedding(ctx, fire); err != nil {
		return nil, p.solveErr(c, err)
	}
	leadFallback := false
	if p.Opt.Sharing == LeadLag && p.lagOverLimit() {
		// The lead held at its load leaves the others above their limit:
		// share equally instead.
		s.equalShare, leadFallback = true, true
		if err := p.solveShedding(ctx, s.fire, false); err != nil {
			return nil, p.solveErr(c, err)
		}
	}

	var lf *LeastFuelResult
	if !forced && p.Opt.Sharing == LeastFuel {
		var err error
		if lf, err = p.leastFuel(ctx, c); err != nil {
			return nil, p.solveErr(c, err)
		}
	}

	cr := &CaseResult{Name: c.Name, Series: c.Series, Pos: c.Pos, Conditions: c.Conditions, Forced: forced,
		PrioritiesGiven: given, ShedRanks: s.nRanks, LeastFuel: lf}
	if err := p.report(cr, !p.Opt.NoLineStates); err != nil {
		return nil, err
	}
	if leadFallback {
		cr.warn("lead-lag sharing would take the other boilers above their limit with the lead at %.0f %% of its MCR: they share equally", 100*p.Opt.LeadLoad)
	}
	if err := p.inertGas(cr); err != nil {
		return nil, err
	}
	if err := p.contingencies(ctx, c, cr); err != nil {
		return nil, err
	}
	if err := p.egeSaving(ctx, c, cr); err != nil {
		return nil, err
	}
	return cr, nil
}

// decideShedding lets the firing rule decide (its trials with nothing
// shed) and, when all the boilers fire and are short, solves again with
// the demand reduced by priority.
func (p *Plant) decideShedding(ctx context.Context, fire []bool) error {
	s := p.s
	s.noShed, s.shedFailed = true, false
	if err := p.decide(ctx, fire); err != nil {
		return err
	}
	copy(fire, s.fire)
	return p.shedIfOver(ctx, fire)
}

// lagOverLimit says whether a firing boiler raises more than its limit
// while the firing boilers together stay within theirs: what lead-lag
// sharing does when the lead's set load leaves too much to the others.
func (p *Plant) lagOverLimit() bool {
	s := p.s
	var lim, steam float64
	over := false
	for i, b := range s.asm.roles.boilers {
		if !s.fire[i] {
			continue
		}
		m := s.last[b.steam.mIdx()]
		lim += b.Limit()
		steam += m
		over = over || m > b.Limit()*(1+1e-9)
	}
	return over && steam <= lim*(1+1e-9)
}

// forcedFiring marks the boilers a case forces to fire, and refuses names
// that are not boilers of the plant.
func (p *Plant) forcedFiring(c Case, fire []bool) error {
	var fs faults
	boilers := p.s.asm.roles.boilers
	for _, name := range c.Fire {
		found := false
		for i, b := range boilers {
			if b.Name == name {
				fire[i] = true
				found = true
			}
		}
		if !found {
			fs.add(c.Pos, name, "", "case %q forces %q to fire, but the plant has no oil-fired boiler of that name", c.Name, name)
		}
	}
	if len(c.Fire) == 0 && len(p.s.asm.roles.dumps) == 0 && len(boilers) > 0 {
		fs.add(c.Pos, "", "", "case %q forces every boiler off, but without an exhaust-gas economiser and a dump condenser nothing raises steam", c.Name)
	}
	return fs.err()
}

// forcedOffShort refuses a case that forces every boiler off when the
// exhaust-gas economisers cannot carry it: the dump condenser would have to
// give steam back.
func (p *Plant) forcedOffShort(c Case, fire []bool) error {
	for _, f := range fire {
		if f {
			return nil
		}
	}
	dumped := p.dumpFlow()
	if dumped >= -FlowFloor {
		return nil
	}
	var raised float64
	for _, e := range p.s.asm.roles.eges {
		raised += p.s.last[e.steam.mIdx()]
	}
	var fs faults
	fs.add(c.Pos, "", "", "case %q forces every boiler off, but the exhaust-gas economisers raise %.0f kg/h against a demand of %.0f kg/h with the main engine at %.0f %% of MCR: fire a boiler, or give an engine load at which the economisers carry the demand",
		c.Name, raised*3600, (raised-dumped)*3600, 100*c.Conditions.EngineLoad)
	return fs.err()
}

// egeSaving solves the case again with every exhaust-gas economiser out of
// service and records the boiler fuel they save. The plant's warm-start
// point is kept as the case with the economisers left it.
func (p *Plant) egeSaving(ctx context.Context, c Case, cr *CaseResult) error {
	if p.Opt.NoEGESaving || cr.EGESteamKgS <= 0 {
		return nil
	}
	s := p.s
	var eges []*ExhaustGasEconomiser
	for _, e := range s.asm.roles.eges {
		if !e.Off {
			eges = append(eges, e)
		}
	}
	if s.lastCopy == nil {
		s.lastCopy = make([]float64, len(s.last))
	}
	copy(s.lastCopy, s.last)
	saved := s.slvRes
	hint, hintSet := s.hint, s.hintSet
	noShed, shedFailed := s.noShed, s.shedFailed
	fireSaved := append([]bool(nil), s.fire...)
	defer func() {
		s.hint, s.hintSet = hint, hintSet
		for _, e := range eges {
			e.Off = false
		}
		copy(s.last, s.lastCopy)
		copy(s.fire, fireSaved)
		s.slvRes = saved
		s.noShed, s.shedFailed = noShed, shedFailed
	}()
	for _, e := range eges {
		e.Off = true
		if err := e.prepare(p, c.Conditions); err != nil {
			return err
		}
	}
	fire := make([]bool, len(s.asm.roles.boilers))
	var err error
	if len(c.Fire) > 0 {
		for i, b := range s.asm.roles.boilers {
			for _, n := range c.Fire {
				fire[i] = fire[i] || b.Name == n
			}
		}
		err = p.solveShedding(ctx, fire, false)
	} else {
		err = p.decideShedding(ctx, fire)
	}
	if err != nil {
		return &SolveError{Case: c.Name + " (without exhaust-gas economisers)", Pos: c.Pos, Status: s.slvRes.Status, Err: err}
	}
	var fuel float64
	for _, b := range s.asm.roles.boilers {
		fuel += s.last[b.fuel]
	}
	cr.EGEFuelSavedKgS = fuel - cr.FuelKgS
	for i := range cr.EGEs {
		cr.EGEs[i].FuelSavedKgS = cr.EGEFuelSavedKgS
	}
	for _, e := range eges {
		e.Off = false
		if err := e.prepare(p, c.Conditions); err != nil {
			return err
		}
	}
	return nil
}

// SolveError is a load case that the solver could not bring to a balance.
type SolveError struct {
	Case   string
	Pos    Pos
	Status solver.Status
	Err    error
	// Hint says, in the plant's terms, what most likely stops the case
	// and what to change; "" when nothing stands out (the solver's own
	// message then says what it met).
	Hint string
}

func (e *SolveError) Error() string {
	pre := ""
	if s := e.Pos.String(); s != "" {
		pre = s + ": "
	}
	return fmt.Sprintf("%scase %q: %s", pre, e.Case, e.Reason())
}

// Reason is the message without the case: the hint, or the solver's.
func (e *SolveError) Reason() string {
	if e.Hint != "" {
		return "no balance found: " + e.Hint
	}
	return fmt.Sprintf("no balance found (%s): %v", e.Status, e.Err)
}

func (e *SolveError) Unwrap() error { return e.Err }

func (p *Plant) solveErr(c Case, err error) error {
	se := &SolveError{Case: c.Name, Pos: c.Pos, Status: p.s.slvRes.Status, Err: err, Hint: p.failureHint(c)}
	if se.Hint != "" {
		p.Opt.Logger.Debug().Str("case", c.Name).Err(err).Msg("the solver's failure")
	}
	return se
}

// report fills cr from the last converged point, with the states of the
// lines when lines is set.
func (p *Plant) report(cr *CaseResult, lines bool) error {
	s := p.s
	ev := &s.ev
	ev.x = s.last
	cr.Converged = s.slvRes.Status == solver.Converged
	cr.Iterations = s.slvRes.Stats.Iterations
	cr.ResidualNorm = s.slvRes.ResidualNorm
	cr.Solves = s.solves
	cr.NewtonIterations = s.newton
	// The lists are made to the lengths of the last report (all the
	// components' at the first), so that a case allocates each once.
	if s.nUnits == 0 && s.nConsumers == 0 {
		s.nUnits, s.nConsumers = len(p.comps), len(p.comps)
	}
	cr.Units = make([]ComponentResult, 0, s.nUnits)
	cr.Consumers = make([]ConsumerResult, 0, s.nConsumers)
	cr.Boilers = make([]BoilerResult, 0, len(s.asm.roles.boilers))
	for _, c := range p.comps {
		if err := c.report(ev, cr); err != nil {
			return err
		}
	}
	s.nUnits, s.nConsumers = max(len(cr.Units), 1), max(len(cr.Consumers), 1)
	for _, c := range p.comps {
		if f, ok := c.(finisher); ok {
			f.finish(cr)
		}
	}
	if lines {
		cr.Lines = make([]LineResult, 0, len(p.lines))
		if err := p.reportLines(ev, cr); err != nil {
			return err
		}
	}
	p.reportTotals(cr)
	b := &cr.boundary
	mIn, mOut := b.massIn, b.massOut
	cr.Balance.MassRel = closure(mIn, mOut, math.Max(math.Max(mIn, mOut), cr.SteamProductionKgS))
	eIn := b.energyIn + b.heatIn + b.workIn
	eOut := b.energyOut + b.heatOut + b.workOut
	cr.Balance.EnergyRel = closure(eIn, eOut, math.Max(eIn, eOut))
	cr.clean()
	return nil
}

// reportLines adds the solved state of every water/steam line.
func (p *Plant) reportLines(ev *eval, cr *CaseResult) error {
	for _, l := range p.lines {
		if l.medium != WaterSteam {
			continue
		}
		lr, err := l.state(ev.p(l), ev.h(l))
		if err != nil {
			return fmt.Errorf("line %q: %w", l.Name, err)
		}
		lr.Name, lr.M = l.Name, ev.m(l)
		cr.Lines = append(cr.Lines, lr)
	}
	return nil
}

// reportTotals sums the boilers and the shedding and says whether the
// firing boilers carry the case, with the margin before the next must
// fire.
func (p *Plant) reportTotals(cr *CaseResult) {
	var capFiring, capAll, usableFiring, fired float64
	for _, b := range cr.Boilers {
		cr.SteamProductionKgS += b.SteamKgS
		fired += b.SteamKgS
		cr.FuelKgS += b.FuelKgS
		cr.CO2KgS += b.CO2KgS
		capAll += b.LimitKgS
		if b.Firing {
			cr.BoilersFiring++
			capFiring += b.LimitKgS
			usableFiring += math.Min(p.Opt.UsableFraction*b.MCRKgS, b.LimitKgS)
		}
	}
	for _, c := range cr.Consumers {
		cr.ShedW += c.ShedW
		cr.ShedKgS += c.ShedKgS
	}
	cr.SteamDemandKgS = cr.SteamProductionKgS - cr.DumpedKgS
	shed := p.shedding()
	over := cr.BoilersFiring > 0 && fired > capFiring*(1+1e-9)
	switch {
	case cr.BoilersFiring == 0:
		cr.CanCarry = !shed
		cr.MarginNextKgS = cr.DumpedKgS
	case cr.BoilersFiring < len(cr.Boilers):
		cr.CanCarry = !shed && !over
		cr.MarginNextKgS = usableFiring - fired
		if cr.Forced {
			cr.MarginNextKgS = capFiring - fired
		}
	default:
		cr.CanCarry = !shed && !over
		cr.MarginNextKgS = capAll - fired
	}
	if cr.Forced {
		for _, b := range cr.Boilers {
			if b.Firing && b.LoadFraction > p.Opt.UsableFraction*(1+1e-9) && b.SteamKgS <= b.LimitKgS*(1+1e-9) {
				cr.warn("oil-fired boiler %q is forced to %.0f %% of its MCR, above the plant's usable fraction %.0f %%: no margin is left for load swings",
					b.Name, 100*b.LoadFraction, 100*p.Opt.UsableFraction)
			}
		}
	}
	if cr.CanCarry {
		return
	}
	if !shed {
		cr.ShedW, cr.ShedKgS = 0, 0
	}
	cr.ShortfallKgS = cr.ShedKgS + math.Max(0, fired-capFiring)
	who := "the plant cannot carry this case"
	if cr.Forced && cr.BoilersFiring < len(cr.Boilers) {
		who = "the boilers forced to fire cannot carry this case"
	}
	msg := fmt.Sprintf("%s: short by %.0f kg/h", who, cr.ShortfallKgS*3600)
	if shed {
		msg += fmt.Sprintf(", with the boilers firing at their limit of %.0f kg/h; %s", capFiring*3600, shedSummary(cr))
	}
	cr.warn("%s", msg)
	if p.s.shedFailed && over {
		cr.warn("even with every consumer that may be reduced taken to nothing the boilers would be short: what cannot be reduced (fuel-driven heaters and atomising steam, the feed tank's heating, header drains, blowdown) takes more than their limit, so the figures show them above it and nothing shed")
	}
}

// Outline returns the shape of a case result without solving anything:
// every boiler, economiser, consumer and other component in the lists a
// solved case has, every line, and zero figures. A script's check mode
// returns it where a case would be solved.
func (p *Plant) Outline(name string, cond Conditions) *CaseResult {
	cr := &CaseResult{Name: name, Conditions: cond}
	for _, c := range p.comps {
		c.outline(cr)
	}
	for _, l := range p.lines {
		cr.Lines = append(cr.Lines, LineResult{Name: l.Name})
	}
	return cr
}
