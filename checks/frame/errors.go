package frame

import (
	"errors"
	"strconv"
)

// ErrNoConvergence is returned when the eigenvalue iteration does not reach
// the requested accuracy.
var ErrNoConvergence = errors.New("frame: eigenvalue iteration did not converge")

// InputError reports an invalid item of the Model.
type InputError struct {
	Item  string // "node", "member", "combination" or "model"
	Index int    // index in the Model's slice (-1 for the model)
	ID    string // the item's ID, if any
	Msg   string
}

func (e *InputError) Error() string {
	return "frame: " + where(e.Item, e.Index, e.ID) + ": " + e.Msg
}

func where(item string, index int, id string) string {
	if index < 0 {
		return item
	}
	s := item + " " + strconv.Itoa(index)
	if id != "" {
		s += " (" + strconv.Quote(id) + ")"
	}
	return s
}

// dofName returns the name of degree of freedom i (0..5) of a point.
func dofName(i int) string {
	const names = "uxuyuzrxryrz"
	if i < 0 || i > 5 {
		return "?"
	}
	return names[2*i : 2*i+2]
}

// MechanismError reports a singular stiffness matrix: the structure, or a
// part of it, can move without straining. It names the first degree of
// freedom found without stiffness; releasing or supporting it differently
// (or adding the missing member) removes the mechanism.
type MechanismError struct {
	// Item is "node" for a model node or "member" for a point inside a
	// member (Point > 0: interior point Point of Elements−1) or for a
	// released member end (Release is "start" or "end").
	Item    string
	Index   int
	ID      string
	Point   int
	Release string
	// DOF is the degree of freedom (0..5: ux, uy, uz, rx, ry, rz) in Axes.
	DOF  int
	Axes string // "global", "support", "plane" or "member"
	// Ratio is the pivot found divided by the degree of freedom's own
	// stiffness (0 or negative: exactly singular).
	Ratio float64
}

func (e *MechanismError) Error() string {
	s := "frame: mechanism at " + where(e.Item, e.Index, e.ID)
	switch {
	case e.Release != "":
		s += " " + e.Release + " release"
	case e.Point > 0:
		s += " interior point " + strconv.Itoa(e.Point)
	}
	s += ": " + dofName(e.DOF) + " (" + e.Axes + " axes) has no stiffness"
	s += " (pivot ratio " + strconv.FormatFloat(e.Ratio, 'g', 3, 64) + "); check supports and releases"
	return s
}
