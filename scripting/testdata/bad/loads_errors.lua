local ship = steam_plant {
  name = "Invented Tanker 4",
  boilers = { { name = "AB1", mcr = "5 t/h", drum = "7 bar(g)", fuel = "HSFO", efficiency = "84 %" } },
  consumers = {
    { name = "COT 1", kind = "tank_heating", fuel = "HSFO", T = "60 C", volume = "100 m3",
      boundaries = { { area = "50 m2", U = "4 W/m2K", beyond = "see" } } },
    { name = "acc", kind = "acommodation", UA = "1 kW/K", inside_T = "21 C" },
    { name = "FO heater", kind = "fuel_heater", service = "engine", fuel = "HSFO", flow = 2.5, inlet_T = "90 C", outlet_T = "120 C" },
  },
}
