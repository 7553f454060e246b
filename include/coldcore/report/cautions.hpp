#pragma once
/// The safety cautions every report prints, in every format.
#include <string>
#include <vector>

namespace coldcore {

/// The cautions, one sentence each, in the order reports print them.
const std::vector<std::string>& cautions();

/// The cautions of a report about measured data (probe): the same duties (heat-penetration and
/// temperature-distribution studies, process authority, regulator, local codes) with the
/// measurement's assumptions in place of the model's.
const std::vector<std::string>& measured_cautions();

}  // namespace coldcore
