// coldcore media: the heat-transfer coefficient ranges with their sources.
#include <cstdio>
#include <ostream>

#include "coldcore/report/cautions.hpp"
#include "coldcore/report/json.hpp"
#include "coldcore/report/json_contract.hpp"
#include "coldcore/report/reference_tables.hpp"
#include "coldcore/report/temperature_text.hpp"

namespace coldcore {

static void write_media_library_unrendered(const MediaLibrary& lib, Format f, TempUnit u, std::ostream& out);

void write_media_library(const MediaLibrary& lib, Format f, TempUnit u, std::ostream& out) {
  write_rendered(out, u, [&](std::ostream& o) { write_media_library_unrendered(lib, f, u, o); });
}

static void write_media_library_unrendered(const MediaLibrary& lib, Format f, TempUnit u, std::ostream& out) {
  const std::string use =
      "a stage naming medium_type uses, for each target, the end of the range conservative for it: the LOW end in "
      "a heating stage (slower heating, conservative for lethality and minimum temperatures) and for a cooling "
      "rule (slower cooling); the HIGH end in a cooling stage for the lethality and minimum-temperature targets it "
      "affects (faster cooling, less lethality accrues); when targets differ they are evaluated on separate "
      "scenarios and each report says which h each target used";
  if (f == Format::json) {
    JsonWriter w(out);
    w.begin_object();
    write_json_envelope(w, "media", u);
    w.key("library").value(lib.origin);
    w.key("use").value(use);
    w.key("media").begin_array();
    for (const auto& m : lib.media) {
      w.begin_object();
      w.key("key").value(m.key).key("description").value(m.description);
      w.key("h_min_W_m2K").value(m.h_min_W_m2K).key("h_max_W_m2K").value(m.h_max_W_m2K);
      w.key("source").value(m.source).key("status").value(m.status);
      w.end_object();
    }
    w.end_array();
    w.key("cautions").value(cautions());
    w.end_object();
    out << "\n";
  } else if (f == Format::csv) {
    for (const auto& c : cautions()) out << "# caution: " << c << "\n";
    out << "# library: " << lib.origin << "\n# use: " << use << "\n";
    out << "key,h_min_W_m2K,h_max_W_m2K,status,description,source\n";
    for (const auto& m : lib.media)
      out << m.key << "," << csv_number(m.h_min_W_m2K) << "," << csv_number(m.h_max_W_m2K) << ","
          << csv_cell(m.status) << "," << csv_cell(m.description) << "," << csv_cell(m.source) << "\n";
  } else {
    out << "Surface heat-transfer coefficient ranges (" << lib.origin << ")\n  " << use << "\n\n";
    char buf[200];
    for (const auto& m : lib.media) {
      std::snprintf(buf, sizeof buf, "  %-18s %8.0f - %-8.0f W/m2K  [%s]\n", m.key.c_str(), m.h_min_W_m2K,
                    m.h_max_W_m2K, m.status.c_str());
      out << buf << "      " << m.description << "\n      source: " << m.source << "\n";
    }
    out << "\nCAUTIONS\n";
    for (const auto& c : cautions()) out << "  * " << c << "\n";
  }
}

}  // namespace coldcore
