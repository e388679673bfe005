package profile

import (
	"context"
	"fmt"
	"math"

	"steamcase/plant"
)

// Variant is one version of a plant in a study: the same plant with some
// parameters set for every row (an exhaust-gas economiser out of service,
// or of another size).
type Variant struct {
	Name string
	Set  []plant.Setting
}

// Economics are the money figures of a study. Zero values leave the money
// figures out.
type Economics struct {
	FuelPrice     float64 // per tonne of boiler fuel
	InstalledCost float64 // of the change, in the same currency
	Currency      string
}

// VariantResult is one variant over the profile.
type VariantResult struct {
	Name   string
	Totals Totals
	// Against the base variant (the first):
	FuelSavedT   float64
	CO2AvoidedT  float64
	CostSaved    float64 // FuelSavedT × FuelPrice
	PaybackYears float64 // InstalledCost / CostSaved per year, when both are given; +Inf if nothing is saved
	// HoursBelowMinGasT is the hours in which an exhaust-gas economiser's
	// gas would leave below its minimum (with or without a bypass).
	HoursBelowMinGasT float64 // RowWarnings are the warnings of the rows whose case warned, in row
	// order: the texts, not only their count.
	RowWarnings []RowWarnings
}

// RowWarnings are the warnings of one row of a profile (Row from 0).
type RowWarnings struct {
	Row   int
	Texts []string
}

// StudyResult compares variants over a profile.
type StudyResult struct {
	Hours    float64 // of the profile
	Variants []VariantResult
	Economics
}

// Study runs the profile once per variant and compares each with the first.
// For the payback the savings are scaled to a year of 8760 h (by
// 8760 / the profile's hours; a profile of 8760 h is one year as it is).
func Study(ctx context.Context, p *plant.Plant, rows []Row, variants []Variant, econ Economics, opt Options) (*StudyResult, error) {
	if len(variants) < 2 {
		return nil, fmt.Errorf("a study needs at least two variants (a base and one to compare); got %d", len(variants))
	}
	if err := Validate(rows); err != nil {
		return nil, err
	}
	if econ.FuelPrice < 0 || econ.InstalledCost < 0 || math.IsNaN(econ.FuelPrice+econ.InstalledCost) {
		return nil, fmt.Errorf("fuel price and installed cost must not be negative")
	}
	out := &StudyResult{Economics: econ}
	for _, r := range rows {
		out.Hours += r.Hours
	}
	perYear := 8760 / out.Hours
	for _, v := range variants {
		vr := make([]Row, len(rows))
		for i, r := range rows {
			c := r.Case
			c.Set = append(append([]plant.Setting(nil), r.Case.Set...), v.Set...)
			vr[i] = Row{Phase: r.Phase, Hours: r.Hours, Case: c}
		}
		res, err := Run(ctx, p, vr, opt)
		if err != nil {
			return nil, fmt.Errorf("variant %q: %w", v.Name, err)
		}
		x := VariantResult{Name: v.Name, Totals: res.Total}
		for i, row := range res.Rows {
			if w := row.Result.Warnings; len(w) > 0 {
				x.RowWarnings = append(x.RowWarnings, RowWarnings{Row: i, Texts: append([]string(nil), w...)})
			}
			for _, e := range row.Result.EGEs {
				if e.BelowMin {
					x.HoursBelowMinGasT += vr[i].Hours
					break
				}
			}
		}
		out.Variants = append(out.Variants, x)
	}
	base := out.Variants[0].Totals
	for i := range out.Variants {
		v := &out.Variants[i]
		v.FuelSavedT = base.FuelT - v.Totals.FuelT
		v.CO2AvoidedT = base.CO2T - v.Totals.CO2T
		v.CostSaved = v.FuelSavedT * econ.FuelPrice
		if econ.InstalledCost > 0 && econ.FuelPrice > 0 && i > 0 {
			perYearSaved := v.CostSaved * perYear
			if perYearSaved > 0 {
				v.PaybackYears = econ.InstalledCost / perYearSaved
			} else {
				v.PaybackYears = math.Inf(1)
			}
		}
	}
	return out, nil
}
