package report

import (
	"bytes"
	"fmt"
	"io"
	"math"
	"sort"
	"strconv"
	"strings"
	"text/tabwriter"

	"steamcase/plant"
)

// Caution is the safety note every rendering carries, on one line.
const Caution = "Caution: planning and audit estimate only; the makers' manuals, class and flag rules and licensed practice govern, and local codes come first."

// Case is one solved load case of a run: the result and the name of the
// plant it was solved on. The script position is Result.Pos.
type Case struct {
	Plant  string
	Result *plant.CaseResult
}

// Header kinds and figure keys read from plant.ComponentResult.
const (
	kindHeader   = "steam header"
	kindFeedTank = "feed tank"
	kindDump     = "dump condenser"
	keyDrained   = "drained_kg_s"
	keyTankSteam = "heating_steam_kg_s"
	kgh          = 3600.0 // kg/s to kg/h
)

// Table writes the run as a text table for people: one block per load
// case, then one per voyage, study and audit, and the caution at the end.
func Table(w io.Writer, run Run) error {
	ew := &errWriter{w: w}
	if run.empty() {
		fmt.Fprintln(ew, "Nothing was solved: the scripts ran no load case, voyage, study, audit or heating plan.")
	}
	var b bytes.Buffer
	block := func(write func(io.Writer)) {
		if b.Len() > 0 {
			fmt.Fprintln(ew)
		}
		b.Reset()
		write(&b)
		writeTrimmed(ew, b.Bytes())
	}
	for i := 0; i < len(run.Cases); {
		c := run.Cases[i]
		if n := seriesLen(run.Cases[i:]); n > 1 {
			block(func(w io.Writer) { writeSeries(w, i+1, len(run.Cases), run.Cases[i:i+n]) })
			i += n
			continue
		}
		block(func(w io.Writer) { writeCase(w, i+1, len(run.Cases), c) })
		i++
	}
	for _, v := range run.Voyages {
		block(func(w io.Writer) { writeVoyage(w, v) })
	}
	for _, s := range run.Studies {
		block(func(w io.Writer) { writeStudy(w, s) })
	}
	for _, a := range run.Audits {
		block(func(w io.Writer) { writeAudit(w, a) })
	}
	for _, h := range run.HeatingPlans {
		if h.Result != nil {
			block(func(w io.Writer) { writeHeatingPlan(w, h) })
		}
	}
	if !run.empty() || len(run.Files) > 0 {
		block(func(w io.Writer) { writeRecord(w, run) })
	}
	fmt.Fprintf(ew, "\n%s\n", Caution)
	return ew.err
}

// writeCase writes load case n of total: its head, the steam balance,
// the boilers, what limits the plant, the totals and the warnings.
func writeCase(w io.Writer, n, total int, c Case) {
	r := c.Result
	writeCaseHead(w, n, total, c)
	writeSteamBalance(w, r)
	writeBoilers(w, r)
	writeCapacity(w, r)
	writeCaseTotals(w, r)
	if len(r.Warnings) == 0 {
		fmt.Fprintf(w, "  warnings: none\n")
		return
	}
	fmt.Fprintf(w, "  warnings (%d):\n", len(r.Warnings))
	for _, s := range r.Warnings {
		fmt.Fprintf(w, "    - %s\n", oneLine(s))
	}
}

// writeCaseHead writes the case's name, plant, conditions and whether
// its solution converged.
func writeCaseHead(w io.Writer, n, total int, c Case) {
	r := c.Result
	fmt.Fprintf(w, "Load case %d of %d: %s\n", n, total, r.Name)
	where := ""
	if s := r.Pos.String(); s != "" {
		where = ", solved at " + s
	}
	fmt.Fprintf(w, "  plant %q%s\n", c.Plant, where)
	fmt.Fprintf(w, "  conditions: sea %s, air %s, main engine load %s %%\n",
		celsius(r.Conditions.SeaT), celsius(r.Conditions.AirT), fix(r.Conditions.EngineLoad*100, 1))
	if r.Converged {
		fmt.Fprintf(w, "  solution: converged, balances closed\n")
	} else {
		fmt.Fprintf(w, "  solution: NOT CONVERGED after %d iterations (residual %s); the figures below are not a balance\n",
			r.Iterations, sci(r.ResidualNorm))
	}
}

// writeSteamBalance writes the table of the steam balance: the steam
// produced, the steam taken, the demand and production, and the water
// lost and made up.
func writeSteamBalance(w io.Writer, r *plant.CaseResult) {
	fmt.Fprintf(w, "\n  Steam balance\n")
	tw := tabwriter.NewWriter(w, 0, 8, 2, ' ', 0)
	fmt.Fprintf(tw, "    \t\t%10s\t%10s\t\n", "kg/h", "kW")
	fmt.Fprintf(tw, "    produced\t\t\t\t\n")
	writeSteamProduced(tw, r)
	fmt.Fprintf(tw, "    taken\t\t\t\t\n")
	writeSteamTaken(tw, r)
	fmt.Fprintf(tw, "    demand\t\t%10s\t\t\n", fix(r.SteamDemandKgS*kgh, 1))
	fmt.Fprintf(tw, "    production\t\t%10s\t\t\n", fix(r.SteamProductionKgS*kgh, 1))
	fmt.Fprintf(tw, "    water lost\t\t\t\t\n")
	fmt.Fprintf(tw, "      %s\t\t%10s\t\t\n", "blowdown", fix(r.BlowdownKgS*kgh, 1))
	fmt.Fprintf(tw, "      %s\t\t%10s\t\t\n", "vented flash steam", fix(r.VentedKgS*kgh, 1))
	var lost float64
	for _, cs := range r.Consumers {
		lost += cs.LostKgS
	}
	fmt.Fprintf(tw, "      %s\t\t%10s\t\t\n", "condensate not returned", fix(lost*kgh, 1))
	fmt.Fprintf(tw, "      %s\t\t%10s\t\t\n", "header drains lost", fix(headerDrains(r)*kgh, 1))
	fmt.Fprintf(tw, "    make-up\t\t%10s\t\t\n", fix(r.MakeUpKgS*kgh, 1))
	tw.Flush()
}

// writeSteamProduced writes the rows of the steam balance's producers:
// the oil-fired boilers and the exhaust-gas economisers.
func writeSteamProduced(tw io.Writer, r *plant.CaseResult) {
	for _, b := range r.Boilers {
		note := "heat to water"
		if !b.Firing {
			note = "not firing"
		}
		fmt.Fprintf(tw, "      %s\t%s\t%10s\t%10s\t%s\n", b.Name, "oil-fired boiler", fix(b.SteamKgS*kgh, 1), fix(b.HeatW/1e3, 1), note)
	}
	for _, g := range r.EGEs {
		note := "not in service"
		if g.InService {
			note = fmt.Sprintf("exhaust %s -> %s °C", fix(g.GasInT-273.15, 0), fix(g.GasOutT-273.15, 0))
			if g.BypassFraction > 0 {
				note += fmt.Sprintf(", %s %% bypassed", fix(g.BypassFraction*100, 0))
			}
		}
		fmt.Fprintf(tw, "      %s\t%s\t%10s\t%10s\t%s\n", g.Name, "exhaust-gas economiser", fix(g.SteamKgS*kgh, 1), fix(g.DutyW/1e3, 1), note)
	}
}

// writeSteamTaken writes the rows of the steam balance's takers: the
// consumers (with their drain coolers and trap losses), the feed tanks'
// heating, the headers' drains and the dump condensers.
func writeSteamTaken(tw io.Writer, r *plant.CaseResult) {
	for _, cs := range r.Consumers {
		note := "duty"
		if cs.Kind == "steam turbine" {
			note = "shaft power"
		}
		if fix(cs.DrainCoolerW/1e3, 1) != "0.0" { // a cooler that gives up heat
			to := "to the " + cs.DrainCoolerTo
			if cs.DrainCoolerTo == "overboard" || cs.DrainCoolerTo == "" {
				to = "overboard"
			}
			note += fmt.Sprintf("; drain cooler %s kW %s", fix(cs.DrainCoolerW/1e3, 1), to)
		}
		if fix(cs.TrapLossKgS*kgh, 1) != "0.0" {
			note += fmt.Sprintf("; %s kg/h live steam through the trap", fix(cs.TrapLossKgS*kgh, 1))
		}
		fmt.Fprintf(tw, "      %s\t%s\t%10s\t%10s\t%s\n", cs.Name, cs.Kind, fix(cs.SteamKgS*kgh, 1), fix(cs.DutyW/1e3, 1), note)
	}
	for _, u := range r.Units {
		if u.Kind == kindFeedTank {
			if m, ok := u.Figures.Get(keyTankSteam); ok {
				fmt.Fprintf(tw, "      %s\t%s\t%10s\t%10s\t\n", u.Name, "feed tank heating", fix(m*kgh, 1), "")
			}
		}
	}
	for _, u := range r.Units {
		if u.Kind == kindHeader && (u.Figures.Of(keyDrained) != 0 || u.Figures.Of("heat_loss_W") != 0) {
			where := "heat loss, drained and lost"
			if u.Figures.Of("drains_returned_kg_s") > 0 {
				where = "heat loss, drained to the hotwell"
			}
			fmt.Fprintf(tw, "      %s\t%s\t%10s\t%10s\t%s\n", u.Name, "header drains", fix(u.Figures.Of(keyDrained)*kgh, 1),
				fix(u.Figures.Of("heat_loss_W")/1e3, 1), where)
		}
	}
	for _, u := range r.Units {
		if u.Kind == kindDump {
			fmt.Fprintf(tw, "      %s\t%s\t%10s\t%10s\t\n", u.Name, "dumped", fix(u.Figures.Of("steam_kg_s")*kgh, 1), "")
		}
	}
}

// writeBoilers writes the table of the boilers (firing, load, steam,
// fuel, efficiency, temperatures, burner) and a line for each boiler
// whose burner cycles.
func writeBoilers(w io.Writer, r *plant.CaseResult) {
	firing := fmt.Sprintf("%d of %d firing", r.BoilersFiring, len(r.Boilers))
	if r.Forced {
		firing += " (chosen by the case)"
	}
	fmt.Fprintf(w, "\n  Boilers: %s\n", firing)
	tw := tabwriter.NewWriter(w, 0, 8, 2, ' ', 0)
	fmt.Fprintf(tw, "    boiler\tfiring\t%10s\t%10s\t%10s\t%10s\t%10s\t%7s\t%7s\tburner\n",
		"load %MCR", "MCR kg/h", "steam kg/h", "fuel kg/h", "eff. %", "feed °C", "flue °C")
	for _, b := range r.Boilers {
		yes, burner, eff := "no", "off", "-"
		if b.Firing {
			yes, burner = "yes", "steady"
			if b.Cycling {
				burner = fmt.Sprintf("cycling, on %s %% of the time", fix(b.OnFraction*100, 0))
				if b.StartsPerHour > 0 {
					burner += fmt.Sprintf(", %s starts/h", fix(b.StartsPerHour, 1))
				}
			}
			eff = fix(b.Efficiency*100, 1) + " " + b.EfficiencyBasis
		}
		feed, flue := "-", "-"
		if b.Firing && b.FeedT > 0 {
			feed = fix(b.FeedT-273.15, 1)
		}
		if b.Firing && b.FlueT > 0 {
			flue = fix(b.FlueT-273.15, 0)
		}
		fmt.Fprintf(tw, "    %s\t%s\t%10s\t%10s\t%10s\t%10s\t%10s\t%7s\t%7s\t%s\n", b.Name, yes, fix(b.LoadFraction*100, 1),
			fix(b.MCRKgS*kgh, 1), fix(b.SteamKgS*kgh, 1), fix(b.FuelKgS*kgh, 1), eff, feed, flue, burner)
	}
	tw.Flush()
	for _, b := range r.Boilers {
		if !b.Cycling {
			continue
		}
		purge := "purges not counted"
		if b.PurgePerStartJ > 0 && b.StartsPerHour > 0 {
			purge = fmt.Sprintf("purges %s kW", fix(b.PurgeW/1e3, 1))
		}
		fmt.Fprintf(w, "    %s cycles: %s %% at the burner minimum, %s %% on average; standby loss %s kW, %s kW of it over the off time; %s\n",
			b.Name, fix(b.FiringEfficiency*100, 1), fix(b.Efficiency*100, 1), fix(b.StandbyLossW/1e3, 1), fix(b.StandbyOffW/1e3, 1), purge)
	}
}

// writeCapacity writes what the boilers' capacity leaves: a shortfall
// and what is shed, the margin before the next boiler, the single
// failures, the least-fuel sharing's saving and the inert gas.
func writeCapacity(w io.Writer, r *plant.CaseResult) {
	if !r.CanCarry {
		fmt.Fprintf(w, "  CANNOT CARRY the demand: short by %s kg/h\n", fix(r.ShortfallKgS*kgh, 1))
		writeShed(w, r)
	}
	fmt.Fprintf(w, "  margin %s: %s kg/h\n", marginLabel(r), fix(r.MarginNextKgS*kgh, 1))
	writeContingencies(w, r)
	if l := r.LeastFuel; l != nil {
		switch {
		case l.Note != "":
			fmt.Fprintf(w, "  least-fuel sharing: %s\n", l.Note)
		case l.SavedKgS > 0:
			fmt.Fprintf(w, "  least-fuel sharing saves %s kg/h (%s %%) against equal sharing (%s kg/h)\n",
				fix(l.SavedKgS*kgh, 1), fix(100*l.SavedFraction(), 2), fix(l.EqualFuelKgS*kgh, 1))
		default:
			fmt.Fprintf(w, "  least-fuel sharing: equal sharing is the least fuel here (%s kg/h)\n", fix(l.EqualFuelKgS*kgh, 1))
		}
	}
	if r.InertGas != nil {
		fmt.Fprintf(w, "  %s\n", plant.InertGasLine(r.InertGas))
		fmt.Fprintf(w, "    (a planning estimate: the O2 analyser and the inert-gas system's own instructions govern)\n")
	}
}

// writeCaseTotals writes the table of the case's totals: fuel, the
// economisers' saving, CO2 both ways, the electrical load, the feed tank
// and the closures of the balances.
func writeCaseTotals(w io.Writer, r *plant.CaseResult) {
	fmt.Fprintf(w, "\n")
	tw := tabwriter.NewWriter(w, 0, 8, 2, ' ', 0)
	fmt.Fprintf(tw, "  fuel\t%s kg/h\t%s t/day\n", fix(r.FuelKgS*kgh, 1), fix(r.FuelKgS*86.4, 3))
	if len(r.EGEs) > 0 {
		fmt.Fprintf(tw, "  fuel saved by EGE\t%s kg/h\t%s t/day\n", fix(r.EGEFuelSavedKgS*kgh, 1), fix(r.EGEFuelSavedKgS*86.4, 3))
	}
	fmt.Fprintf(tw, "  CO2 by IMO C_F\t\t%s t/day for regulatory reporting\n", fix(r.CO2KgS*86.4, 2))
	if r.CO2AnalysisUnknown {
		fmt.Fprintf(tw, "  CO2 by analysis\t\tnot known: a fuel has no analysis\n")
	} else {
		fmt.Fprintf(tw, "  CO2 by analysis\t\t%s t/day from the fuel's carbon\n", fix(r.CO2AnalysisKgS*86.4, 2))
	}
	fmt.Fprintf(tw, "  electrical load\t%s kW\t\n", fix(r.ElectricW/1e3, 1))
	fmt.Fprintf(tw, "  feed tank\t%s °C\t\n", fix(r.FeedTankT-273.15, 1))
	fmt.Fprintf(tw, "  balance closure\tmass %s\tenergy %s (relative)\n", closure(r.Balance.MassRel), closure(r.Balance.EnergyRel))
	tw.Flush()
}

// writeContingencies writes the case's N-1 lines.
func writeContingencies(w io.Writer, r *plant.CaseResult) {
	switch {
	case !r.ContingenciesChecked:
		fmt.Fprintf(w, "  N-1: not checked (the plant's n_minus_1 = false)\n")
	case len(r.Contingencies) == 0:
		fmt.Fprintf(w, "  N-1: no boiler fires and no economiser raises steam: nothing to lose\n")
	default:
		for _, c := range r.Contingencies {
			fmt.Fprintf(w, "  N-1: %s\n", plant.ContingencyLine(c))
		}
		fmt.Fprintf(w, "    (planning estimates: the boiler makers' manuals and the ship's safety management system govern)\n")
	}
}

// writeShed lists what a short case sheds: the consumers reduced, lowest
// priority first, or that every one is reduced in proportion.
func writeShed(w io.Writer, r *plant.CaseResult) {
	var shed []plant.ConsumerResult
	for _, c := range r.Consumers {
		if c.ShedW > 0 || c.ShedKgS > 0 {
			shed = append(shed, c)
		}
	}
	if len(shed) == 0 {
		return
	}
	sort.SliceStable(shed, func(i, j int) bool { return shed[i].Priority < shed[j].Priority })
	switch {
	case r.ShedRanks <= 1 && !r.PrioritiesGiven:
		fmt.Fprintf(w, "  no priorities given: every consumer that may be reduced is reduced in proportion\n")
	case r.ShedRanks <= 1:
		fmt.Fprintf(w, "  every consumer has the same priority: each is reduced in proportion\n")
	default:
		fmt.Fprintf(w, "  shed by priority, lowest first:\n")
	}
	tw := tabwriter.NewWriter(w, 0, 8, 2, ' ', 0)
	fmt.Fprintf(tw, "    consumer\tpriority\t%10s\t%10s\t%10s\t\n", "shed kW", "of kW", "shed kg/h")
	for _, c := range shed {
		fmt.Fprintf(tw, "    %s\t%s\t%10s\t%10s\t%10s\t%s\n", c.Name, priorityName(c.Priority), fix(c.ShedW/1e3, 1),
			fix(c.RequestedW/1e3, 1), fix(c.ShedKgS*kgh, 1), coolingNote(c.Cooling))
	}
	tw.Flush()
}

// priorityName is a priority's level name, or its number.
func priorityName(v float64) string {
	if n := plant.PriorityLevelName(v); n != "" {
		return n
	}
	return strconv.FormatFloat(v, 'g', 6, 64)
}

// coolingNote says what a shed tank's cargo does: "cargo cools 0.4 K/h,
// 12.5 h to 45.0 °C".
func coolingNote(c *plant.TankCooling) string {
	if c == nil {
		return ""
	}
	rate := c.RateKS * 3600
	var s string
	if rate < 0 {
		s = "cargo cools " + fix(-rate, 2) + " K/h"
	} else {
		s = "cargo still warms " + fix(rate, 2) + " K/h"
	}
	switch {
	case c.MinT > 0 && c.Reaches:
		s += ", " + fix(c.SecondsToMinT/3600, 1) + " h to " + fix(c.MinT-273.15, 1) + " °C"
	case c.MinT > 0 && rate < 0:
		s += ", never down to " + fix(c.MinT-273.15, 1) + " °C"
	}
	return s
}

// headerDrains sums the condensate the headers' traps drain and lose (not
// returned to the hotwell).
func headerDrains(r *plant.CaseResult) float64 {
	var m float64
	for _, u := range r.Units {
		if u.Kind == kindHeader {
			m += u.Figures.Of(keyDrained) - u.Figures.Of("drains_returned_kg_s")
		}
	}
	return m
}

// headerDrained sums the steam the headers' heat losses condense, which
// their traps drain (to the hotwell or lost): a steam demand.
func headerDrained(r *plant.CaseResult) float64 {
	var m float64
	for _, u := range r.Units {
		if u.Kind == kindHeader {
			m += u.Figures.Of(keyDrained)
		}
	}
	return m
}

// marginLabel says what the margin is measured to.
func marginLabel(r *plant.CaseResult) string {
	switch {
	case r.BoilersFiring == 0:
		return "with no boiler firing (steam dumped)"
	case r.BoilersFiring == len(r.Boilers):
		return "to the MCR of all boilers"
	case r.Forced:
		return "to the MCR of the boilers firing"
	}
	return "before the next boiler must fire"
}

// fix formats v with dec decimals, without a minus sign on a value that
// rounds to zero, and "-" for a value that is not finite.
func fix(v float64, dec int) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "-"
	}
	s := strconv.FormatFloat(v, 'f', dec, 64)
	if strings.HasPrefix(s, "-") && strings.Trim(s, "-0.") == "" {
		s = s[1:]
	}
	return s
}

// celsius formats a condition's temperature in K as "12.0 °C", or says
// "not given" for the zero that plant.Conditions holds when the case did
// not give it.
func celsius(k float64) string {
	if k <= 0 {
		return "not given"
	}
	return fix(k-273.15, 1) + " °C"
}

// sci formats v with two significant digits in exponent form.
func sci(v float64) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "-"
	}
	return strconv.FormatFloat(v, 'e', 1, 64)
}

// closure formats a relative balance closure; below 1e-9 it is solver
// noise and is shown as such, so that reports do not change with the last
// bits of a solve.
func closure(v float64) string {
	if v < 1e-9 {
		return "< 1e-9"
	}
	return sci(v)
}

// writeTrimmed writes text without the spaces tabwriter leaves at the ends
// of lines.
func writeTrimmed(w io.Writer, text []byte) {
	for line := range bytes.Lines(text) {
		w.Write(bytes.TrimRight(line, " \n"))
		w.Write([]byte{'\n'})
	}
}

func oneLine(s string) string { return strings.Join(strings.Fields(s), " ") }

// errWriter keeps the first write error.
type errWriter struct {
	w   io.Writer
	err error
}

func (e *errWriter) Write(p []byte) (int, error) {
	if e.err != nil {
		return 0, e.err
	}
	n, err := e.w.Write(p)
	e.err = err
	return n, err
}
