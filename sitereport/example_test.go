package sitereport_test

import (
	"fmt"

	"gwsat.dev/gwsat/sitereport"
)

// The checksum recorded for each input in methods.json (SHA-256, FIPS 180-4;
// the value for "abc" is the standard's first example).
func ExampleBytesSHA256() {
	fmt.Println(sitereport.BytesSHA256([]byte("abc")))
	// Output: ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad
}
