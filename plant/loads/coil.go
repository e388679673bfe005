package loads

import (
	"fmt"
	"math"

	"steamcase/plant/fuel"
)

// CoilKind says how a tank's heating coil meets the cargo.
type CoilKind int

const (
	// SteamCoil is a steam coil inside the tank: steam condenses in the
	// pipes at its saturation temperature, the cargo around them is well
	// mixed at one temperature.
	SteamCoil CoilKind = iota
	// DeckHeater is a heat exchanger on deck through which a pump
	// circulates the cargo (Circulation, m³/s) from the tank and back.
	DeckHeater
)

// String returns "coil" or "deck_heater", as scripts write them.
func (k CoilKind) String() string {
	switch k {
	case SteamCoil:
		return "coil"
	case DeckHeater:
		return "deck_heater"
	}
	return fmt.Sprintf("CoilKind(%d)", int(k))
}

// Default overall heat-transfer coefficients of heating coils, W/(m²·K).
//
//   - DefaultCoilU, a steam coil in the tank: 60 W/(m²·K), chosen within
//     the indicative 30–150 W/(m²·K) of "Steam coil to oil (sizing)" in
//     docs/reference/plant-checks.md §6 [M] (heavy oils at the low end, crude higher):
//     common practice, no source. The oil side in natural convection
//     governs.
//   - DefaultDeckHeaterU, a deck heater with the cargo pumped through it:
//     250 W/(m²·K), from memory (forced flow of oil on one side,
//     condensing steam on the other); no published value was confirmed.
//
// Either is a fixed input the caller may replace (Coil.U).
const (
	DefaultCoilU       = 60.0
	DefaultDeckHeaterU = 250.0
)

// DefaultMaxHeatUpRate is the heat-up rate above which a heat-up gives a
// warning (not a cap): 3 K per day, the upper end of the 1–3 K per day
// that is common practice for large heated cargoes (common practice, no
// source), in K/s.
const DefaultMaxHeatUpRate = 3.0 / 86400

// Coil is a tank's heating coil: its kind, its heating surface and its
// overall U (zero means DefaultCoilU or DefaultDeckHeaterU). A deck
// heater also needs the cargo's circulation (m³/s). The U is a fixed
// input: this package does not compute the film coefficients of the
// coil, and fouling of the coil is in the U the caller gives.
type Coil struct {
	Kind        CoilKind
	Area        float64 // m²
	U           float64 // W/(m²·K); zero: the kind's default
	Circulation float64 // m³/s, a deck heater's cargo flow
}

// Given reports whether a coil is described (an area above zero).
func (c Coil) Given() bool { return c.Area > 0 }

// u returns the coil's U or its kind's default.
func (c Coil) u() float64 {
	if c.U > 0 {
		return c.U
	}
	if c.Kind == DeckHeater {
		return DefaultDeckHeaterU
	}
	return DefaultCoilU
}

// UA returns U·A of the coil (W/K).
func (c Coil) UA() float64 { return c.u() * c.Area }

// CoilDuty is what a coil can give at one cargo temperature.
type CoilDuty struct {
	// Q is the coil's capacity (W): U·A·LMTD.
	Q float64
	// LMTD is the log-mean temperature difference between the steam and
	// the cargo (K).
	LMTD float64
	// UA of the coil (W/K).
	UA float64
	// SteamT and CargoT are the steam's saturation temperature and the
	// cargo's temperature in the tank (K).
	SteamT, CargoT float64
	// OutletT is the temperature the cargo leaves a deck heater at (K);
	// for a coil in the tank it is CargoT.
	OutletT float64
}

func (t *TankHeating) checkCoil(c checker) error {
	cl := t.Coil
	if !(cl.Area >= 0) || math.IsInf(cl.Area, 0) {
		return c.errf("coil area %.6g m² is negative or not finite; want an area ≥ 0 m²", cl.Area)
	}
	if !(cl.U >= 0) || math.IsInf(cl.U, 0) {
		return c.errf("coil U %.6g W/(m²·K) is negative or not finite; want U ≥ 0 W/(m²·K) (0: the default)", cl.U)
	}
	switch cl.Kind {
	case SteamCoil:
	case DeckHeater:
		if cl.Area > 0 {
			if err := c.positive("deck heater circulation", cl.Circulation, "m³/s"); err != nil {
				return err
			}
		}
	default:
		return c.errf("coil kind %d is unknown; want SteamCoil or DeckHeater", int(cl.Kind))
	}
	return nil
}

// CoilCapacity returns the heat the tank's coil can give with the cargo
// at T and steam saturated at steamT (K), by U·A·LMTD (heat exchanger
// textbooks, e.g. Incropera and DeWitt, Fundamentals of Heat and Mass
// Transfer, ch. 11):
//
//   - a steam coil in the tank: the steam condenses at steamT all along
//     the coil and the cargo around it is at T, so both ends of the coil
//     see the same difference and LMTD = steamT − T. The subcooling of the
//     condensate at the coil's end is not counted as heating surface;
//   - a deck heater: the cargo enters at T and leaves at T_out with the
//     steam condensing at steamT on the other side, so
//     LMTD = (T_out − T)/ln((steamT − T)/(steamT − T_out)), and with
//     ṁ = ρ·circulation, NTU = U·A/(ṁ·c), ε = 1 − exp(−NTU) (one stream
//     at constant temperature, Incropera eq. 11.35a) the duty
//     Q = ε·ṁ·c·(steamT − T) = U·A·LMTD, c by Cragoe at T.
//
// Cargo at or above the steam temperature takes nothing from the coil.
func (t *TankHeating) CoilCapacity(T, steamT float64) (CoilDuty, error) {
	c := checker{KindTankHeating, t.Name}
	if err := t.checkCoil(c); err != nil {
		return CoilDuty{}, err
	}
	if err := c.temp("cargo temperature", T); err != nil {
		return CoilDuty{}, err
	}
	if err := c.temp("steam temperature at the coil", steamT); err != nil {
		return CoilDuty{}, err
	}
	r := CoilDuty{UA: t.Coil.UA(), SteamT: steamT, CargoT: T, OutletT: T}
	if !t.Coil.Given() || T >= steamT {
		return r, nil
	}
	dT := steamT - T
	switch t.Coil.Kind {
	case SteamCoil:
		r.LMTD = dT
		r.Q = r.UA * dT
	case DeckHeater:
		cp, err := t.Cargo.cp(T)
		if err != nil {
			return CoilDuty{}, c.wrap(err, "%s specific heat", t.Cargo.label())
		}
		mc := t.Cargo.Density * t.Coil.Circulation * cp
		eps := -math.Expm1(-r.UA / mc)
		r.Q = eps * mc * dT
		r.OutletT = T + r.Q/mc
		dOut := steamT - r.OutletT
		if dOut > 0 && dOut < dT {
			r.LMTD = (dT - dOut) / math.Log(dT/dOut)
		} else {
			r.LMTD = dT
		}
	}
	if !finite(r.Q, r.LMTD, r.OutletT) {
		return CoilDuty{}, c.overflow("coil capacity")
	}
	return r, nil
}

// SpecFlashPoint returns the lowest flash point a fuel grade's
// specification allows (K), and whether there is one: 60 °C for the
// distillate grades DMA, DMZ and DMB and for every residual grade
// RMA–RMK of ISO 8217:2017 (Tables 1 and 2, from memory; the same 60 °C
// is SOLAS II-2 reg. 4.2's limit for fuel oil, docs/reference/plant-checks.md §5.2 [S]).
// A gas has none. DMX (43 °C) is not a built-in grade and is not assumed.
// A tank of a fuel grade whose flash point is not given is checked against
// it, and its warning says the figure was assumed.
func SpecFlashPoint(f fuel.Fuel) (float64, bool) {
	switch f.Class {
	case fuel.Distillate, fuel.Residual:
		return 60 + 273.15, true
	}
	return 0, false
}
