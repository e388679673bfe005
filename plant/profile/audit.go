package profile

import (
	"context"
	"errors"
	"fmt"
	"math"
	"runtime"
	"strings"
	"time"

	"steamcase/plant"
)

// Scope says how often an uncertain input is drawn in an audit.
type Scope int

// The scopes.
const (
	// ScopeDefault takes the scope DefaultScope gives the key.
	ScopeDefault Scope = iota
	// Fixed inputs are properties of the ship that do not change from
	// one day to the next (tank U-values, a boiler's efficiency, fouling):
	// drawn once per Monte Carlo sample for the whole period.
	Fixed
	// Daily inputs change from day to day (weather readings, daily
	// operating noise): drawn afresh for each day of each sample.
	Daily
)

func (s Scope) String() string {
	switch s {
	case Fixed:
		return "fixed"
	case Daily:
		return "daily"
	}
	return "default"
}

// Readings of a day's conditions that may be uncertain: an Uncertain with
// no Unit and one of these as its Param is an error of the day's reading,
// a temperature difference (K) added to it.
const (
	ReadingSea = "sea"
	ReadingAir = "air"
)

// Uncertain is an input of the plant known only within a range: a unit's
// parameter (a consumer's duty factor for an uncertain U-value, a
// boiler's efficiency factor, a return fraction), or, with no Unit, the
// error of a day's sea or air temperature reading (ReadingSea,
// ReadingAir: a difference in K added to the day's reading). It is drawn
// uniformly between Low and High (a rectangular distribution: all that a
// bound with no other knowledge says, GUM, JCGM 100:2008 §4.3.7, from
// memory), once per sample (Fixed) or once per day of each sample
// (Daily).
type Uncertain struct {
	Unit, Param string
	Low, High   float64
	Scope       Scope
	Pos         plant.Pos
}

// name is the input as messages name it: "cargo heating.factor" or "sea
// reading".
func (u Uncertain) name() string {
	if u.Unit == "" {
		return u.Param + " reading"
	}
	return u.Unit + "." + u.Param
}

// scopeDefaults are the scopes of uncertain keys that the script does not
// give, by key name, with the reason (common practice, no source). A key
// that is not here needs its scope given.
var scopeDefaults = [...]struct {
	key   string
	scope Scope
	why   string
}{
	{"factor", Fixed, "a consumer's duty factor stands for U-values and tank or system properties, which do not change from day to day"},
	{"eta_factor", Fixed, "a boiler's efficiency against the maker's figure changes with fouling and burner setting over months, not days"},
	{"returns", Fixed, "the condensate return fraction is set by the system's leaks and drains"},
	{"subcool", Fixed, "condensate subcooling is set by the heater and its trap"},
	{"return_T", Fixed, "the return temperature is set by the drain cooler"},
	{"heat_loss", Fixed, "a heat loss is set by the insulation"},
	{"ua", Fixed, "a heat exchanger's UA is a property of its surface and fouling"},
	{"preheat_ua", Fixed, "a heat exchanger's UA is a property of its surface and fouling"},
	{"eta", Fixed, "a pump's efficiency is a property of the pump"},
	{"mcr", Fixed, "a boiler's rating is a property of the boiler"},
	{"dryness", Fixed, "steam dryness is a property of the drum's separators"},
	{"ratio", Fixed, "an atomising-steam ratio is a burner setting"},
	{"margin", Fixed, "a feed pump's margin is a setting of the plant"},
	{"length", Fixed, "a steam-tracing length is a property of the ship"},
	{"density", Fixed, "a cargo's density is fixed for the voyage"},
	{ReadingSea, Daily, "a sea temperature reading is taken each day"},
	{ReadingAir, Daily, "an air temperature reading is taken each day"},
	{"duty", Daily, "a duty follows the day's operation"},
	{"steam", Daily, "a steam flow follows the day's operation"},
	{"power", Daily, "a turbine's power follows the day's operation"},
	{"flow", Daily, "a flow follows the day's operation"},
	{"head", Daily, "a cargo pump's head follows the day's operation"},
	{"T", Daily, "a temperature held or reached follows the day's operation"},
	{"from", Daily, "a heat-up's start temperature is the day's"},
	{"to", Daily, "a heat-up's end temperature is the day's"},
	{"duration", Daily, "a duration is the day's"},
	{"interval", Daily, "a soot-blowing interval is the day's practice"},
	{"blowdown", Daily, "blowdown is the day's practice"},
	{"inlet_T", Daily, "an inlet temperature follows the day's operation"},
	{"outlet_T", Daily, "an outlet temperature follows the day's operation"},
	{"target_viscosity", Daily, "a target viscosity follows the day's fuel"},
	{"inside_T", Daily, "an inside temperature is the day's"},
	{"room_T", Daily, "an engine-room temperature is the day's"},
	{"set_T", Daily, "a feed tank's set temperature is the day's"},
	{"production", Daily, "a fresh-water production is the day's"},
	{"p", Daily, "a reduced pressure is the day's setting"},
	{"drum", Daily, "a drum pressure is the day's setting"},
}

// DefaultScope returns the scope an uncertain key takes when the script
// does not give one, with the reason, and false for a key that has no
// default scope (its scope must be given).
func DefaultScope(param string) (Scope, string, bool) {
	for _, d := range scopeDefaults {
		if d.key == param {
			return d.scope, d.why, true
		}
	}
	return ScopeDefault, "", false
}

// DefaultScopeKeys lists the keys that have a default scope, in order.
func DefaultScopeKeys() []string {
	out := make([]string, len(scopeDefaults))
	for i, d := range scopeDefaults {
		out[i] = d.key
	}
	return out
}

// ClaimSource is how a claimed figure was measured.
type ClaimSource int

// The sources of a claim and what their uncertainty is.
const (
	// FlowMeter: a fuel flow meter, ± Accuracy of its reading. The error
	// is the meter's bias, drawn once per sample for the whole period.
	FlowMeter ClaimSource = iota + 1
	// Soundings: tank soundings, ± Volume per sounding at Density. A day's
	// consumption is the difference of two soundings, so its error is the
	// difference of two errors; consecutive days share a sounding, so the
	// errors of a run of days telescope to those of its first and last
	// soundings. Days are taken as consecutive in the order given.
	Soundings
	// NoonReport: the remaining-on-board figures of noon reports, ± Mass
	// each; a day's consumption is the difference of two, as for
	// soundings.
	NoonReport
	// BDNDensity: the density of the bunker delivery note that turned a
	// measured volume into a mass, ± DensityError at Density: a relative
	// error drawn once per sample (one bunker for the period).
	BDNDensity
)

func (s ClaimSource) String() string {
	switch s {
	case FlowMeter:
		return "flow meter"
	case Soundings:
		return "soundings"
	case NoonReport:
		return "noon report"
	case BDNDensity:
		return "bdn density"
	}
	return fmt.Sprintf("ClaimSource(%d)", int(s))
}

// Default uncertainties of a claim's sources, used when a ClaimError
// leaves its figure zero.
const (
	// DefaultMeterAccuracy is ± 1 % of reading (from memory: fuel flow
	// meters on board are commonly specified at ± 0.5 % to ± 1 % of
	// reading).
	DefaultMeterAccuracy = 0.01
	// DefaultSoundingVolume is ± 0.5 m³ per sounding (from memory: a
	// sounding is read to about ± 1 cm, ± 0.5 m³ on a tank of 50 m² plan
	// area, before trim and list corrections).
	DefaultSoundingVolume = 0.5
	// DefaultNoonROBMass is ± 1 t per noon report's remaining-on-board
	// figure (from memory: the figure rests on soundings of several tanks
	// and is rounded).
	DefaultNoonROBMass = 1000
	// DefaultDensityError is ± 1.5 kg/m³ (from memory: of the order of
	// the reproducibility of the density test methods ISO 8217 names).
	DefaultDensityError = 1.5
)

// ClaimError is one source of the claimed figure's measurement
// uncertainty. Zero figures take the defaults above, except Density,
// which Soundings and BDNDensity need.
type ClaimError struct {
	Source       ClaimSource
	Accuracy     float64 // FlowMeter: ± fraction of the reading
	Volume       float64 // Soundings: ± m³ per sounding
	Mass         float64 // NoonReport: ± kg per report
	Density      float64 // Soundings, BDNDensity: kg/m³ (from the BDN)
	DensityError float64 // BDNDensity: ± kg/m³
	Pos          plant.Pos
}

// Factor is a scalar an audit solves for or calibrates: one value given
// to every target (the efficiency factor of both boilers, say). Each
// target must be one of the audit's uncertain inputs, the first giving
// the factor's plausible range.
type Factor struct {
	Targets []Target
	Pos     plant.Pos
}

// Target is a unit's key.
type Target struct{ Unit, Param string }

// Name is the factor as the reports name it: "cargo heating.factor",
// "AB1+AB2.eta_factor" when the targets share their key.
func (f Factor) Name() string {
	if len(f.Targets) == 0 {
		return ""
	}
	same := true
	units := make([]string, len(f.Targets))
	for i, t := range f.Targets {
		units[i] = t.Unit
		same = same && t.Param == f.Targets[0].Param
	}
	if same {
		return strings.Join(units, "+") + "." + f.Targets[0].Param
	}
	parts := make([]string, len(f.Targets))
	for i, t := range f.Targets {
		parts[i] = t.Unit + "." + t.Param
	}
	return strings.Join(parts, "+")
}

// Calibration calibrates a fixed factor on the reference days: the days
// marked Reference, which must have every unit of Off switched off (the
// cargo heating, say, so that the day's fuel is the plant's own).
type Calibration struct {
	Factor
	Off []string
}

// Cause is a part of the plant whose fuel an audit splits out (the cargo
// heating, the cargo pumps): the units switched off together to find it.
type Cause struct {
	Name  string
	Units []string
	Pos   plant.Pos
}

// Day is one day of a log under audit: the case the day's conditions give,
// its hours (24 for a whole day) and the fuel reported for it. A
// reference day (Reference) calibrates the audit's Calibration and is
// not audited itself.
type Day struct {
	Date      string
	Phase     string
	Hours     float64
	Case      plant.Case
	ClaimedT  float64 // reported fuel, tonnes
	Reference bool
	Pos       plant.Pos
}

// AuditSpec is what an audit checks: the days, the uncertain inputs, how
// the claim was measured, what it claims, and what else to find.
type AuditSpec struct {
	Days      []Day
	Uncertain []Uncertain
	// Claim lists the sources of the claim's measurement uncertainty;
	// none takes the claim as exact (the report says so).
	Claim []ClaimError
	// ClaimsOf is "" when the days claim their whole boiler fuel, or the
	// name of one of Causes when they claim that cause's share.
	ClaimsOf string
	// Causes are split out of each day's fuel by with/without solves.
	Causes []Cause
	// Implied are the factors solved for each day so that the model
	// gives the claim.
	Implied []Factor
	// Calibrate, if not nil, is calibrated on the reference days.
	Calibrate *Calibration
}

// AuditOptions control the sampling. Zero values mean the defaults.
type AuditOptions struct {
	Samples int     // Monte Carlo samples; zero means 1000
	Seed    uint64  // of the generators; the same seed gives the same audit
	Low     float64 // lower quantile of the bands; zero means 0.05
	High    float64 // upper quantile; zero means 0.95
	// Alpha is the level of the flags: the period total is flagged when
	// it lies in either tail beyond Alpha/2, a day when it lies beyond
	// Alpha/(2N) of N audited days (Bonferroni), so that an honest log is
	// flagged anywhere with a chance of at most Alpha. Zero means 0.05.
	Alpha   float64
	Workers int // zero means GOMAXPROCS; the result does not depend on it
	// Progress, if not nil, is called after each day with days done and
	// the total, from one goroutine at a time.
	Progress func(done, total int)
}

// DayResult is one day of an audit. Tonnes; the audited quantity is the
// day's boiler fuel, or its cause's share when the audit claims one.
type DayResult struct {
	Date, Phase string
	Reference   bool
	ClaimedT    float64
	// NominalT is the audited quantity with every uncertain input at its
	// nominal value (the middle of its range, or its calibrated value);
	// LowT, MedianT and HighT the model's band and median over the
	// samples; ReadingLowT and ReadingHighT the band of what the claim's
	// measurement would read if the model were right (the model with the
	// claim's measurement error drawn; the model's band when the claim is
	// exact). Zero on a reference day, which is not sampled.
	NominalT, LowT, MedianT, HighT float64
	ReadingLowT, ReadingHighT      float64
	// Percentile is where the claim sits among those readings (the
	// mid-rank: the share below it plus half the share equal), and
	// PAtOrBelow and PAtOrAbove the shares at or below and at or above it.
	Percentile, PAtOrBelow, PAtOrAbove float64
	// Flag is "above" or "below" when the claim lies beyond the day's
	// tail level (AuditResult.DayTail), else "".
	Flag string
	// FuelT and CO2T are the day's modelled boiler fuel and CO2 at the
	// nominal inputs, and FuelByGrade the same by fuel grade.
	FuelT, CO2T float64
	FuelByGrade []GradeTotal
	// Shares are the nominal fuel of each cause (AuditSpec.Causes, in
	// order): the day's fuel less its fuel with the cause's units off.
	Shares []float64
	// Implied are the values of AuditSpec.Implied that make the model
	// give the claim, in order.
	Implied []ImpliedValue
	// Warnings are the texts of the nominal case's warnings;
	// SampleWarnings counts the samples whose case warned.
	Warnings       []string
	SampleWarnings int
}

// ImpliedStatus says how an implied factor's search ended.
type ImpliedStatus int

// The outcomes of the search for an implied factor.
const (
	// ImpliedFound: the model gives the claim at Value.
	ImpliedFound ImpliedStatus = iota
	// ImpliedStep: the model jumps across the claim at Value (a boiler
	// starts, a burner begins to cycle); no value gives the claim exactly.
	ImpliedStep
	// ImpliedAbove: the model stays above the claim over the whole search
	// range; Value is the end of the range searched.
	ImpliedAbove
	// ImpliedBelow: the model stays below the claim over the whole search
	// range; Value is the end of the range searched.
	ImpliedBelow
	// ImpliedNoEffect: the model does not depend on the factor on this
	// day (the cargo heating's factor on a day with the heating off);
	// Value is zero and means nothing.
	ImpliedNoEffect
)

func (s ImpliedStatus) String() string {
	switch s {
	case ImpliedFound:
		return "found"
	case ImpliedStep:
		return "step"
	case ImpliedAbove:
		return "model above claim"
	case ImpliedBelow:
		return "model below claim"
	case ImpliedNoEffect:
		return "no effect"
	}
	return fmt.Sprintf("ImpliedStatus(%d)", int(s))
}

// ImpliedValue is an implied factor on one day.
type ImpliedValue struct {
	Value  float64
	Status ImpliedStatus
}

// ImpliedSummary is an implied factor over the audited days.
type ImpliedSummary struct {
	Name    string
	Targets []Target
	// Low and High are its plausible range (its uncertain input's); the
	// search went from SearchLow to SearchHigh (the key's own range).
	Low, High, SearchLow, SearchHigh float64
	// Found counts the days where the model gives the claim; Mean, SD
	// (the sample standard deviation, n − 1), Min and Max are over them,
	// and Outside counts those outside the plausible range.
	Found, Outside                int
	Mean, SD, Min, Max            float64
	Steps, Above, Below, NoEffect int // days of the other outcomes
}

// CalibrationResult is a factor calibrated on the reference days.
type CalibrationResult struct {
	Name    string
	Targets []Target
	Off     []string
	// Value makes the model of the reference days give their claim;
	// Low and High their claim less and plus its measurement
	// uncertainty (ReadingHalfWidthT): the range the factor is drawn
	// from for the audited days, fixed for the period.
	Value, Low, High  float64
	Days              int
	ClaimedT          float64 // on the reference days
	ReadingHalfWidthT float64
	// PriorLow and PriorHigh are the range the script gave.
	PriorLow, PriorHigh float64
}

// Period is the audited days as a whole: the period's modelled total is
// sampled as a whole (for each sample, the sum over the days of that
// sample, its fixed inputs the same on every day) and its band is a
// quantile of those sums.
type Period struct {
	Days                      int // audited (reference days are not)
	ClaimedT, NominalT        float64
	LowT, MedianT, HighT      float64
	ReadingLowT, ReadingHighT float64
	// PAtOrBelow is the share of the samples whose reading (the model
	// with the claim's measurement error) is at or below the claim;
	// PAtOrAbove at or above; StdErr the Monte Carlo standard error of
	// PAtOrBelow, √(p(1−p)/n).
	PAtOrBelow, PAtOrAbove, StdErr float64
	// Percentile is where the claim sits among the readings (the
	// mid-rank share).
	Percentile float64
	// Flag is "above" when PAtOrAbove < Alpha/2, "below" when
	// PAtOrBelow < Alpha/2, else "".
	Flag string
	// ModelT and ReadingT are each sample's period total, in sample
	// order.
	ModelT, ReadingT []float64
}

// CauseTotal is a cause's nominal fuel over every day of the log.
type CauseTotal struct {
	Name  string
	Units []string
	FuelT float64
}

// ClaimTerm is a source of the claim's uncertainty as the audit used it.
type ClaimTerm struct {
	Source ClaimSource
	// HalfWidth is ± a fraction of the reading (FlowMeter, BDNDensity)
	// or ± tonnes per reading (Soundings, NoonReport).
	HalfWidth float64
	// Text says it in the script's terms ("± 0.5 m³ a sounding at 985
	// kg/m³").
	Text string
}

// AuditAssumption is an assumption an audit made: what, its value and
// where it comes from.
type AuditAssumption struct {
	Item, Value, Source string
}

// ResolvedUncertain is an uncertain input as the audit drew it: its
// scope, why, and its nominal value.
type ResolvedUncertain struct {
	Uncertain
	// Nominal is the middle of the range, or the calibrated value.
	Nominal float64
	// Why says where the scope comes from: "given", or the default's
	// reason.
	Why string
	// Calibrated is set when the range is a calibration's.
	Calibrated bool
}

// AuditResult is the whole audit.
type AuditResult struct {
	Days   []DayResult
	Period Period
	// Flagged counts the days flagged; DayTail is the tail level of a
	// day's flag, Alpha/(2N).
	Flagged int
	DayTail float64
	Samples int
	Seed    uint64
	// LowQ and HighQ are the bands' quantiles; Alpha the flags' level.
	LowQ, HighQ, Alpha float64
	// ClaimsOf is "" for the whole boiler fuel, else the cause claimed.
	ClaimsOf      string
	Uncertainties []ResolvedUncertain
	Claim         []ClaimTerm
	Implied       []ImpliedSummary
	Calibration   *CalibrationResult
	// Causes are the causes' nominal fuel over every day of the log and
	// BaseT what the causes do not account for: the base load and the
	// interaction of the causes (the fuel is not additive: part-load
	// efficiency, a burner's cycling), which is not shared out.
	Causes []CauseTotal
	BaseT  float64
	// FuelT, CO2T and FuelByGrade are the modelled boiler fuel and CO2
	// over every day of the log at the nominal inputs, in all and by
	// grade (CO2 by each grade's factor).
	FuelT, CO2T float64
	FuelByGrade []GradeTotal
	Assumptions []AuditAssumption
	Warnings    []string
	// FixedDraws holds, for each sample, the values of the fixed inputs
	// drawn for it, in the order FixedIndex gives (indexes into
	// Uncertainties): with the seed, what an auditor needs to solve any
	// sample again.
	FixedDraws [][]float64
	FixedIndex []int
}

// DayError is a fault of one day of an audit.
type DayError struct {
	Pos  plant.Pos
	Day  int // from 1
	Date string
	Err  error
}

func (e *DayError) Error() string {
	pre := ""
	if s := e.Pos.String(); s != "" {
		pre = s + ": "
	}
	return fmt.Sprintf("%saudit day %d (%s): %v", pre, e.Day, e.Date, e.Err)
}

func (e *DayError) Unwrap() error { return e.Err }

// DefaultAuditSamples is the Monte Carlo samples of an audit that gives
// none: enough for the tails of each day's band.
const DefaultAuditSamples = 1000

// OverrunError is an audit stopped early because, at the rate of its
// first days, it would not finish within its context's deadline.
type OverrunError struct {
	Done, Total int
	Elapsed     time.Duration
	Need, Left  time.Duration
}

func (e *OverrunError) Error() string {
	return fmt.Sprintf("audit stopped after %d of %d days: at the rate so far (%s for %d) it needs about %s more, and the time limit leaves %s",
		e.Done, e.Total, e.Elapsed.Round(time.Millisecond), e.Done, e.Need.Round(time.Second), e.Left.Round(time.Second))
}

// overruns says whether work of total pieces, done of which took elapsed,
// would run past the time left: the rest at the same rate needs more than
// the time left by a margin (a quarter and a second), so that the noise of
// the first pieces does not stop a job that would fit.
func overruns(done, total int, elapsed, left time.Duration) (need time.Duration, over bool) {
	if done <= 0 || done >= total {
		return 0, false
	}
	need = time.Duration(float64(elapsed) * float64(total-done) / float64(done))
	return need, need > left+left/4+time.Second
}

// Audit models each day's boiler fuel (or a cause's share of it) with
// the uncertain inputs sampled (Monte Carlo, uniform distributions), and
// compares the claims with what a measurement would read if the model
// were right: day by day (the claim's percentile; a flag at the
// Bonferroni level) and over the period as a whole (the period total
// sampled as a whole, its band, the share of samples at or below the
// claim and a flag). It solves, for each day, the implied factors (a
// bracketed Brent search over the solved plant), calibrates a factor on
// the reference days when asked, and splits each day's fuel into its
// causes by with/without solves at the nominal inputs.
//
// Random numbers come from PCG generators seeded by the seed and a
// stream: the fixed inputs of sample k from stream 2⁶³+k, in the order of
// the inputs; the daily inputs of day d (from 0) and sample k from stream
// d·2³²+k; the claim's measurement errors of sample k from stream 2⁶²+k
// (the meter's bias, the density's error, then one error per sounding and
// per noon report, days+1 of each, in that order). Each day is solved on
// one worker, its samples in order, so the result does not depend on the
// number of workers.
func Audit(ctx context.Context, p *plant.Plant, spec AuditSpec, opt AuditOptions) (*AuditResult, error) {
	a, err := newAuditor(p, spec, &opt)
	if err != nil {
		return nil, err
	}
	if err := a.pl.Check(); err != nil {
		return nil, err
	}
	if spec.Calibrate != nil {
		if err := a.calibrate(ctx); err != nil {
			return nil, err
		}
	}
	a.drawFixed()
	workers := opt.Workers
	if workers <= 0 {
		workers = runtime.GOMAXPROCS(0)
	}
	n := len(spec.Days)
	ctx, cancel := context.WithCancelCause(ctx)
	defer cancel(nil)
	start := time.Now()
	done := 0
	progress := func(int) {
		done++
		if opt.Progress != nil {
			opt.Progress(done, n)
		}
		if deadline, ok := ctx.Deadline(); ok && done >= min(workers, n) {
			elapsed := time.Since(start)
			left := time.Until(deadline)
			if need, over := overruns(done, n, elapsed, left); over {
				cancel(&OverrunError{Done: done, Total: n, Elapsed: elapsed, Need: need, Left: left})
			}
		}
	}
	err = forEach(ctx, a.pl, n, workers, func(ctx context.Context, pl *plant.Plant, d int) error {
		if err := a.day(ctx, pl, d); err != nil {
			var de *DayError
			if errors.As(err, &de) {
				return err
			}
			day := spec.Days[d]
			return &DayError{Pos: day.Pos, Day: d + 1, Date: day.Date, Err: err}
		}
		return nil
	}, progress)
	var oe *OverrunError
	if errors.As(context.Cause(ctx), &oe) {
		return nil, oe
	}
	if err != nil {
		return nil, err
	}
	return a.finish(), nil
}

// auditor is the state of one audit.
type auditor struct {
	pl   *plant.Plant // a clone of the caller's, without the EGE saving solves
	spec AuditSpec
	opt  AuditOptions
	unc  []ResolvedUncertain
	// setAt[j] is the index, after a day's own settings, of uncertain
	// input j's setting; -1 for a reading.
	setAt []int
	// implied[i] and calTargets are the indexes in unc of each factor's
	// targets.
	implied    [][]int
	calTargets []int
	claimsOf   int // index of the cause claimed, or -1
	fixed      []int
	daily      []int
	// fixedDraws[k] are the fixed inputs' values of sample k.
	fixedDraws [][]float64
	// q[d][k] is the audited quantity of day d in sample k, t; nil for a
	// reference day.
	q   [][]float64
	cm  claimModel
	out *AuditResult
}

// newAuditor checks the spec and resolves defaults, in the order a
// script gives them: the sampling, the days, the uncertain inputs, the
// causes, the factors, the claim's measurement.
func newAuditor(p *plant.Plant, spec AuditSpec, opt *AuditOptions) (*auditor, error) {
	if len(spec.Days) == 0 {
		return nil, fmt.Errorf("audit has no days")
	}
	if len(spec.Days) >= 1<<30 {
		return nil, fmt.Errorf("audit has %d days; at most %d are accepted", len(spec.Days), 1<<30-1)
	}
	res := &AuditResult{Days: make([]DayResult, len(spec.Days)), ClaimsOf: spec.ClaimsOf}
	if err := res.sampling(opt); err != nil {
		return nil, err
	}

	a := &auditor{spec: spec, opt: *opt, claimsOf: -1, out: res}
	a.pl = p.Clone()
	// The audit needs the fuel, not the saving, nor the N-1 answers, nor
	// the lines' states (none is in its result, and none warns).
	a.pl.Opt.NoEGESaving = true
	a.pl.Opt.NoContingencies = true
	a.pl.Opt.NoLineStates = true

	if err := checkAuditDays(spec); err != nil {
		return nil, err
	}
	if err := a.resolveUncertain(p); err != nil {
		return nil, err
	}
	if err := a.checkCauses(p); err != nil {
		return nil, err
	}
	if err := a.resolveFactors(p); err != nil {
		return nil, err
	}
	for i := range a.unc {
		switch a.unc[i].Scope {
		case Fixed:
			a.fixed = append(a.fixed, i)
		case Daily:
			a.daily = append(a.daily, i)
		}
	}

	// The claim's measurement.
	if err := a.claimTerms(); err != nil {
		return nil, err
	}
	a.q = make([][]float64, len(spec.Days))
	return a, nil
}

// assume records an assumption of the audit.
func (r *AuditResult) assume(item, value, source string) {
	r.Assumptions = append(r.Assumptions, AuditAssumption{Item: item, Value: value, Source: source})
}

// sampling fills in the defaults of the sampling's options, checks them
// and records them with the assumptions of the method.
func (r *AuditResult) sampling(opt *AuditOptions) error {
	if opt.Samples == 0 {
		opt.Samples = DefaultAuditSamples
		r.assume("samples", "1000 (the default)", "common practice, no source")
	}
	if opt.Low == 0 && opt.High == 0 {
		opt.Low, opt.High = 0.05, 0.95
		r.assume("band", "5 % to 95 % (the default)", "common practice, no source")
	}
	if opt.Alpha == 0 {
		opt.Alpha = 0.05
		r.assume("level of the flags", "5 % (the default)", "common practice, no source")
	}
	if opt.Samples < 10 || opt.Samples > 100000 {
		return fmt.Errorf("audit samples must lie between 10 and 100000; got %d", opt.Samples)
	}
	if !(opt.Low > 0 && opt.Low < opt.High && opt.High < 1) {
		return fmt.Errorf("audit band quantiles must satisfy 0 < low < high < 1; got %g and %g", opt.Low, opt.High)
	}
	if !(opt.Alpha > 0 && opt.Alpha < 1) {
		return fmt.Errorf("audit alpha must lie between 0 and 1; got %g", opt.Alpha)
	}
	r.Samples, r.Seed, r.LowQ, r.HighQ, r.Alpha = opt.Samples, opt.Seed, opt.Low, opt.High, opt.Alpha
	r.assume("distribution of the uncertain inputs", "uniform between low and high",
		"GUM (JCGM 100:2008) §4.3.7: a rectangular distribution for a bound with no other knowledge, from memory")
	r.assume("nominal inputs", "the middle of each range (a calibrated factor: its calibrated value)", "the audit's definition")
	r.assume("quantiles", "linear between order statistics (Hyndman and Fan 1996, definition 7)", "the statistics' own definition")
	r.assume("flags", fmt.Sprintf("the period total beyond %g %% in either tail; a day beyond α/(2N) in either tail (Bonferroni)", 100*opt.Alpha/2),
		"Bonferroni's inequality; common practice")
	return nil
}

// dayErrorf is a fault of day i (from 0) of an audit.
func dayErrorf(d Day, i int, format string, v ...any) error {
	return &DayError{Pos: d.Pos, Day: i + 1, Date: d.Date, Err: fmt.Errorf(format, v...)}
}

// checkAuditDays checks each day's date, hours and claim, and that some
// day is audited (not only reference days).
func checkAuditDays(spec AuditSpec) error {
	audited := 0
	for i, d := range spec.Days {
		if strings.TrimSpace(d.Date) == "" {
			return dayErrorf(d, i, "the day has no date")
		}
		if !(d.Hours > 0) || math.IsInf(d.Hours, 0) {
			return dayErrorf(d, i, "hours must be positive; got %g h", d.Hours)
		}
		if !(d.ClaimedT >= 0) || math.IsInf(d.ClaimedT, 0) {
			return dayErrorf(d, i, "the claimed fuel must be zero or more tonnes; got %g t", d.ClaimedT)
		}
		if d.Reference && spec.Calibrate == nil {
			return dayErrorf(d, i, "the day is marked as a reference day, but the audit calibrates nothing (give calibrate, or unmark the day)")
		}
		if !d.Reference {
			audited++
		}
	}
	if audited == 0 {
		return fmt.Errorf("audit has no day to audit: every day is a reference day")
	}
	return nil
}

// resolveUncertain checks the uncertain inputs (a range, given once, a
// unit of the plant or a reading), gives each its nominal value and its
// scope (the default for its key when the script gives none), and checks
// that every day gives the temperatures whose readings are uncertain.
func (a *auditor) resolveUncertain(p *plant.Plant) error {
	seen := map[string]bool{}
	nset := 0
	for _, u := range a.spec.Uncertain {
		if !(u.Low <= u.High) || math.IsInf(u.Low, 0) || math.IsInf(u.High, 0) {
			return fmt.Errorf("%s: uncertain %s: range [%g, %g] is not a range", u.Pos, u.name(), u.Low, u.High)
		}
		if seen[u.name()] {
			return fmt.Errorf("%s: uncertain %s is given twice", u.Pos, u.name())
		}
		seen[u.name()] = true
		r := ResolvedUncertain{Uncertain: u, Nominal: 0.5 * (u.Low + u.High), Why: "given"}
		if u.Unit == "" {
			if u.Param != ReadingSea && u.Param != ReadingAir {
				return fmt.Errorf("%s: uncertain %q has no unit; only the readings %q and %q may be given without one", u.Pos, u.Param, ReadingSea, ReadingAir)
			}
			a.setAt = append(a.setAt, -1)
		} else {
			if p.Component(u.Unit) == nil {
				return fmt.Errorf("%s: uncertain %s: the plant has no unit %q", u.Pos, u.name(), u.Unit)
			}
			a.setAt = append(a.setAt, nset)
			nset++
		}
		if r.Scope == ScopeDefault {
			s, why, ok := DefaultScope(u.Param)
			if !ok {
				return fmt.Errorf("%s: uncertain %s: say whether it is fixed (drawn once for the period: a property of the ship) or daily (drawn each day): key %q has no default scope", u.Pos, u.name(), u.Param)
			}
			r.Scope, r.Why = s, "default for "+u.Param+": "+why
			a.out.assume("scope of "+u.name(), s.String(), "the default for key "+u.Param+" ("+why+"); common practice, no source")
		}
		a.unc = append(a.unc, r)
	}
	for i, d := range a.spec.Days {
		for _, u := range a.unc {
			if u.Unit != "" {
				continue
			}
			t := d.Case.Conditions.SeaT
			if u.Param == ReadingAir {
				t = d.Case.Conditions.AirT
			}
			if t <= 0 {
				return dayErrorf(d, i, "the %s reading is uncertain, but the day gives no %s temperature", u.Param, u.Param)
			}
		}
	}
	return nil
}

// checkCauses checks the causes (a name of their own, units a case can
// switch off), that no day sets a tank's instruction (which belongs to a
// voyage: an audit solves each day on its own) and that a cause claimed
// is one of them.
func (a *auditor) checkCauses(p *plant.Plant) error {
	spec := a.spec
	names := map[string]bool{}
	for _, c := range spec.Causes {
		if c.Name == "" || names[c.Name] {
			return fmt.Errorf("%s: every cause needs a name of its own; got %q", c.Pos, c.Name)
		}
		names[c.Name] = true
		if len(c.Units) == 0 {
			return fmt.Errorf("%s: cause %q names no unit", c.Pos, c.Name)
		}
		for _, u := range c.Units {
			if err := canSwitchOff(p, u); err != nil {
				return fmt.Errorf("%s: cause %q: %v", c.Pos, c.Name, err)
			}
		}
	}
	stateRows := make([]Row, len(spec.Days))
	for i, d := range spec.Days {
		stateRows[i] = Row{Phase: d.Phase, Hours: d.Hours, Case: d.Case}
	}
	if err := checkStateSettings(stateRows, nil, "audit"); err != nil {
		return err
	}
	if spec.ClaimsOf != "" {
		for i, c := range spec.Causes {
			if c.Name == spec.ClaimsOf {
				a.claimsOf = i
			}
		}
		if a.claimsOf < 0 {
			return fmt.Errorf("the days claim the fuel of %q, which is not one of the causes split out", spec.ClaimsOf)
		}
	}
	if len(spec.Causes) > 0 {
		a.out.assume("split of the fuel by cause", "each cause's marginal share: the day's fuel less its fuel with the cause's units off, at the nominal inputs, all else as logged; the rest (the base load and the interaction of the causes) is not shared out",
			"the audit's definition")
	}
	return nil
}

// resolveFactors finds the uncertain inputs of each implied factor and
// of the calibrated one, and checks the calibration.
func (a *auditor) resolveFactors(p *plant.Plant) error {
	for _, f := range a.spec.Implied {
		idx, err := a.factorTargets(f)
		if err != nil {
			return fmt.Errorf("%s: implied %s: %v", f.Pos, f.Name(), err)
		}
		a.implied = append(a.implied, idx)
	}
	if c := a.spec.Calibrate; c != nil {
		return a.checkCalibration(p, c)
	}
	return nil
}

// checkCalibration checks the calibrated factor (fixed inputs only, the
// days claiming their whole fuel, units a case can switch off) and its
// reference days (at least one, each with those units off).
func (a *auditor) checkCalibration(p *plant.Plant, c *Calibration) error {
	spec := a.spec
	idx, err := a.factorTargets(c.Factor)
	if err != nil {
		return fmt.Errorf("%s: calibrate %s: %v", c.Pos, c.Name(), err)
	}
	for _, j := range idx {
		if a.unc[j].Scope != Fixed {
			return fmt.Errorf("%s: calibrate %s: %s is drawn daily; only a fixed input can be calibrated for the period", c.Pos, c.Name(), a.unc[j].name())
		}
	}
	if spec.ClaimsOf != "" {
		return fmt.Errorf("%s: calibrate %s: the reference days must claim their whole boiler fuel, but the days claim the fuel of %q", c.Pos, c.Name(), spec.ClaimsOf)
	}
	for _, u := range c.Off {
		if err := canSwitchOff(p, u); err != nil {
			return fmt.Errorf("%s: calibrate %s: off: %v", c.Pos, c.Name(), err)
		}
	}
	a.calTargets = idx
	refs := 0
	for i, d := range spec.Days {
		if !d.Reference {
			continue
		}
		refs++
		for _, u := range c.Off {
			if !isOff(p, d.Case, u) {
				return dayErrorf(d, i, "a reference day for calibrating %s must have %q off, but the day has it on (set %s.off = true on the day, or unmark it)", c.Name(), u, u)
			}
		}
	}
	if refs == 0 {
		return fmt.Errorf("%s: calibrate %s: no day is marked as a reference day", c.Pos, c.Name())
	}
	a.out.assume("calibration", "the factor that makes the nominal model of the reference days give their claim, the other inputs nominal; its range covers the reference days' measurement uncertainty only",
		"the audit's definition")
	return nil
}

// factorTargets finds the uncertain inputs a factor sets and checks that
// they share one range and that their key has a range to search.
func (a *auditor) factorTargets(f Factor) ([]int, error) {
	if len(f.Targets) == 0 {
		return nil, fmt.Errorf("names no unit")
	}
	var idx []int
	for _, t := range f.Targets {
		j := -1
		for i, u := range a.unc {
			if u.Unit == t.Unit && u.Param == t.Param {
				j = i
			}
		}
		if j < 0 {
			return nil, fmt.Errorf("%s.%s is not one of the uncertain inputs (its plausible range comes from there)", t.Unit, t.Param)
		}
		if _, _, ok := keyRange(a.pl, t.Unit, t.Param); !ok {
			return nil, fmt.Errorf("%s.%s has no range in the key registry to search within; imply a factor such as factor or eta_factor", t.Unit, t.Param)
		}
		if len(idx) > 0 {
			u0, u := a.unc[idx[0]], a.unc[j]
			if u.Low != u0.Low || u.High != u0.High {
				return nil, fmt.Errorf("%s and %s have different ranges ([%g, %g] and [%g, %g]); one factor needs one range",
					u0.name(), u.name(), u0.Low, u0.High, u.Low, u.High)
			}
		}
		idx = append(idx, j)
	}
	return idx, nil
}

// keyRange returns the registry's range of a unit's key, if it has one.
func keyRange(p *plant.Plant, unit, param string) (lo, hi float64, ok bool) {
	c := p.Component(unit)
	if c == nil {
		return 0, 0, false
	}
	for _, k := range c.Keys() {
		if k.Name == param && !(k.Min == 0 && k.Max == 0) {
			return k.Min, k.Max, true
		}
	}
	return 0, 0, false
}

// canSwitchOff checks that a unit has an "off" key a case may set.
func canSwitchOff(p *plant.Plant, unit string) error {
	c := p.Component(unit)
	if c == nil {
		return fmt.Errorf("the plant has no unit %q", unit)
	}
	for _, k := range c.Keys() {
		if k.Name == "off" && k.Case && k.Settable() {
			return nil
		}
	}
	return fmt.Errorf("%q cannot be switched off by a case (it has no key \"off\")", unit)
}

// isOff says whether a unit is off in a case: its own setting, then the
// case's settings of "off" in order.
func isOff(p *plant.Plant, c plant.Case, unit string) bool {
	off := false
	if u := p.Component(unit); u != nil {
		for _, k := range u.Keys() {
			if k.Name == "off" {
				v, _ := k.Get(u)
				off = v != 0
			}
		}
	}
	for _, s := range c.Set {
		if s.Unit == unit && s.Param == "off" {
			off = s.Value != 0
		}
	}
	return off
}

// AuditOutline checks an audit's spec as Audit does, without solving, and
// returns a result of the audit's shape with zero figures: the days, the
// inputs with their scopes, the implied factors and causes named, the
// assumptions. A check mode shows it.
func AuditOutline(p *plant.Plant, spec AuditSpec, opt AuditOptions) (*AuditResult, error) {
	a, err := newAuditor(p, spec, &opt)
	if err != nil {
		return nil, err
	}
	res := a.out
	res.Uncertainties = a.unc
	for i, d := range spec.Days {
		res.Days[i] = DayResult{Date: d.Date, Phase: d.Phase, Reference: d.Reference, ClaimedT: d.ClaimedT,
			Shares: make([]float64, len(spec.Causes)), Implied: make([]ImpliedValue, len(spec.Implied)), Warnings: []string{}}
		if !d.Reference {
			res.Period.Days++
			res.Period.ClaimedT += d.ClaimedT
		}
	}
	if res.Period.Days > 0 {
		res.DayTail = opt.Alpha / (2 * float64(res.Period.Days))
	}
	for _, c := range spec.Causes {
		res.Causes = append(res.Causes, CauseTotal{Name: c.Name, Units: c.Units})
	}
	for _, idx := range a.implied {
		lo, hi, smin, smax := a.factorRange(idx)
		s := ImpliedSummary{Name: factorName(a.unc, idx), Low: lo, High: hi, SearchLow: smin, SearchHigh: smax}
		for _, j := range idx {
			s.Targets = append(s.Targets, Target{Unit: a.unc[j].Unit, Param: a.unc[j].Param})
		}
		res.Implied = append(res.Implied, s)
	}
	if c := spec.Calibrate; c != nil {
		u := a.unc[a.calTargets[0]]
		res.Calibration = &CalibrationResult{Name: c.Name(), Targets: c.Targets, Off: c.Off, PriorLow: u.Low, PriorHigh: u.High}
		for _, d := range spec.Days {
			if d.Reference {
				res.Calibration.Days++
				res.Calibration.ClaimedT += d.ClaimedT
			}
		}
	}
	return res, nil
}
