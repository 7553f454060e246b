#pragma once
/// The media library (products/media.toml): surface heat-transfer coefficient ranges of common
/// processing media, each with its source and status, and how a stage that names
/// `medium_type = "<key>"` instead of `h_W_m2K` gets its h.
///
/// File format (schema 1):
///   schema = 1
///   [media.<key>]  description, h_min_W_m2K > 0, h_max_W_m2K >= h_min, source, status
///                  (status "confirmed" | "from memory" | "derived"); unknown keys refused.
///
/// Conservative end (apply_media): a stage is taken as HEATING when its highest medium point is
/// not below the lowest medium point of the stage before it (the first stage: not below the
/// product's initial temperature), else COOLING. The LOW end of the range is used for every stage:
/// it slows heating (conservative for lethality and minimum temperatures) and slows cooling
/// (conservative for cooling rules). Where a lethality target credits a COOLING stage that uses a
/// range, the low end overstates that stage's lethality; a warning says so and names the target.
/// A stage may also give `h_range_W_m2K = [lo, hi]` beside its `h_W_m2K`: the nominal h is used by
/// default and the range is kept for conservative evaluation (ProductFile::stage_h).
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace coldcore::io {

struct MediumType {
  std::string key, description;
  double h_min_W_m2K = 0, h_max_W_m2K = 0;
  std::string source, status;
};

struct MediaLibrary {
  std::vector<MediumType> media;
  std::string origin;
  const MediumType* find(std::string_view key) const;
  /// Else InputError "<place> = "<key>": not in <origin>; did you mean '<nearest>'? accepted: ...".
  const MediumType& at(std::string_view key, std::string_view place) const;
};

/// Parses media.toml text. Throws InputError `<origin>: media.<key>.<field> = <value>: <why>`.
MediaLibrary parse_media(std::string_view toml_text, std::string_view origin);

}  // namespace coldcore::io
