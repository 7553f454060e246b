// Line plots as strict SVG. Every number goes through fixed_c() (std::to_chars, locale-free) so the bytes depend only on the
// input; every text goes through xml_escape so the output is well-formed XML.
#include "coldcore/report/svg_plot.hpp"

#include "coldcore/report/label_placer.hpp"

#include <algorithm>
#include <charconv>
#include <cassert>
#include <cmath>
#include <limits>
#include <sstream>


namespace coldcore::svg {

std::string xml_escape(std::string_view s) {
  std::string r;
  r.reserve(s.size());
  for (char c : s) {
    switch (c) {
      case '&': r += "&amp;"; break;
      case '<': r += "&lt;"; break;
      case '>': r += "&gt;"; break;
      case '"': r += "&quot;"; break;
      case '\'': r += "&#39;"; break;
      default:
        // Control characters other than tab/newline are not allowed in XML 1.0 at all.
        if (static_cast<unsigned char>(c) < 0x20 && c != '\t' && c != '\n') r += ' ';
        else r += c;
    }
  }
  return r;
}

namespace {

constexpr double kLeft = 64, kRight = 20, kTop = 30, kAxisBelow = 44;
constexpr double kLegendRow = 17;
constexpr double kCharPx = 6.6;  // rough advance of one character at font-size 11

size_t code_points(std::string_view s) {
  size_t n = 0;
  for (unsigned char c : s) n += (c & 0xC0) != 0x80;
  return n;
}

std::string prefix_code_points(std::string_view s, size_t n) {
  size_t i = 0, seen = 0;
  for (; i < s.size(); ++i) {
    if ((static_cast<unsigned char>(s[i]) & 0xC0) != 0x80) {
      if (seen == n) break;
      ++seen;
    }
  }
  return std::string(s.substr(0, i));
}

// Fixed-point text by std::to_chars: independent of any locale a caller may have set, so the
// same plot is the same bytes everywhere. "-0.00" is written as "0.00".
std::string fixed_c(double v, int decimals) {
  if (!std::isfinite(v)) return "0";
  char buf[64];
  const auto res = std::to_chars(buf, buf + sizeof buf, v, std::chars_format::fixed, decimals);
  std::string s(buf, res.ptr);
  if (s[0] == '-' && s.find_first_not_of("-0.") == std::string::npos) s.erase(0, 1);
  return s;
}

std::string num(double v) { return fixed_c(v, 2); }

struct Frame {
  double x0, x1, y0, y1;          // data range
  double left, right, top, bottom;  // plot area in px
  double px(double x) const { return left + (x - x0) / (x1 - x0) * (right - left); }
  double py(double y) const { return top + (y1 - y) / (y1 - y0) * (bottom - top); }
};

struct Range {
  double lo = std::numeric_limits<double>::infinity();
  double hi = -std::numeric_limits<double>::infinity();
  void add(double v) {
    if (!std::isfinite(v)) return;
    lo = std::min(lo, v);
    hi = std::max(hi, v);
  }
  bool empty() const { return !(lo <= hi); }
};

// The axis ends and the ticks to draw between them.
struct AxisLayout {
  double lo, hi;
  Ticks ticks;
};

AxisLayout layout_axis(const Axis& a, Range data, int target_count) {
  if (a.min) data.add(*a.min);
  if (a.max) data.add(*a.max);
  if (data.empty()) data = Range{0, 1};
  Ticks t = nice_ticks(a.min.value_or(data.lo), a.max.value_or(data.hi), target_count);
  AxisLayout l{a.min.value_or(t.first), a.max.value_or(t.last), t};
  if (!(l.hi > l.lo)) l.hi = l.lo + 1;
  // Keep only ticks inside fixed ends.
  std::vector<double> kept;
  for (double v : t.values)
    if (v >= l.lo - 1e-9 * t.step && v <= l.hi + 1e-9 * t.step) kept.push_back(v);
  l.ticks.values = kept;
  return l;
}

std::string stroke_attrs(const std::string& colour, Dash dash, double width) {
  std::string s = "stroke=\"" + xml_escape(colour) + "\" stroke-width=\"" + num(width) + "\"";
  const auto da = dash_array(dash);
  if (!da.empty()) s += " stroke-dasharray=\"" + std::string(da) + "\"";
  return s;
}

// Polylines for one series: broken at NaN, and points closer than 0.3 px to the last kept one
// dropped (invisible at any zoom a printout allows; keeps files small for long histories).
void write_series(std::ostream& o, const Series& s, const Frame& f) {
  std::vector<std::pair<double, double>> pts;
  auto flush = [&] {
    if (pts.size() >= 2) {
      o << "<polyline fill=\"none\" " << stroke_attrs(s.colour, s.dash, s.width_px)
        << " stroke-linejoin=\"round\"";
      if (!s.css_class.empty()) o << " class=\"" << xml_escape(s.css_class) << "\"";
      o << " points=\"";
      for (size_t i = 0; i < pts.size(); ++i)
        o << (i ? " " : "") << num(pts[i].first) << "," << num(pts[i].second);
      o << "\"/>\n";
    } else if (pts.size() == 1) {
      o << "<circle cx=\"" << num(pts[0].first) << "\" cy=\"" << num(pts[0].second) << "\" r=\"2\" fill=\""
        << xml_escape(s.colour) << "\"/>\n";
    }
    pts.clear();
  };
  const size_t n = std::min(s.x.size(), s.y.size());
  for (size_t i = 0; i < n; ++i) {
    if (!std::isfinite(s.x[i]) || !std::isfinite(s.y[i])) {
      flush();
      continue;
    }
    const double X = f.px(s.x[i]), Y = f.py(s.y[i]);
    const bool last = i + 1 == n || !std::isfinite(s.x[i + 1]) || !std::isfinite(s.y[i + 1]);
    if (!pts.empty() && !last && std::fabs(X - pts.back().first) < 0.3 && std::fabs(Y - pts.back().second) < 0.3)
      continue;
    pts.emplace_back(X, Y);
  }
  flush();
}

void text(std::ostream& o, double x, double y, std::string_view s, std::string_view extra = "") {
  o << "<text x=\"" << num(x) << "\" y=\"" << num(y) << "\"";
  if (!extra.empty()) o << " " << extra;
  o << ">" << xml_escape(s) << "</text>\n";
}

struct LegendEntry {
  enum Kind { line, box } kind;
  std::string name, colour;
  Dash dash;
  double width;
};

}  // namespace

namespace {

// The plot with every y as log10(y) (a value <= 0 has none: NaN, not drawn), for a log y axis.
LinePlot with_log_y(LinePlot p) {
  const auto lg = [](double v) { return v > 0 ? std::log10(v) : std::numeric_limits<double>::quiet_NaN(); };
  for (auto& s : p.series)
    for (double& v : s.y) v = lg(v);
  for (auto& h : p.hlines) h.y = lg(h.y);
  for (auto& b : p.boxes) {
    b.y_lo = lg(b.y_lo);
    b.y_hi = lg(b.y_hi);
  }
  if (p.y.min) p.y.min = lg(*p.y.min);
  if (p.y.max) p.y.max = lg(*p.y.max);
  return p;
}

// Whole decades over [lo, hi] (every second one beyond eight).
AxisLayout decades(AxisLayout l) {
  l.lo = std::floor(l.lo + 1e-9);
  l.hi = std::max(l.lo + 1, std::ceil(l.hi - 1e-9));
  const int step = l.hi - l.lo > 8 ? 2 : 1;
  l.ticks.values.clear();
  for (double v = l.lo; v <= l.hi + 1e-9; v += step) l.ticks.values.push_back(v);
  l.ticks.decimals = 0;
  return l;
}

// A decade's label as a plain number: 0.01, 1, 100.
std::string decade_text(double v) {
  const int e = static_cast<int>(std::lround(v));
  return fixed_c(std::pow(10.0, e), e < 0 ? -e : 0);
}

}  // namespace

std::string render_svg(const LinePlot& p_in, bool standalone) {
  const LinePlot& p = p_in.y.log_scale ? with_log_y(p_in) : p_in;  // a temporary bound to the reference lives on
  // Data ranges: y only over points whose x lies inside a fixed x range.
  Range xr, yr;
  for (const auto& s : p.series)
    for (size_t i = 0; i < std::min(s.x.size(), s.y.size()); ++i) {
      if (!std::isfinite(s.y[i])) continue;
      xr.add(s.x[i]);
    }
  for (const auto& b : p.boxes) {
    xr.add(b.x0);
    xr.add(b.x1);
  }
  const AxisLayout xa = layout_axis(p.x, xr, 8);
  for (const auto& s : p.series)
    for (size_t i = 0; i < std::min(s.x.size(), s.y.size()); ++i)
      if (s.x[i] >= xa.lo && s.x[i] <= xa.hi) yr.add(s.y[i]);
  for (const auto& h : p.hlines) yr.add(h.y);
  for (const auto& b : p.boxes) {
    yr.add(b.y_lo);
    yr.add(b.y_hi);
  }
  const AxisLayout ya = p.y.log_scale ? decades(layout_axis(p.y, yr, 7)) : layout_axis(p.y, yr, 7);

  std::vector<LegendEntry> legend;
  for (const auto& s : p.series) legend.push_back({LegendEntry::line, s.name, s.colour, s.dash, s.width_px});
  for (const auto& h : p.hlines)
    if (!h.label.empty()) legend.push_back({LegendEntry::line, h.label, h.colour, h.dash, 1.6});
  for (const auto& b : p.boxes)
    if (!b.label.empty()) legend.push_back({LegendEntry::box, b.label, b.colour, Dash::solid, 1});
  const double plot_w = p.width_px - kLeft - kRight;
  size_t longest = 0;
  for (const auto& e : legend) longest = std::max(longest, code_points(e.name));
  const int cols = (longest * kCharPx + 40 <= plot_w / 2) ? 2 : 1;
  const int rows = static_cast<int>((legend.size() + cols - 1) / cols);
  const double legend_h = rows > 0 ? rows * kLegendRow + 4 : 0;
  const double total_h = p.height_px + legend_h;

  const Frame f{xa.lo, xa.hi, ya.lo, ya.hi, kLeft, p.width_px - kRight, kTop, p.height_px - kAxisBelow};
  const std::string id = xml_escape(p.id);
  std::ostringstream o;
  if (standalone) o << "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n";
  o << "<svg xmlns=\"http://www.w3.org/2000/svg\" version=\"1.1\" class=\"plot\" id=\"" << id << "\" width=\""
    << num(p.width_px) << "\" height=\"" << num(total_h) << "\" viewBox=\"0 0 " << num(p.width_px) << " "
    << num(total_h) << "\" role=\"img\" aria-labelledby=\"" << id
    << "-title\" font-family=\"DejaVu Sans, Arial, Helvetica, sans-serif\" font-size=\"11\">\n";
  o << "<title id=\"" << id << "-title\">" << xml_escape(p.title) << "</title>\n";
  o << "<defs><clipPath id=\"" << id << "-clip\"><rect x=\"" << num(f.left) << "\" y=\"" << num(f.top)
    << "\" width=\"" << num(f.right - f.left) << "\" height=\"" << num(f.bottom - f.top)
    << "\"/></clipPath></defs>\n";
  o << "<rect x=\"0\" y=\"0\" width=\"" << num(p.width_px) << "\" height=\"" << num(total_h)
    << "\" fill=\"#FFFFFF\"/>\n";
  text(o, f.left, 18, p.title, "font-size=\"13\" font-weight=\"bold\"");

  // Grid.
  o << "<g class=\"grid\" stroke=\"#DDDDDD\" stroke-width=\"0.6\">\n";
  for (double v : xa.ticks.values)
    o << "<line x1=\"" << num(f.px(v)) << "\" y1=\"" << num(f.top) << "\" x2=\"" << num(f.px(v)) << "\" y2=\""
      << num(f.bottom) << "\"/>\n";
  for (double v : ya.ticks.values)
    o << "<line x1=\"" << num(f.left) << "\" y1=\"" << num(f.py(v)) << "\" x2=\"" << num(f.right) << "\" y2=\""
      << num(f.py(v)) << "\"/>\n";
  o << "</g>\n";

  const std::string clip = "clip-path=\"url(#" + id + "-clip)\"";
  // One placer for every label drawn inside the plot: none meets another or leaves the area.
  LabelPlacer labels(f.left, f.top, f.right, f.bottom);
  const std::vector<double> rows_down = {0, 12, 24, 36, 48};
  if (!p.boxes.empty()) {
    o << "<g class=\"rule-boxes\" " << clip << ">\n";
    for (const auto& b : p.boxes) {
      const double X0 = f.px(std::min(b.x0, b.x1)), X1 = f.px(std::max(b.x0, b.x1));
      const double Y0 = f.py(std::max(b.y_lo, b.y_hi)), Y1 = f.py(std::min(b.y_lo, b.y_hi));
      const std::string c = xml_escape(b.colour);
      o << "<rect class=\"rule-box\" x=\"" << num(X0) << "\" y=\"" << num(Y0) << "\" width=\"" << num(X1 - X0)
        << "\" height=\"" << num(Y1 - Y0) << "\" fill=\"" << c << "\" fill-opacity=\"0.14\" stroke=\"" << c
        << "\" stroke-width=\"0.8\"/>\n";
      o << "<line class=\"rule-deadline\" x1=\"" << num(X1) << "\" y1=\"" << num(Y0) << "\" x2=\"" << num(X1)
        << "\" y2=\"" << num(Y1) << "\" stroke=\"" << c << "\" stroke-width=\"2.4\"/>\n";
      if (!b.label.empty())
        if (const auto at = labels.place(b.label, X0 + 3, Y0 + 12, 10, false, rows_down))
          text(o, at->first, at->second, b.label, "font-size=\"10\" fill=\"#333333\"");
    }
    o << "</g>\n";
  }

  if (!p.vlines.empty()) {
    std::vector<VLine> v = p.vlines;
    std::stable_sort(v.begin(), v.end(), [](const VLine& a, const VLine& b) { return a.x < b.x; });
    o << "<g class=\"stage-lines\">\n";
    for (size_t i = 0; i < v.size(); ++i) {
      if (v[i].x < f.x0 || v[i].x > f.x1) continue;
      const double X = f.px(v[i].x);
      if (X > f.left + 0.5)
        o << "<line class=\"stage-line\" x1=\"" << num(X) << "\" y1=\"" << num(f.top) << "\" x2=\"" << num(X)
          << "\" y2=\"" << num(f.bottom) << "\" stroke=\"#555555\" stroke-width=\"1\" stroke-dasharray=\"3 3\"/>\n";
      // The whole name in the first free row under the top; shortened (whole in a tooltip) only
      // when no row has room for it.
      std::string label = v[i].label;
      auto at = labels.place(label, X + 3, f.top + 11, 10, false, rows_down);
      if (!at) {
        const double next = i + 1 < v.size() ? std::min(f.px(v[i + 1].x), f.right) : f.right;
        const size_t fit = static_cast<size_t>(std::max(0.0, (next - X - 6) / 6.2));
        label = fit >= 4 ? prefix_code_points(label, fit - 1) + "…" : "";
        if (!label.empty()) at = labels.place(label, X + 3, f.top + 11, 10, false, rows_down);
      }
      if (at && !label.empty()) {
        o << "<text x=\"" << num(at->first) << "\" y=\"" << num(at->second) << "\" font-size=\"10\" fill=\"#333333\">"
          << xml_escape(label);
        if (label != v[i].label) o << "<title>" << xml_escape(v[i].label) << "</title>";
        o << "</text>\n";
      }
    }
    o << "</g>\n";
  }

  o << "<g class=\"series\" " << clip << ">\n";
  for (const auto& s : p.series) write_series(o, s, f);
  o << "</g>\n";

  if (!p.hlines.empty()) {
    o << "<g class=\"target-lines\" " << clip << ">\n";
    for (const auto& h : p.hlines) {
      const double Y = f.py(h.y);
      o << "<line class=\"target-line\" x1=\"" << num(f.left) << "\" y1=\"" << num(Y) << "\" x2=\"" << num(f.right)
        << "\" y2=\"" << num(Y) << "\" " << stroke_attrs(h.colour, h.dash, 1.6) << "/>\n";
      // Above its line, else below, else further out: never on another label.
      if (!h.label.empty())
        if (const auto at = labels.place(h.label, f.right - 4, Y - 4, 10, true, {0, 16, -12, 28, -24, 40, -36}))
          text(o, at->first, at->second, h.label, "font-size=\"10\" text-anchor=\"end\" fill=\"#222222\"");
    }
    o << "</g>\n";
  }

  o << "<rect class=\"plot-area\" id=\"" << id << "-area\" x=\"" << num(f.left) << "\" y=\"" << num(f.top)
    << "\" width=\"" << num(f.right - f.left) << "\" height=\"" << num(f.bottom - f.top)
    << "\" fill=\"none\" stroke=\"#333333\" stroke-width=\"1\"/>\n";

  // Ticks and labels.
  o << "<g class=\"axes\" fill=\"#222222\">\n";
  for (double v : xa.ticks.values) {
    const double X = f.px(v);
    o << "<line x1=\"" << num(X) << "\" y1=\"" << num(f.bottom) << "\" x2=\"" << num(X) << "\" y2=\""
      << num(f.bottom + 4) << "\" stroke=\"#333333\"/>\n";
    text(o, X, f.bottom + 16, fixed_c(v, xa.ticks.decimals), "text-anchor=\"middle\"");
  }
  for (double v : ya.ticks.values) {
    const double Y = f.py(v);
    o << "<line x1=\"" << num(f.left - 4) << "\" y1=\"" << num(Y) << "\" x2=\"" << num(f.left) << "\" y2=\""
      << num(Y) << "\" stroke=\"#333333\"/>\n";
    text(o, f.left - 7, Y + 4, p.y.log_scale ? decade_text(v) : fixed_c(v, ya.ticks.decimals), "text-anchor=\"end\"");
  }
  text(o, (f.left + f.right) / 2, f.bottom + 34, p.x.label, "text-anchor=\"middle\" class=\"axis-label\"");
  const double yl_x = 16, yl_y = (f.top + f.bottom) / 2;
  text(o, yl_x, yl_y, p.y.label,
       "text-anchor=\"middle\" class=\"axis-label\" transform=\"rotate(-90 " + num(yl_x) + " " + num(yl_y) + ")\"");
  o << "</g>\n";

  if (!legend.empty()) {
    o << "<g class=\"legend\">\n";
    const double col_w = plot_w / cols;
    for (size_t i = 0; i < legend.size(); ++i) {
      const auto& e = legend[i];
      const double x = kLeft + static_cast<double>(i % cols) * col_w;
      const double y = p.height_px + static_cast<double>(i / cols) * kLegendRow + 8;
      if (e.kind == LegendEntry::box)
        o << "<rect x=\"" << num(x) << "\" y=\"" << num(y - 6) << "\" width=\"28\" height=\"12\" fill=\""
          << xml_escape(e.colour) << "\" fill-opacity=\"0.14\" stroke=\"" << xml_escape(e.colour) << "\"/>\n";
      else
        o << "<line x1=\"" << num(x) << "\" y1=\"" << num(y) << "\" x2=\"" << num(x + 28) << "\" y2=\"" << num(y)
          << "\" " << stroke_attrs(e.colour, e.dash, e.width) << "/>\n";
      text(o, x + 34, y + 4, e.name);
    }
    o << "</g>\n";
  }
  o << "</svg>\n";
  return o.str();
}

}  // namespace coldcore::svg
