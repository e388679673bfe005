package loads

import (
	"testing"

	"steamcase/plant/fuel"
)

func BenchmarkTankHold(b *testing.B) {
	tk, err := TankFromDimensions("COT 2", Cargo{Density: 900}, Dimensions{
		Length: 40, Breadth: 20, Depth: 25, Fill: 0.98, DoubleBottom: 2, DoubleSide: 2,
		WeatherDeck: true, SideAboveWater: 0.3, AdjacentT: kelvin(30),
	})
	if err != nil {
		b.Fatal(err)
	}
	tk.To = kelvin(60)
	amb := Ambient{Sea: kelvin(15), Air: kelvin(5)}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := tk.Duty(amb); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(len(tk.Boundaries)), "boundaries/op")
}

func BenchmarkTankHeatUp(b *testing.B) {
	tk, err := TankFromDimensions("COT 2", Cargo{Density: 900}, Dimensions{
		Length: 40, Breadth: 20, Depth: 25, Fill: 0.98, DoubleBottom: 2, DoubleSide: 2,
		WeatherDeck: true, SideAboveWater: 0.3, AdjacentT: kelvin(30),
	})
	if err != nil {
		b.Fatal(err)
	}
	tk.Mode, tk.From, tk.To, tk.Duration = HeatUp, kelvin(44), kelvin(66), 96*hour
	amb := Ambient{Sea: kelvin(15), Air: kelvin(5)}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := tk.Duty(amb); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkCoolDownAfterCragoe(b *testing.B) {
	tk := &TankHeating{Name: "slop", Cargo: Cargo{Density: 950}, CargoVolume: 5000,
		Boundaries: []Boundary{{Name: "all", Area: 4000, U: 8, Beyond: Air}}}
	amb := Ambient{Sea: kelvin(5), Air: kelvin(5)}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := tk.CoolDownAfter(kelvin(70), 5*day, amb); err != nil {
			b.Fatal(err)
		}
	}
}

func benchHeater(b *testing.B, h FuelHeater) {
	b.ReportAllocs()
	for b.Loop() {
		if _, err := h.Duty(); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkFuelHeaterViscosity(b *testing.B) {
	f := hsfoB(b)
	benchHeater(b, FuelHeater{Name: "ME FO heater", Fuel: f, MassFlow: 0.8, InletT: kelvin(95), TargetViscosity: 13e-6, OutletLimit: kelvin(150)})
}

func BenchmarkFuelHeaterOutletSet(b *testing.B) {
	f := hsfoB(b)
	benchHeater(b, FuelHeater{Name: "purifier heater", Service: Purifier, Fuel: f, MassFlow: 1.2, InletT: kelvin(60), OutletT: kelvin(98)})
}

func hsfoB(b *testing.B) fuel.Fuel {
	b.Helper()
	f, err := fuel.Grade("HSFO")
	if err != nil {
		b.Fatal(err)
	}
	return f
}
