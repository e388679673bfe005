package report

import (
	"fmt"
	"image/color"
	"io"
	"strconv"
	"strings"
	"text/tabwriter"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"steamcase/plant/heatplan"
	"steamcase/plant/schema"
)

// HeatingPlan is a least-fuel cargo heating plan of a voyage
// (heating_plan()).
type HeatingPlan struct {
	Job
	Result *heatplan.Result
}

// The names of the heating plan's CSV tables.
const (
	TablePlanSummary  = "heating plan summary"
	TablePlanRequired = "heating plan required"
	TablePlanRows     = "heating plan rows"
)

var planSummaryHeader = [...]string{tableColumn, "plan", "variant", "fuel_t", "co2_t", "curve_fuel_t", "saving_t", "short_rows", "missed"}

var planRequiredHeader = [...]string{tableColumn, "plan", "tank", "T_C", "at", "source", "reached_T_C", "met", "latest_start_h", "verdict"}

var planRowsHeader = [...]string{
	tableColumn, "plan", "row", "source", "phase", "start_h", "hours", "tank", "instruction", "T_C", "by_h",
	"start_T_C", "end_T_C", "duty_kW", "coil_binds", "boilers_firing", "boiler_steam_kg_h", "fuel_t",
}

// writeHeatingPlan writes a heating plan for people: the three plans'
// fuel and CO2 with the saving, each tank's required temperatures with
// the latest start of heat-up (and the verdict of a miss), each tank's
// instructions with the rows of equal instruction run together, the rows
// where a limit binds, the warnings, and the plan's caution.
func writeHeatingPlan(w io.Writer, h HeatingPlan) {
	fmt.Fprint(w, h.head("Heating plan"))
	r := h.Result
	n := len(r.Rows)
	hours := 0.0
	for _, row := range r.Rows {
		hours += row.Hours
	}
	method := "one programme over the tanks' joint state"
	if len(r.Tanks) == 1 {
		method = "one programme over the tank's temperature"
	}
	if r.Method == "descent" {
		method = fmt.Sprintf("coordinate descent, %d sweeps", r.Sweeps)
	}
	fmt.Fprintf(w, "  %d periods, %s h; grid %s K; %s; fuel curves from %d plant solves\n\n", n, fix(hours, 1), fix(r.Grid, 2), method, r.Solves)
	tw := tabwriter.NewWriter(w, 0, 8, 2, ' ', 0)
	fmt.Fprintf(tw, "    plan\t%10s\t%10s\t%12s\t%10s\t\n", "fuel t", "CO2 t", "saving t", "meets all")
	for _, o := range []struct {
		name string
		o    heatplan.Outcome
	}{{"least fuel", r.Plan}, {"hold the required T from the start", r.Hold}, {"heat at the last moment", r.LastMoment}} {
		saving := "-"
		if o.name != "least fuel" {
			saving = fix(r.SavingT(o.o), 3)
		}
		meets := "yes"
		if len(o.o.Missed) > 0 {
			meets = "no"
		}
		if len(o.o.ShortRows) > 0 {
			meets += ", boilers short"
		}
		fmt.Fprintf(tw, "    %s\t%10s\t%10s\t%12s\t%10s\t\n", o.name, fix(o.o.FuelT, 3), fix(o.o.CO2T, 3), saving, meets)
	}
	tw.Flush()
	fmt.Fprintf(w, "  (the least-fuel plan by the rows' fuel curves: %s t; the figures above are the plant solved row by row)\n", fix(r.Plan.TableFuelT, 3))

	for _, t := range r.Tanks {
		fmt.Fprintf(w, "\n  %s: from %s °C", t.Unit, fix(t.StartT-273.15, 1))
		if t.NeverBelow > 0 {
			fmt.Fprintf(w, ", never below %s °C", fix(t.NeverBelow-273.15, 1))
		}
		fmt.Fprintln(w)
		for _, q := range t.Required {
			status := "met"
			if !q.Met {
				status = "MISSED"
			}
			start := "none meets it"
			if q.LatestStartRow >= 0 {
				start = fmt.Sprintf("%s h (%s)", fix(q.LatestStartH, 1), h.rowRef(q.LatestStartRow))
			}
			fmt.Fprintf(w, "    required %s °C at %s: %s, %s °C; latest start of heat-up %s\n",
				fix(q.T-273.15, 1), q.Label, status, fix(q.Reached-273.15, 2), start)
			if q.Verdict != "" {
				fmt.Fprintf(w, "      %s\n", q.Verdict)
			}
		}
		for _, run := range instructionRuns(t.Rows) {
			rows := "row " + strconv.Itoa(run.from+1)
			if run.to > run.from {
				rows = fmt.Sprintf("rows %d-%d", run.from+1, run.to+1)
			}
			fmt.Fprintf(w, "    %-12s %-30s %s -> %s °C, mean %s kW\n", rows, run.what,
				fix(t.Rows[run.from].T0-273.15, 2), fix(t.Rows[run.to].T1-273.15, 2), fix(run.meanKW, 0))
		}
	}
	coil, boilers, floor := 0, 0, 0
	for _, b := range r.Binding {
		switch b.What {
		case "coil":
			coil++
		case "boilers":
			boilers++
		default:
			floor++
		}
	}
	fmt.Fprintf(w, "\n  limits binding: the coil's capacity in %d tank-periods, the boilers' capacity in %d periods, a never-below temperature in %d tank-periods\n",
		coil, boilers, floor)
	var rows []int
	for _, b := range r.Binding {
		if b.What == "boilers" {
			rows = append(rows, b.Row)
		}
	}
	if len(rows) > 0 {
		fmt.Fprintf(w, "  periods where the boilers' capacity binds: %s\n", rowList(h.Job, rows))
	}
	fmt.Fprintf(w, "  periods the boilers cannot carry under the plan: %s\n", rowList(h.Job, r.Plan.ShortRows))
	for _, s := range r.Warnings {
		fmt.Fprintf(w, "  warning: %s\n", oneLine(s))
	}
	fmt.Fprintf(w, "  %s\n", schema.PlanCaution)
}

// instructionRun is consecutive rows of one tank with the same
// instruction (and temperature).
type instructionRun struct {
	from, to int
	what     string
	meanKW   float64
}

// instructionRuns runs together the rows of equal instruction: off; hold
// and reach (a constant duty) together as "heat at a set duty"; heat_to
// (the coil at its capacity).
func instructionRuns(rows []heatplan.TankRowPlan) []instructionRun {
	var out []instructionRun
	var energy, hours float64
	label := func(tr heatplan.TankRowPlan) string {
		switch tr.Instruction {
		case "off":
			return "off"
		case "heat_to":
			return "heat at the coil's capacity"
		}
		return "heat at a set duty"
	}
	for i, tr := range rows {
		l := label(tr)
		if len(out) == 0 || out[len(out)-1].what != l {
			if len(out) > 0 {
				out[len(out)-1].meanKW = energy / hours
			}
			out = append(out, instructionRun{from: i, to: i, what: l})
			energy, hours = 0, 0
		}
		out[len(out)-1].to = i
		energy += tr.DutyW / 1e3
		hours++
	}
	if len(out) > 0 {
		out[len(out)-1].meanKW = energy / hours
	}
	return out
}

// writeHeatingPlanCSV writes the heating plans' three tables.
func writeHeatingPlanCSV(run Run, begin func([]string, bool), write func([]string)) {
	if !hasRows(run.HeatingPlans, func(h HeatingPlan) bool { return h.Result != nil }) {
		return
	}
	begin(planSummaryHeader[:], false)
	for _, h := range run.HeatingPlans {
		r := h.Result
		if r == nil {
			continue
		}
		for _, o := range []struct {
			name string
			o    heatplan.Outcome
		}{{"least fuel", r.Plan}, {"hold", r.Hold}, {"last moment", r.LastMoment}} {
			saving := ""
			if o.name != "least fuel" {
				saving = fix(r.SavingT(o.o), csvTonnesDec)
			}
			rec := [...]string{TablePlanSummary, h.Name, o.name, fix(o.o.FuelT, csvTonnesDec), fix(o.o.CO2T, csvTonnesDec),
				fix(o.o.TableFuelT, csvTonnesDec), saving, strconv.Itoa(len(o.o.ShortRows)), strconv.Itoa(len(o.o.Missed))}
			write(rec[:])
		}
	}
	begin(planRequiredHeader[:], false)
	for _, h := range run.HeatingPlans {
		if h.Result == nil {
			continue
		}
		for _, t := range h.Result.Tanks {
			for _, q := range t.Required {
				start := ""
				if q.LatestStartRow >= 0 {
					start = fix(q.LatestStartH, csvHoursDec)
				}
				rec := [...]string{TablePlanRequired, h.Name, t.Unit, fix(q.T-273.15, 1), q.Label, q.Pos.String(),
					fix(q.Reached-273.15, 2), strconv.FormatBool(q.Met), start, q.Verdict}
				write(rec[:])
			}
		}
	}
	begin(planRowsHeader[:], false)
	for _, h := range run.HeatingPlans {
		r := h.Result
		if r == nil {
			continue
		}
		for i, row := range r.Rows {
			boilers, steam, fuel := "", "", ""
			if v := r.Plan.Voyage; v != nil && i < len(v.Rows) && v.Rows[i].Summary.Solved {
				c := &v.Rows[i].Summary
				boilers, steam, fuel = strconv.Itoa(c.BoilersFiring), flow(c.BoilerSteamKgS), fix(schema.Tonnes(c.FuelKgS, row.Hours), csvTonnesDec)
			}
			for _, t := range r.Tanks {
				tr := t.Rows[i]
				T, by := "", ""
				if tr.T > 0 {
					T = fix(tr.T-273.15, 2)
				}
				if tr.ByS > 0 {
					by = fix(tr.ByS/3600, csvHoursDec)
				}
				rec := [...]string{TablePlanRows, h.Name, strconv.Itoa(i + 1), source(h.Job, i), row.Phase,
					fix(row.StartH, csvHoursDec), fix(row.Hours, csvHoursDec), t.Unit, tr.Instruction, T, by,
					fix(tr.T0-273.15, 2), fix(tr.T1-273.15, 2), fix(tr.DutyW/1e3, 1), strconv.FormatBool(tr.CoilBinds),
					boilers, steam, fuel}
				write(rec[:])
			}
		}
	}
}

// Colours of the tanks on the heating plan's chart, in turn.
var tankColors = []color.Color{
	color.NRGBA{0x2f, 0x5d, 0x8a, 0xff}, // deep blue
	color.NRGBA{0xb8, 0x6a, 0x1e, 0xff}, // dark amber
	color.NRGBA{0x5b, 0x9e, 0x6b, 0xff}, // green
	color.NRGBA{0x86, 0x6f, 0xb0, 0xff}, // violet
	color.NRGBA{0xb8, 0x4f, 0x46, 0xff}, // brick
	color.NRGBA{0x4c, 0xaa, 0xb0, 0xff}, // teal
}

// PlotHeatingPlan draws a heating plan in format (SVG or PNG) to w,
// against the hours from the start of the voyage: on the upper panel each
// tank's temperature under the plan, °C, with its required temperatures
// marked in black (a dashed line over the phase or a cross at the time
// they hold) and its never-below temperature dotted in its colour; on the lower panel, on the same
// time axis, the steam the plan asks of the oil-fired boilers against the
// MCR of the boilers firing and of all boilers, kg/h. The phases are
// shaded in turn on both; the legend stands to the right.
func PlotHeatingPlan(w io.Writer, format string, h HeatingPlan) error {
	r := h.Result
	if r == nil || len(r.Rows) == 0 || r.Plan.Voyage == nil || len(r.Plan.Voyage.Rows) == 0 {
		return fmt.Errorf("plot: heating plan %q has no rows to draw", h.Name)
	}
	vs := voyageSeriesOf(r.Plan.Voyage.Rows)
	up, entries, err := heatingPlanTemperatures(h, &vs, nil)
	if err != nil {
		return err
	}
	down, entries, err := heatingPlanSteam(&vs, entries)
	if err != nil {
		return err
	}

	return drawPanels(w, format, up, down, entries, 16*vg.Centimeter, 0.4)
}

// heatingPlanTemperatures is the upper panel of a heating plan: each
// tank's temperature under the plan, its required temperatures and its
// never-below temperature, over the phases shaded, between a little
// below and above the temperatures drawn. It appends the panel's entries
// of the legend to entries.
func heatingPlanTemperatures(h HeatingPlan, vs *voyageSeries, entries []legendEntry) (*plot.Plot, []legendEntry, error) {
	r := h.Result
	up := plot.New()
	up.Title.Text = "Heating plan: " + h.Name
	if h.Plant != "" {
		up.Title.Text += " (" + h.Plant + ")"
	}
	up.Y.Label.Text = "cargo temperature, °C"
	up.X.Min, up.X.Max = 0, vs.hours
	up.X.Tick.Marker = hourTicks{}
	styleAxes(up)
	lo, hi := 1e9, -1e9
	for _, t := range r.Tanks {
		for _, tr := range t.Rows {
			lo, hi = min(lo, tr.T0, tr.T1), max(hi, tr.T0, tr.T1)
		}
		for _, q := range t.Required {
			hi = max(hi, q.T)
		}
		if t.NeverBelow > 0 {
			lo = min(lo, t.NeverBelow)
		}
	}
	lo, hi = lo-273.15-1, hi-273.15+1.5
	up.Y.Min, up.Y.Max = lo, hi
	if err := vs.shadePhasesFrom(up, lo, hi); err != nil {
		return nil, nil, err
	}
	up.Add(plotter.NewGrid())
	var marks []plot.Plotter // the required temperatures, drawn over the tanks
	for k, t := range r.Tanks {
		c := tankColors[k%len(tankColors)]
		xys := plotter.XYs{{X: 0, Y: t.StartT - 273.15}}
		at := 0.0
		for i, tr := range t.Rows {
			at += r.Rows[i].Hours
			xys = append(xys, plotter.XY{X: at, Y: tr.T1 - 273.15})
		}
		l, err := plotter.NewLine(xys)
		if err != nil {
			return nil, nil, fmt.Errorf("plot: %s: %w", t.Unit, err)
		}
		l.Color, l.Width = c, vg.Points(2)
		up.Add(l)
		entries = append(entries, legendEntry{t.Unit, []plot.Thumbnailer{l}})
		for _, q := range t.Required {
			m, err := requiredMark(q, r.Rows, t.Unit)
			if err != nil {
				return nil, nil, err
			}
			marks = append(marks, m)
		}
		if t.NeverBelow > 0 {
			fl, err := plotter.NewLine(plotter.XYs{{X: 0, Y: t.NeverBelow - 273.15}, {X: vs.hours, Y: t.NeverBelow - 273.15}})
			if err != nil {
				return nil, nil, fmt.Errorf("plot: %s never below: %w", t.Unit, err)
			}
			fl.Color, fl.Width, fl.Dashes = c, vg.Points(0.8), []vg.Length{vg.Points(1), vg.Points(2)}
			up.Add(fl)
		}
	}
	up.Add(marks...)
	dashed, err := plotter.NewLine(plotter.XYs{{X: 0, Y: 0}, {X: 1, Y: 0}})
	if err != nil {
		return nil, nil, err
	}
	dashed.Color, dashed.Width, dashed.Dashes = ink, vg.Points(1.4), []vg.Length{vg.Points(5), vg.Points(3)}
	dotted, err := plotter.NewLine(plotter.XYs{{X: 0, Y: 0}, {X: 1, Y: 0}})
	if err != nil {
		return nil, nil, err
	}
	dotted.Color, dotted.Width, dotted.Dashes = ink, vg.Points(0.8), []vg.Length{vg.Points(1), vg.Points(2)}
	entries = append(entries, legendEntry{"required temperature", []plot.Thumbnailer{dashed}},
		legendEntry{"never below", []plot.Thumbnailer{dotted}})
	return up, entries, nil
}

// requiredMark marks a required temperature of tank unit in black: a
// dashed line over the rows of its phase, or a cross at its time.
func requiredMark(q heatplan.RequiredResult, rows []heatplan.RowPlan, unit string) (plot.Plotter, error) {
	from, to := q.At/3600, q.At/3600
	if q.Phase != "" {
		from, to = -1.0, -1.0
		for _, row := range rows {
			if row.Phase == q.Phase {
				if from < 0 {
					from = row.StartH
				}
				to = row.StartH + row.Hours
			}
		}
	}
	y := q.T - 273.15
	if to > from {
		req, err := plotter.NewLine(plotter.XYs{{X: from, Y: y}, {X: to, Y: y}})
		if err != nil {
			return nil, fmt.Errorf("plot: %s required: %w", unit, err)
		}
		req.Color, req.Width, req.Dashes = ink, vg.Points(1.4), []vg.Length{vg.Points(5), vg.Points(3)}
		return req, nil
	}
	sc, err := plotter.NewScatter(plotter.XYs{{X: from, Y: y}})
	if err != nil {
		return nil, fmt.Errorf("plot: %s required: %w", unit, err)
	}
	sc.Shape, sc.Color, sc.Radius = draw.CrossGlyph{}, ink, vg.Points(5)
	return sc, nil
}

// heatingPlanSteam is the lower panel of a heating plan: the steam the
// plan asks of the oil-fired boilers against the MCR of the boilers
// firing and of all boilers, over the phases shaded. It appends the
// panel's entries of the legend to entries.
func heatingPlanSteam(vs *voyageSeries, entries []legendEntry) (*plot.Plot, []legendEntry, error) {
	down := plot.New()
	down.X.Label.Text = "time from the start of the voyage, h"
	down.Y.Label.Text = "steam, kg/h"
	down.X.Min, down.X.Max = 0, vs.hours
	down.Y.Min, down.Y.Max = 0, vs.top*1.1
	down.Y.Tick.Marker = flowTicks{}
	down.X.Tick.Marker = hourTicks{}
	styleAxes(down)
	if err := vs.shadePhases(down, down.Y.Max); err != nil {
		return nil, nil, err
	}
	down.Add(plotter.NewGrid())
	lAll, lFiring, err := mcrLines(vs.capA, vs.capF)
	if err != nil {
		return nil, nil, err
	}
	lBoil, err := stepLine(vs.boilers, demandColor, vg.Points(2))
	if err != nil {
		return nil, nil, fmt.Errorf("plot: boiler steam: %w", err)
	}
	lBoil.FillColor = color.NRGBA{0xd5, 0xe1, 0xee, 0xff}
	down.Add(lBoil, lAll, lFiring)
	entries = append(entries, legendEntry{"boiler steam under the plan (lower panel)", []plot.Thumbnailer{lBoil}},
		legendEntry{"MCR of the boilers firing", []plot.Thumbnailer{lFiring}},
		legendEntry{"MCR of all boilers", []plot.Thumbnailer{lAll}})
	return down, entries, nil
}

// shadePhasesFrom shades every other phase of the voyage on p between
// ymin and ymax.
func (s *voyageSeries) shadePhasesFrom(p *plot.Plot, ymin, ymax float64) error {
	for i, sp := range s.spans {
		if i%2 == 0 {
			continue
		}
		poly, err := plotter.NewPolygon(plotter.XYs{{X: sp.from, Y: ymin}, {X: sp.to, Y: ymin}, {X: sp.to, Y: ymax}, {X: sp.from, Y: ymax}})
		if err != nil {
			return fmt.Errorf("plot: phase %q: %w", sp.phase, err)
		}
		poly.Color = bandShade
		poly.LineStyle.Width = 0
		p.Add(poly)
	}
	return nil
}

// writeVoyageTanks writes, for a voyage with stateful tanks, each tank's
// temperature at the start and the end, its lowest and highest, and the
// periods where its coil's capacity bound or its instruction fell short.
func writeVoyageTanks(w io.Writer, v Voyage) {
	rows := v.Result.Rows
	if len(rows) == 0 || len(rows[0].Summary.Tanks) == 0 {
		return
	}
	fmt.Fprintf(w, "  tanks carried from row to row:\n")
	for k, t0 := range rows[0].Summary.Tanks {
		lo, hi := t0.T0, t0.T0
		var binds, short []int
		end := t0.T0
		for i, row := range rows {
			if k >= len(row.Summary.Tanks) {
				continue
			}
			tr := row.Summary.Tanks[k]
			lo, hi, end = min(lo, tr.T1), max(hi, tr.T1), tr.T1
			if tr.Binds {
				binds = append(binds, i)
			}
			if tr.Short {
				short = append(short, i)
			}
		}
		fmt.Fprintf(w, "    %s: %s °C at the start, %s °C at the end (lowest %s °C, highest %s °C); coil at its capacity in %d periods; short of its instruction in %s\n",
			t0.Name, fix(t0.T0-273.15, 2), fix(end-273.15, 2), fix(lo-273.15, 2), fix(hi-273.15, 2), len(binds),
			strings.TrimSpace(rowList(v.Job, short)))
	}
}
