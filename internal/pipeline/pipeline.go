// Package pipeline runs one check from a model file to a report: read and
// index the STEP file, extract the members (with optional side-car actions),
// run the chosen rule set, and evaluate the gate. The CLI and the HTTP
// service both call it, so that they give the same results.
package pipeline

import (
	"context"
	"crypto/sha256"
	"encoding/hex"
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"runtime"
	"strings"
	"time"

	"swaygate/checks"
	"swaygate/checks/effective"
	"swaygate/checks/standards"
	"swaygate/ifcstep"
	"swaygate/ifcstep/ifc"
	"swaygate/ifcstep/sidecar"
	"swaygate/reports"
)

// Request is one check to run.
type Request struct {
	// ModelPath is the model on disk: plain STEP, gzip or .ifczip.
	ModelPath string
	// Name is the model's display name in reports (default: the base name of
	// ModelPath).
	Name string
	// ActionsPath is an optional side-car actions file (CSV or JSON).
	ActionsPath string
	// ActionsName is the side-car's display name in messages (default: the
	// base name of ActionsPath).
	ActionsName string
	// StoreysPath is an optional storey file (storey shear, drift and height
	// per storey, direction and combination) for the drift forms of the
	// storey buckling load factor; StoreysName its display name.
	StoreysPath string
	StoreysName string

	Options checks.Options
	// Include lists IfcMember predefined types to check as well as columns,
	// e.g. ["POST", "STRUT"]; "*" includes every IfcMember.
	Include []string
	// LoadCases: also check results of unfactored load cases.
	LoadCases bool
	// Convention declares the sign convention of the model's member results:
	// "auto" (default), "section-forces" or "end-forces".
	Convention string

	Gate    string // "fail" (default), "needs-analysis" or "none"
	Project string
	Units   string // "si" (default) or "us": display units of text and HTML

	RunID       string
	Now         func() time.Time // default time.Now
	ToolVersion string
	// Limits bound the STEP reader (zero: the reader's defaults).
	Limits ifcstep.Limits
}

// Result is a finished check.
type Result struct {
	Report *checks.Report
	Run    reports.Run
	// Model is what the extraction produced (the report points into it).
	Model *checks.Model
}

// Loaded is a read model and the members extracted from it.
type Loaded struct {
	File  *ifcstep.File
	Model *checks.Model
	Info  reports.ModelInfo
}

// Load reads the model (and side-car) of req and extracts its members,
// without checking them. The model's SHA-256 is computed on another
// goroutine while it is read and its members extracted. Once they are,
// the pages of a memory-mapped model leave the resident memory
// (ifcstep.File.DropPages), so that the peak stays near the file size.
func Load(ctx context.Context, req Request) (*Loaded, error) {
	ld, wait, err := load(ctx, req)
	if err != nil {
		return nil, err
	}
	if err := wait(); err != nil {
		return nil, err
	}
	return ld, nil
}

// load is Load, but the hash may still be running when it returns: wait
// waits for it, sets ld.Info.SHA256 and returns the hash's error. Check
// waits only after the checks, which run on one core: the hash has the
// other one.
func load(ctx context.Context, req Request) (ld *Loaded, wait func() error, err error) {
	// The report names the model by its display name (default: the file's
	// base name); messages by the display name or the path as given.
	name, msgName := req.Name, req.Name
	if name == "" {
		name, msgName = filepath.Base(req.ModelPath), req.ModelPath
	}
	type hashed struct {
		sum string
		err error
	}
	hc := make(chan hashed, 1)
	go func() {
		sum, err := fileSHA256(req.ModelPath)
		hc <- hashed{sum, err}
	}()

	opt := ifc.Options{MemberTypes: req.Include, LoadCases: req.LoadCases, KeFamily: keFamily(req.Options.Standard)}
	if req.Convention != "" {
		c, err := ifc.ParseSignConvention(req.Convention)
		if err != nil {
			<-hc
			return nil, nil, &OptionError{Msg: err.Error()}
		}
		opt.Convention = c
	}
	if req.ActionsPath != "" {
		an := req.ActionsName
		if an == "" {
			an = filepath.Base(req.ActionsPath)
		}
		fh, err := os.Open(req.ActionsPath)
		if err != nil {
			<-hc
			return nil, nil, err
		}
		sc, err := sidecar.Read(fh, an)
		fh.Close()
		if err != nil {
			<-hc
			return nil, nil, err
		}
		opt.Actions = sc
	}
	if err := ctx.Err(); err != nil {
		<-hc
		return nil, nil, err
	}
	// The extraction reads its most numerous relationships from the
	// references the reader records while indexing.
	ropt := ifcstep.Options{Limits: req.Limits, RefTypes: ifc.RefTypes()}
	if ropt.Limits == (ifcstep.Limits{}) {
		ropt.Limits = ifcstep.DefaultLimits()
	}
	f, err := readModel(req.ModelPath, msgName, ropt)
	if err != nil {
		<-hc
		return nil, nil, err
	}
	if f.Size() >= collectAfterRead {
		// The index of a large model leaves its per-chunk arrays behind
		// (about a ninth of the file size): collected now, their memory
		// serves the extraction instead of growing the heap.
		runtime.GC()
	}
	if err := ctx.Err(); err != nil {
		<-hc
		return nil, nil, err
	}
	m, err := ifc.Extract(f, opt)
	if err != nil {
		<-hc
		return nil, nil, err
	}
	// The members hold copies of what they need: the pages of a mapped
	// model can leave the resident memory (the File stays usable, e.g. for
	// the frame analysis). Dropping them takes a while (7 ms for 300 MB):
	// it runs beside the checks, which use one core.
	go f.DropPages()
	if req.StoreysPath != "" {
		sn := req.StoreysName
		if sn == "" {
			sn = filepath.Base(req.StoreysPath)
		}
		fh, err := os.Open(req.StoreysPath)
		if err != nil {
			<-hc
			return nil, nil, err
		}
		rows, err := sidecar.ReadStoreys(fh, sn)
		fh.Close()
		if err != nil {
			<-hc
			return nil, nil, err
		}
		m.StoreyData = append(m.StoreyData, rows...)
	}
	f.Name = name
	ld = &Loaded{
		File:  f,
		Model: m,
		Info:  reports.ModelInfo{File: name, Schema: f.Family.String(), Instances: f.Len()},
	}
	return ld, func() error {
		h := <-hc
		ld.Info.SHA256 = h.sum
		return h.err
	}, nil
}

// collectAfterRead is the model size from which Load collects garbage
// between indexing and extraction (see there).
const collectAfterRead = 64 << 20

// readModel reads (memory-maps) the model file, naming it in messages by its
// display name so that a server's temporary paths never show.
func readModel(path, name string, opt ifcstep.Options) (*ifcstep.File, error) {
	opt.Name = name
	return ifcstep.ReadFile(path, opt)
}

// Check runs req. Errors the user caused are returned as the positioned
// errors of the packages that found them (*ifcstep.Error, *sidecar.Error),
// as *OptionError, or wrap checks.ErrOption; ctx cancels a long run between
// its stages.
func Check(ctx context.Context, req Request) (*Result, error) {
	opt := withDefaults(req.Options)
	rs, err := standards.Lookup(opt.Standard)
	if err != nil {
		return nil, &OptionError{Msg: err.Error()}
	}
	gate := req.Gate
	if gate == "" {
		gate = reports.GateFail
	}
	if gate != reports.GateFail && gate != reports.GateNeedsAnalysis && gate != reports.GateNone {
		return nil, &OptionError{Msg: fmt.Sprintf("unknown gate %q (want %s, %s or %s)", gate, reports.GateFail, reports.GateNeedsAnalysis, reports.GateNone)}
	}
	switch req.Units {
	case "", reports.UnitsSI, reports.UnitsUS:
	default:
		return nil, &OptionError{Msg: fmt.Sprintf("unknown units %q (want si or us)", req.Units)}
	}
	req.Options = opt

	ld, wait, err := load(ctx, req)
	if err != nil {
		return nil, err
	}
	if err := ctx.Err(); err != nil {
		wait()
		return nil, err
	}
	rep, err := runChecks(ld, rs, opt, req)
	if herr := wait(); err == nil {
		err = herr
	}
	if err != nil {
		return nil, err
	}
	g, err := reports.NewGate(gate, rep.Summary)
	if err != nil {
		return nil, &OptionError{Msg: err.Error()}
	}
	now := time.Now
	if req.Now != nil {
		now = req.Now
	}
	return &Result{
		Report: rep,
		Model:  ld.Model,
		Run: reports.Run{
			RunID:       req.RunID,
			CreatedAt:   now().UTC(),
			ToolVersion: req.ToolVersion,
			Project:     req.Project,
			Model:       ld.Info,
			Gate:        g,
			Units:       req.Units,
		},
	}, nil
}

// OptionError is an invalid request option (an unknown standard, gate, unit
// system or sign convention).
type OptionError struct{ Msg string }

func (e *OptionError) Error() string { return "swaygate: " + e.Msg }

// Unwrap makes an OptionError match checks.ErrOption.
func (e *OptionError) Unwrap() error { return checks.ErrOption }

// keFamily chooses the idealised ke table of the standard's family.
func keFamily(standard string) effective.Family {
	if strings.HasPrefix(standard, "aisc") {
		return effective.AISC
	}
	return effective.AS4100
}

func fileSHA256(path string) (string, error) {
	f, err := os.Open(path)
	if err != nil {
		return "", err
	}
	defer f.Close()
	h := sha256.New()
	if _, err := io.Copy(h, f); err != nil {
		return "", err
	}
	return hex.EncodeToString(h.Sum(nil)), nil
}

// ErrNotImplemented was returned before the extraction was wired in; Check
// no longer returns it. Kept so that callers that still test for it build.
var ErrNotImplemented = errors.New("pipeline: not implemented")

// withDefaults fills the option fields a caller left empty from
// checks.DefaultOptions, so that a zero Options checks as the command line
// does by default.
func withDefaults(opt checks.Options) checks.Options {
	def := checks.DefaultOptions()
	for _, f := range []struct {
		v *string
		d string
	}{
		{&opt.Standard, def.Standard}, {&opt.SwayMethod, def.SwayMethod}, {&opt.Scope, def.Scope},
		{&opt.Trace, def.Trace}, {&opt.NZSProvisions, def.NZSProvisions}, {&opt.AISCMethod, def.AISCMethod},
		{&opt.KeFrom, def.KeFrom},
	} {
		if *f.v == "" {
			*f.v = f.d
		}
	}
	return opt
}
