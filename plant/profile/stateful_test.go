package profile

import (
	"context"
	"math"
	"strings"
	"testing"

	"steamcase/plant"
	"steamcase/plant/fuel"
	"steamcase/plant/loads"
)

// heatedTanker is the invented tanker of tanker() with two cargo tanks of
// HSFO heated by steam coils instead of a fixed cargo-heating duty
// (invented figures of realistic size, docs/reference/plant-checks.md §6 [M]).
func heatedTanker(t testing.TB) *plant.Plant {
	p := tanker(t)
	f, err := fuel.Grade("HSFO")
	must(t, err)
	cg, err := loads.CargoFromFuel(f)
	must(t, err)
	for _, name := range []string{"COT 1", "COT 2"} {
		m := &plant.TankHeating{Tank: loads.TankHeating{Cargo: cg, CargoVolume: 9000,
			Boundaries: []loads.Boundary{
				{Name: "deck", Area: 1400, U: 4.5, Beyond: loads.Air},
				{Name: "shell", Area: 2600, U: 3.5, Beyond: loads.Sea},
			},
			Mode: loads.Hold, To: 323.15, Coil: loads.Coil{Area: 700}}}
		c := plant.NewModelConsumer(m)
		c.Base = plant.Base{Name: name}
		c.SubCooling, c.ReturnFraction, c.ReturnT = 10, 0.98, 353.15
		must(t, p.Add(c))
		p.Connect("to "+name, plant.Pos{}, "main", "out", name, "in")
		p.Connect(name+" return", plant.Pos{}, name, "out", "hotwell", "in")
	}
	return p
}

// heatedRows is a winter passage of rows of several lengths, with
// instructions for the two tanks (invented).
func heatedRows() []Row {
	set := func(unit, key string, v float64) plant.Setting {
		return plant.Setting{Unit: unit, Param: key, Value: v, Pos: plant.Pos{File: "route.csv", Line: 2}}
	}
	instr := func(unit string, i loads.Instruction) plant.Setting { return set(unit, "instruction", float64(i)) }
	var rows []Row
	add := func(h, sea, air float64, s ...plant.Setting) {
		rows = append(rows, Row{Phase: "passage", Hours: h, Case: plant.Case{Name: "passage",
			Conditions: plant.Conditions{SeaT: sea + 273.15, AirT: air + 273.15, EngineLoad: 0.7},
			Set:        append([]plant.Setting{set("cargo heating", "off", 1)}, s...)}})
	}
	add(12, 10, 4, instr("COT 1", loads.HeatOff), instr("COT 2", loads.HeatOff))
	add(24, 8, 0, instr("COT 1", loads.HeatOff), instr("COT 2", loads.HoldTemp))
	add(6, 7, -2, instr("COT 1", loads.HeatTo), set("COT 1", "T", 330.15), instr("COT 2", loads.HeatOff))
	add(18, 6, -4, instr("COT 1", loads.HeatTo), set("COT 1", "T", 330.15),
		instr("COT 2", loads.ReachBy), set("COT 2", "T", 326.15), set("COT 2", "by", 120*3600))
	add(36, 5, -6, instr("COT 1", loads.HoldTemp), instr("COT 2", loads.ReachBy), set("COT 2", "T", 326.15), set("COT 2", "by", 120*3600))
	add(24, 6, -3, instr("COT 1", loads.HoldTemp), set("COT 1", "T", 328.15),
		instr("COT 2", loads.ReachBy), set("COT 2", "T", 326.15), set("COT 2", "by", 120*3600))
	add(6, 7, 0, set("COT 1", "off", 1), instr("COT 2", loads.HoldTemp))
	return rows
}

var heatedStarts = []TankStart{{Unit: "COT 1", T: 318.15}, {Unit: "COT 2", T: 320.15}}

// TestStatefulVoyageEnergy solves a voyage whose two tanks carry their
// temperature from row to row and checks: each row starts where the last
// ended; over the voyage Σ coil heat − Σ losses = Σ m·∫c dT of the cargo
// (Cragoe's closed form, docs/reference/plant-checks.md §5.3 [S✓ publication, formula
// from memory]) to 1e-6 relative; the plant's solved consumer duty is the
// tank's mean coil duty; a reach is on its temperature at its time.
func TestStatefulVoyageEnergy(t *testing.T) {
	t.Parallel()
	p := heatedTanker(t)
	rows := heatedRows()
	res, err := Run(context.Background(), p, rows, Options{Tanks: heatedStarts, KeepResults: true})
	must(t, err)
	if p.Stateful() {
		t.Error("the plant's tanks are still stateful after the voyage")
	}
	sg := 985 / fuel.WaterDensity60F
	for k, start := range heatedStarts {
		T := start.T
		var coil, loss, stored, scale float64
		for i, row := range res.Rows {
			tr := row.Summary.Tanks[k]
			if tr.Name != start.Unit {
				t.Fatalf("row %d tank %d is %q", i+1, k, tr.Name)
			}
			if tr.T0 != T {
				t.Errorf("%s row %d starts at %.9g K, the last ended at %.9g K", tr.Name, i+1, tr.T0, T)
			}
			h, err := fuel.CragoeHeat(sg, tr.T0, tr.T1)
			must(t, err)
			coil += tr.CoilJ
			loss += tr.LossJ
			stored += tr.Mass * h
			scale += math.Abs(tr.CoilJ) + math.Abs(tr.LossJ)
			T = tr.T1
			for _, c := range row.Result.Consumers {
				if c.Name == tr.Name && math.Abs(c.DutyW-tr.DutyW) > 1e-6*math.Max(tr.DutyW, 1e3) {
					t.Errorf("%s row %d: solved duty %.9g W, the tank's mean duty %.9g W", tr.Name, i+1, c.DutyW, tr.DutyW)
				}
			}
		}
		if e := math.Abs(coil-loss-stored) / scale; e > 1e-6 {
			t.Errorf("%s: coil %.6g J − losses %.6g J = %.6g J, stored %.6g J (%.1e relative)", start.Unit, coil, loss, coil-loss, stored, e)
		}
	}
	// COT 2 reaches 53 °C at 120 h: the end of row 6.
	if got := res.Rows[5].Summary.Tanks[1].T1; math.Abs(got-326.15) > 1e-6 {
		t.Errorf("COT 2 at 120 h: %.9g K, want 326.15 K", got)
	}
	// Row 7: COT 1's consumer is off, its cargo cools.
	if r := res.Rows[6].Summary.Tanks[0]; r.Instruction != "off" || r.CoilJ != 0 || !(r.T1 < r.T0) {
		t.Errorf("COT 1 off in row 7: %+v", r)
	}
	// Worker-independent: a study of the same rows (one variant, twice)
	// gives the same totals on clones in parallel.
	st, err := Study(context.Background(), p, rows, []Variant{{Name: "a"}, {Name: "b"}}, Economics{}, Options{Tanks: heatedStarts, Workers: 2})
	must(t, err)
	for _, v := range st.Variants {
		if v.Totals.FuelT != res.Total.FuelT {
			t.Errorf("study variant %q: fuel %.9g t, the voyage's %.9g t", v.Name, v.Totals.FuelT, res.Total.FuelT)
		}
	}
}

// TestStatefulErrors checks the refusals, each with the row's position.
func TestStatefulErrors(t *testing.T) {
	t.Parallel()
	p := heatedTanker(t)
	rows := heatedRows()
	ctx := context.Background()
	for _, tc := range []struct {
		name string
		run  func() error
		want string
	}{
		{"instruction without stateful tanks", func() error { _, err := Run(ctx, p, rows, Options{}); return err },
			`route.csv:2: voyage row 1 sets COT 1.instruction, but "COT 1" is not carried from row to row in this voyage`},
		{"unknown tank", func() error {
			_, err := Run(ctx, p, rows, Options{Tanks: []TankStart{{Unit: "COT 1", T: 300}, {Unit: "COT 2", T: 300}, {Unit: "COT 9", T: 300, Pos: plant.Pos{File: "plan.lua", Line: 7}}}})
			return err
		}, `plan.lua:7: the plant has no unit "COT 9"`},
		{"not a tank", func() error {
			_, err := Run(ctx, p, rows, Options{Tanks: []TankStart{{Unit: "COT 1", T: 300}, {Unit: "COT 2", T: 300}, {Unit: "sundry", T: 300}}})
			return err
		}, `"sundry" is a heat consumer, not a tank_heating unit`},
		{"by past the end", func() error {
			r := append([]Row(nil), rows...)
			r[0].Case.Set = append(append([]plant.Setting(nil), r[0].Case.Set...),
				plant.Setting{Unit: "COT 2", Param: "by", Value: 500 * 3600, Pos: plant.Pos{File: "route.csv", Line: 2}})
			_, err := Run(ctx, p, r, Options{Tanks: heatedStarts})
			return err
		}, "route.csv:2: voyage row 1: COT 2.by 500 h is past the end of the voyage at 126 h"},
		{"audit", func() error {
			_, err := Audit(ctx, p, AuditSpec{Days: []Day{{Date: "d1", Hours: 24, Case: rows[0].Case}}}, AuditOptions{Samples: 10})
			return err
		}, "a tank's instruction belongs to a voyage"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			err := tc.run()
			if err == nil || !strings.Contains(err.Error(), tc.want) {
				t.Errorf("error %v, want %q", err, tc.want)
			}
		})
	}
	if p.Stateful() {
		t.Error("a failed run left the tanks stateful")
	}
}

// TestCaseCappedByCoil: in a plain load case, a tank with a coil that is
// asked a heat-up faster than the coil gives takes the coil's capacity
// U·A·(Ts − T) (the default U, 60 W/(m²·K), 700 m², steam at 7 bar(g):
// 170.48 °C, docs/reference/plant-checks.md §0 [C]) at the heat-up's mean temperature,
// and the case warns.
func TestCaseCappedByCoil(t *testing.T) {
	t.Parallel()
	p := heatedTanker(t)
	c := plant.Case{Name: "fast heat-up", Conditions: plant.Conditions{SeaT: 280.15, AirT: 273.15},
		Set: []plant.Setting{{Unit: "cargo heating", Param: "off", Value: 1},
			{Unit: "COT 1", Param: "mode", Value: float64(loads.HeatUp)}, {Unit: "COT 1", Param: "from", Value: 303.15},
			{Unit: "COT 1", Param: "to", Value: 323.15}, {Unit: "COT 1", Param: "duration", Value: 12 * 3600}}}
	cr, err := p.Solve(context.Background(), c)
	must(t, err)
	want := 60 * 700 * (170.48 - 40.0)
	for _, u := range cr.Consumers {
		if u.Name == "COT 1" && math.Abs(u.DutyW-want) > 2e-4*want {
			t.Errorf("COT 1 duty %.6g W, the coil's capacity %.6g W", u.DutyW, want)
		}
	}
	if !strings.Contains(strings.Join(cr.Warnings, "\n"), `tank heating "COT 1": the heat-up asks`) {
		t.Errorf("warnings %q", cr.Warnings)
	}
}
