// History engine: reductions to the foundation series, invariants, end conditions, products.
#include <doctest/doctest.h>

#include <boost/math/quadrature/gauss_kronrod.hpp>
#include <cmath>
#include <cstdint>
#include <string>

#include "coldcore/conduction/history.hpp"
#include "coldcore/conduction/modes.hpp"
#include "coldcore/conduction/overlap.hpp"
#include "coldcore/conduction/quasi_steady.hpp"
#include "coldcore/conduction/series.hpp"
#include "coldcore/error.hpp"
#include "conduction/detail/history_engine.hpp"

using namespace coldcore;

namespace {

Product body(Shape shape, double size_m = 0.04) {
  Product p;
  p.name = "test body";
  p.shape = shape;
  p.dims.diameter_m = size_m;
  p.dims.thickness_m = size_m;
  p.initial_C = 5.0;
  p.properties = {0.5, 1050.0, 3600.0};
  return p;
}

Stage stage(std::vector<MediumPoint> pts, double h, double duration_s) {
  Stage s;
  s.name = "stage";
  s.medium.points = std::move(pts);
  s.h_W_m2K = h;
  s.end.duration_s = duration_s;
  return s;
}

// The foundation series (series.hpp: tail-bounded term count, short-time forms), to 1e-12.
double series_theta(Geometry g, double biot, double x, double fo) {
  return step_response(g, biot, fo, x, SeriesOptions{1e-12, 4000}).theta;
}
double series_mean(Geometry g, double biot, double fo) {
  return mean_step_response(g, biot, fo, SeriesOptions{1e-12, 4000}).theta;
}

}  // namespace

TEST_CASE("ramp profile P solves -lap P = 1 with the Robin condition and equals sum C X / zeta^2") {
  // Derived in quasi_steady.hpp; checked here by finite differences of the ODE and against the
  // eigen-expansion built from modes.hpp (4000 terms; tail ~ 1/n^2 alternating).
  for (Geometry g : {Geometry::slab, Geometry::cylinder, Geometry::sphere}) {
    const int m = geometry_exponent(g);
    for (double bi : {0.3, 4.0, kInfiniteBiot}) {
      const double d = 1e-4;
      for (double x : {0.2, 0.5, 0.8}) {
        const double p0 = ramp_profile(g, bi, x), pp = ramp_profile(g, bi, x + d), pm = ramp_profile(g, bi, x - d);
        const double lap = (pp - 2 * p0 + pm) / (d * d) + m / x * (pp - pm) / (2 * d);
        CHECK(lap == doctest::Approx(-1.0).epsilon(1e-6));
      }
      // P is a quadratic: the central difference across x = 1 is exact up to rounding
      const double dp1 = (ramp_profile(g, bi, 1.0 + d) - ramp_profile(g, bi, 1.0 - d)) / (2 * d);
      if (!std::isinf(bi)) CHECK(std::abs(dp1 + bi * ramp_profile(g, bi, 1.0)) <= 1e-9);
      else CHECK(ramp_profile(g, bi, 1.0) == 0.0);
      double s0 = 0, sm = 0;
      for (const auto& md : modes(g, bi, 4000)) {
        s0 += md.coefficient / (md.zeta * md.zeta);
        sm += md.mean_coefficient / (md.zeta * md.zeta);
      }
      CHECK(s0 == doctest::Approx(ramp_profile(g, bi, 0.0)).epsilon(1e-6));
      CHECK(sm == doctest::Approx(ramp_profile_mean(g, bi)).epsilon(1e-8));
    }
  }
}

TEST_CASE("shifted slab profile matches its eigen-expansion") {
  for (double bi : {0.5, 7.0, kInfiniteBiot})
    for (double kappa : {0.3, 3.0, 40.0}) {
      double s0 = 0, s1 = 0, sm = 0;
      for (const auto& md : modes(Geometry::slab, bi, 4000)) {
        const double f = kappa * kappa / (kappa * kappa + md.zeta * md.zeta);
        s0 += md.coefficient * f;
        s1 += md.coefficient * std::cos(md.zeta) * f;
        sm += md.mean_coefficient * f;
      }
      CHECK(s0 == doctest::Approx(shifted_slab_profile(bi, kappa, 0.0)).epsilon(1e-4));
      CHECK(sm == doctest::Approx(shifted_slab_profile_mean(bi, kappa)).epsilon(1e-6));
      if (!std::isinf(bi)) CHECK(s1 == doctest::Approx(shifted_slab_profile(bi, kappa, 1.0)).epsilon(1e-4));
    }
}

TEST_CASE("a constant medium reduces to the foundation series (1e-9 in theta)") {
  // Source: the series of modes.hpp (400 terms), Incropera §5.6 form.
  for (Shape sh : {Shape::sphere, Shape::cylinder, Shape::slab}) {
    const Geometry g = sh == Shape::sphere ? Geometry::sphere : sh == Shape::cylinder ? Geometry::cylinder : Geometry::slab;
    const auto p = body(sh);
    const double h_W = 50.0, tm = 80.0, L = 0.02;
    const double bi = h_W * L / p.properties.conductivity_W_mK;
    const double alpha = p.properties.diffusivity_m2_s();
    const auto hist = simulate(p, {stage({{0, tm}}, h_W, 3600.0)});
    double worst = 0, worst_other = 0;
    for (double t : {1.0, 10.0, 60.0, 300.0, 1000.0, 2000.0, 3600.0}) {
      const double fo = alpha * t / (L * L);
      const auto s = hist.evaluate(t);
      worst = std::max(worst, std::abs((s.centre_C - tm) / (p.initial_C - tm) - series_theta(g, bi, 0.0, fo)));
      if (fo >= 0.01) {
        worst_other = std::max(worst_other, std::abs((s.mean_C - tm) / (p.initial_C - tm) - series_mean(g, bi, fo)));
        worst_other = std::max(worst_other, std::abs((s.surface_C - tm) / (p.initial_C - tm) - series_theta(g, bi, 1.0, fo)));
        const double xq = hist.temperature_at(t, {0.5, 0, 0});
        worst_other = std::max(worst_other, std::abs((xq - tm) / (p.initial_C - tm) - series_theta(g, bi, 0.5, fo)));
      }
    }
    MESSAGE(to_string(sh) << ": worst centre theta error " << worst << ", mean/surface/x=0.5 " << worst_other);
    CHECK(worst <= 1e-9);
    CHECK(worst_other <= 1e-9);
  }
}

TEST_CASE("finite cylinder and brick at a constant medium equal the product rule") {
  // Newman's product rule (DESIGN.md; REFERENCES.md §7 item 8) with the foundation series
  // (series.hpp), and the handbook product-rule value of REFERENCES.md §7 item 8 below.
  const double alpha = 0.5 / (1050.0 * 3600.0), tm = 90.0, h_W = 120.0, k = 0.5;
  Product fc = body(Shape::finite_cylinder);
  fc.dims.diameter_m = 0.04;
  fc.dims.length_m = 0.05;
  Product br = body(Shape::brick);
  br.dims.size_m[0] = 0.03;
  br.dims.size_m[1] = 0.04;
  br.dims.size_m[2] = 0.05;
  const auto hf = simulate(fc, {stage({{0, tm}}, h_W, 3000.0)});
  const auto hb = simulate(br, {stage({{0, tm}}, h_W, 3000.0)});
  double wf = 0, wb = 0, wm = 0;
  for (double t : {5.0, 100.0, 600.0, 1500.0, 3000.0}) {
    const double tf = series_theta(Geometry::cylinder, h_W * 0.02 / k, 0, alpha * t / 4e-4) *
                      series_theta(Geometry::slab, h_W * 0.025 / k, 0, alpha * t / (0.025 * 0.025));
    wf = std::max(wf, std::abs((hf.evaluate(t).centre_C - tm) / (5.0 - tm) - tf));
    double tb = 1, mb = 1;
    for (double half : {0.015, 0.02, 0.025}) {
      tb *= series_theta(Geometry::slab, h_W * half / k, 0, alpha * t / (half * half));
      mb *= series_mean(Geometry::slab, h_W * half / k, alpha * t / (half * half));
    }
    wb = std::max(wb, std::abs((hb.evaluate(t).centre_C - tm) / (5.0 - tm) - tb));
    if (t >= 100) wm = std::max(wm, std::abs((hb.evaluate(t).mean_C - tm) / (5.0 - tm) - mb));
  }
  MESSAGE("finite cylinder centre " << wf << ", brick centre " << wb << ", brick mean " << wm << " (theta)");
  CHECK(wf <= 1e-9);
  CHECK(wb <= 1e-9);
  CHECK(wm <= 1e-9);
  CHECK(hb.stages[0].biot == doctest::Approx(h_W * 0.015 / k));  // smallest half-dimension

  // REFERENCES.md §7 item 8 [D]: R = 0.0375 m, half-height 0.05 m, alpha = 1.4e-7, Bi = inf,
  // t = 1800 s -> theta_centre = 0.534528 (abs 1e-5).
  Product can = body(Shape::finite_cylinder);
  can.dims.diameter_m = 0.075;
  can.dims.length_m = 0.1;
  can.properties = {1.4e-7 * 1000.0 * 4000.0, 1000.0, 4000.0};
  can.initial_C = 20.0;
  Stage retort = stage({{0, 120.0}}, 0.0, 1800.0);
  retort.h_infinite = true;
  const auto hc = simulate(can, {retort});
  CHECK((hc.evaluate(1800.0).centre_C - 120.0) / (20.0 - 120.0) == doctest::Approx(0.534528).epsilon(2e-5));
}

TEST_CASE("long finite cylinder under a ramp equals the infinite cylinder at its centre") {
  // Limit check: with length 10× the diameter the end faces cannot reach the centre within
  // Fo_H = 0.012, so the finite-cylinder product modes must reproduce the 1D cylinder history.
  Product fc = body(Shape::finite_cylinder);
  fc.dims.length_m = 0.4;
  const std::vector<Stage> st = {stage({{0, 20.0}, {600, 90.0}}, 200.0, 1800.0), stage({{0, 2.0}}, 200.0, 1800.0)};
  const auto h2 = simulate(fc, st);
  const auto h1 = simulate(body(Shape::cylinder), st);
  double w = 0;
  for (double t = 0; t <= 3600; t += 37.0) w = std::max(w, std::abs(h2.evaluate(t).centre_C - h1.evaluate(t).centre_C));
  MESSAGE("long finite cylinder vs cylinder, worst centre difference " << w << " K");
  CHECK(w <= 1e-4);
}

TEST_CASE("long finite cylinder through a change of h equals the infinite cylinder (product projection)") {
  // Limit check of the per-axis projection in products: cook in water (h = 500), chill in air
  // (h = 20), the same through a 1D cylinder; ends cannot reach the centre (Fo_H <= 0.012).
  Product fc = body(Shape::finite_cylinder);
  fc.dims.length_m = 0.4;
  const std::vector<Stage> st = {stage({{0, 20.0}, {1500, 85.0}}, 500.0, 1200.0), stage({{0, 2.0}}, 20.0, 2400.0)};
  const auto h2 = simulate(fc, st);
  const auto h1 = simulate(body(Shape::cylinder), st);
  double w = 0;
  for (double t = 0; t <= 3600; t += 23.0) w = std::max(w, std::abs(h2.evaluate(t).centre_C - h1.evaluate(t).centre_C));
  MESSAGE("long finite cylinder vs cylinder through two h, worst centre difference " << w << " K");
  CHECK(w <= 1e-3);
}

TEST_CASE("energy balance: time integral of surface heat flux equals the change of mean enthalpy") {
  // Invariant (first law). Sphere: area/volume = 3/R. Medium ramps from the initial temperature
  // (no jump), so the surface series converges at all times.
  const auto p = body(Shape::sphere);
  const double R = 0.02, h_W = 100.0, rc = 1050.0 * 3600.0;
  const auto hist = simulate(p, {stage({{0, 5.0}, {1200, 80.0}, {2000, 60.0}}, h_W, 3600.0)}, HistoryOptions{1e-8});
  double q = 0;
  for (std::size_t i = 1; i < hist.samples.size(); ++i) {
    const double a = hist.samples[i - 1].time_s, b = hist.samples[i].time_s;
    if (b <= a) continue;
    q += boost::math::quadrature::gauss_kronrod<double, 31>::integrate(
        [&](double t) { const auto s = hist.evaluate(t); return h_W * (s.medium_C - s.surface_C); }, a, b, 8, 1e-13);
  }
  const double de = rc * R / 3.0 * (hist.evaluate(3600).mean_C - p.initial_C);
  MESSAGE("flux integral " << q << " J/m2, enthalpy change " << de << " J/m2, relative " << std::abs(q / de - 1));
  CHECK(std::abs(q / de - 1) <= 1e-6);
}

TEST_CASE("projection onto the modes of a new h reproduces the profile") {
  using namespace coldcore::detail;
  const double alpha = 0.5 / (1050.0 * 3600.0), L = 0.02;
  for (Geometry g : {Geometry::sphere, Geometry::cylinder, Geometry::slab}) {
    const double cut_lo = 3000 * alpha / (L * L), cut_hi = 4e6 * alpha / (L * L);
    auto mk = [&](double bi, double cut) {
      return make_basis({axis_modes(g, bi, L, modes_needed(g, bi, L, alpha, cut))}, alpha, 0, cut);
    };
    const Basis from = mk(20.0, cut_lo), to = mk(0.8, cut_hi);
    // a state of `from`: some amplitudes and a ramping medium (exercises the ramp-profile projection)
    ModalState st;
    st.a.resize(from.lambda.size());
    for (std::size_t k = 0; k < st.a.size(); ++k) st.a[k] = 30.0 * from.b[k] * std::exp(-0.3 * k);
    const double tm_from = 85.0, slope = 0.05, tm_to = 2.0;
    const auto c = project_state(from, st, tm_from, slope, to, tm_to);
    ModalState nt;
    nt.a = c;
    // Interior points: at t = 0 (the instant of projection) the new series converges like any
    // eigen-expansion of a profile that does not meet the new surface condition, slowly at the
    // surface and, for the sphere, at the centre; the engine therefore evaluates the centre from
    // the previous stage for Fo <= 0.01 and the series is exponentially convergent after that.
    double worst = 0;
    for (double x : {0.25, 0.5, 0.75}) {
      Point p{};
      p[0].x = x;
      const double before = Engine{}.at_point(from, st, p, tm_from, slope);
      const double after = Engine{}.at_point(to, nt, p, tm_to, 0.0);
      worst = std::max(worst, std::abs(before - after));
    }
    // the new series at t = 0 carries no quasi-steady ramp part (slope 0 on the new side), so
    // `after` is the plain sum; compare mean too
    Point pm{};
    pm[0].mean = true;
    const double mb = Engine{}.at_point(from, st, pm, tm_from, slope), ma = Engine{}.at_point(to, nt, pm, tm_to, 0.0);
    MESSAGE(to_string(g) << ": projection worst interior error " << worst << " K, mean " << std::abs(mb - ma) << " K ("
                         << to.lambda.size() << " modes)");
    CHECK(worst <= 2e-4);
    CHECK(std::abs(mb - ma) <= 1e-6);
  }
}

TEST_CASE("until_centre ends at the crossing - a cap is reported / never silently accepted") {
  auto p = body(Shape::sphere);
  std::vector<Stage> st = {stage({{0, 85.0}}, 500.0, 2400.0), stage({{0, 2.0}}, 20.0, 0)};
  st[0].name = "cook";
  st[1].name = "chill";
  st[1].end.kind = StageEndKind::until_centre;
  st[1].end.target_C = 10.0;
  st[1].end.max_duration_s = 1800.0;
  const auto capped = simulate(p, st);
  CHECK(capped.stages[1].ended_by == StageEndedBy::cap);
  CHECK(capped.stages[1].end_s == doctest::Approx(2400.0 + 1800.0));
  REQUIRE(capped.notes.size() == 1);
  CHECK(capped.notes[0].kind == StageNoteKind::cap_reached);
  CHECK(capped.notes[0].stage_number == 2);  // as the file counts stages
  CHECK(capped.notes[0].stage_name == "chill");
  CHECK(capped.notes[0].cap_s == 1800.0);
  CHECK(capped.notes[0].target_C == 10.0);
  CHECK(capped.notes[0].value_C == capped.stages[1].at_end.centre_C);
  CHECK(capped.notes[0].value_C > 10.0);

  // rising: the cook until the mean reaches 70 C; crossing exact on evaluate()
  std::vector<Stage> s2 = {stage({{0, 85.0}}, 500.0, 0)};
  s2[0].end.kind = StageEndKind::until_mean;
  s2[0].end.target_C = 70.0;
  s2[0].end.max_duration_s = 7200.0;
  const auto h = simulate(p, s2);
  CHECK(h.stages[0].ended_by == StageEndedBy::condition);
  CHECK(h.evaluate(h.end_s()).mean_C == doctest::Approx(70.0).epsilon(1e-9));
  CHECK(h.evaluate(h.end_s() - 1.0).mean_C < 70.0);

  // already past the target at the stage start: ends at once, with a warning
  std::vector<Stage> s3 = {stage({{0, 2.0}}, 20.0, 0)};
  s3[0].end.kind = StageEndKind::until_centre;
  s3[0].end.target_C = 8.0;
  s3[0].end.max_duration_s = 100.0;
  const auto h3 = simulate(p, s3);
  CHECK(h3.stages[0].ended_by == StageEndedBy::condition);
  CHECK(h3.end_s() == 0.0);
  REQUIRE(h3.notes.size() == 1);
  CHECK(h3.notes[0].kind == StageNoteKind::ended_at_start);
  CHECK(h3.notes[0].stage_number == 1);
  CHECK(h3.notes[0].value_C == 5.0);  // the centre at the start: the initial temperature
}

TEST_CASE("samples: boundaries on both sides / breakpoints / and linear interpolation within sample_tol") {
  const auto p = body(Shape::sphere);
  const std::vector<Stage> st = {stage({{0, 20.0}, {600, 90.0}, {1000, 90.0}}, 200.0, 1800.0), stage({{0, 2.0}}, 200.0, 1800.0)};
  const HistoryOptions o;
  const auto h = simulate(p, st, o);
  int at_boundary = 0;
  bool has600 = false, has1000 = false;
  for (std::size_t i = 0; i < h.samples.size(); ++i) {
    const auto& s = h.samples[i];
    if (s.time_s == 1800.0) ++at_boundary;
    has600 = has600 || s.time_s == 600.0;
    has1000 = has1000 || s.time_s == 1000.0;
    if (i > 0) CHECK(s.time_s >= h.samples[i - 1].time_s);
  }
  CHECK(at_boundary == 2);
  CHECK(has600);
  CHECK(has1000);
  double worst = 0;
  for (std::size_t i = 1; i < h.samples.size(); ++i) {
    const auto& a = h.samples[i - 1];
    const auto& b = h.samples[i];
    if (b.time_s - a.time_s <= 0.01 * 0.02 * 0.02 / p.properties.diffusivity_m2_s() / 8) continue;
    for (double f : {0.25, 0.5, 0.75}) {
      const double t = a.time_s + f * (b.time_s - a.time_s);
      const auto e = h.evaluate(t);
      worst = std::max(worst, std::abs(e.centre_C - (a.centre_C + f * (b.centre_C - a.centre_C))));
      worst = std::max(worst, std::abs(e.mean_C - (a.mean_C + f * (b.mean_C - a.mean_C))));
    }
  }
  MESSAGE("worst interpolation error between samples " << worst << " K");
  CHECK(worst <= 2 * o.sample_tol_K);
  // evaluate agrees with the samples themselves
  for (const auto& s : h.samples) {
    if (s.stage == 1 && s.time_s == 1800.0) continue;  // boundary: evaluate gives the new side
    CHECK(h.evaluate(s.time_s).centre_C == doctest::Approx(s.centre_C).epsilon(1e-12));
  }
}

TEST_CASE("simulate rejects bad input with place / key / value and requirement") {
  const auto p = body(Shape::sphere);
  CHECK_THROWS_WITH_AS(simulate(p, {stage({{0, 80.0}}, -5.0, 10.0)}), "simulate: stage[0].h_W_m2K = -5: must be > 0",
                       InputError);
  Stage s = stage({{0, 2.0}}, 20.0, 0);
  s.end.kind = StageEndKind::until_centre;
  s.end.max_duration_s = 0;
  CHECK_THROWS_WITH_AS(simulate(p, {stage({{0, 80.0}}, 5.0, 10.0), s}),
                       "simulate: stage[1].max_duration_s = 0: must be > 0 (a cap is mandatory)", InputError);
  const auto h = simulate(p, {stage({{0, 80.0}}, 5.0, 10.0)});
  CHECK_THROWS_AS(h.evaluate(11.0), InputError);
}

TEST_CASE("a noisy 1 s log: samples and evaluate between them meet tol_K (sampling does not change accuracy)") {
  // Invariant: the default run (tol 1e-4 K) against a run with tol 1e-12 K (many more modes).
  // Medium: 20 -> 90 C come-up with +-0.05 K logger noise every second for 20 min.
  Stage s = stage({}, 150.0, 1200.0);
  std::uint64_t x = 12345;
  for (int i = 0; i <= 1200; ++i) {
    x = x * 6364136223846793005ull + 1442695040888963407ull;
    s.medium.points.push_back({double(i), 20.0 + 70.0 * i / 1200.0 + 0.1 * (double(x >> 11) / 9007199254740992.0 - 0.5)});
  }
  for (Shape sh : {Shape::sphere, Shape::finite_cylinder}) {
    Product p = body(sh);
    p.dims.length_m = 0.06;
    const auto a = simulate(p, {s});
    const auto b = simulate(p, {s}, HistoryOptions{1e-12});
    double wc = 0, ws = 0, wm = 0;
    for (double t = 30.25; t < 1200; t += 7.1) {
      const auto u = a.evaluate(t), v = b.evaluate(t);
      wc = std::max(wc, std::abs(u.centre_C - v.centre_C));
      ws = std::max(ws, std::abs(u.surface_C - v.surface_C));
      wm = std::max(wm, std::abs(u.mean_C - v.mean_C));
    }
    for (std::size_t i = 0; i < a.samples.size(); i += 7) {
      const auto& u = a.samples[i];
      if (u.time_s < 30) continue;
      const auto v = b.evaluate(u.time_s);
      wc = std::max(wc, std::abs(u.centre_C - v.centre_C));
      ws = std::max(ws, std::abs(u.surface_C - v.surface_C));
      wm = std::max(wm, std::abs(u.mean_C - v.mean_C));
    }
    MESSAGE(to_string(sh) << ": worst centre " << wc << " K, surface " << ws << " K, mean " << wm << " K");
    CHECK(wc <= 1e-4);
    CHECK(ws <= 1e-4);
    CHECK(wm <= 1e-4);
  }
}

TEST_CASE("every shape through h = inf / a zero-length stage and a capped until_mean: continuous centre") {
  for (Shape sh : {Shape::sphere, Shape::cylinder, Shape::slab, Shape::finite_cylinder, Shape::brick}) {
    Product p = body(sh, 0.03);
    p.dims.length_m = 0.05;
    p.dims.size_m[0] = 0.03;
    p.dims.size_m[1] = 0.04;
    p.dims.size_m[2] = 0.05;
    Stage cook = stage({{0, 60.0}, {300, 95.0}}, 0.0, 0);
    cook.h_infinite = true;
    cook.end.kind = StageEndKind::until_centre;
    cook.end.target_C = 70.0;
    cook.end.max_duration_s = 7200;
    Stage pause = stage({{0, 40.0}}, 50.0, 0.0);
    Stage chill = stage({{0, 1.0}, {600, -1.0}}, 25.0, 0);
    chill.end.kind = StageEndKind::until_mean;
    chill.end.target_C = -5.0;  // below the medium: never reached, the cap ends it
    chill.end.max_duration_s = 1800;
    const auto h = simulate(p, {cook, pause, chill});
    REQUIRE(h.stages.size() == 3);
    CHECK(h.stages[0].ended_by == StageEndedBy::condition);
    CHECK(h.stages[0].at_end.centre_C == doctest::Approx(70.0).epsilon(1e-8));
    CHECK(h.stages[1].end_s == h.stages[1].start_s);
    CHECK(h.stages[2].ended_by == StageEndedBy::cap);
    REQUIRE(h.notes.size() == 1);
    CHECK(h.notes[0].stage_number == 3);
    for (const auto& r : h.stages) {
      if (r.start_s <= 0) continue;
      const double before = h.evaluate(r.start_s - 1e-7).centre_C, after = h.evaluate(r.start_s + 1e-7).centre_C;
      CHECK(std::abs(before - after) < 1e-5);
      CHECK(std::abs(h.evaluate(r.start_s).centre_C - before) < 1e-5);
    }
    for (std::size_t i = 1; i < h.samples.size(); ++i) CHECK(h.samples[i].time_s >= h.samples[i - 1].time_s);
    CHECK(h.samples.back().time_s == doctest::Approx(h.end_s()));
    CHECK(std::isfinite(h.temperature_at(h.end_s() / 2, {0.5, 0.5, 0.5})));
  }
}

TEST_CASE("a medium ramp from the initial temperature equals the Duhamel integral summed directly") {
  // Closed form of Duhamel's integral for T∞ = T0 + s·t: u(0, t) = −s Σ C_n (1 − e^{−λ_n t})/λ_n,
  // summed here over 4000 modes (modes.hpp), independent of the engine's recursion and of its
  // left-out-mode corrections. Sphere, Bi = 5.
  const auto p = body(Shape::sphere);
  const double L = 0.02, alpha = p.properties.diffusivity_m2_s(), s = 0.05;
  const double h_W = 5.0 * 0.5 / L;
  const auto hist = simulate(p, {stage({{0, 5.0}, {2000, 5.0 + s * 2000}}, h_W, 2000.0)});
  const auto ms = modes(Geometry::sphere, 5.0, 4000);
  double worst = 0;
  for (double t : {0.5, 3.0, 17.0, 150.0, 999.0, 2000.0}) {
    double u = 0;
    for (const auto& m : ms) {
      const double lam = alpha * m.zeta * m.zeta / (L * L);
      u += -s * m.coefficient * (-std::expm1(-lam * t)) / lam;
    }
    worst = std::max(worst, std::abs(hist.evaluate(t).centre_C - (5.0 + s * t + u)));
  }
  MESSAGE("ramp vs direct Duhamel sum: worst centre " << worst << " K");
  CHECK(worst <= 1e-6);
}

TEST_CASE("projection inner products (Green's identity) equal the direct overlap integrals") {
  // Independent formula: overlap.hpp (sinc / Lommel closed forms, checked there against adaptive
  // quadrature) divided by the new mode's norm.
  using namespace coldcore::detail;
  for (Geometry g : {Geometry::slab, Geometry::cylinder, Geometry::sphere}) {
    for (auto [bi_from, bi_to] : {std::pair{20.0, 0.8}, std::pair{kInfiniteBiot, 3.0}, std::pair{0.5, kInfiniteBiot}}) {
      const auto from = axis_modes(g, bi_from, 0.02, 30), to = axis_modes(g, bi_to, 0.02, 30);
      const auto M = projection_matrix(from, to);
      double worst = 0;
      for (int i = 0; i < 30; ++i)
        for (int j = 0; j < 30; ++j)
          worst = std::max(worst, std::abs(M[i * 30 + j] - mode_overlap(g, from.zeta[i], to.zeta[j]) / to.norm[j]));
      MESSAGE(to_string(g) << " Bi " << bi_from << " -> " << bi_to << ": worst " << worst);
      CHECK(worst <= 1e-10);
    }
  }
}
