package scripting

import (
	"bytes"
	"context"
	"encoding/json"
	"os"
	"path/filepath"
	"sort"
	"strings"
	"testing"
	"testing/fstest"
	"time"

	"github.com/rs/zerolog"

	"steamcase/plant/schema"
)

// luaOnly are the keys the Lua tables of the jobs add to their schema
// objects, as the package doc lists them: conveniences derived from the
// schema's values.
var luaOnly = map[string]bool{
	"by_phase": true, "by_name": true, "flagged_days": true,
	"hours_no_boiler": true, "hours_one_boiler": true, "hours_two_boilers": true,
}

// keysSrc solves one case and runs one voyage, study and audit on the
// invented tanker of testdata/good, and prints the key paths of each
// result table ("rows[].warnings"), the Lua-only keys left out and
// counted apart.
const keysSrc = `local ship = include("jobs_plant.lua")
local only = { by_phase = true, by_name = true, flagged_days = true,
  hours_no_boiler = true, hours_one_boiler = true, hours_two_boilers = true }
local function paths(t, prefix, out, seen)
  for k, v in pairs(t) do
    if type(k) == "string" then
      if only[k] then
        seen[k] = true
      else
        local p = prefix .. k
        if not out[p] then out[p] = true; out[#out + 1] = p end
        if type(v) == "table" and k ~= "inputs" then
          if v[1] ~= nil then
            for _, e in ipairs(v) do
              if type(e) == "table" then paths(e, p .. "[].", out, seen) end
            end
          else
            paths(v, p .. ".", out, seen)
          end
        end
      end
    end
  end
end
local function emit(kind, t)
  local out, seen = {}, {}
  paths(t, "", out, seen)
  local extra = {}
  for k in pairs(seen) do extra[#extra + 1] = k end
  table.sort(extra)
  print(kind .. "|" .. table.concat(out, " ") .. "|" .. table.concat(extra, " "))
end
local rows = {
  { phase = "passage", hours = 6, sea = "15 C", air = "10 C", engine = "85 %" },
  { phase = "discharge", hours = 6, air = "5 C", engine = "0 %", set = { ["cargo heating"] = { duty = "9 MW" } } },
}
emit("case", case(ship, { name = "at sea", sea = "15 C", air = "10 C", engine = "85 %" }))
emit("voyage", voyage(ship, { name = "trip", rows = rows }))
emit("study", study(ship, { name = "EGE", rows = rows, fuel_price = 600, installed_cost = 100000, currency = "EUR",
  carbon_price = 80, life = 10, discount_rate = "8 %",
  variants = { { name = "without", set = { EGE = { off = true } } }, { name = "with" } },
  sweep = { unit = "EGE", key = "ua", from = "20 kW/K", to = "60 kW/K", steps = 2, cost = { at = "40 kW/K", cost = 200000 } } }))
emit("voyage_full", voyage(ship, { name = "trip in full", rows = rows, keep = "full" }))
emit("study_full", study(ship, { name = "EGE in full", rows = rows, keep = "full", fuel_price = 600, life = 10, discount_rate = "8 %",
  variants = { { name = "without", set = { EGE = { off = true } } }, { name = "with" } },
  sweep = { unit = "EGE", key = "ua", from = "20 kW/K", to = "60 kW/K", steps = 2, cost = { at = "40 kW/K", cost = 200000 } } }))
emit("audit", audit(ship, { name = "log", samples = 10, days = {
  { date = "2026-03-01", phase = "passage", sea = "15 C", air = "10 C", engine = "85 %", claimed = 40 },
  { date = "2026-03-02", phase = "passage", sea = "15 C", air = "10 C", engine = "85 %", claimed = 1 } },
  uncertain = { { unit = "galley", key = "duty", low = "20 kW", high = "60 kW" } } }))
`

// jsonPaths returns the key paths of a JSON object as the script above
// writes them: a null is left out (it is nil in Lua), the keys inside
// "inputs" are data.
func jsonPaths(t *testing.T, v any) []string {
	t.Helper()
	b, err := json.Marshal(v)
	if err != nil {
		t.Fatal(err)
	}
	var x any
	if err := json.Unmarshal(b, &x); err != nil {
		t.Fatal(err)
	}
	var out []string
	var walk func(v any, prefix string)
	walk = func(v any, prefix string) {
		switch v := v.(type) {
		case map[string]any:
			for k, e := range v {
				if e == nil {
					continue
				}
				out = append(out, prefix+k)
				if k == "inputs" {
					continue
				}
				switch e := e.(type) {
				case []any:
					for _, x := range e {
						walk(x, prefix+k+"[].")
					}
				default:
					walk(e, prefix+k+".")
				}
			}
		}
	}
	walk(x, "")
	return out
}

func uniqueSorted(s []string) []string {
	m := map[string]bool{}
	for _, x := range s {
		m[x] = true
	}
	out := make([]string, 0, len(m))
	for x := range m {
		out = append(out, x)
	}
	sort.Strings(out)
	return out
}

// TestLuaKeysAreJSONKeys: for a case and a job of each kind, the Lua
// table's keys, at every depth, are the JSON object's keys (less those
// that are null, which are nil in Lua), and the only others are the
// documented Lua-only conveniences, which the JSON does not have.
func TestLuaKeysAreJSONKeys(t *testing.T) {
	t.Parallel()
	plantSrc, err := os.ReadFile(filepath.Join("testdata", "good", "jobs_plant.lua"))
	if err != nil {
		t.Fatal(err)
	}
	fsys := fstest.MapFS{"jobs_plant.lua": {Data: plantSrc}}
	var log bytes.Buffer
	run, err := RunSource(context.Background(), "keys.lua", []byte(keysSrc), fsys, Options{Logger: zerolog.New(&log), Timeout: time.Minute})
	if err != nil {
		t.Fatal(err)
	}
	lua := map[string][]string{}
	extra := map[string][]string{}
	dec := json.NewDecoder(&log)
	for {
		var rec struct{ Message string }
		if err := dec.Decode(&rec); err != nil {
			break
		}
		parts := strings.Split(rec.Message, "|")
		if len(parts) != 3 {
			t.Fatalf("printed %q", rec.Message)
		}
		lua[parts[0]] = uniqueSorted(strings.Fields(parts[1]))
		extra[parts[0]] = strings.Fields(parts[2])
	}
	job := func(name, plant string, pos Pos, rows []Pos) schema.Job {
		return schema.Job{Name: name, Plant: plant, Source: pos.String(), RowSources: posStrings(rows)}
	}
	c, v, s, a := run.Cases[0], run.Voyages[0], run.Studies[0], run.Audits[0]
	want := map[string][]string{
		"case":   uniqueSorted(jsonPaths(t, schema.NewCase(c.Plant, c.Result))),
		"voyage": uniqueSorted(jsonPaths(t, schema.NewVoyage(job(v.Name, v.Plant, v.Pos, v.Rows), v.Result))),
		"study":  uniqueSorted(jsonPaths(t, schema.NewStudy(job(s.Name, s.Plant, s.Pos, s.Rows), s.Result))),
		"audit":  uniqueSorted(jsonPaths(t, schema.NewAudit(job(a.Name, a.Plant, a.Pos, a.Days), a.Result))),
	}
	vf, sf := run.Voyages[1], run.Studies[1]
	want["voyage_full"] = uniqueSorted(jsonPaths(t, schema.NewVoyage(job(vf.Name, vf.Plant, vf.Pos, vf.Rows), vf.Result)))
	want["study_full"] = uniqueSorted(jsonPaths(t, schema.NewStudy(job(sf.Name, sf.Plant, sf.Pos, sf.Rows), sf.Result)))
	wantExtra := map[string]string{
		"case":   "",
		"voyage": "by_phase hours_no_boiler hours_one_boiler hours_two_boilers",
		"study":  "by_name hours_no_boiler hours_one_boiler hours_two_boilers",
		"audit":  "flagged_days",
		// A voyage's rows' cases have no conveniences; a study's rows have
		// none, and its totals have theirs.
		"voyage_full": "by_phase hours_no_boiler hours_one_boiler hours_two_boilers",
		"study_full":  "by_name hours_no_boiler hours_one_boiler hours_two_boilers",
	}
	for kind, w := range want {
		got := lua[kind]
		if strings.Join(got, "\n") != strings.Join(w, "\n") {
			gm := map[string]bool{}
			for _, k := range got {
				gm[k] = true
			}
			for _, k := range w {
				if !gm[k] {
					t.Errorf("%s: the JSON has %q, the Lua table does not", kind, k)
				}
				delete(gm, k)
			}
			for k := range gm {
				t.Errorf("%s: the Lua table has %q, the JSON does not", kind, k)
			}
		}
		if len(w) < 10 {
			t.Errorf("%s: only %d keys: %q", kind, len(w), w)
		}
		if e := strings.Join(extra[kind], " "); e != wantExtra[kind] {
			t.Errorf("%s: Lua-only keys %q, want %q", kind, e, wantExtra[kind])
		}
		for _, k := range w {
			if luaOnly[k[strings.LastIndex(k, ".")+1:]] {
				t.Errorf("%s: the JSON has %q, a name kept for a Lua-only key", kind, k)
			}
		}
	}
	for _, k := range []string{"rows[].warnings", "total.ege_fuel_saved_t", "row_sources"} {
		if !contains(want["voyage"], k) {
			t.Errorf("voyage: no key %q in %q", k, want["voyage"])
		}
	}
	// Kept in full, and only then: a row's case, a variant's and a size's
	// rows.
	for kind, k := range map[string]string{"voyage_full": "rows[].result.boilers[].load_fraction",
		"study_full": "variants[].rows[].result.fuel_kg_h"} {
		if !contains(want[kind], k) {
			t.Errorf("%s: no key %q", kind, k)
		}
	}
	if !contains(want["study_full"], "sweep.points[].rows[].result.fuel_kg_h") {
		t.Errorf("study_full: a sweep's sizes keep no rows")
	}
	for _, kind := range []string{"voyage", "study"} {
		for _, k := range want[kind] {
			if strings.Contains(k, "result") || strings.HasPrefix(k, "variants[].rows") {
				t.Errorf("%s kept as summaries has %q", kind, k)
			}
		}
	}
}

// BenchmarkVoyageTable checks a voyage of 5000 rows without solving it:
// the cost is reading the rows and building the Lua table of the result
// (through its JSON form), which a solved voyage pays once besides its
// solves.
func BenchmarkVoyageTable(b *testing.B) {
	const rows = 5000
	fsys := voyageFS(b, rows)
	ctx := context.Background()
	for b.Loop() {
		run, err := RunSource(ctx, "voyage.lua", []byte(voyageSrc), fsys, Options{CheckOnly: true, Timeout: time.Minute})
		if err != nil {
			b.Fatal(err)
		}
		if len(run.Voyages[0].Rows) != rows {
			b.Fatalf("%d rows", len(run.Voyages[0].Rows))
		}
	}
	b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N*rows), "ns/row")
}
