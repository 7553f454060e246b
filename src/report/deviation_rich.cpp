// Markdown and HTML deviation record. Written once, a function per section, into a RichDoc
// (html_doc / md_doc make the markup), so a new section (e.g. a conservative worst case) is one
// more function called from write_deviation_doc. Only formatting: every number is a field of the
// DeviationResult or of the runs the process layer made.
#include <sstream>

#include "coldcore/process/assessment.hpp"
#include "coldcore/report/conservative_text.hpp"
#include "coldcore/report/process_notes.hpp"
#include "coldcore/report/target_notes.hpp"
#include "coldcore/report/cautions.hpp"
#include "coldcore/report/deviation_report.hpp"
#include "coldcore/report/history_notes.hpp"
#include "coldcore/report/temperature_text.hpp"
#include "deviation_figures.hpp"
#include "rich_page.hpp"

namespace coldcore {

namespace {

using detail::RichDoc;
using detail::TextTable;
using process::Check;
using process::DeviationResult;

std::string temp(double c, TempUnit u) { return fixed(display_temp(c, u), 2) + " " + std::string(unit_symbol(u)); }
std::string logs_down(const std::optional<double>& v) { return v ? shown_log_reduction(*v) : "-"; }
std::string at_time(double s) { return duration_text(s) + " (" + fixed(s, 0) + " s)"; }

std::string lot_text(const DeviationRecordInfo& i) { return i.lot.empty() ? "(not given)" : i.lot; }

std::string provenance_value(const DeviationRecordInfo& i, const std::string& key) {
  for (const auto& kv : i.provenance)
    if (kv.key == key) return kv.value;
  return "";
}

/// One row per target of a re-run: required, achieved, margin, verdict.
void check_table(RichDoc& d, const std::vector<TargetResult>& targets) {
  std::vector<bool> met;
  const TextTable t = detail::target_table(targets, met);
  if (met.empty()) d.paragraph("No targets to assess.");
  else d.verdict_table(t, met);
}
void check_table(RichDoc& d, const Check& c) { check_table(d, c.eval.assessment.targets); }

void record_section(RichDoc& d, const DeviationResult& r, const DeviationRecordInfo& i, TempUnit u) {
  d.section_begin("record", "Deviation record");
  std::vector<KeyValue> kv = {{"product", i.product_name}, {"lot", lot_text(i)}};
  if (!r.stage.empty()) {
    kv.push_back({"deviated stage", r.stage + " (starts " + duration_text(r.stage_start_s) + " into the process; " +
                                        (r.stage_heats ? "heats" : "cools") + ")"});
    if (r.events.empty()) kv.push_back({"deviation", no_deviation_text(r)});
    for (std::size_t n = 0; n < r.events.size(); ++n)
      kv.push_back({"deviation " + std::to_string(n + 1) + " of " + std::to_string(r.events.size()),
                    deviation_event_text(r.events[n], u, i.medium_log_start_unix_s)});
    if (r.extension_given_s)
      kv.push_back({"hold extension",
                    "the log runs " + at_time(*r.extension_given_s) + " past the scheduled end, credited as delivered; " +
                        (!r.extension_needed_s ? "the extension needed is not known: " + no_hold_text(r.extension_needed_none, r)
                         : *r.extension_needed_s == 0
                             ? std::string("none of it was needed")
                             : at_time(*r.extension_needed_s) + " at the scheduled medium was needed")});
    kv.push_back({"medium log", i.medium_log});
    kv.push_back({"medium log SHA-256", i.medium_log_sha256});
  }
  if (!i.probe_log.empty()) {
    kv.push_back({"probe log", i.probe_log});
    kv.push_back({"probe log SHA-256", i.probe_log_sha256});
  }
  for (const char* key : {"tool", "input", "input SHA-256", "date"}) {
    const std::string v = provenance_value(i, key);
    if (!v.empty()) kv.push_back({std::string(key == std::string("date") ? "record date" : key), v});
  }
  d.key_value(kv);
  if (!r.assumptions.empty()) {
    d.paragraph("Assumptions of this record:");
    d.list(assumption_texts(r.assumptions));
  }
  d.section_end();
}

void comparison_section(RichDoc& d, const DeviationResult& r) {
  d.section_begin("comparison", r.delivered ? "Scheduled against delivered (model with the logged medium)"
                                            : "Scheduled against delivered (measured probe log)");
  TextTable t = {{"target", "F scheduled → delivered", "log reduction scheduled → delivered", "required",
                  "delivered margin", "verdict as scheduled", "verdict as delivered"}};
  std::vector<bool> met;
  for (const auto& tg : r.targets) {
    t.push_back({tg.name + " (" + std::string(to_string(tg.kind)) + ")",
                 tg.lethality ? minutes_down(tg.scheduled_F_s) + " → " + minutes_down(tg.delivered_F_s) : "-",
                 tg.scheduled_logs || tg.delivered_logs
                     ? logs_down(tg.scheduled_logs) + " → " + logs_down(tg.delivered_logs)
                     : "-",
                 tg.delivered.required_text, detail::margin_cell(tg.delivered),
                 std::string(verdict_word(tg.scheduled.verdict == Verdict::met)),
                 std::string(verdict_word(tg.verdict == Verdict::met))});
    met.push_back(tg.verdict == Verdict::met);
  }
  d.verdict_table(t, met);
  d.paragraph("F and log reductions are rounded down. Every target met as delivered: " +
              std::string(r.all_met_delivered ? "yes." : "NO."));
  d.section_end();
}

void probe_section(RichDoc& d, const DeviationResult& r) {
  if (!(r.probe && r.delivered)) return;  // probe only: the comparison above is the probe
  d.section_begin("probe", "Measured probe log");
  check_table(d, r.probe->targets);
  d.section_end();
}

void extra_hold_section(RichDoc& d, const DeviationResult& r, TempUnit u) {
  d.section_begin("extra-hold", "Additional time that restores the targets");
  if (r.extra_hold_s && *r.extra_hold_s == 0) {
    d.paragraph("None needed: every lethality target is met as delivered.");
  } else if (r.extra_hold_s) {
    d.statement("Additional time at the scheduled medium (" + temp(r.extension_medium_C, u) + ") in stage \"" +
                r.stage + "\": " + at_time(*r.extra_hold_s) + ", rounded up from " +
                fixed(*r.extra_hold_unrounded_s, 1) + " s.");
    if (r.restored) {
      d.paragraph("Forward re-run with the extension (" + at_time(r.restored->value) + "): " +
                  (r.restored->eval.all_met ? "every target met." : "NOT every target met."));
      check_table(d, *r.restored);
    }
    if (r.restored_one_unit_less) {
      d.paragraph("One unit less (" + at_time(r.restored_one_unit_less->value) + "):");
      check_table(d, *r.restored_one_unit_less);
    }
  } else {
    d.paragraph("None computed: " + (r.extra_hold_none == process::NoHoldReason::none
                                         ? std::string("no deviated stage")
                                         : no_hold_text(r.extra_hold_none, r)));
  }
  d.section_end();
}

void plot_section(RichDoc& d, const DeviationResult& r, const DeviationRecordInfo& i, TempUnit u) {
  d.figures(detail::deviation_figures(r, i, u));
}

/// --conservative: the worst case of the file's ranges beside the nominal record.
void conservative_section(RichDoc& d, const DeviationResult& nominal, const DeviationRecordInfo& i, TempUnit u) {
  if (!i.conservative) return;
  const process::ConservativeDeviation& c = *i.conservative;
  const DeviationResult& r = c.result;
  d.section_begin("conservative", "Conservative evaluation (documented worst case of the file's ranges)");
  d.paragraph("Choices applied together:");
  d.list(range_setting_texts(c.choices));
  if (const std::string why = initial_choice_text(c.initial); !why.empty()) d.paragraph("Initial temperature: " + why + ".");
  TextTable t = {{"target", "F scheduled → delivered (worst case)", "nominal delivered F", "delivered margin",
                  "verdict as delivered (worst case)"}};
  std::vector<bool> met;
  for (std::size_t k = 0; k < r.targets.size(); ++k) {
    const auto& tg = r.targets[k];
    const bool nom = k < nominal.targets.size() && nominal.targets[k].lethality;
    t.push_back({tg.name + " (" + std::string(to_string(tg.kind)) + ")",
                 tg.lethality ? minutes_down(tg.scheduled_F_s) + " → " + minutes_down(tg.delivered_F_s) : "-",
                 nom ? minutes_down(nominal.targets[k].delivered_F_s) : "-", detail::margin_cell(tg.delivered),
                 std::string(verdict_word(tg.verdict == Verdict::met))});
    met.push_back(tg.verdict == Verdict::met);
  }
  d.verdict_table(t, met);
  std::string hold;
  if (r.extra_hold_s && *r.extra_hold_s == 0) hold = "none needed";
  else if (r.extra_hold_s) hold = at_time(*r.extra_hold_s);
  else hold = "none computed" + (r.extra_hold_none == process::NoHoldReason::none
                                     ? std::string()
                                     : ": " + no_hold_text(r.extra_hold_none, r));
  d.paragraph("Every target met as delivered, worst case: " + std::string(r.all_met_delivered ? "yes" : "NO") +
              ". Additional time at the scheduled medium (" + temp(r.extension_medium_C, u) + "), worst case: " + hold +
              ".");
  TextTable alone = {{"choice alone", "delivered", "least margin", "additional time"}};
  for (const auto& a : c.alone) {
    std::string extra = "none computed";
    if (a.extra_hold_s && *a.extra_hold_s == 0) extra = "none needed";
    else if (a.extra_hold_s) extra = at_time(*a.extra_hold_s);
    alone.push_back({range_setting_text(a.choice), a.all_met_delivered ? "met" : "not demonstrated", fixed(a.least_margin, 4), extra});
  }
  d.table(alone);
  d.statement("Driven by: " + driven_by_text(c) + ".");
  d.section_end();
}

void notes_section(RichDoc& d, const DeviationResult& r) {
  if (r.notes.empty()) return;
  d.section_begin("notes", "Notes");
  d.list(deviation_note_texts(r.notes));
  d.section_end();
}

void disposition_section(RichDoc& d) {
  d.section_begin("disposition", "Disposition");
  d.statement(disposition_statement());  // the sign-off follows, before the cautions
  d.section_end();
}

void closing_sections(RichDoc& d, const DeviationResult& r, const DeviationRecordInfo& i) {
  std::vector<std::string> warns = i.warnings;
  if (r.delivered) {
    const auto engine_notes = history_warnings(r.delivered->history);
    warns.insert(warns.end(), engine_notes.begin(), engine_notes.end());
  }
  if (r.probe) for (const auto& w : r.probe->warnings) warns.push_back(assessment_warning_text(w));
  if (!warns.empty()) {
    d.section_begin("warnings", "Warnings");
    d.list(warns, true);
    d.section_end();
  }
  if (!i.provenance.empty()) {
    d.section_begin("provenance", "Provenance");
    d.key_value(i.provenance);
    d.section_end();
  }
}

void write_deviation_doc(RichDoc& d, const DeviationResult& r, const DeviationRecordInfo& i, TempUnit u) {
  d.begin("coldcore deviation record: lot " + lot_text(i) + " — " + i.product_name, detail::running_text(i.lot, i.provenance));
  d.verdict_summary(verdict_summary(r, i.conservative));
  record_section(d, r, i, u);
  comparison_section(d, r);
  probe_section(d, r);
  extra_hold_section(d, r, u);
  plot_section(d, r, i, u);
  conservative_section(d, r, i, u);
  notes_section(d, r);
  disposition_section(d);
  closing_sections(d, r, i);
  d.end(cautions());
}

}  // namespace

static void write_deviation_html_unrendered(const DeviationResult& r, const DeviationRecordInfo& i, std::ostream& out, TempUnit u);

void write_deviation_html(const DeviationResult& r, const DeviationRecordInfo& i, std::ostream& out, TempUnit u) {
  write_rendered(out, u, [&](std::ostream& o) { write_deviation_html_unrendered(r, i, o, u); });
}

static void write_deviation_html_unrendered(const DeviationResult& r, const DeviationRecordInfo& i, std::ostream& out, TempUnit u) {
  const auto d = detail::html_doc(out);
  write_deviation_doc(*d, r, i, u);
}

static MarkdownReport write_deviation_markdown_unrendered(const DeviationResult& r, const DeviationRecordInfo& i, TempUnit u, std::string_view svg_basename);

MarkdownReport write_deviation_markdown(const DeviationResult& r, const DeviationRecordInfo& i, TempUnit u, std::string_view svg_basename) {
  return rendered(write_deviation_markdown_unrendered(r, i, u, svg_basename), u);
}

static MarkdownReport write_deviation_markdown_unrendered(const DeviationResult& r, const DeviationRecordInfo& i, TempUnit u,
                                        std::string_view svg_basename) {
  MarkdownReport rep;
  std::ostringstream o;
  const auto d = detail::md_doc(o, svg_basename, rep.svg_files);
  write_deviation_doc(*d, r, i, u);
  rep.markdown = o.str();
  return rep;
}

}  // namespace coldcore
