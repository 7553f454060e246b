// Timestamps of logged csv files: ISO 8601 date-times (with or without a UTC offset) and the
// fixed UTC offsets given on the command line (logger_csv.hpp declares both).
#include <optional>
#include <string>
#include <string_view>

#include "coldcore/error.hpp"
#include "coldcore/io/logger_csv.hpp"
#include "io/detail/text.hpp"

namespace coldcore::io {

namespace {

using detail::quote;
using detail::trim;

// Days since 1970-01-01 of a proleptic Gregorian date (H. Hinnant's days_from_civil).
long long days_from_civil(long long y, unsigned m, unsigned d) {
  y -= m <= 2;
  const long long era = (y >= 0 ? y : y - 399) / 400;
  const unsigned yoe = static_cast<unsigned>(y - era * 400);
  const unsigned doy = (153 * (m + (m > 2 ? -3 : 9)) + 2) / 5 + d - 1;
  const unsigned doe = yoe * 365 + yoe / 4 - yoe / 100 + doy;
  return era * 146097 + static_cast<long long>(doe) - 719468;
}

bool leap(long long y) { return (y % 4 == 0 && y % 100 != 0) || y % 400 == 0; }

}  // namespace

std::optional<double> parse_iso8601_s(std::string_view s) { return parse_iso8601_s(s, nullptr); }

std::optional<double> parse_iso8601_s(std::string_view s, bool* has_offset) {
  s = trim(s);
  std::size_t pos = 0;
  auto digits = [&](std::size_t n) -> std::optional<int> {
    if (pos + n > s.size()) return std::nullopt;
    int v = 0;
    for (std::size_t i = 0; i < n; ++i) {
      const char c = s[pos + i];
      if (c < '0' || c > '9') return std::nullopt;
      v = v * 10 + (c - '0');
    }
    pos += n;
    return v;
  };
  auto expect = [&](char c) {
    if (pos < s.size() && s[pos] == c) {
      ++pos;
      return true;
    }
    return false;
  };
  const auto year = digits(4);
  if (!year || !expect('-')) return std::nullopt;
  const auto month = digits(2);
  if (!month || !expect('-')) return std::nullopt;
  const auto day = digits(2);
  if (!day || !(expect('T') || expect(' '))) return std::nullopt;
  const auto hour = digits(2);
  if (!hour || !expect(':')) return std::nullopt;
  const auto minute = digits(2);
  if (!minute) return std::nullopt;
  double second = 0;
  if (expect(':')) {
    const auto sec = digits(2);
    if (!sec) return std::nullopt;
    second = *sec;
    if (expect('.')) {
      double scale = 0.1;
      const std::size_t start = pos;
      while (pos < s.size() && s[pos] >= '0' && s[pos] <= '9') {
        second += scale * (s[pos] - '0');
        scale /= 10;
        ++pos;
      }
      if (pos == start) return std::nullopt;
    }
  }
  double offset_s = 0;
  if (has_offset) *has_offset = pos < s.size();
  if (expect('Z')) {
  } else if (pos < s.size() && (s[pos] == '+' || s[pos] == '-')) {
    const int sign = s[pos] == '+' ? 1 : -1;
    ++pos;
    const auto oh = digits(2);
    if (!oh) return std::nullopt;
    expect(':');
    const auto om = digits(2);
    if (!om || *oh > 23 || *om > 59) return std::nullopt;
    offset_s = sign * (*oh * 3600.0 + *om * 60.0);
  }
  if (pos != s.size()) return std::nullopt;
  static constexpr int kDays[] = {31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31};
  if (*month < 1 || *month > 12) return std::nullopt;
  const int month_days = kDays[*month - 1] + (*month == 2 && leap(*year) ? 1 : 0);
  if (*day < 1 || *day > month_days || *hour > 23 || *minute > 59 || second >= 61) return std::nullopt;
  const long long days = days_from_civil(*year, static_cast<unsigned>(*month), static_cast<unsigned>(*day));
  return static_cast<double>(days) * 86400.0 + *hour * 3600.0 + *minute * 60.0 + second - offset_s;
}

double parse_utc_offset_s(std::string_view text, std::string_view option) {
  const std::string_view t = trim(text);
  const auto bad = [&]() {
    return InputError(std::string(option) + " = " + quote(t) +
                      ": must be a fixed UTC offset +HH:MM or -HH:MM (hours 0 to 14, e.g. +01:00), +HH, Z or UTC");
  };
  if (t == "Z" || t == "UTC") return 0;
  if (t.size() < 3 || (t[0] != '+' && t[0] != '-')) throw bad();
  const auto two = [&](std::size_t at) -> int {
    if (at + 2 > t.size() || t[at] < '0' || t[at] > '9' || t[at + 1] < '0' || t[at + 1] > '9') throw bad();
    return (t[at] - '0') * 10 + (t[at + 1] - '0');
  };
  const int hours = two(1);
  int minutes = 0;
  if (t.size() > 3) {
    const std::size_t at = t[3] == ':' ? 4 : 3;
    minutes = two(at);
    if (at + 2 != t.size()) throw bad();
  }
  if (hours > 14 || minutes > 59 || (hours == 14 && minutes > 0)) throw bad();
  return (t[0] == '+' ? 1.0 : -1.0) * (hours * 3600.0 + minutes * 60.0);
}

}  // namespace coldcore::io
