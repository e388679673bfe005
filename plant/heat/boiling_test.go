package heat

import (
	"errors"
	"fmt"
	"math"
	"testing"
)

// TestBoilingPublished: water at 1 atm, ΔT = 4.3 K, with the library's
// p_c = 22048321 Pa (printed "22.048 MPa" on the sheet) and M = 18.02:
// Cooper 1558.1435442153575, Mostinski 1185.0509770292663 W/(m²·K); a page
// built on the same library prints 9530.96 for Cooper at q = 1e5 W/m²
// (docs/reference/heat-transfer.md §6 [S✓, library docstring; "reproduced exactly"]).
func TestBoilingPublished(t *testing.T) {
	t.Parallel()
	b := Pool{P: 101325, Pc: 22048321, M: 18.02}
	h, w, err := b.CooperDeltaT(4.3)
	mustNoErr(t, err)
	withinRel(t, "Cooper ΔT = 4.3 K", h, 1558.1435442153575, 1e-12)
	if w != 0 {
		t.Errorf("p_r = 0.0046 is inside Cooper's range: %v", w)
	}
	m, err := b.MostinskiDeltaT(4.3)
	mustNoErr(t, err)
	withinRel(t, "Mostinski ΔT = 4.3 K", m, 1185.0509770292663, 1e-12)
	hq, _, _ := b.Cooper(1e5)
	printed(t, "Cooper q = 1e5", hq, "9530.96")
	printed(t, "Cooper q = 1e5 (sheet's recomputation)", hq, "9530.9589")
	// The two forms are one equation: h(q = h·ΔT) from ΔT gives h back.
	hq2, _, _ := b.Cooper(h * 4.3)
	withinRel(t, "Cooper q-form at q = h·ΔT", hq2, h, 1e-12)
	mq, _ := b.Mostinski(m * 4.3)
	withinRel(t, "Mostinski q-form at q = h·ΔT", mq, m, 1e-12)
}

// TestBoilingBoilerRange: the table of docs/reference/heat-transfer.md §6 [C]: Cooper with
// R_p = 1 μm, p_c = 22.064 MPa, M = 18.015; ΔT_sat = q/h in brackets.
func TestBoilingBoilerRange(t *testing.T) {
	t.Parallel()
	qs := []float64{20e3, 50e3, 100e3}
	for _, c := range []struct {
		bar              float64
		cooper, dT, most [3]string
	}{
		{5, [3]string{"4764.5", "8803.2", "14006.5"}, [3]string{"4.20", "5.68", "7.14"}, [3]string{"4195.3", "7967.5", "12943.3"}},
		{10, [3]string{"5786.7", "10691.8", "17011.4"}, [3]string{"3.46", "4.68", "5.88"}, [3]string{"4931.6", "9365.7", "15214.7"}},
		{15, [3]string{"6563.2", "12126.5", "19294.1"}, [3]string{"3.05", "4.12", "5.18"}, [3]string{"5513.7", "10471.4", "17010.8"}},
		{20, [3]string{"7230.0", "13358.6", "21254.4"}, [3]string{"2.77", "3.74", "4.70"}, [3]string{"6034.4", "11460.1", "18617.0"}},
	} {
		b := WaterPool(c.bar * 1e5)
		for i, q := range qs {
			name := fmt.Sprintf("docs/reference/heat-transfer.md §6 p=%g bar q=%g", c.bar, q)
			h, _, err := b.Cooper(q)
			mustNoErr(t, err)
			printed(t, name+" Cooper", h, c.cooper[i])
			printed(t, name+" ΔT", q/h, c.dT[i])
			m, err := b.Mostinski(q)
			mustNoErr(t, err)
			printed(t, name+" Mostinski", m, c.most[i])
		}
	}
}

func TestBoilingErrors(t *testing.T) {
	t.Parallel()
	for _, b := range []Pool{
		{P: 0, Pc: 22e6, M: 18},
		{P: 23e6, Pc: 22e6, M: 18},
		{P: 1e6, Pc: math.NaN(), M: 18},
		{P: 1e6, Pc: 22e6, M: 0},
		{P: 1e6, Pc: 22e6, M: 18, Roughness: -1},
	} {
		if _, _, err := b.Cooper(1e4); !errors.Is(err, ErrInput) {
			t.Errorf("%+v: want ErrInput, got %v", b, err)
		}
	}
	b := WaterPool(1e6)
	if _, _, err := b.Cooper(-1); !errors.Is(err, ErrInput) {
		t.Errorf("negative flux: %v", err)
	}
	if _, w, _ := WaterPool(21e6).Cooper(1e4); !w.Has(WarnCooperPressure) {
		t.Error("p_r = 0.95 must warn (Cooper's usual range 0.001-0.9, from memory)")
	}
	// Roughness: rougher surfaces boil better (exponent 0.12 − 0.2·log10 R_p
	// falls, p_r < 1): common practice, no source for the numbers.
	rough := b
	rough.Roughness = 5
	h1, _, _ := b.Cooper(3e4)
	h5, _, _ := rough.Cooper(3e4)
	if !(h5 > h1) {
		t.Errorf("R_p = 5 μm: %g, not above R_p = 1 μm: %g", h5, h1)
	}
}
