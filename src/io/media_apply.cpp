// apply_media: a stage's medium_type becomes its h, at the conservative end of the medium's range.
#include "coldcore/error.hpp"
#include "coldcore/io/product_file.hpp"
#include "io/detail/text.hpp"

namespace coldcore::io {

bool needs_media(const ProductFile& file) {
  for (const auto& sh : file.stage_h)
    if (!sh.medium_type.empty()) return true;
  return false;
}

void apply_media(ProductFile& file, const MediaLibrary& media) {
  using detail::format_number;
  for (std::size_t i = 0; i < file.stages.size() && i < file.stage_h.size(); ++i) {
    StageH& sh = file.stage_h[i];
    if (sh.medium_type.empty()) continue;
    Stage& st = file.stages[i];
    const std::string place = file.origin + ": stage[" + std::to_string(i + 1) + "].medium_type";
    const MediumType& m = medium_at(media, sh.medium_type, place);
    // The stage's own h is the low end; evaluate() takes each target's conservative end
    // (process/h_ends.hpp) from the range kept in stage_h and given to the Scenario by scenario_of().
    st.h_W_m2K = m.h_min_W_m2K;
    st.h_infinite = false;
    sh.h_range_W_m2K = std::array<double, 2>{m.h_min_W_m2K, m.h_max_W_m2K};
    sh.note = "stage \"" + st.name + "\": medium_type = \"" + m.key + "\" -> h " + format_number(m.h_min_W_m2K) + "-" +
              format_number(m.h_max_W_m2K) + " W/m2K (" + m.source + "; " + m.status +
              "), each target evaluated at the end conservative for it: the low end in a heating stage (slower "
              "heating, conservative for lethality) and for a cooling rule (slower cooling, conservative for a cooling "
              "rule), the high end in a cooling stage for the lethality and minimum-temperature targets it affects "
              "(faster cooling, less lethality); each target's notes say which h it used";
    file.warnings.push_back(sh.note);
  }
}

}  // namespace coldcore::io
