#include "coldcore/report/temperature_text.hpp"

#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <ostream>
#include <sstream>

namespace coldcore {

namespace {

constexpr std::string_view kOpen = temperature_token::open;
constexpr std::string_view kSep = temperature_token::separator;
constexpr std::string_view kClose = temperature_token::close;

std::string printf_text(const char* format, int digits, double v) {
  char buf[64];
  std::snprintf(buf, sizeof buf, format, digits, v);
  return buf;
}

int decimals_of(std::string_view text) {
  const auto dot = text.find('.');
  if (dot == std::string_view::npos) return 0;
  std::size_t n = 0;
  for (std::size_t i = dot + 1; i < text.size() && text[i] >= '0' && text[i] <= '9'; ++i) ++n;
  return static_cast<int>(n);
}

// The °F text: from the exact value, trailing zeros dropped.
std::string fahrenheit_text(std::string_view celsius_text, double exact, bool difference) {
  const double f = difference ? exact * 1.8 : exact * 1.8 + 32.0;
  if (celsius_text.find_first_of("eE") != std::string_view::npos) return printf_text("%.*g", 6, f);
  // one more decimal than the °C text (a °F is 5/9 of a kelvin), but no more than three unless
  // the °C text itself had more
  const int dc = decimals_of(celsius_text);
  std::string s = printf_text("%.*f", dc < 3 ? dc + 1 : dc, f);
  if (s.find('.') != std::string::npos) {
    while (!s.empty() && s.back() == '0') s.pop_back();
    if (!s.empty() && s.back() == '.') s.pop_back();
  }
  if (s == "-0") s = "0";
  return s;
}

}  // namespace

std::string render_temperatures(std::string_view text, TempUnit u) {
  if (text.find(kOpen) == std::string_view::npos) return std::string(text);
  std::string out;
  out.reserve(text.size());
  std::size_t pos = 0;
  for (;;) {
    const std::size_t open = text.find(kOpen, pos);
    if (open == std::string_view::npos) break;
    const std::size_t body = open + kOpen.size();
    const std::size_t close = text.find(kClose, body);
    const std::size_t sep = text.find(kSep, body);
    if (close == std::string_view::npos || sep == std::string_view::npos || sep > close || sep == body) break;
    out.append(text.substr(pos, open - pos));
    const bool difference = text[body] == 'D';
    const std::string_view c = text.substr(body + 1, sep - body - 1);
    std::string_view exact_text = text.substr(sep + kSep.size(), close - sep - kSep.size());
    std::string_view written_F;  // 'W': the °F text as the source writes it
    if (text[body] == 'W') {
      const std::size_t sep2 = exact_text.find(kSep);
      if (sep2 != std::string_view::npos) {
        written_F = exact_text.substr(sep2 + kSep.size());
        exact_text = exact_text.substr(0, sep2);
      }
    }
    const std::string exact(exact_text);
    if (u == TempUnit::C) out += c;
    else if (!written_F.empty()) out += written_F;
    else out += fahrenheit_text(c, std::strtod(exact.c_str(), nullptr), difference);
    out += ' ';
    out += unit_symbol(u);
    pos = close + kClose.size();
  }
  out.append(text.substr(pos));
  return out;
}

void write_rendered(std::ostream& out, TempUnit u, const std::function<void(std::ostream&)>& write) {
  std::ostringstream buffer;
  write(buffer);
  out << render_temperatures(buffer.str(), u);
}

}  // namespace coldcore
