package schema

import (
	"bytes"
	"encoding/json"
	"math"
	"os"
	"reflect"
	"regexp"
	"strings"
	"testing"

	"steamcase/plant"
	"steamcase/plant/profile"
)

// documented reads the keys doc.go lists for each type: a line of the
// comment naming "(type T)" starts T's list, and each line of a code block
// that begins with a key (or keys separated by commas) followed by two
// spaces adds them; continuation lines begin with spaces and add nothing.
func documented(t *testing.T) map[string][]string {
	t.Helper()
	src, err := os.ReadFile("doc.go")
	must(t, err)
	typeRe := regexp.MustCompile(`\(type (\w+)\)`)
	keyRe := regexp.MustCompile(`^//\t([A-Za-z_][A-Za-z0-9_]*(?:, [A-Za-z_][A-Za-z0-9_]*)*)(?:  |$)`)
	out := map[string][]string{}
	current := ""
	for _, line := range strings.Split(string(src), "\n") {
		if m := typeRe.FindStringSubmatch(line); m != nil {
			current = m[1]
			if _, dup := out[current]; dup {
				t.Errorf("doc.go names (type %s) twice", current)
			}
			out[current] = nil
			continue
		}
		if m := keyRe.FindStringSubmatch(line); m != nil {
			if current == "" {
				t.Errorf("doc.go lists keys %q before naming a type", m[1])
				continue
			}
			out[current] = append(out[current], strings.Split(m[1], ", ")...)
		}
	}
	return out
}

// tagged walks the struct types reachable from Document and returns, for
// each, the JSON keys of its own fields (an embedded struct's keys belong
// to the embedded type, which is walked in turn).
func tagged() map[string][]string {
	out := map[string][]string{}
	var walk func(rt reflect.Type)
	walk = func(rt reflect.Type) {
		for rt.Kind() == reflect.Pointer || rt.Kind() == reflect.Slice || rt.Kind() == reflect.Map {
			rt = rt.Elem()
		}
		if rt.Kind() != reflect.Struct {
			return
		}
		if _, seen := out[rt.Name()]; seen {
			return
		}
		out[rt.Name()] = []string{}
		for f := range rt.Fields() {
			if f.Anonymous {
				walk(f.Type)
				continue
			}
			name, _, _ := strings.Cut(f.Tag.Get("json"), ",")
			if name == "" || name == "-" {
				continue
			}
			out[rt.Name()] = append(out[rt.Name()], name)
			walk(f.Type)
		}
	}
	walk(reflect.TypeFor[Document]())
	return out
}

// TestDocumentedKeys keeps doc.go and the types in step: every type of the
// document is documented, with exactly the keys of its struct tags, and
// doc.go documents no type or key the document does not have.
func TestDocumentedKeys(t *testing.T) {
	t.Parallel()
	doc, tags := documented(t), tagged()
	for typ, keys := range tags {
		dk, ok := doc[typ]
		if !ok {
			t.Errorf("type %s (keys %q) is not documented in doc.go: name it as (type %s)", typ, keys, typ)
			continue
		}
		have := map[string]bool{}
		for _, k := range dk {
			if have[k] {
				t.Errorf("doc.go lists %s.%s twice", typ, k)
			}
			have[k] = true
		}
		for _, k := range keys {
			if !have[k] {
				t.Errorf("%s has the key %q, which doc.go does not list", typ, k)
			}
			delete(have, k)
		}
		for k := range have {
			t.Errorf("doc.go lists the key %q for %s, which has no such key", k, typ)
		}
	}
	for typ := range doc {
		if _, ok := tags[typ]; !ok {
			t.Errorf("doc.go documents (type %s), which the document does not hold", typ)
		}
	}
	if len(tags) < 20 {
		t.Errorf("only %d types found from Document: %v", len(tags), tags)
	}
}

// TestDocumentJSON writes a document with every kind of object and checks
// its envelope: the version, the plants as a list in the order of first
// appearance, the checks, and no null where a list is documented.
func TestDocumentJSON(t *testing.T) {
	t.Parallel()
	p := boilerOnly(t)
	cr := solve(t, p, plant.Case{Name: "check", Pos: plant.Pos{File: "ship.lua", Line: 4}})
	v, s, a := jobs(t)
	job := Job{Name: "j", Plant: "Invented Second Ship", Source: "ship.lua:9"}
	d := Document{Version: "test", Caution: "caution", Cases: []Case{NewCase(p.Name, cr)},
		Voyages: []Voyage{NewVoyage(job, v)}, Studies: []Study{NewStudy(job, s)}, Audits: []Audit{NewAudit(job, a)},
		Checks: Checks{Passed: 3, Failed: []CheckFailure{{Pos: "ship.lua:12", Message: "one boiler carries it"}}}}
	d.Finish()
	b, err := json.Marshal(d)
	must(t, err)
	var got map[string]any
	must(t, json.Unmarshal(b, &got))
	if got["schema"] != float64(Version) || got["version"] != "test" {
		t.Errorf("schema %v version %v", got["schema"], got["version"])
	}
	plants, _ := json.Marshal(got["plant"])
	if string(plants) != `[{"name":"Invented Check Ship"},{"name":"Invented Second Ship"}]` {
		t.Errorf("plant %s", plants)
	}
	checks, _ := json.Marshal(got["checks"])
	if string(checks) != `{"failed":[{"message":"one boiler carries it","pos":"ship.lua:12"}],"passed":3}` {
		t.Errorf("checks %s", checks)
	}
	// Nothing solved: every list empty, the plants too.
	var empty Document
	empty.Finish()
	b, err = json.Marshal(empty)
	must(t, err)
	for _, want := range []string{`"plant":[]`, `"cases":[]`, `"voyages":[]`, `"studies":[]`, `"audits":[]`, `"failed":[]`} {
		if !bytes.Contains(b, []byte(want)) {
			t.Errorf("an empty document lacks %s: %s", want, b)
		}
	}
}

// TestNewCase checks the conversions to the report units against
// docs/reference/plant-checks.md §3.6 [C]: 10 t/h of saturated steam at 7 bar(g) from
// feed at 60 °C, η 0.85, LCV 40 200 kJ/kg: 736.4 kg/h = 17.674 t/d, and
// with C_F 3.114 (IMO MEPC.364(79) [S]) 55.04 t/d of CO2; tolerance
// ±0.2 % as docs/reference/plant-checks.md §11 item 9 states. And the rules: a temperature not given is
// null, lists are never null, a single-phase line has x null.
func TestNewCase(t *testing.T) {
	t.Parallel()
	p := boilerOnly(t)
	cr := solve(t, p, plant.Case{Name: "check", Pos: plant.Pos{File: "ship.lua", Line: 4}})
	j := NewCase(p.Name, cr)
	near(t, "fuel kg/h", j.FuelKgH, 736.4, 0.002)          // docs/reference/plant-checks.md §3.6 [C]
	near(t, "fuel t/day", j.FuelTPerDay, 17.674, 0.002)    // docs/reference/plant-checks.md §3.6 [C]
	near(t, "CO2 t/day", j.CO2TPerDay, 55.04, 0.002)       // docs/reference/plant-checks.md §3.6 [C]
	near(t, "steam kg/h", j.SteamDemandKgH, 10000, 1e-6)   // the consumer's set flow
	near(t, "MCR kg/h", j.Boilers[0].MCRKgH, 4*3600, 1e-9) // 4 kg/s, 1 h = 3600 s
	if j.Plant != p.Name || j.Source != "ship.lua:4" || j.Name != "check" {
		t.Errorf("plant %q source %q name %q", j.Plant, j.Source, j.Name)
	}
	if j.SeaTK != nil || j.AirTK != nil {
		t.Errorf("temperatures not given: sea %v air %v, want null", j.SeaTK, j.AirTK)
	}
	if j.EGEs == nil || j.Warnings == nil || j.Units == nil {
		t.Errorf("a list is null: %+v", j)
	}
	// x is null for a single phase, the quality for two: the steam of a
	// drum at dryness 0.97 is wet.
	wet := solve(t, p, plant.Case{Name: "wet", Set: []plant.Setting{{Unit: "b1", Param: "dryness", Value: 0.97}}})
	for _, l := range NewCase(p.Name, wet).Lines {
		switch l.Name {
		case "feed": // water at 60 °C and 1 bar(a)
			if l.X != nil {
				t.Errorf("feed: x = %v, want null", *l.X)
			}
		case "steam":
			if l.X == nil || math.Abs(*l.X-0.97) > 1e-6 {
				t.Errorf("steam: x = %v, want 0.97", l.X)
			}
		}
	}
	// The same case with its temperatures: given back in K, rounded.
	cr = solve(t, p, plant.Case{Name: "given", Conditions: plant.Conditions{SeaT: 288.15, AirT: 263.15}})
	j = NewCase(p.Name, cr)
	if j.SeaTK == nil || *j.SeaTK != 288.15 || j.AirTK == nil || *j.AirTK != 263.15 {
		t.Errorf("temperatures given: sea %v air %v", j.SeaTK, j.AirTK)
	}
}

// TestNewJobs checks the jobs' schema against the profile results they
// come from: rows numbered from 1, a row's warnings its case's texts, its
// tonnes its flows times its hours (1 kg/s for 1 h = 3.6 t, exact by
// definition), the totals' rows, and the study's and audit's own keys.
func TestNewJobs(t *testing.T) {
	t.Parallel()
	v, s, a := jobs(t)
	job := Job{Name: "trip", Plant: "Invented Check Ship", Source: "trip.lua:3", RowSources: []string{"a:1", "a:2", "a:3"}}
	vj := NewVoyage(job, v)
	if len(vj.Rows) != 3 || len(vj.Phases) != 2 || vj.Phases[0].Phase != "sea" || vj.Phases[1].Phase != "port" {
		t.Fatalf("rows %d phases %+v", len(vj.Rows), vj.Phases)
	}
	for i, row := range vj.Rows {
		c := v.Rows[i].Result
		if row.Row != i+1 || row.Case != c.Name || !reflect.DeepEqual(row.Warnings, append([]string{}, c.Warnings...)) {
			t.Errorf("row %d: number %d case %q warnings %q, want %q", i+1, row.Row, row.Case, row.Warnings, c.Warnings)
		}
		near(t, "fuel_t", row.FuelT, c.FuelKgS*3.6*v.Rows[i].Hours, 5e-6)
		near(t, "steam_production_kg_h", row.SteamProductionKgH, c.SteamProductionKgS*3600, 5e-6)
		// Kept in full: the row's result is its CASE.
		if row.Result == nil || !reflect.DeepEqual(*row.Result, NewCase(job.Plant, c)) {
			t.Errorf("row %d: result %+v, want the CASE of its case result", i+1, row.Result)
		}
	}
	// Summaries only: the same row, its result null.
	lean := *v
	lean.Rows = append([]profile.RowResult(nil), v.Rows...)
	for i := range lean.Rows {
		lean.Rows[i].Result = nil
	}
	for i, row := range NewVoyage(job, &lean).Rows {
		full := vj.Rows[i]
		full.Result = nil
		if row.Result != nil || !reflect.DeepEqual(row, full) {
			t.Errorf("row %d from its summary: %+v\nwant %+v", i+1, row, full)
		}
	}
	if len(vj.Rows[1].Warnings) == 0 || !strings.Contains(vj.Rows[1].Warnings[0], "cycles") {
		t.Errorf("the light row (1000 kg/h on a burner minimum of 3600 kg/h) should warn that it cycles: %q", vj.Rows[1].Warnings)
	}
	if vj.Rows[1].SeaTK != nil || vj.Rows[0].SeaTK == nil || *vj.Rows[0].SeaTK != 288.15 {
		t.Errorf("row temperatures: %v, %v", vj.Rows[0].SeaTK, vj.Rows[1].SeaTK)
	}
	if vj.Total.PeakRow == nil || *vj.Total.PeakRow != 1 || vj.Total.TightestRow == nil || *vj.Total.TightestRow != 1 {
		t.Errorf("peak row %v tightest row %v, want 1 and 1 (the full row)", vj.Total.PeakRow, vj.Total.TightestRow)
	}
	if !reflect.DeepEqual(vj.Total.WarningRows, []int{2}) {
		t.Errorf("warning rows %v, want [2]", vj.Total.WarningRows)
	}
	near(t, "total fuel", vj.Total.FuelT, v.Total.FuelT, 5e-6)

	// No row summed: the rows and the margin are null, not 0 or infinite.
	none := NewTotals(profile.Totals{PeakRow: -1, TightestRow: -1, TightestMarginKgS: math.Inf(1)})
	if none.PeakRow != nil || none.TightestRow != nil || none.TightestMarginKgH != nil || none.ShortRows == nil {
		t.Errorf("empty totals %+v", none)
	}
	if _, err := json.Marshal(none); err != nil {
		t.Errorf("empty totals do not marshal: %v", err)
	}

	sj := NewStudy(job, s)
	if sj.Variants[0].Rows != nil || sj.Variants[1].Rows != nil {
		t.Errorf("a study that keeps summaries has rows: %d, %d", len(sj.Variants[0].Rows), len(sj.Variants[1].Rows))
	}
	// A study that kept its rows: each variant's rows, with their cases.
	kept := *s
	kept.Variants = append([]profile.VariantResult(nil), s.Variants...)
	kept.Variants[0].Rows = v.Rows
	if rows := NewStudy(job, &kept).Variants[0].Rows; len(rows) != 3 || rows[1].Result == nil || rows[1].Result.Name != "light" ||
		!reflect.DeepEqual(rows[1].Warnings, vj.Rows[1].Warnings) {
		t.Errorf("a study's kept rows: %+v", rows)
	}
	if sj.Variants[0].PaybackYears != nil {
		t.Errorf("the base has a payback %v", *sj.Variants[0].PaybackYears)
	}
	if pb := sj.Variants[1].PaybackYears; pb == nil || math.Abs(*pb-s.Variants[1].PaybackYears) > 5e-6**pb {
		t.Errorf("payback %v, want %g", pb, s.Variants[1].PaybackYears)
	}
	if sj.FuelPrice != 600 || sj.Currency != "EUR" || sj.Variants[1].FuelSavedT <= 0 {
		t.Errorf("study %+v", sj)
	}

	aj := NewAudit(job, a)
	if len(aj.Days) != 2 || aj.Days[1].Day != 2 || aj.Days[0].Flag != "above" || aj.Days[1].Flag != "below" {
		t.Errorf("days %+v", aj.Days)
	}
	if len(aj.Uncertainties) != 1 || aj.Uncertainties[0].Param != "eta_factor" || aj.Uncertainties[0].Scope != "fixed" {
		t.Errorf("uncertainties %+v", aj.Uncertainties)
	}
	// The period's figures are the profile's, rounded; a day's implied
	// factor is named and has its value (0.95 to 1.05 gives a band of
	// about ±5 %: a claim of 12 t lies beyond it, of 2 t below it).
	near(t, "period claimed_t", aj.Period.ClaimedT, a.Period.ClaimedT, 5e-6)
	near(t, "period high_t", aj.Period.HighT, a.Period.HighT, 5e-6)
	if aj.ClaimsOf != ClaimsOfFuel || aj.BaseT != nil || aj.Calibration != nil || len(aj.Implied) != 1 {
		t.Errorf("claims_of %q base %v calibration %v implied %d", aj.ClaimsOf, aj.BaseT, aj.Calibration, len(aj.Implied))
	}
	for i, d := range aj.Days {
		v := a.Days[i].Implied[0]
		if len(d.Implied) != 1 || d.Implied[0].Factor != "b1.eta_factor" || d.Implied[0].Status != v.Status.String() ||
			(v.Status == profile.ImpliedFound) != (d.Implied[0].Value != nil) {
			t.Errorf("day %d implied %+v; profile %+v", i+1, d.Implied, v)
		}
		if d.LowT == nil || d.Percentile == nil || d.Reference {
			t.Errorf("day %d: an audited day's band or percentile is null", i+1)
		}
	}
	// The job's lists are its own copies.
	job.RowSources[0] = "changed"
	if vj.RowSources[0] != "a:1" {
		t.Errorf("the voyage shares its row sources with the caller")
	}
}

// TestNewVoyageRowUnsolved: a row without a case result (check mode) has
// its phase and hours, zero figures and empty lists of warnings and tanks.
func TestNewVoyageRowUnsolved(t *testing.T) {
	t.Parallel()
	r := NewVoyageRow(profile.RowResult{Index: 4, Phase: "port", Hours: 6})
	b, err := json.Marshal(r)
	must(t, err)
	want := `{"row":5,"phase":"port","hours":6,"case":"","sea_T_K":null,"air_T_K":null,"engine_load":0,` +
		`"boilers_firing":0,"can_carry":true,"steam_demand_kg_h":0,"steam_production_kg_h":0,"boiler_steam_kg_h":0,` +
		`"ege_steam_kg_h":0,"dumped_kg_h":0,"fuel_kg_h":0,"fuel_t":0,"co2_t":0,"co2_analysis_t":0,"margin_kg_h":0,"n_minus_1_can_carry":null,"warnings":[],"tanks":[],` +
		`"result":null}`
	if string(b) != want {
		t.Errorf("got  %s\nwant %s", b, want)
	}
}

func TestConversions(t *testing.T) {
	t.Parallel()
	// Exact by the definitions of the units: 1 h = 3600 s, 1 d = 86 400 s,
	// 1 t = 1000 kg, 1 kW = 1000 W.
	for _, c := range []struct {
		what      string
		got, want float64
	}{
		{"1 kg/s in kg/h", KgPerH(1), 3600},
		{"1 kg/s in t/day", TPerDay(1), 86.4},
		{"2500 W in kW", KW(2500), 2.5},
		{"1 kg/s for 10 h in t", Tonnes(1, 10), 36},
	} {
		if math.Abs(c.got-c.want) > 1e-12*c.want {
			t.Errorf("%s = %.17g, want %g", c.what, c.got, c.want)
		}
	}
}
