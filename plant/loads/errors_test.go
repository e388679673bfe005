package loads

import (
	"errors"
	"strings"
	"testing"
)

// TestBadInput: every bad input is an *InputError naming the consumer, its
// name, and what was expected.
func TestBadInput(t *testing.T) {
	t.Parallel()
	f := hsfo(t)
	amb := Ambient{Sea: kelvin(15), Air: kelvin(5)}
	cargo := Cargo{Density: 900, Cp: 2000}
	dims := Dimensions{Length: 30, Breadth: 20, Depth: 20, Fill: 0.98, WeatherDeck: true, AdjacentT: kelvin(20)}
	tank := func(mod func(*TankHeating)) func() error {
		return func() error {
			tk := TankHeating{Name: "COT 1C", Cargo: cargo, CargoVolume: 1000, To: kelvin(50),
				Boundaries: []Boundary{{Name: "deck", Area: 500, U: 5, Beyond: Air}}}
			mod(&tk)
			_, err := tk.Duty(amb)
			return err
		}
	}
	fromDims := func(mod func(*Dimensions)) func() error {
		return func() error {
			d := dims
			mod(&d)
			_, err := TankFromDimensions("COT 3P", cargo, d)
			return err
		}
	}
	heater := func(mod func(*FuelHeater)) func() error {
		return func() error {
			h := FuelHeater{Name: "Boiler FO heater", Service: BoilerBurner, Fuel: f, MassFlow: 0.2, InletT: kelvin(90), TargetViscosity: 13e-6}
			mod(&h)
			_, err := h.Duty()
			return err
		}
	}
	cases := []struct {
		name string
		run  func() error
		want string
	}{
		{"negative area", tank(func(tk *TankHeating) { tk.Boundaries[0].Area = -5 }),
			`tank heating "COT 1C": boundary 1 "deck": area -5 m² is negative or not finite; want an area ≥ 0 m²`},
		{"negative U", tank(func(tk *TankHeating) { tk.Boundaries[0].U = -1 }),
			`tank heating "COT 1C": boundary 1 "deck": U -1 W/(m²·K) is negative`},
		{"unknown beyond", tank(func(tk *TankHeating) { tk.Boundaries[0].Beyond = 7 }),
			`beyond 7 is unknown; want Sea, Air or Space`},
		{"space without temperature", tank(func(tk *TankHeating) { tk.Boundaries[0].Beyond = Space }),
			`tank heating "COT 1C": boundary 1 "deck": temperature beyond is not given (0 K); want a temperature in kelvin`},
		{"heat-up final below initial", tank(func(tk *TankHeating) {
			tk.Mode, tk.From, tk.To, tk.Duration = HeatUp, kelvin(50), kelvin(40), day
		}), `tank heating "COT 1C": heat-up final temperature 40 °C is not above the initial 50 °C; want To > From`},
		{"heat-up zero time", tank(func(tk *TankHeating) {
			tk.Mode, tk.From, tk.To, tk.Duration = HeatUp, kelvin(40), kelvin(50), 0
		}), `tank heating "COT 1C": heat-up duration 0 s must be positive and finite`},
		{"heat-up negative time", tank(func(tk *TankHeating) {
			tk.Mode, tk.From, tk.To, tk.Duration = HeatUp, kelvin(40), kelvin(50), -3600
		}), `tank heating "COT 1C": heat-up duration -3600 s must be positive`},
		{"unknown mode", tank(func(tk *TankHeating) { tk.Mode = 9 }), `mode 9 is unknown`},
		{"no volume", tank(func(tk *TankHeating) { tk.CargoVolume = 0 }), `tank heating "COT 1C": cargo volume 0 m³ must be positive`},
		{"no density", tank(func(tk *TankHeating) { tk.Cargo.Density = 0 }), `tank heating "COT 1C": cargo density 0 kg/m³ must be positive`},
		{"°C given as kelvin", tank(func(tk *TankHeating) { tk.To = 60 }),
			`tank heating "COT 1C": temperature To 60 K (-213.15 °C) is not a plausible temperature; want kelvin`},
		{"hold outside Cragoe", tank(func(tk *TankHeating) { tk.Cargo.Cp = 0; tk.To = kelvin(300) }),
			`tank heating "COT 1C": cargo specific heat: fuel: Cragoe specific heat: temperature 573.15 K outside`},
		{"cool-down zero time", func() error {
			_, err := coolTank().CoolDownAfter(kelvin(60), 0, amb)
			return err
		}, `tank heating "cool": cool-down time 0 s must be positive and finite`},
		{"cool-down without boundaries", func() error {
			tk := coolTank()
			tk.Boundaries = nil
			_, err := tk.CoolDownAfter(kelvin(60), day, amb)
			return err
		}, `tank heating "cool": Σ U·A is 0 W/K; a cool-down needs boundaries with U·A > 0`},
		{"fill above 100 %", fromDims(func(d *Dimensions) { d.Fill = 1.05 }),
			`tank heating "COT 3P": fill 105 % is above 100 %`},
		{"fill zero", fromDims(func(d *Dimensions) { d.Fill = 0 }), `tank heating "COT 3P": fill 0 % must be above 0 %`},
		{"negative length", fromDims(func(d *Dimensions) { d.Length = -30 }), `tank heating "COT 3P": length -30 m must be positive`},
		{"double sides wider than the breadth", fromDims(func(d *Dimensions) { d.DoubleSide = 10 }),
			`tank heating "COT 3P": breadth 20 m less 2 × double side 10 m leaves no tank`},
		{"double bottom too high", fromDims(func(d *Dimensions) { d.DoubleBottom = 20 }),
			`tank heating "COT 3P": depth 20 m less double bottom 20 m leaves no tank`},
		{"no deck-space temperature", fromDims(func(d *Dimensions) { d.WeatherDeck = false }),
			`tank heating "COT 3P": temperature above the tank top is not given`},
		{"no adjacent temperature", fromDims(func(d *Dimensions) { d.AdjacentT = 0 }),
			`tank heating "COT 3P": temperature of the adjacent tanks is not given`},
		{"negative U default override", fromDims(func(d *Dimensions) { d.U.Shell = -3 }),
			`tank heating "COT 3P": U shell -3 W/(m²·K) must be positive`},
		{"viscosity target too low to reach", heater(func(h *FuelHeater) { h.TargetViscosity = 2e-6 }),
			`fuel heater "Boiler FO heater": target viscosity 2 cSt cannot be reached in the fuel's valid range`},
		{"viscosity target too high to reach", heater(func(h *FuelHeater) { h.TargetViscosity = 1e-1; h.InletT = kelvin(-10) }),
			`fuel heater "Boiler FO heater": target viscosity 100000 cSt cannot be reached`},
		{"heater both outlet and target", heater(func(h *FuelHeater) { h.OutletT = kelvin(130) }),
			`fuel heater "Boiler FO heater": both an outlet temperature (130 °C) and a target viscosity (13 cSt) are set; want one of them`},
		{"heater neither", heater(func(h *FuelHeater) { h.TargetViscosity = 0 }),
			`fuel heater "Boiler FO heater": neither an outlet temperature nor a target viscosity is set`},
		{"heater cools", heater(func(h *FuelHeater) { h.TargetViscosity = 0; h.OutletT = kelvin(80) }),
			`fuel heater "Boiler FO heater": outlet temperature 80 °C is below the inlet 90 °C`},
		{"heater zero flow", heater(func(h *FuelHeater) { h.MassFlow = 0 }),
			`fuel heater "Boiler FO heater": oil mass flow 0 kg/s must be positive`},
		{"heater fuel without density", heater(func(h *FuelHeater) { h.Fuel.ISO.Density15 = 0 }),
			`fuel heater "Boiler FO heater": fuel properties: fuel "HSFO": specific gravity needs`},
		{"accommodation balance above inside", func() error {
			_, err := Accommodation{Name: "accommodation", UA: 1e4, InsideT: kelvin(21), BalanceT: kelvin(25)}.Duty(kelvin(0))
			return err
		}, `accommodation heating "accommodation": balance temperature 25 °C is above the inside temperature 21 °C`},
		{"accommodation table not increasing", func() error {
			_, err := Accommodation{Name: "accommodation", Table: []DutyPoint{{kelvin(0), 1}, {kelvin(0), 2}}}.Duty(kelvin(0))
			return err
		}, `accommodation heating "accommodation": table row 2: air temperature 0 °C does not follow 0 °C`},
		{"accommodation one-row table", func() error {
			_, err := Accommodation{Name: "accommodation", Table: []DutyPoint{{kelvin(0), 1}}}.Duty(kelvin(0))
			return err
		}, `want at least two`},
		{"tank cleaning boils", func() error {
			_, err := TankCleaning{Name: "TC heater", Flow: 10, InletT: kelvin(15), OutletT: kelvin(185)}.Duty()
			return err
		}, `tank-cleaning heater "TC heater": outlet 185 °C is at or above the boiling point 179.886 °C at 1000 kPa`},
		{"tank cleaning zero flow", func() error {
			_, err := TankCleaning{Name: "TC heater", InletT: kelvin(15), OutletT: kelvin(80)}.Duty()
			return err
		}, `tank-cleaning heater "TC heater": water flow 0 kg/s must be positive`},
		{"pump efficiency zero", func() error {
			_, err := CargoPump{Name: "COP 2", Flow: 1, Head: 100, Density: 870}.Power()
			return err
		}, `cargo pump "COP 2": efficiency 0 is outside (0, 1]`},
		{"pump negative head", func() error {
			_, err := CargoPump{Name: "COP 2", Flow: 1, Head: -1, Density: 870, Efficiency: 0.8}.Power()
			return err
		}, `cargo pump "COP 2": head -1 m is negative`},
		{"soot blowing longer than interval", func() error {
			_, err := SootBlowing{Name: "EGE", WhileBlowing: 1, Duration: 7200, Interval: 3600}.Flow()
			return err
		}, `soot blowing "EGE": blowing duration 7200 s is longer than the interval 3600 s`},
		{"soot blowing zero interval", func() error {
			_, err := SootBlowing{Name: "EGE", WhileBlowing: 1, Duration: 60}.Flow()
			return err
		}, `soot blowing "EGE": interval 0 s must be positive`},
		{"atomising ratio", func() error {
			_, err := AtomisingSteam{Name: "burner 1"}.PerKgFuel()
			return err
		}, `atomising steam "burner 1": steam per fuel 0 kg/kg is outside (0, 0.5]`},
		{"tracing negative length", func() error {
			_, err := SteamTracing{Name: "FO lines", PerMetre: 30, Length: -1}.Duty()
			return err
		}, `steam tracing "FO lines": length -1 m is negative`},
		{"fixed duty negative", func() error {
			_, err := FixedDuty{Name: "galley", Duty: -1}.Result()
			return err
		}, `fixed duty "galley": duty -1 W is negative`},
		{"fixed power negative", func() error {
			_, err := FixedPower{Name: "TG", Power: -1}.Shaft()
			return err
		}, `fixed-power turbine "TG": shaft power -1 W is negative`},
		{"FWG without energy or temperature", func() error {
			_, err := FreshWaterGenerator{Name: "FWG", Production: 0.2}.Duty()
			return err
		}, `fresh-water generator "FWG": evaporation temperature is not given`},
		{"FWG feed ratio below 1", func() error {
			_, err := FreshWaterGenerator{Name: "FWG", Production: 0.2, EvaporationT: kelvin(45), FeedRatio: 0.5, FeedT: kelvin(30)}.Duty()
			return err
		}, `fresh-water generator "FWG": feed ratio 0.5 kg/kg is below 1`},
		{"cloud point pour point out of range", func() error {
			_, err := CloudPointHM40(kelvin(90))
			return err
		}, `HM 40 cloud point: pour point 90 °C is outside the accepted −60…60 °C`},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			err := tc.run()
			if err == nil {
				t.Fatalf("no error, want %q", tc.want)
			}
			var ie *InputError
			if !errors.As(err, &ie) {
				t.Errorf("error %T %v is not an *InputError", err, err)
			}
			t.Log(err)
			if !strings.Contains(err.Error(), tc.want) {
				t.Errorf("error\n  %v\nwant it to contain\n  %s", err, tc.want)
			}
		})
	}
}
