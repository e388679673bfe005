package loads

// StandardGravity is the standard acceleration of free fall, 9.80665 m/s²
// (CGPM 1901, exact by definition).
const StandardGravity = 9.80665

// CargoPump is a turbine-driven cargo pump. Its shaft power is
//
//	P_hyd = ρ·g·Q·H,   P_shaft = P_hyd/η
//
// (docs/reference/plant-checks.md §9 [C], §8 [M; arithmetic C]). The plant's turbine unit
// turns the shaft power into a steam flow. The efficiency is a fixed input:
// no pump curve is modelled.
type CargoPump struct {
	// Name identifies the pump.
	Name string
	// Flow is the volume flow (m³/s).
	Flow float64
	// Head is the total head (m).
	Head float64
	// Density of the cargo (kg/m³).
	Density float64
	// Efficiency of the pump, (0, 1]; large cargo pumps 0.80–0.87
	// (docs/reference/plant-checks.md §9 [M]).
	Efficiency float64
}

// PumpResult is a pump's power and the inputs that drove it.
type PumpResult struct {
	Name string
	// Hydraulic power ρ·g·Q·H (W) and Shaft power (W).
	Hydraulic, Shaft float64
	// Flow (m³/s), Head (m), Density (kg/m³), Efficiency echo the inputs.
	Flow, Head, Density, Efficiency float64
}

// Power returns the pump's hydraulic and shaft power.
func (p CargoPump) Power() (PumpResult, error) {
	c := checker{KindCargoPump, p.Name}
	r := PumpResult{Name: p.Name, Flow: p.Flow, Head: p.Head, Density: p.Density, Efficiency: p.Efficiency}
	if err := c.nonNegative("flow", p.Flow, "m³/s"); err != nil {
		return r, err
	}
	if err := c.nonNegative("head", p.Head, "m"); err != nil {
		return r, err
	}
	if err := c.positive("cargo density", p.Density, "kg/m³"); err != nil {
		return r, err
	}
	if !(p.Efficiency > 0 && p.Efficiency <= 1) {
		return r, c.errf("efficiency %.6g is outside (0, 1]; want a fraction such as 0.85", p.Efficiency)
	}
	r.Hydraulic = p.Density * StandardGravity * p.Flow * p.Head
	r.Shaft = r.Hydraulic / p.Efficiency
	if !finite(r.Hydraulic, r.Shaft) {
		return PumpResult{Name: p.Name}, c.overflow("shaft power")
	}
	return r, nil
}

// FixedPower is a turbine with a set shaft power, such as a turbo-generator
// at a given electrical load (the user converts electrical to shaft power).
type FixedPower struct {
	// Name identifies the turbine.
	Name string
	// Power is the shaft power (W), ≥ 0.
	Power float64
}

// Shaft returns the shaft power (W) after checking it.
func (f FixedPower) Shaft() (float64, error) {
	c := checker{KindFixedPower, f.Name}
	if err := c.nonNegative("shaft power", f.Power, "W"); err != nil {
		return 0, err
	}
	return f.Power, nil
}
