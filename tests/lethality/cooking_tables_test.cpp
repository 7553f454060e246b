// Cooking time-temperature tables (REFERENCES §1.4 FSIS Appendix A, §2.1 Food Code 3-401.11).
#include <doctest/doctest.h>

#include <cmath>
#include <vector>

#include "coldcore/io/libraries.hpp"
#include "coldcore/error.hpp"
#include "coldcore/lethality/cooking_tables.hpp"
#include "lethality/lethality_support.hpp"

using namespace coldcore;

namespace {

const CookingTables& tables() {
  static const CookingTables t =
      io::parse_cooking_tables(test::read_source_file("products/cooking-tables.toml"), "cooking-tables.toml");
  return t;
}

CookingCheck hold(double temp_C, double seconds, const CookingTable& t) {
  // Come-up from well below the table and an instant drop after the hold: only the hold counts.
  std::vector<double> ts{0, 1e-4, 1e-4 + seconds, 2e-4 + seconds};
  std::vector<double> Ts{20, temp_C, temp_C, 20};
  return check_cooking_table(ts, Ts, t);
}

}  // namespace

TEST_CASE("FSIS Appendix A rows are transcribed as published (REFERENCES 1.4)") {
  // [C] rhosey.com copy of Appendix A, both columns, 130-158 F. Seconds for 146 F and above.
  const double F[] = {130, 131, 132, 133, 134, 135, 136, 137, 138, 139, 140, 141, 142, 143, 144,
                      145, 146, 147, 148, 149, 150, 151, 152, 153, 154, 155, 156, 157, 158};
  const double t65[] = {112, 89, 71, 56, 45, 36, 28, 23, 18, 15, 12, 9, 8, 6, 5, 4,
                        169, 134, 107, 85, 67, 54, 43, 34, 27, 22, 17, 14, 0};
  const double t7[] = {121, 97, 77, 62, 47, 37, 32, 24, 19, 15, 12, 10, 8, 6, 5, 4,
                       182, 144, 115, 91, 72, 58, 46, 37, 29, 23, 19, 15, 0};
  const CookingTable& a = tables().at("fsis-appendix-a-6.5-log", "t");
  const CookingTable& b = tables().at("fsis-appendix-a-7-log", "t");
  REQUIRE(a.rows.size() == 29);
  REQUIRE(b.rows.size() == 29);
  for (int i = 0; i < 29; ++i) {
    CAPTURE(F[i]);
    const double unit = i < 16 ? 60 : 1;
    CHECK(*a.rows[i].printed_F == F[i]);
    CHECK(a.rows[i].hold_s == t65[i] * unit);
    CHECK(b.rows[i].hold_s == t7[i] * unit);
    // The higher of the exact conversion and the printed 0.1 C value is used.
    CHECK(a.rows[i].temp_C == std::max((F[i] - 32) / 1.8, *a.rows[i].printed_C));
    // The published C column rounds 137 F (58.33) up to 58.4 and 139 F (59.44) up to 59.5.
    CHECK(std::abs(a.rows[i].temp_C - (F[i] - 32) / 1.8) < 0.07);
  }
  // REFERENCES §7 item 17: 140 F -> 12 min; 150 F -> 67 s; 155 F -> 22 s; 7-log 130 F -> 121 min,
  // 146 F -> 182 s; >= 158 F instant.
  CHECK(a.rows[10].hold_s == 720);
  CHECK(b.rows[16].hold_s == 182);
  CHECK(a.rows[28].hold_s == 0);
  // Food Code roast table = the 6.5-log column (REFERENCES 2.1).
  const CookingTable& roast = tables().at("food-code-whole-roasts", "t");
  for (const auto& r : roast.rows) {
    bool found = false;
    for (const auto& ar : a.rows)
      if (*ar.printed_F == *r.printed_F) {
        found = true;
        CHECK(ar.hold_s == r.hold_s);
      }
    CHECK(found);
  }
}

TEST_CASE("Appendix A rows are reproduced by the equivalent-time check within the table's rounding") {
  // A hold at each row temperature for the printed time plus half its rounding unit meets the
  // table; minus half a unit does not (the printed times are whole minutes or whole seconds).
  for (const char* key : {"fsis-appendix-a-6.5-log", "fsis-appendix-a-7-log", "food-code-whole-roasts"}) {
    const CookingTable& t = tables().at(key, "t");
    for (const auto& row : t.rows) {
      if (row.hold_s == 0) continue;
      const double half = row.printed_in_min ? 30 : 0.5;
      CAPTURE(key);
      CAPTURE(*row.printed_F);
      CHECK(hold(row.temp_C, row.hold_s + half, t).met);
      CHECK_FALSE(hold(row.temp_C, row.hold_s - half, t).met);
      CHECK(hold(row.temp_C, row.hold_s, t).fraction == doctest::Approx(1.0).epsilon(1e-5));
    }
  }
}

TEST_CASE("the equivalent-time integral adds fractions across rows") {
  // 6 min at 140 F (half of 12 min) + 33.5 s at 150 F (half of 67 s): Φ = 1 exactly (REFERENCES 1.4
  // table values, arithmetic), so one second more meets and one second less does not.
  const CookingTable& a = tables().at("fsis-appendix-a-6.5-log", "t");
  const double T140 = a.rows[10].temp_C, T150 = a.rows[20].temp_C;
  for (double extra : {+1.0, -1.0}) {
    const double e = 1e-4;  // near-instant ramps between holds
    std::vector<double> ts{0, e, 360 + e, 360 + 2 * e, 360 + 2 * e + 33.5 + extra, 360 + 3 * e + 33.5 + extra};
    std::vector<double> Ts{20, T140, T140, T150, T150, 20};
    const CookingCheck c = check_cooking_table(ts, Ts, a);
    CHECK(c.met == (extra > 0));
    CHECK(c.fraction == doctest::Approx(0.5 + (33.5 + extra) / 67).epsilon(1e-5));
    CHECK_FALSE(c.literal_row.has_value());  // no single row is met literally
  }
  // Implied z of the 6.5-log column 130 -> 157 F: 27 / log10(6720 s / 14 s) = 10.07 F = 5.59 C
  // (REFERENCES 1.4 [D]).
  const double z_F = 27.0 / std::log10(a.rows[0].hold_s / a.rows[27].hold_s);
  CHECK(z_F == doctest::Approx(10.07).epsilon(1e-3));
}

TEST_CASE("instant rows and the Food Code poultry temperature") {
  const CookingTable& p = tables().at("food-code-poultry", "t");
  // 165 F printed as 74 C: the higher, 74 C, is used (conservative).
  CHECK(p.rows[0].temp_C == 74);
  CHECK(hold(74.0, 0.5, p).met);
  CHECK_FALSE(hold(73.9, 600, p).met);
  const CookingTable& a = tables().at("fsis-appendix-a-6.5-log", "t");
  const CookingCheck c = hold(70.1, 0.1, a);
  CHECK(c.met);
  CHECK(c.instant_reached_s.has_value());
  // Comminuted: 66 C for 61 s meets the 1-min alternative literally.
  const CookingTable& m = tables().at("food-code-comminuted", "t");
  const CookingCheck cm = hold(66.0, 61, m);
  CHECK(cm.met);
  REQUIRE(cm.literal_row.has_value());
  CHECK(*cm.literal_row == 1);
}

TEST_CASE("cooking-table file errors") {
  const char* bad = R"(
[[table]]
key = "x"
name = "x"
source = "s"
status = "confirmed"
rows = [ { temp_F = 140, temp_C = 65, hold_s = 3 } ]
)";
  CHECK_THROWS_WITH_AS(io::parse_cooking_tables(bad, "c.toml"),
                       "c.toml: table[1].rows[1].temp_C = 65: must agree with temp_F = 140 (60 C) within 0.5 C",
                       InputError);
}
