#include "coldcore/model/cooling_rules.hpp"

#include "coldcore/error.hpp"
#include "coldcore/suggest.hpp"

namespace coldcore {

const CoolingRule* RuleLibrary::find(std::string_view key) const {
  for (const auto& r : rules)
    if (r.key == key) return &r;
  return nullptr;
}

const CoolingRule& RuleLibrary::at(std::string_view key, std::string_view place) const {
  if (const CoolingRule* r = find(key)) return *r;
  std::vector<std::string> keys;
  for (const auto& r : rules) keys.push_back(r.key);
  std::string msg = std::string(place) + ": rule = \"" + std::string(key) + "\": not in " +
                    (origin.empty() ? std::string("the rule library") : origin);
  const std::string near = did_you_mean(key, keys).value_or("");
  if (!near.empty()) msg += "; did you mean '" + near + "'?";
  throw InputError(msg);
}

}  // namespace coldcore
