#pragma once
// Small text helpers shared by the io parsers: how values are written inside error messages.
#include <string>
#include <string_view>

namespace coldcore::io::detail {

/// Shortest text that reads back to the same double ("42", "0.042", "-5", "inf", "nan").
std::string format_number(double v);

/// `s` in double quotes, with `"` and `\` escaped and control characters as \uXXXX.
std::string quote(std::string_view s);

/// `s` without leading/trailing blanks (space, tab, CR).
std::string_view trim(std::string_view s);

}  // namespace coldcore::io::detail
