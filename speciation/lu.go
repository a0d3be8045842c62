package speciation

import (
	"math"
)

// This file holds the sparse LU factorisation used by the Newton step.

// luSolve solves A x = b in place (b becomes x) by Gaussian elimination with partial
// pivoting on the row-major n x n matrix A (destroyed). It reports false when A is
// singular to working precision. The Jacobians of speciation are sparse (a cation's
// balance involves its own activity, a few anions and the ionic strength), so each
// elimination step records the columns where the pivot row is non-zero and updates only
// those, in the elimination and in the back substitution: the same arithmetic as the
// dense loops without the terms that add l*0 (except that the back substitution
// multiplies by the reciprocal pivot, computed once). ws is the workspace (see luWork).
func luSolve(A []float64, b []float64, n int, ws *luWork) bool {
	A = A[:n*n]
	b = b[:n]
	idx := ws.idx[:n*n]
	off := ws.off[:n+1]
	rdiag := ws.rdiag[:n]
	off[0] = 0
	// With a pattern (ws.pattern) and as long as no rows are exchanged, the rows below
	// the pivot that can be non-zero in column k are known: the pivot search and the
	// elimination visit only those (the others hold exact zeros, which neither win the
	// search nor change a row). The first exchange ends the use of the pattern.
	sym := ws.pattern && ws.patternN == n
	for k := 0; k < n; k++ {
		p := k
		mx := math.Abs(A[k*n+k])
		if sym {
			for _, i := range ws.below[ws.belowOff[k]:ws.belowOff[k+1]] {
				if v := math.Abs(A[int(i)*n+k]); v > mx {
					mx, p = v, int(i)
				}
			}
		} else {
			for i := k + 1; i < n; i++ {
				if v := math.Abs(A[i*n+k]); v > mx {
					mx, p = v, i
				}
			}
		}
		if mx < 1e-250 || mx != mx {
			return false
		}
		if p != k {
			rk, rp := A[k*n:k*n+n], A[p*n:p*n+n]
			for j := range rk {
				rk[j], rp[j] = rp[j], rk[j]
			}
			b[k], b[p] = b[p], b[k]
			sym = false
		}
		d := 1 / A[k*n+k]
		rdiag[k] = d
		// non-zero columns of the pivot row right of the pivot
		rk := A[k*n : k*n+n]
		cnt := off[k]
		for j := k + 1; j < n; j++ {
			if rk[j] != 0 {
				idx[cnt] = j
				cnt++
			}
		}
		off[k+1] = cnt
		cols := idx[off[k]:cnt]
		bk := b[k]
		if sym {
			for _, i := range ws.below[ws.belowOff[k]:ws.belowOff[k+1]] {
				ri := A[int(i)*n : int(i)*n+n]
				l := ri[k] * d
				if l == 0 {
					continue
				}
				for _, j := range cols {
					ri[j] -= l * rk[j]
				}
				b[i] -= l * bk
			}
			continue
		}
		for i := k + 1; i < n; i++ {
			ri := A[i*n : i*n+n]
			l := ri[k] * d
			if l == 0 {
				continue
			}
			for _, j := range cols {
				ri[j] -= l * rk[j]
			}
			b[i] -= l * bk
		}
	}
	for k := n - 1; k >= 0; k-- {
		v := b[k]
		rk := A[k*n : k*n+n]
		for _, j := range idx[off[k]:off[k+1]] {
			v -= rk[j] * b[j]
		}
		b[k] = v * rdiag[k]
	}
	for _, v := range b {
		if !finite(v) {
			return false
		}
	}
	return true
}

// luWork is the scratch of luSolve for systems up to its size: the non-zero columns of
// each pivot row (idx, row k in idx[off[k]:off[k+1]]) and the reciprocal pivots. If
// pattern is set, the matrices of size patternN are known to be zero outside a pattern,
// and below[belowOff[k]:belowOff[k+1]] lists the rows i > k that can be non-zero in
// column k during the elimination without row exchanges (the pattern with its fill-in,
// see setPattern).
type luWork struct {
	idx   []int
	off   []int
	rdiag []float64

	pattern  bool
	patternN int
	below    []int32
	belowOff []int32
	fill     []bool
}

// setPattern records the non-zero pattern of the n x n matrices to come (nz: row-major
// positions; the diagonal is always included) and works out its fill-in under
// elimination in the natural order.
func (ws *luWork) setPattern(n int, nz []int32) {
	if cap(ws.fill) < n*n {
		ws.fill = make([]bool, n*n)
	}
	P := ws.fill[:n*n]
	clear(P)
	for _, pos := range nz {
		P[pos] = true
	}
	for k := 0; k < n; k++ {
		P[k*n+k] = true
	}
	ws.below = ws.below[:0]
	ws.belowOff = append(ws.belowOff[:0], 0)
	for k := 0; k < n; k++ {
		for i := k + 1; i < n; i++ {
			if !P[i*n+k] {
				continue
			}
			ws.below = append(ws.below, int32(i))
			for j := k + 1; j < n; j++ {
				if P[k*n+j] {
					P[i*n+j] = true
				}
			}
		}
		ws.belowOff = append(ws.belowOff, int32(len(ws.below)))
	}
	ws.pattern, ws.patternN = true, n
}

func newLUWork(n int) luWork {
	return luWork{idx: make([]int, n*n), off: make([]int, n+1), rdiag: make([]float64, n)}
}
