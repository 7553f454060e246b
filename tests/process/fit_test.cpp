// The heat-penetration fit (process/fit.hpp, heat_penetration.hpp) against studies made by an
// independent finite-volume model (tests/reference/heat_penetration/, generator
// tests/reference/gen_heat_penetration.py; rerun: /usr/bin/python3 tests/reference/gen_heat_penetration.py).
// The truth (k, h, initial temperature) is in each file's header and in truth.csv; the noise added
// here is the thermocouple model: Gaussian σ = 0.1 K, readings rounded to 0.1 °C.
#include <doctest/doctest.h>

#include <boost/math/distributions/students_t.hpp>
#include <cmath>
#include <random>

#include "coldcore/error.hpp"
#include "coldcore/process/fit.hpp"
#include "coldcore/process/fit_bound.hpp"
#include "coldcore/process/heat_penetration.hpp"
#include "support/csv_table.hpp"
#include "support/libraries.hpp"

using namespace coldcore;
using namespace coldcore::process;

namespace {

struct Truth {
  double k = 0, rho = 0, cp = 0, h_heat = 0, h_cool = 0, initial = 0, diameter = 0, length = 0;
  std::string shape;
};

Truth truth_of(const std::string& file) {
  for (const auto& r : test::read_csv("tests/reference/heat_penetration/truth.csv"))
    if (r.text("file") == file) {
      Truth t;
      t.k = r.num("k_W_mK");
      t.rho = r.num("rho_kg_m3");
      t.cp = r.num("cp_J_kgK");
      t.h_heat = r.num("h_heat_W_m2K");
      t.h_cool = r.num("h_cool_W_m2K");
      t.initial = r.num("initial_C");
      t.diameter = r.num("diameter_m");
      t.shape = r.text("shape");
      if (t.shape == "finite-cylinder") t.length = r.num("length_m");
      return t;
    }
  FAIL("no truth row for " << file);
  return {};
}

/// The sphere study's product and schedule as a product file would give them, with starting
/// values for k and h that are off by design (the fit must find its own way).
std::vector<Stage> sphere_schedule(double h_heat_start, double h_cool_start) {
  Stage up{"come-up", {{{0, 5}, {300, 95}}, "points"}, {}, h_heat_start, false, {}};
  up.end.duration_s = 300;
  Stage hold{"hold", {{{0, 95}}, "constant"}, {}, h_heat_start, false, {}};
  hold.end.duration_s = 3300;
  Stage chill{"chill", {{{0, 2}}, "constant"}, {}, h_cool_start, false, {}};
  chill.end.duration_s = 3600;
  return {up, hold, chill};
}

Product product_of(const Truth& t, double k_start) {
  Product p;
  p.name = "reference body";
  p.shape = t.shape == "sphere" ? Shape::sphere : Shape::finite_cylinder;
  p.dims.diameter_m = t.diameter;
  p.dims.length_m = t.length;
  p.initial_C = t.initial;
  p.properties = {k_start, t.rho, t.cp};
  return p;
}

ProbeCurve noisy_curve(const std::string& file, double spacing_s, unsigned seed, double sigma = 0.1) {
  std::mt19937 rng(seed);
  std::normal_distribution<double> noise(0.0, sigma);
  ProbeCurve c;
  c.name = "probe";
  for (const auto& r : test::read_csv("tests/reference/heat_penetration/" + file)) {
    const double t = r.num("time_s");
    if (std::fmod(t, spacing_s) != 0) continue;
    c.time_s.push_back(t);
    c.temp_C.push_back(std::round((r.num("centre_C") + noise(rng)) * 10.0) / 10.0);
  }
  return c;
}

}  // namespace

TEST_CASE("fit: sphere study by an independent finite-volume model: alpha within 2 % / h inside its interval") {
  // Source of the truth: tests/reference/heat_penetration/sphere_clean.csv (finite volume, 800
  // intervals; its header states the convergence) with k 0.45, rho 1050, cp 3500, h 150.
  const Truth t = truth_of("sphere_clean.csv");
  FitInput in;
  in.product = product_of(t, 0.60);  // start 33 % off
  in.stages = sphere_schedule(60, 400);
  in.probes = {noisy_curve("sphere_clean.csv", 30, 7)};
  const FitResult f = fit_study(in);
  const double alpha = t.k / (t.rho * t.cp);
  CHECK(f.converged);
  CHECK(f.alpha_m2_s == doctest::Approx(alpha).epsilon(0.02));
  CHECK(f.alpha_ci95_m2_s[0] < f.alpha_m2_s);
  CHECK(f.alpha_ci95_m2_s[1] > f.alpha_m2_s);
  REQUIRE(f.h.size() == 2);  // two stage groups: the heating stages share the file's h, the chill its own
  for (const FittedH& g : f.h) {
    CHECK(g.status == HStatus::fitted);
    CHECK(g.ci95_W_m2K[0] <= t.h_heat);
    CHECK(g.ci95_W_m2K[1] >= t.h_heat);
  }
  // The residuals are the noise: σ = 0.1 K plus the rounding's 0.029 K.
  CHECK(f.rms_K == doctest::Approx(0.104).epsilon(0.15));
  CHECK(f.dof == f.n_points - 4);  // α, two h groups and the probe's initial temperature
  // t(0.975, dof) from Boost.Math; for large dof it approaches the normal 1.960 (standard tables).
  CHECK(f.t95 == doctest::Approx(1.97).epsilon(0.01));
}

TEST_CASE("fit: a study where the surface is at the medium (Bi very high) reports h only as a lower bound") {
  // The can of tests/reference/heat_penetration/can_clean.csv heats at h 600 (Bi 44) and cools at
  // h 400. Fitting only its heating phase with a start of h = 5000 must not produce a meaningless
  // interval for h when the data cannot tell 5000 from infinity.
  const Truth t = truth_of("can_clean.csv");
  FitInput in;
  in.product = product_of(t, 0.5);
  Stage up{"come-up", {{{0, 40}, {600, 121.1}}, "points"}, {}, 600, false, {}};
  up.end.duration_s = 600;
  Stage hold{"hold", {{{0, 121.1}}, "constant"}, {}, 600, false, {}};
  hold.end.duration_s = 3600;
  Stage cool{"cool", {{{0, 25}}, "constant"}, {}, 400, false, {}};
  cool.end.duration_s = 3000;
  in.stages = {up, hold, cool};
  in.probes = {noisy_curve("can_clean.csv", 60, 11)};
  const FitResult f = fit_study(in);
  const double alpha = t.k / (t.rho * t.cp);
  CHECK(f.alpha_m2_s == doctest::Approx(alpha).epsilon(0.02));
  // One group (both heating stages share 600 in the file) and the cooling group: the cooling h is
  // identified by the cooling curve; heating h may be fitted or bounded, but never both an
  // interval and a bound, and a bound never above the truth.
  REQUIRE(f.h.size() == 2);
  for (const FittedH& g : f.h) {
    if (g.status == HStatus::fitted) {
      CHECK(g.ci95_W_m2K[0] < g.h_W_m2K);
      CHECK(g.ci95_W_m2K[1] > g.h_W_m2K);
    } else {
      CHECK(g.status == HStatus::lower_bound);
      CHECK(g.h_W_m2K <= t.h_heat * 1.05);
    }
  }
}

TEST_CASE("fit: an h group the readings do not reach is kept from the file and said to be not identified") {
  const Truth t = truth_of("sphere_clean.csv");
  FitInput in;
  in.product = product_of(t, 0.45);
  in.stages = sphere_schedule(150, 90);
  ProbeCurve c = noisy_curve("sphere_clean.csv", 30, 3);
  while (c.time_s.back() > 3500) {  // the probe log ends before the chill
    c.time_s.pop_back();
    c.temp_C.pop_back();
  }
  in.stages.back().end.duration_s = 1;  // the study still names the chill stage
  in.probes = {c};
  const FitResult f = fit_study(in);
  REQUIRE(f.h.size() == 2);
  CHECK(f.h[1].status == HStatus::not_identified);
  CHECK(f.h[1].h_W_m2K == 90);
  CHECK(f.parameters.size() == 2);
}

TEST_CASE("fit: too few readings are refused with the count") {
  const Truth t = truth_of("sphere_clean.csv");
  FitInput in;
  in.product = product_of(t, 0.45);
  in.stages = sphere_schedule(150, 150);
  in.probes = {{"p", {0, 30}, {5, 5}}};
  CHECK_THROWS_WITH_AS(fit_study(in), doctest::Contains("2 readings: at least 3"), InputError);
}

TEST_CASE("study: the broken-heating reference is reported broken - the too-short probe gets no f_h") {
  // broken_heating.csv: a sphere whose conductivity halves above 90 °C (finite volume; its header
  // gives the two slopes, −0.0291 and −0.0182 per min of log10(100 − T)). too_short.csv: the
  // sphere of sphere_clean.csv logged only through its come-up and lag (6 min).
  const auto read = [](const std::string& file) {
    ProbeCurve c;
    c.name = file;
    for (const auto& r : test::read_csv("tests/reference/heat_penetration/" + file)) {
      c.time_s.push_back(r.num("time_s"));
      c.temp_C.push_back(r.num("centre_C"));
    }
    return c;
  };
  const ProbeCurve broken = read("broken_heating.csv");
  const CurveDescription b = describe_curve(broken.time_s, broken.temp_C, 100.0, 0.0, broken.time_s.back(), 0.0, true);
  REQUIRE(b.status == CurveStatus::described);
  CHECK(b.broken);
  CHECK(b.f2_s > b.f_s * 1.2);
  // f = −1/slope: 1/0.0291 = 34.4 min (the generator's slope over 12–32 min) and 1/0.0182 =
  // 54.9 min (over 60–95 min). The generator notes that its first part bends gradually into the
  // second (departure 0.015 log10 from a line), so its slope depends on the window: 10 % there,
  // 5 % on the straight second part.
  CHECK(b.f_s / 60 == doctest::Approx(1 / 0.0291).epsilon(0.10));
  CHECK(b.f2_s / 60 == doctest::Approx(1 / 0.0182).epsilon(0.05));

  const ProbeCurve short_curve = read("too_short.csv");
  const CurveDescription s =
      describe_curve(short_curve.time_s, short_curve.temp_C, 95.0, 0.0, short_curve.time_s.back(), 174.0, true);
  CHECK(s.status != CurveStatus::described);
}

TEST_CASE("fit bound: the least favourable shift of a linear quantity is t(0.95 / dof) standard deviations") {
  // For q = gᵀd the delta method is exact: q(d*) = −t·√(gᵀCg). t(0.95, 10) = 1.812 (Student t
  // tables, e.g. NIST/SEMATECH e-Handbook of Statistical Methods, table 1.3.6.7.2).
  Calibration c;
  c.alpha_m2_s = 1e-7;
  c.alpha_ci95_m2_s = {0.9e-7, 1.1e-7};
  c.h = {{{"hold"}, CalibratedHStatus::fitted, 100, {90, 110}}};
  c.covariance_log = {{4e-4, -1e-4}, {-1e-4, 9e-4}};
  c.dof = 10;
  CHECK(one_sided_t95(c) == doctest::Approx(1.812).epsilon(0.001));
  const std::vector<double> g{2.0, -1.0};
  const std::vector<double> d = least_favourable_shift(c, g);
  const double gCg = 2 * 2 * 4e-4 + 2 * 2 * (-1) * (-1e-4) + 1 * 9e-4;
  CHECK(g[0] * d[0] + g[1] * d[1] == doctest::Approx(-1.812 * std::sqrt(gCg)).epsilon(0.001));
  CHECK(least_favourable_shift(c, {0.0, 0.0}) == std::vector<double>{0.0, 0.0});
  // The shift reaches the scenario: k scales with α, the named stage's h with its factor.
  Scenario s;
  s.product.properties = {0.5, 1000, 4000};
  s.stages = {Stage{"hold", {{{0, 90}}, "constant"}, {}, 100, false, {}}, Stage{"chill", {{{0, 2}}, "constant"}, {}, 50, false, {}}};
  const Scenario moved = shifted_scenario(s, c, {std::log(2.0), std::log(3.0)});
  CHECK(moved.product.properties.conductivity_W_mK == doctest::Approx(1.0));
  CHECK(moved.stages[0].h_W_m2K == doctest::Approx(300));
  CHECK(moved.stages[1].h_W_m2K == 50);
}

TEST_CASE("study stages: the logged medium replaces each stage's over its span - a temperature-ended stage must be last") {
  std::vector<Stage> sched = sphere_schedule(100, 100);
  MediumTrace m{{0, 100, 300, 3600, 3700, 7200}, {5, 35, 95, 95, 2, 2}};
  const std::vector<Stage> st = study_stages(sched, m, 5000, "t.toml");
  REQUIRE(st.size() == 3);
  CHECK(st[0].medium.points.size() == 3);  // 0, 100 and the end at 300
  CHECK(st[0].medium.at(100) == doctest::Approx(35));
  CHECK(st[2].end.duration_s == doctest::Approx(5000 - 3600));
  // the schedule steps from 95 to 2 °C at 3600 s: the chill holds its first own reading back to its start
  CHECK(st[2].medium.at(50) == doctest::Approx(2));
  CHECK(st[1].medium.at(3300) == doctest::Approx(95));
  sched[1].end.kind = StageEndKind::until_centre;
  CHECK_THROWS_WITH_AS(study_stages(sched, m, 5000, "t.toml"), doctest::Contains("stage[2]"), InputError);
}
