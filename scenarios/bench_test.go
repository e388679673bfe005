package scenarios_test

import (
	"context"
	"io/fs"
	"math"
	"testing"
	"time"

	"steamcase/plant"
	"steamcase/plant/profile"
	"steamcase/scenarios"
	"steamcase/scripting"
)

// demoTanker builds the demo product tanker's plant from its script.
func demoTanker(b testing.TB) *plant.Plant {
	src, err := fs.ReadFile(scenarios.FS, "tanker_plant.lua")
	if err != nil {
		b.Fatal(err)
	}
	run, err := scripting.RunSource(context.Background(), "tanker_plant.lua", src, scenarios.FS, scripting.Options{Timeout: time.Minute})
	if err != nil {
		b.Fatal(err)
	}
	return run.Plants[0]
}

// yearRows is a year of hourly rows on the demo tanker: sea and air
// temperatures following the seasons, the engine at sea most of the time,
// the cargo heating held in the loaded half of each month.
func yearRows() []profile.Row {
	rows := make([]profile.Row, 8760)
	for h := range rows {
		day := float64(h) / 24
		sea := 288.15 + 8*math.Sin(2*math.Pi*(day-110)/365)
		air := sea - 4 + 3*math.Sin(2*math.Pi*float64(h%24)/24)
		engine := 0.75
		phase := "sea"
		if h%(24*15) < 48 {
			engine, phase = 0, "port"
		}
		var set []plant.Setting
		if (h/(24*15))%2 == 1 {
			set = append(set, plant.Setting{Unit: "cargo heating", Param: "off", Value: 1})
		}
		rows[h] = profile.Row{Phase: phase, Hours: 1, Case: plant.Case{Name: phase,
			Conditions: plant.Conditions{SeaT: sea, AirT: air, EngineLoad: engine}, Set: set}}
	}
	return rows
}

// BenchmarkDemoTankerYear solves a year of hourly cases on the demo
// product tanker on one core. The second solve per case that gives the
// economiser's fuel saving is left out (Options.NoEGESaving), as a year's
// plan asks for the fuel, not for the saving hour by hour.
func BenchmarkDemoTankerYear(b *testing.B) {
	p := demoTanker(b)
	p.Opt.NoEGESaving = true
	rows := yearRows()
	var iters, all float64
	cpu0 := cpuSeconds()
	for b.Loop() {
		res, err := profile.Run(context.Background(), p, rows, profile.Options{Workers: 1})
		if err != nil {
			b.Fatal(err)
		}
		for _, r := range res.Rows {
			iters += float64(r.Result.Iterations)
			all += float64(r.Result.NewtonIterations)
		}
	}
	// cpu-s/op is the process's CPU time: on a shared machine the wall
	// clock also counts the waits for a core.
	b.ReportMetric((cpuSeconds()-cpu0)/float64(b.N), "cpu-s/op")
	b.ReportMetric(iters/float64(b.N)/8760, "newton-iters/row")
	b.ReportMetric(all/float64(b.N)/8760, "all-newton-iters/row")
}
