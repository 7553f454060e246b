#pragma once
// Private TOML reading helpers for the data libraries (organisms, cooling rules, cooking
// tables): unknown-key "did you mean", sourced quantities { value, source, status }. The
// product file reads through io/detail/fields.hpp, whose keys carry unit suffixes.
#include <initializer_list>
#include <string>
#include <string_view>
#include <vector>
#include <toml++/toml.h>

#include "coldcore/lethality/organisms.hpp"

#include "coldcore/model/limits.hpp"

namespace coldcore::io::detail {

/// Parses TOML text; a syntax error becomes InputError "<origin>:<line>:<col>: <description>".
toml::table parse_toml(std::string_view text, std::string_view origin);

/// Throws InputError for the first key of `t` not in `allowed`:
/// "<origin>: unknown key 'x' in [place]; did you mean 'y'?"
void check_keys(const toml::table& t, std::initializer_list<std::string_view> allowed,
                std::string_view origin, std::string_view place);

/// A required string. Throws "<origin>: <place>.<key>: missing" or "... = <v>: must be a string".
std::string get_string(const toml::table& t, std::string_view key, std::string_view origin,
                       std::string_view place, bool required = true);

/// A plain number (integer or float).
double get_number(const toml::table& t, std::string_view key, std::string_view origin,
                  std::string_view place);
bool has(const toml::table& t, std::string_view key);

/// A sourced quantity: key = { value = <number>, source = "<text>", status = "confirmed" |
/// "derived" | "from memory" }. `scale` converts the value to SI (60 for _min).
Sourced get_sourced(const toml::table& t, std::string_view key, std::string_view origin,
                    std::string_view place, double scale = 1.0);

/// Checks a status string.
void check_status(const std::string& status, std::string_view origin, std::string_view where);

/// InputError `<origin>: <where> = <v>: must be from <low> to <high> <unit>` unless r contains v
/// (model/limits.hpp; the library's own units, C and s). NaN fails.
void require_in(double v, const limits::Range& r, std::string_view origin, const std::string& where,
                const char* unit);

}  // namespace coldcore::io::detail
