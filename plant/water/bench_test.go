package water

import "testing"

// The benchmarks cycle through a few states so that branch prediction does
// not see a single input. Run: go test -run '^$' -bench . -benchmem ./plant/water/

var (
	benchP1 = [4]float64{1e5, 3e6, 10e6, 80e6}
	benchT1 = [4]float64{300, 350, 450, 550}
	benchP2 = [4]float64{5e3, 1e6, 6e6, 30e6}
	benchT2 = [4]float64{400, 500, 700, 900}
	sink    float64
)

// cpuMeter reports the process CPU time per operation as cpu-ns/op when
// the benchmark ends.
type cpuMeter struct{ start float64 }

func startCPU() cpuMeter { return cpuMeter{cpuSeconds()} }

func (m cpuMeter) report(b *testing.B) {
	b.ReportMetric((cpuSeconds()-m.start)*1e9/float64(b.N), "cpu-ns/op")
}

func BenchmarkHPTRegion1(b *testing.B) {
	m := startCPU()
	defer m.report(b)
	i := 0
	for b.Loop() {
		h, _ := HPT(benchP1[i&3], benchT1[i&3])
		sink += h
		i++
	}
}

func BenchmarkPTRegion1All(b *testing.B) {
	m := startCPU()
	defer m.report(b)
	i := 0
	for b.Loop() {
		st, _ := PT(benchP1[i&3], benchT1[i&3])
		sink += st.W
		i++
	}
}

func BenchmarkPTRegion2All(b *testing.B) {
	m := startCPU()
	defer m.report(b)
	i := 0
	for b.Loop() {
		st, _ := PT(benchP2[i&3], benchT2[i&3])
		sink += st.W
		i++
	}
}

func benchH(b *testing.B, ps, ts *[4]float64) [4]float64 {
	var hs [4]float64
	for k := range hs {
		h, err := HPT(ps[k], ts[k])
		if err != nil {
			b.Fatal(err)
		}
		hs[k] = h
	}
	return hs
}

func BenchmarkTPHRegion1(b *testing.B) {
	hs := benchH(b, &benchP1, &benchT1)
	m := startCPU()
	defer m.report(b)
	i := 0
	for b.Loop() {
		t, _ := TPH(benchP1[i&3], hs[i&3])
		sink += t
		i++
	}
}

func BenchmarkTPHRegion2(b *testing.B) {
	hs := benchH(b, &benchP2, &benchT2)
	m := startCPU()
	defer m.report(b)
	i := 0
	for b.Loop() {
		t, _ := TPH(benchP2[i&3], hs[i&3])
		sink += t
		i++
	}
}

func BenchmarkPHWet(b *testing.B) {
	ps := [4]float64{5e3, 1e5, 1e6, 8e6}
	hs := [4]float64{1.2e6, 1.5e6, 2.0e6, 2.4e6}
	m := startCPU()
	defer m.report(b)
	i := 0
	for b.Loop() {
		st, _ := PH(ps[i&3], hs[i&3])
		sink += st.X
		i++
	}
}

func BenchmarkTsat(b *testing.B) {
	ps := [4]float64{5e3, 1e5, 1e6, 8e6}
	m := startCPU()
	defer m.report(b)
	i := 0
	for b.Loop() {
		t, _ := Tsat(ps[i&3])
		sink += t
		i++
	}
}

func BenchmarkSPH(b *testing.B) {
	hs := benchH(b, &benchP2, &benchT2)
	m := startCPU()
	defer m.report(b)
	i := 0
	for b.Loop() {
		s, _ := SPH(benchP2[i&3], hs[i&3])
		sink += s
		i++
	}
}

func BenchmarkPTRegion3(b *testing.B) {
	ps := [4]float64{20e6, 25e6, 40e6, 80e6}
	ts := [4]float64{640, 650, 700, 750}
	m := startCPU()
	defer m.report(b)
	i := 0
	for b.Loop() {
		st, _ := PT(ps[i&3], ts[i&3])
		sink += st.W
		i++
	}
}

func BenchmarkPHRegion3(b *testing.B) {
	ps := [4]float64{20e6, 25e6, 40e6, 80e6}
	ts := [4]float64{640, 650, 700, 750}
	var hs [4]float64
	for k := range hs {
		h, err := HPT(ps[k], ts[k])
		if err != nil {
			b.Fatal(err)
		}
		hs[k] = h
	}
	m := startCPU()
	defer m.report(b)
	i := 0
	for b.Loop() {
		st, _ := PH(ps[i&3], hs[i&3])
		sink += st.T
		i++
	}
}

// TestZeroAllocations: the fast paths and the state constructors do not
// allocate on success. Source: the package's speed requirement (hot paths
// allocate nothing); checked with testing.AllocsPerRun.
func TestZeroAllocations(t *testing.T) {
	calls := map[string]func(){
		"HPT region 1": func() { HPT(3e6, 400) },
		"HPT region 3": func() { HPT(25e6, 650) },
		"TPH region 1": func() { TPH(3e6, 500e3) },
		"TPH region 2": func() { TPH(1e6, 3000e3) },
		"TPH wet":      func() { TPH(1e6, 2000e3) },
		"SPH wet":      func() { SPH(1e6, 2000e3) },
		"HPS region 2": func() { HPS(1e6, 7000) },
		"Tsat":         func() { Tsat(1e6) },
		"Psat":         func() { Psat(450) },
		"PT region 2":  func() { PT(1e6, 500) },
		"PT region 5":  func() { PT(1e6, 1500) },
		"PH wet":       func() { PH(1e6, 2000e3) },
		"PH region 3":  func() { PH(25e6, 1800e3) },
		"PS region 1":  func() { PS(1e6, 1000) },
		"PX":           func() { PX(1e6, 0.3) },
		"TX region 3":  func() { TX(640, 0.3) },
	}
	for name, f := range calls {
		if a := testing.AllocsPerRun(100, f); a != 0 {
			t.Errorf("%s: %g allocations per call, want 0", name, a)
		}
	}
}

func BenchmarkTPHWet(b *testing.B) {
	ps := [4]float64{5e3, 1e5, 1e6, 8e6}
	hs := [4]float64{1.2e6, 1.5e6, 2.0e6, 2.4e6}
	m := startCPU()
	defer m.report(b)
	i := 0
	for b.Loop() {
		t, _ := TPH(ps[i&3], hs[i&3])
		sink += t
		i++
	}
}
