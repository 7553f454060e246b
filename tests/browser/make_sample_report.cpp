// Writes the synthetic sample report (tests/support/sample_report.hpp) as HTML, for the
// real-browser check (scripts/browser_check.sh). Usage: make_sample_report OUT.html [C|F]
#include <fstream>
#include <iostream>

#include "coldcore/report/html.hpp"
#include "support/sample_report.hpp"

int main(int argc, char** argv) {
  if (argc < 2 || argc > 3) {
    std::cerr << "usage: make_sample_report OUT.html [C|F]\n";
    return 2;
  }
  const coldcore::TempUnit u = argc == 3 ? coldcore::parse_temp_unit(argv[2]) : coldcore::TempUnit::C;
  std::ofstream out(argv[1], std::ios::binary);
  if (!out) {
    std::cerr << argv[1] << ": cannot open for writing\n";
    return 1;
  }
  coldcore::write_run_html(coldcore::testing::sample_report(), out, u);
  out.close();
  if (!out) {
    std::cerr << argv[1] << ": write failed\n";
    return 1;
  }
  return 0;
}
