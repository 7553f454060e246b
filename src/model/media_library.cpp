#include "coldcore/model/media_library.hpp"

namespace coldcore {

const MediumType* MediaLibrary::find(std::string_view key) const {
  for (const auto& m : media)
    if (m.key == key) return &m;
  return nullptr;
}

}  // namespace coldcore
