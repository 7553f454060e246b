// Ball formula method; the table and conventions are stated in ball_formula.hpp.
#include "coldcore/process/ball_formula.hpp"

#include <array>
#include <cmath>
#include <cstddef>
#include <sstream>

#include "coldcore/error.hpp"

namespace coldcore::process {

namespace {

constexpr std::array<double, 9> kFhOverU = {0.5, 1, 2, 5, 10, 20, 50, 100, 200};
constexpr std::array<double, 9> kLog10G = {-1.29, -0.273, 0.298, 0.742, 0.955, 1.112, 1.27, 1.365, 1.447};
constexpr double kFahrenheitPerKelvin = 1.8;  // size of a degree, for differences
constexpr double kComeUpCredit = 0.42;         // Ball: 42 % of come-up counts at retort temperature

double node_x(std::size_t i) { return std::log10(kFhOverU[i]); }

double lagrange3(double x, std::size_t a, std::size_t b, std::size_t c) {
  const double xa = node_x(a), xb = node_x(b), xc = node_x(c);
  return kLog10G[a] * (x - xb) * (x - xc) / ((xa - xb) * (xa - xc)) +
         kLog10G[b] * (x - xa) * (x - xc) / ((xb - xa) * (xb - xc)) +
         kLog10G[c] * (x - xa) * (x - xb) / ((xc - xa) * (xc - xb));
}

void require(bool ok, const char* key, double value, const char* requirement) {
  if (ok) return;
  std::ostringstream m;
  m << "ball_process_time: " << key << " = " << value << ": " << requirement;
  throw InputError(m.str());
}

}  // namespace

std::optional<LogGInterpolation> ball_log10_g(double fh_over_U) {
  if (!std::isfinite(fh_over_U) || fh_over_U < kFhOverU.front() || fh_over_U > kFhOverU.back())
    return std::nullopt;
  for (std::size_t i = 0; i < kFhOverU.size(); ++i)
    if (fh_over_U == kFhOverU[i]) return LogGInterpolation{kLog10G[i], 0.0};
  std::size_t i = 0;  // the interval [i, i+1] holding fh_over_U
  while (fh_over_U > kFhOverU[i + 1]) ++i;
  const double x = std::log10(fh_over_U);
  const double w = (x - node_x(i)) / (node_x(i + 1) - node_x(i));
  const double linear = kLog10G[i] + w * (kLog10G[i + 1] - kLog10G[i]);
  // Third node: the nearer outside neighbour (the only one at the table's ends).
  const bool has_left = i > 0, has_right = i + 2 < kFhOverU.size();
  const bool use_left = has_left && (!has_right || x - node_x(i - 1) <= node_x(i + 2) - x);
  const double quadratic = use_left ? lagrange3(x, i - 1, i, i + 1) : lagrange3(x, i, i + 1, i + 2);
  return LogGInterpolation{linear, std::abs(quadratic - linear)};
}

BallResult ball_process_time(double f_h_s, double j_h, double retort_C, double initial_C, double F_required_s,
                             double reference_C, double z_C, double come_up_s) {
  require(std::isfinite(f_h_s) && f_h_s > 0, "f_h_s", f_h_s, "must be > 0");
  require(std::isfinite(j_h) && j_h > 0, "j_h", j_h, "must be > 0");
  require(std::isfinite(retort_C), "retort_C", retort_C, "must be finite");
  require(std::isfinite(initial_C) && initial_C < retort_C, "initial_C", initial_C, "must be below retort_C");
  require(std::isfinite(F_required_s) && F_required_s > 0, "F_required_s", F_required_s, "must be > 0");
  require(std::isfinite(reference_C), "reference_C", reference_C, "must be finite");
  require(std::isfinite(z_C) && z_C > 0, "z_C", z_C, "must be > 0");
  require(std::isfinite(come_up_s) && come_up_s >= 0, "come_up_s", come_up_s, "must be >= 0");

  BallResult r;
  r.z_matches_table = std::abs(z_C - 10.0) < 0.05;
  r.U_s = F_required_s * std::pow(10.0, (reference_C - retort_C) / z_C);
  r.fh_over_U = f_h_s / r.U_s;
  const auto log_g = ball_log10_g(r.fh_over_U);
  if (!log_g) return r;
  r.in_table = true;
  r.log10_g_F = log_g->log10_g_F;
  r.interpolation_error_log10_g = log_g->error_log10_g;
  r.g_K = std::pow(10.0, r.log10_g_F) / kFahrenheitPerKelvin;
  const double I_h_F = (retort_C - initial_C) * kFahrenheitPerKelvin;  // same unit as the table's g
  r.B_s = f_h_s * (std::log10(j_h * I_h_F) - r.log10_g_F);
  r.operator_time_s = r.B_s - kComeUpCredit * come_up_s;
  return r;
}

}  // namespace coldcore::process
