// Lethal rate, F-values and log reductions against published values (REFERENCES §1, §7).
#include <doctest/doctest.h>

#include <cmath>
#include <vector>

#include "coldcore/io/libraries.hpp"
#include "coldcore/error.hpp"
#include "coldcore/lethality/integrate.hpp"
#include "coldcore/lethality/kinetics.hpp"
#include "coldcore/lethality/organisms.hpp"
#include "lethality/lethality_support.hpp"

using namespace coldcore;

namespace {

Kinetics dz(double ref_C, double z_C, std::optional<double> D_s = std::nullopt) {
  Kinetics k;
  k.reference_C = ref_C;
  k.z_C = z_C;
  k.D_ref_s = D_s;
  return k;
}

double f_hold_s(double temp_C, double hold_s, const Kinetics& k) {
  std::vector<double> bp{0.0, hold_s};
  return f_value([temp_C](double) { return temp_C; }, bp, k).F_s;
}

const OrganismLibrary& library() {
  static const OrganismLibrary lib =
      io::parse_organisms(test::read_source_file("products/organisms.toml"), "organisms.toml");
  return lib;
}

}  // namespace

TEST_CASE("isothermal holds equal the Bigelow definition") {
  // REFERENCES §7 item 11 [D from the Bigelow definition]: 3 min at 121.1 C -> F0 = 3 min.
  const Kinetics f0 = dz(121.1, 10);
  CHECK(f_hold_s(121.1, 180, f0) / 60 == doctest::Approx(3.0).epsilon(1e-12));
  // Item 11: 10 min at 115.0 C -> F0 = 2.4547 min; 1 min at 111.1 C -> 0.1000 min (1e-4).
  CHECK(f_hold_s(115.0, 600, f0) / 60 == doctest::Approx(2.4547).epsilon(1e-4));
  CHECK(f_hold_s(111.1, 60, f0) / 60 == doctest::Approx(0.1000).epsilon(1e-4));
  // 80 C for 1 min, z 7.5 -> F70 = 10^(10/7.5) = 21.54 min (brief; Bigelow definition).
  CHECK(f_hold_s(80, 60, dz(70, 7.5)) / 60 == doctest::Approx(21.544).epsilon(1e-4));
}

TEST_CASE("12D botulinum cook and P70 Listeria") {
  // REFERENCES §7 item 13 (common practice): 12 x 0.21 = 2.52 min; with D = 0.2, 2.4 min.
  const Organism& cb = library().at("c-botulinum-proteolytic", "test");
  CHECK(*cb.kinetics.D_ref_s * 12 / 60 == doctest::Approx(2.52).epsilon(1e-12));
  CHECK(log_reduction_linear(2.52 * 60, cb.kinetics) == doctest::Approx(12.0).epsilon(1e-12));
  CHECK(log_reduction_linear(2.4 * 60, dz(121.1, 10, 0.2 * 60)) == doctest::Approx(12.0));
  // REFERENCES §1.3: 70 C for 2 min = 6-log Listeria (D70 = 0.33 min, z = 7.5 C from memory).
  const Organism& lm = library().at("listeria-monocytogenes", "test");
  CHECK(log_reduction_linear(f_hold_s(70, 120, lm.kinetics), lm.kinetics) ==
        doctest::Approx(6.0).epsilon(1e-9));
  CHECK(log_reduction_linear(f_hold_s(70, 120, dz(70, 7.5, 0.33 * 60)), dz(70, 7.5, 0.33 * 60)) ==
        doctest::Approx(6.06).epsilon(1e-3));
}

TEST_CASE("P70 equivalents at z = 7.5 C (REFERENCES 7 item 15)") {
  // [D] 2*10^((70-T)/7.5): 60 C 43.09 min, 65 C 9.283 min, 75 C 25.85 s, 80 C 5.57 s (1e-3 rel).
  const Kinetics k = library().at("listeria-monocytogenes", "test").kinetics;
  CHECK(equivalent_time_s(120, 60, k) / 60 == doctest::Approx(43.09).epsilon(1e-3));
  CHECK(equivalent_time_s(120, 65, k) / 60 == doctest::Approx(9.283).epsilon(1e-3));
  CHECK(equivalent_time_s(120, 75, k) == doctest::Approx(25.85).epsilon(1e-3));
  CHECK(equivalent_time_s(120, 80, k) == doctest::Approx(5.57).epsilon(1e-3));
}

TEST_CASE("pasteurisation units (REFERENCES 7 item 16)") {
  // 1 PU = 1 min at 60 C; PU = t * 1.393^(T-60), z = 1/log10(1.393) = 6.947 C [C formula, D numbers].
  const Kinetics pu = dz(60, 1.0 / std::log10(1.393));
  CHECK(pu.z_C == doctest::Approx(6.947).epsilon(1e-3));
  CHECK(f_hold_s(60, 60, pu) / 60 == doctest::Approx(1.0));
  CHECK(f_hold_s(65, 600, pu) / 60 == doctest::Approx(52.45).epsilon(1e-3));
}

TEST_CASE("non-proteolytic C. botulinum: split z reproduces the CFA equivalence table") {
  // REFERENCES §1.2 [C table, D split]; §7 item 14: tolerance = the table's printed rounding
  // (half a unit in the last printed digit).
  const Organism& np = library().at("c-botulinum-non-proteolytic", "test");
  REQUIRE(np.equivalence);
  REQUIRE(np.equivalence->rows.size() == 21);
  for (const auto& row : np.equivalence->rows) {
    const double predicted_min = equivalent_time_s(np.equivalence->F_ref_s, row.temp_C, np.kinetics) / 60;
    const double printed = row.time_s / 60;
    // Printed to 2 significant figures below 10 min with one decimal, whole minutes above.
    const double half_unit = printed >= 10 ? 0.5 : 0.05;
    CAPTURE(row.temp_C);
    CHECK(std::abs(predicted_min - printed) <= half_unit + 1e-9);
  }
  // Spot values from §7 item 14: 80 C 129.2, 85 C 35.9, 89 C 12.9, 95 C 3.16, 100 C 1.00 min.
  CHECK(equivalent_time_s(600, 80, np.kinetics) / 60 == doctest::Approx(129.15).epsilon(1e-3));
  CHECK(equivalent_time_s(600, 85, np.kinetics) / 60 == doctest::Approx(35.94).epsilon(1e-3));
  CHECK(equivalent_time_s(600, 95, np.kinetics) / 60 == doctest::Approx(3.162).epsilon(1e-3));
  // Continuity at the split.
  CHECK(lethal_rate(90 - 1e-9, np.kinetics) == doctest::Approx(1.0).epsilon(1e-9));
}

TEST_CASE("General Method on a linear ramp against the closed form (REFERENCES 7 item 12)") {
  // Ramp 101.1 -> 121.1 C over 20 min, z = 10, Tref = 121.1: F = (10/ln10)(1 - 10^-2) = 4.29952 min.
  const Kinetics f0 = dz(121.1, 10);
  auto ramp = [](double t) { return 101.1 + t / 60.0; };
  const double exact_min = 10.0 / std::log(10.0) * (1 - 0.01);
  std::vector<double> bp{0, 1200};
  const LethalityResult r = f_value(ramp, bp, f0);
  CHECK(r.F_s / 60 == doctest::Approx(4.29952).epsilon(1e-5));
  CHECK(std::abs(r.F_s / 60 - exact_min) / exact_min < 1e-9);  // adaptive GK: well below 0.1 %
  // Logged ramp at 1 s: exact piecewise-linear integral to 1e-6 relative (brief), trapezoid 1e-4.
  std::vector<double> ts, Ts;
  for (int i = 0; i <= 1200; ++i) {
    ts.push_back(i);
    Ts.push_back(ramp(i));
  }
  CHECK(std::abs(f_piecewise_linear_s(ts, Ts, f0).F_s / 60 - exact_min) / exact_min < 1e-6);
  CHECK(std::abs(f_trapezoid_s(ts, Ts, f0).F_s / 60 - exact_min) / exact_min < 1e-4);
  CHECK(std::abs(f_simpson_s(ts, Ts, f0).F_s / 60 - exact_min) / exact_min < 1e-6);
  // A coarse log (every 60 s, odd interval count) still within 1e-6 for the exact-linear rule.
  ts.clear();
  Ts.clear();
  for (int i = 0; i <= 1140; i += 60) {
    ts.push_back(i);
    Ts.push_back(ramp(i));
  }
  ts.push_back(1200);
  Ts.push_back(ramp(1200));
  const double exact_coarse = 10.0 / std::log(10.0) * (1 - 0.01);
  CHECK(std::abs(f_piecewise_linear_s(ts, Ts, f0).F_s / 60 - exact_coarse) / exact_coarse < 1e-6);
  CHECK(std::abs(f_simpson_s(ts, Ts, f0).F_s / 60 - exact_coarse) / exact_coarse < 1e-4);
}

TEST_CASE("adaptive F on a sharp peak meets 0.1 % and refuses to return unconverged") {
  // Peak 70 + 50 exp(-((t-3600)/30)^2) over 2 h; z = 5: the closed form is not simple, so compare
  // with a very fine composite Simpson (independent rule) on the same function.
  const Kinetics k = dz(90, 5);
  auto peak = [](double t) { return 70 + 50 * std::exp(-std::pow((t - 3600) / 30, 2)); };
  std::vector<double> bp{0, 7200};
  const double adaptive = f_value(peak, bp, k).F_s;
  double fine = 0;
  const int n = 200000;
  const double h = 7200.0 / n;
  for (int i = 0; i <= n; ++i) {
    const double w = (i == 0 || i == n) ? 1 : (i % 2 ? 4 : 2);
    fine += w * lethal_rate(peak(i * h), k);
  }
  fine *= h / 3;
  CHECK(std::abs(adaptive - fine) / fine < 1e-4);
  FValueOptions tiny;
  tiny.max_intervals = 4;
  tiny.rel_tol = 1e-14;
  CHECK_THROWS_AS(f_value(peak, bp, k, tiny), NotConverged);
}

TEST_CASE("log integrators reject bad logs and warn on gaps") {
  const Kinetics k = dz(70, 7.5);
  std::vector<double> t{0, 10, 10, 30}, T{60, 65, 70, 70};
  CHECK_THROWS_WITH_AS(f_trapezoid_s(t, T, k, "probe.csv"),
                       "probe.csv: row 3: time_s = 10: must be greater than the previous row's 10",
                       InputError);
  std::vector<double> t2, T2;
  for (int i = 0; i < 20; ++i) {
    t2.push_back(i * 10.0 + (i >= 10 ? 600 : 0));
    T2.push_back(70);
  }
  const auto r = f_trapezoid_s(t2, T2, k);
  REQUIRE(!r.notes.empty());
  CHECK(r.notes[0].kind == SamplingNoteKind::gap);
  CHECK(r.notes[0].from_s == 90);
  CHECK(r.notes[0].to_s == 700);  // a 610 s interval, against a median of 10 s
  CHECK(r.notes[0].median_interval_s == 10);
}

TEST_CASE("Weibull: isothermal definition and the non-isothermal reduction") {
  // Isothermal: log10 S = -(t/δ)^p (Mafart et al. 2002, from memory).
  Kinetics k = dz(70, 7.5);
  k.weibull = Weibull{60.0, 0.5};
  CHECK(log_reduction_weibull(f_hold_s(70, 240, k), k) == doctest::Approx(2.0));
  // At 77.5 C (one z above) δ is 6 s: 24 s gives (24/6)^0.5 = 2.
  CHECK(log_reduction_weibull(f_hold_s(77.5, 24, k), k) == doctest::Approx(2.0));
}

TEST_CASE("organism library parses with sources and rejects bad data") {
  const auto& lib = library();
  for (const char* key : {"c-botulinum-proteolytic", "c-botulinum-non-proteolytic",
                          "listeria-monocytogenes", "salmonella-meat-poultry", "e-coli-o157h7",
                          "cook-value"}) {
    const Organism* o = lib.find(key);
    REQUIRE(o != nullptr);
    for (const auto& [name, v] : o->values) {
      const auto& value_name = name;  // a plain reference: clang 14 cannot capture a structured binding
      CAPTURE(value_name);
      CHECK(!v.source.empty());
    }
  }
  CHECK(lib.at("cook-value", "t").kinetics.z_C == 33);
  CHECK(lib.at("c-botulinum-proteolytic", "t").kinetics.reference_C == 121.1);
  CHECK_THROWS_WITH_AS(lib.at("listeria", "p.toml: target[1]"),
                       "p.toml: target[1]: organism = \"listeria\": not in organisms.toml",
                       InputError);
  CHECK_THROWS_WITH_AS(lib.at("e-coli-o157h8", "p.toml: target[1]"),
                       "p.toml: target[1]: organism = \"e-coli-o157h8\": not in organisms.toml; "
                       "did you mean 'e-coli-o157h7'?",
                       InputError);
  const char* bad = R"(
[[organism]]
key = "x"
name = "x"
kind = "spore"
reference_C = { value = 100, source = "s", status = "confirmed" }
z_C = { value = -5, source = "s", status = "confirmed" }
valid_min_C = { value = 90, source = "s", status = "confirmed" }
valid_max_C = { value = 110, source = "s", status = "confirmed" }
)";
  CHECK_THROWS_WITH_AS(io::parse_organisms(bad, "o.toml"), "o.toml: organism[1].z_C = -5: must be > 0",
                       InputError);
  const char* typo = R"(
[[organism]]
key = "x"
name = "x"
kind = "spore"
refrence_C = 3
)";
  CHECK_THROWS_WITH_AS(io::parse_organisms(typo, "o.toml"),
                       "o.toml: organism[1].refrence_C = 3: unknown key; did you mean 'reference_C'?",
                       InputError);
  const char* unsourced = R"(
[[organism]]
key = "x"
name = "x"
kind = "spore"
reference_C = 100
)";
  CHECK_THROWS_WITH_AS(io::parse_organisms(unsourced, "o.toml"),
                       "o.toml: organism[1].reference_C = 100: must be { value = <number>, source = \"...\", status = \"...\" }",
                       InputError);
}

// issue 18: library values are range-checked where they are read (model/limits.hpp): an organism
// whose D overflows a year, a z of 1e-300 or an equivalence row with a NaN temperature used to
// run to a verdict with exit 0.
TEST_CASE("issue 18: organism library values outside the plausible ranges are refused") {
  const std::string base = R"(
[[organism]]
key = "x"
name = "x"
kind = "spore"
reference_C = { value = 100, source = "s", status = "confirmed" }
z_C = { value = 10, source = "s", status = "confirmed" }
D_ref_min = { value = 1, source = "s", status = "confirmed" }
valid_min_C = { value = 90, source = "s", status = "confirmed" }
valid_max_C = { value = 110, source = "s", status = "confirmed" }
)";
  CHECK_NOTHROW(io::parse_organisms(base, "o.toml"));
  const auto with = [&](const std::string& from, const std::string& to) {
    std::string s = base;
    const auto at = s.find(from);
    REQUIRE(at != std::string::npos);
    return s.replace(at, from.size(), to);
  };
  CHECK_THROWS_WITH_AS(io::parse_organisms(with("D_ref_min = { value = 1,", "D_ref_min = { value = 1e300,"), "o.toml"),
                       "o.toml: organism[1].D_ref = 6e+301: must be from 0 to 31622400 s", InputError);
  CHECK_THROWS_WITH_AS(io::parse_organisms(with("z_C = { value = 10,", "z_C = { value = 1e-300,"), "o.toml"),
                       "o.toml: organism[1].z_C = 1e-300: must be from 1 to 100 C", InputError);
  CHECK_THROWS_WITH_AS(
      io::parse_organisms(base + "equivalence = { source = \"s\", status = \"confirmed\", F_ref_min = 1, rows_min = [[nan, 2]] }\n",
                      "o.toml"),
      "o.toml: organism[1].equivalence.rows_min[1]: must be [temp_C, time_min] with temp_C from -200 to 400 and "
      "time_min > 0, at most a year",
      InputError);
}
