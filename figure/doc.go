// Package figure draws the figures of gwsat: saturation-index maps, depth
// profiles, blending and temperature curves, bar charts, Piper and Stiff
// diagrams and SI against time, on gonum.org/v1/plot.
//
// The package draws what it is given and imports none of gwsat's other
// packages. Each kind of figure is a plain input type: [SIMap] (an
// interpolated saturation-index surface on a [Grid], its near-equilibrium
// zone hatched, with [Well] symbols, site [Feature]s styled by class, a
// colour bar, a scale bar and a north arrow), [SIMaps] (several map panels,
// e.g. one per sampling round, with one legend, colour bar and caption),
// [DepthProfile] (SI against depth, one column per mineral, one row per
// well nest, rounds as line styles), [Curves] (SI against mixing fraction
// or temperature, one [Series] per mineral), [Bars] (for example
// precipitation potential per mineral, on a log axis when amounts differ by
// orders of magnitude) and [Piper] (the trilinear major-ion diagram of Piper 1944, one
// [PiperPoint] per sample), [Stiff] and [StiffGrid] (Stiff 1951 polygons of
// the major ions per well, small multiples on a shared scale, paged by
// [StiffGrid.Pages]) and [SITime] (SI against time per well with interval
// bars and the near-equilibrium band). Every one of them is a [Figure]; [Panels] tiles several figures
// on one page, and [Render] draws a figure into PNG (300 dpi), SVG (fonts
// embedded) or PDF bytes, turning drawing panics into errors. Callers write
// the bytes to files themselves, atomically.
//
// Saturation index is shown in [Diverging], a blue-white-orange colour scale
// centred on SI = 0, whose lightness rises monotonically from each end to
// the neutral centre and whose two ends differ in lightness, so that the
// figures stay readable in grey-scale print and for colour-blind readers.
// Each mineral keeps one colour, marker and dash pattern in every curve,
// profile and bar chart: [MineralStyle], from colour-blind-safe palettes in
// the fixed order of [mineralOrder]. Map well symbols show SI colour
// instead.
//
// Non-finite values (NaN, ±Inf) never reach the plotting library: they are
// left out, and each input type reports how many through its Skipped method.
// A figure with nothing to draw returns [ErrNoData] instead of a blank image.
//
// The figures are for screening: they show computed saturation states, not
// a design. Defer to local codes and licensed professionals.
package figure
