package plant

// Clone returns an independent copy of the plant: the same units with the
// same parameters and the same lines, ready to solve in another goroutine.
// Parameters that are pointers or interfaces (efficiency models, duty
// models, fuels) are shared, and must not be changed while clones solve;
// the plant package never changes them.
func (p *Plant) Clone() *Plant {
	c := New(p.Name, p.Opt)
	c.Pos = p.Pos
	for _, u := range p.units {
		// Add cannot fail: the names were unique in p.
		_ = c.Add(u.clone())
	}
	for _, l := range p.lines {
		c.Connect(l.Name, l.Pos, l.From, l.FromPort, l.To, l.ToPort)
	}
	return c
}

func (u *MakeUp) clone() Unit   { c := *u; return &c }
func (u *FeedTank) clone() Unit { c := *u; c.ins = nil; return &c }
func (u *FeedPump) clone() Unit {
	c := *u
	c.Boilers = append([]string(nil), u.Boilers...)
	return &c
}
func (u *Header) clone() Unit {
	c := *u
	c.ins, c.outs, c.eqP, c.eqH = nil, nil, nil, nil
	return &c
}
func (u *ReducingValve) clone() Unit { c := *u; return &c }
func (u *Consumer) clone() Unit      { c := *u; return &c }
func (u *Turbine) clone() Unit       { c := *u; return &c }
func (u *Condenser) clone() Unit     { c := *u; return &c }
func (u *Boiler) clone() Unit        { c := *u; c.effSet = false; return &c }
func (u *Economiser) clone() Unit    { c := *u; c.b = nil; return &c }
func (u *ExhaustGasEconomiser) clone() Unit {
	c := *u
	c.op = egeOperation{}
	return &c
}
