package plant

import (
	"math"
	"sort"
)

// SchemaVersion is the version of the JSON form of a case result. It
// changes only when a key is removed or changes meaning; new keys may be
// added without a change.
const SchemaVersion = 1

// CaseJSON is the JSON form of a CaseResult. Its keys carry their units;
// the schema is documented in the README and kept stable.
type CaseJSON struct {
	Name               string         `json:"name"`
	Converged          bool           `json:"converged"`
	Iterations         int            `json:"iterations"`
	ResidualNorm       float64        `json:"residual_norm"`
	SeaTK              float64        `json:"sea_T_K"`
	AirTK              float64        `json:"air_T_K"`
	EngineLoad         float64        `json:"engine_load"`
	BoilersFiring      int            `json:"boilers_firing"`
	Forced             bool           `json:"firing_forced"`
	CanCarry           bool           `json:"can_carry"`
	ShortfallKgH       float64        `json:"shortfall_kg_h"`
	MarginNextKgH      float64        `json:"margin_kg_h"`
	SteamDemandKgH     float64        `json:"steam_demand_kg_h"`
	SteamProductionKgH float64        `json:"steam_production_kg_h"`
	DumpedKgH          float64        `json:"dumped_kg_h"`
	FuelKgH            float64        `json:"fuel_kg_h"`
	FuelTPerDay        float64        `json:"fuel_t_per_day"`
	CO2TPerDay         float64        `json:"co2_t_per_day"`
	MakeUpKgH          float64        `json:"makeup_kg_h"`
	BlowdownKgH        float64        `json:"blowdown_kg_h"`
	VentedKgH          float64        `json:"vented_kg_h"`
	CondensateLostKgH  float64        `json:"condensate_lost_kg_h"`
	FeedTankTK         float64        `json:"feed_tank_T_K"`
	ElectricKW         float64        `json:"electric_kW"`
	Balance            BalanceJSON    `json:"balance"`
	EGESteamKgH        float64        `json:"ege_steam_kg_h"`
	EGEFuelSavedKgH    float64        `json:"ege_fuel_saved_kg_h"`
	Boilers            []BoilerJSON   `json:"boilers"`
	EGEs               []EGEJSON      `json:"exhaust_gas_economisers"`
	Consumers          []ConsumerJSON `json:"consumers"`
	Units              []UnitJSON     `json:"units"`
	Lines              []LineJSON     `json:"lines"`
	Warnings           []string       `json:"warnings"`
}

// EGEJSON is one exhaust-gas economiser in the JSON form.
type EGEJSON struct {
	Name           string  `json:"name"`
	InService      bool    `json:"in_service"`
	SteamKgH       float64 `json:"steam_kg_h"`
	DutyKW         float64 `json:"duty_kW"`
	GasKgS         float64 `json:"gas_kg_s"`
	GasInTK        float64 `json:"gas_in_T_K"`
	GasOutTK       float64 `json:"gas_out_T_K"`
	PinchK         float64 `json:"pinch_K"`
	BypassFraction float64 `json:"bypass_fraction"`
	PreheatKW      float64 `json:"preheat_kW"`
	EvaporatorOutT float64 `json:"evaporator_gas_out_T_K"`
	BelowMinGasT   bool    `json:"below_min_gas_T"`
	FuelSavedKgH   float64 `json:"fuel_saved_kg_h"`
}

// BalanceJSON holds the balance closures.
type BalanceJSON struct {
	MassRel   float64 `json:"mass_rel"`
	EnergyRel float64 `json:"energy_rel"`
}

// BoilerJSON is one boiler in the JSON form.
type BoilerJSON struct {
	Name            string  `json:"name"`
	Firing          bool    `json:"firing"`
	Cycling         bool    `json:"cycling"`
	OnFraction      float64 `json:"on_fraction"`
	LoadFraction    float64 `json:"load_fraction"`
	MCRKgH          float64 `json:"mcr_kg_h"`
	SteamKgH        float64 `json:"steam_kg_h"`
	FuelKgH         float64 `json:"fuel_kg_h"`
	Efficiency      float64 `json:"efficiency"`
	EfficiencyBasis string  `json:"efficiency_basis"`
	Fuel            string  `json:"fuel"`
	FuelLHV         float64 `json:"fuel_lhv_J_per_kg"`
	DrumPPa         float64 `json:"drum_p_Pa"`
	FeedTK          float64 `json:"feed_T_K"`
	SteamDryness    float64 `json:"steam_dryness"`
	BlowdownKgH     float64 `json:"blowdown_kg_h"`
	HeatKW          float64 `json:"heat_kW"`
	// From a combustion model; null for a boiler with a plain efficiency
	// table.
	FlueTK        *float64    `json:"flue_gas_exit_T_K"`
	ExcessAir     *float64    `json:"excess_air"` // λ − 1
	Losses        *LossesJSON `json:"losses"`
	FanElectricKW float64     `json:"fan_electric_kW"`
}

// LossesJSON is a boiler's heat-loss account in percent of the heat input
// on the stated basis.
type LossesJSON struct {
	Basis        string  `json:"basis"`
	DryGasPct    float64 `json:"dry_gas_pct"`
	MoisturePct  float64 `json:"moisture_pct"`
	RadiationPct float64 `json:"radiation_pct"`
	UnburntPct   float64 `json:"unburnt_pct"`
	CreditsPct   float64 `json:"credits_pct"`
	TotalPct     float64 `json:"total_pct"`
}

// ConsumerJSON is one consumer in the JSON form.
type ConsumerJSON struct {
	Name      string  `json:"name"`
	Kind      string  `json:"kind"`
	DutyKW    float64 `json:"duty_kW"`
	SteamKgH  float64 `json:"steam_kg_h"`
	ReturnKgH float64 `json:"condensate_return_kg_h"`
	LostKgH   float64 `json:"condensate_lost_kg_h"`
	CoolerKW  float64 `json:"drain_cooler_kW"`
	// Inputs are the figures a computed duty came from, keys with units.
	Inputs map[string]float64 `json:"inputs,omitempty"`
}

// UnitJSON is one other unit with its figures, each key carrying its SI
// unit.
type UnitJSON struct {
	Name    string       `json:"name"`
	Kind    string       `json:"kind"`
	Figures []FigureJSON `json:"figures"`
}

// FigureJSON is one named figure of a unit.
type FigureJSON struct {
	Key   string  `json:"key"`
	Value float64 `json:"value"`
}

// LineJSON is one line's solved state.
type LineJSON struct {
	Name string   `json:"name"`
	M    float64  `json:"m_kg_s"`
	P    float64  `json:"p_Pa"`
	T    float64  `json:"T_K"`
	H    float64  `json:"h_J_per_kg"`
	X    *float64 `json:"x"` // null when single-phase
}

// JSON returns the case result in its documented JSON form. Numbers are
// rounded to the digits that carry meaning, so that the output is stable
// across platforms.
func (cr *CaseResult) JSON() CaseJSON {
	const h = 3600
	j := CaseJSON{
		Name:               cr.Name,
		Converged:          cr.Converged,
		Iterations:         cr.Iterations,
		ResidualNorm:       cr.ResidualNorm,
		SeaTK:              r6(cr.Conditions.SeaT),
		AirTK:              r6(cr.Conditions.AirT),
		EngineLoad:         r6(cr.Conditions.EngineLoad),
		BoilersFiring:      cr.BoilersFiring,
		Forced:             cr.Forced,
		CanCarry:           cr.CanCarry,
		ShortfallKgH:       r6(cr.ShortfallKgS * h),
		MarginNextKgH:      r6(cr.MarginNextKgS * h),
		SteamDemandKgH:     r6(cr.SteamDemandKgS * h),
		SteamProductionKgH: r6(cr.SteamProductionKgS * h),
		DumpedKgH:          r6(cr.DumpedKgS * h),
		FuelKgH:            r6(cr.FuelKgS * h),
		FuelTPerDay:        r6(cr.FuelKgS * 86.4),
		CO2TPerDay:         r6(cr.CO2KgS * 86.4),
		MakeUpKgH:          r6(cr.MakeUpKgS * h),
		BlowdownKgH:        r6(cr.BlowdownKgS * h),
		VentedKgH:          r6(cr.VentedKgS * h),
		CondensateLostKgH:  r6(cr.CondensateLostKgS * h),
		FeedTankTK:         r6(cr.FeedTankT),
		ElectricKW:         r6(cr.ElectricW / 1e3),
		Balance:            BalanceJSON{MassRel: cr.Balance.MassRel, EnergyRel: cr.Balance.EnergyRel},
		EGESteamKgH:        r6(cr.EGESteamKgS * h),
		EGEFuelSavedKgH:    r6(cr.EGEFuelSavedKgS * h),
		Boilers:            []BoilerJSON{},
		EGEs:               []EGEJSON{},
		Consumers:          []ConsumerJSON{},
		Units:              []UnitJSON{},
		Lines:              []LineJSON{},
		Warnings:           append([]string{}, cr.Warnings...),
	}
	for _, b := range cr.Boilers {
		bj := BoilerJSON{
			Name: b.Name, Firing: b.Firing, Cycling: b.Cycling, OnFraction: r6(b.OnFraction),
			LoadFraction: r6(b.LoadFraction), MCRKgH: r6(b.MCRKgS * h), SteamKgH: r6(b.SteamKgS * h),
			FuelKgH: r6(b.FuelKgS * h), Efficiency: r6(b.Efficiency), EfficiencyBasis: b.EfficiencyBasis,
			Fuel: b.FuelName, FuelLHV: r6(b.FuelLHV), DrumPPa: r6(b.DrumP), FeedTK: r6(b.FeedT),
			SteamDryness: r6(b.SteamDryness), BlowdownKgH: r6(b.BlowdownKgS * h), HeatKW: r6(b.HeatW / 1e3),
			FanElectricKW: r6(b.FanElectricW / 1e3),
		}
		if b.FlueT > 0 {
			t, ea := r6(b.FlueT), r6(b.Lambda-1)
			bj.FlueTK, bj.ExcessAir = &t, &ea
		}
		if l := b.Losses; l != nil {
			bj.Losses = &LossesJSON{
				Basis:        "LHV",
				DryGasPct:    r6(l.DryGas),
				MoisturePct:  r6(l.Moisture()),
				RadiationPct: r6(l.Radiation),
				UnburntPct:   r6(l.CO + l.Solids),
				CreditsPct:   r6(l.TotalCredit),
				TotalPct:     r6(l.TotalLoss - l.TotalCredit),
			}
		}
		j.Boilers = append(j.Boilers, bj)
	}
	for _, e := range cr.EGEs {
		j.EGEs = append(j.EGEs, EGEJSON{
			Name: e.Name, InService: e.InService, SteamKgH: r6(e.SteamKgS * h), DutyKW: r6(e.DutyW / 1e3),
			GasKgS: r6(e.GasKgS), GasInTK: r6(e.GasInT), GasOutTK: r6(e.GasOutT), PinchK: r6(e.Pinch),
			BypassFraction: r6(e.BypassFraction), PreheatKW: r6(e.PreheatW / 1e3), EvaporatorOutT: r6(evapOut(e)),
			BelowMinGasT: e.BelowMin, FuelSavedKgH: r6(e.FuelSavedKgS * h),
		})
	}
	for _, c := range cr.Consumers {
		j.Consumers = append(j.Consumers, ConsumerJSON{
			Name: c.Name, Kind: c.Kind, DutyKW: r6(c.DutyW / 1e3), SteamKgH: r6(c.SteamKgS * h),
			ReturnKgH: r6(c.ReturnKgS * h), LostKgH: r6(c.LostKgS * h), CoolerKW: r6(c.DrainCoolerW / 1e3), Inputs: roundMap(c.Inputs),
		})
	}
	for _, u := range cr.Units {
		uj := UnitJSON{Name: u.Name, Kind: u.Kind, Figures: []FigureJSON{}}
		for _, f := range u.Figures {
			uj.Figures = append(uj.Figures, FigureJSON{Key: f.Key, Value: r6(f.Value)})
		}
		sort.Slice(uj.Figures, func(a, b int) bool { return uj.Figures[a].Key < uj.Figures[b].Key })
		j.Units = append(j.Units, uj)
	}
	for _, l := range cr.Lines {
		lj := LineJSON{Name: l.Name, M: r6(l.M), P: r6(l.P), T: r6(l.T), H: r6(l.H)}
		if l.TwoPhase {
			x := r6(l.X)
			lj.X = &x
		}
		j.Lines = append(j.Lines, lj)
	}
	return j
}

// r6 rounds to six significant digits, and a value within 1e-9 of zero to
// zero, so that reports do not show solver noise (-0.000000001 kg/h).
func r6(v float64) float64 {
	if !finite(v) {
		return v
	}
	if math.Abs(v) < 1e-9 {
		return 0
	}
	e := math.Floor(math.Log10(math.Abs(v)))
	f := math.Pow(10, 5-e)
	return math.Round(v*f) / f
}

func roundMap(m map[string]float64) map[string]float64 {
	if len(m) == 0 {
		return nil
	}
	out := make(map[string]float64, len(m))
	for k, v := range m {
		out[k] = r6(v)
	}
	return out
}

// evapOut is the gas temperature leaving the evaporator: the outlet itself
// when there is no preheating section.
func evapOut(e EGEResult) float64 {
	if e.PreheatW > 0 {
		return e.EvaporatorOutT
	}
	return e.GasOutT
}
