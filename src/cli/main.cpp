// coldcore command line: parse, dispatch to a verb, turn errors into one stderr line.
#include <algorithm>
#include <iostream>
#include <string>
#include <vector>

#include "cli/library_files.hpp"
#include "cli/verbs.hpp"
#include "coldcore/error.hpp"
#include "coldcore/io/quantity.hpp"
#include "coldcore/report/format.hpp"
#include "coldcore/report/temperature_text.hpp"
#include "coldcore/version.hpp"

namespace {

// The unit errors are shown in: the chosen verb's --units once the command line is parsed, so a
// message about a temperature reads in the unit the user asked for.
coldcore::TempUnit error_unit = coldcore::TempUnit::C;

void take_error_unit(const CLI::App& app) {
  for (const CLI::App* verb : app.get_subcommands()) {
    const CLI::Option* units = verb->get_option_no_throw("--units");
    if (units == nullptr || units->count() == 0) continue;
    try {
      error_unit = coldcore::parse_temp_unit(units->as<std::string>());
    } catch (const coldcore::Error&) {
      // the verb refuses the value itself, naming it; its message stays in C
    }
  }
}

int real_main(int argc, char** argv) {
  using namespace coldcore::cli;
  CLI::App app{"coldcore: cold-spot temperature, lethality and cooling checks for conduction-heated foods"};
  app.set_version_flag("--version", std::string("coldcore ") + coldcore::kVersion);
  app.require_subcommand(1);
  app.footer(
      "Exit status: 0 every target met (or none given); 1 a target not demonstrated, a stage\n"
      "that reached its cap, or no solution; 2 bad input or usage.\n"
      "Data libraries (organisms, cooling rules, cooking tables, media): " + std::string(kLibrarySearchOrder) + ".\n"
      "coldcore help VERB shows a verb's options; -o FILE writes there, its extension naming the format.\n"
      "Results are engineering estimates; a qualified process authority and the local regulator decide.");
  VerbContext ctx;
  add_all_verbs(app, ctx);
  // An unknown verb: say which verbs there are and the nearest one (CLI11 would only say that a
  // subcommand is required).
  std::vector<std::string> verbs;
  for (const CLI::App* sub : app.get_subcommands([](const CLI::App*) { return true; })) verbs.push_back(sub->get_name());
  if (argc > 1 && argv[1][0] != '-' && std::find(verbs.begin(), verbs.end(), argv[1]) == verbs.end()) {
    std::string msg = std::string("unknown verb '") + argv[1] + "'";
    if (auto near = coldcore::io::did_you_mean(argv[1], verbs)) msg += "; did you mean '" + *near + "'?";
    std::string list;
    for (const auto& v : verbs) list += (list.empty() ? "" : ", ") + v;
    throw coldcore::InputError(msg + " (verbs: " + list + "; coldcore --help)");
  }
  // An option the verb does not have: name the nearest (CLI11 would only say it was not expected).
  if (argc > 1 && argv[1][0] != '-') check_option_names(*app.get_subcommand(argv[1]), argc, argv, 2);
  try {
    app.parse(argc, argv);
  } catch (const CLI::ParseError& e) {
    const int code = app.exit(e);
    return code == 0 ? 0 : kBadInput;
  }
  take_error_unit(app);
  if (!ctx.run) return kBadInput;
  return ctx.run(std::cout, std::cerr);
}

}  // namespace

int main(int argc, char** argv) {
  try {
    return real_main(argc, argv);
  } catch (const coldcore::InputError& e) {
    std::cerr << "coldcore: " << coldcore::render_temperatures(e.what(), error_unit) << "\n";
    return coldcore::cli::kBadInput;
  } catch (const coldcore::NoSolution& e) {
    std::cerr << "coldcore: no solution: " << coldcore::render_temperatures(e.what(), error_unit) << "\n";
    return coldcore::cli::kNotDemonstrated;
  } catch (const coldcore::Error& e) {
    std::cerr << "coldcore: " << coldcore::render_temperatures(e.what(), error_unit) << "\n";
    return coldcore::cli::kBadInput;
  } catch (const std::exception& e) {
    std::cerr << "coldcore: internal error: " << e.what() << "\n";
    return 70;
  }
}
