package fuel

import (
	"errors"
	"fmt"
	"math"
)

// Class says what kind of fuel a Fuel is. It chooses the ISO 8217 reference
// temperature of the kinematic viscosity and which property models apply.
type Class int

const (
	// Residual is a residual marine fuel (ISO 8217 RM grades: HSFO, VLSFO).
	// Its ISO 8217 viscosity is given at 50 °C.
	Residual Class = iota
	// Distillate is a distillate marine fuel (ISO 8217 DM grades: MGO, MDO).
	// Its ISO 8217 viscosity is given at 40 °C.
	Distillate
	// Gas is a gaseous fuel burnt as gas (LNG boil-off or vaporised LNG).
	// Liquid-fuel models (ISO 8217 energy, ASTM D341, Cragoe, volume
	// correction, CCAI) do not apply and return an error.
	Gas
)

// String returns the class name.
func (c Class) String() string {
	switch c {
	case Residual:
		return "residual"
	case Distillate:
		return "distillate"
	case Gas:
		return "gas"
	}
	return fmt.Sprintf("Class(%d)", int(c))
}

// Standard atomic weights (kg/mol) used throughout the package and by
// package combustion, so that mass balances close exactly. They are the
// weights behind the molar masses of NASA/TP-2002-211556 (CO2 44.0095,
// H2O 18.01528, N2 28.0134, O2 31.9988, SO2 64.0638 g/mol).
const (
	AtomicC = 12.0107e-3
	AtomicH = 1.00794e-3
	AtomicO = 15.9994e-3
	AtomicN = 14.0067e-3
	AtomicS = 32.065e-3

	// MolarCO2 and MolarH2O are the molar masses of CO2 and H2O (kg/mol).
	MolarCO2 = AtomicC + 2*AtomicO
	MolarH2O = 2*AtomicH + AtomicO
	// WaterPerHydrogen is the kg of water formed per kg of hydrogen burnt,
	// M(H2O)/M(H2) = 8.937 (docs/reference/plant-checks.md §2 writes 8.936).
	WaterPerHydrogen = MolarH2O / (2 * AtomicH)
	// CO2PerCarbon is the kg of CO2 formed per kg of carbon, M(CO2)/M(C).
	CO2PerCarbon = MolarCO2 / AtomicC
)

// LatentHeat25 is the enthalpy of vaporisation of water at 25 °C (J/kg),
// 2441.7 kJ/kg: IAPWS-IF97 value as listed in docs/reference/plant-checks.md §0 [C]. It is
// the figure used to convert between gross and net specific energy.
const LatentHeat25 = 2441.7e3

// SumTolerance is the largest accepted deviation of the sum of an ultimate
// analysis (C+H+S+N+O+water+ash) from 1 kg/kg: 0.005 kg/kg (0.5 % m/m), a
// round figure for laboratory rounding (common practice, no source). The
// analysis is used as given, not normalised; the remainder is neither gas
// nor ash in the combustion balance.
const SumTolerance = 0.005

// Density limits (kg/m³ at 15 °C) accepted for a liquid fuel: 700–1100.
// ISO 8217 residual grades reach 1010 kg/m³ (RMK, from memory) and marine
// distillates start near 800; the limits leave margin on both sides
// (common practice, no source).
const (
	MinDensity15 = 700.0
	MaxDensity15 = 1100.0
)

// Analysis is an ultimate analysis, as fired, in mass fractions (kg/kg).
// Water is free water and ash the non-combustible residue; H is hydrogen
// other than that in the free water. The zero value means "not given".
type Analysis struct {
	C, H, S, N, O, Water, Ash float64
}

// Sum returns C+H+S+N+O+Water+Ash.
func (a Analysis) Sum() float64 { return a.C + a.H + a.S + a.N + a.O + a.Water + a.Ash }

// Given reports whether any fraction is non-zero.
func (a Analysis) Given() bool { return a != Analysis{} }

// ISO8217 holds the properties a bunker delivery note or an ISO 8217 test
// report gives. The zero value means "not given". Fractions are kg/kg.
type ISO8217 struct {
	// Density15 is the density at 15 °C (kg/m³).
	Density15 float64
	// Viscosity is the kinematic viscosity (m²/s) at ViscosityT.
	Viscosity float64
	// ViscosityT is the temperature (K) of Viscosity. Zero means the ISO 8217
	// reference: 323.15 K (50 °C) for Residual, 313.15 K (40 °C) for
	// Distillate.
	ViscosityT float64
	// Sulfur, Water and Ash are mass fractions (kg/kg).
	Sulfur, Water, Ash float64
}

// Given reports whether any ISO 8217 property is set.
func (p ISO8217) Given() bool { return p != ISO8217{} }

// Fuel is one fuel: a built-in grade (see Grade) or the user's own, given by
// its ISO 8217 properties, its ultimate analysis, or both. The zero value is
// not a valid fuel; Validate says what is missing.
type Fuel struct {
	// Name identifies the fuel in messages.
	Name string
	// Class chooses the viscosity reference temperature and the models.
	Class Class
	// ISO holds the ISO 8217 properties (optional).
	ISO ISO8217
	// Viscosity2 is an optional second viscosity point (T in K, ν in m²/s)
	// which, with the ISO 8217 viscosity, fixes the ASTM D341 line.
	Viscosity2 ViscosityPoint
	// Analysis is the ultimate analysis (optional for energy, required for
	// combustion).
	Analysis Analysis

	// SetLHV is a stated net specific energy (J/kg): a laboratory's figure,
	// one stated with a bunker delivery note, or one a script gives. When
	// non-zero it takes precedence over the ISO 8217 and analysis routes.
	// The built-in liquid grades leave it zero: their net specific energy
	// comes from their ISO 8217 properties.
	SetLHV float64
	// SetLHVSource names where SetLHV comes from.
	SetLHVSource string
	// IMO is the fuel type of the IMO table of lower calorific values and
	// CO2 conversion factors under which the fuel's CO2 is reported
	// (optional). Its figures are regulatory defaults for CO2 reporting; the
	// energy balance and the combustion models never use them.
	IMO IMOFuelType
}

// IMOFuelType is one row of the IMO table of lower calorific values and CO2
// conversion factors (MEPC.364(79), 2022 EEDI calculation guidelines, para
// 2.1; the same C_F serve the data collection system and the CII). The
// figures are defaults for regulatory reporting, one per fuel type, not the
// properties of a particular fuel: a 0.5 % sulfur residual fuel reports
// under HFO with the carbon fraction of a high-sulfur one. The zero value
// means "no IMO fuel type".
type IMOFuelType struct {
	// Name is the fuel type as the table names it, e.g. "HFO (RME-RMK)".
	Name string
	// LCV is the lower calorific value the table lists (J/kg).
	LCV float64
	// CF is the CO2 conversion factor C_F (kg CO2 per kg fuel).
	CF float64
	// Carbon is the carbon mass fraction the table lists with C_F
	// (kg/kg); C_F = Carbon·44/12 in the table's own rounding.
	Carbon float64
	// Source names the table and the row, for reports.
	Source string
}

// Given reports whether the fuel has an IMO fuel type.
func (t IMOFuelType) Given() bool { return t != IMOFuelType{} }

func (f Fuel) label() string {
	if f.Name == "" {
		return "(unnamed)"
	}
	return f.Name
}

// FieldError is a validation or input error naming the fuel, the field, the
// value given and what was expected.
type FieldError struct {
	Fuel  string
	Field string
	Value float64
	Want  string
	// Text, if not empty, is the whole message, the figure said in the
	// units its source writes it in (a delivery note's % m/m).
	Text string
}

func (e *FieldError) Error() string {
	if e.Text != "" {
		return e.Text
	}
	return fmt.Sprintf("fuel %q: %s = %g: %s", e.Fuel, e.Field, e.Value, e.Want)
}

func (f Fuel) fieldErr(field string, v float64, want string) error {
	return &FieldError{Fuel: f.label(), Field: field, Value: v, Want: want}
}

// inRange reports whether lo <= v <= hi (false for NaN).
func inRange(v, lo, hi float64) bool { return v >= lo && v <= hi }

// Validate checks the fuel and returns every problem found, joined; nil if
// the fuel is usable. It does not allocate when the fuel is valid.
func (f Fuel) Validate() error {
	var errs []error
	add := func(e error) { errs = append(errs, e) }
	if f.Class != Residual && f.Class != Distillate && f.Class != Gas {
		add(f.fieldErr("Class", float64(f.Class), "want Residual, Distillate or Gas"))
	}
	if !f.ISO.Given() && !f.Analysis.Given() && f.SetLHV == 0 {
		add(&FieldError{Fuel: f.label(), Field: "ISO, Analysis, SetLHV", Value: 0,
			Want: "give ISO 8217 properties, an ultimate analysis or a set LHV"})
	}
	if f.ISO.Given() {
		if f.Class == Gas {
			add(f.fieldErr("ISO.Density15", f.ISO.Density15, "ISO 8217 properties apply to liquid fuels, not to Class Gas"))
		}
		p := f.ISO
		if !inRange(p.Density15, MinDensity15, MaxDensity15) {
			add(f.fieldErr("ISO.Density15", p.Density15,
				fmt.Sprintf("want a density at 15 °C in %g…%g kg/m³", MinDensity15, MaxDensity15)))
		}
		checkFrac := func(name string, v, max float64) {
			if !inRange(v, 0, max) {
				add(f.fieldErr(name, v, fmt.Sprintf("want a mass fraction in 0…%g kg/kg", max)))
			}
		}
		// Plausible upper limits: ISO 8217 residual limits are S 3.5 %,
		// water 0.5 %, ash 0.15 % (from memory); doubled for margin.
		checkFrac("ISO.Sulfur", p.Sulfur, 0.07)
		checkFrac("ISO.Water", p.Water, 0.05)
		checkFrac("ISO.Ash", p.Ash, 0.02)
		if p.Viscosity != 0 || p.ViscosityT != 0 {
			if !inRange(p.Viscosity, minNu, maxNu) {
				add(f.fieldErr("ISO.Viscosity", p.Viscosity,
					fmt.Sprintf("want a kinematic viscosity in %g…%g m²/s", minNu, maxNu)))
			}
			if p.ViscosityT != 0 && !inRange(p.ViscosityT, MinWaltherT, MaxWaltherT) {
				add(f.fieldErr("ISO.ViscosityT", p.ViscosityT,
					fmt.Sprintf("want a temperature in %g…%g K", MinWaltherT, MaxWaltherT)))
			}
		}
	}
	if f.Viscosity2 != (ViscosityPoint{}) {
		if !inRange(f.Viscosity2.Nu, minNu, maxNu) {
			add(f.fieldErr("Viscosity2.Nu", f.Viscosity2.Nu,
				fmt.Sprintf("want a kinematic viscosity in %g…%g m²/s", minNu, maxNu)))
		}
		if !inRange(f.Viscosity2.T, MinWaltherT, MaxWaltherT) {
			add(f.fieldErr("Viscosity2.T", f.Viscosity2.T,
				fmt.Sprintf("want a temperature in %g…%g K", MinWaltherT, MaxWaltherT)))
		}
		if f.ISO.Viscosity == 0 {
			add(f.fieldErr("ISO.Viscosity", 0, "a second viscosity point needs the ISO 8217 viscosity as the first"))
		}
	}
	if f.Analysis.Given() {
		a := f.Analysis
		for _, c := range [...]struct {
			name string
			v    float64
		}{{"C", a.C}, {"H", a.H}, {"S", a.S}, {"N", a.N}, {"O", a.O}, {"Water", a.Water}, {"Ash", a.Ash}} {
			if !inRange(c.v, 0, 1) {
				add(f.fieldErr("Analysis."+c.name, c.v, "want a mass fraction in 0…1 kg/kg"))
			}
		}
		if s := a.Sum(); !(math.Abs(s-1) <= SumTolerance) {
			add(f.fieldErr("Analysis sum", s,
				fmt.Sprintf("want C+H+S+N+O+Water+Ash = 1 ± %g kg/kg", SumTolerance)))
		}
		if !(a.C+a.H+a.S > 0.5) {
			add(f.fieldErr("Analysis C+H+S", a.C+a.H+a.S, "want more than 0.5 kg/kg combustible matter for a fuel"))
		}
		if f.ISO.Given() {
			// Both given: they describe one fuel and must agree.
			const tol = 0.001 // 0.1 % m/m, common practice, no source
			for _, c := range [...]struct {
				name   string
				iso, a float64
			}{{"Sulfur", f.ISO.Sulfur, a.S}, {"Water", f.ISO.Water, a.Water}, {"Ash", f.ISO.Ash, a.Ash}} {
				if !(math.Abs(c.iso-c.a) <= tol) {
					add(f.fieldErr("Analysis vs ISO "+c.name, c.a-c.iso,
						fmt.Sprintf("ISO %g and analysis %g kg/kg differ; want agreement within %g kg/kg", c.iso, c.a, tol)))
				}
			}
		}
	}
	if f.SetLHV != 0 && !inRange(f.SetLHV, 5e6, 130e6) {
		add(f.fieldErr("SetLHV", f.SetLHV, "want a net specific energy in 5e6…130e6 J/kg"))
	}
	if f.IMO.Given() {
		if !inRange(f.IMO.LCV, 5e6, 130e6) {
			add(f.fieldErr("IMO.LCV", f.IMO.LCV, "want a lower calorific value in 5e6…130e6 J/kg"))
		}
		if !inRange(f.IMO.CF, 0.5, 4) {
			add(f.fieldErr("IMO.CF", f.IMO.CF, "want a CO2 factor in 0.5…4 kg CO2/kg fuel"))
		}
		if !inRange(f.IMO.Carbon, 0, 1) {
			add(f.fieldErr("IMO.Carbon", f.IMO.Carbon, "want a carbon fraction in 0…1 kg/kg"))
		}
	}
	if len(errs) == 0 {
		return nil
	}
	return errors.Join(errs...)
}
