// Unit-suffix conversion and did-you-mean.
#include <doctest/doctest.h>

#include "coldcore/io/quantity.hpp"
#include "coldcore/suggest.hpp"

#include <string>
#include <vector>

using coldcore::io::Quantity;
using coldcore::io::to_si;

TEST_CASE("temperature suffixes: F converts with the 32 offset / C is unchanged") {
  // REFERENCES.md conventions: C = (F - 32) / 1.8; 250 F = 121.11 C (F0 reference row).
  CHECK(*to_si(Quantity::temperature, 250, "F") == doctest::Approx(121.1111111111).epsilon(1e-12));
  CHECK(*to_si(Quantity::temperature, 32, "F") == 0.0);
  CHECK(*to_si(Quantity::temperature, 212, "F") == doctest::Approx(100.0).epsilon(1e-15));
  CHECK(*to_si(Quantity::temperature, -40, "F") == doctest::Approx(-40.0).epsilon(1e-15));
  CHECK(*to_si(Quantity::temperature, 72, "C") == 72.0);
  CHECK_FALSE(to_si(Quantity::temperature, 300, "K"));
}

TEST_CASE("temperature differences (z-values) convert without the offset") {
  // REFERENCES.md conventions and C. botulinum row: z = 10 C = 18 F.
  CHECK(*to_si(Quantity::temperature_difference, 18, "F") == doctest::Approx(10.0).epsilon(1e-15));
  CHECK(*to_si(Quantity::temperature_difference, 7.5, "C") == 7.5);
  // The trap: treating z_F as a temperature would give (18 - 32) / 1.8 = -7.8.
  CHECK(*to_si(Quantity::temperature_difference, 18, "F") != *to_si(Quantity::temperature, 18, "F"));
}

TEST_CASE("length and time suffixes") {
  CHECK(*to_si(Quantity::length, 42, "mm") == doctest::Approx(0.042).epsilon(1e-15));
  CHECK(*to_si(Quantity::length, 0.5, "m") == 0.5);
  // The international inch and foot (1959): 25.4 mm and 0.3048 m exactly (NIST SP 811, B.8).
  CHECK(*to_si(Quantity::length, 1, "in") == doctest::Approx(0.0254).epsilon(1e-15));
  CHECK(*to_si(Quantity::length, 2, "ft") == doctest::Approx(0.6096).epsilon(1e-15));
  CHECK(*to_si(Quantity::length, 4.2, "cm") == doctest::Approx(0.042).epsilon(1e-15));
  CHECK_FALSE(to_si(Quantity::length, 1, "yd"));
  CHECK(*to_si(Quantity::time, 22, "min") == 1320.0);
  CHECK(*to_si(Quantity::time, 8, "h") == 28800.0);
  CHECK(*to_si(Quantity::time, 90, "s") == 90.0);
  CHECK_FALSE(to_si(Quantity::time, 1, "d"));
  CHECK_FALSE(to_si(Quantity::time, 1, "C"));
}

TEST_CASE("edit distance counts insertions / deletions / substitutions and swaps") {
  using coldcore::io::edit_distance;
  CHECK(edit_distance("", "") == 0);
  CHECK(edit_distance("abc", "") == 3);
  CHECK(edit_distance("kitten", "sitting") == 3);  // the textbook Levenshtein example
  CHECK(edit_distance("diamter_mm", "diameter_mm") == 1);
  CHECK(edit_distance("shpere", "sphere") == 1);   // one swap
  CHECK(edit_distance("Sphere", "sphere") == 0);   // case-insensitive
}

TEST_CASE("did you mean: the nearest close candidate / or nothing") {
  using coldcore::io::did_you_mean;
  const std::vector<std::string> keys = {"diameter_mm", "diameter_m", "length_mm", "initial_C"};
  CHECK(did_you_mean("diamter_mm", keys) == "diameter_mm");
  CHECK(did_you_mean("inital_C", keys) == "initial_C");
  CHECK_FALSE(did_you_mean("colour", keys));
  CHECK_FALSE(did_you_mean("x", {}));
}

// NIST Special Publication 811 (2008 edition), Appendix B.8/B.9 conversion factors, as printed
// there to seven significant figures (4186.8 exactly): the code derives them from the exact
// definitions of the foot, pound, International Table Btu and Fahrenheit degree.
TEST_CASE("issue 16: US customary property units convert by the NIST SP 811 factors") {
  CHECK(*to_si(Quantity::conductivity, 1, "Btu_hftF") == doctest::Approx(1.730735).epsilon(5e-7));
  CHECK(*to_si(Quantity::heat_transfer_coefficient, 1, "Btu_hft2F") == doctest::Approx(5.678263).epsilon(5e-7));
  CHECK(*to_si(Quantity::specific_heat, 1, "Btu_lbF") == doctest::Approx(4186.8).epsilon(1e-15));
  CHECK(*to_si(Quantity::density, 1, "lb_ft3") == doctest::Approx(16.01846).epsilon(5e-7));
  // SI spellings are taken as they are.
  CHECK(*to_si(Quantity::conductivity, 0.48, "W_mK") == 0.48);
  CHECK(*to_si(Quantity::density, 1060, "kg_m3") == 1060);
  CHECK(*to_si(Quantity::specific_heat, 3450, "J_kgK") == 3450);
  CHECK(*to_si(Quantity::heat_transfer_coefficient, 22, "W_m2K") == 22);
  CHECK_FALSE(to_si(Quantity::conductivity, 1, "W_mC"));
  CHECK(coldcore::io::unit_text("Btu_hft2F") == "Btu/(h ft2 F)");
  CHECK(coldcore::io::unit_text("mm") == "mm");
}

// issue 12 item 7: one suggestion rule everywhere (coldcore/suggest.hpp): the data-library
// readers used a case-sensitive Levenshtein distance without swaps before.
TEST_CASE("issue 12: one did-you-mean rule / case-insensitive with transpositions") {
  const std::vector<std::string> organisms{"listeria-monocytogenes", "salmonella-meat-poultry"};
  CHECK(coldcore::did_you_mean("lsiteria-monocytogenes", organisms) == "listeria-monocytogenes");
  CHECK(coldcore::did_you_mean("LISTERIA-MONOCYTOGENES", organisms) == "listeria-monocytogenes");
  CHECK_FALSE(coldcore::did_you_mean("clostridium", organisms));
  CHECK(coldcore::did_you_mean("rnu", {"run", "modes", "probe"}) == "run");
  CHECK(coldcore::edit_distance("ab", "ba") == 1);
}
