package effective

import (
	"fmt"
	"math"
)

// FarEnd is the condition at the far end of a restraining beam.
type FarEnd uint8

const (
	// FarColumn: the far end is rigidly connected to a column (the
	// alignment-chart assumption; βe = 1).
	FarColumn FarEnd = iota
	// FarPinned: the far end is pinned.
	FarPinned
	// FarFixed: the far end is fixed.
	FarFixed
)

func (f FarEnd) String() string {
	switch f {
	case FarPinned:
		return "pinned"
	case FarFixed:
		return "fixed"
	}
	return "column"
}

// BetaE returns the modifying factor βe of a restraining beam's stiffness
// I/L for its far-end condition, braced (sway false) or sway:
//
//	                    braced  sway
//	far end pinned      1.5     0.5
//	rigid to a column   1.0     1.0
//	far end fixed       2.0     0.67   (AS4100, AS 4100 Table 4.6.3.4)
//	                            2/3    (AISC, Commentary Appendix 7; Theoretical)
//
// A braced chart assumes the beam bends in single curvature (stiffness
// 2EI/L): a pinned far end gives 3EI/L (×1.5), a fixed one 4EI/L (×2). A
// sway chart assumes reverse curvature (6EI/L): 3EI/L (×0.5) and 4EI/L (×2/3).
func BetaE(f Family, far FarEnd, sway bool) float64 {
	switch far {
	case FarPinned:
		if sway {
			return 0.5
		}
		return 1.5
	case FarFixed:
		if !sway {
			return 2
		}
		if f == AS4100 {
			return 0.67
		}
		return 2.0 / 3
	}
	return 1
}

// Column is a compression member meeting at a joint: E in MPa, I (about the
// axis of bending in the plane of buckling) in mm⁴, L in mm.
type Column struct {
	E, I, L float64
}

// Beam is a restraining member rigidly connected at the joint in the plane of
// buckling. Beams connected for shear only are left out (AISC Commentary
// Appendix 7).
type Beam struct {
	E, I, L float64
	Far     FarEnd
}

// Ratio returns the end-restraint ratio of a joint (AS 4100 4.6.3.3 γ; AISC
// G):
//
//	γ = Σ(E·I/L)columns / Σ(βe·E·I/L)beams
//
// over the columns and beams rigidly connected at the joint in the plane of
// buckling, βe from BetaE. With no beam the joint is unrestrained and Ratio
// returns +Inf. At least one column is required; every E, I and L must be
// positive. Beam axial force and column inelasticity adjustments are not
// applied.
func Ratio(f Family, columns []Column, beams []Beam, sway bool) (float64, error) {
	if len(columns) == 0 {
		return 0, fmt.Errorf("effective: joint has no column")
	}
	var sc, sb float64
	for i, c := range columns {
		if err := checkStiffness("column", i, c.E, c.I, c.L); err != nil {
			return 0, err
		}
		sc += c.E * c.I / c.L
	}
	for i, b := range beams {
		if err := checkStiffness("beam", i, b.E, b.I, b.L); err != nil {
			return 0, err
		}
		sb += BetaE(f, b.Far, sway) * b.E * b.I / b.L
	}
	if sb == 0 {
		return math.Inf(1), nil
	}
	return sc / sb, nil
}

func checkStiffness(what string, i int, e, in, l float64) error {
	if !(e > 0) || !(in > 0) || !(l > 0) || math.IsInf(e*in/l, 0) {
		return fmt.Errorf("effective: %s %d: E = %g, I = %g, L = %g: want positive finite values", what, i, e, in, l)
	}
	return nil
}

// Footing returns the end-restraint ratio to use at a column base with the
// footing condition base (Pinned or Fixed), unless a rational analysis gives
// another value:
//
//	               pinned  fixed (rigid)
//	AS4100         10      0.6    (Steel Designers' Handbook on AS 4100 4.6.3.3; γ ≥ 10 for pinned)
//	AISC           10      1.0    (AISC Commentary Appendix 7)
//	Theoretical    +Inf    0
//
// ok is false for any other end condition.
func Footing(f Family, base End) (g float64, ok bool) {
	switch base {
	case Pinned:
		if f == Theoretical {
			return math.Inf(1), true
		}
		return 10, true
	case Fixed:
		switch f {
		case AISC:
			return 1, true
		case Theoretical:
			return 0, true
		}
		return 0.6, true
	}
	return 0, false
}
