#pragma once
/// The json contract every verb's report follows (schemas/coldcore-report.schema.json, issue 16):
/// an envelope first (`schema_version`, `tool`, `verb`, `units`), snake_case keys with a unit
/// suffix on every quantity (`_s`, `_min`, `_C`/`_F`, `_W_m2K`, ...), numbers as json numbers
/// (an infinite h or Bi is `null` beside a `true` flag, never the string "inf"), and one key for
/// one quantity in every verb (F-values in minutes: `F_min`, `F_required_min`).
#include <string>
#include <string_view>

#include "coldcore/report/format.hpp"
#include "coldcore/report/json.hpp"

namespace coldcore {

/// Bumped when a key is renamed or removed, or a value changes meaning; adding keys does not.
inline constexpr int kJsonSchemaVersion = 1;

/// Writes the envelope keys into the object just begun: schema_version, tool, verb, units.
void write_json_envelope(JsonWriter& w, std::string_view verb, TempUnit u);

/// A display label as a json key: "input SHA-256" -> "input_sha256", "conductivity k" ->
/// "conductivity_k", "clock time" -> "clock_time" (ASCII letters lower-cased, digits kept, any
/// other run of characters one '_').
std::string json_key(std::string_view label);

/// A labelled value as json: a number when the whole text is a finite number as json writes it
/// ("241"), else the text ("4.00 °C", "0.1.0", "0412").
void write_label_value(JsonWriter& w, std::string_view text);

/// An object of labelled rows (anything with .key and .value strings), keys by json_key.
template <class Rows>
void write_labelled_object(JsonWriter& w, const Rows& rows) {
  w.begin_object();
  for (const auto& kv : rows) {
    const std::string key = json_key(kv.key);
    w.key(key);
    if (key == "lot" || key == "name") w.value(kv.value);  // identifiers stay text, even "20261201"
    else write_label_value(w, kv.value);
  }
  w.end_object();
}

}  // namespace coldcore
