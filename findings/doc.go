// Package findings turns assessed samples, their saturation intervals
// (package uncertainty) and their trends into what an engineer writes in a
// report: which minerals the water is supersaturated with, with
// confidence, where, since when, how strongly and whether it is getting
// worse; which are near equilibrium; which are undersaturated everywhere;
// and the water types.
//
// Trends tests every well's series, each mineral's saturation index and
// the major analytes (TrendAnalytes, in mg/L), with the Mann-Kendall test
// and the Sen slope (package trend). The time axis of a well is decimal
// years when all its samples are dated, else its sampling rounds (an
// ordinal axis). A well needs MinEvents (4) sampling events; with fewer it
// is reported as having too few events, not as an error. A saturation index
// rising significantly is flagged as moving toward deposition: toward
// saturation when still below zero, further into supersaturation above it.
//
// Build groups samples by cluster (an input column, DefaultClusterColumn
// "Cluster") and depth zone (assess.DepthM: the sample depth or the middle
// of the screen; zones at given edges, or split where the depths leave a
// gap wider than a quarter of their range and at least 10 m, common
// practice for nested monitoring wells), and gives one Row per mineral and
// group: how many samples are supersaturated with confidence (the verdict
// of package uncertainty), at which wells, the median and highest SI as
// measured, the first and last event supersaturated, and the SI trend.
// Findings.Lines words them: one sentence per mineral supersaturated with
// confidence; minerals that are supersaturated but slow to form at aquifer
// temperatures (SlowMinerals) in one line; minerals near equilibrium in
// some samples; minerals undersaturated with confidence everywhere in one
// line; SIs rising significantly; water types; and the caution.
// Findings.Table is the same as findings.csv, TrendTable the trends.
//
// WaterType classifies a sample (package facies) from the analyses as
// reported, in meq/L; StiffFigures draws the latest sample of each well as
// Stiff diagrams (package figure) for a report page. DefaultMinerals
// chooses the minerals to map: the common scale minerals, iron and
// manganese oxides when the database has them, and every mineral
// supersaturated with confidence.
//
// Results are for screening, not a design: defer to local codes and
// licensed professionals.
package findings
