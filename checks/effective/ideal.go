package effective

// Idealised returns the effective length factor of a member with idealised
// end conditions a and b (order does not matter) in the plane considered,
// braced (sway false: the ends cannot translate relative to each other) or
// sway (sway true: one end may translate).
//
// The design values are (braced fixed–fixed, fixed–pinned, pinned–pinned;
// sway fixed–fixed, fixed–free, fixed–pinned):
//
//	AS4100       0.7   0.85  1.0    1.2  2.2  2.2   (AS 4100 Figure 4.6.3.2)
//	AISC         0.65  0.8   1.0    1.2  2.1  2.0   (AISC Table C-A-7.1)
//	Theoretical  0.5   0.7   1.0    1.0  2.0  2.0
//
// ok is false when no finite ke exists or the combination contradicts itself:
//
//   - sway with neither end fixed (pinned–pinned, pinned–free, free–free):
//     the member is a mechanism;
//   - braced with a free end: a free end translates, so the member is not
//     braced in that plane. It is refused rather than treated as pinned,
//     which would give 0.85 or 1.0 where the cantilever needs 2.2: ask for
//     the sway value instead.
//
// An unknown end (EndUnknown or an out-of-range value) also gives ok false.
func Idealised(f Family, a, b End, sway bool) (ke float64, ok bool) {
	if !valid(a) || !valid(b) {
		return 0, false
	}
	if a > b {
		a, b = b, a // Fixed < Pinned < Free
	}
	t, known := idealValuesOf(f)
	if !known {
		return 0, false
	}
	if !sway {
		switch {
		case b == Free:
			return 0, false
		case a == Fixed && b == Fixed:
			return t.bracedFF, true
		case a == Fixed && b == Pinned:
			return t.bracedFP, true
		default: // pinned–pinned
			return t.bracedPP, true
		}
	}
	if a != Fixed {
		return 0, false
	}
	switch b {
	case Fixed:
		return t.swayFF, true
	case Free:
		return t.swayFFree, true
	default:
		return t.swayFP, true
	}
}

func valid(e End) bool { return e == Fixed || e == Pinned || e == Free }

type idealValues struct {
	bracedFF, bracedFP, bracedPP float64
	swayFF, swayFFree, swayFP    float64
}

// idealValuesOf returns the table row of family f.
func idealValuesOf(f Family) (idealValues, bool) {
	switch f {
	case AS4100:
		return idealValues{0.7, 0.85, 1.0, 1.2, 2.2, 2.2}, true
	case AISC:
		return idealValues{0.65, 0.8, 1.0, 1.2, 2.1, 2.0}, true
	case Theoretical:
		return idealValues{0.5, 0.7, 1.0, 1.0, 2.0, 2.0}, true
	}
	return idealValues{}, false
}
