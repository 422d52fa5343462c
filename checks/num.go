package checks

import (
	"math"
	"strconv"
)

// Num is a float64 that may be unknown. NaN means "could not be computed" and
// is written as JSON null; every other value is written in the shortest form
// that round-trips.
type Num float64

// Null is the unknown Num.
var Null = Num(math.NaN())

// Known reports whether n holds a value.
func (n Num) Known() bool { return !math.IsNaN(float64(n)) }

// F returns n as a float64 (NaN when unknown).
func (n Num) F() float64 { return float64(n) }

// MarshalJSON writes null for an unknown value and for ±Inf.
func (n Num) MarshalJSON() ([]byte, error) {
	f := float64(n)
	if math.IsNaN(f) || math.IsInf(f, 0) {
		return []byte("null"), nil
	}
	return strconv.AppendFloat(nil, f, 'g', -1, 64), nil
}

// UnmarshalJSON reads null as unknown.
func (n *Num) UnmarshalJSON(b []byte) error {
	if string(b) == "null" {
		*n = Null
		return nil
	}
	f, err := strconv.ParseFloat(string(b), 64)
	if err != nil {
		return err
	}
	*n = Num(f)
	return nil
}
