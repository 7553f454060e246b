#pragma once
/// Reading the data libraries (products/organisms.toml, cooling-rules.toml, cooking-tables.toml)
/// into their model and lethality types. Every value keeps its source; every error names the file,
/// the entry and the value (InputError). The file formats are documented beside the types
/// (lethality/organisms.hpp) and below.
#include <string_view>

#include "coldcore/lethality/cooking_tables.hpp"
#include "coldcore/lethality/organisms.hpp"
#include "coldcore/model/cooling_rules.hpp"

namespace coldcore::io {

/// Parses organisms.toml text. Checks: unique keys, z > 0, D > 0, valid_min < valid_max,
/// reference inside the valid range, split_C and z_below_C together, weibull δ > 0 and p > 0,
/// unknown keys (with "did you mean"), every quantity sourced with a known status.
OrganismLibrary parse_organisms(std::string_view toml_text, std::string_view origin);

/// Parses cooling-rules.toml (schema 1):
///   [[rule]] key, name, source, status, note?, chill_start_within_min?, chill_start_source?
///   [[rule.step]] from_C | from_F, to_C | to_F, within_h | within_min | within_s, advisory?,
///                 source, status
/// °F values are converted exactly ((F − 32)/1.8).
RuleLibrary parse_cooling_rules(std::string_view toml_text, std::string_view origin);

/// Parses cooking-tables.toml (schema 1):
///   [[table]] key, name, source, status, note?, log_reduction?
///             rows = [ { temp_F = 130, temp_C = 54.4, hold_min = 112 }, { ..., hold_s = 169 },
///                      { temp_F = 158, temp_C = 70.0, hold_s = 0, note = "instant" } ]
/// Checks: rows strictly ascending in temperature, holds >= 0, printed °C within 0.5 °C of the
/// printed °F, unknown keys.
CookingTables parse_cooking_tables(std::string_view toml_text, std::string_view origin);

}  // namespace coldcore::io
