package report

import (
	"encoding/csv"
	"io"
	"strconv"
)

// csvHeader names the CSV columns, each with its unit.
var csvHeader = [...]string{
	"case", "plant", "sea_T_C", "air_T_C", "engine_load_pct",
	"boilers_firing", "can_carry", "shortfall_kg_h", "steam_demand_kg_h",
	"steam_production_kg_h", "fuel_kg_h", "fuel_t_per_day", "co2_t_per_day",
	"makeup_kg_h", "electric_kW", "margin_kg_h", "warnings",
}

// CSV writes a header row and one row per load case of the run with the
// main figures (the voyages, studies and audits are in the table and the
// JSON):
//
//	case, plant                      names
//	sea_T_C, air_T_C                 °C, one decimal
//	engine_load_pct                  % of the main engine's MCR, one decimal
//	boilers_firing                   count
//	can_carry                        true or false
//	shortfall_kg_h, steam_demand_kg_h, steam_production_kg_h,
//	fuel_kg_h, makeup_kg_h, margin_kg_h   kg/h, one decimal
//	fuel_t_per_day                   t/day, three decimals
//	co2_t_per_day                    t/day, two decimals
//	electric_kW                      kW, one decimal
//	warnings                         how many warnings the case has
//
// The caution is not part of the CSV (it would break the table); a
// program that shows these figures to people must show it.
func CSV(w io.Writer, run Run) error {
	cw := csv.NewWriter(w)
	if err := cw.Write(csvHeader[:]); err != nil {
		return err
	}
	for _, c := range run.Cases {
		r := c.Result
		row := [...]string{
			r.Name, c.Plant,
			fix(r.Conditions.SeaT-273.15, 1), fix(r.Conditions.AirT-273.15, 1), fix(r.Conditions.EngineLoad*100, 1),
			strconv.Itoa(r.BoilersFiring), strconv.FormatBool(r.CanCarry),
			fix(r.ShortfallKgS*kgh, 1), fix(r.SteamDemandKgS*kgh, 1), fix(r.SteamProductionKgS*kgh, 1),
			fix(r.FuelKgS*kgh, 1), fix(r.FuelKgS*86.4, 3), fix(r.CO2KgS*86.4, 2),
			fix(r.MakeUpKgS*kgh, 1), fix(r.ElectricW/1e3, 1), fix(r.MarginNextKgS*kgh, 1),
			strconv.Itoa(len(r.Warnings)),
		}
		if err := cw.Write(row[:]); err != nil {
			return err
		}
	}
	cw.Flush()
	return cw.Error()
}
