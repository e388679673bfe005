package schema

import "steamcase/plant/profile"

// Job is what every job over a profile (a voyage, a study, an audit)
// starts with: its name, its plant's, where the script ran it and where
// each of its rows (an audit's days) was given, each as "file:line".
type Job struct {
	Name       string   `json:"name"`
	Plant      string   `json:"plant"`
	Source     string   `json:"source"`
	RowSources []string `json:"row_sources"`
}

// job returns j with a list for RowSources, never null.
func (j Job) job() Job {
	j.RowSources = append([]string{}, j.RowSources...)
	return j
}

// Totals are the sums over a set of rows of a profile (each row's figures
// times its hours).
type Totals struct {
	Rows              int          `json:"rows"`
	Hours             float64      `json:"hours"`
	FuelT             float64      `json:"fuel_t"`
	CO2T              float64      `json:"co2_t"`
	CO2AnalysisT      *float64     `json:"co2_analysis_t"`
	SteamT            float64      `json:"steam_t"`
	EGESteamT         float64      `json:"ege_steam_t"`
	EGEFuelSavedT     float64      `json:"ege_fuel_saved_t"`
	EGEFoulingLostT   float64      `json:"ege_fouling_lost_steam_t"`
	DumpedT           float64      `json:"dumped_t"`
	MakeUpT           float64      `json:"makeup_t"`
	ElectricMWh       float64      `json:"electric_MWh"`
	HoursFiring       []float64    `json:"hours_firing"`
	PeakBoilerKgH     float64      `json:"peak_boiler_kg_h"`
	PeakRow           *int         `json:"peak_row"`
	CapacityKgH       float64      `json:"capacity_kg_h"`
	TightestMarginKgH *float64     `json:"tightest_margin_kg_h"`
	TightestRow       *int         `json:"tightest_row"`
	ShortRows         []int        `json:"short_rows"`
	WarningRows       []int        `json:"warning_rows"`
	FuelByGrade       []GradeTotal `json:"fuel_by_grade"`
	N1CheckedRows     int          `json:"n_minus_1_rows"`
	N1ShortHours      float64      `json:"n_minus_1_short_hours"`
	N1ShortRows       []int        `json:"n_minus_1_short_rows"`
	InertGasShortH    float64      `json:"inert_gas_short_hours"`
}

// GradeTotal is the boiler fuel of one grade and its CO2, by the
// regulatory factor and by the analysis (null without one).
type GradeTotal struct {
	Grade        string   `json:"grade"`
	FuelT        float64  `json:"fuel_t"`
	CO2T         float64  `json:"co2_t"`
	CO2AnalysisT *float64 `json:"co2_analysis_t"`
}

// row1 is a 0-based row index as the 1-based number the reports show, or
// nil (null) for a negative index: no such row.
func row1(i int) *int {
	if i < 0 {
		return nil
	}
	n := i + 1
	return &n
}

// rows1 turns 0-based row indexes into 1-based numbers.
func rows1(rows []int) []int {
	out := make([]int, len(rows))
	for i, r := range rows {
		out[i] = r + 1
	}
	return out
}

// NewTotals returns the schema form of a set of totals. Rows are numbered
// from 1; peak_row, tightest_row and tightest_margin_kg_h are null when no
// row was summed.
func NewTotals(t profile.Totals) Totals {
	hf := make([]float64, len(t.HoursFiring))
	for i, h := range t.HoursFiring {
		hf[i] = Round(h)
	}
	out := Totals{
		Rows: t.Rows, Hours: Round(t.Hours), FuelT: Round(t.FuelT), CO2T: Round(t.CO2T),
		CO2AnalysisT: roundPtr(t.CO2AnalysisT, !t.CO2AnalysisUnknown), SteamT: Round(t.SteamT),
		EGESteamT: Round(t.EGESteamT), EGEFuelSavedT: Round(t.FuelSavedT), EGEFoulingLostT: Round(t.EGEFoulingLostT), DumpedT: Round(t.DumpedT),
		MakeUpT: Round(t.MakeUpT), ElectricMWh: Round(t.ElectricMWh), HoursFiring: hf,
		PeakBoilerKgH: Round(KgPerH(t.PeakBoilerKgS)), PeakRow: row1(t.PeakRow), CapacityKgH: Round(KgPerH(t.CapacityKgS)),
		TightestRow: row1(t.TightestRow), ShortRows: rows1(t.ShortRows), WarningRows: rows1(t.WarningRows),
		N1CheckedRows: t.N1CheckedRows, N1ShortHours: Round(t.N1ShortHours), N1ShortRows: rows1(t.N1ShortRows),
		InertGasShortH: Round(t.InertGasShortHours),
	}
	if t.TightestRow >= 0 {
		out.TightestMarginKgH = roundPtr(KgPerH(t.TightestMarginKgS), true)
	}
	out.FuelByGrade = make([]GradeTotal, len(t.FuelByGrade))
	for i, g := range t.FuelByGrade {
		out.FuelByGrade[i] = GradeTotal{Grade: g.Grade, FuelT: Round(g.FuelT), CO2T: Round(g.CO2T),
			CO2AnalysisT: roundPtr(g.CO2AnalysisT, g.HasCO2Analysis)}
	}
	return out
}

// Voyage is a solved voyage plan.
type Voyage struct {
	Job
	Total  Totals      `json:"total"`
	Phases []Phase     `json:"phases"`
	Rows   []VoyageRow `json:"rows"`
}

// Phase is the totals of one phase of a voyage.
type Phase struct {
	Phase string `json:"phase"`
	Totals
}

// VoyageRow is one period of a voyage plan and the main figures of its
// solved case.
type VoyageRow struct {
	Row                int      `json:"row"`
	Phase              string   `json:"phase"`
	Hours              float64  `json:"hours"`
	Case               string   `json:"case"`
	SeaTK              *float64 `json:"sea_T_K"`
	AirTK              *float64 `json:"air_T_K"`
	EngineLoad         float64  `json:"engine_load"`
	BoilersFiring      int      `json:"boilers_firing"`
	CanCarry           bool     `json:"can_carry"`
	SteamDemandKgH     float64  `json:"steam_demand_kg_h"`
	SteamProductionKgH float64  `json:"steam_production_kg_h"`
	BoilerSteamKgH     float64  `json:"boiler_steam_kg_h"`
	EGESteamKgH        float64  `json:"ege_steam_kg_h"`
	DumpedKgH          float64  `json:"dumped_kg_h"`
	FuelKgH            float64  `json:"fuel_kg_h"`
	FuelT              float64  `json:"fuel_t"`
	CO2T               float64  `json:"co2_t"`
	CO2AnalysisT       *float64 `json:"co2_analysis_t"`
	MarginKgH          float64  `json:"margin_kg_h"`
	N1CanCarry         *bool    `json:"n_minus_1_can_carry"`
	Warnings           []string `json:"warnings"`
	// Tanks are the tanks the voyage carries from row to row, over the
	// row (empty when it carries none).
	Tanks []VoyageTank `json:"tanks"`
	// Result is the row's full case when the job kept its rows in full
	// (profile.Options.KeepResults); null otherwise.
	Result *Case `json:"result"`
}

// NewVoyageRow returns the schema form of one row of a voyage, from its
// summary; its result stays null (newRows adds it). A row not solved
// (its summary's Solved false, as a script's check mode gives) has its
// phase and hours and zero figures, with can_carry true.
func NewVoyageRow(row profile.RowResult) VoyageRow {
	c := &row.Summary
	out := VoyageRow{Row: row.Index + 1, Phase: row.Phase, Hours: Round(row.Hours), CanCarry: true, Warnings: []string{},
		CO2AnalysisT: roundPtr(0, true), Tanks: newVoyageTanks(c.Tanks)}
	if !c.Solved {
		return out
	}
	out.Case = c.Case
	out.SeaTK, out.AirTK = temperature(c.SeaT), temperature(c.AirT)
	out.EngineLoad = Round(c.EngineLoad)
	out.BoilersFiring, out.CanCarry = c.BoilersFiring, c.CanCarry
	out.SteamDemandKgH = Round(KgPerH(c.SteamDemandKgS))
	out.SteamProductionKgH = Round(KgPerH(c.SteamProductionKgS))
	out.BoilerSteamKgH = Round(KgPerH(c.BoilerSteamKgS))
	out.EGESteamKgH = Round(KgPerH(c.EGESteamKgS))
	out.DumpedKgH = Round(KgPerH(c.DumpedKgS))
	out.FuelKgH = Round(KgPerH(c.FuelKgS))
	out.FuelT = Round(Tonnes(c.FuelKgS, row.Hours))
	out.CO2T = Round(Tonnes(c.CO2KgS, row.Hours))
	out.CO2AnalysisT = roundPtr(Tonnes(c.CO2AnalysisKgS, row.Hours), !c.CO2AnalysisUnknown)
	out.MarginKgH = Round(KgPerH(c.MarginNextKgS))
	if c.N1Checked {
		ok := c.N1CanCarry
		out.N1CanCarry = &ok
	}
	out.Warnings = append(out.Warnings, c.Warnings...)
	return out
}

// newRows returns the schema form of a job's rows solved on the plant
// called plantName, each with its full case when it kept one.
func newRows(plantName string, rows []profile.RowResult) []VoyageRow {
	out := make([]VoyageRow, 0, len(rows))
	for _, row := range rows {
		vr := NewVoyageRow(row)
		if row.Result != nil {
			c := NewCase(plantName, row.Result)
			vr.Result = &c
		}
		out = append(out, vr)
	}
	return out
}

// NewVoyage returns the schema form of a solved voyage plan run as job.
func NewVoyage(job Job, r *profile.Result) Voyage {
	out := Voyage{Job: job.job(), Total: NewTotals(r.Total), Phases: make([]Phase, 0, len(r.Phases)),
		Rows: newRows(job.Plant, r.Rows)}
	for _, p := range r.Phases {
		out.Phases = append(out.Phases, Phase{Phase: p.Phase, Totals: NewTotals(p.Totals)})
	}
	return out
}

// Study is a comparison of plant variants over a profile.
type Study struct {
	Job
	Hours         float64   `json:"hours"`
	FuelPrice     float64   `json:"fuel_price_per_t"`
	InstalledCost float64   `json:"installed_cost"`
	Currency      string    `json:"currency"`
	CarbonPrice   float64   `json:"carbon_price_per_t_co2"`
	LifeYears     *int      `json:"life_years"`
	DiscountRate  *float64  `json:"discount_rate"`
	SootCaution   string    `json:"soot_fire_caution"`
	Variants      []Variant `json:"variants"`
	Sweep         *Sweep    `json:"sweep"`
}

// SootFireCaution is what a study says beside the hours it counts at
// soot-risk loads.
const SootFireCaution = "The soot-risk hours are those in which an exhaust-gas economiser runs at low engine load or low gas velocity, where soot builds up: soot fires in exhaust-gas economisers are a known hazard. The thresholds are common practice (no source) unless the script gives the maker's; soot-blow, wash and inspect as the maker prescribes, and keep the gas outlet above the acid-dew and soot margins the maker states."

// Money is what a variant or a size earns against the base.
type Money struct {
	InstalledCost float64  `json:"installed_cost"`
	CostSaved     float64  `json:"cost_saved"`
	CarbonSaved   float64  `json:"carbon_cost_saved"`
	AnnualSaving  float64  `json:"annual_saving"`
	PaybackYears  *float64 `json:"payback_years"`
	NPV           *float64 `json:"npv"`
}

// EGEHours are the hours flagged by the economisers.
type EGEHours struct {
	HoursBelowMinGasT float64 `json:"hours_below_min_gas_T"`
	HoursBelowAcidDew float64 `json:"hours_below_acid_dew_margin"`
	HoursSootRisk     float64 `json:"hours_soot_risk"`
}

// Variant is one variant of a study, its savings against the first.
type Variant struct {
	Name        string  `json:"name"`
	Totals      Totals  `json:"totals"`
	FuelSavedT  float64 `json:"fuel_saved_t"`
	CO2AvoidedT float64 `json:"co2_avoided_t"`
	Money
	EGEHours
	RowWarnings []RowWarning `json:"row_warnings"`
	// Rows are the variant's rows when the study kept them in full
	// (profile.Options.KeepResults); null otherwise.
	Rows []VoyageRow `json:"rows"`
}

// RowWarning is the warnings of one row of a profile.
type RowWarning struct {
	Row      int      `json:"row"`
	Warnings []string `json:"warnings"`
}

// Sweep is a study's sweep of an economiser's size.
type Sweep struct {
	Unit         string       `json:"unit"`
	Param        string       `json:"param"`
	CostRefUA    float64      `json:"cost_ref_ua_W_K"`
	CostRef      float64      `json:"cost_ref"`
	CostExponent float64      `json:"cost_exponent"`
	CostFixed    float64      `json:"cost_fixed"`
	Best         *int         `json:"best"`
	Points       []SweepPoint `json:"points"`
}

// SweepPoint is one size of a sweep.
type SweepPoint struct {
	Value       float64 `json:"value"`
	UA          float64 `json:"ua_W_K"`
	FuelT       float64 `json:"fuel_t"`
	CO2T        float64 `json:"co2_t"`
	EGESteamT   float64 `json:"ege_steam_t"`
	DumpedT     float64 `json:"dumped_t"`
	FoulingT    float64 `json:"ege_fouling_lost_steam_t"`
	FuelSavedT  float64 `json:"fuel_saved_t"`
	CO2AvoidedT float64 `json:"co2_avoided_t"`
	Money
	EGEHours
	// Rows are the size's rows when the study kept them in full; null
	// otherwise.
	Rows []VoyageRow `json:"rows"`
}

// newMoney converts money figures; the installed cost is rounded unless
// it is an input given by the script.
func newMoney(m profile.Money, hasNPV, given bool) Money {
	cost := m.InstalledCost
	if !given {
		cost = Round(cost)
	}
	return Money{InstalledCost: cost, CostSaved: Round(m.CostSaved), CarbonSaved: Round(m.CarbonSaved),
		AnnualSaving: Round(m.AnnualSaving), PaybackYears: roundPtr(m.PaybackYears, m.HasPayback), NPV: roundPtr(m.NPV, hasNPV)}
}

func newEGEHours(h profile.EGEHours) EGEHours {
	return EGEHours{HoursBelowMinGasT: Round(h.HoursBelowMinGasT), HoursBelowAcidDew: Round(h.HoursBelowAcidDew), HoursSootRisk: Round(h.HoursSootRisk)}
}

// NewStudy returns the schema form of a study run as job. The money
// inputs (prices, installed costs, life, rate, the cost law) are given as
// the script gave them (not rounded); a payback is null for the base,
// without an extra installed cost or a price, or when nothing is saved;
// an NPV is null without a life.
func NewStudy(job Job, r *profile.StudyResult) Study {
	out := Study{Job: job.job(), Hours: Round(r.Hours), FuelPrice: r.FuelPrice, InstalledCost: r.InstalledCost,
		Currency: r.Currency, CarbonPrice: r.CarbonPrice, SootCaution: SootFireCaution, Variants: make([]Variant, 0, len(r.Variants))}
	if r.HasNPV {
		life, rate := r.LifeYears, r.DiscountRate
		out.LifeYears, out.DiscountRate = &life, &rate
	}
	for _, v := range r.Variants {
		vj := Variant{Name: v.Name, Totals: NewTotals(v.Totals), FuelSavedT: Round(v.FuelSavedT),
			CO2AvoidedT: Round(v.CO2AvoidedT), Money: newMoney(v.Money, r.HasNPV, true), EGEHours: newEGEHours(v.EGEHours),
			RowWarnings: make([]RowWarning, 0, len(v.RowWarnings))}
		for _, w := range v.RowWarnings {
			vj.RowWarnings = append(vj.RowWarnings, RowWarning{Row: w.Row + 1, Warnings: append([]string{}, w.Texts...)})
		}
		vj.Rows = keptRows(job.Plant, v.Rows)
		out.Variants = append(out.Variants, vj)
	}
	if sw := r.Sweep; sw != nil {
		exp := sw.Cost.Exponent
		if exp == 0 {
			exp = profile.DefaultCostExponent
		}
		js := &Sweep{Unit: sw.Unit, Param: sw.Param, CostRefUA: sw.Cost.RefUA, CostRef: sw.Cost.RefCost, CostExponent: exp,
			CostFixed: sw.Cost.Fixed, Best: row1(sw.Best), Points: make([]SweepPoint, 0, len(sw.Points))}
		for _, pt := range sw.Points {
			js.Points = append(js.Points, SweepPoint{Value: pt.Value, UA: Round(pt.UA), FuelT: Round(pt.FuelT), CO2T: Round(pt.CO2T),
				EGESteamT: Round(pt.EGESteamT), DumpedT: Round(pt.DumpedT), FoulingT: Round(pt.EGEFoulingLostT),
				FuelSavedT: Round(pt.FuelSavedT), CO2AvoidedT: Round(pt.CO2AvoidedT), Money: newMoney(pt.Money, r.HasNPV, false),
				EGEHours: newEGEHours(pt.EGEHours), Rows: keptRows(job.Plant, pt.Rows)})
		}
		out.Sweep = js
	}
	return out
}

// keptRows is the schema form of the rows a study kept, or nil (null)
// when it kept none.
func keptRows(plantName string, rows []profile.RowResult) []VoyageRow {
	if rows == nil {
		return nil
	}
	return newRows(plantName, rows)
}
