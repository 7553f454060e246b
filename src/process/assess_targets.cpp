#include "process/detail/assessed_curve.hpp"

#include "coldcore/error.hpp"

namespace coldcore::assessing {

namespace {

void append(std::vector<TargetNote>& to, std::vector<TargetNote>& from) {
  for (auto& n : from) to.push_back(std::move(n));
}

}  // namespace

AssessedTargets assess_targets(const AssessedCurve& curve, const std::vector<Target>& targets,
                               const OrganismLibrary& organisms, const RuleLibrary& rules,
                               const AssessOptions& opts) {
  AssessedTargets out;
  for (std::size_t i = 0; i < targets.size(); ++i) {
    const Target& t = targets[i];
    const std::string place = opts.origin + ": target[" + std::to_string(i + 1) + "]";
    TargetResult r;
    r.kind = t.kind;
    r.name = label_of(t);
    if (t.at != "centre" && t.at != "mean")
      throw InputError(place + ".at = \"" + t.at + "\": must be \"centre\" or \"mean\"");
    switch (t.kind) {
      case TargetKind::log_reduction:
      case TargetKind::f_value: {
        const Resolved res = resolve(t, place, organisms);
        r.kinetics = res.k;
        r.column = "F_" + r.name + "_min";
        r.source = res.k.source;
        LethalityEvidence e = curve.lethality(t, res, place);
        r.F_s = e.F_s;
        r.stages = std::move(e.stages);
        r.credited_stages = std::move(e.credited_stages);
        r.unrecorded_s = std::move(e.unrecorded_s);
        r.F_outside_range_s = e.F_outside_range_s;
        append(r.notes, e.notes);
        for (auto& w : e.warnings) out.warnings.push_back(std::move(w));
        lethality_verdict(r, t, res, opts, place, e.F_error_s);
        provenance_notes(r, res);
        if (e.share_base_s > 0 && e.F_outside_range_s > opts.out_of_range_flag_fraction * e.share_base_s)
          r.notes.push_back(outside_range_note(e.F_outside_range_s / e.share_base_s, res.k));
        if (e.rules) out.rules.push_back(std::move(*e.rules));
        break;
      }
      case TargetKind::cooling_rule: {
        CoolingEvidence e = curve.cooling(t, rules.at(t.rule, place));
        cooling_result(r, e.check, rules.at(t.rule, place), e.error);
        append(r.notes, e.notes);
        break;
      }
      case TargetKind::cooking_table: {
        CookingEvidence e = curve.cooking(t, cooking_table_for(t, place, opts));
        cooking_result(r, e.check, e.fraction_uncertainty);
        append(r.notes, e.notes);
        break;
      }
      case TargetKind::centre_min_temperature: {
        MinTemperatureEvidence e = curve.min_temperature(t);
        min_temperature_result(r, t, e.curve, e.error, e.gaps);
        append(r.notes, e.notes);
        break;
      }
    }
    out.targets.push_back(std::move(r));
  }
  return out;
}

}  // namespace coldcore::assessing
