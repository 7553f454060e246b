#pragma once
/// Builds the report model of `coldcore run` from the model that was evaluated and the computed
/// history (and, once lethality is assessed, the verdicts). No physics is recomputed here
/// except sampling the engine's exact evaluation at the output times. What ran (each stage's h,
/// how it ended) is read from the history's StageRecords, never from the file.
#include <string>

#include "coldcore/conduction/history.hpp"
#include "coldcore/process/assessment.hpp"
#include "coldcore/model/calibration.hpp"
#include "coldcore/model/scenario.hpp"
#include "coldcore/process/inverse.hpp"
#include "coldcore/report/run_report.hpp"

namespace coldcore {

struct RunReportOptions {
  double step_s = 60;      ///< output sampling; > 0. Rows also at every stage boundary and the end.
  std::string date;        ///< report date for provenance (fixed in tests for reproducibility)
  std::string version;     ///< tool version for provenance
};

/// Characteristic length V/A of the product, m (for the lumped-capacitance Biot number).
double volume_to_area_m(const Product& p);
/// Biot number on Lc = V/A: h·(V/A)/k. The one Bi the run report shows (table, notes, reading).
/// REQUIRES h_W_m2K > 0 finite, conductivity > 0.
double biot_volume_to_area(const Product& p, double h_W_m2K);
/// Plain-words note on what a stage's Bi(V/A) means, by regime: < 0.1 lumped capacitance is fair;
/// 0.1 to 1 the surface resistance dominates but the centre still lags; > 1 the resistance inside
/// dominates (Bi = inside / surface resistance; lumped criterion on V/A, REFERENCES 3.2).
std::string biot_note(const Product& p, const Stage& s);

/// Where the run's inputs came from (provenance), and what their reader warned about.
struct InputSource {
  std::string origin;      ///< the file as given
  std::string sha256_hex;  ///< of its bytes
  std::vector<std::string> warnings;
};

/// The run report of `history`, the history of `model` (its first h scenario where stages take
/// h ranges: the stage table shows the h each stage ran with, from history.stages).
RunReport build_run_report(const Scenario& model, const InputSource& source, const History& history,
                           const RunReportOptions& opts);

/// Adds the assessment: one verdict row per target (with per-stage F shares, cooling-rule steps
/// and flags as details), a cumulative F_<name>_min column per lethality target sampled at the
/// report's rows, the required F lines and the cooling-rule boxes for the plots.
void add_assessment(RunReport& report, const History& history, const Assessment& assessment,
                    const std::vector<Target>& targets);
/// The same with each target's own history (the h scenario it was evaluated on,
/// process/h_ends.hpp): history_of[i] for assessment.targets[i]. The report's rows are the first
/// target's scenario; add_scenarios adds every scenario's own. REQUIRES history_of.size() == assessment.targets.size().
void add_assessment(RunReport& report, const std::vector<const History*>& history_of, const Assessment& assessment,
                    const std::vector<Target>& targets);

/// Which h each per-target-range stage used, for which targets and why, as report assumptions
/// (every format shows them); when the targets were split, also that every verdict names its
/// scenario and the report shows each scenario's history.
void add_h_assumptions(RunReport& report, const process::Evaluation& e);

/// A calibrated product: each verdict row gets its target at the one-sided 95 % bound of the
/// fit (process/fit_bound.hpp; at_bound[i] is target i, in the verdict rows' order), a detail
/// line saying it, an assumption naming the calibration, and a warning for every target met
/// nominally but not at the bound.
void add_fit_bound(RunReport& report, const std::vector<TargetResult>& at_bound, const Calibration& c);

/// When the targets were split over h scenarios (e.h_scenarios.size() > 1): one ScenarioView per
/// scenario from the histories evaluate made (sampled every `step_s` (> 0) and at every stage
/// end; no re-run), its label from its h choices, the F columns / required lines / rule boxes of
/// its own targets; and each verdict row names its scenario. Stage Bi on V/A of `*p` (null: the
/// engine's records, on the smallest half-dimension, as build_rerun_report's stage rows).
/// REQUIRES report.verdicts parallel to e.assessment.targets (add_assessment first).
void add_scenarios(RunReport& report, const process::Evaluation& e, const Product* p,
                   const std::vector<Target>& targets, double step_s = 60);

/// The report model of one forward re-run, for the plots of other verbs' rich reports (solve's
/// verification, deviation's scheduled and delivered runs): stage rows from the history's own
/// records (no medium text or Biot notes), the history sampled every `step_s` (> 0) and at every
/// stage end, then add_assessment (F columns, required lines, rule boxes). No product rows,
/// provenance or lumped-capacitance column. Sampling only: the history and assessment are the
/// ones the process layer computed.
RunReport build_rerun_report(const History& history, const Assessment& assessment,
                             const std::vector<Target>& targets, double step_s = 60);

/// The same from an Evaluation: each target's F column from the history of the h scenario it was
/// evaluated on (process/h_ends.hpp) and, when the targets were split, add_scenarios (every
/// scenario's history and plots; stage Bi of those views on V/A of `p`, else the engine's).
RunReport build_rerun_report(const process::Evaluation& e, const std::vector<Target>& targets, double step_s = 60,
                             const Product* p = nullptr);

/// Verdict row of one target, shared by every verb that reports targets.
VerdictRow verdict_row(const TargetResult& t);

}  // namespace coldcore
