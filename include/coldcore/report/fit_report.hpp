#pragma once
/// The report of `coldcore fit`: a heat-penetration study described the trade's way (f_h, j_h,
/// f_c, j_c per probe), the exact model fitted to it with intervals, the first-term cross-check
/// and Ball's formula beside the exact hold. Formatting only: every number comes from
/// process::analyse_study. Text, Markdown (+ SVG files), HTML, JSON and CSV; cautions in each.
#include <iosfwd>
#include <string>
#include <string_view>
#include <vector>

#include "coldcore/process/heat_penetration.hpp"
#include "coldcore/report/format.hpp"
#include "coldcore/report/markdown.hpp"
#include "coldcore/report/run_report.hpp"

namespace coldcore {

struct FitReportContext {
  std::string product_name;
  std::string origin;                    ///< the product file as given
  std::vector<KeyValue> provenance;      ///< files read with their SHA-256, date, version
  std::vector<std::string> warnings;     ///< from reading the logs and the file
  std::string written_product;           ///< --write-product path, "" when not asked
  std::vector<std::string> stage_names;  ///< the study's stages, in order
};

void write_fit_text(const process::StudyAnalysis& a, const FitReportContext& c, std::ostream& out, TempUnit u);
void write_fit_html(const process::StudyAnalysis& a, const FitReportContext& c, std::ostream& out, TempUnit u);
MarkdownReport write_fit_markdown(const process::StudyAnalysis& a, const FitReportContext& c, TempUnit u,
                                  std::string_view svg_basename);
/// Keys: fit{alpha_m2_s, alpha_ci95_m2_s, h[]{stages, status, h_W_m2K, h_ci95_W_m2K | h_lower_bound},
/// rms_K, n_points, ...}, fit_pool (same, with two or more probes), curves[]{probe, f_h_s, j_h,
/// f_c_s, j_c, straight_from_s, straight_to_s, broken, ...}, slowest_probe, cross_check,
/// classical, warnings, cautions, provenance. Numbers that do not exist are null.
void write_fit_json(const process::StudyAnalysis& a, const FitReportContext& c, std::ostream& out, TempUnit u);
/// One row per probe reading: probe, time_s, measured, model (slowest fit; pool fit), residual;
/// the cautions first as '#' lines.
void write_fit_csv(const process::StudyAnalysis& a, const FitReportContext& c, std::ostream& out, TempUnit u);

}  // namespace coldcore
