package outguard

import (
	"errors"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

type op struct {
	kind Kind
	path string
}

// fixture builds, in a fresh working directory:
//
//	a.csv              an input
//	h.csv              a hard link to a.csv
//	l.csv -> a.csv     a symbolic link
//	d.csv -> new.csv   a dangling link
//	sub/x.csv
//	linkdir -> sub
func fixture(t *testing.T) string {
	t.Helper()
	dir := t.TempDir()
	t.Chdir(dir)
	must := func(err error) {
		t.Helper()
		if err != nil {
			t.Fatal(err)
		}
	}
	must(os.WriteFile("a.csv", []byte("well,Ca\n"), 0o644))
	must(os.Mkdir("sub", 0o755))
	must(os.WriteFile(filepath.Join("sub", "x.csv"), []byte("x"), 0o644))
	must(os.Link("a.csv", "h.csv"))
	must(os.Symlink("a.csv", "l.csv"))
	must(os.Symlink("new.csv", "d.csv"))
	must(os.Symlink("sub", "linkdir"))
	return dir
}

func TestSet(t *testing.T) {
	tests := []struct {
		name  string
		ops   []op
		want  error  // nil: every op succeeds
		names string // both of these appear in the message
	}{
		{"same name", []op{{Input, "a.csv"}, {Output, "a.csv"}}, ErrSameFile, "a.csv|a.csv"},
		{"dot slash", []op{{Input, "a.csv"}, {Output, "./a.csv"}}, ErrSameFile, "a.csv|./a.csv"},
		{"up and back", []op{{Input, "a.csv"}, {Output, "sub/../a.csv"}}, ErrSameFile, "a.csv|sub/../a.csv"},
		{"absolute", []op{{Input, "a.csv"}, {Output, "ABS/a.csv"}}, ErrSameFile, "a.csv|ABS/a.csv"},
		{"hard link", []op{{Input, "a.csv"}, {Output, "h.csv"}}, ErrSameFile, "a.csv|h.csv"},
		{"symbolic link as output", []op{{Input, "a.csv"}, {Output, "l.csv"}}, ErrSameFile, "a.csv|l.csv"},
		{"symbolic link as input", []op{{Input, "l.csv"}, {Output, "a.csv"}}, ErrSameFile, "l.csv|a.csv"},
		{"output before input", []op{{Output, "./a.csv"}, {Input, "a.csv"}}, ErrSameFile, "./a.csv|a.csv"},
		{"two new outputs", []op{{Output, "new.csv"}, {Output, "sub/../new.csv"}}, ErrSameFile, "new.csv|sub/../new.csv"},
		{"new output through a dangling link", []op{{Output, "d.csv"}, {Output, "new.csv"}}, ErrSameFile, "d.csv|new.csv"},
		{"new outputs through a linked folder", []op{{Output, "sub/y.csv"}, {Output, "linkdir/y.csv"}}, ErrSameFile, "sub/y.csv|linkdir/y.csv"},
		{"new folder, new outputs", []op{{Output, "rep/t.csv"}, {Output, "rep/./t.csv"}}, ErrSameFile, "rep/t.csv|rep/./t.csv"},
		{"input in report folder", []op{{Input, "sub/x.csv"}, {OutputDir, "sub"}}, ErrInputInDir, "sub/x.csv|sub"},
		{"input in report folder by link", []op{{Input, "sub/x.csv"}, {OutputDir, "linkdir"}}, ErrInputInDir, "sub/x.csv|linkdir"},
		{"input added after the folder", []op{{OutputDir, "."}, {Input, "a.csv"}}, ErrInputInDir, "a.csv|."},
		{"input by link into the folder", []op{{OutputDir, "sub"}, {Input, "linkdir/x.csv"}}, ErrInputInDir, "linkdir/x.csv|sub"},

		{"distinct files", []op{{Input, "a.csv"}, {Input, "sub/x.csv"}, {Output, "b.csv"}, {Output, "sub/a.csv"}}, nil, ""},
		{"an input read twice", []op{{Input, "a.csv"}, {Input, "h.csv"}, {Input, "l.csv"}}, nil, ""},
		{"standard streams", []op{{Input, "-"}, {Output, "-"}, {Output, "-"}}, nil, ""},
		{"null device twice", []op{{Output, os.DevNull}, {Output, os.DevNull}}, nil, ""},
		{"new report folder", []op{{Input, "a.csv"}, {OutputDir, "rep"}, {Output, "rep/t.csv"}}, nil, ""},
		{"folder beside the input", []op{{Input, "a.csv"}, {OutputDir, "sub"}}, nil, ""},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			dir := fixture(t)
			var s Set
			var err error
			for _, o := range tc.ops {
				p := strings.Replace(o.path, "ABS", dir, 1)
				switch o.kind {
				case Input:
					err = s.AddInput(p)
				case Output:
					err = s.AddOutput(p)
				case OutputDir:
					err = s.AddOutputDir(p)
				}
				if err != nil {
					break
				}
			}
			if tc.want == nil {
				if err != nil {
					t.Fatalf("unexpected refusal: %v", err)
				}
				return
			}
			if !errors.Is(err, tc.want) {
				t.Fatalf("error %v, want %v", err, tc.want)
			}
			var ce *ClashError
			if !errors.As(err, &ce) {
				t.Fatalf("%v is not a *ClashError", err)
			}
			for _, n := range strings.Split(strings.Replace(tc.names, "ABS", dir, 1), "|") {
				if !strings.Contains(err.Error(), `"`+n+`"`) {
					t.Errorf("message %q does not name %q", err, n)
				}
			}
		})
	}
}

// A standard output redirected onto an input is caught by the open file's identity.
func TestOpenFiles(t *testing.T) {
	fixture(t)
	f, err := os.OpenFile("h.csv", os.O_WRONLY|os.O_APPEND, 0)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	var s Set
	if err := s.AddInput("a.csv"); err != nil {
		t.Fatal(err)
	}
	if err := s.AddOutputFile("standard output", f); !errors.Is(err, ErrSameFile) || !strings.Contains(err.Error(), "standard output") {
		t.Errorf("redirected output onto the input: %v", err)
	}
	in, err := os.Open("sub/x.csv")
	if err != nil {
		t.Fatal(err)
	}
	defer in.Close()
	if err := s.AddInputFile("standard input", in); err != nil {
		t.Errorf("an unrelated standard input was refused: %v", err)
	}
	if err := s.AddOutput("linkdir/x.csv"); !errors.Is(err, ErrSameFile) {
		t.Errorf("output onto the redirected input: %v", err)
	}
}

func TestEmptyPath(t *testing.T) {
	var s Set
	if err := s.AddOutput(""); err == nil || errors.Is(err, ErrSameFile) {
		t.Errorf("empty output path: %v", err)
	}
}
