package heat_test

import (
	"fmt"
	"math"

	"steamcase/plant/heat"
)

// flueGas is the test flue gas of docs/reference/heat-transfer.md §1.3 (heavy fuel oil at
// 15 % excess air, SO2 folded into N2).
var flueGas = heat.Composition{heat.N2: 0.754, heat.O2: 0.026, heat.CO2: 0.125, heat.H2O: 0.095}

func ExampleMixTransport() {
	g, err := heat.MixTransport(&flueGas, 700, heat.TransportOptions{})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("η = %.4e Pa·s, λ = %.5f W/(m·K)\n", g.Viscosity, g.Conductivity)
	// Output: η = 3.2300e-05 Pa·s, λ = 0.05014 W/(m·K)
}

func ExampleRadiatingGas_Emissivity() {
	// Furnace 1.2 m across, 3.5 m long: L_m = 3.6·V/A.
	V := math.Pi * 0.36 * 3.5
	A := math.Pi*1.2*3.5 + 2*math.Pi*0.36
	L, _ := heat.BeamLength(V, A)
	gas := heat.GasFromComposition(&flueGas, heat.StandardAtmosphere, L, heat.WSGGRatio1)
	for _, T := range []float64{1000, 1500} {
		e, w, _ := gas.Emissivity(T)
		fmt.Printf("ε_g(%.0f K) = %.4f  warnings: %d\n", T, e, w)
	}
	// Output:
	// ε_g(1000 K) = 0.2615  warnings: 0
	// ε_g(1500 K) = 0.2048  warnings: 0
}

func ExampleFurnace_Solve() {
	V := math.Pi * 0.36 * 3.5
	A := math.Pi*1.2*3.5 + 2*math.Pi*0.36
	L, _ := heat.BeamLength(V, A)
	f := heat.Furnace{WallArea: A, BeamLength: L, WallTemperature: 470, WallEmissivity: 0.8,
		Set: heat.WSGGRatio1, SootVolumeFraction: 1e-7}
	r, err := f.Solve(heat.FurnaceInput{
		GasFlow:              300.0 / 3600 * 16.836, // kg/s
		Composition:          flueGas,
		Enthalpy:             heat.ConstantCp(1250, 298.15), // stand-in for the combustion package
		FiringRate:           300.0 / 3600 * 40.2e6,         // W
		ReferenceTemperature: 298.15,
	})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("T_ad = %.1f K, T_E = %.1f K, Q_rad = %.0f kW, ε_flame = %.3f\n",
		r.AdiabaticTemperature, r.ExitTemperature, r.HeatAbsorbed/1e3, r.FlameEmissivity)
	// Output: T_ad = 2208.3 K, T_E = 1449.4 K, Q_rad = 1331 kW, ε_flame = 0.381
}

func ExampleSmokeTubes_Solve() {
	tubes := heat.SmokeTubes{Count: 60, Di: 0.0563, Length: 3.5, WallThickness: 0.0036,
		FoulingGas: 0.001, FoulingWater: 0.0002, WallEmissivity: 0.8, Set: heat.WSGGRatio1}
	r, err := tubes.Solve(heat.TubePassInput{
		GasFlow: 1.403, InletTemperature: 1449.4, Composition: flueGas,
		Enthalpy:         heat.ConstantCp(1250, 298.15),
		WaterTemperature: 453.03, WaterPressure: 10e5, // h_w by Cooper
	})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("T_out = %.1f K, Q = %.0f kW, U = %.1f W/(m²·K), h_conv = %.1f, h_rad = %.1f\n",
		r.OutletTemperature, r.Duty/1e3, r.U, r.HConvection, r.HRadiation)
	// Output: T_out = 790.6 K, Q = 1155 kW, U = 51.1 W/(m²·K), h_conv = 46.9, h_rad = 8.1
}

func ExampleCounterflow() {
	// An economiser: 1.403 kg/s of flue gas at 520 K heats 2 kg/s of feed
	// water from 333 K; UA = 3000 W/K; constant capacity rates.
	r, err := heat.Counterflow(1.403*1100, 2*4200, 3000, 520, 333)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("NTU = %.3f, Cr = %.3f, ε = %.3f, Q = %.1f kW, gas out %.1f K, water out %.1f K\n",
		r.NTU, r.Cr, r.Eff, r.Q/1e3, r.HotOut, r.ColdOut)
	// Output: NTU = 1.944, Cr = 0.184, ε = 0.826, Q = 238.5 kW, gas out 365.4 K, water out 361.4 K
}

func ExampleTubeWall_U() {
	// The worked smoke-tube example of docs/reference/heat-transfer.md §5.
	w := heat.TubeWall{Di: 0.0563, Do: 0.0635, K: 47, HInside: 43.08,
		FoulingInside: 0.001, FoulingOutside: 0.0002, HOutside: 10000}
	u, _ := w.U(heat.Inside)
	fmt.Printf("U_i = %.2f W/(m²·K)\n", u)
	// Output: U_i = 40.73 W/(m²·K)
}

func ExamplePool_Cooper() {
	h, _, _ := heat.WaterPool(10e5).Cooper(50e3)
	fmt.Printf("h = %.1f W/(m²·K), ΔT_sat = %.2f K\n", h, 50e3/h)
	// Output: h = 10691.8 W/(m²·K), ΔT_sat = 4.68 K
}
