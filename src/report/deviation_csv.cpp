// The deviation record as csv: the verdict summary, the record's facts as '# ' lines, then one
// row per target (nominal and, with --conservative, the worst case).
#include <ostream>
#include <optional>
#include <string>

#include "coldcore/report/cautions.hpp"
#include "coldcore/report/format.hpp"
#include "coldcore/report/deviation_report.hpp"
#include "coldcore/report/json.hpp"
#include "coldcore/report/conservative_text.hpp"
#include "coldcore/report/process_notes.hpp"
#include "coldcore/report/temperature_text.hpp"
#include "coldcore/report/verdict_summary.hpp"

namespace coldcore {

using process::DeviationResult;

namespace {

std::string opt_num(const std::optional<double>& v) { return v ? csv_number(*v) : ""; }

}  // namespace

static void write_deviation_csv_unrendered(const DeviationResult& r, const DeviationRecordInfo& i, std::ostream& out, TempUnit u);

void write_deviation_csv(const DeviationResult& r, const DeviationRecordInfo& i, std::ostream& out, TempUnit u) {
  write_rendered(out, u, [&](std::ostream& o) { write_deviation_csv_unrendered(r, i, o, u); });
}

static void write_deviation_csv_unrendered(const DeviationResult& r, const DeviationRecordInfo& i, std::ostream& out, TempUnit) {
  write_summary_csv(out, verdict_summary(r, i.conservative));
  for (const auto& cau : cautions()) out << "# caution: " << cau << "\n";
  out << "# disposition: " << disposition_statement() << "\n";
  out << "# lot: " << (i.lot.empty() ? "(not given)" : i.lot) << "\n";
  if (!r.stage.empty()) {
    out << "# stage: " << r.stage << "\n";
    out << "# stage heats: " << (r.stage_heats ? "yes" : "no") << "; scheduled_stage_s "
        << JsonWriter::number(r.scheduled_stage_s) << "; delivered_stage_s " << JsonWriter::number(r.delivered_stage_s)
        << "\n";
    out << "# deviations: " << r.events.size() << " (times from the stage start)\n";
    for (const auto& e : r.events) {
      out << "# deviation: " << to_string(e.kind) << "; start_s " << JsonWriter::number(e.start_s) << "; end_s "
          << JsonWriter::number(e.end_s);
      if (e.kind == process::DeviationKind::medium_colder || e.kind == process::DeviationKind::medium_warmer)
        out << "; extreme_C " << JsonWriter::number(e.extreme_C) << "; extreme_at_s " << JsonWriter::number(e.extreme_at_s)
            << "; scheduled_at_extreme_C " << JsonWriter::number(e.scheduled_at_extreme_C) << "; departure_K "
            << JsonWriter::number(e.departure_K);
      out << "\n";
    }
    if (r.extension_given_s)
      out << "# extension_given_s: " << JsonWriter::number(*r.extension_given_s) << "; extension_needed_s: "
          << (r.extension_needed_s ? JsonWriter::number(*r.extension_needed_s) : "none: " + no_hold_text(r.extension_needed_none, r))
          << "\n";
    out << "# medium log: " << i.medium_log << " (SHA-256 " << i.medium_log_sha256 << ")\n";
  }
  if (!i.probe_log.empty()) out << "# probe log: " << i.probe_log << " (SHA-256 " << i.probe_log_sha256 << ")\n";
  for (const auto& kv : i.provenance) out << "# " << kv.key << ": " << kv.value << "\n";
  out << "# extra_hold_s: " << (r.extra_hold_s ? JsonWriter::number(*r.extra_hold_s) : "none: " + no_hold_text(r.extra_hold_none, r)) << "\n";
  for (const auto& n : assumption_texts(r.assumptions)) out << "# assumption: " << n << "\n";
  for (const auto& n : deviation_note_texts(r.notes)) out << "# note: " << n << "\n";
  out << "# reviewer name: \n# review date: \n# decision: \n";
  const auto* cons = i.conservative;
  if (cons) {
    for (const auto& ch : range_setting_texts(cons->choices)) out << "# conservative choice: " << ch << "\n";
    if (const std::string why = initial_choice_text(cons->initial); !why.empty())
      out << "# conservative initial temperature: " << why << "\n";
    out << "# conservative extra_hold_s: "
        << (cons->result.extra_hold_s ? JsonWriter::number(*cons->result.extra_hold_s)
                                      : "none: " + no_hold_text(cons->result.extra_hold_none, cons->result))
        << "\n";
    out << "# conservative all met as delivered: " << (cons->result.all_met_delivered ? "yes" : "no") << "\n";
    for (const auto& a : cons->alone)
      out << "# conservative alone: " << range_setting_text(a.choice) << "; least margin " << JsonWriter::number(a.least_margin)
          << "; extra_hold_s " << (a.extra_hold_s ? JsonWriter::number(*a.extra_hold_s) : "none") << "\n";
    out << "# conservative driven by: " << driven_by_text(*cons) << "\n";
    for (const auto& n : deviation_note_texts(cons->result.notes)) out << "# conservative note: " << n << "\n";
  }
  out << "target,kind,scheduled_F_min,delivered_F_min,scheduled_log_reduction,delivered_log_reduction,verdict"
      << (cons ? ",case" : "") << ",met\n";
  const auto rows = [&](const DeviationResult& d, const char* which) {
    for (const auto& t : d.targets) {
      out << csv_cell(t.name) << "," << to_string(t.kind) << ",";
      if (t.lethality) out << csv_number(t.scheduled_F_s / 60.0) << "," << csv_number(t.delivered_F_s / 60.0);
      else out << ",";
      out << "," << opt_num(t.scheduled_logs) << "," << opt_num(t.delivered_logs) << "," << to_string(t.verdict);
      if (cons) out << "," << which;
      out << "," << (t.verdict == Verdict::met ? "true" : "false") << "\n";
    }
  };
  rows(r, "nominal");
  if (cons) rows(cons->result, "conservative");
}

}  // namespace coldcore
