package schema

import "steamcase/plant/profile"

// Audit is a check of reported daily fuel against the model of the plant:
// the period as a whole and day by day, the implied factors, the
// calibration, the fuel by cause and by grade, and what the audit
// assumed.
type Audit struct {
	Job
	Samples          int               `json:"samples"`
	Seed             uint64            `json:"seed"`
	LowQ             float64           `json:"low_quantile"`
	HighQ            float64           `json:"high_quantile"`
	Alpha            float64           `json:"alpha"`
	DayTail          float64           `json:"day_tail"`
	ClaimsOf         string            `json:"claims_of"`
	Period           AuditPeriod       `json:"period"`
	Flagged          int               `json:"flagged"`
	Days             []Day             `json:"days"`
	Uncertainties    []Uncertain       `json:"uncertainties"`
	ClaimUncertainty []ClaimTerm       `json:"claim_uncertainty"`
	Implied          []Implied         `json:"implied"`
	Calibration      *Calibration      `json:"calibration"`
	Causes           []Cause           `json:"causes"`
	BaseT            *float64          `json:"base_t"`
	FuelT            float64           `json:"fuel_t"`
	CO2T             float64           `json:"co2_t"`
	FuelByGrade      []GradeTotal      `json:"fuel_by_grade"`
	Assumptions      []AuditAssumption `json:"assumptions"`
	Warnings         []string          `json:"warnings"`
}

// AuditPeriod is the audited days as a whole.
type AuditPeriod struct {
	Days         int     `json:"days"`
	ClaimedT     float64 `json:"claimed_t"`
	NominalT     float64 `json:"nominal_t"`
	LowT         float64 `json:"low_t"`
	MedianT      float64 `json:"median_t"`
	HighT        float64 `json:"high_t"`
	ReadingLowT  float64 `json:"reading_low_t"`
	ReadingHighT float64 `json:"reading_high_t"`
	PAtOrBelow   float64 `json:"p_at_or_below"`
	PAtOrAbove   float64 `json:"p_at_or_above"`
	StdErr       float64 `json:"p_standard_error"`
	Percentile   float64 `json:"percentile"`
	Flag         string  `json:"flag"`
}

// Day is one day of an audit.
type Day struct {
	Day            int          `json:"day"`
	Date           string       `json:"date"`
	Phase          string       `json:"phase"`
	Reference      bool         `json:"reference"`
	ClaimedT       float64      `json:"claimed_t"`
	NominalT       float64      `json:"nominal_t"`
	LowT           *float64     `json:"low_t"`
	MedianT        *float64     `json:"median_t"`
	HighT          *float64     `json:"high_t"`
	ReadingLowT    *float64     `json:"reading_low_t"`
	ReadingHighT   *float64     `json:"reading_high_t"`
	Percentile     *float64     `json:"percentile"`
	PAtOrBelow     *float64     `json:"p_at_or_below"`
	PAtOrAbove     *float64     `json:"p_at_or_above"`
	Flag           string       `json:"flag"`
	FuelT          float64      `json:"fuel_t"`
	CO2T           float64      `json:"co2_t"`
	FuelByGrade    []GradeTotal `json:"fuel_by_grade"`
	Shares         []Share      `json:"shares"`
	Implied        []ImpliedDay `json:"implied"`
	Warnings       []string     `json:"warnings"`
	SampleWarnings int          `json:"samples_with_warnings"`
}

// Share is a cause's fuel on one day.
type Share struct {
	Cause string  `json:"cause"`
	FuelT float64 `json:"fuel_t"`
}

// ImpliedDay is an implied factor on one day.
type ImpliedDay struct {
	Factor string   `json:"factor"`
	Value  *float64 `json:"value"`
	Status string   `json:"status"`
}

// Uncertain is an input of an audit drawn uniformly between Low and High,
// in SI units or as a fraction, as the script gave it (or as calibrated).
type Uncertain struct {
	Unit        string  `json:"unit"`
	Param       string  `json:"param"`
	Low         float64 `json:"low"`
	High        float64 `json:"high"`
	Nominal     float64 `json:"nominal"`
	Scope       string  `json:"scope"`
	ScopeSource string  `json:"scope_source"`
	Calibrated  bool    `json:"calibrated"`
}

// ClaimTerm is a source of the claim's measurement uncertainty.
type ClaimTerm struct {
	Source            string   `json:"source"`
	HalfWidthFraction *float64 `json:"half_width_fraction"`
	HalfWidthT        *float64 `json:"half_width_t"`
	Text              string   `json:"text"`
}

// Implied is an implied factor over the audited days.
type Implied struct {
	Factor        string   `json:"factor"`
	Targets       []string `json:"targets"`
	PlausibleLow  float64  `json:"plausible_low"`
	PlausibleHigh float64  `json:"plausible_high"`
	SearchLow     float64  `json:"search_low"`
	SearchHigh    float64  `json:"search_high"`
	DaysFound     int      `json:"days_found"`
	DaysOutside   int      `json:"days_outside"`
	Mean          *float64 `json:"mean"`
	SD            *float64 `json:"sd"`
	Min           *float64 `json:"min"`
	Max           *float64 `json:"max"`
	DaysStep      int      `json:"days_step"`
	DaysAbove     int      `json:"days_model_above"`
	DaysBelow     int      `json:"days_model_below"`
	DaysNoEffect  int      `json:"days_no_effect"`
}

// Calibration is a factor calibrated on the reference days.
type Calibration struct {
	Factor            string   `json:"factor"`
	Targets           []string `json:"targets"`
	Off               []string `json:"off"`
	Value             float64  `json:"value"`
	Low               float64  `json:"low"`
	High              float64  `json:"high"`
	ReferenceDays     int      `json:"reference_days"`
	ClaimedT          float64  `json:"claimed_t"`
	ReadingHalfWidthT float64  `json:"reading_half_width_t"`
	PriorLow          float64  `json:"prior_low"`
	PriorHigh         float64  `json:"prior_high"`
}

// Cause is a cause's fuel over every day of the log.
type Cause struct {
	Name  string   `json:"name"`
	Units []string `json:"units"`
	FuelT float64  `json:"fuel_t"`
}

// AuditAssumption is an assumption of an audit.
type AuditAssumption struct {
	Item   string `json:"item"`
	Value  string `json:"value"`
	Source string `json:"source"`
}

// ClaimsOfFuel is claims_of of an audit whose days claim their whole
// boiler fuel.
const ClaimsOfFuel = "boiler fuel"

func targets(ts []profile.Target) []string {
	out := make([]string, len(ts))
	for i, t := range ts {
		out[i] = t.Unit + "." + t.Param
	}
	return out
}

func grades(gs []profile.GradeTotal) []GradeTotal {
	out := make([]GradeTotal, len(gs))
	for i, g := range gs {
		out[i] = GradeTotal{Grade: g.Grade, FuelT: Round(g.FuelT), CO2T: Round(g.CO2T)}
	}
	return out
}

// NewAudit returns the schema form of an audit run as job. The sampling
// settings and the uncertain inputs' ranges are given as set (not
// rounded); a reference day's band, percentile and shares of samples are
// null (it is not sampled); an implied factor's value is null when no
// value was found (its status says why), and its summary's mean, sd, min
// and max null when no day had one (sd also with one day only).
func NewAudit(job Job, r *profile.AuditResult) Audit {
	out := Audit{Job: job.job(), Samples: r.Samples, Seed: r.Seed, LowQ: r.LowQ, HighQ: r.HighQ, Alpha: r.Alpha,
		DayTail: Round(r.DayTail), ClaimsOf: r.ClaimsOf, Flagged: r.Flagged,
		FuelT: Round(r.FuelT), CO2T: Round(r.CO2T), FuelByGrade: grades(r.FuelByGrade),
		Days: make([]Day, 0, len(r.Days)), Uncertainties: make([]Uncertain, 0, len(r.Uncertainties)),
		ClaimUncertainty: []ClaimTerm{}, Implied: []Implied{}, Causes: []Cause{},
		Assumptions: []AuditAssumption{}, Warnings: append([]string{}, r.Warnings...)}
	if out.ClaimsOf == "" {
		out.ClaimsOf = ClaimsOfFuel
	}
	p := r.Period
	out.Period = AuditPeriod{Days: p.Days, ClaimedT: Round(p.ClaimedT), NominalT: Round(p.NominalT),
		LowT: Round(p.LowT), MedianT: Round(p.MedianT), HighT: Round(p.HighT),
		ReadingLowT: Round(p.ReadingLowT), ReadingHighT: Round(p.ReadingHighT),
		PAtOrBelow: Round(p.PAtOrBelow), PAtOrAbove: Round(p.PAtOrAbove), StdErr: Round(p.StdErr),
		Percentile: Round(p.Percentile), Flag: p.Flag}
	for i, d := range r.Days {
		sampled := !d.Reference
		day := Day{Day: i + 1, Date: d.Date, Phase: d.Phase, Reference: d.Reference,
			ClaimedT: Round(d.ClaimedT), NominalT: Round(d.NominalT),
			LowT: roundPtr(d.LowT, sampled), MedianT: roundPtr(d.MedianT, sampled), HighT: roundPtr(d.HighT, sampled),
			ReadingLowT: roundPtr(d.ReadingLowT, sampled), ReadingHighT: roundPtr(d.ReadingHighT, sampled),
			Percentile: roundPtr(d.Percentile, sampled), PAtOrBelow: roundPtr(d.PAtOrBelow, sampled),
			PAtOrAbove: roundPtr(d.PAtOrAbove, sampled), Flag: d.Flag,
			FuelT: Round(d.FuelT), CO2T: Round(d.CO2T), FuelByGrade: grades(d.FuelByGrade),
			Shares: make([]Share, 0, len(d.Shares)), Implied: make([]ImpliedDay, 0, len(d.Implied)),
			Warnings: append([]string{}, d.Warnings...), SampleWarnings: d.SampleWarnings}
		for k, s := range d.Shares {
			name := ""
			if k < len(r.Causes) {
				name = r.Causes[k].Name
			}
			day.Shares = append(day.Shares, Share{Cause: name, FuelT: Round(s)})
		}
		for k, v := range d.Implied {
			name := ""
			if k < len(r.Implied) {
				name = r.Implied[k].Name
			}
			day.Implied = append(day.Implied, ImpliedDay{Factor: name,
				Value: roundPtr(v.Value, v.Status == profile.ImpliedFound || v.Status == profile.ImpliedStep), Status: v.Status.String()})
		}
		out.Days = append(out.Days, day)
	}
	for _, u := range r.Uncertainties {
		out.Uncertainties = append(out.Uncertainties, Uncertain{Unit: u.Unit, Param: u.Param, Low: u.Low, High: u.High,
			Nominal: u.Nominal, Scope: u.Scope.String(), ScopeSource: u.Why, Calibrated: u.Calibrated})
	}
	for _, c := range r.Claim {
		ct := ClaimTerm{Source: c.Source.String(), Text: c.Text}
		switch c.Source {
		case profile.FlowMeter, profile.BDNDensity:
			ct.HalfWidthFraction = roundPtr(c.HalfWidth, true)
		default:
			ct.HalfWidthT = roundPtr(c.HalfWidth, true)
		}
		out.ClaimUncertainty = append(out.ClaimUncertainty, ct)
	}
	for _, s := range r.Implied {
		found := s.Found > 0
		out.Implied = append(out.Implied, Implied{Factor: s.Name, Targets: targets(s.Targets),
			PlausibleLow: s.Low, PlausibleHigh: s.High, SearchLow: s.SearchLow, SearchHigh: s.SearchHigh,
			DaysFound: s.Found, DaysOutside: s.Outside, Mean: roundPtr(s.Mean, found), SD: roundPtr(s.SD, s.Found > 1),
			Min: roundPtr(s.Min, found), Max: roundPtr(s.Max, found), DaysStep: s.Steps, DaysAbove: s.Above, DaysBelow: s.Below, DaysNoEffect: s.NoEffect})
	}
	if c := r.Calibration; c != nil {
		out.Calibration = &Calibration{Factor: c.Name, Targets: targets(c.Targets), Off: append([]string{}, c.Off...),
			Value: Round(c.Value), Low: Round(c.Low), High: Round(c.High), ReferenceDays: c.Days,
			ClaimedT: Round(c.ClaimedT), ReadingHalfWidthT: Round(c.ReadingHalfWidthT), PriorLow: c.PriorLow, PriorHigh: c.PriorHigh}
	}
	for _, c := range r.Causes {
		out.Causes = append(out.Causes, Cause{Name: c.Name, Units: append([]string{}, c.Units...), FuelT: Round(c.FuelT)})
	}
	out.BaseT = roundPtr(r.BaseT, len(r.Causes) > 0)
	for _, a := range r.Assumptions {
		out.Assumptions = append(out.Assumptions, AuditAssumption(a))
	}
	return out
}
