package main

import (
	"os"
	"path/filepath"
	"testing"
)

// TestByteOrderMark checks that a UTF-8 byte-order mark at the start of a
// CSV (spreadsheets write one) or of a script is skipped: the first
// column is "phase", not "\ufeffphase", and the script runs.
func TestByteOrderMark(t *testing.T) {
	t.Parallel()
	dir := t.TempDir()
	const bom = "\xEF\xBB\xBF"
	files := map[string]string{
		"plant.lua":  badPlant,
		"rows.csv":   bom + "phase,hours\r\nport,12\r\n",
		"voyage.csv": bom + "phase,hours,sea,air\nport,12,14 C,9 C\n",
		"s.lua": bom + "local rows = read_csv(\"rows.csv\")\n" +
			"check(rows[1].phase == \"port\" and rows[1].hours == \"12\", \"the header's first name is phase\")\n" +
			"local ship = include(\"plant.lua\")\n" +
			"local v = voyage(ship, { name = \"v\", csv = \"voyage.csv\" })\n" +
			"check(v.total.hours == 12, \"the voyage reads its phase column\")\n",
	}
	for name, content := range files {
		if err := os.WriteFile(filepath.Join(dir, name), []byte(content), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	code, out, errOut := runSim(t, "run", "--quiet", filepath.Join(dir, "s.lua"))
	if code != exitOK || errOut != "" || out == "" {
		t.Errorf("exit %d, stderr %q", code, errOut)
	}
}
