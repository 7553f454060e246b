// coldcore media: the heat-transfer coefficient ranges of products/media.toml with their sources.
#include <cstdio>
#include <memory>

#include "cli/library_files.hpp"
#include "cli/output.hpp"
#include "cli/verbs.hpp"
#include "coldcore/io/media.hpp"
#include "coldcore/io/product_file.hpp"
#include "coldcore/report/cautions.hpp"
#include "coldcore/report/json.hpp"

namespace coldcore::cli {

namespace {

struct MediaArgs {
  std::string library;
  OutputArgs output;
};


int run_media(const MediaArgs& a, std::ostream& out) {
  const Format f = output_format(a.output);
  const auto path = library_path("media.toml", a.library, "");
  const io::MediaLibrary lib = io::parse_media(io::read_text_file(path), path.generic_string());
  const std::string use =
      "a stage naming medium_type uses, for each target, the end of the range conservative for it: the LOW end in "
      "a heating stage (slower heating, conservative for lethality and minimum temperatures) and for a cooling "
      "rule (slower cooling); the HIGH end in a cooling stage for the lethality and minimum-temperature targets it "
      "affects (faster cooling, less lethality accrues); when targets differ they are evaluated on separate "
      "scenarios and each report says which h each target used";
  if (f == Format::json) {
    JsonWriter w(out);
    w.begin_object();
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
      out << m.key << "," << JsonWriter::number(m.h_min_W_m2K) << "," << JsonWriter::number(m.h_max_W_m2K) << ","
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
  return kAllMet;
}

}  // namespace

void add_media_verb(CLI::App& app, VerbContext& ctx) {
  auto args = std::make_shared<MediaArgs>();
  auto* sub = app.add_subcommand("media", "surface heat-transfer coefficient ranges with sources");
  add_library_option(*sub, args->library);
  add_output_options(*sub, args->output, {Format::text, Format::json, Format::csv});
  sub->callback([&ctx, args] {
    ctx.run = [args] { return with_output(args->output, [&](std::ostream& out) { return run_media(*args, out); }); };
  });
}

}  // namespace coldcore::cli
