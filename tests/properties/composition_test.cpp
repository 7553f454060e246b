// Choi–Okos component polynomials and ASHRAE mixing, checked against REFERENCES.md §5.3 and §7.
#include <doctest/doctest.h>

#include "coldcore/error.hpp"
#include "coldcore/properties/composition.hpp"

using coldcore::Composition;
using coldcore::FoodComponent;
using coldcore::InputError;
using doctest::Approx;

namespace {
Composition lean_beef() {  // 74/22/3/1 water/protein/fat/ash, REFERENCES §5.2 and §7 item 20
  Composition c;
  c.water = 0.74;
  c.protein = 0.22;
  c.fat = 0.03;
  c.ash = 0.01;
  return c;
}
}  // namespace

TEST_CASE("Choi-Okos: every component at 0 C equals its constant term (guard against copying errors)") {
  // REFERENCES §5.3 table constants; §7 guard against known copying errors in public implementations.
  struct Row {
    FoodComponent c;
    double k, rho, cp_kJ;
  } rows[] = {{FoodComponent::water, 0.57109, 997.18, 4.1762},
              {FoodComponent::ice, 2.2196, 916.89, 2.0623},
              {FoodComponent::protein, 0.17881, 1329.9, 2.0082},
              {FoodComponent::fat, 0.18071, 925.59, 1.9842},
              {FoodComponent::carbohydrate, 0.20141, 1599.1, 1.5488},
              {FoodComponent::fiber, 0.18331, 1311.5, 1.8459},
              {FoodComponent::ash, 0.32962, 2423.8, 1.0926}};
  for (const Row& r : rows) {
    CAPTURE(coldcore::to_string(r.c));
    const auto p = coldcore::choi_okos_component(r.c, 0.0);
    CHECK(p.conductivity_W_mK == Approx(r.k).epsilon(1e-12));
    CHECK(p.density_kg_m3 == Approx(r.rho).epsilon(1e-12));
    CHECK(p.specific_heat_J_kgK == Approx(1000 * r.cp_kJ).epsilon(1e-12));
  }
  // Water cp at 0 °C is the liquid branch 4.1762, not 4.1289 and not the −40..0 branch 4.0817.
  CHECK(coldcore::choi_okos_component(FoodComponent::water, 0.0).specific_heat_J_kgK ==
        Approx(4176.2).epsilon(1e-12));
}

TEST_CASE("Choi-Okos: reference evaluations at 20 and 60 C") {
  // REFERENCES §5.3 "Reference evaluations" [D] and §7 item 20 (rel 1e-5).
  const auto w20 = coldcore::choi_okos_component(FoodComponent::water, 20.0);
  CHECK(w20.conductivity_W_mK == Approx(0.60366).epsilon(1e-5));
  CHECK(w20.density_kg_m3 == Approx(995.74).epsilon(1e-5));
  CHECK(w20.specific_heat_J_kgK == Approx(4176.57).epsilon(1e-5));
  const auto w60 = coldcore::choi_okos_component(FoodComponent::water, 60.0);
  CHECK(w60.conductivity_W_mK == Approx(0.65271).epsilon(1e-5));
  CHECK(w60.density_kg_m3 == Approx(983.84).epsilon(1e-5));
  CHECK(w60.specific_heat_J_kgK == Approx(4190.45).epsilon(1e-5));
  const auto p20 = coldcore::choi_okos_component(FoodComponent::protein, 20.0);
  CHECK(p20.conductivity_W_mK == Approx(0.20164).epsilon(1e-4));
  CHECK(p20.density_kg_m3 == Approx(1319.53).epsilon(1e-5));
  CHECK(p20.specific_heat_J_kgK == Approx(2031.85).epsilon(1e-5));
  const auto f20 = coldcore::choi_okos_component(FoodComponent::fat, 20.0);
  CHECK(f20.conductivity_W_mK == Approx(0.17512).epsilon(1e-4));
  CHECK(f20.density_kg_m3 == Approx(917.24).epsilon(1e-5));
  CHECK(f20.specific_heat_J_kgK == Approx(2011.75).epsilon(1e-5));
}

TEST_CASE("Choi-Okos: traps are absent away from 0 C too") {
  // Fat cp linear term is 1.4733e-3 (trap: 1.4733e-4): at 100 °C cp = 1.9842 + 0.14733 − 0.048008.
  CHECK(coldcore::choi_okos_component(FoodComponent::fat, 100.0).specific_heat_J_kgK ==
        Approx(1000 * (1.9842 + 0.14733 - 0.048008)).epsilon(1e-12));
  // Fat k linear term is −2.7604e-4 (trap: −2.7604e-3).
  CHECK(coldcore::choi_okos_component(FoodComponent::fat, 100.0).conductivity_W_mK ==
        Approx(0.18071 - 0.027604 - 0.0017749).epsilon(1e-12));
  // Fibre cp quadratic 4.6509e-6 (trap: 4.4609e-6).
  CHECK(coldcore::choi_okos_component(FoodComponent::fiber, 100.0).specific_heat_J_kgK ==
        Approx(1000 * (1.8459 + 0.18306 - 0.046509)).epsilon(1e-12));
  // Ice k linear −6.2489e-3 (trap: −6.2489e-2): at −20 °C k = 2.2196 + 0.124978 + 0.040616.
  CHECK(coldcore::choi_okos_component(FoodComponent::ice, -20.0).conductivity_W_mK ==
        Approx(2.2196 + 0.124978 + 0.040616).epsilon(1e-12));
  // Water cp falls slightly then rises (−9.0864e-5·T + 5.4731e-6·T²), min near 8.3 °C.
  const double cp0 = coldcore::choi_okos_component(FoodComponent::water, 0.0).specific_heat_J_kgK;
  const double cp8 = coldcore::choi_okos_component(FoodComponent::water, 8.0).specific_heat_J_kgK;
  CHECK(cp8 < cp0);
  // Carbohydrate cp is not the carbohydrate k polynomial: about 1.58 kJ/kg·K at 20 °C.
  CHECK(coldcore::choi_okos_component(FoodComponent::carbohydrate, 20.0).specific_heat_J_kgK ==
        Approx(1000 * (1.5488 + 0.03925 - 0.00237596)).epsilon(1e-12));
  // Water below 0 °C uses the −40..0 branch: 4.0817 + 0.106124 + 0.398064 at −20 °C.
  CHECK(coldcore::choi_okos_component(FoodComponent::water, -20.0).specific_heat_J_kgK ==
        Approx(1000 * (4.0817 + 0.106124 + 0.398064)).epsilon(1e-12));
}

TEST_CASE("Choi-Okos: temperatures outside -40..150 C are refused with value and range") {
  CHECK_THROWS_WITH_AS(coldcore::choi_okos_component(FoodComponent::fat, 150.5),
                       "choi-okos: temp_C = 150.5: must be within -40 to 150 °C (Choi–Okos "
                       "validity range)",
                       InputError);
  CHECK_THROWS_WITH_AS(coldcore::choi_okos_component(FoodComponent::ice, -41, "beef.toml"),
                       "beef.toml: temp_C = -41: must be within -40 to 150 °C (Choi–Okos "
                       "validity range)",
                       InputError);
  CHECK_NOTHROW(coldcore::choi_okos_component(FoodComponent::ice, -40));
  CHECK_NOTHROW(coldcore::choi_okos_component(FoodComponent::water, 150));
}

TEST_CASE("composition: lean beef 74/22/3/1 at 20 C") {
  // REFERENCES §7 item 20 [D]: ρ 1056.3, cp 3.609, k 0.517 (parallel), α 1.356e-7 (rel 1e-3).
  const auto p = coldcore::composition_properties(lean_beef(), 20.0);
  CHECK(p.density_kg_m3 == Approx(1056.3).epsilon(1e-3));
  CHECK(p.specific_heat_J_kgK == Approx(3609).epsilon(1e-3));
  CHECK(p.conductivity_W_mK == Approx(0.517).epsilon(1e-3));
  CHECK(p.diffusivity_m2_s() == Approx(1.356e-7).epsilon(1e-3));
  // Handbook cp of lean beef 3.43–3.6 kJ/kg·K (Geankoplis A.4-1; James & James Table 13.2):
  // within 5 % of that range.
  CHECK(p.specific_heat_J_kgK >= 0.95 * 3430);
  CHECK(p.specific_heat_J_kgK <= 1.05 * 3600);
}

TEST_CASE("composition: potato 79/2/0.1/17.5/1.4 at 20 C") {
  // REFERENCES §5.2 [D]: k 0.550, ρ 1081, cp 3.64 (rounded as printed there).
  Composition c;
  c.water = 0.79;
  c.protein = 0.02;
  c.fat = 0.001;
  c.carbohydrate = 0.175;
  c.ash = 0.014;
  const auto p = coldcore::composition_properties(c, 20.0);
  CHECK(p.conductivity_W_mK == Approx(0.550).epsilon(2e-3));
  CHECK(p.density_kg_m3 == Approx(1081).epsilon(1e-3));
  CHECK(p.specific_heat_J_kgK == Approx(3640).epsilon(2e-3));
}

TEST_CASE("composition: pure water equals the water component") {
  Composition c;
  c.water = 1.0;
  for (double t : {0.0, 20.0, 60.0, 150.0}) {
    const auto m = coldcore::composition_properties(c, t);
    const auto w = coldcore::choi_okos_component(FoodComponent::water, t);
    CHECK(m.conductivity_W_mK == Approx(w.conductivity_W_mK).epsilon(1e-14));
    CHECK(m.density_kg_m3 == Approx(w.density_kg_m3).epsilon(1e-14));
    CHECK(m.specific_heat_J_kgK == Approx(w.specific_heat_J_kgK).epsilon(1e-14));
  }
}

TEST_CASE("composition: bad input names the value and the requirement") {
  Composition c = lean_beef();
  c.water = 0.70;  // sum 0.96
  CHECK_THROWS_WITH_AS(coldcore::composition_properties(c, 20.0, "beef.toml"),
                       "beef.toml: composition sum = 0.96: must be 1 within 0.005", InputError);
  c.water = 0.7449;  // sum 1.0049: accepted
  CHECK_NOTHROW(coldcore::composition_properties(c, 20.0));
  c.water = 0.7451;  // sum 1.0051: refused
  CHECK_THROWS_AS(coldcore::composition_properties(c, 20.0), InputError);
  c = lean_beef();
  c.fat = -0.03;
  c.water = 0.80;
  CHECK_THROWS_WITH_AS(coldcore::composition_properties(c, 20.0),
                       "composition: composition.fat = -0.03: must be within 0 and 1", InputError);
  CHECK_THROWS_WITH_AS(coldcore::composition_properties(lean_beef(), -5.0),
                       "composition: temp_C = -5: must be within 0 to 150 °C (below 0 °C the food "
                       "may be partly frozen; no ice-fraction model is implemented)",
                       InputError);
  CHECK_THROWS_WITH_AS(coldcore::composition_properties(lean_beef(), 151.0),
                       "composition: temp_C = 151: must be within 0 to 150 °C (unfrozen food, "
                       "Choi–Okos validity range)",
                       InputError);
}

TEST_CASE("composition table: rows / last row exact / alpha consistent") {
  const auto rows = coldcore::composition_table(lean_beef(), 0.0, 95.0, 10.0);
  REQUIRE(rows.size() == 11);
  CHECK(rows.front().temp_C == 0.0);
  CHECK(rows[2].temp_C == 20.0);
  CHECK(rows.back().temp_C == 95.0);
  CHECK(rows[2].conductivity_W_mK == Approx(0.517).epsilon(1e-3));  // §7 item 20
  for (const auto& r : rows)
    CHECK(r.diffusivity_m2_s ==
          Approx(r.conductivity_W_mK / (r.density_kg_m3 * r.specific_heat_J_kgK)).epsilon(1e-14));
  CHECK(coldcore::composition_table(lean_beef(), 20.0, 20.0, 1.0).size() == 1);
  CHECK_THROWS_WITH_AS(coldcore::composition_table(lean_beef(), 0.0, 10.0, 0.0),
                       "composition: step_C = 0: must be > 0", InputError);
  CHECK_THROWS_WITH_AS(coldcore::composition_table(lean_beef(), 50.0, 10.0, 1.0),
                       "composition: to_C = 10: must be >= from_C (50)", InputError);
  CHECK_THROWS_AS(coldcore::composition_table(lean_beef(), 0.0, 150.0, 1e-3), InputError);
}
