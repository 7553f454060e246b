#pragma once
// Reads a committed reference table (tests/reference/*.csv): '#' lines are comments, the first
// other line is the header. Tests only; the library never reads files.
#include <doctest/doctest.h>

#include <cmath>
#include <fstream>
#include <limits>
#include <map>
#include <sstream>
#include <string>
#include <vector>

namespace coldcore::test {

struct CsvRow {
  std::map<std::string, std::string> cells;
  int line = 0;
  const std::string& text(const std::string& key) const { return cells.at(key); }
  double num(const std::string& key) const {
    const std::string& s = cells.at(key);
    if (s == "inf") return std::numeric_limits<double>::infinity();
    return std::stod(s);
  }
};

inline std::vector<CsvRow> read_csv(const std::string& relative_path) {
  const std::string path = std::string(COLDCORE_SOURCE_DIR) + "/" + relative_path;
  std::ifstream in(path);
  REQUIRE_MESSAGE(in.good(), "cannot open " << path);
  std::vector<std::string> header;
  std::vector<CsvRow> rows;
  std::string line;
  int line_no = 0;
  while (std::getline(in, line)) {
    ++line_no;
    if (line.empty() || line[0] == '#') continue;
    std::vector<std::string> fields;
    std::stringstream ss(line);
    std::string f;
    while (std::getline(ss, f, ',')) fields.push_back(f);
    if (header.empty()) {
      header = fields;
      continue;
    }
    REQUIRE_MESSAGE(fields.size() == header.size(), path << ":" << line_no << ": wrong field count");
    CsvRow r;
    r.line = line_no;
    for (std::size_t i = 0; i < fields.size(); ++i) r.cells[header[i]] = fields[i];
    rows.push_back(std::move(r));
  }
  REQUIRE_MESSAGE(!rows.empty(), path << ": no rows");
  return rows;
}

/// Tracks the worst relative error of a table check and where it happened.
struct WorstError {
  double err = 0;
  std::string where;
  void add(double got, double want, const std::string& at, double floor = 0) {
    const double scale = std::max(std::abs(want), floor);
    const double e = scale == 0 ? std::abs(got) : std::abs(got - want) / scale;
    if (!(e <= err)) {  // also catches NaN
      err = std::isnan(e) ? std::numeric_limits<double>::infinity() : e;
      where = at;
    }
  }
};

}  // namespace coldcore::test
