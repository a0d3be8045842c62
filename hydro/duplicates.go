package hydro

import (
	"hash/maphash"
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

// dupIndex finds sample ids used twice within one sampling event, and
// well ids met at places more than wellApartM apart, with compact state:
// per sample id and event its first line (and every line only for the ids
// used more than once), per well id its first located row's line and
// place. Keys are 64-bit hashes (maphash): two different ids share a key
// with a chance of about n^2/2^65, about 3e-8 for a million ids.
//
// Rows are first observed in file order; annotate then adds the warnings
// to a row. When every row is observed before any is annotated (a second
// pass over a file, or rows collected in memory), every row of a duplicate
// gets its warning; when rows are annotated as they are observed (a stream
// read once), only the later rows can name the earlier ones.
type dupIndex struct {
	seed  maphash.Seed
	first map[uint64]int   // id+event -> first line
	lines map[uint64][]int // id+event used more than once -> every line
	wells map[uint64]wellAnchor
	// far lists, per anchor line, the rows of its well far from it.
	far map[int][]farRow
	// late counts earlier rows that could not be warned (read once).
	late int
}

type wellAnchor struct {
	line int
	at   Sample // only the location fields are kept
}

type farRow struct {
	line int
	km   float64
}

func newDupIndex() *dupIndex {
	return &dupIndex{seed: maphash.MakeSeed(), first: map[uint64]int{}, lines: map[uint64][]int{}, wells: map[uint64]wellAnchor{}, far: map[int][]farRow{}}
}

func (d *dupIndex) hash(parts ...string) uint64 {
	var h maphash.Hash
	h.SetSeed(d.seed)
	for _, p := range parts {
		h.WriteString(p)
		h.WriteByte(0)
	}
	return h.Sum64()
}

// observe records a row (in file order).
func (d *dupIndex) observe(r *Row) {
	s := &r.Sample
	if s.WellID != "" {
		if _, ok := apartM(s, s); ok {
			k := d.hash(s.WellID)
			if a, ok := d.wells[k]; !ok {
				d.wells[k] = wellAnchor{line: r.Line, at: locationOf(s)}
			} else if km, ok := apartM(s, &a.at); ok && km > wellApartM {
				d.far[a.line] = append(d.far[a.line], farRow{line: r.Line, km: km / 1000})
			}
		}
	}
	if s.ID == "" {
		return
	}
	k := d.hash(s.ID, s.Event)
	fl, seen := d.first[k]
	if !seen {
		d.first[k] = r.Line
		return
	}
	if _, ok := d.lines[k]; !ok {
		d.lines[k] = []int{fl}
	}
	d.lines[k] = append(d.lines[k], r.Line)
}

// locationOf keeps the fields apartM uses.
func locationOf(s *Sample) Sample {
	return Sample{Easting: s.Easting, Northing: s.Northing, EPSG: s.EPSG, Lat: s.Lat, Lon: s.Lon}
}

// annotate adds the duplicate warnings of a row already observed.
func (d *dupIndex) annotate(r *Row) {
	s := &r.Sample
	if s.WellID != "" {
		if a, ok := d.wells[d.hash(s.WellID)]; ok {
			if a.line == r.Line {
				for _, f := range d.far[r.Line] {
					r.add(Warning, CodeWellApart, r.Line, "", "well id %q also on line %d, %.1f km away: two wells with one id, or a mislabel?", s.WellID, f.line, f.km)
				}
			} else if km, ok := apartM(s, &a.at); ok && km > wellApartM {
				r.add(Warning, CodeWellApart, r.Line, "", "well id %q also on line %d, %.1f km away: two wells with one id, or a mislabel?", s.WellID, a.line, km/1000)
			}
		}
	}
	if s.ID == "" {
		return
	}
	ls := d.lines[d.hash(s.ID, s.Event)]
	if len(ls) < 2 {
		return
	}
	var others []string
	for _, l := range ls {
		if l != r.Line {
			others = append(others, strconv.Itoa(l))
		}
	}
	if len(others) == 0 {
		return
	}
	what := "sample id %q also used on line %s; rows kept apart"
	if s.Event != "" {
		what = "sample id %q of the same event also used on line %s; rows kept apart"
	}
	r.add(Warning, CodeDuplicateID, r.Line, "", what, s.ID, strings.Join(others, ", "))
}

// observeAnnotate observes a row and warns it at once (a stream read
// once): the row names the earlier rows it repeats; those, already handed
// out, are counted in late.
func (d *dupIndex) observeAnnotate(r *Row) {
	s := &r.Sample
	var lateFar []farRow
	if s.WellID != "" {
		if a, ok := d.wells[d.hash(s.WellID)]; ok && a.line != r.Line {
			lateFar = d.far[a.line]
		}
	}
	nFar := len(lateFar)
	d.observe(r)
	if s.WellID != "" {
		if a, ok := d.wells[d.hash(s.WellID)]; ok && a.line != r.Line && len(d.far[a.line]) > nFar {
			f := d.far[a.line][nFar]
			r.add(Warning, CodeWellApart, r.Line, "", "well id %q also on line %d, %.1f km away: two wells with one id, or a mislabel?", s.WellID, a.line, f.km)
			d.late++
			// only the count matters once read: keep the list short
			d.far[a.line] = d.far[a.line][:0]
		}
	}
	if s.ID == "" {
		return
	}
	ls := d.lines[d.hash(s.ID, s.Event)]
	if len(ls) < 2 {
		return
	}
	others := make([]string, 0, len(ls)-1)
	for _, l := range ls[:len(ls)-1] {
		others = append(others, strconv.Itoa(l))
	}
	what := "sample id %q also used on line %s; rows kept apart"
	if s.Event != "" {
		what = "sample id %q of the same event also used on line %s; rows kept apart"
	}
	r.add(Warning, CodeDuplicateID, r.Line, "", what, s.ID, strings.Join(others, ", "))
	if len(ls) == 2 {
		d.late++
	}
}
