package main

import (
	"os"
	"path/filepath"
	"strconv"
	"testing"
)

// Shards 1..4 of the demo, joined as documented, equal the single-run table
// byte for byte; shards given out of order are refused.
func TestShardsJoinToTheSingleRun(t *testing.T) {
	dir := t.TempDir()
	code, single, errs := gwsat(t, "", "check", "--demo", "-q")
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	var parts []string
	rows := 0
	for k := 1; k <= 4; k++ {
		p := filepath.Join(dir, "part"+strconv.Itoa(k)+".csv")
		code, _, errs := gwsat(t, "", "check", "--demo", "-q", "--shard", strconv.Itoa(k)+"/4", "-o", p)
		if code != exitOK {
			t.Fatalf("shard %d: exit %d: %s", k, code, errs)
		}
		parts = append(parts, p)
		rows += len(readCSV(t, readFile(t, p))) - 1
	}
	if rows != 96 {
		t.Fatalf("the shards hold %d rows, want 96", rows)
	}
	code, joined, errs := gwsat(t, "", append([]string{"join"}, parts...)...)
	if code != exitOK {
		t.Fatalf("join: exit %d: %s", code, errs)
	}
	if joined != single {
		t.Fatal("the joined shards differ from the single run")
	}
	code, _, errs = gwsat(t, "", "join", parts[1], parts[0], parts[2], parts[3])
	if code != exitUsage {
		t.Errorf("shards out of order: exit %d (%s)", code, errs)
	}
	for _, bad := range []string{"0/4", "5/4", "x", "1/0", "1/1000000"} {
		if code, _, _ := gwsat(t, "", "check", "--demo", "--shard", bad); code != exitUsage {
			t.Errorf("--shard %s: exit %d", bad, code)
		}
	}
}

func readFile(t *testing.T, p string) string {
	t.Helper()
	b, err := os.ReadFile(p)
	if err != nil {
		t.Fatal(err)
	}
	return string(b)
}

// With Monte Carlo intervals too, the shards joined equal the single run: each row
// draws from the random stream of its index in the whole run.
func TestShardsWithIntervals(t *testing.T) {
	if testing.Short() {
		t.Skip("Monte Carlo")
	}
	dir := t.TempDir()
	args := []string{"check", "--demo", "-q", "--intervals", "--draws", "40"}
	code, single, errs := gwsat(t, "", args...)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	var parts []string
	for k := 1; k <= 3; k++ {
		p := filepath.Join(dir, "p"+strconv.Itoa(k)+".csv")
		if code, _, errs := gwsat(t, "", append(args, "--shard", strconv.Itoa(k)+"/3", "-o", p)...); code != exitOK {
			t.Fatalf("shard %d: %s", k, errs)
		}
		parts = append(parts, p)
	}
	code, joined, errs := gwsat(t, "", append([]string{"join"}, parts...)...)
	if code != exitOK || joined != single {
		t.Fatalf("joined shards with intervals differ from the single run (exit %d %s)", code, errs)
	}
}
