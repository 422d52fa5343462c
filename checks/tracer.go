package checks

// Tracer collects the steps of one member's hand calculation. The engine owns
// it and reuses its storage across members; a rule set only calls On, Step
// and the Step's methods. A nil or switched-off Tracer records nothing, so a
// rule set guards each step with On to skip the work:
//
//	if tr.On() {
//		tr.Step("delta_b,major", "AS 4100 4.4.2.2", "max(1, c_m / (1 - N*/N_omb))", d, "").
//			Add("c_m", cm, "").Add("N*", checks.KN(n), "kN").Add("N_omb", checks.KN(nomb), "kN")
//	}
//
// Steps are fixed structs: recording one allocates nothing once the buffer
// has grown.
type Tracer struct {
	steps []Step
	on    bool
	comb  string // stamped on each step
	axis  string
}

// On reports whether steps are recorded.
func (t *Tracer) On() bool { return t != nil && t.on }

// Step appends a step stamped with the current combination and axis and
// returns it so that inputs and a note can be added. The pointer is valid
// until the next call of Step.
func (t *Tracer) Step(quantity, clause, formula string, value float64, unit string) *Step {
	n := len(t.steps)
	if n < cap(t.steps) {
		t.steps = t.steps[:n+1]
	} else {
		t.steps = append(t.steps, Step{})
	}
	s := &t.steps[n]
	// Field by field, clearing only the inputs a reused slot held: a whole
	// struct assignment writes all 8 inputs (some 450 bytes) per step, which
	// measured about twice as slow.
	if k := s.NInputs; k > 0 {
		clear(s.Inputs[:k])
		s.NInputs = 0
	}
	s.Quantity = quantity
	s.Clause = clause
	s.Formula = formula
	s.Value = value
	s.Unit = unit
	s.Combination = t.comb
	s.Axis = t.axis
	s.Note = ""
	return s
}

// Steps returns the steps recorded so far (sharing the tracer's storage).
func (t *Tracer) Steps() []Step { return t.steps }

func (t *Tracer) reset(dst []Step, on bool) {
	t.steps = dst
	t.on = on
	t.comb = ""
	t.axis = ""
}

// Noted sets the step's note and returns the step.
func (s *Step) Noted(note string) *Step {
	s.Note = note
	return s
}
