package hydro

// SpeciationComponent returns the speciation component an analyte key is
// passed on as ("Ca" -> "Ca2+", "SO4" -> "SO4 2-", "TIC" -> "CO3 2-",
// "SiO2" -> "H4SiO4"), and false for keys that are not passed on as a
// component total (alkalinity, HCO3 and CO3, which become the alkalinity;
// ions used in the charge balance only; unknown keys). It is the mapping
// Sample.Water uses.
func SpeciationComponent(key string) (string, bool) {
	if key == "TIC" {
		return "CO3 2-", true
	}
	a, ok := analytes[key]
	if !ok || a.Component == "" {
		return "", false
	}
	return a.Component, true
}
