package main

import (
	"fmt"
	"strconv"
	"strings"

	"gwsat.dev/gwsat/assess"
)

// shard selects rows k, k+n, k+2n, ... (1-based k) of the input, counted over
// all files in order: a stable rule that a batch system's array jobs can share
// out, and that 'gwsat join' undoes by taking one row from each shard in turn.
type shard struct{ k, n int }

// maxShards bounds --shard (a typo must not make a million empty jobs).
const maxShards = 100000

func parseShard(s string) (shard, error) {
	if strings.TrimSpace(s) == "" {
		return shard{1, 1}, nil
	}
	ks, ns, ok := strings.Cut(s, "/")
	k, err1 := strconv.Atoi(strings.TrimSpace(ks))
	n, err2 := strconv.Atoi(strings.TrimSpace(ns))
	if !ok || err1 != nil || err2 != nil || n < 1 || k < 1 || k > n || n > maxShards {
		return shard{}, fmt.Errorf("%q: want K/N with 1 <= K <= N <= %d, e.g. 2/8", s, maxShards)
	}
	return shard{k, n}, nil
}

// count is how many of total rows the shard takes.
func (s shard) count(total int) int {
	if s.n <= 1 {
		return total
	}
	c := total / s.n
	if total%s.n >= s.k {
		c++
	}
	return c
}

// filter keeps the shard's rows.
func (s shard) filter(next func() (assess.Item, bool, error)) func() (assess.Item, bool, error) {
	if s.n <= 1 {
		return next
	}
	i := 0
	return func() (assess.Item, bool, error) {
		for {
			it, ok, err := next()
			if err != nil || !ok {
				return it, ok, err
			}
			i++
			if (i-1)%s.n == s.k-1 {
				return it, true, nil
			}
		}
	}
}
