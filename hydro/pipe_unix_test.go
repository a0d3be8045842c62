//go:build unix

package hydro

import (
	"io"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"syscall"
	"testing"
)

// A named pipe is read once (a second open would find it empty), and
// ReadFile still warns both rows of a duplicate.
func TestScanFilePipe(t *testing.T) {
	path := filepath.Join(t.TempDir(), "lab.csv")
	if err := syscall.Mkfifo(path, 0o600); err != nil {
		t.Skipf("no named pipes here: %v", err)
	}
	text := scanInputs["wide"]
	want, err := Read(strings.NewReader(text), path, Options{})
	if err != nil {
		t.Fatal(err)
	}
	for _, whole := range []bool{true, false} {
		done := make(chan error, 1)
		go func() {
			f, err := os.OpenFile(path, os.O_WRONLY, 0)
			if err == nil {
				_, err = io.WriteString(f, text)
				if cerr := f.Close(); err == nil {
					err = cerr
				}
			}
			done <- err
		}()
		var rows []Row
		if whole {
			b, err := ReadFile(path, Options{})
			if err != nil {
				t.Fatal(err)
			}
			rows = b.Rows
		} else {
			s, err := ScanFile(path, Options{})
			if err != nil {
				t.Fatal(err)
			}
			rows = scanAll(t, s)
		}
		if err := <-done; err != nil {
			t.Fatal(err)
		}
		if len(rows) != len(want.Rows) {
			t.Fatalf("whole %v: %d rows, want %d", whole, len(rows), len(want.Rows))
		}
		if whole && !reflect.DeepEqual(rows, want.Rows) {
			t.Errorf("ReadFile of a pipe differs from Read")
		}
	}
}
