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
	"steamcase/plant/schema"
	"steamcase/plant/units"
)

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

A reading that no firing boiler gives is refused (exit 1): an O2 at or
within 0.1 point of the air's (analysers show air as 20.9 %), a reading
that means an air ratio above 20, a flue gas at or below its water dew
point (the account lets the moisture leave as vapour) or below 25 °C, and
losses that add up to the whole heat input or more.

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

// fluegasQuery is a parsed request: the reading for plant/combustion and,
// for messages, the unit each value was given in.
type fluegasQuery struct {
	reading combustion.FlueGasReading
	unitOf  map[combustion.ReadingField]string
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
	r, err := combustion.CheckFlueGas(q.reading, &combustion.CheckSettings{
		Name:  func(f combustion.ReadingField) string { return "--" + flagOf(f) },
		Value: combustion.ValuesIn(q.unitOf),
	})
	if err != nil {
		return a.readingError(err)
	}
	out := r.JSON() // its caution is cautionLine, as the table's (a test keeps them equal)
	// Marshalling also checks that no NaN or infinity reaches a report,
	// for the table too: encoding/json refuses them.
	var b []byte
	if a.json {
		// The rule of every JSON document (plant/schema): the program's
		// version in front, six significant digits.
		doc := struct {
			Version string `json:"version"`
			combustion.FlueGasJSON
		}{version(), out}
		schema.RoundFigures(&doc)
		b, err = json.MarshalIndent(&doc, "", "  ")
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

// flagOf is the flag that gives a field; a field no flag gives keeps its
// Go name.
func flagOf(f combustion.ReadingField) string {
	switch f {
	case combustion.FieldFuel:
		return "fuel"
	case combustion.FieldAnalysis:
		return "fuel-analysis"
	case combustion.FieldLHV:
		return "lhv"
	case combustion.FieldGas, combustion.FieldO2:
		return "o2"
	case combustion.FieldCO2:
		return "co2"
	case combustion.FieldFlueT:
		return "gas"
	case combustion.FieldAirT:
		return "air"
	case combustion.FieldHumidity, combustion.FieldRelativeHumidity:
		return "humidity"
	case combustion.FieldCO:
		return "co"
	case combustion.FieldRadiation:
		return "radiation"
	case combustion.FieldLoad:
		return "load"
	case combustion.FieldSolids:
		return "solids"
	case combustion.FieldSO3:
		return "so3"
	}
	return f.String()
}

// readingError words an error of plant/combustion as the flags gave the
// value: `--gas "30 C": the flue gas ... `. It is a failure (exit 1): the
// flags were well formed.
func (a *fluegasArgs) readingError(err error) error {
	var re *combustion.ReadingError
	if !errors.As(err, &re) {
		return err
	}
	if re.Field == combustion.FieldFuel {
		return errors.New(re.Msg) // names the fuel
	}
	if raw := a.raw(flagOf(re.Field)); raw != "" {
		return fmt.Errorf("--%s %q: %s", flagOf(re.Field), raw, re.Msg)
	}
	return errors.New(re.Msg)
}

// raw returns the text given for a flag, "" if none.
func (a *fluegasArgs) raw(flag string) string {
	for _, f := range [...]struct {
		name string
		val  *string
	}{{"fuel", &a.fuel}, {"fuel-analysis", &a.analysis}, {"lhv", &a.lhv}, {"o2", &a.o2}, {"co2", &a.co2}, {"co", &a.co},
		{"gas", &a.gas}, {"air", &a.air}, {"humidity", &a.humidity}, {"load", &a.load}, {"radiation", &a.radiation},
		{"solids", &a.solids}, {"so3", &a.so3}} {
		if f.name == flag {
			return strings.TrimSpace(*f.val)
		}
	}
	return ""
}

func given(s string) bool { return strings.TrimSpace(s) != "" }

// query checks which flags were given and reads their values. Malformed
// values and missing or clashing flags are usage errors; whether the
// values make sense is for plant/combustion to judge.
func (a *fluegasArgs) query() (fluegasQuery, error) {
	q := fluegasQuery{unitOf: map[combustion.ReadingField]string{}}
	if err := a.checkGiven(); err != nil {
		return q, err
	}
	var err error
	if q.reading.Fuel, err = a.fuelOf(q.unitOf); err != nil {
		return q, err
	}
	if err := a.measurement(&q); err != nil {
		return q, err
	}
	if err := a.temperatures(&q); err != nil {
		return q, err
	}
	if given(a.humidity) {
		if err := parseHumidity(a.humidity, &q.reading); err != nil {
			return q, err
		}
	}
	return q, a.losses(&q)
}

// checkGiven checks the flags that must, or must not, come together.
func (a *fluegasArgs) checkGiven() error {
	switch {
	case !given(a.fuel) && !given(a.analysis):
		return usagef("no fuel given: give --fuel with a grade (%s) or --fuel-analysis with the fuel's analysis", strings.Join(fuel.GradeNames(), ", "))
	case given(a.o2) && given(a.co2):
		return usagef("--o2 and --co2 given together: give the one the analyser measured")
	case !given(a.o2) && !given(a.co2):
		return usagef("no flue-gas measurement given: give --o2 (or --co2) in percent of the dry flue gas, such as --o2 \"3 %%\"")
	case !given(a.gas):
		return usagef("no flue-gas temperature given: give --gas, such as --gas \"250 C\"")
	case !given(a.air):
		return usagef("no air temperature given: give --air, such as --air \"35 C\"")
	case given(a.load) && !given(a.radiation):
		return usagef("--load scales the radiation and convection loss: give --radiation with it, such as --radiation \"1 %%\"")
	}
	return nil
}

// fuelOf reads --fuel, --fuel-analysis and --lhv into the fuel.
func (a *fluegasArgs) fuelOf(unitOf map[combustion.ReadingField]string) (fuel.Fuel, error) {
	var f fuel.Fuel
	if given(a.fuel) {
		g, err := fuel.Grade(strings.TrimSpace(a.fuel))
		if err != nil {
			return f, usagef("--fuel %q: unknown fuel grade; the known grades are %s (or give --fuel-analysis for your own fuel)",
				a.fuel, strings.Join(fuel.GradeNames(), ", "))
		}
		f = g
	} else {
		f = fuel.Fuel{Name: "own fuel (--fuel-analysis)", Class: fuel.Residual}
	}
	if given(a.analysis) {
		an, err := parseAnalysis(a.analysis)
		if err != nil {
			return f, err
		}
		if given(a.fuel) {
			f = combustion.FuelWithAnalysis(f, an)
		} else {
			f.Analysis = an
		}
		unitOf[combustion.FieldAnalysis] = "%"
	}
	if given(a.lhv) {
		v, err := units.Parse(a.lhv, units.SpecificEnergy, units.Options{})
		if err != nil {
			return f, flagValueError("lhv", err)
		}
		q, _ := units.ParseAny(a.lhv, units.Options{})
		f.SetLHV = v
		f.SetLHVSource = "given with --lhv"
		unitOf[combustion.FieldLHV] = q.Unit
	}
	return f, nil
}

// measurement reads --o2 or --co2.
func (a *fluegasArgs) measurement(q *fluegasQuery) error {
	r := &q.reading
	var err error
	if given(a.o2) {
		r.Gas = combustion.MeasuredO2
		r.Dry, err = parsePercent("o2", a.o2)
		q.unitOf[combustion.FieldO2] = "%"
	} else {
		r.Gas = combustion.MeasuredCO2
		r.Dry, err = parsePercent("co2", a.co2)
		q.unitOf[combustion.FieldCO2] = "%"
	}
	return err
}

// temperatures reads --air and --gas.
func (a *fluegasArgs) temperatures(q *fluegasQuery) error {
	r := &q.reading
	var err error
	if r.AirT, q.unitOf[combustion.FieldAirT], err = parseTemperature("air", a.air); err != nil {
		return err
	}
	r.FlueT, q.unitOf[combustion.FieldFlueT], err = parseTemperature("gas", a.gas)
	return err
}

// losses reads --co, --radiation, --load, --solids and --so3.
func (a *fluegasArgs) losses(q *fluegasQuery) error {
	r := &q.reading
	if given(a.co) {
		ppm, unit, err := parseCO(a.co)
		if err != nil {
			return err
		}
		r.COppmDry = ppm
		q.unitOf[combustion.FieldCO] = unit
	}
	for _, f := range [...]struct {
		name  string
		val   string
		field combustion.ReadingField
		to    *float64
	}{
		{"radiation", a.radiation, combustion.FieldRadiation, &r.RadiationAtMCR},
		{"load", a.load, combustion.FieldLoad, &r.Load},
		{"solids", a.solids, combustion.FieldSolids, &r.Solids},
		{"so3", a.so3, combustion.FieldSO3, &r.SO3Conversion},
	} {
		if !given(f.val) {
			continue
		}
		v, err := parsePercent(f.name, f.val)
		if err != nil {
			return err
		}
		*f.to = v
		q.unitOf[f.field] = "%"
	}
	r.RadiationGiven = given(a.radiation)
	if given(a.so3) && r.SO3Conversion == 0 {
		// 0 % would read as the default; refuse it as the range does.
		return fmt.Errorf("--so3 %q: the SO2 to SO3 conversion must be above 0 %% and at most %g %% (1 %% to 5 %% is usual in oil firing)", a.so3, 100*combustion.MaxSO3Conversion)
	}
	if given(a.load) && r.Load == 0 {
		return fmt.Errorf("--load %q: the load must lie between %g %% and %g %% of MCR", a.load, 100*combustion.MinCheckLoad, 100*combustion.MaxCheckLoad)
	}
	return nil
}

// analysisKeys are the keys of --fuel-analysis in the order they print.
var analysisKeys = [...]string{"C", "H", "S", "N", "O", "W", "A"}

// parseAnalysis reads "C=86,H=11,S=2.5,N=0.3,O=0.2" (mass % as fired). A
// malformed text is a usage error; whether the values make an analysis
// (each 0 to 100 %, adding up to 100 %) is checked by plant/combustion.
func parseAnalysis(s string) (fuel.Analysis, error) {
	var an fuel.Analysis
	var seen [len(analysisKeys)]bool
	fields := [len(analysisKeys)]*float64{&an.C, &an.H, &an.S, &an.N, &an.O, &an.Water, &an.Ash}
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
		i := -1
		for j, key := range analysisKeys {
			if key == k {
				i = j
			}
		}
		if i < 0 {
			return an, usagef("--fuel-analysis %q: unknown key %q; the keys are C, H, S, N, O, W (free water) and A (ash)", s, k)
		}
		if seen[i] {
			return an, usagef("--fuel-analysis %q: %s given twice", s, k)
		}
		seen[i] = true
		v = strings.TrimSpace(strings.TrimSuffix(strings.TrimSpace(v), "%"))
		x, err := strconv.ParseFloat(v, 64)
		if err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
			return an, usagef("--fuel-analysis %q: the value of %s is %q; want a finite number in percent by mass, such as %s=86", s, k, v, k)
		}
		*fields[i] = x / 100
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

// parseTemperature reads a temperature and the unit it was given in.
func parseTemperature(name, val string) (float64, string, error) {
	v, err := units.Parse(val, units.Temperature, units.Options{})
	if err != nil {
		return 0, "", flagValueError(name, err)
	}
	q, _ := units.ParseAny(val, units.Options{})
	unit := q.Unit
	if q.Dim != units.Temperature {
		unit = "°C" // "K" resolved to a difference: write the message in °C
	}
	return v, unit, nil
}

// parseCO reads the CO reading in ppm ("50 ppm") or percent ("0.005 %")
// and returns ppm by volume and the unit it was given in.
func parseCO(val string) (float64, string, error) {
	s := strings.TrimSpace(val)
	if num, ok := strings.CutSuffix(s, "ppm"); ok {
		x, err := strconv.ParseFloat(strings.TrimSpace(num), 64)
		if err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
			return 0, "", usagef("--co %q: want a number before ppm, such as \"50 ppm\"", val)
		}
		return x, "ppm", nil
	}
	q, err := units.ParseAny(s, units.Options{})
	if err != nil || q.Dim != units.Fraction || q.Unit != "%" {
		return 0, "", usagef("--co %q: want ppm or a percentage, such as \"50 ppm\" or \"0.005 %%\"", val)
	}
	return q.Value * 1e6, "%", nil
}

// parseHumidity reads a relative humidity ("60 %") or a humidity ratio
// ("0.012 kg/kg", "12 g/kg") into r.
func parseHumidity(val string, r *combustion.FlueGasReading) error {
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
		r.Humidity = x * u.scale
		return nil
	}
	q, err := units.ParseAny(s, units.Options{})
	if err != nil || q.Dim != units.Fraction || q.Unit != "%" {
		return usagef("--humidity %q: want a relative humidity such as \"60 %%\" or a humidity ratio such as \"0.012 kg/kg\"", val)
	}
	r.RelativeHumidity = q.Value
	return nil
}

func writeFluegasTable(w io.Writer, a *fluegasArgs, r *combustion.FlueGasCheck, o *combustion.FlueGasJSON) error {
	p := &r.Products
	c := func(T float64) string { return fmtF(T-273.15, 1) }
	mj := func(v float64) string { return fmtF(v/1e6, 3) }

	fmt.Fprintf(w, "Boiler efficiency from a flue-gas measurement (heat-loss method)\n")
	fmt.Fprintf(w, "Fuel: %s; analysis as fired, %% m/m: %s\n", r.Reading.Fuel.Name, analysisText(r.Reading.Fuel.Analysis))
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
	if s := &r.Siegert; s.Known {
		fmt.Fprintf(w, "Siegert cross-check (1. BImSchV, %s, %s): flue-gas loss %s %%, against dry gas + moisture %s %% (LHV).\n",
			s.Form, s.Set, fmtF(s.Loss, 2), fmtF(o.FlueLossDetailed, 2))
	} else {
		fmt.Fprintf(w, "Siegert cross-check: %s\n", s.Note)
	}
	if d := &r.DewPoint; d.Known {
		fmt.Fprintf(w, "Acid dew point (Verhoff-Banchero, %s %% of the SO2 to SO3): %s °C; the flue gas at %s °C is %s.\n",
			fmtG(100*d.SO3Conversion), c(d.VerhoffBanchero), c(r.Reading.FlueT), marginText(d.Margin))
	} else {
		fmt.Fprintf(w, "Acid dew point: %s.\n", d.Note)
	}
	fmt.Fprintf(w, "Reference temperature: the air temperature, %s °C (as in Siegert's formula); the fuel is taken at it, so there are no credits. Complete combustion; ideal gases (NASA TM-4513 data).\n",
		c(p.AirT))
	if len(r.Warnings) > 0 {
		fmt.Fprintf(w, "\nWarnings:\n")
		for _, s := range r.Warnings {
			fmt.Fprintf(w, "  - %s\n", s)
		}
	}
	_, err := fmt.Fprintf(w, "\n%s\n", cautionLine)
	return err
}

// marginText says how far the flue gas is from its dew point, to 0.1 K:
// "14.3 K above it", "34.9 K below it" or "at it".
func marginText(d float64) string {
	s := fmtF(math.Abs(d), 1)
	switch {
	case s == fmtF(0, 1):
		return "at it (within 0.05 K)"
	case d < 0:
		return s + " K below it"
	}
	return s + " K above it"
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
