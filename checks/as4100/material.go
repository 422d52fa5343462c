package as4100

import (
	"math"
	"strings"
)

// Yield stress for the capacity checks: the model's fy, else the request's
// default (Options.Yield), else the value of the grade named in the model
// from a small table of common grades of the AS/NZS family, by the
// thickness band of the section's thickest element (which gives the lowest
// fy of the section; one fy is used for every element, as the design
// capacity tables do).

// product is the kind of steel product a section is made of; it decides
// which material standard a bare grade number refers to.
type product uint8

const (
	productRolled product = iota // hot-rolled sections: AS/NZS 3679.1
	productWelded                // welded sections from plate: AS/NZS 3678
	productHollow                // structural hollow sections: AS/NZS 1163
)

// band is one thickness band of a grade: fy for thicknesses up to max
// (t ≤ max, or t < max when strict).
type band struct {
	max    float64 // mm; +Inf for the last band
	strict bool
	fy     float64 // MPa
}

// grade is one entry of the table.
type grade struct {
	number  string // the grade number as written, e.g. "300"
	product product
	label   string  // trace note, e.g. "AS/NZS 3679.1 grade 300"
	fu      float64 // MPa, tensile strength
	bands   []band
}

var inf = math.Inf(1)

// grades is the table of common AS/NZS grades. The values are those AS 4100
// Table 2.1 reproduces from the material standards.
//
// source: AS 4100 Table 2.1 via two public implementations that agree:
// Folded-Structures-Lab/steel-as src/steelas/member/material.py
// (AS3679_sections_fy, AS3678_fy, AS1163_fy and the fu functions) and a
// public plate_yield_stress function citing AS 4100:2020 Table 2.1 (grades
// 250, 300 of AS/NZS 3678 and 300, 350 of AS/NZS 3679.1). [L]
var grades = []grade{
	// AS/NZS 3679.1 hot-rolled bars and sections.
	{"300", productRolled, "AS/NZS 3679.1 grade 300 (AS 4100 Table 2.1)", 440,
		[]band{{11, true, 320}, {17, false, 300}, {inf, false, 280}}},
	{"350", productRolled, "AS/NZS 3679.1 grade 350 (AS 4100 Table 2.1)", 480,
		[]band{{11, false, 360}, {40, true, 340}, {inf, false, 330}}},
	// AS/NZS 3678 hot-rolled plates (welded sections).
	{"250", productWelded, "AS/NZS 3678 grade 250 (AS 4100 Table 2.1)", 410,
		[]band{{8, false, 280}, {12, false, 260}, {50, false, 250}, {80, false, 240}, {150, false, 230}}},
	{"300", productWelded, "AS/NZS 3678 grade 300 (AS 4100 Table 2.1)", 430,
		[]band{{8, false, 320}, {12, false, 310}, {20, false, 300}, {50, false, 280}, {80, false, 270}, {150, false, 260}}},
	{"350", productWelded, "AS/NZS 3678 grade 350 (AS 4100 Table 2.1)", 450,
		[]band{{12, false, 360}, {20, false, 350}, {80, false, 340}, {150, false, 330}}},
	{"400", productWelded, "AS/NZS 3678 grade 400 (AS 4100 Table 2.1)", 480,
		[]band{{12, false, 400}, {20, false, 380}, {80, false, 360}}},
	// AS/NZS 1163 cold-formed structural hollow sections (one value for
	// every thickness).
	{"250", productHollow, "AS/NZS 1163 grade C250 (AS 4100 Table 2.1)", 320, []band{{inf, false, 250}}},
	{"350", productHollow, "AS/NZS 1163 grade C350 (AS 4100 Table 2.1)", 430, []band{{inf, false, 350}}},
	{"450", productHollow, "AS/NZS 1163 grade C450 (AS 4100 Table 2.1)", 500, []band{{inf, false, 450}}},
}

// yieldOf returns fy, fu and the table label of the named grade for a
// section of product p whose thickest element is t (mm); ok is false when
// the grade is not in the table or t is beyond its bands.
//
// The name is read token by token (separators are anything but letters
// and digits): a token like "300", "GR300", "GRADE350", "300PLUS",
// "C450L0" or "350L0" names the grade; a token "3679", "3678" or "1163"
// names the material standard and overrides the product; a leading "C"
// (C250, C350, C450) is AS/NZS 1163.
func yieldOf(name string, p product, t float64) (fy, fu float64, label string, ok bool) {
	num, prod, found := parseGrade(name, p)
	if !found {
		return 0, 0, "", false
	}
	for k := range grades {
		g := &grades[k]
		if g.number != num || g.product != prod {
			continue
		}
		for _, b := range g.bands {
			if t < b.max || (!b.strict && t == b.max) {
				return b.fy, g.fu, g.label, true
			}
		}
		return 0, 0, "", false
	}
	return 0, 0, "", false
}

// parseGrade finds the grade number and the product it belongs to.
func parseGrade(name string, p product) (num string, prod product, ok bool) {
	prod = p
	s := strings.ToUpper(name)
	for len(s) > 0 {
		// Next token of letters and digits.
		i := 0
		for i < len(s) && !isAlnum(s[i]) {
			i++
		}
		j := i
		for j < len(s) && isAlnum(s[j]) {
			j++
		}
		tok := s[i:j]
		s = s[j:]
		switch tok {
		case "3679":
			prod = productRolled
			continue
		case "3678":
			prod = productWelded
			continue
		case "1163":
			prod = productHollow
			continue
		}
		hollow := false
		switch {
		case strings.HasPrefix(tok, "GRADE"):
			tok = tok[5:]
		case strings.HasPrefix(tok, "GR"):
			tok = tok[2:]
		case strings.HasPrefix(tok, "C") && len(tok) > 1 && isDigit(tok[1]):
			tok, hollow = tok[1:], true
		case strings.HasPrefix(tok, "G") && len(tok) > 1 && isDigit(tok[1]):
			tok = tok[1:]
		}
		if len(tok) < 3 || !isDigit(tok[0]) || !isDigit(tok[1]) || !isDigit(tok[2]) {
			continue
		}
		rest := tok[3:]
		switch rest {
		case "", "PLUS", "L0", "L15", "L20", "L40", "L50", "Y0":
		default:
			continue
		}
		switch n := tok[:3]; n {
		case "250", "300", "350", "400", "450":
			num = n
		default:
			continue
		}
		if hollow {
			prod = productHollow
		}
		ok = true
	}
	return num, prod, ok
}

func isDigit(c byte) bool { return c >= '0' && c <= '9' }

func isAlnum(c byte) bool { return isDigit(c) || (c >= 'A' && c <= 'Z') }
