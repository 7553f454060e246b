// apply_media: a stage's medium_type becomes its h, at the conservative end of the medium's range.
#include <algorithm>

#include "coldcore/error.hpp"
#include "coldcore/io/product_file.hpp"
#include "io/detail/text.hpp"

namespace coldcore::io {

bool needs_media(const ProductFile& file) {
  for (const auto& sh : file.stage_h)
    if (!sh.medium_type.empty()) return true;
  return false;
}

namespace {

double medium_min(const Stage& s) {
  double m = 1e300;
  for (const auto& p : s.medium.points) m = std::min(m, p.temp_C);
  return m;
}
double medium_max(const Stage& s) {
  double m = -1e300;
  for (const auto& p : s.medium.points) m = std::max(m, p.temp_C);
  return m;
}

bool credits(const Target& t, const std::string& stage) {
  if (t.kind != TargetKind::log_reduction && t.kind != TargetKind::f_value) return false;
  return t.stages.empty() || std::find(t.stages.begin(), t.stages.end(), stage) != t.stages.end();
}

}  // namespace

void apply_media(ProductFile& file, const MediaLibrary& media) {
  using detail::format_number;
  for (std::size_t i = 0; i < file.stages.size() && i < file.stage_h.size(); ++i) {
    StageH& sh = file.stage_h[i];
    if (sh.medium_type.empty()) continue;
    Stage& st = file.stages[i];
    const std::string place = file.origin + ": stage[" + std::to_string(i + 1) + "].medium_type";
    const MediumType& m = media.at(sh.medium_type, place);
    const double before = i == 0 ? file.product.initial_C : medium_min(file.stages[i - 1]);
    const bool heating = medium_max(st) >= before;
    st.h_W_m2K = m.h_min_W_m2K;
    st.h_infinite = false;
    sh.h_range_W_m2K = std::array<double, 2>{m.h_min_W_m2K, m.h_max_W_m2K};
    sh.note = "stage \"" + st.name + "\": medium_type = \"" + m.key + "\" -> h = " + format_number(m.h_min_W_m2K) +
              " W/m2K, the low end of " + format_number(m.h_min_W_m2K) + "-" + format_number(m.h_max_W_m2K) +
              " (" + m.source + "; " + m.status + "): " +
              (heating ? "slower heating, conservative for lethality" : "slower cooling, conservative for a cooling rule");
    file.warnings.push_back(sh.note);
    if (!heating)
      for (const auto& t : file.targets)
        if (credits(t, st.name))
          file.warnings.push_back("stage \"" + st.name + "\" is a cooling stage credited by lethality target \"" + t.name +
                                  "\": its low-end h overstates the lethality accrued there (the high end, " +
                                  format_number(m.h_max_W_m2K) + " W/m2K, would be conservative for it); restrict the "
                                  "target's stages or give h_W_m2K");
  }
}

}  // namespace coldcore::io
