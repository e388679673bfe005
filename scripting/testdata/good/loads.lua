-- Consumers computed by plant/loads, on an invented product tanker.
local ship = steam_plant {
  name = "Invented Product Tanker 3",
  boilers = {
    { name = "AB1", mcr = "12 t/h", drum = "8 bar(g)", fuel = "HSFO", turndown = 4, efficiency = "84 %" },
    { name = "AB2", mcr = "12 t/h", drum = "8 bar(g)", fuel = "HSFO", turndown = 4, efficiency = "84 %" },
  },
  consumers = {
    { name = "COT 3P", kind = "tank_heating", fuel = "HSFO", T = "60 C", returns = "95 %", return_T = "80 C",
      dimensions = { length = "30 m", breadth = "16 m", depth = "20 m", fill = "95 %", double_bottom = "2 m",
                     double_side = "2 m", layout = "wing", weather_deck = true, adjacent_T = "30 C" } },
    { name = "slop tank", kind = "tank_heating", density = "900 kg/m3", cp = "2 kJ/kgK", mode = "heat_up",
      from = "20 C", to = "60 C", duration = "24 h", volume = "500 m3", returns = "95 %", return_T = "80 C",
      boundaries = { { name = "deck", area = "100 m2", U = "4.5 W/m2K", beyond = "air" },
                     { name = "bottom", area = "100 m2", U = "3.5 W/m2K", beyond = "sea" },
                     { name = "engine room", area = "60 m2", U = "15 W/m2K", beyond = "space", T = "35 C" } } },
    { name = "ME fuel heater", kind = "fuel_heater", service = "engine", fuel = "HSFO", flow = "2.5 t/h",
      inlet_T = "90 C", target_viscosity = "13 cSt", returns = "100 %", return_T = "80 C" },
    { name = "burner heater", kind = "fuel_heater", service = "burner", boiler = "AB1", fuel = "HSFO",
      inlet_T = "60 C", outlet_T = "120 C", returns = "100 %", return_T = "80 C" },
    { name = "atomising", kind = "atomising_steam", boiler = "AB1", ratio = "2 %" },
    { name = "accommodation", kind = "accommodation", UA = "10 kW/K", inside_T = "21 C", balance_T = "16 C",
      returns = "90 %", return_T = "80 C" },
    { name = "tank cleaning", kind = "tank_cleaning", flow = "60 t/h", outlet_T = "80 C", cp = "3.99 kJ/kgK", off = true },
    { name = "soot blowers", kind = "soot_blowing", flow = "1.5 t/h", duration = "10 min", interval = "8 h" },
    { name = "tracing", kind = "steam_tracing", per_metre = "30 W/m", length = "400 m", returns = "80 %", return_T = "80 C" },
    { name = "FWG", kind = "fresh_water_generator", production = "25 t/d", specific_energy = "2500 kJ/kg",
      returns = "100 %", return_T = "80 C" },
  },
  turbines = {
    { name = "COP1", kind = "cargo_pump", flow = "1200 m3/h", head = "130 m", density = "850 kg/m3",
      efficiency = "80 %", exhaust = "0.2 bar(a)", eta_is = "65 %", eta_mech = "95 %", off = true,
      condenser = { subcool = "5 K" } },
  },
}

local cold = case(ship, { name = "loaded, cold sea", sea = "5 C", air = "0 C" })
local warm = case(ship, { name = "loaded, warm sea", sea = "25 C", air = "20 C" })
check(cold.converged and warm.converged, "converged")
local function consumer(r, name)
  for _, c in ipairs(r.consumers) do if c.name == name then return c end end
end
check(consumer(cold, "COT 3P").duty_kW > consumer(warm, "COT 3P").duty_kW, "a tank loses more to a colder sea")
check(consumer(cold, "accommodation").duty_kW > 0 and consumer(warm, "accommodation").duty_kW == 0,
      "no accommodation heating above the balance temperature")
check(consumer(cold, "COT 3P").kind == "tank heating", "kind label")
check(consumer(cold, "atomising").steam_kg_h > 0, "atomising steam follows the fuel")
check(consumer(cold, "burner heater").duty_kW > 0, "burner heater follows the fuel")

local discharge = case(ship, { name = "discharge", sea = "15 C", air = "10 C",
                               set = { COP1 = { off = false }, ["tank cleaning"] = { off = false } } })
check(discharge.converged, "discharge converged")
-- Hand arithmetic (docs/reference/plant-checks.md §9 [C]): P = rho g Q H / eta
-- = 850 * 9.80665 * (1200/3600) * 130 / 0.80 = 451.5 kW.
check(math.abs(consumer(discharge, "COP1").duty_kW - 451.5) < 0.1, "cargo pump shaft power")
-- Hand arithmetic: 25 t/d * 2500 kJ/kg = 723.4 kW; 30 W/m * 400 m = 12 kW;
-- 1.5 t/h * 10 min / 8 h = 31.25 kg/h.
check(math.abs(consumer(discharge, "FWG").duty_kW - 723.38) < 0.01, "FWG duty")
check(math.abs(consumer(discharge, "tracing").duty_kW - 12) < 1e-6, "tracing duty")
check(math.abs(consumer(discharge, "soot blowers").steam_kg_h - 31.25) < 1e-6, "soot blowing mean flow")
check(discharge.fuel_kg_h > warm.fuel_kg_h, "discharge burns more")

-- Case settings of a loads model hold for that case only.
local hotter = case(ship, { name = "hold 70 C", sea = "5 C", air = "0 C", set = { ["COT 3P"] = { T = "70 C" } } })
local again = case(ship, { name = "loaded, cold sea again", sea = "5 C", air = "0 C" })
check(consumer(hotter, "COT 3P").duty_kW > consumer(cold, "COT 3P").duty_kW, "holding hotter takes more heat")
check(consumer(again, "COT 3P").duty_kW == consumer(cold, "COT 3P").duty_kW, "the tank's own temperature is back")
