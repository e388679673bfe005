package plant

import (
	"fmt"

	"steamcase/plant/loads"
)

// tankState is what a stateful tank carries from row to row.
type tankState struct {
	on      bool
	start   float64 // its temperature at the voyage's start (K)
	T       float64 // at the start of the present row (K)
	clock   float64 // time from the voyage's start to the present row (s)
	steamP  float64 // the supply pressure found for the coil (Pa)
	pending loads.StepResult
	instr   loads.Instruction
	target  float64
	has     bool // pending holds the present row's step
}

// TankRow is a stateful tank over one row of a voyage: its temperatures,
// instruction, the coil's heat, the losses and the heat stored, the
// coil's capacity and whether it bound. CaseResult.Tanks lists them.
type TankRow struct {
	Name        string
	Instruction string  // "off", "hold", "heat_to", "reach"
	Target      float64 // the instruction's temperature (K); zero for off
	By          float64 // reach: wanted by, from the voyage's start (s)
	T0, T1      float64 // at the row's start and end (K)
	// Hours of the row; Clock the time from the voyage's start to the
	// row's start (s).
	Hours, Clock float64
	DutyW        float64 // the coil's mean duty over the row
	CapacityW    float64 // the coil's capacity at T0
	SteamT       float64 // the steam's saturation temperature at the coil (K)
	Binds        bool    // the coil gave its capacity for part of the row
	Short        bool    // the instruction's temperature was not reached
	// CoilJ, LossJ, StoredJ: heat given by the coil, lost to the
	// surroundings and stored in the cargo over the row (J).
	CoilJ, LossJ, StoredJ float64
	Mass, UA, AmbientT    float64
}

// Stateful reports whether the tank carries its temperature from row to
// row (Plant.StartTank).
func (m *TankHeating) Stateful() bool { return m.state.on }

// Temperature returns a stateful tank's temperature at the start of the
// next row (K).
func (m *TankHeating) Temperature() float64 { return m.state.T }

// stateDuty is a stateful tank's duty for a row: its step over the row's
// hours from its present temperature under the row's instruction
// (loads.TankHeating.Advance), whose mean duty the plant takes as the
// row's steady load. The step waits in the model until the row is solved
// (Plant.CommitRow).
func (m *TankHeating) stateDuty(c Conditions) (Duty, error) {
	if !(c.Period > 0) {
		return Duty{}, fmt.Errorf("is carried from row to row: its duty needs the row's hours (a voyage row), not a single load case")
	}
	amb, err := needAmbient(c, m.uses(loads.Sea), m.uses(loads.Air))
	if err != nil {
		return Duty{}, err
	}
	st := loads.Step{T0: m.state.T, Dt: c.Period, Instr: m.Instr, Target: m.Tank.To}
	if m.Instr == loads.HeatOff {
		st.Target = 0
	}
	if m.Instr == loads.ReachBy {
		if m.By <= 0 {
			return Duty{}, fmt.Errorf("instruction \"reach\" needs by, the time from the voyage's start by which T is wanted")
		}
		st.Deadline = m.By - m.state.clock
	}
	if m.Instr != loads.HeatOff {
		p := m.CoilP
		if p == 0 {
			p = m.state.steamP
		}
		if !(p > 0) {
			return Duty{}, fmt.Errorf("the steam pressure at its coil is not known: give coil_p")
		}
		ts, err := waterTsat(p)
		if err != nil {
			return Duty{}, fmt.Errorf("steam at its coil: %w", err)
		}
		st.SteamT = ts
	}
	r, err := m.Tank.Advance(st, amb)
	if err != nil {
		return Duty{}, err
	}
	m.state.pending, m.state.has = r, true
	m.state.instr, m.state.target = m.Instr, st.Target
	if st.Instr == loads.HoldTemp && st.Target == 0 {
		m.state.target = st.T0
	}
	in := map[string]float64{
		"mass_kg": r.Mass, "UA_W_per_K": r.UA, "ambient_T_K": r.AmbientT,
		"start_T_K": r.T0, "end_T_K": r.T1, "coil_J": r.CoilJ, "loss_J": r.LossJ, "stored_J": r.StoredJ,
		"capacity_W": r.Capacity, "period_s": r.Dt,
	}
	if st.SteamT > 0 {
		in["steam_T_K"] = st.SteamT
	}
	return Duty{W: r.Duty, Inputs: in, Warnings: r.Warnings}, nil
}

// statePrepare checks what a stateful tank's consumer may not do, and
// carries the tank through a row with its consumer off (the heating off).
func (m *TankHeating) statePrepare(u *Consumer, c Conditions) error {
	if u.Factor != 0 && u.Factor != 1 {
		return fmt.Errorf("factor %g would scale the steam but not the heat a tank carried from row to row is given; scale its U values instead", u.Factor)
	}
	if !u.Off {
		return nil
	}
	instr := m.Instr
	m.Instr = loads.HeatOff
	_, err := m.stateDuty(c)
	m.Instr = instr
	if err == nil {
		m.state.instr = loads.HeatOff
	}
	return err
}

// row returns the tank's row for the case result, if it has one.
func (m *TankHeating) row(name string) (TankRow, bool) {
	if !m.state.on || !m.state.has {
		return TankRow{}, false
	}
	r := m.state.pending
	tr := TankRow{Name: name, Instruction: m.state.instr.String(), Target: m.state.target, T0: r.T0, T1: r.T1,
		Hours: r.Dt / 3600, Clock: m.state.clock, DutyW: r.Duty, CapacityW: r.Capacity, Binds: r.CapacityBinds,
		Short: r.Short, CoilJ: r.CoilJ, LossJ: r.LossJ, StoredJ: r.StoredJ, Mass: r.Mass, UA: r.UA, AmbientT: r.AmbientT}
	if m.state.instr == loads.ReachBy {
		tr.By = m.By
	}
	if m.state.instr != loads.HeatOff {
		if p := m.CoilP; p > 0 {
			tr.SteamT, _ = waterTsat(p)
		} else if m.state.steamP > 0 {
			tr.SteamT, _ = waterTsat(m.state.steamP)
		}
	}
	return tr, true
}

// commit moves the tank to the end of its present row.
func (m *TankHeating) commit() {
	if !m.state.on || !m.state.has {
		return
	}
	m.state.T = m.state.pending.T1
	m.state.clock += m.state.pending.Dt
	m.state.has = false
}

// tankOf returns the tank heating model of the unit called name.
func (p *Plant) tankOf(name string) (*TankHeating, error) {
	u, ok := p.byName[name]
	if !ok {
		return nil, fmt.Errorf("the plant has no unit %q", name)
	}
	c, ok := u.(*Consumer)
	var m *TankHeating
	if ok {
		m, ok = c.Model.(*TankHeating)
	}
	if !ok {
		return nil, fmt.Errorf("%q is a %s, not a tank_heating unit", name, u.Kind())
	}
	return m, nil
}

// StartTank makes the tank_heating unit called name stateful, its cargo
// at T0 (K): each later case must then be a row with its hours
// (Conditions.Period), its duty follows from the tank's state and the
// row's instruction, and CommitRow carries the state to the next row. A
// stateful tank needs a heating coil (coil_area), whose capacity limits
// what it gives.
func (p *Plant) StartTank(name string, T0 float64) error {
	m, err := p.tankOf(name)
	if err != nil {
		return err
	}
	if !m.Tank.Coil.Given() {
		return fmt.Errorf("tank %q: a tank carried from row to row needs its heating coil: give coil_area (and coil_U)", name)
	}
	if !(T0 >= loads.MinTemperature && T0 <= loads.MaxTemperature) {
		return fmt.Errorf("tank %q: starting temperature %.6g K is not a plausible temperature", name, T0)
	}
	sp, err := p.SupplyPressure(name)
	if err != nil && m.CoilP == 0 {
		return fmt.Errorf("tank %q: %w; give coil_p, the steam pressure at its coil", name, err)
	}
	m.state = tankState{on: true, start: T0, T: T0, steamP: sp}
	return nil
}

// StopTanks ends the state of every stateful tank.
func (p *Plant) StopTanks() {
	for _, c := range p.comps {
		if m, ok := modelOf[*TankHeating](c); ok {
			m.state = tankState{}
		}
	}
}

// Stateful reports whether any unit of the plant carries a state from
// row to row: its rows must be solved in order.
func (p *Plant) Stateful() bool {
	for _, c := range p.comps {
		if m, ok := modelOf[*TankHeating](c); ok && m.state.on {
			return true
		}
	}
	return false
}

// StatefulTanks lists the stateful tanks' names, in the plant's order.
func (p *Plant) StatefulTanks() []string {
	var out []string
	for _, c := range p.comps {
		if m, ok := modelOf[*TankHeating](c); ok && m.state.on {
			out = append(out, c.Ident().Name)
		}
	}
	return out
}

// CommitRow carries every stateful tank to the end of the row last
// solved.
func (p *Plant) CommitRow() {
	for _, c := range p.comps {
		if m, ok := modelOf[*TankHeating](c); ok {
			m.commit()
		}
	}
}

// TankTemperature returns a stateful tank's temperature at the start of
// the next row (K).
func (p *Plant) TankTemperature(name string) (float64, bool) {
	m, err := p.tankOf(name)
	if err != nil || !m.state.on {
		return 0, false
	}
	return m.state.T, true
}

// SupplyPressure returns the set pressure of what feeds the unit called
// name: up its inlet line through headers to the first reducing valve
// (its set pressure) or boiler (its drum pressure). It is what a coil's
// steam is taken at before the plant is solved; the solved pressure at
// the consumer's inlet is the same, less nothing, since headers pass
// their inlet's pressure on.
func (p *Plant) SupplyPressure(name string) (float64, error) {
	seen := map[string]bool{}
	unit := name
	for range 32 {
		if seen[unit] {
			break
		}
		seen[unit] = true
		var from string
		for _, l := range p.lines {
			if l.To == unit && (unit != name || l.ToPort == "in") {
				from = l.From
				break
			}
		}
		switch u := p.byName[from].(type) {
		case *ReducingValve:
			return u.P, nil
		case *Boiler:
			return u.DrumP, nil
		case *ExhaustGasEconomiser:
			return u.DrumP, nil
		case nil:
			return 0, fmt.Errorf("no steam supply found upstream of %q", name)
		}
		unit = from
	}
	return 0, fmt.Errorf("no reducing valve or boiler found upstream of %q", name)
}
