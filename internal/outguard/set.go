package outguard

import (
	"errors"
	"fmt"
	"io/fs"
	"os"
	"path/filepath"
	"strings"
	"sync"
)

// Kind says what a path is to the command.
type Kind int

const (
	Input     Kind = iota // a file the command reads
	Output                // a file the command writes
	OutputDir             // a folder the command fills (a report)
)

func (k Kind) String() string {
	switch k {
	case Input:
		return "input"
	case Output:
		return "output"
	case OutputDir:
		return "output folder"
	}
	return fmt.Sprintf("Kind(%d)", int(k))
}

// entry is one path of the Set.
type entry struct {
	path string      // as given
	real string      // resolved absolute path; "" for an open file
	info fs.FileInfo // nil while it does not exist
	kind Kind
}

// Set holds the paths of one command run. The zero value is empty and ready;
// a Set is safe for concurrent use. The order of the calls does not matter: an
// input added after an output is checked against it.
type Set struct {
	mu      sync.Mutex
	entries []entry
}

// AddInput records a file the command reads. It fails when path is the same
// file as an output already added, or lies inside an output folder.
func (s *Set) AddInput(path string) error { return s.addPath(path, Input) }

// AddOutput records a file the command writes. It fails when path is the same
// file as an input or another output already added.
func (s *Set) AddOutput(path string) error { return s.addPath(path, Output) }

// AddOutputDir records a folder the command writes into (a report). It fails
// when an input already added lies inside it (or is it).
func (s *Set) AddOutputDir(dir string) error { return s.addPath(dir, OutputDir) }

// AddInputFile records an open file the command reads, such as a standard
// input redirected from a file; name is how messages call it ("standard
// input"). Only a regular file can clash.
func (s *Set) AddInputFile(name string, f *os.File) error { return s.addFile(name, f, Input) }

// AddOutputFile records an open file the command writes, such as a standard
// output redirected to a file (gwsat check lab.csv >> lab.csv).
func (s *Set) AddOutputFile(name string, f *os.File) error { return s.addFile(name, f, Output) }

func (s *Set) addPath(path string, kind Kind) error {
	if path == "-" {
		return nil
	}
	if path == "" {
		return fmt.Errorf("outguard: empty %s path", kind)
	}
	real, err := realPath(path)
	if err != nil {
		return err
	}
	e := entry{path: path, real: real, kind: kind}
	fi, err := os.Stat(real)
	switch {
	case err == nil:
		e.info = fi
	case !errors.Is(err, fs.ErrNotExist):
		return fmt.Errorf("outguard: %w", err)
	}
	return s.add(e)
}

func (s *Set) addFile(name string, f *os.File, kind Kind) error {
	fi, err := f.Stat()
	if err != nil {
		return fmt.Errorf("outguard: %s: %w", name, err)
	}
	return s.add(entry{path: name, info: fi, kind: kind})
}

func (s *Set) add(e entry) error {
	s.mu.Lock()
	defer s.mu.Unlock()
	for _, o := range s.entries {
		if err := clash(e, o); err != nil {
			return err
		}
	}
	s.entries = append(s.entries, e)
	return nil
}

// clash applies the rules between the new entry e and an earlier one o.
func clash(e, o entry) error {
	pair := func(err error) error {
		return &ClashError{Path: e.path, Kind: e.kind, Other: o.path, OtherKind: o.kind, Err: err}
	}
	switch {
	case e.kind == Input && o.kind == Input:
		return nil // reading a file twice harms nothing
	case e.kind == OutputDir && o.kind == Input:
		if inside(o, e) {
			return pair(ErrInputInDir)
		}
	case e.kind == Input && o.kind == OutputDir:
		if inside(e, o) {
			return pair(ErrInputInDir)
		}
	case e.kind == OutputDir || o.kind == OutputDir:
		return nil // files written into a report folder are the report's business
	default:
		if sameFile(e, o) {
			return pair(ErrSameFile)
		}
	}
	return nil
}

// sameFile: both regular files (or not there yet) that are one file.
func sameFile(a, b entry) bool {
	if !clashable(a) || !clashable(b) {
		return false
	}
	if a.info != nil && b.info != nil {
		return os.SameFile(a.info, b.info)
	}
	return a.real != "" && a.real == b.real
}

// clashable: devices, pipes and folders are never the same file as another
// output (writing /dev/null twice is fine; a folder fails when written).
func clashable(e entry) bool { return e.info == nil || e.info.Mode().IsRegular() }

// inside reports whether the input in lies in (or is) the folder dir: by
// identity along the input's resolved parent chain when dir exists, by path
// otherwise.
func inside(in, dir entry) bool {
	if in.real == "" {
		return false // an open file has no path to walk
	}
	if dir.info != nil && dir.info.IsDir() {
		for p := in.real; ; {
			if fi, err := os.Stat(p); err == nil && os.SameFile(fi, dir.info) {
				return true
			}
			parent := filepath.Dir(p)
			if parent == p {
				break
			}
			p = parent
		}
	}
	rel, err := filepath.Rel(dir.real, in.real)
	return err == nil && rel != ".." && !strings.HasPrefix(rel, ".."+string(filepath.Separator))
}
