package loads

import (
	"fmt"

	"steamcase/plant/water"
)

// AtomisingSteam is the steam a steam-atomised burner blows with its fuel,
// a fixed ratio of steam to fuel (kg/kg). The steam is lost to the furnace
// (no condensate returns). The ratio is the burner maker's figure; no
// default is given. Steam = ratio × fuel flow (common practice, no source;
// docs/reference/plant-checks.md §2 lists atomising steam among the flue-gas water).
type AtomisingSteam struct {
	// Name identifies the consumer.
	Name string
	// SteamPerFuel is kg of steam per kg of fuel burnt, (0, 0.5] (the upper
	// bound is a sanity limit chosen here, no source).
	SteamPerFuel float64
}

// SteamFlowResult is a steam consumer given as a steam flow.
type SteamFlowResult struct {
	Name string
	// SteamFlow (kg/s); zero for a per-kg result.
	SteamFlow float64
	// PerKgFuel is kg of steam per kg of fuel; zero for a soot blower.
	PerKgFuel float64
	// FuelFlow (kg/s) echoes the input of AtomisingSteam.Flow.
	FuelFlow float64
	// WhileBlowing (kg/s), Duration and Interval (s) echo the soot blower's
	// inputs.
	WhileBlowing, Duration, Interval float64
}

func (a AtomisingSteam) check() error {
	c := checker{KindAtomising, a.Name}
	if !(a.SteamPerFuel > 0 && a.SteamPerFuel <= 0.5) {
		return c.errf("steam per fuel %.6g kg/kg is outside (0, 0.5]; want the burner maker's ratio", a.SteamPerFuel)
	}
	return nil
}

// PerKgFuel returns the steam per kg of fuel, for the plant to multiply by
// the boiler's solved fuel flow.
func (a AtomisingSteam) PerKgFuel() (SteamFlowResult, error) {
	if err := a.check(); err != nil {
		return SteamFlowResult{Name: a.Name}, err
	}
	return SteamFlowResult{Name: a.Name, PerKgFuel: a.SteamPerFuel}, nil
}

// Flow returns the atomising steam flow (kg/s) for a fuel flow (kg/s).
func (a AtomisingSteam) Flow(fuelFlow float64) (SteamFlowResult, error) {
	if err := a.check(); err != nil {
		return SteamFlowResult{Name: a.Name}, err
	}
	c := checker{KindAtomising, a.Name}
	if err := c.nonNegative("fuel flow", fuelFlow, "kg/s"); err != nil {
		return SteamFlowResult{Name: a.Name}, err
	}
	r := SteamFlowResult{Name: a.Name, PerKgFuel: a.SteamPerFuel, FuelFlow: fuelFlow, SteamFlow: a.SteamPerFuel * fuelFlow}
	if !finite(r.SteamFlow) {
		return SteamFlowResult{Name: a.Name}, c.overflow("steam flow")
	}
	return r, nil
}

// SootBlowing is a soot blower: a steam flow while blowing, for Duration
// every Interval, averaged over the interval:
//
//	ṁ_mean = ṁ_blowing · Duration / Interval
//
// (common practice, no source). The average suits a steady balance; the peak (ṁ_blowing) is what the
// boiler must also carry while blowing, and is kept in the result.
type SootBlowing struct {
	// Name identifies the consumer.
	Name string
	// WhileBlowing is the steam flow while blowing (kg/s).
	WhileBlowing float64
	// Duration of one blow (s) and Interval between the starts of two
	// blows (s).
	Duration, Interval float64
}

// Flow returns the mean steam flow over the interval.
func (s SootBlowing) Flow() (SteamFlowResult, error) {
	c := checker{KindSootBlowing, s.Name}
	r := SteamFlowResult{Name: s.Name, WhileBlowing: s.WhileBlowing, Duration: s.Duration, Interval: s.Interval}
	if err := c.nonNegative("steam flow while blowing", s.WhileBlowing, "kg/s"); err != nil {
		return r, err
	}
	if err := c.positive("blowing duration", s.Duration, "s"); err != nil {
		return r, err
	}
	if err := c.positive("interval", s.Interval, "s"); err != nil {
		return r, err
	}
	if s.Duration > s.Interval {
		return r, c.errf("blowing duration %.6g s is longer than the interval %.6g s; want duration ≤ interval", s.Duration, s.Interval)
	}
	r.SteamFlow = s.WhileBlowing * (s.Duration / s.Interval)
	return r, nil
}

// DutyResult is a heat duty with the inputs that drove it.
type DutyResult struct {
	Name string
	// Duty (W).
	Duty float64
	// PerMetre (W/m) and Length (m) echo a tracing's inputs.
	PerMetre, Length float64
}

// SteamTracing is steam tracing of pipes: a heat loss per metre of traced
// pipe times the length (the per-metre figure from the tracing design;
// common practice, no source).
type SteamTracing struct {
	// Name identifies the consumer.
	Name string
	// PerMetre is the heat given per metre (W/m), ≥ 0.
	PerMetre float64
	// Length of traced pipe (m), ≥ 0.
	Length float64
}

// Duty returns PerMetre·Length.
func (s SteamTracing) Duty() (DutyResult, error) {
	c := checker{KindTracing, s.Name}
	r := DutyResult{Name: s.Name, PerMetre: s.PerMetre, Length: s.Length}
	if err := c.nonNegative("heat per metre", s.PerMetre, "W/m"); err != nil {
		return r, err
	}
	if err := c.nonNegative("length", s.Length, "m"); err != nil {
		return r, err
	}
	r.Duty = s.PerMetre * s.Length
	if !finite(r.Duty) {
		return DutyResult{Name: s.Name}, c.overflow("duty")
	}
	return r, nil
}

// FixedDuty is a consumer with a set duty: galley, laundry, sundry heating.
type FixedDuty struct {
	// Name identifies the consumer.
	Name string
	// Duty (W), ≥ 0.
	Duty float64
}

// Result returns the duty after checking it.
func (f FixedDuty) Result() (DutyResult, error) {
	c := checker{KindFixedDuty, f.Name}
	if err := c.nonNegative("duty", f.Duty, "W"); err != nil {
		return DutyResult{Name: f.Name}, err
	}
	return DutyResult{Name: f.Name, Duty: f.Duty}, nil
}

// FreshWaterGenerator is a steam-heated fresh-water generator (evaporator).
// Its duty is Q = Production · q, with the specific energy input q either
// given (SpecificEnergy, the maker's figure per kg of distillate) or
// computed for a single-effect evaporator as
//
//	q = h_fg(T_evap) + FeedRatio·[h_f(T_evap) − h(p_sat(T_evap), FeedT)]
//
// with IAPWS-IF97 pure-water properties (package water): the latent heat at
// the evaporation temperature plus the sensible heat to bring the feed
// (FeedRatio kg per kg of distillate) from FeedT to boiling. Simplifications
// of the computed form: pure-water properties for the sea-water feed (its
// specific heat is some 4 % lower, from memory), no boiling-point rise, no
// heat losses, brine leaving at T_evap. The balance itself is common
// practice (no source); the properties are IAPWS R7-97(2012).
type FreshWaterGenerator struct {
	// Name identifies the consumer.
	Name string
	// Production of distillate (kg/s).
	Production float64
	// SpecificEnergy is a given heat input per kg of distillate (J/kg).
	// Non-zero: used as given; zero: computed from the fields below.
	SpecificEnergy float64
	// EvaporationT is the boiling temperature in the evaporator (K),
	// e.g. 318 K under vacuum.
	EvaporationT float64
	// FeedRatio is kg of sea-water feed per kg of distillate (≥ 1 when
	// given; zero: the feed's sensible heat is not counted).
	FeedRatio float64
	// FeedT is the feed temperature entering the evaporator (K); needed
	// when FeedRatio is non-zero.
	FeedT float64
}

// FreshWaterResult is the generator's duty and the inputs that drove it.
type FreshWaterResult struct {
	Name string
	// Duty (W), SpecificEnergy (J/kg of distillate), Production (kg/s).
	Duty, SpecificEnergy, Production float64
	// Computed is true when SpecificEnergy was computed, false when given.
	Computed bool
	// Source says how SpecificEnergy was found.
	Source string
}

// Duty returns the generator's duty.
func (g FreshWaterGenerator) Duty() (FreshWaterResult, error) {
	c := checker{KindFreshWater, g.Name}
	r := FreshWaterResult{Name: g.Name, Production: g.Production}
	if err := c.nonNegative("production", g.Production, "kg/s"); err != nil {
		return r, err
	}
	if g.SpecificEnergy != 0 {
		if err := c.positive("specific energy", g.SpecificEnergy, "J/kg"); err != nil {
			return r, err
		}
		r.SpecificEnergy = g.SpecificEnergy
		r.Source = "given"
	} else {
		if err := c.temp("evaporation temperature", g.EvaporationT); err != nil {
			return r, err
		}
		if !(g.EvaporationT > 273.16 && g.EvaporationT < 373.15) {
			return r, c.errf("evaporation temperature %.6g °C is outside 0…100 °C; want the boiling temperature under the evaporator's vacuum", celsius(g.EvaporationT))
		}
		liq, err := water.TX(g.EvaporationT, 0)
		if err != nil {
			return r, c.wrap(err, "saturated liquid at %.6g °C", celsius(g.EvaporationT))
		}
		vap, err := water.TX(g.EvaporationT, 1)
		if err != nil {
			return r, c.wrap(err, "saturated vapour at %.6g °C", celsius(g.EvaporationT))
		}
		q := vap.H - liq.H
		r.Source = "computed: IAPWS-IF97 h_fg at the evaporation temperature"
		if g.FeedRatio != 0 {
			if !(g.FeedRatio >= 1) || !finite(g.FeedRatio) {
				return r, c.errf("feed ratio %.6g kg/kg is below 1 or not finite; want kg of feed per kg of distillate ≥ 1", g.FeedRatio)
			}
			if err := c.temp("feed temperature", g.FeedT); err != nil {
				return r, err
			}
			if !(g.FeedT > 273.16 && g.FeedT <= g.EvaporationT) {
				return r, c.errf("feed temperature %.6g °C is outside 0 °C…the evaporation temperature %.6g °C", celsius(g.FeedT), celsius(g.EvaporationT))
			}
			hf := liq.H
			if g.FeedT < g.EvaporationT {
				hf, err = water.HPT(liq.P, g.FeedT)
				if err != nil {
					return r, c.wrap(err, "feed enthalpy at %.6g °C", celsius(g.FeedT))
				}
			}
			q += g.FeedRatio * (liq.H - hf)
			r.Source = fmt.Sprintf("computed: IAPWS-IF97 h_fg at the evaporation temperature plus feed heating (feed ratio %.4g)", g.FeedRatio)
		}
		r.SpecificEnergy = q
		r.Computed = true
	}
	r.Duty = g.Production * r.SpecificEnergy
	if !finite(r.Duty) {
		return FreshWaterResult{Name: g.Name}, c.overflow("duty")
	}
	return r, nil
}
