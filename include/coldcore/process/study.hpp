#pragma once
/// A heat-penetration study on the process clock: the measured cold-spot curves of one or more
/// containers (probes) and the process they went through, with each scheduled stage's medium
/// replaced by the logged medium over the stage's span. Pure computation; io/ reads the logs.
#include <optional>
#include <string>
#include <vector>

#include "coldcore/model/stages.hpp"

namespace coldcore::process {

/// One measured cold-spot curve. Times from the start of the first stage, strictly increasing.
struct ProbeCurve {
  std::string name;            ///< the log's column or file name, as the report shows it
  std::vector<double> time_s;
  std::vector<double> temp_C;
};

/// The logged medium on the process clock (time from the start of the first stage).
struct MediumTrace {
  std::vector<double> time_s;
  std::vector<double> temp_C;
};

/// The stages the study's product went through: the scheduled stages in order, each lasting its
/// scheduled duration, the last one running to `end_s`; each stage's medium is `logged` over its
/// span (rebased to the stage start) when given, else the schedule's. Where the schedule steps
/// between two stages (a jump of more than 0.5 K), the log is not interpolated across the
/// boundary: each side holds its own nearest reading to it (the file states when the step was). Stages that start at or
/// after end_s are left out. REQUIRES: a stage that ends on a temperature (until_*) is the last
/// one kept; otherwise InputError "<origin>: stage[i] ends on a temperature: a study needs its
/// duration (duration_*)". end_s > 0.
std::vector<Stage> study_stages(const std::vector<Stage>& scheduled, const std::optional<MediumTrace>& logged,
                                double end_s, const std::string& origin);

/// The process clock time at which each stage of `stages` starts (durations summed).
std::vector<double> stage_starts_s(const std::vector<Stage>& stages);

}  // namespace coldcore::process
