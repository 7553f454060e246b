// The coverage study of the heat-penetration fit (issue 14): 100 seeded replicates of the
// sphere study made by the independent finite-volume model (tests/reference/heat_penetration/
// sphere_clean.csv: k 0.45, rho 1050, cp 3500, h 150), each with thermocouple noise σ = 0.1 K and
// readings rounded to 0.1 °C, fitted from starting values 30 % off. A 95 % interval should hold
// the truth in about 95 of 100; the issue asks for at least 90. Too slow for CTest under the
// sanitizers, so it is a benchmark line: "fit-coverage-alpha 0.95" and "fit-coverage-h 0.95".
#include <cmath>
#include <cstdio>
#include <fstream>
#include <random>
#include <sstream>
#include <string>
#include <vector>

#include "coldcore/process/fit.hpp"

namespace coldcore::bench {

using namespace coldcore::process;

void fit_coverage(int replicates) {
  std::ifstream in(std::string(COLDCORE_SOURCE_DIR) + "/tests/reference/heat_penetration/sphere_clean.csv");
  std::vector<double> t, centre;
  std::string line;
  bool header = true;
  while (std::getline(in, line)) {
    if (line.empty() || line[0] == '#') continue;
    if (header) {
      header = false;
      continue;
    }
    std::stringstream ss(line);
    std::string a, b, c;
    std::getline(ss, a, ',');
    std::getline(ss, b, ',');
    std::getline(ss, c, ',');
    if (std::fmod(std::stod(a), 30.0) != 0) continue;
    t.push_back(std::stod(a));
    centre.push_back(std::stod(c));
  }
  if (t.empty()) {
    std::printf("fit-coverage: cannot read sphere_clean.csv\n");
    return;
  }
  const double alpha_true = 0.45 / (1050.0 * 3500.0), h_true = 150;
  FitInput fi;
  fi.product.shape = Shape::sphere;
  fi.product.dims.diameter_m = 0.06;
  fi.product.initial_C = 5;
  fi.product.properties = {0.6, 1050, 3500};
  Stage up{"come-up", {{{0, 5}, {300, 95}}, "points"}, {}, 100, false, {}};
  up.end.duration_s = 300;
  Stage hold{"hold", {{{0, 95}}, "constant"}, {}, 100, false, {}};
  hold.end.duration_s = 3300;
  Stage chill{"chill", {{{0, 2}}, "constant"}, {}, 200, false, {}};
  chill.end.duration_s = 3600;
  fi.stages = {up, hold, chill};
  int alpha_in = 0, h_in = 0, h_total = 0, failed = 0;
  double worst_alpha = 0;
  for (int r = 0; r < replicates; ++r) {
    std::mt19937 rng(1000u + static_cast<unsigned>(r));
    std::normal_distribution<double> noise(0.0, 0.1);
    ProbeCurve c{"replicate", t, {}};
    for (double x : centre) c.temp_C.push_back(std::round((x + noise(rng)) * 10.0) / 10.0);
    fi.probes = {c};
    try {
      const FitResult f = fit_study(fi);
      alpha_in += f.alpha_ci95_m2_s[0] <= alpha_true && alpha_true <= f.alpha_ci95_m2_s[1];
      worst_alpha = std::max(worst_alpha, std::abs(f.alpha_m2_s / alpha_true - 1));
      for (const FittedH& g : f.h) {
        if (g.status != HStatus::fitted) continue;
        ++h_total;
        h_in += g.ci95_W_m2K[0] <= h_true && h_true <= g.ci95_W_m2K[1];
      }
    } catch (const std::exception&) {
      ++failed;
    }
  }
  std::printf("fit-coverage-alpha %.2f (%d of %d replicates; worst alpha error %.2f %%; %d failed)\n",
              static_cast<double>(alpha_in) / replicates, alpha_in, replicates, 100 * worst_alpha, failed);
  std::printf("fit-coverage-h %.2f (%d of %d fitted h intervals)\n",
              h_total ? static_cast<double>(h_in) / h_total : 0.0, h_in, h_total);
}

}  // namespace coldcore::bench
