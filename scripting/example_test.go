package scripting_test

import (
	"context"
	"errors"
	"fmt"

	"steamcase/scripting"
)

func ExampleRunSource() {
	src := []byte(`
local ship = steam_plant {
  name = "Invented Coaster",
  boilers = { { name = "AB1", mcr = "2 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "85 %" },
              { name = "AB2", mcr = "2 t/h", drum = "7 bar(g)", fuel = "MGO", efficiency = "85 %" } },
  consumers = { { name = "heating", duty = "300 kW", returns = "90 %", return_T = "80 C" } },
}
for _, kW in ipairs({ 300, 1500 }) do
  local r = case(ship, { name = kW .. " kW", sea = "10 C", air = "5 C",
                         set = { heating = { duty = kW .. " kW" } } })
  check(r.converged, "converged")
end
check(false, "stop here")
`)
	run, err := scripting.RunSource(context.Background(), "coaster.lua", src, nil, scripting.Options{})
	for _, c := range run.Cases {
		fmt.Printf("%s: %s, %d boiler(s) firing\n", c.Pos, c.Result.Name, c.Result.BoilersFiring)
	}
	var ae *scripting.AssertionError
	if errors.As(err, &ae) {
		fmt.Println(err)
	}
	// Output:
	// coaster.lua:9: 300 kW, 1 boiler(s) firing
	// coaster.lua:9: 1500 kW, 2 boiler(s) firing
	// coaster.lua:13: assertion failed: stop here
}

func ExampleOptions_checkOnly() {
	src := []byte(`local ship = plant { name = "x" }
ship:boiler { name = "AB1", mrc = "5 t/h", drum = "7 bar", fuel = "MGO", efficiency = "85 %" }
`)
	_, err := scripting.RunSource(context.Background(), "x.lua", src, nil, scripting.Options{CheckOnly: true})
	fmt.Println(err)
	// Output:
	// 3 errors:
	// x.lua:1: plant "x": has no lines; join its units with ship:line(name, "from.port", "to.port")
	// x.lua:2: boiler "AB1": drum: pressure '7 bar' is ambiguous: write '7 bar(g)' for gauge or '7 bar(a)' for absolute
	// x.lua:2: boiler "AB1": unknown key 'mrc'; did you mean 'mcr'? (accepted: name, mcr, drum, dryness, blowdown, tds_feed, tds_max, turndown, cycling_loss, standby_loss, purge_air, starts_per_hour, cycle_band, water_content, eta_factor, max_load, inert_gas, fuel, lhv, co2_factor, bdn, efficiency, burner)
}
