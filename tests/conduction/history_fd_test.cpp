// History engine against the independent finite-volume Crank-Nicolson reference
// (tests/reference/history_fd.csv, generator tests/reference/gen_history_fd.py; its header holds
// the convergence table: centre error estimate <= 1e-6 K).
#include <doctest/doctest.h>

#include <algorithm>
#include <cmath>
#include <string>
#include <vector>

#include "coldcore/conduction/history.hpp"
#include "support/csv_table.hpp"

using namespace coldcore;

namespace {

// The generator's cases (k = 0.5, rho = 1050, cp = 3600; R = 0.02 m; initial 5 C).
Product fd_product(Shape shape) {
  Product p;
  p.name = "fd reference body";
  p.shape = shape;
  p.dims.diameter_m = 0.04;
  p.initial_C = 5.0;
  p.properties = {0.5, 1050.0, 3600.0};
  return p;
}

Stage stage(std::vector<MediumPoint> pts, double h, double duration_s) {
  Stage s;
  s.name = "stage";
  s.medium.points = std::move(pts);
  s.h_W_m2K = h;
  s.end.kind = StageEndKind::duration;
  s.end.duration_s = duration_s;
  return s;
}

struct Worst {
  double err = 0, t = 0;
  void add(double got, double want, double t_s) {
    const double e = std::abs(got - want);
    if (e > err) { err = e; t = t_s; }
  }
};

void compare(const History& h, const std::string& case_name, double tol_centre, double tol_other) {
  Worst wc, wm, ws;
  int n = 0;
  for (const auto& r : test::read_csv("tests/reference/history_fd.csv")) {
    if (r.text("case") != case_name) continue;
    const double t = r.num("time_s");
    const auto s = h.evaluate(t);
    wc.add(s.centre_C, r.num("centre_C"), t);
    // mean and surface only where the reference itself is good to 2 mK (not right after a jump)
    if (r.num("mean_err_K") < 2e-3) wm.add(s.mean_C, r.num("mean_C"), t);
    if (r.num("surface_err_K") < 2e-3) ws.add(s.surface_C, r.num("surface_C"), t);
    ++n;
  }
  REQUIRE(n > 50);
  MESSAGE(case_name << ": worst centre " << wc.err << " K at t=" << wc.t << " s; mean " << wm.err << " K at "
                    << wm.t << " s; surface " << ws.err << " K at " << ws.t << " s (" << n << " rows)");
  CHECK(wc.err <= tol_centre);
  CHECK(wm.err <= tol_other);
  CHECK(ws.err <= tol_other);
}

}  // namespace

TEST_CASE("ramp-hold-step medium: sphere and cylinder centre vs finite-volume reference to 0.02 K") {
  // Source: tests/reference/history_fd.csv, cases ramp-hold-step-*; rows include 2, 6, 20 s after
  // every breakpoint, i.e. evaluate() between the engine's internal steps.
  const std::vector<Stage> st = {stage({{0, 20.0}, {600, 90.0}}, 200.0, 1800.0), stage({{0, 2.0}}, 200.0, 1800.0)};
  compare(simulate(fd_product(Shape::sphere), st), "ramp-hold-step-sphere", 0.02, 0.02);
  compare(simulate(fd_product(Shape::cylinder), st), "ramp-hold-step-cylinder", 0.02, 0.02);
}

TEST_CASE("the same ramp-hold-step medium logged every second (the regular-log fast path) vs the reference") {
  // Source: tests/reference/history_fd.csv, cases ramp-hold-step-*. The medium is the same piecewise
  // linear one, given as a 1 s log over the whole cook stage (1801 points on the ramp and the hold):
  // the engine then takes its lean path for runs of equal short steps, and its samples and
  // checkpoints (read by evaluate) must meet the reference as the two-point schedule does.
  std::vector<MediumPoint> logged;
  for (int i = 0; i <= 1800; ++i) logged.push_back({double(i), i <= 600 ? 20.0 + 70.0 * i / 600.0 : 90.0});
  const std::vector<Stage> st = {stage(logged, 200.0, 1800.0), stage({{0, 2.0}}, 200.0, 1800.0)};
  const std::vector<Stage> two = {stage({{0, 20.0}, {600, 90.0}}, 200.0, 1800.0), stage({{0, 2.0}}, 200.0, 1800.0)};
  for (Shape sh : {Shape::sphere, Shape::cylinder}) {
    const History h = simulate(fd_product(sh), st);
    compare(h, sh == Shape::sphere ? "ramp-hold-step-sphere" : "ramp-hold-step-cylinder", 0.02, 0.02);
    // every sample of the logged run against the two-point run's exact evaluation (same medium):
    // the engine's tolerance (1e-4 K default) bounds their difference
    const History g = simulate(fd_product(sh), two);
    double worst = 0;
    std::size_t n = 0;
    for (const auto& x : h.samples) {
      if (x.time_s <= 0 || x.time_s > 1800) continue;
      const auto y = g.evaluate(x.time_s);
      worst = std::max({worst, std::abs(x.centre_C - y.centre_C), std::abs(x.surface_C - y.surface_C),
                        std::abs(x.mean_C - y.mean_C)});
      ++n;
    }
    MESSAGE(to_string(sh) << ": 1 s log samples vs two-point schedule, worst " << worst << " K over " << n << " samples");
    CHECK(n >= 1800);
    CHECK(worst <= 1e-4);
  }
}

TEST_CASE("cook in hot water then chill in cold air (two h): vs reference to 0.05 K and chill end within 10 s") {
  // Source: tests/reference/history_fd.csv, case cook-chill-sphere and its :crossing row.
  const auto p = fd_product(Shape::sphere);
  std::vector<Stage> st = {stage({{0, 85.0}}, 500.0, 2400.0), stage({{0, 2.0}}, 20.0, 7200.0)};
  compare(simulate(p, st), "cook-chill-sphere", 0.05, 0.05);

  double t_ref = 0;
  for (const auto& r : test::read_csv("tests/reference/history_fd.csv"))
    if (r.text("case") == "cook-chill-sphere:crossing") t_ref = r.num("time_s");
  REQUIRE(t_ref > 2400);
  st[1].end.kind = StageEndKind::until_centre;
  st[1].end.target_C = 10.0;
  st[1].end.max_duration_s = 4 * 3600.0;
  const auto h = simulate(p, st);
  REQUIRE(h.stages.size() == 2);
  CHECK(h.stages[1].ended_by == StageEndedBy::condition);
  MESSAGE("chill end: engine " << h.stages[1].end_s << " s, reference " << t_ref << " s");
  CHECK(std::abs(h.stages[1].end_s - t_ref) <= 10.0);
  CHECK(h.stages[1].at_end.centre_C == doctest::Approx(10.0).epsilon(1e-6));
  CHECK(h.notes.empty());
}

TEST_CASE("ramp-hold-step medium: finite cylinder (product modes) vs 2D finite-volume reference to 0.02 K") {
  // Source: tests/reference/history_fd2d.csv (generator gen_history_fd2d.py; centre error
  // estimate of the reference 2e-4 K, see its header). Diameter 40 mm, length 50 mm, h = 200.
  Product p = fd_product(Shape::finite_cylinder);
  p.dims.length_m = 0.05;
  const std::vector<Stage> st = {stage({{0, 20.0}, {600, 90.0}}, 200.0, 1800.0), stage({{0, 2.0}}, 200.0, 1800.0)};
  const auto h = simulate(p, st);
  Worst wc, wm;
  int n = 0;
  for (const auto& r : test::read_csv("tests/reference/history_fd2d.csv")) {
    const double t = r.num("time_s");
    const auto s = h.evaluate(t);
    wc.add(s.centre_C, r.num("centre_C"), t);
    if (r.num("mean_err_K") < 2e-3) wm.add(s.mean_C, r.num("mean_C"), t);
    ++n;
  }
  REQUIRE(n > 50);
  MESSAGE("finite cylinder: worst centre " << wc.err << " K at t=" << wc.t << " s; mean " << wm.err << " K at " << wm.t
                                          << " s (" << n << " rows)");
  CHECK(wc.err <= 0.02);
  CHECK(wm.err <= 0.02);
}
