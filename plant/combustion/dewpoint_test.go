package combustion

import (
	"fmt"
	"testing"

	"steamcase/plant/fuel"
)

func TestDewPointTable(t *testing.T) {
	t.Parallel()
	// docs/reference/plant-checks.md §4 table. Row 1 [S✓]/[C], docs/reference/plant-checks.md §11 item 6: ±0.05 K. The
	// other rows [C] are printed to 0.01 °C: held to ±0.01 K.
	cases := []struct {
		pw, ps  float64 // Pa
		vb, okk float64 // °C; okk 0 = not given
		source  string
		tol     float64
	}{
		{93.44 * mmHg, 0.0024917 * mmHg, 128.75, 0, "docs/reference/plant-checks.md §4 row 1, §11 item 6", 0.05},
		{0.11 * atm, 10e-6 * atm, 138.29, 134.40, "docs/reference/plant-checks.md §4 row 2 [C]", 0.01},
		{0.10 * atm, 1e-6 * atm, 115.66, 115.51, "docs/reference/plant-checks.md §4 row 3 [C]", 0.01},
		{0.10 * atm, 20e-6 * atm, 144.33, 139.25, "docs/reference/plant-checks.md §4 row 4 [C]", 0.01},
	}
	for _, c := range cases {
		T, err := VerhoffBanchero(c.pw, c.ps)
		if err != nil {
			t.Fatal(err)
		}
		near(t, "Verhoff-Banchero °C ("+c.source+")", T-273.15, c.vb, c.tol)
		if c.okk == 0 {
			continue
		}
		T, err = Okkes(c.pw, c.ps)
		if err != nil {
			t.Fatal(err)
		}
		near(t, "Okkes °C ("+c.source+")", T-273.15, c.okk, c.tol)
	}
	// Outside Okkes's range (from memory): refused, not extrapolated.
	if _, err := Okkes(0.3*atm, 10e-6*atm); err == nil {
		t.Errorf("Okkes outside its H2O range accepted")
	}
	if _, err := VerhoffBanchero(0.1*atm, 0); err == nil {
		t.Errorf("zero SO3 accepted")
	}
}

// Test-fuel flue gas at λ 1.15 (H2O 9.5 %, SO2 1358 ppm wet, 3 % to SO3 =
// 40.7 ppm): VB 151.3 °C, Okkes 145.1 °C (docs/reference/plant-checks.md §4 [C], printed
// to 0.1 °C: ±0.05 K).
func TestAcidDewPointOfProducts(t *testing.T) {
	t.Parallel()
	p, err := Fire(testFuel(), Conditions{Lambda: 1.15})
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		m    DewMethod
		want float64
	}{{MethodVerhoffBanchero, 151.3}, {MethodOkkes, 145.1}} {
		T, err := AcidDewPoint(p, 0, 0, c.m) // defaults: 1 atm, 3 % SO3
		if err != nil {
			t.Fatal(err)
		}
		near(t, fmt.Sprintf("method %d °C (docs/reference/plant-checks.md §4 [C])", c.m), T-273.15, c.want, 0.05)
	}
	g, _ := fuel.Grade("LNG")
	pg, _ := Fire(g, Conditions{Lambda: 1.1})
	if _, err := AcidDewPoint(pg, 0, 0, MethodVerhoffBanchero); err == nil {
		t.Errorf("acid dew point of a sulfur-free fuel accepted")
	}
}
