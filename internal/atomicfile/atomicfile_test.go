package atomicfile

import (
	"errors"
	"io"
	"os"
	"path/filepath"
	"testing"
)

func TestWriteFileReplaces(t *testing.T) {
	dir := t.TempDir()
	p := filepath.Join(dir, "out.csv")
	if err := WriteFile(p, []byte("old")); err != nil {
		t.Fatal(err)
	}
	if err := WriteFile(p, []byte("new")); err != nil {
		t.Fatal(err)
	}
	got, err := os.ReadFile(p)
	if err != nil || string(got) != "new" {
		t.Fatalf("got %q, %v; want new", got, err)
	}
}

// A failing writer must leave the previous file intact and no temporary file behind.
func TestWriteWithFailureLeavesNoHalfFile(t *testing.T) {
	dir := t.TempDir()
	p := filepath.Join(dir, "out.csv")
	if err := WriteFile(p, []byte("previous")); err != nil {
		t.Fatal(err)
	}
	boom := errors.New("boom")
	err := WriteWith(p, func(w io.Writer) error {
		io.WriteString(w, "half a fi")
		return boom
	})
	if !errors.Is(err, boom) {
		t.Fatalf("err = %v, want boom", err)
	}
	got, _ := os.ReadFile(p)
	if string(got) != "previous" {
		t.Fatalf("destination changed to %q", got)
	}
	entries, _ := os.ReadDir(dir)
	if len(entries) != 1 {
		t.Fatalf("directory holds %d entries, want only the destination", len(entries))
	}
	// And a failed first write creates nothing at all.
	q := filepath.Join(dir, "never.csv")
	_ = WriteWith(q, func(w io.Writer) error { return boom })
	if _, err := os.Stat(q); !os.IsNotExist(err) {
		t.Fatalf("failed write created %s", q)
	}
}
