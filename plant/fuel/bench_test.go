package fuel

import "testing"

func BenchmarkEnergy(b *testing.B) {
	f, _ := Grade("HSFO")
	f.SetLHV = 0
	b.ReportAllocs()
	for b.Loop() {
		if _, err := f.Energy(); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkTemperatureForViscosity(b *testing.B) {
	f, _ := Grade("HSFO")
	w, _ := f.ViscosityLine()
	b.ReportAllocs()
	for b.Loop() {
		if _, err := w.Temperature(13e-6); err != nil {
			b.Fatal(err)
		}
	}
}
