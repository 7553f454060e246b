// Assessment of targets on analytic histories; every expected value is a closed form of the
// Bigelow General Method on piecewise-linear temperatures (REFERENCES §7 item 12 form), or a
// published rule limit (REFERENCES §2.2, §2.3).
#include <doctest/doctest.h>

#include <cmath>
#include <vector>

#include "coldcore/report/target_notes.hpp"
#include "coldcore/io/libraries.hpp"
#include "coldcore/report/temperature_text.hpp"
#include "coldcore/error.hpp"
#include "coldcore/lethality/integrate.hpp"
#include "coldcore/process/assessment.hpp"
#include "lethality/lethality_support.hpp"
#include "support/libraries.hpp"

using namespace coldcore;

namespace {

const OrganismLibrary& orgs() { return test::project_organisms(); }
const RuleLibrary& rules() { return test::project_rules(); }

// Cook: 20 -> 72 C linear over 20 min, hold 72 C to 30 min; chill: 72 -> 2 C linear over 60 min.
double cook_chill(double t) {
  if (t <= 1200) return 20 + 52 * t / 1200;
  if (t <= 1800) return 72;
  return std::max(2.0, 72 - 70 * (t - 1800) / 3600);
}
double medium(double t) { return t < 1800 ? 90 : -1; }

History make() {
  return test::analytic_history(cook_chill, {{"cook", 1800}, {"chill", 3600}}, 10.0, medium);
}

// Closed form: F over a linear segment Ta -> Tb lasting d seconds (z, Tref).
double f_linear(double d, double Ta, double Tb, double tref, double z) {
  const double La = std::pow(10, (Ta - tref) / z), Lb = std::pow(10, (Tb - tref) / z);
  return d * z / (std::log(10.0) * (Tb - Ta)) * (Lb - La);
}

Target listeria(double logs, std::vector<std::string> stages = {}) {
  Target t;
  t.kind = TargetKind::log_reduction;
  t.organism = "listeria-monocytogenes";
  t.log_reduction = logs;
  t.stages = std::move(stages);
  return t;
}

// The cook-chill as a probe log: a row every 10 s, so every corner is a row.
void cook_chill_rows(std::vector<double>& ts, std::vector<double>& Ts) {
  for (double t = 0; t <= 5400; t += 10) {
    ts.push_back(t);
    Ts.push_back(cook_chill(t));
  }
}

Target two_stage_rule() {
  Target cool;
  cool.kind = TargetKind::cooling_rule;
  cool.rule = "two-stage-6h";
  return cool;
}

}  // namespace

TEST_CASE("log-reduction target: per-stage F / credited stages / margin and range flag") {
  const History h = make();
  const double z = 7.5, ref = 70, D = 20;  // organisms.toml Listeria (D70 = 2 min / 6)
  const double F_cook = f_linear(1200, 20, 72, ref, z) + 600 * std::pow(10, 2 / 7.5);
  const double F_chill = f_linear(3600, 72, 2, ref, z);
  const Assessment a = assess(h, {listeria(6), listeria(6, {"cook"}), listeria(100)}, orgs(), rules());
  REQUIRE(a.targets.size() == 3);
  const TargetResult& all = a.targets[0];
  REQUIRE(all.stages.size() == 2);
  CHECK(all.stages[0].F_s == doctest::Approx(F_cook).epsilon(1e-6));
  CHECK(all.stages[1].F_s == doctest::Approx(F_chill).epsilon(1e-6));
  CHECK(all.F_s == doctest::Approx(F_cook + F_chill).epsilon(1e-6));
  CHECK(all.achieved == doctest::Approx((F_cook + F_chill) / D).epsilon(1e-6));
  CHECK(all.verdict == Verdict::met);
  CHECK(all.column == "F_listeria-monocytogenes_min");
  // Chill excluded.
  const TargetResult& cook_only = a.targets[1];
  CHECK(cook_only.F_s == doctest::Approx(F_cook).epsilon(1e-6));
  CHECK_FALSE(cook_only.stages[1].credited);
  // Not demonstrated with the shortfall, rounded up.
  const TargetResult& big = a.targets[2];
  CHECK(big.verdict == Verdict::not_demonstrated);
  CHECK(big.margin == doctest::Approx((F_cook + F_chill) / D - 100).epsilon(1e-6));
  CHECK(big.verdict_text.find("not demonstrated, shortfall ") == 0);
  CHECK_FALSE(a.all_met());
  // F credited below 60 C (the data's range is 60-80 C): ramp 20->60 and chill 60->2, closed form.
  const double below = f_linear(1200.0 * 40 / 52, 20, 60, ref, z) + f_linear(3600.0 * 58 / 70, 60, 2, ref, z);
  CHECK(all.F_outside_range_s == doctest::Approx(below).epsilon(1e-5));
  bool flagged = false, memory = false;
  for (const auto& n : all.notes) {
    if (n.kind == TargetNoteKind::outside_valid_range) {
      flagged = true;
      CHECK(n.low_C == 60);
      CHECK(n.high_C == 80);
      CHECK(n.value == doctest::Approx(below / all.F_s).epsilon(1e-5));
    }
    memory |= n.kind == TargetNoteKind::value_from_memory && n.key == "z_C" && n.subject == "listeria-monocytogenes";
  }
  CHECK(flagged);
  CHECK(memory);
  // Cumulative F at the stage boundary and the end.
  std::vector<double> times{0, 600, 1800, 5400};
  const auto cum = cumulative_f_s(h, all, times);
  CHECK(cum[0] == 0);
  CHECK(cum[1] == doctest::Approx(f_linear(600, 20, 46, ref, z)).epsilon(1e-6));
  CHECK(cum[2] == doctest::Approx(F_cook).epsilon(1e-6));
  CHECK(cum[3] == doctest::Approx(F_cook + F_chill).epsilon(1e-6));
  const auto cum_cook = cumulative_f_s(h, cook_only, times);
  CHECK(cum_cook[3] == doctest::Approx(F_cook).epsilon(1e-6));
}

TEST_CASE("F-value target with own kinetics - verdict only on a positive margin") {
  // 80 C for 1 min with z 7.5 -> F70 = 21.54 min (brief; Bigelow definition).
  auto T = [](double) { return 80.0; };
  const History h = test::analytic_history(T, {{"hold", 60}}, 5.0);
  Target t;
  t.kind = TargetKind::f_value;
  t.name = "F70";
  t.own = OwnKinetics{70, 7.5, std::nullopt};
  t.F_required_s = 21.0 * 60;
  Target t2 = t;
  t2.F_required_s = 22.0 * 60;
  const Assessment a = assess(h, {t, t2}, orgs(), rules());
  CHECK(a.targets[0].F_s / 60 == doctest::Approx(21.544).epsilon(1e-4));
  CHECK(a.targets[0].verdict == Verdict::met);
  CHECK(a.targets[0].achieved_text == "21.5 min");  // 21.544 rounded down
  CHECK(a.targets[0].margin_text == "0.544 min");
  CHECK(a.targets[0].column == "F_F70_min");
  CHECK(a.targets[1].verdict == Verdict::not_demonstrated);
  CHECK(a.targets[1].margin_text == "0.456 min");  // shortfall 22 - 21.5443 = 0.45565, rounded up
}

TEST_CASE("F0 = 3 min isothermal and 12D: shown values") {
  // REFERENCES §7 items 11, 13: 3 min at 121.1 C -> F0 = 3.00 min; 12D needs 2.52 min.
  auto T = [](double) { return 121.1; };
  const History h = test::analytic_history(T, {{"hold", 180}}, 10.0);
  Target t;
  t.kind = TargetKind::log_reduction;
  t.organism = "c-botulinum-proteolytic";
  t.log_reduction = 12;
  const Assessment a = assess(h, {t}, orgs(), rules());
  CHECK(a.targets[0].stages[0].F_text == "3.00 min");
  CHECK(a.targets[0].F_required_s / 60 == doctest::Approx(2.52));
  CHECK(a.targets[0].achieved == doctest::Approx(180 / 12.6));
  CHECK(a.targets[0].verdict == Verdict::met);
  CHECK(shown_down(2.999) == "2.99");
  CHECK(shown_up(2.001) == "2.01");
  CHECK(shown_down(-0.4561) == "-0.457");
}

TEST_CASE("cooling-rule and minimum-temperature targets on a history") {
  const History h = make();
  Target rule;
  rule.kind = TargetKind::cooling_rule;
  rule.rule = "two-stage-6h";
  Target opt2 = rule;
  opt2.rule = "fsis-stabilization-option-2";
  Target hold;
  hold.kind = TargetKind::centre_min_temperature;
  hold.min_temp_C = 70;
  hold.hold_s = 120;
  const Assessment a = assess(h, {rule, opt2, hold}, orgs(), rules());
  const TargetResult& r = a.targets[0];
  REQUIRE(r.cooling);
  // 57 C at 1800 + 15/70 h, 21 C at 1800 + 51/70 h, 5 C at 1800 + 67/70 h.
  CHECK(r.cooling->steps[0].start_s.value() == doctest::Approx(1800 + 15.0 / 70 * 3600).epsilon(1e-9));
  CHECK(r.cooling->steps[0].elapsed_s == doctest::Approx(36.0 / 70 * 3600).epsilon(1e-9));
  CHECK(r.cooling->steps[1].elapsed_s == doctest::Approx(52.0 / 70 * 3600).epsilon(1e-9));
  CHECK(r.verdict == Verdict::met);
  // Tightest step: 7200 - 1851.43 s = 89.14 min margin.
  CHECK(r.margin == doctest::Approx(7200 - 36.0 / 70 * 3600).epsilon(1e-9));
  // Option 2: chilling inferred to start at the chill stage, right after the cook.
  const TargetResult& o2 = a.targets[1];
  CHECK(o2.cooling->chill_delay_s.value() == doctest::Approx(0.0));
  CHECK(o2.verdict == Verdict::met);
  // Minimum temperature 70 C: up-crossing at 1200*50/52 s, down-crossing at 1800 + 2/70 h.
  const TargetResult& m = a.targets[2];
  CHECK(m.achieved == doctest::Approx(1800 + 2.0 / 70 * 3600 - 1200.0 * 50 / 52).epsilon(1e-9));
  CHECK(m.verdict == Verdict::met);
  CHECK(m.reached_s.value() == doctest::Approx(1200.0 * 50 / 52).epsilon(1e-9));
}

TEST_CASE("assessment errors name the target") {
  const History h = make();
  AssessOptions o;
  o.origin = "meatballs.toml";
  CHECK_THROWS_WITH_AS(assess(h, {listeria(6, {"chil"})}, orgs(), rules(), o),
                       "meatballs.toml: target[1].stages: \"chil\": no stage of that name; did you mean 'chill'?",
                       InputError);
  Target cv;
  cv.kind = TargetKind::log_reduction;
  cv.organism = "cook-value";
  cv.log_reduction = 1;
  CHECK_THROWS_WITH_AS(assess(h, {cv}, orgs(), rules(), o),
                       "meatballs.toml: target[1]: organism = \"cook-value\": has no D value; a "
                       "log-reduction target needs D_ref (or Weibull data)",
                       InputError);
}

TEST_CASE("probe log: three rules / verdict on the smallest / rule check on the same log") {
  std::vector<double> ts, Ts;
  cook_chill_rows(ts, Ts);
  const Target cool = two_stage_rule();
  const ProbeAssessment p = assess_probe_log(ts, Ts, {listeria(6), cool}, orgs(), rules());
  REQUIRE(p.lethality.size() == 1);
  const double exact = f_linear(1200, 20, 72, 70, 7.5) + 600 * std::pow(10, 2 / 7.5) + f_linear(3600, 72, 2, 70, 7.5);
  CHECK(p.lethality[0].F_linear_s == doctest::Approx(exact).epsilon(1e-9));
  CHECK(p.lethality[0].F_trapezoid_s == doctest::Approx(exact).epsilon(1e-3));
  CHECK(p.lethality[0].F_simpson_s == doctest::Approx(exact).epsilon(1e-3));
  CHECK(p.targets[0].F_s <= p.lethality[0].F_linear_s);
  CHECK(p.targets[0].verdict == Verdict::met);
  CHECK(p.targets[1].verdict == Verdict::met);
  CHECK(p.targets[1].cooling->steps[0].elapsed_s == doctest::Approx(36.0 / 70 * 3600).epsilon(1e-9));
  CHECK(p.all_met());
}

TEST_CASE("Weibull organism data are parsed and used for log reductions") {
  // Test-only kinetics (not library data): delta 60 s at 70 C, p 0.5, z 7.5 C.
  const char* text = R"(
schema = 1
[[organism]]
key = "test-weibull"
name = "test organism"
kind = "vegetative"
reference_C = { value = 70, source = "test", status = "derived" }
z_C = { value = 7.5, source = "test", status = "derived" }
valid_min_C = { value = 60, source = "test", status = "derived" }
valid_max_C = { value = 80, source = "test", status = "derived" }
weibull = { delta_ref_min = { value = 1, source = "test", status = "derived" }, p = { value = 0.5, source = "test", status = "derived" } }
)";
  const OrganismLibrary lib = io::parse_organisms(text, "w.toml");
  REQUIRE(lib.organisms[0].kinetics.weibull);
  CHECK(lib.organisms[0].kinetics.weibull->delta_ref_s == 60);
  // 70 C for 4 min: (240/60)^0.5 = 2 log10 (Mafart et al. 2002 definition, from memory).
  auto T = [](double) { return 70.0; };
  const History h = test::analytic_history(T, {{"hold", 240}}, 10.0);
  Target t;
  t.kind = TargetKind::log_reduction;
  t.organism = "test-weibull";
  t.log_reduction = 1.9;
  const Assessment a = assess(h, {t}, lib, rules());
  CHECK(a.targets[0].achieved == doctest::Approx(2.0));
  // F needed for 1.9 log10: delta * 1.9^(1/p) = 60 * 3.61 = 216.6 s.
  CHECK(a.targets[0].F_required_s == doctest::Approx(216.6));
  CHECK(a.targets[0].verdict == Verdict::met);
}

TEST_CASE("a tie is not shown as met") {
  // 57 C exactly at 600 s and 21 C exactly at 7800 s: elapsed = the 2 h limit, margin 0.
  std::vector<double> ts{0, 600, 7800, 20000}, Ts{60, 57, 21, 4};
  Target cool;
  cool.kind = TargetKind::cooling_rule;
  cool.rule = "two-stage-6h";
  const ProbeAssessment p = assess_probe_log(ts, Ts, {cool}, orgs(), rules());
  CHECK(p.targets[0].margin == 0);
  CHECK(p.targets[0].verdict == Verdict::not_demonstrated);
  // issue 11: a tie is named as such, not as "shortfall 0".
  CHECK(p.targets[0].verdict_text ==
        "not demonstrated — exactly at the required value: not demonstrated by a positive margin");
  CHECK(p.targets[0].margin_shown == "exactly at the required value");
}

TEST_CASE("history without exact evaluation is interpolated / with a warning") {
  History h = make();
  h.evaluate = nullptr;
  const Assessment a = assess(h, {listeria(6)}, orgs(), rules());
  REQUIRE(a.warnings.size() == 1);
  const double F = f_linear(1200, 20, 72, 70, 7.5) + 600 * std::pow(10, 2 / 7.5) + f_linear(3600, 72, 2, 70, 7.5);
  // Linear interpolation of a piecewise-linear history with samples at every corner is exact.
  CHECK(a.targets[0].F_s == doctest::Approx(F).epsilon(1e-6));
}

TEST_CASE("cooking table on a history") {
  const CookingTables tabs =
      io::parse_cooking_tables(test::read_source_file("products/cooking-tables.toml"), "cooking-tables.toml");
  const History h = make();  // reaches 72 C, above the 158 F (70.0 C) instant row (REFERENCES 1.4)
  const CookingCheck c = check_cooking_table(h, tabs.at("fsis-appendix-a-6.5-log", "t"));
  CHECK(c.met);
  REQUIRE(c.instant_reached_s.has_value());
  CHECK(*c.instant_reached_s == doctest::Approx(1200.0 * 50 / 52).epsilon(1e-9));
  const CookingCheck p = check_cooking_table(h, tabs.at("food-code-poultry", "t"));
  CHECK_FALSE(p.met);  // never reaches 74 C
}

// The log-sampling check returns numbers (lethality/integrate.hpp); report words them.
// Rules of the check as documented there: a gap is > 5 × the median interval and >= 60 s; a
// coarse interval changes by more than z/10 and carries >= 1 % of F.
TEST_CASE("probe log: a gap and a coarse interval are worded with their times and temperatures") {
  std::vector<double> ts, Ts;
  for (int i = 0; i < 40; ++i) {
    ts.push_back(i * 10.0 + (i >= 20 ? 600 : 0));  // 610 s from t = 190 s to 800 s
    Ts.push_back(i == 30 ? 75.0 : 70.0);           // 70 -> 75 °C in one 10 s step: > z/10 = 0.75 K
  }
  const ProbeAssessment p = assess_probe_log(ts, Ts, {listeria(1)}, orgs(), rules());
  const auto has = [&](const std::string& text) {
    for (const auto& w : assessment_warning_texts(p.warnings))
      if (w.find(text) != std::string::npos) return true;
    return false;
  };
  CHECK(has("log gap of 610 s after t = 190 s (median interval 10 s)"));
  CHECK(has("coarse sampling: "));
  CHECK(has(" between t = 890 and 900 s (more than z/10 in one interval)"));
}

// Issue 12 item 2: a model history and a measured log are one curve to the assessment. Rows at
// every corner of the piecewise-linear cook-chill make both the same curve, so every kind of
// target reads the same numbers (the closed forms above), and the notes come in the same order.
TEST_CASE("one curve: a probe log and a history through the same corners agree on every target kind") {
  std::vector<double> ts, Ts;
  cook_chill_rows(ts, Ts);
  const Target cool = two_stage_rule();
  Target hold;
  hold.kind = TargetKind::centre_min_temperature;
  hold.min_temp_C = 70;
  hold.hold_s = 120;
  const std::vector<Target> targets{listeria(6), cool, hold};
  const ProbeAssessment p = assess_probe_log(ts, Ts, targets, orgs(), rules());
  const Assessment a = assess(make(), targets, orgs(), rules());
  REQUIRE(p.targets.size() == a.targets.size());
  const double F = f_linear(1200, 20, 72, 70, 7.5) + 600 * std::pow(10, 2 / 7.5) + f_linear(3600, 72, 2, 70, 7.5);
  CHECK(a.targets[0].F_s == doctest::Approx(F).epsilon(1e-4));  // adaptive quadrature, rel_tol 1e-4
  CHECK(p.targets[0].F_s == doctest::Approx(F).epsilon(1e-3));  // smallest of three rules on 10-s rows
  // Listeria data hold for 60-80 C (organisms.toml): the share below 60 C is flagged on both, after
  // the provenance notes.
  for (const auto* notes : {&a.targets[0].notes, &p.targets[0].notes}) {
    REQUIRE_FALSE(notes->empty());
    CHECK(notes->back().kind == TargetNoteKind::outside_valid_range);
  }
  CHECK(p.targets[0].F_outside_range_s == doctest::Approx(a.targets[0].F_outside_range_s).epsilon(1e-3));
  for (std::size_t i = 0; i < 2; ++i)  // 57 -> 21 C and 21 -> 5 C steps: same crossings
    CHECK(p.targets[1].cooling->steps[i].elapsed_s ==
          doctest::Approx(a.targets[1].cooling->steps[i].elapsed_s).epsilon(1e-9));
  CHECK(p.targets[2].achieved == doctest::Approx(1800 + 2.0 / 70 * 3600 - 1200.0 * 50 / 52).epsilon(1e-9));
  CHECK(a.targets[2].achieved == doctest::Approx(p.targets[2].achieved).epsilon(1e-9));
  for (std::size_t i = 0; i < 3; ++i) CHECK(p.targets[i].verdict == a.targets[i].verdict);
}
