package report_test

import (
	"fmt"
	"os"

	"steamcase/cmd/sim/internal/report"
)

// The file name of a chart sets its format.
func ExampleFormatOf() {
	for _, name := range []string{"demand.svg", "demand.PNG", "demand.pdf"} {
		format, err := report.FormatOf(name)
		fmt.Println(format, err)
	}
	// Output:
	// svg <nil>
	// png <nil>
	//  plot file "demand.pdf": the name must end in .svg or .png, which sets the format
}

// A run that solved nothing still says so, and still carries the caution.
func ExampleTable() {
	if err := report.Table(os.Stdout, report.Run{}); err != nil {
		fmt.Println(err)
	}
	// Output:
	// Nothing was solved: the scripts ran no load case, voyage, study, audit or heating plan.
	//
	// Caution: planning and audit estimate only; the makers' manuals, class and flag rules and licensed practice govern, and local codes come first.
}

// A run that solved nothing still writes the header of the cases table:
// the first field of every table's header is "table".
func ExampleCSV() {
	if err := report.CSV(os.Stdout, report.Run{}); err != nil {
		fmt.Println(err)
	}
	// Output:
	// table,case,plant,sea_T_C,air_T_C,engine_load_pct,boilers_firing,can_carry,shortfall_kg_h,steam_demand_kg_h,steam_production_kg_h,fuel_kg_h,fuel_t_per_day,co2_t_per_day,makeup_kg_h,electric_kW,margin_kg_h,warnings
}
