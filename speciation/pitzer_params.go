package speciation

import (
	_ "embed"
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"
	"sync"
)

// pitzerText is the text of the embedded ion-interaction parameter set (pitzer.txt beside
// this file; its format is described at its top). DefaultPitzerParams parses it.
//
//go:embed pitzer.txt
var pitzerText string

// ErrPitzerParams is wrapped by every error of ParsePitzerParams (inside a *DataError
// that names the line).
var ErrPitzerParams = errors.New("speciation: invalid ion-interaction parameter")

// pzTemp is a parameter as a function of temperature (see the format of pitzer.txt).
type pzTemp struct {
	v25    float64
	slope  float64
	fit    [8]float64
	hasFit bool
	off    float64 // f(298.15) of the fit
	fuossB float64 // Fuoss exponent b at 25 C; 0: no Fuoss scaling
}

func fit8(a *[8]float64, T float64) float64 {
	return a[0] + a[1]*T + a[2]/T + a[3]*math.Log(T) + a[4]/(T-263) + a[5]*T*T + a[6]/(680-T) + a[7]/(T-227)
}

// at returns the parameter at tempK.
func (p *pzTemp) at(tempK float64) float64 {
	v := p.v25 + p.slope*(tempK-T25)
	if p.hasFit {
		v += fit8(&p.fit, tempK) - p.off
	}
	if p.fuossB != 0 {
		v *= fuossRatio(p.fuossB, tempK)
	}
	return v
}

// PitzerParams is a parsed ion-interaction parameter set. It is read-only once built
// and safe for concurrent use.
type PitzerParams struct {
	aphi    pzTemp
	kept    map[string]bool // species the set treats explicitly
	binary  map[[2]string]*pzBinary
	theta   map[[2]string]*pzTemp
	psi     map[[3]string]*pzTemp
	lambda  map[[2]string]*pzTemp
	records int
}

// pzBinary holds the cation-anion parameters of one pair.
type pzBinary struct {
	beta0, beta1, beta2, cphi pzTemp
	has2                      bool
}

// Records returns the number of parameter records in the set.
func (p *PitzerParams) Records() int { return p.records }

// Treats reports whether the parameter set treats the named species explicitly.
func (p *PitzerParams) Treats(species string) bool { return p.kept[CanonicalName(species)] }

var (
	pitzerOnce   sync.Once
	pitzerParams *PitzerParams
	pitzerErr    error
)

// DefaultPitzerParams returns the embedded parameter set (pitzerText), parsed once.
func DefaultPitzerParams() (*PitzerParams, error) {
	pitzerOnce.Do(func() { pitzerParams, pitzerErr = ParsePitzerParams(pitzerText) })
	return pitzerParams, pitzerErr
}

func sortedPair(a, b string) [2]string {
	if a > b {
		a, b = b, a
	}
	return [2]string{a, b}
}

// ParsePitzerParams reads an ion-interaction parameter set in gwsat's own format
// (described at the top of speciation/pitzer.txt). Errors are *DataError values that
// wrap ErrPitzerParams and name the line.
func ParsePitzerParams(text string) (*PitzerParams, error) {
	p := &PitzerParams{
		kept:   map[string]bool{},
		binary: map[[2]string]*pzBinary{},
		theta:  map[[2]string]*pzTemp{},
		psi:    map[[3]string]*pzTemp{},
		lambda: map[[2]string]*pzTemp{},
	}
	hasAphi := false
	seen := map[string]int{}
	firstLine := map[string]int{} // first line naming each species
	for n, line := range strings.Split(text, "\n") {
		ln := n + 1
		line = strings.TrimSpace(line)
		if line == "" || strings.HasPrefix(line, "#") {
			continue
		}
		bad := func(format string, args ...any) error {
			return &DataError{Line: ln, Err: fmt.Errorf("%w: "+format, append([]any{ErrPitzerParams}, args...)...)}
		}
		f := strings.Split(line, " | ")
		if len(f) != 5 {
			return nil, bad("want 5 fields separated by \" | \", got %d", len(f))
		}
		for i := range f {
			f[i] = strings.TrimSpace(f[i])
		}
		kind, names, vs, tf, src := f[0], f[1], f[2], f[3], f[4]
		if src == "" {
			return nil, bad("%s record without a source", kind)
		}
		var sp []string
		if names != "-" {
			for _, s := range strings.Split(names, ",") {
				c := CanonicalName(strings.TrimSpace(s))
				sp = append(sp, c)
				if _, ok := firstLine[c]; !ok {
					firstLine[c] = ln
				}
			}
		}
		if kind == "species" {
			for _, s := range sp {
				p.kept[s] = true
			}
			p.records++
			continue
		}
		v, err := strconv.ParseFloat(vs, 64)
		if err != nil || !finite(v) {
			return nil, bad("value %q is not a number", vs)
		}
		t, err := parseTempFunc(tf)
		if err != nil {
			return nil, bad("%v", err)
		}
		t.v25 = v
		key := kind + " " + strings.Join(sp, ", ")
		if prev, dup := seen[key]; dup {
			return nil, bad("%s given twice (first on line %d)", key, prev)
		}
		seen[key] = ln
		want := map[string]int{"aphi": 0, "beta0": 2, "beta1": 2, "beta2": 2, "cphi": 2, "theta": 2, "psi": 3, "lambda": 2}
		nw, ok := want[kind]
		if !ok {
			return nil, bad("unknown kind %q", kind)
		}
		if len(sp) != nw {
			return nil, bad("%s needs %d species, got %d", kind, nw, len(sp))
		}
		p.records++
		switch kind {
		case "aphi":
			p.aphi, hasAphi = t, true
		case "beta0", "beta1", "beta2", "cphi":
			k := [2]string{sp[0], sp[1]}
			b := p.binary[k]
			if b == nil {
				b = &pzBinary{}
				p.binary[k] = b
			}
			switch kind {
			case "beta0":
				b.beta0 = t
			case "beta1":
				b.beta1 = t
			case "beta2":
				b.beta2, b.has2 = t, true
			case "cphi":
				b.cphi = t
			}
		case "theta":
			tt := t
			p.theta[sortedPair(sp[0], sp[1])] = &tt
		case "psi":
			a := sortedPair(sp[0], sp[1])
			tt := t
			p.psi[[3]string{a[0], a[1], sp[2]}] = &tt
		case "lambda":
			tt := t
			p.lambda[[2]string{sp[0], sp[1]}] = &tt
		}
	}
	if !hasAphi {
		return nil, &DataError{Line: 1, Err: fmt.Errorf("%w: no aphi record", ErrPitzerParams)}
	}
	// Every species named by a parameter must be kept (otherwise the parameter could
	// never apply).
	var named []string
	for k := range p.binary {
		named = append(named, k[:]...)
	}
	for k := range p.theta {
		named = append(named, k[:]...)
	}
	for k := range p.psi {
		named = append(named, k[:]...)
	}
	for k := range p.lambda {
		named = append(named, k[:]...)
	}
	for _, s := range named {
		if !p.kept[s] {
			return nil, &DataError{Line: firstLine[s], Err: fmt.Errorf("%w: %s has parameters but is not in the species list", ErrPitzerParams, s)}
		}
	}
	return p, nil
}

func parseTempFunc(s string) (pzTemp, error) {
	var t pzTemp
	f := strings.Fields(s)
	switch {
	case len(f) == 1 && f[0] == "-":
		return t, nil
	case len(f) == 2 && f[0] == "slope":
		v, err := strconv.ParseFloat(f[1], 64)
		if err != nil || !finite(v) {
			return t, fmt.Errorf("slope %q is not a number", f[1])
		}
		t.slope = v
		return t, nil
	case len(f) == 3 && f[0] == "fuoss":
		z, err1 := strconv.ParseFloat(f[1], 64)
		logK, err2 := strconv.ParseFloat(f[2], 64)
		if err1 != nil || err2 != nil || !finite(z) || !finite(logK) || z <= 0 {
			return t, fmt.Errorf("fuoss %q %q: want the charge product and the log K of association at 25 C", f[1], f[2])
		}
		b, err := fuossExponent(z, logK)
		if err != nil {
			return t, err
		}
		t.fuossB = b
		return t, nil
	case len(f) == 9 && f[0] == "fit8":
		for i := range 8 {
			v, err := strconv.ParseFloat(f[i+1], 64)
			if err != nil || !finite(v) {
				return t, fmt.Errorf("fit8 coefficient %q is not a number", f[i+1])
			}
			t.fit[i] = v
		}
		t.hasFit = true
		t.off = fit8(&t.fit, T25)
		for _, tc := range []float64{0, 50, 100} {
			if !finite(fit8(&t.fit, tc+273.15)) {
				return t, fmt.Errorf("fit8 is not finite at %g C", tc)
			}
		}
		return t, nil
	}
	return t, fmt.Errorf("temperature function %q: want \"-\", \"slope S\", \"fuoss Z LOGK\" or \"fit8\" with 8 numbers", s)
}

// PitzerText returns the embedded text (read-only).
func PitzerText() string { return pitzerText }
