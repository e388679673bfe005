package report

import (
	"bytes"
	"encoding/csv"
	"testing"
	"unicode/utf8"
)

// FuzzCSVNames gives the jobs, phases, variants and dates names with
// commas, quotes, newlines and blank lines in them, and reads the stream
// back: every record is a header ("table" first) or a row of a named
// table, and the names come back as they were.
func FuzzCSVNames(f *testing.F) {
	for _, s := range []string{"plain", "a,b", `say "x"`, "two\nlines", "blank\n\nline", "", "table"} {
		f.Add(s, s+"!")
	}
	run := profileRun(f)
	f.Fuzz(func(t *testing.T, name, other string) {
		if !utf8.ValidString(name) || !utf8.ValidString(other) {
			return // encoding/csv passes bytes through; the names of a run are text
		}
		r := run
		v, s, a := r.Voyages[0], r.Studies[0], r.Audits[0]
		v.Name, s.Name, a.Name = name, other, name
		vr := *v.Result
		vr.Rows = append(vr.Rows[:0:0], vr.Rows...)
		vr.Rows[0].Phase = other
		v.Result = &vr
		sr := *s.Result
		sr.Variants = append(sr.Variants[:0:0], sr.Variants...)
		sr.Variants[1].Name = name
		s.Result = &sr
		r.Voyages, r.Studies, r.Audits = []Voyage{v}, []Study{s}, []Audit{a}
		var b bytes.Buffer
		if err := CSV(&b, r); err != nil {
			t.Fatal(err)
		}
		cr := csv.NewReader(&b)
		cr.FieldsPerRecord = -1
		recs, err := cr.ReadAll()
		if err != nil {
			t.Fatalf("the stream does not read back: %v\n%s", err, b.String())
		}
		found := map[string]bool{}
		for _, rec := range recs {
			switch rec[0] {
			case tableColumn:
			case TableVoyage:
				found["voyage"] = found["voyage"] || rec[1] == name
				if rec[2] == "1" && rec[4] != other {
					t.Errorf("phase %q read back as %q", other, rec[4])
				}
			case TableVoyageWarn:
				found["warning"] = found["warning"] || rec[1] == name
			case TableStudy:
				found["study"] = found["study"] || rec[1] == other
				found["variant"] = found["variant"] || rec[2] == name
			case TableAudit:
				found["audit"] = found["audit"] || rec[1] == name
			case TableStudyWarn:
				if rec[1] != other || (rec[2] != name && rec[2] != s.Result.Variants[0].Name) {
					t.Errorf("study warnings: %q", rec)
				}
			case TableAuditPer, TableImplied, TableShares, TableGrades, TableAuditWarn:
				if rec[1] != name {
					t.Errorf("%s: audit %q read back as %q", rec[0], name, rec[1])
				}
			default:
				t.Fatalf("a record of no table: %q", rec)
			}
		}
		if len(found) != 5 || !found["voyage"] || !found["warning"] || !found["study"] || !found["variant"] || !found["audit"] {
			t.Errorf("names lost: %v", found)
		}
	})
}
