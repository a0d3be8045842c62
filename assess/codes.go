package assess

import "gwsat.dev/gwsat/hydro"

// Codes of the issues Run adds to a record (hydro.Issue.Code). They are stable:
// programs may rely on them; the messages may change wording.
const (
	CodeBalanceIncomplete hydro.Code = "balance-incomplete"     // ions missing from the charge balance
	CodeBalanceFail       hydro.Code = "balance-fail"           // Standard Methods 1030 E criterion failed
	CodeBalanceWarn       hydro.Code = "balance-warn"           // outside the criterion, within twice it
	CodeTDSRatio          hydro.Code = "tds-ratio"              // measured/calculated TDS outside 1.0-1.2
	CodeNoPH              hydro.Code = "no-ph"                  // no pH: not speciated
	CodeLabPH             hydro.Code = "lab-ph"                 // lab pH used
	CodeNoTemp            hydro.Code = "no-temperature"         // speciated at DefaultTempC
	CodeSolveFailed       hydro.Code = "solve-failed"           // the speciation did not converge
	CodeBalanceClosed     hydro.Code = "balance-closed"         // a total adjusted to close the charge balance
	CodeIonicStrength     hydro.Code = "beyond-model"           // ionic strength beyond the activity model's range
	CodeSolverNote        hydro.Code = "solver-note"            // other notes of the solver
	CodeNoCarbonate       hydro.Code = "no-carbonate"           // carbonate minerals not computed
	CodeSpeciatedBalance  hydro.Code = "speciated-balance"      // charge balance after speciation beyond 10 %
	CodeIndicesRange      hydro.Code = "indices-range"          // Langelier/Ryznar outside their range
	CodeTempRange         hydro.Code = "outside-data-range"     // SIs computed outside their data's temperature range
	CodeNoRedox           hydro.Code = "no-redox"               // no pe: oxide and sulfide SIs not computed
	CodePressureRange     hydro.Code = "outside-pressure-range" // SIs computed beyond their data's pressure range
	CodeNoPressureData    hydro.Code = "no-pressure-data"       // at a pressure, SIs of minerals without pressure data
	CodeNoDepth           hydro.Code = "no-depth"               // hydrostatic pressure asked for, but the row has no depth
	CodePosition          hydro.Code = "position-unusable"      // coordinates reported but not usable
)
