package outguard_test

import (
	"errors"
	"fmt"
	"os"
	"path/filepath"

	"gwsat.dev/gwsat/internal/outguard"
)

func ExampleSet() {
	dir, err := os.MkdirTemp("", "outguard")
	if err != nil {
		fmt.Println(err)
		return
	}
	defer os.RemoveAll(dir)
	lab := filepath.Join(dir, "lab.csv")
	if err := os.WriteFile(lab, []byte("well,Ca\n"), 0o644); err != nil {
		fmt.Println(err)
		return
	}

	var guard outguard.Set
	fmt.Println(guard.AddInput(lab))
	fmt.Println(guard.AddOutput(filepath.Join(dir, "si.csv")))
	err = guard.AddOutput(filepath.Join(dir, "sub", "..", "lab.csv"))
	fmt.Println(errors.Is(err, outguard.ErrSameFile))
	err = guard.AddOutputDir(dir)
	fmt.Println(errors.Is(err, outguard.ErrInputInDir))
	// Output:
	// <nil>
	// <nil>
	// true
	// true
}
