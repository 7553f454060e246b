#include <algorithm>
#include <cmath>
#include <ostream>

#include "coldcore/process/assessment.hpp"
#include "coldcore/report/conservative_text.hpp"
#include "coldcore/report/process_notes.hpp"
#include "coldcore/report/target_notes.hpp"
#include "coldcore/report/cautions.hpp"
#include "coldcore/report/deviation_report.hpp"
#include "coldcore/report/json.hpp"
#include "coldcore/report/json_contract.hpp"
#include "coldcore/report/solve_report.hpp"
#include "coldcore/report/verdict_summary.hpp"
#include "coldcore/report/history_notes.hpp"
#include "coldcore/report/temperature_text.hpp"

namespace coldcore {

namespace {

using process::DeviationResult;
using process::DeviationTarget;

std::string temp(double c, TempUnit u, int d = 2) { return fixed(display_temp(c, u), d) + " " + std::string(unit_symbol(u)); }

void json_opt(JsonWriter& w, const char* k, const std::optional<double>& v) {
  w.key(k);
  if (v) w.value(*v); else w.null();
}

std::string hold_text(const DeviationResult& d) {
  if (d.extra_hold_s && *d.extra_hold_s == 0) return "none needed";
  if (d.extra_hold_s) return duration_text(*d.extra_hold_s) + " (" + fixed(*d.extra_hold_s, 0) + " s)";
  return "none computed: " + no_hold_text(d.extra_hold_none, d);
}

void text_conservative(const process::ConservativeDeviation& c, const DeviationResult& nominal, std::ostream& out,
                       TempUnit u) {
  const DeviationResult& r = c.result;
  out << "\nCONSERVATIVE (documented worst case of the file's ranges, model with the logged medium)\n  choices:";
  for (const auto& ch : range_setting_texts(c.choices)) out << " " << ch << ";";
  out << "\n";
  if (const std::string why = initial_choice_text(c.initial); !why.empty())
    out << "  initial temperature: " << why << "\n";
  for (std::size_t k = 0; k < r.targets.size(); ++k) {
    const DeviationTarget& t = r.targets[k];
    out << "  " << t.name << " (" << to_string(t.kind) << ")\n";
    if (t.lethality) {
      out << "    F scheduled " << minutes_down(t.scheduled_F_s) << ", delivered " << minutes_down(t.delivered_F_s);
      if (k < nominal.targets.size() && nominal.targets[k].lethality)
        out << " (nominal delivered " << minutes_down(nominal.targets[k].delivered_F_s) << ")";
      out << "\n";
    }
    out << "    scheduled: " << t.scheduled.verdict_text << "\n    delivered: " << t.delivered.verdict_text << "\n";
  }
  out << "  every target met as delivered, worst case: " << (r.all_met_delivered ? "yes" : "NO") << "\n";
  out << "  additional time at the scheduled medium (" << temp(r.extension_medium_C, u) << "), worst case: "
      << hold_text(r) << "\n";
  for (const auto& a : c.alone) {
    out << "  alone: " << range_setting_text(a.choice) << " -> delivered " << (a.all_met_delivered ? "met" : "NOT met") << ", least margin "
        << fixed(a.least_margin, 4) << ", additional time ";
    if (a.extra_hold_s && *a.extra_hold_s == 0) out << "none needed";
    else if (a.extra_hold_s) out << fixed(*a.extra_hold_s, 0) << " s";
    else out << "none computed";
    out << "\n";
  }
  out << "  driven by: " << driven_by_text(c) << "\n";
  // Only what the nominal record does not already say.
  const auto fresh = []<class T>(const std::vector<T>& v, const std::vector<T>& nominal_v) {
    std::vector<T> out_v;
    for (const auto& x : v)
      if (std::find(nominal_v.begin(), nominal_v.end(), x) == nominal_v.end()) out_v.push_back(x);
    return out_v;
  };
  for (const auto& n : deviation_note_texts(fresh(r.notes, nominal.notes))) out << "  - " << n << "\n";
  for (const auto& n : assumption_texts(fresh(r.assumptions, nominal.assumptions))) out << "  - assumption: " << n << "\n";
}

/// Per target scheduled against delivered, then the extra hold: the same keys for the nominal
/// record and for its conservative worst case.
void json_targets_and_hold(JsonWriter& w, const DeviationResult& r, TempUnit u) {
  w.key("targets").begin_array();
  for (const auto& t : r.targets) {
    w.begin_object();
    w.key("name").value(t.name);
    w.key("kind").value(to_string(t.kind));
    if (t.lethality) {
      w.key("scheduled_F_min").value(t.scheduled_F_s / 60.0);
      w.key("delivered_F_min").value(t.delivered_F_s / 60.0);
      w.key("F_required_min").value(t.delivered.F_required_s / 60.0);
      if (t.scheduled_logs) w.key("scheduled_log_reduction").value(*t.scheduled_logs);
      if (t.delivered_logs) w.key("delivered_log_reduction").value(*t.delivered_logs);
    } else {
      w.key("scheduled_F_min").null();
      w.key("delivered_F_min").null();
    }
    w.key("verdict").value(to_string(t.verdict));
    w.key("met").value(t.verdict == Verdict::met);  // as delivered
    w.key("scheduled_verdict").value(to_string(t.scheduled.verdict));
    w.key("margin_unit").value(raw_unit(t.delivered));  // of delivered_margin and its uncertainty
    w.key("delivered_margin").value(t.delivered.margin);
    w.key("delivered_margin_uncertainty").value(t.delivered.margin_uncertainty);
    w.key("delivered_verdict_text").value(t.delivered.verdict_text);
    w.key("scheduled_verdict_text").value(t.scheduled.verdict_text);
    if (t.delivered.cooling) write_cooling_steps_json(w, *t.delivered.cooling);  // as delivered
    w.end_object();
  }
  w.end_array();
  w.key("all_met_delivered").value(r.all_met_delivered);
  json_opt(w, "extra_hold_s", r.extra_hold_s);
  json_opt(w, "extra_hold_unrounded_s", r.extra_hold_unrounded_s);
  w.key("extension_medium_" + std::string(unit_suffix(u))).value(display_temp(r.extension_medium_C, u));
  if (r.extra_hold_none != process::NoHoldReason::none)
    w.key("extra_hold_note").value(no_hold_text(r.extra_hold_none, r));
}

void json_conservative(JsonWriter& w, const process::ConservativeDeviation& c, TempUnit u) {
  const DeviationResult& r = c.result;
  w.key("conservative").begin_object();
  w.key("choices").value(range_setting_texts(c.choices));
  w.key("initial_reason").value(initial_choice_text(c.initial));
  json_targets_and_hold(w, r, u);
  w.key("alone").begin_array();
  for (const auto& a : c.alone) {
    w.begin_object();
    w.key("choice").value(range_setting_text(a.choice));
    w.key("all_met_delivered").value(a.all_met_delivered);
    w.key("least_margin").value(a.least_margin);
    json_opt(w, "extra_hold_s", a.extra_hold_s);
    if (a.extra_hold_none != process::NoHoldReason::none)
      w.key("extra_hold_note").value(no_hold_text(a.extra_hold_none, r));
    w.end_object();
  }
  w.end_array();
  w.key("driven_by").value(driven_by_text(c));
  w.key("notes").value(deviation_note_texts(r.notes));
  w.key("assumptions").value(assumption_texts(r.assumptions));
  w.end_object();
}

}  // namespace

const std::string& disposition_statement() {
  static const std::string s =
      "The disposition of the product (release, reprocess, hold or destroy) is for the process authority to "
      "decide; this record computes delivered lethality and does not decide it.";
  return s;
}

static void write_deviation_text_unrendered(const DeviationResult& r, const DeviationRecordInfo& i, std::ostream& out, TempUnit u);

void write_deviation_text(const DeviationResult& r, const DeviationRecordInfo& i, std::ostream& out, TempUnit u) {
  write_rendered(out, u, [&](std::ostream& o) { write_deviation_text_unrendered(r, i, o, u); });
}

static void write_deviation_text_unrendered(const DeviationResult& r, const DeviationRecordInfo& i, std::ostream& out, TempUnit u) {
  out << "coldcore deviation: " << i.product_name << "\n\n";
  write_summary_text(out, verdict_summary(r, i.conservative));
  out << "DEVIATION RECORD\n";
  out << "  lot:                 " << (i.lot.empty() ? "(not given)" : i.lot) << "\n";
  if (!r.stage.empty()) {
    out << "  deviated stage:      " << r.stage << " (starts " << duration_text(r.stage_start_s) << " into the process; "
        << (r.stage_heats ? "heats" : "cools") << ")\n";
    if (r.events.empty()) {
      out << "  deviation:           " << no_deviation_text(r) << "\n";
    } else {
      out << "  deviations:          " << r.events.size() << " (times from the stage start)\n";
      for (std::size_t n = 0; n < r.events.size(); ++n)
        out << "    " << n + 1 << ". " << deviation_event_text(r.events[n], u, i.medium_log_start_unix_s) << "\n";
    }
    if (r.extension_given_s) {
      out << "  hold extension:      the log runs " << duration_text(*r.extension_given_s) << " ("
          << fixed(*r.extension_given_s, 0) << " s) past the scheduled end, credited as delivered; ";
      if (r.extension_needed_s)
        out << (*r.extension_needed_s == 0 ? std::string("none of it was needed")
                                           : duration_text(*r.extension_needed_s) + " (" +
                                                 fixed(*r.extension_needed_s, 0) + " s) at the scheduled medium was needed")
            << "\n";
      else
        out << "the extension needed is not known: " << no_hold_text(r.extension_needed_none, r) << "\n";
    }
    out << "  medium log:          " << i.medium_log << "\n  medium log SHA-256:  " << i.medium_log_sha256 << "\n";
  }
  if (!i.probe_log.empty())
    out << "  probe log:           " << i.probe_log << "\n  probe log SHA-256:   " << i.probe_log_sha256 << "\n";
  for (const auto& kv : i.provenance) out << "  " << kv.key << ": " << kv.value << "\n";

  out << "\nSCHEDULED AGAINST DELIVERED" << (r.delivered ? " (model with the logged medium)" : " (measured probe)") << "\n";
  for (const auto& t : r.targets) {
    out << "  " << t.name << " (" << to_string(t.kind) << ")\n";
    if (t.lethality) {
      out << "    F scheduled " << minutes_down(t.scheduled_F_s) << ", delivered " << minutes_down(t.delivered_F_s);
      if (t.scheduled_logs && t.delivered_logs)
        out << "; log reduction scheduled " << shown_log_reduction(*t.scheduled_logs) << ", delivered "
            << shown_log_reduction(*t.delivered_logs);
      out << "\n";
    }
    out << "    scheduled: " << t.scheduled.verdict_text << "\n    delivered: " << t.delivered.verdict_text
        << " (required " << t.delivered.required_text << ", achieved " << t.delivered.achieved_text << ")\n";
  }
  if (r.probe && r.delivered) {
    out << "  measured probe log:\n";
    for (const auto& t : r.probe->targets) out << "    " << t.name << ": " << t.verdict_text << "\n";
  }
  out << "\n  every target met as delivered: " << (r.all_met_delivered ? "yes" : "NO") << "\n";
  if (r.extra_hold_s && *r.extra_hold_s == 0) {
    out << "  additional time at the scheduled medium: none needed (every lethality target met as delivered)\n";
  } else if (r.extra_hold_s) {
    out << "  additional time at the scheduled medium (" << temp(r.extension_medium_C, u) << ") in stage \"" << r.stage
        << "\" that restores every lethality target: " << duration_text(*r.extra_hold_s) << " (" << fixed(*r.extra_hold_s, 0)
        << " s, rounded up from " << fixed(*r.extra_hold_unrounded_s, 1) << " s)\n";
    if (r.restored) {
      out << "    re-run with the extension:";
      for (const auto& t : r.restored->eval.assessment.targets) out << " " << t.name << " " << t.verdict_text << ";";
      out << "\n";
    }
    if (r.restored_one_unit_less) {
      out << "    one unit less (" << fixed(r.restored_one_unit_less->value, 0) << " s):";
      for (const auto& t : r.restored_one_unit_less->eval.assessment.targets) out << " " << t.name << " " << t.verdict_text << ";";
      out << "\n";
    }
  } else if (r.extra_hold_none != process::NoHoldReason::none) {
    out << "  additional time: none computed: " << no_hold_text(r.extra_hold_none, r) << "\n";
  }
  if (!r.notes.empty()) {
    out << "\nNOTES\n";
    for (const auto& n : deviation_note_texts(r.notes)) out << "  - " << n << "\n";
  }
  if (i.conservative) text_conservative(*i.conservative, r, out, u);
  std::vector<std::string> warns = i.warnings;
  if (r.delivered) {
    const auto engine_notes = history_warnings(r.delivered->history);
    warns.insert(warns.end(), engine_notes.begin(), engine_notes.end());
  }
  if (r.probe) for (const auto& w : r.probe->warnings) warns.push_back(assessment_warning_text(w));
  if (!warns.empty()) {
    out << "\nWARNINGS\n";
    for (const auto& n : warns) out << "  ! " << n << "\n";
  }
  out << "\nASSUMPTIONS\n";
  for (const auto& n : assumption_texts(r.assumptions)) out << "  - " << n << "\n";
  out << "\nDISPOSITION\n  " << disposition_statement() << "\n\n";
  write_sign_off_text(out);
  out << "CAUTIONS\n";
  for (const auto& cau : cautions()) out << "  * " << cau << "\n";
}

static void write_deviation_json_unrendered(const DeviationResult& r, const DeviationRecordInfo& i, std::ostream& out, TempUnit u);

void write_deviation_json(const DeviationResult& r, const DeviationRecordInfo& i, std::ostream& out, TempUnit u) {
  write_rendered(out, u, [&](std::ostream& o) { write_deviation_json_unrendered(r, i, o, u); });
}

static void write_deviation_json_unrendered(const DeviationResult& r, const DeviationRecordInfo& i, std::ostream& out, TempUnit u) {
  JsonWriter w(out);
  w.begin_object();
  write_json_envelope(w, "deviation", u);
  w.key("product").value(i.product_name);
  write_summary_json(w, verdict_summary(r, i.conservative));
  if (i.lot.empty()) w.key("lot").null(); else w.key("lot").value(i.lot);
  if (r.stage.empty()) w.key("stage").null(); else w.key("stage").value(r.stage);
  w.key("stage_start_s").value(r.stage_start_s);
  w.key("stage_heats").value(r.stage_heats);
  w.key("scheduled_stage_s").value(r.scheduled_stage_s);
  w.key("delivered_stage_s").value(r.delivered_stage_s);
  w.key("deviations").begin_array();
  for (const auto& e : r.events) {
    w.begin_object();
    w.key("kind").value(std::string(to_string(e.kind)));
    w.key("start_s").value(e.start_s);
    w.key("end_s").value(e.end_s);
    if (e.kind == process::DeviationKind::medium_colder || e.kind == process::DeviationKind::medium_warmer) {
      const std::string us(unit_suffix(u));
      w.key("extreme_" + us).value(display_temp(e.extreme_C, u));
      w.key("extreme_at_s").value(e.extreme_at_s);
      w.key("scheduled_at_extreme_" + us).value(display_temp(e.scheduled_at_extreme_C, u));
      w.key("departure_K").value(e.departure_K);
    }
    w.key("description").value(deviation_event_text(e, u, i.medium_log_start_unix_s));
    w.end_object();
  }
  w.end_array();
  w.key("deviation_times_from").value("the start of the deviated stage");
  json_opt(w, "extension_given_s", r.extension_given_s);
  json_opt(w, "extension_needed_s", r.extension_needed_s);
  if (r.extension_needed_none != process::NoHoldReason::none)
    w.key("extension_needed_note").value(no_hold_text(r.extension_needed_none, r));
  json_targets_and_hold(w, r, u);
  w.key("restored");
  if (r.restored) {
    w.begin_object();
    w.key("value_s").value(r.restored->value);
    w.key("all_met").value(r.restored->eval.all_met);
    w.key("targets").begin_array();
    for (const auto& t : r.restored->eval.assessment.targets) write_target_json(w, t);
    w.end_array();
    w.end_object();
  } else {
    w.null();
  }
  if (r.probe) {
    w.key("probe").begin_object();
    w.key("all_met").value(r.probe->all_met());
    w.key("targets").begin_array();
    for (const auto& t : r.probe->targets) write_target_json(w, t);
    w.end_array();
    w.key("warnings").value(assessment_warning_texts(r.probe->warnings));
    w.end_object();
  }
  w.key("record").begin_object();
  w.key("lot").value(i.lot.empty() ? std::string("(not given)") : i.lot);
  w.key("medium_log").value(i.medium_log);
  w.key("medium_log_sha256").value(i.medium_log_sha256);
  w.key("probe_log").value(i.probe_log);
  w.key("probe_log_sha256").value(i.probe_log_sha256);
  w.key("reviewer_name").value("");
  w.key("review_date").value("");
  w.key("decision").value("");
  w.end_object();
  if (i.conservative) json_conservative(w, *i.conservative, u);
  w.key("disposition").value(disposition_statement());
  w.key("notes").value(deviation_note_texts(r.notes));
  w.key("assumptions").value(assumption_texts(r.assumptions));
  w.key("warnings").value(i.warnings);
  w.key("provenance");
  write_labelled_object(w, i.provenance);
  w.key("cautions").value(cautions());
  w.end_object();
  out << "\n";
}

}  // namespace coldcore
