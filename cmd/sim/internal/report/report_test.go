package report

import (
	"bytes"
	"context"
	"encoding/csv"
	"encoding/json"
	"flag"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"steamcase/plant"
	"steamcase/plant/schema"
)

var update = flag.Bool("update", false, "rewrite the golden files in testdata/")

const bar = 1e5

// gauge converts bar(g) to Pa absolute at the standard atmosphere
// (101325 Pa, exact by definition).
func gauge(b float64) float64 { return b*bar + 101325 }

func must(t testing.TB, err error) {
	t.Helper()
	if err != nil {
		t.Fatal(err)
	}
}

// twoBoilers is an invented plant: two 10 t/h oil-fired boilers at
// 7 bar(g) on one header, a heating consumer with 95 % return and a sundry
// consumer that loses its condensate (the plant package's test plant).
func twoBoilers(t testing.TB, name string) *plant.Plant {
	p := plant.New(name, plant.Options{UsableFraction: 0.85})
	fuel := plant.FuelSpec{Name: "HFO", LHV: 40.2e6, CO2Factor: 3.114}
	eta := &plant.EfficiencyTable{Load: []float64{0.25, 0.5, 0.75, 1.0}, Eta: []float64{0.80, 0.84, 0.85, 0.845}}
	must(t, p.Add(&plant.MakeUp{Base: plant.Base{Name: "makeup"}, T: 288.15}))
	must(t, p.Add(&plant.FeedTank{Base: plant.Base{Name: "hotwell"}, HeatLoss: 5e3}))
	must(t, p.Add(&plant.FeedPump{Base: plant.Base{Name: "fp"}, Boilers: []string{"AB1", "AB2"}, Margin: 3 * bar, Eta: 0.45}))
	must(t, p.Add(&plant.Header{Base: plant.Base{Name: "feed header"}}))
	for _, b := range []string{"AB1", "AB2"} {
		must(t, p.Add(&plant.Boiler{Base: plant.Base{Name: b}, MCR: 10000.0 / 3600, DrumP: gauge(7), Turndown: 4,
			Blowdown: 0.01, Dryness: 0.98, Efficiency: eta, Fuel: fuel}))
	}
	must(t, p.Add(&plant.Header{Base: plant.Base{Name: "main"}, HeatLoss: 10e3}))
	must(t, p.Add(&plant.Consumer{Base: plant.Base{Name: "cargo heating"}, Duty: 2e6, SubCooling: 10, ReturnFraction: 0.95}))
	must(t, p.Add(&plant.Consumer{Base: plant.Base{Name: "sundry"}, SteamFlow: 0.1}))
	p.Connect("makeup", plant.Pos{}, "makeup", "out", "hotwell", "in")
	p.Connect("suction", plant.Pos{}, "hotwell", "out", "fp", "in")
	p.Connect("discharge", plant.Pos{}, "fp", "out", "feed header", "in")
	p.Connect("feed1", plant.Pos{}, "feed header", "out", "AB1", "feed")
	p.Connect("feed2", plant.Pos{}, "feed header", "out", "AB2", "feed")
	p.Connect("steam1", plant.Pos{}, "AB1", "steam", "main", "in")
	p.Connect("steam2", plant.Pos{}, "AB2", "steam", "main", "in")
	p.Connect("to heating", plant.Pos{}, "main", "out", "cargo heating", "in")
	p.Connect("to sundry", plant.Pos{}, "main", "out", "sundry", "in")
	p.Connect("heating return", plant.Pos{}, "cargo heating", "out", "hotwell", "in")
	return p
}

// demoCases solves four cases on the two-boiler plant: a light port load
// (one boiler cycling), a heavy load (both firing), one beyond both
// boilers' MCR, and one with the firing forced.
func demoCases(t testing.TB) []Case {
	p := twoBoilers(t, "Invented Test Tanker")
	cond := func(seaC, airC, engine float64) plant.Conditions {
		return plant.Conditions{SeaT: seaC + 273.15, AirT: airC + 273.15, EngineLoad: engine}
	}
	specs := []plant.Case{
		{Name: "port stay", Pos: plant.Pos{File: "demo.lua", Line: 12}, Conditions: cond(12, 5, 0),
			Set: []plant.Setting{{Unit: "cargo heating", Param: "duty", Value: 300e3}}},
		{Name: "cargo heating", Pos: plant.Pos{File: "demo.lua", Line: 17}, Conditions: cond(8, -2, 0.3),
			Set: []plant.Setting{{Unit: "cargo heating", Param: "duty", Value: 7e6}}},
		{Name: "too much", Pos: plant.Pos{File: "demo.lua", Line: 21}, Conditions: cond(8, -2, 0.3),
			Set: []plant.Setting{{Unit: "cargo heating", Param: "duty", Value: 14e6}}},
		{Name: "one boiler forced", Pos: plant.Pos{File: "demo.lua", Line: 25}, Conditions: cond(25, 30, 0.85),
			Fire: []string{"AB2"}},
	}
	var out []Case
	for _, c := range specs {
		cr, err := p.Solve(context.Background(), c)
		must(t, err)
		out = append(out, Case{Plant: p.Name, Result: cr})
	}
	return out
}

// egeCases solves three cases on an invented plant with an exhaust-gas
// economiser beside one oil-fired boiler (the plant package's EGE test
// plant, with the indicative engine of docs/reference/plant-checks.md §7 [C]): at sea the
// economiser and the boiler share the demand, on a light demand the
// economiser's surplus goes to the dump condenser, in port it is out of
// service. The engine's table holds as given (no site correction), as the
// sheet's check takes it.
func egeCases(t testing.TB) []Case {
	p := egePlant(t)
	var out []Case
	for _, c := range []plant.Case{
		{Name: "at sea", Conditions: plant.Conditions{SeaT: 288.15, AirT: 288.15, EngineLoad: 1}},
		{Name: "at sea, light load", Conditions: plant.Conditions{SeaT: 288.15, AirT: 288.15, EngineLoad: 1},
			Set: []plant.Setting{{Unit: "heating", Param: "steam", Value: 500.0 / 3600}}},
		{Name: "in port", Conditions: plant.Conditions{SeaT: 288.15, AirT: 288.15}},
	} {
		cr, err := p.Solve(context.Background(), c)
		must(t, err)
		out = append(out, Case{Plant: p.Name, Result: cr})
	}
	return out
}

// egePlant is the plant of egeCases.
func egePlant(t testing.TB) *plant.Plant {
	p := plant.New("Invented EGE Ship", plant.Options{})
	drum := gauge(7)
	engine := plant.EngineExhaust{MCR: 15e6, Load: []float64{0.3, 1}, Specific: []float64{8.5 / 3.6e6, 8.5 / 3.6e6}, T: []float64{513.15, 513.15}}
	must(t, p.Add(&plant.MakeUp{Base: plant.Base{Name: "makeup"}, T: 333.15, P: 1e5}))
	must(t, p.Add(&plant.FeedTank{Base: plant.Base{Name: "hotwell"}, P: 1e5}))
	must(t, p.Add(&plant.Header{Base: plant.Base{Name: "feed header"}}))
	must(t, p.Add(&plant.ExhaustGasEconomiser{Base: plant.Base{Name: "EGE"}, Engine: engine, DrumP: drum,
		DesignLoad: 1, DesignPinch: 15, GasCp: 1060, Ambient: plant.AmbientAsGiven}))
	must(t, p.Add(&plant.Boiler{Base: plant.Base{Name: "AB1"}, MCR: 10000.0 / 3600, DrumP: drum,
		Efficiency: &plant.EfficiencyTable{Load: []float64{0.25, 1.1}, Eta: []float64{0.85, 0.85}},
		Fuel:       plant.FuelSpec{Name: "HFO", LHV: 40.2e6, CO2Factor: 3.114}}))
	must(t, p.Add(&plant.Header{Base: plant.Base{Name: "main"}}))
	must(t, p.Add(&plant.Consumer{Base: plant.Base{Name: "heating"}, SteamFlow: 5000.0 / 3600}))
	must(t, p.Add(&plant.Condenser{Base: plant.Base{Name: "dump"}, Dump: true}))
	p.Connect("mu", plant.Pos{}, "makeup", "out", "hotwell", "in")
	p.Connect("feed", plant.Pos{}, "hotwell", "out", "feed header", "in")
	p.Connect("ege feed", plant.Pos{}, "feed header", "out", "EGE", "feed")
	p.Connect("boiler feed", plant.Pos{}, "feed header", "out", "AB1", "feed")
	p.Connect("ege steam", plant.Pos{}, "EGE", "steam", "main", "in")
	p.Connect("boiler steam", plant.Pos{}, "AB1", "steam", "main", "in")
	p.Connect("to heating", plant.Pos{}, "main", "out", "heating", "in")
	p.Connect("to dump", plant.Pos{}, "main", "out", "dump", "in")
	p.Connect("dump return", plant.Pos{}, "dump", "out", "hotwell", "in")
	return p
}

func golden(t *testing.T, name string, got []byte) []byte {
	t.Helper()
	path := filepath.Join("testdata", name)
	if *update {
		must(t, os.WriteFile(path, got, 0o644))
		return got
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("%v (run with -update to create it)", err)
	}
	return want
}

// TestGolden pins the layout and number formats of the table, the JSON
// and the CSV. The figures come from the plant package, whose balances
// are checked in its own tests. Rewrite with: go test ./cmd/sim/internal/report -update
func TestGolden(t *testing.T) {
	cases := demoCases(t)
	for _, f := range []struct {
		file   string
		render func(*bytes.Buffer) error
	}{
		{"table.golden", func(b *bytes.Buffer) error { return Table(b, Run{Cases: cases}) }},
		{"json.golden", func(b *bytes.Buffer) error { return JSON(b, Run{Cases: cases}) }},
		{"csv.golden", func(b *bytes.Buffer) error { return CSV(b, Run{Cases: cases}) }},
		{"table_empty.golden", func(b *bytes.Buffer) error { return Table(b, Run{Cases: nil}) }},
		{"table_ege.golden", func(b *bytes.Buffer) error { return Table(b, Run{Cases: egeCases(t)}) }},
	} {
		var b bytes.Buffer
		must(t, f.render(&b))
		want := golden(t, f.file, b.Bytes())
		if strings.HasPrefix(f.file, "json") {
			if err := sameJSON(b.String(), string(want)); err != nil {
				t.Errorf("%s differs: %v (rewrite with -update if the change is meant)", f.file, err)
			}
			continue
		}
		if !bytes.Equal(b.Bytes(), want) {
			t.Errorf("%s differs:\n--- got\n%s\n--- want\n%s", f.file, b.String(), want)
		}
	}
}

// TestCasesCoverTheStates makes sure the golden cases show what the report
// must say: a cycling boiler, two boilers firing, a case the plant cannot
// carry and a forced firing.
func TestCasesCoverTheStates(t *testing.T) {
	cases := demoCases(t)
	r := func(i int) *plant.CaseResult { return cases[i].Result }
	if r(0).BoilersFiring != 1 || !r(0).Boilers[0].Cycling {
		t.Errorf("port stay: %d firing, AB1 cycling %v; want one boiler cycling", r(0).BoilersFiring, r(0).Boilers[0].Cycling)
	}
	if r(1).BoilersFiring != 2 || !r(1).CanCarry {
		t.Errorf("cargo heating: %d firing, can carry %v; want both firing and carrying", r(1).BoilersFiring, r(1).CanCarry)
	}
	if r(2).CanCarry || r(2).ShortfallKgS <= 0 {
		t.Errorf("too much: can carry %v, shortfall %g; want a shortfall", r(2).CanCarry, r(2).ShortfallKgS)
	}
	if !r(3).Forced || r(3).Boilers[0].Firing || !r(3).Boilers[1].Firing {
		t.Errorf("one boiler forced: forced %v, firing %v %v", r(3).Forced, r(3).Boilers[0].Firing, r(3).Boilers[1].Firing)
	}
	var b bytes.Buffer
	must(t, Table(&b, Run{Cases: cases}))
	out := b.String()
	for _, s := range []string{
		"Load case 1 of 4: port stay", `plant "Invented Test Tanker", solved at demo.lua:12`,
		"sea 12.0 °C, air 5.0 °C, main engine load 0.0 %", "cycling, on ", "2 of 2 firing",
		"CANNOT CARRY the demand: short by", "1 of 2 firing (chosen by the case)",
		"margin before the next boiler must fire", "margin to the MCR of all boilers",
		"header drains", "blowdown", "make-up", "t/day", "electrical load", "feed tank", "balance closure",
		Caution,
	} {
		if !strings.Contains(out, s) {
			t.Errorf("the table does not say %q", s)
		}
	}
	if strings.Contains(out, "NaN") || strings.Contains(out, "Inf") {
		t.Errorf("the table shows a non-finite number")
	}
	quiet := *cases[3].Result
	quiet.Warnings = nil
	quiet.Consumers = append([]plant.ConsumerResult(nil), quiet.Consumers...)
	quiet.Consumers[0].DrainCoolerW = 12345 // W: shown as 12.3 kW
	quiet.Consumers[0].DrainCoolerTo = "feed"
	b.Reset()
	must(t, Table(&b, Run{Cases: []Case{{Plant: "x", Result: &quiet}}}))
	if !strings.Contains(b.String(), "duty; drain cooler 12.3 kW to the feed\n") {
		t.Errorf("the drain cooler's heat is not shown:\n%s", b.String())
	}
	if !strings.Contains(b.String(), "\n  warnings: none\n") {
		t.Errorf("a case without warnings does not say so:\n%s", b.String())
	}
	if strings.Contains(out, " \n") {
		t.Errorf("the table has trailing spaces")
	}
	if !strings.HasSuffix(out, Caution+"\n") {
		t.Errorf("the table does not end with the caution")
	}
}

// TestCSV reads the CSV back and checks each figure against the result it
// came from, in the units the header names (1 kg/s = 3600 kg/h and
// 1 t/day = 1000 kg / 86400 s, exact by definition; °C = K − 273.15,
// exact by the Celsius definition), to the decimals written.
func TestCSV(t *testing.T) {
	cases := demoCases(t)
	var b bytes.Buffer
	must(t, CSV(&b, Run{Cases: cases}))
	rows, err := csv.NewReader(&b).ReadAll()
	must(t, err)
	if len(rows) != len(cases)+1 {
		t.Fatalf("%d rows, want a header and %d cases", len(rows), len(cases))
	}
	col := map[string]int{}
	for i, h := range rows[0] {
		col[h] = i
	}
	for i, c := range cases {
		r, row := c.Result, rows[i+1]
		num := func(key string, want, tol float64) {
			t.Helper()
			got, err := strconv.ParseFloat(row[col[key]], 64)
			if err != nil || got < want-tol || got > want+tol {
				t.Errorf("case %q: %s = %q, want %.6g ± %g", r.Name, key, row[col[key]], want, tol)
			}
		}
		if row[col["table"]] != TableCases || row[col["case"]] != r.Name || row[col["plant"]] != c.Plant {
			t.Errorf("row %d names %q on %q", i+1, row[col["case"]], row[col["plant"]])
		}
		num("sea_T_C", r.Conditions.SeaT-273.15, 0.05)
		num("air_T_C", r.Conditions.AirT-273.15, 0.05)
		num("engine_load_pct", r.Conditions.EngineLoad*100, 0.05)
		num("boilers_firing", float64(r.BoilersFiring), 0)
		num("shortfall_kg_h", r.ShortfallKgS*3600, 0.05)
		num("steam_demand_kg_h", r.SteamDemandKgS*3600, 0.05)
		num("steam_production_kg_h", r.SteamProductionKgS*3600, 0.05)
		num("fuel_kg_h", r.FuelKgS*3600, 0.05)
		num("fuel_t_per_day", r.FuelKgS*86400/1000, 0.0005)
		num("co2_t_per_day", r.CO2KgS*86400/1000, 0.005)
		num("makeup_kg_h", r.MakeUpKgS*3600, 0.05)
		num("electric_kW", r.ElectricW/1000, 0.05)
		num("margin_kg_h", r.MarginNextKgS*3600, 0.05)
		num("warnings", float64(len(r.Warnings)), 0)
		if row[col["can_carry"]] != strconv.FormatBool(r.CanCarry) {
			t.Errorf("case %q: can_carry %q", r.Name, row[col["can_carry"]])
		}
	}
}

// TestJSONDocument decodes the JSON strictly and checks the envelope: the
// schema's version, the program's, the caution, the plants as a list, the
// checks, and that each case is its schema form.
func TestJSONDocument(t *testing.T) {
	cases := demoCases(t)
	decode := func(run Run) map[string]json.RawMessage {
		var b bytes.Buffer
		must(t, JSON(&b, run))
		var doc map[string]json.RawMessage
		must(t, json.Unmarshal(b.Bytes(), &doc))
		var strict schema.Document
		dec := json.NewDecoder(bytes.NewReader(b.Bytes()))
		dec.DisallowUnknownFields()
		must(t, dec.Decode(&strict))
		return doc
	}
	compact := func(raw json.RawMessage) string {
		var b bytes.Buffer
		must(t, json.Compact(&b, raw))
		return b.String()
	}
	doc := decode(Run{Cases: cases, Version: "v9.9.9-test",
		Checks: schema.Checks{Passed: 4, Failed: []schema.CheckFailure{{Pos: "demo.lua:30", Message: "two boilers carry it"}}}})
	if string(doc["schema"]) != strconv.Itoa(schema.Version) {
		t.Errorf("schema %s, want %d", doc["schema"], schema.Version)
	}
	if string(doc["version"]) != `"v9.9.9-test"` {
		t.Errorf("version %s", doc["version"])
	}
	if got := compact(doc["plant"]); got != `[{"name":"Invented Test Tanker"}]` {
		t.Errorf("plant %s", got)
	}
	if got := compact(doc["checks"]); got != `{"passed":4,"failed":[{"pos":"demo.lua:30","message":"two boilers carry it"}]}` {
		t.Errorf("checks %s", got)
	}
	var caution string
	must(t, json.Unmarshal(doc["caution"], &caution))
	if caution != Caution {
		t.Errorf("caution %q", caution)
	}
	var got []json.RawMessage
	must(t, json.Unmarshal(doc["cases"], &got))
	for i, c := range cases {
		want, _ := json.Marshal(schema.NewCase(c.Plant, c.Result))
		if compact(got[i]) != string(want) {
			t.Errorf("case %d is not its schema form:\n%s\n%s", i, compact(got[i]), want)
		}
	}

	// Cases on two plants: both listed, in order.
	other := twoBoilers(t, "Invented Second Ship")
	cr, err := other.Solve(context.Background(), plant.Case{Name: "alone"})
	must(t, err)
	doc = decode(Run{Cases: append(cases[:1:1], Case{Plant: other.Name, Result: cr})})
	if got := compact(doc["plant"]); got != `[{"name":"Invented Test Tanker"},{"name":"Invented Second Ship"}]` {
		t.Errorf("two plants: plant %s", got)
	}
	// No case: empty lists, not null; no check failed.
	doc = decode(Run{})
	if string(doc["cases"]) != "[]" || string(doc["plant"]) != "[]" || compact(doc["checks"]) != `{"passed":0,"failed":[]}` {
		t.Errorf("no case: cases %s plant %s checks %s", doc["cases"], doc["plant"], doc["checks"])
	}
}

// TestNotGiven: a case without sea or air temperature shows them as not
// given in every form: null in the JSON, an empty cell in the CSV, "not
// given" in the table; never as -273.1 °C or 0 K.
func TestNotGiven(t *testing.T) {
	p := twoBoilers(t, "Invented Test Tanker")
	cr, err := p.Solve(context.Background(), plant.Case{Name: "no weather", Conditions: plant.Conditions{AirT: 278.15}})
	must(t, err)
	run := Run{Cases: []Case{{Plant: p.Name, Result: cr}}}
	var b bytes.Buffer
	must(t, JSON(&b, run))
	if !strings.Contains(b.String(), `"sea_T_K": null,`) || !strings.Contains(b.String(), `"air_T_K": 278.15,`) {
		t.Errorf("JSON: %.600s", b.String())
	}
	b.Reset()
	must(t, Table(&b, run))
	if !strings.Contains(b.String(), "conditions: sea not given, air 5.0 °C, main engine load 0.0 %") {
		t.Errorf("table: %.400s", b.String())
	}
	b.Reset()
	must(t, CSV(&b, run))
	rows, err := csv.NewReader(&b).ReadAll()
	must(t, err)
	if rows[0][3] != "sea_T_C" || rows[1][3] != "" || rows[1][4] != "5.0" {
		t.Errorf("CSV: %q", rows)
	}
	for _, s := range []string{"-273.1", "-273.2"} {
		if strings.Contains(b.String(), s) {
			t.Errorf("%s in the output", s)
		}
	}
}

// TestPlot writes the chart in both formats; the bytes are not compared
// (they depend on the plotting library's version), only that a real file
// of the right kind comes out with the case names in it.
func TestPlot(t *testing.T) {
	cases := demoCases(t)
	var svg bytes.Buffer
	must(t, Plot(&svg, SVG, cases))
	s := svg.String()
	if !strings.HasPrefix(strings.TrimSpace(s), "<?xml") || !strings.Contains(s, "<svg") {
		t.Fatalf("not an SVG: %.80q", s)
	}
	for _, want := range []string{"port stay", "cargo heating", "too much", "one boiler forced",
		"steam, kg/h", "MCR of all boilers", "MCR of the boilers firing", "sundry", "header drains"} {
		if !strings.Contains(s, want) {
			t.Errorf("the SVG does not contain %q", want)
		}
	}
	var png bytes.Buffer
	must(t, Plot(&png, PNG, cases))
	if !bytes.HasPrefix(png.Bytes(), []byte("\x89PNG\r\n\x1a\n")) || png.Len() < 1000 {
		t.Errorf("not a PNG of any size: %d bytes", png.Len())
	}
	svg.Reset()
	must(t, Plot(&svg, SVG, egeCases(t)))
	if !strings.Contains(svg.String(), "steam from exhaust-gas economisers") {
		t.Error("the chart of a plant with an economiser does not show its steam")
	}
	if err := Plot(&png, "pdf", cases); err == nil {
		t.Error("format pdf accepted")
	}
	if err := Plot(&png, SVG, nil); err == nil {
		t.Error("a chart of no case drawn")
	}
}

func TestFormatOf(t *testing.T) {
	for _, c := range []struct{ name, want string }{
		{"out.svg", SVG}, {"dir/x.PNG", PNG}, {"a.b.svg", SVG}, {"plot.pdf", ""}, {"plot", ""}, {"svg", ""},
	} {
		got, err := FormatOf(c.name)
		if got != c.want || (err == nil) != (c.want != "") {
			t.Errorf("FormatOf(%q) = %q, %v; want %q", c.name, got, err, c.want)
		}
	}
}

// TestFill checks that the bar colours do not repeat over three rounds of
// the palette.
func TestFill(t *testing.T) {
	seen := map[[3]uint8]int{}
	for i := range 3 * len(palette) {
		c := fill(i)
		k := [3]uint8{c.R, c.G, c.B}
		if j, ok := seen[k]; ok {
			t.Errorf("fill(%d) = fill(%d) = %v", i, j, c)
		}
		seen[k] = i
	}
}

func TestFix(t *testing.T) {
	for _, c := range []struct {
		v    float64
		dec  int
		want string
	}{
		{1.25, 1, "1.2"}, {-0.04, 1, "0.0"}, {-0.06, 1, "-0.1"}, {12345.678, 0, "12346"}, {-1e-12, 3, "0.000"},
	} {
		if got := fix(c.v, c.dec); got != c.want {
			t.Errorf("fix(%g, %d) = %q, want %q", c.v, c.dec, got, c.want)
		}
	}
}

// noiseKeys are the figures that measure solver noise; their last digits
// move with any change to the solver, so the golden compare asks only that
// both stay below 1e-9.
var noiseKeys = map[string]bool{"residual_norm": true, "mass_rel": true, "energy_rel": true}

// solverKeys depend on the solver's path, not on the answer: the golden
// compare skips them.
var solverKeys = map[string]bool{"iterations": true}

// sameJSON checks that every value of the golden text is in the output:
// objects may gain keys (the schema allows new keys without a version
// change, schema.Version), but no key may go missing or change its
// value. Strings, booleans and nulls must be equal, lists of the same
// length, and numbers equal to 1e-9 relative (they are rounded to six
// digits by schema.Round); the solver keys are skipped and the noise keys
// need only both be below 1e-9.
func sameJSON(got, want string) error {
	decode := func(s string) (any, error) {
		d := json.NewDecoder(strings.NewReader(s))
		d.UseNumber()
		var v any
		err := d.Decode(&v)
		return v, err
	}
	g, err := decode(got)
	if err != nil {
		return fmt.Errorf("output: %v", err)
	}
	w, err := decode(want)
	if err != nil {
		return fmt.Errorf("golden: %v", err)
	}
	return contains(g, w, "$")
}

func contains(g, w any, path string) error {
	switch w := w.(type) {
	case map[string]any:
		gm, ok := g.(map[string]any)
		if !ok {
			return fmt.Errorf("%s: %T, want an object", path, g)
		}
		for k, wv := range w {
			gv, ok := gm[k]
			if !ok {
				return fmt.Errorf("%s: key %q missing", path, k)
			}
			if solverKeys[k] {
				continue
			}
			if noiseKeys[k] {
				a, _ := gv.(json.Number).Float64()
				b, _ := wv.(json.Number).Float64()
				if math.Abs(a) < 1e-9 && math.Abs(b) < 1e-9 {
					continue
				}
			}
			if err := contains(gv, wv, path+"."+k); err != nil {
				return err
			}
		}
	case []any:
		gl, ok := g.([]any)
		if !ok || len(gl) != len(w) {
			return fmt.Errorf("%s: %v, want a list of %d", path, g, len(w))
		}
		for i := range w {
			if err := contains(gl[i], w[i], fmt.Sprintf("%s[%d]", path, i)); err != nil {
				return err
			}
		}
	case json.Number:
		gn, ok := g.(json.Number)
		if !ok {
			return fmt.Errorf("%s: %v, want the number %s", path, g, w)
		}
		a, _ := gn.Float64()
		b, _ := w.Float64()
		if math.Abs(a-b) > 1e-9*math.Max(math.Abs(a), math.Abs(b)) {
			return fmt.Errorf("%s: %s, want %s", path, gn, w)
		}
	default:
		if g != w {
			return fmt.Errorf("%s: %v, want %v", path, g, w)
		}
	}
	return nil
}

// TestEGETable checks the economiser's rows: its steam among the
// producers, the dumped surplus, and the fuel it saves. The saving at the
// design point is docs/reference/plant-checks.md §7 [C]: 215.6 kg/h = 5.175 t/d against a
// boiler at η 0.85 on LCV 40 200 kJ/kg.
func TestEGETable(t *testing.T) {
	var b bytes.Buffer
	must(t, Table(&b, Run{Cases: egeCases(t)}))
	out := b.String()
	for _, s := range []string{
		"EGE                      exhaust-gas economiser",
		"fuel saved by EGE  215.6 kg/h   5.175 t/day", // docs/reference/plant-checks.md §7 [C]
		"dump                     dumped                      2634.1",
		"margin with no boiler firing (steam dumped)",
		"not in service",
	} {
		if !strings.Contains(out, s) {
			t.Errorf("the table does not say %q", s)
		}
	}
}

// TestRunRecord: the table ends with the run's record and the JSON holds
// it: the program's version, the files read with their SHA-256, the
// scripts' seed and the defaults in force with their sources.
func TestRunRecord(t *testing.T) {
	t.Parallel()
	run := Run{Cases: demoCases(t)[:1], Version: "1.2.3", LuaSeed: 42,
		Files: []File{{Name: "ship.lua", Bytes: 10, SHA256: strings.Repeat("ab", 32)}},
		Assumptions: []Assumption{{Plant: "Invented Test Tanker", Assumption: plant.Assumption{Unit: "fp", Kind: "feed pump",
			Key: "eta", Label: "pump efficiency", Value: "45 %", Source: "docs/reference/plant-checks.md §9 [M]"}},
			{Plant: "Invented Test Tanker", Assumption: plant.Assumption{Unit: "AB1", Kind: "oil-fired boiler",
				Key: "cycling_loss", Label: "cycling loss", Value: "0 %"}}}}
	var b bytes.Buffer
	must(t, Table(&b, run))
	for _, s := range []string{"Run record\n  program: steamcase 1.2.3\n  files read (SHA-256):\n    ship.lua  10 bytes  " + strings.Repeat("ab", 32),
		"scripts' math.random seed: 42", `    plant "Invented Test Tanker":`,
		"      fp.eta (feed pump) pump efficiency: 45 %; docs/reference/plant-checks.md §9 [M]",
		"      AB1.cycling_loss (oil-fired boiler) cycling loss: 0 %; no source recorded in the key registry\n\n" + Caution} {
		if !strings.Contains(b.String(), s) {
			t.Errorf("the table does not say %q", s)
		}
	}
	doc := Document(run)
	if doc.Version != "1.2.3" || doc.LuaSeed != 42 || len(doc.FilesRead) != 1 || doc.FilesRead[0].SHA256 != strings.Repeat("ab", 32) ||
		len(doc.Assumptions) != 2 || doc.Assumptions[0].Source != "docs/reference/plant-checks.md §9 [M]" || doc.Assumptions[1].Source != "" {
		t.Errorf("document record: %+v %+v %+v", doc.Version, doc.FilesRead, doc.Assumptions)
	}
}

// TestSeriesTable: cases a script groups in one series are one table of
// the report, a row per case with its own label, instead of a block each
// (issue 16); the figures are the cases' own.
func TestSeriesTable(t *testing.T) {
	t.Parallel()
	cases := demoCases(t)
	for i := range cases {
		r := *cases[i].Result
		r.Series, r.Name = "sweep", "audit"
		cases[i].Result = &r
	}
	var b bytes.Buffer
	must(t, Table(&b, Run{Cases: cases}))
	out := b.String()
	if strings.Contains(out, "Load case 1 of") || !strings.Contains(out, fmt.Sprintf("Load cases 1 to %d of %d: series \"sweep\", %d cases", len(cases), len(cases), len(cases))) {
		t.Errorf("the series is not one table:\n%s", out)
	}
	for i := range cases {
		if !strings.Contains(out, fmt.Sprintf("audit %d", i+1)) {
			t.Errorf("row %d is not labelled apart:\n%s", i+1, out)
		}
		if !strings.Contains(out, fix(cases[i].Result.FuelKgS*kgh, 1)) {
			t.Errorf("row %d's fuel is not in the table", i+1)
		}
	}
}
