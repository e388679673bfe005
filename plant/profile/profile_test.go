package profile

import (
	"context"
	"math"
	"reflect"
	"testing"

	"steamcase/plant"
	"steamcase/plant/loads"
)

func must(t testing.TB, err error) {
	t.Helper()
	if err != nil {
		t.Fatal(err)
	}
}

// tanker is an invented product tanker's plant: two 12 t/h boilers at
// 7 bar(g), an exhaust-gas economiser, a dump condenser, cargo heating and
// a sundry load. Figures are invented, of realistic size (docs/reference/plant-checks.md
// §3.5 and §7 [M/CP]).
func tanker(t testing.TB) *plant.Plant {
	drum := 7e5 + 101325
	fuel := plant.FuelSpec{Name: "HSFO", LHV: 40.2e6, CO2Factor: 3.114}
	eta := &plant.EfficiencyTable{Load: []float64{0.25, 0.5, 0.75, 1.0}, Eta: []float64{0.80, 0.84, 0.85, 0.845}}
	p := plant.New("invented tanker", plant.Options{})
	add := func(u plant.Component) { must(t, p.Add(u)) }
	add(&plant.MakeUp{Base: plant.Base{Name: "makeup"}, T: 288.15})
	add(&plant.FeedTank{Base: plant.Base{Name: "hotwell"}, HeatLoss: 5e3})
	add(&plant.FeedPump{Base: plant.Base{Name: "fp"}, Boilers: []string{"AB1", "AB2"}, Margin: 3e5, Eta: 0.45})
	add(&plant.Header{Base: plant.Base{Name: "feed header"}})
	add(&plant.Boiler{Base: plant.Base{Name: "AB1"}, MCR: 12000.0 / 3600, DrumP: drum, Turndown: 4, Blowdown: 0.01, Efficiency: eta, Fuel: fuel})
	add(&plant.Boiler{Base: plant.Base{Name: "AB2"}, MCR: 12000.0 / 3600, DrumP: drum, Turndown: 4, Blowdown: 0.01, Efficiency: eta, Fuel: fuel})
	add(&plant.ExhaustGasEconomiser{Base: plant.Base{Name: "EGE"}, DrumP: drum, DesignLoad: 0.85, DesignPinch: 20, GasCp: 1060,
		Engine: plant.EngineExhaust{MCR: 12e6, Load: []float64{0.25, 0.5, 0.75, 1}, Specific: []float64{11 / 3.6e6, 9 / 3.6e6, 8.4 / 3.6e6, 8.1 / 3.6e6},
			T: []float64{523.15, 503.15, 498.15, 518.15}}})
	add(&plant.Header{Base: plant.Base{Name: "main"}, HeatLoss: 10e3})
	add(&plant.Consumer{Base: plant.Base{Name: "cargo heating"}, Duty: 2e6, SubCooling: 10, ReturnFraction: 0.98, ReturnT: 353.15})
	add(&plant.Consumer{Base: plant.Base{Name: "sundry"}, Duty: 300e3, ReturnFraction: 0.9, ReturnT: 353.15})
	add(&plant.Condenser{Base: plant.Base{Name: "dump"}, Dump: true, SubCooling: 80})
	c := func(name, from, fp, to, tp string) { p.Connect(name, plant.Pos{}, from, fp, to, tp) }
	c("makeup", "makeup", "out", "hotwell", "in")
	c("suction", "hotwell", "out", "fp", "in")
	c("discharge", "fp", "out", "feed header", "in")
	c("feed1", "feed header", "out", "AB1", "feed")
	c("feed2", "feed header", "out", "AB2", "feed")
	c("ege feed", "feed header", "out", "EGE", "feed")
	c("steam1", "AB1", "steam", "main", "in")
	c("steam2", "AB2", "steam", "main", "in")
	c("ege steam", "EGE", "steam", "main", "in")
	c("to heating", "main", "out", "cargo heating", "in")
	c("heating return", "cargo heating", "out", "hotwell", "in")
	c("to sundry", "main", "out", "sundry", "in")
	c("sundry return", "sundry", "out", "hotwell", "in")
	c("to dump", "main", "out", "dump", "in")
	c("dump return", "dump", "out", "hotwell", "in")
	return p
}

// voyage builds n hourly rows through four phases with the cargo heating
// and engine load varying smoothly.
func voyage(n int) []Row {
	rows := make([]Row, n)
	phases := []string{"port stay", "discharge", "loaded passage", "ballast passage"}
	for i := range rows {
		ph := phases[(i*len(phases))/n]
		load := 0.0
		heat := 0.5e6 + 2.5e6*(0.5+0.5*math.Sin(float64(i)/24))
		if ph == "loaded passage" || ph == "ballast passage" {
			load = 0.6 + 0.2*math.Sin(float64(i)/50)
		}
		if ph == "ballast passage" {
			heat = 0
		}
		rows[i] = Row{Phase: ph, Hours: 1, Case: plant.Case{Name: ph, Conditions: plant.Conditions{EngineLoad: load, SeaT: 283.15, AirT: 278.15},
			Set: []plant.Setting{{Unit: "cargo heating", Param: "duty", Value: heat}}}}
	}
	return rows
}

func TestVoyageTotalsAreSums(t *testing.T) {
	t.Parallel()
	p := tanker(t)
	rows := voyage(200)
	res, err := Run(context.Background(), p, rows, Options{Workers: 2, ChunkRows: 16})
	must(t, err)
	// The totals equal the sums of the rows' own figures (by definition of
	// a voyage total; no outside source).
	var fuel, co2 float64
	for i, r := range res.Rows {
		fuel += r.Summary.FuelKgS * rows[i].Hours * 3.6
		co2 += r.Summary.CO2KgS * rows[i].Hours * 3.6
	}
	if math.Abs(res.Total.FuelT-fuel) > 1e-9*fuel || math.Abs(res.Total.CO2T-co2) > 1e-9*co2 {
		t.Errorf("totals %g t fuel, %g t CO2; rows sum to %g, %g", res.Total.FuelT, res.Total.CO2T, fuel, co2)
	}
	var byPhase float64
	var hours float64
	for _, ph := range res.Phases {
		byPhase += ph.FuelT
		hours += ph.Hours
	}
	if math.Abs(byPhase-res.Total.FuelT) > 1e-9*fuel || hours != 200 {
		t.Errorf("phases sum to %g t over %g h; total %g t", byPhase, hours, res.Total.FuelT)
	}
	var firing float64
	for _, h := range res.Total.HoursFiring {
		firing += h
	}
	if firing != 200 || len(res.Phases) != 4 {
		t.Errorf("hours by boilers firing %v, phases %d", res.Total.HoursFiring, len(res.Phases))
	}
}

func TestIdenticalRowsScale(t *testing.T) {
	t.Parallel()
	// A profile of identical rows gives the single case's figures times
	// the hours.
	p := tanker(t)
	row := voyage(200)[120]
	single, err := p.Solve(context.Background(), row.Case)
	must(t, err)
	rows := make([]Row, 50)
	for i := range rows {
		rows[i] = row
		rows[i].Hours = 2
	}
	res, err := Run(context.Background(), p, rows, Options{Workers: 2, ChunkRows: 7})
	must(t, err)
	want := single.FuelKgS * 100 * 3.6
	if math.Abs(res.Total.FuelT-want) > 1e-8*want {
		t.Errorf("fuel %.9g t, want %.9g t", res.Total.FuelT, want)
	}
}

func TestWorkersGiveIdenticalResults(t *testing.T) {
	t.Parallel()
	p := tanker(t)
	rows := voyage(150)
	one, err := Run(context.Background(), p, rows, Options{Workers: 1, ChunkRows: 10, KeepResults: true})
	must(t, err)
	four, err := Run(context.Background(), tanker(t), rows, Options{Workers: 4, ChunkRows: 10, KeepResults: true})
	must(t, err)
	// Summaries only: the same summaries and totals as with the full
	// results kept.
	sums, err := Run(context.Background(), tanker(t), rows, Options{Workers: 3, ChunkRows: 10})
	must(t, err)
	for i := range one.Rows {
		if !reflect.DeepEqual(one.Rows[i].Result, four.Rows[i].Result) {
			t.Fatalf("row %d differs between 1 and 4 workers", i)
		}
		if !reflect.DeepEqual(one.Rows[i].Summary, four.Rows[i].Summary) || !reflect.DeepEqual(one.Rows[i].Summary, sums.Rows[i].Summary) {
			t.Fatalf("row %d: the summary differs between 1 and 4 workers, or with the results kept and not", i)
		}
		if sums.Rows[i].Result != nil {
			t.Fatalf("row %d keeps its case result without KeepResults", i)
		}
	}
	if !reflect.DeepEqual(one.Total, four.Total) {
		t.Errorf("totals differ: %+v vs %+v", one.Total, four.Total)
	}
	if !reflect.DeepEqual(one.Total, sums.Total) || !reflect.DeepEqual(one.Phases, sums.Phases) {
		t.Errorf("totals differ with summaries only: %+v vs %+v", one.Total, sums.Total)
	}
}

func TestStudySavingIsDifference(t *testing.T) {
	t.Parallel()
	p := tanker(t)
	rows := voyage(100)
	res, err := Study(context.Background(), p, rows, []Variant{
		{Name: "without EGE", Set: []plant.Setting{{Unit: "EGE", Param: "off", Value: 1}}},
		{Name: "with EGE"},
	}, Economics{FuelPrice: 600, InstalledCost: 250000}, Options{})
	must(t, err)
	a, b := res.Variants[0].Totals, res.Variants[1].Totals
	saved := res.Variants[1].FuelSavedT
	if math.Abs(saved-(a.FuelT-b.FuelT)) > 1e-12 || !(saved > 0) {
		t.Errorf("saving %g t, totals %g and %g t", saved, a.FuelT, b.FuelT)
	}
	if math.Abs(res.Variants[1].CostSaved-600*saved) > 1e-9 {
		t.Errorf("cost saved %g", res.Variants[1].CostSaved)
	}
	wantPayback := 250000 / (600 * saved * 8760 / 100)
	if math.Abs(res.Variants[1].PaybackYears-wantPayback) > 1e-9*wantPayback {
		t.Errorf("payback %g years, want %g", res.Variants[1].PaybackYears, wantPayback)
	}
}

func BenchmarkYearHourly(b *testing.B) {
	p := tanker(b)
	p.Opt.NoEGESaving = true
	rows := voyage(8760)
	var iters float64
	cpu0 := cpuSeconds()
	for b.Loop() {
		res, err := Run(context.Background(), p, rows, Options{Workers: 1})
		if err != nil {
			b.Fatal(err)
		}
		for _, r := range res.Rows {
			iters += float64(r.Summary.Iterations)
		}
	}
	b.ReportMetric((cpuSeconds()-cpu0)/float64(b.N), "cpu-s/op")
	b.ReportMetric(iters/float64(b.N)/8760, "newton-iters/row")
}

// TestModelKeysVaryByRow: rows that set a duty model's parameters (a
// tank's temperature held) solve on clones that own their models, so the
// result does not depend on the workers or on the chunks, and each row's
// duty is its own (the loss ΣUA·(T − T_sea), docs/reference/plant-checks.md §6 [CP]).
func TestModelKeysVaryByRow(t *testing.T) {
	t.Parallel()
	build := func() *plant.Plant {
		p := tanker(t)
		tank := &plant.TankHeating{Tank: loads.TankHeating{Cargo: loads.Cargo{Density: 950, Cp: 1900}, CargoVolume: 2e4,
			Boundaries: []loads.Boundary{{Area: 4000, U: 5, Beyond: loads.Sea}}, To: 323.15}}
		c := plant.NewModelConsumer(tank)
		c.Name, c.ReturnFraction = "COT", 0.95
		must(t, p.Add(c))
		p.Connect("to COT", plant.Pos{}, "main", "out", "COT", "in")
		p.Connect("COT return", plant.Pos{}, "COT", "out", "hotwell", "in")
		return p
	}
	var rows []Row
	for i := 0; i < 12; i++ {
		tC := 40 + float64(i)
		rows = append(rows, Row{Phase: "p", Hours: 1, Case: plant.Case{Name: "r",
			Conditions: plant.Conditions{SeaT: 283.15, AirT: 278.15},
			Set:        []plant.Setting{{Unit: "COT", Param: "T", Value: 273.15 + tC}}}})
	}
	seq, err := Run(context.Background(), build(), rows, Options{Workers: 1, ChunkRows: 12, KeepResults: true})
	must(t, err)
	par, err := Run(context.Background(), build(), rows, Options{Workers: 3, ChunkRows: 1, KeepResults: true})
	must(t, err)
	for i := range rows {
		want := 4000 * 5 * (30 + float64(i))
		for _, r := range []*Result{seq, par} {
			var got float64
			for _, c := range r.Rows[i].Result.Consumers {
				if c.Name == "COT" {
					got = c.DutyW
				}
			}
			if math.Abs(got-want) > 1e-6*want {
				t.Errorf("row %d: COT duty %.1f W, want %.1f W", i+1, got, want)
			}
		}
	}
	if math.Abs(seq.Total.FuelT-par.Total.FuelT) > 1e-9*seq.Total.FuelT {
		t.Errorf("fuel %.9g t in sequence, %.9g t on three workers one row a chunk", seq.Total.FuelT, par.Total.FuelT)
	}
}
