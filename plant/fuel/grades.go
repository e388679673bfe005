package fuel

import (
	"errors"
	"fmt"
	"strings"
)

// The IMO fuel types the built-in grades report under: IMO resolution
// MEPC.364(79), 2022 EEDI calculation guidelines, para 2.1 table, as listed
// in docs/reference/plant-checks.md §1.3 [S] (values from memory of the table; only HFO
// 3.114 was seen in a secondary page). The rows for LPG, methanol and
// ethanol are not carried: no built-in grade reports under them. The array
// is never written.
var imoTypes = [...]IMOFuelType{
	{Name: "Diesel/Gas oil (DMX-DMB)", LCV: 42.7e6, CF: 3.206, Carbon: 0.8744,
		Source: "IMO MEPC.364(79) para 2.1, Diesel/Gas oil (ISO 8217 DMX-DMB)"},
	{Name: "LFO (RMA-RMD)", LCV: 41.2e6, CF: 3.151, Carbon: 0.8594,
		Source: "IMO MEPC.364(79) para 2.1, LFO (ISO 8217 RMA-RMD)"},
	{Name: "HFO (RME-RMK)", LCV: 40.2e6, CF: 3.114, Carbon: 0.8493,
		Source: "IMO MEPC.364(79) para 2.1, HFO (ISO 8217 RME-RMK)"},
	{Name: "LNG", LCV: 48.0e6, CF: 2.750, Carbon: 0.7500,
		Source: "IMO MEPC.364(79) para 2.1, LNG"},
}

const (
	imoDiesel = iota
	imoLFO
	imoHFO
	imoLNG
)

// IMOFuelTypes returns the rows of the IMO table this package carries
// (Diesel/Gas oil, LFO, HFO, LNG), a copy.
func IMOFuelTypes() []IMOFuelType {
	out := make([]IMOFuelType, len(imoTypes))
	copy(out, imoTypes[:])
	return out
}

// gradeDef is a built-in grade: the fuel without its analysis for a liquid
// grade, and the nitrogen and oxygen that the ISO 8217 properties do not
// give. Grade derives the rest of the analysis (AnalysisFromISO).
type gradeDef struct {
	fuel Fuel
	n, o float64
}

// Built-in grades. Sources, figure by figure:
//
//   - Net and gross specific energy of the liquid grades: from their ISO
//     8217 properties by the standard's annex formulae (Fuel.Energy); the
//     grades carry no set LHV.
//   - Ultimate analysis of the liquid grades: derived from the ISO 8217
//     properties (AnalysisFromISO), with nitrogen and oxygen the typical
//     values of docs/reference/plant-checks.md §2.1 [M].
//   - IMO fuel type (LCV, C_F, carbon): docs/reference/plant-checks.md §1.3 [S], kept for
//     regulatory CO2 reporting only.
//   - Densities, viscosities, water and ash: typical values [M]; HSFO's ρ
//     985 kg/m³ with 2.5 % S is docs/reference/plant-checks.md §1.1 row 3, VLSFO's ρ 950
//     with water 0.10, ash 0.03 and sulfur 0.5 % is docs/reference/plant-checks.md §1.1 row 4, and HSFO's
//     380 cSt at 50 °C / 35 cSt at 100 °C is the assumption of docs/reference/plant-checks.md §5.1 check
//     B [C].
//
// The array is never mutated; Grade returns copies.
var grades = [...]gradeDef{
	{
		fuel: Fuel{
			Name:  "MGO",
			Class: Distillate,
			ISO: ISO8217{
				Density15:  860,    // typical DMA [M]
				Viscosity:  3.0e-6, // 3.0 cSt at 40 °C, typical DMA (ISO 8217 DMA 2.0–6.0, from memory) [M]
				ViscosityT: 313.15,
				Sulfur:     0.001, // ≤ 0.1 % m/m [M] (docs/reference/plant-checks.md §1.2)
			},
			Viscosity2: ViscosityPoint{T: 373.15, Nu: 1.2e-6}, // 1.2 cSt at 100 °C, typical [M]
			IMO:        imoTypes[imoDiesel],
		},
		n: 0, o: 0.001, // docs/reference/plant-checks.md §2.1 MGO: no N, O 0.1 % [M]
	},
	{
		fuel: Fuel{
			Name:  "VLSFO",
			Class: Residual,
			ISO: ISO8217{
				Density15:  950,    // docs/reference/plant-checks.md §1.1 row 4; typical [M]
				Viscosity:  150e-6, // 150 cSt at 50 °C, typical RMG-grade VLSFO [M]
				ViscosityT: 323.15, //
				Sulfur:     0.005,  // ≤ 0.50 % m/m (the grade's definition)
				Water:      0.001,  // 0.10 % m/m, docs/reference/plant-checks.md §1.1 row 4 [M]
				Ash:        0.0003, // 0.03 % m/m, docs/reference/plant-checks.md §1.1 row 4 [M]
			},
			Viscosity2: ViscosityPoint{T: 373.15, Nu: 20e-6}, // 20 cSt at 100 °C, typical [M]
			// A VLSFO of an RME–RMK grade reports as HFO in the IMO table;
			// one of grade RMA–RMD would report as LFO (see FromBDN).
			IMO: imoTypes[imoHFO],
		},
		n: 0.003, o: 0.004, // docs/reference/plant-checks.md §2.1 VLSFO: N 0.3, O 0.4 % [M]
	},
	{
		fuel: Fuel{
			Name:  "HSFO",
			Class: Residual,
			ISO: ISO8217{
				Density15:  985,    // docs/reference/plant-checks.md §1.1 row 3 and §3.3 [C]
				Viscosity:  380e-6, // 380 cSt at 50 °C: RMG 380, docs/reference/plant-checks.md §5.1 check B
				ViscosityT: 323.15, //
				Sulfur:     0.025,  // 2.5 % m/m, docs/reference/plant-checks.md §1.2 test fuel [M]
			},
			Viscosity2: ViscosityPoint{T: 373.15, Nu: 35e-6}, // 35 cSt at 100 °C, docs/reference/plant-checks.md §5.1 check B assumption
			IMO:        imoTypes[imoHFO],
		},
		n: 0.003, o: 0.002, // docs/reference/plant-checks.md §1.2 test fuel: N 0.3, O 0.2 % [M]
	},
	{
		fuel: Fuel{
			Name:  "LNG",
			Class: Gas,
			// Taken as pure methane: C = 12.0107/16.04246, H =
			// 4·1.00794/16.04246, exact from molar masses [C]
			// (docs/reference/plant-checks.md §1.2). Liquid LNG is about 430–470 kg/m³
			// near −162 °C [M]; no liquid property is modelled.
			Analysis: Analysis{C: AtomicC / (AtomicC + 4*AtomicH), H: 4 * AtomicH / (AtomicC + 4*AtomicH)},
			// Methane's own net specific energy, 50.01 MJ/kg, from the
			// standard enthalpies of formation at 25 °C (docs/reference/plant-checks.md
			// §1.3 [C]): ISO 8217 does not apply to a gas, and the IMO LCV
			// of 48 000 kJ/kg is a reporting default, not the energy of the
			// methane the combustion model burns.
			SetLHV:       50.01e6,
			SetLHVSource: "methane, from the standard enthalpies of formation at 25 °C",
			IMO:          imoTypes[imoLNG],
		},
	},
}

// ErrUnknownGrade is wrapped by Grade when the name is not known.
var ErrUnknownGrade = errors.New("fuel: unknown grade")

// Grade returns a built-in grade by trade name, case-insensitive: "MGO",
// "VLSFO", "HSFO" or "LNG". A liquid grade's analysis is derived from its
// ISO 8217 properties (AnalysisFromISO). The returned Fuel is a copy;
// change it freely (but a changed ISO property does not change the
// analysis: build the fuel with FromBDN, or derive it with AnalysisFromISO).
func Grade(name string) (Fuel, error) {
	for i := range grades {
		if !strings.EqualFold(grades[i].fuel.Name, name) {
			continue
		}
		g := grades[i]
		f := g.fuel
		if f.Class != Gas {
			a, err := AnalysisFromISO(f.Class, f.ISO, g.n, g.o)
			if err != nil {
				return Fuel{}, fmt.Errorf("fuel: built-in grade %s: %w", f.Name, err)
			}
			f.Analysis = a
		}
		return f, nil
	}
	return Fuel{}, fmt.Errorf("%w %q: known grades are %s", ErrUnknownGrade, name, strings.Join(GradeNames(), ", "))
}

// GradeNames returns the names of the built-in grades.
func GradeNames() []string {
	names := make([]string, len(grades))
	for i := range grades {
		names[i] = grades[i].fuel.Name
	}
	return names
}
