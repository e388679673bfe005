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
	boilers := r.list(a, "boilers")
	makeup := r.subTable(a, "makeup")
	hotwell := r.subTable(a, "hotwell")
	pump := r.subTable(a, "feed_pump")
	headers := r.list(a, "headers")
	consumers := r.list(a, "consumers")
	turbines := r.list(a, "turbines")
	ege := r.subTable(a, "exhaust_gas_economiser")
	dump := r.subTable(a, "dump_condenser")
	economisers := r.list(a, "economisers")
	obs := r.subTable(a, "observation_tank")
	if dump != nil && ege == nil {
		a.errorf(nil, "dump_condenser is only built with an exhaust_gas_economiser")
	}
	if len(boilers) == 0 && a.nerr == 0 {
		a.errorf(nil, "boilers is required: a list such as { {name = \"AB1\", mcr = \"3 t/h\", drum = \"7 bar(g)\", fuel = \"MGO\", efficiency = \"85 %%\"} }")
	}
	a.done()
	ud := r.newPlant(name, pos, opt, a.uopt)
	ph := ud.Value.(*plantHandle)

	line := func(pos Pos, name, from, to string) {
		ph.nLines++
		ph.pending = append(ph.pending, pendingLine{name: name, pos: pos, from: from, to: to})
	}
	// at is the position of an entry: the line of its own table.
	at := func(t *lua.LTable, key string) Pos {
		if t != nil {
			if n, ok := t.RawGetString("name").(lua.LString); ok {
				if p := r.entryPos(pos, string(n)); p != pos {
					return p
				}
			}
		}
		if key != "" {
			return r.entryPos(pos, "="+key)
		}
		return pos
	}
	named := func(t *lua.LTable, def string) *lua.LTable {
		return r.copyTable(t, def, map[string]string{"name": def})
	}

	muPos, hwPos, fpPos := at(makeup, "makeup"), at(hotwell, "hotwell"), at(pump, "feed_pump")
	r.addUnit(ph, "makeup", named(makeup, "makeup"), muPos, nil)
	hw := named(hotwell, "hotwell")
	hwName := r.addUnit(ph, "feed_tank", hw, hwPos, nil)
	// Returns go to the hotwell, or through an observation tank draining
	// to it.
	returnTo := hwName
	if obs != nil {
		obsPos := at(obs, "observation_tank")
		if on := r.addUnit(ph, "observation_tank", named(obs, "observation tank"), obsPos, nil); on != "" {
			line(obsPos, on+" drain", on+".out", hwName+".in")
			returnTo = on
		}
	}
	var boilerNames []string
	for _, b := range boilers {
		if n, ok := b.RawGetString("name").(lua.LString); ok {
			boilerNames = append(boilerNames, string(n))
		}
	}
	fp := named(pump, "feed pump")
	if fp.RawGetString("boilers") == lua.LNil {
		bl := r.L.NewTable()
		for _, n := range boilerNames {
			bl.Append(lua.LString(n))
		}
		fp.RawSetString("boilers", bl)
	}
	fpName := r.addUnit(ph, "feed_pump", fp, fpPos, nil)
	fh := r.addUnit(ph, "header", named(nil, "feed header"), fpPos, nil)
	line(muPos, "makeup", "makeup.out", hwName+".in")
	line(hwPos, "feed suction", hwName+".out", fpName+".in")
	line(fpPos, "feed discharge", fpName+".out", fh+".in")

	if len(headers) == 0 {
		headers = []*lua.LTable{named(nil, "main")}
	}
	var main string
	for i, h := range headers {
		var p lua.LValue
		hPos := at(h, "")
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
			main = hn
			continue
		}
		if p == lua.LNil {
			continue
		}
		prv := r.L.NewTable()
		prv.RawSetString("name", lua.LString("PRV "+hn))
		prv.RawSetString("p", p)
		pn := r.addUnit(ph, "reducing_valve", prv, hPos, nil)
		line(hPos, "to "+pn, main+".out", pn+".in")
		line(hPos, "from "+pn, pn+".out", hn+".in")
	}
	// Economisers sit on the feed line of their boiler.
	ecoOf := map[string]string{}
	for _, e := range economisers {
		ePos := at(e, "")
		var boiler string
		en := r.addUnit(ph, "economiser", e, ePos, nil)
		if u, ok := ph.p.Component(en).(*plant.Economiser); ok {
			boiler = u.Boiler
		}
		if en == "" {
			continue
		}
		if !contains(boilerNames, boiler) {
			continue // the plant reports the unknown boiler
		}
		if prev, dup := ecoOf[boiler]; dup {
			r.errs = append(r.errs, &Error{Pos: ePos, Unit: fmt.Sprintf("economiser %q", en), Msg: fmt.Sprintf("boiler %q already has the economiser %q; the short form takes one per boiler", boiler, prev)})
			continue
		}
		ecoOf[boiler] = en
		line(ePos, "feed "+en, fh+".out", en+".in")
	}
	for _, b := range boilers {
		bPos := at(b, "")
		bn := r.addUnit(ph, "boiler", b, bPos, nil)
		if en, ok := ecoOf[bn]; ok && bn != "" {
			line(bPos, "feed "+bn, en+".out", bn+".feed")
		} else {
			line(bPos, "feed "+bn, fh+".out", bn+".feed")
		}
		line(bPos, "steam "+bn, bn+".steam", main+".in")
	}
	if ege != nil {
		ePos := at(ege, "exhaust_gas_economiser")
		en := r.addUnit(ph, "exhaust_gas_economiser", named(ege, "EGE"), ePos, nil)
		if en != "" {
			line(ePos, "feed "+en, fh+".out", en+".feed")
			line(ePos, "steam "+en, en+".steam", main+".in")
		}
		dPos := ePos
		if dump != nil {
			dPos = at(dump, "dump_condenser")
		}
		dc := r.copyTable(named(dump, "dump condenser"), "dump_condenser", map[string]string{"subcool": defaultDumpSubcool})
		dc.RawSetString("dump", lua.LTrue)
		dn := r.addUnit(ph, "condenser", dc, dPos, nil)
		if dn != "" {
			line(dPos, "to "+dn, main+".out", dn+".in")
			line(dPos, "condensate of "+dn, dn+".out", hwName+".in")
		}
	}
	if hw.RawGetString("set_T") != lua.LNil {
		line(hwPos, "hotwell heating", main+".out", hwName+".steam")
	}
	header := func(a *args) string {
		h, ok := a.str("header", false)
		if !ok {
			return main
		}
		return h
	}
	for _, c := range consumers {
		var hn string
		cPos := at(c, "")
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
			hn = header(a)
			a.get("kind")
		})
		if cn == "" {
			continue
		}
		line(cPos, "steam to "+cn, hn+".out", cn+".in")
		if cu, ok := ph.p.Component(cn).(*plant.Consumer); ok && cu.ReturnFraction > 0 {
			line(cPos, "return from "+cn, cn+".out", returnTo+".in")
		}
	}
	for _, tt := range turbines {
		var hn string
		var cond *lua.LTable
		kind := "turbine"
		if k, ok := tt.RawGetString("kind").(lua.LString); ok && k == "cargo_pump" {
			kind = "cargo_pump"
		}
		tPos := at(tt, "")
		tn := r.addUnit(ph, kind, tt, tPos, func(a *args) {
			hn = header(a)
			cond = r.subTable(a, "condenser")
			if k, ok := a.str("kind", false); ok && k != kind {
				a.errorf(nil, "kind of a turbine must be \"turbine\" or \"cargo_pump\"; got %q", k)
			}
		})
		if tn == "" {
			continue
		}
		cn := r.addUnit(ph, "condenser", named(cond, tn+" condenser"), tPos, nil)
		line(tPos, fmt.Sprintf("steam to %s", tn), hn+".out", tn+".in")
		line(tPos, fmt.Sprintf("exhaust of %s", tn), tn+".out", cn+".in")
		line(tPos, fmt.Sprintf("condensate of %s", tn), cn+".out", hwName+".in")
	}
	L.Push(ud)
	return 1
}
