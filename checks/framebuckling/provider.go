package framebuckling

import (
	"math"

	"swaygate/checks"
)

// Provider is the frame sway method: see the package documentation. A
// Provider serves one run; make one with Analysis.Provider.
type Provider struct {
	a      *Analysis
	sc     *checks.SwayContext
	storey *checks.StoreyProvider
	nc     int

	role     []checks.Role // per member-axis (2i+a)
	covered  []bool        // per member-axis: lambda_c from the frame
	fallback []string      // per member: why some swaying axis fell back ("" none)
	keep     bool          // the storey rows are kept (some axis falls back)
}

// Provider returns a fresh sway provider for one run of the engine.
func (a *Analysis) Provider() *Provider { return &Provider{a: a} }

// Method implements checks.SwayProvider.
func (p *Provider) Method() string { return "frame" }

// Prepare implements checks.SwayProvider: it runs the storey method for the
// roles (sway, leaning, braced) and for the members the frame does not
// cover, and fills Report.Frame.
func (p *Provider) Prepare(sc *checks.SwayContext) error {
	p.sc = sc
	p.nc = len(sc.Combinations)
	rep := sc.Report
	markS, markA := len(rep.Storeys), len(rep.Assumptions)
	p.storey = checks.NewStoreyProvider()
	if err := p.storey.Prepare(sc); err != nil {
		return err
	}
	n := sc.Members()
	p.role = make([]checks.Role, 2*n)
	p.covered = make([]bool, 2*n)
	p.fallback = make([]string, n)
	a := p.a
	var normal vec
	if pl := a.Model.Plane; pl != nil {
		normal = planeNormal(pl)
	}
	var nCovered, nFell int
	for i := 0; i < n; i++ {
		in := a.Covered(i)
		if in {
			nCovered++
		}
		for _, ax := range checks.Axes {
			k := 2*i + int(ax)
			role := checks.RoleUnknown
			if p.nc > 0 {
				role = p.storey.Sway(i, ax, 0).Role
			}
			p.role[k] = role
			if !role.Swaying() {
				continue
			}
			switch {
			case !in:
				p.fallback[i] = p.why(i)
			case a.Model.Plane != nil && outOfPlane(sc.Axis(i, ax).Direction, normal):
				p.fallback[i] = "the " + ax.String() + " axis sways out of the plane of the plane frame: lambda_c from the storey method"
			default:
				p.covered[k] = true
				continue
			}
			nFell++
		}
	}
	p.keep = nFell > 0
	if !p.keep {
		rep.Storeys = rep.Storeys[:markS]
		rep.Assumptions = rep.Assumptions[:markA]
	}
	rep.Assumptions = append(rep.Assumptions, p.assumption())
	rep.Frame = a.Report(sc.Model)
	rep.Frame.Covered, rep.Frame.FellBack = nCovered, nFell
	return nil
}

// why explains why member i is not covered by the frame.
func (p *Provider) why(i int) string {
	a := p.a
	switch {
	case a.Err != nil:
		return "the frame buckling analysis failed (" + a.Err.Error() + "): lambda_c from the storey method"
	case a.Result == nil:
		return "the frame was not analysed: lambda_c from the storey method"
	}
	return "the member is not linked to an analytical member of the frame: lambda_c from the storey method"
}

func (p *Provider) assumption() string {
	a := p.a
	s := "sway method frame: lambda_c of every sway and leaning axis of a member idealised in the analytical frame (" + a.In.Name +
		") is the lowest elastic buckling load factor of the whole frame under the combination's axial forces (a rational " +
		"buckling analysis of the frame: 12-degree-of-freedom beam-column elements, members subdivided so that buckling between " +
		"nodes is found); it is taken for every sway and leaning axis, whichever part of the frame the mode involves"
	if a.Result == nil {
		s += "; the analysis did not run, so every axis takes the storey method (frame-fallback)"
	}
	return s
}

// Sway implements checks.SwayProvider.
func (p *Provider) Sway(i int, ax checks.Axis, c int) checks.SwayValue {
	k := 2*i + int(ax)
	if !p.covered[k] {
		if !p.keep {
			return checks.SwayValue{Role: p.role[k], Lambda: math.NaN()}
		}
		return p.storey.Sway(i, ax, c)
	}
	return checks.SwayValue{Role: p.role[k], Lambda: p.a.swayLambda(c, p.sc.Axis(i, ax).Direction), Method: "frame", Form: "frame"}
}

// MemberNotes implements checks.SwayProvider.
func (p *Provider) MemberNotes(i int, dst []checks.Reason) []checks.Reason {
	if p.keep {
		dst = p.storey.MemberNotes(i, dst)
	}
	if p.fallback[i] != "" {
		dst = append(dst, checks.Reason{Code: checks.CodeFrameFallback, Message: p.fallback[i]})
	}
	return dst
}

// outOfPlane reports whether sway in global direction d leaves the plane of
// a plane model with the given normal.
func outOfPlane(d checks.Direction, normal vec) bool {
	v := vec{1, 0, 0}
	if d == checks.DirY {
		v = vec{0, 1, 0}
	}
	return math.Abs(v.dot(normal)) > 0.5
}
