package main

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"gwsat.dev/gwsat/speciation"
)

// maxRangeValues caps the points of a sweep (a typo such as a step of 1e-12
// must not exhaust memory).
const maxRangeValues = 10000

// parseRange reads "FROM:TO:STEP" or a comma-separated list, every value
// finite and within [lo, hi].
func parseRange(s string, lo, hi float64) ([]float64, error) {
	var out []float64
	if strings.Count(s, ":") == 2 {
		p := strings.Split(s, ":")
		var v [3]float64
		for i := range p {
			f, err := strconv.ParseFloat(strings.TrimSpace(p[i]), 64)
			if err != nil || math.IsNaN(f) || math.IsInf(f, 0) {
				return nil, fmt.Errorf("%q is not a finite number", p[i])
			}
			v[i] = f
		}
		if !(v[2] > 0) || v[1] < v[0] {
			return nil, fmt.Errorf("range %q: want FROM:TO:STEP with TO >= FROM and STEP > 0", s)
		}
		if (v[1]-v[0])/v[2] > maxRangeValues {
			return nil, fmt.Errorf("range %q gives more than %d values", s, maxRangeValues)
		}
		n := int((v[1]-v[0])/v[2] + 1e-9)
		for i := 0; i <= n; i++ {
			out = append(out, v[0]+float64(i)*v[2])
		}
	} else {
		for _, f := range strings.Split(s, ",") {
			v, err := strconv.ParseFloat(strings.TrimSpace(f), 64)
			if err != nil || math.IsNaN(v) || math.IsInf(v, 0) {
				return nil, fmt.Errorf("%q is not a finite number", f)
			}
			out = append(out, v)
		}
		if len(out) > maxRangeValues {
			return nil, fmt.Errorf("more than %d values", maxRangeValues)
		}
	}
	for _, v := range out {
		if v < lo || v > hi {
			return nil, fmt.Errorf("%g outside %g-%g", v, lo, hi)
		}
	}
	return out, nil
}

// parseTemp reads a temperature in C within the data's range.
func parseTemp(s string) (float64, error) {
	t, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
	if err != nil || math.IsNaN(t) || math.IsInf(t, 0) {
		return 0, fmt.Errorf("%q is not a number", s)
	}
	if t < speciation.MinTempC || t > speciation.MaxTempC {
		return 0, fmt.Errorf("%g C outside the supported %g-%g C", t, speciation.MinTempC, speciation.MaxTempC)
	}
	return t, nil
}

// parseIncreasing reads a comma-separated list of increasing numbers.
func parseIncreasing(s string) ([]float64, error) {
	if strings.TrimSpace(s) == "" {
		return nil, nil
	}
	var out []float64
	for _, f := range strings.Split(s, ",") {
		v, err := strconv.ParseFloat(strings.TrimSpace(f), 64)
		if err != nil || math.IsNaN(v) || math.IsInf(v, 0) {
			return nil, fmt.Errorf("%q is not a finite number", f)
		}
		if len(out) > 0 && v <= out[len(out)-1] {
			return nil, fmt.Errorf("values must increase")
		}
		out = append(out, v)
	}
	return out, nil
}
