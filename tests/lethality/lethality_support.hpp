#pragma once
// Test helpers for the lethality suites: read committed data files, build analytic histories.
#include <algorithm>
#include <fstream>
#include <stdexcept>
#include <functional>
#include <sstream>
#include <string>
#include <vector>

#include "coldcore/conduction/history.hpp"

namespace coldcore::test {

inline std::string read_source_file(const std::string& relative) {
  std::ifstream in(std::string(COLDCORE_SOURCE_DIR) + "/" + relative);
  if (!in) throw std::runtime_error("cannot open " + relative);
  std::ostringstream os;
  os << in.rdbuf();
  return os.str();
}

struct StageSpec {
  std::string name;
  double duration_s;
};

/// A History whose centre (and mean, surface) follow temp(t) exactly, with samples every
/// sample_s and stage records from `stages` laid end to end.
inline History analytic_history(std::function<double(double)> temp, std::vector<StageSpec> stages,
                                double sample_s = 10.0,
                                std::function<double(double)> medium = nullptr) {
  History h;
  double t0 = 0;
  for (const auto& s : stages) {
    StageRecord r;
    r.name = s.name;
    r.start_s = t0;
    r.end_s = t0 + s.duration_s;
    t0 = r.end_s;
    h.stages.push_back(r);
  }
  std::vector<StageRecord> recs = h.stages;
  h.evaluate = [temp, medium, stages = recs](double t) {
    HistorySample s;
    s.time_s = t;
    s.centre_C = s.mean_C = s.surface_C = s.medium_C = temp(t);
    if (medium) s.medium_C = medium(t);
    int idx = 0;
    for (std::size_t i = 0; i < stages.size(); ++i)
      if (t >= stages[i].start_s) idx = static_cast<int>(i);
    s.stage = idx;
    return s;
  };
  for (std::size_t i = 0; i < h.stages.size(); ++i) {
    const auto& st = h.stages[i];
    for (double t = st.start_s;; t += sample_s) {
      const double tt = std::min(t, st.end_s);
      HistorySample s = h.evaluate(tt);
      s.stage = static_cast<int>(i);
      h.samples.push_back(s);
      if (tt >= st.end_s) break;
    }
    h.stages[i].at_end = h.samples.back();
  }
  return h;
}

}  // namespace coldcore::test
