#pragma once
/// Answers with a bound from a calibrated product (model/calibration.hpp): beside each answer at
/// the fitted values, the answer at the one-sided 95 % bound of the fit.
///
/// Method (the delta method, evaluated exactly at its point): the answer q is linearised in the
/// fitted parameters' logarithms, g = ∂q/∂(ln θ) by forward differences of one standard error
/// each; the least favourable point of the one-sided 95 % region is
///     d* = −t(0.95, dof) · C g / √(gᵀ C g)     (C the covariance of ln θ; q larger = safer)
/// and the answer there is computed with the full model (not extrapolated), so rounding and
/// verdicts at the bound follow the same rules as the nominal answer. A quantity that does not
/// depend on the parameters gets d* = 0. Parameters the fit could only bound (an h lower bound,
/// already the slower-heating choice) or not identify are not varied.
#include <functional>
#include <vector>

#include "coldcore/model/calibration.hpp"
#include "coldcore/process/inverse.hpp"

namespace coldcore::process {

/// The scenario with the calibrated parameters moved by `d_ln` (ln α, then each fitted h group).
Scenario shifted_scenario(const Scenario& s, const Calibration& c, const std::vector<double>& d_ln);

/// ∂q/∂(ln θ) by forward differences of one standard error; q(d_ln) is the answer at a shift.
std::vector<double> fit_gradient(const Calibration& c, const std::function<double(const std::vector<double>&)>& q,
                                 double q0);

/// d* above for gradient g (q larger = safer; pass −g for a quantity where smaller is safer).
std::vector<double> least_favourable_shift(const Calibration& c, const std::vector<double>& g);

/// t(0.95, dof): the one-sided 95 % Student quantile of the calibration.
double one_sided_t95(const Calibration& c);

/// Each target of `s` evaluated at its own least favourable point of the fit (margin = the
/// root finder's margin of inverse.hpp, larger = safer). Result i belongs to target i.
std::vector<TargetResult> targets_at_fit_bound(const Scenario& s, const Calibration& c, const Libraries& libs);

/// The question answered at the least favourable point for its unrounded answer (larger hold
/// or chill time, smaller size, higher medium temperature = the unfavourable direction).
SolveResult solve_at_fit_bound(Question q, const Scenario& s, const Calibration& c, const Libraries& libs,
                               const SolveOptions& opts, const SolveResult& nominal);

}  // namespace coldcore::process
