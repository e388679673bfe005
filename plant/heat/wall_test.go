package heat

import (
	"errors"
	"fmt"
	"math"
	"testing"
)

// TestTEMAFouling: docs/reference/heat-transfer.md §5 table, h·ft²·°F/Btu → m²·K/W with
// 1 h·ft²·°F/Btu = 0.176110 m²·K/W [C]; TEMA RGP-T-2.4 values [S✓].
func TestTEMAFouling(t *testing.T) {
	t.Parallel()
	printed(t, "unit conversion", FoulingUnit, "0.176110")
	for _, c := range []struct {
		name string
		got  float64
		want string
	}{
		{"engine exhaust", FoulingEngineExhaust, "0.00176"},
		{"natural-gas flue gas", FoulingNaturalGasFlue, "0.00088"},
		{"coal flue gas", FoulingCoalFlue, "0.00176"},
		{"feedwater ≤ 3 ft/s", FoulingBoilerFeedwaterSlow, "0.000176"},
		{"feedwater > 3 ft/s", FoulingBoilerFeedwaterFast, "0.000088"},
		{"boiler blowdown", FoulingBoilerBlowdown, "0.00035"},
		{"distilled water, condensate", FoulingDistilledOrCondensate, "0.000088"},
	} {
		printed(t, "TEMA "+c.name, c.got, c.want)
	}
}

// TestDepositLayers: docs/reference/heat-transfer.md §5 [CP/M]: 1 mm of soot at k =
// 0.05-0.1 W/(m·K) is 0.01-0.02 m²·K/W; 0.1 mm of scale at 0.5-2.5 W/(m·K)
// is 0.00004-0.0002 m²·K/W.
func TestDepositLayers(t *testing.T) {
	t.Parallel()
	r, err := LayerResistance(1e-3, SootConductivityHigh)
	mustNoErr(t, err)
	printed(t, "1 mm soot, k = 0.1", r, "0.01")
	r, _ = LayerResistance(1e-3, SootConductivityLow)
	printed(t, "1 mm soot, k = 0.05", r, "0.02")
	r, _ = LayerResistance(1e-4, ScaleConductivityHi)
	printed(t, "0.1 mm scale, k = 2.5", r, "0.00004")
	r, _ = LayerResistance(1e-4, ScaleConductivityLow)
	printed(t, "0.1 mm scale, k = 0.5", r, "0.0002")
	if _, err := LayerResistance(-1e-3, 0.1); !errors.Is(err, ErrInput) {
		t.Errorf("negative thickness: %v", err)
	}
	if _, err := LayerResistance(1e-3, 0); !errors.Is(err, ErrInput) {
		t.Errorf("zero conductivity: %v", err)
	}
}

// TestWorkedSmokeTube reproduces the worked smoke-tube example of
// docs/reference/heat-transfer.md §5 [C] through this package's own chain: test flue gas at
// 700 K and 1 atm, u = 20 m/s, d_i = 56.3 mm, d_o = 63.5 mm, k_w = 47,
// c_p = 1158.32 J/(kg·K) (given by the sheet, from NASA TM-4513
// polynomials, which are not part of this package), soot 0.001, boiling
// 10 000 W/(m²·K), scale 0.0002 on the outside area.
func TestWorkedSmokeTube(t *testing.T) {
	t.Parallel()
	const R = 8.314462618 // J/(mol·K), CODATA 2018
	x := flueTest
	printed(t, "M flue gas (g/mol)", x.MolarMassMix()*1000, "29.167")
	rho := StandardAtmosphere * x.MolarMassMix() / (R * 700)
	printed(t, "ρ", rho, "0.5078")
	g, err := MixTransport(&x, 700, TransportOptions{})
	mustNoErr(t, err)
	printed(t, "η", g.Viscosity, "3.2300e-5")
	printed(t, "λ", g.Conductivity, "0.05014")
	cp := 1158.32
	pr := cp * g.Viscosity / g.Conductivity
	// Pr, h_g and the Dittus-Boelter h of the sheet carry one more rounding
	// (0.7462 follows from the rounded η and λ; 1/0.023215 = 43.0756 while
	// the unrounded chain gives 43.0748): checked to ±1 in the last digit.
	within(t, "Pr", pr, 0.7462, 1e-4)
	di, do := 0.0563, 0.0635
	re := rho * 20 * di / g.Viscosity
	printed(t, "Re", re, "17701.3")
	f, _ := FrictionFactor(Petukhov, re)
	printed(t, "f", f, "0.026987")
	nu, _, err := TubeFlow{}.Nusselt(re, pr)
	mustNoErr(t, err)
	printed(t, "Nu", nu, "48.364")
	hg := nu * g.Conductivity / di
	within(t, "h_g", hg, 43.08, 0.01)
	db, _ := DittusBoelter(re, pr, 60, false)
	within(t, "Dittus-Boelter h", db*g.Conductivity/di, 46.96, 0.01)

	rw, err := WallResistancePerLength(di, do, 47)
	mustNoErr(t, err)
	printed(t, "R'_wall (K·m/W)", rw, "4.0752e-4")

	w := TubeWall{Di: di, Do: do, K: 47, HInside: hg, FoulingInside: 0.001, FoulingOutside: 0.0002, HOutside: 10000}
	r, err := w.Resistances(Inside)
	mustNoErr(t, err)
	for i, want := range []string{"0.023215", "0.001000", "7.208e-5", "1.773e-4", "8.866e-5"} {
		printed(t, fmt.Sprintf("resistance %d per m² inside", i), r[i], want)
	}
	sum := r[0] + r[1] + r[2] + r[3] + r[4]
	printed(t, "sum", sum, "0.024553")
	u, _ := w.U(Inside)
	printed(t, "U_i", u, "40.73")
	printed(t, "gas film share (%)", 100*r[0]/sum, "94.6")
	printed(t, "water side share (%)", 100*(r[3]+r[4])/sum, "1.1")
	printed(t, "wall share (%)", 100*r[2]/sum, "0.3")
	// Referred to the outside: U_o·A_o = U_i·A_i, exact.
	uo, _ := w.U(Outside)
	withinRel(t, "U_o·d_o = U_i·d_i", uo*do, u*di, 1e-14)
	// Per-metre wall resistance equals the area form divided by π·d_i.
	withinRel(t, "R'_wall vs area form", rw, r[2]/(math.Pi*di), 1e-14)
}

func TestTubeWallErrors(t *testing.T) {
	t.Parallel()
	good := TubeWall{Di: 0.05, Do: 0.06, K: 47, HInside: 40, HOutside: 1e4}
	for _, mod := range []func(*TubeWall){
		func(w *TubeWall) { w.Do = 0.04 },
		func(w *TubeWall) { w.K = 0 },
		func(w *TubeWall) { w.HInside = 0 },
		func(w *TubeWall) { w.HOutside = math.NaN() },
		func(w *TubeWall) { w.FoulingInside = -1e-3 },
	} {
		w := good
		mod(&w)
		if _, err := w.U(Inside); !errors.Is(err, ErrInput) {
			t.Errorf("%+v: want ErrInput, got %v", w, err)
		}
	}
	// A perfect film (+Inf) is allowed: U is then the rest of the series.
	w := good
	w.HOutside = math.Inf(1)
	u, err := w.U(Inside)
	mustNoErr(t, err)
	within(t, "U with perfect outside film", 1/u, 1.0/40+0.025*math.Log(0.06/0.05)/47, 1e-15)
}

// TestSteelConductivity: EN 1993-1-2 §3.4.1.3 (docs/reference/heat-transfer.md §7 [S✓
// form]), table [C] to its rounding; 27.3 from 800 °C.
func TestSteelConductivity(t *testing.T) {
	t.Parallel()
	for _, c := range []struct {
		theta float64
		want  string
	}{{20, "53.33"}, {100, "50.67"}, {200, "47.34"}, {250, "45.68"}, {300, "44.01"}, {400, "40.68"}, {800, "27.3"}, {1200, "27.3"}} {
		k, err := SteelConductivity(c.theta + 273.15)
		mustNoErr(t, err)
		printed(t, fmt.Sprintf("steel λ at %g °C", c.theta), k, c.want)
	}
	k, _ := SteelConductivity(799.999 + 273.15)
	printed(t, "54 − 0.0333·800 (docs/reference/heat-transfer.md §7)", k, "27.36")
	for _, T := range []float64{273.15, 1500} {
		if _, err := SteelConductivity(T); !errors.Is(err, ErrRange) {
			t.Errorf("T = %g K: want ErrRange, got %v", T, err)
		}
	}
	if _, err := SteelConductivity(math.NaN()); !errors.Is(err, ErrInput) {
		t.Errorf("NaN: want ErrInput, got %v", err)
	}
}
