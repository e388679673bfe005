package profile

import (
	"context"
	"fmt"

	"steamcase/plant"
)

// TankStart makes a tank_heating unit of the plant stateful for a run:
// its cargo starts at T (K) and is carried from row to row
// (plant.Plant.StartTank). Pos is where it was given.
type TankStart struct {
	Unit string
	T    float64
	Pos  plant.Pos
}

// stateKeys are the keys of a tank_heating that only a stateful tank
// takes.
var stateKeys = map[string]bool{"instruction": true, "by": true}

// checkStateSettings refuses a row's instruction for a tank that is not
// stateful in the run, and a reach's time past the profile's end, naming
// the row's position.
func checkStateSettings(rows []Row, tanks []TankStart, job string) error {
	on := map[string]bool{}
	for _, t := range tanks {
		on[t.Unit] = true
	}
	var hours float64
	for _, r := range rows {
		hours += r.Hours
	}
	for i, r := range rows {
		for _, s := range r.Case.Set {
			if !stateKeys[s.Param] {
				continue
			}
			pos := s.Pos
			if pos.File == "" {
				pos = r.Case.Pos
			}
			if !on[s.Unit] {
				if job != "voyage" {
					return Errorf(pos, "%s row %d sets %s.%s: a tank's instruction belongs to a voyage, which carries the tank from row to row; a %s solves each row on its own", job, i+1, s.Unit, s.Param, job)
				}
				return Errorf(pos, "%s row %d sets %s.%s, but %q is not carried from row to row in this %s: give tanks = { [%q] = \"40 C\" } with its starting temperature", job, i+1, s.Unit, s.Param, s.Unit, job, s.Unit)
			}
			if s.Param == "by" && s.Value > hours*3600*(1+1e-12) {
				return Errorf(pos, "%s row %d: %s.by %.6g h is past the end of the %s at %.6g h", job, i+1, s.Unit, s.Value/3600, job, hours)
			}
		}
	}
	return nil
}

// startTanks makes the tanks stateful on pl.
func startTanks(pl *plant.Plant, tanks []TankStart) error {
	seen := map[string]bool{}
	for _, t := range tanks {
		at := t.Pos
		if seen[t.Unit] {
			return Errorf(at, "tank %q is given twice", t.Unit)
		}
		seen[t.Unit] = true
		if err := pl.StartTank(t.Unit, t.T); err != nil {
			return Errorf(at, "%w", err)
		}
	}
	return nil
}

// runStateful solves the rows in order on pl with the tanks stateful,
// each row warm-started from the one before and its tanks carried to the
// next. It leaves pl's tanks as they were (not stateful). Each row keeps
// its summary, and its case result if keep.
func runStateful(ctx context.Context, pl *plant.Plant, rows []Row, tanks []TankStart, progress func(done int), texts *Texts, keep bool) ([]RowResult, error) {
	defer pl.StopTanks()
	defer summaryOnly(pl, keep)()
	if err := startTanks(pl, tanks); err != nil {
		return nil, err
	}
	pl.ColdStart()
	res := make([]RowResult, len(rows))
	for i, r := range rows {
		c := r.Case
		c.Conditions.Period = r.Hours * 3600
		cr, err := pl.Solve(ctx, c)
		if err != nil {
			return nil, fmt.Errorf("profile row %d (%s, %q): %w", i+1, r.Phase, r.Case.Name, err)
		}
		pl.CommitRow()
		res[i] = rowResult(i, r, cr, texts, keep)
		if progress != nil && (i%16 == 15 || i == len(rows)-1) {
			progress(i + 1)
		}
	}
	return res, nil
}

// PosError is an error in the input of a profile at a position of the
// script or its CSV file (a row, a setting, a tank given): Pos and the
// message without it. Error gives "file:line: message".
type PosError struct {
	Pos plant.Pos
	Err error
}

func (e *PosError) Error() string {
	if s := e.Pos.String(); s != "" {
		return s + ": " + e.Err.Error()
	}
	return e.Err.Error()
}

func (e *PosError) Unwrap() error { return e.Err }

// Errorf returns a *PosError at pos.
func Errorf(pos plant.Pos, format string, v ...any) error {
	return &PosError{Pos: pos, Err: fmt.Errorf(format, v...)}
}
