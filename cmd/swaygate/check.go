package main

import (
	"bufio"
	"context"
	"errors"
	"fmt"
	"io"
	"os"
	"os/signal"
	"strconv"
	"strings"

	"github.com/spf13/cobra"

	"swaygate/checks"
	"swaygate/checks/standards"
	"swaygate/ifcstep"
	"swaygate/ifcstep/sidecar"
	"swaygate/internal/pipeline"
	"swaygate/reports"
)

// checkFlags are the flags of `swaygate check`, bound into one struct.
type checkFlags struct {
	standard      string
	actions       string
	storeys       string
	swayMethod    string
	scope         string
	format        string
	output        string
	gate          string
	trace         string
	nzsProvisions string
	aiscMethod    string
	units         string
	include       []string
	loadCases     bool
	convention    string
	keFrom        string

	defaultBoth  string
	defaultMajor string
	defaultMinor string
	modulus      float64
	yield        float64
	memberPDelta bool

	projectFile   string
	noProjectFile bool
	project       string
	progress      string
}

func newCheckCmd(d deps) *cobra.Command {
	var fl checkFlags
	cmd := &cobra.Command{
		Use:   "check MODEL",
		Short: "Check the stability and moment amplification of every steel column in an IFC model",
		Long: `check reads an IFC model (plain, gzip or .ifczip), extracts every steel column, and checks
each one under every design load combination: elastic buckling loads about both axes, the
buckling load factor lambda_c, delta_b, delta_s, delta_m and the amplified moments, with a
verdict per GlobalId: pass, fail or needs-analysis.

Exit status: 0 when the gate holds, 1 when it does not (--gate fail: any member fails;
--gate needs-analysis: any member fails or needs analysis; --gate none: never), 2 for a
usage or input error.

Defaults for flags may sit in a project file beside the model (swaygate.conf); flags given on
the command line win. Results support, and never replace, the judgement of a licensed
engineer and the local building code.`,
		Args: cobra.ExactArgs(1),
		RunE: func(cmd *cobra.Command, args []string) error {
			return runCheck(cmd, args[0], &fl, d)
		},
	}
	f := cmd.Flags()
	f.StringVar(&fl.standard, "standard", standards.Default, "design standard: "+strings.Join(standards.Names(), ", "))
	f.StringVar(&fl.actions, "actions", "", "side-car design actions (CSV or JSON, keyed by GlobalId); replaces the model's own results")
	f.StringVar(&fl.storeys, "storeys", "", "storey file (CSV or JSON): storey shear, drift and height per storey, direction and combination, for the drift forms of lambda_c")
	f.StringVar(&fl.swayMethod, "sway-method", "storey", "lambda_c of sway axes: storey, member or frame")
	f.StringVar(&fl.scope, "scope", "", "stability (amplification only) or full (adds member capacity); default: the standard's")
	f.StringVar(&fl.format, "format", "text", "output format: text, json, junit, csv or html")
	f.StringVarP(&fl.output, "output", "o", "", "write the report to this file instead of standard output")
	f.StringVar(&fl.gate, "gate", reports.GateFail, "gate policy for the exit status: fail, needs-analysis or none (report only, exit 0)")
	f.StringVar(&fl.trace, "trace", "full", "calculation trace in json and html: full, summary (governing combination) or none")
	f.StringVar(&fl.nzsProvisions, "nzs-provisions", "default", "NZS 3404 sway provisions: default or quoted (unconfirmed 0.95 factor and lambda_c >= 10 rule)")
	f.StringVar(&fl.aiscMethod, "aisc-method", "lrfd", "AISC 360 design basis for alpha: lrfd (1.0) or asd (1.6)")
	f.StringVar(&fl.units, "units", reports.UnitsSI, "display units of text and html: si (kN, kNm) or us (kip, kip-ft)")
	f.StringArrayVar(&fl.include, "include", nil, "also check IfcMember of these predefined types, e.g. member:POST,STRUT (member:* for all)")
	f.BoolVar(&fl.loadCases, "load-cases", false, "also check the results of bare (unfactored) load cases")
	f.StringVar(&fl.convention, "sign-convention", "auto", "sign convention of the model's member results: auto, section-forces or end-forces")
	f.StringVar(&fl.keFrom, "ke-from", "auto", "where ke comes from: auto (the property set, else the analytical frame's restraint ratios), property-set, restraint-ratios or buckling")
	f.StringVar(&fl.defaultBoth, "default-restraint", "", "restraint for both axes of columns without restraint data: ROLE[:KE[:BRACED_KE]], e.g. sway:1.2 or braced:1.0")
	f.StringVar(&fl.defaultMajor, "default-major", "", "as --default-restraint, major axis only")
	f.StringVar(&fl.defaultMinor, "default-minor", "", "as --default-restraint, minor axis only")
	f.Float64Var(&fl.modulus, "modulus", 0, "elastic modulus E in MPa where the model gives none (default: the standard's)")
	f.Float64Var(&fl.yield, "yield", 0, "yield stress fy in MPa where the model gives none")
	f.BoolVar(&fl.memberPDelta, "member-pdelta-modelled", false, "second-order results also include member (P-delta) effects, so delta_b = 1 for them")
	f.StringVar(&fl.projectFile, "project-file", "", "project defaults file (default: swaygate.conf beside the model, when present)")
	f.BoolVar(&fl.noProjectFile, "no-project-file", false, "ignore any project defaults file")
	f.StringVar(&fl.project, "project", "", "project name recorded in the report")
	f.StringVar(&fl.progress, "progress", "auto", "progress on standard error: auto (when it is a terminal), always or never")
	return cmd
}

// runCheck is the check command.
func runCheck(cmd *cobra.Command, model string, fl *checkFlags, d deps) error {
	if err := applyProjectFile(cmd, model, fl); err != nil {
		return err
	}
	opt, err := fl.options()
	if err != nil {
		return err
	}
	switch fl.format {
	case "text", "json", "junit", "csv", "html":
	default:
		return usage("unknown --format %q (want text, json, junit, csv or html)", fl.format)
	}
	include, err := parseInclude(fl.include)
	if err != nil {
		return err
	}

	prog := newProgress(cmd.ErrOrStderr(), fl.progress, model)
	ctx, stop := signal.NotifyContext(context.Background(), os.Interrupt)
	defer stop()

	prog.stage("reading and checking " + model)
	res, err := pipeline.Check(ctx, pipeline.Request{
		ModelPath:   model,
		ActionsPath: fl.actions,
		StoreysPath: fl.storeys,
		Options:     opt,
		Include:     include,
		LoadCases:   fl.loadCases,
		Convention:  fl.convention,
		Gate:        fl.gate,
		Project:     fl.project,
		Units:       fl.units,
		RunID:       d.newRunID(),
		Now:         d.now,
		ToolVersion: version,
	})
	if err != nil {
		prog.done()
		return checkError(err)
	}
	prog.stage("writing the " + fl.format + " report")

	out := cmd.OutOrStdout()
	var file *os.File
	if fl.output != "" {
		file, err = os.Create(fl.output)
		if err != nil {
			prog.done()
			return usage("%v", err)
		}
		out = file
	}
	w := bufio.NewWriterSize(out, 1<<16)
	err = writeReport(w, fl.format, res)
	if ferr := w.Flush(); err == nil {
		err = ferr
	}
	if file != nil {
		if cerr := file.Close(); err == nil {
			err = cerr
		}
	}
	prog.done()
	if err != nil {
		return &exitError{code: exitUsage, msg: "swaygate check: writing the report: " + err.Error()}
	}
	if fl.output != "" && fl.format != "text" {
		s := res.Report.Summary
		fmt.Fprintf(cmd.ErrOrStderr(), "swaygate: %d members: %d pass, %d fail, %d needs-analysis; gate %s %s; report written to %s\n",
			s.Members, s.Pass, s.Fail, s.NeedsAnalysis, res.Run.Gate.Policy, holdsWord(res.Run.Gate.Passed), fl.output)
	}
	if !res.Run.Gate.Passed {
		return &exitError{code: exitGate}
	}
	return nil
}

func holdsWord(passed bool) string {
	if passed {
		return "holds"
	}
	return "does not hold"
}

// writeReport writes res in the chosen format.
func writeReport(w io.Writer, format string, res *pipeline.Result) error {
	switch format {
	case "json":
		return reports.WriteJSON(w, res.Report, res.Run)
	case "junit":
		return reports.WriteJUnit(w, res.Report, res.Run)
	case "csv":
		return reports.WriteCSV(w, res.Report, res.Run)
	case "html":
		return reports.WriteHTML(w, res.Report, res.Run)
	default:
		return reports.WriteText(w, res.Report, res.Run)
	}
}

// options turns the flags into check options.
func (fl *checkFlags) options() (checks.Options, error) {
	opt := checks.DefaultOptions()
	opt.Standard = fl.standard
	opt.SwayMethod = fl.swayMethod
	if fl.scope != "" {
		opt.Scope = fl.scope
	}
	opt.Trace = fl.trace
	opt.NZSProvisions = fl.nzsProvisions
	opt.AISCMethod = fl.aiscMethod
	opt.MemberPDeltaModelled = fl.memberPDelta
	opt.Modulus = fl.modulus
	opt.Yield = fl.yield
	opt.TraceOnDemand = true
	switch fl.keFrom {
	case "auto", "property-set", "restraint-ratios", "buckling":
		opt.KeFrom = fl.keFrom
	default:
		return opt, usage("unknown --ke-from %q (want auto, property-set, restraint-ratios or buckling)", fl.keFrom)
	}
	for _, d := range []struct {
		flag, value string
		axes        []checks.Axis
	}{
		{"--default-restraint", fl.defaultBoth, []checks.Axis{checks.Major, checks.Minor}},
		{"--default-major", fl.defaultMajor, []checks.Axis{checks.Major}},
		{"--default-minor", fl.defaultMinor, []checks.Axis{checks.Minor}},
	} {
		if d.value == "" {
			continue
		}
		rd, err := parseRestraintDefault(d.value)
		if err != nil {
			return opt, usage("%s %q: %v", d.flag, d.value, err)
		}
		for _, a := range d.axes {
			opt.Defaults[a] = rd
		}
	}
	return opt, nil
}

// parseRestraintDefault reads ROLE[:KE[:BRACED_KE]].
func parseRestraintDefault(s string) (checks.RestraintDefault, error) {
	var rd checks.RestraintDefault
	parts := strings.Split(s, ":")
	switch strings.ToLower(parts[0]) {
	case "sway":
		rd.Restraint = checks.Sway
	case "braced":
		rd.Restraint = checks.Braced
	default:
		return rd, errors.New("want sway or braced, then optional :KE and :BRACED_KE")
	}
	if len(parts) > 3 {
		return rd, errors.New("too many fields: want ROLE[:KE[:BRACED_KE]]")
	}
	for i, p := range parts[1:] {
		v, err := strconv.ParseFloat(p, 64)
		if err != nil || !(v > 0) {
			return rd, fmt.Errorf("%q is not a positive effective length factor", p)
		}
		if i == 0 {
			rd.Ke = v
		} else {
			rd.BracedKe = v
		}
	}
	return rd, nil
}

// parseInclude reads --include member:TYPE[,TYPE...] values.
func parseInclude(values []string) ([]string, error) {
	var types []string
	for _, inc := range values {
		kind, list, ok := strings.Cut(inc, ":")
		if !ok || !strings.EqualFold(kind, "member") || list == "" {
			return nil, usage("--include %q: want member:TYPE[,TYPE...], e.g. member:POST,STRUT", inc)
		}
		for _, t := range strings.Split(list, ",") {
			if t = strings.ToUpper(strings.TrimSpace(t)); t != "" {
				types = append(types, t)
			}
		}
	}
	return types, nil
}

// checkError maps a pipeline error to exit status 2 with its message: the
// positioned text of the readers' errors, the option errors, or the
// operating system's.
func checkError(err error) error {
	var pe *ifcstep.Error
	var se *sidecar.Error
	var oe *pipeline.OptionError
	switch {
	case errors.As(err, &pe):
		return &exitError{code: exitUsage, msg: pe.Error()}
	case errors.As(err, &se):
		return &exitError{code: exitUsage, msg: se.Error()}
	case errors.As(err, &oe):
		return &exitError{code: exitUsage, msg: oe.Error()}
	case errors.Is(err, context.Canceled):
		return &exitError{code: exitUsage, msg: "swaygate: interrupted"}
	}
	msg := err.Error()
	if !strings.HasPrefix(msg, "swaygate") {
		msg = "swaygate: " + msg
	}
	return &exitError{code: exitUsage, msg: msg}
}

func usage(format string, args ...any) error {
	return &exitError{code: exitUsage, msg: "swaygate check: " + fmt.Sprintf(format, args...)}
}
