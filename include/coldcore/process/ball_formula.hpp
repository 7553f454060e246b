#pragma once
/// Ball formula method (REFERENCES.md §4): process time B from f_h, j_h, the retort and initial
/// temperatures and the required lethality, through the f_h/U : log g table. Pure computation.
///
/// Table (REFERENCES.md §4, Table 38.6 of the cited chapter; z = 18 °F = 10 °C basis; g in °F):
///   f_h/U   0.5    1       2      5      10     20     50    100    200
///   log g  −1.29  −0.273  0.298  0.742  0.955  1.112  1.27  1.365  1.447
/// log10 g is interpolated linearly in log10(f_h/U); outside [0.5, 200] there is no value (no
/// extrapolation). g in kelvin = g in °F / 1.8 (a temperature difference).
///
/// The table holds for z = 10 °C and Ball's cooling assumptions (j_c = 1.41, f_c = f_h); for
/// another z the result is still computed, and z_matches_table says it is off the table's basis.
#include <optional>

namespace coldcore::process {

struct LogGInterpolation {
  double log10_g_F = 0;  ///< log10 of g in °F
  /// |quadratic − linear|: the 3-point quadratic in log10(f_h/U) through the interval's two
  /// nodes and the nearer outside neighbour, minus the linear value. 0 at a table node.
  double error_log10_g = 0;
};

/// log10 g (°F) for f_h/U, or nullopt when f_h/U is outside [0.5, 200] or not finite.
/// A table node gives its tabulated value exactly.
std::optional<LogGInterpolation> ball_log10_g(double fh_over_U);

struct BallResult {
  bool in_table = false;       ///< f_h/U inside [0.5, 200]; otherwise only fh_over_U and U_s are set
  double fh_over_U = 0;
  double U_s = 0;              ///< required lethality at retort temperature: F·10^((T_ref − T_R)/z)
  double log10_g_F = 0;        ///< g in °F, as the table is
  double g_K = 0;              ///< g in kelvin: 10^log10_g_F / 1.8
  double interpolation_error_log10_g = 0;  ///< see LogGInterpolation
  double B_s = 0;              ///< Ball process time from the corrected zero; <= 0 when j_h·I_h <= g
  double operator_time_s = 0;  ///< B − 0.42·come-up (42 % come-up credit)
  bool z_matches_table = true; ///< |z_C − 10| < 0.05
};

/// B = f_h·(log10(j_h·I_h) − log10 g), I_h = T_R − T_I, with I_h and g both in °F (I_h·1.8) — the
/// same B as with both in kelvin. REQUIRES (InputError otherwise): f_h_s, j_h, F_required_s, z_C > 0;
/// retort_C > initial_C; come_up_s >= 0; all finite.
BallResult ball_process_time(double f_h_s, double j_h, double retort_C, double initial_C, double F_required_s,
                             double reference_C, double z_C, double come_up_s);

}  // namespace coldcore::process
