package scenarios_test

import (
	"context"
	"fmt"
	"io/fs"
	"math"
	"runtime"
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

// dischargeRows is yearRows with a cargo discharge of 30 hours after each
// port stay (all three cargo pumps running): the rows where a boiler trip
// cannot be carried and its contingency is solved.
func dischargeRows() []profile.Row {
	rows := yearRows()
	for h := range rows {
		if k := h % (24 * 15); k >= 48 && k < 78 {
			r := &rows[h]
			r.Phase = "discharge"
			r.Case.Name = "discharge"
			r.Case.Conditions.EngineLoad = 0
			for _, u := range []string{"COP1", "COP2", "COP3"} {
				r.Case.Set = append(r.Case.Set, plant.Setting{Unit: u, Param: "off", Value: 0})
			}
		}
	}
	return rows
}

// BenchmarkDemoTankerYear solves a year of hourly cases on the demo
// product tanker on one worker, with its N-1 contingencies and without
// (Options.NoContingencies), on the year of yearRows and on the year with
// discharges (dischargeRows). The second solve per case that gives the
// economiser's fuel saving is left out (Options.NoEGESaving), as a year's
// plan asks for the fuel, not for the saving hour by hour. Metrics:
// Newton iterations of each row's final configuration, and the N-1
// contingencies solved (not screened as carried) per row.
func BenchmarkDemoTankerYear(b *testing.B) {
	for _, year := range []struct {
		name string
		rows []profile.Row
	}{{"sea-and-port", yearRows()}, {"with-discharges", dischargeRows()}} {
		for _, n1 := range []bool{false, true} {
			b.Run(fmt.Sprintf("%s/n-1=%v", year.name, n1), func(b *testing.B) {
				p := demoTanker(b)
				p.Opt.NoEGESaving = true
				p.Opt.NoContingencies = !n1
				var iters, all, solved float64
				cpu0 := cpuSeconds()
				for b.Loop() {
					res, err := profile.Run(context.Background(), p, year.rows, profile.Options{Workers: 1})
					if err != nil {
						b.Fatal(err)
					}
					for _, r := range res.Rows {
						iters += float64(r.Summary.Iterations)
						all += float64(r.Summary.NewtonIterations)
						solved += float64(r.Summary.N1Solved)
					}
				}
				n := float64(b.N) * float64(len(year.rows))
				// cpu-s/op is the process's CPU time: on a shared machine
				// the wall clock also counts the waits for a core.
				b.ReportMetric((cpuSeconds()-cpu0)/float64(b.N), "cpu-s/op")
				b.ReportMetric(iters/n, "newton-iters/row")
				b.ReportMetric(all/n, "all-newton-iters/row")
				b.ReportMetric(solved/n, "n-1-solves/row")
			})
		}
	}
}

// BenchmarkDemoTankerYearKept measures the heap a solved year keeps: the
// voyage result of yearRows on the demo product tanker's plant as the
// demo runs it (N-1 and the economiser's saving on), measured with
// runtime.MemStats after a garbage collection before the run and after
// it, while the result is still held; with the rows' summaries only (the
// default) and with their full case results (Options.KeepResults).
// Metric: bytes kept per row.
func BenchmarkDemoTankerYearKept(b *testing.B) {
	for _, keep := range []bool{false, true} {
		name := "summary"
		if keep {
			name = "full"
		}
		b.Run(name, func(b *testing.B) {
			p := demoTanker(b)
			rows := yearRows()
			// One run first, so that what the plant keeps between runs (its
			// warm start, its memos) is in the heap before the measurement.
			if _, err := profile.Run(context.Background(), p, rows[:64], profile.Options{Workers: 1}); err != nil {
				b.Fatal(err)
			}
			var kept float64
			for b.Loop() {
				var m0, m1 runtime.MemStats
				runtime.GC()
				runtime.ReadMemStats(&m0)
				res, err := profile.Run(context.Background(), p, rows, profile.Options{Workers: 1, KeepResults: keep})
				if err != nil {
					b.Fatal(err)
				}
				runtime.GC()
				runtime.ReadMemStats(&m1)
				kept += float64(int64(m1.HeapAlloc) - int64(m0.HeapAlloc))
				runtime.KeepAlive(res)
			}
			b.ReportMetric(kept/float64(b.N)/float64(len(rows)), "B-kept/row")
		})
	}
}
