package schema

// Version is the version of the schema: the "schema" key of the run
// document. It changes when a key is removed or changes its meaning; keys
// may be added without a change. The package documentation lists what
// each version changed.
const Version = 3

// Document is the JSON form of a run: what the scripts solved, in the
// order they solved it, with the program's version, the safety caution,
// the plants and the outcome of the scripts' check() calls, and the
// record of what the run read and assumed.
type Document struct {
	Schema      int          `json:"schema"`
	Version     string       `json:"version"`
	Caution     string       `json:"caution"`
	FilesRead   []FileRead   `json:"files_read"`
	LuaSeed     uint64       `json:"lua_seed"`
	Assumptions []Assumption `json:"assumptions"`
	Plants      []Plant      `json:"plant"`
	Checks      Checks       `json:"checks"`
	Cases       []Case       `json:"cases"`
	Voyages     []Voyage     `json:"voyages"`
	Studies     []Study      `json:"studies"`
	Audits      []Audit      `json:"audits"`
	// HeatingPlans are the jobs of heating_plan(), in the order run.
	HeatingPlans []HeatingPlan `json:"heating_plans"`
}

// FileRead is a script or data file a run read, and the SHA-256 of its
// bytes, in hexadecimal.
type FileRead struct {
	File   string `json:"file"`
	Bytes  int    `json:"bytes"`
	SHA256 string `json:"sha256"`
}

// Assumption is a default in force on a plant the run solved on: a key of
// a unit that the description left at its default, the default and its
// source as the key registry gives them ("" when it records none).
type Assumption struct {
	Plant  string `json:"plant"`
	Unit   string `json:"unit"`
	Kind   string `json:"kind"`
	Key    string `json:"key"`
	Label  string `json:"label"`
	Value  string `json:"value"`
	Source string `json:"source"`
}

// Plant names a plant the run solved cases or jobs on.
type Plant struct {
	Name string `json:"name"`
}

// Checks is the outcome of the scripts' check() calls: how many passed,
// and the one that failed, if any (a failed check ends its run, so the
// list holds at most one today; it is a list so that a run that goes on
// after a failure could report each).
type Checks struct {
	Passed int            `json:"passed"`
	Failed []CheckFailure `json:"failed"`
}

// CheckFailure is a check() that failed: where ("file:line") and its
// message.
type CheckFailure struct {
	Pos     string `json:"pos"`
	Message string `json:"message"`
}

// Finish makes d ready to write: it sets Schema to Version, lists in
// Plants every plant the cases and jobs name, in the order they first
// appear, and turns every nil list into an empty one, so that the
// document has no null where a list is documented.
func (d *Document) Finish() {
	d.Schema = Version
	seen := map[string]bool{}
	d.Plants = []Plant{}
	add := func(name string) {
		if !seen[name] {
			seen[name] = true
			d.Plants = append(d.Plants, Plant{Name: name})
		}
	}
	for _, c := range d.Cases {
		add(c.Plant)
	}
	for _, v := range d.Voyages {
		add(v.Plant)
	}
	for _, s := range d.Studies {
		add(s.Plant)
	}
	for _, a := range d.Audits {
		add(a.Plant)
	}
	for _, h := range d.HeatingPlans {
		add(h.Plant)
	}
	if d.FilesRead == nil {
		d.FilesRead = []FileRead{}
	}
	if d.Assumptions == nil {
		d.Assumptions = []Assumption{}
	}
	if d.Checks.Failed == nil {
		d.Checks.Failed = []CheckFailure{}
	}
	if d.Cases == nil {
		d.Cases = []Case{}
	}
	if d.Voyages == nil {
		d.Voyages = []Voyage{}
	}
	if d.Studies == nil {
		d.Studies = []Study{}
	}
	if d.Audits == nil {
		d.Audits = []Audit{}
	}
	if d.HeatingPlans == nil {
		d.HeatingPlans = []HeatingPlan{}
	}
}
