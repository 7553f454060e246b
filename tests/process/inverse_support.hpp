#pragma once
// Scenarios shared by the inverse and deviation suites: the invented kofta-like sphere of
// tests/reference/gen_fd_dip.py (same numbers), and the libraries from products/.
#include <string>
#include <vector>

#include "coldcore/io/libraries.hpp"
#include "../lethality/lethality_support.hpp"
#include "coldcore/lethality/organisms.hpp"
#include "coldcore/process/cooling.hpp"
#include "coldcore/process/inverse.hpp"

namespace coldcore::test {

struct Libs {
  OrganismLibrary organisms = io::parse_organisms(read_source_file("products/organisms.toml"), "organisms.toml");
  RuleLibrary rules = io::parse_cooling_rules(read_source_file("products/cooling-rules.toml"), "cooling-rules.toml");
  process::Libraries get() const { return {&organisms, &rules}; }
};

inline Stage stage(std::string name, std::vector<MediumPoint> pts, double h, double duration_s) {
  Stage s;
  s.name = std::move(name);
  s.medium.points = std::move(pts);
  s.medium.description = "test";
  s.h_W_m2K = h;
  s.end.kind = StageEndKind::duration;
  s.end.duration_s = duration_s;
  return s;
}

/// F-value target with own kinetics (Tref 70 C, z 7.5 C as in gen_fd_dip.py).
inline Target f_target(std::string name, double F_required_s, std::vector<std::string> stages = {}) {
  Target t;
  t.kind = TargetKind::f_value;
  t.name = std::move(name);
  t.own = OwnKinetics{70.0, 7.5, std::nullopt};
  t.F_required_s = F_required_s;
  t.stages = std::move(stages);
  return t;
}

/// gen_fd_dip.py's sphere: R = 0.019 m, k 0.48, rho 1052, cp 3418, initial 4 C; cook 96 C h 120
/// for 960 s; chill -2 C h 30 for 3600 s.
inline process::Scenario dip_sphere(std::vector<Target> targets) {
  process::Scenario s;
  s.product.name = "test sphere";
  s.product.shape = Shape::sphere;
  s.product.dims.diameter_m = 0.038;
  s.product.initial_C = 4;
  s.product.properties.conductivity_W_mK = 0.48;
  s.product.properties.density_kg_m3 = 1052;
  s.product.properties.specific_heat_J_kgK = 3418;
  s.stages = {stage("cook", {{0, 96}}, 120, 960), stage("chill", {{0, -2}}, 30, 3600)};
  s.targets = std::move(targets);
  s.origin = "test";
  return s;
}

}  // namespace coldcore::test
