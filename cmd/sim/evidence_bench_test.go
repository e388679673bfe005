package main

import (
	"bytes"
	"context"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// BenchmarkEvidenceAudit30Days runs sim run --evidence on an audit of 30
// days with 1000 samples, fixed and daily inputs, the flow meter's
// uncertainty, two implied factors and a split, on the scenarios'
// invented tanker: the whole command, from reading the script to the
// folder written. The target is 10 s on two cores. It reports the
// wall time (ns/op) and the CPU seconds the process used (cpu-s/op, user
// and system, from getrusage on unix), which a loaded machine does not
// inflate as it does the wall time.
func BenchmarkEvidenceAudit30Days(b *testing.B) {
	dir := b.TempDir()
	plant, err := os.ReadFile(filepath.Join("..", "..", "scenarios", "tanker_plant.lua"))
	if err != nil {
		b.Fatal(err)
	}
	var log strings.Builder
	log.WriteString("date,phase,sea,air,engine,claimed\n")
	for d := 0; d < 30; d++ {
		fmt.Fprintf(&log, "2026-03-%02d,loaded passage,%d C,%d C,78 %%,%.1f t\n", d+1, 6+d%5, -3+d%7, 9.5+0.1*float64(d%6))
	}
	script := `local ship = include("tanker_plant.lua")
audit(ship, { name = "March", csv = "log.csv",
  uncertain = {
    { unit = "cargo heating", key = "factor", low = 0.8, high = 1.2 },
    { unit = "AB1", key = "eta_factor", low = 0.965, high = 1.02 },
    { unit = "AB2", key = "eta_factor", low = 0.965, high = 1.02 },
    { key = "sea", low = "-1 K", high = "1 K" },
    { key = "air", low = "-2 K", high = "2 K" },
    { unit = "galley and sundry", key = "duty", low = "40 kW", high = "80 kW" } },
  claim = { source = "flow meter" },
  implied = { { unit = "cargo heating", key = "factor" }, { units = { "AB1", "AB2" }, key = "eta_factor" } },
  split = { { name = "cargo heating", units = { "cargo heating" } } },
  samples = 1000, seed = 1 })
`
	for name, body := range map[string]string{"tanker_plant.lua": string(plant), "log.csv": log.String(), "audit.lua": script} {
		if err := os.WriteFile(filepath.Join(dir, name), []byte(body), 0o644); err != nil {
			b.Fatal(err)
		}
	}
	var cpu float64
	n := 0
	for b.Loop() {
		out := filepath.Join(b.TempDir(), "evidence")
		c0 := cpuSeconds()
		var stdout, stderr bytes.Buffer
		code := run(context.Background(), []string{"run", "--quiet", "--timeout", "10m", "--evidence", out, filepath.Join(dir, "audit.lua")}, &stdout, &stderr)
		cpu += cpuSeconds() - c0
		n++
		if code != exitOK {
			b.Fatalf("exit %d: %s", code, stderr.String())
		}
	}
	b.ReportMetric(cpu/float64(n), "cpu-s/op")
	b.ReportMetric(30*1000, "samples/op")
}
