package ifc

import (
	"math"
	"sort"
	"strings"

	"swaygate/checks"
	"swaygate/ifcstep"
)

// assignActions gives every member its actions per combination, from the
// side-car (when given: the only source), else from the model's analysis
// results, else from Swaygate_DesignActions, and fixes the model's list of
// combinations.
func (x *extractor) assignActions() {
	if x.opt.Actions != nil {
		x.sidecarActions()
		return
	}
	ms := x.model.Members
	var combos []string
	seen := map[string]bool{}
	addCombo := func(n string) {
		if !seen[n] {
			seen[n] = true
			combos = append(combos, n)
		}
	}

	// Combinations with results, in the order of their load groups.
	var sets []*resultSet
	for _, rs := range x.results {
		if rs.use {
			sets = append(sets, rs)
		}
	}
	sort.Slice(sets, func(i, j int) bool { return sets[i].group.id < sets[j].group.id })
	for _, rs := range sets {
		addCombo(rs.name)
	}
	var declared []*loadGroup
	withResults := map[uint32]bool{}
	for _, rs := range sets {
		withResults[rs.group.id] = true
	}
	for _, g := range x.groups {
		if g.combination && !withResults[g.id] {
			declared = append(declared, g)
		}
	}
	sort.Slice(declared, func(i, j int) bool { return declared[i].id < declared[j].id })
	if len(declared) > 0 {
		names := make([]string, len(declared))
		for i, g := range declared {
			names[i] = quote(g.name)
		}
		if len(sets) > 0 {
			x.warn("combinations-without-results", itoa(len(declared))+" load combination(s) of the model have no results and are not checked: "+
				strings.Join(names, ", "), refID(declared[0].id))
		} else {
			for _, g := range declared {
				addCombo(g.name)
			}
			x.warn("combinations-without-results", "the model's "+itoa(len(declared))+" load combination(s) have no member results: "+
				strings.Join(names, ", "), refID(declared[0].id))
		}
	}

	fromResults := map[string]bool{}
	for i := range ms {
		for k := range ms[i].Actions {
			a := &ms[i].Actions[k]
			if a.Source == "ifc-results" {
				fromResults[a.Combination] = true
			} else {
				addCombo(a.Combination)
			}
		}
	}
	x.model.Combinations = combos
	x.axialSignSuspect(fromResults)

	if len(combos) == 0 {
		onlyCases := false
		for _, rs := range x.results {
			if rs.group != nil && rs.group.predefined == "LOAD_CASE" {
				onlyCases = true
			}
		}
		for i := range ms {
			if onlyCases {
				continue // the engine reports no-design-combinations
			}
			ms[i].Problems = append(ms[i].Problems, checks.Reason{Code: checks.CodeMissingActions,
				Message: "no design actions: no side-car, no analysis results of load combinations, no " + psetDesignActions})
		}
	}
}

// memberActions reads one member's actions from the model: its analysis
// results, else its Swaygate_DesignActions.
func (x *extractor) memberActions(m *checks.Member, a *memberAux) {
	if a.am != nil {
		x.resultActions(m, a)
	}
	if len(m.Actions) == 0 {
		x.psetActions(m, a)
	}
}

// resultActions reads the member's analysis results, one Actions per
// checked result set.
func (x *extractor) resultActions(m *checks.Member, a *memberAux) {
	am := a.am
	results := x.memberResults(am)
	if len(results) > 0 && m.Actions == nil {
		m.Actions = make([]checks.Actions, 0, len(results))
	}
	var sfb [8]sectionForce
	for _, mr := range results {
		name := mr.set.name
		problem := func(code, msg string) {
			m.Problems = append(m.Problems, checks.Reason{Code: code, Message: msg, Combination: name, Ref: mr.ref})
		}
		if len(mr.stations) == 0 {
			continue
		}
		st := mr.stations
		if mr.global {
			local := false
			if len(st) == 2 && am.hasAxes {
				if !balanced(st[0], st[1], am.x, am.length) && balanced(st[0], st[1], vec{1, 0, 0}, am.length) {
					local = true
					problem("global-coords-suspect", "results declared GLOBAL_COORDS balance only when read in the member's local axes: read as local")
				}
			}
			if !local {
				if !am.hasAxes {
					problem(checks.CodeMissingActions, "results in global coordinates but the analytical member has no usable Axis: they cannot be resolved")
					continue
				}
				st = toLocal(st, am)
			}
		}
		if !a.phiOK {
			problem(checks.CodeMissingActions, "the results cannot be resolved onto the member's principal axes (no section or no analytical Axis)")
			continue
		}
		conv := x.opt.Convention
		det, decided := ConventionAuto, false
		if len(st) > 2 {
			det, decided = ConventionSectionForces, true
		} else if len(st) == 2 {
			det, decided = detectConvention(st[0].f[0], st[1].f[0])
		}
		ambiguous := false
		switch {
		case conv != ConventionAuto:
			if decided && det != conv {
				problem("sign-convention-declared", "the axial pattern suggests "+det.String()+"; the declared "+conv.String()+" are used")
			}
		case decided:
			conv = det
		default:
			ambiguous = true
		}
		var act checks.Actions
		act.Combination, act.Theory, act.Source, act.Ref = name, mr.set.theory, "ifc-results", mr.ref
		if !ambiguous {
			act.NStar, act.Moments = diagram(appendSectionForces(sfb[:0], st, conv), a.phi, am.length)
		} else {
			n1, m1 := diagram(appendSectionForces(sfb[:0], st, ConventionSectionForces), a.phi, am.length)
			n2, m2 := diagram(appendSectionForces(sfb[:0], st, ConventionEndForces), a.phi, am.length)
			act.NStar, act.Moments = math.Max(n1, n2), m1
			for k := range act.Moments {
				mo := &act.Moments[k]
				mo.Peak = math.Max(checks.MaxMoment(&m1[k]), checks.MaxMoment(&m2[k]))
				mo.Transverse = m1[k].Transverse || m2[k].Transverse
				mo.CurvatureUnknown = true
			}
			problem(checks.CodeSignConventionAmbiguous, "the axial forces at the ends ("+ftoa(st[0].f[0]/1e3)+" and "+
				ftoa(st[len(st)-1].f[0]/1e3)+" kN) do not tell section forces from end forces: the curvature is taken as unknown (beta_m = -1)")
		}
		m.Actions = append(m.Actions, act)
	}
}

// toLocal resolves stations given in the analysis model's coordinates onto
// the member's local axes.
func toLocal(st []station, am *analyticalMember) []station {
	out := make([]station, len(st))
	for i, s := range st {
		out[i] = station{x: s.x,
			f: vec{s.f.dot(am.x), s.f.dot(am.y), s.f.dot(am.z)},
			m: vec{s.m.dot(am.x), s.m.dot(am.y), s.m.dot(am.z)}}
	}
	return out
}

// psetActions reads Swaygate_DesignActions of the occurrence (one
// combination, named by the set's Description or "design").
func (x *extractor) psetActions(m *checks.Member, a *memberAux) {
	var set ifcstep.Instance
	for _, s := range a.psets.occ {
		if s.Type() == "IFCPROPERTYSET" && psetIs(s, psetDesignActions) {
			set = s
			break
		}
	}
	if set.ID() == 0 {
		return
	}
	props := x.properties(set, pPsetProps)
	name := strings.TrimSpace(text(set.Attr(pDescription)))
	if name == "" {
		name = "design"
	}
	n, ok := props.number(x, "AxialCompression", qForce)
	if !ok {
		m.Problems = append(m.Problems, checks.Reason{Code: checks.CodeMissingActions, Combination: name,
			Message: psetDesignActions + " has no AxialCompression", Ref: ref(set)})
		return
	}
	act := checks.Actions{Combination: name, NStar: n, Source: "property-set", Ref: ref(set)}
	for k, nm := range [4]string{"MomentMajorStart", "MomentMajorEnd", "MomentMinorStart", "MomentMinorEnd"} {
		v, _ := props.number(x, nm, qTorque)
		mo := &act.Moments[k/2]
		if k%2 == 0 {
			mo.Start = v
		} else {
			mo.End = v
		}
	}
	endMomentsOnly(m, &act, [2]float64{math.NaN(), math.NaN()})
	m.Actions = append(m.Actions, act)
}

// endMomentsOnly marks the axes of actions that give only end moments: with
// a transverse load flagged (TransverseLoadMajor/Minor) the peak is unknown
// unless given.
func endMomentsOnly(m *checks.Member, act *checks.Actions, peaks [2]float64) {
	for k := range act.Moments {
		mo := &act.Moments[k]
		if !math.IsNaN(peaks[k]) {
			mo.Peak = peaks[k]
			if m.Axes[k].TransverseLoad {
				mo.Transverse = true
			}
			continue
		}
		if m.Axes[k].TransverseLoad {
			mo.Transverse, mo.InteriorUnknown = true, true
		}
	}
}

// sidecarActions takes every member's actions from the side-car.
func (x *extractor) sidecarActions() {
	sc := x.opt.Actions
	ms := x.model.Members
	byID := make(map[string]int, len(ms))
	for i := range ms {
		byID[ms[i].GlobalID] = i
	}
	skipped := map[string]bool{}
	for _, s := range x.model.Skipped {
		skipped[s.GlobalID] = true
	}
	unknown := 0
	for k := range sc.Rows {
		r := &sc.Rows[k]
		i, ok := byID[r.GlobalID]
		if !ok {
			if skipped[r.GlobalID] {
				continue
			}
			unknown++
			if unknown <= 100 {
				x.model.Warnings = append(x.model.Warnings, checks.Reason{Code: checks.CodeUnknownGlobalID,
					Message: "the side-car gives actions for " + r.GlobalID + ", which is not a member of the model", Combination: r.Combination, Ref: sc.Ref(r)})
			}
			continue
		}
		m := &ms[i]
		act := checks.Actions{Combination: r.Combination, Theory: r.Theory, NStar: r.NStar, Source: "side-car", Ref: sc.Ref(r)}
		act.Moments[checks.Major].Start, act.Moments[checks.Major].End = r.MajorStart, r.MajorEnd
		act.Moments[checks.Minor].Start, act.Moments[checks.Minor].End = r.MinorStart, r.MinorEnd
		endMomentsOnly(m, &act, [2]float64{r.MajorPeak, r.MinorPeak})
		m.Actions = append(m.Actions, act)
	}
	if unknown > 100 {
		x.warn(checks.CodeUnknownGlobalID, itoa(unknown)+" side-car rows name GlobalIds that are not members of the model (the first 100 are listed)", sc.Name)
	}
	x.model.Combinations = append([]string(nil), sc.Combinations...)
	x.assume("design actions from the side-car " + sc.Name + "; the model's own analysis results and " + psetDesignActions + " are not used")
}

// axialSignSuspect flags, per combination of the analysis results, the
// members in tension when most members of that combination are: the axial
// sign convention is then suspect (design §4.2).
func (x *extractor) axialSignSuspect(combos map[string]bool) {
	ms := x.model.Members
	for c := range combos {
		var total, tension int
		for i := range ms {
			for k := range ms[i].Actions {
				a := &ms[i].Actions[k]
				if a.Combination == c && a.Source == "ifc-results" {
					total++
					if a.NStar < 0 {
						tension++
					}
				}
			}
		}
		if total == 0 || 2*tension <= total {
			continue
		}
		for i := range ms {
			for k := range ms[i].Actions {
				a := &ms[i].Actions[k]
				if a.Combination == c && a.Source == "ifc-results" && a.NStar < 0 {
					ms[i].Problems = append(ms[i].Problems, checks.Reason{Code: checks.CodeAxialSignSuspect, Combination: c, Ref: a.Ref,
						Message: itoa(tension) + " of the " + itoa(total) + " members come out in tension in this combination: the axial sign of the results is suspect"})
				}
			}
		}
	}
}
