package sitereport

import (
	"encoding/json"
	"fmt"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
)

// GDAL, an independent reader, opens every GIS layer of the demo report: each
// raster with a UTM coordinate system (the demo site lies in zone 14 north) and a
// finite extent, each vector layer with at least one feature of the kind it
// should hold. Skipped where GDAL is absent, except in CI (CI=true), which
// installs it.
func TestDemoGISLayersOpenInGDAL(t *testing.T) {
	gdalinfo := needTool(t, "gdalinfo")
	ogrinfo := needTool(t, "ogrinfo")
	dir, _ := demoReport(t)
	tifs, _ := filepath.Glob(filepath.Join(dir, "gis", "*.tif"))
	vecs, _ := filepath.Glob(filepath.Join(dir, "gis", "*.geojson"))
	if len(tifs) == 0 || len(vecs) == 0 {
		t.Fatalf("%d rasters and %d vector layers in gis/", len(tifs), len(vecs))
	}
	for _, f := range tifs {
		out, err := exec.Command(gdalinfo, "-json", f).Output()
		if err != nil {
			t.Fatalf("gdalinfo %s: %v", filepath.Base(f), err)
		}
		var info struct {
			CoordinateSystem struct {
				WKT string `json:"wkt"`
			} `json:"coordinateSystem"`
			CornerCoordinates struct {
				UpperLeft, LowerRight []float64
			} `json:"cornerCoordinates"`
		}
		if err := json.Unmarshal(out, &info); err != nil {
			t.Fatal(err)
		}
		if !strings.Contains(info.CoordinateSystem.WKT, "UTM zone 14N") {
			t.Errorf("%s: coordinate system %.80q", filepath.Base(f), info.CoordinateSystem.WKT)
		}
		ul, lr := info.CornerCoordinates.UpperLeft, info.CornerCoordinates.LowerRight
		if len(ul) != 2 || len(lr) != 2 || !(lr[0] > ul[0] && ul[1] > lr[1]) || ul[0] < 100000 || ul[0] > 900000 {
			t.Errorf("%s: extent %v %v is not a UTM box", filepath.Base(f), ul, lr)
		}
	}
	for _, f := range vecs {
		out, err := exec.Command(ogrinfo, "-so", "-al", f).Output()
		if err != nil {
			t.Fatalf("ogrinfo %s: %v", filepath.Base(f), err)
		}
		var n int
		i := strings.Index(string(out), "Feature Count: ")
		if i < 0 {
			t.Fatalf("%s: no feature count:\n%s", filepath.Base(f), out)
		}
		fmt.Sscanf(string(out[i+len("Feature Count: "):]), "%d", &n)
		// The demo's site file holds the boundary, the river, two pipelines and
		// two injection wells (data/demo/README.md): six features.
		if strings.HasPrefix(filepath.Base(f), "site_features") && n != 6 {
			t.Errorf("%s: %d features, want the demo site's 6", filepath.Base(f), n)
		}
	}
}
