// Package lsq solves the normal equations of linear least squares: the one
// Cholesky solver of the project's fits (additive entropies, ion volumes).
package lsq

import (
	"errors"
	"math"
)

// ErrNotPositiveDefinite reports normal equations that a Cholesky
// factorisation cannot take: some combination of the unknowns is not
// determined by the data.
var ErrNotPositiveDefinite = errors.New("the least-squares system is singular (not positive definite)")

// SolveSPD solves the symmetric positive-definite system m·x = b, m being
// p×p in row-major order, by Cholesky factorisation m = L·Lᵀ and two
// triangular solves (Golub and Van Loan, Matrix Computations, 4th ed.,
// algorithm 4.2.1). Only the lower triangle of m is read.
func SolveSPD(m, b []float64, p int) ([]float64, error) {
	l := make([]float64, p*p)
	for i := range p {
		for j := 0; j <= i; j++ {
			s := m[i*p+j]
			for k := range j {
				s -= l[i*p+k] * l[j*p+k]
			}
			if i == j {
				if !(s > 0) {
					return nil, ErrNotPositiveDefinite
				}
				l[i*p+i] = math.Sqrt(s)
			} else {
				l[i*p+j] = s / l[j*p+j]
			}
		}
	}
	y := make([]float64, p)
	for i := range p {
		s := b[i]
		for k := range i {
			s -= l[i*p+k] * y[k]
		}
		y[i] = s / l[i*p+i]
	}
	x := make([]float64, p)
	for i := p - 1; i >= 0; i-- {
		s := y[i]
		for k := i + 1; k < p; k++ {
			s -= l[k*p+i] * x[k]
		}
		x[i] = s / l[i*p+i]
	}
	return x, nil
}
