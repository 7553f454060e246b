#pragma once
// The content of the fit report written once, as sections of sentences, key-value rows and
// tables; the text and the rich (md, html) writers lay the same content out.
#include <string>
#include <vector>

#include "coldcore/report/fit_report.hpp"
#include "run_figures.hpp"

namespace coldcore::detail {

struct FitSection {
  std::string id, heading;
  std::vector<std::string> paragraphs;
  std::vector<KeyValue> key_values;
  TextTable table;                   ///< empty: none
  std::vector<bool> numeric;         ///< right-aligned columns of `table`
  std::vector<std::string> items;    ///< a list after the table
  std::vector<std::string> statements;  ///< sentences set apart (the design value)
};

struct FitContent {
  std::string title, lead;
  std::vector<FitSection> sections;
};

FitContent fit_content(const process::StudyAnalysis& a, const FitReportContext& c, TempUnit u);

/// The plots: measured and fitted curves, the semi-log plot with the straight portion, residuals.
std::vector<RunFigure> fit_figures(const process::StudyAnalysis& a, TempUnit u);

/// "1.234e-07" (4 significant figures), for diffusivities.
std::string sci(double x, int significant = 4);

}  // namespace coldcore::detail
