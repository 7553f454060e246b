// The history engine's two step paths agree bit for bit. A run of equal short steps in a
// duration stage (a regular 1 s log) takes the lean path (lean_steps.cpp); every other step the
// general one (stage_run.cpp). They are meant to do the same arithmetic in the same order, so
// forcing every step onto the general path (HistoryOptions::force_general_steps) must give the
// same samples to the last bit, and the same exact evaluations, for every shape.
#include <doctest/doctest.h>

#include <cmath>
#include <cstring>
#include <string>
#include <vector>

#include "coldcore/conduction/history.hpp"

using namespace coldcore;

namespace {

Product body(Shape shape) {
  Product p;
  p.name = "test body (invented)";
  p.shape = shape;
  p.dims.diameter_m = 0.05;
  p.dims.thickness_m = 0.03;
  p.dims.length_m = 0.08;
  p.dims.size_m[0] = 0.03;
  p.dims.size_m[1] = 0.05;
  p.dims.size_m[2] = 0.07;
  p.initial_C = 4.0;
  p.properties = {0.48, 1080.0, 3500.0};
  return p;
}

// A logger record at 1 s with a wobble (every step changes the slope), a stretch at 2 s (a new
// run length) and a level plateau (slope changes of zero), invented.
std::vector<MediumPoint> wobbly_log(double base_C, double amplitude_C, int seconds) {
  std::vector<MediumPoint> pts;
  double t = 0.0;
  while (t <= seconds) {
    pts.push_back({t, base_C + amplitude_C * std::sin(t / 37.0) + 0.3 * std::sin(t / 3.1)});
    t += (t >= 300.0 && t < 420.0) ? 2.0 : 1.0;
    if (t >= 600.0 && t < 660.0) {
      pts.push_back({t, pts.back().temp_C});
      t = 660.0;
    }
  }
  return pts;
}

Stage logged_stage(std::string name, double h, std::vector<MediumPoint> pts) {
  Stage s;
  s.name = std::move(name);
  s.h_W_m2K = h;
  s.end.duration_s = pts.back().time_s;
  s.medium.points = std::move(pts);
  return s;
}

bool same_bits(const HistorySample& a, const HistorySample& b) {
  return std::memcmp(&a.time_s, &b.time_s, sizeof(double)) == 0 &&
         std::memcmp(&a.medium_C, &b.medium_C, sizeof(double)) == 0 &&
         std::memcmp(&a.centre_C, &b.centre_C, sizeof(double)) == 0 &&
         std::memcmp(&a.surface_C, &b.surface_C, sizeof(double)) == 0 &&
         std::memcmp(&a.mean_C, &b.mean_C, sizeof(double)) == 0 && a.stage == b.stage;
}

}  // namespace

TEST_CASE("lean and general step paths give the same bits (1 s logs / a projection / every shape)") {
  // cook through a logged oven, then a logged chill at another h (projection between stages)
  const std::vector<Stage> stages = {logged_stage("cook", 60.0, wobbly_log(95.0, 4.0, 1200)),
                                     logged_stage("chill", 250.0, wobbly_log(2.0, 1.5, 900))};
  for (Shape shape : {Shape::sphere, Shape::cylinder, Shape::slab, Shape::finite_cylinder, Shape::brick}) {
    CAPTURE(static_cast<int>(shape));
    const Product p = body(shape);
    HistoryOptions general;
    general.force_general_steps = true;
    const History lean = simulate(p, stages);
    const History all_general = simulate(p, stages, general);
    REQUIRE(lean.samples.size() == all_general.samples.size());
    REQUIRE(lean.samples.size() > 1500);
    std::size_t differing = 0;
    for (std::size_t i = 0; i < lean.samples.size(); ++i)
      if (!same_bits(lean.samples[i], all_general.samples[i])) ++differing;
    CHECK(differing == 0);
    for (double t : {0.5, 299.5, 301.0, 633.0, 1199.9, 1200.0, 1201.0, 1250.5, 2099.0}) {
      const auto a = lean.evaluate(t), b = all_general.evaluate(t);
      CHECK(same_bits(a, b));
    }
  }
}
