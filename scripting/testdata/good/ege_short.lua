-- An invented tanker with an exhaust-gas economiser in the short form,
-- economiser on the boiler, a flue-gas table and a burner fan. The
-- engine's exhaust is docs/reference/plant-checks.md §7's indicative range [M].
local engine = { mcr = "12 MW",
  { load = "25 %", gas = "11 kg/kWh", T = "250 C" },
  { load = "50 %", gas = "9 kg/kWh", T = "225 C" },
  { load = "75 %", gas = "8.3 kg/kWh", T = "230 C" },
  { load = "100 %", gas = "8.1 kg/kWh", T = "245 C" } }

local ship = steam_plant {
  name = "Invented EGE Tanker",
  boilers = {
    { name = "AB1", mcr = "6 t/h", drum = "7 bar(g)", fuel = "HSFO", turndown = 4,
      efficiency = { flue_gas = { {"30 %", "250 C", "5 %"}, {"100 %", "300 C", "3 %"} }, radiation = "1 %" },
      burner = { fan_rise = "3 kPa", fan_eta = "65 %" } },
    { name = "AB2", mcr = "6 t/h", drum = "7 bar(g)", fuel = "HSFO", efficiency = "84 %", turndown = 4 },
  },

  exhaust_gas_economiser = { name = "EGE", drum = "7 bar(g)", engine = engine,
                             design_load = "85 %", pinch = "15 K", min_gas_T = "170 C", bypass = true },
  hotwell = { heat_loss = "5 kW" },
  consumers = {
    { name = "cargo heating", duty = "2 MW", returns = "90 %", subcool = "10 K", return_T = "80 C" },
    { name = "galley", duty = "40 kW", returns = "100 %" },
  },
}

local sea = case(ship, { name = "at sea", sea = "15 C", air = "10 C", engine = "85 %" })
check(sea.ege_steam_kg_h > 0, "the economiser raises steam at sea")
check(sea.ege_fuel_saved_kg_h > 0, "it saves boiler fuel")
local port = case(ship, { name = "port", sea = "15 C", air = "10 C", engine = "0 %",
                          set = { EGE = { off = true }, AB1 = { eta_factor = 0.98 }, ["cargo heating"] = { factor = 1.1 } } })
check(port.ege_steam_kg_h == 0, "no exhaust at port")
check(port.fuel_kg_h > 0, "the boilers fire at port")
local light = case(ship, { name = "light", sea = "15 C", air = "10 C", engine = "100 %",
                           set = { ["cargo heating"] = { off = true } } })
check(light.dumped_kg_h > 0, "surplus economiser steam goes to the dump condenser")
