// Finite-volume conduction solver checked against outside references:
//  - exact eigenfunction series (mpmath), tests/reference/numeric_check.csv
//    (generator tests/reference/gen_numeric_check.py);
//  - an independent fine-grid SciPy method-of-lines solution with k(T), ρcp(T) and a ramped
//    medium, tests/reference/numeric_kt_check.csv (generator gen_numeric_kt_check.py);
//  - invariants: energy conservation, second-order grid convergence, input errors.
#include <doctest/doctest.h>

#include <algorithm>
#include <chrono>
#include <functional>
#include <tuple>
#include <cmath>
#include <fstream>
#include <map>
#include <sstream>
#include <string>
#include <vector>

#include "coldcore/conduction/numeric.hpp"
#include "coldcore/error.hpp"

using namespace coldcore;

namespace {

/// Reads a committed CSV table (lines starting with '#' are comments) into rows of named fields.
std::vector<std::map<std::string, std::string>> read_table(const std::string& name) {
  const std::string path = std::string(COLDCORE_SOURCE_DIR) + "/tests/reference/" + name;
  std::ifstream in(path);
  REQUIRE_MESSAGE(in.good(), "cannot open " << path);
  std::vector<std::string> header;
  std::vector<std::map<std::string, std::string>> rows;
  std::string line;
  while (std::getline(in, line)) {
    if (line.empty() || line[0] == '#') continue;
    std::vector<std::string> fields;
    std::stringstream ss(line);
    std::string f;
    while (std::getline(ss, f, ',')) fields.push_back(f);
    if (header.empty()) {
      header = fields;
      continue;
    }
    REQUIRE(fields.size() == header.size());
    std::map<std::string, std::string> row;
    for (std::size_t i = 0; i < fields.size(); ++i) row[header[i]] = fields[i];
    rows.push_back(row);
  }
  return rows;
}

double num(const std::map<std::string, std::string>& row, const std::string& key) {
  return std::stod(row.at(key));
}

Geometry geometry_of(const std::string& s) {
  if (s == "slab") return Geometry::slab;
  if (s == "cylinder") return Geometry::cylinder;
  return Geometry::sphere;
}

MediumProfile constant_medium(double temp_C) {
  MediumProfile m;
  m.points = {{0.0, temp_C}};
  m.description = "constant";
  return m;
}

NumericProblem series_problem(Geometry g, double h_W_m2K, double duration_s) {
  NumericProblem p;
  p.geometry = g;
  p.half_size_m = 0.02;
  p.initial_C = 5.0;
  ThermalProperties props;
  props.conductivity_W_mK = 0.5;
  props.density_kg_m3 = 1050;
  props.specific_heat_J_kgK = 3600;
  p.material = constant_material(props);
  const bool held = std::isinf(h_W_m2K);
  p.segments = {{duration_s, held ? 0.0 : h_W_m2K, held, constant_medium(90.0)}};
  return p;
}

/// Worst |numeric − series| over one (geometry, h) group of numeric_check.csv.
double worst_against_series(Geometry g, double h_W_m2K,
                            const std::vector<std::map<std::string, std::string>>& rows,
                            const NumericOptions& opt, NumericResult* out = nullptr) {
  std::vector<double> times;
  for (const auto& r : rows) times.push_back(num(r, "time_s"));
  const NumericResult res = solve_numeric(series_problem(g, h_W_m2K, times.back()), times, opt);
  double worst = 0;
  for (std::size_t i = 0; i < rows.size(); ++i) {
    worst = std::max(worst, std::fabs(res.samples[i].centre_C - num(rows[i], "centre_C")));
    worst = std::max(worst, std::fabs(res.samples[i].surface_C - num(rows[i], "surface_C")));
    worst = std::max(worst, std::fabs(res.samples[i].mean_C - num(rows[i], "mean_C")));
  }
  if (out) *out = res;
  return worst;
}

std::vector<std::map<std::string, std::string>> series_rows(const std::string& geometry, double h) {
  std::vector<std::map<std::string, std::string>> out;
  for (const auto& r : read_table("numeric_check.csv"))
    if (r.at("geometry") == geometry && num(r, "h_W_m2K") == h) out.push_back(r);
  return out;
}

/// The three cases of tests/reference/numeric_kt_check.csv, defined exactly as in
/// gen_numeric_kt_check.py.
NumericProblem kt_problem(const std::string& name) {
  NumericProblem p;
  if (name == "poly-sphere") {
    p.geometry = Geometry::sphere;
    p.half_size_m = 0.02;
    p.initial_C = 5.0;
    p.material.conductivity_W_mK = [](double t) { return 0.45 + 1.5e-3 * t - 4e-6 * t * t; };
    p.material.volumetric_heat_capacity_J_m3K = [](double t) {
      return 1050.0 * (3500.0 + 2.0 * t + 0.01 * t * t);
    };
    MediumProfile ramp;
    ramp.points = {{0.0, 5.0}, {600.0, 90.0}};
    p.segments = {{1800.0, 300.0, false, ramp}, {1800.0, 50.0, false, constant_medium(2.0)}};
  } else if (name == "beef-slab") {
    Composition beef;  // 74/22/3/1 water/protein/fat/ash
    beef.water = 0.74;
    beef.protein = 0.22;
    beef.fat = 0.03;
    beef.ash = 0.01;
    p.geometry = Geometry::slab;
    p.half_size_m = 0.015;
    p.initial_C = 4.0;
    p.material = composition_material(beef);
    p.segments = {{2400.0, 200.0, false, constant_medium(95.0)}};
  } else {
    p.geometry = Geometry::cylinder;
    p.half_size_m = 0.025;
    p.initial_C = 10.0;
    p.material.conductivity_W_mK = [](double t) { return 0.40 + 2.5e-3 * t; };
    p.material.volumetric_heat_capacity_J_m3K = [](double t) { return 3.8e6 - 4000.0 * t; };
    p.segments = {{3000.0, 0.0, true, constant_medium(80.0)}};
  }
  return p;
}

/// Σ V_i ∫_{T0}^{T_i} ρcp dT over the returned final profile, per m² of surface, with control
/// volumes recomputed here (vertex-centred: half cells at centre and surface) and the integral
/// by 20-panel Simpson (exact for the polynomials used).
double enthalpy_change_J_m2(const NumericResult& r, Geometry g, double T0,
                            const std::function<double(double)>& c) {
  const int m = g == Geometry::slab ? 0 : g == Geometry::cylinder ? 1 : 2;
  const std::size_t n = r.node_r_m.size() - 1;
  const double R = r.node_r_m.back();
  auto measure = [m](double x) { return std::pow(x, m + 1) / (m + 1); };
  double total = 0;
  for (std::size_t i = 0; i <= n; ++i) {
    const double lo = i == 0 ? 0.0 : 0.5 * (r.node_r_m[i - 1] + r.node_r_m[i]);
    const double hi = i == n ? R : 0.5 * (r.node_r_m[i] + r.node_r_m[i + 1]);
    const double a = T0, b = r.node_T_C[i];
    double integral = 0;
    const int panels = 20;
    for (int j = 0; j <= panels; ++j) {
      const double w = (j == 0 || j == panels) ? 1 : (j % 2 ? 4 : 2);
      integral += w * c(a + (b - a) * j / panels);
    }
    integral *= (b - a) / (3.0 * panels);
    total += (measure(hi) - measure(lo)) * integral;
  }
  return total / std::pow(R, m);
}

}  // namespace

TEST_CASE("numeric: agrees with the exact series within 0.01 K (constant properties and medium)") {
  // Source: tests/reference/numeric_check.csv, exact series by mpmath (gen_numeric_check.py).
  const auto rows = read_table("numeric_check.csv");
  REQUIRE(rows.size() == 90);
  // Group rows by (geometry, h): one solve per group, all its times at once.
  std::map<std::pair<std::string, double>, std::vector<std::map<std::string, std::string>>> groups;
  for (const auto& r : rows) groups[{r.at("geometry"), num(r, "h_W_m2K")}].push_back(r);
  double worst = 0;
  std::string worst_where;
  for (const auto& [key, group] : groups) {
    std::vector<double> times;
    for (const auto& r : group) times.push_back(num(r, "time_s"));
    const auto t_start = std::chrono::steady_clock::now();
    const NumericResult res =
        solve_numeric(series_problem(geometry_of(key.first), key.second, times.back()), times);
    const double ms =
        std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - t_start).count();
    double group_worst = 0;
    for (std::size_t i = 0; i < group.size(); ++i) {
      const auto& r = group[i];
      const auto& s = res.samples[i];
      const auto& case_key = key;  // a plain reference: clang 14 cannot capture a structured binding
      CAPTURE(case_key.first);
      CAPTURE(case_key.second);
      CAPTURE(s.time_s);
      for (auto [got, want] : {std::pair{s.centre_C, num(r, "centre_C")},
                               std::pair{s.surface_C, num(r, "surface_C")},
                               std::pair{s.mean_C, num(r, "mean_C")}}) {
        CHECK(std::fabs(got - want) <= 0.01);
        group_worst = std::max(group_worst, std::fabs(got - want));
        if (std::fabs(got - want) > worst) {
          worst = std::fabs(got - want);
          worst_where = key.first + " h=" + std::to_string(key.second) + " t=" + std::to_string(s.time_s);
        }
      }
    }
    MESSAGE(key.first << " h=" << key.second << ": " << res.cells << " cells, " << res.steps
                      << " steps, self-check estimate " << res.error_estimate_K << " K, actual "
                      << group_worst << " K, " << ms << " ms");
    // The self-check is honest: the actual error is not far above the estimate.
    CHECK(group_worst <= 2.0 * res.error_estimate_K + 2e-4);
  }
  MESSAGE("worst |numeric - series| = " << worst << " K at " << worst_where);
}

TEST_CASE("numeric: a looser tolerance gives a coarser grid that still meets it") {
  // Exact series, tests/reference/numeric_check.csv (sphere, Bi = 5).
  NumericOptions opt;
  opt.tol_K = 0.05;
  NumericResult res;
  const double worst = worst_against_series(Geometry::sphere, 125, series_rows("sphere", 125), opt, &res);
  CHECK(res.cells < 160);
  CHECK(worst <= 0.05);
  CHECK(res.error_estimate_K <= 0.05);
}

TEST_CASE("numeric: second-order convergence in space and time together") {
  // Exact series, tests/reference/numeric_check.csv; cells and step refined together by 2.
  for (const auto& [geometry, g, h] : {std::tuple{std::string("sphere"), Geometry::sphere, 125.0},
                                       std::tuple{std::string("cylinder"), Geometry::cylinder, 1250.0},
                                       std::tuple{std::string("slab"), Geometry::slab, 12.5}}) {
    const auto rows = series_rows(geometry, h);
    std::vector<double> err;
    for (int level = 0; level < 3; ++level) {
      NumericOptions opt;
      opt.fixed_cells = 20 << level;
      opt.fixed_step_divisor = 1 << level;
      err.push_back(worst_against_series(g, h, rows, opt));
    }
    const double p1 = std::log2(err[0] / err[1]), p2 = std::log2(err[1] / err[2]);
    const std::string& geometry_name = geometry;  // clang 14 cannot capture a structured binding
    CAPTURE(geometry_name);
    MESSAGE(geometry << " h=" << h << " errors " << err[0] << ", " << err[1] << ", " << err[2]
                     << " K: observed order " << p1 << ", " << p2);
    CHECK(p1 > 1.8);
    CHECK(p1 < 2.3);
    CHECK(p2 > 1.8);
    CHECK(p2 < 2.3);
  }
}

TEST_CASE("numeric: temperature-dependent properties against an independent SciPy solution") {
  // Source: tests/reference/numeric_kt_check.csv (gen_numeric_kt_check.py: cell-centred method
  // of lines, Radau, 200/400/800 cells, Richardson-extrapolated; uncertainty column ≤ 1.4e-4 K).
  const auto rows = read_table("numeric_kt_check.csv");
  REQUIRE(rows.size() == 19);
  std::map<std::string, std::vector<std::map<std::string, std::string>>> cases;
  for (const auto& r : rows) cases[r.at("case")].push_back(r);
  REQUIRE(cases.size() == 3);
  double worst = 0;
  for (const auto& [name, group] : cases) {
    std::vector<double> times;
    for (const auto& r : group) times.push_back(num(r, "time_s"));
    const auto t_start = std::chrono::steady_clock::now();
    const NumericResult res = solve_numeric(kt_problem(name), times);
    const double ms =
        std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - t_start).count();
    double group_worst = 0;
    for (std::size_t i = 0; i < group.size(); ++i) {
      const std::string& case_name = name;  // clang 14 cannot capture a structured binding
      CAPTURE(case_name);
      CAPTURE(times[i]);
      const auto& s = res.samples[i];
      for (auto [got, want] : {std::pair{s.centre_C, num(group[i], "centre_C")},
                               std::pair{s.surface_C, num(group[i], "surface_C")},
                               std::pair{s.mean_C, num(group[i], "mean_C")}}) {
        CHECK(std::fabs(got - want) <= 0.01);
        group_worst = std::max(group_worst, std::fabs(got - want));
      }
    }
    worst = std::max(worst, group_worst);
    MESSAGE(name << ": " << res.cells << " cells, " << res.steps << " steps, estimate "
                 << res.error_estimate_K << " K, actual " << group_worst << " K, " << ms << " ms");
  }
  MESSAGE("worst |numeric - SciPy| = " << worst << " K");
}

TEST_CASE("numeric: heat through the surface equals the change of enthalpy") {
  // Invariant of the conservative scheme; ΔH computed here from the final profile.
  SUBCASE("constant properties, ramped medium: ΔH = ρcp (V/A) (mean − T0)") {
    NumericProblem p = series_problem(Geometry::sphere, 125, 3000);
    MediumProfile ramp;
    ramp.points = {{0.0, 5.0}, {500.0, 95.0}, {2000.0, 60.0}};
    p.segments[0].medium = ramp;
    const auto res = solve_numeric(p, {100, 500, 1000, 3000});
    for (const auto& s : res.samples) {
      const double dH = 1050.0 * 3600.0 * (0.02 / 3.0) * (s.mean_C - 5.0);
      CAPTURE(s.time_s);
      CHECK(std::fabs(s.heat_in_J_m2 - dH) <= 1e-6 * std::fabs(dH));
    }
  }
  for (const std::string name : {"poly-sphere", "poly-cylinder-held"}) {
    SUBCASE(("k(T), ρcp(T): " + name).c_str()) {
      const NumericProblem p = kt_problem(name);
      const double end = p.segments.size() == 2 ? 3600.0 : 3000.0;
      const auto res = solve_numeric(p, {end});
      const double dH = enthalpy_change_J_m2(res, p.geometry, p.initial_C,
                                             p.material.volumetric_heat_capacity_J_m3K);
      CHECK(std::fabs(res.samples[0].heat_in_J_m2 - dH) <= 1e-6 * std::fabs(dH));
    }
  }
}

TEST_CASE("numeric: output times in any order / repeated / and at t = 0") {
  const auto p = series_problem(Geometry::slab, 125, 600);
  const auto res = solve_numeric(p, {600, 0, 300, 600});
  REQUIRE(res.samples.size() == 4);
  CHECK(res.samples[0].time_s == 600);
  CHECK(res.samples[1].time_s == 0);
  CHECK(res.samples[1].centre_C == 5.0);
  CHECK(res.samples[1].surface_C == 5.0);
  CHECK(res.samples[1].medium_C == 90.0);
  CHECK(res.samples[2].time_s == 300);
  CHECK(res.samples[3].centre_C == res.samples[0].centre_C);
  CHECK(res.samples[2].centre_C < res.samples[0].centre_C);
}

TEST_CASE("numeric: bad input and unreachable tolerance are refused") {
  auto p = series_problem(Geometry::sphere, 125, 3000);
  p.segments[0].h_W_m2K = -5;
  CHECK_THROWS_WITH_AS(solve_numeric(p, {10}),
                       "numeric: segment[0].h_W_m2K = -5: must be > 0 (or h_infinite)", InputError);
  p = series_problem(Geometry::sphere, 125, 3000);
  CHECK_THROWS_WITH_AS(solve_numeric(p, {10, 5000}),
                       "numeric: output_times_s[1] = 5000: must be within 0 and the total "
                       "duration 3000 s",
                       InputError);
  p.half_size_m = 0;
  CHECK_THROWS_WITH_AS(solve_numeric(p, {10}), "numeric: half_size_m = 0: must be > 0", InputError);
  p = series_problem(Geometry::sphere, 125, 3000);
  p.material.conductivity_W_mK = [](double t) { return t < 50 ? 0.5 : -1.0; };
  CHECK_THROWS_WITH_AS(solve_numeric(p, {3000}),
                       doctest::Contains("must be finite and > 0"), InputError);
  p = series_problem(Geometry::sphere, 125, 3000);
  p.segments[0].medium.points = {{0, 90}, {0, 80}};
  CHECK_THROWS_WITH_AS(solve_numeric(p, {10}),
                       "numeric: segment[0].medium.points[1].time_s = 0: must be greater than the "
                       "previous point's time",
                       InputError);
  // Composition properties refuse 160 °C: the solve stops with their InputError.
  auto beef = kt_problem("beef-slab");
  beef.segments[0].medium = constant_medium(160.0);
  CHECK_THROWS_WITH_AS(solve_numeric(beef, {2400}), doctest::Contains("must be within 0 to 150 °C"),
                       InputError);
  NumericOptions opt;
  opt.tol_K = 1e-7;
  opt.max_level = 2;
  CHECK_THROWS_WITH_AS(solve_numeric(series_problem(Geometry::sphere, 125, 3000), {3000}, opt),
                       doctest::Contains("numeric: self-check error estimate = "), NotConverged);
}

namespace {
PhaseChangeProperties neumann_material(double band_K) {
  // As in tests/reference/gen_neumann_check.py.
  PhaseChangeProperties p;
  p.frozen_conductivity_W_mK = 1.6;
  p.unfrozen_conductivity_W_mK = 0.5;
  p.frozen_volumetric_heat_capacity_J_m3K = 1050.0 * 1900.0;
  p.unfrozen_volumetric_heat_capacity_J_m3K = 1050.0 * 3600.0;
  p.latent_heat_J_m3 = 1050.0 * 230e3;
  p.freezing_C = -1.5;
  p.band_K = band_K;
  return p;
}
}  // namespace

TEST_CASE("numeric: phase change conserves energy through the enthalpy") {
  // Invariant: heat through the surface = Σ V_i (H(T_i) − H(T0)), H from the material itself.
  NumericProblem p;
  p.geometry = Geometry::sphere;
  p.half_size_m = 0.02;
  p.initial_C = 8.0;
  p.material = phase_change_material(neumann_material(1.0));
  MediumProfile chill;
  chill.points = {{0.0, 8.0}, {300.0, -25.0}};
  p.segments = {{3000.0, 40.0, false, chill}, {1800.0, 15.0, false, constant_medium(20.0)}};
  NumericOptions opt;
  opt.fixed_cells = 80;
  opt.fixed_step_divisor = 4;
  for (double end : {1500.0, 3000.0, 4800.0}) {
    const auto res = solve_numeric(p, {end}, opt);
    double dH = 0;
    const std::size_t n = res.node_r_m.size() - 1;
    for (std::size_t i = 0; i <= n; ++i) {
      const double lo = i == 0 ? 0.0 : 0.5 * (res.node_r_m[i - 1] + res.node_r_m[i]);
      const double hi = i == n ? 0.02 : 0.5 * (res.node_r_m[i] + res.node_r_m[i + 1]);
      dH += (hi * hi * hi - lo * lo * lo) / 3.0 *
            (p.material.volumetric_enthalpy_J_m3(res.node_T_C[i]) -
             p.material.volumetric_enthalpy_J_m3(8.0));
    }
    dH /= 0.02 * 0.02;
    CAPTURE(end);
    MESSAGE("t=" << end << " centre " << res.samples[0].centre_C << " C, heat "
                 << res.samples[0].heat_in_J_m2 << " J/m2, dH " << dH);
    CHECK(std::fabs(res.samples[0].heat_in_J_m2 - dH) <= 1e-6 * std::fabs(dH));
  }
}

TEST_CASE("numeric: phase-change material input checks and enthalpy inverse") {
  const auto m = phase_change_material(neumann_material(0.5));
  for (double t : {-40.0, -1.75, -1.6, -1.5, -1.3, -1.25, 0.0, 30.0})
    CHECK(m.temperature_from_enthalpy_C(m.volumetric_enthalpy_J_m3(t)) == doctest::Approx(t).epsilon(1e-12));
  // Latent heat is all inside the band: H(top) − H(bottom) = mean capacity × band + latent.
  CHECK(m.volumetric_enthalpy_J_m3(-1.25) - m.volumetric_enthalpy_J_m3(-1.75) ==
        doctest::Approx(0.5 * 0.5 * (1050.0 * 1900 + 1050.0 * 3600) + 1050.0 * 230e3).epsilon(1e-12));
  auto bad = neumann_material(0.5);
  bad.band_K = 0;
  CHECK_THROWS_WITH_AS(phase_change_material(bad), "phase change: band_K = 0: must be > 0", InputError);
  NumericProblem p = series_problem(Geometry::slab, 125, 100);
  p.material.volumetric_enthalpy_J_m3 = [](double t) { return 4e6 * t; };
  CHECK_THROWS_WITH_AS(solve_numeric(p, {100}),
                       "numeric: material: volumetric_enthalpy_J_m3 and temperature_from_enthalpy_C "
                       "must be set together",
                       InputError);
}

TEST_CASE("numeric: freezing front against Neumann's exact solution") {
  // Source: tests/reference/neumann_check.csv (gen_neumann_check.py, mpmath; Carslaw & Jaeger
  // §11.2). Slab half-thickness 0.1 m, surface held at −30 °C, initially 8 °C, 1800 s.
  const auto rows = read_table("neumann_check.csv");
  NumericProblem p;
  p.geometry = Geometry::slab;
  p.half_size_m = 0.1;
  p.initial_C = 8.0;
  p.material = phase_change_material(neumann_material(0.25));
  p.segments = {{1800.0, 0.0, true, constant_medium(-30.0)}};
  NumericOptions opt;
  opt.tol_K = 0.01;
  const auto t_start = std::chrono::steady_clock::now();
  const NumericResult res = solve_numeric(p, {1800.0}, opt);
  const double ms =
      std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - t_start).count();
  double worst = 0;
  for (const auto& r : rows) {
    if (r.at("quantity") == "heat_removed_J_m2") {
      MESSAGE("heat: numeric " << -res.samples[0].heat_in_J_m2 << " exact " << num(r, "value"));
      CHECK(-res.samples[0].heat_in_J_m2 == doctest::Approx(num(r, "value")).epsilon(2e-3));
    } else if (r.at("quantity") == "temp_C") {
      // Depth from the held face; nodes are r from the centre, so r = 0.1 − depth.
      const double r_m = 0.1 - num(r, "depth_m");
      std::size_t i = 0;
      while (res.node_r_m[i + 1] < r_m) ++i;
      const double w = (r_m - res.node_r_m[i]) / (res.node_r_m[i + 1] - res.node_r_m[i]);
      const double got = res.node_T_C[i] + w * (res.node_T_C[i + 1] - res.node_T_C[i]);
      CAPTURE(num(r, "depth_m"));
      CHECK(std::fabs(got - num(r, "value")) <= 0.1);
      worst = std::max(worst, std::fabs(got - num(r, "value")));
    }
  }
  // The centre of the 0.2 m slab has barely felt the surface (Neumann: 8 − 2e-4 K at that
  // depth, doubled by the symmetric far face): the slab stands in for a semi-infinite solid.
  CHECK(std::fabs(res.samples[0].centre_C - 8.0) <= 1e-3);
  MESSAGE("Neumann: " << res.cells << " cells, " << res.steps << " steps, estimate "
                      << res.error_estimate_K << " K, worst profile difference " << worst
                      << " K, " << ms << " ms");
}

TEST_CASE("numeric: segment boundaries: later medium reported / state continuous / h change used") {
  // Two segments: 600 s in 90 °C water at h 500, then 600 s in 10 °C air at h 10.
  NumericProblem p = series_problem(Geometry::sphere, 500, 600);
  p.segments.push_back({600.0, 10.0, false, constant_medium(10.0)});
  const auto res = solve_numeric(p, {600, 600.5, 1200});
  REQUIRE(res.samples.size() == 3);
  CHECK(res.samples[0].medium_C == 10.0);  // the later segment owns the shared instant
  CHECK(res.samples[1].medium_C == 10.0);
  // At the boundary the temperatures are those reached in the first segment: the exact series
  // value for sphere, h 500, t 600 s (tests/reference/numeric_check.csv).
  for (const auto& r : series_rows("sphere", 500))
    if (num(r, "time_s") == 600) CHECK(std::fabs(res.samples[0].centre_C - num(r, "centre_C")) <= 0.01);
  // Half a second later the centre is still rising (heat already inside moves on) while the
  // surface has started to cool.
  CHECK(res.samples[1].centre_C > res.samples[0].centre_C);
  CHECK(res.samples[1].centre_C - res.samples[0].centre_C < 0.1);
  CHECK(res.samples[1].surface_C < res.samples[0].surface_C);
  // Weak cooling: the mean falls but heat has left through the surface.
  CHECK(res.samples[2].heat_in_J_m2 < res.samples[0].heat_in_J_m2);
}

TEST_CASE("numeric: composition properties refuse a chill below 0 C rather than guess") {
  // No ice-fraction model: a surface driven below 0 °C stops the solve with InputError.
  auto p = kt_problem("beef-slab");
  p.initial_C = 20.0;
  p.segments[0].medium = constant_medium(-5.0);
  CHECK_THROWS_WITH_AS(solve_numeric(p, {2400}),
                       doctest::Contains("must be within 0 to 150 °C (below 0 °C the food may be "
                                         "partly frozen; no ice-fraction model is implemented)"),
                       InputError);
}
