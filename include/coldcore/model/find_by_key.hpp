#pragma once
/// Looking an entry up by key in a data library (media, cooling rules, organisms, cooking
/// tables): the one lookup, and the one "not in <library>" message with its suggestion.
#include <string>
#include <string_view>
#include <vector>

#include "coldcore/error.hpp"
#include "coldcore/suggest.hpp"

namespace coldcore {

/// An entry's key: its `key` member (an organism's key lives in its kinetics; it passes its own).
struct KeyMember {
  template <class Entry>
  const std::string& operator()(const Entry& e) const { return e.key; }
};

/// The first entry of `entries` whose key is `key`, or nullptr.
template <class Entries, class KeyOf = KeyMember>
const typename Entries::value_type* find_by_key(const Entries& entries, std::string_view key, KeyOf key_of = {}) {
  for (const auto& e : entries)
    if (key_of(e) == key) return &e;
  return nullptr;
}

/// The entry `key`; else InputError
/// "<place>: <field> = "<key>": not in <library>; did you mean '<nearest>'?"
/// where `library` names the file the entries came from (or the library, when from none).
template <class Entries, class KeyOf = KeyMember>
const typename Entries::value_type& at_by_key(const Entries& entries, std::string_view key, std::string_view place,
                                              std::string_view field, std::string_view library, KeyOf key_of = {}) {
  if (const auto* e = find_by_key(entries, key, key_of)) return *e;
  std::vector<std::string> keys;
  for (const auto& e : entries) keys.push_back(key_of(e));
  std::string msg = std::string(place) + ": " + std::string(field) + " = \"" + std::string(key) + "\": not in " +
                    std::string(library);
  if (auto near = did_you_mean(key, keys)) msg += "; did you mean '" + *near + "'?";
  throw InputError(msg);
}

}  // namespace coldcore
