package en1993

import (
	"math"

	"swaygate/checks"
	"swaygate/checks/section"
)

// Partial factors and constants of the capacity checks.
const (
	// GammaM0 and GammaM1 are the recommended partial factors of 6.1(1)
	// NOTE 2B (cross-sections, member buckling); a National Annex may
	// change them.
	GammaM0 = 1.0
	GammaM1 = 1.0
	// Poisson is nu of 3.2.6; G = E/(2(1 + nu)) (81 000 MPa for E = 210 000).
	Poisson = 0.3
)

// Names of the capacity checks (CapacityCheck.Name).
const (
	CheckCompressionMajor = "compression-major" // N_Ed ≤ N_b,Rd,y (6.3.1)
	CheckCompressionMinor = "compression-minor" // N_Ed ≤ N_b,Rd,z (6.3.1)
	CheckSection          = "section"           // cross-section, linear sum 6.2.1(7)
	CheckMemberMajor      = "member-major"      // 6.3.3 (6.61)
	CheckMemberMinor      = "member-minor"      // 6.3.3 (6.62)
	CheckLateralTorsional = "lateral-torsional" // M_y,Ed ≤ M_b,Rd (6.3.2), members not in compression
)

// Clause labels of the capacity checks.
const (
	clauseFy      = "EN 1993-1-1 3.2.1"
	clauseClass   = "EN 1993-1-1 5.5.2, Table 5.2"
	clauseAeff    = "EN 1993-1-5 4.4"
	clauseNcRd    = "EN 1993-1-1 6.2.4 (6.10), (6.11)"
	clauseNplRd   = "EN 1993-1-1 6.2.3 (6.6)"
	clauseMcRd    = "EN 1993-1-1 6.2.5 (6.13), (6.14)"
	clauseCurve   = "EN 1993-1-1 6.3.1.2, Tables 6.1 and 6.2"
	clauseLambda  = "EN 1993-1-1 6.3.1.3 (6.50), (6.51)"
	clauseChi     = "EN 1993-1-1 6.3.1.2 (6.49)"
	clauseNbRd    = "EN 1993-1-1 6.3.1.1 (6.47), (6.48)"
	clauseSection = "EN 1993-1-1 6.2.1(7) (6.2)"
	clauseMcr     = "EN 1993-1-1 6.3.2.2(2)"
	clauseCurveLT = "EN 1993-1-1 6.3.2.2, Tables 6.3 and 6.4"
	clauseChiLT   = "EN 1993-1-1 6.3.2.2 (6.56)"
	clauseMbRd    = "EN 1993-1-1 6.3.2.1 (6.54), (6.55)"
	clauseCm      = "EN 1993-1-1 Annex B, Table B.3"
	clauseK       = "EN 1993-1-1 Annex B, Tables B.1 and B.2"
	clause661     = "EN 1993-1-1 6.3.3(4) (6.61)"
	clause662     = "EN 1993-1-1 6.3.3(4) (6.62)"
)

// Imperfection factors of Table 6.1 (buckling curves a0, a, b, c, d).
// source: standards-notes §3 (Table 6.1) [L]
const (
	alphaA0 = 0.13
	alphaA  = 0.21
	alphaB  = 0.34
	alphaC  = 0.49
	alphaD  = 0.76
)

// Notes and messages of the capacity checks.
const (
	noteAssumedRolled  = "I section with root fillets and no type in its name: taken as hot-rolled (Table 6.2)"
	noteAssumedWelded  = "I section without root fillets and no type in its name: taken as welded (Table 6.2)"
	noteAssumedCold    = "hollow section of unknown manufacture: taken as cold-formed, buckling curve c (Table 6.2)"
	noteFyModel        = "from the model"
	noteFyRequest      = "the request's default yield strength"
	noteClassN         = "class in compression"
	noteClass4         = "Class 4: effective area of EN 1993-1-5 4.4 (uniform compression, psi = 1)"
	noteNoLTB          = "hollow section: not susceptible to lateral-torsional buckling, chi_LT = 1"
	noteLTBSegment     = "segment length = the member length, lateral and torsional restraint at both ends only (assumed); k = k_w = 1"
	noteC1Linear       = "C1 = 1.88 - 1.40 psi + 0.52 psi² ≤ 2.70 (end moments, k = 1)"
	noteC1One          = "moment diagram not linear or curvature unknown: C1 = 1.0 (conservative)"
	noteLTSmall        = "lambda_LT ≤ 0.2 or M_Ed/M_cr ≤ 0.04: chi_LT = 1 (6.3.2.2(4))"
	noteCmLinear       = "linear moment diagram: 0.6 + 0.4 psi ≥ 0.4"
	noteCmSway         = "sway axis: not below 0.9 (Table B.3, sway buckling mode)"
	noteCmOne          = "transverse load or curvature unknown: C_m = 1.0 (conservative)"
	noteNcrSystem      = "N_cr with the braced (system) buckling length: the sway effects are in the amplified moments (5.2.2(8))"
	noteNcrOwn         = "N_cr with the axis's buckling length"
	noteSumClass       = "linear sum, permitted for every class"
	noteTension        = "tension: N_pl,Rd = A f_y / gamma_M0"
	msgNoPlates        = "the section has no plate model (properties given in the model, or a solid or arbitrary shape): its class (Table 5.2) cannot be found, so the capacity checks cannot be made"
	msgUnsupportedFam  = "EN 1993-1-1 capacity checks are implemented for doubly symmetric I and H sections and rectangular and circular hollow sections only: check this member by hand"
	msgNoYield         = "no yield strength: the model gives neither fy nor a grade of the table (EN 10025-2 S235, S275, S355, S450; S460; EN 10210-1/10219-1 hollow sections), and the request gives no default"
	msgCHSClass4       = "Class 4 circular hollow section: its resistance is given by EN 1993-1-6, which is not implemented"
	msgWeffMajor       = "Class 4 in major-axis bending: the effective section modulus W_eff (EN 1993-1-5 4.3, 4.4) is not implemented; check this member by hand"
	msgWeffMinor       = "Class 4 in minor-axis bending: the effective section modulus W_eff (EN 1993-1-5 4.3, 4.4) is not implemented; check this member by hand"
	msgUnsupportedAxes = "I section whose flanges are not parallel to its major axis: not supported by the EN 1993-1-1 capacity checks"
)

// secKey identifies the inputs of the section-level values: the section
// (by pointer: members that share a Properties value share the result) and
// what decides fy.
type secKey struct {
	sec         *section.Properties
	fy, req     float64
	grade, name string
}

// secCap are the section-level values of the capacity checks.
type secCap struct {
	skip      bool   // no section: the engine gives missing-section
	code, msg string // a check that cannot be made: the reason

	fam          family
	welded, hot  bool
	typeNote     string
	fy           float64
	fyNote       string
	eps          float64
	tMax         float64
	h, b, tf     float64
	el           [4]element
	nel          int
	classN       int
	classM       [2]int
	class        int // for the interaction: the worst of classN and classM
	a, aEff, nRk float64
	wpl, wel     [2]float64
	mcRk         [2]float64 // W fy of pure bending by the axis's class; NaN for Class 4
	w            [2]float64 // W of the interaction by class; NaN when W_eff is needed
	curve        [2]byte
	alpha        [2]float64
	ltb          bool // an I section: lateral-torsional buckling applies
	curveLT      byte
	alphaLT      float64
	iz, it, iw   float64
}

// memCap are the member-level values: flexural buckling per axis.
type memCap struct {
	index int
	valid bool
	ncr   [2]float64
	lam   [2]float64
	chi   [2]float64
	nbRd  [2]float64
}

// scratch is the rule set's per-run state, kept in MemberContext.Scratch.
type scratch struct {
	key   secKey
	keyOK bool
	sec   secCap
	mem   memCap
	arena checks.CheckArena
}

func scratchOf(mc *checks.MemberContext) *scratch {
	if sc, ok := mc.Scratch.(*scratch); ok {
		return sc
	}
	sc := &scratch{}
	mc.Scratch = sc
	return sc
}

// maxChecks is the most checks one combination adds.
const maxChecks = 5

// pick returns y for the major axis and z for the minor.
func pick(a int, y, z string) string {
	if a == 0 {
		return y
	}
	return z
}

// memberCapacity computes the section- and member-level values of mc's
// member, tracing each step when tr is on. The section-level part is
// reused from the previous member when the section and the material
// inputs are the same and no trace is built.
func (r *Rules) memberCapacity(mc *checks.MemberContext, sc *scratch, tr *checks.Tracer) {
	mem := mc.Member
	key := secKey{sec: mem.Section, fy: mem.Material.Fy, req: mc.Options.Yield,
		grade: mem.Material.Grade, name: mem.Material.Name}
	if tr.On() || !sc.keyOK || sc.key != key {
		sectionCapacity(mc, &sc.sec, tr)
		sc.key, sc.keyOK = key, true
	}
	m := &sc.mem
	*m = memCap{index: mc.Index, valid: true}
	s := &sc.sec
	for a := range m.chi {
		m.ncr[a], m.lam[a], m.chi[a], m.nbRd[a] = math.NaN(), math.NaN(), math.NaN(), math.NaN()
	}
	if s.skip || s.code != "" {
		return
	}
	on := tr.On()
	for a := range mc.Axes {
		ax := &mc.Axes[a]
		ncr := ax.Nomb
		if math.IsNaN(ncr) {
			continue // the missing input has its own reason
		}
		lam := math.Sqrt(s.nRk / ncr)
		phi := 0.5 * (1 + s.alpha[a]*(lam-0.2) + lam*lam)
		chi := math.Min(1, 1/(phi+math.Sqrt(phi*phi-lam*lam)))
		nb := chi * s.nRk / GammaM1
		m.ncr[a], m.lam[a], m.chi[a], m.nbRd[a] = ncr, lam, chi, nb
		if !on {
			continue
		}
		note := noteNcrOwn
		if ax.Restraint == checks.Sway {
			note = noteNcrSystem
		}
		tr.Step(pick(a, "N_cr,y", "N_cr,z"), clauseLambda, "pi^2 E I / (k_b L)^2", checks.KN(ncr), "kN").
			Add("k_b", ax.BracedKe, "").Add("L", ax.Length, "mm").Noted(note)
		aLabel := "A"
		if s.classN == 4 {
			aLabel = "A_eff"
		}
		tr.Step(pick(a, "lambda_y", "lambda_z"), clauseLambda, "sqrt(A f_y / N_cr)", lam, "").
			Add(aLabel, s.nRk/s.fy, "mm²").Add("f_y", s.fy, "MPa").Add("N_cr", checks.KN(ncr), "kN")
		tr.Step(pick(a, "Phi_y", "Phi_z"), clauseChi, "0.5 (1 + alpha (lambda - 0.2) + lambda^2)", phi, "").
			Add("alpha", s.alpha[a], "").Add("lambda", lam, "")
		tr.Step(pick(a, "chi_y", "chi_z"), clauseChi, "1 / (Phi + sqrt(Phi^2 - lambda^2)) ≤ 1", chi, "").
			Add("Phi", phi, "").Add("lambda", lam, "")
		tr.Step(pick(a, "N_b,Rd,y", "N_b,Rd,z"), clauseNbRd, "chi A f_y / gamma_M1", checks.KN(nb), "kN").
			Add("chi", chi, "").Add(aLabel, s.nRk/s.fy, "mm²").Add("f_y", s.fy, "MPa").Add("gamma_M1", GammaM1, "")
	}
}

// sectionCapacity computes the section-level values into s.
func sectionCapacity(mc *checks.MemberContext, s *secCap, tr *checks.Tracer) {
	*s = secCap{}
	mem := mc.Member
	sec := mem.Section
	if sec == nil || !(sec.A > 0) {
		s.skip = true
		return
	}
	if sec.Geometry == nil {
		s.code, s.msg = checks.CodeUnsupportedProfile, msgNoPlates
		return
	}
	fam, welded, hot, note := sectionType(sec.Geometry, sec.Profile, mem.Material.Grade, mem.Material.Name)
	if fam == famNone {
		s.code, s.msg = checks.CodeUnsupportedProfile, msgUnsupportedFam
		return
	}
	pl, ok := sec.Geometry.(section.Plated)
	if !ok {
		s.code, s.msg = checks.CodeUnsupportedProfile, msgNoPlates
		return
	}
	plates, err := pl.Plates()
	if err != nil {
		s.code, s.msg = checks.CodeUnsupportedProfile, "plate elements: "+err.Error()
		return
	}
	s.fam, s.welded, s.hot, s.typeNote = fam, welded, hot, note
	for k := range plates {
		s.tMax = math.Max(s.tMax, plates[k].Thickness)
	}
	if fam == famI {
		g := unwrap(sec.Geometry).(section.ISection)
		s.h, s.b, s.tf = g.D, g.B, g.Tf
		hw := g.D - 2*g.Tf
		ix := g.B*g.Tf*(g.D-g.Tf)*(g.D-g.Tf)/2 + g.Tw*hw*hw*hw/12
		if iy := g.Tf * g.B * g.B * g.B / 6; iy > ix {
			// The flanges' own stiffness exceeds the major-axis one: the
			// flanges are not parallel to the major axis.
			s.code, s.msg = checks.CodeUnsupportedProfile, msgUnsupportedAxes
			return
		}
	}

	// Yield strength (3.2.1).
	on := tr.On()
	prod := productRolled
	if fam != famI {
		prod = productCold
		if hot {
			prod = productHot
		}
	}
	mat := &mem.Material
	gfy, glabel, gok := 0.0, "", false
	if mat.Grade != "" {
		gfy, glabel, gok = gradeYield(mat.Grade, prod, s.tMax)
	}
	if !gok && mat.Name != "" {
		gfy, glabel, gok = gradeYield(mat.Name, prod, s.tMax)
	}
	if !gok {
		gfy, glabel, gok = gradeYield(sec.Profile, prod, s.tMax)
	}
	switch {
	case finitePos(mat.Fy):
		s.fy, s.fyNote = mat.Fy, noteFyModel
	case finitePos(mc.Options.Yield):
		s.fy, s.fyNote = mc.Options.Yield, noteFyRequest
	case gok:
		s.fy, s.fyNote = gfy, glabel
	default:
		s.code, s.msg = checks.CodeMissingMaterial, msgNoYield
		return
	}
	fy := s.fy
	s.eps = math.Sqrt(235 / fy)
	if on {
		tr.Step("f_y", clauseFy, "yield strength", fy, "MPa").Add("t_max", s.tMax, "mm").Noted(s.fyNote)
		tr.Step("epsilon", clauseClass, "sqrt(235 / f_y)", s.eps, "").Add("f_y", fy, "MPa")
	}

	// Classification (5.5.2, Table 5.2) and the effective area of Class 4
	// elements in compression (EN 1993-1-5 4.4).
	s.nel = elements(fam, plates, s.eps, &s.el)
	s.classN, s.classM = 1, [2]int{1, 1}
	s.a = sec.A
	lost := 0.0
	for k := range s.el[:s.nel] {
		e := &s.el[k]
		s.classN = max(s.classN, e.classN)
		s.classM[0] = max(s.classM[0], e.classM[0])
		s.classM[1] = max(s.classM[1], e.classM[1])
		lamP := math.NaN()
		if e.classN == 4 && fam != famCHS {
			e.rho, lamP = rhoCompression(e.ratio, s.eps, e.support)
			lost += float64(e.count) * (1 - e.rho) * e.c * e.t
		}
		if on {
			formula, scale := "c / t", s.eps
			if fam == famCHS {
				formula, scale = "d / t", s.eps*s.eps
			}
			st := tr.Step("c/t,"+e.part, clauseClass, formula, e.ratio, "").Add("c", e.c, "mm").Add("t", e.t, "mm").
				Add("class (compression)", float64(e.classN), "")
			for a := range e.classM {
				if e.limM[a] != nil {
					st.Add(pick(a, "class (bending y)", "class (bending z)"), float64(e.classM[a]), "")
				}
			}
			st.Add("Class 3 limit (compression)", limitN(fam, e.support)*scale, "")
			if e.classN == 4 && fam != famCHS {
				tr.Step("rho,"+e.part, clauseAeff, "(lambda_p - 0.055 (3 + psi)) / lambda_p^2 or (lambda_p - 0.188) / lambda_p^2", e.rho, "").
					Add("lambda_p", lamP, "").Noted(noteClass4)
			}
		}
	}
	s.class = max(s.classN, s.classM[0], s.classM[1])
	if s.classN == 4 && fam == famCHS {
		s.code, s.msg = checks.CodeUnsupportedProfile, msgCHSClass4
		return
	}
	s.aEff = s.a - lost
	s.nRk = s.aEff * fy
	if on {
		tr.Step("class (compression)", clauseClass, "worst element in compression", float64(s.classN), "")
		tr.Step("class y", clauseClass, "worst element in major-axis bending", float64(s.classM[0]), "")
		tr.Step("class z", clauseClass, "worst element in minor-axis bending", float64(s.classM[1]), "")
		tr.Step("class (interaction)", clauseClass, "worst of compression and bending", float64(s.class), "").
			Noted("a section under compression and bending is taken in the worse of the two classes (conservative)")
		if s.classN == 4 {
			tr.Step("A_eff", clauseAeff, "A - sum (1 - rho) c t", s.aEff, "mm²").Add("A", s.a, "mm²").Noted(noteClass4)
		}
		tr.Step("N_c,Rd", clauseNcRd, "A f_y / gamma_M0", checks.KN(s.nRk/GammaM0), "kN").
			Add("A", s.aEff, "mm²").Add("f_y", fy, "MPa").Add("gamma_M0", GammaM0, "")
	}

	// Moment resistances (6.2.5) and the moduli of the interaction.
	s.wpl = [2]float64{sec.SMajor, sec.SMinor}
	s.wel = [2]float64{sec.ZMajor, sec.ZMinor}
	for a := range s.w {
		switch {
		case s.classM[a] <= 2:
			s.mcRk[a] = s.wpl[a] * fy
		case s.classM[a] == 3:
			s.mcRk[a] = s.wel[a] * fy
		default:
			s.mcRk[a] = math.NaN()
		}
		switch {
		case s.classM[a] == 4:
			s.w[a] = math.NaN()
		case s.class <= 2:
			s.w[a] = s.wpl[a]
		default:
			s.w[a] = s.wel[a]
		}
		if on {
			formula, w := "W_pl f_y / gamma_M0", s.wpl[a]
			if s.classM[a] >= 3 {
				formula, w = "W_el f_y / gamma_M0", s.wel[a]
			}
			st := tr.Step(pick(a, "M_c,Rd,y", "M_c,Rd,z"), clauseMcRd, formula, checks.KNm(s.mcRk[a]/GammaM0), "kNm").
				Add("W", w, "mm³").Add("f_y", fy, "MPa").Add("class", float64(s.classM[a]), "")
			if s.classM[a] == 4 {
				st.Noted("Class 4: W_eff not implemented")
			}
		}
	}

	// Buckling curves (Table 6.2) and the lateral-torsional curve (Table 6.4).
	var curveNote string
	s.curve, curveNote = bucklingCurves(s)
	s.alpha = [2]float64{imperfection(s.curve[0]), imperfection(s.curve[1])}
	if s.fam == famI {
		s.ltb = true
		s.iz, s.it, s.iw = sec.IMinor, sec.J, sec.Iw
		switch {
		case !s.welded && s.h/s.b <= 2:
			s.curveLT = 'a'
		case !s.welded:
			s.curveLT = 'b'
		case s.h/s.b <= 2:
			s.curveLT = 'c'
		default:
			s.curveLT = 'd'
		}
		s.alphaLT = imperfection(s.curveLT)
	}
	if on {
		for a := range s.curve {
			tr.Step(pick(a, "alpha_y", "alpha_z"), clauseCurve, curveFormula(s.curve[a]), s.alpha[a], "").
				Add("h/b", s.h/s.b, "").Add("t_f", s.tf, "mm").Noted(curveNote)
		}
		if s.ltb {
			tr.Step("alpha_LT", clauseCurveLT, curveFormula(s.curveLT), s.alphaLT, "").Add("h/b", s.h/s.b, "").
				Noted("general case (6.3.2.2)")
		} else {
			tr.Step("chi_LT", clauseCurveLT, "1", 1, "").Noted(noteNoLTB)
		}
	}
}

// limitN is the Class 3 limit in compression (multiple of epsilon, or
// epsilon² for a CHS).
func limitN(fam family, sup section.Support) float64 {
	switch {
	case fam == famCHS:
		return limCHS[2]
	case sup == section.OneEdge:
		return limOutstandComp[2]
	}
	return limInternalComp[2]
}

// bucklingCurves selects the flexural buckling curves of Table 6.2 and
// explains the choice. The S460 column is used from fy = 460 MPa.
// source: standards-notes §3 Table 6.2 [M] (first rows [L])
func bucklingCurves(s *secCap) ([2]byte, string) {
	s460 := s.fy >= 460
	switch s.fam {
	case famI:
		if s.welded {
			if s.tf <= 40 {
				return [2]byte{'b', 'c'}, withNote("welded I, t_f ≤ 40 mm", s.typeNote)
			}
			return [2]byte{'c', 'd'}, withNote("welded I, t_f > 40 mm", s.typeNote)
		}
		switch {
		case s.h/s.b > 1.2 && s.tf <= 40:
			if s460 {
				return [2]byte{'0', '0'}, withNote("rolled I, h/b > 1.2, t_f ≤ 40 mm, S460", s.typeNote)
			}
			return [2]byte{'a', 'b'}, withNote("rolled I, h/b > 1.2, t_f ≤ 40 mm", s.typeNote)
		case s.h/s.b > 1.2 && s.tf <= 100, s.h/s.b <= 1.2 && s.tf <= 100:
			if s460 {
				return [2]byte{'a', 'a'}, withNote("rolled I, S460", s.typeNote)
			}
			if s.h/s.b > 1.2 {
				return [2]byte{'b', 'c'}, withNote("rolled I, h/b > 1.2, 40 < t_f ≤ 100 mm", s.typeNote)
			}
			return [2]byte{'b', 'c'}, withNote("rolled I, h/b ≤ 1.2, t_f ≤ 100 mm", s.typeNote)
		default:
			if s460 {
				return [2]byte{'c', 'c'}, withNote("rolled I, t_f > 100 mm, S460", s.typeNote)
			}
			return [2]byte{'d', 'd'}, withNote("rolled I, t_f > 100 mm", s.typeNote)
		}
	default:
		if s.hot {
			if s460 {
				return [2]byte{'0', '0'}, "hot-finished hollow section, S460"
			}
			return [2]byte{'a', 'a'}, "hot-finished hollow section"
		}
		return [2]byte{'c', 'c'}, withNote("cold-formed hollow section", s.typeNote)
	}
}

func withNote(a, b string) string {
	if b == "" {
		return a
	}
	return a + "; " + b
}

// imperfection is alpha of Table 6.1 for curve c ('0' is a0).
func imperfection(c byte) float64 {
	switch c {
	case '0':
		return alphaA0
	case 'a':
		return alphaA
	case 'b':
		return alphaB
	case 'c':
		return alphaC
	}
	return alphaD
}

func curveFormula(c byte) string {
	switch c {
	case '0':
		return "curve a0"
	case 'a':
		return "curve a"
	case 'b':
		return "curve b"
	case 'c':
		return "curve c"
	}
	return "curve d"
}

// Chi is the reduction factor chi of 6.3.1.2 (6.49) for the relative
// slenderness lambda and the imperfection factor alpha (≤ 1).
func Chi(lambda, alpha float64) float64 {
	phi := 0.5 * (1 + alpha*(lambda-0.2) + lambda*lambda)
	return math.Min(1, 1/(phi+math.Sqrt(phi*phi-lambda*lambda)))
}

// C1 is the factor of the elastic critical moment for a linear moment
// diagram with end moment ratio psi (+1 uniform moment in single
// curvature, −1 double curvature): 1.88 − 1.40 psi + 0.52 psi² ≤ 2.70, the
// usual fit to the tabulated values for k = 1. From memory [M].
func C1(psi float64) float64 { return math.Min(2.70, 1.88-1.40*psi+0.52*psi*psi) }

// Mcr is the elastic critical moment of a doubly symmetric I section under
// a moment diagram with factor c1, loaded at its shear centre, with
// k = k_w = 1 over the length l (mm): c1 (pi² E Iz / l²) sqrt(Iw/Iz +
// l² G It / (pi² E Iz)) (N·mm). From memory [M].
func Mcr(c1, e, g, iz, it, iw, l float64) float64 {
	p := math.Pi * math.Pi * e * iz / (l * l)
	return c1 * p * math.Sqrt(iw/iz+l*l*g*it/(math.Pi*math.Pi*e*iz))
}

// combo collects the checks of one combination.
type combo struct {
	cx  *checks.CombinationContext
	tr  *checks.Tracer
	buf []checks.CapacityCheck
	n   int
}

// add records a check, its utilisation and, above 1, capacity-exceeded.
func (k *combo) add(name, clause string, demand, capacity float64, unit, axis string) {
	u := ratio(demand, capacity)
	k.buf[k.n] = checks.CapacityCheck{Name: name, Clause: clause, Demand: checks.Num(demand),
		Capacity: checks.Num(capacity), Unit: unit, Utilisation: checks.Num(u)}
	k.n++
	if u > 1 {
		k.cx.Reason(checks.CodeCapacityExceeded, numMsg(name+": utilisation ", u, " > 1 ("+clause+")"), axis)
	}
	if k.tr.On() {
		st := k.tr.Step("u,"+name, clause, "demand / capacity", u, "")
		switch unit {
		case "N":
			st.Add("demand", checks.KN(demand), "kN").Add("capacity", checks.KN(capacity), "kN")
		case "N·mm":
			st.Add("demand", checks.KNm(demand), "kNm").Add("capacity", checks.KNm(capacity), "kNm")
		}
	}
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

// psiOf returns psi of Table B.3 (and of C1) from an axis's end moments:
// M_small/M_large, +1 for equal moments in single curvature; ok is false
// when the diagram is not linear between the ends or its curvature is not
// known.
func psiOf(ax *checks.AxisContext) (psi float64, ok bool) {
	mo := ax.Moments
	if ax.SignAmbiguous || mo.CurvatureUnknown || ax.Setup.Transverse || mo.Transverse || mo.InteriorUnknown {
		return math.NaN(), false
	}
	mm := math.Max(math.Abs(mo.Start), math.Abs(mo.End))
	if math.Abs(mo.Peak) > mm*(1+1e-6)+checks.MomentTolerance {
		return math.NaN(), false // a peak between the ends
	}
	r, ok := checks.EndMomentRatio(mo.Start, mo.End)
	if !ok {
		return 1, true // no end moments: any C_m applies to nothing
	}
	return -r, true
}

// Capacity implements checks.RuleSet: the member capacity checks of one
// combination with the amplified moments of both axes (scope full).
func (r *Rules) Capacity(cx *checks.CombinationContext, out *checks.CombinationResult, tr *checks.Tracer) {
	mc := cx.Member
	sc := scratchOf(mc)
	if !sc.mem.valid || sc.mem.index != mc.Index {
		r.memberCapacity(mc, sc, nil)
	}
	s, m := &sc.sec, &sc.mem
	switch {
	case s.skip:
		return
	case s.code != "":
		cx.Reason(s.code, s.msg, "")
		return
	}
	k := combo{cx: cx, tr: tr, buf: sc.arena.Reserve(maxChecks)}
	on := tr.On()
	nEd := cx.Actions.NStar
	var mEd [2]float64
	for a := range mEd {
		mEd[a] = math.Abs(out.Axes[a].MAmp.F())
		if mEd[a] <= checks.MomentTolerance {
			mEd[a] = 0
		}
	}
	// A moment on a Class 4 axis needs W_eff.
	for a := range mEd {
		if math.IsNaN(s.w[a]) && mEd[a] > 0 {
			msg := msgWeffMajor
			if a == 1 {
				msg = msgWeffMinor
			}
			cx.Reason(checks.CodeUnsupportedProfile, msg, checks.Axis(a).String())
			mEd[a] = math.NaN()
		}
	}
	known := !math.IsNaN(mEd[0]) && !math.IsNaN(mEd[1])
	var mRk [2]float64
	for a := range mRk {
		mRk[a] = s.w[a] * s.fy
		if mEd[a] == 0 && math.IsNaN(mRk[a]) {
			mRk[a] = math.Inf(1) // W_eff unknown but no moment: the term is zero
		}
	}

	// Lateral-torsional buckling of the segment (6.3.2.2).
	chiLT := 1.0
	ltbKnown := true
	if s.ltb && mEd[0] > 0 {
		chiLT, ltbKnown = r.lateralTorsional(cx, s, mEd[0], mRk[0], on, tr)
	}

	if nEd <= 0 {
		// Not in compression: the cross-section (tension or none) and, for
		// I sections, lateral-torsional buckling.
		if known {
			nRd := s.a * s.fy / GammaM0
			v := -nEd/nRd + ratio(mEd[0], mRk[0]/GammaM0) + ratio(mEd[1], mRk[1]/GammaM0)
			if on {
				tr.Step("section interaction", clauseSection, "N_Ed/N_Rd + M_y,Ed/M_y,Rd + M_z,Ed/M_z,Rd", v, "").
					Add("N_Ed", checks.KN(nEd), "kN").Add("N_Rd", checks.KN(nRd), "kN").
					Add("M_y,Ed", checks.KNm(mEd[0]), "kNm").Add("M_y,Rd", checks.KNm(mRk[0]/GammaM0), "kNm").
					Add("M_z,Ed", checks.KNm(mEd[1]), "kNm").Add("M_z,Rd", checks.KNm(mRk[1]/GammaM0), "kNm").Noted(noteTension)
			}
			k.add(CheckSection, clauseSection, v, 1, "", "")
		}
		if s.ltb && mEd[0] > 0 && ltbKnown {
			k.add(CheckLateralTorsional, clauseMbRd, mEd[0], chiLT*mRk[0]/GammaM1, "N·mm", "major")
		}
		out.Capacity = sc.arena.Commit(k.n)
		return
	}

	// Flexural buckling (6.3.1).
	for a := range m.nbRd {
		if !math.IsNaN(m.nbRd[a]) {
			k.add(pick(a, CheckCompressionMajor, CheckCompressionMinor), clauseNbRd, nEd, m.nbRd[a], "N", checks.Axis(a).String())
		}
	}
	if !known {
		out.Capacity = sc.arena.Commit(k.n)
		return
	}

	// Cross-section (6.2.1(7), linear sum).
	nRd := s.nRk / GammaM0
	v := nEd/nRd + ratio(mEd[0], mRk[0]/GammaM0) + ratio(mEd[1], mRk[1]/GammaM0)
	if on {
		tr.Step("section interaction", clauseSection, "N_Ed/N_Rd + M_y,Ed/M_y,Rd + M_z,Ed/M_z,Rd", v, "").
			Add("N_Ed", checks.KN(nEd), "kN").Add("N_Rd", checks.KN(nRd), "kN").
			Add("M_y,Ed", checks.KNm(mEd[0]), "kNm").Add("M_y,Rd", checks.KNm(mRk[0]/GammaM0), "kNm").
			Add("M_z,Ed", checks.KNm(mEd[1]), "kNm").Add("M_z,Rd", checks.KNm(mRk[1]/GammaM0), "kNm").Noted(noteSumClass)
	}
	k.add(CheckSection, clauseSection, v, 1, "", "")

	// Member interaction (6.3.3(4), Annex B).
	if math.IsNaN(m.chi[0]) || math.IsNaN(m.chi[1]) || !ltbKnown {
		out.Capacity = sc.arena.Commit(k.n)
		return
	}
	var cm [2]float64
	for a := range cm {
		cm[a] = r.cmFactor(cx, a, on, tr)
	}
	cmLT := 1.0
	if s.ltb {
		cmLT = cmLinear(cx.Axes[0], false)
		if on {
			tr.Step("C_mLT", clauseCm, "0.6 + 0.4 psi ≥ 0.4", cmLT, "").Noted(noteCmLinear)
		}
	}
	kyy, kyz, kzy, kzz := interactionFactors(s, m, nEd, cm, cmLT)
	if on {
		tr.Step("k_yy", clauseK, kFormula(s, "yy"), kyy, "").Add("C_my", cm[0], "").Add("lambda_y", m.lam[0], "").
			Add("N_Ed/N_b,Rd,y", nEd/m.nbRd[0], "")
		tr.Step("k_zz", clauseK, kFormula(s, "zz"), kzz, "").Add("C_mz", cm[1], "").Add("lambda_z", m.lam[1], "").
			Add("N_Ed/N_b,Rd,z", nEd/m.nbRd[1], "")
		tr.Step("k_yz", clauseK, kFormula(s, "yz"), kyz, "")
		tr.Step("k_zy", clauseK, kFormula(s, "zy"), kzy, "").Add("C_mLT", cmLT, "").Add("lambda_z", m.lam[1], "")
	}
	my := ratio(mEd[0], chiLT*mRk[0]/GammaM1)
	mz := ratio(mEd[1], mRk[1]/GammaM1)
	u61 := nEd/m.nbRd[0] + kyy*my + kyz*mz
	u62 := nEd/m.nbRd[1] + kzy*my + kzz*mz
	if on {
		tr.Step("6.61", clause661, "N_Ed/(chi_y N_Rk/g_M1) + k_yy M_y,Ed/(chi_LT M_y,Rk/g_M1) + k_yz M_z,Ed/(M_z,Rk/g_M1)", u61, "").
			Add("N_Ed", checks.KN(nEd), "kN").Add("chi_y N_Rk", checks.KN(m.chi[0]*s.nRk), "kN").
			Add("M_y,Ed", checks.KNm(mEd[0]), "kNm").Add("chi_LT M_y,Rk", checks.KNm(chiLT*mRk[0]), "kNm").
			Add("M_z,Ed", checks.KNm(mEd[1]), "kNm").Add("M_z,Rk", checks.KNm(mRk[1]), "kNm")
		tr.Step("6.62", clause662, "N_Ed/(chi_z N_Rk/g_M1) + k_zy M_y,Ed/(chi_LT M_y,Rk/g_M1) + k_zz M_z,Ed/(M_z,Rk/g_M1)", u62, "").
			Add("N_Ed", checks.KN(nEd), "kN").Add("chi_z N_Rk", checks.KN(m.chi[1]*s.nRk), "kN").
			Add("M_y,Ed", checks.KNm(mEd[0]), "kNm").Add("chi_LT M_y,Rk", checks.KNm(chiLT*mRk[0]), "kNm").
			Add("M_z,Ed", checks.KNm(mEd[1]), "kNm").Add("M_z,Rk", checks.KNm(mRk[1]), "kNm")
	}
	k.add(CheckMemberMajor, clause661, u61, 1, "", "major")
	k.add(CheckMemberMinor, clause662, u62, 1, "", "minor")
	out.Capacity = sc.arena.Commit(k.n)
}

// lateralTorsional computes chi_LT of the member's segment for the
// combination (6.3.2.2, general case) and whether it is known.
func (r *Rules) lateralTorsional(cx *checks.CombinationContext, s *secCap, mEd, mRk float64, on bool, tr *checks.Tracer) (float64, bool) {
	mc := cx.Member
	l := mc.Axes[0].MemberLength
	if math.IsNaN(l) || !(s.it > 0) || !(s.iw >= 0) || !(s.iz > 0) {
		return math.NaN(), false // missing-length is the engine's reason
	}
	ax := cx.Axes[0]
	psi, ok := psiOf(ax)
	c1, note := 1.0, noteC1One
	if ok {
		c1, note = C1(psi), noteC1Linear
	}
	g := mc.E / (2 * (1 + Poisson))
	mcr := Mcr(c1, mc.E, g, s.iz, s.it, s.iw, l)
	lam := math.Sqrt(mRk / mcr)
	chi := 1.0
	small := lam <= 0.2 || mEd/mcr <= 0.04
	if !small {
		chi = Chi(lam, s.alphaLT)
	}
	if on {
		st := tr.Step("C1", clauseMcr, "C1(psi)", c1, "")
		if ok {
			st.Add("psi", psi, "")
		}
		st.Noted(note)
		tr.Step("M_cr", clauseMcr, "C1 pi^2 E I_z / L^2 sqrt(I_w/I_z + L^2 G I_t / (pi^2 E I_z))", checks.KNm(mcr), "kNm").
			Add("C1", c1, "").Add("E", mc.E, "MPa").Add("G", g, "MPa").Add("I_z", s.iz, "mm⁴").
			Add("I_t", s.it, "mm⁴").Add("I_w", s.iw, "mm⁶").Add("L", l, "mm").Noted(noteLTBSegment)
		tr.Step("lambda_LT", clauseChiLT, "sqrt(W_y f_y / M_cr)", lam, "").
			Add("W_y f_y", checks.KNm(mRk), "kNm").Add("M_cr", checks.KNm(mcr), "kNm")
		st = tr.Step("chi_LT", clauseChiLT, "1 / (Phi_LT + sqrt(Phi_LT^2 - lambda_LT^2)) ≤ 1", chi, "").
			Add("alpha_LT", s.alphaLT, "").Add("lambda_LT", lam, "")
		if small {
			st.Noted(noteLTSmall)
		}
	}
	return chi, true
}

// cmLinear is C_m of Table B.3 for axis ax: 0.6 + 0.4 psi ≥ 0.4 for a
// linear moment diagram, 1.0 where it is not linear or its curvature is
// unknown; on a sway axis at least 0.9 when sway is true.
func cmLinear(ax *checks.AxisContext, sway bool) float64 {
	psi, ok := psiOf(ax)
	if !ok {
		return 1
	}
	cm := math.Max(0.4, 0.6+0.4*psi)
	if sway {
		cm = math.Max(cm, 0.9)
	}
	return cm
}

// cmFactor is C_my or C_mz of the combination, traced.
func (r *Rules) cmFactor(cx *checks.CombinationContext, a int, on bool, tr *checks.Tracer) float64 {
	ax := cx.Axes[a]
	sway := ax.Sway.Role.Swaying()
	cm := cmLinear(ax, sway)
	if on {
		_, ok := psiOf(ax)
		note := noteCmLinear
		switch {
		case !ok:
			note = noteCmOne
		case sway:
			note = noteCmSway
		}
		tr.Step(pick(a, "C_my", "C_mz"), clauseCm, "0.6 + 0.4 psi ≥ 0.4", cm, "").Noted(note)
	}
	return cm
}

// interactionFactors are k_yy, k_yz, k_zy and k_zz of Annex B (Method 2):
// Table B.2 (members susceptible to torsional deformations: I sections)
// and Table B.1 (hollow sections). From memory [M].
func interactionFactors(s *secCap, m *memCap, nEd float64, cm [2]float64, cmLT float64) (kyy, kyz, kzy, kzz float64) {
	ny, nz := nEd/m.nbRd[0], nEd/m.nbRd[1]
	ly, lz := m.lam[0], m.lam[1]
	plastic := s.class <= 2
	if plastic {
		kyy = cm[0] * math.Min(1+(ly-0.2)*ny, 1+0.8*ny)
		if s.fam == famI {
			kzz = cm[1] * math.Min(1+(2*lz-0.6)*nz, 1+1.4*nz)
		} else {
			kzz = cm[1] * math.Min(1+(lz-0.2)*nz, 1+0.8*nz)
		}
		kyz = 0.6 * kzz
	} else {
		kyy = cm[0] * math.Min(1+0.6*ly*ny, 1+0.6*ny)
		kzz = cm[1] * math.Min(1+0.6*lz*nz, 1+0.6*nz)
		kyz = kzz
	}
	switch {
	case s.fam != famI && plastic:
		kzy = 0.6 * kyy
	case s.fam != famI:
		kzy = 0.8 * kyy
	case plastic && lz < 0.4:
		kzy = math.Min(0.6+lz, 1-0.1*lz*nz/(cmLT-0.25))
	case plastic:
		kzy = math.Max(1-0.1*lz*nz/(cmLT-0.25), 1-0.1*nz/(cmLT-0.25))
	default:
		kzy = math.Max(1-0.05*lz*nz/(cmLT-0.25), 1-0.05*nz/(cmLT-0.25))
	}
	return kyy, kyz, kzy, kzz
}

// kFormula is the trace formula of an interaction factor.
func kFormula(s *secCap, which string) string {
	plastic := s.class <= 2
	switch which {
	case "yy":
		if plastic {
			return "C_my min(1 + (lambda_y - 0.2) n_y, 1 + 0.8 n_y)"
		}
		return "C_my min(1 + 0.6 lambda_y n_y, 1 + 0.6 n_y)"
	case "zz":
		switch {
		case plastic && s.fam == famI:
			return "C_mz min(1 + (2 lambda_z - 0.6) n_z, 1 + 1.4 n_z)"
		case plastic:
			return "C_mz min(1 + (lambda_z - 0.2) n_z, 1 + 0.8 n_z)"
		}
		return "C_mz min(1 + 0.6 lambda_z n_z, 1 + 0.6 n_z)"
	case "yz":
		if plastic {
			return "0.6 k_zz"
		}
		return "k_zz"
	}
	switch {
	case s.fam != famI && plastic:
		return "0.6 k_yy (Table B.1)"
	case s.fam != famI:
		return "0.8 k_yy (Table B.1)"
	case plastic:
		return "max(1 - 0.1 lambda_z n_z/(C_mLT - 0.25), 1 - 0.1 n_z/(C_mLT - 0.25)); 0.6 + lambda_z for lambda_z < 0.4 (Table B.2)"
	}
	return "max(1 - 0.05 lambda_z n_z/(C_mLT - 0.25), 1 - 0.05 n_z/(C_mLT - 0.25)) (Table B.2)"
}

// capacityAssumptions are the run assumptions of scope full.
func capacityAssumptions() []string {
	return []string{
		"EN 1993-1-1 capacity (scope full): gamma_M0 = gamma_M1 = 1.0, the recommended values of 6.1(1); a National Annex may set others",
		"EN 1993-1-1 capacity: f_y from the model, else the request's default, else the grade named in the model by the thickness of the " +
			"section's thickest element (EN 10025-2 ReH by thickness band; S460 and hollow sections by EN 1993-1-1 Table 3.1)",
		"EN 1993-1-1 capacity: section class by Table 5.2 with c the flat width clear of root fillets and corner radii (b - 3t for a hollow " +
			"section without corner radii); under compression and bending the worse of the compression and bending classes is used (conservative); " +
			"Class 4 in compression takes the effective area of EN 1993-1-5 4.4, Class 4 in bending (W_eff) is not implemented (needs-analysis)",
		"EN 1993-1-1 capacity: flexural buckling (6.3.1) with N_cr of the braced (system) buckling length, the sway effects being in the amplified " +
			"moments (5.2.2(8)); torsional and torsional-flexural buckling (6.3.1.4) are not checked (doubly symmetric I and hollow sections)",
		"EN 1993-1-1 capacity: lateral-torsional buckling of I sections (6.3.2.2, general case) over the member length with restraint at both ends " +
			"only (k = k_w = 1), load at the shear centre, M_cr by the closed form for doubly symmetric sections with C1 from the end moments; " +
			"hollow sections are taken as not susceptible",
		"EN 1993-1-1 capacity: cross-section by the linear sum of 6.2.1(7) (conservative for every class); shear is taken as not reducing the " +
			"moment resistance (V_Ed ≤ 0.5 V_pl,Rd, 6.2.8(2)), which the actions cannot show: check it",
		"EN 1993-1-1 capacity: member interaction 6.3.3 (6.61), (6.62) with the amplified moments and the factors of Annex B (Method 2): " +
			"Table B.2 for I sections, Table B.1 for hollow sections; C_m from the first-order end moments, at least 0.9 on sway axes",
	}
}
