package combustion

// FlueGasJSON is the JSON form of a FlueGasCheck, as `sim fluegas --json`
// prints it and the scripts' flue_gas{} returns it: temperatures in K,
// specific energies in J/kg, flows in kg (or Nm³) per kg fuel, fractions
// and losses in percent, the unit in each key. Numbers are not rounded.
type FlueGasJSON struct {
	Fuel          string  `json:"fuel"`
	FlueT         float64 `json:"flue_gas_T_K"`
	AirT          float64 `json:"air_T_K"`
	RefT          float64 `json:"reference_T_K"`
	Lambda        float64 `json:"lambda"`
	ExcessAir     float64 `json:"excess_air_pct"`
	StoichAir     float64 `json:"stoich_air_kg_per_kg"`
	StoichFlue    float64 `json:"stoich_flue_gas_kg_per_kg"`
	Air           float64 `json:"air_kg_per_kg"`
	FlueGas       float64 `json:"flue_gas_kg_per_kg"`
	DryFlueGas    float64 `json:"dry_flue_gas_kg_per_kg"`
	FlueGasNm3    float64 `json:"flue_gas_Nm3_per_kg"`
	HumidityRatio float64 `json:"humidity_kg_per_kg_dry_air"`
	CO2Dry        float64 `json:"co2_dry_pct"`
	O2Dry         float64 `json:"o2_dry_pct"`
	SO2Dry        float64 `json:"so2_dry_ppm"`
	N2Dry         float64 `json:"n2_dry_pct"`
	ArDry         float64 `json:"ar_dry_pct"`
	CO2Wet        float64 `json:"co2_wet_pct"`
	O2Wet         float64 `json:"o2_wet_pct"`
	SO2Wet        float64 `json:"so2_wet_ppm"`
	H2OWet        float64 `json:"h2o_wet_pct"`
	N2Wet         float64 `json:"n2_wet_pct"`
	ArWet         float64 `json:"ar_wet_pct"`

	Losses        LossesJSON `json:"losses"`
	LossesHHV     LossesJSON `json:"losses_hhv"`
	EfficiencyLHV float64    `json:"efficiency_lhv_pct"`
	EfficiencyHHV float64    `json:"efficiency_hhv_pct"`

	// AcidDewPoint is null for a fuel without sulfur, or when it could not
	// be computed (a warning says so).
	AcidDewPoint  *float64 `json:"acid_dew_point_K"`
	AcidDewMethod string   `json:"acid_dew_point_method"`
	SO3Conversion float64  `json:"so3_conversion_pct"`
	// Siegert is null when the formula does not apply.
	Siegert          *float64 `json:"siegert_loss_pct"`
	SiegertForm      string   `json:"siegert_form"`
	FlueLossDetailed float64  `json:"dry_gas_plus_moisture_lhv_pct"`

	LHV       float64  `json:"lhv_J_per_kg"`
	HHV       float64  `json:"hhv_J_per_kg"`
	LHVSource string   `json:"lhv_source"`
	HHVSource string   `json:"hhv_source"`
	Warnings  []string `json:"warnings"`
	Caution   string   `json:"caution"`
}

// LossesJSON is one basis of the account, in percent of that basis's
// input. moisture_pct is the sum of the moisture items; the item of the
// atomising steam is present only when the reading has atomising steam.
type LossesJSON struct {
	DryGas        float64 `json:"dry_gas_pct"`
	Moisture      float64 `json:"moisture_pct"`
	MoistureH     float64 `json:"moisture_from_hydrogen_pct"`
	MoistureW     float64 `json:"moisture_from_fuel_water_pct"`
	MoistureAir   float64 `json:"moisture_from_air_pct"`
	MoistureSteam float64 `json:"moisture_from_atomising_steam_pct,omitempty"`
	Radiation     float64 `json:"radiation_pct"`
	Unburnt       float64 `json:"unburnt_pct"`
	CO            float64 `json:"co_pct"`
	Solids        float64 `json:"solids_pct"`
	Credits       float64 `json:"credits_pct"`
	Total         float64 `json:"total_pct"`
}

func lossesJSON(l LossItems) LossesJSON {
	return LossesJSON{
		DryGas: l.DryGas, Moisture: l.Moisture(),
		MoistureH: l.MoistureH, MoistureW: l.MoistureFuel, MoistureAir: l.MoistureAir, MoistureSteam: l.MoistureSteam,
		Radiation: l.Radiation, Unburnt: l.CO + l.Solids, CO: l.CO, Solids: l.Solids,
		Credits: l.TotalCredit, Total: l.TotalLoss,
	}
}

// JSON returns the JSON form of the check, with the Caution.
func (c *FlueGasCheck) JSON() FlueGasJSON {
	p := &c.Products
	xd, xw := &c.Dry, &c.Wet
	l := &c.Losses
	out := FlueGasJSON{
		Fuel:  c.Reading.Fuel.Name,
		FlueT: c.Reading.FlueT, AirT: p.AirT, RefT: l.RefT,
		Lambda: p.Lambda, ExcessAir: 100 * c.ExcessAir,
		StoichAir: p.Stoich.Air, StoichFlue: c.StoichFlueGas,
		Air: p.Air, FlueGas: p.FlueGas, DryFlueGas: p.DryFlueGas,
		FlueGasNm3:    p.NormalVolume(true),
		HumidityRatio: p.HumidityRatio,
		CO2Dry:        100 * xd[CO2], O2Dry: 100 * xd[O2], SO2Dry: 1e6 * xd[SO2],
		N2Dry: 100 * xd[N2], ArDry: 100 * xd[Ar],
		CO2Wet: 100 * xw[CO2], O2Wet: 100 * xw[O2], SO2Wet: 1e6 * xw[SO2],
		H2OWet: 100 * xw[H2O], N2Wet: 100 * xw[N2], ArWet: 100 * xw[Ar],
		Losses:        lossesJSON(l.LHV),
		LossesHHV:     lossesJSON(l.HHV),
		EfficiencyLHV: l.LHV.Efficiency,
		EfficiencyHHV: l.HHV.Efficiency,
		AcidDewMethod: c.DewPoint.Method,
		SO3Conversion: 100 * c.DewPoint.SO3Conversion,
		SiegertForm:   "1. BImSchV, " + c.Siegert.Form + ", " + c.Siegert.Set,
		LHV:           l.LHV.HeatInput, HHV: l.HHV.HeatInput,
		LHVSource: l.LHV.Source.String(), HHVSource: l.HHV.Source.String(),
		Warnings: append([]string{}, c.Warnings...),
		Caution:  Caution,
	}
	out.FlueLossDetailed = out.Losses.DryGas + out.Losses.Moisture
	if c.DewPoint.Known {
		v := c.DewPoint.VerhoffBanchero
		out.AcidDewPoint = &v
	}
	if c.Siegert.Known {
		v := c.Siegert.Loss
		out.Siegert = &v
	}
	return out
}
