package loads

import (
	"fmt"
	"math"
)

// DutyPoint is one row of an accommodation heating table: the duty (W) at
// an outside air temperature AirT (K).
type DutyPoint struct {
	AirT, Duty float64
}

// Accommodation is the accommodation (and other space) heating against the
// outside air temperature, in one of two forms:
//
//   - by transmission: Q = UA·(InsideT − T_air) while T_air < BalanceT, and
//     zero at and above BalanceT (the outside temperature above which the
//     internal gains carry the space; the duty jumps to zero there). [CP,
//     textbook steady transmission loss; UA includes ventilation if the
//     user puts it in.]
//   - by table: Table gives the duty at several air temperatures, as a
//     yard's heat-balance sheet does; between rows the duty is interpolated
//     linearly. Outside the table it is extrapolated linearly from the end
//     segment, never below zero, with a warning.
//
// When Table has rows it is used and UA, InsideT and BalanceT are ignored.
type Accommodation struct {
	// Name identifies the consumer.
	Name string
	// UA is the overall heat-loss coefficient of the spaces (W/K).
	UA float64
	// InsideT is the temperature held inside (K).
	InsideT float64
	// BalanceT is the outside temperature at and above which no heating is
	// needed (K). Zero means InsideT.
	BalanceT float64
	// Table rows, with AirT strictly increasing and Duty ≥ 0; at least two.
	// The slice is only read.
	Table []DutyPoint
}

// AccommodationResult is the heating duty and the inputs that drove it.
type AccommodationResult struct {
	Name string
	// Duty (W).
	Duty float64
	// AirT is the outside air temperature (K).
	AirT float64
	// FromTable is true when the table was used.
	FromTable bool
	// UA, InsideT, BalanceT echo the transmission form's inputs.
	UA, InsideT, BalanceT float64
	// Warnings lists cautions (outside the table).
	Warnings []string
}

// Duty returns the heating duty at outside air temperature airT (K).
func (a Accommodation) Duty(airT float64) (AccommodationResult, error) {
	c := checker{KindAccommodation, a.Name}
	r := AccommodationResult{Name: a.Name, AirT: airT}
	if err := c.temp("outside air temperature", airT); err != nil {
		return r, err
	}
	if len(a.Table) > 0 {
		return a.fromTable(c, r)
	}
	if err := c.nonNegative("UA", a.UA, "W/K"); err != nil {
		return r, err
	}
	if err := c.temp("inside temperature", a.InsideT); err != nil {
		return r, err
	}
	bal := a.BalanceT
	if bal == 0 {
		bal = a.InsideT
	}
	if err := c.temp("balance temperature", bal); err != nil {
		return r, err
	}
	if bal > a.InsideT {
		return r, c.errf("balance temperature %.6g °C is above the inside temperature %.6g °C; want balance ≤ inside",
			celsius(bal), celsius(a.InsideT))
	}
	r.UA, r.InsideT, r.BalanceT = a.UA, a.InsideT, bal
	if airT < bal {
		r.Duty = a.UA * (a.InsideT - airT)
	}
	if !finite(r.Duty) {
		return AccommodationResult{Name: a.Name}, c.overflow("duty")
	}
	return r, nil
}

func (a Accommodation) fromTable(c checker, r AccommodationResult) (AccommodationResult, error) {
	tb := a.Table
	if len(tb) < 2 {
		return r, c.errf("table has %d row; want at least two (air temperature, duty)", len(tb))
	}
	for i, p := range tb {
		if !(p.AirT >= MinTemperature && p.AirT <= MaxTemperature) {
			return r, c.temp(fmt.Sprintf("table row %d air temperature", i+1), p.AirT)
		}
		if !(p.Duty >= 0) || math.IsInf(p.Duty, 0) {
			return r, c.errf("table row %d: duty %.6g W is negative or not finite; want a duty ≥ 0 W", i+1, p.Duty)
		}
		if i > 0 && !(p.AirT > tb[i-1].AirT) {
			return r, c.errf("table row %d: air temperature %.6g °C does not follow %.6g °C; want strictly increasing temperatures",
				i+1, celsius(p.AirT), celsius(tb[i-1].AirT))
		}
	}
	r.FromTable = true
	x := r.AirT
	i := 1
	for i < len(tb)-1 && x > tb[i].AirT {
		i++
	}
	p0, p1 := tb[i-1], tb[i]
	q := p0.Duty + (p1.Duty-p0.Duty)*(x-p0.AirT)/(p1.AirT-p0.AirT)
	if x < tb[0].AirT || x > tb[len(tb)-1].AirT {
		r.Warnings = append(r.Warnings, fmt.Sprintf(
			"air %.4g °C is outside the table (%.4g…%.4g °C): duty extrapolated linearly from the end rows",
			celsius(x), celsius(tb[0].AirT), celsius(tb[len(tb)-1].AirT)))
		if q < 0 {
			r.Warnings = append(r.Warnings, fmt.Sprintf("extrapolated duty %.4g kW is negative; taken as zero", q/1e3))
			q = 0
		}
	}
	if !finite(q) {
		return AccommodationResult{Name: a.Name}, c.overflow("duty")
	}
	r.Duty = q
	return r, nil
}
