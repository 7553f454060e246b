#pragma once
/// Heat-inactivation kinetics: log-linear (Bigelow D/z) and Weibull (δ/p) survival.
///
/// Log-linear (Bigelow General Method; Stumbo, Thermobacteriology in Food Processing, 1973):
///   lethal rate L(T) = 10^((T − Tref)/z), F = ∫ L dt (equivalent time at Tref),
///   log reduction = F / D_ref.
/// Split z: where an equivalence table implies one z above a temperature and another below it
/// (the chilled-food table for non-proteolytic C. botulinum, REFERENCES §1.2: z = 10 °C at and
/// above 90 °C, 9 °C below), L(T) = 10^((T − Tref)/z) for T >= split_C and
/// L(T) = 10^((split_C − Tref)/z) · 10^((T − split_C)/z_below) below, continuous at split_C.
#include <optional>
#include <string>

namespace coldcore {

/// Weibull survival, isothermal: log10(N/N0) = −(t/δ(T))^p (Mafart et al. 2002, Int. J. Food
/// Microbiol. 72:107–113, δ/p form — citation from memory). δ follows the same z as the lethal
/// rate: δ(T) = delta_ref_s / L(T).
struct Weibull {
  double delta_ref_s = 0;  ///< time for the first decimal reduction at reference_C; > 0
  double p = 1;            ///< shape; > 0 (p = 1 is log-linear with D = δ)
};

/// One organism or quality attribute, or a target's own kinetics.
struct Kinetics {
  std::string key;                 ///< library key, e.g. "listeria-monocytogenes"; "" for own kinetics
  std::string name;                ///< human name
  double reference_C = 0;          ///< Tref
  double z_C = 0;                  ///< > 0; z at and above split_C (everywhere when no split)
  std::optional<double> z_below_C; ///< z below split_C; set together with split_C
  std::optional<double> split_C;
  std::optional<double> D_ref_s;   ///< D at reference_C; needed for log reductions
  double valid_min_C = -1e300;     ///< temperature range the data are valid for
  double valid_max_C = 1e300;
  std::optional<Weibull> weibull;
  std::string source;              ///< citation(s) for the values
};

/// L(T) = 10^((T − Tref)/z) (with the split form above). Dimensionless, 1 at Tref.
/// REQUIRES: k.z_C > 0 (and z_below_C > 0 when split). Exact to rounding; no clamping.
double lethal_rate(double temp_C, const Kinetics& k);

/// D at temp_C = D_ref / L(T). REQUIRES: k.D_ref_s.
double d_value_s(double temp_C, const Kinetics& k);

/// Equivalent time at temp_C of F_ref_s at Tref: F_ref / L(T) (e.g. the CFA table row).
double equivalent_time_s(double F_ref_s, double temp_C, const Kinetics& k);

/// Log-linear log10 reduction for an F (equivalent time at Tref). REQUIRES: k.D_ref_s.
double log_reduction_linear(double F_ref_s, const Kinetics& k);

/// Weibull log10 reduction along any temperature history with equivalent time F_ref_s.
/// The published non-isothermal rate form (Peleg & Cole 1998, Crit. Rev. Food Sci. Nutr. 38:353;
/// Mafart et al. 2002 — from memory) is
///   d(−log10 S)/dt = (p / δ(T)) · (−log10 S)^((p − 1)/p).
/// With p independent of T and δ(T) = δ_ref / L(T), substituting dτ = L dt makes the equation
/// autonomous in τ, so its solution from S = 1 is exactly −log10 S = (τ/δ_ref)^p with τ = F_ref.
/// This function returns that closed form. REQUIRES: k.weibull.
double log_reduction_weibull(double F_ref_s, const Kinetics& k);

}  // namespace coldcore
