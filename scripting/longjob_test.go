package scripting

import (
	"context"
	"errors"
	"fmt"
	"runtime"
	"runtime/metrics"
	"strings"
	"testing"
	"testing/fstest"
	"time"
)

// longPlant is an invented coaster's plant, small so that a long job
// solves fast: one boiler, a duty consumer and the accommodation.
const longPlant = `return steam_plant {
  name = "Invented Long-Job Coaster",
  boilers = { { name = "AB1", mcr = "6 t/h", drum = "7 bar(g)", fuel = "VLSFO", turndown = 4,
                efficiency = { { "30 %", "82 %" }, { "100 %", "85 %" } } } },
  hotwell = { heat_loss = "4 kW" },
  consumers = {
    { name = "cargo heating", duty = "1.5 MW", returns = "95 %", return_T = "80 C" },
    { name = "accommodation", kind = "accommodation", UA = "8 kW/K", inside_T = "21 C", returns = "100 %" },
  },
}`

// longStudy compares three variants of the cargo heating over the rows
// of long.csv.
const longStudy = `local ship = include("plant.lua")
local s = study(ship, { name = "long", csv = "long.csv", fuel_price = 600,
  variants = { { name = "as built" },
               { name = "better lagging", set = { ["cargo heating"] = { factor = 0.9 } } },
               { name = "hot cargo", set = { ["cargo heating"] = { factor = 1.2 } } } } })
check(s.variants[1].totals.rows == ROWS, "every row summed")
`

// longFS is the plant, the study and a CSV of n hourly rows whose sea and
// air temperatures and heating duty vary from row to row.
func longFS(n int) fstest.MapFS {
	var csv strings.Builder
	csv.Grow(40 * n)
	csv.WriteString("phase,hours,sea,air,cargo heating.duty\n")
	for i := range n {
		fmt.Fprintf(&csv, "passage %d,1,%d C,%d C,%d kW\n", i%3, 5+i%17, i%23-3, 800+7*(i%151))
	}
	return fstest.MapFS{
		"plant.lua": {Data: []byte(longPlant)},
		"long.csv":  {Data: []byte(csv.String())},
		"long.lua":  {Data: []byte(strings.ReplaceAll(longStudy, "ROWS", fmt.Sprint(n)))},
	}
}

// TestLongStudyFitsMemoryGuard runs a study of 3 variants over 100 000
// hourly rows (3 × 100 000 solved rows) through RunSource under the
// default memory guard (Options.MaxMemory, 1 GiB of heap growth): the
// rows keep their summaries, not their case results, so the run fits.
// With every case result kept (keep = "full") the same study would keep
// some 300 000 case results of several kilobytes each, past the guard.
// It also reports the heap the run held at its end (after a collection)
// and the time it took. Skipped with -short: it solves 300 000 rows.
func TestLongStudyFitsMemoryGuard(t *testing.T) {
	if testing.Short() {
		t.Skip("a study of 3 × 100 000 rows")
	}
	const n = 100000
	var def Options
	def.defaults()
	defaultMaxMemory := def.MaxMemory
	fsys := longFS(n)
	src, _ := fsys["long.lua"]
	var m0, m1 runtime.MemStats
	runtime.GC()
	runtime.ReadMemStats(&m0)
	// The peak of what the guard watches: the heap's objects, live and
	// not yet collected, above their level at the start.
	sample := []metrics.Sample{{Name: "/memory/classes/heap/objects:bytes"}}
	read := func() uint64 { metrics.Read(sample); return sample[0].Value.Uint64() }
	base, peak := read(), uint64(0)
	stop, done := make(chan struct{}), make(chan struct{})
	go func() {
		defer close(done)
		tick := time.NewTicker(2 * time.Millisecond)
		defer tick.Stop()
		for {
			select {
			case <-stop:
				return
			case <-tick.C:
				if now := read(); now > base {
					peak = max(peak, now-base)
				}
			}
		}
	}()
	start := time.Now()
	run, err := RunSource(context.Background(), "long.lua", src.Data, fsys, Options{})
	took := time.Since(start)
	close(stop)
	<-done
	if err != nil {
		t.Fatal(err)
	}
	runtime.GC()
	runtime.ReadMemStats(&m1)
	res := run.Studies[0].Result
	for _, v := range res.Variants {
		if v.Totals.Rows != n || v.Rows != nil || !(v.Totals.FuelT > 0) {
			t.Errorf("variant %q: %d rows summed, %d kept, %g t of fuel", v.Name, v.Totals.Rows, len(v.Rows), v.Totals.FuelT)
		}
	}
	// The variants differ as their heating does: less fuel with better
	// lagging, more with hot cargo (the same plant's own figures; no
	// outside source).
	if f := res.Variants; !(f[1].Totals.FuelT < f[0].Totals.FuelT && f[0].Totals.FuelT < f[2].Totals.FuelT) {
		t.Errorf("fuel %g, %g, %g t", f[0].Totals.FuelT, f[1].Totals.FuelT, f[2].Totals.FuelT)
	}
	held := int64(m1.HeapAlloc) - int64(m0.HeapAlloc)
	t.Logf("3 × %d rows in %v; heap growth at its peak %.0f MiB of the guard's %d MiB; held after the run %.1f MiB; %d collections",
		n, took.Round(time.Millisecond), float64(peak)/(1<<20), defaultMaxMemory>>20, float64(held)/(1<<20), m1.NumGC-m0.NumGC)
	// Room to spare: half the guard at most (measured 337 to 364 MiB).
	if peak > defaultMaxMemory/2 {
		t.Errorf("the heap grew by %.0f MiB at its peak, more than half the guard's %d MiB", float64(peak)/(1<<20), defaultMaxMemory>>20)
	}
	runtime.KeepAlive(run)
}

// TestJobMemoryStop: a study that keeps its rows in full past the memory
// guard is stopped, and the message names the job and what keeps the
// memory.
func TestJobMemoryStop(t *testing.T) {
	t.Parallel()
	fsys := longFS(20000)
	src := strings.Replace(string(fsys["long.lua"].Data), `csv = "long.csv",`, `csv = "long.csv", keep = "full",`, 1)
	_, err := RunSource(context.Background(), "long.lua", []byte(src), fsys, Options{MaxMemory: 32 << 20})
	var te *TimeoutError
	if !errors.As(err, &te) || te.Memory != 32<<20 {
		t.Fatalf("error %v; want a stop at the memory guard", err)
	}
	for _, want := range []string{"long.lua:2: ", "more than 32 MiB of memory while running study \"long\"", `keep = "full"`, "summaries"} {
		if !strings.Contains(err.Error(), want) {
			t.Errorf("%q does not say %q", err, want)
		}
	}
}
