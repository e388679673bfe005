// Package profile runs a plant through many load cases: a voyage plan (one
// row per period, with its phase and hours), a designer's comparison of
// plant variants over a year's operating profile (with and without an
// exhaust-gas economiser, or of other sizes, each with its installed cost;
// savings at a fuel and a carbon price, simple payback and NPV over a life
// by the annuity factor; a sweep of an economiser's UA or pinch costed by a
// six-tenths-rule law, the best size the one of highest NPV; the hours at
// soot-risk loads and near the acid dew point), and an auditor's check
// of claimed daily boiler fuel against a modelled band found by Monte
// Carlo sampling of the uncertain inputs.
//
// Rows run on all cores, each worker on its own clone of the plant. The
// work is cut into pieces that do not depend on the number of workers
// (chunks of consecutive rows, warm-started within the chunk; whole audit
// days), so the output with one worker and with many is identical.
//
// Totals are sums of the rows' results times their hours: fuel, CO2 and
// steam in tonnes, electrical energy in MWh.
package profile
