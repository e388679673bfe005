package units

import (
	"errors"
	"math"
	"strings"
	"testing"
)

// close reports whether got is within a relative 1e-12 of want (or within
// 1e-12 absolutely near zero).
func closeTo(got, want float64) bool {
	return math.Abs(got-want) <= 1e-12*math.Max(1, math.Abs(want))
}

// Sources of the expected values, used in the table:
//
//	[def]  exact by definition, NIST SP 811 (2008) Appendix B.8/B.9:
//	       1 bar = 1e5 Pa; 1 atm = 101325 Pa; 1 kgf/cm2 = 98066.5 Pa;
//	       1 lb = 0.45359237 kg; 1 in = 0.0254 m; g_n = 9.80665 m/s2, so
//	       1 psi = 6894.757293168 Pa; 1 kcal(IT) = 4186.8 J;
//	       mmHg (conventional) = 13595.1 kg/m3 * g_n * 1 mm = 133.322387415 Pa;
//	       T(K) = t(°C) + 273.15; T(K) = (t(°F) + 459.67) * 5/9;
//	       1 h = 3600 s; 1 d = 86400 s; 1 t = 1000 kg; 1 cSt = 1 mm2/s.
//	[gauge] gauge pressure + 101325 Pa (the package's documented default).
//	The products were worked out with exact rational arithmetic in Python's
//	fractions module and rounded to float64 once.
var conversions = []struct {
	in   string
	dim  Dimension
	want float64
	src  string
}{
	// The spellings of the brief.
	{"7 bar(g)", Pressure, 801325, "[def][gauge] 7e5 + 101325"},
	{"8 bar(a)", Pressure, 8e5, "[def]"},
	{"0.8 MPa", Pressure, 8e5, "[def]"},
	{"10 kg/cm2g", Pressure, 1081990, "[def][gauge] 10*98066.5 + 101325"},
	{"120 psig", Pressure, 928695.8751802034, "[def][gauge] 120*6894.757293168 + 101325"},
	{"170 C", Temperature, 443.15, "[def]"},
	{"170 °C", Temperature, 443.15, "[def]"},
	{"443 K", Temperature, 443, "[def]"},
	{"18 t/h", MassFlow, 5, "[def] 18000/3600"},
	{"5 kg/s", MassFlow, 5, "[def]"},
	{"450 kW", Power, 450e3, "[def]"},
	{"2.1 MW", Power, 2.1e6, "[def]"},
	{"300000 kcal/h", Power, 348900, "[def] 300000*4186.8/3600"},
	{"2768 kJ/kg", SpecificEnergy, 2.768e6, "[def]"},
	{"6.6 kJ/kgK", SpecificHeat, 6600, "[def]"},
	{"380 cSt", KinematicViscosity, 380e-6, "[def]"},
	{"991 kg/m3", Density, 991, "[def]"},
	{"12 m2", Area, 12, "[def]"},
	{"5 W/m2K", HeatTransferCoefficient, 5, "[def]"},
	{"24 h", Time, 86400, "[def]"},
	{"3 d", Time, 259200, "[def]"},
	{"85 %", Fraction, 0.85, "[def]"},
	// Other pressures.
	{"101.325 kPa", Pressure, 101325, "[def]"},
	{"1 atm", Pressure, 101325, "[def]"},
	{"1 Pa", Pressure, 1, "[def]"},
	{"760 mmHg", Pressure, 101325.0144354, "[def] 760*133.322387415"},
	{"14.695949 psia", Pressure, 101325.00154778028, "[def] 14.695949*6894.757293168"},
	{"1 kg/cm2a", Pressure, 98066.5, "[def]"},
	{"1 kgf/cm2(a)", Pressure, 98066.5, "[def]"},
	{"1013.25 mbar(a)", Pressure, 101325, "[def]"},
	{"5 mbar(g)", Pressure, 101825, "[def][gauge]"},
	{"5 kPa(g)", Pressure, 106325, "[def][gauge]"},
	{"0.7 MPa(g)", Pressure, 801325, "[def][gauge]"},
	{"7 barg", Pressure, 801325, "[def][gauge]"},
	{"7 bar (g)", Pressure, 801325, "[def][gauge]"},
	{"8 bara", Pressure, 8e5, "[def]"},
	{"8 bar abs", Pressure, 8e5, "[def]"},
	{"-0.5 bar(g)", Pressure, 51325, "[def][gauge]"},
	{"\u22120.5 bar(g)", Pressure, 51325, "[def][gauge] U+2212 minus sign"},
	{"+7 bar(g)", Pressure, 801325, "[def][gauge]"},
	{"  7bar(g)  ", Pressure, 801325, "[def][gauge] white space"},
	{"1.2e6 Pa", Pressure, 1.2e6, "[def]"},
	{"1.2E+6 Pa", Pressure, 1.2e6, "[def]"},
	{"12e-1 MPa", Pressure, 1.2e6, "[def]"},
	{".8 MPa", Pressure, 8e5, "[def]"},
	// Temperatures.
	{"212 °F", Temperature, 373.15, "[def]"},
	{"32 F", Temperature, 273.15, "[def]"},
	{"-40 degF", Temperature, 233.15, "[def]"},
	{"-40 deg C", Temperature, 233.15, "[def]"},
	{"0 K", Temperature, 0, "[def]"},
	{"5 K", TemperatureDifference, 5, "[def]"},
	{"5 ΔC", TemperatureDifference, 5, "[def]"},
	{"5 delta °C", TemperatureDifference, 5, "[def]"},
	{"9 ΔF", TemperatureDifference, 5, "[def] 9*5/9"},
	{"-12 K", TemperatureDifference, -12, "[def]"},
	// Flows, power, energy.
	{"3600 kg/h", MassFlow, 1, "[def]"},
	{"60 kg/min", MassFlow, 1, "[def]"},
	{"24 t/d", MassFlow, 0.2777777777777778, "[def] 24000/86400"},
	{"1 lb/h", MassFlow, 0.00012599788055555556, "[def] 0.45359237/3600"},
	{"1500 W", Power, 1500, "[def]"},
	{"1 kWh", Energy, 3.6e6, "[def]"},
	{"1 kcal", Energy, 4186.8, "[def]"},
	{"2 GJ", Energy, 2e9, "[def]"},
	{"1 kcal/kg", SpecificEnergy, 4186.8, "[def]"},
	{"40.2 MJ/kg", SpecificEnergy, 40.2e6, "[def]"},
	{"251.98 J/kg", SpecificEnergy, 251.98, "[def]"},
	{"4.1868 kJ/kg K", SpecificHeat, 4186.8, "[def]"},
	{"4.1868 kJ/(kg·K)", SpecificHeat, 4186.8, "[def]"},
	{"4.1868 kJ/kg°C", SpecificHeat, 4186.8, "[def] per degree is a difference"},
	{"1 kcal/kgK", SpecificHeat, 4186.8, "[def]"},
	{"1 J/kgK", SpecificHeat, 1, "[def]"},
	{"0.24 m3/kg", SpecificVolume, 0.24, "[def]"},
	{"1 mm2/s", KinematicViscosity, 1e-6, "[def]"},
	{"0.991 t/m3", Density, 991, "[def]"},
	{"0.991 kg/l", Density, 991, "[def]"},
	{"991 kg/m³", Density, 991, "[def]"},
	{"3 m", Length, 3, "[def]"},
	{"25 mm", Length, 0.025, "[def]"},
	{"1500 cm2", Area, 0.15, "[def]"},
	{"10 m3", Volume, 10, "[def]"},
	{"500 l", Volume, 0.5, "[def]"},
	{"36 m3/h", VolumeFlow, 0.01, "[def]"},
	{"850 t", Mass, 850e3, "[def]"},
	{"2 kg", Mass, 2, "[def]"},
	{"90 s", Time, 90, "[def]"},
	{"30 min", Time, 1800, "[def]"},
	{"15 m/s", Velocity, 15, "[def]"},
	{"0.5 kW/m2K", HeatTransferCoefficient, 500, "[def]"},
	{"0.0002 m2K/W", FoulingResistance, 0.0002, "[def]"},
	{"12 kW/K", ThermalConductance, 12e3, "[def]"},
	{"500 W/K", ThermalConductance, 500, "[def]"},
	{"45 W/mK", ThermalConductivity, 45, "[def]"},
	{"3.6 kg/kWh", SpecificConsumption, 1e-6, "[def] 3.6/3.6e6"},
	{"180 g/kWh", SpecificConsumption, 5e-8, "[def] 0.18/3.6e6"},
	{"36 kg/MWh", SpecificConsumption, 1e-8, "[def] 36/3.6e9"},
	// Fractions.
	{"0.85", Fraction, 0.85, "[def] a bare number is a fraction"},
	{"1", Fraction, 1, "[def]"},
	{"110 %", Fraction, 1.1, "[def]"},
}

func TestParseConversions(t *testing.T) {
	t.Parallel()
	for _, c := range conversions {
		got, err := Parse(c.in, c.dim, Options{})
		if err != nil {
			t.Errorf("Parse(%q, %v): %v (%s)", c.in, c.dim, err, c.src)
			continue
		}
		if !closeTo(got, c.want) {
			t.Errorf("Parse(%q, %v) = %.17g, want %.17g (%s)", c.in, c.dim, got, c.want, c.src)
		}
	}
}

func TestParseAnyFindsDimension(t *testing.T) {
	t.Parallel()
	for _, c := range conversions {
		want := c.dim
		if want == TemperatureDifference && strings.HasSuffix(c.in, " K") {
			want = Temperature // documented: ParseAny reads K as a temperature
			if c.want < 0 {
				continue // a negative temperature; TestErrors covers it
			}
		}
		q, err := ParseAny(c.in, Options{})
		if err != nil {
			t.Errorf("ParseAny(%q): %v", c.in, err)
			continue
		}
		if q.Dim != want || !closeTo(q.Value, c.want) {
			t.Errorf("ParseAny(%q) = %v %v, want %.17g %v (%s)", c.in, q.Value, q.Dim, c.want, want, c.src)
		}
	}
}

func TestQuantityUnitIsCanonical(t *testing.T) {
	t.Parallel()
	for _, c := range []struct{ in, unit string }{
		{"7 barg", "bar(g)"}, {"7 bar (g)", "bar(g)"}, {"170 C", "°C"}, {"1 kJ/(kg K)", "kJ/kgK"},
		{"0.5", ""}, {"5 %", "%"}, {"1 kgf/cm2g", "kg/cm2g"},
	} {
		q, err := ParseAny(c.in, Options{})
		if err != nil || q.Unit != c.unit {
			t.Errorf("ParseAny(%q).Unit = %q, %v; want %q", c.in, q.Unit, err, c.unit)
		}
	}
}

func TestGaugeWithCustomAmbient(t *testing.T) {
	t.Parallel()
	// 1 bar = 1e5 Pa exact (NIST SP 811 B.8); gauge + ambient by definition.
	opt := Options{AmbientPressure: 98000}
	cases := []struct {
		in   string
		want float64
	}{
		{"7 bar(g)", 798000},
		{"0 psig", 98000},
		{"7 bar(a)", 7e5}, // absolute: ambient plays no part
		{"0.7 MPa", 7e5},
	}
	for _, c := range cases {
		got, err := Parse(c.in, Pressure, opt)
		if err != nil || !closeTo(got, c.want) {
			t.Errorf("Parse(%q, ambient 98000 Pa) = %v, %v; want %v", c.in, got, err, c.want)
		}
	}
	g, err := opt.FromSI(798000, "bar(g)")
	if err != nil || !closeTo(g, 7) {
		t.Errorf("FromSI(798000, bar(g)) with ambient 98000 = %v, %v; want 7", g, err)
	}
	s, err := opt.Format(798000, "barg")
	if err != nil || s != "7 bar(g)" {
		t.Errorf("Format(798000, barg) with ambient 98000 = %q, %v; want \"7 bar(g)\"", s, err)
	}
}

func TestErrors(t *testing.T) {
	t.Parallel()
	cases := []struct {
		in   string
		dim  Dimension // zero: ParseAny
		opt  Options
		kind ErrorKind
		msg  string // the exact message, or a prefix when it ends in "..."
	}{
		{"7 bar", Pressure, Options{}, ErrAmbiguous,
			"pressure '7 bar' is ambiguous: write '7 bar(g)' for gauge or '7 bar(a)' for absolute"},
		{"7 bar", 0, Options{}, ErrAmbiguous,
			"pressure '7 bar' is ambiguous: write '7 bar(g)' for gauge or '7 bar(a)' for absolute"},
		{"100 psi", Pressure, Options{}, ErrAmbiguous,
			"pressure '100 psi' is ambiguous: write '100 psig' for gauge or '100 psia' for absolute"},
		{"7 kg/cm2", Pressure, Options{}, ErrAmbiguous,
			"pressure '7 kg/cm2' is ambiguous: write '7 kg/cm2g' for gauge or '7 kg/cm2a' for absolute"},
		{"1013 mbar", Pressure, Options{}, ErrAmbiguous,
			"pressure '1013 mbar' is ambiguous: write '1013 mbar(g)' for gauge or '1013 mbar(a)' for absolute"},
		{"7 kg/h", Pressure, Options{}, ErrWrongDimension,
			"pressure expected, such as '7 bar(g)'; got '7 kg/h' (a mass flow)"},
		{"12 m2", Temperature, Options{}, ErrWrongDimension,
			"temperature expected, such as '170 C'; got '12 m2' (an area)"},
		{"7 bar(g)", Fraction, Options{}, ErrWrongDimension,
			"fraction expected, such as '0.85' or '85 %'; got '7 bar(g)' (a pressure)"},
		{"7 bar", MassFlow, Options{}, ErrWrongDimension,
			"mass flow expected, such as '18 t/h'; got '7 bar' (a pressure)"},
		{"5 ΔC", Temperature, Options{}, ErrWrongDimension,
			"temperature expected, such as '170 C'; got '5 ΔC' (a temperature difference)"},
		{"7 bra(g)", Pressure, Options{}, ErrUnknownUnit,
			"unknown unit 'bra(g)' in '7 bra(g)'; pressure units are: Pa, kPa, MPa, bar(a), mbar(a), psia, kg/cm2a, atm, mmHg, bar(g), mbar(g), kPa(g), MPa(g), psig, kg/cm2g"},
		{"7 BAR(G)", Pressure, Options{}, ErrUnknownUnit,
			"unknown unit 'BAR(G)' in '7 BAR(G)'; did you mean 'bar(g)'?; pressure units are: ..."},
		{"1 mpa", 0, Options{}, ErrUnknownUnit, "unknown unit 'mpa' in '1 mpa'; did you mean 'MPa'?"},
		{"1 furlong", 0, Options{}, ErrUnknownUnit, "unknown unit 'furlong' in '1 furlong'"},
		{"1 bar)g(", Pressure, Options{}, ErrUnknownUnit, "unknown unit 'bar)g(' in '1 bar)g('..."},
		{"7", Pressure, Options{}, ErrMissingUnit, "pressure needs a unit, such as '7 bar(g)'; got '7'"},
		{" 18 ", MassFlow, Options{}, ErrMissingUnit, "mass flow needs a unit, such as '18 t/h'; got ' 18 '"},
		{"", Pressure, Options{}, ErrSyntax, "empty quantity: expected a number and a unit, such as '7 bar(g)'"},
		{"bar(g)", Pressure, Options{}, ErrSyntax,
			"no number in 'bar(g)': expected a number and a unit, such as '7 bar(g)'"},
		{"NaN bar(g)", Pressure, Options{}, ErrSyntax, "no number in 'NaN bar(g)'..."},
		{"Inf K", Temperature, Options{}, ErrSyntax, "no number in 'Inf K'..."},
		{"-", 0, Options{}, ErrSyntax, "no number in '-'..."},
		{"7,5 bar(g)", Pressure, Options{}, ErrSyntax, "bad number in '7,5 bar(g)': use '.' as the decimal point"},
		{"1e400 Pa", Pressure, Options{}, ErrRange, "number in '1e400 Pa' is out of range for a float64"},
		{"1e308 MPa", Pressure, Options{}, ErrRange, "'1e308 MPa' is out of range: its value in Pa is not finite"},
		{"-2 bar(g)", Pressure, Options{}, ErrPhysical,
			"pressure '-2 bar(g)' is at or below vacuum: it is -0.98675 bar(a) with an ambient of 1.01325 bar(a); an absolute pressure must be above zero"},
		{"0 Pa", Pressure, Options{}, ErrPhysical, "pressure '0 Pa' is at or below vacuum: it is 0 bar(a); an absolute pressure must be above zero"},
		{"-300 C", Temperature, Options{}, ErrPhysical, "temperature '-300 C' is below absolute zero (0 K, -273.15 °C)"},
		{"-1 K", Temperature, Options{}, ErrPhysical, "temperature '-1 K' is below absolute zero (0 K, -273.15 °C)"},
		{"5 C", TemperatureDifference, Options{}, ErrAmbiguous,
			"temperature difference '5 C' is ambiguous ('°C' names a temperature): write '5 ΔC' for a difference, or give it in K"},
		{"9 °F", TemperatureDifference, Options{}, ErrAmbiguous,
			"temperature difference '9 °F' is ambiguous ('°F' names a temperature): write '9 ΔF' for a difference, or give it in K"},
		{"7 bar(g)", Pressure, Options{AmbientPressure: 1.013}, ErrOptions,
			"ambient pressure 1.013 Pa is not plausible: give it in pascals, between 50000 and 150000 (zero means 101325)"},
		{"7 bar(g)", Pressure, Options{AmbientPressure: math.NaN()}, ErrOptions, "ambient pressure NaN Pa is not plausible..."},
	}
	for _, c := range cases {
		var err error
		if c.dim == 0 {
			_, err = ParseAny(c.in, c.opt)
		} else {
			_, err = Parse(c.in, c.dim, c.opt)
		}
		var e *Error
		if !errors.As(err, &e) {
			t.Errorf("%q as %v: error %v, want an *Error of kind %v", c.in, c.dim, err, c.kind)
			continue
		}
		if e.Kind != c.kind {
			t.Errorf("%q as %v: kind %v, want %v (%v)", c.in, c.dim, e.Kind, c.kind, err)
		}
		if p, ok := strings.CutSuffix(c.msg, "..."); ok {
			if !strings.HasPrefix(err.Error(), p) {
				t.Errorf("%q as %v:\n got %s\nwant %s", c.in, c.dim, err, c.msg)
			}
		} else if err.Error() != c.msg {
			t.Errorf("%q as %v:\n got %s\nwant %s", c.in, c.dim, err, c.msg)
		}
	}
}

func TestErrorFields(t *testing.T) {
	t.Parallel()
	_, err := Parse("7 kg/h", Pressure, Options{})
	var e *Error
	if !errors.As(err, &e) || e.Want != Pressure || e.Got != MassFlow || e.Unit != "kg/h" || e.Input != "7 kg/h" {
		t.Errorf("Error fields = %+v", e)
	}
}

// TestRoundTripEveryUnit converts values through every accepted unit:
// ToSI then FromSI, and Format then Parse, give the value back (exact
// definitions only; the tolerance covers float64 rounding).
func TestRoundTripEveryUnit(t *testing.T) {
	t.Parallel()
	values := []float64{1, 7, 0.013, 170.5, 2768.4, 12345.678}
	for _, d := range Dimensions() {
		for _, u := range Units(d) {
			for _, sp := range u.Spellings {
				for _, v := range values {
					si, err := ToSI(v, sp)
					if err != nil {
						t.Errorf("ToSI(%v, %q): %v", v, sp, err)
						continue
					}
					if want := v*u.Scale + u.Offset; !u.Gauge && !closeTo(si, want) {
						t.Errorf("ToSI(%v, %q) = %v, want %v", v, sp, si, want)
					}
					back, err := FromSI(si, sp)
					if err != nil || !closeTo(back, v) {
						t.Errorf("FromSI(ToSI(%v, %q)) = %v, %v", v, sp, back, err)
					}
					s, err := Format(si, sp)
					if err != nil {
						t.Errorf("Format(%v, %q): %v", si, sp, err)
						continue
					}
					again, err := Parse(s, d, Options{})
					if err != nil || !closeTo(again, si) {
						t.Errorf("Parse(Format(%v, %q) = %q) = %v, %v", si, sp, s, again, err)
					}
				}
			}
		}
	}
}

func TestFormat(t *testing.T) {
	t.Parallel()
	cases := []struct {
		v    float64
		unit string
		prec int // -1: Format, else FormatPrec
		want string
	}{
		{801325, "bar(g)", -1, "7 bar(g)"},      // [def][gauge]
		{801325, "bar(a)", 2, "8.01 bar(a)"},    // [def]
		{443.15, "C", 1, "170.0 °C"},            // [def]
		{5, "t/h", -1, "18 t/h"},                // [def]
		{2.768e6, "kJ/kg", 1, "2768.0 kJ/kg"},   // [def]
		{6600, "kJ/(kg K)", 3, "6.600 kJ/kgK"},  // [def]
		{0.85, "%", -1, "85 %"},                 // [def]
		{0.85, "", -1, "0.85"},                  // bare fraction
		{373.15, "°F", 2, "212.00 °F"},          // [def]
		{1e6, "Pa", -1, "1e+06 Pa"},             // strconv 'g' form
		{348900, "kcal/h", -1, "300000 kcal/h"}, // [def]
	}
	for _, c := range cases {
		var s string
		var err error
		if c.prec < 0 {
			s, err = Format(c.v, c.unit)
		} else {
			s, err = FormatPrec(c.v, c.unit, c.prec)
		}
		if err != nil || s != c.want {
			t.Errorf("format(%v, %q, %d) = %q, %v; want %q", c.v, c.unit, c.prec, s, err, c.want)
		}
	}
	for _, c := range []struct {
		v    float64
		unit string
		kind ErrorKind
	}{
		{1, "bar", ErrAmbiguous}, {1, "furlong", ErrUnknownUnit}, {math.NaN(), "Pa", ErrRange}, {math.Inf(1), "K", ErrRange},
	} {
		_, err := Format(c.v, c.unit)
		var e *Error
		if !errors.As(err, &e) || e.Kind != c.kind {
			t.Errorf("Format(%v, %q) error = %v, want kind %v", c.v, c.unit, err, c.kind)
		}
	}
	if _, err := ToSI(-2, "bar(g)"); err == nil {
		t.Error("ToSI(-2, bar(g)) gave no error; an absolute pressure below zero must be rejected")
	}
}

// TestTable checks the table's invariants: every dimension has a unit,
// canonical spellings are unique within a dimension, the positions fit the
// index's uint8, and the SI unit of each dimension has scale 1.
func TestTable(t *testing.T) {
	t.Parallel()
	if len(table) > 255 {
		t.Fatalf("table has %d units; the index stores positions as uint8", len(table))
	}
	for _, d := range Dimensions() {
		us := Units(d)
		if len(us) == 0 {
			t.Errorf("%v has no units", d)
		}
		if d == Fraction {
			continue
		}
		found := false
		for _, u := range us {
			var a, b [maxUnitLen]byte
			na, _ := compact(u.Name, &a)
			nb, _ := compact(d.SIUnit(), &b)
			if string(a[:na]) == string(b[:nb]) {
				found = true
				if u.Scale != 1 || u.Offset != 0 || u.Gauge {
					t.Errorf("%v: SI unit %q has scale %v offset %v", d, u.Name, u.Scale, u.Offset)
				}
			}
		}
		if !found {
			t.Errorf("%v: SI unit %q is not in the table", d, d.SIUnit())
		}
		if _, err := Parse(d.Example(), d, Options{}); err != nil {
			t.Errorf("%v: its own example %q does not parse: %v", d, d.Example(), err)
		}
	}
}

func TestParsePanicsOnInvalidDimension(t *testing.T) {
	defer func() {
		r := recover()
		if s, ok := r.(string); !ok || !strings.HasPrefix(s, "units:") {
			t.Errorf("recover() = %v, want a panic with prefix units:", r)
		}
	}()
	Parse("7 bar(g)", Dimension(200), Options{})
}

func TestParseAllocs(t *testing.T) {
	allocs := testing.AllocsPerRun(100, func() {
		if _, err := Parse("7 bar(g)", Pressure, Options{}); err != nil {
			t.Fatal(err)
		}
		if _, err := Parse(" 6.6 kJ/(kg K) ", SpecificHeat, Options{}); err != nil {
			t.Fatal(err)
		}
	})
	if allocs != 0 {
		t.Errorf("Parse allocates %v times per call pair; want 0", allocs)
	}
}

func BenchmarkParse(b *testing.B) {
	inputs := []struct {
		s string
		d Dimension
	}{
		{"7 bar(g)", Pressure}, {"170 C", Temperature}, {"18 t/h", MassFlow},
		{"6.6 kJ/(kg K)", SpecificHeat}, {"85 %", Fraction}, {"2.5e-4 m2K/W", FoulingResistance},
	}
	b.ReportAllocs()
	for b.Loop() {
		for _, in := range inputs {
			if _, err := Parse(in.s, in.d, Options{}); err != nil {
				b.Fatal(err)
			}
		}
	}
	b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N*len(inputs)), "ns/parse")
}

func BenchmarkFormat(b *testing.B) {
	b.ReportAllocs()
	for b.Loop() {
		if _, err := FormatPrec(801325, "bar(g)", 2); err != nil {
			b.Fatal(err)
		}
	}
}

func TestLookupAndValidate(t *testing.T) {
	t.Parallel()
	u, err := Lookup("kg/cm2(g)")
	if err != nil || u.Name != "kg/cm2g" || !u.Gauge || u.Dim != Pressure || u.Scale != kgfcm2 {
		t.Errorf("Lookup(kg/cm2(g)) = %+v, %v", u, err)
	}
	if u, err := Lookup("K"); err != nil || u.Dim != Temperature {
		t.Errorf("Lookup(K) = %+v, %v; want a temperature", u, err)
	}
	if _, err := Lookup("bar"); err == nil {
		t.Error("Lookup(bar) gave no error; it is ambiguous")
	}
	if err := (Options{}).Validate(); err != nil {
		t.Errorf("zero Options: %v", err)
	}
	if err := (Options{AmbientPressure: 1.013e5}).Validate(); err != nil {
		t.Errorf("ambient 101300 Pa: %v", err)
	}
	if err := (Options{AmbientPressure: 1.013}).Validate(); err == nil {
		t.Error("ambient 1.013 Pa accepted; it is a unit mistake")
	}
}
