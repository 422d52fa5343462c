package aisc360

import (
	"math"
	"strings"
)

// Yield stress for the capacity checks: the model's Fy, else the request's
// default (Options.Yield), else the value of the ASTM grade named in the
// model from a small table of common grades (below). ASTM structural
// grades give one minimum Fy for every thickness of the shapes here.

// KSI is one ksi in MPa.
const KSI = 6.894757293168361

// astm is one entry of the table: a designation and, where the standard
// distinguishes them, the grade letter; Fy of rectangular (and open)
// sections and of round HSS.
type astm struct {
	spec        string // e.g. "A992"
	grade       string // "" or e.g. "B", "C", "50"
	rect, round float64
	label       string
}

// grades is the table of common ASTM grades (ksi).
//
// source: A992 Fy = 50 ksi and A500 Grade B 46 ksi / Grade C 50 ksi for
// rectangular HSS: standards-notes §6.2 (AISC Design Examples E.1, E.9,
// "Fy = 50 ksi", "Fy = 46 (A500 Gr B)", "Fy = 50 (A500 Gr C)") [L].
// from memory: A36 36 ksi, A572 Grade 50 50 ksi, A500 round HSS Grade B
// 42 ksi and Grade C 46 ksi, A53 Grade B 35 ksi, A1085 50 ksi (AISC Manual
// Table 2-4) [M].
var grades = []astm{
	{"A992", "", 50, 50, "ASTM A992 (Fy = 50 ksi)"},
	{"A36", "", 36, 36, "ASTM A36 (Fy = 36 ksi)"},
	{"A572", "50", 50, 50, "ASTM A572 Grade 50 (Fy = 50 ksi)"},
	{"A500", "B", 46, 42, "ASTM A500 Grade B (Fy = 46 ksi rectangular, 42 ksi round)"},
	{"A500", "C", 50, 46, "ASTM A500 Grade C (Fy = 50 ksi rectangular, 46 ksi round)"},
	{"A53", "B", 35, 35, "ASTM A53 Grade B (Fy = 35 ksi)"},
	{"A1085", "", 50, 50, "ASTM A1085 (Fy = 50 ksi)"},
}

// gradeYield returns Fy (MPa) and the table label of the ASTM grade named
// in name, for a round HSS when round is true; ok is false when no grade
// of the table is named. "A992", "ASTM A500 Gr. C", "A500-B", "A572 Gr 50"
// and "A36" name grades; a designation whose grade the table needs
// (A500, A572, A53) and that names none is not found.
func gradeYield(name string, round bool) (fy float64, label string, ok bool) {
	s := strings.ToUpper(name)
	for k := range grades {
		g := &grades[k]
		i := indexToken(s, g.spec)
		if i < 0 {
			continue
		}
		if g.grade != "" && !namesGrade(s[i+len(g.spec):], g.grade) {
			continue
		}
		v := g.rect
		if round {
			v = g.round
		}
		return v * KSI, g.label, true
	}
	return 0, "", false
}

// indexToken finds spec in s as a whole token (not followed by a digit,
// not preceded by a letter or digit).
func indexToken(s, spec string) int {
	from := 0
	for {
		i := strings.Index(s[from:], spec)
		if i < 0 {
			return -1
		}
		i += from
		end := i + len(spec)
		if (i == 0 || !isAlnum(s[i-1])) && (end == len(s) || !isDigit(s[end])) {
			return i
		}
		from = i + 1
	}
}

// namesGrade reports whether rest (the text after the designation) names
// grade g: "GR. C", "GRADE 50", "-B", " B", "GR50".
func namesGrade(rest, g string) bool {
	r := strings.TrimLeft(rest, " -.,/")
	for _, p := range []string{"GRADE", "GR"} {
		if strings.HasPrefix(r, p) {
			r = strings.TrimLeft(r[len(p):], " .")
			break
		}
	}
	if !strings.HasPrefix(r, g) {
		return false
	}
	end := len(g)
	return end == len(r) || !isAlnum(r[end])
}

func isDigit(c byte) bool { return c >= '0' && c <= '9' }

func isAlnum(c byte) bool { return isDigit(c) || (c >= 'A' && c <= 'Z') || (c >= 'a' && c <= 'z') }

func finitePos(x float64) bool { return x > 0 && !math.IsInf(x, 1) }
