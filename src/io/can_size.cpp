#include "coldcore/io/can_size.hpp"

#include <cctype>

namespace coldcore::io {

namespace {

constexpr double kInch_m = 0.0254;

// One dimension: 3 or 4 digits, inches then two digits of sixteenths.
std::optional<double> dimension_m(std::string_view digits, std::string* why) {
  if (digits.size() < 3 || digits.size() > 4) {
    if (why) *why = "each dimension must be 3 or 4 digits (inches, then sixteenths of an inch as two digits)";
    return std::nullopt;
  }
  for (char c : digits)
    if (!std::isdigit(static_cast<unsigned char>(c))) {
      if (why) *why = "each dimension must be digits only";
      return std::nullopt;
    }
  const int inches = std::stoi(std::string(digits.substr(0, digits.size() - 2)));
  const int sixteenths = std::stoi(std::string(digits.substr(digits.size() - 2)));
  if (sixteenths >= 16) {
    if (why) *why = "the last two digits are sixteenths of an inch and must be 00 to 15";
    return std::nullopt;
  }
  if (inches == 0 && sixteenths == 0) {
    if (why) *why = "a dimension must be > 0";
    return std::nullopt;
  }
  return (inches + sixteenths / 16.0) * kInch_m;
}

std::string_view trim(std::string_view s) {
  while (!s.empty() && s.front() == ' ') s.remove_prefix(1);
  while (!s.empty() && s.back() == ' ') s.remove_suffix(1);
  return s;
}

}  // namespace

std::optional<CanSize> parse_can_size(std::string_view text, std::string* why) {
  std::size_t sep = std::string_view::npos, sep_len = 1;
  for (std::size_t i = 0; i < text.size() && sep == std::string_view::npos; ++i) {
    if (text[i] == 'x' || text[i] == 'X') sep = i;
    else if (text.compare(i, 2, "\xC3\x97") == 0) {  // U+00D7 multiplication sign
      sep = i;
      sep_len = 2;
    }
  }
  if (sep == std::string_view::npos) {
    if (why) *why = "must be diameter x height in the can notation, e.g. \"211 x 400\"";
    return std::nullopt;
  }
  const auto d = dimension_m(trim(text.substr(0, sep)), why);
  if (!d) return std::nullopt;
  const auto h = dimension_m(trim(text.substr(sep + sep_len)), why);
  if (!h) return std::nullopt;
  return CanSize{*d, *h};
}

}  // namespace coldcore::io
