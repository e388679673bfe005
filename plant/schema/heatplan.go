package schema

import (
	"steamcase/plant"
	"steamcase/plant/heatplan"
)

// PlanCaution is the caution every heating plan carries.
const PlanCaution = "The heating plan is an estimate: the charter party's heating instructions, the cargo's safety data sheet and the master's judgment govern."

// VoyageTank is a tank a voyage carries from row to row, over one row.
type VoyageTank struct {
	Name        string   `json:"name"`
	Instruction string   `json:"instruction"`
	TK          *float64 `json:"T_K"`
	ByH         *float64 `json:"by_h"`
	StartTK     float64  `json:"start_T_K"`
	EndTK       float64  `json:"end_T_K"`
	DutyKW      float64  `json:"duty_kW"`
	CapacityKW  float64  `json:"capacity_kW"`
	CoilBinds   bool     `json:"coil_binds"`
	Short       bool     `json:"short"`
}

// newVoyageTanks returns the stateful tanks of a row.
func newVoyageTanks(tanks []plant.TankRow) []VoyageTank {
	out := []VoyageTank{}
	for _, t := range tanks {
		out = append(out, VoyageTank{Name: t.Name, Instruction: t.Instruction, TK: temperature(t.Target),
			ByH: roundPtr(t.By/3600, t.By > 0), StartTK: Round(t.T0), EndTK: Round(t.T1), DutyKW: Round(KW(t.DutyW)),
			CapacityKW: Round(KW(t.CapacityW)), CoilBinds: t.Binds, Short: t.Short})
	}
	return out
}

// HeatingPlan is a least-fuel heating plan and the naive plans it is
// compared with.
type HeatingPlan struct {
	Job
	Caution             string        `json:"caution"`
	Method              string        `json:"method"`
	GridK               float64       `json:"grid_K"`
	Solves              int           `json:"solves"`
	Plan                PlanOutcome   `json:"plan"`
	Hold                PlanOutcome   `json:"hold"`
	LastMoment          PlanOutcome   `json:"last_moment"`
	SavingVsHoldT       float64       `json:"saving_vs_hold_t"`
	SavingVsLastMomentT float64       `json:"saving_vs_last_moment_t"`
	CO2SavingVsHoldT    float64       `json:"co2_saving_vs_hold_t"`
	CO2SavingVsLastMomT float64       `json:"co2_saving_vs_last_moment_t"`
	Tanks               []PlanTank    `json:"tanks"`
	Rows                []PlanRow     `json:"rows"`
	Binding             []PlanBinding `json:"binding"`
	Warnings            []string      `json:"warnings"`
}

// PlanOutcome is a plan solved as a voyage.
type PlanOutcome struct {
	FuelT      float64  `json:"fuel_t"`
	CO2T       float64  `json:"co2_t"`
	TableFuelT float64  `json:"curve_fuel_t"`
	ShortRows  []int    `json:"short_rows"`
	Missed     []string `json:"missed"`
}

// PlanTank is one tank's plan.
type PlanTank struct {
	Name         string         `json:"name"`
	StartTK      float64        `json:"start_T_K"`
	NeverBelowTK *float64       `json:"never_below_T_K"`
	Required     []PlanRequired `json:"required"`
	Rows         []PlanTankRow  `json:"rows"`
}

// PlanRequired is a required temperature and how the plan meets it.
type PlanRequired struct {
	TK             float64  `json:"T_K"`
	At             string   `json:"at"`
	AtH            *float64 `json:"at_h"`
	Phase          string   `json:"phase"`
	Source         string   `json:"source"`
	ReachedTK      float64  `json:"reached_T_K"`
	Met            bool     `json:"met"`
	LatestStartH   *float64 `json:"latest_start_h"`
	LatestStartRow *int     `json:"latest_start_row"`
	Verdict        string   `json:"verdict"`
}

// PlanTankRow is a tank's instruction over one row.
type PlanTankRow struct {
	Row         int      `json:"row"`
	Instruction string   `json:"instruction"`
	TK          *float64 `json:"T_K"`
	ByH         *float64 `json:"by_h"`
	StartTK     float64  `json:"start_T_K"`
	EndTK       float64  `json:"end_T_K"`
	DutyKW      float64  `json:"duty_kW"`
	CoilBinds   bool     `json:"coil_binds"`
}

// PlanRow is one row of the voyage under the plan.
type PlanRow struct {
	Row            int     `json:"row"`
	Phase          string  `json:"phase"`
	Hours          float64 `json:"hours"`
	StartH         float64 `json:"start_h"`
	DutyKW         float64 `json:"duty_kW"`
	CapacityKW     float64 `json:"capacity_kW"`
	BoilersFiring  int     `json:"boilers_firing"`
	BoilerSteamKgH float64 `json:"boiler_steam_kg_h"`
	FuelT          float64 `json:"fuel_t"`
}

// PlanBinding is a row where a limit binds.
type PlanBinding struct {
	Row   int    `json:"row"`
	Tank  string `json:"tank"`
	Limit string `json:"limit"`
}

func newOutcome(o heatplan.Outcome) PlanOutcome {
	return PlanOutcome{FuelT: Round(o.FuelT), CO2T: Round(o.CO2T), TableFuelT: Round(o.TableFuelT),
		ShortRows: rows1(o.ShortRows), Missed: append([]string{}, o.Missed...)}
}

// NewHeatingPlan returns the schema form of a heating plan run as job.
func NewHeatingPlan(job Job, r *heatplan.Result) HeatingPlan {
	out := HeatingPlan{Job: job.job(), Caution: PlanCaution, Method: r.Method, GridK: Round(r.Grid), Solves: r.Solves,
		Plan: newOutcome(r.Plan), Hold: newOutcome(r.Hold), LastMoment: newOutcome(r.LastMoment),
		SavingVsHoldT: Round(r.SavingT(r.Hold)), SavingVsLastMomentT: Round(r.SavingT(r.LastMoment)),
		CO2SavingVsHoldT: Round(r.Hold.CO2T - r.Plan.CO2T), CO2SavingVsLastMomT: Round(r.LastMoment.CO2T - r.Plan.CO2T),
		Tanks: []PlanTank{}, Rows: []PlanRow{}, Binding: []PlanBinding{}, Warnings: append([]string{}, r.Warnings...)}
	for _, t := range r.Tanks {
		pt := PlanTank{Name: t.Unit, StartTK: Round(t.StartT), NeverBelowTK: temperature(t.NeverBelow),
			Required: []PlanRequired{}, Rows: []PlanTankRow{}}
		for _, q := range t.Required {
			pr := PlanRequired{TK: Round(q.T), At: q.Label, Phase: q.Phase, Source: q.Pos.String(), ReachedTK: Round(q.Reached),
				Met: q.Met, Verdict: q.Verdict}
			if q.Phase == "" {
				pr.AtH = roundPtr(q.At/3600, true)
			}
			if q.LatestStartRow >= 0 {
				pr.LatestStartH = roundPtr(q.LatestStartH, true)
				pr.LatestStartRow = row1(q.LatestStartRow)
			}
			pt.Required = append(pt.Required, pr)
		}
		for i, tr := range t.Rows {
			pt.Rows = append(pt.Rows, PlanTankRow{Row: i + 1, Instruction: tr.Instruction, TK: temperature(tr.T),
				ByH: roundPtr(tr.ByS/3600, tr.ByS > 0), StartTK: Round(tr.T0), EndTK: Round(tr.T1), DutyKW: Round(KW(tr.DutyW)),
				CoilBinds: tr.CoilBinds})
		}
		out.Tanks = append(out.Tanks, pt)
	}
	for i, rp := range r.Rows {
		row := PlanRow{Row: i + 1, Phase: rp.Phase, Hours: Round(rp.Hours), StartH: Round(rp.StartH), DutyKW: Round(KW(rp.DutyW)),
			CapacityKW: Round(KW(rp.CapacityW))}
		if v := r.Plan.Voyage; v != nil && i < len(v.Rows) && v.Rows[i].Summary.Solved {
			c := &v.Rows[i].Summary
			row.BoilersFiring = c.BoilersFiring
			row.BoilerSteamKgH = Round(KgPerH(c.BoilerSteamKgS))
			row.FuelT = Round(Tonnes(c.FuelKgS, rp.Hours))
		}
		out.Rows = append(out.Rows, row)
	}
	for _, b := range r.Binding {
		out.Binding = append(out.Binding, PlanBinding{Row: b.Row + 1, Tank: b.Tank, Limit: b.What})
	}
	return out
}
