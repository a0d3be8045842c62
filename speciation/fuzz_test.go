package speciation

import (
	"errors"
	"testing"
)

// FuzzParseDatabase: any text either parses or is rejected with a *DataError; never a
// panic. Seeds: the embedded data set and the parser-test header.
func FuzzParseDatabase(f *testing.F) {
	f.Add(Thermo())
	f.Add(tinyHeader)
	f.Add(fluoriteDB)
	f.Add("[mineral X]\nreaction = - +\n")
	f.Fuzz(func(t *testing.T, text string) {
		db, err := ParseDatabase(text)
		if err != nil {
			var de *DataError
			if !errors.As(err, &de) {
				t.Fatalf("error %T is not a *DataError: %v", err, err)
			}
			return
		}
		if db.ComponentIndex(NameH2O) < 0 || db.ComponentIndex(NameHPlus) < 0 {
			t.Fatal("database without H2O or H+")
		}
	})
}
