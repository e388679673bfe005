package heatplan

import (
	"context"
	"fmt"
	"math"
	"sort"
	"strings"

	"steamcase/plant"
	"steamcase/plant/loads"
	"steamcase/plant/profile"
	"steamcase/plant/water"
)

// Tank is a tank_heating unit whose heating the plan decides: its cargo's
// temperature at the voyage's start and, optionally, a temperature it
// must never fall below (pumpability, the cloud point of a waxy cargo:
// loads.CloudPointHM40).
type Tank struct {
	Unit       string
	StartT     float64 // K
	NeverBelow float64 // K; zero: none
	Pos        plant.Pos
}

// Requirement is a temperature a tank must have: at a time (At, s from
// the voyage's start, a row boundary), or through a phase (Phase: from
// the start of its first row to the end of its last). Label says it as
// given ("discharge", "240 h", "end").
type Requirement struct {
	Tank  string
	T     float64 // K
	At    float64 // s; with Phase empty
	Phase string
	Label string
	Pos   plant.Pos
}

// Options control the plan. The zero value plans on a 0.25 K grid with
// 3 K of headroom, the method chosen by size, on all cores.
type Options struct {
	// Grid is the step of the tanks' temperature grid (K); zero means
	// 0.25 K.
	Grid float64
	// Headroom is how far above the highest temperature it must have (or
	// its start) a tank's grid reaches (K); zero means 3 K.
	Headroom float64
	// Method is "joint" (one programme over the joint state of every
	// tank), "descent" (coordinate descent, each tank's programme in turn
	// with the others held) or "" (joint where the joint state is small
	// enough, see JointBudget; descent otherwise).
	Method string
	// JointBudget bounds the work of the joint programme in the automatic
	// choice: rows × Π(grid states) × Π(mean controls); zero means 2e7.
	JointBudget float64
	// MaxSweeps bounds the coordinate descent's sweeps; zero means 20.
	MaxSweeps int
	// Workers is the number of goroutines the fuel curves are solved on;
	// zero means 1. The result does not depend on it.
	Workers int
}

func (o *Options) defaults() {
	if o.Grid <= 0 {
		o.Grid = 0.25
	}
	if o.Headroom <= 0 {
		o.Headroom = 3
	}
	if o.JointBudget <= 0 {
		o.JointBudget = 2e7
	}
	if o.MaxSweeps <= 0 {
		o.MaxSweeps = 20
	}
	if o.Workers <= 0 {
		o.Workers = 1
	}
}

// Result is a heating plan and what it is compared with.
type Result struct {
	// Method is "joint" or "descent"; Sweeps the descent's sweeps.
	Method string
	Sweeps int
	// Grid is the temperature step (K); Solves the plant solves of the
	// fuel curves.
	Grid   float64
	Solves int
	// Rows are the voyage's rows with what the plan asks of the boilers.
	Rows []RowPlan
	// Tanks are the planned tanks, in the order given.
	Tanks []TankPlan
	// Plan is the least-fuel plan; Hold holds every tank at its highest
	// required temperature from the start to its last required time;
	// LastMoment waits (off, or at the never-below temperature) and heats
	// each tank at the coil's capacity from the latest start that still
	// meets each required temperature, then holds it to its last
	// required time. Each is solved as a voyage with its instructions.
	Plan, Hold, LastMoment Outcome
	// Binding lists every row where a limit binds in the plan.
	Binding []Binding
	// Warnings are the plan's cautions (not the rows' own).
	Warnings []string
}

// RowPlan is one row of the voyage under the plan.
type RowPlan struct {
	Index int
	Phase string
	Hours float64
	// StartH is the row's start, hours from the voyage's start.
	StartH float64
	// DutyW is the planned tanks' total mean duty; CapacityW the most the
	// row's boilers carry for them (W).
	DutyW, CapacityW float64
}

// TankPlan is one tank's plan: an instruction per row and its
// temperatures, and its required temperatures with how the plan meets
// them.
type TankPlan struct {
	Unit       string
	StartT     float64
	NeverBelow float64
	Rows       []TankRowPlan
	Required   []RequiredResult
}

// TankRowPlan is a tank's instruction over one row: Instruction is "off",
// "hold" (at T), "heat_to" (T, at the coil's capacity) or "reach" (T by
// the row's end, at DutyW); T0 and T1 the temperatures at the row's start
// and end (K), DutyW the coil's mean duty, CoilBinds that the coil gives
// its capacity.
type TankRowPlan struct {
	Instruction string
	T           float64
	ByS         float64 // reach: the row's end, from the voyage's start (s)
	T0, T1      float64
	DutyW       float64
	CoilBinds   bool
}

// RequiredResult is a required temperature and the plan's answer.
type RequiredResult struct {
	Requirement
	// Reached is the lowest temperature the plan has where the
	// requirement holds (K); Met whether it is at least T (within
	// 0.01 K).
	Reached float64
	Met     bool
	// LatestStartH is the latest start of a heat-up at the coil's
	// capacity (after waiting with the heating off, or at the never-below
	// temperature) that still meets the requirement, hours from the
	// voyage's start, and its row (from 0); −1 when even heating from the
	// first row does not meet it.
	LatestStartH   float64
	LatestStartRow int
	// Verdict says, when the plan misses, by how much and what it would
	// take: "COT 3 reaches 54.2 °C at discharge; 57.0 °C needs 21 h more
	// heating or 0.9 MW more coil".
	Verdict string
}

// Outcome is a plan solved as a voyage.
type Outcome struct {
	// FuelT and CO2T are the voyage's boiler fuel and CO2 (t), from the
	// plant solved row by row with the plan's instructions; TableFuelT
	// the fuel the plan was chosen by (the rows' fuel curves).
	FuelT, CO2T, TableFuelT float64
	// ShortRows are rows the boilers cannot carry (from 0); Missed the
	// required temperatures it misses (texts).
	ShortRows []int
	Missed    []string
	// Voyage is the voyage solved with the plan's instructions (its rows
	// keep their summaries, not their full case results).
	Voyage *profile.Result
	// Rows are the plan's rows as voyage settings (instruction, T, by of
	// each tank), so that a voyage() can follow it.
	Rows []profile.Row
}

// Binding is a row where a limit binds: the coil's capacity ("coil"),
// the boilers' capacity ("boilers"), or a never-below temperature
// ("never below").
type Binding struct {
	Row  int
	Tank string // "" for the boilers
	What string
}

// SavingT returns the plan's fuel saved against o (t).
func (r *Result) SavingT(o Outcome) float64 { return o.FuelT - r.Plan.FuelT }

// Plan finds, for each tank, the instructions per row that meet every
// required temperature with the least boiler fuel over the voyage given
// by rows, within the coils' capacities, the boilers' capacity in each
// row and the never-below temperatures; see the package documentation
// for the method. A plan that cannot meet a requirement is returned with
// the best it can do and a verdict; an error is bad input.
func Plan(ctx context.Context, p *plant.Plant, rows []profile.Row, tanks []Tank, reqs []Requirement, opt Options) (*Result, error) {
	opt.defaults()
	if err := profile.Validate(rows); err != nil {
		return nil, err
	}
	if len(tanks) == 0 {
		return nil, fmt.Errorf("a heating plan needs at least one tank")
	}
	if err := p.Check(); err != nil {
		return nil, err
	}
	if opt.Method != "" && opt.Method != "joint" && opt.Method != "descent" {
		return nil, fmt.Errorf("method %q is not \"joint\" or \"descent\"", opt.Method)
	}
	nr := len(rows)
	bound := make([]float64, nr+1) // s from the start
	for i, r := range rows {
		bound[i+1] = bound[i] + r.Hours*3600
	}
	names := make([]string, len(tanks))
	byName := map[string]int{}
	if err := checkTanks(p, rows, tanks, names, byName); err != nil {
		return nil, err
	}
	reqAt := make([][]int, len(reqs)) // boundaries each holds at
	if err := requiredAt(rows, reqs, bound, names, byName, reqAt); err != nil {
		return nil, err
	}

	// The tanks' models, periods and grids.
	dps := make([]*tankDP, len(tanks))
	ltanks := make([]*loads.TankHeating, len(tanks))
	steamT := make([]float64, len(tanks))
	for i, t := range tanks {
		var err error
		if dps[i], ltanks[i], steamT[i], err = tankModel(p, rows, t); err != nil {
			return nil, err
		}
	}
	for k, q := range reqs {
		d := dps[byName[q.Tank]]
		for _, b := range reqAt[k] {
			d.req[b] = math.Max(d.req[b], q.T)
		}
	}
	for i, d := range dps {
		if err := d.grid(opt.Grid, opt.Headroom, false); err != nil {
			return nil, profile.Errorf(tanks[i].Pos, "tank %q: %w", d.name, err)
		}
	}

	// The rows' fuel against the planned duty, and the programme.
	curves, solves, err := fuelCurves(ctx, p, rows, names, dps, opt.Workers)
	if err != nil {
		return nil, err
	}
	pb := &problem{rows: nr, dt: make([]float64, nr), fuel: curves, tanks: dps}
	for r, row := range rows {
		pb.dt[r] = row.Hours * 3600
		if curves[r].Cap < 0 {
			return nil, profile.Errorf(row.Case.Pos, "row %d (%q): the plant cannot carry the row even with the planned tanks' heating off", r+1, row.Case.Name)
		}
	}
	for _, d := range dps {
		d.precompute(nr, false)
	}
	res := &Result{Grid: opt.Grid, Solves: solves}
	plans := pb.solve(opt, res)
	tableFuel, _, _ := pb.cost(plans)

	// The plan's rows, instructions and limits.
	res.addRows(rows, plans, bound, curves)
	res.addTanks(rows, tanks, plans, bound)
	sort.SliceStable(res.Binding, func(a, b int) bool { return res.Binding[a].Row < res.Binding[b].Row })

	// The plan and the naive plans as voyages.
	latest, err := res.replayAll(ctx, p, rows, tanks, pb, reqs, reqAt)
	if err != nil {
		return nil, err
	}
	res.Plan.TableFuelT = tableFuel / 1000

	// The requirements: met, the latest start, the verdict.
	for k, q := range reqs {
		i := byName[q.Tank]
		res.addRequired(pb, dps[i], ltanks[i], steamT[i], rows, q, i, reqAt[k], latest[k], bound)
	}
	if e := math.Abs(res.Plan.TableFuelT - res.Plan.FuelT); e > 0.005*res.Plan.FuelT {
		res.Warnings = append(res.Warnings, fmt.Sprintf(
			"the fuel curves the plan was chosen by give %.3f t, the plant solved row by row %.3f t: the plan may not be the least-fuel one by as much", res.Plan.TableFuelT, res.Plan.FuelT))
	}
	return res, nil
}

// checkTanks checks the planned tanks (each once, a tank_heating unit
// with a coil and a plausible start and never-below temperature), filling
// names and byName, and that no row sets what the plan decides for them.
func checkTanks(p *plant.Plant, rows []profile.Row, tanks []Tank, names []string, byName map[string]int) error {
	for i, t := range tanks {
		at := t.Pos
		if _, dup := byName[t.Unit]; dup {
			return profile.Errorf(at, "tank %q is given twice", t.Unit)
		}
		byName[t.Unit] = i
		names[i] = t.Unit
		// StartTank checks the unit, its coil and the temperature.
		pc := p.Clone()
		if err := pc.StartTank(t.Unit, t.StartT); err != nil {
			return profile.Errorf(at, "%w", err)
		}
		if t.NeverBelow != 0 && !(t.NeverBelow >= loads.MinTemperature && t.NeverBelow <= loads.MaxTemperature) {
			return profile.Errorf(at, "tank %q: never-below temperature %.6g K is not plausible", t.Unit, t.NeverBelow)
		}
	}
	for i, r := range rows {
		for _, s := range r.Case.Set {
			if _, ok := byName[s.Unit]; ok && (s.Param == "instruction" || s.Param == "T" || s.Param == "by" || s.Param == "mode" ||
				s.Param == "from" || s.Param == "to" || s.Param == "duration" || s.Param == "factor") {
				return profile.Errorf(rowPos(s, r), "row %d sets %s.%s, but the plan decides %q's heating: leave it out of the rows",
					i+1, s.Unit, s.Param, s.Unit)
			}
		}
	}
	return nil
}

// requiredAt checks the requirements (a tank of the plan, a plausible
// temperature, a phase of the voyage or a time at a row boundary) and
// sets reqAt[k] to the boundaries requirement k holds at: the start and
// end of each row of its phase, or the boundary at its time. bound are
// the boundaries' times from the start (s).
func requiredAt(rows []profile.Row, reqs []Requirement, bound []float64, names []string, byName map[string]int, reqAt [][]int) error {
	nr := len(rows)
	for k, q := range reqs {
		at := q.Pos
		if _, ok := byName[q.Tank]; !ok {
			return profile.Errorf(at, "required temperature for %q, which is not a tank of the plan (tanks: %s)", q.Tank, strings.Join(names, ", "))
		}
		if !(q.T >= loads.MinTemperature && q.T <= loads.MaxTemperature) {
			return profile.Errorf(at, "required temperature of %q %.6g K is not plausible", q.Tank, q.T)
		}
		if q.Phase != "" {
			for i, r := range rows {
				if r.Phase == q.Phase {
					if len(reqAt[k]) == 0 || reqAt[k][len(reqAt[k])-1] != i {
						reqAt[k] = append(reqAt[k], i)
					}
					reqAt[k] = append(reqAt[k], i+1)
				}
			}
			if len(reqAt[k]) == 0 {
				return profile.Errorf(at, "required at phase %q, but no row of the voyage has that phase (phases: %s)", q.Phase, strings.Join(phases(rows), ", "))
			}
			continue
		}
		total := bound[nr]
		if q.At > total*(1+1e-12)+1e-6 || q.At < 0 {
			return profile.Errorf(at, "required time %s (%.6g h) is past the end of the voyage at %.6g h", q.Label, q.At/3600, total/3600)
		}
		b := sort.Search(nr+1, func(i int) bool { return bound[i] >= q.At-1e-6 })
		if b > nr || math.Abs(bound[b]-q.At) > 1e-6 {
			return profile.Errorf(at, "required time %s (%.6g h) falls inside row %d (%.6g h to %.6g h); give the time of a row's start or end, or a phase", q.Label, q.At/3600, b, bound[b-1]/3600, bound[b]/3600)
		}
		reqAt[k] = []int{b}
	}
	return nil
}

// tankModel returns tank t as the programme sees it (its heat-loss
// periods of the rows and the rows its coil may heat in), its cargo model
// and the saturation temperature of the steam at its coil (K).
func tankModel(p *plant.Plant, rows []profile.Row, t Tank) (*tankDP, *loads.TankHeating, float64, error) {
	m := p.Component(t.Unit).(*plant.Consumer).Model.(*plant.TankHeating)
	lt := m.Tank
	lt.Name = t.Unit
	lt.Boundaries = append([]loads.Boundary(nil), m.Tank.Boundaries...)
	sp := m.CoilP
	if sp == 0 {
		var err error
		if sp, err = p.SupplyPressure(t.Unit); err != nil {
			return nil, nil, 0, profile.Errorf(t.Pos, "tank %q: %w", t.Unit, err)
		}
	}
	ts, err := water.Tsat(sp)
	if err != nil {
		return nil, nil, 0, profile.Errorf(t.Pos, "tank %q: steam at its coil: %w", t.Unit, err)
	}
	nr := len(rows)
	d := &tankDP{name: t.Unit, start: t.StartT, floor: t.NeverBelow, periods: make([]loads.Period, nr),
		heat: make([]bool, nr), req: make([]float64, nr+1)}
	for r, row := range rows {
		amb := loads.Ambient{Sea: row.Case.Conditions.SeaT, Air: row.Case.Conditions.AirT}
		if (m.UsesSea() && amb.Sea <= 0) || (m.UsesAir() && amb.Air <= 0) {
			return nil, nil, 0, profile.Errorf(row.Case.Pos, "row %d: tank %q loses heat to the sea and air: the row needs its sea and air temperatures", r+1, t.Unit)
		}
		pd, err := lt.Period(row.Hours*3600, amb, ts)
		if err != nil {
			return nil, nil, 0, profile.Errorf(row.Case.Pos, "row %d: %w", r+1, err)
		}
		d.periods[r] = pd
		d.heat[r] = !rowSetsOff(row, t.Unit, p)
	}
	return d, &lt, ts, nil
}

// fuelCurves solves each row's fuel against the planned tanks' duty, up
// to the most their coils take from the lowest temperature of their grids
// in the rows they may heat in, and returns the curves and the solves.
func fuelCurves(ctx context.Context, p *plant.Plant, rows []profile.Row, names []string, dps []*tankDP, workers int) ([]FuelCurve, int, error) {
	nr := len(rows)
	active := make([][]bool, nr)
	qmax := make([]float64, nr)
	for r := range rows {
		active[r] = make([]bool, len(dps))
		for i, d := range dps {
			active[r][i] = d.heat[r]
			if d.heat[r] {
				qmax[r] += d.periods[r].Capacity(d.lowT(), d.lowT())
			}
		}
	}
	return tabulate(ctx, p, rows, names, active, qmax, workers)
}

// solve chooses the method (the joint programme where its work and
// memory are small enough, else the descent, unless opt names one), runs
// it and records it in res.
func (pb *problem) solve(opt Options, res *Result) []plan {
	method := opt.Method
	if method == "" {
		method = "descent"
		if work := pb.jointWork(); len(pb.tanks) <= 3 && work <= opt.JointBudget && pb.jointMemory() <= 5e7 {
			method = "joint"
		}
	}
	var plans []plan
	if method == "joint" {
		plans = pb.joint()
	} else {
		plans, res.Sweeps = pb.descend(opt.MaxSweeps)
	}
	res.Method = method
	return plans
}

// addRows adds the voyage's rows under the plans: the tanks' mean duty
// against the boilers' capacity for them, and the rows where the boilers'
// capacity binds.
func (res *Result) addRows(rows []profile.Row, plans []plan, bound []float64, curves []FuelCurve) {
	for r, row := range rows {
		rp := RowPlan{Index: r, Phase: row.Phase, Hours: row.Hours, StartH: bound[r] / 3600, CapacityW: curves[r].Cap}
		for _, pl := range plans {
			rp.DutyW += pl.c[r].Q
		}
		res.Rows = append(res.Rows, rp)
		if rp.DutyW > 0 && rp.DutyW >= 0.995*curves[r].Cap {
			res.Binding = append(res.Binding, Binding{Row: r, What: "boilers"})
		}
	}
}

// addTanks adds each tank's plan: its instruction and temperatures in
// each row, and the rows where its coil or its never-below temperature
// binds.
func (res *Result) addTanks(rows []profile.Row, tanks []Tank, plans []plan, bound []float64) {
	for i, t := range tanks {
		tp := TankPlan{Unit: t.Unit, StartT: t.StartT, NeverBelow: t.NeverBelow}
		for r := range rows {
			c := plans[i].c[r]
			tr := TankRowPlan{T0: plans[i].T[r], T1: c.T1, DutyW: c.Q}
			switch c.kind {
			case ctrlOff:
				tr.Instruction = "off"
			case ctrlHold:
				tr.Instruction, tr.T = "hold", c.T1
			case ctrlFull:
				tr.Instruction, tr.T, tr.CoilBinds = "heat_to", c.T1, true
				res.Binding = append(res.Binding, Binding{Row: r, Tank: t.Unit, What: "coil"})
			default:
				tr.Instruction, tr.T, tr.ByS = "reach", c.T1, bound[r+1]
			}
			if t.NeverBelow > 0 && c.T1 <= t.NeverBelow+0.01 && c.kind != ctrlOff {
				res.Binding = append(res.Binding, Binding{Row: r, Tank: t.Unit, What: "never below"})
			}
			tp.Rows = append(tp.Rows, tr)
		}
		res.Tanks = append(res.Tanks, tp)
	}
}

// replayAll solves the plan and the naive plans (hold, last moment) as
// voyages with their instructions, with the naive plans' fuel by the
// rows' fuel curves, and returns the latest start of each requirement's
// heat-up (naive).
func (res *Result) replayAll(ctx context.Context, p *plant.Plant, rows []profile.Row, tanks []Tank, pb *problem, reqs []Requirement, reqAt [][]int) ([]int, error) {
	starts := make([]profile.TankStart, len(tanks))
	for i, t := range tanks {
		starts[i] = profile.TankStart{Unit: t.Unit, T: t.StartT, Pos: t.Pos}
	}
	planRows := withInstructions(rows, res.Tanks)
	var err error
	res.Plan, err = replay(ctx, p, planRows, starts)
	if err != nil {
		return nil, fmt.Errorf("the plan solved as a voyage: %w", err)
	}
	hold, last, latest := naive(pb, reqs, reqAt)
	res.Hold, err = replay(ctx, p, withInstructions(rows, hold), starts)
	if err != nil {
		return nil, fmt.Errorf("the plan holding the required temperatures, solved as a voyage: %w", err)
	}
	res.LastMoment, err = replay(ctx, p, withInstructions(rows, last), starts)
	if err != nil {
		return nil, fmt.Errorf("the plan heating at the last moment, solved as a voyage: %w", err)
	}
	for _, o := range []*Outcome{&res.Hold, &res.LastMoment} {
		var ts []TankPlan
		if o == &res.Hold {
			ts = hold
		} else {
			ts = last
		}
		f, _, _ := pb.cost(toPlans(ts))
		o.TableFuelT = f / 1000
	}
	return latest, nil
}

// addRequired adds requirement q of tank i (at the boundaries at, its
// heat-up's latest start row latest) to the tank's plan: the lowest
// temperature the plan has there, whether it is met and, when not, the
// verdict; and the naive plans' misses of it.
func (res *Result) addRequired(pb *problem, d *tankDP, lt *loads.TankHeating, ts float64, rows []profile.Row, q Requirement, i int, at []int, latest int, bound []float64) {
	rr := RequiredResult{Requirement: q, Reached: math.Inf(1), LatestStartRow: latest}
	if latest >= 0 {
		rr.LatestStartH = bound[latest] / 3600
	} else {
		rr.LatestStartH = -1
	}
	worst := at[0]
	for _, b := range at {
		T := res.tankT(i, b)
		if T < rr.Reached {
			rr.Reached, worst = T, b
		}
	}
	rr.Met = rr.Reached >= q.T-0.01
	if !rr.Met {
		rr.Verdict = verdict(pb, d, lt, ts, rows, q, worst, rr.Reached)
		res.Plan.Missed = append(res.Plan.Missed, rr.Verdict)
	}
	res.Tanks[i].Required = append(res.Tanks[i].Required, rr)
	for _, o := range []*Outcome{&res.Hold, &res.LastMoment} {
		low := math.Inf(1)
		for _, b := range at {
			low = math.Min(low, outcomeT(o, i, b, q.Tank))
		}
		if low < q.T-0.01 {
			o.Missed = append(o.Missed, fmt.Sprintf("%s reaches %.1f °C at %s; %.1f °C is required", q.Tank, low-273.15, q.Label, q.T-273.15))
		}
	}
}

// tankT is tank i's planned temperature at boundary b.
func (r *Result) tankT(i, b int) float64 {
	t := r.Tanks[i]
	if b == 0 {
		return t.StartT
	}
	return t.Rows[b-1].T1
}

// outcomeT is a tank's temperature at boundary b in a voyage solved.
func outcomeT(o *Outcome, i, b int, name string) float64 {
	if o.Voyage == nil || len(o.Voyage.Rows) == 0 {
		return math.NaN()
	}
	row := b - 1
	first := false
	if b == 0 {
		row, first = 0, true
	}
	for _, tr := range o.Voyage.Rows[row].Summary.Tanks {
		if tr.Name == name {
			if first {
				return tr.T0
			}
			return tr.T1
		}
	}
	return math.NaN()
}

// grid sets the tank's temperature grid, boundary by boundary: steps of
// step kelvin, from below the lowest the cargo can fall to (its cool-down
// with the heating off all the voyage, or its never-below temperature) to
// headroom above the highest it must have. Unless flat, the grid of each
// boundary is shifted so that the tank's frontier there is a grid point:
// the lowest temperature from which the coil, at its capacity, still meets
// every requirement ahead (found backwards from them through the exact
// full-coil step). The value of a state just below the frontier is then
// never interpolated with one above it, which with the steep cost of a
// miss would make the plan start heating early. A requirement the coil
// cannot meet even heating from the first row is lowered, for the
// programme, to what that heating reaches (the plan then reports the
// miss); so is a never-below temperature.
func (d *tankDP) grid(step, headroom float64, flat bool) error {
	rows := len(d.periods)
	coast := make([]float64, rows+1) // heating off all the way
	full := make([]float64, rows+1)  // coil at its capacity all the way
	coast[0], full[0] = d.start, d.start
	for r := range d.periods {
		coast[r+1] = d.periods[r].Off(coast[r])
		if d.heat[r] {
			full[r+1], _ = d.periods[r].Full(full[r])
		} else {
			full[r+1] = d.periods[r].Off(full[r])
		}
		if math.IsNaN(coast[r+1]) || math.IsNaN(full[r+1]) {
			return fmt.Errorf("row %d: the cargo leaves its specific heat correlation's range", r+1)
		}
	}
	high := d.start
	for b, q := range d.req {
		if q > 0 {
			high = math.Max(high, q)
			d.req[b] = math.Min(q, full[b])
		}
	}
	if d.floor > 0 {
		high = math.Max(high, d.floor)
	}
	high += headroom
	floorAt := func(b int) float64 {
		if d.floor > 0 && b > 0 {
			return math.Min(d.floor, full[b])
		}
		return 0
	}
	// The frontier, backwards.
	front := make([]float64, rows+1)
	front[rows] = math.Max(d.req[rows], floorAt(rows))
	for b := rows - 1; b >= 0; b-- {
		f := 0.0
		if next := front[b+1]; next > 0 {
			f = d.inverse(b, next)
		}
		front[b] = math.Max(f, math.Max(d.req[b], floorAt(b)))
	}
	d.dT = step
	d.base = make([]float64, rows+1)
	anchor := d.start
	for _, q := range d.req {
		if q > 0 {
			anchor = math.Max(anchor, q)
		}
	}
	// The shift: the frontier, or where the cargo is lowest with the
	// heating off all the way when that is higher (below it no state is
	// reachable; below the frontier none meets what lies ahead, so one
	// grid step below the shift suffices).
	for b := range d.base {
		shift := anchor
		if !flat {
			shift = math.Max(front[b], coast[b])
		}
		d.base[b] = shift
	}
	// z = T − shift at each boundary: from the lowest below to the highest.
	zlo, zhi := -step, 0.0
	for b := range d.base {
		if flat {
			low := math.Min(coast[b], d.start)
			if f := floorAt(b); f > 0 {
				low = math.Min(low, f)
			}
			low = math.Max(low, 253.15+step)
			zlo = math.Min(zlo, low-step-d.base[b])
		}
		zhi = math.Max(zhi, high-d.base[b])
	}
	zlo = -step * math.Ceil(-zlo/step-1e-9)
	d.n = int(math.Floor((zhi-zlo)/step+1e-9)) + 1
	if d.n < 2 {
		d.n = 2
	}
	if d.n > 20000 {
		return fmt.Errorf("the grid of %d temperatures at %.3g K is too fine", d.n, step)
	}
	for b := range d.base {
		d.base[b] += zlo
	}
	return nil
}

// lowT returns the lowest temperature of the tank's grids.
func (d *tankDP) lowT() float64 {
	lo := math.Inf(1)
	for _, b := range d.base {
		lo = math.Min(lo, b)
	}
	return lo
}

// inverse returns the temperature at boundary b from which row b ends at
// T1 with the coil at its capacity (or, in a row it may not heat, with
// the heating off): the full-coil step is increasing in its start, so by
// bisection, to 1e-10 K.
func (d *tankDP) inverse(b int, T1 float64) float64 {
	p := &d.periods[b]
	step := func(T0 float64) float64 {
		if d.heat[b] {
			T, _ := p.Full(T0)
			return T
		}
		return p.Off(T0)
	}
	lo, hi := math.Max(T1-150, 253.2), math.Min(T1+150, 520)
	if v := step(lo); !(v < T1) {
		return lo
	}
	if v := step(hi); !(v >= T1) {
		return hi
	}
	for hi-lo > 1e-10 {
		mid := 0.5 * (lo + hi)
		if v := step(mid); v >= T1 {
			hi = mid
		} else {
			lo = mid
		}
	}
	return hi
}

// jointWork estimates the joint programme's work: rows × Π n × Π mean
// controls.
func (pb *problem) jointWork() float64 {
	w := float64(pb.rows)
	for _, t := range pb.tanks {
		n := 0
		for r := range pb.rows {
			n += len(t.ctrls[r])
		}
		w *= float64(t.n) * math.Max(1, float64(n)/float64(pb.rows*t.n))
	}
	return w
}

// jointMemory is the number of values the joint programme keeps.
func (pb *problem) jointMemory() float64 {
	m := float64(pb.rows + 1)
	for _, t := range pb.tanks {
		m *= float64(t.n)
	}
	return m
}

// toPlans turns tank plans back into the DP's plans (for their cost by
// the fuel curves).
func toPlans(ts []TankPlan) []plan {
	out := make([]plan, len(ts))
	for i, t := range ts {
		out[i] = plan{c: make([]ctrl, len(t.Rows)), T: make([]float64, len(t.Rows)+1)}
		out[i].T[0] = t.StartT
		for r, tr := range t.Rows {
			out[i].c[r] = ctrl{T1: tr.T1, Q: tr.DutyW}
			out[i].T[r+1] = tr.T1
		}
	}
	return out
}

// withInstructions returns the rows with each tank's instruction.
func withInstructions(rows []profile.Row, tanks []TankPlan) []profile.Row {
	out := make([]profile.Row, len(rows))
	for r, row := range rows {
		c := row.Case
		c.Set = append([]plant.Setting(nil), row.Case.Set...)
		for _, t := range tanks {
			tr := t.Rows[r]
			pos := row.Case.Pos
			var instr loads.Instruction
			switch tr.Instruction {
			case "off":
				instr = loads.HeatOff
			case "hold":
				instr = loads.HoldTemp
			case "heat_to":
				instr = loads.HeatTo
			default:
				instr = loads.ReachBy
			}
			c.Set = append(c.Set, plant.Setting{Unit: t.Unit, Param: "instruction", Value: float64(instr), Pos: pos})
			if tr.T > 0 {
				c.Set = append(c.Set, plant.Setting{Unit: t.Unit, Param: "T", Value: tr.T, Pos: pos})
			}
			if tr.ByS > 0 {
				c.Set = append(c.Set, plant.Setting{Unit: t.Unit, Param: "by", Value: tr.ByS, Pos: pos})
			}
		}
		out[r] = profile.Row{Phase: row.Phase, Hours: row.Hours, Case: c}
	}
	return out
}

// replay solves the rows as a voyage with the tanks stateful.
func replay(ctx context.Context, p *plant.Plant, rows []profile.Row, starts []profile.TankStart) (Outcome, error) {
	res, err := profile.Run(ctx, p, rows, profile.Options{Tanks: starts, Workers: 1})
	if err != nil {
		return Outcome{}, err
	}
	return Outcome{FuelT: res.Total.FuelT, CO2T: res.Total.CO2T, ShortRows: res.Total.ShortRows, Voyage: res, Rows: rows}, nil
}

// naive returns the two plans the least-fuel plan is compared with, each
// tank's instruction per row simulated exactly (loads.Period): holding
// the highest required temperature from the first row to the last
// required time, and heating at the last moment. It also gives, for each
// requirement, the latest row a heat-up at the coil's capacity may start
// in and still meet it (−1 when none).
func naive(pb *problem, reqs []Requirement, reqAt [][]int) (hold, last []TankPlan, latest []int) {
	latest = make([]int, len(reqs))
	for k := range latest {
		latest[k] = -1
	}
	for _, d := range pb.tanks {
		// The tank's requirements in the order of their first boundary.
		type rq struct {
			k, first, end int
			T             float64
		}
		var list []rq
		top, end := 0.0, -1
		for k, q := range reqs {
			if q.Tank != d.name {
				continue
			}
			b0, b1 := reqAt[k][0], reqAt[k][len(reqAt[k])-1]
			list = append(list, rq{k: k, first: b0, end: b1, T: q.T})
			top = math.Max(top, q.T)
			end = max(end, b1)
		}
		sort.SliceStable(list, func(a, b int) bool { return list[a].first < list[b].first })
		wait := func(r int, T float64) ctrl { // off, or at the floor
			if d.floor > 0 && d.heat[r] {
				return d.toward(r, T, d.floor)
			}
			return ctrl{T1: d.periods[r].Off(T), kind: ctrlOff}
		}
		// Hold: heat to the highest required temperature and hold it to
		// the last required time; then as waiting.
		h := TankPlan{Unit: d.name, StartT: d.start, NeverBelow: d.floor}
		T := d.start
		for r := 0; r < pb.rows; r++ {
			var c ctrl
			if top > 0 && r < end && d.heat[r] {
				c = d.toward(r, T, top)
				h.Rows = append(h.Rows, rowOf(c, T, top))
			} else {
				c = wait(r, T)
				h.Rows = append(h.Rows, rowOf(c, T, d.floor))
			}
			T = c.T1
		}
		hold = append(hold, h)
		// Last moment: for each requirement in turn, wait until the
		// latest start that still meets it, heat at the coil's capacity to
		// it, hold it to its end.
		l := TankPlan{Unit: d.name, StartT: d.start, NeverBelow: d.floor}
		T = d.start
		r := 0
		simulate := func(from int, T0 float64, s, b int, target float64) float64 {
			T := T0
			for x := from; x < b; x++ {
				if x < s || !d.heat[x] {
					T = wait(x, T).T1
				} else {
					T = d.toward(x, T, target).T1
				}
			}
			return T
		}
		for _, q := range list {
			if q.first < r {
				continue
			}
			// The latest s in [r, first) with the target met at first.
			s := -1
			lo, hi := r, q.first-1
			for lo <= hi {
				mid := (lo + hi) / 2
				if simulate(r, T, mid, q.first, q.T) >= q.T-1e-6 {
					s, lo = mid, mid+1
				} else {
					hi = mid - 1
				}
			}
			if q.first == r && T >= q.T-1e-6 {
				s = r
			}
			latest[q.k] = s
			start := s
			if start < 0 {
				start = r
			}
			for ; r < q.end; r++ {
				var c ctrl
				if (r >= start || r >= q.first) && d.heat[r] {
					c = d.toward(r, T, q.T)
					l.Rows = append(l.Rows, rowOf(c, T, q.T))
				} else {
					c = wait(r, T)
					l.Rows = append(l.Rows, rowOf(c, T, d.floor))
				}
				T = c.T1
			}
		}
		for ; r < pb.rows; r++ {
			c := wait(r, T)
			l.Rows = append(l.Rows, rowOf(c, T, d.floor))
			T = c.T1
		}
		last = append(last, l)
	}
	return hold, last, latest
}

// toward is the heat_to (hold) instruction over row r from T: the coil at
// its capacity up to target, then the losses there; or the heating off
// down to it. It returns the row's end and mean duty, simulated by
// loads.Advance's model.
func (d *tankDP) toward(r int, T, target float64) ctrl {
	p := &d.periods[r]
	Toff := p.Off(T)
	switch {
	case T > target && Toff >= target:
		return ctrl{T1: Toff, kind: ctrlOff}
	case T >= target-1e-9 && T <= target+1e-9:
		q := p.Duty(T, T)
		if q >= 0 && q <= p.Capacity(T, T) {
			return ctrl{T1: T, Q: q, kind: ctrlHold}
		}
	}
	Tf, qf := p.Full(T)
	if T < target && Tf <= target {
		return ctrl{T1: Tf, Q: qf, kind: ctrlFull}
	}
	// It reaches the target within the row: the mean duty of reaching it
	// and holding it.
	T1, q, binds := p.HeatTo(T, target)
	if math.IsNaN(T1) {
		return ctrl{T1: Toff, kind: ctrlOff}
	}
	kind := uint8(ctrlReach)
	if binds {
		kind = ctrlFull
	}
	return ctrl{T1: T1, Q: q, kind: kind}
}

// rowOf is a naive plan's row: its instruction from the control.
func rowOf(c ctrl, T0, target float64) TankRowPlan {
	tr := TankRowPlan{T0: T0, T1: c.T1, DutyW: c.Q}
	switch {
	case c.kind == ctrlOff && target == 0:
		tr.Instruction = "off"
	default:
		tr.Instruction, tr.T = "heat_to", target
		tr.CoilBinds = c.kind == ctrlFull
	}
	return tr
}

// verdict says how far a tank misses a requirement and what would meet
// it: more hours of heating at the coil's capacity from where the plan
// leaves it (with the surroundings of the row before), or more coil (the
// coil's capacity at the required temperature that heating from the first
// row at full coil would need), or, if the coil would do, the boilers.
func verdict(pb *problem, d *tankDP, lt *loads.TankHeating, ts float64, rows []profile.Row, q Requirement, b int, reached float64) string {
	head := fmt.Sprintf("%s reaches %.1f °C at %s; %.1f °C", q.Tank, reached-273.15, q.Label, q.T-273.15)
	r := max(b-1, 0)
	p := d.periods[r]
	more := ""
	if tt, level, ok := p.TimeFull(reached, q.T); ok {
		more = fmt.Sprintf("%.0f h more heating", math.Ceil(tt/3600))
	} else {
		more = fmt.Sprintf("more than this coil can give (at its capacity the cargo levels out at %.1f °C)", level-273.15)
	}
	// Full coil from the start, with the coil scaled by k.
	fullFrom := func(k float64) float64 {
		x := *lt
		x.Coil.Area *= k
		T := d.start
		for i := 0; i < b; i++ {
			if !d.heat[i] {
				T = d.periods[i].Off(T)
				continue
			}
			per, err := x.Period(pb.dt[i], loads.Ambient{Sea: rows[i].Case.Conditions.SeaT, Air: rows[i].Case.Conditions.AirT}, ts)
			if err != nil {
				return math.NaN()
			}
			c := (&tankDP{periods: []loads.Period{per}, heat: []bool{true}}).toward(0, T, q.T)
			T = c.T1
		}
		return T
	}
	if fullFrom(1) >= q.T-0.01 {
		return head + " needs the boilers to carry more heating than they can in the rows before it (the coil would do)"
	}
	lo, hi := 1.0, 2.0
	for fullFrom(hi) < q.T-0.01 && hi < 1000 {
		lo, hi = hi, hi*2
	}
	if fullFrom(hi) < q.T-0.01 {
		return head + " needs " + more
	}
	for range 50 {
		mid := 0.5 * (lo + hi)
		if fullFrom(mid) >= q.T-0.01 {
			hi = mid
		} else {
			lo = mid
		}
	}
	extra := (hi - 1) * lt.Coil.UA() * (ts - q.T)
	if lt.Coil.Kind == loads.DeckHeater {
		extra = (hi - 1) * p.Capacity(q.T, q.T)
	}
	return fmt.Sprintf("%s needs %s or %.1f MW more coil", head, more, extra/1e6)
}

// rowSetsOff reports whether the row switches the tank's consumer off
// (or the plant has it off and the row does not switch it on).
func rowSetsOff(row profile.Row, unit string, p *plant.Plant) bool {
	off := false
	if c, ok := p.Component(unit).(*plant.Consumer); ok {
		off = c.Off
	}
	for _, s := range row.Case.Set {
		if s.Unit == unit && s.Param == "off" {
			off = s.Value != 0
		}
	}
	return off
}

func rowPos(s plant.Setting, r profile.Row) plant.Pos {
	if s.Pos.File != "" {
		return s.Pos
	}
	return r.Case.Pos
}

func phases(rows []profile.Row) []string {
	var out []string
	seen := map[string]bool{}
	for _, r := range rows {
		if !seen[r.Phase] {
			seen[r.Phase] = true
			out = append(out, fmt.Sprintf("%q", r.Phase))
		}
	}
	return out
}
