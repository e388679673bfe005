package scripting

import (
	"context"
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"testing/fstest"
	"time"
)

// voyageFS is testdata/good's plant with a voyage CSV of n rows, as a file
// system for RunSource.
func voyageFS(tb testing.TB, n int) fstest.MapFS {
	plantSrc, err := os.ReadFile(filepath.Join("testdata", "good", "jobs_plant.lua"))
	if err != nil {
		tb.Fatal(err)
	}
	var csv strings.Builder
	csv.WriteString("phase,hours,sea,air,engine,cargo heating.duty\n")
	for i := range n {
		// loads and temperatures vary row by row, as in a year's profile
		fmt.Fprintf(&csv, "passage %d,6,%d C,%d C,%d %%,%d kW\n", i%4, 5+i%15, i%20, 40+i%50, 1000+10*(i%150))
	}
	return fstest.MapFS{
		"jobs_plant.lua": {Data: plantSrc},
		"plan.csv":       {Data: []byte(csv.String())},
	}
}

const voyageSrc = `local ship = include("jobs_plant.lua")
voyage(ship, { name = "year", csv = "plan.csv" })`

// BenchmarkVoyage runs a voyage of 500 rows on one worker: the cost per
// row is the plant's solve (warm-started within each chunk) plus the row's
// parsing.
func BenchmarkVoyage(b *testing.B) {
	const rows = 500
	fsys := voyageFS(b, rows)
	ctx := context.Background()
	for b.Loop() {
		run, err := RunSource(ctx, "voyage.lua", []byte(voyageSrc), fsys, Options{Workers: 1, Timeout: time.Minute})
		if err != nil {
			b.Fatal(err)
		}
		if run.Voyages[0].Result.Total.Rows != rows {
			b.Fatalf("%d rows solved", run.Voyages[0].Result.Total.Rows)
		}
	}
	b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N*rows), "ns/row")
}

// FuzzVoyageCSV checks that no CSV file makes a voyage panic or fail
// inside this package: every outcome is a result or a script error (check
// mode, so nothing is solved).
func FuzzVoyageCSV(f *testing.F) {
	fsys := voyageFS(f, 3)
	f.Add(fsys["plan.csv"].Data)
	for _, name := range []string{"voyage_rows.csv", "audit_log.csv"} {
		b, err := os.ReadFile(filepath.Join("testdata", "good", name))
		if err != nil {
			f.Fatal(err)
		}
		f.Add(b)
	}
	f.Add([]byte("phase,hours,EGE.off,fire\nx,1,maybe,AB1+\n"))
	f.Add([]byte("phase,hours\n\"x,1\n"))
	f.Fuzz(func(t *testing.T, data []byte) {
		fs := fstest.MapFS{"jobs_plant.lua": fsys["jobs_plant.lua"], "plan.csv": {Data: data}}
		_, err := RunSource(context.Background(), "voyage.lua", []byte(voyageSrc), fs, Options{CheckOnly: true, Timeout: 5 * time.Second})
		if errors.Is(err, ErrInternal) {
			t.Fatalf("internal error for %q: %v", data, err)
		}
		var list ErrorList
		if err != nil && !errors.As(err, &list) {
			t.Fatalf("error of type %T for %q: %v", err, data, err)
		}
	})
}
