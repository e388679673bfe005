local ship = plant { name = "units" }
ship:consumer { name = "galley", duty = "40 kWatt" }
