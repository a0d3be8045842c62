package atomicfile

import (
	"io"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"
	"time"
)

// While fill runs, the only other entry is our recognisable temporary file.
func TestTempName(t *testing.T) {
	tests := []struct{ name, base string }{
		{"plain", "samples.csv"},
		{"hidden", ".hidden"},
		{"long non-ASCII", strings.Repeat("ü", 120)}, // 240 bytes: the temp name must be cut
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			dir := t.TempDir()
			var seen []string
			err := WriteWith(filepath.Join(dir, tc.base), func(w io.Writer) error {
				entries, err := os.ReadDir(dir)
				for _, e := range entries {
					seen = append(seen, e.Name())
				}
				return err
			})
			if err != nil {
				t.Fatal(err)
			}
			if len(seen) != 1 || !tempPattern.MatchString(seen[0]) || !strings.HasPrefix(seen[0], "."+tc.base[:min(len(tc.base), 200)]) {
				t.Errorf("during the write the folder held %q", seen)
			}
			entries, _ := os.ReadDir(dir)
			if len(entries) != 1 || entries[0].Name() != tc.base {
				t.Errorf("after the write the folder holds %v", entries)
			}
		})
	}
}

// CleanStale removes our old temporary files and nothing else.
func TestCleanStale(t *testing.T) {
	dir := t.TempDir()
	old := time.Now().Add(-2 * time.Hour)
	files := []struct {
		name    string
		age     time.Time
		removed bool
	}{
		{".samples.csv.gwsat-tmp-0123456789ab", old, true},
		{"..hidden.gwsat-tmp-00000000ffff", old, true},
		{".fresh.csv.gwsat-tmp-0123456789ab", time.Now(), false},
		{".samples.csv.gwsat-tmp-0123456789AB", old, false}, // upper case: not ours
		{".samples.csv.gwsat-tmp-0123456789a", old, false},  // 11 digits
		{"samples.csv.gwsat-tmp-0123456789ab", old, false},  // no leading dot
		{".samples.csv.tmp-123456", old, false},             // another program's
		{"samples.csv", old, false},
	}
	var want []string
	for _, f := range files {
		p := filepath.Join(dir, f.name)
		if err := os.WriteFile(p, []byte("x"), 0o644); err != nil {
			t.Fatal(err)
		}
		if err := os.Chtimes(p, f.age, f.age); err != nil {
			t.Fatal(err)
		}
		if f.removed {
			want = append(want, p)
		}
	}
	// A folder and a link named like ours are never ours.
	if err := os.Mkdir(filepath.Join(dir, ".d.gwsat-tmp-0123456789ab"), 0o755); err != nil {
		t.Fatal(err)
	}
	link := filepath.Join(dir, ".l.gwsat-tmp-0123456789ab")
	if err := os.Symlink("samples.csv", link); err != nil {
		t.Fatal(err)
	}
	os.Chtimes(filepath.Join(dir, ".d.gwsat-tmp-0123456789ab"), old, old)
	slices.Sort(want)

	got, err := CleanStale(dir, time.Hour)
	if err != nil {
		t.Fatal(err)
	}
	if !slices.Equal(got, want) {
		t.Errorf("removed %q, want %q", got, want)
	}
	entries, _ := os.ReadDir(dir)
	if n := len(files) - len(want) + 2; len(entries) != n {
		t.Errorf("%d entries left, want %d", len(entries), n)
	}
	if _, err := CleanStale(dir, -time.Second); err == nil {
		t.Error("negative age accepted")
	}
	if _, err := CleanStale(filepath.Join(dir, "absent"), 0); err == nil {
		t.Error("missing folder gave no error")
	}
}
