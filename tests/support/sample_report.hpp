#pragma once
// A synthetic RunReport for writer tests and the browser check. Its curves come from a made-up
// two-lag model (surface follows the medium, centre follows the surface) chosen only to look
// like a cook-then-chill run; they are NOT a conduction result and test no physics. The writers
// only format, so any plausible numbers exercise them.
#include <cmath>
#include <string>

#include "coldcore/report/cautions.hpp"
#include "coldcore/report/run_report.hpp"

namespace coldcore::testing {

struct SampleOptions {
  bool lumped_column = true;  ///< include lumped_centre_C
  double biot = 0.9;          ///< the Biot number written into both stages
};

inline RunReport sample_report(const SampleOptions& opt = {}) {
  RunReport r;
  r.title = "Synthetic sample <meatballs> & \"quotes\" — made-up curves, not a computed process";
  r.verb = "run";
  r.product = {{"name", "Synthetic sphere, 42 mm"},
               {"shape", "sphere"},
               {"diameter", "42 mm"},
               {"conductivity", "0.48 W/mK"},
               {"density", "1060 kg/m³"},
               {"specific heat", "3450 J/kgK"},
               {"pipe | and *stars*", "kept as text"}};
  r.history.columns = {{"time_s", false},        {"medium_C", true}, {"centre_C", true},
                       {"surface_C", true},      {"mean_C", true},   {"F_F70_min", false}};
  if (opt.lumped_column) r.history.columns.push_back({"lumped_centre_C", true});

  const double cook_end_s = 1500, cap_s = 8 * 3600;
  double surface = 4, centre = 4, lumped = 4, f70_min = 0, t = 0, chill_end_s = cap_s;
  double passed57_s = -1, passed21_s = -1, passed5_s = -1;
  auto medium_at = [&](double ts) { return ts < cook_end_s ? 84.0 : -1.0; };
  auto push = [&] {
    std::vector<double> row = {t, medium_at(t), centre, surface, (surface + 2 * centre) / 3, f70_min};
    if (opt.lumped_column) row.push_back(lumped);
    r.history.rows.push_back(row);
  };
  push();
  for (int step = 1; t < cap_s; ++step) {
    const bool cook = t < cook_end_s;
    const double tau_s = cook ? 300 : 1800, tau_c = cook ? 600 : 3600, tau_l = cook ? 700 : 4200;
    const double m = medium_at(t);
    surface += (m - surface) / tau_s;
    centre += (surface - centre) / tau_c;
    lumped += (m - lumped) / tau_l;
    f70_min += std::pow(10.0, (centre - 70.0) / 7.5) / 60.0;
    t += 1;
    if (!cook) {
      if (passed57_s < 0 && centre <= 57) passed57_s = t;
      if (passed21_s < 0 && centre <= 21) passed21_s = t;
      if (passed5_s < 0 && centre <= 5) passed5_s = t;
    }
    if (step % 60 == 0) push();
    if (!cook && centre <= 4) {
      chill_end_s = t;
      if (step % 60 != 0) push();
      break;
    }
  }
  const auto& last = r.history.rows.back();
  const auto& at_cook_end = r.history.rows[static_cast<size_t>(cook_end_s / 60)];
  r.stages = {
      {"steam cook", 0, cook_end_s, "duration", "84 °C constant", 180, false, opt.biot,
       "synthetic Bi; above 0.1 the centre lags the surface", at_cook_end[2], at_cook_end[3], at_cook_end[4]},
      {"blast chill", cook_end_s, chill_end_s, "condition met", "-1 °C constant", 22, false, opt.biot / 8,
       "synthetic Bi", last[2], last[3], last[4]},
  };
  r.target_lines = {{"F_F70_min", 2.0, ""}, {"centre_C", 72.0, ""}};
  if (passed57_s > 0 && passed21_s > 0) {
    r.rule_boxes.push_back({"rule step 1 (2 h)", passed57_s, passed57_s + 2 * 3600, 57, 21, ""});
    r.rule_boxes.push_back({"rule step 2 (6 h in all)", passed21_s, passed57_s + 6 * 3600, 21, 5, ""});
  }
  VerdictRow f70;
  f70.name = "F70";
  f70.kind = "F-value";
  f70.required = "F70 ≥ 2.00 min";
  f70.achieved = fixed(std::floor(f70_min * 100) / 100, 2) + " min";  // lethality rounded down
  f70.margin = fixed(std::floor((f70_min - 2.0) * 100) / 100, 2) + " min";
  f70.met = f70_min > 2.0;
  f70.details = {"steam cook: all of it (synthetic)"};
  f70.required_value = 2.0;
  f70.achieved_value = f70_min;
  f70.margin_value = f70_min - 2.0;
  f70.value_unit = "min";
  VerdictRow cool;
  cool.name = "two-stage cooling";
  cool.kind = "cooling-rule";
  cool.required = "step 1 within 2 h, step 2 within 6 h in all";
  cool.achieved = "synthetic";
  cool.margin = "-";
  cool.met = false;
  cool.details = {"synthetic row: shows how a not-demonstrated verdict prints"};
  r.verdicts = {f70, cool};
  r.warnings = {"Synthetic data: these curves were made up for testing the report layout."};
  r.assumptions = {"Conduction only (synthetic)", "Cold spot at the geometric centre"};
  r.provenance = {{"tool version", "coldcore test sample"},
                  {"input", "synthetic (no file)"},
                  {"input SHA-256", "e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855"},
                  {"date", "2026-01-01T00:00:00Z"}};
  r.cautions = cautions();
  return r;
}

}  // namespace coldcore::testing
