// Package hydro reads groundwater lab spreadsheets and turns them into
// checked, comparable water analyses: it owns every lab quirk (delimiters,
// decimal commas, header spellings, units, "<0.5" and "ND"), so nothing
// downstream sees a unit string.
//
// # Reading
//
// Read and ReadFile take a CSV file of one of two shapes: Wide (one row per
// sample, one column per parameter) or Long (one row per sample and
// parameter, with sample-id, parameter, value and optionally unit,
// qualifier and detection-limit columns; consecutive lines with the same
// sample id form one sample). They detect the delimiter (comma, semicolon,
// tab, '|') and a decimal comma (only in files not delimited by commas),
// strip a UTF-8 byte-order mark, accept LF, CRLF and bare-CR line endings,
// read non-UTF-8 bytes as Latin-1, and trim spaces around cells.
//
// The result is a Batch: which header mapped to which parameter
// (Batch.Mapping) and one Row per input row (wide) or per sample (long), in
// input order. Each Row carries a Sample, a Status (ok, warning, rejected)
// and its Issues, each naming its column (in the long shape: the value,
// unit or parameter column, with the parameter in the message and the line
// in Issue.Line). Lines with no values (blank, or only delimiters) are not
// rows. A bad row never stops the others;
// the error return of Read is kept for the file as a whole (a *ReadError
// wrapping ErrEmpty, ErrNotCSV, ErrNoSampleID, ErrNoAnalyte or ErrRead).
//
// Plain encoding/csv with our own header mapping does the reading, not
// gocsv struct tags: a lab file's analyte columns are open-ended and
// recognising "Ca (mg/L)", "Ca_mg_L", "Calcium" and "Ca2+" is the job
// itself, so a struct with fixed tags would only add a second mapping and
// gocsv's process-global reader settings. gocsv reads the fixed-column
// column map file (ReadColumnMap).
//
// Header rules: the sample id is an explicit sample column ("Sample ID",
// "sample", "lab id"...), else a number column ("no", "nr"), else "id"; a
// bare "id" beside a sample-number column is the well id. A pH not marked
// field or lab is taken as the lab pH; Sample.PH is the field pH when there
// is one, else the lab pH (Sample.PHSource says which). The sampling round
// comes from "round", "event" or "campaign". Columns not understood are kept
// as text in Sample.Extra. Options.ColumnMap (see ReadColumnMap) overrides
// the guess for any header.
//
// # Units
//
// Concentration units come from the header ("Ca (mg/L)", "Ba [ug/L]",
// "Ca_mg_L", "Alkalinity as CaCO3 (mg/L)", "NO3-N"), from a unit column in
// the long shape, or default to mg/L (stated in the mapping). Understood:
// mg/L, ug/L (µg/L, μg/L), g/L, mol/L, mmol/L, umol/L, meq/L, mol/kgw
// (mol/kg), mmol/kgw, mg/kg, ug/kg, ppm and ppb (mass fractions of the
// solution, equal to mg/L and ug/L in dilute water; alkalinity in mmol/L is
// read as mmol H+ per litre, i.e. meq/L), with a basis "as X":
// alkalinity as CaCO3 (the default for a mass unit) or HCO3, nitrate and
// ammonium as N, silica as Si, sulfate as S, phosphate as P, TIC as C (the
// default), CO2 or CaCO3. An unknown unit is a row error naming the column.
// Molar masses are sums of the IUPAC standard atomic weights (Meija et al.
// 2016, "Atomic weights of the elements 2013", conventional values for
// interval elements); see units.go. Field parameters are converted to the
// unit in their Sample field name: TempC (from C, F or K), DepthM (m, ft),
// SpecCondUScm (uS/cm, mS/cm, mS/m, dS/m), TDSMgL, Density (kg/L).
//
// # Non-detects
//
// "<0.5", "< 0.5", "ND", "n.d.", "BDL", "<DL", a value with a "U"
// qualifier, or a qualifier column ("<", "U", "ND") next to the value (in
// the long shape a qualifier column; in the wide shape a "Ca_qualifier"
// column, and "Ca_DL" for a detection limit) mark a non-detect. The value
// used follows Options.NonDetect: HalfDL (the default), Zero or DL. Each
// substituted value has Measurement.Substituted set and an info issue on
// its row (the row stays ok); a non-detect without a detection limit gets
// 0 and a warning.
//
// # Validation
//
// Rejected (error): non-numeric or negative concentration, unknown unit,
// pH outside 0-14, temperature outside 0-100 C (the supported range),
// density outside 0.9-1.5 kg/L, negative TDS or conductance, ragged row,
// empty row. Warning (used, but look): duplicate sample id (rows kept
// apart), one well id at places more than 100 m apart, a non-detect without
// a limit, a ">x" value, a multi-interval or unreadable screen, an
// unreadable or ambiguous date (01/02/2024 is read day-first or month-first
// only when another date in the file settles it), coordinates out of range,
// an unknown long-shape parameter (kept in Extra).
//
// # Chemistry
//
// Sample.Water converts to molalities (Water) keyed by speciation component
// name, with alkalinity in eq/kgw, kg of water per litre = density - TDS/1e6
// (`common practice`), the density measured, else estimated from TDS as
// 1.000 + 7.0e-7 TDS(mg/L) kg/L (`common practice`), else assumed 1.000.
// ChargeBalance gives the anion-cation balance (Balance) with the
// acceptance criteria of Standard Methods 1030 E, 23rd edition (2017), and
// the measured/calculated TDS ratio of the same section.
//
// Main types: Batch, Row, Sample, Measurement, Unit, Issue, Options, Water,
// Balance, ReadError.
package hydro
