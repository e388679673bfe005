local ship = plant { name = "keys" }
ship:boiler { name = "AB1", mrc = "20 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "85 %" }
