package plant

import (
	"fmt"
	"math"

	"steamcase/plant/combustion"
)

// CaseResult is the answer to one load case. Every figure is SI (kg/s, W,
// Pa, K, J/kg); package plant/schema gives its documented form for
// reports and scripts, in the units its keys name.
type CaseResult struct {
	Name       string
	Series     string // the sweep the case belongs to, if any (Case.Series)
	Pos        Pos
	Conditions Conditions

	Converged  bool
	Iterations int // Newton iterations of the final configuration
	Solves     int // configurations tried by the dispatch
	// NewtonIterations counts the Newton iterations of every solve the
	// case took: the configurations the firing rule tried, failed and
	// repeated solves included (Iterations is the final one's alone).
	NewtonIterations int
	ResidualNorm     float64

	BoilersFiring int
	CanCarry      bool
	// ShortfallKgS is the steam the firing boilers at their limit cannot
	// raise: the steam the shed consumers would take at the solved state
	// (ShedKgS), and any steam the boilers still raise above their limit
	// when nothing more may be shed.
	ShortfallKgS float64
	// MarginNextKgS is how much more steam the firing boilers can take
	// before the next boiler must fire (UsableFraction of their MCR), or,
	// with all boilers firing, before their MCR is reached.
	MarginNextKgS float64
	Forced        bool // the case forced which boilers fire

	SteamProductionKgS float64
	SteamDemandKgS     float64
	FuelKgS            float64
	// CO2KgS is the CO2 by each fuel's regulatory factor (the IMO
	// conversion factor C_F of its IMO fuel type; see FuelSpec.CO2Factor),
	// the figure for regulatory reporting. CO2AnalysisKgS is the CO2 from
	// the carbon of each fuel's analysis, what the combustion models burn;
	// CO2AnalysisUnknown says a boiler burnt a fuel without an analysis,
	// so that CO2AnalysisKgS is not the case's.
	CO2KgS             float64
	CO2AnalysisKgS     float64
	CO2AnalysisUnknown bool
	MakeUpKgS          float64
	ElectricW          float64
	BlowdownKgS        float64
	VentedKgS          float64
	CondensateLostKgS  float64
	TrapLossKgS        float64 // live steam passing the consumers' traps
	DrainsReturnedKgS  float64 // header drains returned to the hotwell
	DumpedKgS          float64
	FeedTankT          float64
	// EGESteamKgS is the steam the exhaust-gas economisers raise, and
	// EGEFuelSavedKgS the boiler fuel they save against the same case
	// without them (solved again with them out of service).
	EGESteamKgS     float64
	EGEFuelSavedKgS float64

	// The allocation of a shortfall (priority.go): the heat (or shaft
	// power) and the steam shed from the consumers, whether any consumer
	// gave a priority, and how many distinct priorities the consumers
	// that may be reduced have. Each consumer's part is in Consumers.
	ShedW, ShedKgS  float64
	PrioritiesGiven bool
	ShedRanks       int

	// Contingencies are the N-1 answers of the case (contingency.go): one
	// per single failure considered, in order; empty when the plant's
	// option turns them off (ContingenciesChecked false).
	Contingencies        []ContingencyResult
	ContingenciesChecked bool
	// InertGas is the inert-gas check of a case with cargo pumps running
	// on a plant with an inert-gas source (inertgas.go); nil otherwise.
	InertGas *InertGasResult
	// LeastFuel is what least-fuel sharing chose against equal sharing
	// (leastfuel.go); nil under another sharing rule, or when the case
	// forces its firing.
	LeastFuel *LeastFuelResult

	Balance Balance

	Boilers   []BoilerResult
	EGEs      []EGEResult
	Consumers []ConsumerResult
	Units     []ComponentResult
	Lines     []LineResult
	Warnings  []string
	// Tanks are the stateful tanks over the row (a voyage's), in the
	// plant's order; empty in a single load case.
	Tanks []TankRow

	boundary boundary
}

// Balance holds the closures of the case's balances, computed from the
// solved lines and the units' reported flows, not from the residuals.
type Balance struct {
	// MassRel is |mass in − mass out| / mass throughput of the plant
	// boundary: make-up in; blowdown, vented steam, lost condensate out.
	MassRel float64
	// EnergyRel is |energy in − energy out| / energy throughput: fuel heat
	// to water, pump work and make-up in; consumer duties, losses,
	// turbine work and the enthalpy of lost water out.
	EnergyRel float64
}

// boundary accumulates the flows across the plant boundary while units
// report.
type boundary struct {
	massIn, massOut     float64 // kg/s
	energyIn, energyOut float64 // W, enthalpy flows
	heatIn, heatOut     float64 // W
	workIn, workOut     float64 // W
}

// BoilerResult is one boiler's part in a case.
type BoilerResult struct {
	Name         string
	Firing       bool
	Cycling      bool
	OnFraction   float64 // share of time the burner is on when cycling
	LoadFraction float64
	MCRKgS       float64
	SteamKgS     float64
	FuelKgS      float64
	// CO2KgS is by the fuel's regulatory factor (CO2Basis says which);
	// CO2AnalysisKgS by its analysis carbon, when HasCO2Analysis.
	CO2KgS         float64
	CO2Basis       string
	CO2AnalysisKgS float64
	HasCO2Analysis bool
	IMOLCV         float64 // the IMO fuel type's LCV, J/kg; zero without one
	// Efficiency is the heat to water and steam over the fuel's heat: for
	// a cycling boiler the time average, below FiringEfficiency (the
	// efficiency model's at the firing rate) by the standby and purge
	// losses.
	Efficiency       float64
	FiringEfficiency float64
	EfficiencyBasis  string
	// A cycling boiler's losses (zero otherwise): the standby loss of the
	// warm boiler StandbyLossW and the part of it the off time takes
	// StandbyOffW, the purges' heat PurgeW (PurgePerStartJ each), and the
	// starts per hour (zero when not known).
	StandbyLossW, StandbyOffW float64
	PurgeW, PurgePerStartJ    float64
	StartsPerHour             float64
	FuelName                  string
	FuelLHV                   float64
	DrumP                     float64
	FeedT                     float64
	SteamDryness              float64
	BlowdownKgS               float64
	HeatW                     float64

	// From a combustion model (zero with a plain efficiency table):
	FlueT        float64 // flue-gas exit temperature, K
	Lambda       float64 // air ratio
	AirKgS       float64 // combustion air
	FlueGasKgS   float64
	Losses       *combustion.LossItems // LHV basis
	FanShaftW    float64
	FanElectricW float64

	// LimitKgS is the most steam the boiler may raise in the case: its
	// MCR times its max load.
	LimitKgS float64
	// InertGasSource: the boiler's uptake feeds the inert-gas system.
	InertGasSource bool
	// From a combustion model, while firing: O2 in the dry flue gas (mole
	// fraction) and the dry flue gas at normal conditions (0 °C,
	// 101.325 kPa), m³/s.
	O2Dry       float64
	DryFlueNm3S float64
}

// ConsumerResult is one steam consumer's part in a case.
type ConsumerResult struct {
	Name      string
	Kind      string
	DutyW     float64 // heat delivered, or shaft power of a turbine
	SteamKgS  float64
	ReturnKgS float64
	LostKgS   float64
	// DrainCoolerW is the heat the returning condensate gives up in a
	// drain cooler before the feed tank, and DrainCoolerTo where it goes:
	// "feed", "hotwell" or "overboard" ("" without a drain cooler).
	DrainCoolerW  float64
	DrainCoolerTo string
	// TrapLossKgS is the live steam that passes the consumer's trap.
	TrapLossKgS float64
	// Inputs are the figures that drove a computed duty, keys with units.
	Inputs map[string]float64

	// Priority is the consumer's priority (PriorityEssential when none was
	// given); Reducible says the shedding may reduce it in this case.
	// RequestedW is the duty (or shaft power) the case asks for, ShedW and
	// ShedKgS what the shedding took from it, in heat and in steam at the
	// solved state.
	Priority       float64
	Reducible      bool
	RequestedW     float64
	ShedW, ShedKgS float64
	// CargoRate is the cargo a turbine's pump delivers, m³/s (its flow in
	// proportion to the power delivered).
	CargoRate float64
	// Cooling is what shedding a tank's heating does to its cargo; nil
	// when nothing is shed or the consumer is no tank.
	Cooling *TankCooling
}

// TankCooling is a tank's cargo with part of its heating shed.
type TankCooling struct {
	// RateKS is the cargo's temperature change at the start, K/s (negative
	// when it cools).
	RateKS float64
	// MinT is the lowest temperature the cargo may reach (the tank's
	// min_T; zero when not given); SecondsToMinT the time until it gets
	// there, and Reaches false when it never does (the heating left holds
	// it above).
	MinT          float64
	SecondsToMinT float64
	Reaches       bool
}

// ComponentResult holds the figures of a unit that is neither a boiler nor a
// consumer, by name with the unit in the key.
type ComponentResult struct {
	Name    string
	Kind    string
	Figures Figures
}

// Figure is one named figure of a unit; the key carries its SI unit.
type Figure struct {
	Key   string
	Value float64
}

// Figures are a unit's figures in the order the unit gives them.
type Figures []Figure

// Get returns the figure called key and whether the unit has it.
func (f Figures) Get(key string) (float64, bool) {
	for _, x := range f {
		if x.Key == key {
			return x.Value, true
		}
	}
	return 0, false
}

// Of returns the figure called key, or 0 if the unit has none.
func (f Figures) Of(key string) float64 {
	v, _ := f.Get(key)
	return v
}

// Map returns the figures as a map by key.
func (f Figures) Map() map[string]float64 {
	m := make(map[string]float64, len(f))
	for _, x := range f {
		m[x.Key] = x.Value
	}
	return m
}

// LineResult is the solved state of one line.
type LineResult struct {
	Name     string
	M, P, T  float64
	H        float64
	X        float64 // quality; meaningful only when TwoPhase
	Phase    string
	TwoPhase bool
}

func (cr *CaseResult) warn(format string, args ...any) {
	cr.Warnings = append(cr.Warnings, fmt.Sprintf(format, args...))
}

// closure is |a − b| / scale, with a zero scale giving the plain difference.
func closure(a, b, scale float64) float64 {
	d := math.Abs(a - b)
	if scale <= 0 {
		return d
	}
	return d / scale
}

// FlowFloor is the smallest mass flow a result reports, kg/s: the solver
// converges its scaled residuals to 1e-10 (flows are scaled by 1 kg/s),
// so a flow below this is indistinguishable from none (0.36 g/h), and a
// result shows it as 0 rather than as solver noise (a cold boiler's fuel
// of 4e-24 kg/s). The balance closures are computed before, from the
// unrounded figures.
const FlowFloor = 1e-10

// clean sets the flows below FlowFloor to zero.
func (cr *CaseResult) clean() {
	z := func(v *float64) {
		if math.Abs(*v) < FlowFloor {
			*v = 0
		}
	}
	for _, v := range []*float64{&cr.ShortfallKgS, &cr.SteamProductionKgS, &cr.SteamDemandKgS, &cr.FuelKgS, &cr.CO2KgS, &cr.CO2AnalysisKgS,
		&cr.MakeUpKgS, &cr.BlowdownKgS, &cr.VentedKgS, &cr.CondensateLostKgS, &cr.TrapLossKgS, &cr.DrainsReturnedKgS, &cr.DumpedKgS, &cr.EGESteamKgS, &cr.EGEFuelSavedKgS} {
		z(v)
	}
	for i := range cr.Boilers {
		b := &cr.Boilers[i]
		for _, v := range []*float64{&b.SteamKgS, &b.FuelKgS, &b.CO2KgS, &b.CO2AnalysisKgS, &b.BlowdownKgS, &b.AirKgS, &b.FlueGasKgS} {
			z(v)
		}
		if b.SteamKgS == 0 {
			b.LoadFraction = 0
		}
	}
	for i := range cr.EGEs {
		z(&cr.EGEs[i].SteamKgS)
		z(&cr.EGEs[i].FuelSavedKgS)
	}
	for i := range cr.Consumers {
		c := &cr.Consumers[i]
		for _, v := range []*float64{&c.SteamKgS, &c.ReturnKgS, &c.LostKgS, &c.TrapLossKgS} {
			z(v)
		}
	}
	for i := range cr.Lines {
		z(&cr.Lines[i].M)
	}
}
