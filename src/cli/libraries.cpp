// coldcore organisms | rules: the data libraries with their sources.
#include <ostream>

#include "cli/library_files.hpp"
#include "cli/output.hpp"
#include "cli/verbs.hpp"
#include "coldcore/report/reference_tables.hpp"

namespace coldcore::cli {

namespace {

struct LibraryListArgs {
  OutputArgs output;
  std::string library;  ///< --library DIR; empty: the search order of cli/library_files.hpp
};

int organisms_table(const LibraryListArgs& args, std::ostream& out) {
  const OutputArgs& a = args.output;
  const Format f = output_format(a);
  const TempUnit u = parse_temp_unit(a.units);
  const auto lib = load_libraries(args.library, "");
  write_organism_library(lib.organisms, f, u, out);
  return kAllMet;
}

int rules_table(const LibraryListArgs& args, std::ostream& out) {
  const OutputArgs& a = args.output;
  const Format f = output_format(a);
  const TempUnit u = parse_temp_unit(a.units);
  const auto lib = load_libraries(args.library, "");
  write_rule_library(lib.rules, f, u, out);
  return kAllMet;
}

// Reference tables: no terminal note, nothing goes to `err`.
int run_organisms(const LibraryListArgs& a, std::ostream& out, std::ostream& /*err*/) {
  return with_output(a.output, out, [&](std::ostream& table) { return organisms_table(a, table); });
}

int run_rules(const LibraryListArgs& a, std::ostream& out, std::ostream& /*err*/) {
  return with_output(a.output, out, [&](std::ostream& table) { return rules_table(a, table); });
}

}  // namespace

void add_library_verbs(CLI::App& app, VerbContext& ctx) {
  auto org = std::make_shared<LibraryListArgs>();
  auto* o = app.add_subcommand("organisms", "the organism heat-resistance library with its sources");
  add_output_options(*o, org->output, {Format::text, Format::json, Format::csv});
  add_library_option(*o, org->library);
  o->callback([&ctx, org] {
    ctx.run = [org](std::ostream& out, std::ostream& err) { return run_organisms(*org, out, err); };
  });
  auto rul = std::make_shared<LibraryListArgs>();
  auto* r = app.add_subcommand("rules", "the cooling-rule library with its sources");
  add_output_options(*r, rul->output, {Format::text, Format::json, Format::csv});
  add_library_option(*r, rul->library);
  r->callback([&ctx, rul] {
    ctx.run = [rul](std::ostream& out, std::ostream& err) { return run_rules(*rul, out, err); };
  });
}

}  // namespace coldcore::cli
