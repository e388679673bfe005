package loads

import (
	"math"
	"testing"
)

func checkFinite(t *testing.T, what string, vs ...float64) {
	t.Helper()
	for i, v := range vs {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			t.Fatalf("%s: value %d is %g with a nil error", what, i, v)
		}
	}
}

// FuzzTankFromDimensions: no panic, and no NaN or Inf in any result
// returned without an error, for any finite input.
func FuzzTankFromDimensions(f *testing.F) {
	f.Add(40.0, 20.0, 25.0, 0.98, 2.0, 2.0, 0.3, 0, true, false, 303.15, 288.15, 278.15, 333.15, 313.15, 86400.0, 900.0, 0.0, 0.9, 2000.0)
	f.Add(10.0, 8.0, 12.0, 1.0, 0.0, 0.0, 0.0, 2, false, true, 0.0, 300.0, 250.0, 360.0, 350.0, 1.0, 980.0, 0.98, 0.0, 0.0)
	f.Add(1e300, 1e300, 1e300, 0.5, 1.0, 1.0, 0.5, 1, true, false, 973.15, 173.15, 973.15, 500.0, 173.15, 1e-300, 1e300, 1e-300, 1.1, 1e-300)
	f.Fuzz(func(t *testing.T, L, B, D, fill, db, ds, above float64, layout int, weather, heated bool,
		adjT, sea, air, T1, T2, dur, rho, cp, sg, elapsed float64) {
		for _, v := range []float64{L, B, D, fill, db, ds, above, adjT, sea, air, T1, T2, dur, rho, cp, sg, elapsed} {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				return
			}
		}
		cargo := Cargo{Density: rho, Cp: cp, SG: sg}
		tk, err := TankFromDimensions("fuzz", cargo, Dimensions{Length: L, Breadth: B, Depth: D, Fill: fill,
			DoubleBottom: db, DoubleSide: ds, SideAboveWater: above, Layout: Layout(layout), WeatherDeck: weather,
			DeckSpaceT: adjT, AdjacentT: adjT, AdjacentHeated: heated})
		if err != nil {
			return
		}
		checkFinite(t, "volume", tk.CargoVolume)
		for _, b := range tk.Boundaries {
			checkFinite(t, "boundary", b.Area, b.U)
		}
		exercise(t, &tk, Ambient{Sea: sea, Air: air}, T1, T2, dur, elapsed)
	})
}

// FuzzTankBoundaries: the same for a tank given by two boundaries.
func FuzzTankBoundaries(f *testing.F) {
	f.Add(1000.0, 50.0, 0, 400.0, 8.0, 2, 320.0, 10000.0, 1000.0, 2000.0, 0.0, 293.15, 283.15, 333.15, 313.15, 3600.0, 259200.0)
	f.Add(-1.0, 1e308, 1, 1e308, 1e308, 2, 400.0, 1e308, 1e308, 0.0, 1.1, 173.15, 973.15, 173.15, 973.15, 1e-308, 1e308)
	f.Fuzz(func(t *testing.T, a1, u1 float64, b1 int, a2, u2 float64, b2 int, T2b, vol, rho, cp, sg, sea, air, T1, T2, dur, elapsed float64) {
		for _, v := range []float64{a1, u1, a2, u2, T2b, vol, rho, cp, sg, sea, air, T1, T2, dur, elapsed} {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				return
			}
		}
		tk := TankHeating{Name: "fuzz", Cargo: Cargo{Density: rho, Cp: cp, SG: sg}, CargoVolume: vol,
			Boundaries: []Boundary{{Area: a1, U: u1, Beyond: Beyond(b1), T: T2b}, {Area: a2, U: u2, Beyond: Beyond(b2), T: T2b}}}
		exercise(t, &tk, Ambient{Sea: sea, Air: air}, T1, T2, dur, elapsed)
	})
}

func exercise(t *testing.T, tk *TankHeating, amb Ambient, T1, T2, dur, elapsed float64) {
	t.Helper()
	tk.Mode, tk.To = Hold, T2
	if r, err := tk.Duty(amb); err == nil {
		checkFinite(t, "hold", r.Duty, r.Loss, r.Sensible, r.Mass, r.UA, r.AmbientT)
		if r.Duty < 0 {
			t.Fatalf("hold duty %g < 0", r.Duty)
		}
	}
	tk.Mode, tk.From, tk.Duration = HeatUp, T1, dur
	if r, err := tk.Duty(amb); err == nil {
		checkFinite(t, "heat-up", r.Duty, r.Loss, r.Sensible, r.Mass, r.UA, r.AmbientT, r.MeanCp)
	}
	if r, err := tk.CoolDownAfter(T2, elapsed, amb); err == nil {
		checkFinite(t, "cool-down", r.T, r.Tau, r.Cp, r.UA, r.AmbientT, r.Mass)
		lo, hi := math.Min(T2, r.AmbientT), math.Max(T2, r.AmbientT)
		if r.T < lo-1e-6*math.Abs(lo) || r.T > hi+1e-6*math.Abs(hi) {
			t.Fatalf("cool-down T %g outside [%g, %g]", r.T, lo, hi)
		}
	}
	if r, err := tk.TimeToCool(T2, T1, amb); err == nil {
		checkFinite(t, "time to cool", r.Elapsed, r.Tau, r.Cp)
		if r.Elapsed < 0 {
			t.Fatalf("time to cool %g < 0", r.Elapsed)
		}
	}
	if bl, err := tk.BoundaryLosses(nil, T2, amb); err == nil {
		for _, b := range bl {
			checkFinite(t, "boundary loss", b.Loss, b.TBeyond)
		}
	}
}
