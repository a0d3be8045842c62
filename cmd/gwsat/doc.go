// Command gwsat reads groundwater lab results, checks them, computes aqueous
// speciation and mineral saturation indices, plans injection (blending, warming,
// deposits, dosing, pore filling), states the findings and writes site-report
// folders. Run "gwsat help" for the commands.
//
// The command only parses flags, opens files and calls the library: hydro
// (reading and QA), assess (the per-row assessment, streamed), speciation and
// speciation/reaction (chemistry), inject (injection planning), uncertainty and
// findings (intervals, trends, plain words), site and sitereport (figures and the
// report folder), report (tables, JSON, GeoJSON, HTML). run is the whole program,
// testable in process; it is built on cobra.
//
// Results are screening results, not a design: defer to local codes and
// licensed professionals before acting on them.
package main
