package loads

import (
	"fmt"
	"math"
)

// Instruction is what a stateful tank's heating does over one period (a
// row of a voyage).
type Instruction int

const (
	// HoldTemp keeps the cargo at Step.Target (the temperature at the start
	// of the period when Target is zero): the coil heats it up to the
	// target as fast as it can, or the heating stays off while the cargo
	// cools down to it, and then the coil gives the losses at the target.
	HoldTemp Instruction = iota
	// HeatOff gives no heat: the cargo cools (or warms) towards its
	// surroundings.
	HeatOff
	// HeatTo heats at the coil's capacity up to Step.Target and holds it
	// there; a cargo above the target is let cool to it. It acts as HoldTemp
	// with a target; it is the word of a heat-up.
	HeatTo
	// ReachBy heats at the constant duty that brings the cargo to
	// Step.Target at Step.Deadline (from the period's start, with this
	// period's surroundings), within the coil's capacity, and holds the
	// target after the deadline.
	ReachBy
)

// String returns "hold", "off", "heat_to" or "reach", as scripts write
// them.
func (i Instruction) String() string {
	switch i {
	case HoldTemp:
		return "hold"
	case HeatOff:
		return "off"
	case HeatTo:
		return "heat_to"
	case ReachBy:
		return "reach"
	}
	return fmt.Sprintf("Instruction(%d)", int(i))
}

// Step is one period of a stateful tank: where it starts, how long it
// lasts, what the heating is told to do and the steam the coil gets.
type Step struct {
	// T0 is the cargo's temperature at the start of the period (K).
	T0 float64
	// Dt is the period's length (s).
	Dt float64
	// Instr is the instruction; Target its temperature (K) and Deadline,
	// for ReachBy, the time from the start of this period by which the
	// target is wanted (s; zero or less: it is past, hold the target).
	Instr    Instruction
	Target   float64
	Deadline float64
	// SteamT is the saturation temperature of the steam at the coil (K).
	SteamT float64
}

// StepResult is a stateful tank over one period.
type StepResult struct {
	// T0 and T1 are the cargo's temperatures at the start and the end of
	// the period (K).
	T0, T1 float64
	// Dt is the period's length (s).
	Dt float64
	// CoilJ is the heat the coil gave (J), LossJ the heat lost to the
	// surroundings (J; negative when they warm the cargo), StoredJ the
	// heat stored in the cargo, m·∫c dT from T0 to T1 (J). CoilJ −
	// LossJ = StoredJ to rounding.
	CoilJ, LossJ, StoredJ float64
	// Duty is the mean duty of the coil over the period, CoilJ/Dt (W):
	// the steady load the plant sees for the period.
	Duty float64
	// Capacity is the coil's capacity at T0 (W); CapacityBinds says the
	// coil gave its capacity for part of the period (the instruction
	// asked more than it can give, or a heat-up ran at full coil).
	Capacity      float64
	CapacityBinds bool
	// Short says the coil cannot give what the instruction asks: the
	// losses at a temperature to hold are more than its capacity, or
	// ReachBy will not reach its target by the deadline at the coil's
	// capacity. A heat-up that has not reached its target by the period's
	// end is not short.
	Short bool
	// Mass (kg), UA (W/K) and AmbientT (K, UA-weighted) of the tank.
	Mass, UA, AmbientT float64
	// Warnings lists cautions.
	Warnings []string
}

// Rate returns the mean heat-up rate over the period (K/s).
func (r StepResult) Rate() float64 { return (r.T1 - r.T0) / r.Dt }

// relaxation is the lumped model of the cargo, m·c(T)·dT/dt =
// −K·(T − Teq), with Cragoe's c, which is linear in T: c = ca + c1·(T −
// Teq). Every segment of Advance has this form: the heating off (K = ΣUA,
// Teq the UA-weighted surroundings), a constant duty Q (K = ΣUA, Teq =
// T_amb + Q/ΣUA) and a steam coil at its capacity (K = ΣUA + U·A_coil,
// Teq the conductance-weighted mean of the surroundings and the steam).
// Its solution is exact in closed form in time, t = (m/K)·[ca·ln(u0/u) +
// c1·(u0 − u)], u = T − Teq (docs/reference/plant-checks.md §6 cool-down line [CP], with
// the linear c integrated exactly).
type relaxation struct {
	m, K, Teq float64
	ca, c1    float64 // c at Teq and its slope
}

// newRelax builds the relaxation towards Teq with conductance K for a
// cargo at T0 (which must be in the cargo correlation's range).
func (t *TankHeating) newRelax(c checker, m, K, Teq, T0 float64) (relaxation, error) {
	ca, c1, err := t.cargoLine(c, T0, Teq)
	if err != nil {
		return relaxation{}, err
	}
	return relaxation{m: m, K: K, Teq: Teq, ca: ca, c1: c1}, nil
}

// after returns T after time dt from T0.
func (x relaxation) after(T0, dt float64) float64 {
	u0 := T0 - x.Teq
	if u0 == 0 || !(x.K > 0) || !(dt > 0) {
		return T0
	}
	k := x.K * dt / x.m
	cmin := math.Min(x.ca, x.ca+x.c1*u0)
	if math.IsInf(k, 1) || math.IsInf(k/cmin, 1) {
		return x.Teq
	}
	return x.Teq + u0*math.Exp(solveRelax(x.ca, x.c1, u0, k))
}

// timeTo returns the time to go from T0 to T (which must lie between T0
// and Teq, or equal T0), and false when T is not on that side.
func (x relaxation) timeTo(T0, T float64) (float64, bool) {
	u0, u := T0-x.Teq, T-x.Teq
	if u == u0 {
		return 0, true
	}
	if !(x.K > 0) || u0 == 0 || u/u0 <= 0 || math.Abs(u) > math.Abs(u0) {
		return 0, false
	}
	return x.m / x.K * (x.ca*math.Log(u0/u) + x.c1*(u0-u)), true
}

// solveRelax solves G(s) = −ca·s + c1·u0·(1 − e^s) − k = 0 for
// s = ln(u/u0) ≤ 0 by safeguarded Newton steps: G decreases (G' = −c(T)
// < 0), G(0) = −k < 0 and G(−k/cmin) ≥ 0, with cmin the smaller of c at
// T0 and at Teq.
func solveRelax(ca, c1, u0, k float64) float64 {
	cmin := math.Min(ca, ca+c1*u0)
	lo, hi := -k/cmin, 0.0
	sv := -k / (ca + c1*u0) // constant c at T0
	if !(sv >= lo && sv <= hi) {
		sv = 0.5 * (lo + hi)
	}
	for range 200 {
		e := math.Exp(sv)
		g := -ca*sv + c1*u0*(1-e) - k
		if g > 0 {
			lo = sv
		} else {
			hi = sv
		}
		next := sv + g/(ca+c1*u0*e)
		if !(next > lo && next < hi) {
			next = 0.5 * (lo + hi)
		}
		done := math.Abs(next-sv) <= 1e-13*(1+math.Abs(sv))
		sv = next
		if done || hi-lo <= 1e-15*(1+math.Abs(lo)) {
			break
		}
	}
	return sv
}

// integralU returns ∫(T − Teq) dt over a segment from T0 to T1 of the
// relaxation: from the model, −(m/K)·∫c dT, with ∫c dT of the linear c in
// closed form.
func (x relaxation) integralU(T0, T1 float64) float64 {
	u0, u1 := T0-x.Teq, T1-x.Teq
	h := x.ca*(u1-u0) + 0.5*x.c1*(u1*u1-u0*u0)
	return -x.m / x.K * h
}

// stepper carries a stateful tank through the segments of one period,
// adding up the coil's heat and the losses.
type stepper struct {
	t       *TankHeating
	c       checker
	m, ua   float64 // mass, ΣUA
	ta      float64 // UA-weighted surroundings
	uac, ts float64 // coil U·A (linearised for a deck heater) and steam T
	T, left float64 // present temperature, time left in the period
	coil    float64 // J
	loss    float64 // J
	binds   bool
	short   bool // a hold asked more than the coil gives
}

// off lets the cargo cool for dt (or until it reaches stopAt when that
// is not zero and lies on the way); it returns the time used.
func (s *stepper) off(dt, stopAt float64) (float64, error) {
	return s.constant(0, dt, stopAt)
}

// constant heats at the duty q (W) for dt, or until stopAt.
func (s *stepper) constant(q, dt, stopAt float64) (float64, error) {
	if dt <= 0 {
		return 0, nil
	}
	if !(s.ua > 0) {
		// No losses: m·c·dT/dt = q.
		if q == 0 {
			return dt, nil
		}
		used := dt
		T1, err := s.t.heatAfter(s.c, s.m, s.T, q*dt)
		if err != nil {
			return 0, err
		}
		if stopAt != 0 && (T1-stopAt)*(s.T-stopAt) < 0 {
			h, err := s.t.Cargo.heat(s.T, stopAt)
			if err != nil {
				return 0, s.c.wrap(err, "%s specific heat", s.t.Cargo.label())
			}
			used = s.m * h / q
			T1 = stopAt
		}
		s.coil += q * used
		s.T = T1
		return used, nil
	}
	x, err := s.t.newRelax(s.c, s.m, s.ua, s.ta+q/s.ua, s.T)
	if err != nil {
		return 0, err
	}
	return s.run(x, dt, stopAt, func(T0, T1, used float64) {
		s.coil += q * used
		s.loss += s.ua * (x.integralU(T0, T1) + (x.Teq-s.ta)*used)
	})
}

// full heats at the coil's capacity for dt, or until stopAt.
func (s *stepper) full(dt, stopAt float64) (float64, error) {
	if dt <= 0 {
		return 0, nil
	}
	s.binds = true
	uac := s.uac
	if uac <= 0 || s.T >= s.ts {
		return s.off(dt, stopAt)
	}
	K := s.ua + uac
	teq := (s.ua*s.ta + uac*s.ts) / K
	x, err := s.t.newRelax(s.c, s.m, K, teq, s.T)
	if err != nil {
		return 0, err
	}
	return s.run(x, dt, stopAt, func(T0, T1, used float64) {
		iu := x.integralU(T0, T1)
		s.coil += uac * ((s.ts-teq)*used - iu)
		s.loss += s.ua * (iu + (teq-s.ta)*used)
	})
}

// run advances along x for dt or until stopAt, and books the segment.
func (s *stepper) run(x relaxation, dt, stopAt float64, book func(T0, T1, used float64)) (float64, error) {
	T0 := s.T
	used := dt
	T1 := x.after(T0, dt)
	if stopAt != 0 && (T1-stopAt)*(T0-stopAt) < 0 {
		if tt, ok := x.timeTo(T0, stopAt); ok && tt < dt {
			used, T1 = tt, stopAt
		}
	}
	if err := s.c.temp("cargo temperature", T1); err != nil {
		return 0, err
	}
	book(T0, T1, used)
	s.T = T1
	return used, nil
}

// hold holds the cargo at T for dt: the losses at T, within the coil's
// capacity. Where they are more than the coil gives, the coil heats at its
// capacity and the cargo cools; where the surroundings are warmer than T
// the heating is off.
func (s *stepper) hold(T, dt float64) error {
	if dt <= 0 {
		return nil
	}
	q := s.ua * (T - s.ta)
	switch {
	case q < 0:
		_, err := s.off(dt, 0)
		return err
	case q > s.capacity(T):
		s.short = true
		_, err := s.full(dt, 0)
		return err
	}
	s.coil += q * dt
	s.loss += q * dt
	return nil
}

// capacity is the coil's capacity at T (W) in the linear form the segments
// use.
func (s *stepper) capacity(T float64) float64 {
	if s.uac <= 0 || T >= s.ts {
		return 0
	}
	return s.uac * (s.ts - T)
}

// toward brings the cargo to target (heating at full coil or letting it
// cool) within the time left, then holds it; it reports whether the
// target was reached.
func (s *stepper) toward(target float64) (bool, error) {
	const tol = 1e-9
	var used float64
	var err error
	switch {
	case s.T < target-tol*target:
		used, err = s.full(s.left, target)
	case s.T > target+tol*target:
		used, err = s.off(s.left, target)
	default:
		s.T = target
	}
	if err != nil {
		return false, err
	}
	s.left -= used
	if s.T != target {
		return false, nil
	}
	if err := s.hold(target, s.left); err != nil {
		return false, err
	}
	s.left = 0
	return true, nil
}

// Advance carries a stateful tank through one period (a voyage row): from
// s.T0, for s.Dt, under the instruction, with the coil's capacity at the
// steam's saturation temperature as the limit of what it gives (see
// CoilCapacity), and returns its temperature at the end with the coil's
// heat, the losses and the heat stored. The period's sea and air
// temperatures set the losses.
//
// Each period is cut into segments in which the cargo obeys m·c(T)·dT/dt
// = Q_coil − Σ U_i·A_i·(T − T_i) with Q_coil either constant (off, a
// hold, the constant duty of ReachBy) or the coil's capacity, linear in T;
// each segment is integrated exactly (see relaxation), so the period's
// result is exact for the lumped model, whatever its length. A deck
// heater's ε·ṁ·c (CoilCapacity) is taken at the period's start
// temperature: the change of Cragoe's c over the period (about 0.2 % per
// K) is not followed, the one simplification of the integration.
//
// Warnings: the instruction asked more than the coil gives (capped; the
// warning names the figures), the heat-up rate is above MaxRate (a
// warning, not a cap), the cargo is within 10 K of its flash point
// (SOLAS II-2 reg. 4.2, docs/reference/plant-checks.md §5.2 [S]), and the surroundings
// are warmer than a temperature to hold.
func (t *TankHeating) Advance(st Step, amb Ambient) (StepResult, error) {
	c := checker{KindTankHeating, t.Name}
	r := StepResult{T0: st.T0, Dt: st.Dt}
	if err := t.check(c, amb); err != nil {
		return r, err
	}
	if err := c.temp("temperature at the start of the period", st.T0); err != nil {
		return r, err
	}
	if err := c.positive("period", st.Dt, "s"); err != nil {
		return r, err
	}
	if st.Instr != HeatOff && st.Instr != HoldTemp && st.Instr != HeatTo && st.Instr != ReachBy {
		return r, c.errf("instruction %d is unknown; want HeatOff, HoldTemp, HeatTo or ReachBy", int(st.Instr))
	}
	if st.Instr != HeatOff && st.Instr != HoldTemp || st.Target != 0 {
		if err := c.temp("instruction's temperature", st.Target); err != nil {
			return r, err
		}
	}
	if math.IsNaN(st.Deadline) || math.IsInf(st.Deadline, 0) {
		return r, c.errf("deadline %g s is not finite", st.Deadline)
	}
	s := stepper{t: t, c: c, m: t.CargoVolume * t.Cargo.Density, T: st.T0, left: st.Dt}
	ua, uaT := t.ua(amb)
	s.ua = ua
	if ua > 0 {
		s.ta = uaT / ua
	}
	if st.Instr != HeatOff {
		if !t.Coil.Given() {
			return r, c.errf("instruction %q needs the tank's heating coil: give its area (and U)", st.Instr)
		}
		if err := c.temp("steam temperature at the coil", st.SteamT); err != nil {
			return r, err
		}
		s.ts = st.SteamT
		cd, err := t.CoilCapacity(st.T0, st.SteamT)
		if err != nil {
			return r, err
		}
		r.Capacity = cd.Q
		// The same conductance as Period's: for a deck heater the
		// capacity Q = ε·ṁ·c·(Ts − T) is linear in T with ε·ṁ·c taken
		// at the period's start.
		pp := Period{t: t, m: s.m, ua: s.ua, ta: s.ta, ts: st.SteamT, Dt: st.Dt, uac: t.Coil.UA()}
		if t.Coil.Kind == DeckHeater {
			pp.deck, pp.mc = true, t.Cargo.Density*t.Coil.Circulation
		}
		s.uac = pp.stepper(st.T0).uac
	}
	if _, err := t.Cargo.cp(st.T0); err != nil {
		return r, c.wrap(err, "%s specific heat", t.Cargo.label())
	}
	var err error
	switch st.Instr {
	case HeatOff:
		_, err = s.off(s.left, 0)
	case HoldTemp, HeatTo:
		target := st.Target
		if target == 0 {
			target = st.T0
		}
		// Not reaching the target within the period is a heat-up (or a
		// cool-down) under way, not a shortfall.
		_, err = s.toward(target)
	case ReachBy:
		err = s.reach(&r, st)
	}
	if err != nil {
		return StepResult{T0: st.T0, Dt: st.Dt}, err
	}
	r.T1 = s.T
	r.CoilJ, r.LossJ = s.coil, s.loss
	h, err := t.Cargo.heat(st.T0, r.T1)
	if err != nil {
		return StepResult{T0: st.T0, Dt: st.Dt}, c.wrap(err, "%s specific heat at the end of the period", t.Cargo.label())
	}
	r.Mass, r.UA, r.AmbientT = s.m, s.ua, s.ta
	r.StoredJ = s.m * h
	r.Duty = r.CoilJ / st.Dt
	r.CapacityBinds = s.binds && r.Capacity > 0
	r.Short = r.Short || s.short
	if !finite(r.T1, r.CoilJ, r.LossJ, r.StoredJ, r.Duty) {
		return StepResult{T0: st.T0, Dt: st.Dt}, c.overflow("period")
	}
	t.stepWarnings(&r, st)
	return r, nil
}

// reach heats at the constant duty that brings the cargo to the target
// at the deadline, within the coil's capacity, then holds it.
func (s *stepper) reach(r *StepResult, st Step) error {
	if st.Deadline <= 0 {
		// Past the deadline: short if the target is not reached in this
		// period.
		ok, err := s.toward(st.Target)
		r.Short = !ok && err == nil
		return err
	}
	horizon := st.Deadline
	q, err := s.t.dutyToReach(s.c, s.m, s.ua, s.ta, s.T, st.Target, horizon)
	if err != nil {
		return err
	}
	seg := math.Min(horizon, s.left)
	switch {
	case q <= 0:
		_, err = s.off(seg, 0)
	case q > s.capacity(math.Max(s.T, st.Target)):
		// The constant duty is more than the coil gives at the target:
		// heat at the coil's capacity, stopping at the target.
		var used float64
		used, err = s.full(seg, st.Target)
		if err == nil && used < seg {
			err = s.hold(st.Target, seg-used)
		} else if err == nil {
			// Not there yet: is the target still reachable by the
			// deadline at the coil's capacity?
			r.Short = !s.reachable(st.Target, horizon-seg)
		}
	default:
		_, err = s.constant(q, seg, 0)
	}
	if err != nil {
		return err
	}
	s.left -= seg
	if s.left > 0 {
		ok, err := s.toward(st.Target)
		r.Short = r.Short || !ok && err == nil
		return err
	}
	return nil
}

// reachable reports whether the coil at its capacity brings the cargo from
// its present temperature to target within dt (with this period's
// surroundings).
func (s *stepper) reachable(target, dt float64) bool {
	if s.T >= target {
		return true
	}
	if dt <= 0 || s.uac <= 0 {
		return false
	}
	K := s.ua + s.uac
	teq := (s.ua*s.ta + s.uac*s.ts) / K
	x, err := s.t.newRelax(s.c, s.m, K, teq, s.T)
	if err != nil {
		return false
	}
	tt, ok := x.timeTo(s.T, target)
	return ok && tt <= dt
}

// heatAfter returns the temperature after adding heat q (J) to m kg of
// cargo at T0, without losses: the root of m·∫c dT = q, which for
// Cragoe's linear c is a quadratic.
func (t *TankHeating) heatAfter(c checker, m, T0, q float64) (float64, error) {
	ca, c1, err := t.cargoLine(c, T0, T0)
	if err != nil {
		return 0, err
	}
	h := q / m
	if c1 == 0 {
		return T0 + h/ca, nil
	}
	// ca·d + c1/2·d² = h.
	disc := ca*ca + 2*c1*h
	if disc < 0 {
		return 0, c.errf("heat %.6g J cannot be taken from the cargo", q)
	}
	return T0 + 2*h/(ca+math.Sqrt(disc)), nil
}

// DutyToReach returns the constant coil duty (W) that brings the cargo
// from T0 to T1 in dt at the given surroundings, by the exact solution of
// the lumped model (see Advance): the inverse of a period at constant
// duty. The duty is negative when the cargo would cool past T1 with the
// heating off (no heating reaches it; a plan takes zero).
func (t *TankHeating) DutyToReach(T0, T1, dt float64, amb Ambient) (float64, error) {
	c := checker{KindTankHeating, t.Name}
	if err := t.check(c, amb); err != nil {
		return 0, err
	}
	if err := c.temp("start temperature", T0); err != nil {
		return 0, err
	}
	if err := c.temp("end temperature", T1); err != nil {
		return 0, err
	}
	if err := c.positive("period", dt, "s"); err != nil {
		return 0, err
	}
	ua, uaT := t.ua(amb)
	ta := 0.0
	if ua > 0 {
		ta = uaT / ua
	}
	return t.dutyToReach(c, t.CargoVolume*t.Cargo.Density, ua, ta, T0, T1, dt)
}

// dutyToReach solves, for the constant duty q, the time of the relaxation
// towards Teq = ta + q/ua from T0 to T1 equal to dt: with u = T − Teq,
// dt = (m/ua)·[c(Teq)·ln(u0/u1) + c1·(u0 − u1)], which decreases in Teq
// on the side of Teq beyond T1; safeguarded Newton steps on Teq.
func (t *TankHeating) dutyToReach(c checker, m, ua, ta, T0, T1, dt float64) (float64, error) {
	if !(ua > 0) {
		h, err := t.Cargo.heat(T0, T1)
		if err != nil {
			return 0, c.wrap(err, "%s specific heat", t.Cargo.label())
		}
		return m * h / dt, nil
	}
	if T1 == T0 {
		return ua * (T0 - ta), nil
	}
	ca0, c1, err := t.cargoLine(c, T0, T0)
	if err != nil {
		return 0, err
	}
	if _, err := t.Cargo.cp(T1); err != nil {
		return 0, c.wrap(err, "%s specific heat", t.Cargo.label())
	}
	// time(Teq) − dt, for Teq beyond T1 (above it when heating).
	sgn := 1.0
	if T1 < T0 {
		sgn = -1
	}
	f := func(teq float64) (g, dg float64) {
		u0, u1 := T0-teq, T1-teq
		cteq := ca0 + c1*(teq-T0)
		l := math.Log(u0 / u1)
		g = m/ua*(cteq*l+c1*(u0-u1)) - dt
		// d/dTeq: c1·l + cteq·(−1/u0 + 1/u1)
		dg = m / ua * (c1*l + cteq*(1/u1-1/u0))
		return g, dg
	}
	// Start from the constant-c solution (c at the mean of T0 and T1):
	// T∞ = (T1 − T0·e)/(1 − e), e = exp(−dt/τ), τ = m·c/ΣUA. Bracket:
	// near T1 the time is long (g > 0, +∞ at T1, exclusive); far beyond
	// it short.
	cm := ca0 + c1*(0.5*(T1-T0))
	e := math.Exp(-dt * ua / (m * cm))
	guess := (T1 - T0*e) / (1 - e)
	lo, hi := T1, guess
	if !((guess-T1)*sgn > 0) || math.IsInf(guess, 0) || math.IsNaN(guess) {
		hi = T1 + sgn*math.Max(1, math.Abs(T1-T0))
	}
	for range 200 {
		g, _ := f(hi)
		if g < 0 {
			break
		}
		lo = hi
		hi = T1 + 2*(hi-T1)
	}
	teq := hi
	if (guess-lo)*(guess-hi) < 0 {
		teq = guess
	}
	for range 200 {
		g, dg := f(teq)
		if g > 0 {
			lo = teq
		} else {
			hi = teq
		}
		next := teq - g/dg
		if !((next-lo)*(next-hi) < 0) {
			next = 0.5 * (lo + hi)
		}
		done := math.Abs(next-teq) <= 1e-12*math.Abs(teq)
		teq = next
		if done || math.Abs(hi-lo) <= 1e-12*math.Abs(teq) {
			break
		}
	}
	q := ua * (teq - ta)
	if !finite(q) {
		return 0, c.overflow("duty to reach the temperature")
	}
	return q, nil
}

// stepWarnings adds a period's cautions.
func (t *TankHeating) stepWarnings(r *StepResult, st Step) {
	max := t.MaxRate
	if max == 0 {
		max = DefaultMaxHeatUpRate
	}
	if rate := r.Rate(); rate > max*(1+1e-9) {
		r.Warnings = append(r.Warnings, fmt.Sprintf(
			"heat-up at %.3g K per day is above the %.3g K per day of common practice for large heated cargoes (a caution, not a limit)",
			rate*86400, max*86400))
	}
	switch {
	case r.Short && st.Instr == ReachBy:
		r.Warnings = append(r.Warnings, fmt.Sprintf(
			"the coil's capacity (%.4g kW at %.4g °C) cannot bring the cargo to %.4g °C by the time wanted; heating at the coil's capacity",
			r.Capacity/1e3, celsius(st.T0), celsius(st.Target)))
	case r.Short:
		r.Warnings = append(r.Warnings, fmt.Sprintf(
			"the losses at %.4g °C are more than the coil gives (%.4g kW at %.4g °C): the cargo ends the period at %.4g °C",
			celsius(st.Target), r.Capacity/1e3, celsius(st.T0), celsius(r.T1)))
	}
	if r.UA > 0 && (st.Instr == HoldTemp || st.Instr == HeatTo) && st.Target != 0 && st.Target < r.AmbientT {
		r.Warnings = append(r.Warnings, fmt.Sprintf(
			"the surroundings (UA-weighted %.4g °C) are warmer than the %.4g °C to hold: the heating is off",
			celsius(r.AmbientT), celsius(st.Target)))
	}
	top := math.Max(r.T0, r.T1)
	if t.FlashPoint != 0 && top > t.FlashPoint-FlashPointMargin {
		r.Warnings = append(r.Warnings, t.flashWarning(top))
	}
}

// flashWarning is the SOLAS caution for the tank, saying where the flash
// point was assumed.
func (t *TankHeating) flashWarning(T float64) string {
	w := useFlashWarning(T, t.FlashPoint, t.Use)
	if t.FlashPointAssumed {
		w += fmt.Sprintf(" (flash point not given: %.4g °C assumed, the ISO 8217 minimum of the grade)", celsius(t.FlashPoint))
	}
	return w
}

// Period is a tank's lumped model over one period at fixed surroundings
// and steam, for a planner that tries many starting temperatures and
// duties: each method gives what Advance gives for the same period and
// instruction (the same closed forms, to the last bit for Off and Full),
// checks nothing and allocates nothing. Build it with Tank.Period.
type Period struct {
	t      *TankHeating
	m, ua  float64
	ta, ts float64
	uac    float64 // coil U·A (a steam coil)
	Dt     float64 // s
	deck   bool
	mc     float64 // a deck heater's ρ·circulation (kg/s)
}

// Period returns the tank's period of dt seconds at the surroundings amb
// with steam at steamT at the coil (zero: no steam, the coil gives
// nothing), after checking the tank, the period and the temperatures.
func (t *TankHeating) Period(dt float64, amb Ambient, steamT float64) (Period, error) {
	c := checker{KindTankHeating, t.Name}
	if err := t.check(c, amb); err != nil {
		return Period{}, err
	}
	if err := c.positive("period", dt, "s"); err != nil {
		return Period{}, err
	}
	if steamT != 0 {
		if err := c.temp("steam temperature at the coil", steamT); err != nil {
			return Period{}, err
		}
	}
	p := Period{t: t, m: t.CargoVolume * t.Cargo.Density, ts: steamT, Dt: dt}
	ua, uaT := t.ua(amb)
	p.ua = ua
	if ua > 0 {
		p.ta = uaT / ua
	}
	if steamT > 0 && t.Coil.Given() {
		p.uac = t.Coil.UA()
		if t.Coil.Kind == DeckHeater {
			p.deck = true
			p.mc = t.Cargo.Density * t.Coil.Circulation
		}
	}
	return p, nil
}

// stepper returns a stepper at T0 as Advance sets it up.
func (p *Period) stepper(T0 float64) stepper {
	s := stepper{t: p.t, c: checker{KindTankHeating, p.t.Name}, m: p.m, ua: p.ua, ta: p.ta, ts: p.ts, T: T0, left: p.Dt}
	s.uac = p.uac
	if p.deck && p.ts > T0 {
		cp, err := p.t.Cargo.cp(T0)
		if err == nil {
			mc := p.mc * cp
			s.uac = -math.Expm1(-p.uac/mc) * mc
		}
	}
	return s
}

// Off returns the temperature at the period's end with the heating off
// from T0, or NaN where the model fails (a temperature out of the
// cargo's correlation range).
func (p *Period) Off(T0 float64) float64 {
	s := p.stepper(T0)
	if _, err := s.off(p.Dt, 0); err != nil {
		return math.NaN()
	}
	return s.T
}

// Full returns the temperature at the period's end with the coil at its
// capacity all the period from T0, and the coil's mean duty (W); NaN
// where the model fails.
func (p *Period) Full(T0 float64) (T1, duty float64) {
	s := p.stepper(T0)
	if _, err := s.full(p.Dt, 0); err != nil {
		return math.NaN(), math.NaN()
	}
	return s.T, s.coil / p.Dt
}

// Capacity returns the coil's capacity with the cargo at T (W), in the
// linear form of the period (for a deck heater, ε·ṁ·c at T0).
func (p *Period) Capacity(T0, T float64) float64 {
	s := p.stepper(T0)
	return s.capacity(T)
}

// Duty returns the constant duty (W) that brings the cargo from T0 to T1
// in the period (DutyToReach); NaN where the model fails. Negative means
// the cargo would not cool that far with the heating off.
func (p *Period) Duty(T0, T1 float64) float64 {
	s := p.stepper(T0)
	q, err := p.t.dutyToReach(s.c, p.m, p.ua, p.ta, T0, T1, p.Dt)
	if err != nil {
		return math.NaN()
	}
	return q
}

// TimeFull returns the time the coil at its capacity takes to bring the
// cargo from T0 to target with this period's surroundings (s), or false
// when it levels out below the target; with the level it reaches (K).
func (p *Period) TimeFull(T0, target float64) (float64, float64, bool) {
	s := p.stepper(T0)
	if s.uac <= 0 {
		return 0, s.ta, false
	}
	K := s.ua + s.uac
	teq := (s.ua*s.ta + s.uac*s.ts) / K
	if target >= teq {
		return 0, teq, false
	}
	x, err := p.t.newRelax(s.c, s.m, K, teq, T0)
	if err != nil {
		return 0, teq, false
	}
	tt, ok := x.timeTo(T0, target)
	return tt, teq, ok
}

// HeatTo returns the period's end from T0 under HeatTo target (the coil at
// its capacity up to the target, then its losses; or the heating off
// down to it), the coil's mean duty, and whether the coil gave its
// capacity: what Advance gives, without its checks; NaN where the model
// fails.
func (p *Period) HeatTo(T0, target float64) (T1, duty float64, binds bool) {
	s := p.stepper(T0)
	if _, err := s.toward(target); err != nil {
		return math.NaN(), math.NaN(), false
	}
	return s.T, s.coil / p.Dt, s.binds && p.uac > 0
}
