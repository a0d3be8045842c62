package site

import (
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"strings"

	"github.com/paulmach/orb"
	"github.com/paulmach/orb/project"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/geo"
	"gwsat.dev/gwsat/internal/atomicfile"
)

// SiteFeaturesFile is the GeoJSON layer of the site features (boundary,
// rivers, pipelines, injection wells) as read, in WGS 84 lon/lat.
const SiteFeaturesFile = "site_features.geojson"

// WriteLayers writes the GIS layers of the drawn surfaces into dir (made if
// missing), each file atomically, and returns the names written (relative
// to dir), in the order of st.Surfaces:
//
//   - si_<mineral>_<zone>[_round_<r>].tif: the surface as a float32 GeoTIFF
//     in the maps' UTM zone (st.EPSG), cell for cell as drawn, empty cells
//     GeoTIFFNoData;
//   - si_<mineral>_<zone>[_round_<r>]_equilibrium.geojson: the SI = 0 line
//     (MultiLineString, property "layer": "si_zero") and the near-equilibrium
//     zone |SI| <= assess.NearEquilibriumBand (MultiPolygon of grid-cell
//     runs, "layer": "near_equilibrium"), in WGS 84 lon/lat (RFC 7946);
//   - SiteFeaturesFile, when the site has features.
//
// Surfaces not drawn (too few wells, or a leave-one-out error not below the
// band) get no layers; the sample points are written by the report as
// samples.geojson.
func WriteLayers(dir string, st *Site) ([]string, error) {
	if st == nil {
		return nil, nil
	}
	if len(st.grids) != len(st.Surfaces) {
		return nil, fmt.Errorf("site: %d surfaces but %d grids: a Site not made by Build", len(st.Surfaces), len(st.grids))
	}
	if err := os.MkdirAll(dir, 0o755); err != nil {
		return nil, fmt.Errorf("site: GIS layers: %w", err)
	}
	var names []string
	write := func(name string, fill func(w io.Writer) error) error {
		if err := atomicfile.WriteWith(filepath.Join(dir, name), fill); err != nil {
			return fmt.Errorf("site: writing %s: %w", name, err)
		}
		names = append(names, name)
		return nil
	}
	toLL := func(p orb.Point) orb.Point {
		ll, err := geo.ToLonLat(p[0], p[1], st.EPSG)
		if err != nil {
			return orb.Point{math.NaN(), math.NaN()}
		}
		return ll
	}
	for k, row := range st.Surfaces {
		g := st.grids[k]
		if g == nil {
			continue
		}
		stem := layerStem(row)
		r := geo.RasterFromGrid(g, st.EPSG)
		if err := write(stem+".tif", func(w io.Writer) error { return geo.WriteGeoTIFF(w, r) }); err != nil {
			return names, err
		}
		props := func(layer string) []geo.Prop {
			return []geo.Prop{{Key: "layer", Value: layer}, {Key: "mineral", Value: row.Mineral},
				{Key: "depth_zone", Value: row.Zone}, {Key: "round", Value: row.Round},
				{Key: "band_si", Value: assess.NearEquilibriumBand}, {Key: "method", Value: row.Method},
				{Key: "loo_cv_rmse_si", Value: row.CVRMSE}}
		}
		var fs []geo.ShapeFeature
		if zero := geo.Isolines(g, 0); len(zero) > 0 {
			fs = append(fs, geo.ShapeFeature{Geometry: project.Geometry(zero, toLL), Props: props("si_zero")})
		}
		b := assess.NearEquilibriumBand
		if zone := geo.BandCells(g, -b, b); len(zone) > 0 {
			fs = append(fs, geo.ShapeFeature{Geometry: project.Geometry(zone, toLL), Props: props("near_equilibrium")})
		}
		if err := write(stem+"_equilibrium.geojson", func(w io.Writer) error { return geo.WriteShapes(w, fs) }); err != nil {
			return names, err
		}
	}
	if len(st.features) > 0 {
		var fs []geo.ShapeFeature
		for _, f := range st.features {
			fs = append(fs, geo.ShapeFeature{Geometry: f.Geometry, Props: []geo.Prop{{Key: "kind", Value: f.Kind}, {Key: "name", Value: f.Name}}})
		}
		if err := write(SiteFeaturesFile, func(w io.Writer) error { return geo.WriteShapes(w, fs) }); err != nil {
			return names, err
		}
	}
	return names, nil
}

// layerStem names a surface's files: si_<mineral>_<zone>[_round_<r>].
func layerStem(row SurfaceRow) string {
	s := "si_" + slug(row.Mineral) + "_" + slug(row.Zone)
	if row.Round != "" {
		s += "_round_" + slug(row.Round)
	}
	return strings.Trim(s, "_")
}
