#pragma once
// The plots of the deviation record: scheduled against delivered temperatures and cumulative F.
#include <vector>

#include "coldcore/process/deviation.hpp"
#include "coldcore/report/deviation_report.hpp"
#include "run_figures.hpp"

namespace coldcore::detail {

/// "temperature": scheduled and delivered medium and centre (and the measured probe log), with
/// the scheduled stage starts and the deviation's start and end; "lethality": cumulative F of
/// each lethality target as scheduled and as delivered, with the required line. A plot is left
/// out when its data are absent (no plot reports in `i`).
std::vector<RunFigure> deviation_figures(const process::DeviationResult& r, const DeviationRecordInfo& i, TempUnit u);

}  // namespace coldcore::detail
