package profile

import (
	"context"
	"fmt"
	"math"

	"steamcase/plant"
)

// Variant is one version of a plant in a study: the same plant with some
// parameters set for every row (an exhaust-gas economiser out of service,
// or of another size, drum pressure or pinch), and what it costs to
// install.
type Variant struct {
	Name string
	Set  []plant.Setting
	// InstalledCost is the variant's own installed cost, in the study's
	// currency, when HasCost. A variant without one costs
	// Economics.InstalledCost, except the first (the base), which then
	// costs nothing.
	InstalledCost float64
	HasCost       bool
}

// Economics are the money figures of a study. Zero values leave the money
// figures out.
type Economics struct {
	FuelPrice     float64 // per tonne of boiler fuel
	InstalledCost float64 // of each variant but the first that has no cost of its own
	Currency      string
	// CarbonPrice is the price of a tonne of CO2 emitted (an emissions
	// allowance or levy); the CO2 avoided earns it.
	CarbonPrice float64
	// LifeYears, if positive, is the life (whole years) over which the
	// net present value is taken at DiscountRate (a fraction a year, not
	// negative).
	LifeYears    int
	DiscountRate float64
}

// validate checks the money figures.
func (e Economics) validate() error {
	for _, x := range []struct {
		what string
		v    float64
	}{{"fuel price", e.FuelPrice}, {"installed cost", e.InstalledCost}, {"carbon price", e.CarbonPrice}} {
		if !(x.v >= 0) || math.IsInf(x.v, 0) {
			return fmt.Errorf("%s must be zero or more; got %g", x.what, x.v)
		}
	}
	if e.LifeYears < 0 || e.LifeYears > maxLifeYears {
		return fmt.Errorf("life must be 1 to %d years; got %d", maxLifeYears, e.LifeYears)
	}
	if !(e.DiscountRate >= 0) || e.DiscountRate > 1 {
		return fmt.Errorf("discount rate must lie between 0 and 100 %% a year; got %g %%", 100*e.DiscountRate)
	}
	return nil
}

// maxLifeYears bounds the life of an investment.
const maxLifeYears = 60

// HoursPerYear is the year a study's savings are scaled to.
const HoursPerYear = 8760

// Annuity is the present value of 1 a year received at the end of each of
// n years at discount rate r: (1 − (1 + r)^−n)/r, and n at r = 0 (the
// annuity factor of engineering economics, common practice).
func Annuity(r float64, n int) float64 {
	if r == 0 {
		return float64(n)
	}
	return (1 - math.Pow(1+r, -float64(n))) / r
}

// Money is what a variant (or a sweep's size) earns against the base.
type Money struct {
	// InstalledCost is its own, as used; the figures below take the
	// difference to the base's.
	InstalledCost float64
	// CostSaved is FuelSavedT × FuelPrice and CarbonSaved CO2AvoidedT ×
	// CarbonPrice, over the profile; AnnualSaving their sum scaled to a
	// year (by 8760 h / the profile's hours).
	CostSaved, CarbonSaved, AnnualSaving float64
	// PaybackYears is the extra installed cost over the annual saving,
	// when HasPayback (not for the base, nor without an extra cost or a
	// price); +Inf when nothing is saved.
	PaybackYears float64
	HasPayback   bool
	// NPV is −(extra installed cost) + AnnualSaving × Annuity(rate, life),
	// when the study has a life (StudyResult.HasNPV).
	NPV float64
}

// EGEHours are the hours of a profile flagged by its exhaust-gas
// economisers.
type EGEHours struct {
	// HoursBelowMinGasT: an economiser's gas would leave below its minimum
	// (with or without a bypass). HoursBelowAcidDew: the gas outlet comes
	// within the margin of the exhaust's acid dew point, or a preheating
	// section's feed or the drum's saturation lies below it.
	// HoursSootRisk: an economiser runs at a load or gas velocity where
	// soot builds up and soot fires are a known hazard.
	HoursBelowMinGasT, HoursBelowAcidDew, HoursSootRisk float64
}

// VariantResult is one variant over the profile.
type VariantResult struct {
	Name   string
	Totals Totals
	// Against the base variant (the first):
	FuelSavedT  float64
	CO2AvoidedT float64
	Money
	EGEHours
	// RowWarnings are the warnings of the rows whose case warned, in row
	// order: the texts, not only their count.
	RowWarnings []RowWarnings
	// Rows are the variant's rows, each with its summary and its full
	// case result, when the study kept them (Options.KeepResults); nil
	// otherwise.
	Rows []RowResult
}

// RowWarnings are the warnings of one row of a profile (Row from 0).
type RowWarnings struct {
	Row   int
	Texts []string
}

// rowWarnings lists the solved rows that warned, with their warnings (the
// summaries' texts, shared).
func rowWarnings(res []RowResult) []RowWarnings {
	var out []RowWarnings
	for i := range res {
		if w := res[i].Summary.Warnings; len(w) > 0 {
			out = append(out, RowWarnings{Row: i, Texts: w})
		}
	}
	return out
}

// Sweep is a series of sizes of one exhaust-gas economiser, each run over
// the profile like a variant and compared with the base: Param is "ua"
// (Values in W/K) or "pinch" (K), set on Unit together with Set for every
// size; each size costs Cost at its UA.
type Sweep struct {
	Unit, Param string
	Values      []float64
	Set         []plant.Setting
	Cost        CostLaw
}

// CostLaw is the installed cost of an economiser against its size, in the
// form of the six-tenths rule (R. Williams, Chemical Engineering 54(12),
// 1947, from memory; common practice for equipment cost):
//
//	cost = Fixed + RefCost·(UA/RefUA)^Exponent
//
// with UA the clean UA at the size's reference gas flow. Zero Exponent
// means 0.6.
type CostLaw struct {
	RefUA, RefCost, Exponent, Fixed float64
}

// DefaultCostExponent is the six-tenths rule's exponent.
const DefaultCostExponent = 0.6

// At returns the cost at a UA (W/K).
func (c CostLaw) At(ua float64) float64 {
	n := c.Exponent
	if n == 0 {
		n = DefaultCostExponent
	}
	return c.Fixed + c.RefCost*math.Pow(ua/c.RefUA, n)
}

func (c CostLaw) validate() error {
	if !(c.RefUA > 0) || math.IsInf(c.RefUA, 0) || !(c.RefCost > 0) || math.IsInf(c.RefCost, 0) {
		return fmt.Errorf("the sweep's cost needs a positive reference UA and a positive cost at it; got %g W/K and %g", c.RefUA, c.RefCost)
	}
	if c.Exponent != 0 && !(c.Exponent >= 0.1 && c.Exponent <= 1.5) {
		return fmt.Errorf("the sweep's cost exponent must lie between 0.1 and 1.5; got %g", c.Exponent)
	}
	if !(c.Fixed >= 0) || math.IsInf(c.Fixed, 0) {
		return fmt.Errorf("the sweep's fixed cost must be zero or more; got %g", c.Fixed)
	}
	return nil
}

// SweepPoint is one size of a sweep over the profile.
type SweepPoint struct {
	Value float64 // the size as Param gives it, SI
	UA    float64 // its clean UA at the reference gas flow, W/K
	Totals
	FuelSavedT, CO2AvoidedT float64
	Money
	EGEHours
	// Rows are the size's rows when the study kept them
	// (Options.KeepResults), as a variant's; nil otherwise.
	Rows []RowResult
}

// SweepResult is a sweep: its sizes in the order given, and Best, the
// index of the size with the highest NPV (the first of equals).
type SweepResult struct {
	Unit, Param string
	Cost        CostLaw
	Points      []SweepPoint
	Best        int
}

// StudyResult compares variants over a profile.
type StudyResult struct {
	Hours    float64 // of the profile
	Variants []VariantResult
	Economics
	// HasNPV says the money figures include an NPV (a life is given).
	HasNPV bool
	// Sweep is the sweep of sizes, if the study has one.
	Sweep *SweepResult
}

// StudySpec is what a study compares: its variants (the first the base),
// their economics, and optionally a sweep of an economiser's size.
type StudySpec struct {
	Variants  []Variant
	Economics Economics
	Sweep     *Sweep
}

// Study runs the profile once per variant and compares each with the
// first; see RunStudy.
func Study(ctx context.Context, p *plant.Plant, rows []Row, variants []Variant, econ Economics, opt Options) (*StudyResult, error) {
	return RunStudy(ctx, p, rows, StudySpec{Variants: variants, Economics: econ}, opt)
}

// maxSweepPoints bounds a sweep.
const maxSweepPoints = 100

// RunStudy runs the profile once per variant, and once per size of the
// sweep if there is one, and compares each with the first variant. For
// the money figures the savings are scaled to a year of 8760 h (by 8760 /
// the profile's hours; a profile of 8760 h is one year as it is). Every
// variant and size runs in chunks of rows, each chunk cold-started, on
// all workers, so the results do not depend on the number of workers.
func RunStudy(ctx context.Context, p *plant.Plant, rows []Row, spec StudySpec, opt Options) (*StudyResult, error) {
	variants, econ, sw := spec.Variants, spec.Economics, spec.Sweep
	if len(variants) < 2 {
		return nil, fmt.Errorf("a study needs at least two variants (a base and one to compare); got %d", len(variants))
	}
	if err := Validate(rows); err != nil {
		return nil, err
	}
	if err := econ.validate(); err != nil {
		return nil, err
	}
	for _, v := range variants {
		if v.HasCost && (!(v.InstalledCost >= 0) || math.IsInf(v.InstalledCost, 0)) {
			return nil, fmt.Errorf("variant %q: installed cost must be zero or more; got %g", v.Name, v.InstalledCost)
		}
	}
	if sw != nil {
		if err := sw.validate(p, econ); err != nil {
			return nil, err
		}
	}
	if err := p.Check(); err != nil {
		return nil, err
	}
	out := &StudyResult{Economics: econ, HasNPV: econ.LifeYears > 0}
	for _, r := range rows {
		out.Hours += r.Hours
	}

	// Every run: the variants, then the sweep's sizes.
	var sets [][]plant.Setting
	var names []string
	for _, v := range variants {
		sets, names = append(sets, v.Set), append(names, fmt.Sprintf("variant %q", v.Name))
	}
	if sw != nil {
		for _, x := range sw.Values {
			set := append(append([]plant.Setting(nil), sw.Set...), plant.Setting{Unit: sw.Unit, Param: sw.Param, Value: x})
			sets, names = append(sets, set), append(names, fmt.Sprintf("sweep of %s.%s at %g", sw.Unit, sw.Param, x))
		}
	}
	res, err := runVariants(ctx, p, rows, sets, names, opt)
	if err != nil {
		return nil, err
	}

	perYear := HoursPerYear / out.Hours
	cost := func(i int) float64 {
		switch v := variants[i]; {
		case v.HasCost:
			return v.InstalledCost
		case i > 0:
			return econ.InstalledCost
		}
		return 0
	}
	baseCost := cost(0)
	money := func(fuelSaved, co2Avoided, own float64, isBase bool) Money {
		m := Money{InstalledCost: own, CostSaved: fuelSaved * econ.FuelPrice, CarbonSaved: co2Avoided * econ.CarbonPrice}
		m.AnnualSaving = (m.CostSaved + m.CarbonSaved) * perYear
		extra := own - baseCost
		priced := econ.FuelPrice > 0 || econ.CarbonPrice > 0
		if !isBase && priced && extra > 0 {
			m.HasPayback = true
			m.PaybackYears = math.Inf(1)
			if m.AnnualSaving > 0 {
				m.PaybackYears = extra / m.AnnualSaving
			}
		}
		if out.HasNPV {
			m.NPV = -extra + m.AnnualSaving*Annuity(econ.DiscountRate, econ.LifeYears)
			if isBase {
				m.NPV = 0
			}
		}
		return m
	}

	kept := func(rr []RowResult) []RowResult {
		if opt.KeepResults {
			return rr
		}
		return nil
	}
	for i, v := range variants {
		out.Variants = append(out.Variants, VariantResult{Name: v.Name, Totals: Sum(res[i]).Total, EGEHours: egeHours(res[i], ""),
			RowWarnings: rowWarnings(res[i]), Rows: kept(res[i])})
	}
	base := out.Variants[0].Totals
	for i := range out.Variants {
		v := &out.Variants[i]
		v.FuelSavedT = base.FuelT - v.Totals.FuelT
		v.CO2AvoidedT = base.CO2T - v.Totals.CO2T
		v.Money = money(v.FuelSavedT, v.CO2AvoidedT, cost(i), i == 0)
	}
	if sw != nil {
		sr := &SweepResult{Unit: sw.Unit, Param: sw.Param, Cost: sw.Cost, Best: -1}
		for k, x := range sw.Values {
			rr := res[len(variants)+k]
			ua := designUA(rr, sw.Unit)
			if !(ua > 0) {
				return nil, fmt.Errorf("sweep of %s.%s at %g: the economiser's UA is not known (is it out of service in every row?)", sw.Unit, sw.Param, x)
			}
			pt := SweepPoint{Value: x, UA: ua, Totals: Sum(rr).Total, EGEHours: egeHours(rr, ""), Rows: kept(rr)}
			pt.FuelSavedT = base.FuelT - pt.FuelT
			pt.CO2AvoidedT = base.CO2T - pt.CO2T
			pt.Money = money(pt.FuelSavedT, pt.CO2AvoidedT, sw.Cost.At(ua), false)
			if sr.Best < 0 || pt.NPV > sr.Points[sr.Best].NPV {
				sr.Best = k
			}
			sr.Points = append(sr.Points, pt)
		}
		out.Sweep = sr
	}
	return out, nil
}

// validate checks a sweep against the plant and the economics.
func (s *Sweep) validate(p *plant.Plant, econ Economics) error {
	u := p.Component(s.Unit)
	if u == nil {
		return fmt.Errorf("sweep: the plant has no unit %q", s.Unit)
	}
	if _, ok := u.(*plant.ExhaustGasEconomiser); !ok {
		return fmt.Errorf("sweep: %q is a %s; a sweep of size is of an exhaust-gas economiser", s.Unit, u.Kind())
	}
	if s.Param != "ua" && s.Param != "pinch" {
		return fmt.Errorf("sweep: the size swept is \"ua\" or \"pinch\"; got %q", s.Param)
	}
	if len(s.Values) < 2 || len(s.Values) > maxSweepPoints {
		return fmt.Errorf("sweep: needs 2 to %d sizes; got %d", maxSweepPoints, len(s.Values))
	}
	if econ.LifeYears <= 0 || !(econ.FuelPrice > 0 || econ.CarbonPrice > 0) {
		return fmt.Errorf("sweep: the best size is the one of highest NPV: give a fuel price (or a carbon price), a life and a discount rate")
	}
	return s.Cost.validate()
}

// runVariants solves the rows once per set of settings (added to each
// row's own), chunk by chunk on all workers, and returns each run's rows:
// their summaries, and their case results if opt.KeepResults.
func runVariants(ctx context.Context, p *plant.Plant, rows []Row, sets [][]plant.Setting, names []string, opt Options) ([][]RowResult, error) {
	opt.defaults()
	if len(opt.Tanks) > 0 {
		return runStatefulVariants(ctx, p, rows, sets, names, opt)
	}
	if err := checkStateSettings(rows, nil, "study"); err != nil {
		return nil, err
	}
	nChunks := (len(rows) + opt.ChunkRows - 1) / opt.ChunkRows
	res := make([][]RowResult, len(sets))
	for i := range res {
		res[i] = make([]RowResult, len(rows))
	}
	texts := &Texts{}
	total := len(sets) * len(rows)
	done := 0
	chunk := func(c int) (lo, hi int) { return c * opt.ChunkRows, min((c+1)*opt.ChunkRows, len(rows)) }
	var progress func(int)
	if opt.Progress != nil {
		progress = func(k int) {
			lo, hi := chunk(k % nChunks)
			done += hi - lo
			opt.Progress(done, total)
		}
	}
	err := forEach(ctx, p, len(sets)*nChunks, opt.Workers, func(ctx context.Context, pl *plant.Plant, k int) error {
		v, c := k/nChunks, k%nChunks
		defer summaryOnly(pl, opt.KeepResults)()
		pl.ColdStart()
		lo, hi := chunk(c)
		for i := lo; i < hi; i++ {
			cs := rows[i].Case
			cs.Set = append(append([]plant.Setting(nil), rows[i].Case.Set...), sets[v]...)
			cr, err := pl.Solve(ctx, cs)
			if err != nil {
				return fmt.Errorf("%s: profile row %d (%s, %q): %w", names[v], i+1, rows[i].Phase, cs.Name, err)
			}
			res[v][i] = rowResult(i, rows[i], cr, texts, opt.KeepResults)
		}
		return nil
	}, progress)
	if err != nil {
		return nil, err
	}
	return res, nil
}

// egeHours counts the hours flagged by the economisers (unit "" for all).
func egeHours(res []RowResult, unit string) EGEHours {
	var h EGEHours
	for i := range res {
		var below, dew, soot bool
		for _, e := range res[i].Summary.EGEs {
			if unit != "" && e.Name != unit {
				continue
			}
			below = below || e.BelowMin
			dew = dew || e.BelowDewMargin
			soot = soot || e.SootRisk
		}
		if below {
			h.HoursBelowMinGasT += res[i].Hours
		}
		if dew {
			h.HoursBelowAcidDew += res[i].Hours
		}
		if soot {
			h.HoursSootRisk += res[i].Hours
		}
	}
	return h
}

// designUA is the named economiser's clean UA at its reference flow, from
// the first row that reports it.
func designUA(res []RowResult, unit string) float64 {
	for i := range res {
		for _, e := range res[i].Summary.EGEs {
			if e.Name == unit && e.DesignUA > 0 {
				return e.DesignUA
			}
		}
	}
	return 0
}

// runStatefulVariants runs each set's rows in order (the tanks carry their
// state from row to row), the sets in parallel, each on its own clone.
func runStatefulVariants(ctx context.Context, p *plant.Plant, rows []Row, sets [][]plant.Setting, names []string, opt Options) ([][]RowResult, error) {
	vrows := make([][]Row, len(sets))
	for v, set := range sets {
		vr := make([]Row, len(rows))
		for i, r := range rows {
			c := r.Case
			c.Set = append(append([]plant.Setting(nil), r.Case.Set...), set...)
			vr[i] = Row{Phase: r.Phase, Hours: r.Hours, Case: c}
		}
		if err := checkStateSettings(vr, opt.Tanks, "study"); err != nil {
			return nil, fmt.Errorf("%s: %w", names[v], err)
		}
		vrows[v] = vr
	}
	res := make([][]RowResult, len(sets))
	texts := &Texts{}
	done := 0
	var progress func(int)
	if opt.Progress != nil {
		progress = func(int) {
			done += len(rows)
			opt.Progress(done, len(sets)*len(rows))
		}
	}
	err := forEach(ctx, p, len(sets), opt.Workers, func(ctx context.Context, pl *plant.Plant, v int) error {
		r, err := runStateful(ctx, pl, vrows[v], opt.Tanks, nil, texts, opt.KeepResults)
		if err != nil {
			return fmt.Errorf("%s: %w", names[v], err)
		}
		res[v] = r
		return nil
	}, progress)
	if err != nil {
		return nil, err
	}
	return res, nil
}
