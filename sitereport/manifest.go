package sitereport

import (
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"os"
	"path/filepath"
	"sort"
	"strings"

	"gwsat.dev/gwsat/internal/atomicfile"
	"gwsat.dev/gwsat/internal/lockfile"
)

// ManifestName is the file in a report folder that lists what gwsat wrote
// there. A later run replaces or removes only the files it names.
const ManifestName = ".gwsat-manifest.json"

// ErrOtherFiles is wrapped by the error for an output folder that holds files
// gwsat did not write (Options.AllowOtherFiles lets the run go ahead and leave
// them alone).
var ErrOtherFiles = errors.New("sitereport: output folder holds files gwsat did not write")

// manifest is the content of ManifestName.
type manifest struct {
	Tool  string   `json:"tool"`
	Note  string   `json:"note"`
	Files []string `json:"files"` // slash-separated, relative to the folder
}

const manifestNote = "Files written by gwsat report. A later run into this folder replaces or removes only these files."

// readManifest returns the files an earlier run listed, keeping only local
// relative paths (a manifest edited to name ../x or /etc/x names nothing
// outside the folder). A missing manifest gives an empty set.
func readManifest(dir string) (map[string]bool, error) {
	raw, err := os.ReadFile(filepath.Join(dir, ManifestName))
	if errors.Is(err, fs.ErrNotExist) {
		return map[string]bool{}, nil
	}
	if err != nil {
		return nil, err
	}
	var m manifest
	if err := json.Unmarshal(raw, &m); err != nil {
		return nil, fmt.Errorf("sitereport: %s in %s is not a gwsat manifest: %w", ManifestName, dir, err)
	}
	out := map[string]bool{}
	for _, f := range m.Files {
		if filepath.IsLocal(filepath.FromSlash(f)) {
			out[filepath.ToSlash(filepath.Clean(filepath.FromSlash(f)))] = true
		}
	}
	return out, nil
}

// writeManifest lists files (slash-separated, relative) in the folder.
func writeManifest(dir string, files []string) error {
	files = append([]string(nil), files...)
	sort.Strings(files)
	return atomicfile.WriteWith(filepath.Join(dir, ManifestName), func(w io.Writer) error {
		enc := json.NewEncoder(w)
		enc.SetIndent("", "  ")
		return enc.Encode(manifest{Tool: "gwsat", Note: manifestNote, Files: files})
	})
}

// ours reports whether a file in the folder belongs to gwsat: named by the
// manifest, the manifest itself, the folder lock or a temporary file of an
// atomic write.
func ours(rel string, listed map[string]bool) bool {
	base := filepath.Base(rel)
	return listed[rel] || rel == ManifestName || rel == lockfile.Name || strings.Contains(base, ".gwsat-tmp-")
}

// otherFiles lists the files under dir that gwsat did not write (at most
// limit of them, sorted), reading the manifest of an earlier run. A folder
// that does not exist holds none.
func otherFiles(dir string, limit int) ([]string, map[string]bool, error) {
	listed, err := readManifest(dir)
	if err != nil {
		return nil, nil, err
	}
	var other []string
	err = filepath.WalkDir(dir, func(path string, d fs.DirEntry, err error) error {
		if err != nil {
			if errors.Is(err, fs.ErrNotExist) && path == dir {
				return fs.SkipAll
			}
			return err
		}
		if d.IsDir() {
			return nil
		}
		rel, err := filepath.Rel(dir, path)
		if err != nil {
			return err
		}
		rel = filepath.ToSlash(rel)
		if !ours(rel, listed) {
			other = append(other, rel)
		}
		return nil
	})
	if err != nil {
		return nil, nil, err
	}
	sort.Strings(other)
	if len(other) > limit {
		other = append(other[:limit], fmt.Sprintf("and %d more", len(other)-limit))
	}
	return other, listed, nil
}

// checkFolder refuses a folder holding files gwsat did not write, unless
// allow is set, and returns the files the earlier run listed.
func checkFolder(dir string, allow bool) (map[string]bool, error) {
	other, listed, err := otherFiles(dir, 5)
	if err != nil {
		return nil, err
	}
	if len(other) > 0 && !allow {
		return nil, fmt.Errorf("%w: %s holds %s; choose an empty or new folder",
			ErrOtherFiles, dir, strings.Join(other, ", "))
	}
	return listed, nil
}

// removeStale deletes the files an earlier run listed that this run did not
// write (a figure no longer drawn must not linger beside the new ones). Only
// listed files are touched, and only inside dir.
func removeStale(dir string, listed map[string]bool, written []string) error {
	keep := map[string]bool{}
	for _, f := range written {
		keep[f] = true
	}
	var errs []error
	for f := range listed {
		if keep[f] || !filepath.IsLocal(filepath.FromSlash(f)) {
			continue
		}
		if err := os.Remove(filepath.Join(dir, filepath.FromSlash(f))); err != nil && !errors.Is(err, fs.ErrNotExist) {
			errs = append(errs, err)
		}
	}
	return errors.Join(errs...)
}
