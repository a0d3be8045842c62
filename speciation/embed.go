package speciation

import _ "embed"

//go:embed thermo.txt
var thermo string

// Thermo returns the text of the embedded thermodynamic data set (thermo.txt beside
// this file; its format is described at its top). Default parses it.
func Thermo() string { return thermo }
