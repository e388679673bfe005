package profile

import (
	"context"
	"fmt"
	"math"
	"math/rand/v2"
	"sort"

	"steamcase/plant"
	"steamcase/plant/internal/root"
)

// Streams of the audit's generators (see Audit).
const (
	streamFixed = 1 << 63
	streamClaim = 1 << 62
)

// dayEval solves one day of an audit with chosen values of the uncertain
// inputs.
type dayEval struct {
	a    *auditor
	pl   *plant.Plant
	ctx  context.Context
	day  Day
	c    plant.Case
	nUnc int // len(c.Set) with the uncertain inputs' settings
	// vals holds the present value of each uncertain input.
	vals []float64
}

func (a *auditor) newEval(ctx context.Context, pl *plant.Plant, d int) *dayEval {
	day := a.spec.Days[d]
	base := len(day.Case.Set)
	maxOff := 0
	for _, c := range a.spec.Causes {
		maxOff = max(maxOff, len(c.Units))
	}
	e := &dayEval{a: a, pl: pl, ctx: ctx, day: day, c: day.Case, vals: make([]float64, len(a.unc))}
	e.c.Set = make([]plant.Setting, base, base+len(a.unc)+maxOff)
	copy(e.c.Set, day.Case.Set)
	for j, u := range a.unc {
		if a.setAt[j] >= 0 {
			e.c.Set = append(e.c.Set, plant.Setting{Unit: u.Unit, Param: u.Param, Pos: u.Pos})
		}
	}
	e.nUnc = len(e.c.Set)
	e.nominal()
	return e
}

// set gives uncertain input j the value v.
func (e *dayEval) set(j int, v float64) {
	e.vals[j] = v
	if at := e.a.setAt[j]; at >= 0 {
		e.c.Set[len(e.day.Case.Set)+at].Value = v
		return
	}
	switch e.a.unc[j].Param {
	case ReadingSea:
		e.c.Conditions.SeaT = e.day.Case.Conditions.SeaT + v
	case ReadingAir:
		e.c.Conditions.AirT = e.day.Case.Conditions.AirT + v
	}
}

// nominal sets every uncertain input to its nominal value.
func (e *dayEval) nominal() {
	for j, u := range e.a.unc {
		e.set(j, u.Nominal)
	}
}

// tonnes is a flow in kg/s over the day's hours, t.
func (e *dayEval) tonnes(kgPerS float64) float64 { return kgPerS * e.day.Hours * 3.6 }

// solve solves the day with the values set and the given units off.
func (e *dayEval) solve(off []string) (*plant.CaseResult, error) {
	e.c.Set = e.c.Set[:e.nUnc]
	for _, u := range off {
		e.c.Set = append(e.c.Set, plant.Setting{Unit: u, Param: "off", Value: 1, Pos: e.day.Pos})
	}
	cr, err := e.pl.Solve(e.ctx, e.c)
	e.c.Set = e.c.Set[:e.nUnc]
	return cr, err
}

// quantity is the audited quantity with the values set: the day's boiler
// fuel, or the claimed cause's share of it; and the case with everything
// on.
func (e *dayEval) quantity() (float64, *plant.CaseResult, error) {
	cr, err := e.solve(nil)
	if err != nil {
		return 0, nil, err
	}
	q := e.tonnes(cr.FuelKgS)
	if e.a.claimsOf >= 0 {
		w, err := e.solve(e.a.spec.Causes[e.a.claimsOf].Units)
		if err != nil {
			return 0, nil, fmt.Errorf("with %s off: %w", e.a.spec.Causes[e.a.claimsOf].Name, err)
		}
		q -= e.tonnes(w.FuelKgS)
	}
	return q, cr, nil
}

// day solves day d: the nominal case and its causes, the implied
// factors, and (unless it is a reference day) the samples.
func (a *auditor) day(ctx context.Context, pl *plant.Plant, d int) error {
	pl.ColdStart()
	e := a.newEval(ctx, pl, d)
	day := e.day
	r := DayResult{Date: day.Date, Phase: day.Phase, Reference: day.Reference, ClaimedT: day.ClaimedT}
	cr, err := e.solve(nil)
	if err != nil {
		return err
	}
	var pred predictor
	pl.SaveStart(&pred.nominal)
	r.FuelT, r.CO2T = e.tonnes(cr.FuelKgS), e.tonnes(cr.CO2KgS)
	for _, b := range cr.Boilers {
		if b.FuelKgS > 0 {
			r.FuelByGrade = appendGrade(r.FuelByGrade, b.FuelName, e.tonnes(b.FuelKgS), e.tonnes(b.CO2KgS))
		}
	}
	r.Warnings = append([]string{}, cr.Warnings...)
	r.Shares = make([]float64, len(a.spec.Causes))
	for i, c := range a.spec.Causes {
		w, err := e.solve(c.Units)
		if err != nil {
			return fmt.Errorf("with %s off: %w", c.Name, err)
		}
		r.Shares[i] = r.FuelT - e.tonnes(w.FuelKgS)
	}
	r.NominalT = r.FuelT
	if a.claimsOf >= 0 {
		r.NominalT = r.Shares[a.claimsOf]
	}
	for _, idx := range a.implied {
		lo, hi, smin, smax := a.factorRange(idx)
		v, err := search(ctx, func(x float64) (float64, error) {
			for _, j := range idx {
				e.set(j, x)
			}
			q, _, err := e.quantity()
			return q - day.ClaimedT, err
		}, lo, hi, smin, smax, day.ClaimedT)
		e.nominal()
		if err != nil {
			return fmt.Errorf("implied %s: %w", factorName(a.unc, idx), err)
		}
		r.Implied = append(r.Implied, v)
	}
	if day.Reference {
		a.out.Days[d] = r
		return nil
	}
	n := a.opt.Samples
	q := make([]float64, n)
	if err := pred.directions(e); err != nil {
		return err
	}
	for k := 0; k < n; k++ {
		for i, j := range a.fixed {
			e.set(j, a.fixedDraws[k][i])
		}
		rng := rand.New(rand.NewPCG(a.opt.Seed, uint64(d)<<32|uint64(k)))
		for _, j := range a.daily {
			u := a.unc[j]
			e.set(j, u.Low+(u.High-u.Low)*rng.Float64())
		}
		pred.start(e)
		v, cr, err := e.quantity()
		if err != nil {
			return fmt.Errorf("sample %d: %w", k+1, err)
		}
		if len(cr.Warnings) > 0 {
			r.SampleWarnings++
		}
		q[k] = v
	}
	a.q[d] = q
	a.out.Days[d] = r
	return nil
}

// predictor gives each sample of a day its starting point: the day's
// nominal solution moved by the change each uncertain input makes to
// first order, from one solve per input at a quarter of its range above
// its nominal value (a secant): x₀ = x_nom + Σ_j (v_j − nom_j)/δ_j ·
// (x_j − x_nom), within the unknowns' bounds (plant.Plant.Predict). Each
// sample then starts from a point of its own inputs alone, so that its
// result does not depend on the samples solved before it (it did while
// each started from the last one), and within a second-order error of its
// solution, which takes fewer Newton steps. A sample that does not
// converge from there is solved from the plant's own guess, as any case
// whose warm start fails (plant.Plant.Solve).
type predictor struct {
	nominal plant.Start
	dirs    []plant.Start // the solution with input j moved by delta[j]
	delta   []float64     // zero for an input without a range
	w       []float64
	x       plant.Start
}

// directions solves the day once for each uncertain input moved from its
// nominal value, all others nominal. A direction that does not solve is
// left out of the predictions.
func (pr *predictor) directions(e *dayEval) error {
	unc := e.a.unc
	pr.dirs = make([]plant.Start, len(unc))
	pr.delta = make([]float64, len(unc))
	pr.w = make([]float64, len(unc))
	for j, u := range unc {
		if !(u.High > u.Low) {
			continue
		}
		pr.delta[j] = (u.High - u.Low) / 4
		e.set(j, u.Nominal+pr.delta[j])
		e.pl.UseStart(&pr.nominal)
		_, err := e.solve(nil)
		e.set(j, u.Nominal)
		if err != nil {
			if e.ctx.Err() != nil {
				return e.ctx.Err()
			}
			pr.delta[j] = 0
			continue
		}
		e.pl.SaveStart(&pr.dirs[j])
	}
	return nil
}

// start gives the plant the starting point of the inputs set in e.
func (pr *predictor) start(e *dayEval) {
	for j, u := range e.a.unc {
		pr.w[j] = 0
		if pr.delta[j] > 0 {
			pr.w[j] = (e.vals[j] - u.Nominal) / pr.delta[j]
		}
	}
	e.pl.Predict(&pr.x, &pr.nominal, pr.dirs, pr.w)
	e.pl.UseStart(&pr.x)
}

// factorName names the factor of uncertain inputs idx.
func factorName(unc []ResolvedUncertain, idx []int) string {
	f := Factor{}
	for _, j := range idx {
		f.Targets = append(f.Targets, Target{Unit: unc[j].Unit, Param: unc[j].Param})
	}
	return f.Name()
}

// factorRange is a factor's plausible range (its first input's) and the
// range to search (the keys' ranges, all of them).
func (a *auditor) factorRange(idx []int) (lo, hi, smin, smax float64) {
	u := a.unc[idx[0]]
	lo, hi = u.Low, u.High
	smin, smax = math.Inf(-1), math.Inf(1)
	for _, j := range idx {
		kl, kh, _ := keyRange(a.pl, a.unc[j].Unit, a.unc[j].Param)
		smin, smax = max(smin, kl), min(smax, kh)
	}
	return lo, hi, smin, smax
}

// search finds x with f(x) = 0 (f the model less the claim), starting
// from the plausible range [lo, hi] and widening it, side by side, within
// [smin, smax] until f changes sign; then Brent's method. A solve that
// fails outside the plausible range ends the search on that side (the
// plant cannot be solved beyond); inside it, it is an error. The model
// counts as giving the claim within 1e-8 of the claim (or 1e-9 t);
// a sign change that no value closes to that is a step of the model.
func search(ctx context.Context, f func(float64) (float64, error), lo, hi, smin, smax, claim float64) (ImpliedValue, error) {
	lo, hi = max(lo, smin), min(hi, smax)
	if lo > hi {
		lo, hi = smin, smax
	}
	ftol := 1e-8 * max(math.Abs(claim), 0.1)
	xtol := 1e-11 * max(1, math.Abs(hi))
	w := hi - lo
	if w == 0 {
		w = 0.01 * max(math.Abs(hi), (smax-smin)*0.01)
	}
	flo, err := f(lo)
	if err != nil {
		return ImpliedValue{}, err
	}
	if math.Abs(flo) <= ftol {
		return ImpliedValue{Value: lo, Status: ImpliedFound}, nil
	}
	fhi := flo
	if hi != lo {
		if fhi, err = f(hi); err != nil {
			return ImpliedValue{}, err
		}
	}
	if math.Abs(fhi-flo) <= ftol && (flo > 0) == (fhi > 0) {
		// Flat across the plausible range: see whether the factor has any
		// effect within the range searched.
		flat := true
		for _, x := range []float64{smin, smax} {
			if x == lo || x == hi {
				continue
			}
			fx, err := f(x)
			if err != nil && ctx.Err() != nil {
				return ImpliedValue{}, ctx.Err()
			}
			flat = flat && err == nil && math.Abs(fx-flo) <= ftol
		}
		if flat {
			return ImpliedValue{Status: ImpliedNoEffect}, nil
		}
	}
	// Widen until the sign changes: on the side the slope points to, or
	// on both in turn while the slope says nothing.
	downOK, upOK := lo > smin, hi < smax
	for step := w; (flo > 0) == (fhi > 0) && flo != 0 && fhi != 0 && (downOK || upOK); step *= 2 {
		if ctx.Err() != nil {
			return ImpliedValue{}, ctx.Err()
		}
		above := flo > 0 // the model above the claim at both ends
		var goDown bool
		switch {
		case fhi > flo:
			goDown = above
		case fhi < flo:
			goDown = !above
		default:
			goDown = downOK
		}
		if goDown && !downOK {
			break
		}
		if !goDown && !upOK {
			break
		}
		if goDown {
			x := max(smin, lo-step)
			fx, err := f(x)
			if err != nil {
				downOK = false
				continue
			}
			hi, fhi = lo, flo
			lo, flo = x, fx
			downOK = x > smin
		} else {
			x := min(smax, hi+step)
			fx, err := f(x)
			if err != nil {
				upOK = false
				continue
			}
			lo, flo = hi, fhi
			hi, fhi = x, fx
			upOK = x < smax
		}
	}
	if (flo > 0) == (fhi > 0) && flo != 0 && fhi != 0 {
		// No sign change in the range searched.
		st, end := ImpliedAbove, lo
		if flo < 0 {
			st = ImpliedBelow
		}
		if math.Abs(fhi) < math.Abs(flo) {
			end = hi
		}
		return ImpliedValue{Value: end, Status: st}, nil
	}
	x, fx, _, err := root.Brent(f, lo, hi, flo, fhi, xtol, ftol*0.01, 200)
	if err != nil {
		return ImpliedValue{}, err
	}
	if math.Abs(fx) <= ftol {
		return ImpliedValue{Value: x, Status: ImpliedFound}, nil
	}
	return ImpliedValue{Value: x, Status: ImpliedStep}, nil
}

// drawFixed draws the fixed inputs of every sample.
func (a *auditor) drawFixed() {
	n := a.opt.Samples
	a.fixedDraws = make([][]float64, n)
	for k := range a.fixedDraws {
		rng := rand.New(rand.NewPCG(a.opt.Seed, streamFixed|uint64(k)))
		v := make([]float64, len(a.fixed))
		for i, j := range a.fixed {
			u := a.unc[j]
			v[i] = u.Low + (u.High-u.Low)*rng.Float64()
		}
		a.fixedDraws[k] = v
	}
}

// claimModel is the claim's measurement error: relative half-widths of a
// meter's bias and a density's error, and tonnes per sounding and per
// noon report.
type claimModel struct {
	meter, density, sounding, noon float64
}

// claimTerms resolves the sources of the claim's uncertainty.
func (a *auditor) claimTerms() error {
	res := a.out
	assume := func(item, value, source string) {
		res.Assumptions = append(res.Assumptions, AuditAssumption{Item: item, Value: value, Source: source})
	}
	seen := map[ClaimSource]bool{}
	var cm claimModel
	for _, c := range a.spec.Claim {
		if seen[c.Source] {
			return fmt.Errorf("%s: the claim's uncertainty gives %s twice", c.Pos, c.Source)
		}
		seen[c.Source] = true
		neg := func(what string, v float64) error {
			if !(v >= 0) || math.IsInf(v, 0) {
				return fmt.Errorf("%s: claim %s: %s must be zero or more; got %g", c.Pos, c.Source, what, v)
			}
			return nil
		}
		for _, chk := range []struct {
			what string
			v    float64
		}{{"accuracy", c.Accuracy}, {"volume", c.Volume}, {"mass", c.Mass}, {"density", c.Density}, {"density error", c.DensityError}} {
			if err := neg(chk.what, chk.v); err != nil {
				return err
			}
		}
		switch c.Source {
		case FlowMeter:
			acc := c.Accuracy
			if acc == 0 {
				acc = DefaultMeterAccuracy
				assume("flow meter accuracy", "± 1 % of reading (the default)", "from memory: fuel flow meters on board are commonly specified at ± 0.5 % to ± 1 % of reading")
			}
			if acc >= 1 {
				return fmt.Errorf("%s: claim flow meter: accuracy must be below 100 %%; got %g %%", c.Pos, 100*acc)
			}
			cm.meter = acc
			res.Claim = append(res.Claim, ClaimTerm{Source: c.Source, HalfWidth: acc,
				Text: fmt.Sprintf("± %g %% of the reading, the meter's bias, fixed for the period", 100*acc)})
		case Soundings, BDNDensity:
			if c.Density == 0 {
				return fmt.Errorf("%s: claim %s: the density is needed (from the bunker delivery note), such as density = \"985 kg/m3\"", c.Pos, c.Source)
			}
			if c.Density < 500 || c.Density > 1200 {
				return fmt.Errorf("%s: claim %s: a fuel's density lies between 500 and 1200 kg/m3; got %g kg/m3", c.Pos, c.Source, c.Density)
			}
			if c.Source == Soundings {
				v := c.Volume
				if v == 0 {
					v = DefaultSoundingVolume
					assume("sounding uncertainty", "± 0.5 m³ a sounding (the default)", "from memory: a sounding is read to about ± 1 cm, ± 0.5 m³ on a tank of 50 m² plan area")
				}
				cm.sounding = v * c.Density / 1000
				res.Claim = append(res.Claim, ClaimTerm{Source: c.Source, HalfWidth: cm.sounding,
					Text: fmt.Sprintf("± %g m³ a sounding at %g kg/m³ (± %.4g t); a day is the difference of two soundings", v, c.Density, cm.sounding)})
				assume("soundings", "the days are consecutive in the order given: the sounding that ends one day starts the next", "the audit's definition")
			} else {
				de := c.DensityError
				if de == 0 {
					de = DefaultDensityError
					assume("density uncertainty of the bunker delivery note", "± 1.5 kg/m³ (the default)", "from memory: of the order of the reproducibility of the density test methods ISO 8217 names")
				}
				cm.density = de / c.Density
				res.Claim = append(res.Claim, ClaimTerm{Source: c.Source, HalfWidth: cm.density,
					Text: fmt.Sprintf("± %g kg/m³ at %g kg/m³ (± %.3g %%), fixed for the period", de, c.Density, 100*cm.density)})
			}
		case NoonReport:
			m := c.Mass
			if m == 0 {
				m = DefaultNoonROBMass
				assume("noon report uncertainty", "± 1 t a remaining-on-board figure (the default)", "from memory: the figure rests on soundings of several tanks and is rounded")
			}
			cm.noon = m / 1000
			res.Claim = append(res.Claim, ClaimTerm{Source: c.Source, HalfWidth: cm.noon,
				Text: fmt.Sprintf("± %g t a remaining-on-board figure; a day is the difference of two reports", m/1000)})
		default:
			return fmt.Errorf("%s: unknown source of the claim's uncertainty %v", c.Pos, c.Source)
		}
	}
	if len(a.spec.Claim) == 0 {
		assume("measurement uncertainty of the claim", "none given: the claim is taken as exact", "the script")
	}
	a.cm = cm
	return nil
}

// halfWidth is the claim's measurement uncertainty, a half-width in
// tonnes, of a sum of days claiming claimed tonnes in runs consecutive
// runs of days (the errors of soundings and reports telescope within a
// run): the sources' half-widths added (a bound, not a quadrature sum).
func (cm claimModel) halfWidth(claimed float64, runs int) float64 {
	return (cm.meter+cm.density)*claimed + 2*float64(runs)*(cm.sounding+cm.noon)
}

// readings turns the model's samples of each day into what the claim's
// measurement would read: q[d][k] times the meter's and the density's
// errors of sample k, plus the errors of the soundings and reports that
// open and close day d. Reference days (q[d] nil) stay nil.
func (a *auditor) readings() [][]float64 {
	n, nd := a.opt.Samples, len(a.q)
	out := make([][]float64, nd)
	for d := range out {
		if a.q[d] != nil {
			out[d] = make([]float64, n)
		}
	}
	cm := a.cm
	s := make([]float64, nd+1)
	r := make([]float64, nd+1)
	for k := 0; k < n; k++ {
		rng := rand.New(rand.NewPCG(a.opt.Seed, streamClaim|uint64(k)))
		u := func(h float64) float64 { return h * (2*rng.Float64() - 1) }
		scale := 1.0
		if cm.meter > 0 {
			scale *= 1 + u(cm.meter)
		}
		if cm.density > 0 {
			scale *= 1 + u(cm.density)
		}
		for i := range s {
			s[i], r[i] = 0, 0
		}
		if cm.sounding > 0 {
			for i := range s {
				s[i] = u(cm.sounding)
			}
		}
		if cm.noon > 0 {
			for i := range r {
				r[i] = u(cm.noon)
			}
		}
		for d := range out {
			if out[d] != nil {
				out[d][k] = a.q[d][k]*scale + (s[d] - s[d+1]) + (r[d] - r[d+1])
			}
		}
	}
	return out
}

// calibrate finds the calibrated factor on the reference days and
// replaces its inputs' range and nominal value.
func (a *auditor) calibrate(ctx context.Context) error {
	cal := a.spec.Calibrate
	var evals []*dayEval
	claimed, runs, prev := 0.0, 0, false
	for d, day := range a.spec.Days {
		if day.Reference {
			evals = append(evals, a.newEval(ctx, a.pl, d))
			claimed += day.ClaimedT
			if !prev {
				runs++
			}
		}
		prev = day.Reference
	}
	idx := a.calTargets
	lo, hi, smin, smax := a.factorRange(idx)
	model := func(x float64) (float64, error) {
		var sum float64
		for _, e := range evals {
			for _, j := range idx {
				e.set(j, x)
			}
			cr, err := e.solve(nil)
			if err != nil {
				return 0, &DayError{Pos: e.day.Pos, Date: e.day.Date, Day: dayNumber(a.spec.Days, e.day), Err: err}
			}
			sum += e.tonnes(cr.FuelKgS)
		}
		return sum, nil
	}
	name := cal.Name()
	a.pl.ColdStart()
	mlo, err := model(lo)
	if err != nil {
		return fmt.Errorf("%s: calibrate %s: %w", cal.Pos, name, err)
	}
	mhi, err := model(hi)
	if err != nil {
		return fmt.Errorf("%s: calibrate %s: %w", cal.Pos, name, err)
	}
	if math.Abs(mhi-mlo) <= 1e-9*max(math.Abs(mlo), 1e-3) {
		return fmt.Errorf("%s: calibrate %s: the model of the %d reference days does not depend on it (%.6g t at %g and at %g): those days cannot calibrate it (do the boilers fire on them?)",
			cal.Pos, name, len(evals), mlo, lo, hi)
	}
	u := a.cm.halfWidth(claimed, runs)
	var vals [3]float64
	for i, target := range [3]float64{claimed, claimed - u, claimed + u} {
		a.pl.ColdStart()
		v, err := search(ctx, func(x float64) (float64, error) {
			m, err := model(x)
			return m - target, err
		}, lo, hi, smin, smax, target)
		if err != nil {
			return fmt.Errorf("%s: calibrate %s: %w", cal.Pos, name, err)
		}
		switch v.Status {
		case ImpliedAbove, ImpliedBelow:
			return fmt.Errorf("%s: calibrate %s: no value from %g to %g makes the model of the %d reference days give %.4g t (%s)",
				cal.Pos, name, smin, smax, len(evals), target, v.Status)
		case ImpliedStep:
			a.out.Warnings = append(a.out.Warnings, fmt.Sprintf("calibrate %s: the model of the reference days jumps across %.4g t at %.6g (a boiler starts or a burner cycles); the calibration takes that value", name, target, v.Value))
		}
		vals[i] = v.Value
	}
	u0 := a.unc[idx[0]]
	res := &CalibrationResult{Name: name, Targets: cal.Targets, Off: cal.Off, Value: vals[0],
		Low: min(vals[1], vals[2]), High: max(vals[1], vals[2]), Days: len(evals), ClaimedT: claimed,
		ReadingHalfWidthT: u, PriorLow: u0.Low, PriorHigh: u0.High}
	for _, j := range idx {
		a.unc[j].Low, a.unc[j].High, a.unc[j].Nominal = res.Low, res.High, res.Value
		a.unc[j].Calibrated = true
		a.unc[j].Why = fmt.Sprintf("calibrated on %d reference days", len(evals))
	}
	if res.Value < res.PriorLow || res.Value > res.PriorHigh {
		a.out.Warnings = append(a.out.Warnings, fmt.Sprintf("calibrate %s: the calibrated value %.4g lies outside the range given, %g to %g", name, res.Value, res.PriorLow, res.PriorHigh))
	}
	a.out.Calibration = res
	return nil
}

// dayNumber is the number (from 1) of day among days.
func dayNumber(days []Day, day Day) int {
	for i := range days {
		if days[i].Pos == day.Pos && days[i].Date == day.Date {
			return i + 1
		}
	}
	return 0
}

// finish builds the result from the days' samples.
func (a *auditor) finish() *AuditResult {
	res := a.out
	n := a.opt.Samples
	res.FixedDraws, res.FixedIndex = a.fixedDraws, a.fixed
	res.Uncertainties = a.unc
	audited := 0
	for _, d := range a.spec.Days {
		if !d.Reference {
			audited++
		}
	}
	res.DayTail = a.opt.Alpha / (2 * float64(audited))
	read := a.readings()
	per := Period{Days: audited, ModelT: make([]float64, n), ReadingT: make([]float64, n)}
	sorted := make([]float64, n)
	for d := range res.Days {
		r := &res.Days[d]
		res.FuelT += r.FuelT
		res.CO2T += r.CO2T
		for _, g := range r.FuelByGrade {
			res.FuelByGrade = appendGrade(res.FuelByGrade, g.Grade, g.FuelT, g.CO2T)
		}
		if r.Reference {
			continue
		}
		per.ClaimedT += r.ClaimedT
		per.NominalT += r.NominalT
		for k := 0; k < n; k++ {
			per.ModelT[k] += a.q[d][k]
			per.ReadingT[k] += read[d][k]
		}
		copy(sorted, a.q[d])
		sort.Float64s(sorted)
		r.LowT, r.MedianT, r.HighT = quantile(sorted, a.opt.Low), quantile(sorted, 0.5), quantile(sorted, a.opt.High)
		copy(sorted, read[d])
		sort.Float64s(sorted)
		r.ReadingLowT, r.ReadingHighT = quantile(sorted, a.opt.Low), quantile(sorted, a.opt.High)
		r.Percentile, r.PAtOrBelow, r.PAtOrAbove = rank(sorted, r.ClaimedT)
		switch {
		case r.PAtOrAbove < res.DayTail:
			r.Flag = "above"
		case r.PAtOrBelow < res.DayTail:
			r.Flag = "below"
		}
		if r.Flag != "" {
			res.Flagged++
		}
	}
	copy(sorted, per.ModelT)
	sort.Float64s(sorted)
	per.LowT, per.MedianT, per.HighT = quantile(sorted, a.opt.Low), quantile(sorted, 0.5), quantile(sorted, a.opt.High)
	copy(sorted, per.ReadingT)
	sort.Float64s(sorted)
	per.ReadingLowT, per.ReadingHighT = quantile(sorted, a.opt.Low), quantile(sorted, a.opt.High)
	per.Percentile, per.PAtOrBelow, per.PAtOrAbove = rank(sorted, per.ClaimedT)
	per.StdErr = math.Sqrt(per.PAtOrBelow * (1 - per.PAtOrBelow) / float64(n))
	switch {
	case per.PAtOrAbove < a.opt.Alpha/2:
		per.Flag = "above"
	case per.PAtOrBelow < a.opt.Alpha/2:
		per.Flag = "below"
	}
	res.Period = per
	if float64(n)*res.DayTail < 1 {
		need := int(math.Ceil(1 / res.DayTail))
		res.Warnings = append(res.Warnings, fmt.Sprintf("a day is flagged beyond its tail of %.3g %% (α/(2N) over %d days), finer than %d samples resolve: only a claim beyond every sample is flagged; give samples = %d or more",
			100*res.DayTail, audited, n, need))
	}

	// Causes over every day of the log.
	for i, c := range a.spec.Causes {
		ct := CauseTotal{Name: c.Name, Units: c.Units}
		for _, r := range res.Days {
			ct.FuelT += r.Shares[i]
		}
		res.Causes = append(res.Causes, ct)
	}
	if len(res.Causes) > 0 {
		res.BaseT = res.FuelT
		for _, c := range res.Causes {
			res.BaseT -= c.FuelT
		}
	}

	// Implied factors over the audited days.
	for i, idx := range a.implied {
		lo, hi, smin, smax := a.factorRange(idx)
		s := ImpliedSummary{Name: factorName(a.unc, idx), Low: lo, High: hi, SearchLow: smin, SearchHigh: smax}
		for _, j := range idx {
			s.Targets = append(s.Targets, Target{Unit: a.unc[j].Unit, Param: a.unc[j].Param})
		}
		var sum, sum2 float64
		for _, r := range res.Days {
			if r.Reference {
				continue
			}
			v := r.Implied[i]
			switch v.Status {
			case ImpliedFound:
				if s.Found == 0 {
					s.Min, s.Max = v.Value, v.Value
				}
				s.Found++
				sum += v.Value
				s.Min, s.Max = min(s.Min, v.Value), max(s.Max, v.Value)
				if v.Value < lo || v.Value > hi {
					s.Outside++
				}
			case ImpliedStep:
				s.Steps++
			case ImpliedAbove:
				s.Above++
			case ImpliedBelow:
				s.Below++
			case ImpliedNoEffect:
				s.NoEffect++
			}
		}
		if s.Found > 0 {
			s.Mean = sum / float64(s.Found)
			for _, r := range res.Days {
				if v := r.Implied[i]; !r.Reference && v.Status == ImpliedFound {
					sum2 += (v.Value - s.Mean) * (v.Value - s.Mean)
				}
			}
			if s.Found > 1 {
				s.SD = math.Sqrt(sum2 / float64(s.Found-1))
			}
		}
		res.Implied = append(res.Implied, s)
	}
	return res
}

// rank returns where x sits in sorted data: the mid-rank share (those
// below plus half those equal), and the shares at or below and at or
// above it.
func rank(sorted []float64, x float64) (mid, atOrBelow, atOrAbove float64) {
	n := float64(len(sorted))
	below := sort.SearchFloat64s(sorted, x) // first ≥ x
	upTo := sort.Search(len(sorted), func(i int) bool { return sorted[i] > x })
	eq := upTo - below
	mid = (float64(below) + 0.5*float64(eq)) / n
	return mid, float64(upTo) / n, float64(len(sorted)-below) / n
}

// quantile of sorted data by linear interpolation between order statistics
// (Hyndman and Fan 1996, definition 7; R's default, Excel's
// PERCENTILE.INC).
func quantile(sorted []float64, q float64) float64 {
	n := len(sorted)
	h := q * float64(n-1)
	i := int(math.Floor(h))
	if i >= n-1 {
		return sorted[n-1]
	}
	return sorted[i] + (h-float64(i))*(sorted[i+1]-sorted[i])
}

// appendGrade adds fuel and CO2 of a grade to a list in the order grades
// first appear.
func appendGrade(list []GradeTotal, grade string, fuel, co2 float64) []GradeTotal {
	for i := range list {
		if list[i].Grade == grade {
			list[i].FuelT += fuel
			list[i].CO2T += co2
			return list
		}
	}
	return append(list, GradeTotal{Grade: grade, FuelT: fuel, CO2T: co2})
}
