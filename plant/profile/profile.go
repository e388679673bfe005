package profile

import (
	"context"
	"fmt"
	"math"
	"runtime"

	"steamcase/plant"
)

// Row is one period of a profile: a load case that lasts Hours, in a
// phase of the voyage or year (port stay, loaded passage, ...).
type Row struct {
	Phase string
	Hours float64
	Case  plant.Case
}

// Options control how a profile is run. The zero value runs on all cores.
type Options struct {
	// Workers is the number of goroutines; zero means GOMAXPROCS. The
	// results do not depend on it.
	Workers int
	// ChunkRows is the number of consecutive rows one worker solves in
	// turn, each warm-started from the one before; each chunk starts cold.
	// Zero means 64. The results depend on it only in the last bits of
	// the solver's tolerance, and not at all on Workers.
	ChunkRows int
	// Progress, if not nil, is called after each chunk with the rows done
	// so far and the total, from one goroutine at a time.
	Progress func(done, total int)
	// Tanks, if any, are tank_heating units carried from row to row: each
	// starts at its temperature, each row's duty follows from its state
	// and the row's instruction, and the rows are solved in order on one
	// core (a voyage with stateful tanks cannot be split; the variants of
	// a study still run in parallel).
	Tanks []TankStart
	// KeepResults keeps each row's full case result (RowResult.Result)
	// besides its summary. False keeps the summaries only: what the
	// totals, the reports, the CSV, the JSON and Lua rows and the charts
	// read, at a fraction of the memory (RowSummary), so that a long job
	// fits in memory. The totals are the same either way.
	KeepResults bool
}

func (o *Options) defaults() {
	if o.Workers <= 0 {
		o.Workers = runtime.GOMAXPROCS(0)
	}
	if o.ChunkRows <= 0 {
		o.ChunkRows = 64
	}
}

// RowResult is one solved row: its place, phase and hours, its summary,
// and its full case result if the run kept it.
type RowResult struct {
	Index   int
	Phase   string
	Hours   float64
	Summary RowSummary
	// Result is the row's full case result when the run kept it
	// (Options.KeepResults); nil otherwise, and in a script's check mode.
	Result *plant.CaseResult
}

// rowResult is row i's result from its solved case: its summary, and the
// case result itself if keep.
func rowResult(i int, r Row, cr *plant.CaseResult, texts *Texts, keep bool) RowResult {
	out := RowResult{Index: i, Phase: r.Phase, Hours: r.Hours, Summary: Summarise(cr, texts)}
	if keep {
		out.Result = cr
	}
	return out
}

// Totals sum a set of rows. Masses in tonnes, energies in MWh, flows in
// kg/s.
type Totals struct {
	Rows  int
	Hours float64
	// Boiler fuel and CO2 burnt, and steam raised, in tonnes.
	FuelT, CO2T, SteamT, EGESteamT, DumpedT, MakeUpT float64
	// CO2AnalysisT is the CO2 by the carbon of the fuels' analyses (CO2T
	// is by their regulatory factors, plant.CaseResult.CO2KgS);
	// CO2AnalysisUnknown says a row burnt a fuel without an analysis, so
	// that CO2AnalysisT is not the total.
	CO2AnalysisT       float64
	CO2AnalysisUnknown bool
	// FuelSavedT is the boiler fuel the exhaust-gas economisers saved;
	// EGEFoulingLostT the steam their fouling cost them.
	FuelSavedT      float64
	EGEFoulingLostT float64
	ElectricMWh     float64
	// HoursFiring[k] is the hours with k oil-fired boilers firing.
	HoursFiring []float64
	// Peak demand on the oil-fired boilers and the row it occurs in, and
	// the capacity (all boilers' MCR) it is measured against.
	PeakBoilerKgS float64
	PeakRow       int
	CapacityKgS   float64
	// TightestMarginKgS is the smallest margin to the next boiler (or to
	// all boilers' MCR) over the rows, and its row.
	TightestMarginKgS float64
	TightestRow       int
	// ShortRows are the rows the plant cannot carry; WarningRows those
	// with any warning.
	ShortRows, WarningRows []int
	// FuelByGrade is the boiler fuel and its CO2 by fuel grade, in the
	// order the grades first fire (the totals the fuel-consumption
	// reporting schemes ask for).
	FuelByGrade []GradeTotal
	// N1ShortHours are the hours of the rows in which at least one of the
	// case's N-1 contingencies (plant contingency.go: the largest firing
	// boiler trips, an economiser is out, a listed failure) cannot be
	// carried, and N1ShortRows those rows; N1CheckedRows counts the rows
	// whose contingencies were answered (none when the plant's option
	// turns them off).
	N1ShortHours  float64
	N1ShortRows   []int
	N1CheckedRows int
	// InertGasShortHours are the hours of the rows whose inert-gas check
	// (plant inertgas.go) is not met.
	InertGasShortHours float64
}

// GradeTotal is the boiler fuel burnt of one grade, and its CO2, tonnes:
// by the regulatory factor (CO2T) and by the analysis carbon
// (CO2AnalysisT, when HasCO2Analysis).
type GradeTotal struct {
	Grade          string
	FuelT, CO2T    float64
	CO2AnalysisT   float64
	HasCO2Analysis bool
}

// PhaseTotals are the totals of one phase.
type PhaseTotals struct {
	Phase string
	Totals
}

// Result is a solved profile: every row, the totals by phase in the order
// phases first appear, and the totals of the whole profile.
type Result struct {
	Rows   []RowResult
	Phases []PhaseTotals
	Total  Totals
}

// Validate checks the rows: a positive number of hours each.
func Validate(rows []Row) error {
	if len(rows) == 0 {
		return fmt.Errorf("profile has no rows")
	}
	for i, r := range rows {
		if !(r.Hours > 0) || math.IsInf(r.Hours, 0) {
			pos := r.Case.Pos.String()
			if pos != "" {
				pos += ": "
			}
			return fmt.Errorf("%sprofile row %d (%q): hours must be positive; got %g", pos, i+1, r.Case.Name, r.Hours)
		}
	}
	return nil
}

// Run solves every row of the profile on p and its clones and sums the
// results. It stops at the first row that fails, reporting it.
func Run(ctx context.Context, p *plant.Plant, rows []Row, opt Options) (*Result, error) {
	if err := Validate(rows); err != nil {
		return nil, err
	}
	if err := checkStateSettings(rows, opt.Tanks, "voyage"); err != nil {
		return nil, err
	}
	if err := p.Check(); err != nil {
		return nil, err
	}
	opt.defaults()
	if len(opt.Tanks) > 0 {
		var progress func(int)
		if opt.Progress != nil {
			progress = func(done int) { opt.Progress(done, len(rows)) }
		}
		res, err := runStateful(ctx, p, rows, opt.Tanks, progress, &Texts{}, opt.KeepResults)
		if err != nil {
			return nil, err
		}
		return Sum(res), nil
	}
	res := make([]RowResult, len(rows))
	texts := &Texts{}
	nChunks := (len(rows) + opt.ChunkRows - 1) / opt.ChunkRows
	chunk := func(c int) (lo, hi int) { return c * opt.ChunkRows, min((c+1)*opt.ChunkRows, len(rows)) }
	done := 0
	var progress func(int)
	if opt.Progress != nil {
		progress = func(c int) {
			lo, hi := chunk(c)
			done += hi - lo
			opt.Progress(done, len(rows))
		}
	}
	err := forEach(ctx, p, nChunks, opt.Workers, func(ctx context.Context, pl *plant.Plant, c int) error {
		defer summaryOnly(pl, opt.KeepResults)()
		pl.ColdStart()
		lo, hi := chunk(c)
		for i := lo; i < hi; i++ {
			cr, err := pl.Solve(ctx, rows[i].Case)
			if err != nil {
				return fmt.Errorf("profile row %d (%s, %q): %w", i+1, rows[i].Phase, rows[i].Case.Name, err)
			}
			res[i] = rowResult(i, rows[i], cr, texts, opt.KeepResults)
		}
		return nil
	}, progress)
	if err != nil {
		return nil, err
	}
	return Sum(res), nil
}

// Sum builds the totals of solved rows, in their order, from their
// summaries; the result holds rows itself.
func Sum(rows []RowResult) *Result {
	out := &Result{Rows: rows}
	byPhase := map[string]int{}
	for i, r := range rows {
		k, ok := byPhase[r.Phase]
		if !ok {
			k = len(out.Phases)
			byPhase[r.Phase] = k
			out.Phases = append(out.Phases, PhaseTotals{Phase: r.Phase, Totals: newTotals()})
		}
		out.Phases[k].add(i, r.Hours, &r.Summary)
	}
	out.Total = newTotals()
	for i := range rows {
		out.Total.add(i, rows[i].Hours, &rows[i].Summary)
	}
	return out
}

// addGrade adds fuel and CO2 (tonnes) of a grade: by its regulatory
// factor and, when the fuel has an analysis, by its analysis.
func (t *Totals) addGrade(grade string, fuel, co2, co2a float64, hasAnalysis bool) {
	for i := range t.FuelByGrade {
		g := &t.FuelByGrade[i]
		if g.Grade == grade {
			g.FuelT += fuel
			g.CO2T += co2
			g.CO2AnalysisT += co2a
			g.HasCO2Analysis = g.HasCO2Analysis && hasAnalysis
			return
		}
	}
	t.FuelByGrade = append(t.FuelByGrade, GradeTotal{Grade: grade, FuelT: fuel, CO2T: co2, CO2AnalysisT: co2a, HasCO2Analysis: hasAnalysis})
}

func newTotals() Totals {
	return Totals{TightestMarginKgS: math.Inf(1), PeakRow: -1, TightestRow: -1}
}

func (t *Totals) add(i int, hours float64, cr *RowSummary) {
	s := hours * 3600 / 1000 // kg/s over the row → t
	t.Rows++
	t.Hours += hours
	t.FuelT += cr.FuelKgS * s
	t.CO2T += cr.CO2KgS * s
	t.CO2AnalysisT += cr.CO2AnalysisKgS * s
	t.CO2AnalysisUnknown = t.CO2AnalysisUnknown || cr.CO2AnalysisUnknown
	t.SteamT += cr.SteamProductionKgS * s
	t.EGESteamT += cr.EGESteamKgS * s
	t.DumpedT += cr.DumpedKgS * s
	t.MakeUpT += cr.MakeUpKgS * s
	t.FuelSavedT += cr.EGEFuelSavedKgS * s
	for _, e := range cr.EGEs {
		t.EGEFoulingLostT += e.FoulingLostKgS * s
	}
	t.ElectricMWh += cr.ElectricW * hours / 1e6
	for len(t.HoursFiring) <= cr.BoilersFiring {
		t.HoursFiring = append(t.HoursFiring, 0)
	}
	t.HoursFiring[cr.BoilersFiring] += hours
	for _, f := range cr.Fuels {
		t.addGrade(f.Grade, f.FuelKgS*s, f.CO2KgS*s, f.CO2AnalysisKgS*s, f.HasCO2Analysis)
	}
	t.CapacityKgS = cr.MCRKgS
	// A row takes the peak or the tightest margin from an earlier one only
	// by more than a part in 1e9 of the capacity: rows that tie within the
	// solver's tolerance (the same hour of two seasons) keep the first, not
	// the one the last bits of their solves favour.
	tie := 1e-9 * cr.MCRKgS
	if fired := cr.BoilerSteamKgS; t.PeakRow < 0 || fired > t.PeakBoilerKgS+tie {
		t.PeakBoilerKgS, t.PeakRow = fired, i
	}
	if t.TightestRow < 0 || cr.MarginNextKgS < t.TightestMarginKgS-tie {
		t.TightestMarginKgS, t.TightestRow = cr.MarginNextKgS, i
	}
	if !cr.CanCarry {
		t.ShortRows = append(t.ShortRows, i)
	}
	if cr.InertGasShort {
		t.InertGasShortHours += hours
	}
	if cr.N1Checked {
		t.N1CheckedRows++
		if !cr.N1CanCarry {
			t.N1ShortHours += hours
			t.N1ShortRows = append(t.N1ShortRows, i)
		}
	}
	if len(cr.Warnings) > 0 {
		t.WarningRows = append(t.WarningRows, i)
	}
}
