package speciation

import "math"

const log2of10 = 3.321928094887362347870319429489390175864831393

// pow10 returns 10^x; for x in [-300, 300] it uses a fast table-driven path that
// agrees with math.Pow within 2e-15 relative (a few units in the last place; tested),
// outside that range (and for NaN) it is math.Pow. The method is the table-driven
// exponential of Tang (1989, ACM Trans. Math. Softw. 15(2), 144-157; from memory) with
// the argument reduction of Cody & Waite (1980, Software Manual for the Elementary
// Functions; from memory): 10^x = 2^(n/64) 10^r with n the nearest integer to
// 64 x log2(10), so |r| <= log10(2)/128. r = x - n log10(2)/64 is formed with the
// constant split in a high part with trailing zero bits (n times it is exact, and so is
// x minus that product, the two being within a factor of two) and a low part, so r
// carries only the rounding of its last operation; the former version multiplied x by
// ln10 first and lost up to 1e-13 for |x| near 300. 10^r = e^y with y = r ln10,
// |y| <= ln2/128 < 0.0055, by its Taylor series to degree 6 (truncation error below
// 4e-20); 2^(j/64) for the remainder j of n modulo 64 comes from a table, and
// 2^floor(n/64) is added to the exponent bits.
func pow10(x float64) float64 {
	if !(x >= -300 && x <= 300) {
		return math.Pow(10, x) // outside the fast range, and NaN
	}
	// n = round(64 x log2(10)) by the add-and-subtract trick (exact for |t| < 2^51)
	const shift = 6755399441055744.0 // 1.5 * 2^52
	n := (x*(64*log2of10) + shift) - shift
	// r = x - n log10(2)/64, with the constant split in a high part of 32 significant
	// bits (n has at most 16 bits: n*pow10RedHi is exact) and the rest
	r := (x - n*pow10RedHi) - n*pow10RedLo
	y := r * math.Ln10
	y2 := y * y
	p := 1 + y + y2*((1.0/2+y*(1.0/6))+y2*((1.0/24+y*(1.0/120))+y2*(1.0/720)))
	ni := int64(n)
	v := pow10Table[ni&(pow10TableSize-1)] * p
	return math.Float64frombits(math.Float64bits(v) + uint64(ni>>6)<<52)
}

// pow10s sets dst[i] = pow10(src[i]) (the same arithmetic, in one loop without calls:
// it is the solver's innermost loop). dst must be at least as long as src.
func pow10s(dst, src []float64) {
	dst = dst[:len(src)]
	for i, x := range src {
		if !(x >= -300 && x <= 300) {
			dst[i] = math.Pow(10, x)
			continue
		}
		const shift = 6755399441055744.0
		n := (x*(64*log2of10) + shift) - shift
		r := (x - n*pow10RedHi) - n*pow10RedLo
		y := r * math.Ln10
		y2 := y * y
		p := 1 + y + y2*((1.0/2+y*(1.0/6))+y2*((1.0/24+y*(1.0/120))+y2*(1.0/720)))
		ni := int64(n)
		v := pow10Table[ni&(pow10TableSize-1)] * p
		dst[i] = math.Float64frombits(math.Float64bits(v) + uint64(ni>>6)<<52)
	}
}

const pow10TableSize = 64 // 2^6 entries: n>>6 is the power of two

// log10(2)/64 in two parts: pow10RedHi is the value rounded down to 32 significant
// bits (exactly 0.0047035936804604716598987579345703125), pow10RedLo the rest, from
// log10(2) = 0.301029995663981195213738894724493026768 (computed to 60 digits).
const (
	pow10RedHi = 0.0047035936804604716598987579345703125
	pow10RedLo = 1.7892345153159123e-12
)

// pow10Table[j] = 2^(j/64), from math.Exp2 (within an ulp).
var pow10Table = func() (t [pow10TableSize]float64) {
	for j := range t {
		t[j] = math.Exp2(float64(j) / pow10TableSize)
	}
	return t
}()

// roughLog10 returns log10(x) for finite x > 0 within about 1e-5; it is used only for
// starting guesses, which Newton refines. Non-positive or non-finite x fall back to
// math.Log10.
func roughLog10(x float64) float64 {
	if !(x > 2.3e-308 && x < 1.7e308) {
		return math.Log10(x)
	}
	b := math.Float64bits(x)
	e := float64(int64(b>>52&0x7ff) - 1023)
	m := math.Float64frombits(b&^(0x7ff<<52) | 1023<<52) // mantissa in [1, 2)
	t := (m - 1) / (m + 1)
	t2 := t * t
	ln := 2 * t * (1 + t2*(1.0/3+t2*(1.0/5+t2*(1.0/7+t2*(1.0/9)))))
	const log10of2 = 0.301029995663981195213738894724493026768189881462108541310
	return e*log10of2 + ln*math.Log10E
}
