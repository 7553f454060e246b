#pragma once
/// Temperatures inside free text (notes, warnings, labels, reasons), written where the physics is.
///
/// Such text is built before anyone knows the display unit (process/, the assessment, the
/// history engine). A temperature in it is therefore written as a token that keeps its °C value
/// and says whether it is an absolute temperature or a difference; the report layer writes every
/// token in the display unit (report/temperature_text.hpp, render_temperatures): "57 °C", or with
/// --units F "134.6 °F". A difference (a z-value, a margin in kelvin) converts by 1.8 only.
///
/// Token: U+E000, 'T' (absolute) or 'D' (difference), the °C text, U+E002, the exact value in
/// °C (%.17g), U+E001 (private-use code points, never in the tool's own text). °F is computed
/// from the exact value, so 54.4444 °C shown as "54.4 °C" is "130 °F", not 129.92. A limit that
/// its source writes in both units ('W') carries both texts: U+E000 'W' °C text U+E002 exact
/// U+E002 °F text U+E001, shown as written in either unit ("57 °C", "135 °F").
#include <string>
#include <string_view>

namespace coldcore {

namespace temperature_token {
inline constexpr std::string_view open = "\xEE\x80\x80";       // U+E000
inline constexpr std::string_view separator = "\xEE\x80\x82";  // U+E002: between the °C text and the exact value
inline constexpr std::string_view close = "\xEE\x80\x81";      // U+E001
}  // namespace temperature_token

/// An absolute temperature, shown in °C with `significant` significant digits (as %g).
std::string temp_token(double celsius, int significant = 6);
/// A temperature difference in K (= °C), shown as above.
std::string temp_difference_token(double kelvin, int significant = 6);
/// As above with a fixed number of decimals in °C (as %.*f).
std::string temp_token_fixed(double celsius, int decimals);
std::string temp_difference_token_fixed(double kelvin, int decimals);
/// An absolute temperature whose °C text the caller chose (e.g. rounded for a label).
std::string temp_token_text(std::string_view celsius_text, double exact_celsius);
/// A limit as its source writes it in both units (e.g. a code's "57 °C (135 °F)"): each unit
/// shows its own text; `exact_celsius` is the value computed with.
std::string temp_token_written(std::string_view celsius_text, std::string_view fahrenheit_text, double exact_celsius);

}  // namespace coldcore
