// Issue 16: no two labels inside a plot meet, and none leaves its plot. Checked on every SVG plot
// of the committed example reports (reports/*.svg, which cli.reports_current keeps equal to what
// the demo makes now), with text boxes estimated as report/label_placer.hpp states; and on a
// made-up plot with two labels on top of each other, which the check must catch.
#include <doctest/doctest.h>

#include <filesystem>
#include <fstream>
#include <regex>
#include <sstream>
#include <string>
#include <vector>

#include "coldcore/report/label_placer.hpp"
#include "coldcore/report/run_report.hpp"
#include "report/run_figures.hpp"
#include "support/sample_report.hpp"

using namespace coldcore::svg;

namespace {

struct Label {
  std::string text;
  TextBox box;
};

// The plot labels of an SVG: <text> elements at font size 10 (stage, rule-step and required-value
// labels; the legend and axes use other sizes), with their estimated boxes.
std::vector<Label> plot_labels(const std::string& svg) {
  static const std::regex text_re("<text x=\"([-0-9.]+)\" y=\"([-0-9.]+)\" font-size=\"10\"([^>]*)>([^<]*)");
  std::vector<Label> out;
  for (auto it = std::sregex_iterator(svg.begin(), svg.end(), text_re); it != std::sregex_iterator(); ++it) {
    const auto& m = *it;
    const bool end_anchor = m[3].str().find("text-anchor=\"end\"") != std::string::npos;
    out.push_back({m[4].str(), label_box(m[4].str(), std::stod(m[1].str()), std::stod(m[2].str()), 10, end_anchor)});
  }
  return out;
}

// The first pair of labels that meet, as text; empty when none do.
std::string overlap(const std::vector<Label>& labels) {
  for (std::size_t i = 0; i < labels.size(); ++i)
    for (std::size_t j = i + 1; j < labels.size(); ++j)
      if (labels[i].box.meets(labels[j].box)) return "'" + labels[i].text + "' meets '" + labels[j].text + "'";
  return "";
}

std::string read(const std::filesystem::path& p) {
  std::ifstream in(p, std::ios::binary);
  std::ostringstream s;
  s << in.rdbuf();
  return s.str();
}

}  // namespace

TEST_CASE("issue 16: the overlap check catches two labels on top of each other") {
  const std::string svg =
      "<svg><text x=\"95.91\" y=\"144.48\" font-size=\"10\" fill=\"#333333\">step 1 (2 h): 57 °C → 21 °C</text>\n"
      "<text x=\"95.91\" y=\"144.48\" font-size=\"10\" fill=\"#333333\">step 2 (6 h): 57 °C → 5 °C</text></svg>";
  CHECK_FALSE(overlap(plot_labels(svg)).empty());
  // one row (12 px) apart they are clear of each other
  const std::string apart =
      "<svg><text x=\"95.91\" y=\"144.48\" font-size=\"10\">step 1</text>"
      "<text x=\"95.91\" y=\"156.48\" font-size=\"10\">step 2</text></svg>";
  CHECK(overlap(plot_labels(apart)).empty());
}

TEST_CASE("issue 16: no plot label of the example reports meets another or leaves its plot") {
  const std::filesystem::path dir = std::filesystem::path(COLDCORE_SOURCE_DIR) / "reports";
  static const std::regex area_re("class=\"plot-area\"[^>]* x=\"([-0-9.]+)\" y=\"([-0-9.]+)\" width=\"([-0-9.]+)\" height=\"([-0-9.]+)\"");
  int plots = 0, labels = 0;
  for (const auto& e : std::filesystem::directory_iterator(dir)) {
    if (e.path().extension() != ".svg") continue;
    const std::string svg = read(e.path());
    const std::vector<Label> l = plot_labels(svg);
    ++plots;
    labels += static_cast<int>(l.size());
    const std::string name = e.path().filename().string();
    CHECK_MESSAGE(overlap(l).empty(), name << ": " << overlap(l));
    std::smatch a;
    REQUIRE_MESSAGE(std::regex_search(svg, a, area_re), name << ": no plot area");
    const TextBox area{std::stod(a[1].str()), std::stod(a[2].str()), std::stod(a[1].str()) + std::stod(a[3].str()),
                       std::stod(a[2].str()) + std::stod(a[4].str())};
    for (const auto& x : l)
      CHECK_MESSAGE((x.box.x0 >= area.x0 - 1e-9 && x.box.x1 <= area.x1 + 1e-9 && x.box.y0 >= area.y0 - 1e-9 &&
                     x.box.y1 <= area.y1 + 1e-9),
                    name << ": '" << x.text << "' leaves the plot area");
  }
  CHECK(plots >= 20);
  CHECK(labels >= 20);
}

TEST_CASE("issue 16: a requirement under 5 % of the lethality axis gets a log axis - otherwise it stays linear") {
  using namespace coldcore;
  using coldcore::detail::RunFigure;
  using coldcore::detail::run_figures;
  RunReport r = coldcore::testing::sample_report();
  const auto lethality = [](const std::vector<RunFigure>& figs) -> const RunFigure* {
    for (const auto& f : figs)
      if (f.key == "lethality") return &f;
    return nullptr;
  };
  // The sample requires F70 = 2 min; its F column decides the axis.
  std::size_t col = 0;
  while (r.history.columns[col].name != "F_F70_min") ++col;
  double top = 0;
  for (const auto& row : r.history.rows) top = std::max(top, row[col]);
  REQUIRE(top > 0);
  // 2 min against a top 100 times larger: the requirement is 1 % of the axis.
  for (auto& row : r.history.rows) row[col] *= 200.0 / top;
  const std::vector<RunFigure> figs = run_figures(r, TempUnit::C);
  const RunFigure* f = lethality(figs);
  REQUIRE(f != nullptr);
  CHECK(f->plot.y.log_scale);
  CHECK(f->plot.y.label == "F-value (min, log scale)");
  const std::string svg = svg::render_svg(f->plot, true);
  CHECK(svg.find(">0.01</text>") != std::string::npos);  // decades from a hundredth of the requirement
  CHECK(svg.find(">100</text>") != std::string::npos);
  // 2 min against a top of 10 min (20 %): linear, as before.
  for (auto& row : r.history.rows) row[col] *= 10.0 / 200.0;
  const std::vector<RunFigure> figs2 = run_figures(r, TempUnit::C);
  const RunFigure* g = lethality(figs2);
  REQUIRE(g != nullptr);
  CHECK_FALSE(g->plot.y.log_scale);
}

TEST_CASE("issue 16: no caption or label of the example reports names a colour (meaningless in black and white)") {
  // Whole words only: a plot is read in print and by readers who do not tell colours apart.
  static const std::regex colour_word("\\b(red|blue|green|purple|orange|grey|gray|yellow|pink|black|magenta|cyan)\\b",
                                      std::regex::icase);
  const std::filesystem::path dir = std::filesystem::path(COLDCORE_SOURCE_DIR) / "reports";
  int files = 0;
  for (const auto& e : std::filesystem::directory_iterator(dir)) {
    if (e.path().extension() != ".md" && e.path().extension() != ".svg") continue;
    ++files;
    const std::string text = read(e.path());
    std::smatch m;
    CHECK_MESSAGE(!std::regex_search(text, m, colour_word), e.path().filename().string() << ": '" << m.str() << "'");
  }
  CHECK(files >= 20);
  CHECK(std::regex_search(std::string("the purple line"), colour_word));  // the check can fail
}
