// Words shared by the writers for reports about measured data and delivered lethality.
#include <chrono>
#include <cmath>
#include <cstdio>

#include "coldcore/report/run_report.hpp"

namespace coldcore {

std::string utc_text(double unix_s) {
  const double whole = std::floor(unix_s + 1e-6);  // binary noise of a computed instant is not a second earlier
  const auto days = static_cast<long long>(std::floor(whole / 86400.0));
  const auto secs = static_cast<long long>(whole - static_cast<double>(days) * 86400.0);
  const std::chrono::year_month_day ymd{std::chrono::sys_days{std::chrono::days{days}}};
  char buf[48];
  std::snprintf(buf, sizeof buf, "%04d-%02u-%02u %02lld:%02lld:%02lld UTC", static_cast<int>(ymd.year()),
                static_cast<unsigned>(ymd.month()), static_cast<unsigned>(ymd.day()), secs / 3600, secs / 60 % 60,
                secs % 60);
  return buf;
}

std::string delivered_text(const DeliveredRow& d) {
  return "F " + d.F_text + (d.log_text.empty() ? "" : ", " + d.log_text);
}

std::string_view delivered_heading() { return "Delivered lethality (no target given: no verdict)"; }

}  // namespace coldcore
