// Issue 11, defect 5: the Biot explanation by regime, on one Biot number (V/A) throughout.
// Regimes: Bi is the inside (conduction) resistance over the surface (convection) resistance
// (Incropera et al., Fundamentals of Heat and Mass Transfer, ch. 5, from memory); lumped
// capacitance is fair for Bi < 0.1 with Lc = V/A (REFERENCES 3.2).
#include <doctest/doctest.h>

#include <sstream>

#include "coldcore/conduction/history.hpp"
#include "coldcore/io/product_file.hpp"
#include "coldcore/io/scenario.hpp"
#include "coldcore/report/html.hpp"
#include "coldcore/report/markdown.hpp"
#include "coldcore/report/run_builder.hpp"

using namespace coldcore;

namespace {

// Sphere 38 mm, k 0.48 W/mK: V/A = r/3 = 6.333 mm, so Bi(V/A) = h · 0.0063333 / 0.48 and
// Bi on the radius is three times that (sphere V = 4/3 π r³, A = 4 π r²).
io::ProductFile sphere(double cook_h, double chill_h) {
  const std::string toml = R"(schema = 1
[product]
name = "test sphere"
shape = "sphere"
diameter_mm = 38
initial_C = 4
[product.properties]
conductivity_W_mK = 0.48
density_kg_m3 = 1052
specific_heat_J_kgK = 3418
[[stage]]
name = "cook"
medium_C = 96
h_W_m2K = )" + std::to_string(cook_h) + R"(
duration_min = 20
[[stage]]
name = "chill"
medium_C = -2
h_W_m2K = )" + std::to_string(chill_h) + R"(
duration_min = 30
)";
  return io::parse_product(toml, "t.toml");
}

RunReport report_of(const io::ProductFile& f) {
  RunReportOptions o;
  o.date = "2026-12-01";
  o.version = "test";
  return build_run_report(io::scenario_of(f), {f.origin, f.sha256_hex, f.warnings}, simulate(f.product, f.stages), o);
}

}  // namespace

TEST_CASE("issue 11: the Biot note names the right regime below 0.1 / from 0.1 to 1 and above 1") {
  const io::ProductFile f = sphere(120, 30);
  // h 30: Bi(V/A) = 30 · 0.0063333 / 0.48 = 0.3958 — the case the issue found described as
  // "surface resistance small next to the inside's".
  CHECK(biot_volume_to_area(f.product, 30) == doctest::Approx(30 * 0.019 / 3 / 0.48).epsilon(1e-12));
  Stage s = f.stages[1];
  CHECK(biot_note(f.product, s) ==
        "Bi(V/A) = 0.396, between 0.1 and 1: the surface resistance dominates, but the inside's is no longer "
        "negligible: the centre still lags the surface, so lumped capacitance would misstate the centre and the "
        "exact series is needed.");
  s.h_W_m2K = 5;  // Bi(V/A) = 0.066
  CHECK(biot_note(f.product, s) ==
        "Bi(V/A) = 0.066 < 0.1: the inside stays nearly uniform, so lumped capacitance would be a fair shortcut "
        "here; the exact series is used all the same.");
  s.h_W_m2K = 120;  // Bi(V/A) = 1.583
  CHECK(biot_note(f.product, s) ==
        "Bi(V/A) = 1.583 > 1: the resistance inside the product dominates: the surface nears the medium "
        "temperature long before the centre does; lumped capacitance would misstate the centre and the exact "
        "series is needed.");
  // The boundaries: exactly 1 is still "between 0.1 and 1"; just above 1 is not.
  s.h_W_m2K = 0.48 / (0.019 / 3);
  CHECK(biot_note(f.product, s).find("between 0.1 and 1") != std::string::npos);
  CHECK(biot_note(f.product, s).find("surface resistance small") == std::string::npos);
}

TEST_CASE("issue 11: one Biot number / on V/A / in the table / the notes and Reading this report") {
  const RunReport r = report_of(sphere(120, 30));
  REQUIRE(r.stages.size() == 2);
  CHECK(r.biot_length == "V/A");
  CHECK(r.biot_length_m == doctest::Approx(0.019 / 3).epsilon(1e-12));
  CHECK(r.stages[1].biot == doctest::Approx(30 * 0.019 / 3 / 0.48).epsilon(1e-12));

  std::ostringstream text;
  write_run_text(r, text, TempUnit::C);
  CHECK(text.str().find("Bi(V/A)") != std::string::npos);
  CHECK(text.str().find("What the Biot number says (Bi on V/A, the volume over the surface area, 6.33 mm):") !=
        std::string::npos);
  CHECK(text.str().find("chill: Bi(V/A) = 0.396, between 0.1 and 1") != std::string::npos);
  // the radius-based Bi of the chill (3 × 0.396 = 1.188) appears nowhere
  CHECK(text.str().find("1.188") == std::string::npos);

  std::ostringstream html;
  write_run_html(r, html, TempUnit::C);
  const std::string h = html.str();
  CHECK(h.find("In this report L is V/A, the volume over the surface area (6.33 mm), in the stage table, the notes "
               "and here.") != std::string::npos);
  CHECK(h.find("From 0.1 to 1 the surface resistance still dominates, but the centre lags the surface.") !=
        std::string::npos);
  CHECK(h.find("Above 1 the resistance inside dominates") != std::string::npos);
  CHECK(h.find("In this run: cook Bi(V/A) = 1.583; chill Bi(V/A) = 0.396.") != std::string::npos);
  CHECK(h.find("<th>Bi(V/A)</th>") != std::string::npos);
  CHECK(h.find("1.188") == std::string::npos);

  const std::string md = write_run_markdown(r, TempUnit::C, "x").markdown;
  CHECK(md.find("| Bi(V/A) |") != std::string::npos);
  CHECK(md.find("chill Bi(V/A) = 0.396") != std::string::npos);
}
