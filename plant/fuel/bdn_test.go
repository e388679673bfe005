package fuel

import (
	"errors"
	"math"
	"strings"
	"testing"

	"steamcase/plant/water"
)

// row2Water is the volume fraction of water that is 0.50 % m/m at 991
// kg/m³: 0.005·991/999.10.
const row2Water = 0.005 * 991 / WaterDensity15

// A delivery with the figures of docs/reference/plant-checks.md §1.1 row 2 (docs/reference/plant-checks.md §11 item 1):
// ρ 991, w 0.50 % m/m, a 0.05, s 2.5 → 40.165 / 42.453 MJ/kg [C].
func TestFromBDNSheetRow2(t *testing.T) {
	t.Parallel()
	base, _ := Grade("HSFO")
	d, err := FromBDN(base, BDN{Grade: "RMG 380", Density15: 991, Sulfur: 0.025, Water: row2Water, Ash: 0.0005, Viscosity: 380e-6})
	if err != nil {
		t.Fatal(err)
	}
	near(t, "net MJ/kg (docs/reference/plant-checks.md §1.1 row 2, §11 item 1 [C])", d.Energy.Net/1e6, 40.165, 0.0005)
	near(t, "gross MJ/kg (docs/reference/plant-checks.md §1.1 row 2 [C])", d.Energy.Gross/1e6, 42.453, 0.0005)
	near(t, "ISONet = Net without a stated LHV", d.ISONet, d.Energy.Net, 0)
	near(t, "water % m/m", 100*d.Fuel.ISO.Water, 0.5, 1e-12)
	if d.Energy.NetSource.Route != RouteISO8217 || d.Fuel.Name != "HSFO (BDN)" {
		t.Errorf("route %v, name %q", d.Energy.NetSource, d.Fuel.Name)
	}
	// Analysis by hand: H = (42.453078 − 40.164929 − 0.012245)/21.2058 =
	// 10.7324 %; C = 100 − 10.7324 − 2.5 − 0.3 − 0.2 − 0.5 − 0.05 =
	// 85.7176 % (N and O of the base grade).
	near(t, "H % (by hand)", 100*d.Fuel.Analysis.H, 10.7324, 0.00005)
	near(t, "C % (by hand)", 100*d.Fuel.Analysis.C, 85.7176, 0.00005)
	// Channiwala-Parikh on it, by hand 42.795 MJ/kg: +0.81 % of the ISO
	// gross value, within 2 %.
	near(t, "Channiwala-Parikh gross MJ/kg (by hand)", d.AnalysisGross/1e6, 42.7950, 0.0005)
	near(t, "Channiwala-Parikh / ISO gross − 1 (within 2 %)", d.AnalysisGross/d.ISOGross-1, 0, 0.02)
	// CO2: 0.857176 × 3.664191 = 3.1409 by the analysis, 3.114 by the IMO
	// HFO factor (docs/reference/plant-checks.md §1.3 [S]).
	near(t, "analysis CO2 (by hand)", d.CO2.Analysis, 3.1409, 0.00005)
	near(t, "IMO CO2 (docs/reference/plant-checks.md §1.3 [S])", d.CO2.IMO, 3.114, 0)
	// The stated viscosity equals the base's, so the line with the base's
	// slope is the base's line: 35 cSt at 100 °C (docs/reference/plant-checks.md §5.1
	// check B assumption) and 13 cSt at 134.4 °C (docs/reference/plant-checks.md §5.1 check B [C]).
	near(t, "ν(100 °C) cSt (docs/reference/plant-checks.md §5.1 check B)", d.Fuel.Viscosity2.Nu/cSt, 35, 1e-9)
	T, err := d.Fuel.TemperatureForViscosity(13 * cSt)
	if err != nil {
		t.Fatal(err)
	}
	near(t, "T for 13 cSt °C (docs/reference/plant-checks.md §5.1 check B [C])", T-273.15, 134.4, 0.05)
	if len(d.Warnings) != 1 || !strings.Contains(d.Warnings[0], "slope") {
		t.Errorf("warnings %q, want the one on the viscosity line", d.Warnings)
	}
}

// WaterDensity15 against IAPWS-IF97 at 15 °C and 101.325 kPa (package
// plant/water, IAPWS R7-97(2012) region 1).
func TestWaterDensity15(t *testing.T) {
	t.Parallel()
	s, err := water.PT(101325, 288.15)
	if err != nil {
		t.Fatal(err)
	}
	near(t, "ρ water 15 °C kg/m³ (IAPWS-IF97 via plant/water)", WaterDensity15, s.Rho, 0.005)
}

func TestFromBDNIMOType(t *testing.T) {
	t.Parallel()
	vlsfo, _ := Grade("VLSFO")
	mgo, _ := Grade("MGO")
	cases := []struct {
		base   Fuel
		grade  string
		lcv    float64 // MJ/kg, IMO MEPC.364(79), docs/reference/plant-checks.md §1.3 [S]
		cf     float64
		typeIn string
	}{
		{vlsfo, "", 40.2, 3.114, "HFO"}, // the base's type
		{vlsfo, "RMD 80", 41.2, 3.151, "LFO"},
		{vlsfo, "rma10", 41.2, 3.151, "LFO"},
		{vlsfo, "RME 180", 40.2, 3.114, "HFO"},
		{vlsfo, "RMK 700", 40.2, 3.114, "HFO"},
		{mgo, "DMA", 42.7, 3.206, "Diesel"},
		{mgo, "dmb", 42.7, 3.206, "Diesel"},
	}
	for _, c := range cases {
		b := BDN{Grade: c.grade, Density15: 880, Sulfur: 0.001, Viscosity: 10e-6}
		if c.base.Class == Distillate {
			b.Density15, b.Viscosity = 855, 3e-6
		}
		d, err := FromBDN(c.base, b)
		if err != nil {
			t.Fatalf("%s %q: %v", c.base.Name, c.grade, err)
		}
		near(t, c.grade+" IMO LCV MJ/kg (docs/reference/plant-checks.md §1.3 [S])", d.Energy.IMOLCV/1e6, c.lcv, 0)
		near(t, c.grade+" IMO C_F (docs/reference/plant-checks.md §1.3 [S])", d.CO2.IMO, c.cf, 0)
		if !strings.Contains(d.Fuel.IMO.Name, c.typeIn) {
			t.Errorf("%q: IMO type %q, want %s", c.grade, d.Fuel.IMO.Name, c.typeIn)
		}
		// The IMO figure never replaces the energy balance's.
		if d.Energy.Net == d.Energy.IMOLCV || d.Energy.NetSource.Route == RouteSet {
			t.Errorf("%q: net %g from %v", c.grade, d.Energy.Net, d.Energy.NetSource)
		}
	}
}

// A stated LHV is used, and one far from the ISO estimate is flagged.
func TestFromBDNStatedLHV(t *testing.T) {
	t.Parallel()
	base, _ := Grade("VLSFO")
	// docs/reference/plant-checks.md §1.1 row 4: ρ 950, w 0.10 % m/m, a 0.03, s 0.5 →
	// 41.550 MJ/kg [C]. The water by volume that gives 0.10 % m/m.
	b := BDN{Density15: 950, Sulfur: 0.005, Water: 0.001 * 950 / WaterDensity15, Ash: 0.0003, Viscosity: 150e-6,
		Viscosity2: ViscosityPoint{T: 373.15, Nu: 20e-6}}
	cases := []struct {
		lhv  float64
		warn bool
	}{
		{41.3e6, false}, // −0.6 %
		{40.2e6, true},  // the IMO HFO LCV, −3.2 %
		{42.5e6, true},  // +2.3 %
	}
	for _, c := range cases {
		b.LHV = c.lhv
		d, err := FromBDN(base, b)
		if err != nil {
			t.Fatal(err)
		}
		near(t, "ISO net MJ/kg (docs/reference/plant-checks.md §1.1 row 4 [C])", d.ISONet/1e6, 41.550, 0.0005)
		near(t, "net = stated", d.Energy.Net, c.lhv, 0)
		if d.Energy.NetSource.Route != RouteSet || !strings.Contains(d.Energy.NetSource.Note, "bunker delivery note") {
			t.Errorf("net source %v", d.Energy.NetSource)
		}
		got := len(d.Warnings) == 1 && strings.Contains(d.Warnings[0], "ISO 8217 estimate")
		if got != c.warn || (!c.warn && len(d.Warnings) != 0) {
			t.Errorf("LHV %g: warnings %q, want a warning: %v", c.lhv, d.Warnings, c.warn)
		}
	}
}

func TestFromBDNOffSpec(t *testing.T) {
	t.Parallel()
	base, _ := Grade("HSFO")
	// RMG 380 (ISO 8217:2017 Table 2, from memory): ρ ≤ 991, ν50 ≤ 380,
	// water ≤ 0.50 % V/V, ash ≤ 0.100 %.
	d, err := FromBDN(base, BDN{Grade: "RMG 380", Density15: 995, Sulfur: 0.028, Water: 0.003, Ash: 0.0012,
		Viscosity: 420e-6, Viscosity2: ViscosityPoint{T: 373.15, Nu: 38e-6}})
	if err != nil {
		t.Fatal(err)
	}
	want := []string{"density at 15 °C 995", "viscosity at 50 °C 420", "ash 0.12"}
	if len(d.Warnings) != len(want) {
		t.Errorf("warnings %q, want %d", d.Warnings, len(want))
	}
	for i, w := range want {
		if i < len(d.Warnings) && !(strings.Contains(d.Warnings[i], w) && strings.Contains(d.Warnings[i], "off-spec for RMG 380")) {
			t.Errorf("warning %d %q, want %q off-spec for RMG 380", i, d.Warnings[i], w)
		}
	}
	// Off-spec figures are still computed: ρ 995 > 991 but within the
	// envelope (1010, RMK).
	if !(d.Energy.Net > 39e6 && d.Energy.Net < 41e6) {
		t.Errorf("net %g", d.Energy.Net)
	}
	// A DMA above 890 kg/m³ and 6 cSt.
	mgo, _ := Grade("MGO")
	d, err = FromBDN(mgo, BDN{Grade: "DMA", Density15: 895, Sulfur: 0.0012, Viscosity: 7e-6})
	if err != nil {
		t.Fatal(err)
	}
	if len(d.Warnings) != 3 || !strings.Contains(d.Warnings[0], "off-spec for DMA") || !strings.Contains(d.Warnings[1], "off-spec for DMA") {
		t.Errorf("DMA warnings %q", d.Warnings)
	}
}

func TestFromBDNErrors(t *testing.T) {
	t.Parallel()
	hsfo, _ := Grade("HSFO")
	mgo, _ := Grade("MGO")
	lng, _ := Grade("LNG")
	good := BDN{Density15: 985, Sulfur: 0.025, Water: 0.002, Ash: 0.0005, Viscosity: 380e-6}
	with := func(f func(*BDN)) BDN { b := good; f(&b); return b }
	cases := []struct {
		name  string
		base  Fuel
		b     BDN
		field string
	}{
		{"no density", hsfo, with(func(b *BDN) { b.Density15 = 0 }), "bdn.density"},
		{"density above RMK", hsfo, with(func(b *BDN) { b.Density15 = 1015 }), "1010"},
		{"density NaN", hsfo, with(func(b *BDN) { b.Density15 = math.NaN() }), "bdn.density"},
		{"sulfur", hsfo, with(func(b *BDN) { b.Sulfur = 0.04 }), "bdn.sulphur"},
		{"sulfur negative", hsfo, with(func(b *BDN) { b.Sulfur = -0.001 }), "bdn.sulphur"},
		{"water", hsfo, with(func(b *BDN) { b.Water = 0.006 }), "bdn.water"},
		{"ash", hsfo, with(func(b *BDN) { b.Ash = 0.002 }), "bdn.ash"},
		{"viscosity", hsfo, with(func(b *BDN) { b.Viscosity = 800e-6 }), "bdn.viscosity"},
		{"distillate viscosity", mgo, BDN{Density15: 850, Viscosity: 20e-6}, "bdn.viscosity"},
		{"distillate density", mgo, BDN{Density15: 950, Viscosity: 3e-6}, "bdn.density"},
		{"LHV", hsfo, with(func(b *BDN) { b.LHV = 48e6 }), "bdn.lhv"},
		{"gas base", lng, good, "liquid fuel"},
		{"unknown grade", hsfo, with(func(b *BDN) { b.Grade = "RMX 99" }), "unknown"},
		{"grade number", hsfo, with(func(b *BDN) { b.Grade = "RMG 999" }), "RMG 180, RMG 380"},
		{"distillate number", mgo, BDN{Grade: "DMA 10", Density15: 850}, "no number"},
		{"class mismatch", hsfo, with(func(b *BDN) { b.Grade = "DMA" }), "distillate grade"},
		{"base invalid", Fuel{Name: "broken", ISO: ISO8217{Density15: 5}}, good, "base fuel"},
	}
	for _, c := range cases {
		_, err := FromBDN(c.base, c.b)
		if err == nil {
			t.Errorf("%s: no error", c.name)
			continue
		}
		if !strings.Contains(err.Error(), c.field) || !strings.Contains(err.Error(), "fuel \"") {
			t.Errorf("%s: error %q should name the fuel and %q", c.name, err, c.field)
		}
	}
	// Every bad figure is reported, not only the first.
	_, err := FromBDN(hsfo, BDN{Density15: 1200, Sulfur: 0.5, Water: -1, Ash: 1})
	for _, f := range []string{"bdn.density", "bdn.sulphur", "bdn.water", "bdn.ash"} {
		if err == nil || !strings.Contains(err.Error(), f) {
			t.Errorf("joined errors %v: missing %s", err, f)
		}
	}
	var fe *FieldError
	if !errors.As(err, &fe) || fe.Fuel != "HSFO (BDN)" {
		t.Errorf("error %v is not a *FieldError naming the fuel", err)
	}
}

func TestFromBDNViscosity(t *testing.T) {
	t.Parallel()
	base, _ := Grade("HSFO")
	w0, _ := base.ViscosityLine()
	// One point: the base's slope through it.
	d, err := FromBDN(base, BDN{Density15: 980, Sulfur: 0.02, Viscosity: 250e-6})
	if err != nil {
		t.Fatal(err)
	}
	w, err := d.Fuel.ViscosityLine()
	if err != nil {
		t.Fatal(err)
	}
	near(t, "slope B = base's", w.B, w0.B, 1e-9)
	nu, _ := w.Viscosity(323.15)
	near(t, "ν(50 °C) = stated, cSt", nu/cSt, 250, 1e-6)
	// Two points: the stated line.
	d, err = FromBDN(base, BDN{Density15: 980, Sulfur: 0.02, Viscosity: 250e-6, Viscosity2: ViscosityPoint{T: 373.15, Nu: 30e-6}})
	if err != nil {
		t.Fatal(err)
	}
	if d.Fuel.Viscosity2 != (ViscosityPoint{T: 373.15, Nu: 30e-6}) || len(d.Warnings) != 0 {
		t.Errorf("second point %+v, warnings %q", d.Fuel.Viscosity2, d.Warnings)
	}
	// A second point that rises with temperature: an error.
	if _, err := FromBDN(base, BDN{Density15: 980, Sulfur: 0.02, Viscosity: 250e-6, Viscosity2: ViscosityPoint{T: 373.15, Nu: 300e-6}}); err == nil {
		t.Errorf("a rising viscosity line accepted")
	}
	// Not stated: the base's line, with a warning.
	d, err = FromBDN(base, BDN{Density15: 980, Sulfur: 0.02})
	if err != nil {
		t.Fatal(err)
	}
	if d.Fuel.ISO.Viscosity != base.ISO.Viscosity || d.Fuel.Viscosity2 != base.Viscosity2 || len(d.Warnings) != 1 || !strings.Contains(d.Warnings[0], "not stated") {
		t.Errorf("viscosity not stated: %+v %+v, warnings %q", d.Fuel.ISO, d.Fuel.Viscosity2, d.Warnings)
	}
	// The base's set LHV is dropped: it described another fuel.
	base.SetLHV, base.SetLHVSource = 40.2e6, "test"
	d, err = FromBDN(base, BDN{Density15: 980, Sulfur: 0.02, Viscosity: 250e-6})
	if err != nil {
		t.Fatal(err)
	}
	if d.Fuel.SetLHV != 0 || d.Energy.NetSource.Route != RouteISO8217 {
		t.Errorf("the base's set LHV was kept: %g %v", d.Fuel.SetLHV, d.Energy.NetSource)
	}
}

// FuzzFromBDN: no BDN makes FromBDN panic, and an accepted one gives a
// fuel that validates, an analysis that sums to 1 and finite figures.
func FuzzFromBDN(f *testing.F) {
	f.Add("RMG 380", 991.0, 0.025, 0.005, 0.0005, 380e-6, 0.0)
	f.Add("", 950.0, 0.005, 0.001, 0.0003, 150e-6, 41e6)
	f.Add("DMA", 860.0, 0.001, 0.0, 0.0, 3e-6, 0.0)
	f.Add("rmk", math.NaN(), -1.0, 2.0, math.Inf(1), -1.0, 1e300)
	base, _ := Grade("HSFO")
	mgo, _ := Grade("MGO")
	f.Fuzz(func(t *testing.T, grade string, rho, s, w, a, nu, lhv float64) {
		for _, bf := range []Fuel{base, mgo} {
			d, err := FromBDN(bf, BDN{Grade: grade, Density15: rho, Sulfur: s, Water: w, Ash: a, Viscosity: nu, LHV: lhv})
			if err != nil {
				continue
			}
			if err := d.Fuel.Validate(); err != nil {
				t.Fatalf("accepted BDN gives an invalid fuel: %v", err)
			}
			for _, v := range []float64{d.Energy.Net, d.Energy.Gross, d.CO2.Analysis, d.AnalysisGross, d.ISONet, d.ISOGross} {
				if !(v > 0) || math.IsInf(v, 0) {
					t.Fatalf("figure %g in %+v", v, d)
				}
			}
			if math.Abs(d.Fuel.Analysis.Sum()-1) > 1e-12 {
				t.Fatalf("analysis sum %g", d.Fuel.Analysis.Sum())
			}
		}
	})
}
