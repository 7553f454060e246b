#pragma once
/// Loader of product files (TOML, schema 1 of DESIGN.md): product, stages, targets, converted
/// once to SI (°C, m, s). Everything here validates; nothing simulates.
///
/// Error messages (coldcore::InputError), one line each:
///   <origin>: <key path> = <value>: <requirement>      a value is wrong
///   <origin>: <key path>: missing: <requirement>        a required key is absent
///   <origin>:<line>:<column>: not valid TOML: <why>     the text does not parse
/// Key paths are `schema`, `product.diameter_mm`, `product.properties.conductivity_W_mK`,
/// `stage[2].h_W_m2K`, `target[1].z_C` (stages and targets numbered from 1, in file order).
/// Values are written as TOML would: numbers bare (shortest form that reads back), strings in
/// double quotes, arrays as [a, b]. Unknown keys get "did you mean" when a key is close:
///   t.toml: product.diamter_mm = 42: unknown key; did you mean 'diameter_mm'?
/// Errors inside a medium log are those of parse_log_csv (`<log path>:<line>: ...`).
///
/// Quantity keys carry their unit as a suffix (io/quantity.hpp): temperatures _C/_F, lengths
/// _m/_mm, times _s/_min/_h; a key given with two suffixes at once is refused. `X_*` below
/// stands for any accepted suffix.
///
/// Keys read (anything else is refused):
///   schema = 1                                     required, first checked
///   [product]  name, shape (sphere | cylinder | finite-cylinder | slab | brick),
///              diameter_* (sphere, cylinder, finite-cylinder), length_* (finite-cylinder),
///              thickness_* (slab, full thickness), size_* = [a, b, c] (brick, full edges),
///              initial_*; a dimension the shape does not use is refused, not ignored.
///   [product.ranges]       optional tolerance ranges, each [low, high] containing the nominal:
///              diameter_*, length_*, thickness_* (only those the shape uses), conductivity_W_mK,
///              initial_* — e.g. diameter_mm = [40, 44], initial_C = [2, 6]
///   [product.properties]   conductivity_W_mK, density_kg_m3, specific_heat_J_kgK (all > 0), or
///   [product.composition]  water (required), protein, fat, carbohydrate, fiber, ash fractions
///   [[stage]]  name (default "stage N", unique); medium: exactly one of
///                medium_C|F = T (constant), medium_C|F = [[t, T], ...] (t in s; or name the time
///                unit: medium_min_C), medium_log = "file.csv" (+ optional medium_log_max_gap_*);
///              h_W_m2K > 0, or inf / "inf" (then h_infinite = true and h_W_m2K = +inf),
///                optionally with h_range_W_m2K = [low, high] containing it (kept in stage_h);
///                or medium_type = "<key of media.toml>" instead of h_W_m2K: h is then taken
///                from the medium's range by apply_media() (io/media.hpp says which end and why);
///                load_product reads media.toml beside the product file for it;
///              end: exactly one of duration_*, until_centre_* / until_mean_* (with mandatory
///                max_duration_*); with medium_log and no end given, duration = log length.
///   [[target]] kind = log-reduction: organism, or own reference_*, z_*, D_*; log_reduction > 0;
///                                    optional name (default: organism, else "targetN"), stages
///              kind = F-value: name, reference_*, z_*, F_* > 0, optional stages
///              kind = cooling-rule: rule, optional at = "centre" | "mean", name (default rule)
///              kind = centre-min-temperature: min_*, hold_* >= 0, optional at, name
///              z_F is a temperature difference: z_C = z_F / 1.8. Target names are unique.
///   [calibration]  optional, written by coldcore fit (io/calibration_file.hpp)
#include <array>
#include <cstdint>
#include <filesystem>
#include <functional>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "coldcore/io/logger_csv.hpp"
#include "coldcore/io/media.hpp"
#include "coldcore/model/calibration.hpp"
#include "coldcore/model/product.hpp"
#include "coldcore/model/stages.hpp"
#include "coldcore/properties/composition.hpp"
#include "coldcore/model/targets.hpp"

namespace coldcore::io {

/// Mass fractions of [product.composition] (each in [0, 1], summing to 1 within
/// composition_sum_tolerance). When a file gives these instead of [product.properties],
/// Product::properties stays zero and the properties module derives temperature-dependent
/// values from the composition. The same type the properties module takes.
using MassFractions = coldcore::Composition;

/// [product.ranges]: tolerance ranges [low, high] of product values, in SI, each containing the
/// nominal value. Used by conservative evaluation (process/conservative.hpp); nominal results
/// never use them. Keys: diameter_*, length_*, thickness_* (as the shape uses them),
/// conductivity_W_mK, initial_* (°C or °F). Stage h ranges: StageH::h_range_W_m2K.
struct ProductRanges {
  std::optional<std::array<double, 2>> diameter_m, length_m, thickness_m, conductivity_W_mK, initial_C;
  bool any() const { return diameter_m || length_m || thickness_m || conductivity_W_mK || initial_C; }
};

/// Per-stage h provenance beyond h_W_m2K (parallel to ProductFile::stages).
struct StageH {
  std::string medium_type;                        ///< set when the stage names medium_type
  std::optional<std::array<double, 2>> h_range_W_m2K;  ///< [low, high]: h_range_W_m2K, or the medium's range
  std::string note;                               ///< which h was used and why (apply_media)
};

struct ProductFile {
  Product product;
  std::optional<MassFractions> composition;  ///< set when [product.composition] was given
  std::vector<Stage> stages;                 ///< at least one, in file order, names unique
  std::vector<Target> targets;               ///< may be empty
  std::vector<std::string> warnings;         ///< e.g. gaps in a medium log; never fatal
  std::vector<StageH> stage_h;               ///< parallel to stages
  ProductRanges ranges;                      ///< [product.ranges], when given
  std::string origin;                        ///< as passed to parse_product
  std::string sha256_hex;                    ///< of the TOML text, for provenance
  /// [calibration] (io/calibration_file.hpp), written by `coldcore fit --write-product`.
  std::optional<Calibration> calibration;
};

/// Reads a medium log for parse_product. Returns the file's bytes, or nullopt when it cannot
/// be read (the loader then raises an error naming the stage key and the path).
/// Tests pass a lambda over an in-memory map; load_product passes a disk reader.
using LogReader = std::function<std::optional<std::string>(const std::filesystem::path&)>;

/// Parses schema-1 text. `origin` names the file in messages. A stage's `medium_log` is
/// resolved as base_dir / value and read through `read_log`; an empty `read_log` makes any
/// medium_log an error. Throws InputError on the first problem found.
ProductFile parse_product(std::string_view toml_text, std::string_view origin,
                          const std::filesystem::path& base_dir = {}, const LogReader& read_log = {});

/// Gives every stage that names medium_type its h from `media` (the conservative end, see
/// io/media.hpp) and records the choice in stage_h[i].note and in warnings. InputError
/// `<origin>: stage[i].medium_type = "x": not in media.toml; ...` for an unknown medium.
void apply_media(ProductFile& file, const MediaLibrary& media);

/// True when some stage names medium_type.
bool needs_media(const ProductFile& file);

/// Reads `path` and its medium logs from disk, then parse_product with origin = path as given
/// and base_dir = its parent folder. The only function of io/ that touches the disk, together
/// with read_text_file. When a stage names medium_type, media.toml beside the file is read and
/// apply_media() applied (InputError when it is missing).
ProductFile load_product(const std::filesystem::path& path);

/// Refuses a file that gives only [product.composition]: the series engine needs constant
/// [product.properties], and temperature-dependent properties are not wired into the process
/// verbs yet. InputError "<origin>: product.composition: ...".
void require_constant_properties(const ProductFile& file);

/// Largest input file read (product files, logs, libraries): 256 MiB. A 1-s log of a year is
/// about 20 MiB, so this only stops a wrong file (an image, a disk) from exhausting memory.
inline constexpr std::uintmax_t kMaxInputFileBytes = 256u * 1024u * 1024u;

/// "-" reads standard input to its end (same limit; not recorded as an input file).
/// The bytes of a regular file. InputError `<path>: cannot read file: <why>` when it is missing
/// or unreadable (the system's reason), a directory, a FIFO, socket or device (refused before
/// opening, so nothing blocks), or larger than kMaxInputFileBytes.
std::string read_text_file(const std::filesystem::path& path);

/// Every file read_text_file has read in this process, as given (the CLI refuses an --out or a
/// side file that is one of them: a report must never overwrite its product file or a log).
std::vector<std::filesystem::path> inputs_read();

}  // namespace coldcore::io
