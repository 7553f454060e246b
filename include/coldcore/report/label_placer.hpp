#pragma once
/// Places the text labels inside a plot so that no two meet and none leaves the plot area
/// (issue 16: the two cooling steps' labels printed on top of each other, stage names cut short).
/// Text extents are estimated, not measured (an SVG writer has no font metrics): a label of n
/// characters at font size s is taken as 0.62·s·n wide (wider than DejaVu Sans' and Arial's
/// average glyph, so the estimate errs on the roomy side) and from 0.8·s above its baseline to
/// 0.25·s below.
#include <optional>
#include <string_view>
#include <vector>

namespace coldcore::svg {

/// The estimated box of a text label: x0 < x1, y0 < y1 in SVG pixels.
struct TextBox {
  double x0 = 0, y0 = 0, x1 = 0, y1 = 0;
  bool meets(const TextBox& o) const { return x0 < o.x1 && o.x0 < x1 && y0 < o.y1 && o.y0 < y1; }
};

/// Characters (UTF-8 code points) of a label.
std::size_t label_characters(std::string_view text);
/// The estimated box of `text` at (x, baseline y), anchored at its start or (end_anchor) its end.
TextBox label_box(std::string_view text, double x, double y, double font_px, bool end_anchor);

class LabelPlacer {
 public:
  LabelPlacer(double left, double top, double right, double bottom) : area_{left, top, right, bottom} {}
  /// Finds a baseline for `text` at x: the first of y + k·offsets[i] whose box lies inside the
  /// area and meets no label placed before; a start-anchored label too long for the area's right
  /// edge is moved left to end there. Returns the (x, y) used and takes that place, or nullopt
  /// when no offset is free (the caller shortens the label or leaves it out).
  std::optional<std::pair<double, double>> place(std::string_view text, double x, double y, double font_px,
                                                 bool end_anchor, const std::vector<double>& offsets);

 private:
  TextBox area_;
  std::vector<TextBox> taken_;
};

}  // namespace coldcore::svg
