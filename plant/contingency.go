package plant

import (
	"context"
	"fmt"
	"math"
	"strings"
)

// N-1: every case also answers the single failures that matter.
//
// After a case is solved, unless Options.NoContingencies, it is solved
// again for each contingency:
//
//   - the largest firing boiler trips (the largest MCR; between equals
//     the one raising the most steam, then the last declared);
//   - each exhaust-gas economiser in service is out;
//   - each contingency the plant lists (Options.Contingencies): the
//     boilers and economisers it names are lost together.
//
// The boilers that fire after the failure are those still firing, and,
// if they cannot carry the case's demand within their usable capacity,
// the standby boilers in the order declared, until they can (or all are
// firing): a standby boiler that must start is marked Started (it may
// need time to come up to pressure, which a steady-state balance does
// not show). They share equally in fractions of their limits, whatever
// the plant's sharing rule, and the case is solved once, warm from its
// own solution, with the shedding on (priority.go): one solve per
// contingency (two in the rare case that the direct solve fails and the
// two-step one is needed). Whether the rest can carry it, the shortfall,
// what is shed by priority and what the shedding does to a tank's cargo
// (its cooling rate and the hours until its min_T) are reported.
//
// A contingency the remaining boilers clearly carry is not solved: when
// the usable capacity of the boilers that would fire is at least
// Screen times the steam they would have to raise (the case's boiler
// steam plus the lost economisers' steam), it is reported as carried, with
// the load estimated as that steam over their limits (Solved false). The
// steam they raise changes with the failure only through the consumers
// that follow the boilers' fuel and the feed temperature, by a few per
// cent, well inside the 25 % of Screen.
//
// The figures are planning estimates: the boiler makers' manuals, the
// ship's safety management system and the inert-gas system's own
// instructions govern what is done when a boiler trips.

// Screen is the margin by which the remaining boilers' usable capacity
// must exceed the steam they would raise for a contingency to count as
// carried without a solve (see above).
const Screen = 1.25

// Contingency is a single failure a plant lists beside the automatic ones:
// the boilers and exhaust-gas economisers lost together, and where the
// script gave it.
type Contingency struct {
	Units []string
	Pos   Pos
}

// ContingencyResult is one N-1 answer of a case.
type ContingencyResult struct {
	// Name says what fails ("AB2 trips", "EGE out"); Kind is "boiler
	// trip", "economiser out" or "listed"; Units the units lost.
	Name  string
	Kind  string
	Units []string
	// Solved is false when the contingency was screened as carried (see
	// Screen) or nothing was left to solve (Note says so).
	Solved   bool
	CanCarry bool
	// ShortfallKgS is the steam the remaining boilers at their limit
	// cannot raise; MarginKgS what they could still add to their limits
	// (zero when short).
	ShortfallKgS float64
	MarginKgS    float64
	// Boilers are the boilers firing after the failure.
	Boilers []ContingencyBoiler
	// Shed are the consumers the shortfall reduces, lowest priority
	// first, with the cooling of a tank's cargo.
	Shed []ConsumerResult
	// ShedW and ShedKgS total them.
	ShedW, ShedKgS float64
	// Note is a sentence for what the figures do not say (no steam
	// source remains; the solve failed).
	Note string
}

// ContingencyBoiler is a boiler firing after a failure.
type ContingencyBoiler struct {
	Name         string
	LoadFraction float64 // of its MCR
	SteamKgS     float64
	// Started: it was on standby in the case and must start.
	Started bool
}

// contingencySpec is one failure to answer.
type contingencySpec struct {
	name, kind string
	boilers    []*Boiler
	eges       []*ExhaustGasEconomiser
}

func (c contingencySpec) units() []string {
	var out []string
	for _, b := range c.boilers {
		out = append(out, b.Name)
	}
	for _, e := range c.eges {
		out = append(out, e.Name)
	}
	return out
}

// checkContingencies adds a fault for each listed contingency that names
// no unit, or a unit that is not a boiler or an exhaust-gas economiser of
// the plant.
func (p *Plant) checkContingencies(fs *faults) {

	for i, c := range p.Opt.Contingencies {
		pos := c.Pos
		if pos == (Pos{}) {
			pos = p.Pos
		}
		if len(c.Units) == 0 {
			fs.add(pos, "", "", "contingency %d names no unit: give the boilers or exhaust-gas economisers lost together, such as { \"AB1\" }", i+1)
			continue
		}
		for _, n := range c.Units {
			switch p.byName[n].(type) {
			case *Boiler, *ExhaustGasEconomiser:
			case nil:
				fs.add(pos, n, "", "contingency %d names %q, which is not a unit of the plant", i+1, n)
			default:
				fs.add(pos, n, "", "contingency %d names the %s %q; a contingency loses boilers or exhaust-gas economisers", i+1, p.byName[n].Kind(), n)
			}
		}
	}
}

// contingencySpecs lists the failures to answer for the case in hand.
func (p *Plant) contingencySpecs(cr *CaseResult) []contingencySpec {
	s := p.s
	var out []contingencySpec
	var largest *Boiler
	var largestSteam float64
	for i, b := range s.asm.roles.boilers {
		if !s.fire[i] {
			continue
		}
		m := s.last[b.steam.mIdx()]
		// Between equals the one raising the most steam, and the last
		// declared where they raise the same to the solver's tolerance.
		if largest == nil || b.MCR > largest.MCR || (b.MCR == largest.MCR && m >= largestSteam-1e-9*math.Max(1, largestSteam)) {
			largest, largestSteam = b, m
		}
	}
	if largest != nil {
		out = append(out, contingencySpec{name: largest.Name + " trips", kind: "boiler trip", boilers: []*Boiler{largest}})
	}
	for _, e := range s.asm.roles.eges {
		if !e.Off && e.op.gas.q > 0 {
			out = append(out, contingencySpec{name: e.Name + " out", kind: "economiser out", eges: []*ExhaustGasEconomiser{e}})
		}
	}
	for _, c := range p.Opt.Contingencies {
		spec := contingencySpec{kind: "listed"}
		for _, n := range c.Units {
			switch u := p.byName[n].(type) {
			case *Boiler:
				spec.boilers = append(spec.boilers, u)
			case *ExhaustGasEconomiser:
				spec.eges = append(spec.eges, u)
			}
		}
		names := spec.units()
		spec.name = strings.Join(names, " and ") + " lost"
		dup := false
		for _, o := range out {
			dup = dup || sameUnits(o.units(), names)
		}
		if !dup {
			out = append(out, spec)
		}
	}
	return out
}

func sameUnits(a, b []string) bool {
	if len(a) != len(b) {
		return false
	}
	for _, x := range a {
		found := false
		for _, y := range b {
			found = found || x == y
		}
		if !found {
			return false
		}
	}
	return true
}

// contingencies answers the case's N-1 contingencies and records them in
// cr. The plant's warm-start point and firing state are kept as the case
// left them.
func (p *Plant) contingencies(ctx context.Context, c Case, cr *CaseResult) error {
	if p.Opt.NoContingencies {
		return nil
	}
	cr.ContingenciesChecked = true
	s := p.s
	specs := p.contingencySpecs(cr)
	if len(specs) == 0 {
		return nil
	}
	s.n1Base = append(s.n1Base[:0], s.last...)
	s.n1BaseFire = append(s.n1BaseFire[:0], s.fire...)
	base, baseFire := s.n1Base, s.n1BaseFire
	baseRes, baseSolves := s.slvRes, s.solves
	hint, hintSet := s.hint, s.hintSet
	noShed, shedFailed, equal, shares := s.noShed, s.shedFailed, s.equalShare, s.shares
	var boilerSteam float64
	for _, b := range cr.Boilers {
		boilerSteam += b.SteamKgS
	}
	defer func() {
		copy(s.last, base)
		copy(s.fire, baseFire)
		s.slvRes, s.solves = baseRes, baseSolves
		s.hint, s.hintSet = hint, hintSet
		s.noShed, s.shedFailed, s.equalShare, s.shares = noShed, shedFailed, equal, shares
	}()
	for _, spec := range specs {
		res, err := p.contingency(ctx, c, spec, base, baseFire, boilerSteam)
		if err != nil {
			return err
		}
		cr.Contingencies = append(cr.Contingencies, res)
	}
	return nil
}

// contingency answers one failure.
func (p *Plant) contingency(ctx context.Context, c Case, spec contingencySpec, base []float64, baseFire []bool, boilerSteam float64) (ContingencyResult, error) {
	s := p.s
	res := ContingencyResult{Name: spec.name, Kind: spec.kind, Units: spec.units()}
	lost := func(b *Boiler) bool {
		for _, x := range spec.boilers {
			if x == b {
				return true
			}
		}
		return false
	}
	// The steam the boilers must raise after the failure: theirs, and
	// what the lost economisers raised less what was dumped.
	need := 0.0
	for _, e := range spec.eges {
		if !e.Off {
			need += base[e.steam.mIdx()]
		}
	}
	for _, d := range s.asm.roles.dumps {
		need -= base[d.in.mIdx()]
	}
	need = boilerSteam + math.Max(0, need)
	boilers := s.asm.roles.boilers
	if len(s.n1Fire) != len(boilers) {
		s.n1Fire, s.n1Started = make([]bool, len(boilers)), make([]bool, len(boilers))
	}
	fire, started := s.n1Fire, s.n1Started
	for i := range fire {
		fire[i], started[i] = false, false
	}
	var usable, limit float64
	for i, b := range boilers {
		if baseFire[i] && !lost(b) {
			fire[i] = true
			usable += p.usable(b)
			limit += b.Limit()
		}
	}
	for i, b := range boilers {
		if usable >= need {
			break
		}
		if !fire[i] && !lost(b) {
			fire[i], started[i] = true, true
			usable += p.usable(b)
			limit += b.Limit()
		}
	}
	anyFire := false
	for _, f := range fire {
		anyFire = anyFire || f
	}
	egeLeft := false
	for _, e := range s.asm.roles.eges {
		lostE := false
		for _, x := range spec.eges {
			lostE = lostE || x == e
		}
		egeLeft = egeLeft || (!lostE && !e.Off && e.op.gas.q > 0)
	}
	if !anyFire && !(egeLeft && len(s.asm.roles.dumps) > 0) {
		res.CanCarry = need <= 0
		res.ShortfallKgS = need
		res.Note = "no steam source remains: every consumer is lost"
		return res, nil
	}
	if anyFire && usable >= Screen*need {
		res.CanCarry = true
		res.MarginKgS = limit - need
		for i, b := range boilers {
			if fire[i] {
				res.Boilers = append(res.Boilers, ContingencyBoiler{Name: b.Name, LoadFraction: need / limit * b.maxLoad(),
					SteamKgS: need / limit * b.Limit(), Started: started[i]})
			}
		}
		return res, nil
	}

	// Solve the failure, warm from the case's solution.
	for _, e := range spec.eges {
		if e.Off {
			continue
		}
		e.Off = true
		defer func(e *ExhaustGasEconomiser) {
			e.Off = false
			_ = e.prepare(p, c.Conditions) // it prepared for the case before
		}(e)
		if err := e.prepare(p, c.Conditions); err != nil {
			return res, err
		}
	}
	copy(s.last, base)
	p.contingencyStart(fire, need, limit)
	s.equalShare, s.shares = true, nil
	res.Solved = true
	if err := p.solveShedding(ctx, fire, true); err != nil {
		if ctx.Err() != nil {
			return res, ctx.Err()
		}
		res.Note = fmt.Sprintf("no balance found (%s): %v", s.slvRes.Status, err)
		return res, nil
	}
	tmp := &CaseResult{Conditions: c.Conditions, Forced: true, ShedRanks: s.nRanks}
	if err := p.report(tmp); err != nil {
		res.Note = fmt.Sprintf("no report: %v", err)
		return res, nil
	}
	res.CanCarry = tmp.CanCarry
	res.ShortfallKgS = tmp.ShortfallKgS
	res.ShedW, res.ShedKgS = tmp.ShedW, tmp.ShedKgS
	var steam float64
	for i, b := range tmp.Boilers {
		if !b.Firing {
			continue
		}
		steam += b.SteamKgS
		res.Boilers = append(res.Boilers, ContingencyBoiler{Name: b.Name, LoadFraction: b.LoadFraction, SteamKgS: b.SteamKgS, Started: started[i]})
	}
	res.MarginKgS = math.Max(0, limit-steam)
	for _, cs := range tmp.Consumers {
		if cs.ShedW > 0 || cs.ShedKgS > 0 {
			res.Shed = append(res.Shed, cs)
		}
	}
	sortShed(res.Shed)
	if tmp.BoilersFiring == 0 {
		res.MarginKgS = 0
	}
	if p.s.shedFailed {
		res.Note = "even with every consumer that may be reduced taken to nothing the remaining boilers would be short"
	}
	return res, nil
}

// contingencyStart moves the warm start of a contingency's solve near
// its answer: the boilers firing share the steam needed up to their
// limits, the others raise none, and where the steam needed is beyond
// their limits the shed level starts at the share of the reduced
// consumers' steam (rankShedding's estimate) that makes up the
// difference. Newton's first step then starts inside every boiler's
// range (a flue-gas table ends at 120 % of MCR) instead of at the tripped
// boiler's steam moved onto the others.
func (p *Plant) contingencyStart(fire []bool, need, limit float64) {
	s := p.s
	x := s.last
	for i, b := range s.asm.roles.boilers {
		m := 0.0
		if fire[i] && limit > 0 {
			m = math.Min(need, limit) * b.Limit() / limit
		}
		x[b.steam.mIdx()] = m
		x[b.feed.mIdx()] = m / (1 - b.blowdown())
	}
	if s.shedIdx < 0 || need <= limit || s.nRanks == 0 {
		return
	}
	var reducible float64
	for _, c := range s.shedders {
		if _, _, ok, steam := c.shedPriority(x); ok {
			reducible += steam
		}
	}
	if reducible > 0 {
		x[s.shedIdx] = math.Min(1, (need-limit)/reducible)
	}
}

// sortShed orders shed consumers by priority, lowest first, keeping the
// plant's order between equals.
func sortShed(cs []ConsumerResult) {
	for i := 1; i < len(cs); i++ {
		for j := i; j > 0 && cs[j].Priority < cs[j-1].Priority; j-- {
			cs[j], cs[j-1] = cs[j-1], cs[j]
		}
	}
}

// ContingencyLine words one N-1 answer as the report's line: "if AB2
// trips: AB1 at 100 %, short 5.4 t/h; shed: cargo heating 2.64 MW (cargo
// cools 0.40 K/h), COP3 782 kW".
func ContingencyLine(r ContingencyResult) string {
	var b strings.Builder
	fmt.Fprintf(&b, "if %s: ", r.Name)
	if len(r.Boilers) == 0 && r.Note != "" && !r.Solved {
		b.WriteString(r.Note)
		return b.String()
	}
	var parts []string
	for _, x := range r.Boilers {
		s := fmt.Sprintf("%s at %.0f %%", x.Name, 100*x.LoadFraction)
		if !r.Solved {
			s = fmt.Sprintf("%s at about %.0f %%", x.Name, 100*x.LoadFraction)
		}
		if x.Started {
			s += " (must start)"
		}
		parts = append(parts, s)
	}
	if len(parts) == 0 {
		parts = append(parts, "no boiler fires")
	}
	b.WriteString(strings.Join(parts, ", "))
	switch {
	case r.CanCarry && !r.Solved:
		fmt.Fprintf(&b, ", carries it with about %.1f t/h to spare (estimate: usable capacity at least %.0f %% of the steam needed)", r.MarginKgS*3.6, 100*Screen)
	case r.CanCarry:
		fmt.Fprintf(&b, ", carries it with %.1f t/h to spare", r.MarginKgS*3.6)
	default:
		fmt.Fprintf(&b, ", short %.1f t/h", r.ShortfallKgS*3.6)
	}
	if len(r.Shed) > 0 {
		var sh []string
		for _, c := range r.Shed {
			s := fmt.Sprintf("%s %s", c.Name, kwText(c.ShedW))
			if c.ShedW < c.RequestedW*(1-1e-9) {
				s += fmt.Sprintf(" of %s", kwText(c.RequestedW))
			}
			if c.Cooling != nil {
				s += " (" + coolingText(c.Cooling) + ")"
			}
			sh = append(sh, s)
		}
		b.WriteString("; shed: " + strings.Join(sh, ", "))
	}
	if r.Note != "" {
		b.WriteString("; " + r.Note)
	}
	return b.String()
}

// coolingText words a shed tank's cooling: "cargo cools 0.40 K/h, 12.5 h
// to 45 °C".
func coolingText(c *TankCooling) string {
	rate := c.RateKS * 3600
	s := fmt.Sprintf("cargo cools %.2f K/h", -rate)
	if rate >= 0 {
		s = fmt.Sprintf("cargo still warms %.2f K/h", rate)
	}
	switch {
	case c.MinT > 0 && c.Reaches:
		s += fmt.Sprintf(", %.1f h to %.1f °C", c.SecondsToMinT/3600, c.MinT-273.15)
	case c.MinT > 0 && rate < 0:
		s += fmt.Sprintf(", never down to %.1f °C", c.MinT-273.15)
	}
	return s
}
