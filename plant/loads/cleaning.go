package loads

import (
	"fmt"

	"steamcase/plant/water"
)

// DefaultCleaningPressure is the water pressure in a tank-cleaning heater
// when none is given: 1.0 MPa absolute (about 9 bar(g), a round figure for
// the discharge of a tank-cleaning pump, from memory). The enthalpy rise of
// liquid water depends on pressure only slightly (about 0.06 % per MPa for
// 15 → 80 °C, python3-iapws 1.5.2 IAPWS97).
const DefaultCleaningPressure = 1.0e6

// TankCleaning is a tank-cleaning heater: a water flow heated from the sea
// temperature to a target. By default the duty is
//
//	Q = ṁ·[h(p, OutletT) − h(p, InletT)]
//
// with h by IAPWS-IF97 (package water, IAPWS R7-97(2012)) at the stated
// pressure p. IAPWS-IF97 is pure water: for sea water, whose specific heat
// is about 4 % lower (about 3.99 kJ/(kg·K) at 35 g/kg, from memory), give a
// constant Cp instead.
type TankCleaning struct {
	// Name identifies the heater.
	Name string
	// Flow is the water mass flow (kg/s).
	Flow float64
	// InletT is the water inlet temperature, usually the sea temperature (K).
	InletT float64
	// OutletT is the target outlet temperature (K).
	OutletT float64
	// Pressure is the absolute water pressure in the heater (Pa). Zero means
	// DefaultCleaningPressure. The outlet must stay below its saturation
	// temperature.
	Pressure float64
	// Cp, when non-zero, replaces IAPWS-IF97 by a constant specific heat
	// (J/(kg·K)), e.g. for sea water.
	Cp float64
}

// CleaningResult is the tank-cleaning heater's duty and its inputs.
type CleaningResult struct {
	Name string
	// Duty (W) and PerKg, the enthalpy rise (J/kg).
	Duty, PerKg float64
	// Flow (kg/s), InletT, OutletT (K), Pressure (Pa) echo the inputs.
	Flow, InletT, OutletT, Pressure float64
	// Source says how PerKg was found.
	Source string
}

// Duty returns the heater's duty.
func (tc TankCleaning) Duty() (CleaningResult, error) {
	c := checker{KindTankCleaning, tc.Name}
	p := tc.Pressure
	if p == 0 {
		p = DefaultCleaningPressure
	}
	r := CleaningResult{Name: tc.Name, Flow: tc.Flow, InletT: tc.InletT, OutletT: tc.OutletT, Pressure: p}
	if err := c.positive("water flow", tc.Flow, "kg/s"); err != nil {
		return r, err
	}
	if err := c.temp("inlet temperature", tc.InletT); err != nil {
		return r, err
	}
	if err := c.temp("outlet temperature", tc.OutletT); err != nil {
		return r, err
	}
	if tc.OutletT < tc.InletT {
		return r, c.errf("outlet temperature %.6g °C is below the inlet %.6g °C; want outlet ≥ inlet",
			celsius(tc.OutletT), celsius(tc.InletT))
	}
	if tc.Cp != 0 {
		if err := c.positive("specific heat", tc.Cp, "J/(kg·K)"); err != nil {
			return r, err
		}
		r.PerKg = tc.Cp * (tc.OutletT - tc.InletT)
		r.Source = fmt.Sprintf("constant cp %.6g J/(kg·K)", tc.Cp)
	} else {
		if err := c.positive("pressure", p, "Pa"); err != nil {
			return r, err
		}
		ts, err := water.Tsat(p)
		if err != nil {
			return r, c.wrap(err, "pressure %.6g Pa", p)
		}
		if tc.OutletT >= ts {
			return r, c.errf("outlet %.6g °C is at or above the boiling point %.6g °C at %.6g kPa; want a higher pressure or a lower outlet",
				celsius(tc.OutletT), celsius(ts), p/1e3)
		}
		if tc.InletT < 273.16 {
			return r, c.errf("inlet %.6g °C is below the range of IAPWS-IF97 (0 °C); give a constant Cp for sea water", celsius(tc.InletT))
		}
		h1, err := water.HPT(p, tc.InletT)
		if err != nil {
			return r, c.wrap(err, "water enthalpy at the inlet")
		}
		h2, err := water.HPT(p, tc.OutletT)
		if err != nil {
			return r, c.wrap(err, "water enthalpy at the outlet")
		}
		r.PerKg = h2 - h1
		r.Source = "IAPWS-IF97 enthalpy difference"
	}
	r.Duty = tc.Flow * r.PerKg
	if !finite(r.Duty) {
		return CleaningResult{Name: tc.Name}, c.overflow("duty")
	}
	return r, nil
}
