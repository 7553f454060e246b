#pragma once
/// The can trade's size notation, "D x H" (e.g. "211 x 400"): each number is whole inches
/// followed by two digits of sixteenths of an inch, so 211 is 2 11/16 in (68.26 mm) and 400 is
/// 4 in (101.6 mm). D is the overall diameter (over the double seam), H the overall height
/// (common practice of can makers; the notation is from memory, the inch is exactly 25.4 mm).
#include <optional>
#include <string>
#include <string_view>

namespace coldcore::io {

struct CanSize {
  double diameter_m = 0;
  double height_m = 0;
};

/// Parses "211 x 400" (also "211x400", "211 X 400", "211 × 400"). nullopt with `why` set when the
/// text is not in that form or a sixteenths part is 16 or more.
std::optional<CanSize> parse_can_size(std::string_view text, std::string* why = nullptr);

}  // namespace coldcore::io
