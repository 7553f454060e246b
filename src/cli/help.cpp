// coldcore help [VERB], and the nearest option when a verb is given one it does not have.
#include <ostream>
#include <memory>
#include <string>
#include <vector>

#include "cli/verbs.hpp"
#include "coldcore/error.hpp"
#include "coldcore/io/quantity.hpp"

namespace coldcore::cli {

namespace {

std::vector<std::string> verb_names(const CLI::App& app) {
  std::vector<std::string> names;
  for (const CLI::App* sub : app.get_subcommands([](const CLI::App*) { return true; })) names.push_back(sub->get_name());
  return names;
}

}  // namespace

void add_help_verb(CLI::App& app, VerbContext& ctx) {
  auto topic = std::make_shared<std::string>();
  auto* sub = app.add_subcommand("help", "the options of a verb: coldcore help VERB (no VERB: every verb)");
  sub->add_option("VERB", *topic, "the verb to explain");
  sub->callback([&app, &ctx, topic] {
    ctx.run = [&app, topic](std::ostream& out, std::ostream& /*err*/) {
      if (topic->empty()) {
        out << app.help();
        return 0;
      }
      CLI::App* verb = nullptr;
      for (CLI::App* s : app.get_subcommands([](const CLI::App*) { return true; }))
        if (s->get_name() == *topic) verb = s;
      if (verb == nullptr) {
        std::string msg = "help: unknown verb '" + *topic + "'";
        if (auto near = io::did_you_mean(*topic, verb_names(app))) msg += "; did you mean '" + *near + "'?";
        throw InputError(msg + " (coldcore help lists every verb)");
      }
      out << verb->help();
      return 0;
    };
  });
}

void check_option_names(const CLI::App& verb, int argc, char** argv, int first) {
  std::vector<std::string> known{"--help"};
  for (const CLI::Option* opt : verb.get_options())
    for (const std::string& name : opt->get_lnames()) known.push_back("--" + name);
  for (int i = first; i < argc; ++i) {
    const std::string arg = argv[i];
    if (arg == "--") return;  // what follows is not an option
    if (arg.size() <= 2 || arg.compare(0, 2, "--") != 0) continue;
    const std::string name = arg.substr(0, arg.find('='));
    bool found = false;
    for (const auto& k : known) found = found || k == name;
    if (found) continue;
    std::string msg = verb.get_name() + ": unknown option '" + name + "'";
    if (auto near = io::did_you_mean(name, known)) msg += "; did you mean '" + *near + "'?";
    throw InputError(msg + " (coldcore help " + verb.get_name() + ")");
  }
}

}  // namespace coldcore::cli
