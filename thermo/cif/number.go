package cif

import (
	"math"
	"strconv"
	"strings"
)

// parseNumber reads a CIF numeric value: an optional sign, digits with an
// optional decimal point, an optional exponent, and an optional standard
// uncertainty in parentheses, as in 5.4309(2) or -1.2e-3(4). The
// uncertainty is checked and dropped. Words such as "NaN" or "Inf", which
// CIF does not allow, are refused.
func parseNumber(s string) (float64, bool) {
	body := s
	if k := strings.IndexByte(s, '('); k >= 0 {
		if !strings.HasSuffix(s, ")") || k+2 > len(s)-1 {
			return 0, false
		}
		for _, c := range s[k+1 : len(s)-1] {
			if c < '0' || c > '9' {
				return 0, false
			}
		}
		body = s[:k]
	}
	i := 0
	if i < len(body) && (body[i] == '+' || body[i] == '-') {
		i++
	}
	digits := 0
	for i < len(body) && body[i] >= '0' && body[i] <= '9' {
		i++
		digits++
	}
	if i < len(body) && body[i] == '.' {
		i++
		for i < len(body) && body[i] >= '0' && body[i] <= '9' {
			i++
			digits++
		}
	}
	if digits == 0 {
		return 0, false
	}
	if i < len(body) && (body[i] == 'e' || body[i] == 'E') {
		i++
		if i < len(body) && (body[i] == '+' || body[i] == '-') {
			i++
		}
		exp := 0
		for i < len(body) && body[i] >= '0' && body[i] <= '9' {
			i++
			exp++
		}
		if exp == 0 {
			return 0, false
		}
	}
	if i != len(body) {
		return 0, false
	}
	x, err := strconv.ParseFloat(body, 64)
	if err != nil || math.IsInf(x, 0) || math.IsNaN(x) {
		return 0, false
	}
	return x, true
}
