package heat

import (
	"errors"
	"fmt"
	"math"
	"testing"
)

// TestGnielinskiSheetTable checks the table of docs/reference/heat-transfer.md §2 [C]:
// f (Petukhov), Nu (1976 form, Petukhov f), Nu (Filonenko f), Nu (VDI form,
// Konakov ξ, Re, fully developed) and Dittus-Boelter n = 0.3 and 0.4, to
// the printed rounding.
func TestGnielinskiSheetTable(t *testing.T) {
	t.Parallel()
	for _, c := range []struct {
		Re, Pr                            float64
		f, nu76, nuFil, nuVDI, db03, db04 string
	}{
		{20000, 0.7, "0.026151", "51.3706", "51.2961", "52.9829", "57.0271", "55.0289"},
		{10000, 0.7, "0.031480", "29.8174", "29.7728", "32.3192", "32.7535", "31.6058"},
		{50000, 0.7, "0.020958", "104.1883", "104.0419", "104.6552", "118.6952", "114.5363"},
		{4000, 0.7, "0.041441", "13.4872", "13.4660", "17.4115", "15.7364", "15.1850"},
	} {
		name := fmt.Sprintf("docs/reference/heat-transfer.md §2 Re=%g Pr=%g", c.Re, c.Pr)
		f, err := FrictionFactor(Petukhov, c.Re)
		mustNoErr(t, err)
		printed(t, name+" f Petukhov", f, c.f)
		nu, err := Gnielinski(c.Re, c.Pr, f)
		mustNoErr(t, err)
		printed(t, name+" Nu 1976", nu, c.nu76)
		ff, _ := FrictionFactor(Filonenko, c.Re)
		nu, _ = Gnielinski(c.Re, c.Pr, ff)
		printed(t, name+" Nu Filonenko", nu, c.nuFil)
		nu, w, err := GnielinskiVDI(c.Re, c.Pr, 0)
		mustNoErr(t, err)
		printed(t, name+" Nu VDI", nu, c.nuVDI)
		if (c.Re < 1e4) != w.Has(WarnVDIBelowRange) {
			t.Errorf("%s: VDI warning %v, want set only below 1e4 (the sheet marks 4000 outside its range)", name, w)
		}
		// The TubeFlow default at these Re is the 1976 form (Re ≥ 4000).
		nu, _, err = TubeFlow{}.Nusselt(c.Re, c.Pr)
		mustNoErr(t, err)
		printed(t, name+" TubeFlow default", nu, c.nu76)
		if c.Re >= 1e4 {
			db, err := DittusBoelter(c.Re, c.Pr, 60, false)
			mustNoErr(t, err)
			printed(t, name+" Dittus-Boelter n=0.3", db, c.db03)
			db, _ = DittusBoelter(c.Re, c.Pr, 60, true)
			printed(t, name+" Dittus-Boelter n=0.4", db, c.db04)
		} else {
			// Re = 4000 is below the Dittus-Boelter range Re ≥ 1e4 (docs/reference/heat-transfer.md §3): refused.
			if _, err := DittusBoelter(c.Re, c.Pr, 60, false); !errors.Is(err, ErrRange) {
				t.Errorf("%s: Dittus-Boelter below 1e4 must be ErrRange, got %v", name, err)
			}
		}
	}
	// Filonenko is "the same to 0.2 %" (docs/reference/heat-transfer.md §2).
	for _, re := range []float64{3000, 1e4, 1e5, 1e6, 5e6} {
		fp, _ := FrictionFactor(Petukhov, re)
		ff, _ := FrictionFactor(Filonenko, re)
		withinRel(t, fmt.Sprintf("Filonenko vs Petukhov at Re=%g", re), ff, fp, 0.002)
	}
}

// TestPublishedExamples: the library examples quoted in docs/reference/heat-transfer.md §2
// and §3 [S✓, one library docstring], reproduced to 1e-12.
func TestPublishedExamples(t *testing.T) {
	t.Parallel()
	nu, err := Gnielinski(1e5, 1.2, 0.0185)
	mustNoErr(t, err)
	withinRel(t, "Gnielinski Re=1e5 Pr=1.2 f=0.0185 (docs/reference/heat-transfer.md §2)", nu, 254.62682749359632, 1e-12)
	db, _ := DittusBoelter(1e5, 1.2, 60, true)
	withinRel(t, "Dittus-Boelter n=0.4 (docs/reference/heat-transfer.md §3)", db, 247.40036409449127, 1e-12)
	db, _ = DittusBoelter(1e5, 1.2, 60, false)
	withinRel(t, "Dittus-Boelter n=0.3 (docs/reference/heat-transfer.md §3)", db, 242.9305927410295, 1e-12)
}

// TestTransition checks the transition rows of docs/reference/heat-transfer.md §2 [C]:
// Nu_lam = 3.66, VDI Nu_turb(1e4) = 32.3192, γ = (Re − 2300)/(1e4 − 2300);
// and the 2013 end point Re = 4000 with the VDI form: Re = 3000 gives
// γ = 0.4118 and Nu = 9.3224.
func TestTransition(t *testing.T) {
	t.Parallel()
	vdi := TubeFlow{Form: VDIForm, TransitionEnd: 1e4}
	for _, c := range []struct {
		Re    float64
		gamma string
		nu    string
	}{{3000, "0.0909", "6.2654"}, {5000, "0.3506", "13.7093"}, {7000, "0.6104", "21.1533"}} {
		nu, w, err := vdi.Nusselt(c.Re, 0.7)
		mustNoErr(t, err)
		printed(t, fmt.Sprintf("VDI transition Re=%g Nu", c.Re), nu, c.nu)
		printed(t, fmt.Sprintf("VDI transition Re=%g γ", c.Re), (c.Re-2300)/(1e4-2300), c.gamma)
		if w != 0 {
			t.Errorf("Re=%g: end point 1e4 is in the VDI range, got warning %v", c.Re, w)
		}
	}
	vdi2013 := TubeFlow{Form: VDIForm} // end point 4000
	nu, w, err := vdi2013.Nusselt(3000, 0.7)
	mustNoErr(t, err)
	printed(t, "2013 end point, VDI Nu_turb, Re=3000", nu, "9.3224")
	printed(t, "2013 end point γ", (3000.0-2300)/(4000-2300), "0.4118")
	if !w.Has(WarnVDIBelowRange) {
		t.Error("VDI form at Re = 4000 must be flagged")
	}
	// Laminar: 3.66 / 4.36 (textbook [S]).
	if nu, _, _ := (TubeFlow{}).Nusselt(1000, 0.7); nu != 3.66 {
		t.Errorf("laminar UWT: %g", nu)
	}
	if nu, _, _ := (TubeFlow{UniformHeatFlux: true}).Nusselt(2300, 0.7); nu != 4.36 {
		t.Errorf("laminar UHF: %g", nu)
	}
	// Default curve is continuous at 2300 and 4000 (by construction of the
	// 2013 interpolation; common practice, no source for numbers).
	m := TubeFlow{}
	a, _, _ := m.Nusselt(2300, 0.7)
	b, _, _ := m.Nusselt(2300*(1+1e-12), 0.7)
	within(t, "continuity at 2300", b, a, 1e-9)
	a, _, _ = m.Nusselt(4000*(1-1e-12), 0.7)
	b, _, _ = m.Nusselt(4000, 0.7)
	within(t, "continuity at 4000", a, b, 1e-9)
	// Entrance factor [1 + (d/L)^(2/3)] is 1.06-1.07 for L/d 50-80 (docs/reference/heat-transfer.md §2 [S, memory]).
	for _, ld := range []float64{50, 80} {
		n0, _, _ := m.Nusselt(2e4, 0.7)
		n1, _, _ := TubeFlow{DOverL: 1 / ld}.Nusselt(2e4, 0.7)
		if r := n1 / n0; r < 1.05 || r > 1.075 {
			t.Errorf("entrance factor at L/d=%g: %.4f, want 1.06-1.07", ld, r)
		}
	}
}

func TestConvectionRanges(t *testing.T) {
	t.Parallel()
	f := 0.02
	for _, c := range []struct {
		Re, Pr float64
		want   error
	}{
		{2999, 0.7, ErrRange}, {5.1e6, 0.7, ErrRange}, {1e4, 0.49, ErrRange}, {1e4, 2001, ErrRange},
		{-5, 0.7, ErrInput}, {math.NaN(), 0.7, ErrInput}, {1e4, math.NaN(), ErrInput},
	} {
		if _, err := Gnielinski(c.Re, c.Pr, f); !errors.Is(err, c.want) {
			t.Errorf("Gnielinski(%g, %g): got %v, want %v", c.Re, c.Pr, err, c.want)
		}
	}
	if _, err := Gnielinski(1e4, 0.7, -1); !errors.Is(err, ErrInput) {
		t.Errorf("negative f: %v", err)
	}
	if _, _, err := (TubeFlow{}).Nusselt(6e6, 0.7); !errors.Is(err, ErrRange) {
		t.Errorf("TubeFlow Re=6e6: %v", err)
	}
	if _, _, err := (TubeFlow{}).Nusselt(1e4, 0.3); !errors.Is(err, ErrRange) {
		t.Errorf("TubeFlow Pr=0.3: %v", err)
	}
	if _, _, err := (TubeFlow{TransitionEnd: 100}).Nusselt(1e4, 0.7); !errors.Is(err, ErrInput) {
		t.Errorf("TransitionEnd=100: %v", err)
	}
	if _, err := DittusBoelter(1e5, 0.7, 9, false); !errors.Is(err, ErrRange) {
		t.Errorf("DittusBoelter L/d = 9: %v", err)
	}
	for _, c := range []struct{ Re, Pr float64 }{{9999, 0.7}, {1e4, 0.59}, {1e4, 161}} {
		if _, err := DittusBoelter(c.Re, c.Pr, 60, false); !errors.Is(err, ErrRange) {
			t.Errorf("DittusBoelter(%g, %g): %v", c.Re, c.Pr, err)
		}
	}
}
