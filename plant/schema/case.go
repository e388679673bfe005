package schema

import (
	"sort"

	"steamcase/plant"
)

// Case is one solved load case: the object of "cases" in the run
// document, and the table case() returns to a script. Its keys carry their
// units; they are listed with their meaning in the package documentation.
type Case struct {
	Plant              string        `json:"plant"`
	Source             string        `json:"source"`
	Name               string        `json:"name"`
	Series             string        `json:"series"`
	Converged          bool          `json:"converged"`
	Iterations         int           `json:"iterations"`
	ResidualNorm       float64       `json:"residual_norm"`
	SeaTK              *float64      `json:"sea_T_K"`
	AirTK              *float64      `json:"air_T_K"`
	EngineLoad         float64       `json:"engine_load"`
	BoilersFiring      int           `json:"boilers_firing"`
	Forced             bool          `json:"firing_forced"`
	CanCarry           bool          `json:"can_carry"`
	ShortfallKgH       float64       `json:"shortfall_kg_h"`
	MarginKgH          float64       `json:"margin_kg_h"`
	SteamDemandKgH     float64       `json:"steam_demand_kg_h"`
	SteamProductionKgH float64       `json:"steam_production_kg_h"`
	DumpedKgH          float64       `json:"dumped_kg_h"`
	FuelKgH            float64       `json:"fuel_kg_h"`
	FuelTPerDay        float64       `json:"fuel_t_per_day"`
	CO2TPerDay         float64       `json:"co2_t_per_day"`
	CO2AnalysisTPerDay *float64      `json:"co2_analysis_t_per_day"`
	MakeUpKgH          float64       `json:"makeup_kg_h"`
	BlowdownKgH        float64       `json:"blowdown_kg_h"`
	VentedKgH          float64       `json:"vented_kg_h"`
	CondensateLostKgH  float64       `json:"condensate_lost_kg_h"`
	TrapLossKgH        float64       `json:"trap_loss_kg_h"`
	DrainsReturnedKgH  float64       `json:"drains_returned_kg_h"`
	FeedTankTK         float64       `json:"feed_tank_T_K"`
	ElectricKW         float64       `json:"electric_kW"`
	Balance            Balance       `json:"balance"`
	EGESteamKgH        float64       `json:"ege_steam_kg_h"`
	EGEFuelSavedKgH    float64       `json:"ege_fuel_saved_kg_h"`
	ShedKW             float64       `json:"shed_kW"`
	ShedKgH            float64       `json:"shed_kg_h"`
	PrioritiesGiven    bool          `json:"priorities_given"`
	N1Checked          bool          `json:"n_minus_1_checked"`
	Contingencies      []Contingency `json:"contingencies"`
	InertGas           *InertGas     `json:"inert_gas"`
	LeastFuel          *LeastFuel    `json:"least_fuel"`
	Boilers            []Boiler      `json:"boilers"`
	EGEs               []EGE         `json:"exhaust_gas_economisers"`
	Consumers          []Consumer    `json:"consumers"`
	Units              []Unit        `json:"units"`
	Lines              []Line        `json:"lines"`
	Warnings           []string      `json:"warnings"`
}

// Balance holds a case's balance closures, as computed (not rounded).
type Balance struct {
	MassRel   float64 `json:"mass_rel"`
	EnergyRel float64 `json:"energy_rel"`
}

// Boiler is one oil-fired boiler of a case.
type Boiler struct {
	Name         string  `json:"name"`
	Firing       bool    `json:"firing"`
	Cycling      bool    `json:"cycling"`
	OnFraction   float64 `json:"on_fraction"`
	LoadFraction float64 `json:"load_fraction"`
	MCRKgH       float64 `json:"mcr_kg_h"`
	SteamKgH     float64 `json:"steam_kg_h"`
	FuelKgH      float64 `json:"fuel_kg_h"`
	CO2KgH       float64 `json:"co2_kg_h"`
	CO2Basis     string  `json:"co2_basis"`
	// CO2AnalysisKgH is null when the fuel has no analysis; IMOLCV when it
	// has no IMO fuel type.
	CO2AnalysisKgH *float64 `json:"co2_analysis_kg_h"`
	IMOLCV         *float64 `json:"imo_lcv_J_per_kg"`
	Efficiency     float64  `json:"efficiency"`
	FiringEff      float64  `json:"firing_efficiency"`
	StandbyLossKW  float64  `json:"standby_loss_kW"`
	StandbyOffKW   float64  `json:"standby_off_kW"`
	PurgeKW        float64  `json:"purge_kW"`
	PurgePerStartJ float64  `json:"purge_per_start_J"`
	// StartsPerHour is null when the boiler cycles and its starts are not
	// known (no starts_per_hour, no cycle_band).
	StartsPerHour   *float64 `json:"starts_per_hour"`
	EfficiencyBasis string   `json:"efficiency_basis"`
	Fuel            string   `json:"fuel"`
	FuelLHV         float64  `json:"fuel_lhv_J_per_kg"`
	DrumPPa         float64  `json:"drum_p_Pa"`
	FeedTK          float64  `json:"feed_T_K"`
	SteamDryness    float64  `json:"steam_dryness"`
	BlowdownKgH     float64  `json:"blowdown_kg_h"`
	HeatKW          float64  `json:"heat_kW"`
	// From a combustion model; null for a boiler with a plain efficiency
	// table.
	FlueTK        *float64 `json:"flue_gas_exit_T_K"`
	ExcessAir     *float64 `json:"excess_air"` // λ − 1
	Losses        *Losses  `json:"losses"`
	FanElectricKW float64  `json:"fan_electric_kW"`
	LimitKgH      float64  `json:"limit_kg_h"`
	InertGas      bool     `json:"inert_gas_source"`
	O2Dry         *float64 `json:"o2_dry"`
	DryFlueNm3H   *float64 `json:"dry_flue_gas_Nm3_h"`
}

// LeastFuel is what least-fuel sharing chose against equal sharing.
type LeastFuel struct {
	EqualFuelKgH float64   `json:"equal_fuel_kg_h"`
	SavedKgH     float64   `json:"saved_kg_h"`
	SavedPct     float64   `json:"saved_pct"`
	Firing       []string  `json:"firing"`
	Shares       []float64 `json:"shares"`
	Note         string    `json:"note"`
}

// newLeastFuel is the schema form of least-fuel sharing's answer, or nil.
func newLeastFuel(l *plant.LeastFuelResult) *LeastFuel {
	if l == nil {
		return nil
	}
	out := &LeastFuel{EqualFuelKgH: Round(KgPerH(l.EqualFuelKgS)), SavedKgH: Round(KgPerH(l.SavedKgS)),
		SavedPct: Round(100 * l.SavedFraction()), Firing: append([]string{}, l.Firing...), Shares: make([]float64, 0, len(l.Shares)), Note: l.Note}
	for _, s := range l.Shares {
		out.Shares = append(out.Shares, Round(s))
	}
	return out
}

// InertGas is the inert-gas check of a case with cargo pumps running.
type InertGas struct {
	Sources       []string `json:"sources"`
	Firing        []string `json:"firing"`
	CargoRateM3H  float64  `json:"cargo_rate_m3_h"`
	Capacity      float64  `json:"capacity"`
	RequiredM3H   float64  `json:"required_m3_h"`
	DeliveredNm3H float64  `json:"delivered_Nm3_h"`
	O2Dry         float64  `json:"o2_dry"`
	O2Max         float64  `json:"o2_max"`
	Met           bool     `json:"met"`
	MinLoad       *float64 `json:"min_load_fraction"`
	ExtraSteamKgH float64  `json:"extra_steam_kg_h"`
	ExtraFuelKgH  float64  `json:"extra_fuel_kg_h"`
	Note          string   `json:"note"`
	Line          string   `json:"line"`
}

// newInertGas is the schema form of an inert-gas check, or nil.
func newInertGas(g *plant.InertGasResult) *InertGas {
	if g == nil {
		return nil
	}
	return &InertGas{Sources: append([]string{}, g.Sources...), Firing: append([]string{}, g.Firing...),
		CargoRateM3H: Round(g.CargoRateM3S * 3600), Capacity: Round(g.Capacity), RequiredM3H: Round(g.RequiredM3S * 3600),
		DeliveredNm3H: Round(g.DeliveredNm3S * 3600), O2Dry: Round(g.O2Dry), O2Max: Round(g.O2Max), Met: g.Met,
		MinLoad: roundPtr(g.MinLoad, g.MinLoadFound), ExtraSteamKgH: Round(KgPerH(g.ExtraSteamKgS)),
		ExtraFuelKgH: Round(KgPerH(g.ExtraFuelKgS)), Note: g.Note, Line: plant.InertGasLine(g)}
}

// Losses is a boiler's heat-loss account in percent of the heat input on
// the stated basis.
type Losses struct {
	Basis        string  `json:"basis"`
	DryGasPct    float64 `json:"dry_gas_pct"`
	MoisturePct  float64 `json:"moisture_pct"`
	RadiationPct float64 `json:"radiation_pct"`
	UnburntPct   float64 `json:"unburnt_pct"`
	CreditsPct   float64 `json:"credits_pct"`
	TotalPct     float64 `json:"total_pct"`
}

// EGE is one exhaust-gas economiser of a case.
type EGE struct {
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
	// The site correction of the engine's table.
	TableGasKgS   float64  `json:"table_gas_kg_s"`
	TableGasInTK  float64  `json:"table_gas_in_T_K"`
	IntakeTK      *float64 `json:"intake_air_T_K"`
	CoolantTK     *float64 `json:"coolant_T_K"`
	ExhaustTCorrK float64  `json:"exhaust_T_correction_K"`
	GasFlowFactor float64  `json:"gas_flow_factor"`
	// Size and fouling.
	DesignUA       float64 `json:"design_ua_W_K"`
	UA             float64 `json:"ua_W_K"`
	UAFraction     float64 `json:"ua_fraction"`
	FoulingLostKgH float64 `json:"fouling_lost_steam_kg_h"`
	// The cold end and soot.
	AcidDewTK       *float64 `json:"acid_dew_point_T_K"`
	PreheatWaterInT *float64 `json:"preheat_water_in_T_K"`
	BelowDewMargin  bool     `json:"below_acid_dew_margin"`
	SootRisk        bool     `json:"soot_risk"`
	GasVelocity     *float64 `json:"gas_velocity_m_s"`
}

// Consumer is one steam consumer (or turbine) of a case.
type Consumer struct {
	Name      string  `json:"name"`
	Kind      string  `json:"kind"`
	DutyKW    float64 `json:"duty_kW"`
	SteamKgH  float64 `json:"steam_kg_h"`
	ReturnKgH float64 `json:"condensate_return_kg_h"`
	LostKgH   float64 `json:"condensate_lost_kg_h"`
	CoolerKW  float64 `json:"drain_cooler_kW"`
	CoolerTo  string  `json:"drain_cooler_to"`
	TrapKgH   float64 `json:"trap_loss_kg_h"`
	// Inputs are the figures a computed duty came from, keys with units;
	// absent when the duty was given.
	Inputs map[string]float64 `json:"inputs,omitempty"`
	// The allocation of a shortfall.
	Priority      float64  `json:"priority"`
	PriorityLevel *string  `json:"priority_level"`
	Reducible     bool     `json:"reducible"`
	RequestedKW   float64  `json:"requested_kW"`
	ShedKW        float64  `json:"shed_kW"`
	ShedKgH       float64  `json:"shed_kg_h"`
	CargoM3H      float64  `json:"cargo_m3_h"`
	Cooling       *Cooling `json:"cooling"`
}

// Contingency is one N-1 answer of a case: a single failure and what the
// rest of the plant does about it.
type Contingency struct {
	Name         string              `json:"name"`
	Kind         string              `json:"kind"`
	Units        []string            `json:"units"`
	Solved       bool                `json:"solved"`
	CanCarry     bool                `json:"can_carry"`
	ShortfallKgH float64             `json:"shortfall_kg_h"`
	MarginKgH    float64             `json:"margin_kg_h"`
	ShedKW       float64             `json:"shed_kW"`
	ShedKgH      float64             `json:"shed_kg_h"`
	Boilers      []ContingencyBoiler `json:"boilers"`
	Shed         []Shed              `json:"shed"`
	Note         string              `json:"note"`
	Line         string              `json:"line"`
}

// ContingencyBoiler is a boiler firing after a failure.
type ContingencyBoiler struct {
	Name         string  `json:"name"`
	LoadFraction float64 `json:"load_fraction"`
	SteamKgH     float64 `json:"steam_kg_h"`
	Started      bool    `json:"started"`
}

// Shed is a consumer a contingency's shortfall reduces.
type Shed struct {
	Name          string   `json:"name"`
	Kind          string   `json:"kind"`
	Priority      float64  `json:"priority"`
	PriorityLevel *string  `json:"priority_level"`
	RequestedKW   float64  `json:"requested_kW"`
	ShedKW        float64  `json:"shed_kW"`
	ShedKgH       float64  `json:"shed_kg_h"`
	Cooling       *Cooling `json:"cooling"`
}

// newContingency is the schema form of one N-1 answer.
func newContingency(c plant.ContingencyResult) Contingency {
	out := Contingency{Name: c.Name, Kind: c.Kind, Units: append([]string{}, c.Units...), Solved: c.Solved,
		CanCarry: c.CanCarry, ShortfallKgH: Round(KgPerH(c.ShortfallKgS)), MarginKgH: Round(KgPerH(c.MarginKgS)),
		ShedKW: Round(KW(c.ShedW)), ShedKgH: Round(KgPerH(c.ShedKgS)), Boilers: make([]ContingencyBoiler, 0, len(c.Boilers)),
		Shed: make([]Shed, 0, len(c.Shed)), Note: c.Note, Line: plant.ContingencyLine(c)}
	for _, b := range c.Boilers {
		out.Boilers = append(out.Boilers, ContingencyBoiler{Name: b.Name, LoadFraction: Round(b.LoadFraction),
			SteamKgH: Round(KgPerH(b.SteamKgS)), Started: b.Started})
	}
	for _, s := range c.Shed {
		out.Shed = append(out.Shed, Shed{Name: s.Name, Kind: s.Kind, Priority: Round(s.Priority), PriorityLevel: level(s.Priority),
			RequestedKW: Round(KW(s.RequestedW)), ShedKW: Round(KW(s.ShedW)), ShedKgH: Round(KgPerH(s.ShedKgS)),
			Cooling: newCooling(s.Cooling)})
	}
	return out
}

// Cooling is what a shortfall does to a tank's cargo whose heating is
// reduced.
type Cooling struct {
	RateKPerH   float64  `json:"rate_K_per_h"`
	MinTK       *float64 `json:"min_T_K"`
	HoursToMinT *float64 `json:"hours_to_min_T"`
}

// newCooling is the schema form of a tank's cooling, or nil.
func newCooling(c *plant.TankCooling) *Cooling {
	if c == nil {
		return nil
	}
	out := &Cooling{RateKPerH: Round(c.RateKS * 3600), MinTK: roundPtr(c.MinT, c.MinT > 0)}
	out.HoursToMinT = roundPtr(c.SecondsToMinT/3600, c.MinT > 0 && c.Reaches)
	return out
}

// level is a priority's level name, or null.
func level(v float64) *string {
	if n := plant.PriorityLevelName(v); n != "" {
		return &n
	}
	return nil
}

// Unit is any other unit with its figures, each key carrying its SI unit.
type Unit struct {
	Name    string   `json:"name"`
	Kind    string   `json:"kind"`
	Figures []Figure `json:"figures"`
}

// Figure is one named figure of a unit.
type Figure struct {
	Key   string  `json:"key"`
	Value float64 `json:"value"`
}

// Line is one line's solved state.
type Line struct {
	Name string   `json:"name"`
	M    float64  `json:"m_kg_s"`
	P    float64  `json:"p_Pa"`
	T    float64  `json:"T_K"`
	H    float64  `json:"h_J_per_kg"`
	X    *float64 `json:"x"` // null when single-phase
}

// temperature is a condition's temperature in K, or null when the case
// did not give it: plant.Conditions holds zero (0 K) for a temperature not
// given.
func temperature(k float64) *float64 { return roundPtr(k, k > 0) }

// NewCase returns the schema form of a case solved on the plant called
// plantName: the figures in the units their keys name, each rounded by
// Round (the solver's residual_norm and the balance closures excepted:
// they are given as computed), a temperature the case did not give as
// null, and every list present (empty, not null).
func NewCase(plantName string, cr *plant.CaseResult) Case {
	j := Case{
		Plant:              plantName,
		Source:             cr.Pos.String(),
		Name:               cr.Name,
		Series:             cr.Series,
		Converged:          cr.Converged,
		Iterations:         cr.Iterations,
		ResidualNorm:       cr.ResidualNorm,
		SeaTK:              temperature(cr.Conditions.SeaT),
		AirTK:              temperature(cr.Conditions.AirT),
		EngineLoad:         Round(cr.Conditions.EngineLoad),
		BoilersFiring:      cr.BoilersFiring,
		Forced:             cr.Forced,
		CanCarry:           cr.CanCarry,
		ShortfallKgH:       Round(KgPerH(cr.ShortfallKgS)),
		MarginKgH:          Round(KgPerH(cr.MarginNextKgS)),
		SteamDemandKgH:     Round(KgPerH(cr.SteamDemandKgS)),
		SteamProductionKgH: Round(KgPerH(cr.SteamProductionKgS)),
		DumpedKgH:          Round(KgPerH(cr.DumpedKgS)),
		FuelKgH:            Round(KgPerH(cr.FuelKgS)),
		FuelTPerDay:        Round(TPerDay(cr.FuelKgS)),
		CO2TPerDay:         Round(TPerDay(cr.CO2KgS)),
		CO2AnalysisTPerDay: roundPtr(TPerDay(cr.CO2AnalysisKgS), !cr.CO2AnalysisUnknown),
		MakeUpKgH:          Round(KgPerH(cr.MakeUpKgS)),
		BlowdownKgH:        Round(KgPerH(cr.BlowdownKgS)),
		VentedKgH:          Round(KgPerH(cr.VentedKgS)),
		CondensateLostKgH:  Round(KgPerH(cr.CondensateLostKgS)),
		TrapLossKgH:        Round(KgPerH(cr.TrapLossKgS)),
		DrainsReturnedKgH:  Round(KgPerH(cr.DrainsReturnedKgS)),
		FeedTankTK:         Round(cr.FeedTankT),
		ElectricKW:         Round(KW(cr.ElectricW)),
		Balance:            Balance{MassRel: cr.Balance.MassRel, EnergyRel: cr.Balance.EnergyRel},
		EGESteamKgH:        Round(KgPerH(cr.EGESteamKgS)),
		EGEFuelSavedKgH:    Round(KgPerH(cr.EGEFuelSavedKgS)),
		ShedKW:             Round(KW(cr.ShedW)),
		ShedKgH:            Round(KgPerH(cr.ShedKgS)),
		PrioritiesGiven:    cr.PrioritiesGiven,
		N1Checked:          cr.ContingenciesChecked,
		Contingencies:      make([]Contingency, 0, len(cr.Contingencies)),
		InertGas:           newInertGas(cr.InertGas),
		LeastFuel:          newLeastFuel(cr.LeastFuel),
		Boilers:            make([]Boiler, 0, len(cr.Boilers)),
		EGEs:               make([]EGE, 0, len(cr.EGEs)),
		Consumers:          make([]Consumer, 0, len(cr.Consumers)),
		Units:              make([]Unit, 0, len(cr.Units)),
		Lines:              make([]Line, 0, len(cr.Lines)),
		Warnings:           append([]string{}, cr.Warnings...),
	}
	for _, c := range cr.Contingencies {
		j.Contingencies = append(j.Contingencies, newContingency(c))
	}
	for _, b := range cr.Boilers {
		bj := Boiler{
			Name: b.Name, Firing: b.Firing, Cycling: b.Cycling, OnFraction: Round(b.OnFraction),
			LoadFraction: Round(b.LoadFraction), MCRKgH: Round(KgPerH(b.MCRKgS)), SteamKgH: Round(KgPerH(b.SteamKgS)),
			FuelKgH: Round(KgPerH(b.FuelKgS)), Efficiency: Round(b.Efficiency), EfficiencyBasis: b.EfficiencyBasis,
			Fuel: b.FuelName, FuelLHV: Round(b.FuelLHV), DrumPPa: Round(b.DrumP), FeedTK: Round(b.FeedT),
			SteamDryness: Round(b.SteamDryness), BlowdownKgH: Round(KgPerH(b.BlowdownKgS)), HeatKW: Round(KW(b.HeatW)),
			FanElectricKW: Round(KW(b.FanElectricW)), LimitKgH: Round(KgPerH(b.LimitKgS)), InertGas: b.InertGasSource,
			O2Dry: roundPtr(b.O2Dry, b.DryFlueNm3S > 0), DryFlueNm3H: roundPtr(b.DryFlueNm3S*3600, b.DryFlueNm3S > 0),
			CO2KgH: Round(KgPerH(b.CO2KgS)), CO2Basis: co2Basis(b.CO2Basis),
			CO2AnalysisKgH: roundPtr(KgPerH(b.CO2AnalysisKgS), b.HasCO2Analysis),
			IMOLCV:         roundPtr(b.IMOLCV, b.IMOLCV > 0),
			FiringEff:      Round(b.FiringEfficiency), StandbyLossKW: Round(KW(b.StandbyLossW)),
			StandbyOffKW: Round(KW(b.StandbyOffW)), PurgeKW: Round(KW(b.PurgeW)), PurgePerStartJ: Round(b.PurgePerStartJ),
			StartsPerHour: roundPtr(b.StartsPerHour, !b.Cycling || b.StartsPerHour > 0),
		}
		if b.FlueT > 0 {
			bj.FlueTK = roundPtr(b.FlueT, true)
			bj.ExcessAir = roundPtr(b.Lambda-1, true)
		}
		if l := b.Losses; l != nil {
			bj.Losses = &Losses{
				Basis:        "LHV",
				DryGasPct:    Round(l.DryGas),
				MoisturePct:  Round(l.Moisture()),
				RadiationPct: Round(l.Radiation),
				UnburntPct:   Round(l.CO + l.Solids),
				CreditsPct:   Round(l.TotalCredit),
				TotalPct:     Round(l.TotalLoss - l.TotalCredit),
			}
		}
		j.Boilers = append(j.Boilers, bj)
	}
	for _, e := range cr.EGEs {
		j.EGEs = append(j.EGEs, EGE{
			Name: e.Name, InService: e.InService, SteamKgH: Round(KgPerH(e.SteamKgS)), DutyKW: Round(KW(e.DutyW)),
			GasKgS: Round(e.GasKgS), GasInTK: Round(e.GasInT), GasOutTK: Round(e.GasOutT), PinchK: Round(e.Pinch),
			BypassFraction: Round(e.BypassFraction), PreheatKW: Round(KW(e.PreheatW)), EvaporatorOutT: Round(evapOut(e)),
			BelowMinGasT: e.BelowMin, FuelSavedKgH: Round(KgPerH(e.FuelSavedKgS)),
			TableGasKgS: Round(e.TableGasKgS), TableGasInTK: Round(e.TableGasInT),
			IntakeTK: temperature(e.IntakeT), CoolantTK: temperature(e.CoolantT),
			ExhaustTCorrK: Round(e.ExhaustTCorrection), GasFlowFactor: Round(gasFactor(e)),
			DesignUA: Round(e.DesignUA), UA: Round(e.UA), UAFraction: Round(e.UAFraction),
			FoulingLostKgH: Round(KgPerH(e.FoulingLostKgS)),
			AcidDewTK:      temperature(e.AcidDewT), PreheatWaterInT: temperature(e.PreheatWaterInT),
			BelowDewMargin: e.BelowDewMargin, SootRisk: e.SootRisk, GasVelocity: roundPtr(e.GasVelocity, e.GasVelocity > 0),
		})
	}
	for _, c := range cr.Consumers {
		j.Consumers = append(j.Consumers, Consumer{
			Name: c.Name, Kind: c.Kind, DutyKW: Round(KW(c.DutyW)), SteamKgH: Round(KgPerH(c.SteamKgS)),
			ReturnKgH: Round(KgPerH(c.ReturnKgS)), LostKgH: Round(KgPerH(c.LostKgS)), CoolerKW: Round(KW(c.DrainCoolerW)),
			CoolerTo: c.DrainCoolerTo, TrapKgH: Round(KgPerH(c.TrapLossKgS)),
			Inputs: roundMap(c.Inputs), Priority: Round(c.Priority), PriorityLevel: level(c.Priority),
			Reducible: c.Reducible, RequestedKW: Round(KW(c.RequestedW)), ShedKW: Round(KW(c.ShedW)),
			ShedKgH: Round(KgPerH(c.ShedKgS)), CargoM3H: Round(c.CargoRate * 3600), Cooling: newCooling(c.Cooling),
		})
	}
	for _, u := range cr.Units {
		uj := Unit{Name: u.Name, Kind: u.Kind, Figures: make([]Figure, 0, len(u.Figures))}
		for _, f := range u.Figures {
			uj.Figures = append(uj.Figures, Figure{Key: f.Key, Value: Round(f.Value)})
		}
		sort.Slice(uj.Figures, func(a, b int) bool { return uj.Figures[a].Key < uj.Figures[b].Key })
		j.Units = append(j.Units, uj)
	}
	for _, l := range cr.Lines {
		lj := Line{Name: l.Name, M: Round(l.M), P: Round(l.P), T: Round(l.T), H: Round(l.H)}
		lj.X = roundPtr(l.X, l.TwoPhase)
		j.Lines = append(j.Lines, lj)
	}
	return j
}

// co2Basis names the factor of a boiler's regulatory CO2: the fuel's own
// statement, or, for a fuel a script gave by its LHV and CO2 factor,
// "given co2_factor".
func co2Basis(s string) string {
	if s == "" {
		return "given co2_factor"
	}
	return s
}

func roundMap(m map[string]float64) map[string]float64 {
	if len(m) == 0 {
		return nil
	}
	out := make(map[string]float64, len(m))
	for k, v := range m {
		out[k] = Round(v)
	}
	return out
}

// gasFactor is the site correction's factor on the gas flow: 1 when
// there is none (and in an outline).
func gasFactor(e plant.EGEResult) float64 {
	if e.GasFlowFactor == 0 {
		return 1
	}
	return e.GasFlowFactor
}

// evapOut is the gas temperature leaving the evaporator: the outlet itself
// when there is no preheating section.
func evapOut(e plant.EGEResult) float64 {
	if e.PreheatW > 0 {
		return e.EvaporatorOutT
	}
	return e.GasOutT
}
