package combustion

import (
	"testing"

	"steamcase/plant/fuel"
)

func BenchmarkMixtureH(b *testing.B) {
	p, err := Fire(testFuel(), Conditions{Lambda: 1.15})
	if err != nil {
		b.Fatal(err)
	}
	m := p.Flue
	b.ReportAllocs()
	T := 523.15
	var sink float64
	for b.Loop() {
		h, err := m.H(T)
		if err != nil {
			b.Fatal(err)
		}
		sink += h
	}
	_ = sink
}

func BenchmarkFire(b *testing.B) {
	f, _ := fuel.Grade("HSFO")
	c := Conditions{O2Dry: 0.03, AirT: 308.15, FuelT: 393.15, RelativeHumidity: 0.6, AtomisingSteam: 0.02}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Fire(f, c); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkEfficiency(b *testing.B) {
	f, _ := fuel.Grade("HSFO")
	p, err := Fire(f, Conditions{O2Dry: 0.03, AirT: 308.15, FuelT: 393.15, Humidity: 0.01, AtomisingSteam: 0.02})
	if err != nil {
		b.Fatal(err)
	}
	o := LossOptions{COppmDry: 50, UnburntSolids: 0.1, Radiation: Radiation{PercentAtMCR: 0.8, LoadFraction: 0.7}}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Efficiency(p, 523.15, TRef, o); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkAdiabaticFlameTemperature(b *testing.B) {
	p, err := Fire(testFuel(), Conditions{Lambda: 1.15})
	if err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	for b.Loop() {
		if _, _, err := AdiabaticFlameTemperature(p); err != nil {
			b.Fatal(err)
		}
	}
}

// The hot paths allocate nothing (project rule 7).
func TestNoAllocs(t *testing.T) {
	f, _ := fuel.Grade("HSFO")
	c := Conditions{O2Dry: 0.03, AirT: 308.15, FuelT: 393.15, RelativeHumidity: 0.6, AtomisingSteam: 0.02}
	p, err := Fire(f, c)
	if err != nil {
		t.Fatal(err)
	}
	o := LossOptions{COppmDry: 50, Radiation: Radiation{PercentAtMCR: 0.8}}
	for name, fn := range map[string]func(){
		"Mixture.H":  func() { _, _ = p.Flue.H(600) },
		"Mixture.Cp": func() { _, _ = p.Flue.Cp(600) },
		"Fire":       func() { _, _ = Fire(f, c) },
		"Efficiency": func() { _, _ = Efficiency(p, 523.15, TRef, o) },
		"Flame":      func() { _, _, _ = AdiabaticFlameTemperature(p) },
		"DewPoint":   func() { _, _ = AcidDewPoint(p, 0, 0, MethodVerhoffBanchero) },
	} {
		if n := testing.AllocsPerRun(50, fn); n != 0 {
			t.Errorf("%s allocates %v times per call", name, n)
		}
	}
}
