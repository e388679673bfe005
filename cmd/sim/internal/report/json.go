package report

import (
	"encoding/json"
	"io"

	"steamcase/plant"
)

// document is the JSON form of a run; see the package doc for the schema.
type document struct {
	Schema  int          `json:"schema"`
	Caution string       `json:"caution"`
	Plant   *plantJSON   `json:"plant"`
	Cases   []caseJSON   `json:"cases"`
	Voyages []voyageJSON `json:"voyages"`
	Studies []studyJSON  `json:"studies"`
	Audits  []auditJSON  `json:"audits"`
}

type plantJSON struct {
	Name string `json:"name"`
}

// caseJSON is plant.CaseJSON with the plant's name and the script
// position in front.
type caseJSON struct {
	Plant  string `json:"plant"`
	Source string `json:"source"`
	plant.CaseJSON
}

// JSON writes the run as one JSON document, indented, in the schema the
// package doc describes.
func JSON(w io.Writer, run Run) error {
	doc := document{Schema: plant.SchemaVersion, Caution: Caution, Cases: []caseJSON{},
		Voyages: []voyageJSON{}, Studies: []studyJSON{}, Audits: []auditJSON{}}
	var plants []string
	for _, c := range run.Cases {
		doc.Cases = append(doc.Cases, caseJSON{Plant: c.Plant, Source: c.Result.Pos.String(), CaseJSON: c.Result.JSON()})
		plants = append(plants, c.Plant)
	}
	for _, v := range run.Voyages {
		doc.Voyages = append(doc.Voyages, voyageOf(v))
		plants = append(plants, v.Plant)
	}
	for _, s := range run.Studies {
		doc.Studies = append(doc.Studies, studyOf(s))
		plants = append(plants, s.Plant)
	}
	for _, a := range run.Audits {
		doc.Audits = append(doc.Audits, auditOf(a))
		plants = append(plants, a.Plant)
	}
	for i, p := range plants {
		if i == 0 {
			doc.Plant = &plantJSON{Name: p}
		} else if p != plants[0] {
			doc.Plant = nil // several plants: each case and job names its own
			break
		}
	}
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(doc)
}
