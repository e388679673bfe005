-- Fuel inputs that must be refused with the script line (issue 14 §1).
local ship = steam_plant {
  name = "Invented Fuel Check",
  boilers = {
    { name = "AB1", mcr = "2 t/h", drum = "7 bar(g)", fuel = "VLSFO", efficiency = "85 %",
      bdn = { density = "1050 kg/m3", sulphur = "0.48 %" } },
    { name = "AB2", mcr = "2 t/h", drum = "7 bar(g)", fuel = "own", lhv = "41 MJ/kg", co2_factor = 3.1,
      efficiency = "85 %", bdn = { density = "950 kg/m3" } },
  },
  consumers = { { name = "galley", duty = "40 kW" } },
}
