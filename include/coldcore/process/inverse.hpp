#pragma once
/// Inverse questions on a product file's process: the forward model (simulate + assess) wrapped
/// by the root finder of process/solve.hpp. No physics is duplicated here.
///
/// Questions (answers in SI):
///  hold-time   shortest duration (s) of a stage (default: the last heating stage) so that every
///              lethality target (log-reduction, F-value; centre-min-temperature too) is met, each
///              with its own stage credit (Target::stages; by default every stage counts).
///              An until_* stage is turned into a fixed-duration stage for the question.
///  chill-time  duration (s) of a chilling stage (default: the last cooling stage) that brings the
///              centre (or, with `mean`, the mass average) to the end temperature (the stage's
///              until_* value, or `end_C`); cooling-rule verdicts of the rounded schedule beside it.
///  max-size    largest characteristic dimension (m; diameter, thickness, or the smallest edge of
///              a brick scaled alone) for which the scheduled process still meets every target.
///  min-medium  lowest constant medium temperature (°C) of a stage (default: the last heating
///              stage) for which every target is met.
/// Every answer is rounded toward the safe side to a unit (hold/chill: UP to unit_s; size: DOWN
/// to unit_m; medium: UP to unit_C), re-run forward, and the re-run's verdicts are returned beside
/// it; the value one unit on the unsafe side is re-run as well and must not meet every target
/// (when it does, the answer was limited by a bound and a note says so).
/// The margin of one target for the root finder: lethality F/F_required − 1; other targets
/// margin/required (required 0: margin in the target's unit); each less its error bound
/// (TargetResult::margin_uncertainty, relative likewise); clamped so that its sign agrees
/// with the verdict (met only when the margin is > 0). The process margin is the minimum.
/// NoSolution (with the reason) when no value within the bounds meets the targets.
#include <optional>
#include <string>
#include <vector>

#include "coldcore/process/process_notes.hpp"
#include "coldcore/conduction/history.hpp"
#include "coldcore/lethality/organisms.hpp"
#include "coldcore/process/cooling.hpp"
#include "coldcore/process/h_ends.hpp"
#include "coldcore/model/product.hpp"
#include "coldcore/model/stages.hpp"
#include "coldcore/process/solve.hpp"
#include "coldcore/model/targets.hpp"
#include "coldcore/process/assessment.hpp"

namespace coldcore::process {

struct Libraries {
  const OrganismLibrary* organisms = nullptr;  ///< REQUIRES non-null
  const RuleLibrary* rules = nullptr;          ///< REQUIRES non-null
  const CookingTables* cooking = nullptr;      ///< needed only by cooking-table targets
};

/// One scenario of h choices and the targets evaluated on it (process/h_ends.hpp).
struct HScenarioRun {
  std::vector<int> targets;
  std::vector<HChoice> choices;
  History history;
};

/// One forward run: history, assessment and the process margin over `considered` targets.
struct Evaluation {
  /// The history of the (first) scenario; with per-target h ranges that split the targets, the
  /// scenario of the first target's group (the others in h_scenarios).
  History history;
  Assessment assessment;
  double margin = 0;          ///< min over considered targets (> 0 iff all considered are met)
  bool all_met = false;       ///< every target (considered or not) met
  bool considered_met = false;
  /// Filled only when the targets were split over two or more h scenarios; then every target's
  /// result comes from the scenario holding it (target_scenario[i] indexes h_scenarios).
  std::vector<HScenarioRun> h_scenarios;
  std::vector<int> target_scenario;
  /// Which h each per-target-range stage took, for which targets and why (also when not split).
  std::vector<HUse> h_uses;
};

/// Margin of one target result as described above.
double target_margin(const TargetResult& r);

/// Runs simulate + assess, once per h scenario (Scenario::per_target_h, process/h_ends.hpp).
/// `considered`: indices of targets entering the margin (empty = all).
Evaluation evaluate(const Scenario& s, const Libraries& libs, const std::vector<int>& considered = {},
                    const HistoryOptions& hopts = {});

/// Adds to `notes` (once each) which h every per-target-range stage took and, when the targets
/// were split over h scenarios, that the result is the least favourable over them.
void add_h_notes(const Evaluation& e, std::vector<ProcessNote>& notes);

/// Engine options used while SEARCHING (root-finder trials, stage classification, bracket
/// guesses): tol_K 1e-3 K, sample_tol_K 0.05 K — a brick costs far less at these. Answers are
/// never taken from a search run alone: every reported re-run (verification, one unit less,
/// restored) uses the default HistoryOptions, and a rounded answer that fails there is stepped.
HistoryOptions search_history_options();

/// Index of the last stage whose medium, at its end, is above the centre at the stage's start
/// (a heating stage); of the last stage whose medium is below the centre (cooling) for
/// `heating == false`. Found by one forward run. NoSolution when there is none.
int default_stage(const Scenario& s, bool heating);
/// Index of the stage named `name`; InputError listing the stage names otherwise.
int stage_index(const Scenario& s, const std::string& name, const std::string& place);

enum class Question { hold_time, chill_time, max_size, min_medium };
const char* to_string(Question q);  ///< "hold-time" | "chill-time" | "max-size" | "min-medium"
/// A value of the parameter question q solves for, with its unit: "840 s", "38 mm", or a
/// temperature token (model/temperature_token.hpp). For messages and notes.
std::string parameter_text(Question q, double x);

/// Options of the inverse questions. Defaults in brackets.
struct SolveOptions {
  std::string stage;           ///< stage name; empty = the question's default stage
  double unit_s = 60;          ///< hold/chill rounding unit, s [60]
  double unit_m = 0.001;       ///< max-size rounding unit, m [1 mm]
  double unit_C = 0.5;         ///< min-medium rounding unit, °C [0.5]
  double max_hold_s = 48 * 3600.0;   ///< hold/chill search bound [48 h]
  std::optional<double> end_C; ///< chill-time: end temperature (default: the stage's until_* value)
  bool mean = false;           ///< chill-time: the mass average instead of the centre
  double max_size_factor = 3;  ///< max-size: search up to this × the nominal size [3]
  double min_size_factor = 0.05;///< max-size: and down to this × [0.05]
  double max_medium_C = 200;   ///< min-medium: search bound [200 °C]
  double rel_tol = 1e-6;       ///< root finder: relative tolerance on the answer [1e-6]
};

/// A forward re-run of one candidate value.
struct Check {
  double value = 0;            ///< in the answer's SI unit
  Evaluation eval;
};

struct SolveResult {
  Question question = Question::hold_time;
  std::string stage;           ///< stage the answer applies to ("" for max-size)
  std::string quantity;        ///< "duration" | "diameter" | "thickness" | "smallest edge" | "medium"
  std::string unit;            ///< "s" | "m" | "C" (JSON key suffix)
  double answer = 0;           ///< unrounded (feasible side of the root-finder's bracket)
  double rounded = 0;          ///< to use
  double unit_step = 0;        ///< rounding unit
  double nominal = 0;          ///< the scheduled value, for comparison
  Check verification;          ///< forward re-run at `rounded`
  std::optional<Check> one_unit_less;  ///< re-run one unit on the unsafe side (if inside the domain)
  RootResult root;
  /// Names of the targets the answer is solved for; empty for chill-time, which is solved for its
  /// end condition (end_point at or below end_C; report/process_notes.hpp: solved_for_texts).
  std::vector<std::string> considered;
  std::vector<ProcessNote> notes;
  std::vector<ProcessNote> assumptions;  ///< the assumes_* kinds; report words them
  // chill-time only: the end temperature and where it is taken, and the temperature there at
  // the rounded duration and one unit less (reached only when strictly below end_C).
  std::optional<double> end_C;
  std::string end_point;       ///< "centre" | "mass average"
  double end_at_rounded_C = 0;
  std::optional<double> end_at_less_C;
  /// "Reached" means below end_C by more than end_tol_K (the model's temperature accuracy); for
  /// chill-time the re-runs' considered_met is this condition and their margin end_C − T (K).
  double end_tol_K = 0;
  bool end_reached_at_rounded = false;
  std::optional<bool> end_reached_at_less;
};

/// Answers one question. Throws NoSolution (with the reason), InputError (bad stage or option),
/// NotConverged.
SolveResult solve(Question q, const Scenario& s, const Libraries& libs, const SolveOptions& opts = {});

}  // namespace coldcore::process
