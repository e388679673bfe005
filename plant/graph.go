package plant

import (
	"fmt"
	"sort"
	"strings"
)

// Pos is where an object of the plant was declared: a script file and line,
// or empty when the plant was built in Go.
type Pos struct {
	File string
	Line int
}

// String formats the position as file:line, or "" when unknown.
func (p Pos) String() string {
	if p.File == "" {
		return ""
	}
	if p.Line <= 0 {
		return p.File
	}
	return fmt.Sprintf("%s:%d", p.File, p.Line)
}

// Medium is what a line carries.
type Medium int

// The media a line can carry. Gas lines (burner flue gas, engine exhaust)
// belong to the combustion side of the plant.
const (
	WaterSteam Medium = iota
	Gas
)

func (m Medium) String() string {
	switch m {
	case WaterSteam:
		return "water/steam"
	case Gas:
		return "gas"
	}
	return fmt.Sprintf("Medium(%d)", int(m))
}

// Direction says whether a port takes flow in or sends it out.
type Direction int

// Port directions.
const (
	In Direction = iota
	Out
)

func (d Direction) String() string {
	if d == In {
		return "inlet"
	}
	return "outlet"
}

// PortSpec describes one port of a unit kind.
type PortSpec struct {
	Name     string
	Dir      Direction
	Medium   Medium
	Multi    bool // takes any number of lines (a header's outlets)
	Optional bool // may stay unconnected
}

// Line joins an outlet port of one unit to an inlet port of another. A water
// or steam line carries three unknowns: mass flow, pressure and specific
// enthalpy.
type Line struct {
	Name     string
	Pos      Pos
	From, To string // unit names
	FromPort string
	ToPort   string

	medium Medium
	idx    int // index of the mass flow in the unknown vector; p at idx+1, h at idx+2
	sat    satMemo
	// tm is the temperature of the line's last single-phase state (p, h)
	// reported: a steam line of dry saturated steam from a drum at its set
	// pressure has the same state case after case.
	tm memo
}

// Index of the line's unknowns in the plant's unknown vector.
func (l *Line) mIdx() int { return l.idx }
func (l *Line) pIdx() int { return l.idx + 1 }
func (l *Line) hIdx() int { return l.idx + 2 }

// GraphError lists every fault found in a plant's graph, each naming the
// unit and line concerned and, where known, the script position.
type GraphError struct {
	Faults []Fault
}

// Fault is one problem found while checking a plant.
type Fault struct {
	Pos  Pos
	Unit string
	Line string
	Msg  string
}

func (f Fault) String() string {
	var b strings.Builder
	if s := f.Pos.String(); s != "" {
		b.WriteString(s)
		b.WriteString(": ")
	}
	switch {
	case f.Unit != "" && f.Line != "":
		fmt.Fprintf(&b, "unit %q, line %q: ", f.Unit, f.Line)
	case f.Unit != "":
		fmt.Fprintf(&b, "unit %q: ", f.Unit)
	case f.Line != "":
		fmt.Fprintf(&b, "line %q: ", f.Line)
	}
	b.WriteString(f.Msg)
	return b.String()
}

func (e *GraphError) Error() string {
	if len(e.Faults) == 1 {
		return "plant: " + e.Faults[0].String()
	}
	var b strings.Builder
	fmt.Fprintf(&b, "plant: %d faults:", len(e.Faults))
	for _, f := range e.Faults {
		b.WriteString("\n  ")
		b.WriteString(f.String())
	}
	return b.String()
}

// faults collects Faults; its Err is nil when none were added.
type faults []Fault

func (fs *faults) add(pos Pos, unit, line, format string, args ...any) {
	*fs = append(*fs, Fault{Pos: pos, Unit: unit, Line: line, Msg: fmt.Sprintf(format, args...)})
}

func (fs faults) err() error {
	if len(fs) == 0 {
		return nil
	}
	out := make([]Fault, len(fs))
	copy(out, fs)
	sort.SliceStable(out, func(i, j int) bool {
		if out[i].Pos.File != out[j].Pos.File {
			return out[i].Pos.File < out[j].Pos.File
		}
		return out[i].Pos.Line < out[j].Pos.Line
	})
	return &GraphError{Faults: out}
}
