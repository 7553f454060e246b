#pragma once
/// Temperatures inside free text (notes, warnings, labels, reasons).
///
/// Such text is built where the physics is (process/, the assessment, the history engine), before
/// anyone knows the display unit. A temperature in it is therefore written as a token that keeps
/// its °C value; every output of the CLI passes through render_temperatures, which writes each
/// token in the display unit: "57 °C", or with --units F "134.6 °F". A difference (a z-value, a
/// margin in kelvin) converts by the factor 1.8 only.
///
/// Token: U+E000, 'T' (absolute) or 'D' (difference), the °C text, U+E002, the exact value in
/// °C (%.17g), U+E001 (private-use code points, never in the tool's own text). °F is computed
/// from the exact value, so 54.4444 °C shown as "54.4 °C" is "130 °F", not 129.92.
#include <string>
#include <string_view>

#include "coldcore/report/format.hpp"

namespace coldcore {

/// An absolute temperature, shown in °C with `significant` significant digits (as %g).
std::string temp_token(double celsius, int significant = 6);
/// A temperature difference in K (= °C), shown as above.
std::string temp_difference_token(double kelvin, int significant = 6);
/// As above with a fixed number of decimals in °C (as fixed()).
std::string temp_token_fixed(double celsius, int decimals);
std::string temp_difference_token_fixed(double kelvin, int decimals);
/// An absolute temperature whose °C text the caller chose (e.g. rounded for a label).
std::string temp_token_text(std::string_view celsius_text, double exact_celsius);

/// `text` with every token written in unit u: in °C its °C text; in °F the exact value with one
/// more decimal than the °C text had, up to three (57 -> 134.6, 4.04 -> 39.272; a °C text with
/// more decimals keeps its count: 3.87611 -> 38.97700 -> "38.977"), trailing zeros dropped. Text without tokens is
/// returned unchanged.
std::string render_temperatures(std::string_view text, TempUnit u);

}  // namespace coldcore
