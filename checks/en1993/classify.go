package en1993

import (
	"math"
	"strings"

	"swaygate/checks/section"
)

// Section families with capacity formulas in this package.
type family uint8

const (
	famNone family = iota
	famI           // doubly symmetric I or H section (section.ISection)
	famRHS         // rectangular or square hollow section
	famCHS         // circular hollow section
)

// Class limits of EN 1993-1-1 Table 5.2 (multiples of epsilon; of
// epsilon² for circular hollow sections): Class 1, 2 and 3.
// source: xcfem/xc python_modules/materials/ec3/EC3_materials.py
// (internal parts 33/38/42 in compression, 72/83/124 in bending; outstands
// 9/10/14 in compression) [L]; CHS 50/70/90 ε², outstand with the tip in
// compression under bending 9/10/21√kσ: from memory [M].
var (
	limInternalComp = [3]float64{33, 38, 42}
	limInternalBend = [3]float64{72, 83, 124}
	limOutstandComp = [3]float64{9, 10, 14}
	// limOutstandTip is an outstand bent with its tip in compression and
	// its root at the neutral axis (an I section's flange about the minor
	// axis): 9ε/α and 10ε/α with α = 1, and 21ε√kσ with kσ = 0.57 for
	// ψ = 0 (EN 1993-1-5 Table 4.2).
	limOutstandTip = [3]float64{9, 10, 21 * math.Sqrt(0.57)}
	limCHS         = [3]float64{50, 70, 90}
)

// element is one plate element of the section with its slenderness and
// classes.
type element struct {
	part    string // trace label
	c, t    float64
	ratio   float64 // c/t (d/t for a CHS)
	support section.Support
	count   int
	// classN is the class in compression; classM per axis the class in
	// bending about that axis (0: not in compression under that bending).
	classN int
	classM [2]int
	// limM is the kind of limits used in bending per axis.
	limM [2]*[3]float64
	// rho is the reduction factor of EN 1993-1-5 4.4 in compression (1 up
	// to Class 3).
	rho float64
}

// classOf returns the class (1 to 4) of a slenderness against limits
// (already multiplied by epsilon or epsilon²).
func classOf(ratio float64, lim *[3]float64, scale float64) int {
	for k := range lim {
		if ratio <= lim[k]*scale {
			return k + 1
		}
	}
	return 4
}

// unwrap returns the shape a Transformed wraps (its parent, recursively).
func unwrap(s section.Shape) section.Shape {
	for {
		t, ok := s.(section.Transformed)
		if !ok {
			return s
		}
		s = t.Parent
	}
}

// sectionType finds the family of the geometry and, from the profile and
// material names, whether an I section is welded and whether a hollow
// section is hot-finished. note says how it was found when it was assumed
// ("" when a name said it).
func sectionType(geom section.Shape, profile, grade, material string) (fam family, welded, hot bool, note string) {
	names := strings.ToUpper(profile + " " + grade + " " + material)
	switch g := unwrap(geom).(type) {
	case section.ISection:
		fam = famI
		switch {
		case hasAny(names, "WELD", "WWF", "BUILT", "PLATE GIRDER"):
			welded = true
		case hasAny(strings.ToUpper(profile), "IPE", "HE", "HD", "HL", "UB", "UC", "W1", "W2", "W3", "W4", "W5", "W6", "W8",
			"W9", "INP", "IPN") || hasAny(names, "ROLLED"):
		case g.R > 0:
			note = noteAssumedRolled
		default:
			welded, note = true, noteAssumedWelded
		}
	case section.RHS, section.CHS:
		fam = famRHS
		if _, ok := g.(section.CHS); ok {
			fam = famCHS
		}
		switch {
		case hasAny(names, "10210", "HOT", "HF"):
			hot = true
		case hasAny(names, "10219", "COLD", "CF"):
		default:
			note = noteAssumedCold
		}
	}
	return fam, welded, hot, note
}

func hasAny(s string, subs ...string) bool {
	for _, x := range subs {
		if strings.Contains(s, x) {
			return true
		}
	}
	return false
}

// elements classifies the plate elements of the section (Table 5.2) with
// c measured as the table defines it: the flat width clear of root fillets
// and corner radii (b − 3t for a hollow section whose corner radius is
// not given). It returns at most four elements.
func elements(fam family, plates []section.Plate, eps float64, out *[4]element) int {
	n := 0
	eps2 := eps * eps
	switch fam {
	case famI:
		for k := range plates {
			p := &plates[k]
			c := p.Width - p.Fillet
			if p.Support == section.BothEdges {
				c = p.Width - 2*p.Fillet
			}
			e := element{c: c, t: p.Thickness, support: p.Support, count: p.Count, rho: 1}
			e.ratio = c / p.Thickness
			if p.Support == section.OneEdge {
				e.part = "flange outstand"
				e.classN = classOf(e.ratio, &limOutstandComp, eps)
				e.limM = [2]*[3]float64{&limOutstandComp, &limOutstandTip}
				e.classM = [2]int{e.classN, classOf(e.ratio, &limOutstandTip, eps)}
			} else {
				e.part = "web"
				e.classN = classOf(e.ratio, &limInternalComp, eps)
				e.limM = [2]*[3]float64{&limInternalBend, nil}
				e.classM = [2]int{classOf(e.ratio, &limInternalBend, eps), 0}
			}
			if n < len(out) {
				out[n] = e
				n++
			}
		}
	case famRHS:
		// The walls of the shorter outside side are the flanges in
		// major-axis bending (the axis parallel to them), the longer ones
		// the webs; about the minor axis the roles swap.
		short := math.Inf(1)
		for k := range plates {
			short = math.Min(short, plates[k].Width)
		}
		for k := range plates {
			p := &plates[k]
			c := p.Width - 2*p.Fillet
			if p.Fillet <= 0 {
				c = p.Width - p.Thickness // b − 3t with b the outside width
			}
			e := element{c: c, t: p.Thickness, support: p.Support, count: p.Count, rho: 1}
			e.ratio = c / p.Thickness
			e.classN = classOf(e.ratio, &limInternalComp, eps)
			bend := classOf(e.ratio, &limInternalBend, eps)
			if p.Width == short {
				e.part = "wall (flange in major-axis bending)"
				e.limM = [2]*[3]float64{&limInternalComp, &limInternalBend}
				e.classM = [2]int{e.classN, bend}
			} else {
				e.part = "wall (web in major-axis bending)"
				e.limM = [2]*[3]float64{&limInternalBend, &limInternalComp}
				e.classM = [2]int{bend, e.classN}
			}
			if n < len(out) {
				out[n] = e
				n++
			}
		}
	case famCHS:
		for k := range plates {
			p := &plates[k]
			e := element{part: "wall", c: p.Width, t: p.Thickness, support: p.Support, count: 1, rho: 1}
			e.ratio = p.Width / p.Thickness
			e.classN = classOf(e.ratio, &limCHS, eps2)
			e.limM = [2]*[3]float64{&limCHS, &limCHS}
			e.classM = [2]int{e.classN, e.classN}
			if n < len(out) {
				out[n] = e
				n++
			}
		}
	}
	return n
}

// rhoCompression is the reduction factor rho of EN 1993-1-5 4.4(2) for a
// flat element in uniform compression (psi = 1): internal elements with
// k_sigma = 4, rho = (lambda_p − 0.22)/lambda_p² for lambda_p > 0.673;
// outstands with k_sigma = 0.43, rho = (lambda_p − 0.188)/lambda_p² for
// lambda_p > 0.748; lambda_p = (c/t)/(28.4 epsilon sqrt(k_sigma)). From
// memory [M].
func rhoCompression(ratio, eps float64, support section.Support) (rho, lambdaP float64) {
	switch support {
	case section.BothEdges:
		lambdaP = ratio / (28.4 * eps * 2)
		if lambdaP <= 0.673 {
			return 1, lambdaP
		}
		return math.Min(1, (lambdaP-0.22)/(lambdaP*lambdaP)), lambdaP
	case section.OneEdge:
		lambdaP = ratio / (28.4 * eps * math.Sqrt(0.43))
		if lambdaP <= 0.748 {
			return 1, lambdaP
		}
		return math.Min(1, (lambdaP-0.188)/(lambdaP*lambdaP)), lambdaP
	}
	return math.NaN(), math.NaN()
}
