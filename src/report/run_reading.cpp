// The plain-words "Reading this report" paragraphs of the rich formats: what the Biot number,
// the curves and the verdicts mean for this report (or, for measured data, what the log shows).
#include <algorithm>
#include <cmath>
#include <string>
#include <vector>

#include "coldcore/report/temperature_text.hpp"
#include "run_figures.hpp"

namespace coldcore::detail {

namespace {

double max_biot(const RunReport& r, bool& infinite) {
  double m = 0;
  infinite = false;
  for (const auto& s : r.stages) {
    if (s.h_infinite) infinite = true;
    else m = std::max(m, s.biot);
  }
  return m;
}

const char* kVerdictWords =
    "A verdict says \"met\" only when the computed margin is positive. \"Not demonstrated\" means this calculation "
    "does not show the target is reached; it does not prove the product unsafe, and \"met\" does not release "
    "product.";

// A report about measured data: no conduction model, no Biot number, no surface or centre curves.
std::vector<std::string> measured_paragraphs(const RunReport& r) {
  const MeasuredSource& m = *r.measured;
  std::vector<std::string> p;
  std::string log = "This report is about measured data: the " + std::to_string(m.readings) +
                    " temperatures logged in " + m.log;
  log += m.start_unix_s ? ", the first at " + utc_text(*m.start_unix_s) + "." : " (the log carries no clock time).";
  log += " No model of the product is used: between readings the temperature is taken as a straight line, and "
         "everything shown is computed from the readings alone.";
  p.push_back(log);
  p.push_back(
      "The readings stand for the product's slowest-heating point (the cold spot while heating, the warm spot while "
      "cooling) only if the probe was there and calibrated; that is for the user to verify. A probe off that point "
      "reads warmer than it while heating, which overstates lethality.");
  std::string f = "An F-value is the time at the reference temperature that would kill as many organisms as the "
                  "logged temperatures did; the lethality plot shows it adding up over the log.";
  if (!r.delivered.empty())
    f += " No target was given for the lethality, so the report shows what the log delivered (F and, where a D "
         "value is known, log reductions) and claims no verdict for it.";
  if (!r.verdicts.empty()) f += std::string(" ") + kVerdictWords;
  p.push_back(f);
  return p;
}

}  // namespace

std::vector<std::string> reading_paragraphs(const RunReport& r, TempUnit u) {
  if (r.measured) return measured_paragraphs(r);
  std::vector<std::string> p;
  // One Biot number throughout (the table, the notes and here), on the length the report names.
  // Regimes: Bi = inside / surface resistance (Incropera et al., ch. 5, from memory); lumped
  // capacitance fair below 0.1 on V/A (REFERENCES 3.2).
  const std::string sym = biot_symbol(r);
  std::string biot =
      "The Biot number compares the resistance to heat flow inside the product with the resistance at its "
      "surface: Bi = h·L/k.";
  if (r.biot_length == "V/A")
    biot += " In this report L is V/A, the volume over the surface area (" + fixed(r.biot_length_m * 1000.0, 2) +
            " mm), in the stage table, the notes and here.";
  else if (!r.biot_length.empty())
    biot += " In this report L is the " + r.biot_length + ".";
  biot += " Below 0.1 the inside stays close to one temperature and the piece heats or cools as a whole, so "
          "lumped capacitance is a fair shortcut (the lumped-capacitance criterion of heat-transfer textbooks). "
          "From 0.1 to 1 the surface resistance still dominates, but the centre lags the surface. Above 1 the "
          "resistance inside dominates: the surface nears the medium temperature long before the centre does.";
  if (!r.stages.empty()) {
    biot += " In this run:";
    for (size_t i = 0; i < r.stages.size(); ++i)
      biot += std::string(i ? ";" : "") + " " + r.stages[i].name + " " + sym + " = " + biot_text(r.stages[i]);
    biot += ".";
  }
  p.push_back(biot);
  p.push_back(
      "Heat enters and leaves only through the surface and must travel through the product to reach the centre. "
      "So the centre is the last point to warm while cooking and the last to cool while chilling: it is the cold "
      "spot when heating and the warm spot when cooling, which is why the targets are checked there. In the "
      "temperature plot the gap between the surface and the centre curves is that lag; the mass-average curve "
      "is the temperature of the whole piece if it were mixed, and usually lies between them.");

  bool bi_inf = false;
  const double bi_max = max_biot(r, bi_inf);
  const bool high_bi = bi_inf || bi_max > 0.1;
  const auto lumped = column_index(r.history, "lumped_centre_C");
  const auto centre = column_index(r.history, "centre_C");
  const auto tcol = column_index(r.history, "time_s");
  if (lumped && centre && tcol) {
    double gap = -1, at_s = 0, signed_gap = 0;
    for (const auto& row : r.history.rows) {
      if (std::max({*lumped, *centre, *tcol}) >= row.size()) continue;
      const double d = row[*lumped] - row[*centre];
      if (std::isfinite(d) && std::fabs(d) > gap) {
        gap = std::fabs(d);
        signed_gap = d;
        at_s = row[*tcol];
      }
    }
    std::string s =
        "The lumped-capacitance shortcut treats the product as if it had one uniform temperature. Its estimate of "
        "the centre is drawn beside the exact centre curve.";
    if (gap >= 0)
      s += " The largest difference in this run is " + fixed(display_temp_difference(gap, u), 1) + " " +
           std::string(unit_symbol(u)) + " (the shortcut reads " + (signed_gap > 0 ? "warmer" : "cooler") +
           " than the exact centre) at " + duration_text(at_s) + ".";
    s += high_bi ? " With " + sym + " above 0.1 the shortcut in general reads the centre warmer than it is while heating and "
                   "cooler than it is while cooling, so relying on it would overstate safety."
                 : " With " + sym + " at or below 0.1 in every stage the shortcut stays close to the exact centre.";
    p.push_back(s);
  } else if (!r.stages.empty()) {
    p.push_back(high_bi ? "With " + sym + " above 0.1 a lumped-capacitance shortcut (one uniform temperature) would "
                          "misjudge the centre; the model did not provide that curve for this run, so it is not drawn."
                        : "With " + sym + " at or below 0.1 in every stage a lumped-capacitance shortcut (one uniform "
                          "temperature) would give nearly the same centre temperature.");
  }
  p.push_back(
      "An F-value is the time at the reference temperature that would kill as many organisms as the whole process "
      "did; the lethality plot shows it adding up over time against the required value. A verdict says \"met\" only "
      "when the computed margin is positive. \"Not demonstrated\" means this calculation does not show the target "
      "is reached; it does not prove the product unsafe, and \"met\" does not release product.");
  return p;
}

}  // namespace coldcore::detail
