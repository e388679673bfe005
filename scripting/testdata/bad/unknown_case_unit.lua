local ship = include("../good/plant_tanker.lua")
