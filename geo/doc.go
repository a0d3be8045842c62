// Package geo places groundwater samples on the Earth and turns scattered
// well values into surfaces: coordinate conversion, geodesic distance,
// interpolation that never extrapolates, and GeoJSON in and out.
//
// Points are orb.Point values in [longitude, latitude] order on WGS84
// (github.com/paulmach/orb). NAD83 codes are accepted and treated as WGS84,
// a simplification worth up to about 2 m in North America.
//
// # Coordinates
//
// ParseEPSG, FromLonLat and ToLonLat handle EPSG:4326, EPSG:4269 and UTM
// zones EPSG:326zz, 327zz (WGS84) and 269zz (NAD83) in pure Go, with a
// TransverseMercator built on Krueger's series to sixth order in n as given
// by Karney (2011), J. Geodesy 85, 475-485 (nanometre accuracy within a
// zone; the tests hold it to 1 mm against PROJ and Snyder 1987). UTMZone and
// UTMEPSG pick a zone. A LocalFrame is a transverse Mercator centred on the
// data, giving metres east and north of the centroid; its Forward and
// Inverse methods have the shape of an orb.Projection. ValidLonLat flags
// impossible or suspicious positions (NaN, out of range, the (0, 0) "null
// island" of blank cells) so callers can keep such rows in tables and leave
// them off maps.
//
// # Distance
//
// Distance and Geodesic solve the inverse geodesic problem on the ellipsoid
// with Vincenty's (1975) method (sub-millimetre for well fields). For the
// rare nearly antipodal pair where it does not converge, DistanceOK reports
// ErrNoConvergence and Distance falls back to a spherical estimate.
//
// # Surfaces
//
// Interpolation works in a planar frame in metres (project with a
// LocalFrame first). NewIDW (inverse-distance weighting, optional k nearest
// neighbours on gonum's k-d tree) and NewKriging (ordinary kriging with a
// Variogram fitted by FitVariogram to an ExperimentalVariogram, Cressie 1985
// weights, gonum/optimize; system solved with gonum/mat) are Interpolators.
// InterpolateIDW and InterpolateKriging lay a Grid over the wells with
// NewLayout and return a Surface: the Grid, the method, the wells' convex
// hull, the buffer, and the leave-one-out cross-validation RMSE in the units
// of the values. Cells farther than the buffer (default 10 % of the hull's
// extent) outside the convex hull hold no estimate: Grid.Valid is false and,
// by convention, the value is NaN, so callers must check Valid (or use At)
// before writing a value anywhere. Wells closer than 1 cm are averaged into
// one (positions and values) and counted in Surface.Merged; fewer than three
// distinct wells is ErrTooFewWells.
//
// # GeoJSON
//
// ReadSiteFeatures reads an optional FeatureCollection of site features
// (boundary, river, injection wells...) into SiteFeature values with a kind
// and name, naming the feature index in any FeatureError. WriteSamples writes
// samples as RFC 7946 Point features with properties in the caller's order,
// coordinates rounded to 1e-6 degree, NaN values as null and unusable
// positions as null geometry. WriteShapes writes lines and polygons (e.g. an
// SI = 0 line from Isolines, a near-equilibrium zone from BandCells, site
// features) the same way, refusing non-finite coordinates and turning
// exterior rings counter-clockwise (RFC 7946 sec. 3.1.6).
//
// # GeoTIFF
//
// WriteGeoTIFF writes a Raster (north-up, float32, a projected EPSG code) as
// a baseline TIFF 6.0 with the GeoTIFF 1.1 (OGC 19-008r4, 2019) tags
// ModelPixelScale, ModelTiepoint and GeoKeyDirectory; empty cells hold
// GeoTIFFNoData. RasterFromGrid takes a grid already in the raster's CRS
// cell for cell; ResampleToCRS moves a LocalFrame grid into a UTM zone by
// nearest neighbour.
//
// Surfaces, maps and distances here are for screening, not design; defer to
// local codes and licensed professionals.
package geo
