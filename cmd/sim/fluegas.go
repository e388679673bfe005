package main

import (
	"context"
	"encoding/json"
	"errors"
	"flag"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
	"text/tabwriter"

	"steamcase/plant/combustion"
	"steamcase/plant/fuel"
	"steamcase/plant/units"
)

// dewMargin is the margin (K) the flue gas should keep above the acid dew
// point before the command warns: 20 K, common practice, no source.
const dewMargin = 20.0

func fluegasCommand() *command {
	return &command{
		Name: "fluegas",
		UsageLine: `--fuel GRADE [--fuel-analysis ANALYSIS] (--o2 PERCENT | --co2 PERCENT) --gas TEMPERATURE --air TEMPERATURE [flags]
--fuel-analysis ANALYSIS (--o2 PERCENT | --co2 PERCENT) --gas TEMPERATURE --air TEMPERATURE [flags]`,
		Short: "boiler efficiency from a flue-gas measurement (heat-loss method)",
		Long: `Fluegas works out a boiler's efficiency from a flue-gas measurement, such as
a handheld analyser gives: the oxygen (or carbon dioxide) in the dry flue
gas, the flue-gas temperature at the boiler outlet and the temperature of
the combustion air. It burns the fuel completely with the air ratio that the
reading implies and draws up the heat-loss account in the manner of ASME
PTC 4 and EN 12952-15: the dry flue gas, the moisture, the radiation and
convection, and the unburnt losses, on the net (LHV) and on the gross (HHV)
basis. The basis is stated beside every efficiency.

The fuel is a built-in grade (MGO, VLSFO, HSFO or LNG), or the user's own
fuel given by its ultimate analysis, or a grade with an analysis given on
top. An analysis is written as KEY=VALUE pairs separated by commas, each
value in percent by mass as fired, such as "C=86,H=11,S=2.5,N=0.3,O=0.2".
The keys are C, H, S, N and O, W for the free water and A for the ash; each
may appear once, a key left out counts as zero, and the values must add up
to 100 % within 0.5 %. The analysis is used as given, not normalised. A fuel
given only by its analysis is taken as a liquid fuel oil, and its LHV comes
from the analysis (Channiwala-Parikh correlation) unless --lhv sets it. With
a grade, the analysis replaces the grade's typical analysis and ISO 8217
data and the grade keeps its class: a liquid grade's LHV then comes from the
analysis as for an own fuel, and LNG keeps its set LHV (methane's); for a
gas fuel, give --fuel LNG with the analysis. --lhv overrides the net
specific energy of any fuel; the gross value is then the LHV plus the latent
heat of the water the analysis forms.

The reference temperature of the account is the combustion-air temperature,
as in Siegert's formula, and the fuel is taken at that temperature, so the
account has no credits; it must lie between -20 and 50 °C. Combustion is
taken as complete: a CO reading adds its loss by the Siegert-type form
a·CO/(CO + CO2) (a = 48 for oil, 32 for gas), but the flue gas is not
corrected for it. The radiation and convection loss is given as a percentage
of the input at MCR and scaled by 1/load, because the loss in kW stays
nearly constant; 0.5 to 1.5 % at MCR is common for marine auxiliary boilers.
Without --radiation it is taken as zero and a warning says so.

The table shows the excess air, the stoichiometric air and the flue gas per
kg of fuel, the flue-gas composition (dry and wet), each loss and the
efficiency on both bases, the acid dew point by Verhoff and Banchero with a
warning when the flue gas is less than 20 K above it (a common-practice
margin), Siegert's flue-gas loss (1. BImSchV) as a cross-check, and the
fuel's LHV and HHV with their sources. With --json the same results are
printed as one JSON object: temperatures in K, specific energies in J/kg,
flows in kg/kg fuel and fractions and losses in percent, the unit in each
key (lambda, stoich_air_kg_per_kg, flue_gas_kg_per_kg, co2_dry_pct,
o2_dry_pct, h2o_wet_pct, losses on the LHV basis and losses_hhv on the HHV
basis, efficiency_lhv_pct, efficiency_hhv_pct, acid_dew_point_K, which is
null for a fuel without sulfur, lhv_J_per_kg, hhv_J_per_kg, warnings and
caution, among others).

Examples:

	sim fluegas --fuel VLSFO --o2 "3 %" --gas "250 C" --air "35 C"
	sim fluegas --fuel HSFO --o2 "3.5 %" --gas "280 C" --air "30 C" --co "50 ppm" --radiation "1 %" --load "50 %"
	sim fluegas --fuel-analysis "C=86,H=11,S=2.5,N=0.3,O=0.2" --lhv "40.487 MJ/kg" --o2 "3 %" --gas "250 C" --air "35 C"
	sim fluegas --fuel MGO --co2 "13 %" --gas "220 C" --air "40 C" --humidity "60 %" --json`,
		Flags: func() *flag.FlagSet { return new(fluegasArgs).flagSet() },
		Run:   runFluegas,
	}
}

// fluegasArgs holds the flags of sim fluegas, as given.
type fluegasArgs struct {
	fuel, analysis, lhv          string
	o2, co2, co                  string
	gas, air, humidity           string
	load, radiation, solids, so3 string
	json                         bool
}

func (a *fluegasArgs) flagSet() *flag.FlagSet {
	fs := flag.NewFlagSet("fluegas", flag.ContinueOnError)
	fs.StringVar(&a.fuel, "fuel", "", "The fuel `GRADE`, one of "+strings.Join(fuel.GradeNames(), ", ")+", in upper or lower case.\nGive --fuel, --fuel-analysis or both.")
	fs.StringVar(&a.analysis, "fuel-analysis", "", "The fuel's ultimate `ANALYSIS` as fired, in percent by mass, such as\n\"C=86,H=11,S=2.5,N=0.3,O=0.2\". The keys are C, H, S, N, O, W (free water) and\nA (ash), and the values must add up to 100 %. Alone it is the user's own fuel oil;\nwith --fuel it replaces the grade's analysis.")
	fs.StringVar(&a.lhv, "lhv", "", "The fuel's net specific `ENERGY` (LHV), such as \"40.2 MJ/kg\" or \"40200 kJ/kg\".\nIt overrides the grade's figure or the one from the analysis.")
	fs.StringVar(&a.o2, "o2", "", "The oxygen measured in the dry flue gas, as a `PERCENT` by volume, such as \"3 %\".\nGive --o2 or --co2, not both.")
	fs.StringVar(&a.co2, "co2", "", "The carbon dioxide measured in the dry flue gas, as a `PERCENT` by volume, such\nas \"13 %\". The excess air then follows from the fuel's maximum CO2.")
	fs.StringVar(&a.co, "co", "", "The carbon monoxide measured in the dry flue gas, an `AMOUNT` in ppm by volume or\nin percent, such as \"50 ppm\" or \"0.005 %\". It adds the CO loss, which is zero\nwithout it.")
	fs.StringVar(&a.gas, "gas", "", "The flue-gas `TEMPERATURE` at the boiler outlet, where the gas was measured,\nsuch as \"250 C\".")
	fs.StringVar(&a.air, "air", "", "The combustion-air `TEMPERATURE` at the burner intake, such as \"35 C\". It is the\nreference of the account and must lie between -20 and 50 °C.")
	fs.StringVar(&a.humidity, "humidity", "", "The `HUMIDITY` of the combustion air: relative, at the air temperature, such as\n\"60 %\", or as a humidity ratio (water per dry air), such as \"0.012 kg/kg\" or\n\"12 g/kg\". Without it the air is taken as dry.")
	fs.StringVar(&a.radiation, "radiation", "", "The radiation and convection loss at MCR, as a `PERCENT` of the heat input (LHV),\nsuch as \"1 %\". Without it the loss is taken as zero, with a warning.")
	fs.StringVar(&a.load, "load", "", "The boiler load as a `PERCENT` of MCR, from 5 to 120 %, such as \"50 %\". The\nradiation loss is scaled by 1/load; it needs --radiation. The default is 100 %.")
	fs.StringVar(&a.solids, "solids", "", "The unburnt-solids (soot, coke) loss as a `PERCENT` of the heat input (LHV), such\nas \"0.1 %\". The default is zero.")
	fs.StringVar(&a.so3, "so3", "", "The share of the SO2 that turns to SO3, as a `PERCENT`, for the acid dew point,\nsuch as \"3 %\". The default is 3 %, inside the 1 to 5 % usual in oil firing.")
	fs.BoolVar(&a.json, "json", false, "Print one JSON object (SI units and percentages) instead of the table.")
	return fs
}

// fluegasQuery is a parsed, checked request.
type fluegasQuery struct {
	fuel       fuel.Fuel
	cond       combustion.Conditions
	flueT      float64 // K
	o2, co2    float64 // measured dry fractions; one is zero
	so3        float64 // fraction of SO2 to SO3
	opts       combustion.LossOptions
	radGiven   bool   // --radiation given, perhaps as 0 %
	stoichNote string // set when O2 = 0 % was read as λ = 1
}

func runFluegas(ctx context.Context, e env, args []string) error {
	var a fluegasArgs
	if err := parseFlags(a.flagSet(), args); err != nil {
		return err
	}
	q, err := a.query()
	if err != nil {
		return err
	}
	if err := ctx.Err(); err != nil {
		return err
	}
	r, err := q.compute()
	if err != nil {
		return err
	}
	out := r.json()
	// Marshalling also checks that no NaN or infinity reaches a report,
	// for the table too: encoding/json refuses them.
	var b []byte
	if a.json {
		b, err = json.MarshalIndent(&out, "", "  ")
	} else {
		b, err = json.Marshal(&out)
	}
	if err != nil {
		var ue *json.UnsupportedValueError
		if errors.As(err, &ue) {
			return fmt.Errorf("fluegas: a result is not finite (%s); the inputs lie outside what the combustion model covers", ue.Str)
		}
		return err
	}
	if a.json {
		_, err := e.stdout.Write(append(b, '\n'))
		return err
	}
	return writeFluegasTable(e.stdout, &a, r, &out)
}

// query checks which flags were given and parses their values.
func (a *fluegasArgs) query() (fluegasQuery, error) {
	var q fluegasQuery
	given := func(s string) bool { return strings.TrimSpace(s) != "" }

	// The fuel.
	if !given(a.fuel) && !given(a.analysis) {
		return q, usagef("no fuel given: give --fuel with a grade (%s) or --fuel-analysis with the fuel's analysis", strings.Join(fuel.GradeNames(), ", "))
	}
	if given(a.fuel) {
		f, err := fuel.Grade(strings.TrimSpace(a.fuel))
		if err != nil {
			return q, usagef("--fuel %q: unknown fuel grade; the known grades are %s (or give --fuel-analysis for your own fuel)",
				a.fuel, strings.Join(fuel.GradeNames(), ", "))
		}
		q.fuel = f
	} else {
		q.fuel = fuel.Fuel{Name: "own fuel (--fuel-analysis)", Class: fuel.Residual}
	}
	if given(a.analysis) {
		an, err := parseAnalysis(a.analysis)
		if err != nil {
			return q, err
		}
		if given(a.fuel) {
			q.fuel.Name += " with the given analysis"
			// The grade's ISO 8217 data describe its typical fuel; they
			// would disagree with another analysis (sulfur, water, ash).
			q.fuel.ISO = fuel.ISO8217{}
			q.fuel.Viscosity2 = fuel.ViscosityPoint{}
		}
		q.fuel.Analysis = an
	}
	if given(a.lhv) {
		v, err := units.Parse(a.lhv, units.SpecificEnergy, units.Options{})
		if err != nil {
			return q, flagValueError("lhv", err)
		}
		if !(v >= 5e6 && v <= 130e6) {
			return q, fmt.Errorf("--lhv %q: a net specific energy must lie between 5 and 130 MJ/kg; got %s MJ/kg", a.lhv, fmtG(v/1e6))
		}
		q.fuel.SetLHV = v
		q.fuel.SetLHVSource = "given with --lhv"
	}
	if !q.fuel.Analysis.Given() {
		return q, fmt.Errorf("fuel %q has no ultimate analysis, which the combustion needs; give --fuel-analysis", q.fuel.Name)
	}
	if err := q.fuel.Validate(); err != nil {
		return q, fmt.Errorf("fuel %q: %w", q.fuel.Name, err)
	}

	// The measurement.
	switch {
	case given(a.o2) && given(a.co2):
		return q, usagef("--o2 and --co2 given together: give the one the analyser measured")
	case !given(a.o2) && !given(a.co2):
		return q, usagef("no flue-gas measurement given: give --o2 (or --co2) in percent of the dry flue gas, such as --o2 \"3 %%\"")
	}
	if !given(a.gas) {
		return q, usagef("no flue-gas temperature given: give --gas, such as --gas \"250 C\"")
	}
	if !given(a.air) {
		return q, usagef("no air temperature given: give --air, such as --air \"35 C\"")
	}
	if given(a.load) && !given(a.radiation) {
		return q, usagef("--load scales the radiation and convection loss: give --radiation with it, such as --radiation \"1 %%\"")
	}

	var err error
	airO2 := combustion.StandardDryAir[combustion.O2]
	if given(a.o2) {
		if q.o2, err = parsePercent("o2", a.o2); err != nil {
			return q, err
		}
		switch {
		case q.o2 < 0:
			return q, fmt.Errorf("--o2 %q: a measured O2 cannot be negative", a.o2)
		case q.o2 >= airO2:
			return q, fmt.Errorf("--o2 %q: no combustion: O2 at or above that of air (%s %% dry); the burner cannot fire", a.o2, fmtG(100*airO2))
		case q.o2 == 0:
			q.cond.Lambda = 1
			q.stoichNote = "an O2 reading of 0 % is taken as stoichiometric firing (λ = 1); in practice it means incomplete combustion (CO, soot), which this complete-combustion account does not represent"
		default:
			q.cond.O2Dry = q.o2
		}
	} else {
		if q.co2, err = parsePercent("co2", a.co2); err != nil {
			return q, err
		}
		if !(q.co2 > 0 && q.co2 < 0.3) {
			return q, fmt.Errorf("--co2 %q: a measured dry CO2 must be above 0 and below 30 %%", a.co2)
		}
		st, err := combustion.Stoichiometry(q.fuel, combustion.StandardDryAir)
		if err != nil {
			return q, err
		}
		if q.co2 > st.CO2Max {
			return q, fmt.Errorf("--co2 %q: above the fuel's maximum CO2 of %s %% (dry, at λ = 1): complete combustion cannot give it; the reading or the fuel is wrong, or the burner fires with too little air",
				a.co2, fmtF(100*st.CO2Max, 2))
		}
		q.cond.CO2Dry = q.co2
	}

	airT, err := parseTemperature("air", a.air)
	if err != nil {
		return q, err
	}
	if !(airT >= 253.15 && airT <= 323.15) {
		return q, fmt.Errorf("--air %q: the air temperature is the reference of the loss account, which must lie between -20 and 50 °C; got %s °C (for preheated air, give the temperature before the air heater)",
			a.air, fmtF(airT-273.15, 2))
	}
	q.flueT, err = parseTemperature("gas", a.gas)
	if err != nil {
		return q, err
	}
	if !(q.flueT > airT) {
		return q, fmt.Errorf("--gas %q: the flue gas (%s °C) is not hotter than the combustion air (%s °C); a firing boiler's flue gas leaves hotter than the air comes in",
			a.gas, fmtF(q.flueT-273.15, 2), fmtF(airT-273.15, 2))
	}
	if !(q.flueT <= 1273.15) {
		return q, fmt.Errorf("--gas %q: the flue-gas temperature must be at most 1000 °C for the heat-loss account; got %s °C", a.gas, fmtF(q.flueT-273.15, 2))
	}
	q.cond.AirT, q.cond.FuelT = airT, airT

	if given(a.humidity) {
		if err := parseHumidity(a.humidity, &q.cond); err != nil {
			return q, err
		}
	}
	if given(a.co) {
		ppm, err := parseCO(a.co)
		if err != nil {
			return q, err
		}
		q.opts.COppmDry = ppm
	}
	if given(a.radiation) {
		v, err := parsePercent("radiation", a.radiation)
		if err != nil {
			return q, err
		}
		if !(v >= 0 && v <= 0.10) {
			return q, fmt.Errorf("--radiation %q: the radiation and convection loss at MCR must lie between 0 and 10 %%", a.radiation)
		}
		q.opts.Radiation.PercentAtMCR = 100 * v
		q.radGiven = true
	}
	if given(a.load) {
		v, err := parsePercent("load", a.load)
		if err != nil {
			return q, err
		}
		if !(v >= 0.05 && v <= 1.2) {
			return q, fmt.Errorf("--load %q: the load must lie between 5 and 120 %% of MCR", a.load)
		}
		q.opts.Radiation.LoadFraction = v
	}
	if given(a.solids) {
		v, err := parsePercent("solids", a.solids)
		if err != nil {
			return q, err
		}
		if !(v >= 0 && v <= 0.10) {
			return q, fmt.Errorf("--solids %q: the unburnt-solids loss must lie between 0 and 10 %%", a.solids)
		}
		q.opts.UnburntSolids = 100 * v
	}
	q.so3 = combustion.DefaultSO3Conversion
	if given(a.so3) {
		v, err := parsePercent("so3", a.so3)
		if err != nil {
			return q, err
		}
		if !(v > 0 && v <= 0.2) {
			return q, fmt.Errorf("--so3 %q: the SO2 to SO3 conversion must be above 0 and at most 20 %% (1 to 5 %% is usual in oil firing)", a.so3)
		}
		q.so3 = v
	}
	return q, nil
}

// analysisKeys are the keys of --fuel-analysis in the order they print.
var analysisKeys = [...]string{"C", "H", "S", "N", "O", "W", "A"}

// parseAnalysis reads "C=86,H=11,S=2.5,N=0.3,O=0.2" (mass % as fired).
// A malformed text is a usage error; fractions that are out of range or do
// not add up to 100 % are failures (exit 1).
func parseAnalysis(s string) (fuel.Analysis, error) {
	var an fuel.Analysis
	var seen [len(analysisKeys)]bool
	field := func(k string) *float64 {
		switch k {
		case "C":
			return &an.C
		case "H":
			return &an.H
		case "S":
			return &an.S
		case "N":
			return &an.N
		case "O":
			return &an.O
		case "W":
			return &an.Water
		case "A":
			return &an.Ash
		}
		return nil
	}
	for _, part := range strings.Split(s, ",") {
		part = strings.TrimSpace(part)
		if part == "" {
			return an, usagef("--fuel-analysis %q: an empty entry; write KEY=VALUE pairs separated by commas, such as \"C=86,H=11,S=2.5,N=0.3,O=0.2\"", s)
		}
		k, v, ok := strings.Cut(part, "=")
		if !ok {
			return an, usagef("--fuel-analysis %q: %q is not KEY=VALUE; write pairs such as \"C=86,H=11,S=2.5,N=0.3,O=0.2\"", s, part)
		}
		k = strings.ToUpper(strings.TrimSpace(k))
		p := field(k)
		if p == nil {
			return an, usagef("--fuel-analysis %q: unknown key %q; the keys are C, H, S, N, O, W (free water) and A (ash)", s, strings.TrimSpace(k))
		}
		i := strings.Index("CHSNOWA", k)
		if seen[i] {
			return an, usagef("--fuel-analysis %q: %s given twice", s, k)
		}
		seen[i] = true
		v = strings.TrimSpace(strings.TrimSuffix(strings.TrimSpace(v), "%"))
		x, err := strconv.ParseFloat(v, 64)
		if err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
			return an, usagef("--fuel-analysis %q: the value of %s is %q; want a finite number in percent by mass, such as %s=86", s, k, v, k)
		}
		if !(x >= 0 && x <= 100) {
			return an, fmt.Errorf("--fuel-analysis %q: %s = %s %%; each value must lie between 0 and 100 %% by mass", s, k, fmtG(x))
		}
		*p = x / 100
	}
	if sum := an.Sum(); !(math.Abs(sum-1) <= fuel.SumTolerance) {
		return an, fmt.Errorf("--fuel-analysis %q: the values add up to %s %%; they must add up to 100 %% within %s %% (as fired, with W and A)",
			s, fmtG(100*sum), fmtG(100*fuel.SumTolerance))
	}
	return an, nil
}

// parsePercent reads a fraction written with a percent sign, "3 %".
func parsePercent(name, val string) (float64, error) {
	q, err := units.ParseAny(val, units.Options{})
	if err != nil {
		return 0, flagValueError(name, err)
	}
	if q.Dim != units.Fraction || q.Unit != "%" {
		return 0, usagef("--%s %q: want a percentage with its sign, such as \"3 %%\"", name, val)
	}
	return q.Value, nil
}

func parseTemperature(name, val string) (float64, error) {
	v, err := units.Parse(val, units.Temperature, units.Options{})
	if err != nil {
		return 0, flagValueError(name, err)
	}
	return v, nil
}

// parseCO reads the CO reading in ppm ("50 ppm") or percent ("0.005 %")
// and returns ppm by volume.
func parseCO(val string) (float64, error) {
	s := strings.TrimSpace(val)
	var ppm float64
	if num, ok := strings.CutSuffix(s, "ppm"); ok {
		x, err := strconv.ParseFloat(strings.TrimSpace(num), 64)
		if err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
			return 0, usagef("--co %q: want a number before ppm, such as \"50 ppm\"", val)
		}
		ppm = x
	} else {
		q, err := units.ParseAny(s, units.Options{})
		if err != nil {
			return 0, usagef("--co %q: want ppm or a percentage, such as \"50 ppm\" or \"0.005 %%\"", val)
		}
		if q.Dim != units.Fraction || q.Unit != "%" {
			return 0, usagef("--co %q: want ppm or a percentage, such as \"50 ppm\" or \"0.005 %%\"", val)
		}
		ppm = q.Value * 1e6
	}
	if !(ppm >= 0 && ppm <= 1e5) {
		return 0, fmt.Errorf("--co %q: the CO must lie between 0 and 100000 ppm (10 %%)", val)
	}
	return ppm, nil
}

// parseHumidity reads a relative humidity ("60 %") or a humidity ratio
// ("0.012 kg/kg", "12 g/kg") into c.
func parseHumidity(val string, c *combustion.Conditions) error {
	s := strings.TrimSpace(val)
	for _, u := range [...]struct {
		suffix string
		scale  float64
	}{{"kg/kg", 1}, {"g/kg", 1e-3}} {
		num, ok := strings.CutSuffix(s, u.suffix)
		if !ok {
			continue
		}
		x, err := strconv.ParseFloat(strings.TrimSpace(num), 64)
		if err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
			return usagef("--humidity %q: want a number before %s, such as \"0.012 kg/kg\"", val, u.suffix)
		}
		x *= u.scale
		if !(x >= 0 && x <= combustion.MaxHumidity) {
			return fmt.Errorf("--humidity %q: a humidity ratio must lie between 0 and %s kg/kg dry air", val, fmtG(combustion.MaxHumidity))
		}
		c.Humidity = x
		return nil
	}
	q, err := units.ParseAny(s, units.Options{})
	if err != nil || q.Dim != units.Fraction || q.Unit != "%" {
		return usagef("--humidity %q: want a relative humidity such as \"60 %%\" or a humidity ratio such as \"0.012 kg/kg\"", val)
	}
	if !(q.Value >= 0 && q.Value <= 1) {
		return fmt.Errorf("--humidity %q: a relative humidity must lie between 0 and 100 %%", val)
	}
	if q.Value > 0 && c.AirT < 273.15 {
		return fmt.Errorf("--humidity %q: a relative humidity below 0 °C air is not modelled (saturation over ice); give the humidity ratio in kg/kg", val)
	}
	c.RelativeHumidity = q.Value
	return nil
}

// fluegasResult holds the computed figures.
type fluegasResult struct {
	q           fluegasQuery
	p           combustion.Products
	stoichFlue  float64 // wet flue gas at λ = 1 (kg/kg fuel)
	l           combustion.Losses
	dew         float64 // K, valid if dewOK
	dewOK       bool
	dewNote     string // why there is no dew point
	siegert     float64
	siegertOK   bool
	siegertForm string
	siegertSet  string
	siegertNote string
	warnings    []string
}

func (q fluegasQuery) compute() (*fluegasResult, error) {
	r := &fluegasResult{q: q}
	var err error
	if r.p, err = combustion.Fire(q.fuel, q.cond); err != nil {
		return nil, err
	}
	st := combustion.Conditions{Lambda: 1, AirT: q.cond.AirT, FuelT: q.cond.FuelT, Humidity: r.p.HumidityRatio}
	ps, err := combustion.Fire(q.fuel, st)
	if err != nil {
		return nil, err
	}
	r.stoichFlue = ps.FlueGas
	if r.l, err = combustion.Efficiency(r.p, q.flueT, q.cond.AirT, q.opts); err != nil {
		return nil, err
	}

	// Acid dew point.
	if q.fuel.Analysis.S == 0 {
		r.dewNote = "the fuel has no sulfur, so there is no acid dew point (only the water dew point)"
	} else if t, err := combustion.AcidDewPoint(r.p, 0, q.so3, combustion.MethodVerhoffBanchero); err != nil {
		r.dewNote = "not computed: " + err.Error()
		r.warnings = append(r.warnings, "the acid dew point could not be computed ("+err.Error()+"); check the margin to it by other means")
	} else {
		r.dew, r.dewOK = t, true
		switch {
		case q.flueT <= t:
			r.warnings = append(r.warnings, fmt.Sprintf("the flue gas at %s °C is at or below the acid dew point of %s °C: sulfuric acid condenses on the surfaces it touches",
				fmtF(q.flueT-273.15, 1), fmtF(t-273.15, 1)))
		case q.flueT < t+dewMargin:
			r.warnings = append(r.warnings, fmt.Sprintf("the flue gas at %s °C is less than %s K above the acid dew point of %s °C; a margin of at least %s K is common practice (no source), and tube walls are colder than the gas",
				fmtF(q.flueT-273.15, 1), fmtG(dewMargin), fmtF(t-273.15, 1), fmtG(dewMargin)))
		}
	}

	// Siegert cross-check, in the form of the reading.
	coef, set := combustion.SiegertFuelOil, "fuel-oil coefficients"
	if q.fuel.Class == fuel.Gas {
		coef, set = combustion.SiegertNaturalGas, "natural-gas coefficients"
	}
	r.siegertSet = set
	var sErr error
	if q.co2 != 0 {
		r.siegertForm = "CO2 form"
		r.siegert, sErr = combustion.SiegertCO2(q.flueT, q.cond.AirT, q.co2, coef)
	} else {
		r.siegertForm = "O2 form"
		r.siegert, sErr = combustion.Siegert(q.flueT, q.cond.AirT, q.o2, coef)
	}
	if sErr != nil {
		r.siegertNote = "not available: " + sErr.Error()
	} else {
		r.siegertOK = true
	}

	// Warnings from the account.
	if q.stoichNote != "" {
		r.warnings = append(r.warnings, q.stoichNote)
	}
	if r.l.Warnings&combustion.WarnNoRadiation != 0 && !q.radGiven {
		r.warnings = append(r.warnings, "no radiation and convection loss given (--radiation): taken as zero, so the efficiency is overstated by it (0.5 to 1.5 % at MCR is common for marine auxiliary boilers)")
	}
	if r.l.Warnings&combustion.WarnLowLoadRadiation != 0 {
		r.warnings = append(r.warnings, "below 25 % load the 1/load scaling of the radiation loss is crude")
	}
	if r.l.Warnings&combustion.WarnFuelSensibleNotModelled != 0 {
		r.warnings = append(r.warnings, "the fuel's sensible heat is not modelled for this fuel; the fuel credit is taken as zero")
	}
	return r, nil
}

// lossesJSON is one basis of the account, in percent of that basis's input.
type lossesJSON struct {
	DryGas      float64 `json:"dry_gas_pct"`
	Moisture    float64 `json:"moisture_pct"`
	MoistureH   float64 `json:"moisture_from_hydrogen_pct"`
	MoistureW   float64 `json:"moisture_from_fuel_water_pct"`
	MoistureAir float64 `json:"moisture_from_air_pct"`
	Radiation   float64 `json:"radiation_pct"`
	Unburnt     float64 `json:"unburnt_pct"`
	CO          float64 `json:"co_pct"`
	Solids      float64 `json:"solids_pct"`
	Credits     float64 `json:"credits_pct"`
	Total       float64 `json:"total_pct"`
}

func lossesOf(l combustion.LossItems) lossesJSON {
	return lossesJSON{
		DryGas: l.DryGas, Moisture: l.Moisture(),
		MoistureH: l.MoistureH, MoistureW: l.MoistureFuel, MoistureAir: l.MoistureAir,
		Radiation: l.Radiation, Unburnt: l.CO + l.Solids, CO: l.CO, Solids: l.Solids,
		Credits: l.TotalCredit, Total: l.TotalLoss,
	}
}

// fluegasJSON is the JSON form of the result.
type fluegasJSON struct {
	Fuel          string  `json:"fuel"`
	FlueT         float64 `json:"flue_gas_T_K"`
	AirT          float64 `json:"air_T_K"`
	RefT          float64 `json:"reference_T_K"`
	Lambda        float64 `json:"lambda"`
	ExcessAir     float64 `json:"excess_air_pct"`
	StoichAir     float64 `json:"stoich_air_kg_per_kg"`
	StoichFlue    float64 `json:"stoich_flue_gas_kg_per_kg"`
	Air           float64 `json:"air_kg_per_kg"`
	FlueGas       float64 `json:"flue_gas_kg_per_kg"`
	DryFlueGas    float64 `json:"dry_flue_gas_kg_per_kg"`
	FlueGasNm3    float64 `json:"flue_gas_Nm3_per_kg"`
	HumidityRatio float64 `json:"humidity_kg_per_kg_dry_air"`
	CO2Dry        float64 `json:"co2_dry_pct"`
	O2Dry         float64 `json:"o2_dry_pct"`
	SO2Dry        float64 `json:"so2_dry_ppm"`
	N2Dry         float64 `json:"n2_dry_pct"`
	ArDry         float64 `json:"ar_dry_pct"`
	CO2Wet        float64 `json:"co2_wet_pct"`
	O2Wet         float64 `json:"o2_wet_pct"`
	SO2Wet        float64 `json:"so2_wet_ppm"`
	H2OWet        float64 `json:"h2o_wet_pct"`
	N2Wet         float64 `json:"n2_wet_pct"`
	ArWet         float64 `json:"ar_wet_pct"`

	Losses        lossesJSON `json:"losses"`
	LossesHHV     lossesJSON `json:"losses_hhv"`
	EfficiencyLHV float64    `json:"efficiency_lhv_pct"`
	EfficiencyHHV float64    `json:"efficiency_hhv_pct"`

	AcidDewPoint     *float64 `json:"acid_dew_point_K"`
	AcidDewMethod    string   `json:"acid_dew_point_method"`
	SO3Conversion    float64  `json:"so3_conversion_pct"`
	Siegert          *float64 `json:"siegert_loss_pct"`
	SiegertForm      string   `json:"siegert_form"`
	FlueLossDetailed float64  `json:"dry_gas_plus_moisture_lhv_pct"`

	LHV       float64  `json:"lhv_J_per_kg"`
	HHV       float64  `json:"hhv_J_per_kg"`
	LHVSource string   `json:"lhv_source"`
	HHVSource string   `json:"hhv_source"`
	Warnings  []string `json:"warnings"`
	Caution   string   `json:"caution"`
}

func (r *fluegasResult) json() fluegasJSON {
	p := &r.p
	xd, xw := p.MoleFractions(false), p.MoleFractions(true)
	out := fluegasJSON{
		Fuel:  r.q.fuel.Name,
		FlueT: r.q.flueT, AirT: p.AirT, RefT: r.l.RefT,
		Lambda: p.Lambda, ExcessAir: 100 * (p.Lambda - 1),
		StoichAir: p.Stoich.Air, StoichFlue: r.stoichFlue,
		Air: p.Air, FlueGas: p.FlueGas, DryFlueGas: p.DryFlueGas,
		FlueGasNm3:    p.NormalVolume(true),
		HumidityRatio: p.HumidityRatio,
		CO2Dry:        100 * xd[combustion.CO2], O2Dry: 100 * xd[combustion.O2], SO2Dry: 1e6 * xd[combustion.SO2],
		N2Dry: 100 * xd[combustion.N2], ArDry: 100 * xd[combustion.Ar],
		CO2Wet: 100 * xw[combustion.CO2], O2Wet: 100 * xw[combustion.O2], SO2Wet: 1e6 * xw[combustion.SO2],
		H2OWet: 100 * xw[combustion.H2O], N2Wet: 100 * xw[combustion.N2], ArWet: 100 * xw[combustion.Ar],
		Losses:        lossesOf(r.l.LHV),
		LossesHHV:     lossesOf(r.l.HHV),
		EfficiencyLHV: r.l.LHV.Efficiency,
		EfficiencyHHV: r.l.HHV.Efficiency,
		AcidDewMethod: "Verhoff-Banchero (1974)",
		SO3Conversion: 100 * r.q.so3,
		SiegertForm:   "1. BImSchV, " + r.siegertForm + ", " + r.siegertSet,
		LHV:           r.l.LHV.HeatInput, HHV: r.l.HHV.HeatInput,
		LHVSource: r.l.LHV.Source.String(), HHVSource: r.l.HHV.Source.String(),
		Warnings: append([]string{}, r.warnings...),
		Caution:  cautionLine,
	}
	out.FlueLossDetailed = out.Losses.DryGas + out.Losses.Moisture
	if r.dewOK {
		v := r.dew
		out.AcidDewPoint = &v
	}
	if r.siegertOK {
		v := r.siegert
		out.Siegert = &v
	}
	return out
}

func writeFluegasTable(w io.Writer, a *fluegasArgs, r *fluegasResult, o *fluegasJSON) error {
	p := &r.p
	q := &r.q
	c := func(T float64) string { return fmtF(T-273.15, 1) }
	mj := func(v float64) string { return fmtF(v/1e6, 3) }

	fmt.Fprintf(w, "Boiler efficiency from a flue-gas measurement (heat-loss method)\n")
	fmt.Fprintf(w, "Fuel: %s; analysis as fired, %% m/m: %s\n", q.fuel.Name, analysisText(q.fuel.Analysis))
	fmt.Fprintf(w, "Measured: %s\n\n", a.inputs())

	tw := tabwriter.NewWriter(w, 0, 8, 2, ' ', 0)
	fmt.Fprintf(tw, "Fuel\n")
	fmt.Fprintf(tw, "  LHV (net)\t%s\tMJ/kg\t%s\n", mj(o.LHV), o.LHVSource)
	fmt.Fprintf(tw, "  HHV (gross)\t%s\tMJ/kg\t%s\n", mj(o.HHV), o.HHVSource)
	fmt.Fprintf(tw, "\n")
	fmt.Fprintf(tw, "Combustion (per kg fuel)\n")
	fmt.Fprintf(tw, "  air ratio λ\t%s\t\t%s %% excess air\n", fmtF(o.Lambda, 4), fmtF(o.ExcessAir, 2))
	fmt.Fprintf(tw, "  stoichiometric air\t%s\tkg/kg\tdry air\n", fmtF(o.StoichAir, 3))
	fmt.Fprintf(tw, "  combustion air\t%s\tkg/kg\twith its humidity, %s kg/kg dry air\n", fmtF(o.Air, 3), fmtF(o.HumidityRatio, 4))
	fmt.Fprintf(tw, "  stoichiometric flue gas\t%s\tkg/kg\twet, at λ = 1\n", fmtF(o.StoichFlue, 3))
	fmt.Fprintf(tw, "  flue gas\t%s\tkg/kg\twet; %s kg/kg dry; %s Nm3/kg wet\n", fmtF(o.FlueGas, 3), fmtF(o.DryFlueGas, 3), fmtF(o.FlueGasNm3, 2))
	fmt.Fprintf(tw, "\n")
	fmt.Fprintf(tw, "Flue-gas composition\tdry\twet\n")
	fmt.Fprintf(tw, "  CO2, %%\t%s\t%s\n", fmtF(o.CO2Dry, 2), fmtF(o.CO2Wet, 2))
	fmt.Fprintf(tw, "  O2, %%\t%s\t%s\n", fmtF(o.O2Dry, 2), fmtF(o.O2Wet, 2))
	fmt.Fprintf(tw, "  SO2, ppm\t%s\t%s\n", fmtF(o.SO2Dry, 0), fmtF(o.SO2Wet, 0))
	fmt.Fprintf(tw, "  H2O, %%\t-\t%s\n", fmtF(o.H2OWet, 2))
	fmt.Fprintf(tw, "  N2, %%\t%s\t%s\n", fmtF(o.N2Dry, 2), fmtF(o.N2Wet, 2))
	fmt.Fprintf(tw, "  Ar, %%\t%s\t%s\n", fmtF(o.ArDry, 2), fmtF(o.ArWet, 2))
	fmt.Fprintf(tw, "\n")
	fmt.Fprintf(tw, "Losses, %% of the fuel input\tLHV basis\tHHV basis\n")
	row := func(name string, v1, v2 float64) {
		fmt.Fprintf(tw, "  %s\t%s\t%s\n", name, fmtF(v1, 2), fmtF(v2, 2))
	}
	row("dry flue gas", o.Losses.DryGas, o.LossesHHV.DryGas)
	row("moisture", o.Losses.Moisture, o.LossesHHV.Moisture)
	row("radiation and convection", o.Losses.Radiation, o.LossesHHV.Radiation)
	row("unburnt (CO and solids)", o.Losses.Unburnt, o.LossesHHV.Unburnt)
	row("total", o.Losses.Total, o.LossesHHV.Total)
	row("efficiency", o.EfficiencyLHV, o.EfficiencyHHV)
	if err := tw.Flush(); err != nil {
		return err
	}

	fmt.Fprintf(w, "\nEfficiency: %s %% on the LHV (net) basis, %s %% on the HHV (gross) basis.\n",
		fmtF(o.EfficiencyLHV, 2), fmtF(o.EfficiencyHHV, 2))
	if r.siegertOK {
		fmt.Fprintf(w, "Siegert cross-check (1. BImSchV, %s, %s): flue-gas loss %s %%, against dry gas + moisture %s %% (LHV).\n",
			r.siegertForm, r.siegertSet, fmtF(r.siegert, 2), fmtF(o.FlueLossDetailed, 2))
	} else {
		fmt.Fprintf(w, "Siegert cross-check: %s\n", r.siegertNote)
	}
	if r.dewOK {
		fmt.Fprintf(w, "Acid dew point (Verhoff-Banchero, %s %% of the SO2 to SO3): %s °C; the flue gas at %s °C is %s K above it.\n",
			fmtG(100*q.so3), c(r.dew), c(q.flueT), fmtF(q.flueT-r.dew, 1))
	} else {
		fmt.Fprintf(w, "Acid dew point: %s.\n", r.dewNote)
	}
	fmt.Fprintf(w, "Reference temperature: the air temperature, %s °C (as in Siegert's formula); the fuel is taken at it, so there are no credits. Complete combustion; ideal gases (NASA TM-4513 data).\n",
		c(p.AirT))
	if len(r.warnings) > 0 {
		fmt.Fprintf(w, "\nWarnings:\n")
		for _, s := range r.warnings {
			fmt.Fprintf(w, "  - %s\n", s)
		}
	}
	_, err := fmt.Fprintf(w, "\n%s\n", cautionLine)
	return err
}

// analysisText writes an analysis as "C 86.00, H 11.00, ...", leaving out
// water and ash when they are zero.
func analysisText(an fuel.Analysis) string {
	vals := [...]float64{an.C, an.H, an.S, an.N, an.O, an.Water, an.Ash}
	var parts []string
	for i, k := range analysisKeys {
		if i >= 5 && vals[i] == 0 {
			continue
		}
		parts = append(parts, k+" "+fmtF(100*vals[i], 2))
	}
	return strings.Join(parts, ", ")
}

// inputs echoes the measurement as given.
func (a *fluegasArgs) inputs() string {
	var parts []string
	for _, f := range []struct{ name, val string }{
		{"O2", a.o2}, {"CO2", a.co2}, {"CO", a.co}, {"flue gas", a.gas}, {"air", a.air},
		{"humidity", a.humidity}, {"load", a.load},
	} {
		if v := strings.TrimSpace(f.val); v != "" {
			parts = append(parts, f.name+" "+v)
		}
	}
	return strings.Join(parts, ", ")
}

func fmtF(v float64, dec int) string { return strconv.FormatFloat(v, 'f', dec, 64) }
func fmtG(v float64) string          { return strconv.FormatFloat(v, 'g', 6, 64) }
