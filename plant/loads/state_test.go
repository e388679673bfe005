package loads

import (
	"math"
	"strings"
	"testing"

	"steamcase/plant/fuel"
)

// lumpedTank is docs/reference/plant-checks.md §6's cool-down check tank: m 10 000 t,
// c 2.0 kJ/(kg·K), ΣUA 50 kW/K, its surroundings at 20 °C [C].
func lumpedTank() *TankHeating {
	return &TankHeating{Name: "lumped", Cargo: Cargo{Density: 1000, Cp: 2000}, CargoVolume: 10000,
		Boundaries: []Boundary{{Name: "all", Area: 1, U: 50e3, Beyond: Space, T: 293.15}},
		Coil:       Coil{Area: 1000, U: 60}}
}

// hsfoTank is a tank of HSFO with Cragoe's c, losses to sea and air and
// a steam coil (invented figures).
func hsfoTank(t *testing.T) *TankHeating {
	t.Helper()
	f, err := fuel.Grade("HSFO")
	if err != nil {
		t.Fatal(err)
	}
	cg, err := CargoFromFuel(f)
	if err != nil {
		t.Fatal(err)
	}
	return &TankHeating{Name: "COT 3", Cargo: cg, CargoVolume: 12000,
		Boundaries: []Boundary{
			{Name: "deck", Area: 1500, U: 4.5, Beyond: Air},
			{Name: "shell", Area: 3000, U: 3.5, Beyond: Sea},
		},
		Coil: Coil{Area: 900, U: 60}}
}

const tsat7 = 170.48 + 273.15 // saturation at 7 bar(g), docs/reference/plant-checks.md §0 [C]

func relErr(got, want float64) float64 { return math.Abs(got-want) / math.Max(math.Abs(want), 1e-300) }

// TestAdvanceClosedForm checks one period against the closed-form
// exponential of docs/reference/plant-checks.md §6 (T(t) = T∞ + (T0 − T∞)·exp(−t/τ),
// τ = m·c/K) with a constant c, to 1e-6 relative: the cool-down check
// (60 °C, 3 days → 40.92 °C [C]), a constant duty, and the steam coil at
// its capacity (K = ΣUA + U·A_coil, T∞ their weighted mean).
func TestAdvanceClosedForm(t *testing.T) {
	t.Parallel()
	tank := lumpedTank()
	m, c, ua, ta := 1e7, 2000.0, 50e3, 293.15
	uac := 60.0 * 1000
	T0 := 333.15
	cases := []struct {
		name   string
		st     Step
		K, Teq float64
	}{
		{"cool-down 3 days", Step{T0: T0, Dt: 72 * 3600, Instr: HeatOff}, ua, ta},
		{"reach by the end", Step{T0: T0, Dt: 72 * 3600, Instr: HeatOff}, ua, ta},
		{"full coil", Step{T0: 303.15, Dt: 48 * 3600, Instr: HeatTo, Target: 400, SteamT: tsat7}, ua + uac, (ua*ta + uac*tsat7) / (ua + uac)},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			r, err := tank.Advance(tc.st, Ambient{})
			if err != nil {
				t.Fatal(err)
			}
			tau := m * c / tc.K
			want := tc.Teq + (tc.st.T0-tc.Teq)*math.Exp(-tc.st.Dt/tau)
			if e := relErr(r.T1, want); e > 1e-6 {
				t.Errorf("T1 %.9g K, closed form %.9g K (%.1e relative)", r.T1, want, e)
			}
		})
	}
	// docs/reference/plant-checks.md §6 check value: 40.92 °C after 3 days [C].
	r, _ := tank.Advance(cases[0].st, Ambient{})
	if math.Abs(r.T1-273.15-40.92) > 0.005 {
		t.Errorf("cool-down after 3 days %.4f °C, docs/reference/plant-checks.md §6 40.92 °C", r.T1-273.15)
	}
	// A constant duty of 1.2 MW: T∞ = T_amb + Q/ΣUA, docs/reference/plant-checks.md §6.
	q := 1.2e6
	dt := 30 * 3600.0
	T1 := tank.relaxConst(t, T0, q, dt)
	want := ta + q/ua + (T0-ta-q/ua)*math.Exp(-dt/(m*c/ua))
	if e := relErr(T1, want); e > 1e-6 {
		t.Errorf("constant duty: T1 %.9g, closed form %.9g (%.1e)", T1, want, e)
	}
}

// relaxConst runs a period at the constant duty q through ReachBy: the
// duty DutyToReach finds for the closed form's end point must give it
// back.
func (tank *TankHeating) relaxConst(t *testing.T, T0, q, dt float64) float64 {
	t.Helper()
	ta, ua, m, c := 293.15, 50e3, 1e7, 2000.0
	want := ta + q/ua + (T0-ta-q/ua)*math.Exp(-dt/(m*c/ua))
	got, err := tank.DutyToReach(T0, want, dt, Ambient{})
	if err != nil {
		t.Fatal(err)
	}
	if e := relErr(got, q); e > 1e-6 {
		t.Errorf("DutyToReach %.9g W, the duty of the closed form %.9g W (%.1e)", got, q, e)
	}
	r, err := tank.Advance(Step{T0: T0, Dt: dt, Instr: ReachBy, Target: want, Deadline: dt, SteamT: tsat7}, Ambient{})
	if err != nil {
		t.Fatal(err)
	}
	if e := relErr(r.Duty, q); e > 1e-6 {
		t.Errorf("ReachBy duty %.9g W, want %.9g W", r.Duty, q)
	}
	return r.T1
}

// rk4 integrates m·c(T)·dT/dt = Q(T) − ΣUA·(T − T_amb) with the classical
// fourth-order Runge–Kutta method in n steps, and the coil heat and the
// losses by the same stages: an independent check of the closed forms
// (Cragoe's c from package fuel, docs/reference/plant-checks.md §5.3).
func rk4(t *testing.T, tank *TankHeating, amb Ambient, T0, dt float64, q func(T float64) float64, n int) (T1, coil, loss float64) {
	t.Helper()
	ua, uaT := tank.ua(amb)
	ta := uaT / ua
	m := tank.CargoVolume * tank.Cargo.Density
	f := func(T float64) (dT, qc, ql float64) {
		c, err := tank.Cargo.cp(T)
		if err != nil {
			t.Fatal(err)
		}
		qc, ql = q(T), ua*(T-ta)
		return (qc - ql) / (m * c), qc, ql
	}
	h := dt / float64(n)
	T := T0
	for range n {
		k1, q1, l1 := f(T)
		k2, q2, l2 := f(T + h/2*k1)
		k3, q3, l3 := f(T + h/2*k2)
		k4, q4, l4 := f(T + h*k3)
		T += h / 6 * (k1 + 2*k2 + 2*k3 + k4)
		coil += h / 6 * (q1 + 2*q2 + 2*q3 + q4)
		loss += h / 6 * (l1 + 2*l2 + 2*l3 + l4)
	}
	return T, coil, loss
}

// TestAdvanceAgainstRungeKutta checks the exact integration with Cragoe's
// c (linear in T) against a fine Runge–Kutta integration of the same
// lumped model, to 1e-6 relative in temperature, coil heat and losses,
// and checks each period's energy balance CoilJ − LossJ = StoredJ (m·∫c dT
// by Cragoe's closed form, docs/reference/plant-checks.md §5.3) to 1e-9.
func TestAdvanceAgainstRungeKutta(t *testing.T) {
	t.Parallel()
	tank := hsfoTank(t)
	amb := Ambient{Sea: 278.15, Air: 268.15}
	uac := tank.Coil.UA()
	cases := []struct {
		name string
		st   Step
		q    func(T float64) float64
	}{
		{"off", Step{T0: 330.15, Dt: 36 * 3600, Instr: HeatOff}, func(float64) float64 { return 0 }},
		{"full coil", Step{T0: 313.15, Dt: 30 * 3600, Instr: HeatTo, Target: 400, SteamT: tsat7},
			func(T float64) float64 { return uac * (tsat7 - T) }},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			r, err := tank.Advance(tc.st, amb)
			if err != nil {
				t.Fatal(err)
			}
			T1, coil, loss := rk4(t, tank, amb, tc.st.T0, tc.st.Dt, tc.q, 4000)
			if e := relErr(r.T1, T1); e > 1e-6 {
				t.Errorf("T1 %.9g K, Runge-Kutta %.9g K (%.1e)", r.T1, T1, e)
			}
			if coil != 0 {
				if e := relErr(r.CoilJ, coil); e > 1e-6 {
					t.Errorf("coil heat %.9g J, Runge-Kutta %.9g J (%.1e)", r.CoilJ, coil, e)
				}
			}
			if e := relErr(r.LossJ, loss); e > 1e-6 {
				t.Errorf("losses %.9g J, Runge-Kutta %.9g J (%.1e)", r.LossJ, loss, e)
			}
			h, err := fuel.CragoeHeat(tank.Cargo.sg(), r.T0, r.T1)
			if err != nil {
				t.Fatal(err)
			}
			stored := r.Mass * h
			if e := math.Abs(r.CoilJ-r.LossJ-stored) / math.Max(math.Abs(stored), r.CoilJ); e > 1e-9 {
				t.Errorf("coil − losses %.9g J, stored %.9g J (%.1e)", r.CoilJ-r.LossJ, stored, e)
			}
		})
	}
}

// TestAdvanceSplitsExactly checks that a period gives the same end
// temperature and heat whether taken whole or as 24 periods of an hour
// (the integration is exact, not a step): for each instruction, to 1e-9.
func TestAdvanceSplitsExactly(t *testing.T) {
	t.Parallel()
	tank := hsfoTank(t)
	amb := Ambient{Sea: 280.15, Air: 270.15}
	for _, st := range []Step{
		{T0: 320.15, Instr: HeatOff},
		{T0: 310.15, Instr: HeatTo, Target: 330.15, SteamT: tsat7},
		{T0: 310.15, Instr: HoldTemp, Target: 312.15, SteamT: tsat7},
		{T0: 320.15, Instr: HoldTemp, SteamT: tsat7},
	} {
		t.Run(st.Instr.String(), func(t *testing.T) {
			whole := st
			whole.Dt = 24 * 3600
			r, err := tank.Advance(whole, amb)
			if err != nil {
				t.Fatal(err)
			}
			T, coil := st.T0, 0.0
			for range 24 {
				s := st
				s.T0, s.Dt = T, 3600
				if st.Instr == HoldTemp && st.Target == 0 {
					s.Target = st.T0
				}
				x, err := tank.Advance(s, amb)
				if err != nil {
					t.Fatal(err)
				}
				T, coil = x.T1, coil+x.CoilJ
			}
			if e := relErr(T, r.T1); e > 1e-9 {
				t.Errorf("24 × 1 h end at %.12g K, one period %.12g K", T, r.T1)
			}
			if e := math.Abs(coil-r.CoilJ) / math.Max(r.CoilJ, 1); e > 1e-9 {
				t.Errorf("24 × 1 h coil heat %.12g J, one period %.12g J", coil, r.CoilJ)
			}
		})
	}
}

// TestReachByAndCap checks ReachBy: a deadline within reach ends on the
// target at the deadline; one out of reach heats at the coil's capacity,
// is marked short and warns.
func TestReachByAndCap(t *testing.T) {
	t.Parallel()
	tank := hsfoTank(t)
	amb := Ambient{Sea: 280.15, Air: 270.15}
	r, err := tank.Advance(Step{T0: 318.15, Dt: 24 * 3600, Instr: ReachBy, Target: 321.15, Deadline: 72 * 3600, SteamT: tsat7}, amb)
	if err != nil {
		t.Fatal(err)
	}
	if r.CapacityBinds || r.Short || len(r.Warnings) != 0 {
		t.Errorf("reach within the coil's capacity: binds %v short %v warnings %q", r.CapacityBinds, r.Short, r.Warnings)
	}
	// Carry on for the next two days: at the deadline the cargo is at 48 °C.
	T := r.T1
	for d := 1; d < 3; d++ {
		x, err := tank.Advance(Step{T0: T, Dt: 24 * 3600, Instr: ReachBy, Target: 321.15, Deadline: float64(3-d) * 24 * 3600, SteamT: tsat7}, amb)
		if err != nil {
			t.Fatal(err)
		}
		T = x.T1
	}
	if math.Abs(T-321.15) > 1e-6 {
		t.Errorf("at the deadline %.9g K, want 321.15 K", T)
	}
	far, err := tank.Advance(Step{T0: 300.15, Dt: 24 * 3600, Instr: ReachBy, Target: 340.15, Deadline: 24 * 3600, SteamT: tsat7}, amb)
	if err != nil {
		t.Fatal(err)
	}
	if !far.CapacityBinds || !far.Short || far.T1 >= 340.15 {
		t.Errorf("reach out of range: binds %v short %v T1 %.4g", far.CapacityBinds, far.Short, far.T1-273.15)
	}
	if !strings.Contains(strings.Join(far.Warnings, "\n"), "cannot bring the cargo to 67 °C") {
		t.Errorf("warnings %q", far.Warnings)
	}
	if !strings.Contains(strings.Join(far.Warnings, "\n"), "K per day") {
		t.Errorf("a 40 K heat-up in a day gives no rate warning: %q", far.Warnings)
	}
}

// TestCoilLMTD checks the coil capacity by the LMTD formula worked by hand
// (Incropera and DeWitt, Fundamentals of Heat and Mass Transfer, ch. 11,
// eq. 11.15 and 11.35a): a deck heater of 60 m² at U 250 W/(m²·K), HSFO
// circulated at 200 m³/h from a tank at 40 °C, steam at 170.48 °C.
func TestCoilLMTD(t *testing.T) {
	t.Parallel()
	tank := hsfoTank(t)
	tank.Coil = Coil{Kind: DeckHeater, Area: 60, U: 250, Circulation: 200.0 / 3600}
	T := 313.15
	d, err := tank.CoilCapacity(T, tsat7)
	if err != nil {
		t.Fatal(err)
	}
	// By hand: c(40 °C) = (1.685 + 0.00339·40)/√(985/999.016) kJ/(kg·K)
	// (Cragoe, docs/reference/plant-checks.md §5.3); ṁ = 985·200/3600 kg/s.
	c := (1.685 + 0.00339*40) / math.Sqrt(985/999.016) * 1e3
	mc := 985 * 200.0 / 3600 * c
	ntu := 250 * 60 / mc
	tout := 40 + (170.48-40)*(1-math.Exp(-ntu))
	lmtd := ((170.48 - 40) - (170.48 - tout)) / math.Log((170.48-40)/(170.48-tout))
	if e := relErr(d.LMTD, lmtd); e > 1e-9 {
		t.Errorf("LMTD %.9g K, by hand %.9g K", d.LMTD, lmtd)
	}
	if e := relErr(d.Q, 250*60*lmtd); e > 1e-9 {
		t.Errorf("Q %.9g W, U·A·LMTD by hand %.9g W", d.Q, 250*60*lmtd)
	}
	if e := relErr(d.OutletT-273.15, tout); e > 1e-9 {
		t.Errorf("outlet %.9g °C, by hand %.9g °C", d.OutletT-273.15, tout)
	}
	// A coil in the tank: LMTD = Ts − T, Q = U·A·(Ts − T) with the default
	// U of 60 W/(m²·K) (docs/reference/plant-checks.md §6 coil row [M], chosen).
	tank.Coil = Coil{Area: 900}
	d, err = tank.CoilCapacity(T, tsat7)
	if err != nil {
		t.Fatal(err)
	}
	if want := 60 * 900 * (170.48 - 40); relErr(d.Q, want) > 1e-9 || relErr(d.LMTD, 130.48) > 1e-9 {
		t.Errorf("coil in the tank: Q %.6g W LMTD %.6g K, want %.6g W and 130.48 K", d.Q, d.LMTD, want)
	}
}

// TestFlashPointAssumed checks the SOLAS caution's text when the flash
// point is the grade's ISO 8217 minimum (60 °C, SpecFlashPoint, from
// memory of ISO 8217:2017 Tables 1 and 2).
func TestFlashPointAssumed(t *testing.T) {
	t.Parallel()
	tank := hsfoTank(t)
	f, _ := fuel.Grade("HSFO")
	fp, ok := SpecFlashPoint(f)
	if !ok || fp != 333.15 {
		t.Fatalf("HSFO flash point %v %v, want 60 °C", fp, ok)
	}
	lng, _ := fuel.Grade("LNG")
	if _, ok := SpecFlashPoint(lng); ok {
		t.Error("LNG has a flash point by specification")
	}
	tank.FlashPoint, tank.FlashPointAssumed = fp, true
	r, err := tank.Advance(Step{T0: 326.15, Dt: 3600, Instr: HoldTemp, SteamT: tsat7}, Ambient{Sea: 280, Air: 275})
	if err != nil {
		t.Fatal(err)
	}
	w := strings.Join(r.Warnings, "\n")
	if !strings.Contains(w, "SOLAS II-2 reg. 4.2") || !strings.Contains(w, "60 °C assumed, the ISO 8217 minimum") {
		t.Errorf("warnings %q", r.Warnings)
	}
}

// TestAdvanceErrors checks the refusals.
func TestAdvanceErrors(t *testing.T) {
	t.Parallel()
	tank := hsfoTank(t)
	amb := Ambient{Sea: 280, Air: 275}
	noCoil := *tank
	noCoil.Coil = Coil{}
	for _, tc := range []struct {
		name string
		tank *TankHeating
		st   Step
		want string
	}{
		{"no coil", &noCoil, Step{T0: 310, Dt: 3600, Instr: HeatTo, Target: 320, SteamT: tsat7}, "needs the tank's heating coil"},
		{"no steam", tank, Step{T0: 310, Dt: 3600, Instr: HeatTo, Target: 320}, "steam temperature at the coil is not given"},
		{"no target", tank, Step{T0: 310, Dt: 3600, Instr: ReachBy, SteamT: tsat7}, "instruction's temperature is not given"},
		{"no period", tank, Step{T0: 310, Instr: HeatOff}, "period 0 s must be positive"},
		{"unknown", tank, Step{T0: 310, Dt: 1, Instr: 9}, "instruction 9 is unknown"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, err := tc.tank.Advance(tc.st, amb)
			if err == nil || !strings.Contains(err.Error(), tc.want) || !strings.Contains(err.Error(), `tank heating "COT 3"`) {
				t.Errorf("error %v, want %q", err, tc.want)
			}
		})
	}
}

// TestPeriodMatchesAdvance checks that a planner's Period gives what
// Advance gives: the same end temperature with the heating off and at
// full coil (to the last bit, so that a plan replayed as instructions
// ends where it was planned), and the constant duty of a reach.
func TestPeriodMatchesAdvance(t *testing.T) {
	t.Parallel()
	for _, kind := range []CoilKind{SteamCoil, DeckHeater} {
		tank := hsfoTank(t)
		if kind == DeckHeater {
			tank.Coil = Coil{Kind: DeckHeater, Area: 60, U: 250, Circulation: 200.0 / 3600}
		}
		amb := Ambient{Sea: 279.15, Air: 271.15}
		dt := 6 * 3600.0
		p, err := tank.Period(dt, amb, tsat7)
		if err != nil {
			t.Fatal(err)
		}
		for _, T0 := range []float64{300.15, 315.4, 331.9} {
			off, err := tank.Advance(Step{T0: T0, Dt: dt, Instr: HeatOff}, amb)
			if err != nil {
				t.Fatal(err)
			}
			if got := p.Off(T0); got != off.T1 {
				t.Errorf("%v: Off(%g) %.17g, Advance %.17g", kind, T0, got, off.T1)
			}
			T1, duty := p.Full(T0)
			full, err := tank.Advance(Step{T0: T0, Dt: dt, Instr: HeatTo, Target: T1, SteamT: tsat7}, amb)
			if err != nil {
				t.Fatal(err)
			}
			if full.T1 != T1 || full.Short || relErr(full.Duty, duty) > 1e-12 {
				t.Errorf("%v: Full(%g) %.17g K %.9g W, Advance heat_to it %.17g K %.9g W short %v", kind, T0, T1, duty, full.T1, full.Duty, full.Short)
			}
			mid := 0.5 * (off.T1 + T1)
			q := p.Duty(T0, mid)
			reach, err := tank.Advance(Step{T0: T0, Dt: dt, Instr: ReachBy, Target: mid, Deadline: dt, SteamT: tsat7}, amb)
			if err != nil {
				t.Fatal(err)
			}
			if relErr(reach.Duty, q) > 1e-9 || math.Abs(reach.T1-mid) > 1e-9 {
				t.Errorf("%v: Duty(%g → %g) %.9g W, Advance reach %.9g W to %.9g K", kind, T0, mid, q, reach.Duty, reach.T1)
			}
		}
	}
}

// TestDutyCappedByCoil checks that a plain heat-up (not a stateful tank)
// that asks more than its coil gives is capped at the coil's capacity
// U·A·(Ts − T) at the heat-up's mean temperature, and warned: 20 K in
// 12 h of 12 000 m³ (heat exchanger textbooks, e.g. Incropera
// ch. 11, for the capacity of a coil in a well-mixed tank).
func TestDutyCappedByCoil(t *testing.T) {
	t.Parallel()
	tank := hsfoTank(t)
	tank.Mode, tank.From, tank.To, tank.Duration = HeatUp, 303.15, 323.15, 12*3600
	tank.SteamT = tsat7
	r, err := tank.Duty(Ambient{Sea: 280.15, Air: 273.15})
	if err != nil {
		t.Fatal(err)
	}
	want := 60 * 900 * (tsat7 - 313.15) // the default U, 900 m², at the mean 40 °C
	if !r.Capped || relErr(r.Duty, want) > 1e-12 || relErr(r.Capacity, want) > 1e-12 {
		t.Errorf("duty %.6g W capped %v, want the coil's %.6g W", r.Duty, r.Capped, want)
	}
	if w := strings.Join(r.Warnings, "\n"); !strings.Contains(w, "the coil gives at most") || !strings.Contains(w, "heat-up takes longer") {
		t.Errorf("warnings %q", r.Warnings)
	}
	tank.Duration = 30 * 86400 // slow enough for the coil
	r, err = tank.Duty(Ambient{Sea: 280.15, Air: 273.15})
	if err != nil || r.Capped {
		t.Errorf("a 30-day heat-up capped: %+v %v", r, err)
	}
}
