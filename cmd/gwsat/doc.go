// Command gwsat reads groundwater lab results, checks them, computes
// aqueous speciation and mineral saturation indices, mixes waters, estimates
// precipitation and draws site figures. Run "gwsat help" for the commands.
//
// The command only parses flags, opens files and calls the packages: hydro
// (reading and QA), assess (the per-row workflow), speciation and
// speciation/reaction (chemistry), geo and maps (space and figures) and
// report (tables, GeoJSON, index.html). run is the whole program, testable
// in process.
//
// Results are screening results, not a design: defer to local codes and
// licensed professionals before acting on them.
package main
