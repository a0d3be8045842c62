package hydro

import (
	"fmt"
	"math"
	"strconv"
	"strings"
	"unicode"

	"gwsat.dev/gwsat/speciation"
)

// fieldUnit converts a field parameter to the reader's unit.
type fieldUnit struct {
	name string
	conv func(float64) float64
}

func scale(f float64) func(float64) float64 { return func(v float64) float64 { return v * f } }

var identity = func(v float64) float64 { return v }

// parseFieldUnit parses the unit of a non-analyte numeric parameter; "" is
// the default unit of the class.
func parseFieldUnit(c class, s string) (fieldUnit, bool) {
	k := unitKey(s)
	switch c {
	case clTemp:
		switch k {
		case "", "c", "degc", "celsius", "oc", "degreesc", "degc25":
			return fieldUnit{"C", identity}, true
		case "f", "degf", "fahrenheit", "of":
			return fieldUnit{"F", func(v float64) float64 { return (v - 32) * 5 / 9 }}, true
		case "k", "kelvin":
			return fieldUnit{"K", func(v float64) float64 { return v - 273.15 }}, true
		}
	case clLength, clCoord:
		switch k {
		case "", "m", "meter", "meters", "metre", "metres", "mbgl", "mbgs", "mamsl", "masl", "mbtoc", "mbelowgl", "mmsl":
			return fieldUnit{"m", identity}, true
		case "ft", "feet", "ftbgs", "ftbgl", "ftamsl", "ftasl", "ftmsl":
			if c == clLength {
				return fieldUnit{"ft", scale(0.3048)}, true // international foot, exact
			}
		}
	case clEC:
		switch k {
		case "", "uscm", "umhocm", "umhoscm", "uscm25c", "uscmat25c", "uscm25":
			return fieldUnit{"uS/cm", identity}, true
		case "mscm":
			return fieldUnit{"mS/cm", scale(1000)}, true
		case "msm":
			return fieldUnit{"mS/m", scale(10)}, true
		case "dsm":
			return fieldUnit{"dS/m", scale(1000)}, true
		}
	case clTDS:
		switch k {
		case "", "mgl", "ppm", "mgkg", "mgl180c":
			return fieldUnit{"mg/L", identity}, true
		case "gl":
			return fieldUnit{"g/L", scale(1000)}, true
		}
	case clDensity:
		switch k {
		case "", "kgl", "gml", "gcm3", "gcc", "kgdm3":
			return fieldUnit{"kg/L", identity}, true
		case "kgm3":
			return fieldUnit{"kg/m3", scale(0.001)}, true
		}
	case clDO:
		switch k {
		case "", "mgl", "mgo2l", "ppm":
			return fieldUnit{"mg/L", identity}, true
		}
	case clMV:
		switch k {
		case "", "mv":
			return fieldUnit{"mV", identity}, true
		case "v":
			return fieldUnit{"V", scale(1000)}, true
		}
	case clPressure:
		// Absolute pressure; 1 bar = 0.1 MPa = 100 kPa exactly, 1 psi = 0.0689475729 bar
		// (6894.757 Pa, NIST SP 811), 1 atm = 1.01325 bar exactly.
		switch k {
		case "", "bar", "bars", "bara":
			return fieldUnit{"bar", identity}, true
		case "mpa":
			return fieldUnit{"MPa", scale(10)}, true
		case "kpa":
			return fieldUnit{"kPa", scale(0.01)}, true
		case "psi", "psia":
			return fieldUnit{"psi", scale(0.0689475729)}, true
		case "atm":
			return fieldUnit{"atm", scale(1.01325)}, true
		}
	case clPE:
		if k == "" {
			return fieldUnit{"", identity}, true
		}
	case clPH:
		switch k {
		case "", "su", "units", "stdunits", "phunits", "standardunits":
			return fieldUnit{"", identity}, true
		}
	case clDegrees:
		switch k {
		case "", "deg", "degrees", "dd", "decimaldegrees", "decdeg":
			return fieldUnit{"deg", identity}, true
		}
	case clText, clDate, clInt, clScreen, clLongParam, clLongValue, clLongUnit, clLongQual, clLongDL:
		if k == "" {
			return fieldUnit{"", identity}, true
		}
		if c == clScreen || c == clLongValue || c == clLongDL {
			if k == "m" || k == "mbgl" || k == "mbgs" {
				return fieldUnit{"m", identity}, true
			}
		}
	}
	return fieldUnit{}, false
}

// ParsePressureBar reads an absolute pressure written as a number with an
// optional unit (bar when none; MPa, kPa, psi or atm), such as "250",
// "25 MPa" or "3600psi", and returns it in bar. It refuses a pressure outside
// speciation.MinPressureBar to speciation.MaxPressureBar.
func ParsePressureBar(s string) (float64, error) {
	t := strings.TrimSpace(s)
	i := strings.IndexFunc(t, func(r rune) bool { return unicode.IsLetter(r) })
	num, unit := t, ""
	if i >= 0 {
		num, unit = strings.TrimSpace(t[:i]), t[i:]
	}
	v, err := strconv.ParseFloat(num, 64)
	if err != nil || math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, fmt.Errorf("hydro: pressure %q is not a number with an optional unit (bar, MPa, kPa, psi, atm)", s)
	}
	fu, ok := parseFieldUnit(clPressure, unit)
	if !ok {
		return 0, fmt.Errorf("hydro: pressure %q: unknown unit %q (bar, MPa, kPa, psi, atm)", s, unit)
	}
	v = fu.conv(v)
	if v < speciation.MinPressureBar || v > speciation.MaxPressureBar {
		return 0, fmt.Errorf("hydro: pressure %.4g bar outside %g-%g bar (absolute)", v, speciation.MinPressureBar, speciation.MaxPressureBar)
	}
	return v, nil
}
