package units_test

import (
	"fmt"

	"steamcase/plant/units"
)

func ExampleParse() {
	p, err := units.Parse("7 bar(g)", units.Pressure, units.Options{})
	fmt.Println(p, err)
	m, _ := units.Parse("18 t/h", units.MassFlow, units.Options{})
	fmt.Println(m)
	t, _ := units.Parse("170 C", units.Temperature, units.Options{})
	fmt.Printf("%.2f\n", t)
	// Output:
	// 801325 <nil>
	// 5
	// 443.15
}

func ExampleParse_errors() {
	for _, s := range []string{"7 bar", "7 kg/h", "7", "-2 bar(g)"} {
		_, err := units.Parse(s, units.Pressure, units.Options{})
		fmt.Println(err)
	}
	// Output:
	// pressure '7 bar' is ambiguous: write '7 bar(g)' for gauge or '7 bar(a)' for absolute
	// pressure expected, such as '7 bar(g)'; got '7 kg/h' (a mass flow)
	// pressure needs a unit, such as '7 bar(g)'; got '7'
	// pressure '-2 bar(g)' is at or below vacuum: it is -0.98675 bar(a) with an ambient of 1.01325 bar(a); an absolute pressure must be above zero
}

func ExampleParse_ambient() {
	// A gauge reading on a plant whose ambient is 1000 mbar(a).
	opt := units.Options{AmbientPressure: 100000}
	p, _ := units.Parse("7 bar(g)", units.Pressure, opt)
	fmt.Println(p)
	// Output:
	// 800000
}

func ExampleParseAny() {
	q, err := units.ParseAny("300000 kcal/h", units.Options{})
	fmt.Println(q.Value, q.Dim, q.Unit, err)
	// Output:
	// 348900 power kcal/h <nil>
}

func ExampleFormatPrec() {
	for _, unit := range []string{"bar(g)", "bar(a)", "MPa"} {
		s, _ := units.FormatPrec(801325, unit, 3)
		fmt.Println(s)
	}
	t, _ := units.FormatPrec(443.6, "C", 2)
	fmt.Println(t)
	// Output:
	// 7.000 bar(g)
	// 8.013 bar(a)
	// 0.801 MPa
	// 170.45 °C
}
