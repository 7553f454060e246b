#pragma once
/// Cooling (stabilisation) rules as data: steps "from -> to within a limit", each with its
/// source. io/libraries.hpp reads them from cooling-rules.toml; process/cooling.hpp checks a
/// temperature record against them.
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace coldcore {

struct CoolingStep {
  std::string label;       ///< free text from the file, or "<from> -> <to>" with temperature tokens
                           ///< (model/temperature_token.hpp); `from_label` words the start
  double from_C = 0;
  double to_C = 0;         ///< < from_C
  /// The limits as the rule writes them (temperature tokens): a limit written in both units
  /// shows each as written ("135 °F", not the 134.6 °F that 57 °C converts to).
  std::string from_text, to_text;
  std::optional<double> from_written_F, to_written_F;  ///< the °F values, when the rule writes them
  double within_s = 0;     ///< > 0
  bool advisory = false;
  std::string source, status;
};

struct CoolingRule {
  std::string key, name, source, status, note;
  std::vector<CoolingStep> steps;
  std::optional<double> chill_start_within_s;  ///< chilling must begin within this after the cook
  std::string chill_start_source;
};

struct RuleLibrary {
  std::vector<CoolingRule> rules;
  std::string origin;
  const CoolingRule* find(std::string_view key) const;
  /// Else InputError "<place>: rule = "<key>": not in <origin>; did you mean '<nearest>'?".
  const CoolingRule& at(std::string_view key, std::string_view place) const;
};

}  // namespace coldcore
