package effective

// Family selects the design practice whose tabulated values are used: the
// idealised ke values, the beam far-end factors βe and the footing values.
type Family uint8

const (
	// AS4100 is AS 4100 practice (also used for NZS 3404): Figure 4.6.3.2
	// design ke, Table 4.6.3.4 βe, and γ = 10 (pinned) / 0.6 (rigid) footings.
	AS4100 Family = iota
	// AISC is AISC 360 Commentary practice: Table C-A-7.1 recommended K,
	// the girder adjustments of Appendix 7, and G = 10 / 1.0 footings.
	AISC
	// Theoretical uses the exact idealisations: the theoretical ke (0.5,
	// 0.7, 1.0, 1.0, 2.0, 2.0), βe from the beam stiffness (3EI/L pinned far
	// end, 4EI/L fixed far end) and G = +Inf (pinned) / 0 (fixed) footings.
	Theoretical
)

func (f Family) String() string {
	switch f {
	case AISC:
		return "aisc"
	case Theoretical:
		return "theoretical"
	}
	return "as4100"
}

// End is an idealised end condition of a compression member, in the plane of
// buckling considered.
type End uint8

const (
	// EndUnknown is the zero value; no function accepts it.
	EndUnknown End = iota
	// Fixed: rotation restrained.
	Fixed
	// Pinned: rotation free.
	Pinned
	// Free: rotation and translation free (a cantilever tip).
	Free
)

func (e End) String() string {
	switch e {
	case Fixed:
		return "fixed"
	case Pinned:
		return "pinned"
	case Free:
		return "free"
	}
	return "unknown"
}

// ParseEnd reads an end condition label ("fixed", "pinned", "free"; case is
// ignored, as in the EndConditionBottom/Top properties). It reports false
// for any other label.
func ParseEnd(s string) (End, bool) {
	switch {
	case equalFold(s, "fixed"):
		return Fixed, true
	case equalFold(s, "pinned"):
		return Pinned, true
	case equalFold(s, "free"):
		return Free, true
	}
	return EndUnknown, false
}

// equalFold reports whether s equals the lower-case ASCII word w, ignoring
// ASCII case.
func equalFold(s, w string) bool {
	if len(s) != len(w) {
		return false
	}
	for i := 0; i < len(s); i++ {
		c := s[i]
		if 'A' <= c && c <= 'Z' {
			c += 'a' - 'A'
		}
		if c != w[i] {
			return false
		}
	}
	return true
}
