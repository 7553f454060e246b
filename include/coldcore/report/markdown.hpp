#pragma once
/// The run report as Markdown with the plots as separate SVG files. The writer does no file
/// I/O: it returns the text and the files, and the caller decides where to write them.
#include <string>
#include <string_view>
#include <utility>
#include <vector>

#include "coldcore/report/run_report.hpp"

namespace coldcore {

struct MarkdownReport {
  std::string markdown;
  /// {file name, SVG text}: file names are `<svg_basename>-<plot>.svg` (plot: temperature,
  /// lethality, cooling), referenced from `markdown` by relative path, so write them beside it.
  std::vector<std::pair<std::string, std::string>> svg_files;
};

/// `md` with every temperature token in its text and its SVG files rendered in u.
MarkdownReport rendered(MarkdownReport md, TempUnit u);

/// The same content as write_run_html. REQUIRES: svg_basename non-empty, a plain file name
/// (no directory part is added or removed). Temperatures in `u`, F-values in minutes.
MarkdownReport write_run_markdown(const RunReport& r, TempUnit u, std::string_view svg_basename);

}  // namespace coldcore
