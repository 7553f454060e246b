#pragma once
/// The organism library (products/organisms.toml): heat-resistance data with the source and
/// status of every value.
///
/// File format (schema 1). Every quantity is an inline table with its source beside it:
///   schema = 1
///   [[organism]]
///   key = "listeria-monocytogenes"          # used by targets: organism = "..."
///   name = "Listeria monocytogenes"
///   kind = "vegetative" | "spore" | "quality"
///   reference_C = { value = 70, source = "...", status = "confirmed" }
///   z_C         = { value = 7.5, source = "...", status = "from memory" }
///   D_ref_s or D_ref_min = { ... }           # optional (quality indices have none)
///   split_C, z_below_C = { ... }             # optional, together: z_below_C applies below split_C
///   valid_min_C, valid_max_C = { ... }       # temperature range the data are valid for
///   weibull = { delta_ref_s or delta_ref_min = { ... }, p = { ... } }   # optional
///   [organism.equivalence]                   # optional published equivalence table
///   source = "..."   status = "..."   note = "..."
///   F_ref_min = 10                           # the process every row is equivalent to
///   rows_min = [[80, 129], [81, 100], ...]   # [temp_C, time_min] as printed
/// status is "confirmed" (seen in a cited source), "derived" (computed from cited values, the
/// derivation in `note`), or "from memory" (unconfirmed; verify before use as a criterion).
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "coldcore/lethality/kinetics.hpp"

namespace coldcore {

/// A value with its provenance.
struct Sourced {
  double value = 0;    ///< SI (seconds for times, °C for temperatures)
  std::string source;
  std::string status;  ///< "confirmed" | "derived" | "from memory"
  std::string note;
};

/// One row of a published equivalence table: temp_C held for time_s ≡ the table's reference process.
struct EquivalenceRow {
  double temp_C = 0;
  double time_s = 0;   ///< as printed (rounded in the source)
};

struct EquivalenceTable {
  double F_ref_s = 0;  ///< the process all rows are equivalent to, at the organism's reference_C
  std::vector<EquivalenceRow> rows;
  std::string source, status, note;
};

struct Organism {
  Kinetics kinetics;   ///< kinetics.source joins the value sources
  std::string kind;    ///< "vegetative" | "spore" | "quality"
  /// Provenance per quantity key as written in the file ("z_C", "D_ref_s", "valid_min_C", ...).
  std::vector<std::pair<std::string, Sourced>> values;
  std::optional<EquivalenceTable> equivalence;
  /// True when any value is "from memory".
  bool has_unconfirmed() const;
};

struct OrganismLibrary {
  std::vector<Organism> organisms;
  std::string origin;  ///< file name the library came from
  /// The organism with this key, or nullptr.
  const Organism* find(std::string_view key) const;
  /// The organism with this key; else InputError
  /// "<place>: organism = "<key>": not in <origin>; did you mean '<nearest>'?".
  const Organism& at(std::string_view key, std::string_view place) const;
};

}  // namespace coldcore
