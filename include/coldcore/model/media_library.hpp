#pragma once
/// The media library: surface heat-transfer coefficient ranges of processing media, each with
/// its source and status (io/media.hpp reads products/media.toml into it).
#include <string>
#include <string_view>
#include <vector>

namespace coldcore {

struct MediumType {
  std::string key, description;
  double h_min_W_m2K = 0, h_max_W_m2K = 0;
  std::string source, status;
};

struct MediaLibrary {
  std::vector<MediumType> media;
  std::string origin;
  /// The medium type `key`, or nullptr.
  const MediumType* find(std::string_view key) const;
};

}  // namespace coldcore
