package as4100

import (
	"math"

	"swaygate/checks"
	"swaygate/checks/section"
)

// Member capacity (scope full): compression (Section 6), tension (7.2),
// section moment capacity (5.2), lateral-torsional buckling (5.6.1) and
// combined actions (Section 8) with the amplified design moments.
//
// Member-level values (fy, kf, Ns, Nc per axis, Ze and Ms per axis, Mo) are
// computed once per member and kept in the run's MemberContext.Scratch; the
// checks of each combination use them with that combination's N* and M*.

// Constants of the capacity checks.
const (
	// Phi is the capacity factor for members in compression, tension,
	// bending and combined actions (Table 3.4).
	Phi = 0.9
	// ShearModulus is G of steel (MPa), clause 2.2.4.
	ShearModulus = 80_000.0
)

// maxChecks is the most capacity checks of one combination.
const maxChecks = 10

// Names of the capacity checks (CapacityCheck.Name).
const (
	CheckSection        = "section"           // N* ≤ φNs (6.1), or N*t ≤ φNt in tension (7.1)
	CheckCompressionMaj = "compression-major" // N* ≤ φNcx (6.1, 6.3.3)
	CheckCompressionMin = "compression-minor" // N* ≤ φNcy
	CheckSectionMajor   = "section-major"     // M*x ≤ φMrx (8.3.2)
	CheckSectionMinor   = "section-minor"     // M*y ≤ φMry (8.3.3)
	CheckSectionBiaxial = "section-biaxial"   // 8.3.4
	CheckInPlaneMajor   = "in-plane-major"    // M*x ≤ φMix (8.4.2.2)
	CheckInPlaneMinor   = "in-plane-minor"    // M*y ≤ φMiy (8.4.2.2)
	CheckOutOfPlane     = "out-of-plane"      // M*x ≤ φMox (8.4.4)
	CheckMemberBiaxial  = "member-biaxial"    // 8.4.5
)

// capClauses are the clause labels of the capacity checks.
type capClauses struct {
	fy, lambdaE, kf, ns, alphaB, curve, compression, nt, tension           string
	slenderness, zeCompact, zeNonCompact, zeSlender, ms, mo, alphaM, mb    string
	mrx, mry, sectionBiaxial, mi, mox, moxTension, memberBiaxial, biaxialT string
}

func newCapClauses(std string) capClauses {
	p := std + " "
	return capClauses{
		fy:             p + "Table 2.1",
		lambdaE:        p + "6.2.3",
		kf:             p + "6.2.2",
		ns:             p + "6.2.1",
		alphaB:         p + "Table 6.3.3",
		curve:          p + "6.3.3",
		compression:    p + "6.1",
		nt:             p + "7.2",
		tension:        p + "7.1",
		slenderness:    p + "5.2.2",
		zeCompact:      p + "5.2.3",
		zeNonCompact:   p + "5.2.4",
		zeSlender:      p + "5.2.5",
		ms:             p + "5.2.1",
		mo:             p + "5.6.1.1",
		alphaM:         p + "5.6.1.1",
		mb:             p + "5.6.1.1",
		mrx:            p + "8.3.2",
		mry:            p + "8.3.3",
		sectionBiaxial: p + "8.3.4",
		mi:             p + "8.4.2.2",
		mox:            p + "8.4.4.1",
		moxTension:     p + "8.4.4.2",
		memberBiaxial:  p + "8.4.5.1",
		biaxialT:       p + "8.4.5.2",
	}
}

// Trace notes of the capacity steps; the variant's note is appended once,
// in NewVariant.
const (
	cnNone = iota
	cnFyModel
	cnFyRequest
	cnNoFu
	cnAnAg
	cnEffective
	cnReduced
	cnRingReduced
	cnCompact
	cnNonCompact
	cnSlender
	cnNcAxis
	cnNcBracedAxis
	cnSegment
	cnClosed
	cnAlphaMFormula
	cnAlphaMOne
	cnAlphaMCapped
	cnGeneral
	cn118
	cn118Reduced
	cn119
	cnTension
	cnTensionMox
	cnZero
	cnFracture
	cnYield
	nCapNotes
)

func capNoteText() [nCapNotes]string {
	return [nCapNotes]string{
		cnFyModel:       "f_y from the model",
		cnFyRequest:     "f_y from the request's default (the model gives none)",
		cnNoFu:          "f_u unknown: the fracture limit 0.85 k_t A_n f_u is not checked",
		cnAnAg:          "A_n = A_g (no holes or penetrations assumed)",
		cnEffective:     "fully effective",
		cnReduced:       "not fully effective: b_e = b lambda_ey/lambda_e",
		cnRingReduced:   "not fully effective: d_e = d_o min(sqrt(lambda_ey/lambda_e), (3 lambda_ey/lambda_e)^2)",
		cnCompact:       "compact: lambda_s ≤ lambda_sp",
		cnNonCompact:    "non-compact: lambda_sp < lambda_s ≤ lambda_sy",
		cnSlender:       "slender: lambda_s > lambda_sy",
		cnNcAxis:        "l_e = k_e L with the axis's own k_e (the sway k_e on a sway axis)",
		cnNcBracedAxis:  "l_e = k_e L, braced axis",
		cnSegment:       "segment = the member, both ends restrained, k_t = k_l = k_r = 1: l_e = L (assumed)",
		cnClosed:        "closed hollow section: no lateral-torsional buckling, M_b = M_s",
		cnAlphaMFormula: "from the quarter-point moments of the linear first-order moment diagram",
		cnAlphaMOne:     "transverse load, non-linear diagram or unknown curvature: alpha_m = 1.0 (uniform moment, conservative)",
		cnAlphaMCapped:  "limited to 2.5",
		cnGeneral:       "general form",
		cn118:           "compact doubly symmetric I or RHS/SHS with k_f = 1",
		cn118Reduced:    "compact doubly symmetric I or RHS/SHS with k_f < 1",
		cn119:           "compact doubly symmetric I section with k_f = 1",
		cnTension:       "tension: general form with phi N_t",
		cnTensionMox:    "tension: M_b without the benefit of tension, not more than M_rx",
		cnZero:          "the axial force leaves no moment capacity",
		cnFracture:      "fracture governs: 0.85 k_t A_n f_u with k_t = 1, A_n = A_g",
		cnYield:         "yield governs: A_g f_y",
	}
}

// Reason messages of the capacity checks.
const (
	msgNoPlates      = "no plate model for this profile: the form factor and section compactness (AS 4100 6.2, 5.2) need its plate elements"
	msgColdFormedOpn = "cold-formed open section (lipped channel, zed): designed to AS/NZS 4600, not covered by these capacity checks"
	msgLTBOpen       = "lateral-torsional buckling of tees, angles and monosymmetric I sections is not implemented: the out-of-plane check (AS 4100 8.4.4) cannot be made"
	msgLTBUnknown    = "J or I_w unknown: lateral-torsional buckling (AS 4100 5.6.1) and the out-of-plane check cannot be made"
	msgNoArea        = "no cross-section area: the member capacity checks cannot be made"
	msgNoModulus     = "no elastic or plastic section modulus about this axis: the section moment capacity (AS 4100 5.2) cannot be found"
	msgNoYield       = "no yield stress: the model gives none, the request sets no default and the grade is not in the table of common AS/NZS grades"
)

// Mr forms of 8.3.2 and 8.3.3.
const (
	formGeneral uint8 = iota
	form118
	form118Reduced
	form119
)

// LTB cases.
const (
	ltbFormula  uint8 = iota // 5.6.1.1 with Mo
	ltbClosed                // closed hollow section: Mb = Ms
	ltbOpen                  // tee, angle, monosymmetric I: not implemented
	ltbUnknown               // J or Iw unknown
	ltbNoLength              // member length unknown (missing-length)
)

// axisCap holds the member-level capacity values of one axis.
type axisCap struct {
	le, r   float64
	lambdaN float64
	cv      curve
	nc      float64 // N, NaN when unknown

	lambdaS, lambdaSP, lambdaSY float64
	gov                         string // governing element part
	class, kind                 uint8
	z, s, ze, ms                float64 // mm³, N·mm; ms NaN when unknown
	form                        uint8
	lambdaW, lambdaWY           float64 // web slenderness and limit for form118Reduced
}

// memberCap holds the member-level capacity values of one member.
type memberCap struct {
	index int
	valid bool

	skip      bool   // a reason the engine already gives (no section)
	code, msg string // a blocking reason of the capacity checks (member-wide)

	fy, fu     float64
	fyNote     string
	tMax       float64
	fam        family
	welded     bool
	majorX     bool // the major axis is the shape's x-axis
	res        residual
	tf         float64
	ag, ae     float64
	kf, ns     float64
	nt         float64
	ntNote     int
	alphaB     float64
	abCat      int
	ax         [2]axisCap
	ltb        uint8
	mo, alphaS float64
	length     float64
}

// scratch is the rule set's per-run, per-member state kept in
// MemberContext.Scratch.
type scratch struct {
	cap   memberCap
	arena checks.CheckArena

	// The section-level values of the last section computed.
	secKey secKey
	secVal memberCap
	secOK  bool

	// The plate elements of the last section.
	pSec    *section.Properties
	pPlates []section.Plate
	pErr    error

	// The last grade looked up: most members of a model share one.
	gName   string
	gProd   product
	gT      float64
	gFy     float64
	gFu     float64
	gLabel  string
	gOK     bool
	gCached bool
}

func scratchOf(mc *checks.MemberContext) *scratch {
	sc, _ := mc.Scratch.(*scratch)
	if sc == nil {
		sc = &scratch{}
		sc.cap.index = -1
		mc.Scratch = sc
	}
	return sc
}

// platesOf returns the plate elements of sec (from pl, its geometry),
// remembering the last section's: building them validates the whole
// outline, which costs more than the rest of a member's capacity values.
func (s *scratch) platesOf(sec *section.Properties, pl section.Plated) ([]section.Plate, error) {
	if s.pSec != sec {
		s.pPlates, s.pErr = pl.Plates()
		s.pSec = sec
	}
	return s.pPlates, s.pErr
}

// grade looks the grade up, remembering the last answer.
func (s *scratch) grade(name string, p product, t float64) (fy, fu float64, label string, ok bool) {
	if s.gCached && s.gName == name && s.gProd == p && s.gT == t {
		return s.gFy, s.gFu, s.gLabel, s.gOK
	}
	fy, fu, label, ok = yieldOf(name, p, t)
	s.gName, s.gProd, s.gT, s.gFy, s.gFu, s.gLabel, s.gOK, s.gCached = name, p, t, fy, fu, label, ok, true
	return fy, fu, label, ok
}

// unwrap returns the shape a Transformed moves.
func unwrap(g section.Shape) section.Shape {
	for {
		switch t := g.(type) {
		case section.Transformed:
			g = t.Parent
		case *section.Transformed:
			g = t.Parent
		default:
			return g
		}
	}
}

// classify finds the family of a shape; msg is set for shapes the checks do
// not cover.
func classify(g section.Shape, profile string) (f family, welded, majorX bool, msg string) {
	majorX = true
	switch s := unwrap(g).(type) {
	case section.ISection, *section.ISection:
		return famI, isWeldedName(profile), true, ""
	case section.AsymmetricI, *section.AsymmetricI:
		return famMonoI, true, true, ""
	case section.Channel, *section.Channel:
		return famChannel, false, true, ""
	case section.Tee, *section.Tee:
		return famTee, false, true, ""
	case section.Angle, *section.Angle:
		return famAngle, false, true, ""
	case section.RHS:
		return famRHS, false, s.D >= s.B, ""
	case *section.RHS:
		return famRHS, false, s.D >= s.B, ""
	case section.CHS, *section.CHS:
		return famCHS, false, true, ""
	case section.LippedChannel, *section.LippedChannel, section.Zed, *section.Zed:
		return famNone, false, true, msgColdFormedOpn
	}
	return famNone, false, true, msgNoPlates
}

// isWeldedName reports whether a profile designation names a welded beam or
// column (WB, WC).
func isWeldedName(profile string) bool {
	for i := 1; i+1 < len(profile); i++ {
		c, d := profile[i]|0x20, profile[i+1]|0x20
		if c == 'w' && (d == 'b' || d == 'c') && isDigit(profile[i-1]) {
			return true
		}
	}
	return false
}

// stressOf is how a plate element of a family is stressed by bending about
// the shape's x-axis (aboutX) or y-axis. [L] steel-as i/c/t/rhs
// _section_components and the C# getElementSlenderness.
func stressOf(f family, part string, aboutX bool) stress {
	switch f {
	case famI, famMonoI:
		switch {
		case part == "flange" && aboutX:
			return stressUniform
		case part == "flange":
			return stressTip
		case aboutX:
			return stressBending
		}
		return stressNone
	case famChannel:
		switch {
		case part == "flange" && aboutX:
			return stressUniform
		case part == "flange":
			return stressTip
		case aboutX:
			return stressBending
		}
		return stressUniform // the web, when the flange tips are in tension
	case famTee:
		switch {
		case part == "flange" && aboutX:
			return stressUniform
		case part == "flange":
			return stressTip
		case aboutX:
			return stressTip // the stem, its tip in compression
		}
		return stressNone
	case famRHS:
		if (part == "flange") == aboutX {
			return stressUniform
		}
		return stressBending
	}
	return stressUniform // angles (conservative), circular hollow sections
}

// secKey identifies the inputs of the section-level capacity values: the
// section (by pointer: members that share a Properties value share the
// result) and what decides fy and fu.
type secKey struct {
	sec         *section.Properties
	fy, fu, req float64
	grade, name string
}

// memberCapacity computes the member-level capacity values of mc's member
// into m, tracing each step when tr is on. The section-level part is taken
// from the last member's when the section and material are the same and
// no trace is built.
func (r *Rules) memberCapacity(mc *checks.MemberContext, m *memberCap, sc *scratch, tr *checks.Tracer) {
	mem := mc.Member
	key := secKey{sec: mem.Section, fy: mem.Material.Fy, fu: mem.Material.Fu, req: mc.Options.Yield,
		grade: mem.Material.Grade, name: mem.Material.Name}
	if !tr.On() && sc.secOK && sc.secKey == key {
		*m = sc.secVal
	} else {
		r.sectionCapacity(mc, m, sc, tr)
		sc.secKey, sc.secVal, sc.secOK = key, *m, true
	}
	m.index, m.valid = mc.Index, true
	if m.skip || m.code != "" {
		return
	}
	r.memberLevel(mc, m, tr)
}

// sectionCapacity computes the section-level values: fy, fu, the form
// factor and Ns (6.2), Nt (7.2), Ze and Ms per axis (5.2).
func (r *Rules) sectionCapacity(mc *checks.MemberContext, m *memberCap, sc *scratch, tr *checks.Tracer) {
	*m = memberCap{}
	mem := mc.Member
	sec := mem.Section
	switch {
	case sec == nil:
		m.skip = true // missing-section is the engine's reason
		return
	case !(sec.A > 0) || math.IsInf(sec.A, 0):
		m.code, m.msg = checks.CodeMissingSection, msgNoArea
		return
	}
	fam, welded, majorX, msg := classify(sec.Geometry, sec.Profile)
	if msg != "" {
		m.code, m.msg = checks.CodeUnsupportedProfile, msg
		return
	}
	pl, _ := unwrap(sec.Geometry).(section.Plated)
	if pl == nil {
		m.code, m.msg = checks.CodeUnsupportedProfile, msgNoPlates
		return
	}
	if g, ok := sec.Geometry.(section.Plated); ok {
		pl = g // a Transformed scales its parent's plates
	}
	plates, err := sc.platesOf(sec, pl)
	if err != nil {
		m.code, m.msg = checks.CodeUnsupportedProfile, "plate elements: "+err.Error()
		return
	}
	m.fam, m.welded, m.majorX = fam, welded, majorX
	m.res = resHR
	switch {
	case fam == famRHS || fam == famCHS:
		m.res = resCF
	case welded:
		m.res = resHW
	}
	for k := range plates {
		m.tMax = math.Max(m.tMax, plates[k].Thickness)
		if plates[k].Part == "flange" {
			m.tf = math.Max(m.tf, plates[k].Thickness)
		}
	}

	// Yield and tensile strength.
	on := tr.On()
	c := &r.cc
	prod := productRolled
	switch {
	case fam == famRHS || fam == famCHS:
		prod = productHollow
	case welded:
		prod = productWelded
	}
	mat := &mem.Material
	gfy, gfu, glabel, gok := 0.0, 0.0, "", false
	if mat.Grade != "" {
		gfy, gfu, glabel, gok = sc.grade(mat.Grade, prod, m.tMax)
	}
	if !gok && mat.Name != "" {
		gfy, gfu, glabel, gok = sc.grade(mat.Name, prod, m.tMax)
	}
	switch {
	case mat.Fy > 0 && !math.IsInf(mat.Fy, 0):
		m.fy, m.fyNote = mat.Fy, r.cnotes[cnFyModel]
	case mc.Options.Yield > 0 && !math.IsInf(mc.Options.Yield, 0):
		m.fy, m.fyNote = mc.Options.Yield, r.cnotes[cnFyRequest]
	case gok:
		m.fy, m.fyNote = gfy, r.gradeNote(glabel)
	default:
		m.code, m.msg = checks.CodeMissingMaterial, msgNoYield
		return
	}
	m.fu = math.NaN()
	switch {
	case mat.Fu > 0 && !math.IsInf(mat.Fu, 0):
		m.fu = mat.Fu
	case gok:
		m.fu = gfu
	}
	fy := m.fy
	if on {
		tr.Step("f_y", c.fy, "yield stress used in design", fy, "MPa").
			Add("t_max", m.tMax, "mm").Noted(m.fyNote)
	}

	// Form factor and section capacity in compression (6.2).
	m.ag = sec.A
	lost := 0.0
	for k := range plates {
		p := &plates[k]
		le := elementSlenderness(p, fy)
		ley := compressionLimit(p.Support, m.res)
		be := effectiveWidth(p, le, ley)
		if be < p.Width {
			lost += lostArea(p, be)
		}
		if on {
			note := cnEffective
			switch {
			case be < p.Width && p.Support == section.Ring:
				note = cnRingReduced
			case be < p.Width:
				note = cnReduced
			}
			formula := "(b/t) sqrt(f_y/250)"
			if p.Support == section.Ring {
				formula = "(d_o/t) (f_y/250)"
			}
			tr.Step(partLabel(p.Part), c.lambdaE, formula, le, "").
				Add("b", p.Width, "mm").Add("t", p.Thickness, "mm").Add("lambda_ey", ley, "").
				Add("b_e", be, "mm").Add("n", float64(p.Count), "").Noted(r.cnotes[note])
		}
	}
	m.ae = math.Max(0, m.ag-lost)
	m.kf = m.ae / m.ag
	m.ns = m.kf * m.ag * fy
	if on {
		tr.Step("k_f", c.kf, "A_e / A_g", m.kf, "").Add("A_e", m.ae, "mm²").Add("A_g", m.ag, "mm²").Noted(r.cnotes[cnNone])
		tr.Step("N_s", c.ns, "k_f A_n f_y", checks.KN(m.ns), "kN").
			Add("k_f", m.kf, "").Add("A_n", m.ag, "mm²").Add("f_y", fy, "MPa").Noted(r.cnotes[cnAnAg])
	}
	m.alphaB, m.abCat = memberSectionConstant(fam, welded, m.tf, m.kf)
	if on {
		tr.Step("alpha_b", c.alphaB, "member section constant", m.alphaB, "").
			Add("k_f", m.kf, "").Add("t_f", m.tf, "mm").Noted(r.abNotes[m.abCat])
	}

	// Section moment capacity per axis (5.2).
	for a := range m.ax {
		r.axisBending(m, a, plates, sec, tr)
	}

	// Tension (7.2).
	m.nt = m.ag * fy
	m.ntNote = cnYield
	switch {
	case math.IsNaN(m.fu):
		m.ntNote = cnNoFu
	case 0.85*m.ag*m.fu < m.nt:
		m.nt = 0.85 * m.ag * m.fu
		m.ntNote = cnFracture
	}
	if tr.On() {
		tr.Step("N_t", c.nt, "min(A_g f_y, 0.85 k_t A_n f_u)", checks.KN(m.nt), "kN").
			Add("A_g", m.ag, "mm²").Add("f_y", fy, "MPa").Add("f_u", m.fu, "MPa").Noted(r.cnotes[m.ntNote])
	}

}

// memberLevel computes the values that depend on the member's restraint
// and length: Nc per axis (6.3.3) and the LTB reference moment (5.6.1.1).
func (r *Rules) memberLevel(mc *checks.MemberContext, m *memberCap, tr *checks.Tracer) {
	on := tr.On()
	c := &r.cc
	sec := mc.Member.Section
	fy := m.fy
	// Member capacity in compression per axis (6.3.3).
	for a := range m.ax {
		ax := &m.ax[a]
		s := &mc.Axes[a]
		rg := sec.RMajor
		if a == int(checks.Minor) {
			rg = sec.RMinor
		}
		if !(rg > 0) && s.I > 0 {
			rg = math.Sqrt(s.I / m.ag)
		}
		ax.r = rg
		ax.le = s.Ke * s.Length
		ax.nc = math.NaN()
		if ax.le > 0 && rg > 0 && !math.IsInf(ax.le, 0) {
			ax.lambdaN = ax.le / rg * math.Sqrt(m.kf) * math.Sqrt(fy/250)
			ax.cv = columnCurve(ax.lambdaN, m.alphaB)
			ax.nc = math.Min(ax.cv.alphaC*m.ns, m.ns)
			if on {
				q := &r.cq[a]
				note := cnNcAxis
				if s.Restraint == checks.Braced {
					note = cnNcBracedAxis
				}
				tr.Step(q.lambdaN, c.curve, "(k_e L / r) sqrt(k_f) sqrt(f_y/250)", ax.lambdaN, "").
					Add("k_e", s.Ke, "").Add("L", s.Length, "mm").Add("r", rg, "mm").
					Add("k_f", m.kf, "").Add("f_y", fy, "MPa").Noted(r.cnotes[note])
				tr.Step(q.alphaC, c.curve, "xi (1 - sqrt(1 - (90/(xi lambda))^2)) ≤ 1", ax.cv.alphaC, "").
					Add("lambda_n", ax.lambdaN, "").Add("alpha_a", ax.cv.alphaA, "").Add("alpha_b", m.alphaB, "").
					Add("lambda", ax.cv.lambda, "").Add("eta", ax.cv.eta, "").Add("xi", ax.cv.xi, "").Noted(r.cnotes[cnNone])
				tr.Step(q.nc, c.curve, "alpha_c N_s ≤ N_s", checks.KN(ax.nc), "kN").
					Add("alpha_c", ax.cv.alphaC, "").Add("N_s", checks.KN(m.ns), "kN").Noted(r.cnotes[cnNone])
			}
		}
	}

	// Lateral-torsional buckling reference moment (5.6.1.1).
	m.length = mc.Axes[checks.Major].MemberLength
	switch m.fam {
	case famRHS, famCHS:
		m.ltb = ltbClosed
		if on && !math.IsNaN(m.ax[checks.Major].ms) {
			tr.Step("M_bx", c.mb, "M_sx", checks.KNm(m.ax[checks.Major].ms), "kNm").Noted(r.cnotes[cnClosed])
		}
		return
	case famTee, famAngle, famMonoI:
		m.ltb = ltbOpen
		return
	}
	iy, j, iw, e := sec.IMinor, sec.J, sec.Iw, mc.E
	switch {
	case !(m.length > 0) || math.IsInf(m.length, 0):
		m.ltb = ltbNoLength
		return
	case !(iy > 0) || !(j > 0) || !(iw >= 0) || math.IsInf(j+iw, 0):
		m.ltb = ltbUnknown
		return
	}
	l := m.length
	pe := math.Pi * math.Pi * e * iy / (l * l)
	m.mo = math.Sqrt(pe * (ShearModulus*j + math.Pi*math.Pi*e*iw/(l*l)))
	ms := m.ax[checks.Major].ms
	if ms > 0 {
		x := ms / m.mo
		m.alphaS = 0.6 * (math.Sqrt(x*x+3) - x)
	}
	if on {
		tr.Step("M_o", c.mo, "sqrt((pi^2 E I_y / l_e^2)(G J + pi^2 E I_w / l_e^2))", checks.KNm(m.mo), "kNm").
			Add("E", e, "MPa").Add("I_y", iy, "mm⁴").Add("G", ShearModulus, "MPa").Add("J", j, "mm⁴").
			Add("I_w", iw, "mm⁶").Add("l_e", l, "mm").Noted(r.cnotes[cnSegment])
		if ms > 0 {
			tr.Step("alpha_s", c.mo, "0.6 (sqrt((M_sx/M_o)^2 + 3) - M_sx/M_o)", m.alphaS, "").
				Add("M_sx", checks.KNm(ms), "kNm").Add("M_o", checks.KNm(m.mo), "kNm").Noted(r.cnotes[cnNone])
		}
	}
}

// axisBending computes the section slenderness, Ze and Ms of axis a (5.2).
func (r *Rules) axisBending(m *memberCap, a int, plates []section.Plate, sec *section.Properties, tr *checks.Tracer) {
	ax := &m.ax[a]
	ax.ms = math.NaN()
	aboutX := m.majorX == (a == int(checks.Major))
	worst := -1.0
	var gov *section.Plate // the governing element
	var depth float64      // RHS: outside dimension across the bending axis
	for k := range plates {
		p := &plates[k]
		st := stressOf(m.fam, p.Part, aboutX)
		if st == stressNone {
			continue
		}
		if st == stressBending {
			depth = p.Width + 2*p.Thickness
		}
		le := elementSlenderness(p, m.fy)
		ep, ey := bendingLimits(p.Support, st, m.res)
		if q := le / ey; q > worst {
			worst, gov = q, p
			ax.lambdaS, ax.lambdaSP, ax.lambdaSY, ax.gov = le, ep, ey, p.Part
			switch {
			case p.Support == section.Ring:
				ax.kind = slenderRing
			case st == stressTip:
				ax.kind = slenderTip
			case m.fam == famRHS && st == stressUniform:
				ax.kind = slenderBox
			default:
				ax.kind = slenderFlat
			}
		}
		if st == stressBending && a == int(checks.Major) {
			ax.lambdaW, ax.lambdaWY = le, compressionLimit(p.Support, m.res)
		}
	}
	z, s := sec.ZMajor, sec.SMajor
	if a == int(checks.Minor) {
		z, s = sec.ZMinor, sec.SMinor
	}
	ax.z, ax.s = z, s
	if worst < 0 || !(z > 0) || !(s > 0) {
		return
	}
	switch {
	case ax.lambdaS <= ax.lambdaSP:
		ax.class = compact
	case ax.lambdaS <= ax.lambdaSY:
		ax.class = nonCompact
	default:
		ax.class = slender
	}
	ax.ze = effectiveModulus(ax.class, ax.kind, z, s, ax.lambdaS, ax.lambdaSP, ax.lambdaSY)
	if ax.class == slender && ax.kind == slenderBox {
		i := sec.IMajor
		if a == int(checks.Minor) {
			i = sec.IMinor
		}
		if ze := rhsEffectiveZ(i, sec.A, depth, gov.Width, gov.Thickness, ax.lambdaS, ax.lambdaSY); ze > 0 && depth > 0 {
			ax.ze = ze
		} else {
			ax.kind = slenderFlat
		}
	}
	ax.ms = m.fy * ax.ze

	full := m.kf >= 1-1e-9
	if ax.class == compact {
		switch {
		case a == int(checks.Major) && (m.fam == famI || m.fam == famRHS) && full:
			ax.form = form118
		case a == int(checks.Major) && (m.fam == famI || m.fam == famRHS) && ax.lambdaW > 0:
			ax.form = form118Reduced
		case a == int(checks.Minor) && m.fam == famI && full:
			ax.form = form119
		case a == int(checks.Minor) && m.fam == famRHS:
			ax.form = form118
		}
	}
	if !tr.On() {
		return
	}
	c := &r.cc
	q := &r.cq[a]
	note, clause, formula := cnCompact, c.zeCompact, "min(S, 1.5 Z)"
	switch ax.class {
	case nonCompact:
		note, clause, formula = cnNonCompact, c.zeNonCompact, "Z + (lambda_sy - lambda_s)/(lambda_sy - lambda_sp) (min(S, 1.5 Z) - Z)"
	case slender:
		note, clause = cnSlender, c.zeSlender
		switch ax.kind {
		case slenderTip:
			formula = "Z (lambda_sy/lambda_s)^2"
		case slenderRing:
			formula = "Z min(sqrt(lambda_sy/lambda_s), (2 lambda_sy/lambda_s)^2)"
		case slenderBox:
			formula = "Z of the effective section: compression wall b_e = b lambda_sy/lambda_s"
		default:
			formula = "Z lambda_sy/lambda_s"
		}
	}
	tr.Step(q.lambdaS, c.slenderness, "lambda_e of the element with the largest lambda_e/lambda_ey", ax.lambdaS, "").
		Add("lambda_sp", ax.lambdaSP, "").Add("lambda_sy", ax.lambdaSY, "").Noted(r.partNote(ax.gov))
	tr.Step(q.ze, clause, formula, ax.ze, "mm³").Add("Z", z, "mm³").Add("S", s, "mm³").Noted(r.cnotes[note])
	tr.Step(q.ms, c.ms, "f_y Z_e", checks.KNm(ax.ms), "kNm").Add("f_y", m.fy, "MPa").Add("Z_e", ax.ze, "mm³").Noted(r.cnotes[cnNone])
}

// partLabel is the trace quantity of an element's slenderness.
func partLabel(part string) string {
	switch part {
	case "flange":
		return "lambda_e,flange"
	case "web":
		return "lambda_e,web"
	case "wall":
		return "lambda_e,wall"
	case "leg":
		return "lambda_e,leg"
	case "lip":
		return "lambda_e,lip"
	}
	return "lambda_e"
}

// capQuantities are the per-axis trace labels of the capacity steps.
type capQuantities struct {
	lambdaN, alphaC, nc, lambdaS, ze, ms string
}

func newCapQuantities(a checks.Axis) capQuantities {
	s := "x"
	if a == checks.Minor {
		s = "y"
	}
	return capQuantities{
		lambdaN: "lambda_n," + a.String(),
		alphaC:  "alpha_c," + a.String(),
		nc:      "N_c" + s,
		lambdaS: "lambda_s," + a.String(),
		ze:      "Z_e" + s,
		ms:      "M_s" + s,
	}
}

// gradeNote returns the trace note of a grade label (with the variant's note).
func (r *Rules) gradeNote(label string) string {
	for k := range grades {
		if grades[k].label == label {
			return r.gNotes[k]
		}
	}
	return label
}

// partNote returns the trace note naming the governing element.
func (r *Rules) partNote(part string) string {
	switch part {
	case "flange":
		return r.pNotes[0]
	case "web":
		return r.pNotes[1]
	case "wall":
		return r.pNotes[2]
	case "leg":
		return r.pNotes[3]
	}
	return r.pNotes[4]
}

// initCapacity builds the capacity labels and notes of a variant.
func (r *Rules) initCapacity() {
	r.cc = newCapClauses(r.v.Clauses.Standard)
	for a := range checks.Axes {
		r.cq[a] = newCapQuantities(checks.Axis(a))
	}
	with := func(n string) string {
		switch {
		case n == "":
			return r.v.Note
		case r.v.Note == "":
			return n
		}
		return n + "; " + r.v.Note
	}
	for k, n := range capNoteText() {
		r.cnotes[k] = with(n)
	}
	for k, n := range alphaBText() {
		r.abNotes[k] = with(n)
	}
	r.gNotes = make([]string, len(grades))
	for k := range grades {
		r.gNotes[k] = with("f_y of " + grades[k].label + " for the thickest element")
	}
	for k, p := range []string{"flange", "web", "wall", "leg", "element"} {
		r.pNotes[k] = with("governed by the " + p)
	}
}

// designMoment returns |M*| of an axis result: the amplified moment, or 0
// when the axis has no moment; ok is false when the moment is not known.
func designMoment(a *checks.AxisResult) (float64, bool) {
	if a.MAmp.Known() {
		return math.Abs(a.MAmp.F()), true
	}
	if a.MStar.Known() && math.Abs(a.MStar.F()) <= checks.MomentTolerance {
		return 0, true
	}
	return math.NaN(), false
}

// alphaM returns the moment modification factor αm of 5.6.1.1 for the
// major-axis moments of a combination: 1.7 M*m / √(M2² + M3² + M4²) ≤ 2.5
// from the quarter-point moments of the linear moment diagram between the
// end moments; 1.0 where the diagram is not linear (a transverse load, a
// peak above the end moments), the curvature is unknown or there is no
// moment. [L] skane88/utilityscripts as4100.py s5_6_1_1_alpha_m, the C#
// getMemberCapacity (≤ 2.5)
func alphaM(s *checks.AxisSetup, mo *checks.AxisMoments, ambiguous bool) (float64, int) {
	if ambiguous || s.Transverse || mo.Transverse || mo.InteriorUnknown {
		return 1, cnAlphaMOne
	}
	a, b := mo.Start, mo.End
	mm := math.Max(math.Abs(a), math.Abs(b))
	if !(mm > checks.MomentTolerance) || math.Abs(mo.Peak) > mm*(1+1e-6)+checks.MomentTolerance {
		return 1, cnAlphaMOne
	}
	m2, m3, m4 := 0.75*a+0.25*b, 0.5*(a+b), 0.25*a+0.75*b
	am := 1.7 * mm / math.Sqrt(m2*m2+m3*m3+m4*m4)
	if am > 2.5 {
		return 2.5, cnAlphaMCapped
	}
	return am, cnAlphaMFormula
}

// ratio is demand/capacity: 0 for no demand, +Inf for a demand on no
// capacity.
func ratio(d, c float64) float64 {
	switch {
	case c > 0:
		return d / c
	case d <= 0:
		return 0
	}
	return math.Inf(1)
}

// reduce is x·(1 − n/φN) floored at 0.
func reduce(x, n, phiN float64) float64 { return math.Max(0, x*(1-n/phiN)) }

// combo evaluates the checks of one combination.
type combo struct {
	r   *Rules
	cx  *checks.CombinationContext
	tr  *checks.Tracer
	buf []checks.CapacityCheck // room for maxChecks, in the arena
	n   int
}

// add records one check, its utilisation and, above 1, the
// capacity-exceeded reason.
func (k *combo) add(name, clause string, demand, capacity float64, unit, axis string) {
	u := ratio(demand, capacity)
	// Field by field: a composite literal is built and copied with a bulk
	// write barrier over the whole struct, which measured about twice as
	// slow on the arena's fresh memory.
	c := &k.buf[k.n]
	c.Name, c.Clause, c.Unit = name, clause, unit
	c.Demand, c.Capacity, c.Utilisation = checks.Num(demand), checks.Num(capacity), checks.Num(u)
	k.n++
	if u > 1 {
		msg := "the axial force leaves no moment capacity (" + clause + ")"
		if !math.IsInf(u, 1) {
			msg = numMsg("utilisation ", u, " > 1 ("+clause+")")
		}
		k.cx.Reason(checks.CodeCapacityExceeded, name+": "+msg, axis)
	}
	if k.tr.On() {
		k.tr.Step(utilLabel(name), clause, "demand / capacity", u, "").
			Add("demand", reportValue(demand, unit), reportUnit(unit)).
			Add("capacity", reportValue(capacity, unit), reportUnit(unit)).Noted(k.r.cnotes[cnNone])
	}
}

// utilLabel is the trace quantity of a check's utilisation.
func utilLabel(name string) string {
	switch name {
	case CheckSection:
		return "u,section"
	case CheckCompressionMaj:
		return "u,compression-major"
	case CheckCompressionMin:
		return "u,compression-minor"
	case CheckSectionMajor:
		return "u,section-major"
	case CheckSectionMinor:
		return "u,section-minor"
	case CheckSectionBiaxial:
		return "u,section-biaxial"
	case CheckInPlaneMajor:
		return "u,in-plane-major"
	case CheckInPlaneMinor:
		return "u,in-plane-minor"
	case CheckOutOfPlane:
		return "u,out-of-plane"
	case CheckMemberBiaxial:
		return "u,member-biaxial"
	}
	return "u"
}

func reportValue(x float64, unit string) float64 {
	switch unit {
	case "N":
		return checks.KN(x)
	case "N·mm":
		return checks.KNm(x)
	}
	return x
}

func reportUnit(unit string) string {
	switch unit {
	case "N":
		return "kN"
	case "N·mm":
		return "kNm"
	}
	return unit
}

// Capacity implements checks.RuleSet: the member capacity checks of one
// combination (scope full) with the amplified moments M* of both axes
// (AxisResult.MAmp).
//
// In compression (N* ≥ 0) the checks are, by name: section (N* ≤ φNs),
// compression-major and compression-minor (N* ≤ φNc with the axis's ke),
// section-major and section-minor (M* ≤ φMr, 8.3.2/8.3.3),
// section-biaxial (8.3.4, general form), in-plane-major and in-plane-minor
// (M* ≤ φMi, 8.4.2.2 general form), out-of-plane (M*x ≤ φMox, 8.4.4.1,
// with Mb from 5.6.1.1) and member-biaxial (8.4.5.1). In tension: section
// (N*t ≤ φNt), section-major, section-minor, section-biaxial, out-of-plane
// and member-biaxial (8.4.5.2), without the benefit of tension. Demand
// and capacity are in N or N·mm (the capacity includes φ); the
// interactions have demand = the interaction value and capacity 1.
//
// A utilisation above 1 adds capacity-exceeded naming the check (+Inf
// when the axial force leaves no moment capacity). A check that cannot be
// made adds needs-analysis: missing-material (no fy), unsupported-profile
// (no plate model, a cold-formed open section, lateral-torsional buckling
// of a tee, angle or monosymmetric I under a major-axis moment),
// missing-section (no area, no section modulus under a moment, no J or Iw
// for lateral-torsional buckling). Values that are unknown for a reason
// the engine already gives (restraint, length, second moment, an
// unstable axis) skip their checks without a second reason.
func (r *Rules) Capacity(cx *checks.CombinationContext, out *checks.CombinationResult, tr *checks.Tracer) {
	mc := cx.Member
	sc := scratchOf(mc)
	m := &sc.cap
	if !m.valid || m.index != mc.Index {
		r.memberCapacity(mc, m, sc, nil)
	}
	switch {
	case m.skip:
		return
	case m.code != "":
		cx.Reason(m.code, m.msg, "")
		return
	}
	k := &combo{r: r, cx: cx, tr: tr, buf: sc.arena.Reserve(maxChecks)}
	n := cx.Actions.NStar
	mx, okx := designMoment(&out.Axes[checks.Major])
	my, oky := designMoment(&out.Axes[checks.Minor])
	// A moment with no section modulus: the moment checks cannot be made.
	// (Every other capacity that can be unknown has the engine's reason:
	// missing restraint, length or second moment, or an unstable axis.)
	if okx && mx > checks.MomentTolerance && math.IsNaN(m.ax[checks.Major].ms) {
		cx.Reason(checks.CodeMissingSection, msgNoModulus, "major")
	}
	if oky && my > checks.MomentTolerance && math.IsNaN(m.ax[checks.Minor].ms) {
		cx.Reason(checks.CodeMissingSection, msgNoModulus, "minor")
	}
	if n >= 0 {
		r.compressionChecks(k, m, n, mx, my, okx, oky)
	} else {
		r.tensionChecks(k, m, -n, mx, my, okx, oky)
	}
	out.Capacity = sc.arena.Commit(k.n)
}

// mb returns the member moment capacity Mbx of the combination (5.6.1.1)
// and whether it is known; it records the reason when lateral-torsional
// buckling cannot be checked and a major-axis moment acts.
func (r *Rules) mb(k *combo, m *memberCap, mx float64) (float64, bool) {
	msx := m.ax[checks.Major].ms
	if math.IsNaN(msx) {
		return math.NaN(), false
	}
	c := &r.cc
	switch m.ltb {
	case ltbClosed:
		return msx, true
	case ltbOpen, ltbUnknown:
		if mx > checks.MomentTolerance {
			msg := msgLTBOpen
			if m.ltb == ltbUnknown {
				msg = msgLTBUnknown
			}
			code := checks.CodeUnsupportedProfile
			if m.ltb == ltbUnknown {
				code = checks.CodeMissingSection
			}
			k.cx.Reason(code, msg, "major")
		}
		return math.NaN(), false
	case ltbNoLength:
		return math.NaN(), false
	}
	ax := k.cx.Axes[checks.Major]
	am, note := alphaM(ax.Setup, ax.Moments, ax.SignAmbiguous)
	raw := am * m.alphaS * msx
	v := math.Min(raw, msx)
	if k.tr.On() {
		st := k.tr.Step("alpha_m", c.alphaM, "1.7 M*_m / sqrt(M_2^2 + M_3^2 + M_4^2) ≤ 2.5", am, "")
		if note != cnAlphaMOne {
			st.Add("M_start", checks.KNm(ax.Moments.Start), "kNm").Add("M_end", checks.KNm(ax.Moments.End), "kNm")
		}
		st.Noted(r.cnotes[note])
		k.tr.Step("M_bx", c.mb, "alpha_m alpha_s M_sx ≤ M_sx", checks.KNm(v), "kNm").
			Add("alpha_m", am, "").Add("alpha_s", m.alphaS, "").Add("M_sx", checks.KNm(msx), "kNm").Noted(r.cnotes[cnNone])
	}
	return v, true
}

// traceCap records a capacity value.
func (k *combo) traceCap(quantity, clause, formula string, v float64, unit string, note int) *checks.Step {
	if !k.tr.On() {
		return nil
	}
	return k.tr.Step(quantity, clause, formula, reportValue(v, unit), reportUnit(unit)).Noted(k.r.cnotes[note])
}

// compressionChecks are the checks of a member in compression (N* ≥ 0).
func (r *Rules) compressionChecks(k *combo, m *memberCap, n, mx, my float64, okx, oky bool) {
	c := &r.cc
	on := k.tr.On()
	ax, ay := &m.ax[checks.Major], &m.ax[checks.Minor]
	phiNs := Phi * m.ns
	k.add(CheckSection, c.compression, n, phiNs, "N", "")
	if !math.IsNaN(ax.nc) {
		k.add(CheckCompressionMaj, c.compression, n, Phi*ax.nc, "N", "major")
	}
	if !math.IsNaN(ay.nc) {
		k.add(CheckCompressionMin, c.compression, n, Phi*ay.nc, "N", "minor")
	}

	// Section capacity (8.3).
	msx, msy := ax.ms, ay.ms
	mrx, mry := math.NaN(), math.NaN()
	if okx && !math.IsNaN(msx) {
		f := 1 - n/phiNs
		note := cnGeneral
		switch ax.form {
		case form118:
			mrx, note = math.Min(1.18*msx*f, msx), cn118
		case form118Reduced:
			mrx, note = math.Min(msx*f*(1+0.18*(82-ax.lambdaW)/(82-ax.lambdaWY)), msx), cn118Reduced
		default:
			mrx = msx * f
		}
		mrx = math.Max(0, mrx)
		if st := k.traceCap("M_rx", c.mrx, mrFormula(ax.form, true), mrx, "N·mm", note); st != nil {
			st.Add("M_sx", checks.KNm(msx), "kNm").Add("N*", checks.KN(n), "kN").Add("phi N_s", checks.KN(phiNs), "kN")
			if ax.form == form118Reduced {
				st.Add("lambda_w", ax.lambdaW, "").Add("lambda_wy", ax.lambdaWY, "")
			}
		}
		k.add(CheckSectionMajor, c.mrx, mx, Phi*mrx, "N·mm", "major")
	}
	if oky && !math.IsNaN(msy) {
		f := n / phiNs
		note := cnGeneral
		switch ay.form {
		case form119:
			mry, note = math.Min(1.19*msy*(1-f*f), msy), cn119
		case form118:
			mry, note = math.Min(1.18*msy*(1-f), msy), cn118
		default:
			mry = msy * (1 - f)
		}
		mry = math.Max(0, mry)
		if st := k.traceCap("M_ry", c.mry, mrFormula(ay.form, false), mry, "N·mm", note); st != nil {
			st.Add("M_sy", checks.KNm(msy), "kNm").Add("N*", checks.KN(n), "kN").Add("phi N_s", checks.KN(phiNs), "kN")
		}
		k.add(CheckSectionMinor, c.mry, my, Phi*mry, "N·mm", "minor")
	}
	if okx && oky && !math.IsNaN(msx) && !math.IsNaN(msy) {
		v := n/phiNs + ratio(mx, Phi*msx) + ratio(my, Phi*msy)
		if on {
			k.tr.Step("section interaction", c.sectionBiaxial, "N*/(phi N_s) + M*_x/(phi M_sx) + M*_y/(phi M_sy)", v, "").
				Add("N*", checks.KN(n), "kN").Add("M*_x", checks.KNm(mx), "kNm").Add("M*_y", checks.KNm(my), "kNm").
				Add("phi N_s", checks.KN(phiNs), "kN").Add("phi M_sx", checks.KNm(Phi*msx), "kNm").
				Add("phi M_sy", checks.KNm(Phi*msy), "kNm").Noted(r.cnotes[cnGeneral])
		}
		k.add(CheckSectionBiaxial, c.sectionBiaxial, v, 1, "", "")
	}

	// In-plane member capacity (8.4.2.2, general form).
	mix, miy := math.NaN(), math.NaN()
	if okx && !math.IsNaN(msx) && !math.IsNaN(ax.nc) {
		mix = reduce(msx, n, Phi*ax.nc)
		if st := k.traceCap("M_ix", c.mi, "M_sx (1 - N*/(phi N_cx))", mix, "N·mm", cnGeneral); st != nil {
			st.Add("M_sx", checks.KNm(msx), "kNm").Add("N*", checks.KN(n), "kN").Add("phi N_cx", checks.KN(Phi*ax.nc), "kN")
		}
		k.add(CheckInPlaneMajor, c.mi, mx, Phi*mix, "N·mm", "major")
	}
	if oky && !math.IsNaN(msy) && !math.IsNaN(ay.nc) {
		miy = reduce(msy, n, Phi*ay.nc)
		if st := k.traceCap("M_iy", c.mi, "M_sy (1 - N*/(phi N_cy))", miy, "N·mm", cnGeneral); st != nil {
			st.Add("M_sy", checks.KNm(msy), "kNm").Add("N*", checks.KN(n), "kN").Add("phi N_cy", checks.KN(Phi*ay.nc), "kN")
		}
		k.add(CheckInPlaneMinor, c.mi, my, Phi*miy, "N·mm", "minor")
	}

	// Out-of-plane member capacity (8.4.4.1, general form).
	mox := math.NaN()
	if okx && !math.IsNaN(ay.nc) {
		if mbx, ok := r.mb(k, m, mx); ok {
			mox = reduce(mbx, n, Phi*ay.nc)
			if st := k.traceCap("M_ox", c.mox, "M_bx (1 - N*/(phi N_cy))", mox, "N·mm", cnGeneral); st != nil {
				st.Add("M_bx", checks.KNm(mbx), "kNm").Add("N*", checks.KN(n), "kN").Add("phi N_cy", checks.KN(Phi*ay.nc), "kN")
			}
			k.add(CheckOutOfPlane, c.mox, mx, Phi*mox, "N·mm", "major")
		}
	}

	// Biaxial member capacity (8.4.5.1).
	if okx && oky && !math.IsNaN(mix) && !math.IsNaN(miy) && (!math.IsNaN(mox) || mx <= checks.MomentTolerance) {
		mcx := mix
		if !math.IsNaN(mox) {
			mcx = math.Min(mix, mox)
		}
		v := math.Pow(ratio(mx, Phi*mcx), 1.4) + math.Pow(ratio(my, Phi*miy), 1.4)
		if on {
			k.tr.Step("member interaction", c.memberBiaxial, "(M*_x/(phi M_cx))^1.4 + (M*_y/(phi M_iy))^1.4", v, "").
				Add("M*_x", checks.KNm(mx), "kNm").Add("phi M_cx", checks.KNm(Phi*mcx), "kNm").
				Add("M*_y", checks.KNm(my), "kNm").Add("phi M_iy", checks.KNm(Phi*miy), "kNm").Noted(r.cnotes[cnNone])
		}
		k.add(CheckMemberBiaxial, c.memberBiaxial, v, 1, "", "")
	}
}

// tensionChecks are the checks of a member in tension (nt = N*t > 0):
// the section capacity in tension, the section moment capacities reduced
// by the tension (general forms), and the out-of-plane and biaxial member
// checks without the benefit of tension.
func (r *Rules) tensionChecks(k *combo, m *memberCap, nt, mx, my float64, okx, oky bool) {
	c := &r.cc
	on := k.tr.On()
	ax, ay := &m.ax[checks.Major], &m.ax[checks.Minor]
	phiNt := Phi * m.nt
	k.add(CheckSection, c.tension, nt, phiNt, "N", "")
	msx, msy := ax.ms, ay.ms
	mrx, mry := math.NaN(), math.NaN()
	if okx && !math.IsNaN(msx) {
		mrx = reduce(msx, nt, phiNt)
		if st := k.traceCap("M_rx", c.mrx, "M_sx (1 - N*_t/(phi N_t))", mrx, "N·mm", cnTension); st != nil {
			st.Add("M_sx", checks.KNm(msx), "kNm").Add("N*_t", checks.KN(nt), "kN").Add("phi N_t", checks.KN(phiNt), "kN")
		}
		k.add(CheckSectionMajor, c.mrx, mx, Phi*mrx, "N·mm", "major")
	}
	if oky && !math.IsNaN(msy) {
		mry = reduce(msy, nt, phiNt)
		if st := k.traceCap("M_ry", c.mry, "M_sy (1 - N*_t/(phi N_t))", mry, "N·mm", cnTension); st != nil {
			st.Add("M_sy", checks.KNm(msy), "kNm").Add("N*_t", checks.KN(nt), "kN").Add("phi N_t", checks.KN(phiNt), "kN")
		}
		k.add(CheckSectionMinor, c.mry, my, Phi*mry, "N·mm", "minor")
	}
	if okx && oky && !math.IsNaN(msx) && !math.IsNaN(msy) {
		v := nt/phiNt + ratio(mx, Phi*msx) + ratio(my, Phi*msy)
		if on {
			k.tr.Step("section interaction", c.sectionBiaxial, "N*_t/(phi N_t) + M*_x/(phi M_sx) + M*_y/(phi M_sy)", v, "").
				Add("N*_t", checks.KN(nt), "kN").Add("M*_x", checks.KNm(mx), "kNm").Add("M*_y", checks.KNm(my), "kNm").
				Add("phi N_t", checks.KN(phiNt), "kN").Add("phi M_sx", checks.KNm(Phi*msx), "kNm").
				Add("phi M_sy", checks.KNm(Phi*msy), "kNm").Noted(r.cnotes[cnTension])
		}
		k.add(CheckSectionBiaxial, c.sectionBiaxial, v, 1, "", "")
	}
	mox := math.NaN()
	if okx && !math.IsNaN(mrx) {
		if mbx, ok := r.mb(k, m, mx); ok {
			mox = math.Min(mbx, mrx)
			if st := k.traceCap("M_ox", c.moxTension, "min(M_bx, M_rx)", mox, "N·mm", cnTensionMox); st != nil {
				st.Add("M_bx", checks.KNm(mbx), "kNm").Add("M_rx", checks.KNm(mrx), "kNm")
			}
			k.add(CheckOutOfPlane, c.moxTension, mx, Phi*mox, "N·mm", "major")
		}
	}
	if okx && oky && !math.IsNaN(mrx) && !math.IsNaN(mry) && (!math.IsNaN(mox) || mx <= checks.MomentTolerance) {
		mtx := mrx
		if !math.IsNaN(mox) {
			mtx = math.Min(mrx, mox)
		}
		v := math.Pow(ratio(mx, Phi*mtx), 1.4) + math.Pow(ratio(my, Phi*mry), 1.4)
		if on {
			k.tr.Step("member interaction", c.biaxialT, "(M*_x/(phi M_tx))^1.4 + (M*_y/(phi M_ry))^1.4", v, "").
				Add("M*_x", checks.KNm(mx), "kNm").Add("phi M_tx", checks.KNm(Phi*mtx), "kNm").
				Add("M*_y", checks.KNm(my), "kNm").Add("phi M_ry", checks.KNm(Phi*mry), "kNm").Noted(r.cnotes[cnTension])
		}
		k.add(CheckMemberBiaxial, c.biaxialT, v, 1, "", "")
	}
}

func mrFormula(form uint8, major bool) string {
	switch {
	case form == form118 && major:
		return "min(1.18 M_sx (1 - N*/(phi N_s)), M_sx)"
	case form == form118Reduced:
		return "min(M_sx (1 - N*/(phi N_s)) (1 + 0.18 (82 - lambda_w)/(82 - lambda_wy)), M_sx)"
	case form == form118:
		return "min(1.18 M_sy (1 - N*/(phi N_s)), M_sy)"
	case form == form119:
		return "min(1.19 M_sy (1 - (N*/(phi N_s))^2), M_sy)"
	case major:
		return "M_sx (1 - N*/(phi N_s))"
	}
	return "M_sy (1 - N*/(phi N_s))"
}

// capacityAssumptions are the run-level assumptions of scope full.
func (r *Rules) capacityAssumptions() []string {
	t := r.v.Title
	return []string{
		t + " member capacity: phi = 0.9 (Table 3.4); f_y from the model, else the request's default, else from the grade name " +
			"(AS/NZS 3679.1, 3678 and 1163 values of AS 4100 Table 2.1, by the band of the section's thickest element); " +
			"one f_y for all elements of a section; A_n = A_g (no holes)",
		t + " residual stress category from the section type (Table 5.2): rolled I sections, channels, tees and angles hot-rolled; " +
			"I sections named WB/WC and monosymmetric I sections heavily welded; hollow sections cold-formed, not stress-relieved " +
			"(alpha_b = -0.5, Tables 6.3.3(1) and (2))",
		t + " member compression capacity about each axis with that axis's k_e and buckling length (the sway k_e on a sway axis)",
		t + " lateral-torsional buckling: the segment is the whole member, both ends restrained, k_t = k_l = k_r = 1 (l_e = L); " +
			"alpha_m from the quarter-point moments of the linear moment diagram (5.6.1.1), 1.0 where a transverse load acts or " +
			"the curvature is unknown; closed hollow sections are not prone to it (M_b = M_s); not implemented for tees, " +
			"angles and monosymmetric I sections",
		t + " combined actions with the amplified moments: 8.3.2/8.3.3 with the 1.18 and 1.19 forms for compact doubly symmetric " +
			"I sections and RHS/SHS, the general forms of 8.3.4, 8.4.2.2 and 8.4.4.1, and 8.4.5.1",
		t + " tension members: phi N_t = phi min(A_g f_y, 0.85 k_t A_n f_u) with k_t = 1 and A_n = A_g (connections are designed " +
			"separately); bending checks in tension take no benefit from the tension",
	}
}
