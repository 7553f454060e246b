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
/// Conservative end: apply_media() sets the stage's h to the LOW end and keeps the range in
/// ProductFile::stage_h; io::scenario_of() (io/scenario.hpp) hands it to the process layer, where
/// each target is evaluated at the end conservative for it (process/h_ends.hpp): the LOW end in a
/// heating stage (slower heating: less lethality, a later minimum temperature) and for a cooling
/// rule (slower cooling); the HIGH end in a cooling stage for the lethality targets that credit it
/// (or a later stage) and for minimum-temperature / cooking-table targets (faster cooling: less
/// lethality accrues, less time at temperature). When these choices differ between targets, the
/// targets are evaluated on separate scenarios; every report says which h each target used.
/// A stage may also give `h_range_W_m2K = [lo, hi]` beside its `h_W_m2K`: the nominal h is used by
/// default and the range is kept for conservative evaluation (ProductFile::stage_h).
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "coldcore/model/media_library.hpp"

namespace coldcore::io {

/// The medium type `key` of `media`; else InputError "<place> = "<key>": not in <origin>; did
/// you mean '<nearest>'? accepted: ...".
const MediumType& medium_at(const MediaLibrary& media, std::string_view key, std::string_view place);

/// Parses media.toml text. Throws InputError `<origin>: media.<key>.<field> = <value>: <why>`.
MediaLibrary parse_media(std::string_view toml_text, std::string_view origin);

}  // namespace coldcore::io
