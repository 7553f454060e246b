#pragma once
// What only the data libraries write: where a value comes from. Every library entry and every
// organism value names its source and how sure it is; read through Fields like any other key.
#include <set>
#include <utility>
#include <string>
#include <string_view>

#include "coldcore/lethality/organisms.hpp"
#include "io/detail/fields.hpp"

namespace coldcore::io::detail {

/// The table's `status`, which must be given: "confirmed", "derived" or "from memory".
std::string source_status(const Fields& f);

/// The opening keys of a library entry (a rule, a cooking table): its key, unique among `seen`,
/// a name, a source and its status, an optional note. `thing` names the entry in messages ("the
/// rule's key"); `source_is` says what the source must name.
struct EntryHeading {
  std::string key, name, source, status, note;
};
EntryHeading entry_heading(const Fields& f, std::set<std::string>& seen, std::string_view thing,
                           std::string_view source_is);

/// Reads the heading into an entry that has the same five fields.
template <class Entry>
void read_heading(Entry& e, const Fields& f, std::set<std::string>& seen, std::string_view thing,
                  std::string_view source_is) {
  EntryHeading h = entry_heading(f, seen, thing, source_is);
  e.key = std::move(h.key);
  e.name = std::move(h.name);
  e.source = std::move(h.source);
  e.status = std::move(h.status);
  e.note = std::move(h.note);
}

/// `key = { value = <number>, source = "<text>", status = "...", note = "..." }` (note optional),
/// which must be given; the value times `scale` (60 for a _min key) is in SI.
Sourced sourced(const Fields& f, std::string_view key, double scale = 1.0);

}  // namespace coldcore::io::detail
