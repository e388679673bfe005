package profile

import (
	"sync"

	"steamcase/plant"
)

// RowSummary is what the reports of a job read of one solved row: the
// figures of the voyage's table, its CSV, its JSON and Lua rows and its
// charts, and those the totals, a study's hours flagged by the
// economisers and a sweep's UA are summed from. A row keeps its summary
// always and its full plant.CaseResult only on request
// (Options.KeepResults): on the demo tanker's year a row keeps some
// 540 bytes with its summary, 16.2 kB with its case result as well
// (scenarios' BenchmarkDemoTankerYearKept measures both).
//
// Every figure is the case result's own (SI), copied or summed in the
// order the case result lists its boilers and economisers, so that a
// total summed from the summaries is the total summed from the case
// results, bit for bit.
type RowSummary struct {
	// Case is the name of the row's case.
	Case string
	// The case's conditions: sea and air temperatures (K, zero when not
	// given) and the main engine's load (fraction of its MCR).
	SeaT, AirT, EngineLoad float64

	// The solver's Newton iterations of the final configuration and of
	// every configuration tried (plant.CaseResult.Iterations,
	// NewtonIterations).
	Iterations, NewtonIterations int

	BoilersFiring int
	// MarginNextKgS is plant.CaseResult.MarginNextKgS.
	MarginNextKgS float64

	SteamDemandKgS, SteamProductionKgS float64
	// BoilerSteamKgS is the steam the oil-fired boilers raise; MCRKgS the
	// MCR of all of them and FiringMCRKgS of those firing.
	BoilerSteamKgS, MCRKgS, FiringMCRKgS float64
	EGESteamKgS, EGEFuelSavedKgS         float64
	DumpedKgS, MakeUpKgS                 float64
	// FuelKgS, CO2KgS and CO2AnalysisKgS are the case's boiler fuel and
	// its CO2 on both bases, as in plant.CaseResult.
	FuelKgS, CO2KgS, CO2AnalysisKgS float64
	ElectricW                       float64
	// N1Solved counts the N-1 contingencies solved (not screened as
	// carried).
	N1Solved int

	// Solved is false for a row that was not solved (a script's check
	// mode): every figure is then zero.
	Solved bool
	// Converged: the final configuration converged.
	Converged bool
	CanCarry  bool
	// CO2AnalysisUnknown: a boiler burnt a fuel without an analysis (as
	// in plant.CaseResult).
	CO2AnalysisUnknown bool
	// N1Checked says the case's N-1 contingencies were answered;
	// N1CanCarry that every one of them is carried.
	N1Checked, N1CanCarry bool
	// InertGasShort says the case's inert-gas check is not met.
	InertGasShort bool

	// Fuels are the boilers that burn fuel in the case, in the plant's
	// order: the totals by grade are summed from them.
	Fuels []RowFuel
	// EGEs are the case's exhaust-gas economisers, in the plant's order.
	EGEs []RowEGE
	// Warnings are the texts of the case's warnings. A run keeps one copy
	// of each distinct text: rows that warn alike share it.
	Warnings []string
	// Tanks are the stateful tanks over the row (plant.CaseResult.Tanks):
	// empty unless the voyage carries tanks from row to row.
	Tanks []plant.TankRow
}

// RowFuel is one boiler's fuel in a row: its grade, the fuel flow and its
// CO2 by the regulatory factor and, when HasCO2Analysis, by the analysis
// (kg/s).
type RowFuel struct {
	Grade                           string
	FuelKgS, CO2KgS, CO2AnalysisKgS float64
	HasCO2Analysis                  bool
}

// RowEGE is what a row keeps of an exhaust-gas economiser: the steam its
// fouling costs (kg/s), its clean UA at its reference gas flow (W/K), and
// its flags (plant.EGEResult).
type RowEGE struct {
	Name                               string
	FoulingLostKgS, DesignUA           float64
	BelowMin, BelowDewMargin, SootRisk bool
}

// Summarise returns the summary of a solved row. Texts, if not nil,
// keeps one copy of each distinct warning text (see Texts).
func Summarise(cr *plant.CaseResult, texts *Texts) RowSummary {
	s := RowSummary{
		Solved: true, Case: cr.Name,
		SeaT: cr.Conditions.SeaT, AirT: cr.Conditions.AirT, EngineLoad: cr.Conditions.EngineLoad,
		Converged: cr.Converged, Iterations: cr.Iterations, NewtonIterations: cr.NewtonIterations,
		BoilersFiring: cr.BoilersFiring, CanCarry: cr.CanCarry, MarginNextKgS: cr.MarginNextKgS,
		SteamDemandKgS: cr.SteamDemandKgS, SteamProductionKgS: cr.SteamProductionKgS,
		EGESteamKgS: cr.EGESteamKgS, EGEFuelSavedKgS: cr.EGEFuelSavedKgS,
		DumpedKgS: cr.DumpedKgS, MakeUpKgS: cr.MakeUpKgS,
		FuelKgS: cr.FuelKgS, CO2KgS: cr.CO2KgS, CO2AnalysisKgS: cr.CO2AnalysisKgS, CO2AnalysisUnknown: cr.CO2AnalysisUnknown,
		ElectricW:     cr.ElectricW,
		N1Checked:     cr.ContingenciesChecked,
		InertGasShort: cr.InertGas != nil && !cr.InertGas.Met,
		Tanks:         cr.Tanks,
	}
	nFuel := 0
	for _, b := range cr.Boilers {
		s.BoilerSteamKgS += b.SteamKgS
		s.MCRKgS += b.MCRKgS
		if b.Firing {
			s.FiringMCRKgS += b.MCRKgS
		}
		if b.FuelKgS > 0 {
			nFuel++
		}
	}
	if nFuel > 0 {
		s.Fuels = make([]RowFuel, 0, nFuel)
		for _, b := range cr.Boilers {
			if b.FuelKgS > 0 {
				s.Fuels = append(s.Fuels, RowFuel{Grade: b.FuelName, FuelKgS: b.FuelKgS, CO2KgS: b.CO2KgS,
					CO2AnalysisKgS: b.CO2AnalysisKgS, HasCO2Analysis: b.HasCO2Analysis})
			}
		}
	}
	if len(cr.EGEs) > 0 {
		s.EGEs = make([]RowEGE, len(cr.EGEs))
		for i, e := range cr.EGEs {
			s.EGEs[i] = RowEGE{Name: e.Name, FoulingLostKgS: e.FoulingLostKgS, DesignUA: e.DesignUA,
				BelowMin: e.BelowMin, BelowDewMargin: e.BelowDewMargin, SootRisk: e.SootRisk}
		}
	}
	if s.N1Checked {
		s.N1CanCarry = true
		for _, c := range cr.Contingencies {
			s.N1CanCarry = s.N1CanCarry && c.CanCarry
			if c.Solved {
				s.N1Solved++
			}
		}
	}
	if len(cr.Warnings) > 0 {
		s.Warnings = make([]string, len(cr.Warnings))
		for i, w := range cr.Warnings {
			s.Warnings[i] = texts.Intern(w)
		}
	}
	return s
}

// summaryOnly makes pl leave the lines' states out of its case results
// (plant.Options.NoLineStates) while its rows keep their summaries alone
// (keep false), which read no line, and returns what puts the option
// back: pl may be the caller's plant.
func summaryOnly(pl *plant.Plant, keep bool) func() {
	old := pl.Opt.NoLineStates
	pl.Opt.NoLineStates = old || !keep
	return func() { pl.Opt.NoLineStates = old }
}

// Texts keeps one copy of each distinct text for the rows of a run, so
// that rows that warn alike share the bytes. Its zero value is ready; it
// is safe for use by several goroutines, and a nil *Texts keeps every
// text as given.
type Texts struct {
	mu   sync.Mutex
	seen map[string]string
}

// Intern returns the copy of s that t keeps, keeping s if it has none.
func (t *Texts) Intern(s string) string {
	if t == nil {
		return s
	}
	t.mu.Lock()
	defer t.mu.Unlock()
	if k, ok := t.seen[s]; ok {
		return k
	}
	if t.seen == nil {
		t.seen = map[string]string{}
	}
	t.seen[s] = s
	return s
}
