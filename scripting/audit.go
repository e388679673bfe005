package scripting

import (
	"context"
	"errors"
	"fmt"
	"math"
	"strings"

	lua "github.com/yuin/gopher-lua"

	"steamcase/plant"
	"steamcase/plant/profile"
	"steamcase/plant/schema"
	"steamcase/plant/units"
)

// auditArgs is what audit() reads besides its days.
type auditArgs struct {
	spec profile.AuditSpec
	opt  profile.AuditOptions
}

// luaAudit is audit(plant, { name, csv or days, uncertain, claim, claims,
// split, implied, calibrate, samples, seed, band, alpha }).
func (r *runner) luaAudit(L *lua.LState) int {
	var aa auditArgs
	nerr := len(r.errs)
	ph, a, name, rows := r.jobStart("audit", rowSpec{job: "audit", audit: true}, func(a *args) {
		ph := r.checkPlant(1)
		pos := plant.Pos{File: a.pos.File, Line: a.pos.Line}
		aa.spec.Uncertain = r.uncertainties(ph, a)
		aa.spec.Claim = r.claimErrors(a, pos)
		aa.spec.Causes = r.causes(ph, a, pos)
		if s, ok := a.str("claims", false); ok {
			found := false
			var names []string
			for _, c := range aa.spec.Causes {
				names = append(names, c.Name)
				found = found || c.Name == s
			}
			if !found {
				msg := fmt.Sprintf("claims = %q: the days claim the fuel of a cause split out, but split names no such cause", s)
				if len(names) > 0 {
					msg += fmt.Sprintf(" (split names %s)", strings.Join(quoteAll(names), ", "))
					if sg := suggest(s, names); sg != "" {
						msg += fmt.Sprintf("; did you mean %q?", sg)
					}
				}
				a.errorf(nil, "%s", msg)
			}
			aa.spec.ClaimsOf = s
		}
		if v := a.get("implied"); v != lua.LNil {
			for i, t := range r.tableList(a, "implied", v) {
				fa := r.args(t, fmt.Sprintf("%s implied[%d]", a.what, i+1), a.pos, ph.uopt)
				f := r.factor(ph, fa, pos)
				fa.done()
				a.nerr += fa.nerr
				aa.spec.Implied = append(aa.spec.Implied, f)
			}
		}
		if v := a.get("calibrate"); v != lua.LNil {
			t, ok := v.(*lua.LTable)
			if !ok {
				a.errorf(nil, "calibrate must be a table such as { units = { \"AB1\", \"AB2\" }, key = \"eta_factor\", off = { \"cargo heating\" } }; got %s", describe(v))
			} else {
				ca := r.args(t, a.what+" calibrate", a.pos, ph.uopt)
				c := &profile.Calibration{Factor: r.factor(ph, ca, pos)}
				c.Off = r.unitNames(ph, ca, "off")
				ca.done()
				a.nerr += ca.nerr
				aa.spec.Calibrate = c
			}
		}
		if n, ok := a.number("samples"); ok {
			if n != math.Trunc(n) || n < 10 || n > 100000 {
				a.errorf(nil, "samples must be a whole number from 10 to 100000; got %g", n)
			}
			aa.opt.Samples = int(n)
		}
		if s, ok := a.number("seed"); ok {
			if s != math.Trunc(s) || s < 0 || s > 1<<53 {
				a.errorf(nil, "seed must be a whole number from 0 to 2^53; got %g", s)
			}
			aa.opt.Seed = uint64(s)
		}
		if v := a.get("band"); v != lua.LNil {
			bt, ok := v.(*lua.LTable)
			if !ok || bt.Len() != 2 {
				a.errorf(nil, "band must be a pair of quantiles such as band = {\"5 %%\", \"95 %%\"}; got %s", describe(v))
			} else {
				lo, err1 := parseQuantity(bt.RawGetInt(1), "band[1]", units.Fraction, a.uopt)
				hi, err2 := parseQuantity(bt.RawGetInt(2), "band[2]", units.Fraction, a.uopt)
				if err := errors.Join(err1, err2); err != nil {
					a.errorf(err, "%s", strings.ReplaceAll(err.Error(), "\n", "; "))
				} else if !(lo > 0 && lo < hi && hi < 1) {
					a.errorf(nil, "band must satisfy 0 < low < high < 100 %%; got %g %% and %g %%", 100*lo, 100*hi)
				}
				aa.opt.Low, aa.opt.High = lo, hi
			}
		}
		if v, ok := a.quantity("alpha", units.Fraction, false); ok {
			if !(v > 0 && v < 0.5) {
				a.errorf(nil, "alpha must lie between 0 and 50 %%; got %g %%", 100*v)
			}
			aa.opt.Alpha = v
		}
	})
	for i, row := range rows.rows {
		aa.spec.Days = append(aa.spec.Days, profile.Day{Date: rows.dates[i], Phase: row.Phase, Hours: row.Hours, Case: row.Case,
			ClaimedT: rows.claimed[i], Reference: rows.reference[i], Pos: row.Case.Pos})
	}
	rec := AuditRecord{Name: name, Plant: ph.p.Name, Pos: a.pos, Days: rows.pos}
	job := schema.Job{Name: name, Plant: ph.p.Name, Source: a.pos.String(), RowSources: posStrings(rows.pos)}
	if r.opt.CheckOnly {
		res := &profile.AuditResult{}
		if len(r.errs) == nerr { // else its errors are in already
			out, err := profile.AuditOutline(ph.p, aa.spec, aa.opt)
			if err != nil {
				r.auditErr(a.pos, a.what, err, false)
			} else {
				res = out
			}
		}
		r.out.Audits = append(r.out.Audits, rec)
		L.Push(r.auditTable(job, res))
		return 1
	}
	aa.opt.Workers = r.opt.Workers
	aa.opt.Progress = r.progress(a.what)
	var res *profile.AuditResult
	err := r.inJob(a.what, a.pos, auditWork(aa.spec, aa.opt), func(ctx context.Context) error {
		var err error
		res, err = profile.Audit(ctx, ph.p, aa.spec, aa.opt)
		return err
	})
	if err != nil {
		r.auditErr(a.pos, a.what, err, true)
	}
	rec.Result = res
	r.out.Audits = append(r.out.Audits, rec)
	L.Push(r.auditTable(job, res))
	return 1
}

// auditErr raises an audit's error at the day it names, if it names one,
// else at the audit() call; a time limit names the option to raise. In
// check mode (raise false) it records the error and goes on.
func (r *runner) auditErr(pos Pos, what string, err error, raise bool) {
	r.raiseLimit(pos, what, err)
	var oe *profile.OverrunError
	var de *profile.DayError
	e := &Error{Pos: pos, Unit: what, Msg: err.Error(), Err: err}
	switch {
	case errors.As(err, &oe):
		e = &Error{Pos: pos, Unit: what, Err: err, Msg: fmt.Sprintf("%v: raise the job time limit (sim run --job-timeout; scripting's Options.JobTimeout), or give fewer samples",
			oe)}
	case errors.As(err, &de) && de.Pos.File != "":
		e = &Error{Pos: Pos{File: de.Pos.File, Line: de.Pos.Line}, Unit: what, Err: err,
			Msg: fmt.Sprintf("audit day %d (%s): %v", de.Day, de.Date, de.Err)}
	default:
		var se *plant.SolveError
		if errors.As(err, &se) && se.Pos.File != "" {
			e.Pos = Pos{File: se.Pos.File, Line: se.Pos.Line}
		}
	}
	if raise {
		r.raise(e)
	}
	r.errs = append(r.errs, e)
}

func quoteAll(s []string) []string {
	out := make([]string, len(s))
	for i, x := range s {
		out[i] = fmt.Sprintf("%q", x)
	}
	return out
}

// tableList reads a list of tables, or one table, under key.
func (r *runner) tableList(a *args, key string, v lua.LValue) []*lua.LTable {
	t, ok := v.(*lua.LTable)
	if !ok {
		a.errorf(nil, "%s must be a table or a list of tables; got %s", key, describe(v))
		return nil
	}
	r.checkSize(t, key)
	if t.Len() == 0 {
		return []*lua.LTable{t}
	}
	var out []*lua.LTable
	for i := 1; i <= t.Len(); i++ {
		e, ok := t.RawGetInt(i).(*lua.LTable)
		if !ok {
			a.errorf(nil, "%s[%d] must be a table; got %s", key, i, describe(t.RawGetInt(i)))
			continue
		}
		out = append(out, e)
	}
	return out
}

// unitNames reads a list of unit names of the plant under key (or one
// name).
func (r *runner) unitNames(ph *plantHandle, a *args, key string) []string {
	v := a.get(key)
	if v == lua.LNil {
		return nil
	}
	var names []string
	if s, ok := v.(lua.LString); ok {
		names = []string{string(s)}
	} else {
		names = a.names(key)
	}
	for _, n := range names {
		if ph.p.Component(n) == nil {
			a.errorf(nil, "%s: %s", key, r.unknownUnitMsg(ph, n))
		}
	}
	return names
}

// factor reads { unit = "..." } or { units = { ... } } with key = "...".
func (r *runner) factor(ph *plantHandle, a *args, pos plant.Pos) profile.Factor {
	var unitList []string
	if a.has("unit") && a.has("units") {
		a.errorf(nil, "give unit or units, not both")
	}
	if s, ok := a.str("unit", false); ok {
		unitList = []string{s}
		if ph.p.Component(s) == nil {
			a.errorf(nil, "unit: %s", r.unknownUnitMsg(ph, s))
		}
	} else {
		unitList = r.unitNames(ph, a, "units")
	}
	key, _ := a.str("key", true)
	if len(unitList) == 0 && a.nerr == 0 {
		a.errorf(nil, "unit (or units) is required: the unit whose key this factor sets, such as unit = \"cargo heating\"")
	}
	f := profile.Factor{Pos: pos}
	for _, u := range unitList {
		f.Targets = append(f.Targets, profile.Target{Unit: u, Param: key})
	}
	return f
}

// causes reads split = { { name = "cargo heating", units = { ... } }, ... }.
func (r *runner) causes(ph *plantHandle, a *args, pos plant.Pos) []profile.Cause {
	v := a.get("split")
	if v == lua.LNil {
		return nil
	}
	var out []profile.Cause
	for i, t := range r.tableList(a, "split", v) {
		ca := r.args(t, fmt.Sprintf("%s split[%d]", a.what, i+1), a.pos, ph.uopt)
		name, _ := ca.str("name", true)
		c := profile.Cause{Name: name, Pos: pos}
		if s, ok := ca.str("unit", false); ok {
			c.Units = []string{s}
			if ph.p.Component(s) == nil {
				ca.errorf(nil, "unit: %s", r.unknownUnitMsg(ph, s))
			}
		} else {
			c.Units = r.unitNames(ph, ca, "units")
		}
		if len(c.Units) == 0 && ca.nerr == 0 {
			ca.errorf(nil, "units is required: the units switched off together to find the cause's fuel, such as units = { \"COP1\", \"COP2\" }")
		}
		for _, u := range c.Units {
			if ph.p.Component(u) == nil {
				continue
			}
			ok := false
			for _, k := range r.caseKeys(ph, u) {
				ok = ok || k.Name == "off"
			}
			if !ok {
				ca.errorf(nil, "%q cannot be switched off by a case (it has no key \"off\"), so its fuel cannot be split out", u)
			}
		}
		ca.done()
		a.nerr += ca.nerr
		out = append(out, c)
	}
	return out
}

// claimSources are the sources a claim's uncertainty may name.
var claimSources = [...]struct {
	name string
	src  profile.ClaimSource
	keys []string
}{
	{"flow meter", profile.FlowMeter, []string{"accuracy"}},
	{"soundings", profile.Soundings, []string{"per_sounding", "density"}},
	{"noon report", profile.NoonReport, []string{"rob"}},
	{"bdn density", profile.BDNDensity, []string{"density", "uncertainty"}},
}

// claimErrors reads claim = { source = "flow meter", accuracy = "1 %" }
// or a list of such.
func (r *runner) claimErrors(a *args, pos plant.Pos) []profile.ClaimError {
	v := a.get("claim")
	if v == lua.LNil {
		return nil
	}
	var names []string
	for _, s := range claimSources {
		names = append(names, s.name)
	}
	var out []profile.ClaimError
	for i, t := range r.tableList(a, "claim", v) {
		ca := r.args(t, fmt.Sprintf("%s claim[%d]", a.what, i+1), a.pos, a.uopt)
		src, _ := ca.str("source", true)
		ce := profile.ClaimError{Pos: pos}
		found := false
		for _, s := range claimSources {
			if s.name == strings.ToLower(strings.TrimSpace(src)) {
				found, ce.Source = true, s.src
			}
		}
		if !found && src != "" {
			msg := fmt.Sprintf("source %q is not a source this audit knows; the sources are %s", src, strings.Join(quoteAll(names), ", "))
			if sg := suggest(src, names); sg != "" {
				msg += fmt.Sprintf("; did you mean %q?", sg)
			}
			ca.errorf(nil, "%s", msg)
		}
		switch ce.Source {
		case profile.FlowMeter:
			ce.Accuracy, _ = ca.quantity("accuracy", units.Fraction, false)
		case profile.Soundings:
			ce.Volume, _ = ca.quantity("per_sounding", units.Volume, false)
			ce.Density, _ = ca.quantity("density", units.Density, true)
		case profile.NoonReport:
			ce.Mass, _ = ca.quantity("rob", units.Mass, false)
		case profile.BDNDensity:
			ce.Density, _ = ca.quantity("density", units.Density, true)
			ce.DensityError, _ = ca.quantity("uncertainty", units.Density, false)
		}
		ca.done()
		a.nerr += ca.nerr
		out = append(out, ce)
	}
	return out
}

// uncertainties reads uncertain = { {unit, key, low, high, scope}, ... };
// a reading's error has no unit: { key = "sea", low = "-1 K", high = "1 K" }.
func (r *runner) uncertainties(ph *plantHandle, a *args) []profile.Uncertain {
	v := a.get("uncertain")
	if v == lua.LNil {
		return nil
	}
	t, ok := v.(*lua.LTable)
	if !ok {
		a.errorf(nil, "uncertain must be a list such as { {unit = \"cargo heating\", key = \"factor\", low = 0.85, high = 1.15} }; got %s", describe(v))
		return nil
	}
	r.checkSize(t, "uncertain")
	var out []profile.Uncertain
	for i := 1; i <= t.Len(); i++ {
		et, ok := t.RawGetInt(i).(*lua.LTable)
		if !ok {
			a.errorf(nil, "uncertain[%d] must be a table {unit, key, low, high}", i)
			continue
		}
		ea := r.args(et, fmt.Sprintf("%s uncertain[%d]", a.what, i), a.pos, ph.uopt)
		unit, hasUnit := ea.str("unit", false)
		key, _ := ea.str("key", true)
		lo, hi := ea.get("low"), ea.get("high")
		scope := profile.ScopeDefault
		if s, ok := ea.str("scope", false); ok {
			switch s {
			case "fixed":
				scope = profile.Fixed
			case "daily":
				scope = profile.Daily
			default:
				ea.errorf(nil, "scope must be \"fixed\" (drawn once for the period: a property of the ship) or \"daily\" (drawn afresh each day); got %q", s)
			}
		}
		ea.done()
		if ea.nerr > 0 {
			a.nerr += ea.nerr
			continue
		}
		pos := plant.Pos{File: a.pos.File, Line: a.pos.Line}
		if !hasUnit {
			if key != profile.ReadingSea && key != profile.ReadingAir {
				ea.errorf(nil, "unit is required, except for the error of a day's reading: key = %q or %q with low and high in K, such as low = \"-1 K\"",
					profile.ReadingSea, profile.ReadingAir)
				a.nerr += ea.nerr
				continue
			}
			l, h := r.bound(ea, lo, "low", func(v lua.LValue, what string) (float64, error) {
				return parseQuantity(v, what, units.TemperatureDifference, ph.uopt)
			}), r.bound(ea, hi, "high", func(v lua.LValue, what string) (float64, error) {
				return parseQuantity(v, what, units.TemperatureDifference, ph.uopt)
			})
			if ea.nerr == 0 && !(l <= h) {
				ea.errorf(nil, "low must not exceed high; got %s and %s", describe(lo), describe(hi))
			}
			out = append(out, profile.Uncertain{Param: key, Low: l, High: h, Scope: scope, Pos: pos})
			a.nerr += ea.nerr
			continue
		}
		if ph.p.Component(unit) == nil {
			ea.errorf(nil, "%s", r.unknownUnitMsg(ph, unit))
			a.nerr += ea.nerr
			continue
		}
		var k plant.Key
		var accepted []string
		found := false
		for _, x := range r.caseKeys(ph, unit) {
			if x.Kind == plant.KeyText {
				continue // a text cannot be drawn from a range
			}
			accepted = append(accepted, x.Name)
			if x.Name == key {
				k, found = x, true
			}
		}
		switch {
		case !found:
			ea.errorf(nil, "%s: %s", unit, unknownKeyMsg(key, accepted))
		case k.Kind == plant.KeyFlag || k.Kind == plant.KeyChoice || k.Kind == plant.KeyRank:
			ea.errorf(nil, "%s.%s cannot be sampled (a switch, a choice or a priority); sample a number such as factor", unit, key)
		default:
			parse := func(v lua.LValue, what string) (float64, error) { return parseSetting(v, &k, what, ph.uopt) }
			l, h := r.bound(ea, lo, "low", parse), r.bound(ea, hi, "high", parse)
			if ea.nerr == 0 && !(l <= h) {
				ea.errorf(nil, "low must not exceed high; got %s and %s", describe(lo), describe(hi))
			}
			if ea.nerr == 0 && !(k.Min == 0 && k.Max == 0) && (l < k.Min || h > k.Max) {
				ea.errorf(nil, "%s.%s: the range %s to %s leaves the key's own range, %g to %g", unit, key, describe(lo), describe(hi), k.Min, k.Max)
			}
			out = append(out, profile.Uncertain{Unit: unit, Param: k.Name, Low: l, High: h, Scope: scope, Pos: pos})
		}
		a.nerr += ea.nerr
	}
	return out
}

// bound reads an uncertain input's low or high with parse.
func (r *runner) bound(ea *args, v lua.LValue, what string, parse func(lua.LValue, string) (float64, error)) float64 {
	if v == lua.LNil {
		ea.errorf(nil, "%s is required, such as %s = 0.85", what, what)
		return 0
	}
	f, err := parse(v, what)
	if err != nil {
		ea.errorf(err, "%v", err)
	}
	return f
}

// auditTable is what audit() returns: the audit's schema object and
// flagged_days, the days whose flag is not "", in order.
func (r *runner) auditTable(job schema.Job, res *profile.AuditResult) lua.LValue {
	o := r.schemaTable(fmt.Sprintf("audit %q", job.Name), schema.NewAudit(job, res))
	flagged := r.L.NewTable()
	for _, d := range list(o, "days") {
		if f, _ := d.RawGetString("flag").(lua.LString); f != "" {
			flagged.Append(d)
		}
	}
	o.RawSetString("flagged_days", flagged)
	return o
}

// auditWork is the plant solves an audit announces for its time limit:
// each day's samples and nominal case, its causes' solves without them,
// and up to 40 solves for each implied factor's search per day and for a
// calibration on the days.
func auditWork(spec profile.AuditSpec, opt profile.AuditOptions) int {
	samples := opt.Samples
	if samples <= 0 {
		samples = profile.DefaultAuditSamples
	}
	perDay := samples + 1 + len(spec.Causes) + 40*len(spec.Implied)
	if spec.Calibrate != nil {
		perDay += 40
	}
	return len(spec.Days) * perDay
}
