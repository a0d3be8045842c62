// Package hydro reads groundwater lab spreadsheets and turns them into
// checked, comparable water analyses: it owns every lab quirk (delimiters,
// decimal commas, header spellings, units, "<0.5" and "ND"), so nothing
// downstream sees a unit string.
//
// # Reading
//
// Read takes CSV text, ReadExcel an .xlsx workbook (the sheet named or
// numbered by Options.Sheet), ReadFile either (told apart by the file's
// first bytes). A table has one of two shapes: Wide (one row per sample,
// one column per parameter) or Long (one row per sample and parameter,
// with sample-id, parameter, value and optionally unit, qualifier and
// detection-limit columns; consecutive lines with the same sample id form
// one sample). CSV input: the delimiter (comma, semicolon, tab, '|') and a
// decimal comma (only in files not delimited by commas) are detected, a
// UTF-8 byte-order mark stripped, LF, CRLF and bare-CR line endings
// accepted, non-UTF-8 bytes read as Latin-1, spaces around cells trimmed.
// Workbook input: cells are read as stored (numbers with a decimal point,
// dates as serial numbers in the workbook's 1900 or 1904 date system),
// merged cells hold their value in every cell they cover, Row.Line is the
// sheet row.
//
// Lab files as they arrive: lines above the header (title, client, lab
// number) are skipped, the header being the line among the first 30 with
// the most recognised column names; a row under the header whose cells are
// units or blank is the units row and gives each column without a unit in
// its header its unit; a row whose first text cell is "LOR", "MDL", "RL",
// "Detection limit"... gives detection limits per column; a row that only
// repeats the header (cells merged down) is skipped. None of these is a
// sample: Batch.Skipped lists them with their kind, Batch.HeaderLine and
// Batch.UnitsLine say where the header and the units row are.
//
// The result is a Batch: which header mapped to which parameter and where
// its unit came from (Batch.Mapping, the column report) and one Row per
// input row (wide) or per sample (long), in input order. Each Row carries
// a Sample, a Status (ok, warning, rejected) and its Issues, each with a
// stable Code (the CodeXxx constants) for programs and a Message for
// people, naming its column (in the long shape: the value, unit or
// parameter column, with the parameter in the message and the line in
// Issue.Line). Lines with no values (blank, or only delimiters) are not
// rows. A bad row never stops the others; the error return is kept for the
// file as a whole (a *ReadError wrapping ErrEmpty, ErrNotCSV,
// ErrNoSampleID, ErrNoAnalyte, ErrRead, ErrSheet or ErrOption; a missing
// file is also fs.ErrNotExist underneath).
//
// Plain encoding/csv with our own header mapping does the reading, not
// gocsv struct tags: a lab file's analyte columns are open-ended and
// recognising "Ca (mg/L)", "Ca_mg_L", "Calcium" and "Ca2+" is the job
// itself, so a struct with fixed tags would only add a second mapping and
// gocsv's process-global reader settings. gocsv reads the fixed-column
// column map file (ReadColumnMap).
//
// Header rules: the sample id is an explicit sample column ("Sample ID",
// "sample", "lab id"...), else a number column ("no", "nr"), else "id",
// else the well id (the sampling date or round then tells a well's samples
// apart); a bare "id" beside a sample-number column is the well id. A pH
// not marked field or lab is taken as the lab pH (in a field sheet, the
// field pH); Sample.PH is the field pH when there is one, else the lab pH
// (Sample.PHSource says which). The sampling round comes from "round",
// "event" or "campaign"; Sample.Event is the round, else the sampling
// date. A "Q", "Flag" or "Qualifier" column right of an analyte column
// qualifies it, a "DL", "MDL" or "LOR" column there gives its limit.
// Columns not understood are kept, in file order and under their own
// header, in Sample.ExtraColumns (and, when not blank, in Sample.Extra).
// Options.ColumnMap (see ReadColumnMap) overrides the guess for any header.
//
// Every analyte is kept as reported (Measurement: value, unit, the unit
// text, qualifier, detection limit) and in mg/L (Measurement.MgPerL).
//
// Dates: ISO 8601, day.month.year, day/month/year and month/day/year
// (slashes or dashes), with or without a time, month names, and Excel
// serial numbers. Whether slash dates are day or month first is decided
// per column from its values (a day above 12 settles it), or set by
// Options.DateOrder; an undecidable date is left empty with a warning.
//
// # Units
//
// Concentration units come from the header ("Ca (mg/L)", "Ba [ug/L]",
// "Ca_mg_L", "Alkalinity as CaCO3 (mg/L)", "NO3-N"), from the units row,
// from a column map entry, from a unit column: in the long shape the
// unit of its line, in the wide shape the unit of each row's analytes
// that have none of their own. When none of them gives one, mg/L is
// assumed and every row using such a column gets a warning (CodeUnitAssumed)
// naming the columns, unless Options.ConfirmUnits confirms it. Understood:
// mg/L, ug/L (µg/L, μg/L), g/L, mol/L, mmol/L, umol/L, meq/L, mol/kgw
// (mol/kg), mmol/kgw, mg/kg, ug/kg, ppm and ppb (mass fractions of the
// solution: converted to per litre with the density, measured or estimated
// from TDS, and the row says so; alkalinity in mmol/L is read as mmol H+
// per litre, i.e. meq/L), with a basis "as X": alkalinity as CaCO3 (the
// default for a mass unit) or HCO3, nitrate and ammonium as N, silica as
// Si, sulfate as S, phosphate as P, TIC as C (the default), CO2 or CaCO3.
// An unknown unit is a row error naming the column. Molar masses are sums
// of the IUPAC standard atomic weights (Meija et al. 2016, "Atomic weights
// of the elements 2013", conventional values for interval elements); see
// units.go. Field parameters are converted to the unit in their Sample
// field name: TempC (from C, F or K), DepthM (m, ft), SpecCondUScm (uS/cm,
// mS/cm, mS/m, dS/m), TDSMgL, Density (kg/L; a specific gravity is taken
// as kg/L), DissolvedOxygenMgL, EhMV and ORPMV (mV or V).
//
// Plausibility: Ba, Sr, Fe, Mn, Al, Li or F far above what fresh and
// brackish groundwater shows (limits in plausible.go, with their source)
// in a water that is not saline gives a warning naming the column and the
// value it would have in ug/L (CodeImplausible); a pH column whose values
// are mostly outside 0-14 is taken for a potential in mV: the pH is left
// empty with a warning instead of rejecting the row.
//
// Sodium and potassium reported together ("Na+K", "Sodium plus
// potassium") are taken as sodium, by the convention of reports that give
// the sum as the cation deficit computed as Na: mass as Na, charge 1. The
// value is stored as "Na" with Measurement.SodiumPlusPotassium set and an
// info note, counts in the charge balance, and K is then not asked for.
//
// # Missing and censored values
//
// Missing: a blank cell, "n.a.", "n/a", "NA", "-", "–", "not analysed",
// "ns" and the like. A missing analyte is not reported (an info note when
// the cell was not blank). Censored: "<0.5", "< 0.5", "0.5 <", "<LOR",
// "<LOQ", "<MDL", "<PQL", "<RL", "ND", "n.d.", "BDL", a value with a "U"
// qualifier ("0.5U"), or a qualifier column ("<", "U", "ND") next to the
// value (in the long shape a qualifier column; in the wide shape a
// "Ca_qualifier" column or a "Q"/"Flag" column right of it, and "Ca_DL" or
// a "DL" column for a detection limit). A censored value without a number
// takes the column's limit from a limits row, a limit column or
// Options.DetectionLimits. The value used follows Options.NonDetect:
// HalfDL (the default), Zero or DL. Each substituted value has
// Measurement.Substituted set and an info issue on its row (the row stays
// ok); a non-detect without any limit gets 0 and a warning. A missing or
// censored pH or temperature is a missing value with a warning, never a
// rejected row; Options.SiteTempC fills a missing temperature (an info
// note; Sample.TempSource says where each temperature came from).
//
// # Field sheets
//
// ReadFieldSheet reads a second file of field measurements (pH,
// temperature, specific conductance, dissolved oxygen, Eh or ORP, with
// their units), which needs no analyte. JoinFieldSheet joins it to the lab
// rows on sample id, or on well id and sampling date when the ids differ:
// field pH and temperature take precedence over the lab's, the other
// values fill what the lab row lacks, each joined row says so, and rows
// matching nothing on either side are returned.
//
// # Validation
//
// Rejected (error): non-numeric or negative concentration, unknown unit,
// pH outside 0-14 (unless the whole column looks like mV), a non-numeric
// pH or temperature that is not a missing or censored spelling,
// temperature outside 0-100 C (the supported range), density outside
// 0.9-1.5 kg/L, negative TDS or conductance, ragged row. Warning (used,
// but look): an assumed unit, an implausible value, a missing pH or
// temperature, a sample id used twice within one sampling event (rows
// kept apart; one id on two events is one well sampled twice), one well
// id at places more than 100 m apart, a non-detect without a limit, a ">x"
// value, a multi-interval or unreadable screen, an unreadable or ambiguous
// date, coordinates out of range, an unknown long-shape parameter (kept in
// Extra).
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
// Main types: Batch, Row, Sample, Measurement, Unit, Issue, Code, Options,
// FieldJoin, Water, Balance, ReadError.
package hydro
