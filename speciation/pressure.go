package speciation

import "math"

// Pressure limits of a solve, bar (absolute). The mineral pressure data of the
// embedded data set hold to 500 bar (their valid_pressure_bar); a Water above a
// mineral's range is solved, with the mineral's MineralSI.OutsidePressureRange
// set, up to MaxPressureBar, beyond which Solve refuses it: at 1000 bar the
// quadratic form already changes log K by about twice its 500 bar change, and
// the neglect of the aqueous species' pressure dependence is no longer small
// (common practice).
const (
	MinPressureBar = 0.5
	MaxPressureBar = 1000.0
)

// gasConstantCm3Bar is R in cm3 bar/(mol K) (CODATA 2018 R = 8.314462618
// J/(mol K); 1 J = 10 cm3 bar).
const gasConstantCm3Bar = 10 * gasConstant

// PressureLogKShift is the change of log10 K of a reaction from 1 bar to
// pressureBar (bar, absolute) at tempK (kelvin), for a reaction with standard
// volume change dVCm3 (cm3/mol) and compressibility change dKappaCm3Bar =
// -d(dV)/dP (cm3/(mol bar)):
//
//	log K(P) - log K(1 bar) = -dV (P - 1)/(R T ln 10) + 0.5 dkappa (P - 1)^2/(R T ln 10)
//
// the integral of d(ln K)/dP = -dV(P)/(R T) with dV(P) = dV - dkappa (P - 1),
// in the form of Millero (1982), Geochim. Cosmochim. Acta 46, 11-22, "The
// effect of pressure on the solubility of minerals in water and seawater".
// A negative dV (the ions take less room than the solid, the usual case for
// a salt) makes log K rise with pressure.
func PressureLogKShift(dVCm3, dKappaCm3Bar, tempK, pressureBar float64) float64 {
	dp := pressureBar - 1
	return (-dVCm3*dp + 0.5*dKappaCm3Bar*dp*dp) / (gasConstantCm3Bar * tempK * math.Ln10)
}

// HydrostaticPressureBar is the pressure at depthM metres below the water
// table in a column of fresh water: 1 bar at the surface plus rho g h, with
// rho = 1000 kg/m3 and standard gravity 9.80665 m/s2, so 0.0980665 bar per
// metre (common practice; a brine column, a deeper water table or an
// over-pressured aquifer differ).
func HydrostaticPressureBar(depthM float64) float64 {
	return 1 + 0.0980665*depthM
}
