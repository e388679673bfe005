package water_test

import (
	"fmt"

	"steamcase/plant/water"
)

// Saturated steam at 8.013 bar(a), about 7 bar(g): its temperature and
// enthalpy, the figures a steam-heating balance starts from.
func ExamplePX() {
	st, err := water.PX(8.013e5, 1)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("T = %.2f °C, h'' = %.1f kJ/kg\n", st.T-273.15, st.H/1e3)
	// Output: T = 170.48 °C, h'' = 2768.4 kJ/kg
}

// A wet state from pressure and enthalpy: the vapour fraction follows from
// h between the saturated liquid and vapour.
func ExamplePH() {
	st, err := water.PH(1e6, 2000e3)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%v, T = %.2f K, x = %.4f\n", st.Phase, st.T, st.X)
	// Output: two-phase, T = 453.04 K, x = 0.6142
}

// Out of range: the error names the bound crossed.
func ExamplePT_outOfRange() {
	_, err := water.PT(120e6, 500)
	fmt.Println(err)
	// Output: water.PT: pressure 120 MPa above the IF97 limit of 100 MPa
}
