package loads

import (
	"fmt"
	"math"

	"steamcase/plant/fuel"
)

// Beyond says what lies on the far side of a tank boundary.
type Beyond int

const (
	// Sea: the sea, at Ambient.Sea.
	Sea Beyond = iota
	// Air: outside air, at Ambient.Air.
	Air
	// Space: an adjacent tank, hold, engine or pump room at the boundary's
	// own temperature T.
	Space
)

// String returns "sea", "air" or "space".
func (b Beyond) String() string {
	switch b {
	case Sea:
		return "sea"
	case Air:
		return "air"
	case Space:
		return "space"
	}
	return fmt.Sprintf("Beyond(%d)", int(b))
}

// Ambient holds the sea and air temperatures of a load case (K).
type Ambient struct {
	Sea, Air float64
}

// Boundary is one face of a tank: its area, its overall heat-transfer
// coefficient U (oil to whatever lies beyond, 1/U = 1/h_in + Σt/k + 1/h_out,
// docs/reference/plant-checks.md §6) and what lies beyond. U is a fixed input: this package
// does not compute film coefficients; see DefaultU for indicative values.
type Boundary struct {
	// Name identifies the face in reports, e.g. "weather deck".
	Name string
	// Area in m² (≥ 0).
	Area float64
	// U in W/(m²·K) (≥ 0).
	U float64
	// Beyond says what lies on the other side.
	Beyond Beyond
	// T is the temperature beyond (K), used when Beyond is Space.
	T float64
}

// Cargo is the oil in a tank: its density, for the mass, and its specific
// heat, either constant (Cp) or by Cragoe (1929) at the specific gravity SG
// (fuel.CragoeCp, docs/reference/plant-checks.md §5.3 [S✓ publication, formula from
// memory]). Cragoe's formula is for petroleum liquids in general, so it
// serves crude oils and fuel oils alike.
type Cargo struct {
	// Name of the cargo, for reports (e.g. "heavy crude").
	Name string
	// Density (kg/m³) at the temperature the tank's CargoVolume refers to;
	// mass = CargoVolume·Density.
	Density float64
	// SG is the specific gravity 60/60 °F for Cragoe. Zero means
	// Density/999.016 (fuel.WaterDensity60F).
	SG float64
	// Cp is a constant specific heat (J/(kg·K)). Non-zero replaces Cragoe.
	Cp float64
}

// CargoFromFuel returns a Cargo for a fuel oil: its density at 15 °C and
// its Cragoe specific heat at its specific gravity.
func CargoFromFuel(f fuel.Fuel) (Cargo, error) {
	sg, err := f.SpecificGravity()
	if err != nil {
		return Cargo{}, err
	}
	return Cargo{Name: f.Name, Density: f.ISO.Density15, SG: sg}, nil
}

func (cg Cargo) check(c checker) error {
	if err := c.positive("cargo density", cg.Density, "kg/m³"); err != nil {
		return err
	}
	if cg.Cp != 0 {
		return c.positive("cargo specific heat", cg.Cp, "J/(kg·K)")
	}
	if cg.SG != 0 {
		return c.positive("cargo specific gravity", cg.SG, "")
	}
	return nil
}

// label names the cargo in messages.
func (cg Cargo) label() string {
	if cg.Name == "" {
		return "cargo"
	}
	return fmt.Sprintf("cargo %q", cg.Name)
}

func (cg Cargo) sg() float64 {
	if cg.SG != 0 {
		return cg.SG
	}
	return cg.Density / fuel.WaterDensity60F
}

// heat returns ∫c dT from T1 to T2 (J/kg).
func (cg Cargo) heat(T1, T2 float64) (float64, error) {
	if cg.Cp != 0 {
		return cg.Cp * (T2 - T1), nil
	}
	return fuel.CragoeHeat(cg.sg(), T1, T2)
}

// cp returns c at T (J/(kg·K)).
func (cg Cargo) cp(T float64) (float64, error) {
	if cg.Cp != 0 {
		return cg.Cp, nil
	}
	return fuel.CragoeCp(cg.sg(), T)
}

// TankMode says what a tank's heating must do.
type TankMode int

const (
	// Hold keeps the cargo at To: the duty is the heat loss only,
	// Q = Σ U_i·A_i·(To − T_i).
	Hold TankMode = iota
	// HeatUp raises the cargo from From to To in Duration:
	// Q = m·∫c dT/Duration + Σ U_i·A_i·(T_mean − T_i), T_mean = (From+To)/2.
	HeatUp
)

// String returns "hold" or "heat-up".
func (m TankMode) String() string {
	switch m {
	case Hold:
		return "hold"
	case HeatUp:
		return "heat-up"
	}
	return fmt.Sprintf("TankMode(%d)", int(m))
}

// TankHeating is a cargo, bunker, settling or slop tank with its heating
// duty: the tank (cargo, volume, boundaries) and the mode (hold a
// temperature, or heat up in a given time). Formulas: docs/reference/plant-checks.md §6
// (loss, heat-up and cool-down lines, [CP] textbook heat balance). The
// boundaries can be listed directly or derived from the tank's dimensions
// by TankFromDimensions.
//
// Simplifications: the cargo is well mixed (one temperature); U values are
// fixed inputs; losses during a heat-up are taken at the mean of the initial
// and final temperatures; the heat stored in the steel is not counted.
type TankHeating struct {
	// Name identifies the tank, e.g. "COT 3P".
	Name string
	// Cargo is the oil in the tank.
	Cargo Cargo
	// CargoVolume is the volume of oil (m³), at the temperature of
	// Cargo.Density.
	CargoVolume float64
	// Boundaries are the tank's faces. The slice is only read.
	Boundaries []Boundary
	// FlashPoint of the oil (K); zero means not given. When given, heating
	// to within FlashPointMargin of it gives a warning (SOLAS II-2 reg. 4.2
	// caution for fuel storage and settling tanks, docs/reference/plant-checks.md §5.2 [S]).
	FlashPoint float64
	// FlashPointAssumed says FlashPoint was not given but taken as the
	// grade's specification minimum (SpecFlashPoint); the warning says so.
	FlashPointAssumed bool
	// Use says what the tank holds, which decides the flash-point
	// caution's basis: fuel in storage (the zero value), fuel in a
	// settling or service tank, or cargo.
	Use TankUse
	// Coil is the tank's heating coil; its capacity (CoilCapacity) limits
	// what a stateful tank's heating gives (Advance). A tank without a
	// coil (zero area) has no limit in Duty.
	Coil Coil
	// MaxRate is the heat-up rate (K/s) above which Advance warns; zero
	// means DefaultMaxHeatUpRate.
	MaxRate float64
	// SteamT is the saturation temperature of the steam at the coil (K)
	// for Duty: with a coil and SteamT, Duty caps the duty at the coil's
	// capacity and warns. Zero: Duty does not check the coil.
	SteamT float64

	// Mode: Hold (zero value) or HeatUp.
	Mode TankMode
	// From is the initial temperature of a heat-up (K).
	From float64
	// To is the temperature held (Hold) or reached (HeatUp) (K).
	To float64
	// Duration of a heat-up (s).
	Duration float64
}

// TankResult is a tank's heating duty and the inputs that drove it.
type TankResult struct {
	Name string
	Mode TankMode
	// Duty is the heat the coils must give (W), Sensible + Loss, never
	// negative (see Warnings when the losses are negative).
	Duty float64
	// Sensible is m·∫c dT/Duration (W); zero when holding.
	Sensible float64
	// Loss is Σ U_i·A_i·(T_oil − T_i) at LossT (W); negative when the
	// surroundings are warmer than the oil.
	Loss float64
	// LossT is the oil temperature at which the losses are taken (K).
	LossT float64
	// Mass of cargo (kg).
	Mass float64
	// MeanCp is the mean specific heat over the heat-up (J/(kg·K)); zero
	// when holding.
	MeanCp float64
	// UA is Σ U_i·A_i (W/K).
	UA float64
	// AmbientT is the UA-weighted mean temperature beyond the boundaries
	// (K); zero when UA is zero.
	AmbientT float64
	// From, To, Duration echo the mode's inputs.
	From, To, Duration float64
	// Capacity is the coil's capacity at LossT (W), when the tank has a
	// coil and its steam temperature; Capped says the duty was capped at
	// it.
	Capacity float64
	Capped   bool
	// Warnings lists cautions.
	Warnings []string
}

// check validates everything but the mode.
func (t *TankHeating) check(c checker, amb Ambient) error {
	if err := t.Cargo.check(c); err != nil {
		return err
	}
	if err := c.positive("cargo volume", t.CargoVolume, "m³"); err != nil {
		return err
	}
	if t.FlashPoint != 0 {
		if err := c.temp("flash point", t.FlashPoint); err != nil {
			return err
		}
	}
	if err := t.checkCoil(c); err != nil {
		return err
	}
	if !(t.MaxRate >= 0) || math.IsInf(t.MaxRate, 0) {
		return c.errf("heat-up rate limit %.6g K/s is negative or not finite; want a rate ≥ 0 (0: the default)", t.MaxRate)
	}
	for i := range t.Boundaries {
		b := &t.Boundaries[i]
		if !(b.Area >= 0) || math.IsInf(b.Area, 0) {
			return c.errf("boundary %d %q: area %.6g m² is negative or not finite; want an area ≥ 0 m²", i+1, b.Name, b.Area)
		}
		if !(b.U >= 0) || math.IsInf(b.U, 0) {
			return c.errf("boundary %d %q: U %.6g W/(m²·K) is negative or not finite; want U ≥ 0 W/(m²·K)", i+1, b.Name, b.U)
		}
		switch b.Beyond {
		case Sea:
			if err := c.temp("sea temperature", amb.Sea); err != nil {
				return err
			}
		case Air:
			if err := c.temp("air temperature", amb.Air); err != nil {
				return err
			}
		case Space:
			if !(b.T >= MinTemperature && b.T <= MaxTemperature) {
				return c.temp(fmt.Sprintf("boundary %d %q: temperature beyond", i+1, b.Name), b.T)
			}
		default:
			return c.errf("boundary %d %q: beyond %d is unknown; want Sea, Air or Space", i+1, b.Name, int(b.Beyond))
		}
	}
	return nil
}

// ua returns Σ U·A (W/K) and Σ U·A·T_i (W), after check.
func (t *TankHeating) ua(amb Ambient) (ua, uaT float64) {
	for i := range t.Boundaries {
		b := &t.Boundaries[i]
		T := b.T
		switch b.Beyond {
		case Sea:
			T = amb.Sea
		case Air:
			T = amb.Air
		}
		x := b.U * b.Area
		ua += x
		uaT += x * T
	}
	return ua, uaT
}

// Duty returns the tank's heating duty at the given sea and air
// temperatures. It allocates only for warnings and errors.
func (t *TankHeating) Duty(amb Ambient) (TankResult, error) {
	c := checker{KindTankHeating, t.Name}
	r := TankResult{Name: t.Name, Mode: t.Mode, From: t.From, To: t.To, Duration: t.Duration}
	if err := t.check(c, amb); err != nil {
		return r, err
	}
	if err := c.temp("temperature To", t.To); err != nil {
		return r, err
	}
	r.Mass = t.CargoVolume * t.Cargo.Density
	switch t.Mode {
	case Hold:
		r.LossT = t.To
		if _, err := t.Cargo.cp(t.To); err != nil { // range check of Cragoe
			return r, c.wrap(err, "%s specific heat", t.Cargo.label())
		}
	case HeatUp:
		if err := c.temp("temperature From", t.From); err != nil {
			return r, err
		}
		if !(t.To > t.From) {
			return r, c.errf("heat-up final temperature %.6g °C is not above the initial %.6g °C; want To > From",
				celsius(t.To), celsius(t.From))
		}
		if err := c.positive("heat-up duration", t.Duration, "s"); err != nil {
			return r, err
		}
		q, err := t.Cargo.heat(t.From, t.To)
		if err != nil {
			return r, c.wrap(err, "%s specific heat", t.Cargo.label())
		}
		r.MeanCp = q / (t.To - t.From)
		r.Sensible = r.Mass * q / t.Duration
		r.LossT = 0.5 * (t.From + t.To)
	default:
		return r, c.errf("mode %d is unknown; want Hold or HeatUp", int(t.Mode))
	}
	ua, uaT := t.ua(amb)
	r.UA = ua
	if ua > 0 {
		r.AmbientT = uaT / ua
		r.Loss = ua * (r.LossT - r.AmbientT)
	}
	r.Duty = r.Sensible + r.Loss
	if !finite(r.Duty, r.Sensible, r.Loss, r.Mass, r.UA, r.AmbientT) {
		return TankResult{Name: t.Name, Mode: t.Mode}, c.overflow("duty")
	}
	if len(t.Boundaries) == 0 {
		r.Warnings = append(r.Warnings, "no boundaries given: heat losses not counted")
	}
	if r.Duty < 0 {
		r.Warnings = append(r.Warnings, fmt.Sprintf(
			"the surroundings (UA-weighted %.4g °C) give the cargo %.4g kW more than it needs; heating duty taken as zero",
			celsius(r.AmbientT), -r.Duty/1e3))
		r.Duty = 0
	}
	if t.FlashPoint != 0 && t.To > t.FlashPoint-FlashPointMargin {
		r.Warnings = append(r.Warnings, t.flashWarning(t.To))
	}
	if t.Coil.Given() && t.SteamT > 0 && r.Duty > 0 {
		// The coil's capacity at the temperature the losses are taken at
		// (the mean of a heat-up, where its capacity is its mean over
		// the heat-up to first order) caps the duty.
		cd, err := t.CoilCapacity(r.LossT, t.SteamT)
		if err != nil {
			return TankResult{Name: t.Name, Mode: t.Mode}, err
		}
		r.Capacity = cd.Q
		if r.Duty > cd.Q {
			r.Warnings = append(r.Warnings, fmt.Sprintf(
				"the %s asks %.4g kW, the coil gives at most %.4g kW at %.4g °C (U·A·LMTD, steam at %.4g °C): the duty is capped at it%s",
				t.Mode, r.Duty/1e3, cd.Q/1e3, celsius(r.LossT), celsius(t.SteamT), capNote(t.Mode)))
			r.Duty = cd.Q
			r.Capped = true
		}
	}
	return r, nil
}

// capNote says what a capped duty means for the mode.
func capNote(m TankMode) string {
	if m == HeatUp {
		return ", and the heat-up takes longer than asked"
	}
	return ", and the cargo cools below the temperature held"
}

// BoundaryLoss is one boundary's share of a tank's heat loss.
type BoundaryLoss struct {
	Boundary
	// Beyond temperature used (K).
	TBeyond float64
	// Loss is U·A·(T_oil − TBeyond) (W).
	Loss float64
}

// BoundaryLosses appends to dst each boundary's loss with the oil at Toil
// (K), for a report, and returns the extended slice.
func (t *TankHeating) BoundaryLosses(dst []BoundaryLoss, Toil float64, amb Ambient) ([]BoundaryLoss, error) {
	c := checker{KindTankHeating, t.Name}
	if err := t.check(c, amb); err != nil {
		return dst, err
	}
	if err := c.temp("oil temperature", Toil); err != nil {
		return dst, err
	}
	for _, b := range t.Boundaries {
		T := b.T
		switch b.Beyond {
		case Sea:
			T = amb.Sea
		case Air:
			T = amb.Air
		}
		l := b.U * b.Area * (Toil - T)
		if !finite(l) {
			return dst, c.overflow(fmt.Sprintf("loss through %q", b.Name))
		}
		dst = append(dst, BoundaryLoss{Boundary: b, TBeyond: T, Loss: l})
	}
	return dst, nil
}

// CoolDown is a tank's temperature with the heating off.
type CoolDown struct {
	Name string
	// T0 is the temperature when heating stops (K).
	T0 float64
	// Elapsed is the time considered (s) and T the temperature then (K)
	// (from CoolDownAfter), or the time until T reaches the target (from
	// TimeToCool).
	Elapsed, T float64
	// Reached is false when TimeToCool's target lies at or below the
	// surroundings: the cargo never gets there (Elapsed is then zero).
	Reached bool
	// Tau is the time constant m·c/ΣUA (s), with c at the mean of T0 and T.
	Tau float64
	// Mass (kg), Cp at the mean of T0 and T (J/(kg·K)), UA (W/K).
	Mass, Cp, UA float64
	// AmbientT is the UA-weighted mean temperature beyond the boundaries (K).
	AmbientT float64
	// Warnings lists cautions.
	Warnings []string
}

// CoolDownAfter returns the cargo temperature after elapsed seconds with
// the heating off, starting from T0, by the lumped model
//
//	m·c(T)·dT/dt = −Σ U_i·A_i·(T − T_i) = −ΣUA·(T − T_amb)
//
// (docs/reference/plant-checks.md §6 [CP]). With boundaries at several temperatures T_amb
// is the UA-weighted mean Σ U_i·A_i·T_i / ΣUA; this is exact, not an
// approximation, because the loss is linear in the oil temperature. With a
// constant c the solution is the exponential of docs/reference/plant-checks.md §6,
//
//	T(t) = T_amb + (T0 − T_amb)·exp(−t/τ),   τ = m·c/ΣUA.
//
// With Cragoe's c, which is linear in T (c = c_a + c'·(T − T_amb)), the
// model is integrated exactly:
//
//	t = (m/ΣUA)·[c_a·ln((T0 − T_amb)/(T − T_amb)) + c'·(T0 − T)]
//
// and solved for T by safeguarded Newton steps. The result's Tau uses c at
// the mean of T0 and T (exact for a constant c). The tank's mode fields are
// not used.
func (t *TankHeating) CoolDownAfter(T0, elapsed float64, amb Ambient) (CoolDown, error) {
	c := checker{KindTankHeating, t.Name}
	r, err := t.coolSetup(c, T0, amb)
	if err != nil {
		return r, err
	}
	if !(elapsed > 0) || math.IsInf(elapsed, 0) {
		return r, c.errf("cool-down time %.6g s must be positive and finite", elapsed)
	}
	r.Elapsed = elapsed
	r.Reached = true
	ca, c1, err := t.cargoLine(c, T0, r.AmbientT)
	if err != nil {
		return r, err
	}
	u0 := T0 - r.AmbientT
	k := r.UA * elapsed / r.Mass
	T := T0
	if math.IsInf(k, 1) || math.IsInf(k/math.Min(ca, ca+c1*u0), 1) {
		T = r.AmbientT // cooled all the way, to rounding
	} else if u0 != 0 && k > 0 {
		T = r.AmbientT + u0*math.Exp(solveRelax(ca, c1, u0, k))
	}
	r.T = T
	if err := t.coolEnd(c, &r); err != nil {
		return r, err
	}
	return r, nil
}

// TimeToCool returns the time (s) for the cargo to cool from T0 to target
// with the heating off, by the same model as CoolDownAfter:
//
//	t = (m/ΣUA)·[c_a·ln((T0 − T_amb)/(target − T_amb)) + c'·(T0 − target)]
//
// (c' = 0 for a constant c: t = τ·ln((T0 − T_amb)/(target − T_amb))). A
// plan uses it to say when heating must start again. A target at or above
// T0 takes no time; a target at or below the surroundings is never reached
// (Reached false, Elapsed zero, with a warning).
func (t *TankHeating) TimeToCool(T0, target float64, amb Ambient) (CoolDown, error) {
	c := checker{KindTankHeating, t.Name}
	r, err := t.coolSetup(c, T0, amb)
	if err != nil {
		return r, err
	}
	if err := c.temp("target temperature", target); err != nil {
		return r, err
	}
	r.T = target
	ca, c1, err := t.cargoLine(c, T0, r.AmbientT)
	if err != nil {
		return r, err
	}
	switch {
	case target >= T0:
		r.Reached = true
	case target <= r.AmbientT:
		r.Warnings = append(r.Warnings, fmt.Sprintf(
			"the surroundings (UA-weighted %.4g °C) are not colder than the target %.4g °C: the cargo never cools to it",
			celsius(r.AmbientT), celsius(target)))
	default:
		r.Reached = true
		u0, u := T0-r.AmbientT, target-r.AmbientT
		r.Elapsed = r.Mass / r.UA * (ca*math.Log(u0/u) + c1*(u0-u))
	}
	if err := t.coolEnd(c, &r); err != nil {
		return r, err
	}
	return r, nil
}

// cargoLine returns the cargo's specific heat as a line in T: c at Ta (ca,
// J/(kg·K)) and its slope c1 (J/(kg·K²)), from c at T0 (which must be in
// the correlation's range). For a constant Cp, ca = Cp and c1 = 0.
func (t *TankHeating) cargoLine(c checker, T0, Ta float64) (ca, c1 float64, err error) {
	cg := t.Cargo
	if cg.Cp != 0 {
		return cg.Cp, 0, nil
	}
	c0, err := cg.cp(T0)
	if err != nil {
		return 0, 0, c.wrap(err, "%s specific heat", cg.label())
	}
	T1 := T0 - 1
	if T1 < fuel.MinCragoeT {
		T1 = T0 + 1
	}
	cx, err := cg.cp(T1)
	if err != nil {
		return 0, 0, c.wrap(err, "%s specific heat", cg.label())
	}
	c1 = (cx - c0) / (T1 - T0)
	ca = c0 - c1*(T0-Ta)
	if !(ca > 0) {
		return 0, 0, c.errf("%s: specific heat extrapolated to the surroundings (%.4g °C) is not positive", cg.label(), celsius(Ta))
	}
	return ca, c1, nil
}

// coolEnd fills Cp and Tau (c at the mean of T0 and T) and checks the
// result is finite and T within the cargo correlation's range.
func (t *TankHeating) coolEnd(c checker, r *CoolDown) error {
	cp, err := t.Cargo.cp(0.5 * (r.T0 + r.T))
	if err == nil && t.Cargo.Cp == 0 {
		_, err = t.Cargo.cp(r.T)
	}
	if err != nil {
		*r = CoolDown{Name: t.Name}
		return c.wrap(err, "%s specific heat at the end of the cool-down", t.Cargo.label())
	}
	r.Cp = cp
	r.Tau = r.Mass * cp / r.UA
	if !finite(r.T, r.Tau, r.Elapsed) {
		*r = CoolDown{Name: t.Name}
		return c.overflow("cool-down")
	}
	return nil
}

func (t *TankHeating) coolSetup(c checker, T0 float64, amb Ambient) (CoolDown, error) {
	r := CoolDown{Name: t.Name, T0: T0}
	if err := t.check(c, amb); err != nil {
		return r, err
	}
	if err := c.temp("initial temperature", T0); err != nil {
		return r, err
	}
	ua, uaT := t.ua(amb)
	if !(ua > 0) {
		return r, c.errf("Σ U·A is %.6g W/K; a cool-down needs boundaries with U·A > 0", ua)
	}
	r.UA = ua
	r.AmbientT = uaT / ua
	r.Mass = t.CargoVolume * t.Cargo.Density
	if !finite(r.UA, r.AmbientT, r.Mass) {
		return CoolDown{Name: t.Name}, c.overflow("Σ U·A")
	}
	return r, nil
}

// CargoResult is the sum over many tanks with each tank's result.
type CargoResult struct {
	// Duty is the sum of the tanks' duties (W).
	Duty float64
	// Tanks holds each tank's result, in the order given.
	Tanks []TankResult
}

// CargoHeating returns the heating duty of a cargo of many tanks at the
// given sea and air temperatures: each tank's result (own mode and
// temperatures) and their sum. The first tank in error stops the sum, and
// the error names it.
func CargoHeating(tanks []TankHeating, amb Ambient) (CargoResult, error) {
	r := CargoResult{Tanks: make([]TankResult, 0, len(tanks))}
	for i := range tanks {
		tr, err := tanks[i].Duty(amb)
		if err != nil {
			return CargoResult{}, err
		}
		r.Duty += tr.Duty
		r.Tanks = append(r.Tanks, tr)
	}
	return r, nil
}

// CloudPointHM40 returns the cloud point (wax appearance temperature, K) of
// a crude oil from its pour point (K) by Energy Institute HM 40 (3rd ed.,
// 2018 addendum, A.2.3 Eq. 7; docs/reference/plant-checks.md §6 [S✓]):
//
//	CP = 20.2·10^(0.00708·PP − 0.1157714) + 8    (°C)
//
// Waxy crudes are carried above their cloud point. The correlation's range of
// validity was not confirmed; pour points from −60 °C to +60 °C are accepted
// (chosen here, no source), others are an error.
func CloudPointHM40(pour float64) (float64, error) {
	pp := celsius(pour)
	if !(pp >= -60 && pp <= 60) {
		return 0, &InputError{Consumer: KindCloudPoint, Name: "",
			Msg: fmt.Sprintf("pour point %.6g °C is outside the accepted −60…60 °C", pp)}
	}
	return 20.2*math.Pow(10, 0.00708*pp-0.1157714) + 8 + 273.15, nil
}

// TankUse is what a heated tank holds, for the flash-point caution.
type TankUse int

const (
	// FuelStorage: SOLAS II-2 reg. 4.2 keeps the oil at least
	// FlashPointMargin below its flash point (docs/reference/plant-checks.md §5.2 [S]).
	FuelStorage TankUse = iota
	// FuelSettling and FuelService: tanks of the fuel supply system,
	// which SOLAS II-2 reg. 4.2 lets be heated closer to (or above) the
	// flash point only with the arrangements it requires (from memory).
	FuelSettling
	FuelService
	// CargoTank: the SOLAS fuel-oil rule does not apply; the cargo's safety
	// data sheet, the charter party and the ship's cargo procedures
	// govern its heating near the flash point.
	CargoTank
)
