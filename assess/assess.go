package assess

import (
	"context"
	"errors"
	"fmt"
	"math"
	"strings"

	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

// AutoModelSwitch is the ionic strength (mol/kgw) above which the automatic model
// choice solves a row with Pitzer's equations instead of Truesdell-Jones: at 0.5
// mol/kg the extended Debye-Hueckel forms begin to depart from measured mean
// activity coefficients (Davies is 7.7 % low for NaCl there; Robinson & Stokes
// 1959 tables), while over random waters the sulfate SIs of the two models still
// agree within 0.1 up to I = 1 (measured in the brine tests of package speciation).
const AutoModelSwitch = 0.5

// DefaultTempC is the temperature assumed for a sample reported without one
// (25 C, the reference temperature of the data; common practice). The row
// gets a warning when it is used.
const DefaultTempC = 25.0

// IncompleteBalanceLimitPct and SpeciatedBalanceLimitPct are the charge
// balances beyond which a row is marked warning when Standard Methods 1030 E
// cannot judge it: an analysis with ions missing, and the balance after
// speciation, which also counts H+ and OH- (10 %, common practice).
const (
	IncompleteBalanceLimitPct = 10.0
	SpeciatedBalanceLimitPct  = 10.0
)

// Options control Run.
type Options struct {
	// Model is the activity model; nil chooses per row by ionic strength (see
	// AutoModelSwitch): Truesdell-Jones for fresh and brackish water, Pitzer for
	// brines. The model used is recorded in every result.
	Model speciation.ActivityModel
	// BalanceOn names a component (e.g. "Cl-", "Na+") whose total is
	// adjusted so that the speciated water is electrically neutral; "" for
	// none.
	BalanceOn string
	// Workers is the number of goroutines solving (default GOMAXPROCS).
	Workers int
	// Progress, when not nil, is called after each record is done (from one
	// goroutine at a time).
	Progress func()
	// ORPReference names the reference electrode of ORP readings (e.g.
	// "Ag/AgCl sat KCl"; see speciation.ParseReferenceElectrode); "" leaves ORP
	// unused.
	ORPReference string
	// Detail keeps every species and the distribution of each component in
	// the results (for JSON output and the species view). Without it only
	// the summary quantities are kept (ionic strength, SIs, indices...),
	// which keeps memory small on large files.
	Detail bool
	// PressureBar is the absolute pressure in bar at which rows without a
	// Pressure column are speciated; 0 means 1 bar (no pressure correction).
	// Hydrostatic instead puts each such row at the pressure of a fresh-water
	// column above its depth (speciation.HydrostaticPressureBar of DepthM:
	// common practice); a row without a depth stays at 1 bar, with a note.
	PressureBar float64
	Hydrostatic bool
}

// Record is one input row with everything computed for it.
type Record struct {
	File string
	Row  hydro.Row

	Water   hydro.Water
	Balance hydro.Balance
	// Result is the speciation, nil when the row was rejected, could not
	// be speciated (no pH) or the solve failed (SolveError says why).
	Result     *speciation.Result
	SolveError string
	// PHAdjusted is set when a charge-balance adjustment was asked for.
	Adjusted string
	// PressureBar is the absolute pressure the row was speciated at, bar; 0
	// for 1 bar (no pressure given).
	PressureBar float64
	// PESource says where the pe came from ("O2/H2O", "Eh", "ORP"...), "" when
	// the water was solved without one.
	PESource string

	// Status and Issues are the final verdict: the reader's, the unit
	// conversion's, the charge balance's, the position check's and the
	// solver's findings together, typed (see the Code constants).
	Status hydro.Status
	Issues []hydro.Issue
}

// Reasons renders the issues as text, one per issue ("warning: ...").
func (r *Record) Reasons() []string {
	out := make([]string, len(r.Issues))
	for i, is := range r.Issues {
		out[i] = is.String()
	}
	return out
}

// FirstProblem returns the first warning or error of the record as text,
// else its first issue, else "".
func (r *Record) FirstProblem() string {
	for _, is := range r.Issues {
		if is.Severity >= hydro.Warning {
			return is.String()
		}
	}
	if len(r.Issues) > 0 {
		return r.Issues[0].String()
	}
	return ""
}

// Sample returns the record's sample.
func (r *Record) Sample() *hydro.Sample { return &r.Row.Sample }

// Run assesses every row of the batches, in order. It returns one record per
// row; the error is only for a cancelled context.
func Run(ctx context.Context, db *speciation.Database, batches []*hydro.Batch, opt Options) ([]Record, error) {
	n := 0
	for _, b := range batches {
		n += len(b.Rows)
	}
	recs := make([]Record, 0, n)
	err := Stream(ctx, db, BatchItems(batches), opt, func(r *Record) error {
		recs = append(recs, *r)
		return nil
	})
	return recs, err
}

// worse returns the more severe of two statuses.
func worse(a, b hydro.Status) hydro.Status {
	rank := map[hydro.Status]int{hydro.StatusOK: 0, hydro.StatusWarning: 1, hydro.StatusRejected: 2}
	if rank[b] > rank[a] {
		return b
	}
	return a
}

// statusOf is the row status an issue of a severity leads to.
func statusOf(sev hydro.Severity) hydro.Status {
	switch sev {
	case hydro.Error:
		return hydro.StatusRejected
	case hydro.Warning:
		return hydro.StatusWarning
	}
	return hydro.StatusOK
}

// Note adds an issue and raises the status to what its severity asks.
func (r *Record) Note(sev hydro.Severity, code hydro.Code, format string, a ...any) {
	r.Add(hydro.Issue{Severity: sev, Code: code, Message: fmt.Sprintf(format, a...)})
}

// Add adds an issue found elsewhere and raises the status accordingly.
func (r *Record) Add(is hydro.Issue) {
	r.Status = worse(r.Status, statusOf(is.Severity))
	r.Issues = append(r.Issues, is)
}

func assessOne(r *Record, solver, brine *speciation.Solver, sw *speciation.Water, opt Options) {
	r.Status = r.Row.Status
	r.Issues = append(r.Issues[:0], r.Row.Issues...)
	s := &r.Row.Sample
	checkPosition(r)
	if r.Status == hydro.StatusRejected {
		return
	}
	w, issues := s.Water()
	r.Water = w
	for _, is := range issues {
		r.Add(is)
	}
	checkPlausible(r, &w)
	if r.Status == hydro.StatusRejected {
		return
	}
	r.Balance = hydro.ChargeBalance(s)
	if !finite(r.Balance.ErrorPct) || !finite(r.Balance.CationsMeqL) || !finite(r.Balance.AnionsMeqL) {
		r.Balance = hydro.Balance{}
		r.Note(hydro.Error, CodeNotFinite, "charge balance cannot be computed: a value is too large")
		return
	}
	switch {
	case !r.Balance.Complete && math.Abs(r.Balance.ErrorPct) > IncompleteBalanceLimitPct:
		r.Note(hydro.Warning, CodeBalanceIncomplete, "charge balance %.1f %% with ions missing (%v): the analysis is incomplete or wrong", r.Balance.ErrorPct, r.Balance.Missing)
	case !r.Balance.Complete:
		// Info only: many files carry a partial analysis on purpose.
		r.Note(hydro.Info, CodeBalanceIncomplete, "charge balance incomplete (missing %v)", r.Balance.Missing)
	case r.Balance.Status == hydro.BalanceFail:
		r.Note(hydro.Warning, CodeBalanceFail, "charge balance %.1f %% fails Standard Methods 1030 E (%s)", r.Balance.ErrorPct, r.Balance.Criterion)
	case r.Balance.Status == hydro.BalanceWarn:
		r.Note(hydro.Warning, CodeBalanceWarn, "charge balance %.1f %% outside Standard Methods 1030 E (%s)", r.Balance.ErrorPct, r.Balance.Criterion)
	}
	if r.Balance.HasTDSRatio && !r.Balance.TDSRatioOK {
		side := "below 1.0"
		if r.Balance.TDSRatio > 1.2 {
			side = "above 1.2"
		}
		r.Note(hydro.Warning, CodeTDSRatio, "measured/calculated TDS %.3f is %s (Standard Methods 1030 E accepts 1.0-1.2; calculated %.0f mg/L)", r.Balance.TDSRatio, side, r.Balance.TDSCalcMgL)
	}
	if !w.HasPH {
		r.Note(hydro.Warning, CodeNoPH, "no pH: speciation skipped")
		return
	}
	if w.PHSource == "lab" {
		r.Note(hydro.Info, CodeLabPH, "lab pH used (no field pH): it may differ from the pH in the aquifer by CO2 loss")
	}
	tempC := w.TempC
	if !w.HasTemp {
		tempC = DefaultTempC
		r.Note(hydro.Warning, CodeNoTemp, "no temperature: speciated at %.0f C", DefaultTempC)
	}
	SpeciationWater(sw, &w, tempC)
	sw.PressureBar = r.pressure(opt)
	if opt.BalanceOn != "" {
		sw.ChargeBalanceIon = opt.BalanceOn
	}
	res, err := solveWithRedox(r, solver, sw, tempC, opt)
	if err == nil && brine != nil && res.IonicStrength > AutoModelSwitch {
		// A brine: solve again with Pitzer's equations. The choice depends on
		// this row alone, so it never changes between two runs.
		if res.HasPE {
			sw.SetPE(res.PE) // the same pe, whatever reading gave it
		}
		if bres, berr := brine.Solve(sw); berr == nil {
			res = bres
		} else {
			r.Note(hydro.Warning, CodeIonicStrength, "ionic strength %.3g mol/kgw is a brine, but the Pitzer solve failed (%v): the Truesdell-Jones result is kept, beyond its range", res.IonicStrength, berr)
		}
	}
	if err != nil {
		var se *speciation.SolveError
		reason := err.Error()
		if errors.As(err, &se) && se.Reason != "" {
			reason = se.Reason
		}
		r.SolveError = reason
		r.Note(hydro.Warning, CodeSolveFailed, "speciation failed: %s", reason)
		return
	}
	if !opt.Detail {
		res.Species, res.Distribution = nil, nil
	}
	r.Result = res
	if res.Adjusted != "" {
		r.Adjusted = res.Adjusted
		r.Note(hydro.Info, CodeBalanceClosed, "%s total adjusted to %.4g mol/kgw to close the charge balance", res.Adjusted, res.AdjustedTotal)
	}
	for _, wmsg := range res.Warnings {
		if wmsg == speciation.WarnIonicStrength {
			m := solver.Model()
			if brine != nil && res.Model == brine.Model().Name() {
				m = brine.Model()
			}
			r.Note(hydro.Warning, CodeIonicStrength, "ionic strength %.3g mol/kgw above the %s model's limit %.2g", res.IonicStrength, m.Name(), m.MaxIonicStrength())
			continue
		}
		if wmsg == speciation.WarnNoEnthalpy {
			continue // a property of the data set, stated in the README, not of the sample
		}
		r.Note(hydro.Info, CodeSolverNote, "%s", wmsg)
	}
	var outside []string
	for _, m := range res.Minerals {
		if m.OutsideTempRange {
			outside = append(outside, m.Name)
		}
	}
	if len(outside) > 0 {
		r.Note(hydro.Info, CodeTempRange, "at %.1f C, outside the temperature range of their data: %s (those SIs are extrapolated)", res.TempC, strings.Join(outside, ", "))
	}
	pressureNotes(r, res)
	if res.RedoxSkipped {
		r.Note(hydro.Info, CodeNoRedox, "%s", speciation.NoteNoRedox)
	}
	_, hasTIC := w.Molal[speciation.NameCarbonate]
	switch {
	case !hasTIC && !w.HasAlkalinity:
		r.Note(hydro.Info, CodeNoCarbonate, "no alkalinity or carbonate: carbonate minerals and log pCO2 not computed")
	case !hasTIC && w.AlkalinityEqKgw <= 0:
		r.Note(hydro.Info, CodeNoCarbonate, "alkalinity not above 0 (an acid water): carbonate minerals and log pCO2 not computed")
	}
	checkPCO2(r, res)
	if math.Abs(res.ChargeBalance) > SpeciatedBalanceLimitPct {
		r.Note(hydro.Warning, CodeSpeciatedBalance, "charge balance after speciation %.1f %%: saturation indices are doubtful", res.ChargeBalance)
	}
	if ix := res.Indices; ix.HasLangelier && (res.PH < 6.5 || res.PH > 9.5 || res.IonicStrength > 0.5) {
		r.Note(hydro.Info, CodeIndicesRange, "Langelier and Ryznar indices outside their range (pH 6.5-9.5, ionic strength up to 0.5 mol/kgw)")
	}
}

func finite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }

// SpeciationWater fills dst from a converted lab sample: its temperature
// (tempC, since a missing one is the caller's choice), pH, component
// totals, and alkalinity unless total inorganic carbon was measured.
func SpeciationWater(dst *speciation.Water, w *hydro.Water, tempC float64) {
	dst.Reset()
	dst.TempC = tempC
	dst.PH = w.PH
	for comp, m := range w.Molal {
		if m > 0 {
			dst.SetTotal(comp, m)
		}
	}
	if w.HasAlkalinity {
		if _, hasTIC := w.Molal[speciation.NameCarbonate]; !hasTIC && w.AlkalinityEqKgw > 0 {
			dst.SetAlkalinity(w.AlkalinityEqKgw)
		}
	}
}

// TempC returns the temperature a record was speciated at.
func (r *Record) TempC() float64 {
	if r.Water.HasTemp {
		return r.Water.TempC
	}
	return DefaultTempC
}
