#pragma once
/// A product file's calibration: the values a heat-penetration study fitted (coldcore fit) and
/// what run and solve need to answer with a bound — the covariance of the fitted parameters'
/// logarithms. SI units.
#include <array>
#include <string>
#include <vector>

namespace coldcore {

enum class CalibratedHStatus { fitted, lower_bound, not_identified };

/// The h of one group of stages as the study left it.
struct CalibratedH {
  std::vector<std::string> stages;     ///< stage names sharing this h
  CalibratedHStatus status = CalibratedHStatus::fitted;
  double h_W_m2K = 0;
  std::array<double, 2> ci95_W_m2K{0, 0};  ///< fitted only
};

struct Calibration {
  double alpha_m2_s = 0;
  std::array<double, 2> alpha_ci95_m2_s{0, 0};
  std::vector<CalibratedH> h;          ///< every group with a finite h
  /// Covariance of [ln α, ln h of each group with status fitted, in the order of h].
  std::vector<std::vector<double>> covariance_log;
  int dof = 0;                         ///< readings − parameters of the fit
  double rms_K = 0;
  int n_points = 0;
  std::string design_probe;            ///< the probe the values describe (the slowest heating)
  std::string date;
  std::vector<std::string> study;      ///< provenance: files read with their SHA-256, version
  /// Number of free parameters: 1 + the fitted h groups.
  std::size_t parameters() const {
    std::size_t p = 1;
    for (const CalibratedH& g : h) p += g.status == CalibratedHStatus::fitted ? 1 : 0;
    return p;
  }
};

}  // namespace coldcore
