#pragma once
/// What a process must achieve, as written in the product file (already in SI units).
/// Resolution of organism keys against products/organisms.toml happens in lethality/.
#include <optional>
#include <string>
#include <vector>

namespace coldcore {

enum class TargetKind { log_reduction, f_value, cooling_rule, centre_min_temperature, cooking_table };

/// Kinetics a target gives itself instead of naming a library organism.
struct OwnKinetics {
  double reference_C = 0;
  double z_C = 0;                      ///< > 0
  std::optional<double> D_ref_s;       ///< D at reference_C, when a log reduction is asked
};

struct Target {
  TargetKind kind = TargetKind::f_value;
  std::string name;                    ///< label; names the csv column F_<name>_min
  std::string organism;                ///< library key, or empty when `own` is set
  std::optional<OwnKinetics> own;
  double log_reduction = 0;            ///< log_reduction targets: required decimal reductions
  double F_required_s = 0;             ///< F-value targets: required F (a time)
  std::vector<std::string> stages;     ///< stages whose lethality counts; empty = all
  std::string rule;                    ///< cooling-rule targets: rule key in cooling-rules.toml
  std::string table;                   ///< cooking-table targets: table key in cooking-tables.toml
  double min_temp_C = 0;               ///< centre-min-temperature: temperature to reach ...
  double hold_s = 0;                   ///< ... and hold at or above for this long
  std::string at = "centre";           ///< "centre" or "mean": where a rule or minimum is checked
};

}  // namespace coldcore
