package main

import (
	"bytes"
	"encoding/json"

	"github.com/paulmach/orb"
	"github.com/paulmach/orb/geojson"
)

func lonLat(p point) orb.Point {
	lon, lat := toLonLat(p.X, p.Y)
	return orb.Point{lon, lat}
}

func line(ps []point) orb.LineString {
	ls := make(orb.LineString, len(ps))
	for i, p := range ps {
		ls[i] = lonLat(p)
	}
	return ls
}

// siteGeoJSON renders the invented site features as an RFC 7946
// FeatureCollection (lon/lat, coordinates rounded to 1e-6 degree).
func siteGeoJSON() []byte {
	fc := geojson.NewFeatureCollection()
	ring := orb.Ring(line(boundary))
	ring = append(ring, ring[0]) // closed
	b := geojson.NewFeature(orb.Round(orb.Polygon{ring}, 1e6))
	b.Properties = geojson.Properties{
		"kind": "boundary", "name": siteName,
		"note": "invented demo site; no real place, company or person",
	}
	fc.Append(b)

	r := geojson.NewFeature(orb.Round(line(river), 1e6))
	r.Properties = geojson.Properties{"kind": "river", "name": riverName}
	fc.Append(r)

	names := []string{"Injectate pipeline (trunk from the river intake)", "Injectate pipeline (branch to IW-2)"}
	for i, pl := range pipelines {
		f := geojson.NewFeature(orb.Round(line(pl), 1e6))
		f.Properties = geojson.Properties{"kind": "pipeline", "name": names[i]}
		fc.Append(f)
	}

	for _, w := range injectionWells {
		f := geojson.NewFeature(orb.Round(lonLat(w.P), 1e6))
		f.Properties = geojson.Properties{
			"kind": "injection_well", "name": w.Name,
			"screen_top_m_bgl": 35, "screen_bottom_m_bgl": 125,
			"ground_elevation_m": roundTo(groundElev(w.P.X, w.P.Y), 1),
		}
		fc.Append(f)
	}
	raw, err := json.Marshal(fc)
	if err != nil {
		panic(err) // cannot happen for these fixed, finite features
	}
	var out bytes.Buffer
	if err := json.Indent(&out, raw, "", " "); err != nil {
		panic(err)
	}
	out.WriteByte('\n')
	return out.Bytes()
}

func roundTo(v float64, dec int) float64 {
	p := 1.0
	for i := 0; i < dec; i++ {
		p *= 10
	}
	return float64(int64(v*p+0.5)) / p
}
