package scripting

import (
	"context"
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"
	"testing/fstest"
	"time"
)

// keepSrc runs a voyage and a study of two rows on testdata/good's tanker,
// with keep given as KEEP (or not at all), and checks in Lua that a row
// has its case under result exactly when FULL.
const keepSrc = `local ship = include("jobs_plant.lua")
local rows = {
  { phase = "passage", hours = 6, sea = "15 C", air = "10 C", engine = "85 %" },
  { phase = "discharge", hours = 6, air = "5 C", engine = "0 %", set = { ["cargo heating"] = { duty = "9 MW" } } },
}
local v = voyage(ship, { name = "trip", rows = rows KEEP })
local s = study(ship, { name = "EGE", rows = rows KEEP,
  variants = { { name = "without", set = { EGE = { off = true } } }, { name = "with" } } })
local full = FULL
check((v.rows[2].result ~= nil) == full, "a voyage row has its case exactly when kept in full")
check((s.variants[2].rows ~= nil) == full, "a study variant has rows exactly when kept in full")
if full then
  local c = v.rows[2].result
  check(c.name == v.rows[2].case and c.fuel_kg_h == v.rows[2].fuel_kg_h and #c.boilers == 2,
    "the kept case is the row's")
  check(#s.variants[2].rows == 2 and s.variants[2].rows[2].result.fuel_kg_h == v.rows[2].fuel_kg_h,
    "a variant's kept rows are its own")
end
`

// TestKeepRows: voyage() and study() keep their rows' case results when
// the script says keep = "full", or when the run's FullRows says so and
// the script does not say; the Lua rows follow, and the totals are the
// same either way (the same solves; no outside source).
func TestKeepRows(t *testing.T) {
	t.Parallel()
	plantSrc, err := os.ReadFile(filepath.Join("testdata", "good", "jobs_plant.lua"))
	if err != nil {
		t.Fatal(err)
	}
	fsys := fstest.MapFS{"jobs_plant.lua": {Data: plantSrc}}
	var totals []float64
	for _, tc := range []struct {
		keep     string // the script's key, "" for none
		fullRows bool   // Options.FullRows
		full     bool
	}{
		{"", false, false},
		{"", true, true},
		{"summary", true, false},
		{"full", false, true},
		{"summary", false, false},
	} {
		t.Run(fmt.Sprintf("keep=%q,FullRows=%v", tc.keep, tc.fullRows), func(t *testing.T) {
			keep := ""
			if tc.keep != "" {
				keep = fmt.Sprintf(", keep = %q", tc.keep)
			}
			src := strings.NewReplacer("KEEP", keep, "FULL", fmt.Sprint(tc.full)).Replace(keepSrc)
			run, err := RunSource(context.Background(), "keep.lua", []byte(src), fsys, Options{FullRows: tc.fullRows, Timeout: time.Minute})
			if err != nil {
				t.Fatal(err)
			}
			v, s := run.Voyages[0].Result, run.Studies[0].Result
			for i, row := range v.Rows {
				if (row.Result != nil) != tc.full || !row.Summary.Solved {
					t.Errorf("voyage row %d: case result kept %v, want %v", i+1, row.Result != nil, tc.full)
				}
			}
			for _, x := range s.Variants {
				if (x.Rows != nil) != tc.full {
					t.Errorf("variant %q keeps %d rows; want them kept %v", x.Name, len(x.Rows), tc.full)
				}
			}
			totals = append(totals, v.Total.FuelT, s.Variants[1].Totals.FuelT)
		})
	}
	for i := 2; i < len(totals); i += 2 {
		if !reflect.DeepEqual(totals[i:i+2], totals[:2]) {
			t.Errorf("totals %v differ from those kept as summaries %v", totals[i:i+2], totals[:2])
		}
	}
}

// TestKeepRowsError: keep takes "summary" or "full" and nothing else; the
// error names the script line, the job and the key.
func TestKeepRowsError(t *testing.T) {
	t.Parallel()
	plantSrc, err := os.ReadFile(filepath.Join("testdata", "good", "jobs_plant.lua"))
	if err != nil {
		t.Fatal(err)
	}
	fsys := fstest.MapFS{"jobs_plant.lua": {Data: plantSrc}}
	for _, job := range []string{"voyage", "study"} {
		src := `local ship = include("jobs_plant.lua")
` + job + `(ship, { name = "j", keep = "all", rows = { { phase = "p", hours = 1 } },
  variants = { { name = "a" }, { name = "b" } } })`
		if job == "voyage" {
			src = `local ship = include("jobs_plant.lua")
voyage(ship, { name = "j", keep = "all", rows = { { phase = "p", hours = 1 } } })`
		}
		_, err := RunSource(context.Background(), "bad.lua", []byte(src), fsys, Options{Timeout: time.Minute})
		var list ErrorList
		if !errors.As(err, &list) {
			t.Fatalf("%s: error %v; want an ErrorList", job, err)
		}
		msg := err.Error()
		for _, want := range []string{"bad.lua:2:", job + ` "j"`, `keep must be "summary"`, `"full"`, `got "all"`} {
			if !strings.Contains(msg, want) {
				t.Errorf("%s: error %q does not say %q", job, msg, want)
			}
		}
	}
}

// TestKeepRowsCheckMode: in check mode a job kept in full has the shape
// of a solved one, each row's result its case's outline, so that a
// script reading it runs (indexing a missing table would raise an error).
func TestKeepRowsCheckMode(t *testing.T) {
	t.Parallel()
	plantSrc, err := os.ReadFile(filepath.Join("testdata", "good", "jobs_plant.lua"))
	if err != nil {
		t.Fatal(err)
	}
	fsys := fstest.MapFS{"jobs_plant.lua": {Data: plantSrc}}
	src := strings.NewReplacer("KEEP", `, keep = "full"`, "FULL", "true").Replace(keepSrc) + `
local x = v.rows[2].result.boilers[1].load_fraction + s.variants[2].rows[1].result.fuel_kg_h
`
	if _, err := RunSource(context.Background(), "keep.lua", []byte(src), fsys, Options{CheckOnly: true, Timeout: time.Minute}); err != nil {
		t.Fatal(err)
	}
	// Kept as summaries, the same read is an error: result is nil.
	src = strings.NewReplacer("KEEP", "", "FULL", "false").Replace(keepSrc) + `
local x = v.rows[2].result.boilers[1].load_fraction
`
	if _, err := RunSource(context.Background(), "keep.lua", []byte(src), fsys, Options{CheckOnly: true, Timeout: time.Minute}); err == nil {
		t.Errorf("check mode: a summary row has a result")
	}
}
