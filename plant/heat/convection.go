package heat

import "math"

// Friction names a smooth-tube Darcy friction factor.
type Friction int

// Friction factors (docs/reference/heat-transfer.md §2).
const (
	Petukhov  Friction = iota // f = (0.790·ln Re − 1.64)^−2 [S✓], the default
	Filonenko                 // f = (1.82·log10 Re − 1.64)^−2 [S✓], within 0.2 % of Petukhov
	Konakov                   // ξ = (1.8·log10 Re − 1.5)^−2, used by the VDI form [S, memory]
)

// FrictionFactor returns the Darcy friction factor of a smooth tube. Re must
// be at least 3000 (the range of the Gnielinski equation they serve).
func FrictionFactor(form Friction, Re float64) (float64, error) {
	if !(Re >= 3000) || math.IsInf(Re, 1) {
		return 0, rangeErr("smooth-tube friction factor", "Re", Re, "3000 <= Re < +Inf")
	}
	var d float64
	switch form {
	case Petukhov:
		d = 0.790*math.Log(Re) - 1.64
	case Filonenko:
		d = 1.82*math.Log10(Re) - 1.64
	case Konakov:
		d = 1.8*math.Log10(Re) - 1.5
	default:
		panic("heat: unknown Friction")
	}
	return 1 / (d * d), nil
}

// Gnielinski returns the Nusselt number of turbulent flow in a tube,
//
//	Nu = (f/8)·(Re − 1000)·Pr / [1 + 12.7·(f/8)^½·(Pr^(2/3) − 1)]
//
// V. Gnielinski, Int. Chem. Eng. 16:359-368 (1976) (docs/reference/heat-transfer.md §2
// [S✓]), with the Darcy friction factor f supplied by the caller (normally
// FrictionFactor(Petukhov, Re)). Valid for 3000 ≤ Re ≤ 5e6 and
// 0.5 ≤ Pr ≤ 2000; outside it returns an ErrRange error. Fully developed
// flow, properties at the bulk temperature, no entrance or property-ratio
// correction (TubeFlow adds the entrance factor on request).
func Gnielinski(Re, Pr, f float64) (float64, error) {
	const where = "Gnielinski (1976)"
	if err := gnielinskiRange(where, Re, 3000, Pr); err != nil {
		return 0, err
	}
	if !(f > 0 && f < 1) {
		return 0, inputErr(where, "f", f, "a Darcy friction factor in (0, 1)")
	}
	f8 := f / 8
	return f8 * (Re - 1000) * Pr / (1 + 12.7*math.Sqrt(f8)*(math.Pow(Pr, 2.0/3)-1)), nil
}

func gnielinskiRange(where string, Re, reMin, Pr float64) error {
	if !(Re >= reMin && Re <= 5e6) {
		if !(Re > 0) {
			return inputErr(where, "Re", Re, "a Reynolds number > 0")
		}
		if reMin == 3000 {
			return rangeErr(where, "Re", Re, "3000 <= Re <= 5e6")
		}
		return rangeErr(where, "Re", Re, "Re <= 5e6")
	}
	if !(Pr >= 0.5 && Pr <= 2000) {
		if !(Pr > 0) {
			return inputErr(where, "Pr", Pr, "a Prandtl number > 0")
		}
		return rangeErr(where, "Pr", Pr, "0.5 <= Pr <= 2000")
	}
	return nil
}

// GnielinskiVDI returns the turbulent Nusselt number in the form of the VDI
// Heat Atlas (2010, chapter G1), with Konakov's ξ and Re (not Re − 1000):
//
//	Nu = (ξ/8)·Re·Pr / [1 + 12.7·(ξ/8)^½·(Pr^(2/3) − 1)] · [1 + (d/L)^(2/3)]
//
// This form is from memory and not verified (docs/reference/heat-transfer.md §2 [S,
// memory]); it is valid for Re ≥ 1e4. dOverL = 0 means fully developed flow.
// Below Re = 1e4 (down to 3000) it is computed with WarnVDIBelowRange set,
// because TubeFlow may use it as an end point of the transition range.
func GnielinskiVDI(Re, Pr, dOverL float64) (float64, Warning, error) {
	const where = "Gnielinski, VDI Heat Atlas form"
	if err := gnielinskiRange(where, Re, 3000, Pr); err != nil {
		return 0, 0, err
	}
	if !(dOverL >= 0 && dOverL <= 1) {
		return 0, 0, inputErr(where, "d/L", dOverL, "0 <= d/L <= 1 (0 = fully developed)")
	}
	var w Warning
	if Re < 1e4 {
		w = WarnVDIBelowRange
	}
	xi, _ := FrictionFactor(Konakov, Re)
	x8 := xi / 8
	nu := x8 * Re * Pr / (1 + 12.7*math.Sqrt(x8)*(math.Pow(Pr, 2.0/3)-1))
	return nu * (1 + math.Pow(dOverL, 2.0/3)), w, nil
}

// TurbulentForm chooses the turbulent tube correlation of TubeFlow.
type TurbulentForm int

// Turbulent forms.
const (
	Gnielinski1976 TurbulentForm = iota // the 1976 equation with FrictionFactor [S✓], the default
	VDIForm                             // GnielinskiVDI [S, memory]
)

// Laminar Nusselt numbers of fully developed flow in a round tube
// (docs/reference/heat-transfer.md §2 [S, textbook]).
const (
	NuLaminarWallTemperature = 3.66 // uniform wall temperature
	NuLaminarHeatFlux        = 4.36 // uniform heat flux
	ReLaminar                = 2300.0
)

// TubeFlow evaluates the Nusselt number of flow inside a round tube over the
// whole range of Re. The zero value is the default: Gnielinski (1976) with
// Petukhov's f in turbulent flow, Nu = 3.66 (uniform wall temperature, no
// entrance effect) for Re ≤ 2300, and between them linear interpolation in
// Re from Nu_lam at 2300 to Nu_turb at 4000, the end point proposed by
// Gnielinski, IJHMT 63:134-140 (2013) (docs/reference/heat-transfer.md §2 [S✓ abstract]):
//
//	Nu = (1 − γ)·Nu_lam + γ·Nu_turb(Re_end),  γ = (Re − 2300)/(Re_end − 2300)
type TubeFlow struct {
	Form     TurbulentForm
	Friction Friction // for Gnielinski1976; the VDI form always uses Konakov
	// TransitionEnd is Re_end. 0 means 4000 (Gnielinski 2013). The VDI Heat
	// Atlas form uses 1e4 [S, memory]. Must lie in [3000, 1e5].
	TransitionEnd float64
	// UniformHeatFlux selects Nu_lam = 4.36 instead of 3.66.
	UniformHeatFlux bool
	// DOverL, if > 0, multiplies the turbulent Nu by the entrance factor
	// [1 + (d/L)^(2/3)] (docs/reference/heat-transfer.md §2 [S, memory]); 0 = fully developed.
	DOverL float64
}

func (m *TubeFlow) turbulent(Re, Pr float64) (float64, Warning, error) {
	if m.Form == VDIForm {
		return GnielinskiVDI(Re, Pr, m.DOverL)
	}
	f, err := FrictionFactor(m.Friction, Re)
	if err != nil {
		return 0, 0, err
	}
	nu, err := Gnielinski(Re, Pr, f)
	if err != nil {
		return 0, 0, err
	}
	if m.DOverL > 0 {
		nu *= 1 + math.Pow(m.DOverL, 2.0/3)
	}
	return nu, 0, nil
}

// Nusselt returns Nu = h·d/λ at Re and Pr (properties at the bulk
// temperature). Re above 5e6 or Pr outside 0.5-2000 give an ErrRange error;
// Re ≤ 0 an ErrInput error.
func (m TubeFlow) Nusselt(Re, Pr float64) (float64, Warning, error) {
	const where = "tube flow Nusselt number"
	if !(Re > 0) || math.IsInf(Re, 1) {
		return 0, 0, inputErr(where, "Re", Re, "a finite Reynolds number > 0")
	}
	if !(Pr > 0) || math.IsInf(Pr, 1) {
		return 0, 0, inputErr(where, "Pr", Pr, "a finite Prandtl number > 0")
	}
	if !(m.DOverL >= 0 && m.DOverL <= 1) {
		return 0, 0, inputErr(where, "d/L", m.DOverL, "0 <= d/L <= 1")
	}
	if m.Form != Gnielinski1976 && m.Form != VDIForm {
		panic("heat: unknown TurbulentForm")
	}
	end := m.TransitionEnd
	if end == 0 {
		end = 4000
	}
	if !(end >= 3000 && end <= 1e5) {
		return 0, 0, inputErr(where, "transition end Re", end, "3000 <= Re_end <= 1e5 (0 for 4000)")
	}
	nuLam := NuLaminarWallTemperature
	if m.UniformHeatFlux {
		nuLam = NuLaminarHeatFlux
	}
	if Re <= ReLaminar {
		// Fully developed laminar flow: Nu does not depend on Re or Pr.
		return nuLam, 0, nil
	}
	if Re < end {
		nuT, w, err := m.turbulent(end, Pr)
		if err != nil {
			return 0, 0, err
		}
		g := (Re - ReLaminar) / (end - ReLaminar)
		return (1-g)*nuLam + g*nuT, w, nil
	}
	return m.turbulent(Re, Pr)
}

// DittusBoelter returns Nu = 0.023·Re^0.8·Pr^n with n = 0.4 when the fluid
// is heated and n = 0.3 when it is cooled (flue gas in smoke tubes: cooled).
// F. W. Dittus, L. M. K. Boelter, Univ. Calif. Publ. Eng. 2(13):443-461
// (1930) (docs/reference/heat-transfer.md §3 [S✓]). Valid for Re ≥ 1e4, 0.6 ≤ Pr ≤ 160 and
// L/d ≥ 10 (lOverD is the tube's length over its diameter); outside it
// returns an ErrRange error. Use it only as a cross-check of Gnielinski (it
// reads 11 % high at Re = 2e4, Pr = 0.7).
func DittusBoelter(Re, Pr, lOverD float64, heated bool) (float64, error) {
	const where = "Dittus-Boelter"
	if !(lOverD >= 10) {
		if !(lOverD > 0) {
			return 0, inputErr(where, "L/d", lOverD, "a length-to-diameter ratio > 0")
		}
		return 0, rangeErr(where, "L/d", lOverD, "L/d >= 10")
	}
	if !(Re >= 1e4) || math.IsInf(Re, 1) {
		if !(Re > 0) {
			return 0, inputErr(where, "Re", Re, "a Reynolds number > 0")
		}
		return 0, rangeErr(where, "Re", Re, "1e4 <= Re < +Inf")
	}
	if !(Pr >= 0.6 && Pr <= 160) {
		if !(Pr > 0) {
			return 0, inputErr(where, "Pr", Pr, "a Prandtl number > 0")
		}
		return 0, rangeErr(where, "Pr", Pr, "0.6 <= Pr <= 160")
	}
	n := 0.3
	if heated {
		n = 0.4
	}
	return 0.023 * math.Pow(Re, 0.8) * math.Pow(Pr, n), nil
}
