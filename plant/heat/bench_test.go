package heat

import "testing"

var sinkF float64

func BenchmarkMixTransport(b *testing.B) {
	x := flueTest
	T := 900.0
	for b.Loop() {
		g, err := MixTransport(&x, T, TransportOptions{})
		if err != nil {
			b.Fatal(err)
		}
		sinkF += g.Viscosity + g.Conductivity
	}
}

func BenchmarkWSGGEmissivity(b *testing.B) {
	g := RadiatingGas{Set: WSGGRatio1, PH2O: 0.095 * StandardAtmosphere, PCO2: 0.125 * StandardAtmosphere, PathLength: 0.922}
	for b.Loop() {
		e, _, err := g.Emissivity(1500)
		if err != nil {
			b.Fatal(err)
		}
		sinkF += e
	}
}

func BenchmarkGnielinski(b *testing.B) {
	m := TubeFlow{}
	for b.Loop() {
		nu, _, err := m.Nusselt(17701.3, 0.7462)
		if err != nil {
			b.Fatal(err)
		}
		sinkF += nu
	}
}

func BenchmarkTubePass(b *testing.B) {
	s, in := sheetTubes()
	s.WallEmissivity = 0.8
	iters := 0
	for b.Loop() {
		r, err := s.Solve(in)
		if err != nil {
			b.Fatal(err)
		}
		iters += r.Iterations
		sinkF += r.OutletTemperature
	}
	b.ReportMetric(float64(iters)/float64(b.N), "brent-iters/op")
}

func BenchmarkTubePassCooper(b *testing.B) {
	s, in := sheetTubes()
	s.WallEmissivity = 0.8
	in.WaterHTC = 0
	in.WaterPressure = 10e5
	iters := 0
	for b.Loop() {
		r, err := s.Solve(in)
		if err != nil {
			b.Fatal(err)
		}
		iters += r.Iterations
		sinkF += r.OutletTemperature
	}
	b.ReportMetric(float64(iters)/float64(b.N), "brent-iters/op")
}

func BenchmarkFurnace(b *testing.B) {
	f, in := sheetFurnace(b)
	f.SootVolumeFraction = 1e-7
	iters := 0
	for b.Loop() {
		r, err := f.Solve(in)
		if err != nil {
			b.Fatal(err)
		}
		iters += r.Iterations
		sinkF += r.ExitTemperature
	}
	b.ReportMetric(float64(iters)/float64(b.N), "brent-iters/op")
}
