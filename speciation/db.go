package speciation

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"
	"sync"
)

// Sentinel errors of the data reader. Errors returned by ParseDatabase wrap one of
// these in a *DataError that names the entry and its line.
var (
	ErrSyntax           = errors.New("speciation: syntax error")
	ErrUnknownComponent = errors.New("speciation: unknown component or species in reaction")
	ErrMissingLogK      = errors.New("speciation: missing log K")
	ErrMissingTempFunc  = errors.New("speciation: missing temperature function (analytic or dh)")
	ErrChargeImbalance  = errors.New("speciation: reaction does not balance in charge")
	ErrDuplicateEntry   = errors.New("speciation: duplicate entry")
	ErrInconsistentLogK = errors.New("speciation: analytic expression does not reproduce log10_k_25c at 25 C")
	ErrMissingComponent = errors.New("speciation: required component missing")
	ErrUnknownEntryKind = errors.New("speciation: unknown entry kind")
	ErrMissingField     = errors.New("speciation: missing field")
	ErrInvalidParameter = errors.New("speciation: invalid parameter")
)

// DataError reports a problem in a thermodynamic data file, with the entry and the
// line where it was found.
type DataError struct {
	Line  int    // 1-based line of the offending key, or of the entry header
	Entry string // e.g. "species CaHCO3+"
	Err   error  // one of the ErrXxx sentinels, possibly wrapped with detail
}

func (e *DataError) Error() string {
	if e.Entry == "" {
		return fmt.Sprintf("thermodynamic data line %d: %v", e.Line, e.Err)
	}
	return fmt.Sprintf("thermodynamic data line %d, entry [%s]: %v", e.Line, e.Entry, e.Err)
}

func (e *DataError) Unwrap() error { return e.Err }

// LogKFunc is log10 K as a function of temperature,
// log K(T) = A + B*T + C/T + D*log10(T) + E/T^2 + F/(eps_r(T) T) with T in
// kelvin and eps_r the dielectric constant of water (WaterDielectric).
// A van 't Hoff enthalpy is stored in the same form (A and C only); F carries
// the heat capacity of an ion pair's association from the Fuoss (1958)
// equation (heat_capacity = fuoss in the data; see fuossHeatCapacity).
type LogKFunc struct {
	A, B, C, D, E, F float64
}

// At returns log10 K at temperature tempK (kelvin).
func (f LogKFunc) At(tempK float64) float64 {
	v := f.A + f.B*tempK + f.C/tempK + f.D*math.Log10(tempK) + f.E/(tempK*tempK)
	if f.F != 0 {
		v += f.F / (WaterDielectric(tempK-273.15) * tempK)
	}
	return v
}

func (f LogKFunc) add(g LogKFunc, nu float64) LogKFunc {
	return LogKFunc{A: f.A + nu*g.A, B: f.B + nu*g.B, C: f.C + nu*g.C, D: f.D + nu*g.D, E: f.E + nu*g.E, F: f.F + nu*g.F}
}

// tempConstant is the TempNote of a log K held constant (no enthalpy in the data).
const tempConstant = "constant (no enthalpy)"

// gasConstant in J/(mol K) (CODATA 2018, exact value 8.314462618).
const gasConstant = 8.314462618

// T25 is 25 C in kelvin.
const T25 = 298.15

func vantHoff(logK25, dhJ float64) LogKFunc {
	// log K(T) = log K25 - dH/(R ln10) (1/T - 1/T25)
	s := dhJ / (gasConstant * math.Ln10)
	return LogKFunc{A: logK25 + s/T25, C: -s}
}

// Term is one component of a reaction with its stoichiometric coefficient.
type Term struct {
	Component string
	Index     int // index of the component in Database.Components
	Nu        float64
}

// Component is a basis species: the laboratory reports its total.
type Component struct {
	Name       string
	Charge     float64
	Mass       float64 // g/mol
	Alkalinity float64 // equivalents of alkalinity per mole
	Solvent    bool    // true for H2O
	Line       int
}

// Species is an aqueous species formed from components.
type Species struct {
	Name       string
	Charge     float64
	Terms      []Term   // formation reaction, expanded to components (H2O included)
	LogK       LogKFunc // formation constant from components as a function of T
	LogK25     float64  // log K at 25 C of the reaction as written in the file
	IonSize    float64  // angstrom
	TJB        float64  // Truesdell-Jones b, kg/mol
	SizeSource string
	Source     string
	Confidence string
	Master     int // index of the component this is the free ion of, or -1
	// Alkalinity is the equivalents of total alkalinity per mole: the sum over the
	// reaction's terms (components and earlier species), or the entry's own
	// "alkalinity" key where its reference level differs (HS-, NH4+, O2(aq)).
	Alkalinity float64
	// redox attributes the electrons of the formation reaction to the component whose
	// oxidation state they change (e.g. -1 on Fe2+ for Fe3+ and its complexes).
	redox      []Term
	Reaction   string
	TempNote   string     // "analytic", "van 't Hoff" or "constant (no enthalpy)"
	ValidTempC [2]float64 // temperature range of LogK in C (valid_temp_c); zero if not stated
	Line       int
}

// Mineral is a solid or a gas written as its dissolution into components.
type Mineral struct {
	Name          string
	Formula       string
	Gas           bool
	Terms         []Term
	LogK          LogKFunc
	LogK25        float64
	MolarMass     float64 // g/mol
	Density       float64 // g/cm3
	DensitySource string
	Source        string
	Confidence    string
	Reaction      string
	TempNote      string
	ValidTempC    [2]float64 // temperature range of LogK in C (valid_temp_c); zero if not stated
	// VolumeChange is the standard volume change of the dissolution reaction at
	// 25 C, cm3/mol (reaction_volume_cm3), and CompressibilityChange its
	// compressibility change -d(VolumeChange)/dP, cm3/(mol bar)
	// (reaction_compressibility_cm3_bar). They correct LogK for pressure
	// (PressureLogKShift) within ValidPressureBar, which is zero for a mineral
	// without pressure data.
	VolumeChange          float64
	CompressibilityChange float64
	ValidPressureBar      [2]float64
	PressureSource        string
	Line                  int
}

// HasPressureData reports whether the mineral's log K can be corrected for
// pressure (its data give a volume change of reaction).
func (m *Mineral) HasPressureData() bool { return m.ValidPressureBar != [2]float64{} }

// LogKAt returns log10 K of the dissolution reaction at tempC (C) and
// pressureBar (bar, absolute): the temperature function, plus the pressure
// correction of PressureLogKShift when the mineral has pressure data (a
// mineral without them keeps its 1 bar value). A pressure of 0 means 1 bar.
func (m *Mineral) LogKAt(tempC, pressureBar float64) float64 {
	tk := tempC + 273.15
	lk := m.LogK.At(tk)
	if m.HasPressureData() && pressureBar != 0 {
		lk += PressureLogKShift(m.VolumeChange, m.CompressibilityChange, tk, pressureBar)
	}
	return lk
}

// MolarVolume returns the molar volume in cm3/mol, or 0 if the density is unknown.
func (m *Mineral) MolarVolume() float64 {
	if m.Density <= 0 {
		return 0
	}
	return m.MolarMass / m.Density
}

// Database is a parsed thermodynamic data set. It is read-only once built and safe
// for concurrent use.
type Database struct {
	components []Component
	species    []Species // the free ion of each non-solvent component comes first, in component order
	minerals   []Mineral // minerals and gases, in file order

	compIndex    map[string]int
	speciesIndex map[string]int
	mineralIndex map[string]int
	water        int // index of H2O
	hplus        int // index of H+
	carbonate    int // index of CO3 2- or -1
	co2gas       int // index of CO2(g) in Minerals or -1
	calcite      int
	hco3         int // species index of HCO3- or -1
	co3          int
	electron     int // index of the electron component e- or -1
	o2gas        int // index of O2(g) in Minerals or -1
}

// ComponentIndex returns the index of the named component, or -1. Names are matched
// after CanonicalName, so "SO4^2-" and the sign-first spellings find SO4 2-.
func (db *Database) ComponentIndex(name string) int {
	if i, ok := db.compIndex[name]; ok {
		return i
	}
	if i, ok := db.compIndex[CanonicalName(name)]; ok {
		return i
	}
	return -1
}

// SpeciesIndex returns the index of the named species, or -1 (names matched as in
// ComponentIndex).
func (db *Database) SpeciesIndex(name string) int {
	if i, ok := db.speciesIndex[name]; ok {
		return i
	}
	if i, ok := db.speciesIndex[CanonicalName(name)]; ok {
		return i
	}
	return -1
}

// MineralIndex returns the index of the named mineral or gas, or -1. Mineral names
// are matched without regard to case, spaces, hyphens, underscores and parentheses,
// and the alternative names of MineralAliases are accepted.
func (db *Database) MineralIndex(name string) int {
	if i, ok := db.mineralIndex[name]; ok {
		return i
	}
	if i, ok := db.mineralIndex[mineralKey(name)]; ok {
		return i
	}
	return -1
}

// Mineral returns a copy of the named mineral or gas, or nil (names matched as in
// MineralIndex).
func (db *Database) Mineral(name string) *Mineral {
	i := db.MineralIndex(name)
	if i < 0 {
		return nil
	}
	m := db.minerals[i].clone()
	return &m
}

// Components returns a copy of the components, in data-file order.
func (db *Database) Components() []Component { return append([]Component(nil), db.components...) }

// Component returns a copy of component i (i from ComponentIndex).
func (db *Database) Component(i int) Component { return db.components[i] }

// Species returns a copy of the aqueous species: the free ion of each non-solvent
// component first, in component order, then the others in data-file order.
func (db *Database) Species() []Species {
	out := make([]Species, len(db.species))
	for i := range db.species {
		out[i] = db.species[i].clone()
	}
	return out
}

// Minerals returns a copy of the minerals and gases, in data-file order.
func (db *Database) Minerals() []Mineral {
	out := make([]Mineral, len(db.minerals))
	for i := range db.minerals {
		out[i] = db.minerals[i].clone()
	}
	return out
}

func (s Species) clone() Species { s.Terms = append([]Term(nil), s.Terms...); return s }
func (m Mineral) clone() Mineral { m.Terms = append([]Term(nil), m.Terms...); return m }

// MineralNames returns the names of the minerals (gases excluded) in data-file order.
func (db *Database) MineralNames() []string {
	out := make([]string, 0, len(db.minerals))
	for i := range db.minerals {
		if !db.minerals[i].Gas {
			out = append(out, db.minerals[i].Name)
		}
	}
	return out
}

// Names of components with a special role.
const (
	NameH2O       = "H2O"
	NameHPlus     = "H+"
	NameCarbonate = "CO3 2-"
	NameCO2Gas    = "CO2(g)"
	NameCalcite   = "calcite"
	// NameElectron is the electron component: its activity is fixed by the pe of the
	// water (Water.SetPE), and species and minerals that contain it exist only when
	// a pe is given.
	NameElectron = "e-"
	// NameO2Gas is oxygen gas, whose partial pressure marks the upper stability limit
	// of water.
	NameO2Gas = "O2(g)"
)

var (
	defaultOnce sync.Once
	defaultDB   *Database
	defaultErr  error
)

// Default returns the database parsed from the embedded data file (Thermo, from thermo.txt).
// It is parsed once and shared.
func Default() (*Database, error) {
	defaultOnce.Do(func() {
		defaultDB, defaultErr = ParseDatabase(thermo)
	})
	return defaultDB, defaultErr
}

type rawEntry struct {
	kind, name string
	line       int
	fields     map[string]string
	lines      map[string]int
}

// ParseDatabase reads a thermodynamic data set in gwsat's own format (described at the
// top of speciation/thermo.txt). It needs at least the components H2O and H+. A malformed or
// inconsistent file is rejected with a *DataError naming the entry and line.
func ParseDatabase(text string) (*Database, error) {
	entries, err := splitEntries(text)
	if err != nil {
		return nil, err
	}
	db := &Database{
		compIndex:    map[string]int{},
		speciesIndex: map[string]int{},
		mineralIndex: map[string]int{},
		water:        -1, hplus: -1, carbonate: -1, co2gas: -1, calcite: -1, hco3: -1, co3: -1,
		electron: -1, o2gas: -1,
	}
	seen := map[string]int{}
	// Components first (they may appear anywhere in the file, but usually lead it).
	for _, e := range entries {
		key := e.kind + " " + e.name
		if prev, dup := seen[key]; dup {
			return nil, &DataError{Line: e.line, Entry: key, Err: fmt.Errorf("%w (first defined on line %d)", ErrDuplicateEntry, prev)}
		}
		seen[key] = e.line
		switch e.kind {
		case "component", "species", "mineral", "gas":
		default:
			return nil, &DataError{Line: e.line, Entry: key, Err: fmt.Errorf("%w %q", ErrUnknownEntryKind, e.kind)}
		}
		if e.kind != "component" {
			continue
		}
		c := Component{Name: e.name, Line: e.line, Solvent: e.name == NameH2O}
		if c.Charge, err = e.number("charge", true); err != nil {
			return nil, err
		}
		if c.Mass, err = e.number("mass", false); err != nil {
			return nil, err
		}
		if c.Alkalinity, err = e.number("alkalinity", false); err != nil {
			return nil, err
		}
		db.compIndex[c.Name] = len(db.components)
		db.components = append(db.components, c)
	}
	var ok bool
	if db.water, ok = db.compIndex[NameH2O]; !ok {
		return nil, &DataError{Line: 1, Err: fmt.Errorf("%w: %s", ErrMissingComponent, NameH2O)}
	}
	if db.hplus, ok = db.compIndex[NameHPlus]; !ok {
		return nil, &DataError{Line: 1, Err: fmt.Errorf("%w: %s", ErrMissingComponent, NameHPlus)}
	}
	if i, ok := db.compIndex[NameCarbonate]; ok {
		db.carbonate = i
	}
	if i, ok := db.compIndex[NameElectron]; ok {
		db.electron = i
	}
	// Free-ion species for every non-solvent component (the electron has none: it is
	// a bookkeeping component, not a dissolved species).
	for _, e := range entries {
		if e.kind != "component" || e.name == NameH2O || e.name == NameElectron {
			continue
		}
		ci := db.compIndex[e.name]
		s := Species{Name: e.name, Charge: db.components[ci].Charge, Master: ci,
			Terms: []Term{{Component: e.name, Index: ci, Nu: 1}}, Reaction: e.name,
			TempNote: "free ion", Line: e.line, Confidence: "", Source: "definition",
			Alkalinity: db.components[ci].Alkalinity}
		if err := e.ionParams(&s); err != nil {
			return nil, err
		}
		db.speciesIndex[s.Name] = len(db.species)
		db.species = append(db.species, s)
	}
	// Species and phases, in file order (a reaction may use species defined earlier).
	for _, e := range entries {
		switch e.kind {
		case "species":
			if _, clash := db.speciesIndex[e.name]; clash {
				return nil, &DataError{Line: e.line, Entry: "species " + e.name, Err: fmt.Errorf("%w (a component has this name)", ErrDuplicateEntry)}
			}
			s := Species{Name: e.name, Line: e.line, Master: -1}
			if s.Charge, err = e.number("charge", true); err != nil {
				return nil, err
			}
			if err := e.ionParams(&s); err != nil {
				return nil, err
			}
			terms, fn, logk25, note, err := db.reaction(e, +1)
			if err != nil {
				return nil, err
			}
			s.Terms, s.LogK, s.LogK25, s.TempNote = terms, fn, logk25, note
			if s.Alkalinity, s.redox, err = db.speciesAlkalinityRedox(e); err != nil {
				return nil, err
			}
			s.Reaction = e.fields["reaction"]
			s.Source, s.Confidence = e.fields["source"], e.fields["confidence"]
			if s.ValidTempC, err = e.tempRange(); err != nil {
				return nil, err
			}
			if err := db.checkCharge(e, terms, s.Charge); err != nil {
				return nil, err
			}
			db.speciesIndex[s.Name] = len(db.species)
			db.species = append(db.species, s)
		case "mineral", "gas":
			m := Mineral{Name: e.name, Line: e.line, Gas: e.kind == "gas"}
			terms, fn, logk25, note, err := db.reaction(e, -1)
			if err != nil {
				return nil, err
			}
			m.Terms, m.LogK, m.LogK25, m.TempNote = terms, fn, logk25, note
			m.Reaction = e.fields["reaction"]
			m.Formula = e.fields["formula"]
			m.Source, m.Confidence = e.fields["source"], e.fields["confidence"]
			if m.ValidTempC, err = e.tempRange(); err != nil {
				return nil, err
			}
			if err := e.pressureData(&m); err != nil {
				return nil, err
			}
			m.DensitySource = e.fields["density_source"]
			if m.MolarMass, err = e.number("mass", false); err != nil {
				return nil, err
			}
			if m.Density, err = e.number("density", false); err != nil {
				return nil, err
			}
			if m.MolarMass < 0 || m.Density < 0 {
				return nil, e.errf("mass", "%w: negative mass or density", ErrInvalidParameter)
			}
			if err := db.checkCharge(e, terms, 0); err != nil {
				return nil, err
			}
			if _, dup := db.mineralIndex[mineralKey(m.Name)]; dup {
				return nil, &DataError{Line: e.line, Entry: e.kind + " " + e.name, Err: ErrDuplicateEntry}
			}
			db.mineralIndex[m.Name] = len(db.minerals)
			db.mineralIndex[mineralKey(m.Name)] = len(db.minerals)
			db.minerals = append(db.minerals, m)
		}
	}
	if i, ok := db.mineralIndex[NameCO2Gas]; ok && db.minerals[i].Gas {
		db.co2gas = i
	}
	if i, ok := db.mineralIndex[NameO2Gas]; ok && db.minerals[i].Gas {
		db.o2gas = i
	}
	db.calcite = db.MineralIndex(NameCalcite)
	for alias, name := range mineralAliases {
		if i, ok := db.mineralIndex[mineralKey(name)]; ok {
			if _, taken := db.mineralIndex[mineralKey(alias)]; !taken {
				db.mineralIndex[mineralKey(alias)] = i
			}
		}
	}
	db.hco3 = db.SpeciesIndex("HCO3-")
	db.co3 = db.SpeciesIndex(NameCarbonate)
	return db, nil
}

func (e *rawEntry) errf(key, format string, args ...any) *DataError {
	line := e.line
	if l, ok := e.lines[key]; ok {
		line = l
	}
	return &DataError{Line: line, Entry: e.kind + " " + e.name, Err: fmt.Errorf(format, args...)}
}

// number reads a numeric field; a missing optional field is 0.
func (e *rawEntry) number(key string, required bool) (float64, error) {
	v, ok := e.fields[key]
	if !ok {
		if required {
			return 0, e.errf(key, "%w %q", ErrMissingField, key)
		}
		return 0, nil
	}
	x, err := strconv.ParseFloat(v, 64)
	if err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
		return 0, e.errf(key, "%w: %s = %q is not a number", ErrSyntax, key, v)
	}
	return x, nil
}

// tempRange reads the optional valid_temp_c = "low high" (C, low < high).
func (e *rawEntry) tempRange() ([2]float64, error) {
	var r [2]float64
	v, ok := e.fields["valid_temp_c"]
	if !ok {
		return r, nil
	}
	f := strings.Fields(v)
	if len(f) != 2 {
		return r, e.errf("valid_temp_c", "%w: valid_temp_c needs two numbers, low and high", ErrSyntax)
	}
	for i, p := range f {
		x, err := strconv.ParseFloat(p, 64)
		if err != nil || !finite(x) {
			return r, e.errf("valid_temp_c", "%w: %q is not a number", ErrSyntax, p)
		}
		r[i] = x
	}
	if r[0] >= r[1] {
		return r, e.errf("valid_temp_c", "%w: valid_temp_c low %g is not below high %g", ErrInvalidParameter, r[0], r[1])
	}
	return r, nil
}

// pressureData reads the optional reaction_volume_cm3,
// reaction_compressibility_cm3_bar and valid_pressure_bar of a mineral: the
// volume needs the range (the data's range is always stated) and the
// compressibility needs the volume.
func (e *rawEntry) pressureData(m *Mineral) error {
	_, hasV := e.fields["reaction_volume_cm3"]
	_, hasK := e.fields["reaction_compressibility_cm3_bar"]
	rng, hasR := e.fields["valid_pressure_bar"]
	if !hasV && !hasK && !hasR {
		return nil
	}
	if e.kind != "mineral" {
		return e.errf("reaction_volume_cm3", "%w: pressure data are for minerals, not for a %s", ErrInvalidParameter, e.kind)
	}
	if !hasV {
		key := "valid_pressure_bar"
		if hasK {
			key = "reaction_compressibility_cm3_bar"
		}
		return e.errf(key, "%w \"reaction_volume_cm3\" (needed with %s)", ErrMissingField, key)
	}
	if !hasR {
		return e.errf("reaction_volume_cm3", "%w \"valid_pressure_bar\" (the range of the pressure data must be stated)", ErrMissingField)
	}
	var err error
	if m.VolumeChange, err = e.number("reaction_volume_cm3", true); err != nil {
		return err
	}
	if m.CompressibilityChange, err = e.number("reaction_compressibility_cm3_bar", false); err != nil {
		return err
	}
	f := strings.Fields(rng)
	if len(f) != 2 {
		return e.errf("valid_pressure_bar", "%w: valid_pressure_bar needs two numbers, low and high", ErrSyntax)
	}
	for i, p := range f {
		x, err := strconv.ParseFloat(p, 64)
		if err != nil || !finite(x) {
			return e.errf("valid_pressure_bar", "%w: %q is not a number", ErrSyntax, p)
		}
		m.ValidPressureBar[i] = x
	}
	if r := m.ValidPressureBar; r[0] <= 0 || r[0] >= r[1] {
		return e.errf("valid_pressure_bar", "%w: valid_pressure_bar needs 0 < low < high, got %g %g", ErrInvalidParameter, r[0], r[1])
	}
	m.PressureSource = e.fields["pressure_source"]
	return nil
}

func (e *rawEntry) ionParams(s *Species) error {
	var err error
	if s.IonSize, err = e.number("ion_size", false); err != nil {
		return err
	}
	if s.TJB, err = e.number("tj_b", false); err != nil {
		return err
	}
	if s.IonSize < 0 {
		return e.errf("ion_size", "%w: negative ion size", ErrInvalidParameter)
	}
	if s.Charge != 0 && s.IonSize == 0 {
		if _, ok := e.fields["ion_size"]; !ok && e.name != NameH2O {
			return e.errf("charge", "%w \"ion_size\" (needed for a charged species)", ErrMissingField)
		}
	}
	s.SizeSource = e.fields["size_source"]
	return nil
}

func (db *Database) checkCharge(e *rawEntry, terms []Term, want float64) error {
	z := 0.0
	for _, t := range terms {
		z += t.Nu * db.components[t.Index].Charge
	}
	if math.Abs(z-want) > 1e-9 {
		return e.errf("reaction", "%w: reaction gives %g, entry has %g", ErrChargeImbalance, z, want)
	}
	return nil
}

// reaction parses the reaction, expands species into components and builds the
// log K function. sign is +1 for formation (species) and -1 for dissolution (phases):
// a species term used in a phase reaction contributes minus its formation constant.
func (db *Database) reaction(e *rawEntry, sign float64) ([]Term, LogKFunc, float64, string, error) {
	var fn LogKFunc
	rx, ok := e.fields["reaction"]
	if !ok || strings.TrimSpace(rx) == "" {
		return nil, fn, 0, "", e.errf("reaction", "%w \"reaction\"", ErrMissingField)
	}
	ls, ok := e.fields["log10_k_25c"]
	if !ok {
		return nil, fn, 0, "", e.errf("log10_k_25c", "%w", ErrMissingLogK)
	}
	logk25, err := strconv.ParseFloat(ls, 64)
	if err != nil || math.IsNaN(logk25) || math.IsInf(logk25, 0) {
		return nil, fn, 0, "", e.errf("log10_k_25c", "%w: log10_k_25c = %q is not a number", ErrSyntax, ls)
	}
	var note string
	if an, ok := e.fields["temperature_fit"]; ok {
		parts := strings.Fields(an)
		if len(parts) != 5 {
			return nil, fn, 0, "", e.errf("temperature_fit", "%w: temperature_fit needs 5 numbers a b c d e, got %d", ErrSyntax, len(parts))
		}
		var c [5]float64
		for i, p := range parts {
			if c[i], err = strconv.ParseFloat(p, 64); err != nil {
				return nil, fn, 0, "", e.errf("temperature_fit", "%w: %q is not a number", ErrSyntax, p)
			}
		}
		fn = LogKFunc{A: c[0], B: c[1], C: c[2], D: c[3], E: c[4]}
		if got := fn.At(T25); math.Abs(got-logk25) > 0.02 || math.IsNaN(got) {
			return nil, fn, 0, "", e.errf("temperature_fit", "%w: expression gives %.4f, log10_k_25c is %.4f", ErrInconsistentLogK, got, logk25)
		}
		note = "analytic"
		if _, ok := e.fields["heat_capacity"]; ok {
			return nil, fn, 0, "", e.errf("heat_capacity", "%w: heat_capacity goes with enthalpy, not with temperature_fit", ErrSyntax)
		}
	} else if dh, ok := e.fields["enthalpy"]; ok {
		parts := strings.Fields(dh)
		switch {
		case len(parts) == 1 && parts[0] == "none":
			fn = LogKFunc{A: logk25}
			note = tempConstant
			if _, ok := e.fields["heat_capacity"]; ok {
				return nil, fn, 0, "", e.errf("heat_capacity", "%w: heat_capacity needs a measured enthalpy, not \"none\"", ErrSyntax)
			}
		case len(parts) == 2:
			v, err := strconv.ParseFloat(parts[0], 64)
			if err != nil || math.IsNaN(v) || math.IsInf(v, 0) {
				return nil, fn, 0, "", e.errf("enthalpy", "%w: enthalpy %q is not a number", ErrSyntax, parts[0])
			}
			switch parts[1] {
			case "kJ":
				v *= 1000
			case "kcal":
				v *= 4184
			default:
				return nil, fn, 0, "", e.errf("enthalpy", "%w: enthalpy unit %q (want kJ or kcal)", ErrSyntax, parts[1])
			}
			fn = vantHoff(logk25, v)
			note = "van 't Hoff"
			if hc, ok := e.fields["heat_capacity"]; ok {
				f := strings.Fields(hc)
				z := 0.0
				if len(f) == 2 && f[0] == "fuoss" {
					z, err = strconv.ParseFloat(f[1], 64)
				}
				if len(f) != 2 || f[0] != "fuoss" || err != nil || !(z > 0) || math.IsInf(z, 0) {
					return nil, fn, 0, "", e.errf("heat_capacity", "%w: heat_capacity must be \"fuoss Z\" (Z the charge product of the pair), got %q", ErrSyntax, hc)
				}
				curv, err := fuossHeatCapacity(z, logk25)
				if err != nil {
					return nil, fn, 0, "", e.errf("heat_capacity", "%w: %v", ErrSyntax, err)
				}
				fn = fn.add(curv, 1)
				note = "van 't Hoff with the Fuoss heat capacity"
			}
		default:
			return nil, fn, 0, "", e.errf("enthalpy", "%w: enthalpy must be \"<number> kJ\", \"<number> kcal\" or \"none\"", ErrSyntax)
		}
	} else {
		return nil, fn, 0, "", e.errf("log10_k_25c", "%w", ErrMissingTempFunc)
	}
	raw, err := parseReaction(rx)
	if err != nil {
		return nil, fn, 0, "", e.errf("reaction", "%w", err)
	}
	acc := map[int]float64{}
	order := []int{}
	addComp := func(ci int, nu float64) {
		if _, ok := acc[ci]; !ok {
			order = append(order, ci)
		}
		acc[ci] += nu
	}
	for _, t := range raw {
		if ci, ok := db.compIndex[t.Component]; ok {
			addComp(ci, t.Nu)
			continue
		}
		si, ok := db.speciesIndex[t.Component]
		if !ok {
			return nil, fn, 0, "", e.errf("reaction", "%w: %q", ErrUnknownComponent, t.Component)
		}
		sp := &db.species[si]
		for _, st := range sp.Terms {
			addComp(st.Index, t.Nu*st.Nu)
		}
		fn = fn.add(sp.LogK, sign*t.Nu)
	}
	terms := make([]Term, 0, len(order))
	for _, ci := range order {
		if nu := acc[ci]; nu != 0 {
			terms = append(terms, Term{Component: db.components[ci].Name, Index: ci, Nu: nu})
		}
	}
	if len(terms) == 0 {
		return nil, fn, 0, "", e.errf("reaction", "%w: empty reaction", ErrSyntax)
	}
	return terms, fn, logk25, note, nil
}

// parseReaction reads "[coef] name (+|-) [coef] name ...".
func parseReaction(s string) ([]Term, error) {
	tok := strings.Fields(s)
	var out []Term
	sign := 1.0
	expectTerm := true
	for i := 0; i < len(tok); i++ {
		t := tok[i]
		if !expectTerm {
			switch t {
			case "+":
				sign = 1
			case "-":
				sign = -1
			default:
				return nil, fmt.Errorf("%w: expected + or - before %q", ErrSyntax, t)
			}
			expectTerm = true
			continue
		}
		coef := 1.0
		if v, err := strconv.ParseFloat(t, 64); err == nil {
			if v <= 0 || math.IsInf(v, 0) || math.IsNaN(v) {
				return nil, fmt.Errorf("%w: coefficient %q must be positive", ErrSyntax, t)
			}
			coef = v
			i++
			if i >= len(tok) {
				return nil, fmt.Errorf("%w: coefficient %q without a name", ErrSyntax, t)
			}
			t = tok[i]
		}
		if t == "+" || t == "-" {
			return nil, fmt.Errorf("%w: operator %q where a term was expected", ErrSyntax, t)
		}
		// A name runs to the next operator: "SO4 2-" is one name.
		for i+1 < len(tok) && tok[i+1] != "+" && tok[i+1] != "-" {
			i++
			t += " " + tok[i]
		}
		out = append(out, Term{Component: CanonicalName(t), Nu: sign * coef})
		expectTerm = false
	}
	if expectTerm {
		return nil, fmt.Errorf("%w: reaction ends with an operator or is empty", ErrSyntax)
	}
	return out, nil
}

func splitEntries(text string) ([]*rawEntry, error) {
	var out []*rawEntry
	var cur *rawEntry
	for n, line := range strings.Split(text, "\n") {
		ln := n + 1
		if i := strings.IndexByte(line, '#'); i >= 0 {
			line = line[:i]
		}
		line = strings.TrimSpace(line)
		if line == "" {
			continue
		}
		if strings.HasPrefix(line, "[") {
			if !strings.HasSuffix(line, "]") {
				return nil, &DataError{Line: ln, Err: fmt.Errorf("%w: header %q lacks a closing ]", ErrSyntax, line)}
			}
			f := strings.Fields(line[1 : len(line)-1])
			if len(f) < 2 {
				return nil, &DataError{Line: ln, Err: fmt.Errorf("%w: header must be [kind name], got %q", ErrSyntax, line)}
			}
			// A name may hold spaces ("SO4 2-", "amorphous silica").
			cur = &rawEntry{kind: f[0], name: strings.Join(f[1:], " "), line: ln, fields: map[string]string{}, lines: map[string]int{}}
			out = append(out, cur)
			continue
		}
		k, v, ok := strings.Cut(line, "=")
		if !ok {
			return nil, &DataError{Line: ln, Entry: entryName(cur), Err: fmt.Errorf("%w: expected key = value, got %q", ErrSyntax, line)}
		}
		if cur == nil {
			return nil, &DataError{Line: ln, Err: fmt.Errorf("%w: key %q before any [kind name] header", ErrSyntax, strings.TrimSpace(k))}
		}
		k, v = strings.TrimSpace(k), strings.TrimSpace(v)
		if _, dup := cur.fields[k]; dup {
			return nil, &DataError{Line: ln, Entry: entryName(cur), Err: fmt.Errorf("%w: key %q given twice", ErrSyntax, k)}
		}
		cur.fields[k] = v
		cur.lines[k] = ln
	}
	return out, nil
}

func entryName(e *rawEntry) string {
	if e == nil {
		return ""
	}
	return e.kind + " " + e.name
}
