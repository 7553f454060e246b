#pragma once
/// Calibration of the exact conduction model to a heat-penetration study: the thermal
/// diffusivity α and one surface coefficient h per stage group, by nonlinear least squares
/// (Eigen's Levenberg–Marquardt) on the series model driven by the study's stages (the logged
/// medium, come-up included), against every probe reading.
///
/// Parameters are fitted as logarithms (both are positive, and their intervals are then
/// asymmetric as they should be). Each probe is simulated from a uniform initial temperature
/// fitted with the rest (a nuisance parameter: one noisy first reading would otherwise bias the
/// whole fit and the intervals would not cover it); its start is the mean of the readings up to
/// Fo = 0.02 at the file's α, when the centre has not moved yet. Residuals are model − measured,
/// in kelvin, unweighted.
/// Standard errors from s²·(JᵀJ)⁻¹ at the optimum (s² = SSR/(n − p)); 95 % intervals
/// exp(ln θ ± t(0.975, n − p)·se) with Student's t from Boost.Math.
///
/// Stage groups: stages whose file gives the same finite h and that go the same way (heating or
/// cooling, by h_ends.hpp's rule from the product's initial temperature) share one fitted h; a
/// stage with h = inf keeps a surface at the medium (not fitted). A group whose h cannot be identified is
/// not given an interval:
///  - lower_bound: the data are as well explained by any larger h (a high Biot number): the
///    interval would run to infinity. h is fixed at the smallest value the data allow, the h
///    where the profiled sum of squares rises to SSR·(1 + t²/(n − p)) (the one-parameter 95 %
///    profile limit), and α is fitted again with it. Flagged when the fitted Bi exceeds
///    kHighBiot or the interval's ends are more than a factor 100 apart. The intervals of α and
///    of the other h then span the fits at the bound and at the top of h's range, so they do not
///    pretend h is known.
///  - not_identified: the readings do not depend on it (e.g. no probe reading in its stages):
///    kept at the file's value.
#include <array>
#include <string>
#include <vector>

#include "coldcore/conduction/history.hpp"
#include "coldcore/model/calibration.hpp"
#include "coldcore/model/product.hpp"
#include "coldcore/process/study.hpp"

namespace coldcore::process {

enum class HStatus { fitted, lower_bound, fixed_infinite, not_identified };

struct FittedH {
  std::vector<int> stages;       ///< indices into the study's stages
  HStatus status = HStatus::fitted;
  double h_W_m2K = 0;            ///< the fitted value, the bound, or the file's
  double h_start_W_m2K = 0;      ///< the file's value (the starting point)
  std::array<double, 2> ci95_W_m2K{0, 0};  ///< fitted only
  double se_log = 0;             ///< standard error of ln h (fitted only)
  double biot = 0;               ///< h·L_min/k at the fitted k
};

struct ProbeFit {
  std::string name;
  std::vector<double> time_s, measured_C, model_C;  ///< every reading
  double rms_K = 0;
  double initial_C = 0;          ///< the fitted uniform initial temperature
};

struct FitResult {
  double alpha_m2_s = 0;
  std::array<double, 2> alpha_ci95_m2_s{0, 0};
  double alpha_se_log = 0;
  double alpha_start_m2_s = 0;
  double conductivity_W_mK = 0;  ///< α·ρ·cp
  std::vector<FittedH> h;        ///< one per stage group, in stage order
  /// Covariance and correlation of the free parameters' logarithms, in the order
  /// [ln α, ln h of each group with status fitted]; `parameters` names them ("alpha", "h:<i>").
  std::vector<std::string> parameters;
  std::vector<std::vector<double>> covariance_log, correlation;
  double rms_K = 0;
  int n_points = 0, n_parameters = 0, dof = 0;  ///< n_parameters counts each probe's initial temperature
  double t95 = 0;                ///< t(0.975, dof)
  std::vector<ProbeFit> probes;
  int iterations = 0;            ///< model evaluations of the solver
  bool converged = false;
  /// k or a fitted h ended at the edge of its accepted range (model/limits.hpp): the readings
  /// do not look like this product in this process (probe position, swapped logs, wrong file).
  bool at_limit = false;
  /// An h is held at its lower bound, and the intervals of α and the fitted h span the fit at
  /// that bound and the fit with that h at the top of its range (any larger h fits as well);
  /// their standard errors and covariance_log are widened to match (correlations kept).
  bool intervals_span_bound = false;
};

struct FitInput {
  Product product;               ///< shape, size, ρ, cp, k (the starting α); initial_C only for
                                 ///< the stages' direction (the probes' own initial temperatures are used)
  std::vector<Stage> stages;     ///< the study's stages (study_stages)
  std::vector<ProbeCurve> probes;///< the curves fitted together (one, or the pool)
  /// Direction of each stage for the grouping (true: heats). Empty: from the stages' media by
  /// h_ends.hpp's rule; pass the schedule's when the stages carry a logged medium, whose noise
  /// at a stage boundary could turn the rule.
  std::vector<bool> heating;
  HistoryOptions engine = fit_engine_options();
  static HistoryOptions fit_engine_options();
};

/// Bi above which a fitted h is checked for being only a lower bound.
inline constexpr double kHighBiot = 200;

/// Fits α and the h groups. InputError when there are fewer readings than parameters + 2, or a
/// probe has fewer than 3 readings; NotConverged when the solver fails outright.
FitResult fit_study(const FitInput& in);

/// The fit as a product file's calibration: the h groups by stage name (`stage_names` indexes
/// the study's stages), the covariance of the free parameters, provenance.
Calibration calibration_of(const FitResult& fit, const std::vector<std::string>& stage_names,
                           const std::string& design_probe, const std::string& date,
                           const std::vector<std::string>& study);

/// The model's cold-spot curve of one probe at the given α and h per study stage (for bounds
/// and cross-checks): centre temperatures at `time_s`, from `initial_C`.
std::vector<double> model_curve(const Product& product, const std::vector<Stage>& stages, double initial_C,
                                const std::vector<double>& time_s, const HistoryOptions& engine);

}  // namespace coldcore::process
