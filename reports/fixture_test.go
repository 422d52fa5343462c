package reports

import (
	"math"
	"time"

	"swaygate/checks"
	"swaygate/checks/section"
)

// The fixture is an invented two-storey steel frame (data for tests only):
// Level 1 (C1 a sway column, C2 a leaning gravity column) and Level 2 (C3 a
// sway column, C4 with no section and no minor-axis restraint, C5 restrained
// about its minor axis only every second floor, which fails), checked under
// two combinations, plus one concrete column that is skipped. Numbers follow
// the AS 4100 steps of design §5.3 with E = 200 000 MPa, so the golden hand
// calculations add up; the section properties are those of sections.md.

const (
	fxE    = 200000.0 // MPa
	fxULS1 = "ULS-1 1.2G+1.5Q"
	fxULS2 = "ULS-2 0.9G+Wu"
)

var fxRun = Run{
	RunID:       "6f1c9a52-8f0e-4c1b-9a6e-3d2b1c0a9e11",
	CreatedAt:   time.Date(2025, 1, 15, 9, 30, 0, 0, time.UTC),
	ToolVersion: "0.1.0-test",
	Project:     "demo-frame",
	Model: ModelInfo{
		File:      "demo-frame.ifc",
		SHA256:    "3b1f0c5e9a7d4e2f8c6b0a1d2e3f405162738495a6b7c8d9e0f1a2b3c4d5e6f7",
		Schema:    "IFC4",
		Instances: 1834,
	},
	Gate: Gate{Policy: GateFail, Passed: false},
}

func sec310UC968() *section.Properties {
	return &section.Properties{Profile: "310UC96.8", Shape: "I", A: 12400, IMajor: 2.23e8, IMinor: 7.29e7,
		RMajor: 134, RMinor: 76.7, ZMajor: 1.45e6, ZMinor: 4.78e5, SMajor: 1.6e6, SMinor: 7.25e5,
		J: 9.28e5, Iw: 1.56e12, Source: "computed"}
}

func sec250UC895() *section.Properties {
	return &section.Properties{Profile: "250UC89.5", Shape: "I", A: 11400, IMajor: 1.43e8, IMinor: 4.84e7,
		RMajor: 112, RMinor: 65.2, ZMajor: 1.1e6, ZMinor: 3.78e5, SMajor: 1.23e6, SMinor: 5.75e5,
		J: 1.04e6, Iw: 7.13e11, Source: "computed"}
}

func sec200UC462() *section.Properties {
	return &section.Properties{Profile: "200UC46.2", Shape: "I", A: 5900, IMajor: 4.59e7, IMinor: 1.53e7,
		RMajor: 88.2, RMinor: 51, ZMajor: 4.51e5, ZMinor: 1.51e5, SMajor: 5e5, SMinor: 2.3e5,
		J: 2.28e5, Iw: 1.42e11, Source: "computed"}
}

// act builds the actions of one combination: N* in kN, moments in kNm.
func act(comb string, nKN, majS, majE, minS, minE float64) checks.Actions {
	return checks.Actions{
		Combination: comb, NStar: nKN * 1e3, Source: "side-car",
		Moments: [2]checks.AxisMoments{
			{Start: majS * 1e6, End: majE * 1e6},
			{Start: minS * 1e6, End: minE * 1e6},
		},
	}
}

func axes(major, minor checks.AxisInput) [2]checks.AxisInput {
	return [2]checks.AxisInput{major, minor}
}

func fxModel() *checks.Model {
	l1 := func(m checks.Member) checks.Member {
		m.StoreyKey, m.Storey, m.StoreyElevation = "#38", "Level 1", 0
		m.BaseZ, m.TopZ = 0, 4200
		return m
	}
	l2 := func(m checks.Member) checks.Member {
		m.StoreyKey, m.Storey, m.StoreyElevation = "#52", "Level 2", 4200
		m.BaseZ, m.TopZ = 4200, 7800
		return m
	}
	pset := func(r checks.Restraint, ke float64, d checks.Direction) checks.AxisInput {
		return checks.AxisInput{Restraint: r, Ke: ke, Direction: d, Source: "property-set"}
	}
	steel := checks.Material{E: fxE, Fy: 300, Grade: "300PLUS", Source: "model"}
	members := []checks.Member{
		l1(checks.Member{
			GlobalID: "1hL2Wb0aL9$Qm8sZkT4p01", Entity: "IfcColumn", Name: "C1", Tag: "A1", Ref: "#210",
			Length: 4200, Section: sec310UC968(), Material: steel,
			Axes:    axes(pset(checks.Sway, 1.2, checks.DirY), pset(checks.Braced, 1, checks.DirX)),
			Actions: []checks.Actions{act(fxULS1, 1450, 45, -62, 5, 5), act(fxULS2, 980, 120, -95, 3, 4)},
		}),
		l1(checks.Member{
			GlobalID: "1hL2Wb0aL9$Qm8sZkT4p02", Entity: "IfcColumn", Name: "C2", Tag: "B1", Ref: "#245",
			Length: 4200, Section: sec310UC968(), Material: steel,
			Axes:    axes(pset(checks.Braced, 1, checks.DirY), pset(checks.Braced, 1, checks.DirX)),
			Actions: []checks.Actions{act(fxULS1, 1900, 8, 10, 2, 2), act(fxULS2, 1300, 5, 6, 1, 1)},
		}),
		l2(checks.Member{
			GlobalID: "1hL2Wb0aL9$Qm8sZkT4p03", Entity: "IfcColumn", Name: "C3", Tag: "A2", Ref: "#280",
			Length: 3600, Section: sec250UC895(), Material: checks.Material{Fy: 300, Grade: "300PLUS", Source: "model"},
			Axes:    axes(pset(checks.Sway, 1.2, checks.DirY), pset(checks.Braced, 1, checks.DirX)),
			Actions: []checks.Actions{act(fxULS1, 700, 60, -75, 4, 3), act(fxULS2, 480, 95, -88, 2, 2)},
		}),
		l2(checks.Member{
			GlobalID: "1hL2Wb0aL9$Qm8sZkT4p04", Entity: "IfcColumn", Name: "C4", Tag: "B2", Ref: "#315",
			Length: 3600, Material: steel,
			Axes:    axes(pset(checks.Sway, 1.2, checks.DirY), checks.AxisInput{Direction: checks.DirX}),
			Actions: []checks.Actions{act(fxULS1, 650, 20, -25, 0, 0), act(fxULS2, 450, 30, -28, 0, 0)},
			Problems: []checks.Reason{
				{Code: checks.CodeMissingSection, Message: "no profile found on the column or its type", Ref: "#315"},
				{Code: checks.CodeMissingRestraint, Message: "no restraint data for the minor axis", Axis: "minor", Ref: "#315"},
			},
		}),
		l2(checks.Member{
			GlobalID: "1hL2Wb0aL9$Qm8sZkT4p05", Entity: "IfcColumn", Name: "C5", Tag: "C2", Ref: "#350",
			Length: 3600, Section: sec200UC462(), Material: steel,
			Axes: axes(pset(checks.Sway, 1.2, checks.DirY),
				checks.AxisInput{Restraint: checks.Braced, Ke: 1, BucklingLength: 7200, Direction: checks.DirX, Source: "property-set"}),
			Actions: []checks.Actions{act(fxULS1, 620, 15, -18, 6, -4), act(fxULS2, 410, 40, -36, 2, -1)},
		}),
	}
	return &checks.Model{
		Members:      members,
		Combinations: []string{fxULS1, fxULS2},
		Skipped: []checks.Skipped{{GlobalID: "1hL2Wb0aL9$Qm8sZkT4p09", Name: "CC1", Entity: "IfcColumn",
			Reason: checks.CodeNotSteel, Message: "material \"Concrete 40 MPa\""}},
		Warnings: []checks.Reason{{Code: checks.CodeUnknownGlobalID,
			Message: "GlobalId 3Zq8PfG1D0uA7yVw9cRk11 in the actions file is not in the model", Ref: "actions.csv:14"}},
		Assumptions: []string{"actions from actions.csv (side-car): first-order, internal end moments"},
	}
}

// fxNom is pi² E I / (ke L)² in N.
func fxNom(e, i, ke, l float64) float64 { return math.Pi * math.Pi * e * i / ((ke * l) * (ke * l)) }

// fxReport runs the fixture through a small hand implementation of the AS
// 4100 storey method (design §5.3) and returns the engine-shaped result.
func fxReport(trace bool) *checks.Report {
	m := fxModel()
	rep := &checks.Report{Standard: "as4100", SwayMethod: "storey", Scope: "stability",
		Assumptions: append([]string{
			"storey method: one structure per storey with a rigid diaphragm, columns spanning the storey, no plan torsion",
			"storey Level 1 braced in X", "storey Level 2 braced in X",
		}, m.Assumptions...),
		Warnings: m.Warnings, Skipped: m.Skipped}

	type sums struct{ noms, nstar, a1, a2, b1, b2 float64 }
	type key struct{ storey, comb string }
	st := map[key]*sums{}
	counts := map[key][2]int{}
	nomb := func(mb *checks.Member, ax checks.Axis) float64 {
		in := mb.Axes[ax]
		if mb.Section == nil || in.Ke == 0 {
			return math.NaN()
		}
		kb := in.Ke
		if in.Restraint == checks.Sway {
			kb = 1
		}
		l := mb.Length
		if in.BucklingLength > 0 {
			l = in.BucklingLength
		}
		return fxNom(fxE, iOf(mb.Section, ax), kb, l)
	}
	// Storey sums in Y (the only sway direction); every column gives load,
	// sway columns that are stable give stiffness.
	for i := range m.Members {
		mb := &m.Members[i]
		for _, a := range mb.Actions {
			k := key{mb.Storey, a.Combination}
			s := st[k]
			if s == nil {
				s = &sums{}
				st[k] = s
			}
			n := math.Max(a.NStar, 0)
			s.nstar += n
			s.a2 += n / mb.Length
			s.b2 += n * n / mb.Length
			c := counts[k]
			in := mb.Axes[checks.Major]
			stable := !(n >= nomb(mb, checks.Minor)) && !(n >= nomb(mb, checks.Major))
			if in.Restraint == checks.Sway {
				c[0]++
				if mb.Section != nil && stable {
					noms := fxNom(fxE, mb.Section.IMajor, in.Ke, mb.Length)
					s.a1 += noms / mb.Length
					s.b1 += noms * n / mb.Length
				}
			} else {
				c[1]++
			}
			counts[k] = c
		}
	}
	lambda := func(storey, comb string) float64 {
		s := st[key{storey, comb}]
		return math.Min(s.a1/s.a2, s.b1/s.b2)
	}
	for _, storey := range []struct {
		key, name string
		elev      float64
	}{{"#38", "Level 1", 0}, {"#52", "Level 2", 4200}} {
		for _, comb := range m.Combinations {
			s := st[key{storey.name, comb}]
			c := counts[key{storey.name, comb}]
			fa, fb := s.a1/s.a2, s.b1/s.b2
			form := "A"
			if fb < fa {
				form = "B"
			}
			rep.Storeys = append(rep.Storeys, checks.StoreyResult{
				StoreyKey: storey.key, Name: storey.name, Elevation: checks.Num(storey.elev),
				Direction: checks.DirY, Combination: comb, LambdaC: checks.Num(lambda(storey.name, comb)),
				FormA: checks.Num(fa), FormB: checks.Num(fb), FormDrift: checks.Null, Form: form,
				SwayMembers: c[0], LeaningMembers: c[1], SumNStar: checks.Num(s.nstar), Complete: true,
			})
		}
	}

	for i := range m.Members {
		mb := &m.Members[i]
		el := checks.Element{Member: mb, E: fxE, ESource: mb.Material.Source, GoverningUtilisation: checks.Null}
		if mb.Material.E == 0 {
			el.ESource = "default"
			el.Reasons = append(el.Reasons, checks.Reason{Code: checks.CodeAssumedModulus,
				Message: "E not given in the model: 200000 MPa (AS 4100) assumed"})
		}
		el.Reasons = append(el.Reasons, mb.Problems...)
		var steps []checks.Step
		bestDelta := -1.0
		for _, a := range mb.Actions {
			cr := checks.CombinationResult{Name: a.Combination, Theory: a.Theory, NStar: checks.Num(a.NStar)}
			for _, ax := range checks.Axes {
				lam := math.NaN()
				leaning := false
				if mb.Axes[ax].Direction == checks.DirY {
					lam = lambda(mb.Storey, a.Combination)
					leaning = mb.Axes[ax].Restraint == checks.Braced
				}
				ar, rs := fxAxis(mb, ax, &a, lam, leaning, &steps)
				cr.Axes[ax] = ar
				cr.Verdict = cr.Verdict.Worse(ar.Verdict)
				el.Reasons = append(el.Reasons, rs...)
			}
			for _, r := range mb.Problems {
				cr.Verdict = cr.Verdict.Worse(r.Verdict())
			}
			d := math.Max(nz(cr.Axes[0].DeltaM.F()), nz(cr.Axes[1].DeltaM.F()))
			if cr.Verdict > el.Verdict || (cr.Verdict == el.Verdict && d > bestDelta) || el.GoverningCombination == "" {
				el.GoverningCombination, bestDelta = cr.Name, d
			}
			el.Verdict = el.Verdict.Worse(cr.Verdict)
			el.Combinations = append(el.Combinations, cr)
		}
		if trace {
			el.Trace = steps
		}
		rep.Elements = append(rep.Elements, el)
		rep.Summary.Members++
		switch el.Verdict {
		case checks.Pass:
			rep.Summary.Pass++
		case checks.Fail:
			rep.Summary.Fail++
		default:
			rep.Summary.NeedsAnalysis++
		}
	}
	return rep
}

func nz(f float64) float64 {
	if math.IsNaN(f) {
		return 0
	}
	return f
}

func iOf(p *section.Properties, ax checks.Axis) float64 {
	if ax == checks.Minor {
		return p.IMinor
	}
	return p.IMajor
}

// fxAxis computes one axis of one combination (AS 4100 4.4 and 4.6.2).
func fxAxis(mb *checks.Member, ax checks.Axis, a *checks.Actions, lam float64, leaning bool, steps *[]checks.Step) (checks.AxisResult, []checks.Reason) {
	in := mb.Axes[ax]
	axis := ax.String()
	mo := a.Moments[ax]
	mStar := math.Max(math.Abs(mo.Start), math.Abs(mo.End))
	r := checks.AxisResult{Restraint: in.Restraint, Leaning: leaning, Direction: in.Direction,
		Ke: checks.Null, Length: checks.Num(mb.Length), Nom: checks.Null, Nomb: checks.Null, LambdaC: checks.Null,
		BetaM: checks.Null, Cm: checks.Null, DeltaB: checks.Null, DeltaS: checks.Null, DeltaM: checks.Null,
		MStar: checks.Num(mStar), MAmp: checks.Null}
	if in.BucklingLength > 0 {
		r.Length = checks.Num(in.BucklingLength)
	}
	if in.Ke > 0 {
		r.Ke = checks.Num(in.Ke)
	}
	step := func(q, clause, formula string, v float64, unit string) *checks.Step {
		*steps = append(*steps, checks.Step{Quantity: q, Clause: clause, Formula: formula, Value: v, Unit: unit,
			Combination: a.Combination, Axis: axis})
		return &(*steps)[len(*steps)-1]
	}
	if mb.Section == nil || in.Ke == 0 {
		r.Verdict = checks.NeedsAnalysis
		return r, nil
	}
	nStar := a.NStar
	i := iOf(mb.Section, ax)
	l := r.Length.F()
	nom := fxNom(fxE, i, in.Ke, l)
	r.Nom = checks.Num(nom)
	step("N_om,"+axis, "AS 4100 4.6.2", "pi^2 E I / (ke L)^2", nom/1e3, "kN").
		Add("E", fxE, "MPa").Add("I", i, "mm4").Add("ke", in.Ke, "").Add("L", l, "mm")
	kb := in.Ke
	if in.Restraint == checks.Sway {
		kb = 1
	}
	nomb := fxNom(fxE, i, kb, l)
	r.Nomb = checks.Num(nomb)
	if in.Restraint == checks.Sway {
		step("N_omb,"+axis, "AS 4100 4.6.2", "pi^2 E I / (ke_b L)^2", nomb/1e3, "kN").
			Add("E", fxE, "MPa").Add("I", i, "mm4").Add("ke_b", kb, "").Add("L", l, "mm")
	}
	m1, m2 := mo.Start, mo.End
	if math.Abs(m1) > math.Abs(m2) {
		m1, m2 = m2, m1
	}
	beta := -1.0
	if m2 != 0 {
		beta = math.Abs(m1) / math.Abs(m2)
		if (m1 < 0) == (m2 < 0) && m1 != 0 {
			beta = -beta
		}
	}
	r.BetaM = checks.Num(beta)
	step("beta_m,"+axis, "AS 4100 4.4.2.2", "M1/M2, reverse curvature positive", beta, "").
		Add("M1", m1/1e6, "kNm").Add("M2", m2/1e6, "kNm")
	cm := math.Min(1, 0.6-0.4*beta)
	r.Cm = checks.Num(cm)
	step("c_m,"+axis, "AS 4100 4.4.2.2", "min(1, 0.6 - 0.4 beta_m)", cm, "").Add("beta_m", beta, "")
	if nStar >= nomb {
		r.Verdict = checks.Fail
		return r, []checks.Reason{{Code: checks.CodeUnstable, Combination: a.Combination, Axis: axis,
			Message: "N* = " + fmtSig(nStar/1e3, 4) + " kN >= N_omb = " + fmtSig(nomb/1e3, 4) + " kN: the member buckles between its ends"}}
	}
	db := math.Max(1, cm/(1-nStar/nomb))
	r.DeltaB = checks.Num(db)
	step("delta_b,"+axis, "AS 4100 4.4.2.2", "max(1, c_m / (1 - N*/N_omb))", db, "").
		Add("c_m", cm, "").Add("N*", nStar/1e3, "kN").Add("N_omb", nomb/1e3, "kN")
	dm := db
	if math.IsNaN(lam) {
		r.LambdaC = checks.Num(nomb / nStar)
	} else {
		r.LambdaC = checks.Num(lam)
		ds := 1 / (1 - 1/lam)
		r.DeltaS = checks.Num(ds)
		step("delta_s,"+axis, "AS 4100 4.4.2.3", "1 / (1 - 1/lambda_c)", ds, "").Add("lambda_c", lam, "")
		dm = math.Max(db, ds)
	}
	r.DeltaM = checks.Num(dm)
	r.MAmp = checks.Num(dm * mStar)
	step("M*,"+axis, "AS 4100 4.4.2.3", "delta_m M*_m", dm*mStar/1e6, "kNm").
		Add("delta_m", dm, "").Add("M*_m", mStar/1e6, "kNm")
	if dm > 1.4 {
		r.Verdict = checks.NeedsAnalysis
		return r, []checks.Reason{{Code: checks.CodeSecondOrderRequired, Combination: a.Combination, Axis: axis,
			Message: "delta_m > 1.4"}}
	}
	var rs []checks.Reason
	if leaning && mStar > 0 && a.Combination == fxULS1 {
		rs = append(rs, checks.Reason{Code: checks.CodeMixedSwayFlags, Axis: axis,
			Message: "leaning column carries end moments: check for a braced bay"})
	}
	return r, rs
}
