package section

import (
	"errors"
	"fmt"
	"math"
	"strconv"
)

// ErrDimension is wrapped by every DimensionError: test for it with
// errors.Is.
var ErrDimension = errors.New("section: invalid dimensions")

// DimensionError reports a shape whose dimensions do not make a valid
// section. It names the shape, the designation when one was given, and the
// field at fault with its value.
type DimensionError struct {
	Shape  string  // Go type of the shape, e.g. "ISection"
	Name   string  // designation, e.g. "IPE200"; may be empty
	Field  string  // the field at fault, e.g. "Tf"
	Value  float64 // its value, mm (radians for slopes)
	Reason string  // what is wrong, lower case
}

func (e *DimensionError) Error() string {
	b := make([]byte, 0, 96)
	b = append(b, "section: "...)
	b = append(b, e.Shape...)
	if e.Name != "" {
		b = append(b, ' ')
		b = strconv.AppendQuote(b, e.Name)
	}
	b = append(b, ": "...)
	if e.Field != "" {
		b = append(b, e.Field...)
		b = append(b, " = "...)
		b = strconv.AppendFloat(b, e.Value, 'g', 6, 64)
		b = append(b, ": "...)
	}
	b = append(b, e.Reason...)
	return string(b)
}

// Unwrap returns ErrDimension.
func (e *DimensionError) Unwrap() error { return ErrDimension }

// checker collects the first dimension error of a shape.
type checker struct {
	shape, name string
	err         error
}

func (c *checker) failf(field string, v float64, format string, args ...any) {
	if c.err != nil {
		return
	}
	c.err = &DimensionError{Shape: c.shape, Name: c.name, Field: field, Value: v, Reason: fmt.Sprintf(format, args...)}
}

// positive requires a finite v > 0.
func (c *checker) positive(field string, v float64) {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		c.failf(field, v, "must be a finite number")
	} else if v <= 0 {
		c.failf(field, v, "must be greater than zero")
	}
}

// nonNegative requires a finite v >= 0 (0 meaning "not given").
func (c *checker) nonNegative(field string, v float64) {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		c.failf(field, v, "must be a finite number")
	} else if v < 0 {
		c.failf(field, v, "must not be negative")
	}
}

// less requires v < limit; what describes the limit for the message.
func (c *checker) less(field string, v, limit float64, what string) {
	if c.err == nil && !(v < limit) {
		c.failf(field, v, "must be less than %s (%.4g mm)", what, limit)
	}
}

// slope requires 0 <= v < 45°: the flange and web slopes of rolled sections
// are a few degrees.
func (c *checker) slope(field string, v float64) {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		c.failf(field, v, "must be a finite number")
	} else if v < 0 || v >= math.Pi/4 {
		c.failf(field, v, "must be from 0 to less than π/4 rad (45°)")
	}
}
