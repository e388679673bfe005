package plant

// Assumption is a default in force on a plant: a key of a unit that the
// description leaves at its default, what the default is and where it
// comes from, as the key registry declares them (Key.DefaultText,
// Key.Source).
type Assumption struct {
	Unit  string // the unit's name
	Kind  string // its kind ("oil-fired boiler")
	Key   string // the key's name as scripts write it ("blowdown")
	Label string // the key's label ("blowdown fraction")
	Value string // the default in words or in the key's unit ("0 %", "no drain cooler")
	// Source is where the default comes from, as the registry says; ""
	// when the registry records none.
	Source string
}

// Defaults lists the defaults in force on the plant as described (not as
// a load case changes it), unit by unit in declaration order and key by
// key in each unit's order: every key with a default (Key.HasDefault or
// Key.DefaultNote) whose field holds zero, the registry's mark of a key
// not given. A key whose default is zero is listed whether it was left
// out or given as zero: either way the default is what holds. Switches
// that say whether a unit runs ("off") are the state of a case, not an
// assumption, and are left out; so are keys that a unit reads from a
// table (a boiler's efficiency), which have no default.
func (p *Plant) Defaults() []Assumption {
	var out []Assumption
	for _, c := range p.comps {
		b := c.Ident()
		for _, k := range c.Keys() {
			if k.Name == "off" || (!k.HasDefault && k.DefaultNote == "") {
				continue
			}
			v, ok := k.Get(c)
			if !ok || v != 0 {
				continue
			}
			out = append(out, Assumption{Unit: b.Name, Kind: c.Kind(), Key: k.Name, Label: k.Label,
				Value: k.DefaultText(), Source: k.Source})
		}
	}
	return out
}
