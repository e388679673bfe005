package scripting

import (
	"fmt"

	lua "github.com/yuin/gopher-lua"

	"steamcase/plant"
)

// defaultDumpSubcool is the short form's dump condenser subcooling below
// saturation at the main header's pressure: condensate at about 90 C from
// a 7 bar(g) header, below the boiling point of a vented hotwell (common
// practice, no source). A dump condenser of the full graph takes the
// condenser's own default (saturated condensate).
const defaultDumpSubcool = "80 K"

// copyTable returns a shallow copy of t (nil gives an empty table) with
// defaults set where the key is absent.
func (r *runner) copyTable(t *lua.LTable, what string, defaults map[string]string) *lua.LTable {
	out := r.L.NewTable()
	if t != nil {
		r.checkSize(t, what)
		t.ForEach(func(k, v lua.LValue) { out.RawSet(k, v) })
	}
	for k, v := range defaults {
		if out.RawGetString(k) == lua.LNil {
			out.RawSetString(k, lua.LString(v))
		}
	}
	return out
}

// subTable reads an optional table key of the short form.
func (r *runner) subTable(a *args, key string) *lua.LTable {
	switch v := a.get(key).(type) {
	case *lua.LNilType:
		return nil
	case *lua.LTable:
		return v
	default:
		a.errorf(nil, "%s must be a table; got %s", key, describe(v))
		return nil
	}
}

// list reads an optional list of tables of the short form.
func (r *runner) list(a *args, key string) []*lua.LTable {
	t := r.subTable(a, key)
	if t == nil {
		return nil
	}
	r.checkSize(t, key)
	n := t.Len()
	var out []*lua.LTable
	for i := 1; i <= n; i++ {
		e, ok := t.RawGetInt(i).(*lua.LTable)
		if !ok {
			a.errorf(nil, "%s[%d] must be a table such as { name = \"...\" }; got %s", key, i, describe(t.RawGetInt(i)))
			continue
		}
		out = append(out, e)
	}
	if extra := r.unknownKeys(t, nil); len(extra) > n {
		a.errorf(nil, "%s must be a list { {...}, {...} } without named keys", key)
	}
	return out
}

// luaSteamPlant is the short form: steam_plant{ name, boilers, hotwell,
// feed_pump, makeup, headers, consumers, turbines, and the plant keys }.
func (r *runner) luaSteamPlant(L *lua.LState) int {
	t := r.checkTable(1, "steam_plant")
	pos := r.where()
	a, name, opt := r.plantOptions(t, "steam_plant", pos)
	in := shortInput{
		boilers:     r.list(a, "boilers"),
		makeup:      r.subTable(a, "makeup"),
		hotwell:     r.subTable(a, "hotwell"),
		pump:        r.subTable(a, "feed_pump"),
		headers:     r.list(a, "headers"),
		consumers:   r.list(a, "consumers"),
		turbines:    r.list(a, "turbines"),
		ege:         r.subTable(a, "exhaust_gas_economiser"),
		dump:        r.subTable(a, "dump_condenser"),
		economisers: r.list(a, "economisers"),
		obs:         r.subTable(a, "observation_tank"),
	}
	if in.dump != nil && in.ege == nil {
		a.errorf(nil, "dump_condenser is only built with an exhaust_gas_economiser")
	}
	if len(in.boilers) == 0 && a.nerr == 0 {
		a.errorf(nil, "boilers is required: a list such as { {name = \"AB1\", mcr = \"3 t/h\", drum = \"7 bar(g)\", fuel = \"MGO\", efficiency = \"85 %%\"} }")
	}
	a.done()
	ud, ph := r.newPlant(name, pos, opt, a.uopt)
	f := &shortForm{r: r, ph: ph, pos: pos}
	f.feedSide(in)
	f.headers(in.headers)
	ecoOf := f.economisers(in.economisers)
	f.boilers(in.boilers, ecoOf)
	if in.ege != nil {
		f.exhaustGas(in.ege, in.dump)
	}
	if f.hotwellTable.RawGetString("set_T") != lua.LNil {
		f.line(f.hotwellPos, "hotwell heating", f.main+".out", f.hotwell+".steam")
	}
	f.consumers(in.consumers)
	f.turbines(in.turbines)
	L.Push(ud)
	return 1
}

// shortInput are the tables of a steam_plant{} call.
type shortInput struct {
	boilers, headers, consumers, turbines, economisers []*lua.LTable
	makeup, hotwell, pump, ege, dump, obs              *lua.LTable
}

// shortForm builds the graph of a steam_plant{}: the components in the
// usual arrangement and the lines between them.
type shortForm struct {
	r   *runner
	ph  *plantHandle
	pos Pos // of the call

	hotwell, returnTo, feedHeader, main string
	hotwellTable                        *lua.LTable
	hotwellPos                          Pos
	boilerNames                         []string
}

func (f *shortForm) line(pos Pos, name, from, to string) {
	f.ph.nLines++
	f.ph.pending = append(f.ph.pending, pendingLine{name: name, pos: pos, from: from, to: to})
}

// at is the position of an entry: the line of its own table.
func (f *shortForm) at(t *lua.LTable, key string) Pos {
	if t != nil {
		if n, ok := t.RawGetString("name").(lua.LString); ok {
			if p := f.r.entryPos(f.pos, string(n)); p != f.pos {
				return p
			}
		}
	}
	if key != "" {
		return f.r.entryPos(f.pos, "="+key)
	}
	return f.pos
}

// named copies t with a default name.
func (f *shortForm) named(t *lua.LTable, def string) *lua.LTable {
	return f.r.copyTable(t, def, map[string]string{"name": def})
}

// feedSide builds the make-up, the hotwell (and an observation tank the
// returns pass), the feed pump and the feed header.
func (f *shortForm) feedSide(in shortInput) {
	r, ph := f.r, f.ph
	muPos, fpPos := f.at(in.makeup, "makeup"), f.at(in.pump, "feed_pump")
	f.hotwellPos = f.at(in.hotwell, "hotwell")
	r.addUnit(ph, "makeup", f.named(in.makeup, "makeup"), muPos, nil)
	f.hotwellTable = f.named(in.hotwell, "hotwell")
	f.hotwell = r.addUnit(ph, "feed_tank", f.hotwellTable, f.hotwellPos, nil)
	// Returns go to the hotwell, or through an observation tank draining
	// to it.
	f.returnTo = f.hotwell
	if in.obs != nil {
		obsPos := f.at(in.obs, "observation_tank")
		if on := r.addUnit(ph, "observation_tank", f.named(in.obs, "observation tank"), obsPos, nil); on != "" {
			f.line(obsPos, on+" drain", on+".out", f.hotwell+".in")
			f.returnTo = on
		}
	}
	for _, b := range in.boilers {
		if n, ok := b.RawGetString("name").(lua.LString); ok {
			f.boilerNames = append(f.boilerNames, string(n))
		}
	}
	fp := f.named(in.pump, "feed pump")
	if fp.RawGetString("boilers") == lua.LNil {
		bl := r.L.NewTable()
		for _, n := range f.boilerNames {
			bl.Append(lua.LString(n))
		}
		fp.RawSetString("boilers", bl)
	}
	fpName := r.addUnit(ph, "feed_pump", fp, fpPos, nil)
	f.feedHeader = r.addUnit(ph, "header", f.named(nil, "feed header"), fpPos, nil)
	f.line(muPos, "makeup", "makeup.out", f.hotwell+".in")
	f.line(f.hotwellPos, "feed suction", f.hotwell+".out", fpName+".in")
	f.line(fpPos, "feed discharge", fpName+".out", f.feedHeader+".in")
}

// headers builds the main header and each further one, fed from the main
// header through a reducing valve.
func (f *shortForm) headers(headers []*lua.LTable) {
	r, ph := f.r, f.ph
	if len(headers) == 0 {
		headers = []*lua.LTable{f.named(nil, "main")}
	}
	for i, h := range headers {
		var p lua.LValue
		hPos := f.at(h, "")
		hn := r.addUnit(ph, "header", h, hPos, func(a *args) {
			p = a.get("p")
			if i == 0 && p != lua.LNil {
				a.errorf(nil, "the first header is the main header at the boilers' pressure; it takes no p")
			}
			if i > 0 && p == lua.LNil {
				a.errorf(nil, "p is required for a header after the first, such as p = \"7 bar(g)\" (it is fed from the main header through a reducing valve)")
			}
		})
		if i == 0 {
			f.main = hn
			continue
		}
		if p == lua.LNil {
			continue
		}
		prv := r.L.NewTable()
		prv.RawSetString("name", lua.LString("PRV "+hn))
		prv.RawSetString("p", p)
		pn := r.addUnit(ph, "reducing_valve", prv, hPos, nil)
		f.line(hPos, "to "+pn, f.main+".out", pn+".in")
		f.line(hPos, "from "+pn, pn+".out", hn+".in")
	}
}

// economisers builds the flue-gas economisers on the feed line of their
// boilers and returns each boiler's economiser.
func (f *shortForm) economisers(ecos []*lua.LTable) map[string]string {
	r, ph := f.r, f.ph
	ecoOf := map[string]string{}
	for _, e := range ecos {
		ePos := f.at(e, "")
		var boiler string
		en := r.addUnit(ph, "economiser", e, ePos, nil)
		if u, ok := ph.p.Component(en).(*plant.Economiser); ok {
			boiler = u.Boiler
		}
		if en == "" {
			continue
		}
		if !contains(f.boilerNames, boiler) {
			continue // the plant reports the unknown boiler
		}
		if prev, dup := ecoOf[boiler]; dup {
			r.errs = append(r.errs, &Error{Pos: ePos, Unit: fmt.Sprintf("economiser %q", en), Msg: fmt.Sprintf("boiler %q already has the economiser %q; the short form takes one per boiler", boiler, prev)})
			continue
		}
		ecoOf[boiler] = en
		f.line(ePos, "feed "+en, f.feedHeader+".out", en+".in")
	}
	return ecoOf
}

// boilers builds the boilers, fed from the feed header (or their
// economiser), raising steam into the main header.
func (f *shortForm) boilers(boilers []*lua.LTable, ecoOf map[string]string) {
	for _, b := range boilers {
		bPos := f.at(b, "")
		bn := f.r.addUnit(f.ph, "boiler", b, bPos, nil)
		if en, ok := ecoOf[bn]; ok && bn != "" {
			f.line(bPos, "feed "+bn, en+".out", bn+".feed")
		} else {
			f.line(bPos, "feed "+bn, f.feedHeader+".out", bn+".feed")
		}
		f.line(bPos, "steam "+bn, bn+".steam", f.main+".in")
	}
}

// exhaustGas builds the exhaust-gas economiser between the feed and main
// headers and its dump condenser on the main header.
func (f *shortForm) exhaustGas(ege, dump *lua.LTable) {
	r, ph := f.r, f.ph
	ePos := f.at(ege, "exhaust_gas_economiser")
	en := r.addUnit(ph, "exhaust_gas_economiser", f.named(ege, "EGE"), ePos, nil)
	if en != "" {
		f.line(ePos, "feed "+en, f.feedHeader+".out", en+".feed")
		f.line(ePos, "steam "+en, en+".steam", f.main+".in")
	}
	dPos := ePos
	if dump != nil {
		dPos = f.at(dump, "dump_condenser")
	}
	dc := r.copyTable(f.named(dump, "dump condenser"), "dump_condenser", map[string]string{"subcool": defaultDumpSubcool})
	dc.RawSetString("dump", lua.LTrue)
	dn := r.addUnit(ph, "condenser", dc, dPos, nil)
	if dn != "" {
		f.line(dPos, "to "+dn, f.main+".out", dn+".in")
		f.line(dPos, "condensate of "+dn, dn+".out", f.hotwell+".in")
	}
}

// header reads an entry's header key: its header, by default the main one.
func (f *shortForm) header(a *args) string {
	h, ok := a.str("header", false)
	if !ok {
		return f.main
	}
	return h
}

// consumers builds the consumers on their headers, returning condensate
// to the hotwell (or the observation tank) when they return any.
func (f *shortForm) consumers(consumers []*lua.LTable) {
	r, ph := f.r, f.ph
	for _, c := range consumers {
		var hn string
		cPos := f.at(c, "")
		kind := "consumer"
		if k, ok := c.RawGetString("kind").(lua.LString); ok && k != "consumer" {
			if !contains(consumerKinds, string(k)) {
				what := "consumer"
				if n, ok := c.RawGetString("name").(lua.LString); ok {
					what = fmt.Sprintf("consumer %q", string(n))
				}
				msg := unknownKindMsg(string(k))
				if k == "cargo_pump" {
					msg = "a cargo pump is a turbine: list it under turbines"
				}
				r.errs = append(r.errs, &Error{Pos: cPos, Unit: what, Msg: msg})
				continue
			}
			kind = string(k)
		}
		cn := r.addUnit(ph, kind, c, cPos, func(a *args) {
			hn = f.header(a)
			a.get("kind")
		})
		if cn == "" {
			continue
		}
		f.line(cPos, "steam to "+cn, hn+".out", cn+".in")
		if cu, ok := ph.p.Component(cn).(*plant.Consumer); ok && cu.ReturnFraction > 0 {
			f.line(cPos, "return from "+cn, cn+".out", f.returnTo+".in")
		}
	}
}

// turbines builds the turbines on their headers, each exhausting to a
// condenser of its own that drains to the hotwell.
func (f *shortForm) turbines(turbines []*lua.LTable) {
	r, ph := f.r, f.ph
	for _, tt := range turbines {
		var hn string
		var cond *lua.LTable
		kind := "turbine"
		if k, ok := tt.RawGetString("kind").(lua.LString); ok && k == "cargo_pump" {
			kind = "cargo_pump"
		}
		tPos := f.at(tt, "")
		tn := r.addUnit(ph, kind, tt, tPos, func(a *args) {
			hn = f.header(a)
			cond = r.subTable(a, "condenser")
			if k, ok := a.str("kind", false); ok && k != kind {
				a.errorf(nil, "kind of a turbine must be \"turbine\" or \"cargo_pump\"; got %q", k)
			}
		})
		if tn == "" {
			continue
		}
		cn := r.addUnit(ph, "condenser", f.named(cond, tn+" condenser"), tPos, nil)
		f.line(tPos, fmt.Sprintf("steam to %s", tn), hn+".out", tn+".in")
		f.line(tPos, fmt.Sprintf("exhaust of %s", tn), tn+".out", cn+".in")
		f.line(tPos, fmt.Sprintf("condensate of %s", tn), cn+".out", f.hotwell+".in")
	}
}
