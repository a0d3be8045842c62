package main

import (
	"os"
	"os/exec"
	"path/filepath"
	"testing"
)

// The library can be imported by another Go module: testdata/extmod is a module
// of its own (example.org/gwsatuser) that requires gwsat.dev/gwsat through a
// replace directive and reads a CSV, speciates it and reads the SIs. Its tests
// run here with the go command on PATH.
func TestLibraryFromAnotherModule(t *testing.T) {
	if testing.Short() {
		t.Skip("builds another module")
	}
	goBin, err := exec.LookPath("go")
	if err != nil {
		t.Fatalf("no go command on PATH: %v", err)
	}
	cmd := exec.Command(goBin, "test", "-count=1", "./...")
	cmd.Dir = filepath.Join("..", "..", "testdata", "extmod")
	cmd.Env = append(os.Environ(), "GOFLAGS=-mod=mod", "GOWORK=off")
	out, err := cmd.CombinedOutput()
	if err != nil {
		t.Fatalf("the external module's tests failed: %v\n%s", err, out)
	}
}
