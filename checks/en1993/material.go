package en1993

import (
	"math"
	"strings"
)

// Yield strength for the capacity checks: the model's fy, else the
// request's default (Options.Yield), else the value of the grade named in
// the model from a small table of common grades (below), by the thickness
// band of the section's thickest element, which gives the lowest fy of the
// section; one fy is used for the whole section.

// product is the product standard a grade name refers to.
type product uint8

const (
	productRolled product = iota // EN 10025-2 (open sections, plates)
	productHot                   // EN 10210-1 hot-finished hollow sections
	productCold                  // EN 10219-1 cold-formed hollow sections
)

// fyBand is one thickness band: fy for nominal thicknesses t ≤ max.
type fyBand struct {
	max float64 // mm
	fy  float64 // MPa
}

// grade is one entry of the table.
type grade struct {
	number  string // "235", "275", "355", "450", "460"
	product product
	label   string
	bands   []fyBand
}

// grades is the table of common grades.
//
// EN 10025-2 (hot-rolled sections, plates): the product standard's
// minimum yield strength ReH by nominal thickness (≤ 16, ≤ 40, ≤ 63, ≤ 80,
// ≤ 100 mm), which EN 1993-1-1 3.2.1(1)a permits to be used as fy.
// source: xcfem/xc python_modules/materials/ec3/EC3_materials.py
// (S235JR, S275JR, S355JR, S450J0 "European norm EN 10025-2:2004") [L].
//
// S460 (EN 10025-3/-4, N/NL and M/ML) and the hollow sections: the
// simplified values of EN 1993-1-1 Table 3.1 (t ≤ 40 mm and
// 40 < t ≤ 80 mm; EN 10219-1 gives t ≤ 40 mm only), 3.2.1(1)b.
// source: alezen9/themis apps/frontend/src/pages/ec3/data/steel-grades.ts
// (EN 1993-1-1 Table 3.1 rows EN10025-3/-4, EN10210-1, EN10219-1) [L].
// S460 cold-formed (EN 10219-1) is left out: that source gives 420, which
// does not match the grade name; such a member needs fy in the model.
var grades = []grade{
	{"235", productRolled, "EN 10025-2 S235 (ReH by thickness)", []fyBand{{16, 235}, {40, 225}, {63, 215}, {80, 215}, {100, 215}}},
	{"275", productRolled, "EN 10025-2 S275 (ReH by thickness)", []fyBand{{16, 275}, {40, 265}, {63, 255}, {80, 245}, {100, 235}}},
	{"355", productRolled, "EN 10025-2 S355 (ReH by thickness)", []fyBand{{16, 355}, {40, 345}, {63, 335}, {80, 325}, {100, 315}}},
	{"450", productRolled, "EN 10025-2 S450 (ReH by thickness)", []fyBand{{16, 450}, {40, 430}, {63, 410}, {80, 390}, {100, 380}}},
	{"460", productRolled, "EN 10025-3/-4 S460 (EN 1993-1-1 Table 3.1)", []fyBand{{40, 460}, {80, 430}}},
	{"235", productHot, "EN 10210-1 S235H (EN 1993-1-1 Table 3.1)", []fyBand{{40, 235}, {80, 215}}},
	{"275", productHot, "EN 10210-1 S275H (EN 1993-1-1 Table 3.1)", []fyBand{{40, 275}, {80, 255}}},
	{"355", productHot, "EN 10210-1 S355H (EN 1993-1-1 Table 3.1)", []fyBand{{40, 355}, {80, 335}}},
	{"460", productHot, "EN 10210-1 S460NH (EN 1993-1-1 Table 3.1)", []fyBand{{40, 460}, {80, 430}}},
	{"235", productCold, "EN 10219-1 S235H (EN 1993-1-1 Table 3.1)", []fyBand{{40, 235}}},
	{"275", productCold, "EN 10219-1 S275H (EN 1993-1-1 Table 3.1)", []fyBand{{40, 275}}},
	{"355", productCold, "EN 10219-1 S355H (EN 1993-1-1 Table 3.1)", []fyBand{{40, 355}}},
}

// gradeYield returns fy and the table label of the grade named in name for
// a section of product p whose thickest element is t (mm); ok is false
// when no grade of the table is named or t is beyond its bands. A name
// such as "S355", "S355J2", "S355J2H", "S 355 JR", "S355NH" or "Steel
// S275JR" names a grade; "10210" or "10219" in the name selects the hollow
// section standard.
func gradeYield(name string, p product, t float64) (fy float64, label string, ok bool) {
	s := strings.ToUpper(name)
	if p != productRolled {
		switch {
		case strings.Contains(s, "10210"):
			p = productHot
		case strings.Contains(s, "10219"):
			p = productCold
		}
	}
	num := ""
	for i := 0; i < len(s); i++ {
		if s[i] != 'S' || (i > 0 && isAlnum(s[i-1])) {
			continue
		}
		j := i + 1
		if j < len(s) && s[j] == ' ' {
			j++
		}
		if j+3 <= len(s) && isDigit(s[j]) && isDigit(s[j+1]) && isDigit(s[j+2]) && (j+3 == len(s) || !isDigit(s[j+3])) {
			num = s[j : j+3]
			break
		}
	}
	if num == "" {
		return 0, "", false
	}
	for k := range grades {
		g := &grades[k]
		if g.number != num || g.product != p {
			continue
		}
		for _, b := range g.bands {
			if t <= b.max {
				return b.fy, g.label, true
			}
		}
		return 0, "", false
	}
	return 0, "", false
}

func isDigit(c byte) bool { return c >= '0' && c <= '9' }

func isAlnum(c byte) bool { return isDigit(c) || (c >= 'A' && c <= 'Z') || (c >= 'a' && c <= 'z') }

func finitePos(x float64) bool { return x > 0 && !math.IsInf(x, 1) }
