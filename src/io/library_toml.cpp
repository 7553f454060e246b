#include "io/detail/library_toml.hpp"

#include <algorithm>
#include <cmath>
#include <sstream>
#include <vector>

#include "coldcore/error.hpp"
#include "coldcore/number_text.hpp"
#include "coldcore/suggest.hpp"

namespace coldcore::io::detail {

toml::table parse_toml(std::string_view text, std::string_view origin) {
  try {
    return toml::parse(text, origin);
  } catch (const toml::parse_error& e) {
    std::ostringstream os;
    os << origin << ":" << e.source().begin.line << ":" << e.source().begin.column << ": "
       << e.description();
    throw InputError(os.str());
  }
}

void check_keys(const toml::table& t, std::initializer_list<std::string_view> allowed,
                std::string_view origin, std::string_view place) {
  for (const auto& [k, v] : t) {
    const std::string_view key = k.str();
    if (std::find(allowed.begin(), allowed.end(), key) != allowed.end()) continue;
    std::string msg = std::string(origin) + ": unknown key '" + std::string(key) + "' in [" +
                      std::string(place) + "]";
    const std::string near = did_you_mean(key, allowed).value_or("");
    if (!near.empty()) msg += "; did you mean '" + near + "'?";
    throw InputError(msg);
  }
}

bool has(const toml::table& t, std::string_view key) { return t.contains(key); }

std::string get_string(const toml::table& t, std::string_view key, std::string_view origin,
                       std::string_view place, bool required) {
  const toml::node* n = t.get(key);
  const std::string where = std::string(origin) + ": " + std::string(place) + "." + std::string(key);
  if (!n) {
    if (required) throw InputError(where + ": missing");
    return "";
  }
  if (auto s = n->value<std::string>()) return *s;
  throw InputError(where + ": must be a string");
}

double get_number(const toml::table& t, std::string_view key, std::string_view origin,
                  std::string_view place) {
  const toml::node* n = t.get(key);
  const std::string where = std::string(origin) + ": " + std::string(place) + "." + std::string(key);
  if (!n) throw InputError(where + ": missing");
  if (auto d = n->value<double>()) {
    if (!std::isfinite(*d)) throw InputError(where + " = " + number_text(*d) + ": must be finite");
    return *d;
  }
  throw InputError(where + ": must be a number");
}

void check_status(const std::string& status, std::string_view origin, std::string_view where) {
  if (status == "confirmed" || status == "derived" || status == "from memory") return;
  std::string msg = std::string(origin) + ": " + std::string(where) + ".status = \"" + status +
                    "\": must be \"confirmed\", \"derived\" or \"from memory\"";
  throw InputError(msg);
}

Sourced get_sourced(const toml::table& t, std::string_view key, std::string_view origin,
                    std::string_view place, double scale) {
  const toml::node* n = t.get(key);
  const std::string p = std::string(place) + "." + std::string(key);
  if (!n) throw InputError(std::string(origin) + ": " + p + ": missing");
  const toml::table* q = n->as_table();
  if (!q)
    throw InputError(std::string(origin) + ": " + p +
                     ": must be { value = <number>, source = \"...\", status = \"...\" }");
  check_keys(*q, {"value", "source", "status", "note"}, origin, p);
  Sourced s;
  s.value = get_number(*q, "value", origin, p) * scale;
  s.source = get_string(*q, "source", origin, p);
  if (s.source.empty()) throw InputError(std::string(origin) + ": " + p + ".source = \"\": must name a source");
  s.status = get_string(*q, "status", origin, p);
  check_status(s.status, origin, p);
  s.note = get_string(*q, "note", origin, p, false);
  return s;
}

void require_in(double v, const limits::Range& r, std::string_view origin, const std::string& where,
                const char* unit) {
  if (!r.contains(v))
    throw InputError(std::string(origin) + ": " + where + " = " + number_text(v) + ": must be from " + number_text(r.low) + " to " +
                     number_text(r.high) + " " + unit);
}

}  // namespace coldcore::io::detail
