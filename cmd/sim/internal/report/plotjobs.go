package report

import (
	"fmt"
	"image/color"
	"io"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"gonum.org/v1/plot/vg/vgimg"
	"gonum.org/v1/plot/vg/vgsvg"
	"steamcase/plant/profile"
)

// Chart is one chart a run can draw: the chart of its load cases, or the
// chart of one of its jobs.
type Chart struct {
	// Kind is "cases", "voyage", "study", "audit", "audit-implied",
	// "audit-period" or "heating-plan".
	Kind string
	// N numbers the job among the run's jobs of its kind, from 1; it is
	// 0 for the chart of the cases.
	N int
	// Name is the job's name ("" for the cases).
	Name string

	draw func(w io.Writer, format string) error
}

// Draw writes the chart in format (SVG or PNG) to w.
func (c Chart) Draw(w io.Writer, format string) error { return c.draw(w, format) }

// Charts lists the charts of a run, in this order: the load cases (all on
// one chart, by Plot) if there are any, then each voyage (PlotVoyage),
// study (PlotStudy), audit and heating plan (PlotHeatingPlan) in the
// order the scripts ran them; an audit has up to three: its band per day
// (PlotAudit, kind "audit"), its implied factors per day when it solves
// any (PlotAuditImplied, "audit-implied") and the distribution of its
// period total (PlotAuditPeriod, "audit-period").
func Charts(run Run) []Chart {
	var out []Chart
	if len(run.Cases) > 0 {
		cases := run.Cases
		out = append(out, Chart{Kind: "cases", draw: func(w io.Writer, f string) error { return Plot(w, f, cases) }})
	}
	for i, v := range run.Voyages {
		out = append(out, Chart{Kind: "voyage", N: i + 1, Name: v.Name,
			draw: func(w io.Writer, f string) error { return PlotVoyage(w, f, v) }})
	}
	for i, s := range run.Studies {
		out = append(out, Chart{Kind: "study", N: i + 1, Name: s.Name,
			draw: func(w io.Writer, f string) error { return PlotStudy(w, f, s) }})
	}
	for i, a := range run.Audits {
		out = append(out, Chart{Kind: "audit", N: i + 1, Name: a.Name,
			draw: func(w io.Writer, f string) error { return PlotAudit(w, f, a) }})
		if a.Result != nil && len(a.Result.Implied) > 0 {
			out = append(out, Chart{Kind: "audit-implied", N: i + 1, Name: a.Name,
				draw: func(w io.Writer, f string) error { return PlotAuditImplied(w, f, a) }})
		}
		if a.Result != nil && len(a.Result.Period.ReadingT) > 0 {
			out = append(out, Chart{Kind: "audit-period", N: i + 1, Name: a.Name,
				draw: func(w io.Writer, f string) error { return PlotAuditPeriod(w, f, a) }})
		}
	}
	for i, h := range run.HeatingPlans {
		if h.Result == nil {
			continue
		}
		out = append(out, Chart{Kind: "heating-plan", N: i + 1, Name: h.Name,
			draw: func(w io.Writer, f string) error { return PlotHeatingPlan(w, f, h) }})
	}
	return out
}

// Colours of the job charts.
var (
	demandColor  = color.NRGBA{0x2f, 0x5d, 0x8a, 0xff} // deep blue
	totalColor   = color.NRGBA{0x4c, 0xaa, 0xb0, 0xff} // teal
	fuelColor    = color.NRGBA{0xb8, 0x6a, 0x1e, 0xff} // dark amber
	fuelFill     = color.NRGBA{0xf3, 0xd9, 0xb1, 0xff} // pale amber
	bandShade    = color.NRGBA{0xee, 0xee, 0xee, 0xff} // phase bands
	baseColor    = color.NRGBA{0x9a, 0x9a, 0x9a, 0xff} // the study's base
	savedColor   = color.NRGBA{0x5b, 0x9e, 0x6b, 0xff} // green
	lossColor    = color.NRGBA{0xb8, 0x4f, 0x46, 0xff} // brick
	bandColor    = color.NRGBA{0x2f, 0x5d, 0x8a, 0xff}
	medianColor  = color.NRGBA{0x86, 0x6f, 0xb0, 0xff} // violet
	flaggedColor = color.NRGBA{0xc0, 0x1c, 0x1c, 0xff}
)

// newCanvas returns a canvas of the size and format asked for.
func newCanvas(format string, width, height vg.Length) (interface {
	vg.CanvasSizer
	io.WriterTo
}, error) {
	switch format {
	case SVG:
		return vgsvg.New(width, height), nil
	case PNG:
		return vgimg.PngCanvas{Canvas: vgimg.NewWith(vgimg.UseWH(width, height), vgimg.UseDPI(120))}, nil
	}
	return nil, fmt.Errorf("plot: unknown format %q; the formats are svg and png", format)
}

// styleAxes gives a plot the look of the case chart.
func styleAxes(p *plot.Plot) {
	p.Title.Padding = vg.Millimeter * 3
	for _, ax := range []*plot.Axis{&p.X, &p.Y} {
		ax.Color = ink
		ax.Tick.Color = ink
	}
}

// legendEntry is a name and the thumbnails beside it.
type legendEntry struct {
	name  string
	thumb []plot.Thumbnailer
}

// sideLegend builds a legend to stand right of a chart and returns it
// with the width it needs.
func sideLegend(entries []legendEntry) (plot.Legend, vg.Length) {
	legend := plot.NewLegend()
	legend.Top, legend.Left = true, true
	legend.TextStyle.Font.Size = vg.Points(10)
	legend.YOffs = -vg.Millimeter * 8
	w := vg.Length(0)
	for _, e := range entries {
		legend.Add(e.name, e.thumb...)
		w = max(w, legend.TextStyle.Width(e.name))
	}
	return legend, w + legend.ThumbnailWidth + vg.Centimeter
}

// span is a run of consecutive rows of one phase, in hours from the start.
type span struct {
	phase    string
	from, to float64
}

// PlotVoyage draws a voyage plan in format (SVG or PNG) to w, against the
// hours from the start of the voyage, each row a step as long as its
// hours: on the upper panel the steam demand on the oil-fired boilers
// (and the whole steam demand, where exhaust-gas economisers take a share
// of it), the MCR of the boilers firing and the MCR of all boilers, in
// kg/h, with the periods the plant cannot carry marked by a red cross
// and the phases shaded in turn and named; on the lower panel the boiler
// fuel burnt, kg/h. The legend stands to the right.
func PlotVoyage(w io.Writer, format string, v Voyage) error {
	if v.Result == nil || len(v.Result.Rows) == 0 {
		return fmt.Errorf("plot: voyage %q has no rows to draw", v.Name)
	}
	vs := voyageSeriesOf(v.Result.Rows)
	up, entries, err := vs.upperPanel(v)
	if err != nil {
		return err
	}
	down, fuelEntry, err := vs.lowerPanel()
	if err != nil {
		return err
	}
	entries = append(entries, fuelEntry)
	return drawPanels(w, format, up, down, entries, 15*vg.Centimeter, 0.38)
}

// drawPanels writes a chart of two panels on one time axis, 20 cm wide
// and height high on an opaque background, the lower panel taking the
// fraction lower of the height (plot.Align lines up their data areas),
// with the legend of entries to the right.
func drawPanels(w io.Writer, format string, up, down *plot.Plot, entries []legendEntry, height vg.Length, lower float64) error {
	legend, legW := sideLegend(entries)
	plotW := 20 * vg.Centimeter
	canvas, err := newCanvas(format, plotW+legW, height)
	if err != nil {
		return err
	}
	dc := draw.New(canvas)
	opaque(dc)
	area := draw.Crop(dc, 0, -legW, 0, 0)
	cs := plot.Align([][]*plot.Plot{{up}, {down}}, draw.Tiles{Rows: 2, Cols: 1, PadY: vg.Millimeter * 2}, area)
	split := area.Min.Y + (area.Max.Y-area.Min.Y)*vg.Length(lower)
	cs[0][0].Min.Y = split + vg.Millimeter
	cs[1][0].Max.Y = split - vg.Millimeter
	up.Draw(cs[0][0])
	down.Draw(cs[1][0])
	legend.Draw(draw.Crop(dc, plotW+vg.Millimeter*3, 0, 0, 0))
	_, err = canvas.WriteTo(w)
	return err
}

// voyageSeries are the step lines of a voyage's chart, against the hours
// from its start.
type voyageSeries struct {
	boilers, total, capF, capA, fuel plotter.XYs
	short                            plotter.XYs // periods the plant cannot carry
	spans                            []span      // the phases
	hours, top, topFuel              float64
	ege                              bool // economisers take a share of the demand
}

// voyageSeriesOf reads the series off the rows: each row a step as long
// as its hours.
func voyageSeriesOf(rows []profile.RowResult) voyageSeries {
	var s voyageSeries
	t := 0.0
	for _, row := range rows {
		c := &row.Summary
		fired, mcrF, mcrA := c.BoilerSteamKgS, c.FiringMCRKgS, c.MCRKgS
		s.boilers = append(s.boilers, plotter.XY{X: t, Y: fired * kgh})
		s.total = append(s.total, plotter.XY{X: t, Y: c.SteamDemandKgS * kgh})
		s.capF = append(s.capF, plotter.XY{X: t, Y: mcrF * kgh})
		s.capA = append(s.capA, plotter.XY{X: t, Y: mcrA * kgh})
		s.fuel = append(s.fuel, plotter.XY{X: t, Y: c.FuelKgS * kgh})
		if c.EGESteamKgS*kgh > 0.5 {
			s.ege = true
		}
		if !c.CanCarry {
			s.short = append(s.short, plotter.XY{X: t + row.Hours/2, Y: fired * kgh})
		}
		if len(s.spans) == 0 || s.spans[len(s.spans)-1].phase != row.Phase {
			s.spans = append(s.spans, span{phase: row.Phase, from: t})
		}
		t += row.Hours
		s.spans[len(s.spans)-1].to = t
		s.top = max(s.top, fired*kgh, c.SteamDemandKgS*kgh, mcrA*kgh)
		s.topFuel = max(s.topFuel, c.FuelKgS*kgh)
	}
	// The last step ends at the end of the voyage.
	for _, xy := range []*plotter.XYs{&s.boilers, &s.total, &s.capF, &s.capA, &s.fuel} {
		*xy = append(*xy, plotter.XY{X: t, Y: (*xy)[len(*xy)-1].Y})
	}
	s.hours = t
	if !(s.top > 0) {
		s.top = 1
	}
	if !(s.topFuel > 0) {
		s.topFuel = 1
	}
	return s
}

// shadePhases shades every other phase of the voyage on p, up to ymax.
func (s *voyageSeries) shadePhases(p *plot.Plot, ymax float64) error {
	for i, sp := range s.spans {
		if i%2 == 0 {
			continue
		}
		poly, err := plotter.NewPolygon(plotter.XYs{{X: sp.from, Y: 0}, {X: sp.to, Y: 0}, {X: sp.to, Y: ymax}, {X: sp.from, Y: ymax}})
		if err != nil {
			return fmt.Errorf("plot: phase %q: %w", sp.phase, err)
		}
		poly.Color = bandShade
		poly.LineStyle.Width = 0
		p.Add(poly)
	}
	return nil
}

// phaseNames names each phase at the top of the upper panel; names of
// narrow phases alternate between two heights.
func (s *voyageSeries) phaseNames() (*plotter.Labels, error) {
	narrow := false
	for _, sp := range s.spans {
		if sp.to-sp.from < 0.14*s.hours {
			narrow = true
		}
	}
	var names plotter.XYLabels
	for i, sp := range s.spans {
		y := s.top * 1.15
		if narrow && i%2 == 1 {
			y = s.top * 1.07
		}
		names.XYs = append(names.XYs, plotter.XY{X: (sp.from + sp.to) / 2, Y: y})
		names.Labels = append(names.Labels, sp.phase)
	}
	lbl, err := plotter.NewLabels(names)
	if err != nil {
		return nil, fmt.Errorf("plot: phase names: %w", err)
	}
	for i := range lbl.TextStyle {
		lbl.TextStyle[i].XAlign = draw.XCenter
		lbl.TextStyle[i].Font.Size = vg.Points(8.5)
		lbl.TextStyle[i].Color = ink
	}
	return lbl, nil
}

// mcrLines are the step lines of the MCR of all boilers (dashed) and of
// the boilers firing, drawn alike in the voyage's and the heating plan's
// charts.
func mcrLines(all, firing plotter.XYs) (lAll, lFiring *plotter.Line, err error) {
	if lAll, err = stepLine(all, allColor, vg.Points(1.2), vg.Points(5), vg.Points(3)); err != nil {
		return nil, nil, fmt.Errorf("plot: MCR of all boilers: %w", err)
	}
	if lFiring, err = stepLine(firing, firingColor, vg.Points(1.8)); err != nil {
		return nil, nil, fmt.Errorf("plot: MCR of the boilers firing: %w", err)
	}
	return lAll, lFiring, nil
}

// stepLine is a line drawn as steps, each held until the next point.
func stepLine(xys plotter.XYs, c color.Color, width vg.Length, dashes ...vg.Length) (*plotter.Line, error) {
	l, err := plotter.NewLine(xys)
	if err != nil {
		return nil, err
	}
	l.StepStyle = plotter.PostStep
	l.Color = c
	l.Width = width
	l.Dashes = dashes
	return l, nil
}

// upperPanel draws the steam demand against the boilers' capacity, with
// the phases and the periods the plant cannot carry.
func (s *voyageSeries) upperPanel(v Voyage) (*plot.Plot, []legendEntry, error) {
	ymax := s.top * 1.22 // room for the phase names
	up := plot.New()
	up.Title.Text = "Voyage: " + v.Name
	if v.Plant != "" {
		up.Title.Text += " (" + v.Plant + ")"
	}
	up.Y.Label.Text = "steam, kg/h"
	up.X.Min, up.X.Max = 0, s.hours
	up.Y.Min, up.Y.Max = 0, ymax
	up.Y.Tick.Marker = flowTicks{}
	up.X.Tick.Marker = hourTicks{}
	styleAxes(up)
	if err := s.shadePhases(up, ymax); err != nil {
		return nil, nil, err
	}
	up.Add(plotter.NewGrid())
	lbl, err := s.phaseNames()
	if err != nil {
		return nil, nil, err
	}
	var entries []legendEntry
	lAll, lFiring, err := mcrLines(s.capA, s.capF)
	if err != nil {
		return nil, nil, err
	}
	lBoil, err := stepLine(s.boilers, demandColor, vg.Points(2.2))
	if err != nil {
		return nil, nil, fmt.Errorf("plot: steam demand on the boilers: %w", err)
	}
	up.Add(lAll, lFiring)
	entries = append(entries, legendEntry{"MCR of all boilers", []plot.Thumbnailer{lAll}},
		legendEntry{"MCR of the boilers firing", []plot.Thumbnailer{lFiring}})
	if s.ege {
		lTot, err := stepLine(s.total, totalColor, vg.Points(1.2), vg.Points(2), vg.Points(2))
		if err != nil {
			return nil, nil, fmt.Errorf("plot: steam demand: %w", err)
		}
		up.Add(lTot)
		entries = append(entries, legendEntry{"steam demand, economisers included", []plot.Thumbnailer{lTot}})
	}
	up.Add(lBoil)
	entries = append(entries, legendEntry{"steam demand on the oil-fired boilers", []plot.Thumbnailer{lBoil}})
	if len(s.short) > 0 {
		sc, err := plotter.NewScatter(s.short)
		if err != nil {
			return nil, nil, fmt.Errorf("plot: periods the plant cannot carry: %w", err)
		}
		sc.Shape = draw.CrossGlyph{}
		sc.Color = flaggedColor
		sc.Radius = vg.Points(5)
		up.Add(sc)
		entries = append(entries, legendEntry{"period the plant cannot carry", []plot.Thumbnailer{sc}})
	}
	up.Add(lbl)
	return up, entries, nil
}

// lowerPanel draws the boiler fuel burnt.
func (s *voyageSeries) lowerPanel() (*plot.Plot, legendEntry, error) {
	down := plot.New()
	down.X.Label.Text = "time from the start of the voyage, h"
	down.Y.Label.Text = "fuel, kg/h"
	down.X.Min, down.X.Max = 0, s.hours
	down.Y.Min, down.Y.Max = 0, s.topFuel*1.12
	down.Y.Tick.Marker = flowTicks{}
	down.X.Tick.Marker = hourTicks{}
	styleAxes(down)
	if err := s.shadePhases(down, down.Y.Max); err != nil {
		return nil, legendEntry{}, err
	}
	down.Add(plotter.NewGrid())
	lFuel, err := stepLine(s.fuel, fuelColor, vg.Points(1.6))
	if err != nil {
		return nil, legendEntry{}, fmt.Errorf("plot: fuel: %w", err)
	}
	lFuel.FillColor = fuelFill
	down.Add(lFuel)
	return down, legendEntry{"boiler fuel burnt (lower panel)", []plot.Thumbnailer{lFuel}}, nil
}

// hourTicks marks an axis of hours at a step a watch-keeper reads: 1, 2,
// 3, 6 or 12 h, a day, or whole days and weeks, giving at most 14 marks.
type hourTicks struct{}

func (hourTicks) Ticks(lo, hi float64) []plot.Tick {
	if !(hi > lo) {
		return []plot.Tick{{Value: lo, Label: fix(lo, 0)}}
	}
	steps := [...]float64{1, 2, 3, 6, 12, 24, 48, 72, 168, 336, 720, 1464, 2190, 4380, 8760}
	step := steps[len(steps)-1]
	for _, s := range steps {
		if (hi-lo)/s <= 14 {
			step = s
			break
		}
	}
	var ticks []plot.Tick
	for v := math.Ceil(lo/step) * step; v <= hi+step*1e-9; v += step {
		ticks = append(ticks, plot.Tick{Value: v, Label: fix(v, 0)})
	}
	return ticks
}

// decimalTicks marks an axis at a round step (1, 2 or 5 times a power of
// ten) giving five to ten marks, labelled with the decimals the step needs.
type decimalTicks struct{}

func (decimalTicks) Ticks(lo, hi float64) []plot.Tick {
	if !(hi > lo) {
		return []plot.Tick{{Value: lo, Label: fix(lo, 0)}}
	}
	step := roundStep(lo, hi)
	dec := max(0, int(-math.Floor(math.Log10(step)+1e-9)))
	var ticks []plot.Tick
	for k := math.Ceil(lo/step - 1e-9); k*step <= hi+step*1e-9; k++ {
		ticks = append(ticks, plot.Tick{Value: k * step, Label: fix(k*step, dec)})
	}
	return ticks
}

// hoursPerYear is the year the study's savings are scaled to.
const hoursPerYear = profile.HoursPerYear

// PlotStudy draws a study in format (SVG or PNG) to w: a bar for each
// variant, in the order given, of the boiler fuel it saves against the
// first, in t/yr (the profile's savings scaled to 8760 h when its hours
// are not a year), green for a saving and brick for a loss, each bar
// labelled with its figure and, when the study has money figures, its
// payback. A study with a sweep of size has two panels more below: the
// NPV of each size against the first variant, and the steam dumped, in
// t/yr, against the size, with the size of highest NPV marked on both.
func PlotStudy(w io.Writer, format string, s Study) error {
	r := s.Result
	if r == nil || len(r.Variants) == 0 || !(r.Hours > 0) {
		return fmt.Errorf("plot: study %q has no variants to draw", s.Name)
	}
	p, width, height, err := studyBars(s)
	if err != nil {
		return err
	}
	if r.Sweep == nil || len(r.Sweep.Points) == 0 {
		canvas, err := newCanvas(format, width, height)
		if err != nil {
			return err
		}
		dc := draw.New(canvas)
		opaque(dc)
		p.Draw(dc)
		_, err = canvas.WriteTo(w)
		return err
	}
	npv, dumped, err := sweepPanels(r)
	if err != nil {
		return err
	}
	width = max(width, 20*vg.Centimeter)
	sweepH := 16 * vg.Centimeter
	canvas, err := newCanvas(format, width, height+sweepH)
	if err != nil {
		return err
	}
	dc := draw.New(canvas)
	opaque(dc)
	p.Draw(draw.Crop(dc, 0, 0, sweepH, 0))
	area := draw.Crop(dc, 0, 0, 0, -height-vg.Centimeter)
	cs := plot.Align([][]*plot.Plot{{npv}, {dumped}}, draw.Tiles{Rows: 2, Cols: 1, PadY: vg.Millimeter * 2}, area)
	npv.Draw(cs[0][0])
	dumped.Draw(cs[1][0])
	_, err = canvas.WriteTo(w)
	return err
}

// studyBars is the bar chart of a study's variants, with the size it
// wants.
func studyBars(s Study) (*plot.Plot, vg.Length, vg.Length, error) {
	r := s.Result
	perYear := hoursPerYear / r.Hours
	p := plot.New()
	p.Title.Text = "Study: " + s.Name
	if s.Plant != "" {
		p.Title.Text += " (" + s.Plant + ")"
	}
	p.Y.Label.Text = fmt.Sprintf("boiler fuel saved against %q, t/yr", r.Variants[0].Name)
	if math.Abs(r.Hours-hoursPerYear) > 1e-6 {
		p.Y.Label.Text += fmt.Sprintf(" (%s h scaled)", fix(r.Hours, 0))
	}
	names := make([]string, len(r.Variants))
	longest := 0
	for i, v := range r.Variants {
		names[i] = v.Name
		longest = max(longest, len(v.Name))
	}
	p.NominalX(names...)
	if len(names) > 3 || longest > 14 {
		p.X.Tick.Label.Rotation = math.Pi / 8
		p.X.Tick.Label.XAlign = draw.XRight
		p.X.Tick.Label.YAlign = draw.YTop
	}
	p.Add(plotter.NewGrid())
	barW := vg.Points(math.Max(16, math.Min(60, 420/float64(len(names)))))
	var lo, hi float64
	var labels plotter.XYLabels
	for i, v := range r.Variants {
		y := v.FuelSavedT * perYear
		bc, err := plotter.NewBarChart(plotter.Values{y}, barW)
		if err != nil {
			return nil, 0, 0, fmt.Errorf("plot: variant %q: %w", v.Name, err)
		}
		bc.XMin = float64(i)
		switch {
		case i == 0:
			bc.Color = baseColor
		case y < 0:
			bc.Color = lossColor
		default:
			bc.Color = savedColor
		}
		bc.LineStyle.Width = 0
		p.Add(bc)
		lo, hi = min(lo, y), max(hi, y)
		text := fix(y, 0) + " t/yr"
		if i == 0 {
			text = "base"
		} else if v.HasPayback && !math.IsInf(v.PaybackYears, 0) {
			text += "\npayback " + fix(v.PaybackYears, 1) + " yr"
		}
		labels.XYs = append(labels.XYs, plotter.XY{X: float64(i), Y: max(y, 0)})
		labels.Labels = append(labels.Labels, text)
	}
	if !(hi > lo) {
		hi = lo + 1
	}
	pad := (hi - lo) * 0.04
	for i := range labels.XYs {
		labels.XYs[i].Y += pad
	}
	lbl, err := plotter.NewLabels(labels)
	if err != nil {
		return nil, 0, 0, fmt.Errorf("plot: labels: %w", err)
	}
	for i := range lbl.TextStyle {
		lbl.TextStyle[i].XAlign = draw.XCenter
		lbl.TextStyle[i].Font.Size = vg.Points(9)
		lbl.TextStyle[i].Color = ink
	}
	p.Add(lbl)
	p.X.Min, p.X.Max = -0.6, float64(len(names))-0.4
	p.Y.Min = min(0, lo*1.1)
	p.Y.Max = hi + (hi-lo)*0.22
	p.Y.Tick.Marker = flowTicks{}
	styleAxes(p)

	width := vg.Length(math.Max(14, math.Min(36, 3.2*float64(len(names))+6))) * vg.Centimeter
	height := 11 * vg.Centimeter
	if p.X.Tick.Label.Rotation != 0 {
		l := vg.Length(0)
		for _, n := range names {
			l = max(l, p.X.Tick.Label.Width(n))
		}
		height += l * vg.Length(math.Sin(p.X.Tick.Label.Rotation))
	}
	return p, width, height, nil
}

// sweepPanels are the two panels of a study's sweep: the NPV of each
// size (thousands of the currency) and the steam dumped (t/yr), against
// the size, the best size ringed and marked by a dashed line on both.
func sweepPanels(r *profile.StudyResult) (*plot.Plot, *plot.Plot, error) {
	sw := r.Sweep
	perYear := hoursPerYear / r.Hours
	xUnit, xScale := "K", 1.0
	what := "design pinch"
	if sw.Param == "ua" {
		xUnit, xScale, what = "kW/K", 1e-3, "UA"
	}
	npvXY := make(plotter.XYs, len(sw.Points))
	dumpXY := make(plotter.XYs, len(sw.Points))
	for k, pt := range sw.Points {
		x := pt.Value * xScale
		npvXY[k] = plotter.XY{X: x, Y: pt.NPV / 1e3}
		dumpXY[k] = plotter.XY{X: x, Y: pt.DumpedT * perYear}
	}
	cur := r.Currency
	if cur == "" {
		cur = "currency"
	}
	mk := func(title, ylabel string, xy plotter.XYs, c color.Color) (*plot.Plot, error) {
		p := plot.New()
		p.Title.Text = title
		p.Y.Label.Text = ylabel
		p.X.Label.Text = fmt.Sprintf("%s of %s, %s", what, sw.Unit, xUnit)
		p.Add(plotter.NewGrid())
		l, pts, err := plotter.NewLinePoints(xy)
		if err != nil {
			return nil, err
		}
		l.Color, l.Width = c, vg.Points(1.5)
		pts.Color, pts.Shape, pts.Radius = c, draw.CircleGlyph{}, vg.Points(2.5)
		p.Add(l, pts)
		lo, hi := xy[0].Y, xy[0].Y
		for _, q := range xy {
			lo, hi = min(lo, q.Y), max(hi, q.Y)
		}
		lo, hi = min(lo, 0), max(hi, 0)
		if !(hi > lo) {
			hi = lo + 1
		}
		p.Y.Min, p.Y.Max = lo-(hi-lo)*0.05, hi+(hi-lo)*0.15
		p.Y.Tick.Marker = decimalTicks{}
		p.X.Tick.Marker = decimalTicks{}
		if sw.Best >= 0 {
			bx := xy[sw.Best].X
			vl, err := plotter.NewLine(plotter.XYs{{X: bx, Y: p.Y.Min}, {X: bx, Y: p.Y.Max}})
			if err != nil {
				return nil, err
			}
			vl.Color, vl.Dashes, vl.Width = savedColor, []vg.Length{vg.Points(4), vg.Points(3)}, vg.Points(1)
			ring, err := plotter.NewScatter(plotter.XYs{xy[sw.Best]})
			if err != nil {
				return nil, err
			}
			ring.Shape, ring.Color, ring.Radius = draw.RingGlyph{}, savedColor, vg.Points(6)
			p.Add(vl, ring)
		}
		styleAxes(p)
		return p, nil
	}
	npv, err := mk(fmt.Sprintf("NPV against %q over %d years at %s %%", r.Variants[0].Name, r.LifeYears, fix(100*r.DiscountRate, 1)),
		"NPV, thousand "+cur, npvXY, demandColor)
	if err != nil {
		return nil, nil, fmt.Errorf("plot: sweep: %w", err)
	}
	if sw.Best >= 0 {
		b := sw.Points[sw.Best]
		lbl, err := plotter.NewLabels(plotter.XYLabels{XYs: []plotter.XY{npvXY[sw.Best]},
			Labels: []string{fmt.Sprintf("  best: %s, NPV %s %s", sizeText(sw.Param, b.Value), fix(b.NPV, 0), r.Currency)}})
		if err != nil {
			return nil, nil, fmt.Errorf("plot: sweep: %w", err)
		}
		lbl.TextStyle[0].Font.Size = vg.Points(9)
		lbl.TextStyle[0].Color = ink
		lbl.TextStyle[0].YAlign = draw.YBottom
		if sw.Best > len(sw.Points)/2 {
			lbl.TextStyle[0].XAlign = draw.XRight
			lbl.Labels[0] = fmt.Sprintf("best: %s, NPV %s %s  ", sizeText(sw.Param, b.Value), fix(b.NPV/1e3, 0)+" thousand", r.Currency)
		}
		npv.Add(lbl)
	}
	dumped, err := mk("Steam dumped", "steam dumped, t/yr", dumpXY, lossColor)
	if err != nil {
		return nil, nil, fmt.Errorf("plot: sweep: %w", err)
	}
	return npv, dumped, nil
}
