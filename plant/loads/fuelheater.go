package loads

import (
	"fmt"

	"steamcase/plant/fuel"
)

// HeaterService says what a fuel oil heater serves. It chooses which
// cautions apply; the heat balance is the same for all.
type HeaterService int

const (
	// EngineService heats the engine's fuel to its injection viscosity
	// (10–15 cSt for two-stroke engines, docs/reference/plant-checks.md §5.2 [M/CP]).
	EngineService HeaterService = iota
	// BoilerBurner heats the boiler burner's fuel to the burner viscosity
	// (pressure-jet 10–15 cSt, steam-atomised 15–25 cSt, docs/reference/plant-checks.md
	// §3.5 [M/CP]). Its oil flow is the boiler's own fuel flow: use
	// FuelHeater.DutyPerKg.
	BoilerBurner
	// Purifier heats oil before the centrifugal purifier (HFO 95–98 °C,
	// docs/reference/plant-checks.md §5.2 [CP]).
	Purifier
	// Transfer heats oil on its way to a storage or settling tank; the
	// SOLAS II-2 reg. 4.2 flash-point caution applies to it.
	Transfer
)

// String returns the trade name of the service.
func (s HeaterService) String() string {
	switch s {
	case EngineService:
		return "engine service"
	case BoilerBurner:
		return "boiler burner"
	case Purifier:
		return "purifier"
	case Transfer:
		return "transfer"
	}
	return fmt.Sprintf("HeaterService(%d)", int(s))
}

// FlashPointMargin is the margin below the flash point to which oil in
// storage tanks may be heated: 10 K, SOLAS II-2 reg. 4.2 (docs/reference/plant-checks.md
// §5.2 [S], from memory of the regulation). It is used as a caution (a
// warning), not as an error: the regulation's exceptions for service and
// settling arrangements are not modelled.
const FlashPointMargin = 10.0

// FuelHeater is a fuel oil heater: engine service, boiler burner, purifier
// or transfer heater. The outlet temperature is either set (OutletT) or
// found from a target viscosity (TargetViscosity) on the fuel's ASTM D341
// line through its two viscosity points (fuel.Fuel.TemperatureForViscosity,
// docs/reference/plant-checks.md §5.1 [S✓]). The duty is
//
//	Q = ṁ · ∫ c dT   from InletT to the outlet,
//
// with c by Cragoe (1929) at the fuel's specific gravity (fuel.CragoeHeat,
// docs/reference/plant-checks.md §5.3 [S✓ publication, formula from memory]). Heat losses of
// the heater itself are not counted.
type FuelHeater struct {
	// Name identifies the heater in results and errors.
	Name string
	// Service says what the heater serves (cautions only).
	Service HeaterService
	// Fuel is the oil heated; it needs ISO.Density15, and for a viscosity
	// target ISO.Viscosity and Viscosity2.
	Fuel fuel.Fuel
	// MassFlow is the oil flow (kg/s). Not used by DutyPerKg.
	MassFlow float64
	// InletT is the oil temperature at the heater inlet (K).
	InletT float64
	// OutletT is a set outlet temperature (K). Zero means: find it from
	// TargetViscosity. Exactly one of the two must be given.
	OutletT float64
	// TargetViscosity is the kinematic viscosity wanted at the outlet
	// (m²/s), e.g. 13e-6 for 13 cSt.
	TargetViscosity float64
	// OutletLimit is the highest outlet temperature the heater may reach (K),
	// e.g. its design limit or the steam side's saturation temperature less
	// an approach. Zero means no limit. An outlet above it gives a warning.
	OutletLimit float64
	// FlashPoint is the fuel's flash point (K), from its delivery note.
	// Zero means not given. For a Transfer heater an outlet within
	// FlashPointMargin of it gives a warning.
	FlashPoint float64
}

// FuelHeaterResult is a fuel heater's duty and the inputs that drove it.
type FuelHeaterResult struct {
	Name    string
	Service HeaterService
	// Duty is the heat taken from steam (W); zero from DutyPerKg.
	Duty float64
	// PerKg is the heat per kg of oil (J/kg).
	PerKg float64
	// MassFlow is the oil flow used (kg/s); zero from DutyPerKg.
	MassFlow float64
	// InletT and OutletT are the oil temperatures (K).
	InletT, OutletT float64
	// OutletFromViscosity is true when OutletT was found from the target.
	OutletFromViscosity bool
	// OutletViscosity is the viscosity at the outlet (m²/s); zero when the
	// fuel has no viscosity line.
	OutletViscosity float64
	// MeanCp is PerKg/(OutletT − InletT) (J/(kg·K)); zero for an idle heater.
	MeanCp float64
	// Warnings lists cautions (outlet above its limit, flash point, idle).
	Warnings []string
}

// Duty returns the heater's duty for its MassFlow.
func (h FuelHeater) Duty() (FuelHeaterResult, error) {
	c := checker{KindFuelHeater, h.Name}
	if err := c.positive("oil mass flow", h.MassFlow, "kg/s"); err != nil {
		return FuelHeaterResult{}, err
	}
	r, err := h.perKg(c)
	if err != nil {
		return FuelHeaterResult{}, err
	}
	r.MassFlow = h.MassFlow
	r.Duty = h.MassFlow * r.PerKg
	if !finite(r.Duty) {
		return FuelHeaterResult{}, c.overflow("duty")
	}
	return r, nil
}

// DutyPerKg returns the heat per kg of oil (J/kg) in PerKg, for a heater
// whose oil flow is found by the plant, such as the boiler burner's heater
// (the boiler's own fuel flow): the plant multiplies PerKg by the solved
// fuel flow. MassFlow is ignored and Duty is zero.
func (h FuelHeater) DutyPerKg() (FuelHeaterResult, error) {
	return h.perKg(checker{KindFuelHeater, h.Name})
}

func (h FuelHeater) perKg(c checker) (FuelHeaterResult, error) {
	r := FuelHeaterResult{Name: h.Name, Service: h.Service, InletT: h.InletT}
	if h.Service < EngineService || h.Service > Transfer {
		return r, c.errf("unknown service %d; want EngineService, BoilerBurner, Purifier or Transfer", int(h.Service))
	}
	if err := c.temp("inlet temperature", h.InletT); err != nil {
		return r, err
	}
	sg, err := h.Fuel.SpecificGravity()
	if err != nil {
		return r, c.wrap(err, "fuel properties")
	}
	if err := h.Fuel.Validate(); err != nil {
		return r, c.wrap(err, "fuel properties")
	}
	switch {
	case h.OutletT != 0 && h.TargetViscosity != 0:
		return r, c.errf("both an outlet temperature (%.6g °C) and a target viscosity (%.6g cSt) are set; want one of them",
			celsius(h.OutletT), h.TargetViscosity*1e6)
	case h.OutletT != 0:
		if err := c.temp("outlet temperature", h.OutletT); err != nil {
			return r, err
		}
		if h.OutletT < h.InletT {
			return r, c.errf("outlet temperature %.6g °C is below the inlet %.6g °C; want an outlet ≥ inlet (a heater does not cool)",
				celsius(h.OutletT), celsius(h.InletT))
		}
		r.OutletT = h.OutletT
		if h.Fuel.ISO.Viscosity != 0 && h.Fuel.Viscosity2 != (fuel.ViscosityPoint{}) {
			nu, err := h.Fuel.Viscosity(h.OutletT)
			if err != nil {
				return r, c.wrap(err, "viscosity at the outlet %.6g °C", celsius(h.OutletT))
			}
			r.OutletViscosity = nu
		}
	case h.TargetViscosity != 0:
		if !(h.TargetViscosity > 0) || !finite(h.TargetViscosity) {
			return r, c.errf("target viscosity %.6g cSt must be positive and finite", h.TargetViscosity*1e6)
		}
		T, err := h.Fuel.TemperatureForViscosity(h.TargetViscosity)
		if err != nil {
			return r, c.wrap(err, "target viscosity %.6g cSt cannot be reached in the fuel's valid range", h.TargetViscosity*1e6)
		}
		r.OutletFromViscosity = true
		r.OutletViscosity = h.TargetViscosity
		if T <= h.InletT {
			// The oil arrives thinner than the target: the heater is idle.
			r.OutletT = h.InletT
			nu, err := h.Fuel.Viscosity(h.InletT)
			if err == nil {
				r.OutletViscosity = nu
			}
			r.Warnings = append(r.Warnings, fmt.Sprintf(
				"inlet %.6g °C is already above the %.4g °C needed for %.4g cSt; heater idle",
				celsius(h.InletT), celsius(T), h.TargetViscosity*1e6))
			return r, nil
		}
		r.OutletT = T
	default:
		return r, c.errf("neither an outlet temperature nor a target viscosity is set; want one of them")
	}
	if h.OutletLimit != 0 {
		if err := c.temp("outlet limit", h.OutletLimit); err != nil {
			return r, err
		}
		if r.OutletT > h.OutletLimit {
			if r.OutletFromViscosity {
				r.Warnings = append(r.Warnings, fmt.Sprintf(
					"%.4g cSt needs %.4g °C, above the heater outlet limit %.4g °C",
					h.TargetViscosity*1e6, celsius(r.OutletT), celsius(h.OutletLimit)))
			} else {
				r.Warnings = append(r.Warnings, fmt.Sprintf(
					"outlet %.4g °C is above the heater outlet limit %.4g °C",
					celsius(r.OutletT), celsius(h.OutletLimit)))
			}
		}
	}
	if h.FlashPoint != 0 {
		if err := c.temp("flash point", h.FlashPoint); err != nil {
			return r, err
		}
		if h.Service == Transfer && r.OutletT > h.FlashPoint-FlashPointMargin {
			r.Warnings = append(r.Warnings, flashWarning(r.OutletT, h.FlashPoint))
		}
	}
	q, err := fuel.CragoeHeat(sg, h.InletT, r.OutletT)
	if err != nil {
		return r, c.wrap(err, "specific heat")
	}
	r.PerKg = q
	if dT := r.OutletT - h.InletT; dT > 0 {
		r.MeanCp = q / dT
	}
	return r, nil
}

// useFlashWarning is the flash-point caution of a tank by what it holds.
func useFlashWarning(T, flash float64, use TankUse) string {
	where := "within " + fmt.Sprint(FlashPointMargin) + " °C of"
	switch {
	case T > flash+0.05:
		where = fmt.Sprintf("%.3g °C above", T-flash)
	case T >= flash-0.05:
		where = "at"
	}
	switch use {
	case FuelSettling, FuelService:
		kind := "settling"
		if use == FuelService {
			kind = "service"
		}
		return fmt.Sprintf("oil heated to %.4g °C, %s its flash point %.4g °C: SOLAS II-2 reg. 4.2 allows a %s tank so hot only with the arrangements it requires (from memory): check them",
			celsius(T), where, celsius(flash), kind)
	case CargoTank:
		return fmt.Sprintf("cargo heated to %.4g °C, %s its flash point %.4g °C: the cargo's safety data sheet, the charter party's heating instructions and the ship's cargo procedures govern",
			celsius(T), where, celsius(flash))
	}
	return flashWarning(T, flash)
}

func flashWarning(T, flash float64) string {
	if T >= flash {
		return fmt.Sprintf("oil heated to %.4g °C, %.3g °C above its flash point %.4g °C: SOLAS II-2 reg. 4.2 keeps oil in storage tanks at least %g °C below it",
			celsius(T), T-flash, celsius(flash), FlashPointMargin)
	}
	return fmt.Sprintf("oil heated to %.4g °C, within %g °C of its flash point %.4g °C: SOLAS II-2 reg. 4.2 keeps oil in storage tanks at least that far below it",
		celsius(T), FlashPointMargin, celsius(flash))
}
