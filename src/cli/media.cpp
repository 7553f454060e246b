// coldcore media: the heat-transfer coefficient ranges of products/media.toml with their sources.
#include <memory>

#include "cli/library_files.hpp"
#include "cli/output.hpp"
#include "cli/verbs.hpp"
#include "coldcore/io/media.hpp"
#include "coldcore/io/product_file.hpp"
#include "coldcore/report/reference_tables.hpp"

namespace coldcore::cli {

namespace {

struct MediaArgs {
  std::string library;
  OutputArgs output;
};


int media_table(const MediaArgs& a, std::ostream& out) {
  const Format f = output_format(a.output);
  const auto path = library_path("media.toml", a.library, "");
  const MediaLibrary lib = io::parse_media(io::read_text_file(path), path.generic_string());
  write_media_library(lib, f, parse_temp_unit(a.output.units), out);
  return kAllMet;
}

// A reference table: no terminal note, nothing goes to `err`.
int run_media(const MediaArgs& a, std::ostream& out, std::ostream& /*err*/) {
  return with_output(a.output, out, [&](std::ostream& table) { return media_table(a, table); });
}

}  // namespace

void add_media_verb(CLI::App& app, VerbContext& ctx) {
  auto args = std::make_shared<MediaArgs>();
  auto* sub = app.add_subcommand("media", "surface heat-transfer coefficient ranges with sources");
  add_library_option(*sub, args->library);
  add_output_options(*sub, args->output, {Format::text, Format::json, Format::csv});
  sub->callback([&ctx, args] {
    ctx.run = [args](std::ostream& out, std::ostream& err) { return run_media(*args, out, err); };
  });
}

}  // namespace coldcore::cli
