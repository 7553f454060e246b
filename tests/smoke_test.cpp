// The pieces every suite relies on.
#include <doctest/doctest.h>

#include "coldcore/model/product.hpp"
#include "coldcore/model/stages.hpp"
#include "coldcore/report/cautions.hpp"

TEST_CASE("medium profile is piecewise linear and held after its last point") {
  coldcore::MediumProfile m;
  m.points = {{0, 20}, {100, 120}, {200, 120}};
  CHECK(m.at(-5) == 20);
  CHECK(m.at(50) == doctest::Approx(70));
  CHECK(m.at(150) == 120);
  CHECK(m.at(1e6) == 120);
}

TEST_CASE("cautions defer to the process authority and the regulator") {
  std::string all;
  for (const auto& c : coldcore::cautions()) all += c + " ";
  CHECK(all.find("engineering estimates") != std::string::npos);
  CHECK(all.find("heat-penetration") != std::string::npos);
  CHECK(all.find("temperature-distribution") != std::string::npos);
  CHECK(all.find("process authority") != std::string::npos);
  CHECK(all.find("regulator") != std::string::npos);
  CHECK(all.find("local food codes") != std::string::npos);
}
