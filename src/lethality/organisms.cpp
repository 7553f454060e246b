#include "coldcore/lethality/organisms.hpp"

#include <set>

#include "coldcore/error.hpp"
#include "coldcore/model/limits.hpp"
#include "lethality/detail/text.hpp"
#include "coldcore/suggest.hpp"

namespace coldcore {

bool Organism::has_unconfirmed() const {
  for (const auto& [k, v] : values)
    if (v.status == "from memory") return true;
  return false;
}

const Organism* OrganismLibrary::find(std::string_view key) const {
  for (const auto& o : organisms)
    if (o.kinetics.key == key) return &o;
  return nullptr;
}

const Organism& OrganismLibrary::at(std::string_view key, std::string_view place) const {
  if (const Organism* o = find(key)) return *o;
  std::vector<std::string> keys;
  for (const auto& o : organisms) keys.push_back(o.kinetics.key);
  std::string msg = std::string(place) + ": organism = \"" + std::string(key) + "\": not in " +
                    (origin.empty() ? std::string("the organism library") : origin);
  const std::string near = did_you_mean(key, keys).value_or("");
  if (!near.empty()) msg += "; did you mean '" + near + "'?";
  throw InputError(msg);
}

}  // namespace coldcore
