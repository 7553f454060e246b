// Plain-text run report: what a QA engineer reads in a terminal or prints.
#include <algorithm>
#include <ostream>

#include "coldcore/report/cautions.hpp"
#include "coldcore/report/run_report.hpp"
#include "coldcore/report/temperature_text.hpp"
#include "coldcore/report/verdict_summary.hpp"

namespace coldcore {

std::string_view verdict_word(bool met) { return met ? "met" : "not demonstrated"; }

namespace {

size_t code_points(const std::string& s) {
  size_t cps = 0;
  for (unsigned char c : s) cps += (c & 0xC0) != 0x80;
  return cps;
}

std::string pad(std::string s, size_t width) {
  // Pads by code points, not bytes, so °C columns stay aligned.
  const size_t cps = code_points(s);
  if (cps < width) s.append(width - cps, ' ');
  return s;
}

void print_table(std::ostream& out, const std::vector<std::vector<std::string>>& raw, TempUnit u) {
  // cells measured as shown: temperatures in free text rendered in the display unit first
  std::vector<std::vector<std::string>> rows = raw;
  for (auto& row : rows)
    for (auto& cell : row) cell = render_temperatures(cell, u);
  std::vector<size_t> width;
  for (const auto& row : rows)
    for (size_t i = 0; i < row.size(); ++i) {
      if (width.size() <= i) width.push_back(0);
      width[i] = std::max(width[i], code_points(row[i]));
    }
  for (const auto& row : rows) {
    std::string line = " ";
    for (size_t i = 0; i < row.size(); ++i) {
      line += ' ';
      line += pad(row[i], i + 1 < row.size() ? width[i] : 0);
    }
    out << line << "\n";
  }
}

std::string h_text(const StageRow& s) { return s.h_infinite ? "inf" : fixed(s.h_W_m2K, 1); }

// "scenario 2" of "scenario 2: ...": the short name a table column shows.
std::string scenario_short(const std::string& label) { return label.substr(0, label.find(':')); }

void print_stage_table(std::ostream& out, const RunReport& r, const std::vector<StageRow>& stages, TempUnit u) {
  std::vector<std::vector<std::string>> rows = {
      {"stage", "start", "end", "ended by", "h W/m²K", biot_symbol(r), "centre", "surface", "mean"}};
  for (const auto& s : stages)
    rows.push_back({s.name, duration_text(s.start_s), duration_text(s.end_s), s.ended_by, h_text(s),
                    s.h_infinite ? "inf" : biot_number_text(s.biot), fixed(display_temp(s.centre_C, u), 2),
                    fixed(display_temp(s.surface_C, u), 2), fixed(display_temp(s.mean_C, u), 2)});
  print_table(out, rows, u);
}

}  // namespace

static void write_run_text_unrendered(const RunReport& r, std::ostream& out, TempUnit u);

void write_run_text(const RunReport& r, std::ostream& out, TempUnit u) {
  write_rendered(out, u, [&](std::ostream& o) { write_run_text_unrendered(r, o, u); });
}

static void write_run_text_unrendered(const RunReport& r, std::ostream& out, TempUnit u) {
  const std::string us(unit_symbol(u));
  out << r.title << "\n\n";
  write_summary_text(out, verdict_summary(r));
  if (!r.product.empty()) {
    out << (r.measured ? "Measured log\n" : "Product\n");
    for (const auto& kv : r.product) out << "  " << kv.key << ": " << kv.value << "\n";
    out << "\n";
  }
  if (!r.stages.empty()) {
    out << "Stages (" << (r.scenarios.empty() ? "" : "h of scenario 1; ") << "temperatures at each stage's end, " << us
        << ")\n";
    print_stage_table(out, r, r.stages, u);
    out << "\n  Media:\n";
    for (const auto& s : r.stages) out << "    " << s.name << ": " << s.medium << "\n";
    out << "\n  What the Biot number says";
    if (r.biot_length == "V/A")
      out << " (Bi on V/A, the volume over the surface area, " << fixed(r.biot_length_m * 1000.0, 2) << " mm)";
    out << ":\n";
    for (const auto& s : r.stages) out << "    " << s.name << ": " << s.biot_note << "\n";
    out << "\n";
  }
  if (!r.scenarios.empty()) {
    // every scenario's history behind the verdicts (issue 11): its stage ends, per scenario
    out << "Scenarios (the targets need different ends of an h range; each verdict comes from its own; "
        << "temperatures at each stage's end, " << us << ")\n";
    for (const auto& sc : r.scenarios) {
      std::string names;
      for (const auto& t : sc.targets) names += (names.empty() ? "" : ", ") + t;
      out << "  " << sc.label << "; targets: " << names << "\n";
      print_stage_table(out, r, sc.stages, u);
    }
    out << "\n";
  }
  if (!r.verdicts.empty()) {
    out << "Assessment\n";
    const bool split = !r.scenarios.empty();
    std::vector<std::vector<std::string>> rows = {{"target", "required", "achieved", "margin", "verdict"}};
    if (split) rows[0].push_back("scenario");
    for (const auto& v : r.verdicts) {
      rows.push_back({v.name, v.required, v.achieved, v.margin, std::string(verdict_word(v.met))});
      if (split) rows.back().push_back(scenario_short(v.scenario));
    }
    print_table(out, rows, u);
    for (const auto& v : r.verdicts)
      for (const auto& d : v.details) out << "    " << v.name << ": " << d << "\n";
    out << "\n";
  }
  if (!r.delivered.empty()) {
    out << delivered_heading() << "\n";
    for (const auto& d : r.delivered) {
      out << "  " << d.name << ": " << delivered_text(d) << "\n";
      for (const auto& line : d.details) out << "    " << d.name << ": " << line << "\n";
    }
    out << "\n";
  }
  if (!r.warnings.empty()) {
    out << "Warnings\n";
    for (const auto& w : r.warnings) out << "  ! " << w << "\n";
    out << "\n";
  }
  if (!r.assumptions.empty()) {
    out << "Assumptions\n";
    for (const auto& a : r.assumptions) out << "  - " << a << "\n";
    out << "\n";
  }
  if (!r.provenance.empty()) {
    out << "Provenance\n";
    for (const auto& kv : r.provenance) out << "  " << kv.key << ": " << kv.value << "\n";
    out << "\n";
  }
  write_sign_off_text(out);
  out << "CAUTIONS\n";
  for (const auto& c : r.cautions) out << "  * " << c << "\n";
}

}  // namespace coldcore
