package plant

import (
	"context"
	"errors"
	"fmt"
	"math"

	"steamcase/solver"
)

// Case is one load case: the surroundings, the parameters of units that
// differ from the plant's (a consumer's duty, a turbine's power, a unit
// switched off), and optionally which boilers must fire.
type Case struct {
	Name       string
	Pos        Pos
	Conditions Conditions
	Set        []Setting
	// Fire, if not nil, names the boilers that must fire; the others stay
	// cold. Nil lets the plant decide by its firing rule.
	Fire []string
}

// Setting changes one parameter of one unit for a case.
type Setting struct {
	Unit  string
	Param string
	Value float64
	Pos   Pos
}

// domainErr marks a unit's failure while the solver explores: the solver
// shortens a line-search step that meets it and reports it otherwise.
type domainErr struct{ err error }

func (e domainErr) Error() string        { return e.err.Error() }
func (e domainErr) Unwrap() error        { return e.err }
func (e domainErr) Is(target error) bool { return target == solver.ErrDomain }

// residual evaluates every unit's equations and the dispatch equations.
func (p *Plant) residual(r, x []float64) error {
	ev := &p.ev
	ev.x = x
	for _, u := range p.units {
		if err := u.residual(ev, r); err != nil {
			return domainErr{err}
		}
	}
	p.dispatchResidual(x, r)
	return nil
}

func (p *Plant) solverSettings() *solver.Settings {
	s := solver.Settings{}
	if p.Opt.Solver != nil {
		s = *p.Opt.Solver
	}
	s.SkipDiagnosis = true // compile has diagnosed the structure
	s.NoReuse = true       // fresh Jacobians: reused ones stop at FTol and move noise-level report figures
	if s.Factorizer == nil {
		// A plant's Jacobian is sparse (each equation touches a few
		// lines): the sparse LU is several times faster than the dense
		// one at a plant's size, and a minimum-degree column order on the
		// pattern keeps its fill and its symbolic work small. Each plant
		// (and clone) has its own.
		s.Factorizer = &solver.SparseLU{MinDegree: true}
	}
	return &s
}

// solveConfig solves the plant with the boilers in fire firing, starting
// from the last converged point when there is one.
func (p *Plant) solveConfig(ctx context.Context, fire []bool) error {
	copy(p.disp.fire, fire)
	if p.x0 == nil {
		p.x0 = make([]float64, p.prob.Dim)
	}
	warm := p.last != nil
	if warm {
		copy(p.x0, p.last)
	} else {
		p.guess(p.x0)
	}
	res, err := p.slv.Solve(ctx, p.x0)
	if err != nil && warm && ctx.Err() == nil {
		p.guess(p.x0)
		res, err = p.slv.Solve(ctx, p.x0)
	}
	p.slvRes = *res
	if err != nil {
		return err
	}
	if p.last == nil {
		p.last = make([]float64, p.prob.Dim)
	}
	copy(p.last, res.X)
	p.solves++
	return nil
}

// ColdStart forgets the last solution, so that the next case starts from
// the plant's own guess.
func (p *Plant) ColdStart() { p.last, p.hintSet = nil, false }

// applySettings sets the case's parameters and returns a function that
// restores the plant's own.
func (p *Plant) applySettings(c *Case) (restore func(), err error) {
	type saved struct {
		ptr *float64
		old float64
	}
	var olds []saved
	restore = func() {
		for i := len(olds) - 1; i >= 0; i-- {
			*olds[i].ptr = olds[i].old
		}
	}
	var fs faults
	for _, s := range c.Set {
		u, ok := p.byName[s.Unit]
		if !ok {
			fs.add(s.Pos, s.Unit, "", "case %q sets %q of a unit that the plant does not have", c.Name, s.Param)
			continue
		}
		ptr, err := u.param(s.Param)
		if err != nil {
			var ue *UnitError
			if errors.As(err, &ue) {
				err = ue.Err
			}
			fs.add(s.Pos, s.Unit, "", "%v", err)
			continue
		}
		if !finite(s.Value) {
			fs.add(s.Pos, s.Unit, "", "%s must be a number; got %g", s.Param, s.Value)
			continue
		}
		olds = append(olds, saved{ptr, *ptr})
		*ptr = s.Value
	}
	for _, u := range p.units {
		u.check(&fs)
		switch v := u.(type) {
		case *FeedPump:
			if err := v.resolve(p); err != nil {
				fs.add(v.Pos, v.Name, "", "%v", err.(*UnitError).Err)
			}
		case *Consumer:
			if err := v.prepare(c.Conditions); err != nil {
				fs.add(v.Pos, v.Name, "", "%v", err.(*UnitError).Err)
			}
		case *ExhaustGasEconomiser:
			if err := v.prepare(c.Conditions); err != nil {
				fs.add(v.Pos, v.Name, "", "%v", err.(*UnitError).Err)
			}
		}
	}
	if err := fs.err(); err != nil {
		restore()
		return nil, err
	}
	return restore, nil
}

// Solve solves one load case: it decides which boilers fire (or takes the
// case's choice), solves the plant's balance, and reports. A case whose
// demand exceeds every boiler's MCR is solved and reported with CanCarry
// false and the shortfall; it is not an error.
func (p *Plant) Solve(ctx context.Context, c Case) (*CaseResult, error) {
	if err := p.compile(); err != nil {
		return nil, err
	}
	restore, err := p.applySettings(&c)
	if err != nil {
		return nil, err
	}
	defer restore()
	p.ev = eval{cond: c.Conditions, pl: p, disp: &p.disp}
	p.solves = 0

	n := len(p.boilers)
	fire := make([]bool, n)
	forced := c.Fire != nil
	if forced {
		var fs faults
		for _, name := range c.Fire {
			found := false
			for i, b := range p.boilers {
				if b.Name == name {
					fire[i] = true
					found = true
				}
			}
			if !found {
				fs.add(c.Pos, name, "", "case %q forces %q to fire, but the plant has no oil-fired boiler of that name", c.Name, name)
			}
		}
		if len(c.Fire) == 0 && len(p.dumps) == 0 && n > 0 {
			fs.add(c.Pos, "", "", "case %q forces every boiler off, but without an exhaust-gas economiser and a dump condenser nothing raises steam", c.Name)
		}
		if err := fs.err(); err != nil {
			return nil, err
		}
		if err := p.solveConfig(ctx, fire); err != nil {
			return nil, p.solveErr(c, err)
		}
	} else if err := p.decide(ctx, fire); err != nil {
		return nil, p.solveErr(c, err)
	}

	cr := &CaseResult{Name: c.Name, Pos: c.Pos, Conditions: c.Conditions, Forced: forced}
	if err := p.report(cr); err != nil {
		return nil, err
	}
	if err := p.egeSaving(ctx, c, cr); err != nil {
		return nil, err
	}
	return cr, nil
}

// egeSaving solves the case again with every exhaust-gas economiser out of
// service and records the boiler fuel they save. The plant's warm-start
// point is kept as the case with the economisers left it.
func (p *Plant) egeSaving(ctx context.Context, c Case, cr *CaseResult) error {
	if p.Opt.NoEGESaving || cr.EGESteamKgS <= 0 {
		return nil
	}
	var eges []*ExhaustGasEconomiser
	for _, u := range p.units {
		if e, ok := u.(*ExhaustGasEconomiser); ok && e.Off == 0 {
			eges = append(eges, e)
		}
	}
	if p.lastCopy == nil {
		p.lastCopy = make([]float64, len(p.last))
	}
	copy(p.lastCopy, p.last)
	saved := p.slvRes
	hint, hintSet := p.hint, p.hintSet
	defer func() {
		p.hint, p.hintSet = hint, hintSet
		for _, e := range eges {
			e.Off = 0
		}
		copy(p.last, p.lastCopy)
		p.slvRes = saved
	}()
	for _, e := range eges {
		e.Off = 1
		if err := e.prepare(c.Conditions); err != nil {
			return err
		}
	}
	fire := make([]bool, len(p.boilers))
	var err error
	if c.Fire != nil && len(c.Fire) > 0 {
		for i, b := range p.boilers {
			for _, n := range c.Fire {
				fire[i] = fire[i] || b.Name == n
			}
		}
		err = p.solveConfig(ctx, fire)
	} else {
		err = p.decide(ctx, fire)
	}
	if err != nil {
		return &SolveError{Case: c.Name + " (without exhaust-gas economisers)", Pos: c.Pos, Status: p.slvRes.Status, Err: err}
	}
	var fuel float64
	for _, b := range p.boilers {
		fuel += p.last[b.fuel]
	}
	cr.EGEFuelSavedKgS = fuel - cr.FuelKgS
	for i := range cr.EGEs {
		cr.EGEs[i].FuelSavedKgS = cr.EGEFuelSavedKgS
	}
	for _, e := range eges {
		e.Off = 0
		if err := e.prepare(c.Conditions); err != nil {
			return err
		}
	}
	return nil
}

// decide finds how many boilers must fire: none if the steam system has a
// dump condenser and the exhaust-gas economisers leave steam over without
// them; else the fewest, in declaration order, whose demand stays within
// UsableFraction of their MCR; else all.
//
// It starts from the number that fired in the plant's previous case (a
// voyage's hours rarely change it) and moves up while the demand does not
// fit, then down while fewer boilers would do. A step down is only tried
// when it could succeed: one boiler fewer only if the demand is within 5 %
// of what the fewer could carry (the demand hardly depends on how many
// boilers share it: only consumers driven by the boilers' fuel flow change
// with it), and no boiler at all only if the boilers raise no more than
// those fuel-driven consumers take. Without a previous case it starts from
// none (or one) and moves up, as the rule reads.
func (p *Plant) decide(ctx context.Context, fire []bool) error {
	n := len(p.boilers)
	try0 := len(p.dumps) > 0 && p.egeHeat() > 0
	if n == 0 {
		return p.solveConfig(ctx, fire)
	}
	lowest := 1
	if try0 {
		lowest = 0
	}
	k := lowest
	hinted := p.hintSet && p.hint > lowest && p.hint <= n
	if hinted {
		k = p.hint
	}
	// Up: the first k from the start that fits.
	for {
		ok, err := p.fits(ctx, fire, k)
		if err != nil && hinted && ctx.Err() == nil {
			// The last case's number does not solve here (the economisers
			// now leave steam over, say): scan from the bottom instead.
			k, hinted = lowest, false
			continue
		}
		if err != nil && (k > 0 || ctx.Err() != nil) {
			return err
		}
		if ok {
			break
		}
		k++
	}
	// Down: while one boiler fewer would do.
	for k > lowest && p.mayFit(k-1) {
		p.keep()
		ok, err := p.fits(ctx, fire, k-1)
		if ctx.Err() != nil {
			return ctx.Err()
		}
		if err == nil && ok {
			k--
			continue
		}
		p.restore(fire, k)
		break
	}
	p.hint, p.hintSet = k, true
	return nil
}

// fits solves the plant with the first k boilers firing and says whether
// the firing rule accepts it.
func (p *Plant) fits(ctx context.Context, fire []bool, k int) (bool, error) {
	for i := range fire {
		fire[i] = i < k
	}
	if err := p.solveConfig(ctx, fire); err != nil {
		return false, err
	}
	if k == 0 {
		return p.dumpFlow() >= 0, nil
	}
	if k == len(p.boilers) {
		return true, nil
	}
	demand, mcr := p.firedDemand(k)
	return demand <= p.Opt.UsableFraction*mcr*(1+1e-12), nil
}

// firedDemand is the steam of the first k boilers and their MCR at the
// last solution.
func (p *Plant) firedDemand(k int) (demand, mcr float64) {
	for _, b := range p.boilers[:k] {
		demand += p.last[b.steam.mIdx()]
		mcr += b.MCR
	}
	return demand, mcr
}

// mayFit says whether j boilers could carry the demand of the present
// solution (see decide).
func (p *Plant) mayFit(j int) bool {
	k := j + 1
	demand, _ := p.firedDemand(k)
	if j == 0 {
		var coupled float64
		for _, u := range p.units {
			if c, ok := u.(*Consumer); ok && c.fuel >= 0 {
				coupled += p.last[c.in.mIdx()]
			}
		}
		return demand <= 1.1*coupled+1e-6
	}
	_, mcr := p.firedDemand(j)
	return demand <= 1.05*p.Opt.UsableFraction*mcr
}

// keep saves the last solution before a trial that may be refused.
func (p *Plant) keep() {
	if len(p.keepX) != len(p.last) {
		p.keepX = make([]float64, len(p.last))
	}
	copy(p.keepX, p.last)
	p.keepRes = p.slvRes
	p.keepSolves = p.solves
}

// restore brings back the solution kept before a refused trial, with k
// boilers firing.
func (p *Plant) restore(fire []bool, k int) {
	copy(p.last, p.keepX)
	p.slvRes = p.keepRes
	p.solves++
	for i := range fire {
		fire[i] = i < k
	}
	copy(p.disp.fire, fire)
}

// egeHeat is the heat the exhaust-gas economisers take from the exhaust in
// the present case, W.
func (p *Plant) egeHeat() float64 {
	var q float64
	for _, u := range p.units {
		if e, ok := u.(*ExhaustGasEconomiser); ok {
			q += e.op.q
		}
	}
	return q
}

func (p *Plant) dumpFlow() float64 {
	var m float64
	for _, d := range p.dumps {
		m += p.last[d.in.mIdx()]
	}
	return m
}

// SolveError is a load case that the solver could not bring to a balance.
type SolveError struct {
	Case   string
	Pos    Pos
	Status solver.Status
	Err    error
}

func (e *SolveError) Error() string {
	pre := ""
	if s := e.Pos.String(); s != "" {
		pre = s + ": "
	}
	return fmt.Sprintf("%scase %q: no balance found (%s): %v", pre, e.Case, e.Status, e.Err)
}

func (e *SolveError) Unwrap() error { return e.Err }

func (p *Plant) solveErr(c Case, err error) error {
	return &SolveError{Case: c.Name, Pos: c.Pos, Status: p.slvRes.Status, Err: err}
}

// report fills cr from the last converged point.
func (p *Plant) report(cr *CaseResult) error {
	ev := &p.ev
	ev.x = p.last
	cr.Converged = p.slvRes.Status == solver.Converged
	cr.Iterations = p.slvRes.Stats.Iterations
	cr.ResidualNorm = p.slvRes.ResidualNorm
	cr.Solves = p.solves
	cr.Units = make([]UnitResult, 0, len(p.units))
	cr.Consumers = make([]ConsumerResult, 0, len(p.units))
	cr.Boilers = make([]BoilerResult, 0, len(p.boilers))
	cr.Lines = make([]LineResult, 0, len(p.lines))
	for _, u := range p.units {
		if err := u.report(ev, cr); err != nil {
			return err
		}
	}
	for _, u := range p.units {
		if e, ok := u.(*Economiser); ok {
			e.adjustBoiler(cr)
		}
	}
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

	var capFiring, capAll, fired float64
	for _, b := range cr.Boilers {
		cr.SteamProductionKgS += b.SteamKgS
		fired += b.SteamKgS
		cr.FuelKgS += b.FuelKgS
		cr.CO2KgS += b.CO2KgS
		capAll += b.MCRKgS
		if b.Firing {
			cr.BoilersFiring++
			capFiring += b.MCRKgS
		}
	}
	cr.SteamDemandKgS = cr.SteamProductionKgS - cr.DumpedKgS
	switch {
	case cr.BoilersFiring == 0:
		cr.CanCarry = true
		cr.MarginNextKgS = cr.DumpedKgS
	case cr.BoilersFiring < len(p.boilers):
		cr.CanCarry = fired <= capFiring*(1+1e-9) || !cr.Forced
		cr.MarginNextKgS = p.Opt.UsableFraction*capFiring - fired
		if cr.Forced {
			cr.MarginNextKgS = capFiring - fired
		}
	default:
		cr.CanCarry = fired <= capAll*(1+1e-9)
		cr.MarginNextKgS = capAll - fired
	}
	if !cr.CanCarry {
		cr.ShortfallKgS = fired - capFiring
		if cr.Forced && cr.BoilersFiring < len(p.boilers) {
			cr.warn("the boilers forced to fire cannot carry this case: short by %.0f kg/h", cr.ShortfallKgS*3600)
		} else {
			cr.warn("the plant cannot carry this case: short by %.0f kg/h", cr.ShortfallKgS*3600)
		}
	}

	b := &cr.boundary
	mIn, mOut := b.massIn, b.massOut
	cr.Balance.MassRel = closure(mIn, mOut, math.Max(math.Max(mIn, mOut), cr.SteamProductionKgS))
	eIn := b.energyIn + b.heatIn + b.workIn
	eOut := b.energyOut + b.heatOut + b.workOut
	cr.Balance.EnergyRel = closure(eIn, eOut, math.Max(eIn, eOut))
	cr.clean()
	return nil
}
