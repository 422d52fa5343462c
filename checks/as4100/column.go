package as4100

import "math"

// The column curve of 6.3.3 and the member section constant αb of Tables
// 6.3.3(1) (kf = 1) and 6.3.3(2) (kf < 1).

// curve holds the intermediate values of the column curve, for the trace.
type curve struct {
	alphaA, lambda, eta, xi, alphaC float64
}

// columnCurve evaluates 6.3.3 for the modified slenderness λn and the
// member section constant αb:
//
//	αa = 2100(λn − 13.5) / (λn² − 15.3λn + 2050)
//	λ  = λn + αa·αb
//	η  = 0.00326(λ − 13.5) ≥ 0
//	ξ  = [(λ/90)² + 1 + η] / [2(λ/90)²]
//	αc = ξ{1 − √[1 − (90/(ξλ))²]} ≤ 1
//
// A non-positive λ (a very stocky member) gives αc = 1.
//
// source: standards-notes §1.4 [L] (steel-as docs/tutorial-3.md, an NZS
// 3404/AS 4100 column-curve implementation); the same formula set in
// Folded-Structures-Lab/steel-as member.py (alpha_a, eta, xi, alpha_c).
func columnCurve(lambdaN, alphaB float64) curve {
	var c curve
	c.alphaA = 2100 * (lambdaN - 13.5) / (lambdaN*lambdaN - 15.3*lambdaN + 2050)
	c.lambda = lambdaN + c.alphaA*alphaB
	if !(c.lambda > 0) {
		c.alphaC = 1
		return c
	}
	c.eta = math.Max(0, 0.00326*(c.lambda-13.5))
	l2 := (c.lambda / 90) * (c.lambda / 90)
	c.xi = (l2 + 1 + c.eta) / (2 * l2)
	q := 90 / (c.xi * c.lambda)
	c.alphaC = math.Min(1, c.xi*(1-math.Sqrt(math.Max(0, 1-q*q))))
	return c
}

// AlphaC is the member slenderness reduction factor αc of AS 4100 6.3.3 for
// the modified member slenderness λn = (le/r)·√kf·√(fy/250) and the member
// section constant αb (−1, −0.5, 0, 0.5 or 1).
func AlphaC(lambdaN, alphaB float64) float64 { return columnCurve(lambdaN, alphaB).alphaC }

// family is the kind of section for the capacity rules.
type family uint8

const (
	famNone    family = iota
	famI              // I or H section, doubly symmetric
	famMonoI          // I section with unequal flanges
	famChannel        // channel (PFC)
	famTee            // tee
	famAngle          // angle
	famRHS            // rectangular or square hollow section
	famCHS            // circular hollow section
)

func (f family) String() string {
	switch f {
	case famI:
		return "I section"
	case famMonoI:
		return "monosymmetric I section"
	case famChannel:
		return "channel"
	case famTee:
		return "tee"
	case famAngle:
		return "angle"
	case famRHS:
		return "rectangular hollow section"
	case famCHS:
		return "circular hollow section"
	}
	return "section"
}

// αb categories, for the trace notes.
const (
	abHollowCF = iota
	abRolledI
	abRolledIThick
	abWeldedI
	abWeldedIThick
	abOpen
	abOther
	nAlphaB
)

func alphaBText() [nAlphaB]string {
	return [nAlphaB]string{
		abHollowCF:     "cold-formed hollow section, not stress-relieved: -0.5 (Tables 6.3.3(1) and (2))",
		abRolledI:      "hot-rolled I section, flanges up to 40 mm: 0 (Tables 6.3.3(1) and (2))",
		abRolledIThick: "hot-rolled I section, flanges over 40 mm (Table 6.3.3(1): other sections +1.0; Table 6.3.3(2): +0.5)",
		abWeldedI:      "welded I section, flanges up to 40 mm (Table 6.3.3(1): 0; Table 6.3.3(2): +0.5)",
		abWeldedIThick: "welded I section, flanges over 40 mm: other sections +1.0",
		abOpen:         "channel, tee or angle (Table 6.3.3(1): +0.5; Table 6.3.3(2): +1.0)",
		abOther:        "other sections: +1.0",
	}
}

// memberSectionConstant returns αb of Tables 6.3.3(1) (kf = 1) and
// 6.3.3(2) (kf < 1) and the category (an index of alphaBText).
//
// source: Folded-Structures-Lab/steel-as slenderness.py
// _member_section_constant (both tables), the OneSteel DuraGal design
// capacity tables (αb = −0.5 for C450L0 hollow sections, Table 6.3.3) and
// standards-notes §6.3 [D] (αb = −0.5 reproduces SDH Example 6.2 with kf <
// 1). [L] For cold-formed hollow sections with kf = 1 the Australian Tube
// Mills tables (165.1×5.4 CHS C250L0) are reproduced with −0.5, not with
// the −1.0 of hot-formed or stress-relieved tubes that one library uses for
// every hollow section. The branch for welded I sections with flanges over
// 40 mm is from memory: "other sections", +1.0.
func memberSectionConstant(f family, welded bool, tf, kf float64) (float64, int) {
	full := kf >= 1-1e-9
	switch f {
	case famRHS, famCHS:
		return -0.5, abHollowCF
	case famI, famMonoI:
		switch {
		case !welded && tf <= 40:
			return 0, abRolledI
		case !welded && full:
			return 1, abRolledIThick
		case !welded:
			return 0.5, abRolledIThick
		case tf <= 40 && full:
			return 0, abWeldedI
		case tf <= 40:
			return 0.5, abWeldedI
		}
		return 1, abWeldedIThick // from memory: not listed, "other sections"
	case famChannel, famTee, famAngle:
		if full {
			return 0.5, abOpen
		}
		return 1, abOpen
	}
	return 1, abOther
}
