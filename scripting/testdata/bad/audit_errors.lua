local ship = include("voyage_plant.lua")
audit(ship, { name = "log", days = { { date = "2026-01-01", claimed = "3 m3", sea = "15 C" } },
  uncertain = { { unit = "cargo heating", key = "off", low = 0, high = 1 },
                { unit = "AB1", key = "eta_factr", low = 0.9, high = 1.1 },
                { unit = "cargo heating", key = "factor", low = 1.2, high = 0.8 } },
  samples = 5, band = { "95 %", "5 %" } })
