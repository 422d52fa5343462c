package pipeline

import (
	"errors"
	"strings"

	"swaygate/checks"
	"swaygate/checks/effective"
	"swaygate/checks/framebuckling"
	"swaygate/ifcstep/ifc"
)

// runChecks runs the engine on the loaded model. When the frame sway method
// is chosen, or the effective length factors are to come from the
// analytical frame (Options.KeFrom restraint-ratios or buckling, or the
// default where some axis has a role but no ke), it first reads the
// model's analytical frame, analyses it, sets the members' ke, and runs the
// engine with the frame sway provider.
func runChecks(ld *Loaded, rs checks.RuleSet, opt checks.Options, req Request) (*checks.Report, error) {
	keFrom := opt.KeFrom
	switch keFrom {
	case "", framebuckling.KeAuto:
		keFrom = framebuckling.KeAuto
	case framebuckling.KePropertySet, framebuckling.KeRestraintRatios, framebuckling.KeBuckling:
	default:
		return nil, &OptionError{Msg: "unknown ke source " + `"` + keFrom + `"` + " (want auto, property-set, restraint-ratios or buckling)"}
	}
	frameMethod := opt.SwayMethod == "frame"
	need := frameMethod || keFrom == framebuckling.KeRestraintRatios || keFrom == framebuckling.KeBuckling ||
		(keFrom == framebuckling.KeAuto && needsKe(ld.Model, opt.Defaults))
	if !need {
		return checks.Run(ld.Model, rs, opt)
	}
	m := ld.Model
	an, err := analyseFrame(ld, req)
	if err != nil {
		return nil, err
	}
	if an == nil {
		if keFrom == framebuckling.KeRestraintRatios || keFrom == framebuckling.KeBuckling {
			m.Assumptions = append(m.Assumptions, "ke from "+keFrom+" was asked for, but the model has no analytical frame "+
				"(no IfcStructuralAnalysisModel with curve members): the property set's ke are used")
		}
		if !frameMethod {
			return checks.Run(m, rs, opt)
		}
		an = framebuckling.Unavailable(m, "the model has no analytical frame (no IfcStructuralAnalysisModel with curve members)")
	}
	eDefault, _ := rs.Modulus()
	if opt.Modulus > 0 {
		eDefault = opt.Modulus
	}
	as, err := an.ApplyKe(m, framebuckling.KeOptions{From: keFrom, Family: keFamilyOf(opt.Standard), Defaults: opt.Defaults, Modulus: eDefault})
	if err != nil {
		return nil, &OptionError{Msg: err.Error()}
	}
	m.Assumptions = append(m.Assumptions, as...)
	if !frameMethod {
		rep, err := checks.Run(m, rs, opt)
		if err == nil && keFrom == framebuckling.KeBuckling {
			rep.Frame = an.Report(m)
		}
		return rep, err
	}
	return checks.RunWith(m, rs, an.Provider(), opt)
}

// analyseFrame reads and analyses the loaded model's analytical frame; nil
// when the model has none.
func analyseFrame(ld *Loaded, req Request) (*framebuckling.Analysis, error) {
	opt := ifc.Options{LoadCases: req.LoadCases}
	if req.Convention != "" {
		c, err := ifc.ParseSignConvention(req.Convention)
		if err != nil {
			return nil, &OptionError{Msg: err.Error()}
		}
		opt.Convention = c
	}
	fr, err := ifc.ExtractFrame(ld.File, ld.Model, opt)
	if errors.Is(err, ifc.ErrNoFrame) {
		return nil, nil
	}
	if err != nil {
		return nil, err
	}
	ld.Model.Warnings = append(ld.Model.Warnings, fr.Problems...)
	in := &framebuckling.Input{Name: fr.Name, Model: fr.Model, Axial: fr.Axial, Columns: fr.Columns, Planes: fr.Planes, Notes: fr.Notes}
	return framebuckling.Analyze(ld.Model, in, framebuckling.Options{Diaphragms: true}), nil
}

// needsKe reports whether some member axis has a role (its own or the
// user's default) but no ke: the default ke source then tries the frame.
func needsKe(m *checks.Model, defaults [2]checks.RestraintDefault) bool {
	for i := range m.Members {
		for a := range m.Members[i].Axes {
			in := &m.Members[i].Axes[a]
			if in.Ke > 0 {
				continue
			}
			if in.Restraint != checks.RestraintUnknown || defaults[a].Restraint != checks.RestraintUnknown {
				return true
			}
		}
	}
	return false
}

// keFamilyOf chooses the beam factors and footing values of the
// restraint-ratio method: AISC practice for AISC 360, AS 4100 practice for
// AS 4100 and NZS 3404, and the theoretical values for EN 1993-1-1, which
// tabulates neither.
func keFamilyOf(standard string) effective.Family {
	switch {
	case strings.HasPrefix(standard, "aisc"):
		return effective.AISC
	case strings.HasPrefix(standard, "en"):
		return effective.Theoretical
	}
	return effective.AS4100
}
