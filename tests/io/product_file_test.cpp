// Product files that load: values converted to SI once, as DESIGN.md schema 1 describes.
#include <doctest/doctest.h>

#include <cmath>
#include <fstream>
#include <map>

#include "coldcore/error.hpp"
#include "coldcore/io/product_file.hpp"
#include "coldcore/io/can_size.hpp"
#include "coldcore/io/sha256.hpp"

using namespace coldcore;
using coldcore::io::parse_product;

namespace {

// The example of DESIGN.md "Product file (TOML), schema 1", with all four target kinds.
const char* kMeatballs = R"(
schema = 1
[product]
name = "Pork and herb meatballs, 42 mm"
shape = "sphere"
diameter_mm = 42
initial_C = 4
[product.properties]
conductivity_W_mK = 0.48
density_kg_m3 = 1060
specific_heat_J_kgK = 3450

[[stage]]
name = "steam cook"
medium_C = 92
h_W_m2K = 180
duration_min = 22

[[stage]]
name = "blast chill"
medium_C = -1
h_W_m2K = 22
until_centre_C = 4
max_duration_h = 8

[[target]]
kind = "log-reduction"
organism = "listeria-monocytogenes"
log_reduction = 6
[[target]]
kind = "F-value"
name = "F70"
reference_C = 70
z_C = 7.5
F_min = 2
stages = ["steam cook"]
[[target]]
kind = "cooling-rule"
rule = "two-stage-6h"
[[target]]
kind = "centre-min-temperature"
min_C = 72
hold_s = 15
)";

/// An in-memory file system for medium logs.
io::LogReader memory(std::map<std::string, std::string> files) {
  return [files = std::move(files)](const std::filesystem::path& p) -> std::optional<std::string> {
    auto it = files.find(p.generic_string());
    if (it == files.end()) return std::nullopt;
    return it->second;
  };
}

}  // namespace

TEST_CASE("the DESIGN.md example loads / converted to SI") {
  const auto pf = parse_product(kMeatballs, "meatballs.toml");
  CHECK(pf.origin == "meatballs.toml");
  CHECK(pf.sha256_hex == io::sha256_hex(kMeatballs));
  CHECK(pf.product.name == "Pork and herb meatballs, 42 mm");
  CHECK(pf.product.shape == Shape::sphere);
  CHECK(pf.product.dims.diameter_m == doctest::Approx(0.042));
  CHECK(pf.product.dims.length_m == 0);
  CHECK(pf.product.initial_C == 4);
  CHECK(pf.product.properties.conductivity_W_mK == 0.48);
  CHECK(pf.product.properties.density_kg_m3 == 1060);
  CHECK(pf.product.properties.specific_heat_J_kgK == 3450);
  CHECK_FALSE(pf.composition);

  REQUIRE(pf.stages.size() == 2);
  const Stage& cook = pf.stages[0];
  CHECK(cook.name == "steam cook");
  REQUIRE(cook.medium.points.size() == 1);
  CHECK(cook.medium.points[0].time_s == 0);
  CHECK(cook.medium.points[0].temp_C == 92);
  CHECK(cook.medium.description == "constant");
  CHECK(cook.h_W_m2K == 180);
  CHECK_FALSE(cook.h_infinite);
  CHECK(cook.end.kind == StageEndKind::duration);
  CHECK(cook.end.duration_s == 22 * 60);
  const Stage& chill = pf.stages[1];
  CHECK(chill.medium.points[0].temp_C == -1);
  CHECK(chill.end.kind == StageEndKind::until_centre);
  CHECK(chill.end.target_C == 4);
  CHECK(chill.end.max_duration_s == 8 * 3600);

  REQUIRE(pf.targets.size() == 4);
  CHECK(pf.targets[0].kind == TargetKind::log_reduction);
  CHECK(pf.targets[0].organism == "listeria-monocytogenes");
  CHECK(pf.targets[0].name == "listeria-monocytogenes");
  CHECK(pf.targets[0].log_reduction == 6);
  CHECK_FALSE(pf.targets[0].own);
  CHECK(pf.targets[0].stages.empty());
  CHECK(pf.targets[1].kind == TargetKind::f_value);
  CHECK(pf.targets[1].name == "F70");
  REQUIRE(pf.targets[1].own);
  CHECK(pf.targets[1].own->reference_C == 70);
  CHECK(pf.targets[1].own->z_C == 7.5);
  CHECK_FALSE(pf.targets[1].own->D_ref_s);
  CHECK(pf.targets[1].F_required_s == 120);
  CHECK(pf.targets[1].stages == std::vector<std::string>{"steam cook"});
  CHECK(pf.targets[2].kind == TargetKind::cooling_rule);
  CHECK(pf.targets[2].rule == "two-stage-6h");
  CHECK(pf.targets[2].name == "two-stage-6h");
  CHECK(pf.targets[2].at == "centre");
  CHECK(pf.targets[3].kind == TargetKind::centre_min_temperature);
  CHECK(pf.targets[3].min_temp_C == 72);
  CHECK(pf.targets[3].hold_s == 15);
  CHECK(pf.warnings.empty());
}

TEST_CASE("Fahrenheit / metres / hours - z in F is a difference - h = inf") {
  // 250 F = 121.11 C and z = 18 F = 10 C (REFERENCES.md conventions, C. botulinum rows).
  const auto pf = parse_product(R"(
schema = 1
[product]
name = "can"
shape = "finite-cylinder"
diameter_m = 0.075
length_mm = 100
initial_F = 104
[product.properties]
conductivity_W_mK = 0.6
density_kg_m3 = 1000
specific_heat_J_kgK = 4000
[[stage]]
name = "retort"
medium_F = 250
h_W_m2K = inf
until_mean_F = 240
max_duration_min = 90
[[stage]]
name = "cool"
medium_C = 20
h_W_m2K = "inf"
duration_h = 0.5
[[target]]
kind = "log-reduction"
name = "botulinum-12D"
reference_F = 250
z_F = 18
D_min = 0.21
log_reduction = 12
stages = ["retort", "cool"]
[[target]]
kind = "cooling-rule"
rule = "some-rule"
at = "mean"
[[target]]
kind = "centre-min-temperature"
min_F = 160
hold_min = 2
)",
                                "can.toml");
  CHECK(pf.product.shape == Shape::finite_cylinder);
  CHECK(pf.product.dims.diameter_m == 0.075);
  CHECK(pf.product.dims.length_m == doctest::Approx(0.1));
  CHECK(pf.product.initial_C == doctest::Approx(40));
  CHECK(pf.stages[0].medium.points[0].temp_C == doctest::Approx(121.1111111111));
  CHECK(pf.stages[0].h_infinite);
  CHECK(std::isinf(pf.stages[0].h_W_m2K));
  CHECK(pf.stages[0].end.kind == StageEndKind::until_mean);
  CHECK(pf.stages[0].end.target_C == doctest::Approx(115.5555555556));
  CHECK(pf.stages[0].end.max_duration_s == 5400);
  CHECK(pf.stages[1].h_infinite);
  CHECK(pf.stages[1].end.duration_s == 1800);
  const Target& t = pf.targets[0];
  REQUIRE(t.own);
  CHECK(t.organism.empty());
  CHECK(t.own->reference_C == doctest::Approx(121.1111111111));
  CHECK(t.own->z_C == doctest::Approx(10.0));
  REQUIRE(t.own->D_ref_s);
  CHECK(*t.own->D_ref_s == doctest::Approx(12.6));
  CHECK(t.log_reduction == 12);
  CHECK(pf.targets[1].at == "mean");
  CHECK(pf.targets[2].min_temp_C == doctest::Approx(71.1111111111));  // (160 - 32) / 1.8
  CHECK(pf.targets[2].hold_s == 120);
  CHECK(pf.targets[2].at == "centre");
}

TEST_CASE("slab and brick dimensions") {
  const std::string head = "schema = 1\n[product]\nname = \"p\"\ninitial_C = 5\n";
  const std::string tail =
      "[product.composition]\nwater = 0.7\nprotein = 0.2\nfat = 0.08\nash = 0.02\n"
      "[[stage]]\nmedium_C = 90\nh_W_m2K = 50\nduration_s = 600\n";
  const auto slab = parse_product(head + "shape = \"slab\"\nthickness_mm = 30\n" + tail, "s.toml");
  CHECK(slab.product.shape == Shape::slab);
  CHECK(slab.product.dims.thickness_m == doctest::Approx(0.03));
  REQUIRE(slab.composition);
  CHECK(slab.composition->water == 0.7);
  CHECK(slab.composition->fat == 0.08);
  CHECK(slab.composition->carbohydrate == 0);
  CHECK(slab.product.properties.conductivity_W_mK == 0);  // derived later from the composition
  CHECK(slab.stages[0].name == "stage 1");                 // default name
  const auto brick = parse_product(head + "shape = \"brick\"\nsize_mm = [300, 200, 45.5]\n" + tail, "b.toml");
  CHECK(brick.product.shape == Shape::brick);
  CHECK(brick.product.dims.size_m[0] == doctest::Approx(0.3));
  CHECK(brick.product.dims.size_m[1] == doctest::Approx(0.2));
  CHECK(brick.product.dims.size_m[2] == doctest::Approx(0.0455));
  const auto cyl = parse_product(head + "shape = \"cylinder\"\ndiameter_mm = 24\n" + tail, "c.toml");
  CHECK(cyl.product.shape == Shape::cylinder);
  CHECK(cyl.product.dims.diameter_m == doctest::Approx(0.024));
}

TEST_CASE("piecewise-linear medium points: key suffixes name both columns") {
  const std::string head =
      "schema = 1\n[product]\nname = \"p\"\nshape = \"sphere\"\ndiameter_mm = 40\ninitial_C = 5\n"
      "[product.properties]\nconductivity_W_mK = 0.5\ndensity_kg_m3 = 1050\nspecific_heat_J_kgK = 3500\n"
      "[[stage]]\nh_W_m2K = 100\nduration_min = 30\n";
  const auto s = parse_product(head + "medium_C = [[0, 20], [600, 92], [1800, 92]]\n", "p.toml").stages[0];
  REQUIRE(s.medium.points.size() == 3);
  CHECK(s.medium.description == "points");
  CHECK(s.medium.points[1].time_s == 600);
  CHECK(s.medium.points[1].temp_C == 92);
  CHECK(s.medium.at(300) == doctest::Approx(56));
  const auto f = parse_product(head + "medium_min_F = [[0, 68], [10, 212]]\n", "p.toml").stages[0];
  CHECK(f.medium.points[1].time_s == 600);
  CHECK(f.medium.points[0].temp_C == doctest::Approx(20));
  CHECK(f.medium.points[1].temp_C == doctest::Approx(100));
}

TEST_CASE("medium log: path relative to the file / first row = stage start / duration = log length") {
  const std::string text =
      "schema = 1\n[product]\nname = \"p\"\nshape = \"slab\"\nthickness_mm = 20\ninitial_C = 5\n"
      "[product.properties]\nconductivity_W_mK = 0.5\ndensity_kg_m3 = 1050\nspecific_heat_J_kgK = 3500\n"
      "[[stage]]\nname = \"oven\"\nmedium_log = \"logs/oven.csv\"\nh_W_m2K = 40\n";
  const std::string log = "time_min,temp_F\n5,68\n6,212\n25,212\n";
  const auto pf = parse_product(text, "plant/p.toml", "plant", memory({{"plant/logs/oven.csv", log}}));
  const Stage& s = pf.stages[0];
  REQUIRE(s.medium.points.size() == 3);
  CHECK(s.medium.points[0].time_s == 0);
  CHECK(s.medium.points[0].temp_C == doctest::Approx(20));
  CHECK(s.medium.points[2].time_s == doctest::Approx(1200));
  CHECK(s.end.kind == StageEndKind::duration);
  CHECK(s.end.duration_s == doctest::Approx(1200));
  CHECK(s.medium.description == "log plant/logs/oven.csv (sha256 " + io::sha256_hex(log) + ")");
  // The 19-minute gap is reported with the log's file:line.
  REQUIRE(pf.warnings.size() == 1);
  CHECK(pf.warnings[0] ==
        "plant/logs/oven.csv:4: gap of 1140 s since the previous row (line 3) exceeds 60 s; values in between are "
        "interpolated");
  // A stated gap limit silences it; a duration longer than the log is a warning.
  const auto pf2 = parse_product(text + "medium_log_max_gap_min = 20\nduration_min = 30\n", "plant/p.toml", "plant",
                                 memory({{"plant/logs/oven.csv", log}}));
  REQUIRE(pf2.warnings.size() == 1);
  CHECK(pf2.warnings[0] ==
        "plant/p.toml: stage[1].duration_min = 30: longer than the medium log (1200 s); its last temperature is "
        "held to the end");
  CHECK(pf2.stages[0].end.duration_s == 1800);
}

TEST_CASE("load_product reads the file and its logs from disk") {
  const auto dir = std::filesystem::temp_directory_path() / "coldcore_io_load_test";
  std::filesystem::create_directories(dir);
  const std::string text =
      "schema = 1\n[product]\nname = \"p\"\nshape = \"slab\"\nthickness_mm = 20\ninitial_C = 5\n"
      "[product.properties]\nconductivity_W_mK = 0.5\ndensity_kg_m3 = 1050\nspecific_heat_J_kgK = 3500\n"
      "[[stage]]\nmedium_log = \"oven.csv\"\nh_W_m2K = 40\n";
  std::ofstream(dir / "p.toml") << text;
  std::ofstream(dir / "oven.csv") << "timestamp,medium_C\n2026-03-01T08:00:00Z,20\n2026-03-01T08:00:30Z,90\n";
  const auto pf = io::load_product(dir / "p.toml");
  CHECK(pf.origin == (dir / "p.toml").generic_string());
  CHECK(pf.sha256_hex == io::sha256_hex(text));
  CHECK(pf.stages[0].end.duration_s == 30);
  CHECK_THROWS_WITH_AS(io::load_product(dir / "nope.toml"), ((dir / "nope.toml").generic_string() +
                                                             ": cannot read file: No such file or directory").c_str(),
                       InputError);
  std::filesystem::remove_all(dir);
}

// issue 16: a product written in US customary units reads as the same product in SI. The
// invented 42 mm meatball above, converted by hand with the exact definitions (1 in = 25.4 mm;
// NIST SP 811 Appendix B factors): 42 mm = 1.6535433 in; k 0.48 W/(m K) = 0.48 / 1.7307347
// Btu/(h ft F); rho 1060 kg/m3 = 1060 / 16.018463 lb/ft3; cp 3450 J/(kg K) = 3450 / 4186.8
// Btu/(lb F); h 180 W/(m2 K) = 180 / 5.6782633 Btu/(h ft2 F); 92 C = 197.6 F.
TEST_CASE("issue 16: US customary units give the same product as SI") {
  const std::string us = R"toml(
schema = 1
[product]
name = "Meatballs in US units (invented)"
shape = "sphere"
diameter_in = 1.6535433070866142
initial_F = 39.2
[product.properties]
conductivity_Btu_hftF = 0.27733887
density_lb_ft3 = 66.173638
specific_heat_Btu_lbF = 0.82401834
[[stage]]
name = "steam cook"
medium_F = 197.6
h_Btu_hft2F = 31.699833
duration_min = 22
)toml";
  const auto pf = parse_product(us, "us.toml");
  CHECK(pf.product.dims.diameter_m == doctest::Approx(0.042).epsilon(1e-12));
  CHECK(pf.product.initial_C == doctest::Approx(4.0).epsilon(1e-12));
  CHECK(pf.product.properties.conductivity_W_mK == doctest::Approx(0.48).epsilon(1e-6));
  CHECK(pf.product.properties.density_kg_m3 == doctest::Approx(1060).epsilon(1e-6));
  CHECK(pf.product.properties.specific_heat_J_kgK == doctest::Approx(3450).epsilon(1e-6));
  CHECK(pf.stages.at(0).h_W_m2K == doctest::Approx(180).epsilon(1e-5));
  // A plausibility range is said in the unit as written.
  std::string too_high = us;
  too_high.replace(too_high.find("0.27733887"), 10, "100");
  CHECK_THROWS_WITH_AS(parse_product(too_high, "us.toml"),
                       doctest::Contains("product.properties.conductivity_Btu_hftF = 100: must be from"),
                       coldcore::InputError);
  CHECK_THROWS_WITH_AS(parse_product(too_high, "us.toml"), doctest::Contains("Btu/(h ft F)"), coldcore::InputError);
}

// issue 16: the can trade's "D x H" size, inches and sixteenths (common practice of can makers,
// from memory): 211 x 400 is 2 11/16 in by 4 in = 68.2625 mm by 101.6 mm (1 in = 25.4 mm).
TEST_CASE("issue 16: can size notation gives the overall diameter and height") {
  const auto size = coldcore::io::parse_can_size("211 x 400");
  REQUIRE(size);
  CHECK(size->diameter_m == doctest::Approx(0.0682625).epsilon(1e-12));
  CHECK(size->height_m == doctest::Approx(0.1016).epsilon(1e-12));
  const auto big2 = coldcore::io::parse_can_size("603 \u00D7 700");  // the multiplication sign
  REQUIRE(big2);
  CHECK(big2->diameter_m == doctest::Approx((6 + 3 / 16.0) * 0.0254).epsilon(1e-12));
  CHECK(coldcore::io::parse_can_size("307X409").has_value());
  std::string why;
  CHECK_FALSE(coldcore::io::parse_can_size("216 x 400", &why));
  CHECK(why == "the last two digits are sixteenths of an inch and must be 00 to 15");
  CHECK_FALSE(coldcore::io::parse_can_size("2.6875 in", &why));

  const std::string can = R"(
schema = 1
[product]
name = "Invented corned beef can"
shape = "finite-cylinder"
can_size = "307 x 409"
initial_C = 20
[product.properties]
conductivity_W_mK = 0.45
density_kg_m3 = 1050
specific_heat_J_kgK = 3400
[[stage]]
name = "retort"
medium_C = 121.1
h_W_m2K = "inf"
duration_min = 90
)";
  const auto pf = parse_product(can, "can.toml");
  CHECK(pf.product.dims.diameter_m == doctest::Approx((3 + 7 / 16.0) * 0.0254).epsilon(1e-12));
  CHECK(pf.product.dims.length_m == doctest::Approx((4 + 9 / 16.0) * 0.0254).epsilon(1e-12));
  std::string both = can;
  both.replace(both.find("can_size"), 0, "diameter_mm = 87\n");
  CHECK_THROWS_WITH_AS(parse_product(both, "can.toml"),
                       "can.toml: product.diameter_mm = 87: given together with can_size; give one", coldcore::InputError);
  std::string bad = can;
  bad.replace(bad.find("307 x 409"), 9, "307 x 420");
  CHECK_THROWS_WITH_AS(parse_product(bad, "can.toml"),
                       "can.toml: product.can_size = \"307 x 420\": the last two digits are sixteenths of an inch and must be 00 to 15",
                       coldcore::InputError);
  std::string sphere = can;
  sphere.replace(sphere.find("\"finite-cylinder\""), 17, "\"sphere\"\ndiameter_mm = 40");
  CHECK_THROWS_WITH_AS(parse_product(sphere, "can.toml"), doctest::Contains("product.can_size"), coldcore::InputError);
}
