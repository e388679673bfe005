package report

import (
	"encoding/json"
	"io"

	"steamcase/plant/schema"
)

// Document returns the run in the form of package plant/schema: every case
// and job in its schema form, the plants, the checks, the program's
// version and the caution.
func Document(run Run) schema.Document {
	doc := schema.Document{Version: run.Version, Caution: Caution, Checks: run.Checks, LuaSeed: run.LuaSeed}
	for _, f := range run.Files {
		doc.FilesRead = append(doc.FilesRead, schema.FileRead{File: f.Name, Bytes: f.Bytes, SHA256: f.SHA256})
	}
	for _, a := range run.Assumptions {
		doc.Assumptions = append(doc.Assumptions, schema.Assumption{Plant: a.Plant, Unit: a.Unit, Kind: a.Kind,
			Key: a.Key, Label: a.Label, Value: a.Value, Source: a.Source})
	}
	for _, c := range run.Cases {
		doc.Cases = append(doc.Cases, schema.NewCase(c.Plant, c.Result))
	}
	for _, v := range run.Voyages {
		doc.Voyages = append(doc.Voyages, schema.NewVoyage(v.schemaJob(), v.Result))
	}
	for _, s := range run.Studies {
		doc.Studies = append(doc.Studies, schema.NewStudy(s.schemaJob(), s.Result))
	}
	for _, a := range run.Audits {
		doc.Audits = append(doc.Audits, schema.NewAudit(a.schemaJob(), a.Result))
	}
	for _, h := range run.HeatingPlans {
		if h.Result != nil {
			doc.HeatingPlans = append(doc.HeatingPlans, schema.NewHeatingPlan(h.schemaJob(), h.Result))
		}
	}
	doc.Finish()
	return doc
}

// JSON writes the run as one JSON document, indented, in the schema of
// package plant/schema.
func JSON(w io.Writer, run Run) error {
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(Document(run))
}
