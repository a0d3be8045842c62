package hydro

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
