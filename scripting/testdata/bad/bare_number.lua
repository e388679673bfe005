local ship = plant { name = "bare" }
ship:boiler { name = "AB1", mcr = 20, drum = "7 bar(g)", fuel = "MGO", efficiency = "85 %" }
