// Command demogen writes gwsat's invented demo data set: samples.csv (lab
// results from a made-up aquifer storage-and-recovery pilot site),
// site.geojson (its boundary, river, pipeline and injection wells) and
// README.md (the scenario, the chemistry and the deliberate flaws).
//
// Usage, from the repository root:
//
//	go run ./data/demogen -out data/demo
//
// The output is deterministic for a given -seed. Everything it writes is
// invented; no real site, company or person is described.
package main
