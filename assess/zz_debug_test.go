package assess

import (
	"bytes"
	"encoding/json"
	"os"
	"testing"

	"gwsat/data"
	"gwsat/hydro"
	"gwsat/speciation"
)

type dumpW struct {
	T, PH  float64
	Totals []speciation.ComponentTotal
	Alk    float64
	HasAlk bool
	PHCB   bool
	CBI    string
}

func TestZZDump(t *testing.T) {
	raw, _ := data.Demo.ReadFile("demo/samples.csv")
	batch, err := hydro.Read(bytes.NewReader(raw), "samples.csv", hydro.Options{})
	if err != nil {
		t.Fatal(err)
	}
	var out []dumpW
	for _, r := range batch.Rows {
		w, _ := r.Sample.Water()
		var sw speciation.Water
		SpeciationWater(&sw, &w, w.TempC)
		a, ha := sw.Alkalinity()
		out = append(out, dumpW{sw.TempC, sw.PH, sw.Totals(), a, ha, sw.PHFromChargeBalance, sw.ChargeBalanceIon})
	}
	b, _ := json.Marshal(out)
	os.WriteFile("/tmp/perf/demo_waters.json", b, 0o644)
}
