#pragma once
/// The run report as one self-contained HTML file: inline CSS and SVG, no script, nothing
/// fetched. Printable on A4 and US letter (content fits 180 mm). The markup is also well-formed
/// XML after the doctype line, so it can be checked with any XML parser.
#include <iosfwd>

#include "coldcore/report/run_report.hpp"

namespace coldcore {

/// Writes title; product, stage (process) tables; plots of temperatures (with stage
/// boundaries), cumulative lethality (with target lines) and cooling against the rule's boxes;
/// "Reading this report"; verdicts; warnings; assumptions; provenance; the cautions box.
/// Formats only: every number comes from `r`. Temperatures in `u`, F-values in minutes.
/// Same `r` ⇒ same bytes (the writer reads no clock).
void write_run_html(const RunReport& r, std::ostream& out, TempUnit u);

}  // namespace coldcore
