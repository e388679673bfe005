package fuel

import (
	"errors"
	"fmt"
	"math"
)

// Basis says whether a specific energy is net (lower, product water as
// vapour) or gross (higher, product water condensed), both at 25 °C.
type Basis int

const (
	// Net is the net (lower) specific energy, LHV/LCV.
	Net Basis = iota
	// Gross is the gross (higher) specific energy, HHV/GCV.
	Gross
)

// String returns "net (LHV)" or "gross (HHV)".
func (b Basis) String() string {
	switch b {
	case Net:
		return "net (LHV)"
	case Gross:
		return "gross (HHV)"
	}
	return fmt.Sprintf("Basis(%d)", int(b))
}

// Route says how a specific energy was obtained.
type Route int

const (
	// RouteSet: the fuel's stated SetLHV (a laboratory's figure, one on a
	// bunker delivery note, a script's).
	RouteSet Route = iota + 1
	// RouteISO8217: the ISO 8217 annex formula from density, water, ash and
	// sulfur: the residual-fuel formula (docs/reference/plant-checks.md §1.1 [S✓]) for
	// Class Residual, the distillate formula (from memory) for Class
	// Distillate.
	RouteISO8217
	// RouteAnalysis: the Channiwala-Parikh correlation for the gross value
	// from the ultimate analysis, net = gross − h_fg(25 °C)·(8.937·H + w).
	RouteAnalysis
	// RouteSetPlusLatent: a gross value made from the set LHV plus the
	// latent heat of the product water (analysis H and water).
	RouteSetPlusLatent
	// RouteSetPlusISODifference: a gross value made from the set LHV plus
	// the gross−net difference of the ISO 8217 formula (no analysis given).
	RouteSetPlusISODifference
	// RouteISO8217Distillate: the ISO 8217 annex formula for distillate
	// fuels (ISO8217DistillateEnergy), for Class Distillate.
	RouteISO8217Distillate
)

// String describes the route and its source.
func (r Route) String() string {
	switch r {
	case RouteSet:
		return "set value"
	case RouteISO8217:
		return "ISO 8217 annex formula (density, water, ash, sulfur)"
	case RouteISO8217Distillate:
		return "ISO 8217 annex formula for distillates (density, water, ash, sulfur)"
	case RouteAnalysis:
		return "ultimate analysis, Channiwala-Parikh (2002) HHV correlation, LHV by latent heat of product water"
	case RouteSetPlusLatent:
		return "set LHV plus latent heat of product water from the analysis"
	case RouteSetPlusISODifference:
		return "set LHV plus the ISO 8217 gross-net difference"
	}
	return fmt.Sprintf("Route(%d)", int(r))
}

// Source tells where one figure came from: the route, and for a set value
// the note the fuel carries (e.g. "IMO MEPC.364(79)").
type Source struct {
	Route Route
	Note  string
}

// String returns the route, with the note in parentheses when there is one.
func (s Source) String() string {
	if s.Note != "" {
		return s.Route.String() + " (" + s.Note + ")"
	}
	return s.Route.String()
}

// Energy holds the specific energies of a fuel at 25 °C (J/kg), each with
// where it came from. Net is the figure for the energy balance; IMOLCV is a
// regulatory default that only CO2 reports use.
type Energy struct {
	// Net is the net specific energy (LHV) the energy balance uses: the
	// fuel's stated value (SetLHV) when it has one, otherwise the ISO 8217
	// annex formula from its density, water, ash and sulfur, otherwise the
	// Channiwala-Parikh correlation on its analysis. NetSource says which.
	Net float64
	// Gross is the gross specific energy (HHV). From the ISO 8217 route it
	// is the standard's gross value, which is at constant volume (bomb
	// calorimeter), while Net is at constant pressure: Gross − Net is then
	// HydrogenGrossNet·H plus the water term, 0.6 MJ/kg per kg of hydrogen
	// less than the latent heat of the product water. GrossSource says
	// which route gave it.
	Gross                  float64
	NetSource, GrossSource Source
	// IMOLCV is the lower calorific value of the fuel's IMO fuel type (J/kg),
	// MEPC.364(79), kept for regulatory reporting beside the CO2 of the IMO
	// factor; the energy balance never uses it. Zero when the fuel has no
	// IMO fuel type.
	IMOLCV float64
	// IMOSource names the IMO table and fuel type of IMOLCV.
	IMOSource string
}

// ISO8217Energy returns the net and gross specific energy (J/kg) of a
// residual marine fuel by the ISO 8217 informative annex "Calculation of
// specific energy" (docs/reference/plant-checks.md §1.1 [S✓]), from the density at 15 °C
// (kg/m³) and the water, ash and sulfur mass fractions (kg/kg):
//
//	Q_gross = (52.190 − 8.802e-6·ρ²)·[1 − 0.01(w+a+s)] + 0.0942·s                      MJ/kg
//	Q_net   = (46.704 − 8.802e-6·ρ² + 3.167e-3·ρ)·[1 − 0.01(w+a+s)] + 0.0942·s − 0.02449·w
//
// with w, a, s in % m/m. The gross value is at constant volume (bomb
// calorimeter), the net value at constant pressure. The annex gives this
// pair for residual fuels (as remembered; the sheet does not say) and a
// second pair for distillates (ISO8217DistillateEnergy).
func ISO8217Energy(rho15, water, ash, sulfur float64) (net, gross float64, err error) {
	return isoFormula(Residual, rho15, water, ash, sulfur)
}

// ISO8217DistillateEnergy returns the net and gross specific energy (J/kg)
// of a distillate marine fuel by the distillate equations of the same ISO
// 8217 annex, FROM MEMORY (not on the project's reference sheet and not
// confirmed against the printed standard):
//
//	Q_gross = (51.916 − 8.792e-6·ρ²)·[1 − 0.01(w+a+s)] + 0.0942·s                      MJ/kg
//	Q_net   = (46.423 − 8.792e-6·ρ² + 3.170e-3·ρ)·[1 − 0.01(w+a+s)] + 0.0942·s − 0.02449·w
//
// Corroboration: the gross pair is Cragoe's (US Bureau of Standards Misc.
// Publ. 97, 1929) Q = 12 400 − 2 100·d² cal/g in MJ/kg (× 4.1868 J/cal:
// 51.916 and 8.792), the relation behind ASTM D4868 (both from memory); and
// the hydrogen its gross − net implies agrees with Cragoe's H = 26 − 15·d %
// within 0.1 % m/m (see AnalysisFromISO). At 860 kg/m³ with 0.1 % S it gives
// 42.61 MJ/kg net, 0.27 MJ/kg (0.6 %) below the residual formula.
func ISO8217DistillateEnergy(rho15, water, ash, sulfur float64) (net, gross float64, err error) {
	return isoFormula(Distillate, rho15, water, ash, sulfur)
}

// isoWaterTerm is the water term of the ISO 8217 net formulae, 0.02449
// MJ/kg per % m/m of water: 2.449 MJ per kg of free water (J/kg).
const isoWaterTerm = 2.449e6

// isoFormula evaluates the residual or distillate annex formula.
func isoFormula(c Class, rho15, water, ash, sulfur float64) (net, gross float64, err error) {
	if !inRange(rho15, MinDensity15, MaxDensity15) {
		return 0, 0, fmt.Errorf("fuel: ISO 8217 specific energy: density at 15 °C %g kg/m³ outside %g…%g", rho15, MinDensity15, MaxDensity15)
	}
	if !inRange(water, 0, 0.05) || !inRange(ash, 0, 0.02) || !inRange(sulfur, 0, 0.07) {
		return 0, 0, fmt.Errorf("fuel: ISO 8217 specific energy: water %g, ash %g, sulfur %g kg/kg: want 0…0.05, 0…0.02, 0…0.07", water, ash, sulfur)
	}
	g0, g2, n0, n1 := 52.190, 8.802e-6, 46.704, 3.167e-3
	switch c {
	case Residual:
	case Distillate:
		g0, g2, n0, n1 = 51.916, 8.792e-6, 46.423, 3.170e-3
	default:
		return 0, 0, fmt.Errorf("fuel: ISO 8217 specific energy applies to residual and distillate fuels, not to %v", c)
	}
	w, a, s := 100*water, 100*ash, 100*sulfur
	k := 1 - 0.01*(w+a+s)
	g := (g0-g2*rho15*rho15)*k + 0.0942*s
	n := (n0-g2*rho15*rho15+n1*rho15)*k + 0.0942*s - isoWaterTerm/1e8*w
	return n * 1e6, g * 1e6, nil
}

// Channiwala-Parikh validity limits on the analysis (mass fractions), from
// the paper's stated data range as remembered: C 0–92.25 %, H 0.43–25.15 %,
// O 0–50 %, N 0–5.6 %, S 0–94 %, ash 0–71 % (from memory).
const (
	cpMaxC = 0.9225
	cpMinH = 0.0043
	cpMaxH = 0.2515
	cpMaxO = 0.50
	cpMaxN = 0.056
)

// AnalysisEnergy returns the net and gross specific energy (J/kg) from an
// ultimate analysis (as fired, mass fractions). The gross value is the
// Channiwala-Parikh unified correlation, S. A. Channiwala and P. P. Parikh,
// Fuel 81 (2002) 1051–1063 (coefficients from memory):
//
//	HHV [MJ/kg] = 0.3491·C + 1.1783·H + 0.1005·S − 0.1034·O − 0.0151·N − 0.0211·A
//
// with fractions in % m/m. The paper gives an average absolute error of
// 1.45 % (from memory). The correlation is linear without a constant term,
// so applying it to as-fired fractions (free water contributes nothing) gives
// the as-fired gross value. The net value subtracts the latent heat of the
// product water at 25 °C: LHV = HHV − LatentHeat25·(8.937·H + water).
func AnalysisEnergy(a Analysis) (net, gross float64, err error) {
	if !inRange(a.C, 0, cpMaxC) || !inRange(a.H, cpMinH, cpMaxH) || !inRange(a.O, 0, cpMaxO) ||
		!inRange(a.N, 0, cpMaxN) || !inRange(a.S, 0, 0.94) || !inRange(a.Ash, 0, 0.71) || !inRange(a.Water, 0, 1) {
		return 0, 0, fmt.Errorf("fuel: Channiwala-Parikh HHV: analysis C %g, H %g, O %g, N %g, S %g, ash %g kg/kg outside the correlation's data range (C ≤ %g, %g ≤ H ≤ %g, O ≤ %g, N ≤ %g, S ≤ 0.94, ash ≤ 0.71)",
			a.C, a.H, a.O, a.N, a.S, a.Ash, cpMaxC, cpMinH, cpMaxH, cpMaxO, cpMaxN)
	}
	g := (0.3491*a.C*100 + 1.1783*a.H*100 + 0.1005*a.S*100 - 0.1034*a.O*100 - 0.0151*a.N*100 - 0.0211*a.Ash*100) * 1e6
	n := g - LatentHeat25*(WaterPerHydrogen*a.H+a.Water)
	return n, g, nil
}

// ProductWaterLatent returns the latent heat of the water in the flue gas
// from hydrogen and free water, per kg fuel (J/kg): the gross-net difference
// implied by the analysis.
func (a Analysis) ProductWaterLatent() float64 {
	return LatentHeat25 * (WaterPerHydrogen*a.H + a.Water)
}

// ErrNoEnergyData is wrapped when a fuel has neither a set LHV, ISO 8217
// data nor an analysis.
var ErrNoEnergyData = errors.New("no data for a specific energy")

// Energy returns the specific energies of the fuel (J/kg), each with its
// source. Precedence for the net value: SetLHV, then the ISO 8217 formula
// of the fuel's class, then the analysis correlation. The gross value
// follows the same data: with SetLHV it is SetLHV plus the latent heat of
// the product water from the analysis (or, without analysis, plus the ISO
// 8217 gross−net difference); otherwise the same route as the net value.
// IMOLCV is the IMO fuel type's LCV, reported beside, never in its place.
func (f Fuel) Energy() (Energy, error) {
	if err := f.Validate(); err != nil {
		return Energy{}, err
	}
	var e Energy
	switch {
	case f.ISO.Given() && f.ISO.Density15 != 0:
		n, g, err := isoFormula(f.Class, f.ISO.Density15, f.ISO.Water, f.ISO.Ash, f.ISO.Sulfur)
		if err != nil {
			return Energy{}, fmt.Errorf("fuel %q: %w", f.label(), err)
		}
		r := RouteISO8217
		if f.Class == Distillate {
			r = RouteISO8217Distillate
		}
		e = Energy{Net: n, Gross: g, NetSource: Source{Route: r}, GrossSource: Source{Route: r}}
	case f.Analysis.Given():
		n, g, err := AnalysisEnergy(f.Analysis)
		if err != nil && f.SetLHV == 0 {
			return Energy{}, fmt.Errorf("fuel %q: %w", f.label(), err)
		}
		if err == nil {
			e = Energy{Net: n, Gross: g, NetSource: Source{Route: RouteAnalysis}, GrossSource: Source{Route: RouteAnalysis}}
		}
	}
	if f.SetLHV != 0 {
		set := Source{Route: RouteSet, Note: f.SetLHVSource}
		switch {
		case f.Analysis.Given():
			e.Gross = f.SetLHV + f.Analysis.ProductWaterLatent()
			e.GrossSource = Source{Route: RouteSetPlusLatent, Note: f.SetLHVSource}
		case e.NetSource.Route == RouteISO8217 || e.NetSource.Route == RouteISO8217Distillate:
			e.Gross = f.SetLHV + (e.Gross - e.Net)
			e.GrossSource = Source{Route: RouteSetPlusISODifference, Note: f.SetLHVSource}
		default:
			return Energy{}, fmt.Errorf("fuel %q: set LHV given without an analysis or ISO 8217 data: no gross value can be formed", f.label())
		}
		e.Net = f.SetLHV
		e.NetSource = set
	}
	if e.NetSource.Route == 0 {
		return Energy{}, fmt.Errorf("fuel %q: %w (give SetLHV, ISO 8217 density or an analysis)", f.label(), ErrNoEnergyData)
	}
	if math.IsNaN(e.Net) || math.IsNaN(e.Gross) || e.Net <= 0 || e.Gross < e.Net {
		return Energy{}, fmt.Errorf("fuel %q: specific energy net %g, gross %g J/kg is not physical", f.label(), e.Net, e.Gross)
	}
	e.IMOLCV, e.IMOSource = f.IMO.LCV, f.IMO.Source
	return e, nil
}

// CO2Factor is the CO2 emitted per kg of fuel burnt (kg/kg), twice: from
// the fuel's analysis (what the combustion model burns) and by the IMO
// factor of its fuel type (what regulatory reports use). The two differ by
// the difference between the fuel's carbon and the carbon of the IMO
// table's fuel type: for a 0.5 % sulfur residual fuel about 2.4 %.
type CO2Factor struct {
	// Analysis is C·M(CO2)/M(C) = C·44.0095/12.0107 of the analysis carbon,
	// complete combustion. Zero when the fuel has no analysis.
	Analysis float64
	// AnalysisSource describes the Analysis figure ("" when zero).
	AnalysisSource string
	// IMO is the C_F of the fuel's IMO fuel type (MEPC.364(79)). Zero when
	// the fuel has no IMO fuel type.
	IMO float64
	// IMOSource names the IMO table and fuel type ("" when zero).
	IMOSource string
}

// IMOOrAnalysis returns the IMO factor when the fuel has an IMO fuel type,
// otherwise the analysis figure: the one figure for a report that shows a
// single, regulatory CO2 line. Reports that show both read the fields.
func (c CO2Factor) IMOOrAnalysis() float64 {
	if c.IMO != 0 {
		return c.IMO
	}
	return c.Analysis
}

// CO2 returns the CO2 emitted per kg fuel, by the analysis and by the IMO
// factor (see CO2Factor); an error when the fuel has neither an analysis
// nor an IMO fuel type.
func (f Fuel) CO2() (CO2Factor, error) {
	if err := f.Validate(); err != nil {
		return CO2Factor{}, err
	}
	var c CO2Factor
	if f.Analysis.Given() {
		c.Analysis = CO2PerCarbon * f.Analysis.C
		c.AnalysisSource = "analysis carbon × 44.0095/12.0107 (complete combustion)"
	}
	if f.IMO.Given() {
		c.IMO, c.IMOSource = f.IMO.CF, f.IMO.Source
	}
	if c.Analysis == 0 && c.IMO == 0 {
		return CO2Factor{}, fmt.Errorf("fuel %q: CO2 factor: neither an analysis nor an IMO fuel type is given", f.label())
	}
	return c, nil
}
