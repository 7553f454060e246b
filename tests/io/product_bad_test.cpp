// Bad product files are refused with one exact, specific message:
// `<file>: <key path> = <value>: <requirement>` (HELPER_RULES / STYLE.md rule 7).
#include <doctest/doctest.h>

#include <map>
#include <stdexcept>

#include "coldcore/error.hpp"
#include "coldcore/io/product_file.hpp"

using coldcore::InputError;
using coldcore::io::parse_product;

namespace {

// A valid file; each case changes one thing.
const std::string kGood = R"(schema = 1
[product]
name = "meatballs"
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
)";

/// kGood with `from` replaced by `to`; fails the test if `from` is not there.
std::string with(const std::string& from, const std::string& to, std::string base = kGood) {
  const auto pos = base.find(from);
  if (pos == std::string::npos) throw std::logic_error("test text lacks: " + from);
  return base.replace(pos, from.size(), to);
}

coldcore::io::ProductFile parse(const std::string& text) { return parse_product(text, "t.toml"); }

/// A file whose first stage reads its medium from `oven.csv` with these contents.
coldcore::io::ProductFile parse_with_log(const std::string& log, const std::string& extra = "") {
  const std::string text = with("medium_C = 92\nh_W_m2K = 180\nduration_min = 22\n",
                                "medium_log = \"oven.csv\"\nh_W_m2K = 180\n" + extra);
  const coldcore::io::LogReader reader = [log](const std::filesystem::path& p) -> std::optional<std::string> {
    if (p.generic_string() == "oven.csv") return log;
    return std::nullopt;
  };
  return parse_product(text, "t.toml", "", reader);
}

}  // namespace

TEST_CASE("the base file of the bad-file cases is itself good") {
  CHECK_NOTHROW(parse(kGood));
}

TEST_CASE("bad file: schema missing or wrong") {
  CHECK_THROWS_WITH_AS(parse(with("schema = 1\n", "")), "t.toml: schema: missing: must be 1 (write schema = 1 at the top)",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("schema = 1", "schema = 2")),
                       "t.toml: schema = 2: must be 1 (the only product-file schema this coldcore reads)", InputError);
  CHECK_THROWS_WITH_AS(parse(with("schema = 1", "schema = \"1\"")),
                       "t.toml: schema = \"1\": must be 1 (the only product-file schema this coldcore reads)",
                       InputError);
}

TEST_CASE("bad file: not TOML at all") {
  CHECK_THROWS_WITH_AS(parse(with("diameter_mm = 42", "diameter_mm = ")),
                       "t.toml:5:15: not valid TOML: Error while parsing key-value pair: expected value, saw '\\n'", InputError);
}

TEST_CASE("bad file: missing keys") {
  CHECK_THROWS_WITH_AS(parse(with("name = \"meatballs\"\n", "")),
                       "t.toml: product.name: missing: a name for reports, in double quotes", InputError);
  CHECK_THROWS_WITH_AS(parse(with("diameter_mm = 42\n", "")),
                       "t.toml: product.diameter_*: missing: shape = \"sphere\" needs a diameter "
                       "(diameter_m, diameter_mm, diameter_cm, diameter_in or diameter_ft, > 0)",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("initial_C = 4\n", "")),
                       "t.toml: product.initial_*: missing: the uniform initial temperature (initial_C or initial_F)",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("density_kg_m3 = 1060\n", "")),
                       "t.toml: product.properties.density_*: missing: density (density_kg_m3 or density_lb_ft3), > 0", InputError);
  CHECK_THROWS_WITH_AS(parse(with("h_W_m2K = 22\n", "")),
                       "t.toml: stage[2].h_W_m2K: missing: surface heat-transfer coefficient, > 0 W/(m2 K) (or h_Btu_hft2F), or inf",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("medium_C = 92\n", "")),
                       "t.toml: stage[1].medium_*: missing: give medium_C|F (a temperature, or points [[t_s, T], "
                       "...]) or medium_log = \"file.csv\"",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("duration_min = 22\n", "")),
                       "t.toml: stage[1].duration_*: missing: give duration_s|min|h, or until_centre_C|F or "
                       "until_mean_C|F with max_duration_s|min|h",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("log_reduction = 6\n", "")),
                       "t.toml: target[1].log_reduction: missing: the required decimal reductions, > 0 (e.g. 6)",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("name = \"F70\"\n", "")),
                       "t.toml: target[2].name: missing: an F-value target needs a name (it names the csv column "
                       "F_<name>_min)",
                       InputError);
}

TEST_CASE("bad file: a stage ending on a temperature without its cap") {
  CHECK_THROWS_WITH_AS(parse(with("max_duration_h = 8\n", "")),
                       "t.toml: stage[2].max_duration_*: missing: until_centre_C = 4 needs a cap (max_duration_s, "
                       "max_duration_min or max_duration_h, > 0)",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("max_duration_h = 8", "max_duration_h = 0")),
                       "t.toml: stage[2].max_duration_h = 0: must be > 0", InputError);
  CHECK_THROWS_WITH_AS(parse(with("duration_min = 22\n", "duration_min = 22\nmax_duration_min = 30\n")),
                       "t.toml: stage[1].max_duration_min = 30: only used with until_centre_* or until_mean_* (a "
                       "duration needs no cap)",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("duration_min = 22\n", "duration_min = 22\nuntil_centre_C = 72\n")),
                       "t.toml: stage[1].until_centre_C = 72: given together with duration_min; give one end "
                       "condition",
                       InputError);
}

TEST_CASE("bad file: unknown unit suffix") {
  CHECK_THROWS_WITH_AS(parse(with("diameter_mm = 42", "diameter_yd = 0.046")),
                       "t.toml: product.diameter_yd = 0.046: unknown unit suffix '_yd'; accepted: diameter_m, "
                       "diameter_mm, diameter_cm, diameter_in or diameter_ft",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("diameter_mm = 42", "diameter_MM = 42")),
                       "t.toml: product.diameter_MM = 42: unknown unit suffix '_MM'; did you mean 'diameter_mm'? "
                       "accepted: diameter_m, diameter_mm, diameter_cm, diameter_in or diameter_ft",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("initial_C = 4", "initial_K = 277")),
                       "t.toml: product.initial_K = 277: unknown unit suffix '_K'; accepted: initial_C or initial_F",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("duration_min = 22", "duration_mins = 22")),
                       "t.toml: stage[1].duration_mins = 22: unknown unit suffix '_mins'; did you mean "
                       "'duration_min'? accepted: duration_s, duration_min or duration_h",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("medium_C = 92", "medium_K = 365")),
                       "t.toml: stage[1].medium_K = 365: unknown unit suffix '_K'; accepted: medium_C or medium_F "
                       "(points may name the time unit: medium_min_C)",
                       InputError);
}

TEST_CASE("bad file: a number that is not a number") {
  CHECK_THROWS_WITH_AS(parse(with("diameter_mm = 42", "diameter_mm = \"forty\"")),
                       "t.toml: product.diameter_mm = \"forty\": must be a number (length in mm)", InputError);
  CHECK_THROWS_WITH_AS(parse(with("conductivity_W_mK = 0.48", "conductivity_W_mK = \"0.48\"")),
                       "t.toml: product.properties.conductivity_W_mK = \"0.48\": must be a number (thermal "
                       "conductivity in W/(m K))",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("z_C = 7.5", "z_C = true")),
                       "t.toml: target[2].z_C = true: must be a number (temperature difference in C)", InputError);
  CHECK_THROWS_WITH_AS(parse(with("diameter_mm = 42", "diameter_mm = nan")),
                       "t.toml: product.diameter_mm = nan: must be a finite number", InputError);
  CHECK_THROWS_WITH_AS(parse(with("shape = \"sphere\"", "shape = 1")),
                       "t.toml: product.shape = 1: must be a string, in double quotes", InputError);
}

TEST_CASE("bad file: sizes and properties out of range") {
  CHECK_THROWS_WITH_AS(parse(with("diameter_mm = 42", "diameter_mm = -4")),
                       "t.toml: product.diameter_mm = -4: must be > 0", InputError);
  CHECK_THROWS_WITH_AS(parse(with("diameter_mm = 42", "diameter_mm = 0.0")),
                       "t.toml: product.diameter_mm = 0: must be > 0", InputError);
  CHECK_THROWS_WITH_AS(parse(with("conductivity_W_mK = 0.48", "conductivity_W_mK = 0")),
                       "t.toml: product.properties.conductivity_W_mK = 0: must be > 0", InputError);
  CHECK_THROWS_WITH_AS(parse(with("conductivity_W_mK = 0.48", "conductivity_W_mK = -0.5")),
                       "t.toml: product.properties.conductivity_W_mK = -0.5: must be > 0", InputError);
  CHECK_THROWS_WITH_AS(parse(with("initial_C = 4", "initial_F = -500")),
                       "t.toml: product.initial_F = -500: below absolute zero (-273.15 C, -459.67 F)", InputError);
}

TEST_CASE("bad file: h < 0 and h = 0 refused - inf is the only non-finite h") {
  const std::string need = ": must be > 0 W/(m2 K), or inf for a surface held at the medium temperature";
  CHECK_THROWS_WITH_AS(parse(with("h_W_m2K = 180", "h_W_m2K = -5")), ("t.toml: stage[1].h_W_m2K = -5" + need).c_str(),
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("h_W_m2K = 22", "h_W_m2K = 0")), ("t.toml: stage[2].h_W_m2K = 0" + need).c_str(),
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("h_W_m2K = 180", "h_W_m2K = -inf")),
                       ("t.toml: stage[1].h_W_m2K = -inf" + need).c_str(), InputError);
  CHECK_THROWS_WITH_AS(parse(with("h_W_m2K = 180", "h_W_m2K = nan")), ("t.toml: stage[1].h_W_m2K = nan" + need).c_str(),
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("h_W_m2K = 180", "h_W_m2K = \"infinite\"")),
                       ("t.toml: stage[1].h_W_m2K = \"infinite\"" + need).c_str(), InputError);
  CHECK(parse(with("h_W_m2K = 180", "h_W_m2K = inf")).stages[0].h_infinite);
}

TEST_CASE("bad file: unknown shape") {
  CHECK_THROWS_WITH_AS(parse(with("shape = \"sphere\"", "shape = \"cone\"")),
                       "t.toml: product.shape = \"cone\": unknown shape; accepted: sphere, cylinder, finite-cylinder, "
                       "slab, brick",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("shape = \"sphere\"", "shape = \"shpere\"")),
                       "t.toml: product.shape = \"shpere\": unknown shape; did you mean \"sphere\"? accepted: sphere, "
                       "cylinder, finite-cylinder, slab, brick",
                       InputError);
}

TEST_CASE("bad file: unknown keys get did-you-mean") {
  CHECK_THROWS_WITH_AS(parse(with("diameter_mm = 42", "diamter_mm = 42")),
                       "t.toml: product.diamter_mm = 42: unknown key; did you mean 'diameter_mm'?", InputError);
  CHECK_THROWS_WITH_AS(parse(with("h_W_m2K = 180", "h_W_m2k = 180")),
                       "t.toml: stage[1].h_W_m2k = 180: unknown unit suffix '_W_m2k'; did you mean 'h_W_m2K'? "
                       "accepted: h_W_m2K or h_Btu_hft2F", InputError);
  CHECK_THROWS_WITH_AS(parse(with("[[stage]]\nname = \"steam cook\"", "[[stages]]\nname = \"steam cook\"")),
                       "t.toml: stages = [{ duration_min = 22, h_W_m2K = 180, medium_C = 92, name = \"steam cook\" }]: "
                       "unknown key; did you mean 'stage'?", InputError);
  CHECK_THROWS_WITH_AS(parse(with("log_reduction = 6", "log_reduction = 6\ncolour = \"red\"")),
                       "t.toml: target[1].colour = \"red\": unknown key; accepted keys here: kind, name, organism, "
                       "log_reduction, reference_C|F, z_C|F, D_s|min|h, stages",
                       InputError);
}

TEST_CASE("bad file: a quantity given twice / with two units") {
  CHECK_THROWS_WITH_AS(parse(with("diameter_mm = 42", "diameter_mm = 42\ndiameter_m = 0.042")),
                       "t.toml: product.diameter_mm = 42: given together with diameter_m; give one", InputError);
}

TEST_CASE("bad file: dimensions that do not fit the shape") {
  CHECK_THROWS_WITH_AS(parse(with("shape = \"sphere\"\ndiameter_mm = 42", "shape = \"brick\"\nsize_mm = [100, 50]")),
                       "t.toml: product.size_mm = [100, 50]: must be 3 numbers [a, b, c] (full edge lengths in mm), "
                       "each > 0",
                       InputError);
  CHECK_THROWS_WITH_AS(
      parse(with("shape = \"sphere\"\ndiameter_mm = 42", "shape = \"brick\"\nsize_mm = [100, \"50\", 20]")),
      "t.toml: product.size_mm = [100, \"50\", 20]: must be 3 numbers [a, b, c] (full edge lengths in mm), each > 0",
      InputError);
  CHECK_THROWS_WITH_AS(parse(with("shape = \"sphere\"\ndiameter_mm = 42", "shape = \"brick\"\nsize_mm = 100")),
                       "t.toml: product.size_mm = 100: must be 3 numbers [a, b, c] (full edge lengths in mm), each > 0",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("shape = \"sphere\"", "shape = \"finite-cylinder\"")),
                       "t.toml: product.length_*: missing: shape = \"finite-cylinder\" needs a length (length_m, "
                       "length_mm, length_cm, length_in or length_ft, > 0)",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("shape = \"sphere\"", "shape = \"cylinder\"\nlength_mm = 120")),
                       "t.toml: product.length_mm = 120: not used by shape = \"cylinder\" (an infinite cylinder has no "
                       "length; use shape = \"finite-cylinder\")",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("shape = \"sphere\"", "shape = \"slab\"")),
                       "t.toml: product.thickness_*: missing: shape = \"slab\" needs a full thickness (thickness_m, "
                       "thickness_mm, thickness_cm, thickness_in or thickness_ft, > 0)",
                       InputError);
}

TEST_CASE("bad file: medium points") {
  CHECK_THROWS_WITH_AS(parse(with("medium_C = 92", "medium_C = [[0, 20], [600, 92], [300, 80]]")),
                       "t.toml: stage[1].medium_C[3] = [300, 80]: time must be after the previous point's 600 s "
                       "(times must increase)",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("medium_C = 92", "medium_min_C = [[0, 20], [10, 92], [10, 80]]")),
                       "t.toml: stage[1].medium_min_C[3] = [10, 80]: time must be after the previous point's 10 min "
                       "(times must increase)",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("medium_C = 92", "medium_C = [[60, 20], [600, 92]]")),
                       "t.toml: stage[1].medium_C[1] = [60, 20]: the first point must be at time 0 (the stage's start)",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("medium_C = 92", "medium_C = [[0, 20], [600]]")),
                       "t.toml: stage[1].medium_C[2] = [600]: must be a pair of numbers [time_s, temp_C]", InputError);
  CHECK_THROWS_WITH_AS(parse(with("medium_C = 92", "medium_C = []")),
                       "t.toml: stage[1].medium_C = []: must have at least one point [time_s, temp_C]", InputError);
  CHECK_THROWS_WITH_AS(parse(with("medium_C = 92", "medium_min_C = 92")),
                       "t.toml: stage[1].medium_min_C = 92: a constant medium temperature has no time unit; write "
                       "medium_C = 92",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("medium_C = 92", "medium_C = 92\nmedium_log = \"oven.csv\"")),
                       "t.toml: stage[1].medium_log = \"oven.csv\": given together with medium_C; give one",
                       InputError);
}

TEST_CASE("bad file: medium logs (file:line of the log)") {
  CHECK_THROWS_WITH_AS(parse_with_log("time_s,medium_C\n0,20\n60,80\n30,92\n"),
                       "oven.csv:4: time_s = 30: must be after the previous row (60 at line 3)", InputError);
  CHECK_THROWS_WITH_AS(parse_with_log("time_s,medium_C\n0,20\n60,hot\n"),
                       "oven.csv:3: medium_C = \"hot\": not a number", InputError);
  CHECK_THROWS_WITH_AS(parse_with_log(""), "oven.csv:1: empty log: no header and no data rows; a log is a header naming the columns with units (e.g. time_s,temp_C) and a row per reading", InputError);
  CHECK_THROWS_WITH_AS(parse_with_log("time_s,medium_C\n"), "oven.csv:1: empty log: a header but no data rows; give a row per reading below it",
                       InputError);
  CHECK_THROWS_WITH_AS(parse_with_log("time_s,medium_C\n0,92\n"),
                       "t.toml: stage[1].medium_log = \"oven.csv\": the log covers 0 s (one row); give duration_s, "
                       "duration_min or duration_h",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("medium_C = 92", "medium_log = \"oven.csv\"")),
                       "t.toml: stage[1].medium_log = \"oven.csv\": cannot read logs here (no file reader given)",
                       InputError);
  const auto missing = [] {
    const std::string text = with("medium_C = 92", "medium_log = \"missing.csv\"");
    return parse_product(text, "dir/t.toml", "dir", [](const std::filesystem::path&) { return std::nullopt; });
  };
  CHECK_THROWS_WITH_AS(missing(), "dir/t.toml: stage[1].medium_log = \"missing.csv\": cannot read file \"dir/missing.csv\"",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("duration_min = 22", "duration_min = 22\nmedium_log_max_gap_s = 30")),
                       "t.toml: stage[1].medium_log_max_gap_s = 30: only used with medium_log", InputError);
}

TEST_CASE("log gap: loads with a warning naming the log line") {
  const auto pf = parse_with_log("time_s,medium_C\n0,20\n30,80\n200,92\n230,92\n");
  REQUIRE(pf.warnings.size() == 1);
  CHECK(pf.warnings[0] ==
        "oven.csv:4: gap of 170 s since the previous row (line 3) exceeds 60 s; values in between are interpolated");
  CHECK(pf.stages[0].end.duration_s == 230);
  CHECK(parse_with_log("time_s,medium_C\n0,20\n30,80\n200,92\n230,92\n", "medium_log_max_gap_min = 3\n")
            .warnings.empty());
}

TEST_CASE("bad file: targets") {
  CHECK_THROWS_WITH_AS(parse(with("stages = [\"steam cook\"]", "stages = [\"stem cook\"]")),
                       "t.toml: target[2].stages[1] = \"stem cook\": no such stage; did you mean \"steam cook\"?",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("stages = [\"steam cook\"]", "stages = [\"fry\"]")),
                       "t.toml: target[2].stages[1] = \"fry\": no such stage; the stages are \"steam cook\", "
                       "\"blast chill\"",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("stages = [\"steam cook\"]", "stages = \"steam cook\"")),
                       "t.toml: target[2].stages = \"steam cook\": must be an array of stage names, e.g. "
                       "[\"steam cook\"]",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("z_C = 7.5", "z_C = 0")), "t.toml: target[2].z_C = 0: must be > 0", InputError);
  CHECK_THROWS_WITH_AS(parse(with("z_C = 7.5", "z_F = -13.5")), "t.toml: target[2].z_F = -13.5: must be > 0",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("log_reduction = 6", "log_reduction = 0")),
                       "t.toml: target[1].log_reduction = 0: must be > 0", InputError);
  CHECK_THROWS_WITH_AS(parse(with("F_min = 2", "F_min = -2")), "t.toml: target[2].F_min = -2: must be > 0",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("kind = \"F-value\"", "kind = \"F value\"")),
                       "t.toml: target[2].kind = \"F value\": unknown kind; did you mean \"F-value\"? accepted: "
                       "log-reduction, F-value, cooling-rule, centre-min-temperature",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("organism = \"listeria-monocytogenes\"",
                                  "organism = \"listeria-monocytogenes\"\nz_C = 7.5")),
                       "t.toml: target[1].z_C = 7.5: given together with organism; give organism = \"key\" or own "
                       "kinetics (reference_*, z_*, D_*), not both",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("organism = \"listeria-monocytogenes\"", "reference_C = 70\nz_C = 7.5")),
                       "t.toml: target[1].D_*: missing: own kinetics need reference_*, z_* and D_* (D at the "
                       "reference temperature) (D_s, D_min or D_h, > 0)",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("name = \"F70\"", "name = \"listeria-monocytogenes\"")),
                       "t.toml: target[2].name = \"listeria-monocytogenes\": same as target[1]; target names must be "
                       "unique (they name report columns)",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(kGood + "[[target]]\nkind = \"cooling-rule\"\nrule = \"two-stage-6h\"\nat = \"surface\"\n"),
                       "t.toml: target[3].at = \"surface\": must be \"centre\" or \"mean\"", InputError);
  CHECK_THROWS_WITH_AS(parse(kGood + "[[target]]\nkind = \"centre-min-temperature\"\nmin_C = 72\n"),
                       "t.toml: target[3].hold_*: missing: how long to stay at or above it (hold_s, hold_min or "
                       "hold_h, >= 0)",
                       InputError);
}

TEST_CASE("bad file: stages and composition") {
  const std::string no_stages = kGood.substr(0, kGood.find("[[stage]]"));
  CHECK_THROWS_WITH_AS(parse(with("schema = 1\n", "schema = 1\nstage = [1, 2]\n", no_stages)),
                       "t.toml: stage = [1, 2]: must be one or more [[stage]] tables (double brackets)", InputError);
  CHECK_THROWS_WITH_AS(parse(with("[[stage]]\nname = \"steam cook\"\nmedium_C = 92\nh_W_m2K = 180\nduration_min = 22\n\n"
                                  "[[stage]]\nname = \"blast chill\"\nmedium_C = -1\nh_W_m2K = 22\nuntil_centre_C = 4\n"
                                  "max_duration_h = 8\n",
                                  "")),
                       "t.toml: stage: missing: at least one [[stage]] table (medium, h_W_m2K, end condition)",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("name = \"F70\"", "name = \"F70, core\"")),
                       "t.toml: target[2].name = \"F70, core\": must not contain commas, double quotes or control "
                       "characters (it names a csv column)",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("name = \"blast chill\"", "name = \"steam cook\"")),
                       "t.toml: stage[2].name = \"steam cook\": same as stage[1]; stage names must be unique",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("[[stage]]\nname = \"steam cook\"", "[stage]\nname = \"steam cook\"")),
                       "t.toml:18:1: not valid TOML: Error while parsing table header: cannot redefine existing table "
                       "'stage' as array-of-tables",
                       InputError);
  const std::string comp = with("[product.properties]\nconductivity_W_mK = 0.48\ndensity_kg_m3 = 1060\n"
                                "specific_heat_J_kgK = 3450\n",
                                "[product.composition]\nwater = 0.7\nprotein = 0.2\n");
  CHECK_THROWS_WITH_AS(parse(comp),
                       "t.toml: product.composition = { protein = 0.2, water = 0.7 }: the mass fractions must sum to 1 "
                       "(within 0.005); they sum to 0.8999999999999999",
                       InputError);
  CHECK_THROWS_WITH_AS(parse(with("[product.properties]\n", "[product.composition]\nwater = 0.7\n[product.properties]\n")),
                       "t.toml: product.composition = { water = 0.7 }: given together with [product.properties]; give "
                       "one",
                       InputError);
}

// issue 18: every value is range-checked where it is read (model/limits.hpp), with the key as
// written and the range in the key's own unit, so that no overflow or underflow reaches the
// physics (these inputs used to fail deep inside with "modes: biot = 4e-302", "modes: count =
// -2147483646", "stage[0].duration_s = inf", or UB in a float-to-integer conversion).
TEST_CASE("issue 18: values outside the plausible ranges are refused where they are read") {
  const std::map<std::string, std::pair<std::pair<std::string, std::string>, std::string>> cases = {
      {"h tiny", {{"h_W_m2K = 180", "h_W_m2K = 1e-300"},
                  "t.toml: stage[1].h_W_m2K = 1e-300: must be from 0.1 to 1e+06 W/(m2 K) (or inf)"}},
      {"diameter tiny", {{"diameter_mm = 42", "diameter_mm = 1e-300"},
                         "t.toml: product.diameter_mm = 1e-300: must be from 1 to 3000 mm"}},
      {"k huge", {{"conductivity_W_mK = 0.48", "conductivity_W_mK = 1e308"},
                  "t.toml: product.properties.conductivity_W_mK = 1e+308: must be from 0.01 to 10 W/(m K)"}},
      {"density tiny", {{"density_kg_m3 = 1060", "density_kg_m3 = 1e-300"},
                        "t.toml: product.properties.density_kg_m3 = 1e-300: must be from 50 to 3000 kg/m3"}},
      {"cp huge", {{"specific_heat_J_kgK = 3450", "specific_heat_J_kgK = 345000"},
                   "t.toml: product.properties.specific_heat_J_kgK = 345000: must be from 500 to 10000 J/(kg K)"}},
      {"initial huge", {{"initial_C = 4", "initial_C = 1e308"},
                        "t.toml: product.initial_C = 1e+308: must be from -200 to 400 C"}},
      {"initial in F", {{"initial_C = 4", "initial_F = 900"},
                        "t.toml: product.initial_F = 900: must be from -328 to 752 F"}},
      {"duration huge", {{"duration_min = 22", "duration_h = 1e305"},
                         "t.toml: stage[1].duration_h = 1e+305: must be from 0 to 8784 h"}},
      {"cap over a year", {{"max_duration_h = 8", "max_duration_h = 9000"},
                           "t.toml: stage[2].max_duration_h = 9000: must be from 0 to 8784 h"}},
      {"medium hot", {{"medium_C = 92", "medium_C = 5000"}, "t.toml: stage[1].medium_C = 5000: must be from -200 to 400 C"}},
      {"z tiny", {{"z_C = 7.5", "z_C = 1e-300"}, "t.toml: target[2].z_C = 1e-300: must be from 1 to 100 C"}},
      {"F over a year", {{"F_min = 2", "F_min = 1e12"}, "t.toml: target[2].F_min = 1e+12: must be from 0 to 527040 min"}},
      {"reference cold", {{"reference_C = 70", "reference_C = -250"},
                          "t.toml: target[2].reference_C = -250: must be from -200 to 400 C"}},
  };
  for (const auto& entry : cases) {
    const std::string& name = entry.first;  // a plain name: clang 14 cannot capture a structured binding
    const auto& c = entry.second;
    CAPTURE(name);
    CHECK_THROWS_WITH_AS(parse(with(c.first.first, c.first.second)), c.second.c_str(), InputError);
  }
  // The ends of the ranges themselves are accepted (1 mm, 3000 mm, h 0.1, a year exactly).
  CHECK_NOTHROW(parse(with("diameter_mm = 42", "diameter_mm = 1")));
  CHECK_NOTHROW(parse(with("diameter_mm = 42", "diameter_mm = 3000")));
  CHECK_NOTHROW(parse(with("h_W_m2K = 180", "h_W_m2K = 0.1")));
  CHECK_NOTHROW(parse(with("h_W_m2K = 180", "h_W_m2K = \"inf\"")));
  CHECK_NOTHROW(parse(with("max_duration_h = 8", "max_duration_h = 8784")));
}

// issue 18: counts are bounded and the bound is said; a megabyte-long unknown key is quoted back
// cut to limits::max_message_chars, without a suggestion (no name is that long).
TEST_CASE("issue 18: stage count / target count and message length are bounded") {
  std::string many;
  for (int i = 0; i < 201; ++i)
    many += "[[stage]]\nname = \"s" + std::to_string(i) + "\"\nmedium_C = 90\nh_W_m2K = 100\nduration_s = 10\n";
  const std::string text = with(kGood.substr(kGood.find("[[stage]]"), kGood.find("[[target]]") - kGood.find("[[stage]]")),
                                many);
  CHECK_THROWS_WITH_AS(parse(text), "t.toml: stage: 201 [[stage]] tables: at most 200", InputError);
  const std::string key(1000000, 'x');
  try {
    parse(with("[product]\n", "[product]\n" + key + " = 1\n"));
    FAIL("a megabyte-long key was accepted");
  } catch (const InputError& e) {
    const std::string what = e.what();
    CHECK(what.size() < 2100);
    CHECK(what.find("(message cut at 2000 characters)") != std::string::npos);
    CHECK(what.rfind("t.toml: ", 0) == 0);
  }
}
