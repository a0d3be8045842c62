package assess

import (
	"strings"

	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

// pressure decides the absolute pressure (bar) a row is speciated at: its own
// Pressure column, else Options.Hydrostatic from its depth, else
// Options.PressureBar; 0 stands for 1 bar. It is kept in Record.PressureBar.
func (r *Record) pressure(opt Options) float64 {
	switch {
	case r.Water.HasPressure:
		r.PressureBar = r.Water.PressureBar
	case opt.Hydrostatic:
		d, ok := DepthM(r.Sample())
		if !ok || d < 0 {
			r.Note(hydro.Info, CodeNoDepth, "no sample depth: speciated at 1 bar (a hydrostatic pressure needs the depth)")
			r.PressureBar = 0
			break
		}
		r.PressureBar = min(speciation.HydrostaticPressureBar(d), speciation.MaxPressureBar)
	default:
		r.PressureBar = opt.PressureBar
	}
	return r.PressureBar
}

// pressureNotes says, at a pressure other than 1 bar, which SIs are
// extrapolated beyond their data's pressure range (a warning) and which keep
// their 1 bar log K for want of pressure data.
func pressureNotes(r *Record, res *speciation.Result) {
	if res.PressureBar == 1 {
		return
	}
	var outside, none []string
	for _, m := range res.Minerals {
		switch {
		case m.OutsidePressureRange:
			outside = append(outside, m.Name)
		case m.NoPressureData:
			none = append(none, m.Name)
		}
	}
	if len(outside) > 0 {
		r.Note(hydro.Warning, CodePressureRange, "at %.4g bar, outside the pressure range of their data: %s (those SIs are extrapolated)", res.PressureBar, strings.Join(outside, ", "))
	}
	if len(none) > 0 {
		r.Note(hydro.Info, CodeNoPressureData, "at %.4g bar, no pressure data: %s (those SIs use the 1 bar log K)", res.PressureBar, strings.Join(none, ", "))
	}
}
