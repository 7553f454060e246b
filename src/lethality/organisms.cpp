#include "coldcore/lethality/organisms.hpp"

#include "coldcore/model/find_by_key.hpp"

namespace coldcore {

bool Organism::has_unconfirmed() const {
  for (const auto& [k, v] : values)
    if (v.status == "from memory") return true;
  return false;
}

namespace {

const std::string& organism_key(const Organism& o) { return o.kinetics.key; }

}  // namespace

const Organism* OrganismLibrary::find(std::string_view key) const {
  return find_by_key(organisms, key, organism_key);
}

const Organism& OrganismLibrary::at(std::string_view key, std::string_view place) const {
  return at_by_key(organisms, key, place, "organism", origin.empty() ? "the organism library" : origin,
                   organism_key);
}

}  // namespace coldcore
