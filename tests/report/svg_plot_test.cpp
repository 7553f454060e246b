// The line-plot builder: nice ticks, the data-to-pixel mapping, dash patterns, strict XML.
#include <doctest/doctest.h>

#include <cmath>
#include <limits>
#include <set>

#include "coldcore/report/svg_plot.hpp"
#include "support/xml_check.hpp"

using namespace coldcore::svg;
using coldcore::testing::xml_problem;

namespace {
size_t count(const std::string& s, const std::string& what) {
  size_t n = 0;
  for (size_t p = s.find(what); p != std::string::npos; p = s.find(what, p + 1)) ++n;
  return n;
}
}  // namespace

TEST_CASE("nice numbers are 1 / 2 / 5 or 10 times a power of ten (Heckbert 1990 / Graphics Gems)") {
  CHECK(nice_number(438, false) == doctest::Approx(500));
  CHECK(nice_number(125, true) == doctest::Approx(100));
  CHECK(nice_number(0.025, true) == doctest::Approx(0.02));
  CHECK(nice_number(0.031, false) == doctest::Approx(0.05));
  CHECK(nice_number(7.2, true) == doctest::Approx(10));
  CHECK(nice_number(2.0, false) == doctest::Approx(2));
}

TEST_CASE("loose labels enclose the data: 105..543 with 5 ticks gives 100..600 step 100") {
  // The 105..543 example is Heckbert's (Graphics Gems 1990), from memory; the arithmetic is his
  // loose-labelling rule: range = nice(438) = 500, step = nice(500/4, round) = 100.
  const Ticks t = nice_ticks(105, 543, 5);
  CHECK(t.step == doctest::Approx(100));
  CHECK(t.first == doctest::Approx(100));
  CHECK(t.last == doctest::Approx(600));
  CHECK(t.values.size() == 6);
  CHECK(t.decimals == 0);
}

TEST_CASE("nice ticks: properties over many ranges") {
  for (double lo : {-40.0, -1.0, 0.0, 0.013, 3.7, 57.0, 1e4}) {
    for (double span : {1e-3, 0.37, 1.0, 9.9, 88.0, 1234.5}) {
      const double hi = lo + span;
      const Ticks t = nice_ticks(lo, hi, 6);
      CAPTURE(lo);
      CAPTURE(hi);
      CHECK(t.first <= lo + 1e-9 * t.step);
      CHECK(t.last >= hi - 1e-9 * t.step);
      CHECK(t.first > lo - t.step);  // loose, but not by more than a step
      CHECK(t.last < hi + t.step);
      const double mant = t.step / std::pow(10.0, std::floor(std::log10(t.step) + 1e-12));
      CHECK((std::fabs(mant - 1) < 1e-9 || std::fabs(mant - 2) < 1e-9 || std::fabs(mant - 5) < 1e-9));
      CHECK(t.values.size() >= 3);
      CHECK(t.values.size() <= 13);
      // The decimals print each tick exactly: step * 10^decimals is an integer.
      const double scaled = t.step * std::pow(10.0, t.decimals);
      CHECK(std::fabs(scaled - std::round(scaled)) < 1e-6);
    }
  }
  const Ticks flat = nice_ticks(72, 72, 6);  // a flat series still gets an axis around it
  CHECK(flat.first < 72);
  CHECK(flat.last > 72);
}

TEST_CASE("data map onto the plot area corners") {
  LinePlot p;
  p.id = "t";
  p.title = "mapping";
  p.x = {"x", 0.0, 10.0};
  p.y = {"y", 0.0, 100.0};
  Series s;
  s.name = "diagonal";
  s.x = {0, 10};
  s.y = {0, 100};
  p.series = {s};
  const std::string out = render_svg(p, false);
  // Default 720 x 360 with the documented margins: plot area x 64..700, y 30..316.
  CHECK(out.find("points=\"64.00,316.00 700.00,30.00\"") != std::string::npos);
  CHECK(out.find("id=\"t-area\" x=\"64.00\" y=\"30.00\" width=\"636.00\" height=\"286.00\"") != std::string::npos);
  CHECK(xml_problem(out) == "");
}

TEST_CASE("every dash pattern differs / and NaN breaks a line") {
  std::set<std::string> seen;
  for (Dash d : {Dash::solid, Dash::dashed, Dash::dotted, Dash::dash_dot, Dash::long_dash, Dash::short_dash})
    seen.insert(std::string(dash_array(d)));
  CHECK(seen.size() == 6);

  LinePlot p;
  p.id = "n";
  Series s;
  s.name = "broken";
  const double nan = std::numeric_limits<double>::quiet_NaN();
  s.x = {0, 1, 2, 3, 4, 5};
  s.y = {0, 1, nan, 3, 4, 5};
  s.dash = Dash::dash_dot;
  p.series = {s};
  const std::string out = render_svg(p, false);
  CHECK(count(out, "<polyline") == 2);
  CHECK(out.find("stroke-dasharray=\"8 3 2 3\"") != std::string::npos);
}

TEST_CASE("labels are escaped / ids are prefixed / standalone files carry the XML declaration") {
  LinePlot p;
  p.id = "plot-a";
  p.title = "T < 5 & \"cold\"";
  p.x.label = "time (min)";
  p.y.label = "temperature (°C)";
  Series s;
  s.name = "<centre>";
  s.x = {0, 1, 2};
  s.y = {5, 4, 3};
  p.series = {s};
  p.vlines = {{0, "cook"}, {1, "chill & hold"}};
  p.hlines = {{4.5, "limit 'x'"}};
  p.boxes = {{0.5, 1.5, 3, 4.5, "box", okabe_ito::reddish_purple}};
  const std::string inline_svg = render_svg(p, false);
  const std::string file_svg = render_svg(p, true);
  CHECK(xml_problem(inline_svg) == "");
  CHECK(xml_problem(file_svg) == "");
  CHECK(file_svg.rfind("<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n<svg ", 0) == 0);
  CHECK(inline_svg.rfind("<svg ", 0) == 0);
  CHECK(inline_svg.find("T &lt; 5 &amp; &quot;cold&quot;") != std::string::npos);
  CHECK(inline_svg.find("&lt;centre&gt;") != std::string::npos);
  CHECK(inline_svg.find("clip-path=\"url(#plot-a-clip)\"") != std::string::npos);
  CHECK(count(inline_svg, "class=\"stage-line\"") == 1);  // the one at the axis is not drawn
  CHECK(count(inline_svg, "class=\"target-line\"") == 1);
  CHECK(count(inline_svg, "class=\"rule-box\"") == 1);
  CHECK(inline_svg.find("rotate(-90") != std::string::npos);  // y label reads upwards
}

TEST_CASE("the well-formedness checker itself rejects broken XML") {
  CHECK(xml_problem("<a><b></a>") != "");
  CHECK(xml_problem("<a x=1/>") != "");
  CHECK(xml_problem("<a>&nbsp;</a>") != "");
  CHECK(xml_problem("<a>1 < 2</a>") != "");
  CHECK(xml_problem("<a/><b/>") != "");
  CHECK(xml_problem("<a x=\"1\" x=\"2\"/>") != "");
  CHECK(xml_problem("<a x=\"1\"y=\"2\"/>") != "");
  CHECK(xml_problem("<a>") != "");
  CHECK(xml_problem("<a x=\"&#176;\">&amp;&#xB0;</a>") == "");
}
