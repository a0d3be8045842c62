package hydro_test

import (
	"fmt"
	"os"
	"path/filepath"
	"strings"

	"gwsat.dev/gwsat/hydro"
)

// A column map file names what two oddly headed columns hold, states their
// units, and gives barium's detection limit for results written "ND".
func ExampleLoadColumnMap() {
	dir, err := os.MkdirTemp("", "colmap")
	if err != nil {
		fmt.Println(err)
		return
	}
	defer os.RemoveAll(dir)
	path := filepath.Join(dir, "map.csv")
	text := "header,parameter,detection_limit\nCalc. Ca++,Ca (mg/L),\nBar.,Ba (ug/L),2\n"
	if err := os.WriteFile(path, []byte(text), 0o600); err != nil {
		fmt.Println(err)
		return
	}
	cm, err := hydro.LoadColumnMap(path)
	if err != nil {
		fmt.Println(err)
		return
	}
	var opt hydro.Options
	cm.Apply(&opt)
	b, err := hydro.Read(strings.NewReader("Sample,Calc. Ca++,Bar.\nA-1,40.1,ND\n"), "lab.csv", opt)
	if err != nil {
		fmt.Println(err)
		return
	}
	r := b.Rows[0]
	ba := r.Sample.Analytes["Ba"]
	fmt.Println(r.Status, r.Sample.Analytes["Ca"].Value, ba.Value, ba.Unit, ba.DetectionLimit)
	// Output:
	// ok 40.1 1 ug/L 2
}
