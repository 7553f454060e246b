#include "coldcore/process/shown_values.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "coldcore/number_text.hpp"

namespace coldcore {

namespace {

std::string shown(double value, int significant, bool up) {
  if (!std::isfinite(value)) return value > 0 ? "inf" : (value < 0 ? "-inf" : "nan");
  if (value == 0) return "0";
  const int e = static_cast<int>(std::floor(std::log10(std::abs(value))));
  const int decimals = std::max(0, significant - 1 - e);
  const double scale = std::pow(10.0, significant - 1 - e);
  // Allowance for binary representation error (documented in the header).
  const double x = value * scale;
  const double nudge = 1e-12 * std::abs(x);
  const double r = up ? std::ceil(x - nudge) : std::floor(x + nudge);
  char buf[64];
  std::snprintf(buf, sizeof buf, "%.*f", decimals, r / scale);
  return buf;
}

}  // namespace

std::string shown_down(double value, int significant) { return shown(value, significant, false); }
std::string shown_up(double value, int significant) { return shown(value, significant, true); }

std::string minutes_down(double seconds) { return shown_down(seconds / 60.0) + " min"; }
std::string minutes_up(double seconds) { return shown_up(seconds / 60.0) + " min"; }

std::string shown_log_reduction(double logs, double required_logs) {
  const double n = std::max(kMeaningfulLogReduction, std::ceil(required_logs));
  if (logs > n) return "more than " + number_text(n, 10) + " log10";
  return shown_down(logs) + " log10";
}

ShownUnit shown_unit(std::string_view unit) {
  if (unit == "log10") return kShownLog;
  if (unit == "min") return kShownMin;
  return ShownUnit{1.0, ""};
}

std::string signed_small(double v, const ShownUnit& u) {
  // Built by appending: GCC 12's -Wrestrict misreads the "+" + std::string chain here.
  std::string s(v > 0 ? "+" : "-");
  s += v > 0 ? shown_down(v * u.scale, 2) : shown_up(-v * u.scale, 2);
  s += u.suffix;
  return s;
}

}  // namespace coldcore
