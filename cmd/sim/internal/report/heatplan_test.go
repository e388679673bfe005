package report

import (
	"bytes"
	"context"
	"encoding/json"
	"strings"
	"testing"

	"steamcase/plant"
	"steamcase/plant/fuel"
	"steamcase/plant/heatplan"
	"steamcase/plant/loads"
	"steamcase/plant/profile"
)

// heatingRun plans one heated tank on the two-boiler plant over eight
// rows of 12 h to 55 °C through the discharge, and one it cannot reach
// (100 °C at the end) (invented figures).
func heatingRun(t testing.TB) Run {
	p := twoBoilers(t, "Invented Heated Ship")
	f, err := fuel.Grade("HSFO")
	must(t, err)
	cg, err := loads.CargoFromFuel(f)
	must(t, err)
	m := &plant.TankHeating{Tank: loads.TankHeating{Cargo: cg, CargoVolume: 6000, To: 323.15, Coil: loads.Coil{Area: 300},
		Boundaries: []loads.Boundary{{Name: "deck", Area: 900, U: 4.5, Beyond: loads.Air}, {Name: "shell", Area: 1600, U: 3.5, Beyond: loads.Sea}}}}
	c := plant.NewModelConsumer(m)
	c.Base = plant.Base{Name: "COT 1"}
	c.SubCooling, c.ReturnFraction = 10, 0.95
	must(t, p.Add(c))
	p.Connect("to COT 1", plant.Pos{}, "main", "out", "COT 1", "in")
	p.Connect("COT 1 return", plant.Pos{}, "COT 1", "out", "hotwell", "in")
	var rows []profile.Row
	var src []string
	for i := range 8 {
		ph := "passage"
		if i >= 6 {
			ph = "discharge"
		}
		rows = append(rows, profile.Row{Phase: ph, Hours: 12, Case: plant.Case{Name: ph, Pos: plant.Pos{File: "route.csv", Line: i + 2},
			Conditions: plant.Conditions{SeaT: 280.15 - float64(i)/2, AirT: 273.15 - float64(i)},
			Set:        []plant.Setting{{Unit: "cargo heating", Param: "off", Value: 1}}}})
		src = append(src, "route.csv:"+string(rune('2'+i)))
	}
	tanks := []heatplan.Tank{{Unit: "COT 1", StartT: 318.15, NeverBelow: 308.15}}
	ok, err := heatplan.Plan(context.Background(), p, rows, tanks,
		[]heatplan.Requirement{{Tank: "COT 1", T: 328.15, Phase: "discharge", Label: "discharge", Pos: plant.Pos{File: "plan.lua", Line: 3}}}, heatplan.Options{})
	must(t, err)
	far, err := heatplan.Plan(context.Background(), p, rows, tanks,
		[]heatplan.Requirement{{Tank: "COT 1", T: 373.15, At: 96 * 3600, Label: "end", Pos: plant.Pos{File: "plan.lua", Line: 9}}}, heatplan.Options{})
	must(t, err)
	job := func(name string, line int) Job {
		return Job{Name: name, Plant: p.Name, Source: "plan.lua:" + string(rune('0'+line)), Rows: src}
	}
	return Run{Version: "test", HeatingPlans: []HeatingPlan{{Job: job("to 55 C", 3), Result: ok}, {Job: job("to 100 C", 9), Result: far}}}
}

// TestHeatingPlanReport pins the heating plan's table and CSV (golden
// files, rewritten with -update) and checks what they must say: the
// caution, the saving, the verdict of the miss; the CSV's three tables,
// a line per row and tank; the JSON's heating_plans.
func TestHeatingPlanReport(t *testing.T) {
	t.Parallel()
	run := heatingRun(t)
	var tb bytes.Buffer
	must(t, Table(&tb, run))
	if want := golden(t, "table_heatplan.golden", tb.Bytes()); !bytes.Equal(tb.Bytes(), want) {
		t.Errorf("table differs from testdata/table_heatplan.golden:\n%s", tb.String())
	}
	text := tb.String()
	for _, s := range []string{"Heating plan: to 55 C", "the charter party's heating instructions, the cargo's safety data sheet and the master's judgment govern",
		"hold the required T from the start", "heat at the last moment", "required 55.0 °C at discharge: met",
		"required 100.0 °C at end: MISSED", "needs ", "MW more coil", Caution} {
		if !strings.Contains(text, s) {
			t.Errorf("table lacks %q", s)
		}
	}
	var cb bytes.Buffer
	must(t, CSV(&cb, run))
	if want := golden(t, "csv_heatplan.golden", cb.Bytes()); !bytes.Equal(cb.Bytes(), want) {
		t.Errorf("CSV differs from testdata/csv_heatplan.golden:\n%s", cb.String())
	}
	order, tables := readTables(t, cb.String())
	if strings.Join(order, "|") != "cases|heating plan summary|heating plan required|heating plan rows" {
		t.Errorf("CSV tables %q", order)
	}
	if n := len(tables[TablePlanRows]) - 1; n != 2*8 {
		t.Errorf("%d plan rows, want 16 (two plans, eight rows, one tank)", n)
	}
	if n := len(tables[TablePlanSummary]) - 1; n != 6 {
		t.Errorf("%d summary lines, want 6", n)
	}
	var jb bytes.Buffer
	must(t, JSON(&jb, run))
	var doc struct {
		HeatingPlans []struct {
			Name    string `json:"name"`
			Caution string `json:"caution"`
			Tanks   []struct {
				Required []struct {
					Met     bool   `json:"met"`
					Verdict string `json:"verdict"`
				} `json:"required"`
				Rows []struct {
					Instruction string `json:"instruction"`
				} `json:"rows"`
			} `json:"tanks"`
		} `json:"heating_plans"`
	}
	must(t, json.Unmarshal(jb.Bytes(), &doc))
	if len(doc.HeatingPlans) != 2 || !doc.HeatingPlans[0].Tanks[0].Required[0].Met || doc.HeatingPlans[1].Tanks[0].Required[0].Met ||
		!strings.Contains(doc.HeatingPlans[1].Tanks[0].Required[0].Verdict, "COT 1 reaches") || len(doc.HeatingPlans[0].Tanks[0].Rows) != 8 {
		t.Errorf("JSON heating plans: %d, first %+v", len(doc.HeatingPlans), doc.HeatingPlans[0].Tanks[0].Required)
	}
}

// TestPlotHeatingPlan draws the plan's chart in both formats and refuses
// a plan without rows.
func TestPlotHeatingPlan(t *testing.T) {
	t.Parallel()
	run := heatingRun(t)
	charts := Charts(run)
	if len(charts) != 2 || charts[0].Kind != "heating-plan" || charts[1].N != 2 {
		t.Fatalf("charts %+v", charts)
	}
	for _, f := range []string{SVG, PNG} {
		var b bytes.Buffer
		must(t, charts[0].Draw(&b, f))
		if b.Len() < 1000 {
			t.Errorf("%s chart of %d bytes", f, b.Len())
		}
	}
	var b bytes.Buffer
	must(t, charts[0].Draw(&b, SVG))
	for _, s := range []string{"COT 1", "required temperature", "boiler steam under the plan", "cargo temperature"} {
		if !strings.Contains(b.String(), s) {
			t.Errorf("SVG lacks %q", s)
		}
	}
	if err := PlotHeatingPlan(&b, SVG, HeatingPlan{Job: Job{Name: "empty"}, Result: &heatplan.Result{}}); err == nil {
		t.Error("a plan without rows was drawn")
	}
}
