package fuel

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"
)

// BDN holds what a bunker delivery note, with the supplier's certificate of
// quality, states of a delivered liquid fuel. FromBDN turns it, on top of a
// base grade, into a Fuel. Fractions are kg/kg except Water, which is a
// volume fraction as ISO 8217 states it.
type BDN struct {
	// Name names the delivered fuel; empty means the base fuel's name with
	// " (BDN)".
	Name string
	// Grade is the ISO 8217 grade the note declares, such as "RMG 380",
	// "RME180" or "DMA" (optional). It chooses the IMO fuel type (DM and DF
	// grades: Diesel/Gas oil; RMA-RMD: LFO; RME-RMK: HFO) and the grade's
	// limits, against which the figures are checked (an off-spec figure is
	// a warning). Empty keeps the base fuel's IMO fuel type and checks only
	// the envelope of all grades of the class.
	Grade string
	// Density15 is the density at 15 °C (kg/m³). Required.
	Density15 float64
	// Sulfur is the sulfur content (kg/kg: the note's % m/m over 100).
	// Zero means none.
	Sulfur float64
	// Water is the water content as a volume fraction (m³/m³: ISO 8217's %
	// V/V over 100, the unit of the ISO 3733 test). Zero means none. It is
	// turned into a mass fraction with the density of water at 15 °C,
	// WaterDensity15.
	Water float64
	// Ash is the ash content (kg/kg). Zero means none.
	Ash float64
	// Viscosity is the kinematic viscosity (m²/s) at the ISO 8217
	// reference temperature of the base fuel's class: 50 °C for residual,
	// 40 °C for distillate fuels. Zero means not stated: the base fuel's
	// viscosity line is kept, with a warning.
	Viscosity float64
	// Viscosity2 is an optional second viscosity point (T in K, ν in m²/s)
	// for the ASTM D341 line. Without it the line through Viscosity keeps
	// the slope of the base fuel's line (a warning says so).
	Viscosity2 ViscosityPoint
	// LHV is a stated net specific energy (J/kg), optional. Zero means the
	// ISO 8217 annex formula gives it.
	LHV float64
	// LHVSource names where LHV comes from; empty means "stated with the
	// bunker delivery note".
	LHVSource string
}

// BDNFuel is a fuel made from a bunker delivery note, with its figures and
// what a reader of them should know.
type BDNFuel struct {
	// Fuel has the note's ISO 8217 properties, the analysis they imply
	// (AnalysisFromISO) and, when stated, the LHV.
	Fuel Fuel
	// Energy and CO2 are the fuel's Energy() and CO2().
	Energy Energy
	CO2    CO2Factor
	// AnalysisGross is the gross specific energy (J/kg) of the derived
	// analysis by the Channiwala-Parikh correlation (AnalysisEnergy), the
	// cross-check of the ISO 8217 gross value (ISOGross).
	AnalysisGross float64
	// ISONet and ISOGross are the ISO 8217 annex values (J/kg) from the
	// note's properties, whether or not a stated LHV replaces the net one.
	ISONet, ISOGross float64
	// Warnings are the figures a reader must see: off-spec properties for
	// the declared grade, a stated LHV far from the ISO 8217 estimate, a
	// cross-check that disagrees, a simplified viscosity line.
	Warnings []string
}

// WaterDensity15 is the density of water at 15 °C and 101.325 kPa, 999.10
// kg/m³ (IAPWS-IF97 region 1; a test checks it against plant/water), used
// to turn a water content by volume into one by mass.
const WaterDensity15 = 999.10

// Tolerances behind the warnings of FromBDN (common practice, no source):
// a stated LHV more than 2 % from the ISO 8217 estimate, and a
// Channiwala-Parikh gross value more than 2 % from the ISO 8217 gross value.
const (
	BDNLHVTolerance        = 0.02
	BDNCrossCheckTolerance = 0.02
)

// Stated net specific energies accepted for a liquid fuel: 35…46 MJ/kg, a
// margin around the 39.5…43.5 MJ/kg of marine fuel oils and gas oils
// (common practice, no source).
const (
	minBDNLHV = 35e6
	maxBDNLHV = 46e6
)

// isoGrade is one ISO 8217 grade family with its limits, as ISO 8217:2017
// Tables 1 (distillates) and 2 (residual fuels) give them, FROM MEMORY (not
// on the project's reference sheet, not confirmed against the printed
// standard). Zero means the table gives no figure. The array is never
// written.
type isoGrade struct {
	family string
	class  Class
	imo    int
	// numbers are the designation numbers allowed (residual: the maximum
	// viscosity at 50 °C in mm²/s, ascending; a designation without one
	// takes the largest); viscMin and viscMax the distillate range at 40 °C.
	numbers          []int
	viscMin, viscMax float64 // mm²/s, distillates only
	densityMax       float64 // kg/m³
	waterMax         float64 // % V/V
	ashMax           float64 // % m/m
	sulfurMax        float64 // % m/m; residual grades: statutory, no figure
}

var isoGrades = [...]isoGrade{
	{family: "RMA", class: Residual, imo: imoLFO, numbers: []int{10}, densityMax: 920, waterMax: 0.30, ashMax: 0.040},
	{family: "RMB", class: Residual, imo: imoLFO, numbers: []int{30}, densityMax: 960, waterMax: 0.50, ashMax: 0.070},
	{family: "RMD", class: Residual, imo: imoLFO, numbers: []int{80}, densityMax: 975, waterMax: 0.50, ashMax: 0.070},
	{family: "RME", class: Residual, imo: imoHFO, numbers: []int{180}, densityMax: 991, waterMax: 0.50, ashMax: 0.070},
	{family: "RMG", class: Residual, imo: imoHFO, numbers: []int{180, 380, 500, 700}, densityMax: 991, waterMax: 0.50, ashMax: 0.100},
	{family: "RMK", class: Residual, imo: imoHFO, numbers: []int{380, 500, 700}, densityMax: 1010, waterMax: 0.50, ashMax: 0.150},
	{family: "DMX", class: Distillate, imo: imoDiesel, viscMin: 1.4, viscMax: 5.5, ashMax: 0.010, sulfurMax: 1.00},
	{family: "DMA", class: Distillate, imo: imoDiesel, viscMin: 2.0, viscMax: 6.0, densityMax: 890, ashMax: 0.010, sulfurMax: 1.00},
	{family: "DFA", class: Distillate, imo: imoDiesel, viscMin: 2.0, viscMax: 6.0, densityMax: 890, ashMax: 0.010, sulfurMax: 1.00},
	{family: "DMZ", class: Distillate, imo: imoDiesel, viscMin: 3.0, viscMax: 6.0, densityMax: 890, ashMax: 0.010, sulfurMax: 1.00},
	{family: "DFZ", class: Distillate, imo: imoDiesel, viscMin: 3.0, viscMax: 6.0, densityMax: 890, ashMax: 0.010, sulfurMax: 1.00},
	{family: "DMB", class: Distillate, imo: imoDiesel, viscMin: 2.0, viscMax: 11.0, densityMax: 900, waterMax: 0.30, ashMax: 0.010, sulfurMax: 1.50},
	{family: "DFB", class: Distillate, imo: imoDiesel, viscMin: 2.0, viscMax: 11.0, densityMax: 900, waterMax: 0.30, ashMax: 0.010, sulfurMax: 1.50},
}

// bdnEnvelope is the range FromBDN accepts for a class: the union of the
// ISO 8217 grades' limits (from memory, as isoGrades) where the standard
// gives one, a stated bound where it does not. Outside it the figures are
// an error: the annex formula is not used beyond the fuels it serves.
type bdnEnvelope struct {
	densityMin, densityMax float64 // kg/m³
	viscMin, viscMax       float64 // mm²/s at the reference temperature
	waterMax, ashMax       float64 // % V/V, % m/m
	sulfurMax              float64 // % m/m
	note                   string
}

func envelope(c Class) bdnEnvelope {
	if c == Distillate {
		// Density: DMB's 900 kg/m³ at most; at least 780 kg/m³ (common
		// practice, no source). Viscosity 1.4 (DMX) to 11 (DMB) mm²/s,
		// water 0.30 % V/V (DMB), ash 0.010 %, sulfur 1.50 % (DMB).
		return bdnEnvelope{780, 900, 1.4, 11, 0.30, 0.010, 1.50, "ISO 8217 distillate grades DMX-DMB (from memory)"}
	}
	// Density: RMK's 1010 kg/m³ at most; at least 820 kg/m³ (common
	// practice, no source). Viscosity at most 700 mm²/s (RMG and RMK 700),
	// water 0.50 % V/V, ash 0.150 % (RMK). Sulfur: ISO 8217 leaves it to
	// statute; 3.50 % m/m is the MARPOL Annex VI regulation 14 global limit
	// before 2020 (from memory).
	return bdnEnvelope{820, 1010, 0, 700, 0.50, 0.150, 3.50, "ISO 8217 residual grades RMA-RMK (from memory)"}
}

// parseISOGrade reads a grade designation such as "RMG 380", "rmg380" or
// "DMA" and returns the family and the residual viscosity number (0 for a
// distillate).
func parseISOGrade(s string) (isoGrade, int, error) {
	t := strings.ToUpper(strings.Join(strings.Fields(s), ""))
	if len(t) < 3 {
		return isoGrade{}, 0, fmt.Errorf("ISO 8217 grade %q: want a designation such as \"RMG 380\" or \"DMA\"", s)
	}
	fam, num := t[:3], t[3:]
	for _, g := range isoGrades {
		if g.family != fam {
			continue
		}
		if g.class == Distillate {
			if num != "" {
				return isoGrade{}, 0, fmt.Errorf("ISO 8217 grade %q: a distillate grade has no number; want %s", s, g.family)
			}
			return g, 0, nil
		}
		if num == "" {
			return g, g.numbers[len(g.numbers)-1], nil
		}
		v, err := strconv.Atoi(num)
		if err == nil {
			for _, n := range g.numbers {
				if n == v {
					return g, v, nil
				}
			}
		}
		ns := make([]string, len(g.numbers))
		for i, n := range g.numbers {
			ns[i] = fmt.Sprintf("%s %d", g.family, n)
		}
		return isoGrade{}, 0, fmt.Errorf("ISO 8217 grade %q: %s comes as %s", s, g.family, strings.Join(ns, ", "))
	}
	return isoGrade{}, 0, fmt.Errorf("ISO 8217 grade %q: unknown; want RMA, RMB, RMD, RME, RMG or RMK with its number, or DMX, DMA, DMZ, DMB (DFA, DFZ, DFB)", s)
}

// FromBDN returns the fuel a bunker delivery note describes, on top of the
// base fuel (usually a built-in grade, see Grade): the note's density,
// sulfur, water, ash and viscosity replace the base's ISO 8217 properties;
// the analysis follows from them (AnalysisFromISO, with the base's
// nitrogen and oxygen); the net specific energy is the note's stated LHV
// or else the ISO 8217 annex formula of the base's class; the IMO fuel type
// follows the declared grade, or stays the base's. The base's own set LHV,
// if any, is dropped: it described another fuel.
//
// Figures outside the envelope of the ISO 8217 grades of the class (and a
// stated LHV outside 35…46 MJ/kg) are errors naming the field, the value
// and the range, all of them joined; figures outside the declared grade's
// own limits, a stated LHV more than BDNLHVTolerance from the ISO 8217
// estimate, and a Channiwala-Parikh gross value more than
// BDNCrossCheckTolerance from the ISO 8217 one are warnings.
func FromBDN(base Fuel, b BDN) (BDNFuel, error) {
	name := b.Name
	if name == "" {
		name = base.label() + " (BDN)"
	}
	if err := base.Validate(); err != nil {
		return BDNFuel{}, fmt.Errorf("fuel %q: base fuel: %w", name, err)
	}
	if base.Class != Residual && base.Class != Distillate {
		return BDNFuel{}, &FieldError{Fuel: name, Field: "base Class", Value: float64(base.Class),
			Want: fmt.Sprintf("a bunker delivery note describes a liquid fuel; the base %q is %v", base.label(), base.Class)}
	}
	refT := 323.15
	if base.Class == Distillate {
		refT = 313.15
	}
	nu := b.Viscosity * 1e6 // mm²/s
	grade, number, err := bdnCheck(name, base, b, refT, nu)
	if err != nil {
		return BDNFuel{}, err
	}
	var out BDNFuel
	out.offSpec(name, grade, number, b, nu)

	f := base
	f.Name = name
	f.SetLHV, f.SetLHVSource = 0, ""
	f.ISO = ISO8217{
		Density15: b.Density15,
		Sulfur:    b.Sulfur,
		Water:     b.Water * WaterDensity15 / b.Density15,
		Ash:       b.Ash,
	}
	if grade.family != "" {
		f.IMO = imoTypes[grade.imo]
	}

	a, err := AnalysisFromISO(f.Class, f.ISO, base.Analysis.N, base.Analysis.O)
	if err != nil {
		return BDNFuel{}, fmt.Errorf("fuel %q: %w", name, err)
	}
	f.Analysis = a
	if err := out.viscosity(&f, name, base, b, refT, nu); err != nil {
		return BDNFuel{}, err
	}
	if err := out.energies(&f, name, b); err != nil {
		return BDNFuel{}, err
	}
	out.Fuel = f
	return out, nil
}

// warnf adds a warning on fuel name.
func (out *BDNFuel) warnf(name, format string, args ...any) {
	out.Warnings = append(out.Warnings, fmt.Sprintf("fuel %q: ", name)+fmt.Sprintf(format, args...))
}

// bdnCheck reads the note's declared grade, if any, which must be of the
// base's class, and checks the note's figures against the envelope of the
// class (a stated LHV against the range of a liquid fuel): it returns the
// grade's family and number, or every fault joined. A figure out of range
// is said as the note writes it (kg/m³, % m/m, % V/V, mm²/s, MJ/kg),
// naming the key of a script's bdn table; nu is the stated viscosity
// (mm²/s) at refT (K).
func bdnCheck(name string, base Fuel, b BDN, refT, nu float64) (isoGrade, int, error) {
	var errs []error
	var grade isoGrade
	var number int
	if b.Grade != "" {
		g, n, err := parseISOGrade(b.Grade)
		switch {
		case err != nil:
			errs = append(errs, fmt.Errorf("fuel %q: the delivery note's grade (bdn.grade): %w", name, err))
		case g.class != base.Class:
			errs = append(errs, fmt.Errorf("fuel %q: the delivery note's grade (bdn.grade) %q is a %v grade, the base %q a %v fuel", name, b.Grade, g.class, base.label(), base.Class))
		default:
			grade, number = g, n
		}
	}

	env := envelope(base.Class)
	bad := func(key, what string, shown float64, unit string, lo, hi float64, why string) {
		want := fmt.Sprintf("want %g…%g %s, %s", lo, hi, unit, why)
		errs = append(errs, &FieldError{Fuel: name, Field: "bdn." + key, Value: shown, Want: want,
			Text: fmt.Sprintf("fuel %q: the delivery note's %s (bdn.%s) is %g %s; %s", name, what, key, shown, unit, want)})
	}
	envNote := "the envelope of the " + env.note
	if !inRange(b.Density15, env.densityMin, env.densityMax) {
		bad("density", "density at 15 °C", b.Density15, "kg/m³", env.densityMin, env.densityMax, envNote)
	}
	if !inRange(100*b.Sulfur, 0, env.sulfurMax) {
		bad("sulphur", "sulphur", 100*b.Sulfur, "% m/m", 0, env.sulfurMax, envNote)
	}
	if !inRange(100*b.Water, 0, env.waterMax) {
		bad("water", "water", 100*b.Water, "% V/V", 0, env.waterMax, envNote)
	}
	if !inRange(100*b.Ash, 0, env.ashMax) {
		bad("ash", "ash", 100*b.Ash, "% m/m", 0, env.ashMax, envNote)
	}
	if b.Viscosity != 0 && !(nu > 0 && inRange(nu, env.viscMin, env.viscMax)) {
		bad("viscosity", fmt.Sprintf("viscosity at %g °C", refT-273.15), nu, "mm²/s", env.viscMin, env.viscMax, envNote)
	}
	if b.LHV != 0 && !inRange(b.LHV, minBDNLHV, maxBDNLHV) {
		bad("lhv", "net specific energy", b.LHV/1e6, "MJ/kg", minBDNLHV/1e6, maxBDNLHV/1e6, "for a liquid fuel")
	}
	if len(errs) > 0 {
		return isoGrade{}, 0, errors.Join(errs...)
	}
	return grade, number, nil
}

// offSpec warns of each figure of the note outside the declared grade's
// own limits (none without a declared grade). nu is the stated viscosity
// (mm²/s).
func (out *BDNFuel) offSpec(name string, grade isoGrade, number int, b BDN, nu float64) {
	if grade.family == "" {
		return
	}
	label := grade.family
	if number != 0 {
		label = fmt.Sprintf("%s %d", grade.family, number)
	}
	offSpec := func(what string, v float64, unit, limit string) {
		out.warnf(name, "%s %g %s is off-spec for %s (%s; ISO 8217:2017 limits, from memory)", what, v, unit, label, limit)
	}
	if grade.densityMax != 0 && b.Density15 > grade.densityMax {
		offSpec("density at 15 °C", b.Density15, "kg/m³", fmt.Sprintf("at most %g", grade.densityMax))
	}
	if b.Viscosity != 0 {
		switch {
		case grade.class == Residual && nu > float64(number):
			offSpec("viscosity at 50 °C", nu, "mm²/s", fmt.Sprintf("at most %d", number))
		case grade.class == Distillate && !inRange(nu, grade.viscMin, grade.viscMax):
			offSpec("viscosity at 40 °C", nu, "mm²/s", fmt.Sprintf("%g…%g", grade.viscMin, grade.viscMax))
		}
	}
	if grade.waterMax != 0 && 100*b.Water > grade.waterMax {
		offSpec("water", 100*b.Water, "% V/V", fmt.Sprintf("at most %g", grade.waterMax))
	}
	if 100*b.Ash > grade.ashMax {
		offSpec("ash", 100*b.Ash, "% m/m", fmt.Sprintf("at most %g", grade.ashMax))
	}
	if grade.sulfurMax != 0 && 100*b.Sulfur > grade.sulfurMax {
		offSpec("sulfur", 100*b.Sulfur, "% m/m", fmt.Sprintf("at most %g", grade.sulfurMax))
	}
}

// viscosity gives f the note's viscosity line: the base's when the note
// states none, the two points stated, or the line through the one point
// stated (nu mm²/s at refT) with the slope of the base's line; and checks
// the line.
func (out *BDNFuel) viscosity(f *Fuel, name string, base Fuel, b BDN, refT, nu float64) error {
	switch {
	case b.Viscosity == 0:
		f.ISO.Viscosity, f.ISO.ViscosityT = base.ISO.Viscosity, base.ISO.ViscosityT
		if base.ISO.Viscosity != 0 {
			out.warnf(name, "viscosity not stated: the base fuel's viscosity line (%g mm²/s at %g °C) is kept", base.ISO.Viscosity*1e6, base.isoViscosityT()-273.15)
		}
	case b.Viscosity2 != (ViscosityPoint{}):
		f.ISO.Viscosity, f.ISO.ViscosityT = b.Viscosity, refT
		f.Viscosity2 = b.Viscosity2
	default:
		f.ISO.Viscosity, f.ISO.ViscosityT = b.Viscosity, refT
		f.Viscosity2 = ViscosityPoint{}
		if w0, err := base.ViscosityLine(); err == nil {
			// The line through the stated point with the base line's slope.
			w := Walther{A: loglog(nu) + w0.B*math.Log10(refT), B: w0.B, TMin: w0.TMin, TMax: w0.TMax}
			const t2 = 373.15
			nu2, err := w.Viscosity(t2)
			if err != nil {
				return fmt.Errorf("fuel %q: viscosity line through %g mm²/s at %g °C with the base's slope: %w", name, nu, refT-273.15, err)
			}
			f.Viscosity2 = ViscosityPoint{T: t2, Nu: nu2}
			out.warnf(name, "one viscosity stated: the ASTM D341 line through it keeps the slope of the base fuel's line (B = %.4f), giving %.3g mm²/s at 100 °C; give a second point to replace it", w0.B, nu2*1e6)
		} else {
			out.warnf(name, "one viscosity stated and the base fuel has no viscosity line: the fuel has none (heater temperatures for a target viscosity cannot be computed)")
		}
	}
	if f.Viscosity2 != (ViscosityPoint{}) {
		if _, err := f.ViscosityLine(); err != nil {
			return fmt.Errorf("fuel %q: BDN viscosity: %w", name, err)
		}
	}
	return nil
}

// energies sets the ISO 8217 annex values of f's properties, its stated
// LHV (with a warning when it is far from the annex value), the
// Channiwala-Parikh cross-check of its analysis (with a warning when it
// disagrees), and the fuel's energy and CO2 factor.
func (out *BDNFuel) energies(f *Fuel, name string, b BDN) error {
	var err error
	if out.ISONet, out.ISOGross, err = isoFormula(f.Class, f.ISO.Density15, f.ISO.Water, f.ISO.Ash, f.ISO.Sulfur); err != nil {
		return fmt.Errorf("fuel %q: %w", name, err)
	}
	if b.LHV != 0 {
		f.SetLHV, f.SetLHVSource = b.LHV, b.LHVSource
		if f.SetLHVSource == "" {
			f.SetLHVSource = "stated with the bunker delivery note"
		}
		if d := b.LHV/out.ISONet - 1; !(math.Abs(d) <= BDNLHVTolerance) {
			out.warnf(name, "stated LHV %.3f MJ/kg is %+.1f %% from the ISO 8217 estimate %.3f MJ/kg from the same note; check that it is the fuel's own figure and not a regulatory default such as the IMO LCV",
				b.LHV/1e6, 100*d, out.ISONet/1e6)
		}
	}
	if _, out.AnalysisGross, err = AnalysisEnergy(f.Analysis); err != nil {
		return fmt.Errorf("fuel %q: cross-check: %w", name, err)
	}
	if d := out.AnalysisGross/out.ISOGross - 1; !(math.Abs(d) <= BDNCrossCheckTolerance) {
		out.warnf(name, "the Channiwala-Parikh gross value of the derived analysis, %.3f MJ/kg, is %+.1f %% from the ISO 8217 gross value %.3f MJ/kg: the figures do not describe a usual fuel oil",
			out.AnalysisGross/1e6, 100*d, out.ISOGross/1e6)
	}
	if out.Energy, err = f.Energy(); err != nil {
		return err
	}
	if out.CO2, err = f.CO2(); err != nil {
		return err
	}
	return nil
}
