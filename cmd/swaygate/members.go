package main

import (
	"bufio"
	"context"
	"strings"
	"time"

	"github.com/google/uuid"
	"github.com/spf13/cobra"

	"swaygate/checks"
	"swaygate/internal/pipeline"
	"swaygate/reports"
)

// membersFlags are the flags of `swaygate members`.
type membersFlags struct {
	actions    string
	include    []string
	format     string
	loadCases  bool
	convention string
	units      string
	standard   string
}

func newMembersCmd() *cobra.Command {
	var fl membersFlags
	cmd := &cobra.Command{
		Use:   "members MODEL [--actions FILE] [--include member:POST,STRUT] [--format json|text]",
		Short: "List the columns extracted from an IFC model: section, length, material, restraint, actions and problems",
		Long: "members reads an IFC model and lists every steel column with what was found for it\n" +
			"(section, length, material, restraint per axis and the design actions of each load\n" +
			"combination) and its problems. Columns that are not steel are listed as skipped.\n" +
			"It exits 0 whatever the members' problems; 2 when the model or the actions file\n" +
			"cannot be read.",
		Args: cobra.ExactArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			types, err := parseInclude(fl.include)
			if err != nil {
				return &exitError{code: exitUsage, msg: strings.Replace(err.Error(), "swaygate check:", "swaygate members:", 1)}
			}
			switch fl.format {
			case "json", "text":
			default:
				return &exitError{code: exitUsage, msg: "swaygate members: unknown --format " + quoteArg(fl.format) + " (want json or text)"}
			}
			// The same reading and extraction as check (internal/pipeline).
			lm, err := pipeline.Load(context.Background(), pipeline.Request{
				ModelPath:   args[0],
				ActionsPath: fl.actions,
				Include:     types,
				LoadCases:   fl.loadCases,
				Convention:  fl.convention,
				Options:     checks.Options{Standard: fl.standard},
			})
			if err != nil {
				return checkError(err)
			}
			run := reports.Run{
				RunID:       uuid.NewString(),
				CreatedAt:   time.Now(),
				ToolVersion: version,
				Model:       lm.Info,
				Units:       fl.units,
			}
			listing := withListingProblems(lm.Model)
			w := bufio.NewWriterSize(cmd.OutOrStdout(), 1<<16)
			if fl.format == "json" {
				err = reports.WriteMembersJSON(w, listing, run)
			} else {
				err = reports.WriteMembersText(w, listing, run)
			}
			if ferr := w.Flush(); err == nil {
				err = ferr
			}
			if err != nil {
				return &exitError{code: exitUsage, msg: "swaygate members: " + err.Error()}
			}
			return nil
		},
	}
	f := cmd.Flags()
	f.StringVar(&fl.actions, "actions", "", "side-car design actions (CSV or JSON, keyed by GlobalId)")
	f.StringArrayVar(&fl.include, "include", nil, "also include IfcMember of these predefined types, e.g. member:POST,STRUT (member:* for all)")
	f.StringVar(&fl.format, "format", "text", "output format: json or text")
	f.BoolVar(&fl.loadCases, "load-cases", false, "also check the results of bare (unfactored) load cases")
	f.StringVar(&fl.convention, "sign-convention", "auto", "sign convention of the model's member results: auto, section-forces or end-forces")
	f.StringVar(&fl.units, "units", "si", "display units of the text format: si or us")
	f.StringVar(&fl.standard, "standard", "", "design standard whose idealised ke table turns Swaygate_ColumnDesign end conditions into ke (default AS 4100)")
	return cmd
}

func quoteArg(s string) string { return "\"" + s + "\"" }

// withListingProblems returns a copy of m whose members also carry the
// problems the check engine would find from the data alone (missing section,
// length, restraint per axis, actions per combination), so that the listing
// shows every gap. The model itself is left for the engine, which finds these
// on its own.
func withListingProblems(m *checks.Model) *checks.Model {
	out := *m
	if len(m.Combinations) == 0 {
		out.Warnings = append(append([]checks.Reason(nil), m.Warnings...), checks.Reason{Code: checks.CodeNoDesignCombinations,
			Message: "the model has no design load combinations: there are no actions to check"})
	}
	out.Members = make([]checks.Member, len(m.Members))
	for i := range m.Members {
		mb := m.Members[i]
		ps := append([]checks.Reason(nil), mb.Problems...)
		has := func(code, axis, combination string) bool {
			for _, p := range ps {
				if p.Code == code && (p.Axis == "" || axis == "" || p.Axis == axis) && (p.Combination == "" || p.Combination == combination) {
					return true
				}
			}
			return false
		}
		if mb.Section == nil && !has(checks.CodeMissingSection, "", "") && !has(checks.CodeUnsupportedProfile, "", "") {
			ps = append(ps, checks.Reason{Code: checks.CodeMissingSection, Message: "no section properties"})
		}
		if !(mb.Length > 0) && !has(checks.CodeMissingLength, "", "") {
			ps = append(ps, checks.Reason{Code: checks.CodeMissingLength, Message: "no member length"})
		}
		for _, a := range checks.Axes {
			in := &mb.Axes[a]
			switch {
			case has(checks.CodeMissingRestraint, a.String(), "") || has(checks.CodeInvalidRestraint, a.String(), ""):
			case in.Ke < 0:
				ps = append(ps, checks.Reason{Code: checks.CodeInvalidRestraint, Axis: a.String(), Message: "ke must be positive"})
			case in.Restraint == checks.RestraintUnknown || in.Ke == 0:
				ps = append(ps, checks.Reason{Code: checks.CodeMissingRestraint, Axis: a.String(),
					Message: "no restraint data for this axis (Swaygate_ColumnDesign: sway or braced, and ke)"})
			case in.Restraint == checks.Sway && in.Ke < 1:
				ps = append(ps, checks.Reason{Code: checks.CodeInvalidRestraint, Axis: a.String(),
					Message: "ke below 1 on a sway axis: a member free to sway cannot have ke < 1"})
			}
		}
		for k := range mb.Actions {
			act := &mb.Actions[k]
			for _, a := range checks.Axes {
				if act.Moments[a].InteriorUnknown {
					ps = append(ps, checks.Reason{Code: checks.CodeInteriorMomentUnknown, Combination: act.Combination, Axis: a.String(),
						Message: "a transverse load acts between the ends but only end moments are known: M*_m cannot be found"})
				}
			}
		}
		for _, c := range m.Combinations {
			found := false
			for k := range mb.Actions {
				if mb.Actions[k].Combination == c {
					found = true
					break
				}
			}
			if !found && !has(checks.CodeMissingActions, "", c) {
				ps = append(ps, checks.Reason{Code: checks.CodeMissingActions, Combination: c, Message: "no design actions for this combination"})
			}
		}
		mb.Problems = ps
		out.Members[i] = mb
	}
	return &out
}
