#pragma once
// The one way the io layer reads TOML: checked access to one table of a product file or a data
// library. The table's accepted keys are declared up front, so misspelt keys and unknown unit
// suffixes are refused before any value is used (a typo must never silently become "missing" or
// "default"); every message names the file, the key, the value and what is accepted.
#include <initializer_list>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include <toml++/toml.h>

#include "coldcore/io/quantity.hpp"
#include "coldcore/model/limits.hpp"

namespace coldcore::io::detail {

/// How a declared key is spelt in the file.
enum class KeyForm {
  plain,     ///< exactly `name`
  quantity,  ///< `name_<unit>` with a unit of `quantity`
  medium,    ///< `name_<temp unit>` or `name_<time unit>_<temp unit>` (points with time unit)
};

struct KeySpec {
  std::string name;
  KeyForm form = KeyForm::plain;
  Quantity quantity = Quantity::temperature;  ///< KeyForm::quantity only
};

inline KeySpec plain(std::string name) { return {std::move(name), KeyForm::plain, Quantity::temperature}; }
inline KeySpec quantity(std::string base, Quantity q) { return {std::move(base), KeyForm::quantity, q}; }
/// Plain keys only, as the data libraries write them (units are part of the fixed names there).
inline std::vector<KeySpec> plain_keys(std::initializer_list<std::string_view> names) {
  std::vector<KeySpec> out;
  for (auto n : names) out.push_back(plain(std::string(n)));
  return out;
}

/// Parses a TOML document; a syntax error becomes InputError
/// "<origin>:<line>:<col>: not valid TOML: <description>".
toml::table parse_toml(std::string_view text, const std::string& origin);

/// A TOML value as it would be written in the file (numbers bare, strings quoted, [a, b]).
std::string format_value(const toml::node& n);

/// A quantity key found in a table: its spelling, its value as written and in SI.
struct Found {
  std::string key;       ///< e.g. "diameter_mm"
  std::string unit;      ///< e.g. "mm" (for medium keys: the temperature unit)
  std::string time_unit; ///< medium keys only: "s" unless given as name_<time>_<temp>
  const toml::node* node = nullptr;
};

class Fields {
 public:
  /// Validates every key of `table` against `specs`. `path` is the table's key path for
  /// messages ("product", "stage[2]"; empty for the document root).
  Fields(const toml::table& table, std::string origin, std::string path, std::vector<KeySpec> specs);

  std::string key_path(std::string_view key) const;
  /// `<origin>: <path.key> = <value>: <requirement>`
  [[noreturn]] void fail(std::string_view key, const std::string& requirement) const;
  /// `<origin>: <path.key>: missing: <requirement>`
  [[noreturn]] void missing(std::string_view key, const std::string& requirement) const;
  /// `<origin>: <path.what> = <value>: <requirement>` for a value the file does not hold as
  /// written (converted to SI, the value of a { value = ... } table); `what` names it.
  [[noreturn]] void fail_value(std::string_view what, double value, const std::string& requirement) const;
  /// `<origin>: <path[.where]>: <problem>` for a rule across keys ("give X or Y, not both") or a
  /// part of a value (`where` = "rows[2]"); an empty `where` names the table itself.
  [[noreturn]] void fail_at(std::string_view where, const std::string& problem) const;

  const toml::node* node(std::string_view plain_key) const;
  /// A data library's `schema`: when given it must be the integer 1 (`schema = <v>: must be 1`);
  /// `required`: missing is an error too.
  void require_schema_1(bool required) const;
  /// The one spelling of a quantity or medium key present, if any.
  std::optional<Found> find(std::string_view base) const;

  /// Plain string key; fails when present but not a string.
  std::optional<std::string> string(std::string_view key) const;
  /// Plain string key that must be given: `missing: <requirement>` otherwise.
  std::string required_string(std::string_view key, const std::string& requirement) const;
  /// Plain number key, if given (checked as number_of).
  std::optional<double> number(std::string_view key, std::string_view what = {}) const;
  /// Plain number key that must be given: `missing: <requirement>` otherwise.
  double required_number(std::string_view key, const std::string& requirement, std::string_view what = {}) const;
  /// `key = [[...]]`, an array of tables (may be empty): `missing: <requirement>` when absent,
  /// `must be <requirement>` when another type or an element is not a table.
  const toml::array& tables(std::string_view key, const std::string& requirement) const;
  /// Plain or quantity node as a number (integers accepted); fails with "must be a number ..."
  /// when present but not a number and, unless allow_inf, when not finite.
  /// `what` is added to the type message: "must be a number (length in mm)".
  double number_of(std::string_view key, const toml::node& n, bool allow_inf = false,
                   std::string_view what = {}) const;
  /// A quantity key converted to SI; `found`, when given, receives the key as spelt.
  std::optional<double> quantity_si(std::string_view base, Found* found = nullptr) const;

  /// Fails unless `si` lies in `r` (model/limits.hpp): `<key> = <value>: must be from <low> to
  /// <high> <unit>`, the range given in `unit` as written (`q` converts it; plain keys: no q).
  /// `why` is appended when given. NaN fails.
  void require_range(std::string_view key, double si, const limits::Range& r, std::optional<Quantity> q,
                     std::string_view unit, std::string_view why = {}) const;
  /// Fails unless `value` lies in `r`: `<what> = <value>: must be from <low> to <high> <unit>`,
  /// all in the value's own unit; for values not written as such (see fail_value).
  void require_value_range(std::string_view what, double value, const limits::Range& r, std::string_view unit) const;

  const std::string& origin() const { return origin_; }
  const std::string& path() const { return path_; }
  const toml::table& table() const { return table_; }
  /// Checked access to `t`, a table inside this one at `where` ("weibull", "step[2]").
  Fields nested(std::string_view where, const toml::table& t, std::vector<KeySpec> specs) const;
  /// The tables of the array of tables `key` (see tables()), each as Fields at "<key>[i]",
  /// counted from 1 as a reader counts them, with the accepted keys `specs`.
  std::vector<Fields> entries(std::string_view key, const std::string& requirement,
                              const std::vector<KeySpec>& specs) const;

 private:
  const toml::table& table_;
  std::string origin_;
  std::string path_;
  std::vector<KeySpec> specs_;
};

/// `si` (m, s, °C, K) expressed in `unit` of quantity q: the inverse of to_si (linear).
double from_si(Quantity q, double si, std::string_view unit);

/// "from <low> to <high> <unit>" for messages, the range converted to `unit` (plain: SI as is).
std::string range_text(const limits::Range& r, std::optional<Quantity> q, std::string_view unit);

/// "diameter_m or diameter_mm" for messages.
std::string spellings(std::string_view base, Quantity q);

}  // namespace coldcore::io::detail
