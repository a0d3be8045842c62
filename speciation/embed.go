package speciation

import _ "embed"

// Thermo is the text of the embedded thermodynamic data set (thermo.txt beside this
// file; its format is described at its top). Default parses it.
//
//go:embed thermo.txt
var Thermo string
