package checks

import (
	"errors"
	"math"
)

// Messages of the engine's own reasons. They are constants so that a member
// costs no allocation for them.
const (
	msgMissingActions       = "no design actions for this combination"
	msgMissingSection       = "no section properties"
	msgMissingI             = "no second moment of area about this axis"
	msgMissingLength        = "no member length"
	msgMissingRestraint     = "no restraint data for this axis (sway or braced, and ke)"
	msgSwayKeBelowOne       = "ke below 1 on a sway axis: a member free to sway cannot have ke < 1"
	msgKeNotPositive        = "ke must be positive"
	msgBracedKeAboveOne     = "ke above 1 on a braced axis: check the restraint data"
	msgBracedKeOfSwayAbove  = "braced ke above 1 on a sway axis: check the restraint data"
	msgNoDesignCombinations = "the model has no design load combinations: nothing to check"
	msgSecondOrderResults   = "actions from a second-order analysis: delta_s = 1 (the sway effect is included)"
	msgSecondOrderMember    = "actions from a second-order analysis that the user declares includes member P-delta: delta_s = 1, delta_b = 1"
	msgMixedSwayFlags       = "a braced-flagged (leaning) column of a swaying storey carries end moments: " +
		"it takes the storey's delta_s; if it belongs to a braced bay, check the sway flags"
)

// ErrOption is wrapped by the errors Run returns for invalid options.
var ErrOption = errors.New("checks: invalid option")

type traceLevel uint8

const (
	traceNone traceLevel = iota
	traceSummary
	traceFull
)

// member flags found while resolving the inputs.
const (
	fNoSection uint16 = 1 << iota
	fNoLength
	fAssumedE
	fDirDefault
	fProblemSection // the member's Problems already name these codes
	fProblemLength
	fProblemRestraint
)

// axis flags.
const (
	afNoI uint8 = 1 << iota
	afMissingRestraint
	afSwayKeBelowOne
	afKeNotPositive
	afUnusualKe
	afUnusualBracedKe
	afAssumed
)

// memberSetup is a member's resolved, combination-independent data.
type memberSetup struct {
	E       float64
	ESource string
	Axes    [2]AxisSetup
	flags   uint16
	axFlags [2]uint8
	eMsg    int32 // index into run.eMsgs when E is assumed
}

// eKey is one assumed modulus and where it came from.
type eKey struct {
	e   float64
	src string
}

// run is the state of one run; the Report keeps it to rebuild traces.
type run struct {
	m      *Model
	rs     RuleSet
	sp     SwayProvider
	opt    Options
	rep    *Report
	combos []string
	nc     int
	level  traceLevel

	setups []memberSetup
	actIdx []int32   // n*nc: index into Member.Actions, -1 = missing
	nstar  []float64 // n*nc: N* (N), NaN = missing
	gov    []int32   // governing combination per member, -1 = none

	// Messages built once per run.
	eMsgs              []string // assumed-modulus messages, one per distinct E and source
	msgAssumedRestrain [2]string

	// Scratch reused across members.
	mc      MemberContext
	ax      [2]AxisContext
	cc      CombinationContext
	sink    reasonSink
	tr      Tracer
	scratch CombinationResult
	uniq    []uniqReason
	uidx    []int32

	// Arenas the elements' slices are cut from.
	reasonArena []Reason
	stepArena   []Step
}

// Run checks every member of m with rule set rs and the sway method named by
// opt.SwayMethod ("storey", the default, or "member"). Other methods (the
// frame buckling analysis) plug in through RunWith.
//
// The error is for invalid options only (wrapping ErrOption); problems of the
// model's data become reasons and needs-analysis verdicts, never errors. m
// is read, never changed; the report points into it.
func Run(m *Model, rs RuleSet, opt Options) (*Report, error) {
	var sp SwayProvider
	switch opt.SwayMethod {
	case "", "storey":
		sp = NewStoreyProvider()
	case "member":
		sp = NewMemberProvider()
	case "frame":
		return nil, optionError("sway method frame needs the frame buckling provider (RunWith)")
	default:
		return nil, optionError("unknown sway method " + quote(opt.SwayMethod) + " (want storey or member)")
	}
	return RunWith(m, rs, sp, opt)
}

// RunWith is Run with a given sway provider (a fresh value for each run).
func RunWith(m *Model, rs RuleSet, sp SwayProvider, opt Options) (*Report, error) {
	if rs == nil || sp == nil || m == nil {
		return nil, optionError("a model, a rule set and a sway provider are required")
	}
	r := &run{m: m, rs: rs, sp: sp, opt: opt}
	for a := range r.ax {
		r.ax[a] = AxisContext{Member: &r.mc, Setup: &r.mc.Axes[a], Axis: Axis(a), sink: &r.sink}
	}
	switch opt.Trace {
	case "", "full":
		r.level = traceFull
	case "summary":
		r.level = traceSummary
	case "none":
		r.level = traceNone
	default:
		return nil, optionError("unknown trace level " + quote(opt.Trace) + " (want full, summary or none)")
	}
	scope := opt.Scope
	switch scope {
	case "":
		scope = "stability"
	case "stability", "full":
	default:
		return nil, optionError("unknown scope " + quote(opt.Scope) + " (want stability or full)")
	}
	r.opt.Scope = scope
	for a, d := range opt.Defaults {
		if d.Ke < 0 || d.BracedKe < 0 || (d.Restraint == Sway && d.Ke > 0 && d.Ke < 1) {
			return nil, optionError("restraint default for the " + Axis(a).String() + " axis: ke must be positive, and at least 1 on a sway axis")
		}
	}
	if opt.Modulus < 0 || math.IsInf(opt.Modulus, 0) {
		return nil, optionError("modulus must be positive")
	}
	std, err := rs.Begin(&r.opt)
	if err != nil {
		return nil, err
	}

	rep := &Report{
		Standard:   rs.Name(),
		SwayMethod: sp.Method(),
		Scope:      scope,
		Skipped:    m.Skipped,
		run:        r,
	}
	r.rep = rep
	rep.Assumptions = append(rep.Assumptions, m.Assumptions...)
	rep.Assumptions = append(rep.Assumptions, std...)
	rep.Warnings = append(rep.Warnings, m.Warnings...)

	r.combos = m.Combinations
	if len(r.combos) == 0 {
		r.combos = actionCombinations(m)
	}
	r.nc = len(r.combos)

	r.resolve()
	sc := &SwayContext{Model: m, Rules: rs, Options: &r.opt, Combinations: r.combos, Report: rep, r: r}
	if err := sp.Prepare(sc); err != nil {
		return nil, err
	}
	if r.nc == 0 {
		rep.Warnings = append(rep.Warnings, Reason{Code: CodeNoDesignCombinations, Message: msgNoDesignCombinations})
	}

	n := len(m.Members)
	rep.Elements = make([]Element, n)
	combs := make([]CombinationResult, n*r.nc)
	// Large fresh slices are cleared before the run fills them field by
	// field: while the collector runs, a pointer store reads the old value
	// first, a fresh page read first maps the shared zero page, and the
	// store then copies the page and flushes the TLB of every core (some
	// 10 µs a page on a virtual machine: half of a run's time at worst).
	clear(rep.Elements)
	clear(combs)
	r.gov = make([]int32, n)
	for i := range n {
		el := &rep.Elements[i]
		el.Combinations = combs[i*r.nc : (i+1)*r.nc : (i+1)*r.nc]
		r.check(i, el)
		switch el.Verdict {
		case Pass:
			rep.Summary.Pass++
		case Fail:
			rep.Summary.Fail++
		default:
			rep.Summary.NeedsAnalysis++
		}
	}
	rep.Summary.Members = n
	return rep, nil
}

func optionError(msg string) error { return &optError{msg} }

type optError struct{ msg string }

func (e *optError) Error() string { return "checks: " + e.msg }
func (e *optError) Unwrap() error { return ErrOption }

func quote(s string) string { return "\"" + s + "\"" }

// actionCombinations is the union of the members' combination names in order
// of first appearance, for a model that does not list them.
func actionCombinations(m *Model) []string {
	var names []string
	seen := make(map[string]bool)
	for i := range m.Members {
		for k := range m.Members[i].Actions {
			c := m.Members[i].Actions[k].Combination
			if !seen[c] {
				seen[c] = true
				names = append(names, c)
			}
		}
	}
	return names
}

// resolve is the first pass: inputs, defaults, buckling loads, actions.
func (r *run) resolve() {
	m := r.m
	n, nc := len(m.Members), r.nc
	r.setups = make([]memberSetup, n)
	clear(r.setups) // written before it is read (see RunWith)
	r.actIdx = make([]int32, n*nc)
	r.nstar = make([]float64, n*nc)
	var index map[string]int
	if nc > 0 {
		index = make(map[string]int, nc)
		for c := nc - 1; c >= 0; c-- {
			index[r.combos[c]] = c
		}
	}
	eDefault, eClause := r.rs.Modulus()
	var nDirDefault int
	var nAssumed [2]int
	eIndex := map[eKey]int32{}
	var eCount []int
	for i := range m.Members {
		mem := &m.Members[i]
		ms := &r.setups[i]
		r.setup(mem, ms, eDefault)
		if ms.flags&fAssumedE != 0 {
			k := eKey{ms.E, ms.ESource}
			x, ok := eIndex[k]
			if !ok {
				x = int32(len(r.eMsgs))
				eIndex[k] = x
				r.eMsgs = append(r.eMsgs, r.assumedEMessage(k, eClause))
				eCount = append(eCount, 0)
			}
			ms.eMsg = x
			eCount[x]++
		}
		if ms.flags&fDirDefault != 0 {
			nDirDefault++
		}
		for a := range Axes {
			if ms.axFlags[a]&afAssumed != 0 {
				nAssumed[a]++
			}
		}
		r.loadMember(i)
		r.rs.Member(&r.mc, nil)
		ms.Axes[0].Nom, ms.Axes[0].Nomb = r.mc.Axes[0].Nom, r.mc.Axes[0].Nomb
		ms.Axes[1].Nom, ms.Axes[1].Nomb = r.mc.Axes[1].Nom, r.mc.Axes[1].Nomb

		ai := r.actIdx[i*nc : (i+1)*nc]
		ns := r.nstar[i*nc : (i+1)*nc]
		for c := range ai {
			ai[c] = -1
			ns[c] = math.NaN()
		}
		for k := range mem.Actions {
			name := mem.Actions[k].Combination
			c := -1
			if k < nc && r.combos[k] == name { // the usual order: no lookup
				c = k
			} else if j, ok := index[name]; ok {
				c = j
			}
			if c >= 0 && ai[c] < 0 && finiteActions(&mem.Actions[k]) { // the first row of a combination wins
				ai[c] = int32(k)
				ns[c] = mem.Actions[k].NStar
			}
		}
	}

	rep := r.rep
	for x, msg := range r.eMsgs {
		rep.Assumptions = append(rep.Assumptions, msg+" ("+itoa(eCount[x])+" member(s))")
	}
	for a, d := range r.opt.Defaults {
		if nAssumed[a] == 0 {
			continue
		}
		r.msgAssumedRestrain[a] = "restraint from the user's default for the " + Axis(a).String() + " axis: " + describeDefault(d)
		rep.Assumptions = append(rep.Assumptions, r.msgAssumedRestrain[a]+" ("+itoa(nAssumed[a])+" member(s))")
	}
	if nDirDefault > 0 {
		rep.Assumptions = append(rep.Assumptions, itoa(nDirDefault)+
			" member(s) give no global sway direction for an axis: taken as an unrotated column (major-axis bending sways in Y, minor in X)")
	}
	if r.opt.MemberPDeltaModelled {
		rep.Assumptions = append(rep.Assumptions,
			"the user declares that second-order analyses also modelled member (P-delta) effects: delta_b = 1 for their results")
	}
}

// finiteActions reports whether every value of a is a finite number; a row
// with NaN or Inf is treated as missing (missing-actions).
func finiteActions(a *Actions) bool {
	x := a.NStar
	for k := range a.Moments {
		m := &a.Moments[k]
		x += m.Start + m.End + m.Peak
	}
	return !math.IsNaN(x) && !math.IsInf(x, 0)
}

// assumedEMessage explains an assumed modulus.
func (r *run) assumedEMessage(k eKey, clause string) string {
	var src string
	switch k.src {
	case "default":
		src = "the " + r.rs.Title() + " default (" + clause + ")"
	case "request":
		src = "the request's default"
	default:
		src = "from " + quote(k.src)
	}
	return "E = " + ftoa(k.e) + " MPa, " + src + ": the model gives no modulus"
}

func describeDefault(d RestraintDefault) string {
	ke := d.Ke
	if ke <= 0 {
		ke = 1
	}
	s := d.Restraint.String() + ", ke = " + ftoa(ke)
	if d.Restraint == Sway {
		bke := d.BracedKe
		if bke <= 0 {
			bke = 1
		}
		s += ", braced ke = " + ftoa(bke)
	}
	return s
}

// setup resolves one member's inputs.
func (r *run) setup(mem *Member, ms *memberSetup, eDefault float64) {
	*ms = memberSetup{}
	for k := range mem.Problems {
		switch mem.Problems[k].Code {
		case CodeMissingSection:
			ms.flags |= fProblemSection
		case CodeMissingLength:
			ms.flags |= fProblemLength
		case CodeMissingRestraint:
			ms.flags |= fProblemRestraint
		}
	}
	switch e := mem.Material.E; {
	case finitePos(e):
		ms.E, ms.ESource = e, "model"
		if src := mem.Material.Source; src != "" && src != "model" {
			ms.ESource = src
			ms.flags |= fAssumedE
		}
	case r.opt.Modulus > 0:
		ms.E, ms.ESource = r.opt.Modulus, "request"
		ms.flags |= fAssumedE
	default:
		ms.E, ms.ESource = eDefault, "default"
		ms.flags |= fAssumedE
	}
	length := mem.Length
	if !finitePos(length) {
		length = math.NaN()
		ms.flags |= fNoLength
	}
	sec := mem.Section
	if sec == nil {
		ms.flags |= fNoSection
	}
	for a := range Axes {
		in := &mem.Axes[a]
		s := &ms.Axes[a]
		s.Axis = Axis(a)
		s.Direction = in.Direction
		if s.Direction != DirX && s.Direction != DirY {
			s.Direction = DirY // unrotated column: major-axis bending sways in Y
			if a == int(Minor) {
				s.Direction = DirX
			}
			ms.flags |= fDirDefault
		}
		s.Transverse = in.TransverseLoad
		s.MemberLength = length
		s.Length = length
		if finitePos(in.BucklingLength) {
			s.Length = in.BucklingLength
		}
		s.I = math.NaN()
		if sec != nil {
			i := sec.IMajor
			if a == int(Minor) {
				i = sec.IMinor
			}
			if finitePos(i) {
				s.I = i
			} else {
				ms.axFlags[a] |= afNoI
			}
		}
		s.Nom, s.Nomb = math.NaN(), math.NaN()

		restraint, ke, bke := in.Restraint, in.Ke, in.BracedKe
		if d := r.opt.Defaults[a]; d.Restraint != RestraintUnknown {
			dke := d.Ke
			if dke <= 0 {
				dke = 1
			}
			switch {
			case restraint == RestraintUnknown:
				restraint = d.Restraint
				if !(ke > 0) {
					ke = dke
				}
				if !(bke > 0) {
					bke = d.BracedKe
				}
				s.Assumed = true
			case ke == 0 && restraint == d.Restraint:
				ke = dke
				if !(bke > 0) {
					bke = d.BracedKe
				}
				s.Assumed = true
			}
			if s.Assumed {
				ms.axFlags[a] |= afAssumed
			}
		}
		s.Restraint = restraint
		s.Ke, s.BracedKe = math.NaN(), math.NaN()
		switch {
		case ke < 0 || math.IsInf(ke, 0):
			ms.axFlags[a] |= afKeNotPositive
			s.Invalid = true
		case !(ke > 0):
			ms.axFlags[a] |= afMissingRestraint
		default:
			s.Ke = ke
		}
		switch restraint {
		case RestraintUnknown:
			ms.axFlags[a] |= afMissingRestraint
		case Sway:
			s.BracedKe = 1
			if finitePos(bke) {
				s.BracedKe = bke
			}
			if s.BracedKe > 1 {
				ms.axFlags[a] |= afUnusualBracedKe
			}
			if s.Ke < 1 {
				ms.axFlags[a] |= afSwayKeBelowOne
				s.Invalid = true
			}
		case Braced:
			s.BracedKe = s.Ke
			if s.Ke > 1 {
				ms.axFlags[a] |= afUnusualKe
			}
		}
	}
}

// loadMember fills the member context from the resolved setup.
func (r *run) loadMember(i int) {
	ms := &r.setups[i]
	r.mc.Index = i
	r.mc.Member = &r.m.Members[i]
	r.mc.Options = &r.opt
	r.mc.E, r.mc.ESource = ms.E, ms.ESource
	r.mc.Axes = ms.Axes
}

// memberReasons appends the member-level reasons and returns the verdict
// floor they set for the member and for each axis.
func (r *run) memberReasons(i int) (floor Verdict, axFloor [2]Verdict) {
	mem := &r.m.Members[i]
	ms := &r.setups[i]
	sk := &r.sink
	for k := range mem.Problems {
		sk.add(mem.Problems[k])
	}
	if ms.flags&fNoSection != 0 && ms.flags&fProblemSection == 0 {
		sk.add(Reason{Code: CodeMissingSection, Message: msgMissingSection})
	}
	if ms.flags&fNoLength != 0 && ms.flags&fProblemLength == 0 {
		sk.add(Reason{Code: CodeMissingLength, Message: msgMissingLength})
	}
	for a := range Axes {
		f := ms.axFlags[a]
		if f == 0 {
			continue
		}
		name := Axis(a).String()
		if f&afNoI != 0 && ms.flags&fProblemSection == 0 {
			sk.add(Reason{Code: CodeMissingSection, Message: msgMissingI, Axis: name})
		}
		if f&afAssumed != 0 {
			sk.add(Reason{Code: CodeAssumedRestraint, Message: r.msgAssumedRestrain[a], Axis: name})
		}
		if f&afMissingRestraint != 0 && ms.flags&fProblemRestraint == 0 {
			sk.add(Reason{Code: CodeMissingRestraint, Message: msgMissingRestraint, Axis: name})
		}
		if f&afKeNotPositive != 0 {
			sk.add(Reason{Code: CodeInvalidRestraint, Message: msgKeNotPositive, Axis: name})
		}
		if f&afSwayKeBelowOne != 0 {
			sk.add(Reason{Code: CodeInvalidRestraint, Message: msgSwayKeBelowOne, Axis: name})
		}
		if f&afUnusualKe != 0 {
			sk.add(Reason{Code: CodeUnusualKe, Message: msgBracedKeAboveOne, Axis: name})
		}
		if f&afUnusualBracedKe != 0 {
			sk.add(Reason{Code: CodeUnusualKe, Message: msgBracedKeOfSwayAbove, Axis: name})
		}
	}
	if ms.flags&fAssumedE != 0 {
		sk.add(Reason{Code: CodeAssumedModulus, Message: r.eMsgs[ms.eMsg]})
	}
	sk.rs = r.sp.MemberNotes(i, sk.rs)
	if r.nc == 0 {
		sk.add(Reason{Code: CodeNoDesignCombinations, Message: msgNoDesignCombinations})
	}
	for k := range sk.rs {
		if sk.rs[k].Combination != "" {
			continue // a problem of one combination: folded in there
		}
		v := sk.rs[k].Verdict()
		switch sk.rs[k].Axis {
		case "major":
			axFloor[Major] = axFloor[Major].Worse(v)
		case "minor":
			axFloor[Minor] = axFloor[Minor].Worse(v)
		default:
			floor = floor.Worse(v)
		}
	}
	axFloor[Major] = axFloor[Major].Worse(floor)
	axFloor[Minor] = axFloor[Minor].Worse(floor)
	return floor, axFloor
}

// check is the second pass for member i: every combination and axis, the
// verdict, the reasons and the trace.
func (r *run) check(i int, el *Element) {
	mem := &r.m.Members[i]
	ms := &r.setups[i]
	el.Member = mem
	el.E, el.ESource = ms.E, ms.ESource
	el.GoverningUtilisation = Null

	r.sink.rs = r.sink.rs[:0]
	r.sink.discard = false
	floor, axFloor := r.memberReasons(i)
	r.loadMember(i)

	inline := r.level == traceFull && !r.opt.TraceOnDemand
	r.tr.reset(r.tr.steps[:0], inline)
	if inline {
		r.rs.Member(&r.mc, &r.tr)
	}

	gov, govV, govD := -1, Pass, math.Inf(-1)
	for c := range el.Combinations {
		cr := &el.Combinations[c]
		r.combination(i, c, cr, &r.tr, axFloor)
		cr.Verdict = cr.Verdict.Worse(floor)
		d := math.Max(nanToInf(cr.Axes[0].DeltaM.F()), nanToInf(cr.Axes[1].DeltaM.F()))
		if gov < 0 || cr.Verdict > govV || (cr.Verdict == govV && d > govD) {
			gov, govV, govD = c, cr.Verdict, d
		}
	}
	r.gov[i] = int32(gov)
	el.Verdict = floor.Worse(govV)
	if r.opt.Scope == "full" {
		el.GoverningUtilisation = governingUtilisation(el.Combinations)
	}
	if gov >= 0 {
		el.GoverningCombination = r.combos[gov]
	}

	if r.level == traceSummary && !r.opt.TraceOnDemand {
		r.replay(i, false, r.tr.steps[:0])
	}
	el.Reasons = r.compactReasons()
	if r.level != traceNone && !r.opt.TraceOnDemand {
		el.Trace = r.keepSteps(r.tr.steps)
	}
}

// governingUtilisation is the largest utilisation of the capacity checks of
// all combinations (Null when there is none).
func governingUtilisation(cs []CombinationResult) Num {
	u := math.NaN()
	for c := range cs {
		for k := range cs[c].Capacity {
			if x := cs[c].Capacity[k].Utilisation.F(); x > u || (math.IsNaN(u) && !math.IsNaN(x)) {
				u = x
			}
		}
	}
	return Num(u)
}

func nanToInf(x float64) float64 {
	if math.IsNaN(x) {
		return math.Inf(-1)
	}
	return x
}

// replay rebuilds member i's trace into r.tr, appending to dst: member-level
// steps, then every combination (all) or the governing one. Reasons and
// results are discarded.
func (r *run) replay(i int, all bool, dst []Step) {
	r.loadMember(i)
	r.tr.reset(dst, true)
	r.rs.Member(&r.mc, &r.tr)
	var axFloor [2]Verdict
	r.sink.discard = true
	defer func() { r.sink.discard = false }()
	if all {
		for c := range r.nc {
			r.combination(i, c, &r.scratch, &r.tr, axFloor)
		}
		return
	}
	if g := r.gov[i]; g >= 0 {
		r.combination(i, int(g), &r.scratch, &r.tr, axFloor)
	}
}

// combination evaluates member i under combination c into cr.
func (r *run) combination(i, c int, cr *CombinationResult, tr *Tracer, axFloor [2]Verdict) {
	mem := &r.m.Members[i]
	name := r.combos[c]
	cr.Name = name
	cr.Capacity = nil
	mark := len(r.sink.rs)
	for a := range Axes {
		s := &r.mc.Axes[a]
		ar := &cr.Axes[a]
		*ar = AxisResult{
			Restraint: s.Restraint,
			Direction: s.Direction,
			Ke:        Num(s.Ke),
			Length:    Num(s.Length),
			Nom:       Num(s.Nom),
			Nomb:      Num(s.Nomb),
			LambdaC:   Null,
			BetaM:     Null,
			Cm:        Null,
			DeltaB:    Null,
			DeltaS:    Null,
			DeltaM:    Null,
			MStar:     Null,
			MAmp:      Null,
		}
	}
	k := r.actIdx[i*r.nc+c]
	if k < 0 {
		cr.Theory, cr.NStar = FirstOrder, Null
		r.sink.add(Reason{Code: CodeMissingActions, Message: msgMissingActions, Combination: name})
		for a := range Axes {
			sv := r.sp.Sway(i, Axis(a), c)
			cr.Axes[a].Leaning = sv.Role == RoleLeaning
			cr.Axes[a].Verdict = axFloor[a].Worse(NeedsAnalysis)
		}
		cr.Verdict = NeedsAnalysis.Worse(axFloor[0]).Worse(axFloor[1])
		return
	}
	act := &mem.Actions[k]
	cr.Theory, cr.NStar = act.Theory, Num(act.NStar)
	ambiguous, problem := false, Pass
	for p := range mem.Problems {
		pr := &mem.Problems[p]
		if pr.Combination != "" && pr.Combination != name {
			continue
		}
		if pr.Code == CodeSignConventionAmbiguous {
			ambiguous = true
		}
		if pr.Combination != "" {
			problem = problem.Worse(pr.Verdict())
		}
	}
	if act.Theory == SecondOrder {
		msg := msgSecondOrderResults
		if r.opt.MemberPDeltaModelled {
			msg = msgSecondOrderMember
		}
		r.sink.add(Reason{Code: CodeSecondOrderResults, Message: msg, Combination: name})
	}
	if tr.On() {
		tr.comb, tr.axis = name, ""
		note := "first-order analysis"
		if act.Theory == SecondOrder {
			note = "second-order analysis"
		}
		tr.Step("N*", "", "design axial compression (compression positive)", KN(act.NStar), "kN").Noted(note)
	}
	for a := range Axes {
		// Member, Setup, Axis and the sink are fixed per run (newRun); only
		// the combination's fields change, which saves a struct copy per axis.
		ax := &r.ax[a]
		ax.Combination, ax.Name = c, name
		ax.Actions, ax.Moments, ax.NStar = act, &act.Moments[a], act.NStar
		ax.Sway = r.sp.Sway(i, Axis(a), c)
		ax.SignAmbiguous = ambiguous
		ar := &cr.Axes[a]
		ar.Leaning = ax.Sway.Role == RoleLeaning
		am := len(r.sink.rs)
		if tr.On() {
			tr.axis = ax.Axis.String()
		}
		r.rs.Amplify(ax, ar, tr)
		if ax.Sway.Code != "" && act.Theory == FirstOrder {
			ax.Reason(ax.Sway.Code, ax.Sway.Message)
		}
		if ar.Leaning && HasEndMoments(ax.Moments) {
			ax.Reason(CodeMixedSwayFlags, msgMixedSwayFlags)
		}
		ar.Verdict = axFloor[a].Worse(r.sink.worst(am)).Worse(problem)
	}
	if r.opt.Scope == "full" {
		r.cc = CombinationContext{Member: &r.mc, Combination: c, Name: name, Actions: act,
			Axes: [2]*AxisContext{&r.ax[0], &r.ax[1]}, sink: &r.sink}
		if tr.On() {
			tr.axis = ""
		}
		r.rs.Capacity(&r.cc, cr, tr)
	}
	cr.Verdict = r.sink.worst(mark).Worse(cr.Axes[0].Verdict).Worse(cr.Axes[1].Verdict)
}

// reasonSink collects a member's reasons; discard drops them (trace replay).
type reasonSink struct {
	rs      []Reason
	discard bool
}

func (s *reasonSink) add(r Reason) {
	if !s.discard {
		s.rs = append(s.rs, r)
	}
}

// worst is the worst verdict of the reasons from index from on.
func (s *reasonSink) worst(from int) Verdict {
	v := Pass
	if from < len(s.rs) {
		for k := range s.rs[from:] {
			v = v.Worse(s.rs[from+k].Verdict())
		}
	}
	return v
}

type uniqReason struct {
	first int32
	count int32
}

// compactReasons copies the member's reasons out of the sink. A reason that
// recurs with the same code, axis and message in every combination (of two
// or more) is kept once, without a combination name.
func (r *run) compactReasons() []Reason {
	rs := r.sink.rs
	if len(rs) == 0 {
		return nil
	}
	r.uniq = r.uniq[:0]
	r.uidx = r.uidx[:0]
	for j := range rs {
		u := int32(-1)
		if rs[j].Combination != "" && r.nc > 1 {
			for k := range r.uniq {
				f := &rs[r.uniq[k].first]
				if f.Code == rs[j].Code && f.Axis == rs[j].Axis && f.Message == rs[j].Message {
					u = int32(k)
					r.uniq[k].count++
					break
				}
			}
			if u < 0 {
				u = int32(len(r.uniq))
				r.uniq = append(r.uniq, uniqReason{first: int32(j), count: 1})
			}
		}
		r.uidx = append(r.uidx, u)
	}
	out := r.allocReasons(len(rs))[:0]
	for j := range rs {
		u := r.uidx[j]
		if u < 0 || int(r.uniq[u].count) < r.nc {
			out = append(out, rs[j])
			continue
		}
		if int(r.uniq[u].first) == j {
			x := rs[j]
			x.Combination = ""
			out = append(out, x)
		}
	}
	return out[:len(out):len(out)]
}

// Arena chunks start small (a small model allocates little) and double up to
// arenaChunk.
const (
	arenaFirst = 64
	arenaChunk = 4096
)

func nextChunk(prev, n int) int { return max(n, min(arenaChunk, max(arenaFirst, 2*prev))) }

func (r *run) allocReasons(n int) []Reason {
	if cap(r.reasonArena)-len(r.reasonArena) < n {
		r.reasonArena = make([]Reason, 0, nextChunk(cap(r.reasonArena), n))
		clear(r.reasonArena[:cap(r.reasonArena)]) // see RunWith
	}
	l := len(r.reasonArena)
	r.reasonArena = r.reasonArena[:l+n]
	return r.reasonArena[l : l+n : l+n]
}

// keepSteps copies a member's steps into the run's step arena.
func (r *run) keepSteps(steps []Step) []Step {
	n := len(steps)
	if n == 0 {
		return nil
	}
	if cap(r.stepArena)-len(r.stepArena) < n {
		r.stepArena = make([]Step, 0, nextChunk(cap(r.stepArena), n))
		clear(r.stepArena[:cap(r.stepArena)]) // see RunWith
	}
	l := len(r.stepArena)
	r.stepArena = append(r.stepArena, steps...)
	return r.stepArena[l : l+n : l+n]
}

// TraceReplayer rebuilds element traces as Report.AppendTrace does, with
// scratch state of its own, so that a writer can rebuild the traces of a
// large report on several goroutines: each replayer serves one goroutine,
// and the replayers of a report may run at the same time (not together
// with Report.AppendTrace on that report).
type TraceReplayer struct {
	r run
}

// NewTraceReplayer returns a replayer of rep's element traces, or nil when
// there is none to rebuild (rep was not made by Run, or with trace "none").
// It shares the run's read-only state (model, inputs, sway values, results)
// and copies none of it.
func (rep *Report) NewTraceReplayer() *TraceReplayer {
	src := rep.run
	if src == nil || src.level == traceNone {
		return nil
	}
	t := &TraceReplayer{r: *src}
	r := &t.r
	// Fresh scratch; the rule set makes its own per-member scratch again.
	r.mc = MemberContext{}
	for a := range r.ax {
		r.ax[a] = AxisContext{Member: &r.mc, Setup: &r.mc.Axes[a], Axis: Axis(a), sink: &r.sink}
	}
	r.cc = CombinationContext{}
	r.sink = reasonSink{}
	r.tr = Tracer{}
	r.scratch = CombinationResult{}
	r.uniq, r.uidx, r.reasonArena, r.stepArena = nil, nil, nil, nil
	return t
}

// AppendTrace appends element i's trace to dst and returns it, as
// Report.AppendTrace does.
func (t *TraceReplayer) AppendTrace(dst []Step, i int) []Step {
	r := &t.r
	if i < 0 || i >= len(r.setups) {
		return dst
	}
	r.replay(i, r.level == traceFull, dst)
	out := r.tr.steps
	r.tr.reset(nil, false)
	return out
}

// AppendTrace appends element i's trace at the run's trace level to dst and
// returns it; with trace "none" it returns dst unchanged. It rebuilds the
// steps from the run's stored state, so a writer can stream the trace of a
// large model one element at a time (Options.TraceOnDemand) with one reused
// buffer. It is not safe for concurrent use, nor concurrent with another
// AppendTrace on the same report.
func (rep *Report) AppendTrace(dst []Step, i int) []Step {
	r := rep.run
	if r == nil || r.level == traceNone || i < 0 || i >= len(r.setups) {
		return dst
	}
	saved := r.tr.steps
	r.replay(i, r.level == traceFull, dst)
	out := r.tr.steps
	r.tr.reset(saved[:0], false)
	return out
}
