package report

import (
	"encoding/json"
	"io"

	"steamcase/plant"
)

// document is the JSON form of a run; see the package doc for the schema.
type document struct {
	Schema  int        `json:"schema"`
	Caution string     `json:"caution"`
	Plant   *plantJSON `json:"plant"`
	Cases   []caseJSON `json:"cases"`
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

// JSON writes the cases as one JSON document, indented, in the schema the
// package doc describes.
func JSON(w io.Writer, cases []Case) error {
	doc := document{Schema: plant.SchemaVersion, Caution: Caution, Cases: []caseJSON{}}
	for i, c := range cases {
		doc.Cases = append(doc.Cases, caseJSON{Plant: c.Plant, Source: c.Result.Pos.String(), CaseJSON: c.Result.JSON()})
		if i == 0 {
			doc.Plant = &plantJSON{Name: c.Plant}
		} else if c.Plant != cases[0].Plant {
			doc.Plant = nil // several plants: each case names its own
		}
	}
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(doc)
}
