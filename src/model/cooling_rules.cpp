#include "coldcore/model/cooling_rules.hpp"

#include "coldcore/model/find_by_key.hpp"

namespace coldcore {

const CoolingRule* RuleLibrary::find(std::string_view key) const { return find_by_key(rules, key); }

const CoolingRule& RuleLibrary::at(std::string_view key, std::string_view place) const {
  return at_by_key(rules, key, place, "rule", origin.empty() ? "the rule library" : origin);
}

}  // namespace coldcore
