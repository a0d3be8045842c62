package hydro

import (
	"math"
	"strconv"
	"strings"
)

// wellApartM is the distance beyond which two rows of one well id are taken
// to be at different places (`common practice`: well coordinates from a
// handheld GPS or a site plan agree within tens of metres).
const wellApartM = 100

// apartM returns the distance in metres between the locations of two
// samples, and false when they cannot be compared.
func apartM(a, b *Sample) (float64, bool) {
	if a.Easting.OK && a.Northing.OK && b.Easting.OK && b.Northing.OK && a.EPSG == b.EPSG {
		return math.Hypot(a.Easting.V-b.Easting.V, a.Northing.V-b.Northing.V), true
	}
	if a.Lat.OK && a.Lon.OK && b.Lat.OK && b.Lon.OK {
		// Equirectangular approximation on a sphere of radius 6371 km
		// (mean Earth radius), ample for a 100 m threshold.
		const r = 6371000.0
		lat := (a.Lat.V + b.Lat.V) / 2 * math.Pi / 180
		dx := (a.Lon.V - b.Lon.V) * math.Pi / 180 * math.Cos(lat)
		dy := (a.Lat.V - b.Lat.V) * math.Pi / 180
		return r * math.Hypot(dx, dy), true
	}
	return 0, false
}

// markDuplicates warns on every row whose sample id is used again, and on
// rows sharing a well id at places more than wellApartM apart (both rows
// are kept as they are).
func markDuplicates(rows []Row) {
	wells := map[string][]int{}
	for i, r := range rows {
		if r.Sample.WellID != "" {
			wells[r.Sample.WellID] = append(wells[r.Sample.WellID], i)
		}
	}
	// Each row is compared with the first located row of its well (linear
	// in the number of rows).
	for id, idx := range wells {
		anchor := -1
		for _, i := range idx {
			if _, ok := apartM(&rows[i].Sample, &rows[i].Sample); ok {
				anchor = i
				break
			}
		}
		if anchor < 0 {
			continue
		}
		for _, i := range idx {
			if i == anchor {
				continue
			}
			if d, ok := apartM(&rows[i].Sample, &rows[anchor].Sample); ok && d > wellApartM {
				rows[i].add(Warning, CodeWellApart, rows[i].Line, "", "well id %q also on line %d, %.1f km away: two wells with one id, or a mislabel?", id, rows[anchor].Line, d/1000)
				rows[anchor].add(Warning, CodeWellApart, rows[anchor].Line, "", "well id %q also on line %d, %.1f km away: two wells with one id, or a mislabel?", id, rows[i].Line, d/1000)
			}
		}
	}
	// One sample id on two sampling events (rounds, or dates when the
	// file has no round) is one well sampled twice, not a duplicate.
	at := map[string][]int{}
	key := func(s *Sample) string { return s.ID + "\x00" + s.Event }
	for i := range rows {
		if rows[i].Sample.ID != "" {
			k := key(&rows[i].Sample)
			at[k] = append(at[k], rows[i].Line)
		}
	}
	for i := range rows {
		ls := at[key(&rows[i].Sample)]
		if rows[i].Sample.ID == "" || len(ls) < 2 {
			continue
		}
		var others []string
		for _, l := range ls {
			if l != rows[i].Line {
				others = append(others, strconv.Itoa(l))
			}
		}
		what := "sample id %q also used on line %s; rows kept apart"
		if rows[i].Sample.Event != "" {
			what = "sample id %q of the same event also used on line %s; rows kept apart"
		}
		rows[i].add(Warning, CodeDuplicateID, rows[i].Line, "", what, rows[i].Sample.ID, strings.Join(others, ", "))
	}
}
