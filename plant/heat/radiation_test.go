package heat

import (
	"errors"
	"fmt"
	"math"
	"testing"
)

var wsggByName = map[string]WSGGSet{
	"H2O_pw_to_0": WSGGH2OLean, "H2O_pw_1atm": WSGGH2OPure, "CO2_pc_to_0": WSGGCO2Lean,
	"H2O_CO2_pw_pc_1": WSGGRatio1, "H2O_CO2_pw_pc_2": WSGGRatio2,
}

// TestWSGGCoefficientsMatchCSV compares the embedded sets with
// testdata/wsgg-smith-shen-friedman-1982.csv (Smith, Shen & Friedman 1982,
// as printed; docs/reference/gas-radiation.md §1.2 [S✓]), applying the printed scales.
func TestWSGGCoefficientsMatchCSV(t *testing.T) {
	t.Parallel()
	col, rows := readCSV(t, "wsgg-smith-shen-friedman-1982.csv")
	if len(rows) != 15 {
		t.Fatalf("%d rows, want 15", len(rows))
	}
	for _, r := range rows {
		set := wsggByName[r[col["set"]]]
		i := int(parse(t, r[col["gray_gas_i"]]))
		c := &wsggSets[set]
		if k := parse(t, r[col["kappa_per_atm_m"]]); c.kappa[i-1] != k {
			t.Errorf("%v κ%d = %g, CSV %g", set, i, c.kappa[i-1], k)
		}
		want := [4]float64{
			parse(t, r[col["b1_times_1e1"]]) * sb1, parse(t, r[col["b2_times_1e4_per_K"]]) * sb2,
			parse(t, r[col["b3_times_1e7_per_K2"]]) * sb3, parse(t, r[col["b4_times_1e11_per_K3"]]) * sb4,
		}
		for j := range want {
			// Go folds "printed * scale" exactly at compile time, the test
			// multiplies in float64: equal to the last bit or two.
			withinRel(t, fmt.Sprintf("%v b%d%d", set, i, j+1), c.b[i-1][j], want[j], 4e-16)
		}
	}
}

// TestWSGGCheckValues runs all 72 rows of wsgg-check-values.csv (computed
// from the set coefficients [C], docs/reference/gas-radiation.md §2) to the printed
// rounding of 6 decimals (the sheet's 1e-9 applies to unrounded numbers).
func TestWSGGCheckValues(t *testing.T) {
	t.Parallel()
	col, rows := readCSV(t, "wsgg-check-values.csv")
	if len(rows) != 72 {
		t.Fatalf("%d rows, want 72", len(rows))
	}
	for _, r := range rows {
		set := wsggByName[r[col["set"]]]
		T := parse(t, r[col["T_K"]])
		g := RadiatingGas{Set: set, PH2O: parse(t, r[col["pw_atm"]]) * StandardAtmosphere,
			PCO2: parse(t, r[col["pc_atm"]]) * StandardAtmosphere, PathLength: parse(t, r[col["L_m"]])}
		name := fmt.Sprintf("%s T=%g L=%g (wsgg-check-values.csv, %s)", set, T, g.PathLength, r[col["provenance"]])
		a := set.Weights(T)
		for i, key := range []string{"a0", "a1", "a2", "a3"} {
			printed(t, name+" "+key, a[i], r[col[key]])
		}
		e, w, err := g.Emissivity(T)
		mustNoErr(t, err)
		printed(t, name+" ε", e, r[col["emissivity"]])
		_, paL, _, _ := g.check("")
		printed(t, name+" pa·L", paL, r[col["paL_atm_m"]])
		if w.Has(WarnWSGGTemperature) {
			t.Errorf("%s: 600-2400 K must not warn", name)
		}
	}
}

// TestWSGGSheetTables checks the tables printed in docs/reference/gas-radiation.md §2 [C].
func TestWSGGSheetTables(t *testing.T) {
	t.Parallel()
	atm := StandardAtmosphere
	for _, c := range []struct {
		set          WSGGSet
		pw, pc, L    float64
		e1000, e1500 string
		paL          string
	}{
		{WSGGRatio1, 0.1, 0.1, 1.0, "0.259984", "0.203481", "0.2"},
		{WSGGRatio1, 0.1, 0.1, 0.5, "0.188817", "0.140368", "0.1"},
		{WSGGRatio1, 0.1, 0.1, 2.0, "0.329358", "0.265610", "0.4"},
		{WSGGRatio1, 0.095, 0.125, 0.922, "0.261486", "0.204818", "0.2028"},
		{WSGGRatio2, 0.2, 0.1, 1.0, "0.332807", "0.267036", "0.3"},
		{WSGGRatio2, 0.12, 0.06, 1.0, "0.272885", "0.212434", "0.18"},
		{WSGGH2OLean, 0.1, 0, 1.0, "0.149665", "0.117240", "0.1"},
		{WSGGH2OPure, 1.0, 0, 0.1, "0.200276", "0.130317", "0.1"},
		{WSGGCO2Lean, 0, 0.1, 1.0, "0.115825", "0.094793", "0.1"},
	} {
		g := RadiatingGas{Set: c.set, PH2O: c.pw * atm, PCO2: c.pc * atm, PathLength: c.L}
		name := fmt.Sprintf("docs/reference/gas-radiation.md §2 %v pw=%g pc=%g L=%g", c.set, c.pw, c.pc, c.L)
		e, _, err := g.Emissivity(1000)
		mustNoErr(t, err)
		printed(t, name+" ε(1000 K)", e, c.e1000)
		e, _, _ = g.Emissivity(1500)
		printed(t, name+" ε(1500 K)", e, c.e1500)
		_, paL, _, _ := g.check("")
		printed(t, name+" pa·L", paL, c.paL)
	}
	// Weights of the pw/pc = 1 set, docs/reference/gas-radiation.md §2 [C].
	for _, c := range []struct {
		T float64
		a [4]string
	}{
		{1000, [4]string{"0.347802", "0.367550", "0.225390", "0.059258"}},
		{1500, [4]string{"0.437099", "0.339155", "0.197752", "0.025993"}},
	} {
		a := WSGGRatio1.Weights(c.T)
		for i := range a {
			printed(t, fmt.Sprintf("pw/pc=1 a%d at %g K (docs/reference/gas-radiation.md §2)", i, c.T), a[i], c.a[i])
		}
	}
}

// TestWSGGWeightSigns checks "Sign of the weights [C]" of docs/reference/gas-radiation.md
// §1.4, evaluated every 10 K over 600-2400 K: a0 > 0 in every set with
// minimum 0.244 (pw/pc = 2); a3 of the H2O sets dips to −0.0006 (pw → 0)
// and −0.0003 (pw = 1 atm). Tolerance: the sheet's rounding.
func TestWSGGWeightSigns(t *testing.T) {
	t.Parallel()
	minA0 := math.Inf(1)
	var minSet WSGGSet
	for set := WSGGH2OLean; set < numWSGGSets; set++ {
		minA3 := math.Inf(1)
		for T := 600.0; T <= 2400; T += 10 {
			a := set.Weights(T)
			if a[0] <= 0 {
				t.Errorf("%v: a0 = %g at %g K, want > 0", set, a[0], T)
			}
			if a[0] < minA0 {
				minA0, minSet = a[0], set
			}
			minA3 = math.Min(minA3, a[3])
		}
		switch set {
		case WSGGH2OLean:
			printed(t, "min a3, H2O pw→0", minA3, "-0.0006")
		case WSGGH2OPure:
			printed(t, "min a3, H2O pw=1atm", minA3, "-0.0003")
		}
	}
	printed(t, "min a0 over all sets", minA0, "0.244")
	if minSet != WSGGRatio2 {
		t.Errorf("min a0 in set %v, want pw/pc=2", minSet)
	}
}

// TestSelectWSGGSet follows the switching rule of copy A (docs/reference/gas-radiation.md
// §1.4 [CP]) and the sheet's choice for HFO flue gas (pw/pc = 0.76 → set 1),
// gas oil (0.91 → set 1) and methane (2 → set 2).
func TestSelectWSGGSet(t *testing.T) {
	t.Parallel()
	atm := StandardAtmosphere
	for _, c := range []struct {
		pw, pc float64
		want   WSGGSet
	}{
		{0.0950, 0.1247, WSGGRatio1}, // HFO, docs/reference/plant-checks.md §2.1 (pw/pc = 0.76)
		{0.091, 0.100, WSGGRatio1},   // gas oil pw/pc = 0.91
		{0.18, 0.09, WSGGRatio2},     // methane pw/pc = 2
		{0.05, 0.1, WSGGCO2Lean},     // pw = 0.5·pc: boundary belongs to the CO2 set
		{0.15, 0.1, WSGGRatio1},      // 1.5·pc boundary
		{0.25, 0.1, WSGGRatio2},      // 2.5·pc boundary
		{0.3, 0.1, WSGGH2OLean},      // pw ≤ 0.5 atm
		{0.6, 0.1, WSGGH2OPure},      // pw > 0.5 atm
	} {
		if got := SelectWSGGSet(c.pw*atm, c.pc*atm); got != c.want {
			t.Errorf("pw=%g pc=%g: got %v, want %v", c.pw, c.pc, got, c.want)
		}
	}
	// WSGGAuto in RadiatingGas uses the rule.
	g := RadiatingGas{PH2O: 0.095 * atm, PCO2: 0.125 * atm, PathLength: 0.922}
	e, _, _ := g.Emissivity(1000)
	printed(t, "auto set for HFO gas (docs/reference/gas-radiation.md §2)", e, "0.261486")
}

// TestWSGGWarningsAndErrors: outside 600-2400 K or 0.001-10 atm·m the value
// is computed and flagged (ranges from memory, docs/reference/gas-radiation.md §1.1 [M]);
// nonsense is an error.
func TestWSGGWarningsAndErrors(t *testing.T) {
	t.Parallel()
	atm := StandardAtmosphere
	g := RadiatingGas{Set: WSGGRatio1, PH2O: 0.1 * atm, PCO2: 0.1 * atm, PathLength: 1}
	if _, w, err := g.Emissivity(500); err != nil || !w.Has(WarnWSGGTemperature) {
		t.Errorf("500 K: want WarnWSGGTemperature, got %v, %v", w, err)
	}
	if _, w, err := g.Emissivity(2500); err != nil || !w.Has(WarnWSGGTemperature) {
		t.Errorf("2500 K: want WarnWSGGTemperature, got %v, %v", w, err)
	}
	// Above 3000 K the weights are refused (this package's limit: the cubic
	// polynomials turn upward there).
	if _, _, err := g.Emissivity(3500); !errors.Is(err, ErrRange) {
		t.Errorf("3500 K: want ErrRange, got %v", err)
	}
	if _, w, err := g.Emissivity(2900); err != nil || !w.Has(WarnWSGGTemperature) {
		t.Errorf("2900 K: want a value with WarnWSGGTemperature, got %v, %v", w, err)
	}
	long := g
	long.PathLength = 100
	if _, w, _ := long.Emissivity(1000); !w.Has(WarnWSGGPathLength) {
		t.Errorf("pa·L = 20 atm·m: want WarnWSGGPathLength, got %v", w)
	}
	if w := WarnWSGGPathLength | WarnWSGGTemperature; w.String() == "" {
		t.Error("warnings must print")
	}
	for _, bad := range []RadiatingGas{
		{Set: WSGGRatio1, PH2O: -1, PCO2: 0.1 * atm, PathLength: 1},
		{Set: WSGGRatio1, PH2O: math.NaN(), PCO2: 0.1 * atm, PathLength: 1},
		{Set: WSGGRatio1, PH2O: 0.1 * atm, PCO2: 0.1 * atm, PathLength: math.Inf(1)},
		{Set: 17, PH2O: 0.1 * atm, PCO2: 0.1 * atm, PathLength: 1},
	} {
		if _, _, err := bad.Emissivity(1000); !errors.Is(err, ErrInput) {
			t.Errorf("%+v: want ErrInput, got %v", bad, err)
		}
	}
	if _, _, err := g.Emissivity(math.NaN()); !errors.Is(err, ErrInput) {
		t.Errorf("NaN T: want ErrInput, got %v", err)
	}
	// Zero path: transparent, exactly.
	z := g
	z.PathLength = 0
	if e, w, err := z.Emissivity(1000); e != 0 || w != 0 || err != nil {
		t.Errorf("L = 0: got %g, %v, %v; want 0", e, w, err)
	}
}

// TestAbsorptivity: with the wall at the gas temperature the WSGG
// absorptivity equals the emissivity (Kirchhoff, exact); a colder wall
// shifts the weights (common practice, no source for the value).
func TestAbsorptivity(t *testing.T) {
	t.Parallel()
	g := RadiatingGas{Set: WSGGRatio1, PH2O: 0.095 * StandardAtmosphere, PCO2: 0.125 * StandardAtmosphere, PathLength: 0.922}
	e, _, _ := g.Emissivity(1200)
	a, _, err := g.Absorptivity(1200)
	mustNoErr(t, err)
	withinRel(t, "α(Ts = Tg) = ε", a, e, 1e-15)
	a470, w, _ := g.Absorptivity(470)
	if !w.Has(WarnWSGGTemperature) {
		t.Error("470 K source must be flagged outside 600-2400 K")
	}
	if !(a470 > 0 && a470 < 1) {
		t.Errorf("α(470 K) = %g, want in (0, 1)", a470)
	}
}

// TestBeamLength checks docs/reference/gas-radiation.md §4.
func TestBeamLength(t *testing.T) {
	t.Parallel()
	// L0 = 4V/A by hand [C]: sphere 2D/3, long cylinder D, slab 2s.
	D := 1.3
	l, _ := BeamLengthThin(math.Pi*D*D*D/6, math.Pi*D*D)
	withinRel(t, "sphere 4V/A = 2D/3 (docs/reference/gas-radiation.md §4)", l, 2*D/3, 1e-15)
	l, _ = BeamLengthThin(math.Pi*D*D/4*1, math.Pi*D*1) // per metre, curved surface only
	withinRel(t, "long cylinder 4V/A = D (docs/reference/gas-radiation.md §4)", l, D, 1e-15)
	s := 0.4
	l, _ = BeamLengthThin(s*1, 2*1)
	withinRel(t, "slab 4V/A = 2s (docs/reference/gas-radiation.md §4)", l, 2*s, 1e-15)

	// Furnace D = 1.2 m, length 3.5 m, ends included [C]: L_m = 0.922 m,
	// 4V/A = 1.024 m, 0.95·D = 1.14 m.
	V := math.Pi * 0.36 * 3.5
	A := math.Pi*1.2*3.5 + 2*math.Pi*0.36
	printed(t, "furnace V (docs/reference/heat-transfer.md §8)", V, "3.9584")
	printed(t, "furnace A_w (docs/reference/heat-transfer.md §8)", A, "15.4566")
	lm, err := BeamLength(V, A)
	mustNoErr(t, err)
	printed(t, "furnace L_m = 3.6 V/A (docs/reference/gas-radiation.md §4)", lm, "0.922")
	printed(t, "furnace L_m (docs/reference/heat-transfer.md §8)", lm, "0.9220")
	l0, _ := BeamLengthThin(V, A)
	printed(t, "furnace 4V/A (docs/reference/gas-radiation.md §4)", l0, "1.024")
	lc, _ := BeamLengthShape(LongCylinder, 1.2)
	printed(t, "0.95 D (docs/reference/gas-radiation.md §4)", lc, "1.14")
	// Smoke tube d_i = 56.3 mm: L_m = 53.5 mm [C].
	lt, _ := BeamLengthShape(LongCylinder, 0.0563)
	printed(t, "smoke tube L_m (docs/reference/gas-radiation.md §4)", lt*1000, "53.5")
	// Factors of Hottel's table [S, memory].
	for _, c := range []struct {
		s BeamShape
		f float64
	}{{Sphere, 0.65}, {CylinderHD, 0.60}, {Slab, 1.8}, {CubeFace, 0.60}, {BankTriangle2D, 3.0}, {BankTriangle3D, 3.8}, {BankSquare2D, 3.5}} {
		l, _ := BeamLengthShape(c.s, 2)
		withinRel(t, fmt.Sprintf("shape %d factor (docs/reference/gas-radiation.md §4, from memory)", c.s), l, 2*c.f, 1e-15)
	}
	if _, err := BeamLength(-1, 2); !errors.Is(err, ErrInput) {
		t.Errorf("negative volume: want ErrInput, got %v", err)
	}
	if _, err := BeamLengthShape(Slab, 0); !errors.Is(err, ErrInput) {
		t.Errorf("zero dimension: want ErrInput, got %v", err)
	}
}

// TestTubeRadiation checks the smoke-tube figures of docs/reference/gas-radiation.md §4
// [C, pw/pc = 1 set]: pa = 0.22 atm, L = 0.95·56.3 mm, pa·L = 0.0118 atm·m;
// ε_g = 0.107, 0.088, 0.072 at 600, 800, 1000 K; with ε_w = 0.8 and the wall
// at 470 K, h_rad = 3.7, 5.3, 7.2 W/(m²·K).
func TestTubeRadiation(t *testing.T) {
	t.Parallel()
	atm := StandardAtmosphere
	L, _ := BeamLengthShape(LongCylinder, 0.0563)
	g := RadiatingGas{Set: WSGGRatio1, PH2O: 0.095 * atm, PCO2: 0.125 * atm, PathLength: L}
	_, paL, _, _ := g.check("")
	printed(t, "tube pa·L", paL, "0.0118")
	for _, c := range []struct {
		T        float64
		eps, hr  string
		warnTemp bool
	}{{600, "0.107", "3.7", false}, {800, "0.088", "5.3", false}, {1000, "0.072", "7.2", false}} {
		e, _, err := g.Emissivity(c.T)
		mustNoErr(t, err)
		printed(t, fmt.Sprintf("tube ε_g at %g K", c.T), e, c.eps)
		ee, _ := EffectiveEmissivity(e, 0.8)
		hr := RadiationCoefficient(ee, c.T, 470)
		printed(t, fmt.Sprintf("tube h_rad at %g K", c.T), hr, c.hr)
		// The factored form equals the defining quotient.
		withinRel(t, "h_rad form", hr, StefanBoltzmann*ee*(math.Pow(c.T, 4)-math.Pow(470, 4))/(c.T-470), 1e-12)
	}
}

// TestSoot checks docs/reference/gas-radiation.md §5 [C]: C0 = 7.0274 and 3.72·C0/C2 =
// 1816.9 (Shaddix n, k), 3.83·C0/C2 = 1870.7, Dalzell-Sarofim C0 = 4.8922 and
// 1264.9; the example f_v = 1e-7, T = 1450 K, L = 0.922 m gives ε_soot =
// 0.216, and with ε_gas = 0.211, ε_flame = 0.381.
func TestSoot(t *testing.T) {
	t.Parallel()
	k := SootConstant(SootShaddixN, SootShaddixK, 3.72)
	printed(t, "C0 Shaddix", k*secondRadiationConstant/3.72, "7.0274")
	printed(t, "3.72·C0/C2 Shaddix", k, "1816.9")
	printed(t, "3.83·C0/C2 Shaddix", SootConstant(1.75, 1.03, 3.83), "1870.7")
	kd := SootConstant(SootDalzellSarofimN, SootDalzellSarofimK, 3.72)
	printed(t, "C0 Dalzell-Sarofim", kd*secondRadiationConstant/3.72, "4.8922")
	printed(t, "3.72·C0/C2 Dalzell-Sarofim", kd, "1264.9")
	es := SootEmissivity(SootAbsorption(k, 1e-7, 1450), 0.922)
	printed(t, "ε_soot example", es, "0.216")
	printed(t, "ε_flame example", FlameEmissivity(0.211, es), "0.381")
	if _, err := BlendedFlameEmissivity(1.2, 0.5, 0.2); !errors.Is(err, ErrInput) {
		t.Errorf("m = 1.2: want ErrInput, got %v", err)
	}
	// m·ε_lum + (1 − m)·ε_non (formula from memory [M]): arithmetic check.
	b, _ := BlendedFlameEmissivity(0.55, 0.6, 0.2)
	withinRel(t, "blended flame emissivity", b, 0.55*0.6+0.45*0.2, 1e-15)
}

// TestEffectiveEmissivity: ε_eff = 1/(1/ε_g + 1/ε_w − 1), docs/reference/heat-transfer.md
// §8 (the case values B and C are checked in TestFurnaceSheetCases, from
// unrounded ε_g); here the algebra: 0.5 and 0.5 give 1/3.
func TestEffectiveEmissivity(t *testing.T) {
	t.Parallel()
	e, err := EffectiveEmissivity(0.5, 0.5)
	mustNoErr(t, err)
	withinRel(t, "ε_eff(0.5, 0.5)", e, 1.0/3, 1e-15)
	if e, _ := EffectiveEmissivity(1, 1); e != 1 {
		t.Errorf("black gas and wall: %g, want 1", e)
	}
	if e, _ := EffectiveEmissivity(0, 0.8); e != 0 {
		t.Errorf("transparent gas: %g, want 0", e)
	}
	if _, err := EffectiveEmissivity(1.1, 0.8); !errors.Is(err, ErrInput) {
		t.Errorf("ε_g = 1.1: want ErrInput, got %v", err)
	}
}

// TestWSGGCopyCClearGas: copy C of docs/reference/gas-radiation.md §1.3 stores the
// pw/pc = 2 clear-gas weight as a0 = 1 − (8.9756·1e-1 − 2.557·1e-4·T +
// 0.368·1e-7·T² − 0.437·1e-11·T³), the column sums of the printed rows: an
// internal consistency check of the embedded set.
func TestWSGGCopyCClearGas(t *testing.T) {
	t.Parallel()
	for T := 600.0; T <= 2400; T += 200 {
		want := 1 - (8.9756*sb1 - 2.557*sb2*T + 0.368*sb3*T*T - 0.437*sb4*T*T*T)
		within(t, fmt.Sprintf("a0 pw/pc=2 at %g K (copy C)", T), WSGGRatio2.Weights(T)[0], want, 1e-13)
	}
}
