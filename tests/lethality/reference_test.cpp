// Lethality along non-isothermal histories against tests/reference/lethality.csv
// (mpmath quadrature of the Bigelow definition; scipy ODE integration of the Weibull rate form).
#include <doctest/doctest.h>

#include <cmath>
#include <map>
#include <sstream>
#include <vector>

#include "coldcore/io/libraries.hpp"
#include "coldcore/lethality/integrate.hpp"
#include "coldcore/process/assessment.hpp"
#include "lethality/lethality_support.hpp"

using namespace coldcore;

namespace {

std::map<std::string, double> reference() {
  std::map<std::string, double> m;
  std::istringstream in(test::read_source_file("tests/reference/lethality.csv"));
  std::string line;
  while (std::getline(in, line)) {
    if (line.empty() || line[0] == '#') continue;
    const auto a = line.find(','), b = line.rfind(',');
    m[line.substr(0, b)] = std::stod(line.substr(b + 1));
    (void)a;
  }
  return m;
}

double retort(double t) { return 121.1 - 81.1 * std::exp(-t / 600); }
double cook_chill(double t) {
  if (t <= 2400) return 80 - 75 * std::exp(-t / 900);
  return (80 - 75 * std::exp(-2400.0 / 900)) * std::exp(-(t - 2400) / 1200);
}

Kinetics dz(double ref, double z) {
  Kinetics k;
  k.reference_C = ref;
  k.z_C = z;
  return k;
}

}  // namespace

TEST_CASE("adaptive F matches mpmath on exponential heating to 1e-7") {
  const auto ref = reference();
  std::vector<double> bp{0, 3600};
  const double F = f_value(retort, bp, dz(121.1, 10)).F_s;
  CHECK(std::abs(F - ref.at("retort,F_s")) / ref.at("retort,F_s") < 1e-7);
  // Split z (non-proteolytic C. botulinum form); breakpoints do not include the 90 C crossing.
  Kinetics np = dz(90, 10);
  np.split_C = 90;
  np.z_below_C = 9;
  std::vector<double> bp2{0, 1800};
  const double Fs = f_value([](double t) { return 95 - 20 * std::exp(-t / 300); }, bp2, np).F_s;
  CHECK(std::abs(Fs - ref.at("split,F_s")) / ref.at("split,F_s") < 1e-6);
}

TEST_CASE("assessment per-stage F on a cook-chill history matches mpmath to 1e-6") {
  const auto ref = reference();
  const OrganismLibrary orgs =
      io::parse_organisms(test::read_source_file("products/organisms.toml"), "organisms.toml");
  const RuleLibrary rules = io::parse_cooling_rules(
      test::read_source_file("products/cooling-rules.toml"), "cooling-rules.toml");
  const History h = test::analytic_history(cook_chill, {{"cook", 2400}, {"chill", 7200}}, 30.0);
  Target t;
  t.kind = TargetKind::log_reduction;
  t.organism = "listeria-monocytogenes";
  t.log_reduction = 6;
  const Assessment a = assess(h, {t}, orgs, rules);
  const TargetResult& r = a.targets[0];
  CHECK(std::abs(r.stages[0].F_s - ref.at("cook-chill,F_cook_s")) / ref.at("cook-chill,F_cook_s") < 1e-6);
  CHECK(std::abs(r.stages[1].F_s - ref.at("cook-chill,F_chill_s")) / ref.at("cook-chill,F_chill_s") < 1e-6);
}

TEST_CASE("Weibull closed form equals the ODE of the published rate form") {
  const auto ref = reference();
  std::vector<double> bp{0, 3600};
  for (double p : {0.6, 1.5}) {
    Kinetics k = dz(121.1, 10);
    k.weibull = Weibull{30.0, p};
    const double F = f_value(retort, bp, k).F_s;
    const double logs = log_reduction_weibull(F, k);
    std::ostringstream key;
    key << "weibull-" << p << ",log_reduction";
    CAPTURE(p);
    CHECK(std::abs(logs - ref.at(key.str())) / ref.at(key.str()) < 1e-6);
  }
}
