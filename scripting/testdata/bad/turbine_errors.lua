-- A turbine's steam given by a steam rate needs the power it is given at.
local ship = steam_plant {
  name = "Invented Turbine Check",
  boilers = { { name = "AB1", mcr = "20 t/h", drum = "16 bar(g)", fuel = "HSFO", efficiency = "85 %" } },
  turbines = {
    { name = "COP1", kind = "cargo_pump", flow = "2000 m3/h", head = "140 m", density = "800 kg/m3",
      efficiency = "78 %", exhaust = "0.2 bar(a)", steam_rate = "8.5 kg/kWh" },
    { name = "COP2", kind = "cargo_pump", flow = "2000 m3/h", head = "140 m", density = "800 kg/m3",
      efficiency = "78 %", exhaust = "0.2 bar(a)", eta_is = "65 %", steam_rate = "8.5 kg/kWh", rated_power = "1.3 MW" },
    { name = "COP3", kind = "cargo_pump", flow = "2000 m3/h", head = "140 m", density = "800 kg/m3",
      efficiency = "78 %", eta_is = "65 %" },
  },
}
