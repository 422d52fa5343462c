// Package checks is swaygate's engineering core: the stability and second-order
// (moment amplification) checks of steel columns on plain Go values.
//
// It knows nothing of IFC, HTTP or files. Its input is a Model of Members (what
// the IFC reader, a side-car file or a test built), its output a Result per
// member with a verdict, reasons, per-combination and per-axis numbers and an
// ordered calculation trace.
//
// # Units
//
// Every quantity inside the package is in one consistent set: N, mm, MPa
// (N/mm²), N·mm. Converting to kN and kNm is the reports' job.
//
// # Nulls
//
// A number that could not be computed is NaN inside the package (see Num); the
// JSON report writes it as null, never as 0.
//
// # Layout
//
// The rule set of each design standard is its own subpackage (as4100, nzs3404,
// ...): constants, thresholds and formulas of a standard live there and nowhere
// else. Section properties are computed in checks/section from plain shape
// structs.
package checks
