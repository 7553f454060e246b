#include "coldcore/report/format.hpp"

#include <charconv>
#include <cmath>
#include <cstdio>

#include "coldcore/error.hpp"

namespace coldcore {

std::string_view to_string(Format f) {
  switch (f) {
    case Format::text: return "text";
    case Format::md: return "md";
    case Format::html: return "html";
    case Format::json: return "json";
    case Format::csv: return "csv";
  }
  return "?";
}

Format parse_format(std::string_view s, const std::vector<Format>& allowed) {
  std::string list;
  for (Format f : allowed) {
    if (s == to_string(f)) return f;
    if (!list.empty()) list += "|";
    list += to_string(f);
  }
  throw InputError("--format = " + std::string(s) + ": must be one of " + list);
}

TempUnit parse_temp_unit(std::string_view s) {
  if (s == "C") return TempUnit::C;
  if (s == "F") return TempUnit::F;
  throw InputError("--units = " + std::string(s) + ": must be C or F");
}

double display_temp(double temp_C, TempUnit u) { return u == TempUnit::C ? temp_C : temp_C * 1.8 + 32.0; }

double display_temp_difference(double delta_K, TempUnit u) { return u == TempUnit::C ? delta_K : delta_K * 1.8; }

std::string_view unit_symbol(TempUnit u) { return u == TempUnit::C ? "°C" : "°F"; }
std::string_view unit_suffix(TempUnit u) { return u == TempUnit::C ? "C" : "F"; }

std::string csv_cell(const std::string& s) {
  if (s.find_first_of(",\"\n") == std::string::npos) return s;
  std::string o = "\"";
  for (char ch : s) {
    if (ch == '"') o += '"';
    o += ch;
  }
  return o + "\"";
}

std::string csv_number(double x) {
  if (!std::isfinite(x)) return "";
  char buf[64];
  const auto res = std::to_chars(buf, buf + sizeof buf, x);
  return std::string(buf, res.ptr);
}

std::string fixed(double x, int digits) {
  if (std::isnan(x)) return "-";
  if (std::isinf(x)) return x > 0 ? "inf" : "-inf";
  char buf[64];
  std::snprintf(buf, sizeof buf, "%.*f", digits, x);
  std::string s = buf;
  if (s == "-0" || s.rfind("-0.", 0) == 0) {
    // "-0.00" reads as a sign that is not there.
    bool all_zero = s.find_first_not_of("-0.") == std::string::npos;
    if (all_zero) s.erase(0, 1);
  }
  return s;
}

std::string duration_text(double seconds) {
  if (std::isnan(seconds)) return "-";
  long total = static_cast<long>(std::ceil(seconds - 1e-9));
  if (total < 0) total = 0;
  const long h = total / 3600, m = (total % 3600) / 60, s = total % 60;
  char buf[64];
  if (h > 0)
    std::snprintf(buf, sizeof buf, "%ld h %02ld min %02ld s", h, m, s);
  else if (m > 0)
    std::snprintf(buf, sizeof buf, "%ld min %02ld s", m, s);
  else
    std::snprintf(buf, sizeof buf, "%ld s", s);
  return buf;
}

}  // namespace coldcore
