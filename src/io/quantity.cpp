#include "coldcore/io/quantity.hpp"

#include <algorithm>
#include <array>
#include <cctype>

namespace coldcore::io {

namespace {
constexpr std::array<std::string_view, 2> kTemperature = {"C", "F"};
constexpr std::array<std::string_view, 2> kLength = {"m", "mm"};
constexpr std::array<std::string_view, 3> kTime = {"s", "min", "h"};

char lower(char c) { return static_cast<char>(std::tolower(static_cast<unsigned char>(c))); }
}  // namespace

std::span<const std::string_view> unit_suffixes(Quantity q) {
  switch (q) {
    case Quantity::temperature:
    case Quantity::temperature_difference: return kTemperature;
    case Quantity::length: return kLength;
    case Quantity::time: return kTime;
  }
  return {};
}

std::optional<double> to_si(Quantity q, double value, std::string_view unit) {
  switch (q) {
    case Quantity::temperature:
      if (unit == "C") return value;
      if (unit == "F") return (value - 32.0) / 1.8;
      break;
    case Quantity::temperature_difference:
      // A difference of 1.8 °F is 1 K: no offset (z-values, REFERENCES.md conventions).
      if (unit == "C") return value;
      if (unit == "F") return value / 1.8;
      break;
    case Quantity::length:
      if (unit == "m") return value;
      if (unit == "mm") return value / 1000.0;
      break;
    case Quantity::time:
      if (unit == "s") return value;
      if (unit == "min") return value * 60.0;
      if (unit == "h") return value * 3600.0;
      break;
  }
  return std::nullopt;
}

std::string_view quantity_name(Quantity q) {
  switch (q) {
    case Quantity::temperature: return "temperature";
    case Quantity::temperature_difference: return "temperature difference";
    case Quantity::length: return "length";
    case Quantity::time: return "time";
  }
  return "quantity";
}

std::string_view si_unit(Quantity q) {
  switch (q) {
    case Quantity::temperature:
    case Quantity::temperature_difference: return "C";
    case Quantity::length: return "m";
    case Quantity::time: return "s";
  }
  return "";
}

std::size_t edit_distance(std::string_view a, std::string_view b) {
  const std::size_t n = a.size(), m = b.size();
  // Full table: names are short, and the swap rule needs two rows back.
  std::vector<std::vector<std::size_t>> d(n + 1, std::vector<std::size_t>(m + 1));
  for (std::size_t i = 0; i <= n; ++i) d[i][0] = i;
  for (std::size_t j = 0; j <= m; ++j) d[0][j] = j;
  for (std::size_t i = 1; i <= n; ++i) {
    for (std::size_t j = 1; j <= m; ++j) {
      const std::size_t cost = lower(a[i - 1]) == lower(b[j - 1]) ? 0 : 1;
      d[i][j] = std::min({d[i - 1][j] + 1, d[i][j - 1] + 1, d[i - 1][j - 1] + cost});
      if (i > 1 && j > 1 && lower(a[i - 1]) == lower(b[j - 2]) && lower(a[i - 2]) == lower(b[j - 1]))
        d[i][j] = std::min(d[i][j], d[i - 2][j - 2] + 1);
    }
  }
  return d[n][m];
}

std::optional<std::string> did_you_mean(std::string_view word,
                                        const std::vector<std::string>& candidates) {
  // Names are short: a very long word is no typo of one (and its table would cost memory).
  if (word.size() > 100) return std::nullopt;
  const std::size_t limit = std::max<std::size_t>(2, word.size() / 3);
  std::optional<std::string> best;
  std::size_t best_d = limit + 1;
  for (const auto& c : candidates) {
    // The distance is at least the difference in length.
    const std::size_t gap = word.size() > c.size() ? word.size() - c.size() : c.size() - word.size();
    if (gap >= best_d) continue;
    const std::size_t d = edit_distance(word, c);
    if (d < best_d) {
      best_d = d;
      best = c;
    }
  }
  return best;
}

}  // namespace coldcore::io
