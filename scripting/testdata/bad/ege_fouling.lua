-- An exhaust-gas economiser whose soot grows without a cleaning interval
-- (invented figures).
local ship = steam_plant { name = "Invented Fouling Ship",
  boilers = { { name = "AB1", mcr = "3 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "84 %" } },
  exhaust_gas_economiser = { name = "EGE", drum = "7 bar(g)", design_load = "85 %", pinch = "20 K",
    fouling_rate = "0.001 m2K/W", clean_U = "40 W/m2K",
    engine = { mcr = "9 MW", { load = "25 %", gas = "11 kg/kWh", T = "250 C" }, { load = "100 %", gas = "8.1 kg/kWh", T = "245 C" } } },
  consumers = { { name = "heating", duty = "1 MW", returns = "90 %" } } }
case(ship, { name = "sea", sea = "15 C", air = "10 C", engine = "85 %" })
