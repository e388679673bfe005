// Package profile runs a plant through many load cases: a voyage plan (one
// row per period, with its phase and hours), a designer's comparison of
// plant variants over a year's operating profile (with and without an
// exhaust-gas economiser, or of other sizes, each with its installed cost;
// savings at a fuel and a carbon price, simple payback and NPV over a life
// by the annuity factor; a sweep of an economiser's UA or pinch costed by a
// six-tenths-rule law, the best size the one of highest NPV; the hours at
// soot-risk loads and near the acid dew point), and an auditor's check
// of claimed daily fuel against the model (Audit).
//
// Rows run on all cores, each worker on its own clone of the plant. The
// work is cut into pieces that do not depend on the number of workers
// (chunks of consecutive rows, warm-started within the chunk; whole audit
// days), so the output with one worker and with many is identical.
//
// Totals are sums of the rows' results times their hours: fuel, CO2 and
// steam in tonnes, electrical energy in MWh.
//
// A row keeps its summary (RowSummary: what the totals and the reports
// read, a few hundred bytes) and its full case result only on request
// (Options.KeepResults), so that a job of hundreds of thousands of rows
// fits in memory; the totals are summed from the summaries in the same
// order and with the same operations as from the case results, and are
// the same either way. A study keeps its variants' rows only on request.
//
// # The audit
//
// An audit samples the uncertain inputs by Monte Carlo, each uniformly
// between its bounds (a rectangular distribution: all a bound with no
// other knowledge says; GUM, JCGM 100:2008 §4.3.7, from memory). An input
// is fixed (a property of the ship: drawn once per sample for the whole
// period) or daily (drawn afresh for each day of each sample); keys have
// a default scope (DefaultScope) and a script may give another. The
// period's total is sampled as a whole, the sum over the days within each
// sample, so that its band is a quantile of something and the share of
// samples at or below the claim is a probability (with its Monte Carlo
// standard error √(p(1−p)/n)). The claim's own measurement error (a flow
// meter's bias, soundings whose daily errors telescope, noon reports, a
// delivery note's density) is drawn with each sample: the claim is
// compared with what the measurement would read if the model were right.
// A day is flagged beyond α/(2N) in either tail of its readings
// (Bonferroni over the N days audited), the period beyond α/2.
// Quantiles interpolate between order statistics (Hyndman and Fan 1996,
// definition 7).
//
// For each day, an implied factor is the value of one uncertain factor
// (given to all its targets) that makes the model give the claim, the
// other inputs nominal: a bracket widened from the factor's plausible
// range within the key's own range, then Brent's method over the solved
// plant. A calibration sets a fixed factor on the reference days (their
// named units off) so that their nominal model gives their claim, and
// draws it for the audited days from the values that give the claim less
// and plus its measurement uncertainty. A cause's fuel is the day's fuel
// less its fuel with the cause's units off, at the nominal inputs (a
// marginal, with/without share); what the causes do not account for, the
// base load and their interaction, is reported apart and not shared out.
//
// Simplifications, named: the inputs are independent and uniform; the
// nominal inputs are the middles of their ranges; the implied factors
// and the calibration hold the other inputs at nominal; the calibrated
// range covers the reference days' measurement uncertainty only; days are
// consecutive in the order given for the telescoping of soundings and
// noon reports; the claim's sources' half-widths add linearly for the
// calibration (a bound, not a quadrature sum).
package profile
