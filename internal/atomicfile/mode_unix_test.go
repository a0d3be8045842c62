//go:build unix

package atomicfile

import (
	"errors"
	"os"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
)

// A replaced file keeps its permission bits, whatever the umask; a new file gets
// 0o666 less the umask, as os.Create gives. The umask is process-wide, so this test
// is not parallel.
func TestPermissions(t *testing.T) {
	tests := []struct {
		name     string
		umask    int
		existing os.FileMode // 0: no file before
		want     os.FileMode
	}{
		{"new, umask 022", 0o022, 0, 0o644},
		{"new, umask 027", 0o027, 0, 0o640},
		{"new, umask 002", 0o002, 0, 0o664},
		{"private kept", 0o022, 0o600, 0o600},
		{"group-writable kept under umask 022", 0o022, 0o664, 0o664},
		{"world-writable kept under umask 077", 0o077, 0o666, 0o666},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			p := filepath.Join(t.TempDir(), "out.csv")
			if tc.existing != 0 {
				if err := os.WriteFile(p, []byte("old"), 0o600); err != nil {
					t.Fatal(err)
				}
				if err := os.Chmod(p, tc.existing); err != nil {
					t.Fatal(err)
				}
			}
			old := syscall.Umask(tc.umask)
			err := WriteFile(p, []byte("new"))
			syscall.Umask(old)
			if err != nil {
				t.Fatal(err)
			}
			fi, err := os.Stat(p)
			if err != nil {
				t.Fatal(err)
			}
			if got := fi.Mode().Perm(); got != tc.want {
				t.Errorf("mode %v, want %v", got, tc.want)
			}
		})
	}
}

// A read-only file is refused, directly or through a link, and left as it was.
func TestReadOnlyRefused(t *testing.T) {
	dir := t.TempDir()
	p := filepath.Join(dir, "frozen.csv")
	if err := os.WriteFile(p, []byte("keep me"), 0o444); err != nil {
		t.Fatal(err)
	}
	link := filepath.Join(dir, "link.csv")
	if err := os.Symlink("frozen.csv", link); err != nil {
		t.Fatal(err)
	}
	for _, name := range []string{p, link} {
		err := WriteFile(name, []byte("overwritten"))
		if !errors.Is(err, ErrReadOnly) || !strings.Contains(err.Error(), "frozen.csv") {
			t.Errorf("writing %s: %v, want ErrReadOnly naming frozen.csv", name, err)
		}
	}
	if got, _ := os.ReadFile(p); string(got) != "keep me" {
		t.Errorf("read-only file now holds %q", got)
	}
	if entries, _ := os.ReadDir(dir); len(entries) != 2 {
		t.Errorf("%d entries left, want the file and the link", len(entries))
	}
}
