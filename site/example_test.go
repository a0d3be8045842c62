package site_test

import (
	"bytes"
	"context"
	"fmt"
	"os"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/data"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/site"
	"gwsat.dev/gwsat/speciation"
)

// Map calcite over the demo site (invented data) and write the GIS layers of
// its surfaces: a GeoTIFF and an equilibrium layer per drawn surface.
func ExampleWriteLayers() {
	raw, _ := data.Demo().ReadFile("demo/samples.csv")
	b, err := hydro.Read(bytes.NewReader(raw), "demo/samples.csv", hydro.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	db, _ := speciation.Default()
	recs, _ := assess.Run(context.Background(), db, []*hydro.Batch{b}, assess.Options{})
	st, err := site.Build(recs, db.MineralNames(), site.Options{Minerals: []string{"calcite"}})
	if err != nil {
		fmt.Println(err)
		return
	}
	dir, _ := os.MkdirTemp("", "gis")
	defer os.RemoveAll(dir)
	names, err := site.WriteLayers(dir, st)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println("maps in EPSG:", st.EPSG)
	fmt.Println(names[0])
	fmt.Println(names[1])
	// Output:
	// maps in EPSG: 32614
	// si_calcite_40_m_depth_round_1.tif
	// si_calcite_40_m_depth_round_1_equilibrium.geojson
}
