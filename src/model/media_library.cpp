#include "coldcore/model/media_library.hpp"

#include "coldcore/model/find_by_key.hpp"

namespace coldcore {

const MediumType* MediaLibrary::find(std::string_view key) const { return find_by_key(media, key); }

}  // namespace coldcore
