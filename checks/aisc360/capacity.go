package aisc360

import (
	"math"
	"strings"

	"swaygate/checks"
	"swaygate/checks/section"
)

// Resistance and safety factors of the capacity checks (LRFD φ, ASD Ω).
const (
	PhiC   = 0.90 // E1, compression
	OmegaC = 1.67
	PhiB   = 0.90 // F1, flexure
	OmegaB = 1.67
	PhiT   = 0.90 // D2(a), tensile yielding
	OmegaT = 1.67
)

// Names of the capacity checks (CapacityCheck.Name).
const (
	CheckCompression  = "compression"   // P_r ≤ P_c (E3, E7)
	CheckTension      = "tension"       // P_r ≤ P_c (D2(a))
	CheckFlexureMajor = "flexure-major" // M_rx ≤ M_cx (F2, F3, F7, F8)
	CheckFlexureMinor = "flexure-minor" // M_ry ≤ M_cy (F6, F7, F8)
	CheckInteraction  = "interaction"   // H1-1a or H1-1b
)

// Clause labels of the capacity checks.
const (
	clauseFy      = "AISC 360 A3.1"
	clauseClass   = "AISC 360 B4.1, Tables B4.1a and B4.1b"
	clauseFe      = "AISC 360 E3 (E3-4)"
	clauseFn      = "AISC 360 E3 (E3-2), (E3-3)"
	clausePn      = "AISC 360 E3 (E3-1)"
	clauseE7      = "AISC 360 E7.1 (E7-2), (E7-3), Table E7.1"
	clauseE7Round = "AISC 360 E7.2 (E7-7)"
	clausePnE7    = "AISC 360 E7 (E7-1)"
	clausePt      = "AISC 360 D2(a) (D2-1)"
	clauseF2      = "AISC 360 F2"
	clauseF2LTB   = "AISC 360 F2.2 (F2-2), (F2-3)"
	clauseF3      = "AISC 360 F3.2 (F3-1), (F3-2)"
	clauseF6      = "AISC 360 F6"
	clauseF7      = "AISC 360 F7"
	clauseF7LTB   = "AISC 360 F7.4"
	clauseF8      = "AISC 360 F8"
	clauseCb      = "AISC 360 F1 (F1-1)"
	clauseH1a     = "AISC 360 H1.1 (H1-1a)"
	clauseH1b     = "AISC 360 H1.1 (H1-1b)"
)

// Notes and messages.
const (
	noteFyModel       = "from the model"
	noteFyRequest     = "the request's default yield stress"
	noteAssumedRolled = "I section with root fillets and no type in its name: taken as rolled (Table B4.1 cases 1, 10)"
	noteAssumedBuilt  = "I section without root fillets and no type in its name: taken as built-up (Table B4.1 cases 2, 11)"
	noteCbOne         = "moment diagram not linear or curvature unknown: C_b = 1.0 (conservative)"
	noteCbLinear      = "linear moment diagram between the end moments; L_b = the member length (bracing at the ends only)"
	noteLc            = "L_c = K L with the axis's K (the sway K on a sway axis: effective length method, App. 7.2)"
	msgNoPlates       = "the section has no plate model (properties given in the model, or a solid or arbitrary shape): its local buckling classification (Table B4.1) cannot be made, so the capacity checks cannot be made"
	msgUnsupportedFam = "AISC 360 capacity checks are implemented for doubly symmetric I shapes and rectangular and round HSS only: check this member by hand"
	msgNoYield        = "no yield stress: the model gives neither Fy nor a grade of the table (ASTM A992, A36, A572 Gr 50, A500 Gr B/C, A53 Gr B, A1085), and the request gives no default"
	msgRoundDt        = "round HSS with D/t ≥ 0.45 E/Fy: outside the scope of E7.2 and F8; check this member by hand"
	msgSlenderWeb     = "I shape with a noncompact or slender web in flexure (h/tw > 3.76 sqrt(E/Fy)): F4 and F5 are not implemented; check this member by hand"
	msgSlenderHSS     = "HSS with a slender wall in flexure: the effective section modulus of F7.2(c) and F7.3(b) is not implemented; check this member by hand"
	msgUnsupportedAx  = "I shape whose flanges are not parallel to its major axis: not supported by the AISC 360 capacity checks"
)

// Section families.
type family uint8

const (
	famNone family = iota
	famI
	famRHS
	famCHS
)

// element is one plate element with its Table B4.1 slenderness.
type element struct {
	part    string
	b, t    float64
	lambda  float64
	count   int
	lamR    float64 // compression limit (Table B4.1a)
	c1, c2  float64 // Table E7.1
	slender bool    // slender in compression
	// Flexure per axis: lamP, lamRM the limits (0 when the element is not
	// in compression under that bending), class 1 compact, 2 noncompact,
	// 3 slender; flange tells a flange from a web.
	lamP, lamRM [2]float64
	classM      [2]int
	flange      [2]bool
}

// secCap are the section-level values.
type secCap struct {
	skip      bool
	code, msg string

	fam        family
	welded     bool
	typeNote   string
	fy, e      float64
	fyNote     string
	ag         float64
	el         [4]element
	nel        int
	dt, dtLimN float64 // round HSS: D/t and 0.11 E/Fy
	aeRound    float64 // round HSS effective area (E7-7)
	mp         [2]float64
	mnLocal    [2]float64 // yielding and local buckling (NaN: not implemented)
	mnNote     [2]string
	axisMsg    [2]string // why flexure about an axis cannot be checked
	// Lateral-torsional buckling about the major axis.
	ltb            uint8 // 0 none, ltbI (F2), ltbHSS (F7.4)
	ry, sx, zx     float64
	rts, h0, j, cw float64
	kc             float64
}

const (
	ltbNone uint8 = iota
	ltbI
	ltbHSS
)

// memCap are the member-level values: compression per axis.
type memCap struct {
	index int
	valid bool
	fe    [2]float64
	fn    [2]float64
	ae    [2]float64
	pn    [2]float64
	pnMin float64 // the governing P_n (NaN when an axis is unknown)
	lb    float64 // unbraced length for LTB
}

type secKey struct {
	sec         *section.Properties
	fy, req, e  float64
	grade, name string
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
const maxChecks = 4

func pick(a int, x, y string) string {
	if a == 0 {
		return x
	}
	return y
}

func unwrap(s section.Shape) section.Shape {
	for {
		t, ok := s.(section.Transformed)
		if !ok {
			return s
		}
		s = t.Parent
	}
}

// sectionType finds the family and, for an I shape, whether it is built up
// (welded); note says how when it was assumed.
func sectionType(geom section.Shape, profile, grade, material string) (fam family, welded bool, note string) {
	names := strings.ToUpper(profile + " " + grade + " " + material)
	switch g := unwrap(geom).(type) {
	case section.ISection:
		fam = famI
		prof := strings.ToUpper(profile)
		switch {
		case strings.Contains(names, "WELD") || strings.Contains(names, "BUILT") || strings.Contains(names, "PLATE GIRDER"):
			welded = true
		case strings.HasPrefix(prof, "W") || strings.HasPrefix(prof, "HP") || strings.HasPrefix(prof, "M") ||
			strings.HasPrefix(prof, "S") || strings.Contains(names, "ROLLED") || strings.Contains(prof, "UC") ||
			strings.Contains(prof, "UB") || strings.Contains(prof, "HE") || strings.Contains(prof, "IPE"):
		case g.R > 0:
			note = noteAssumedRolled
		default:
			welded, note = true, noteAssumedBuilt
		}
	case section.RHS:
		fam = famRHS
	case section.CHS:
		fam = famCHS
	}
	return fam, welded, note
}

// Cb is the lateral-torsional buckling modification factor of F1-1 for a
// linear moment diagram between the end moments start and end (N·mm, the
// same sign in single curvature): 12.5 Mmax / (2.5 Mmax + 3 MA + 4 MB +
// 3 MC) with the quarter-point moments, R_m = 1 (doubly symmetric), at
// most 3.0. It is 1 with no moment.
func Cb(start, end float64) float64 {
	mmax := math.Max(math.Abs(start), math.Abs(end))
	if !(mmax > checks.MomentTolerance) {
		return 1
	}
	ma := math.Abs(0.75*start + 0.25*end)
	mb := math.Abs(0.5*start + 0.5*end)
	mc := math.Abs(0.25*start + 0.75*end)
	return math.Min(3, 12.5*mmax/(2.5*mmax+3*ma+4*mb+3*mc))
}

// Fn is the flexural buckling stress of E3 (E3-2, E3-3) for the yield
// stress fy and the elastic buckling stress fe (MPa).
func Fn(fy, fe float64) float64 {
	if fy/fe <= 2.25 {
		return math.Pow(0.658, fy/fe) * fy
	}
	return 0.877 * fe
}

// Interaction is the H1.1 interaction of P_r/P_c and the moment ratios
// (all terms positive): H1-1a when P_r/P_c ≥ 0.2, else H1-1b; it returns
// the value and the equation's clause.
func Interaction(pr, pc, mrx, mcx, mry, mcy float64) (float64, string) {
	p := ratio(pr, pc)
	m := ratio(mrx, mcx) + ratio(mry, mcy)
	if p >= 0.2 {
		return p + 8.0/9.0*m, clauseH1a
	}
	return p/2 + m, clauseH1b
}

func ratio(d, c float64) float64 {
	switch {
	case c > 0:
		return d / c
	case d <= 0:
		return 0
	}
	return math.Inf(1)
}

// memberCapacity computes the section- and member-level values of mc's
// member, tracing each step when tr is on.
func (r *Rules) memberCapacity(mc *checks.MemberContext, sc *scratch, tr *checks.Tracer) {
	mem := mc.Member
	key := secKey{sec: mem.Section, fy: mem.Material.Fy, req: mc.Options.Yield, e: mc.E,
		grade: mem.Material.Grade, name: mem.Material.Name}
	if tr.On() || !sc.keyOK || sc.key != key {
		sectionCapacity(mc, &sc.sec, tr)
		sc.key, sc.keyOK = key, true
	}
	m := &sc.mem
	*m = memCap{index: mc.Index, valid: true, pnMin: math.NaN(), lb: mc.Axes[0].MemberLength}
	s := &sc.sec
	for a := range m.pn {
		m.fe[a], m.fn[a], m.ae[a], m.pn[a] = math.NaN(), math.NaN(), math.NaN(), math.NaN()
	}
	if s.skip || s.code != "" {
		return
	}
	on := tr.On()
	known := true
	for a := range mc.Axes {
		ax := &mc.Axes[a]
		if math.IsNaN(ax.Nom) {
			known = false
			continue
		}
		fe := ax.Nom / s.ag
		fn := Fn(s.fy, fe)
		ae := s.effectiveArea(fn, false, nil)
		m.fe[a], m.fn[a], m.ae[a], m.pn[a] = fe, fn, ae, fn*ae
		if !on {
			continue
		}
		tr.Step(pick(a, "F_e,x", "F_e,y"), clauseFe, "pi^2 E / (L_c/r)^2", fe, "MPa").
			Add("L_c", ax.Ke*ax.Length, "mm").Add("r", math.Sqrt(ax.I/s.ag), "mm").Add("E", s.e, "MPa").Noted(noteLc)
		formula := "0.658^(F_y/F_e) F_y"
		if s.fy/fe > 2.25 {
			formula = "0.877 F_e"
		}
		tr.Step(pick(a, "F_n,x", "F_n,y"), clauseFn, formula, fn, "MPa").Add("F_y", s.fy, "MPa").Add("F_e", fe, "MPa")
		if ae < s.ag {
			s.effectiveArea(fn, true, tr)
			tr.Step(pick(a, "A_e,x", "A_e,y"), clausePnE7, "A_g - sum (b - b_e) t", ae, "mm²").Add("A_g", s.ag, "mm²")
			tr.Step(pick(a, "P_n,x", "P_n,y"), clausePnE7, "F_n A_e", checks.KN(fn*ae), "kN").
				Add("F_n", fn, "MPa").Add("A_e", ae, "mm²")
		} else {
			tr.Step(pick(a, "P_n,x", "P_n,y"), clausePn, "F_n A_g", checks.KN(fn*ae), "kN").
				Add("F_n", fn, "MPa").Add("A_g", s.ag, "mm²")
		}
	}
	if known {
		m.pnMin = math.Min(m.pn[0], m.pn[1])
		if on {
			phi, omega := factor(mc.Options.AISCMethod, PhiC, OmegaC)
			tr.Step("P_n", clausePn, "min(P_n,x, P_n,y)", checks.KN(m.pnMin), "kN")
			if omega > 0 {
				tr.Step("P_c", clausePn, "P_n / Omega_c", checks.KN(m.pnMin/omega), "kN").Add("Omega_c", omega, "")
			} else {
				tr.Step("P_c", clausePn, "phi_c P_n", checks.KN(phi*m.pnMin), "kN").Add("phi_c", phi, "")
			}
		}
	}
}

// factor returns φ (LRFD) or, for ASD, Ω (and φ = 0).
func factor(method string, phi, omega float64) (float64, float64) {
	if method == "asd" {
		return 0, omega
	}
	return phi, 0
}

// available is φ R_n (LRFD) or R_n/Ω (ASD).
func available(method string, rn, phi, omega float64) float64 {
	if method == "asd" {
		return rn / omega
	}
	return phi * rn
}

// effectiveArea is A_e of E7 for the flexural buckling stress fn (MPa),
// tracing the effective widths when trace is on.
func (s *secCap) effectiveArea(fn float64, trace bool, tr *checks.Tracer) float64 {
	if s.fam == famCHS {
		return s.aeRound
	}
	ae := s.ag
	for k := range s.el[:s.nel] {
		e := &s.el[k]
		if !(e.lambda > e.lamR*math.Sqrt(s.fy/fn)) {
			continue
		}
		fel := math.Pow(e.c2*e.lamR/e.lambda, 2) * s.fy
		q := math.Sqrt(fel / fn)
		be := math.Min(e.b, e.b*(1-e.c1*q)*q)
		ae -= float64(e.count) * (e.b - be) * e.t
		if trace {
			tr.Step("b_e,"+e.part, clauseE7, "b (1 - c1 sqrt(F_el/F_n)) sqrt(F_el/F_n)", be, "mm").
				Add("b", e.b, "mm").Add("c1", e.c1, "").Add("F_el", fel, "MPa").Add("F_n", fn, "MPa")
		}
	}
	return ae
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
	fam, welded, note := sectionType(sec.Geometry, sec.Profile, mem.Material.Grade, mem.Material.Name)
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
	s.fam, s.welded, s.typeNote = fam, welded, note
	s.e, s.ag = mc.E, sec.A
	var g section.ISection
	scale := 1.0
	if fam == famI {
		g = unwrap(sec.Geometry).(section.ISection)
		if t, ok := sec.Geometry.(section.Transformed); ok && t.Scale > 0 {
			scale = t.Scale
		}
		hw := g.D - 2*g.Tf
		if iy := g.Tf * g.B * g.B * g.B / 6; iy > g.B*g.Tf*(g.D-g.Tf)*(g.D-g.Tf)/2+g.Tw*hw*hw*hw/12 {
			s.code, s.msg = checks.CodeUnsupportedProfile, msgUnsupportedAx
			return
		}
	}

	// Yield stress.
	on := tr.On()
	mat := &mem.Material
	round := fam == famCHS
	gfy, glabel, gok := 0.0, "", false
	if mat.Grade != "" {
		gfy, glabel, gok = gradeYield(mat.Grade, round)
	}
	if !gok && mat.Name != "" {
		gfy, glabel, gok = gradeYield(mat.Name, round)
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
	fy, e := s.fy, s.e
	re := math.Sqrt(e / fy)
	if on {
		tr.Step("F_y", clauseFy, "specified minimum yield stress", fy, "MPa").Noted(s.fyNote)
	}

	// Classification (B4.1).
	switch fam {
	case famI:
		var web section.Plate
		for k := range plates {
			if plates[k].Support == section.BothEdges {
				web = plates[k]
			}
		}
		h := web.Width - 2*web.Fillet
		if welded {
			h = web.Width
		}
		tw := web.Thickness
		s.kc = math.Min(0.76, math.Max(0.35, 4/math.Sqrt(h/tw)))
		bf, tf := g.B*scale/2, g.Tf*scale
		fl := element{part: "flange", b: bf, t: tf, lambda: bf / tf, count: 4, c1: 0.22, c2: 1.49}
		fl.lamR = 0.56 * re
		fl.lamP = [2]float64{0.38 * re, 0.38 * re}
		fl.lamRM = [2]float64{1.0 * re, 1.0 * re}
		if welded {
			fl.lamR = 0.64 * math.Sqrt(s.kc*e/fy)
			fl.lamRM[0] = 0.95 * math.Sqrt(s.kc*e/(0.7*fy))
		}
		fl.flange = [2]bool{true, true}
		// The flange outstand b is half the flange width, so two half
		// widths per flange lose (b − b_e) t each: count 4.
		wb := element{part: "web", b: h, t: tw, lambda: h / tw, count: 1, c1: 0.18, c2: 1.31}
		wb.lamR = 1.49 * re
		wb.lamP = [2]float64{3.76 * re, 0}
		wb.lamRM = [2]float64{5.70 * re, 0}
		s.el[0], s.el[1], s.nel = fl, wb, 2
	case famRHS:
		short := math.Inf(1)
		for k := range plates {
			short = math.Min(short, plates[k].Width)
		}
		for k := range plates {
			p := &plates[k]
			b := p.Width - 2*p.Fillet
			if p.Fillet <= 0 {
				b = p.Width - p.Thickness // B − 3t (B4.1b(d))
			}
			el := element{part: "wall", b: b, t: p.Thickness, lambda: b / p.Thickness, count: p.Count, c1: 0.20, c2: 1.38}
			el.lamR = 1.40 * re
			flangeMajor := p.Width == short
			el.flange = [2]bool{flangeMajor, !flangeMajor}
			for a := range el.flange {
				if el.flange[a] {
					el.lamP[a], el.lamRM[a] = 1.12*re, 1.40*re
				} else {
					el.lamP[a], el.lamRM[a] = 2.42*re, 5.70*re
				}
			}
			if flangeMajor {
				el.part = "wall (flange in major-axis bending)"
			} else {
				el.part = "wall (web in major-axis bending)"
			}
			if s.nel < len(s.el) {
				s.el[s.nel] = el
				s.nel++
			}
		}
	case famCHS:
		p := plates[0]
		s.dt = p.Width / p.Thickness
		s.dtLimN = 0.11 * e / fy
		if s.dt >= 0.45*e/fy {
			s.code, s.msg = checks.CodeUnsupportedProfile, msgRoundDt
			return
		}
		s.aeRound = s.ag
		if s.dt > s.dtLimN {
			s.aeRound = (0.038*e/(fy*s.dt) + 2.0/3.0) * s.ag
		}
		el := element{part: "wall", b: p.Width, t: p.Thickness, lambda: s.dt, count: 1}
		el.lamR = s.dtLimN
		el.lamP = [2]float64{0.07 * e / fy, 0.07 * e / fy}
		el.lamRM = [2]float64{0.31 * e / fy, 0.31 * e / fy}
		el.flange = [2]bool{true, true}
		s.el[0], s.nel = el, 1
	}
	for k := range s.el[:s.nel] {
		el := &s.el[k]
		el.slender = el.lambda > el.lamR
		for a := range el.classM {
			switch {
			case el.lamP[a] == 0:
				el.classM[a] = 0
			case el.lambda <= el.lamP[a]:
				el.classM[a] = 1
			case el.lambda <= el.lamRM[a]:
				el.classM[a] = 2
			default:
				el.classM[a] = 3
			}
		}
		if on {
			formula := "b / t"
			switch {
			case fam == famCHS:
				formula = "D / t"
			case fam == famI && el.part == "web":
				formula = "h / t_w"
			}
			st := tr.Step("lambda,"+el.part, clauseClass, formula, el.lambda, "").Add("b", el.b, "mm").Add("t", el.t, "mm").
				Add("lambda_r (compression)", el.lamR, "")
			for a := range el.classM {
				if el.classM[a] > 0 {
					st.Add(pick(a, "lambda_p (x)", "lambda_p (y)"), el.lamP[a], "").Add(pick(a, "lambda_r (x)", "lambda_r (y)"), el.lamRM[a], "")
				}
			}
			note := "nonslender in compression"
			if el.slender {
				note = "slender in compression (E7)"
			}
			st.Noted(withNote(note, classNote(el.classM)))
		}
	}
	if on && fam == famCHS && s.aeRound < s.ag {
		tr.Step("A_e", clauseE7Round, "(0.038 E / (F_y D/t) + 2/3) A_g", s.aeRound, "mm²").Add("D/t", s.dt, "").Add("A_g", s.ag, "mm²")
	}

	// Flexure: yielding and local buckling per axis; LTB parameters.
	s.zx, s.sx = sec.SMajor, sec.ZMajor // AISC Z is plastic, S elastic
	zs := [2]float64{sec.SMajor, sec.SMinor}
	ss := [2]float64{sec.ZMajor, sec.ZMinor}
	for a := range s.mp {
		s.mp[a] = fy * zs[a]
		if fam == famI && a == 1 {
			s.mp[a] = math.Min(fy*zs[a], 1.6*fy*ss[a])
		}
		mn, why, clause := s.mp[a], "yielding", clauseF2
		switch fam {
		case famI:
			if a == 1 {
				clause = clauseF6
			}
			fl, wb := &s.el[0], &s.el[1]
			if a == 0 && wb.classM[0] > 1 {
				mn, why = math.NaN(), ""
				s.axisMsg[a] = msgSlenderWeb
				break
			}
			fyS := 0.7 * fy * ss[a]
			switch fl.classM[a] {
			case 2:
				mn = s.mp[a] - (s.mp[a]-fyS)*(fl.lambda-fl.lamP[a])/(fl.lamRM[a]-fl.lamP[a])
				why = "flange local buckling, noncompact flange"
				if a == 0 {
					clause = clauseF3
				}
			case 3:
				if a == 0 {
					mn, why, clause = 0.9*e*s.kc*ss[a]/(fl.lambda*fl.lambda), "flange local buckling, slender flange", clauseF3
				} else {
					mn, why = 0.69*e/(fl.lambda*fl.lambda)*ss[a], "flange local buckling, slender flange (F_cr = 0.69 E/lambda²)"
				}
			}
		case famRHS:
			clause = clauseF7
			for k := range s.el[:s.nel] {
				el := &s.el[k]
				switch el.classM[a] {
				case 2:
					v := s.mp[a] - (s.mp[a]-fy*ss[a])*(el.lambda-el.lamP[a])/(el.lamRM[a]-el.lamP[a])
					if v < mn {
						mn = v
						why = "flange local buckling, noncompact flange (F7-2)"
						if !el.flange[a] {
							why = "web local buckling, noncompact web (F7-6)"
						}
					}
				case 3:
					mn, why = math.NaN(), ""
					s.axisMsg[a] = msgSlenderHSS
				}
				if math.IsNaN(mn) {
					break
				}
			}
		case famCHS:
			clause = clauseF8
			el := &s.el[0]
			switch el.classM[a] {
			case 2:
				mn, why = (0.021*e/s.dt+fy)*ss[a], "local buckling, noncompact wall (F8-2)"
			case 3:
				mn, why = 0.33*e/s.dt*ss[a], "local buckling, slender wall (F8-3, F8-4)"
			}
		}
		s.mnLocal[a] = math.Min(mn, s.mp[a])
		if math.IsNaN(mn) {
			s.mnLocal[a] = math.NaN()
		}
		s.mnNote[a] = why
		if on {
			tr.Step(pick(a, "M_p,x", "M_p,y"), clause, mpFormula(fam, a), checks.KNm(s.mp[a]), "kNm").
				Add("F_y", fy, "MPa").Add("Z", zs[a], "mm³").Add("S", ss[a], "mm³")
			if !math.IsNaN(s.mnLocal[a]) {
				tr.Step(pick(a, "M_n,x (local)", "M_n,y (local)"), clause, "yielding and local buckling", checks.KNm(s.mnLocal[a]), "kNm").Noted(why)
			} else {
				tr.Step(pick(a, "M_n,x (local)", "M_n,y (local)"), clause, "not implemented", math.NaN(), "kNm").Noted(s.axisMsg[a])
			}
		}
	}
	switch {
	case fam == famI:
		s.ltb = ltbI
		s.ry = math.Sqrt(sec.IMinor / sec.A)
		s.j, s.cw = sec.J, sec.Iw
		s.h0 = (g.D - g.Tf) * scale
		s.rts = math.Sqrt(math.Sqrt(sec.IMinor*sec.Iw) / s.sx)
	case fam == famRHS && math.Abs(sec.IMajor-sec.IMinor) > 1e-6*sec.IMajor:
		s.ltb = ltbHSS
		s.ry = math.Sqrt(sec.IMinor / sec.A)
		s.j = sec.J
	}
}

func classNote(c [2]int) string {
	name := func(k int) string {
		switch k {
		case 1:
			return "compact"
		case 2:
			return "noncompact"
		case 3:
			return "slender"
		}
		return "not compressed"
	}
	return "flexure x: " + name(c[0]) + ", y: " + name(c[1])
}

func withNote(a, b string) string {
	if b == "" {
		return a
	}
	return a + "; " + b
}

func mpFormula(fam family, a int) string {
	if fam == famI && a == 1 {
		return "min(F_y Z_y, 1.6 F_y S_y)"
	}
	return "F_y Z"
}

// ltbMn is M_n of lateral-torsional buckling about the major axis for the
// unbraced length lb (mm) and cb (F2.2 for I shapes, F7.4 for rectangular
// HSS); +Inf where the limit state does not apply.
func (s *secCap) ltbMn(lb, cb float64) (mn, lp, lr float64) {
	fy, e, mp := s.fy, s.e, s.mp[0]
	switch s.ltb {
	case ltbI:
		lp = 1.76 * s.ry * math.Sqrt(e/fy)
		jc := s.j / (s.sx * s.h0)
		lr = 1.95 * s.rts * e / (0.7 * fy) * math.Sqrt(jc+math.Sqrt(jc*jc+6.76*math.Pow(0.7*fy/e, 2)))
		switch {
		case lb <= lp:
			return math.Inf(1), lp, lr
		case lb <= lr:
			return math.Min(mp, cb*(mp-(mp-0.7*fy*s.sx)*(lb-lp)/(lr-lp))), lp, lr
		}
		x := lb / s.rts
		fcr := cb * math.Pi * math.Pi * e / (x * x) * math.Sqrt(1+0.078*jc*x*x)
		return math.Min(mp, fcr*s.sx), lp, lr
	case ltbHSS:
		ja := math.Sqrt(s.j * s.ag)
		lp = 0.13 * e * s.ry * ja / mp
		lr = 2 * e * s.ry * ja / (0.7 * fy * s.sx)
		switch {
		case lb <= lp:
			return math.Inf(1), lp, lr
		case lb <= lr:
			return math.Min(mp, cb*(mp-(mp-0.7*fy*s.sx)*(lb-lp)/(lr-lp))), lp, lr
		}
		return math.Min(mp, 2*e*cb*ja/(lb/s.ry)), lp, lr
	}
	return math.Inf(1), math.NaN(), math.NaN()
}

// combo collects the checks of one combination.
type combo struct {
	cx  *checks.CombinationContext
	tr  *checks.Tracer
	buf []checks.CapacityCheck
	n   int
}

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

// cbOf is C_b of the combination from the major axis's first-order end
// moments, and whether the diagram was linear.
func cbOf(ax *checks.AxisContext) (float64, bool) {
	mo := ax.Moments
	if ax.SignAmbiguous || mo.CurvatureUnknown || ax.Setup.Transverse || mo.Transverse || mo.InteriorUnknown {
		return 1, false
	}
	mm := math.Max(math.Abs(mo.Start), math.Abs(mo.End))
	if math.Abs(mo.Peak) > mm*(1+1e-6)+checks.MomentTolerance {
		return 1, false
	}
	return Cb(mo.Start, mo.End), true
}

// Capacity implements checks.RuleSet: the member strength checks of one
// combination with the amplified moments M_r of both axes (scope full).
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
	method := mc.Options.AISCMethod
	on := tr.On()
	k := combo{cx: cx, tr: tr, buf: sc.arena.Reserve(maxChecks)}
	pr := cx.Actions.NStar
	var mr, mcap [2]float64
	for a := range mr {
		mr[a] = math.Abs(out.Axes[a].MAmp.F())
		if mr[a] <= checks.MomentTolerance {
			mr[a] = 0
		}
	}

	// Flexure (F2 to F8).
	for a := range mr {
		mn := s.mnLocal[a]
		if math.IsNaN(mn) {
			if mr[a] > 0 {
				cx.Reason(checks.CodeUnsupportedProfile, s.axisMsg[a], checks.Axis(a).String())
				mr[a] = math.NaN()
			}
			mcap[a] = math.Inf(1)
			continue
		}
		if a == 0 && s.ltb != ltbNone && !math.IsNaN(m.lb) {
			cb, linear := cbOf(cx.Axes[0])
			ltb, lp, lr := s.ltbMn(m.lb, cb)
			if on {
				note := noteCbLinear
				if !linear {
					note = noteCbOne
				}
				tr.Step("C_b", clauseCb, "12.5 M_max / (2.5 M_max + 3 M_A + 4 M_B + 3 M_C)", cb, "").Noted(note)
				clause := clauseF2LTB
				if s.ltb == ltbHSS {
					clause = clauseF7LTB
				}
				st := tr.Step("M_n,x (LTB)", clause, "lateral-torsional buckling", checks.KNm(ltb), "kNm").
					Add("L_b", m.lb, "mm").Add("L_p", lp, "mm").Add("L_r", lr, "mm").Add("C_b", cb, "")
				if math.IsInf(ltb, 1) {
					st.Noted("L_b ≤ L_p: the limit state does not apply")
				}
			}
			mn = math.Min(mn, ltb)
		} else if a == 0 && s.ltb != ltbNone {
			if mr[a] > 0 {
				mr[a] = math.NaN() // no length: missing-length is the engine's reason
			}
			mcap[a] = math.Inf(1)
			continue
		}
		mcap[a] = available(method, mn, PhiB, OmegaB)
		if on {
			if method == "asd" {
				tr.Step(pick(a, "M_cx", "M_cy"), flexClause(s, a), "M_n / Omega_b", checks.KNm(mcap[a]), "kNm").
					Add("M_n", checks.KNm(mn), "kNm").Add("Omega_b", OmegaB, "")
			} else {
				tr.Step(pick(a, "M_cx", "M_cy"), flexClause(s, a), "phi_b M_n", checks.KNm(mcap[a]), "kNm").
					Add("M_n", checks.KNm(mn), "kNm").Add("phi_b", PhiB, "")
			}
		}
		if !math.IsNaN(mr[a]) {
			k.add(pick(a, CheckFlexureMajor, CheckFlexureMinor), pick(a, flexClause(s, 0), flexClause(s, 1)), mr[a], mcap[a], "N·mm",
				checks.Axis(a).String())
		}
	}

	// Axial strength.
	var pc float64
	name, clause := CheckCompression, clausePn
	if pr >= 0 {
		if math.IsNaN(m.pnMin) {
			out.Capacity = sc.arena.Commit(k.n)
			return
		}
		pc = available(method, m.pnMin, PhiC, OmegaC)
		if m.ae[0] < s.ag || m.ae[1] < s.ag {
			clause = clausePnE7
		}
	} else {
		name, clause = CheckTension, clausePt
		pc = available(method, s.fy*s.ag, PhiT, OmegaT)
		if on {
			tr.Step("P_c (tension)", clausePt, "phi_t F_y A_g or F_y A_g / Omega_t", checks.KN(pc), "kN").
				Add("F_y", s.fy, "MPa").Add("A_g", s.ag, "mm²")
		}
	}
	k.add(name, clause, math.Abs(pr), pc, "N", "")

	// Interaction (H1.1).
	if math.IsNaN(mr[0]) || math.IsNaN(mr[1]) {
		out.Capacity = sc.arena.Commit(k.n)
		return
	}
	v, hc := Interaction(math.Abs(pr), pc, mr[0], mcap[0], mr[1], mcap[1])
	if on {
		formula := "P_r/P_c + 8/9 (M_rx/M_cx + M_ry/M_cy)"
		if hc == clauseH1b {
			formula = "P_r/(2 P_c) + (M_rx/M_cx + M_ry/M_cy)"
		}
		tr.Step("H1-1", hc, formula, v, "").Add("P_r", checks.KN(pr), "kN").Add("P_c", checks.KN(pc), "kN").
			Add("M_rx", checks.KNm(mr[0]), "kNm").Add("M_cx", checks.KNm(mcap[0]), "kNm").
			Add("M_ry", checks.KNm(mr[1]), "kNm").Add("M_cy", checks.KNm(mcap[1]), "kNm")
	}
	k.add(CheckInteraction, hc, v, 1, "", "")
	out.Capacity = sc.arena.Commit(k.n)
}

func flexClause(s *secCap, a int) string {
	switch s.fam {
	case famRHS:
		return clauseF7
	case famCHS:
		return clauseF8
	}
	if a == 1 {
		return clauseF6
	}
	if s.el[0].classM[0] > 1 {
		return clauseF3
	}
	return clauseF2
}

// capacityAssumptions are the run assumptions of scope full.
func capacityAssumptions(method string) []string {
	f := "LRFD: phi_c = phi_b = phi_t = 0.90"
	if method == "asd" {
		f = "ASD: Omega_c = Omega_b = Omega_t = 1.67"
	}
	return []string{
		"AISC 360 capacity (scope full), " + f + "; P_r and M_r are the design actions (M_r amplified by App. 8) taken positive in H1.1",
		"AISC 360 capacity: Fy from the model, else the request's default, else the ASTM grade named in the model (A992, A36, A572 Gr 50, " +
			"A500 Gr B/C, A53 Gr B, A1085); HSS wall thickness as given in the model (B4.2 uses the design wall thickness, 0.93 t_nom for " +
			"ERW HSS: give that one)",
		"AISC 360 capacity: P_n by E3 (flexural buckling) with L_c = K L of each axis (the sway K on a sway axis, effective length " +
			"method App. 7.2.3(b); K = 1 where B2 ≤ 1.1, permitted by App. 7.2.3(a), is not applied) and E7 effective areas for slender " +
			"elements; torsional and flexural-torsional buckling (E4) are not checked (doubly symmetric I and HSS with torsional " +
			"unbraced length not above the flexural ones)",
		"AISC 360 capacity: M_n by F2/F3 (I major axis, compact web), F6 (I minor axis), F7 (rectangular HSS) and F8 (round HSS); " +
			"lateral-torsional buckling over L_b = the member length (bracing at the ends only) with C_b from the first-order end " +
			"moments (F1-1), 1.0 where the diagram is not linear; F4, F5 and slender HSS walls in flexure are not implemented (needs-analysis)",
		"AISC 360 capacity: shear (G) is not checked; the H1.3 alternative for single-axis flexure is not used",
	}
}
