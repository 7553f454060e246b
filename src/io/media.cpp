#include "coldcore/io/media.hpp"

#include <cmath>

#include <toml++/toml.h>

#include "coldcore/error.hpp"
#include "coldcore/io/quantity.hpp"
#include "io/detail/fields.hpp"
#include "io/detail/sourced.hpp"
#include "io/detail/text.hpp"

namespace coldcore::io {

const MediumType& medium_at(const MediaLibrary& library, std::string_view key, std::string_view place) {
  if (const MediumType* m = library.find(key)) return *m;
  std::vector<std::string> keys;
  std::string accepted;
  for (const auto& m : library.media) {
    keys.push_back(m.key);
    accepted += (accepted.empty() ? "" : ", ") + m.key;
  }
  std::string msg = std::string(place) + " = " + detail::quote(key) + ": not in " + library.origin;
  if (auto near = did_you_mean(key, keys)) msg += "; did you mean " + detail::quote(*near) + "?";
  throw InputError(msg + "; accepted: " + accepted);
}

MediaLibrary parse_media(std::string_view text, std::string_view origin_sv) {
  const std::string origin(origin_sv);
  const toml::table doc = detail::parse_toml(text, origin);
  using detail::plain;
  detail::Fields root(doc, origin, "", {plain("schema"), plain("media")});
  root.require_schema_1(true);
  const toml::node* media = root.node("media");
  if (media == nullptr || !media->is_table()) root.missing("media", "[media.<key>] tables");
  MediaLibrary lib;
  lib.origin = origin;
  for (const auto& [k, v] : *media->as_table()) {
    const std::string key(k.str());
    if (!v.is_table()) root.fail("media." + key, "must be a table [media." + key + "]");
    detail::Fields f(*v.as_table(), origin, "media." + key,
                     {plain("description"), plain("h_min_W_m2K"), plain("h_max_W_m2K"), plain("source"),
                      plain("status")});
    MediumType m;
    m.key = key;
    const auto str = [&](const char* name) {
      auto s = f.string(name);
      if (!s || s->empty()) f.missing(name, "a non-empty string");
      return *s;
    };
    const auto h = [&](const char* name) {
      const toml::node* n = f.node(name);
      if (n == nullptr) f.missing(name, "a heat-transfer coefficient in W/(m2 K), > 0");
      const double x = f.number_of(name, *n, false, "W/(m2 K)");
      if (!(x > 0)) f.fail(name, "must be > 0");
      f.require_range(name, x, limits::h_W_m2K, std::nullopt, "W/(m2 K)");
      return x;
    };
    m.description = str("description");
    m.h_min_W_m2K = h("h_min_W_m2K");
    m.h_max_W_m2K = h("h_max_W_m2K");
    if (m.h_max_W_m2K < m.h_min_W_m2K) f.fail("h_max_W_m2K", "must be >= h_min_W_m2K (" + detail::format_number(m.h_min_W_m2K) + ")");
    m.source = str("source");
    m.status = detail::source_status(f);
    lib.media.push_back(std::move(m));
  }
  if (lib.media.empty()) root.fail("media", "must hold at least one [media.<key>] table");
  return lib;
}

}  // namespace coldcore::io
