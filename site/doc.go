// Package site places assessed samples on a site and draws what a report shows of
// them: SI maps per mineral, depth zone and sampling round in the UTM zone of
// the wells (interpolated surfaces only where enough wells and a leave-one-out
// error below the near-equilibrium band allow, else the measured values),
// depth profiles per well cluster for every round and a Piper diagram. Build
// composes them and records per surface whether it was drawn and why
// ([SurfaceRow]); the figures are plain values of package figure, rendered by
// the caller. [WriteLayers] writes the drawn surfaces as GIS layers (GeoTIFF
// rasters and GeoJSON equilibrium lines and zones) and the site features.
package site
