// Verbs of the design whose issues have not landed: they say so, and produce no output.
#include <iostream>

#include "cli/verbs.hpp"

namespace coldcore::cli {

void add_pending_verbs(CLI::App& app, VerbContext& ctx) {
  struct Pending { const char* name; const char* help; };
  static const Pending kPending[] = {
      {"probe", "lethality from a measured cold-spot log"},
      {"organisms", "the organism heat-resistance library with sources"},
      {"rules", "the cooling-rule library with sources"},
  };
  for (const auto& p : kPending) {
    auto* sub = app.add_subcommand(p.name, std::string(p.help) + " (not available yet)");
    sub->allow_extras();
    const std::string name = p.name;
    sub->callback([&ctx, name] {
      ctx.run = [name] {
        std::cerr << "coldcore: '" << name << "' is not available yet in this version\n";
        return static_cast<int>(kBadInput);
      };
    });
  }
}

}  // namespace coldcore::cli
