package checks

// Step is one line of a member's hand calculation: the quantity, the clause
// that defines it, the formula, the inputs with their units, and the value.
// Steps are plain structs: building one allocates nothing beyond the slice
// that holds it.
type Step struct {
	Quantity    string // e.g. "N_om,minor"
	Clause      string // e.g. "AS 4100 4.6.2"
	Formula     string // e.g. "pi^2 E I_minor / (ke L)^2"
	Inputs      [MaxStepInputs]StepInput
	NInputs     uint8
	Value       float64 // in Unit
	Unit        string  // e.g. "kN"
	Combination string  // empty for member-level steps
	Axis        string  // "major", "minor" or ""
	Note        string  // optional remark, e.g. "floored to 1.0"
}

// MaxStepInputs is the most inputs a step may list.
const MaxStepInputs = 8

// StepInput is one named input of a step.
type StepInput struct {
	Name  string
	Value float64
	Unit  string
}

// In returns the step's inputs as a slice (sharing the step's storage).
func (s *Step) In() []StepInput { return s.Inputs[:s.NInputs] }

// Add appends an input; inputs beyond MaxStepInputs are dropped.
func (s *Step) Add(name string, value float64, unit string) *Step {
	if int(s.NInputs) < MaxStepInputs {
		s.Inputs[s.NInputs] = StepInput{name, value, unit}
		s.NInputs++
	}
	return s
}
