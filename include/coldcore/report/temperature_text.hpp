#pragma once
/// Temperatures inside free text, written in the display unit. The lower layers write each
/// temperature as a token (model/temperature_token.hpp); every public writer of the report layer
/// passes its output through render_temperatures, which writes each token in the unit the user
/// asked for, so what the report API hands out is final text.
#include <functional>
#include <iosfwd>
#include <string>
#include <string_view>

#include "coldcore/model/temperature_token.hpp"
#include "coldcore/report/format.hpp"

namespace coldcore {

/// `text` with every token written in unit u: in °C its °C text; in °F the exact value with one
/// more decimal than the °C text had, up to three (57 -> 134.6, 4.04 -> 39.272; a °C text with
/// more decimals keeps its count: 3.87611 -> 38.97700 -> "38.977"), trailing zeros dropped. Text without tokens is
/// returned unchanged.
std::string render_temperatures(std::string_view text, TempUnit u);

/// Runs `write` into a buffer, then writes the buffer to `out` with every token rendered in u.
/// On an exception nothing reaches `out`.
void write_rendered(std::ostream& out, TempUnit u, const std::function<void(std::ostream&)>& write);

}  // namespace coldcore
