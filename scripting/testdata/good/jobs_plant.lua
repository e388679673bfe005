-- An invented product tanker with an exhaust-gas economiser, shared by the
-- voyage, study and audit scripts. Engine exhaust: docs/reference/plant-checks.md §7's
-- indicative range [M].
return steam_plant {
  name = "Invented Product Tanker",
  boilers = {
    { name = "AB1", mcr = "5 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = { {"25 %", "80 %"}, {"100 %", "85 %"} }, turndown = 4 },
    { name = "AB2", mcr = "5 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = { {"25 %", "80 %"}, {"100 %", "85 %"} }, turndown = 4 },
  },
  exhaust_gas_economiser = { name = "EGE", drum = "7 bar(g)", design_load = "85 %", pinch = "15 K",
    engine = { mcr = "9 MW",
      { load = "25 %", gas = "11 kg/kWh", T = "250 C" },
      { load = "50 %", gas = "9 kg/kWh", T = "225 C" },
      { load = "100 %", gas = "8.1 kg/kWh", T = "245 C" } } },
  hotwell = { heat_loss = "5 kW" },
  consumers = {
    { name = "cargo heating", duty = "2.5 MW", returns = "90 %", subcool = "10 K", return_T = "80 C" },
    { name = "accommodation", kind = "accommodation", UA = "12 kW/K", inside_T = "21 C", returns = "100 %" },
    { name = "galley", duty = "40 kW", returns = "100 %" },
  },
}
