// Package effective computes effective length factors ke (AISC: K) of
// compression members from their end restraint, without reading a chart:
//
//   - Idealised: the design values for idealised end conditions (fixed,
//     pinned, free) of AS 4100 Figure 4.6.3.2 and of AISC Table C-A-7.1, or
//     the theoretical values.
//   - Braced and Sway: the alignment-chart equations (AISC 360 Commentary
//     Appendix 7; the AS 4100 Figure 4.6.3.3 charts are believed to be the
//     same), solved numerically for K from the end-restraint ratios G_A, G_B
//     (AS 4100: γ1, γ2).
//   - Ratio, BetaE and Footing: the end-restraint ratio of a joint from the
//     columns and beams rigidly connected there in the plane of buckling,
//     with the beam far-end adjustment factors and the footing values of the
//     chosen Family.
//
// # Units
//
// E in MPa, I in mm⁴, lengths in mm; ratios are dimensionless. Only E·I/L
// enters, so any consistent set works.
//
// # Infinite ratios
//
// A ratio of +Inf is a pinned end (no rotational restraint) and 0 a fixed
// end; both are accepted by Braced and Sway, which use the limits of the
// equations there. A sway member pinned at both ends (G_A = G_B = +Inf) is a
// mechanism: Sway returns ErrMechanism.
package effective
