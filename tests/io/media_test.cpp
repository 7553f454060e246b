// media.toml: the library as committed, bad entries refused, and stages that name medium_type.
#include <doctest/doctest.h>

#include "coldcore/io/libraries.hpp"
#include "../lethality/lethality_support.hpp"
#include "coldcore/error.hpp"
#include "coldcore/io/media.hpp"
#include "coldcore/io/product_file.hpp"
#include "coldcore/io/scenario.hpp"
#include "coldcore/process/conservative.hpp"

using namespace coldcore;

TEST_CASE("media.toml: every medium parses with a source and status") {
  const auto lib = io::parse_media(test::read_source_file("products/media.toml"), "media.toml");
  CHECK(lib.media.size() == 7);
  const auto& steam = io::medium_at(lib, "condensing-steam", "t");
  // boiling and condensation 2 500–100 000 W/m2K (Çengel, as cited in media.toml)
  CHECK(steam.h_max_W_m2K == 100000);
  for (const auto& m : lib.media) {
    CHECK_FALSE(m.source.empty());
    CHECK(m.h_min_W_m2K <= m.h_max_W_m2K);
  }
  CHECK_THROWS_WITH_AS(io::medium_at(lib, "blast-chil", "p.toml: stage[2].medium_type"),
                       doctest::Contains("p.toml: stage[2].medium_type = \"blast-chil\": not in media.toml; did you mean \"blast-chill\"?"),
                       InputError);
}

TEST_CASE("media.toml: bad ranges and unknown keys are refused") {
  CHECK_THROWS_WITH_AS(io::parse_media("schema = 1\n[media.x]\ndescription = \"d\"\nh_min_W_m2K = 50\nh_max_W_m2K = 20\n"
                                       "source = \"s\"\nstatus = \"confirmed\"\n", "m.toml"),
                       "m.toml: media.x.h_max_W_m2K = 20: must be >= h_min_W_m2K (50)", InputError);
  CHECK_THROWS_AS(io::parse_media("schema = 1\n[media.x]\ndescription = \"d\"\nh_min_W_m2K = 5\nh_max_W_m2K = 20\n"
                                  "source = \"s\"\nstatus = \"confirmed\"\nh_mean = 3\n", "m.toml"),
                  InputError);
}

namespace {
const char* kBase = R"(schema = 1
[product]
name = "p"
shape = "sphere"
diameter_mm = 40
initial_C = 4
[product.properties]
conductivity_W_mK = 0.5
density_kg_m3 = 1050
specific_heat_J_kgK = 3600
[[stage]]
name = "cook"
medium_C = 90
h_W_m2K = 200
h_range_W_m2K = [150, 250]
duration_min = 20
[[stage]]
name = "chill"
medium_C = 0
medium_type = "blast-chill"
until_centre_C = 5
max_duration_h = 4
[[target]]
kind = "F-value"
name = "P70"
reference_C = 70
z_C = 7.5
F_min = 2
)";
}

TEST_CASE("product file: medium_type keeps the medium's range for per-target ends and says why - h_range kept") {
  auto pf = io::parse_product(kBase, "p.toml");
  REQUIRE(pf.stage_h.size() == 2);
  REQUIRE(pf.stage_h[0].h_range_W_m2K);
  CHECK((*pf.stage_h[0].h_range_W_m2K)[0] == 150);
  CHECK(pf.stages[0].h_W_m2K == 200);
  CHECK(pf.stage_h[1].medium_type == "blast-chill");
  CHECK(io::needs_media(pf));
  const auto lib = io::parse_media(test::read_source_file("products/media.toml"), "media.toml");
  io::apply_media(pf, lib);
  CHECK(pf.stages[1].h_W_m2K == 20);  // blast-chill 20–60 in media.toml: the stage's listed h is the low end
  CHECK(pf.stage_h[1].note.find("each target evaluated at the end conservative for it") != std::string::npos);
  // The range goes to the process layer for the medium_type stage only (the cook keeps h = 200).
  const auto s = io::scenario_of(pf);
  REQUIRE(s.per_target_h.size() == 2);
  CHECK_FALSE(s.per_target_h[0]);
  REQUIRE(s.per_target_h[1]);
  CHECK(s.per_target_h[1]->low_W_m2K == 20);
  CHECK(s.per_target_h[1]->high_W_m2K == 60);
  // P70 credits every stage, the chill included: it is evaluated at the chill's high end
  // (common practice: faster cooling, less lethality accrues in the chill).
  const auto ch = process::h_choices_for(s, 0);
  REQUIRE(ch.size() == 1);
  CHECK(ch[0].end == process::HEnd::high);
  CHECK(ch[0].h_W_m2K == 60);
}

TEST_CASE("product file: medium_type with h_W_m2K / and h outside its range / are refused") {
  std::string both = kBase;
  both.replace(both.find("medium_type = \"blast-chill\""), 27, "medium_type = \"blast-chill\"\nh_W_m2K = 30");
  CHECK_THROWS_WITH_AS(io::parse_product(both, "p.toml"),
                       "p.toml: stage[2].medium_type = \"blast-chill\": given together with h_W_m2K; give one", InputError);
  std::string out = kBase;
  out.replace(out.find("[150, 250]"), 10, "[250, 300]");
  CHECK_THROWS_WITH_AS(io::parse_product(out, "p.toml"),
                       "p.toml: stage[1].h_range_W_m2K = [250, 300]: must contain h_W_m2K = 200", InputError);
}

TEST_CASE("product file: [product.ranges] parse in SI and must contain the nominal value") {
  std::string t = kBase;
  t.replace(t.find("[product.properties]"), 20,
            "[product.ranges]\ndiameter_mm = [38, 44]\ninitial_C = [2, 6]\nconductivity_W_mK = [0.45, 0.55]\n[product.properties]");
  const auto pf = io::parse_product(t, "p.toml");
  REQUIRE(pf.ranges.diameter_m);
  CHECK((*pf.ranges.diameter_m)[1] == doctest::Approx(0.044));
  CHECK((*pf.ranges.initial_C)[0] == 2);
  CHECK((*pf.ranges.conductivity_W_mK)[0] == 0.45);
  std::string bad = kBase;
  bad.replace(bad.find("[product.properties]"), 20, "[product.ranges]\ndiameter_mm = [41, 44]\n[product.properties]");
  CHECK_THROWS_WITH_AS(io::parse_product(bad, "p.toml"),
                       "p.toml: product.ranges.diameter_mm = [41, 44]: must contain the nominal value 0.04 (SI)", InputError);
  std::string unused = kBase;
  unused.replace(unused.find("[product.properties]"), 20, "[product.ranges]\nthickness_mm = [41, 44]\n[product.properties]");
  CHECK_THROWS_AS(io::parse_product(unused, "p.toml"), InputError);
}

TEST_CASE("medium_type per target / from the file: F as with the high h given / cooling rule as with the low h") {
  // The invented tests/cli/media-split/chill-credited.toml, and the same text with the chill's
  // medium_type replaced by h_W_m2K = 60 (the high end) and = 20 (the low end) given explicitly.
  const std::string text = test::read_source_file("tests/cli/media-split/chill-credited.toml");
  const auto lib = io::parse_media(test::read_source_file("tests/cli/media-split/media.toml"), "media.toml");
  const auto with_h = [&](const char* h) {
    std::string t = text;
    const std::string key = "medium_type = \"blast-chill\"";
    t.replace(t.find(key), key.size(), std::string("h_W_m2K = ") + h);
    return io::scenario_of(io::parse_product(t, "explicit.toml"));
  };
  auto pf = io::parse_product(text, "chill-credited.toml");
  io::apply_media(pf, lib);
  const OrganismLibrary organisms = io::parse_organisms(test::read_source_file("products/organisms.toml"), "o.toml");
  const RuleLibrary rules = io::parse_cooling_rules(test::read_source_file("products/cooling-rules.toml"), "r.toml");
  const process::Libraries libs{&organisms, &rules, nullptr};
  const auto e = process::evaluate(io::scenario_of(pf), libs);
  const auto hi = process::evaluate(with_h("60"), libs);
  const auto lo = process::evaluate(with_h("20"), libs);
  // common practice: higher h cools faster, so less lethality accrues in a credited cooling stage
  CHECK(e.assessment.targets[0].F_s == doctest::Approx(hi.assessment.targets[0].F_s).epsilon(1e-12));
  CHECK(e.assessment.targets[0].F_s < lo.assessment.targets[0].F_s * (1 - 1e-4));
  // common practice: lower h cools slower, the conservative side of a cooling rule
  CHECK(e.assessment.targets[1].achieved == doctest::Approx(lo.assessment.targets[1].achieved).epsilon(1e-12));
  CHECK(e.assessment.targets[1].achieved > hi.assessment.targets[1].achieved);
}
