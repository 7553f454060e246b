#pragma once
/// The safety cautions every report prints, in every format.
#include <string>
#include <vector>

namespace coldcore {

/// The cautions, one sentence each, in the order reports print them.
const std::vector<std::string>& cautions();

}  // namespace coldcore
