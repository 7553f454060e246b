#include "coldcore/report/label_placer.hpp"

namespace coldcore::svg {

std::size_t label_characters(std::string_view text) {
  std::size_t n = 0;
  for (unsigned char c : text)
    if ((c & 0xC0) != 0x80) ++n;  // count lead bytes only
  return n;
}

TextBox label_box(std::string_view text, double x, double y, double font_px, bool end_anchor) {
  const double w = 0.62 * font_px * static_cast<double>(label_characters(text));
  const double x0 = end_anchor ? x - w : x;
  return {x0, y - 0.8 * font_px, x0 + w, y + 0.25 * font_px};
}

std::optional<std::pair<double, double>> LabelPlacer::place(std::string_view text, double x, double y, double font_px,
                                                            bool end_anchor, const std::vector<double>& offsets) {
  for (double dy : offsets) {
    double px = x;
    TextBox b = label_box(text, px, y + dy, font_px, end_anchor);
    if (b.x1 > area_.x1) {  // keep it inside: end at the right edge
      px -= b.x1 - area_.x1;
      b = label_box(text, px, y + dy, font_px, end_anchor);
    }
    if (b.x0 < area_.x0 || b.y0 < area_.y0 || b.y1 > area_.y1) continue;
    bool free = true;
    for (const auto& t : taken_) free = free && !b.meets(t);
    if (!free) continue;
    taken_.push_back(b);
    return std::pair{px, y + dy};
  }
  return std::nullopt;
}

}  // namespace coldcore::svg
