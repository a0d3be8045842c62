//go:build unix

package atomicfile

import (
	"bufio"
	"errors"
	"fmt"
	"io"
	"os"
	"os/exec"
	"os/signal"
	"path/filepath"
	"syscall"
	"testing"
)

// helperEnv names the destination for the helper process; see TestMain.
const helperEnv = "GWSAT_ATOMICFILE_SIGNAL_HELPER"

// TestMain turns the test binary into the helper process of TestSignalRemovesTemp
// when helperEnv is set: it starts a write that never finishes, says "ready", and
// on SIGTERM does what a command's main should do.
func TestMain(m *testing.M) {
	if dest := os.Getenv(helperEnv); dest != "" {
		stop := make(chan os.Signal, 1)
		signal.Notify(stop, syscall.SIGTERM, syscall.SIGINT)
		go func() {
			<-stop
			RemoveInFlight()
			os.Exit(143) // 128 + SIGTERM, as a shell reports it
		}()
		err := WriteWith(dest, func(w io.Writer) error {
			io.WriteString(w, "half a table")
			fmt.Println("ready")
			select {} // until the signal comes
		})
		fmt.Fprintln(os.Stderr, "helper: write ended:", err)
		os.Exit(1)
	}
	os.Exit(m.Run())
}

func TestSignalRemovesTemp(t *testing.T) {
	dir := t.TempDir()
	dest := filepath.Join(dir, "out.csv")
	if err := WriteFile(dest, []byte("previous")); err != nil {
		t.Fatal(err)
	}
	cmd := exec.Command(os.Args[0], "-test.run=^$")
	cmd.Env = append(os.Environ(), helperEnv+"="+dest)
	out, err := cmd.StdoutPipe()
	if err != nil {
		t.Fatal(err)
	}
	if err := cmd.Start(); err != nil {
		t.Fatal(err)
	}
	line, err := bufio.NewReader(out).ReadString('\n')
	if err != nil || line != "ready\n" {
		cmd.Process.Kill()
		t.Fatalf("helper said %q, %v", line, err)
	}
	if entries, _ := os.ReadDir(dir); len(entries) != 2 {
		t.Errorf("while writing the folder holds %v, want the file and a temporary", entries)
	}
	if err := cmd.Process.Signal(syscall.SIGTERM); err != nil {
		t.Fatal(err)
	}
	err = cmd.Wait()
	var ee *exec.ExitError
	if !errors.As(err, &ee) || ee.ExitCode() != 143 {
		t.Errorf("helper ended with %v, want exit status 143", err)
	}
	entries, _ := os.ReadDir(dir)
	if len(entries) != 1 || entries[0].Name() != "out.csv" {
		t.Errorf("after SIGTERM the folder holds %v", entries)
	}
	if got, _ := os.ReadFile(dest); string(got) != "previous" {
		t.Errorf("destination holds %q", got)
	}
}
