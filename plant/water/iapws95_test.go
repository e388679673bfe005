package water

import (
	"encoding/csv"
	"math"
	"os"
	"strconv"
	"testing"
)

// readCSV reads a testdata csv file into header-keyed rows of numbers
// (non-numeric cells are kept as NaN and their text in the raw rows).
func readCSV(t *testing.T, name string) (hdr map[string]int, rows [][]string) {
	t.Helper()
	f, err := os.Open(name)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	all, err := csv.NewReader(f).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	hdr = map[string]int{}
	for k, h := range all[0] {
		hdr[h] = k
	}
	return hdr, all[1:]
}

func cell(t *testing.T, hdr map[string]int, r []string, col string) float64 {
	t.Helper()
	k, ok := hdr[col]
	if !ok {
		t.Fatalf("column %q missing", col)
	}
	v, err := strconv.ParseFloat(r[k], 64)
	if err != nil {
		t.Fatalf("column %q: %v", col, err)
	}
	return v
}

// TestIAPWS95Grid compares PT with testdata/water-iapws95-grid.csv:
// IAPWS-95 (IAPWS R6-95(2018)) values computed with python3-iapws, class
// IAPWS95, in the shared reference set. Tolerances are the reference set's
// suggestion: Δv/v 0.05 %, Δh 0.5 kJ/kg, Δs 0.001 kJ/(kg K), Δcp/cp 1 %,
// Δw/w 0.5 %. The file's cv and u columns are checked too, with the
// tolerances of cp and h (not part of the suggestion).
func TestIAPWS95Grid(t *testing.T) {
	t.Parallel()
	hdr, rows := readCSV(t, "testdata/water-iapws95-grid.csv")
	if len(rows) != 156 {
		t.Fatalf("%d rows, want 156", len(rows))
	}
	for _, r := range rows {
		p := cell(t, hdr, r, "p_MPa") * 1e6
		tk := cell(t, hdr, r, "T_K")
		st, err := PT(p, tk)
		if err != nil {
			t.Errorf("PT(%g Pa, %g K): %v", p, tk, err)
			continue
		}
		wantPhase := Liquid
		if r[hdr["phase"]] == "vapour" {
			wantPhase = Vapour
		}
		if st.Phase != wantPhase {
			t.Errorf("IAPWS-95 grid p=%g MPa T=%g K: phase %v, want %v", p/1e6, tk, st.Phase, wantPhase)
		}
		v := cell(t, hdr, r, "v_m3_per_kg")
		h := cell(t, hdr, r, "h_kJ_per_kg") * 1e3
		s := cell(t, hdr, r, "s_kJ_per_kgK") * 1e3
		cp := cell(t, hdr, r, "cp_kJ_per_kgK") * 1e3
		w := cell(t, hdr, r, "w_m_per_s")
		cv := cell(t, hdr, r, "cv_kJ_per_kgK") * 1e3
		u := cell(t, hdr, r, "u_kJ_per_kg") * 1e3
		checks := []struct {
			name      string
			got, want float64
			dev, tol  float64
		}{
			{"v (rel.)", st.V, v, math.Abs(st.V-v) / v, 5e-4},
			{"h (J/kg)", st.H, h, math.Abs(st.H - h), 500},
			{"s (J/(kg K))", st.S, s, math.Abs(st.S - s), 1},
			{"cp (rel.)", st.Cp, cp, math.Abs(st.Cp-cp) / cp, 1e-2},
			{"w (rel.)", st.W, w, math.Abs(st.W-w) / w, 5e-3},
			// Not in the suggestion: cv with the cp tolerance, u with h's.
			{"cv (rel.)", st.Cv, cv, math.Abs(st.Cv-cv) / cv, 1e-2},
			{"u (J/kg)", st.U, u, math.Abs(st.U - u), 500},
		}
		for _, c := range checks {
			if !(c.dev <= c.tol) {
				t.Errorf("IAPWS-95 grid (python3-iapws IAPWS95) p=%g MPa T=%g K %s: got %.9g, want %.9g, deviation %.3g > %.3g",
					p/1e6, tk, c.name, c.got, c.want, c.dev, c.tol)
			}
		}
	}
}

// TestIAPWS95Saturation compares Psat, TX(T,0) and TX(T,1) with
// testdata/water-iapws95-saturation.csv: IAPWS-95 (IAPWS R6-95(2018))
// saturation values computed with python3-iapws, class IAPWS95, in the
// shared reference set. Up to 600 K the tolerances are the set's
// suggestion (Δp_sat/p_sat 0.05 %, Δv/v 0.05 %, Δh 0.5 kJ/kg, Δs 0.001
// kJ/(kg K)). From 610 K to 640 K the set's README measured IF97 against
// IAPWS-95 at up to 1.4e-3 in v”, 1.09 kJ/kg in h” and 1.7e-3 kJ/(kg K)
// in s”; there the test allows 0.3 %, 1.5 kJ/kg and 0.0025 kJ/(kg K).
func TestIAPWS95Saturation(t *testing.T) {
	t.Parallel()
	hdr, rows := readCSV(t, "testdata/water-iapws95-saturation.csv")
	if len(rows) != 40 {
		t.Fatalf("%d rows, want 40", len(rows))
	}
	for _, r := range rows {
		tk := cell(t, hdr, r, "T_K")
		tolV, tolH, tolS := 5e-4, 500.0, 1.0
		if tk > 600 {
			tolV, tolH, tolS = 3e-3, 1500, 2.5
		}
		ps, err := Psat(tk)
		if err != nil {
			t.Fatal(err)
		}
		want := cell(t, hdr, r, "p_sat_MPa") * 1e6
		if d := math.Abs(ps-want) / want; tk <= 600 && !(d <= 5e-4) {
			t.Errorf("IAPWS-95 saturation (python3-iapws IAPWS95) T=%g K: p_sat %.9g Pa, want %.9g, rel. dev. %.3g", tk, ps, want, d)
		}
		l, err := TX(tk, 0)
		if err != nil {
			t.Fatal(err)
		}
		v, err := TX(tk, 1)
		if err != nil {
			t.Fatal(err)
		}
		for _, c := range []struct {
			name      string
			got, want float64
			rel       bool
			tol       float64
		}{
			{"v'", l.V, cell(t, hdr, r, "v_liquid_m3_per_kg"), true, tolV},
			{"v''", v.V, cell(t, hdr, r, "v_vapour_m3_per_kg"), true, tolV},
			{"h'", l.H, cell(t, hdr, r, "h_liquid_kJ_per_kg") * 1e3, false, tolH},
			{"h''", v.H, cell(t, hdr, r, "h_vapour_kJ_per_kg") * 1e3, false, tolH},
			{"s'", l.S, cell(t, hdr, r, "s_liquid_kJ_per_kgK") * 1e3, false, tolS},
			{"s''", v.S, cell(t, hdr, r, "s_vapour_kJ_per_kgK") * 1e3, false, tolS},
		} {
			d := math.Abs(c.got - c.want)
			if c.rel {
				d /= c.want
			}
			if !(d <= c.tol) {
				t.Errorf("IAPWS-95 saturation (python3-iapws IAPWS95) T=%g K %s: got %.9g, want %.9g, deviation %.3g > %.3g",
					tk, c.name, c.got, c.want, d, c.tol)
			}
		}
	}
}
