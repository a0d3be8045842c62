package site

import (
	"bytes"
	"context"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"sync"
	"testing"

	"github.com/paulmach/orb"
	"github.com/paulmach/orb/geojson"
	"gonum.org/v1/plot/vg"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/data"
	"gwsat.dev/gwsat/figure"
	"gwsat.dev/gwsat/geo"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

var (
	demoOnce sync.Once
	demoSt   *Site
	demoErr  error
)

// demoSite builds the site of the demo data set (the report's --demo).
func demoSite(t testing.TB) *Site {
	t.Helper()
	demoOnce.Do(func() {
		fs := data.Demo()
		raw, err := fs.ReadFile("demo/samples.csv")
		if err != nil {
			demoErr = err
			return
		}
		b, err := hydro.Read(bytes.NewReader(raw), "demo/samples.csv", hydro.Options{})
		if err != nil {
			demoErr = err
			return
		}
		db, err := speciation.Default()
		if err != nil {
			demoErr = err
			return
		}
		recs, err := assess.Run(context.Background(), db, []*hydro.Batch{b}, assess.Options{})
		if err != nil {
			demoErr = err
			return
		}
		sraw, err := fs.ReadFile("demo/site.geojson")
		if err != nil {
			demoErr = err
			return
		}
		feats, err := geo.ReadSiteFeatures(bytes.NewReader(sraw))
		if err != nil {
			demoErr = err
			return
		}
		demoSt, demoErr = Build(recs, db.MineralNames(), Options{Features: feats, Model: "Truesdell-Jones"})
	})
	if demoErr != nil {
		t.Fatal(demoErr)
	}
	return demoSt
}

// Every surface row says whether its surface is drawn, and the rule holds:
// drawn exactly when it has enough wells and a leave-one-out error below
// the band.
func TestDemoSurfacesSayWhy(t *testing.T) {
	st := demoSite(t)
	if len(st.Surfaces) == 0 {
		t.Fatal("no surfaces")
	}
	drawn := 0
	for _, r := range st.Surfaces {
		want := r.Wells >= MinWellsSurface && r.HasCV && r.CVRMSE < MaxSurfaceCVRMSE
		if r.Drawn != want {
			t.Errorf("%s %s round %s: drawn %v with %d wells, CV %v (%v)", r.Mineral, r.Zone, r.Round, r.Drawn, r.Wells, r.CVRMSE, r.HasCV)
		}
		if r.Note == "" || r.Drawn != strings.Contains(r.Note, "surface drawn") {
			t.Errorf("%s %s round %s: note %q for drawn = %v", r.Mineral, r.Zone, r.Round, r.Note, r.Drawn)
		}
		if r.Drawn {
			drawn++
		}
	}
	if drawn == 0 || drawn == len(st.Surfaces) {
		t.Logf("%d of %d surfaces drawn", drawn, len(st.Surfaces))
	}
	// The panels follow the rows: a surface where drawn, posted values
	// where not.
	var panels []figure.SIMap
	for _, f := range st.Figures {
		if ms, ok := f.Figure.(figure.SIMaps); ok {
			panels = append(panels, ms.Maps...)
		}
	}
	if len(panels) != len(st.Surfaces) {
		t.Fatalf("%d map panels for %d surface rows", len(panels), len(st.Surfaces))
	}
	for i, p := range panels {
		r := st.Surfaces[i]
		if (p.Grid != nil) != r.Drawn || p.PostValues == r.Drawn || p.Note == "" {
			t.Errorf("panel %q: grid %v, posted values %v, note %q; row drawn %v", p.Title, p.Grid != nil, p.PostValues, p.Note, r.Drawn)
		}
	}
}

// On every demo map no two labels overlap, and no label lies on a north
// arrow or scale bar.
func TestDemoMapLabelsApart(t *testing.T) {
	st := demoSite(t)
	n := 0
	for _, f := range st.Figures {
		ms, ok := f.Figure.(figure.SIMaps)
		if !ok {
			continue
		}
		n++
		labels, furniture, err := ms.LabelBoxes(f.W, f.H)
		if err != nil {
			t.Fatalf("%s: %v", f.Stem, err)
		}
		if len(labels) == 0 {
			t.Errorf("%s: no label placed", f.Stem)
		}
		for i := range labels {
			for j := i + 1; j < len(labels); j++ {
				if overlap(labels[i], labels[j]) {
					t.Errorf("%s: labels %v and %v overlap", f.Stem, labels[i], labels[j])
				}
			}
			for _, fu := range furniture {
				if overlap(labels[i], fu) {
					t.Errorf("%s: label %v lies on map furniture %v", f.Stem, labels[i], fu)
				}
			}
		}
	}
	if n == 0 {
		t.Fatal("no map figure in the demo")
	}
}

func overlap(a, b vg.Rectangle) bool {
	return a.Min.X < b.Max.X && b.Min.X < a.Max.X && a.Min.Y < b.Max.Y && b.Min.Y < a.Max.Y
}

// WriteLayers writes a GeoTIFF and an equilibrium layer per drawn surface
// and the site features; the GeoJSON decodes (RFC 7946 lon/lat near the
// site) with the expected feature counts.
func TestWriteLayersDemo(t *testing.T) {
	st := demoSite(t)
	dir := t.TempDir()
	names, err := WriteLayers(dir, st)
	if err != nil {
		t.Fatal(err)
	}
	drawn := 0
	for _, r := range st.Surfaces {
		if r.Drawn {
			drawn++
		}
	}
	if want := 2*drawn + 1; len(names) != want {
		t.Fatalf("%d files, want %d (2 per drawn surface + site features)", len(names), want)
	}
	centre := st.features[0].Geometry.Bound().Center()
	for _, name := range names {
		b, err := os.ReadFile(filepath.Join(dir, name))
		if err != nil {
			t.Fatal(err)
		}
		if !strings.HasSuffix(name, ".geojson") {
			continue
		}
		fc, err := geojson.UnmarshalFeatureCollection(b)
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		if name == SiteFeaturesFile && len(fc.Features) != len(st.features) {
			t.Errorf("%s: %d features, want %d", name, len(fc.Features), len(st.features))
		}
		for _, f := range fc.Features {
			bd := f.Geometry.Bound()
			for _, p := range []orb.Point{bd.Min, bd.Max} {
				if d := geo.Distance(centre, p); d > 20000 {
					t.Errorf("%s: point %v lies %.0f m from the site: not lon/lat?", name, p, d)
				}
			}
		}
	}
	ogrinfoCounts(t, dir, names)
	gdalinfoUTM(t, dir, names, st.EPSG)
}

// ogrinfo (GDAL) reads each GeoJSON layer with the feature count we wrote.
func ogrinfoCounts(t *testing.T, dir string, names []string) {
	bin, err := exec.LookPath("ogrinfo")
	if err != nil {
		t.Log("ogrinfo not installed: GeoJSON not checked with GDAL")
		return
	}
	re := regexp.MustCompile(`Feature Count: (\d+)`)
	for _, name := range names {
		if !strings.HasSuffix(name, ".geojson") {
			continue
		}
		path := filepath.Join(dir, name)
		out, err := exec.Command(bin, "-ro", "-so", "-al", path).CombinedOutput()
		if err != nil {
			t.Fatalf("ogrinfo %s: %v\n%s", name, err, out)
		}
		m := re.FindSubmatch(out)
		b, _ := os.ReadFile(path)
		fc, _ := geojson.UnmarshalFeatureCollection(b)
		if m == nil || string(m[1]) != strconv.Itoa(len(fc.Features)) {
			t.Errorf("ogrinfo %s: %q, want Feature Count: %d", name, m, len(fc.Features))
		}
	}
}

// gdalinfo (GDAL) reads each raster in the site's UTM zone.
func gdalinfoUTM(t *testing.T, dir string, names []string, epsg int) {
	bin, err := exec.LookPath("gdalinfo")
	if err != nil {
		t.Log("gdalinfo not installed: GeoTIFF not checked with GDAL")
		return
	}
	c, _ := geo.ParseEPSG(epsg)
	want := "UTM zone " + strconv.Itoa(c.Zone)
	for _, name := range names {
		if !strings.HasSuffix(name, ".tif") {
			continue
		}
		out, err := exec.Command(bin, filepath.Join(dir, name)).CombinedOutput()
		if err != nil {
			t.Fatalf("gdalinfo %s: %v\n%s", name, err, out)
		}
		if !bytes.Contains(out, []byte(want)) || !bytes.Contains(out, []byte("NoData Value=-9999")) {
			t.Errorf("gdalinfo %s: no %q or no-data value in\n%s", name, want, out)
		}
	}
}

// Maps and profiles are drawn at A4 text width (16-17 cm), so a page that
// shows them at that width prints their smallest type (8 pt) at 8 pt.
func TestDemoFiguresPrintWidth(t *testing.T) {
	st := demoSite(t)
	for _, f := range st.Figures {
		if f.W < 16*vg.Centimeter || f.W > 17*vg.Centimeter {
			t.Errorf("%s: %.1f cm wide, want 16-17 cm", f.Stem, f.W.Points()/vg.Centimeter.Points())
		}
		if f.H > 25*vg.Centimeter {
			t.Errorf("%s: %.1f cm tall: more than an A4 text height", f.Stem, f.H.Points()/vg.Centimeter.Points())
		}
	}
}
