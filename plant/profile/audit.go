package profile

import (
	"context"
	"fmt"
	"math"
	"math/rand/v2"
	"runtime"
	"sort"

	"steamcase/plant"
)

// Uncertain is an input of the plant known only within a range: a unit's
// parameter drawn uniformly between Low and High for each sample (a
// consumer's duty factor for an uncertain U-value, a boiler's efficiency
// factor, a return fraction).
type Uncertain struct {
	Unit, Param string
	Low, High   float64
	Pos         plant.Pos
}

// Day is one day of a log under audit: the case the day's conditions give,
// its hours (24 for a whole day) and the boiler fuel reported for it.
type Day struct {
	Date     string
	Phase    string
	Hours    float64
	Case     plant.Case
	ClaimedT float64 // reported boiler fuel, tonnes
	Pos      plant.Pos
}

// AuditOptions control the sampling. Zero values mean the defaults.
type AuditOptions struct {
	Samples int     // per day; zero means 200
	Seed    uint64  // of the generator; the same seed gives the same band
	Low     float64 // lower quantile of the band; zero means 0.05
	High    float64 // upper quantile; zero means 0.95
	Workers int     // zero means GOMAXPROCS; the result does not depend on it
	// Progress, if not nil, is called after each day with days done and
	// the total, from one goroutine at a time.
	Progress func(done, total int)
}

// DayResult is one audited day.
type DayResult struct {
	Date, Phase string
	ClaimedT    float64
	// NominalT is the modelled fuel with every uncertain input at the
	// middle of its range; LowT and HighT the band's quantiles; MedianT
	// the samples' median.
	NominalT, LowT, MedianT, HighT float64
	// Flag is "above" or "below" when the claim lies outside the band,
	// else "".
	Flag string
}

// AuditResult is the whole audit.
type AuditResult struct {
	Days []DayResult
	// Totals over the days, tonnes. The band totals add the days' band
	// ends (a conservative band for the total: the days' errors are not
	// assumed to cancel).
	ClaimedT, NominalT, LowT, HighT float64
	// ExcessT is the sum, over days flagged above, of the claim beyond the
	// band's upper end.
	ExcessT float64
	// Flagged counts the days outside the band.
	Flagged       int
	Samples       int
	Seed          uint64
	LowQ, HighQ   float64
	Uncertainties []Uncertain
}

// Audit models each day's boiler fuel with its uncertain inputs sampled
// (Monte Carlo, uniform distributions, a seeded generator per day and
// sample so the result does not depend on the number of workers) and
// flags the days whose claim lies outside the band.
func Audit(ctx context.Context, p *plant.Plant, days []Day, unc []Uncertain, opt AuditOptions) (*AuditResult, error) {
	if len(days) == 0 {
		return nil, fmt.Errorf("audit has no days")
	}
	if opt.Samples == 0 {
		opt.Samples = 200
	}
	if opt.Low == 0 {
		opt.Low = 0.05
	}
	if opt.High == 0 {
		opt.High = 0.95
	}
	if opt.Samples < 10 || opt.Samples > 100000 {
		return nil, fmt.Errorf("audit samples must lie between 10 and 100000; got %d", opt.Samples)
	}
	if !(opt.Low > 0 && opt.Low < opt.High && opt.High < 1) {
		return nil, fmt.Errorf("audit band quantiles must satisfy 0 < low < high < 1; got %g and %g", opt.Low, opt.High)
	}
	for _, u := range unc {
		if !(u.Low <= u.High) || math.IsInf(u.Low, 0) || math.IsInf(u.High, 0) {
			return nil, fmt.Errorf("%s: uncertain %s of %q: range [%g, %g] is not a range", u.Pos, u.Param, u.Unit, u.Low, u.High)
		}
	}
	for i, d := range days {
		if !(d.Hours > 0) || math.IsNaN(d.ClaimedT) || d.ClaimedT < 0 {
			return nil, fmt.Errorf("%s: audit day %d (%s): hours must be positive and the claimed fuel zero or more; got %g h and %g t", d.Pos, i+1, d.Date, d.Hours, d.ClaimedT)
		}
	}
	rows := make([]Row, len(days))
	for i, d := range days {
		rows[i] = Row{Phase: d.Phase, Hours: d.Hours, Case: d.Case}
	}
	if err := checkStateSettings(rows, nil, "audit"); err != nil {
		return nil, err
	}
	if err := p.Check(); err != nil {
		return nil, err
	}
	workers := opt.Workers
	if workers <= 0 {
		workers = runtime.GOMAXPROCS(0)
	}
	out := &AuditResult{Days: make([]DayResult, len(days)), Samples: opt.Samples, Seed: opt.Seed,
		LowQ: opt.Low, HighQ: opt.High, Uncertainties: unc}
	done := 0
	var progress func(int)
	if opt.Progress != nil {
		progress = func(int) {
			done++
			opt.Progress(done, len(days))
		}
	}
	err := forEach(ctx, p, len(days), workers, func(ctx context.Context, pl *plant.Plant, d int) error {
		r, err := auditDay(ctx, pl, days[d], d, unc, opt, make([]float64, opt.Samples))
		if err != nil {
			return fmt.Errorf("audit day %d (%s): %w", d+1, days[d].Date, err)
		}
		out.Days[d] = r
		return nil
	}, progress)
	if err != nil {
		return nil, err
	}
	for _, d := range out.Days {
		out.ClaimedT += d.ClaimedT
		out.NominalT += d.NominalT
		out.LowT += d.LowT
		out.HighT += d.HighT
		if d.Flag != "" {
			out.Flagged++
		}
		if d.Flag == "above" {
			out.ExcessT += d.ClaimedT - d.HighT
		}
	}
	return out, nil
}

// auditDay solves one day: the nominal case, then the samples in order,
// each from a generator seeded by (seed, day, sample).
func auditDay(ctx context.Context, pl *plant.Plant, d Day, idx int, unc []Uncertain, opt AuditOptions, fuel []float64) (DayResult, error) {
	pl.ColdStart()
	base := len(d.Case.Set)
	c := d.Case
	c.Set = make([]plant.Setting, base, base+len(unc))
	copy(c.Set, d.Case.Set)
	for _, u := range unc {
		c.Set = append(c.Set, plant.Setting{Unit: u.Unit, Param: u.Param, Value: 0.5 * (u.Low + u.High), Pos: u.Pos})
	}
	cr, err := pl.Solve(ctx, c)
	if err != nil {
		return DayResult{}, err
	}
	tonnes := func(cr *plant.CaseResult) float64 { return cr.FuelKgS * d.Hours * 3.6 }
	r := DayResult{Date: d.Date, Phase: d.Phase, ClaimedT: d.ClaimedT, NominalT: tonnes(cr)}
	for k := range fuel {
		rng := rand.New(rand.NewPCG(opt.Seed, uint64(idx)<<32|uint64(k)))
		for j, u := range unc {
			c.Set[base+j].Value = u.Low + (u.High-u.Low)*rng.Float64()
		}
		cr, err := pl.Solve(ctx, c)
		if err != nil {
			return DayResult{}, fmt.Errorf("sample %d: %w", k+1, err)
		}
		fuel[k] = tonnes(cr)
	}
	sort.Float64s(fuel)
	r.LowT = quantile(fuel, opt.Low)
	r.MedianT = quantile(fuel, 0.5)
	r.HighT = quantile(fuel, opt.High)
	switch {
	case d.ClaimedT > r.HighT:
		r.Flag = "above"
	case d.ClaimedT < r.LowT:
		r.Flag = "below"
	}
	return r, nil
}

// quantile of sorted data by linear interpolation between order statistics
// (the R-7 / Excel PERCENTILE.INC definition).
func quantile(sorted []float64, q float64) float64 {
	n := len(sorted)
	h := q * float64(n-1)
	i := int(math.Floor(h))
	if i >= n-1 {
		return sorted[n-1]
	}
	return sorted[i] + (h-float64(i))*(sorted[i+1]-sorted[i])
}
