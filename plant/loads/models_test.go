package loads

import (
	"math"
	"strings"
	"testing"

	"steamcase/plant/fuel"
)

// wingTank is the geometry case worked by hand below.
func geometryTank(t *testing.T) TankHeating {
	t.Helper()
	tk, err := TankFromDimensions("COT 2", Cargo{Name: "heavy crude", Density: 900, Cp: 2000}, Dimensions{
		Length: 40, Breadth: 20, Depth: 25, Fill: 0.98, DoubleBottom: 2, DoubleSide: 2,
		WeatherDeck: true, SideAboveWater: 0.3, AdjacentT: kelvin(30),
	})
	if err != nil {
		t.Fatal(err)
	}
	return tk
}

// TestGeometry checks the boundaries derived from dimensions against a hand
// calculation (computed by hand, this comment; U from DefaultU):
//
//	b = 20 − 2·2 = 16 m, d = 25 − 2 = 23 m, cargo height h = 0.98·23 = 22.54 m,
//	waterline z_w = 23·0.7 = 16.1 m; volume 40·16·23·0.98 = 14 425.6 m³
//	weather deck           40·16 = 640 m²,           U 4.5, air
//	bottom, double bottom  640 m²,                   U 3.5, sea
//	sides wetted, sea      2·40·16.1 = 1288 m²,      U 3.5
//	sides wetted, air      2·40·(22.54−16.1) = 515.2 m², U 3.5
//	sides dry, air         2·40·0.46 = 36.8 m²,      U 3.5
//	transverse wetted      2·16·22.54 = 721.28 m²,   U 15, 30 °C
//	transverse dry         2·16·0.46 = 14.72 m²,     U 4.5, 30 °C
//
// Holding 60 °C with sea 15 °C and air 5 °C:
// 640·4.5·55 + 640·3.5·45 + 1288·3.5·45 + 515.2·3.5·55 + 36.8·3.5·55
// + 721.28·15·30 + 14.72·4.5·30 = 158 400 + 100 800 + 202 860 + 99 176
// + 7084 + 324 576 + 1987.2 = 894 883.2 W.
func TestGeometry(t *testing.T) {
	t.Parallel()
	tk := geometryTank(t)
	want := []struct {
		name   string
		area   float64
		u      float64
		beyond Beyond
	}{
		{"weather deck", 640, 4.5, Air},
		{"bottom, double bottom", 640, 3.5, Sea},
		{"sides wetted, double side, sea", 1288, 3.5, Sea},
		{"sides wetted, double side, air", 515.2, 3.5, Air},
		{"sides dry, double side, air", 36.8, 3.5, Air},
		{"transverse bulkheads wetted", 721.28, 15, Space},
		{"transverse bulkheads dry", 14.72, 4.5, Space},
	}
	if len(tk.Boundaries) != len(want) {
		t.Fatalf("got %d boundaries %+v, want %d", len(tk.Boundaries), tk.Boundaries, len(want))
	}
	for i, w := range want {
		b := tk.Boundaries[i]
		if b.Name != w.name || math.Abs(b.Area-w.area) > 1e-9 || b.U != w.u || b.Beyond != w.beyond {
			t.Errorf("boundary %d = %+v, want %+v", i, b, w)
		}
	}
	near(t, "cargo volume m³", tk.CargoVolume, 14425.6, 1e-9)
	tk.To = kelvin(60)
	r, err := tk.Duty(Ambient{Sea: kelvin(15), Air: kelvin(5)})
	if err != nil {
		t.Fatal(err)
	}
	near(t, "hold duty W (hand-computed, see comment)", r.Duty, 894883.2, 1e-6)
	near(t, "mass kg", r.Mass, 14425.6*900, 1e-6)
	if len(r.Warnings) != 0 {
		t.Errorf("warnings %q", r.Warnings)
	}
	// The per-boundary report adds up to the same loss.
	bl, err := tk.BoundaryLosses(nil, kelvin(60), Ambient{Sea: kelvin(15), Air: kelvin(5)})
	if err != nil {
		t.Fatal(err)
	}
	var sum float64
	for _, b := range bl {
		sum += b.Loss
	}
	near(t, "Σ boundary losses W", sum, 894883.2, 1e-6)
	near(t, "top loss W (640·4.5·55, by hand)", bl[0].Loss, 158400, 1e-9)
}

// TestLayouts checks which faces a wing and a centre tank get (by hand: a
// wing tank of breadth 10 with a 2 m double side is 8 m wide, one sea side
// and one longitudinal bulkhead; a centre tank has two bulkheads and no sea
// side; single bottom and single side use U Shell).
func TestLayouts(t *testing.T) {
	t.Parallel()
	cg := Cargo{Density: 900, Cp: 2000}
	wing, err := TankFromDimensions("COT 3P", cg, Dimensions{Length: 30, Breadth: 10, Depth: 20, Fill: 0.5,
		DoubleSide: 2, Layout: Wing, WeatherDeck: true, AdjacentT: kelvin(20)})
	if err != nil {
		t.Fatal(err)
	}
	areas := map[string]float64{}
	for _, b := range wing.Boundaries {
		areas[b.Name] = b.Area
	}
	// 30·8 = 240 m² top and bottom; sea side wetted 30·10 = 300, dry 300;
	// longitudinal bulkhead wetted 300, dry 300; transverse 2·8·10 = 160 each.
	for name, a := range map[string]float64{
		"weather deck": 240, "bottom shell": 240,
		"sides wetted, double side, sea": 300, "sides dry, double side, sea": 300,
		"longitudinal bulkheads wetted": 300, "longitudinal bulkheads dry": 300,
		"transverse bulkheads wetted": 160, "transverse bulkheads dry": 160,
	} {
		if math.Abs(areas[name]-a) > 1e-9 {
			t.Errorf("wing %q area %g, want %g (all: %v)", name, areas[name], a, areas)
		}
	}
	centre, err := TankFromDimensions("COT 3C", cg, Dimensions{Length: 30, Breadth: 10, Depth: 20, Fill: 1,
		Layout: Centre, DeckSpaceT: kelvin(25), AdjacentHeated: true})
	if err != nil {
		t.Fatal(err)
	}
	// Full, not weather deck, neighbours heated: only top (U DeckWetted 15,
	// space 25 °C) and bottom shell (U Shell 40).
	if len(centre.Boundaries) != 2 || centre.Boundaries[0].U != 15 || centre.Boundaries[0].Beyond != Space ||
		centre.Boundaries[1].U != 40 || centre.Boundaries[1].Area != 300 {
		t.Errorf("centre boundaries %+v", centre.Boundaries)
	}
}

// TestWeightedAmbient: the lumped model with boundaries at 10 °C (UA 30
// kW/K) and 35 °C (UA 20 kW/K) is exactly the model with one boundary of UA
// 50 kW/K at their UA-weighted mean (300 + 700)/50 = 20 °C (by hand), so it
// reproduces the docs/reference/plant-checks.md §6 [C] cool-down 40.92 °C after 3 days.
func TestWeightedAmbient(t *testing.T) {
	t.Parallel()
	tk := &TankHeating{Name: "split", Cargo: Cargo{Density: 1000, Cp: 2000}, CargoVolume: 10000,
		Boundaries: []Boundary{
			{Name: "shell", Area: 1000, U: 30, Beyond: Sea},
			{Name: "ER bulkhead", Area: 400, U: 50, Beyond: Space, T: kelvin(35)},
		}}
	r, err := tk.CoolDownAfter(kelvin(60), 3*day, Ambient{Sea: kelvin(10), Air: kelvin(0)})
	if err != nil {
		t.Fatal(err)
	}
	near(t, "UA-weighted ambient °C", celsius(r.AmbientT), 20, 1e-9)
	near(t, "T after 3 days °C (docs/reference/plant-checks.md §6 [C])", celsius(r.T), 40.92, 0.005)
}

// TestCoolDownCragoe compares the closed-form cool-down with Cragoe's c(T)
// with a numerical integration (RK4, 1 h steps, in this test) of
// m·c(T)·dT/dt = −UA·(T − T_amb). No external source: an independent
// solution of the same model.
func TestCoolDownCragoe(t *testing.T) {
	t.Parallel()
	cg := Cargo{Density: 950, SG: 0.95}
	tk := &TankHeating{Name: "slop", Cargo: cg, CargoVolume: 5000,
		Boundaries: []Boundary{{Name: "all", Area: 4000, U: 8, Beyond: Air}}}
	amb := Ambient{Sea: kelvin(5), Air: kelvin(5)}
	r, err := tk.CoolDownAfter(kelvin(70), 5*day, amb)
	if err != nil {
		t.Fatal(err)
	}
	m, ua := 5000*950.0, 4000*8.0
	f := func(T float64) float64 {
		c, err := cg.cp(T)
		if err != nil {
			t.Fatal(err)
		}
		return -ua * (T - amb.Air) / (m * c)
	}
	T := kelvin(70)
	for range 120 {
		k1 := f(T)
		k2 := f(T + 0.5*hour*k1)
		k3 := f(T + 0.5*hour*k2)
		k4 := f(T + hour*k3)
		T += hour / 6 * (k1 + 2*k2 + 2*k3 + k4)
	}
	near(t, "T after 5 days, closed form vs RK4 (K)", r.T, T, 1e-5)
	// One constant c at the mean temperature would be off by about 0.26 K
	// here; the closed form is not.
	c, _ := cg.cp(0.5 * (kelvin(70) + r.T))
	near(t, "c at the mean", r.Cp, c, 1e-6)
	single := amb.Air + (kelvin(70)-amb.Air)*math.Exp(-5*day*ua/(m*c))
	if math.Abs(single-T) < 0.1 {
		t.Errorf("single-c solution %.4f K is as close to RK4 %.4f K as expected only of the closed form", single, T)
	}
	// TimeToCool inverts CoolDownAfter.
	back, err := tk.TimeToCool(kelvin(70), r.T, amb)
	if err != nil {
		t.Fatal(err)
	}
	near(t, "TimeToCool(CoolDownAfter) s", back.Elapsed, 5*day, 1e-3)
}

// TestFuelHeater checks the duty by hand (computed by hand, this comment):
// HSFO ρ15 985, s = 985/999.016 = 0.985970, 90 → 130 °C:
// ∫c dT = [1.685·40 + 0.001695·(130² − 90²)]/√s = (67.4 + 14.916)/0.992960
// = 82.8996 kJ/kg (Cragoe, docs/reference/plant-checks.md §5.3 [S]); 2.5 kg/s → 207.249 kW.
func TestFuelHeater(t *testing.T) {
	t.Parallel()
	h := FuelHeater{Name: "ME FO heater", Fuel: hsfo(t), MassFlow: 2.5, InletT: kelvin(90), OutletT: kelvin(130)}
	r, err := h.Duty()
	if err != nil {
		t.Fatal(err)
	}
	near(t, "per kg J/kg", r.PerKg, 82899.59, 0.05)
	near(t, "duty W", r.Duty, 2.5*82899.59, 0.2)
	// The outlet viscosity is reported: between the docs/reference/plant-checks.md §5.1 [C] values at 120 °C
	// (18.9 cSt) and 150 °C (9.2 cSt).
	if nu := r.OutletViscosity * 1e6; !(nu < 18.9 && nu > 9.2) {
		t.Errorf("outlet viscosity %g cSt", nu)
	}
	pk, err := h.DutyPerKg()
	if err != nil {
		t.Fatal(err)
	}
	if pk.PerKg != r.PerKg || pk.Duty != 0 || pk.MassFlow != 0 {
		t.Errorf("DutyPerKg = %+v, want PerKg %g and no duty", pk, r.PerKg)
	}
	// The boiler burner's heater needs no mass flow.
	h.MassFlow, h.Service = 0, BoilerBurner
	if _, err := h.DutyPerKg(); err != nil {
		t.Error(err)
	}
}

func TestWarnings(t *testing.T) {
	t.Parallel()
	f := hsfo(t)
	amb := Ambient{Sea: kelvin(15), Air: kelvin(10)}
	cases := []struct {
		name string
		run  func() ([]string, error)
		want string // substring of one warning; "" means none
	}{
		{"heater within limit", func() ([]string, error) {
			r, err := FuelHeater{Name: "h", Fuel: f, MassFlow: 1, InletT: kelvin(90), TargetViscosity: 13e-6, OutletLimit: kelvin(140)}.Duty()
			return r.Warnings, err
		}, ""},
		{"heater above limit", func() ([]string, error) {
			r, err := FuelHeater{Name: "h", Fuel: f, MassFlow: 1, InletT: kelvin(90), TargetViscosity: 13e-6, OutletLimit: kelvin(130)}.Duty()
			return r.Warnings, err
		}, "13 cSt needs 134.4 °C, above the heater outlet limit 130 °C"},
		{"heater idle", func() ([]string, error) {
			r, err := FuelHeater{Name: "h", Fuel: f, MassFlow: 1, InletT: kelvin(140), TargetViscosity: 13e-6}.Duty()
			if err == nil && r.Duty != 0 {
				t.Errorf("idle heater duty %g", r.Duty)
			}
			return r.Warnings, err
		}, "heater idle"},
		{"transfer heater near flash point", func() ([]string, error) {
			r, err := FuelHeater{Name: "h", Service: Transfer, Fuel: f, MassFlow: 1, InletT: kelvin(30), OutletT: kelvin(55), FlashPoint: kelvin(62)}.Duty()
			return r.Warnings, err
		}, "SOLAS II-2 reg. 4.2"},
		{"transfer heater clear of flash point", func() ([]string, error) {
			r, err := FuelHeater{Name: "h", Service: Transfer, Fuel: f, MassFlow: 1, InletT: kelvin(30), OutletT: kelvin(50), FlashPoint: kelvin(62)}.Duty()
			return r.Warnings, err
		}, ""},
		{"service heater above flash point: no caution", func() ([]string, error) {
			r, err := FuelHeater{Name: "h", Fuel: f, MassFlow: 1, InletT: kelvin(90), OutletT: kelvin(130), FlashPoint: kelvin(62)}.Duty()
			return r.Warnings, err
		}, ""},
		{"settling tank near flash point", func() ([]string, error) {
			tk := TankHeating{Name: "FO sett", Cargo: Cargo{Density: 985}, CargoVolume: 50, FlashPoint: kelvin(60), To: kelvin(55),
				Boundaries: []Boundary{{Area: 100, U: 5, Beyond: Space, T: kelvin(40)}}}
			r, err := tk.Duty(amb)
			return r.Warnings, err
		}, "within 10 °C of its flash point 60 °C"},
		{"tank gains heat", func() ([]string, error) {
			tk := TankHeating{Name: "FO serv", Cargo: Cargo{Density: 985}, CargoVolume: 50, To: kelvin(30),
				Boundaries: []Boundary{{Area: 100, U: 5, Beyond: Space, T: kelvin(40)}}}
			r, err := tk.Duty(amb)
			if err == nil && (r.Duty != 0 || !(r.Loss < 0)) {
				t.Errorf("duty %g loss %g, want 0 and negative", r.Duty, r.Loss)
			}
			return r.Warnings, err
		}, "heating duty taken as zero"},
		{"never cools to target", func() ([]string, error) {
			r, err := coolTank().TimeToCool(kelvin(60), kelvin(15), Ambient{Sea: kelvin(20), Air: kelvin(20)})
			if err == nil && (r.Reached || r.Elapsed != 0) {
				t.Errorf("reached %v after %g s", r.Reached, r.Elapsed)
			}
			return r.Warnings, err
		}, "never cools"},
		{"accommodation outside table", func() ([]string, error) {
			r, err := accTable().Duty(kelvin(-20))
			return r.Warnings, err
		}, "outside the table"},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			w, err := tc.run()
			if err != nil {
				t.Fatal(err)
			}
			if tc.want == "" {
				if len(w) != 0 {
					t.Errorf("warnings %q, want none", w)
				}
				return
			}
			if !strings.Contains(strings.Join(w, "\n"), tc.want) {
				t.Errorf("warnings %q, want one containing %q", w, tc.want)
			}
		})
	}
}

func accTable() Accommodation {
	return Accommodation{Name: "accommodation", Table: []DutyPoint{
		{kelvin(-10), 600e3}, {kelvin(0), 400e3}, {kelvin(15), 100e3}, {kelvin(20), 0},
	}}
}

// TestAccommodation: values computed by hand in the table rows.
func TestAccommodation(t *testing.T) {
	t.Parallel()
	ua := Accommodation{Name: "accommodation", UA: 20e3, InsideT: kelvin(21), BalanceT: kelvin(16)}
	cases := []struct {
		name string
		a    Accommodation
		air  float64 // °C
		want float64 // W
	}{
		{"UA at −10 °C: 20 kW/K × 31 K", ua, -10, 620e3},
		{"UA at 15.9 °C: 20 kW/K × 5.1 K", ua, 15.9, 102e3},
		{"UA at the balance 16 °C: off", ua, 16, 0},
		{"UA above the balance: off", ua, 25, 0},
		{"UA, balance defaults to inside: 20 kW/K × 1 K", Accommodation{Name: "a", UA: 20e3, InsideT: kelvin(21)}, 20, 20e3},
		{"table at a row", accTable(), 0, 400e3},
		{"table at 5 °C: 400 + (100 − 400)·5/15", accTable(), 5, 300e3},
		{"table at −20 °C: extrapolated 600 + 200", accTable(), -20, 800e3},
		{"table at 25 °C: extrapolated −100, taken as 0", accTable(), 25, 0},
	}
	for _, tc := range cases {
		r, err := tc.a.Duty(kelvin(tc.air))
		if err != nil {
			t.Errorf("%s: %v", tc.name, err)
			continue
		}
		near(t, tc.name, r.Duty, tc.want, 1e-6)
	}
}

// TestSmallConsumers: values computed by hand in the rows.
func TestSmallConsumers(t *testing.T) {
	t.Parallel()
	at := AtomisingSteam{Name: "atomising", SteamPerFuel: 0.03}
	a1, err := at.Flow(0.5)
	if err != nil {
		t.Fatal(err)
	}
	a2, err := at.PerKgFuel()
	if err != nil {
		t.Fatal(err)
	}
	sb, err := SootBlowing{Name: "EGE soot blow", WhileBlowing: 1.0, Duration: 600, Interval: 8 * hour}.Flow()
	if err != nil {
		t.Fatal(err)
	}
	tr, err := SteamTracing{Name: "FO lines", PerMetre: 40, Length: 350}.Duty()
	if err != nil {
		t.Fatal(err)
	}
	gy, err := FixedDuty{Name: "galley", Duty: 25e3}.Result()
	if err != nil {
		t.Fatal(err)
	}
	fw, err := FreshWaterGenerator{Name: "FWG", Production: 0.25, SpecificEnergy: 2.6e6}.Duty()
	if err != nil {
		t.Fatal(err)
	}
	tg, err := FixedPower{Name: "TG", Power: 800e3}.Shaft()
	if err != nil {
		t.Fatal(err)
	}
	tcp, err := TankCleaning{Name: "TC", Flow: 10, InletT: kelvin(15), OutletT: kelvin(75), Cp: 3990}.Duty()
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		name      string
		got, want float64
	}{
		{"atomising 0.03 × 0.5 kg/s", a1.SteamFlow, 0.015},
		{"atomising per kg", a2.PerKgFuel, 0.03},
		{"soot blowing 1 kg/s × 600 s / 28 800 s", sb.SteamFlow, 1.0 / 48},
		{"tracing 40 W/m × 350 m", tr.Duty, 14000},
		{"galley", gy.Duty, 25e3},
		{"FWG given 0.25 kg/s × 2.6 MJ/kg", fw.Duty, 650e3},
		{"turbo-generator", tg, 800e3},
		{"tank cleaning, sea-water cp 3990 × 60 K × 10 kg/s", tcp.Duty, 2.394e6},
	} {
		near(t, c.name, c.got, c.want, 1e-9*math.Max(1, c.want))
	}
	if fw.Computed || fw.Source != "given" {
		t.Errorf("FWG source %q computed %v", fw.Source, fw.Computed)
	}
}

func TestCargoHeating(t *testing.T) {
	t.Parallel()
	amb := Ambient{Sea: kelvin(15), Air: kelvin(5)}
	a := geometryTank(t)
	a.To = kelvin(60)
	b := *coolTank()
	b.Name, b.Mode, b.From, b.To, b.Duration = "COT 4", HeatUp, kelvin(40), kelvin(50), 4*day
	r, err := CargoHeating([]TankHeating{a, b}, amb)
	if err != nil {
		t.Fatal(err)
	}
	// Tank b by hand: 1e7 kg × 2000 × 10 K / 345 600 s = 57 870.37 W, plus
	// 50 kW/K × (45 − 15) K = 1.5 MW of losses.
	near(t, "tank b W", r.Tanks[1].Duty, 1e7*2000*10/(4*day)+50e3*30, 1e-6)
	near(t, "sum W", r.Duty, 894883.2+r.Tanks[1].Duty, 1e-6)
	if r.Tanks[0].Name != "COT 2" || r.Tanks[1].Name != "COT 4" {
		t.Errorf("order %q %q", r.Tanks[0].Name, r.Tanks[1].Name)
	}
	b.To = b.From - 1
	if _, err := CargoHeating([]TankHeating{a, b}, amb); err == nil || !strings.Contains(err.Error(), `"COT 4"`) {
		t.Errorf("error %v, want one naming COT 4", err)
	}
}

// TestCargoFromFuel: a fuel cargo takes the fuel's density and Cragoe at
// its specific gravity. By hand: s = 985/999.016 = 0.985970, c(40 °C) =
// (1.685 + 0.1356)/√s = 1833.507 J/(kg·K) (Cragoe, docs/reference/plant-checks.md §5.3
// [S]); 1000 m³ × 985 kg/m³ × 1833.507 × 20 K / 36 000 s = 1 003 335.9 W.
func TestCargoFromFuel(t *testing.T) {
	t.Parallel()
	cg, err := CargoFromFuel(hsfo(t))
	if err != nil {
		t.Fatal(err)
	}
	tk := TankHeating{Name: "FO bunker 2P", Cargo: cg, CargoVolume: 1000, Mode: HeatUp,
		From: kelvin(30), To: kelvin(50), Duration: 10 * hour}
	r, err := tk.Duty(Ambient{Sea: kelvin(15), Air: kelvin(5)})
	if err != nil {
		t.Fatal(err)
	}
	near(t, "mean cp", r.MeanCp, 1833.507, 0.001)
	near(t, "duty W", r.Duty, 1003335.9, 0.1)
	lng, err := fuel.Grade("LNG")
	if err != nil {
		t.Fatal(err)
	}
	if _, err := CargoFromFuel(lng); err == nil {
		t.Error("a gas fuel gave a cargo")
	}
}

// TestWaterProperties: the IAPWS-IF97 Δh at a stated pressure, against
// python3-iapws 1.5.2 (Debian 1.5.3-1): IAPWS97(P=0.3, T=353.15).h −
// IAPWS97(P=0.3, T=283.15).h; and the fresh-water generator's latent heat
// alone (feed ratio zero), IAPWS97(T=318.15, x=1).h − (x=0).h.
func TestWaterProperties(t *testing.T) {
	t.Parallel()
	r, err := TankCleaning{Name: "TC", Flow: 1, InletT: kelvin(10), OutletT: kelvin(80), Pressure: 0.3e6}.Duty()
	if err != nil {
		t.Fatal(err)
	}
	near(t, "Δh at 0.3 MPa kJ/kg", r.PerKg/1e3, 292.837239, 1e-4)
	fw, err := FreshWaterGenerator{Name: "FWG", Production: 1, EvaporationT: kelvin(45)}.Duty()
	if err != nil {
		t.Fatal(err)
	}
	near(t, "h_fg(45 °C) kJ/kg", fw.SpecificEnergy/1e3, 2394.015473, 1e-4)
}
