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

// A link is followed (its target replaced, the link kept); a named pipe or
// a device is written into, never replaced.
func TestWriteFileLinkAndPipe(t *testing.T) {
	dir := t.TempDir()
	target := filepath.Join(dir, "target.csv")
	link := filepath.Join(dir, "link.csv")
	if err := os.WriteFile(target, []byte("old"), 0o644); err != nil {
		t.Fatal(err)
	}
	if err := os.Symlink(target, link); err != nil {
		t.Skip("no symlinks here:", err)
	}
	if err := WriteFile(link, []byte("new")); err != nil {
		t.Fatal(err)
	}
	if fi, err := os.Lstat(link); err != nil || fi.Mode()&os.ModeSymlink == 0 {
		t.Errorf("the link was replaced by a file")
	}
	if got, _ := os.ReadFile(target); string(got) != "new" {
		t.Errorf("target holds %q", got)
	}

	if err := WriteFile(os.DevNull, []byte("discarded")); err != nil {
		t.Fatalf("writing %s: %v", os.DevNull, err)
	}
	if fi, err := os.Stat(os.DevNull); err != nil || fi.Mode().IsRegular() {
		t.Fatalf("%s is no longer a device", os.DevNull)
	}

	fifo := filepath.Join(dir, "pipe")
	if err := mkfifo(fifo); err != nil {
		t.Skip("no named pipes here:", err)
	}
	got := make(chan string)
	go func() {
		b, _ := os.ReadFile(fifo)
		got <- string(b)
	}()
	if err := WriteFile(fifo, []byte("through the pipe")); err != nil {
		t.Fatal(err)
	}
	if s := <-got; s != "through the pipe" {
		t.Errorf("pipe read %q", s)
	}
	if fi, _ := os.Lstat(fifo); fi.Mode()&os.ModeNamedPipe == 0 {
		t.Errorf("the pipe was replaced")
	}
}

// A dangling link gets its target created and stays a link, as with os.Create;
// a directory is refused.
func TestWriteFileDanglingLinkAndDirectory(t *testing.T) {
	dir := t.TempDir()
	link := filepath.Join(dir, "link.csv")
	if err := os.Symlink("sub/../target.csv", link); err != nil {
		t.Skip("no symlinks here:", err)
	}
	if err := os.Mkdir(filepath.Join(dir, "sub"), 0o755); err != nil {
		t.Fatal(err)
	}
	if err := WriteFile(link, []byte("new")); err != nil {
		t.Fatal(err)
	}
	if fi, err := os.Lstat(link); err != nil || fi.Mode()&os.ModeSymlink == 0 {
		t.Errorf("the link was replaced by a file")
	}
	if got, err := os.ReadFile(filepath.Join(dir, "target.csv")); string(got) != "new" {
		t.Errorf("target holds %q, %v", got, err)
	}
	if err := WriteFile(filepath.Join(dir, "sub"), []byte("x")); !errors.Is(err, ErrIsDir) {
		t.Errorf("writing a directory: %v, want ErrIsDir", err)
	}
}

// A fill that panics leaves no temporary file; the panic still reaches the caller.
func TestWriteWithPanicLeavesNothing(t *testing.T) {
	dir := t.TempDir()
	func() {
		defer func() {
			if recover() == nil {
				t.Error("the panic was swallowed")
			}
		}()
		WriteWith(filepath.Join(dir, "out.csv"), func(w io.Writer) error {
			io.WriteString(w, "half")
			panic("drawing failed")
		})
	}()
	if entries, _ := os.ReadDir(dir); len(entries) != 0 {
		t.Errorf("left behind: %v", entries)
	}
}
