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

	"steamcase/plant/schema"
	"steamcase/plant/units"
	"steamcase/plant/water"
)

func steamCommand() *command {
	return &command{
		Name: "steam",
		UsageLine: `--p PRESSURE (--t TEMPERATURE | --h ENTHALPY | --s ENTROPY | --x QUALITY) [--ambient PRESSURE] [--json]
--t TEMPERATURE --x QUALITY [--ambient PRESSURE] [--json]`,
		Short: "look up a water or steam state (IAPWS-IF97)",
		Long: `Steam looks up one state of water or steam with the IAPWS-IF97 formulation
and prints its properties. The state is fixed by the pressure and one more
property (temperature, specific enthalpy, specific entropy or quality), or,
on the saturation line, by the temperature and the quality.

Each value is a quantity with its unit. Pressures must say whether they are
gauge or absolute: "7 bar(g)", "8 bar(a)", "0.8 MPa" and "120 psig" are
accepted, "7 bar" is not. Gauge pressures are taken relative to the ambient
pressure, which is 1.01325 bar(a) unless --ambient gives another. The
quality is the steam mass fraction of a two-phase mixture, written as a plain
number from 0 (saturated liquid) to 1 (saturated vapour) or as a percentage.

The table shows the pressure in bar(a) and bar(g), the temperature in °C,
the specific enthalpy in kJ/kg, the specific entropy and the specific heat cp
in kJ/kgK, the specific volume in m3/kg and the density in kg/m3, with the
quality ("-" for a single phase), the phase and the IF97 region. With --json
the state is printed as one JSON object in SI units, the unit in each key:
p_Pa, T_K, h_J_per_kg, s_J_per_kgK, v_m3_per_kg, rho_kg_per_m3,
cp_J_per_kgK, x (null for a single phase), region and phase, and the
caution as "caution". A state asked for by its quality shows it, also at
x = 0 and x = 1 (the saturated liquid and vapour). A property that is not
defined for the state (cp inside the two-phase region) is shown as "-" and
written as null.

Examples:

	sim steam --p "7 bar(g)" --x 1
	sim steam --p "1.2 MPa" --t "250 C"
	sim steam --p "16 bar(g)" --h "2900 kJ/kg" --json
	sim steam --t "170 C" --x 0`,
		Flags: func() *flag.FlagSet { return new(steamArgs).flagSet() },
		Run:   runSteam,
	}
}

// steamArgs holds the flags of sim steam, as given.
type steamArgs struct {
	p, t, h, s, x, ambient string
	json                   bool
}

func (a *steamArgs) flagSet() *flag.FlagSet {
	fs := flag.NewFlagSet("steam", flag.ContinueOnError)
	fs.StringVar(&a.p, "p", "", "the `PRESSURE`, gauge or absolute: \"7 bar(g)\", \"8 bar(a)\", \"0.8 MPa\",\n\"120 psig\"")
	fs.StringVar(&a.t, "t", "", "the `TEMPERATURE`: \"250 C\", \"523.15 K\", \"482 F\"")
	fs.StringVar(&a.h, "h", "", "the specific `ENTHALPY`: \"2768 kJ/kg\", \"2.768 MJ/kg\"")
	fs.StringVar(&a.s, "s", "", "the specific `ENTROPY`: \"6.6 kJ/kgK\", \"6600 J/kgK\"")
	fs.StringVar(&a.x, "x", "", "the `QUALITY` (steam mass fraction): a number from 0 to 1, such as 1\nor 0.85, or \"85 %\"")
	fs.StringVar(&a.ambient, "ambient", "", "the ambient `PRESSURE` that gauge values refer to, absolute:\n\"1.013 bar(a)\", \"1000 mbar(a)\" (default 1.01325 bar(a), the standard\natmosphere)")
	fs.BoolVar(&a.json, "json", false, "print one JSON object in SI units instead of the table")
	return fs
}

// steamQuery is a parsed, checked request: the SI inputs and the one
// water function that fixes the state.
type steamQuery struct {
	by      string // "p,T", "p,h", "p,s", "p,x" or "T,x"
	p, t, h float64
	s, x    float64
	opt     units.Options
}

func runSteam(ctx context.Context, e env, args []string) error {
	var a steamArgs
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
	st, err := q.lookup()
	if err != nil {
		return err
	}
	sat := saturated(st, strings.HasSuffix(q.by, "x"))
	if a.json {
		return writeSteamJSON(e.stdout, st, sat)
	}
	return writeSteamTable(e.stdout, st, sat, &a, q.opt)
}

// query checks which flags were given and parses their values.
func (a *steamArgs) query() (steamQuery, error) {
	var q steamQuery
	var given []string
	for _, f := range []struct {
		name, val string
	}{{"p", a.p}, {"t", a.t}, {"h", a.h}, {"s", a.s}, {"x", a.x}} {
		if strings.TrimSpace(f.val) != "" {
			given = append(given, f.name)
		}
	}
	by := strings.Join(given, ",")
	switch by {
	case "p,t", "p,h", "p,s", "p,x", "t,x":
	case "":
		return q, usagef("no state given: give --p with one of --t, --h, --s or --x, or --t with --x")
	case "p":
		return q, usagef("--p alone does not fix a state: add one of --t, --h, --s or --x")
	case "t", "h", "s", "x":
		return q, usagef("--%s alone does not fix a state: add --p (or, for --t, --x on the saturation line)", by)
	default:
		return q, usagef("--%s given together: give --p with exactly one of --t, --h, --s or --x, or --t with --x",
			strings.Join(given, ", --"))
	}

	if strings.TrimSpace(a.ambient) != "" {
		amb, err := units.Parse(a.ambient, units.Pressure, units.Options{})
		if err != nil {
			return q, flagValueError("ambient", err)
		}
		if qa, _ := units.ParseAny(a.ambient, units.Options{}); isGauge(qa.Unit) {
			return q, &usageError{msg: fmt.Sprintf("--ambient %q: the ambient pressure must be absolute, such as \"1.013 bar(a)\"", a.ambient), echoes: []string{a.ambient}}
		}
		q.opt.AmbientPressure = amb
		if err := q.opt.Validate(); err != nil {
			// well written, but out of range: a failure, not a usage error
			return q, echoError{fmt.Errorf("--ambient %q is %s bar(a); an ambient pressure must lie between 0.5 and 1.5 bar(a)",
				a.ambient, strconv.FormatFloat(amb/1e5, 'g', 6, 64)), []string{a.ambient}}
		}
	}
	parse := func(name, val string, d units.Dimension) (float64, error) {
		v, err := units.Parse(val, d, q.opt)
		if err != nil {
			return 0, flagValueError(name, err)
		}
		return v, nil
	}
	var err error
	q.by = strings.Replace(by, "t", "T", 1)
	if a.p != "" {
		if q.p, err = parse("p", a.p, units.Pressure); err != nil {
			return q, err
		}
	}
	if a.t != "" {
		if q.t, err = parse("t", a.t, units.Temperature); err != nil {
			return q, err
		}
	}
	if a.h != "" {
		if q.h, err = parse("h", a.h, units.SpecificEnergy); err != nil {
			return q, err
		}
	}
	if a.s != "" {
		if q.s, err = parse("s", a.s, units.SpecificHeat); err != nil {
			return q, err
		}
	}
	if a.x != "" {
		if q.x, err = parse("x", a.x, units.Fraction); err != nil {
			return q, err
		}
		if !(q.x >= 0 && q.x <= 1) {
			return q, echoError{fmt.Errorf("--x %q: the quality must be from 0 to 1 (as a percentage, 0 %% to 100 %%); got %s",
				a.x, strconv.FormatFloat(q.x, 'g', -1, 64)), []string{a.x}}
		}
	}
	return q, nil
}

// isGauge reports whether unit is a gauge pressure unit.
func isGauge(unit string) bool {
	u, err := units.Lookup(unit)
	return err == nil && u.Gauge
}

// flagValueError turns a units error into a usage error (a malformed or
// misunderstood value: exit 2) or a failure (a value that is well written
// but not physical, such as "-2 bar(g)": exit 1).
// The message repeats the value given, cut when it is long.
func flagValueError(name string, err error) error {
	var ue *units.Error
	if errors.As(err, &ue) && (ue.Kind == units.ErrPhysical || ue.Kind == units.ErrRange) {
		return fmt.Errorf("--%s: %w", name, err)
	}
	u := &usageError{msg: fmt.Sprintf("--%s: %s", name, err)}
	if ue != nil {
		u.echoes = []string{ue.Input, ue.Unit}
	}
	return u
}

// echoError is a failure whose message repeats values the user gave,
// listed to be cut when long.
type echoError struct {
	err    error
	echoes []string
}

func (e echoError) Error() string { return shortenEchoes(e.err.Error(), e.err, e.echoes...) }
func (e echoError) Unwrap() error { return e.err }

// waterError words an error of plant/water for the command's user: the
// bound crossed, without the package's function names, and, on the
// saturation line, the flag that fixes the state there.
func waterError(err error) error {
	var se *water.SaturationError
	if errors.As(err, &se) {
		return fmt.Errorf("%s bar(a) and %s °C lie on the saturation line (the saturation pressure at that temperature is %s bar(a), IAPWS-IF97 Eq. 30): "+
			"pressure and temperature do not fix the state there; give the quality with --x instead of --t or --p",
			strconv.FormatFloat(se.P/1e5, 'g', 6, 64), strconv.FormatFloat(se.T-273.15, 'f', 2, 64), strconv.FormatFloat(se.PSat/1e5, 'g', 6, 64))
	}
	var re *water.RangeError
	var ie *water.InputError
	var ce *water.ConvergenceError
	fn := ""
	switch {
	case errors.As(err, &re):
		fn = re.Func
	case errors.As(err, &ie):
		fn = ie.Func
	case errors.As(err, &ce):
		fn = ce.Func
	default:
		return err
	}
	return errors.New(strings.TrimPrefix(err.Error(), "water."+fn+": "))
}

func (q steamQuery) lookup() (water.State, error) {
	var st water.State
	var err error
	switch q.by {
	case "p,T":
		st, err = water.PT(q.p, q.t)
	case "p,h":
		st, err = water.PH(q.p, q.h)
	case "p,s":
		st, err = water.PS(q.p, q.s)
	case "p,x":
		st, err = water.PX(q.p, q.x)
	case "T,x":
		st, err = water.TX(q.t, q.x)
	default:
		panic("sim: steam query by " + q.by)
	}
	if err != nil {
		return st, waterError(err)
	}
	// No NaN may reach a report: the state variables must be finite.
	for _, f := range []struct {
		name string
		v    float64
	}{{"pressure", st.P}, {"temperature", st.T}, {"specific enthalpy", st.H},
		{"specific entropy", st.S}, {"specific volume", st.V}, {"density", st.Rho}} {
		if math.IsNaN(f.v) || math.IsInf(f.v, 0) {
			return st, fmt.Errorf("the %s of the state is not finite (%v); the inputs lie outside what IAPWS-IF97 covers", f.name, f.v)
		}
	}
	return st, nil
}

// saturated reports whether the state lies on or under the saturation
// line, where the quality x is defined: a two-phase state, or a state asked
// for by its quality (x = 0 and x = 1 give the saturated liquid and vapour,
// which plant/water reports as single-phase states of region 1, 2 or 3).
func saturated(st water.State, byQuality bool) bool {
	return byQuality || st.Phase == water.TwoPhase || st.Region == water.RegionTwoPhase
}

// cpOf returns cp, or nil where it is not defined: inside the two-phase
// region, where plant/water sets it to 0, or if it is not finite.
func cpOf(st water.State) *float64 {
	if st.Phase == water.TwoPhase || st.Cp <= 0 {
		return nil
	}
	return finite(st.Cp)
}

// finite returns a pointer to v, or nil if v is NaN or infinite.
func finite(v float64) *float64 {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return nil
	}
	return &v
}

// steamJSON is the JSON form of a state, in SI units.
type steamJSON struct {
	Version string   `json:"version"`
	P       float64  `json:"p_Pa"`
	T       float64  `json:"T_K"`
	H       float64  `json:"h_J_per_kg"`
	S       float64  `json:"s_J_per_kgK"`
	V       float64  `json:"v_m3_per_kg"`
	Rho     float64  `json:"rho_kg_per_m3"`
	Cp      *float64 `json:"cp_J_per_kgK"`
	X       *float64 `json:"x"`
	Region  int      `json:"region"`
	Phase   string   `json:"phase"`
	Caution string   `json:"caution"`
}

func writeSteamJSON(w io.Writer, st water.State, sat bool) error {
	out := steamJSON{
		P: st.P, T: st.T, H: st.H, S: st.S, V: st.V, Rho: st.Rho,
		Cp:      cpOf(st),
		Region:  int(st.Region),
		Phase:   st.Phase.String(),
		Caution: cautionLine,
	}
	if sat {
		out.X = finite(st.X)
	}
	out.Version = version()
	schema.RoundFigures(&out) // the rule of every JSON document (plant/schema)
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(out)
}

func writeSteamTable(w io.Writer, st water.State, sat bool, a *steamArgs, opt units.Options) error {
	conv := func(v float64, unit string) float64 {
		x, err := opt.FromSI(v, unit)
		if err != nil {
			panic("sim: " + err.Error()) // fixed, known units
		}
		return x
	}
	g := func(v float64, sig int) string { return strconv.FormatFloat(v, 'g', sig, 64) }
	f := func(v float64, dec int) string { return strconv.FormatFloat(v, 'f', dec, 64) }

	fmt.Fprintf(w, "Water and steam state (IAPWS-IF97) at %s\n\n", a.inputs())
	tw := tabwriter.NewWriter(w, 0, 8, 2, ' ', 0)
	amb := opt.AmbientPressure
	if amb == 0 {
		amb = units.StandardAtmosphere
	}
	fmt.Fprintf(tw, "pressure\t%s\tbar(a)\n", g(conv(st.P, "bar(a)"), 6))
	fmt.Fprintf(tw, "pressure, gauge\t%s\tbar(g)\t(ambient %s bar(a))\n", g(conv(st.P, "bar(g)"), 6), g(amb/1e5, 6))
	fmt.Fprintf(tw, "temperature\t%s\t°C\t(%s K)\n", f(conv(st.T, "°C"), 2), f(st.T, 2))
	fmt.Fprintf(tw, "specific enthalpy\t%s\tkJ/kg\n", f(conv(st.H, "kJ/kg"), 1))
	fmt.Fprintf(tw, "specific entropy\t%s\tkJ/kgK\n", f(conv(st.S, "kJ/kgK"), 4))
	fmt.Fprintf(tw, "specific volume\t%s\tm3/kg\n", g(st.V, 6))
	fmt.Fprintf(tw, "density\t%s\tkg/m3\n", g(st.Rho, 6))
	cp := "-"
	if p := cpOf(st); p != nil {
		cp = f(conv(*p, "kJ/kgK"), 4)
	}
	fmt.Fprintf(tw, "specific heat cp\t%s\tkJ/kgK\n", cp)
	x := "-"
	phase := st.Phase.String()
	if sat {
		x = f(st.X, 4)
		if st.Phase != water.TwoPhase {
			phase += ", saturated"
		}
	}
	fmt.Fprintf(tw, "quality x\t%s\n", x)
	fmt.Fprintf(tw, "phase\t%s\n", phase)
	fmt.Fprintf(tw, "IF97 region\t%d\n", int(st.Region))
	if err := tw.Flush(); err != nil {
		return err
	}
	_, err := fmt.Fprintf(w, "\n%s\n", cautionLine)
	return err
}

// inputs echoes the given values: "p = 7 bar(g), x = 1".
func (a *steamArgs) inputs() string {
	var parts []string
	for _, f := range []struct{ name, val string }{{"p", a.p}, {"T", a.t}, {"h", a.h}, {"s", a.s}, {"x", a.x}} {
		if v := strings.TrimSpace(f.val); v != "" {
			parts = append(parts, f.name+" = "+v)
		}
	}
	return strings.Join(parts, ", ")
}
