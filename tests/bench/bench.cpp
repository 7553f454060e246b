// Benchmark of the history engine: centre history through a 4-hour logged medium sampled every
// second (14,400 intervals, h constant), for a sphere and a finite cylinder.
// Usage: coldcore_bench [--repeat N] [--case sphere|cylinder]. Prints "<case> <ms per history> ms".
// No assertions. --case runs one case only (e.g. to count its instructions under callgrind).
#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdint>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <vector>

#include "coldcore/conduction/history.hpp"

using namespace coldcore;

namespace {

// A synthetic oven log: come-up 20 -> 90 C over 40 min, hold with a slow 0.6 K oscillation,
// cool to 4 C from 3 h, plus +-0.05 K logger noise (deterministic generator).
MediumProfile logged_medium() {
  MediumProfile m;
  m.description = "synthetic 1 s log";
  std::uint64_t state = 0x9e3779b97f4a7c15ull;
  for (int i = 0; i <= 14400; ++i) {
    const double t = i;
    double T = t < 2400 ? 20 + 70 * t / 2400 : t < 10800 ? 90 + 0.6 * std::sin(t / 300.0) : 90 - 86 * std::min(1.0, (t - 10800) / 1800);
    state = state * 6364136223846793005ull + 1442695040888963407ull;
    T += 0.1 * (static_cast<double>(state >> 11) / 9007199254740992.0 - 0.5);
    m.points.push_back({t, T});
  }
  return m;
}

double time_ms(const Product& p, const std::vector<Stage>& st, int repeat, double& centre_end) {
  std::vector<double> times;
  for (int r = 0; r < repeat; ++r) {
    const auto t0 = std::chrono::steady_clock::now();
    const History h = simulate(p, st);
    const auto t1 = std::chrono::steady_clock::now();
    centre_end = h.samples.back().centre_C;
    times.push_back(std::chrono::duration<double, std::milli>(t1 - t0).count());
  }
  std::sort(times.begin(), times.end());
  return times[times.size() / 2];  // median
}

}  // namespace

namespace coldcore::bench {
void fit_coverage(int replicates);  // fit_coverage.cpp
}

int main(int argc, char** argv) {
  int repeat = 21;
  bool run_sphere = true, run_cylinder = true, run_fit = true;
  for (int i = 1; i < argc; ++i) {
    if (std::strcmp(argv[i], "--repeat") == 0 && i + 1 < argc) {
      repeat = std::max(1, std::atoi(argv[++i]));
    } else if (std::strcmp(argv[i], "--case") == 0 && i + 1 < argc && std::strcmp(argv[i + 1], "fit-coverage") == 0) {
      run_sphere = run_cylinder = false;
      ++i;
    } else if (std::strcmp(argv[i], "--case") == 0 && i + 1 < argc && std::strcmp(argv[i + 1], "sphere") == 0) {
      run_cylinder = run_fit = false;
      ++i;
    } else if (std::strcmp(argv[i], "--case") == 0 && i + 1 < argc && std::strcmp(argv[i + 1], "cylinder") == 0) {
      run_sphere = run_fit = false;
      ++i;
    } else {
      std::fprintf(stderr, "usage: coldcore_bench [--repeat N] [--case sphere|cylinder|fit-coverage]\n");
      return 2;
    }
  }
  Stage s;
  s.name = "logged oven";
  s.medium = logged_medium();
  s.h_W_m2K = 150;
  s.end.duration_s = 14400;
  const std::vector<Stage> st = {s};

  Product sphere;
  sphere.name = "sphere 40 mm";
  sphere.shape = Shape::sphere;
  sphere.dims.diameter_m = 0.04;
  sphere.initial_C = 4;
  sphere.properties = {0.5, 1050, 3600};
  Product fc = sphere;
  fc.name = "finite cylinder 40 x 60 mm";
  fc.shape = Shape::finite_cylinder;
  fc.dims.length_m = 0.06;

  double c = 0;
  if (run_sphere) {
    const double ms_s = time_ms(sphere, st, repeat, c);
    std::printf("sphere-4h-log %.3f ms\n", ms_s);
  }
  if (run_cylinder) {
    const double ms_f = time_ms(fc, st, std::max(1, repeat / 3), c);
    std::printf("finite-cylinder-4h-log %.3f ms\n", ms_f);
  }
  if (run_fit) coldcore::bench::fit_coverage(100);
  return 0;
}
