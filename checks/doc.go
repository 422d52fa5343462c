// Package checks is swaygate's engineering core: the stability and second-order
// (moment amplification) checks of steel columns on plain Go values.
//
// It knows nothing of IFC, HTTP or files. Its input is a Model of Members (what
// the IFC reader, a side-car file or a test built), its output a Report with an
// Element per member: a verdict, reasons, per-combination and per-axis numbers
// and an ordered calculation trace.
//
// # Running a check
//
//	rs, err := standards.Lookup("as4100")      // package checks/standards
//	rep, err := checks.Run(model, rs, checks.DefaultOptions())
//
// Run returns an error only for invalid options (wrapping ErrOption, or the
// rule set's own option errors); problems of the model's data become reasons
// and needs-analysis verdicts. The model is read, never changed.
//
// # Engine, rule sets and sway providers
//
// Three parts cooperate:
//
//   - The engine (Run, RunWith) does what every standard shares. It resolves
//     each member's inputs: E (the model's, else Options.Modulus, else the
//     standard's default, recorded as assumed-modulus), restraint per axis
//     (Options.Defaults fill gaps, recorded as assumed-restraint), ke and the
//     braced ke (default 1.0 on a sway axis), buckling lengths, the global
//     sway direction (an unrotated column when unknown). It finds missing data
//     (missing-section, missing-length, missing-restraint, invalid-restraint,
//     missing-actions, the member's own blocking problems) and turns it into
//     needs-analysis while still computing every value it can. It aggregates
//     verdicts (fail > needs-analysis > pass; per axis, combination and
//     member), picks the governing combination (the one that set the verdict,
//     ties to the largest delta_m), compacts reasons (one that recurs in every
//     combination is kept once), counts the summary and keeps the trace.
//   - A RuleSet is one design standard, in its own package (checks/as4100,
//     checks/nzs3404, checks/en1993, checks/aisc360): its default modulus, the member buckling loads (Member),
//     which storey form it uses (StoreyLambda), the amplification and the
//     reasons of one axis under one combination (Amplify), its capacity checks
//     for scope full (Capacity) and its clause labels in the trace. Constants,
//     thresholds and formulas of a standard live there and nowhere else.
//   - A SwayProvider gives every axis its role (sway, leaning, braced) and the
//     elastic buckling load factor lambda_c of sway and leaning axes, model-wide:
//     StoreyProvider (the default, --sway-method storey) sums the sway columns'
//     stiffness and every column's load per storey, global direction and
//     combination; MemberProvider (member) takes each member alone. A frame
//     buckling analysis plugs in through RunWith without changing rule sets.
//
// Run works in three passes: resolve every member and compute its buckling
// loads; let the provider prepare its model-wide values (the storey rows of
// Report.Storeys); then check every member under every combination.
//
// # Adding a standard
//
// Write a package with a type implementing RuleSet (see as4100 for the
// pattern, and NewVariant there for a standard that follows AS 4100), keep its
// numbers in one named table where they are not confirmed against the
// published text, name its clauses in its steps, and add one case to
// checks/standards. The engine does not change.
//
// # Trace
//
// Each step (Step) names a quantity, the clause, the formula, its inputs with
// units and the value in report units (kN, kNm, mm, MPa, mm⁴, "" for
// dimensionless). Options.Trace: "full" keeps every combination, "summary"
// the member-level steps and the governing combination, "none" nothing. Steps
// are fixed structs recorded through a Tracer without fmt or maps. A stored
// step costs some 450 bytes, so for large models set Options.TraceOnDemand and
// let the writer rebuild each element's steps with Report.AppendTrace into
// one reused buffer, or on several goroutines with one TraceReplayer each
// (Report.NewTraceReplayer).
//
// # Units
//
// Every quantity inside the package is in one consistent set: N, mm, MPa
// (N/mm²), N·mm. Converting to kN and kNm is the reports' job; only trace steps
// carry report units.
//
// # Nulls
//
// A number that could not be computed is NaN inside the package (see Num); the
// JSON report writes it as null, never as 0. lambda_c is +Inf where there is
// no compression (written as null).
//
// # Layout
//
// The rule set of each design standard is its own subpackage (as4100, nzs3404,
// en1993, aisc360): constants, thresholds and formulas of a standard live there and nowhere
// else. Section properties are computed in checks/section from plain shape
// structs.
package checks
