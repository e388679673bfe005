package profile

import (
	"context"
	"errors"
	"fmt"
	"math"
	"reflect"
	"sort"
	"strings"
	"testing"
	"time"

	"steamcase/plant"
)

// auditDays are n days of a loaded passage on the invented tanker: the
// engine at 70 %, sea 10 °C and air 5 °C, the cargo heating's duty
// varying from day to day (invented figures), claims zero.
func auditDays(n int) []Day {
	days := make([]Day, n)
	for d := range days {
		heat := 1.6e6 + 0.4e6*math.Sin(float64(d))
		days[d] = Day{Date: fmt.Sprintf("day %d", d+1), Phase: "loaded passage", Hours: 24,
			Pos: plant.Pos{File: "log.csv", Line: d + 2},
			Case: plant.Case{Name: "passage", Conditions: plant.Conditions{EngineLoad: 0.7, SeaT: 283.15, AirT: 278.15},
				Set: []plant.Setting{{Unit: "cargo heating", Param: "duty", Value: heat}}}}
	}
	return days
}

// mixed are uncertain inputs of both scopes: the heating factor and the
// boilers' efficiency fixed, the sea reading daily.
func mixed() []Uncertain {
	return []Uncertain{
		{Unit: "cargo heating", Param: "factor", Low: 0.9, High: 1.1},
		{Unit: "AB1", Param: "eta_factor", Low: 0.98, High: 1.02},
		{Unit: "AB2", Param: "eta_factor", Low: 0.98, High: 1.02},
		{Param: ReadingSea, Low: -1, High: 1},
		{Unit: "sundry", Param: "duty", Low: 250e3, High: 350e3},
	}
}

// withClaims returns days with claims: the quantity given per day.
func withClaims(days []Day, claim func(d int) float64) []Day {
	out := append([]Day(nil), days...)
	for d := range out {
		out[d].ClaimedT = claim(d)
	}
	return out
}

// TestAuditMedianClaim: a claim at the model's median of the period total
// (found with one seed) has P(model ≤ claim) ≈ 0.5 with another seed,
// within four standard errors: the binomial standard error √(p(1−p)/n) of
// the share and that of the median found, each about 0.5/√n (the
// statistics' own definitions).
func TestAuditMedianClaim(t *testing.T) {
	t.Parallel()
	p := tanker(t)
	days := auditDays(4)
	const n = 600
	probe, err := Audit(context.Background(), p, AuditSpec{Days: days, Uncertain: mixed()}, AuditOptions{Samples: n, Seed: 1})
	must(t, err)
	per := probe.Period
	if !(per.LowT < per.MedianT && per.MedianT < per.HighT) {
		t.Fatalf("probe: band %g < %g < %g", per.LowT, per.MedianT, per.HighT)
	}
	// Claims summing to the median, shared as the days' nominal figures.
	claimed := withClaims(days, func(d int) float64 { return per.MedianT * probe.Days[d].NominalT / per.NominalT })
	res, err := Audit(context.Background(), p, AuditSpec{Days: claimed, Uncertain: mixed()}, AuditOptions{Samples: n, Seed: 2})
	must(t, err)
	tol := 4 * math.Sqrt(0.25/n+0.25/n)
	if got := res.Period.PAtOrBelow; math.Abs(got-0.5) > tol {
		t.Errorf("P(model ≤ claim) = %.4f; want 0.5 ± %.3f", got, tol)
	}
	if math.Abs(res.Period.PAtOrBelow+res.Period.PAtOrAbove-1) > 1e-12 {
		t.Errorf("P(≤) %g and P(≥) %g do not add to 1 with no ties", res.Period.PAtOrBelow, res.Period.PAtOrAbove)
	}
	if se := res.Period.StdErr; math.Abs(se-math.Sqrt(res.Period.PAtOrBelow*(1-res.Period.PAtOrBelow)/n)) > 1e-15 {
		t.Errorf("standard error %g", se)
	}
	if res.Period.Flag != "" {
		t.Errorf("a claim at the median is flagged %q", res.Period.Flag)
	}
}

// TestAuditSteadyOverclaim: a claim 15 % above the model on every day,
// with the fixed inputs known to ±5 % and ±1 %, lies beyond the period
// total's upper tail; the claims at the model are not flagged (the
// flags' definition: the period beyond α/2 of its sampled total).
func TestAuditSteadyOverclaim(t *testing.T) {
	t.Parallel()
	p := tanker(t)
	days := auditDays(6)
	unc := []Uncertain{
		{Unit: "cargo heating", Param: "factor", Low: 0.95, High: 1.05},
		{Unit: "AB1", Param: "eta_factor", Low: 0.99, High: 1.01},
		{Unit: "AB2", Param: "eta_factor", Low: 0.99, High: 1.01},
		{Param: ReadingSea, Low: -1, High: 1},
		{Unit: "sundry", Param: "duty", Low: 250e3, High: 350e3},
	}
	opt := AuditOptions{Samples: 300, Seed: 5}
	nominal, err := Audit(context.Background(), p, AuditSpec{Days: days, Uncertain: unc}, opt)
	must(t, err)
	fair := withClaims(days, func(d int) float64 { return nominal.Days[d].NominalT })
	res, err := Audit(context.Background(), p, AuditSpec{Days: fair, Uncertain: unc}, opt)
	must(t, err)
	if res.Period.Flag != "" || res.Flagged != 0 {
		t.Errorf("claims at the nominal model: period flag %q, %d days flagged", res.Period.Flag, res.Flagged)
	}
	over := withClaims(days, func(d int) float64 { return 1.15 * nominal.Days[d].NominalT })
	res, err = Audit(context.Background(), p, AuditSpec{Days: over, Uncertain: unc, Claim: []ClaimError{{Source: FlowMeter, Accuracy: 0.01}}}, opt)
	must(t, err)
	if res.Period.Flag != "above" || !(res.Period.PAtOrAbove < res.Alpha/2) {
		t.Errorf("+15 %% every day: period flag %q, P(model ≥ claim) %g", res.Period.Flag, res.Period.PAtOrAbove)
	}
	for _, d := range res.Days {
		if !(d.Percentile > 0.5) {
			t.Errorf("%s: a claim 15 %% high sits at the %g percentile", d.Date, d.Percentile)
		}
	}
}

// TestAuditFixedBandIsSumQuantile: with every input fixed, the period's
// band is the quantile of the per-sample sums over the days, each sample
// solved here directly with its drawn values (the definition of the
// period total sampled as a whole; quantiles by Hyndman and Fan's
// definition 7, written out again here).
func TestAuditFixedBandIsSumQuantile(t *testing.T) {
	t.Parallel()
	p := tanker(t)
	days := auditDays(3)
	unc := []Uncertain{
		{Unit: "cargo heating", Param: "factor", Low: 0.8, High: 1.2, Scope: Fixed},
		{Unit: "AB1", Param: "eta_factor", Low: 0.96, High: 1.02, Scope: Fixed},
		{Unit: "AB2", Param: "eta_factor", Low: 0.96, High: 1.02},
	}
	const n = 40
	res, err := Audit(context.Background(), p, AuditSpec{Days: days, Uncertain: unc}, AuditOptions{Samples: n, Seed: 11, Low: 0.1, High: 0.9})
	must(t, err)
	if len(res.FixedDraws) != n || !reflect.DeepEqual(res.FixedIndex, []int{0, 1, 2}) {
		t.Fatalf("fixed draws %d, index %v", len(res.FixedDraws), res.FixedIndex)
	}
	q := p.Clone()
	sums := make([]float64, n)
	for k := 0; k < n; k++ {
		for _, d := range days {
			c := d.Case
			c.Set = append([]plant.Setting(nil), d.Case.Set...)
			for i, j := range res.FixedIndex {
				u := unc[j]
				c.Set = append(c.Set, plant.Setting{Unit: u.Unit, Param: u.Param, Value: res.FixedDraws[k][i]})
			}
			cr, err := q.Solve(context.Background(), c)
			must(t, err)
			sums[k] += cr.FuelKgS * d.Hours * 3.6
		}
		if math.Abs(sums[k]-res.Period.ModelT[k]) > 1e-8*sums[k] {
			t.Errorf("sample %d: %.9g t solved here, %.9g t in the audit", k+1, sums[k], res.Period.ModelT[k])
		}
	}
	sort.Float64s(sums)
	q7 := func(p float64) float64 {
		h := (n - 1) * p
		lo := math.Floor(h)
		return sums[int(lo)] + (h-lo)*(sums[int(lo)+1]-sums[int(lo)])
	}
	for _, c := range []struct {
		name      string
		got, want float64
	}{{"low", res.Period.LowT, q7(0.1)}, {"median", res.Period.MedianT, q7(0.5)}, {"high", res.Period.HighT, q7(0.9)}} {
		if math.Abs(c.got-c.want) > 1e-8*c.want {
			t.Errorf("period %s %.9g t; the quantile of the sums is %.9g t", c.name, c.got, c.want)
		}
	}
}

// TestAuditZeroUncertainty: inputs with no width and an exact claim give
// bands that collapse onto the nominal figure, for the days and the
// period (the definition of the band).
func TestAuditZeroUncertainty(t *testing.T) {
	t.Parallel()
	p := tanker(t)
	unc := []Uncertain{
		{Unit: "cargo heating", Param: "factor", Low: 1.05, High: 1.05},
		{Unit: "AB1", Param: "eta_factor", Low: 0.99, High: 0.99},
		{Param: ReadingSea, Low: 0.5, High: 0.5},
	}
	days := auditDays(3)
	res, err := Audit(context.Background(), p, AuditSpec{Days: days, Uncertain: unc}, AuditOptions{Samples: 20, Seed: 3})
	must(t, err)
	near := func(a, b float64) bool { return math.Abs(a-b) <= 1e-9*math.Abs(b) }
	for _, d := range res.Days {
		for _, v := range []float64{d.LowT, d.MedianT, d.HighT, d.ReadingLowT, d.ReadingHighT} {
			if !near(v, d.NominalT) {
				t.Errorf("%s: band %g..%g (reading %g..%g) around a nominal %g", d.Date, d.LowT, d.HighT, d.ReadingLowT, d.ReadingHighT, d.NominalT)
				break
			}
		}
	}
	per := res.Period
	if !near(per.LowT, per.NominalT) || !near(per.HighT, per.NominalT) || !near(per.MedianT, per.NominalT) {
		t.Errorf("period band %g..%g around a nominal %g", per.LowT, per.HighT, per.NominalT)
	}
	// Against a direct solve at the values given.
	c := days[0].Case
	c.Set = append(append([]plant.Setting(nil), c.Set...), plant.Setting{Unit: "cargo heating", Param: "factor", Value: 1.05},
		plant.Setting{Unit: "AB1", Param: "eta_factor", Value: 0.99})
	c.Conditions.SeaT += 0.5
	cr, err := p.Clone().Solve(context.Background(), c)
	must(t, err)
	if want := cr.FuelKgS * 86.4; !near(res.Days[0].NominalT, want) {
		t.Errorf("day 1 nominal %.9g t; solved directly %.9g t", res.Days[0].NominalT, want)
	}
}

// TestAuditImplied: each day's implied heating factor, substituted back
// into a fresh solve, gives the claim to 1e-6 (the definition of the
// implied factor); a claim the plant cannot come down to is reported as
// such.
func TestAuditImplied(t *testing.T) {
	t.Parallel()
	p := tanker(t)
	days := auditDays(4)
	days[3].Case.Conditions.EngineLoad = 0 // in port: the boilers carry the base load
	scale := []float64{0.9, 1.0, 1.2, 0}
	probe, err := Audit(context.Background(), p, AuditSpec{Days: days, Uncertain: mixed()}, AuditOptions{Samples: 10})
	must(t, err)
	claimed := withClaims(days, func(d int) float64 { return scale[d] * probe.Days[d].NominalT })
	claimed[3].ClaimedT = 0.01 // far below the plant's base load
	heat := Factor{Targets: []Target{{Unit: "cargo heating", Param: "factor"}}}
	boilers := Factor{Targets: []Target{{Unit: "AB1", Param: "eta_factor"}, {Unit: "AB2", Param: "eta_factor"}}}
	res, err := Audit(context.Background(), p, AuditSpec{Days: claimed, Uncertain: mixed(), Implied: []Factor{heat, boilers}},
		AuditOptions{Samples: 10})
	must(t, err)
	if res.Implied[0].Name != "cargo heating.factor" || res.Implied[1].Name != "AB1+AB2.eta_factor" {
		t.Errorf("names %q, %q", res.Implied[0].Name, res.Implied[1].Name)
	}
	for d, day := range res.Days[:3] {
		for f, v := range day.Implied {
			if v.Status != ImpliedFound {
				t.Errorf("%s: factor %d: %v at %g", day.Date, f, v.Status, v.Value)
				continue
			}
			c := claimed[d].Case
			c.Set = append([]plant.Setting(nil), c.Set...)
			for j, u := range res.Uncertainties {
				val := u.Nominal
				if (f == 0 && j == 0) || (f == 1 && (j == 1 || j == 2)) {
					val = v.Value
				}
				if u.Unit == "" {
					c.Conditions.SeaT += val
					continue
				}
				c.Set = append(c.Set, plant.Setting{Unit: u.Unit, Param: u.Param, Value: val})
			}
			cr, err := p.Clone().Solve(context.Background(), c)
			must(t, err)
			if got := cr.FuelKgS * 86.4; math.Abs(got-claimed[d].ClaimedT) > 1e-6*claimed[d].ClaimedT {
				t.Errorf("%s: factor %d = %.9g gives %.9g t; claimed %.9g t", day.Date, f, v.Value, got, claimed[d].ClaimedT)
			}
		}
	}
	if v := res.Days[1].Implied[0]; math.Abs(v.Value-1) > 1e-4 {
		t.Errorf("the claim at the nominal implies a heating factor of %g, not 1", v.Value)
	}
	if v := res.Days[3].Implied[0]; v.Status != ImpliedAbove || v.Value != 0.01 {
		t.Errorf("a claim of 0.01 t: %v at %g; want the model above the claim down to the key's least factor 0.01", v.Status, v.Value)
	}
	s := res.Implied[0]
	if s.Found != 3 || s.Above != 1 || s.Outside < 1 || !(s.Min < 1 && s.Max > 1.1) {
		t.Errorf("summary %+v", s)
	}
}

// TestAuditWorkers: the same seed gives the same audit on one worker and
// on four (every day is one job on its own generators).
func TestAuditWorkers(t *testing.T) {
	t.Parallel()
	days := withClaims(auditDays(5), func(d int) float64 { return 9 + float64(d) })
	spec := AuditSpec{Days: days, Uncertain: mixed(), Claim: []ClaimError{{Source: Soundings, Density: 985}},
		Implied: []Factor{{Targets: []Target{{Unit: "cargo heating", Param: "factor"}}}},
		Causes:  []Cause{{Name: "heating", Units: []string{"cargo heating"}}}}
	one, err := Audit(context.Background(), tanker(t), spec, AuditOptions{Samples: 30, Seed: 9, Workers: 1})
	must(t, err)
	four, err := Audit(context.Background(), tanker(t), spec, AuditOptions{Samples: 30, Seed: 9, Workers: 4})
	must(t, err)
	if !reflect.DeepEqual(one, four) {
		t.Errorf("the audit differs between one worker and four")
	}
}

// TestAuditReadings: with an exact model, the band of the readings is the
// claim's measurement error alone. A meter's ±a bias scales the reading
// by a uniform factor, so the band's 5 % end is at 1 − 0.9a; two
// soundings' errors of ±h differ by a triangular error on [−2h, 2h],
// whose 95 % quantile is (2 − √0.4)h, for a day and, as the errors
// telescope, for the whole period (the distributions' own definitions).
func TestAuditReadings(t *testing.T) {
	t.Parallel()
	p := tanker(t)
	days := withClaims(auditDays(5), func(int) float64 { return 10 })
	const n = 4000
	meter, err := Audit(context.Background(), p, AuditSpec{Days: days, Claim: []ClaimError{{Source: FlowMeter, Accuracy: 0.02}}},
		AuditOptions{Samples: n, Seed: 4})
	must(t, err)
	per := meter.Period
	// The quantile of a uniform sample of n: its standard error is about
	// √(q(1−q)/n) of the range.
	tol := 4 * math.Sqrt(0.05*0.95/n) * 2 * 0.02 * per.NominalT
	if want := per.NominalT * (1 - 0.9*0.02); math.Abs(per.ReadingLowT-want) > tol {
		t.Errorf("meter ±2 %%: reading band starts at %.5g t; want %.5g ± %.2g t", per.ReadingLowT, want, tol)
	}
	if math.Abs(per.LowT-per.NominalT) > 1e-9*per.NominalT {
		t.Errorf("the model's band %g moved with the meter", per.LowT)
	}
	sound, err := Audit(context.Background(), p, AuditSpec{Days: days, Claim: []ClaimError{{Source: Soundings, Volume: 1, Density: 1000}}},
		AuditOptions{Samples: n, Seed: 4})
	must(t, err)
	h := 1.0 // t a sounding
	want := (2 - math.Sqrt(0.4)) * h
	tol = 0.08 * h
	if got := sound.Period.ReadingHighT - sound.Period.NominalT; math.Abs(got-want) > tol {
		t.Errorf("soundings: the period reading's 95 %% end is %.4f t above the model; want %.4f (telescoped) ± %.2f", got, want, tol)
	}
	if got := sound.Days[2].ReadingHighT - sound.Days[2].NominalT; math.Abs(got-want) > tol {
		t.Errorf("soundings: a day's reading's 95 %% end is %.4f t above the model; want %.4f ± %.2f", got, want, tol)
	}
	if len(sound.Claim) != 1 || sound.Claim[0].HalfWidth != 1 {
		t.Errorf("claim terms %+v", sound.Claim)
	}
}

// TestAuditCalibration: reference days metered at the fuel of boilers 3 %
// less efficient than their table calibrate the boilers' factor to 0.97;
// the flow meter's ±1 % widens it to the factors giving the claim ∓ 1 %
// (the calibration's definition); a reference day with the heating on is
// refused at its line.
func TestAuditCalibration(t *testing.T) {
	t.Parallel()
	p := tanker(t)
	days := auditDays(5)
	for _, d := range []int{0, 1} {
		// At anchor with the heating off: the boilers carry the base load.
		days[d].Reference = true
		days[d].Case.Conditions.EngineLoad = 0
		days[d].Case.Set = append(append([]plant.Setting(nil), days[d].Case.Set...), plant.Setting{Unit: "cargo heating", Param: "off", Value: 1})
	}
	var truth float64
	for _, d := range days[:2] {
		c := d.Case
		c.Set = append(append([]plant.Setting(nil), c.Set...), plant.Setting{Unit: "AB1", Param: "eta_factor", Value: 0.97},
			plant.Setting{Unit: "AB2", Param: "eta_factor", Value: 0.97})
		cr, err := p.Clone().Solve(context.Background(), c)
		must(t, err)
		truth += cr.FuelKgS * 86.4
	}
	days[0].ClaimedT, days[1].ClaimedT = truth/2, truth/2
	for d := 2; d < 5; d++ {
		days[d].ClaimedT = 10
	}
	unc := []Uncertain{
		{Unit: "AB1", Param: "eta_factor", Low: 0.9, High: 1.05},
		{Unit: "AB2", Param: "eta_factor", Low: 0.9, High: 1.05},
		{Unit: "cargo heating", Param: "factor", Low: 0.9, High: 1.1},
	}
	cal := &Calibration{Factor: Factor{Targets: []Target{{Unit: "AB1", Param: "eta_factor"}, {Unit: "AB2", Param: "eta_factor"}}},
		Off: []string{"cargo heating"}}
	spec := AuditSpec{Days: days, Uncertain: unc, Calibrate: cal, Claim: []ClaimError{{Source: FlowMeter, Accuracy: 0.01}}}
	res, err := Audit(context.Background(), p, spec, AuditOptions{Samples: 20})
	must(t, err)
	c := res.Calibration
	if c == nil || math.Abs(c.Value-0.97) > 1e-6 || c.Days != 2 {
		t.Fatalf("calibration %+v; want 0.97 on 2 days", c)
	}
	// Fuel ∝ 1/η near the point: ±1 % of fuel is about ∓1 % of the factor.
	if !(c.Low < 0.97 && c.High > 0.97) || math.Abs((c.High-c.Low)/0.97-0.02) > 0.002 {
		t.Errorf("calibrated range %g to %g; want about 0.97 ∓ 1 %%", c.Low, c.High)
	}
	if u := res.Uncertainties[0]; !u.Calibrated || u.Nominal != c.Value || u.Low != c.Low {
		t.Errorf("the boilers' input after calibration: %+v", u)
	}
	if res.Period.Days != 3 || !res.Days[0].Reference || res.Days[0].Flag != "" {
		t.Errorf("period of %d days; day 1 reference %v", res.Period.Days, res.Days[0].Reference)
	}

	bad := append([]Day(nil), days...)
	bad[1].Case.Set = days[1].Case.Set[:1] // the heating left on
	_, err = Audit(context.Background(), p, AuditSpec{Days: bad, Uncertain: unc, Calibrate: cal}, AuditOptions{Samples: 10})
	var de *DayError
	if !errors.As(err, &de) || de.Pos.Line != 3 || !strings.Contains(err.Error(), `must have "cargo heating" off`) {
		t.Errorf("a reference day with the heating on: %v", err)
	}
}

// TestAuditSplitAndGrades: a day's heating share is its fuel less its
// fuel with the heating off (the split's definition), the causes and the
// base add up to the fuel, and a day burning MGO adds a grade whose CO2
// is its own.
func TestAuditSplitAndGrades(t *testing.T) {
	t.Parallel()
	p := tanker(t)
	days := withClaims(auditDays(3), func(int) float64 { return 10 })
	days[2].Case.Set = append(append([]plant.Setting(nil), days[2].Case.Set...),
		plant.Setting{Unit: "AB1", Param: "fuel", Text: "MGO"}, plant.Setting{Unit: "AB2", Param: "fuel", Text: "MGO"})
	spec := AuditSpec{Days: days, Causes: []Cause{{Name: "cargo heating", Units: []string{"cargo heating"}}, {Name: "sundry", Units: []string{"sundry"}}}}
	res, err := Audit(context.Background(), p, spec, AuditOptions{Samples: 10})
	must(t, err)
	d := days[0]
	c := d.Case
	c.Set = append(append([]plant.Setting(nil), c.Set...), plant.Setting{Unit: "cargo heating", Param: "off", Value: 1})
	cr, err := p.Clone().Solve(context.Background(), c)
	must(t, err)
	if want := res.Days[0].FuelT - cr.FuelKgS*86.4; math.Abs(res.Days[0].Shares[0]-want) > 1e-8*want {
		t.Errorf("heating share %.9g t; with and without solved here %.9g t", res.Days[0].Shares[0], want)
	}
	var causes float64
	for _, c := range res.Causes {
		causes += c.FuelT
	}
	if math.Abs(causes+res.BaseT-res.FuelT) > 1e-9*res.FuelT {
		t.Errorf("causes %g + base %g ≠ fuel %g", causes, res.BaseT, res.FuelT)
	}
	if len(res.FuelByGrade) != 2 || res.FuelByGrade[0].Grade != "HSFO" || res.FuelByGrade[1].Grade != "MGO" {
		t.Fatalf("grades %+v", res.FuelByGrade)
	}
	if g := res.FuelByGrade[1]; math.Abs(g.FuelT-res.Days[2].FuelT) > 1e-9 || math.Abs(g.CO2T-res.Days[2].CO2T) > 1e-9 {
		t.Errorf("MGO %+v; day 3 burns %g t with %g t CO2", g, res.Days[2].FuelT, res.Days[2].CO2T)
	}
	// The grade's own factor: MGO's C_F is 3.206 t CO2/t fuel, not the
	// HSFO's 3.114 (docs/reference/plant-checks.md §1.3 [S]).
	if f := res.FuelByGrade[1].CO2T / res.FuelByGrade[1].FuelT; math.Abs(f-3.206) > 1e-3 {
		t.Errorf("MGO's CO2 per tonne %g; want 3.206", f)
	}
}

func TestAuditErrors(t *testing.T) {
	t.Parallel()
	p := tanker(t)
	days := auditDays(2)
	ref := append([]Day(nil), days...)
	ref[0].Reference = true
	nodate := append([]Day(nil), days...)
	nodate[1].Date = " "
	for _, tc := range []struct {
		name string
		spec AuditSpec
		want string
	}{
		{"no date", AuditSpec{Days: nodate}, "log.csv:3: audit day 2 ( ): the day has no date"},
		{"scope", AuditSpec{Days: days, Uncertain: []Uncertain{{Unit: "AB1", Param: "cycling_loss", Low: 0, High: 0.01}}}, "has no default scope"},
		{"reading", AuditSpec{Days: days, Uncertain: []Uncertain{{Param: "engine", Low: -0.01, High: 0.01}}}, `only the readings "sea" and "air"`},
		{"reference", AuditSpec{Days: ref}, "log.csv:2: audit day 1 (day 1): the day is marked as a reference day, but the audit calibrates nothing"},
		{"claims of", AuditSpec{Days: days, ClaimsOf: "heating"}, `"heating", which is not one of the causes`},
		{"implied", AuditSpec{Days: days, Implied: []Factor{{Targets: []Target{{Unit: "AB1", Param: "eta_factor"}}}}}, "is not one of the uncertain inputs"},
		{"cause", AuditSpec{Days: days, Causes: []Cause{{Name: "x", Units: []string{"main"}}}}, `"main" cannot be switched off`},
		{"density", AuditSpec{Days: days, Claim: []ClaimError{{Source: Soundings}}}, "the density is needed"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, err := Audit(context.Background(), p, tc.spec, AuditOptions{Samples: 10})
			if err == nil || !strings.Contains(err.Error(), tc.want) {
				t.Errorf("error %v; want it to contain %q", err, tc.want)
			}
		})
	}
}

// TestOverruns: the projection stops a job only when the rest at the rate
// so far needs more than the time left by a quarter and a second.
func TestOverruns(t *testing.T) {
	t.Parallel()
	for _, tc := range []struct {
		done, total   int
		elapsed, left time.Duration
		over          bool
	}{
		{2, 30, 2 * time.Second, 10 * time.Second, true}, // needs 28 s
		{2, 30, 2 * time.Second, 30 * time.Second, false},
		{10, 30, 5 * time.Second, 8 * time.Second, false}, // needs 10 s: within a quarter and a second
		{10, 30, 5 * time.Second, 7 * time.Second, true},
		{30, 30, time.Hour, 0, false},
	} {
		if _, over := overruns(tc.done, tc.total, tc.elapsed, tc.left); over != tc.over {
			t.Errorf("%d of %d in %v with %v left: over %v", tc.done, tc.total, tc.elapsed, tc.left, over)
		}
	}
}

// TestOverrunStopsEarly: an audit that cannot finish within its deadline
// stops with an OverrunError, not at the deadline.
func TestOverrunStopsEarly(t *testing.T) {
	t.Parallel()
	// 300 days of 2000 samples on one worker: a day takes about a tenth
	// of a second (several tenths with the race detector), the whole far
	// longer than the deadline.
	days := auditDays(300)
	const limit = 5 * time.Second
	ctx, cancel := context.WithTimeout(context.Background(), limit)
	defer cancel()
	start := time.Now()
	_, err := Audit(ctx, tanker(t), AuditSpec{Days: days, Uncertain: mixed()}, AuditOptions{Samples: 2000, Workers: 1})
	var oe *OverrunError
	if !errors.As(err, &oe) {
		t.Fatalf("error %v; want an OverrunError", err)
	}
	if oe.Total != 300 || time.Since(start) >= limit {
		t.Errorf("%v after %v", oe, time.Since(start))
	}
}

func TestSearch(t *testing.T) {
	t.Parallel()
	// A step (a function that jumps across zero), which Brent's method
	// (plant/internal/root) closes onto.
	step := func(x float64) (float64, error) {
		if x < 0.3 {
			return -1, nil
		}
		return 1, nil
	}
	v, err := search(context.Background(), step, 0, 1, -10, 10, 1)
	if err != nil || v.Status != ImpliedStep || math.Abs(v.Value-0.3) > 1e-9 {
		t.Errorf("step: %+v %v", v, err)
	}
	lin := func(x float64) (float64, error) { return 2*x - 7, nil }
	v, err = search(context.Background(), lin, 0.9, 1.1, 0.01, 10, 1)
	if err != nil || v.Status != ImpliedFound || math.Abs(v.Value-3.5) > 1e-8 {
		t.Errorf("widened search: %+v %v", v, err)
	}
	v, _ = search(context.Background(), lin, 0.9, 1.1, 0.01, 3, 1)
	if v.Status != ImpliedBelow || v.Value != 3 {
		t.Errorf("beyond the range: %+v", v)
	}
}

// BenchmarkAudit30Days1000Samples audits 30 days of 1000 samples each on
// the test tanker, with fixed and daily inputs, the flow meter's
// uncertainty, two implied factors and a split, on GOMAXPROCS workers
// (issue 18's target: 0.5 s on two cores). It reports the wall time
// (ns/op) and the CPU seconds the process used (cpu-s/op).
func BenchmarkAudit30Days1000Samples(b *testing.B) {
	p := tanker(b)
	days := withClaims(auditDays(30), func(d int) float64 { return 9 + 0.1*float64(d%7) })
	spec := AuditSpec{Days: days, Uncertain: mixed(), Claim: []ClaimError{{Source: FlowMeter}},
		Implied: []Factor{{Targets: []Target{{Unit: "cargo heating", Param: "factor"}}},
			{Targets: []Target{{Unit: "AB1", Param: "eta_factor"}, {Unit: "AB2", Param: "eta_factor"}}}},
		Causes: []Cause{{Name: "cargo heating", Units: []string{"cargo heating"}}}}
	cpu0 := cpuSeconds()
	for b.Loop() {
		if _, err := Audit(context.Background(), p, spec, AuditOptions{Samples: 1000, Seed: 1}); err != nil {
			b.Fatal(err)
		}
	}
	// cpu-s/op is the process's CPU time: on a shared machine the wall
	// clock also counts the waits for a core.
	b.ReportMetric((cpuSeconds()-cpu0)/float64(b.N), "cpu-s/op")
	b.ReportMetric(30*1000, "samples/op")
}

// TestDefaultScopeKeys: every key with a default scope is a key a case may
// set on some kind (or a reading), so that the table names no key that
// does not exist (the table's own consistency; no outside source).
func TestDefaultScopeKeys(t *testing.T) {
	t.Parallel()
	caseKeys := map[string]bool{ReadingSea: true, ReadingAir: true}
	for _, k := range plant.Kinds() {
		for _, key := range k.Keys() {
			if key.Case {
				caseKeys[key.Name] = true
			}
		}
	}
	for _, key := range DefaultScopeKeys() {
		if !caseKeys[key] {
			t.Errorf("default scope for %q, which no kind lets a case set", key)
		}
		if s, why, ok := DefaultScope(key); !ok || s == ScopeDefault || why == "" {
			t.Errorf("%q: scope %v, reason %q", key, s, why)
		}
	}
	if _, _, ok := DefaultScope("cycling_loss"); ok {
		t.Errorf("cycling_loss has a default scope; the tests of a missing one need another key")
	}
}
