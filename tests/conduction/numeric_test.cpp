// Finite-volume conduction solver checked against outside references:
//  - exact eigenfunction series (mpmath), tests/reference/numeric_check.csv
//    (generator tests/reference/gen_numeric_check.py);
//  - an independent fine-grid SciPy method-of-lines solution with k(T), ρcp(T) and a ramped
//    medium, tests/reference/numeric_kt_check.csv (generator gen_numeric_kt_check.py);
//  - invariants: energy conservation, second-order grid convergence, input errors.
#include <doctest/doctest.h>

#include <chrono>
#include <cmath>
#include <fstream>
#include <map>
#include <sstream>
#include <string>
#include <vector>

#include "coldcore/conduction/numeric.hpp"
#include "coldcore/error.hpp"

using namespace coldcore;

namespace {

/// Reads a committed CSV table (lines starting with '#' are comments) into rows of named fields.
std::vector<std::map<std::string, std::string>> read_table(const std::string& name) {
  const std::string path = std::string(COLDCORE_SOURCE_DIR) + "/tests/reference/" + name;
  std::ifstream in(path);
  REQUIRE_MESSAGE(in.good(), "cannot open " << path);
  std::vector<std::string> header;
  std::vector<std::map<std::string, std::string>> rows;
  std::string line;
  while (std::getline(in, line)) {
    if (line.empty() || line[0] == '#') continue;
    std::vector<std::string> fields;
    std::stringstream ss(line);
    std::string f;
    while (std::getline(ss, f, ',')) fields.push_back(f);
    if (header.empty()) {
      header = fields;
      continue;
    }
    REQUIRE(fields.size() == header.size());
    std::map<std::string, std::string> row;
    for (std::size_t i = 0; i < fields.size(); ++i) row[header[i]] = fields[i];
    rows.push_back(row);
  }
  return rows;
}

double num(const std::map<std::string, std::string>& row, const std::string& key) {
  return std::stod(row.at(key));
}

Geometry geometry_of(const std::string& s) {
  if (s == "slab") return Geometry::slab;
  if (s == "cylinder") return Geometry::cylinder;
  return Geometry::sphere;
}

MediumProfile constant_medium(double temp_C) {
  MediumProfile m;
  m.points = {{0.0, temp_C}};
  m.description = "constant";
  return m;
}

NumericProblem series_problem(Geometry g, double h_W_m2K, double duration_s) {
  NumericProblem p;
  p.geometry = g;
  p.half_size_m = 0.02;
  p.initial_C = 5.0;
  ThermalProperties props;
  props.conductivity_W_mK = 0.5;
  props.density_kg_m3 = 1050;
  props.specific_heat_J_kgK = 3600;
  p.material = constant_material(props);
  p.segments = {{duration_s, h_W_m2K, false, constant_medium(90.0)}};
  return p;
}

}  // namespace

TEST_CASE("numeric: agrees with the exact series within 0.01 K (constant properties and medium)") {
  // Source: tests/reference/numeric_check.csv, exact series by mpmath (gen_numeric_check.py).
  const auto rows = read_table("numeric_check.csv");
  REQUIRE(rows.size() == 72);
  // Group rows by (geometry, h): one solve per group, all its times at once.
  std::map<std::pair<std::string, double>, std::vector<std::map<std::string, std::string>>> groups;
  for (const auto& r : rows) groups[{r.at("geometry"), num(r, "h_W_m2K")}].push_back(r);
  double worst = 0;
  std::string worst_where;
  for (const auto& [key, group] : groups) {
    std::vector<double> times;
    for (const auto& r : group) times.push_back(num(r, "time_s"));
    const auto t_start = std::chrono::steady_clock::now();
    const NumericResult res =
        solve_numeric(series_problem(geometry_of(key.first), key.second, times.back()), times);
    const double ms =
        std::chrono::duration<double, std::milli>(std::chrono::steady_clock::now() - t_start).count();
    MESSAGE(key.first << " h=" << key.second << ": " << res.cells << " cells, " << res.steps
                      << " steps, estimate " << res.error_estimate_K << " K, " << ms << " ms");
    for (std::size_t i = 0; i < group.size(); ++i) {
      const auto& r = group[i];
      const auto& s = res.samples[i];
      CAPTURE(key.first);
      CAPTURE(key.second);
      CAPTURE(s.time_s);
      for (auto [got, want] : {std::pair{s.centre_C, num(r, "centre_C")},
                               std::pair{s.surface_C, num(r, "surface_C")},
                               std::pair{s.mean_C, num(r, "mean_C")}}) {
        CHECK(std::fabs(got - want) <= 0.01);
        if (std::fabs(got - want) > worst) {
          worst = std::fabs(got - want);
          worst_where = key.first + " h=" + std::to_string(key.second) + " t=" + std::to_string(s.time_s);
        }
      }
    }
  }
  MESSAGE("worst |numeric - series| = " << worst << " K at " << worst_where);
}
