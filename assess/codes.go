package assess

// Codes of the issues Run adds to a record (hydro.Issue.Code). They are stable:
// programs may rely on them; the messages may change wording.
const (
	CodeBalanceIncomplete = "balance-incomplete" // ions missing from the charge balance
	CodeBalanceFail       = "balance-fail"       // Standard Methods 1030 E criterion failed
	CodeBalanceWarn       = "balance-warn"       // outside the criterion, within twice it
	CodeTDSRatio          = "tds-ratio"          // measured/calculated TDS outside 1.0-1.2
	CodeNoPH              = "no-ph"              // no pH: not speciated
	CodeLabPH             = "lab-ph"             // lab pH used
	CodeNoTemp            = "no-temperature"     // speciated at DefaultTempC
	CodeSolveFailed       = "solve-failed"       // the speciation did not converge
	CodeBalanceClosed     = "balance-closed"     // a total adjusted to close the charge balance
	CodeIonicStrength     = "beyond-model"       // ionic strength beyond the activity model's range
	CodeSolverNote        = "solver-note"        // other notes of the solver
	CodeNoCarbonate       = "no-carbonate"       // carbonate minerals not computed
	CodeSpeciatedBalance  = "speciated-balance"  // charge balance after speciation beyond 10 %
	CodeIndicesRange      = "indices-range"      // Langelier/Ryznar outside their range
	CodePosition          = "position-unusable"  // coordinates reported but not usable
)
