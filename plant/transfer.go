package plant

// Heat and water that one component passes to another without a line of
// the graph: a drain cooler's heat to the boiler feed (a feed-water heater
// on the return, at the feed pump) or to the hotwell, and a header's trap
// drains to the hotwell. The source computes the flow and its partial
// derivatives; the receiver adds them to its balance. The receivers are
// the plant's first feed pump and its first feed tank that is not an
// observation tank, found by the source's link.

// partial is the derivative of a transferred flow by one unknown: dm of
// its mass flow, kg/s, and de of its energy flow, W.
type partial struct {
	col    int
	dm, de float64
}

// transfer is a source of water (m, kg/s) carrying the energy e (W), or of
// heat alone (m = 0).
type transfer interface {
	// transferred gives the flow at the present unknowns and, with
	// partials, its derivatives by up to three unknowns (col −1 for none;
	// without partials d is left empty, so that a residual does not pay
	// for them).
	transferred(ev *eval, partials bool) (m, e float64, d [3]partial, err error)
	// transferDeps lists the unknowns the flow depends on.
	transferDeps() []int
}

// firstFeedPump returns the plant's first feed pump, or nil.
func (p *Plant) firstFeedPump() *FeedPump {
	for _, c := range p.comps {
		if u, ok := c.(*FeedPump); ok {
			return u
		}
	}
	return nil
}

// firstFeedTank returns the plant's first feed tank that is not an
// observation tank, or nil.
func (p *Plant) firstFeedTank() *FeedTank {
	for _, c := range p.comps {
		if u, ok := c.(*FeedTank); ok && !u.Observation {
			return u
		}
	}
	return nil
}

// sumTransfers adds the flows of ts at the present unknowns.
func sumTransfers(ev *eval, ts []transfer) (m, e float64, err error) {
	for _, t := range ts {
		mi, ei, _, err := t.transferred(ev, false)
		if err != nil {
			return 0, 0, err
		}
		m += mi
		e += ei
	}
	return m, e, nil
}
