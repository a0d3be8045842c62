package speciation

import (
	"math"
	"strings"
)

// Supported temperature range of the package, in degrees C.
const (
	MinTempC = 0.0
	MaxTempC = 100.0
)

// WaterDielectric returns the relative permittivity of liquid water at 1 atm,
// Malmberg & Maryott (1956), J. Res. Natl. Bur. Stand. 56, 1-8:
// eps = 87.740 - 0.40008 t + 9.398e-4 t^2 - 1.410e-6 t^3, t in C, 0-100 C (from memory).
func WaterDielectric(tempC float64) float64 {
	t := tempC
	return 87.740 - 0.40008*t + 9.398e-4*t*t - 1.410e-6*t*t*t
}

// WaterDensity returns the density of air-free water at 1 atm in g/cm3,
// Kell (1975), J. Chem. Eng. Data 20, 97-105, 0-150 C (from memory).
func WaterDensity(tempC float64) float64 {
	t := tempC
	num := 999.83952 + 16.945176*t - 7.9870401e-3*t*t - 46.170461e-6*t*t*t +
		105.56302e-9*t*t*t*t - 280.54253e-12*t*t*t*t*t
	return num / (1 + 16.879850e-3*t) / 1000
}

// DebyeHuckelAB returns the Debye-Hueckel constants A (kg^0.5 mol^-0.5) and
// B (kg^0.5 mol^-0.5 per angstrom) at tempC, from the dielectric constant and density
// of water: A = 1.82483e6 sqrt(rho) (eps T)^-1.5 and B = 50.2916 sqrt(rho) (eps T)^-0.5
// (the textbook forms, e.g. Robinson & Stokes 1959, from memory), with eps from
// Malmberg & Maryott (1956) and rho from Kell (1975). They agree with the table of
// Helgeson & Kirkham (1974) within 0.002 (A) and 0.0005 (B) at 0-50 C and within 0.005
// and 0.001 at 100 C.
func DebyeHuckelAB(tempC float64) (A, B float64) {
	T := tempC + 273.15
	eT := WaterDielectric(tempC) * T
	sr := math.Sqrt(WaterDensity(tempC))
	sq := math.Sqrt(eT)
	A = 1.82483e6 * sr / (eT * sq)
	B = 50.2916 * sr / sq
	return A, B
}

// ExtendedDebyeHuckel returns log10 gamma of an ion of charge z and ion size a
// (angstrom) at ionic strength I: -A z^2 sqrt(I) / (1 + B a sqrt(I)).
// With a Truesdell-Jones b, add b*I (see TruesdellJones).
func ExtendedDebyeHuckel(z, a, A, B, I float64) float64 {
	s := math.Sqrt(I)
	return -A * z * z * s / (1 + B*a*s)
}

// ActivityState is what an activity model sees: one entry per species present in the
// solve (all slices have the length of logG in LogGammas). The solver fills it; models
// only read it.
type ActivityState struct {
	TempC float64
	I     float64 // ionic strength, mol/kgw
	A, B  float64 // Debye-Hueckel constants at TempC (DebyeHuckelAB)

	Charge   []float64
	IonSize  []float64 // angstrom
	TJB      []float64 // Truesdell-Jones b, kg/mol
	Molality []float64 // current molalities (for composition-dependent models)
	Species  []int     // index of each entry in DB.species
	DB       *Database
}

// ActivityModel computes activity coefficients. Implementations must not allocate
// in LogGammas: it is called in the solver's inner loop.
//
// LogGammas writes log10 gamma of every species of st into logG and d(log10 gamma)/dI
// into dLogG (same length as st.Charge), and returns log10 of the activity of water.
// Models that do not model the water activity return 0 (a_w = 1).
type ActivityModel interface {
	Name() string
	// MaxIonicStrength is the ionic strength (mol/kgw) up to which the model holds;
	// a solve beyond it carries a warning.
	MaxIonicStrength() float64
	LogGammas(logG, dLogG []float64, st *ActivityState) (logAw float64)
}

// NeutralSetschenow is the coefficient k of log10 gamma = k I used for every neutral
// species by the Davies and Truesdell-Jones models: a Setschenow-type salting-out term
// with k = 0.1 kg/mol (common practice; close to measured values for CO2 in NaCl
// solutions). Water activity is taken as 1 by these two models (dilute-water convention).
const NeutralSetschenow = 0.1

// Davies is the Davies (1962) equation, log10 gamma = -A z^2 (sqrt(I)/(1+sqrt(I)) - 0.3 I)
// (Davies, C.W., 1962, Ion Association, Butterworths). Fresh water: up to I = 0.5 mol/kg
// (the upper end of the range usually quoted, 0.1-0.5).
type Davies struct{}

func (Davies) Name() string { return "davies" }

func (Davies) MaxIonicStrength() float64 { return 0.5 }

func (Davies) LogGammas(logG, dLogG []float64, st *ActivityState) float64 {
	I := math.Max(st.I, 0)
	s := math.Sqrt(I)
	f := s/(1+s) - 0.3*I
	var df float64
	if s > 0 {
		df = 1/(2*s*(1+s)*(1+s)) - 0.3
	}
	A := st.A
	z := st.Charge[:len(logG)]
	dLogG = dLogG[:len(logG)]
	for i := range logG {
		zz := z[i] * z[i]
		if zz == 0 {
			logG[i] = NeutralSetschenow * I
			dLogG[i] = NeutralSetschenow
			continue
		}
		logG[i] = -A * zz * f
		dLogG[i] = -A * zz * df
	}
	return 0
}

// TruesdellJones is the extended Debye-Hueckel equation with an added linear term,
// log10 gamma = -A z^2 sqrt(I)/(1 + B a sqrt(I)) + b I (Truesdell, A.H. & Jones, B.F.,
// 1974, J. Res. U.S. Geol. Survey 2(2), 233-248), with per-ion a and b from the data file
// (Kielland 1937 a with b = 0 where Truesdell and Jones give no pair). It is used up to
// I = 1 mol/kg here (Truesdell and Jones fitted major ions in chloride solutions to about
// 2 mol/kg; ions with Kielland sizes only are good to about 0.1, so 1 is a compromise).
type TruesdellJones struct{}

func (TruesdellJones) Name() string { return "truesdell-jones" }

func (TruesdellJones) MaxIonicStrength() float64 { return 1.0 }

func (TruesdellJones) LogGammas(logG, dLogG []float64, st *ActivityState) float64 {
	I := math.Max(st.I, 0)
	s := math.Sqrt(I)
	A, B := st.A, st.B
	n := len(logG)
	z := st.Charge[:n]
	a := st.IonSize[:n]
	b := st.TJB[:n]
	dLogG = dLogG[:n]
	// one division per ion: with q = 1/(1 + B a sqrt(I)), log gamma = -A z^2 sqrt(I) q + b I
	// and d(log gamma)/dI = -A z^2 q^2 / (2 sqrt(I)) + b
	var h float64 // 1/(2 sqrt(I)), 0 at I = 0 (where the derivative's first term is dropped)
	if s > 0 {
		h = 0.5 / s
	}
	for i := range logG {
		zz := z[i] * z[i]
		if zz == 0 {
			logG[i] = NeutralSetschenow * I
			dLogG[i] = NeutralSetschenow
			continue
		}
		q := 1 / (1 + B*a[i]*s)
		Az := A * zz * q
		logG[i] = -Az*s + b[i]*I
		dLogG[i] = -Az*q*h + b[i]
	}
	return 0
}

// Ideal sets every activity coefficient to 1 (and the activity of water to 1). It holds
// only at infinite dilution; it exists for hand-calculation checks. Its stated limit is
// I = 0.001 mol/kg.
type Ideal struct{}

func (Ideal) Name() string { return "ideal" }

func (Ideal) MaxIonicStrength() float64 { return 0.001 }

func (Ideal) LogGammas(logG, dLogG []float64, st *ActivityState) float64 {
	clear(logG)
	clear(dLogG[:len(logG)])
	return 0
}

// ModelByName returns the activity model with the given name ("davies",
// "truesdell-jones" or "tj", "ideal", "pitzer"), case-insensitive, or false.
func ModelByName(name string) (ActivityModel, bool) {
	switch strings.ToLower(strings.TrimSpace(name)) {
	case "davies":
		return Davies{}, true
	case "truesdell-jones", "truesdelljones", "tj":
		return TruesdellJones{}, true
	case "ideal":
		return Ideal{}, true
	case "pitzer":
		return NewPitzer(), true
	}
	return nil, false
}

// ModelNames lists the names ModelByName accepts (canonical forms).
func ModelNames() []string { return []string{"davies", "truesdell-jones", "ideal", "pitzer"} }
