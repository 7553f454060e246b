// The calibrated product file (io/calibration_file.hpp): what `coldcore fit --write-product`
// writes reads back as the same calibration and product, and a file edited afterwards is refused.
#include <doctest/doctest.h>

#include <string>

#include "coldcore/error.hpp"
#include "coldcore/io/calibration_file.hpp"
#include "coldcore/io/product_file.hpp"

using namespace coldcore;

namespace {

const char* kOriginal = R"(schema = 1
# a comment that carries a source
[product]
name = "test can"
shape = "sphere"
diameter_mm = 60
initial_C = 5

[product.properties]
conductivity_W_mK = 0.6
density_kg_m3 = 1000
specific_heat_J_kgK = 4000

[[stage]]
name = "heat"
medium_C = 95
h_W_m2K = 100
duration_min = 60

[[stage]]
name = "chill"
medium_C = 2
h_W_m2K = 80
duration_min = 60
)";

Calibration calibration() {
  Calibration c;
  c.alpha_m2_s = 1.2e-7;  // k = 0.48 at rho cp = 4e6
  c.alpha_ci95_m2_s = {1.1e-7, 1.3e-7};
  c.h = {{{"heat"}, CalibratedHStatus::fitted, 150, {140, 160}}, {{"chill"}, CalibratedHStatus::lower_bound, 300, {0, 0}}};
  c.covariance_log = {{1e-4, -2e-5}, {-2e-5, 4e-4}};
  c.dof = 238;
  c.rms_K = 0.1;
  c.n_points = 241;
  c.design_probe = "probe2_C";
  c.date = "2026-12-01";
  c.study = {"probe log p.csv: sha256 00"};
  return c;
}

}  // namespace

TEST_CASE("calibrated product file: written / read back / same values - the original kept as comments") {
  const std::string text = io::calibrated_product_toml(kOriginal, calibration(), 1000.0 * 4000.0);
  CHECK(text.find("# # a comment that carries a source") != std::string::npos);
  const io::ProductFile f = io::parse_product(text, "cal.toml");
  REQUIRE(f.calibration.has_value());
  CHECK(f.product.properties.conductivity_W_mK == doctest::Approx(0.48));
  REQUIRE(f.ranges.conductivity_W_mK.has_value());
  CHECK((*f.ranges.conductivity_W_mK)[0] == doctest::Approx(0.44));
  CHECK(f.stages[0].h_W_m2K == 150);
  CHECK(f.stage_h[0].h_range_W_m2K.has_value());
  CHECK(f.stages[1].h_W_m2K == 300);
  CHECK_FALSE(f.stage_h[1].h_range_W_m2K.has_value());  // a lower bound has no upper end to give
  CHECK(f.calibration->covariance_log[1][0] == -2e-5);
  CHECK(f.calibration->dof == 238);
  CHECK(f.calibration->h[1].status == CalibratedHStatus::lower_bound);
  CHECK(f.calibration->parameters() == 2);
}

TEST_CASE("calibrated product file: edited k or h / or a malformed covariance / is refused with the key") {
  std::string text = io::calibrated_product_toml(kOriginal, calibration(), 1000.0 * 4000.0);
  const auto with = [&](const std::string& from, const std::string& to) {
    std::string t = text;
    const auto at = t.find(from);
    REQUIRE(at != std::string::npos);
    return t.replace(at, from.size(), to);
  };
  CHECK_THROWS_WITH_AS(io::parse_product(with("conductivity_W_mK = 0.48", "conductivity_W_mK = 0.45"), "cal.toml"),
                       doctest::Contains("calibration.alpha_m2_s = 1.2e-07: the file's properties give alpha"), InputError);
  CHECK_THROWS_WITH_AS(io::parse_product(with("h_W_m2K = 150\nh_range", "h_W_m2K = 151\nh_range"), "cal.toml"),
                       doctest::Contains("stage[1].h_W_m2K = 151: the calibration gives 150"), InputError);
  CHECK_THROWS_WITH_AS(io::parse_product(with("covariance_log = [[1e-04, -2e-05], [-2e-05, 4e-04]]",
                                              "covariance_log = [[1e-04, -2e-05], [-3e-05, 4e-04]]"),
                                         "cal.toml"),
                       doctest::Contains("calibration.covariance_log"), InputError);
  CHECK_THROWS_WITH_AS(io::parse_product(with("dof = 238", "dof = 0"), "cal.toml"),
                       doctest::Contains("calibration.dof"), InputError);
}
