// The verdict summary: counted once from the verdicts a report shows, placed by every writer.
#include "coldcore/report/verdict_summary.hpp"

#include <cctype>
#include <ostream>

#include "coldcore/report/json.hpp"
#include "rich_page.hpp"

namespace coldcore {

namespace {

std::string targets_word(int n) { return n == 1 ? "target" : "targets"; }

std::string part_text(const VerdictCount& c) {
  if (c.no_answer) return "no answer, so no verdict";
  if (c.targets == 0) return "no target given: no verdict";
  if (c.not_demonstrated == 0)
    return c.targets == 1 ? "1 of 1 target met" : "all " + std::to_string(c.targets) + " targets met";
  std::string s = std::to_string(c.not_demonstrated) + " of " + std::to_string(c.targets) + " " +
                  targets_word(c.targets) + " NOT DEMONSTRATED: ";
  for (std::size_t i = 0; i < c.not_met.size(); ++i) {
    const SummaryItem& it = c.not_met[i];
    s += (i ? ", " : "") + it.name;
    if (!it.why.empty() && it.why != "-") s += " (" + it.why + ")";
  }
  return s;
}

std::vector<SummaryItem> items_of(const std::vector<TargetResult>& targets) {
  std::vector<SummaryItem> items;
  for (const auto& t : targets) items.push_back({t.name, t.verdict == Verdict::met, detail::margin_cell(t)});
  return items;
}

std::vector<SummaryItem> items_of(const process::DeviationResult& r) {
  std::vector<SummaryItem> items;
  // the delivered verdict and its margin cell, as the comparison tables show them
  for (const auto& t : r.targets) items.push_back({t.name, t.verdict == Verdict::met, detail::margin_cell(t.delivered)});
  return items;
}

void json_count(JsonWriter& w, const VerdictCount& c) {
  w.key("scope").value(c.scope);
  w.key("targets").value(c.targets);
  w.key("met").value(c.met);
  w.key("not_demonstrated").value(c.not_demonstrated);
  std::vector<std::string> names;
  for (const auto& it : c.not_met) names.push_back(it.name);
  w.key("not_demonstrated_targets").value(names);
}

}  // namespace

VerdictCount count_verdicts(const std::vector<SummaryItem>& items, std::string scope) {
  VerdictCount c;
  c.scope = std::move(scope);
  for (const auto& it : items) {
    ++c.targets;
    if (it.met) {
      ++c.met;
    } else {
      ++c.not_demonstrated;
      c.not_met.push_back(it);
    }
  }
  return c;
}

VerdictSummary summarize_verdicts(std::vector<VerdictCount> parts) {
  VerdictSummary s;
  s.parts = std::move(parts);
  s.all_met = !s.parts.empty();
  for (const auto& p : s.parts) {
    if (p.no_answer || p.targets == 0 || p.not_demonstrated > 0) s.all_met = false;
    std::string text = p.scope.empty() ? part_text(p) : p.scope + ": " + part_text(p);
    if (s.sentence.empty() && !text.empty()) text[0] = static_cast<char>(std::toupper(static_cast<unsigned char>(text[0])));
    s.sentence += (s.sentence.empty() ? "" : "; ") + text;
  }
  return s;
}

VerdictSummary verdict_summary(const RunReport& r) {
  std::vector<SummaryItem> items;
  for (const auto& v : r.verdicts) items.push_back({v.name, v.met, v.margin});
  return summarize_verdicts({count_verdicts(items)});
}

VerdictSummary verdict_summary(const process::SolveResult& r, const process::ConservativeSolve* worst) {
  std::vector<VerdictCount> parts = {count_verdicts(items_of(r.verification.eval.assessment.targets), "at the answer to use")};
  if (worst) {
    if (worst->result) {
      parts.push_back(count_verdicts(items_of(worst->result->verification.eval.assessment.targets),
                                     "worst case of the file's ranges"));
    } else {
      VerdictCount none;
      none.scope = "worst case of the file's ranges";
      none.no_answer = true;
      parts.push_back(none);
    }
  }
  return summarize_verdicts(std::move(parts));
}

VerdictSummary verdict_summary(const process::DeviationResult& r, const process::ConservativeDeviation* worst) {
  std::vector<VerdictCount> parts = {count_verdicts(items_of(r), "as delivered")};
  if (worst) parts.push_back(count_verdicts(items_of(worst->result), "worst case of the file's ranges"));
  return summarize_verdicts(std::move(parts));
}

void write_summary_text(std::ostream& out, const VerdictSummary& s) {
  out << "Verdict summary: " << s.sentence << "\n\n";
}

void write_summary_json(JsonWriter& w, const VerdictSummary& s) {
  w.key("verdict_summary").begin_object();
  w.key("sentence").value(s.sentence);
  w.key("all_met").value(s.all_met);
  json_count(w, s.main());
  if (s.parts.size() > 1) {
    w.key("worst_case").begin_object();
    json_count(w, s.parts[1]);
    w.key("no_answer").value(s.parts[1].no_answer);
    w.end_object();
  }
  w.end_object();
}

void write_summary_csv(std::ostream& out, const VerdictSummary& s) { out << "# verdict summary: " << s.sentence << "\n"; }

std::string summary_stderr_line(std::string_view verb, const VerdictSummary& s, std::string_view out_path) {
  return "coldcore " + std::string(verb) + ": " + s.sentence + "; report written to " + std::string(out_path);
}

}  // namespace coldcore
