package heat

import (
	"errors"
	"math"
	"testing"
)

func finite(v ...float64) bool {
	for _, x := range v {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			return false
		}
	}
	return true
}

func knownErr(err error) bool { return errors.Is(err, ErrInput) || errors.Is(err, ErrRange) }

// FuzzFurnace: on any input the furnace solve returns either a finite result
// between the wall and adiabatic temperatures with a closed energy balance,
// or an ErrInput/ErrRange error. Never a panic or a NaN.
func FuzzFurnace(f *testing.F) {
	f.Add(15.4566, 0.922, 470.0, 0.8, 0.0, 1e-7, 1.403, 2208.34, 0.0, 0.095, 0.125)
	f.Add(0.0, 0.922, 470.0, 0.8, 0.25, 0.0, 1.403, 2208.34, 0.0, 0.095, 0.125)
	f.Add(1e6, 1e-3, 300.0, 1.0, 0.0, 0.0, 1e-3, 4000.0, 1e3, 0.3, 0.01)
	f.Add(-1.0, math.NaN(), math.Inf(1), 2.0, -1.0, 1.0, 0.0, -5.0, -1.0, 2.0, -1.0)
	f.Fuzz(func(t *testing.T, area, L, tw, epsW, fixed, fv, mdot, tad, loss, xw, xc float64) {
		x := Composition{H2O: xw, CO2: xc, N2: 1 - xw - xc}
		fu := Furnace{WallArea: area, BeamLength: L, WallTemperature: tw, WallEmissivity: epsW,
			FixedEmissivity: fixed, SootVolumeFraction: fv, Set: WSGGAuto}
		in := FurnaceInput{GasFlow: mdot, Composition: x, Enthalpy: ConstantCp(1250, 298.15),
			AdiabaticTemperature: tad, HeatLoss: loss}
		r, err := fu.Solve(in)
		if err != nil {
			if !knownErr(err) {
				t.Fatalf("unclassified error: %v", err)
			}
			return
		}
		if !finite(r.ExitTemperature, r.HeatAbsorbed, r.EffectiveEmissivity, r.GasEmissivity, r.SootEmissivity) {
			t.Fatalf("non-finite result %+v", r)
		}
		if r.ExitTemperature < tw-1e-6 || r.ExitTemperature > tad+1e-6 || r.HeatAbsorbed < 0 {
			t.Fatalf("T_E = %g outside [%g, %g] or Q = %g < 0", r.ExitTemperature, tw, tad, r.HeatAbsorbed)
		}
		// The root is bracketed: the residual changes sign (or vanishes)
		// across the final Brent interval around T_E.
		gas := GasFromComposition(&in.Composition, StandardAtmosphere, L, WSGGAuto)
		soot := SootConstant(1.75, 1.03, 3.72)
		var edge bool
		resid := func(T float64) float64 {
			q, _, _, _, _, _, err := fu.radiation(&gas, soot, T)
			if err != nil {
				edge = true // at the edge of the WSGG weights' usable range
			}
			return mdot*1250*(tad-T) - loss - q
		}
		d := 2e-8 + 1e-15*r.ExitTemperature
		lo, hi := math.Max(tw, r.ExitTemperature-d), math.Min(tad, r.ExitTemperature+d)
		if a, b := resid(lo), resid(hi); !edge && (a < 0 && b < 0 || a > 0 && b > 0) {
			if r.ExitTemperature != tad && r.ExitTemperature != tw {
				t.Fatalf("no sign change around T_E = %.15g: %g, %g", r.ExitTemperature, a, b)
			}
		}
	})
}

// FuzzTubePass: the tube pass returns a finite outlet between the water and
// inlet temperatures, or a classified error.
func FuzzTubePass(f *testing.F) {
	f.Add(uint8(60), 0.0563, 3.5, 0.0036, 0.001, 0.0002, 0.8, 1.403, 1200.0, 453.0, 10000.0, 10e5)
	f.Add(uint8(1), 0.02, 0.0, 0.001, 0.0, 0.0, 0.0, 0.01, 500.0, 450.0, 0.0, 10e5)
	f.Add(uint8(200), 1.0, 1e4, 0.5, 1.0, 1.0, 1.0, 100.0, 3000.0, 373.0, 0.0, 1e3)
	f.Add(uint8(0), -1.0, math.NaN(), 0.0, -1.0, math.Inf(1), 2.0, 0.0, 100.0, 500.0, -1.0, 0.0)
	f.Fuzz(func(t *testing.T, n uint8, di, length, wall, fg, fw, epsW, mdot, tin, tsat, hw, pw float64) {
		s := SmokeTubes{Count: int(n), Di: di, Length: length, WallThickness: wall, FoulingGas: fg, FoulingWater: fw,
			WallEmissivity: epsW, Set: WSGGRatio1}
		in := TubePassInput{GasFlow: mdot, InletTemperature: tin, Composition: flueTest,
			Enthalpy: ConstantCp(1250, 298.15), WaterTemperature: tsat, WaterHTC: hw, WaterPressure: pw}
		r, err := s.Solve(in)
		if err != nil {
			if !knownErr(err) {
				t.Fatalf("unclassified error: %v", err)
			}
			return
		}
		if !finite(r.OutletTemperature, r.Duty, r.U, r.NTU, r.HConvection, r.HRadiation, r.HWater) {
			t.Fatalf("non-finite result %+v", r)
		}
		if r.OutletTemperature < tsat-1e-6 || r.OutletTemperature > tin+1e-6 || r.Duty < -1e-6 {
			t.Fatalf("T_out = %g outside [%g, %g], Q = %g", r.OutletTemperature, tsat, tin, r.Duty)
		}
	})
}

// FuzzAdiabaticTemperature: the root of h(T) = h(T_ref) + dh is found or
// refused; found roots satisfy the equation.
func FuzzAdiabaticTemperature(f *testing.F) {
	f.Add(1250.0, 298.15, 2e6, 470.0)
	f.Add(-1.0, 0.0, math.NaN(), 1e9)
	f.Fuzz(func(t *testing.T, cp, tref, dh, tlo float64) {
		h := ConstantCp(cp, 298.15)
		ta, err := AdiabaticTemperature(h, tref, dh, tlo)
		if err != nil {
			if !knownErr(err) {
				t.Fatalf("unclassified error: %v", err)
			}
			return
		}
		if !finite(ta) || ta < tlo || ta > maxGasTemperature {
			t.Fatalf("T_ad = %g", ta)
		}
	})
}

// FuzzCounterflow: ε in [0, 1], outlets between the inlets, balance closed.
func FuzzCounterflow(f *testing.F) {
	f.Add(1540.0, 8400.0, 3000.0, 520.0, 333.0)
	f.Add(1500.0, math.Inf(1), 1e9, 600.0, 450.0)
	f.Add(0.0, -1.0, math.NaN(), 1.0, 2.0)
	f.Fuzz(func(t *testing.T, ch, cc, ua, th, tc float64) {
		r, err := Counterflow(ch, cc, ua, th, tc)
		if err != nil {
			if !knownErr(err) {
				t.Fatalf("unclassified error: %v", err)
			}
			return
		}
		if !finite(r.Q, r.HotOut, r.ColdOut, r.Eff) || r.Eff < 0 || r.Eff > 1 {
			t.Fatalf("result %+v", r)
		}
		if r.HotOut < tc-1e-9*math.Abs(tc) || r.ColdOut > th+1e-9*math.Abs(th) {
			t.Fatalf("second law violated: %+v", r)
		}
	})
}

// FuzzMixTransport: any composition and temperature gives finite positive
// properties or a classified error.
func FuzzMixTransport(f *testing.F) {
	f.Add(0.754, 0.026, 0.125, 0.095, 0.0, 700.0, false)
	f.Add(0.0, 0.0, 0.0, 1.0, 0.0, 300.0, true)
	f.Add(-1.0, 2.0, 0.0, 0.0, 0.0, math.NaN(), true)
	f.Fuzz(func(t *testing.T, n2, o2, co2, h2o, ar, T float64, extrap bool) {
		x := Composition{n2, o2, co2, h2o, ar}
		g, err := MixTransport(&x, T, TransportOptions{AllowExtrapolation: extrap})
		if err != nil {
			if !knownErr(err) {
				t.Fatalf("unclassified error: %v", err)
			}
			return
		}
		if !finite(g.Viscosity, g.Conductivity) || g.Viscosity <= 0 || g.Conductivity <= 0 {
			t.Fatalf("%+v at %g K for %v", g, T, x)
		}
	})
}
