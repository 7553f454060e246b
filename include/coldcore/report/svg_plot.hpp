#pragma once
/// A small line-plot builder that writes strict SVG 1.1 (well-formed XML): named series with
/// colours and dash patterns, axes with "nice" ticks and labels, vertical marker lines (stage
/// boundaries), horizontal target lines, shaded boxes (cooling-rule limits) and a legend.
/// Output is deterministic: the same plot gives the same bytes (numbers are formatted by
/// std::to_chars with fixed decimals, which no locale changes).
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace coldcore::svg {

/// Dash patterns, so lines differ by more than colour (print in grey, colour-blind readers).
enum class Dash { solid, dashed, dotted, dash_dot, long_dash, short_dash };

/// The stroke-dasharray value of a pattern ("" for solid).
std::string_view dash_array(Dash d);

/// The Okabe–Ito colour-blind-safe palette (Okabe & Ito 2008, "Color Universal Design"),
/// hex RGB. Values from memory; black is listed first as in the original.
namespace okabe_ito {
inline constexpr const char* black = "#000000";
inline constexpr const char* orange = "#E69F00";
inline constexpr const char* sky_blue = "#56B4E9";
inline constexpr const char* bluish_green = "#009E73";
inline constexpr const char* yellow = "#F0E442";
inline constexpr const char* blue = "#0072B2";
inline constexpr const char* vermillion = "#D55E00";
inline constexpr const char* reddish_purple = "#CC79A7";
}  // namespace okabe_ito

/// One polyline. x and y have the same length; a NaN in either breaks the line there.
struct Series {
  std::string name;        ///< legend text
  std::vector<double> x, y;
  std::string colour = okabe_ito::black;
  Dash dash = Dash::solid;
  double width_px = 1.8;   ///< stroke width in SVG user units (px at 100 %)
  std::string css_class;   ///< extra class attribute value, e.g. "series-centre" (may be empty)
};

/// A vertical marker across the plot area at `x`, its label at the top right of the line.
struct VLine {
  double x = 0;
  std::string label;
};

/// A horizontal line across the plot area at `y` (a required value), labelled at the right.
struct HLine {
  double y = 0;
  std::string label;
  std::string colour = okabe_ito::black;
  Dash dash = Dash::long_dash;
};

/// A shaded rectangle between x0..x1 and y_lo..y_hi, labelled inside its top-left corner.
/// The edge at x1 is drawn heavier: it is the deadline of a cooling-rule step.
struct Box {
  double x0 = 0, x1 = 0, y_lo = 0, y_hi = 0;
  std::string label;
  std::string colour = okabe_ito::reddish_purple;
};

struct Axis {
  std::string label;               ///< with its unit, e.g. "time (min)"
  std::optional<double> min, max;  ///< fixed ends; unset ends follow the data, widened to ticks
  /// y only: a logarithmic axis in decades (issue 16: a requirement of 2 min on an axis to
  /// 1,780 min would lie on zero). Values <= 0 are not drawn; min and max stay in data units.
  bool log_scale = false;
};

struct LinePlot {
  std::string id;            ///< prefix of element ids; unique within one HTML document
  std::string title;         ///< accessible title (<title>) and the heading drawn above the plot
  double width_px = 720;     ///< default 720 × 360 user units
  double height_px = 360;
  Axis x, y;
  std::vector<Series> series;
  std::vector<VLine> vlines;
  std::vector<HLine> hlines;
  std::vector<Box> boxes;
};

/// Ticks chosen by Heckbert's "loose labelling" (Graphics Gems, 1990, "Nice numbers for graph
/// labels"): step = {1, 2, 5} × 10^k, first and last tick enclose [lo, hi].
struct Ticks {
  double first = 0, last = 1, step = 1;
  int decimals = 0;               ///< decimals that print every tick exactly
  std::vector<double> values;     ///< first, first+step, ..., last
};

/// REQUIRES: lo, hi finite; target_count >= 2. lo == hi is widened to a unit-sized range.
Ticks nice_ticks(double lo, double hi, int target_count = 6);

/// The "nice" number near x > 0: 1, 2, 5 or 10 times a power of ten (Heckbert 1990).
/// round=true picks the nearest, round=false the next larger-or-equal.
double nice_number(double x, bool round);

/// Escapes & < > " ' for XML text and attribute values.
std::string xml_escape(std::string_view s);

/// The plot as one <svg> element. standalone=true prefixes the XML declaration, for .svg files.
/// Only ever writes the SVG namespace URI (xmlns), never a link to fetch.
std::string render_svg(const LinePlot& plot, bool standalone);

}  // namespace coldcore::svg
