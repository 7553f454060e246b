#pragma once
/// Output formats and temperature units shared by every verb.
#include <string>
#include <string_view>
#include <vector>

namespace coldcore {

enum class Format { text, md, html, json, csv };
enum class TempUnit { C, F };

std::string_view to_string(Format f);
/// Parses a --format value. Throws InputError naming the option, the value and `allowed`.
Format parse_format(std::string_view s, const std::vector<Format>& allowed);
/// Parses a --units value: "C" or "F".
TempUnit parse_temp_unit(std::string_view s);

/// A temperature in the display unit.
double display_temp(double temp_C, TempUnit u);
/// A temperature difference (margin, z) in the display unit.
double display_temp_difference(double delta_K, TempUnit u);
std::string_view unit_symbol(TempUnit u);  ///< "°C" or "°F"
std::string_view unit_suffix(TempUnit u);  ///< "C" or "F", for column names

/// A CSV field (RFC 4180): as is, or in double quotes with inner quotes doubled when it holds
/// a comma, a quote or a line break.
std::string csv_cell(const std::string& s);

/// A number cell of a csv: the shortest text that reads back to the same double; empty for
/// NaN or infinity (a missing value to every csv reader, never the word "null" or "inf").
std::string csv_number(double x);

/// Fixed-point text of x with `digits` decimals; "-" for NaN.
std::string fixed(double x, int digits);
/// A duration as "1 h 05 min 30 s" style text, rounded UP to whole seconds.
std::string duration_text(double seconds);

}  // namespace coldcore
